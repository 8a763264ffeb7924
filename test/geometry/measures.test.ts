// Points, quadrance, spread, cross and lines.
import { describe, expect, it } from 'vitest';
import { code } from './helpers.js';
import fc from 'fast-check';
import { rational, decimal, float, solveTriangle } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import {
  point,
  quadrance,
  vectorQuadrance,
  spread,
  cross,
  spreadOfVectors,
  triangle,
  solveQuadratic,
  surd,
  sqrtOf,
  line,
  lineThrough,
  isOnLine,
  isParallel,
  isPerpendicular,
  footOfPerpendicular,
  quadranceToLine,
  spreadOfLines,
} from '../../src/geometry/index.js';

const coord = fc
  .tuple(fc.integer({ min: -1e6, max: 1e6 }), fc.integer({ min: 0, max: 3 }))
  .map(([n, k]) => `${n}e-${k}`);
const pt = fc.tuple(coord, coord);
const arithmetics: Array<[string, Arithmetic<any>]> = [
  ['rational', rational],
  ['decimal(30)', decimal(30)],
  ['float', float],
];

describe.each(arithmetics)('measures of simple figures in %s', (_n, A) => {
  const P = (x: number | string, y: number | string) => point(A, x, y);
  const O = P(0, 0);
  const text = (v: unknown) => A.toNumber(v);
  it('quadrance(A, O, (3, 4)) is 25 and vectorQuadrance(A, (1, 2)) is 5', () => {
    expect(text(quadrance(A, O, P(3, 4)))).toBe(25);
    expect(text(vectorQuadrance(A, P(1, 2)))).toBe(5);
  });
  it('spread(A, V, P, Q) is 1 when VP ⟂ VQ and 0 when they are one line', () => {
    expect(text(spread(A, P(1, 1), P(5, 1), P(1, -2)))).toBe(1);
    expect(text(spread(A, O, P(2, 3), P(-4, -6)))).toBe(0);
  });
  it('spread and cross of the 3-4-5 angle are 9/25 and 16/25 (sin² and cos² of atan(3/4))', () => {
    expect(text(spread(A, O, P(4, 0), P(4, 3)))).toBeCloseTo(0.36, 14);
    expect(text(cross(A, O, P(4, 0), P(4, 3)))).toBeCloseTo(0.64, 14);
  });
  it('the spread of lines y = 0 and 3x − 4y + 1 = 0 is 9/25', () => {
    expect(text(spreadOfLines(A, line(A, 0, 1, 0), line(A, 3, -4, 1)))).toBeCloseTo(0.36, 14);
  });
  it('the foot of the perpendicular from (3, 4) to x + y = 1 is (0, 1), at quadrance 18 (by hand: (3, 4) − 3·(1, 1))', () => {
    const F = footOfPerpendicular(A, P(3, 4), line(A, 1, 1, -1));
    expect([text(F.x), text(F.y)]).toEqual([0, 1]);
    expect(text(quadranceToLine(A, P(3, 4), line(A, 1, 1, -1)))).toBe(18);
  });
});

