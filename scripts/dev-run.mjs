#!/usr/bin/env node
// Runs a TypeScript entry of the source tree without a full build: bundles it with esbuild
// into node_modules/.cache/quadspread/ and runs it with the remaining arguments.
// Usage: node scripts/dev-run.mjs src/cli/main.ts demo --format markdown
import { build } from 'esbuild';
import { mkdirSync, rmSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const [entry, ...args] = process.argv.slice(2);
if (!entry) {
  console.error('usage: node scripts/dev-run.mjs <entry.ts> [args...]');
  process.exit(2);
}
const outdir = resolve('node_modules/.cache/quadspread');
mkdirSync(outdir, { recursive: true });
// One file per process, so that runs at the same time never execute each other's bundle.
const outfile = resolve(outdir, `${basename(entry).replace(/\.ts$/, '')}-${process.pid}.mjs`);
await build({
  entryPoints: [entry],
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  outfile,
  packages: 'external',
  logLevel: 'warning',
});
process.argv = [process.argv[0], outfile, ...args];
try {
  await import(pathToFileURL(outfile).href);
} finally {
  // The bundle is loaded; remove it (a long-running command keeps its module in memory).
  rmSync(outfile, { force: true });
}
