/**
 * Batch kinds that use the solvers (added to the `inverses` kind of the batch command).
 *
 * @module cli
 */
import { heightFromReading, point, sqrtOf, triangle, verticalFromAngle } from '../../index.js';
import type { Arithmetic } from '../../index.js';
import type { BatchKind } from '../batch.js';
import { batchValue } from '../batch-value.js';

function exactOr<V>(A: Arithmetic<V, boolean>, x: V, digits: number): string {
  return A.exact ? A.toString(x) : A.toPrecision(x, digits);
}

export const BATCH_EXTRA: Record<string, BatchKind> = {
  triangles: {
    description:
      'triangles by their vertices (x1, y1, x2, y2, x3, y3; x east, y north): quadrances, spreads and quadrea, exact in rational',
    columns: ['x1', 'y1', 'x2', 'y2', 'x3', 'y3'],
    outputs: ['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea'],
    row(A, [x1, y1, x2, y2, x3, y3], digits) {
      const t = triangle(A, point(A, x1!, y1!), point(A, x2!, y2!), point(A, x3!, y3!));
      return [t.Q1, t.Q2, t.Q3, t.s1, t.s2, t.s3, t.quadrea].map((v) => exactOr(A, v, digits));
    },
  },
  heights: {
    description:
      'heights from a horizontal distance and an elevation angle in degrees (horizontal, elevation): H = Q·R/(1 − R) and the signed height',
    columns: ['horizontal', 'elevation'],
    nonNegative: ['horizontal'],
    outputs: ['H', 'height'],
    row(A, [d, e], digits) {
      const v = verticalFromAngle(A, e!);
      const H = heightFromReading(A, { horizontal: A.mul(d!, d!), vertical: v });
      const h = sqrtOf(A, H);
      const text = batchValue(A, h, digits);
      return [
        A.toPrecision(H, digits),
        v.sign < 0 && !text.startsWith('-') && text !== '0' ? `-${text}` : text,
      ];
    },
  },
};
