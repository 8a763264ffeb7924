/**
 * Bearings of a traverse from a field book: measured angles (interior, exterior, to the
 * right, or deflections) carried from a starting bearing, with the angular misclosure
 * against the condition of their kind and the angles balanced equally.
 *
 * @module cogo
 */
import { QuadspreadError, show, invalidArgument } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { angleToDegrees } from '../readings/angle.js';
import { modulo } from '../readings/trig.js';
import { readAzimuth } from './bearing.js';
import { readArray } from './internal.js';

/** How the angles of a field book were measured. */
export type AngleKind = 'interior' | 'exterior' | 'right' | 'deflection';

/** Input of {@link carryBearings}. */
export interface CarryBearingsInput<T> {
  /**
   * The measured angles in degrees or DMS text, one per station in order. `interior`,
   * `exterior` and `right` angles are turned clockwise from the back station to the forward
   * station (interior angles so measured run a loop counterclockwise, exterior angles
   * clockwise); `deflection` angles are signed, right (clockwise) positive.
   */
  readonly angles: readonly Numeric<T>[];
  /** The kind of angle (default `right`). */
  readonly kind?: AngleKind;
  /**
   * A loop: the bearing of the first course. Otherwise: the bearing of the line arriving at
   * the first station (from the backsight point to it), from which the first angle is turned.
   */
  readonly startBearing: Numeric<T>;
  /** `'loop'` (n angles, n courses), `'open'` (n angles, n courses, no check) or `'link'` (n + 1 angles: the last one to the closing reference). */
  readonly close: 'loop' | 'open' | 'link';
  /** For `'link'`: the known bearing of the closing line (from the last station to its reference). */
  readonly closeBearing?: Numeric<T>;
}

/** What {@link carryBearings} returns (degrees). */
export interface CarriedBearings<T> {
  /** The bearing of each course, carried with the balanced angles, in [0°, 360°). */
  readonly bearings: T[];
  /** The angles after balancing (equal shares of the misclosure, opposite in sign). */
  readonly balanced: T[];
  /** The angular misclosure (measured less the condition); undefined for `'open'`. */
  readonly misclosure: T | undefined;
  /** The condition: (n − 2)·180°, (n + 2)·180°, ±360° for a loop, the known closing bearing for a link. */
  readonly expected: T | undefined;
}

/**
 * Carries the bearings of a traverse through its measured angles, with the angular
 * misclosure against the condition of their kind and the angles balanced.
 *
 * Forward bearing = back bearing + 180° + angle for angles turned clockwise, or = previous
 * bearing + deflection, reduced to [0°, 360°). The conditions: interior angles of a loop
 * sum to (n − 2)·180°, exterior angles to (n + 2)·180° (Euclid I.32, corollaries), angles to
 * the right of a loop to either, deflections to ±360°; a link traverse closes on the known
 * bearing of its closing line. The misclosure is shared equally among the angles with the
 * opposite sign (common practice, e.g. Ghilani & Wolf, *Elementary Surveying*, chapter on
 * traverse computations, from memory). Exact in `rational` for degrees and DMS text.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ angles, kind?, startBearing, close, closeBearing? }`, see {@link CarryBearingsInput}
 * @returns `{ bearings, balanced, misclosure, expected }` in degrees
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than three angles of a loop or two of a
 *   link; `INVALID_ARGUMENT` for an unknown kind or close, a link without `closeBearing`;
 *   `INVALID_ANGLE`, `INVALID_BEARING` for readings that do not parse.
 * @example
 * ```ts
 * import { rational, carryBearings } from 'quadspread';
 * // A square run counterclockwise, interior angles 90° with 4" too much in all.
 * const b = carryBearings(rational, {
 *   angles: [`90°00'01"`, `90°00'01"`, `90°00'01"`, `90°00'01"`],
 *   kind: 'interior',
 *   startBearing: 90,
 *   close: 'loop',
 * });
 * [rational.toString(rational.mul(b.misclosure!, rational.from(3600))), b.bearings.map((x) => rational.toString(x))];
 * //=> ['4', ['90', '0', '270', '180']]
 * ```
 */
