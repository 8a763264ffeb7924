/**
 * Cassini–Soldner (EPSG method 9806): IOGP Guidance Note 7-2, §3.2.4, in its **series** form
 * (terms to A⁵ in A = (λ − λ0) cos φ forward, to D⁵ in D = (E − FE)/ν1 inverse; the meridian
 * arc to e⁶ and the footpoint latitude to e1⁴). The truncation grows like ν·A⁶: about 0.1 mm at
 * 100 km from the central meridian and some centimetres at 300 km, so the method is for the
 * narrow zones it was designed for. The inverse starts from GN 7-2's inverse series and refines
 * it by Newton's iteration on the forward series, so that inverse ∘ forward is the identity to
 * the arithmetic's precision (the inverse series alone agrees only to order D⁶). The scale factors h (meridian), k (parallel) and the convergence are
 * those of the series as implemented (its partial derivatives, derived).
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, QuadspreadError, invalidArgument, checkArithmetic } from '../errors.js';
import { root, toDegrees } from './internal.js';
import {
  forwardWith,
  inverseWith,
  latitudeTerms,
  outside,
  prepared,
  toRadians,
  type GeographicPoint,
  type MethodImpl,
  type PreparedProjection,
  type ProjectedPoint,
  type Projection,
  type ProjectionParams,
} from './projection-core.js';

interface Cassini<T> {
  readonly a: T;
  readonly e2: T;
  /** e′² = e²/(1 − e²) */
  readonly ep2: T;
  /** the meridian arc's coefficients: M = a(c0 φ − c2 sin 2φ + c4 sin 4φ − c6 sin 6φ) */
  readonly c: readonly [T, T, T, T];
  readonly M0: T;
  /** footpoint series coefficients in e1 */
  readonly f: readonly [T, T, T, T];
  readonly tol: T;
}

const frac = <T>(A: Arithmetic<T>, n: number, d: number): T => A.div(A.from(n), A.from(d));

/** M = a[(1 − e²/4 − 3e⁴/64 − 5e⁶/256)φ − (3e²/8 + 3e⁴/32 + 45e⁶/1024) sin 2φ + (15e⁴/256 + 45e⁶/1024) sin 4φ − (35e⁶/3072) sin 6φ] (GN 7-2 §3.2.4) */
function meridianArc<T>(A: Arithmetic<T>, c: Cassini<T>, latDeg: T): T {
  const phi = toRadians(A, latDeg);
  const sin = (k: number) => A.sin(A.mul(A.from(k), phi));
  const [c0, c2, c4, c6] = c.c;
  return A.mul(
    c.a,
    A.sub(A.add(A.sub(A.mul(c0, phi), A.mul(c2, sin(2))), A.mul(c4, sin(4))), A.mul(c6, sin(6))),
  );
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>): Cassini<T> {
  const e2 = p.e2;
  const e4 = A.mul(e2, e2);
  const e6 = A.mul(e4, e2);
  const lin = (terms: [number, number, T][]): T =>
    terms.reduce((s, [n, d, x]) => A.add(s, A.mul(frac(A, n, d), x)), A.zero);
  const c: [T, T, T, T] = [
    lin([
      [1, 1, A.one],
      [-1, 4, e2],
      [-3, 64, e4],
      [-5, 256, e6],
    ]),
    lin([
      [3, 8, e2],
      [3, 32, e4],
      [45, 1024, e6],
    ]),
    lin([
      [15, 256, e4],
      [45, 1024, e6],
    ]),
    lin([[35, 3072, e6]]),
  ];
  // e1 = (1 − √(1 − e²))/(1 + √(1 − e²)); φ1 = μ1 + (3e1/2 − 27e1³/32) sin 2μ1 + (21e1²/16 −
  // 55e1⁴/32) sin 4μ1 + (151e1³/96) sin 6μ1 + (1097e1⁴/512) sin 8μ1 (GN 7-2 §3.2.4)
  const r = root(A, A.sub(A.one, e2));
  const e1 = A.div(A.sub(A.one, r), A.add(A.one, r));
  const e12 = A.mul(e1, e1);
  const e13 = A.mul(e12, e1);
  const e14 = A.mul(e13, e1);
  const f: [T, T, T, T] = [
    lin([
      [3, 2, e1],
      [-27, 32, e13],
    ]),
    lin([
      [21, 16, e12],
      [-55, 32, e14],
    ]),
    lin([[151, 96, e13]]),
    lin([[1097, 512, e14]]),
  ];
  const base = { a: p.a, tol: p.tol, e2, ep2: A.div(e2, A.sub(A.one, e2)), c, f, M0: A.zero };
  return { ...base, M0: meridianArc(A, base, p.lat0!) };
}

