/**
 * Points of the plane.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from './validate.js';
import { checkArithmetic } from '../errors.js';

/**
 * A point (or a vector) of the plane in arithmetic `T`: `x` east, `y` north.
 * Every geometry function reads points of this shape; any object with `x` and `y`
 * values of the arithmetic will do.
 *
 * @example
 * ```ts
 * import { float, quadrance } from 'quadspread';
 * quadrance(float, { x: 1, y: 1 }, { x: 4, y: 5 });
 * //=> 25
 * ```
 */
export interface Point<T> {
  /** East coordinate (or the first component of a vector). */
  readonly x: T;
  /** North coordinate (or the second component of a vector). */
  readonly y: T;
}

/**
 * A point as the coordinate and elevation solvers read it: `{ x, y }` with `x` east and `y`
 * north, or an array `[x, y]` in the same order (as GIS code holds positions), each coordinate a
 * value of the arithmetic or anything its `from` reads (a number, numeric text, a bigint).
 * A {@link Point} made by {@link point} is one. (A GeoJSON position holds longitude and
 * latitude, not plane coordinates: convert it through a grid first.)
 *
 * @example
 * ```ts
 * import { rational, area, type PointInput } from 'quadspread';
 * const lot: PointInput<ReturnType<typeof rational.from>>[] = [{ x: 0, y: 0 }, { x: '4', y: 0 }, { x: 4, y: '3/2' }];
 * rational.toString(area(rational, lot));
 * //=> '3'
 * ```
 */
export type PointInput<T> =
  | {
      /** East coordinate. */
      readonly x: Numeric<T>;
      /** North coordinate. */
      readonly y: Numeric<T>;
    }
  | readonly [x: Numeric<T>, y: Numeric<T>];

/**
 * Makes a point `{ x, y }` (x = east, y = north), reading each coordinate with `A.from`.
 * The same shape serves as a vector.
 *
 * @param A the arithmetic
 * @param x east coordinate (any unit; quadrances come out in its square)
 * @param y north coordinate
 * @returns the point `{ x, y }` with values of the arithmetic
 * @throws {QuadspreadError} `INVALID_NUMBER` (from `A.from`) when a coordinate is not a number.
 * @example
 * ```ts
 * import { rational, point } from 'quadspread';
 * const P = point(rational, '0.1', 3);
 * [rational.toString(P.x), rational.toString(P.y)];
 * //=> ['1/10', '3']
 * ```
 */
export function point<T>(A: Arithmetic<T>, x: Numeric<T>, y: Numeric<T>): Point<T> {
  checkArithmetic(A, 'point');
  return { x: readNumber(A, x, 'point(A, x, y) x'), y: readNumber(A, y, 'point(A, x, y) y') };
}

/**
 * A point as the geometry primitives (`quadrance`, `spread`, `triangle`, the line functions)
 * take it: a {@link Point} of values of the arithmetic, or an array `[x, y]` of such values
 * (x = east, y = north). The primitives do not read text or numbers through `A.from` (they are
 * the hot inner operations); make such points with {@link point}.
 *
 * @example
 * ```ts
 * import { float, quadrance } from 'quadspread';
 * quadrance(float, [0, 0], [3, 4]);
 * //=> 25
 * ```
 */
export type PointLike<T> = Point<T> | readonly [x: T, y: T];

/** A {@link PointLike} as a {@link Point}: an array `[x, y]` becomes `{ x, y }`. @internal */
export function asPoint<T>(P: PointLike<T>): Point<T> {
  return Array.isArray(P)
    ? { x: (P as readonly [T, T])[0], y: (P as readonly [T, T])[1] }
    : (P as Point<T>);
}
