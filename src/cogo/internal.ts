/**
 * Helpers shared by the coordinate-geometry files. Not exported from the package.
 *
 * @module cogo
 * @internal
 */
import { QuadspreadError, show } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { surd } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';

/** A point as cogo reads it: x = east, y = north, each a value or numeric input. @internal */
export interface PointInput<T> {
  readonly x: Numeric<T>;
  readonly y: Numeric<T>;
}

/** A point of arithmetic `T`: x = east, y = north (the geometry's `Point`). @internal */
export type XY<T> = Point<T>;

/** Reads a point `{ x, y }` (x = east, y = north) into the arithmetic. @internal */
export function readPoint<T>(A: Arithmetic<T, boolean>, p: unknown, where: string): XY<T> {
  if (p === null || typeof p !== 'object' || !('x' in p) || !('y' in p)) {
    throw new QuadspreadError('INVALID_ARGUMENT', where, `${show(p)} is not a point { x, y } (x = east, y = north)`);
  }
  const q = p as PointInput<T>;
  return { x: A.from(q.x), y: A.from(q.y) };
}

/** Relative tolerance of {@link sqrtValue} in an exact arithmetic. @internal */
export const SQRT_TOLERANCE_DIGITS = 40;

/**
 * √q as a value of the arithmetic. Inexact arithmetics round as their `sqrt` does. In an
 * exact arithmetic the root is exact when q is a perfect square and otherwise a rational
 * within 1e-40 relative of √q (Newton's iteration, each step rounded to 50 significant
 * digits). Never hangs: gives up with `NOT_CONVERGED` after 400 steps.
 * @internal
 */
export function sqrtValue<T>(A: Arithmetic<T, boolean>, q: T, where: string): T {
  const sign = A.sign(q);
  if (sign < 0) throw new QuadspreadError('NO_REAL_SOLUTION', where, `√ of the negative value ${A.toString(q)}`);
  if (sign === 0) return A.zero;
  const r = A.sqrt(q);
  if (r !== undefined) return r;
  // Newton's iteration x ← (x + q/x)/2 (Heron's method), rounded to 50 digits each step.
  const two = A.from(2);
  let x: T;
  const guess = Math.sqrt(A.toNumber(q));
  x = guess > 0 && Number.isFinite(guess) ? A.from(guess.toPrecision(17)) : A.cmp(q, A.one) > 0 ? q : A.one;
  const bound = A.mul(q, A.from(`1e-${SQRT_TOLERANCE_DIGITS + 6}`));
  for (let i = 0; i < 400; i++) {
    const next = A.from(A.toPrecision(A.div(A.add(x, A.div(q, x)), two), 50));
    const err = A.sub(A.mul(next, next), q);
    x = next;
    // |x² − q| ≤ 1e-46·q gives |x − √q| < 1e-46·√q, inside the stated 1e-40.
    if (A.cmp(A.abs(err), bound) <= 0) return x;
  }
  throw new QuadspreadError('NOT_CONVERGED', where, `√${A.toString(q)} did not converge`);
}

/** Checks that an input is an array (not too long) and returns it. @internal */
export function readArray<U>(x: unknown, where: string, max = 1_000_000): readonly U[] {
  if (!Array.isArray(x)) throw new QuadspreadError('INVALID_ARGUMENT', where, `${show(x)} is not an array`);
  if (x.length > max) throw new QuadspreadError('INPUT_TOO_LONG', where, `${x.length} items is more than the limit of ${max}`);
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
 * an exact one, 10^(3 − digits) for one with `digits` (decimal), 1e-12 otherwise (float). @internal
 */
export function roundingSlack<T>(A: Arithmetic<T, boolean>): T {
  if (A.exact) return A.zero;
  const digits = (A as { digits?: unknown }).digits;
  return A.from(typeof digits === 'number' ? `1e${3 - digits}` : '1e-12');
}
