#!/usr/bin/env node
// quadspread benchmarks: `npm run bench` (full) or `npm run bench -- --quick` (< 60 s).
// Runs against the BUILT package (dist/; `npm run build` first) and prints, per workload, our
// time against hand-written float code, plain fraction.js and plain big.js formulas, then the
// headline lines `ratio float-vs-hand <x>`, `ratio naive-fraction-vs-rational <x>`,
// `ratio naive-big-vs-decimal <x>`. Every ratio is the median of interleaved repeated
// measurements, taken after every arithmetic has been through the same generic functions.
// Options: --quick, --json <file> (write the results), --only <workload>, --forks <n> (the
// number of processes that measure, one after another; default 3).
//
// Forks: how V8 compiles a workload differs from one process to the next (which calls it
// inlines, where it allocates), and a few workloads measure in two modes accordingly (the
// heights through quadspread/float once at 1.9 where two other processes gave 1.0–1.2). Each
// fork is a whole run in a process of its own; every figure reported is the median over the
// forks, and a pair whose forks disagree by more than 25 % is named (`spread` lines).
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import os from 'node:os';
import Fraction from 'fraction.js';
import BigJs from 'big.js';
import DecimalJsLib from 'decimal.js';
import { ratio, keep, setClock, clockName } from './harness.mjs';
import { combine, report } from './report.mjs';
import * as triangle from './workloads/triangle.mjs';
import * as heights from './workloads/heights.mjs';
import * as traverse from './workloads/traverse.mjs';
import * as traverse20 from './workloads/traverse-exact.mjs';
import * as bearings from './workloads/traverse-bearings.mjs';
import * as budget from './workloads/budget.mjs';
import * as geodesy from './workloads/geodesy.mjs';
import * as roundtrip from './workloads/roundtrip.mjs';
import * as sideshots from './workloads/side-shots.mjs';
import * as projection from './workloads/projection.mjs';
import * as geodesic from './workloads/geodesic.mjs';
import * as alignment from './workloads/alignment.mjs';
import * as network from './workloads/network.mjs';
import * as levelling from './workloads/levelling.mjs';

