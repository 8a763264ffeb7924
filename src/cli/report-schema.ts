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
      },
    },
  },
};
