/**
 * The uncertainty budget of a result: its combined standard uncertainty and each
 * input's share (GUM, JCGM 100:2008 §5.1.2 and §5.2.2).
 *
 * @module uncertainty
 */
import {
  QuadspreadError,
  show,
  notFinite,
  invalidCovariance,
  unsupportedOperation,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { Uncertain } from '../arithmetic/uncertain.js';
import type { UncertainArithmetic, UncertainInput } from '../arithmetic/uncertain.js';
import { isSurd, sqrtOf } from '../geometry/surd.js';
import { checkU, sqrtRatioToNumber } from './internal.js';
import { budgetFloat } from './budget-float.js';
import type { Root, Surd } from '../geometry/surd.js';

/** One input's line in a {@link Budget}. */
export interface Contribution<T> {
  /** The input's name. */
  readonly name: string;
  /** Its measured value xᵢ. */
  readonly value: T;
  /** Its standard uncertainty u(xᵢ). */
  readonly sigma: T;
  /** The sensitivity coefficient cᵢ = ∂f/∂xᵢ at the measured values (GUM eq. (11a)). */
  readonly sensitivity: T;
  /** Its share of the variance, cᵢ²·u²(xᵢ), in the result's units squared. */
  readonly contribution: T;
}

/** The share of the variance that a correlation between two inputs adds (GUM eq. (13)). */
export interface CorrelationTerm<T> {
  /** The two inputs, as given in `options.covariance`. */
  readonly names: readonly [string, string];
  /** Their covariance u(xᵢ, xⱼ). */
  readonly covariance: T;
  /** 2·cᵢ·cⱼ·u(xᵢ, xⱼ): may be negative. */
  readonly contribution: T;
}

/** The uncertainty budget of one result. */
export interface Budget<T, E extends boolean = boolean> {
  /** The result's value y. */
  readonly value: T;
  /**
   * The combined variance u_c²(y) = Σ contributions + Σ correlation terms, computed in the
   * base arithmetic: exact in `rational`.
   */
  readonly variance: T;
  /**
   * The combined standard uncertainty u_c(y) = √variance: over an exact base the exact
   * quadratic surd (`sqrtOf`, e.g. `3√2/100`; its `toNumber()` is √variance correctly
   * rounded to the nearest JS number, computed from the variance with bigints, so it works
   * however large the surd's radicand grows), over `float` and `decimal` the base's
   * rounded square root.
   */
  readonly sigma: Root<T, E>;
  /**
   * One line per input the result depends on, largest contribution first (ties by name):
   * the uncertainty budget. Inputs that cancel out appear with sensitivity 0.
   */
  readonly contributions: readonly Contribution<T>[];
  /** One line per correlated pair of `options.covariance` (empty without it). */
  readonly correlations: readonly CorrelationTerm<T>[];
}

/** Options of {@link budget}. */
export interface BudgetOptions<T> {
  /**
   * Covariances of correlated inputs: `[nameA, nameB, u(a, b)]` triples, in the inputs'
   * units multiplied (GUM §5.2.2). Pairs not listed are uncorrelated. A correlation
   * coefficient r gives u(a, b) = r·u(a)·u(b) (GUM eq. (14)).
   */
  readonly covariance?: readonly (readonly [string, string, Numeric<T>])[];
}

/**
 * The uncertainty budget of `result`: the law of propagation of uncertainty (GUM,
 * JCGM 100:2008 §5.1.2, eq. (10)), u_c²(y) = Σ cᵢ²·u²(xᵢ) with cᵢ = ∂f/∂xᵢ, and with
 * correlated inputs eq. (13), + 2·Σᵢ<ⱼ cᵢ·cⱼ·u(xᵢ, xⱼ). The sensitivities come from the
 * gradient that the uncertain arithmetic carried through the computation.
 *
 * This is first order: it is the exact variance of the linearised model. Where the model
 * is strongly non-linear on the scale of the input uncertainties (spreads near 0 or 1,
 * near-degenerate triangles, a result near a square root's zero) check it with
 * {@link monteCarlo} (JCGM 101:2008).
 *
 * @param U the uncertain arithmetic the result was computed in
 * @param result the result: a value of `U` (a constant gives a zero budget), or a surd
 *   result of an exact solver when it is rational
 * @param options `covariance` triples for correlated inputs
 * @returns `{ value, variance, sigma, contributions, correlations }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when `U` is not an uncertain arithmetic;
 *   `DUPLICATE_INPUT` when two different inputs share a name;
 *   `UNSUPPORTED_OPERATION` for an irrational surd (use an inexact base for it);
 *   `UNKNOWN_INPUT` when a covariance names an input the result does not depend on;
 *   `INVALID_COVARIANCE` for a pair of one input with itself, a pair listed twice,
 *   |u(a, b)| > u(a)·u(b), or covariances that make the variance negative;
 *   `NOT_FINITE` over `float` when the value or the variance overflowed.
 * @example
 * ```ts
 * import { uncertain, rational, measured, budget } from 'quadspread';
 * const U = uncertain(rational);
 * const a = measured(U, '12.5', '0.02', 'a');
 * const b = measured(U, '4', '0.01', 'b');
 * const B = budget(U, U.mul(a, b)); // area = a·b
 * [rational.toString(B.variance), B.sigma.toString(), B.contributions.map((c) => c.name)];
 * //=> ['881/40000', '√881/200', ['b', 'a']]
 * ```
 */
export function budget<T, E extends boolean>(
  U: UncertainArithmetic<T, E>,
  result: Uncertain<T> | Surd<Uncertain<T>> | Numeric<T>,
  options: BudgetOptions<T> = {},
): Budget<T, E> {
  checkArithmetic(U, 'budget');
  const where = 'budget(U, result, options)';
  checkU(U, where);
  const B: Arithmetic<T, E> = U.base;
  let y: Uncertain<T>;
  if (isSurd(result)) {
    const r = result as Surd<Uncertain<T>>;
    if (!r.isRational()) {
      throw unsupportedOperation(
        where,
        `the result ${r.toString()} is an irrational surd, whose sensitivities are irrational too: take its budget in uncertain(decimal(n)) or uncertain(float)`,
      );
    }
    y = U.from(r.a);
  } else if (U.is(result)) {
    y = result;
  } else if (
    result instanceof Uncertain &&
    typeof result.value === 'number' &&
    result.value - result.value !== 0
  ) {
    throw notFinite(where, `the result ${show(result.value)} is not finite (overflow)`);
  } else {
    y = U.from(result as Numeric<Uncertain<T>>);
  }
  const inputs = y.inputs;
  const n = inputs.length;
  checkNames(B, inputs, where);
  if (B.float64 === true && options?.covariance === undefined) {
    // float without covariances, the usual budget: its lines in plain numbers
    const fast = budgetFloat(B as unknown as Arithmetic<number, false>, y as Uncertain<number>);
    if (fast !== undefined) return fast as unknown as Budget<T, E>;
  }
  const lines: Contribution<T>[] = [];
  let variance = B.zero;
  for (let i = 0; i < n; i++) {
    const input = inputs[i] as UncertainInput<T>;
    const c = y.derivatives[i] as T;
    const cu = B.mul(c, input.sigma);
    const contribution = B.mul(cu, cu); // (cᵢ·u(xᵢ))²: GUM eq. (10) term
    variance = B.add(variance, contribution);
    lines.push({
      name: input.name,
      value: input.value,
      sigma: input.sigma,
      sensitivity: c,
      contribution,
    });
  }
  sortLines(B, lines);

  const correlations: CorrelationTerm<T>[] = [];
  const covariance = options?.covariance ?? NO_COVARIANCE;
  if (!Array.isArray(covariance)) {
    throw invalidCovariance(
      `${where}.covariance`,
      `${show(covariance)} is not a list of [nameA, nameB, covariance] triples`,
    );
  }
  // By name, for the covariances: filled only when there are some (most budgets have none).
  const byName = new Map<string, { input: UncertainInput<T>; c: T }>();
  if (covariance.length > 0)
    for (let i = 0; i < n; i++) {
      const input = inputs[i] as UncertainInput<T>;
      byName.set(input.name, { input, c: y.derivatives[i] as T });
    }
  const seen = new Set<string>();
  for (const triple of covariance) {
    if (!Array.isArray(triple) || triple.length !== 3) {
      throw invalidCovariance(
        `${where}.covariance`,
        `${show(triple)} is not a [nameA, nameB, covariance] triple`,
      );
    }
    const [na, nb, cov] = triple;
    const a = byName.get(na);
    const b = byName.get(nb);
    if (a === undefined || b === undefined) {
      const missing = a === undefined ? na : nb;
      throw new QuadspreadError(
        'UNKNOWN_INPUT',
        `${where}.covariance`,
        `the result does not depend on an input named ${show(missing)}`,
      );
    }
    if (na === nb)
      throw invalidCovariance(
        `${where}.covariance`,
        `${show(na)} is paired with itself (its variance is its sigma squared)`,
      );
    const key = na < nb ? `${na}\u0000${nb}` : `${nb}\u0000${na}`;
    if (seen.has(key))
      throw invalidCovariance(
        `${where}.covariance`,
        `the pair ${show(na)}, ${show(nb)} is listed twice`,
      );
    seen.add(key);
    let v: T;
    try {
      v = B.from(cov);
    } catch {
      throw invalidCovariance(`${where}.covariance`, `${show(cov)} is not a number`);
    }
    // |u(a, b)| ≤ u(a)·u(b), i.e. |r| ≤ 1 (GUM §C.3.6): compared squared, exact in rational.
    const bound = B.mul(a.input.sigma, b.input.sigma);
    if (B.cmp(B.mul(v, v), B.mul(bound, bound)) > 0) {
      throw invalidCovariance(
        `${where}.covariance`,
        `|${show(cov)}| exceeds u(${na})·u(${nb}) = ${B.toString(bound)}`,
      );
    }
    const contribution = B.mul(B.from(2), B.mul(B.mul(a.c, b.c), v)); // 2·cᵢ·cⱼ·u(xᵢ, xⱼ): GUM eq. (13)
    variance = B.add(variance, contribution);
    correlations.push(
      Object.freeze({ names: Object.freeze([na, nb] as const), covariance: v, contribution }),
    );
  }
  // A negative total means covariances no joint distribution can have; in an inexact base
  // a negative total within 1e-12 of the terms is round-off (perfect anti-correlation): 0.
  if (B.sign(variance) < 0) {
    let scale = B.zero;
    for (const l of lines) scale = B.add(scale, l.contribution);
    for (const c of correlations) scale = B.add(scale, B.abs(c.contribution));
    const noise = B.exact || B.cmp(B.abs(variance), B.mul(scale, B.from('1e-12'))) > 0;
    if (noise)
      throw invalidCovariance(
        where,
        `the covariances make the variance ${B.toString(variance)} negative (they cannot belong to real inputs)`,
      );
    variance = B.zero;
  }
  // float lets ±Infinity and NaN through until output: refuse them here rather than return them.
  if (
    typeof variance === 'number' &&
    (variance - variance !== 0 || (y.value as number) - (y.value as number) !== 0)
  ) {
    throw notFinite(
      where,
      `the result ${show(y.value)} or its variance ${show(variance)} is not finite (overflow or an infinite sensitivity)`,
    );
  }
  return {
    value: y.value,
    variance,
    sigma: sigmaOf(B, variance),
    contributions: lines,
    correlations,
  };
}

/** Largest contribution first, ties by name (names are distinct: one order only). */
function sortLines<T>(B: Arithmetic<T>, lines: Contribution<T>[]): void {
  const before = (p: Contribution<T>, q: Contribution<T>) =>
    B.cmp(q.contribution, p.contribution) || (p.name < q.name ? -1 : p.name > q.name ? 1 : 0);
  if (lines.length > 16) {
    lines.sort(before);
    return;
  }
  // A budget has a few lines: insertion sort, without the generic sort's set-up.
  for (let i = 1; i < lines.length; i++) {
    const l = lines[i] as Contribution<T>;
    let j = i - 1;
    for (; j >= 0 && before(lines[j] as Contribution<T>, l) > 0; j--) lines[j + 1] = lines[j]!;
    lines[j + 1] = l;
  }
}

const NO_COVARIANCE: readonly never[] = /* @__PURE__ */ Object.freeze([]);

/**
 * Refuses two different inputs with one name (`DUPLICATE_INPUT`, naming the first two found):
 * a budget's lines and covariances are by name. Pairwise for the usual few inputs, by a map
 * for many.
 */
function checkNames<T>(
  B: Arithmetic<T>,
  inputs: readonly UncertainInput<T>[],
  where: string,
): void {
  const n = inputs.length;
  const index = n > 16 ? new Map<string, UncertainInput<T>>() : undefined;
  for (let i = 0; i < n; i++) {
    const input = inputs[i] as UncertainInput<T>;
    let other: UncertainInput<T> | undefined;
    if (index === undefined) {
      for (let j = 0; j < i && other === undefined; j++)
        if ((inputs[j] as UncertainInput<T>).name === input.name) other = inputs[j];
    } else {
      other = index.get(input.name);
      index.set(input.name, input);
    }
    if (other !== undefined) {
      throw new QuadspreadError(
        'DUPLICATE_INPUT',
        where,
        `two different inputs are named ${show(input.name)} (values ${B.toString(other.value)} and ${B.toString(input.value)})`,
      );
    }
  }
}

/**
 * √variance as a root; over `rational` the surd's `toNumber()` comes from the variance
 * itself (the surd's own coefficient and radicand may lie beyond the range of JS numbers
 * when the root does not).
 */
function sigmaOf<T, E extends boolean>(B: Arithmetic<T, E>, variance: T): Root<T, E> {
  // An inexact base: its own root of the (checked, non-negative) variance, as sqrtOf gives it.
  if (!B.exact) {
    const r = B.sqrt(variance);
    if (r !== undefined) return r as Root<T, E>;
  }
  const s = sqrtOf(B, variance);
  const v = B.ratio?.(variance);
  if (v === undefined || !isSurd(s) || s.isRational()) return s;
  const where = 'budget(U, result, options).sigma.toNumber()';
  // A surd that differs from `s` only in how it gives its number.
  return Object.create(s, {
    toNumber: {
      value: () => {
        const x = sqrtRatioToNumber(v.n, v.d);
        if (!Number.isFinite(x))
          throw notFinite(where, `√(${B.toString(variance)}) is beyond the range of a JS number`);
        return x;
      },
    },
  }) as Root<T, E>;
}
