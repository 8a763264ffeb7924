/**
 * Distributions for the tests of an adjustment: the standard normal, χ² and F distributions
 * (cumulative probabilities and quantiles), computed here in JS numbers, and the critical
 * values of Baarda's w-test and Pope's τ-test. Accurate to about 1e-12 relative.
 *
 * @module adjustment
 */
import { show, invalidArgument, notFinite } from '../errors.js';

// Lanczos approximation of ln Γ(x), g = 7, nine coefficients (Lanczos, SIAM J. Numer. Anal.
// B1, 1964; the coefficient set published by P. Godfrey, common practice), with the
// reflection formula below 1/2.
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];
const LN_SQRT_2PI = 0.9189385332046727;

/** ln Γ(x) for x > 0. @internal */
export function lnGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  const z = x - 1;
  let s = LANCZOS[0]!;
  for (let i = 1; i < 9; i++) s += LANCZOS[i]! / (z + i);
  const t = z + 7.5;
  return LN_SQRT_2PI + (z + 0.5) * Math.log(t) - t + Math.log(s);
}

const EPS = 1e-16;
const TINY = 1e-300;
const MAX_STEPS = 10000;

// Regularised incomplete gamma P(a, x) and Q(a, x) = 1 − P: the series for x < a + 1, the
// continued fraction (modified Lentz) otherwise (Press et al., Numerical Recipes, 3rd ed.
// 2007, §6.2).
function gammaPQ(a: number, x: number): [number, number] {
  if (x <= 0) return [0, 1];
  const front = Math.exp(-x + a * Math.log(x) - lnGamma(a));
  if (x < a + 1) {
    let ap = a;
    let del = 1 / a;
    let sum = del;
    for (let n = 0; n < MAX_STEPS; n++) {
      ap += 1;
      del *= x / ap;
      sum += del;
      if (Math.abs(del) < Math.abs(sum) * EPS) break;
    }
    const p = Math.min(1, sum * front);
    return [p, 1 - p];
  }
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < MAX_STEPS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < EPS) break;
  }
  const q = Math.min(1, front * h);
  return [1 - q, q];
}

// Continued fraction of the regularised incomplete beta I_x(a, b), modified Lentz (Numerical
// Recipes, 3rd ed. 2007, §6.4).
function betaFraction(a: number, b: number, x: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m < MAX_STEPS; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < EPS) break;
  }
  return h;
}

/** Regularised incomplete beta I_x(a, b) (Numerical Recipes, 3rd ed. 2007, §6.4). @internal */
export function betaRegularized(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(
    lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(1 - x),
  );
  // The fraction converges fast for x < (a + 1)/(a + b + 2); otherwise use the symmetry.
  if (x < (a + 1) / (a + b + 2)) return (front * betaFraction(a, b, x)) / a;
  return 1 - (front * betaFraction(b, a, 1 - x)) / b;
}

function checkProbability(p: unknown, where: string): number {
  if (typeof p !== 'number' || !(p > 0 && p < 1))
    throw invalidArgument(where, `${show(p)} is not a probability strictly between 0 and 1`);
  return p;
}

function checkDof(k: unknown, where: string): number {
  if (typeof k !== 'number' || !(k > 0) || k === Infinity || k > 1e7)
    throw invalidArgument(where, `${show(k)} is not a positive number of degrees of freedom`);
  return k;
}

function checkX(x: unknown, where: string): number {
  if (typeof x !== 'number' || x !== x) throw invalidArgument(where, `${show(x)} is not a number`);
  return x;
}

/**
 * Inverts an increasing cumulative distribution `cdf` with density `pdf` on (lo, ∞):
 * safeguarded Newton steps inside a bisection bracket, so that it always converges.
 */
function invert(
  cdf: (x: number) => number,
  pdf: (x: number) => number,
  p: number,
  lo: number,
  start: number,
  where: string,
): number {
  let a = lo;
  let b = Math.max(start, lo + 1);
  for (let i = 0; cdf(b) < p; i++) {
    a = b;
    b *= 2;
    if (i > 2000) throw notFinite(where, `no quantile found for p = ${p}`);
  }
  let x = start > a && start < b ? start : (a + b) / 2;
  for (let i = 0; i < 400; i++) {
    const f = cdf(x) - p;
    if (f === 0) return x;
    if (f < 0) a = x;
    else b = x;
    const d = pdf(x);
    let next = d > 0 ? x - f / d : (a + b) / 2;
    if (!(next > a && next < b)) next = (a + b) / 2;
    if (Math.abs(next - x) <= 1e-15 * Math.abs(x) || b - a <= 4e-16 * Math.abs(b)) return next;
    x = next;
  }
  return x;
}

