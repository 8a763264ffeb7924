import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import {
  rational,
  float,
  levelRun,
  allowableMisclosure,
  area,
  intersectCircles,
  forward,
} from '../../src/index.js';
import type { LevelSight } from '../../src/index.js';

// A run booked by hand (invented numbers; levels reduced by hand, derived):
// BM 50.000; BS 1.525 → HI 51.525; IS 2.310 → 49.215; FS 0.985 (CP1) → 50.540, BS 2.105 → HI 52.645;
// IS 1.660 → 50.985; FS 3.015 (CP2) → 49.630, BS 0.750 → HI 50.380; FS 1.360 → 49.020.
// ΣBS = 4.380, ΣFS = 5.360, last − first = −0.980; the closing bench mark is known as 49.030.
const sights: LevelSight<string>[] = [
  { station: 'BM1', bs: '1.525' },
  { station: 'A', is: '2.310', distance: 40 },
  { station: 'CP1', fs: '0.985', bs: '2.105', distance: 40 },
  { station: 'B', is: '1.660', distance: 50 },
  { station: 'CP2', fs: '3.015', bs: '0.750', distance: 50 },
  { station: 'BM2', fs: '1.360', distance: 70 },
];
const levels = ['50', '49.215', '50.54', '50.985', '49.63', '49.02'];

