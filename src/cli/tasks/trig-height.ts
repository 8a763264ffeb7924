/**
 * Task `trig-height`: the height difference between two marks by a trigonometric sight
 * (slope or horizontal distance, vertical reading, instrument and target heights, curvature
 * and refraction), through the library's `trigHeight`; with a backward sight, the
 * reciprocal mean through `reciprocalTrigHeight`.
 *
 * @module cli
 */
import { reciprocalTrigHeight, trigHeight } from '../../index.js';
import type { TrigSight } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { SketchView } from '../report.js';
import type { Env, RawCheck, RawQuantity, TaskKind } from '../task.js';
import {
  inClosed,
  lengthText,
  positive,
  readLength,
  readNumber,
  readVertical,
  verticalInputs,
  verticalOf,
} from '../values.js';
import type { Input, VerticalSpec } from '../values.js';
import type { Schema } from '../validate.js';
import { absAtMost, plus, taskSchema } from './common.js';

interface SightSpec {
  distance: Input;
  measured: 'slope' | 'horizontal';
  vertical: VerticalSpec;
  hi?: Input;
  ht?: Input;
}

const SIGHT: Record<string, Schema> = {
  distance: { $ref: '#/$defs/measuredLength', description: 'The measured distance.' },
  measured: { enum: ['slope', 'horizontal'], description: 'Which distance it is (default slope).' },
  vertical: { $ref: '#/$defs/vertical' },
  instrumentHeight: {
    $ref: '#/$defs/measuredLength',
    description: 'Height of the instrument axis above the station mark.',
  },
  targetHeight: {
    $ref: '#/$defs/measuredLength',
    description: 'Height of the target above the far mark.',
  },
};

