/**
 * Uncertain inputs: a measured value with its standard uncertainty.
 *
 * @module uncertainty
 */
import type { Numeric } from '../arithmetic/types.js';
import { Uncertain } from '../arithmetic/uncertain.js';
import type { UncertainArithmetic, UncertainInput } from '../arithmetic/uncertain.js';
import { readNumber } from '../geometry/validate.js';
import { checkU, readName, readSigma } from './internal.js';
import { checkArithmetic } from '../errors.js';

/**
 * An uncertain input: the measured value `value` with standard uncertainty `sigma`
 * (same units as `value`), identified in budgets by `name`. Its gradient is 1 with
 * respect to itself. Compute with it in `U` like any number; `budget` then tells how
 * much of the result's uncertainty it causes.
 *
 * The name identifies the input: use each name for one input only (`budget` refuses two
 * different inputs with one name).
 *
 * @param U an uncertain arithmetic, e.g. `uncertain(float)`
 * @param value the measured value xᵢ, read by `U.base`
 * @param sigma its standard uncertainty u(xᵢ) ≥ 0, same units as `value`
 * @param name a non-empty name (at most 200 characters)
 * @returns the value with gradient {name: 1}
 * @throws {QuadspreadError} `INVALID_NUMBER` naming `value` when it cannot be read; `INVALID_SIGMA`
 *   when `sigma` is negative or not a number; `INVALID_ARGUMENT` for a bad name or when `U`
 *   is not an uncertain arithmetic.
 * @example
 * ```ts
 * import { uncertain, float, measured, budget } from 'quadspread';
 * const U = uncertain(float);
 * const d = measured(U, 25.4, 0.003, 'd');
 * budget(U, U.mul(d, U.from(2))).sigma;
 * //=> 0.006
 * ```
 */
export function measured<T>(
  U: UncertainArithmetic<T>,
  value: Numeric<T>,
  sigma: Numeric<T>,
  name: string,
): Uncertain<T> {
  checkArithmetic(U, 'measured');
  const where = 'measured(U, value, sigma, name)';
  const n = readName(name, where);
  const s = readSigma(U, sigma, where);
  const v = readNumber(U.base, value, where, ' value');
  const input: UncertainInput<T> = Object.freeze({ name: n, value: v, sigma: s });
  return new Uncertain(v, [input], [U.base.one]);
}

/**
 * The inputs a value depends on, with ∂value/∂input, in the order of its `gradient`.
 *
 * @param U the uncertain arithmetic of `y`
 * @param y a value of `U`
 * @returns `{ name, value, sigma, sensitivity }` for each input
 * @throws {QuadspreadError} `INVALID_NUMBER` when `y` is not a value of `U`;
 *   `INVALID_ARGUMENT` when `U` is not an uncertain arithmetic.
 * @example
 * ```ts
 * import { uncertain, float, measured, sensitivities } from 'quadspread';
 * const U = uncertain(float);
 * const a = measured(U, 2, 0.1, 'a');
 * const b = measured(U, 5, 0.2, 'b');
 * sensitivities(U, U.mul(a, b)).map((s) => [s.name, s.sensitivity]);
 * //=> [['a', 5], ['b', 2]]
 * ```
 */
export function sensitivities<T>(
  U: UncertainArithmetic<T>,
  y: Uncertain<T>,
): { name: string; value: T; sigma: T; sensitivity: T }[] {
  checkArithmetic(U, 'sensitivities');
  checkU(U, 'sensitivities(U, y)');
  const v = readNumber(U, y, 'sensitivities(U, y) y');
  return [...v.gradient].map(([input, c]) => ({
    name: input.name,
    value: input.value,
    sigma: input.sigma,
    sensitivity: c,
  }));
}
