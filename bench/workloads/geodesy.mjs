// Workload (e): geodetic → geocentric on GRS 80 (latitude, longitude in decimal degrees,
// ellipsoidal height in metres), and (f) the round trip back by Bowring's iteration.
import { rng } from '../data.mjs';
import { loop1 } from '../harness.mjs';

export const name = 'geodesy';
export const title = '(e) geodetic → geocentric (GRS 80)';

export function unavailable(lib) {
  return lib.g.geodeticToGeocentric ? undefined : 'geodeticToGeocentric() is not in the package';
}

/** Points spread over the ellipsoid: |lat| < 89.9°, any longitude, heights −100 m to 9 km. */
export function makeCases(n, seed = 5) {
  const rand = rng(seed);
  const out = [];
  for (let i = 0; i < n; i++) {
    out.push({
      lat: Math.round((rand() * 179.8 - 89.9) * 1e9) / 1e9,
      lon: Math.round((rand() * 360 - 180) * 1e9) / 1e9,
      h: Math.round((rand() * 9100 - 100) * 1e3) / 1e3,
    });
  }
  return out;
}

// ---- the same formulas as src/geodesy/geocentric.ts, written plainly ----------------------
// GRS 80: a = 6378137 m, f = 1/298.257222101.
const A = 6378137;
const F = 1 / 298.257222101;
const B = A * (1 - F);
const E2 = F * (2 - F);
const EP2 = E2 / (1 - E2);
const RAD = Math.PI / 180;

/** X = (ν + h) cos φ cos λ, Y = (ν + h) cos φ sin λ, Z = ((1 − e²)ν + h) sin φ, ν = a/√(1 − e² sin²φ). */
export function handForward(p) {
  const lat = p.lat,
    lon = p.lon,
    h = p.h ?? 0;
  if (!(Math.abs(lat) <= 90)) throw new Error('latitude');
  if (!(lon - lon === 0)) throw new Error('longitude');
  if (!(h >= -A)) throw new Error('height');
  const sp = Math.sin(lat * RAD),
    cp = Math.cos(lat * RAD),
    sl = Math.sin(lon * RAD),
    cl = Math.cos(lon * RAD);
  const nu = A / Math.sqrt(1 - E2 * sp * sp);
  const r = (nu + h) * cp;
  return { X: r * cl, Y: r * sl, Z: ((1 - E2) * nu + h) * sp };
}

/** Bowring's iteration on unit vectors, stopped as the library stops it (1e-17, or noise). */
export function handInverse(q) {
  const X = q.X,
    Y = q.Y,
    Z = q.Z;
  if (!(X - X === 0 && Y - Y === 0 && Z - Z === 0)) throw new Error('number');
  const p2 = X * X + Y * Y;
  if (p2 === 0) throw new Error('polar axis');
  const p = Math.sqrt(p2);
  let r = Math.hypot(B * p, A * Z);
  let uc = (B * p) / r,
    us = (A * Z) / r;
  let pc = 0,
    ps = 0,
    have = false,
    prev = -1;
  for (let i = 0; i < 30; i++) {
    const num = Z + EP2 * B * us * us * us;
    const den = p - E2 * A * uc * uc * uc;
    if (den <= 0) throw new Error('too deep');
    r = Math.sqrt(den * den + num * num);
    const nc = den / r,
      ns = num / r;
    if (have) {
      const change = Math.abs(pc * ns - ps * nc);
      pc = nc;
      ps = ns;
      if (change <= 1e-17 || (prev >= 0 && change <= 1e-13 && change + change >= prev)) break;
      prev = change;
    } else {
      pc = nc;
      ps = ns;
      have = true;
    }
    const t = (1 - F) * ps;
    r = Math.sqrt(pc * pc + t * t);
    uc = pc / r;
    us = t / r;
  }
  const w = Math.sqrt(1 - E2 * ps * ps);
  return {
    lat: Math.atan2(ps, pc) / RAD,
    lon: Math.atan2(Y, X) / RAD,
    h: p * pc + Z * ps - A * w,
  };
}

export const handRoundTrip = (p) => handInverse(handForward(p));

export function build(lib, cases) {
  const { g, F: Fl } = lib;
  const key = (r) => r.X + r.Y + r.Z !== 0;
  const fwd = (x) => Fl.geodeticToGeocentric(x, 'GRS80');
  const gen = (x) => g.geodeticToGeocentric(g.float, x, 'GRS80');
  return {
    items: cases.length,
    float: { ours: loop1(cases, fwd, key), hand: loop1(cases, handForward, key) },
    floatGeneric: { ours: loop1(cases, gen, key), hand: loop1(cases, handForward, key) },
    pollute(arithmetics) {
      let n = 0;
      for (const Ar of arithmetics) {
        for (const c of cases.slice(0, 3)) {
          const q = g.geodeticToGeocentric(Ar, c, 'GRS80');
          n += g.geocentricToGeodetic(Ar, q, 'GRS80') ? 1 : 0;
        }
      }
      return n;
    },
  };
}
