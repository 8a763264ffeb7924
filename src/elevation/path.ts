/**
 * The grade of a path cut across a plane slope, and the direction that gives a wanted grade.
 *
 * @module elevation
 */
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import { checkObject } from './input.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readSpread } from '../geometry/validate.js';

/**
 * How the offset spread of a path from the fall line is measured: `'face'` in the plane of
 * the slope itself (as a protractor laid on the hillside reads it), `'plan'` on the map
 * (horizontal projection; as a drawing or a compass bearing gives it).
 */
export type OffsetMeasure = 'face' | 'plan';

function readMeasured(m: unknown, where: string): OffsetMeasure {
  if (m === 'face' || m === 'plan') return m;
  throw invalidArgument(where, `${show(m)} is not 'face' or 'plan'`);
}

/**
 * The grade spread U of a straight path on a plane slope whose fall line (the steepest
 * line) has spread S with the horizontal, the path turned from the fall line by offset
 * spread R:
 *
 * - measured in the face: U = S·(1 − R) (the sine of the path's slope angle is
 *   sin φ·cos γ, with φ the slope angle and γ the angle from the fall line in the face:
 *   derived, the direction cosines of a line in an inclined plane);
 * - measured on the plan: U = S·(1 − R)/(1 − S·R) (tan of the path's slope is tan φ·cos β,
 *   β the plan angle from the fall line — the apparent-dip relation of structural geology,
 *   e.g. D. M. Ragan, *Structural Geology: An Introduction to Geometrical Techniques*, from
 *   memory — rewritten in spreads).
 *
 * Exact in `rational`. A spread has no sign: the path climbs one way and falls the other.
 *
 * @param A the arithmetic
 * @param input `fall`: S, the slope's fall-line spread in [0, 1]; `offset`: R, the spread
 *   between the path and the fall line in [0, 1] (0 along the fall line, 1 along the
 *   contour); `measured`: `'face'` or `'plan'`
 * @returns U, the spread of the path with the horizontal
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE`; `INVALID_ARGUMENT` for an unknown
 *   `measured`, or a vertical face (S = 1) crossed along its fall line in plan (no plan direction there).
 * @example
 * ```ts
 * import { rational, pathGrade } from 'quadspread';
 * rational.toString(pathGrade(rational, { fall: '1/5', offset: '1/4', measured: 'plan' }));
 * //=> '3/19'
 * rational.toString(pathGrade(rational, { fall: '1/5', offset: '1/4', measured: 'face' }));
 * //=> '3/20'
 * ```
 */
export function pathGrade<T>(
  A: Arithmetic<T>,
  input: { fall: Numeric<T>; offset: Numeric<T>; measured: OffsetMeasure },
): T {
  checkArithmetic(A, 'pathGrade');
  const w = 'pathGrade(input)';
  checkObject(input, w);
  const measured = readMeasured(input.measured, `${w}.measured`);
  const S = readSpread(A, input.fall, w, 'fall');
  const R = readSpread(A, input.offset, w, 'offset');
  const face = A.mul(S, A.sub(A.one, R)); // U = S(1 − R)
  if (measured === 'face') return face;
  const den = A.sub(A.one, A.mul(S, R));
  if (A.isZero(den))
    throw invalidArgument(
      w,
      'a vertical face (fall 1) has no plan direction along the contour (offset 1)',
    );
  return A.div(face, den); // U = S(1 − R)/(1 − S·R)
}

/**
 * The offset spread R from the fall line that gives a path the grade spread U on a plane
 * slope of fall-line spread S: the inverse of {@link pathGrade}.
 *
 * - face: R = 1 − U/S;
 * - plan: R = (S − U)/(S·(1 − U)) (solving U(1 − S·R) = S(1 − R) for R).
 *
 * This answers the design question: at what direction to cut a road or rail line across a
 * hillside so that it holds a ruling grade (see docs/heights.md). Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `fall`: S in (0, 1]; `grade`: U in [0, S]; `measured`: `'face'` or `'plan'`
 * @returns R, the spread between the path and the fall line (two mirror-image directions,
 *   one each side of the fall line, share it)
 * @throws {QuadspreadError} `GRADE_STEEPER_THAN_SLOPE` when U > S; `INVALID_ARGUMENT` for
 *   S = 0 (a level plane: every direction is level), an unknown `measured`, or S = U = 1
 *   in plan; `SPREAD_OUT_OF_RANGE`.
 * @example
 * ```ts
 * import { rational, pathOffset } from 'quadspread';
 * rational.toString(pathOffset(rational, { fall: '1/5', grade: '3/19', measured: 'plan' }));
 * //=> '1/4'
 * ```
 */
export function pathOffset<T>(
  A: Arithmetic<T>,
  input: { fall: Numeric<T>; grade: Numeric<T>; measured: OffsetMeasure },
): T {
  checkArithmetic(A, 'pathOffset');
  const w = 'pathOffset(input)';
  checkObject(input, w);
  const measured = readMeasured(input.measured, `${w}.measured`);
  const S = readSpread(A, input.fall, w, 'fall');
  const U = readSpread(A, input.grade, w, 'grade');
  if (A.isZero(S))
    throw invalidArgument(
      `${w}.fall`,
      'a level plane (fall 0): every direction is level, no offset is fixed',
    );
  if (A.cmp(U, S) > 0) {
    throw new QuadspreadError(
      'GRADE_STEEPER_THAN_SLOPE',
      `${w}.grade`,
      `grade spread ${A.toString(U)} is steeper than the slope's fall-line spread ${A.toString(S)}`,
    );
  }
  if (measured === 'face') return A.sub(A.one, A.div(U, S)); // R = 1 − U/S
  const den = A.mul(S, A.sub(A.one, U));
  if (A.isZero(den))
    throw invalidArgument(
      w,
      'a vertical face climbed vertically (fall = grade = 1) has no plan direction',
    );
  return A.div(A.sub(S, U), den); // R = (S − U)/(S(1 − U))
}
