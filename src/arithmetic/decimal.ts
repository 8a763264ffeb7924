/**
 * The decimal arithmetic: big.js values rounded to a stated number of significant digits.
 *
 * @module arithmetic
 */
import BigJs from 'big.js';
import type { Big, BigConstructor } from 'big.js';
import {
  show,
  invalidArgument,
  divisionByZero,
  noRealSolution,
  notFinite,
  zeroVectorAngle,
} from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import {
  MAX_DECIMAL_DIGITS,
  isqrt,
  operandChecks,
  pow10,
  ratioToPrecision,
  readInput,
} from './exact.js';
import { decimalElementary } from './elementary.js';
import { decimalKernels } from './fused-decimal.js';

/** A value of a {@link decimal} arithmetic: a big.js `Big`. */
export type Decimal = Big;

/** The type of a {@link decimal} arithmetic (inexact: `E = false`). */
export interface DecimalArithmetic extends Arithmetic<Decimal, false> {
  /** Significant digits every result is rounded to. */
  readonly digits: number;
}

// Kept in exact.ts (no big.js there), so that code reading it does not bundle big.js.
export { MAX_DECIMAL_DIGITS };

const HALF_EVEN = 2;

/** Coefficient and exponent of a Big: value = coef · 10^exp. */
function parts(x: Big): { coef: bigint; exp: number } {
  const digits = x.c.join('');
  const coef = BigInt(digits);
  return { coef: x.s < 0 ? -coef : coef, exp: x.e - (digits.length - 1) };
}

/** A Big made by another big.js constructor (another decimal instance). */
function isForeignBig(x: unknown): x is Big {
  if (x === null || typeof x !== 'object') return false;
  const b = x as { c?: unknown; e?: unknown; s?: unknown };
  return Array.isArray(b.c) && typeof b.e === 'number' && (b.s === 1 || b.s === -1);
}

function digitCount(a: bigint): number {
  return (a < 0n ? -a : a).toString().length;
}

/**
 * A decimal arithmetic that rounds every result to `digits` significant digits, ties
 * to even (IEEE 754 roundTiesToEven). + − × are computed exactly and rounded once; ÷ and
 * √ are correctly rounded (computed with bigints, with a sticky digit). Each instance has
 * its own big.js constructor: no setting is shared between instances, and none is global.
 *
 * Transcendental functions (`pi`, `sin`, `cos`, `atan2`) are rounded to `digits`
 * significant digits (see the elementary module for their accuracy).
 *
 * @param digits significant digits, an integer in 1..{@link MAX_DECIMAL_DIGITS}; default 34
 *   (IEEE 754 decimal128).
 * @returns a new, independent decimal arithmetic
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when `digits` is not such an integer.
 * @example
 * ```ts
 * import { decimal } from 'quadspread';
 * const D = decimal(30);
 * D.toString(D.div(D.one, D.from(3)));
 * //=> '0.333333333333333333333333333333'
 * ```
 */
