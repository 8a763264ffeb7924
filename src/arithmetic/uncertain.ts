/**
 * The uncertain arithmetic: values that carry, beside their value in a base arithmetic,
 * a sparse first-order gradient over named inputs (forward-mode automatic
 * differentiation). Every solver written against {@link Arithmetic} propagates
 * uncertainty unchanged when handed `uncertain(base)`.
 *
 * @module arithmetic
 */
import {
  show,
  invalidArgument,
  invalidNumber,
  divisionByZero,
  noRealSolution,
  notFinite,
  zeroVectorAngle,
  checkArithmetic,
  notAValue,
} from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import { float } from './float.js';
import { floatCos, floatSin, floatSinCosInto } from './float-trig.js';

/**
 * A named input of an uncertain computation: its measured value and its standard
 * uncertainty, both in the base arithmetic and in the same units. Made by `measured`;
 * identified by object identity in gradients and by `name` in budgets.
 */
export interface UncertainInput<T> {
  /** The name that budgets and covariances use. */
  readonly name: string;
  /** The measured (estimated) value xᵢ. */
  readonly value: T;
  /** Its standard uncertainty u(xᵢ) ≥ 0, in the units of `value`. */
  readonly sigma: T;
}

/** A sparse gradient: ∂y/∂xᵢ for each input xᵢ the value depends on. */
export type Gradient<T> = ReadonlyMap<UncertainInput<T>, T>;

type Keys<T> = readonly UncertainInput<T>[];
const NO_KEYS: Keys<never> = /* @__PURE__ */ Object.freeze([]);
const NO_DERIVS: readonly never[] = /* @__PURE__ */ Object.freeze([]);
/** sin and cos of the value in `sin`/`cos` of the uncertain arithmetic over float (read at once). */
const SIN_COS = /* @__PURE__ */ new Float64Array(2);

/**
 * A value of an {@link uncertain} arithmetic: a value in the base arithmetic and its
 * first-order gradient over the named inputs it was computed from. Immutable.
 *
 * The gradient is kept as two small parallel arrays (inputs, derivatives); values computed
 * from the same inputs share one inputs array, so most operations are plain loops.
 *
 * @example
 * ```ts
 * import { uncertain, float, measured } from 'quadspread';
 * const U = uncertain(float);
 * const y = U.add(measured(U, 2, 0.1, 'a'), U.from(1));
 * [y.value, [...y.gradient].map(([input, d]) => [input.name, d])];
 * //=> [3, [['a', 1]]]
 * ```
 */
export class Uncertain<T> {
  /** The value y in the base arithmetic. */
  readonly value: T;
  /** @internal the inputs (see {@link gradient} for their order); shared between values, never mutated */
  readonly inputs: readonly UncertainInput<T>[];
  /** @internal ∂y/∂inputs[i] */
  readonly derivatives: readonly T[];
  #map: Gradient<T> | undefined;

  /**
   * @param value the value in the base arithmetic
   * @param inputs the inputs it depends on (not copied: never mutate it afterwards)
   * @param derivatives ∂value/∂inputs[i], same length (not copied)
   */
  constructor(
    value: T,
    inputs: readonly UncertainInput<T>[] = NO_KEYS as Keys<T>,
    derivatives: readonly T[] = NO_DERIVS as readonly T[],
  ) {
    this.value = value;
    this.inputs = inputs;
    this.derivatives = derivatives;
    this.#map = undefined;
  }

  /**
   * ∂y/∂xᵢ for each input the value depends on (empty for constants). An operation's result
   * lists the inputs of its operand with more of them (the first operand's on a tie) in that
   * operand's order, then the other operand's inputs not among them, in their order.
   */
  get gradient(): Gradient<T> {
    if (this.#map === undefined) {
      const m = new Map<UncertainInput<T>, T>();
      for (let i = 0; i < this.inputs.length; i++)
        m.set(this.inputs[i] as UncertainInput<T>, this.derivatives[i] as T);
      this.#map = m;
    }
    return this.#map;
  }

  /** `String(value)`, for debugging; `U.toString(x)` gives the arithmetic's own text of the value. */
  toString(): string {
    return String(this.value);
  }
}

