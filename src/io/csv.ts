/**
 * CSV point files: a header naming the columns (name, east, north, height, code; names
 * configurable, order free), any delimiter, RFC 4180 quoting with line breaks inside quotes,
 * a byte order mark, CRLF; read whole or streamed, written in an exchange or a spreadsheet mode.
 *
 * @module io
 */
import { CsvError, parse as parseStream } from 'csv-parse';
import { parse as parseSync } from 'csv-parse/sync';
import { Readable } from 'node:stream';
import { QuadspreadError, type Arithmetic } from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import { csvCell } from './csv-cell.js';
import { fixedText } from './numbers.js';
import type { ExchangePoint, ExchangePointInput } from './point.js';

/** The header names of the columns (defaults: `name`, `east`, `north`, `height`, `code`). */
export interface CsvColumns {
  /** The point's name (required in a file). */
  readonly name?: string;
  /** Easting (required). */
  readonly east?: string;
  /** Northing (required). */
  readonly north?: string;
  /** Height (optional in a file). */
  readonly height?: string;
  /** Point code (optional in a file). */
  readonly code?: string;
}

/**
 * Options of the CSV readers: `columns` (the header names, matched without regard to case or
 * surrounding spaces), `delimiter` (one character; by default the one of `,` `;` tab `|` found
 * most often in the header line), `decimalComma` (numbers written `1234,56`; default false).
 */
export interface CsvReadOptions {
  /** Header names of the columns. */
  readonly columns?: CsvColumns;
  /** The field delimiter (default: found from the header line). */
  readonly delimiter?: string;
  /** Numbers with a decimal comma (default false). */
  readonly decimalComma?: boolean;
}

/**
 * Options of {@link pointsToCsv}: the `mode` (`'exchange'`: text kept as it is, so a round
 * trip is exact; `'spreadsheet'`: cells that a spreadsheet would run as formulas neutralised),
 * `columns`, `delimiter` (default `,`), `eol` (default `\n`), `decimals` (default: the exact
 * value, to 40 significant digits in an exact arithmetic).
 */
export interface CsvWriteOptions {
  /** `'exchange'` or `'spreadsheet'`. */
  readonly mode: 'exchange' | 'spreadsheet';
  /** Header names of the columns. */
  readonly columns?: CsvColumns;
  /** The field delimiter (default `,`). */
  readonly delimiter?: string;
  /** The line end (default `\n`). */
  readonly eol?: '\n' | '\r\n';
  /** Decimals of the coordinates and heights (0 to 12; default exact). */
  readonly decimals?: number;
}

const KEYS = ['name', 'east', 'north', 'height', 'code'] as const;
const REQUIRED = new Set<string>(['name', 'east', 'north']);
const DELIMITERS = [',', ';', '\t', '|'];
// Longest record read (characters): an unclosed quote ends in an error, not in a whole file
// held in memory.
const MAX_RECORD = 1 << 20;

const bad = (where: string, what: string) => new QuadspreadError('INVALID_FILE', where, what);

function columnNames(
  c: CsvColumns | undefined,
  where: string,
): Record<(typeof KEYS)[number], string> {
  if (c !== undefined && (typeof c !== 'object' || c === null))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.columns)`,
      `${show(c)} is not { name?, east?, north?, height?, code? }`,
    );
  const out = {} as Record<(typeof KEYS)[number], string>;
  for (const k of KEYS) {
    const v = c?.[k] ?? k;
    if (typeof v !== 'string' || v.trim() === '')
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}(options.columns.${k})`,
        `${show(v)} is not a column name`,
      );
    out[k] = v;
  }
  return out;
}

