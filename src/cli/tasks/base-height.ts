/**
 * Task `base-height`: the height of a point whose foot cannot be reached, from two stations
 * on a measured base, the horizontal angles at each between the base and the point, and
 * vertical readings, through the library's `heightFromBase` (spread law and triple spread
 * formula).
 *
 * @module cli
 */
import { heightFromBase, isSurd } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { SketchView } from '../report.js';
import type { Env, RawCheck, RawQuantity, TaskKind, Value } from '../task.js';
import {
  inRange,
  lengthText,
  plain,
  positive,
  readAngle,
  readLength,
  readVertical,
  verticalInputs,
  verticalOf,
} from '../values.js';
import type { Input, VerticalSpec } from '../values.js';
import { plus, rootOfValue, squared, taskSchema } from './common.js';

export const baseHeightTask: TaskKind = {
  kind: 'base-height',
  description:
    'Height of a point whose foot cannot be reached, from two stations on a measured base: horizontal angles at both stations (spread law), vertical readings at one or both.',
  schema: taskSchema('base-height', ['base', 'stations'], {
    target: { $ref: '#/$defs/name', description: 'Name of the point sighted.' },
    base: {
      $ref: '#/$defs/measuredLength',
      description: 'Horizontal distance between the two stations.',
    },
    stations: {
      type: 'array',
      minItems: 2,
      maxItems: 2,
      items: {
        type: 'object',
        required: ['angle'],
        additionalProperties: false,
        properties: {
          name: { $ref: '#/$defs/name' },
          angle: {
            $ref: '#/$defs/measuredAngle',
            description:
              'Horizontal angle at the station between the base and the line to the point, in (0°, 180°).',
          },
          vertical: { $ref: '#/$defs/vertical' },
        },
      },
    },
    instrumentLevel: {
      $ref: '#/$defs/measuredLength',
      description:
        "Level of the instrument axes (both stations at one level), to give the point's level.",
    },
    tolerance: {
      $ref: '#/$defs/tolerance',
      description: 'Largest allowed difference between the heights from the two stations.',
    },
  }),
  prepare(task, path, ctx) {
    const name = typeof task.target === 'string' ? task.target : 'P';
    const base = positive(
      readLength(task.base, `${path}.base`, ctx.unit, 'base', 'base length'),
      `${path}.base`,
      'base length',
    );
    const stations = (task.stations as Record<string, unknown>[]).map((s, i) => {
      const label = typeof s.name === 'string' ? s.name : `station ${i + 1}`;
      const p = `${path}.stations[${i}]`;
      return {
        label,
        angle: inRange(
          readAngle(s.angle, `${p}.angle`, `${label} angle`, 'horizontal angle'),
          `${p}.angle`,
          'interior angle',
          0,
          180,
          'both',
        ),
        vertical:
          s.vertical !== undefined
            ? (readVertical(s.vertical, `${p}.vertical`, label) as VerticalSpec)
            : undefined,
      };
    });
    if (stations.every((s) => s.vertical === undefined))
      throw new JobInvalid(`${path}.stations`, 'at least one station needs a "vertical" reading');
    const level =
      task.instrumentLevel !== undefined
        ? readLength(
            task.instrumentLevel,
            `${path}.instrumentLevel`,
            ctx.unit,
            'instrument level',
            'level',
          )
        : undefined;
    const tol =
      task.tolerance !== undefined
        ? lengthText(task.tolerance, `${path}.tolerance`, ctx.unit, 'tolerance')
        : undefined;
    const inputs: Input[] = [
      base,
      ...stations.flatMap((s) => [s.angle, ...(s.vertical ? verticalInputs(s.vertical) : [])]),
      ...(level ? [level] : []),
    ];
    return {
      summary: `Height of ${name} from a measured base ${stations[0]!.label}–${stations[1]!.label} (spread law).`,
      inputs,
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const b = env.get(base);
        const v = stations.map((s) =>
          s.vertical ? verticalOf(A, s.vertical, env.get) : undefined,
        );
        const r = heightFromBase(A, {
          base: A.mul(b, b),
          angles: [env.get(stations[0]!.angle), env.get(stations[1]!.angle)],
          vertical: [v[0], v[1]],
        });
        const results: RawQuantity<V>[] = [];
        stations.forEach((s, i) => {
          const Q = r.horizontal[i] as Value<V>;
          results.push({
            name: `${s.label}.Q`,
            label: `Horizontal quadrance from ${s.label} to the foot`,
            unit: squared(u),
            value: Q,
          });
          const d = rootOfValue(A, Q);
          results.push({
            name: `${s.label}.distance`,
            label: `Horizontal distance from ${s.label} to the foot`,
            unit: u,
            value: d.value,
            approx: d.approx,
          });
        });
        results.push({
          name: 'H',
          label: `Vertical quadrance H of ${name}`,
          unit: squared(u),
          value: r.H as Value<V>,
        });
        const h = rootOfValue(A, r.H as Value<V>);
        const hs: Value<V> =
          r.sign >= 0
            ? h.value
            : isSurd(h.value)
              ? (h.value.neg() as Value<V>)
              : A.neg(h.value as V);
        results.push({
          name: 'height',
          label: `Height of ${name} above the stations' level`,
          unit: u,
          value: hs,
          approx: h.approx,
        });
        if (level)
          results.push({
            name: 'level',
            label: `Level of ${name}`,
            unit: u,
            value: plus(A, hs, env.get(level)),
            approx: h.approx,
          });
        const checks: RawCheck<V>[] = [];
        if (tol !== undefined && r.heights[0] !== undefined && r.heights[1] !== undefined) {
          const h1 = Math.sqrt(env.num(r.heights[0] as Value<V>)),
            h2 = Math.sqrt(env.num(r.heights[1] as Value<V>));
          const diff = Math.abs(h1 - h2);
          checks.push({
            name: 'discrepancy',
            label: `Difference between the heights from ${stations[0]!.label} and ${stations[1]!.label}`,
            unit: u,
            value: A.from(String(diff)),
            limit: A.from(tol),
            pass: diff <= Number(plain(tol)),
          });
        }
        let sketch: SketchView[] | undefined;
        if (env.drawing) {
          const bb = env.num(b),
            q1 = env.num(r.horizontal[0] as Value<V>),
            q2 = env.num(r.horizontal[1] as Value<V>);
          const fx = (q1 - q2 + bb * bb) / (2 * bb); // the foot from its distances to the two stations (drawing only)
          const fy = Math.sqrt(Math.max(0, q1 - fx * fx));
          const hh = Math.sqrt(env.num(r.H as Value<V>)) * (r.sign < 0 ? -1 : 1);
          const [n1, n2] = [stations[0]!.label, stations[1]!.label];
          sketch = [
            {
              title: `${name} from the base ${n1}–${n2}: plan`,
              view: 'plan',
              unit: u,
              caption: `plan with the base along x (${n1} at the origin)`,
              points: [
                { name: n1, x: 0, y: 0, role: 'station' },
                { name: n2, x: bb, y: 0, role: 'station' },
                { name: `${name} (foot)`, x: fx, y: fy, role: 'foot' },
              ],
              lines: [
                {
                  x1: 0,
                  y1: 0,
                  x2: bb,
                  y2: 0,
                  role: 'base',
                  label: `base ${plain(base.value)} ${u}`,
                },
                { x1: 0, y1: 0, x2: fx, y2: fy, role: 'sight' },
                { x1: bb, y1: 0, x2: fx, y2: fy, role: 'sight' },
              ],
              notes: [],
            },
            {
              title: `${name} from the base ${n1}–${n2}: elevation`,
              view: 'elevation',
              unit: u,
              points: [
                { name: n1, x: -Math.sqrt(q1), y: 0, role: 'station' },
                { name: n2, x: -Math.sqrt(q2), y: 0, role: 'station' },
                { name, x: 0, y: hh, role: 'target' },
              ],
              lines: [
                {
                  x1: -Math.max(Math.sqrt(q1), Math.sqrt(q2)),
                  y1: 0,
                  x2: 0,
                  y2: 0,
                  role: 'ground',
                },
                {
                  x1: 0,
                  y1: 0,
                  x2: 0,
                  y2: hh,
                  role: 'base',
                  label: `h = ${hh.toPrecision(6)} ${u}`,
                },
                ...stations
                  .filter((s) => s.vertical)
                  .map((s) => ({
                    x1: -Math.sqrt(s === stations[0] ? q1 : q2),
                    y1: 0,
                    x2: 0,
                    y2: hh,
                    role: 'sight' as const,
                  })),
              ],
              notes: [],
            },
          ];
        }
        return {
          results,
          checks,
          notes: [
            'Both stations are taken to be at one level. The horizontal angles fix on which side of the base the foot lies.',
          ],
          ...(sketch ? { sketch } : {}),
        };
      },
    };
  },
};