/**
 * The type of an {@link uncertain} arithmetic: an {@link Arithmetic} over
 * {@link Uncertain} values, exact exactly when its base is.
 */
export interface UncertainArithmetic<T, E extends boolean = boolean> extends Arithmetic<
  Uncertain<T>,
  E
> {
  /** The arithmetic values and derivatives are computed in. */
  readonly base: Arithmetic<T, E>;
  /**
   * A value with the given gradient (for building inputs; `measured` is the usual way).
   * @param value the value, read by the base arithmetic
   * @param gradient partial derivatives (copied)
   */
  make(value: Numeric<T>, gradient?: Gradient<T>): Uncertain<T>;
}

/** Position of `k` in `keys`, or −1. Linear: gradients are short. */
function indexOf<T>(keys: Keys<T>, k: UncertainInput<T>): number {
  for (let i = 0; i < keys.length; i++) if (keys[i] === k) return i;
  return -1;
}

/**
 * How many inputs `a` and `b` have in the same places from the start: results take the
 * fuller operand's list, or extend it, so related values' lists share a beginning.
 */
function sharedStart<T>(a: Keys<T>, b: Keys<T>): number {
  const n = b.length < a.length ? b.length : a.length;
  let p = 0;
  while (p < n && a[p] === b[p]) p++;
  return p;
}

/**
 * The union of two input lists as `b`'s positions in it: `a`'s inputs, then `b`'s that are
 * not among them. `b[0..p)` are known to be `a[0..p)` (see {@link sharedStart}).
 */
function union<T>(a: Keys<T>, b: Keys<T>, p: number): { keys: Keys<T>; where: number[] } {
  const where = new Array<number>(b.length);
  for (let j = 0; j < p; j++) where[j] = j;
  let keys: UncertainInput<T>[] | undefined;
  const big = a.length * b.length > 256;
  const index = big ? new Map(a.map((k, i) => [k, i] as const)) : undefined;
  for (let j = p; j < b.length; j++) {
    const k = b[j] as UncertainInput<T>;
    let i = index ? (index.get(k) ?? -1) : indexOf(a, k);
    if (i < 0) {
      // new to `a` (b's inputs are distinct, so it was not added before either)
      keys ??= a.slice();
      i = keys.length;
      keys.push(k);
      index?.set(k, i);
    }
    where[j] = i;
  }
  return { keys: keys ?? a, where };
}

/**
 * Where each of `small`'s inputs sits in `big`, or `undefined` when one of them is not there;
 * `small[0..p)` are known to be `big[0..p)`. When it gives positions, a result of operands
 * with these lists takes `big` itself as its inputs, so the values of a computation come to
 * share one array (and later operations between them are plain loops) instead of each
 * holding the inputs in its own order.
 */
function within<T>(big: Keys<T>, small: Keys<T>, p: number): number[] | undefined {
  const where = new Array<number>(small.length);
  for (let j = 0; j < p; j++) where[j] = j;
  const index =
    big.length * small.length > 256 ? new Map(big.map((k, i) => [k, i] as const)) : undefined;
  for (let j = p; j < small.length; j++) {
    const k = small[j] as UncertainInput<T>;
    const i = index ? (index.get(k) ?? -1) : indexOf(big, k);
    if (i < 0) return undefined;
    where[j] = i;
  }
  return where;
}

function fromMap<T>(
  B: Arithmetic<T>,
  value: T,
  g: Gradient<T> | undefined,
  name: string,
): Uncertain<T> {
  if (g === undefined) return new Uncertain(value);
  if (!(g instanceof Map))
    throw invalidArgument(
      `${name}.make(value, gradient)`,
      `the gradient ${show(g)} is not a Map from inputs to derivatives`,
    );
  if (g.size === 0) return new Uncertain(value);
  const keys: UncertainInput<T>[] = [];
  const ders: T[] = [];
  for (const [k, v] of g) {
    keys.push(k);
    ders.push(B.from(v));
  }
  return new Uncertain(value, keys, ders);
}

