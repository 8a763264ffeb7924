/**
 * The inclined-plane fit of height differences between two height systems at common points.
 *
 * @module adjustment
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { leastSquares, mean, readCommonPoints, variance, type CommonPoint } from './fit-common.js';
import { checkArithmetic } from '../errors.js';

/** A fitted inclined plane Z − z = c + sx·(x − x0) + sy·(y − y0), with residuals. */
export interface InclinedPlaneFit<T> {
  /** the shift at the centroid (x0, y0), metres */
  readonly c: T;
  /** the slopes of the plane in x and y (metres per metre) */
  readonly sx: T;
  readonly sy: T;
  /** the centroid of the source points, where `c` applies */
  readonly x0: T;
  readonly y0: T;
  /** per point: observed Z − z minus fitted, metres */
  readonly residuals: { readonly name: string; readonly vz: T }[];
  /** Σ vz² */
  readonly sumSquares: T;
  /** variance of unit weight Σvz²/(n − 3), undefined for three points */
  readonly variance: T | undefined;
}

/**
 * Fits an inclined plane to the height differences Z − z between two height systems at
 * common points (a shift and two slopes, as local height transformations are commonly
 * modelled; common practice), by least squares with equal weights:
 * Z − z = c + sx·(x − x0) + sy·(y − y0), with (x0, y0) the centroid of the source points.
 * Exact in `rational`.
 *
 * @param A the arithmetic
 * @param points at least three `{ name?, from: { x, y, z }, to: { x, y, z } }`, not collinear
 *   (the plane is placed on the source x, y)
 * @returns `{ c, sx, sy, x0, y0, residuals, sumSquares, variance }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` with fewer than three points;
 *   `COLLINEAR_POINTS` when the points lie on a line; `INVALID_NUMBER` for a missing height.
 * @example
 * ```ts
 * import { rational, fitInclinedPlane } from 'quadspread';
 * // Z − z = 0.5 + 0.001·(x − 50) − 0.002·(y − 50)
 * const f = fitInclinedPlane(rational, [
 *   { from: { x: 0, y: 0, z: 10 }, to: { x: 0, y: 0, z: '10.55' } },
 *   { from: { x: 100, y: 0, z: 20 }, to: { x: 100, y: 0, z: '20.65' } },
 *   { from: { x: 0, y: 100, z: 30 }, to: { x: 0, y: 100, z: '30.35' } },
 *   { from: { x: 100, y: 100, z: 40 }, to: { x: 100, y: 100, z: '40.45' } },
 * ]);
 * [f.c, f.sx, f.sy, f.sumSquares].map((v) => rational.toString(v));
 * //=> ['1/2', '1/1000', '-1/500', '0']
 * ```
 */
export function fitInclinedPlane<T>(
  A: Arithmetic<T>,
  points: readonly CommonPoint<T>[],
): InclinedPlaneFit<T> {
  checkArithmetic(A, 'fitInclinedPlane');
  const where = 'fitInclinedPlane(points)';
  const P = readCommonPoints(A, points, 3, where, true);
  const x0 = mean(
    A,
    P.map((p) => p.x),
  );
  const y0 = mean(
    A,
    P.map((p) => p.y),
  );
  const rows = P.map((p) => [A.one, A.sub(p.x, x0), A.sub(p.y, y0)]);
  const l = P.map((p) => A.sub(p.Z!, p.z!));
  const r = leastSquares(
    A,
    3,
    rows,
    l,
    where,
    'the points are collinear: a plane needs three points not on a line',
  );
  const [c, sx, sy] = r.p as [T, T, T];
  return {
    c,
    sx,
    sy,
    x0,
    y0,
    residuals: P.map((p, i) => ({ name: p.name, vz: r.residuals[i]! })),
    sumSquares: r.vtv,
    variance: variance(A, r.vtv, P.length, 3),
  };
}
