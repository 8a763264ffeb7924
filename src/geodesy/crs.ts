/**
 * A small table of coordinate reference systems by EPSG code: WGS 84 geographic, the UTM zones
 * and UPS on WGS 84, and a handful of national and continental grids. Everything else is
 * defined by its parameters (see `toGrid`). No network access, no grid files.
 *
 * @module geodesy
 */
import { QuadspreadError, show } from '../errors.js';
import { GRS80, WGS84, type Ellipsoid } from './ellipsoid.js';
import type { Projection } from './projection-core.js';
import { utmProjection } from './utm.js';

/** A projected CRS from the table: a projection `toGrid` and `fromGrid` take as it is. */
export interface ProjectedCrs extends Projection {
  readonly kind: 'projected';
  /** `'EPSG:…'` */
  readonly code: string;
  /** The EPSG name. */
  readonly name: string;
  /** Where the definition comes from. */
  readonly source: string;
  /** `'EN'`, or `'NE'` where the published coordinate system lists northing first. */
  readonly axisOrder: 'EN' | 'NE';
}

/** A geographic CRS from the table: latitude and longitude in degrees on an ellipsoid. */
export interface GeographicCrs {
  readonly kind: 'geographic';
  readonly code: string;
  readonly name: string;
  readonly ellipsoid: Ellipsoid;
  readonly source: string;
}

// Ellipsoids of the national grids, by their EPSG defining parameters.
const AIRY_1830: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'Airy 1830',
  a: '6377563.396',
  f: '21306487/6377563396', // from b = 6356256.909 m (EPSG ellipsoid 7001)
  source: 'EPSG ellipsoid 7001: a = 6377563.396 m, b = 6356256.909 m',
});
const BESSEL_1841: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'Bessel 1841',
  a: '6377397.155',
  f: '1/299.1528128',
  source: 'EPSG ellipsoid 7004: a = 6377397.155 m, 1/f = 299.1528128',
});
const INTERNATIONAL_1924: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'International 1924',
  a: '6378388',
  f: '1/297',
  source: 'EPSG ellipsoid 7022: a = 6378388 m, 1/f = 297',
});
const KRASSOWSKY_1940: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'Krassowsky 1940',
  a: '6378245',
  f: '1/298.3',
  source: 'EPSG ellipsoid 7024: a = 6378245 m, 1/f = 298.3',
});

const GIGS = 'parameters as in the IOGP GIGS Test Dataset v2.1 (EPSG dataset 10.019)';
const MEMORY = 'EPSG Geodetic Parameter Dataset, from memory: check against the authority';

type Entry = Omit<ProjectedCrs, 'kind' | 'code' | 'axisOrder'> & { axisOrder?: 'NE' };

const GRIDS: Readonly<Record<string, Entry>> = {
  '27700': {
    name: 'OSGB36 / British National Grid',
    method: 'transverse-mercator',
    ellipsoid: AIRY_1830,
    lat0: 49,
    lon0: -2,
    k0: '0.9996012717',
    falseEasting: 400000,
    falseNorthing: -100000,
    source: 'Ordnance Survey, A guide to coordinate systems in Great Britain, annex C',
  },
  '2154': {
    name: 'RGF93 / Lambert-93',
    method: 'lambert-conic-2sp',
    ellipsoid: GRS80,
    lat0: 46.5,
    lon0: 3,
    lat1: 49,
    lat2: 44,
    falseEasting: 700000,
    falseNorthing: 6600000,
    source: MEMORY,
  },
  '31370': {
    name: 'Belge 1972 / Belgian Lambert 72',
    method: 'lambert-conic-2sp',
    ellipsoid: INTERNATIONAL_1924,
    lat0: '90',
    lon0: '4.2202952',
    lat1: '51.100000204',
    lat2: '49.500000204',
    falseEasting: '150000.013',
    falseNorthing: '5400088.438',
    angleUnit: 'dms-packed',
    pointAngleUnit: 'deg',
    source: GIGS,
  },
  '28992': {
    name: 'Amersfoort / RD New',
    method: 'oblique-stereographic',
    ellipsoid: BESSEL_1841,
    lat0: '52.0922178',
    lon0: '5.23155',
    k0: '0.9999079',
    falseEasting: 155000,
    falseNorthing: 463000,
    angleUnit: 'dms-packed',
    pointAngleUnit: 'deg',
    source: GIGS,
  },
  '3035': {
    name: 'ETRS89-extended / LAEA Europe',
    method: 'lambert-azimuthal-equal-area',
    ellipsoid: GRS80,
    lat0: 52,
    lon0: 10,
    falseEasting: 4321000,
    falseNorthing: 3210000,
    axisOrder: 'NE',
    source: GIGS,
  },
  '3577': {
    name: 'GDA94 / Australian Albers',
    method: 'albers-equal-area',
    ellipsoid: GRS80,
    lat0: 0,
    lon0: 132,
    lat1: -18,
    lat2: -36,
    source: GIGS,
  },
  '5070': {
    name: 'NAD83 / Conus Albers',
    method: 'albers-equal-area',
    ellipsoid: GRS80,
    lat0: 23,
    lon0: -96,
    lat1: 29.5,
    lat2: 45.5,
    source: MEMORY,
  },
  '3388': {
    name: 'Pulkovo 1942 / Caspian Sea Mercator',
    method: 'mercator-2sp',
    ellipsoid: KRASSOWSKY_1940,
    lat1: 42,
    lon0: 51,
    axisOrder: 'NE',
    source: GIGS,
  },
  '2193': {
    name: 'NZGD2000 / New Zealand Transverse Mercator 2000',
    method: 'transverse-mercator',
    ellipsoid: GRS80,
    lat0: 0,
    lon0: 173,
    k0: '0.9996',
    falseEasting: 1600000,
    falseNorthing: 10000000,
    axisOrder: 'NE',
    source: MEMORY,
  },
  '32661': {
    name: 'WGS 84 / UPS North (N,E)',
    method: 'polar-stereographic-a',
    ellipsoid: WGS84,
    lat0: 90,
    lon0: 0,
    k0: '0.994',
    falseEasting: 2000000,
    falseNorthing: 2000000,
    axisOrder: 'NE',
    source: MEMORY,
  },
  '32761': {
    name: 'WGS 84 / UPS South (N,E)',
    method: 'polar-stereographic-a',
    ellipsoid: WGS84,
    lat0: -90,
    lon0: 0,
    k0: '0.994',
    falseEasting: 2000000,
    falseNorthing: 2000000,
    axisOrder: 'NE',
    source: MEMORY,
  },
  '3031': {
    name: 'WGS 84 / Antarctic Polar Stereographic',
    method: 'polar-stereographic-b',
    ellipsoid: WGS84,
    lat1: -71,
    lon0: 0,
    source: MEMORY,
  },
  '3413': {
    name: 'WGS 84 / NSIDC Sea Ice Polar Stereographic North',
    method: 'polar-stereographic-b',
    ellipsoid: WGS84,
    lat1: 70,
    lon0: -45,
    source: MEMORY,
  },
};

