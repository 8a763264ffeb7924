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
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, expectObject, finiteResult, shownInput } from '../geometry/validate.js';
import { sinCosDegrees } from '../readings/trig.js';
import {
  ellipsoidParameters,
  readEllipsoid,
  type Ellipsoid,
  type EllipsoidParameters,
} from './ellipsoid.js';
import {
  claimedDigits,
  delegateFor,
  readHeight,
  readLatitude,
  readLongitude,
  root,
  tenToMinus,
  toDegrees,
} from './internal.js';

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
  checkArithmetic(A, 'heightReductionFactor');
  const R = readNumber(A, radius, 'heightReductionFactor(radius)');
  if (A.sign(R) <= 0)
    throw invalidArgument(
      'heightReductionFactor(radius)',
      `${shownInput(A, radius, R)} is not positive`,
    );
  const H = readHeight(A, h, A.div(R, A.from(2)), 'heightReductionFactor(h)', 'R/2');
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
  [
    [1, 2, 1],
    [-2, 3, 2],
    [5, 16, 3],
    [41, 180, 4],
    [-127, 288, 5],
    [7891, 37800, 6],
  ],
  [
    [13, 48, 2],
    [-3, 5, 3],
    [557, 1440, 4],
    [281, 630, 5],
    [-1983433, 1935360, 6],
  ],
  [
    [61, 240, 3],
    [-103, 140, 4],
    [15061, 26880, 5],
    [167603, 181440, 6],
  ],
  [
    [49561, 161280, 4],
    [-179, 168, 5],
    [6601661, 7257600, 6],
  ],
  [
    [34729, 80640, 5],
    [-3418889, 1995840, 6],
  ],
  [[212378941, 319334400, 6]],
];

/** Σ z^(2k+1)/(2k+1) = atanh z for |z| < 1/10, in A, until a term is below tol. */
function atanhSmall<T>(A: Arithmetic<T>, z: T, tol: T): T {
  const z2 = A.mul(z, z);
  let p = z;
  let sum = z;
  for (let k = 3; k < 400; k += 2) {
    p = A.mul(p, z2);
    const term = A.div(p, A.from(k));
    sum = A.add(sum, term);
    if (A.cmp(A.abs(term), tol) <= 0) break;
  }
  return sum;
}

/** Σ w^(2k+1)/(2k+1)! = sinh w for |w| < 1/10, in A, until a term is below tol. */
function sinhSmall<T>(A: Arithmetic<T>, w: T, tol: T): T {
  const w2 = A.mul(w, w);
  let t = w;
  let sum = w;
  for (let k = 2; k < 400; k += 2) {
    t = A.div(A.mul(t, w2), A.from(k * (k + 1)));
    sum = A.add(sum, t);
    if (A.cmp(A.abs(t), tol) <= 0) break;
  }
  return sum;
}

/** atanh z for |z| < 1: halve by atanh z = 2 atanh(z/(1 + √(1 − z²))) until |z| < 1/10, then the series. */
function atanhAny<T>(A: Arithmetic<T>, z: T, tol: T): T {
  let doublings = 0;
  const tenth = A.from('0.1');
  while (A.cmp(A.abs(z), tenth) > 0 && doublings < 60) {
    // tanh(x/2) = tanh x/(1 + sech x), sech x = √(1 − tanh²x)
    z = A.div(z, A.add(A.one, root(A, A.sub(A.one, A.mul(z, z)))));
    doublings += 1;
  }
  let r = atanhSmall(A, z, tol);
  for (let i = 0; i < doublings; i++) r = A.add(r, r);
  return r;
}

/** The core of Krüger's series at a point: scale k/k0, convergence in radians, and optionally ξ, η. */
interface KrugerResult<T> {
  readonly k: T;
  readonly gamma: T;
  readonly xi?: T;
  readonly eta?: T;
  /** A/a: the rectifying radius over a. */
  readonly Aa: T;
}

