// Trigonometric heighting: slope and horizontal distances, curvature and refraction, reciprocal sights.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import {
  rational,
  decimal,
  float,
  QuadspreadError,
  uncertain,
  measured,
  budget,
} from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import {
  trigHeight,
  reciprocalTrigHeight,
  curvatureRefraction,
} from '../../src/elevation/trig-heighting.js';
import { verticalFromAngle, verticalFromRatio } from '../../src/readings/vertical.js';

const R = rational;
const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};

describe('trigHeight in rational: exact surds from exact sights', () => {
  it('a 5-12-13 sight: slope 130 upward gives V = 50; horizontal 120 the same', () => {
    const v = verticalFromRatio(R, 5, 12);
    expect(
      trigHeight(R, {
        distance: 130,
        measured: 'slope',
        vertical: v,
        correction: false,
      }).vertical.toString(),
    ).toBe('50');
    expect(
      trigHeight(R, {
        distance: 120,
        measured: 'horizontal',
        vertical: v,
        correction: false,
      }).vertical.toString(),
    ).toBe('50');
  });
  it('a sight below the horizon gives a negative difference', () => {
    const v = verticalFromRatio(R, -5, 12);
    const r = trigHeight(R, {
      distance: 130,
      measured: 'slope',
      vertical: v,
      instrumentHeight: '1.55',
      targetHeight: '1.3',
      correction: false,
    });
    expect(r.difference.toString()).toBe('-199/4');
  });
  it('an irrational sine stays an exact surd: spread 1/2 at slope 10 is 5√2', () => {
    expect(
      trigHeight(R, {
        distance: 10,
        measured: 'slope',
        vertical: '1/2',
        correction: false,
      }).vertical.toString(),
    ).toBe('5√2');
  });
  it('random rational rise/run sights: V² = rise²·(distance²/(rise² + run²)) exactly', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -500, max: 500 }),
        fc.integer({ min: 1, max: 500 }),
        fc.integer({ min: 1, max: 10000 }),
        (rise, run, S) => {
          const v = verticalFromRatio(R, rise, run);
          const V = trigHeight(R, {
            distance: S,
            measured: 'slope',
            vertical: v,
            correction: false,
          }).vertical;
          const want = R.div(R.from(rise * rise * S * S), R.from(rise * rise + run * run));
          expect(V.mul(V).eq(want)).toBe(true);
          expect(V.sign()).toBe(Math.sign(rise));
        },
      ),
    );
  });
});

describe('trigHeight in float and decimal against classical trigonometry (Math.sin, Math.tan, Math.cos)', () => {
  it('Δh = hi + S·sin α − hr + (1 − k)(S cos α)²/(2R) and Δh = hi + D·tan α − hr + (1 − k)D²/(2R)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        (S, a) => {
          const rad = (a * Math.PI) / 180;
          const k = 0.13,
            Re = 6371000,
            hi = 1.52,
            hr = 1.8;
          const slopeWant =
            hi + S * Math.sin(rad) - hr + ((1 - k) * (S * Math.cos(rad)) ** 2) / (2 * Re);
          const horizWant = hi + S * Math.tan(rad) - hr + ((1 - k) * S * S) / (2 * Re);
          for (const A of [float, decimal(30)] as Arithmetic<unknown>[]) {
            const v = verticalFromAngle(A, a);
            const s = A.toNumber(
              trigHeight(A, {
                distance: S,
                measured: 'slope',
                vertical: v,
                instrumentHeight: hi,
                targetHeight: hr,
              }).difference as never,
            );
            const h = A.toNumber(
              trigHeight(A, {
                distance: S,
                measured: 'horizontal',
                vertical: v,
                instrumentHeight: hi,
                targetHeight: hr,
              }).difference as never,
            );
            expect(Math.abs(s - slopeWant)).toBeLessThan(1e-9 * Math.max(1, S));
            expect(Math.abs(h - horizWant)).toBeLessThan(1e-9 * Math.max(1, S));
          }
        },
      ),
      { numRuns: 50 },
    );
  });
});

