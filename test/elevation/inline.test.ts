// heightFromInlineReadings and heightFromInlineQuadrances: stations on one straight line.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, float, QuadspreadError } from '../../src/index.js';
import {
  heightFromInlineReadings,
  heightFromInlineQuadrances,
} from '../../src/elevation/inline.js';
import { stewartQuadranceResidual } from '../../src/geometry/stewart.js';
import { verticalFromAngle } from '../../src/readings/vertical.js';

const R = rational;
type Q = ReturnType<typeof R.from>;
const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};

/** Vertical spreads R = H/(H + Q) seen from chainages c to a point with foot (f, e) and height quadrance H (construction). */
function readings(c: Q[], f: Q, e: Q, H: Q): Q[] {
  return c.map((ci) => {
    const d = R.sub(ci, f);
    return R.div(H, R.add(H, R.add(R.mul(d, d), e)));
  });
}
const rat = (lo: number, hi: number) =>
  fc
    .tuple(fc.integer({ min: lo, max: hi }), fc.integer({ min: 1, max: 50 }))
    .map(([n, d]) => R.from(`${n}/${d}`));

describe('heightFromInlineReadings returns the construction exactly in rational', () => {
  it('three stations: H = 144, foot chainage 7, offset quadrance 25', () => {
    const c = [0, 10, 20].map((x) => R.from(x));
    const r = heightFromInlineReadings(R, {
      chainages: c,
      vertical: readings(c, R.from(7), R.from(25), R.from(144)),
    });
    expect([R.toString(r.H), R.toString(r.footChainage), R.toString(r.footOffset)]).toEqual([
      '144',
      '7',
      '25',
    ]);
    expect(r.residuals.every((x) => R.isZero(x))).toBe(true);
  });
  it('random exact configurations with 3 to 6 stations in any order', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: -5000, max: 5000 }), { minLength: 3, maxLength: 6 }),
        rat(-5000, 5000),
        rat(1, 10 ** 6),
        rat(1, 10 ** 6),
        (cs, f, e, H) => {
          const c = cs.map((x) => R.from(`${x}/4`));
          const r = heightFromInlineReadings(R, { chainages: c, vertical: readings(c, f, e, H) });
          expect(R.eq(r.H, H) && R.eq(r.footChainage, f) && R.eq(r.footOffset, e)).toBe(true);
          expect(r.residuals.every((x) => R.isZero(x))).toBe(true);
          expect(r.sign).toBe(1);
        },
      ),
      { numRuns: 80 },
    );
  });
  it("a point below the stations' level (readings with sign −1) has the same H and sign −1", () => {
    const c = [0, 10, 20].map((x) => R.from(x));
    const v = readings(c, R.from(7), R.from(25), R.from(144)).map((s) => ({
      spread: s,
      sign: -1 as const,
    }));
    const r = heightFromInlineReadings(R, { chainages: c, vertical: v });
    expect(R.toString(r.H)).toBe('144');
    expect(r.sign).toBe(-1);
  });
  it('a foot on the line itself (offset 0) is found exactly', () => {
    const c = [0, 3, 11, 12].map((x) => R.from(x));
    const r = heightFromInlineReadings(R, {
      chainages: c,
      vertical: readings(c, R.from(5), R.zero, R.from(9)),
    });
    expect([R.toString(r.H), R.toString(r.footChainage), R.toString(r.footOffset)]).toEqual([
      '9',
      '5',
      '0',
    ]);
  });
});

