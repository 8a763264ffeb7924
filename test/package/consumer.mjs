#!/usr/bin/env node
// npm run test:package — the built-package (consumer) tests. Needs `npm run build` first.
//
// Packs the package (`npm pack`), installs the tarball into a temporary project the way a
// user would (`npm install <tarball>`; its dependencies come from the npm cache), then loads
// every entry every way users do:
//   - ESM: named imports, namespace imports, and the dependencies' default exports inside
//     the built code (fraction.js, big.js: no "default is not a constructor");
//   - CJS: require() of every entry;
//   - TypeScript: the same code typechecked (with the repo's typescript, skipLibCheck off,
//     strict) under moduleResolution node16 (an ESM .mts and a CommonJS .cts file), bundler,
//     and node10 (the resolution stubs);
// and checks that the answers are exact (a 3-4-5 triangle, a height from a vertical reading).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { packTarball, root } from '../../scripts/pack.mjs';

const started = Date.now();
const work = mkdtempSync(join(tmpdir(), 'quadspread-consumer-'));
const keep = process.argv.includes('--keep');
let passed = 0;
let failed = 0;

function run(cmd, args, cwd) {
  return execFileSync(cmd, args, { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
}

function check(name, fn) {
  try {
    fn();
    passed++;
    console.log(`  ✓ ${name}`);
  } catch (e) {
    failed++;
    console.log(`  ✗ ${name}`);
    console.log(
      String(e.stdout ?? '') +
        String(e.stderr ?? '') +
        (e.stdout || e.stderr ? '' : String(e.stack ?? e)),
    );
  }
}

function write(dir, files) {
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
}

// Shared checks, written once as JS; every loader runs them on the modules it got.
// The 3-4-5 triangle: quadrances 9, 16, 25, spread 1 at the right angle (Pythagoras; derived).
// Height from a vertical reading: H = Q·R/(1 − R) with Q = 120² and R = 1/10 gives H = 1600,
// so the height is 40 exactly (derived from the definition of the vertical spread).
const CHECKS = `
function assertEqual(actual, expected, what) {
  if (actual !== expected) throw new Error(what + ': expected ' + JSON.stringify(expected) + ', got ' + JSON.stringify(actual));
}
function runChecks(label, q, R, D, F) {
  const A = q.rational;
  const O = q.point(A, 0, 0), P = q.point(A, 3, 0), S = q.point(A, 3, 4);
  assertEqual(A.toString(q.quadrance(A, O, S)), '25', label + ' generic quadrance');
  assertEqual(A.toString(q.spread(A, P, O, S)), '1', label + ' generic spread at the right angle');
  assertEqual(A.toString(A.from('1/3').add(A.from('1/6'))), '1/2', label + ' fraction.js values work');
  const D34 = q.decimal(34);
  assertEqual(D34.toString(D34.div(D34.one, D34.from(3))), '0.3333333333333333333333333333333333', label + ' big.js values work');
  assertEqual(R.arithmetic.toString(R.quadrance(R.point('1/2', 0), R.point(0, 2))), '17/4', label + ' rational entry');
  assertEqual(D.arithmetic.toString(D.quadrance(D.point('0.1', 0), D.point(0, '0.2'))), '0.05', label + ' decimal entry');
  assertEqual(F.quadrance(F.point(0, 0), F.point(3, 4)), 25, label + ' float entry');
  const H = R.arithmetic.div(R.arithmetic.mul(R.arithmetic.from(14400), R.arithmetic.from('1/10')), R.arithmetic.from('9/10'));
  assertEqual(R.rootToString(R.sqrtOf(H)), '40', label + ' height from a vertical reading');
  let code;
  try { F.point('abc', 0); } catch (e) { code = e.code; if (!(e instanceof q.QuadspreadError)) throw new Error(label + ' instanceof across entries'); }
  assertEqual(code, 'INVALID_NUMBER', label + ' error code');
  for (const m of [R, D, F]) for (const key of ['point', 'quadrance', 'spread', 'rational', 'QuadspreadError']) if (!(key in m)) throw new Error(label + ' bound entry lacks ' + key);
}
`;

try {
  console.log('test:package: packing');
  const pack = packTarball(join(work, 'pack'));
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
  for (const f of pack.files) {
    if (!/^(dist\/|docs\/|rational\/|decimal\/|float\/|io\/|package\.json$|README|LICENSE)/.test(f))
      throw new Error(`unexpected file in the tarball: ${f}`);
  }
  console.log(
    `test:package: ${pack.files.length} files, ${(pack.size / 1024).toFixed(1)} KiB packed`,
  );

  const app = join(work, 'app');
  mkdirSync(app, { recursive: true });
  writeFileSync(
    join(app, 'package.json'),
    JSON.stringify({ name: 'consumer-app', version: '1.0.0', private: true }, null, 2),
  );
  console.log('test:package: installing the tarball (offline: dependencies from the npm cache)');
  run(
    'npm',
    ['install', pack.tarball, '--no-audit', '--no-fund', '--prefer-offline', '--no-package-lock'],
    app,
  );

  write(app, {
    'checks.cjs': `${CHECKS}\nmodule.exports = { runChecks };\n`,
    'esm-named.mjs': `import { rational, decimal, float, point, quadrance, spread, QuadspreadError } from 'quadspread';
import { arithmetic as Ra, point as Rp, quadrance as Rq, sqrtOf, rootToString } from 'quadspread/rational';
import * as D from 'quadspread/decimal';
import * as F from 'quadspread/float';
import * as q from 'quadspread';
import checks from './checks.cjs';
import { dataFormatOf } from 'quadspread/io';
if (dataFormatOf('a.geojson') !== 'geojson') throw new Error('io entry (ESM)');
if (typeof rational.from !== 'function' || typeof decimal !== 'function' || float.name !== 'float') throw new Error('named imports');
if (QuadspreadError !== q.QuadspreadError || point !== q.point || quadrance !== q.quadrance || spread !== q.spread) throw new Error('named = namespace');
checks.runChecks('esm', q, { arithmetic: Ra, point: Rp, quadrance: Rq, sqrtOf, rootToString, ...await import('quadspread/rational') }, D, F);
console.log('ok');
`,
    'esm-dynamic.mjs': `const q = await import('quadspread');
const R = await import('quadspread/rational');
const D = await import('quadspread/decimal');
const F = await import('quadspread/float');
const { default: checks } = await import('./checks.cjs');
checks.runChecks('esm dynamic', q, R, D, F);
console.log('ok');
`,
    'cjs.cjs': `const q = require('quadspread');
const R = require('quadspread/rational');
const D = require('quadspread/decimal');
const F = require('quadspread/float');
const { runChecks } = require('./checks.cjs');
const { rational, quadrance, point } = require('quadspread');
const io = require('quadspread/io');
if (io.dataFormatOf('a.xml') !== 'landxml') throw new Error('io entry (CJS)');
if (rational.toString(quadrance(rational, point(rational, 1, 1), point(rational, 2, 3))) !== '5') throw new Error('destructured require');
runChecks('cjs', q, R, D, F);
console.log('ok');
`,
    // TypeScript consumers: the same calls, typechecked against the published declarations.
    'ts/esm.mts': `import { rational, decimal, float, point, quadrance, spread, QuadspreadError, type Rational, type Decimal, type Arithmetic } from 'quadspread';
import * as R from 'quadspread/rational';
import * as D from 'quadspread/decimal';
import * as F from 'quadspread/float';
import { dataFormatOf, type DataFormat } from 'quadspread/io';
const fmt: DataFormat = dataFormatOf('p.csv');
const A: Arithmetic<Rational, true> = rational;
const q: Rational = quadrance(A, point(A, 0, 0), point(A, 3, 4));
const half: Rational = q.add(1).div(52);
const s: Rational = spread(A, point(A, 3, 0), point(A, 0, 0), point(A, 3, 4));
const d: Decimal = D.quadrance(D.point('0.1', 0), D.point(0, '0.2'));
const dd: Decimal = decimal(20).from('1.5');
const f: number = F.quadrance(F.point(0, 0), F.point(3, 4));
const g: number = float.add(1, 2);
const r: Rational = R.quadrance(R.point('1/2', 0), R.point(0, 2));
const root: string = R.rootToString(R.sqrtOf(8));
const e = new QuadspreadError('INVALID_NUMBER', 'here', 'what');
const code: 'INVALID_NUMBER' | string = e.code;
// @ts-expect-error -- a bound function takes no arithmetic
F.quadrance(float, F.point(0, 0), F.point(3, 4));
export { half, s, d, dd, f, g, r, root, code, fmt };
`,
    'ts/cjs.cts': `import q = require('quadspread');
import R = require('quadspread/rational');
import F = require('quadspread/float');
import io = require('quadspread/io');
import { decimal, type Decimal } from 'quadspread';
const v: io.DataFormat = io.dataFormatOf('p.xml');
const x: q.Rational = q.rational.from('1/3');
const y: q.Rational = R.quadrance(R.point(x, 0), R.point(0, 1));
const z: number = F.spreadFromDegrees(30);
const w: Decimal = decimal(10).from(2);
export = { x, y, z, w, v };
`,
    'ts/bundler.ts': `import { rational, point, quadrance, type Rational } from 'quadspread';
import { arithmetic, sqrtOf, rootToString } from 'quadspread/rational';
import { quadrance as fq, point as fp } from 'quadspread/float';
import { arithmetic as D } from 'quadspread/decimal';
import { dataFormatOf } from 'quadspread/io';
const q: Rational = quadrance(rational, point(rational, 0, 0), point(rational, 1, 1));
const t: string = rootToString(sqrtOf(q));
const n: number = fq(fp(0, 0), fp(1, 1));
const s: string = arithmetic.toString(q) + D.toString(D.from(1)) + dataFormatOf('p.txt');
export { t, n, s };
`,
    'ts/tsconfig.node16.json': JSON.stringify(
      {
        compilerOptions: {
          module: 'node16',
          moduleResolution: 'node16',
          target: 'es2022',
          strict: true,
          noEmit: true,
          skipLibCheck: false,
          types: [],
        },
        files: ['esm.mts', 'cjs.cts'],
      },
      null,
      2,
    ),
    'ts/tsconfig.nodenext.json': JSON.stringify(
      {
        compilerOptions: {
          module: 'nodenext',
          moduleResolution: 'nodenext',
          target: 'es2022',
          strict: true,
          noEmit: true,
          skipLibCheck: false,
          types: [],
        },
        files: ['esm.mts', 'cjs.cts'],
      },
      null,
      2,
    ),
    'ts/tsconfig.bundler.json': JSON.stringify(
      {
        compilerOptions: {
          module: 'esnext',
          moduleResolution: 'bundler',
          target: 'es2022',
          strict: true,
          noEmit: true,
          skipLibCheck: false,
          types: [],
        },
        files: ['bundler.ts'],
      },
      null,
      2,
    ),
    'ts/tsconfig.node10.json': JSON.stringify(
      {
        compilerOptions: {
          module: 'commonjs',
          moduleResolution: 'node10',
          target: 'es2022',
          strict: true,
          noEmit: true,
          skipLibCheck: false,
          esModuleInterop: true,
          types: [],
          ignoreDeprecations: '5.0',
        },
        files: ['bundler.ts'],
      },
      null,
      2,
    ),
  });

  console.log('test:package: loading the installed package');
  for (const file of ['esm-named.mjs', 'esm-dynamic.mjs', 'cjs.cjs']) {
    check(`node ${file}`, () => {
      const out = run(process.execPath, [file], app);
      if (out.trim() !== 'ok') throw new Error(`printed ${JSON.stringify(out)}`);
    });
  }
  const tsc = join(root, 'node_modules', 'typescript', 'bin', 'tsc');
  for (const config of ['node16', 'nodenext', 'bundler', 'node10']) {
    check(`tsc -p tsconfig.${config}.json (strict, skipLibCheck off)`, () =>
      run(process.execPath, [tsc, '-p', `tsconfig.${config}.json`], join(app, 'ts')),
    );
  }
  check('the installed package.json has sideEffects: false and the five entries', () => {
    const installed = JSON.parse(
      readFileSync(join(app, 'node_modules', 'quadspread', 'package.json'), 'utf8'),
    );
    if (installed.sideEffects !== false) throw new Error('sideEffects is not false');
    for (const e of ['.', './rational', './decimal', './float', './io'])
      if (!installed.exports[e]) throw new Error(`no export ${e}`);
    if (installed.version !== pkg.version) throw new Error('version');
  });
} catch (e) {
  failed++;
  console.log(String(e.stdout ?? '') + String(e.stderr ?? '') + String(e.stack ?? e));
} finally {
  if (!keep) rmSync(work, { recursive: true, force: true });
  else console.log(`kept ${work}`);
}
console.log(
  `\ntest:package: ${passed} passed, ${failed} failed (${((Date.now() - started) / 1000).toFixed(1)} s)`,
);
process.exit(failed > 0 ? 1 : 0);
