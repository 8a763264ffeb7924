/**
 * The inverse computation (bearing and distance between two points) and the forward
 * computation (a point from a station, a bearing and a distance).
 *
 * @module cogo
 */
import { coincidentPoints, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { sqrtOf } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';
import { formatDms } from '../readings/dms.js';
import { sinCosDegrees } from '../readings/trig.js';
import { azimuthToQuadrant, readAzimuth } from './bearing.js';
import { readNumber, finiteResult } from '../geometry/validate.js';
import { readPoint } from './internal.js';
import type { PointInput } from './internal.js';

/** What {@link inverse} returns. */
export interface Inverse<T, E extends boolean> {
  /** Q − P: the direction vector (east, north), exact. */
  readonly direction: Point<T>;
  /** Quadrance (squared distance) from P to Q, exact in `rational`. */
  readonly quadrance: T;
  /** Distance √quadrance: a surd in an exact arithmetic, a value otherwise. */
  readonly distance: Root<T, E>;
  /** Azimuth from P to Q in decimal degrees, clockwise from north, in [0, 360). */
  readonly azimuth: T;
  /** The azimuth as DMS text, e.g. `248°05'35.0"`. */
  readonly dms: string;
  /** The azimuth as a quadrant bearing, e.g. `S 68°05'35.0" W`. */
  readonly quadrant: string;
}

/**
 * The inverse: direction vector, quadrance, distance and bearing from P to Q.
 *
 * Points are `{ x, y }` with x = east, y = north; the bearing is an azimuth clockwise
 * from north. The direction vector and the quadrance are exact in `rational`; the
 * distance is a surd there. The azimuth is exact in `rational` when it is a multiple of
 * 45° (the vector lies on an axis or a diagonal); otherwise it goes through `A.atan2`
 * and is within the arithmetic's transcendental tolerance (1e-40 relative in `rational`).
 *
 * @param A the arithmetic
 * @param P the station `{ x: east, y: north }`
 * @param Q the point sighted
 * @param options `secondsDecimals` for the DMS texts (0..6, default 1)
 * @returns `{ direction, quadrance, distance, azimuth, dms, quadrant }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when P = Q (no bearing); `INVALID_ARGUMENT` / `INVALID_NUMBER` for bad points.
 * @example
 * ```ts
 * import { rational, inverse } from 'quadspread';
 * const r = inverse(rational, { x: 0, y: 0 }, { x: -1, y: -1 });
 * [rational.toString(r.quadrance), r.distance.toString(), rational.toString(r.azimuth), r.quadrant];
 * //=> ['2', '√2', '225', `S 45°00'00.0" W`]
 * ```
 */
export function inverse<T, E extends boolean>(
  A: Arithmetic<T, E>,
  P: PointInput<T>,
  Q: PointInput<T>,
  options: { readonly secondsDecimals?: number } = {},
): Inverse<T, E> {
  checkArithmetic(A, 'inverse');
  const where = 'inverse(A, P, Q)';
  const p = readPoint(A, P, `${where} P`);
  const q = readPoint(A, Q, `${where} Q`);
  const dx = A.sub(q.x, p.x);
  const dy = A.sub(q.y, p.y);
  if (A.isZero(dx) && A.isZero(dy)) {
    throw coincidentPoints(
      where,
      `P and Q are the same point (${A.toString(p.x)}, ${A.toString(p.y)}): no bearing`,
    );
  }
  const quadrance = A.add(A.mul(dx, dx), A.mul(dy, dy));
  const azimuth = azimuthOf(A, dx, dy);
  const decimals = options.secondsDecimals ?? 1;
  return {
    direction: { x: dx, y: dy },
    quadrance,
    distance: sqrtOf(A, quadrance),
    azimuth,
    // An azimuth just below 360° may round to 360°00′00″: write it as 0°.
    dms: formatDms(A, azimuth, decimals).replace(/^360°/, '0°'),
    quadrant: azimuthToQuadrant(A, azimuth, decimals),
  };
}

/** Azimuth in degrees clockwise from north of the vector (east dx, north dy) ≠ 0. @internal */
export function azimuthOf<T>(A: Arithmetic<T, boolean>, dx: T, dy: T): T {
  const sx = A.sign(dx);
  const sy = A.sign(dy);
  // Exact on the axes and diagonals: multiples of 45°.
  if (sx === 0) return A.from(sy > 0 ? 0 : 180);
  if (sy === 0) return A.from(sx > 0 ? 90 : 270);
  if (A.eq(A.abs(dx), A.abs(dy))) return A.from(sx > 0 ? (sy > 0 ? 45 : 135) : sy < 0 ? 225 : 315);
  // Azimuth clockwise from north = atan2(east, north), in degrees (180°/π rad).
  let deg = A.div(A.mul(A.atan2(dx, dy), A.from(180)), A.pi);
  if (A.sign(deg) < 0) deg = A.add(deg, A.from(360));
  if (A.cmp(deg, A.from(360)) >= 0) deg = A.sub(deg, A.from(360));
  return deg;
}

/**
 * The forward computation: the point at a bearing and a horizontal distance from a
 * station: x = x₀ + d·sin(azimuth), y = y₀ + d·cos(azimuth) (x = east, y = north,
 * azimuth clockwise from north).
 *
 * Exact when the sine and cosine of the bearing are rational (multiples of 90°, and sin
 * at 30°, 150°, … as the readings' `sinCosDegrees` says); otherwise in `rational` within
 * its transcendental tolerance (1e-40 relative), correctly rounded in `decimal`, IEEE in
 * `float`.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param P the station `{ x: east, y: north }`
 * @param bearing azimuth clockwise from north (degrees or DMS text) or a quadrant bearing
 * @param distance horizontal distance, ≥ 0, in the coordinate unit
 * @returns the new point
 * @throws {QuadspreadError} `INVALID_BEARING` for a bearing that does not parse; `INVALID_ARGUMENT` for a negative distance; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, forward } from 'quadspread';
 * const p = forward(rational, { x: 100, y: 200 }, `S 30° E`, 10);
 * [rational.toString(p.x), rational.toNumber(p.y).toFixed(9)];
 * //=> ['105', '191.339745962']
 * ```
 */
export function forward<T>(
  A: Arithmetic<T, boolean>,
  P: PointInput<T>,
  bearing: Numeric<T>,
  distance: Numeric<T>,
): Point<T> {
  checkArithmetic(A, 'forward');
  const where = 'forward(A, P, bearing, distance)';
  const p = readPoint(A, P, `${where} P`);
  const az = readAzimuth(A, bearing, `${where} bearing`);
  const d = readNumber(A, distance, where, ' distance');
  if (A.sign(d) < 0) throw invalidArgument(`${where} distance`, `${A.toString(d)} is negative`);
  const { sin, cos } = sinCosDegrees(A, az);
  // Departure d·sin(azimuth), latitude d·cos(azimuth).
  return {
    x: finiteResult(A.add(p.x, A.mul(d, sin)), where),
    y: finiteResult(A.add(p.y, A.mul(d, cos)), where),
  };
}
