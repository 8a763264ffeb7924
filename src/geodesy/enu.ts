/**
 * The local east-north-up frame at an origin: a rotation of geocentric coordinates, in
 * which the plane solvers of this library apply near the origin.
 *
 * @module geodesy
 */
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, expectObject, shownInput } from '../geometry/validate.js';
import { sinCosDegrees } from '../readings/trig.js';
import { readEllipsoid, type Ellipsoid } from './ellipsoid.js';
import { geodeticToGeocentric, type Geocentric, type GeodeticInput } from './geocentric.js';
import { claimedDigits, readLatitude, readLongitude, roundExact } from './internal.js';

/** Local coordinates in metres: east, north (in the tangent plane), up (along the ellipsoid normal). */
export interface Enu<T> {
  readonly e: T;
  readonly n: T;
  readonly u: T;
}

function objectArg(x: unknown, where: string, shape: string): void {
  if (x === null || typeof x !== 'object')
    throw invalidArgument(where, `${show(x)} is not ${shape}`);
}

/** A 3 × 3 matrix, rows first. */
export type Matrix3<T> = readonly [readonly [T, T, T], readonly [T, T, T], readonly [T, T, T]];

/**
 * A point (cos θ, sin θ) exactly on the unit circle in an exact arithmetic: from the
 * approximate pair, t = tan(θ/2) = sin θ/(1 + cos θ) rounded, then
 * cos = (1 − t²)/(1 + t²), sin = 2t/(1 + t²) (the rational parametrisation of the circle),
 * so that c² + s² = 1 exactly. Pairs already on the circle are kept.
 */
function onCircle<T>(A: Arithmetic<T>, c: T, s: T, digits: number): { c: T; s: T } {
  if (!A.exact || A.eq(A.add(A.mul(c, c), A.mul(s, s)), A.one)) return { c, s };
  const neg = A.sign(c) < 0;
  // Use the half-angle of θ or of θ + π, whichever keeps 1 + cos away from 0.
  const cc = neg ? A.neg(c) : c;
  const ss = neg ? A.neg(s) : s;
  const t = roundExact(A, A.div(ss, A.add(A.one, cc)), digits + 8); // keeps an uncertain gradient
  const t2 = A.mul(t, t);
  const d = A.add(A.one, t2);
  const c1 = A.div(A.sub(A.one, t2), d);
  const s1 = A.div(A.add(t, t), d);
  return neg ? { c: A.neg(c1), s: A.neg(s1) } : { c: c1, s: s1 };
}

/**
 * The rotation from geocentric axes to east-north-up at latitude φ, longitude λ (rows:
 * e = (−sin λ, cos λ, 0), n = (−sin φ cos λ, −sin φ sin λ, cos φ),
 * u = (cos φ cos λ, cos φ sin λ, sin φ): the unit vectors of the local level frame, e.g.
 * B. Hofmann-Wellenhof, H. Lichtenegger, E. Wasle, *GNSS — Global Navigation Satellite
 * Systems*, Springer 2008, ch. 10, from memory; each row is checked to be a unit vector
 * along east, north and the ellipsoid normal in the tests).
 *
 * In `rational` the sines and cosines are replaced by the nearest points of a rational
 * parametrisation of the unit circle, so the matrix is *exactly* orthonormal with
 * determinant 1: quadrances (squared distances) are preserved exactly. Elsewhere it is
 * orthonormal to the arithmetic's rounding.
 *
 * @param A the arithmetic
 * @param origin `{ lat, lon }` in degrees or DMS text
 * @returns the 3 × 3 rotation, rows e, n, u
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE` beyond ±90°; `INVALID_ANGLE` for bad text.
 * @example
 * ```ts
 * import { rational, enuRotation } from 'quadspread';
 * enuRotation(rational, { lat: 90, lon: 0 }).map((row) => row.map((x) => rational.toString(x)));
 * //=> [['0', '1', '0'], ['-1', '0', '0'], ['0', '0', '1']]
 * ```
 */
