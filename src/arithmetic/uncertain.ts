/**
 * The uncertain arithmetic: values that carry, beside their value in a base arithmetic,
 * a sparse first-order gradient over named inputs (forward-mode automatic
 * differentiation). Every solver written against {@link Arithmetic} propagates
 * uncertainty unchanged when handed `uncertain(base)`.
 *
 * @module arithmetic
 */
import { QuadspreadError, show } from '../errors.js';
import type { Arithmetic, Numeric } from './types.js';
import { float } from './float.js';

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

const EMPTY: Gradient<never> = new Map<UncertainInput<never>, never>();

/**
 * A value of an {@link uncertain} arithmetic: a value in the base arithmetic and its
 * first-order gradient over the named inputs it was computed from. Immutable.
 */
export class Uncertain<T> {
  /** The value y in the base arithmetic. */
  readonly value: T;
  /** ∂y/∂xᵢ for each input the value depends on (empty for constants). */
  readonly gradient: Gradient<T>;

  /**
   * @param value the value in the base arithmetic
   * @param gradient the partial derivatives; not copied, so never mutate it afterwards
   */
  constructor(value: T, gradient: Gradient<T> = EMPTY as Gradient<T>) {
    this.value = value;
    this.gradient = gradient;
  }

  /** Text of the value alone (`uncertain.toString` does the same). */
  toString(): string {
    return String(this.value);
  }
}

/**
 * The type of an {@link uncertain} arithmetic: an {@link Arithmetic} over
 * {@link Uncertain} values, exact exactly when its base is.
 */
export interface UncertainArithmetic<T, E extends boolean = boolean> extends Arithmetic<Uncertain<T>, E> {
  /** The arithmetic values and derivatives are computed in. */
  readonly base: Arithmetic<T, E>;
  /**
   * A value with the given gradient (for building inputs; `measured` is the usual way).
   * @param value the value, read by the base arithmetic
   * @param gradient partial derivatives, not copied
   */
  make(value: Numeric<T>, gradient?: Gradient<T>): Uncertain<T>;
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
 * Over `float` a specialised copy with plain number operations is returned (same results).
 *
 * @param base the arithmetic of values and derivatives
 * @returns the uncertain arithmetic, named `uncertain(<base name>)`
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
  if (base === (float as unknown)) return uncertainFloat() as unknown as UncertainArithmetic<T, E>;
  return uncertainGeneric(base);
}

/** Σ ca·ga + cb·gb over the union of keys; `undefined` coefficients mean 1. */
function combine<T>(B: Arithmetic<T>, ga: Gradient<T>, ca: T | undefined, gb: Gradient<T>, cb: T | undefined): Gradient<T> {
  if (gb.size === 0) return scale(B, ga, ca);
  if (ga.size === 0) return scale(B, gb, cb);
  const out = new Map<UncertainInput<T>, T>();
  for (const [k, v] of ga) out.set(k, ca === undefined ? v : B.mul(ca, v));
  for (const [k, v] of gb) {
    const w = cb === undefined ? v : B.mul(cb, v);
    const prev = out.get(k);
    out.set(k, prev === undefined ? w : B.add(prev, w));
  }
  return out;
}

function scale<T>(B: Arithmetic<T>, g: Gradient<T>, c: T | undefined): Gradient<T> {
  if (c === undefined || g.size === 0) return g;
  const out = new Map<UncertainInput<T>, T>();
  for (const [k, v] of g) out.set(k, B.mul(c, v));
  return out;
}

