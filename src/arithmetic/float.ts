/**
 * The float arithmetic: JS numbers (IEEE 754 binary64).
 *
 * @module arithmetic
 */
import {
  show,
  notAValue,
  notFinite,
  invalidNumber,
  divisionByZero,
  noRealSolution,
  zeroVectorAngle,
} from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import { floatCos, floatSin } from './float-trig.js';
import { ratioToNumber, ratioToPrecision, readInput, readRatio } from './exact.js';

/** The type of the {@link float} arithmetic (inexact: `E = false`). */
export type FloatArithmetic = Arithmetic<number, false>;

/** `a` when it is a finite number, else `INVALID_NUMBER` naming the operation. */
function ok1(op: string, a: unknown): number {
  if (typeof a === 'number' && a - a === 0) return a;
  throw notAValue('float', op, a);
}

/** `r` (the result of `op` on a and b) when a, b and r are finite numbers; else the error. */
function ok2(op: string, a: unknown, b: unknown, r: number): number {
  if (typeof a === 'number' && typeof b === 'number' && a - a === 0 && b - b === 0) {
    if (r - r === 0) return r;
    throw notFinite(`float.${op}(a, b)`, `${show(a)} ${op} ${show(b)} is not finite`);
  }
  throw notAValue('float', op, typeof a === 'number' && a - a === 0 ? b : a);
}

// + − ×: two numbers whose result is finite were finite themselves (±Infinity or NaN in an
// operand makes the result ±Infinity or NaN), so the fast path tests the result only; the
// rest goes to ok2 for the error.
const add = (a: number, b: number): number => {
  if (typeof a === 'number' && typeof b === 'number') {
    const r = a + b;
    if (r - r === 0) return r;
  }
  return ok2('add', a, b, NaN);
};
const sub = (a: number, b: number): number => {
  if (typeof a === 'number' && typeof b === 'number') {
    const r = a - b;
    if (r - r === 0) return r;
  }
  return ok2('sub', a, b, NaN);
};
const mul = (a: number, b: number): number => {
  if (typeof a === 'number' && typeof b === 'number') {
    const r = a * b;
    if (r - r === 0) return r;
  }
  return ok2('mul', a, b, NaN);
};

function finite(v: number, where: string): number {
  if (!Number.isFinite(v)) throw notFinite(where, `the result ${show(v)} is not finite`);
  return v;
}

/**
 * The float arithmetic: fast, rounding every operation to the nearest JS number.
 * NaN and ±Infinity are refused where values enter (`from`) and where they leave
 * (`toNumber`, `toString`, `toPrecision`); `div` refuses a zero divisor and `sqrt` a
 * negative argument; every operation called through this object refuses an operand that is
 * not a finite number (`INVALID_NUMBER`) and a result that is not (`NOT_FINITE`). The
 * float-specialised solvers of `quadspread/float` inline + − × for speed: there an overflow,
 * possible only with magnitudes near 1e308, is caught at the next division, root or
 * conversion, and the functions whose result is a bare sum, difference or product
 * (`quadrance`, `lineThrough`, the law residuals) check that result once. Text is read correctly rounded (`'1/3'` gives the
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
  // Called through the object (generic code, or a user), every operation checks its operands
  // are finite numbers and its result is finite: `'0.1' + '0.2'` is refused, not '0.10.2'. The
  // float-specialised quadspread/float inlines + − × in its solvers instead (checked where the
  // values enter and leave).
  add,
  sub,
  mul,
  div(a, b) {
    if (typeof a === 'number' && typeof b === 'number' && b - b === 0 && b !== 0) {
      const r = a / b;
      if (r - r === 0) return r; // then a was finite too
    }
    ok2('div', a, b, 0);
    if (b === 0) throw divisionByZero('float.div(a, b)', `b is zero (a = ${show(a)})`);
    const r = a / b;
    // Infinity/Infinity, NaN/x or an overflowing quotient: refuse rather than pass NaN on.
    if (r - r !== 0) throw notFinite('float.div(a, b)', `${show(a)} / ${show(b)} is not finite`);
    return r;
  },
  neg: (a) => -ok1('neg', a),
  abs: (a) => Math.abs(ok1('abs', a)),
  cmp(a, b) {
    if (!(typeof a === 'number' && typeof b === 'number' && a - a === 0 && b - b === 0))
      ok2('cmp', a, b, 0);
    return a < b ? -1 : a > b ? 1 : 0;
  },
  eq(a, b) {
    ok2('eq', a, b, 0);
    return a === b;
  },
  isZero: (a) => ok1('isZero', a) === 0,
  sign: (a) => (ok1('sign', a) < 0 ? -1 : a > 0 ? 1 : 0),
  sqrt(a) {
    if (ok1('sqrt', a) < 0) throw noRealSolution('float.sqrt(a)', `a = ${show(a)} is negative`);
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
  // (FDLIBM's kernels compiled in below π/4, Math.sin and Math.cos past it: float-trig.ts)
  sin: (x) => floatSin(ok1('sin', x)),
  cos: (x) => floatCos(ok1('cos', x)),
  atan2(y, x) {
    ok2('atan2', y, x, 0);
    if (y === 0 && x === 0) throw zeroVectorAngle('float.atan2(y, x)');
    return Math.atan2(y, x);
  },
  exp(x) {
    const r = Math.exp(ok1('exp', x));
    if (r === Infinity) throw notFinite('float.exp(x)', `e^${show(x)} overflows`);
    return r;
  },
  log(x) {
    if (!(ok1('log', x) > 0))
      throw noRealSolution('float.log(x)', `x = ${show(x)} is not positive`);
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