describe('heightFromInlineReadings in float against classical trigonometry', () => {
  // Invented demo geometry: a mast 42.7 m above a straight shore path, foot 31.4 m off the line at chainage 118.
  const h = 42.7,
    f = 118,
    off = 31.4;
  const chain = [0, 50, 100, 175, 260];
  const elev = chain.map((c) => (Math.atan2(h, Math.hypot(c - f, off)) * 180) / Math.PI); // Math.atan2, Math.hypot
  it('recovers h, the foot chainage and the offset from elevation angles (Math.atan2) to 1e-8', () => {
    const r = heightFromInlineReadings(float, {
      chainages: chain,
      vertical: elev.map((a) => verticalFromAngle(float, a)),
    });
    expect(Math.sqrt(r.H)).toBeCloseTo(h, 8);
    expect(r.footChainage).toBeCloseTo(f, 7);
    expect(Math.sqrt(r.footOffset)).toBeCloseTo(off, 6);
  });
  it('keeps its accuracy with chainages far from their origin (a line at 100 km): 1e-9 relative', () => {
    const cs = chain.map((c) => c + 100000);
    const v = cs.map((c) =>
      verticalFromAngle(float, (Math.atan2(h, Math.hypot(c - (f + 100000), off)) * 180) / Math.PI),
    );
    const r = heightFromInlineReadings(float, { chainages: cs, vertical: v });
    expect(Math.abs(Math.sqrt(r.H) / h - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.footChainage - (f + 100000))).toBeLessThan(1e-6);
    expect(Math.abs(Math.sqrt(r.footOffset) / off - 1)).toBeLessThan(1e-9);
  });
  it('least squares with noisy readings: close to the truth, with non-zero residuals', () => {
    const noise = [0.002, -0.001, 0.0015, -0.002, 0.001]; // degrees
    const r = heightFromInlineReadings(float, {
      chainages: chain,
      vertical: elev.map((a, i) => verticalFromAngle(float, a + noise[i]!)),
    });
    expect(Math.abs(Math.sqrt(r.H) - h)).toBeLessThan(0.2);
    expect(Math.abs(r.footChainage - f)).toBeLessThan(1);
    expect(r.residuals.some((x) => Math.abs(x) > 1e-6)).toBe(true);
  });
});

describe('heightFromInlineReadings refuses bad input with typed errors', () => {
  it('fewer than three stations', () => {
    expect(
      codeOf(() => heightFromInlineReadings(R, { chainages: [0, 10], vertical: ['1/2', '1/3'] })),
    ).toBe('TOO_FEW_STATIONS');
  });
  it('repeated chainages', () => {
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 10], vertical: ['1/2', '1/3', '1/3'] }),
      ),
    ).toBe('REPEATED_CHAINAGE');
    // many stations (checked by sorting): the two equal chainages are named, whatever their order
    const cs = Array.from({ length: 40 }, (_, i) => 3 * i);
    cs[31] = cs[7]!;
    expect(() =>
      heightFromInlineReadings(float, { chainages: cs, vertical: cs.map(() => 0.3) }),
    ).toThrow(/REPEATED_CHAINAGE.*stations 7 and 31 .*chainage 21/);
  });
  it('a very long list of stations is solved (least squares) without a quadratic-time check', () => {
    // invented demo geometry: 20 000 stations 1 m apart, a point 30 above, foot at chainage 5000, offset 20
    const cs = Array.from({ length: 20000 }, (_, i) => i);
    const v = cs.map((c) => {
      const q = (c - 5000) ** 2 + 400;
      return 900 / (900 + q);
    });
    const r = heightFromInlineReadings(float, { chainages: cs, vertical: v });
    expect(Math.sqrt(r.H)).toBeCloseTo(30, 6);
    expect(r.footChainage).toBeCloseTo(5000, 6);
  });
  it('counts that differ, spreads outside [0, 1], level sights and mixed signs', () => {
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 20], vertical: ['1/2', '1/3'] }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 20], vertical: ['1/2', '4/3', '1/3'] }),
      ),
    ).toBe('SPREAD_OUT_OF_RANGE');
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 20], vertical: ['1/2', 0, '1/3'] }),
      ),
    ).toBe('INCONSISTENT_READINGS');
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, {
          chainages: [0, 10, 20],
          vertical: ['1/2', { spread: R.from('1/3'), sign: -1 }, '1/3'],
        }),
      ),
    ).toBe('INCONSISTENT_READINGS');
  });
  it('readings that fit no real point', () => {
    // equal spreads at three stations: Stewart's relation gives a zero coefficient of H
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 20], vertical: ['1/2', '1/2', '1/2'] }),
      ),
    ).toBe('INCONSISTENT_READINGS');
    // the middle station sees the point lowest: no real point (H would be negative)
    expect(
      codeOf(() =>
        heightFromInlineReadings(R, { chainages: [0, 10, 20], vertical: ['1/2', '1/10', '1/2'] }),
      ),
    ).toBe('INCONSISTENT_READINGS');
  });
});

