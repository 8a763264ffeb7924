/**
 * The height of a point seen from two stations of known position, its foot known in plan.
 *
 * @module elevation
 */
import {
  invalidArgument,
  coincidentPoints,
  verticalSight,
  inconsistentReadings,
  checkArithmetic,
} from '../errors.js';
import { checkObject, PLUMB_SIGHT } from './input.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { quadrance } from '../geometry/quadrance.js';
import { readPoint } from '../geometry/validate.js';
import type { PointInput } from '../geometry/point.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';
import { heightFromReading } from './height.js';
import { heightDifference, heightFromQuadrance } from './signed-height.js';
import type { Root } from '../geometry/surd.js';

/** The result of {@link heightFromTwoStations}. */
export interface TwoStationHeight<T> {
  /** H from the first station: Q₁·R₁/(1 − R₁). */
  readonly H1: T;
  /** H from the second station. */
  readonly H2: T;
  /** H1 − H2, a difference of quadrances (square of the length unit): zero for consistent readings. */
  readonly discrepancy: T;
  /**
   * h₁ − h₂, the signed heights from the two readings, in the length unit (e.g. metres): the
   * disagreement to compare with a tolerance. An exact surd in `rational` when √H1 and √H2 are
   * rational or share a radicand, otherwise a value within 10⁻⁴⁰ relative; a value in `decimal`
   * and `float`.
   */
  readonly heightDiscrepancy: Root<T, boolean>;
  /** The weighted mean (w₁H₁ + w₂H₂)/(w₁ + w₂): the point's vertical quadrance. */
  readonly H: T;
  /**
   * The signed height h = ±√H of the mean (positive above the stations' level): an exact surd
   * in `rational`, a value otherwise (see {@link heightFromQuadrance}).
   */
  readonly height: Root<T, boolean>;
  /** The weights w = (1 − R)²/Q of the two readings (not normalised). */
  readonly weights: readonly [T, T];
  /** +1 when the point is above the stations' level, −1 below, 0 on it. */
  readonly sign: -1 | 0 | 1;
}

/**
 * The vertical quadrance of a point above the stations' common level from two stations of
 * known plan position, each with a vertical reading to the point, the point's foot known
 * in plan: H from each by {@link heightFromReading}, their discrepancy, and a weighted mean.
 *
 * The weights are w = (1 − R)²/Q: a vertical-angle error dα moves the height by
 * dh = D·sec²α·dα = D/(1 − R)·dα (derived by differentiating h = D·tan α), so with equal
 * angular precision the variance of each height is proportional to Q/(1 − R)²; the mean
 * weights by its inverse. Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `stations`: the two stations `{ x, y }` (x east, y north); `foot`: the foot of
 *   the point in plan; `vertical`: the two readings (spreads or signed readings), same order
 * @returns `{ H1, H2, discrepancy, heightDiscrepancy, H, height, weights, sign }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when a station is at the foot;
 *   `VERTICAL_SIGHT` for a spread of 1; `INCONSISTENT_READINGS` when one reading is above
 *   the horizon and the other below; `INVALID_ARGUMENT` unless two stations and two readings
 *   are given; `SPREAD_OUT_OF_RANGE`.
 * @example
 * ```ts
 * import { rational, heightFromTwoStations } from 'quadspread';
 * const r = heightFromTwoStations(rational, {
 *   stations: [{ x: 0, y: 0 }, { x: 10, y: 0 }],
 *   foot: { x: 4, y: 3 },
 *   vertical: ['1/2', '25/70'],
 * });
 * [rational.toString(r.H1), rational.toString(r.H2), rational.toString(r.discrepancy)];
 * //=> ['25', '25', '0']
 * ```
 */
export function heightFromTwoStations<T>(
  A: Arithmetic<T>,
  input: {
    stations: readonly [PointInput<T>, PointInput<T>];
    foot: PointInput<T>;
    vertical: readonly [VerticalInput<T>, VerticalInput<T>];
  },
): TwoStationHeight<T> {
  checkArithmetic(A, 'heightFromTwoStations');
  const w = 'heightFromTwoStations(input)';
  checkObject(input, w);
  if (!Array.isArray(input.stations) || input.stations.length !== 2)
    throw invalidArgument(`${w}.stations`, 'give exactly two stations');
  if (!Array.isArray(input.vertical) || input.vertical.length !== 2)
    throw invalidArgument(`${w}.vertical`, 'give exactly two vertical readings');
  const F = readPoint(A, input.foot, `${w}.foot`);
  const H: T[] = [];
  const weights: T[] = [];
  const signs: number[] = [];
  for (let i = 0; i < 2; i++) {
    const P = readPoint(A, input.stations[i]!, `${w}.stations[${i}]`);
    const Q = quadrance(A, P, F);
    if (A.isZero(Q))
      throw coincidentPoints(
        `${w}.stations[${i}]`,
        'the station is at the foot of the point: its reading is a plumb sight',
      );
    const v = readVertical(A, input.vertical[i]!, `${w}.vertical[${i}]`);
    const c = A.sub(A.one, v.spread);
    if (A.isZero(c)) throw verticalSight(`${w}.vertical[${i}]`, PLUMB_SIGHT);
    H.push(heightFromReading(A, { horizontal: Q, vertical: v }));
    weights.push(A.div(A.mul(c, c), Q)); // w = (1 − R)²/Q (derived: dh = D/(1 − R)·dα)
    signs.push(v.sign);
  }
  if (signs[0]! * signs[1]! < 0) {
    throw inconsistentReadings(
      `${w}.vertical`,
      'one reading is above the horizon and the other below',
    );
  }
  const [w1, w2] = weights as [T, T];
  const mean = A.div(A.add(A.mul(w1, H[0]!), A.mul(w2, H[1]!)), A.add(w1, w2));
  const sign = (signs[0] !== 0 ? signs[0] : signs[1]) as -1 | 0 | 1;
  return {
    H1: H[0]!,
    H2: H[1]!,
    discrepancy: A.sub(H[0]!, H[1]!),
    heightDiscrepancy: heightDifference(
      A as Arithmetic<T, boolean>,
      H[0]! as Root<T, boolean>,
      H[1]! as Root<T, boolean>,
      sign,
    ),
    H: mean,
    height: heightFromQuadrance(A as Arithmetic<T, boolean>, mean, A.isZero(mean) ? 0 : sign),
    weights: [w1, w2],
    sign,
  };
}
