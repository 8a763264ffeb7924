// The demo as a subprocess: exit 0, and its numbers against independent computations
// written here with classical trigonometry in JS floats (Math.sin, Math.cos, Math.tan).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { bundleCli, cleanUp, cli } from './helpers';

interface Q {
  name: string;
  value: string;
  exact?: string;
  sigma?: string;
  budget?: { input: string; share: string }[];
}
interface T {
  kind: string;
  name: string;
  results: Q[];
  checks: { name: string; pass: boolean; value: string }[];
}
interface Job {
  points: Record<string, { east: number | { value: number }; north: number | { value: number } }>;
  tasks: Record<string, unknown>[];
}

let report: { tasks: T[]; caution: string; summary: { failed: number } };
let text: string;
const job = JSON.parse(readFileSync(resolve(__dirname, '../../examples/demo.json'), 'utf8')) as Job;

/** Degrees from DMS text like 62°14'20" (written here, independently of the library's parser). */
function dms(text: string): number {
  const m = /^(-?)(\d+)°(?:(\d+)')?(?:([\d.]+)")?$/.exec(text.trim());
  if (!m) throw new Error(`test data: ${text}`);
  const v = Number(m[2]) + Number(m[3] ?? 0) / 60 + Number(m[4] ?? 0) / 3600;
  return m[1] === '-' ? -v : v;
}
const rad = (deg: number) => (deg * Math.PI) / 180;
const num = (x: number | { value: number }) => (typeof x === 'number' ? x : x.value);
const value = (t: T, name: string) => {
  const q = t.results.find((r) => r.name === name);
  if (!q) throw new Error(`no result ${name} in ${t.name}`);
  return Number(q.value);
};
const task = (kind: string) => {
  const t = report.tasks.find((x) => x.kind === kind);
  if (!t) throw new Error(`the demo has no ${kind} task`);
  return t;
};
const jobTask = (kind: string) => job.tasks.find((t) => t.kind === kind)!;

beforeAll(async () => {
  await bundleCli();
  const r = cli(['demo', '--format', 'json', '--digits', '15']);
  expect(r.code).toBe(0);
  report = JSON.parse(r.stdout);
  const t = cli(['demo']);
  expect(t.code).toBe(0);
  text = t.stdout;
});
afterAll(cleanUp);

describe('quadspread demo', () => {
  it('exits 0 and prints a text report that ends with the safety caution', () => {
    expect(text).toMatch(/quadspread report: /);
    expect(
      text
        .replace(/\s+/g, ' ')
        .trimEnd()
        .endsWith('Design and setting-out follow local codes and licensed practice.'),
    ).toBe(true);
    expect(Math.max(...text.split('\n').map((l) => l.length))).toBeLessThanOrEqual(100);
    expect(text).toMatch(/check independently|check every result independently/);
  });

  it('prints, in the text report, the values that classical trigonometry gives, to the digits shown', () => {
    // Path across a 1 in 3.5 slope holding 1 in 12 (apparent dip: cos β = tan g / tan φ).
    // Angles in DMS to 0.1": written here from decimal degrees by hand.
    const toDms = (deg: number): string => {
      const tenths = Math.round(deg * 36000);
      const d = Math.floor(tenths / 36000);
      const m = Math.floor((tenths - d * 36000) / 600);
      const s = (tenths - d * 36000 - m * 600) / 10;
      return `${d}°${String(m).padStart(2, '0')}'${s.toFixed(1).padStart(4, '0')}"`;
    };
    const beta = Math.acos(1 / 12 / (1 / 3.5)) * (180 / Math.PI);
    expect(text).toContain(`Angle between path and fall line (plan): ${toDms(beta)}\n`);
    // Beacon height from H1: h = d·tan α, rounded to match its uncertainty (± 0.00xx m: 4 decimals).
    const d1 = Math.hypot(2105 - 2000, 3160 - 3000);
    expect(text).toMatch(
      new RegExp(
        `Height from H1 \\(above its instrument level\\): ${(d1 * Math.tan(rad(dms(`7°08'52.8"`)))).toFixed(4)} m ± 0\\.00\\d\\d m`,
      ),
    );
    // Levelling: misclosure = start + ΣBS − ΣFS − close, in mm to 0.1 mm.
    expect(text).toContain(
      `Misclosure (computed less known closing level): ${((112.406 + 1.652 + 2.114 + 1.337 - 0.873 - 1.005 - 1.612 - 114.023) * 1000).toFixed(1)} mm`,
    );
  });

  it('runs the same job as examples/demo.json', () => {
    const r = cli(['demo', '--job']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).toEqual(job);
  });

  it('every check of the demo passes, and the report says so', () => {
    expect(report.summary.failed).toBe(0);
    expect(report.tasks.flatMap((t) => t.checks).length).toBeGreaterThan(0);
  });

  it('gives the traverse misclosure that latitudes and departures by Math.cos/Math.sin give', () => {
    const t = task('traverse');
    const courses = jobTask('traverse').courses as {
      bearing: { value: string };
      distance: { value: number };
    }[];
    let e = 0,
      n = 0;
    for (const c of courses) {
      const az = rad(dms(c.bearing.value));
      e += c.distance.value * Math.sin(az); // departure = d sin(azimuth), bearings clockwise from north
      n += c.distance.value * Math.cos(az); // latitude = d cos(azimuth)
    }
    expect(value(t, 'misclosure_east')).toBeCloseTo(e, 9);
    expect(value(t, 'misclosure_north')).toBeCloseTo(n, 9);
    expect(value(t, 'misclosure')).toBeCloseTo(Math.hypot(e, n), 9);
    // Compass rule (Bowditch): the correction to the first course is −misclosure · d1 / total length.
    const total = courses.reduce((s, c) => s + c.distance.value, 0);
    const start = job.points.CM1!;
    const d1 = courses[0]!.distance.value,
      az1 = rad(dms(courses[0]!.bearing.value));
    expect(value(t, 'CM2.east')).toBeCloseTo(
      num(start.east) + d1 * Math.sin(az1) - (e * d1) / total,
      8,
    );
    expect(value(t, 'CM2.north')).toBeCloseTo(
      num(start.north) + d1 * Math.cos(az1) - (n * d1) / total,
      8,
    );
    expect(t.checks.find((c) => c.name === 'precision')!.pass).toBe(true);
    expect(Number(t.checks.find((c) => c.name === 'precision')!.value)).toBeCloseTo(
      total / Math.hypot(e, n),
      0,
    );
  });

  it('gives the parcel area that the shoelace formula in floats gives, exactly as a fraction', () => {
    const t = task('area');
    const names = jobTask('area').points as string[];
    const p = names.map((k) => ({ x: num(job.points[k]!.east), y: num(job.points[k]!.north) }));
    let twice = 0;
    for (let i = 0; i < p.length; i++) {
      const a = p[i]!,
        b = p[(i + 1) % p.length]!;
      twice += a.x * b.y - b.x * a.y;
    }
    expect(value(t, 'area')).toBeCloseTo(Math.abs(twice) / 2, 6);
    const q = t.results.find((r) => r.name === 'area')!;
    const [num_, den] = q.exact!.split('/').map(Number);
    expect(num_! / (den ?? 1)).toBeCloseTo(Math.abs(twice) / 2, 6);
    // Q2 carries σ = 0.02 m in east and north: u(area) = 0.02·√(∂A/∂E² + ∂A/∂N²), ∂A/∂E2 = (N3 − N1)/2, ∂A/∂N2 = (E1 − E3)/2 (shoelace, derived).
    const sens = Math.hypot((p[2]!.y - p[0]!.y) / 2, (p[0]!.x - p[2]!.x) / 2);
    expect(Number(q.sigma)).toBeCloseTo(0.02 * sens, 1);
  });
});

describe('quadspread demo, elevation and design tasks', () => {
  it('gives the path direction that the apparent-dip formula tan g = tan φ·cos β gives', () => {
    const t = task('path-grade');
    // Slope "1 in 3.5" along the fall line, ruling grade "1 in 12", offsets on the plan:
    // cos β = tan g / tan φ (apparent dip of a plane; classical structural geology).
    const beta = Math.acos(1 / 12 / (1 / 3.5)) * (180 / Math.PI);
    expect(value(t, 'offset_angle')).toBeCloseTo(beta, 8);
    expect(t.results.find((r) => r.name === 'offset_spread')!.exact).toBe('527/576'); // sin²β = 1 − (3.5/12)², derived
    expect(value(t, 'bearing_right')).toBeCloseTo(212.5 + beta, 8);
    expect(value(t, 'bearing_left')).toBeCloseTo(212.5 - beta, 8);
    expect(value(t, 'Line A.grade')).toBeCloseTo(100 * (1 / 3.5) * Math.cos(rad(76)), 8);
    expect(value(t, 'Line B.grade')).toBeCloseTo(100 * (1 / 3.5) * Math.cos(rad(74.5)), 8);
    expect(t.checks.every((c) => c.pass)).toBe(true);
    // The checks are those of the proposed alignments; the solver's own round trip is not counted.
    expect(t.checks.map((c) => c.name)).toEqual(['Line A.ruling', 'Line B.ruling']);
  });

  it('gives the beacon height that h = d·tan α gives from each station', () => {
    const t = task('height');
    const P = (k: string) => ({ x: num(job.points[k]!.east), y: num(job.points[k]!.north) });
    const foot = P('HB');
    const d1 = Math.hypot(P('H1').x - foot.x, P('H1').y - foot.y);
    const d2 = Math.hypot(P('H2').x - foot.x, P('H2').y - foot.y);
    const h1 = d1 * Math.tan(rad(dms(`7°08'52.8"`)));
    const h2 = d2 / Math.tan(rad(dms(`82°38'24.5"`))); // zenith angle: h = d·cot z
    expect(value(t, 'H1.height')).toBeCloseTo(h1, 7);
    expect(value(t, 'H2.height')).toBeCloseTo(h2, 7);
    expect(value(t, 'height')).toBeGreaterThanOrEqual(Math.min(h1, h2) - 1e-9);
    expect(value(t, 'height')).toBeLessThanOrEqual(Math.max(h1, h2) + 1e-9);
    // σ of h = d·tan α from σ_α = 5″: σ_h = d·sec²α·σ_α (derived by differentiation).
    const sig = (d1 / Math.cos(rad(dms(`7°08'52.8"`))) ** 2) * rad(5 / 3600);
    expect(Number(t.results.find((r) => r.name === 'H1.height')!.sigma)).toBeCloseTo(sig, 4);
  });

  it('gives a mast position and height that reproduce every causeway reading to within a few seconds (Math.atan)', () => {
    const t = task('inline-height');
    const h = value(t, 'height'),
      f = value(t, 'foot_chainage'),
      e = value(t, 'foot_offset');
    const stations = jobTask('inline-height').stations as {
      chainage: number;
      vertical: { elevation: string };
    }[];
    for (const s of stations) {
      const predicted = Math.atan(h / Math.hypot(s.chainage - f, e)) * (180 / Math.PI);
      expect(Math.abs(predicted - dms(s.vertical.elevation)) * 3600).toBeLessThan(3);
    }
    expect(value(t, 'level')).toBeCloseTo(4.212 + h, 8);
    // The residual check as a horizontal distance: the station-to-foot distance from the fitted
    // foot, less the one the reading gives with the fitted height, h / tan α (derived).
    const H = value(t, 'H'),
      eq = value(t, 'foot_offset_Q');
    const worst = Math.max(
      ...stations.map((s) =>
        Math.abs(
          Math.sqrt((s.chainage - f) ** 2 + eq) -
            Math.sqrt(H) / Math.tan(rad(dms(s.vertical.elevation))),
        ),
      ),
    );
    const check = t.checks.find((c) => c.name === 'residuals')!;
    expect(Number(check.value)).toBeCloseTo(worst, 7);
    expect(check.pass).toBe(worst <= 0.01);
  });

  it("gives the triangle area that Heron's formula gives and spreads equal to sin² by the law of cosines", () => {
    const t = task('triangle');
    const k = jobTask('triangle').known as Record<string, { value: number }>;
    const a = k.side1!.value,
      b = k.side2!.value,
      c = k.side3!.value;
    const s = (a + b + c) / 2;
    expect(value(t, 'area')).toBeCloseTo(Math.sqrt(s * (s - a) * (s - b) * (s - c)), 5); // Heron
    const A1 = Math.acos((b * b + c * c - a * a) / (2 * b * c));
    expect(value(t, 's1')).toBeCloseTo(Math.sin(A1) ** 2, 12);
  });

  it('gives the diagonal intersection that the two-line formula in floats gives', () => {
    const t = task('intersection');
    const P = (k: string) => ({ x: num(job.points[k]!.east), y: num(job.points[k]!.north) });
    const [p1, p2, p3, p4] = [P('Q1'), P('Q3'), P('Q2'), P('Q4')];
    const den = (p1.x - p2.x) * (p3.y - p4.y) - (p1.y - p2.y) * (p3.x - p4.x);
    const a = p1.x * p2.y - p1.y * p2.x,
      b = p3.x * p4.y - p3.y * p4.x;
    expect(value(t, 'QC.east')).toBeCloseTo((a * (p3.x - p4.x) - (p1.x - p2.x) * b) / den, 8);
    expect(value(t, 'QC.north')).toBeCloseTo((a * (p3.y - p4.y) - (p1.y - p2.y) * b) / den, 8);
  });

  it('gives the levelling misclosure that ΣBS − ΣFS gives, against 12 mm·√K', () => {
    const t = task('levelling');
    const lv = jobTask('levelling') as {
      start: number;
      close: number;
      sights: { bs?: number; fs?: number; distance?: number }[];
    };
    const sum = (k: 'bs' | 'fs') => lv.sights.reduce((s, r) => s + (r[k] ?? 0), 0);
    const mis = (lv.start + sum('bs') - sum('fs') - lv.close) * 1000;
    expect(value(t, 'misclosure')).toBeCloseTo(mis, 6);
    const km = lv.sights.reduce((s, r) => s + (r.distance ?? 0), 0) / 1000;
    expect(value(t, 'allowable')).toBeCloseTo(12 * Math.sqrt(km), 8);
    expect(value(t, 'HF2.level')).toBeCloseTo(lv.close, 9);
    // The booking's arithmetic checks confirm the program's own sums, so they are a note, not a
    // counted check: the one check on the readings is the misclosure.
    expect(t.checks.map((c) => c.name)).toEqual(['misclosure']);
    const notes = (t as T & { notes: string[] }).notes;
    expect(
      notes.some((n) =>
        n.includes(`last − first = ${Number((sum('bs') - sum('fs')).toFixed(9))} m`),
      ),
    ).toBe(true);
  });
});

describe('quadspread demo, trigonometric heighting and resection', () => {
  it('gives the trigonometric height difference of hi + S·cos z − ht + (1 − k)·D²/(2R) with k = 0.13, R = 6371 km', () => {
    const t = task('trig-height');
    const j = jobTask('trig-height') as {
      distance: { value: number };
      vertical: { zenith: string };
      instrumentHeight: number;
      targetHeight: number;
      backward: {
        distance: number;
        vertical: { zenith: string };
        instrumentHeight: number;
        targetHeight: number;
      };
      stationLevel: { value: number };
    };
    const dh = (S: number, z: string, hi: number, ht: number) => {
      const zr = rad(dms(z));
      const D = S * Math.sin(zr);
      return hi + S * Math.cos(zr) - ht + ((1 - 0.13) * D * D) / (2 * 6371000); // Ghilani & Wolf ch. 4 form (from memory)
    };
    const f = dh(j.distance.value, j.vertical.zenith, j.instrumentHeight, j.targetHeight);
    const b = dh(
      j.backward.distance,
      j.backward.vertical.zenith,
      j.backward.instrumentHeight,
      j.backward.targetHeight,
    );
    expect(value(t, 'difference')).toBeCloseTo(f, 8);
    expect(value(t, 'backward')).toBeCloseTo(b, 8);
    expect(value(t, 'mean')).toBeCloseTo((f - b) / 2, 8);
    expect(value(t, 'level')).toBeCloseTo(j.stationLevel.value + (f - b) / 2, 8);
  });

  it('gives a resected station from which Math.atan2 sees the control points at the booked angles', () => {
    const t = task('resection');
    const S = { x: value(t, 'TS.east'), y: value(t, 'TS.north') };
    const azimuth = (k: string) => {
      const p = job.points[k]!;
      return (Math.atan2(num(p.east) - S.x, num(p.north) - S.y) * 180) / Math.PI; // clockwise from north
    };
    const booked = (jobTask('resection').angles as { value: string }[]).map((a) => dms(a.value));
    const a12 = (((azimuth('T2') - azimuth('T1')) % 360) + 360) % 360;
    const a23 = (((azimuth('T3') - azimuth('T2')) % 360) + 360) % 360;
    expect(Math.abs(a12 - booked[0]!) * 3600).toBeLessThan(0.01);
    expect(Math.abs(a23 - booked[1]!) * 3600).toBeLessThan(0.01);
  });
});
