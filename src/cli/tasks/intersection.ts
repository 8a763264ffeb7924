/**
 * Task `intersection`: the point where two lines, each through two job points, meet
 * (exact in `rational`), through the library's `intersectLines`.
 *
 * @module cli
 */
import { intersectLines } from '../../index.js';
import type { TaskKind } from '../task.js';
import { nums, pointInputs, taskSchema, xy } from './common.js';

export const intersectionTask: TaskKind = {
  kind: 'intersection',
  description: 'The point where line P1P2 meets line P3P4 (each through two job points).',
  schema: taskSchema('intersection', ['lines'], {
    lines: {
      type: 'array',
      minItems: 2,
      maxItems: 2,
      items: { type: 'array', minItems: 2, maxItems: 2, items: { $ref: '#/$defs/pointRef' } },
      description: 'Two lines, each as two point names: [["P1", "P2"], ["P3", "P4"]].',
    },
    point: { $ref: '#/$defs/name', description: 'A name for the intersection point (default X).' },
  }),
  prepare(task, path, ctx) {
    const lines = task.lines as string[][];
    const name = typeof task.point === 'string' ? task.point : 'X';
    const all = lines.flatMap((l, i) => l.map((n, j) => ctx.point(n, `${path}.lines[${i}][${j}]`)));
    return {
      summary: `Intersection ${name} of line ${all[0]!.name}–${all[1]!.name} with line ${all[2]!.name}–${all[3]!.name}.`,
      inputs: all.flatMap(pointInputs),
      compute(env) {
        const P = all.map((p) => xy(env, p));
        const X = intersectLines(env.A, P[0]!, P[1]!, P[2]!, P[3]!);
        const results = [
          { name: `${name}.east`, label: `${name} east`, unit: ctx.unitName, value: X.x },
          { name: `${name}.north`, label: `${name} north`, unit: ctx.unitName, value: X.y },
        ];
        let sketch;
        if (env.drawing) {
          const n = P.map((p) => nums(env, p));
          const x = nums(env, X);
          sketch = [
            {
              title: `Intersection ${name}`,
              view: 'plan' as const,
              unit: ctx.unitName,
              points: [
                ...all.map((p, i) => ({ name: p.name, ...n[i]!, role: 'control' as const })),
                { name, ...x, role: 'computed' as const },
              ],
              lines: [
                { x1: n[0]!.x, y1: n[0]!.y, x2: x.x, y2: x.y, role: 'sight' as const },
                { x1: n[1]!.x, y1: n[1]!.y, x2: x.x, y2: x.y, role: 'sight' as const },
                { x1: n[2]!.x, y1: n[2]!.y, x2: x.x, y2: x.y, role: 'sight' as const },
                { x1: n[3]!.x, y1: n[3]!.y, x2: x.x, y2: x.y, role: 'sight' as const },
              ],
              notes: [],
            },
          ];
        }
        return { results, checks: [], notes: [], ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
