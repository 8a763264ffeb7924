#!/usr/bin/env node
// Streams a CSV point file of 1 000 000 rows (or --rows N) through streamPointsFromCsv of the
// built quadspread/io (`npm run build` first) in a process whose heap is limited to 64 MB, and
// prints the rows read, the peak heap used and the throughput: the reader's memory is bounded
// by the longest record, not by the file (the points are counted and dropped, as a consumer
// writing them on would). Not a timed test: run it by hand, `node bench/io-csv-stream.mjs`.
// The rows come from a generator (no file on disk), in chunks of 64 KiB, with quoted names
// (some with a line break inside) and CRLF line ends.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const rows = Number(args[args.indexOf('--rows') + 1] || 1_000_000) || 1_000_000;
const HEAP_MB = 64;

if (!args.includes('--child')) {
  const entry = path.join(root, 'dist', 'esm', 'io', 'index.js');
  if (!existsSync(entry)) {
    console.error('io-csv-stream: run `npm run build` first');
    process.exit(1);
  }
  const r = spawnSync(
    process.execPath,
    [
      `--max-old-space-size=${HEAP_MB}`,
      fileURLToPath(import.meta.url),
      '--child',
      '--rows',
      String(rows),
    ],
    { stdio: 'inherit' },
  );
  process.exit(r.status ?? 1);
}

const { streamPointsFromCsv } = await import(path.join(root, 'dist', 'esm', 'io', 'index.js'));
const { float } = await import(path.join(root, 'dist', 'esm', 'index.js'));

async function* source() {
  let chunk = 'name,east,north,height,code\r\n';
  for (let i = 0; i < rows; i++) {
    const name = i % 1000 === 0 ? `"P ${i}\nline two, ""quoted"""` : `P${i}`;
    chunk += `${name},${(400000 + i * 0.001).toFixed(3)},${(5000000 + i * 0.002).toFixed(3)},${(i % 500) / 10},CP\r\n`;
    if (chunk.length >= 65536) {
      yield chunk;
      chunk = '';
    }
  }
  if (chunk) yield chunk;
}

let n = 0;
let peak = 0;
let sumE = 0;
const t0 = process.hrtime.bigint();
for await (const p of streamPointsFromCsv(float, source())) {
  n++;
  sumE += p.x;
  if ((n & 0x3fff) === 0) peak = Math.max(peak, process.memoryUsage().heapUsed);
}
const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
peak = Math.max(peak, process.memoryUsage().heapUsed);
const expected = 400000 * rows + (0.001 * rows * (rows - 1)) / 2;
console.log(`io-csv-stream: ${n} rows read (${rows} written); heap limit ${HEAP_MB} MB`);
console.log(`io-csv-stream: peak heap used ${(peak / 2 ** 20).toFixed(1)} MB`);
console.log(
  `io-csv-stream: ${Math.round(n / seconds)} rows/s (${seconds.toFixed(1)} s; load-dependent, information only)`,
);
if (n !== rows || Math.abs(sumE - expected) > 1e-6 * expected) {
  console.error(`io-csv-stream: wrong result (sum of eastings ${sumE}, expected ${expected})`);
  process.exit(1);
}
