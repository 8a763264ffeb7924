/**
 * One entry to every map projection: `toGrid` and `fromGrid` dispatch on `projection.method`;
 * `prepareProjection` reads a projection once so that nothing is recomputed per point.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show, checkArithmetic } from '../errors.js';
import {
  originXiOf,
  tmTwinConstants,
  transverseMercatorFrom,
  transverseMercatorInverse,
} from './grid.js';
import { readEllipsoid } from './ellipsoid.js';
import { FLOAT_TM } from './projection-float.js';
import { LCC_1SP, LCC_2SP } from './lambert-conic.js';
import { MERCATOR_1SP, MERCATOR_2SP } from './mercator.js';
import { OBLIQUE_STEREOGRAPHIC } from './oblique-stereographic.js';
import { POLAR_STEREOGRAPHIC_A, POLAR_STEREOGRAPHIC_B } from './polar-stereographic.js';
import { CASSINI } from './cassini-soldner.js';
import { ALBERS } from './albers.js';
import { LAEA } from './lambert-azimuthal.js';
import {
  forwardPreparedFloat,
  forwardWith,
  inverseWith,
  prepared,
  prepareWith,
  type GeographicPoint,
  type MethodImpl,
  type PreparedProjection,
  type ProjectedPoint,
  type Projection,
  type ProjectionParams,
} from './projection-core.js';

/** Transverse Mercator through the existing Krüger-series implementation (grid.ts). */
interface Tm<T> {
  readonly tm: { lon0: never; lat0: never; k0: never; ellipsoid: ProjectionParams<T>['ellipsoid'] };
  /** ξ of the true origin, computed once (undefined: computed per point, as before) */
  readonly xi0: T | undefined;
}

const TM: MethodImpl = {
  needs: ['lon0'],
  takes: ['lat0', 'k0'],
  prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>): Tm<T> {
    const lat0 = p.lat0 ?? A.zero;
    return {
      tm: {
        lon0: A.zero as never,
        lat0: lat0 as never,
        k0: (p.k0 ?? A.one) as never,
        ellipsoid: p.ellipsoid,
      },
      xi0: A.exact ? undefined : originXiOf(A, p.ellipsoid, lat0),
    };
  },
  forward<T>(A: Arithmetic<T>, c: object, lat: T, dlon: T) {
    const r = transverseMercatorFrom(A, { lat, lon: dlon }, (c as Tm<T>).tm, (c as Tm<T>).xi0);
    return { x: r.E, y: r.N, k: r.k, gamma: r.convergence };
  },
  inverse<T>(A: Arithmetic<T>, c: object, x: T, y: T) {
    const r = transverseMercatorInverse(A, { E: x, N: y }, (c as Tm<T>).tm);
    return { lat: r.lat, dlon: r.lon, k: r.k, gamma: r.convergence };
  },
  floatKind: FLOAT_TM,
  floatConstants<T>(A: Arithmetic<T>, c: object): readonly number[] | undefined {
    const tm = (c as Tm<T>).tm;
    try {
      return tmTwinConstants(
        A,
        readEllipsoid(tm.ellipsoid, 'prepareProjection'),
        tm.lat0,
        tm.k0,
      ).map(Number);
    } catch {
      return undefined; // the generic code decides, point by point
    }
  },
};

const METHODS: Readonly<Record<string, MethodImpl>> = {
  'transverse-mercator': TM,
  'lambert-conic-1sp': LCC_1SP,
  'lambert-conic-2sp': LCC_2SP,
  'mercator-1sp': MERCATOR_1SP,
  'mercator-2sp': MERCATOR_2SP,
  'oblique-stereographic': OBLIQUE_STEREOGRAPHIC,
  'polar-stereographic-a': POLAR_STEREOGRAPHIC_A,
  'polar-stereographic-b': POLAR_STEREOGRAPHIC_B,
  'cassini-soldner': CASSINI,
  'albers-equal-area': ALBERS,
  'lambert-azimuthal-equal-area': LAEA,
};

function methodOf(method: unknown, where: string): MethodImpl {
  if (typeof method === 'string' && Object.hasOwn(METHODS, method)) return METHODS[method]!;
  throw new QuadspreadError(
    'UNKNOWN_METHOD',
    where,
    `${show(method)} is not a known projection method (${Object.keys(METHODS).join(', ')})`,
  );
}

/**
 * Reads and checks a projection once for an arithmetic and computes its constants, so that
 * projecting many points recomputes nothing per point. Every projection function accepts the
 * result in place of the projection object.
 *
 * @param A the arithmetic
 * @param projection `{ method, ellipsoid, …parameters }` (see {@link toGrid})
 * @returns the prepared projection (frozen), usable with `A` only
 * @throws {QuadspreadError} `UNKNOWN_METHOD`; `MISSING_PARAMETER`; `INVALID_ARGUMENT` for a
 *   parameter the method does not use or values that define no projection; `UNKNOWN_ELLIPSOID`;
 *   `INVALID_UNIT`; `INVALID_ANGLE`.
 * @example
 * ```ts
 * import { float, prepareProjection, toGrid } from 'quadspread';
 * const lambert93 = prepareProjection(float, { method: 'lambert-conic-2sp', ellipsoid: 'GRS80', lat0: 46.5, lon0: 3, lat1: 49, lat2: 44, falseEasting: 700000, falseNorthing: 6600000 });
 * const g = toGrid(float, { lat: 46.5, lon: 3 }, lambert93);
 * [g.E, g.N.toFixed(6)];
 * //=> [700000, '6600000.000000']
 * ```
 */
