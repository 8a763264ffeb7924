/**
 * Oblique Stereographic (EPSG method 9809): the ellipsoid mapped conformally onto a sphere of
 * radius R = √(ρ0 ν0) (Gauss's conformal sphere, longitudes scaled by n), then the stereographic
 * projection of that sphere — IOGP Guidance Note 7-2, §3.2.7.1 ("Oblique and Equatorial
 * Stereographic"), in exact form. The sphere's inverse follows Snyder (1987, USGS Professional
 * Paper 1395, eqs. 20-14 to 20-18), written without trigonometric functions of the angular
 * distance.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import { sinCosDegrees } from '../readings/trig.js';
import { root, toDegrees } from './internal.js';
import {
  forwardWith,
  fromIsometric,
  inverseWith,
  isometric,
  latitudeTerms,
  outside,
  prepared,
  type GeographicPoint,
  type MethodImpl,
  type PreparedProjection,
  type ProjectedPoint,
  type Projection,
  type ProjectionParams,
} from './projection-core.js';

interface Stereo<T> {
  readonly n: T;
  /** ½ ln c: the conformal sphere's isometric latitude is nψ + g */
  readonly g: T;
  /** 2 R k0 */
  readonly twoRk: T;
  readonly sChi0: T;
  readonly cChi0: T;
  readonly a: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
}

/** sin and cos of the latitude whose isometric latitude on a sphere is x: tanh x and sech x. */
function gudermann<T>(A: Arithmetic<T>, x: T): { s: T; c: T } {
  const u = A.exp(A.neg(A.abs(x)));
  const u2 = A.mul(u, u);
  const den = A.add(A.one, u2);
  const s = A.div(A.sub(A.one, u2), den);
  return { s: A.sign(x) < 0 ? A.neg(s) : s, c: A.div(A.mul(A.from(2), u), den) };
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): Stereo<T> {
  const t = latitudeTerms(A, p.e2, p.lat0!);
  const psi0 = isometric(A, p.e, t.s, t.c);
  if (psi0 === undefined)
    throw invalidArgument(
      `${where}(projection.lat0)`,
      'an origin at a pole is the polar case: use polar-stereographic-a',
    );
  const one = A.one;
  const oneMinusE2 = A.sub(one, p.e2);
  // R = √(ρ0 ν0) = a √(1 − e²)/(1 − e² sin²φ0); n = √(1 + e² cos⁴φ0/(1 − e²)) (GN 7-2 §3.2.7.1)
  const W2 = A.mul(t.W, t.W);
  const R = A.div(A.mul(p.a, root(A, oneMinusE2)), W2);
  const c2 = A.mul(t.c, t.c);
  const n = root(A, A.add(one, A.div(A.mul(p.e2, A.mul(c2, c2)), oneMinusE2)));
  // c = (n + sin φ0)(1 − sin χ0′)/((n − sin φ0)(1 + sin χ0′)) with sin χ0′ = (w1 − 1)/(w1 + 1),
  // w1 = e^(2nψ0): ln c = ln((n + sin φ0)/(n − sin φ0)) − 2nψ0 (GN 7-2 §3.2.7.1)
  const g = A.sub(A.div(A.log(A.div(A.add(n, t.s), A.sub(n, t.s))), A.from(2)), A.mul(n, psi0));
  const chi0 = gudermann(A, A.add(A.mul(n, psi0), g));
  return {
    n,
    g,
    twoRk: A.mul(A.from(2), A.mul(R, p.k0!)),
    sChi0: chi0.s,
    cChi0: chi0.c,
    a: p.a,
    e: p.e,
    e2: p.e2,
    tol: p.tol,
  };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Stereo<T>;
  const t = latitudeTerms(A, c.e2, lat);
  const psi = isometric(A, c.e, t.s, t.c);
  const chi =
    psi === undefined
      ? { s: A.from(A.sign(t.s)), c: A.zero }
      : gudermann(A, A.add(A.mul(c.n, psi), c.g));
  // Λ − Λ0 = n(λ − λ0); B = 1 + sin χ sin χ0 + cos χ cos χ0 cos(Λ − Λ0) (GN 7-2 §3.2.7.1)
  const d = sinCosDegrees(A, A.mul(c.n, dlon));
  const B = A.add(A.add(A.one, A.mul(chi.s, c.sChi0)), A.mul(A.mul(chi.c, c.cChi0), d.cos));
  if (A.sign(B) <= 0)
    throw outside(
      `${where}(point)`,
      'the antipode of the origin lies at infinity in a stereographic projection',
    );
  const x = A.div(A.mul(c.twoRk, A.mul(chi.c, d.sin)), B);
  const y = A.div(
    A.mul(c.twoRk, A.sub(A.mul(chi.s, c.cChi0), A.mul(A.mul(chi.c, c.sChi0), d.cos))),
    B,
  );
  // k = (2 R k0/B) · n R cos χ/(ν cos φ)/R: the sphere's stereographic scale times the conformal
  // sphere's (derived from ∂(E, N)/∂λ); 0 at the poles, where the double projection is singular.
  const kk = A.isZero(t.c)
    ? A.zero
    : A.div(A.mul(A.mul(c.twoRk, c.n), A.mul(chi.c, t.W)), A.mul(A.mul(B, c.a), t.c));
  // γ = atan2(∂N/∂λ, ∂E/∂λ) = atan2(sin Δ (sin χ0 + sin χ), cos Δ (1 + sin χ sin χ0) + cos χ cos χ0) (derived)
  const gamma = toDegrees(
    A,
    A.atan2(
      A.mul(d.sin, A.add(c.sChi0, chi.s)),
      A.add(A.mul(d.cos, A.add(A.one, A.mul(chi.s, c.sChi0))), A.mul(chi.c, c.cChi0)),
    ),
  );
  return { x, y, k: kk, gamma };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Stereo<T>;
  // The sphere's inverse (Snyder 1987, eqs. 20-14, 20-15) with τ = ρ/(2 R k0) = tan(c/2):
  // sin c = 2τ/(1 + τ²), cos c = (1 − τ²)/(1 + τ²); q = sin c/ρ = 2/(2Rk0 (1 + τ²)).
  const tx = A.div(x, c.twoRk);
  const ty = A.div(y, c.twoRk);
  const tau2 = A.add(A.mul(tx, tx), A.mul(ty, ty));
  const den = A.add(A.one, tau2);
  const cosC = A.div(A.sub(A.one, tau2), den);
  const q = A.div(A.from(2), den); // sin c/τ
  // sin χ = cos c sin χ0 + (y/ρ) sin c cos χ0; Λ − Λ0 = atan2(x sin c, ρ cos χ0 cos c − y sin χ0 sin c)
  const sChi = A.add(A.mul(cosC, c.sChi0), A.mul(A.mul(ty, q), c.cChi0));
  const dLambda = A.atan2(A.mul(tx, q), A.sub(A.mul(c.cChi0, cosC), A.mul(A.mul(ty, c.sChi0), q)));
  const dlon = A.div(toDegrees(A, dLambda), c.n);
  if (A.cmp(A.abs(sChi), A.one) >= 0) {
    const lat = A.from(A.sign(sChi) * 90);
    return { lat, dlon, ...scales(A, c, lat, dlon, where) };
  }
  // ψ = (atanh(sin χ) − g)/n, then φ from ψ (GN 7-2 §3.2.7.1)
  const psiS = A.div(A.log(A.div(A.add(A.one, sChi), A.sub(A.one, sChi))), A.from(2));
  const f = fromIsometric(A, c.e, A.div(A.sub(psiS, c.g), c.n), c.tol, where);
  return { lat: f.lat, dlon, ...scales(A, c, f.lat, dlon, where) };
}

