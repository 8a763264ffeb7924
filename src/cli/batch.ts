/**
 * The batch command: a CSV of many cases streams through one computation, one output row
 * per input row. A progress count goes to stderr only when stderr is a terminal. With
 * `--out`, the output file appears only when every row has been computed (temporary file
 * and rename); a bad row stops the batch (exit 2 for a value that cannot be read, exit 3
 * for a row with no solution), naming its line, unless `--bad-rows note` asks to note it in
 * an `error` column and go on.
 *
 * The input is read in chunks and the output written in blocks of about 64 KiB. Past the
 * first MiB of input, blocks of lines go to a pool of worker threads (one per core, or
 * `--workers`): at most two blocks per worker are in flight, and the input is not read further
 * until the oldest is written, so memory stays bounded and rows keep their order.
 *
 * @module cli
 */
import { createReadStream } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { openPending, sameFile } from './atomic.js';
import type { PendingFile } from './atomic.js';
import { MAX_CSV_LINE, batchKind, batchRows, headerFields } from './batch-rows.js';
import type { BlockResult, RowOptions, RowProblem, Rows } from './batch-rows.js';
import type { WorkerAnswer, WorkerBlock, WorkerSetup } from './batch-worker.js';
import { JobInvalid, JobUnsolvable } from './failure.js';
import type { Io } from './program.js';
export { BATCH_KINDS } from './tasks/batch-kinds.js';
export type { BatchKind } from './tasks/batch-kinds.js';
export { MAX_CSV_LINE } from './batch-rows.js';

/** The options of the batch command. */
export interface BatchOptions extends RowOptions {
  out?: string;
  /** Worker threads for large inputs (default: the number of cores; 1: none). */
  workers?: number;
}

/** Input read on the main thread before the worker pool starts, in characters. */
export const POOL_FROM = 1 << 20;
/** Characters of input per block sent to a worker. */
const BLOCK = 1 << 17;
/** Output is written when this many characters are waiting. */
const FLUSH = 1 << 16;

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

/** The error that stops a batch at a row. */
function stopAt(p: RowProblem): Error {
  const where = `line ${p.line}${p.column ? `, column "${p.column}"` : ''}`;
  return p.unsolvable ? new JobUnsolvable(where, p.reason) : new JobInvalid(where, p.reason);
}

function countLines(text: string): number {
  let n = 0;
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) n++;
  return n;
}

/** Worker threads computing blocks; answers come back by block id. */
class Pool {
  private readonly workers: Worker[] = [];
  private readonly waiting = new Map<
    number,
    { resolve: (r: BlockResult) => void; reject: (e: Error) => void }
  >();
  private nextId = 0;
  private closing = false;

  constructor(script: URL, setup: WorkerSetup, n: number) {
    const fail = (e: Error): void => {
      for (const w of this.waiting.values()) w.reject(e);
      this.waiting.clear();
    };
    for (let i = 0; i < n; i++) {
      const w = new Worker(script, { workerData: { batch: setup } });
      w.on('message', (a: WorkerAnswer) => {
        const entry = this.waiting.get(a.id);
        if (!entry) return;
        this.waiting.delete(a.id);
        if ('failure' in a) entry.reject(new Error(`in a batch worker: ${a.failure}`));
        else entry.resolve(a.result);
      });
      w.on('error', fail);
      w.on('exit', (code) => {
        if (!this.closing) fail(new Error(`a batch worker stopped (exit code ${code})`));
      });
      this.workers.push(w);
    }
  }

  submit(text: string, firstLine: number): Promise<BlockResult> {
    const id = this.nextId++;
    const p = new Promise<BlockResult>((resolve, reject) =>
      this.waiting.set(id, { resolve, reject }),
    );
    const block: WorkerBlock = { id, text, firstLine };
    this.workers[id % this.workers.length]!.postMessage(block);
    return p;
  }

  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}

