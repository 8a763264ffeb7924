/**
 * Lambert Azimuthal Equal Area (EPSG method 9820): IOGP Guidance Note 7-2, "Lambert Azimuthal
 * Equal Area" — the oblique and equatorial aspects through the authalic latitude β, and the
 * polar aspects (origin at ±90°) by their own formulas — in exact form; the inverse latitude by
 * Newton's iteration on q (Snyder 1987, USGS PP 1395, eq. 3-16) instead of GN 7-2's series in
 * e², so it holds to the arithmetic's precision.
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

interface Laea<T> {
  /** 0 for the oblique and equatorial aspects, 1 or −1 for the north or south polar aspect */
  readonly polar: 0 | 1 | -1;
  readonly qP: T;
  /** Rq = a √(qP/2) */
  readonly Rq: T;
  /** D = a m0/(Rq cos β0) */
  readonly D: T;
  readonly sB0: T;
  readonly cB0: T;
  readonly a: T;
  readonly e: T;
  readonly e2: T;
  readonly tol: T;
}

function prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>): Laea<T> {
  const qP = authalicQ(A, p.e, p.e2, A.one);
  const Rq = A.mul(p.a, root(A, A.div(qP, A.from(2))));
  const o = latitudeTerms(A, p.e2, p.lat0!);
  const base = { qP, Rq, a: p.a, e: p.e, e2: p.e2, tol: p.tol };
  if (A.isZero(o.c))
    return {
      ...base,
      polar: A.sign(o.s) as 1 | -1,
      D: A.one,
      sB0: A.from(A.sign(o.s)),
      cB0: A.zero,
    };
  // sin β0 = q0/qP; D = a m0/(Rq cos β0) (GN 7-2)
  const sB0 = A.div(authalicQ(A, p.e, p.e2, o.s), qP);
  const cB0 = root(A, A.sub(A.one, A.mul(sB0, sB0)));
  const D = A.div(A.mul(p.a, A.div(o.c, o.W)), A.mul(Rq, cB0));
  return { ...base, polar: 0, D, sB0, cB0 };
}

