/**
 * Task `traverse`: coordinates along a traverse from a known point, its misclosure on a
 * known closing point (or the start), the precision ratio 1 : N and the compass- or
 * transit-rule adjustment, through the library's `traverse`.
 *
 * @module cli
 */
import { angularMisclosure, traverse } from '../../index.js';
import type { TraverseCourse } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, Outcome, RawCheck, RawQuantity, RawTable, TaskKind } from '../task.js';
import { traverseTables } from './traverse-tables.js';
import { angleText, lengthText, positive, readAngle, readLength } from '../values.js';
import type { Input } from '../values.js';
import { nums, pointInputs, taskSchema, xy } from './common.js';

type CourseSpec =
  | { to: string; bearing: Input; distance: Input }
  | { to: string; latitude: Input; departure: Input };

export const traverseTask: TaskKind = {
  kind: 'traverse',
  description:
    'A traverse from a known point: misclosure on the closing point, precision 1 : N, adjusted coordinates (compass or transit rule).',
  schema: taskSchema('traverse', ['start', 'courses'], {
    start: { $ref: '#/$defs/pointRef', description: 'The known starting point.' },
    close: {
      $ref: '#/$defs/pointRef',
      description: 'The known point the traverse ends on (default: the start, a closed loop).',
    },
    rule: {
      enum: ['compass', 'transit'],
      description: 'How the misclosure is distributed (default compass, i.e. Bowditch).',
    },
    courses: {
      type: 'array',
      minItems: 1,
      maxItems: 10000,
      items: {
        anyOf: [
          {
            type: 'object',
            required: ['bearing', 'distance'],
            additionalProperties: false,
            properties: {
              to: { $ref: '#/$defs/name', description: 'Name of the point this course reaches.' },
              bearing: {
                $ref: '#/$defs/measuredAngle',
                description:
                  'Azimuth clockwise from north, or a quadrant bearing such as "S 68°05\'35\\" W".',
              },
              distance: { $ref: '#/$defs/measuredLength', description: 'Horizontal distance.' },
            },
          },
          {
            type: 'object',
            required: ['latitude', 'departure'],
            additionalProperties: false,
            properties: {
              to: { $ref: '#/$defs/name' },
              latitude: { $ref: '#/$defs/measuredLength', description: 'North component.' },
              departure: { $ref: '#/$defs/measuredLength', description: 'East component.' },
            },
          },
        ],
        'x-describe':
          'a course: { "bearing", "distance" } or { "latitude", "departure" }, with an optional "to"',
      },
    },
    interiorAngles: {
      type: 'array',
      minItems: 3,
      items: { $ref: '#/$defs/angle' },
      description: 'Measured interior angles of a closed loop, for the angular misclosure.',
    },
    tolerance: {
      type: 'object',
      additionalProperties: false,
      description:
        'Pass/fail limits: the least precision N of 1 : N, the largest linear misclosure, the largest angular misclosure.',
      properties: {
        precision: { type: 'number', exclusiveMinimum: 0 },
        linear: { $ref: '#/$defs/length' },
        angular: { $ref: '#/$defs/angle' },
      },
    },
  }),
  prepare(task, path, ctx) {
    const start = ctx.point(task.start, `${path}.start`);
    const close = task.close !== undefined ? ctx.point(task.close, `${path}.close`) : start;
    const courses: CourseSpec[] = (task.courses as Record<string, unknown>[]).map((c, i) => {
      const p = `${path}.courses[${i}]`;
      const to =
        typeof c.to === 'string'
          ? c.to
          : `${i + 1 === (task.courses as unknown[]).length ? close.name : `P${i + 1}`}`;
      if ('bearing' in c) {
        return {
          to,
          bearing: readAngle(c.bearing, `${p}.bearing`, `course ${i + 1} bearing`, 'bearing'),
          distance: positive(
            readLength(
              c.distance,
              `${p}.distance`,
              ctx.unit,
              `course ${i + 1} distance`,
              'distance',
            ),
            `${p}.distance`,
            'distance',
          ),
        };
      }
      return {
        to,
        latitude: readLength(c.latitude, `${p}.latitude`, ctx.unit, `course ${i + 1} latitude`),
        departure: readLength(c.departure, `${p}.departure`, ctx.unit, `course ${i + 1} departure`),
      };
    });
    const angles = (task.interiorAngles as unknown[] | undefined)?.map((a, i) =>
      angleText(a, `${path}.interiorAngles[${i}]`, 'interior angle'),
    );
    if (angles && task.close !== undefined && task.close !== task.start) {
      throw new JobInvalid(
        `${path}.interiorAngles`,
        'interior angles belong to a closed loop, but this traverse closes on another point',
      );
    }
    const tol = (task.tolerance ?? {}) as {
      precision?: number;
      linear?: unknown;
      angular?: unknown;
    };
    const linearTol =
      tol.linear !== undefined
        ? lengthText(tol.linear, `${path}.tolerance.linear`, ctx.unit, 'tolerance')
        : undefined;
    const angularTol =
      tol.angular !== undefined
        ? angleText(tol.angular, `${path}.tolerance.angular`, 'tolerance')
        : undefined;
    const rule = (task.rule as 'compass' | 'transit' | undefined) ?? 'compass';
    const inputs: Input[] = [...pointInputs(start), ...(close === start ? [] : pointInputs(close))];
    for (const c of courses)
      inputs.push(...('bearing' in c ? [c.bearing, c.distance] : [c.latitude, c.departure]));
    return {
      summary: `Traverse from ${start.name} through ${courses.length} course${courses.length === 1 ? '' : 's'} closing on ${close.name}, ${rule} rule.`,
      inputs,
      compute<V>(env: Env<V>): Outcome<V> {
        const A = env.A;
        const list: TraverseCourse<V>[] = courses.map((c) =>
          'bearing' in c
            ? { bearing: env.get(c.bearing), distance: env.get(c.distance) }
            : { latitude: env.get(c.latitude), departure: env.get(c.departure) },
        );
        const t = traverse(A, {
          start: xy(env, start),
          courses: list,
          close: xy(env, close),
          rule,
        });
        const u = ctx.unitName;
        // Under the compass rule each correction is in proportion to its course's length
        // √(lat² + dep²), exact in an exact arithmetic only for a perfect square (otherwise a
        // rational within 1e-51 relative): the adjusted points then have no exact form.
        const lengthsApprox =
          A.exact &&
          rule === 'compass' &&
          t.courses.some(
            (c, i) =>
              !('bearing' in courses[i]!) &&
              A.sqrt(A.add(A.mul(c.latitude, c.latitude), A.mul(c.departure, c.departure))) ===
                undefined,
          );
        const results: RawQuantity<V>[] = [
          {
            name: 'misclosure_east',
            label: 'Misclosure in departure (east), computed end less known closing point',
            unit: u,
            value: t.closure.east,
          },
          {
            name: 'misclosure_north',
            label: 'Misclosure in latitude (north), computed end less known closing point',
            unit: u,
            value: t.closure.north,
          },
          { name: 'misclosure', label: 'Linear misclosure', unit: u, value: t.closure.linear },
          {
            name: 'length',
            label: 'Length of the traverse',
            unit: u,
            value: t.length,
            approx: true,
          },
          ...t.adjusted.slice(1, -1).flatMap((p, i) => [
            {
              name: `${courses[i]!.to}.east`,
              label: `${courses[i]!.to} adjusted east`,
              unit: u,
              value: p.x,
              approx: lengthsApprox,
            },
            {
              name: `${courses[i]!.to}.north`,
              label: `${courses[i]!.to} adjusted north`,
              unit: u,
              value: p.y,
              approx: lengthsApprox,
            },
          ]),
        ];
        const checks: RawCheck<V>[] = [];
        if (tol.precision !== undefined) {
          const ratio = t.closure.ratio;
          const pass = ratio === undefined || A.cmp(ratio, A.from(tol.precision)) >= 0;
          checks.push(
            ratio === undefined
              ? {
                  name: 'precision',
                  label: 'Precision 1 : N (closes exactly: N is infinite, shown as 0)',
                  unit: '',
                  value: A.zero,
                  tolerance: `≥ ${tol.precision}`,
                  pass,
                }
              : {
                  name: 'precision',
                  label: 'Precision 1 : N, N = length ÷ linear misclosure',
                  unit: '',
                  kind: 'ratio',
                  value: ratio,
                  limit: A.from(tol.precision),
                  relation: '≥',
                  pass,
                },
          );
        }
        if (linearTol !== undefined) {
          const L = A.add(
            A.mul(t.closure.east, t.closure.east),
            A.mul(t.closure.north, t.closure.north),
          );
          const T = A.from(linearTol);
          checks.push({
            name: 'linear',
            label: 'Linear misclosure',
            unit: u,
            value: t.closure.linear,
            limit: T,
            pass: A.cmp(L, A.mul(T, T)) <= 0,
          });
        }
        const notes: string[] = [];
        if (task.close === undefined)
          notes.push(
            'No "close" was given: the traverse is taken to close on its start (a loop). This default is deprecated: name the closing point in "close" (the start itself for a loop).',
          );
        if (t.closure.ratio === undefined)
          notes.push('The traverse closes exactly: precision 1 : ∞.');
        if (angles) {
          const m = angularMisclosure(A, angles);
          results.push({
            name: 'angular_misclosure',
            label: 'Angular misclosure (sum of interior angles less (n − 2)·180°)',
            unit: '°',
            value: m.misclosure,
            kind: 'seconds',
          });
          if (angularTol !== undefined) {
            const sec = A.from(3600);
            checks.push({
              name: 'angular',
              label: 'Angular misclosure, in seconds of arc',
              unit: '"',
              kind: 'seconds',
              value: A.mul(m.misclosure, sec),
              limit: A.mul(A.abs(A.from(angularTol)), sec),
              pass: A.cmp(A.abs(m.misclosure), A.abs(A.from(angularTol))) <= 0,
            });
          }
        }
        const tables: RawTable<V>[] = [];
        if (env.drawing)
          tables.push(
            ...traverseTables(
              A,
              t,
              [start.name, ...courses.map((c) => c.to)],
              courses.map((c) => ('bearing' in c ? env.get(c.bearing) : undefined)),
              u,
            ),
          );
        let sketch;
        if (env.drawing) {
          const names = [start.name, ...courses.map((c) => c.to)];
          const raw = t.points.map((p) => nums(env, p));
          const adj = t.adjusted.map((p) => nums(env, p));
          sketch = [
            {
              title: `Traverse ${start.name} → ${close.name}`,
              view: 'plan' as const,
              unit: u,
              points: adj.slice(0, close === start ? -1 : undefined).map((p, i) => ({
                name: names[i]!,
                ...p,
                role:
                  i === 0 || i === adj.length - 1 ? ('control' as const) : ('computed' as const),
              })),
              lines: [
                ...raw.slice(1).map((p, i) => ({
                  x1: raw[i]!.x,
                  y1: raw[i]!.y,
                  x2: p.x,
                  y2: p.y,
                  role: 'course' as const,
                })),
                ...adj.slice(1).map((p, i) => ({
                  x1: adj[i]!.x,
                  y1: adj[i]!.y,
                  x2: p.x,
                  y2: p.y,
                  role: 'adjusted' as const,
                  measure: true,
                })),
              ],
              notes: [
                {
                  ...adj[adj.length - 1]!,
                  text: `misclosure ${env.A.toPrecision(t.closure.east, 3)} ${u} E, ${env.A.toPrecision(t.closure.north, 3)} ${u} N`,
                },
              ],
            },
          ];
        }
        return { results, checks, notes, tables, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
