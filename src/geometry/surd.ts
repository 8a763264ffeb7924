/**
 * Quadratic surds a + b√d: exact values of results that need one square root.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { isqrt, SURD_BRAND } from '../arithmetic/exact.js';
import {
  QuadspreadError,
  show,
  divisionByZero,
  notFinite,
  invalidArgument,
  noRealSolution,
  unsupportedOperation,
  checkArithmetic,
} from '../errors.js';
import { readNumber } from './validate.js';

/**
 * A quadratic surd a + b√d with a, b, d values of an arithmetic, d ≥ 0.
 *
 * A surd knows its arithmetic, so its methods need no arithmetic argument:
 * `s.toString()`, `s.toNumber()`, `s.add(t)`.
 *
 * **Normal form** (made by {@link surd} and {@link sqrtOf}, kept by every method):
 * - when the value is rational, `b` is 0 and `d` is 1 (`isRational()` is then true);
 * - in `rational`, `d` is a positive integer greater than 1 from which the squares of the
 *   primes below 1000 have been pulled out (√200 = 10√2, √(1/2) = √2/2), and never a
 *   perfect square;
 * - in another arithmetic, a `d` whose square root the arithmetic represents is collapsed.
 *
 * **Combining**: +, −, ×, ÷ are exact when both operands are rational or share a radicand
 * (two radicands whose ratio is a rational square count as one: √8 and √2). Otherwise
 * the result would need two square roots and the method throws `DIFFERENT_RADICANDS`.
 * Comparison (`cmp`, `eq`, `sign`) is exact for any two surds, whatever their radicands.
 * Plain values (`T`, JS numbers, numeric text, bigints) are accepted wherever a surd is,
 * and read with the arithmetic's `from`.
 *
 * **Text**: `toString()` (and `JSON.stringify`, Node's `console.log` and `util.inspect`) write
 * the exact value in this package's notation: `41 + 20√2`, `-3√5/2`, `√10161/2` (the square
 * root sign binds to the digits after it; a coefficient p/q is written `p√d/q`). The exact
 * arithmetic's `toString`, `toPrecision` and `toNumber` also accept a surd and defer to it.
 *
 * @example
 * ```ts
 * import { rational, surd } from 'quadspread';
 * const p = surd(rational, 41, 20, 2);
 * [p.toString(), p.conjugate().toString(), p.mul(p.conjugate()).toString(), p.cmp(69), p.toPrecision(6)];
 * //=> ['41 + 20√2', '41 - 20√2', '881', 1, '69.2843']
 * ```
 */
export interface Surd<T> {
  /** The rational part a. */
  readonly a: T;
  /** The coefficient b of √d (0 when the surd is rational). */
  readonly b: T;
  /** The radicand d (1 when the surd is rational). */
  readonly d: T;
  /** The arithmetic of a, b and d. */
  readonly arithmetic: Arithmetic<T>;
  /** Whether the value is rational (b = 0). */
  isRational(): boolean;
  /** The value as a plain `T` when rational, otherwise `undefined`. */
  toRational(): T | undefined;
  /** this + y. @throws {QuadspreadError} `DIFFERENT_RADICANDS` */
  add(y: Surd<T> | Numeric<T>): Surd<T>;
  /** this − y. @throws {QuadspreadError} `DIFFERENT_RADICANDS` */
  sub(y: Surd<T> | Numeric<T>): Surd<T>;
  /** this × y. @throws {QuadspreadError} `DIFFERENT_RADICANDS` */
  mul(y: Surd<T> | Numeric<T>): Surd<T>;
  /** this ÷ y. @throws {QuadspreadError} `DIVISION_BY_ZERO`, `DIFFERENT_RADICANDS` */
  div(y: Surd<T> | Numeric<T>): Surd<T>;
  /** −this */
  neg(): Surd<T>;
  /** The conjugate a − b√d. */
  conjugate(): Surd<T>;
  /** −1, 0 or 1: the sign of the value, exactly. */
  sign(): -1 | 0 | 1;
  /** Whether the value is zero. */
  isZero(): boolean;
  /** −1, 0 or 1 as this is less than, equal to or greater than y, exactly. */
  cmp(y: Surd<T> | Numeric<T>): -1 | 0 | 1;
  /** Whether this equals y, exactly. */
  eq(y: Surd<T> | Numeric<T>): boolean;
  /**
   * The JS number of the value. In an exact arithmetic it is read from 40 correctly rounded
   * digits (so the nearest JS number, whatever the size of the radicand's terms); otherwise
   * within a few units in the last place (cancellation in a + b√d avoided through the
   * conjugate).
   * @throws {QuadspreadError} `NOT_FINITE` beyond the range of JS numbers.
   */
  toNumber(): number;
  /**
   * Exact text: `41 + 20√2`, `41 - 20√2`, `-3√5/2`, `√2`, `1/2 + √5/2`, `7/3`.
   * The rule: the rational part as the arithmetic writes it (omitted when 0 and b ≠ 0),
   * then ` + ` or ` - ` and the coefficient's magnitude; a coefficient p/q is written
   * `p√d/q`, a coefficient 1 is omitted; a radicand that is not plain digits is written `√(d)`.
   */
  toString(): string;
  /**
   * Decimal text of the value rounded to `digits` significant digits (half away from zero),
   * as the arithmetic's `toPrecision` writes it. In an exact arithmetic the rounding is
   * correct: the value is bracketed between exact bounds until both round alike.
   * @throws {QuadspreadError} `INVALID_ARGUMENT` unless digits is an integer in 1..1000.
   */
  toPrecision(digits: number): string;
  /** The exact text (as {@link Surd.toString}), so that `JSON.stringify` writes `"41 + 20√2"`. */
  toJSON(): string;
}