function kruger<T>(
  A: Arithmetic<T>,
  E: EllipsoidParameters<T>,
  lat: T,
  dlon: T,
  where: string,
  wantGrid: boolean,
): KrugerResult<T> {
  const { sin: sp, cos: cp } = sinCosDegrees(A, lat);
  const { sin: sl, cos: cl } = sinCosDegrees(A, dlon);
  if (A.sign(cl) <= 0)
    throw invalidArgument(
      `${where}(point.lon)`,
      'the point is 90° or more from the central meridian',
    );
  const digits = claimedDigits(A);
  const tol = tenToMinus(A, digits + 4);
  const one = A.one;
  const two = A.from(2);
  // Conformal latitude χ: tan χ = τ′ = τ√(1 + σ²) − σ√(1 + τ²), τ = tan φ,
  // σ = sinh(e atanh(e sin φ)) (Karney 2011, eqs. 7–9); multiplied through by cos φ:
  // S = τ′ cos φ = sin φ √(1 + σ²) − σ, which stays finite at the poles.
  const e = root(A, E.e2);
  const sigma = sinhSmall(A, A.mul(e, atanhSmall(A, A.mul(e, sp), tol)), tol);
  const S = A.sub(A.mul(sp, root(A, A.add(one, A.mul(sigma, sigma)))), sigma);
  const Ccl = A.mul(cp, cl);
  const D2 = A.add(A.mul(S, S), A.mul(Ccl, Ccl)); // cos²φ (τ′² + cos²λ)
  if (A.isZero(D2))
    throw invalidArgument(`${where}(point)`, 'the projection is singular at this point');
  const D = root(A, D2);
  // Gauss–Schreiber: ξ′ = atan2(τ′, cos λ), sinh η′ = sin λ/√(τ′² + cos²λ) (Karney 2011, eq. 10)
  const sx = A.div(S, D); // sin ξ′
  const cx = A.div(Ccl, D); // cos ξ′
  const she = A.div(A.mul(cp, sl), D); // sinh η′
  const che = root(A, A.add(one, A.mul(she, she))); // cosh η′
  // Double angles, then multiples by (cos + i sin)^j and (cosh + sinh)^j.
  const c2 = A.sub(A.mul(cx, cx), A.mul(sx, sx));
  const s2 = A.mul(two, A.mul(sx, cx));
  const ch2 = A.add(one, A.mul(two, A.mul(she, she)));
  const sh2 = A.mul(two, A.mul(she, che));
  const n = E.n;
  const powers: T[] = [one];
  for (let i = 1; i <= 6; i++) powers.push(A.mul(powers[i - 1]!, n));
  let cj = c2;
  let sj = s2;
  let chj = ch2;
  let shj = sh2;
  let pp = one; // p′ = 1 + Σ 2j α_j cos 2jξ′ cosh 2jη′
  let qq = A.zero; // q′ = Σ 2j α_j sin 2jξ′ sinh 2jη′  (Karney 2011, eqs. 11–13)
  let dxi = A.zero; // Σ α_j sin 2jξ′ cosh 2jη′
  let deta = A.zero; // Σ α_j cos 2jξ′ sinh 2jη′  (Karney 2011, eq. 11)
  for (let j = 1; j <= 6; j++) {
    let alpha = A.zero;
    for (const [num, den, pow] of ALPHA[j - 1]!)
      alpha = A.add(alpha, A.div(A.mul(A.from(num), powers[pow]!), A.from(den)));
    if (j === 6 && A.cmp(A.mul(A.abs(alpha), chj), A.from('1e-10')) > 0) {
      // The terms grow like cosh 2jη′: where the last one, α₆ cosh 12η′, exceeds 1e-10 (of a,
      // about 0.6 mm) the truncated series no longer holds (at the equator about 61° from
      // the central meridian; nearer 90° it returns nonsense). Derived from the series.
      throw invalidArgument(
        `${where}(point.lon)`,
        `the point is too far from the central meridian for Krüger's series to n⁶ (its last term is ${show(A.toNumber(A.mul(A.abs(alpha), chj)))})`,
      );
    }
    const w = A.mul(A.from(2 * j), alpha);
    pp = A.add(pp, A.mul(w, A.mul(cj, chj)));
    qq = A.add(qq, A.mul(w, A.mul(sj, shj)));
    if (wantGrid) {
      dxi = A.add(dxi, A.mul(alpha, A.mul(sj, chj)));
      deta = A.add(deta, A.mul(alpha, A.mul(cj, shj)));
    }
    const cn = A.sub(A.mul(cj, c2), A.mul(sj, s2));
    const sn = A.add(A.mul(sj, c2), A.mul(cj, s2));
    const chn = A.add(A.mul(chj, ch2), A.mul(shj, sh2));
    const shn = A.add(A.mul(shj, ch2), A.mul(chj, sh2));
    cj = cn;
    sj = sn;
    chj = chn;
    shj = shn;
  }
  // Rectifying radius over a: A/a = (1 + n²/4 + n⁴/64 + n⁶/256)/(1 + n) (Karney 2011, eq. 14)
  const Aa = A.div(
    A.add(
      A.add(A.add(one, A.div(powers[2]!, A.from(4))), A.div(powers[4]!, A.from(64))),
      A.div(powers[6]!, A.from(256)),
    ),
    A.add(one, n),
  );
  // k′ = √(1 − e² sin²φ) √(1 + τ²)/√(τ′² + cos²λ) = √(1 − e² sin²φ)/D; k″ = (A/a)√(p′² + q′²)
  // (Karney 2011, eqs. 25–26 and 28)
  const kPrime = A.div(root(A, A.sub(one, A.mul(E.e2, A.mul(sp, sp)))), D);
  const kDouble = A.mul(Aa, root(A, A.add(A.mul(pp, pp), A.mul(qq, qq))));
  // γ′ = atan(τ′ tan λ/√(1 + τ′²)) = atan2(S sin λ, cos λ √(S² + cos²φ)); γ″ = atan2(q′, p′)
  // (Karney 2011, eqs. 25 and 27)
  const gamma1 = A.atan2(A.mul(S, sl), A.mul(cl, root(A, A.add(A.mul(S, S), A.mul(cp, cp)))));
  const gamma2 = A.atan2(qq, pp);
  const out: KrugerResult<T> = { k: A.mul(kPrime, kDouble), gamma: A.add(gamma1, gamma2), Aa };
  if (!wantGrid) return out;
  // ξ = ξ′ + Σ α_j sin 2jξ′ cosh 2jη′, η = η′ + Σ α_j cos 2jξ′ sinh 2jη′ (Krüger; Karney 2011, eq. 11)
  const xiP = A.atan2(S, Ccl);
  const etaP = atanhAny(A, A.div(she, che), tol); // η′ = atanh(tanh η′)
  return { ...out, xi: A.add(xiP, dxi), eta: A.add(etaP, deta) };
}

