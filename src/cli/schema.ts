/**
 * The job schema (JSON Schema draft 2020-12), assembled from the task kinds. Published as
 * `docs/job-schema.json` (`quadspread schema job` prints it).
 *
 * @module cli
 */
import type { TaskKind } from './task.js';
import type { Schema } from './validate.js';

const LENGTH_PATTERN =
  '^\\s*[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?(\\s*/\\s*\\d+)?\\s*(mm|cm|m|km|ft|us-ft|ch|lk|us-ch|us-lk|mi)?\\s*$';

/** Definitions shared by the task kinds (`#/$defs/...`). */
export const DEFS: Record<string, Schema> = {
  name: {
    type: 'string',
    minLength: 1,
    maxLength: 80,
    'x-describe': 'a name of 1 to 80 characters',
  },
  length: {
    description:
      'A length: a number in the job\'s length unit, or text with a unit: "120.5 m", "395.2 ft", "5 mm", "3 ch".',
    type: ['number', 'string'],
    pattern: LENGTH_PATTERN,
    'x-describe': 'a length (a number, or text such as "120.5 m")',
  },
  measuredLength: {
    description:
      'A length, or { "value": length, "sigma": σ } with its standard uncertainty: a length (a number in the job\'s unit, or text with its own unit such as "3 mm"), or { "constant": length, "ppm": number } (σ² = constant² + (ppm·10⁻⁶·value)²).',
    anyOf: [
      { $ref: '#/$defs/length' },
      {
        type: 'object',
        required: ['value'],
        additionalProperties: false,
        properties: {
          value: { $ref: '#/$defs/length' },
          sigma: {
            anyOf: [
              { $ref: '#/$defs/length' },
              {
                type: 'object',
                required: ['constant'],
                additionalProperties: false,
                properties: {
                  constant: { $ref: '#/$defs/length' },
                  ppm: { type: 'number', minimum: 0 },
                },
              },
            ],
          },
        },
      },
    ],
    'x-describe': 'a length, or { "value": …, "sigma": … }',
  },
  angle: {
    description:
      'An angle: decimal degrees (a number), DMS text ("12°34\'56.7"", "12 34 56.7"), or a number with a unit ("100 gon", "1600 mil", "0.5 rad").',
    type: ['number', 'string'],
    maxLength: 200,
    'x-describe': 'an angle',
  },
  measuredAngle: {
    description:
      'An angle, or { "value": angle, "sigma": σ }: σ a number in seconds of arc, or text with its own unit ("5\\"", "0°00\'05\\"", "1 mgon").',
    anyOf: [
      { $ref: '#/$defs/angle' },
      {
        type: 'object',
        required: ['value'],
        additionalProperties: false,
        properties: { value: { $ref: '#/$defs/angle' }, sigma: { $ref: '#/$defs/angle' } },
      },
    ],
    'x-describe': 'an angle, or { "value": …, "sigma": … }',
  },
  vertical: {
    description:
      'A vertical reading. Text or a number is an elevation angle (positive above the horizon). Objects say which: ' +
      '{ "elevation": angle } | { "zenith": angle } (zenith angle, over 90° below the horizon) | { "slope": "8%" | "1 in 12" | "1:12" } | ' +
      '{ "spread": "1/10", "below": true }; "sigma" beside an angle is its standard uncertainty (an angle).',
    anyOf: [
      { $ref: '#/$defs/angle' },
      {
        type: 'object',
        additionalProperties: false,
        properties: {
          elevation: { $ref: '#/$defs/angle' },
          zenith: { $ref: '#/$defs/angle' },
          slope: { type: 'string', maxLength: 100 },
          spread: { type: ['number', 'string'], maxLength: 200 },
          below: { type: 'boolean' },
          sigma: { $ref: '#/$defs/angle' },
        },
      },
    ],
    'x-describe':
      'a vertical reading (an elevation angle, or { "zenith": … }, { "slope": … }, { "spread": … })',
  },
  pointRef: {
    type: 'string',
    minLength: 1,
    maxLength: 80,
    description: 'The name of a point in "points".',
    'x-describe': 'a point name',
  },
  correlations: {
    description:
      'Correlated inputs of the task: pairs of inputs (named as in the uncertainty budget, e.g. "C0 elevation") with their correlation coefficient r; the covariance r·u(a)·u(b) enters the variance (GUM eq. (13)). Inputs not listed are uncorrelated.',
    type: 'array',
    maxItems: 1000,
    items: {
      type: 'object',
      required: ['inputs', 'r'],
      additionalProperties: false,
      properties: {
        inputs: {
          type: 'array',
          minItems: 2,
          maxItems: 2,
          items: { type: 'string', minLength: 1, maxLength: 200 },
        },
        r: { type: 'number', minimum: -1, maximum: 1 },
      },
    },
  },
  tolerance: {
    description: "A tolerance in the job's length unit (a number or text with a unit).",
    $ref: '#/$defs/length',
  },
};