describe('heightFromInlineQuadrances: only the quadrances between consecutive stations', () => {
  it("the physical root is the construction; it satisfies geometry's Stewart quadrance relation", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 400 }),
        fc.integer({ min: 1, max: 400 }),
        rat(-800, 800),
        rat(1, 10 ** 5),
        rat(1, 10 ** 5),
        (u, v, f, e, H) => {
          const c = [R.zero, R.from(u), R.from(u + v)];
          const vr = readings(c, f, e, H);
          const r = heightFromInlineQuadrances(R, { spacings: [u * u, v * v], vertical: vr });
          expect(r.H.eq(H)).toBe(true);
          const k = vr.map((s) => R.div(R.sub(R.one, s), s));
          // the foot quadrances H·k from stations 1, 2, 3 meet Stewart's quadrance relation at the middle station
          const res = stewartQuadranceResidual(R, {
            QB: R.mul(H, k[1]!),
            QC: R.mul(H, k[2]!),
            QD: R.mul(H, k[0]!),
            QBD: u * u,
            QBC: v * v,
          });
          expect(R.isZero(res)).toBe(true);
        },
      ),
      { numRuns: 60 },
    );
  });
  it('with spacings that are not squares the height is an exact surd, equal to the chainage form in float', () => {
    // stations at chainages 0, √2, √2 + √3 (spacings 2 and 3), readings chosen freely
    const vr = ['1/2', '1/4', '1/10'];
    let r;
    try {
      r = heightFromInlineQuadrances(R, { spacings: [2, 3], vertical: vr });
    } catch (e) {
      r = undefined;
    }
    const f = heightFromInlineReadings(float, {
      chainages: [0, Math.SQRT2, Math.SQRT2 + Math.sqrt(3)],
      vertical: [1 / 2, 1 / 4, 1 / 10],
    });
    expect(r).toBeDefined();
    expect(r!.H.isRational()).toBe(false);
    expect(r!.H.toNumber()).toBeCloseTo(f.H, 10);
  });
  it('float: recovers a mast height from elevation angles (Math.atan2) with spacings given as quadrances', () => {
    // invented demo geometry: stations at chainages 0, 45, 130 along a shore; mast 27.3 high, foot at (88, 40)
    const h = 27.3,
      f = 88,
      off = 40;
    const cs = [0, 45, 130];
    const v = cs.map((c) =>
      verticalFromAngle(float, (Math.atan2(h, Math.hypot(c - f, off)) * 180) / Math.PI),
    );
    const r = heightFromInlineQuadrances(float, { spacings: [45 * 45, 85 * 85], vertical: v });
    expect(Math.sqrt(r.H)).toBeCloseTo(h, 8);
  });
  it('the mirror root is the height with the first station reflected across the second (stations 1 and 3 on one side)', () => {
    const c = [0, 10, 25].map((x) => R.from(x));
    const vr = readings(c, R.from(7), R.from(25), R.from(144));
    const r = heightFromInlineQuadrances(R, { spacings: [100, 225], vertical: vr });
    expect(r.H.toString()).toBe('144');
    // Stewart's relation (chainage form, derived by hand) with station 1 moved to 2·10 − 0 = 20: H' = a₁₂a₂₃a₁₃/(k₁a₂₃ − k₂a₁₃ + k₃a₁₂)
    const k = vr.map((s) => R.div(R.sub(R.one, s), s));
    const [c1, c2, c3] = [R.from(20), R.from(10), R.from(25)];
    const a12 = R.sub(c2, c1),
      a23 = R.sub(c3, c2),
      a13 = R.sub(c3, c1);
    const Hm = R.div(
      R.mul(R.mul(a12, a23), a13),
      R.add(R.sub(R.mul(k[0]!, a23), R.mul(k[1]!, a13)), R.mul(k[2]!, a12)),
    );
    expect(r.mirror!.eq(Hm)).toBe(true);
    const [qa, qb, qc] = r.quadratic;
    expect(R.isZero(R.add(R.add(R.mul(qa, R.mul(Hm, Hm)), R.mul(qb, Hm)), qc))).toBe(true);
  });
  it('refuses wrong counts and zero spacings', () => {
    expect(
      codeOf(() =>
        heightFromInlineQuadrances(R, { spacings: [100, 100], vertical: ['1/2', '1/3'] }),
      ),
    ).toBe('TOO_FEW_STATIONS');
    expect(
      codeOf(() =>
        heightFromInlineQuadrances(R, {
          spacings: [100, 100],
          vertical: ['1/2', '1/3', '1/4', '1/5'],
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        heightFromInlineQuadrances(R, { spacings: [0, 100], vertical: ['1/2', '1/3', '1/4'] }),
      ),
    ).toBe('REPEATED_CHAINAGE');
    expect(
      codeOf(() =>
        heightFromInlineQuadrances(R, { spacings: [-1, 100], vertical: ['1/2', '1/3', '1/4'] }),
      ),
    ).toBe('NEGATIVE_QUADRANCE');
  });
});
