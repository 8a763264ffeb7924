/**
 * The batch command: a CSV of many cases streams through one computation, one output row
 * per input row. A progress count goes to stderr only when stderr is a terminal. With
 * `--out`, the output file appears only when every row has been computed (temporary file
 * and rename); a bad row stops the batch (exit 2 for a value that cannot be read, exit 3
 * for a row with no solution), naming its line, unless `--bad-rows note` asks to note it in
 * an `error` column and go on.
 *
 * The input is read in chunks and the output written in blocks of about 64 KiB. Past the
 * first MiB of input, blocks of lines (1 MiB each) are computed by `--workers` threads (by
 * default one per idle core): this one and a pool of worker threads, in turn. At most two blocks per
 * thread are in flight, and the input is not read further until the oldest is written, so
 * memory stays bounded and rows keep their order.
 *
 * @module cli
 */
import { createReadStream } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
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
  /** Threads computing a large input, this one included (default: {@link idleCores}; 1: no worker threads). */
  workers?: number;
}

/** Input read on the main thread before the worker pool starts, in characters. */
export const POOL_FROM = 1 << 20;
/** Characters of input per block sent to a worker. */
const BLOCK = 1 << 20;
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

/** The parts joined into a new array of its own (so that its memory can be handed to a worker). */
function joinBytes(parts: readonly Uint8Array[], length: number): Uint8Array {
  const out = new Uint8Array(length);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

const utf8 = new TextDecoder();

/** What the pool gives back for a block: its output as UTF-8, and its counts. */
type PoolResult = Omit<BlockResult, 'text'> & { bytes: Uint8Array };

/** Worker threads computing blocks; answers come back by block id. */
class Pool {
  private readonly workers: Worker[] = [];
  private readonly waiting = new Map<
    number,
    { resolve: (r: PoolResult) => void; reject: (e: Error) => void }
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
        else entry.resolve({ ...a.result, bytes: new Uint8Array(a.result.bytes) });
      });
      w.on('error', fail);
      w.on('exit', (code) => {
        if (!this.closing) fail(new Error(`a batch worker stopped (exit code ${code})`));
      });
      this.workers.push(w);
    }
  }

  /** Hands the block's memory over to a worker (`bytes` must own its buffer). */
  submit(bytes: Uint8Array): Promise<PoolResult> {
    const id = this.nextId++;
    const p = new Promise<PoolResult>((resolve, reject) =>
      this.waiting.set(id, { resolve, reject }),
    );
    const block: WorkerBlock = { id, bytes: bytes.buffer as ArrayBuffer };
    this.workers[id % this.workers.length]!.postMessage(block, [block.bytes]);
    return p;
  }

  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}

/**
 * The cores not already busy: the cores less the 1-minute load average, at least 1. On a machine
 * that other work keeps busy, threads of ours only take turns with each other (and wait for each
 * other), so the pool is left out there.
 */
