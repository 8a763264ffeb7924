/**
 * The float twins of geodetic ↔ geocentric: the same operations, in the same order, as the
 * generic code in `float`, on plain numbers, so that these conversions run near hand-written
 * speed in any process. Each writes its three numbers into a scratch array and returns
 * `true`, or returns `false` wherever the generic code would throw or must decide (text input,
 * a value out of range, a non-finite quotient or root), and the caller then runs the generic
 * code. Property tests check that they return exactly what the
 * generic code returns in float.
 *
 * @module geodesy
 * @internal
 */
import { sinCosQuadrantInto } from '../arithmetic/float-trig.js';
import { PER_DEGREE, sinCosInto } from '../readings/trig-float.js';

/** sin φ, cos φ, sin λ, cos λ of the call in progress (read before any other call). */
const SCRATCH = /* @__PURE__ */ new Float64Array(4);

const isNum = (v: unknown): v is number => typeof v === 'number' && v - v === 0;

/**
 * `geodeticToGeocentric(float, point, E)` for numeric input (`a`, `e2` the ellipsoid's
 * float constants), written into `out[0..2]` (X, Y, Z); `false` where the generic code must
 * decide. (The caller builds the result object: one allocation site, which V8 can remove
 * when the caller is inlined, where an object-or-undefined return could not be.)
 * @internal
 */
export function geocentricInto(
  point: { lat?: unknown; lon?: unknown; h?: unknown },
  a: number,
  e2: number,
  out: Float64Array,
): boolean {
  const lat = point.lat;
  const lon = point.lon;
  let h = point.h;
  if (h === undefined) h = 0;
  if (typeof lat !== 'number' || typeof lon !== 'number' || typeof h !== 'number') return false;
  // Finite and in range (NaN fails every comparison); a longitude of a turn or more, too, is
  // left to the generic code.
  if (!(lat >= -90 && lat <= 90 && lon > -360 && lon < 360 && h >= -a && h - h === 0)) return false;
  const sc = SCRATCH;
  // sin φ, cos φ into sc[0], sc[1], sin λ, cos λ into sc[2], sc[3]: sinCosInto's steps written
  // out for each angle, so that they are compiled into this function whatever V8 chooses to
  // inline; the exact cases (t = 0°, ±30°) go through sinCosInto itself. (Written once in a
  // loop over the two angles, the conversion took about 1.1 times as long, and with two calls
  // of sinCosInto about 1.25 times: 2026-12-04.)
  {
    let k = Math.round(lat * (1 / 90));
    let t = k === 0 ? lat : lat - 90 * k;
    if (t > 45) {
      k += 1;
      t = t - 90;
    } else if (t < -45) {
      k -= 1;
      t = t + 90;
    }
    if (t === 0 || t === 30 || t === -30) sinCosInto(lat, sc, 0);
    else sinCosQuadrantInto(t * PER_DEGREE, k, sc, 0);
  }
  {
    let k = Math.round(lon * (1 / 90));
    let t = k === 0 ? lon : lon - 90 * k;
    if (t > 45) {
      k += 1;
      t = t - 90;
    } else if (t < -45) {
      k -= 1;
      t = t + 90;
    }
    if (t === 0 || t === 30 || t === -30) sinCosInto(lon, sc, 2);
    else sinCosQuadrantInto(t * PER_DEGREE, k, sc, 2);
  }
  const sp = sc[0]!;
  // ν = a/√(1 − e² sin²φ), as primeVertical computes it
  const w = Math.sqrt(1 - e2 * (sp * sp));
  const nu = a / w;
  if (nu - nu !== 0) return false; // (w is NaN, 0 or subnormal: the generic code decides)
  const r = (nu + h) * sc[1]!;
  out[0] = r * sc[3]!;
  out[1] = r * sc[2]!;
  out[2] = ((1 - e2) * nu + h) * sp;
  return true;
}

/** The constants {@link geodeticInto} needs (those of ellipsoidParameters in float). */
export interface FloatEllipsoid {
  readonly a: number;
  readonly f: number;
  readonly b: number;
  readonly e2: number;
  readonly ep2: number;
}

/**
 * `geocentricToGeodetic(float, point, E)` off the polar axis for numeric input, with the
 * stopping tolerances `tol` and `noise` of the generic code, written into `out[0..2]`
 * (latitude, longitude, height); `false` where the generic code must decide.
 * @internal
 */
export function geodeticInto(
  point: { X?: unknown; Y?: unknown; Z?: unknown },
  E: FloatEllipsoid,
  tol: number,
  noise: number,
  out: Float64Array,
): boolean {
  const X = point.X;
  const Y = point.Y;
  const Z = point.Z;
  if (!isNum(X) || !isNum(Y) || !isNum(Z)) return false;
  const p2 = X * X + Y * Y;
  if (p2 === 0) return false; // the polar axis: the generic code
  const p = Math.sqrt(p2);
  if (p - p !== 0) return false;
  const oneMinusF = 1 - E.f;
  // unit(b·p, a·Z): tan u₀ = aZ/(bp)
  let c = E.b * p;
  let s = E.a * Z;
  let r = Math.sqrt(c * c + s * s);
  let uc = c / r;
  let us = s / r;
  if (r - r !== 0 || uc - uc !== 0 || us - us !== 0) return false;
  const ep2b = E.ep2 * E.b;
  const e2a = E.e2 * E.a;
  let pc = 0;
  let ps = 0;
  let have = false;
  let prev = -1;
  for (let i = 0; i < 30; i++) {
    const num = Z + ep2b * (us * (us * us));
    const den = p - e2a * (uc * (uc * uc));
    if (!(den > 0)) return false;
    r = Math.sqrt(den * den + num * num);
    const nc = den / r;
    const ns = num / r;
    if (r - r !== 0 || nc - nc !== 0 || ns - ns !== 0) return false;
    if (have) {
      const change = Math.abs(pc * ns - ps * nc);
      pc = nc;
      ps = ns;
      if (change <= tol) return finish(pc, ps, p, X, Y, Z, E.a, E.e2, out);
      if (prev >= 0 && change <= noise && change + change >= prev)
        return finish(pc, ps, p, X, Y, Z, E.a, E.e2, out);
      prev = change;
    } else {
      pc = nc;
      ps = ns;
      have = true;
    }
    // tan u = (1 − f) tan φ
    c = pc;
    s = oneMinusF * ps;
    r = Math.sqrt(c * c + s * s);
    uc = c / r;
    us = s / r;
    if (r - r !== 0 || uc - uc !== 0 || us - us !== 0) return false;
  }
  return false; // not converged: the generic code reports it
}

function finish(
  c: number,
  s: number,
  p: number,
  X: number,
  Y: number,
  Z: number,
  a: number,
  e2: number,
  out: Float64Array,
): boolean {
  // h = p cos φ + Z sin φ − a √(1 − e² sin²φ)  (Bowring 1985)
  const w = Math.sqrt(1 - e2 * (s * s));
  if (w - w !== 0) return false;
  const h = p * c + Z * s - a * w;
  if (s === 0 && c === 0) return false;
  const lat = (Math.atan2(s, c) * 180) / Math.PI;
  if (X === 0 && Y === 0) return false;
  const lon = (Math.atan2(Y, X) * 180) / Math.PI;
  if (lat - lat !== 0 || lon - lon !== 0) return false;
  out[0] = lat;
  out[1] = lon;
  out[2] = h;
  return true;
}
