/**
 * Lambert Conic Conformal, one standard parallel (EPSG method 9801, "variant A") and two
 * standard parallels (EPSG 9802): IOGP Guidance Note 7-2, §3.2.1.1 (2SP) and §3.2.1.2 (1SP),
 * in their exact (closed) form — no series, so the only error is the arithmetic's rounding and
 * the inverse latitude iteration's tolerance.
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
import { FLOAT_LCC } from './projection-float.js';

/** The constants of a Lambert conic: r = C e^(−nψ), r0 at the (false) origin. */
interface Lcc<T> {
  readonly n: T;
  readonly C: T;
  readonly r0: T;
  readonly a: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
  /** sign of n: the cone's apex is at the north (1) or south (−1) pole */
  readonly sign: 1 | -1;
}

/** m = cos φ/√(1 − e² sin²φ) and ψ at a latitude (GN 7-2 §3.2.1.1), refusing the poles. */
function parallel<T>(A: Arithmetic<T>, p: ProjectionParams<T>, lat: T, where: string) {
  const t = latitudeTerms(A, p.e2, lat);
  const psi = isometric(A, p.e, t.s, t.c);
  if (psi === undefined)
    throw invalidArgument(where, 'a standard parallel at a pole does not define a cone');
  return { m: A.div(t.c, t.W), psi, s: t.s };
}

/** r at latitude φ: C e^(−nψ); 0 at the apex pole, refused at the other. */
function radius<T>(A: Arithmetic<T>, c: Lcc<T>, s: T, co: T, where: string): T {
  const psi = isometric(A, c.e, s, co);
  if (psi === undefined) {
    if (A.sign(s) === c.sign) return A.zero;
    throw outside(where, 'the pole opposite the apex of the cone lies at infinity');
  }
  return A.mul(c.C, A.exp(A.neg(A.mul(c.n, psi))));
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): Lcc<T> {
  const at = (k: string) => `${where}(projection.${k})`;
  let n: T;
  let C: T;
  if (p.method === 'lambert-conic-1sp') {
    // n = sin φ0; r = a k0 F t^n with F = m0/(n t0^n): r = (a k0 m0/n) e^(−n(ψ − ψ0)) (GN 7-2 §3.2.1.2)
    const o = parallel(A, p, p.lat0!, at('lat0'));
    n = o.s;
    if (A.isZero(n))
      throw invalidArgument(
        at('lat0'),
        'a Lambert conic with its origin on the equator is a Mercator projection (use mercator-1sp)',
      );
    C = A.mul(A.div(A.mul(A.mul(p.a, p.k0!), o.m), n), A.exp(A.mul(n, o.psi)));
  } else {
    // n = (ln m1 − ln m2)/(ln t1 − ln t2), F = m1/(n t1^n), ln t = −ψ (GN 7-2 §3.2.1.1)
    const p1 = parallel(A, p, p.lat1!, at('lat1'));
    const p2 = parallel(A, p, p.lat2!, at('lat2'));
    n = A.eq(p1.psi, p2.psi) ? p1.s : A.div(A.sub(A.log(p1.m), A.log(p2.m)), A.sub(p2.psi, p1.psi));
    if (A.isZero(n))
      throw invalidArgument(
        at('lat2'),
        'standard parallels symmetric about the equator do not define a cone',
      );
    C = A.mul(A.div(A.mul(p.a, p1.m), n), A.exp(A.mul(n, p1.psi)));
  }
  const base = {
    n,
    C,
    a: p.a,
    e: p.e,
    e2: p.e2,
    tol: p.tol,
    sign: A.sign(n) as 1 | -1,
    r0: A.zero,
  };
  const o = sinCosDegrees(A, p.lat0!);
  return { ...base, r0: radius(A, base, o.sin, o.cos, at('lat0')) };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Lcc<T>;
  const t = latitudeTerms(A, c.e2, lat);
  if (A.isZero(t.c))
    throw outside(
      `${where}(point.lat)`,
      'the scale factor of a Lambert conic is not finite at the poles',
    );
  const r = radius(A, c, t.s, t.c, `${where}(point.lat)`);
  // θ = n(λ − λ0); E = FE + r sin θ, N = FN + r0 − r cos θ (GN 7-2 §3.2.1.1)
  const theta = A.mul(c.n, dlon);
  const { sin, cos } = sinCosDegrees(A, theta);
  // k = r n/(a m), m = cos φ/√(1 − e² sin²φ) (Snyder 1987, USGS PP 1395, eq. 15-4)
  const kk = A.div(A.mul(A.mul(r, c.n), t.W), A.mul(c.a, t.c));
  return { x: A.mul(r, sin), y: A.sub(c.r0, A.mul(r, cos)), k: kk, gamma: theta };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Lcc<T>;
  const Y = A.sub(c.r0, y);
  const rr = root(A, A.add(A.mul(x, x), A.mul(Y, Y)));
  if (A.isZero(rr))
    throw outside(
      `${where}(point)`,
      'the apex of the cone (a pole), where the scale factor is not finite',
    );
  // r′ = ±√(…) with the sign of n; θ′ = atan2(±x, ±Y); ψ = −ln(r′/(aF))/n (GN 7-2 §3.2.1.1)
  const sgn = c.sign < 0 ? A.neg(A.one) : A.one;
  const theta = toDegrees(A, A.atan2(A.mul(sgn, x), A.mul(sgn, Y)));
  const rSigned = A.mul(sgn, rr);
  const psi = A.div(A.log(A.div(c.C, rSigned)), c.n);
  const f = fromIsometric(A, c.e, psi, c.tol, where);
  const W = root(A, A.sub(A.one, A.mul(c.e2, A.mul(f.s, f.s))));
  const kk = A.div(A.mul(A.mul(rSigned, c.n), W), A.mul(c.a, f.c));
  return { lat: f.lat, dlon: A.div(theta, c.n), k: kk, gamma: theta };
}

