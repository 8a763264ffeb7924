/**
 * Signed vertical readings: a spread with the horizontal plus the side of the horizon the
 * sight is on, so that heights can go down as well as up.
 *
 * @module readings
 */
import {
  MAX_INPUT_LENGTH,
  show,
  invalidArgument,
  invalidAngle,
  invalidSlope,
  textTooLong,
  checkArithmetic,
} from '../errors.js';
import { readNumber, shownInput } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { angleToDegrees, type AngleUnit } from './angle.js';
import { checkSpread, degreesFromSpread, spreadFromDegrees } from './spread.js';
import { spreadFromRatio } from './slope.js';

/**
 * A vertical reading that keeps its sign: `spread` is the spread R of the line of sight
 * with the horizontal (R = sin² of the elevation angle = cos² of the zenith angle, in
 * [0, 1]); `sign` is +1 for a sight above the horizon (elevation angle > 0, zenith
 * angle < 90°), −1 below it, and 0 exactly when the sight is horizontal (R = 0).
 *
 * Every solver that takes a vertical reading accepts either this object or a bare spread
 * (a number, text or value), which is read as a sight above the horizon (`sign` +1, or 0
 * when the spread is 0).
 */
export interface VerticalReading<T> {
  /** Spread R of the sight with the horizontal, 0 ≤ R ≤ 1. */
  readonly spread: T;
  /** +1 above the horizon, −1 below, 0 horizontal (then R = 0). */
  readonly sign: -1 | 0 | 1;
}

/** What a solver accepts as a vertical reading: a {@link VerticalReading} or a bare spread (read as upward). */
export type VerticalInput<T> = VerticalReading<T> | Numeric<T>;

/**
 * Makes a {@link VerticalReading} from a spread and a sign.
 *
 * @param A the arithmetic
 * @param spread the spread with the horizontal, in [0, 1]
 * @param sign +1 above the horizon (default), −1 below; ignored (0) when the spread is 0
 * @returns the reading
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` outside [0, 1]; `INVALID_ARGUMENT` for a
 *   sign other than ±1, or 0 with a spread that is not 0.
 * @example
 * ```ts
 * import { rational, vertical } from 'quadspread';
 * const v = vertical(rational, '1/4', -1);
 * [rational.toString(v.spread), v.sign];
 * //=> ['1/4', -1]
 * ```
 */
export function vertical<T>(
  A: Arithmetic<T>,
  spread: Numeric<T>,
  sign: -1 | 0 | 1 = 1,
): VerticalReading<T> {
  checkArithmetic(A, 'vertical');
  const s = checkSpread(A, spread, 'vertical(spread)');
  if (A.isZero(s)) return { spread: s, sign: 0 };
  if (sign !== 1 && sign !== -1)
    throw invalidArgument(
      'vertical(sign)',
      `${show(sign)} is not +1 or -1 (the spread ${A.toString(s)} is not 0)`,
    );
  return { spread: s, sign };
}

/**
 * @internal reads a {@link VerticalInput} for a solver, naming `where` in errors (followed
 * by `[index]` when an index is given: the text is only built for an error).
 */
export function readVertical<T>(
  A: Arithmetic<T>,
  x: VerticalInput<T>,
  where: string,
  index?: number,
): VerticalReading<T> {
  if (typeof x === 'object' && x !== null && !A.is(x) && 'spread' in (x as object)) {
    const r = x as VerticalReading<T>;
    const s = readSpreadAt(A, r.spread, where, index);
    if (A.isZero(s)) return { spread: s, sign: 0 };
    if (r.sign !== 1 && r.sign !== -1)
      throw invalidArgument(
        at(where, index),
        `sign ${show(r.sign)} is not +1 or -1 for the non-zero spread ${A.toString(s)}`,
      );
    return { spread: s, sign: r.sign };
  }
  const s = readSpreadAt(A, x as Numeric<T>, where, index);
  return { spread: s, sign: A.isZero(s) ? 0 : 1 };
}

function at(where: string, index: number | undefined): string {
  return index === undefined ? where : `${where}[${index}]`;
}

function readSpreadAt<T>(
  A: Arithmetic<T>,
  s: Numeric<T>,
  where: string,
  index: number | undefined,
): T {
  if (index === undefined) return checkSpread(A, s, where);
  const v = readNumber(A, s, () => at(where, index));
  return A.sign(v) < 0 || A.cmp(v, A.one) > 0 ? checkSpread(A, s, at(where, index)) : v;
}

/** Which angle a vertical reading is: from the horizontal (`'elevation'`) or from the zenith (`'zenith'`). */
export type VerticalKind = 'elevation' | 'zenith';

