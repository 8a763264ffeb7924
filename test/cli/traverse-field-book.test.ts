// The traverse task from a field book: courses as measured angles, an explicit close ('loop',
// 'open', a point, a point with a closing bearing), the angle book in the report. Expected
// values are computed here independently (sums of the angles in integer seconds; carrying and
// latitudes/departures with Math.sin and Math.cos).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { runJob } from '../../src/cli/job';
import { JobInvalid, JobInvalidMany } from '../../src/cli/failure';
import { TASK_KINDS } from '../../src/cli/tasks/index';
import type { Report } from '../../src/cli/report';

const run = (job: unknown, arithmetic: 'rational' | 'float' = 'rational'): Report =>
  runJob(job, TASK_KINDS, { arithmetic, digits: 12, source: 't' });
const coords = JSON.parse(
  readFileSync(resolve(__dirname, '../../examples/coordinates.json'), 'utf8'),
) as { points: Record<string, unknown>; tasks: Record<string, unknown>[] };
const fieldLoop = coords.tasks.find((t) => t.name === 'Field-book loop from interior angles')!;
const link = coords.tasks.find((t) => t.name === 'Link traverse between two pairs of marks')!;
const job = (task: Record<string, unknown>) => ({ points: coords.points, tasks: [task] });
const sec = (dms: string): number => {
  const m = /^(\d+)°(\d+)'(\d+)"$/.exec(dms)!;
  return Number(m[1]) * 3600 + Number(m[2]) * 60 + Number(m[3]);
};
const value = (r: Report, name: string): number =>
  Number(r.tasks[0]!.results.find((q) => q.name === name)!.value);

describe('traverse task with courses measured as interior angles (examples/coordinates.json)', () => {
  const r = run(job(fieldLoop));
  const angles = (fieldLoop.courses as { angle: string }[]).map((c) => sec(c.angle));

  it('reports the angular misclosure: the sum of the angles less 540°, in seconds', () => {
    const want = angles.reduce((s, a) => s + a, 0) - 540 * 3600; // +7″
    expect(want).toBe(7);
    expect(value(r, 'angular_misclosure') * 3600).toBeCloseTo(want, 8);
  });

  it('carries the bearings from the start through the balanced angles', () => {
    // Independent: forward = back + 180° + (angle − 7″/5), reduced to [0°, 360°).
    let z = sec(fieldLoop.startBearing as string) / 3600;
    const want = [z];
    for (let i = 1; i < 5; i++) {
      z = (z + 180 + (angles[i]! - 7 / 5) / 3600) % 360;
      want.push(z);
    }
    // Latitudes and departures from these bearings, and their sums: the misclosure.
    const d = (fieldLoop.courses as { distance: number }[]).map((c) => c.distance);
    let e = 0;
    let n = 0;
    want.forEach((b, i) => {
      e += d[i]! * Math.sin((b * Math.PI) / 180);
      n += d[i]! * Math.cos((b * Math.PI) / 180);
    });
    expect(value(r, 'misclosure_east')).toBeCloseTo(e, 8);
    expect(value(r, 'misclosure_north')).toBeCloseTo(n, 8);
  });

  it('shows the angle book before the traverse sheet, with corrections of −1.4″', () => {
    const tables = r.tasks[0]!.tables!;
    expect(tables.map((t) => t.name)).toEqual([
      'angle-book',
      'traverse-sheet',
      'adjusted-courses',
      'coordinates',
    ]);
    const book = tables[0]!;
    expect(book.title).toBe('Angles and bearings (interior angles)');
    expect(book.rows.slice(0, 5).map((row) => row[2])).toEqual(Array(5).fill('-1.4"'));
    expect(book.rows[0]!.slice(0, 2)).toEqual(['K1', `91°20'00.0"`]);
    expect(book.rows[5]![3]).toBe(`540°00'00.0"`);
    expect(r.tasks[0]!.checks.find((c) => c.name === 'angular')!.pass).toBe(true);
    expect(r.tasks[0]!.notes.join(' ')).not.toMatch(/deprecated/);
  });
});