/**
 * An arithmetic whose values carry a first-order gradient over named inputs, computed in
 * `base` (`float`, `decimal(n)` or `rational`). Each operation applies the ordinary rules
 * of differentiation (sum, product, quotient, chain rule) to the gradients, so a solver
 * run in `uncertain(base)` returns its result together with ∂result/∂input for every
 * input made by `measured`; `budget` then gives the uncertainty (GUM, JCGM 100:2008 §5.1.2).
 *
 * Comparisons (`cmp`, `eq`, `isZero`, `sign`) and output (`toNumber`, `toString`,
 * `toPrecision`) look at the value only. Constants (from numbers, text, `zero`, `one`,
 * `pi`) have empty gradients.
 *
 * Where the value has no derivative the arithmetic refuses rather than guess:
 * - `sqrt(a)` with a = 0 and a non-empty gradient throws `NOT_FINITE` (the derivative
 *   1/(2√a) is infinite; first order does not apply — use a Monte Carlo check).
 * - Over an exact base, `sqrt(a)` is `undefined` where the base has no exact root (as for
 *   the base itself), so solvers take their surd path; where the root exists its
 *   derivative 1/(2√a) is exact too.
 * - `abs(a)` at a = 0 keeps the gradient (the derivative from the right).
 *
 * Over `float` a specialised copy with plain number operations is returned (same results,
 * bit for bit). Gradients are small arrays; values computed from the same inputs share one
 * inputs array, so an operation costs one loop over the inputs.
 *
 * @param base the arithmetic of values and derivatives
 * @returns the uncertain arithmetic, named `uncertain(<base name>)`
 * @throws {QuadspreadError} never itself; its operations throw as described above
 *   (`NO_REAL_SOLUTION` for √ of a negative value, `NOT_FINITE`, `DIVISION_BY_ZERO`,
 *   `INVALID_ARGUMENT` for atan2(0, 0), `INVALID_NUMBER` from `from`).
 * @example
 * ```ts
 * import { uncertain, float } from 'quadspread';
 * const U = uncertain(float);
 * const x = U.make(3, new Map([[{ name: 'x', value: 3, sigma: 0.1 }, 1]]));
 * const y = U.mul(x, x); // y = x², dy/dx = 2x = 6
 * [y.value, [...y.gradient.values()][0]];
 * //=> [9, 6]
 * ```
 */
export function uncertain<T, E extends boolean>(base: Arithmetic<T, E>): UncertainArithmetic<T, E> {
  checkArithmetic(base, 'uncertain');
  // The float twin checks its hot operations' operands itself (see uncertainFloat).
  return base === (float as unknown)
    ? (uncertainFloat() as unknown as UncertainArithmetic<T, E>)
    : withOperandChecks(uncertainGeneric(base));
}

const OPERATIONS = [
  'add',
  'sub',
  'mul',
  'div',
  'neg',
  'abs',
  'cmp',
  'eq',
  'isZero',
  'sign',
  'sqrt',
  'toNumber',
  'toString',
  'toPrecision',
  'sin',
  'cos',
  'atan2',
  'exp',
  'log',
] as const;

/**
 * The operations of `U` refusing an operand that is not an uncertain value of `U`
 * (`INVALID_NUMBER` naming the operation) before they read it.
 */
function withOperandChecks<T, E extends boolean>(
  U: UncertainArithmetic<T, E>,
): UncertainArithmetic<T, E> {
  const out = { ...U } as Record<string, unknown>;
  for (const op of OPERATIONS) {
    const f = U[op] as ((...a: unknown[]) => unknown) | undefined;
    if (typeof f !== 'function') continue;
    const arity = op === 'toPrecision' ? 1 : f.length;
    // An Uncertain of this kind; its value is the base arithmetic's to check (an overflow met
    // earlier is NOT_FINITE there, not a wrong operand). Every operation takes at most two
    // arguments: written out, without rest and spread, the check costs V8 next to nothing.
    out[op] =
      arity === 1
        ? (a: unknown, b: unknown) => {
            if (!(a instanceof Uncertain)) throw notAValue(U.name, op, a);
            return f(a, b);
          }
        : (a: unknown, b: unknown) => {
            if (!(a instanceof Uncertain)) throw notAValue(U.name, op, a);
            if (!(b instanceof Uncertain)) throw notAValue(U.name, op, b);
            return f(a, b);
          };
  }
  return out as unknown as UncertainArithmetic<T, E>;
}

