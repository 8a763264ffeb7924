// The laws of rational trigonometry: residuals exactly zero in rational for random
// rational triangles; within a stated bound in float; typed errors for bad values.
import { describe, expect, it } from 'vitest';
import { code } from './helpers.js';
import fc from 'fast-check';
import { rational, float } from '../../src/index.js';
import type { Rational } from '../../src/index.js';
import {
  point,
  quadrance,
  triangle,
  pythagorasResidual,
  quadrea,
  tripleQuadResidual,
  archimedesResidual,
  spreadLawResidual,
  crossLawResidual,
  tripleSpreadResidual,
} from '../../src/geometry/index.js';
import type { Point } from '../../src/geometry/index.js';

const A = rational;
const coord = fc
  .tuple(fc.integer({ min: -1e6, max: 1e6 }), fc.integer({ min: 1, max: 1000 }))
  .map(([n, m]) => `${n}/${m}`);
const pt = fc.tuple(coord, coord).map(([x, y]) => point(A, x, y));
/** Twice the signed area by the shoelace formula, written out here independently of the library. */
function det(P: Point<Rational>, Q: Point<Rational>, R: Point<Rational>): Rational {
  return Q.x
    .sub(P.x)
    .mul(R.y.sub(P.y))
    .sub(Q.y.sub(P.y).mul(R.x.sub(P.x)));
}
const tri = fc.tuple(pt, pt, pt).filter(([P, Q, R]) => !det(P, Q, R).equals(0));
const zero = (x: Rational) => expect(A.toString(x)).toBe('0');

describe('for random rational triangles every law holds exactly in rational', () => {
  it('the cross law holds at each vertex: (Q2 + Q3 − Q1)² = 4·Q2·Q3·(1 − s1), and so on', () => {
    fc.assert(
      fc.property(tri, ([P, Q, R]) => {
        const t = triangle(A, P, Q, R);
        zero(crossLawResidual(A, t.Q2, t.Q3, t.Q1, t.s1));
        zero(crossLawResidual(A, t.Q1, t.Q3, t.Q2, t.s2));
        zero(crossLawResidual(A, t.Q1, t.Q2, t.Q3, t.s3));
      }),
    );
  });
  it('the spread law holds: s1/Q1 = s2/Q2 = s3/Q3', () => {
    fc.assert(
      fc.property(tri, ([P, Q, R]) => {
        const t = triangle(A, P, Q, R);
        zero(spreadLawResidual(A, t.Q1, t.s1, t.Q2, t.s2));
        zero(spreadLawResidual(A, t.Q2, t.s2, t.Q3, t.s3));
      }),
    );
  });
  it('the triple spread formula holds for s1, s2, s3', () => {
    fc.assert(
      fc.property(tri, ([P, Q, R]) => {
        const t = triangle(A, P, Q, R);
        zero(tripleSpreadResidual(A, t.s1, t.s2, t.s3));
      }),
    );
  });
  it("Archimedes' formula: quadrea(Q1, Q2, Q3) = 16·area² with the area from the shoelace formula", () => {
    fc.assert(
      fc.property(tri, ([P, Q, R]) => {
        const t = triangle(A, P, Q, R);
        const area = det(P, Q, R).div(2);
        zero(archimedesResidual(A, t.Q1, t.Q2, t.Q3, area));
        expect(A.eq(quadrea(A, t.Q1, t.Q2, t.Q3), t.quadrea)).toBe(true);
        expect(A.eq(t.quadrea, area.mul(area).mul(16))).toBe(true);
      }),
    );
  });
  it('the triple quad formula is zero for collinear points and positive otherwise', () => {
    fc.assert(
      fc.property(pt, pt, coord, pt, (P, Q, k, R) => {
        const S = point(
          A,
          P.x.add(Q.x.sub(P.x).mul(A.from(k))),
          P.y.add(Q.y.sub(P.y).mul(A.from(k))),
        );
        zero(tripleQuadResidual(A, quadrance(A, Q, S), quadrance(A, P, S), quadrance(A, P, Q)));
        const r = tripleQuadResidual(A, quadrance(A, Q, R), quadrance(A, P, R), quadrance(A, P, Q));
        expect(A.sign(r)).toBe(det(P, Q, R).equals(0) ? 0 : 1);
      }),
    );
  });
  it("Pythagoras' theorem holds for a right angle built by turning a vector a quarter turn", () => {
    fc.assert(
      fc.property(pt, pt, coord, (V, P, k) => {
        const u = { x: P.x.sub(V.x), y: P.y.sub(V.y) };
        const Q = point(A, V.x.sub(u.y.mul(A.from(k))), V.y.add(u.x.mul(A.from(k))));
        zero(pythagorasResidual(A, quadrance(A, V, P), quadrance(A, V, Q), quadrance(A, P, Q)));
      }),
    );
  });
  it('a residual is not zero when the data are wrong: cross law with s3 off by 1/1000', () => {
    // 3-4-5: Q1 = 16, Q2 = 9, Q3 = 25, s3 = 1 (derived); a wrong spread must leave a residual.
    expect(A.isZero(crossLawResidual(A, 16, 9, 25, 1))).toBe(true);
    expect(A.isZero(crossLawResidual(A, 16, 9, 25, '999/1000'))).toBe(false);
    expect(A.isZero(pythagorasResidual(A, 16, 9, 26))).toBe(false);
  });
});