describe('traverse task: a link traverse from a backsight to a foresight', () => {
  it('closes the angles on the bearing T4 → RM2 and the coordinates on T4', () => {
    const r = run(job(link), 'float');
    const az = (p: string, q: string): number => {
      const P = coords.points[p] as { east: number; north: number };
      const Q = coords.points[q] as { east: number; north: number };
      const a = (Math.atan2(Q.east - P.east, Q.north - P.north) * 180) / Math.PI;
      return a < 0 ? a + 360 : a;
    };
    const angles = [
      ...(link.courses as { angle: { value: string } }[]).map((c) => sec(c.angle.value)),
      sec((link.close as { angle: { value: string } }).angle.value),
    ];
    // Carried bearing of the closing line less its known bearing, in seconds (independent).
    let b = az('RM1', 'T1');
    for (const a of angles) b = (b + 180 + a / 3600) % 360;
    let m = (b - az('T4', 'RM2')) * 3600;
    if (m > 648000) m -= 1296000;
    expect(value(r, 'angular_misclosure') * 3600).toBeCloseTo(m, 6);
    expect(m).toBeGreaterThan(6);
    expect(m).toBeLessThan(7);
    const book = r.tasks[0]!.tables![0]!;
    expect(book.rows[3]!.slice(0, 1)).toEqual(['T4']);
    expect(book.rows[3]![4]).toBe('T4–RM2');
    expect(r.tasks[0]!.checks.map((c) => [c.name, c.pass])).toEqual([
      ['linear', true],
      ['angular', true],
    ]);
  });
});

describe('traverse task: how it closes', () => {
  const courses = [
    { to: 'S1', angle: '270', distance: 30 },
    { to: 'S2', angle: '90', distance: 40 },
  ];
  const points = { A: { east: 0, north: 0 }, R: { east: 0, north: -10 } };

  it('"open" carries the coordinates and claims no misclosure', () => {
    const r = run({
      points,
      tasks: [
        {
          kind: 'traverse',
          start: 'A',
          close: 'open',
          angleKind: 'right',
          backsight: 'R',
          courses,
        },
      ],
    });
    const t = r.tasks[0]!;
    expect(t.results.map((q) => q.name)).toEqual([
      'length',
      'S1.east',
      'S1.north',
      'S2.east',
      'S2.north',
    ]);
    expect(value(r, 'S2.east')).toBe(30);
    expect(value(r, 'S2.north')).toBe(40);
    expect(t.notes.join(' ')).toMatch(/nothing checks it \(no misclosure is claimed\)/);
    expect(t.tables!.map((x) => x.name)).toEqual(['angle-book', 'traverse-sheet', 'coordinates']);
  });

  it('a missing close is still a loop, with a deprecation note; "loop" has none', () => {
    const courses4 = [
      { bearing: 90, distance: 10 },
      { bearing: 0, distance: 10 },
      { bearing: 270, distance: 10 },
      { bearing: 180, distance: 10 },
    ];
    const old = run({ points, tasks: [{ kind: 'traverse', start: 'A', courses: courses4 }] });
    expect(old.tasks[0]!.notes.join(' ')).toMatch(/No "close" was given.*deprecated/);
    const now = run({
      points,
      tasks: [{ kind: 'traverse', start: 'A', close: 'loop', courses: courses4 }],
    });
    expect(now.tasks[0]!.notes.join(' ')).not.toMatch(/deprecated/);
    expect(value(now, 'misclosure')).toBe(0);
  });

  it.each([
    [
      'mixed courses',
      { courses: [courses[0], { bearing: 0, distance: 1 }], angleKind: 'right', backsight: 'R' },
      /tasks\[0\]\.courses: 1 of 2 courses are angles/,
    ],
    ['no angleKind', { courses, backsight: 'R', close: 'open' }, /angleKind/],
    [
      'a backsight for a loop',
      { courses: [...courses, courses[0]], angleKind: 'interior', backsight: 'R', close: 'loop' },
      /tasks\[0\]\.backsight: a loop is oriented/,
    ],
    [
      'a closing bearing without its angle',
      { courses, angleKind: 'right', backsight: 'R', close: { point: 'R', bearing: 10 } },
      /tasks\[0\]\.close\.angle/,
    ],
    [
      'a precision tolerance on an open traverse',
      {
        courses,
        angleKind: 'right',
        backsight: 'R',
        close: 'open',
        tolerance: { precision: 5000 },
      },
      /open traverse has no misclosure/,
    ],
  ])('refuses %s as a bad job, naming the place', (_what, part, message) => {
    let thrown: unknown;
    try {
      run({ points, tasks: [{ kind: 'traverse', start: 'A', ...part }] });
    } catch (e) {
      thrown = e;
    }
    expect(thrown instanceof JobInvalid || thrown instanceof JobInvalidMany).toBe(true);
    expect(String((thrown as Error).message)).toMatch(message);
  });
});
