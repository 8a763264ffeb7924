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
import { resolve as resolvePath } from 'node:path';
import { createInterface } from 'node:readline';
import { QuadspreadError, point, quadrance, sqrtOf, rootToPrecision } from '../index.js';
import type { Arithmetic } from '../index.js';
import { openPending } from './atomic.js';
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

/** Runs a batch, writing to `o.out` (atomically) or the standard output. */
export async function runBatch(
  kind: string,
  file: string,
  o: { arithmetic: ArithmeticName; digits: number; out?: string },
  io: Io,
): Promise<void> {
  const k = BATCH_KINDS[kind];
  if (!k)
    throw new JobInvalid(
      '',
      `${JSON.stringify(kind)} is not a batch kind (${Object.keys(BATCH_KINDS).join(', ')})`,
    );
  if (o.out !== undefined && file !== '-' && resolvePath(o.out) === resolvePath(file)) {
    throw new JobInvalid(
      '--out',
      `${JSON.stringify(o.out)} is the input CSV itself: give the results another name`,
    );
  }
  const A = arithmeticFor(o.arithmetic, o.digits);
  const input = file === '-' ? process.stdin : createReadStream(file, { encoding: 'utf8' });
  const opened = new Promise<void>((resolve, reject) => {
    if (file === '-') resolve();
    input.once('open', () => resolve());
    input.once('error', (e: NodeJS.ErrnoException) =>
      reject(
        new JobInvalid(
          '',
          `cannot read the CSV file ${JSON.stringify(file)}: ${e.code ?? e.message}`,
        ),
      ),
    );
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
    const lines = createInterface({ input, crlfDelay: Infinity });
    for await (const raw of lines) {
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
          return A.from(text);
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
