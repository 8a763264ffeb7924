/**
 * The height h from a vertical quadrance H and the side of the level it lies on.
 *
 * @module elevation
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, invalidArgument, show, checkArithmetic } from '../errors.js';
import { readQuadrance } from '../geometry/validate.js';
import { asRoot, isSurd, sqrtOf, type Root, type Surd } from '../geometry/surd.js';
import { approxSqrt } from '../readings/numeric.js';

/**
 * The signed height h = ±√H of a point whose vertical quadrance above (or below) a level is H:
 * positive above the level, negative below. The height functions return H, which stays exact
 * in `rational`; this gives the length, as an exact surd in `rational` (√H is rarely rational)
 * and a correctly rounded value in `decimal` and `float`.
 *
 * @param A the arithmetic
 * @param H the vertical quadrance, ≥ 0 (square of the length unit)
 * @param sign +1 (default) above the level, −1 below, 0 on it (then H must be 0)
 * @returns h, in the length unit of √H
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE` when H < 0; `INVALID_ARGUMENT` for a sign
 *   other than −1, 0, 1, or a sign of 0 with H ≠ 0.
 * @example
 * ```ts
 * import { rational, heightFromQuadrance } from 'quadspread';
 * [heightFromQuadrance(rational, '225/4').toString(), heightFromQuadrance(rational, 50, -1).toString()];
 * //=> ['15/2', '-5√2']
 * ```
 */
export function heightFromQuadrance<T, E extends boolean>(
  A: Arithmetic<T, E>,
  H: Numeric<T>,
  sign: -1 | 0 | 1 = 1,
): Root<T, E> {
  checkArithmetic(A, 'heightFromQuadrance');
  const w = 'heightFromQuadrance(A, H, sign)';
  const q = readQuadrance(A, H, w, 'H');
  if (sign !== 1 && sign !== -1 && sign !== 0)
    throw invalidArgument(`${w} sign`, `${show(sign)} is not -1, 0 or 1`);
  if (sign === 0 && !A.isZero(q))
    throw invalidArgument(`${w} sign`, `sign 0 (on the level) with H = ${show(A.toString(q))}`);
  const h = sqrtOf(A, q);
  if (sign >= 0) return h;
  return (isSurd(h) ? (h as Surd<T>).neg() : A.neg(h as T)) as Root<T, E>;
}

/** ±√H for H a root: exact where H is rational, else through the arithmetic's approximate root. @internal */
export function signedHeightOfRoot<T, E extends boolean>(
  A: Arithmetic<T, E>,
  H: Root<T, E>,
  sign: -1 | 0 | 1,
): Root<T, E> {
  if (!isSurd(H)) return heightFromQuadrance(A, H as T, sign);
  const s = H as Surd<T>;
  const q = s.toRational();
  if (q !== undefined) return heightFromQuadrance(A, q, sign);
  // a + b√d to A.digits + 10 significant digits (the surd rounds it exactly), then its root
  const value = A.from(s.toPrecision(A.digits + 10));
  const h = approxSqrt(A, A.sign(value) < 0 ? A.zero : value);
  return asRoot(A, sign < 0 ? A.neg(h) : h);
}

/**
 * h₁ − h₂ for two heights on the same side of the level (sign +1 above, −1 below), from their
 * vertical quadrances H₁, H₂: sign·(√H₁ − √H₂), a length. Exact (a surd) in an exact arithmetic
 * when the two roots share a radicand or are rational; otherwise (H₁ − H₂)/(√H₁ + √H₂), free of
 * cancellation, with the roots to the arithmetic's digits + 10 (a rational in `rational`).
 * @internal
 */
export function heightDifference<T, E extends boolean>(
  A: Arithmetic<T, E>,
  H1: Root<T, E>,
  H2: Root<T, E>,
  sign: -1 | 0 | 1,
): Root<T, E> {
  const h1 = signedHeightOfRoot(A, H1, 1);
  const h2 = signedHeightOfRoot(A, H2, 1);
  const sg = sign < 0 ? -1 : 1;
  if (!A.exact) {
    const sum = A.add(h1 as T, h2 as T);
    if (A.isZero(sum)) return A.zero as Root<T, E>;
    const d = A.div(A.sub(H1 as T, H2 as T), sum);
    return (sg < 0 ? A.neg(d) : d) as Root<T, E>;
  }
  const s1 = h1 as Surd<T>;
  const s2 = h2 as Surd<T>;
  try {
    const d = s1.sub(s2);
    return (sg < 0 ? d.neg() : d) as Root<T, E>;
  } catch (e) {
    if (!(e instanceof QuadspreadError) || e.code !== 'DIFFERENT_RADICANDS') throw e;
  }
  const digits = A.digits + 10;
  const num = A.from(asSurd(A, H1).sub(asSurd(A, H2)).toPrecision(digits));
  const den = A.add(A.from(s1.toPrecision(digits)), A.from(s2.toPrecision(digits)));
  const d = A.div(num, den);
  return asRoot(A, sg < 0 ? A.neg(d) : d);
}

function asSurd<T, E extends boolean>(A: Arithmetic<T, E>, x: Root<T, E>): Surd<T> {
  return isSurd(x) ? (x as Surd<T>) : (asRoot(A, x as T) as Surd<T>);
}
