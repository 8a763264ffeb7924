/**
 * Propagation of distributions by the Monte Carlo method (JCGM 101:2008), to check
 * first-order budgets where the model is not linear enough.
 *
 * @module uncertainty
 */
import {
  QuadspreadError,
  show,
  invalidArgument,
  invalidNumber,
  notFinite,
  checkArithmetic,
} from '../errors.js';
import { expectObject } from '../geometry/validate.js';
import { randomStream } from './random.js';
import { checkU } from './internal.js';
import type { Numeric } from '../arithmetic/types.js';
import type { Uncertain, UncertainArithmetic } from '../arithmetic/uncertain.js';

/** An input distribution of {@link monteCarlo}. */
export type InputDistribution =
  /** Gaussian N(mean, sigma²) (JCGM 101:2008 §6.4.7). */
  | { readonly distribution: 'normal'; readonly mean: number; readonly sigma: number }
  /** Rectangular on [low, high] (JCGM 101:2008 §6.4.2): standard deviation (high − low)/√12. */
  | { readonly distribution: 'rectangular'; readonly low: number; readonly high: number };

/** Options of {@link monteCarlo}. */
export interface MonteCarloOptions {
  /** Number of trials M, an integer in [100, 10⁷]. JCGM 101 §7.2.2 suggests M ≥ 10⁶ for a 95 % interval. */
  readonly n: number;
  /** Seed of the generator (see {@link randomStream}): the same seed gives the same result. */
  readonly seed: number | bigint;
  /** Coverage probability of the interval, in (0, 1); default 0.95. */
  readonly coverage?: number;
}

/** The summary of a Monte Carlo propagation (JCGM 101:2008 §7.6, §7.7). */
export interface MonteCarloResult {
  /** Number of trials M. */
  readonly n: number;
  /** The average of the model values ỹ (eq. (16)). */
  readonly mean: number;
  /** Their standard deviation u(ỹ), with M − 1 in the denominator (eq. (17)). */
  readonly sigma: number;
  /** The coverage probability p of the interval. */
  readonly coverage: number;
  /** The lower end of the shortest coverage interval for p (§7.7.2). */
  readonly low: number;
  /** The upper end of the shortest coverage interval for p (§7.7.2). */
  readonly high: number;
}

const MAX_TRIALS = 10_000_000;

function checkInput(name: string, d: InputDistribution): void {
  const where = `monteCarlo(f, inputs.${name})`;
  expectObject(d, where, 'a distribution');
  const fin = (x: unknown) => typeof x === 'number' && Number.isFinite(x);
  if (d.distribution === 'normal') {
    if (!fin(d.mean)) throw invalidNumber(where, `the mean ${show(d.mean)} is not a finite number`);
    if (!fin(d.sigma) || d.sigma < 0)
      throw new QuadspreadError(
        'INVALID_SIGMA',
        where,
        `${show(d.sigma)} is not a finite number ≥ 0`,
      );
  } else if (d.distribution === 'rectangular') {
    if (!fin(d.low) || !fin(d.high))
      throw invalidNumber(
        where,
        `the limits ${show(d.low)}, ${show(d.high)} are not finite numbers`,
      );
    if (d.low > d.high)
      throw invalidArgument(where, `low ${show(d.low)} is above high ${show(d.high)}`);
  } else {
    throw invalidArgument(
      where,
      `the distribution ${show((d as { distribution?: unknown }).distribution)} is not 'normal' or 'rectangular'`,
    );
  }
}

/**
 * Propagates input distributions through a model by the Monte Carlo method of
 * JCGM 101:2008 (§7): draws every input `n` times from its distribution with a seeded
 * generator, evaluates `f` on each draw, and summarises the model values by their mean,
 * standard deviation and shortest coverage interval.
 *
 * Runs in JS numbers: write `f` with the `float` arithmetic (or plain Math). Use it to
 * check a first-order {@link budget} where the model is strongly non-linear on the scale
 * of the input uncertainties. The Monte Carlo result itself is uncertain: its standard
 * deviation has a relative standard error of about 1/√(2n) for near-normal output.
 *
 * @param f the model: input values by name → the output value
 * @param inputs the input distributions by name (drawn in the order of the keys)
 * @param options `n` trials, `seed`, `coverage` (default 0.95)
 * @returns `{ n, mean, sigma, coverage, low, high }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad `n`, `seed`, `coverage` or
 *   distribution; `INVALID_SIGMA` for a negative sigma; `NOT_FINITE` when `f` returns
 *   something that is not a finite number (errors thrown by `f` pass through).
 * @example
 * ```ts
 * import { monteCarlo } from 'quadspread';
 * const r = monteCarlo((x) => 2 * x.a + 1, { a: { distribution: 'normal', mean: 3, sigma: 0.5 } }, { n: 10000, seed: 1 });
 * [Math.abs(r.mean - 7) < 0.05, Math.abs(r.sigma - 1) < 0.03];
 * //=> [true, true]
 * ```
 */