/**
 * The constants of the Transverse Mercator float twin (projection-float.ts `tmInto`), each
 * computed by the same operations as {@link kruger} and `tm` compute them on every call: e²,
 * e, α₁…α₆, A/a, ξ0 of the true origin, k0·a·(A/a), k0. @internal
 */
export function tmTwinConstants<T>(A: Arithmetic<T>, ell: Ellipsoid, lat0: T, k0: T): T[] {
  const E = ellipsoidParameters(A, ell);
  const one = A.one;
  const n = E.n;
  const powers: T[] = [one];
  for (let i = 1; i <= 6; i++) powers.push(A.mul(powers[i - 1]!, n));
  const alphas: T[] = [];
  for (let j = 1; j <= 6; j++) {
    let alpha = A.zero;
    for (const [num, den, pow] of ALPHA[j - 1]!)
      alpha = A.add(alpha, A.div(A.mul(A.from(num), powers[pow]!), A.from(den)));
    alphas.push(alpha);
  }
  const r = kruger(A, E, lat0, A.zero, 'prepareProjection', true);
  return [E.e2, root(A, E.e2), ...alphas, r.Aa, r.xi!, A.mul(k0, A.mul(E.a, r.Aa)), k0];
}

/**
 * Point scale factor k and grid convergence γ of a Transverse Mercator projection at a
 * geodetic point, by Krüger's series in the third flattening n (Krüger 1912), in the form
 * and to the order n⁶ of Karney (2011): the conformal latitude (eqs. 7–9), the
 * Gauss–Schreiber coordinates (eq. 10), the series and its derivative (eqs. 11–13, 35) and
 * the scale and convergence that follow (eqs. 25–28), written here without tangents so that
 * the poles are regular. Only sin, cos, atan2, √ and rapidly converging power series (atanh
 * and sinh of small arguments) are used, so it runs in every arithmetic.
 *
 * Accuracy: the series truncation limits k to about 1e-15 relative and γ to about 1e-15 rad
 * within 4000 km of the central meridian (Karney 2011), whatever the arithmetic's digits.
 * In `rational` it is evaluated in decimal with 50 digits and read back.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in degrees or DMS text
 * @param projection `{ lon0, k0?, ellipsoid }`
 * @returns `{ k, convergence }` (convergence in degrees)
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`; `INVALID_ANGLE`; `INVALID_ARGUMENT`
 *   for a point 90° or more from the central meridian, or so far from it that the series
 *   to n⁶ no longer holds (its last term above 1e-10; at the equator beyond about 61°), or
 *   k0 ≤ 0; `UNKNOWN_ELLIPSOID`.
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
  checkArithmetic(A, 'transverseMercatorFactors');
  const r = tm(A, point, projection, false);
  return { k: r.k, convergence: r.convergence };
}

/** A Transverse Mercator grid: a {@link TransverseMercator} with a true origin and false coordinates. */
export interface TransverseMercatorGrid extends TransverseMercator {
  /** Latitude of the true origin, degrees or DMS text (default 0). */
  readonly lat0?: Numeric<never>;
  /** Easting of the true origin, metres (default 0). */
  readonly falseEasting?: Numeric<never>;
  /** Northing of the true origin, metres (default 0). */
  readonly falseNorthing?: Numeric<never>;
}

