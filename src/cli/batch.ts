/**
 * The batch command: a CSV of many cases streams through one computation, one output row
 * per input row. A progress count goes to stderr only when stderr is a terminal. With
 * `--out`, the output file appears only when every row has been computed (temporary file
 * and rename); a bad row stops the batch (exit 2 for a value that cannot be read, exit 3
 * for a row with no solution), naming its line, unless `--bad-rows note` asks to note it in
 * an `error` column and go on.
 *
 * The input is read in chunks and the output written in blocks of about 64 KiB. With one
 * thread (`--workers 1`) this thread computes each chunk of lines as it is read. With
 * `--workers N` (N ≥ 2; by default one per idle core), past the first MiB of input (computed
 * here), this thread only reads and writes: blocks of lines (1 MiB each) go to a pool of N
 * worker threads, each to the one with the fewest blocks in hand. At most two blocks per
 * worker are in flight, and the input is not read further until the oldest is written, so
 * memory stays bounded and rows keep their order.
 *
 * Only a byte order mark at the very start of the input is removed; U+FEFF anywhere else is a
 * character of the data (at a field's edges it is trimmed as white space is).
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
import type { BlockBytes, WorkerAnswer, WorkerBlock, WorkerSetup } from './batch-worker.js';
import { JobInvalid, JobUnsolvable } from './failure.js';
import type { Io } from './program.js';
export { BATCH_KINDS } from './tasks/batch-kinds.js';
export type { BatchKind } from './tasks/batch-kinds.js';
export { MAX_CSV_LINE } from './batch-rows.js';

/** The options of the batch command. */
export interface BatchOptions extends RowOptions {
  out?: string;
  /**
   * Worker threads computing a large input (default: {@link idleCores}); 1: none, this thread
   * computes every row.
   */
  workers?: number;
}

/** Input computed on the main thread before the worker pool starts, in bytes. */
export const POOL_FROM = 1 << 20;
/** Bytes of input per block sent to a worker (whole lines: a block is cut at its last line break). */
const BLOCK = 1 << 20;
/** The memory of a block: room for a block and one more chunk read. */
const BLOCK_MEMORY = BLOCK + (1 << 17);
/** Output is written when this many characters are waiting. */
const FLUSH = 1 << 16;
/**
 * The young generation of a worker's heap, in MiB. What a row leaves behind is short-lived
 * (strings; in the exact arithmetics bigints and fractions too); with V8's default young
 * generation each worker first touches tens of MiB of fresh pages (page faults, system time).
 * Measured with `inverses`, two workers, 2 cores (2026-12-04, `/usr/bin/time`): float, 1 000 000
 * rows, page faults 39 000–40 000 → 27 000–29 000, system time 0.42–0.47 s → 0.30–0.40 s, wall
 * 1.22–1.35 s → 1.13–1.26 s with 8 MiB (4 MiB about the same; 1–2 MiB promote too much and were
 * slower than the default); rational, 200 000 rows, page faults 64 000–65 000 → 49 000–50 000,
 * wall 8.08–8.15 s → 7.97–8.00 s.
 */
const WORKER_YOUNG_MB = 8;

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

/** UTF-8 as text; a byte order mark is kept (only the one starting the input is removed, before). */
const utf8 = new TextDecoder('utf-8', { ignoreBOM: true });

/** Worker threads computing blocks; answers come back by block id. */
export class Pool {
  private readonly workers: Worker[] = [];
  /** Blocks in hand, by worker. */
  private readonly busy: number[] = [];
  private readonly waiting = new Map<
    number,
    { worker: number; resolve: (r: BlockBytes) => void; reject: (e: Error) => void }
  >();
  /** Memory of blocks handed back, to be filled again. */
  private readonly spare: ArrayBuffer[] = [];
  /** Memory of outputs written, to be filled again (by the workers). */
  private readonly spareOut: ArrayBuffer[] = [];
  private nextId = 0;
  private closing = false;
  /** Why the pool cannot go on (a worker failed or stopped): every later block is refused with it. */
  private failure: Error | undefined;

