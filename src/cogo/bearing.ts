/**
 * Reading bearings for coordinate geometry: azimuths clockwise from north.
 *
 * @module cogo
 */
import { QuadspreadError, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { angleToDegrees } from '../readings/angle.js';
import { formatDms } from '../readings/dms.js';

/**
 * Reads a bearing as an azimuth in degrees, clockwise from north (x = east, y = north),
 * in [0°, 360°).
 *
 * Accepts decimal degrees (a value, number or numeric text), DMS text (`226°54'23"`,
 * `226 54 23`) and quadrant bearings (`S 68°05'35" W` = 248°05′35″: N θ E = θ,
 * S θ E = 180° − θ, S θ W = 180° + θ, N θ W = 360° − θ), as the readings'
 * `angleToDegrees` reads them. An azimuth of exactly 360° is read as 0°. Exact in
 * `rational`.
 *
 * @param A the arithmetic
 * @param bearing the bearing: an azimuth clockwise from north, or a quadrant bearing
 * @returns the azimuth in degrees, clockwise from north, in [0, 360)
 * @throws {QuadspreadError} `INVALID_BEARING` for text that is not a bearing, a quadrant
 * angle over 90°, or an azimuth outside [0°, 360°].
 * @example
 * ```ts
 * import { rational, bearingToAzimuth } from 'quadspread';
 * rational.toString(bearingToAzimuth(rational, `S 68°05'35" W`));
 * //=> '178627/720'
 * rational.toString(bearingToAzimuth(rational, `N 45° W`));
 * //=> '315'
 * ```
 */
export function bearingToAzimuth<T>(A: Arithmetic<T, boolean>, bearing: Numeric<T>): T {
  checkArithmetic(A, 'bearingToAzimuth');
  return readAzimuth(A, bearing, 'bearingToAzimuth(A, bearing)');
}

function whereOf(whereText: string | (() => string), suffix: string): string {
  return (typeof whereText === 'string' ? whereText : whereText()) + suffix;
}

/**
 * {@link bearingToAzimuth} naming `where` (+ `suffix`) in its errors; `where` may be a
 * function so that hot loops build the text only on error. @internal
 */
export function readAzimuth<T>(
  A: Arithmetic<T, boolean>,
  bearing: Numeric<T>,
  whereText: string | (() => string),
  suffix = '',
): T {
  // A lone hemisphere letter ('E 100', '45 N') is a latitude's or a longitude's, not a bearing
  // (an azimuth, or a quadrant bearing N θ E).
  if (
    typeof bearing === 'string' &&
    /^\s*[NSEW]|[NSEW]\s*$/i.test(bearing) &&
    !/^\s*[NS][^A-Za-z]*[EW]\s*$/i.test(bearing)
  )
    throw new QuadspreadError(
      'INVALID_BEARING',
      whereOf(whereText, suffix),
      `${show(bearing)} is not a bearing: write an azimuth (100) or a quadrant bearing (S 80 E)`,
    );
  let deg: T;
  try {
    deg = angleToDegrees(A, bearing);
  } catch (e) {
    if (e instanceof QuadspreadError && e.code !== 'INPUT_TOO_LONG') {
      throw new QuadspreadError(
        'INVALID_BEARING',
        whereOf(whereText, suffix),
        `${show(bearing)} is not a bearing (${e.message.replace(/^quadspread \w+: [^:]*: /, '')})`,
      );
    }
    throw e;
  }
  const full = A.from(360);
  if (A.sign(deg) < 0 || A.cmp(deg, full) > 0) {
    throw new QuadspreadError(
      'INVALID_BEARING',
      whereOf(whereText, suffix),
      `${show(bearing)} is not an azimuth in [0°, 360°] (clockwise from north)`,
    );
  }
  return A.eq(deg, full) ? A.zero : deg;
}

/**
 * Writes an azimuth (degrees clockwise from north, x = east, y = north) as a quadrant
 * bearing such as `S 68°05'35.0" W`: N θ E for azimuths up to 90°, S (180° − θ) E up to
 * 180°, S (θ − 180°) W up to 270°, N (360° − θ) W beyond. The angle is written by the
 * readings' `formatDms`, seconds rounded half away from zero.
 *
 * @param A the arithmetic
 * @param azimuth degrees clockwise from north, in [0, 360]
 * @param secondsDecimals decimals of the seconds, 0..6 (default 1)
 * @returns the quadrant bearing text
 * @throws {QuadspreadError} `INVALID_BEARING` for an azimuth outside [0°, 360°]; `INVALID_ARGUMENT` for bad decimals.
 * @example
 * ```ts
 * import { rational, azimuthToQuadrant } from 'quadspread';
 * azimuthToQuadrant(rational, `248°05'35"`, 0);
 * //=> `S 68°05'35" W`
 * azimuthToQuadrant(rational, 315);
 * //=> `N 45°00'00.0" W`
 * ```
 */
export function azimuthToQuadrant<T>(
  A: Arithmetic<T, boolean>,
  azimuth: Numeric<T>,
  secondsDecimals = 1,
): string {
  checkArithmetic(A, 'azimuthToQuadrant');
  const z = readAzimuth(A, azimuth, 'azimuthToQuadrant(A, azimuth)');
  const ninety = A.from(90);
  const half = A.from(180);
  const threeHalves = A.from(270);
  // Quadrant bearings from azimuths (the inverse of the rule in bearingToAzimuth).
  if (A.cmp(z, ninety) <= 0) return `N ${formatDms(A, z, secondsDecimals)} E`;
  if (A.cmp(z, half) <= 0) return `S ${formatDms(A, A.sub(half, z), secondsDecimals)} E`;
  if (A.cmp(z, threeHalves) <= 0) return `S ${formatDms(A, A.sub(z, half), secondsDecimals)} W`;
  return `N ${formatDms(A, A.sub(A.from(360), z), secondsDecimals)} W`;
}
