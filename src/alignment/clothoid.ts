/**
 * The clothoid (Euler spiral) transition: coordinates along it from its tangent point, and the
 * shift and tangent-point offset of the circular curve it leads into.
 *
 * @module alignment
 */
import { invalidArgument, QuadspreadError, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readLength, seriesEpsilon } from './internal.js';

/** The largest angle turned (radians) that a transition spiral is summed for. */
const MAX_TAU = 4;

/** What {@link clothoid} returns (lengths in the unit of the inputs, angles in radians and degrees). */
export interface Clothoid<T> {
  /** Distance along the tangent from the tangent point (TS or ST). */
  readonly x: T;
  /** Offset from the tangent, towards the curve's centre. */
  readonly y: T;
  /** Angle between the tangent and the spiral at `length`, in radians: τ = l²/(2·R·Ls). */
  readonly angle: T;
}

/**
 * x and y of a clothoid at a distance l along it: the power series of the Fresnel integrals,
 * x = l·Σ (−1)ⁿ τ²ⁿ/((4n + 1)(2n)!), y = l·Σ (−1)ⁿ τ²ⁿ⁺¹/((4n + 3)(2n + 1)!), τ = l²/(2·R·Ls)
 * (Abramowitz and Stegun, *Handbook of Mathematical Functions*, 1964, 7.3.11 and 7.3.13,
 * with the clothoid's curvature l/(R·Ls)). Summed until a term is below 1e-45 of l in
 * `rational` (whose terms are exact), 10^−(n+3) in `decimal(n)`, 1e-18 in `float`.
 *
 * @internal
 */
export function clothoidSeries<T>(A: Arithmetic<T>, l: T, R: T, Ls: T): Clothoid<T> {
  const tau = A.div(A.mul(l, l), A.mul(A.from(2), A.mul(R, Ls)));
  // The series needs about e·τ terms: a transition turns far less than 4 rad (229°), and
  // beyond that the terms grow huge before they shrink (a hang in rational).
  if (A.cmp(tau, A.from(MAX_TAU)) > 0)
    throw invalidArgument(
      'clothoid(A, input)',
      `the transition turns ${A.toString(tau)} rad (l²/(2·R·Ls)), more than ${MAX_TAU} rad: check the radius and length`,
    );
  const eps = seriesEpsilon(A);
  let x = A.zero;
  let y = A.zero;
  let a = A.one; // τᵏ/k!
  for (let k = 0; k < 200; k++) {
    if (k > 0) a = A.div(A.mul(a, tau), A.from(k));
    const term = A.div(a, A.from(2 * k + 1));
    // k = 2n: x gets (−1)ⁿ τ²ⁿ/((4n+1)(2n)!); k = 2n + 1: y gets (−1)ⁿ τ²ⁿ⁺¹/((4n+3)(2n+1)!).
    const negative = (k >> 1) % 2 === 1;
    if (k % 2 === 0) x = negative ? A.sub(x, term) : A.add(x, term);
    else y = negative ? A.sub(y, term) : A.add(y, term);
    if (k > 2 && A.cmp(A.abs(term), eps) < 0) return { x: A.mul(l, x), y: A.mul(l, y), angle: tau };
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    'clothoid(A, input)',
    `the series did not converge for τ = ${A.toString(tau)}`,
  );
}

/**
 * A point of a clothoid (Euler spiral) transition, in its own frame: x along the tangent from
 * the tangent point (TS or ST), y offset towards the curve, and the angle turned, τ = l²/(2·R·Ls)
 * radians, at a distance l along a transition of length Ls that reaches radius R at its end.
 * Sums the Fresnel power series (Abramowitz and Stegun, *Handbook of Mathematical Functions*,
 * 1964, 7.3.11 and 7.3.13): x = l·(1 − τ²/10 + τ⁴/216 − …), y = l·(τ/3 − τ³/42 + …), until
 * a term is below 1e-45 in `rational`, 10^−(n+3) in `decimal(n)`, 1e-18 in `float`. In
 * `rational` every term is exact, so the result is within 1e-45·l of the true value.
 *
 * @param A the arithmetic
 * @param input `{ radius, length, at? }`: the radius R at the transition's end (> 0), its length
 *   Ls (> 0), and the distance l along it (0 ≤ l ≤ Ls; default Ls)
 * @returns `{ x, y, angle }` (angle in radians)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a radius or length ≤ 0, l outside
 *   [0, Ls], or a transition turning more than 4 rad (τ > 4); `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, clothoid } from 'quadspread';
 * const c = clothoid(float, { radius: 3000, length: 210 });
 * [c.x.toFixed(3), c.y.toFixed(3), (c.angle * 180 / Math.PI).toFixed(4)];
 * //=> ['209.974', '2.450', '2.0054']
 * ```
 */
export function clothoid<T>(
  A: Arithmetic<T>,
  input: { readonly radius: Numeric<T>; readonly length: Numeric<T>; readonly at?: Numeric<T> },
): Clothoid<T> {
  checkArithmetic(A, 'clothoid');
  const where = 'clothoid(A, input)';
  if (input === null || typeof input !== 'object')
    throw invalidArgument(where, 'input is not an object { radius, length, at? }');
  const R = readLength(A, input.radius, `${where}.radius`, true);
  const Ls = readLength(A, input.length, `${where}.length`, true);
  const l = input.at === undefined ? Ls : readLength(A, input.at, `${where}.at`);
  if (A.cmp(l, Ls) > 0)
    throw invalidArgument(
      `${where}.at`,
      `${A.toString(l)} is beyond the transition's length ${A.toString(Ls)}`,
    );
  return clothoidSeries(A, l, R, Ls);
}