function uncertainGeneric<T, E extends boolean>(B: Arithmetic<T, E>): UncertainArithmetic<T, E> {
  const name = `uncertain(${B.name})`;
  const two = B.from(2);
  const constant = (v: T) => new Uncertain(v);
  const isU = (x: unknown): x is Uncertain<T> => x instanceof Uncertain && B.is(x.value);
  const U: UncertainArithmetic<T, E> = {
    name,
    exact: B.exact,
    base: B,
    zero: constant(B.zero),
    one: constant(B.one),
    make(value, gradient) {
      return new Uncertain(B.from(value), gradient ?? (EMPTY as Gradient<T>));
    },
    from(x: Numeric<Uncertain<T>>): Uncertain<T> {
      if (isU(x)) return x;
      if ((x as unknown) instanceof Uncertain) {
        throw new QuadspreadError('INVALID_NUMBER', `${name}.from(x)`, `${show((x as unknown as Uncertain<unknown>).value)} is a value of another uncertain arithmetic`);
      }
      return constant(B.from(x as Numeric<T>));
    },
    is: isU,
    add: (a, b) => new Uncertain(B.add(a.value, b.value), combine(B, a.gradient, undefined, b.gradient, undefined)),
    sub: (a, b) => new Uncertain(B.sub(a.value, b.value), combine(B, a.gradient, undefined, b.gradient, B.neg(B.one))),
    // d(ab) = b·da + a·db
    mul: (a, b) => new Uncertain(B.mul(a.value, b.value), combine(B, a.gradient, b.value, b.gradient, a.value)),
    div(a, b) {
      if (B.isZero(b.value)) {
        throw new QuadspreadError('DIVISION_BY_ZERO', `${name}.div(a, b)`, `b is zero (a = ${B.toString(a.value)})`);
      }
      // d(a/b) = (da − q·db)/b with q = a/b
      const q = B.div(a.value, b.value);
      const r = B.div(B.one, b.value);
      return new Uncertain(q, combine(B, a.gradient, r, b.gradient, B.neg(B.mul(q, r))));
    },
    neg: (a) => new Uncertain(B.neg(a.value), scale(B, a.gradient, B.neg(B.one))),
    abs: (a) => (B.sign(a.value) < 0 ? U.neg(a) : a),
    cmp: (a, b) => B.cmp(a.value, b.value),
    eq: (a, b) => B.eq(a.value, b.value),
    isZero: (a) => B.isZero(a.value),
    sign: (a) => B.sign(a.value),
    sqrt(a) {
      if (B.sign(a.value) < 0) {
        throw new QuadspreadError('NO_REAL_SOLUTION', `${name}.sqrt(a)`, `a = ${B.toString(a.value)} is negative`);
      }
      const r = B.sqrt(a.value);
      if (r === undefined) return undefined;
      if (a.gradient.size === 0) return constant(r);
      if (B.isZero(r)) {
        throw new QuadspreadError('NOT_FINITE', `${name}.sqrt(a)`, 'a = 0 depends on uncertain inputs: the derivative of √a there is infinite, so first-order propagation does not apply');
      }
      // d√a = da/(2√a)
      return new Uncertain(r, scale(B, a.gradient, B.div(B.one, B.mul(two, r))));
    },
    toNumber: (a) => B.toNumber(a.value),
    toString: (a) => B.toString(a.value),
    toPrecision: (a, digits) => B.toPrecision(a.value, digits),
    get pi() {
      return constant(B.pi);
    },
    // d sin x = cos x dx
    sin: (x) => new Uncertain(B.sin(x.value), x.gradient.size === 0 ? x.gradient : scale(B, x.gradient, B.cos(x.value))),
    // d cos x = −sin x dx
    cos: (x) => new Uncertain(B.cos(x.value), x.gradient.size === 0 ? x.gradient : scale(B, x.gradient, B.neg(B.sin(x.value)))),
    atan2(y, x) {
      if (B.isZero(y.value) && B.isZero(x.value)) {
        throw new QuadspreadError('INVALID_ARGUMENT', `${name}.atan2(y, x)`, 'the angle of the zero vector is undefined');
      }
      const v = B.atan2(y.value, x.value);
      if (y.gradient.size === 0 && x.gradient.size === 0) return constant(v);
      // d atan2(y, x) = (x·dy − y·dx)/(x² + y²)
      const d = B.add(B.mul(x.value, x.value), B.mul(y.value, y.value));
      return new Uncertain(v, combine(B, y.gradient, B.div(x.value, d), x.gradient, B.neg(B.div(y.value, d))));
    },
  };
  return U;
}

/** Σ ca·ga + cb·gb over float gradients. */
function combineF(ga: Gradient<number>, ca: number, gb: Gradient<number>, cb: number): Gradient<number> {
  if (gb.size === 0) return scaleF(ga, ca);
  if (ga.size === 0) return scaleF(gb, cb);
  const out = new Map<UncertainInput<number>, number>();
  for (const [k, v] of ga) out.set(k, ca * v);
  for (const [k, v] of gb) {
    const prev = out.get(k);
    out.set(k, prev === undefined ? cb * v : prev + cb * v);
  }
  return out;
}