/**
 * Makes a {@link VerticalReading} from an angle read on a vertical circle.
 *
 * `kind: 'elevation'` (default): the angle α from the horizontal, in [−90°, 90°],
 * negative below the horizon; R = sin²α. `kind: 'zenith'`: the zenith angle z, in
 * [0°, 180°], over 90° below the horizon; R = cos²z. Total stations usually show zenith
 * angles; say which you have.
 *
 * @param A the arithmetic
 * @param angle the angle: degrees, DMS text, or a number in `unit`
 * @param options `kind` (`'elevation'` or `'zenith'`) and `unit` (as {@link angleToDegrees})
 * @returns the signed reading
 * @throws {QuadspreadError} `INVALID_ANGLE` outside the range of its kind or unreadable;
 *   `INVALID_ARGUMENT` for an unknown kind; `INVALID_UNIT` for an unknown unit.
 * @example
 * ```ts
 * import { rational, verticalFromAngle } from 'quadspread';
 * const v = verticalFromAngle(rational, `120°00'00"`, { kind: 'zenith' });
 * [rational.toString(v.spread), v.sign];
 * //=> ['1/4', -1]
 * ```
 */
export function verticalFromAngle<T>(
  A: Arithmetic<T>,
  angle: Numeric<T>,
  options: { kind?: VerticalKind; unit?: AngleUnit } = {},
): VerticalReading<T> {
  checkArithmetic(A, 'verticalFromAngle');
  if (typeof options !== 'object' || options === null)
    throw invalidArgument(
      'verticalFromAngle(options)',
      `${show(options)} is not an options object`,
    );
  const kind = options.kind ?? 'elevation';
  if (kind !== 'elevation' && kind !== 'zenith') {
    throw invalidArgument(
      'verticalFromAngle(options.kind)',
      `${show(kind)} is not 'elevation' or 'zenith'`,
    );
  }
  // A direction letter makes text a bearing or a latitude ('N 45 E', '12°S'), never a vertical
  // angle: refused rather than read as an elevation.
  if (typeof angle === 'string' && /^\s*[NSEW]|[NSEW]\s*$/i.test(angle))
    throw invalidAngle(
      'verticalFromAngle(angle)',
      `${show(angle)} has a direction letter (N, S, E, W): it is a bearing or a latitude, not a vertical angle`,
    );
  const deg = angleToDegrees(A, angle, options.unit ?? 'deg');
  const elev = kind === 'elevation' ? deg : A.sub(A.from(90), deg); // α = 90° − z
  const ninety = A.from(90);
  if (A.cmp(A.abs(elev), ninety) > 0) {
    const range = kind === 'elevation' ? '[-90°, 90°]' : '[0°, 180°]';
    throw invalidAngle(
      'verticalFromAngle(angle)',
      `${shownInput(A, angle, deg)} is outside ${range} for a${kind === 'elevation' ? 'n elevation' : ' zenith'} angle`,
    );
  }
  const s = spreadFromDegrees(A, elev);
  return { spread: s, sign: A.isZero(s) ? 0 : A.sign(elev) };
}

/**
 * Makes a {@link VerticalReading} from a signed rise over a horizontal run (exact):
 * R = rise²/(rise² + run²), sign of rise·run.
 *
 * @param A the arithmetic
 * @param rise the rise (negative for a fall)
 * @param run the horizontal run
 * @returns the signed reading
 * @throws {QuadspreadError} `INVALID_SLOPE` when both are zero.
 * @example
 * ```ts
 * import { rational, verticalFromRatio } from 'quadspread';
 * const v = verticalFromRatio(rational, -1, 7);
 * [rational.toString(v.spread), v.sign];
 * //=> ['1/50', -1]
 * ```
 */
export function verticalFromRatio<T>(
  A: Arithmetic<T>,
  rise: Numeric<T>,
  run: Numeric<T>,
): VerticalReading<T> {
  checkArithmetic(A, 'verticalFromRatio');
  const r = readNumber(A, rise, 'verticalFromRatio(rise)');
  const d = readNumber(A, run, 'verticalFromRatio(run)');
  const s = spreadFromRatio(A, r, d);
  const sg = A.isZero(s) ? 0 : A.isZero(d) ? A.sign(r) : ((A.sign(r) * A.sign(d)) as -1 | 0 | 1);
  return { spread: s, sign: sg };
}

const SLOPE_TEXT =
  /^\s*([+-]?[\d.]+(?:[eE][+-]?\d+)?)\s*(%|‰|:|in\b)\s*([\d.]*(?:[eE][+-]?\d+)?)\s*$/i;

