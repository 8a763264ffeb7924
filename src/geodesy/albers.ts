/**
 * Albers Equal Area (EPSG method 9822): IOGP Guidance Note 7-2, "Albers Equal Area" (after
 * Snyder 1987, USGS Professional Paper 1395, ch. 14), exact form; the inverse latitude by
 * Newton's iteration (Snyder eq. 3-16) instead of GN 7-2's series in e², so it holds to the
 * arithmetic's precision.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import { sinCosDegrees } from '../readings/trig.js';
import { root, toDegrees } from './internal.js';
import { authalicQ, fromAuthalicQ } from './authalic.js';
import {
  forwardWith,
  inverseWith,
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

interface Albers<T> {
  readonly n: T;
  readonly C: T;
  readonly rho0: T;
  readonly qP: T;
  readonly sign: 1 | -1;
  readonly a: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
}

/** ρ = a √(C − nα)/n (GN 7-2), refusing C − nα < 0. */
function rhoOf<T>(A: Arithmetic<T>, c: Omit<Albers<T>, 'rho0'>, q: T, where: string): T {
  const r = A.sub(c.C, A.mul(c.n, q));
  if (A.sign(r) < 0)
    throw outside(where, 'the point is beyond the range of these standard parallels');
  return A.div(A.mul(c.a, root(A, r)), c.n);
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): Albers<T> {
  const at = (k: string) => `${where}(projection.${k})`;
  const t1 = latitudeTerms(A, p.e2, p.lat1!);
  const t2 = latitudeTerms(A, p.e2, p.lat2!);
  if (A.isZero(t1.c) || A.isZero(t2.c))
    throw invalidArgument(at('lat1'), 'a standard parallel at a pole does not define a cone');
  const m1 = A.div(t1.c, t1.W);
  const m2 = A.div(t2.c, t2.W);
  const q1 = authalicQ(A, p.e, p.e2, t1.s);
  const q2 = authalicQ(A, p.e, p.e2, t2.s);
  // n = (m1² − m2²)/(α2 − α1), or sin φ1 when φ1 = φ2; C = m1² + n α1 (GN 7-2)
  const n = A.eq(q1, q2) ? t1.s : A.div(A.sub(A.mul(m1, m1), A.mul(m2, m2)), A.sub(q2, q1));
  if (A.isZero(n))
    throw invalidArgument(
      at('lat2'),
      'standard parallels symmetric about the equator do not define a cone',
    );
  const C = A.add(A.mul(m1, m1), A.mul(n, q1));
  const base = {
    n,
    C,
    qP: authalicQ(A, p.e, p.e2, A.one),
    sign: A.sign(n) as 1 | -1,
    a: p.a,
    e: p.e,
    e2: p.e2,
    tol: p.tol,
  };
  const o = latitudeTerms(A, p.e2, p.lat0!);
  return { ...base, rho0: rhoOf(A, base, authalicQ(A, p.e, p.e2, o.s), at('lat0')) };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Albers<T>;
  const t = latitudeTerms(A, c.e2, lat);
  if (A.isZero(t.c))
    throw outside(
      `${where}(point.lat)`,
      'the scale factors of an Albers projection are not finite at the poles',
    );
  const rho = rhoOf(A, c, authalicQ(A, c.e, c.e2, t.s), `${where}(point)`);
  // θ = n(λ − λ0); E = EF + ρ sin θ, N = NF + ρ0 − ρ cos θ (GN 7-2)
  const theta = A.mul(c.n, dlon);
  const d = sinCosDegrees(A, theta);
  // k = ρ n/(a m) along the parallel, h = 1/k along the meridian (Snyder 1987, eqs. 14-15, 14-16)
  const kk = A.div(A.mul(A.mul(rho, c.n), t.W), A.mul(c.a, t.c));
  return {
    x: A.mul(rho, d.sin),
    y: A.sub(c.rho0, A.mul(rho, d.cos)),
    k: kk,
    h: A.div(A.one, kk),
    gamma: theta,
  };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Albers<T>;
  const Y = A.sub(c.rho0, y);
  const sgn = c.sign < 0 ? A.neg(A.one) : A.one;
  const rho = A.mul(sgn, root(A, A.add(A.mul(x, x), A.mul(Y, Y))));
  // α′ = (C − ρ′² n²/a²)/n; θ′ = atan2(±x, ±Y) with the sign of n (GN 7-2)
  const rn = A.div(A.mul(rho, c.n), c.a);
  const q = A.div(A.sub(c.C, A.mul(rn, rn)), c.n);
  if (A.cmp(A.abs(q), c.qP) > 0)
    throw outside(`${where}(point)`, 'the point is beyond the pole of this Albers projection');
  const f = fromAuthalicQ(A, c.e, c.e2, q, c.qP, c.tol, where);
  if (A.isZero(f.c))
    throw outside(
      `${where}(point)`,
      'the scale factors of an Albers projection are not finite at the poles',
    );
  const theta = toDegrees(A, A.atan2(A.mul(sgn, x), A.mul(sgn, Y)));
  const dlon = A.div(theta, c.n);
  const r = forward(A, c, f.lat, dlon, where);
  return { lat: f.lat, dlon, k: r.k, h: r.h, gamma: r.gamma };
}

