/**
 * Spread and cross at a vertex: the rational replacements of sin² and cos² of an angle.
 *
 * @module geometry
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { show, coincidentPoints, checkArithmetic } from '../errors.js';
import { asPoint, type Point, type PointLike } from './point.js';
import { atMostOne, checkPoint } from './validate.js';

/**
 * k²/(Q(u)·Q(v)) for u = (ux, uy), v = (vx, vy), with k = u × v (a spread) or u · v (a
 * cross), clamped to 1; a zero u or v is refused naming the point U or W it came from (P or
 * Q), or u or v for bare vectors (U, W undefined).
 */
function ratio<T>(
  A: Arithmetic<T>,
  ux: T,
  uy: T,
  vx: T,
  vy: T,
  dot: boolean,
  where: string,
  U: Point<T> | undefined,
  W: Point<T> | undefined,
): T {
  const qu = A.add(A.mul(ux, ux), A.mul(uy, uy));
  const qv = A.add(A.mul(vx, vx), A.mul(vy, vy));
  if (A.isZero(qu)) zero(A, where, U === undefined ? 'u' : 'P', U);
  if (A.isZero(qv)) zero(A, where, W === undefined ? 'v' : 'Q', W);
  // Spread s = (u1 v2 − u2 v1)² / ((u1² + u2²)(v1² + v2²)) and cross c = (u1 v1 + u2 v2)² / (…) = 1 − s:
  // sin² and cos² of the angle between u and v, from |u × v| = |u||v|·sin θ and u · v = |u||v|·cos θ (common practice; derived).
  const k = dot ? A.add(A.mul(ux, vx), A.mul(uy, vy)) : A.sub(A.mul(ux, vy), A.mul(uy, vx));
  return atMostOne(A, A.div(A.mul(k, k), A.mul(qu, qv)));
}

function zero<T>(A: Arithmetic<T>, where: string, arg: string, P: Point<T> | undefined): never {
  if (P === undefined)
    throw coincidentPoints(where, `${arg} is the zero vector, so it has no direction`);
  throw coincidentPoints(
    where,
    `${arg} = (${show(A.toString(P.x))}, ${show(A.toString(P.y))}) coincides with the vertex V, so the line is undefined`,
  );
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
export function spread<T>(A: Arithmetic<T>, V: PointLike<T>, P: PointLike<T>, Q: PointLike<T>): T {
  checkArithmetic(A, 'spread');
  const Vp = asPoint(V);
  const Pp = asPoint(P);
  const Qp = asPoint(Q);
  checkPoint(A, Vp, 'spread(V)');
  checkPoint(A, Pp, 'spread(P)');
  checkPoint(A, Qp, 'spread(Q)');
  return ratio(
    A,
    A.sub(Pp.x, Vp.x),
    A.sub(Pp.y, Vp.y),
    A.sub(Qp.x, Vp.x),
    A.sub(Qp.y, Vp.y),
    false,
    'spread(A, V, P, Q)',
    Pp,
    Qp,
  );
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
export function cross<T>(A: Arithmetic<T>, V: PointLike<T>, P: PointLike<T>, Q: PointLike<T>): T {
  checkArithmetic(A, 'cross');
  const Vp = asPoint(V);
  const Pp = asPoint(P);
  const Qp = asPoint(Q);
  checkPoint(A, Vp, 'cross(V)');
  checkPoint(A, Pp, 'cross(P)');
  checkPoint(A, Qp, 'cross(Q)');
  return ratio(
    A,
    A.sub(Pp.x, Vp.x),
    A.sub(Pp.y, Vp.y),
    A.sub(Qp.x, Vp.x),
    A.sub(Qp.y, Vp.y),
    true,
    'cross(A, V, P, Q)',
    Pp,
    Qp,
  );
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
export function spreadOfVectors<T>(A: Arithmetic<T>, u: PointLike<T>, v: PointLike<T>): T {
  checkArithmetic(A, 'spreadOfVectors');
  const up = asPoint(u);
  const vp = asPoint(v);
  checkPoint(A, up, 'spreadOfVectors(u)');
  checkPoint(A, vp, 'spreadOfVectors(v)');
  return ratio(A, up.x, up.y, vp.x, vp.y, false, 'spreadOfVectors(A, u, v)', undefined, undefined);
}