const WGS84_GEOGRAPHIC: GeographicCrs = /* @__PURE__ */ Object.freeze({
  kind: 'geographic',
  code: 'EPSG:4326',
  name: 'WGS 84',
  ellipsoid: WGS84,
  source: 'EPSG CRS 4326 (latitude, longitude in degrees; EPSG lists latitude first)',
});

/**
 * The EPSG codes of {@link crs}'s table (UTM zones as ranges), for messages and listings.
 * @example
 * ```ts
 * import { CRS_CODES } from 'quadspread';
 * CRS_CODES.includes('EPSG:27700');
 * //=> true
 * ```
 */
// Built in a pure function call so that a bundle which does not use it drops it, and the
// table with it.
export const CRS_CODES: readonly string[] = /* @__PURE__ */ (() =>
  Object.freeze([
    'EPSG:4326',
    'EPSG:32601…32660 (WGS 84 / UTM zones 1N–60N)',
    'EPSG:32701…32760 (WGS 84 / UTM zones 1S–60S)',
    ...Object.keys(GRIDS).map((c) => `EPSG:${c}`),
  ]))();

/** WGS 84 geographic (EPSG:4326): see the last signature of {@link crs}. */
export function crs(code: 'EPSG:4326'): GeographicCrs;
/** A projected CRS of the table: see the last signature of {@link crs}. */
export function crs(code: string | number): ProjectedCrs;
/**
 * A coordinate reference system by EPSG code, from a small table: `'EPSG:4326'` (WGS 84
 * geographic), `'EPSG:326zz'` and `'EPSG:327zz'` (WGS 84 / UTM zone zz north and south), UPS
 * north and south (32661, 32761), and national and continental grids (see {@link CRS_CODES}).
 * A projected CRS is a projection object: `toGrid(A, p, crs('EPSG:32633'))` works as it is.
 * The table gives the projection only — a datum change (e.g. ETRS89 to OSGB36) is a separate
 * transformation. Axis order is named in `axisOrder` (`'NE'` where the published coordinate
 * system lists northing first); results are always named `E`, `N`.
 *
 * @param code `'EPSG:n'` (or `n` alone)
 * @returns a frozen {@link ProjectedCrs} (or {@link GeographicCrs} for 4326)
 * @throws {QuadspreadError} `UNKNOWN_CRS` for a code not in the table.
 * @example
 * ```ts
 * import { float, toGrid, crs } from 'quadspread';
 * crs('EPSG:32633').name;
 * //=> 'WGS 84 / UTM zone 33N'
 * toGrid(float, { lat: 0, lon: 15 }, crs('EPSG:32633')).E;
 * //=> 500000
 * ```
 */
export function crs(code: string | number): ProjectedCrs | GeographicCrs {
  const text = typeof code === 'number' ? String(code) : typeof code === 'string' ? code : '';
  const m = /^\s*(?:EPSG\s*:\s*)?(\d{4,5})\s*$/i.exec(text);
  const n = m?.[1];
  if (n === '4326') return WGS84_GEOGRAPHIC;
  const made = n === undefined ? undefined : make(n);
  if (made) return made;
  throw new QuadspreadError(
    'UNKNOWN_CRS',
    'crs(code)',
    `${show(code)} is not in the table (${CRS_CODES.join(', ')}); define other systems by their parameters`,
  );
}

function make(n: string): ProjectedCrs | undefined {
  const v = Number(n);
  if ((v > 32600 && v <= 32660) || (v > 32700 && v <= 32760)) {
    const zone = v % 100;
    const south = v > 32700;
    return Object.freeze({
      ...utmProjection(zone, south ? 'S' : 'N'),
      kind: 'projected',
      code: `EPSG:${n}`,
      name: `WGS 84 / UTM zone ${zone}${south ? 'S' : 'N'}`,
      source: 'NIMA TR 8358.2 (UTM), EPSG CRS codes 32601-32760',
      axisOrder: 'EN',
    });
  }
  const g = GRIDS[n];
  if (!g) return undefined;
  return Object.freeze({ axisOrder: 'EN', ...g, kind: 'projected', code: `EPSG:${n}` });
}
