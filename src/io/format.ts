/**
 * Which data format a file holds: the dispatch of the point readers.
 *
 * @module io
 */
import { QuadspreadError, show } from '../errors.js';

/** A data format of the io entry: a CSV point file, a GeoJSON document, a LandXML document. */
export type DataFormat = 'csv' | 'geojson' | 'landxml';

const BY_EXTENSION: Record<string, DataFormat> = {
  csv: 'csv',
  tsv: 'csv',
  txt: 'csv',
  geojson: 'geojson',
  json: 'geojson',
  xml: 'landxml',
  landxml: 'landxml',
};

/** The format the first characters of a text show: `{` JSON, `<` XML, anything else CSV. */
function formatOfText(head: string): DataFormat | undefined {
  const first = /^\uFEFF?\s*(\S)/.exec(head)?.[1];
  if (first === undefined) return undefined;
  return first === '{' ? 'geojson' : first === '<' ? 'landxml' : 'csv';
}

/**
 * The data format of a file, from its name's extension (`.csv`, `.tsv`, `.txt`; `.geojson`,
 * `.json`; `.xml`, `.landxml`, in any case) and, when given, the first characters of its text
 * (after a byte order mark and white space: `{` is JSON, `<` is XML, anything else is CSV).
 * With an unknown extension the text decides; when both are known they must agree, so that a
 * file is never read as what it is not.
 *
 * @param fileName the file's name or path
 * @param head the first characters of the file's text (optional; a few hundred are plenty)
 * @returns `'csv'`, `'geojson'` or `'landxml'`
 * @throws {@link QuadspreadError} `INVALID_ARGUMENT` when the name or the text is not text;
 *   `UNKNOWN_FORMAT` when the extension is unknown and no text
 *   is given (or the text is empty), or when the extension and the text disagree.
 * @example
 * ```ts
 * import { dataFormatOf } from 'quadspread/io';
 * dataFormatOf('control.CSV');
 * //=> 'csv'
 * dataFormatOf('points.dat', '{"type":"FeatureCollection","features":[]}');
 * //=> 'geojson'
 * dataFormatOf('site.xml', '<?xml version="1.0"?><LandXML>');
 * //=> 'landxml'
 * ```
 */
export function dataFormatOf(fileName: string, head?: string): DataFormat {
  const where = `dataFormatOf(${show(fileName)})`;
  if (typeof fileName !== 'string')
    throw new QuadspreadError('INVALID_ARGUMENT', where, `${show(fileName)} is not a file name`);
  if (head !== undefined && typeof head !== 'string')
    throw new QuadspreadError('INVALID_ARGUMENT', `${where}(head)`, `${show(head)} is not text`);
  const ext = /\.([A-Za-z0-9]+)$/.exec(fileName)?.[1]?.toLowerCase();
  const byName = ext === undefined ? undefined : BY_EXTENSION[ext];
  const byText = head === undefined ? undefined : formatOfText(head);
  if (byName !== undefined && byText !== undefined && byName !== byText)
    throw new QuadspreadError(
      'UNKNOWN_FORMAT',
      where,
      `the name says ${byName} but the text begins like ${byText} (${show(head!.trimStart().slice(0, 20))})`,
    );
  const format = byName ?? byText;
  if (format === undefined)
    throw new QuadspreadError(
      'UNKNOWN_FORMAT',
      where,
      `${ext === undefined ? 'no extension' : `the extension .${ext} is not known`}${head === undefined ? '' : ' and the text is empty'}: name the file .csv, .geojson or .xml`,
    );
  return format;
}