const SQRT_AT_ZERO =
  'a = 0 depends on uncertain inputs: the derivative of √a there is infinite, so first-order propagation does not apply';

/**
 * ca·∇a + cb·∇b over the union of inputs; `undefined` coefficients mean 1. The operand with
 * the longer list of inputs leads (its list is the result's, or the start of it), so the
 * values of a computation come to share one list, or lists that begin with the same inputs.
 */
function lin<T>(
  B: Arithmetic<T>,
  value: T,
  a: Uncertain<T>,
  ca: T | undefined,
  b: Uncertain<T>,
  cb: T | undefined,
): Uncertain<T> {
  if (a.inputs.length < b.inputs.length) return linFuller(B, value, b, cb, a, ca);
  return linFuller(B, value, a, ca, b, cb);
}

/** {@link lin} with `a` the operand whose inputs list is at least as long as `b`'s. */
function linFuller<T>(
  B: Arithmetic<T>,
  value: T,
  a: Uncertain<T>,
  ca: T | undefined,
  b: Uncertain<T>,
  cb: T | undefined,
): Uncertain<T> {
  const na = a.inputs.length;
  const nb = b.inputs.length;
  if (nb === 0) return scaled(B, value, a, ca);
  const ka = a.inputs;
  const kb = b.inputs;
  const da = a.derivatives;
  const db = b.derivatives;
  const p = sharedStart(ka, kb);
  const inA = p === nb ? undefined : within(ka, kb, p);
  if (p === nb || inA !== undefined) {
    // every input of `b` is one of `a`'s: the result takes `a`'s list
    const d = new Array<T>(na);
    for (let i = 0; i < na; i++) d[i] = ca === undefined ? (da[i] as T) : B.mul(ca, da[i] as T);
    for (let j = 0; j < nb; j++) {
      const y = cb === undefined ? (db[j] as T) : B.mul(cb, db[j] as T);
      const i = inA === undefined ? j : (inA[j] as number);
      d[i] = B.add(d[i] as T, y);
    }
    return new Uncertain(value, ka, d);
  }
  const { keys, where } = union(ka, kb, p);
  const d = new Array<T>(keys.length);
  for (let i = 0; i < na; i++) d[i] = ca === undefined ? (da[i] as T) : B.mul(ca, da[i] as T);
  for (let j = 0; j < nb; j++) {
    const y = cb === undefined ? (db[j] as T) : B.mul(cb, db[j] as T);
    const i = where[j] as number;
    d[i] = i < na ? B.add(d[i] as T, y) : y;
  }
  return new Uncertain(value, keys, d);
}

/** c·∇a (`undefined` means 1: the arrays are shared). */
function scaled<T>(B: Arithmetic<T>, value: T, a: Uncertain<T>, c: T | undefined): Uncertain<T> {
  const n = a.inputs.length;
  if (c === undefined || n === 0) return new Uncertain(value, a.inputs, a.derivatives);
  const d = new Array<T>(n);
  for (let i = 0; i < n; i++) d[i] = B.mul(c, a.derivatives[i] as T);
  return new Uncertain(value, a.inputs, d);
}

