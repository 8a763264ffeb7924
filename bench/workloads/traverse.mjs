// Workload (c): traverse closure — one loop of 1000 courses given as latitude, departure and
// distance (mm), compass-rule adjustment; the computed end misses the start by a few mm.
import Fraction from 'fraction.js';
import { rng, mm } from '../data.mjs';
import { loop1 } from '../harness.mjs';

export const name = 'traverse';
export const title = '(c) traverse closure, 1000 courses (compass rule)';
const COURSES = 1000;
/** Each item is a whole traverse (tens of ms in the exact arithmetics): a third of the pairs. */
export const repsScale = 1 / 3;
/** Each item allocates ~3000 result objects: batches 8× as long (bench/run.mjs). */
export const batchScale = 8;

export function unavailable(lib) {
  return lib.g.traverse ? undefined : 'traverse() is not in the built package yet';
}

/** `n` traverses (few: each is 1000 courses) as text. */
export function makeCases(n, seed = 3) {
  return loopCases(rng(seed), Math.max(2, Math.min(8, Math.round(n / 100))), COURSES);
}

/**
 * `count` closed loops of `courses` courses as text (mm): headings turn once around; legs
 * 20–300 m; the last course returns to the start with a few millimetres of misclosure; each
 * distance is the rounded length of its latitude and departure.
 */
export function loopCases(rand, count, courses) {
  const out = [];
  for (let t = 0; t < count; t++) {
    const list = [];
    let sx = 0,
      sy = 0;
    for (let i = 0; i < courses; i++) {
      let lat, dep;
      if (i < courses - 1) {
        const a = (2 * Math.PI * i) / courses + (rand() - 0.5) * 0.5;
        const d = 20 + rand() * 280;
        lat = Math.round(d * Math.cos(a) * 1000);
        dep = Math.round(d * Math.sin(a) * 1000);
      } else {
        lat = -sy + Math.round((rand() - 0.5) * 20);
        dep = -sx + Math.round((rand() - 0.5) * 20);
      }
      sy += lat;
      sx += dep;
      const dist = Math.round(Math.hypot(lat, dep)); // measured distance, mm
      list.push({ latitude: mm(lat), departure: mm(dep), distance: mm(dist) });
    }
    out.push({ start: { x: '1000.000', y: '5000.000' }, courses: list });
  }
  return out;
}

// ---- the same computation as src/cogo/traverse.ts, written plainly -----------------------
// Sum the courses; misclosure (east, north) = end − start; linear = √(e² + n²); ratio =
// length/linear; compass rule: correction = −misclosure·(course length/total length).

export function handFloat(inp) {
  const cs = inp.courses,
    n = cs.length;
  let x = inp.start.x,
    y = inp.start.y,
    total = 0;
  const points = new Array(n + 1);
  points[0] = inp.start;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    if (c.distance < 0) throw new Error('distance');
    total += c.distance;
    x += c.departure;
    y += c.latitude;
    points[i + 1] = { x, y };
  }
  const east = x - inp.start.x,
    north = y - inp.start.y;
  const q = east * east + north * north;
  const linear = Math.sqrt(q);
  const ratio = q === 0 ? undefined : total / linear;
  const kLat = -north / total,
    kDep = -east / total;
  const adjusted = new Array(n + 1);
  const legs = new Array(n);
  adjusted[0] = inp.start;
  let ax = inp.start.x,
    ay = inp.start.y;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    const adjLat = c.latitude + kLat * c.distance,
      adjDep = c.departure + kDep * c.distance;
    ax += adjDep;
    ay += adjLat;
    adjusted[i + 1] = { x: ax, y: ay };
    legs[i] = {
      latitude: c.latitude,
      departure: c.departure,
      length: c.distance,
      adjustedLatitude: adjLat,
      adjustedDeparture: adjDep,
    };
  }
  return {
    closure: { east, north, linear, ratio },
    length: total,
    points,
    adjusted,
    courses: legs,
    rule: 'compass',
  };
}

