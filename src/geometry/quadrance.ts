/**
 * Quadrance: the square of the distance between two points.
 *
 * @module geometry
 */
import { checkArithmetic } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { asPoint, type PointLike } from './point.js';
import { finiteResult, checkPoint } from './validate.js';

/**
 * The quadrance Q(P, Q) = (x₂ − x₁)² + (y₂ − y₁)²: the squared distance between two
 * points, in the square of the coordinates' unit. A polynomial in the coordinates, so it
 * is exact in `rational` and rounded once per operation in `decimal` and `float`.
 *
 * @param A the arithmetic
 * @param P the first point
 * @param Q the second point
 * @returns the quadrance (≥ 0), in square units
 * @throws {QuadspreadError} `NOT_FINITE` in float when the result overflows (coordinates beyond about 1e154);
 *   nothing else: the points are values of the arithmetic already.
 * @example
 * ```ts
 * import { rational, point, quadrance } from 'quadspread';
 * rational.toString(quadrance(rational, point(rational, 0, 0), point(rational, 3, 4)));
 * //=> '25'
 * ```
 */
export function quadrance<T>(A: Arithmetic<T>, P: PointLike<T>, Q: PointLike<T>): T {
  checkArithmetic(A, 'quadrance');
  const Pp = asPoint(P);
  const Qp = asPoint(Q);
  checkPoint(A, Pp, 'quadrance(P)');
  checkPoint(A, Qp, 'quadrance(Q)');
  // The square of the Euclidean distance, by Pythagoras' theorem (Euclid, Elements I.47).
  const dx = A.sub(Qp.x, Pp.x);
  const dy = A.sub(Qp.y, Pp.y);
  return finiteResult(A.add(A.mul(dx, dx), A.mul(dy, dy)), 'quadrance(A, P, Q)');
}

/**
 * The quadrance of a vector v = (x, y): x² + y² (its squared length).
 *
 * @param A the arithmetic
 * @param v the vector
 * @returns x² + y², in square units
 * @throws {QuadspreadError} `NOT_FINITE` in float when the result overflows; nothing else: the
 *   vector is a value of the arithmetic already.
 * @example
 * ```ts
 * import { float, point, vectorQuadrance } from 'quadspread';
 * vectorQuadrance(float, point(float, 1, 2));
 * //=> 5
 * ```
 */
export function vectorQuadrance<T>(A: Arithmetic<T>, v: PointLike<T>): T {
  checkArithmetic(A, 'vectorQuadrance');
  const vp = asPoint(v);
  checkPoint(A, vp, 'vectorQuadrance(v)');
  return finiteResult(A.add(A.mul(vp.x, vp.x), A.mul(vp.y, vp.y)), 'vectorQuadrance(A, v)');
}
