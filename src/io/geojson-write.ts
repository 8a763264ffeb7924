/**
 * GeoJSON (RFC 7946) out: points, traverses and alignments as lines, parcels as polygons, in
 * WGS 84 longitude and latitude through a stated grid and datum, or — only when asked —
 * plane coordinates in a file marked as not RFC 7946.
 *
 * @module io
 */
import type { Feature, FeatureCollection, Geometry, Position } from 'geojson';
import {
  QuadspreadError,
  crs,
  settingOutTable,
  type Arithmetic,
  type HorizontalAlignment,
  type Numeric,
} from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import { contentList, parcelRing } from './content.js';
import { fixedNumber, numberOf } from './numbers.js';
import type { ExchangePointInput } from './point.js';
import { prepareReference, type PreparedReference, type Wgs84Reference } from './reference.js';

/** The plane coordinates of a vertex: x = east, y = north, in the grid's unit. */
export interface PlaneVertex<T> {
  /** Easting. */
  readonly x: Numeric<T>;
  /** Northing. */
  readonly y: Numeric<T>;
}

/**
 * A point to write: name, coordinates, and optionally its height, code, standard
 * uncertainties (m), error ellipse (semi-axes in m, azimuth of the major axis in degrees
 * clockwise from grid north) and properties of its own. An adjusted point of
 * `adjustNetwork` with a name added fits as it is.
 */
export interface GeoJsonPointInput<T> extends ExchangePointInput<T> {
  /** Standard uncertainty of x, m (a value or a root). */
  readonly sigmaX?: unknown;
  /** Standard uncertainty of y, m. */
  readonly sigmaY?: unknown;
  /** Standard uncertainty of the height, m. */
  readonly sigmaHeight?: unknown;
  /** Error ellipse: semi-axes, m; azimuth of the major axis, degrees from grid north. */
  readonly ellipse?: {
    readonly major: unknown;
    readonly minor: unknown;
    readonly azimuth: unknown;
  };
  /** Further properties, written as given (JSON values). */
  readonly properties?: Readonly<Record<string, unknown>>;
}

/**
 * A line to write as a `LineString`: a traverse, or any polyline, by its vertices; or an
 * alignment made by `horizontalAlignment`, sampled with `settingOutTable` at `interval` and at
 * every element end (so the arcs are drawn as chords no longer than the interval).
 */
export type GeoJsonLineInput<T> = {
  /** The line's name. */
  readonly name: string;
  /** What it is, written as `kind` (default `'line'`, or `'alignment'`). */
  readonly kind?: string;
  /** Further properties, written as given. */
  readonly properties?: Readonly<Record<string, unknown>>;
} & (
  | { readonly points: readonly PlaneVertex<T>[] }
  | { readonly alignment: HorizontalAlignment<T>; readonly interval: Numeric<T> }
);

/**
 * A parcel to write as a `Polygon`: its boundary's vertices in order, either way round (the
 * closing vertex may be repeated or not). Its area (grid units², from the plane coordinates,
 * not the ellipsoid) is written as `area`.
 */
export interface GeoJsonParcelInput<T> {
  /** The parcel's name. */
  readonly name: string;
  /** The boundary's vertices. */
  readonly points: readonly PlaneVertex<T>[];
  /** Further properties, written as given. */
  readonly properties?: Readonly<Record<string, unknown>>;
}

/** What {@link toGeoJson} writes: points, lines and parcels, each list optional. */
export interface GeoJsonContent<T> {
  /** Points, as `Point` features. */
  readonly points?: readonly GeoJsonPointInput<T>[];
  /** Traverses, alignments and other lines, as `LineString` features. */
  readonly lines?: readonly GeoJsonLineInput<T>[];
  /** Parcels, as `Polygon` features. */
  readonly parcels?: readonly GeoJsonParcelInput<T>[];
}

/**
 * Options of {@link toGeoJson}: `reference` (the grid and datum, see {@link Wgs84Reference}),
 * `coordinates` (`'wgs84'`, the default, as RFC 7946 requires; `'plane'` writes the plane
 * coordinates as they are, in a file marked as not RFC 7946), and `decimals` of the
 * coordinates (default 9 for degrees, about 0.1 mm; 4 for plane coordinates).
 */
export interface GeoJsonWriteOptions<T> {
  /** The grid and the datum transformation to WGS 84. */
  readonly reference?: Wgs84Reference<T>;
  /** `'wgs84'` (default) or `'plane'`. */
  readonly coordinates?: 'wgs84' | 'plane';
  /** Decimals of the coordinates (0 to 12). */
  readonly decimals?: number;
}

/**
 * The name of the foreign member that marks a GeoJSON file of plane coordinates (not
 * RFC 7946): {@link toGeoJson} writes it with `coordinates: 'plane'`, and
 * {@link pointsFromGeoJson} reads such a file only with `coordinates: 'plane'`.
 *
 * @example
 * ```ts
 * import { PLANE_MARK } from 'quadspread/io';
 * PLANE_MARK;
 * //=> 'planeCoordinates'
 * ```
 */