/**
 * The type of a result that may need a square root: a {@link Surd} in an exact
 * arithmetic (`E = true`), a plain value otherwise.
 *
 * @example
 * ```ts
 * import { rational, float, sqrtOf, rootToString } from 'quadspread';
 * [rootToString(rational, sqrtOf(rational, 8)), rootToString(float, sqrtOf(float, 9))];
 * //=> ['2√2', '3']
 * ```
 */
export type Root<T, E extends boolean> = E extends true ? Surd<T> : T;

const BRAND = SURD_BRAND;
// Node's console and util.inspect show a surd as its exact text, `41 + 20√2` (as `toString`),
// rather than its fields and arithmetic; the well-known symbol keeps this browser-safe. The method
// goes on the prototype when the first surd is made, not as a computed class member, so that a
// bundler can drop the whole class from a program that never makes a surd.
let inspectReady = false;
function showInConsole(): void {
  inspectReady = true;
  Object.defineProperty(SurdValue.prototype, Symbol.for('nodejs.util.inspect.custom'), {
    value(this: Surd<unknown>): string {
      return this.toString();
    },
  });
}

// Primes below 1000, for pulling square factors out of radicands (sieve of Eratosthenes).
const SMALL_PRIMES: readonly bigint[] = /* @__PURE__ */ (() => {
  const out: bigint[] = [];
  const composite = new Uint8Array(1000);
  for (let i = 2; i < 1000; i++) {
    if (composite[i]) continue;
    out.push(BigInt(i));
    for (let j = i * i; j < 1000; j += i) composite[j] = 1;
  }
  return out;
})();

class SurdValue<T> implements Surd<T> {
  readonly a: T;
  readonly b: T;
  readonly d: T;
  readonly arithmetic: Arithmetic<T>;
  constructor(A: Arithmetic<T>, a: T, b: T, d: T) {
    this.arithmetic = A;
    this.a = a;
    this.b = b;
    this.d = d;
    Object.defineProperty(this, BRAND, { value: true });
    if (!inspectReady) showInConsole();
  }

  isRational(): boolean {
    return this.arithmetic.isZero(this.b);
  }

  toRational(): T | undefined {
    return this.arithmetic.isZero(this.b) ? this.a : undefined;
  }

  /** y over this surd's radicand: [a, b] with y = a + b√(this.d); throws when impossible. */
  private align(y: Surd<T> | Numeric<T>, where: string): [T, T] {
    const A = this.arithmetic;
    if (!isSurd(y)) return [readNumber(A, y, where), A.zero];
    const Y = y as Surd<T>;
    if (A.isZero(Y.b)) return [Y.a, A.zero];
    if (A.isZero(this.b) || A.eq(Y.d, this.d)) return [Y.a, Y.b];
    const k = A.sqrt(A.div(Y.d, this.d));
    if (k !== undefined) return [Y.a, A.mul(Y.b, k)];
    throw new QuadspreadError(
      'DIFFERENT_RADICANDS',
      where,
      `${this.toString()} and ${Y.toString()} have different radicands (${A.toString(this.d)} and ${A.toString(Y.d)})`,
    );
  }

