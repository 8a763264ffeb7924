// Runs the adversarial worker (test/adversarial/worker.ts) under a watchdog: the worker is
// bundled with esbuild and started in a worker thread; it counts each call in shared memory,
// and when one call runs past the time limit the watchdog ends the worker, records a timeout
// for that call and starts a new worker from the next one.
import { build } from 'esbuild';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
// @ts-expect-error: a plain ES module without types
import { floatSpecialize } from '../../scripts/float-specialize.mjs';
import { compileExample, examplesOf, repoRoot, sourceFiles } from '../docs/extract';
import type { Failure, WorkerInput, WorkerResult } from './worker';

export interface AdversarialOptions {
  seed: number;
  /** Junk replacements per call site. */
  runs: number;
  /** Longest time one call may take, in ms. */
  timeoutMs: number;
  /** Log progress to stderr. */
  verbose?: boolean;
}

export interface AdversarialSummary {
  sites: number;
  calls: number;
  typed: number;
  values: number;
  passedThrough: number;
  untyped: number;
  nonFinite: number;
  wrongType: number;
  timeouts: { site: string; run: number }[];
  failures: Failure[];
  covered: Record<string, string[]>;
  uncovered: Record<string, string[]>;
  slowest: { site: string; ms: number };
  seconds: number;
}

async function bundle(
  entry: string,
  dir: string,
  name: string,
  plugins: unknown[] = [],
): Promise<string> {
  const out = await build({
    entryPoints: [entry],
    bundle: true,
    write: false,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    logLevel: 'silent',
    plugins: plugins as never,
  });
  const file = path.join(dir, name);
  writeFileSync(file, out.outputFiles[0]!.text);
  return file;
}

/** Runs the suite; resolves with the figures (it never throws for a finding). */
export async function runAdversarial(o: AdversarialOptions): Promise<AdversarialSummary> {
  const t0 = Date.now();
  const dir = mkdtempSync(path.join(tmpdir(), 'qs-adversarial-'));
  const floatEntry = path.join(repoRoot, 'src', 'entries', 'float.gen.ts');
  const [workerFile, floatFile] = await Promise.all([
    bundle(path.join(repoRoot, 'test', 'adversarial', 'worker.ts'), dir, 'worker.mjs'),
    bundle(floatEntry, dir, 'float.mjs', [
      floatSpecialize({ entries: [floatEntry], srcDir: path.join(repoRoot, 'src') }),
    ]),
  ]);
  const examples = sourceFiles().flatMap((f) =>
    examplesOf(f).map((ex) => ({ where: `${ex.file}:${ex.line}`, js: compileExample(ex).js })),
  );
  const summary: AdversarialSummary = {
    sites: 0,
    calls: 0,
    typed: 0,
    values: 0,
    passedThrough: 0,
    untyped: 0,
    nonFinite: 0,
    wrongType: 0,
    timeouts: [],
    failures: [],
    covered: {},
    uncovered: {},
    slowest: { site: '', ms: 0 },
    seconds: 0,
  };
  let start = { site: 0, run: 0 };
  let siteNames: string[] = [];
  for (;;) {
    const shared = new SharedArrayBuffer(16);
    const counters = new Int32Array(shared);
    counters[0] = -1;
    const input: WorkerInput = {
      examples,
      floatFile: pathToFileURL(floatFile).href,
      seed: o.seed,
      runs: o.runs,
      shared,
      start,
      timeoutMs: o.timeoutMs,
    };
    const worker = new Worker(workerFile, {
      workerData: input,
      resourceLimits: { maxOldGenerationSizeMb: 2048 },
    });
    const outcome = await new Promise<{
      result?: WorkerResult;
      timeout?: { site: number; run: number };
      error?: string;
    }>((resolve) => {
      let beat = -1;
      let since = Date.now();
      const timer = setInterval(
        () => {
          const b = Atomics.load(counters, 2);
          if (b !== beat) {
            beat = b;
            since = Date.now();
            if (o.verbose && b % 2000 === 0 && b > 0)
              process.stderr.write(`  … site ${counters[0]} of ${counters[3]}\n`);
            return;
          }
          // Recording the call sites (site −1) may take longer than one call.
          const limit = counters[0] === -1 ? Math.max(120000, o.timeoutMs) : o.timeoutMs;
          if (Date.now() - since > limit) {
            clearInterval(timer);
            const at = { site: counters[0]!, run: counters[1]! };
            void worker.terminate().then(() => resolve({ timeout: at }));
          }
        },
        Math.min(250, o.timeoutMs / 4),
      );
      worker.once('message', (result: WorkerResult) => {
        clearInterval(timer);
        void worker.terminate().then(() => resolve({ result }));
      });
      worker.once('error', (e) => {
        clearInterval(timer);
        resolve({
          error: String((e as Error).stack ?? e).slice(0, 800),
          timeout: { site: counters[0]!, run: counters[1]! },
        });
      });
    });
    if (outcome.result) {
      const r = outcome.result;
      siteNames = r.sites;
      summary.sites = r.sites.length;
      summary.calls += r.calls;
      summary.typed += r.typed;
      summary.values += r.values;
      summary.passedThrough += r.passedThrough;
      summary.untyped += r.failureCount['untyped error'];
      summary.nonFinite += r.failureCount['non-finite result'];
      summary.wrongType += r.failureCount['wrong result type'];
      summary.failures.push(...r.failures.slice(0, 300 - summary.failures.length));
      summary.covered = r.covered;
      summary.uncovered = r.uncovered;
      if (r.slowest.ms > summary.slowest.ms) summary.slowest = r.slowest;
      break;
    }
    const at = outcome.timeout!;
    if (at.site < 0)
      throw new Error(
        `the adversarial worker failed while recording call sites: ${outcome.error ?? 'timeout'}`,
      );
    summary.calls += 1;
    summary.timeouts.push({
      site: `${siteNames[at.site] ?? `site ${at.site}`}${outcome.error ? ` (${outcome.error})` : ''}`,
      run: at.run,
    });
    if (o.verbose)
      process.stderr.write(
        `  timeout or crash at site ${at.site} run ${at.run} ${outcome.error ?? ''}\n`,
      );
    // Calls completed before the timeout are counted again by the next worker only from here on.
    start =
      at.run + 1 < o.runs ? { site: at.site, run: at.run + 1 } : { site: at.site + 1, run: 0 };
  }
  // Timeouts met before the first worker finished are named now that the sites are known.
  for (const t of summary.timeouts) {
    const m = /^site (\d+)/.exec(t.site);
    if (m && siteNames[Number(m[1])]) t.site = t.site.replace(m[0], siteNames[Number(m[1])]!);
  }
  summary.seconds = (Date.now() - t0) / 1000;
  return summary;
}