export function idleCores(): number {
  const cores = availableParallelism();
  return Math.max(1, Math.min(cores, Math.round(cores - loadavg()[0]!)));
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
  const input = file === '-' ? process.stdin : createReadStream(file);
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
  const emitBytes = (bytes: Uint8Array): void => {
    flush();
    if (bytes.length === 0) return;
    if (pending) pending.write(bytes);
    else if (io.stdoutBytes) io.stdoutBytes(bytes);
    else io.stdout(utf8.decode(bytes));
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
  const count = (r: Omit<BlockResult, 'text'>): void => {
    rows += r.rows;
    noted += r.noted;
    progress(false);
    if (r.problem) throw stopAt(r.problem);
  };

  let lineNo = 0; // lines read so far (in pool mode: in the blocks taken back)
  let engine: Rows | undefined;
  let setup: WorkerSetup | undefined;
  let read = 0;
  const workers = o.workers ?? idleCores();
  let pool: Pool | undefined;
  const inFlight: Promise<PoolResult | BlockResult>[] = [];
  let dispatched = 0;
  let block: Uint8Array[] = [];
  let blockSize = 0;

  // The workers number lines from 1 in each block; the blocks are taken in order, so the
  // lines before each are known when it is taken.
  const takeOldest = async (): Promise<void> => {
    const r = await inFlight.shift()!;
    if ('text' in r) emit(r.text);
    else emitBytes(r.bytes);
    if (r.problem) r.problem.line += lineNo;
    lineNo += r.lines;
    count(r);
  };

  /** Sends the block being gathered to the pool; waits for the oldest when enough are in flight. */
  const dispatch = async (): Promise<void> => {
    if (blockSize === 0) return;
    const bytes = joinBytes(block, blockSize);
    block = [];
    blockSize = 0;
    // One block in `workers` is computed here, the others by the pool's threads.
    if (dispatched++ % workers === workers - 1)
      inFlight.push(Promise.resolve(engine!.block(utf8.decode(bytes), 1)));
    else {
      const p = pool!.submit(bytes);
      p.catch(() => {}); // awaited in order; a failure is reported there
      inFlight.push(p);
    }
    while (inFlight.length >= 2 * workers) await takeOldest();
  };

  /** Whole lines of input as UTF-8 (each ending with a line break, but perhaps the last). */
  const consume = async (bytes: Uint8Array): Promise<void> => {
    if (!engine) {
      // Find the header: the first line that is neither blank nor a comment.
      let pos = 0;
      while (pos < bytes.length && !engine) {
        let stop = bytes.indexOf(10, pos);
        if (stop < 0) stop = bytes.length;
        const raw = utf8.decode(bytes.subarray(pos, stop)).replace(/\r$/, '');
        pos = stop + 1;
        lineNo++;
        if (raw.length > MAX_CSV_LINE) throw lineTooLong(lineNo);
        if (raw.trim() === '' || raw.startsWith('#')) continue;
        const names = headerFields(raw, lineNo);
        engine = batchRows(kind, names, lineNo, o);
        setup = { kind, names, headerLine: lineNo, options: { ...o } };
        emit(engine.header);
      }
      if (pos >= bytes.length) return;
      bytes = bytes.subarray(pos);
    }
    read += bytes.length;
    if (!pool && workers > 1 && io.workerScript && read > POOL_FROM)
      pool = new Pool(io.workerScript, setup!, workers - 1);
    if (pool) {
      block.push(bytes);
      blockSize += bytes.length;
      if (blockSize >= BLOCK) await dispatch();
      return;
    }
    const r = engine!.block(utf8.decode(bytes), lineNo + 1);
    lineNo += r.lines;
    emit(r.text);
    count(r);
  };

  /** Every block sent is written (in order), then the line that is too long is refused. */
  const tooLong = async (): Promise<never> => {
    if (pool) {
      await dispatch();
      while (inFlight.length > 0) await takeOldest();
    }
    throw lineTooLong(lineNo + 1);
  };

  try {
    if (o.out !== undefined) pending = openPending(o.out);
    let rest: Uint8Array = new Uint8Array(0);
    const chunks = (input as AsyncIterable<Uint8Array>)[Symbol.asyncIterator]();
    for (;;) {
      let next: IteratorResult<Uint8Array>;
      try {
        next = await chunks.next();
      } catch (e) {
        throw cannotRead(file, e);
      }
      if (next.done) break;
      const chunk = typeof next.value === 'string' ? Buffer.from(next.value) : next.value;
      const cut = chunk.lastIndexOf(10);
      if (cut < 0) {
        rest = rest.length === 0 ? chunk : joinBytes([rest, chunk], rest.length + chunk.length);
      } else {
        const lines =
          rest.length === 0
            ? chunk.subarray(0, cut + 1)
            : joinBytes([rest, chunk.subarray(0, cut + 1)], rest.length + cut + 1);
        rest = chunk.subarray(cut + 1);
        await consume(lines);
      }
      // A line may take up to 4 bytes a character: decoded, it says whether it is too long.
      if (rest.length > MAX_CSV_LINE && utf8.decode(rest).length > MAX_CSV_LINE) await tooLong();
    }
    if (rest.length > 0) await consume(rest);
    if (pool) {
      await dispatch();
      while (inFlight.length > 0) await takeOldest();
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