describe('spread and cross in rational are exact rational functions', () => {
  const A = rational;
  it('spread + cross = 1 exactly for random points', () => {
    fc.assert(
      fc.property(pt, pt, pt, (v, p, q) => {
        const V = point(A, ...v),
          P = point(A, ...p),
          Q = point(A, ...q);
        fc.pre(!A.isZero(quadrance(A, V, P)) && !A.isZero(quadrance(A, V, Q)));
        expect(A.eq(A.add(spread(A, V, P, Q), cross(A, V, P, Q)), A.one)).toBe(true);
      }),
    );
  });
  it('spread(A, V, P, Q) = spreadOfVectors(P − V, Q − V) = spreadOfLines(VP, VQ), exactly', () => {
    fc.assert(
      fc.property(pt, pt, pt, (v, p, q) => {
        const V = point(A, ...v),
          P = point(A, ...p),
          Q = point(A, ...q);
        fc.pre(!A.isZero(quadrance(A, V, P)) && !A.isZero(quadrance(A, V, Q)));
        const s = spread(A, V, P, Q);
        const u = { x: A.sub(P.x, V.x), y: A.sub(P.y, V.y) };
        const w = { x: A.sub(Q.x, V.x), y: A.sub(Q.y, V.y) };
        expect(A.eq(s, spreadOfVectors(A, u, w))).toBe(true);
        expect(A.eq(s, spreadOfLines(A, lineThrough(A, V, P), lineThrough(A, V, Q)))).toBe(true);
      }),
    );
  });
  it('the foot of a perpendicular lies on the line and PF is perpendicular to it, exactly', () => {
    fc.assert(
      fc.property(pt, pt, pt, (a, b, p) => {
        const P1 = point(A, ...a),
          P2 = point(A, ...b),
          P = point(A, ...p);
        fc.pre(!A.isZero(quadrance(A, P1, P2)));
        const l = lineThrough(A, P1, P2);
        const F = footOfPerpendicular(A, P, l);
        expect(isOnLine(A, F, l)).toBe(true);
        expect(isOnLine(A, P1, l) && isOnLine(A, P2, l)).toBe(true);
        if (!A.isZero(quadrance(A, P, F)))
          expect(isPerpendicular(A, lineThrough(A, P, F), l)).toBe(true);
        expect(A.eq(quadrance(A, P, F), quadranceToLine(A, P, l))).toBe(true);
      }),
    );
  });
  it('isParallel and isPerpendicular recognise shifted and turned lines', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -99, max: 99 }),
        fc.integer({ min: -99, max: 99 }),
        fc.integer({ min: -99, max: 99 }),
        fc.integer({ min: 1, max: 9 }),
        (a, b, c, k) => {
          fc.pre(a !== 0 || b !== 0);
          const l = line(A, a, b, c);
          expect(isParallel(A, l, line(A, k * a, k * b, c + 1))).toBe(true);
          expect(isPerpendicular(A, l, line(A, -b, a, c))).toBe(true);
          expect(isPerpendicular(A, l, line(A, a, b, 0))).toBe(false);
        },
      ),
    );
  });
});

describe('quadrance and spread are invariant under rational rotations and translations', () => {
  const A = rational;
  // A rotation with rational entries from a Pythagorean triple (m² − n², 2mn, m² + n²).
  const rot = fc
    .tuple(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 40 }))
    .map(([m, n]) => {
      const h = A.from(m * m + n * n);
      return { c: A.from(m * m - n * n).div(h), s: A.from(2 * m * n).div(h) };
    });
  it('Q and s of random points equal those of the rotated and shifted points, exactly', () => {
    fc.assert(
      fc.property(pt, pt, pt, rot, pt, (v, p, q, r, shift) => {
        const V = point(A, ...v),
          P = point(A, ...p),
          Q = point(A, ...q),
          T = point(A, ...shift);
        fc.pre(!A.isZero(quadrance(A, V, P)) && !A.isZero(quadrance(A, V, Q)));
        const move = (X: typeof V) => ({
          x: X.x.mul(r.c).sub(X.y.mul(r.s)).add(T.x),
          y: X.x.mul(r.s).add(X.y.mul(r.c)).add(T.y),
        });
        expect(A.eq(quadrance(A, P, Q), quadrance(A, move(P), move(Q)))).toBe(true);
        expect(A.eq(spread(A, V, P, Q), spread(A, move(V), move(P), move(Q)))).toBe(true);
      }),
    );
  });
});

describe('triangle(A, A1, A2, A3) agrees with quadrance and spread at each vertex', () => {
  const A = rational;
  it('Q1 = Q(A2, A3), s1 = spread(A1; A2, A3) and so on, exactly', () => {
    fc.assert(
      fc.property(pt, pt, pt, (a, b, c) => {
        const P1 = point(A, ...a),
          P2 = point(A, ...b),
          P3 = point(A, ...c);
        const D = P2.x
          .sub(P1.x)
          .mul(P3.y.sub(P1.y))
          .sub(P2.y.sub(P1.y).mul(P3.x.sub(P1.x)));
        fc.pre(!D.equals(0));
        const t = triangle(A, P1, P2, P3);
        expect(
          A.eq(t.Q1, quadrance(A, P2, P3)) &&
            A.eq(t.Q2, quadrance(A, P1, P3)) &&
            A.eq(t.Q3, quadrance(A, P1, P2)),
        ).toBe(true);
        expect(
          A.eq(t.s1, spread(A, P1, P2, P3)) &&
            A.eq(t.s2, spread(A, P2, P1, P3)) &&
            A.eq(t.s3, spread(A, P3, P1, P2)),
        ).toBe(true);
      }),
    );
  });
});