  /** The radicand of a result combining this with y. */
  private radicand(y: Surd<T> | Numeric<T>): T {
    return !this.arithmetic.isZero(this.b) || !isSurd(y) ? this.d : (y as Surd<T>).d;
  }

  add(y: Surd<T> | Numeric<T>): Surd<T> {
    const A = this.arithmetic;
    const [ya, yb] = this.align(y, 'Surd.add(y)');
    return raw(A, A.add(this.a, ya), A.add(this.b, yb), this.radicand(y));
  }

  sub(y: Surd<T> | Numeric<T>): Surd<T> {
    const A = this.arithmetic;
    const [ya, yb] = this.align(y, 'Surd.sub(y)');
    return raw(A, A.sub(this.a, ya), A.sub(this.b, yb), this.radicand(y));
  }

  mul(y: Surd<T> | Numeric<T>): Surd<T> {
    const A = this.arithmetic;
    const [ya, yb] = this.align(y, 'Surd.mul(y)');
    const d = this.radicand(y);
    // (a + b√d)(c + e√d) = (ac + be·d) + (ae + bc)√d
    const a = A.add(A.mul(this.a, ya), A.mul(A.mul(this.b, yb), d));
    const b = A.add(A.mul(this.a, yb), A.mul(this.b, ya));
    return raw(A, a, b, d);
  }

  div(y: Surd<T> | Numeric<T>): Surd<T> {
    const A = this.arithmetic;
    const [ya, yb] = this.align(y, 'Surd.div(y)');
    const d = this.radicand(y);
    // (a + b√d)/(c + e√d) = (a + b√d)(c − e√d)/(c² − e²d)
    const n = A.sub(A.mul(ya, ya), A.mul(A.mul(yb, yb), d));
    if (A.isZero(n)) throw divisionByZero('Surd.div(y)', `${this.toString()} divided by zero`);
    const a = A.div(A.sub(A.mul(this.a, ya), A.mul(A.mul(this.b, yb), d)), n);
    const b = A.div(A.sub(A.mul(this.b, ya), A.mul(this.a, yb)), n);
    return raw(A, a, b, d);
  }

  neg(): Surd<T> {
    const A = this.arithmetic;
    return raw(A, A.neg(this.a), A.neg(this.b), this.d);
  }

  conjugate(): Surd<T> {
    const A = this.arithmetic;
    return raw(A, this.a, A.neg(this.b), this.d);
  }

  sign(): -1 | 0 | 1 {
    return signOf(this.arithmetic, this.a, this.b, this.d);
  }

  isZero(): boolean {
    return this.sign() === 0;
  }

  cmp(y: Surd<T> | Numeric<T>): -1 | 0 | 1 {
    const A = this.arithmetic;
    if (!isSurd(y) || A.isZero((y as Surd<T>).b) || A.isZero(this.b)) {
      return this.sub(y).sign();
    }
    const Y = y as Surd<T>;
    if (A.eq(Y.d, this.d) || A.sqrt(A.div(Y.d, this.d)) !== undefined) return this.sub(Y).sign();
    // Sign of u + b1√d1 − b2√d2 with √d1, √d2 independent: first the sign of X = b1√d1 − b2√d2,
    // then, when u and X differ in sign, compare u² with X² = b1²d1 + b2²d2 − 2 b1 b2 √(d1 d2).
    const u = A.sub(this.a, Y.a);
    const p = A.mul(A.mul(this.b, this.b), this.d);
    const q = A.mul(A.mul(Y.b, Y.b), Y.d);
    const sb1 = A.sign(this.b);
    const sb2 = -A.sign(Y.b);
    const sX: -1 | 0 | 1 = sb1 === sb2 ? sb1 : ((A.cmp(p, q) * sb1) as -1 | 0 | 1);
    const su = A.sign(u);
    if (su === 0) return sX;
    if (sX === 0 || su === sX) return su;
    // u² − X² = (u² − p − q) + 2 b1 b2 √(d1 d2)
    const r = signOf(
      A,
      A.sub(A.sub(A.mul(u, u), p), q),
      A.mul(A.from(2), A.mul(this.b, Y.b)),
      A.mul(this.d, Y.d),
    );
    return r > 0 ? su : r < 0 ? sX : 0;
  }

