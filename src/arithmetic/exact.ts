/**
 * Exact helpers shared by the arithmetics: reading numeric text into an exact ratio of
 * bigints, integer square roots, and correctly rounded conversion of a ratio to a JS
 * number or to decimal text.
 *
 * @module arithmetic
 */
import {
  MAX_INPUT_LENGTH,
  show,
  invalidNumber,
  inputTooLong,
  divisionByZero,
  invalidArgument,
  textTooLong,
  notAValue,
} from '../errors.js';

/**
 * Largest decimal exponent accepted in numeric text (`1e1000` is read, `1e1001` refused),
 * so that no input can make a number with millions of digits.
 *
 * @example
 * ```ts
 * import { rational, MAX_EXPONENT } from 'quadspread';
 * MAX_EXPONENT;
 * //=> 1000
 * rational.toString(rational.from('2e3'));
 * //=> '2000'
 * ```
 */
export const MAX_EXPONENT = 1000;

/**
 * Most significant digits a decimal arithmetic may keep.
 *
 * @example
 * ```ts
 * import { decimal, MAX_DECIMAL_DIGITS } from 'quadspread';
 * decimal(MAX_DECIMAL_DIGITS).digits;
 * //=> 1000
 * ```
 */
export const MAX_DECIMAL_DIGITS = 1000;

/** An exact ratio n/d of bigints with d > 0 (not necessarily in lowest terms). */
export interface Ratio {
  readonly n: bigint;
  readonly d: bigint;
}

