/**
 * Ground to grid: the height reduction of a horizontal ground distance to the ellipsoid,
 * the point scale factor and grid convergence of a Transverse Mercator projection, the
 * combined factor, and the conversions both ways.
 *
 * Directions (the usual source of setting-out blunders):
 * - ellipsoid distance = ground distance × height factor, height factor = R/(R + h) < 1 above the ellipsoid;
 * - grid distance = ellipsoid distance × point scale factor k;
 * - grid distance = ground distance × combined factor (height factor × k);
 * - ground distance = grid distance ÷ combined factor — what is set out on the ground
 *   from grid coordinates.
 *
 * @module geodesy
 */
import { QuadspreadError, show } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { sinCosDegrees } from '../readings/trig.js';
import { ellipsoidParameters, readEllipsoid, type Ellipsoid } from './ellipsoid.js';
import { claimedDigits, decimalFor, readHeight, readLatitude, readLongitude, root, settle, tenToMinus, toDegrees, toDecimalText } from './internal.js';

/**
 * The height reduction factor R/(R + h): a horizontal distance measured on the ground at
 * ellipsoidal height h (the mean height of the line; h = orthometric height + geoid
 * undulation) times this factor is the distance on the ellipsoid (similar triangles on a
 * sphere of radius R; e.g. Ghilani & Wolf, *Elementary Surveying*, ch. 20, from memory).
 * Exact in `rational`.
 *
 * @param A the arithmetic
 * @param h ellipsoidal height of the line, metres, ≥ −R/2
 * @param radius R, metres: {@link radiusInAzimuth} of the line or {@link gaussianMeanRadius}
 * @returns the factor (below 1 above the ellipsoid)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for R ≤ 0; `HEIGHT_OUT_OF_RANGE` for h < −R/2.
 * @example
 * ```ts
 * import { rational, heightReductionFactor } from 'quadspread';
 * rational.toString(heightReductionFactor(rational, 100, 6380000));
 * //=> '63800/63801'
 * ```
 */
export function heightReductionFactor<T>(A: Arithmetic<T>, h: Numeric<T>, radius: Numeric<T>): T {
  const R = A.from(radius);
  if (A.sign(R) <= 0) throw new QuadspreadError('INVALID_ARGUMENT', 'heightReductionFactor(radius)', `${show(typeof radius === 'object' ? A.toString(R) : radius)} is not positive`);
  const H = readHeight(A, h, A.div(R, A.from(2)), 'heightReductionFactor(h)');
  return A.div(R, A.add(R, H)); // R/(R + h)
}

/** A Transverse Mercator projection: central meridian, scale on it, ellipsoid. */
export interface TransverseMercator {
  /** Longitude of the central meridian, degrees or DMS text. */
  readonly lon0: Numeric<never>;
  /** Scale factor on the central meridian (UTM 0.9996; OSGB 0.9996012717). Default 1. */
  readonly k0?: Numeric<never>;
  /** The ellipsoid or its name. */
  readonly ellipsoid: Ellipsoid | string;
}

/** Point scale factor and grid convergence of a Transverse Mercator projection at a point. */
export interface TmFactors<T> {
  /** Point scale factor k: grid distance = ellipsoid distance × k (for short lines). */
  readonly k: T;
  /**
   * Grid convergence γ in degrees: the angle from true north clockwise to grid north
   * (positive east of the central meridian in the northern hemisphere).
   * Grid bearing = true (geodetic) azimuth − γ.
   */
  readonly convergence: T;
}

// Krüger's series coefficients α_j in n to order n⁶ (L. Krüger, *Konforme Abbildung des
// Erdellipsoids in der Ebene*, Potsdam 1912; to n⁶ as given by C. F. F. Karney,
// "Transverse Mercator with an accuracy of a few nanometers", J. Geodesy 85:475–485,
// 2011, eq. 35). Each row: [numerator, denominator, power of n].
const ALPHA: readonly (readonly (readonly [number, number, number])[])[] = [
  [[1, 2, 1], [-2, 3, 2], [5, 16, 3], [41, 180, 4], [-127, 288, 5], [7891, 37800, 6]],
  [[13, 48, 2], [-3, 5, 3], [557, 1440, 4], [281, 630, 5], [-1983433, 1935360, 6]],
  [[61, 240, 3], [-103, 140, 4], [15061, 26880, 5], [167603, 181440, 6]],
  [[49561, 161280, 4], [-179, 168, 5], [6601661, 7257600, 6]],
  [[34729, 80640, 5], [-3418889, 1995840, 6]],
  [[212378941, 319334400, 6]],
];