/** The constants in the order the float twin reads them (projection-float.ts `lccForwardInto`). */
function floatConstants<T>(_A: Arithmetic<T>, k: object): readonly number[] {
  const c = k as Lcc<number>;
  return [c.e2, c.e, c.n, c.C, c.r0, c.a];
}

/** The Lambert Conic Conformal (1SP) formulas: needs lat0, lon0, k0. @internal */
export const LCC_1SP: MethodImpl = {
  needs: ['lat0', 'lon0', 'k0'],
  takes: [],
  prepare,
  forward,
  inverse,
  floatKind: FLOAT_LCC,
  floatConstants,
};
/** The Lambert Conic Conformal (2SP) formulas: needs lat0, lon0 (false origin), lat1, lat2. @internal */
export const LCC_2SP: MethodImpl = {
  needs: ['lat0', 'lon0', 'lat1', 'lat2'],
  takes: [],
  prepare,
  forward,
  inverse,
  floatKind: FLOAT_LCC,
  floatConstants,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'lambert-conic-1sp') return LCC_1SP;
  if (method === 'lambert-conic-2sp') return LCC_2SP;
  throw invalidArgument(
    where,
    `this function projects 'lambert-conic-1sp' or 'lambert-conic-2sp', not ${show(method)}`,
  );
};

/**
 * Lambert Conic Conformal (1SP or 2SP): geodetic latitude and longitude to grid coordinates,
 * with the point scale factor and grid convergence (IOGP GN 7-2 §3.2.1, exact form).
 *
 * `lambert-conic-1sp` takes `lat0`, `lon0` (natural origin), `k0`; `lambert-conic-2sp` takes
 * `lat1`, `lat2` (standard parallels) and `lat0`, `lon0` (false origin); both take
 * `falseEasting`, `falseNorthing`, `primeMeridian`, `angleUnit`, `linearUnit`.
 *
 * @param A the arithmetic (`rational` runs the formulas in decimal with 50 digits)
 * @param point `{ lat, lon }`, in the projection's angle unit; longitude from Greenwich
 * @param projection the projection, or one made by `prepareProjection`
 * @returns `{ E, N, k, convergence }`: grid coordinates in the linear unit, the point scale
 *   factor, the convergence in degrees
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the poles; `LATITUDE_OUT_OF_RANGE`;
 *   `MISSING_PARAMETER`; `INVALID_ARGUMENT` for parameters that define no cone;
 *   `UNKNOWN_ELLIPSOID`; `INVALID_UNIT`.
 * @example
 * ```ts
 * import { float, lambertConic, defineEllipsoid } from 'quadspread';
 * // IOGP GN 7-2 §3.2.1.2 example: JAD69 / Jamaica National Grid
 * const clarke1866 = defineEllipsoid({ a: 6378206.4, b: 6356583.8 });
 * const jamaica = { method: 'lambert-conic-1sp', ellipsoid: clarke1866, lat0: 18, lon0: -77, k0: 1, falseEasting: 250000, falseNorthing: 150000 } as const;
 * const g = lambertConic(float, { lat: `17°55'55.80"N`, lon: `76°56'37.26"W` }, jamaica);
 * [g.E.toFixed(2), g.N.toFixed(2)];
 * //=> ['255966.58', '142493.51']
 * ```
 */
export function lambertConic<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'lambertConic');
  return forwardWith(A, prepared(A, projection, pick, 'lambertConic'), point, 'lambertConic');
}

/**
 * Lambert Conic Conformal (1SP or 2SP) grid coordinates back to latitude and longitude (IOGP
 * GN 7-2 §3.2.1, the latitude by the fixed-point iteration on the isometric latitude, to the
 * arithmetic's precision).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link lambertConic}
 * @returns `{ lat, lon, k, convergence }`: latitude and longitude (from Greenwich) in the
 *   projection's angle unit, the point scale factor, the convergence in degrees
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the apex of the cone; as {@link lambertConic}.
 * @example
 * ```ts
 * import { float, lambertConicInverse, defineEllipsoid } from 'quadspread';
 * const clarke1866 = defineEllipsoid({ a: 6378206.4, b: 6356583.8 });
 * const jamaica = { method: 'lambert-conic-1sp', ellipsoid: clarke1866, lat0: 18, lon0: -77, k0: 1, falseEasting: 250000, falseNorthing: 150000 } as const;
 * const p = lambertConicInverse(float, { E: 250000, N: 150000 }, jamaica);
 * [p.lat.toFixed(9), p.lon.toFixed(9)];
 * //=> ['18.000000000', '-77.000000000']
 * ```
 */
export function lambertConicInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'lambertConicInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'lambertConicInverse'),
    point,
    'lambertConicInverse',
  );
}
