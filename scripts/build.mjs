#!/usr/bin/env node
// npm run build: regenerates the bound entries from src/index.ts, empties dist/, runs tsup
// (tsup.config.ts) and makes the declarations correct under every module resolution.
import { execFileSync } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { root } from './pack.mjs';

const node = (script, ...args) =>
  execFileSync(process.execPath, [join(root, script), ...args], { cwd: root, stdio: 'inherit' });
node('scripts/gen-bound.mjs');
rmSync(join(root, 'dist'), { recursive: true, force: true });
execFileSync(process.execPath, [join(root, 'node_modules', 'tsup', 'dist', 'cli-default.js')], {
  cwd: root,
  stdio: 'inherit',
});
// The per-module ESM tree keeps the generated entries under dist/esm/entries/; the package's
// exports map names dist/esm/rational.js and dist/esm/decimal.js.
for (const e of ['rational', 'decimal'])
  writeFileSync(join(root, 'dist', 'esm', `${e}.js`), `export * from './entries/${e}.gen.js';\n`);
node('scripts/fix-dts.mjs');
