/**
 * Least-squares adjustment of a levelling network: heights from observed height
 * differences between benchmarks, exact in `rational`.
 *
 * @module adjustment
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import type { Root } from '../geometry/surd.js';
import { readArray } from '../cogo/internal.js';
import { solveGroups, observationStatistics } from './least-squares.js';
import type { ObservationGroup } from './least-squares.js';
import { solveNormal } from './normal-equations.js';
import { readTestOptions, assess, sigmaRoot } from './testing.js';
import type {
  TestOptions,
  GlobalTest,
  LocalTest,
  ObservationTest,
  ReadTestOptions,
} from './testing.js';
import { readName, readSigma, requireConnected } from './names.js';
import { snoop } from './snooping.js';
import type { SnoopingReport } from './snooping.js';

/** A benchmark height: a value held fixed, or `{ value, sigma }` (a weighted benchmark). */
export type BenchmarkInput<T> =
  Numeric<T> | { readonly value: Numeric<T>; readonly sigma?: Numeric<T> };

/** One observed height difference: height(to) − height(from), in metres. */
export interface LevellingObservationInput<T> {
  readonly from: string;
  readonly to: string;
  /** height(to) − height(from), m. */
  readonly difference: Numeric<T>;
  /** Length of the levelled line, m; with `options.sigmaPerKm` gives the weight. */
  readonly length?: Numeric<T>;
  /** Standard deviation of the difference, m. */
  readonly sigma?: Numeric<T>;
}

/** Options of {@link adjustLevelling}. */
export interface LevellingOptions<T> extends TestOptions<T> {
  /** σ per km of levelled line in mm/√km for length-weighted observations (default 1). */
  readonly sigmaPerKm?: Numeric<T>;
  /**
   * Where the weights come from: `'auto'` (default: `sigma` when every observation has one,
   * `length` when none has a sigma; refused when some have and some have not), `'sigma'`,
   * `'length'`, or `'mixed'` (each observation's sigma, else its length).
   */
  readonly weights?: 'auto' | 'sigma' | 'length' | 'mixed';
  /**
   * `'fixed'` (default): the benchmarks as given; `'minimal'`: only `datumPoints` (default the
   * first benchmark) held at their heights, the other benchmarks adjusted as new points;
   * `'inner'`: a free network whose datum points (default all) keep the sum of their
   * approximate heights.
   */
  readonly datum?: 'fixed' | 'minimal' | 'inner';
  /** The points of a `'minimal'` or `'inner'` datum. */
  readonly datumPoints?: readonly string[];
  /** Return the covariance matrix of the heights. */
  readonly covariance?: boolean;
  /** Iterative data snooping: remove the observation with the largest suspect |w|, adjust again. */
  readonly snooping?: boolean;
}

/** Input of {@link adjustLevelling}. */
export interface LevellingInput<T> {
  /** Benchmarks: name → height (m), or `{ value, sigma }` for a weighted benchmark. */
  readonly fixed: Readonly<Record<string, BenchmarkInput<T>>>;
  readonly observations: readonly LevellingObservationInput<T>[];
  readonly options?: LevellingOptions<T>;
}

/** An adjusted height. */
export interface AdjustedHeight<T, E extends boolean> {
  /** Height, m. */
  readonly value: T;
  /** Its standard deviation, m (0 for a held point). */
  readonly sigma: Root<T, E>;
  /** Whether the point was held fixed (part of the datum as an exact constant). */
  readonly held: boolean;
}

/** An adjusted height difference (or a weighted benchmark's pseudo-observation). */
export interface AdjustedLevelObservation<T, E extends boolean> extends ObservationTest<T, E> {
  /** `'difference'`, or `'benchmark'` for a weighted benchmark (then from = to = its name). */
  readonly kind: 'difference' | 'benchmark';
  /** Index in the input `observations`, or −1 for a benchmark. */
  readonly index: number;
  readonly from: string;
  readonly to: string;
  /** The observed value, m. */
  readonly observed: T;
  /** adjusted − observed, m. */
  readonly residual: T;
  /** The adjusted value, m. */
  readonly adjusted: T;
  /** Where the weight came from. */
  readonly weightFrom: 'sigma' | 'length';
}

