/**
 * Task `resection`: a station fixed from clockwise horizontal angles to three control
 * points (Tienstra's formula in the library's `resection`), refused near the danger circle.
 *
 * @module cli
 */
import { resection } from '../../index.js';
import type { TaskKind } from '../task.js';
import { inRange, readAngle } from '../values.js';
import { nums, pointInputs, taskSchema, xy } from './common.js';

export const resectionTask: TaskKind = {
  kind: 'resection',
  description:
    'A station from the clockwise horizontal angles P1 → P2 and P2 → P3 measured at it to three control points (refused on or near the danger circle).',
  schema: taskSchema('resection', ['control', 'angles'], {
    control: {
      type: 'array',
      minItems: 3,
      maxItems: 3,
      items: { $ref: '#/$defs/pointRef' },
      description: 'The three control points P1, P2, P3.',
    },
    angles: {
      type: 'array',
      minItems: 2,
      maxItems: 2,
      items: { $ref: '#/$defs/measuredAngle' },
      description:
        'The clockwise horizontal angles a12 (P1 → P2) and a23 (P2 → P3) at the station.',
    },
    point: { $ref: '#/$defs/name', description: 'A name for the station (default S).' },
  }),
  prepare(task, path, ctx) {
    const control = (task.control as unknown[]).map((n, i) =>
      ctx.point(n, `${path}.control[${i}]`),
    );
    const name = typeof task.point === 'string' ? task.point : 'S';
    const angles = (task.angles as unknown[]).map((a, i) =>
      inRange(
        readAngle(
          a,
          `${path}.angles[${i}]`,
          `angle ${control[i]!.name}→${control[i + 1]!.name}`,
          'horizontal angle',
        ),
        `${path}.angles[${i}]`,
        'clockwise horizontal angle',
        0,
        360,
        'lo',
      ),
    );
    return {
      summary: `Station ${name} by resection on ${control.map((c) => c.name).join(', ')} (Tienstra's formula).`,
      inputs: [...control.flatMap(pointInputs), ...angles],
      compute(env) {
        const P = control.map((c) => xy(env, c));
        const r = resection(env.A, {
          control: [P[0]!, P[1]!, P[2]!],
          angles: [env.get(angles[0]!), env.get(angles[1]!)],
        });
        const results = [
          { name: `${name}.east`, label: `${name} east`, unit: ctx.unitName, value: r.station.x },
          { name: `${name}.north`, label: `${name} north`, unit: ctx.unitName, value: r.station.y },
          {
            name: 'danger_ratio',
            label:
              'Nearness to the danger circle, |Q(O, S) − R²| / R² (a ratio: 0 on the circle through the control points)',
            unit: '',
            value: r.dangerRatio,
          },
        ];
        let sketch;
        if (env.drawing) {
          const s = nums(env, r.station);
          const c = P.map((p) => nums(env, p));
          sketch = [
            {
              title: `Resection of ${name}`,
              view: 'plan' as const,
              unit: ctx.unitName,
              points: [
                ...control.map((p, i) => ({ name: p.name, ...c[i]!, role: 'control' as const })),
                { name, ...s, role: 'station' as const },
              ],
              lines: c.map((p) => ({ x1: s.x, y1: s.y, x2: p.x, y2: p.y, role: 'sight' as const })),
              notes: [],
            },
          ];
        }
        return {
          results,
          checks: [],
          notes: [
            'A station near the circle through the control points is weakly fixed; the danger ratio says how near (0 on the circle).',
            'Two angles to three control points fix the station with no redundancy, so nothing here checks the readings: sight a fourth known point to check it.',
          ],
          ...(sketch ? { sketch } : {}),
        };
      },
    };
  },
};
