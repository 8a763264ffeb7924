/**
 * The point at a chainage and offset of a horizontal alignment.
 *
 * @module alignment
 */
import { QuadspreadError, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { readNumber } from '../geometry/validate.js';
import type { AlignmentElement, HorizontalAlignment } from './horizontal.js';
import { readAlignment, readDistance, turnSide } from './horizontal.js';
import { clothoidSeries } from './clothoid.js';
import { along, rightOf, rotate, circleCosSin, azimuth } from './internal.js';

/** A point on an element and the direction of travel there. @internal */
export interface Placed<T> {
  readonly point: Point<T>;
  readonly direction: Point<T>;
}

/**
 * The point at a distance s from an element's start (0 ≤ s ≤ length) on its centre line, and the
 * unit direction of travel there. @internal
 */
export function placeOn<T>(A: Arithmetic<T>, e: AlignmentElement<T>, s: T): Placed<T> {
  if (e.type === 'straight') {
    return {
      point: A.isZero(s) ? e.start : A.eq(s, e.length) ? e.end : along(A, e.start, e.direction, s),
      direction: e.direction,
    };
  }
  if (e.type === 'arc') {
    const R = e.radius;
    const atEnd = A.eq(s, e.length);
    const p0 = atEnd ? e.end : e.start;
    let r = { x: A.div(A.sub(p0.x, e.centre.x), R), y: A.div(A.sub(p0.y, e.centre.y), R) };
    if (!atEnd && !A.isZero(s)) {
      // Turn the start radius through φ = s/R, clockwise on a right-hand curve.
      const { c, s: sn } = circleCosSin(A, A.div(s, R));
      r = rotate(A, r, c, sn, e.turn);
    }
    const point = atEnd || A.isZero(s) ? p0 : along(A, e.centre, r, R);
    // Travel is clockwise round the centre on a right-hand curve: tangent (r.y, −r.x).
    const direction = e.turn > 0 ? { x: r.y, y: A.neg(r.x) } : { x: A.neg(r.y), y: r.x };
    return { point, direction };
  }
  const Ls = e.length;
  const l = e.entering ? s : A.sub(Ls, s);
  const d = e.originDirection;
  const side = (e.entering ? e.turn : -e.turn) as 1 | -1;
  if (A.isZero(l))
    return { point: e.origin, direction: e.entering ? d : { x: A.neg(d.x), y: A.neg(d.y) } };
  const c = clothoidSeries(A, l, e.radius, Ls);
  const point = A.isZero(s)
    ? e.start
    : A.eq(s, Ls)
      ? e.end
      : along(A, along(A, e.origin, d, c.x), turnSide(A, d, side), c.y);
  const t = rotate(A, d, A.cos(c.angle), A.sin(c.angle), side);
  return { point, direction: e.entering ? t : { x: A.neg(t.x), y: A.neg(t.y) } };
}

/** The index of the element holding distance d along the line (bisection on the start distances). @internal */
export function elementAt<T>(
  A: Arithmetic<T>,
  elements: readonly AlignmentElement<T>[],
  d: T,
): number {
  let lo = 0;
  let hi = elements.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (A.cmp(elements[mid]!.startDistance, d) <= 0) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** What {@link alignmentPoint} returns. */
export interface AlignmentPoint<T> {
  /** East. */
  readonly x: T;
  /** North. */
  readonly y: T;
  /** Bearing of the line there, degrees clockwise from north. */
  readonly bearing: T;
  /** Unit direction of travel (east, north). */
  readonly direction: Point<T>;
  /** Index of the element in `alignment.elements`. */
  readonly element: number;
}

/**
 * The point at a chainage and offset of a horizontal alignment, and the bearing of the line there.
 * The offset is measured square to the line, positive to the right looking ahead.
 *
 * On a straight the point is exact in `rational`. On an arc the point is turned from the arc's
 * start through φ = s/R using the rational parametrisation of the circle (cos = (1 − t²)/(1 + t²),
 * sin = 2t/(1 + t²), t = tan(φ/2)), so in `rational` it lies exactly on the circle (if the centre
 * is exact) and only its position along the arc is within the transcendental tolerance
 * (1e-40 relative). On a transition it comes from the clothoid series (see {@link clothoid}).
 * Element ends are returned as stored.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param alignment an alignment made by {@link horizontalAlignment}
 * @param chainage the chainage (a number or station text such as `'1+250.000'`)
 * @param offset signed offset, positive to the right looking ahead (default 0)
 * @param options `region`: which stretch between chainage equations, when a chainage occurs twice
 * @returns `{ x, y, bearing, direction, element }`
 * @throws {QuadspreadError} `OFF_ALIGNMENT` for a chainage beyond the ends; `INVALID_ARGUMENT`
 *   for an alignment that is not one, or a chainage that occurs twice without `region`;
 *   `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, horizontalAlignment, alignmentPoint } from 'quadspread';
 * const R = rational;
 * const h = horizontalAlignment(R, { points: [{ x: 0, y: 0 }, { x: 0, y: 100 }, { x: 60, y: 180 }], curves: [{ radius: 30 }] });
 * const p = alignmentPoint(R, h, 50, 2);
 * [R.toString(p.x), R.toString(p.y), R.toString(p.bearing)];
 * //=> ['2', '50', '0']
 * ```
 */
export function alignmentPoint<T>(
  A: Arithmetic<T>,
  alignment: HorizontalAlignment<T>,
  chainage: Numeric<T>,
  offset: Numeric<T> = 0,
  options: { readonly region?: number } = {},
): AlignmentPoint<T> {
  checkArithmetic(A, 'alignmentPoint');
  const where = 'alignmentPoint(A, alignment, chainage, offset)';
  const h = readAlignment(A, alignment, `${where} alignment`);
  const o = readNumber(A, offset, where, ' offset');
  const d = readDistance(
    A,
    h,
    chainage,
    where,
    options === null || typeof options !== 'object' ? undefined : options.region,
  );
  const i = elementAt(A, h.elements, d);
  const e = h.elements[i]!;
  let s = A.sub(d, e.startDistance);
  // The end chainage read back may exceed the last element by a rounding in an inexact arithmetic.
  if (
    A.cmp(s, e.length) > 0 &&
    !A.exact &&
    A.cmp(A.sub(s, e.length), A.mul(A.add(h.length, A.one), A.from('1e-12'))) <= 0
  )
    s = e.length;
  if (A.cmp(s, e.length) > 0)
    throw new QuadspreadError(
      'OFF_ALIGNMENT',
      `${where} chainage`,
      `${A.toString(d)} is past the end of the alignment`,
    );
  const pl = placeOn(A, e, s);
  const point = A.isZero(o) ? pl.point : along(A, pl.point, rightOf(A, pl.direction), o);
  return {
    x: point.x,
    y: point.y,
    bearing: azimuth(A, pl.direction),
    direction: pl.direction,
    element: i,
  };
}
