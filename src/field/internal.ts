/**
 * Helpers shared by the field files: angle readings in degrees reduced to a turn, distances,
 * 3D points and tolerance checks. Not exported from the package.
 *
 * @module field
 * @internal
 */
import { QuadspreadError, invalidArgument, show } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { angleToDegrees, checkAngleUnit, type AngleUnit } from '../readings/angle.js';
import { modulo } from '../readings/trig.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { approxSqrt } from '../readings/numeric.js';

/** Arc-seconds in a degree. @internal */
export const ARCSEC = 3600;

/** A point with an optional level: x = east, y = north, z = up. */
export interface Point3Input<T> {
  /** East coordinate. */
  readonly x: Numeric<T>;
  /** North coordinate. */
  readonly y: Numeric<T>;
  /** Level (height), optional. */
  readonly z?: Numeric<T>;
}

/** A point with an optional level, read into the arithmetic. */
export interface Point3<T> {
  /** East. */
  readonly x: T;
  /** North. */
  readonly y: T;
  /** Level, when known. */
  readonly z?: T;
}

/**
 * One tolerance check: a quantity, its value, the tolerance it is held to and whether
 * |value| ≤ tolerance.
 */
export interface FieldCheck<T> {
  /** What is checked, e.g. `'collimation'` or `'backsight 2 angle'`. */
  readonly quantity: string;
  /** Its value (in the units the tolerance is stated in). */
  readonly value: T;
  /** The tolerance, ≥ 0. */
  readonly tolerance: T;
  /** |value| ≤ tolerance. */
  readonly ok: boolean;
}

/** Throws `INVALID_ARGUMENT` unless x is an object. @internal */
export function checkRecord(x: unknown, where: string): void {
  expectObject(x, where, 'an object of named inputs');
}

/** Reads an optional angle unit. @internal */
export function readUnit(unit: unknown, where: string): AngleUnit {
  return unit === undefined ? 'deg' : checkAngleUnit(unit, where);
}

/**
 * An angle reading in degrees (a value, a number in `unit`, or DMS text), its errors naming
 * `where` instead of the reader. @internal
 */
export function readDegrees<T>(
  A: Arithmetic<T>,
  x: Numeric<T> | undefined,
  unit: AngleUnit,
  where: string,
): T {
  if (x === undefined) throw invalidArgument(where, 'is missing: give an angle reading');
  try {
    return angleToDegrees(A, x, unit);
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    throw new QuadspreadError(
      e.code,
      where,
      e.message.slice(`quadspread ${e.code}: ${e.where}: `.length),
    );
  }
}

/** x reduced to [0°, 360°), exactly in an exact arithmetic. @internal */
export function turn<T>(A: Arithmetic<T>, x: T, where: string): T {
  return modulo(A, x, A.from(360), where);
}

/** x reduced to (−180°, 180°]. @internal */
export function halfTurn<T>(A: Arithmetic<T>, x: T, where: string): T {
  const r = turn(A, x, where);
  return A.cmp(r, A.from(180)) > 0 ? A.sub(r, A.from(360)) : r;
}

/** A distance ≥ 0. @internal */
export function readDistance<T>(A: Arithmetic<T>, x: Numeric<T> | undefined, where: string): T {
  if (x === undefined) throw invalidArgument(where, 'is missing: give a distance');
  const v = readNumber(A, x, where);
  if (A.sign(v) < 0)
    throw invalidArgument(
      where,
      `${show(typeof x === 'object' ? A.toString(v) : x)} is a negative distance`,
    );
  return v;
}

/** An optional number with a default. @internal */
export function readOptional<T>(
  A: Arithmetic<T>,
  x: Numeric<T> | undefined,
  fallback: T,
  where: string,
): T {
  return x === undefined ? fallback : readNumber(A, x, where);
}

/** A tolerance ≥ 0, or `undefined` when not given. @internal */
export function readTolerance<T>(
  A: Arithmetic<T>,
  x: Numeric<T> | undefined,
  where: string,
): T | undefined {
  if (x === undefined) return undefined;
  const v = readNumber(A, x, where);
  if (A.sign(v) < 0) throw invalidArgument(where, `${show(x)} is a negative tolerance`);
  return v;
}

/** Reads `{ x, y, z? }` (x = east, y = north, z = up). @internal */
export function readPoint3<T>(A: Arithmetic<T>, p: unknown, where: string): Point3<T> {
  if (p === null || typeof p !== 'object' || !('x' in p) || !('y' in p))
    throw invalidArgument(where, `${show(p)} is not a point { x, y, z? } (x = east, y = north)`);
  const q = p as Point3Input<T>;
  const x = readNumber(A, q.x, where, '.x');
  const y = readNumber(A, q.y, where, '.y');
  return q.z === undefined ? { x, y } : { x, y, z: readNumber(A, q.z, where, '.z') };
}

/** A check of |value| against a tolerance, added to `checks` when the tolerance is given. @internal */
export function check<T>(
  A: Arithmetic<T>,
  checks: FieldCheck<T>[],
  quantity: string,
  value: T,
  tolerance: T | undefined,
): void {
  if (tolerance !== undefined)
    checks.push({ quantity, value, tolerance, ok: A.cmp(A.abs(value), tolerance) <= 0 });
}

/** √q for q ≥ 0 as a value: exact where rational, else within 1e-48 relative in `rational`. @internal */
export function root<T>(A: Arithmetic<T>, q: T): T {
  return A.isZero(q) ? A.zero : approxSqrt(A, q);
}

/** The angle of (east, north) clockwise from north, degrees in [0, 360); exact at multiples of 45°. @internal */
export { azimuthOf } from '../cogo/inverse.js';

/** What side shots and setting out need of a set-up: a {@link StationSetup} or one written by hand. */
export interface SetupInput<T> {
  /** The station (x = east, y = north, z = level, optional). */
  readonly station: Point3Input<T>;
  /** Height of the instrument above the station mark (default 0). */
  readonly instrumentHeight?: Numeric<T>;
  /** The bearing of the circle's zero, degrees (or DMS text). */
  readonly orientation: Numeric<T>;
  /** The backsights; the first one's circle reading gives the angle from the backsight. */
  readonly backsights?: readonly { readonly circle: Numeric<T> }[];
}

/** A set-up read into the arithmetic. @internal */
export interface ReadSetup<T> {
  station: Point3<T>;
  hi: T;
  orientation: T;
  firstCircle?: T;
}

/** Reads a set-up. @internal */
export function readSetup<T>(A: Arithmetic<T>, setup: SetupInput<T>, where: string): ReadSetup<T> {
  checkRecord(setup, where);
  const station = readPoint3(A, setup.station, `${where}.station`);
  const hi = readOptional(A, setup.instrumentHeight, A.zero, `${where}.instrumentHeight`);
  const orientation = turn(
    A,
    readDegrees(A, setup.orientation, 'deg', `${where}.orientation`),
    `${where}.orientation`,
  );
  const bs = setup.backsights;
  if (bs === undefined) return { station, hi, orientation };
  if (!Array.isArray(bs))
    throw invalidArgument(`${where}.backsights`, `${show(bs)} is not an array`);
  if (bs.length === 0) return { station, hi, orientation };
  checkRecord(bs[0], `${where}.backsights[0]`);
  const firstCircle = turn(
    A,
    readDegrees(
      A,
      (bs[0] as { circle: Numeric<T> }).circle,
      'deg',
      `${where}.backsights[0].circle`,
    ),
    `${where}.backsights[0].circle`,
  );
  return { station, hi, orientation, firstCircle };
}
