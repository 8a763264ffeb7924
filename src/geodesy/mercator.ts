/**
 * Mercator, variant A ("1SP", EPSG method 9804: scale k0 on the equator) and variant B ("2SP",
 * EPSG 9805: true scale on the parallels ±φ1): IOGP Guidance Note 7-2, §3.2.3, in its exact
 * (closed) form — E = FE + a k0 (λ − λ0), N = FN + a k0 ψ with ψ the isometric latitude
 * (GN 7-2 writes a k0 ln(tan(π/4 + φ/2)((1 − e sin φ)/(1 + e sin φ))^(e/2)), the same ψ).
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import { toDegrees } from './internal.js';
import {
  forwardWith,
  fromIsometric,
  inverseWith,
  isometric,
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
import { FLOAT_MERCATOR } from './projection-float.js';

interface Merc<T> {
  /** a·k0 */
  readonly ak: T;
  readonly k0: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): Merc<T> {
  let k0: T;
  if (p.method === 'mercator-1sp') {
    if (p.lat0 !== undefined && !A.isZero(p.lat0))
      throw invalidArgument(
        `${where}(projection.lat0)`,
        'Mercator variant A has its natural origin on the equator (lat0 = 0); for a standard parallel use mercator-2sp',
      );
    k0 = p.k0!;
  } else {
    // k0 = cos φ1/√(1 − e² sin²φ1) (GN 7-2 §3.2.3, variant B)
    const t = latitudeTerms(A, p.e2, p.lat1!);
    if (A.isZero(t.c))
      throw invalidArgument(
        `${where}(projection.lat1)`,
        'a standard parallel at a pole gives no scale',
      );
    k0 = A.div(t.c, t.W);
  }
  return { ak: A.mul(p.a, k0), k0, e: p.e, e2: p.e2, tol: p.tol };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Merc<T>;
  const t = latitudeTerms(A, c.e2, lat);
  const psi = isometric(A, c.e, t.s, t.c);
  if (psi === undefined)
    throw outside(`${where}(point.lat)`, 'the poles lie at infinity in Mercator');
  // k = k0/m = k0 √(1 − e² sin²φ)/cos φ (Snyder 1987, USGS PP 1395, eq. 7-8)
  return {
    x: A.mul(c.ak, toRadians(A, dlon)),
    y: A.mul(c.ak, psi),
    k: A.div(A.mul(c.k0, t.W), t.c),
    gamma: A.zero,
  };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Merc<T>;
  // ψ = (N − FN)/(a k0), λ = λ0 + (E − FE)/(a k0) (GN 7-2 §3.2.3)
  const f = fromIsometric(A, c.e, A.div(y, c.ak), c.tol, where);
  const W = latitudeTerms(A, c.e2, f.lat).W;
  return {
    lat: f.lat,
    dlon: toDegrees(A, A.div(x, c.ak)),
    k: A.div(A.mul(c.k0, W), f.c),
    gamma: A.zero,
  };
}

/** The constants in the order the float twin reads them (projection-float.ts `mercatorInto`). */
function floatConstants<T>(_A: Arithmetic<T>, k: object): readonly number[] {
  const c = k as Merc<number>;
  return [c.e2, c.e, c.ak, c.k0];
}

/** Mercator variant A: needs lon0, k0 (lat0 may be given as 0). @internal */
export const MERCATOR_1SP: MethodImpl = {
  needs: ['lon0', 'k0'],
  takes: ['lat0'],
  prepare,
  forward,
  inverse,
  floatKind: FLOAT_MERCATOR,
  floatConstants,
};
/** Mercator variant B: needs lat1, lon0. @internal */
export const MERCATOR_2SP: MethodImpl = {
  needs: ['lat1', 'lon0'],
  takes: [],
  prepare,
  forward,
  inverse,
  floatKind: FLOAT_MERCATOR,
  floatConstants,
};

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'mercator-1sp') return MERCATOR_1SP;
  if (method === 'mercator-2sp') return MERCATOR_2SP;
  throw invalidArgument(
    where,
    `this function projects 'mercator-1sp' or 'mercator-2sp', not ${show(method)}`,
  );
};

/**
 * Mercator (variant A, `'mercator-1sp'`: `lon0`, `k0`; variant B, `'mercator-2sp'`: `lat1`,
 * `lon0`): latitude and longitude to grid coordinates, with the point scale factor (k0/m) and
 * the convergence (0). IOGP GN 7-2 §3.2.3, exact form.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the poles; `INVALID_ARGUMENT` for a
 *   variant A origin off the equator; as `toGrid`.
 * @example
 * ```ts
 * import { float, mercator, defineEllipsoid } from 'quadspread';
 * // IOGP GN 7-2 §3.2.3 example (variant B): Pulkovo 1942 / Caspian Sea Mercator
 * const krassowsky = defineEllipsoid({ a: 6378245, invF: '298.3' });
 * const caspian = { method: 'mercator-2sp', ellipsoid: krassowsky, lat1: 42, lon0: 51 } as const;
 * const g = mercator(float, { lat: 53, lon: 53 }, caspian);
 * [g.E.toFixed(2), g.N.toFixed(2)];
 * //=> ['165704.29', '5171848.07']
 * ```
 */
export function mercator<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'mercator');
  return forwardWith(A, prepared(A, projection, pick, 'mercator'), point, 'mercator');
}

/**
 * Mercator (variant A or B) grid coordinates back to latitude and longitude (IOGP GN 7-2
 * §3.2.3; the latitude by the fixed-point iteration on the isometric latitude).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link mercator}
 * @returns `{ lat, lon, k, convergence }`
 * @throws {QuadspreadError} as {@link mercator}; `NOT_CONVERGED` if the iteration fails.
 * @example
 * ```ts
 * import { float, mercatorInverse, defineEllipsoid } from 'quadspread';
 * const krassowsky = defineEllipsoid({ a: 6378245, invF: '298.3' });
 * const caspian = { method: 'mercator-2sp', ellipsoid: krassowsky, lat1: 42, lon0: 51 } as const;
 * const p = mercatorInverse(float, { E: 165704.29, N: 5171848.07 }, caspian);
 * [p.lat.toFixed(7), p.lon.toFixed(7)];
 * //=> ['53.0000000', '53.0000000']
 * ```
 */
export function mercatorInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'mercatorInverse');
  return inverseWith(A, prepared(A, projection, pick, 'mercatorInverse'), point, 'mercatorInverse');
}
