/**
 * The six measures of a triangle from its vertices.
 *
 * @module geometry
 */
import { checkPoints3, finiteResult } from './validate.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { QuadspreadError, show, coincidentPoints, checkArithmetic } from '../errors.js';
import { asPoint, type Point, type PointLike } from './point.js';

/**
 * The measures of a triangle A1 A2 A3: `Q1 = Q(A2, A3)` is the quadrance opposite A1,
 * `s1` the spread at A1 (likewise for 2 and 3), and `quadrea` = 16·area²
 * = (Q1 + Q2 + Q3)² − 2(Q1² + Q2² + Q3²). `V` is the value type: `T` from
 * {@link triangle}, `Root<T, E>` from {@link solveTriangle}.
 *
 * @example
 * ```ts
 * import { float, triangle } from 'quadspread';
 * const t = triangle(float, { x: 0, y: 0 }, { x: 3, y: 0 }, { x: 0, y: 4 });
 * [t.Q1, t.Q2, t.Q3, t.s1];
 * //=> [25, 16, 9, 1]
 * ```
 */
export interface Triangle<V> {
  /** Quadrance opposite A1: Q(A2, A3), square units. */
  Q1: V;
  /** Quadrance opposite A2: Q(A1, A3), square units. */
  Q2: V;
  /** Quadrance opposite A3: Q(A1, A2), square units. */
  Q3: V;
  /** Spread at A1, in (0, 1]. */
  s1: V;
  /** Spread at A2, in (0, 1]. */
  s2: V;
  /** Spread at A3, in (0, 1]. */
  s3: V;
  /** 16·area², square units squared. */
  quadrea: V;
}

/**
 * The quadrances, spreads and quadrea of the triangle with vertices A1, A2, A3.
 * Rational functions of the coordinates: exact in `rational`. With D = (A2 − A1) × (A3 − A1)
 * (twice the signed area), s1 = D²/(Q2·Q3), s2 = D²/(Q1·Q3), s3 = D²/(Q1·Q2) and
 * quadrea = 4·D². In `float` and `decimal` a spread that rounds above 1 is returned as 1.
 *
 * @param A the arithmetic
 * @param A1 first vertex
 * @param A2 second vertex
 * @param A3 third vertex
 * @returns `{ Q1, Q2, Q3, s1, s2, s3, quadrea }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when two vertices coincide;
 * `COLLINEAR_POINTS` when the three are collinear (no proper triangle); `NOT_FINITE` in float
 * when a quadrance overflows.
 * @example
 * ```ts
 * import { rational, point, triangle } from 'quadspread';
 * const t = triangle(rational, point(rational, 0, 0), point(rational, 4, 0), point(rational, 0, 3));
 * [t.Q1, t.s1, t.s2, t.s3, t.quadrea].map((v) => rational.toString(v));
 * //=> ['25', '1', '9/25', '16/25', '576']
 * ```
 */
export function triangle<T>(
  A: Arithmetic<T>,
  A1: PointLike<T>,
  A2: PointLike<T>,
  A3: PointLike<T>,
): Triangle<T> {
  // Float: the twin below, on plain numbers (docs/performance.md, "Float: twins in the generic
  // source"), so that the generic entry with float is fast in any process.
  if ((A as { float64?: unknown } | null | undefined)?.float64 === true)
    return triangleFloat(A, A1, A2, A3);
  return triangleAny(A, A1, A2, A3);
}

// [x, y] points are read in a separate call, so that triangle() stays small enough for V8 to
// inline (docs/performance.md, "Small enough to inline").
function triangleAny<T>(
  A: Arithmetic<T>,
  A1: PointLike<T>,
  A2: PointLike<T>,
  A3: PointLike<T>,
): Triangle<T> {
  checkArithmetic(A, 'triangle');
  if (A1 == null || A2 == null || A3 == null) checkPoints3(A, A1, A2, A3, 'triangle');
  const t =
    Array.isArray(A1) || Array.isArray(A2) || Array.isArray(A3)
      ? triangleOf(A, asPoint(A1), asPoint(A2), asPoint(A3))
      : triangleOf(A, A1 as Point<T>, A2 as Point<T>, A3 as Point<T>);
  // float leaves sums and products unchecked: a quadrance or quadrea that overflowed is
  // NOT_FINITE here (this path is taken in float only when the twin found something amiss).
  if (A.float64) {
    const where = 'triangle(A, A1, A2, A3)';
    finiteResult(t.Q1, where);
    finiteResult(t.Q2, where);
    finiteResult(t.Q3, where);
    finiteResult(t.quadrea, where);
  }
  return t;
}

