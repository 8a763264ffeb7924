/**
 * An open traverse: coordinates carried from a known point through its courses to a point
 * that is not known, with no misclosure and no adjustment.
 *
 * @module cogo
 */
import { checkArithmetic } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import type { CarriedBearings } from './carry-bearings.js';
import { computeTraverse } from './traverse.js';
import type { TraverseInput } from './traverse.js';

/** One course of an open traverse. */
export interface OpenTraverseLeg<T> {
  /** Latitude (north component). */
  readonly latitude: T;
  /** Departure (east component). */
  readonly departure: T;
  /** Course length. */
  readonly length: T;
}

/** What {@link openTraverse} returns. */
export interface OpenTraverse<T> {
  /** The points from the start (index 0) to the end of the last course. */
  readonly points: Point<T>[];
  /** Each course's latitude, departure and length. */
  readonly courses: OpenTraverseLeg<T>[];
  /** Total length of the courses. */
  readonly length: T;
  /** For courses given as angles: the carried bearings and the angles (not balanced: nothing checks them). */
  readonly angles?: CarriedBearings<T>;
}

/**
 * Carries coordinates along an open traverse: from a known start through its courses to a
 * point that is not known. Nothing checks the result — no misclosure, no adjustment — so an
 * open traverse should be measured twice or tied to a known point (give `close` to
 * {@link traverse} then).
 *
 * The courses are those of {@link traverse}: `{ bearing, distance }`, `{ latitude,
 * departure }`, or `{ angle, distance }` with `angleKind` and `startBearing` (the bearing
 * from the backsight to the start) or `backsight` (the point). Latitude = d·cos(azimuth),
 * departure = d·sin(azimuth). Exact in `rational` for latitude/departure courses.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ start, courses, close: 'open', angleKind?, startBearing?, backsight? }`
 * @returns `{ points, courses, length, angles? }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when `close` is not `'open'`, and as {@link traverse}.
 * @example
 * ```ts
 * import { rational, openTraverse } from 'quadspread';
 * // From a backsight due south of the start, turn 270° to the right (east 30 m), then 90° (north 40 m).
 * const t = openTraverse(rational, {
 *   start: { x: 0, y: 0 },
 *   close: 'open',
 *   angleKind: 'right',
 *   startBearing: 0,
 *   courses: [
 *     { angle: 270, distance: 30 },
 *     { angle: 90, distance: 40 },
 *   ],
 * });
 * [t.angles!.bearings.map((b) => rational.toString(b)), rational.toString(t.points[2]!.y)];
 * //=> [['90', '0'], '40']
 * ```
 */
export function openTraverse<T>(
  A: Arithmetic<T, boolean>,
  input: TraverseInput<T>,
): OpenTraverse<T> {
  checkArithmetic(A, 'openTraverse');
  const t = computeTraverse(A, input, 'openTraverse(A, input)', true);
  return {
    points: t.points,
    courses: t.courses.map((c) => ({
      latitude: c.latitude,
      departure: c.departure,
      length: c.length,
    })),
    length: t.length,
    ...(t.angles ? { angles: t.angles } : {}),
  };
}
