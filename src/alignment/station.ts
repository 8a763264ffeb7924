/**
 * Station text: a chainage written as hundreds (or thousands) and the remainder, `50+84.98`
 * (50 stations of 100 ft and 84.98 ft) or `0+565.000` (0 km and 565 m).
 *
 * @module alignment
 */
import {
  show,
  invalidArgument,
  textTooLong,
  MAX_INPUT_LENGTH,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from '../geometry/validate.js';

const STATION = /^\s*([+-])?\s*(\d+)\s*\+\s*(\d+)(\.\d*)?\s*$/;

/**
 * Reads station text into a chainage. `'50+84.98'` is 50 × 100 + 84.98 = 5084.98: the
 * station length is 10 to the number of integer digits after the `+` (two digits: stations of
 * 100, as in US practice; three: kilometres of 1000 m), which is how station text is written
 * (common practice). A leading minus applies to the whole: `'-0+12.50'` is −12.5. Exact in
 * `rational` and `decimal`.
 *
 * @param A the arithmetic
 * @param text station text, e.g. `'50+84.98'`
 * @returns the chainage
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for text that is not station text, or whose
 *   remainder is not below the station length; `INPUT_TOO_LONG` for over-long text.
 * @example
 * ```ts
 * import { rational, readStation } from 'quadspread';
 * [rational.toString(readStation(rational, '50+84.98')), rational.toString(readStation(rational, '0+565.000'))];
 * //=> ['254249/50', '565']
 * ```
 */
export function readStation<T>(A: Arithmetic<T>, text: string): T {
  checkArithmetic(A, 'readStation');
  return parseStation(A, text, 'readStation(A, text)');
}

/** {@link readStation}, naming `where` in its errors. @internal */
export function parseStation<T>(A: Arithmetic<T>, text: string, where: string): T {
  if (typeof text !== 'string')
    throw invalidArgument(where, `${show(text)} is not station text such as '50+84.98'`);
  if (text.length > MAX_INPUT_LENGTH) throw textTooLong(where, text.length);
  const m = STATION.exec(text);
  if (!m)
    throw invalidArgument(
      where,
      `${show(text)} is not station text such as '50+84.98' or '0+565.000'`,
    );
  const per = A.from(10n ** BigInt(m[3]!.length));
  const rest = readNumber(A, m[3]! + (m[4] ?? ''), where);
  const value = A.add(A.mul(A.from(BigInt(m[2]!)), per), rest);
  return m[1] === '-' ? A.neg(value) : value;
}

/**
 * Writes a chainage as station text: `'50+84.98'` for stations of 100 (the default, two
 * decimals), `'0+565.000'` with `{ per: 1000, decimals: 3 }`. The chainage is rounded to
 * `decimals` places (half away from zero) first, so 5084.977 with 2 decimals is `'50+84.98'`.
 *
 * @param A the arithmetic
 * @param chainage the chainage, in the unit of the line
 * @param options `per`: the station length, 100 (default) or 1000 (or any power of ten ≥ 10);
 *   `decimals`: places after the point, 0..9 (default 2)
 * @returns the station text
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a station length that is not a power of ten
 *   or decimals out of range; `INVALID_NUMBER` for a chainage that is not a number.
 * @example
 * ```ts
 * import { rational, formatStation } from 'quadspread';
 * [formatStation(rational, '5084.977'), formatStation(rational, 565, { per: 1000, decimals: 3 }), formatStation(rational, -12.5)];
 * //=> ['50+84.98', '0+565.000', '-0+12.50']
 * ```
 */
export function formatStation<T>(
  A: Arithmetic<T>,
  chainage: Numeric<T>,
  options: { readonly per?: number; readonly decimals?: number } = {},
): string {
  checkArithmetic(A, 'formatStation');
  const where = 'formatStation(A, chainage, options)';
  const o =
    options === null || typeof options !== 'object' ? (invalid(where, options) as never) : options;
  const per = o.per ?? 100;
  const decimals = o.decimals ?? 2;
  const width = typeof per === 'number' ? Math.round(Math.log10(per)) : 0;
  if (typeof per !== 'number' || width < 1 || width > 6 || 10 ** width !== per)
    throw invalidArgument(`${where}.per`, `${show(per)} is not a power of ten from 10 to 1000000`);
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 9)
    throw invalidArgument(`${where}.decimals`, `${show(decimals)} is not an integer from 0 to 9`);
  const c = readNumber(A, chainage, where, ' chainage');
  const negative = A.sign(c) < 0;
  // Units of 10^−decimals, rounded half away from zero, from 45 significant digits.
  const text = A.toPrecision(A.abs(c), 45);
  const [int, frac = ''] = text.split('.');
  const padded = (frac + '0'.repeat(decimals + 1)).slice(0, decimals + 1);
  let units = BigInt((int ?? '0') + padded.slice(0, decimals));
  if (Number(padded[decimals]) >= 5) units += 1n;
  const scale = 10n ** BigInt(decimals);
  const whole = units / scale;
  const part = units % scale;
  const head = whole / BigInt(per);
  const rest = (whole % BigInt(per)).toString().padStart(width, '0');
  const sign = negative && units !== 0n ? '-' : '';
  return `${sign}${head}+${rest}${decimals > 0 ? '.' + part.toString().padStart(decimals, '0') : ''}`;
}

function invalid(where: string, x: unknown): never {
  throw invalidArgument(where, `${show(x)} is not an options object`);
}
