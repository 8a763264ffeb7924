#!/usr/bin/env node
// npm run size:modules — which modules of the built ESM take the bytes of the whole-library
// bundle (minified, fraction.js and big.js external). Needs `npm run build` first. For
// information only; `npm run size` holds the budgets.
import { build } from 'esbuild';
import { writeFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { root } from './pack.mjs';

const work = mkdtempSync(join(tmpdir(), 'quadspread-size-modules-'));
try {
  const entry = join(work, 'all.mjs');
  writeFileSync(
    entry,
    `import * as q from ${JSON.stringify(join(root, 'dist/esm/index.js'))};\nconsole.log(q);`,
  );
  const result = await build({
    entryPoints: [entry],
    bundle: true,
    minify: true,
    format: 'esm',
    platform: 'browser',
    target: 'es2022',
    write: false,
    legalComments: 'none',
    metafile: true,
    external: ['fraction.js', 'big.js'],
    logLevel: 'error',
  });
  const out = Object.values(result.metafile.outputs)[0];
  const rows = Object.entries(out.inputs)
    .map(([file, v]) => [file.replace(/^.*dist\/esm\//, ''), v.bytesInOutput])
    .sort((a, b) => b[1] - a[1]);
  const total = rows.reduce((s, r) => s + r[1], 0);
  for (const [file, bytes] of rows)
    console.log(`${(bytes / 1024).toFixed(1).padStart(6)} KiB  ${file}`);
  console.log(
    `${(total / 1024).toFixed(1).padStart(6)} KiB  total (bundle ${(result.outputFiles[0].contents.length / 1024).toFixed(1)} KiB)`,
  );
} finally {
  rmSync(work, { recursive: true, force: true });
}