function scales<T>(A: Arithmetic<T>, c: Stereo<T>, lat: T, dlon: T, where: string) {
  const f = forward(A, c, lat, dlon, where);
  return { k: f.k, gamma: f.gamma };
}

/** The Oblique Stereographic formulas: needs lat0, lon0, k0. @internal */
export const OBLIQUE_STEREOGRAPHIC: MethodImpl = {
  needs: ['lat0', 'lon0', 'k0'],
  takes: [],
  prepare,
  forward,
  inverse,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'oblique-stereographic') return OBLIQUE_STEREOGRAPHIC;
  throw invalidArgument(
    where,
    `this function projects 'oblique-stereographic', not ${show(method)}`,
  );
};

/**
 * Oblique Stereographic (`'oblique-stereographic'`: `lat0`, `lon0`, `k0`): latitude and
 * longitude to grid coordinates with the point scale factor and the convergence (IOGP GN 7-2
 * §3.2.7.1, exact form).
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, convergence }` (k is 0 at the poles, where the double projection is singular)
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the antipode of the origin; `INVALID_ARGUMENT`
 *   for an origin at a pole; as `toGrid`.
 * @example
 * ```ts
 * import { float, obliqueStereographic, defineEllipsoid } from 'quadspread';
 * // IOGP GN 7-2 §3.2.7.1 example: Amersfoort / RD New
 * const bessel = defineEllipsoid({ a: '6377397.155', invF: '299.1528128' });
 * const rd = { method: 'oblique-stereographic', ellipsoid: bessel, lat0: `52°09'22.178"`, lon0: `5°23'15.500"`, k0: '0.9999079', falseEasting: 155000, falseNorthing: 463000 } as const;
 * const g = obliqueStereographic(float, { lat: 53, lon: 6 }, rd);
 * [g.E.toFixed(3), g.N.toFixed(3)];
 * //=> ['196105.283', '557057.739']
 * ```
 */
export function obliqueStereographic<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'obliqueStereographic');
  return forwardWith(
    A,
    prepared(A, projection, pick, 'obliqueStereographic'),
    point,
    'obliqueStereographic',
  );
}

/**
 * Oblique Stereographic grid coordinates back to latitude and longitude (IOGP GN 7-2
 * §3.2.7.1; the sphere's inverse after Snyder 1987, the latitude by iteration on the isometric
 * latitude).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link obliqueStereographic}
 * @returns `{ lat, lon, k, convergence }`
 * @throws {QuadspreadError} as {@link obliqueStereographic}; `NOT_CONVERGED`.
 * @example
 * ```ts
 * import { float, obliqueStereographicInverse, defineEllipsoid } from 'quadspread';
 * const bessel = defineEllipsoid({ a: '6377397.155', invF: '299.1528128' });
 * const rd = { method: 'oblique-stereographic', ellipsoid: bessel, lat0: `52°09'22.178"`, lon0: `5°23'15.500"`, k0: '0.9999079', falseEasting: 155000, falseNorthing: 463000 } as const;
 * const p = obliqueStereographicInverse(float, { E: 196105.283, N: 557057.739 }, rd);
 * [p.lat.toFixed(7), p.lon.toFixed(7)];
 * //=> ['53.0000000', '6.0000000']
 * ```
 */
export function obliqueStereographicInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'obliqueStereographicInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'obliqueStereographicInverse'),
    point,
    'obliqueStereographicInverse',
  );
}
