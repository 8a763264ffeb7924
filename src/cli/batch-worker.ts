/**
 * A worker of the batch command: sets the kind up for the header it is given, then turns each
 * block of lines it receives into output text (the same code as on the main thread), answering
 * in the order received. Lines are numbered from 1 in each block; the main thread adds the lines
 * before it.
 *
 * A block (about 1 MiB) is computed a slice of about 64 KiB of whole lines at a time: each slice
 * is decoded, computed and encoded into one output buffer that is kept from block to block.
 * Decoding a whole block into one string and building its output as one string made a worker
 * about 1.35× slower than the main thread, which reads the input in 64 KiB chunks: the
 * megabyte strings and the many strings sliced from them kept the garbage collector busy.
 *
 * The worker threads run `dist/batch-worker.js` (src/cli/batch-worker-main.ts), a bundle of
 * this module and the batch code only.
 *
 * @module cli
 */
import { parentPort, workerData } from 'node:worker_threads';
import { batchRows } from './batch-rows.js';
import type { BlockResult, RowOptions, Rows } from './batch-rows.js';

/** What a worker is started with (its `workerData.batch`). */
export interface WorkerSetup {
  kind: string;
  names: string[];
  headerLine: number;
  options: RowOptions;
}

/**
 * A block sent to a worker: whole lines as UTF-8, the first `length` bytes of `bytes` (the
 * memory is handed over, not copied, and handed back with the answer to be used again).
 */
export interface WorkerBlock {
  id: number;
  bytes: ArrayBuffer;
  length: number;
  /**
   * Memory for the block's output, handed back after an earlier output was written (used if
   * it is large enough). Filling memory already in use costs less than new memory, whose
   * every page the system must first provide.
   */
  out?: ArrayBuffer;
}

/** The counts of a block and its output as UTF-8. */
export type BlockBytes = Omit<BlockResult, 'text'> & { bytes: Uint8Array };

/**
 * A worker's answer: the block's output as UTF-8 and its counts, or an internal error; `input`
 * is the memory of the block, handed back.
 */
export type WorkerAnswer =
  | {
      id: number;
      input: ArrayBuffer;
      /** The output is the first `length` bytes of `bytes`. */
      result: Omit<BlockResult, 'text'> & { bytes: ArrayBuffer; length: number };
    }
  | { id: number; input: ArrayBuffer; failure: string };

/** Bytes of input decoded and computed at a time (whole lines: a longer line is one slice). */
export const SLICE = 1 << 16;

/** Whether this thread is a batch worker (started by the batch command with its setup). */
export function isBatchWorker(): boolean {
  return parentPort !== null && (workerData as { batch?: unknown } | null)?.batch !== undefined;
}

/**
 * Computes blocks of whole lines of UTF-8 a slice at a time into one output buffer, kept and
 * grown as needed from block to block. A byte order mark is not removed here (only the one
 * that starts the file is, by the main thread).
 */
export class BlockComputer {
  private readonly decoder = new TextDecoder('utf-8', { ignoreBOM: true });
  private readonly encoder = new TextEncoder();
  private out = new Uint8Array(1 << 21);

  constructor(
    private readonly rows: Rows,
    private readonly slice = SLICE,
  ) {}

  /**
   * The output of the lines in `input` (numbered from 1): at the start of `into` if it is large
   * enough, else in new memory of its own (with room to spare, to be used again).
   */
  block(input: Uint8Array, into?: Uint8Array): BlockBytes {
    let at = 0;
    let rows = 0;
    let noted = 0;
    let lines = 0;
    let pos = 0;
    while (pos < input.length) {
      let end = pos + this.slice;
      if (end >= input.length) end = input.length;
      else {
        // Up to the last line break in the slice, or else the end of the line that is longer.
        const cut = input.lastIndexOf(10, end - 1);
        if (cut >= pos) end = cut + 1;
        else {
          const next = input.indexOf(10, end);
          end = next < 0 ? input.length : next + 1;
        }
      }
      const r = this.rows.block(this.decoder.decode(input.subarray(pos, end)), lines + 1);
      pos = end;
      // At most 3 bytes of UTF-8 for each UTF-16 code unit.
      if (this.out.length - at < 3 * r.text.length) {
        const grown = new Uint8Array(Math.max(2 * this.out.length, at + 3 * r.text.length));
        grown.set(this.out.subarray(0, at));
        this.out = grown;
      }
      at += this.encoder.encodeInto(r.text, this.out.subarray(at)).written;
      rows += r.rows;
      noted += r.noted;
      if (r.problem)
        return {
          bytes: this.copy(at, into),
          rows,
          noted,
          lines: lines + r.lines,
          problem: r.problem,
        };
      lines += r.lines;
    }
    return { bytes: this.copy(at, into), rows, noted, lines };
  }

  /** The first `n` bytes of output, copied into `into` or into new memory. */
  private copy(n: number, into: Uint8Array | undefined): Uint8Array {
    if (!into || into.length < n) into = new Uint8Array(n + (n >> 2));
    into.set(this.out.subarray(0, n));
    return into.subarray(0, n);
  }
}

/** Runs this thread as a batch worker until the main thread ends it. */
export function runBatchWorker(): void {
  const port = parentPort!;
  const setup = (workerData as { batch: WorkerSetup }).batch;
  const computer = new BlockComputer(
    batchRows(setup.kind, setup.names, setup.headerLine, setup.options),
  );
  port.on('message', (m: WorkerBlock) => {
    let answer: WorkerAnswer;
    try {
      const { bytes, ...counts } = computer.block(
        new Uint8Array(m.bytes, 0, m.length),
        m.out && new Uint8Array(m.out),
      );
      // The output is in memory of its own (not the computer's), so it can be handed over.
      const buffer = bytes.buffer as ArrayBuffer;
      answer = {
        id: m.id,
        input: m.bytes,
        result: { ...counts, bytes: buffer, length: bytes.length },
      };
      port.postMessage(answer, [buffer, m.bytes]);
    } catch (e) {
      answer = { id: m.id, input: m.bytes, failure: (e as Error).stack ?? String(e) };
      port.postMessage(answer, [m.bytes]);
    }
  });
}