/** The whole job schema, with one branch of `tasks.items.oneOf` per task kind. */
export function jobSchema(kinds: readonly TaskKind[]): Schema {
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    $id: 'https://quadspread.invalid/job-schema.json',
    title: 'quadspread job',
    description:
      'A job for the quadspread command-line runner: named points, and tasks that read instrument readings and compute heights, grades, triangles, coordinates and checks. ' +
      'Coordinates are x = east, y = north; bearings are clockwise from north.',
    type: 'object',
    required: ['tasks'],
    additionalProperties: false,
    properties: {
      $schema: { type: 'string' },
      title: { type: 'string', maxLength: 200, description: 'A title for the report.' },
      description: { type: 'string', maxLength: 2000, description: 'Free text, not used.' },
      report: {
        type: 'object',
        additionalProperties: false,
        description:
          'Header fields of the report: the date (default today), a job reference, the datum or grid of the coordinates, who computed and who checked.',
        properties: {
          date: { type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}$' },
          reference: { type: 'string', maxLength: 200 },
          datum: { type: 'string', maxLength: 200 },
          computedBy: { type: 'string', maxLength: 200 },
          checkedBy: { type: 'string', maxLength: 200 },
        },
      },
      display: {
        type: 'object',
        additionalProperties: false,
        description:
          'How the text, Markdown and HTML reports write numbers (docs/cli.md, "Display rules"); --display on the command line overrides these.',
        properties: {
          lengths: { type: 'integer', minimum: 0, maximum: 8 },
          levels: { type: 'integer', minimum: 0, maximum: 8 },
          mm: { type: 'integer', minimum: 0, maximum: 8 },
          seconds: { type: 'integer', minimum: 0, maximum: 4 },
          angles: { enum: ['dms', 'degrees'] },
          degreeDecimals: { type: 'integer', minimum: 0, maximum: 12 },
          bearings: { enum: ['azimuth', 'quadrant'] },
          area: { type: 'integer', minimum: 0, maximum: 8 },
          percent: { type: 'integer', minimum: 0, maximum: 8 },
          significant: { type: 'integer', minimum: 1, maximum: 20 },
          roundToSigma: { type: 'boolean' },
        },
      },
      units: {
        type: 'object',
        additionalProperties: false,
        description: 'Units of the job.',
        properties: {
          length: {
            enum: ['m', 'km', 'ft', 'us-ft', 'ch', 'lk', 'us-ch', 'us-lk', 'mi'],
            description:
              'Unit of bare-number lengths and of every length in the report (default m). Lengths written with a unit are converted to it exactly.',
          },
          angles: {
            enum: ['degrees', 'dd.mmss'],
            description:
              'How angles given as numbers are read: "degrees" (decimal degrees, the default) or "dd.mmss" (degrees, minutes and seconds packed as field calculators take them: 36.5027 = 36°50\'27"). Text with marks ("36°50\'27\\"") reads the same either way; a sigma stays in seconds of arc.',
          },
        },
      },
      points: {
        type: 'object',
        description:
          "Named points: stations, control points, corners. Coordinates in the job's length unit.",
        patternProperties: {
          '^.{1,80}$': {
            type: 'object',
            required: ['east', 'north'],
            additionalProperties: false,
            properties: {
              east: { $ref: '#/$defs/measuredLength' },
              north: { $ref: '#/$defs/measuredLength' },
            },
          },
        },
        additionalProperties: false,
      },
      tasks: {
        type: 'array',
        minItems: 1,
        maxItems: 1000,
        description: 'What to compute, in order. Each task has a "kind" and an optional "name".',
        items: { oneOf: kinds.map((k) => ({ description: k.description, ...k.schema })) },
      },
    },
    $defs: DEFS,
  };
}
