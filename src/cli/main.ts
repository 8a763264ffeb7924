#!/usr/bin/env node
/**
 * The `quadspread` command: see `docs/cli.md`. Exit codes: 0 done, 2 bad command line or
 * job file, 3 a computation with no solution, 1 an internal error. The worker threads of the
 * batch command run `batch-worker.js` beside this file (dist/batch-worker.js); where there is
 * none (a bundle of the sources made elsewhere), this same file runs them.
 *
 * @module cli
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { isBatchWorker, runBatchWorker } from './batch-worker.js';
import { main } from './program.js';

if (isBatchWorker()) runBatchWorker();
else {
  const beside = new URL('./batch-worker.js', import.meta.url);
  process.exitCode = await main(process.argv.slice(2), {
    stdout: (text) => process.stdout.write(text),
    // Done with the bytes when nothing is left waiting to be written (a file, or a pipe that
    // took them at once).
    stdoutBytes: (bytes) => {
      process.stdout.write(bytes);
      return process.stdout.writableLength === 0;
    },
    stderr: (text) => process.stderr.write(text),
    stderrIsTTY: process.stderr.isTTY === true,
    workerScript: existsSync(fileURLToPath(beside)) ? beside : new URL(import.meta.url),
  });
}