/** Grid coordinates of a point with its point scale factor and convergence. */
export interface GridPoint<T> extends TmFactors<T> {
  /** Easting, metres. */
  readonly E: T;
  /** Northing, metres. */
  readonly N: T;
}

/**
 * Geodetic latitude and longitude to Transverse Mercator grid coordinates, with the point
 * scale factor and convergence: E = E0 + k0·A·η, N = N0 + k0·A·(ξ − ξ0), A the rectifying
 * radius, ξ, η from Krüger's series (see {@link transverseMercatorFactors}; Karney 2011,
 * eqs. 11 and 14), ξ0 that of the true origin on the central meridian.
 *
 * Accuracy: about 1 µm within 4000 km of the central meridian from the series (Karney 2011),
 * and the arithmetic's rounding.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in degrees or DMS text
 * @param projection `{ lon0, lat0?, k0?, falseEasting?, falseNorthing?, ellipsoid }`
 * @returns `{ E, N, k, convergence }`: metres, metres, the scale factor, degrees
 * @throws {QuadspreadError} as {@link transverseMercatorFactors}.
 * @example
 * ```ts
 * import { float, transverseMercator, GRS80 } from 'quadspread';
 * // UTM zone 31 (central meridian 3° E, k0 = 0.9996, false easting 500 km): on the central meridian E is the false easting
 * transverseMercator(float, { lat: 0, lon: 3 }, { lon0: 3, k0: 0.9996, falseEasting: 500000, ellipsoid: GRS80 }).E;
 * //=> 500000
 * ```
 */
export function transverseMercator<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: TransverseMercatorGrid,
): GridPoint<T> {
  checkArithmetic(A, 'transverseMercator');
  const r = tm(A, point, projection, true);
  return { E: r.E, N: r.N, k: r.k, convergence: r.convergence };
}

