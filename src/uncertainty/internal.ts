/**
 * Internal helpers of the uncertainty module (not re-exported).
 *
 * @module uncertainty
 * @internal
 */
import { QuadspreadError, show } from '../errors.js';
import type { Numeric } from '../arithmetic/types.js';
import type { UncertainArithmetic } from '../arithmetic/uncertain.js';

/**
 * Reads a standard uncertainty: a number of the base arithmetic that is ≥ 0.
 * @internal
 */
export function readSigma<T>(U: UncertainArithmetic<T>, sigma: Numeric<T>, where: string): T {
  if (typeof sigma === 'number' && sigma >= 0 && sigma - sigma === 0) return U.base.from(sigma);
  let s: T;
  try {
    s = U.base.from(sigma);
  } catch {
    throw new QuadspreadError('INVALID_SIGMA', where, `${show(sigma)} is not a number`);
  }
  if (U.base.sign(s) < 0) throw new QuadspreadError('INVALID_SIGMA', where, `${show(sigma)} is negative`);
  return s;
}

/** @internal */
export function readName(name: unknown, where: string): string {
  if (typeof name !== 'string' || name.length === 0 || name.length > 200) {
    throw new QuadspreadError('INVALID_ARGUMENT', where, `the name ${show(name)} is not a string of 1 to 200 characters`);
  }
  return name;
}

