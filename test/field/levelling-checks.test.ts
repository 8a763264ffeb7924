// twoPegTest and reciprocalLevelling: staff readings generated from true levels, an inclined
// line of sight (reading = true + ε·d) and, across a gap, curvature and refraction
// (1 − k)·d²/(2R) (Ghilani & Wolf, Elementary Surveying, ch. 4 — from memory), then recovered.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { code, kinds } from '../geometry/helpers.js';
import { rational, twoPegTest, reciprocalLevelling } from '../../src/index.js';

const R = rational;

describe('twoPegTest recovers a known inclination of the line of sight', () => {
  it('exactly in rational, from any two set-ups with different sight-length differences', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -500, max: 500 }), // ε in 1e-6 m/m
        fc.integer({ min: -3000, max: 3000 }), // true height of B above A, mm
        fc.tuple(fc.integer({ min: 1, max: 80 }), fc.integer({ min: 1, max: 80 })),
        fc.tuple(fc.integer({ min: 1, max: 80 }), fc.integer({ min: 1, max: 80 })),
        (eps, dh, [a1, b1], [a2, b2]) => {
          fc.pre(a1 - b1 !== a2 - b2);
          const e = R.from(`${eps}/1000000`);
          const H = R.from(`${dh}/1000`);
          // line of sight at 1.5 m above A: reading on A = 1.5 + ε·d_A, on B = 1.5 − H + ε·d_B
          const reading = (base: number, d: number, onB: boolean) =>
            R.add(R.sub(R.from(base), onB ? H : R.zero), R.mul(e, R.from(d)));
          const t = twoPegTest(R, {
            first: {
              readingA: reading(1.5, a1, false),
              readingB: reading(1.5, b1, true),
              distanceA: a1,
              distanceB: b1,
            },
            second: {
              readingA: reading(1.2, a2, false),
              readingB: reading(1.2, b2, true),
              distanceA: a2,
              distanceB: b2,
            },
          });
          expect(R.eq(t.inclination, e)).toBe(true);
          expect(R.eq(t.heightDifference, H)).toBe(true);
          expect(R.eq(t.corrected.readingB, R.sub(R.from('1.2'), H))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe.each(kinds)('twoPegTest(%s, …)', (_n, A) => {
  it('midway first set-up: 0.0002 m/m is 41.25″ (206264.8″ per radian) and fails a 0.0001 tolerance', () => {
    const t = twoPegTest(A, {
      first: { readingA: '1.432', readingB: '1.117' },
      second: { readingA: '1.512', readingB: '1.207', distanceA: 3, distanceB: 53 },
      tolerance: '0.0001',
    });
    expect(A.toNumber(t.inclination)).toBeCloseTo(0.0002, 12);
    expect(A.toNumber(t.inclinationArcSeconds)).toBeCloseTo((0.0002 * 180 * 3600) / Math.PI, 9);
    expect(t.ok).toBe(false);
  });

  it('refuses set-ups with equal sight-length differences, a missing distance and a missing reading', () => {
    expect(
      code(() =>
        twoPegTest(A, {
          first: { readingA: 1, readingB: 1 },
          second: { readingA: 1, readingB: 1, distanceA: 20, distanceB: 20 },
        }),
      ),
    ).toBe('INCONSISTENT_READINGS');
    expect(
      code(() =>
        twoPegTest(A, {
          first: { readingA: 1, readingB: 1 },
          second: { readingA: 1, readingB: 1 },
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        twoPegTest(A, {
          first: { readingA: 1 } as never,
          second: { readingA: 1, readingB: 1, distanceA: 1, distanceB: 9 },
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});

describe('reciprocalLevelling', () => {
  it('cancels collimation, curvature and refraction across a 400 m gap (Math.* model, float)', () => {
    const H = -0.8734; // B above A
    const eps = 3e-5;
    const k = 0.13;
    const Re = 6371000;
    const err = (d: number) => eps * d - ((1 - k) * d * d) / (2 * Re); // reading error of a sight of length d
    const short = 15;
    const long = 400;
    const hi = 1.4;
    const set = {
      nearA: { readingA: hi + err(short), readingB: hi - H + err(long) },
      nearB: { readingA: hi + H + err(long), readingB: hi + err(short) },
    };
    const r = reciprocalLevelling(kinds[2]![1], { sets: [set], tolerance: '0.001' });
    expect(Math.abs((r.heightDifference as number) - H)).toBeLessThan(1e-12);
    expect(Math.abs((r.sets[0]!.error as number) - (err(short) - err(long)))).toBeLessThan(1e-12);
    expect(r.ok).toBe(false);
  });

  it.each(kinds)('averages several sets in %s', (_n, A) => {
    const r = reciprocalLevelling(A, {
      sets: [
        {
          nearA: { readingA: '1.270', readingB: '2.106' },
          nearB: { readingA: '0.742', readingB: '1.560' },
        },
        {
          nearA: { readingA: '1.300', readingB: '2.134' },
          nearB: { readingA: '0.750', readingB: '1.570' },
        },
      ],
    });
    // (−0.836 − 0.818)/2 = −0.827 and (−0.834 − 0.820)/2 = −0.827
    expect(A.toNumber(r.heightDifference)).toBeCloseTo(-0.827, 12);
  });

  it('refuses no set and a missing reading', () => {
    expect(code(() => reciprocalLevelling(R, { sets: [] }))).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        reciprocalLevelling(R, {
          sets: [{ nearA: { readingA: 1 } as never, nearB: { readingA: 1, readingB: 2 } }],
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});