/**
 * {@link transverseMercator} with ξ0 of the true origin given (as `tm` computes it on every
 * call otherwise): what a prepared projection uses. @internal
 */
export function transverseMercatorFrom<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: TransverseMercatorGrid,
  xi0: T | undefined,
): GridPoint<T> {
  checkArithmetic(A, 'transverseMercator');
  const r = tm(A, point, projection, true, xi0);
  return { E: r.E, N: r.N, k: r.k, convergence: r.convergence };
}

/**
 * ξ0 of the true origin at `lat0` (degrees, in A), as `tm` computes it on every call, or
 * `undefined` where that throws (then every call computes it, and throws, as before). @internal
 */
export function originXiOf<T>(A: Arithmetic<T>, ell: Ellipsoid, lat0: T): T | undefined {
  try {
    return kruger(A, ellipsoidParameters(A, ell), lat0, A.zero, 'transverseMercator', true).xi;
  } catch {
    return undefined;
  }
}

function tm<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: TransverseMercatorGrid,
  wantGrid: boolean,
  originXi?: T,
): GridPoint<T> & { xi0: T } {
  const where = wantGrid ? 'transverseMercator' : 'transverseMercatorFactors';
  expectObject(point, `${where}(point)`, '{ lat, lon }');
  const { ell, k0, lon0, lat0, E0, N0 } = readProjection(A, projection, where);
  const E = ellipsoidParameters(A, ell);
  const lat = readLatitude(A, point.lat, `${where}(point.lat)`);
  const lon = readLongitude(A, point.lon, `${where}(point.lon)`);
  if (A.exact) {
    // An approximation in any case: evaluate in decimal with 8 guard digits and read the
    // result back exactly, so that exact fractions do not grow through the series.
    const { D, to: t, back } = delegateFor(A, claimedDigits(A) + 8);
    const r = tm(
      D,
      { lat: t(lat), lon: t(lon) },
      {
        lon0: t(lon0) as never,
        lat0: t(lat0) as never,
        k0: t(k0) as never,
        falseEasting: t(E0) as never,
        falseNorthing: t(N0) as never,
        ellipsoid: ell,
      },
      wantGrid,
    );
    return {
      E: back(r.E),
      N: back(r.N),
      k: back(r.k),
      convergence: back(r.convergence),
      xi0: back(r.xi0),
    };
  }
  const c = kruger(A, E, lat, A.sub(lon, lon0), where, wantGrid);
  const k = A.mul(k0, c.k);
  const convergence = toDegrees(A, c.gamma);
  // A huge k0 or false origin can overflow float: NOT_FINITE rather than NaN or ±Infinity.
  finiteResult(k, where);
  if (!wantGrid) return { E: A.zero, N: A.zero, k, convergence, xi0: A.zero };
  const xi0 = originXi ?? kruger(A, E, lat0, A.zero, where, true).xi!;
  const kA = A.mul(k0, A.mul(E.a, c.Aa)); // k0 · A, A = a · (A/a)
  return {
    E: finiteResult(A.add(E0, A.mul(kA, c.eta!)), where),
    N: finiteResult(A.add(N0, A.mul(kA, A.sub(c.xi!, xi0))), where),
    k,
    convergence,
    xi0,
  };
}

/** The projection's members, read and checked, naming `where(projection.member)` on error. */
function readProjection<T>(A: Arithmetic<T>, projection: TransverseMercatorGrid, where: string) {
  expectObject(projection, `${where}(projection)`, '{ lon0, k0, ellipsoid }');
  const at = (k: string): string => `${where}(projection.${k})`;
  const ell = readEllipsoid(projection.ellipsoid, at('ellipsoid'));
  const k0 = readNumber(A, (projection.k0 ?? 1) as Numeric<T>, at('k0'));
  if (A.sign(k0) <= 0) throw invalidArgument(at('k0'), `${show(projection.k0)} is not positive`);
  return {
    ell,
    k0,
    lon0: readLongitude(A, projection.lon0 as Numeric<T>, at('lon0')),
    lat0: readLatitude(A, (projection.lat0 ?? 0) as Numeric<T>, at('lat0')),
    E0: readNumber(A, (projection.falseEasting ?? 0) as Numeric<T>, at('falseEasting')),
    N0: readNumber(A, (projection.falseNorthing ?? 0) as Numeric<T>, at('falseNorthing')),
  };
}

