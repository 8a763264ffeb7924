/**
 * Reading a traverse as a field book gives it: how it closes (`'loop'`, `'open'`, a closing
 * point with or without a closing bearing) and courses measured as angles and distances,
 * turned into courses with bearings through {@link carryBearings}.
 *
 * @module cogo
 * @internal
 */
import { show, invalidArgument } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { carryBearings } from './carry-bearings.js';
import type { AngleKind, CarriedBearings } from './carry-bearings.js';
import { inverse } from './inverse.js';
import { readPoint } from './internal.js';
import type { PointInput } from './internal.js';

/**
 * A closing point given with what is known there: the point, and for a link traverse whose
 * angles are checked, the known bearing of a closing line from it (or the point it runs to,
 * `foresight`) and the angle measured at the closing point from the last station to it.
 */
export interface TraverseClosingPoint<T> {
  /** The known point the traverse ends on. */
  readonly point: PointInput<T>;
  /** The known bearing of the closing line from `point` (degrees, DMS text or a quadrant bearing). */
  readonly bearing?: Numeric<T>;
  /** Instead of `bearing`: the known point the closing line runs to from `point`. */
  readonly foresight?: PointInput<T>;
  /**
   * The angle measured at `point`, of the traverse's `angleKind`, from the last station to
   * the closing line: needed with `bearing` or `foresight` when the courses are angles.
   */
  readonly angle?: Numeric<T>;
}

/**
 * How a traverse closes: `'loop'` (back on its start), `'open'` (on no known point: no
 * misclosure is claimed), a known point (`{ x, y }` or `[x, y]`), or a known point with a
 * closing bearing ({@link TraverseClosingPoint}).
 */
export type TraverseClose<T> = 'loop' | 'open' | PointInput<T> | TraverseClosingPoint<T>;

/** The field-book part of a traverse input, as {@link readFieldBook} reads it. @internal */
export interface FieldBookInput<T> {
  readonly start: PointInput<T>;
  readonly courses: readonly unknown[];
  readonly close?: TraverseClose<T>;
  readonly angleKind?: AngleKind;
  readonly startBearing?: Numeric<T>;
  readonly backsight?: PointInput<T>;
}

/** What {@link readFieldBook} gives the traverse computation. @internal */
export interface FieldBook<T> {
  readonly start: Point<T>;
  /** The known closing point; undefined for an open traverse. */
  readonly end: Point<T> | undefined;
  /** The courses, those measured as angles replaced by `{ bearing, distance }`. */
  readonly courses: readonly unknown[];
  /** The carried bearings, balanced angles and angular misclosure, for courses given as angles. */
  readonly angles?: CarriedBearings<T>;
  /** Whether the input used only the older form (no `'loop'`, no `{ point }`, no angles). */
  readonly plain: boolean;
}

function isClosingPoint<T>(c: unknown): c is TraverseClosingPoint<T> {
  return c !== null && typeof c === 'object' && !Array.isArray(c) && 'point' in c;
}

/**
 * Reads start, close and courses; carries bearings through courses given as `{ angle,
 * distance }`. A closing point equal to the start makes a loop.
 * @internal
 */
