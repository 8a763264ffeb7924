/**
 * Task `setting-out`: a setting-out sheet from an oriented set-up — for each design point the
 * circle reading to turn to, the angle from the first backsight, the horizontal and slope
 * distances and the zenith angle (the library's `setOut`) — and, for a mark already placed
 * and observed, how far it is from its design point (`setOutCheck`).
 *
 * @module cli
 */
import { formatDms, setOut, setOutCheck } from '../../index.js';
import type { SketchView } from '../report.js';
import type { Env, RawCheck, RawQuantity, TaskKind } from '../task.js';
import { lengthText, plain, readLength, readNumber } from '../values.js';
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

export const settingOutTask: TaskKind = {
  kind: 'setting-out',
  description:
    'A setting-out sheet from a set-up oriented on backsights: for each design point the circle reading to turn to, the angle from the first backsight, horizontal and slope distances and the zenith angle; for a placed mark observed, its offsets along and across the line and its cut.',
  schema: taskSchema('setting-out', ['station', 'backsights', 'design'], {
    ...STATION_FIELDS,
    targetHeight: {
      $ref: '#/$defs/measuredLength',
      description: 'Height of the target above the mark to be placed (default 0).',
    },
    combinedFactor: {
      type: ['number', 'string'],
      description: 'Grid coordinates: ground distance = grid distance ÷ this factor.',
    },
    design: {
      type: 'array',
      minItems: 1,
      maxItems: 10000,
      description: 'The design points to set out.',
      items: {
        type: 'object',
        required: ['point'],
        additionalProperties: false,
        properties: {
          point: { $ref: '#/$defs/pointRef' },
          level: { $ref: '#/$defs/measuredLength', description: 'Design level.' },
          placed: { ...SHOT_SCHEMA, description: 'Readings to the mark as placed, to check it.' },
        },
      },
    },
    markTolerance: {
      type: 'object',
      additionalProperties: false,
      description: 'Tolerances of a placed mark: horizontal offset and cut.',
      properties: {
        horizontal: { $ref: '#/$defs/length' },
        vertical: { $ref: '#/$defs/length' },
      },
    },
  }),
  prepare(task, path, ctx) {
    const st = readStation(task, path, ctx);
    const ht =
      task.targetHeight !== undefined
        ? readLength(
            task.targetHeight,
            `${path}.targetHeight`,
            ctx.unit,
            'target height',
            'target height',
          )
        : undefined;
    const factor =
      task.combinedFactor !== undefined
        ? readNumber(
            task.combinedFactor,
            `${path}.combinedFactor`,
            'combined factor',
            'combined factor',
          ).value
        : undefined;
    const mt = (task.markTolerance ?? {}) as Record<string, unknown>;
    const tolH =
      mt.horizontal !== undefined
        ? lengthText(mt.horizontal, `${path}.markTolerance.horizontal`, ctx.unit, 'tolerance')
        : undefined;
    const tolV =
      mt.vertical !== undefined
        ? lengthText(mt.vertical, `${path}.markTolerance.vertical`, ctx.unit, 'tolerance')
        : undefined;
    const design = (task.design as Record<string, unknown>[]).map((d, i) => {
      const p = `${path}.design[${i}]`;
      const point = ctx.point(d.point, `${p}.point`);
      return {
        point,
        ...(d.level !== undefined
          ? {
              level: readLength(
                d.level,
                `${p}.level`,
                ctx.unit,
                `${point.name} design level`,
                'level',
              ),
            }
          : {}),
        ...(d.placed !== undefined
          ? {
              placed: readSight(
                d.placed as Record<string, unknown>,
                `${p}.placed`,
                ctx,
                `${point.name} mark`,
              ),
            }
          : {}),
      } as { point: typeof point; level?: Input; placed?: SightSpec };
    });
    return {
      summary: `Setting out ${design.length} point${design.length > 1 ? 's' : ''} from ${st.station.name}, oriented on ${st.backsights.map((b) => b.point.name).join(', ')}.`,
      inputs: [
        ...stationInputs(st),
        ...(ht ? [ht] : []),
        ...design.flatMap((d) => [
          d.point.east,
          d.point.north,
          ...(d.level ? [d.level] : []),
          ...(d.placed ? sightInputs(d.placed) : []),
        ]),
      ],
      compute<V>(env: Env<V>) {
        const A = env.A;
        const u = ctx.unitName;
        const setup = setUp(env, st, ctx);
        const { results, checks, notes } = setupReport(env, setup, st, u);
        const sheet: string[] = [];
        const drawn: { name: string; x: number; y: number }[] = [];
        for (const d of design) {
          const n = d.point.name;
          const target = {
            x: env.get(d.point.east),
            y: env.get(d.point.north),
            ...(d.level ? { z: env.get(d.level) } : {}),
          };
          const s = setOut(A, setup, target, {
            ...(ht ? { targetHeight: env.get(ht) } : {}),
            ...(factor ? { combinedFactor: A.from(factor) } : {}),
            ...(st.curvature ? { curvature: { unit: ctx.unit } } : {}),
          });
          const q: RawQuantity<V>[] = [
            {
              name: `${n}.circle`,
              label: `${n}: circle reading to turn to`,
              unit: '°',
              value: s.circle,
              approx: true,
            },
            {
              name: `${n}.from_backsight`,
              label: `${n}: angle clockwise from backsight ${setup.backsights[0]!.name}`,
              unit: '°',
              value: s.angleFromBacksight!,
              approx: true,
            },
            {
              name: `${n}.horizontal`,
              label: `${n}: horizontal distance`,
              unit: u,
              value: s.horizontalDistance,
              approx: true,
            },
          ];
          if (s.slopeDistance !== undefined)
            q.push(
              {
                name: `${n}.slope`,
                label: `${n}: slope distance to the target`,
                unit: u,
                value: s.slopeDistance,
                approx: true,
              },
              {
                name: `${n}.zenith`,
                label: `${n}: zenith angle to the target`,
                unit: '°',
                value: s.zenith!,
                approx: true,
              },
            );
          results.push(...q);
          sheet.push(
            `${n}: turn to ${formatDms(A, s.circle, 1)} (${formatDms(A, s.angleFromBacksight!, 1)} from ${setup.backsights[0]!.name}), ${A.toPrecision(s.horizontalDistance, 8)} ${u} horizontal${s.slopeDistance !== undefined ? `, ${A.toPrecision(s.slopeDistance, 8)} ${u} slope at zenith ${formatDms(A, s.zenith!, 1)}` : ''}.`,
          );
          if (env.drawing) drawn.push({ name: n, ...nums(env, target) });
          if (d.placed) {
            const o = observation(env, d.placed, st, ctx);
            const c = setOutCheck(
              A,
              setup,
              target,
              { ...o, zenith: o.zenith!, slope: o.slope! },
              {
                ...(tolH ? { horizontal: A.from(tolH) } : {}),
                ...(tolV ? { vertical: A.from(tolV) } : {}),
              },
            );
            results.push(
              {
                name: `${n}.along`,
                label: `${n} mark: along the line, beyond the design point +`,
                unit: u,
                value: c.along,
                approx: true,
              },
              {
                name: `${n}.across`,
                label: `${n} mark: across the line, right +`,
                unit: u,
                value: c.across,
                approx: true,
              },
            );
            if (c.cut !== undefined)
              results.push({
                name: `${n}.cut`,
                label: `${n} mark: cut (mark level − design level)`,
                unit: u,
                value: c.cut,
                approx: true,
              });
            for (const k of c.checks)
              checks.push({
                name: `${n}.${k.quantity === 'cut' ? 'cut' : 'offset'}`,
                label: `${n} mark: ${k.quantity}`,
                unit: u,
                value: k.value,
                tolerance: `≤ ${plain(k.quantity === 'cut' ? tolV! : tolH!)}`,
                pass: k.ok,
              } as RawCheck<V>);
          }
        }
        notes.push(...sheet);
        notes.push(
          "Setting out follows the contract's tolerances, independent checks and licensed practice: check each mark from a second set-up or by taping between marks.",
        );
        let sketch: SketchView[] | undefined;
        if (env.drawing) {
          const s = nums(env, setup.station);
          const bs = setup.backsights.map((b) => ({ name: b.name, ...nums(env, b.point) }));
          sketch = [
            {
              title: `Setting out from ${st.station.name}`,
              view: 'plan',
              unit: u,
              points: [
                { name: st.station.name, ...s, role: 'station' },
                ...bs.map((b) => ({ ...b, role: 'control' as const })),
                ...drawn.map((p) => ({ ...p, role: 'target' as const })),
              ],
              lines: [
                ...bs.map((b) => ({ x1: s.x, y1: s.y, x2: b.x, y2: b.y, role: 'sight' as const })),
                ...drawn.map((p) => ({
                  x1: s.x,
                  y1: s.y,
                  x2: p.x,
                  y2: p.y,
                  role: 'path' as const,
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
