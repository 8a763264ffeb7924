/**
 * GeoJSON in: `Point` features as named points, converted from WGS 84 longitude and latitude
 * to a stated grid (or read as plane coordinates from a file marked so).
 *
 * @module io
 */
import { QuadspreadError, type Arithmetic } from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import { PLANE_MARK } from './geojson-write.js';
import type { ExchangePoint } from './point.js';
import { prepareReference, type Wgs84Reference } from './reference.js';

/**
 * Options of {@link pointsFromGeoJson}: `reference` (the grid to convert longitude and
 * latitude to, and the datum transformation from it to WGS 84); `coordinates` (`'wgs84'`,
 * the default, or `'plane'` for a file of plane coordinates); `nameProperty` (default
 * `'name'`), `heightProperty` (default `'height'`) and `codeProperty` (default `'code'`);
 * `others`: what to do with features that are not points (`'refuse'`, the default, or
 * `'skip'`).
 */
export interface GeoJsonReadOptions<T> {
  /** The grid and the datum transformation to WGS 84 (used in reverse). */
  readonly reference?: Wgs84Reference<T>;
  /** `'wgs84'` (default) or `'plane'`. */
  readonly coordinates?: 'wgs84' | 'plane';
  /** The property holding the point's name (default `'name'`). */
  readonly nameProperty?: string;
  /** The property holding the height (default `'height'`). */
  readonly heightProperty?: string;
  /** The property holding the point code (default `'code'`). */
  readonly codeProperty?: string;
  /** Features other than points: `'refuse'` (default) or `'skip'`. */
  readonly others?: 'refuse' | 'skip';
}

const bad = (where: string, what: string) => new QuadspreadError('INVALID_FILE', where, what);

/**
 * The `Point` features of a GeoJSON document (a `FeatureCollection` or a `Feature`, as text
 * or parsed) as named points in a grid: each position (longitude, latitude on WGS 84) goes
 * back through the stated datum transformation and grid, as {@link wgs84ToGrid} does; a third
 * coordinate (a height above the WGS 84 ellipsoid) is not read. The name comes from the
 * property `nameProperty` (text, or a number written as text); the height and the code from
 * their properties when present. Numbers are read through their shortest decimal text, so
 * plane coordinates written with up to 15 significant digits come back exactly in `rational`.
 *
 * A file of plane coordinates (marked `planeCoordinates` by {@link toGeoJson}) is read only
 * with `coordinates: 'plane'`; `coordinates: 'plane'` reads an unmarked file's positions as
 * plane coordinates too, on the caller's word.
 *
 * @param A the arithmetic of the results
 * @param input the document: JSON text or the parsed object
 * @param options `{ reference, coordinates?, nameProperty?, heightProperty?, codeProperty?,
 *   others? }`
 * @returns the points, in file order
 * @throws {@link QuadspreadError} `INVALID_FILE` for text that is not JSON, a document that is
 *   not a feature collection or feature, a feature that is not a point (unless skipped), a
 *   missing or repeated name, or a bad position or value (naming the feature);
 *   `MISSING_REFERENCE_SYSTEM` without a grid (or, off WGS 84, a datum transformation);
 *   `INVALID_ARGUMENT` for bad options or plane coordinates read as longitude and latitude.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { pointsFromGeoJson } from 'quadspread/io';
 * const text = '{"type":"FeatureCollection","features":[{"type":"Feature","geometry":{"type":"Point","coordinates":[15,0]},"properties":{"name":"P1","height":12.5}}]}';
 * const [p] = pointsFromGeoJson(rational, text, { reference: { grid: 'EPSG:32633' } });
 * [p.name, rational.toString(p.x), rational.toString(p.y), rational.toString(p.height)];
 * //=> ['P1', '500000', '0', '25/2']
 * ```
 */