/**
 * Reads slope text into a {@link VerticalReading}, exactly: `'5%'`, `'-2.5 %'`,
 * `'12‰'`, `'1:200'` (rise : run), `'1 in 200'`, `'-1 in 50'` (rise 1 per 200 horizontal;
 * common practice). The sign of the first number gives the sign of the reading.
 *
 * @param A the arithmetic
 * @param text the slope text
 * @returns the signed reading
 * @throws {QuadspreadError} `INVALID_SLOPE` for text that is not one of those forms, or a
 *   zero run; `INPUT_TOO_LONG` for text over the input limit.
 * @example
 * ```ts
 * import { rational, verticalFromSlope } from 'quadspread';
 * const v = verticalFromSlope(rational, '-1 in 20');
 * [rational.toString(v.spread), v.sign];
 * //=> ['1/401', -1]
 * ```
 */
export function verticalFromSlope<T>(A: Arithmetic<T>, text: string): VerticalReading<T> {
  checkArithmetic(A, 'verticalFromSlope');
  const where = 'verticalFromSlope(text)';
  if (typeof text !== 'string') throw invalidSlope(where, `${show(text)} is not slope text`);
  if (text.length > MAX_INPUT_LENGTH) throw textTooLong(where, text.length);
  const m = SLOPE_TEXT.exec(text);
  const bad = (): never => {
    throw invalidSlope(where, `${show(text)} is not a slope (write 5%, 12‰, 1:200 or 1 in 200)`);
  };
  if (!m) return bad();
  const mark = m[2]!.toLowerCase();
  const read = (x: string): T => {
    try {
      return A.from(x);
    } catch {
      return bad();
    }
  };
  const first = read(m[1]!);
  if (mark === '%' || mark === '‰') {
    if (m[3] !== '') bad();
    return verticalFromRatio(A, first, mark === '%' ? 100 : 1000);
  }
  if (m[3] === '') bad();
  const second = read(m[3]!);
  if (A.isZero(second)) throw invalidSlope(where, `${show(text)} has a zero run`);
  return verticalFromRatio(A, first, second);
}

/**
 * The signed elevation angle of a vertical reading, in degrees in [−90°, 90°]
 * (via {@link degreesFromSpread}: exact at 0°, ±30°, ±45°, ±60°, ±90°).
 *
 * @param A the arithmetic
 * @param reading the reading (a bare spread is read as upward)
 * @returns the elevation angle in degrees
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` for a spread outside [0, 1].
 * @example
 * ```ts
 * import { rational, elevationFromVertical } from 'quadspread';
 * rational.toString(elevationFromVertical(rational, { spread: rational.from('1/2'), sign: -1 }));
 * //=> '-45'
 * ```
 */
export function elevationFromVertical<T>(A: Arithmetic<T>, reading: VerticalInput<T>): T {
  checkArithmetic(A, 'elevationFromVertical');
  const r = readVertical(A, reading, 'elevationFromVertical(reading)');
  const d = degreesFromSpread(A, r.spread);
  return r.sign < 0 ? A.neg(d) : d;
}

/**
 * The zenith angle of a vertical reading, in degrees in [0°, 180°]: z = 90° − α.
 *
 * @param A the arithmetic
 * @param reading the reading (a bare spread is read as upward)
 * @returns the zenith angle in degrees
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE` for a spread outside [0, 1].
 * @example
 * ```ts
 * import { rational, zenithFromVertical } from 'quadspread';
 * rational.toString(zenithFromVertical(rational, { spread: rational.from('1/4'), sign: -1 }));
 * //=> '120'
 * ```
 */
export function zenithFromVertical<T>(A: Arithmetic<T>, reading: VerticalInput<T>): T {
  checkArithmetic(A, 'zenithFromVertical');
  return A.sub(A.from(90), elevationFromVertical(A, reading));
}

/**
 * A zenith angle as an elevation angle (α = 90° − z), or back: the map is its own inverse.
 * Exact.
 *
 * @param A the arithmetic
 * @param degrees the zenith (or elevation) angle in degrees
 * @returns the elevation (or zenith) angle in degrees
 * @throws {QuadspreadError} `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, zenithToElevation } from 'quadspread';
 * rational.toString(zenithToElevation(rational, '95.5'));
 * //=> '-11/2'
 * ```
 */
export function zenithToElevation<T>(A: Arithmetic<T>, degrees: Numeric<T>): T {
  checkArithmetic(A, 'zenithToElevation');
  return A.sub(A.from(90), readNumber(A, degrees, 'zenithToElevation(degrees)'));
}
