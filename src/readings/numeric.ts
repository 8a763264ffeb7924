/**
 * Internal numeric helpers for the readings: a square root that is exact where it can be
 * and otherwise close, for the places where a reading must become a number (an angle).
 *
 * @module readings
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { MAX_DECIMAL_DIGITS, scaledSqrt } from '../arithmetic/exact.js';

/** Significant digits kept by {@link approxSqrt} in an exact arithmetic. @internal */
export const APPROX_DIGITS = 50;

/**
 * √x as a value of the arithmetic: `A.sqrt(x)` where it exists; in `rational` (an exact
 * arithmetic that gives its values' ratios) where the root is irrational, ⌊√x·10^k⌋/10^k
 * with 10^k chosen from the magnitude of x alone (at least 51 significant digits, below √x
 * by less than 1e-51 relative), so that its denominator never grows with x's; in any other
 * exact arithmetic, a rational within 1e-48 relative: Newton's iteration from
 * the float root on a rounded copy of x (kept to {@link APPROX_DIGITS} significant digits so
 * denominators stay small), then one last step y ← (y + x/y)/2 on x itself, so that an
 * arithmetic carrying derivatives (an uncertain one) gets d√x = dx/(2√x) to first order.
 * For x ≥ 0 only.
 * @internal
 */
export function approxSqrt<T>(A: Arithmetic<T>, x: T): T {
  const r = A.sqrt(x);
  if (r !== undefined) return r;
  if (A.ratio !== undefined) {
    // One integer root on a decimal scale from the magnitude alone (at least 51 digits).
    const q = A.ratio(x);
    const r = scaledSqrt(q.n, q.d, APPROX_DIGITS);
    return A.div(A.from(r.n), A.from(r.d));
  }
  // Newton's iteration for √x (Heron's method): y ← (y + x/y)/2, quadratic convergence.
  const x0 = A.from(A.toPrecision(x, APPROX_DIGITS + 10));
  let y = A.from(Math.sqrt(A.toNumber(x0)));
  if (A.isZero(y)) y = A.from('1e-300');
  const two = A.from(2);
  for (let i = 0; i < 3; i++) {
    y = A.div(A.add(y, A.div(x0, y)), two);
    y = A.from(A.toPrecision(y, APPROX_DIGITS + 5));
  }
  y = A.from(A.toPrecision(y, APPROX_DIGITS));
  return A.div(A.add(y, A.div(x, y)), two);
}

/** Guard digits of the decimal computation behind a transcendental reading in `decimal(n)`. @internal */
export const GUARD_DIGITS = 10;

/**
 * For a `decimal(n)` arithmetic, the `decimal(n + GUARD_DIGITS)` in which a transcendental
 * reading is computed before it is rounded once to n digits; `undefined` for any other
 * arithmetic (which computes directly).
 * @internal
 */
export function guardOf<T>(A: Arithmetic<T>): Arithmetic<T> | undefined {
  // Only an arithmetic with a precision setting ({@link Arithmetic.withDigits}: decimal) has a
  // guarded twin; an uncertain one computes directly (its derivatives need its own values).
  if (A.exact || A.withDigits === undefined) return undefined;
  const digits = A.digits;
  if (digits + GUARD_DIGITS > MAX_DECIMAL_DIGITS) return undefined;
  let G = GUARDS.get(A) as Arithmetic<T> | undefined;
  if (G === undefined) {
    G = A.withDigits(digits + GUARD_DIGITS);
    GUARDS.set(A, G as Arithmetic<unknown>);
  }
  return G as Arithmetic<T>;
}

/**
 * The guard arithmetics made so far, by the arithmetic they guard (weakly held). A memo of
 * immutable, stateless values, not a setting: `withDigits` always gives an arithmetic with the
 * same results, and making one per reading cost more than the reading (a decimal's
 * constructor and elementary tables are built anew).
 */
const GUARDS = new WeakMap<object, Arithmetic<unknown>>();

/**
 * Runs `f` in the guard arithmetic `G` of `A` with an input moved there as a value of `G`
 * (exactly; not as text, which at 1000 digits and more would trip the limit on input text),
 * and rounds the result once into `A`.
 * @internal
 */
export function viaGuard<T, I>(
  A: Arithmetic<T>,
  G: Arithmetic<T>,
  input: I,
  f: (G: Arithmetic<T>, x: I | T) => T,
): T {
  const x = A.is(input) ? G.from(input as unknown as T) : input;
  return A.from(f(G, x));
}