function scaleF(g: Gradient<number>, c: number): Gradient<number> {
  if (c === 1 || g.size === 0) return g;
  const out = new Map<UncertainInput<number>, number>();
  for (const [k, v] of g) out.set(k, c * v);
  return out;
}

/** The float twin of {@link uncertainGeneric}: the same rules with plain number operations. */
function uncertainFloat(): UncertainArithmetic<number, false> {
  const name = 'uncertain(float)';
  type V = Uncertain<number>;
  const constant = (v: number) => new Uncertain(v);
  const isU = (x: unknown): x is V => x instanceof Uncertain && float.is(x.value);
  const fin = (v: number, where: string): number => {
    if (v - v !== 0) throw new QuadspreadError('NOT_FINITE', `${name}.${where}`, `the result ${show(v)} is not finite`);
    return v;
  };
  const U: UncertainArithmetic<number, false> = {
    name,
    exact: false,
    base: float,
    zero: constant(0),
    one: constant(1),
    make(value, gradient) {
      return new Uncertain(float.from(value), gradient ?? (EMPTY as Gradient<number>));
    },
    from(x: Numeric<V>): V {
      if (isU(x)) return x;
      if ((x as unknown) instanceof Uncertain) {
        throw new QuadspreadError('INVALID_NUMBER', `${name}.from(x)`, `${show((x as unknown as Uncertain<unknown>).value)} is a value of another uncertain arithmetic`);
      }
      return constant(float.from(x as Numeric<number>));
    },
    is: isU,
    add: (a, b) => new Uncertain(a.value + b.value, combineF(a.gradient, 1, b.gradient, 1)),
    sub: (a, b) => new Uncertain(a.value - b.value, combineF(a.gradient, 1, b.gradient, -1)),
    mul: (a, b) => new Uncertain(a.value * b.value, combineF(a.gradient, b.value, b.gradient, a.value)),
    div(a, b) {
      if (b.value === 0) throw new QuadspreadError('DIVISION_BY_ZERO', `${name}.div(a, b)`, `b is zero (a = ${show(a.value)})`);
      const q = a.value / b.value;
      const r = 1 / b.value;
      return new Uncertain(q, combineF(a.gradient, r, b.gradient, -(q * r)));
    },
    neg: (a) => new Uncertain(-a.value, scaleF(a.gradient, -1)),
    abs: (a) => (a.value < 0 ? U.neg(a) : a),
    cmp: (a, b) => (a.value < b.value ? -1 : a.value > b.value ? 1 : 0),
    eq: (a, b) => a.value === b.value,
    isZero: (a) => a.value === 0,
    sign: (a) => (a.value < 0 ? -1 : a.value > 0 ? 1 : 0),
    sqrt(a) {
      if (a.value < 0) throw new QuadspreadError('NO_REAL_SOLUTION', `${name}.sqrt(a)`, `a = ${show(a.value)} is negative`);
      const r = Math.sqrt(a.value);
      if (a.gradient.size === 0) return constant(r);
      if (r === 0) {
        throw new QuadspreadError('NOT_FINITE', `${name}.sqrt(a)`, 'a = 0 depends on uncertain inputs: the derivative of √a there is infinite, so first-order propagation does not apply');
      }
      return new Uncertain(r, scaleF(a.gradient, 1 / (2 * r)));
    },
    toNumber: (a) => fin(a.value, 'toNumber(a)'),
    toString: (a) => float.toString(a.value),
    toPrecision: (a, digits) => float.toPrecision(a.value, digits),
    pi: constant(Math.PI),
    sin: (x) => new Uncertain(Math.sin(x.value), x.gradient.size === 0 ? x.gradient : scaleF(x.gradient, Math.cos(x.value))),
    cos: (x) => new Uncertain(Math.cos(x.value), x.gradient.size === 0 ? x.gradient : scaleF(x.gradient, -Math.sin(x.value))),
    atan2(y, x) {
      if (y.value === 0 && x.value === 0) {
        throw new QuadspreadError('INVALID_ARGUMENT', `${name}.atan2(y, x)`, 'the angle of the zero vector is undefined');
      }
      const v = Math.atan2(y.value, x.value);
      if (y.gradient.size === 0 && x.gradient.size === 0) return constant(v);
      const d = x.value * x.value + y.value * y.value;
      return new Uncertain(v, combineF(y.gradient, x.value / d, x.gradient, -(y.value / d)));
    },
  };
  return U;
}