/** The forward series at a point with its partial derivatives (radians). */
function series<T>(A: Arithmetic<T>, c: Cassini<T>, lat: T, dlon: T, where: string) {
  const t = latitudeTerms(A, c.e2, lat);
  if (A.isZero(t.c))
    throw outside(`${where}(point.lat)`, 'the Cassini–Soldner series do not hold at the poles');
  const one = A.one;
  const tan = A.div(t.s, t.c);
  const nu = A.div(c.a, t.W);
  // A = (λ − λ0) cos φ, T = tan²φ, C = e² cos²φ/(1 − e²) (GN 7-2 §3.2.4)
  const L = toRadians(A, dlon);
  const Aa = A.mul(L, t.c);
  const T = A.mul(tan, tan);
  const C = A.mul(c.ep2, A.mul(t.c, t.c));
  const A2 = A.mul(Aa, Aa);
  const A3 = A.mul(A2, Aa);
  const A4 = A.mul(A2, A2);
  const A5 = A.mul(A4, Aa);
  const k8 = A.add(A.sub(A.from(8), T), A.mul(A.from(8), C)); // 8 − T + 8C
  const k5 = A.add(A.sub(A.from(5), T), A.mul(A.from(6), C)); // 5 − T + 6C
  // X = ν(A − T A³/6 − (8 − T + 8C) T A⁵/120); Y = M − M0 + ν tan φ (A²/2 + (5 − T + 6C) A⁴/24)
  const P = A.sub(
    A.sub(Aa, A.div(A.mul(T, A3), A.from(6))),
    A.div(A.mul(A.mul(k8, T), A5), A.from(120)),
  );
  const Q = A.add(A.div(A2, A.from(2)), A.div(A.mul(k5, A4), A.from(24)));
  const x = A.mul(nu, P);
  const y = A.add(A.sub(meridianArc(A, c, lat), c.M0), A.mul(A.mul(nu, tan), Q));
  // Partial derivatives of the series (derived): ∂/∂λ with A_λ = cos φ; ∂/∂φ with A_φ = −A tan φ,
  // T_φ = 2 tan φ (1 + T), C_φ = −2 C tan φ, ν_φ = ν e² sin φ cos φ/W², M_φ = ρ = a(1 − e²)/W³.
  const Pl = A.sub(
    A.sub(one, A.div(A.mul(T, A2), A.from(2))),
    A.div(A.mul(A.mul(k8, T), A4), A.from(24)),
  );
  const Xl = A.mul(A.mul(nu, t.c), Pl);
  const Yl = A.mul(A.mul(nu, t.s), A.add(Aa, A.div(A.mul(k5, A3), A.from(6))));
  const Af = A.neg(A.mul(Aa, tan));
  const Tf = A.mul(A.mul(A.from(2), tan), A.add(one, T));
  const Cf = A.neg(A.mul(A.mul(A.from(2), C), tan));
  const W2 = A.mul(t.W, t.W);
  const nuf = A.div(A.mul(A.mul(nu, c.e2), A.mul(t.s, t.c)), W2);
  const rho = A.div(A.mul(c.a, A.sub(one, c.e2)), A.mul(W2, t.W));
  const k8f = A.add(A.neg(Tf), A.mul(A.from(8), Cf));
  const Pf = A.sub(
    A.sub(A.mul(Af, Pl), A.div(A.mul(Tf, A3), A.from(6))),
    A.div(A.mul(A.add(A.mul(k8f, T), A.mul(k8, Tf)), A5), A.from(120)),
  );
  const Xf = A.add(A.mul(nuf, P), A.mul(nu, Pf));
  const k5f = A.add(A.neg(Tf), A.mul(A.from(6), Cf));
  const Qf = A.add(
    A.add(A.mul(Aa, Af), A.div(A.mul(k5f, A4), A.from(24))),
    A.div(A.mul(A.mul(k5, A3), Af), A.from(6)),
  );
  const Yf = A.add(
    A.add(rho, A.mul(A.add(A.mul(nuf, tan), A.mul(nu, A.add(one, T))), Q)),
    A.mul(A.mul(nu, tan), Qf),
  );
  return { x, y, Xl, Yl, Xf, Yf, nu, rho, c: t.c };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const r = series(A, k as Cassini<T>, lat, dlon, where);
  const kk = A.div(root(A, A.add(A.mul(r.Xl, r.Xl), A.mul(r.Yl, r.Yl))), A.mul(r.nu, r.c));
  const hh = A.div(root(A, A.add(A.mul(r.Xf, r.Xf), A.mul(r.Yf, r.Yf))), r.rho);
  // γ = atan2(−∂E/∂φ, ∂N/∂φ): the grid bearing of the meridian's image is −γ (derived)
  return { x: r.x, y: r.y, k: kk, h: hh, gamma: toDegrees(A, A.atan2(A.neg(r.Xf), r.Yf)) };
}

