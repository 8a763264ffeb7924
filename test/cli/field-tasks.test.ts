// The station-setup and setting-out task kinds, run as a user would from a job file; the
// numbers are checked against classical trigonometry written here with Math.atan2, Math.sin,
// Math.cos and Math.hypot, independently of the library.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

interface T {
  name: string;
  results: { name: string; value: string }[];
  checks: { name: string; pass: boolean }[];
  notes: string[];
}

const rad = (d: number) => (d * Math.PI) / 180;
const az = (dx: number, dy: number) => ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360;
const S = { east: 500, north: 500 };
const CP = { east: 600, north: 700 };
const O = 12.5; // orientation, degrees
const circleTo = (p: { east: number; north: number }) =>
  (az(p.east - S.east, p.north - S.north) - O + 360) % 360;

const job = {
  title: 'Field tasks check (invented)',
  points: {
    S,
    CP,
    D: { east: 530.25, north: 455.5 },
  },
  tasks: [
    {
      kind: 'station-setup',
      station: 'S',
      stationLevel: 20,
      instrumentHeight: 1.5,
      backsights: [{ point: 'CP', circle: circleTo(CP) }],
      shots: [{ name: 'P', circle: 100, zenith: 95, slope: 40, targetHeight: 2 }],
    },
    {
      kind: 'setting-out',
      station: 'S',
      stationLevel: 20,
      instrumentHeight: 1.5,
      backsights: [{ point: 'CP', circle: circleTo(CP) }],
      targetHeight: 1.8,
      design: [{ point: 'D', level: 19.25 }],
    },
  ],
};

const reports: Record<string, T[]> = {};
beforeAll(async () => {
  await bundleCli();
  const file = join(tempFolder(), 'job.json');
  writeFileSync(file, JSON.stringify(job));
  for (const arithmetic of ['float', 'rational']) {
    const r = cli(['run', file, '--format', 'json', '--digits', '12', '--arithmetic', arithmetic]);
    expect(r.code, r.stderr).toBe(0);
    reports[arithmetic] = (JSON.parse(r.stdout) as { tasks: T[] }).tasks;
  }
});
afterAll(cleanUp);

const value = (t: T, name: string) => Number(t.results.find((r) => r.name === name)!.value);

describe.each(['float', 'rational'])('station-setup and setting-out (%s)', (arithmetic) => {
  it('orients on the backsight and places the side shot by x = x0 + S sin z sin β, z = z0 + hi + S cos z − ht', () => {
    const t = reports[arithmetic]![0]!;
    expect(Math.abs(value(t, 'orientation') - O)).toBeLessThan(1e-9);
    const b = rad(100 + O);
    expect(
      Math.abs(value(t, 'P.east') - (500 + 40 * Math.sin(rad(95)) * Math.sin(b))),
    ).toBeLessThan(1e-8);
    expect(
      Math.abs(value(t, 'P.north') - (500 + 40 * Math.sin(rad(95)) * Math.cos(b))),
    ).toBeLessThan(1e-8);
    expect(Math.abs(value(t, 'P.level') - (20 + 1.5 + 40 * Math.cos(rad(95)) - 2))).toBeLessThan(
      1e-8,
    );
  });

  it('gives the circle to turn to, the angle from the backsight, D, slope distance and zenith angle', () => {
    const t = reports[arithmetic]![1]!;
    const dx = 30.25;
    const dy = -44.5;
    const bearing = az(dx, dy);
    expect(Math.abs(value(t, 'D.circle') - (bearing - O))).toBeLessThan(1e-9);
    expect(Math.abs(value(t, 'D.from_backsight') - (bearing - O - circleTo(CP)))).toBeLessThan(
      1e-9,
    );
    const D = Math.hypot(dx, dy);
    const V = 19.25 + 1.8 - 21.5;
    expect(Math.abs(value(t, 'D.horizontal') - D)).toBeLessThan(1e-9);
    expect(Math.abs(value(t, 'D.slope') - Math.hypot(D, V))).toBeLessThan(1e-9);
    expect(Math.abs(value(t, 'D.zenith') - (Math.atan2(D, V) * 180) / Math.PI)).toBeLessThan(1e-9);
    expect(t.notes.some((n) => n.startsWith('D: turn to '))).toBe(true);
  });
});

describe('field task kinds refuse bad jobs', () => {
  const run = (tasks: unknown[]) => {
    const file = join(tempFolder(), 'bad.json');
    writeFileSync(file, JSON.stringify({ ...job, tasks }));
    return cli(['run', file]);
  };
  it('a zenith angle outside (0°, 360°) and a missing backsight are bad jobs (exit 2)', () => {
    const bad = run([{ ...job.tasks[0], shots: [{ circle: 1, zenith: 360, slope: 5 }] }]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/zenith/);
    expect(run([{ ...job.tasks[0], backsights: [] }]).code).toBe(2);
  });
  it('a backsight on the station itself has no solution (exit 3)', () => {
    const r = run([{ ...job.tasks[0], backsights: [{ point: 'S', circle: 0 }] }]);
    expect(r.code).toBe(3);
    expect(r.stdout + r.stderr).toMatch(/COINCIDENT_POINTS/);
  });
});