/**
 * The float twin of triangleOf: the same operations, in the same order, on plain numbers,
 * without the arithmetic's calls (test/perf/float-twins.test.ts checks it bit for bit against
 * the generic code). Anything else — a coordinate that is not a number, an [x, y] point,
 * coincident or collinear points, a result that is not finite — goes to the generic code,
 * which gives the same result or reports the error. The fallback is a call that never runs on
 * good input, so V8 compiles it as a deoptimisation and the result object, built in one place,
 * can be scalar-replaced like hand-written code's.
 */
function triangleFloat<T>(
  A: Arithmetic<T>,
  A1: PointLike<T>,
  A2: PointLike<T>,
  A3: PointLike<T>,
): Triangle<T> {
  // Reading a coordinate of a null or undefined point throws: the generic code then reports
  // the point (a getter that throws is called again there and throws the same). A point that
  // is not an object reads as undefined. (Not `P1?.x`: an optional chain makes each coordinate
  // "undefined or a number", which V8 keeps boxed, 2–3× the time of this function; and a
  // `P1 == null` test per point costs a tenth of it, the try nothing on the way through.)
  const P1 = A1 as unknown as Point<number>,
    P2 = A2 as unknown as Point<number>,
    P3 = A3 as unknown as Point<number>;
  let x1, y1, x2, y2, x3, y3;
  try {
    x1 = P1.x;
    y1 = P1.y;
    x2 = P2.x;
    y2 = P2.y;
    x3 = P3.x;
    y3 = P3.y;
  } catch {
    return triangleAny(A, A1, A2, A3);
  }
  if (
    typeof x1 !== 'number' ||
    typeof y1 !== 'number' ||
    typeof x2 !== 'number' ||
    typeof y2 !== 'number' ||
    typeof x3 !== 'number' ||
    typeof y3 !== 'number'
  )
    return triangleAny(A, A1, A2, A3);
  const ux = x2 - x1;
  const uy = y2 - y1;
  const vx = x3 - x1;
  const vy = y3 - y1;
  const wx = x3 - x2;
  const wy = y3 - y2;
  const Q1 = wx * wx + wy * wy;
  const Q2 = vx * vx + vy * vy;
  const Q3 = ux * ux + uy * uy;
  const D = ux * vy - uy * vx;
  const D2 = D * D;
  let s1 = D2 / (Q2 * Q3);
  let s2 = D2 / (Q1 * Q3);
  let s3 = D2 / (Q1 * Q2);
  const quadrea = 4 * D2;
  // One test for zero and non-finite values: a zero quadrance or D2, an overflow or a NaN
  // leaves some spread 0, ∞ or NaN, or quadrea ∞ (the generic code reports those). Each
  // spread is ≥ 0 or NaN (D2 ≥ 0 over a product of sums of squares), so their product is
  // > 0 only if each is, and finite only if each is (∞ times a positive number is ∞). The
  // product can underflow to 0 for extreme spreads: the generic code then computes the same
  // values, more slowly. (Cheaper than three comparisons and a sum: 1.28–1.32 → 1.25–1.26
  // hand-written in a script of ours after the bench's set-up, 2026-12-04.)
  const sss = s1 * s2 * s3;
  if (!(sss > 0 && sss + quadrea < Infinity)) return triangleAny(A, A1, A2, A3);
  if (s1 > 1) s1 = 1;
  if (s2 > 1) s2 = 1;
  if (s3 > 1) s3 = 1;
  return { Q1, Q2, Q3, s1, s2, s3, quadrea } as unknown as Triangle<T>;
}

