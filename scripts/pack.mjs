// Packs the package as `npm publish` would (the built dist/ must exist: `npm run build`),
// without running the prepack build again. Used by lint:package, test:package and size.
// QUADSPREAD_DIST=<folder> packs that build output instead of dist/ (a private build made
// with `npx tsup --out-dir <folder>`, so that a concurrent build of dist/ cannot interfere).
import { execFileSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** The folder to pack: the repository, or a staged copy with QUADSPREAD_DIST as dist/. */
export function packageDir() {
  const dist = process.env.QUADSPREAD_DIST;
  if (!dist) return root;
  const stage = mkdtempSync(join(tmpdir(), 'quadspread-stage-'));
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
  cpSync(join(root, 'package.json'), join(stage, 'package.json'));
  for (const f of ['README.md', 'LICENSE'])
    if (existsSync(join(root, f))) cpSync(join(root, f), join(stage, f));
  for (const f of pkg.files) {
    const base = f.split('/')[0];
    if (base === 'dist' || base.includes('*')) continue;
    if (existsSync(join(root, base)))
      cpSync(join(root, base), join(stage, base), { recursive: true });
  }
  if (existsSync(join(root, 'docs')))
    cpSync(join(root, 'docs'), join(stage, 'docs'), {
      recursive: true,
      filter: (p) => !p.includes('/docs/api'),
    });
  cpSync(resolve(dist), join(stage, 'dist'), { recursive: true });
  return stage;
}

/** Throws unless every file the exports map names exists. */
export function checkBuilt(dir = root) {
  const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8'));
  const missing = [];
  const walk = (v) => {
    if (typeof v === 'string') {
      if (!existsSync(join(dir, v))) missing.push(v);
    } else if (v && typeof v === 'object') Object.values(v).forEach(walk);
  };
  walk(pkg.exports);
  if (missing.length > 0)
    throw new Error(`not built (missing ${missing.join(', ')}): run \`npm run build\` first`);
  return pkg;
}

/** `npm pack` into a fresh temporary folder; returns the tarball's path. */
export function packTarball(dest = mkdtempSync(join(tmpdir(), 'quadspread-pack-'))) {
  const dir = packageDir();
  checkBuilt(dir);
  mkdirSync(dest, { recursive: true });
  const out = execFileSync(
    'npm',
    ['pack', '--ignore-scripts', '--json', '--pack-destination', dest],
    {
      cwd: dir,
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'inherit'],
    },
  );
  const [info] = JSON.parse(out);
  return {
    tarball: join(dest, info.filename),
    files: info.files.map((f) => f.path),
    dir: dest,
    size: info.size,
  };
}