/**
 * The combined factor (height reduction factor × point scale factor): grid distance =
 * ground distance × combined factor. Exact in `rational` given its factors.
 *
 * @param A the arithmetic
 * @param heightFactor from {@link heightReductionFactor}
 * @param scaleFactor k from {@link transverseMercatorFactors} (the mean over the line for long lines)
 * @returns the combined factor
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when a factor is not positive; `NOT_FINITE` in float when the product overflows.
 * @example
 * ```ts
 * import { rational, combinedFactor } from 'quadspread';
 * rational.toString(combinedFactor(rational, '63800/63801', '0.9996'));
 * //=> '31262/31275'
 * ```
 */
export function combinedFactor<T>(
  A: Arithmetic<T>,
  heightFactor: Numeric<T>,
  scaleFactor: Numeric<T>,
): T {
  checkArithmetic(A, 'combinedFactor');
  const h = positive(A, heightFactor, 'combinedFactor(heightFactor)');
  const k = positive(A, scaleFactor, 'combinedFactor(scaleFactor)');
  return finiteResult(A.mul(h, k), 'combinedFactor(heightFactor, scaleFactor)');
}

function positive<T>(A: Arithmetic<T>, x: Numeric<T>, where: string): T {
  const v = readNumber(A, x, where);
  if (A.sign(v) <= 0) throw invalidArgument(where, `${shownInput(A, x, v)} is not positive`);
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
  checkArithmetic(A, 'groundToGrid');
  return finiteResult(
    A.mul(
      readNumber(A, ground, 'groundToGrid(ground)'),
      positive(A, factor, 'groundToGrid(factor)'),
    ),
    'groundToGrid(ground, factor)',
  );
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
  checkArithmetic(A, 'gridToGround');
  return A.div(
    readNumber(A, grid, 'gridToGround(grid)'),
    positive(A, factor, 'gridToGround(factor)'),
  );
}

/** Most Newton steps {@link transverseMercatorInverse} takes. */
const MAX_INVERSE_STEPS = 40;

/**
 * Transverse Mercator grid coordinates back to geodetic latitude and longitude, by Newton's
 * iteration on {@link transverseMercator} with its exact Jacobian: a conformal map scales
 * every small displacement by k and turns it by the convergence γ, so a grid residual
 * (dE, dN) corresponds on the ellipsoid to east de = (cos γ dE + sin γ dN)/k and north
 * dn = (−sin γ dE + cos γ dN)/k, i.e. dφ = dn/M, dλ = de/(N cos φ) (derived from the
 * definitions of k and γ; M, N the radii of curvature). Quadratic convergence; it stops when
 * the grid residual is below a·10^−digits (about 6 nm in `float`). No inverse series is
 * needed, so the forward and inverse agree to the arithmetic's precision by construction.
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in metres
 * @param projection as for {@link transverseMercator}
 * @returns `{ lat, lon, k, convergence }`: degrees, degrees, the scale factor, degrees
 * @throws {QuadspreadError} `NOT_CONVERGED` if 40 steps do not converge (points within a
 *   few metres of a pole, or far outside the projection's zone); `INVALID_NUMBER`;
 *   `UNKNOWN_ELLIPSOID`; `INVALID_ARGUMENT` for k0 ≤ 0 or where the forward series is
 *   refused (see {@link transverseMercatorFactors}).
 * @example
 * ```ts
 * import { float, transverseMercatorInverse, GRS80 } from 'quadspread';
 * const g = transverseMercatorInverse(float, { E: 500000, N: 0 }, { lon0: 3, k0: 0.9996, falseEasting: 500000, ellipsoid: GRS80 });
 * [g.lat, g.lon];
 * //=> [0, 3]
 * ```
 */
