// solveQuadratic: exact surd roots in rational, cancellation-free roots in float.
import { describe, expect, it } from 'vitest';
import { code } from './helpers.js';
import fc from 'fast-check';
import { rational, float, decimal } from '../../src/index.js';
import { solveQuadratic } from '../../src/geometry/index.js';

const A = rational;
const q = fc
  .tuple(fc.integer({ min: -1e4, max: 1e4 }), fc.integer({ min: 1, max: 100 }))
  .map(([n, m]) => A.from(`${n}/${m}`));

describe('solveQuadratic(rational, a, b, c)', () => {
  it('returns the two rational roots of k(x − r1)(x − r2), ascending and exact', () => {
    fc.assert(
      fc.property(q, q, q, (r1, r2, k) => {
        fc.pre(!k.equals(0) && !r1.equals(r2));
        const roots = solveQuadratic(A, k, k.mul(r1.add(r2)).neg(), k.mul(r1).mul(r2));
        const [lo, hi] = r1.compare(r2) < 0 ? [r1, r2] : [r2, r1];
        expect(roots.length).toBe(2);
        expect(roots[0]!.eq(lo) && roots[1]!.eq(hi)).toBe(true);
      }),
    );
  });
  it('returns surd roots that satisfy a·x² + b·x + c = 0 exactly', () => {
    fc.assert(
      fc.property(q, q, q, (a, b, c) => {
        fc.pre(!a.equals(0));
        for (const x of solveQuadratic(A, a, b, c))
          expect(x.mul(x).mul(a).add(x.mul(b)).add(c).isZero()).toBe(true);
      }),
    );
  });
  it('x² − 82x + 881 = 0 has the roots 41 ∓ 20√2; x² − 2x + 1 one double root; x² + 1 none', () => {
    expect(solveQuadratic(A, 1, -82, 881).map(String)).toEqual(['41 - 20√2', '41 + 20√2']);
    expect(solveQuadratic(A, 1, -2, 1).map(String)).toEqual(['1']);
    expect(solveQuadratic(A, 1, 0, 1)).toEqual([]);
    expect(solveQuadratic(A, -1, 0, 2).map(String)).toEqual(['-√2', '√2']);
  });
  it('a = 0 gives the one root of the linear equation; a = b = 0 throws INVALID_ARGUMENT', () => {
    expect(solveQuadratic(A, 0, 4, -2).map(String)).toEqual(['1/2']);
    expect(code(() => solveQuadratic(A, 0, 0, 1))).toBe('INVALID_ARGUMENT');
  });
});

describe('solveQuadratic(float, a, b, c) avoids cancellation', () => {
  it('x² − 1e8·x + 1 = 0: the small root is 1e-8 to full precision (Vieta: r1·r2 = 1)', () => {
    const [lo, hi] = solveQuadratic(float, 1, -1e8, 1);
    expect(Math.abs(lo! - 1e-8) / 1e-8).toBeLessThan(1e-15);
    expect(Math.abs(hi! - 1e8) / 1e8).toBeLessThan(1e-15);
  });
  // Bound: a root's condition number is about |b|/√disc, so for roots separated by at least 1e-3 of
  // their size the float roots (inputs rounded once, ~10 operations) stay within 1e-9 relative.
  it('agrees with the exact roots to 1e-9 relative when the roots are well separated', () => {
    fc.assert(
      fc.property(q, q, q, (a, b, c) => {
        fc.pre(!a.equals(0));
        const exact = solveQuadratic(A, a, b, c);
        const fl = solveQuadratic(float, a.valueOf(), b.valueOf(), c.valueOf());
        fc.pre(exact.length === 2);
        const [e0, e1] = [exact[0]!.toNumber(), exact[1]!.toNumber()];
        fc.pre(e1 - e0 > 1e-3 * Math.max(Math.abs(e0), Math.abs(e1)));
        expect(fl.length).toBe(2);
        fl.forEach((x, i) => {
          const want = [e0, e1][i]!;
          expect(Math.abs(x - want)).toBeLessThanOrEqual(
            1e-9 * Math.max(Math.abs(e0), Math.abs(e1)),
          );
        });
      }),
    );
  });
  it('decimal(30) gives x² − 2 = 0 the roots ±√2 to 30 digits', () => {
    const D = decimal(30);
    expect(solveQuadratic(D, 1, 0, -2).map((x) => D.toString(x))).toEqual([
      '-1.41421356237309504880168872421',
      '1.41421356237309504880168872421',
    ]);
  });
});