/** What {@link adjustLevelling} returns. */
export interface LevellingAdjustment<T, E extends boolean> {
  readonly heights: Readonly<Record<string, AdjustedHeight<T, E>>>;
  readonly observations: AdjustedLevelObservation<T, E>[];
  /** Degrees of freedom r = observations − unknowns (+ datum defect for `'inner'`). */
  readonly dof: number;
  /** vᵀPv. */
  readonly vtpv: T;
  /** σ̂0² = vᵀPv/r (undefined when r = 0). */
  readonly varianceFactor: T | undefined;
  /** σ̂0. */
  readonly sigma0: Root<T, E> | undefined;
  /** Which variance factor scales the σ. */
  readonly scale: 'a-priori' | 'a-posteriori';
  readonly globalTest: GlobalTest<T> | undefined;
  readonly localTest: LocalTest;
  readonly datum: 'fixed' | 'minimal' | 'inner';
  /** Where the weights came from: `'sigma'`, `'length'` or `'mixed'`. */
  readonly weighting: 'sigma' | 'length' | 'mixed';
  /** The covariance of the heights (m²), rows in the order of `names`, when asked for. */
  readonly covariance?: { readonly names: string[]; readonly matrix: T[][] };
  /** What data snooping removed, when asked for. */
  readonly snooping?: SnoopingReport<T, E>;
}

interface Parsed<T> {
  readonly names: string[];
  readonly index: Map<string, number>;
  readonly given: (T | undefined)[];
  readonly benchSigma: (T | undefined)[];
  readonly obs: { from: number; to: number; d: T; q: T; by: 'sigma' | 'length' }[];
  readonly weighting: 'sigma' | 'length' | 'mixed';
  readonly o: LevellingOptions<T>;
  readonly t: ReadTestOptions<T>;
  readonly datum: 'fixed' | 'minimal' | 'inner';
  readonly datumPoints: number[] | undefined;
}

const WHERE = 'adjustLevelling(A, input)';