  constructor(script: URL, setup: WorkerSetup, n: number) {
    for (let i = 0; i < n; i++) {
      const w = new Worker(script, {
        workerData: { batch: setup },
        resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_MB },
      });
      w.on('message', (a: WorkerAnswer) => {
        const entry = this.waiting.get(a.id);
        if (!entry) return;
        this.waiting.delete(a.id);
        this.busy[entry.worker]!--;
        if (a.input.byteLength === BLOCK_MEMORY) this.spare.push(a.input);
        if ('failure' in a) entry.reject(new Error(`in a batch worker: ${a.failure}`));
        else
          entry.resolve({ ...a.result, bytes: new Uint8Array(a.result.bytes, 0, a.result.length) });
      });
      w.on('error', (e) => this.fail(e));
      w.on('exit', (code) => {
        if (!this.closing) this.fail(new Error(`a batch worker stopped (exit code ${code})`));
      });
      this.workers.push(w);
      this.busy.push(0);
    }
  }

  /** The number of worker threads. */
  get size(): number {
    return this.workers.length;
  }

  private fail(e: Error): void {
    this.failure ??= e;
    for (const w of this.waiting.values()) w.reject(this.failure);
    this.waiting.clear();
  }

  /** Memory for a block ({@link BLOCK_MEMORY} bytes): one handed back, or new. */
  memory(): Uint8Array {
    return new Uint8Array(this.spare.pop() ?? new ArrayBuffer(BLOCK_MEMORY));
  }

  /** Keeps the memory of an output that is written, for a later block's output. */
  written(bytes: Uint8Array): void {
    if (this.spareOut.length < 2 * this.workers.length)
      this.spareOut.push(bytes.buffer as ArrayBuffer);
  }

  /**
   * Hands the first `length` bytes of `bytes` (which must own its buffer) over to the worker
   * with the fewest blocks in hand, with memory for its output if some is kept.
   */
  submit(bytes: Uint8Array, length: number): Promise<BlockBytes> {
    if (this.failure) return Promise.reject(this.failure);
    const id = this.nextId++;
    let worker = 0;
    for (let i = 1; i < this.busy.length; i++) if (this.busy[i]! < this.busy[worker]!) worker = i;
    const p = new Promise<BlockBytes>((resolve, reject) =>
      this.waiting.set(id, { worker, resolve, reject }),
    );
    this.busy[worker]!++;
    const out = this.spareOut.pop();
    const block: WorkerBlock = { id, bytes: bytes.buffer as ArrayBuffer, length, out };
    this.workers[worker]!.postMessage(block, out ? [block.bytes, out] : [block.bytes]);
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
  /** Writes bytes; true if done with them (written or copied), so their memory can be used again. */
  const emitBytes = (bytes: Uint8Array): boolean => {
    flush();
    if (bytes.length === 0) return true;
    if (pending) pending.write(bytes);
    else if (io.stdoutBytes) return io.stdoutBytes(bytes) === true;
    else io.stdout(utf8.decode(bytes));
    return true;
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
  const inFlight: Promise<BlockBytes>[] = [];
  let block: Uint8Array = new Uint8Array(0); // the block being gathered (pool mode)
  let fill = 0; // its bytes so far

  // The workers number lines from 1 in each block; the blocks are taken in order, so the
  // lines before each are known when it is taken.
  const takeOldest = async (): Promise<void> => {
    const r = await inFlight.shift()!;
    if (emitBytes(r.bytes)) pool!.written(r.bytes);
    if (r.problem) r.problem.line += lineNo;
    lineNo += r.lines;
    count(r);
  };

  /** Every block sent is written (in order), then the line that is too long is refused. */
  const tooLong = async (): Promise<never> => {
    while (inFlight.length > 0) await takeOldest();
    throw lineTooLong(lineNo + 1);
  };

  /**
   * Sends the whole lines gathered to the pool (at the end of the input, all that is left),
   * keeping a last partial line for the next block; waits for the oldest block when enough
   * are in flight.
   */
  const dispatch = async (end: boolean): Promise<void> => {
    if (fill === 0) return;
    const full = block;
    const cut = end ? fill : full.lastIndexOf(10, fill - 1) + 1;
    // No line break in a block's worth of bytes: a line longer than any that is read.
    if (cut === 0) await tooLong();
    block = pool!.memory();
    block.set(full.subarray(cut, fill));
    fill -= cut;
    const p = pool!.submit(full, cut);
    p.catch(() => {}); // awaited in order; a failure is reported there
    inFlight.push(p);
    while (inFlight.length >= 2 * pool!.size) await takeOldest();
  };

  /** Input read (in pool mode), gathered into blocks. */
  const gather = async (bytes: Uint8Array): Promise<void> => {
    for (let at = 0; at < bytes.length;) {
      const n = Math.min(bytes.length - at, block.length - fill);
      block.set(bytes.subarray(at, at + n), fill);
      fill += n;
      at += n;
      if (fill >= BLOCK) await dispatch(false);
    }
  };

  /** Whole lines of input as UTF-8 (each ending with a line break, but perhaps the last). */
  const consume = (bytes: Uint8Array): void => {
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
    const r = engine!.block(utf8.decode(bytes), lineNo + 1);
    lineNo += r.lines;
    emit(r.text);
    count(r);
    // Past the first MiB, the rest goes to worker threads.
    if (workers > 1 && io.workerScript && read > POOL_FROM) {
      pool = new Pool(io.workerScript, setup!, workers);
      block = pool.memory();
    }
  };

  try {
    if (o.out !== undefined) pending = openPending(o.out);
    const none = new Uint8Array(0);
    let rest: Uint8Array = none;
    let start = true; // the input's first three bytes not seen yet
    const chunks = (input as AsyncIterable<Uint8Array>)[Symbol.asyncIterator]();
    for (;;) {
      let next: IteratorResult<Uint8Array>;
      try {
        next = await chunks.next();
      } catch (e) {
        throw cannotRead(file, e);
      }
      if (next.done) break;
      let chunk: Uint8Array = typeof next.value === 'string' ? Buffer.from(next.value) : next.value;
      if (start) {
        // A byte order mark is removed at the very start of the input only.
        if (rest.length > 0) {
          chunk = joinBytes([rest, chunk], rest.length + chunk.length);
          rest = none;
        }
        if (chunk.length < 3) {
          rest = chunk;
          continue;
        }
        if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) chunk = chunk.subarray(3);
        start = false;
      }
      if (pool) {
        await gather(chunk);
        continue;
      }
      const cut = chunk.lastIndexOf(10);
      if (cut < 0) {
        rest = rest.length === 0 ? chunk : joinBytes([rest, chunk], rest.length + chunk.length);
      } else {
        const lines =
          rest.length === 0
            ? chunk.subarray(0, cut + 1)
            : joinBytes([rest, chunk.subarray(0, cut + 1)], rest.length + cut + 1);
        rest = chunk.subarray(cut + 1);
        consume(lines);
        if (pool) {
          await gather(rest);
          rest = none;
          continue;
        }
      }
      // A line may take up to 4 bytes a character: decoded, it says whether it is too long.
      if (rest.length > MAX_CSV_LINE && utf8.decode(rest).length > MAX_CSV_LINE) await tooLong();
    }
    if (rest.length > 0) consume(rest);
    if (pool) {
      await dispatch(true);
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