  eq(y: Surd<T> | Numeric<T>): boolean {
    return this.cmp(y) === 0;
  }

  toNumber(): number {
    const A = this.arithmetic;
    if (A.isZero(this.b)) return A.toNumber(this.a);
    if (A.exact) {
      // Through 40 correctly rounded digits: works whatever the size of the radicand's
      // numerator and denominator (√(p/q) is kept as √(pq)/q, which may exceed JS range).
      const v = Number(this.toPrecision(40));
      if (!Number.isFinite(v))
        throw notFinite(
          'Surd.toNumber()',
          `${show(this.toPrecision(12))} is beyond the range of a JS number`,
        );
      return v;
    }
    const a = A.toNumber(this.a);
    const bs = A.toNumber(this.b) * Math.sqrt(A.toNumber(this.d));
    if (a === 0 || a > 0 === bs > 0) return a + bs;
    // Opposite signs: a + b√d = (a² − b²d)/(a − b√d), free of cancellation.
    const n = A.toNumber(A.sub(A.mul(this.a, this.a), A.mul(A.mul(this.b, this.b), this.d)));
    return n / (a - bs);
  }

  toString(): string {
    const A = this.arithmetic;
    if (A.isZero(this.b)) return A.toString(this.a);
    const sb = A.sign(this.b);
    let coef = A.toString(A.abs(this.b));
    const dText = A.toString(this.d);
    const root = /^\d+$/.test(dText) ? `√${dText}` : `√(${dText})`;
    const m = /^(\d+)\/(\d+)$/.exec(coef);
    let term: string;
    if (m) term = `${m[1] === '1' ? '' : m[1]}${root}/${m[2]}`;
    else term = `${coef === '1' ? '' : coef}${root}`;
    if (A.isZero(this.a)) return sb < 0 ? `-${term}` : term;
    coef = A.toString(this.a);
    return `${coef} ${sb < 0 ? '-' : '+'} ${term}`;
  }

  toPrecision(digits: number): string {
    const A = this.arithmetic;
    if (!Number.isInteger(digits) || digits < 1 || digits > 1000) {
      throw invalidArgument(
        'Surd.toPrecision(digits)',
        `digits ${show(digits)} is not an integer in 1..1000`,
      );
    }
    if (A.isZero(this.b)) return A.toPrecision(this.a, digits);
    const d = this.d;
    if (!A.exact) {
      const r = A.sqrt(d);
      if (r === undefined)
        throw unsupportedOperation(
          'Surd.toPrecision(digits)',
          `${A.name} has no square root of ${A.toString(d)}`,
        );
      return A.toPrecision(A.add(this.a, A.mul(this.b, r)), digits);
    }
    // Newton's iteration from above brackets √d: hi ≥ √d ≥ d/hi (AM–GM), the gap shrinking
    // quadratically; stop when both bounds of a + b√d round to the same text (an irrational
    // value is never a rounding boundary, so this ends).
    const two = A.from(2);
    let start: T;
    const f = A.ratio?.(d);
    if (f !== undefined) {
      // (⌊√(pq)⌋ + 1)/q ≥ √(p/q), for any size of radicand
      start = A.div(A.from(isqrt(f.n * f.d) + 1n), A.from(f.d));
    } else {
      start = A.from(Math.sqrt(A.toNumber(d)));
      if (A.sign(start) <= 0) start = A.one;
    }
    let hi = A.div(A.add(start, A.div(d, start)), two);
    const pos = A.sign(this.b) > 0;
    for (let i = 0; i < 60; i++) {
      const lo = A.div(d, hi);
      const l = A.add(this.a, A.mul(this.b, pos ? lo : hi));
      const u = A.add(this.a, A.mul(this.b, pos ? hi : lo));
      const tl = A.toPrecision(l, digits);
      if (tl === A.toPrecision(u, digits)) return tl;
      hi = A.div(A.add(hi, lo), two);
    }
    throw new QuadspreadError(
      'NOT_CONVERGED',
      'Surd.toPrecision(digits)',
      `${this.toString()} did not settle to ${digits} digits`,
    );
  }

  toJSON(): string {
    return this.toString();
  }
}

