/**
 * Spread and cross at a vertex: the rational replacements of sin² and cos² of an angle.
 *
 * @module geometry
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { QuadspreadError, show } from '../errors.js';
import type { Point } from './point.js';

function coincident<T>(A: Arithmetic<T>, where: string, arg: string, P: Point<T>): never {
  throw new QuadspreadError('COINCIDENT_POINTS', where, `${arg} = (${show(A.toString(P.x))}, ${show(A.toString(P.y))}) coincides with the vertex V, so the line is undefined`);
}

/** Rounding (float, decimal) can push a spread or cross just above 1: clamp it. Never acts in `rational`. */
function atMostOne<T>(A: Arithmetic<T>, s: T): T {
  return A.cmp(s, A.one) > 0 ? A.one : s;
}

/**
 * The spread at V between the lines VP and VQ: s = (u × v)² / (|u|²·|v|²) with u = P − V,
 * v = Q − V. It equals sin² of the angle between the lines (0 for parallel lines, 1 for
 * perpendicular ones) and is dimensionless. Exact in `rational`.
 *
 * @param A the arithmetic
 * @param V the vertex
 * @param P a point on the first line (≠ V)
 * @param Q a point on the second line (≠ V)
 * @returns the spread, in [0, 1] (a rounded value above 1 is returned as 1)
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when P or Q coincides with V.
 * @example
 * ```ts
 * import { rational, point, spread } from 'quadspread';
 * const O = point(rational, 0, 0);
 * rational.toString(spread(rational, O, point(rational, 4, 0), point(rational, 4, 3)));
 * //=> '9/25'
 * ```
 */
export function spread<T>(A: Arithmetic<T>, V: Point<T>, P: Point<T>, Q: Point<T>): T {
  const ux = A.sub(P.x, V.x);
  const uy = A.sub(P.y, V.y);
  const vx = A.sub(Q.x, V.x);
  const vy = A.sub(Q.y, V.y);
  const qu = A.add(A.mul(ux, ux), A.mul(uy, uy));
  const qv = A.add(A.mul(vx, vx), A.mul(vy, vy));
  if (A.isZero(qu)) coincident(A, 'spread(A, V, P, Q)', 'P', P);
  if (A.isZero(qv)) coincident(A, 'spread(A, V, P, Q)', 'Q', Q);
  // Spread of two vectors, s = (u1 v2 − u2 v1)² / ((u1² + u2²)(v1² + v2²)): Wildberger, Divine Proportions (2005), ch. 5.
  const c = A.sub(A.mul(ux, vy), A.mul(uy, vx));
  return atMostOne(A, A.div(A.mul(c, c), A.mul(qu, qv)));
}

/**
 * The cross at V between the lines VP and VQ: c = (u · v)² / (|u|²·|v|²) = 1 − spread,
 * with u = P − V, v = Q − V. It equals cos² of the angle between the lines. Exact in
 * `rational`.
 *
 * @param A the arithmetic
 * @param V the vertex
 * @param P a point on the first line (≠ V)
 * @param Q a point on the second line (≠ V)
 * @returns the cross, in [0, 1] (a rounded value above 1 is returned as 1)
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when P or Q coincides with V.
 * @example
 * ```ts
 * import { rational, point, cross } from 'quadspread';
 * const O = point(rational, 0, 0);
 * rational.toString(cross(rational, O, point(rational, 4, 0), point(rational, 4, 3)));
 * //=> '16/25'
 * ```
 */
export function cross<T>(A: Arithmetic<T>, V: Point<T>, P: Point<T>, Q: Point<T>): T {
  const ux = A.sub(P.x, V.x);
  const uy = A.sub(P.y, V.y);
  const vx = A.sub(Q.x, V.x);
  const vy = A.sub(Q.y, V.y);
  const qu = A.add(A.mul(ux, ux), A.mul(uy, uy));
  const qv = A.add(A.mul(vx, vx), A.mul(vy, vy));
  if (A.isZero(qu)) coincident(A, 'cross(A, V, P, Q)', 'P', P);
  if (A.isZero(qv)) coincident(A, 'cross(A, V, P, Q)', 'Q', Q);
  // Cross of two vectors, c = (u1 v1 + u2 v2)² / ((u1² + u2²)(v1² + v2²)) = 1 − s: Wildberger, Divine Proportions (2005), ch. 5.
  const d = A.add(A.mul(ux, vx), A.mul(uy, vy));
  return atMostOne(A, A.div(A.mul(d, d), A.mul(qu, qv)));
}

/**
 * The spread of two direction vectors u and v (neither zero):
 * (u × v)² / (|u|²·|v|²), sin² of the angle between them.
 *
 * @param A the arithmetic
 * @param u the first direction
 * @param v the second direction
 * @returns the spread, in [0, 1]
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when u or v is the zero vector.
 * @example
 * ```ts
 * import { rational, point, spreadOfVectors } from 'quadspread';
 * rational.toString(spreadOfVectors(rational, point(rational, 1, 0), point(rational, 1, 1)));
 * //=> '1/2'
 * ```
 */
export function spreadOfVectors<T>(A: Arithmetic<T>, u: Point<T>, v: Point<T>): T {
  const qu = A.add(A.mul(u.x, u.x), A.mul(u.y, u.y));
  const qv = A.add(A.mul(v.x, v.x), A.mul(v.y, v.y));
  if (A.isZero(qu)) throw new QuadspreadError('COINCIDENT_POINTS', 'spreadOfVectors(A, u, v)', 'u is the zero vector, so it has no direction');
  if (A.isZero(qv)) throw new QuadspreadError('COINCIDENT_POINTS', 'spreadOfVectors(A, u, v)', 'v is the zero vector, so it has no direction');
  // Spread of two vectors: Wildberger, Divine Proportions (2005), ch. 5.
  const c = A.sub(A.mul(u.x, v.y), A.mul(u.y, v.x));
  return atMostOne(A, A.div(A.mul(c, c), A.mul(qu, qv)));
}
