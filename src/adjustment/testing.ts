/**
 * The statistics of an adjustment, shared by the levelling and plane-network solvers: the
 * variance factor and the global test, the local tests (Baarda's w or Pope's τ), the minimal
 * detectable biases, and the scale of the standard deviations.
 *
 * @module adjustment
 * @internal
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { show, invalidArgument, QuadspreadError } from '../errors.js';
import { readNumber } from '../geometry/validate.js';
import { sqrtOf } from '../geometry/surd.js';
import type { Root, Surd } from '../geometry/surd.js';
import { baardaTest, chiSquareQuantile, tauCritical } from './statistics.js';
import type { ObservationStatistics } from './least-squares.js';

/** Options shared by the adjustments: the statistical model and its tests. */
export interface TestOptions<T> {
  /** The a-priori standard deviation of unit weight σ0 (default 1). */
  readonly sigma0?: Numeric<T>;
  /**
   * Which variance factor scales the standard deviations and ellipses: `'a-posteriori'`
   * (σ̂0² = vᵀPv/r, the default) or `'a-priori'` (σ0²). With no redundancy, a-priori is used.
   */
  readonly scale?: 'a-priori' | 'a-posteriori';
  /** Level of the global test (two-sided), default 0.05. */
  readonly alpha?: number;
  /** Level of the local test of one observation (two-sided), default 0.001. */
  readonly alpha0?: number;
  /** Power of the local test, for the minimal detectable bias; default 0.8. */
  readonly power?: number;
  /** The local test: `'w'` (Baarda, a-priori σ0; default) or `'tau'` (Pope, a-posteriori σ̂0). */
  readonly test?: 'w' | 'tau';
}

/** The global (variance) test: vᵀPv/σ0² against χ²(r) at α/2 and 1 − α/2. */
export interface GlobalTest<T> {
  /** vᵀPv/σ0². */
  readonly statistic: T;
  /** χ²(r) quantile at α/2. */
  readonly lower: T;
  /** χ²(r) quantile at 1 − α/2. */
  readonly upper: T;
  readonly alpha: number;
  /** lower ≤ statistic ≤ upper. */
  readonly passed: boolean;
}

/** The local test applied to every observation. */
export interface LocalTest {
  /** `'w'`: wᵢ = vᵢ/(σ0·√q_vv); `'tau'`: τᵢ = vᵢ/(σ̂0·√q_vv). */
  readonly kind: 'w' | 'tau';
  readonly alpha0: number;
  readonly power: number;
  /** The critical value of |w| or |τ|. */
  readonly critical: number;
  /** λ0 of the minimal detectable bias. */
  readonly lambda0: number;
}

/** What every adjusted observation reports beside its residual. */
export interface ObservationTest<T, E extends boolean> {
  /** σ of the observation: √(f·q_ll), f the variance factor in use. */
  readonly sigmaObserved: Root<T, E>;
  /** σ of the adjusted observation: √(f·q_l̂l̂). */
  readonly sigmaAdjusted: Root<T, E>;
  /** σ of the residual: √(f·q_vv). */
  readonly sigmaResidual: Root<T, E>;
  /** The redundancy number rᵢ = (Q_vv·P)ᵢᵢ, in [0, 1]; they sum to the degrees of freedom. */
  readonly redundancy: T;
  /** w (or τ), or `undefined` when the observation has no redundancy (it cannot be tested). */
  readonly standardized: Root<T, E> | undefined;
  /** Minimal detectable bias σ0·√(q_ll·λ0/rᵢ) (observation units); `undefined` when rᵢ = 0. */
  readonly mdb: Root<T, E> | undefined;
  /** |standardized| > critical: flagged, never removed silently. */
  readonly suspect: boolean;
}

/** The read options. @internal */
export interface ReadTestOptions<T> {
  readonly sigma0: T;
  readonly scale: 'a-priori' | 'a-posteriori';
  readonly alpha: number;
  readonly alpha0: number;
  readonly power: number;
  readonly test: 'w' | 'tau';
}

function probability(x: unknown, fallback: number, where: string): number {
  if (x === undefined) return fallback;
  if (typeof x !== 'number' || !(x > 0 && x < 1))
    throw invalidArgument(where, `${show(x)} is not a probability strictly between 0 and 1`);
  return x;
}

/** Reads the test options. @internal */
export function readTestOptions<T>(
  A: Arithmetic<T>,
  o: TestOptions<T>,
  where: string,
): ReadTestOptions<T> {
  const sigma0 = o.sigma0 === undefined ? A.one : readNumber(A, o.sigma0, `${where}.sigma0`);
  if (A.sign(sigma0) <= 0)
    throw new QuadspreadError(
      'INVALID_SIGMA',
      `${where}.sigma0`,
      `σ0 = ${A.toString(sigma0)} is not positive`,
    );
  const scale = o.scale ?? 'a-posteriori';
  if (scale !== 'a-priori' && scale !== 'a-posteriori')
    throw invalidArgument(`${where}.scale`, `${show(scale)} is not 'a-priori' or 'a-posteriori'`);
  const test = o.test ?? 'w';
  if (test !== 'w' && test !== 'tau')
    throw invalidArgument(`${where}.test`, `${show(test)} is not 'w' or 'tau'`);
  return {
    sigma0,
    scale,
    test,
    alpha: probability(o.alpha, 0.05, `${where}.alpha`),
    alpha0: probability(o.alpha0, 0.001, `${where}.alpha0`),
    power: probability(o.power, 0.8, `${where}.power`),
  };
}