/**
 * The standard normal cumulative probability Φ(x) = P(Z ≤ x).
 *
 * Computed as ½·Q(½, x²/2) (the complementary error function as an incomplete gamma),
 * to about 1e-14 relative, also far in the tails.
 *
 * @param x the value
 * @returns Φ(x) in [0, 1]
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when x is not a number.
 * @example
 * ```ts
 * import { normalCdf } from 'quadspread';
 * [normalCdf(0), Math.round(normalCdf(1.959963984540054) * 1e12) / 1e12];
 * //=> [0.5, 0.975]
 * ```
 */
export function normalCdf(x: number): number {
  checkX(x, 'normalCdf(x)');
  // Φ(x) rounds to 0 below −39 and to 1 above 9 in binary64 (Φ(−39) < 1e−300); far out (and at
  // ±Infinity, where x² overflows) the limit is the value.
  if (x < -40) return 0;
  if (x > 40) return 1;
  // Φ(x) = ½ erfc(−x/√2), and erfc(t) = Q(½, t²) for t ≥ 0 (Abramowitz & Stegun 1964, 7.1.2
  // and 6.5.17).
  const [, q] = gammaPQ(0.5, (x * x) / 2);
  return x >= 0 ? 1 - q / 2 : q / 2;
}

/**
 * The standard normal quantile Φ⁻¹(p): the z with P(Z ≤ z) = p.
 *
 * @param p a probability, 0 < p < 1
 * @returns z
 * @throws {QuadspreadError} `INVALID_ARGUMENT` unless 0 < p < 1.
 * @example
 * ```ts
 * import { normalQuantile } from 'quadspread';
 * // Baarda's critical value for α0 = 0.001 (two-sided)
 * normalQuantile(1 - 0.001 / 2).toFixed(4);
 * //=> '3.2905'
 * ```
 */
export function normalQuantile(p: number): number {
  checkProbability(p, 'normalQuantile(p)');
  if (p === 0.5) return 0;
  // By symmetry from the lower tail, where Φ is computed without cancellation.
  const lower = p < 0.5 ? p : 1 - p;
  const pdf = (z: number): number => Math.exp((-z * z) / 2 - LN_SQRT_2PI);
  const tail = (z: number): number => gammaPQ(0.5, (z * z) / 2)[1] / 2; // Φ(−z) for z ≥ 0
  // Solve tail(z) = lower for z > 0: tail decreases, so invert 1 − tail … through −tail.
  const guess = Math.sqrt(-2 * Math.log(lower));
  const z = invert(
    (t) => -tail(t),
    (t) => pdf(t),
    -lower,
    0,
    guess,
    'normalQuantile(p)',
  );
  return p < 0.5 ? -z : z;
}

/**
 * The χ² cumulative probability P(X ≤ x) with `dof` degrees of freedom: P(dof/2, x/2), the
 * regularised incomplete gamma function.
 *
 * @param x the value (≤ 0 gives 0)
 * @param dof degrees of freedom, > 0
 * @returns the probability
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad x or dof.
 * @example
 * ```ts
 * import { chiSquareCdf } from 'quadspread';
 * // χ²(2) is exponential with mean 2: P(X ≤ 2) = 1 − e⁻¹
 * Math.abs(chiSquareCdf(2, 2) - (1 - Math.exp(-1))) < 1e-14;
 * //=> true
 * ```
 */
export function chiSquareCdf(x: number, dof: number): number {
  checkX(x, 'chiSquareCdf(x)');
  checkDof(dof, 'chiSquareCdf(dof)');
  if (x === Infinity) return 1;
  return gammaPQ(dof / 2, Math.max(0, x) / 2)[0];
}

