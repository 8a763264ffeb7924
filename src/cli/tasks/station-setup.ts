/**
 * Task `station-setup`: a total-station set-up on a known point, oriented on one or more
 * backsights (the library's `orientStation`), and the 3D coordinates of side shots from it
 * (`sideShot`), with the backsight residuals checked against tolerances.
 *
 * @module cli
 */
import { sideShot } from '../../index.js';
import type { SketchView } from '../report.js';
import type { Env, RawQuantity, TaskKind } from '../task.js';
import type { Input } from '../values.js';
import { nums, taskSchema } from './common.js';
import {
  SHOT_SCHEMA,
  STATION_FIELDS,
  observation,
  readSight,
  readStation,
  setUp,
  setupReport,
  sightInputs,
  stationInputs,
} from './field-common.js';
import type { SightSpec } from './field-common.js';

export const stationSetupTask: TaskKind = {
  kind: 'station-setup',
  description:
    'A total-station set-up on a known point: the orientation of the circle from backsights to known points, their residuals, and the east, north and level of side shots.',
  schema: taskSchema('station-setup', ['station', 'backsights'], {
    ...STATION_FIELDS,
    shots: {
      type: 'array',
      maxItems: 10000,
      items: SHOT_SCHEMA,
      description: 'Side shots: circle, zenith angle, slope distance, target height.',
    },
  }),
  prepare(task, path, ctx) {
    const st = readStation(task, path, ctx);
    const shots = ((task.shots as Record<string, unknown>[] | undefined) ?? []).map((s, i) => {
      const name = typeof s.name === 'string' ? s.name : `shot ${i + 1}`;
      return { name, sight: readSight(s, `${path}.shots[${i}]`, ctx, name) as SightSpec };
    });
    return {
      summary: `Set-up on ${st.station.name} oriented on ${st.backsights.map((b) => b.point.name).join(', ')}${shots.length ? `, ${shots.length} side shot${shots.length > 1 ? 's' : ''}` : ''}.`,
      inputs: [...stationInputs(st), ...shots.flatMap((s) => sightInputs(s.sight))] as Input[],
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const setup = setUp(env, st, ctx);
        const { results, checks, notes } = setupReport(env, setup, st, u);
        const points = shots.map((s) => {
          const o = observation(env, s.sight, st, ctx);
          return {
            name: s.name,
            p: sideShot(A, setup, { ...o, zenith: o.zenith!, slope: o.slope! }),
          };
        });
        for (const { name, p } of points) {
          const q: RawQuantity<V>[] = [
            { name: `${name}.east`, label: `${name} east`, unit: u, value: p.x, approx: true },
            { name: `${name}.north`, label: `${name} north`, unit: u, value: p.y, approx: true },
          ];
          if (p.z !== undefined)
            q.push({
              name: `${name}.level`,
              label: `${name} level`,
              unit: u,
              value: p.z,
              approx: true,
            });
          results.push(...q);
        }
        if (st.curvature)
          notes.push(
            'Height differences include curvature and refraction (1 − k)·D²/(2R), k = 0.13, R = 6 371 000 m.',
          );
        let sketch: SketchView[] | undefined;
        if (env.drawing) {
          const s = nums(env, setup.station);
          const bs = setup.backsights.map((b) => ({ name: b.name, ...nums(env, b.point) }));
          const sh = points.map((q) => ({ name: q.name, ...nums(env, q.p) }));
          sketch = [
            {
              title: `Set-up on ${st.station.name}: backsights and side shots`,
              view: 'plan',
              unit: u,
              points: [
                { name: st.station.name, ...s, role: 'station' },
                ...bs.map((b) => ({ ...b, role: 'control' as const })),
                ...sh.map((p) => ({ ...p, role: 'computed' as const })),
              ],
              lines: [
                ...bs.map((b) => ({ x1: s.x, y1: s.y, x2: b.x, y2: b.y, role: 'sight' as const })),
                ...sh.map((p) => ({ x1: s.x, y1: s.y, x2: p.x, y2: p.y, role: 'path' as const })),
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
