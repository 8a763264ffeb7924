/**
 * Standard uncertainties of readings, one rule for the library and the job file: a σ is a
 * number in the unit of its value (arc-seconds for an angle), or a value with a unit of its
 * own (`'3 mm'`, `'2"'`), or for a distance `{ constant, ppm }`.
 *
 * @module readings
 */
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import { readNumber } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { angleToDegrees } from './angle.js';
import { checkLengthUnit, lengthIn } from './length.js';
import { approxSqrt } from './numeric.js';
import type { LengthUnit } from './length.js';

/**
 * A distance's standard uncertainty as an instrument states it: a constant part (a length in
 * the distance's unit, or text with its own unit) and a part proportional to the distance, in
 * parts per million.
 */
export interface ConstantAndPpm<T> {
  /** The constant part: a number in the unit of the distance, or text with its own unit (`'2 mm'`). */
  readonly constant: Numeric<T>;
  /** The part proportional to the distance, in ppm (10⁻⁶ of the distance); default 0. */
  readonly ppm?: Numeric<T>;
}

/** A standard uncertainty of a length reading: see {@link lengthSigma}. */
export type LengthSigma<T> = Numeric<T> | ConstantAndPpm<T>;

function nonNegative<T>(A: Arithmetic<T>, s: T, where: string, raw: unknown): T {
  if (A.sign(s) < 0) throw new QuadspreadError('INVALID_SIGMA', where, `${show(raw)} is negative`);
  return s;
}

/**
 * The standard uncertainty of a length, in the length's unit. A number (or numeric text, or a
 * value) is in that unit; text with a unit of its own is converted from it (`'3 mm'`,
 * `'0.01 ft'`, read as {@link lengthIn} reads lengths); `{ constant, ppm }` combines an
 * instrument's constant part and its part proportional to the distance as
 * σ = √(constant² + (ppm·10⁻⁶·d)²) (the two parts taken as independent, common practice),
 * which needs the distance `d`.
 *
 * @param A the arithmetic
 * @param sigma the standard uncertainty, ≥ 0
 * @param unit the unit of the length it belongs to (default `'m'`)
 * @param distance the distance (in `unit`), for `{ constant, ppm }`
 * @returns σ in `unit` (in an exact arithmetic, `{ constant, ppm }` with both parts non-zero
 *   gives a rational within 1e-48 relative of the root)
 * @throws {QuadspreadError} `INVALID_SIGMA` for a negative σ; `INVALID_ARGUMENT` for
 *   `{ constant, ppm }` without the distance; `INVALID_UNIT`, `INVALID_NUMBER` as {@link lengthIn}.
 * @example
 * ```ts
 * import { rational, lengthSigma } from 'quadspread';
 * const R = rational;
 * [R.toString(lengthSigma(R, '3 mm')), R.toString(lengthSigma(R, 0.01, 'ft'))];
 * //=> ['3/1000', '1/100']
 * // 3 mm + 4 ppm over 1000 m: √(3² + 4²) mm = 5 mm
 * R.toString(lengthSigma(R, { constant: '3 mm', ppm: 4 }, 'm', 1000));
 * //=> '1/200'
 * ```
 */
export function lengthSigma<T>(
  A: Arithmetic<T>,
  sigma: LengthSigma<T>,
  unit: LengthUnit = 'm',
  distance?: Numeric<T>,
): T {
  checkArithmetic(A, 'lengthSigma');
  const where = 'lengthSigma(sigma)';
  const u = checkLengthUnit(unit, 'lengthSigma(unit)');
  if (sigma !== null && typeof sigma === 'object' && 'constant' in sigma) {
    const c = nonNegative(A, lengthIn(A, sigma.constant, u), `${where}.constant`, sigma.constant);
    const ppm =
      sigma.ppm === undefined
        ? A.zero
        : nonNegative(A, readNumber(A, sigma.ppm, `${where}.ppm`), `${where}.ppm`, sigma.ppm);
    if (A.isZero(ppm)) return c;
    if (distance === undefined)
      throw invalidArgument(where, '{ constant, ppm } needs the distance it belongs to');
    const d = A.abs(lengthIn(A, distance, u));
    const p = A.div(A.mul(ppm, d), A.from(1000000));
    if (A.isZero(c)) return p;
    // σ² = constant² + (ppm·10⁻⁶·d)²: the two parts independent (common practice).
    const q = A.add(A.mul(c, c), A.mul(p, p));
    return approxSqrt(A, q);
  }
  return nonNegative(A, lengthIn(A, sigma as Numeric<T>, u), where, sigma);
}

/**
 * The standard uncertainty of an angle, in degrees. A number (or numeric text, or a value)
 * is in **arc-seconds**; text with marks or a unit of its own is read as an angle
 * (`'2"'`, `"0°00'05"`, `'0.5 mgon'`, `'1 mil'`, `'0.00001 rad'`).
 *
 * @param A the arithmetic
 * @param sigma the standard uncertainty, ≥ 0
 * @returns σ in degrees
 * @throws {QuadspreadError} `INVALID_SIGMA` for a negative σ; `INVALID_ANGLE`,
 *   `INVALID_NUMBER` for text that is not an angle.
 * @example
 * ```ts
 * import { rational, angleSigma } from 'quadspread';
 * const R = rational;
 * [R.toString(angleSigma(R, 5)), R.toString(angleSigma(R, '5"')), R.toString(angleSigma(R, '1 mgon'))];
 * //=> ['1/720', '1/720', '9/10000']
 * ```
 */
export function angleSigma<T>(A: Arithmetic<T>, sigma: Numeric<T>): T {
  checkArithmetic(A, 'angleSigma');
  const where = 'angleSigma(sigma)';
  let deg: T;
  if (typeof sigma === 'string') {
    const m = /^\s*(.*?)\s*(mgon|gon|mil|rad|deg)\s*$/.exec(sigma);
    if (m)
      deg =
        m[2] === 'mgon'
          ? angleToDegrees(A, A.div(readNumber(A, m[1]!, where), A.from(1000)), 'gon')
          : angleToDegrees(A, m[1]!, m[2] as 'gon' | 'mil' | 'rad' | 'deg');
    else if (/["'°:′″]/.test(sigma)) deg = angleToDegrees(A, sigma);
    else deg = A.div(readNumber(A, sigma, where), A.from(3600)); // 1″ = 1/3600°
  } else deg = A.div(readNumber(A, sigma, where), A.from(3600));
  return nonNegative(A, deg, where, sigma);
}