const args = process.argv.slice(2);
const quick = args.includes('--quick');
const jsonAt = args.indexOf('--json');
const jsonFile = jsonAt >= 0 ? args[jsonAt + 1] : undefined;
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? args[onlyAt + 1] : undefined;
const forksAt = args.indexOf('--forks');
const forks = forksAt >= 0 ? Number(args[forksAt + 1]) : 3;
if (!(Number.isInteger(forks) && forks >= 1)) {
  console.error(`bench: --forks needs a whole number of processes, at least 1`);
  process.exit(2);
}
// A fork started by this script: it measures and writes its rows, the parent reports.
const isFork = args.includes('--fork');
// CPU time of this process by default (a loaded machine's waiting is not counted); --wall for
// elapsed time.
setClock(args.includes('--wall') ? 'wall' : 'cpu');

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
// The built package, loaded by its own name through package.json "exports" (a package may
// import itself), exactly as an integrator's ESM code would: quadspread, quadspread/float, ….
if (!existsSync(path.join(root, 'dist'))) {
  console.error('bench: dist/ is missing: run `npm run build` first');
  process.exit(2);
}
if (!isFork && forks > 1) {
  // The parent: runs the forks one after another (never side by side: they would share the
  // cores), each writing its rows as JSON, and reports the medians.
  const dir = mkdtempSync(path.join(os.tmpdir(), 'quadspread-bench-'));
  const runs = [];
  const childArgs = args.filter(
    (a, i) => !['--json', '--forks'].includes(a) && !['--json', '--forks'].includes(args[i - 1]),
  );
  let failed;
  try {
    for (let k = 0; k < forks; k++) {
      console.log(`fork ${k + 1} of ${forks}`);
      const file = path.join(dir, `fork-${k}.json`);
      const r = spawnSync(
        process.execPath,
        [fileURLToPath(import.meta.url), ...childArgs, '--fork', '--json', file],
        { stdio: ['ignore', 'inherit', 'inherit'] },
      );
      if (r.status !== 0) {
        failed = `fork ${k + 1} failed (${r.error ? r.error.message : `exit ${r.status ?? r.signal}`})`;
        break;
      }
      runs.push(JSON.parse(readFileSync(file, 'utf8')));
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  if (failed) {
    console.error(`bench: ${failed}`);
    process.exit(1);
  }
  report(combine(runs), jsonFile);
  process.exit(0);
}
if (isFork && !jsonFile) {
  console.error('bench: --fork is for the processes this script starts (it needs --json <file>)');
  process.exit(2);
}

const g = await import('quadspread');
const F = await import('quadspread/float');
const R = await import('quadspread/rational');
const D = await import('quadspread/decimal');
// Plain big.js as a user would set it up: division to 34 decimal places, ties to even.
const Big = BigJs();
Big.DP = 34;
Big.RM = 2;
// Plain decimal.js, the faster of the two decimal libraries, as the second peer: every operation
// to 34 significant digits, ties to even (decimal128's precision).
const DecimalJs = DecimalJsLib.clone({ precision: 34, rounding: DecimalJsLib.ROUND_HALF_EVEN });
const lib = { g, F, R, D, Fraction, Big, DecimalJs };

// Short batches, many pairs: on a loaded machine a short batch is less often interrupted, and
// the median of many adjacent pairs discards the interrupted ones.
const settings = quick
  ? { reps: 15, targetMs: 3, n: 300, growthN: 100 }
  : { reps: 61, targetMs: 5, n: 1000, growthN: 400 };
const t0 = Date.now();

// Every arithmetic an integrator's process may use, run through the same generic functions
// before anything is measured.
const arithmetics = [g.float, g.rational, g.decimal(34), g.decimal(20)];
if (g.uncertain) arithmetics.push(g.uncertain(g.float), g.uncertain(g.rational));

const workloads = [
  triangle,
  heights,
  traverse,
  traverse20,
  bearings,
  budget,
  geodesy,
  roundtrip,
  sideshots,
  projection,
  geodesic,
  alignment,
  network,
  levelling,
].filter((w) => !only || w.name === only);
const built = [];
for (const w of workloads) {
  const why = w.unavailable?.(lib);
  if (why) {
    console.log(`skip ${w.name}: ${why}`);
    continue;
  }
  const b = w.build(lib, w.makeCases(settings.n));
  b.pollute(arithmetics);
  built.push([w, b]);
}
// A second pollution round after all workloads are built (the same functions, every arithmetic).
for (const [, b] of built) b.pollute(arithmetics);

const rows = [];
const fmt = (x) =>
  x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x >= 1 ? x.toFixed(2) : x.toFixed(3);
function row(kind, workload, pair, ours, base, m, higherIsBetter) {
  const r = {
    kind,
    workload,
    pair,
    ours,
    base,
    oursUs: m.aUs,
    baseUs: m.bUs,
    ratio: higherIsBetter ? 1 / m.ratio : m.ratio,
    higherIsBetter,
  };
  rows.push(r);
  // A contradiction: the ratio of the per-side medians disagrees with the median of the
  // per-pair ratios by more than 25 % (the load changed during the pairs): said, not hidden.
  const sides = m.aUs / m.bUs;
  r.contradiction = Math.abs(Math.log(sides / m.ratio)) > Math.log(1.25);
  if (r.contradiction)
    console.log(
      `contradiction ${workload} ${pair}: per-side medians give ${(higherIsBetter ? 1 / sides : sides).toFixed(2)}, per-pair ratios ${r.ratio.toFixed(2)} (the load changed while measuring)`,
    );
  console.log(
    `${workload.padEnd(10)} ${pair.padEnd(26)} ${fmt(m.aUs).padStart(9)} µs ${fmt(m.bUs).padStart(9)} µs  ratio ${r.ratio.toFixed(2)}`,
  );
  return r;
}

console.log(
  `quadspread bench (${quick ? 'quick' : 'full'}): node ${process.version}, ${os.cpus().length} cpus, ${os.cpus()[0]?.model ?? '?'}`,
);
const loadAtStart = os.loadavg()[0];
console.log(
  `each ratio: median of ${settings.reps} interleaved pairs of batches of >= ${settings.targetMs} ms of ${clockName() === 'cpu' ? 'CPU time (process.cpuUsage)' : 'elapsed time'}; load average ${loadAtStart.toFixed(2)} at the start`,
);
console.log(
  `${'workload'.padEnd(10)} ${'pair (ours vs baseline)'.padEnd(26)} ${'ours/item'.padStart(12)} ${'base/item'.padStart(12)}`,
);
for (const [w, b] of built) {
  // A workload whose items are large (a 1000-course traverse) may ask for fewer pairs, and one
  // that allocates much per item for longer batches (`batchScale`), so that each batch spans
  // several young-generation collections: with batches of a few items, whichever side a
  // collection fell in paid for it, and the same side measured 50 or 90–500 µs per item from
  // one process to the next.
  const o = {
    items: b.items,
    reps: Math.max(7, Math.round(settings.reps * (w.repsScale ?? 1))) | 1,
    targetMs: settings.targetMs * (w.batchScale ?? 1),
  };
  if (b.float)
    row(
      'float',
      w.name,
      `float vs ${w.baseline ?? 'hand-written'}`,
      'float',
      'hand',
      ratio(b.float.ours, b.float.hand, o),
      false,
    );
  if (b.floatGeneric)
    row(
      'generic',
      w.name,
      '(generic entry, float)',
      'generic',
      'hand',
      ratio(b.floatGeneric.ours, b.floatGeneric.hand, o),
      false,
    );
  if (b.rational)
    row(
      'fraction',
      w.name,
      'fraction.js vs rational',
      'rational',
      'fraction.js',
      ratio(b.rational.ours, b.rational.naive, o),
      true,
    );
  if (b.decimalJs)
    row(
      'decimalJs',
      w.name,
      'decimal.js vs decimal(34)',
      'decimal',
      'decimal.js',
      ratio(b.decimalJs.ours, b.decimalJs.naive, o),
      true,
    );
  for (const line of b.info ?? []) console.log(line);
  // Other pairs a workload defines (lower is better), e.g. exact work with and without roots.
  for (const x of b.extra ?? [])
    row('extra', w.name, x.pair, 'ours', 'base', ratio(x.ours, x.base, o), false).line =
      `${w.name}-${x.line}`;
  if (b.decimal)
    row(
      'big',
      w.name,
      'big.js vs decimal(34)',
      'decimal',
      'big.js',
      ratio(b.decimal.ours, b.decimal.naive, o),
      true,
    );
}

// Rational cost growth over the inputs' significant digits, against the bare BigInt work.
const growth = [];
if (!only || only === 'triangle') {
  const base = triangle.buildGrowth(lib, 2, settings.growthN);
  console.log('rational cost growth (triangle), time at k digits / time at 2 digits:');
  for (const k of [4, 8, 16]) {
    const gk = triangle.buildGrowth(lib, k, settings.growthN);
    const o = { items: settings.growthN, reps: settings.reps, targetMs: settings.targetMs };
    const ours = ratio(gk.ours, base.ours, o);
    const floor = ratio(gk.floor, base.floor, o);
    const naive = ratio(gk.naive, base.naive, o);
    growth.push({
      digits: k,
      rational: ours.ratio,
      bigint: floor.ratio,
      fraction: naive.ratio,
      rationalUs: ours.aUs,
      bigintUs: floor.aUs,
      fractionUs: naive.aUs,
    });
    console.log(
      `growth    ${String(k).padStart(2)} digits: rational ×${ours.ratio.toFixed(2)} (${fmt(ours.aUs)} µs), bare BigInt ×${floor.ratio.toFixed(2)} (${fmt(floor.aUs)} µs), plain fraction.js ×${naive.ratio.toFixed(2)} (${fmt(naive.aUs)} µs)`,
    );
  }
  console.log(
    `growth    at 2 digits: rational ${fmt(base.ours && ratio(base.ours, base.floor, { items: settings.growthN, reps: 3, targetMs: settings.targetMs }).ratio)}× the bare BigInt work`,
  );
}

const meta = {
  quick,
  node: process.version,
  cpus: os.cpus().length,
  cpu: os.cpus()[0]?.model,
  settings,
  clock: clockName(),
  load: [loadAtStart, os.loadavg()[0]],
  elapsed: (Date.now() - t0) / 1000,
  checksum: keep() % 10,
};
if (isFork) writeFileSync(jsonFile, JSON.stringify({ meta, rows, growth }));
else report({ meta, rows, growth, forks: 1 }, jsonFile);
