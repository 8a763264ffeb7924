/**
 * The height of a point from one vertical reading: H = Q·R/(1 − R), and its inverses.
 *
 * @module elevation
 */
import {
  show,
  verticalSight,
  invalidArgument,
  inconsistentReadings,
  coincidentPoints,
  checkArithmetic,
} from '../errors.js';
import { checkObject } from './input.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readQuadrance } from '../geometry/validate.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';

/**
 * The vertical quadrance H of a point above (or below) the instrument's horizontal plane,
 * from the horizontal quadrance Q to the point's foot and the vertical spread R of the
 * sight: H = Q·R/(1 − R). (In the right triangle instrument–foot–point the spread at the
 * instrument is R = H/(H + Q): sin² of the elevation angle as a ratio of
 * quadrances (derived, Pythagoras, Euclid, Elements I.47); solved for H.)
 *
 * H is a quadrance (the height squared): it has no sign. A reading below the horizon
 * (a {@link VerticalReading} with `sign` −1) gives the same H, for a point below the plane;
 * the sign is the reading's.
 *
 * @param A the arithmetic
 * @param input `horizontal`: Q, the horizontal quadrance (≥ 0); `vertical`: R, a spread in
 *   [0, 1) or a signed {@link VerticalReading}
 * @returns H, in the square of Q's length unit. Exact in `rational`.
 * @throws {QuadspreadError} `VERTICAL_SIGHT` when R = 1 (a plumb sight with a horizontal
 *   quadrance); `SPREAD_OUT_OF_RANGE`; `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`;
 *   `INVALID_ARGUMENT` when `input` is not an object.
 * @deprecated Kept for one release: use {@link heightFromSight}, which names its input
 * `horizontalQuadrance` and returns both H and the signed height h.
 * @example
 * ```ts
 * import { rational, heightFromReading } from 'quadspread';
 * rational.toString(heightFromReading(rational, { horizontal: 100, vertical: '9/25' }));
 * //=> '225/4'
 * ```
 */
export function heightFromReading<T>(
  A: Arithmetic<T>,
  input: { horizontal: Numeric<T>; vertical: VerticalInput<T> },
): T {
  checkArithmetic(A, 'heightFromReading');
  checkObject(input, 'heightFromReading(input)');
  const w = 'heightFromReading(input.vertical)';
  const Q = readQuadrance(A, input.horizontal, 'heightFromReading(input)', 'horizontal');
  const R = readVertical(A, input.vertical, w).spread;
  const c = A.sub(A.one, R);
  if (A.isZero(c))
    throw verticalSight(
      w,
      `a vertical spread of 1 is a plumb sight: it meets no point at horizontal quadrance ${show(A.toString(Q))}`,
    );
  return A.div(A.mul(Q, R), c); // H = Q·R/(1 − R)
}

/**
 * The horizontal quadrance Q to the foot of a point at vertical quadrance H seen at vertical
 * spread R: Q = H·(1 − R)/R (the inverse of {@link heightFromReading}). Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `height`: H ≥ 0; `vertical`: R in (0, 1] or a signed reading
 * @returns Q, in square units
 * @throws {QuadspreadError} `INCONSISTENT_READINGS` when R = 0 and H > 0 (a level sight
 *   never reaches a point off the plane); `INVALID_ARGUMENT` when R = 0 and H = 0 (every
 *   distance fits); `SPREAD_OUT_OF_RANGE`; `NEGATIVE_QUADRANCE`.
 * @example
 * ```ts
 * import { rational, horizontalFromHeight } from 'quadspread';
 * rational.toString(horizontalFromHeight(rational, { height: '225/4', vertical: '9/25' }));
 * //=> '100'
 * ```
 */
export function horizontalFromHeight<T>(
  A: Arithmetic<T>,
  input: { height: Numeric<T>; vertical: VerticalInput<T> },
): T {
  checkArithmetic(A, 'horizontalFromHeight');
  const where = 'horizontalFromHeight(input)';
  checkObject(input, where);
  const H = readQuadrance(A, input.height, where, 'height');
  const R = readVertical(A, input.vertical, 'horizontalFromHeight(input.vertical)').spread;
  if (A.isZero(R)) {
    if (A.isZero(H))
      throw invalidArgument(where, 'a level sight to a point in the plane fits every distance');
    throw inconsistentReadings(
      'horizontalFromHeight(input.vertical)',
      `a level sight (R = 0) cannot reach a point at height quadrance ${show(A.toString(H))}`,
    );
  }
  return A.div(A.mul(H, A.sub(A.one, R)), R); // Q = H(1 − R)/R
}

/**
 * The vertical spread R of the sight to a point at vertical quadrance H over a foot at
 * horizontal quadrance Q: R = H/(H + Q) (the inverse of {@link heightFromReading}).
 * Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `height`: H ≥ 0; `horizontal`: Q ≥ 0, not both zero
 * @returns R in [0, 1]
 * @throws {QuadspreadError} `COINCIDENT_POINTS` when H = Q = 0; `NEGATIVE_QUADRANCE`;
 *   `INVALID_ARGUMENT` when `input` is not an object.
 * @example
 * ```ts
 * import { rational, verticalFromHeight } from 'quadspread';
 * rational.toString(verticalFromHeight(rational, { height: 9, horizontal: 16 }));
 * //=> '9/25'
 * ```
 */
export function verticalFromHeight<T>(
  A: Arithmetic<T>,
  input: { height: Numeric<T>; horizontal: Numeric<T> },
): T {
  checkArithmetic(A, 'verticalFromHeight');
  const where = 'verticalFromHeight(input)';
  checkObject(input, where);
  const H = readQuadrance(A, input.height, where, 'height');
  const Q = readQuadrance(A, input.horizontal, where, 'horizontal');
  const sum = A.add(H, Q);
  if (A.isZero(sum))
    throw coincidentPoints(where, 'height and horizontal are both 0: the point is the instrument');
  return A.div(H, sum); // R = H/(H + Q)
}
