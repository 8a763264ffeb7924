/**
 * Datum transformation of geodetic coordinates: geodetic → geocentric on the source
 * ellipsoid, a geocentric transformation, geocentric → geodetic on the target ellipsoid.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { invalidArgument, show, checkArithmetic } from '../errors.js';
import { expectObject } from '../geometry/validate.js';
import type { Ellipsoid } from './ellipsoid.js';
import { geocentricToGeodetic, geodeticToGeocentric, type GeodeticInput } from './geocentric.js';
import { helmert, helmertInverse, helmertReversed, type HelmertParameters } from './helmert.js';
import {
  molodenskyBadekas,
  molodenskyBadekasInverse,
  type MolodenskyBadekasParameters,
} from './molodensky-badekas.js';
import {
  geocentricTranslation,
  type GeocentricTranslationParameters,
} from './geocentric-translation.js';

/** A geocentric transformation by method name, with its parameters. */
export type DatumTransformation<T> =
  | { readonly method: 'helmert'; readonly parameters: HelmertParameters<T> }
  | { readonly method: 'molodensky-badekas'; readonly parameters: MolodenskyBadekasParameters<T> }
  | {
      readonly method: 'geocentric-translation';
      readonly parameters: GeocentricTranslationParameters<T>;
    };

/**
 * How to apply a transformation to geodetic coordinates: the ellipsoid the input point is on
 * (`from`) and the one the result is on (`to`); the `domain` (`'2D'`: h = 0 on the way in and
 * dropped on the way out, as EPSG's geog2D methods do; `'3D'`: h carried); and the
 * `direction`: `'forward'` (default), `'inverse'` (the exact inverse) or `'reversed'` (the
 * EPSG reversal by changing the parameters' signs; not offered for Molodensky–Badekas).
 */
export interface DatumTransformOptions {
  readonly from: Ellipsoid | string;
  readonly to: Ellipsoid | string;
  readonly domain: '2D' | '3D';
  readonly direction?: 'forward' | 'inverse' | 'reversed';
}

/** A transformed point: latitude and longitude in degrees, and h in metres in the 3D domain. */
export interface TransformedPoint<T> {
  readonly lat: T;
  readonly lon: T;
  readonly h?: T;
}

/**
 * Transforms geodetic coordinates between datums through geocentric coordinates, as EPSG's
 * geog2D and geog3D methods are defined (IOGP Guidance Note 7-2, §4.4: geographic →
 * geocentric on the source ellipsoid, the geocentric transformation, geocentric →
 * geographic on the target ellipsoid): {@link geodeticToGeocentric}, then {@link helmert},
 * {@link molodenskyBadekas} or {@link geocentricTranslation} (or their inverse or reversal),
 * then {@link geocentricToGeodetic}.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon, h? }`: degrees or DMS text, metres (h is ignored in '2D')
 * @param transformation `{ method, parameters }`
 * @param options `{ from, to, domain, direction? }`
 * @returns `{ lat, lon }` in '2D', `{ lat, lon, h }` in '3D'
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for an unknown method, domain or direction;
 *   the errors of the steps (`LATITUDE_OUT_OF_RANGE`, `UNKNOWN_ELLIPSOID`, …).
 * @example
 * ```ts
 * import { float, datumTransform, defineEllipsoid, WGS84, formatDms } from 'quadspread';
 * // IOGP GN 7-2 §4.4.3.1 worked example: WGS 72 (a = 6378135 m, 1/f = 298.26) to WGS 84
 * const wgs72 = defineEllipsoid({ name: 'WGS 72', a: 6378135, invF: 298.26 });
 * const p = datumTransform(float, { lat: 55, lon: 4, h: 0 },
 *   { method: 'helmert', parameters: { tx: 0, ty: 0, tz: 4.5, rx: 0, ry: 0, rz: 0.554, ds: 0.219,
 *     convention: 'position-vector' } }, { from: wgs72, to: WGS84, domain: '3D' });
 * [formatDms(float, p.lat, 3), formatDms(float, p.lon, 3), p.h!.toFixed(2)];
 * //=> [`55°00'00.090"`, `4°00'00.554"`, '3.22']
 * ```
 */
export function datumTransform<T>(
  A: Arithmetic<T>,
  point: GeodeticInput<T>,
  transformation: DatumTransformation<T>,
  options: DatumTransformOptions,
): TransformedPoint<T> {
  checkArithmetic(A, 'datumTransform');
  const where = 'datumTransform';
  expectObject(point, `${where}(point)`, '{ lat, lon, h? }');
  expectObject(transformation, `${where}(transformation)`, '{ method, parameters }');
  expectObject(options, `${where}(options)`, '{ from, to, domain }');
  const { domain } = options;
  const direction = options.direction ?? 'forward';
  if (domain !== '2D' && domain !== '3D')
    throw invalidArgument(`${where}(options).domain`, `${show(domain)} is not '2D' or '3D'`);
  if (direction !== 'forward' && direction !== 'inverse' && direction !== 'reversed')
    throw invalidArgument(
      `${where}(options).direction`,
      `${show(direction)} is not 'forward', 'inverse' or 'reversed'`,
    );
  const input = { lat: point.lat, lon: point.lon, h: domain === '2D' ? 0 : point.h } as {
    lat: Numeric<T>;
    lon: Numeric<T>;
    h?: Numeric<T>;
  };
  const xyz = geodeticToGeocentric(A, input, options.from);
  let moved;
  const { method, parameters } = transformation;
  if (method === 'helmert') {
    const p = parameters as HelmertParameters<T>;
    const f = { forward: helmert, inverse: helmertInverse, reversed: helmertReversed }[direction];
    moved = f(A, xyz, p);
  } else if (method === 'molodensky-badekas') {
    const p = parameters as MolodenskyBadekasParameters<T>;
    if (direction === 'reversed')
      throw invalidArgument(
        `${where}(options).direction`,
        `'reversed' is not offered for molodensky-badekas (its sign reversal also moves the pivot): use 'inverse'`,
      );
    moved = (direction === 'forward' ? molodenskyBadekas : molodenskyBadekasInverse)(A, xyz, p);
  } else if (method === 'geocentric-translation') {
    const p = parameters as GeocentricTranslationParameters<T>;
    if (direction !== 'forward') {
      // The reverse of a translation is the translation with its signs changed (exact).
      const moved0 = geocentricTranslation(A, { X: 0, Y: 0, Z: 0 }, p);
      moved = geocentricTranslation(A, xyz, {
        tx: A.neg(moved0.X),
        ty: A.neg(moved0.Y),
        tz: A.neg(moved0.Z),
      });
    } else moved = geocentricTranslation(A, xyz, p);
  } else {
    throw invalidArgument(
      `${where}(transformation).method`,
      `${show(method)} is not 'helmert', 'molodensky-badekas' or 'geocentric-translation'`,
    );
  }
  const g = geocentricToGeodetic(A, moved, options.to);
  return domain === '2D' ? { lat: g.lat, lon: g.lon } : g;
}
