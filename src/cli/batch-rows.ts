/**
 * The rows of a batch: a kind set up for the header of a CSV, turning blocks of input lines
 * into blocks of output text. The same code runs on the main thread and in the workers of the
 * batch command, so that a block gives the same text wherever it is computed.
 *
 * @module cli
 */
import { QuadspreadError, angleToDegrees, float, formatDms } from '../index.js';
import type { AngleUnit, Arithmetic } from '../index.js';
import { decimalText, floatToPrecision } from './batch-format.js';
import { csvField } from './escape.js';
import { csvLine, splitCsvLine } from './csv.js';
import { JobInvalid } from './failure.js';
import { arithmeticFor } from './job.js';
import type { ArithmeticName } from './job.js';
import { BATCH_KINDS } from './tasks/batch-kinds.js';
import type { BatchKind, ColumnReading, KindContext } from './tasks/batch-kinds.js';

/** Longest line of a batch CSV, in characters (a row is a handful of numbers). */
export const MAX_CSV_LINE = 64 * 1024;

/** What a run of the batch command computes and writes (everything but where from and to). */
export interface RowOptions {
  arithmetic: ArithmeticName;
  digits: number;
  /** Also write the exact columns (fractions), in `rational`. */
  exact?: boolean;
  /** Angles written as decimal degrees (default) or DMS text. */
  angles?: 'degrees' | 'dms';
  /** Decimals of the seconds in DMS (0..6, default 1). */
  seconds?: number;
  /** At a bad row: stop (default) or note it in an `error` column and go on. */
  badRows?: 'stop' | 'note';
}

/** Why a row was not computed. */
export interface RowProblem {
  /** The line number in the file. */
  line: number;
  /** The column whose value is wrong, if one is. */
  column?: string;
  reason: string;
  /** A row that was read but has no solution (exit 3), rather than one that cannot be read (exit 2). */
  unsolvable: boolean;
}

/** The output of a block of lines. */
export interface BlockResult {
  text: string;
  /** Rows written (computed or noted). */
  rows: number;
  /** Rows written with an error noted (`badRows: 'note'`). */
  noted: number;
  /** Lines read (up to the one that stopped the block, if one did). */
  lines: number;
  /** The row that stopped the block (the text holds the rows before it). */
  problem?: RowProblem;
}

/** A kind set up for the header of a CSV. */
export interface Rows {
  /** The output header line (with its line break). */
  header: string;
  /**
   * The output text of whole lines (each ending with a line break, except perhaps the last);
   * `firstLine` is the line number of the first. Blank lines and lines starting with `#` are
   * skipped.
   */
  block(text: string, firstLine: number): BlockResult;
}

/** Plain decimal text that `Number` reads exactly as `float.from` does (at most 3 exponent digits, so no exponent limit applies). */
const PLAIN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d{1,3})?$/;
const ANGLE_SUFFIX = /^\s*(.*?)\s*(gon|mil|rad|deg)\s*$/;

class Bad {
  constructor(
    readonly reason: string,
    readonly column?: string,
  ) {}
}

/**
 * The text of a plain decimal as a float, read by `Number` (as `float.from` reads it once it has
 * checked the text), or `undefined` where `float.from` must decide: text over 25 characters,
 * text not starting with a digit, sign or point (white space, `Infinity`), a prefix such as
 * `0x`, `0b`, `0o`, or a result that is not finite or is zero (an exponent beyond the readers'
 * limit gives 0 or ±Infinity from so few characters, and `float.from` refuses it). Proven to
 * agree with `float.from` by the property test in test/cli/batch-format.test.ts.
 */
export function plainFloat(text: string): number | undefined {
  const n = text.length;
  if (n === 0 || n > 25) return undefined;
  const c0 = text.charCodeAt(0);
  if (!((c0 >= 48 && c0 <= 57) || c0 === 45 || c0 === 43 || c0 === 46)) return undefined;
  if (n > 1) {
    const c1 = text.charCodeAt(1);
    if (c1 >= 65 && c1 !== 69 && c1 !== 101) return undefined;
  }
  const v = Number(text);
  return v - v === 0 && v !== 0 ? v : undefined;
}