export const PLANE_MARK = 'planeCoordinates';

/**
 * Points, traverses, alignments and parcels as a GeoJSON `FeatureCollection` (RFC 7946).
 *
 * Positions are WGS 84 longitude and latitude in degrees, converted through the stated grid
 * and, unless the grid is on WGS 84, the stated datum transformation (see
 * {@link Wgs84Reference}); without them the conversion is refused, never guessed. Heights are
 * not written as a third coordinate (RFC 7946 makes it a height above the WGS 84 ellipsoid)
 * but as the property `height`, in the file's own height system.
 *
 * Every feature has `id` and the properties `name` and `kind` (`'point'`, the line's kind,
 * `'parcel'`); points add `height`, `code`, `sigmaX`, `sigmaY`, `sigmaHeight`, `ellipseMajor`,
 * `ellipseMinor` (m) and `ellipseAzimuth` (degrees from grid north) when given; parcels add
 * `area` (grid units², plane). Polygon rings are closed and run counterclockwise (the
 * right-hand rule of RFC 7946 §3.1.6). Coordinates are rounded exactly to `decimals`.
 *
 * With `coordinates: 'plane'` the plane coordinates are written as they are — a file for
 * tools that agree on the grid, not RFC 7946 — and the collection carries the foreign member
 * `planeCoordinates: { rfc7946: false, grid, axes }` (and, when the grid is an EPSG code, the
 * `crs` member of the 2008 GeoJSON format, which GIS software still reads).
 *
 * @param A the arithmetic of the coordinates
 * @param content `{ points?, lines?, parcels? }`
 * @param options `{ reference, coordinates?, decimals? }`
 * @returns the feature collection (pass it to `JSON.stringify`)
 * @throws {@link QuadspreadError} `MISSING_REFERENCE_SYSTEM` when longitude and latitude are
 *   asked for without a grid, or without a datum transformation off WGS 84; `INVALID_ARGUMENT`
 *   for bad options, a line of fewer than two vertices or one that crosses the antimeridian;
 *   `TOO_FEW_POINTS` for a parcel of fewer than three vertices; the errors of the conversions.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { toGeoJson } from 'quadspread/io';
 * const fc = toGeoJson(rational, { points: [{ name: 'P1', x: 500000, y: 0 }] }, { reference: { grid: 'EPSG:32633' } });
 * fc.features[0].geometry;
 * //=> { type: 'Point', coordinates: [15, 0] }
 * ```
 */
