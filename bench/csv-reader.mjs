#!/usr/bin/env node
// The batch command's CSV line reader (src/cli/csv.ts, splitCsvLine) against csv-parse (the
// io entry's parser) on batch-shaped input: `node bench/csv-reader.mjs [--rows N] [--rounds R]`.
// Both read the same generated text (a header and N rows of a name and four coordinates, one
// name in ten quoted with a comma inside) into arrays of fields; the results are compared
// field by field first. Rounds alternate which side runs first; the line printed is
//   ratio csv-parse-vs-batch-reader <median over rounds of csv-parse time / our time>
// Not a timed test: run it by hand. It bundles src/cli/csv.ts with esbuild (a devDependency).
import { build } from 'esbuild';
import { parse } from 'csv-parse/sync';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : dflt;
};
const rows = opt('--rows', 200_000);
const rounds = opt('--rounds', 11);

const out = await build({
  entryPoints: [path.join(root, 'src/cli/csv.ts')],
  bundle: true,
  format: 'esm',
  platform: 'node',
  write: false,
});
const { splitCsvLine } = await import(
  `data:text/javascript;base64,${Buffer.from(out.outputFiles[0].text).toString('base64')}`
);

const lines = ['name,x1,y1,x2,y2'];
for (let i = 0; i < rows; i++) {
  const name = i % 10 === 0 ? `"P${i}, north wall"` : `P${i}`;
  lines.push(
    `${name},${(1000 + i * 0.001).toFixed(3)},${(2000 - i * 0.002).toFixed(3)},${(1500.5 + (i % 977)).toFixed(2)},${(2500.25 - (i % 613)).toFixed(2)}`,
  );
}
const text = lines.join('\n') + '\n';

const ours = () => {
  const res = [];
  for (const line of text.split('\n')) if (line !== '') res.push(splitCsvLine(line));
  return res;
};
const theirs = () => parse(text, { relax_column_count: false, skip_empty_lines: true });

const a = ours();
const b = theirs();
if (a.length !== b.length) throw new Error(`record counts differ: ${a.length} vs ${b.length}`);
for (let i = 0; i < a.length; i++)
  if (a[i].join('\u0000') !== b[i].join('\u0000'))
    throw new Error(`record ${i} differs: ${JSON.stringify(a[i])} vs ${JSON.stringify(b[i])}`);

const time = (f) => {
  const t0 = performance.now();
  f();
  return performance.now() - t0;
};
const ratios = [];
let tOurs = 0;
let tTheirs = 0;
for (let r = 0; r < rounds; r++) {
  let x;
  let y;
  if (r % 2 === 0) {
    x = time(ours);
    y = time(theirs);
  } else {
    y = time(theirs);
    x = time(ours);
  }
  tOurs += x;
  tTheirs += y;
  ratios.push(y / x);
}
ratios.sort((p, q) => p - q);
const median = ratios[Math.floor(ratios.length / 2)];
console.log(
  `csv-reader: ${rows} rows, ${rounds} rounds; batch reader ${(tOurs / rounds).toFixed(1)} ms, csv-parse ${(tTheirs / rounds).toFixed(1)} ms per pass (means); same fields in every record`,
);
console.log(`ratio csv-parse-vs-batch-reader ${median.toFixed(2)}`);
