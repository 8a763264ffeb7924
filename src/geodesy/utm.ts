/**
 * The Universal Transverse Mercator grid: the zone of a point (with the published exceptions
 * for south-west Norway and Svalbard) and the projection of a zone.
 *
 * @module geodesy
 */
import { QuadspreadError, show, invalidArgument } from '../errors.js';
import type { Numeric } from '../arithmetic/types.js';
import { rational } from '../arithmetic/rational.js';
import { WGS84, type Ellipsoid } from './ellipsoid.js';
import { readLatitude, readLongitude } from './internal.js';
import { wrapLongitude, type Projection } from './projection-core.js';

/** A UTM zone: its number (1–60) and hemisphere. */
export interface UtmZone {
  /** Zone number, 1 to 60: zone n spans longitudes 6n − 186° to 6n − 180°. */
  readonly zone: number;
  /** `'N'` north of the equator (and on it), `'S'` south. */
  readonly hemisphere: 'N' | 'S';
}

/**
 * The UTM zone of a point: ⌊(λ + 180°)/6°⌋ + 1, with the exceptions of the UTM definition
 * (NIMA TR 8358.2, *The Universal Grids: UTM and UPS*, 1989, §2-3 — from memory): between
 * 56° N and 64° N zone 32 extends west to 3° E; between 72° N and 84° N zones 32, 34 and 36
 * are not used, zones 31 and 37 widen and 33 and 35 span 9° (31: 0°–9° E, 33: 9°–21° E,
 * 35: 21°–33° E, 37: 33°–42° E). Longitudes are reduced to [−180°, 180°).
 *
 * @param lat latitude, degrees (or DMS text), −80° to 84° (UTM's range)
 * @param lon longitude from Greenwich, degrees (or DMS text)
 * @returns `{ zone, hemisphere }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` for latitudes beyond −80° and 84° (the polar
 *   regions belong to UPS); `LATITUDE_OUT_OF_RANGE`; `INVALID_ANGLE`.
 * @example
 * ```ts
 * import { utmZone } from 'quadspread';
 * // Warsaw
 * utmZone(52.2, 21.0);
 * //=> { zone: 34, hemisphere: 'N' }
 * // Bergen: the Norway exception
 * utmZone(60.4, 5.3);
 * //=> { zone: 32, hemisphere: 'N' }
 * ```
 */
export function utmZone(lat: Numeric<never>, lon: Numeric<never>): UtmZone {
  const R = rational;
  const phi = readLatitude(R, lat, 'utmZone(lat)');
  const lam = wrapLongitude(R, readLongitude(R, lon, 'utmZone(lon)'), 'utmZone(lon)');
  if (R.cmp(phi, R.from(-80)) < 0 || R.cmp(phi, R.from(84)) > 0)
    throw new QuadspreadError(
      'OUTSIDE_DOMAIN',
      'utmZone(lat)',
      `${show(lat)} is outside UTM's latitudes (80° S to 84° N): the polar regions use UPS`,
    );
  const hemisphere = R.sign(phi) < 0 ? 'S' : 'N';
  const between = (x: typeof phi, lo: number, hi: number) =>
    R.cmp(x, R.from(lo)) >= 0 && R.cmp(x, R.from(hi)) < 0;
  // Exceptions (NIMA TR 8358.2 §2-3): south-west Norway and Svalbard.
  if (between(phi, 56, 64) && between(lam, 3, 12)) return { zone: 32, hemisphere };
  if (R.cmp(phi, R.from(72)) >= 0) {
    if (between(lam, 0, 9)) return { zone: 31, hemisphere };
    if (between(lam, 9, 21)) return { zone: 33, hemisphere };
    if (between(lam, 21, 33)) return { zone: 35, hemisphere };
    if (between(lam, 33, 42)) return { zone: 37, hemisphere };
  }
  const zone = Math.floor(R.toNumber(R.div(R.add(lam, R.from(180)), R.from(6)))) + 1;
  return { zone: Math.min(60, Math.max(1, zone)), hemisphere };
}

/**
 * The Transverse Mercator projection of a UTM zone: central meridian 6n − 183°, k0 = 0.9996,
 * false easting 500 000 m, false northing 0 (north) or 10 000 000 m (south) (NIMA TR 8358.2,
 * from memory), on WGS 84 unless another ellipsoid is given (UTM is used on many datums).
 *
 * @param zone the zone number, an integer 1 to 60
 * @param hemisphere `'N'` or `'S'`
 * @param ellipsoid the ellipsoid (default WGS 84)
 * @returns a frozen projection for `toGrid` / `fromGrid`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a zone outside 1..60 or a hemisphere other
 *   than `'N'` or `'S'`.
 * @example
 * ```ts
 * import { float, toGrid, utmProjection } from 'quadspread';
 * const g = toGrid(float, { lat: 0, lon: 15 }, utmProjection(33, 'S'));
 * [g.E, g.N];
 * //=> [500000, 10000000]
 * ```
 */
export function utmProjection(
  zone: number,
  hemisphere: 'N' | 'S',
  ellipsoid: Ellipsoid | string = WGS84,
): Projection {
  if (!Number.isInteger(zone) || zone < 1 || zone > 60)
    throw invalidArgument('utmProjection(zone)', `${show(zone)} is not an integer from 1 to 60`);
  if (hemisphere !== 'N' && hemisphere !== 'S')
    throw invalidArgument('utmProjection(hemisphere)', `${show(hemisphere)} is not 'N' or 'S'`);
  return Object.freeze({
    method: 'transverse-mercator',
    ellipsoid,
    lon0: 6 * zone - 183,
    lat0: 0,
    k0: '0.9996',
    falseEasting: 500000,
    falseNorthing: hemisphere === 'S' ? 10000000 : 0,
  });
}