function parse<T>(A: Arithmetic<T>, input: LevellingInput<T>): Parsed<T> {
  expectObject(input, WHERE, '{ fixed, observations, options? }');
  const o: LevellingOptions<T> = input.options ?? {};
  expectObject(o, `${WHERE} options`, 'an options object');
  const t = readTestOptions(A, o, `${WHERE} options`);
  const fixed = input.fixed ?? {};
  expectObject(fixed, `${WHERE} fixed`, '{ name: height }');
  const names: string[] = [];
  const index = new Map<string, number>();
  const given: (T | undefined)[] = [];
  const benchSigma: (T | undefined)[] = [];
  const add = (name: string): number => {
    let i = index.get(name);
    if (i === undefined) {
      i = names.length;
      index.set(name, i);
      names.push(name);
      given.push(undefined);
      benchSigma.push(undefined);
    }
    return i;
  };
  for (const [name, b] of Object.entries(fixed)) {
    const at = `${WHERE} fixed[${JSON.stringify(name)}]`;
    readName(name, at);
    const i = add(name);
    if (b !== null && typeof b === 'object' && 'value' in b) {
      given[i] = readNumber(A, b.value, `${at}.value`);
      if (b.sigma !== undefined) benchSigma[i] = readSigma(A, b.sigma, `${at}.sigma`);
    } else given[i] = readNumber(A, b as Numeric<T>, at);
  }
  const list = readArray<LevellingObservationInput<T>>(input.observations, `${WHERE} observations`);
  const weights = o.weights ?? 'auto';
  if (!['auto', 'sigma', 'length', 'mixed'].includes(weights as string))
    throw invalidArgument(
      `${WHERE} options.weights`,
      `${show(weights)} is not 'auto', 'sigma', 'length' or 'mixed'`,
    );
  const perKm =
    o.sigmaPerKm === undefined ? A.one : readSigma(A, o.sigmaPerKm, `${WHERE} options.sigmaPerKm`);
  // σ² = (sigmaPerKm mm)²·(length/1000 km), in m²: (sigmaPerKm/1000)²·length/1000.
  const perMetre = A.div(A.mul(perKm, perKm), A.from(1_000_000_000));
  const s02 = A.mul(t.sigma0, t.sigma0);
  let withSigma = 0;
  for (const ob of list)
    if (ob !== null && typeof ob === 'object' && ob.sigma !== undefined) withSigma++;
  if (weights === 'auto' && withSigma > 0 && withSigma < list.length) {
    const i = list.findIndex(
      (ob) => ob === null || typeof ob !== 'object' || ob.sigma === undefined,
    );
    throw invalidArgument(
      `${WHERE} observations[${i}]`,
      `${withSigma} of ${list.length} observations have a sigma and this one has none: give every observation a sigma, or none (weights from length), or set options.weights to 'mixed'`,
    );
  }
  const obs: Parsed<T>['obs'] = [];
  let bySigma = 0;
  for (let k = 0; k < list.length; k++) {
    const ob = list[k]!;
    const at = `${WHERE} observations[${k}]`;
    expectObject(ob, at, '{ from, to, difference, length?, sigma? }');
    const from = add(readName(ob.from, `${at}.from`));
    const to = add(readName(ob.to, `${at}.to`));
    if (from === to)
      throw invalidArgument(at, `an observation from ${JSON.stringify(ob.from)} to itself`);
    const d = readNumber(A, ob.difference, `${at}.difference`);
    const useSigma = weights !== 'length' && ob.sigma !== undefined;
    let variance: T;
    if (useSigma) {
      const s = readSigma(A, ob.sigma!, `${at}.sigma`);
      variance = A.mul(s, s);
      bySigma++;
    } else if (weights === 'sigma') {
      throw new QuadspreadError(
        'INVALID_SIGMA',
        `${at}.sigma`,
        "missing: options.weights is 'sigma'",
      );
    } else {
      if (ob.length === undefined)
        throw invalidArgument(
          `${at}.length`,
          'the observation has neither a sigma nor a length to weight it by',
        );
      const len = readNumber(A, ob.length, `${at}.length`);
      if (A.sign(len) <= 0)
        throw invalidArgument(`${at}.length`, `${A.toString(len)} m is not positive`);
      variance = A.mul(perMetre, len);
    }
    obs.push({ from, to, d, q: A.div(variance, s02), by: useSigma ? 'sigma' : 'length' });
  }
  const weighting = bySigma === obs.length ? 'sigma' : bySigma === 0 ? 'length' : 'mixed';
  const datum = o.datum ?? 'fixed';
  if (datum !== 'fixed' && datum !== 'minimal' && datum !== 'inner')
    throw invalidArgument(
      `${WHERE} options.datum`,
      `${show(datum)} is not 'fixed', 'minimal' or 'inner'`,
    );
  let datumPoints: number[] | undefined;
  if (o.datumPoints !== undefined) {
    const dp = readArray<string>(o.datumPoints, `${WHERE} options.datumPoints`);
    datumPoints = dp.map((n, k) => {
      const i = index.get(readName(n, `${WHERE} options.datumPoints[${k}]`));
      if (i === undefined)
        throw new QuadspreadError(
          'UNKNOWN_POINT',
          `${WHERE} options.datumPoints[${k}]`,
          `${JSON.stringify(n)} is not a point of the network`,
        );
      return i;
    });
    if (datumPoints.length === 0)
      throw new QuadspreadError('DATUM_DEFECT', `${WHERE} options.datumPoints`, 'no datum points');
  }
  if (obs.length === 0 && names.length === 0)
    throw new QuadspreadError('TOO_FEW_OBSERVATIONS', `${WHERE} observations`, 'no observations');
  return { names, index, given, benchSigma, obs, weighting, o, t, datum, datumPoints };
}

/** Approximate heights: given ones, carried along the observations (breadth first). */
function approximate<T>(
  A: Arithmetic<T>,
  P: Parsed<T>,
  active: readonly boolean[],
  start: number[],
): T[] {
  const n = P.names.length;
  const h: (T | undefined)[] = new Array(n);
  const queue: number[] = [];
  for (const s of start) {
    h[s] = P.given[s] ?? A.zero;
    queue.push(s);
  }
  const adj: { to: number; d: T }[][] = Array.from({ length: n }, () => []);
  P.obs.forEach((ob, k) => {
    if (!active[k]) return;
    adj[ob.from]!.push({ to: ob.to, d: ob.d });
    adj[ob.to]!.push({ to: ob.from, d: A.neg(ob.d) });
  });
  for (let q = 0; q < queue.length; q++) {
    const u = queue[q]!;
    for (const e of adj[u]!)
      if (h[e.to] === undefined) {
        h[e.to] = P.given[e.to] ?? A.add(h[u]!, e.d);
        queue.push(e.to);
      }
  }
  return h.map((x) => x ?? A.zero);
}