describe.each(kinds)('levelRun(%s, …)', (_name, A) => {
  const run = levelRun(A, {
    start: '50.000',
    sights: sights as never,
    close: '49.030',
    order: 12,
  });

  it('reduces the booking to the levels worked by hand', () => {
    run.rows.forEach((r, i) =>
      expect(Math.abs(A.toNumber(r.level) - Number(levels[i]))).toBeLessThan(1e-12),
    );
  });

  it('books rises and falls (A: fall 0.785; CP1: rise 1.325; B: rise 0.445; CP2: fall 1.355; BM2: fall 0.610)', () => {
    const rf = run.rows.map((r) =>
      r.rise !== undefined ? A.toNumber(r.rise) : r.fall !== undefined ? -A.toNumber(r.fall) : null,
    );
    expect(rf[0]).toBeNull();
    [-0.785, 1.325, 0.445, -1.355, -0.61].forEach((v, i) => expect(rf[i + 1]!).toBeCloseTo(v, 12));
    const his = run.rows.map((r) => (r.hi === undefined ? null : A.toNumber(r.hi)));
    [51.525, null, 52.645, null, 50.38, null].forEach((v, i) =>
      v === null ? expect(his[i]).toBeNull() : expect(his[i]!).toBeCloseTo(v, 12),
    );
  });

  it('passes both arithmetic checks: ΣBS − ΣFS = ΣRise − ΣFall = last − first = −0.980', () => {
    expect(A.toNumber(run.check.sumBS)).toBeCloseTo(4.38, 12);
    expect(A.toNumber(run.check.sumFS)).toBeCloseTo(5.36, 12);
    expect(A.toNumber(run.check.difference)).toBeCloseTo(-0.98, 12);
    expect(run.check.riseFallOk).toBe(true);
    expect(run.check.heightOfInstrumentOk).toBe(true);
  });

  it('finds a −10 mm misclosure, outside an allowance of 12·√0.25 = 6 mm (c = 12 mm as given)', () => {
    expect(A.toNumber(run.misclosureMm!)).toBeCloseTo(-10, 9);
    // 250 m of run → K = 0.25 km; 12 mm·√0.25 = 6 mm (c as the user gives it).
    expect(run.withinAllowable).toBe(false);
  });

  it('distributes the misclosure in proportion to distance, landing on the closing level', () => {
    expect(run.distributedBy).toBe('distance');
    // Correction at A = +0.010 × 40/250 (derived).
    expect(A.toNumber(run.rows[1]!.correction)).toBeCloseTo(0.0016, 12);
    expect(A.toNumber(run.rows[5]!.adjusted)).toBeCloseTo(49.03, 12);
  });

  it('distributes by setups when distances are missing', () => {
    const r = levelRun(A, {
      start: 50,
      sights: sights.map(({ distance: _d, ...s }) => s) as never,
      close: '49.030',
    });
    expect(r.distributedBy).toBe('setups');
    // Three setups: A and CP1 are read from setup 1 (1/3 of the correction), B and CP2 from 2, BM2 from 3.
    expect(A.toNumber(r.rows[1]!.correction)).toBeCloseTo(0.01 / 3, 12);
    expect(A.toNumber(r.rows[3]!.correction)).toBeCloseTo(0.02 / 3, 12);
    expect(A.toNumber(r.rows[5]!.correction)).toBeCloseTo(0.01, 12);
  });

  it('refuses bookings that break the rules with INVALID_ARGUMENT naming the row', () => {
    expect(code(() => levelRun(A, { start: 0, sights: [{ fs: 1 }, { fs: 1 }] }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(() =>
      levelRun(A, { start: 0, sights: [{ bs: 1 }, { is: 1, fs: 2 }, { fs: 1 }] }),
    ).toThrow(/sights\[1\]/);
    expect(code(() => levelRun(A, { start: 0, sights: [{ bs: 1 }, { is: 1 }] }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => levelRun(A, { start: 0, sights: [{ bs: 1 }, { bs: 2 }, { fs: 1 }] }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => levelRun(A, { start: 0, sights: [{ bs: 1 }, { fs: 1 }], order: 12 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => levelRun(A, { start: 0, sights: [{ bs: 1 }] }))).toBe('TOO_FEW_POINTS');
    expect(code(() => levelRun(A, { start: 0, sights: [{ bs: 1 }, { fs: 'x' }] }))).toBe(
      'INVALID_NUMBER',
    );
  });
});

describe('allowableMisclosure(A, c, km)', () => {
  it('is c·√K, a surd in rational', () => {
    expect(allowableMisclosure(rational, 3, 9).allowable.toString()).toBe('9');
    expect(allowableMisclosure(rational, '8', 3).allowable.toString()).toBe('8√3');
    expect(allowableMisclosure(float, 5, 2).allowable).toBeCloseTo(5 * Math.SQRT2, 14);
  });

  it("refuses text that is not c, the name of an order (its c is the user's to give), c ≤ 0 and negative K with INVALID_ARGUMENT", () => {
    expect(code(() => allowableMisclosure(rational, 'fourth' as never, 1))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => allowableMisclosure(rational, 'third' as never, 1))).toBe('INVALID_ARGUMENT');
    expect(code(() => allowableMisclosure(rational, 0, 1))).toBe('INVALID_ARGUMENT');
    expect(code(() => allowableMisclosure(rational, 12, -1))).toBe('INVALID_ARGUMENT');
  });
});

describe('errors name the input that could not be read', () => {
  it('levelRun names start, a sight member and close; area and circles name the vertex or radius', () => {
    expect(() => levelRun(rational, { start: 'abc', sights: [{ bs: 1 }, { fs: 1 }] })).toThrow(
      /levelRun\(A, input\) start: "abc" is not a number/,
    );
    expect(() => levelRun(float, { start: 0, sights: [{ bs: 1 }, { fs: NaN }] })).toThrow(
      /levelRun\(A, input\) sights\[1\]\.fs:/,
    );
    expect(() =>
      levelRun(rational, { start: 0, close: '1,5', sights: [{ bs: 1 }, { fs: 1 }] }),
    ).toThrow(/levelRun\(A, input\) close:/);
    expect(() =>
      area(rational, [
        { x: 0, y: 0 },
        { x: 'one', y: 0 },
        { x: 0, y: 1 },
      ]),
    ).toThrow(/area\(A, points\)\[1\]\.x: "one" is not a number/);
    expect(() =>
      intersectCircles(
        rational,
        { center: { x: 0, y: 0 }, radius: 'r' },
        { center: { x: 1, y: 0 }, radius: 1 },
      ),
    ).toThrow(/circle1\.radius:/);
    expect(() => forward(rational, { x: 0, y: 0 }, 10, 'far')).toThrow(
      /forward\(A, P, bearing, distance\) distance:/,
    );
    expect(code(() => levelRun(rational, { start: 'abc', sights: [{ bs: 1 }, { fs: 1 }] }))).toBe(
      'INVALID_NUMBER',
    );
  });
});

describe('levelRun with readings in feet', () => {
  it('converts the misclosure to mm and the run length to km with the international foot (0.3048 m, exact)', () => {
    const run = levelRun(rational, {
      unit: 'ft',
      start: 100,
      close: '100.01',
      order: 12,
      sights: [{ bs: '4.50' }, { fs: '4.50', distance: 5000 }],
    });
    // −0.01 ft = −3.048 mm; 5000 ft = 1.524 km; allowable² = 12² × 1.524 = 219.456 mm² (derived).
    expect(rational.toString(run.misclosureMm!)).toBe('-381/125');
    const a = run.allowable!.allowable;
    expect(a.mul(a).toString()).toBe('27432/125');
    expect(run.withinAllowable).toBe(true);
  });
});

describe('levelRun(rational, …) properties (fast-check, exact)', () => {
  const reading = fc.integer({ min: 0, max: 4000 }).map((mm) => `${mm}/1000`);
  const row = fc.oneof(fc.record({ is: reading }), fc.record({ fs: reading, bs: reading }));
  it('satisfies both checks exactly and lands the adjusted end on the closing level', () => {
    fc.assert(
      fc.property(
        reading,
        fc.array(row, { maxLength: 20 }),
        reading,
        fc.integer({ min: -50, max: 50 }),
        (bs0, middle, fsEnd, mm) => {
          const s = [{ bs: bs0 }, ...middle, { fs: fsEnd }] as LevelSight<string>[];
          const r = levelRun(rational, { start: 100, sights: s as never });
          expect(r.check.riseFallOk && r.check.heightOfInstrumentOk).toBe(true);
          const closeLevel = rational.add(r.rows[s.length - 1]!.level, rational.from(`${mm}/1000`));
          const adj = levelRun(rational, { start: 100, sights: s as never, close: closeLevel });
          expect(rational.eq(adj.rows[s.length - 1]!.adjusted, closeLevel)).toBe(true);
        },
      ),
    );
  });
});
