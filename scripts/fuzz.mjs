#!/usr/bin/env node
// The long run of the adversarial suite (test/adversarial/): every exported function of every
// entry, called as its documented examples call it, with one argument or nested field replaced
// by junk, many times per call site, under a watchdog. Prints the figures (as in
// docs/errors.md) and the first failures; exit 1 when there is any.
// Usage: npm run fuzz -- [runs per call site, default 400] [seed, default the date]
import { build } from 'esbuild';
import { mkdirSync, rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const runs = Number(process.argv[2] ?? 400);
const seed = Number(
  process.argv[3] ?? Number(new Date().toISOString().slice(0, 10).replace(/-/g, '')),
);
const outdir = join(root, 'node_modules', '.cache', 'quadspread');
mkdirSync(outdir, { recursive: true });
const outfile = join(outdir, `fuzz-${process.pid}.mjs`);
await build({
  entryPoints: [join(root, 'test', 'adversarial', 'harness.ts')],
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  outfile,
  packages: 'external',
  logLevel: 'warning',
  // test/docs/extract.ts finds the repository from its own folder.
  banner: { js: `const __dirname = ${JSON.stringify(join(root, 'test', 'docs'))};` },
});
try {
  const { runAdversarial } = await import(pathToFileURL(outfile).href);
  console.error(`adversarial run: ${runs} junk calls per call site, seed ${seed}`);
  const s = await runAdversarial({ seed, runs, timeoutMs: 10000, verbose: true });
  const uncovered = Object.entries(s.uncovered)
    .map(([entry, names]) => `${entry} ${names.length}`)
    .join(', ');
  console.log(
    [
      `call sites: ${s.sites}`,
      `calls: ${s.calls} in ${s.seconds.toFixed(0)} s`,
      `QuadspreadError: ${s.typed}`,
      `sane values: ${s.values}`,
      `errors of the junk itself, passed through: ${s.passedThrough}`,
      `untyped errors: ${s.untyped}`,
      `non-finite results: ${s.nonFinite}`,
      `results of the wrong type: ${s.wrongType}`,
      `timeouts: ${s.timeouts.length}`,
      `slowest call: ${s.slowest.ms.toFixed(0)} ms (${s.slowest.site})`,
      `exported functions without a call site: ${uncovered}`,
    ].join('\n'),
  );
  for (const f of s.failures.slice(0, 40))
    console.log(`  ${f.kind}: ${f.site} ${f.path} = ${f.junk}: ${f.detail}`);
  for (const t of s.timeouts) console.log(`  timeout: ${t.site} run ${t.run}`);
  process.exitCode = s.untyped + s.nonFinite + s.wrongType + s.timeouts.length > 0 ? 1 : 0;
} finally {
  rmSync(outfile, { force: true });
}
