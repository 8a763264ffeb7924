/**
 * The arithmetic contract: every solver is written once against {@link Arithmetic}
 * and runs exactly (rational), correctly rounded (decimal), fast (float) or with
 * uncertainty (uncertain) depending on the object passed first.
 *
 * @module arithmetic
 */

/**
 * What a function accepts where it wants a number of arithmetic `T`: a value of that
 * arithmetic, or a JS number, numeric text or bigint that {@link Arithmetic.from} reads.
 */
export type Numeric<T> = T | number | string | bigint;

/**
 * A plain object of operations over an opaque value type `T`.
 *
 * `E` records in the type whether the arithmetic is exact (`true` for `rational`):
 * functions whose results may need a square root return quadratic surds when `E` is
 * `true` and plain values otherwise.
 *
 * Implementations must never return NaN or ±Infinity, and must throw a
 * {@link QuadspreadError} for bad input. They hold no mutable state that one call can
 * change for another.
 */
export interface Arithmetic<T, E extends boolean = boolean> {
  /** A short name: `'rational'`, `'decimal(30)'`, `'float'`, `'uncertain(float)'`. */
  readonly name: string;
  /** `true` when + − × ÷ never round. */
  readonly exact: E;
  /**
   * Significant digits the arithmetic's results claim, for generic code that needs a tolerance
   * instead of guessing from the name: the digits of a `decimal(n)` (n); for `rational`, the
   * digits its transcendental functions (π, sin, cos, atan2) are good to
   * ({@link RATIONAL_TRANSCENDENTAL_DIGITS}, 42); 15 for `float`; an `uncertain(base)` claims
   * its base's.
   */
  readonly digits: number;
  /**
   * The same kind of arithmetic with another number of significant digits, where the
   * arithmetic has such a setting (`decimal(n).withDigits(m)` is `decimal(m)`); absent
   * otherwise. Generic code uses it to compute a transcendental step with guard digits and
   * round once.
   */
  withDigits?(digits: number): Arithmetic<T, E>;
  /**
   * `true` when values are JS numbers and `add`, `sub`, `mul`, `div` are exactly the IEEE 754
   * double operations (the `float` arithmetic). A solver may then run a float twin of its loop
   * written with plain operators, proven equal to the generic code by property tests.
   * @internal
   */
  readonly float64?: boolean;
  /**
   * For an exact arithmetic: a value as the ratio n/d of integers in lowest terms, d > 0
   * (`rational` gives its fraction's numerator and denominator). Generic code uses it for
   * integer work on exact values (square-root bounds, surd simplification) instead of testing
   * the value's class.
   * @internal
   */
  ratio?(x: T): { readonly n: bigint; readonly d: bigint };
  /**
   * For an exact arithmetic: a decimal arithmetic of `digits` significant digits, in which
   * generic code evaluates an approximation whose result is inexact anyway (an iteration, a
   * series), so that fractions do not grow. Reached through the arithmetic, so that code that
   * never meets an exact arithmetic (a float-only program) does not bundle the decimal one.
   * @internal
   */
  approximate?(digits: number): Arithmetic<unknown, false>;
  /** 0 in this arithmetic. */
  readonly zero: T;
  /** 1 in this arithmetic. */
  readonly one: T;
  /**
   * Reads a value: a value of this arithmetic (returned as is), a finite JS number
   * (read through its shortest round-trip decimal, so `0.1` is 1/10), a bigint, or text:
   * an integer, a decimal, an exponent form (`1.5e-3`) or a ratio `a/b`.
   * @throws {QuadspreadError} `INVALID_NUMBER` for anything else; `INPUT_TOO_LONG` for text
   * over {@link MAX_INPUT_LENGTH} characters or with an exponent over {@link MAX_EXPONENT}.
   */
  from(x: Numeric<T>): T;
  /** Whether `x` is a value of this arithmetic. */
  is(x: unknown): x is T;
  /** a + b */
  add(a: T, b: T): T;
  /** a − b */
  sub(a: T, b: T): T;
  /** a × b */
  mul(a: T, b: T): T;
  /**
   * a ÷ b
   * @throws {QuadspreadError} `DIVISION_BY_ZERO` when b is zero.
   */
  div(a: T, b: T): T;
  /** −a */
  neg(a: T): T;
  /** |a| */
  abs(a: T): T;
  /** −1, 0 or 1 as a is less than, equal to or greater than b. */
  cmp(a: T, b: T): -1 | 0 | 1;
  /** a = b */
  eq(a: T, b: T): boolean;
  /** a = 0 */
  isZero(a: T): boolean;
  /** −1, 0 or 1: the sign of a. */
  sign(a: T): -1 | 0 | 1;
  /**
   * √a: exact, or `undefined` where the arithmetic cannot represent the root (in
   * `rational`, when a is not the square of a rational); correctly rounded in `decimal`;
   * IEEE in `float`.
   * @throws {QuadspreadError} `NO_REAL_SOLUTION` when a < 0.
   */
  sqrt(a: T): T | undefined;
  /** The nearest JS number. */
  toNumber(a: T): number;
  /** Text: `3/10` or `25` in rational; plain decimal text in decimal; shortest round trip in float. */
  toString(a: T): string;
  /**
   * Decimal text rounded to `digits` significant digits (half away from zero), without an
   * exponent where practical. For display; exact arithmetic rounds only here.
   */
  toPrecision(a: T, digits: number): string;
  /**
   * π in this arithmetic: exact is impossible, so `rational` gives a rational within its
   * stated tolerance and `decimal` rounds to its digits.
   */
  readonly pi: T;
  /** sin x (x in radians). Transcendental: see {@link Arithmetic.pi} for how each kind rounds. */
  sin(x: T): T;
  /** cos x (x in radians). */
  cos(x: T): T;
  /**
   * The angle of the vector (x, y) in radians, in (−π, π].
   * @throws {QuadspreadError} `INVALID_ARGUMENT` when x = y = 0.
   */
  atan2(y: T, x: T): T;
  /**
   * e^x. Transcendental, rounded as {@link Arithmetic.sin}: `rational` gives a rational within
   * 1e-40 relative of the true value, `decimal` rounds correctly to its digits, `float` is
   * `Math.exp`; `uncertain` carries d e^x = e^x dx.
   * @throws {QuadspreadError} `NOT_FINITE` in float when e^x overflows (x > 709.78);
   * `INVALID_ARGUMENT` in decimal and rational when |x| > 2302585.
   */
  exp(x: T): T;
  /**
   * ln x, the natural logarithm, rounded as {@link Arithmetic.exp}; `uncertain` carries
   * d ln x = dx/x.
   * @throws {QuadspreadError} `NO_REAL_SOLUTION` when x ≤ 0.
   */
  log(x: T): T;
  /**
   * Optional fused kernels: whole formulas computed at once (performance only). Solvers may
   * call one where present and must give the same result without it; a kernel returns
   * `undefined` for input it leaves to the generic path (which reports the errors).
   * @internal
   */
  readonly kernels?: FusedKernels<T>;
}

