/**
 * Number text for the batch command: the exact formatter of each arithmetic, and for `float`
 * the native `Number.prototype.toPrecision` wherever it writes the same text.
 *
 * @module cli
 */
import { float, isSurd } from '../index.js';
import type { Arithmetic } from '../index.js';

/**
 * `float.toPrecision(x, digits)` through the native `Number.prototype.toPrecision`, or
 * `undefined` where that cannot give the same text.
 *
 * Both round the exact value of the double to `digits` significant digits, a tie going away
 * from zero (ECMA-262, Number.prototype.toPrecision, step 10: "if there are two such sets of
 * e and n, pick the e and n for which n × 10^(e–p+1) is larger", applied to |x|), so their
 * digits are the same. They differ only in notation, by the decimal exponent e of the rounded
 * value: the native text has an exponent when e < −6 or e ≥ `digits`, the exact formatter's
 * when e < −7 or e ≥ 21 (with zeros padding the digits in between), both written
 * `d.ddde+N`. So an exponent form with −7 ≤ e ≤ 20 is rewritten with zeros, and a fixed form
 * of |x| ≥ 10²¹ (only with more than 21 digits) is left to the exact formatter. The property
 * test in test/cli/batch-format.test.ts checks this over doubles of every magnitude, ties at
 * the display precision, subnormals, −0, and values at and above 10²¹.
 */
export function nativePrecision(x: number, digits: number): string | undefined {
  if (x - x !== 0 || digits > 100) return undefined;
  const t = x.toPrecision(digits);
  const at = t.indexOf('e');
  if (at < 0) return x < 1e21 && x > -1e21 ? t : undefined;
  const e = Number(t.slice(at + 1));
  if (e < -7 || e > 20) return t;
  const negative = t.charCodeAt(0) === 45;
  const s = t.slice(negative ? 1 : 0, at).replace('.', '');
  const fixed = e < 0 ? `0.000000${s}` : s + '0'.repeat(e + 1 - s.length);
  return negative ? `-${fixed}` : fixed;
}

/** `float.toPrecision(x, digits)`, through the native formatter where it gives the same text. */
export function floatToPrecision(x: number, digits: number): string {
  return nativePrecision(x, digits) ?? float.toPrecision(x, digits);
}

/**
 * A formatter of values (and surds) of `A` to `digits` significant digits, as `A.toPrecision`
 * writes them (decimal text, never a fraction).
 */
export function decimalText(
  A: Arithmetic<unknown, boolean>,
  digits: number,
): (x: unknown) => string {
  if (A === (float as unknown)) return (x) => floatToPrecision(x as number, digits);
  return (x) => (isSurd(x) ? x.toPrecision(digits) : A.toPrecision(x, digits));
}
