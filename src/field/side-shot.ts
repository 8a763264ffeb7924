/**
 * Side shots: 3D coordinates of points observed from an oriented set-up.
 *
 * @module field
 */
import { invalidArgument, checkArithmetic, show } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { sinCosDegrees } from '../readings/trig.js';
import { finiteResult } from '../geometry/validate.js';
import { readArray } from '../cogo/internal.js';
import { shotFloat, sideShotsFloat } from './side-shot-float.js';
import { reduceAt, type FieldObservation } from './reduce.js';
import { readSetup, turn, type ReadSetup, type SetupInput } from './internal.js';

/** One side shot: an observation with its circle reading, and an optional name. */
export interface Shot<T> extends Omit<FieldObservation<T>, 'instrumentHeight'> {
  /** A name for reports (kept as given). */
  readonly name?: string;
}

/** A point fixed by a side shot. */
export interface SideShot<T> {
  /** The name given, if any. */
  readonly name?: string;
  /** East. */
  readonly x: T;
  /** North. */
  readonly y: T;
  /** Level: the station's level + the height difference (only when the station has one). */
  readonly z?: T;
  /** Bearing from the station, degrees in [0°, 360°): circle (face left) + orientation. */
  readonly bearing: T;
  /** The horizontal distance used (the grid distance when the shot asked for `grid`). */
  readonly horizontalDistance: T;
  /** Height of the point's mark above the station mark. */
  readonly heightDifference: T;
}

/**
 * The 3D point observed by one side shot from a set-up: the observation is reduced as
 * {@link reduceObservation} reduces it (with the set-up's instrument height), and
 * x = x₀ + D·sin β, y = y₀ + D·cos β, z = z₀ + Δh, with β = circle + orientation the bearing
 * (clockwise from north; x = east, y = north) and D the horizontal (or grid) distance.
 *
 * For standard uncertainties, run it in `uncertain(base)` with measured readings
 * (`measuredAngle` for the circle and zenith, `measuredDistance` for the slope, a set-up
 * whose orientation and station carry theirs) and ask `budget` of x, y or z.
 *
 * Exact in `rational` when the bearing and zenith angle have rational sines and cosines
 * (multiples of 90°, …); otherwise within `rational`'s transcendental tolerance (1e-40
 * relative).
 *
 * A computational aid: check independently.
 *
 * @param A the arithmetic
 * @param setup an oriented set-up ({@link orientStation}, or `{ station, instrumentHeight?,
 *   orientation }` written by hand)
 * @param shot the readings: `circle`, `zenith`, `slope`, `targetHeight?` and the corrections
 *   of {@link FieldObservation}
 * @returns `{ name?, x, y, z?, bearing, horizontalDistance, heightDifference }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing circle, an instrument height on
 *   the shot (the set-up has it) or a bad set-up; as {@link reduceObservation}.
 * @example
 * ```ts
 * import { rational, sideShot } from 'quadspread';
 * const setup = { station: { x: 500, y: 800, z: 20 }, instrumentHeight: '1.5', orientation: 90 };
 * const p = sideShot(rational, setup, { circle: 90, zenith: 90, slope: 25, targetHeight: 2 });
 * [rational.toString(p.x), rational.toString(p.y), rational.toString(p.z!)];
 * //=> ['500', '775', '39/2']
 * ```
 */
export function sideShot<T>(A: Arithmetic<T>, setup: SetupInput<T>, shot: Shot<T>): SideShot<T> {
  checkArithmetic(A, 'sideShot');
  const s = readSetup(A, setup, 'sideShot(setup)');
  if (A.float64 === true) {
    const fast = shotFloat(s as unknown as ReadSetup<number>, shot);
    if (fast !== undefined) return fast as unknown as SideShot<T>;
  }
  return shotFrom(A, s, shot, 'sideShot(shot)');
}

/**
 * Every side shot of a list from one set-up (read once): {@link sideShot} for each.
 *
 * @param A the arithmetic
 * @param setup the oriented set-up
 * @param shots the observations
 * @returns the points, in order
 * @throws {QuadspreadError} as {@link sideShot}, naming the shot's index; `INVALID_ARGUMENT`
 *   when `shots` is not an array.
 * @example
 * ```ts
 * import { rational, sideShots } from 'quadspread';
 * const setup = { station: { x: 0, y: 0 }, orientation: 0 };
 * sideShots(rational, setup, [{ circle: 0, zenith: 90, slope: 10 }, { circle: 270, zenith: 90, slope: 4 }])
 *   .map((p) => [rational.toString(p.x), rational.toString(p.y)]);
 * //=> [['0', '10'], ['-4', '0']]
 * ```
 */
export function sideShots<T>(
  A: Arithmetic<T>,
  setup: SetupInput<T>,
  shots: readonly Shot<T>[],
): SideShot<T>[] {
  checkArithmetic(A, 'sideShots');
  const s = readSetup(A, setup, 'sideShots(setup)');
  const list = readArray<Shot<T>>(shots, 'sideShots(shots)');
  // Float: the twin, on plain numbers (docs/performance.md, "Float: twins in the generic
  // source"); undefined when a shot needs the generic path below.
  if (A.float64 === true) {
    const fast = sideShotsFloat(s as unknown as ReadSetup<number>, list);
    if (fast !== undefined) return fast as unknown as SideShot<T>[];
  }
  return list.map((o, i) => shotFrom(A, s, o, `sideShots(shots)[${i}]`));
}

/** One side shot from a read set-up. @internal */
export function shotFrom<T>(
  A: Arithmetic<T>,
  s: ReadSetup<T>,
  shot: Shot<T>,
  w: string,
): SideShot<T> {
  const r = reduceAt(A, shot, w, s.hi);
  if ((shot as FieldObservation<T>).instrumentHeight !== undefined)
    throw invalidArgument(`${w}.instrumentHeight`, 'the set-up carries the instrument height');
  if (r.circle === undefined)
    throw invalidArgument(`${w}.circle`, 'is missing: a side shot needs its circle reading');
  const bearing = turn(A, A.add(r.circle, s.orientation), w);
  const D = r.gridDistance ?? r.horizontalDistance;
  const { sin, cos } = sinCosDegrees(A, bearing);
  const z =
    s.station.z === undefined ? {} : { z: finiteResult(A.add(s.station.z, r.heightDifference), w) };
  return {
    ...(shot.name !== undefined ? { name: shotName(shot.name, w) } : {}),
    x: finiteResult(A.add(s.station.x, A.mul(D, sin)), w),
    y: finiteResult(A.add(s.station.y, A.mul(D, cos)), w),
    ...z,
    bearing,
    horizontalDistance: D,
    heightDifference: r.heightDifference,
  };
}

/**
 * A shot's name as text: a string, or a number or bigint written as text; anything else (an
 * object, whose conversion to text could run its own code or throw) is refused. @internal
 */
export function shotName(name: unknown, w: string): string {
  if (typeof name === 'string') return name;
  if (typeof name === 'number' || typeof name === 'bigint') return String(name);
  throw invalidArgument(`${w}.name`, `${show(name)} is not a text`);
}
