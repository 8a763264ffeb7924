/**
 * Numbers out of an arithmetic into files, rounded exactly, and back in. Internal.
 *
 * @module io
 */
import { isSurd, rootToNumber, type Arithmetic, type Root } from '../index.js';

// Digits enough to round a value exactly at any decimals a file carries.
const WORKING_DIGITS = 40;

/**
 * Decimal text of `x` rounded to `decimals` places (half away from zero, from 40 significant
 * digits of the exact value), without trailing zeros. @internal
 */
export function fixedText<T>(A: Arithmetic<T, boolean>, x: T, decimals: number): string {
  const m = /^(-?)(\d*)(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(A.toPrecision(x, WORKING_DIGITS));
  // (toPrecision gives plain or exponent decimal text by its contract)
  const [, sign, int, frac = '', e = '0'] = m!;
  const digits = BigInt(`${int}${frac}` || '0');
  const k = Number(e) - frac.length + decimals;
  let n: bigint;
  if (k >= 0) n = digits * 10n ** BigInt(k);
  else {
    const q = 10n ** BigInt(-k);
    n = digits / q + (2n * (digits % q) >= q ? 1n : 0n);
  }
  const s = n.toString().padStart(decimals + 1, '0');
  const body =
    decimals === 0
      ? s
      : `${s.slice(0, -decimals)}.${s.slice(-decimals)}`.replace(/0+$/, '').replace(/\.$/, '');
  return n === 0n || sign === '' ? body : `-${body}`;
}

/** {@link fixedText} as a JS number (exactly that decimal when it has ≤ 15 significant digits). @internal */
export const fixedNumber = <T>(A: Arithmetic<T, boolean>, x: T, decimals: number): number =>
  Number(fixedText(A, x, decimals));

/** The nearest JS number of a value or a root (a quadratic surd in an exact arithmetic). @internal */
export function numberOf<T>(A: Arithmetic<T, boolean>, x: unknown): number {
  return isSurd(x)
    ? rootToNumber(A, x as Root<T, boolean>)
    : A.toNumber(A.from(x as T | number | string));
}