describe('spread in float agrees with sin² of the angle from Math.atan2', () => {
  it('|spread − sin²(atan2(u × v, u · v))| ≤ 1e-12 for random points', () => {
    const c = fc.double({ min: -1e4, max: 1e4, noNaN: true });
    fc.assert(
      fc.property(c, c, c, c, c, c, (vx, vy, px, py, qx, qy) => {
        const ux = px - vx,
          uy = py - vy,
          wx = qx - vx,
          wy = qy - vy;
        fc.pre(Math.hypot(ux, uy) > 1e-3 && Math.hypot(wx, wy) > 1e-3);
        const angle = Math.atan2(ux * wy - uy * wx, ux * wx + uy * wy);
        const s = spread(float, { x: vx, y: vy }, { x: px, y: py }, { x: qx, y: qy });
        expect(Math.abs(s - Math.sin(angle) ** 2)).toBeLessThanOrEqual(1e-12);
        expect(
          Math.abs(
            cross(float, { x: vx, y: vy }, { x: px, y: py }, { x: qx, y: qy }) -
              Math.cos(angle) ** 2,
          ),
        ).toBeLessThanOrEqual(1e-12);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('bad input to points, spreads and lines throws typed errors', () => {
  const A = rational;
  const O = point(A, 0, 0);
  it('spread(A, V, P, Q) with P = V or Q = V throws COINCIDENT_POINTS (the spread is undefined)', () => {
    expect(code(() => spread(A, O, O, point(A, 1, 0)))).toBe('COINCIDENT_POINTS');
    expect(code(() => spread(A, O, point(A, 1, 0), point(A, 0, 0)))).toBe('COINCIDENT_POINTS');
    expect(code(() => cross(float, { x: 1, y: 1 }, { x: 1, y: 1 }, { x: 2, y: 0 }))).toBe(
      'COINCIDENT_POINTS',
    );
    expect(code(() => spreadOfVectors(A, O, point(A, 1, 0)))).toBe('COINCIDENT_POINTS');
  });
  it('lineThrough(A, P, P) throws COINCIDENT_POINTS and line(A, 0, 0, c) DEGENERATE_LINE', () => {
    expect(code(() => lineThrough(A, point(A, 2, 3), point(A, 2, 3)))).toBe('COINCIDENT_POINTS');
    expect(code(() => line(A, 0, 0, 5))).toBe('DEGENERATE_LINE');
    const bad = { a: A.zero, b: A.zero, c: A.one };
    expect(code(() => footOfPerpendicular(A, O, bad))).toBe('DEGENERATE_LINE');
    expect(code(() => quadranceToLine(A, O, bad))).toBe('DEGENERATE_LINE');
    expect(code(() => spreadOfLines(A, bad, line(A, 1, 0, 0)))).toBe('DEGENERATE_LINE');
  });
  it('errors from reading a number name the function and the argument, not the arithmetic', () => {
    expect(() => point(A, 0, 'north')).toThrow(/point\(A, x, y\) y: "north" is not a number/);
    expect(() => line(A, 1, '2..', 0)).toThrow(/line\(A, a, b, c\) b:/);
    expect(() => solveQuadratic(A, 1, 2, NaN)).toThrow(/solveQuadratic\(A, a, b, c\) c:/);
    expect(() => solveTriangle(A, { Q1: 'five', Q2: 1, Q3: 1 })).toThrow(
      /solveTriangle\(A, known\) Q1:/,
    );
    expect(() => surd(A, 1, 1, 'two')).toThrow(/surd\(A, a, b, d\) d:/);
    expect(() => sqrtOf(A, '9'.repeat(2000))).toThrow(/INPUT_TOO_LONG: sqrtOf\(A, x\) x:/);
  });
  it('point(A, x, y) refuses NaN, Infinity, bad text and overlong text', () => {
    expect(code(() => point(A, NaN, 0))).toBe('INVALID_NUMBER');
    expect(code(() => point(float, 0, Infinity))).toBe('INVALID_NUMBER');
    expect(code(() => point(A, '1,5', 0))).toBe('INVALID_NUMBER');
    expect(code(() => point(A, '1'.repeat(5000), 0))).toBe('INPUT_TOO_LONG');
  });
});
