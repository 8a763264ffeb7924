/**
 * The way from plane grid coordinates to WGS 84 longitude and latitude, as RFC 7946 requires
 * them: a stated grid (projection) and, off WGS 84, a stated datum transformation.
 *
 * @module io
 */
import {
  QuadspreadError,
  WGS84,
  crs,
  datumTransform,
  ellipsoidByName,
  fromGrid,
  prepareProjection,
  toGrid,
  type Arithmetic,
  type DatumTransformation,
  type Ellipsoid,
  type Numeric,
  type Projection,
} from '../index.js';
import { checkArithmetic, show } from '../errors.js';

/**
 * How plane grid coordinates reach WGS 84 longitude and latitude (and back).
 *
 * - `grid`: the projection of the coordinates: an EPSG code from the library's table
 *   (`'EPSG:27700'`, `32633`; see `crs`) or a projection object (see `toGrid`). Coordinates are
 *   in its linear unit.
 * - `toWgs84`: the datum transformation from the grid's datum to WGS 84 (`{ method,
 *   parameters, direction? }` as `datumTransform` takes them), or `'coincident'` to state that
 *   the grid's datum may be taken as WGS 84 at the accuracy needed (ETRS89 or NAD83 are within
 *   about a metre of WGS 84). It may be left out only when the grid is on the WGS 84 ellipsoid
 *   (the UTM and UPS codes), which is taken as the WGS 84 datum. A grid inverse alone gives
 *   latitude and longitude on the grid's own datum, up to some 100 m from WGS 84, so without
 *   either the conversion is refused.
 */
export interface Wgs84Reference<T> {
  /** The grid: an EPSG code of the table or a projection object. */
  readonly grid: Projection | string | number;
  /** The grid's datum to WGS 84, or `'coincident'` (see the interface). */
  readonly toWgs84?:
    | (DatumTransformation<T> & { readonly direction?: 'forward' | 'inverse' | 'reversed' })
    | 'coincident';
}

/** A reference read once: both directions for one arithmetic. @internal */
export interface PreparedReference<T> {
  /** Grid coordinates to WGS 84 degrees. */
  toLonLat(x: Numeric<T>, y: Numeric<T>): { lon: T; lat: T };
  /** WGS 84 degrees to grid coordinates. */
  fromLonLat(lon: Numeric<T>, lat: Numeric<T>): { x: T; y: T };
  /** `'EPSG:n'` when the grid was given by its code. */
  readonly code?: string;
}

const missing = (where: string, what: string) =>
  new QuadspreadError('MISSING_REFERENCE_SYSTEM', where, what);

/** Reads a {@link Wgs84Reference} once for an arithmetic. @internal */
export function prepareReference<T>(
  A: Arithmetic<T, boolean>,
  reference: Wgs84Reference<T> | undefined,
  where: string,
): PreparedReference<T> {
  checkArithmetic(A, where.replace(/\(.*$/, ''));
  if (typeof reference !== 'object' || reference === null || reference.grid === undefined)
    throw missing(
      where,
      'no grid is stated: give { grid, toWgs84 } (the projection of the coordinates and the datum transformation to WGS 84), or ask for plane coordinates explicitly',
    );
  const { grid, toWgs84 } = reference;
  const def = typeof grid === 'object' && grid !== null ? grid : crs(grid);
  if ((def as { kind?: string }).kind === 'geographic')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}.grid`,
      `${show(grid)} is a geographic system, not a grid of plane coordinates`,
    );
  const code = typeof grid === 'object' ? undefined : (def as { code?: string }).code;
  const projection = prepareProjection(A, { ...(def as Projection), pointAngleUnit: 'deg' });
  const e = def.ellipsoid;
  const ellipsoid: Ellipsoid = typeof e === 'string' ? ellipsoidByName(e) : e;
  const onWgs84 = ellipsoid.a === WGS84.a && A.eq(A.from(ellipsoid.f), A.from(WGS84.f));
  let datum: ((lat: T, lon: T, back: boolean) => { lat: T; lon: T }) | undefined;
  if (toWgs84 === undefined) {
    if (!onWgs84)
      throw missing(
        `${where}.toWgs84`,
        `the grid ${code ?? 'given'} is on the ${ellipsoid.name} ellipsoid, not WGS 84: state the datum transformation to WGS 84 ({ method, parameters }), or 'coincident' if its datum may be taken as WGS 84`,
      );
  } else if (toWgs84 !== 'coincident') {
    if (typeof toWgs84 !== 'object' || toWgs84 === null)
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}.toWgs84`,
        `${show(toWgs84)} is not a datum transformation { method, parameters } or 'coincident'`,
      );
    const forward = toWgs84.direction ?? 'forward';
    // The way back: the exact inverse of the forward transformation, and the forward one of
    // an EPSG reversal (reversing the sign-reversed parameters gives the original ones).
    const backward = forward === 'forward' ? 'inverse' : 'forward';
    const step = (lat: T, lon: T, h: T, back: boolean) =>
      datumTransform(A, { lat, lon, h }, toWgs84, {
        from: back ? WGS84 : ellipsoid,
        to: back ? ellipsoid : WGS84,
        domain: '3D',
        direction: back ? backward : forward,
      });
    // Grid points lie on the grid's ellipsoid (h = 0 there, as EPSG's 2D methods take them).
    // Forward, the WGS 84 height is dropped. Back, the point of height 0 on the grid's
    // ellipsoid whose image is (lat, lon) is found by correcting the WGS 84 height once: the
    // height the first pass gives on the grid's ellipsoid, taken off (the 2D inverse alone
    // would miss by the datums' separation times the scale and rotation, ~1 mm per 50 m).
    datum = (lat, lon, back) => {
      if (!back) return step(lat, lon, A.zero, false);
      let hw = A.zero;
      let g = step(lat, lon, hw, true);
      for (let i = 0; i < 2; i++) {
        hw = A.sub(hw, g.h!);
        g = step(lat, lon, hw, true);
      }
      return g;
    };
  }
  return {
    ...(code === undefined ? {} : { code }),
    toLonLat(x, y) {
      const g = fromGrid(A, { E: x, N: y }, projection);
      const w = datum === undefined ? g : datum(g.lat, g.lon, false);
      return { lon: w.lon, lat: w.lat };
    },
    fromLonLat(lon, lat) {
      const L = A.from(lon);
      const B = A.from(lat);
      const g = datum === undefined ? { lat: B, lon: L } : datum(B, L, true);
      const p = toGrid(A, g, projection);
      return { x: p.E, y: p.N };
    },
  };
}

