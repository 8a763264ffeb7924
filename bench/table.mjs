#!/usr/bin/env node
// Renders the JSON written by `npm run bench -- --json <file>` as the Markdown tables of
// docs/performance.md: node bench/table.mjs <file>
import { readFileSync } from 'node:fs';

const r = JSON.parse(readFileSync(process.argv[2], 'utf8'));
const f = (x) =>
  x === undefined || x === null
    ? 'n/a'
    : x >= 100
      ? x.toFixed(0)
      : x >= 10
        ? x.toFixed(1)
        : x >= 1
          ? x.toFixed(2)
          : x.toFixed(3);
const goal = {
  'float vs hand-written': (x) => (x <= 1.3 ? 'yes' : 'no'),
  'fraction.js vs rational': (x) => (x >= 3 ? 'yes' : 'no'),
  'big.js vs decimal(34)': (x) => (x >= 2 ? 'yes' : 'no'),
};
const out = [];
out.push(
  `${r.quick ? 'Quick' : 'Full'} run${r.forks > 1 ? ` in ${r.forks} processes (each figure the median of theirs)` : ''}: median of ${r.settings.reps} interleaved pairs per ratio (fewer for the workloads whose items are large), ${r.settings.targetMs} ms batches (8× as long for the two 1000-course traverses); Node ${r.node}, ${r.cpus} cpus, ${r.cpu}.`,
);
out.push('');
const forks = r.forks > 1;
out.push(
  `| workload | ours vs baseline | ours / item | baseline / item | ratio |${forks ? ' each process |' : ''} goal met |`,
);
out.push(`|---|---|---:|---:|---:|${forks ? '---|' : ''}---|`);
for (const row of r.rows) {
  const g = goal[row.pair];
  const each = forks
    ? ` ${row.forkRatios.map((x) => (x === null ? '–' : x.toFixed(2))).join(', ')} |`
    : '';
  out.push(
    `| ${row.workload} | ${row.pair} | ${f(row.oursUs)} µs | ${f(row.baseUs)} µs | ${row.ratio.toFixed(2)} |${each} ${g ? g(row.ratio) : '(for reference)'} |`,
  );
}
out.push('');
out.push(
  'Ratios: for float, our time / hand-written time (lower is better, goal ≤ 1.3); for rational and decimal, the plain library\'s time / ours (higher is better, goals ≥ 3 and ≥ 2). "(generic entry, float)" is `triangle(float, …)` etc. through the generic `quadspread` entry in the same polluted process, for reference.',
);
out.push('');
out.push(
  'Rational cost growth, triangle workload, time at k significant digits over time at 2 digits:',
);
out.push('');
out.push(
  '| digits | rational triangle | growth | bare BigInt products | growth | plain fraction.js | growth |',
);
out.push('|---:|---:|---:|---:|---:|---:|---:|');
for (const g of r.growth)
  out.push(
    `| ${g.digits} | ${f(g.rationalUs)} µs | ×${g.rational.toFixed(2)} | ${f(g.bigintUs)} µs | ×${g.bigint.toFixed(2)} | ${g.fractionUs === undefined ? 'n/a' : `${f(g.fractionUs)} µs`} | ${g.fraction === undefined ? 'n/a' : `×${g.fraction.toFixed(2)}`} |`,
  );
out.push('');
out.push(
  `Headline (triangles): \`ratio float-vs-hand ${r.headline.floatVsHand?.toFixed(2)}\`, \`ratio naive-fraction-vs-rational ${r.headline.naiveFractionVsRational?.toFixed(2)}\`, \`ratio naive-big-vs-decimal ${r.headline.naiveBigVsDecimal?.toFixed(2)}\`.`,
);
console.log(out.join('\n'));