/** Most Newton steps the inverse takes after the inverse series. */
const MAX_STEPS = 20;

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Cassini<T>;
  const one = A.one;
  // M1 = M0 + (N − FN); μ1 = M1/(a(1 − e²/4 − 3e⁴/64 − 5e⁶/256)); φ1 by the footpoint series (GN 7-2 §3.2.4)
  const mu = A.div(A.add(c.M0, y), A.mul(c.a, c.c[0]));
  const sin = (m: number) => A.sin(A.mul(A.from(m), mu));
  const [f2, f4, f6, f8] = c.f;
  const phi1 = A.add(
    A.add(A.add(A.add(mu, A.mul(f2, sin(2))), A.mul(f4, sin(4))), A.mul(f6, sin(6))),
    A.mul(f8, sin(8)),
  );
  const s1 = A.sin(phi1);
  const c1 = A.cos(phi1);
  if (A.sign(c1) <= 0) throw outside(`${where}(point.N)`, 'the footpoint is at or beyond a pole');
  const W2 = A.sub(one, A.mul(c.e2, A.mul(s1, s1)));
  const W = root(A, W2);
  const nu1 = A.div(c.a, W);
  const rho1 = A.div(A.mul(c.a, A.sub(one, c.e2)), A.mul(W2, W));
  const tan1 = A.div(s1, c1);
  const T1 = A.mul(tan1, tan1);
  const D = A.div(x, nu1);
  const D2 = A.mul(D, D);
  const D3 = A.mul(D2, D);
  const D4 = A.mul(D2, D2);
  const D5 = A.mul(D4, D);
  const k3 = A.add(one, A.mul(A.from(3), T1)); // 1 + 3T1
  // φ = φ1 − (ν1 tan φ1/ρ1)(D²/2 − (1 + 3T1) D⁴/24);
  // λ = λ0 + (D − T1 D³/3 + (1 + 3T1) T1 D⁵/15)/cos φ1 (GN 7-2 §3.2.4)
  const phi = A.sub(
    phi1,
    A.mul(
      A.div(A.mul(nu1, tan1), rho1),
      A.sub(A.div(D2, A.from(2)), A.div(A.mul(k3, D4), A.from(24))),
    ),
  );
  const lam = A.div(
    A.add(A.sub(D, A.div(A.mul(T1, D3), A.from(3))), A.div(A.mul(A.mul(k3, T1), D5), A.from(15))),
    c1,
  );
  let lat = toDegrees(A, phi);
  let dlon = toDegrees(A, lam);
  // The inverse series is the forward's inverse only to its order (D⁶); Newton's iteration on
  // the forward series with its exact Jacobian makes inverse ∘ forward the identity to the
  // arithmetic's precision (derived), so repeated round trips do not drift.
  const limit = A.mul(A.from(1000), c.tol);
  for (let i = 0; ; i++) {
    if (A.cmp(A.abs(lat), A.from(90)) >= 0)
      throw outside(`${where}(point)`, 'the point is at or beyond a pole');
    const r = series(A, c, lat, dlon, where);
    const dx = A.sub(x, r.x);
    const dy = A.sub(y, r.y);
    const det = A.sub(A.mul(r.Xf, r.Yl), A.mul(r.Xl, r.Yf));
    const dphi = A.div(A.sub(A.mul(dx, r.Yl), A.mul(r.Xl, dy)), det);
    const dlam = A.div(A.sub(A.mul(r.Xf, dy), A.mul(r.Yf, dx)), det);
    lat = A.add(lat, toDegrees(A, dphi));
    dlon = A.add(dlon, toDegrees(A, dlam));
    if (A.cmp(A.add(A.abs(dphi), A.abs(dlam)), limit) <= 0) break;
    if (i >= MAX_STEPS)
      throw new QuadspreadError(
        'NOT_CONVERGED',
        `${where}(point)`,
        `Newton's iteration did not converge in ${MAX_STEPS} steps`,
      );
  }
  const r = forward(A, c, lat, dlon, where);
  return { lat, dlon, k: r.k, h: r.h, gamma: r.gamma };
}

