/**
 * Spreads back to percent grades, with the square root kept exact.
 *
 * @module readings
 */
import { verticalSight, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { sqrtOf, surd, type Root } from '../geometry/surd.js';
import { checkSpread } from './spread.js';

/**
 * The percent grade of a spread: p = 100·√(s/(1 − s)) (tan² = s/(1 − s), as
 * sin²/cos²), written 100·√(s(1 − s))/(1 − s) so the radicand is as small as can be.
 * The grade has no sign (a spread has none); give it the sign of the reading.
 *
 * In `rational` the result is an exact {@link Surd} (rational when s(1 − s) is a square:
 * spread 9/25 gives exactly 75 %); in `decimal` and `float` a rounded value.
 *
 * @param A the arithmetic
 * @param s the spread with the horizontal, in [0, 1)
 * @returns the grade in percent, ≥ 0
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` outside [0, 1]; `VERTICAL_SIGHT` when s = 1
 *   (a vertical line has no grade).
 * @example
 * ```ts
 * import { rational, float, gradeFromSpread } from 'quadspread';
 * [gradeFromSpread(rational, '9/25').toString(), gradeFromSpread(rational, '1/3').toString(), gradeFromSpread(float, 0.5)];
 * //=> ['75', '50√2', 100]
 * ```
 */
export function gradeFromSpread<T, E extends boolean>(
  A: Arithmetic<T, E>,
  s: Numeric<T>,
): Root<T, E> {
  checkArithmetic(A, 'gradeFromSpread');
  const v = checkSpread(A, s, 'gradeFromSpread(s)');
  const c = A.sub(A.one, v);
  if (A.isZero(c))
    throw verticalSight('gradeFromSpread(s)', 'a spread of 1 is vertical: it has no grade');
  const k = A.div(A.from(100), c);
  const rad = A.mul(v, c);
  if (A.exact) return surd(A, 0, k, rad) as Root<T, E>; // 100·√(s(1 − s))/(1 − s)
  return A.mul(k, sqrtOf(A, rad) as T) as Root<T, E>;
}