export function monteCarlo<K extends string>(
  f: (x: Readonly<Record<K, number>>) => number,
  inputs: Readonly<Record<K, InputDistribution>>,
  options: MonteCarloOptions,
): MonteCarloResult {
  const where = 'monteCarlo(f, inputs, options)';
  if (typeof f !== 'function') throw invalidArgument(where, `f ${show(f)} is not a function`);
  if (inputs === null || typeof inputs !== 'object')
    throw invalidArgument(where, `inputs ${show(inputs)} is not an object`);
  const { n, seed } = options ?? ({} as MonteCarloOptions);
  const p = options?.coverage ?? 0.95;
  if (!Number.isInteger(n) || n < 100 || n > MAX_TRIALS) {
    throw invalidArgument(`${where}.n`, `${show(n)} is not an integer in [100, ${MAX_TRIALS}]`);
  }
  if (typeof p !== 'number' || !(p > 0 && p < 1))
    throw invalidArgument(`${where}.coverage`, `${show(p)} is not in (0, 1)`);
  const names = Object.keys(inputs) as K[];
  const dists = names.map((name) => {
    const d = inputs[name] as InputDistribution;
    checkInput(name, d);
    return d;
  });
  const rng = randomStream(seed);
  const x = {} as Record<K, number>;
  const y = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < names.length; i++) {
      const d = dists[i] as InputDistribution;
      // JCGM 101 §6.4.7 (normal: μ + σz) and §6.4.2.4 (rectangular: a + (b − a)·u)
      x[names[i] as K] =
        d.distribution === 'normal'
          ? d.mean + d.sigma * rng.normal()
          : d.low + (d.high - d.low) * rng.uniform();
    }
    const v = f(x);
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw notFinite(
        where,
        `f returned ${show(v)} on trial ${r + 1} (inputs ${JSON.stringify(x)})`,
      );
    }
    y[r] = v;
  }
  // Large model values (|y| > 2^500) are summed scaled by 2^−600 (exact, a power of 2), so
  // that their sum and the sum of squared deviations do not overflow to ±Infinity or NaN.
  let big = 0;
  for (let r = 0; r < n; r++) big = Math.max(big, Math.abs(y[r] as number));
  const scale = big > 2 ** 500 ? 2 ** -600 : 1;
  // ỹ = Σ yᵣ / M (JCGM 101 eq. (16)); compensated (Neumaier) summation.
  let sum = 0;
  let comp = 0;
  for (let r = 0; r < n; r++) {
    const v = (y[r] as number) * scale;
    const t = sum + v;
    comp += Math.abs(sum) >= Math.abs(v) ? sum - t + v : v - t + sum;
    sum = t;
  }
  const scaledMean = (sum + comp) / n;
  // u²(ỹ) = Σ (yᵣ − ỹ)² / (M − 1) (JCGM 101 eq. (17)); two passes.
  let ss = 0;
  for (let r = 0; r < n; r++) {
    const e = (y[r] as number) * scale - scaledMean;
    ss += e * e;
  }
  const mean = scaledMean / scale;
  const sigma = Math.sqrt(ss / (n - 1)) / scale;
  if (!Number.isFinite(sigma))
    throw notFinite(
      where,
      `the standard deviation of the model values (up to ${show(big)}) is beyond the range of a JS number`,
    );
  y.sort();
  // Shortest coverage interval (JCGM 101 §7.7.2): q = pM if integer, else ⌊pM + 1/2⌋;
  // the interval [y₍ᵣ₎, y₍ᵣ₊q₋₁₎] of least width over r = 1, …, M − q + 1.
  const pm = p * n;
  const q = Math.max(1, Math.min(n, Number.isInteger(pm) ? pm : Math.floor(pm + 0.5)));
  let best = 0;
  let width = Infinity;
  for (let r = 0; r + q - 1 < n; r++) {
    const w = (y[r + q - 1] as number) * scale - (y[r] as number) * scale;
    if (w < width) {
      width = w;
      best = r;
    }
  }
  return Object.freeze({
    n,
    mean,
    sigma,
    coverage: p,
    low: y[best] as number,
    high: y[best + q - 1] as number,
  });
}

/**
 * Normal input distributions for {@link monteCarlo} from the inputs an uncertain result
 * depends on: each input's value as the mean and its sigma, as JS numbers, by name. With
 * it a first-order budget can be checked in one call.
 *
 * @param U the uncertain arithmetic of `result`
 * @param result a value of `U`
 * @returns `{ [name]: { distribution: 'normal', mean, sigma } }`
 * @throws {QuadspreadError} `DUPLICATE_INPUT` when two different inputs share a name;
 *   `INVALID_ARGUMENT` when `U` is not an uncertain arithmetic.
 * @example
 * ```ts
 * import { uncertain, float, measured, normalInputs } from 'quadspread';
 * const U = uncertain(float);
 * const y = U.mul(measured(U, 3, 0.1, 'a'), measured(U, 4, 0.2, 'b'));
 * normalInputs(U, y);
 * //=> { a: { distribution: 'normal', mean: 3, sigma: 0.1 }, b: { distribution: 'normal', mean: 4, sigma: 0.2 } }
 * ```
 */
export function normalInputs<T>(
  U: UncertainArithmetic<T>,
  result: Uncertain<T> | Numeric<T>,
): Record<string, InputDistribution> {
  checkArithmetic(U, 'normalInputs');
  checkU(U, 'normalInputs(U, result)');
  const y = U.from(result as Numeric<Uncertain<T>>);
  const out: Record<string, InputDistribution> = {};
  const seen = new Map<string, unknown>();
  for (const input of y.inputs) {
    if (seen.has(input.name) && seen.get(input.name) !== input) {
      throw new QuadspreadError(
        'DUPLICATE_INPUT',
        'normalInputs(U, result)',
        `two different inputs are named ${show(input.name)}`,
      );
    }
    seen.set(input.name, input);
    out[input.name] = {
      distribution: 'normal',
      mean: U.base.toNumber(input.value),
      sigma: U.base.toNumber(input.sigma),
    };
  }
  return out;
}
