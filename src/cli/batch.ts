/**
 * The batch command: a CSV of many cases streams through one computation, one output row
 * per input row. A progress count goes to stderr only when stderr is a terminal. With
 * `--out`, the output file appears only when every row has been computed (temporary file
 * and rename); a bad row stops the batch (exit 2 for a value that cannot be read, exit 3
 * for a row with no solution), naming its line.
 *
 * @module cli
 */
import { createReadStream } from 'node:fs';
import { QuadspreadError, point, quadrance, sqrtOf, rootToPrecision } from '../index.js';
import type { Arithmetic } from '../index.js';
import { openPending, sameFile } from './atomic.js';
import type { PendingFile } from './atomic.js';
import { csvLine, splitCsvLine } from './csv.js';
import { JobInvalid, JobUnsolvable } from './failure.js';
import { arithmeticFor } from './job.js';
import type { ArithmeticName } from './job.js';
import type { Io } from './program.js';
import { BATCH_EXTRA } from './tasks/batch-kinds.js';
export { batchValue } from './batch-value.js';

/** One batch kind: its input columns, output columns and the computation of one row. */
export interface BatchKind {
  description: string;
  columns: readonly string[];
  outputs: readonly string[];
  /** Input columns that must not be negative (a distance): a negative value is refused, exit 2. */
  nonNegative?: readonly string[];
  /** Computes the output fields of one row from its values (in the arithmetic), formatted to `digits`. */
  row<V>(A: Arithmetic<V, boolean>, values: V[], digits: number): string[];
}

/** The batch kinds: inverses between pairs of points, and the kinds the solvers add. */
export const BATCH_KINDS: Record<string, BatchKind> = {
  inverses: {
    description:
      'pairs of points (east1, north1, east2, north2): quadrance and distance between them',
    columns: ['east1', 'north1', 'east2', 'north2'],
    outputs: ['quadrance', 'distance'],
    row(A, [e1, n1, e2, n2], digits) {
      const Q = quadrance(A, point(A, e1!, n1!), point(A, e2!, n2!));
      return [
        A.exact ? A.toString(Q) : A.toPrecision(Q, digits),
        rootToPrecision(A, sqrtOf(A, Q), digits),
      ];
    },
  },
  ...BATCH_EXTRA,
};

/** Longest line of a batch CSV, in characters (a row is a handful of numbers). */
export const MAX_CSV_LINE = 64 * 1024;

/**
 * The lines of a text stream (LF or CRLF), refusing a line longer than {@link MAX_CSV_LINE}
 * as soon as it is seen, so that a file with no line breaks (a device such as /dev/zero, a
 * binary file) is refused at once rather than read into memory.
 */
async function* csvLines(input: AsyncIterable<string>, file: string): AsyncGenerator<string> {
  let rest = '';
  let n = 0;
  const chunks = input[Symbol.asyncIterator]();
  for (;;) {
    let next: IteratorResult<string>;
    try {
      next = await chunks.next();
    } catch (e) {
      throw cannotRead(file, e);
    }
    if (next.done) break;
    const chunk = next.value;
    const parts = (rest + chunk).split('\n');
    rest = parts.pop()!;
    for (const line of parts) {
      n++;
      if (line.length > MAX_CSV_LINE + 1) throw lineTooLong(n);
      yield line.endsWith('\r') ? line.slice(0, -1) : line;
    }
    if (rest.length > MAX_CSV_LINE) throw lineTooLong(n + 1);
  }
  if (rest !== '') yield rest.endsWith('\r') ? rest.slice(0, -1) : rest;
}

function cannotRead(file: string, e: unknown): JobInvalid {
  const code = (e as NodeJS.ErrnoException).code;
  return new JobInvalid(
    '',
    `cannot read the CSV file ${JSON.stringify(file)}: ${code === 'EISDIR' ? 'it is a folder' : (code ?? (e as Error).message)}`,
  );
}

function lineTooLong(n: number): JobInvalid {
  return new JobInvalid(
    `line ${n}`,
    `the line is longer than ${MAX_CSV_LINE} characters (is this a CSV text file?)`,
  );
}

