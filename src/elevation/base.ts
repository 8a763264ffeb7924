/**
 * The height of a point whose foot cannot be reached, from two stations on a measured base
 * with horizontal spreads at each towards the point's foot.
 *
 * @module elevation
 */
import {
  QuadspreadError,
  show,
  coincidentPoints,
  invalidArgument,
  invalidAngle,
  verticalSight,
  inconsistentReadings,
  checkArithmetic,
} from '../errors.js';
import { checkObject, PLUMB_SIGHT } from './input.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Root } from '../geometry/surd.js';
import { solveTriangleQs as solveTriangle } from '../geometry/solve-triangle.js';
import { readQuadrance, readSpread, shownInput } from '../geometry/validate.js';
import { angleToDegrees } from '../readings/angle.js';
import { spreadFromDegrees } from '../readings/spread.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';
import { rootOps } from './roots.js';
import { heightDifference, signedHeightOfRoot } from './signed-height.js';

/**
 * Where the foot of the point lies, seen along the base: `'between'` when its
 * perpendicular projection on the base line falls between the two stations (both interior
 * angles at the stations acute), `'beyond'` when it falls beyond one of them (one interior
 * angle obtuse — necessarily at the station with the larger spread).
 */
export type FootSide = 'between' | 'beyond';

/** The result of {@link heightFromBase}. */
export interface BaseHeight<T, E extends boolean> {
  /** Horizontal quadrances from the first and the second station to the foot (spread law). */
  readonly horizontalQuadrances: readonly [Root<T, E>, Root<T, E>];
  /** @deprecated Kept for one release: the same as {@link BaseHeight.horizontalQuadrances}. */
  readonly horizontal: readonly [Root<T, E>, Root<T, E>];
  /** The spread at the foot between the lines to the two stations (triple spread formula). */
  readonly spreadAtFoot: Root<T, E>;
  /** H from each station's vertical reading (`undefined` where none was given). */
  readonly verticalQuadrances: readonly [Root<T, E> | undefined, Root<T, E> | undefined];
  /** @deprecated Kept for one release: the same as {@link BaseHeight.verticalQuadrances}. */
  readonly heights: readonly [Root<T, E> | undefined, Root<T, E> | undefined];
  /** The vertical quadrance: the weighted mean of those given (see {@link heightFromBase}). */
  readonly H: Root<T, E>;
  /**
   * The signed height h = ±√H (positive above the stations' level). Exact in `rational` when H
   * is rational; when H is itself a surd, √H is no quadratic surd and `height` is a rational
   * within 10⁻⁴⁸ relative (a value in `decimal` and `float`, rounded as there).
   */
  readonly height: Root<T, E>;
  /**
   * verticalQuadrances[0] − verticalQuadrances[1] when both readings are given: a difference of
   * quadrances (square of the length unit). See {@link BaseHeight.heightDiscrepancy} for the
   * same disagreement as a length.
   */
  readonly discrepancy: Root<T, E> | undefined;
  /**
   * h₁ − h₂, the signed heights from the first and the second reading, in the length unit
   * (e.g. metres), when both readings are given: the disagreement to compare with a tolerance.
   * Computed as (H₁ − H₂)/(|h₁| + |h₂|) (no cancellation); exact in `rational` when the two
   * heights are rational or share a radicand, otherwise a rational within 10⁻⁴⁰ relative.
   */
  readonly heightDiscrepancy: Root<T, E> | undefined;
  /** +1 above the stations' level, −1 below, 0 on it. */
  readonly sign: -1 | 0 | 1;
}