export const trigHeightTask: TaskKind = {
  kind: 'trig-height',
  description:
    'Height difference between two marks by a trigonometric sight, with curvature and refraction; a backward sight gives the reciprocal mean, in which they cancel.',
  schema: taskSchema('trig-height', ['distance', 'vertical'], {
    ...SIGHT,
    correction: {
      anyOf: [
        { type: 'boolean' },
        {
          type: 'object',
          additionalProperties: false,
          properties: {
            k: {
              anyOf: [
                { type: ['number', 'string'] },
                {
                  type: 'object',
                  required: ['value'],
                  additionalProperties: false,
                  properties: {
                    value: { type: ['number', 'string'] },
                    sigma: { type: ['number', 'string'] },
                  },
                },
              ],
              description:
                'The coefficient of refraction, or { "value": …, "sigma": … } to carry its uncertainty into the budget.',
              'x-describe': 'a number, or { "value", "sigma" }',
            },
            radius: { $ref: '#/$defs/length' },
          },
        },
      ],
      description:
        'Curvature and refraction: true (default: k = 0.13, R = 6 371 000 m), false, or { "k": …, "radius": … }.',
      'x-describe': 'true, false or { "k", "radius" }',
    },
    stationLevel: {
      $ref: '#/$defs/measuredLength',
      description: "Level of the station mark, to give the far mark's level.",
    },
    backward: {
      type: 'object',
      required: ['distance', 'vertical'],
      additionalProperties: false,
      properties: SIGHT,
      description: 'The reciprocal sight from the far mark back to the station.',
    },
    tolerance: {
      $ref: '#/$defs/tolerance',
      description:
        'Largest allowed difference between the forward and backward height differences (after correction).',
    },
  }),
  prepare(task, path, ctx) {
    const sight = (s: Record<string, unknown>, p: string, tag: string): SightSpec => ({
      distance: positive(
        readLength(s.distance, `${p}.distance`, ctx.unit, `${tag} distance`, 'distance'),
        `${p}.distance`,
        'distance',
      ),
      measured: (s.measured as 'slope' | 'horizontal' | undefined) ?? 'slope',
      vertical: readVertical(s.vertical, `${p}.vertical`, tag),
      ...(s.instrumentHeight !== undefined
        ? {
            hi: readLength(
              s.instrumentHeight,
              `${p}.instrumentHeight`,
              ctx.unit,
              `${tag} instrument height`,
              'height',
            ),
          }
        : {}),
      ...(s.targetHeight !== undefined
        ? {
            ht: readLength(
              s.targetHeight,
              `${p}.targetHeight`,
              ctx.unit,
              `${tag} target height`,
              'height',
            ),
          }
        : {}),
    });
    const fwd = sight(task, path, 'forward');
    const back =
      task.backward !== undefined
        ? sight(task.backward as Record<string, unknown>, `${path}.backward`, 'backward')
        : undefined;
    const c = task.correction as boolean | { k?: number | string; radius?: unknown } | undefined;
    const k =
      typeof c === 'object' && c.k !== undefined
        ? inClosed(
            readNumber(c.k, `${path}.correction.k`, 'k', 'coefficient of refraction'),
            `${path}.correction.k`,
            'coefficient of refraction',
            0,
            1,
          )
        : undefined;
    if (k && k.value === '1')
      throw new JobInvalid(
        `${path}.correction.k`,
        '1 is not a valid coefficient of refraction: it must be below 1',
      );
    const radius =
      typeof c === 'object' && c.radius !== undefined
        ? lengthText(c.radius, `${path}.correction.radius`, ctx.unit, 'radius')
        : undefined;
    const level =
      task.stationLevel !== undefined
        ? readLength(task.stationLevel, `${path}.stationLevel`, ctx.unit, 'station level', 'level')
        : undefined;
    const tol =
      task.tolerance !== undefined
        ? lengthText(task.tolerance, `${path}.tolerance`, ctx.unit, 'tolerance')
        : undefined;
    const inputsOf = (s: SightSpec): Input[] => [
      s.distance,
      ...verticalInputs(s.vertical),
      ...(s.hi ? [s.hi] : []),
      ...(s.ht ? [s.ht] : []),
    ];
    return {
      summary: `Trigonometric height difference by a ${fwd.measured} distance${back ? ', with a reciprocal sight' : ''}${c === false ? ', without curvature and refraction' : ''}.`,
      inputs: [
        ...inputsOf(fwd),
        ...(back ? inputsOf(back) : []),
        ...(k ? [k] : []),
        ...(level ? [level] : []),
      ],
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const correction =
          c === false
            ? (false as const)
            : {
                unit: ctx.unit,
                ...(k ? { k: env.get(k) } : {}),
                ...(radius ? { earthRadius: A.from(radius) } : {}),
              };
        const toSight = (s: SightSpec): TrigSight<V> => ({
          distance: env.get(s.distance),
          measured: s.measured,
          vertical: verticalOf(A, s.vertical, env.get),
          ...(s.hi ? { instrumentHeight: env.get(s.hi) } : {}),
          ...(s.ht ? { targetHeight: env.get(s.ht) } : {}),
          correction,
        });
        const f = trigHeight(A, toSight(fwd));
        const results: RawQuantity<V>[] = [
          {
            name: 'vertical',
            label: 'Vertical component of the sight (S·sin α or D·tan α)',
            unit: u,
            value: f.vertical,
          },
          {
            name: 'correction',
            label: 'Curvature and refraction correction (1 − k)·D²/(2R)',
            unit: u,
            value: f.correction,
          },
          {
            name: 'difference',
            label: 'Height of the far mark above the station mark',
            unit: u,
            value: f.difference,
          },
        ];
        const checks: RawCheck<V>[] = [];
        let best: V | typeof f.difference = f.difference;
        if (back) {
          const r = reciprocalTrigHeight(A, { forward: toSight(fwd), backward: toSight(back) });
          results.push(
            {
              name: 'backward',
              label: 'Height of the station mark above the far mark (backward sight)',
              unit: u,
              value: r.backward,
            },
            {
              name: 'mean',
              label: 'Reciprocal mean (forward − backward)/2',
              unit: u,
              value: r.mean,
            },
          );
          best = r.mean;
          if (tol !== undefined) {
            checks.push({
              name: 'reciprocal',
              label: 'Forward + backward (zero for agreeing sights)',
              unit: u,
              value: r.misclosure,
              limit: A.from(tol),
              pass: absAtMost(A, r.misclosure, A.from(tol)),
            });
          }
        }
        if (level)
          results.push({
            name: 'level',
            label: 'Level of the far mark',
            unit: u,
            value: plus(A, best, env.get(level)),
          });
        let sketch: SketchView[] | undefined;
        if (env.drawing) {
          const D = Math.sqrt(env.num(f.horizontalQuadrance));
          const hi = fwd.hi ? env.num(env.get(fwd.hi)) : 0,
            ht = fwd.ht ? env.num(env.get(fwd.ht)) : 0;
          const dh = env.num(best);
          sketch = [
            {
              title: 'Trigonometric sight: elevation',
              view: 'elevation',
              unit: u,
              caption: 'elevation: from the station mark (left) to the far mark, height up',
              points: [
                { name: 'station mark', x: 0, y: 0, role: 'station' },
                { name: 'far mark', x: D, y: dh, role: 'target' },
              ],
              lines: [
                { x1: 0, y1: 0, x2: 0, y2: hi, role: 'base' },
                { x1: D, y1: dh, x2: D, y2: dh + ht, role: 'base' },
                {
                  x1: 0,
                  y1: hi,
                  x2: D,
                  y2: dh + ht,
                  role: 'sight',
                  label: `Δh = ${dh.toPrecision(6)} ${u}`,
                },
              ],
              notes: [],
            },
          ];
        }
        const notes =
          c === false
            ? []
            : [
                'Curvature and refraction use k and R as stated in docs/cli.md (k = 0.13, R = 6 371 000 m by default).',
              ];
        if (c !== false && k?.sigma === undefined) {
          notes.push(
            'The uncertainty of the correction leaves out that of k (refraction varies from sight to sight): give correction.k as { "value": …, "sigma": … } to include it.',
          );
        }
        return { results, checks, notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