/** Σ z^(2k+1)/(2k+1) = atanh z for |z| < 1/10, in A, until a term is below tol. */
function atanhSmall<T>(A: Arithmetic<T>, z: T, tol: T, d: number): T {
  const z2 = A.mul(z, z);
  let p = z;
  let sum = z;
  for (let k = 3; k < 400; k += 2) {
    p = settle(A, A.mul(p, z2), d);
    const term = A.div(p, A.from(k));
    sum = A.add(sum, term);
    if (A.cmp(A.abs(term), tol) <= 0) break;
  }
  return sum;
}

/** Σ w^(2k+1)/(2k+1)! = sinh w for |w| < 1/10, in A, until a term is below tol. */
function sinhSmall<T>(A: Arithmetic<T>, w: T, tol: T, d: number): T {
  const w2 = A.mul(w, w);
  let t = w;
  let sum = w;
  for (let k = 2; k < 400; k += 2) {
    t = settle(A, A.div(A.mul(t, w2), A.from(k * (k + 1))), d);
    sum = A.add(sum, t);
    if (A.cmp(A.abs(t), tol) <= 0) break;
  }
  return sum;
}

/**
 * Point scale factor k and grid convergence γ of a Transverse Mercator projection at a
 * geodetic point, by Krüger's series in the third flattening n (Krüger 1912), in the form
 * and to the order n⁶ of Karney (2011), eqs. 7–9 (conformal latitude), 10–11 (Gauss–Schreiber
 * coordinates), 35 (coefficients) and the scale and convergence formulas that follow from
 * the derivative of the series: k = k0 · √(1 − e² sin²φ)/√(τ′² + cos²λ)·√(1+τ²)… written
 * here without tangents so that the poles are regular. Only sin, cos, atan2, √ and two
 * rapidly converging power series (atanh and sinh of small arguments) are used, so it runs
 * in every arithmetic.
 *
 * Accuracy: the series truncation limits k to about 1e-15 relative and γ to about 1e-15 rad
 * within 4000 km of the central meridian (Karney 2011), whatever the arithmetic's digits.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in degrees or DMS text
 * @param projection `{ lon0, k0?, ellipsoid }`
 * @returns `{ k, convergence }` (convergence in degrees)
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`; `INVALID_ANGLE`; `INVALID_ARGUMENT`
 *   for a point 90° or more from the central meridian or k0 ≤ 0; `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, transverseMercatorFactors, GRS80 } from 'quadspread';
 * const f = transverseMercatorFactors(float, { lat: 52, lon: 3 }, { lon0: 3, k0: 0.9996, ellipsoid: GRS80 });
 * [f.k.toFixed(12), f.convergence];
 * //=> ['0.999600000000', 0]
 * ```
 */
