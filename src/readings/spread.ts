/**
 * Angles to spreads and back: the spread of an angle θ is sin²θ.
 *
 * @module readings
 */
import { QuadspreadError, checkArithmetic } from '../errors.js';
import { readNumber, shownInput } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readAngle, type AngleUnit } from './angle.js';
import { modulo, sinCos } from './trig.js';
import { approxSqrt, guardOf, viaGuard } from './numeric.js';

/** @internal reads a spread and checks 0 ≤ s ≤ 1. */
export function checkSpread<T>(A: Arithmetic<T>, s: Numeric<T>, where: string): T {
  const v = readNumber(A, s, where);
  if (A.sign(v) < 0 || A.cmp(v, A.one) > 0) {
    throw new QuadspreadError(
      'SPREAD_OUT_OF_RANGE',
      where,
      `${shownInput(A, s, v)} is outside [0, 1]`,
    );
  }
  return v;
}

/**
 * The spread of an angle: s = sin²θ (the definition of spread: the square of the sine of
 * the angle between two lines).
 *
 * Exact in `rational` when θ is a multiple of 30° or 45° (spreads 0, 1/4, 1/2, 3/4, 1);
 * otherwise the square of {@link sinCosDegrees}' sine, within the arithmetic's stated
 * transcendental tolerance (1e-40 relative in `rational`, so well inside the library's
 * 1e-20 promise for angle readings). In `decimal(n)` computed with 10 guard digits and
 * rounded once.
 *
 * @param A the arithmetic
 * @param angle the angle: degrees, DMS text, or a number in `unit`
 * @param unit `'deg'` (default), `'gon'`, `'mil'` or `'rad'`
 * @returns the spread, in [0, 1]
 * @throws {QuadspreadError} as {@link angleToDegrees}; `INVALID_ANGLE` for an angle too large
 *   to reduce (as {@link sinCosDegrees}).
 * @example
 * ```ts
 * import { rational, spreadFromDegrees } from 'quadspread';
 * rational.toString(spreadFromDegrees(rational, 60));
 * //=> '3/4'
 * rational.toString(spreadFromDegrees(rational, 50, 'gon'));
 * //=> '1/2'
 * ```
 */
export function spreadFromDegrees<T>(
  A: Arithmetic<T>,
  angle: Numeric<T>,
  unit: AngleUnit = 'deg',
): T {
  checkArithmetic(A, 'spreadFromDegrees');
  const G = guardOf(A);
  if (G)
    return viaGuard(A, G, angle, (g, x) => spreadOfAngle(g, x as Numeric<typeof g.zero>, unit));
  return spreadOfAngle(A, angle, unit);
}

/** @internal {@link spreadFromDegrees} computed directly in A. */
export function spreadOfAngle<T>(A: Arithmetic<T>, angle: Numeric<T>, unit: AngleUnit = 'deg'): T {
  const deg = readAngle(A, angle, unit);
  // Multiples of 30° and 45°: s = (1 − cos 2θ)/2 (the double-angle formula) with cos 2θ exactly
  // 0, ±1/2 or ±1, so s is exactly 0, 1/4, 1/2, 3/4 or 1 (and an arithmetic that carries
  // derivatives keeps ds/dθ = sin 2θ·π/180). Elsewhere sin²θ, which has no cancellation near 0°.
  // Both are multiples of 15°, whose nearest number over 15 is within rounding of an integer:
  // that cheap test skips the exact checks for every other angle.
  const n = A.toNumber(deg) / 15;
  if (
    Math.abs(n - Math.round(n)) <= 1e-9 * Math.max(1, Math.abs(n)) &&
    (A.isZero(modulo(A, deg, A.from(30), 'spreadFromDegrees(angle)')) ||
      A.isZero(modulo(A, deg, A.from(45), 'spreadFromDegrees(angle)')))
  ) {
    return A.div(A.sub(A.one, sinCos(A, A.mul(deg, A.from(2))).cos), A.from(2));
  }
  const { sin } = sinCos(A, deg);
  return A.mul(sin, sin);
}

/**
 * The angle in [0°, 90°] whose spread is s: θ = atan2(√s, √(1 − s)) in degrees.
 *
 * Exact for the spreads 0, 1/4, 1/2, 3/4 and 1 (0°, 30°, 45°, 60°, 90°; an arithmetic
 * carrying derivatives keeps dθ/ds at 1/4, 1/2, 3/4); otherwise
 * through `A.atan2` and `A.pi`, so in `rational` a rational within 1e-40 relative. A
 * spread says nothing of a sign or of which of θ and 180° − θ: see
 * {@link VerticalReading} for readings that keep their sign.
 *
 * @param A the arithmetic
 * @param s the spread, in [0, 1]
 * @returns the acute angle in degrees
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` when s is outside [0, 1].
 * @example
 * ```ts
 * import { rational, degreesFromSpread } from 'quadspread';
 * rational.toString(degreesFromSpread(rational, '1/4'));
 * //=> '30'
 * ```
 */
export function degreesFromSpread<T>(A: Arithmetic<T>, s: Numeric<T>): T {
  checkArithmetic(A, 'degreesFromSpread');
  const G = guardOf(A);
  if (G) {
    checkSpread(A, s, 'degreesFromSpread(s)');
    return viaGuard(A, G, s, (g, x) => degreesOfSpread(g, x as Numeric<typeof g.zero>));
  }
  return degreesOfSpread(A, s);
}

/** @internal {@link degreesFromSpread} computed directly in A. */
export function degreesOfSpread<T>(A: Arithmetic<T>, s: Numeric<T>): T {
  const v = checkSpread(A, s, 'degreesFromSpread(s)');
  if (A.isZero(v)) return A.zero;
  if (A.eq(v, A.one)) return A.from(90);
  const sin = approxSqrt(A, v);
  const cos = approxSqrt(A, A.sub(A.one, v));
  const exact: [string, number][] = [
    ['1/4', 30],
    ['1/2', 45],
    ['3/4', 60],
  ];
  for (const [spread, deg] of exact) {
    const c = A.from(spread);
    if (A.eq(v, c)) {
      // the exact angle, plus (s − c)·dθ/ds (zero in value) so that derivatives carry through:
      // dθ/ds = 1/(2 sin θ cos θ) rad = 90/(π sin θ cos θ) degrees
      return A.add(
        A.from(deg),
        A.mul(A.sub(v, c), A.div(A.from(90), A.mul(A.pi, A.mul(sin, cos)))),
      );
    }
  }
  const rad = A.atan2(sin, cos);
  return A.div(A.mul(rad, A.from(180)), A.pi); // 180° = π rad
}
