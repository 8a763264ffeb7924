/**
 * Station set-up: the orientation of the horizontal circle from one or more backsights to
 * known points, with the residual of each and a check against tolerances.
 *
 * @module field
 */
import {
  QuadspreadError,
  coincidentPoints,
  invalidArgument,
  show,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { AngleUnit } from '../readings/angle.js';
import { sinCosDegrees } from '../readings/trig.js';
import { readArray } from '../cogo/internal.js';
import { reduceAt, type FieldObservation } from './reduce.js';
import {
  ARCSEC,
  azimuthOf,
  check,
  checkRecord,
  halfTurn,
  readDegrees,
  readOptional,
  readPoint3,
  readTolerance,
  readUnit,
  root,
  turn,
  type FieldCheck,
  type Point3,
  type Point3Input,
} from './internal.js';

/** A sight to a known point: its coordinates and the readings taken to it. */
export interface Backsight<T> extends Omit<FieldObservation<T>, 'zenith' | 'slope' | 'unit'> {
  /** The known point sighted. */
  readonly point: Point3Input<T>;
  /** Horizontal circle reading to it. */
  readonly circle: Numeric<T>;
  /** Zenith angle, when a distance was read too. */
  readonly zenith?: Numeric<T>;
  /** Slope distance, when read (needs `zenith`). */
  readonly slope?: Numeric<T>;
  /** A name for reports. */
  readonly name?: string;
}

/** Tolerances of a set-up. */
export interface SetupTolerance<T> {
  /** Largest acceptable |angle residual|, arc-seconds. */
  readonly angle?: Numeric<T>;
  /** Largest acceptable |horizontal distance residual|, metres. */
  readonly distance?: Numeric<T>;
  /** Largest acceptable |height residual|, metres. */
  readonly height?: Numeric<T>;
}

/** The input of {@link orientStation}. */
export interface OrientInput<T> {
  /** The station's coordinates (x = east, y = north, z = level, optional). */
  readonly station: Point3Input<T>;
  /** Height of the instrument above the station mark (default 0). */
  readonly instrumentHeight?: Numeric<T>;
  /** One or more backsights. */
  readonly backsights: readonly Backsight<T>[];
  /**
   * `'equal'` (default): the orientation is the plain mean over the backsights;
   * `'quadrance'`: weighted by the squared distance to each, as the centring part of a
   * direction's variance falls as 1/d² (common practice).
   */
  readonly weighting?: 'equal' | 'quadrance';
  /** Tolerances for the residuals. */
  readonly tolerance?: SetupTolerance<T>;
  /** Unit of numeric angles (default `'deg'`). */
  readonly unit?: AngleUnit;
}

/** One backsight in a {@link StationSetup}. */
export interface BacksightResult<T> {
  /** The name given, or `backsight n` (from 1). */
  readonly name: string;
  /** The known point. */
  readonly point: Point3<T>;
  /** The circle reading, degrees in [0°, 360°). */
  readonly circle: T;
  /** The bearing from the station to the point (from coordinates), degrees. */
  readonly bearing: T;
  /** bearing − circle, this backsight's own orientation, degrees in [0°, 360°). */
  readonly orientation: T;
  /** bearing − (circle + orientation of the set-up), arc-seconds in (−648000, 648000]. */
  readonly angleResidual: T;
  /** The horizontal distance from coordinates. */
  readonly distance: T;
  /** The horizontal distance measured, when read. */
  readonly measuredDistance?: T;
  /** measured − from coordinates, when read. */
  readonly distanceResidual?: T;
  /** Measured position − known position (east, north), when a distance was read. */
  readonly positionResidual?: { readonly x: T; readonly y: T };
  /** Measured level − known level, when both levels and a distance are known. */
  readonly heightResidual?: T;
}

/** A set-up: what {@link orientStation} returns, and what side shots and setting out use. */
export interface StationSetup<T> {
  /** The station. */
  readonly station: Point3<T>;
  /** Height of the instrument above the station mark. */
  readonly instrumentHeight: T;
  /** The bearing of the circle's zero, degrees in [0°, 360°): bearing = circle + orientation. */
  readonly orientation: T;
  /** The weighting of the mean. */
  readonly weighting: 'equal' | 'quadrance';
  /** The backsights, with their residuals. */
  readonly backsights: readonly BacksightResult<T>[];
  /** One check per residual and tolerance given. */
  readonly checks: readonly FieldCheck<T>[];
  /** Every check holds. */
  readonly ok: boolean;
}

/**
 * The circle reading as face left: less 180° when the zenith angle given is face right. @internal
 */
export function faceLeftCircle<T>(
  A: Arithmetic<T>,
  o: { readonly circle?: Numeric<T>; readonly zenith?: Numeric<T> },
  unit: AngleUnit,
  at: string,
): T {
  const c = readDegrees(A, o.circle, unit, `${at}.circle`);
  const right =
    o.zenith !== undefined &&
    A.cmp(readDegrees(A, o.zenith, unit, `${at}.zenith`), A.from(180)) > 0;
  return turn(A, right ? A.sub(c, A.from(180)) : c, `${at}.circle`);
}

/**
 * Orients a station set-up: from each backsight the orientation (the bearing of the circle's
 * zero) is bearing − circle, the bearing from the coordinates (a circle read face right, with
 * a zenith angle over 180°, counts less 180°); with several, their mean
 * reduced about the first (so readings either side of 0° average correctly), equally
 * weighted or by the squared distance. Each backsight gets its residual: the angle
 * (bearing − circle − orientation, arc-seconds) and, when a slope and zenith angle were read,
 * the horizontal distance, the position and (with both levels) the height, measured − known.
 *
 * Exact in `rational` when every bearing is a multiple of 45° (otherwise the bearing's atan2
 * is within `rational`'s transcendental tolerance, 1e-40 relative); the distance from
 * coordinates is a square root (within 1e-48 relative where irrational).
 *
 * @param A the arithmetic
 * @param input `station`, `instrumentHeight`, `backsights`, `weighting`, `tolerance`, `unit`
 * @returns the set-up `{ station, instrumentHeight, orientation, weighting, backsights,
 *   checks, ok }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for no backsight; `COINCIDENT_POINTS` for a
 *   backsight on the station itself; `INVALID_ARGUMENT` for a point without coordinates, a
 *   slope without a zenith angle, an unknown weighting or a negative tolerance; as
 *   {@link reduceObservation} for the readings.
 * @example
 * ```ts
 * import { rational, orientStation } from 'quadspread';
 * const s = orientStation(rational, {
 *   station: { x: 100, y: 100 },
 *   backsights: [{ point: { x: 100, y: 200 }, circle: 30 }, { point: { x: 200, y: 100 }, circle: `120°00'02"` }],
 * });
 * [rational.toString(s.orientation), s.backsights.map((b) => rational.toString(b.angleResidual))];
 * //=> ['1187999/3600', ['1', '-1']]
 * ```
 */
export function orientStation<T>(A: Arithmetic<T>, input: OrientInput<T>): StationSetup<T> {
  checkArithmetic(A, 'orientStation');
  const w = 'orientStation(input)';
  checkRecord(input, w);
  const unit = readUnit(input.unit, `${w}.unit`);
  const station = readPoint3(A, input.station, `${w}.station`);
  const hi = readOptional(A, input.instrumentHeight, A.zero, `${w}.instrumentHeight`);
  const weighting = input.weighting ?? 'equal';
  if (weighting !== 'equal' && weighting !== 'quadrance')
    throw invalidArgument(`${w}.weighting`, `${show(weighting)} is not 'equal' or 'quadrance'`);
  const tol = input.tolerance ?? {};
  checkRecord(tol, `${w}.tolerance`);
  const tAngle = readTolerance(A, tol.angle, `${w}.tolerance.angle`);
  const tDistance = readTolerance(A, tol.distance, `${w}.tolerance.distance`);
  const tHeight = readTolerance(A, tol.height, `${w}.tolerance.height`);
  const list = readArray<Backsight<T>>(input.backsights, `${w}.backsights`, 10000);
  if (list.length === 0)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${w}.backsights`,
      'a set-up needs at least one backsight',
    );
  const seen = list.map((b, i) => {
    const at = `${w}.backsights[${i}]`;
    checkRecord(b, at);
    const point = readPoint3(A, b.point, `${at}.point`);
    const dx = A.sub(point.x, station.x);
    const dy = A.sub(point.y, station.y);
    if (A.isZero(dx) && A.isZero(dy))
      throw coincidentPoints(
        `${at}.point`,
        'the backsight is the station itself: it has no bearing',
      );
    const circle = faceLeftCircle(A, b, unit, at);
    const bearing = azimuthOf(A, dx, dy);
    const Q = A.add(A.mul(dx, dx), A.mul(dy, dy));
    return {
      at,
      b,
      point,
      circle,
      bearing,
      Q,
      own: turn(A, A.sub(bearing, circle), `${at}.circle`),
    };
  });
  // The mean of bearing − circle, each reduced to within ±180° of the first.
  const first = seen[0]!.own;
  let sum = A.zero;
  let weights = A.zero;
  for (const s of seen) {
    const wt = weighting === 'equal' ? A.one : s.Q;
    sum = A.add(sum, A.mul(wt, halfTurn(A, A.sub(s.own, first), s.at)));
    weights = A.add(weights, wt);
  }
  const orientation = turn(A, A.add(first, A.div(sum, weights)), w);
  const sec = A.from(ARCSEC);
  const checks: FieldCheck<T>[] = [];
  const backsights = seen.map((s, i): BacksightResult<T> => {
    const name = s.b.name === undefined ? `backsight ${i + 1}` : String(s.b.name);
    const angleResidual = A.mul(halfTurn(A, A.sub(s.own, orientation), s.at), sec);
    check(A, checks, `${name} angle`, angleResidual, tAngle);
    const distance = root(A, s.Q);
    const base = {
      name,
      point: s.point,
      circle: s.circle,
      bearing: s.bearing,
      orientation: s.own,
      angleResidual,
      distance,
    };
    if (s.b.slope === undefined) return base;
    if (s.b.zenith === undefined)
      throw invalidArgument(
        `${s.at}.zenith`,
        'is missing: a slope distance needs its zenith angle',
      );
    const r = reduceAt(A, { ...s.b, zenith: s.b.zenith, slope: s.b.slope, unit }, s.at, hi);
    const D = r.gridDistance ?? r.horizontalDistance;
    const { sin, cos } = sinCosDegrees(A, A.add(s.circle, orientation));
    const positionResidual = {
      x: A.sub(A.add(station.x, A.mul(D, sin)), s.point.x),
      y: A.sub(A.add(station.y, A.mul(D, cos)), s.point.y),
    };
    const distanceResidual = A.sub(D, distance);
    check(A, checks, `${name} distance`, distanceResidual, tDistance);
    const out = { ...base, measuredDistance: D, distanceResidual, positionResidual };
    if (station.z === undefined || s.point.z === undefined) return out;
    const heightResidual = A.sub(A.add(station.z, r.heightDifference), s.point.z);
    check(A, checks, `${name} height`, heightResidual, tHeight);
    return { ...out, heightResidual };
  });
  return {
    station,
    instrumentHeight: hi,
    orientation,
    weighting,
    backsights,
    checks,
    ok: checks.every((c) => c.ok),
  };
}