describe('curvature and refraction', () => {
  it('is (1 − k)·D²/(2R) exactly in rational, with R converted to the distance unit', () => {
    // by hand: 0.87 · 1000² / (2 · 6 371 000) = 870 000/12 742 000 = 435/6371
    expect(R.toString(curvatureRefraction(R, 1000))).toBe('435/6371');
    // in feet the default radius is 6371000/0.3048 ft: 1000² · 0.3048/12 742 000 = 304 800/12 742 000 = 762/31855 (by hand)
    expect(R.toString(curvatureRefraction(R, 1000, { unit: 'ft', k: 0 }))).toBe('762/31855');
  });
  it('reciprocal sights cancel it exactly: the mean equals the uncorrected mean', () => {
    const fwd = {
      distance: 2400,
      measured: 'horizontal' as const,
      vertical: verticalFromRatio(R, 3, 400),
      instrumentHeight: '1.5',
      targetHeight: '2',
    };
    const bwd = {
      distance: 2400,
      measured: 'horizontal' as const,
      vertical: verticalFromRatio(R, -3, 400),
      instrumentHeight: '1.4',
      targetHeight: '1.6',
    };
    const corrected = reciprocalTrigHeight(R, { forward: fwd, backward: bwd });
    const plain = reciprocalTrigHeight(R, {
      forward: { ...fwd, correction: false },
      backward: { ...bwd, correction: false },
    });
    expect(R.eq(corrected.mean, plain.mean)).toBe(true);
    expect(R.toString(corrected.mean)).toBe('357/20'); // ((18 + 1.5 − 2) − (−18 + 1.4 − 1.6))/2 = (17.5 + 18.2)/2, by hand
    expect(R.toNumber(corrected.misclosure)).toBeCloseTo(
      2 * R.toNumber(curvatureRefraction(R, 2400)) - 0.7,
      12,
    );
  });
  it('reciprocal sights with different radicands give a rational mean within 1e-35 of mathjs BigNumber (50 digits)', () => {
    const r = reciprocalTrigHeight(R, {
      forward: { distance: 500, measured: 'slope', vertical: '1/3', correction: false },
      backward: {
        distance: 500,
        measured: 'slope',
        vertical: { spread: R.from('1/5'), sign: -1 },
        correction: false,
      },
    });
    const M = create(all!, { number: 'BigNumber', precision: 50 });
    // (500·√(1/3) + 500·√(1/5))/2, independent
    const want = M.bignumber(M.evaluate('(500 * sqrt(1/3) + 500 * sqrt(1/5)) / 2').toString());
    expect(Number(want)).toBeCloseTo((500 / Math.sqrt(3) + 500 / Math.sqrt(5)) / 2, 9);
    const got = M.bignumber(R.toPrecision(r.mean, 45));
    expect(Number(M.abs(M.divide(M.subtract(got, want as never), want as never)))).toBeLessThan(
      1e-35,
    );
  });
  it('refuses bad options and bad sights', () => {
    expect(codeOf(() => curvatureRefraction(R, 100, { k: 1 }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => curvatureRefraction(R, 100, { earthRadius: 0 }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => curvatureRefraction(R, -100))).toBe('NEGATIVE_QUADRANCE');
    expect(codeOf(() => curvatureRefraction(R, 100, { unit: 'furlong' as never }))).toBe(
      'INVALID_UNIT',
    );
    expect(
      codeOf(() => trigHeight(R, { distance: 100, measured: 'horizontal', vertical: 1 })),
    ).toBe('VERTICAL_SIGHT');
    expect(
      codeOf(() => trigHeight(R, { distance: 100, measured: 'sloped' as never, vertical: '1/2' })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() => trigHeight(R, { distance: -100, measured: 'slope', vertical: '1/2' })),
    ).toBe('NEGATIVE_QUADRANCE');
    expect(codeOf(() => trigHeight(R, { distance: 100, measured: 'slope', vertical: '3/2' }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
  });
});

describe('reciprocalTrigHeight over uncertain(rational)', () => {
  it('keeps the sensitivities of the mean when the two sights need different square roots', () => {
    // slope distances 1000 m ± 5 mm each way; vertical spreads 1/101 (up) and 1/99 (down):
    // the mean (Δh_AB − Δh_BA)/2 = (1000/√101 + 1000/√99)/2 depends on both distances
    const sights = (U: any) => ({
      forward: {
        distance: measured(U, 1000, '0.005', 'dAB'),
        measured: 'slope' as const,
        vertical: '1/101',
        correction: false,
      },
      backward: {
        distance: measured(U, 1000, '0.005', 'dBA'),
        measured: 'slope' as const,
        vertical: { spread: '1/99', sign: -1 as const },
        correction: false,
      },
    });
    const Ur = uncertain(rational);
    const Uf = uncertain(float);
    const br = budget(Ur, reciprocalTrigHeight(Ur, sights(Ur) as never).mean);
    const bf = budget(Uf, reciprocalTrigHeight(Uf, sights(Uf) as never).mean);
    // by hand: ∂mean/∂dAB = sin α_AB / 2 = (1/√101)/2, ∂mean/∂dBA = (1/√99)/2
    const byHand = Math.sqrt(
      (0.005 / (2 * Math.sqrt(101))) ** 2 + (0.005 / (2 * Math.sqrt(99))) ** 2,
    );
    expect(br.contributions.map((c) => c.name).sort()).toEqual(['dAB', 'dBA']);
    expect(Math.abs(br.sigma.toNumber() - byHand)).toBeLessThan(1e-15);
    expect(Math.abs((bf.sigma as number) - byHand)).toBeLessThan(1e-15);
  });
});