/**
 * Two stations on a measured base of quadrance `base`, a horizontal spread at each between
 * the base and the line to the foot of a point that cannot be reached, and a vertical
 * reading from one or both stations: the horizontal quadrances by the spread law and the
 * point's vertical quadrance H above the stations' level.
 *
 * The spread s₃ at the foot follows from the triple spread formula
 * (s₁ + s₂ + s₃)² = 2(s₁² + s₂² + s₃²) + 4s₁s₂s₃ (derived: the
 * angles of a triangle sum to a straight angle, written in sin²), whose two solutions s₃ = s₁ + s₂ − 2s₁s₂ ± 2√(s₁s₂(1 − s₁)(1 − s₂)) are the two
 * triangles the spreads allow: `+` when both interior angles at the stations are acute
 * (`foot: 'between'`), `−` when one is obtuse (`foot: 'beyond'`). Spreads alone cannot tell
 * them apart: the caller says which with `foot`, or gives the horizontal interior `angles`
 * (degrees or DMS, each in (0°, 180°)), from which the spreads and the side follow. Then
 * the spread law Q/s = Q_base/s₃ (same source and chapter) gives Q(station 1, foot) =
 * base·s₂/s₃ and Q(station 2, foot) = base·s₁/s₃ (both by {@link solveTriangle}), and
 * {@link heightFromReading} each H.
 *
 * With both vertical readings, H is their mean weighted by (1 − R)²/Q (as in
 * {@link heightFromTwoStations}), here (1 − R₁)²·s₁ and (1 − R₂)²·s₂ after the common
 * factor is taken out. Results are exact surds in `rational` (given spreads; angles in
 * degrees are transcendental, see {@link spreadFromDegrees}), values otherwise.
 *
 * @param A the arithmetic
 * @param input `base`: the quadrance between the stations; either `spreads: [s1, s2]` with
 *   `foot: 'between' | 'beyond'`, or `angles: [a1, a2]`; `vertical: [R1, R2]` (either may
 *   be `undefined`, not both)
 * @returns `{ horizontalQuadrances, spreadAtFoot, verticalQuadrances, H, height, discrepancy,
 *   heightDiscrepancy, sign }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing or unknown `foot`, both or
 *   neither of `spreads` and `angles`, or no vertical reading; `COLLINEAR_POINTS` when a
 *   spread is 0 (the foot on the base line); `DEGENERATE_TRIANGLE` when the spreads admit
 *   no triangle on that side (equal spreads with `'beyond'`, angles summing to 180° or more);
 *   `INCONSISTENT_READINGS` for readings on opposite sides of the horizon;
 *   `VERTICAL_SIGHT`; `SPREAD_OUT_OF_RANGE`; `NEGATIVE_QUADRANCE`; `INVALID_ANGLE`.
 * @example
 * ```ts
 * import { rational, heightFromBase } from 'quadspread';
 * // base 0→(14, 0); foot (5, 12): spreads 144/169 at the first station, 144/225 at the second
 * const r = heightFromBase(rational, { base: 196, spreads: ['144/169', '16/25'], foot: 'between', vertical: ['1/2', undefined] });
 * [r.horizontal[0].toString(), r.horizontal[1].toString(), r.H.toString()];
 * //=> ['169', '225', '169']
 * ```
 */
