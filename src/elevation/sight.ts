/**
 * The height of a point from one sight: its vertical quadrance and its signed height.
 *
 * @module elevation
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Root } from '../geometry/surd.js';
import { invalidArgument, checkArithmetic } from '../errors.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';
import { checkObject } from './input.js';
import { heightFromReading } from './height.js';
import { heightFromQuadrance } from './signed-height.js';

/** The result of {@link heightFromSight}. */
export interface SightHeight<T, E extends boolean> {
  /** The vertical quadrance H = h² of the point above or below the instrument's level. */
  readonly H: T;
  /** The signed height h = ±√H: positive above the level, negative below. */
  readonly height: Root<T, E>;
  /** +1 above the level, −1 below, 0 on it (the reading's sign). */
  readonly sign: -1 | 0 | 1;
}

/**
 * The point seen from an instrument at horizontal quadrance Q from its foot, with vertical
 * reading R (the spread of the sight with the horizontal): its vertical quadrance
 * H = Q·R/(1 − R) above (or below) the instrument's level — exact in `rational` — and its
 * signed height h = ±√H (an exact surd in `rational`). In the right triangle instrument–foot–
 * point the spread at the instrument is R = H/(H + Q) (derived, Pythagoras, Euclid, Elements
 * I.47); solved for H.
 *
 * @param A the arithmetic
 * @param input `horizontalQuadrance`: Q ≥ 0, the squared horizontal distance to the foot;
 *   `vertical`: R in [0, 1), or a signed reading (see `verticalFromAngle`)
 * @returns `{ H, height, sign }`
 * @throws {QuadspreadError} `VERTICAL_SIGHT` when R = 1; `SPREAD_OUT_OF_RANGE`;
 *   `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`; `INVALID_ARGUMENT` when `input` is not an object
 *   or lacks `horizontalQuadrance`.
 * @example
 * ```ts
 * import { rational, heightFromSight, verticalFromAngle } from 'quadspread';
 * const r = heightFromSight(rational, { horizontalQuadrance: 100, vertical: '9/25' });
 * [rational.toString(r.H), r.height.toString()];
 * //=> ['225/4', '15/2']
 * // a sight 30° below the horizon, 12 m away: h = −12·tan 30° = −4√3
 * const d = heightFromSight(rational, {
 *   horizontalQuadrance: 144,
 *   vertical: verticalFromAngle(rational, -30),
 * });
 * [rational.toString(d.H), d.height.toString(), d.sign];
 * //=> ['48', '-4√3', -1]
 * ```
 */
export function heightFromSight<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: { horizontalQuadrance: Numeric<T>; vertical: VerticalInput<T> },
): SightHeight<T, E> {
  checkArithmetic(A, 'heightFromSight');
  const w = 'heightFromSight(input)';
  checkObject(input, w);
  if (input.horizontalQuadrance === undefined)
    throw invalidArgument(
      `${w}.horizontalQuadrance`,
      'is missing (the squared horizontal distance from the instrument to the foot)',
    );
  const v = readVertical(A, input.vertical, `${w}.vertical`);
  const H = heightFromReading(A, { horizontal: input.horizontalQuadrance, vertical: v });
  const sign = A.isZero(H) ? 0 : v.sign;
  return { H, height: heightFromQuadrance(A, H, sign), sign };
}
