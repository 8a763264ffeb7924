#!/usr/bin/env node
/**
 * The `quadspread` command: see `docs/cli.md`. Exit codes: 0 done, 2 bad command line or
 * job file, 3 a computation with no solution, 1 an internal error. The same file runs the
 * worker threads of the batch command.
 *
 * @module cli
 */
import { isBatchWorker, runBatchWorker } from './batch-worker.js';
import { main } from './program.js';

if (isBatchWorker()) runBatchWorker();
else
  process.exitCode = await main(process.argv.slice(2), {
    stdout: (text) => process.stdout.write(text),
    stdoutBytes: (bytes) => process.stdout.write(bytes),
    stderr: (text) => process.stderr.write(text),
    stderrIsTTY: process.stderr.isTTY === true,
    workerScript: new URL(import.meta.url),
  });
