// Runs the command line as a subprocess: the CLI entry is bundled once per test file with
// esbuild (as `npm run demo` does, here with its packages included) into a fresh temporary
// folder, then run with node.
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

export interface CliResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

let bundled: string | undefined;
const folders: string[] = [];

/** A fresh temporary folder, removed by cleanUp(). */
export function tempFolder(): string {
  const dir = mkdtempSync(join(tmpdir(), 'quadspread-cli-'));
  folders.push(dir);
  return dir;
}

/**
 * Bundles src/cli/main.ts once, with the script of the batch command's worker threads beside
 * it as `npm run build` puts them (dist/cli.js and dist/batch-worker.js, ES modules).
 */
export async function bundleCli(): Promise<string> {
  if (bundled) return bundled;
  const dir = tempFolder();
  writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
  const out = join(dir, 'cli.js');
  await build({
    entryPoints: {
      cli: resolve(__dirname, '../../src/cli/main.ts'),
      'batch-worker': resolve(__dirname, '../../src/cli/batch-worker-main.ts'),
    },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outdir: dir,
    absWorkingDir: resolve(__dirname, '../..'),
    logLevel: 'error',
    // commander is CommonJS: give the ES module bundle a require() for its node: imports.
    banner: {
      js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);",
    },
  });
  bundled = out;
  return out;
}

/** Runs the CLI with the arguments, in `cwd` (default: the repository). */
export function cli(args: string[], options: { cwd?: string; input?: string } = {}): CliResult {
  if (!bundled) throw new Error('call bundleCli() in beforeAll');
  const r = spawnSync(process.execPath, [bundled, ...args], {
    cwd: options.cwd ?? resolve(__dirname, '../..'),
    encoding: 'utf8',
    input: options.input ?? '',
    timeout: 60000,
    maxBuffer: 64 * 1024 * 1024,
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Removes the temporary folders. */
export function cleanUp(): void {
  for (const d of folders.splice(0)) rmSync(d, { recursive: true, force: true });
  bundled = undefined;
}
