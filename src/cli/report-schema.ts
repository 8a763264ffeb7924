/**
 * The JSON Schema of `--format json` reports (published as `docs/report-schema.json`;
 * `quadspread schema report` prints it).
 *
 * @module cli
 */
import type { Schema } from './validate.js';

const text = { type: 'string' };

/** The report schema (JSON Schema draft 2020-12). */
export const REPORT_SCHEMA: Schema = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: 'https://quadspread.invalid/report-schema.json',
  title: 'quadspread report',
  description:
    'The JSON report of a quadspread job run. Numbers are decimal text rounded to "digits" significant digits; exact forms are fractions (n/d) or surds (a + b√d).',
  type: 'object',
  required: [
    'format',
    'version',
    'title',
    'source',
    'arithmetic',
    'digits',
    'lengthUnit',
    'tasks',
    'summary',
    'caution',
  ],
  additionalProperties: false,
  properties: {
    format: { const: 'quadspread-report' },
    version: { const: 1 },
    title: text,
    source: { ...text, description: 'The job file, or "demo".' },
    arithmetic: { ...text, description: 'rational, decimal(n) or float.' },
    digits: { type: 'integer', minimum: 1, maximum: 100 },
    lengthUnit: text,
    header: {
      type: 'object',
      required: ['date', 'program'],
      additionalProperties: false,
      description:
        'Who, when, with what: the date, the program and version, the datum, who computed and who checked.',
      properties: {
        date: { type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}$' },
        program: text,
        datum: text,
        reference: text,
        computedBy: text,
        checkedBy: text,
      },
    },
    display: {
      type: 'object',
      description:
        'The display rules the text, Markdown and HTML reports follow (docs/cli.md, "Display rules").',
    },
    notes: { type: 'array', items: text, description: 'Notes that hold for the whole report.' },
    tasks: { type: 'array', items: { $ref: '#/$defs/task' } },
    summary: {
      type: 'object',
      required: ['checks', 'passed', 'failed'],
      additionalProperties: false,
      properties: {
        checks: { type: 'integer', minimum: 0 },
        passed: { type: 'integer', minimum: 0 },
        failed: { type: 'integer', minimum: 0 },
      },
    },
    caution: text,
  },
  $defs: {
    decimal: {
      type: 'string',
      pattern: '^-?\\d+(\\.\\d+)?([eE][+-]?\\d+)?$',
      description: 'Decimal text.',
    },
    task: {
      type: 'object',
      required: ['index', 'kind', 'name', 'summary', 'results', 'checks', 'notes'],
      additionalProperties: false,
      properties: {
        index: { type: 'integer', minimum: 0 },
        kind: text,
        name: text,
        summary: text,
        results: { type: 'array', items: { $ref: '#/$defs/quantity' } },
        checks: { type: 'array', items: { $ref: '#/$defs/check' } },
        notes: { type: 'array', items: text },
        tables: { type: 'array', items: { $ref: '#/$defs/table' } },
      },
    },
    table: {
      type: 'object',
      required: ['name', 'title', 'columns', 'rows'],
      additionalProperties: false,
      description:
        'A table (traverse sheet, level book, coordinate list, triangle solution), cells as the display rules write them.',
      properties: {
        name: text,
        title: text,
        columns: {
          type: 'array',
          items: {
            type: 'object',
            required: ['label', 'align'],
            additionalProperties: false,
            properties: { label: text, align: { enum: ['left', 'right'] } },
          },
        },
        rows: { type: 'array', items: { type: 'array', items: text } },
        notes: { type: 'array', items: text },
      },
    },
    quantity: {
      type: 'object',
      required: ['name', 'label', 'unit', 'value'],
      additionalProperties: false,
      properties: {
        name: text,
        label: text,
        unit: text,
        value: { $ref: '#/$defs/decimal' },
        kind: {
          enum: [
            'length',
            'level',
            'mm',
            'angle',
            'seconds',
            'bearing',
            'area',
            'percent',
            'number',
            'ratio',
          ],
          description: 'What the quantity is, which decides how display is written.',
        },
        display: { ...text, description: 'The value as the text report writes it, with its unit.' },
        displaySigma: { ...text, description: 'The uncertainty as the text report writes it.' },
        internal: {
          type: 'boolean',
          description:
            'An internal quantity (quadrance, quadrea, H): text shows it only with --detail.',
        },
        exact: { ...text, description: 'The exact form: a fraction n/d or a surd a + b√d.' },
        sigma: {
          $ref: '#/$defs/decimal',
          description: 'Standard uncertainty (GUM, JCGM 100:2008, first order), in unit.',
        },
        correlations: {
          type: 'array',
          items: {
            type: 'object',
            required: ['inputs', 'r', 'share'],
            additionalProperties: false,
            properties: {
              inputs: { type: 'array', minItems: 2, maxItems: 2, items: text },
              r: { $ref: '#/$defs/decimal' },
              share: {
                $ref: '#/$defs/decimal',
                description: 'Percent of the variance (negative for a negative correlation term).',
              },
            },
          },
        },
        budget: {
          type: 'array',
          items: {
            type: 'object',
            required: ['input', 'sensitivity', 'part', 'share'],
            additionalProperties: false,
            properties: {
              input: text,
              sensitivity: { $ref: '#/$defs/decimal' },
              part: { $ref: '#/$defs/decimal' },
              share: { $ref: '#/$defs/decimal', description: 'Percent of the variance.' },
            },
          },
        },
      },
    },
    check: {
      type: 'object',
      required: ['name', 'label', 'value', 'tolerance', 'unit', 'pass'],
      additionalProperties: false,
      properties: {
        name: text,
        label: text,
        value: { $ref: '#/$defs/decimal' },
        tolerance: text,
        unit: text,
        pass: { type: 'boolean' },
        limit: { $ref: '#/$defs/decimal' },
        relation: { enum: ['≤', '≥'] },
        display: {
          ...text,
          description:
            'Value and limit as the text report writes them: to the same decimals, enough to show the verdict.',
        },
      },
    },
  },
};
