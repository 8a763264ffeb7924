/**
 * Task `traverse`: coordinates along a traverse from a known point, its misclosure on a
 * known closing point (or the start), the precision ratio 1 : N and the compass- or
 * transit-rule adjustment, through the library's `traverse`; courses measured as angles
 * (a field book) are balanced and carried to bearings first; an open traverse goes through
 * `openTraverse` and claims no misclosure.
 *
 * @module cli
 */
import { angularMisclosure, openTraverse, traverse } from '../../index.js';
import type {
  AngleKind,
  CarriedBearings,
  Traverse,
  TraverseClose,
  TraverseCourse,
} from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, Outcome, RawCheck, RawQuantity, RawTable, TaskKind } from '../task.js';
import { angleTable, traverseTables } from './traverse-tables.js';
import { angleText, lengthText, positive, readAngle, readLength } from '../values.js';
import type { Input } from '../values.js';
import { nums, pointInputs, taskSchema, xy } from './common.js';
import type { JobPoint } from '../task.js';

type CourseSpec =
  | { to: string; bearing: Input; distance: Input }
  | { to: string; angle: Input; distance: Input }
  | { to: string; latitude: Input; departure: Input };

/** How the job says the traverse closes. */
type CloseSpec =
  | { kind: 'loop'; point: JobPoint }
  | { kind: 'open' }
  | { kind: 'point'; point: JobPoint; bearing?: Input; foresight?: JobPoint; angle?: Input };

const ANGLE_KINDS: readonly AngleKind[] = ['interior', 'exterior', 'right', 'deflection'];