export function pointsFromGeoJson<T>(
  A: Arithmetic<T, boolean>,
  input: string | object,
  options: GeoJsonReadOptions<T> = {},
): ExchangePoint<T>[] {
  const where = 'pointsFromGeoJson';
  checkArithmetic(A, where);
  const o = (options ?? {}) as GeoJsonReadOptions<T>;
  const mode = o.coordinates ?? 'wgs84';
  const others = o.others ?? 'refuse';
  if (mode !== 'wgs84' && mode !== 'plane')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.coordinates)`,
      `${show(mode)} is not 'wgs84' or 'plane'`,
    );
  if (others !== 'refuse' && others !== 'skip')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.others)`,
      `${show(others)} is not 'refuse' or 'skip'`,
    );
  const keys = {
    name: o.nameProperty ?? 'name',
    height: o.heightProperty ?? 'height',
    code: o.codeProperty ?? 'code',
  };
  for (const [k, v] of Object.entries(keys))
    if (typeof v !== 'string' || v === '')
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}(options.${k}Property)`,
        `${show(v)} is not a property name`,
      );

  let doc: unknown = input;
  if (typeof input === 'string') {
    try {
      doc = JSON.parse(input.replace(/^\uFEFF/, ''));
    } catch (e) {
      throw bad(`${where}(input)`, `not JSON: ${(e as Error).message}`);
    }
  }
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc))
    throw bad(`${where}(input)`, `${show(doc)} is not a GeoJSON object`);
  const type = (doc as { type?: unknown }).type;
  let features: unknown[];
  if (type === 'FeatureCollection') {
    const f = (doc as { features?: unknown }).features;
    if (!Array.isArray(f)) throw bad(`${where}(input).features`, `${show(f)} is not an array`);
    features = f;
  } else if (type === 'Feature') features = [doc];
  else
    throw bad(
      `${where}(input).type`,
      `${show(type)} is not 'FeatureCollection' or 'Feature' (a bare geometry has no name)`,
    );
  const marked = (doc as Record<string, unknown>)[PLANE_MARK] !== undefined;
  if (marked && mode !== 'plane')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.coordinates)`,
      `the file holds plane coordinates (it is marked ${PLANE_MARK}, not RFC 7946): read it with coordinates: 'plane'`,
    );
  const ref =
    mode === 'wgs84' ? prepareReference(A, o.reference, `${where}(options.reference)`) : undefined;

  const out: ExchangePoint<T>[] = [];
  const names = new Set<string>();
  features.forEach((f, i) => {
    const at = `${where}(input).features[${i}]`;
    if (typeof f !== 'object' || f === null || (f as { type?: unknown }).type !== 'Feature')
      throw bad(at, `${show(f)} is not a Feature`);
    const g = (f as { geometry?: unknown }).geometry as {
      type?: unknown;
      coordinates?: unknown;
    } | null;
    if (g === null || typeof g !== 'object' || g.type !== 'Point') {
      if (others === 'skip') return;
      throw bad(
        `${at}.geometry`,
        `${g === null || typeof g !== 'object' ? show(g) : `a ${show(g.type)} geometry`} is not a Point (pass others: 'skip' to leave such features out)`,
      );
    }
    const props = (f as { properties?: unknown }).properties;
    const p = (typeof props === 'object' && props !== null ? props : {}) as Record<string, unknown>;
    const rawName = p[keys.name];
    const name =
      typeof rawName === 'number' && Number.isFinite(rawName) ? String(rawName) : rawName;
    if (typeof name !== 'string' || name === '')
      throw bad(
        `${at}.properties.${keys.name}`,
        `${show(rawName)} is not a name (choose the property with nameProperty)`,
      );
    if (names.has(name))
      throw bad(`${at}.properties.${keys.name}`, `the name ${show(name)} is repeated`);
    names.add(name);
    const c = g.coordinates;
    if (
      !Array.isArray(c) ||
      c.length < 2 ||
      c.length > 3 ||
      !c.every((v) => typeof v === 'number' && Number.isFinite(v))
    )
      throw bad(
        `${at}.geometry.coordinates`,
        `${show(c)} is not a position [x, y] or [x, y, z] of numbers`,
      );
    const [u, v] = c as number[];
    let x: T;
    let y: T;
    if (ref === undefined) {
      x = A.from(u!);
      y = A.from(v!);
    } else {
      if (Math.abs(u!) > 180 || Math.abs(v!) > 90)
        throw bad(
          `${at}.geometry.coordinates`,
          `[${u}, ${v}] is not a longitude and latitude in degrees`,
        );
      ({ x, y } = ref.fromLonLat(u!, v!));
    }
    const point: { name: string; x: T; y: T; height?: T; code?: string } = { name, x, y };
    const h = p[keys.height];
    if (h !== undefined && h !== null) {
      if (typeof h !== 'number' && typeof h !== 'string')
        throw bad(`${at}.properties.${keys.height}`, `${show(h)} is not a number`);
      try {
        point.height = A.from(h);
      } catch (e) {
        throw bad(`${at}.properties.${keys.height}`, (e as Error).message);
      }
    }
    const code = p[keys.code];
    if (code !== undefined && code !== null) {
      if (typeof code !== 'string' && typeof code !== 'number')
        throw bad(`${at}.properties.${keys.code}`, `${show(code)} is not a point code`);
      point.code = String(code);
    }
    out.push(point);
  });
  return out;
}