function triangleOf<T>(A: Arithmetic<T>, A1p: Point<T>, A2p: Point<T>, A3p: Point<T>): Triangle<T> {
  // Performance (docs/performance.md): an arithmetic's fused kernel, where it has one, computes
  // the same measures at once (exactly equal in rational; rounded once in decimal) and returns
  // undefined for degenerate input, which the generic code below reports. (float has none: its
  // copy of this function drops the block, and stays small enough for V8 to inline.)
  if (A.kernels) {
    checkPoints3(A, A1p, A2p, A3p, 'triangle');
    const fused = A.kernels.triangle?.(A1p.x, A1p.y, A2p.x, A2p.y, A3p.x, A3p.y);
    if (fused !== undefined) return fused;
  }
  // The points are values of A. In float, the typeof test is enough here: a NaN or ±Infinity
  // coordinate makes a spread NaN, which the division refuses; and it is small enough to keep
  // this function within V8's inlining limit.
  if (A.float64) {
    if (!(
      typeof A1p.x === 'number' &&
      typeof A1p.y === 'number' &&
      typeof A2p.x === 'number' &&
      typeof A2p.y === 'number' &&
      typeof A3p.x === 'number' &&
      typeof A3p.y === 'number'
    ))
      checkPoints3(A, A1p, A2p, A3p, 'triangle');
  } else checkPoints3(A, A1p, A2p, A3p, 'triangle');
  const ux = A.sub(A2p.x, A1p.x); // A1 → A2
  const uy = A.sub(A2p.y, A1p.y);
  const vx = A.sub(A3p.x, A1p.x); // A1 → A3
  const vy = A.sub(A3p.y, A1p.y);
  const wx = A.sub(A3p.x, A2p.x); // A2 → A3
  const wy = A.sub(A3p.y, A2p.y);
  const Q1 = A.add(A.mul(wx, wx), A.mul(wy, wy));
  const Q2 = A.add(A.mul(vx, vx), A.mul(vy, vy));
  const Q3 = A.add(A.mul(ux, ux), A.mul(uy, uy));
  if (A.isZero(Q1) || A.isZero(Q2) || A.isZero(Q3)) coincident(A, A1p, A2p, A3p, Q1, Q2);
  // Spread from the cross product, s = (u × v)²/(Q(u) Q(v)) = sin² of the angle (|u × v| = |u||v|·sin θ; derived);
  // quadrea = 16·area² = 4·(u × v)² since |u × v| = 2·area (common practice).
  const D = A.sub(A.mul(ux, vy), A.mul(uy, vx));
  const D2 = A.mul(D, D);
  if (A.isZero(D2)) collinear(A, A1p);
  // Rounding (float, decimal) can push a spread of a right angle just above 1: clamp it.
  const one = A.one;
  let s1 = A.div(D2, A.mul(Q2, Q3));
  let s2 = A.div(D2, A.mul(Q1, Q3));
  let s3 = A.div(D2, A.mul(Q1, Q2));
  if (A.cmp(s1, one) > 0) s1 = one;
  if (A.cmp(s2, one) > 0) s2 = one;
  if (A.cmp(s3, one) > 0) s3 = one;
  return { Q1, Q2, Q3, s1, s2, s3, quadrea: A.mul(A.from(4), D2) };
}

// Kept out of triangle() so that its float copy stays small enough for V8 to inline
// (docs/performance.md).
function collinear<T>(A: Arithmetic<T>, A1: Point<T>): never {
  throw new QuadspreadError(
    'COLLINEAR_POINTS',
    'triangle(A, A1, A2, A3)',
    `A1 (${show(A.toString(A1.x))}, ${show(A.toString(A1.y))}), A2 and A3 are collinear`,
  );
}

function coincident<T>(
  A: Arithmetic<T>,
  A1: Point<T>,
  A2: Point<T>,
  A3: Point<T>,
  Q1: T,
  Q2: T,
): never {
  const [n1, n2, P] = A.isZero(Q1)
    ? ['A2', 'A3', A2]
    : A.isZero(Q2)
      ? ['A1', 'A3', A1]
      : ['A1', 'A2', A1];
  throw coincidentPoints(
    'triangle(A, A1, A2, A3)',
    `${n1} and ${n2} coincide at (${show(A.toString(P.x))}, ${show(A.toString(P.y))})`,
  );
}