/** Runs a batch, writing to `o.out` (atomically) or the standard output. */
export async function runBatch(
  kind: string,
  file: string,
  o: { arithmetic: ArithmeticName; digits: number; out?: string },
  io: Io,
): Promise<void> {
  const k = Object.hasOwn(BATCH_KINDS, kind) ? BATCH_KINDS[kind] : undefined;
  if (!k)
    throw new JobInvalid(
      '',
      `${JSON.stringify(kind)} is not a batch kind (${Object.keys(BATCH_KINDS).join(', ')})`,
    );
  if (o.out !== undefined && file !== '-' && sameFile(o.out, file)) {
    throw new JobInvalid(
      '--out',
      `${JSON.stringify(o.out)} is the input CSV itself: give the results another name`,
    );
  }
  const A = arithmeticFor(o.arithmetic, o.digits);
  const input =
    file === '-' ? process.stdin.setEncoding('utf8') : createReadStream(file, { encoding: 'utf8' });
  const opened = new Promise<void>((resolve, reject) => {
    if (file === '-') resolve();
    input.once('open', () => resolve());
    input.once('error', (e: NodeJS.ErrnoException) => reject(cannotRead(file, e)));
  });
  await opened;
  let pending: PendingFile | undefined;
  const write = (text: string): void => (pending ? pending.write(text) : io.stdout(text));
  let lineNo = 0;
  let rows = 0;
  let lastShown = 0;
  let columns: number[] | undefined;
  const progress = (final: boolean): void => {
    if (!io.stderrIsTTY) return;
    const now = Date.now();
    if (!final && now - lastShown < 100) return;
    lastShown = now;
    io.stderr(
      `\rquadspread batch ${kind}: ${rows} row${rows === 1 ? '' : 's'}${final ? ' done\n' : ''}`,
    );
  };
  try {
    if (o.out !== undefined) pending = openPending(o.out);
    for await (const raw of csvLines(input as AsyncIterable<string>, file)) {
      lineNo++;
      if (raw.trim() === '' || raw.startsWith('#')) continue;
      const fields = splitCsvLine(raw);
      if (typeof fields === 'string') throw new JobInvalid(`line ${lineNo}`, fields);
      if (columns === undefined) {
        const names = fields.map((f) => f.trim());
        columns = k.columns.map((c) => {
          const at = names.indexOf(c);
          if (at < 0)
            throw new JobInvalid(
              'line 1',
              `the header has no column "${c}" (a ${kind} batch needs ${k.columns.join(', ')})`,
            );
          return at;
        });
        write(csvLine([...names, ...k.outputs]));
        continue;
      }
      const values = columns.map((at, i) => {
        const text = fields[at];
        if (text === undefined || text === '')
          throw new JobInvalid(`line ${lineNo}, column "${k.columns[i]}"`, 'the value is missing');
        try {
          const v = A.from(text);
          if (k.nonNegative?.includes(k.columns[i]!) && A.sign(v) < 0)
            throw new JobInvalid(
              `line ${lineNo}, column "${k.columns[i]}"`,
              `${JSON.stringify(text)} is negative: a distance is at least 0`,
            );
          return v;
        } catch (e) {
          if (e instanceof QuadspreadError)
            throw new JobInvalid(
              `line ${lineNo}, column "${k.columns[i]}"`,
              `${JSON.stringify(text)} is not a number`,
            );
          throw e;
        }
      });
      let out: string[];
      try {
        out = k.row(A, values, o.digits);
      } catch (e) {
        if (e instanceof QuadspreadError)
          throw new JobUnsolvable(`line ${lineNo}`, e.message.replace(/^quadspread /, ''));
        throw e;
      }
      write(csvLine([...fields, ...out]));
      rows++;
      progress(false);
    }
    if (columns === undefined)
      throw new JobInvalid(
        '',
        `the CSV file ${JSON.stringify(file)} is empty (it needs a header line: ${k.columns.join(', ')})`,
      );
    pending?.commit();
    progress(true);
    if (pending) io.stderr(`${rows} row${rows === 1 ? '' : 's'} written to ${pending.target}\n`);
  } catch (e) {
    pending?.abort();
    if (io.stderrIsTTY && rows > 0) io.stderr('\n');
    throw e;
  }
}