/** The field's text as a number of `A`, read once (`Number` for plain decimals in `float`). */
function numberReader(A: Arithmetic<unknown, boolean>): (text: string) => unknown {
  if (A === (float as unknown)) return (text) => plainFloat(text) ?? A.from(text);
  return (text) => A.from(text);
}

function angleOf(A: Arithmetic<unknown, boolean>, text: string): unknown {
  const m = ANGLE_SUFFIX.exec(text);
  return m ? angleToDegrees(A, m[1]!, m[2] as AngleUnit) : angleToDegrees(A, text);
}

/** A reader of one column's text into a value, throwing {@link Bad} with the reason. */
function reader(
  A: Arithmetic<unknown, boolean>,
  how: ColumnReading,
  readNumber: (text: string) => unknown,
): (text: string) => unknown {
  const what = (text: string, e: unknown, kind: string): Bad => {
    if (e instanceof Bad) return e;
    if (!(e instanceof QuadspreadError)) throw e;
    const m = /^quadspread [A-Z_]+: [^:]*: (.*)$/s.exec(e.message);
    return new Bad(
      kind === 'number'
        ? `${JSON.stringify(text)} is not a number`
        : `${JSON.stringify(text)} is not a valid ${kind}${m ? `: ${m[1]}` : ''}`,
    );
  };
  const plainFirst = (text: string, kind: string, read: (t: string) => unknown): unknown => {
    try {
      return read === readNumber || PLAIN.test(text) ? readNumber(text) : read(text);
    } catch (e) {
      throw what(text, e, kind);
    }
  };
  const inRange = (kind: string, lo: number, hi: number) => {
    const low = A.from(lo);
    const high = A.from(hi);
    return (text: string): unknown => {
      const v = plainFirst(text, `${kind} angle`, (t) => angleOf(A, t));
      if (A.cmp(v, low) < 0 || A.cmp(v, high) > 0)
        throw new Bad(
          `${JSON.stringify(text)} is not a valid ${kind} angle: it must be in [${lo}°, ${hi}°]`,
        );
      return v;
    };
  };
  const notNegative = (text: string, v: number | unknown, what: string): void => {
    if (typeof v === 'number' ? v < 0 : A.sign(v) < 0)
      throw new Bad(`${JSON.stringify(text)} is negative: ${what} is at least 0`);
  };
  switch (how) {
    case 'number':
      return (text) => plainFirst(text, 'number', readNumber);
    case 'distance':
      return (text) => {
        const v = plainFirst(text, 'number', readNumber);
        notNegative(text, v, 'a distance');
        return v;
      };
    case 'angle':
      return (text) => plainFirst(text, 'angle', (t) => angleOf(A, t));
    case 'elevation':
      return inRange('elevation', -90, 90);
    case 'zenith':
      return inRange('zenith', 0, 180);
    case 'sigma':
      return (text) => {
        const v = plainFirst(text, 'number', (t) => float.from(t));
        const n = typeof v === 'number' ? v : float.from(A.toString(v));
        notNegative(text, n, 'a standard uncertainty');
        return n;
      };
    case 'arcseconds':
      return (text) => {
        let n: number;
        try {
          n = PLAIN.test(text) ? Number(text) : float.mul(angleOf(float, text) as number, 3600);
        } catch (e) {
          throw what(text, e, 'standard uncertainty (arc-seconds, or DMS text)');
        }
        if (!(n - n === 0)) throw new Bad(`${JSON.stringify(text)} is not a number`);
        notNegative(text, n, 'a standard uncertainty');
        return n;
      };
  }
}

/** A field of the input as written back: as is when it cannot be a formula, quoted or neutralised otherwise. */
function fieldOut(f: string): string {
  const c = f.charCodeAt(0);
  // '=' '+' '-' '@' tab, carriage return: csvField decides (a number stays, a formula is neutralised).
  if (c === 61 || c === 43 || c === 45 || c === 64 || c === 9 || c === 13) return csvField(f);
  return f.indexOf('"') < 0 && f.indexOf(',') < 0 && f.indexOf('\n') < 0 && f.indexOf('\r') < 0
    ? f
    : csvField(f);
}

