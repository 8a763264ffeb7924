// The job file reads lengths, σ and angles by the library's one grammar: σ of a length a number
// in the job's unit, text with its own unit or { constant, ppm }; σ of an angle a number in
// arc-seconds; DD.MMSS angles only under "units": { "angles": "dd.mmss" }.
import { describe, expect, it } from 'vitest';
import { runJob } from '../../src/cli/job';
import { TASK_KINDS } from '../../src/cli/tasks/index';
import type { Report } from '../../src/cli/report';

const run = (job: unknown): Report =>
  runJob(job, TASK_KINDS, { arithmetic: 'float', digits: 12, source: 't' });
const points = { A: { east: 0, north: 0 } };
const open = (course: Record<string, unknown>, units?: Record<string, unknown>) => ({
  ...(units ? { units } : {}),
  points,
  tasks: [{ kind: 'traverse', start: 'A', close: 'open', courses: [{ to: 'B', ...course }] }],
});
// The report gives σ to two significant digits.
const near = (sigma: string | undefined, want: number) =>
  expect(Math.abs(Number(sigma) - want) / want).toBeLessThan(0.01);
const q = (r: Report, name: string) => r.tasks[0]!.results.find((x) => x.name === name)!;

describe('the job file reads σ by the one rule', () => {
  it('a bare σ of an angle is in arc-seconds: 10″ on a 1000 m line east moves north by 1000·10″', () => {
    const r = run(open({ bearing: { value: 90, sigma: 10 }, distance: 1000 }));
    const want = (1000 * ((10 / 3600) * Math.PI)) / 180; // σ(north) = d·σθ (radians)
    near(q(r, 'B.north').sigma, want);
  });

  it('{ constant, ppm } of a distance is √(constant² + (ppm·10⁻⁶·d)²)', () => {
    const r = run(
      open({ bearing: 0, distance: { value: 2000, sigma: { constant: '3 mm', ppm: 2 } } }),
    );
    near(q(r, 'B.north').sigma, Math.hypot(0.003, 0.004));
  });

  it('a σ with its own unit is converted to the job unit', () => {
    const r = run(open({ bearing: 0, distance: { value: 100, sigma: '0.02 ft' } }));
    near(q(r, 'B.north').sigma, 0.006096);
  });
});

describe('"units": { "angles": "dd.mmss" }', () => {
  it('reads 36.5027 as 36°50′27″ and leaves DMS text as it is', () => {
    const packed = run(open({ bearing: 36.5027, distance: 100 }, { angles: 'dd.mmss' }));
    const text = run(open({ bearing: `36°50'27"`, distance: 100 }));
    const az = ((36 + 50 / 60 + 27 / 3600) * Math.PI) / 180;
    expect(Number(q(packed, 'B.east').value)).toBeCloseTo(100 * Math.sin(az), 9);
    expect(q(packed, 'B.east').value).toBe(q(text, 'B.east').value);
    // Without the setting the number is decimal degrees.
    const plain = run(open({ bearing: 36.5027, distance: 100 }));
    expect(Number(q(plain, 'B.east').value)).toBeCloseTo(
      100 * Math.sin((36.5027 * Math.PI) / 180),
      9,
    );
  });

  it('refuses 36.6027 (60 minutes) naming the place', () => {
    expect(() => run(open({ bearing: 36.6027, distance: 100 }, { angles: 'dd.mmss' }))).toThrow(
      /tasks\[0\]\.courses\[0\]\.bearing: .*minutes 60/,
    );
  });
});
