/**
 * Task `path-grade`: at what direction to cut a road or rail line across a plane hillside
 * so that it holds a ruling grade (the library's `pathOffset`), and the grade of proposed
 * alignments checked against it (`pathGrade`).
 *
 * @module cli
 */
import { modulo } from '../../readings/trig.js';
import {
  degreesFromSpread,
  gradeFromSpread,
  pathGrade,
  pathOffset,
  rational,
  spreadFromDegrees,
} from '../../index.js';
import type { SketchView } from '../report.js';
import type { Env, RawCheck, RawQuantity, TaskKind } from '../task.js';
import { JobInvalid } from '../failure.js';
import { readAngle, readVertical, verticalInputs, verticalOf } from '../values.js';
import type { Input, VerticalSpec } from '../values.js';
import { taskSchema } from './common.js';

const SLOPE_LIKE = /%|‰|:|\bin\b/;

/** A slope or grade: slope text ("1 in 12", "8%", "1:12") or an angle of inclination. */
function readGrade(x: unknown, path: string, name: string): VerticalSpec {
  if (typeof x === 'string' && SLOPE_LIKE.test(x)) return readVertical({ slope: x }, path, name);
  return readVertical(x, path, name);
}

const GRADE = {
  anyOf: [{ type: 'string', maxLength: 100 }, { type: 'number' }, { $ref: '#/$defs/vertical' }],
  description:
    'A slope: text "1 in 12", "8%", "1:12", or an angle of inclination (degrees, DMS, or { "elevation": …, "sigma": … }).',
  'x-describe': 'a slope ("1 in 12", "8%", or an angle)',
};

