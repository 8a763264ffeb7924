/**
 * Polar Stereographic, variant A (EPSG method 9810: origin at a pole with scale k0) and variant B
 * (EPSG 9829: true scale on a standard parallel φc): IOGP Guidance Note 7-2, §3.2.7.2, exact
 * form, with t = e^∓ψ (ψ the isometric latitude) in place of GN 7-2's tan(π/4 ∓ φ/2)·(…)^(e/2).
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

interface Polar<T> {
  /** 1 for the north pole, −1 for the south */
  readonly pole: 1 | -1;
  readonly k0: T;
  /** 2 a k0/√((1 + e)^(1+e) (1 − e)^(1−e)): ρ = this · t */
  readonly scale: T;
  readonly a: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
}

/** t = e^(−ψ) towards the north pole, e^ψ towards the south; 0 at the centre pole. */
function tOf<T>(A: Arithmetic<T>, e: T, s: T, c: T, pole: 1 | -1, where: string): T {
  const psi = isometric(A, e, s, c);
  if (psi === undefined) {
    if (A.sign(s) === pole) return A.zero;
    throw outside(
      where,
      'the pole opposite the origin lies at infinity in a polar stereographic projection',
    );
  }
  return A.exp(pole > 0 ? A.neg(psi) : psi);
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): Polar<T> {
  const one = A.one;
  // √((1 + e)^(1+e) (1 − e)^(1−e)) = exp(((1 + e) ln(1 + e) + (1 − e) ln(1 − e))/2) (GN 7-2 §3.2.7.2)
  const ope = A.add(one, p.e);
  const ome = A.sub(one, p.e);
  const K = A.isZero(p.e)
    ? one
    : A.exp(A.div(A.add(A.mul(ope, A.log(ope)), A.mul(ome, A.log(ome))), A.from(2)));
  let pole: 1 | -1;
  let k0: T;
  if (p.method === 'polar-stereographic-a') {
    const s = A.sign(p.lat0!);
    if (!A.eq(A.abs(p.lat0!), A.from(90)))
      throw invalidArgument(
        `${where}(projection.lat0)`,
        'polar stereographic variant A has its origin at a pole (lat0 = ±90)',
      );
    pole = s as 1 | -1;
    k0 = p.k0!;
  } else {
    // k0 = mc √((1 + e)^(1+e)(1 − e)^(1−e))/(2 tc), mc = cos φc/√(1 − e² sin²φc) (GN 7-2 §3.2.7.2, variant B)
    const s = A.sign(p.lat1!);
    if (s === 0)
      throw invalidArgument(
        `${where}(projection.lat1)`,
        'the standard parallel of a polar stereographic projection cannot be the equator',
      );
    pole = s as 1 | -1;
    const t = latitudeTerms(A, p.e2, p.lat1!);
    if (A.isZero(t.c)) k0 = one;
    else {
      const tc = tOf(A, p.e, t.s, t.c, pole, `${where}(projection.lat1)`);
      k0 = A.div(A.mul(A.div(t.c, t.W), K), A.mul(A.from(2), tc));
    }
  }
  return {
    pole,
    k0,
    scale: A.div(A.mul(A.from(2), A.mul(p.a, k0)), K),
    a: p.a,
    e: p.e,
    e2: p.e2,
    tol: p.tol,
  };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Polar<T>;
  const t = latitudeTerms(A, c.e2, lat);
  const rho = A.mul(c.scale, tOf(A, c.e, t.s, t.c, c.pole, `${where}(point.lat)`));
  const d = sinCosDegrees(A, dlon);
  // north: E = FE + ρ sin Δλ, N = FN − ρ cos Δλ; south: N = FN + ρ cos Δλ (GN 7-2 §3.2.7.2)
  const y = A.mul(rho, d.cos);
  // k = ρ/(a m) (Snyder 1987, eq. 21-32), k0 at the pole; γ = ±Δλ (derived: the meridians are radii)
  const kk = A.isZero(t.c) ? c.k0 : A.div(A.mul(rho, t.W), A.mul(c.a, t.c));
  return {
    x: A.mul(rho, d.sin),
    y: c.pole > 0 ? A.neg(y) : y,
    k: kk,
    gamma: c.pole > 0 ? dlon : A.neg(dlon),
  };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Polar<T>;
  const rho = root(A, A.add(A.mul(x, x), A.mul(y, y)));
  if (A.isZero(rho)) return { lat: A.from(90 * c.pole), dlon: A.zero, k: c.k0, gamma: A.zero };
  // t′ = ρ′/scale; φ from ψ = ∓ln t′; λ = λ0 + atan2(E − FE, ∓(N − FN)) (GN 7-2 §3.2.7.2)
  const lnT = A.log(A.div(rho, c.scale));
  const f = fromIsometric(A, c.e, c.pole > 0 ? A.neg(lnT) : lnT, c.tol, where);
  const dlon = toDegrees(A, A.atan2(x, c.pole > 0 ? A.neg(y) : y));
  const W = root(A, A.sub(A.one, A.mul(c.e2, A.mul(f.s, f.s))));
  return {
    lat: f.lat,
    dlon,
    k: A.div(A.mul(rho, W), A.mul(c.a, f.c)),
    gamma: c.pole > 0 ? dlon : A.neg(dlon),
  };
}