function adjustOnce<T, E extends boolean>(
  A: Arithmetic<T, E>,
  P: Parsed<T>,
  active: readonly boolean[],
): LevellingAdjustment<T, E> & { w2: (T | undefined)[] } {
  const n = P.names.length;
  const { datum } = P;
  // Held points (exact constants) and weighted benchmarks.
  let held: number[];
  let weighted: number[] = [];
  let innerSet: number[] | undefined;
  if (datum === 'fixed') {
    held = [];
    for (let i = 0; i < n; i++)
      if (P.given[i] !== undefined) (P.benchSigma[i] === undefined ? held : weighted).push(i);
    if (held.length === 0 && weighted.length === 0)
      throw new QuadspreadError(
        'DATUM_DEFECT',
        `${WHERE} fixed`,
        "no benchmark: give at least one height, or use options.datum 'inner'",
      );
  } else if (datum === 'minimal') {
    const first = P.given.findIndex((g) => g !== undefined);
    held = P.datumPoints ?? (first >= 0 ? [first] : []);
    if (held.length === 0)
      throw new QuadspreadError(
        'DATUM_DEFECT',
        `${WHERE} options.datumPoints`,
        'a minimal datum needs a point with a height in fixed',
      );
    for (const i of held)
      if (P.given[i] === undefined)
        throw new QuadspreadError(
          'DATUM_DEFECT',
          `${WHERE} options.datumPoints`,
          `${JSON.stringify(P.names[i])} has no height in fixed to be held at`,
        );
  } else {
    innerSet = P.datumPoints ?? [...Array(n).keys()];
    held = [innerSet[0]!];
  }
  const edges: number[][] = [];
  P.obs.forEach((ob, k) => {
    if (active[k]) edges.push([ob.from, ob.to]);
  });
  requireConnected(P.names, edges, [...held, ...weighted], WHERE);
  // Approximate heights: from every point with a given height (the held point of an inner
  // datum without any given height starts at 0).
  const starts: number[] = [];
  for (let i = 0; i < n; i++) if (P.given[i] !== undefined) starts.push(i);
  if (starts.length === 0) starts.push(held[0]!);
  const approx = approximate(A, P, active, starts);
  const isHeld = new Uint8Array(n);
  for (const i of held) isHeld[i] = 1;
  const unknown = new Int32Array(n).fill(-1);
  const unknowns: number[] = [];
  for (let i = 0; i < n; i++)
    if (!isHeld[i]) {
      unknown[i] = unknowns.length;
      unknowns.push(i);
    }
  if (datum !== 'fixed') weighted = [];
  // Observation groups (one observation each).
  const groups: ObservationGroup<T>[] = [];
  const meta: {
    kind: 'difference' | 'benchmark';
    index: number;
    from: number;
    to: number;
    observed: T;
    by: 'sigma' | 'length';
  }[] = [];
  const one = A.one;
  const minus = A.neg(A.one);
  P.obs.forEach((ob, k) => {
    if (!active[k]) return;
    const idx: number[] = [];
    const row: T[] = [];
    if (unknown[ob.to]! >= 0) {
      idx.push(unknown[ob.to]!);
      row.push(one);
    }
    if (unknown[ob.from]! >= 0) {
      idx.push(unknown[ob.from]!);
      row.push(minus);
    }
    const l = A.sub(ob.d, A.sub(approx[ob.to]!, approx[ob.from]!));
    groups.push({
      index: idx,
      rows: [row],
      cofactor: [[ob.q]],
      weight: [[A.div(one, ob.q)]],
      l: [l],
    });
    meta.push({
      kind: 'difference',
      index: k,
      from: ob.from,
      to: ob.to,
      observed: ob.d,
      by: ob.by,
    });
  });
  const s02 = A.mul(P.t.sigma0, P.t.sigma0);
  for (const i of weighted) {
    const s = P.benchSigma[i]!;
    const q = A.div(A.mul(s, s), s02);
    groups.push({
      index: [unknown[i]!],
      rows: [[one]],
      cofactor: [[q]],
      weight: [[A.div(one, q)]],
      l: [A.sub(P.given[i]!, approx[i]!)],
    });
    meta.push({ kind: 'benchmark', index: -1, from: i, to: i, observed: P.given[i]!, by: 'sigma' });
  }
  const u = unknowns.length;
  const tolerance = A.exact ? A.zero : A.from('1e-13');
  const sol = solveGroups(A, u, groups, tolerance);
  if ('singular' in sol)
    throw new QuadspreadError(
      'SINGULAR_NETWORK',
      WHERE,
      `the observations do not determine the height of ${JSON.stringify(P.names[unknowns[sol.singular]!])} (weights too far apart for ${A.name}?)`,
    );
  const { dx, factor, inverse } = sol;
  const Q = (i: number, j: number): T => inverse.get(i, j) ?? A.zero;
  const { stats, vtpv } = observationStatistics(A, groups, dx, Q);
  const dof = groups.length - u + (datum === 'inner' ? 0 : 0);
  const flat = stats.map((s) => s[0]!);
  const a = assess(A, flat, vtpv, dof, P.t);
  // Heights, and for an inner datum the S-transformation of the minimal solution: shift by the
  // mean correction over the datum points, Q' = Q − u·1ᵀ/s − 1·uᵀ/s + (gᵀu)/s², u = Q·g
  // (Baarda, *S-transformations and criterion matrices*, Netherlands Geodetic Commission,
  // Publ. on Geodesy 5(1), 1973 — from memory).
  const value: T[] = approx.map((h, i) => (unknown[i]! >= 0 ? A.add(h, dx[unknown[i]!]!) : h));
  const qdiag: T[] = new Array(n);
  for (let i = 0; i < n; i++) qdiag[i] = unknown[i]! >= 0 ? inverse.diagonal[unknown[i]!]! : A.zero;
  let uvec: T[] | undefined;
  let gtu = A.zero;
  let sCount = A.one;
  if (innerSet !== undefined) {
    const g: T[] = new Array(u).fill(A.zero);
    for (const i of innerSet) if (unknown[i]! >= 0) g[unknown[i]!] = A.one;
    const uu = solveNormal(A, factor, g);
    uvec = new Array(n);
    for (let i = 0; i < n; i++) uvec[i] = unknown[i]! >= 0 ? uu[unknown[i]!]! : A.zero;
    let shift = A.zero;
    for (const i of innerSet) {
      shift = A.add(shift, A.sub(approx[i]!, value[i]!));
      gtu = A.add(gtu, uvec[i]!);
    }
    sCount = A.from(innerSet.length);
    shift = A.div(shift, sCount);
    const two = A.from(2);
    const c = A.div(gtu, A.mul(sCount, sCount));
    for (let i = 0; i < n; i++) {
      value[i] = A.add(value[i]!, shift);
      qdiag[i] = A.add(A.sub(qdiag[i]!, A.div(A.mul(two, uvec[i]!), sCount)), c);
    }
  }
  const heights: Record<string, AdjustedHeight<T, E>> = {};
  for (let i = 0; i < n; i++) {
    const isFixed = innerSet === undefined && isHeld[i] === 1;
    heights[P.names[i]!] = {
      value: value[i]!,
      sigma: sigmaRoot(A, a.factor, qdiag[i]!),
      held: isFixed,
    };
  }
  const observations = meta.map((m, k): AdjustedLevelObservation<T, E> => {
    const s = flat[k]!;
    return {
      kind: m.kind,
      index: m.index,
      from: P.names[m.from]!,
      to: P.names[m.to]!,
      observed: m.observed,
      residual: s.v,
      adjusted: A.add(m.observed, s.v),
      weightFrom: m.by,
      ...a.observations[k]!,
    };
  });
  const w2 = a.observations.map((t, k) =>
    t.standardized === undefined ? undefined : A.div(A.mul(flat[k]!.v, flat[k]!.v), flat[k]!.qvv),
  );
  let covariance: LevellingAdjustment<T, E>['covariance'];
  if (P.o.covariance === true) {
    const rows = innerSet === undefined ? unknowns : [...Array(n).keys()];
    const full: T[][] = [];
    const cols = new Map<number, T[]>();
    for (const i of unknowns) {
      const e: T[] = new Array(u).fill(A.zero);
      e[unknown[i]!] = A.one;
      cols.set(i, solveNormal(A, factor, e));
    }
    const c = innerSet === undefined ? A.zero : A.div(gtu, A.mul(sCount, sCount));
    for (const i of rows) {
      const row: T[] = [];
      for (const j of rows) {
        let q = unknown[i]! >= 0 && unknown[j]! >= 0 ? cols.get(j)![unknown[i]!]! : A.zero;
        if (uvec !== undefined)
          q = A.add(A.sub(A.sub(q, A.div(uvec[i]!, sCount)), A.div(uvec[j]!, sCount)), c);
        row.push(A.mul(a.factor, q));
      }
      full.push(row);
    }
    covariance = { names: rows.map((i) => P.names[i]!), matrix: full };
  }
  return {
    heights,
    observations,
    dof,
    vtpv,
    varianceFactor: a.varianceFactor,
    sigma0: a.sigma0,
    scale: a.scale,
    globalTest: a.globalTest,
    localTest: a.localTest,
    datum,
    weighting: P.weighting,
    ...(covariance ? { covariance } : {}),
    w2,
  };
}

