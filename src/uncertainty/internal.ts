/**
 * Internal helpers of the uncertainty module (not re-exported).
 *
 * @module uncertainty
 * @internal
 */
import { QuadspreadError, show, invalidArgument } from '../errors.js';
import type { Numeric } from '../arithmetic/types.js';
import type { UncertainArithmetic } from '../arithmetic/uncertain.js';
import { bitLength, isqrt, ratioToNumber } from '../arithmetic/exact.js';

/**
 * Refuses anything but an uncertain arithmetic (a plain `float` or `rational` has no `base`).
 * @internal
 */
export function checkU(U: unknown, where: string): void {
  if (
    U === null ||
    typeof U !== 'object' ||
    typeof (U as { base?: unknown }).base !== 'object' ||
    typeof (U as { make?: unknown }).make !== 'function'
  ) {
    const name = U !== null && typeof U === 'object' ? (U as { name?: unknown }).name : U;
    throw invalidArgument(
      where,
      `U = ${show(name)} is not an uncertain arithmetic (make one with uncertain(float), uncertain(decimal(n)) or uncertain(rational))`,
    );
  }
}

/**
 * Reads a standard uncertainty: a number of the base arithmetic that is ≥ 0.
 * @internal
 */
export function readSigma<T>(U: UncertainArithmetic<T>, sigma: Numeric<T>, where: string): T {
  checkU(U, where);
  if (typeof sigma === 'number' && sigma >= 0 && sigma - sigma === 0) return U.base.from(sigma);
  let s: T;
  try {
    s = U.base.from(sigma);
  } catch {
    throw new QuadspreadError('INVALID_SIGMA', where, `${show(sigma)} is not a number`);
  }
  if (U.base.sign(s) < 0)
    throw new QuadspreadError('INVALID_SIGMA', where, `${show(sigma)} is negative`);
  return s;
}

/** @internal */
export function readName(name: unknown, where: string): string {
  if (typeof name !== 'string' || name.length === 0 || name.length > 200) {
    throw invalidArgument(where, `the name ${show(name)} is not a string of 1 to 200 characters`);
  }
  return name;
}

/**
 * The JS number nearest to √(n/d) (n ≥ 0, d > 0; ties to even), exactly with bigints:
 * s = ⌊√(n·4ᵏ/d)⌋ with at least 59 bits, and a sticky half when the root is inexact, so
 * that rounding s (+ ½)·2⁻ᵏ once to 53 bits rounds √(n/d) itself.
 * @internal
 */
export function sqrtRatioToNumber(n: bigint, d: bigint): number {
  if (n === 0n) return 0;
  const k = Math.ceil((120 - (bitLength(n) - bitLength(d))) / 2) + 1;
  const num = k >= 0 ? n << BigInt(2 * k) : n;
  const den = k >= 0 ? d : d << BigInt(-2 * k);
  const N = num / den;
  const s = isqrt(N);
  const inexact = num % den !== 0n || s * s !== N;
  const m = inexact ? 2n * s + 1n : 2n * s; // √(n/d) ≈ m/2^(k+1)
  const e = k + 1;
  return e >= 0 ? ratioToNumber(m, 1n << BigInt(e)) : ratioToNumber(m << BigInt(-e), 1n);
}
