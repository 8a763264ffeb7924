/**
 * The height h from a vertical quadrance H and the side of the level it lies on.
 *
 * @module elevation
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { invalidArgument, show, checkArithmetic } from '../errors.js';
import { readQuadrance } from '../geometry/validate.js';
import { isSurd, sqrtOf, type Root, type Surd } from '../geometry/surd.js';

/**
 * The signed height h = ±√H of a point whose vertical quadrance above (or below) a level is H:
 * positive above the level, negative below. The height functions return H, which stays exact
 * in `rational`; this gives the length, as an exact surd in `rational` (√H is rarely rational)
 * and a correctly rounded value in `decimal` and `float`.
 *
 * @param A the arithmetic
 * @param H the vertical quadrance, ≥ 0 (square of the length unit)
 * @param sign +1 (default) above the level, −1 below, 0 on it (then H must be 0)
 * @returns h, in the length unit of √H
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE` when H < 0; `INVALID_ARGUMENT` for a sign
 *   other than −1, 0, 1, or a sign of 0 with H ≠ 0.
 * @example
 * ```ts
 * import { rational, heightFromQuadrance } from 'quadspread';
 * [heightFromQuadrance(rational, '225/4').toString(), heightFromQuadrance(rational, 50, -1).toString()];
 * //=> ['15/2', '-5√2']
 * ```
 */
export function heightFromQuadrance<T, E extends boolean>(
  A: Arithmetic<T, E>,
  H: Numeric<T>,
  sign: -1 | 0 | 1 = 1,
): Root<T, E> {
  checkArithmetic(A, 'heightFromQuadrance');
  const w = 'heightFromQuadrance(A, H, sign)';
  const q = readQuadrance(A, H, w, 'H');
  if (sign !== 1 && sign !== -1 && sign !== 0)
    throw invalidArgument(`${w} sign`, `${show(sign)} is not -1, 0 or 1`);
  if (sign === 0 && !A.isZero(q))
    throw invalidArgument(`${w} sign`, `sign 0 (on the level) with H = ${show(A.toString(q))}`);
  const h = sqrtOf(A, q);
  if (sign >= 0) return h;
  return (isSurd(h) ? (h as Surd<T>).neg() : A.neg(h as T)) as Root<T, E>;
}