/** Decimal text: sign, integer digits, fraction digits, exponent. @internal */
export const DECIMAL = /^([+-]?)(\d+)?(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

const pow10memo = new Map<number, bigint>();
/** 10^k for k ≥ 0 (a pure memo up to 10^4096: the values never change). @internal */
export function pow10(k: number): bigint {
  let v = pow10memo.get(k);
  if (v === undefined) {
    v = 10n ** BigInt(k);
    if (k <= 4096) pow10memo.set(k, v);
  }
  return v;
}

function readDecimal(text: string, where: string, original: string, allowSign: boolean): Ratio {
  const m = DECIMAL.exec(text);
  if (
    !m ||
    (m[2] === undefined && (m[3] === undefined || m[3] === '')) ||
    (!allowSign && m[1] !== '')
  ) {
    throw invalidNumber(where, `${show(original)} is not a number`);
  }
  const sign = m[1] === '-' ? -1n : 1n;
  const whole = m[2] ?? '';
  const frac = m[3] ?? '';
  const exp = m[4] === undefined ? 0 : Number(m[4]);
  if (!Number.isSafeInteger(exp) || Math.abs(exp) > MAX_EXPONENT) {
    throw inputTooLong(where, `${show(original)} has an exponent beyond ±${MAX_EXPONENT}`);
  }
  const digits = BigInt(whole + frac || '0');
  const scale = exp - frac.length;
  return scale >= 0
    ? { n: sign * digits * pow10(scale), d: 1n }
    : { n: sign * digits, d: pow10(-scale) };
}

/**
 * Reads numeric text exactly: an integer, a decimal, an exponent form (`1.5e-3`) or a
 * ratio `a/b` of two such (the denominator unsigned). Surrounding white space is ignored.
 *
 * @param text the text to read
 * @param where the function and argument to name in an error, e.g. `rational.from(x)`
 * @returns the exact value as n/d with d > 0
 * @throws {QuadspreadError} `INPUT_TOO_LONG` when longer than {@link MAX_INPUT_LENGTH}
 * characters or the exponent exceeds {@link MAX_EXPONENT}; `INVALID_NUMBER` when it is not
 * a number; `DIVISION_BY_ZERO` for `a/0`.
 * @example
 * ```ts
 * import { readRatio } from 'quadspread';
 * const r = readRatio('1.5e-3', 'from(x)');
 * `${r.n}/${r.d}`;
 * //=> '15/10000'
 * ```
 */
export function readRatio(text: string, where: string): Ratio {
  if (typeof text !== 'string') throw invalidNumber(where, `${show(text)} is not text`);
  if (text.length > MAX_INPUT_LENGTH) {
    throw textTooLong(where, text.length);
  }
  const t = text.trim();
  const slash = t.indexOf('/');
  if (slash < 0) return readDecimal(t, where, text, true);
  const num = readDecimal(t.slice(0, slash).trim(), where, text, true);
  const den = readDecimal(t.slice(slash + 1).trim(), where, text, false);
  if (den.n === 0n) throw divisionByZero(where, `${show(text)} divides by zero`);
  return { n: num.n * den.d, d: num.d * den.n };
}

/**
 * Reads any accepted non-arithmetic input (number, bigint, text) exactly.
 * A JS number is read through its shortest round-trip decimal (`String(x)`).
 * @throws {QuadspreadError} `INVALID_NUMBER` for NaN, ±Infinity, null, objects and bad text.
 * @internal
 */
export function readInput(x: unknown, where: string): Ratio {
  if (typeof x === 'bigint') return { n: x, d: 1n };
  if (typeof x === 'number') {
    if (!Number.isFinite(x)) throw invalidNumber(where, `${show(x)} is not a finite number`);
    if (Number.isSafeInteger(x)) return { n: BigInt(x), d: 1n };
    return readRatio(String(x), where);
  }
  if (typeof x === 'string') return readRatio(x, where);
  throw invalidNumber(where, `${show(x)} is not a number, numeric text or bigint`);
}

/** Greatest common divisor of |a| and |b|. @internal */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Number of bits of a positive bigint. @internal */
export function bitLength(a: bigint): number {
  // toString(16) is linear; fine for the sizes met here.
  const h = a.toString(16);
  return (h.length - 1) * 4 + (32 - Math.clz32(parseInt(h[0]!, 16)));
}

const LOG10_2 = /* @__PURE__ */ Math.log10(2);

/**
 * √(n/d) for n, d > 0 on a decimal scale chosen from the magnitude alone: `{ n: r, d: 10^k }`
 * with r = ⌊√(n/d)·10^k⌋ ≥ 10^(digits+1) and k ≥ 0 (not in lowest terms). Below √(n/d) by
 * less than 10^−(digits+1) relative; its denominator divides 10^k whatever n/d is.
 * @internal
 */
export function scaledSqrt(n: bigint, d: bigint, digits: number): { n: bigint; d: bigint } {
  // 2^(bits(n) − bits(d) − 1) ≤ n/d, so e ≤ log10 √(n/d).
  const e = Math.floor(((bitLength(n) - bitLength(d) - 1) * LOG10_2) / 2);
  const k = Math.max(0, digits + 1 - e);
  const s = pow10(k);
  return { n: isqrt((n * s * s) / d), d: s };
}

/**
 * ⌊√a⌋ for a ≥ 0, by Newton's iteration from an upper bound (taken from the double square
 * root of the leading bits, so that a few steps suffice).
 * @internal
 */
export function isqrt(a: bigint): bigint {
  if (a < 0n) throw new RangeError('isqrt of a negative number');
  if (a < 2n) return a;
  if (a < 4503599627370496n) return BigInt(Math.floor(Math.sqrt(Number(a))));
  // a = top·4^s + rest with top < 2^104: √a < √(top + 1)·2^s ≤ (⌊√top⌋ + 2)·2^s, and the
  // double root of top is within 2^−50 relative, so (its floor + 4)·2^s is above √a.
  const s = Math.max(0, Math.floor((bitLength(a) - 103) / 2));
  const top = Number(a >> BigInt(2 * s));
  let x = (BigInt(Math.floor(Math.sqrt(top))) + 4n) << BigInt(s);
  for (;;) {
    const y = (x + a / x) >> 1n;
    if (y >= x) return x;
    x = y;
  }
}

/**
 * The JS number nearest to n/d (ties to even), computed exactly with bigints.
 * @internal
 */
export function ratioToNumber(n: bigint, d: bigint): number {
  if (n === 0n) return 0;
  const neg = n < 0n !== d < 0n;
  if (n < 0n) n = -n;
  if (d < 0n) d = -d;
  // Scale so that the integer quotient has 55 or 56 bits; keep a sticky bit.
  const shift = 55 - (bitLength(n) - bitLength(d));
  const num = shift >= 0 ? n << BigInt(shift) : n;
  const den = shift >= 0 ? d : d << BigInt(-shift);
  let q = num / den;
  const sticky = num % den !== 0n;
  let e = -shift; // value = q · 2^e
  // Reduce q to 53 bits with round-half-even, honouring the sticky bit.
  let extra = bitLength(q) - 53;
  // Subnormal range: the least exponent of a double is −1074.
  if (e + extra < -1074) extra = -1074 - e;
  if (extra > 0) {
    const b = BigInt(extra);
    const rem = q & ((1n << b) - 1n);
    const half = 1n << (b - 1n);
    q >>= b;
    e += extra;
    if (rem > half || (rem === half && (sticky || (q & 1n) === 1n))) q += 1n;
  }
  // q < 2^54 and e ≥ −1074, so this product is exact (or overflows to ±Infinity).
  const v = e > 1000 ? Number(q) * 2 ** 1000 * 2 ** (e - 1000) : Number(q) * 2 ** e;
  return neg ? -v : v;
}

/**
 * n/d (d > 0) as decimal text rounded to `digits` significant digits, half away from
 * zero. Plain notation when the decimal exponent is within [−7, 21), else `d.ddde±x`.
 * @internal
 */
export function ratioToPrecision(n: bigint, d: bigint, digits: number): string {
  if (!Number.isInteger(digits) || digits < 1 || digits > 1000) {
    throw invalidArgument(
      'toPrecision(a, digits)',
      `digits ${show(digits)} is not an integer in 1..1000`,
    );
  }
  if (n === 0n) return digits > 1 ? `0.${'0'.repeat(digits - 1)}` : '0';
  const neg = n < 0n;
  if (neg) n = -n;
  // Estimate the decimal exponent of n/d, then fix it.
  let e = n.toString().length - d.toString().length; // value in [10^(e-1), 10^(e+1))
  const ge = (k: number) => (k >= 0 ? n >= d * pow10(k) : n * pow10(-k) >= d); // n/d >= 10^k
  if (!ge(e)) e -= 1;
  // now 10^e <= n/d < 10^(e+1)
  const k = digits - 1 - e; // scale so the quotient has `digits` digits
  const num = k >= 0 ? n * pow10(k) : n;
  const den = k >= 0 ? d : d * pow10(-k);
  let q = num / den;
  const r = num % den;
  if (2n * r >= den) q += 1n;
  let s = q.toString();
  if (s.length > digits) {
    // rounding carried into a new digit (9.99 → 10.0)
    s = s.slice(0, digits);
    e += 1;
  }
  let out: string;
  if (e >= 21 || e < -7) {
    out =
      s.length > 1
        ? `${s[0]}.${s.slice(1)}e${e >= 0 ? '+' : ''}${e}`
        : `${s}e${e >= 0 ? '+' : ''}${e}`;
  } else if (e >= digits - 1) {
    out = s + '0'.repeat(e - digits + 1);
  } else if (e >= 0) {
    out = `${s.slice(0, e + 1)}.${s.slice(e + 1)}`;
  } else {
    out = `0.${'0'.repeat(-e - 1)}${s}`;
  }
  return neg ? `-${out}` : out;
}

/** The brand every quadratic surd carries (see geometry's `isSurd`). @internal */
export const SURD_BRAND: unique symbol = /* @__PURE__ */ Symbol.for('quadspread.surd') as never;

/** A quadratic surd made by this package, seen from the arithmetic layer (by its brand). @internal */
export interface SurdLike {
  toString(): string;
  toPrecision(digits: number): string;
  toNumber(): number;
}

/** Whether x is a quadratic surd (by its brand, without importing geometry). @internal */
export const isSurdLike = (x: unknown): x is SurdLike =>
  typeof x === 'object' && x !== null && (x as Record<symbol, unknown>)[SURD_BRAND] === true;

/**
 * The operand checks of an arithmetic: `one(op, a)` and `two(op, a, b)` return `a` once the
 * operands pass `is`, and otherwise throw `INVALID_NUMBER` naming `name.op(…)` (a JS number,
 * text or a value of another arithmetic is refused, never computed with).
 * @internal
 */
export function operandChecks<V>(name: string, is: (x: unknown) => boolean) {
  return {
    one(op: string, a: V): V {
      if (is(a)) return a;
      throw notAValue(name, op, a);
    },
    two(op: string, a: V, b: V): V {
      if (is(a) && is(b)) return a;
      throw notAValue(name, op, is(a) ? b : a);
    },
  };
}
