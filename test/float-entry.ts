// Test helper: a module bundled through the float-specialising esbuild plugin
// (scripts/float-specialize.mjs), as the build bundles quadspread/float, and loaded from a
// temporary file, without `npm run build`.
import { build } from 'esbuild';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL, fileURLToPath } from 'node:url';
// @ts-expect-error: a plain ES module without types
import { floatSpecialize } from '../scripts/float-specialize.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** `entry` (an absolute path) bundled float-specialised, imported. */
export async function loadSpecialised(entry: string): Promise<Record<string, any>> {
  const out = await build({
    entryPoints: [entry],
    bundle: true,
    write: false,
    format: 'esm',
    platform: 'node',
    logLevel: 'silent',
    plugins: [floatSpecialize({ entries: [entry], srcDir: path.join(root, 'src') })],
  });
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'qs-float-entry-')), 'bundle.mjs');
  writeFileSync(file, out.outputFiles[0]!.text);
  return (await import(pathToFileURL(file).href)) as Record<string, any>;
}

/** quadspread/float as the build makes it: src/entries/float.gen.ts bundled float-specialised. */
export function loadFloatEntry(): Promise<Record<string, any>> {
  return loadSpecialised(path.join(root, 'src', 'entries', 'float.gen.ts'));
}
