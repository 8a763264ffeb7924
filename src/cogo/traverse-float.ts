/**
 * The float twin of the traverse loop: the same operations, in the same order, on plain
 * numbers, so that a 1000-course float traverse stays fast even in a process where other
 * arithmetics have been through the generic code (see docs/design.md, "Performance"). The
 * property tests check that it returns exactly what the generic code returns in float.
 *
 * @module cogo
 * @internal
 */
import type { Point } from '../geometry/point.js';
import { float } from '../arithmetic/float.js';
import { sinCosInto } from '../readings/trig-float.js';
import { readAzimuth } from './bearing.js';
import type { Traverse, TraverseLeg } from './traverse.js';

const where = 'traverse(A, input)';

/** sin and cos of the course in progress (read at once, before any other call). */
const SC = /* @__PURE__ */ new Float64Array(2);

function isNum(v: unknown): v is number {
  return typeof v === 'number' && v - v === 0;
}

/** latitude, departure and length of a course given by bearing, from {@link bearingCourse}. */
const COURSE = /* @__PURE__ */ new Float64Array(3);

/**
 * A course `{ bearing, distance }` into {@link COURSE}, or `false` where the generic code must
 * decide. (Its own function: inlined into the loop, the bearing's reading and its sine made the
 * loop of latitude/departure courses slower too.)
 */
function bearingCourse(c: { bearing?: unknown; distance?: unknown }): boolean {
  const d = c.distance;
  if (!isNum(d)) return false;
  const b = c.bearing;
  let az: number;
  if (typeof b === 'number' && b - b === 0) {
    // readAzimuth(float, b) for a finite number: [0°, 360°], 360° read as 0°.
    if (b < 0 || b > 360) return false;
    az = b === 360 ? 0 : b;
  } else {
    if (typeof b !== 'string') return false;
    try {
      az = readAzimuth(float, b, where);
    } catch {
      return false;
    }
  }
  if (!sinCosInto(az, SC, 0)) return false;
  COURSE[0] = d * SC[1]!;
  COURSE[1] = d * SC[0]!;
  COURSE[2] = d;
  return true;
}

/**
 * `traverse(float, input)` for well-formed input, or `undefined` when anything needs the
 * generic path (text numbers, malformed courses, anything that must throw): the generic
 * code then validates and reports the error.
 * @internal
 */
export function traverseFloat(
  start: Point<number>,
  end: Point<number>,
  rule: 'compass' | 'transit',
  list: readonly unknown[],
): Traverse<number, false> | undefined {
  const n = list.length;
  // Each leg is made here with its latitude, departure and length, and its adjusted values
  // written in the second loop: three typed arrays of n numbers (kept between the loops)
  // cost a fifth of the time of a 1000-course traverse.
  const legs = new Array<TraverseLeg<number>>(n);
  const points = new Array<Point<number>>(n + 1);
  points[0] = start;
  let x = start.x;
  let y = start.y;
  let total = 0;
  let sumAbsLat = 0;
  let sumAbsDep = 0;
  const transit = rule === 'transit';
  for (let i = 0; i < n; i++) {
    const c = list[i] as {
      bearing?: unknown;
      distance?: unknown;
      latitude?: unknown;
      departure?: unknown;
    } | null;
    if (c === null || typeof c !== 'object') return undefined;
    let la: number;
    let de: number;
    let d: number;
    if (c.bearing !== undefined) {
      if (!bearingCourse(c)) return undefined;
      la = COURSE[0]!;
      de = COURSE[1]!;
      d = COURSE[2]!;
    } else {
      // Each field read once; finite numbers and a length not negative (NaN fails d >= 0), in
      // one test after the reads (a check per field before it cost a tenth of the traverse).
      const lat = c.latitude;
      const dep = c.departure;
      const dist = c.distance;
      if (typeof lat !== 'number' || typeof dep !== 'number') return undefined;
      la = lat;
      de = dep;
      if (dist === undefined) d = Math.sqrt(la * la + de * de);
      else if (typeof dist === 'number') d = dist;
      else return undefined;
    }
    // (x − x is 0 for a finite x and NaN otherwise: one comparison for the three)
    if (!(d >= 0 && la - la + (de - de) + (d - d) === 0)) return undefined;
    // (0.5: the adjusted values are numbers from the start, so that writing them keeps the
    // object's layout)
    legs[i] = {
      latitude: la,
      departure: de,
      length: d,
      adjustedLatitude: 0.5,
      adjustedDeparture: 0.5,
    };
    total = total + d;
    if (transit) {
      sumAbsLat = sumAbsLat + Math.abs(la);
      sumAbsDep = sumAbsDep + Math.abs(de);
    }
    x = x + de;
    y = y + la;
    points[i + 1] = { x, y };
  }
  const east = x - end.x;
  const north = y - end.y;
  const q = east * east + north * north;
  if (q - q !== 0 || total - total !== 0) return undefined;
  const linear = Math.sqrt(q);
  const ratio = q === 0 ? undefined : total / Math.sqrt(q);
  let kLat: number;
  let kDep: number;
  if (!transit) {
    if (total === 0) return undefined;
    kLat = -north / total;
    kDep = -east / total;
  } else {
    if ((sumAbsLat === 0 && north !== 0) || (sumAbsDep === 0 && east !== 0)) return undefined;
    kLat = sumAbsLat === 0 ? 0 : -north / sumAbsLat;
    kDep = sumAbsDep === 0 ? 0 : -east / sumAbsDep;
  }
  // float.div refuses a quotient that is not finite (NOT_FINITE); leave such data (a
  // misclosure over a subnormal length) to the generic path, which reports it.
  if (kLat - kLat !== 0 || kDep - kDep !== 0 || (ratio !== undefined && ratio - ratio !== 0))
    return undefined;
  const adjusted = new Array<Point<number>>(n + 1);
  adjusted[0] = start;
  let ax = start.x;
  let ay = start.y;
  for (let i = 0; i < n; i++) {
    const leg = legs[i] as { -readonly [K in keyof TraverseLeg<number>]: number };
    const la = leg.latitude;
    const de = leg.departure;
    const adjLat = la + kLat * (transit ? Math.abs(la) : leg.length);
    const adjDep = de + kDep * (transit ? Math.abs(de) : leg.length);
    ax = ax + adjDep;
    ay = ay + adjLat;
    adjusted[i + 1] = { x: ax, y: ay };
    leg.adjustedLatitude = adjLat;
    leg.adjustedDeparture = adjDep;
  }
  return {
    closure: { east, north, linear, ratio },
    length: total,
    points,
    adjusted,
    courses: legs,
    rule,
  };
}
