/**
 * The float twins of the forward map projections (`toGrid` and the per-method functions
 * through a prepared projection): the same operations, in the same order, as the generic code
 * in `float`, on plain numbers and on the projection's constants laid out once in a
 * `Float64Array` when it is prepared. Each writes E, N, k and the convergence into `out` and
 * returns `true`, or returns `false` wherever the generic code would throw or must decide
 * (text or angle units other than degrees, a latitude beyond ±90°, a pole, a non-finite
 * quotient, root or result), and the caller then runs the generic code. Property tests
 * (test/perf/projection-float.test.ts) check that they give exactly what the generic code
 * gives in float.
 *
 * @module geodesy
 * @internal
 */
import { sinCosInto, turnFloat } from '../readings/trig-float.js';

/** No float twin for this prepared projection. @internal */
export const FLOAT_NONE = 0;
/** Lambert Conic Conformal (1SP and 2SP). @internal */
export const FLOAT_LCC = 1;
/** Mercator (variants A and B). @internal */
export const FLOAT_MERCATOR = 2;

/**
 * The layout shared by every kind: [0] lon0 + prime meridian (degrees from Greenwich),
 * [1] false easting, [2] false northing (metres), [3] metres per linear unit; the method's
 * constants from {@link METHOD} on.
 * @internal
 */
export const METHOD = 4;

/** sin, cos of the latitude; sin, cos of the second angle (read before any other call). */
const SC = /* @__PURE__ */ new Float64Array(4);
/** x, y, k, γ of the method (metres and degrees, relative to the false origin). */
const XY = /* @__PURE__ */ new Float64Array(4);

/**
 * `forwardWith(float, P, { lat, lon })` for plain numbers in degrees: E, N, k, γ written into
 * `out[0..3]`; `false` where the generic code must decide.
 * @internal
 */
export function forwardFloatInto(
  kind: number,
  k: Float64Array,
  lat: unknown,
  lon: unknown,
  out: Float64Array,
): boolean {
  // readLatitude / readLongitude of a number: a finite number, the latitude within ±90°
  if (typeof lat !== 'number' || typeof lon !== 'number') return false;
  if (!(Math.abs(lat) <= 90) || lon - lon !== 0) return false;
  // wrapLongitude(λ − λ0): [−180°, 180°) as it is, else modulo(λ − λ0 + 180°, 360°) − 180°
  let dl = lon - k[0]!;
  if (dl - dl !== 0) return false;
  if (!(dl >= -180 && dl < 180)) {
    const t = turnFloat(dl + 180);
    if (t - t !== 0) return false;
    dl = t - 180;
  }
  let ok: boolean;
  if (kind === FLOAT_LCC) ok = lccInto(k, lat, dl);
  else if (kind === FLOAT_MERCATOR) ok = mercatorInto(k, lat, dl);
  else return false;
  if (!ok) return false;
  // E = (FE + x)/unit, N = (FN + y)/unit (the linear unit in metres)
  const u = k[3]!;
  const E = (k[1]! + XY[0]!) / u;
  const N = (k[2]! + XY[1]!) / u;
  if (E - E !== 0 || N - N !== 0) return false;
  out[0] = E;
  out[1] = N;
  out[2] = XY[2]!;
  out[3] = XY[3]!;
  return true;
}

/**
 * `isometric(float, e, s, c)` for c ≠ 0 (ψ = ±ln((1 + |s|)/c) − (e/2) ln((1 + es)/(1 − es)),
 * projection-core.ts), or `NaN` where the generic code would throw.
 */
function isometricFloat(e: number, s: number, c: number): number {
  const as = Math.abs(s);
  let psi = 0;
  if (as !== 0) {
    const q = (1 + as) / c;
    if (!(q > 0 && q < Infinity)) return NaN;
    psi = Math.log(q);
  }
  if (s < 0) psi = -psi;
  if (e === 0 || s === 0) return psi;
  const es = e * s;
  const d = 1 - es;
  if (d === 0) return NaN;
  const q = (1 + es) / d;
  if (!(q > 0 && q < Infinity)) return NaN;
  return psi - (e * Math.log(q)) / 2;
}

/**
 * Lambert conic forward (lambert-conic.ts `forward`): constants from {@link METHOD} on are
 * e², e, n, C, r0, a.
 */
function lccInto(k: Float64Array, lat: number, dl: number): boolean {
  const e2 = k[METHOD]!;
  const e = k[METHOD + 1]!;
  const n = k[METHOD + 2]!;
  const C = k[METHOD + 3]!;
  const r0 = k[METHOD + 4]!;
  const a = k[METHOD + 5]!;
  // latitudeTerms: sin φ, cos φ, W = √(1 − e² sin²φ)
  if (!sinCosInto(lat, SC, 0)) return false;
  const s = SC[0]!;
  const c = SC[1]!;
  const W = Math.sqrt(1 - e2 * (s * s));
  if (W - W !== 0 || c === 0) return false; // c = 0: the poles are refused
  // radius: r = C e^(−nψ)
  const psi = isometricFloat(e, s, c);
  if (psi - psi !== 0) return false;
  const r = C * Math.exp(-(n * psi));
  if (r - r !== 0) return false;
  // θ = n(λ − λ0); k = r n W/(a cos φ)
  const theta = n * dl;
  if (!sinCosInto(theta, SC, 2)) return false;
  const den = a * c;
  if (den === 0) return false;
  const kk = (r * n * W) / den;
  if (kk - kk !== 0) return false;
  XY[0] = r * SC[2]!;
  XY[1] = r0 - r * SC[3]!;
  XY[2] = kk;
  XY[3] = theta;
  return true;
}

/** Mercator forward (mercator.ts `forward`): constants from {@link METHOD} on are e², e, a·k0, k0. */
function mercatorInto(k: Float64Array, lat: number, dl: number): boolean {
  const e2 = k[METHOD]!;
  const e = k[METHOD + 1]!;
  const ak = k[METHOD + 2]!;
  const k0 = k[METHOD + 3]!;
  if (!sinCosInto(lat, SC, 0)) return false;
  const s = SC[0]!;
  const c = SC[1]!;
  const W = Math.sqrt(1 - e2 * (s * s));
  if (W - W !== 0 || c === 0) return false; // c = 0: the poles lie at infinity
  const psi = isometricFloat(e, s, c);
  if (psi - psi !== 0) return false;
  // x = a k0 (λ − λ0) in radians, y = a k0 ψ, k = k0 W/cos φ, γ = 0
  const x = ak * ((dl * Math.PI) / 180);
  const y = ak * psi;
  const kk = (k0 * W) / c;
  if (x - x !== 0 || y - y !== 0 || kk - kk !== 0) return false;
  XY[0] = x;
  XY[1] = y;
  XY[2] = kk;
  XY[3] = 0;
  return true;
}
