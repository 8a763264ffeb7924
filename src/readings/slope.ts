/**
 * Slope readings — percent grade, per mille, rise : run, "1 in n" — to spreads and back.
 * All exact in `rational`: a slope of rise r over horizontal run d has spread
 * r²/(r² + d²).
 *
 * @module readings
 */
import { show, verticalSight, invalidSlope, checkArithmetic } from '../errors.js';
import { readNumber } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { checkSpread } from './spread.js';

function shown<T>(A: Arithmetic<T>, x: Numeric<T>, v: T): string {
  return typeof x === 'object' ? A.toString(v) : show(x);
}

/**
 * The spread of a rise over a horizontal run: s = rise²/(rise² + run²) (the spread is
 * the square of the sine; sin² = r²/(r² + d²) in the right triangle, Pythagoras).
 * The signs of rise and run do not change the spread.
 *
 * @param A the arithmetic
 * @param rise the vertical component
 * @param run the horizontal component
 * @returns the spread of the slope with the horizontal, in [0, 1]
 * @throws {QuadspreadError} `INVALID_SLOPE` when both are zero; `INVALID_NUMBER` for bad values.
 * @example
 * ```ts
 * import { rational, spreadFromRatio } from 'quadspread';
 * rational.toString(spreadFromRatio(rational, 3, 4));
 * //=> '9/25'
 * ```
 */
export function spreadFromRatio<T>(A: Arithmetic<T>, rise: Numeric<T>, run: Numeric<T>): T {
  checkArithmetic(A, 'spreadFromRatio');
  const r = readNumber(A, rise, 'spreadFromRatio(rise)');
  const d = readNumber(A, run, 'spreadFromRatio(run)');
  if (A.isZero(r) && A.isZero(d)) {
    throw invalidSlope(
      'spreadFromRatio(rise, run)',
      'rise and run are both zero: the slope has no direction',
    );
  }
  if (!A.exact && outOfSquareRange(A.toNumber(r), A.toNumber(d))) {
    // Squares of such values overflow or underflow a double: divide by the larger part first.
    const riseLarger = A.cmp(A.abs(r), A.abs(d)) >= 0;
    const t = riseLarger ? A.div(d, r) : A.div(r, d);
    const t2 = A.mul(t, t);
    return riseLarger ? A.div(A.one, A.add(A.one, t2)) : A.div(t2, A.add(A.one, t2)); // the same r²/(r² + d²)
  }
  const r2 = A.mul(r, r);
  return A.div(r2, A.add(r2, A.mul(d, d))); // sin² = r²/(r² + d²)
}

/** Whether |x| or |y| is so large (over 1e150) or so small (non-zero, under 1e-150) that its square leaves a double's range. */
function outOfSquareRange(x: number, y: number): boolean {
  const big = Math.max(Math.abs(x), Math.abs(y));
  const small = Math.min(Math.abs(x) || Infinity, Math.abs(y) || Infinity);
  return big > 1e150 || small < 1e-150;
}

/**
 * The spread of a percent grade p (100·rise/run): s = p²/(10⁴ + p²), exact. 100 % is
 * 45°, spread 1/2.
 *
 * @param A the arithmetic
 * @param percent the grade in percent (its sign does not change the spread)
 * @returns the spread, in [0, 1)
 * @throws {QuadspreadError} `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, spreadFromGrade } from 'quadspread';
 * rational.toString(spreadFromGrade(rational, 5));
 * //=> '1/401'
 * ```
 */
export function spreadFromGrade<T>(A: Arithmetic<T>, percent: Numeric<T>): T {
  checkArithmetic(A, 'spreadFromGrade');
  return spreadFromRatio(A, readNumber(A, percent, 'spreadFromGrade(percent)'), 100); // p % = p/100 rise per run
}

/**
 * The spread of a grade in per mille (1000·rise/run): s = p²/(10⁶ + p²), exact.
 *
 * @param A the arithmetic
 * @param perMille the grade in ‰
 * @returns the spread, in [0, 1)
 * @throws {QuadspreadError} `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, spreadFromPerMille } from 'quadspread';
 * rational.toString(spreadFromPerMille(rational, 20));
 * //=> '1/2501'
 * ```
 */
export function spreadFromPerMille<T>(A: Arithmetic<T>, perMille: Numeric<T>): T {
  checkArithmetic(A, 'spreadFromPerMille');
  return spreadFromRatio(A, readNumber(A, perMille, 'spreadFromPerMille(perMille)'), 1000);
}

/**
 * The spread of a "1 in n" slope, read as 1 unit of rise per n units of horizontal run
 * (the railway and drainage usage; common practice): s = 1/(1 + n²), exact.
 *
 * @param A the arithmetic
 * @param n the horizontal run per unit rise, not zero
 * @returns the spread, in (0, 1]
 * @throws {QuadspreadError} `INVALID_SLOPE` when n is zero.
 * @example
 * ```ts
 * import { rational, spreadFromOneIn } from 'quadspread';
 * rational.toString(spreadFromOneIn(rational, 200));
 * //=> '1/40001'
 * ```
 */
export function spreadFromOneIn<T>(A: Arithmetic<T>, n: Numeric<T>): T {
  checkArithmetic(A, 'spreadFromOneIn');
  const v = readNumber(A, n, 'spreadFromOneIn(n)');
  if (A.isZero(v))
    throw invalidSlope('spreadFromOneIn(n)', `"1 in ${shown(A, n, v)}" is not a slope`);
  return spreadFromRatio(A, 1, v);
}

/**
 * The square of the percent grade of a spread: p² = 10⁴·s/(1 − s), exact. (The grade
 * itself, 100·√(s/(1 − s)), is usually irrational; this is what stays exact.)
 *
 * @param A the arithmetic
 * @param s the spread, in [0, 1)
 * @returns the squared grade in percent²
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` outside [0, 1]; `VERTICAL_SIGHT` when s = 1.
 * @example
 * ```ts
 * import { rational, gradeSquaredFromSpread } from 'quadspread';
 * rational.toString(gradeSquaredFromSpread(rational, '9/25'));
 * //=> '5625'
 * ```
 */
export function gradeSquaredFromSpread<T>(A: Arithmetic<T>, s: Numeric<T>): T {
  checkArithmetic(A, 'gradeSquaredFromSpread');
  const v = checkSpread(A, s, 'gradeSquaredFromSpread(s)');
  if (A.eq(v, A.one))
    throw verticalSight('gradeSquaredFromSpread(s)', 'a spread of 1 is vertical: it has no grade');
  return A.div(A.mul(A.from(10000), v), A.sub(A.one, v)); // tan² = s/(1 − s)
}