export function enuRotation<T>(
  A: Arithmetic<T>,
  origin: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
): Matrix3<T> {
  checkArithmetic(A, 'enuRotation');
  const where = 'enuRotation(origin)';
  expectObject(origin, where, '{ lat, lon }');
  const digits = claimedDigits(A);
  const la = sinCosDegrees(A, readLatitude(A, origin.lat, `${where}.lat`));
  const lo = sinCosDegrees(A, readLongitude(A, origin.lon, `${where}.lon`));
  const P = onCircle(A, la.cos, la.sin, digits);
  const L = onCircle(A, lo.cos, lo.sin, digits);
  const z = A.zero;
  return [
    [A.neg(L.s), L.c, z],
    [A.neg(A.mul(P.s, L.c)), A.neg(A.mul(P.s, L.s)), P.c],
    [A.mul(P.c, L.c), A.mul(P.c, L.s), P.s],
  ];
}

function apply<T>(
  A: Arithmetic<T>,
  M: Matrix3<T>,
  v: readonly [T, T, T],
  transpose: boolean,
): [T, T, T] {
  const at = (i: number, j: number): T => (transpose ? M[j]![i]! : M[i]![j]!);
  const row = (i: number): T =>
    A.add(A.add(A.mul(at(i, 0), v[0]), A.mul(at(i, 1), v[1])), A.mul(at(i, 2), v[2]));
  return [row(0), row(1), row(2)];
}

/**
 * Geocentric coordinates to east-north-up at an origin: (e, n, u) = R (P − O), R from
 * {@link enuRotation}, O the origin's geocentric position.
 *
 * The local frame is exact (a rotation); the flat-Earth assumption comes in only when the
 * plane solvers treat (e, n) as map coordinates and ignore u: see {@link flatEarthError}.
 *
 * @param A the arithmetic
 * @param origin `{ lat, lon, h }` of the origin (degrees or DMS, metres)
 * @param point `{ X, Y, Z }` in metres
 * @param ellipsoid an ellipsoid or a known name
 * @returns `{ e, n, u }` in metres
 * @throws {QuadspreadError} as {@link geodeticToGeocentric} for the origin; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, enuFromGeocentric, geodeticToGeocentric, WGS84 } from 'quadspread';
 * const o = { lat: 45, lon: 7, h: 0 };
 * const up = geodeticToGeocentric(float, { ...o, h: 100 }, WGS84);
 * Math.round(enuFromGeocentric(float, o, up, WGS84).u * 1e6) / 1e6;
 * //=> 100
 * ```
 */
export function enuFromGeocentric<T>(
  A: Arithmetic<T>,
  origin: GeodeticInput<T>,
  point: Geocentric<Numeric<T>> | Geocentric<T>,
  ellipsoid: Ellipsoid | string,
): Enu<T> {
  checkArithmetic(A, 'enuFromGeocentric');
  objectArg(origin, 'enuFromGeocentric(origin)', '{ lat, lon, h }');
  objectArg(point, 'enuFromGeocentric(point)', '{ X, Y, Z }');
  const E = readEllipsoid(ellipsoid, 'enuFromGeocentric(ellipsoid)');
  const O = geodeticToGeocentric(A, origin, E);
  const R = enuRotation(A, origin);
  const d: [T, T, T] = [
    A.sub(readNumber(A, point.X as Numeric<T>, 'enuFromGeocentric(point).X'), O.X),
    A.sub(readNumber(A, point.Y as Numeric<T>, 'enuFromGeocentric(point).Y'), O.Y),
    A.sub(readNumber(A, point.Z as Numeric<T>, 'enuFromGeocentric(point).Z'), O.Z),
  ];
  const [e, n, u] = apply(A, R, d, false);
  return { e, n, u };
}

/**
 * East-north-up at an origin back to geocentric coordinates: P = O + Rᵀ (e, n, u).
 *
 * @param A the arithmetic
 * @param origin `{ lat, lon, h }` of the origin
 * @param local `{ e, n, u }` in metres
 * @param ellipsoid an ellipsoid or a known name
 * @returns `{ X, Y, Z }` in metres
 * @throws {QuadspreadError} as {@link enuFromGeocentric}.
 * @example
 * ```ts
 * import { float, geocentricFromEnu, WGS84 } from 'quadspread';
 * const P = geocentricFromEnu(float, { lat: 0, lon: 0, h: 0 }, { e: 10, n: 20, u: 30 }, WGS84);
 * [P.X, P.Y, P.Z];
 * //=> [6378167, 10, 20]
 * ```
 */
