/**
 * Lines of the plane as proportions ⟨a : b : c⟩, the line ax + by + c = 0.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, coincidentPoints, degenerateLine, checkArithmetic } from '../errors.js';
import { asPoint, type Point, type PointLike } from './point.js';
import { atMostOne, finiteResult, readNumber, checkPoint, checkLine } from './validate.js';

/**
 * The line ⟨a : b : c⟩: the points with a·x + b·y + c = 0 (x east, y north), a and b
 * not both zero. Proportional triples are the same line; functions here never assume a
 * particular scaling.
 *
 * @example
 * ```ts
 * import { float, isOnLine } from 'quadspread';
 * isOnLine(float, { x: 2, y: 1 }, { a: 1, b: -2, c: 0 });
 * //=> true
 * ```
 */
export interface Line<T> {
  /** Coefficient of x. */
  readonly a: T;
  /** Coefficient of y. */
  readonly b: T;
  /** Constant term. */
  readonly c: T;
}

/**
 * Makes the line ⟨a : b : c⟩, a·x + b·y + c = 0.
 *
 * @param A the arithmetic
 * @param a coefficient of x
 * @param b coefficient of y
 * @param c constant term
 * @returns the line `{ a, b, c }`
 * @throws {QuadspreadError} `DEGENERATE_LINE` when a = b = 0; `INVALID_NUMBER` for unreadable input.
 * @example
 * ```ts
 * import { rational, line } from 'quadspread';
 * const l = line(rational, 1, -1, '1/2');
 * [rational.toString(l.a), rational.toString(l.b), rational.toString(l.c)];
 * //=> ['1', '-1', '1/2']
 * ```
 */
export function line<T>(A: Arithmetic<T>, a: Numeric<T>, b: Numeric<T>, c: Numeric<T>): Line<T> {
  checkArithmetic(A, 'line');
  const w = 'line(A, a, b, c)';
  const l = {
    a: readNumber(A, a, w, ' a'),
    b: readNumber(A, b, w, ' b'),
    c: readNumber(A, c, w, ' c'),
  };
  if (A.isZero(l.a) && A.isZero(l.b)) {
    throw degenerateLine(
      w,
      `a and b are both zero (c = ${show(A.toString(l.c))}), which is no line`,
    );
  }
  return l;
}

/**
 * The line through two distinct points P and Q:
 * ⟨y_P − y_Q : x_Q − x_P : x_P·y_Q − x_Q·y_P⟩.
 *
 * @param A the arithmetic
 * @param P a point
 * @param Q another point
 * @returns the line PQ
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when P = Q; `NOT_FINITE` in float when c overflows
 *   (coordinates beyond about 1e154).
 * @example
 * ```ts
 * import { rational, point, lineThrough } from 'quadspread';
 * const l = lineThrough(rational, point(rational, 0, 1), point(rational, 2, 3));
 * [rational.toString(l.a), rational.toString(l.b), rational.toString(l.c)];
 * //=> ['-2', '2', '-2']
 * ```
 */
export function lineThrough<T>(A: Arithmetic<T>, P: PointLike<T>, Q: PointLike<T>): Line<T> {
  checkArithmetic(A, 'lineThrough');
  const Pp = asPoint(P);
  const Qp = asPoint(Q);
  checkPoint(A, Pp, 'lineThrough(P)');
  checkPoint(A, Qp, 'lineThrough(Q)');
  // Line through two points: the cross product of their homogeneous coordinates (x, y, 1) (common practice; derived).
  const where = 'lineThrough(A, P, Q)';
  const a = finiteResult(A.sub(Pp.y, Qp.y), where);
  const b = finiteResult(A.sub(Qp.x, Pp.x), where);
  if (A.isZero(a) && A.isZero(b)) {
    throw coincidentPoints(
      where,
      `P and Q coincide at (${show(A.toString(Pp.x))}, ${show(A.toString(Pp.y))})`,
    );
  }
  return { a, b, c: finiteResult(A.sub(A.mul(Pp.x, Qp.y), A.mul(Qp.x, Pp.y)), where) };
}

