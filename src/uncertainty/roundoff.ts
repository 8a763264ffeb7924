/**
 * Round-off: how far a float result strays from the exact rational result of the same
 * computation on the same (decimal) inputs.
 *
 * @module uncertainty
 */
import { show, invalidArgument } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { float } from '../arithmetic/float.js';
import { rational, type Rational } from '../arithmetic/rational.js';

/** The result of {@link roundOff}. */
export interface RoundOff {
  /** The result computed in `float`. */
  readonly float: number;
  /** The result computed in `rational` (exact for + − × ÷). */
  readonly exact: Rational;
  /** |float − exact|, computed exactly and then rounded to a JS number. */
  readonly absolute: number;
  /** absolute / |exact|; `undefined` when the exact result is 0. */
  readonly relative: number | undefined;
}

/** The exact value of a finite double, m/2^k (doubling is exact until m is an integer). */
function exactValue(x: number): Rational {
  let m = x;
  let k = 0n;
  while (!Number.isInteger(m)) {
    m *= 2;
    k++;
  }
  return rational.div(rational.from(BigInt(m)), rational.from(1n << k));
}

/**
 * Runs one computation in `float` and in `rational` and measures the float result's
 * round-off error against the exact one. Write `f` generically and read every input with
 * `A.from(text)`, so that both runs start from the same decimal readings (the float run
 * then includes the rounding of the inputs, as real float code does). The float result is
 * compared through its exact binary value.
 *
 * For computations that are rational functions of their inputs (quadrance, spread, the
 * laws, intersections, areas) the rational run is exact; where `f` uses square roots or
 * transcendental functions the rational run is only as close as those are (see
 * `rational`).
 *
 * @param f the computation, generic in the arithmetic
 * @returns `{ float, exact, absolute, relative }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when `f` does not return a value of the
 *   arithmetic it was given; errors thrown by `f` pass through.
 * @example
 * ```ts
 * import { roundOff, rational } from 'quadspread';
 * const r = roundOff((A) => A.sub(A.add(A.from('0.1'), A.from('0.2')), A.from('0.3')));
 * [r.float, rational.toString(r.exact), r.absolute];
 * //=> [5.551115123125783e-17, '0', 5.551115123125783e-17]
 * ```
 */
export function roundOff(f: <T>(A: Arithmetic<T>) => T): RoundOff {
  const where = 'roundOff(f)';
  if (typeof f !== 'function') throw invalidArgument(where, `${show(f)} is not a function`);
  const x = f(float);
  if (!float.is(x))
    throw invalidArgument(where, `f(float) returned ${show(x)}, not a finite number`);
  const e = f(rational);
  if (!rational.is(e))
    throw invalidArgument(where, `f(rational) returned ${show(e)}, not a rational`);
  const xf = exactValue(x);
  const diff = rational.abs(rational.sub(xf, e));
  const absolute = rational.toNumber(diff);
  const relative = rational.isZero(e)
    ? undefined
    : rational.toNumber(rational.div(diff, rational.abs(e)));
  return Object.freeze({ float: x, exact: e, absolute, relative });
}