/**
 * The χ² quantile: the x with P(X ≤ x) = p for `dof` degrees of freedom.
 *
 * @param p a probability, 0 < p < 1
 * @param dof degrees of freedom, > 0
 * @returns x ≥ 0
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad p or dof.
 * @example
 * ```ts
 * import { chiSquareQuantile } from 'quadspread';
 * // two-sided 95 % bounds of the global test with 3 degrees of freedom
 * [chiSquareQuantile(0.025, 3).toFixed(4), chiSquareQuantile(0.975, 3).toFixed(4)];
 * //=> ['0.2158', '9.3484']
 * ```
 */
export function chiSquareQuantile(p: number, dof: number): number {
  checkProbability(p, 'chiSquareQuantile(p)');
  const k = checkDof(dof, 'chiSquareQuantile(dof)');
  const a = k / 2;
  const lnNorm = a * Math.log(2) + lnGamma(a);
  const pdf = (x: number): number =>
    x <= 0 ? 0 : Math.exp((a - 1) * Math.log(x) - x / 2 - lnNorm);
  // Lower tail through P, upper tail through −Q, so that neither loses digits to 1 − p.
  if (p > 0.5) {
    const q = 1 - p;
    return invert(
      (x) => -gammaPQ(a, x / 2)[1],
      pdf,
      -q,
      0,
      Math.max(k, 1),
      'chiSquareQuantile(p, dof)',
    );
  }
  return invert(
    (x) => gammaPQ(a, x / 2)[0],
    pdf,
    p,
    0,
    Math.max(k, 1),
    'chiSquareQuantile(p, dof)',
  );
}

/**
 * The F (Fisher–Snedecor) cumulative probability with d1 and d2 degrees of freedom:
 * I_{d1·x/(d1·x + d2)}(d1/2, d2/2).
 *
 * @param x the value (≤ 0 gives 0)
 * @param d1 numerator degrees of freedom, > 0
 * @param d2 denominator degrees of freedom, > 0
 * @returns the probability
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad x, d1 or d2.
 * @example
 * ```ts
 * import { fCdf } from 'quadspread';
 * // F(2, 2): P(X ≤ x) = x/(1 + x)
 * Math.abs(fCdf(3, 2, 2) - 0.75) < 1e-14;
 * //=> true
 * ```
 */
export function fCdf(x: number, d1: number, d2: number): number {
  checkX(x, 'fCdf(x)');
  checkDof(d1, 'fCdf(d1)');
  checkDof(d2, 'fCdf(d2)');
  if (x <= 0) return 0;
  // u = d1·x/(d1·x + d2), written so that a huge or infinite x gives u = 1, not ∞/∞.
  return betaRegularized(1 / (1 + d2 / (d1 * x)), d1 / 2, d2 / 2);
}

/**
 * The F quantile: the x with P(X ≤ x) = p for d1 and d2 degrees of freedom.
 *
 * @param p a probability, 0 < p < 1
 * @param d1 numerator degrees of freedom, > 0
 * @param d2 denominator degrees of freedom, > 0
 * @returns x ≥ 0
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad p, d1 or d2; `NOT_FINITE` when the
 *   quantile is beyond the range of a JS number (degrees of freedom near 0).
 * @example
 * ```ts
 * import { fQuantile } from 'quadspread';
 * // the 95 % a-posteriori ellipse factor √(2·F(2, r, 0.95)) for r = 3
 * Math.sqrt(2 * fQuantile(0.95, 2, 3)).toFixed(4);
 * //=> '4.3708'
 * ```
 */
