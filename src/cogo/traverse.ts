/**
 * Traverse computation: latitudes and departures, closure, precision, and adjustment by
 * the compass (Bowditch) or transit rule.
 *
 * @module cogo
 */
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { sqrtOf } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';
import { sinCosDegrees } from '../readings/trig.js';
import { angleToDegrees } from '../readings/angle.js';
import { readAzimuth } from './bearing.js';
import { traverseFloat } from './traverse-float.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { readArray, sqrtValue } from './internal.js';
import type { PointInput } from './internal.js';
import { readFieldBook } from './traverse-field-book.js';
import type { TraverseClose } from './traverse-field-book.js';
import type { AngleKind, CarriedBearings } from './carry-bearings.js';

/**
 * One traverse course: a bearing and a distance, a latitude and a departure, or an angle
 * and a distance as a field book gives them.
 *
 * - `{ bearing, distance }`: the bearing is an azimuth clockwise from north (decimal
 *   degrees or DMS text) or a quadrant bearing such as `S 68°05'35" W`; the distance is
 *   horizontal, in the coordinate unit.
 * - `{ latitude, departure }`: the north and east components (x = east, y = north), with
 *   an optional `distance` (the course length used by the compass rule; by default
 *   √(latitude² + departure²)).
 * - `{ angle, distance }`: the angle measured at the station the course leaves (degrees or
 *   DMS text, of the traverse's `angleKind`), the bearing carried from `startBearing` or
 *   `backsight` through the balanced angles (see {@link carryBearings}). Either every
 *   course is an angle or none is.
 */
export type TraverseCourse<T> =
  | { readonly bearing: Numeric<T>; readonly distance: Numeric<T> }
  | { readonly angle: Numeric<T>; readonly distance: Numeric<T> }
  | {
      readonly latitude: Numeric<T>;
      readonly departure: Numeric<T>;
      readonly distance?: Numeric<T>;
    };

/** Input of {@link traverse}. */
export interface TraverseInput<T> {
  /** The known starting point `{ x: east, y: north }`. */
  readonly start: PointInput<T>;
  /** The courses in order from the start. At least one. */
  readonly courses: readonly TraverseCourse<T>[];
  /**
   * How the traverse closes: `'loop'` (on its start), a known point, or a known point with
   * the bearing of a closing line (`{ point, bearing | foresight, angle }`, which checks the
   * angles of a link traverse). Default: the start (a loop). `'open'` is for
   * {@link openTraverse}, which claims no misclosure.
   */
  readonly close?: TraverseClose<T>;
  /** How the misclosure is distributed: `'compass'` (Bowditch, default) or `'transit'`. */
  readonly rule?: 'compass' | 'transit';
  /**
   * The measured interior angles of a closed loop (degrees or DMS text), for the angular
   * misclosure: their sum less (n − 2)·180°.
   */
  readonly interiorAngles?: readonly Numeric<T>[];
  /** For courses given as `{ angle, distance }`: what the angles are. */
  readonly angleKind?: AngleKind;
  /**
   * For courses given as angles: in a loop, the bearing of the first course; otherwise the
   * bearing of the line from the backsight to the start, from which the first angle is turned.
   */
  readonly startBearing?: Numeric<T>;
  /** For courses given as angles (not a loop): the backsight point, instead of `startBearing`. */
  readonly backsight?: PointInput<T>;
}

/** The misclosure of a traverse: computed end point less the known closing point. */
export interface TraverseClosure<T, E extends boolean> {
  /** Misclosure in departure (east), coordinate units. */
  readonly east: T;
  /** Misclosure in latitude (north), coordinate units. */
  readonly north: T;
  /** Linear misclosure √(east² + north²): a surd in an exact arithmetic, a value otherwise. */
  readonly linear: Root<T, E>;
  /**
   * N of the precision ratio 1 : N, the traverse length over the linear misclosure;
   * `undefined` when the traverse closes exactly. In an exact arithmetic it is within
   * 1e-40 relative (it involves square roots).
   */
  readonly ratio: T | undefined;
}

/** Angular misclosure of a closed loop from its interior angles, in degrees. */
export interface AngularMisclosure<T> {
  /** Sum of the measured interior angles. */
  readonly sum: T;
  /** (n − 2)·180° for n angles. */
  readonly expected: T;
  /** sum − expected. */
  readonly misclosure: T;
}

/** One course as computed and adjusted. */
export interface TraverseLeg<T> {
  /** Unadjusted latitude (north component). */
  readonly latitude: T;
  /** Unadjusted departure (east component). */
  readonly departure: T;
  /** Course length (the given distance, or √(lat² + dep²)). */
  readonly length: T;
  /** Adjusted latitude. */
  readonly adjustedLatitude: T;
  /** Adjusted departure. */
  readonly adjustedDeparture: T;
}

