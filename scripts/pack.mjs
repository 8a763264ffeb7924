// Packs the package as `npm publish` would (the built dist/ must exist: `npm run build`),
// without running the prepack build again. Used by lint:package, test:package and size.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** Throws unless every file the exports map names exists in dist/. */
export function checkBuilt() {
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
  const missing = [];
  const walk = (v) => {
    if (typeof v === 'string') {
      if (!existsSync(join(root, v))) missing.push(v);
    } else if (v && typeof v === 'object') Object.values(v).forEach(walk);
  };
  walk(pkg.exports);
  if (missing.length > 0) throw new Error(`not built (missing ${missing.join(', ')}): run \`npm run build\` first`);
  return pkg;
}

/** `npm pack` into a fresh temporary folder; returns the tarball's path. */
export function packTarball(dest = mkdtempSync(join(tmpdir(), 'quadspread-pack-'))) {
  checkBuilt();
  const out = execFileSync('npm', ['pack', '--ignore-scripts', '--json', '--pack-destination', dest], {
    cwd: root,
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const [info] = JSON.parse(out);
  return { tarball: join(dest, info.filename), files: info.files.map((f) => f.path), dir: dest, size: info.size };
}