/**
 * Whether the point P lies on the line l (exactly in `rational`; in `float` and
 * `decimal` only when the rounded a·x + b·y + c is exactly zero).
 *
 * @param A the arithmetic
 * @param P the point
 * @param l the line
 * @returns a·x + b·y + c = 0
 * @throws Never: P and l are values of the arithmetic already.
 * @example
 * ```ts
 * import { rational, point, line, isOnLine } from 'quadspread';
 * isOnLine(rational, point(rational, 1, 2), line(rational, 2, -1, 0));
 * //=> true
 * ```
 */
export function isOnLine<T>(A: Arithmetic<T>, P: PointLike<T>, l: Line<T>): boolean {
  checkArithmetic(A, 'isOnLine');
  const Pp = asPoint(P);
  checkPoint(A, Pp, 'isOnLine(P)');
  checkLine(A, l, 'isOnLine(l)');
  return A.isZero(A.add(A.add(A.mul(l.a, Pp.x), A.mul(l.b, Pp.y)), l.c));
}

/**
 * Whether two lines are parallel (or equal): a₁b₂ − a₂b₁ = 0.
 *
 * @param A the arithmetic
 * @param l1 the first line
 * @param l2 the second line
 * @returns true when they are parallel
 * @throws Never: the lines are values of the arithmetic already.
 * @example
 * ```ts
 * import { rational, line, isParallel } from 'quadspread';
 * isParallel(rational, line(rational, 1, 2, 3), line(rational, 2, 4, -1));
 * //=> true
 * ```
 */
export function isParallel<T>(A: Arithmetic<T>, l1: Line<T>, l2: Line<T>): boolean {
  checkArithmetic(A, 'isParallel');
  checkLine(A, l1, 'isParallel(l1)');
  checkLine(A, l2, 'isParallel(l2)');
  // Parallel lines: the normals (a1, b1), (a2, b2) are proportional, a1 b2 − a2 b1 = 0 (common practice; derived).
  return A.isZero(A.sub(A.mul(l1.a, l2.b), A.mul(l2.a, l1.b)));
}

/**
 * Whether two lines are perpendicular: a₁a₂ + b₁b₂ = 0.
 *
 * @param A the arithmetic
 * @param l1 the first line
 * @param l2 the second line
 * @returns true when they are perpendicular
 * @throws Never: the lines are values of the arithmetic already.
 * @example
 * ```ts
 * import { rational, line, isPerpendicular } from 'quadspread';
 * isPerpendicular(rational, line(rational, 1, 2, 3), line(rational, 2, -1, 7));
 * //=> true
 * ```
 */
export function isPerpendicular<T>(A: Arithmetic<T>, l1: Line<T>, l2: Line<T>): boolean {
  checkArithmetic(A, 'isPerpendicular');
  checkLine(A, l1, 'isPerpendicular(l1)');
  checkLine(A, l2, 'isPerpendicular(l2)');
  // Perpendicular lines: the normals are perpendicular, a1 a2 + b1 b2 = 0 (common practice; derived).
  return A.isZero(A.add(A.mul(l1.a, l2.a), A.mul(l1.b, l2.b)));
}

/**
 * The foot of the perpendicular from P to the line l:
 * F = P − ((a·x + b·y + c)/(a² + b²))·(a, b). Exact in `rational`.
 *
 * @param A the arithmetic
 * @param P the point
 * @param l the line
 * @returns the point F of l nearest P (F = P when P is on l)
 * @throws {QuadspreadError} `DEGENERATE_LINE` when a = b = 0.
 * @example
 * ```ts
 * import { rational, point, line, footOfPerpendicular } from 'quadspread';
 * const F = footOfPerpendicular(rational, point(rational, 0, 0), line(rational, 1, 1, -2));
 * [rational.toString(F.x), rational.toString(F.y)];
 * //=> ['1', '1']
 * ```
 */