/**
 * Adjusts a levelling network by least squares: the heights of its points from observed
 * height differences and benchmark heights, with standard deviations, residuals, redundancy
 * numbers, Baarda's w-test (or Pope's τ-test), minimal detectable biases, the variance factor
 * and the global test.
 *
 * Model: for each observation, h(to) − h(from) = difference + v, weight p = σ0²/σ²; σ from
 * `sigma`, or σ² = (sigmaPerKm/1000)²·length/1000 m² (heights, residuals and redundancy
 * numbers do not depend on sigmaPerKm). A weighted benchmark adds the pseudo-observation
 * h = value with its sigma. The normal equations are solved by a sparse L·D·Lᵀ in minimum-
 * degree order, and the σ come from the entries of N⁻¹ on the factor's pattern: exact in
 * `rational` (heights, residuals, vᵀPv, variance factor, cofactors and redundancy numbers are
 * fractions; σ, w and MDB are surds), with digit growth polynomial in the size of the network.
 *
 * Scaling: σ̂0² = vᵀPv/r is the variance factor; σ are a-posteriori (σ̂0·√q) unless
 * `options.scale` is `'a-priori'`. w uses the a-priori σ0: w = v/(σ0·√q_vv), flagged when
 * |w| > Φ⁻¹(1 − α0/2) (3.2905 at α0 = 0.001). The global test compares vᵀPv/σ0² with χ²(r)
 * at α/2 and 1 − α/2.
 *
 * A computational aid: an adjustment does not replace independent checks; control and
 * acceptance follow local standards and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ fixed, observations, options? }`, see {@link LevellingInput}
 * @returns heights, observations, dof, variance factor, tests; see {@link LevellingAdjustment}
 * @throws {QuadspreadError} `DATUM_DEFECT` with no benchmark (datum 'fixed') or no height for a
 * minimal datum; `DISCONNECTED_NETWORK` naming points no observation joins to the datum;
 * `UNKNOWN_POINT` for a datum point not in the network; `INVALID_SIGMA` for a sigma ≤ 0;
 * `INVALID_ARGUMENT` for an observation from a point to itself, a length ≤ 0, weights mixed
 * without saying so, bad options; `SINGULAR_NETWORK`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, adjustLevelling } from 'quadspread';
 * // a loop A → B → C → A that misses closure by 3 mm, equal weights
 * const r = adjustLevelling(rational, {
 *   fixed: { A: 100 },
 *   observations: [
 *     { from: 'A', to: 'B', difference: '1.001', sigma: '0.001' },
 *     { from: 'B', to: 'C', difference: '2.001', sigma: '0.001' },
 *     { from: 'C', to: 'A', difference: '-2.999', sigma: '0.001' },
 *   ],
 * });
 * [rational.toString(r.heights.B!.value), rational.toString(r.observations[0]!.residual), rational.toString(r.observations[0]!.redundancy), r.dof];
 * //=> ['101', '-1/1000', '1/3', 1]
 * ```
 */
export function adjustLevelling<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: LevellingInput<T>,
): LevellingAdjustment<T, E> {
  checkArithmetic(A, 'adjustLevelling');
  const P = parse(A, input);
  const active = P.obs.map(() => true);
  if (P.o.snooping === true) {
    const { result, report } = snoop(
      A,
      active,
      (act) => adjustOnce(A, P, act),
      (r, k) => (r.observations[k]!.kind === 'difference' ? r.observations[k]!.index : -1),
    );
    const { w2: _w, ...rest } = result;
    void _w;
    return { ...rest, snooping: report };
  }
  const { w2: _w, ...rest } = adjustOnce(A, P, active);
  void _w;
  return rest;
}