/** What {@link traverse} returns. */
export interface Traverse<T, E extends boolean> {
  /** The misclosure and precision. */
  readonly closure: TraverseClosure<T, E>;
  /** Total length of the courses. */
  readonly length: T;
  /** Unadjusted points, from the start (index 0) to the computed end (index n). */
  readonly points: Point<T>[];
  /** Adjusted points, from the start to the closing point (index n equals `close`). */
  readonly adjusted: Point<T>[];
  /** Each course with its latitude, departure, length and adjusted components. */
  readonly courses: TraverseLeg<T>[];
  /** The rule used. */
  readonly rule: 'compass' | 'transit';
  /** Angular misclosure, when `interiorAngles` were given. */
  readonly angular?: AngularMisclosure<T>;
  /**
   * For courses given as angles: the carried bearings, the balanced angles, the angular
   * misclosure (undefined when nothing checks it) and the condition it is measured against.
   */
  readonly angles?: CarriedBearings<T>;
}

/** √(lat² + dep²): `A.sqrt` directly in an inexact arithmetic (the float hot path). */
function courseLength<T>(A: Arithmetic<T, boolean>, la: T, de: T, at: () => string): T {
  const q = A.add(A.mul(la, la), A.mul(de, de));
  if (A.isZero(q)) return A.zero;
  return A.exact ? sqrtValue(A, q, at()) : A.sqrt(q)!;
}

/**
 * Angular misclosure of a closed loop traverse: the sum of its n measured interior
 * angles less (n − 2)·180° (the angle sum of a simple polygon). Exact in `rational` for
 * degrees and DMS text.
 *
 * @param A the arithmetic
 * @param angles the interior angles, degrees or DMS text, at least three
 * @returns `{ sum, expected, misclosure }` in degrees
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than three angles; `INVALID_ANGLE` for an angle that does not parse.
 * @example
 * ```ts
 * import { rational, angularMisclosure } from 'quadspread';
 * const m = angularMisclosure(rational, [`90°00'10"`, '90', '90', `89°59'56"`]);
 * rational.toString(m.misclosure);
 * //=> '1/600'
 * ```
 */
export function angularMisclosure<T>(
  A: Arithmetic<T, boolean>,
  angles: readonly Numeric<T>[],
): AngularMisclosure<T> {
  checkArithmetic(A, 'angularMisclosure');
  const where = 'angularMisclosure(A, angles)';
  const list = readArray<Numeric<T>>(angles, where);
  if (list.length < 3)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      where,
      `a closed loop has at least 3 angles, got ${list.length}`,
    );
  let sum = A.zero;
  for (const a of list) sum = A.add(sum, angleToDegrees(A, a));
  // Interior angles of a simple n-gon sum to (n − 2)·180° (Euclid I.32, corollary).
  const expected = A.from((list.length - 2) * 180);
  return { sum, expected, misclosure: A.sub(sum, expected) };
}

/**
 * Computes a traverse from a known start through its courses to a known closing point,
 * with its misclosure, precision ratio and adjustment.
 *
 * Coordinates are x = east, y = north; bearings are azimuths clockwise from north (or
 * quadrant bearings). Each course gives latitude = d·cos(azimuth) (north) and
 * departure = d·sin(azimuth) (east). The misclosure is the computed end point less the
 * closing point (default: the start, for a closed loop). The compass (Bowditch) rule
 * corrects each course in proportion to its length; the transit rule corrects latitudes in
 * proportion to |latitude| and departures to |departure|.
 *
 * Exactness: with latitude/departure courses in `rational`, the misclosure, the transit
 * adjustment and (when every length is given or is a perfect square) the compass
 * adjustment are exact, and the adjusted end equals the closing point exactly. Courses
 * with bearings go through sin/cos, so in `rational` they are within the arithmetic's
 * transcendental tolerance (1e-40 relative).
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ start, courses, close?, rule?, interiorAngles? }`, see {@link TraverseInput}
 * @returns `{ closure: { east, north, linear, ratio }, length, points, adjusted, courses, rule, angular? }`
 * @throws {QuadspreadError} `NO_COURSES` for an empty course list; `INVALID_BEARING` for a
 * bearing that does not parse; `INVALID_ARGUMENT` for a course that is neither form, a
 * negative distance, an unknown rule, a zero-length traverse under the compass rule, or a
 * transit adjustment with nothing to distribute over; `INVALID_NUMBER` for bad numbers.
 * @example
 * ```ts
 * import { rational, traverse } from 'quadspread';
 * const t = traverse(rational, {
 *   start: { x: 0, y: 0 },
 *   courses: [
 *     { latitude: 0, departure: 3 },
 *     { latitude: 4, departure: 0 },
 *     { latitude: '-4.01', departure: '-3' },
 *   ],
 * });
 * [rational.toString(t.closure.north), rational.toString(t.closure.east), rational.toString(t.adjusted[3]!.y)];
 * //=> ['-1/100', '0', '0']
 * ```
 */