export function toGeoJson<T>(
  A: Arithmetic<T, boolean>,
  content: GeoJsonContent<T>,
  options: GeoJsonWriteOptions<T> = {},
): FeatureCollection {
  const where = 'toGeoJson';
  checkArithmetic(A, where);
  const o = (options ?? {}) as GeoJsonWriteOptions<T>;
  const mode = o.coordinates ?? 'wgs84';
  if (mode !== 'wgs84' && mode !== 'plane')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.coordinates)`,
      `${show(mode)} is not 'wgs84' or 'plane'`,
    );
  const decimals = o.decimals ?? (mode === 'plane' ? 4 : 9);
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 12)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.decimals)`,
      `${show(decimals)} is not a whole number from 0 to 12`,
    );
  if (typeof content !== 'object' || content === null)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(content)`,
      `${show(content)} is not { points?, lines?, parcels? }`,
    );
  // In plane mode the reference is optional and only names the grid (no datum needed).
  let ref: PreparedReference<T> | undefined;
  let code: string | undefined;
  if (mode === 'wgs84') {
    ref = prepareReference(A, o.reference, `${where}(options.reference)`);
    code = ref.code;
  } else {
    const grid = (o.reference as { grid?: unknown } | undefined)?.grid;
    if (typeof grid === 'string' || typeof grid === 'number') code = crs(grid).code;
  }
  const position = (x: Numeric<T>, y: Numeric<T>): Position => {
    if (mode === 'plane')
      return [fixedNumber(A, A.from(x), decimals), fixedNumber(A, A.from(y), decimals)];
    const w = ref!.toLonLat(x, y);
    return [fixedNumber(A, w.lon, decimals), fixedNumber(A, w.lat, decimals)];
  };
  const readVertices = (v: unknown, at: string): readonly PlaneVertex<T>[] =>
    list(v as readonly PlaneVertex<T>[], at).map((p, i) => {
      if (typeof p !== 'object' || p === null)
        throw new QuadspreadError(
          'INVALID_ARGUMENT',
          `${where}(content.${at}[${i}])`,
          `${show(p)} is not a vertex { x, y }`,
        );
      return p;
    });
  const features: Feature[] = [];
  const feature = (name: string, geometry: Geometry, props: Record<string, unknown>): void => {
    features.push({ type: 'Feature', id: name, geometry, properties: props });
  };
  const list = <X>(v: readonly X[] | undefined, what: string): readonly X[] =>
    contentList(v, where, what);
  const nameOf = (item: { name?: unknown } | null, at: string): string => {
    const name = item?.name;
    if (typeof name !== 'string' || name === '')
      throw new QuadspreadError('INVALID_ARGUMENT', `${at}.name`, `${show(name)} is not a name`);
    return name;
  };
  const extra = (p: unknown, at: string): Record<string, unknown> => {
    if (p === undefined) return {};
    if (typeof p !== 'object' || p === null || Array.isArray(p))
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${at}.properties`,
        `${show(p)} is not an object`,
      );
    return { ...(p as Record<string, unknown>) };
  };

  list(content.points, 'points').forEach((p, i) => {
    const at = `${where}(content.points[${i}])`;
    const name = nameOf(p, at);
    const props: Record<string, unknown> = { name, kind: 'point' };
    // Heights keep 4 decimals (0.1 mm) beside degrees, the coordinates' decimals beside plane ones.
    if (p.height !== undefined)
      props.height = fixedNumber(A, A.from(p.height), mode === 'plane' ? decimals : 4);
    if (p.code !== undefined) {
      if (typeof p.code !== 'string')
        throw new QuadspreadError('INVALID_ARGUMENT', `${at}.code`, `${show(p.code)} is not text`);
      props.code = p.code;
    }
    if (p.sigmaX !== undefined) props.sigmaX = numberOf(A, p.sigmaX);
    if (p.sigmaY !== undefined) props.sigmaY = numberOf(A, p.sigmaY);
    if (p.sigmaHeight !== undefined) props.sigmaHeight = numberOf(A, p.sigmaHeight);
    if (p.ellipse !== undefined) {
      if (typeof p.ellipse !== 'object' || p.ellipse === null)
        throw new QuadspreadError(
          'INVALID_ARGUMENT',
          `${at}.ellipse`,
          `${show(p.ellipse)} is not { major, minor, azimuth }`,
        );
      props.ellipseMajor = numberOf(A, p.ellipse.major);
      props.ellipseMinor = numberOf(A, p.ellipse.minor);
      props.ellipseAzimuth = numberOf(A, p.ellipse.azimuth);
    }
    feature(
      name,
      { type: 'Point', coordinates: position(p.x, p.y) },
      { ...props, ...extra(p.properties, at) },
    );
  });

  list(content.lines, 'lines').forEach((l, i) => {
    const at = `${where}(content.lines[${i}])`;
    const name = nameOf(l, at);
    let vertices: readonly PlaneVertex<T>[];
    if ('alignment' in l && l.alignment !== undefined) {
      const rows = settingOutTable(A as Arithmetic<T>, l.alignment, { interval: l.interval });
      vertices = rows.map((r) => r.points[0]!);
    } else vertices = readVertices((l as { points: unknown }).points, `lines[${i}].points`);
    if (vertices.length < 2)
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${at}.points`,
        `a line needs two vertices or more, got ${vertices.length}`,
      );
    const coordinates = vertices.map((v) => position(v.x, v.y));
    if (mode === 'wgs84') checkAntimeridian(coordinates, at);
    const kind = l.kind ?? ('alignment' in l ? 'alignment' : 'line');
    feature(name, { type: 'LineString', coordinates }, { name, kind, ...extra(l.properties, at) });
  });

  list(content.parcels, 'parcels').forEach((p, i) => {
    const at = `${where}(content.parcels[${i}])`;
    const name = nameOf(p, at);
    const open = parcelRing(A, readVertices(p.points, `parcels[${i}].points`), at);
    const signed = open.signed;
    let ring = open.ring;
    // RFC 7946 §3.1.6: an exterior ring runs counterclockwise. Map projections keep the sense
    // of a ring (they are orientation preserving), so the plane sense is the sense on the map.
    if (A.sign(signed) < 0) ring = [ring[0]!, ...ring.slice(1).reverse()];
    const coordinates = [...ring, ring[0]!].map((v) => position(v.x, v.y));
    if (mode === 'wgs84') checkAntimeridian(coordinates, at);
    feature(
      name,
      { type: 'Polygon', coordinates: [coordinates] },
      { name, kind: 'parcel', area: fixedNumber(A, A.abs(signed), 4), ...extra(p.properties, at) },
    );
  });

  const fc: FeatureCollection & Record<string, unknown> = { type: 'FeatureCollection', features };
  if (mode === 'plane') {
    fc[PLANE_MARK] = {
      rfc7946: false,
      grid: code ?? (o.reference === undefined ? 'unstated' : 'stated by its parameters'),
      axes: 'x east, y north',
    };
    if (code !== undefined)
      fc.crs = { type: 'name', properties: { name: `urn:ogc:def:crs:EPSG::${code.slice(5)}` } };
  }
  return fc;
}

/** RFC 7946 §3.1.9: a line crossing the antimeridian must be cut; refused here instead. */
function checkAntimeridian(coordinates: readonly Position[], at: string): void {
  for (let i = 1; i < coordinates.length; i++)
    if (Math.abs(coordinates[i]![0]! - coordinates[i - 1]![0]!) > 180)
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        at,
        `the line crosses the antimeridian between vertices ${i - 1} and ${i}: split it there`,
      );
}
