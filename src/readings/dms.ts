/**
 * Degrees written as degrees, minutes and seconds.
 *
 * @module readings
 */
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import { readNumber } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';

/**
 * Writes an angle in degrees as DMS text, `12°34'56.7"`: seconds rounded half away from
 * zero to `secondsDecimals` places (exactly, from the value of the arithmetic), minutes
 * and seconds written with two integer digits, a leading `-` below zero. A carry from
 * rounding is propagated (59.96″ to one place gives the next minute); an angle under 360°
 * that rounds to 360° is written `0°00'00"` (a bearing of 359°59′59.99″ is due north to the
 * tenth of a second), while 360° itself stays 360°.
 *
 * @param A the arithmetic
 * @param degrees the angle in degrees, |degrees| < 10⁸
 * @param secondsDecimals decimals of the seconds, an integer 0..6 (default 1)
 * @returns the DMS text
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for decimals outside 0..6 or an angle too
 *   large to write (|degrees| ≥ 10⁸, or over 2⁵³ units of the last decimal of a second);
 *   `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, formatDms } from 'quadspread';
 * formatDms(rational, '12.582416666666666');
 * //=> `12°34'56.7"`
 * formatDms(rational, '-0.5', 0);
 * //=> `-0°30'00"`
 * formatDms(rational, 359.99999999);
 * //=> `0°00'00.0"`
 * ```
 */
export function formatDms<T>(A: Arithmetic<T>, degrees: Numeric<T>, secondsDecimals = 1): string {
  checkArithmetic(A, 'formatDms');
  if (!Number.isInteger(secondsDecimals) || secondsDecimals < 0 || secondsDecimals > 6) {
    throw invalidArgument(
      'formatDms(secondsDecimals)',
      `${show(secondsDecimals)} is not an integer in 0..6`,
    );
  }
  const d = readNumber(A, degrees, 'formatDms(degrees)');
  if (A.cmp(A.abs(d), A.from('1e8')) >= 0) {
    throw invalidArgument('formatDms(degrees)', `${A.toString(d)} is too large to write as DMS`);
  }
  const negative = A.sign(d) < 0;
  const scale = 10 ** secondsDecimals;
  const x = A.mul(A.abs(d), A.from(3600 * scale)); // units of 10^-k seconds
  let n = Math.floor(A.toNumber(x));
  if (n >= Number.MAX_SAFE_INTEGER) {
    throw invalidArgument(
      'formatDms(degrees)',
      `${A.toString(d)} is too large to write as DMS with ${secondsDecimals} decimals of a second`,
    );
  }
  // floor(x) exactly: the nearest number is off by at most one step in an arithmetic at least as
  // fine as a double (two steps allowed; a coarser one cannot hold the seconds anyway)
  for (let i = 0; i < 2 && n > 0 && A.sign(A.sub(x, A.from(n))) < 0; i++) n--;
  for (let i = 0; i < 2 && A.cmp(A.sub(x, A.from(n)), A.one) >= 0; i++) n++;
  // Round half away from zero, decided exactly.
  if (A.cmp(A.sub(x, A.from(n)), A.from('0.5')) >= 0) n++;
  const unitsPerDegree = 3600 * scale;
  // An angle under a full turn that rounds to one is written 0° (the same direction).
  if (n === 360 * unitsPerDegree && A.cmp(A.abs(d), A.from(360)) < 0) n = 0;
  const deg = Math.floor(n / unitsPerDegree);
  let rest = n - deg * unitsPerDegree;
  const min = Math.floor(rest / (60 * scale));
  rest -= min * 60 * scale;
  const secInt = Math.floor(rest / scale);
  const secFrac = rest - secInt * scale;
  const sec =
    String(secInt).padStart(2, '0') +
    (secondsDecimals > 0 ? `.${String(secFrac).padStart(secondsDecimals, '0')}` : '');
  const sign = negative && n > 0 ? '-' : '';
  return `${sign}${deg}°${String(min).padStart(2, '0')}'${sec}"`;
}