/** Polar Stereographic variant A: needs lat0 (±90), lon0, k0. @internal */
export const POLAR_STEREOGRAPHIC_A: MethodImpl = {
  needs: ['lat0', 'lon0', 'k0'],
  takes: [],
  prepare,
  forward,
  inverse,
};
/** Polar Stereographic variant B: needs lat1 (the standard parallel), lon0. @internal */
export const POLAR_STEREOGRAPHIC_B: MethodImpl = {
  needs: ['lat1', 'lon0'],
  takes: [],
  prepare,
  forward,
  inverse,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'polar-stereographic-a') return POLAR_STEREOGRAPHIC_A;
  if (method === 'polar-stereographic-b') return POLAR_STEREOGRAPHIC_B;
  throw invalidArgument(
    where,
    `this function projects 'polar-stereographic-a' or 'polar-stereographic-b', not ${show(method)}`,
  );
};

/**
 * Polar Stereographic (variant A, `'polar-stereographic-a'`: `lat0` = ±90, `lon0`, `k0`;
 * variant B, `'polar-stereographic-b'`: `lat1` the standard parallel, whose sign chooses the
 * pole, and `lon0`): latitude and longitude to grid coordinates, with the point scale factor and
 * the convergence (±(λ − λ0)). IOGP GN 7-2 §3.2.7.2, exact form.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the opposite pole; `INVALID_ARGUMENT` for an
 *   origin off the pole (A) or a standard parallel on the equator (B); as `toGrid`.
 * @example
 * ```ts
 * import { float, polarStereographic } from 'quadspread';
 * // Universal Polar Stereographic, north zone (WGS 84): the pole is at (2000000, 2000000)
 * const ups = { method: 'polar-stereographic-a', ellipsoid: 'WGS84', lat0: 90, lon0: 0, k0: 0.994, falseEasting: 2000000, falseNorthing: 2000000 } as const;
 * const g = polarStereographic(float, { lat: 90, lon: 0 }, ups);
 * [g.E, g.N, g.k];
 * //=> [2000000, 2000000, 0.994]
 * ```
 */
export function polarStereographic<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'polarStereographic');
  return forwardWith(
    A,
    prepared(A, projection, pick, 'polarStereographic'),
    point,
    'polarStereographic',
  );
}

/**
 * Polar Stereographic (variant A or B) grid coordinates back to latitude and longitude (IOGP
 * GN 7-2 §3.2.7.2; the latitude by iteration on the isometric latitude).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link polarStereographic}
 * @returns `{ lat, lon, k, convergence }` (at the pole itself the longitude is `lon0`)
 * @throws {QuadspreadError} as {@link polarStereographic}; `NOT_CONVERGED`.
 * @example
 * ```ts
 * import { float, polarStereographicInverse } from 'quadspread';
 * const ups = { method: 'polar-stereographic-a', ellipsoid: 'WGS84', lat0: 90, lon0: 0, k0: 0.994, falseEasting: 2000000, falseNorthing: 2000000 } as const;
 * polarStereographicInverse(float, { E: 2000000, N: 2000000 }, ups).lat;
 * //=> 90
 * ```
 */
export function polarStereographicInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'polarStereographicInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'polarStereographicInverse'),
    point,
    'polarStereographicInverse',
  );
}