/**
 * The seven measures of triangle A1 A2 A3 as a fused kernel gives them: Q1 = Q(A2, A3)
 * opposite A1, s1 the spread at A1.
 * @internal
 */
export interface FusedTriangle<T> {
  readonly Q1: T;
  readonly Q2: T;
  readonly Q3: T;
  readonly s1: T;
  readonly s2: T;
  readonly s3: T;
  readonly quadrea: T;
}

/**
 * Fused kernels an arithmetic may offer. Exact arithmetics give exactly the generic result;
 * rounding arithmetics compute exactly and round once, so they are at least as accurate.
 * @internal
 */
export interface FusedKernels<T> {
  /** triangle measures from the coordinates of A1, A2, A3; `undefined` if degenerate. */
  triangle?(x1: T, y1: T, x2: T, y2: T, x3: T, y3: T): FusedTriangle<T> | undefined;
  /**
   * heightFromInlineReadings for the input as given (three stations, values of this
   * arithmetic); `undefined` for anything else or anything the generic code rejects.
   */
  inlineHeight?(
    input: unknown,
  ): { H: T; footChainage: T; footOffset: T; residuals: T[]; sign: 1 } | undefined;
  /**
   * traverse for the input as given, all but the closure's root and precision ratio (the
   * caller adds those); `undefined` for input it leaves to the generic code.
   */
  traverse?(input: unknown): FusedTraverse<T> | undefined;
}

/**
 * What a fused traverse kernel gives: the misclosure, the total length, the points and the
 * compass-rule adjustment. @internal
 */
export interface FusedTraverse<T> {
  readonly east: T;
  readonly north: T;
  readonly length: T;
  readonly points: { x: T; y: T }[];
  readonly adjusted: { x: T; y: T }[];
  readonly courses: {
    latitude: T;
    departure: T;
    length: T;
    adjustedLatitude: T;
    adjustedDeparture: T;
  }[];
  readonly rule: 'compass';
}

/** The value type of an arithmetic. */
export type ValueOf<A> = A extends Arithmetic<infer T, boolean> ? T : never;