export function geocentricFromEnu<T>(
  A: Arithmetic<T>,
  origin: GeodeticInput<T>,
  local: Enu<Numeric<T>> | Enu<T>,
  ellipsoid: Ellipsoid | string,
): Geocentric<T> {
  checkArithmetic(A, 'geocentricFromEnu');
  objectArg(origin, 'geocentricFromEnu(origin)', '{ lat, lon, h }');
  objectArg(local, 'geocentricFromEnu(local)', '{ e, n, u }');
  const E = readEllipsoid(ellipsoid, 'geocentricFromEnu(ellipsoid)');
  const O = geodeticToGeocentric(A, origin, E);
  const R = enuRotation(A, origin);
  const v: [T, T, T] = [
    readNumber(A, local.e as Numeric<T>, 'geocentricFromEnu(local).e'),
    readNumber(A, local.n as Numeric<T>, 'geocentricFromEnu(local).n'),
    readNumber(A, local.u as Numeric<T>, 'geocentricFromEnu(local).u'),
  ];
  const [x, y, z] = apply(A, R, v, true);
  return { X: A.add(O.X, x), Y: A.add(O.Y, y), Z: A.add(O.Z, z) };
}

/** The error of treating the tangent plane as the ground, at a distance s from the origin. */
export interface FlatEarthError<T> {
  /** How far the surface falls below the tangent plane: s²/(2R), metres. */
  readonly drop: T;
  /** How much shorter the distance in the plane is than the arc: s³/(6R²), metres. */
  readonly shortening: T;
}

/**
 * The error of the flat-Earth assumption at a distance s along the surface from the
 * origin of a local frame, on a sphere of radius R (derived: the arc s subtends s/R; the
 * surface lies R(1 − cos(s/R)) ≈ s²/(2R) below the tangent plane, and the plane distance
 * R sin(s/R) ≈ s − s³/(6R²) is shorter than the arc; the next terms are smaller by
 * a factor of about (s/R)²/12 and (s/R)²/20). With R = 6371 km: at 1 km the drop is 78 mm
 * and the shortening 0.004 mm; at 10 km, 7.8 m and 4 mm. Heights must therefore always
 * be reduced (use u, or the curvature correction); horizontal positions are good to
 * 1 mm out to about 6 km.
 *
 * @param A the arithmetic
 * @param distance s, metres, ≥ 0
 * @param radius R, metres, > 0 (default 6371008.7714 m, the GRS 80 mean radius R1, Moritz 2000);
 *   use {@link gaussianMeanRadius} for the local value
 * @returns `{ drop, shortening }` in metres; exact in `rational`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for s < 0 or R ≤ 0.
 * @example
 * ```ts
 * import { float, flatEarthError } from 'quadspread';
 * const { drop, shortening } = flatEarthError(float, 10000);
 * [drop.toFixed(3), (shortening * 1000).toFixed(2)];
 * //=> ['7.848', '4.11']
 * ```
 */
export function flatEarthError<T>(
  A: Arithmetic<T>,
  distance: Numeric<T>,
  radius: Numeric<T> = '6371008.7714',
): FlatEarthError<T> {
  checkArithmetic(A, 'flatEarthError');
  const s = readNumber(A, distance, 'flatEarthError(distance)');
  const R = readNumber(A, radius, 'flatEarthError(radius)');
  if (A.sign(s) < 0)
    throw invalidArgument('flatEarthError(distance)', `${shownInput(A, distance, s)} is negative`);
  if (A.sign(R) <= 0)
    throw invalidArgument('flatEarthError(radius)', `${shownInput(A, radius, R)} is not positive`);
  const s2 = A.mul(s, s);
  return {
    drop: A.div(s2, A.mul(A.from(2), R)), // s²/(2R) (derived, leading term of R(1 − cos(s/R)))
    shortening: A.div(A.mul(s2, s), A.mul(A.from(6), A.mul(R, R))), // s³/(6R²) (derived, leading term of s − R sin(s/R))
  };
}