function checkDelimiter(d: unknown, where: string): string {
  if (typeof d !== 'string' || d.length !== 1 || /["\r\n]/.test(d))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.delimiter)`,
      `${show(d)} is not one character other than a quote or a line break`,
    );
  return d;
}

/** The delimiter of the header line: the candidate found most often outside quotes (`,` by default). */
function delimiterOf(text: string): string {
  const line = text
    .replace(/^\uFEFF/, '')
    .split(/\r?\n|\r/, 1)[0]!
    .replace(/"[^"]*"/g, '');
  let best = ',';
  let most = 0;
  for (const d of DELIMITERS) {
    const n = line.split(d).length - 1;
    if (n > most) [best, most] = [d, n];
  }
  return best;
}

/** Reads the header and returns the reader of the records that follow it. */
function rowReader<T>(
  A: Arithmetic<T, boolean>,
  header: string[],
  o: CsvReadOptions,
  where: string,
): (record: string[], line: number) => ExchangePoint<T> {
  const names = columnNames(o.columns, where);
  const index = {} as Record<(typeof KEYS)[number], number>;
  const seen = header.map((h) => h.trim().toLowerCase());
  for (const k of KEYS) {
    const want = names[k].trim().toLowerCase();
    const at = seen.indexOf(want);
    if (at >= 0 && seen.indexOf(want, at + 1) >= 0)
      throw bad(`${where}: line 1`, `the column ${show(names[k])} appears twice in the header`);
    if (at < 0 && REQUIRED.has(k))
      throw new QuadspreadError(
        'MISSING_COLUMN',
        `${where}: line 1`,
        `no column ${show(names[k])} (the ${k}) in the header ${show(header.join(','))}; name the columns with options.columns`,
      );
    index[k] = at;
  }
  const comma = o.decimalComma === true;
  const num = (text: string, key: string, line: number): T => {
    const t = comma ? text.trim().replace(',', '.') : text.trim();
    try {
      return A.from(t);
    } catch (e) {
      throw bad(
        `${where}: line ${line}, column ${show(names[key as 'east'])}`,
        (e as Error).message,
      );
    }
  };
  return (r, line) => {
    const name = r[index.name]!;
    if (name === '') throw bad(`${where}: line ${line}`, 'the name is empty');
    const east = r[index.east]!;
    const north = r[index.north]!;
    if (east.trim() === '' || north.trim() === '')
      throw bad(
        `${where}: line ${line}`,
        `the point ${show(name)} has no ${east.trim() === '' ? 'east' : 'north'} coordinate`,
      );
    const p: { name: string; x: T; y: T; height?: T; code?: string } = {
      name,
      x: num(east, 'east', line),
      y: num(north, 'north', line),
    };
    const h = index.height < 0 ? '' : r[index.height]!;
    if (h.trim() !== '') p.height = num(h, 'height', line);
    const c = index.code < 0 ? '' : r[index.code]!;
    if (c !== '') p.code = c;
    return p;
  };
}

function parserOptions(delimiter: string) {
  return {
    delimiter,
    bom: true,
    info: true,
    skip_empty_lines: true,
    relax_column_count: false,
    max_record_size: MAX_RECORD,
  } as const;
}

/** A csv-parse error as INVALID_FILE naming the line. */
function fromCsvError(e: unknown, where: string): unknown {
  if (e instanceof QuadspreadError) return e;
  const err = e as CsvError & { lines?: number };
  if (e instanceof CsvError || (typeof err?.code === 'string' && err.code.startsWith('CSV_')))
    return bad(`${where}${err.lines === undefined ? '' : `: line ${err.lines}`}`, err.message);
  return e;
}

function readOptions(options: CsvReadOptions | undefined, where: string): CsvReadOptions {
  const o = options ?? {};
  if (typeof o !== 'object' || o === null)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options)`,
      `${show(o)} is not an object`,
    );
  if (o.delimiter !== undefined) checkDelimiter(o.delimiter, where);
  columnNames(o.columns, where);
  return o;
}

/**
 * Reads a CSV point file: a header line naming the columns, then one point per record. The
 * columns `name`, `east` and `north` are required, `height` and `code` optional, others
 * ignored; their names are configurable and matched without regard to case or surrounding
 * spaces, in any order. Fields may be quoted (RFC 4180: quotes doubled, delimiters and line
 * breaks inside quotes); a byte order mark, CRLF line ends and empty lines are accepted. Names
 * and codes are kept exactly as written; numbers are read exactly (in `rational`, `0.1` is
 * 1/10). Repeated names are refused.
 *
 * @param A the arithmetic of the coordinates
 * @param text the file's text (or its bytes, UTF-8)
 * @param options `{ columns?, delimiter?, decimalComma? }`
 * @returns the points, in file order
 * @throws {@link QuadspreadError} `MISSING_COLUMN` naming a required column the header lacks;
 *   `INVALID_FILE` naming the line for broken quoting, a record of the wrong length, an empty
 *   name or coordinate, a number that cannot be read, a repeated name; `INVALID_ARGUMENT` for
 *   bad options.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { pointsFromCsv } from 'quadspread/io';
 * const pts = pointsFromCsv(rational, 'Code;Name;North;East\r\nCP;"Stake ""A""";5310.25;3420.1\r\n');
 * [pts[0].name, pts[0].code, rational.toString(pts[0].x), rational.toString(pts[0].y)];
 * //=> ['Stake "A"', 'CP', '34201/10', '21241/4']
 * ```
 */
export function pointsFromCsv<T>(
  A: Arithmetic<T, boolean>,
  text: string | Uint8Array,
  options?: CsvReadOptions,
): ExchangePoint<T>[] {
  const where = 'pointsFromCsv';
  checkArithmetic(A, where);
  const o = readOptions(options, where);
  if (typeof text !== 'string' && !(text instanceof Uint8Array))
    throw new QuadspreadError('INVALID_ARGUMENT', `${where}(text)`, `${show(text)} is not text`);
  const s = typeof text === 'string' ? text : new TextDecoder().decode(text);
  let rows: { record: string[]; info: { lines: number } }[];
  try {
    rows = parseSync(s, parserOptions(o.delimiter ?? delimiterOf(s))) as never;
  } catch (e) {
    throw fromCsvError(e, where);
  }
  if (rows.length === 0) throw bad(where, 'the file is empty: no header line');
  const read = rowReader(A, rows[0]!.record, o, where);
  const out: ExchangePoint<T>[] = [];
  const names = new Set<string>();
  for (let i = 1; i < rows.length; i++) {
    const { record, info } = rows[i]!;
    const p = read(record, info.lines);
    if (names.has(p.name))
      throw bad(`${where}: line ${info.lines}`, `the name ${show(p.name)} is repeated`);
    names.add(p.name);
    out.push(p);
  }
  return out;
}

/**
 * Reads a CSV point file as a stream, one point at a time, in memory bounded by the longest
 * record (not the file): for files of millions of points. Takes any async iterable of text or
 * bytes — a Node readable stream (`fs.createReadStream(path)`), a web stream's chunks — and
 * reads it as {@link pointsFromCsv} does, except that repeated names are left to the caller
 * (checking them would hold every name). Stopping the loop early stops the reading.
 *
 * @param A the arithmetic of the coordinates
 * @param input the file's content, in chunks (text or UTF-8 bytes)
 * @param options `{ columns?, delimiter?, decimalComma? }`
 * @returns an async iterator of the points, in file order
 * @throws {@link QuadspreadError} as {@link pointsFromCsv} (when the iteration reaches the
 *   bad record), and `INVALID_ARGUMENT` for an input that is not iterable.
 * @example
 * ```ts
 * import { float } from 'quadspread';
 * import { streamPointsFromCsv } from 'quadspread/io';
 * const chunks = ['name,east,no', 'rth\nP1,10,20\nP2,', '30,40\n'];
 * const names = [];
 * for await (const p of streamPointsFromCsv(float, chunks)) names.push(`${p.name}@${p.x},${p.y}`);
 * names;
 * //=> ['P1@10,20', 'P2@30,40']
 * ```
 */
export async function* streamPointsFromCsv<T>(
  A: Arithmetic<T, boolean>,
  input: AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>,
  options?: CsvReadOptions,
): AsyncGenerator<ExchangePoint<T>, void, undefined> {
  const where = 'streamPointsFromCsv';
  checkArithmetic(A, where);
  const o = readOptions(options, where);
  const it = input as { [Symbol.asyncIterator]?: unknown; [Symbol.iterator]?: unknown } | null;
  if (
    typeof input === 'string' ||
    typeof it !== 'object' ||
    it === null ||
    (typeof it[Symbol.asyncIterator] !== 'function' && typeof it[Symbol.iterator] !== 'function')
  )
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(input)`,
      `${show(input)} is not an iterable of chunks`,
    );
  // The delimiter, when not given, from the header line: read chunks until it is complete.
  const source = (async function* () {
    const it = input as AsyncIterable<string | Uint8Array>;
    const decoder = new TextDecoder();
    for await (const chunk of it) {
      if (typeof chunk === 'string') yield chunk;
      else if (chunk instanceof Uint8Array) yield decoder.decode(chunk, { stream: true });
      else
        throw new QuadspreadError(
          'INVALID_ARGUMENT',
          `${where}(input)`,
          `a chunk ${show(chunk)} is not text or bytes`,
        );
    }
    const rest = decoder.decode();
    if (rest !== '') yield rest;
  })();
  let delimiter = o.delimiter;
  const head: string[] = [];
  if (delimiter === undefined) {
    let seen = '';
    for (;;) {
      const n = await source.next();
      if (n.done) break;
      head.push(n.value);
      seen += n.value;
      if (/[\r\n]/.test(seen) || seen.length > MAX_RECORD) break;
    }
    delimiter = delimiterOf(seen);
  }
  const parser = parseStream(parserOptions(delimiter));
  const feed = Readable.from(
    (async function* () {
      yield* head;
      yield* source;
    })(),
  );
  feed.on('error', (e) => parser.destroy(e));
  feed.pipe(parser);
  let read: ((r: string[], line: number) => ExchangePoint<T>) | undefined;
  try {
    for await (const row of parser as AsyncIterable<{
      record: string[];
      info: { lines: number };
    }>) {
      if (read === undefined) read = rowReader(A, row.record, o, where);
      else yield read(row.record, row.info.lines);
    }
  } catch (e) {
    throw fromCsvError(e, where);
  } finally {
    feed.destroy();
    parser.destroy();
  }
  if (read === undefined) throw bad(where, 'the file is empty: no header line');
}

/**
 * Writes points as a CSV point file with a header: `name`, `east`, `north`, then `height` and
 * `code` when any point has them (the names configurable). Two modes:
 *
 * - `'exchange'`: names and codes kept exactly as they are (quoted when they hold the
 *   delimiter, a quote or a line break), so that {@link pointsFromCsv} gives back the same
 *   points: exactly, in `rational`, when the values are decimals of up to 40 significant
 *   digits (or `decimals` is given and they have no more).
 * - `'spreadsheet'`: every cell that a spreadsheet would run as a formula (starting with `=`,
 *   `+`, `-`, `@`, a tab or a carriage return, and not a number) is written as text with a
 *   leading `'` (the OWASP "CSV Injection" guidance), as the command-line batch output does.
 *   Such a name does not read back as it was.
 *
 * Values are written exactly (in an exact arithmetic, to 40 significant digits), or rounded
 * exactly to `decimals`.
 *
 * @param A the arithmetic of the coordinates
 * @param points `{ name, x, y, height?, code? }`
 * @param options `{ mode, columns?, delimiter?, eol?, decimals? }`
 * @returns the file's text
 * @throws {@link QuadspreadError} `INVALID_ARGUMENT` for a missing or unknown mode, bad
 *   options, a point without a name; `INVALID_NUMBER` for a coordinate that is not a number.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { pointsToCsv } from 'quadspread/io';
 * const pts = [{ name: '=HYPERLINK("x")', x: '3420.1', y: '1/4', code: 'CP' }];
 * pointsToCsv(rational, pts, { mode: 'exchange' });
 * //=> 'name,east,north,code\n"=HYPERLINK(""x"")",3420.1,0.25,CP\n'
 * pointsToCsv(rational, pts, { mode: 'spreadsheet' });
 * //=> 'name,east,north,code\n"\'=HYPERLINK(""x"")",3420.1,0.25,CP\n'
 * ```
 */
export function pointsToCsv<T>(
  A: Arithmetic<T, boolean>,
  points: readonly ExchangePointInput<T>[],
  options: CsvWriteOptions,
): string {
  const where = 'pointsToCsv';
  checkArithmetic(A, where);
  const o = options as Partial<CsvWriteOptions> | null;
  const mode = o?.mode;
  if (mode !== 'exchange' && mode !== 'spreadsheet')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.mode)`,
      `${show(mode)} is not 'exchange' or 'spreadsheet' (choose one: the exchange mode keeps names exactly, the spreadsheet mode neutralises formulas)`,
    );
  const delimiter = checkDelimiter(o!.delimiter ?? ',', where);
  const eol = o!.eol ?? '\n';
  if (eol !== '\n' && eol !== '\r\n')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.eol)`,
      `${show(eol)} is not '\\n' or '\\r\\n'`,
    );
  const decimals = o!.decimals;
  if (decimals !== undefined && (!Number.isInteger(decimals) || decimals < 0 || decimals > 12))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.decimals)`,
      `${show(decimals)} is not a whole number from 0 to 12`,
    );
  const names = columnNames(o!.columns, where);
  if (!Array.isArray(points))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(points)`,
      `${show(points)} is not an array of points`,
    );
  const spreadsheet = mode === 'spreadsheet';
  const cell = (s: string) => csvCell(s, delimiter, spreadsheet);
  const value = (v: unknown): string => {
    const x = A.from(v as T);
    if (decimals !== undefined) return fixedText(A, x, decimals);
    if (!A.exact) return A.toString(x);
    const t = A.toPrecision(x, 40);
    return /e/i.test(t) || !t.includes('.') ? t : t.replace(/0+$/, '').replace(/\.$/, '');
  };
  // Array.from visits holes too (as undefined), where map would skip them.
  const list = Array.from(points, (p, i) => {
    if (typeof p !== 'object' || p === null || typeof p.name !== 'string' || p.name === '')
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}(points[${i}])`,
        `${show(p)} is not a point with a name`,
      );
    if (p.code !== undefined && typeof p.code !== 'string')
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}(points[${i}].code)`,
        `${show(p.code)} is not text`,
      );
    return p;
  });
  const withHeight = list.some((p) => p.height !== undefined);
  const withCode = list.some((p) => p.code !== undefined);
  const keys = KEYS.filter((k) => (k !== 'height' || withHeight) && (k !== 'code' || withCode));
  const lines = [keys.map((k) => cell(names[k])).join(delimiter)];
  for (const p of list) {
    const row = [cell(p.name), value(p.x), value(p.y)];
    if (withHeight) row.push(p.height === undefined ? '' : value(p.height));
    if (withCode) row.push(p.code === undefined ? '' : cell(p.code));
    lines.push(row.join(delimiter));
  }
  return lines.join(eol) + eol;
}