export function carryBearings<T>(
  A: Arithmetic<T, boolean>,
  input: CarryBearingsInput<T>,
): CarriedBearings<T> {
  const where = 'carryBearings(A, input)';
  if (input === null || typeof input !== 'object')
    throw invalidArgument(where, `${show(input)} is not { angles, startBearing, close }`);
  const kind = input.kind ?? 'right';
  if (!['interior', 'exterior', 'right', 'deflection'].includes(kind))
    throw invalidArgument(
      `${where} kind`,
      `${show(kind)} is not interior, exterior, right or deflection`,
    );
  const close = input.close;
  if (close !== 'loop' && close !== 'open' && close !== 'link')
    throw invalidArgument(`${where} close`, `${show(close)} is not 'loop', 'open' or 'link'`);
  const list = readArray<Numeric<T>>(input.angles, `${where} angles`);
  const least = close === 'loop' ? 3 : close === 'link' ? 2 : 1;
  if (list.length < least)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${where} angles`,
      `a ${close} traverse needs at least ${least} angles, got ${list.length}`,
    );
  const angles = list.map((a) => angleToDegrees(A, a));
  const full = A.from(360);
  const half = A.from(180);
  const start = readAzimuth(A, input.startBearing, () => `${where} startBearing`, '');
  const deflection = kind === 'deflection';
  // Forward bearing from the previous one and the angle at the station between them.
  const next = (b: T, a: T): T =>
    modulo(A, deflection ? A.add(b, a) : A.add(A.add(b, half), a), full);
  const n = angles.length;
  let sum = A.zero;
  for (const a of angles) sum = A.add(sum, a);
  let misclosure: T | undefined;
  let expected: T | undefined;
  if (close === 'loop') {
    if (deflection) {
      // Deflections of a loop sum to +360° (run clockwise) or −360° (counterclockwise).
      expected = A.sign(sum) >= 0 ? full : A.neg(full);
    } else if (kind === 'exterior') {
      expected = A.from((n + 2) * 180);
    } else if (kind === 'interior') {
      expected = A.from((n - 2) * 180);
    } else {
      // Angles to the right of a loop are its interior or its exterior angles: the nearer sum.
      const inner = A.from((n - 2) * 180);
      const outer = A.from((n + 2) * 180);
      expected = A.cmp(A.abs(A.sub(sum, inner)), A.abs(A.sub(sum, outer))) <= 0 ? inner : outer;
    }
    misclosure = A.sub(sum, expected);
  } else if (close === 'link') {
    if (input.closeBearing === undefined)
      throw invalidArgument(`${where} closeBearing`, 'a link traverse needs the closing bearing');
    expected = readAzimuth(A, input.closeBearing, () => `${where} closeBearing`, '');
    let b = start;
    for (const a of angles) b = next(b, a);
    // Computed less known closing bearing, into (−180°, 180°].
    let m = modulo(A, A.sub(b, expected), full);
    if (A.cmp(m, half) > 0) m = A.sub(m, full);
    misclosure = m;
  }
  const share = misclosure === undefined ? A.zero : A.div(misclosure, A.from(n));
  const balanced = angles.map((a) => A.sub(a, share));
  const courses = close === 'link' ? n - 1 : n;
  const bearings: T[] = [];
  if (close === 'loop') {
    bearings.push(modulo(A, start, full));
    for (let i = 1; i < courses; i++) bearings.push(next(bearings[i - 1]!, balanced[i]!));
  } else {
    let b = start;
    for (let i = 0; i < courses; i++) {
      b = next(b, balanced[i]!);
      bearings.push(b);
    }
  }
  return { bearings, balanced, misclosure, expected };
}