export function transverseMercatorInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: TransverseMercatorGrid,
): { lat: T; lon: T; k: T; convergence: T } {
  checkArithmetic(A, 'transverseMercatorInverse');
  const where = 'transverseMercatorInverse';
  expectObject(point, `${where}(point)`, '{ E, N }');
  const { ell, k0, lon0, lat0, E0, N0 } = readProjection(A, projection, where);
  const Et = readNumber(A, point.E, `${where}(point.E)`);
  const Nt = readNumber(A, point.N, `${where}(point.N)`);
  if (A.exact) {
    const { D, to, back } = delegateFor(A, claimedDigits(A) + 8);
    const r = transverseMercatorInverse(D, { E: to(Et), N: to(Nt) }, projection);
    return { lat: back(r.lat), lon: back(r.lon), k: back(r.k), convergence: back(r.convergence) };
  }
  const P = ellipsoidParameters(A, ell);
  const perRad = A.div(A.from(180), A.pi); // degrees per radian
  const ka = A.mul(k0, P.a);
  // Start on a sphere of radius a: φ ≈ φ0 + (N − N0)/(k0 a), λ ≈ λ0 + (E − E0)/(k0 a cos φ).
  const ninety = A.from('89.9');
  const clampLat = (x: T): T =>
    A.cmp(x, ninety) > 0 ? ninety : A.cmp(x, A.neg(ninety)) < 0 ? A.neg(ninety) : x;
  let lat = clampLat(A.add(lat0, A.mul(A.div(A.sub(Nt, N0), ka), perRad)));
  let lon = A.add(lon0, A.mul(A.div(A.sub(Et, E0), A.mul(ka, sinCosDegrees(A, lat).cos)), perRad));
  const digits = claimedDigits(A);
  const tol = A.mul(P.a, tenToMinus(A, digits));
  const noise = A.mul(P.a, tenToMinus(A, Math.max(1, digits - 3)));
  let prev: T | undefined;
  let xi0: T | undefined;
  for (let i = 0; i < MAX_INVERSE_STEPS; i++) {
    const f = tm(A, { lat, lon }, projection, true, xi0);
    xi0 = f.xi0;
    const dE = A.sub(Et, f.E);
    const dN = A.sub(Nt, f.N);
    const size = A.add(A.abs(dE), A.abs(dN));
    if (
      A.cmp(size, tol) <= 0 ||
      (prev !== undefined && A.cmp(size, noise) <= 0 && A.cmp(A.add(size, size), prev) >= 0)
    ) {
      return { lat, lon, k: f.k, convergence: f.convergence };
    }
    prev = size;
    const g = sinCosDegrees(A, f.convergence);
    // ground displacement (east, north) = Rot(γ)ᵀ (dE, dN) / k
    const de = A.div(A.add(A.mul(g.cos, dE), A.mul(g.sin, dN)), f.k);
    const dn = A.div(A.sub(A.mul(g.cos, dN), A.mul(g.sin, dE)), f.k);
    const { sin: sp, cos: cp } = sinCosDegrees(A, lat);
    const W = root(A, A.sub(A.one, A.mul(P.e2, A.mul(sp, sp))));
    const M = A.div(A.mul(P.a, A.sub(A.one, P.e2)), A.mul(W, A.mul(W, W))); // meridian radius
    const Nr = A.div(P.a, W); // prime-vertical radius
    lat = clampLat(A.add(lat, A.mul(A.div(dn, M), perRad)));
    lon = A.add(lon, A.mul(A.div(de, A.mul(Nr, cp)), perRad));
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    `${where}(point)`,
    `Newton's iteration did not converge in ${MAX_INVERSE_STEPS} steps`,
  );
}
