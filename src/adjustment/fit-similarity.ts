/**
 * The plane similarity (four-parameter Helmert) transformation fitted to common points by
 * least squares.
 *
 * @module adjustment
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { toDegrees } from '../geodesy/internal.js';
import { leastSquares, mean, readCommonPoints, variance, type CommonPoint } from './fit-common.js';
import { checkArithmetic } from '../errors.js';

/** A fitted similarity X = a·x − b·y + tx, Y = b·x + a·y + ty, with residuals. */
export interface SimilarityFit<T> {
  /** a = m cos θ (exact in `rational`). */
  readonly a: T;
  /** b = m sin θ (exact in `rational`). */
  readonly b: T;
  /** translations, metres */
  readonly tx: T;
  readonly ty: T;
  /** the scale squared m² = a² + b² (exact in `rational`: a quadrance ratio) */
  readonly scaleSquared: T;
  /** the spread of the rotation, sin²θ = b²/(a² + b²) (exact in `rational`) */
  readonly rotationSpread: T;
  /** the rotation θ in degrees, counter-clockwise from the source x axis to the target's */
  readonly rotation: T;
  /** per point: observed target minus fitted, metres */
  readonly residuals: { readonly name: string; readonly vx: T; readonly vy: T }[];
  /** Σ(vx² + vy²) */
  readonly sumSquares: T;
  /** variance of unit weight Σv²/(2n − 4), undefined for two points (no redundancy) */
  readonly variance: T | undefined;
}

/**
 * Fits the plane similarity transformation (four-parameter Helmert: scale, rotation and two
 * translations) X = a·x − b·y + tx, Y = b·x + a·y + ty to common points by least squares with
 * equal weights (e.g. Ghilani & Wolf, *Adjustment Computations*, 4th ed. 2006, §18.3 "Two
 * dimensional conformal coordinate transformation"). The model is linear in a, b, tx, ty, so
 * the solution is direct; it is computed about the centroid of the source points for
 * conditioning, and exact in `rational`.
 *
 * @param A the arithmetic
 * @param points at least two `{ name?, from: { x, y }, to: { x, y } }`
 * @returns `{ a, b, tx, ty, scaleSquared, rotationSpread, rotation, residuals, sumSquares, variance }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` with fewer than two points; `COLLINEAR_POINTS`
 *   when the source points coincide; `INVALID_NUMBER`, `INVALID_ARGUMENT` for bad points.
 * @example
 * ```ts
 * import { rational, fitSimilarity } from 'quadspread';
 * // X = 2x − y + 10, Y = x + 2y − 5 at three points: recovered exactly, no residuals
 * const f = fitSimilarity(rational, [
 *   { from: { x: 0, y: 0 }, to: { x: 10, y: -5 } },
 *   { from: { x: 1, y: 0 }, to: { x: 12, y: -4 } },
 *   { from: { x: 0, y: 1 }, to: { x: 9, y: -3 } },
 * ]);
 * [f.a, f.b, f.tx, f.ty, f.scaleSquared, f.rotationSpread, f.sumSquares].map((v) => rational.toString(v));
 * //=> ['2', '1', '10', '-5', '5', '1/5', '0']
 * ```
 */
export function fitSimilarity<T>(
  A: Arithmetic<T>,
  points: readonly CommonPoint<T>[],
): SimilarityFit<T> {
  checkArithmetic(A, 'fitSimilarity');
  const where = 'fitSimilarity(points)';
  const P = readCommonPoints(A, points, 2, where, false);
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
  for (const p of P) {
    const x = A.sub(p.x, cx);
    const y = A.sub(p.y, cy);
    rows.push([x, A.neg(y), A.one, A.zero]); // X = a·x − b·y + tx′
    l.push(p.X);
    rows.push([y, x, A.zero, A.one]); // Y = b·x + a·y + ty′
    l.push(p.Y);
  }
  const r = leastSquares(A, 4, rows, l, where, 'the source points coincide: no rotation or scale');
  const [a, b, t1, t2] = r.p as [T, T, T, T];
  // back from the centroid: tx = tx′ − a·cx + b·cy, ty = ty′ − b·cx − a·cy
  const tx = A.add(A.sub(t1, A.mul(a, cx)), A.mul(b, cy));
  const ty = A.sub(A.sub(t2, A.mul(b, cx)), A.mul(a, cy));
  const m2 = A.add(A.mul(a, a), A.mul(b, b));
  return {
    a,
    b,
    tx,
    ty,
    scaleSquared: m2,
    rotationSpread: A.div(A.mul(b, b), m2),
    rotation: toDegrees(A, A.atan2(b, a)),
    residuals: P.map((p, i) => ({
      name: p.name,
      vx: r.residuals[2 * i]!,
      vy: r.residuals[2 * i + 1]!,
    })),
    sumSquares: r.vtv,
    variance: variance(A, r.vtv, 2 * P.length, 4),
  };
}