function uncertainGeneric<T, E extends boolean>(B: Arithmetic<T, E>): UncertainArithmetic<T, E> {
  const name = `uncertain(${B.name})`;
  const two = B.from(2);
  const minusOne = B.neg(B.one);
  const constant = (v: T) => new Uncertain(v);
  const isU = (x: unknown): x is Uncertain<T> => x instanceof Uncertain && B.is(x.value);
  const U: UncertainArithmetic<T, E> = {
    name,
    exact: B.exact,
    digits: B.digits,
    base: B,
    zero: constant(B.zero),
    one: constant(B.one),
    make(value, gradient) {
      return fromMap(B, B.from(value), gradient, name);
    },
    from(x: Numeric<Uncertain<T>>): Uncertain<T> {
      if (isU(x)) return x;
      if ((x as unknown) instanceof Uncertain) {
        throw invalidNumber(
          `${name}.from(x)`,
          `${show((x as unknown as Uncertain<unknown>).value)} is a value of another uncertain arithmetic`,
        );
      }
      return constant(B.from(x as Numeric<T>));
    },
    is: isU,
    add: (a, b) => lin(B, B.add(a.value, b.value), a, undefined, b, undefined),
    sub: (a, b) => lin(B, B.sub(a.value, b.value), a, undefined, b, minusOne),
    // d(ab) = b·da + a·db
    mul: (a, b) => lin(B, B.mul(a.value, b.value), a, b.value, b, a.value),
    div(a, b) {
      if (B.isZero(b.value)) {
        throw divisionByZero(`${name}.div(a, b)`, `b is zero (a = ${B.toString(a.value)})`);
      }
      // d(a/b) = (da − q·db)/b with q = a/b
      const q = B.div(a.value, b.value);
      const r = B.div(B.one, b.value);
      return lin(B, q, a, r, b, B.neg(B.mul(q, r)));
    },
    neg: (a) => scaled(B, B.neg(a.value), a, minusOne),
    abs: (a) => (B.sign(a.value) < 0 ? U.neg(a) : a),
    cmp: (a, b) => B.cmp(a.value, b.value),
    eq: (a, b) => B.eq(a.value, b.value),
    isZero: (a) => B.isZero(a.value),
    sign: (a) => B.sign(a.value),
    sqrt(a) {
      if (B.sign(a.value) < 0) {
        throw noRealSolution(`${name}.sqrt(a)`, `a = ${B.toString(a.value)} is negative`);
      }
      const r = B.sqrt(a.value);
      if (r === undefined) return undefined;
      if (a.inputs.length === 0) return constant(r);
      if (B.isZero(r)) {
        throw notFinite(`${name}.sqrt(a)`, SQRT_AT_ZERO);
      }
      // d√a = da/(2√a)
      return scaled(B, r, a, B.div(B.one, B.mul(two, r)));
    },
    toNumber: (a) => B.toNumber(a.value),
    toString: (a) => B.toString(a.value),
    toPrecision: (a, digits) => B.toPrecision(a.value, digits),
    get pi() {
      return constant(B.pi);
    },
    // d sin x = cos x dx
    sin: (x) =>
      x.inputs.length === 0
        ? constant(B.sin(x.value))
        : scaled(B, B.sin(x.value), x, B.cos(x.value)),
    // d cos x = −sin x dx
    cos: (x) =>
      x.inputs.length === 0
        ? constant(B.cos(x.value))
        : scaled(B, B.cos(x.value), x, B.neg(B.sin(x.value))),
    atan2(y, x) {
      if (B.isZero(y.value) && B.isZero(x.value)) {
        throw zeroVectorAngle(`${name}.atan2(y, x)`);
      }
      const v = B.atan2(y.value, x.value);
      if (y.inputs.length === 0 && x.inputs.length === 0) return constant(v);
      // d atan2(y, x) = (x·dy − y·dx)/(x² + y²)
      const d = B.add(B.mul(x.value, x.value), B.mul(y.value, y.value));
      return lin(B, v, y, B.div(x.value, d), x, B.neg(B.div(y.value, d)));
    },
    // d e^x = e^x dx
    exp(x) {
      const v = B.exp(x.value);
      return x.inputs.length === 0 ? constant(v) : scaled(B, v, x, v);
    },
    // d ln x = dx/x
    log(x) {
      const v = B.log(x.value);
      return x.inputs.length === 0 ? constant(v) : scaled(B, v, x, B.div(B.one, x.value));
    },
  };
  return U;
}

/**
 * ca·∇a + cb·∇b over float gradients (the same steps as {@link lin}). Operands sharing one
 * inputs array, the usual case, take this short loop (small enough for V8 to inline);
 * the rest go to {@link linApartF}.
 */
function linF(
  value: number,
  a: Uncertain<number>,
  ca: number,
  b: Uncertain<number>,
  cb: number,
): Uncertain<number> {
  const keys = a.inputs;
  const n = keys.length;
  if (keys !== b.inputs || n === 0) return linApartF(value, a, ca, b, cb);
  const da = a.derivatives;
  const db = b.derivatives;
  const d = new Array<number>(n);
  // z stays 0 unless a derivative overflowed (∞·0 and NaN·0 are NaN): one check per operation.
  let z = 0;
  for (let i = 0; i < n; i++) {
    const x = ca * (da[i] as number) + cb * (db[i] as number);
    d[i] = x;
    z += x * 0;
  }
  return finiteGradient(new Uncertain(value, keys, d), z);
}

