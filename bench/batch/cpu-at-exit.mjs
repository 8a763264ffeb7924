// Preloaded by bench/batch.mjs (node --import): prints the process's CPU time (user + system
// of every thread, worker threads included) to stderr when the main thread exits.
import { isMainThread } from 'node:worker_threads';

if (isMainThread)
  process.on('exit', () => {
    const u = process.cpuUsage();
    process.stderr.write(`cpu-us ${u.user + u.system}\n`);
  });