/** ±√(x) as a root: the sign applied to √x. @internal */
export function signedRoot<T, E extends boolean>(
  A: Arithmetic<T, E>,
  sign: number,
  square: T,
): Root<T, E> {
  const r = sqrtOf(A, square);
  if (sign >= 0) return r;
  return (A.exact ? (r as Surd<T>).neg() : A.neg(r as T)) as Root<T, E>;
}

/** The assessment of an adjustment. @internal */
export interface Assessment<T, E extends boolean> {
  readonly dof: number;
  readonly vtpv: T;
  readonly varianceFactor: T | undefined;
  readonly sigma0: Root<T, E> | undefined;
  /** The variance factor the σ use: σ̂0² or σ0². */
  readonly factor: T;
  readonly scale: 'a-priori' | 'a-posteriori';
  readonly globalTest: GlobalTest<T> | undefined;
  readonly localTest: LocalTest;
  readonly observations: ObservationTest<T, E>[];
}

/**
 * Tests an adjustment: variance factor, global test, local tests and MDBs for the flat list
 * of observation statistics. @internal
 */
export function assess<T, E extends boolean>(
  A: Arithmetic<T, E>,
  stats: readonly ObservationStatistics<T>[],
  vtpv: T,
  dof: number,
  o: ReadTestOptions<T>,
): Assessment<T, E> {
  const s02 = A.mul(o.sigma0, o.sigma0);
  // σ̂0² = vᵀPv/r (e.g. Ghilani & Wolf 2006, eq. 12.14 — from memory).
  const varianceFactor = dof > 0 ? A.div(vtpv, A.from(dof)) : undefined;
  const scale = varianceFactor === undefined ? 'a-priori' : o.scale;
  const factor = scale === 'a-priori' ? s02 : varianceFactor!;
  let globalTest: GlobalTest<T> | undefined;
  if (dof > 0) {
    // vᵀPv/σ0² ~ χ²(r) under the model (Koch 1999, §4.3 — from memory).
    const statistic = A.div(vtpv, s02);
    const lower = A.from(chiSquareQuantile(o.alpha / 2, dof));
    const upper = A.from(chiSquareQuantile(1 - o.alpha / 2, dof));
    globalTest = {
      statistic,
      lower,
      upper,
      alpha: o.alpha,
      passed: A.cmp(lower, statistic) <= 0 && A.cmp(statistic, upper) <= 0,
    };
  }
  const baarda = baardaTest(o.alpha0, o.power);
  const tau = o.test === 'tau';
  const critical = tau ? (dof >= 2 ? tauCritical(o.alpha0, dof) : Infinity) : baarda.critical;
  const localTest: LocalTest = {
    kind: o.test,
    alpha0: o.alpha0,
    power: o.power,
    critical,
    lambda0: baarda.lambda0,
  };
  const lambda0 = A.from(baarda.lambda0);
  const c2 = critical === Infinity ? undefined : A.from(critical * critical);
  // The scale of w (a-priori σ0²) or τ (σ̂0²).
  const testScale = tau ? varianceFactor : s02;
  const slack = A.exact ? A.zero : A.from('1e-12');
  const observations = stats.map((s): ObservationTest<T, E> => {
    const tested =
      A.cmp(s.redundancy, slack) > 0 && testScale !== undefined && !A.isZero(testScale);
    // w = v/(σ0·√q_vv) (Baarda 1968); τ = v/(σ̂0·√q_vv) (Pope 1976).
    const w2 = tested ? A.div(A.mul(s.v, s.v), A.mul(testScale!, s.qvv)) : undefined;
    return {
      sigmaObserved: sigmaRoot(A, factor, s.qll),
      sigmaAdjusted: sigmaRoot(A, factor, s.qadj),
      sigmaResidual: sigmaRoot(A, factor, s.qvv),
      redundancy: s.redundancy,
      standardized: w2 === undefined ? undefined : signedRoot(A, A.sign(s.v), w2),
      // MDB ∇ = σ0·√(q_ll·λ0/rᵢ) (Baarda 1968).
      mdb: tested ? sqrtOf(A, A.div(A.mul(A.mul(s02, s.qll), lambda0), s.redundancy)) : undefined,
      suspect: w2 !== undefined && c2 !== undefined && A.cmp(w2, c2) > 0,
    };
  });
  return {
    dof,
    vtpv,
    varianceFactor,
    sigma0: varianceFactor === undefined ? undefined : sqrtOf(A, varianceFactor),
    factor,
    scale,
    globalTest,
    localTest,
    observations,
  };
}

/**
 * √(f·q) as a root: exactly 0 (with no dependence on the inputs, so that an uncertain
 * arithmetic does not differentiate √ at 0) when the cofactor q is 0 or rounded below it.
 * @internal
 */
export function sigmaRoot<T, E extends boolean>(A: Arithmetic<T, E>, f: T, q: T): Root<T, E> {
  const v = nonNegative(A, q);
  return A.isZero(v) ? sqrtOf(A, A.zero) : sqrtOf(A, A.mul(f, v));
}

/** x, or 0 when rounding made a cofactor that must be ≥ 0 slightly negative. @internal */
export function nonNegative<T>(A: Arithmetic<T>, x: T): T {
  return A.sign(x) < 0 ? A.zero : x;
}
