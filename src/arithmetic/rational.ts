/**
 * The exact arithmetic: values are fraction.js fractions (bigint numerator and
 * denominator, always in lowest terms).
 *
 * @module arithmetic
 */
import Fraction from 'fraction.js';
import { show, divisionByZero, noRealSolution, notFinite, zeroVectorAngle } from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import {
  isqrt,
  isSurdLike,
  ratioToNumber,
  ratioToPrecision,
  readInput,
  operandChecks,
} from './exact.js';
import { decimalElementary } from './elementary.js';
import { rationalKernels } from './fused-rational.js';
import { decimal, type DecimalArithmetic } from './decimal.js';

/** A value of the {@link rational} arithmetic: a fraction.js `Fraction`. */
export type Rational = Fraction;

/** The type of the {@link rational} arithmetic: exact (`E = true`). */
export type RationalArithmetic = Arithmetic<Rational, true>;

/**
 * Significant digits of the decimal computation behind `rational`'s transcendental
 * functions (`pi`, `sin`, `cos`, `atan2`): results are rationals within 1e-40 relative
 * (and 1e-40 absolute near zero) of the true value.
 *
 * @example
 * ```ts
 * import { rational, RATIONAL_TRANSCENDENTAL_DIGITS } from 'quadspread';
 * RATIONAL_TRANSCENDENTAL_DIGITS;
 * //=> 42
 * rational.toPrecision(rational.pi, 30);
 * //=> '3.14159265358979323846264338328'
 * ```
 */
export const RATIONAL_TRANSCENDENTAL_DIGITS = 42;

const ZERO = /* @__PURE__ */ new Fraction(0);
const ONE = /* @__PURE__ */ new Fraction(1);

function frac(n: bigint, d: bigint): Rational {
  return new Fraction(n, d);
}

function signed(a: Rational): bigint {
  return a.s * a.n;
}

const elementary = /* @__PURE__ */ decimalElementary(RATIONAL_TRANSCENDENTAL_DIGITS);

function toElementary(a: Rational): string {
  return ratioToPrecision(signed(a), a.d, RATIONAL_TRANSCENDENTAL_DIGITS + 8);
}

function fromElementary(text: string): Rational {
  const r = readInput(text, 'rational (transcendental)');
  return frac(r.n, r.d);
}

// A fraction.js value by shape (bigint numerator and denominator), so that fractions made by a
// second copy of fraction.js (a program loading both the CommonJS and the ES build) still pass.
const approximations = new Map<number, DecimalArithmetic>();
/** decimal(digits), memoised (a pure memo: decimal arithmetics are immutable values). */
function approximate(digits: number): DecimalArithmetic {
  let D = approximations.get(digits);
  if (D === undefined) {
    D = decimal(digits);
    approximations.set(digits, D);
  }
  return D;
}

const isFraction = (x: unknown): boolean =>
  typeof (x as Rational | null)?.d === 'bigint' && typeof (x as Rational).n === 'bigint';

// Kept as one object (not destructured): a bundler cannot drop a destructuring, so a program
// that never uses `rational` would keep these checks.
const checks = /* @__PURE__ */ operandChecks<Rational>('rational', isFraction);
const one = (op: string, a: Rational): Rational => checks.one(op, a);
const two = (op: string, a: Rational, b: Rational): Rational => checks.two(op, a, b);

const INSPECT = /* @__PURE__ */ Symbol.for('nodejs.util.inspect.custom');

/**
 * Node's console and `util.inspect` show a fraction as its exact text (`10161/4`) rather than
 * its fields (`{ s: 1n, n: 10161n, d: 4n }`). Set once on fraction.js's prototype when the
 * `rational` arithmetic is built (only a program that uses `rational` runs this), through the
 * well-known symbol, so no Node module is imported and the code stays browser-safe.
 */
function showFractionsAsText(): void {
  const proto = Fraction.prototype as unknown as Record<symbol, unknown>;
  if (Object.prototype.hasOwnProperty.call(proto, INSPECT)) return;
  Object.defineProperty(proto, INSPECT, {
    value(this: Rational): string {
      return this.toFraction();
    },
    configurable: true,
  });
}

/**
 * The exact arithmetic. + − × ÷ never round; `sqrt` is exact or `undefined`; a JS
 * number is read through its shortest round-trip decimal, so `0.1` is exactly 1/10.
 * Transcendental functions (`pi`, `sin`, `cos`, `atan2`) cannot be exact: they return
 * rationals within 1e-40 relative of the true value ({@link RATIONAL_TRANSCENDENTAL_DIGITS}).
 *
 * Output: `toString` writes the exact fraction (`10161/4`), and Node's `console.log` and
 * `util.inspect` show a fraction that way too. `toString`, `toPrecision` and `toNumber` also
 * take a quadratic surd (a result that needed a square root, e.g. `41 + 20√2`) and defer to
 * its own methods, so any exact value the library returns can be written with them.
 *
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * rational.toString(rational.add(rational.from('0.1'), rational.from(0.2)));
 * //=> '3/10'
 * ```
 */
