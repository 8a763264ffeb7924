// Minimal benchmark harness: medians of ratios measured side by side, interleaved.
//
// Other people load this machine while we run, so absolute times wander; a ratio of two
// batches run back to back (order alternating) cancels most of that. Each pair is measured
// `reps` times and the median ratio is reported, with the median time per item of each side.
import { performance } from 'node:perf_hooks';

// The clock: the process's CPU time (user + system, process.cpuUsage) by default, so that the
// time this process spends waiting for a core on a loaded machine is not counted; `wall`
// (performance.now) on request. Either way both sides of a ratio use the same clock.
let clock = 'cpu';
/** Chooses the clock: 'cpu' (default) or 'wall'. */
export function setClock(kind) {
  if (kind !== 'cpu' && kind !== 'wall') throw new Error(`bench: unknown clock ${kind}`);
  clock = kind;
}
export function clockName() {
  return clock;
}
function now() {
  if (clock === 'wall') return performance.now();
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/** Runs fn() `times` times, returns elapsed ms (and keeps the results alive in `sink`). */
let sink = 0;
function timeIt(fn, times) {
  const t0 = now();
  // Sides made by loop1/loop3 take the repeat count themselves (their own loop, their own
  // feedback); any other function is called `times` times.
  if (fn.selfTimed) sink += fn(times);
  else for (let i = 0; i < times; i++) sink += fn() ? 1 : 0;
  return now() - t0;
}

/** A repeat count for warm-up batches of about 2·targetMs (at most 50). */
function warmCount(fn, targetMs) {
  const t = timeIt(fn, 1);
  return Math.max(1, Math.min(50, Math.round((2 * targetMs) / Math.max(t, 1e-3))));
}

/** How many repetitions of fn make one batch of at least `targetMs`. */
function calibrate(fn, targetMs) {
  let times = 1;
  for (;;) {
    const t = timeIt(fn, times);
    if (t >= targetMs || times > 1 << 24)
      return Math.max(1, Math.ceil((times * targetMs) / Math.max(t, 1e-3)));
    times *= t < targetMs / 16 ? 8 : 2;
  }
}

export function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Measures a / b: `a` and `b` run one batch of `items` items each and return something truthy
 * or falsy (a checksum, so that the work cannot be dropped).
 * @returns {{ ratio: number, aUs: number, bUs: number, ratios: number[] }} median ratio a/b and
 *   median µs per item of each side.
 */
export function ratio(a, b, { items, reps, targetMs }) {
  // Warm both up, then size batches on the slower one.
  // Warm-up: a few substantial batches of each side, alternating, before any sizing. (Sizing
  // from cold, one item-loop at a time, was seen to leave V8 in a worse state for whichever
  // side ran first: ratios then flipped between 0.2 and 7 from one process to the next.)
  const ka = warmCount(a, targetMs),
    kb = warmCount(b, targetMs);
  for (let i = 0; i < 3; i++) {
    timeIt(a, ka);
    timeIt(b, kb);
  }
  const na = calibrate(a, targetMs);
  const nb = calibrate(b, targetMs);
  const ratios = [];
  const ta = [];
  const tb = [];
  for (let r = 0; r < reps; r++) {
    let x, y;
    if (r % 2 === 0) {
      x = timeIt(a, na) / na;
      y = timeIt(b, nb) / nb;
    } else {
      y = timeIt(b, nb) / nb;
      x = timeIt(a, na) / na;
    }
    ratios.push(x / y);
    ta.push(x);
    tb.push(y);
  }
  return {
    ratio: median(ratios),
    aUs: (median(ta) * 1000) / items,
    bUs: (median(tb) * 1000) / items,
    ratios,
  };
}

export function keep() {
  return sink;
}

let loops = 0;
/**
 * A batch loop over `cases` calling f(case[0], case[1], case[2]) and counting key(result).
 * Each loop is compiled from its own source (new Function), so that no two variants share a
 * call site's type feedback — closures made by one factory would (docs/design.md, "Performance"), and would
 * make every variant slow in a different way.
 */
export function loop3(cases, f, key) {
  const body = `// loop ${loops++}
    let acc = 0;
    for (let t = 0; t < times; t++) {
      for (let i = 0; i < P.length; i++) {
        const p = P[i];
        if (key(f(p[0], p[1], p[2]))) acc++;
      }
    }
    return acc;`;
  const run = new Function('P', 'f', 'key', 'times', body);
  const side = (times = 1) => run(cases, f, key, times);
  side.selfTimed = true;
  return side;
}

/** Like loop3, for a one-argument f over a list of inputs. */
export function loop1(inputs, f, key) {
  const body = `// loop ${loops++}
    let acc = 0;
    for (let t = 0; t < times; t++) for (let i = 0; i < P.length; i++) if (key(f(P[i]))) acc++;
    return acc;`;
  const run = new Function('P', 'f', 'key', 'times', body);
  const side = (times = 1) => run(inputs, f, key, times);
  side.selfTimed = true;
  return side;
}
