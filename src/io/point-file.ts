/**
 * Points from a file of any supported format: the dispatch by extension and content.
 *
 * @module io
 */
import type { Arithmetic } from '../index.js';
import { checkArithmetic } from '../errors.js';
import { pointsFromCsv, type CsvReadOptions } from './csv.js';
import { dataFormatOf } from './format.js';
import { pointsFromGeoJson, type GeoJsonReadOptions } from './geojson-read.js';
import { pointsFromLandXml, type LandXmlReadOptions } from './landxml-read.js';
import type { ExchangePoint } from './point.js';

/** Options of {@link pointsFromFile}: those of each format's reader, by format. */
export interface PointFileOptions<T> {
  /** For a CSV point file. */
  readonly csv?: CsvReadOptions;
  /** For a GeoJSON document (the grid and datum, or plane coordinates). */
  readonly geojson?: GeoJsonReadOptions<T>;
  /** For a LandXML document. */
  readonly landxml?: LandXmlReadOptions;
}

/**
 * The points of a file, whatever its format: the format from the name and the first
 * characters ({@link dataFormatOf}), then {@link pointsFromCsv}, {@link pointsFromGeoJson} or
 * {@link pointsFromLandXml} (its `CgPoint`s, in the file's units) with the options given for
 * that format.
 *
 * @param A the arithmetic of the coordinates
 * @param fileName the file's name (its extension is read)
 * @param text the file's text
 * @param options `{ csv?, geojson?, landxml? }`: the options of each reader
 * @returns the points, in file order
 * @throws {@link QuadspreadError} `UNKNOWN_FORMAT` for a format that is not recognised; the
 *   errors of the format's reader.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { pointsFromFile } from 'quadspread/io';
 * pointsFromFile(rational, 'control.txt', 'name;east;north\nK1;100.5;200\n').map((p) => [p.name, rational.toString(p.x)]);
 * //=> [['K1', '201/2']]
 * ```
 */
export function pointsFromFile<T>(
  A: Arithmetic<T, boolean>,
  fileName: string,
  text: string,
  options: PointFileOptions<T> = {},
): ExchangePoint<T>[] {
  checkArithmetic(A, 'pointsFromFile');
  const format = dataFormatOf(fileName, typeof text === 'string' ? text.slice(0, 512) : text);
  const o = options ?? {};
  if (format === 'csv') return pointsFromCsv(A, text, o.csv);
  if (format === 'geojson') return pointsFromGeoJson(A, text, o.geojson);
  return pointsFromLandXml(A, text, o.landxml).map((p) => ({
    name: p.name,
    x: p.x,
    y: p.y,
    ...(p.height !== undefined ? { height: p.height } : {}),
    ...(p.code !== undefined ? { code: p.code } : {}),
  }));
}