export function transverseMercatorFactors<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: TransverseMercator,
): TmFactors<T> {
  const where = 'transverseMercatorFactors';
  if (point === null || typeof point !== 'object') throw new QuadspreadError('INVALID_ARGUMENT', `${where}(point)`, `${show(point)} is not { lat, lon }`);
  if (projection === null || typeof projection !== 'object') throw new QuadspreadError('INVALID_ARGUMENT', `${where}(projection)`, `${show(projection)} is not { lon0, k0, ellipsoid }`);
  const E = ellipsoidParameters(A, readEllipsoid(projection.ellipsoid, `${where}(projection.ellipsoid)`));
  const k0 = A.from(projection.k0 ?? 1);
  if (A.sign(k0) <= 0) throw new QuadspreadError('INVALID_ARGUMENT', `${where}(projection.k0)`, `${show(projection.k0)} is not positive`);
  const lat = readLatitude(A, point.lat, `${where}(point.lat)`);
  if (A.exact) {
    // An approximation in any case: evaluate in decimal with 8 guard digits and read the
    // result back exactly, so that exact fractions do not grow through the series.
    const d = claimedDigits(A) + 8;
    const D = decimalFor(d);
    const r = transverseMercatorFactors(
      D,
      { lat: toDecimalText(A, lat, d), lon: toDecimalText(A, readLongitude(A, point.lon, `${where}(point.lon)`), d) },
      { lon0: toDecimalText(A, readLongitude(A, projection.lon0 as Numeric<T>, `${where}(projection.lon0)`), d), k0: toDecimalText(A, k0, d), ellipsoid: projection.ellipsoid },
    );
    return { k: A.from(D.toString(r.k)), convergence: A.from(D.toString(r.convergence)) };
  }
  const dlon = A.sub(readLongitude(A, point.lon, `${where}(point.lon)`), readLongitude(A, projection.lon0 as Numeric<T>, `${where}(projection.lon0)`));
  const { sin: sp, cos: cp } = sinCosDegrees(A, lat);
  const { sin: sl, cos: cl } = sinCosDegrees(A, dlon);
  if (A.sign(cl) <= 0) throw new QuadspreadError('INVALID_ARGUMENT', `${where}(point.lon)`, 'the point is 90° or more from the central meridian');
  const digits = claimedDigits(A);
  const tol = tenToMinus(A, digits + 4);
  const z = (x: T): T => settle(A, x, digits);
  const one = A.one;
  const two = A.from(2);
  // Conformal latitude χ: tan χ = τ′ = τ√(1 + σ²) − σ√(1 + τ²), σ = sinh(e atanh(e sin φ)/…)
  // (Karney 2011, eqs. 7–9); multiplied through by cos φ: S = τ′ cos φ = sin φ √(1 + σ²) − σ.
  const e = root(A, E.e2);
  const sigma = z(sinhSmall(A, z(A.mul(e, atanhSmall(A, z(A.mul(e, sp)), tol, digits))), tol, digits));
  const S = z(A.sub(A.mul(sp, root(A, A.add(one, A.mul(sigma, sigma)))), sigma));
  const Ccl = z(A.mul(cp, cl));
  const D2 = A.add(A.mul(S, S), A.mul(Ccl, Ccl)); // cos²φ (τ′² + cos²λ)
  if (A.isZero(D2)) throw new QuadspreadError('INVALID_ARGUMENT', `${where}(point)`, 'the projection is singular at this point');
  const D = z(root(A, D2));
  // Gauss–Schreiber: ξ′ = atan2(τ′, cos λ), sinh η′ = sin λ/√(τ′² + cos²λ) (Karney 2011, eq. 10)
  const sx = z(A.div(S, D)); // sin ξ′
  const cx = z(A.div(Ccl, D)); // cos ξ′
  const she = z(A.div(A.mul(cp, sl), D)); // sinh η′
  const che = z(root(A, A.add(one, A.mul(she, she)))); // cosh η′
  // Double angles, then multiples by (cos + i sin)^j and (cosh + sinh)^j.
  const c2 = z(A.sub(A.mul(cx, cx), A.mul(sx, sx)));
  const s2 = z(A.mul(two, A.mul(sx, cx)));
  const ch2 = z(A.add(one, A.mul(two, A.mul(she, she))));
  const sh2 = z(A.mul(two, A.mul(she, che)));
  // Coefficients α_j in A.
  const n = E.n;
  const powers: T[] = [one];
  for (let i = 1; i <= 6; i++) powers.push(A.mul(powers[i - 1]!, n));
  let cj = c2;
  let sj = s2;
  let chj = ch2;
  let shj = sh2;
  let pp = one; // p′ = 1 + Σ 2j α_j cos 2jξ′ cosh 2jη′
  let qq = A.zero; // q′ = Σ 2j α_j sin 2jξ′ sinh 2jη′  (Karney 2011, eqs. 11–13)
  for (let j = 1; j <= 6; j++) {
    let alpha = A.zero;
    for (const [num, den, pow] of ALPHA[j - 1]!) alpha = A.add(alpha, A.div(A.mul(A.from(num), powers[pow]!), A.from(den)));
    const w = z(A.mul(A.from(2 * j), alpha));
    pp = z(A.add(pp, A.mul(w, A.mul(cj, chj))));
    qq = z(A.add(qq, A.mul(w, A.mul(sj, shj))));
    const cn = A.sub(A.mul(cj, c2), A.mul(sj, s2));
    const sn = A.add(A.mul(sj, c2), A.mul(cj, s2));
    const chn = A.add(A.mul(chj, ch2), A.mul(shj, sh2));
    const shn = A.add(A.mul(shj, ch2), A.mul(chj, sh2));
    cj = z(cn);
    sj = z(sn);
    chj = z(chn);
    shj = z(shn);
  }
  // Rectifying radius over a: A/a = (1 + n²/4 + n⁴/64 + n⁶/256)/(1 + n) (Karney 2011, eq. 14)
  const Aa = A.div(
    A.add(A.add(A.add(one, A.div(powers[2]!, A.from(4))), A.div(powers[4]!, A.from(64))), A.div(powers[6]!, A.from(256))),
    A.add(one, n),
  );
  // k′ = √(1 − e² sin²φ) √(1 + τ²)/√(τ′² + cos²λ) = √(1 − e² sin²φ)/D ; k″ = (A/a)√(p′² + q′²)
  const kPrime = A.div(root(A, A.sub(one, A.mul(E.e2, A.mul(sp, sp)))), D);
  const kDouble = A.mul(Aa, root(A, A.add(A.mul(pp, pp), A.mul(qq, qq))));
  const k = A.mul(k0, A.mul(kPrime, kDouble));
  // γ′ = atan(τ′ tan λ/√(1 + τ′²)) = atan2(S sin λ, cos λ √(S² + cos²φ)); γ″ = atan2(q′, p′)
  const gamma1 = A.atan2(A.mul(S, sl), A.mul(cl, root(A, A.add(A.mul(S, S), A.mul(cp, cp)))));
  const gamma2 = A.atan2(qq, pp);
  return { k, convergence: toDegrees(A, A.add(gamma1, gamma2)) };
}

