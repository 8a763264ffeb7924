/**
 * Functions built from an arithmetic's `exp`, `log`, `sin`, `cos`, `atan2` and `sqrt`: the
 * hyperbolic functions and their inverses, non-integer powers, tan, atan and asin — what map
 * projections need — written once for every arithmetic.
 *
 * Accuracy: each is one or two of the arithmetic's transcendental operations and a few
 * arithmetic ones, so in `decimal(n)` the result is within a few units of the n-th significant
 * digit of the larger of the result and its inputs (absolute for `sinh` and `atanh` near 0,
 * where the difference of two exponentials cancels; relative elsewhere); in `rational` within
 * about 1e-40 of the same scale; in `float` within a few ulps. `uncertain` carries the
 * derivatives through the chain rule of the operations used.
 *
 * @module arithmetic
 */
import { show, noRealSolution, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';

/** √x for x ≥ 0: the arithmetic's own root, or e^(ln x / 2) where it has no exact one. */
function sqrtAny<T>(A: Arithmetic<T>, x: T): T {
  const r = A.sqrt(x);
  if (r !== undefined) return r;
  return A.exp(A.div(A.log(x), A.from(2)));
}

/**
 * The hyperbolic sine, sinh x = (e^x − e^−x)/2 (definition).
 *
 * @param A the arithmetic
 * @param value the argument
 * @returns sinh x
 * @throws {QuadspreadError} as the arithmetic's `exp` for |x| too large; `INVALID_NUMBER` for
 *   a value that is not a number.
 * @example
 * ```ts
 * import { float, sinh } from 'quadspread';
 * sinh(float, 1).toFixed(12);
 * //=> '1.175201193644'
 * ```
 */
export function sinh<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'sinh');
  const x = A.from(value);
  const u = A.exp(x);
  return A.div(A.sub(u, A.div(A.one, u)), A.from(2));
}

/**
 * The hyperbolic cosine, cosh x = (e^x + e^−x)/2 (definition).
 *
 * @param A the arithmetic
 * @param value the argument
 * @returns cosh x (≥ 1)
 * @throws {QuadspreadError} as the arithmetic's `exp` for |x| too large; `INVALID_NUMBER` for
 *   a value that is not a number.
 * @example
 * ```ts
 * import { float, cosh } from 'quadspread';
 * cosh(float, 1).toFixed(12);
 * //=> '1.543080634815'
 * ```
 */
export function cosh<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'cosh');
  const x = A.from(value);
  const u = A.exp(x);
  return A.div(A.add(u, A.div(A.one, u)), A.from(2));
}

/**
 * The hyperbolic tangent, tanh x = (1 − e^−2|x|)/(1 + e^−2|x|) with the sign of x (definition,
 * written so that the exponential never overflows).
 *
 * @param A the arithmetic
 * @param value the argument
 * @returns tanh x in (−1, 1)
 * @throws {QuadspreadError} `INVALID_NUMBER` for a value that is not a number.
 * @example
 * ```ts
 * import { float, tanh } from 'quadspread';
 * tanh(float, 1).toFixed(12);
 * //=> '0.761594155956'
 * ```
 */
export function tanh<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'tanh');
  const x = A.from(value);
  if (A.isZero(x)) return x;
  const neg = A.sign(x) < 0;
  const u = A.exp(A.mul(A.from(-2), A.abs(x)));
  const t = A.div(A.sub(A.one, u), A.add(A.one, u));
  return neg ? A.neg(t) : t;
}

/**
 * The inverse hyperbolic tangent, atanh x = ½ ln((1 + x)/(1 − x)) (definition), |x| < 1.
 *
 * @param A the arithmetic
 * @param value the argument, −1 < x < 1
 * @returns atanh x
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when |x| ≥ 1.
 * @example
 * ```ts
 * import { float, atanh } from 'quadspread';
 * atanh(float, 0.5).toFixed(12);
 * //=> '0.549306144334'
 * ```
 */
export function atanh<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'atanh');
  const x = A.from(value);
  if (A.cmp(A.abs(x), A.one) >= 0)
    throw noRealSolution('atanh(A, x)', `|x| = ${show(A.toString(A.abs(x)))} is not below 1`);
  if (A.isZero(x)) return x;
  return A.div(A.log(A.div(A.add(A.one, x), A.sub(A.one, x))), A.from(2));
}

