/**
 * Task `inline-height`: the height of a point off a straight line (a causeway, a track, a
 * shore) from vertical readings at three or more stations on the line at known chainages,
 * nothing measured to its foot, through the library's `heightFromInlineReadings`. Four or
 * more stations are fitted by least squares, and the residuals checked.
 *
 * @module cli
 */
import { heightFromInlineReadings } from '../../index.js';
import type { Env, RawCheck, RawQuantity, TaskKind } from '../task.js';
import { lengthText, readLength, readVertical, verticalInputs, verticalOf } from '../values.js';
import type { Input, VerticalSpec } from '../values.js';
import { plus, root, signedRoot, squared, taskSchema } from './common.js';

export const inlineHeightTask: TaskKind = {
  kind: 'inline-height',
  description:
    "Height of a point off a straight line from vertical readings at three or more stations on the line at known chainages (Stewart's relation; least squares for four or more), with the foot's chainage and offset.",
  schema: taskSchema('inline-height', ['stations'], {
    target: { $ref: '#/$defs/name', description: 'Name of the point sighted (for the report).' },
    stations: {
      type: 'array',
      minItems: 3,
      maxItems: 1000,
      items: {
        type: 'object',
        required: ['chainage', 'vertical'],
        additionalProperties: false,
        properties: {
          name: { $ref: '#/$defs/name' },
          chainage: {
            $ref: '#/$defs/measuredLength',
            description: 'Signed distance along the line from its origin.',
          },
          vertical: { $ref: '#/$defs/vertical' },
        },
      },
    },
    instrumentLevel: {
      $ref: '#/$defs/measuredLength',
      description: 'Level of the instrument axis at every station (optional).',
    },
    tolerance: {
      $ref: '#/$defs/tolerance',
      description:
        'With four or more stations: the largest allowed residual, as a horizontal distance from the station to the foot (√ of the fitted horizontal quadrance less √ of the one read).',
    },
  }),
  prepare(task, path, ctx) {
    const name = typeof task.target === 'string' ? task.target : 'P';
    const stations = (task.stations as Record<string, unknown>[]).map((s, i) => {
      const p = `${path}.stations[${i}]`;
      const label = typeof s.name === 'string' ? s.name : `station ${i + 1}`;
      return {
        label,
        chainage: readLength(
          s.chainage,
          `${p}.chainage`,
          ctx.unit,
          `${label} chainage`,
          'chainage',
        ),
        vertical: readVertical(s.vertical, `${p}.vertical`, label) as VerticalSpec,
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
      ...stations.flatMap((s) => [s.chainage, ...verticalInputs(s.vertical)]),
      ...(level ? [level] : []),
    ];
    return {
      summary: `Height of ${name} from ${stations.length} stations on a straight line (${stations.length === 3 ? "exact, by Stewart's relation" : 'least squares'}).`,
      inputs,
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const chain = stations.map((s) => env.get(s.chainage));
        const vs = stations.map((s) => verticalOf(A, s.vertical, env.get));
        const r = heightFromInlineReadings(A, { chainages: chain, vertical: vs });
        const hr = signedRoot(A, r.H, r.sign);
        const h = hr.value;
        const off = root(A, r.footOffset);
        const results: RawQuantity<V>[] = [
          {
            name: 'H',
            label: `Vertical quadrance H of ${name} above the stations' level`,
            unit: squared(u),
            value: r.H,
          },
          {
            name: 'height',
            label: `Height of ${name} above the stations' level`,
            unit: u,
            value: h,
            approx: hr.approx,
          },
          {
            name: 'foot_chainage',
            label: `Chainage of ${name}'s foot along the line`,
            unit: u,
            value: r.footChainage,
          },
          {
            name: 'foot_offset_Q',
            label: `Offset quadrance of ${name}'s foot from the line`,
            unit: squared(u),
            value: r.footOffset,
          },
          {
            name: 'foot_offset',
            label: `Offset of ${name}'s foot from the line (either side)`,
            unit: u,
            value: off.value,
            approx: off.approx,
          },
        ];
        if (level) {
          results.push({
            name: 'level',
            label: `Level of ${name}`,
            unit: u,
            value: plus(A, h, env.get(level)),
            approx: hr.approx,
          });
        }
        const checks: RawCheck<V>[] = [];
        const notes = [
          "The readings fix the foot's distance from the line, not its side: the sketch draws it on the left.",
        ];
        if (stations.length > 3) {
          const worst = r.residuals.reduce(
            (m, x) => (A.cmp(A.abs(x), m) > 0 ? A.abs(x) : m),
            A.zero,
          );
          results.push({
            name: 'largest_residual',
            label: 'Largest residual (horizontal quadrance, fitted less read)',
            unit: squared(u),
            value: worst,
            internal: true,
          });
          if (tol !== undefined) {
            // The residual q of station i is a difference of horizontal quadrances (fitted
            // (cᵢ − f)² + e less read H·cot²), so as a distance it is √(fitted) − √(read) =
            // q / (√fitted + √read), not √|q| (Q = D², derived). |√a − √b| ≤ t is decided
            // exactly by squaring: with hi ≥ lo, hi − lo − t² ≤ 2t√lo.
            const T = A.from(tol);
            let pass = true;
            let worstDistance = 0;
            let worstAt = stations[0]!.label;
            r.residuals.forEach((q, i) => {
              const d = A.sub(chain[i]!, r.footChainage);
              const fitted = A.add(A.mul(d, d), r.footOffset);
              const read = A.sub(fitted, q); // H·cot² of the reading: never negative
              const [hi, lo] = A.cmp(fitted, read) >= 0 ? [fitted, read] : [read, fitted];
              const x = A.sub(A.sub(hi, lo), A.mul(T, T));
              if (A.sign(x) > 0 && A.cmp(A.mul(x, x), A.mul(A.mul(A.from(4), A.mul(T, T)), lo)) > 0)
                pass = false;
              const dist = Math.abs(Math.sqrt(env.num(fitted)) - Math.sqrt(env.num(read)));
              if (dist > worstDistance) {
                worstDistance = dist;
                worstAt = stations[i]!.label;
              }
            });
            checks.push({
              name: 'residuals',
              label: `Largest residual as a horizontal distance, √(fitted Q) − √(read Q) (at ${worstAt})`,
              unit: u,
              value: A.from(worstDistance),
              limit: A.from(tol),
              pass,
            });
          }
        }
        let sketch;
        if (env.drawing) {
          const c = chain.map((x) => env.num(x));
          const f = env.num(r.footChainage),
            e = Math.sqrt(env.num(r.footOffset)),
            hh = env.num(h);
          const lo = Math.min(...c, f),
            hi = Math.max(...c, f);
          sketch = [
            {
              title: `${name} from the line: plan (chainage along x)`,
              view: 'plan' as const,
              unit: u,
              caption: 'plan along the line: x chainage, y offset (the side is not known)',
              points: [
                ...stations.map((s, i) => ({
                  name: s.label,
                  x: c[i]!,
                  y: 0,
                  role: 'station' as const,
                })),
                { name: `${name} (foot)`, x: f, y: e, role: 'foot' as const },
              ],
              lines: [
                { x1: lo, y1: 0, x2: hi, y2: 0, role: 'base' as const },
                {
                  x1: f,
                  y1: 0,
                  x2: f,
                  y2: e,
                  role: 'adjusted' as const,
                  label: `offset ${e.toPrecision(5)} ${u}`,
                },
                ...c.map((x) => ({ x1: x, y1: 0, x2: f, y2: e, role: 'sight' as const })),
              ],
              notes: [{ x: f, y: 0, text: `foot at chainage ${f.toPrecision(6)} ${u}` }],
            },
            {
              title: `${name} from the line: elevation (distance from the foot across)`,
              view: 'elevation' as const,
              unit: u,
              points: [
                ...stations.map((s, i) => ({
                  name: s.label,
                  x: -Math.hypot(c[i]! - f, e),
                  y: 0,
                  role: 'station' as const,
                })),
                { name, x: 0, y: hh, role: 'target' as const },
              ],
              lines: [
                {
                  x1: -Math.max(...c.map((x) => Math.hypot(x - f, e))),
                  y1: 0,
                  x2: 0,
                  y2: 0,
                  role: 'ground' as const,
                },
                {
                  x1: 0,
                  y1: 0,
                  x2: 0,
                  y2: hh,
                  role: 'base' as const,
                  label: `h = ${hh.toPrecision(6)} ${u}`,
                },
                ...c.map((x) => ({
                  x1: -Math.hypot(x - f, e),
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
        return { results, checks, notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