export function traverse<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: TraverseInput<T>,
): Traverse<T, E> {
  checkArithmetic(A, 'traverse');
  return computeTraverse(A, input, 'traverse(A, input)', false);
}

/**
 * The input a fused kernel may see: none of the field-book forms (`'loop'` is the default
 * close), or undefined.
 */
function kernelInput<T>(input: TraverseInput<T>): TraverseInput<T> | undefined {
  const c = input.close as unknown;
  if (
    (typeof c === 'string' && c !== 'loop') ||
    (c !== null && typeof c === 'object' && 'point' in c) ||
    input.angleKind !== undefined ||
    input.startBearing !== undefined ||
    input.backsight !== undefined
  )
    return undefined;
  if (c !== 'loop') return input;
  const { close: _loop, ...rest } = input;
  return rest;
}

/**
 * The traverse computation; `open`: the traverse ends where its courses end (its closure is
 * zero and nothing is adjusted), for {@link openTraverse}. @internal
 */
export function computeTraverse<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: TraverseInput<T>,
  where: string,
  open: boolean,
): Traverse<T, E> {
  // Performance (docs/performance.md): the arithmetic's fused kernel, where it has one
  // (rational: courses as latitude/departure/distance, compass rule), gives the same points and
  // adjustment at once, or undefined for input it leaves to the code below; the closure's root
  // and ratio are computed here as below.
  const forKernel =
    !open && A.kernels?.traverse && input !== null && typeof input === 'object'
      ? kernelInput(input)
      : undefined;
  const fused = forKernel ? A.kernels?.traverse?.(forKernel) : undefined;
  if (fused !== undefined) {
    const { east, north } = fused;
    const q = A.add(A.mul(east, east), A.mul(north, north));
    const ratio = A.isZero(q) ? undefined : A.div(fused.length, sqrtValue(A, q, where));
    const { points, adjusted, courses, rule, length } = fused;
    return {
      closure: { east, north, linear: sqrtOf(A, A.isZero(q) ? A.zero : q), ratio },
      length,
      points,
      adjusted,
      courses,
      rule,
    };
  }
  if (input === null || typeof input !== 'object') {
    throw invalidArgument(where, `${show(input)} is not { start, courses, close? }`);
  }
  const rule = input.rule ?? 'compass';
  if (rule !== 'compass' && rule !== 'transit') {
    throw invalidArgument(`${where} rule`, `${show(rule)} is not 'compass' or 'transit'`);
  }
  if (input.courses === undefined)
    throw new QuadspreadError('NO_COURSES', `${where} courses`, 'no courses were given');
  const given = readArray<TraverseCourse<T>>(input.courses, `${where} courses`);
  const n = given.length;
  if (n === 0)
    throw new QuadspreadError('NO_COURSES', `${where} courses`, 'the traverse has no courses');
  if (open ? input.close !== 'open' : input.close === 'open')
    throw invalidArgument(
      `${where} close`,
      open
        ? `${show(input.close)}: openTraverse is for close: 'open' (use traverse for a traverse that closes)`
        : "'open' claims no misclosure: use openTraverse(A, input) for an open traverse",
    );
  const book = readFieldBook(A, input, where);
  const start = book.start;
  const list = book.courses as readonly TraverseCourse<T>[];
  const carried = book.angles;
  const withAngles = (r: Traverse<T, E>): Traverse<T, E> => {
    let out = r;
    if (input.interiorAngles !== undefined)
      out = { ...out, angular: angularMisclosure(A, input.interiorAngles) };
    return carried ? { ...out, angles: carried } : out;
  };
  if (A.float64 === true && !open) {
    // The float twin (same operations, same order) keeps this loop fast in any process.
    const fast = traverseFloat(start as Point<number>, book.end as Point<number>, rule, list);
    if (fast !== undefined) {
      const r = fast as unknown as Traverse<T, E>;
      return input.interiorAngles !== undefined || carried ? withAngles(r) : r;
    }
  }

  const lat = new Array<T>(n);
  const dep = new Array<T>(n);
  const len = new Array<T>(n);
  const points = new Array<Point<T>>(n + 1);
  points[0] = start;
  let x = start.x;
  let y = start.y;
  let total = A.zero;
  let sumAbsLat = A.zero;
  let sumAbsDep = A.zero;
  for (let i = 0; i < n; i++) {
    const c = list[i] as Record<string, Numeric<T> | undefined> | null | undefined;
    // Built only for an error message: keeps the float loop free of string work.
    const at = (): string => `${where} courses[${i}]`;
    expectObject(c, at, 'a course');
    let la: T;
    let de: T;
    let d: T;
    if (c.bearing !== undefined) {
      if (c.distance === undefined)
        throw invalidArgument(at(), 'a course with a bearing needs a distance');
      d = readNumber(A, c.distance, at, '.distance');
      const az = readAzimuth(A, c.bearing, at, '.bearing');
      // Latitude = d·cos(azimuth), departure = d·sin(azimuth) (azimuth clockwise from north),
      // e.g. Ghilani & Wolf, Elementary Surveying, chapter on traverse computations (from memory).
      const sc = sinCosDegrees(A, az);
      la = A.mul(d, sc.cos);
      de = A.mul(d, sc.sin);
    } else if (c.latitude !== undefined && c.departure !== undefined) {
      la = readNumber(A, c.latitude, at, '.latitude');
      de = readNumber(A, c.departure, at, '.departure');
      // Course length by Pythagoras unless given.
      d =
        c.distance !== undefined
          ? readNumber(A, c.distance, at, '.distance')
          : courseLength(A, la, de, at);
    } else {
      throw invalidArgument(at(), 'a course is { bearing, distance } or { latitude, departure }');
    }
    if (A.sign(d) < 0) throw invalidArgument(`${at()}.distance`, `${A.toString(d)} is negative`);
    lat[i] = la;
    dep[i] = de;
    len[i] = d;
    total = A.add(total, d);
    if (rule === 'transit') {
      sumAbsLat = A.add(sumAbsLat, A.abs(la));
      sumAbsDep = A.add(sumAbsDep, A.abs(de));
    }
    x = A.add(x, de);
    y = A.add(y, la);
    points[i + 1] = { x, y };
  }

  // An open traverse ends where its courses end.
  const end = book.end ?? { x, y };
  const east = A.sub(x, end.x);
  const north = A.sub(y, end.y);
  const q = A.add(A.mul(east, east), A.mul(north, north));
  // At an exact closure the linear misclosure is 0 (a root there has no first-order derivative).
  const linear = sqrtOf(A, A.isZero(q) ? A.zero : q);
  // Precision ratio 1 : N with N = traverse length / linear misclosure.
  const ratio = A.isZero(q) ? undefined : A.div(total, sqrtValue(A, q, where));

  // Per-unit corrections: compass (Bowditch) rule, correction = −misclosure·(course length /
  // total length); transit rule, correction = −misclosure·|component| / Σ|component|.
  // Both as in Ghilani & Wolf, Elementary Surveying, chapter on traverse computations (from memory).
  let kLat: T;
  let kDep: T;
  if (rule === 'compass') {
    if (A.isZero(total)) {
      if (!A.isZero(q))
        throw invalidArgument(
          where,
          'the courses have zero total length: the compass rule cannot distribute a misclosure',
        );
      kLat = A.zero;
      kDep = A.zero;
    } else {
      kLat = A.div(A.neg(north), total);
      kDep = A.div(A.neg(east), total);
    }
  } else {
    if (A.isZero(sumAbsLat) && !A.isZero(north))
      throw invalidArgument(
        where,
        'every latitude is zero: the transit rule cannot distribute the north misclosure',
      );
    if (A.isZero(sumAbsDep) && !A.isZero(east))
      throw invalidArgument(
        where,
        'every departure is zero: the transit rule cannot distribute the east misclosure',
      );
    kLat = A.isZero(sumAbsLat) ? A.zero : A.div(A.neg(north), sumAbsLat);
    kDep = A.isZero(sumAbsDep) ? A.zero : A.div(A.neg(east), sumAbsDep);
  }

  const adjusted = new Array<Point<T>>(n + 1);
  const legs = new Array<TraverseLeg<T>>(n);
  adjusted[0] = start;
  let ax = start.x;
  let ay = start.y;
  for (let i = 0; i < n; i++) {
    const la = lat[i]!;
    const de = dep[i]!;
    const wLat = rule === 'compass' ? len[i]! : A.abs(la);
    const wDep = rule === 'compass' ? len[i]! : A.abs(de);
    const adjLat = A.add(la, A.mul(kLat, wLat));
    const adjDep = A.add(de, A.mul(kDep, wDep));
    ax = A.add(ax, adjDep);
    ay = A.add(ay, adjLat);
    adjusted[i + 1] = { x: ax, y: ay };
    legs[i] = {
      latitude: la,
      departure: de,
      length: len[i]!,
      adjustedLatitude: adjLat,
      adjustedDeparture: adjDep,
    };
  }

  const result: Traverse<T, E> = {
    closure: { east, north, linear, ratio },
    length: total,
    points,
    adjusted,
    courses: legs,
    rule,
  };
  return withAngles(result);
}
