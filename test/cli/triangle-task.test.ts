// The triangle task with an angle given: a spread cannot tell an angle from its supplement,
// so solveTriangle gives two triangles for two sides and the included angle; the task knows
// the angle and keeps the one that has it. Checked against the law of cosines with Math.cos
// (a² = b² + c² − 2bc·cos A, common practice), independently of the library.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

interface T {
  name: string;
  results: { name: string; value: string }[];
  notes: string[];
}
let tasks: T[];
const b = 120.5,
  c = 85.3;
const angles = { acute: 47 + 12 / 60 + 30 / 3600, obtuse: 132 + 47 / 60 + 30 / 3600 };

beforeAll(async () => {
  await bundleCli();
  const dir = tempFolder();
  const job = {
    title: 'Triangle task check (invented)',
    units: { length: 'm' },
    tasks: [
      {
        kind: 'triangle',
        name: 'included acute',
        known: { side2: '120.5 m', side3: 85.3, angle1: `47°12'30"` },
      },
      {
        kind: 'triangle',
        name: 'included obtuse',
        known: { side2: '120.5 m', side3: 85.3, angle1: `132°47'30"` },
      },
      {
        kind: 'triangle',
        name: 'two sides and an opposite angle',
        known: { side1: 5, side2: 7, angle1: 30 },
      },
      {
        kind: 'triangle',
        name: 'long and short side, nearly right',
        known: { side1: 3500, side2: 1, angle3: 89.9999 },
      },
    ],
  };
  const file = join(dir, 'job.json');
  writeFileSync(file, JSON.stringify(job));
  for (const arithmetic of ['float', 'rational']) {
    const r = cli(['run', file, '--format', 'json', '--digits', '12', '--arithmetic', arithmetic]);
    expect(r.code).toBe(0);
    reports[arithmetic] = (JSON.parse(r.stdout) as { tasks: T[] }).tasks;
  }
  tasks = reports.float!;
});
const reports: Record<string, T[]> = {};
afterAll(cleanUp);

const value = (t: T, name: string) => Number(t.results.find((r) => r.name === name)!.value);
const cosineLaw = (deg: number) =>
  Math.sqrt(b * b + c * c - 2 * b * c * Math.cos((deg * Math.PI) / 180));

describe('triangle task with a given angle', () => {
  it('two sides and the included acute angle: one triangle, the side of the law of cosines', () => {
    const t = tasks[0]!;
    expect(t.results.some((r) => r.name.endsWith('.2'))).toBe(false);
    expect(value(t, 'side1')).toBeCloseTo(cosineLaw(angles.acute), 8);
  });

  it('the same with the supplementary (obtuse) angle: the other triangle', () => {
    const t = tasks[1]!;
    expect(t.results.some((r) => r.name.endsWith('.2'))).toBe(false);
    expect(value(t, 'side1')).toBeCloseTo(cosineLaw(angles.obtuse), 8);
  });

  it('two sides and an angle opposite one of them: still two triangles, with the note', () => {
    const t = tasks[2]!;
    // a = 5 opposite A1 = 30°, b = 7: sin A2 = 7·sin 30°/5 = 0.7, A2 = 44.4° or 135.6°, so
    // side3 = 7 cos 30° ± √(25 − 49 sin² 30°) (law of cosines solved for c).
    const roots = [
      7 * Math.cos(Math.PI / 6) - Math.sqrt(25 - 49 / 4),
      7 * Math.cos(Math.PI / 6) + Math.sqrt(25 - 49 / 4),
    ];
    const got = [value(t, 'side3.1'), value(t, 'side3.2')].sort((x, y) => x - y);
    expect(got[0]).toBeCloseTo(roots[0]!, 9);
    expect(got[1]).toBeCloseTo(roots[1]!, 9);
    expect(t.notes.join(' ')).toMatch(/Two triangles fit/);
  });

  it('a nearly right angle between a long and a short side: one triangle in float and in rational alike', () => {
    // c² = a² + b² − 2ab·cos γ with a = 3500, b = 1, γ = 89.9999° (law of cosines, Math.cos)
    const want = 3500 ** 2 + 1 - 2 * 3500 * Math.cos((89.9999 * Math.PI) / 180);
    for (const arithmetic of ['float', 'rational']) {
      const t = reports[arithmetic]![3]!;
      expect(
        t.results.some((r) => r.name.endsWith('.2')),
        arithmetic,
      ).toBe(false);
      expect(value(t, 'Q3')).toBeCloseTo(want, 3); // the report gives 12 significant digits
    }
  });
});
