/**
 * Intersections with circles: line–circle and circle–circle (distance–distance), with
 * both points as quadratic surds in exact arithmetics.
 *
 * @module cogo
 */
import {
  show,
  invalidArgument,
  coincidentPoints,
  noRealSolution,
  negativeQuadrance,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import type { Root } from '../geometry/surd.js';
import { readNumber } from '../geometry/validate.js';
import { readPoint, rootOf, roundingSlack } from './internal.js';
import type { PointInput } from './internal.js';

/**
 * A circle: its centre `{ x: east, y: north }` and either its radius (a distance) or its
 * quadrance (the squared radius). A quadrance keeps irrational radii exact.
 */
export type CircleInput<T> =
  | { readonly center: PointInput<T>; readonly radius: Numeric<T> }
  | { readonly center: PointInput<T>; readonly quadrance: Numeric<T> };

function readCircle<T>(
  A: Arithmetic<T, boolean>,
  c: unknown,
  where: string,
): { c: Point<T>; R: T } {
  if (c === null || typeof c !== 'object' || !('center' in c)) {
    throw invalidArgument(
      where,
      `${show(c)} is not a circle { center, radius } or { center, quadrance }`,
    );
  }
  const o = c as { center: unknown; radius?: Numeric<T>; quadrance?: Numeric<T> };
  const center = readPoint(A, o.center, `${where}.center`);
  if ((o.radius === undefined) === (o.quadrance === undefined)) {
    throw invalidArgument(where, 'give exactly one of radius and quadrance');
  }
  if (o.radius !== undefined) {
    const r = readNumber(A, o.radius, where, '.radius');
    if (A.sign(r) < 0) throw invalidArgument(`${where}.radius`, `${A.toString(r)} is negative`);
    return { c: center, R: A.mul(r, r) };
  }
  const R = readNumber(A, o.quadrance!, where, '.quadrance');
  if (A.sign(R) < 0) throw negativeQuadrance(`${where}.quadrance`, `${A.toString(R)} is negative`);
  return { c: center, R };
}

/**
 * The points where line P1P2 meets a circle, ordered along the line from P1 towards P2.
 *
 * Coordinates are x = east, y = north. With d = P2 − P1 and f = P1 − C, the points are
 * P1 + t·d where t = (−f·d ± √((f·d)² − (d·d)(f·f − R)))/(d·d) (the quadratic formula), so
 * each coordinate is a surd a + b√k with one radicand k: exact in `rational`, a value in
 * `decimal` and `float`. A tangent line gives one point (in `decimal` and `float`, a
 * discriminant within rounding of zero counts as a tangent: 1e-12 relative in `float`,
 * 10^(3 − digits) in `decimal`).
 *
 * @param A the arithmetic
 * @param P1 a point of the line
 * @param P2 another point of the line
 * @param circle `{ center, radius }` or `{ center, quadrance }`
 * @returns one or two points with `Root` coordinates
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when the line misses the circle;
 * `COINCIDENT_POINTS` when P1 = P2; `INVALID_ARGUMENT`, `NEGATIVE_QUADRANCE`, `INVALID_NUMBER` for bad input.
 * @example
 * ```ts
 * import { rational, intersectLineCircle } from 'quadspread';
 * const pts = intersectLineCircle(rational, { x: 0, y: 0 }, { x: 1, y: 0 }, { center: { x: 0, y: 1 }, radius: 2 });
 * pts.map((p) => `${p.x.toString()}, ${p.y.toString()}`);
 * //=> ['-√3, 0', '√3, 0']
 * ```
 */
export function intersectLineCircle<T, E extends boolean>(
  A: Arithmetic<T, E>,
  P1: PointInput<T>,
  P2: PointInput<T>,
  circle: CircleInput<T>,
): Point<Root<T, E>>[] {
  checkArithmetic(A, 'intersectLineCircle');
  const where = 'intersectLineCircle(A, P1, P2, circle)';
  const a = readPoint(A, P1, `${where} P1`);
  const b = readPoint(A, P2, `${where} P2`);
  const { c, R } = readCircle(A, circle, `${where} circle`);
  const dx = A.sub(b.x, a.x);
  const dy = A.sub(b.y, a.y);
  const dd = A.add(A.mul(dx, dx), A.mul(dy, dy));
  if (A.isZero(dd)) throw coincidentPoints(where, 'P1 and P2 are the same point: they fix no line');
  const fx = A.sub(a.x, c.x);
  const fy = A.sub(a.y, c.y);
  const h = A.add(A.mul(fx, dx), A.mul(fy, dy));
  const ff = A.add(A.mul(fx, fx), A.mul(fy, fy));
  // Quarter discriminant of (d·d)t² + 2(f·d)t + (f·f − R) = 0.
  let disc = A.sub(A.mul(h, h), A.mul(dd, A.sub(ff, R)));
  // In an inexact arithmetic a discriminant within rounding of zero is a tangent.
  if (
    A.sign(disc) < 0 &&
    A.cmp(A.neg(disc), A.mul(roundingSlack(A), A.add(A.mul(h, h), A.mul(dd, A.add(ff, R))))) <= 0
  )
    disc = A.zero;
  if (A.sign(disc) < 0) throw noRealSolution(where, 'the line misses the circle');
  const t0 = A.neg(A.div(h, dd));
  const ax = A.add(a.x, A.mul(t0, dx));
  const ay = A.add(a.y, A.mul(t0, dy));
  const kx = A.div(dx, dd);
  const ky = A.div(dy, dd);
  if (A.isZero(disc))
    return [{ x: rootOf(A, ax, A.zero, A.zero), y: rootOf(A, ay, A.zero, A.zero) }];
  return [
    { x: rootOf(A, ax, A.neg(kx), disc), y: rootOf(A, ay, A.neg(ky), disc) },
    { x: rootOf(A, ax, kx, disc), y: rootOf(A, ay, ky, disc) },
  ];
}

/**
 * The points where two circles meet (the distance–distance intersection): the first to
 * the right of the line from centre 1 to centre 2 (looking from C1 towards C2, on a map
 * with north up), the second to the left; one point when the circles touch.
 *
 * Coordinates are x = east, y = north. With D = Q(C1, C2), the foot on C1C2 is
 * C1 + τ·(C2 − C1) with τ = (D + R1 − R2)/(2D), and the offset is ±√(R1/D − τ²) times the
 * perpendicular (Δy, −Δx) (from the radical line of the two circles). Each coordinate is
 * a surd with one radicand: exact in `rational`. In `decimal` and `float`, circles within
 * rounding of touching (1e-12 relative in `float`, 10^(3 − digits) in `decimal`) touch.
 *
 * @param A the arithmetic
 * @param circle1 `{ center, radius }` or `{ center, quadrance }`
 * @param circle2 the other circle
 * @returns one or two points with `Root` coordinates
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when the circles do not meet;
 * `COINCIDENT_POINTS` for concentric circles; `INVALID_ARGUMENT`, `NEGATIVE_QUADRANCE`, `INVALID_NUMBER` for bad input.
 * @example
 * ```ts
 * import { rational, intersectCircles } from 'quadspread';
 * const pts = intersectCircles(rational, { center: { x: 0, y: 0 }, radius: 5 }, { center: { x: 8, y: 0 }, radius: 5 });
 * pts.map((p) => `${p.x.toString()}, ${p.y.toString()}`);
 * //=> ['4, -3', '4, 3']
 * ```
 */
export function intersectCircles<T, E extends boolean>(
  A: Arithmetic<T, E>,
  circle1: CircleInput<T>,
  circle2: CircleInput<T>,
): Point<Root<T, E>>[] {
  checkArithmetic(A, 'intersectCircles');
  const where = 'intersectCircles(A, circle1, circle2)';
  const { c: c1, R: R1 } = readCircle(A, circle1, `${where} circle1`);
  const { c: c2, R: R2 } = readCircle(A, circle2, `${where} circle2`);
  const dx = A.sub(c2.x, c1.x);
  const dy = A.sub(c2.y, c1.y);
  const D = A.add(A.mul(dx, dx), A.mul(dy, dy));
  if (A.isZero(D))
    throw coincidentPoints(where, 'the circles are concentric: they meet nowhere or everywhere');
  const tau = A.div(A.add(A.sub(D, R2), R1), A.add(D, D));
  let k = A.sub(A.div(R1, D), A.mul(tau, tau));
  // In an inexact arithmetic a k within rounding of zero means the circles touch.
  if (
    A.sign(k) < 0 &&
    A.cmp(A.neg(k), A.mul(roundingSlack(A), A.add(A.div(R1, D), A.mul(tau, tau)))) <= 0
  )
    k = A.zero;
  if (A.sign(k) < 0)
    throw noRealSolution(
      where,
      'the circles do not meet (the distances are too short or too long for the centres)',
    );
  const bx = A.add(c1.x, A.mul(tau, dx));
  const by = A.add(c1.y, A.mul(tau, dy));
  if (A.isZero(k)) return [{ x: rootOf(A, bx, A.zero, A.zero), y: rootOf(A, by, A.zero, A.zero) }];
  // Right of C1→C2 is the clockwise perpendicular (Δy, −Δx).
  return [
    { x: rootOf(A, bx, dy, k), y: rootOf(A, by, A.neg(dx), k) },
    { x: rootOf(A, bx, A.neg(dy), k), y: rootOf(A, by, dx, k) },
  ];
}
