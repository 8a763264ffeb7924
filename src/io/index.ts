/**
 * quadspread/io — data exchange: GeoJSON (RFC 7946), CSV point files and LandXML 1.2, in and
 * out. A separate entry, so that bundles of the solvers never carry the parsers; it uses the
 * library's public areas and the `csv-parse` and `fast-xml-parser` packages.
 *
 * @module quadspread/io
 */
export { dataFormatOf } from './format.js';
export type { DataFormat } from './format.js';
// The error class every reader and writer throws (the same class as quadspread's, by brand).
export { QuadspreadError } from '../errors.js';
export type { ErrorCode } from '../errors.js';
export type { ExchangePoint, ExchangePointInput } from './point.js';
export { gridToWgs84, wgs84ToGrid } from './reference.js';
export type { Wgs84Reference } from './reference.js';
export { toGeoJson, PLANE_MARK } from './geojson-write.js';
export type {
  GeoJsonContent,
  GeoJsonPointInput,
  GeoJsonLineInput,
  GeoJsonParcelInput,
  GeoJsonWriteOptions,
  PlaneVertex,
} from './geojson-write.js';
export { pointsFromGeoJson } from './geojson-read.js';
export type { GeoJsonReadOptions } from './geojson-read.js';
export { pointsFromCsv, streamPointsFromCsv, pointsToCsv } from './csv.js';
export type { CsvColumns, CsvReadOptions, CsvWriteOptions } from './csv.js';
export { pointsFromFile } from './point-file.js';
export type { PointFileOptions } from './point-file.js';
export { readLandXml, pointsFromLandXml } from './landxml-read.js';
export type {
  LandXmlDocument,
  LandXmlObservation,
  LandXmlPoint,
  LandXmlReadOptions,
  LandXmlSetup,
} from './landxml-read.js';
export { toLandXml } from './landxml-write.js';
export type {
  LandXmlAlignmentInput,
  LandXmlContent,
  LandXmlLineInput,
  LandXmlParcelInput,
  LandXmlPointInput,
  LandXmlWriteOptions,
  LandXmlWriteUnit,
} from './landxml-write.js';
export { METRES_PER_LANDXML_UNIT } from './landxml-units.js';
export type { LandXmlAngularUnit, LandXmlLinearUnit, LandXmlUnits } from './landxml-units.js';
export { landXmlStations } from './landxml-field.js';
export type { LandXmlStation } from './landxml-field.js';