export function heightFromBase<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: {
    base: Numeric<T>;
    spreads?: readonly [Numeric<T>, Numeric<T>];
    foot?: FootSide;
    angles?: readonly [Numeric<T>, Numeric<T>];
    vertical: readonly [VerticalInput<T> | undefined, VerticalInput<T> | undefined];
  },
): BaseHeight<T, E> {
  checkArithmetic(A, 'heightFromBase');
  const w = 'heightFromBase(input)';
  checkObject(input, w);
  const R = rootOps(A);
  const base = readQuadrance(A, input.base, w, 'base');
  if (A.isZero(base))
    throw coincidentPoints(`${w}.base`, 'the base is zero: the stations coincide');
  let s1: T;
  let s2: T;
  let side: FootSide;
  if ((input.spreads == null) === (input.angles == null)) {
    throw invalidArgument(w, 'give either spreads (with foot) or angles, not both or neither');
  }
  if (input.angles != null) {
    if (input.foot !== undefined)
      throw invalidArgument(`${w}.foot`, 'angles already fix the side of the foot; leave foot out');
    if (!Array.isArray(input.angles) || input.angles.length !== 2)
      throw invalidArgument(`${w}.angles`, `${show(input.angles)} is not a pair of angles`);
    const a = Array.from(input.angles, (x, i) => {
      const d = angleToDegrees(A, x);
      if (A.sign(d) <= 0 || A.cmp(d, A.from(180)) >= 0)
        throw invalidAngle(
          `${w}.angles[${i}]`,
          `${shownInput(A, x, d)} is not an interior angle in (0°, 180°)`,
        );
      return d;
    });
    if (A.cmp(A.add(a[0]!, a[1]!), A.from(180)) >= 0)
      throw new QuadspreadError(
        'DEGENERATE_TRIANGLE',
        `${w}.angles`,
        'the two interior angles sum to 180° or more: the sights do not meet',
      );
    s1 = spreadFromDegrees(A, a[0]!);
    s2 = spreadFromDegrees(A, a[1]!);
    const ninety = A.from(90);
    side = A.cmp(a[0]!, ninety) > 0 || A.cmp(a[1]!, ninety) > 0 ? 'beyond' : 'between';
  } else {
    if (input.foot !== 'between' && input.foot !== 'beyond') {
      throw invalidArgument(
        `${w}.foot`,
        `${show(input.foot)} is not 'between' or 'beyond': spreads alone allow two triangles, say which`,
      );
    }
    side = input.foot;
    s1 = readSpread(A, input.spreads![0], w, 'spreads[0]');
    s2 = readSpread(A, input.spreads![1], w, 'spreads[1]');
  }
  if (A.isZero(s1) || A.isZero(s2))
    throw new QuadspreadError(
      'COLLINEAR_POINTS',
      `${w}.spreads`,
      'a spread of 0 puts the foot on the base line',
    );
  const one = A.one;
  // Geometry's triangle solver with the base Q3 and the spreads s1, s2 at its ends: the triple
  // spread formula gives s3 = p ± 2√(s1 s2 (1 − s1)(1 − s2)), p = s1 + s2 − 2 s1 s2, and the
  // spread law the sides. The '+' triangle has the foot between the stations, the '−' one beyond.
  const p = A.sub(A.add(s1, s2), A.mul(A.from(2), A.mul(s1, s2)));
  const found = solveTriangle(A, { Q3: base, s1, s2 }).find((t) => {
    const above = R.sign(R.sub(t.s3, p));
    return side === 'between' ? above >= 0 : above <= 0;
  });
  if (found === undefined)
    throw new QuadspreadError(
      'DEGENERATE_TRIANGLE',
      `${w}.spreads`,
      `with foot '${side}' the spreads ${A.toString(s1)} and ${A.toString(s2)} give no triangle (spread 0 at the foot)`,
    );
  const s3 = found.s3;
  const Q1 = found.Q2; // Q(station 1, foot) is opposite station 2
  const Q2 = found.Q1;
  const v = input.vertical ?? [undefined, undefined];
  const readings = [0, 1].map((i) =>
    v[i] === undefined ? undefined : readVertical(A, v[i]!, `${w}.vertical[${i}]`),
  );
  if (readings[0] === undefined && readings[1] === undefined)
    throw invalidArgument(`${w}.vertical`, 'give at least one vertical reading');
  const heights: (typeof Q1 | undefined)[] = [];
  const weights: T[] = [];
  const Qs = [Q1, Q2];
  const ss = [s1, s2];
  for (let i = 0; i < 2; i++) {
    const r = readings[i];
    if (r === undefined) {
      heights.push(undefined);
      continue;
    }
    const c = A.sub(one, r.spread);
    if (A.isZero(c)) throw verticalSight(`${w}.vertical[${i}]`, PLUMB_SIGHT);
    heights.push(R.mul(Qs[i]!, A.div(r.spread, c))); // H = Q·R/(1 − R)
    weights.push(A.mul(A.mul(c, c), ss[i]!));
  }
  const sg = readings.map((r) => (r === undefined ? 0 : r.sign));
  if (sg[0]! * sg[1]! < 0)
    throw inconsistentReadings(
      `${w}.vertical`,
      'one reading is above the horizon and the other below',
    );
  let H: typeof Q1;
  let discrepancy: typeof Q1 | undefined;
  if (heights[0] !== undefined && heights[1] !== undefined) {
    const [wa, wb] = weights as [T, T];
    H = R.div(R.add(R.mul(heights[0], wa), R.mul(heights[1], wb)), A.add(wa, wb));
    discrepancy = R.sub(heights[0], heights[1]);
  } else {
    H = (heights[0] ?? heights[1])!;
    discrepancy = undefined;
  }
  const sign = (sg[0] !== 0 ? sg[0] : sg[1]) as -1 | 0 | 1;
  const finalSign = R.sign(H) === 0 ? 0 : sign;
  return {
    horizontalQuadrances: [Q1, Q2],
    horizontal: [Q1, Q2],
    spreadAtFoot: s3,
    verticalQuadrances: [heights[0], heights[1]],
    heights: [heights[0], heights[1]],
    H,
    height: signedHeightOfRoot(A, H, finalSign),
    discrepancy,
    heightDiscrepancy:
      heights[0] !== undefined && heights[1] !== undefined
        ? heightDifference(A, heights[0], heights[1], finalSign)
        : undefined,
    sign: finalSign,
  };
}