export function decimal(digits = 34): DecimalArithmetic {
  if (!Number.isInteger(digits) || digits < 1 || digits > MAX_DECIMAL_DIGITS) {
    throw invalidArgument(
      'decimal(digits)',
      `digits ${show(digits)} is not an integer in 1..${MAX_DECIMAL_DIGITS}`,
    );
  }
  const D: BigConstructor = BigJs();
  D.DP = 0;
  D.RM = HALF_EVEN;
  D.NE = -7;
  D.PE = 21;
  D.strict = false;
  const name = `decimal(${digits})`;

  const round = (x: Big): Big => (x.c.length > digits ? x.prec(digits, HALF_EVEN) : x);
  const make = (coef: bigint, exp: number): Big => round(new D(`${coef}e${exp}`));
  /** Rounds coef · 10^exp, whose coef has at least digits + 2 digits, with a sticky flag. */
  const withSticky = (coef: bigint, exp: number, inexact: boolean): Big => {
    if (!inexact) return make(coef, exp);
    const c = coef * 10n + (coef < 0n ? -1n : 1n);
    return make(c, exp - 1);
  };
  // big.js constructors share one prototype, so `instanceof` cannot tell instances apart;
  // each Big carries its own constructor as an own property.
  const isOwn = (x: unknown): x is Big => x instanceof D && (x as Big).constructor === D;
  // Operands must be Bigs, by shape (of any decimal(n), or of a second copy of big.js: the
  // operations are exact before they round, so such a Big is read at its full value).
  const { one, two } = operandChecks<Big>(name, isForeignBig);
  const elementary = decimalElementary(digits);
  const fromText = (s: string): Big => round(new D(s));

  const A: DecimalArithmetic = {
    name,
    exact: false,
    digits,
    withDigits: (n: number) => decimal(n),
    zero: new D(0),
    one: new D(1),
    from(x: Numeric<Big>): Big {
      if (isOwn(x)) return round(x);
      if (isForeignBig(x)) {
        // A Big from another decimal instance: read it exactly, then round to these digits.
        const p = parts(x as Big);
        return make(p.coef, p.exp);
      }
      const r = readInput(x, `${name}.from(x)`);
      if (r.d === 1n) return make(r.n, 0);
      // Correctly rounded n/d.
      return divide(r.n, 0, r.d, 0);
    },
    is: isOwn,
    // Every operation checks that its operands are Bigs: a number, text or a fraction is refused.
    add: (a, b) => round(two('add', a, b).plus(b)),
    sub: (a, b) => round(two('sub', a, b).minus(b)),
    mul: (a, b) => round(two('mul', a, b).times(b)),
    div(a, b) {
      if (two('div', a, b) && b.c[0] === 0)
        throw divisionByZero(`${name}.div(a, b)`, `b is zero (a = ${a.toString()})`);
      const pa = parts(a);
      const pb = parts(b);
      return divide(pa.coef, pa.exp, pb.coef, pb.exp);
    },
    neg: (a) => one('neg', a).neg(),
    abs: (a) => one('abs', a).abs(),
    cmp: (a, b) => two('cmp', a, b).cmp(b) as -1 | 0 | 1,
    eq: (a, b) => two('eq', a, b).eq(b),
    isZero: (a) => one('isZero', a).c[0] === 0,
    sign: (a) => (one('sign', a).c[0] === 0 ? 0 : (a.s as -1 | 1)),
    sqrt(a) {
      if (one('sqrt', a).c[0] === 0) return A.zero;
      if (a.s < 0) throw noRealSolution(`${name}.sqrt(a)`, `a = ${a.toString()} is negative`);
      let { coef, exp } = parts(a);
      // Make exp even and coef large enough for digits + 2 digits of root.
      let shift = Math.max(0, 2 * (digits + 2) - digitCount(coef));
      if ((exp - shift) % 2 !== 0) shift += 1;
      coef *= pow10(shift);
      exp -= shift;
      const r = isqrt(coef);
      return withSticky(r, exp / 2, r * r !== coef);
    },
    toNumber(a) {
      const v = Number(one('toNumber', a).toString());
      if (!Number.isFinite(v))
        throw notFinite(
          `${name}.toNumber(a)`,
          `${a.toString()} is beyond the range of a JS number`,
        );
      return v;
    },
    toString: (a) => one('toString', a).toString(),
    toPrecision(a, d) {
      const p = parts(one('toPrecision', a));
      return p.exp >= 0
        ? ratioToPrecision(p.coef * pow10(p.exp), 1n, d)
        : ratioToPrecision(p.coef, pow10(-p.exp), d);
    },
    get pi() {
      return fromText(elementary.pi);
    },
    sin: (x) => fromText(elementary.sin(one('sin', x).toString())),
    cos: (x) => fromText(elementary.cos(one('cos', x).toString())),
    atan2(y, x) {
      if (two('atan2', y, x) && y.c[0] === 0 && x.c[0] === 0)
        throw zeroVectorAngle(`${name}.atan2(y, x)`);
      return fromText(elementary.atan2(y.toString(), x.toString()));
    },
    exp: (x) => fromText(elementary.exp(one('exp', x).toString())),
    log(x) {
      if (one('log', x).s < 0 || x.c[0] === 0)
        throw noRealSolution(`${name}.log(x)`, `x = ${x.toString()} is not positive`);
      return fromText(elementary.ln(x.toString()));
    },
    // Fused kernels (src/arithmetic/fused-decimal.ts): exact with bigints, rounded once.
    kernels: decimalKernels(digits, new D(0), (x) => A.from(x as Numeric<Big>)),
  };

  /** (an·10^ae) / (bn·10^be), correctly rounded to `digits`. */
  function divide(an: bigint, ae: number, bn: bigint, be: number): Big {
    if (an === 0n) return A.zero;
    // Scale the numerator so that the quotient has at least digits + 2 digits.
    const k = Math.max(0, digits + 2 - (digitCount(an) - digitCount(bn)) + 1);
    const num = an * pow10(k);
    const q = num / bn;
    return withSticky(q, ae - be - k, num % bn !== 0n);
  }

  return Object.freeze(A);
}
