// The report of a bench run (bench/run.mjs): the summary lines and the JSON file, from the rows
// of one process, or from the rows of several forks combined by their medians.
import { writeFileSync } from 'node:fs';
import { median } from './harness.mjs';

/** A pair whose forks' ratios differ by more than this factor is named (`spread` lines). */
const SPREAD = 1.25;

/**
 * The runs of several forks as one: each pair's ratio and per-item times are the medians over
 * the forks that measured it (taken separately: ours / base need not equal the ratio);
 * `forkRatios` keeps each fork's ratio, `spread` says whether the largest is more than
 * {@link SPREAD} times the smallest.
 */
export function combine(runs) {
  const keyOf = (r) => `${r.workload}\u0000${r.pair}`;
  // Every pair in the order the first process measured it (then any the others added), each
  // fork's ratio in the order of the forks (null where a fork did not measure the pair).
  const keys = [];
  for (const run of runs)
    for (const r of run.rows) if (!keys.includes(keyOf(r))) keys.push(keyOf(r));
  const rows = keys.map((key) => {
    const each = runs.map((run) => run.rows.find((r) => keyOf(r) === key));
    const list = each.filter(Boolean);
    const ratios = list.map((r) => r.ratio);
    const hi = Math.max(...ratios);
    const lo = Math.min(...ratios);
    return {
      ...list[0],
      ratio: median(ratios),
      oursUs: median(list.map((r) => r.oursUs)),
      baseUs: median(list.map((r) => r.baseUs)),
      contradiction: list.some((r) => r.contradiction),
      forkRatios: each.map((r) => (r ? r.ratio : null)),
      spread: hi > SPREAD * lo,
    };
  });
  const growth = runs[0].growth.map((g0) => {
    const at = runs.map((run) => run.growth.find((g) => g.digits === g0.digits)).filter(Boolean);
    const out = { digits: g0.digits };
    for (const k of Object.keys(g0)) if (k !== 'digits') out[k] = median(at.map((g) => g[k]));
    return out;
  });
  const meta = {
    ...runs[0].meta,
    load: [runs[0].meta.load[0], runs.at(-1).meta.load[1]],
    elapsed: runs.reduce((t, run) => t + run.meta.elapsed, 0),
    checksum: runs.reduce((t, run) => t + run.meta.checksum, 0) % 10,
  };
  return { meta, rows, growth, forks: runs.length };
}

const show = (x) => (x === null ? '–' : x.toFixed(2));

/** Prints the summary lines of a run (one process or forks combined) and writes its JSON. */
export function report({ meta, rows, growth, forks }, jsonFile) {
  const of = (kind) => rows.filter((r) => r.kind === kind);
  const float = of('float'),
    generic = of('generic'),
    fraction = of('fraction'),
    big = of('big'),
    decimalJs = of('decimalJs'),
    extra = of('extra');
  if (forks > 1) {
    console.log(`medians over ${forks} forks (each figure: the median of the forks' figures):`);
    for (const r of rows)
      console.log(
        `${r.workload.padEnd(10)} ${r.pair.padEnd(26)} ratio ${r.ratio.toFixed(2)}  (forks: ${r.forkRatios.map(show).join(', ')})`,
      );
    for (const r of rows.filter((x) => x.spread))
      console.log(
        `spread ${r.workload} ${r.pair}: the forks measured ${r.forkRatios.map(show).join(', ')} (more than ${SPREAD}× apart: the process's compiled state, not the load)`,
      );
  }
  // Headline: the triangle workload (a), the one measured before any code existed
  // (docs/design.md); the other workloads' ratios are printed above and tabled in
  // docs/performance.md.
  const pick = (list) => (list.find((r) => r.workload === 'triangle') ?? list[0])?.ratio;
  const hf = pick(float),
    hr = pick(fraction),
    hb = pick(big);
  console.log(`ratio float-vs-hand ${hf?.toFixed(2) ?? 'n/a'}`);
  console.log(`ratio naive-fraction-vs-rational ${hr?.toFixed(2) ?? 'n/a'}`);
  console.log(`ratio naive-big-vs-decimal ${hb?.toFixed(2) ?? 'n/a'}`);
  // One line per workload: `ratio <workload> <float time / hand-written float time>`, the goal
  // figure of every workload; then the same through the generic entry, and the worst of each.
  for (const r of float) console.log(`ratio ${r.workload} ${r.ratio.toFixed(2)}`);
  for (const r of generic) console.log(`ratio ${r.workload}-generic ${r.ratio.toFixed(2)}`);
  for (const r of decimalJs)
    console.log(`ratio ${r.workload}-decimal.js-vs-decimal ${r.ratio.toFixed(2)}`);
  for (const r of fraction)
    console.log(`ratio ${r.workload}-fraction.js-vs-rational ${r.ratio.toFixed(2)}`);
  for (const r of extra) console.log(`ratio ${r.line} ${r.ratio.toFixed(2)}`);
  const worstOf = (list, f) =>
    list.length ? list.reduce((a, r) => (f(r.ratio, a.ratio) ? r : a)) : undefined;
  const worst = {
    float: worstOf(float, (x, y) => x > y),
    generic: worstOf(generic, (x, y) => x > y),
    fraction: worstOf(fraction, (x, y) => x < y),
    big: worstOf(big, (x, y) => x < y),
    decimalJs: worstOf(decimalJs, (x, y) => x < y),
  };
  if (worst.float)
    console.log(`ratio worst ${worst.float.ratio.toFixed(2)} (${worst.float.workload})`);
  if (worst.generic)
    console.log(
      `ratio worst-generic ${worst.generic.ratio.toFixed(2)} (${worst.generic.workload})`,
    );
  const contradictions = rows.filter((r) => r.contradiction).length;
  console.log(`contradictions ${contradictions} of ${rows.length} pairs`);
  if (forks > 1)
    console.log(`spread ${rows.filter((r) => r.spread).length} of ${rows.length} pairs`);
  const w = (r) => (r ? `${r.ratio.toFixed(2)} (${r.workload})` : 'n/a');
  console.log(
    `worst over workloads: float-vs-hand ${w(worst.float)}, naive-fraction-vs-rational ${w(worst.fraction)}, naive-big-vs-decimal ${w(worst.big)}, decimal.js-vs-decimal ${w(worst.decimalJs)}`,
  );
  console.log(
    `elapsed ${meta.elapsed.toFixed(1)} s${forks > 1 ? ` in ${forks} forks` : ''}, load average ${meta.load[0].toFixed(2)} at the start and ${meta.load[1].toFixed(2)} at the end (checksum ${meta.checksum})`,
  );
  if (jsonFile) {
    writeFileSync(
      jsonFile,
      JSON.stringify(
        {
          ...meta,
          forks,
          rows,
          growth,
          headline: { floatVsHand: hf, naiveFractionVsRational: hr, naiveBigVsDecimal: hb },
          worst,
        },
        null,
        2,
      ),
    );
  }
}