function signOf<T>(A: Arithmetic<T>, a: T, b: T, d: T): -1 | 0 | 1 {
  const sa = A.sign(a);
  const sb = A.sign(b);
  if (sb === 0 || A.isZero(d)) return sa;
  if (sa === 0 || sa === sb) return sb;
  // Opposite signs: the larger of a² and b²d wins.
  const c = A.cmp(A.mul(a, a), A.mul(A.mul(b, b), d));
  return c > 0 ? sa : c < 0 ? sb : 0;
}

/** A surd already in normal form except perhaps for a zero coefficient. */
function raw<T>(A: Arithmetic<T>, a: T, b: T, d: T): Surd<T> {
  if (A.isZero(b)) return new SurdValue(A, a, A.zero, A.one);
  return new SurdValue(A, a, b, d);
}

/**
 * Whether x is a {@link Surd} (made by this package, in any of its entries).
 *
 * @param x anything
 * @returns true for a surd
 * @throws Never.
 * @example
 * ```ts
 * import { rational, isSurd, sqrtOf } from 'quadspread';
 * [isSurd(sqrtOf(rational, 2)), isSurd(rational.from(2))];
 * //=> [true, false]
 * ```
 */
export function isSurd(x: unknown): x is Surd<unknown> {
  return typeof x === 'object' && x !== null && (x as Record<symbol, unknown>)[BRAND] === true;
}

/**
 * Makes the surd a + b√d in normal form (see {@link Surd}).
 *
 * @param A the arithmetic of a, b and d
 * @param a the rational part
 * @param b the coefficient of the root (default 0)
 * @param d the radicand (default 1), ≥ 0
 * @returns the surd, normalised: square factors pulled out of d, rational values with b = 0, d = 1
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when d < 0 and b ≠ 0; `INVALID_NUMBER` for unreadable input.
 * @example
 * ```ts
 * import { rational, surd } from 'quadspread';
 * [surd(rational, 1, 3, 200).toString(), surd(rational, 2, 3, 9).toString(), surd(rational, 0, 1, '1/2').toString()];
 * //=> ['1 + 30√2', '11', '√2/2']
 * ```
 */
export function surd<T>(
  A: Arithmetic<T>,
  a: Numeric<T>,
  b: Numeric<T> = 0,
  d: Numeric<T> = 1,
): Surd<T> {
  checkArithmetic(A, 'surd');
  const w = 'surd(A, a, b, d)';
  const ra = readNumber(A, a, w, ' a');
  let rb = readNumber(A, b, w, ' b');
  let rd = readNumber(A, d, w, ' d');
  if (A.isZero(rb) || A.isZero(rd)) return new SurdValue(A, ra, A.zero, A.one);
  if (A.sign(rd) < 0)
    throw noRealSolution(w, `the radicand d = ${show(A.toString(rd))} is negative`);
  const f = A.ratio?.(rd);
  if (f !== undefined) {
    // √(p/q) = √(pq)/q, then k²m → k√m for the primes below 1000.
    let m = f.n * f.d;
    let k = 1n;
    for (const p of SMALL_PRIMES) {
      const p2 = p * p;
      if (p2 > m) break;
      while (m % p2 === 0n) {
        m /= p2;
        k *= p;
      }
    }
    const r = isqrt(m);
    if (r * r === m) {
      k *= r;
      m = 1n;
    }
    rb = A.div(A.mul(rb, A.from(k)), A.from(f.d));
    if (m === 1n) return new SurdValue(A, A.add(ra, rb), A.zero, A.one);
    rd = A.from(m);
    return new SurdValue(A, ra, rb, rd);
  }
  const s = A.sqrt(rd);
  if (s !== undefined && A.exact) return new SurdValue(A, A.add(ra, A.mul(rb, s)), A.zero, A.one);
  return new SurdValue(A, ra, rb, rd);
}

/**
 * √x as a {@link Root}: in an exact arithmetic the surd √x in normal form (√200 = 10√2;
 * √(9/4) = 3/2 with `isRational()` true); otherwise the arithmetic's own rounded `A.sqrt(x)`.
 *
 * @param A the arithmetic
 * @param x the radicand, ≥ 0
 * @returns √x: a surd when `A.exact` is true, a plain value otherwise
 * @throws {QuadspreadError} `NO_REAL_SOLUTION` when x < 0; `INVALID_NUMBER` for unreadable input.
 * @example
 * ```ts
 * import { rational, float, sqrtOf } from 'quadspread';
 * [sqrtOf(rational, 200).toString(), sqrtOf(rational, '9/4').toString(), sqrtOf(float, 2)];
 * //=> ['10√2', '3/2', 1.4142135623730951]
 * ```
 */