/**
 * Splits a line with no quotes (fields trimmed, as {@link splitCsvLine} does). Returns whether
 * the line can be written back as it is: no field trimmed, none that a spreadsheet could take
 * for a formula (a first character `=`, `+`, `-`, `@`, tab; those go through `csvField`), no
 * carriage return.
 */
function splitPlain(line: string, fields: string[]): boolean {
  let asIs = line.indexOf('\r') < 0;
  let from = 0;
  let n = 0;
  for (;;) {
    const at = line.indexOf(',', from);
    let f = at < 0 ? line.slice(from) : line.slice(from, at);
    if (f.length > 0) {
      const c = f.charCodeAt(0);
      const z = f.charCodeAt(f.length - 1);
      // White space at either end, U+FEFF and the other non-ASCII kinds included, is trimmed.
      if (c <= 32 || z <= 32 || ((c > 126 || z > 126) && f.trim() !== f)) {
        f = f.trim();
        asIs = false;
      } else if (c === 61 || c === 43 || c === 45 || c === 64) asIs = false;
    }
    fields[n++] = f;
    if (at < 0) break;
    from = at + 1;
  }
  fields.length = n;
  return asIs;
}

const isBlank = (line: string): boolean => line.trim() === '';

/** Looks a kind up by name, or refuses it naming the kinds there are (exit 2). */
export function batchKind(kind: string): BatchKind {
  const k = Object.hasOwn(BATCH_KINDS, kind) ? BATCH_KINDS[kind] : undefined;
  if (!k)
    throw new JobInvalid(
      '',
      `${JSON.stringify(kind)} is not a batch kind (${Object.keys(BATCH_KINDS).join(', ')})`,
    );
  return k;
}

/** The fields of a header line (refused with exit 2 when its quoting is broken). */
export function headerFields(line: string, lineNo: number): string[] {
  const fields = splitCsvLine(line);
  if (typeof fields === 'string') throw new JobInvalid(`line ${lineNo}`, fields);
  return fields.map((f) => f.trim());
}

/**
 * Sets a kind up for a header (its fields, on line `headerLine`).
 *
 * @throws {JobInvalid} when the header lacks a column the kind needs, or the options do not fit it.
 */
