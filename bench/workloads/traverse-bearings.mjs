// Workload (c′): traverse closure by bearings — a loop of 1000 courses given as an azimuth
// in decimal degrees and a distance (mm), compass rule.
import { rng } from '../data.mjs';
import { loop1 } from '../harness.mjs';

export const name = 'bearings';
export const title = "(c') traverse by bearings, 1000 courses (compass rule)";
const COURSES = 1000;
export const repsScale = 1 / 3;
/** Each item allocates ~3000 result objects: batches 8× as long (bench/run.mjs). */
export const batchScale = 8;

export function unavailable(lib) {
  return lib.g.traverse ? undefined : 'traverse() is not in the built package yet';
}

/** A few traverses of 1000 courses each: azimuths turning once around, legs 20–300 m. */
export function makeCases(n, seed = 7) {
  const rand = rng(seed);
  const count = Math.max(2, Math.min(8, Math.round(n / 100)));
  const out = [];
  for (let t = 0; t < count; t++) {
    const courses = [];
    for (let i = 0; i < COURSES; i++) {
      const az = (360 * i) / COURSES + (rand() - 0.5) * 20;
      courses.push({
        bearing: Math.round((((az % 360) + 360) % 360) * 1e6) / 1e6,
        distance: Math.round((20 + rand() * 280) * 1000) / 1000,
      });
    }
    out.push({ start: { x: 1000, y: 5000 }, courses });
  }
  return out;
}

const RAD = Math.PI / 180;

/** The same computation written plainly: latitude = d cos(az), departure = d sin(az), compass rule. */
export function handFloat(inp) {
  const cs = inp.courses,
    n = cs.length;
  const lat = new Float64Array(n),
    dep = new Float64Array(n);
  let x = inp.start.x,
    y = inp.start.y,
    total = 0;
  const points = new Array(n + 1);
  points[0] = inp.start;
  for (let i = 0; i < n; i++) {
    const c = cs[i];
    const d = c.distance;
    if (!(d >= 0)) throw new Error('distance');
    const a = c.bearing * RAD;
    lat[i] = d * Math.cos(a);
    dep[i] = d * Math.sin(a);
    total += d;
    x += dep[i];
    y += lat[i];
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
    const d = cs[i].distance;
    const adjLat = lat[i] + kLat * d,
      adjDep = dep[i] + kDep * d;
    ax += adjDep;
    ay += adjLat;
    adjusted[i + 1] = { x: ax, y: ay };
    legs[i] = {
      latitude: lat[i],
      departure: dep[i],
      length: d,
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
  const { g, F } = lib;
  const key = (r) => r.closure.east + r.closure.north + r.adjusted.length > 0;
  return {
    items: cases.length,
    float: { ours: loop1(cases, F.traverse, key), hand: loop1(cases, handFloat, key) },
    floatGeneric: {
      ours: loop1(cases, (x) => g.traverse(g.float, x), key),
      hand: loop1(cases, handFloat, key),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        const t = cases[0];
        n += g.traverse(A, { start: t.start, courses: t.courses.slice(0, 10) }) ? 1 : 0;
      }
      return n;
    },
  };
}
