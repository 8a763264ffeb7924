#!/usr/bin/env node
// npm run test:browser — the built ESM in a real browser. Needs `npm run build` first.
//
// Serves the built package (dist/esm, dist/float.js) and its two dependencies' ESM files
// from localhost, with an import map so that the page imports 'quadspread' exactly as an
// app would, and drives headless Chromium from Debian's `chromium` package with
// playwright-core (never a downloaded browser). When /usr/bin/chromium is missing and we
// are root, it is installed with apt-get first. The page solves a triangle and a height
// exactly; this script compares the page's results with values from published sources.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { extname, join, normalize, resolve, sep } from 'node:path';
import { checkBuilt, packageDir, root } from '../../scripts/pack.mjs';

const CHROMIUM = '/usr/bin/chromium';
const started = Date.now();

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot)
    throw new Error(
      `${CHROMIUM} is missing: install Debian's chromium package (apt-get install chromium)`,
    );
  console.log('test:browser: installing chromium with apt-get');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium'], {
    stdio: 'inherit',
    env,
  });
  if (!existsSync(CHROMIUM))
    throw new Error(`apt-get install chromium did not provide ${CHROMIUM}`);
}

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.json': 'application/json',
};

// The page. The triangle A1(0, 0), A2(14, 0), A3(5, 12) is Heron's 13-14-15 triangle.
const PAGE = `<!doctype html>
<html><head><meta charset="utf-8"><title>quadspread in a browser</title>
<script type="importmap">
{ "imports": {
  "quadspread": "/pkg/dist/esm/index.js",
  "quadspread/rational": "/pkg/dist/esm/rational.js",
  "quadspread/decimal": "/pkg/dist/esm/decimal.js",
  "quadspread/float": "/pkg/dist/float.js",
  "fraction.js": "/deps/fraction.js/dist/fraction.mjs",
  "big.js": "/deps/big.js/big.mjs"
} }
</script></head>
<body><pre id="out">running</pre>
<script type="module">
try {
  const { rational, decimal, point, triangle, heightFromReading, sqrtOf, rootToString } = await import('quadspread');
  const R = await import('quadspread/rational');
  const F = await import('quadspread/float');
  const A = rational;
  const t = triangle(A, point(A, 0, 0), point(A, 14, 0), point(A, 5, 12));
  const H = heightFromReading(A, { horizontal: 14400, vertical: '1/10' });
  const D = decimal(34);
  window.results = {
    triangle: [t.Q1, t.Q2, t.Q3, t.s1, t.s2, t.s3, t.quadrea].map((v) => A.toString(v)),
    height: [A.toString(H), rootToString(A, sqrtOf(A, H))],
    boundHeight: R.arithmetic.toString(R.heightFromReading({ horizontal: '14400', vertical: 0.1 })),
    floatQuadrance: F.quadrance(F.point(0, 0), F.point(3, 4)),
    decimalThird: D.toString(D.div(D.one, D.from(3))),
  };
} catch (e) {
  window.results = { error: String(e && e.stack || e) };
}
document.getElementById('out').textContent = JSON.stringify(window.results);
</script></body></html>`;

// Expected values, each from outside the code:
// - 13-14-15 triangle: Q1 = 15² = 225, Q2 = 13² = 169, Q3 = 14² = 196; Heron's area 84, so the
//   quadrea 16·84² = 112896; spreads by the cross law 144/169 (opposite 15), 16/25 (opposite
//   13), 3136/4225 (opposite 14) (Heron's 13-14-15 triangle, spreads by the cross law: derived, exact).
// - Height from a vertical reading: H = Q·R/(1 − R) = 14400·(1/10)/(9/10) = 1600, h = 40
//   (the definition of the vertical spread, DESIGN "Conventions"; derived).
// - 3-4-5: Q = 25 (Pythagoras). 1/3 to 34 significant digits (IEEE 754 decimal128 rounding).
const EXPECTED = {
  triangle: ['225', '169', '196', '144/169', '16/25', '3136/4225', '112896'],
  height: ['1600', '40'],
  boundHeight: '1600',
  floatQuadrance: 25,
  decimalThird: '0.3333333333333333333333333333333333',
};

function serve(pkgDir) {
  const mounts = { '/pkg/': pkgDir, '/deps/': join(root, 'node_modules') };
  const server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    if (url.pathname === '/favicon.ico') {
      res.writeHead(204);
      res.end();
      return;
    }
    if (url.pathname === '/' || url.pathname === '/index.html') {
      res.writeHead(200, { 'content-type': TYPES['.html'] });
      res.end(PAGE);
      return;
    }
    for (const [prefix, dir] of Object.entries(mounts)) {
      if (!url.pathname.startsWith(prefix)) continue;
      const file = normalize(join(dir, decodeURIComponent(url.pathname.slice(prefix.length))));
      if (!file.startsWith(resolve(dir) + sep) || !existsSync(file)) break;
      res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' });
      res.end(readFileSync(file));
      return;
    }
    res.writeHead(404);
    res.end('not found');
  });
  return new Promise((ok) => server.listen(0, '127.0.0.1', () => ok(server)));
}

let failed = 0;
let passed = 0;
const pkgDir = packageDir();
const profile = mkdtempSync(join(tmpdir(), 'quadspread-chromium-'));
let server;
let context;
try {
  checkBuilt(pkgDir);
  ensureChromium();
  const { chromium } = await import('playwright-core');
  server = await serve(pkgDir);
  const { port } = server.address();
  context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('response', (r) => {
    if (r.status() >= 400) errors.push(`${r.status()} for ${r.url()}`);
  });
  await page.goto(`http://127.0.0.1:${port}/`);
  await page.waitForFunction(() => window.results !== undefined, null, { timeout: 30000 });
  const results = await page.evaluate(() => window.results);
  console.log(`test:browser: the page computed ${JSON.stringify(results)}`);
  if (results.error) throw new Error(`the page threw: ${results.error}`);
  for (const [key, want] of Object.entries(EXPECTED)) {
    const ok = JSON.stringify(results[key]) === JSON.stringify(want);
    if (ok) passed++;
    else failed++;
    console.log(
      `  ${ok ? '✓' : '✗'} ${key}: ${JSON.stringify(results[key])}${ok ? '' : ` (expected ${JSON.stringify(want)})`}`,
    );
  }
  if (errors.length > 0) {
    failed++;
    console.log(`  ✗ the page logged errors: ${errors.join('; ')}`);
  }
} catch (e) {
  failed++;
  console.log(String(e.stack ?? e));
} finally {
  await context?.close();
  server?.close();
  rmSync(profile, { recursive: true, force: true });
  if (pkgDir !== root) rmSync(pkgDir, { recursive: true, force: true });
}
console.log(
  `\ntest:browser: ${passed} passed, ${failed} failed (${((Date.now() - started) / 1000).toFixed(1)} s)`,
);
process.exit(failed > 0 ? 1 : 0);