function forward<T>(A: Arithmetic<T>, k: object, lat: T, dlon: T, where: string) {
  const c = k as Laea<T>;
  const t = latitudeTerms(A, c.e2, lat);
  const q = authalicQ(A, c.e, c.e2, t.s);
  const d = sinCosDegrees(A, dlon);
  if (c.polar !== 0) {
    // north: ρ = a √(qP − q), E = FE + ρ sin Δλ, N = FN − ρ cos Δλ; south: ρ = a √(qP + q),
    // N = FN + ρ cos Δλ (GN 7-2, polar aspects)
    if (A.isZero(t.c) && A.sign(t.s) !== c.polar)
      throw outside(`${where}(point)`, 'the antipode of the origin has no single image');
    const r2 = c.polar > 0 ? A.sub(c.qP, q) : A.add(c.qP, q);
    const rho = A.mul(c.a, root(A, A.sign(r2) < 0 ? A.zero : r2));
    const y = A.mul(rho, d.cos);
    // k = ρ/(a m) along the parallel, h = 1/k (equal area, meridians ⟂ parallels); 1 at the origin (derived)
    const kk = A.isZero(t.c) ? A.one : A.div(A.mul(rho, t.W), A.mul(c.a, t.c));
    return {
      x: A.mul(rho, d.sin),
      y: c.polar > 0 ? A.neg(y) : y,
      k: kk,
      h: A.div(A.one, kk),
      gamma: c.polar > 0 ? dlon : A.neg(dlon),
    };
  }
  if (A.isZero(t.c))
    throw outside(
      `${where}(point.lat)`,
      'the scale factors of an oblique azimuthal projection are not defined at the poles',
    );
  // sin β = q/qP; B = Rq √(2/(1 + sin β0 sin β + cos β0 cos β cos Δλ)) (GN 7-2)
  const sB = A.div(q, c.qP);
  const cB = root(A, A.sub(A.one, A.mul(sB, sB)));
  const S = A.add(A.add(A.one, A.mul(c.sB0, sB)), A.mul(A.mul(c.cB0, cB), d.cos));
  if (A.sign(S) <= 0)
    throw outside(`${where}(point)`, 'the antipode of the origin has no single image');
  const B = A.mul(c.Rq, root(A, A.div(A.from(2), S)));
  // E = FE + B D cos β sin Δλ; N = FN + (B/D)(cos β0 sin β − sin β0 cos β cos Δλ) (GN 7-2)
  const v = A.sub(A.mul(c.cB0, sB), A.mul(A.mul(c.sB0, cB), d.cos));
  const x = A.mul(A.mul(B, c.D), A.mul(cB, d.sin));
  const y = A.div(A.mul(B, v), c.D);
  // Scale factors from the partial derivatives of E, N (derived): with S_Δ = −cos β0 cos β sin Δλ,
  // B_Δ = −B S_Δ/(2S); S_β = sin β0 cos β − cos β0 sin β cos Δλ, B_β = −B S_β/(2S).
  const two = A.from(2);
  const BD = A.div(A.mul(B, A.mul(A.mul(c.cB0, cB), d.sin)), A.mul(two, S));
  const Sb = A.sub(A.mul(c.sB0, cB), A.mul(A.mul(c.cB0, sB), d.cos));
  const Bb = A.neg(A.div(A.mul(B, Sb), A.mul(two, S)));
  const ED = A.mul(A.mul(c.D, cB), A.add(A.mul(BD, d.sin), A.mul(B, d.cos)));
  const ND = A.div(A.add(A.mul(BD, v), A.mul(A.mul(B, A.mul(c.sB0, cB)), d.sin)), c.D);
  const Eb = A.mul(A.mul(c.D, d.sin), A.sub(A.mul(Bb, cB), A.mul(B, sB)));
  const Nb = A.div(
    A.add(A.mul(Bb, v), A.mul(B, A.add(A.mul(c.cB0, cB), A.mul(A.mul(c.sB0, sB), d.cos)))),
    c.D,
  );
  // k = |∂(E, N)/∂λ|/(ν cos φ); h = |∂(E, N)/∂β| dβ/dφ/ρ = |∂(E, N)/∂β| · 2 cos φ/(a qP cos β W)
  const kk = A.div(A.mul(root(A, A.add(A.mul(ED, ED), A.mul(ND, ND))), t.W), A.mul(c.a, t.c));
  const hh = A.div(
    A.mul(A.mul(root(A, A.add(A.mul(Eb, Eb), A.mul(Nb, Nb))), two), t.c),
    A.mul(A.mul(c.a, c.qP), A.mul(cB, t.W)),
  );
  // γ: the grid bearing of the meridian's image is −γ: γ = atan2(−∂E/∂φ, ∂N/∂φ) (derived)
  return { x, y, k: kk, h: hh, gamma: toDegrees(A, A.atan2(A.neg(Eb), Nb)) };
}

function inverse<T>(A: Arithmetic<T>, k: object, x: T, y: T, where: string) {
  const c = k as Laea<T>;
  let q: T;
  let dlon: T;
  if (c.polar !== 0) {
    const rr = A.div(A.add(A.mul(x, x), A.mul(y, y)), A.mul(c.a, c.a));
    const qq = A.sub(c.qP, rr);
    if (A.cmp(qq, A.neg(c.qP)) < 0)
      throw outside(`${where}(point)`, 'the point is beyond the antipode of the origin');
    q = c.polar > 0 ? qq : A.neg(qq);
    dlon = A.isZero(rr) ? A.zero : toDegrees(A, A.atan2(x, c.polar > 0 ? A.neg(y) : y));
  } else {
    // ρ = √((x/D)² + (D y)²); sin(C/2) = ρ/(2Rq); sin β′ = cos C sin β0 + D y sin C cos β0/ρ;
    // Δλ = atan2(x sin C, D ρ cos β0 cos C − D² y sin β0 sin C) (GN 7-2), divided through by ρ
    const xd = A.div(x, c.D);
    const yd = A.mul(y, c.D);
    const rho2 = A.add(A.mul(xd, xd), A.mul(yd, yd));
    const s2 = A.div(rho2, A.mul(A.mul(A.from(4), c.Rq), c.Rq)); // sin²(C/2)
    if (A.cmp(s2, A.one) > 0)
      throw outside(`${where}(point)`, 'the point is beyond the antipode of the origin');
    const cosC = A.sub(A.one, A.mul(A.from(2), s2));
    const sinCOverRho = A.div(root(A, A.sub(A.one, s2)), c.Rq); // sin C/ρ
    const sB = A.add(A.mul(cosC, c.sB0), A.mul(A.mul(yd, sinCOverRho), c.cB0));
    q = A.mul(c.qP, sB);
    dlon = A.isZero(rho2)
      ? A.zero
      : toDegrees(
          A,
          A.atan2(
            A.mul(x, sinCOverRho),
            A.sub(A.mul(A.mul(c.D, c.cB0), cosC), A.mul(A.mul(A.mul(c.D, yd), c.sB0), sinCOverRho)),
          ),
        );
  }
  const f = fromAuthalicQ(A, c.e, c.e2, q, c.qP, c.tol, where);
  if (c.polar === 0 && A.isZero(f.c))
    throw outside(
      `${where}(point)`,
      'the scale factors of an oblique azimuthal projection are not defined at the poles',
    );
  const r = forward(A, c, f.lat, dlon, where);
  return { lat: f.lat, dlon, k: r.k, h: r.h, gamma: r.gamma };
}

