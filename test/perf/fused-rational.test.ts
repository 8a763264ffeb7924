// The fused rational kernel (src/arithmetic/fused-rational.ts) gives exactly the fractions the
// generic step-by-step formulas give, in lowest terms, and leaves degenerate input to them.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Rational } from '../../src/index.js';
import { point, triangle } from '../../src/geometry/index.js';

/** The same arithmetic with no fused kernels: triangle() then takes its generic path. */
const plain: Arithmetic<Rational, true> = { ...rational, kernels: undefined };
const KEYS = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea'] as const;

/** Same value and the same (s, n, d) triple: lowest terms, as fraction.js keeps them. */
function same(a: Rational, b: Rational): boolean {
  return a.s === b.s && a.n === b.n && a.d === b.d;
}

function code(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
  }
  return undefined;
}

// Coordinates of several kinds: millimetres up to 100 km, arbitrary fractions, big integers.
const mm = fc.integer({ min: -100_000_000, max: 100_000_000 }).map((m) => `${m / 1000}`);
const ratio = fc
  .tuple(
    fc.bigInt({ min: -(10n ** 20n), max: 10n ** 20n }),
    fc.bigInt({ min: 1n, max: 10n ** 12n }),
  )
  .map(([n, d]) => `${n}/${d}`);
const digits16 = fc
  .tuple(fc.bigInt({ min: 10n ** 15n, max: 10n ** 16n - 1n }), fc.integer({ min: -16, max: 4 }))
  .map(([m, e]) => `${m}e${e}`);
const coord = fc.oneof(mm, ratio, digits16, fc.integer({ min: -5, max: 5 }).map(String));
const pt = coord.chain((x) => coord.map((y) => point(rational, x, y)));

describe('the fused rational triangle kernel', () => {
  it('triangle(rational, …) equals the generic formulas exactly, in lowest terms, for random points', () => {
    fc.assert(
      fc.property(pt, pt, pt, (P, Q, R) => {
        let fast, slow;
        const e1 = code(() => (fast = triangle(rational, P, Q, R)));
        const e2 = code(() => (slow = triangle(plain, P, Q, R)));
        expect(e1).toBe(e2);
        if (e1 !== undefined) return;
        for (const k of KEYS) expect(same(fast![k], slow![k]), k).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it('its results are fraction.js fractions that behave like any other', () => {
    const t = triangle(
      rational,
      point(rational, 0, 0),
      point(rational, '0.004', 0),
      point(rational, 0, '0.003'),
    );
    // 3-4-5 in millimetres (derived): Q1 = 25e-6, right angle at A1 so s1 = 1, s2 = 9/25.
    expect(t.Q1 instanceof Fraction).toBe(true);
    expect(rational.toString(t.Q1)).toBe('1/40000');
    expect(rational.toString(t.s1)).toBe('1');
    expect(rational.toString(t.s2)).toBe('9/25');
    expect(t.s2.add(t.s3).equals(1)).toBe(true);
    expect(rational.eq(t.s2, rational.from('0.36'))).toBe(true);
  });

  it('leaves coincident and collinear points to the generic path, which reports them', () => {
    const k = rational.kernels!.triangle!;
    const [a, b, c] = [rational.from(1), rational.from(2), rational.from(3)];
    expect(k(a, a, a, a, b, c)).toBeUndefined();
    expect(k(a, a, b, b, c, c)).toBeUndefined();
    expect(
      code(() =>
        triangle(rational, point(rational, 1, 1), point(rational, 1, 1), point(rational, 2, 3)),
      ),
    ).toBe('COINCIDENT_POINTS');
    expect(
      code(() =>
        triangle(rational, point(rational, 1, 1), point(rational, 2, 2), point(rational, 3, 3)),
      ),
    ).toBe('COLLINEAR_POINTS');
  });
});
