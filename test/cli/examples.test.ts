// Example jobs as a subprocess, against classical computations with Math.*.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { bundleCli, cleanUp, cli } from './helpers';

const rad = (d: number) => (d * Math.PI) / 180;
function dms(text: string): number {
  const m = /^(\d+)°(\d+)'([\d.]+)"$/.exec(text);
  if (!m) throw new Error(`test data: ${text}`);
  return Number(m[1]) + Number(m[2]) / 60 + Number(m[3]) / 3600;
}
type Report = {
  tasks: {
    kind: string;
    results: { name: string; value: string; exact?: string }[];
    checks: { pass: boolean }[];
  }[];
};
const run = (file: string): Report => {
  const r = cli([
    'run',
    resolve(__dirname, '../../examples', file),
    '--format',
    'json',
    '--digits',
    '15',
  ]);
  expect(r.code).toBe(0);
  return JSON.parse(r.stdout);
};
const val = (t: Report['tasks'][number], name: string) =>
  Number(t.results.find((q) => q.name === name)!.value);

beforeAll(bundleCli);
afterAll(cleanUp);

describe('examples/heights-feet.json', () => {
  it('base-height: distances by the sine rule and the height by d·tan α', () => {
    const job = JSON.parse(
      readFileSync(resolve(__dirname, '../../examples/heights-feet.json'), 'utf8'),
    );
    const spec = job.tasks.find((t: { kind: string }) => t.kind === 'base-height');
    const t = run('heights-feet.json').tasks.find((x) => x.kind === 'base-height')!;
    const a1 = rad(dms(spec.stations[0].angle.value)),
      a2 = rad(dms(spec.stations[1].angle.value));
    const b = spec.base.value;
    const d1 = (b * Math.sin(a2)) / Math.sin(a1 + a2); // sine rule: the side opposite the angle at station 2
    const d2 = (b * Math.sin(a1)) / Math.sin(a1 + a2);
    expect(val(t, 'R1.distance')).toBeCloseTo(d1, 7);
    expect(val(t, 'R2.distance')).toBeCloseTo(d2, 7);
    const h1 = d1 * Math.tan(rad(dms(spec.stations[0].vertical.elevation)));
    const h2 = d2 * Math.tan(rad(dms(spec.stations[1].vertical)));
    expect(val(t, 'height')).toBeGreaterThanOrEqual(Math.min(h1, h2) - 1e-7);
    expect(val(t, 'height')).toBeLessThanOrEqual(Math.max(h1, h2) + 1e-7);
    expect(t.checks.every((c) => c.pass)).toBe(true);
  });

  it('inline-height: the exact configuration comes back exactly (H = 144, foot at 7, offset quadrance 25)', () => {
    const t = run('heights-feet.json').tasks.find((x) => x.kind === 'inline-height')!;
    const exact = (n: string) => t.results.find((q) => q.name === n)!.exact;
    expect([exact('H'), exact('foot_chainage'), exact('foot_offset_Q'), exact('height')]).toEqual([
      '144',
      '7',
      '25',
      '12',
    ]);
  });
});

describe('examples/triangles.json', () => {
  it('gives the two triangles Q3 = 41 ∓ 20√2 and the 13-14-15 triangle of area 84 (Heron)', () => {
    const [two, three] = run('triangles.json').tasks;
    expect(two!.results.filter((q) => q.name.startsWith('Q3')).map((q) => q.exact)).toEqual([
      '41 - 20√2',
      '41 + 20√2',
    ]);
    expect(three!.results.find((q) => q.name === 'area')!.exact).toBe('84');
    expect(three!.results.find((q) => q.name === 'quadrea')!.exact).toBe('112896');
  });
});

describe('examples/road-grade.json', () => {
  it('the plan case fall 1/5, offset 1/4 holds grade 3/19 exactly; the face case gives R = 1 − U/S', () => {
    const [face, plan] = run('road-grade.json').tasks;
    expect(plan!.results.find((q) => q.name === 'offset_spread')!.exact).toBe('1/4');
    // Face: slope "1 in 2" → S = 1/5, grade 10 % → U = 1/101; R = 1 − U/S = 96/101 (derived).
    expect(face!.results.find((q) => q.name === 'offset_spread')!.exact).toBe('96/101');
    // Pegged line at 80° from the fall line in the face: sin(grade) = sin φ·cos 80° (derived).
    const phi = Math.atan(1 / 2);
    expect(val(face!, 'Pegged line.grade')).toBeCloseTo(
      100 * Math.tan(Math.asin(Math.sin(phi) * Math.cos(rad(80)))),
      8,
    );
  });
});

describe('examples/geodesy.json', () => {
  it('gives the round trip through the inverse as a note, not as a counted check on the coordinates', () => {
    const r = cli(['run', resolve(__dirname, '../../examples/geodesy.json'), '--format', 'json']);
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout) as {
      tasks: { checks: unknown[]; notes: string[] }[];
      summary: { passed: number; failed: number };
    };
    for (const t of report.tasks) {
      expect(t.checks).toEqual([]);
      expect(t.notes.some((n) => /^Computation check: the round trip .* agrees/.test(n))).toBe(
        true,
      );
    }
    expect(report.summary).toMatchObject({ passed: 0, failed: 0 });
    const text = cli(['run', resolve(__dirname, '../../examples/geodesy.json')]).stdout;
    expect(text).toContain('checks: none (nothing in this job is checked against a tolerance)');
  });
});
