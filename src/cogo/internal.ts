/**
 * Helpers shared by the coordinate-geometry files. Not exported from the package.
 *
 * @module cogo
 * @internal
 */
import { show, invalidArgument, noRealSolution, inputTooLong } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { surd } from '../geometry/surd.js';
import { approxSqrt } from '../readings/numeric.js';
import type { Root } from '../geometry/surd.js';

import type { PointInput } from '../geometry/point.js';
export type { PointInput };

export { readPoint } from '../geometry/validate.js';

/**
 * √q as a value of the arithmetic, for q ≥ 0: 0 for q = 0; otherwise the readings'
 * `approxSqrt` — `A.sqrt(q)` where the arithmetic has the root (rounded as its `sqrt` rounds
 * in `decimal` and `float`, exact for a perfect square in `rational`), else in an exact
 * arithmetic a rational within 1e-48 relative of √q whose last Newton step is taken on q
 * itself, so that an uncertain arithmetic keeps d√q = dq/(2√q).
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when q < 0, naming `where`.
 * @internal
 */
export function sqrtValue<T>(A: Arithmetic<T, boolean>, q: T, where: string): T {
  const sign = A.sign(q);
  if (sign < 0) throw noRealSolution(where, `√ of the negative value ${A.toString(q)}`);
  if (sign === 0) return A.zero;
  return approxSqrt(A, q);
}

/** Checks that an input is an array (not too long) and returns it. @internal */
export function readArray<U>(x: unknown, where: string, max = 1_000_000): readonly U[] {
  if (!Array.isArray(x)) throw invalidArgument(where, `${show(x)} is not an array`);
  if (x.length > max)
    throw inputTooLong(where, `${x.length} items is more than the limit of ${max}`);
  // A sparse array ([a, , c]) has holes that map and forEach skip: refused, naming the first.
  for (let i = 0; i < x.length; i++)
    if (!(i in x)) throw invalidArgument(`${where}[${i}]`, 'is missing (a hole in a sparse array)');
  return x as readonly U[];
}

/**
 * a + b·√d as a `Root`: a surd in an exact arithmetic, a value (√ rounded by `A.sqrt`)
 * otherwise. Requires d ≥ 0. @internal
 */
export function rootOf<T, E extends boolean>(A: Arithmetic<T, E>, a: T, b: T, d: T): Root<T, E> {
  if (A.exact) return surd(A, a, b, d) as Root<T, E>;
  return A.add(a, A.mul(b, A.sqrt(d)!)) as Root<T, E>;
}

/**
 * Relative slack for deciding "touching" against rounding in an inexact arithmetic: 0 in
 * an exact one, 10^(3 − digits) otherwise ({@link Arithmetic.digits}: 1e-12 in float). @internal
 */
export function roundingSlack<T>(A: Arithmetic<T, boolean>): T {
  if (A.exact) return A.zero;
  return A.from(`1e${3 - A.digits}`);
}