/**
 * The combined factor (height reduction factor × point scale factor): grid distance =
 * ground distance × combined factor. Exact in `rational` given its factors.
 *
 * @param A the arithmetic
 * @param heightFactor from {@link heightReductionFactor}
 * @param scaleFactor k from {@link transverseMercatorFactors} (the mean over the line for long lines)
 * @returns the combined factor
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when a factor is not positive.
 * @example
 * ```ts
 * import { rational, combinedFactor } from 'quadspread';
 * rational.toString(combinedFactor(rational, '63800/63801', '0.9996'));
 * //=> '31262/31275'
 * ```
 */
export function combinedFactor<T>(A: Arithmetic<T>, heightFactor: Numeric<T>, scaleFactor: Numeric<T>): T {
  const h = positive(A, heightFactor, 'combinedFactor(heightFactor)');
  const k = positive(A, scaleFactor, 'combinedFactor(scaleFactor)');
  return A.mul(h, k);
}

function positive<T>(A: Arithmetic<T>, x: Numeric<T>, where: string): T {
  const v = A.from(x);
  if (A.sign(v) <= 0) throw new QuadspreadError('INVALID_ARGUMENT', where, `${show(typeof x === 'object' ? A.toString(v) : x)} is not positive`);
  return v;
}

/**
 * A horizontal ground distance to the grid: ground × combined factor.
 *
 * @param A the arithmetic
 * @param ground horizontal distance measured on the ground, metres
 * @param factor the combined factor ({@link combinedFactor})
 * @returns the grid distance, metres
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a factor ≤ 0.
 * @example
 * ```ts
 * import { rational, groundToGrid } from 'quadspread';
 * rational.toString(groundToGrid(rational, 1000, '0.9995'));
 * //=> '1999/2'
 * ```
 */
export function groundToGrid<T>(A: Arithmetic<T>, ground: Numeric<T>, factor: Numeric<T>): T {
  return A.mul(A.from(ground), positive(A, factor, 'groundToGrid(factor)'));
}

/**
 * A grid distance (from grid coordinates) to the horizontal distance to set out on the
 * ground: grid ÷ combined factor.
 *
 * @param A the arithmetic
 * @param grid distance computed from grid coordinates, metres
 * @param factor the combined factor ({@link combinedFactor})
 * @returns the ground distance, metres
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a factor ≤ 0.
 * @example
 * ```ts
 * import { rational, gridToGround } from 'quadspread';
 * rational.toString(gridToGround(rational, '999.5', '0.9995'));
 * //=> '1000'
 * ```
 */
export function gridToGround<T>(A: Arithmetic<T>, grid: Numeric<T>, factor: Numeric<T>): T {
  return A.div(A.from(grid), positive(A, factor, 'gridToGround(factor)'));
}