export const rational: RationalArithmetic = /* @__PURE__ */ ((): RationalArithmetic => {
  showFractionsAsText();
  return Object.freeze<RationalArithmetic>({
    name: 'rational',
    exact: true,
    digits: RATIONAL_TRANSCENDENTAL_DIGITS,
    ratio: (x: Rational) => {
      const a = one('ratio', x);
      return { n: signed(a), d: a.d };
    },
    zero: ZERO,
    one: ONE,
    from(x: Numeric<Rational>): Rational {
      if (x instanceof Fraction) return x;
      const r = readInput(x, 'rational.from(x)');
      return frac(r.n, r.d);
    },
    is(x: unknown): x is Rational {
      return x instanceof Fraction;
    },
    // Every operation checks that its operands are fractions (two instanceof tests, next to a
    // gcd): a JS number or a value of another arithmetic is refused, never computed with.
    add: (a, b) => two('add', a, b).add(b),
    sub: (a, b) => two('sub', a, b).sub(b),
    mul: (a, b) => two('mul', a, b).mul(b),
    div(a, b) {
      if (two('div', a, b) && b.n === 0n)
        throw divisionByZero('rational.div(a, b)', `b is zero (a = ${a.toFraction()})`);
      return a.div(b);
    },
    neg: (a) => one('neg', a).neg(),
    abs: (a) => one('abs', a).abs(),
    cmp(a, b) {
      const c = two('cmp', a, b).compare(b);
      return c < 0 ? -1 : c > 0 ? 1 : 0;
    },
    eq: (a, b) => two('eq', a, b).s === b.s && a.n === b.n && a.d === b.d,
    isZero: (a) => one('isZero', a).n === 0n,
    sign: (a) => (one('sign', a).n === 0n ? 0 : a.s < 0n ? -1 : 1),
    sqrt(a) {
      if (one('sqrt', a).n === 0n) return ZERO;
      if (a.s < 0n) throw noRealSolution('rational.sqrt(a)', `a = ${a.toFraction()} is negative`);
      const rn = isqrt(a.n);
      if (rn * rn !== a.n) return undefined;
      const rd = isqrt(a.d);
      if (rd * rd !== a.d) return undefined;
      return frac(rn, rd);
    },
    toNumber(a) {
      // A surd (a result that needed a square root) converts itself: see `Surd.toNumber`.
      if (isSurdLike(a)) return a.toNumber();
      const v = ratioToNumber(signed(one('toNumber', a)), a.d);
      if (!Number.isFinite(v))
        throw notFinite(
          'rational.toNumber(a)',
          `${show(a.toFraction())} is beyond the range of a JS number`,
        );
      return v;
    },
    toString: (a) => (isSurdLike(a) ? a.toString() : one('toString', a).toFraction()),
    toPrecision: (a, digits) =>
      isSurdLike(a)
        ? a.toPrecision(digits)
        : ratioToPrecision(signed(one('toPrecision', a)), a.d, digits),
    get pi() {
      return fromElementary(elementary.pi);
    },
    // The exact argument itself is reduced (by π/2 to as many bits as it needs), never a
    // rounded copy: sin(10^50 + 1) differs from sin(10^50) as it should.
    sin: (x) => fromElementary(elementary.ratio!.sin(signed(one('sin', x)), x.d)),
    cos: (x) => fromElementary(elementary.ratio!.cos(signed(one('cos', x)), x.d)),
    atan2(y, x) {
      if (two('atan2', y, x) && y.n === 0n && x.n === 0n)
        throw zeroVectorAngle('rational.atan2(y, x)');
      return fromElementary(elementary.ratio!.atan2(signed(y), y.d, signed(x), x.d));
    },
    exp: (x) => (one('exp', x).n === 0n ? ONE : fromElementary(elementary.exp(toElementary(x)))),
    log(x) {
      if (one('log', x).s < 0n || x.n === 0n)
        throw noRealSolution('rational.log(x)', `x = ${x.toFraction()} is not positive`);
      return x.n === 1n && x.d === 1n ? ZERO : fromElementary(elementary.ln(toElementary(x)));
    },
    approximate,
    // Fused exact kernels (src/arithmetic/fused-rational.ts): same results, fewer gcds.
    kernels: rationalKernels,
  });
})();
