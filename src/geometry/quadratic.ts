/**
 * Real roots of a quadratic equation, as exact surds or rounded values.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, invalidArgument, unsupportedOperation, checkArithmetic } from '../errors.js';
import { type Root, type Surd, surd } from './surd.js';
import { readNumber } from './validate.js';

/**
 * The real roots of a·x² + b·x + c = 0, distinct and in increasing order: two, one
 * (a double root, or a linear equation when a = 0) or none.
 *
 * In an exact arithmetic the roots are {@link Surd}s (−b ± √(b² − 4ac))/(2a), exact.
 * In `float` and `decimal` they are values computed without cancellation
 * (q = −(b + sign(b)·√disc)/2, roots q/a and c/q); a discriminant that rounds below zero
 * gives no roots, so a double root met only after rounding may be lost.
 *
 * @param A the arithmetic
 * @param a coefficient of x²
 * @param b coefficient of x
 * @param c constant term
 * @returns the real roots, ascending (an empty array when there are none)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when a = b = 0 (no equation in x).
 * @example
 * ```ts
 * import { rational, solveQuadratic } from 'quadspread';
 * solveQuadratic(rational, 1, -82, 881).map((r) => r.toString());
 * //=> ['41 - 20√2', '41 + 20√2']
 * ```
 */
export function solveQuadratic<T, E extends boolean>(
  A: Arithmetic<T, E>,
  a: Numeric<T>,
  b: Numeric<T>,
  c: Numeric<T>,
): Root<T, E>[] {
  checkArithmetic(A, 'solveQuadratic');
  const w = 'solveQuadratic(A, a, b, c)';
  const qa = readNumber(A, a, w, ' a');
  const qb = readNumber(A, b, w, ' b');
  const qc = readNumber(A, c, w, ' c');
  if (A.isZero(qa)) {
    if (A.isZero(qb)) {
      throw invalidArgument(
        w,
        `a and b are both zero (c = ${show(A.toString(qc))}): no equation in x`,
      );
    }
    const x = A.neg(A.div(qc, qb));
    return [(A.exact ? surd(A, x) : x) as Root<T, E>];
  }
  // Quadratic formula x = (−b ± √(b² − 4ac))/(2a): any algebra text; the cancellation-free form for rounded
  // arithmetic: Press et al., Numerical Recipes, 3rd ed. (2007), §5.6.
  const disc = A.sub(A.mul(qb, qb), A.mul(A.from(4), A.mul(qa, qc)));
  const sd = A.sign(disc);
  if (sd < 0) return [];
  const two = A.from(2);
  if (A.exact) {
    const m = A.div(A.neg(qb), A.mul(two, qa));
    if (sd === 0) return [surd(A, m) as Root<T, E>];
    const k = A.div(A.one, A.mul(two, A.abs(qa)));
    const lo: Surd<T> = surd(A, m, A.neg(k), disc);
    if (lo.isRational()) {
      const hi = surd(A, m, k, disc);
      return [lo, hi] as Root<T, E>[];
    }
    return [lo, surd(A, lo.a, A.neg(lo.b), lo.d)] as Root<T, E>[];
  }
  if (sd === 0) return [A.div(A.neg(qb), A.mul(two, qa)) as Root<T, E>];
  const r = A.sqrt(disc);
  if (r === undefined)
    throw unsupportedOperation(
      'solveQuadratic(A, a, b, c)',
      `${A.name} has no square root of ${show(A.toString(disc))}`,
    );
  const q = A.div(A.neg(A.sign(qb) < 0 ? A.sub(qb, r) : A.add(qb, r)), two);
  const x1 = A.div(q, qa);
  const x2 = A.div(qc, q);
  return (A.cmp(x1, x2) <= 0 ? [x1, x2] : [x2, x1]) as Root<T, E>[];
}
