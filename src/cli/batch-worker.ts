/**
 * A worker of the batch command: sets the kind up for the header it is given, then turns each
 * block of lines it receives into output text (the same code as on the main thread), answering
 * in the order received. Lines are numbered from 1 in each block; the main thread adds the lines
 * before it.
 *
 * @module cli
 */
import { parentPort, workerData } from 'node:worker_threads';
import { batchRows } from './batch-rows.js';
import type { BlockResult, RowOptions } from './batch-rows.js';

/** What a worker is started with (its `workerData.batch`). */
export interface WorkerSetup {
  kind: string;
  names: string[];
  headerLine: number;
  options: RowOptions;
}

/** A block sent to a worker: whole lines as UTF-8 (the memory is handed over, not copied). */
export interface WorkerBlock {
  id: number;
  bytes: ArrayBuffer;
}

/** A worker's answer: the block's output as UTF-8 and its counts, or an internal error. */
export type WorkerAnswer =
  | { id: number; result: Omit<BlockResult, 'text'> & { bytes: ArrayBuffer } }
  | { id: number; failure: string };

/** Whether this thread is a batch worker (started by the batch command with its setup). */
export function isBatchWorker(): boolean {
  return parentPort !== null && (workerData as { batch?: unknown } | null)?.batch !== undefined;
}

/** Runs this thread as a batch worker until the main thread ends it. */
export function runBatchWorker(): void {
  const port = parentPort!;
  const setup = (workerData as { batch: WorkerSetup }).batch;
  const rows = batchRows(setup.kind, setup.names, setup.headerLine, setup.options);
  const decoder = new TextDecoder();
  const encoder = new TextEncoder();
  port.on('message', (m: WorkerBlock) => {
    let answer: WorkerAnswer;
    try {
      const { text, ...counts } = rows.block(decoder.decode(m.bytes), 1);
      // encode() gives an array of its own, so its memory can be handed back.
      const bytes = encoder.encode(text).buffer as ArrayBuffer;
      answer = { id: m.id, result: { ...counts, bytes } };
      port.postMessage(answer, [bytes]);
    } catch (e) {
      answer = { id: m.id, failure: (e as Error).stack ?? String(e) };
      port.postMessage(answer);
    }
  });
}
