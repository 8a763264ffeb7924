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
