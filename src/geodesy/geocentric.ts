/**
 * Geodetic latitude, longitude and ellipsoidal height ↔ Earth-centred, Earth-fixed
 * Cartesian coordinates (X, Y, Z).
 *
 * @module geodesy
 */
import { QuadspreadError, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { sinCosDegrees } from '../readings/trig.js';
import {
  parametersAt,
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
import { geocentricInto, geodeticInto } from './geocentric-float.js';

/** The float twins' X, Y, Z and latitude, longitude, height (read at once). */
const XYZ = /* @__PURE__ */ new Float64Array(3);
const LLH = /* @__PURE__ */ new Float64Array(3);

/** Geodetic coordinates: latitude and longitude in decimal degrees (north, east positive), height in metres above the ellipsoid. */
export interface Geodetic<T> {
  readonly lat: T;
  readonly lon: T;
  readonly h: T;
}

/**
 * Geodetic coordinates as input: latitude and longitude as decimal degrees or DMS text
 * (`53°36'43.1653"N`, `1°39'51.9920"W`, `-1 39 51.992`), height in metres (default 0).
 */
export interface GeodeticInput<T> {
  readonly lat: Numeric<T>;
  readonly lon: Numeric<T>;
  readonly h?: Numeric<T>;
}

/** Earth-centred, Earth-fixed Cartesian coordinates in metres: Z toward the north pole, X toward longitude 0 on the equator, Y toward 90° E. */
export interface Geocentric<T> {
  readonly X: T;
  readonly Y: T;
  readonly Z: T;
}

/**
 * Geodetic to geocentric coordinates:
 * X = (ν + h) cos φ cos λ, Y = (ν + h) cos φ sin λ, Z = ((1 − e²) ν + h) sin φ,
 * ν = a / √(1 − e² sin² φ) (Ordnance Survey, *A guide to coordinate systems in Great
 * Britain*, annex B, eqs. B3–B5).
 *
 * Accuracy: in `decimal(d)` the result is within a few units of the d-th digit (sin, cos
 * and √ are correctly rounded, every operation rounds once); in `float` within about
 * 10 nm at the Earth's surface; in `rational` within 1e-30 m (transcendental steps at
 * 42 digits).
 *
 * @param A the arithmetic
 * @param point `{ lat, lon, h }`: degrees or DMS text, metres
 * @param ellipsoid an ellipsoid or a known name (`'WGS84'`, `'GRS80'`)
 * @returns `{ X, Y, Z }` in metres
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE` beyond ±90°; `INVALID_ANGLE` for text
 *   that is not an angle; `HEIGHT_OUT_OF_RANGE` for h < −a; `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, geodeticToGeocentric, GRS80 } from 'quadspread';
 * // Ordnance Survey guide, annex B
 * const p = geodeticToGeocentric(float, { lat: `53°36'43.1653"N`, lon: `1°39'51.9920"W`, h: 299.8 }, GRS80);
 * [p.X.toFixed(3), p.Y.toFixed(3), p.Z.toFixed(3)];
 * //=> ['3790644.900', '-110149.210', '5111482.970']
 * ```
 */
export function geodeticToGeocentric<T>(
  A: Arithmetic<T>,
  point: GeodeticInput<T>,
  ellipsoid: Ellipsoid | string,
): Geocentric<T> {
  checkArithmetic(A, 'geodeticToGeocentric');
  const where = 'geodeticToGeocentric(point)';
  expectObject(point, where, '{ lat, lon, h }');
  const E = parametersAt(A, ellipsoid, 'geodeticToGeocentric(ellipsoid)');
  if (A.float64) {
    // The float twin (same operations, same order) for numeric input; else the code below.
    const o = XYZ;
    if (geocentricInto(point, E.a as number, E.e2 as number, o))
      return { X: o[0]!, Y: o[1]!, Z: o[2]! } as unknown as Geocentric<T>;
  }
  return geocentricOf(A, point, E);
}

/** {@link geodeticToGeocentric} once the arithmetic, the point and the ellipsoid are read (kept out of it so that it stays small enough for V8 to inline). */
function geocentricOf<T>(
  A: Arithmetic<T>,
  point: GeodeticInput<T>,
  E: EllipsoidParameters<T>,
): Geocentric<T> {
  const where = 'geodeticToGeocentric(point)';
  const lat = readLatitude(A, point.lat, `${where}.lat`);
  const lon = readLongitude(A, point.lon, `${where}.lon`);
  const h = readHeight(A, point.h, E.a, `${where}.h`);
  const { sin: sp, cos: cp } = sinCosDegrees(A, lat);
  const { sin: sl, cos: cl } = sinCosDegrees(A, lon);
  const nu = primeVertical(A, E.a, E.e2, sp);
  const r = A.mul(A.add(nu, h), cp);
  return {
    X: A.mul(r, cl), // X = (ν + h) cos φ cos λ  (OS guide, annex B)
    Y: A.mul(r, sl), // Y = (ν + h) cos φ sin λ
    Z: A.mul(A.add(A.mul(A.sub(A.one, E.e2), nu), h), sp), // Z = ((1 − e²)ν + h) sin φ
  };
}

/** @internal ν = a/√(1 − e² sin²φ), the prime-vertical radius of curvature. */
export function primeVertical<T>(A: Arithmetic<T>, a: T, e2: T, sinLat: T): T {
  return A.div(a, root(A, A.sub(A.one, A.mul(e2, A.mul(sinLat, sinLat)))));
}

/** Most iterations {@link geocentricToGeodetic} runs (it converges in 2 to 6). */
const MAX_ITERATIONS = 30;

/**
 * Geocentric to geodetic coordinates by Bowring's method iterated to convergence
 * (B. R. Bowring, "Transformation from spatial to geographical coordinates", *Survey
 * Review* 23(181):323–327, 1976): with p = √(X² + Y²) and the parametric latitude u,
 * tan φ = (Z + e′² b sin³u) / (p − e² a cos³u), tan u = (1 − f) tan φ, starting from
 * tan u = aZ/(bp); it converges rapidly (each step gains several digits at the Earth's
 * surface), and it stops when a step changes φ by less than 10^−(digits+2) rad or, in an
 * inexact arithmetic, when the change stops shrinking at the rounding noise. The iteration is carried on
 * unit vectors (cos, sin), so no tangent is ever formed and the poles are regular. Then
 * h = p cos φ + Z sin φ − a √(1 − e² sin²φ) (Bowring, "The accuracy of geodetic latitude
 * and height equations", *Survey Review* 28(218):202–206, 1985), accurate at every
 * latitude; λ = atan2(Y, X), and 0 on the polar axis.
 *
 * Accuracy: latitude to the arithmetic's digits (iteration stops when a step changes the
 * latitude by less than 10^−(digits+2) rad, in `rational` 10^−44), height within
 * a few units of the last digit times a.
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres
 * @param ellipsoid an ellipsoid or a known name
 * @returns `{ lat, lon, h }`: decimal degrees (north, east positive) and metres
 * @throws {QuadspreadError} `INVALID_ARGUMENT` at the centre of the ellipsoid;
 *   `HEIGHT_OUT_OF_RANGE` for points so deep inside (within about e²a = 43 km of the
 *   centre) that the method does not apply; `NOT_CONVERGED` if 30 steps do not converge;
 *   `UNKNOWN_ELLIPSOID`; `INVALID_NUMBER` for coordinates that are not numbers.
 * @example
 * ```ts
 * import { float, geocentricToGeodetic, formatDms, GRS80 } from 'quadspread';
 * // Ordnance Survey guide, annex B
 * const g = geocentricToGeodetic(float, { X: 3790644.9, Y: -110149.21, Z: 5111482.97 }, GRS80);
 * [formatDms(float, g.lat, 4), formatDms(float, g.lon, 4), g.h.toFixed(3)];
 * //=> [`53°36'43.1653"`, `-1°39'51.9920"`, '299.800']
 * ```
 */
export function geocentricToGeodetic<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>> | Geocentric<T>,
  ellipsoid: Ellipsoid | string,
): Geodetic<T> {
  checkArithmetic(A, 'geocentricToGeodetic');
  const where = 'geocentricToGeodetic(point)';
  expectObject(point, where, '{ X, Y, Z }');
  const E = parametersAt(A, ellipsoid, 'geocentricToGeodetic(ellipsoid)');
  if (A.float64) {
    // The float twin (same operations, same order, same tolerances); else the code below.
    // float's tolerances 10^−17 and 10^−13 are tenToMinus(A, 17) and tenToMinus(A, 13)
    // (float has 15 digits; a test checks both), without the two memo lookups.
    const o = LLH;
    if (
      A.digits === 15 &&
      geodeticInto(point, E as unknown as EllipsoidParameters<number>, 1e-17, 1e-13, o)
    )
      return { lat: o[0]!, lon: o[1]!, h: o[2]! } as unknown as Geodetic<T>;
  }
  return geodeticOf<T>(A, point, E, ellipsoid);
}

/** {@link geocentricToGeodetic} once the arithmetic, the point and the ellipsoid are read. */
function geodeticOf<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>> | Geocentric<T>,
  E: EllipsoidParameters<T>,
  ellipsoid: Ellipsoid | string,
): Geodetic<T> {
  const where = 'geocentricToGeodetic(point)';
  const X = readNumber(A, point.X as Numeric<T>, `${where}.X`);
  const Y = readNumber(A, point.Y as Numeric<T>, `${where}.Y`);
  const Z = readNumber(A, point.Z as Numeric<T>, `${where}.Z`);
  const p2 = A.add(A.mul(X, X), A.mul(Y, Y));
  if (A.exact && !A.isZero(p2)) {
    // The result is an approximation in any case: iterate in decimal with 8 guard digits,
    // so that exact fractions do not grow, and read the result back exactly.
    const { D, to, back } = delegateFor(A, claimedDigits(A) + 8);
    const g = geocentricToGeodetic(
      D,
      { X: to(X), Y: to(Y), Z: to(Z) },
      readEllipsoid(ellipsoid, 'geocentricToGeodetic(ellipsoid)'),
    );
    return { lat: back(g.lat), lon: back(g.lon), h: back(g.h) };
  }
  if (A.isZero(p2)) {
    // On the polar axis: φ = ±90°, h = |Z| − b, λ taken as 0.
    if (A.isZero(Z))
      throw invalidArgument(
        where,
        'the centre of the ellipsoid has no unique geodetic coordinates',
      );
    return { lat: A.from(A.sign(Z) > 0 ? 90 : -90), lon: A.zero, h: A.sub(A.abs(Z), E.b) };
  }
  // From here on A is inexact: exact arithmetics were delegated above.
  const p = root(A, p2);
  const oneMinusF = A.sub(A.one, E.f);
  const unit = (c: T, s: T): { c: T; s: T } => {
    const r = root(A, A.add(A.mul(c, c), A.mul(s, s)));
    return { c: A.div(c, r), s: A.div(s, r) };
  };
  const cube = (x: T): T => A.mul(x, A.mul(x, x));
  const digits = claimedDigits(A);
  const tol = tenToMinus(A, digits + 2);
  // tan u₀ = aZ/(bp) (Bowring 1976)
  let u = unit(A.mul(E.b, p), A.mul(E.a, Z));
  let phi: { c: T; s: T } | undefined;
  let prev: T | undefined;
  const noise = tenToMinus(A, Math.max(1, digits - 2));
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    // tan φ = (Z + e′² b sin³u) / (p − e² a cos³u)  (Bowring 1976)
    const num = A.add(Z, A.mul(A.mul(E.ep2, E.b), cube(u.s)));
    const den = A.sub(p, A.mul(A.mul(E.e2, E.a), cube(u.c)));
    if (A.sign(den) <= 0) {
      throw new QuadspreadError(
        'HEIGHT_OUT_OF_RANGE',
        where,
        `the point (${A.toString(X)}, ${A.toString(Y)}, ${A.toString(Z)}) is too deep inside the ellipsoid for geodetic coordinates`,
      );
    }
    const next = unit(den, num);
    if (phi !== undefined) {
      // |sin(φ_new − φ_old)| = |c_old s_new − s_old c_new|
      const change = A.abs(A.sub(A.mul(phi.c, next.s), A.mul(phi.s, next.c)));
      phi = next;
      if (A.cmp(change, tol) <= 0) return finish(A, phi, p, X, Y, Z, E.a, E.e2);
      // Converged to the rounding noise of an inexact arithmetic: a change that no longer
      // shrinks (the true iteration gains about 10 digits a step) and is within 100 units
      // of the last digit.
      if (
        prev !== undefined &&
        A.cmp(change, noise) <= 0 &&
        A.cmp(A.add(change, change), prev) >= 0
      )
        return finish(A, phi, p, X, Y, Z, E.a, E.e2);
      prev = change;
    } else {
      phi = next;
    }
    // tan u = (1 − f) tan φ
    u = unit(phi.c, A.mul(oneMinusF, phi.s));
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    where,
    `Bowring's iteration did not converge in ${MAX_ITERATIONS} steps`,
  );
}

function finish<T>(
  A: Arithmetic<T>,
  phi: { c: T; s: T },
  p: T,
  X: T,
  Y: T,
  Z: T,
  a: T,
  e2: T,
): Geodetic<T> {
  // h = p cos φ + Z sin φ − a √(1 − e² sin²φ)  (Bowring 1985)
  const w = root(A, A.sub(A.one, A.mul(e2, A.mul(phi.s, phi.s))));
  const h = A.sub(A.add(A.mul(p, phi.c), A.mul(Z, phi.s)), A.mul(a, w));
  const lat = toDegrees(A, A.atan2(phi.s, phi.c));
  const lon = toDegrees(A, A.atan2(Y, X));
  return { lat, lon, h };
}