export function batchRows(
  kindName: string,
  names: readonly string[],
  headerLine: number,
  o: RowOptions,
): Rows {
  const kind = batchKind(kindName);
  const A = arithmeticFor(o.arithmetic, o.digits);
  if (o.exact && !A.exact)
    throw new JobInvalid(
      '--exact',
      `exact columns are written in rational arithmetic only (add --arithmetic rational)`,
    );
  if (o.exact && !kind.exactColumns)
    throw new JobInvalid(
      '--exact',
      `a ${kindName} batch has no exact columns (its results go through angles, whose spreads are not rational)`,
    );
  const num = decimalText(A, o.digits);
  const seconds = o.seconds ?? 1;
  const ctx: KindContext = {
    A,
    num,
    floatNum: (x) => floatToPrecision(x, o.digits),
    angle:
      o.angles === 'dms'
        ? // A bearing just below 360° rounds to 0°; the seconds' mark is a quote: the field is quoted.
          (x) => csvField(formatDms(A, x, seconds).replace(/^360°/, '0°'))
        : num,
    exact: (x) => A.toString(x),
    exactColumns: o.exact === true,
  };
  const plan = kind.plan(ctx, names);
  if (typeof plan === 'string') throw new JobInvalid(`line ${headerLine}`, plan);
  const readNumber = numberReader(A);
  const inputs = plan.inputs.map((input) => {
    const at = names.indexOf(input.column);
    if (at < 0 && !input.optional)
      throw new JobInvalid(
        `line ${headerLine}`,
        `the header has no column "${input.column}" (a ${kindName} batch needs ${kind.columns.join(', ')})`,
      );
    return { ...input, at, read: reader(A, input.reading, readNumber) };
  });
  const note = o.badRows === 'note';
  const outputs = [...plan.outputs, ...(note ? ['error'] : [])];
  const empty = ','.repeat(plan.outputs.length);
  const width = names.length;

  /** The input fields as written back, padded to the header's width so the results line up. */
  const fieldsOut = (fields: string[]): string => {
    let s = fields.length > 0 ? fieldOut(fields[0]!) : '';
    for (let i = 1; i < fields.length; i++) s += ',' + fieldOut(fields[i]!);
    for (let i = fields.length; i < width; i++) s += ',';
    return s;
  };

  const values: unknown[] = new Array<unknown>(inputs.length);
  /** The results of a row (without a line break), or a {@link Bad} reason. */
  const compute = (fields: string[]): string => {
    for (let i = 0; i < inputs.length; i++) {
      const input = inputs[i]!;
      const text = input.at < 0 ? undefined : fields[input.at];
      if (text === undefined || text === '') {
        if (input.optional) {
          values[i] = undefined;
          continue;
        }
        throw new Bad('the value is missing', input.column);
      }
      try {
        values[i] = input.read(text);
      } catch (e) {
        if (e instanceof Bad) throw new Bad(e.reason, input.column);
        throw e;
      }
    }
    return plan.row(values).join(',');
  };

  const fields: string[] = [];
  return {
    header: csvLine([...names, ...outputs]),
    block(text, firstLine) {
      let out = '';
      let rows = 0;
      let noted = 0;
      const lines = text.split('\n');
      // A block ends with a line break: the empty string after it is no line.
      const count = lines[lines.length - 1] === '' ? lines.length - 1 : lines.length;
      for (let k = 0; k < count; k++) {
        const line = firstLine + k;
        let raw = lines[k]!;
        if (raw.length > 0 && raw.charCodeAt(raw.length - 1) === 13) raw = raw.slice(0, -1);
        if (raw.length > MAX_CSV_LINE)
          return {
            text: out,
            rows,
            noted,
            lines: k + 1,
            problem: {
              line,
              reason: `the line is longer than ${MAX_CSV_LINE} characters (is this a CSV text file?)`,
              unsolvable: false,
            },
          };
        if (
          raw.length === 0 ||
          raw.charCodeAt(0) === 35 ||
          ((raw.charCodeAt(0) <= 32 || raw.charCodeAt(0) > 126) && isBlank(raw))
        )
          continue;
        let split: string[] | string;
        let asIs = false;
        if (raw.indexOf('"') < 0) {
          asIs = splitPlain(raw, fields);
          split = fields;
        } else split = splitCsvLine(raw);
        let problem: RowProblem;
        if (typeof split === 'string') {
          problem = { line, reason: split, unsolvable: false };
          if (note) {
            out += `${csvField(raw)}${','.repeat(Math.max(0, width - 1))}${empty},${csvField(split)}\n`;
            rows++;
            noted++;
            continue;
          }
        } else {
          try {
            const results = compute(split);
            out +=
              (asIs && split.length >= width ? raw : fieldsOut(split)) +
              ',' +
              results +
              (note ? ',\n' : '\n');
            rows++;
            continue;
          } catch (e) {
            if (e instanceof Bad)
              problem = { line, column: e.column, reason: e.reason, unsolvable: false };
            else if (e instanceof QuadspreadError)
              problem = { line, reason: e.message.replace(/^quadspread /, ''), unsolvable: true };
            else throw e;
          }
          if (note) {
            const why = problem.column
              ? `column "${problem.column}": ${problem.reason}`
              : problem.unsolvable
                ? `no solution: ${problem.reason}`
                : problem.reason;
            out += `${fieldsOut(split)}${empty},${csvField(why)}\n`;
            rows++;
            noted++;
            continue;
          }
        }
        return { text: out, rows, noted, lines: k + 1, problem };
      }
      return { text: out, rows, noted, lines: count };
    },
  };
}