export function sqrtOf<T, E extends boolean>(A: Arithmetic<T, E>, x: Numeric<T>): Root<T, E> {
  checkArithmetic(A, 'sqrtOf');
  const v = readNumber(A, x, 'sqrtOf(A, x) x');
  if (A.sign(v) < 0) throw noRealSolution('sqrtOf(A, x)', `x = ${show(A.toString(v))} is negative`);
  if (A.exact) return surd(A, 0, 1, v) as Root<T, E>;
  const r = A.sqrt(v);
  if (r === undefined)
    throw unsupportedOperation(
      'sqrtOf(A, x)',
      `${A.name} has no square root of ${show(A.toString(v))}`,
    );
  return r as Root<T, E>;
}

/**
 * Lifts a plain value into a {@link Root}: a rational surd in an exact arithmetic, the
 * value itself otherwise. Lets one code path return `Root<T, E>` in every arithmetic.
 *
 * @param A the arithmetic
 * @param x the value
 * @returns x as a root
 * @throws {QuadspreadError} `INVALID_NUMBER` (naming `asRoot(A, x) x`) when x is not a number.
 * @example
 * ```ts
 * import { rational, asRoot } from 'quadspread';
 * asRoot(rational, '3/4').toString();
 * //=> '3/4'
 * ```
 */
export function asRoot<T, E extends boolean>(A: Arithmetic<T, E>, x: Numeric<T>): Root<T, E> {
  checkArithmetic(A, 'asRoot');
  const v = readNumber(A, x, 'asRoot(A, x) x');
  return (A.exact ? new SurdValue(A, v, A.zero, A.one) : v) as Root<T, E>;
}

/**
 * The JS number of a {@link Root}: `r.toNumber()` for a surd, `A.toNumber(r)` otherwise.
 *
 * @param A the arithmetic
 * @param r a root (surd or plain value)
 * @returns the nearest JS number (see {@link Surd.toNumber})
 * @throws {QuadspreadError} `NOT_FINITE` beyond the range of JS numbers.
 * @example
 * ```ts
 * import { rational, float, sqrtOf, rootToNumber } from 'quadspread';
 * [rootToNumber(rational, sqrtOf(rational, 4)), rootToNumber(float, sqrtOf(float, 4))];
 * //=> [2, 2]
 * ```
 */
export function rootToNumber<T, E extends boolean>(A: Arithmetic<T, E>, r: Root<T, E>): number {
  checkArithmetic(A, 'rootToNumber');
  return isSurd(r) ? (r as Surd<T>).toNumber() : A.toNumber(r as T);
}

/**
 * The text of a {@link Root}: `r.toString()` for a surd (exact form), `A.toString(r)` otherwise.
 *
 * @param A the arithmetic
 * @param r a root (surd or plain value)
 * @returns its text
 * @throws Never for a root of this arithmetic.
 * @example
 * ```ts
 * import { rational, sqrtOf, rootToString } from 'quadspread';
 * rootToString(rational, sqrtOf(rational, 12));
 * //=> '2√3'
 * ```
 */
export function rootToString<T, E extends boolean>(A: Arithmetic<T, E>, r: Root<T, E>): string {
  checkArithmetic(A, 'rootToString');
  return isSurd(r) ? (r as Surd<T>).toString() : A.toString(r as T);
}

/**
 * Decimal text of a {@link Root} rounded to `digits` significant digits: correctly
 * rounded for a surd of an exact arithmetic (see {@link Surd.toPrecision}), the
 * arithmetic's `toPrecision` otherwise.
 *
 * @param A the arithmetic
 * @param r a root
 * @param digits significant digits, 1..1000
 * @returns decimal text
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad digit count.
 * @example
 * ```ts
 * import { rational, sqrtOf, rootToPrecision } from 'quadspread';
 * rootToPrecision(rational, sqrtOf(rational, 2), 20);
 * //=> '1.4142135623730950488'
 * ```
 */
export function rootToPrecision<T, E extends boolean>(
  A: Arithmetic<T, E>,
  r: Root<T, E>,
  digits: number,
): string {
  checkArithmetic(A, 'rootToPrecision');
  return isSurd(r) ? (r as Surd<T>).toPrecision(digits) : A.toPrecision(r as T, digits);
}