export const pathGradeTask: TaskKind = {
  kind: 'path-grade',
  description:
    'Direction of a path across a plane slope that holds a ruling grade, and the grade of proposed alignments (offsets from the fall line measured on the plan or in the slope face).',
  schema: taskSchema('path-grade', ['slope'], {
    slope: {
      ...GRADE,
      description: 'The slope of the hillside along its fall line (steepest line).',
    },
    grade: { ...GRADE, description: 'The ruling grade the path must hold.' },
    measured: {
      enum: ['plan', 'face'],
      description:
        'Where offsets from the fall line are measured: on the plan (map, default) or in the slope face.',
    },
    fallBearing: {
      $ref: '#/$defs/measuredAngle',
      description:
        'Bearing (clockwise from north) of the fall line, downhill, to give the path bearings.',
    },
    alignments: {
      type: 'array',
      maxItems: 100,
      items: {
        type: 'object',
        required: ['offset'],
        additionalProperties: false,
        properties: {
          name: { $ref: '#/$defs/name' },
          offset: {
            $ref: '#/$defs/measuredAngle',
            description: 'Angle between the alignment and the fall line.',
          },
        },
      },
      description: 'Proposed alignments to check against the ruling grade.',
    },
  }),
  prepare(task, path, ctx) {
    void ctx;
    const slope = readGrade(task.slope, `${path}.slope`, 'slope');
    const grade =
      task.grade !== undefined ? readGrade(task.grade, `${path}.grade`, 'ruling grade') : undefined;
    const measured = (task.measured as 'plan' | 'face' | undefined) ?? 'plan';
    // A bearing is reduced to [0°, 360°) exactly here, in a bounded number of steps, so that
    // every arithmetic computes with the same bearing however many turns it was written with.
    const fallBearing =
      task.fallBearing !== undefined
        ? readAngle(task.fallBearing, `${path}.fallBearing`, 'fall-line bearing', 'bearing')
        : undefined;
    if (fallBearing)
      fallBearing.value = rational.toString(
        modulo(rational, rational.from(fallBearing.value), rational.from(360)),
      );
    const alignments = ((task.alignments ?? []) as Record<string, unknown>[]).map((a, i) => {
      const label = typeof a.name === 'string' ? a.name : `alignment ${i + 1}`;
      return {
        label,
        offset: readAngle(
          a.offset,
          `${path}.alignments[${i}].offset`,
          `${label} offset`,
          'offset angle',
        ),
      };
    });
    if (!grade && alignments.length === 0)
      throw new JobInvalid(path, 'give a ruling "grade", "alignments", or both');
    const inputs: Input[] = [
      ...verticalInputs(slope),
      ...(grade ? verticalInputs(grade) : []),
      ...(fallBearing ? [fallBearing] : []),
      ...alignments.map((a) => a.offset),
    ];
    return {
      summary: `Path across a slope of ${slope.text}${grade ? ` holding ${grade.text}` : ''}, offsets measured ${measured === 'plan' ? 'on the plan' : 'in the slope face'}.`,
      inputs,
      compute<V>(env: Env<V>) {
        const A = env.A;
        const S = verticalOf(A, slope, env.get).spread;
        const results: RawQuantity<V>[] = [
          { name: 'slope_spread', label: 'Spread S of the fall line', unit: '', value: S },
          {
            name: 'slope_percent',
            label: 'Slope of the fall line in percent',
            unit: '%',
            value: gradeFromSpread(A, S),
          },
        ];
        const checks: RawCheck<V>[] = [];
        const notes: string[] = [];
        let U: V | undefined;
        let gamma: V | undefined;
        if (grade) {
          U = verticalOf(A, grade, env.get).spread;
          const R = pathOffset(A, { fall: S, grade: U, measured });
          gamma = degreesFromSpread(A, R);
          results.push(
            { name: 'grade_spread', label: 'Spread U of the ruling grade', unit: '', value: U },
            {
              name: 'offset_spread',
              label: `Offset spread R from the fall line (${measured})`,
              unit: '',
              value: R,
            },
            {
              name: 'offset_angle',
              label: `Angle between path and fall line (${measured})`,
              unit: '°',
              value: gamma,
              approx: true,
            },
          );
          // Round trip through the forward solver: the path at offset R has grade U exactly (in
          // rational). It tests the solvers, not the job's readings, so it is not counted as a
          // check on the survey: a note when it holds, a failed check if it ever does not.
          const back = pathGrade(A, { fall: S, offset: R, measured });
          const agrees = A.exact
            ? A.eq(back, U)
            : Math.abs(env.num(A.sub(back, U))) <= 1e-9 * Math.max(1e-300, env.num(U));
          if (agrees)
            notes.push(
              `The forward solution at offset spread R gives back the ruling grade${A.exact ? ' exactly' : ' (to 1e-9 relative)'}.`,
            );
          else
            checks.push({
              name: 'round_trip',
              label: 'Grade of the path at that offset equals the ruling grade (spread difference)',
              unit: '',
              value: A.sub(back, U),
              tolerance: A.exact ? '= 0' : '≈ 0',
              pass: false,
            });
          if (fallBearing) {
            const fb = env.get(fallBearing);
            // Reduced mod 360° in a bounded number of steps for any bearing (a float bearing
            // too large to have a fraction of a turn is refused).
            const wrap = (x: V): V => modulo(A, x, A.from(360), 'fallBearing');
            if (measured === 'face')
              notes.push(
                'Bearings are on the plan; with offsets measured in the face, the plan bearing differs from fall bearing ± the face angle. Use measured "plan" for bearings.',
              );
            else {
              results.push(
                {
                  name: 'bearing_right',
                  label: 'Path bearing, downhill, clockwise of the fall line',
                  unit: '°',
                  value: wrap(A.add(fb, gamma)),
                  approx: true,
                },
                {
                  name: 'bearing_left',
                  label: 'Path bearing, downhill, anticlockwise of the fall line',
                  unit: '°',
                  value: wrap(A.sub(fb, gamma)),
                  approx: true,
                },
              );
            }
          }
          notes.push(
            'Two mirror-image directions, one each side of the fall line, hold the grade; the path climbs one way and falls the other.',
          );
        }
        for (const a of alignments) {
          const R = spreadFromDegrees(A, env.get(a.offset));
          const Ua = pathGrade(A, { fall: S, offset: R, measured });
          results.push({
            name: `${a.label}.grade`,
            label: `${a.label}: grade in percent`,
            unit: '%',
            value: gradeFromSpread(A, Ua),
          });
          if (U !== undefined)
            checks.push({
              name: `${a.label}.ruling`,
              label: `${a.label} no steeper than the ruling grade`,
              unit: '%',
              value: gradeFromSpread(A, Ua),
              limit: gradeFromSpread(A, U),
              pass: A.cmp(Ua, U) <= 0,
            });
        }
        let sketch;
        if (env.drawing) {
          const views = [];
          // Plan: the fall line drawn downhill along its bearing (or south), the paths at ± the offset angle.
          const fb = fallBearing ? env.num(env.get(fallBearing)) : 180;
          const dir = (deg: number) => ({
            x: Math.sin((deg * Math.PI) / 180),
            y: Math.cos((deg * Math.PI) / 180),
          });
          const L = 100;
          const lines: SketchView['lines'] = [
            {
              x1: 0,
              y1: 0,
              x2: L * dir(fb).x,
              y2: L * dir(fb).y,
              role: 'base',
              label: 'fall line (downhill)',
            },
          ];
          const pts = [{ name: 'O', x: 0, y: 0, role: 'station' as const }];
          if (gamma !== undefined && measured === 'plan') {
            const g = env.num(gamma);
            for (const s of [1, -1])
              lines.push({
                x1: 0,
                y1: 0,
                x2: L * dir(fb + s * g).x,
                y2: L * dir(fb + s * g).y,
                role: 'path' as const,
                label: `${grade!.text} path`,
              });
          }
          views.push({
            title: 'Path across the slope: plan',
            view: 'plan' as const,
            points: pts,
            lines,
            notes: [],
          });
          sketch = views;
        }
        return { results, checks, notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