export function footOfPerpendicular<T>(A: Arithmetic<T>, P: PointLike<T>, l: Line<T>): Point<T> {
  checkArithmetic(A, 'footOfPerpendicular');
  const Pp = asPoint(P);
  checkPoint(A, Pp, 'footOfPerpendicular(P)');
  checkLine(A, l, 'footOfPerpendicular(l)');
  const n = A.add(A.mul(l.a, l.a), A.mul(l.b, l.b));
  if (A.isZero(n))
    throw degenerateLine('footOfPerpendicular(A, P, l)', 'l has a = b = 0, which is no line');
  // Orthogonal projection onto a·x + b·y + c = 0 (common practice; derived from the normal vector (a, b)).
  const k = A.div(A.add(A.add(A.mul(l.a, Pp.x), A.mul(l.b, Pp.y)), l.c), n);
  return { x: A.sub(Pp.x, A.mul(k, l.a)), y: A.sub(Pp.y, A.mul(k, l.b)) };
}

/**
 * The quadrance from the point P to the line l (the squared perpendicular distance):
 * (a·x + b·y + c)² / (a² + b²).
 *
 * @param A the arithmetic
 * @param P the point
 * @param l the line
 * @returns the quadrance, in square units
 * @throws {QuadspreadError} `DEGENERATE_LINE` when a = b = 0.
 * @example
 * ```ts
 * import { rational, point, line, quadranceToLine } from 'quadspread';
 * rational.toString(quadranceToLine(rational, point(rational, 0, 0), line(rational, 3, 4, -10)));
 * //=> '4'
 * ```
 */
export function quadranceToLine<T>(A: Arithmetic<T>, P: PointLike<T>, l: Line<T>): T {
  checkArithmetic(A, 'quadranceToLine');
  const Pp = asPoint(P);
  checkPoint(A, Pp, 'quadranceToLine(P)');
  checkLine(A, l, 'quadranceToLine(l)');
  const n = A.add(A.mul(l.a, l.a), A.mul(l.b, l.b));
  if (A.isZero(n))
    throw degenerateLine('quadranceToLine(A, P, l)', 'l has a = b = 0, which is no line');
  // Point-to-line distance |a·x + b·y + c|/√(a² + b²), squared (common practice; derived).
  const v = A.add(A.add(A.mul(l.a, Pp.x), A.mul(l.b, Pp.y)), l.c);
  return A.div(A.mul(v, v), n);
}

/**
 * The spread of two lines: (a₁b₂ − a₂b₁)² / ((a₁² + b₁²)(a₂² + b₂²)); 0 for parallel
 * lines, 1 for perpendicular ones.
 *
 * @param A the arithmetic
 * @param l1 the first line
 * @param l2 the second line
 * @returns the spread, in [0, 1]
 * @throws {QuadspreadError} `DEGENERATE_LINE` when a line has a = b = 0.
 * @example
 * ```ts
 * import { rational, line, spreadOfLines } from 'quadspread';
 * rational.toString(spreadOfLines(rational, line(rational, 0, 1, 0), line(rational, 3, -4, 1)));
 * //=> '9/25'
 * ```
 */
export function spreadOfLines<T>(A: Arithmetic<T>, l1: Line<T>, l2: Line<T>): T {
  checkArithmetic(A, 'spreadOfLines');
  checkLine(A, l1, 'spreadOfLines(l1)');
  checkLine(A, l2, 'spreadOfLines(l2)');
  const n1 = A.add(A.mul(l1.a, l1.a), A.mul(l1.b, l1.b));
  const n2 = A.add(A.mul(l2.a, l2.a), A.mul(l2.b, l2.b));
  if (A.isZero(n1))
    throw degenerateLine('spreadOfLines(A, l1, l2)', 'l1 has a = b = 0, which is no line');
  if (A.isZero(n2))
    throw degenerateLine('spreadOfLines(A, l1, l2)', 'l2 has a = b = 0, which is no line');
  // Spread of two lines: sin² of the angle between their normals (a1, b1), (a2, b2) (derived, as for two vectors).
  const c = A.sub(A.mul(l1.a, l2.b), A.mul(l2.a, l1.b));
  return atMostOne(A, A.div(A.mul(c, c), A.mul(n1, n2)));
}
