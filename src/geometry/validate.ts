/**
 * Readers that check quadrances and spreads where they enter (internal).
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show } from '../errors.js';

/**
 * Reads a quadrance with `A.from` and checks that it is ≥ 0.
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER` from `A.from`.
 * @internal
 */
export function readQuadrance<T>(A: Arithmetic<T>, x: Numeric<T>, where: string, arg: string): T {
  const v = A.from(x);
  if (A.sign(v) < 0) throw new QuadspreadError('NEGATIVE_QUADRANCE', where, `${arg} = ${show(A.toString(v))} is negative; a quadrance is a squared distance`);
  return v;
}

/**
 * Reads a spread with `A.from` and checks that it lies in [0, 1].
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER` from `A.from`.
 * @internal
 */
export function readSpread<T>(A: Arithmetic<T>, x: Numeric<T>, where: string, arg: string): T {
  const v = A.from(x);
  if (A.sign(v) < 0 || A.cmp(v, A.one) > 0) throw new QuadspreadError('SPREAD_OUT_OF_RANGE', where, `${arg} = ${show(A.toString(v))} is outside [0, 1]`);
  return v;
}