export function readFieldBook<T>(
  A: Arithmetic<T, boolean>,
  input: FieldBookInput<T>,
  where: string,
): FieldBook<T> {
  const start = readPoint(A, input.start, `${where} start`);
  const close = input.close;
  let end: Point<T> | undefined;
  let closing: TraverseClosingPoint<T> | undefined;
  if (close === undefined || close === 'loop') end = start;
  else if (close === 'open') end = undefined;
  else if (isClosingPoint<T>(close)) {
    closing = close;
    end = readPoint(A, close.point, `${where} close.point`);
  } else if (typeof close === 'string')
    throw invalidArgument(
      `${where} close`,
      `${show(close)} is not 'loop', 'open', a point or { point, bearing? }`,
    );
  else end = readPoint(A, close, `${where} close`);
  const courses = input.courses;
  const n = courses.length;
  let angled = 0;
  for (let i = 0; i < n; i++) {
    const c = courses[i];
    if (c !== null && typeof c === 'object' && (c as { angle?: unknown }).angle !== undefined)
      angled++;
  }
  const plain =
    angled === 0 &&
    closing === undefined &&
    typeof close !== 'string' &&
    input.startBearing === undefined &&
    input.backsight === undefined &&
    input.angleKind === undefined;
  if (plain) return { start, end, courses, plain };
  if (angled === 0) {
    for (const k of ['angleKind', 'startBearing', 'backsight'] as const)
      if (input[k] !== undefined)
        throw invalidArgument(
          `${where} ${k}`,
          'belongs to courses measured as angles ({ angle, distance }), but no course has an angle',
        );
    if (closing?.bearing !== undefined || closing?.foresight !== undefined)
      throw invalidArgument(
        `${where} close`,
        'a closing bearing checks measured angles, but no course has an angle',
      );
    return { start, end, courses, plain };
  }
  if (angled !== n)
    throw invalidArgument(
      `${where} courses`,
      `${angled} of ${n} courses are angles: give every course as { angle, distance }, or none`,
    );
  const kind = input.angleKind;
  if (kind === undefined)
    throw invalidArgument(
      `${where} angleKind`,
      "courses measured as angles need their kind: 'interior', 'exterior', 'right' or 'deflection'",
    );
  // A loop: back on the start, with no closing bearing to check.
  const loop =
    end !== undefined &&
    closing?.bearing === undefined &&
    closing?.foresight === undefined &&
    A.isZero(A.sub(end.x, start.x)) &&
    A.isZero(A.sub(end.y, start.y));
  if (loop && input.backsight !== undefined)
    throw invalidArgument(
      `${where} backsight`,
      'a loop is oriented by the bearing of its first course: give startBearing',
    );
  if ((input.startBearing === undefined) === (input.backsight === undefined))
    throw invalidArgument(
      `${where} startBearing`,
      loop
        ? 'a loop of angles needs startBearing, the bearing of its first course'
        : 'give one of startBearing (from the backsight to the start) or backsight (a point)',
    );
  const startBearing =
    input.startBearing ??
    inverse(A, readPoint(A, input.backsight!, `${where} backsight`), start).azimuth;
  const angles: Numeric<T>[] = courses.map((c) => (c as { angle: Numeric<T> }).angle);
  let closeKind: 'loop' | 'open' | 'link' = loop ? 'loop' : 'open';
  let closeBearing: Numeric<T> | undefined;
  if (closing !== undefined && (closing.bearing !== undefined || closing.foresight !== undefined)) {
    if (closing.bearing !== undefined && closing.foresight !== undefined)
      throw invalidArgument(`${where} close`, 'give one of bearing or foresight, not both');
    if (closing.angle === undefined)
      throw invalidArgument(
        `${where} close.angle`,
        'a closing bearing needs the angle measured at the closing point to the closing line',
      );
    closeKind = 'link';
    angles.push(closing.angle);
    closeBearing =
      closing.bearing ??
      inverse(A, end!, readPoint(A, closing.foresight!, `${where} close.foresight`)).azimuth;
  } else if (closing?.angle !== undefined)
    throw invalidArgument(
      `${where} close.angle`,
      'a closing angle needs the bearing (or foresight point) it is checked against',
    );
  const carried = carryBearings(A, {
    angles,
    kind,
    startBearing,
    close: closeKind,
    ...(closeBearing !== undefined ? { closeBearing } : {}),
  });
  const withBearings = courses.map((c, i) => ({
    bearing: carried.bearings[i]!,
    distance: (c as { distance: Numeric<T> }).distance,
  }));
  return { start, end, courses: withBearings, angles: carried, plain };
}
