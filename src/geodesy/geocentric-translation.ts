/**
 * The three-parameter geocentric translation (EPSG method 1031).
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { invalidArgument, checkArithmetic } from '../errors.js';
import { expectObject, readNumber } from '../geometry/validate.js';
import type { Geocentric } from './geocentric.js';
import { readXyz } from './helmert.js';

/** The translations `tx`, `ty`, `tz` in metres. */
export interface GeocentricTranslationParameters<T> {
  readonly tx: Numeric<T>;
  readonly ty: Numeric<T>;
  readonly tz: Numeric<T>;
}

/**
 * Geocentric translation (IOGP Guidance Note 7-2, §4.4.2, EPSG method 1031):
 * X_t = X_s + tX, Y_t = Y_s + tY, Z_t = Z_s + tZ. Exact in `rational`; the reverse is the
 * same with the signs of the translations changed (also exact).
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, source frame
 * @param params `{ tx, ty, tz }` in metres
 * @returns `{ X, Y, Z }` in metres, target frame
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing translation; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, geocentricTranslation } from 'quadspread';
 * // IOGP GN 7-2 §4.4.2 worked example, WGS 84 to ED50
 * const p = geocentricTranslation(rational, { X: '3771793.97', Y: '140253.34', Z: '5124304.35' },
 *   { tx: '84.87', ty: '96.49', tz: '116.95' });
 * [p.X, p.Y, p.Z].map((v) => rational.toPrecision(v, 9));
 * //=> ['3771878.84', '140349.830', '5124421.30']
 * ```
 */
export function geocentricTranslation<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: GeocentricTranslationParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'geocentricTranslation');
  const where = 'geocentricTranslation(params)';
  const [X, Y, Z] = readXyz(A, point, 'geocentricTranslation(point)');
  expectObject(params, where, '{ tx, ty, tz }');
  const t = (['tx', 'ty', 'tz'] as const).map((k) => {
    if (params[k] === undefined) throw invalidArgument(`${where}.${k}`, `${k} is missing`);
    return readNumber(A, params[k], `${where}.${k}`);
  });
  return { X: A.add(X, t[0]!), Y: A.add(Y, t[1]!), Z: A.add(Z, t[2]!) };
}
