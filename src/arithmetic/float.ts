/**
 * The float arithmetic: JS numbers (IEEE 754 binary64).
 *
 * @module arithmetic
 */
import {
  show,
  notFinite,
  invalidNumber,
  divisionByZero,
  noRealSolution,
  zeroVectorAngle,
} from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import { ratioToNumber, ratioToPrecision, readInput, readRatio } from './exact.js';

/** The type of the {@link float} arithmetic (inexact: `E = false`). */
export type FloatArithmetic = Arithmetic<number, false>;

function finite(v: number, where: string): number {
  if (!Number.isFinite(v)) throw notFinite(where, `the result ${show(v)} is not finite`);
  return v;
}

/**
 * The float arithmetic: fast, rounding every operation to the nearest JS number.
 * NaN and ±Infinity are refused where values enter (`from`) and where they leave
 * (`toNumber`, `toString`, `toPrecision`); `div` refuses a zero divisor and `sqrt` a
 * negative argument, and both refuse a result that is not finite (`NOT_FINITE`), so an
 * overflow met in `add`, `sub` or `mul` — left unchecked for speed, and possible only with
 * magnitudes near 1e308 — is caught at the next division, root or conversion, and the
 * functions whose result is a bare sum, difference or product (`quadrance`, `lineThrough`, the
 * law residuals) check that result once. Text is read correctly rounded (`'1/3'` gives the
 * double nearest to 1/3).
 *
 * @example
 * ```ts
 * import { float } from 'quadspread';
 * float.add(float.from('0.1'), float.from(0.2));
 * //=> 0.30000000000000004
 * ```
 */
export const float: FloatArithmetic = /* @__PURE__ */ Object.freeze<FloatArithmetic>({
  name: 'float',
  exact: false,
  digits: 15,
  float64: true,
  zero: 0,
  one: 1,
  from(x: Numeric<number>): number {
    if (typeof x === 'number') {
      if (x - x !== 0) throw invalidNumber('float.from(x)', `${show(x)} is not a finite number`);
      return x;
    }
    if (typeof x === 'string') {
      const r = readRatio(x, 'float.from(x)');
      return finite(x.includes('/') ? ratioToNumber(r.n, r.d) : Number(x.trim()), 'float.from(x)');
    }
    const r = readInput(x, 'float.from(x)');
    return finite(ratioToNumber(r.n, r.d), 'float.from(x)');
  },
  is: (x: unknown): x is number => typeof x === 'number' && x - x === 0,
  add: (a, b) => a + b,
  sub: (a, b) => a - b,
  mul: (a, b) => a * b,
  div(a, b) {
    if (b === 0) throw divisionByZero('float.div(a, b)', `b is zero (a = ${show(a)})`);
    const r = a / b;
    // Infinity/Infinity, NaN/x or an overflowing quotient: refuse rather than pass NaN on.
    if (r - r !== 0) throw notFinite('float.div(a, b)', `${show(a)} / ${show(b)} is not finite`);
    return r;
  },
  neg: (a) => -a,
  abs: (a) => Math.abs(a),
  cmp: (a, b) => (a < b ? -1 : a > b ? 1 : 0),
  eq: (a, b) => a === b,
  isZero: (a) => a === 0,
  sign: (a) => (a < 0 ? -1 : a > 0 ? 1 : 0),
  sqrt(a) {
    if (a < 0) throw noRealSolution('float.sqrt(a)', `a = ${show(a)} is negative`);
    const r = Math.sqrt(a);
    if (r - r !== 0) throw notFinite('float.sqrt(a)', `a = ${show(a)} is not finite`);
    return r;
  },
  toNumber: (a) => finite(a, 'float.toNumber(a)'),
  toString: (a) => String(finite(a, 'float.toString(a)') + 0),
  toPrecision(a, digits) {
    finite(a, 'float.toPrecision(a, digits)');
    // Exact decimal expansion of the double, then rounded half away from zero.
    const r = readRatio(exactText(a), 'float.toPrecision(a, digits)');
    return ratioToPrecision(r.n, r.d, digits);
  },
  pi: Math.PI,
  sin: (x) => Math.sin(x),
  cos: (x) => Math.cos(x),
  atan2(y, x) {
    if (y === 0 && x === 0) throw zeroVectorAngle('float.atan2(y, x)');
    return Math.atan2(y, x);
  },
  exp(x) {
    const r = Math.exp(x);
    if (r === Infinity) throw notFinite('float.exp(x)', `e^${show(x)} overflows`);
    return r;
  },
  log(x) {
    if (!(x > 0)) throw noRealSolution('float.log(x)', `x = ${show(x)} is not positive`);
    return Math.log(x);
  },
});

/** The exact value of a finite double as text (a/2^k). */
function exactText(a: number): string {
  if (Number.isInteger(a)) return BigInt(a).toString();
  let k = 0;
  let m = a;
  while (!Number.isInteger(m)) {
    m *= 2;
    k++;
  }
  return `${BigInt(m)}/${1n << BigInt(k)}`;
}