/** The Lambert Azimuthal Equal Area formulas: needs lat0, lon0. @internal */
export const LAEA: MethodImpl = { needs: ['lat0', 'lon0'], takes: [], prepare, forward, inverse };

const pick = (method: unknown, where: string): MethodImpl => {
  if (method === 'lambert-azimuthal-equal-area') return LAEA;
  throw invalidArgument(
    where,
    `this function projects 'lambert-azimuthal-equal-area', not ${show(method)}`,
  );
};

/**
 * Lambert Azimuthal Equal Area (`'lambert-azimuthal-equal-area'`: `lat0`, `lon0`): latitude and
 * longitude to grid coordinates, with the scale factors along the parallel (k) and the meridian
 * (h) and the convergence. IOGP GN 7-2, exact form, oblique, equatorial and polar aspects.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }` in the projection's angle unit; longitude from Greenwich
 * @param projection the projection or a prepared one
 * @returns `{ E, N, k, h, convergence }`
 * @throws {QuadspreadError} `OUTSIDE_DOMAIN` at the antipode of the origin (and, in the
 *   oblique aspects, at the poles, where the scale factors along meridian and parallel are not
 *   defined); as `toGrid`.
 * @example
 * ```ts
 * import { float, lambertAzimuthalEqualArea } from 'quadspread';
 * // IOGP GN 7-2 example: ETRS89 / ETRS-LAEA (EPSG 3035)
 * const laea = { method: 'lambert-azimuthal-equal-area', ellipsoid: 'GRS80', lat0: 52, lon0: 10, falseEasting: 4321000, falseNorthing: 3210000 } as const;
 * const g = lambertAzimuthalEqualArea(float, { lat: 50, lon: 5 }, laea);
 * [g.E.toFixed(2), g.N.toFixed(2)];
 * //=> ['3962799.45', '2999718.85']
 * ```
 */
export function lambertAzimuthalEqualArea<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  checkArithmetic(A, 'lambertAzimuthalEqualArea');
  return forwardWith(
    A,
    prepared(A, projection, pick, 'lambertAzimuthalEqualArea'),
    point,
    'lambertAzimuthalEqualArea',
  );
}

/**
 * Lambert Azimuthal Equal Area grid coordinates back to latitude and longitude (IOGP GN 7-2;
 * the latitude by Newton's iteration, Snyder 1987 eq. 3-16).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link lambertAzimuthalEqualArea}
 * @returns `{ lat, lon, k, h, convergence }`
 * @throws {QuadspreadError} as {@link lambertAzimuthalEqualArea}; `NOT_CONVERGED`.
 * @example
 * ```ts
 * import { float, lambertAzimuthalEqualAreaInverse } from 'quadspread';
 * const laea = { method: 'lambert-azimuthal-equal-area', ellipsoid: 'GRS80', lat0: 52, lon0: 10, falseEasting: 4321000, falseNorthing: 3210000 } as const;
 * const p = lambertAzimuthalEqualAreaInverse(float, { E: 3962799.45, N: 2999718.85 }, laea);
 * [p.lat.toFixed(7), p.lon.toFixed(7)];
 * //=> ['50.0000000', '5.0000000']
 * ```
 */
export function lambertAzimuthalEqualAreaInverse<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'lambertAzimuthalEqualAreaInverse');
  return inverseWith(
    A,
    prepared(A, projection, pick, 'lambertAzimuthalEqualAreaInverse'),
    point,
    'lambertAzimuthalEqualAreaInverse',
  );
}