/** The Albers Equal Area formulas: needs lat1, lat2, lat0, lon0 (false origin). @internal */
export const ALBERS: MethodImpl = {
  needs: ['lat0', 'lon0', 'lat1', 'lat2'],
  takes: [],
  prepare,
  forward,
  inverse,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'albers-equal-area') return ALBERS;
  throw invalidArgument(where, `this function projects 'albers-equal-area', not ${show(method)}`);
};

/**
 * Albers Equal Area (`'albers-equal-area'`: `lat1`, `lat2` the standard parallels, `lat0`, `lon0`
 * the false origin): latitude and longitude to grid coordinates, with the scale factors along
 * the parallel (k) and the meridian (h = 1/k) and the convergence. IOGP GN 7-2, exact form.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, h, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the poles; `INVALID_ARGUMENT` for standard
 *   parallels that define no cone; as `toGrid`.
 * @example
 * ```ts
 * import { float, albersEqualArea, defineEllipsoid } from 'quadspread';
 * // Snyder 1987, USGS PP 1395, p. 292: Clarke 1866, standard parallels 29.5° and 45.5°
 * const clarke1866 = defineEllipsoid({ a: 6378206.4, b: 6356583.8 });
 * const usa = { method: 'albers-equal-area', ellipsoid: clarke1866, lat1: 29.5, lat2: 45.5, lat0: 23, lon0: -96 } as const;
 * const g = albersEqualArea(float, { lat: 35, lon: -75 }, usa);
 * [g.E.toFixed(1), g.N.toFixed(1)];
 * //=> ['1885472.7', '1535925.0']
 * ```
 */
export function albersEqualArea<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'albersEqualArea');
  return forwardWith(A, prepared(A, projection, pick, 'albersEqualArea'), point, 'albersEqualArea');
}

/**
 * Albers Equal Area grid coordinates back to latitude and longitude (IOGP GN 7-2; the latitude
 * by Newton's iteration, Snyder 1987 eq. 3-16).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link albersEqualArea}
 * @returns `{ lat, lon, k, h, convergence }`
 * @throws {QuadspreadError} as {@link albersEqualArea}; `NOT_CONVERGED`.
 * @example
 * ```ts
 * import { float, albersEqualAreaInverse, defineEllipsoid } from 'quadspread';
 * const clarke1866 = defineEllipsoid({ a: 6378206.4, b: 6356583.8 });
 * const usa = { method: 'albers-equal-area', ellipsoid: clarke1866, lat1: 29.5, lat2: 45.5, lat0: 23, lon0: -96 } as const;
 * const p = albersEqualAreaInverse(float, { E: 0, N: 0 }, usa);
 * [p.lat.toFixed(9), p.lon];
 * //=> ['23.000000000', -96]
 * ```
 */
export function albersEqualAreaInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'albersEqualAreaInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'albersEqualAreaInverse'),
    point,
    'albersEqualAreaInverse',
  );
}