export const traverseTask: TaskKind = {
  kind: 'traverse',
  description:
    'A traverse from a known point: misclosure on the closing point, precision 1 : N, adjusted coordinates (compass or transit rule).',
  schema: taskSchema('traverse', ['start', 'courses'], {
    start: { $ref: '#/$defs/pointRef', description: 'The known starting point.' },
    close: {
      description:
        'How the traverse closes: "loop" (on its start), "open" (on no known point: no misclosure is claimed), the name of the known point it ends on, or { "point", "bearing" | "foresight", "angle" } for a link traverse whose angles close on a known bearing. Leaving it out means a loop (deprecated: say "loop").',
      anyOf: [
        { enum: ['loop', 'open'] },
        { $ref: '#/$defs/pointRef' },
        {
          type: 'object',
          required: ['point'],
          additionalProperties: false,
          properties: {
            point: { $ref: '#/$defs/pointRef', description: 'The known closing point.' },
            bearing: {
              $ref: '#/$defs/angle',
              description: 'The known bearing of the closing line from the closing point.',
            },
            foresight: {
              $ref: '#/$defs/pointRef',
              description: 'Instead of "bearing": the known point the closing line runs to.',
            },
            angle: {
              $ref: '#/$defs/measuredAngle',
              description:
                'The angle measured at the closing point, of the kind "angleKind", from the last station to the closing line.',
            },
          },
        },
      ],
      'x-describe': '"loop", "open", a point name, or { "point", "bearing", "angle" }',
    },
    angleKind: {
      enum: ['interior', 'exterior', 'right', 'deflection'],
      description:
        'For courses given as { "angle", "distance" }: interior, exterior or to the right (turned clockwise from the back station), or deflections (signed, right positive).',
    },
    startBearing: {
      $ref: '#/$defs/angle',
      description:
        'For courses given as angles: in a loop, the bearing of the first course; otherwise the bearing from the backsight to the start.',
    },
    backsight: {
      $ref: '#/$defs/pointRef',
      description:
        'For courses given as angles, not a loop: the backsight point, instead of "startBearing".',
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
            required: ['angle', 'distance'],
            additionalProperties: false,
            properties: {
              to: { $ref: '#/$defs/name', description: 'Name of the point this course reaches.' },
              angle: {
                $ref: '#/$defs/measuredAngle',
                description:
                  'The angle measured at the station this course leaves, of the kind "angleKind".',
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
          'a course: { "bearing", "distance" }, { "angle", "distance" } or { "latitude", "departure" }, with an optional "to"',
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
        'Pass/fail limits: the least precision N of 1 : N, the largest linear misclosure, the largest angular misclosure (of the interior angles, or of the courses measured as angles).',
      properties: {
        precision: { type: 'number', exclusiveMinimum: 0 },
        linear: { $ref: '#/$defs/length' },
        angular: { $ref: '#/$defs/angle' },
      },
    },
  }),
  prepare(task, path, ctx) {
    const start = ctx.point(task.start, `${path}.start`);
    const rawClose = task.close;
    let close: CloseSpec;
    if (rawClose === undefined || rawClose === 'loop') close = { kind: 'loop', point: start };
    else if (rawClose === 'open') close = { kind: 'open' };
    else if (typeof rawClose === 'string') {
      const point = ctx.point(rawClose, `${path}.close`);
      close = point === start ? { kind: 'loop', point } : { kind: 'point', point };
    } else {
      const o = rawClose as {
        point: unknown;
        bearing?: unknown;
        foresight?: unknown;
        angle?: unknown;
      };
      close = {
        kind: 'point',
        point: ctx.point(o.point, `${path}.close.point`),
        ...(o.bearing !== undefined
          ? { bearing: readAngle(o.bearing, `${path}.close.bearing`, 'closing bearing', 'bearing') }
          : {}),
        ...(o.foresight !== undefined
          ? { foresight: ctx.point(o.foresight, `${path}.close.foresight`) }
          : {}),
        ...(o.angle !== undefined
          ? { angle: readAngle(o.angle, `${path}.close.angle`, 'closing angle', 'angle') }
          : {}),
      };
    }
    const endName = close.kind === 'open' ? undefined : close.point.name;
    const rawCourses = task.courses as Record<string, unknown>[];
    const courses: CourseSpec[] = rawCourses.map((c, i) => {
      const p = `${path}.courses[${i}]`;
      const to =
        typeof c.to === 'string'
          ? c.to
          : `${i + 1 === rawCourses.length && endName !== undefined ? endName : `P${i + 1}`}`;
      const distance = (): Input =>
        positive(
          readLength(c.distance, `${p}.distance`, ctx.unit, `course ${i + 1} distance`, 'distance'),
          `${p}.distance`,
          'distance',
        );
      if ('bearing' in c)
        return {
          to,
          bearing: readAngle(c.bearing, `${p}.bearing`, `course ${i + 1} bearing`, 'bearing'),
          distance: distance(),
        };
      if ('angle' in c)
        return {
          to,
          angle: readAngle(
            c.angle,
            `${p}.angle`,
            `angle at ${i === 0 ? start.name : `station ${i + 1}`}`,
            'angle',
          ),
          distance: distance(),
        };
      return {
        to,
        latitude: readLength(c.latitude, `${p}.latitude`, ctx.unit, `course ${i + 1} latitude`),
        departure: readLength(c.departure, `${p}.departure`, ctx.unit, `course ${i + 1} departure`),
      };
    });
    // Name the angles by their stations, now that the stations have names.
    courses.forEach((c, i) => {
      if ('angle' in c) c.angle.name = `angle at ${i === 0 ? start.name : courses[i - 1]!.to}`;
    });
    const angled = courses.filter((c) => 'angle' in c).length;
    if (angled !== 0 && angled !== courses.length)
      throw new JobInvalid(
        `${path}.courses`,
        `${angled} of ${courses.length} courses are angles: give every course as { "angle", "distance" }, or none`,
      );
    const fieldBook = angled > 0;
    const angleKind = task.angleKind as AngleKind | undefined;
    if (fieldBook && angleKind === undefined)
      throw new JobInvalid(
        `${path}.angleKind`,
        `courses measured as angles need "angleKind": ${ANGLE_KINDS.join(', ')}`,
      );
    if (!fieldBook)
      for (const k of ['angleKind', 'startBearing', 'backsight'])
        if (task[k] !== undefined)
          throw new JobInvalid(
            `${path}.${k}`,
            'belongs to courses measured as angles ({ "angle", "distance" }), but no course has an angle',
          );
    const startBearing =
      task.startBearing !== undefined
        ? readAngle(task.startBearing, `${path}.startBearing`, 'starting bearing', 'bearing')
        : undefined;
    const backsight =
      task.backsight !== undefined ? ctx.point(task.backsight, `${path}.backsight`) : undefined;
    if (fieldBook) {
      if (close.kind === 'loop' && backsight !== undefined)
        throw new JobInvalid(
          `${path}.backsight`,
          'a loop is oriented by the bearing of its first course: give "startBearing"',
        );
      if ((startBearing === undefined) === (backsight === undefined))
        throw new JobInvalid(
          `${path}.startBearing`,
          close.kind === 'loop'
            ? 'a loop of angles needs "startBearing", the bearing of its first course'
            : 'give one of "startBearing" (from the backsight to the start) or "backsight" (a point)',
        );
    }
    if (close.kind === 'point') {
      const checked = close.bearing !== undefined || close.foresight !== undefined;
      if (checked && !fieldBook)
        throw new JobInvalid(
          `${path}.close`,
          'a closing bearing checks measured angles, but no course has an angle',
        );
      if (close.bearing !== undefined && close.foresight !== undefined)
        throw new JobInvalid(`${path}.close`, 'give one of "bearing" or "foresight", not both');
      if (checked && close.angle === undefined)
        throw new JobInvalid(
          `${path}.close.angle`,
          'a closing bearing needs the angle measured at the closing point to the closing line',
        );
      if (!checked && close.angle !== undefined)
        throw new JobInvalid(
          `${path}.close.angle`,
          'a closing angle needs the "bearing" (or "foresight" point) it is checked against',
        );
    }
    const angles = (task.interiorAngles as unknown[] | undefined)?.map((a, i) =>
      angleText(a, `${path}.interiorAngles[${i}]`, 'interior angle'),
    );
    if (angles && close.kind !== 'loop') {
      throw new JobInvalid(
        `${path}.interiorAngles`,
        'interior angles belong to a closed loop, but this traverse closes on another point',
      );
    }
    if (angles && fieldBook)
      throw new JobInvalid(
        `${path}.interiorAngles`,
        'the courses are measured angles already: their misclosure is computed from them',
      );
    const tol = (task.tolerance ?? {}) as {
      precision?: number;
      linear?: unknown;
      angular?: unknown;
    };
    if (close.kind === 'open' && (tol.precision !== undefined || tol.linear !== undefined))
      throw new JobInvalid(
        `${path}.tolerance`,
        'an open traverse has no misclosure to hold to a precision or a linear tolerance',
      );
    const linearTol =
      tol.linear !== undefined
        ? lengthText(tol.linear, `${path}.tolerance.linear`, ctx.unit, 'tolerance')
        : undefined;
    const angularTol =
      tol.angular !== undefined
        ? angleText(tol.angular, `${path}.tolerance.angular`, 'tolerance')
        : undefined;
    const rule = (task.rule as 'compass' | 'transit' | undefined) ?? 'compass';
    const end = close.kind === 'open' ? undefined : close.point;
    const inputs: Input[] = [
      ...pointInputs(start),
      ...(end && end !== start ? pointInputs(end) : []),
    ];
    if (backsight) inputs.push(...pointInputs(backsight));
    if (startBearing) inputs.push(startBearing);
    if (close.kind === 'point') {
      if (close.bearing) inputs.push(close.bearing);
      if (close.foresight) inputs.push(...pointInputs(close.foresight));
      if (close.angle) inputs.push(close.angle);
    }
    for (const c of courses)
      inputs.push(
        ...('bearing' in c
          ? [c.bearing, c.distance]
          : 'angle' in c
            ? [c.angle, c.distance]
            : [c.latitude, c.departure]),
      );
    const closing =
      close.kind === 'open'
        ? 'open (no misclosure is claimed)'
        : close.kind === 'loop'
          ? `closing on ${start.name} (a loop)`
          : `closing on ${close.point.name}${close.bearing || close.foresight ? ' and a known bearing' : ''}`;
    return {
      summary: `Traverse from ${start.name} through ${courses.length} course${courses.length === 1 ? '' : 's'}${fieldBook ? ` measured as ${angleKind === 'right' ? 'angles to the right' : angleKind === 'deflection' ? 'deflections' : `${angleKind} angles`}` : ''}, ${closing}${close.kind === 'open' ? '' : `, ${rule} rule`}.`,
      inputs,
      compute<V>(env: Env<V>): Outcome<V> {
        const A = env.A;
        const list: TraverseCourse<V>[] = courses.map((c) =>
          'bearing' in c
            ? { bearing: env.get(c.bearing), distance: env.get(c.distance) }
            : 'angle' in c
              ? { angle: env.get(c.angle), distance: env.get(c.distance) }
              : { latitude: env.get(c.latitude), departure: env.get(c.departure) },
        );
        const libClose: TraverseClose<V> =
          close.kind === 'open'
            ? 'open'
            : close.kind === 'loop'
              ? 'loop'
              : {
                  point: xy(env, close.point),
                  ...(close.bearing ? { bearing: env.get(close.bearing) } : {}),
                  ...(close.foresight ? { foresight: xy(env, close.foresight) } : {}),
                  ...(close.angle ? { angle: env.get(close.angle) } : {}),
                };
        const input = {
          start: xy(env, start),
          courses: list,
          close: libClose,
          rule,
          ...(fieldBook ? { angleKind: angleKind! } : {}),
          ...(startBearing ? { startBearing: env.get(startBearing) } : {}),
          ...(backsight ? { backsight: xy(env, backsight) } : {}),
        };
        const u = ctx.unitName;
        const names = [start.name, ...courses.map((c) => c.to)];
        const notes: string[] = [];
        if (task.close === undefined)
          notes.push(
            'No "close" was given: the traverse is taken to close on its start (a loop). This default is deprecated: write "close": "loop" (or name the closing point, or "open").',
          );
        if (close.kind === 'open') {
          const o = openTraverse(A, input);
          const last = o.points[o.points.length - 1]!;
          const to = names[names.length - 1]!;
          const results: RawQuantity<V>[] = [
            {
              name: 'length',
              label: 'Length of the traverse',
              unit: u,
              value: o.length,
              approx: true,
            },
            ...o.points.slice(1).flatMap((p, i) => [
              { name: `${names[i + 1]}.east`, label: `${names[i + 1]} east`, unit: u, value: p.x },
              {
                name: `${names[i + 1]}.north`,
                label: `${names[i + 1]} north`,
                unit: u,
                value: p.y,
              },
            ]),
          ];
          notes.push(
            `An open traverse: ${to} is carried from ${start.name} and nothing checks it (no misclosure is claimed). Measure it back, or close it on a known point.`,
          );
          const tables: RawTable<V>[] = [];
          if (env.drawing) {
            if (o.angles)
              tables.push(
                angleTable(
                  A,
                  o.angles,
                  names,
                  angleKind!,
                  courses.map((c) => env.get((c as { angle: Input }).angle)),
                  undefined,
                ),
              );
            tables.push(
              ...traverseTables(
                A,
                { ...o, rule: undefined },
                names,
                courses.map((c) => ('bearing' in c ? env.get(c.bearing) : undefined)),
                u,
                o.angles?.bearings,
              ),
            );
          }
          let sketch;
          if (env.drawing) {
            const pts = o.points.map((p) => nums(env, p));
            sketch = [
              {
                title: `Open traverse ${start.name} → ${to}`,
                view: 'plan' as const,
                points: pts.map((p, i) => ({
                  name: names[i]!,
                  ...p,
                  role: i === 0 ? ('control' as const) : ('computed' as const),
                })),
                lines: pts.slice(1).map((p, i) => ({
                  x1: pts[i]!.x,
                  y1: pts[i]!.y,
                  x2: p.x,
                  y2: p.y,
                  role: 'course' as const,
                })),
                notes: [{ ...nums(env, last), text: 'open: not checked' }],
              },
            ];
          }
          return { results, checks: [], notes, tables, ...(sketch ? { sketch } : {}) };
        }
        const t: Traverse<V, boolean> = traverse(A, input);
        // Under the compass rule each correction is in proportion to its course's length
        // √(lat² + dep²), exact in an exact arithmetic only for a perfect square (otherwise a
        // rational within 1e-51 relative): the adjusted points then have no exact form.
        const lengthsApprox =
          A.exact &&
          rule === 'compass' &&
          t.courses.some(
            (c, i) =>
              !('bearing' in courses[i]!) &&
              !('angle' in courses[i]!) &&
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
        const carried = t.angles;
        if (carried)
          angularResults(
            A,
            carried,
            angleKind!,
            close.kind === 'point' && close.angle !== undefined,
            angularTol,
            results,
            checks,
            notes,
          );
        const tables: RawTable<V>[] = [];
        if (env.drawing) {
          if (carried)
            tables.push(
              angleTable(
                A,
                carried,
                names,
                angleKind!,
                [
                  ...courses.map((c) => env.get((c as { angle: Input }).angle)),
                  ...(close.kind === 'point' && close.angle ? [env.get(close.angle)] : []),
                ],
                close.kind === 'point' && close.angle
                  ? `${close.point.name}–${close.foresight?.name ?? 'closing line'}`
                  : undefined,
              ),
            );
          tables.push(
            ...traverseTables(
              A,
              t,
              names,
              courses.map((c) => ('bearing' in c ? env.get(c.bearing) : undefined)),
              u,
              carried?.bearings,
            ),
          );
        }
        let sketch;
        if (env.drawing) {
          const raw = t.points.map((p) => nums(env, p));
          const adj = t.adjusted.map((p) => nums(env, p));
          sketch = [
            {
              title: `Traverse ${start.name} → ${end!.name}`,
              view: 'plan' as const,
              unit: u,
              points: adj.slice(0, close.kind === 'loop' ? -1 : undefined).map((p, i) => ({
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

/** The angular misclosure of courses measured as angles: a result, a check, a note. */
function angularResults<V>(
  A: Env<V>['A'],
  carried: CarriedBearings<V>,
  kind: AngleKind,
  link: boolean,
  tolerance: string | undefined,
  results: RawQuantity<V>[],
  checks: RawCheck<V>[],
  notes: string[],
): void {
  const m = carried.misclosure;
  if (m === undefined) {
    notes.push(
      'The angles close on no known bearing: nothing checks them, and they are carried unbalanced.',
    );
    return;
  }
  const n = carried.balanced.length;
  const words =
    kind === 'deflection'
      ? 'deflections'
      : kind === 'right'
        ? 'angles to the right'
        : `${kind} angles`;
  results.push({
    name: 'angular_misclosure',
    label: link
      ? 'Angular misclosure (closing bearing carried through the angles less the known one)'
      : `Angular misclosure (sum of the ${words} less ${Math.round(A.toNumber(carried.expected!))}°)`,
    unit: '°',
    value: m,
    kind: 'seconds',
  });
  notes.push(
    `The angular misclosure is shared equally: each of the ${n} angles is corrected by its opposite ÷ ${n}.`,
  );
  if (tolerance !== undefined) {
    const sec = A.from(3600);
    checks.push({
      name: 'angular',
      label: 'Angular misclosure, in seconds of arc',
      unit: '"',
      kind: 'seconds',
      value: A.mul(m, sec),
      limit: A.mul(A.abs(A.from(tolerance)), sec),
      pass: A.cmp(A.abs(m), A.abs(A.from(tolerance))) <= 0,
    });
  }
}