/**
 * The inverse hyperbolic sine, asinh x = ln(|x| + √(x² + 1)) with the sign of x (definition,
 * written so that no cancellation occurs for large negative x).
 *
 * @param A the arithmetic
 * @param value the argument
 * @returns asinh x
 * @throws {QuadspreadError} `INVALID_NUMBER` for a value that is not a number.
 * @example
 * ```ts
 * import { float, asinh } from 'quadspread';
 * asinh(float, 1).toFixed(12);
 * //=> '0.881373587020'
 * ```
 */
export function asinh<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'asinh');
  const x = A.from(value);
  if (A.isZero(x)) return x;
  const ax = A.abs(x);
  const r = A.log(A.add(ax, sqrtAny(A, A.add(A.mul(ax, ax), A.one))));
  return A.sign(x) < 0 ? A.neg(r) : r;
}

/**
 * x^y. An integer exponent (|y| ≤ 1024) is computed by repeated squaring, exactly in
 * `rational`; any other exponent as e^(y ln x), which needs x ≥ 0.
 *
 * @param A the arithmetic
 * @param base the base
 * @param exponent the exponent
 * @returns x^y
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` for x < 0 with a non-integer y;
 *   `DIVISION_BY_ZERO` for 0 to a negative power.
 * @example
 * ```ts
 * import { rational, float, pow } from 'quadspread';
 * rational.toString(pow(rational, rational.from('2/3'), rational.from(3)));
 * //=> '8/27'
 * pow(float, 2, 0.5).toFixed(12);
 * //=> '1.414213562373'
 * ```
 */
export function pow<T>(A: Arithmetic<T>, base: Numeric<T>, exponent: Numeric<T>): T {
  checkArithmetic(A, 'pow');
  const x = A.from(base);
  const y = A.from(exponent);
  const yn = Math.round(A.toNumber(y));
  if (Math.abs(yn) <= 1024 && A.eq(A.from(yn), y)) {
    let b = x;
    let result = A.one;
    for (let k = Math.abs(yn); k > 0; k >>= 1) {
      if (k & 1) result = A.mul(result, b);
      if (k > 1) b = A.mul(b, b);
    }
    return yn < 0 ? A.div(A.one, result) : result;
  }
  const s = A.sign(x);
  if (s < 0)
    throw noRealSolution(
      'pow(A, x, y)',
      `x = ${show(A.toString(x))} is negative and y = ${show(A.toString(y))} is not an integer`,
    );
  if (s === 0) {
    if (A.sign(y) > 0) return A.zero;
    throw noRealSolution('pow(A, x, y)', `0 to the power ${show(A.toString(y))} is not finite`);
  }
  return A.exp(A.mul(y, A.log(x)));
}

/**
 * tan x = sin x / cos x, x in radians.
 *
 * @param A the arithmetic
 * @param value the angle in radians
 * @returns tan x
 * @throws {QuadspreadError} `DIVISION_BY_ZERO` where the arithmetic's cos x is 0.
 * @example
 * ```ts
 * import { float, tan } from 'quadspread';
 * tan(float, 1).toFixed(12);
 * //=> '1.557407724655'
 * ```
 */
export function tan<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'tan');
  const x = A.from(value);
  return A.div(A.sin(x), A.cos(x));
}

/**
 * atan x in (−π/2, π/2) radians, as atan2(x, 1).
 *
 * @param A the arithmetic
 * @param value the argument
 * @returns atan x in radians
 * @throws {QuadspreadError} `INVALID_NUMBER` for a value that is not a number.
 * @example
 * ```ts
 * import { float, atan } from 'quadspread';
 * atan(float, 1) * 4;
 * //=> 3.141592653589793
 * ```
 */
export function atan<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'atan');
  const x = A.from(value);
  if (A.isZero(x)) return x;
  return A.atan2(x, A.one);
}

/**
 * asin x in [−π/2, π/2] radians, as atan2(x, √(1 − x²)).
 *
 * @param A the arithmetic
 * @param value the argument, −1 ≤ x ≤ 1
 * @returns asin x in radians
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when |x| > 1.
 * @example
 * ```ts
 * import { float, asin } from 'quadspread';
 * asin(float, 0.5).toFixed(12);
 * //=> '0.523598775598'
 * ```
 */
export function asin<T>(A: Arithmetic<T>, value: Numeric<T>): T {
  checkArithmetic(A, 'asin');
  const x = A.from(value);
  const c2 = A.sub(A.one, A.mul(x, x));
  if (A.sign(c2) < 0)
    throw noRealSolution('asin(A, x)', `|x| = ${show(A.toString(A.abs(x)))} is above 1`);
  if (A.isZero(x)) return x;
  return A.atan2(x, A.isZero(c2) ? c2 : sqrtAny(A, c2));
}
