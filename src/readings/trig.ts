/**
 * Sine and cosine of an angle in degrees, exact where the value is rational.
 *
 * @module readings
 */
import { show, invalidAngle, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { guardOf } from './numeric.js';
import { sinCosFloat } from './trig-float.js';

/**
 * @internal ⌊text⌋ of a value written as a fraction `n/d` or as decimal text (`-1.25e3`), or
 * undefined for other text (an uncertain value's form).
 */
export function floorOfText(text: string): bigint | undefined {
  const f = /^(-?\d+)(?:\/(\d+))?$/.exec(text);
  if (f) {
    const n = BigInt(f[1]!);
    const d = BigInt(f[2] ?? '1');
    const q = n / d;
    return n < 0n && q * d !== n ? q - 1n : q;
  }
  const m = /^(-?)(\d*)(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(text);
  if (!m || (m[2] === '' && (m[3] ?? '') === '')) return undefined;
  const digits = (m[2] ?? '') + (m[3] ?? '');
  const point = (m[2] ?? '').length + Number(m[4] ?? 0); // digits before the decimal point
  if (point > 100000) return undefined;
  const whole = point <= 0 ? 0n : BigInt(digits.slice(0, point).padEnd(point, '0') || '0');
  if (m[1] !== '-') return whole;
  const fraction = point <= 0 ? digits : digits.slice(point);
  return /[1-9]/.test(fraction) ? -whole - 1n : -whole;
}

/**
 * @internal x mod m in [0, m), exact for exact arithmetics, in a bounded number of steps for
 * any finite x: the whole number of m's in x is read exactly from x/m (Muller, "Elementary
 * Functions", ch. 11: reduction by an exact multiple), then at most two corrections.
 * @throws {QuadspreadError} `INVALID_ANGLE` (at `where`) when an inexact arithmetic does not
 *   resolve x to a millionth of m (the remainder would be noise: over about 10¹² in float).
 */
export function modulo<T>(A: Arithmetic<T>, x: T, m: T, where = 'modulo(x)'): T {
  if (A.sign(x) >= 0 && A.cmp(x, m) < 0) return x; // already in [0, m): the common case
  // An inexact arithmetic must still resolve x to a millionth of m (e.g. about 1″ of a turn):
  // (x + m) − x = m to within m·10⁻⁶; otherwise the remainder would be rounding noise.
  if (!A.exact && A.cmp(A.abs(A.sub(A.sub(A.add(x, m), x), m)), A.div(m, A.from(1e6))) > 0) {
    throw invalidAngle(
      where,
      `${show(A.toString(x))} is too large for ${A.name} to reduce modulo ${A.toString(m)}`,
    );
  }
  let r = x;
  const q = floorOfText(A.toString(A.div(x, m)));
  if (q !== undefined && q !== 0n) r = A.sub(x, A.mul(A.from(q), m));
  // Otherwise (an arithmetic whose text is not a plain number), by the nearest float quotient:
  // each pass leaves a remainder about 10¹⁶ times smaller.
  for (let i = 0; i < 8; i++) {
    if (A.sign(r) >= 0 && A.cmp(r, m) < 0) return r;
    const k = q !== undefined ? 0 : Math.floor(A.toNumber(A.div(r, m)));
    r = k === 0 ? (A.sign(r) < 0 ? A.add(r, m) : A.sub(r, m)) : A.sub(r, A.mul(A.from(k), m));
  }
  throw invalidAngle(
    where,
    `${show(A.toString(x))} is too large to reduce modulo ${A.toString(m)}`,
  );
}

/**
 * sin θ and cos θ of an angle θ in degrees.
 *
 * Exact at every multiple of 90° and wherever the value is rational (sin at 30°, 150°,
 * 210°, 330°; cos at 60°, 120°, 240°, 300°; angles are reduced to [−45°, 45°] exactly by
 * whole quadrants). Elsewhere from `A.sin` / `A.cos` of the reduced angle in radians (θ·π/180), so in
 * `rational` within its stated transcendental tolerance (1e-40 relative); in `decimal(n)`
 * computed with 10 guard digits and rounded once (correctly rounded unless within about
 * 10⁻ⁿ⁻¹⁰ relative of a rounding boundary); close to IEEE in `float`.
 *
 * @param A the arithmetic
 * @param degrees the angle in degrees
 * @returns `{ sin, cos }`
 * @throws {QuadspreadError} `INVALID_NUMBER` when `degrees` is not a number; `INVALID_ANGLE`
 *   when it is too large to reduce mod 360° (over about 10¹²° in `float`, where the remainder
 *   would be rounding noise).
 * @example
 * ```ts
 * import { rational, sinCosDegrees } from 'quadspread';
 * const { sin, cos } = sinCosDegrees(rational, -150);
 * [rational.toString(sin), rational.toNumber(cos).toFixed(12)];
 * //=> ['-1/2', '-0.866025403784']
 * ```
 */
export function sinCosDegrees<T>(A: Arithmetic<T>, degrees: Numeric<T>): { sin: T; cos: T } {
  checkArithmetic(A, 'sinCosDegrees');
  if (A.float64 && typeof degrees === 'number') {
    // The float twin (same operations, same order); undefined where sinCos must decide.
    const fast = sinCosFloat(degrees);
    if (fast !== undefined) return fast as unknown as { sin: T; cos: T };
  }
  const G = guardOf(A);
  if (G) {
    // Values cross between A and its guard as values, not text (a decimal(n) reads another's
    // value exactly; text of 1000 digits and more would trip the limit on input text).
    const r = sinCos(G, A.is(degrees) ? G.from(degrees) : degrees);
    return { sin: A.from(r.sin), cos: A.from(r.cos) };
  }
  return sinCos(A, degrees);
}

/**
 * @internal {@link sinCosDegrees} computed directly in A.
 *
 * The angle is reduced to t = θ − 90°·k ∈ [−45°, 45°] with k the nearest whole number of
 * quadrants, and sin θ, cos θ are ±sin t, ±cos t (the quadrant rotations). This subtraction is
 * exact in every arithmetic: |t| ≤ |θ|, and θ and 90°·k are whole multiples of the unit of θ's
 * last digit (or θ is an integer), so t is too and has no more digits than θ (the argument of
 * Sterbenz's lemma; Muller, "Elementary Functions", ch. 11, reduction by an exact multiple).
 * Only an angle of a turn or more is first reduced mod 360° ({@link modulo}), which is also
 * where an inexact arithmetic refuses an angle too large to reduce.
 */
export function sinCos<T>(A: Arithmetic<T>, degrees: Numeric<T>): { sin: T; cos: T } {
  const ninety = A.from(90);
  const x = A.from(degrees);
  const d =
    A.cmp(A.abs(x), A.from(360)) < 0 ? x : modulo(A, x, A.from(360), 'sinCosDegrees(degrees)');
  // The nearest quadrant from the nearest number, then corrected exactly by at most one step.
  let k = Math.round(A.toNumber(d) * (1 / 90));
  let t = k === 0 ? d : A.sub(d, A.from(90 * k));
  if (A.cmp(t, A.from(45)) > 0) {
    k += 1;
    t = A.sub(t, ninety);
  } else if (A.cmp(t, A.from(-45)) < 0) {
    k -= 1;
    t = A.add(t, ninety);
  }
  const perDegree = A.div(A.pi, A.from(180)); // π rad = 180°
  let sin: T;
  let cos: T;
  // The exact cases add (t − t₀)·derivative, which is zero in value, so that an arithmetic
  // carrying derivatives (uncertain) keeps them: d sin = cos·π/180 dt, d cos = −sin·π/180 dt.
  if (A.isZero(t)) {
    sin = A.mul(t, perDegree);
    cos = A.one;
  } else {
    const rad = A.mul(t, perDegree);
    cos = A.cos(rad);
    // sin ±30° = ±1/2 exactly (the 30-60-90 triangle); its cosine √3/2 is irrational.
    const thirty = A.from(30);
    if (A.eq(t, thirty)) {
      sin = A.add(A.div(A.one, A.from(2)), A.mul(A.sub(t, thirty), A.mul(cos, perDegree)));
    } else if (A.eq(t, A.neg(thirty))) {
      sin = A.sub(A.mul(A.add(t, thirty), A.mul(cos, perDegree)), A.div(A.one, A.from(2)));
    } else {
      sin = A.sin(rad);
    }
  }
  // sin(t + 90°) = cos t, cos(t + 90°) = −sin t (the quadrant rotations)
  switch (k & 3) {
    case 0:
      return { sin, cos };
    case 1:
      return { sin: cos, cos: A.neg(sin) };
    case 2:
      return { sin: A.neg(sin), cos: A.neg(cos) };
    default:
      return { sin: A.neg(cos), cos: sin };
  }
}