describe('in float the residuals stay within 1e-12 of the natural scale of each law', () => {
  // Bound: each residual is a sum of products of quadrances (or of spreads ≤ 1) of total degree 2;
  // rounding in IEEE doubles leaves at most a few dozen ulps of the largest term,
  // (Q1 + Q2 + Q3)² for quadrance laws, 1 for spread laws; 1e-12 leaves a wide margin.
  const c = fc.double({ min: -1000, max: 1000, noNaN: true });
  const fpt = fc.tuple(c, c).map(([x, y]) => ({ x, y }));
  it('cross law, spread law, triple spread and Archimedes for random float triangles', () => {
    fc.assert(
      fc.property(fpt, fpt, fpt, (P, Q, R) => {
        const D = (Q.x - P.x) * (R.y - P.y) - (Q.y - P.y) * (R.x - P.x);
        const Qmax = Math.max(
          quadrance(float, P, Q),
          quadrance(float, Q, R),
          quadrance(float, P, R),
        );
        fc.pre(Math.abs(D) > 1e-3 * Qmax && Qmax > 1e-6);
        const t = triangle(float, P, Q, R);
        const scale = (t.Q1 + t.Q2 + t.Q3) ** 2;
        expect(Math.abs(crossLawResidual(float, t.Q1, t.Q2, t.Q3, t.s3))).toBeLessThanOrEqual(
          1e-12 * scale,
        );
        expect(Math.abs(spreadLawResidual(float, t.Q1, t.s1, t.Q2, t.s2))).toBeLessThanOrEqual(
          1e-12 * (t.Q1 + t.Q2),
        );
        expect(Math.abs(tripleSpreadResidual(float, t.s1, t.s2, t.s3))).toBeLessThanOrEqual(1e-12);
        expect(Math.abs(archimedesResidual(float, t.Q1, t.Q2, t.Q3, D / 2))).toBeLessThanOrEqual(
          1e-12 * scale,
        );
      }),
      { numRuns: 1000 },
    );
  });
});

describe('the laws refuse values outside their domain with typed errors', () => {
  it('a negative quadrance throws NEGATIVE_QUADRANCE', () => {
    expect(code(() => pythagorasResidual(A, -1, 4, 5))).toBe('NEGATIVE_QUADRANCE');
    expect(code(() => quadrea(A, 1, '-1/2', 5))).toBe('NEGATIVE_QUADRANCE');
    expect(code(() => crossLawResidual(float, 1, 1, -1e-9, 0.5))).toBe('NEGATIVE_QUADRANCE');
  });
  it('a spread outside [0, 1] throws SPREAD_OUT_OF_RANGE', () => {
    expect(code(() => tripleSpreadResidual(A, '1.0001', 0, 0))).toBe('SPREAD_OUT_OF_RANGE');
    expect(code(() => crossLawResidual(A, 1, 1, 1, -0.5))).toBe('SPREAD_OUT_OF_RANGE');
    expect(code(() => spreadLawResidual(A, 1, 2, 1, 0))).toBe('SPREAD_OUT_OF_RANGE');
  });
  it('text that is not a number throws INVALID_NUMBER', () => {
    expect(code(() => tripleQuadResidual(A, 'x', 1, 1))).toBe('INVALID_NUMBER');
    expect(code(() => archimedesResidual(float, 1, 1, 1, NaN))).toBe('INVALID_NUMBER');
  });
});