/** Runs a batch, writing to `o.out` (atomically) or the standard output. */
export async function runBatch(kind: string, file: string, o: BatchOptions, io: Io): Promise<void> {
  batchKind(kind);
  if (o.out !== undefined && file !== '-' && sameFile(o.out, file)) {
    throw new JobInvalid(
      '--out',
      `${JSON.stringify(o.out)} is the input CSV itself: give the results another name`,
    );
  }
  const input =
    file === '-' ? process.stdin.setEncoding('utf8') : createReadStream(file, { encoding: 'utf8' });
  await new Promise<void>((resolve, reject) => {
    if (file === '-') resolve();
    input.once('open', () => resolve());
    input.once('error', (e: NodeJS.ErrnoException) => reject(cannotRead(file, e)));
  });
  let pending: PendingFile | undefined;
  let waitingOut = '';
  const flush = (): void => {
    if (waitingOut === '') return;
    const text = waitingOut;
    waitingOut = '';
    if (pending) pending.write(text);
    else io.stdout(text);
  };
  const emit = (text: string): void => {
    waitingOut += text;
    if (waitingOut.length >= FLUSH) flush();
  };
  let rows = 0;
  let noted = 0;
  let lastShown = 0;
  const progress = (final: boolean): void => {
    if (!io.stderrIsTTY) return;
    const now = Date.now();
    if (!final && now - lastShown < 100) return;
    lastShown = now;
    io.stderr(
      `\rquadspread batch ${kind}: ${rows} row${rows === 1 ? '' : 's'}${final ? ' done\n' : ''}`,
    );
  };
  const take = (r: BlockResult): void => {
    emit(r.text);
    rows += r.rows;
    noted += r.noted;
    progress(false);
    if (r.problem) throw stopAt(r.problem);
  };

  let lineNo = 0; // lines consumed so far
  let engine: Rows | undefined;
  let names: string[] | undefined;
  let headerLine = 0;
  let read = 0;
  const workers = o.workers ?? availableParallelism();
  let pool: Pool | undefined;
  const inFlight: Promise<BlockResult>[] = [];
  let block = '';
  let blockLine = 1;

  /** Sends the block being gathered to the pool; waits for the oldest when enough are in flight. */
  const dispatch = async (): Promise<void> => {
    if (block === '') return;
    const p = pool!.submit(block, blockLine);
    p.catch(() => {}); // awaited in order below; a failure is reported there
    inFlight.push(p);
    blockLine += countLines(block);
    block = '';
    while (inFlight.length >= 2 * workers) take(await inFlight.shift()!);
  };

  /** Whole lines of input (each ending with a line break, but perhaps the last). */
  const consume = async (text: string): Promise<void> => {
    if (!engine) {
      // Find the header: the first line that is neither blank nor a comment.
      let pos = 0;
      while (pos < text.length && !engine) {
        let stop = text.indexOf('\n', pos);
        if (stop < 0) stop = text.length;
        const raw = text.slice(pos, stop).replace(/\r$/, '');
        pos = stop + 1;
        lineNo++;
        if (raw.length > MAX_CSV_LINE) throw lineTooLong(lineNo);
        if (raw.trim() === '' || raw.startsWith('#')) continue;
        names = headerFields(raw, lineNo);
        headerLine = lineNo;
        engine = batchRows(kind, names, headerLine, o);
        emit(engine.header);
      }
      text = text.slice(Math.min(pos, text.length));
      if (text === '') return;
    }
    read += text.length;
    if (!pool && workers > 1 && io.workerScript && read > POOL_FROM) {
      const setup: WorkerSetup = { kind, names: names!, headerLine, options: { ...o } };
      pool = new Pool(io.workerScript, setup, workers);
      blockLine = lineNo + 1;
    }
    if (pool) {
      block += text;
      if (block.length >= BLOCK) await dispatch();
      return;
    }
    const r = engine!.block(text, lineNo + 1);
    lineNo += countLines(text);
    take(r);
  };

  try {
    if (o.out !== undefined) pending = openPending(o.out);
    let rest = '';
    const chunks = (input as AsyncIterable<string>)[Symbol.asyncIterator]();
    for (;;) {
      let next: IteratorResult<string>;
      try {
        next = await chunks.next();
      } catch (e) {
        throw cannotRead(file, e);
      }
      if (next.done) break;
      const text = rest + next.value;
      const cut = text.lastIndexOf('\n');
      if (cut < 0) {
        rest = text;
      } else {
        rest = text.slice(cut + 1);
        await consume(text.slice(0, cut + 1));
      }
      if (rest.length > MAX_CSV_LINE) {
        if (pool) {
          await dispatch();
          while (inFlight.length > 0) take(await inFlight.shift()!);
        }
        throw lineTooLong((pool ? blockLine - 1 : lineNo) + 1);
      }
    }
    if (rest !== '') await consume(rest);
    if (pool) {
      await dispatch();
      while (inFlight.length > 0) take(await inFlight.shift()!);
    }
    if (!engine) {
      const k = batchKind(kind);
      throw new JobInvalid(
        '',
        `the CSV file ${JSON.stringify(file)} is empty (it needs a header line: ${k.columns.join(', ')})`,
      );
    }
    flush();
    pending?.commit();
    progress(true);
    if (noted > 0)
      io.stderr(`${noted} row${noted === 1 ? '' : 's'} not computed: see the error column\n`);
    if (pending) io.stderr(`${rows} row${rows === 1 ? '' : 's'} written to ${pending.target}\n`);
  } catch (e) {
    if (pending) pending.abort();
    else flush();
    if (io.stderrIsTTY && rows > 0) io.stderr('\n');
    throw e;
  } finally {
    if (pool) await pool.close();
    if (file !== '-') (input as { destroy?: () => void }).destroy?.();
  }
}
