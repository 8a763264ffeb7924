/**
 * Task `height`: the height of a point from vertical readings, each with the horizontal
 * distance to the point's foot or from a station of known plan position to a foot of
 * known plan position, through the library's `heightFromReading` and (two stations)
 * `heightFromTwoStations`. Redundant readings give a discrepancy check.
 *
 * @module cli
 */
import { heightFromReading, heightFromTwoStations, quadrance } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, JobPoint, RawCheck, RawQuantity, TaskKind } from '../task.js';
import {
  lengthText,
  positive,
  readLength,
  readVertical,
  verticalInputs,
  verticalOf,
} from '../values.js';
import type { Input, VerticalSpec } from '../values.js';
import {
  nums,
  plus,
  pointInputs,
  rootsWithin,
  signedRoot,
  squared,
  taskSchema,
  xy,
} from './common.js';

interface ReadingSpec {
  label: string;
  station?: JobPoint;
  horizontal?: Input;
  vertical: VerticalSpec;
}

export const heightTask: TaskKind = {
  kind: 'height',
  description:
    'Height of a point above the instrument level from vertical readings: H = Q·R/(1 − R) per reading; two stations of known position give a weighted mean and a discrepancy check.',
  schema: taskSchema('height', ['readings'], {
    target: {
      $ref: '#/$defs/pointRef',
      description: 'The point whose foot is known in plan (needed with readings from stations).',
    },
    readings: {
      type: 'array',
      minItems: 1,
      maxItems: 100,
      items: {
        type: 'object',
        required: ['vertical'],
        additionalProperties: false,
        properties: {
          station: {
            $ref: '#/$defs/pointRef',
            description:
              'The instrument station (its plan position gives the horizontal distance to the target).',
          },
          horizontal: {
            $ref: '#/$defs/measuredLength',
            description: 'The horizontal distance to the foot (instead of a station).',
          },
          vertical: { $ref: '#/$defs/vertical' },
        },
      },
    },
    instrumentLevel: {
      $ref: '#/$defs/measuredLength',
      description: "Level of the instrument axis, to give the point's level (optional).",
    },
    tolerance: {
      $ref: '#/$defs/tolerance',
      description: 'Largest allowed difference between the heights from different readings.',
    },
  }),
  prepare(task, path, ctx) {
    const target = task.target !== undefined ? ctx.point(task.target, `${path}.target`) : undefined;
    const readings: ReadingSpec[] = (task.readings as Record<string, unknown>[]).map((r, i) => {
      const p = `${path}.readings[${i}]`;
      const station = r.station !== undefined ? ctx.point(r.station, `${p}.station`) : undefined;
      if ((station === undefined) === (r.horizontal === undefined))
        throw new JobInvalid(p, 'a reading needs either "station" or "horizontal" (not both)');
      if (station && !target)
        throw new JobInvalid(
          `${path}.target`,
          'readings from stations need the "target" whose foot they sight',
        );
      const label = station ? station.name : `reading ${i + 1}`;
      return {
        label,
        ...(station ? { station } : {}),
        ...(r.horizontal !== undefined
          ? {
              horizontal: positive(
                readLength(
                  r.horizontal,
                  `${p}.horizontal`,
                  ctx.unit,
                  `${label} horizontal`,
                  'horizontal distance',
                ),
                `${p}.horizontal`,
                'horizontal distance',
              ),
            }
          : {}),
        vertical: readVertical(r.vertical, `${p}.vertical`, label),
      };
    });
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
      ...(target ? pointInputs(target) : []),
      ...readings.flatMap((r) => [
        ...(r.station ? pointInputs(r.station) : []),
        ...(r.horizontal ? [r.horizontal] : []),
        ...verticalInputs(r.vertical),
      ]),
      ...(level ? [level] : []),
    ];
    const twoStations = readings.length === 2 && readings.every((r) => r.station);
    return {
      summary: `Height${target ? ` of ${target.name}` : ''} from ${readings.length} vertical reading${readings.length === 1 ? '' : 's'}${twoStations ? ' at two stations of known position (weighted mean)' : ''}.`,
      inputs,
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const foot = target ? xy(env, target) : undefined;
        const vs = readings.map((r) => verticalOf(A, r.vertical, env.get));
        const Qs = readings.map((r) =>
          r.station
            ? quadrance(A, xy(env, r.station), foot!)
            : A.mul(env.get(r.horizontal!), env.get(r.horizontal!)),
        );
        const Hs = readings.map((_, i) =>
          heightFromReading(A, { horizontal: Qs[i]!, vertical: vs[i]! }),
        );
        const results: RawQuantity<V>[] = [];
        readings.forEach((r, i) => {
          results.push({
            name: `${r.label}.H`,
            label: `Vertical quadrance H from ${r.label}`,
            unit: squared(u),
            value: Hs[i]!,
          });
          const hr = signedRoot(A, Hs[i]!, vs[i]!.sign);
          results.push({
            name: `${r.label}.height`,
            label: `Height from ${r.label} (above its instrument level)`,
            unit: u,
            value: hr.value,
            approx: hr.approx,
          });
        });
        let sign = vs[0]!.sign as number;
        let best: V = Hs[0]!;
        const notes: string[] = [];
        if (twoStations) {
          const two = heightFromTwoStations(A, {
            stations: [xy(env, readings[0]!.station!), xy(env, readings[1]!.station!)],
            foot: foot!,
            vertical: [vs[0]!, vs[1]!],
          });
          best = two.H;
          sign = two.sign;
          results.push({
            name: 'H',
            label: 'Vertical quadrance H, weighted mean (weights (1 − R)²/Q)',
            unit: squared(u),
            value: two.H,
          });
          const hm = signedRoot(A, two.H, two.sign);
          results.push({
            name: 'height',
            label: 'Height, weighted mean',
            unit: u,
            value: hm.value,
            approx: hm.approx,
          });
          notes.push(
            'The two stations are taken to be at one level (the instrument axes at the same height).',
          );
        } else if (readings.length > 1) {
          notes.push(
            'Each reading gives its own height (above its own instrument level); only two readings from stations of known position are combined.',
          );
        }
        if (level) {
          const h = signedRoot(A, best, sign);
          results.push({
            name: 'level',
            label: `Level of ${target ? target.name : 'the point'} (instrument level + height)`,
            unit: u,
            value: plus(A, h.value, env.get(level)),
            approx: h.approx,
          });
        }
        const checks: RawCheck<V>[] = [];
        if (tol !== undefined && readings.length > 1) {
          const T = A.from(tol);
          let worst = 0,
            wi = 0,
            wj = 1;
          for (let i = 0; i < Hs.length; i++)
            for (let j = i + 1; j < Hs.length; j++) {
              const d = Math.abs(Math.sqrt(env.num(Hs[i]!)) - Math.sqrt(env.num(Hs[j]!)));
              if (d >= worst) {
                worst = d;
                wi = i;
                wj = j;
              }
            }
          const pass = Hs.every((a, i) =>
            Hs.every((b, j) => j <= i || (vs[i]!.sign === vs[j]!.sign && rootsWithin(A, a, b, T))),
          );
          checks.push({
            name: 'discrepancy',
            label: `Largest difference between heights (${readings[wi]!.label} − ${readings[wj]!.label})`,
            unit: u,
            value: A.from(worst),
            limit: A.from(tol),
            pass,
          });
        }
        let sketch;
        if (env.drawing) {
          const h = Math.sqrt(env.num(best)) * Math.sign(sign || 1);
          const name = target?.name ?? 'P';
          const views = [];
          if (foot) {
            const f = nums(env, foot);
            views.push({
              title: `Height of ${name}: plan`,
              view: 'plan' as const,
              unit: u,
              points: [
                ...readings
                  .filter((r) => r.station)
                  .map((r) => ({
                    name: r.station!.name,
                    ...nums(env, xy(env, r.station!)),
                    role: 'station' as const,
                  })),
                { name: `${name} (foot)`, ...f, role: 'foot' as const },
              ],
              lines: readings
                .filter((r) => r.station)
                .map((r) => {
                  const s = nums(env, xy(env, r.station!));
                  return { x1: s.x, y1: s.y, x2: f.x, y2: f.y, role: 'sight' as const };
                }),
              notes: [],
            });
          }
          const dists = Qs.map((q) => Math.sqrt(env.num(q)));
          views.push({
            title: `Height of ${name}: elevation`,
            view: 'elevation' as const,
            unit: u,
            points: [
              ...readings.map((r, i) => ({
                name: r.label,
                x: -dists[i]!,
                y: 0,
                role: 'station' as const,
              })),
              { name, x: 0, y: h, role: 'target' as const },
              { name: 'foot', x: 0, y: 0, role: 'foot' as const },
            ],
            lines: [
              { x1: -Math.max(...dists), y1: 0, x2: 0, y2: 0, role: 'ground' as const },
              {
                x1: 0,
                y1: 0,
                x2: 0,
                y2: h,
                role: 'base' as const,
                label: `h = ${h.toPrecision(6)} ${u}`,
              },
              ...readings.map((_, i) => ({
                x1: -dists[i]!,
                y1: 0,
                x2: 0,
                y2: h,
                role: 'sight' as const,
              })),
            ],
            notes: [],
          });
          sketch = views;
        }
        return { results, checks, notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