/**
 * {@link linF} for operands with different inputs arrays (or none): the operand with the
 * longer list leads, as in {@link lin}.
 */
function linApartF(
  value: number,
  a: Uncertain<number>,
  ca: number,
  b: Uncertain<number>,
  cb: number,
): Uncertain<number> {
  if (a.inputs.length < b.inputs.length) return linFullerF(value, b, cb, a, ca);
  return linFullerF(value, a, ca, b, cb);
}

/** {@link linApartF} with `a` the operand whose list is at least as long as `b`'s. */
function linFullerF(
  value: number,
  a: Uncertain<number>,
  ca: number,
  b: Uncertain<number>,
  cb: number,
): Uncertain<number> {
  const ka = a.inputs;
  const kb = b.inputs;
  const na = ka.length;
  const nb = kb.length;
  if (nb === 0) return scaledF(value, a, ca);
  const da = a.derivatives;
  const db = b.derivatives;
  const p = sharedStart(ka, kb);
  let z = 0;
  if (p === nb) {
    // `b`'s list is the start of `a`'s: the result takes `a`'s, position for position
    const d = new Array<number>(na);
    for (let i = 0; i < nb; i++) {
      const x = ca * (da[i] as number) + cb * (db[i] as number);
      d[i] = x;
      z += x * 0;
    }
    for (let i = nb; i < na; i++) {
      const x = ca * (da[i] as number);
      d[i] = x;
      z += x * 0;
    }
    return finiteGradient(new Uncertain(value, ka, d), z);
  }
  const inA = within(ka, kb, p);
  if (inA !== undefined) {
    const d = new Array<number>(na);
    for (let i = 0; i < na; i++) d[i] = ca * (da[i] as number);
    for (let j = 0; j < nb; j++) {
      const i = inA[j] as number;
      d[i] = (d[i] as number) + cb * (db[j] as number);
    }
    for (let i = 0; i < na; i++) z += (d[i] as number) * 0;
    return finiteGradient(new Uncertain(value, ka, d), z);
  }
  const { keys, where } = union(ka, kb, p);
  const d = new Array<number>(keys.length);
  for (let i = 0; i < na; i++) d[i] = ca * (da[i] as number);
  for (let j = 0; j < nb; j++) {
    const y = cb * (db[j] as number);
    const i = where[j] as number;
    d[i] = i < na ? (d[i] as number) + y : y;
  }
  for (let i = 0; i < d.length; i++) z += (d[i] as number) * 0;
  return finiteGradient(new Uncertain(value, keys, d), z);
}

function scaledF(value: number, a: Uncertain<number>, c: number): Uncertain<number> {
  const n = a.inputs.length;
  if (c === 1 || n === 0) return new Uncertain(value, a.inputs, a.derivatives);
  const d = new Array<number>(n);
  let z = 0;
  for (let i = 0; i < n; i++) {
    const x = c * (a.derivatives[i] as number);
    d[i] = x;
    z += x * 0;
  }
  return finiteGradient(new Uncertain(value, a.inputs, d), z);
}

/** `u`, or NOT_FINITE when a derivative overflowed (`z` is 0 exactly when all are finite). */
function finiteGradient(u: Uncertain<number>, z: number): Uncertain<number> {
  if (z !== 0)
    throw notFinite(
      'uncertain(float)',
      `a derivative of the result ${show(u.value)} is not finite (overflow): use uncertain(decimal(n)) for values this large`,
    );
  return u;
}

/** Refuses an operand that is not an uncertain value, as {@link withOperandChecks} does. */
function operand(name: string, op: string, x: unknown): void {
  if (!(x instanceof Uncertain)) throw notAValue(name, op, x);
}

/**
 * The float twin of {@link uncertainGeneric}: the same rules with plain number operations for
 * everything a solver does in its loops (arithmetic, comparisons, √, sin, cos); the rest
 * (`make`, `is`, output, `pi`, `atan2`) is the generic arithmetic's own, with the operand
 * checks of {@link withOperandChecks}. The twin's own operations check their operands
 * themselves, in the same order and with the same error: one shared wrapper calling each of
 * them would be a call site with a dozen targets, which V8 does not inline through.
 */