export function fQuantile(p: number, d1: number, d2: number): number {
  checkProbability(p, 'fQuantile(p)');
  const a = checkDof(d1, 'fQuantile(d1)') / 2;
  const b = checkDof(d2, 'fQuantile(d2)') / 2;
  // Invert the beta distribution of u = d1·x/(d1·x + d2) in (0, 1), then x = d2·u/(d1·(1 − u)).
  const lnB = lnGamma(a) + lnGamma(b) - lnGamma(a + b);
  const pdf = (u: number): number =>
    u <= 0 || u >= 1 ? 0 : Math.exp((a - 1) * Math.log(u) + (b - 1) * Math.log(1 - u) - lnB);
  let lo = 0;
  let hi = 1;
  let u = 0.5;
  for (let i = 0; i < 400; i++) {
    const f = betaRegularized(u, a, b) - p;
    if (f === 0) break;
    if (f < 0) lo = u;
    else hi = u;
    const d = pdf(u);
    let next = d > 0 ? u - f / d : (lo + hi) / 2;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    const done = Math.abs(next - u) <= 1e-16 * Math.max(u, 1e-300) || hi - lo <= 1e-300;
    u = next;
    if (done) break;
  }
  const x = (b * 2 * u) / (a * 2 * (1 - u));
  if (!Number.isFinite(x))
    throw notFinite(
      'fQuantile(p, d1, d2)',
      `the quantile for p = ${p}, d1 = ${2 * a}, d2 = ${2 * b} is beyond the range of a JS number`,
    );
  return x;
}

/** Critical values of Baarda's w-test (data snooping). */
export interface BaardaTest {
  /** The two-sided significance level α0 of the test of one observation. */
  readonly alpha0: number;
  /** The power β0 with which a bias of the size of the MDB is detected. */
  readonly power: number;
  /** The critical value of |w|: Φ⁻¹(1 − α0/2). */
  readonly critical: number;
  /** The non-centrality λ0 = (Φ⁻¹(1 − α0/2) + Φ⁻¹(β0))². */
  readonly lambda0: number;
}

/**
 * The critical value and non-centrality of Baarda's w-test for a level α0 (two-sided) and a
 * power β0: |w| > Φ⁻¹(1 − α0/2) flags an observation, and a bias of
 * σ·√(λ0/r) (the minimal detectable bias) is found with probability β0, where
 * λ0 = (Φ⁻¹(1 − α0/2) + Φ⁻¹(β0))² (Baarda, *A testing procedure for use in geodetic
 * networks*, Netherlands Geodetic Commission, Publ. on Geodesy 2(5), 1968).
 *
 * @param alpha0 level of the test of one observation (default 0.001)
 * @param power power β0 (default 0.8)
 * @returns `{ alpha0, power, critical, lambda0 }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` unless both lie strictly between 0 and 1.
 * @example
 * ```ts
 * import { baardaTest } from 'quadspread';
 * const t = baardaTest();
 * [t.critical.toFixed(4), t.lambda0.toFixed(2)];
 * //=> ['3.2905', '17.07']
 * ```
 */
export function baardaTest(alpha0 = 0.001, power = 0.8): BaardaTest {
  checkProbability(alpha0, 'baardaTest(alpha0)');
  checkProbability(power, 'baardaTest(power)');
  const critical = normalQuantile(1 - alpha0 / 2);
  const lambda0 = (critical + normalQuantile(power)) ** 2;
  return { alpha0, power, critical, lambda0 };
}

/**
 * The critical value of Pope's τ-test for an adjustment with `dof` degrees of freedom at the
 * level α (two-sided): τ = √r·t/√(r − 1 + t²), t the Student quantile with r − 1 degrees of
 * freedom at 1 − α/2, here t² = F(1, r − 1) at 1 − α (Pope, *The statistics of residuals and
 * the detection of outliers*, NOAA Technical Report NOS 65 NGS 1, 1976).
 *
 * @param alpha level of the test of one observation, 0 < α < 1
 * @param dof the redundancy r of the adjustment, ≥ 2
 * @returns the critical value of |τ| (below √r)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad α or r < 2.
 * @example
 * ```ts
 * import { tauCritical } from 'quadspread';
 * // with many degrees of freedom τ approaches the normal critical value
 * [tauCritical(0.05, 3).toFixed(4), tauCritical(0.05, 100000).toFixed(3)];
 * //=> ['1.6454', '1.960']
 * ```
 */
export function tauCritical(alpha: number, dof: number): number {
  checkProbability(alpha, 'tauCritical(alpha)');
  if (typeof dof !== 'number' || !Number.isInteger(dof) || dof < 2 || dof > 1e7)
    throw invalidArgument('tauCritical(dof)', `${show(dof)} is not an integer r ≥ 2`);
  const t2 = fQuantile(1 - alpha, 1, dof - 1);
  return Math.sqrt((dof * t2) / (dof - 1 + t2));
}