/** Plain fraction.js; √ (which fraction.js lacks) through Math.sqrt of the value. */
export function naiveFraction(inp) {
  const cs = inp.courses,
    n = cs.length;
  let x = inp.start.x,
    y = inp.start.y,
    total = new Fraction(0);
  const points = new Array(n + 1);
  points[0] = inp.start;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    if (c.distance.s < 0n) throw new Error('distance');
    total = total.add(c.distance);
    x = x.add(c.departure);
    y = y.add(c.latitude);
    points[i + 1] = { x, y };
  }
  const east = x.sub(inp.start.x),
    north = y.sub(inp.start.y);
  const q = east.mul(east).add(north.mul(north));
  const linear = new Fraction(Math.sqrt(q.valueOf()));
  const ratio = q.n === 0n ? undefined : total.div(linear);
  const kLat = north.neg().div(total),
    kDep = east.neg().div(total);
  const adjusted = new Array(n + 1);
  const legs = new Array(n);
  adjusted[0] = inp.start;
  let ax = inp.start.x,
    ay = inp.start.y;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    const adjLat = c.latitude.add(kLat.mul(c.distance)),
      adjDep = c.departure.add(kDep.mul(c.distance));
    ax = ax.add(adjDep);
    ay = ay.add(adjLat);
    adjusted[i + 1] = { x: ax, y: ay };
    legs[i] = {
      latitude: c.latitude,
      departure: c.departure,
      length: c.distance,
      adjustedLatitude: adjLat,
      adjustedDeparture: adjDep,
    };
  }
  return {
    closure: { east, north, linear, ratio },
    length: total,
    points,
    adjusted,
    courses: legs,
    rule: 'compass',
  };
}

/** Plain big.js (÷ and √ to Big.DP = 34 places). */
export function naiveBig(inp) {
  const cs = inp.courses,
    n = cs.length;
  let x = inp.start.x,
    y = inp.start.y,
    total = inp.start.x.times(0);
  const points = new Array(n + 1);
  points[0] = inp.start;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    if (c.distance.lt(0)) throw new Error('distance');
    total = total.plus(c.distance);
    x = x.plus(c.departure);
    y = y.plus(c.latitude);
    points[i + 1] = { x, y };
  }
  const east = x.minus(inp.start.x),
    north = y.minus(inp.start.y);
  const q = east.times(east).plus(north.times(north));
  const linear = q.sqrt();
  const ratio = q.eq(0) ? undefined : total.div(linear);
  const kLat = north.neg().div(total),
    kDep = east.neg().div(total);
  const adjusted = new Array(n + 1);
  const legs = new Array(n);
  adjusted[0] = inp.start;
  let ax = inp.start.x,
    ay = inp.start.y;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    const adjLat = c.latitude.plus(kLat.times(c.distance)),
      adjDep = c.departure.plus(kDep.times(c.distance));
    ax = ax.plus(adjDep);
    ay = ay.plus(adjLat);
    adjusted[i + 1] = { x: ax, y: ay };
    legs[i] = {
      latitude: c.latitude,
      departure: c.departure,
      length: c.distance,
      adjustedLatitude: adjLat,
      adjustedDeparture: adjDep,
    };
  }
  return {
    closure: { east, north, linear, ratio },
    length: total,
    points,
    adjusted,
    courses: legs,
    rule: 'compass',
  };
}

export function build(lib, cases) {
  const { g, F, R, D, Big, DecimalJs } = lib;
  const as = (from) =>
    cases.map((t) => ({
      start: { x: from(t.start.x), y: from(t.start.y) },
      courses: t.courses.map((c) => ({
        latitude: from(c.latitude),
        departure: from(c.departure),
        distance: from(c.distance),
      })),
    }));
  const fl = as((s) => F.arithmetic.from(s));
  const ra = as((s) => R.arithmetic.from(s));
  const fr = as((s) => new Fraction(s));
  const de = as((s) => D.arithmetic.from(s));
  const bi = as((s) => new Big(s));
  const dj = as((s) => new DecimalJs(s));
  // naiveBig compiled again from its own source text (no type feedback shared with big.js's).
  const naiveDecimalJs = new Function(`return ${naiveBig.toString()}`)();
  const keyF = (r) => r.closure.east + r.closure.north + r.adjusted.length > 0;
  return {
    items: cases.length,
    float: { ours: loop1(fl, F.traverse, keyF), hand: loop1(fl, handFloat, keyF) },
    floatGeneric: {
      ours: loop1(fl, (x) => g.traverse(g.float, x), keyF),
      hand: loop1(fl, handFloat, keyF),
    },
    rational: {
      ours: loop1(ra, R.traverse, (r) => r.adjusted.length > 0),
      naive: loop1(fr, naiveFraction, (r) => r.adjusted.length > 0),
    },
    decimal: {
      ours: loop1(de, D.traverse, (r) => r.adjusted.length > 0),
      naive: loop1(bi, naiveBig, (r) => r.adjusted.length > 0),
    },
    decimalJs: {
      ours: loop1(de, D.traverse, (r) => r.adjusted.length > 0),
      naive: loop1(dj, naiveDecimalJs, (r) => r.adjusted.length > 0),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        const t = cases[0];
        const small = { start: t.start, courses: t.courses.slice(0, 50) };
        n += g.traverse(A, small) ? 1 : 0;
      }
      return n;
    },
  };
}
