/**
 * Task `area`: the area and perimeter of a parcel from its corner points (shoelace
 * formula, exact in `rational`), through the library's `polygonArea`.
 *
 * @module cli
 */
import { polygonArea } from '../../index.js';
import type { TaskKind } from '../task.js';
import { nums, pointInputs, squared, taskSchema, xy } from './common.js';

export const areaTask: TaskKind = {
  kind: 'area',
  description:
    'Area and perimeter of a polygon from its corner points, in order (shoelace formula).',
  schema: taskSchema('area', ['points'], {
    points: {
      type: 'array',
      minItems: 3,
      maxItems: 10000,
      items: { $ref: '#/$defs/pointRef' },
      description: 'Corner points in order around the parcel.',
    },
  }),
  prepare(task, path, ctx) {
    const corners = (task.points as unknown[]).map((n, i) => ctx.point(n, `${path}.points[${i}]`));
    const unit = ctx.unit;
    const metric = unit === 'm' || unit === 'km';
    return {
      summary: `Area of ${corners.map((c) => c.name).join('–')} by coordinates (shoelace formula).`,
      inputs: corners.flatMap(pointInputs),
      compute(env) {
        const pts = corners.map((c) => xy(env, c));
        const r = polygonArea(env.A, pts, { unit });
        const results = [
          { name: 'area', label: 'Area', unit: squared(ctx.unitName), value: env.A.abs(r.signed) },
          metric
            ? { name: 'area_ha', label: 'Area in hectares', unit: 'ha', value: r.ha }
            : {
                name: 'area_acres',
                label: 'Area in acres',
                unit:
                  unit === 'us-ft' || unit === 'us-ch' || unit === 'us-lk'
                    ? 'US survey acres'
                    : 'acres',
                value: unit.startsWith('us-') ? r.usacres : r.acres,
              },
          {
            name: 'perimeter',
            label: 'Perimeter',
            unit: ctx.unitName,
            value: r.perimeter,
            approx: true,
          },
        ];
        const notes = [
          r.orientation === 'degenerate'
            ? 'The corners enclose no area (they are collinear or the outline cancels itself).'
            : `The corners run ${r.orientation} on the plan (north up).`,
        ];
        const sketch = env.drawing
          ? [
              {
                title: `Parcel ${corners.map((c) => c.name).join('–')}`,
                view: 'plan' as const,
                unit: ctx.unitName,
                points: corners.map((c, i) => ({
                  name: c.name,
                  ...nums(env, pts[i]!),
                  role: 'control' as const,
                })),
                lines: pts.map((p, i) => {
                  const a = nums(env, p),
                    b = nums(env, pts[(i + 1) % pts.length]!);
                  return {
                    x1: a.x,
                    y1: a.y,
                    x2: b.x,
                    y2: b.y,
                    role: 'boundary' as const,
                    measure: true,
                  };
                }),
                notes: [
                  {
                    ...centroid(pts.map((p) => nums(env, p))),
                    text: `area ${env.A.toPrecision(env.A.abs(r.signed), 6)} ${squared(ctx.unitName)}`,
                  },
                ],
              },
            ]
          : undefined;
        return { results, checks: [], notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};

function centroid(ps: { x: number; y: number }[]): { x: number; y: number } {
  return {
    x: ps.reduce((s, p) => s + p.x, 0) / ps.length,
    y: ps.reduce((s, p) => s + p.y, 0) / ps.length,
  };
}
