/**
 * The plane affine transformation (six parameters) fitted to common points by least squares.
 *
 * @module adjustment
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { leastSquares, mean, readCommonPoints, variance, type CommonPoint } from './fit-common.js';
import { checkArithmetic } from '../errors.js';

/** A fitted affine transformation X = a1·x + a2·y + tx, Y = b1·x + b2·y + ty, with residuals. */
export interface AffineFit<T> {
  readonly a1: T;
  readonly a2: T;
  readonly b1: T;
  readonly b2: T;
  /** translations, metres */
  readonly tx: T;
  readonly ty: T;
  /** per point: observed target minus fitted, metres */
  readonly residuals: { readonly name: string; readonly vx: T; readonly vy: T }[];
  /** Σ(vx² + vy²) */
  readonly sumSquares: T;
  /** variance of unit weight Σv²/(2n − 6), undefined for three points */
  readonly variance: T | undefined;
}

/**
 * Fits the plane affine transformation X = a1·x + a2·y + tx, Y = b1·x + b2·y + ty (two scales,
 * two rotations — or a rotation and a shear — and two translations) to common points by least
 * squares with equal weights (e.g. Ghilani & Wolf, *Adjustment Computations*, 4th ed. 2006,
 * §18.5 "Two-dimensional affine coordinate transformation"). Linear, solved directly about the
 * centroid of the source points; exact in `rational`.
 *
 * @param A the arithmetic
 * @param points at least three `{ name?, from: { x, y }, to: { x, y } }`, not collinear
 * @returns `{ a1, a2, b1, b2, tx, ty, residuals, sumSquares, variance }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` with fewer than three points;
 *   `COLLINEAR_POINTS` when the source points lie on a line; `INVALID_NUMBER`,
 *   `INVALID_ARGUMENT` for bad points.
 * @example
 * ```ts
 * import { rational, fitAffine } from 'quadspread';
 * // X = 2x + y + 1, Y = −x + 3y at four points: recovered exactly
 * const f = fitAffine(rational, [
 *   { from: { x: 0, y: 0 }, to: { x: 1, y: 0 } },
 *   { from: { x: 1, y: 0 }, to: { x: 3, y: -1 } },
 *   { from: { x: 0, y: 1 }, to: { x: 2, y: 3 } },
 *   { from: { x: 2, y: 2 }, to: { x: 7, y: 4 } },
 * ]);
 * [f.a1, f.a2, f.b1, f.b2, f.tx, f.ty, f.sumSquares].map((v) => rational.toString(v));
 * //=> ['2', '1', '-1', '3', '1', '0', '0']
 * ```
 */
export function fitAffine<T>(A: Arithmetic<T>, points: readonly CommonPoint<T>[]): AffineFit<T> {
  checkArithmetic(A, 'fitAffine');
  const where = 'fitAffine(points)';
  const P = readCommonPoints(A, points, 3, where, false);
  const cx = mean(
    A,
    P.map((p) => p.x),
  );
  const cy = mean(
    A,
    P.map((p) => p.y),
  );
  const rows: T[][] = [];
  const l: T[] = [];
  const O = A.zero;
  for (const p of P) {
    const x = A.sub(p.x, cx);
    const y = A.sub(p.y, cy);
    rows.push([x, y, A.one, O, O, O]);
    l.push(p.X);
    rows.push([O, O, O, x, y, A.one]);
    l.push(p.Y);
  }
  const r = leastSquares(
    A,
    6,
    rows,
    l,
    where,
    'the source points are collinear: an affine fit needs three points not on a line',
  );
  const [a1, a2, t1, b1, b2, t2] = r.p as [T, T, T, T, T, T];
  return {
    a1,
    a2,
    b1,
    b2,
    tx: A.sub(A.sub(t1, A.mul(a1, cx)), A.mul(a2, cy)),
    ty: A.sub(A.sub(t2, A.mul(b1, cx)), A.mul(b2, cy)),
    residuals: P.map((p, i) => ({
      name: p.name,
      vx: r.residuals[2 * i]!,
      vy: r.residuals[2 * i + 1]!,
    })),
    sumSquares: r.vtv,
    variance: variance(A, r.vtv, 2 * P.length, 6),
  };
}
