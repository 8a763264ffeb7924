#!/usr/bin/env node
// The batch command against a hand-written Node script (bench/batch/hand-inverses.mjs) that
// writes the same bytes: `node bench/batch.mjs [--rows N] [--rounds R] [--cli dist/cli.js]`.
// Needs the built command (`npm run build`). Each round runs, in turn (the order rotating), the
// hand-written script, `quadspread batch inverses --workers 1` and the same with one worker per
// core, each as its own process on the same generated CSV; the outputs are compared byte for
// byte. It reports the CPU time of each process (user + system of every thread, read at exit),
// its wall time, the machine's load (/proc/loadavg) before and after, and the lines
//   ratio batch-cpu-vs-hand <CPU of --workers 1 / CPU of the script, median of per-round ratios>
//   ratio batch-pool-cpu-vs-hand <the same with the worker pool>
//   ratio batch-speedup <wall time of --workers 1 / wall time with the pool>
// CPU time counts the work done whatever else runs on the machine; wall time does not, so the
// speed-up is only meaningful on an idle machine (the load is printed beside it).
import { spawnSync } from 'node:child_process';
import {
  existsSync,
  mkdtempSync,
  openSync,
  closeSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { median } from './harness.mjs';
import { rng } from './data.mjs';

const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const at = args.indexOf(name);
  return at >= 0 ? args[at + 1] : dflt;
};
const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..');
const rows = Number(opt('--rows', 400000));
const rounds = Number(opt('--rounds', 5));
const cli = path.resolve(opt('--cli', path.join(root, 'dist', 'cli.js')));
if (!existsSync(cli)) {
  console.error(`bench/batch: ${cli} is missing: run \`npm run build\` first`);
  process.exit(2);
}
const cores = availableParallelism();
const dir = mkdtempSync(path.join(tmpdir(), 'quadspread-batch-bench-'));
const input = path.join(dir, 'pairs.csv');
const cpuHook = path.join(here, 'batch', 'cpu-at-exit.mjs');

// Pairs of points with millimetre coordinates in a 100 km square, one in 2000 coincident.
const rand = rng(16);
const mm = () => (Math.floor(rand() * 1e8) / 1000).toFixed(3);
let text = 'name,east1,north1,east2,north2\n';
for (let i = 0; i < rows; i++) {
  const p = [mm(), mm()];
  const q = i % 2000 === 0 ? p : [mm(), mm()];
  text += `P${i},${p[0]},${p[1]},${q[0]},${q[1]}\n`;
}
writeFileSync(input, text);
text = '';

const sides = {
  hand: [path.join(here, 'batch', 'hand-inverses.mjs'), input],
  one: [cli, 'batch', 'inverses', input, '--workers', '1'],
  pool: [cli, 'batch', 'inverses', input, '--workers', String(cores)],
};

function run(name) {
  const out = path.join(dir, `${name}.csv`);
  const fd = openSync(out, 'w');
  const t0 = process.hrtime.bigint();
  const r = spawnSync(process.execPath, ['--import', cpuHook, ...sides[name]], {
    stdio: ['ignore', fd, 'pipe'],
    encoding: 'utf8',
  });
  const wall = Number(process.hrtime.bigint() - t0) / 1e6;
  closeSync(fd);
  if (r.status !== 0) throw new Error(`${name} failed (${r.status}): ${r.stderr}`);
  const cpu = Number([...r.stderr.matchAll(/cpu-us (\d+)/g)].at(-1)?.[1]) / 1000;
  return { wall, cpu, out };
}

const load0 = loadavg();
const seen = { hand: [], one: [], pool: [] };
const ratios = { cpu: [], poolCpu: [], speedup: [] };
const order = ['hand', 'one', 'pool'];
for (let k = 0; k < rounds; k++) {
  const got = {};
  for (let j = 0; j < 3; j++) {
    const name = order[(j + k) % 3];
    got[name] = run(name);
    seen[name].push(got[name]);
  }
  const hand = readFileSync(got.hand.out);
  for (const name of ['one', 'pool'])
    if (!hand.equals(readFileSync(got[name].out)))
      throw new Error(
        `round ${k + 1}: ${name} did not write the same bytes as the hand-written script`,
      );
  ratios.cpu.push(got.one.cpu / got.hand.cpu);
  ratios.poolCpu.push(got.pool.cpu / got.hand.cpu);
  ratios.speedup.push(got.one.wall / got.pool.wall);
}
const load1 = loadavg();
rmSync(dir, { recursive: true, force: true });

const f = (x) => x.toFixed(0).padStart(7);
console.log(
  `batch inverses, ${rows} rows, ${rounds} rounds; ${cores} cores; Node ${process.version}; ` +
    `load ${load0.map((l) => l.toFixed(2)).join(' ')} before, ${load1.map((l) => l.toFixed(2)).join(' ')} after`,
);
console.log('side       CPU ms (median)   wall ms (median)   CPU µs/row');
for (const name of order) {
  const cpu = median(seen[name].map((s) => s.cpu));
  const wall = median(seen[name].map((s) => s.wall));
  console.log(
    `${name.padEnd(10)} ${f(cpu)}           ${f(wall)}            ${((cpu * 1000) / rows).toFixed(2)}`,
  );
}
console.log('outputs: identical bytes in every round');
console.log(`ratio batch-cpu-vs-hand ${median(ratios.cpu).toFixed(2)}`);
console.log(`ratio batch-pool-cpu-vs-hand ${median(ratios.poolCpu).toFixed(2)}`);
console.log(`ratio batch-speedup ${median(ratios.speedup).toFixed(2)}`);