/**
 * Plane grid coordinates to WGS 84 longitude and latitude (degrees), through a stated grid
 * and datum transformation: the conversion the GeoJSON writer makes for every position.
 *
 * @param A the arithmetic
 * @param point `{ x: east, y: north }` in the grid's linear unit
 * @param reference `{ grid, toWgs84? }` (see {@link Wgs84Reference})
 * @returns `{ lon, lat }` in degrees on WGS 84
 * @throws {@link QuadspreadError} `MISSING_REFERENCE_SYSTEM` when no grid is stated, or when
 *   the grid is not on WGS 84 and no datum transformation is stated; `UNKNOWN_CRS`,
 *   `INVALID_ARGUMENT` and the errors of `fromGrid` and `datumTransform`.
 * @example
 * ```ts
 * import { float } from 'quadspread';
 * import { gridToWgs84 } from 'quadspread/io';
 * // UTM zone 33N (on WGS 84): the false origin of the zone is at 15° E on the equator
 * gridToWgs84(float, { x: 500000, y: 0 }, { grid: 'EPSG:32633' });
 * //=> { lon: 15, lat: 0 }
 * ```
 */
export function gridToWgs84<T>(
  A: Arithmetic<T, boolean>,
  point: { readonly x: Numeric<T>; readonly y: Numeric<T> },
  reference: Wgs84Reference<T>,
): { lon: T; lat: T } {
  const p = pointObject(point, 'gridToWgs84(point)', '{ x, y }');
  return prepareReference(A, reference, 'gridToWgs84(reference)').toLonLat(p.x, p.y);
}

/**
 * WGS 84 longitude and latitude (degrees) to plane grid coordinates, through a stated datum
 * transformation (applied in reverse) and grid: the conversion the GeoJSON reader makes.
 *
 * @param A the arithmetic
 * @param position `{ lon, lat }` in degrees on WGS 84
 * @param reference `{ grid, toWgs84? }` (see {@link Wgs84Reference})
 * @returns `{ x: east, y: north }` in the grid's linear unit
 * @throws {@link QuadspreadError} as {@link gridToWgs84}, and the errors of `toGrid`.
 * @example
 * ```ts
 * import { float } from 'quadspread';
 * import { wgs84ToGrid } from 'quadspread/io';
 * wgs84ToGrid(float, { lon: 15, lat: 0 }, { grid: 'EPSG:32633' });
 * //=> { x: 500000, y: 0 }
 * ```
 */
export function wgs84ToGrid<T>(
  A: Arithmetic<T, boolean>,
  position: { readonly lon: Numeric<T>; readonly lat: Numeric<T> },
  reference: Wgs84Reference<T>,
): { x: T; y: T } {
  const p = pointObject(position, 'wgs84ToGrid(position)', '{ lon, lat }');
  return prepareReference(A, reference, 'wgs84ToGrid(reference)').fromLonLat(p.lon, p.lat);
}

/** The point argument as an object, or `INVALID_ARGUMENT` naming it. */
function pointObject<P extends object>(p: P, where: string, shape: string): P {
  if (typeof p !== 'object' || p === null || Array.isArray(p))
    throw new QuadspreadError('INVALID_ARGUMENT', where, `${show(p)} is not a point ${shape}`);
  return p;
}