export function prepareProjection<T>(
  A: Arithmetic<T>,
  projection: Projection,
): PreparedProjection<T> {
  checkArithmetic(A, 'prepareProjection');
  const where = 'prepareProjection';
  const m = methodOf(
    (projection as Partial<Projection> | null)?.method,
    `${where}(projection.method)`,
  );
  return prepareWith(A, projection, m, where);
}

/**
 * Geodetic latitude and longitude to grid coordinates in any of the supported projections,
 * chosen by `projection.method`: `'transverse-mercator'`, `'lambert-conic-1sp'`,
 * `'lambert-conic-2sp'`, `'mercator-1sp'`, `'mercator-2sp'`, `'oblique-stereographic'`,
 * `'polar-stereographic-a'`, `'polar-stereographic-b'`, `'cassini-soldner'`,
 * `'albers-equal-area'`, `'lambert-azimuthal-equal-area'` (see docs/geodesy.md for each
 * method's parameters, source and domain).
 *
 * The point's longitude is counted from Greenwich; `lon0` from the projection's
 * `primeMeridian`. Angles are in `projection.angleUnit`, grid coordinates in
 * `projection.linearUnit`. Axis order is the caller's business: some published grids list
 * northing first.
 *
 * @param A the arithmetic
 * @param point `{ lat, lon }`
 * @param projection `{ method, ellipsoid, lat0?, lon0?, lat1?, lat2?, k0?, falseEasting?,
 *   falseNorthing?, primeMeridian?, angleUnit?, linearUnit? }` or a prepared projection
 * @returns `{ E, N, k, convergence }` (and `h` for the equal-area and Cassini methods)
 * @throws {QuadspreadError} `UNKNOWN_METHOD`; `OUTSIDE_DOMAIN` for a point the method cannot
 *   project; `LATITUDE_OUT_OF_RANGE`; `MISSING_PARAMETER`; and as {@link prepareProjection}.
 * @example
 * ```ts
 * import { float, toGrid } from 'quadspread';
 * // UTM zone 31N: 3° E on the equator is (500000, 0)
 * const g = toGrid(float, { lat: 0, lon: 3 }, { method: 'transverse-mercator', ellipsoid: 'WGS84', lon0: 3, k0: 0.9996, falseEasting: 500000 });
 * [g.E, g.N];
 * //=> [500000, 0]
 * ```
 */
export function toGrid<T>(
  A: Arithmetic<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): ProjectedPoint<T> {
  // float with a prepared projection and a point of plain numbers: the float twin
  // (projection-float.ts), before anything else, so that this function stays small enough to
  // be inlined and its result object can be optimised away.
  if (
    (A as { float64?: unknown } | null | undefined)?.float64 === true &&
    forwardPreparedFloat(A, projection, point, ENKG)
  )
    return { E: ENKG[0], N: ENKG[1], k: ENKG[2], convergence: ENKG[3] } as ProjectedPoint<T>;
  checkArithmetic(A, 'toGrid');
  return forwardWith(A, prepared(A, projection, methodOf, 'toGrid'), point, 'toGrid');
}

/** E, N, k, γ of the float twin's call in progress (read before any other call). */
const ENKG = /* @__PURE__ */ new Float64Array(4);

/**
 * Grid coordinates back to geodetic latitude and longitude, in any supported projection (see
 * {@link toGrid}).
 *
 * @param A the arithmetic
 * @param point `{ E, N }` in the projection's linear unit
 * @param projection as for {@link toGrid}
 * @returns `{ lat, lon, k, convergence }` (and `h` for the equal-area and Cassini methods);
 *   latitude and longitude (from Greenwich) in the projection's angle unit
 * @throws {QuadspreadError} as {@link toGrid}; `NOT_CONVERGED` if an iteration fails.
 * @example
 * ```ts
 * import { float, fromGrid } from 'quadspread';
 * const p = fromGrid(float, { E: 500000, N: 0 }, { method: 'transverse-mercator', ellipsoid: 'WGS84', lon0: 3, k0: 0.9996, falseEasting: 500000 });
 * [p.lat, p.lon];
 * //=> [0, 3]
 * ```
 */
export function fromGrid<T>(
  A: Arithmetic<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  projection: Projection | PreparedProjection<T>,
): GeographicPoint<T> {
  checkArithmetic(A, 'fromGrid');
  return inverseWith(A, prepared(A, projection, methodOf, 'fromGrid'), point, 'fromGrid');
}