/** The Cassini–Soldner formulas: needs lat0, lon0. @internal */
export const CASSINI: MethodImpl = {
  needs: ['lat0', 'lon0'],
  takes: [],
  prepare,
  forward,
  inverse,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'cassini-soldner') return CASSINI;
  throw invalidArgument(where, `this function projects 'cassini-soldner', not ${show(method)}`);
};

/**
 * Cassini–Soldner (`'cassini-soldner'`: `lat0`, `lon0`): latitude and longitude to grid
 * coordinates by the series of IOGP GN 7-2 §3.2.4, with the scale factors along the meridian
 * (h) and the parallel (k) and the convergence. The series are truncated (see the module
 * notes): use it within the narrow zones it was designed for.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, h, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the poles; as `toGrid`.
 * @example
 * ```ts
 * import { float, cassiniSoldner, defineEllipsoid } from 'quadspread';
 * // IOGP GN 7-2 §3.2.4 example: Trinidad 1903 / Trinidad Grid, in Clarke's links
 * const clarke1858 = defineEllipsoid({ a: '6378293.6452087592', b: '6356617.9876798382' }); // 20926348 and 20855233 Clarke's feet
 * const trinidad = { method: 'cassini-soldner', ellipsoid: clarke1858, lat0: `10°26'30"N`, lon0: `61°20'00"W`, falseEasting: 430000, falseNorthing: 325000, linearUnit: 'clarke-link' } as const;
 * const g = cassiniSoldner(float, { lat: `10°N`, lon: `62°W` }, trinidad);
 * [g.E.toFixed(2), g.N.toFixed(2)];
 * //=> ['66644.94', '82536.22']
 * ```
 */
export function cassiniSoldner<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'cassiniSoldner');
  return forwardWith(A, prepared(A, projection, pick, 'cassiniSoldner'), point, 'cassiniSoldner');
}

/**
 * Cassini–Soldner grid coordinates back to latitude and longitude by the inverse series of IOGP
 * GN 7-2 §3.2.4 (truncated as the forward series; see {@link cassiniSoldner}).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link cassiniSoldner}
 * @returns `{ lat, lon, k, h, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` for a footpoint at or beyond a pole; as {@link cassiniSoldner}.
 * @example
 * ```ts
 * import { float, cassiniSoldnerInverse, defineEllipsoid } from 'quadspread';
 * const clarke1858 = defineEllipsoid({ a: '6378293.6452087592', b: '6356617.9876798382' });
 * const trinidad = { method: 'cassini-soldner', ellipsoid: clarke1858, lat0: `10°26'30"N`, lon0: `61°20'00"W`, falseEasting: 430000, falseNorthing: 325000, linearUnit: 'clarke-link' } as const;
 * const p = cassiniSoldnerInverse(float, { E: 66644.94, N: 82536.22 }, trinidad);
 * [p.lat.toFixed(6), p.lon.toFixed(6)];
 * //=> ['10.000000', '-62.000000']
 * ```
 */
export function cassiniSoldnerInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'cassiniSoldnerInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'cassiniSoldnerInverse'),
    point,
    'cassiniSoldnerInverse',
  );
}
