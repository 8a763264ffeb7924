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
/** Transverse Mercator (Krüger's series to n⁶). @internal */
export const FLOAT_TM = 3;

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
  // The Lambert conic in one function of its own (see lccForwardInto).
  if (kind === FLOAT_LCC) return lccForwardInto(k, lat, lon, out);
  // readLatitude / readLongitude of a number: a finite number, the latitude within ±90°
  if (typeof lat !== 'number' || typeof lon !== 'number') return false;
  if (!(Math.abs(lat) <= 90) || lon - lon !== 0) return false;
  const dl = wrapFloat(lon - k[0]!);
  if (dl - dl !== 0) return false;
  let ok: boolean;
  if (kind === FLOAT_MERCATOR) ok = mercatorInto(k, lat, dl);
  else if (kind === FLOAT_TM) ok = tmInto(k, lat, dl);
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
 * wrapLongitude(λ − λ0) in float: [−180°, 180°) as it is, else modulo(λ − λ0 + 180°, 360°) −
 * 180°; `NaN` where the generic code must decide (not finite, too large to reduce). The checks
 * of the point stay in each caller: V8 then knows there that the latitude is a number (a
 * helper doing them too measured about 7 % slower on the Lambert conic).
 */
function wrapFloat(dl: number): number {
  if (dl >= -180 && dl < 180) return dl;
  const t = turnFloat(dl + 180);
  return t - t !== 0 ? NaN : t - 180;
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
 * Lambert conic forward (lambert-conic.ts `forward`) and the grid coordinates, from the point's
 * latitude and longitude: constants from {@link METHOD} on are e², e, n, C, r0, a.
 *
 * One function from the point to `out`, larger than V8 inlines into a caller (460 bytes of
 * bytecode), so that V8 compiles it on its own and has its whole budget of inlined code (920
 * bytes) for the sine and cosine kernels and the isometric latitude; inlined into the caller's
 * loop together with the dispatch above, it exceeded that budget and the kernels stayed calls,
 * with every angle passed to them boxed (docs/performance.md, "Map projections in float").
 */
function lccForwardInto(k: Float64Array, lat: unknown, lon: unknown, out: Float64Array): boolean {
  // readLatitude / readLongitude of a number, then wrapLongitude(λ − λ0), as forwardFloatInto
  if (typeof lat !== 'number' || typeof lon !== 'number') return false;
  if (!(Math.abs(lat) <= 90) || lon - lon !== 0) return false;
  const dl = wrapFloat(lon - k[0]!);
  if (dl - dl !== 0) return false;
  const e2 = k[METHOD]!;
  const e = k[METHOD + 1]!;
  const n = k[METHOD + 2]!;
  const C = k[METHOD + 3]!;
  const r0 = k[METHOD + 4]!;
  const a = k[METHOD + 5]!;
  // θ = n(λ − λ0). The sines and cosines of φ and θ from one call site, so that V8 compiles
  // one copy of the kernel into this function (two copies exceed its inlining budget).
  const theta = n * dl;
  for (let i = 0; i < 4; i += 2) if (!sinCosInto(i === 0 ? lat : theta, SC, i)) return false;
  // latitudeTerms: sin φ, cos φ, W = √(1 − e² sin²φ)
  const s = SC[0]!;
  const c = SC[1]!;
  const W = Math.sqrt(1 - e2 * (s * s));
  if (W - W !== 0 || c === 0) return false; // c = 0: the poles are refused
  // radius: r = C e^(−nψ)
  const psi = isometricFloat(e, s, c);
  if (psi - psi !== 0) return false;
  const r = C * Math.exp(-(n * psi));
  if (r - r !== 0) return false;
  // k = r n W/(a cos φ)
  const den = a * c;
  if (den === 0) return false;
  const kk = (r * n * W) / den;
  if (kk - kk !== 0) return false;
  // x = r sin θ, y = r0 − r cos θ; E = (FE + x)/unit, N = (FN + y)/unit; γ = θ
  const u = k[3]!;
  const E = (k[1]! + r * SC[2]!) / u;
  const N = (k[2]! + (r0 - r * SC[3]!)) / u;
  if (E - E !== 0 || N - N !== 0) return false;
  out[0] = E;
  out[1] = N;
  out[2] = kk;
  out[3] = theta;
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

/** grid.ts `atanhSmall` in float: Σ z^(2k+1)/(2k+1) until a term is below tol. */
function atanhSmallFloat(z: number, tol: number): number {
  const z2 = z * z;
  let p = z;
  let sum = z;
  for (let k = 3; k < 400; k += 2) {
    p = p * z2;
    const term = p / k;
    sum = sum + term;
    if (Math.abs(term) <= tol) break;
  }
  return sum;
}

/** grid.ts `sinhSmall` in float: Σ w^(2k+1)/(2k+1)! until a term is below tol. */
function sinhSmallFloat(w: number, tol: number): number {
  const w2 = w * w;
  let t = w;
  let sum = w;
  for (let k = 2; k < 400; k += 2) {
    t = (t * w2) / (k * (k + 1));
    sum = sum + t;
    if (Math.abs(t) <= tol) break;
  }
  return sum;
}

/** grid.ts `atanhAny` in float: halving by atanh z = 2 atanh(z/(1 + √(1 − z²))), then the series. */
function atanhAnyFloat(z: number, tol: number): number {
  let doublings = 0;
  while (Math.abs(z) > 0.1 && doublings < 60) {
    z = z / (1 + Math.sqrt(1 - z * z));
    doublings += 1;
  }
  let r = atanhSmallFloat(z, tol);
  for (let i = 0; i < doublings; i++) r = r + r;
  return r;
}

/** 10^−(15 + 4): the series' tolerance in float (grid.ts `kruger`, tenToMinus(float, 19)). */
const SERIES_TOL = 1e-19;

/**
 * Transverse Mercator forward (grid.ts `tm` and `kruger` through projection.ts `TM`, for a
 * central meridian at 0 and no false origin of its own): constants from {@link METHOD} on are
 * e², e, α₁…α₆, A/a, ξ0, k0·a·(A/a), k0 (grid.ts `tmTwinConstants`).
 */
function tmInto(k: Float64Array, lat: number, dl: number): boolean {
  const e2 = k[METHOD]!;
  const e = k[METHOD + 1]!;
  const Aa = k[METHOD + 8]!;
  const xi0 = k[METHOD + 9]!;
  const kA = k[METHOD + 10]!;
  const k0 = k[METHOD + 11]!;
  if (!sinCosInto(lat, SC, 0) || !sinCosInto(dl, SC, 2)) return false;
  const sp = SC[0]!;
  const cp = SC[1]!;
  const sl = SC[2]!;
  const cl = SC[3]!;
  if (!(cl > 0)) return false; // 90° or more from the central meridian
  // conformal latitude: S = sin φ √(1 + σ²) − σ, σ = sinh(e atanh(e sin φ)) (Karney 2011, eqs. 7–9)
  const sigma = sinhSmallFloat(e * atanhSmallFloat(e * sp, SERIES_TOL), SERIES_TOL);
  const S = sp * Math.sqrt(1 + sigma * sigma) - sigma;
  const Ccl = cp * cl;
  const D2 = S * S + Ccl * Ccl;
  if (!(D2 > 0)) return false; // singular
  const D = Math.sqrt(D2);
  // Gauss–Schreiber ξ′, η′ (Karney 2011, eq. 10)
  const sx = S / D;
  const cx = Ccl / D;
  const she = (cp * sl) / D;
  const che = Math.sqrt(1 + she * she);
  if (she - she !== 0 || che - che !== 0) return false;
  const c2 = cx * cx - sx * sx;
  const s2 = 2 * (sx * cx);
  const ch2 = 1 + 2 * (she * she);
  const sh2 = 2 * (she * che);
  let cj = c2;
  let sj = s2;
  let chj = ch2;
  let shj = sh2;
  let pp = 1;
  let qq = 0;
  let dxi = 0;
  let deta = 0;
  // Krüger's series and its derivative (Karney 2011, eqs. 11–13)
  for (let j = 1; j <= 6; j++) {
    const alpha = k[METHOD + 1 + j]!;
    if (j === 6 && Math.abs(alpha) * chj > 1e-10) return false; // the series no longer holds
    const w = 2 * j * alpha;
    pp = pp + w * (cj * chj);
    qq = qq + w * (sj * shj);
    dxi = dxi + alpha * (sj * chj);
    deta = deta + alpha * (cj * shj);
    const cn = cj * c2 - sj * s2;
    const sn = sj * c2 + cj * s2;
    const chn = chj * ch2 + shj * sh2;
    const shn = shj * ch2 + chj * sh2;
    cj = cn;
    sj = sn;
    chj = chn;
    shj = shn;
  }
  // an overflow anywhere in the series (the generic code throws) leaves ±Infinity or NaN here
  if (pp - pp !== 0 || qq - qq !== 0 || dxi - dxi !== 0 || deta - deta !== 0) return false;
  if (cj - cj !== 0 || sj - sj !== 0 || chj - chj !== 0 || shj - shj !== 0) return false;
  // k = k′k″, γ = γ′ + γ″ (Karney 2011, eqs. 25–28)
  const kPrime = Math.sqrt(1 - e2 * (sp * sp)) / D;
  const kDouble = Aa * Math.sqrt(pp * pp + qq * qq);
  const gy = S * sl;
  const gx = cl * Math.sqrt(S * S + cp * cp);
  if ((gy === 0 && gx === 0) || (qq === 0 && pp === 0) || (S === 0 && Ccl === 0)) return false;
  const gamma = Math.atan2(gy, gx) + Math.atan2(qq, pp);
  const kk = k0 * (kPrime * kDouble);
  const convergence = (gamma * 180) / Math.PI;
  // ξ = ξ′ + Σ α_j sin 2jξ′ cosh 2jη′, η = η′ + Σ α_j cos 2jξ′ sinh 2jη′ (Karney 2011, eq. 11)
  const xi = Math.atan2(S, Ccl) + dxi;
  const eta = atanhAnyFloat(she / che, SERIES_TOL) + deta;
  const x = 0 + kA * eta;
  const y = 0 + kA * (xi - xi0);
  if (kk - kk !== 0 || x - x !== 0 || y - y !== 0 || convergence - convergence !== 0) return false;
  XY[0] = x;
  XY[1] = y;
  XY[2] = kk;
  XY[3] = convergence;
  return true;
}