function uncertainFloat(): UncertainArithmetic<number, false> {
  const G = withOperandChecks(uncertainGeneric(float));
  const name = G.name;
  type V = Uncertain<number>;
  const constant = (v: number) => new Uncertain(v);
  const U: UncertainArithmetic<number, false> = {
    ...G,
    from(x: Numeric<V>): V {
      if (G.is(x)) return x;
      if ((x as unknown) instanceof Uncertain) {
        const v = (x as unknown as Uncertain<unknown>).value;
        if (typeof v === 'number')
          throw notFinite(`${name}.from(x)`, `the value ${show(v)} is not finite (overflow)`);
        throw invalidNumber(
          `${name}.from(x)`,
          `${show(v)} is a value of another uncertain arithmetic`,
        );
      }
      return constant(float.from(x as Numeric<number>));
    },
    add(a, b) {
      operand(name, 'add', a);
      operand(name, 'add', b);
      return linF(a.value + b.value, a, 1, b, 1);
    },
    sub(a, b) {
      operand(name, 'sub', a);
      operand(name, 'sub', b);
      return linF(a.value - b.value, a, 1, b, -1);
    },
    mul(a, b) {
      operand(name, 'mul', a);
      operand(name, 'mul', b);
      return linF(a.value * b.value, a, b.value, b, a.value);
    },
    div(a, b) {
      operand(name, 'div', a);
      operand(name, 'div', b);
      if (b.value === 0)
        throw divisionByZero(`${name}.div(a, b)`, `b is zero (a = ${show(a.value)})`);
      const q = a.value / b.value;
      // as float.div: a quotient that is not finite is refused
      if (q - q !== 0)
        throw notFinite(`${name}.div(a, b)`, `${show(a.value)} / ${show(b.value)} is not finite`);
      const r = 1 / b.value;
      return linF(q, a, r, b, -(q * r));
    },
    neg(a) {
      operand(name, 'neg', a);
      return scaledF(-a.value, a, -1);
    },
    abs(a) {
      operand(name, 'abs', a);
      return a.value < 0 ? U.neg(a) : a;
    },
    cmp(a, b) {
      operand(name, 'cmp', a);
      operand(name, 'cmp', b);
      return a.value < b.value ? -1 : a.value > b.value ? 1 : 0;
    },
    eq(a, b) {
      operand(name, 'eq', a);
      operand(name, 'eq', b);
      return a.value === b.value;
    },
    isZero(a) {
      operand(name, 'isZero', a);
      return a.value === 0;
    },
    sign(a) {
      operand(name, 'sign', a);
      return a.value < 0 ? -1 : a.value > 0 ? 1 : 0;
    },
    sqrt(a) {
      operand(name, 'sqrt', a);
      if (a.value < 0) throw noRealSolution(`${name}.sqrt(a)`, `a = ${show(a.value)} is negative`);
      const r = Math.sqrt(a.value);
      if (r - r !== 0) throw notFinite(`${name}.sqrt(a)`, `a = ${show(a.value)} is not finite`);
      if (a.inputs.length === 0) return constant(r);
      if (r === 0) throw notFinite(`${name}.sqrt(a)`, SQRT_AT_ZERO);
      return scaledF(r, a, 1 / (2 * r));
    },
    sin(x) {
      operand(name, 'sin', x);
      if (x.inputs.length === 0) return constant(floatSin(x.value));
      floatSinCosInto(x.value, SIN_COS, 0);
      return scaledF(SIN_COS[0]!, x, SIN_COS[1]!);
    },
    cos(x) {
      operand(name, 'cos', x);
      if (x.inputs.length === 0) return constant(floatCos(x.value));
      floatSinCosInto(x.value, SIN_COS, 0);
      return scaledF(SIN_COS[1]!, x, -SIN_COS[0]!);
    },
    exp(x) {
      operand(name, 'exp', x);
      const v = float.exp(x.value);
      return x.inputs.length === 0 ? constant(v) : scaledF(v, x, v);
    },
    log(x) {
      operand(name, 'log', x);
      const v = float.log(x.value);
      return x.inputs.length === 0 ? constant(v) : scaledF(v, x, 1 / x.value);
    },
  };
  return U;
}
