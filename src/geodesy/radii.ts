/**
 * Radii of curvature of the ellipsoid at a latitude: meridian, prime vertical, in a
 * given azimuth, and the Gaussian mean radius.
 *
 * Formulas: e.g. W. Torge & J. Müller, *Geodesy*, 4th ed., de Gruyter 2012, ch. 4 (the
 * geometry of the ellipsoid); R. E. Deakin & M. N. Hunter, *Geometric Geodesy*, RMIT 2010.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { sinCosDegrees } from '../readings/trig.js';
import { parametersAt, type Ellipsoid } from './ellipsoid.js';
import { readAngle, readLatitude, root } from './internal.js';
import { checkArithmetic } from '../errors.js';

function setup<T>(A: Arithmetic<T>, lat: Numeric<T>, ellipsoid: Ellipsoid | string, fn: string) {
  const E = parametersAt(A, ellipsoid, `${fn}(ellipsoid)`);
  const { sin, cos } = sinCosDegrees(A, readLatitude(A, lat, `${fn}(lat)`));
  // W² = 1 − e² sin²φ
  const W2 = A.sub(A.one, A.mul(E.e2, A.mul(sin, sin)));
  return { E, sin, cos, W2, W: root(A, W2) };
}

/**
 * The meridian radius of curvature M = a(1 − e²)/(1 − e² sin²φ)^(3/2) (Torge & Müller, ch. 4),
 * in metres: the radius of the north–south section.
 *
 * @param A the arithmetic
 * @param lat latitude, degrees or DMS text
 * @param ellipsoid an ellipsoid or a known name
 * @returns M in metres
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`, `INVALID_ANGLE`, `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, meridianRadius, GRS80 } from 'quadspread';
 * meridianRadius(float, 0, GRS80).toFixed(4);
 * //=> '6335439.3271'
 * ```
 */
export function meridianRadius<T>(
  A: Arithmetic<T>,
  lat: Numeric<T>,
  ellipsoid: Ellipsoid | string,
): T {
  checkArithmetic(A, 'meridianRadius');
  const { E, W2, W } = setup(A, lat, ellipsoid, 'meridianRadius');
  return A.div(A.mul(E.a, A.sub(A.one, E.e2)), A.mul(W2, W)); // M = a(1 − e²)/W³
}

/**
 * The prime-vertical radius of curvature N = a/√(1 − e² sin²φ) (Torge & Müller, ch. 4), in
 * metres: the radius of the east–west section normal to the meridian.
 *
 * @param A the arithmetic
 * @param lat latitude, degrees or DMS text
 * @param ellipsoid an ellipsoid or a known name
 * @returns N in metres
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`, `INVALID_ANGLE`, `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, primeVerticalRadius, GRS80 } from 'quadspread';
 * primeVerticalRadius(float, 0, GRS80);
 * //=> 6378137
 * ```
 */
export function primeVerticalRadius<T>(
  A: Arithmetic<T>,
  lat: Numeric<T>,
  ellipsoid: Ellipsoid | string,
): T {
  checkArithmetic(A, 'primeVerticalRadius');
  const { E, W } = setup(A, lat, ellipsoid, 'primeVerticalRadius');
  return A.div(E.a, W); // N = a/W
}

/**
 * The radius of curvature of the normal section in azimuth α (clockwise from north), by
 * Euler's theorem 1/R_α = cos²α/M + sin²α/N, i.e. R_α = MN/(N cos²α + M sin²α)
 * (Torge & Müller, ch. 4). Use it for the curvature-and-refraction correction and the
 * height reduction of a line in that direction.
 *
 * @param A the arithmetic
 * @param lat latitude, degrees or DMS text
 * @param azimuth azimuth of the line, degrees or DMS text, clockwise from north
 * @param ellipsoid an ellipsoid or a known name
 * @returns R_α in metres (M at α = 0°, N at α = 90°)
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`, `INVALID_ANGLE`, `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, radiusInAzimuth, primeVerticalRadius, GRS80 } from 'quadspread';
 * radiusInAzimuth(float, 52, 90, GRS80) === primeVerticalRadius(float, 52, GRS80);
 * //=> true
 * ```
 */
export function radiusInAzimuth<T>(
  A: Arithmetic<T>,
  lat: Numeric<T>,
  azimuth: Numeric<T>,
  ellipsoid: Ellipsoid | string,
): T {
  checkArithmetic(A, 'radiusInAzimuth');
  const { E, W2, W } = setup(A, lat, ellipsoid, 'radiusInAzimuth');
  const { sin, cos } = sinCosDegrees(A, readAngle(A, azimuth, 'radiusInAzimuth(azimuth)'));
  const N = A.div(E.a, W);
  const M = A.div(A.mul(E.a, A.sub(A.one, E.e2)), A.mul(W2, W));
  // R_α = MN/(N cos²α + M sin²α)  (Euler's theorem on normal curvatures)
  return A.div(A.mul(M, N), A.add(A.mul(N, A.mul(cos, cos)), A.mul(M, A.mul(sin, sin))));
}

/**
 * The Gaussian mean radius √(MN) = a√(1 − e²)/(1 − e² sin²φ) (Torge & Müller, ch. 4), in
 * metres: the mean of R_α over all azimuths in the sense of Gaussian curvature; the
 * radius of the sphere that best fits the ellipsoid at that latitude.
 *
 * @param A the arithmetic
 * @param lat latitude, degrees or DMS text
 * @param ellipsoid an ellipsoid or a known name
 * @returns √(MN) in metres
 * @throws {QuadspreadError} `LATITUDE_OUT_OF_RANGE`, `INVALID_ANGLE`, `UNKNOWN_ELLIPSOID`.
 * @example
 * ```ts
 * import { float, gaussianMeanRadius, GRS80 } from 'quadspread';
 * gaussianMeanRadius(float, 90, GRS80).toFixed(4);
 * //=> '6399593.6259'
 * ```
 */
export function gaussianMeanRadius<T>(
  A: Arithmetic<T>,
  lat: Numeric<T>,
  ellipsoid: Ellipsoid | string,
): T {
  checkArithmetic(A, 'gaussianMeanRadius');
  const { E, W2 } = setup(A, lat, ellipsoid, 'gaussianMeanRadius');
  return A.div(A.mul(E.a, root(A, A.sub(A.one, E.e2))), W2); // √(MN) = a√(1 − e²)/W²
}
