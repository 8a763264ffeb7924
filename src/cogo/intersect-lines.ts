/**
 * Intersection of two lines given by two points each.
 *
 * @module cogo
 */
import { QuadspreadError, coincidentPoints, checkArithmetic } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { readPoint } from './internal.js';
import type { Point } from '../geometry/point.js';
import type { PointInput } from './internal.js';

/**
 * The point where line P1P2 meets line P3P4, exact in `rational`.
 *
 * Points are `{ x, y }` with x = east, y = north. The lines are infinite: the
 * intersection may lie beyond the segments. Solved by Cramer's rule on
 * P1 + t·(P2 − P1) = P3 + u·(P4 − P3), so in `rational` the point lies on both lines
 * exactly.
 *
 * @param A the arithmetic
 * @param P1 a point of the first line
 * @param P2 another point of the first line
 * @param P3 a point of the second line
 * @param P4 another point of the second line
 * @returns the intersection `{ x, y }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when P1 = P2 or P3 = P4 (no line);
 * `PARALLEL_LINES` when the lines are parallel or the same line; `INVALID_ARGUMENT` /
 * `INVALID_NUMBER` for bad points.
 * @example
 * ```ts
 * import { rational, intersectLines } from 'quadspread';
 * const p = intersectLines(rational, { x: 0, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 3 }, { x: 3, y: 0 });
 * [rational.toString(p.x), rational.toString(p.y)];
 * //=> ['3/2', '3/2']
 * ```
 */
export function intersectLines<T>(
  A: Arithmetic<T, boolean>,
  P1: PointInput<T>,
  P2: PointInput<T>,
  P3: PointInput<T>,
  P4: PointInput<T>,
): Point<T> {
  checkArithmetic(A, 'intersectLines');
  const where = 'intersectLines(A, P1, P2, P3, P4)';
  const a = readPoint(A, P1, `${where} P1`);
  const b = readPoint(A, P2, `${where} P2`);
  const c = readPoint(A, P3, `${where} P3`);
  const d = readPoint(A, P4, `${where} P4`);
  const d1x = A.sub(b.x, a.x);
  const d1y = A.sub(b.y, a.y);
  const d2x = A.sub(d.x, c.x);
  const d2y = A.sub(d.y, c.y);
  if (A.isZero(d1x) && A.isZero(d1y)) {
    throw coincidentPoints(
      where,
      `P1 and P2 are the same point (${A.toString(a.x)}, ${A.toString(a.y)}): they fix no line`,
    );
  }
  if (A.isZero(d2x) && A.isZero(d2y)) {
    throw coincidentPoints(
      where,
      `P3 and P4 are the same point (${A.toString(c.x)}, ${A.toString(c.y)}): they fix no line`,
    );
  }
  // Cramer's rule: t = ((P3 − P1) × d2) / (d1 × d2), with u × v = uₓv_y − u_yvₓ.
  const den = A.sub(A.mul(d1x, d2y), A.mul(d1y, d2x));
  if (A.isZero(den)) {
    throw new QuadspreadError(
      'PARALLEL_LINES',
      where,
      'line P1P2 and line P3P4 are parallel (or the same line): they have no single intersection',
    );
  }
  const ex = A.sub(c.x, a.x);
  const ey = A.sub(c.y, a.y);
  const t = A.div(A.sub(A.mul(ex, d2y), A.mul(ey, d2x)), den);
  return { x: A.add(a.x, A.mul(t, d1x)), y: A.add(a.y, A.mul(t, d1y)) };
}
