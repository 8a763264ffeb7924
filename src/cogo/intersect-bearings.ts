/**
 * Intersection by bearings: the point seen from two stations on two bearings.
 *
 * @module cogo
 */
import { QuadspreadError, show, noRealSolution, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { sinCosDegrees } from '../readings/trig.js';
import { readAzimuth } from './bearing.js';
import { readPoint } from './internal.js';
import type { PointInput } from './internal.js';

/** What {@link intersectBearings} returns. */
export interface BearingIntersection<T> {
  /** The intersection point `{ x: east, y: north }`. */
  readonly point: Point<T>;
  /** Horizontal distance from P to the point along its bearing. */
  readonly distanceP: T;
  /** Horizontal distance from Q to the point along its bearing. */
  readonly distanceQ: T;
}

/**
 * Smallest sine of the angle between the two bearings accepted by {@link intersectBearings}
 * in an inexact arithmetic: 1e-12 (about 2e-7″). Below it the rays are treated as parallel.
 *
 * @example
 * ```ts
 * import { BEARING_PARALLEL_TOLERANCE } from 'quadspread';
 * BEARING_PARALLEL_TOLERANCE;
 * //=> 1e-12
 * ```
 */
export const BEARING_PARALLEL_TOLERANCE = 1e-12;

/**
 * The point where the ray from P on bearing `bearingP` meets the ray from Q on bearing
 * `bearingQ` (bearing–bearing intersection).
 *
 * Coordinates are x = east, y = north; bearings are azimuths clockwise from north
 * (degrees, DMS text) or quadrant bearings. Solves P + s·(sin θP, cos θP) =
 * Q + t·(sin θQ, cos θQ) by Cramer's rule; s and t are the distances along each ray and
 * must be positive: rays that meet only behind a station are refused rather than
 * silently extended. Exact where the sines and cosines are rational; otherwise within the
 * arithmetic's transcendental tolerance in `rational`.
 *
 * @param A the arithmetic
 * @param P the first station
 * @param bearingP bearing from P, clockwise from north
 * @param Q the second station
 * @param bearingQ bearing from Q, clockwise from north
 * @returns `{ point, distanceP, distanceQ }`
 * @throws {QuadspreadError} `PARALLEL_LINES` for parallel bearings (sine of the angle
 * between them below {@link BEARING_PARALLEL_TOLERANCE} in inexact arithmetics, zero in
 * exact ones); `NO_REAL_SOLUTION` when the rays meet behind P or Q; `INVALID_BEARING`;
 * `INVALID_ARGUMENT` / `INVALID_NUMBER` for bad points.
 * @example
 * ```ts
 * import { rational, intersectBearings } from 'quadspread';
 * const r = intersectBearings(rational, { x: 0, y: 0 }, 90, { x: 10, y: -10 }, 0);
 * [rational.toString(r.point.x), rational.toString(r.point.y), rational.toString(r.distanceP), rational.toString(r.distanceQ)];
 * //=> ['10', '0', '10', '10']
 * ```
 */
export function intersectBearings<T>(
  A: Arithmetic<T, boolean>,
  P: PointInput<T>,
  bearingP: Numeric<T>,
  Q: PointInput<T>,
  bearingQ: Numeric<T>,
): BearingIntersection<T> {
  checkArithmetic(A, 'intersectBearings');
  const where = 'intersectBearings(A, P, bearingP, Q, bearingQ)';
  const p = readPoint(A, P, `${where} P`);
  const q = readPoint(A, Q, `${where} Q`);
  const a = sinCosDegrees(A, readAzimuth(A, bearingP, `${where} bearingP`));
  const b = sinCosDegrees(A, readAzimuth(A, bearingQ, `${where} bearingQ`));
  // Unit directions (east, north) = (sin θ, cos θ); cross u × v = uₓv_y − u_yvₓ = sin(θQ − θP).
  const den = A.sub(A.mul(a.sin, b.cos), A.mul(a.cos, b.sin));
  const parallel = A.exact ? A.isZero(den) : Math.abs(A.toNumber(den)) < BEARING_PARALLEL_TOLERANCE;
  if (parallel) {
    throw new QuadspreadError(
      'PARALLEL_LINES',
      where,
      `bearings ${show(bearingP)} and ${show(bearingQ)} are parallel: the rays do not meet at one point`,
    );
  }
  const ex = A.sub(q.x, p.x);
  const ey = A.sub(q.y, p.y);
  // Cramer's rule: s = ((Q − P) × v)/(u × v), t = ((Q − P) × u)/(u × v).
  const s = A.div(A.sub(A.mul(ex, b.cos), A.mul(ey, b.sin)), den);
  const t = A.div(A.sub(A.mul(ex, a.cos), A.mul(ey, a.sin)), den);
  if (A.sign(s) < 0 || A.sign(t) < 0) {
    throw noRealSolution(
      where,
      `the rays meet behind ${A.sign(s) < 0 ? 'P' : 'Q'} (distance ${A.toPrecision(A.sign(s) < 0 ? s : t, 6)}): check the bearings`,
    );
  }
  return {
    point: { x: A.add(p.x, A.mul(s, a.sin)), y: A.add(p.y, A.mul(s, a.cos)) },
    distanceP: s,
    distanceQ: t,
  };
}
