/**
 * The linear least-squares step shared by the levelling and plane-network adjustments
 * (Gauss–Markov model): given observation groups with design rows, cofactor matrices and
 * reduced observations, the corrections dx = N⁻¹AᵀPl, the residuals v = A·dx − l, vᵀPv, and
 * for every observation the cofactors q_l̂l̂ = (A·Q·Aᵀ)ᵢᵢ and q_vv = (Q_ll − A·Q·Aᵀ)ᵢᵢ and the
 * redundancy number rᵢ = (Q_vv·P)ᵢᵢ (e.g. Ghilani & Wolf, *Adjustment Computations*, 4th ed.
 * 2006, ch. 11 and 21; Koch, *Parameter Estimation and Hypothesis Testing in Linear Models*,
 * 2nd ed. 1999, §3.2).
 *
 * @module adjustment
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import {
  normalSystem,
  addObservation,
  addGroup,
  minimumDegreeOrder,
  factorNormal,
  solveNormal,
  selectedInverse,
} from './normal-equations.js';
import type { NormalFactor, NormalSystem, SelectedInverse } from './normal-equations.js';
import { accumulateFloat, observationStatisticsFloat } from './normal-float.js';

/** A group of m observations (m = 1 for an uncorrelated one). @internal */
export interface ObservationGroup<T> {
  /** The unknowns the group's rows touch. */
  readonly index: readonly number[];
  /** m design rows over `index`. */
  readonly rows: readonly (readonly T[])[];
  /** The m × m cofactor matrix Q_ll (covariance / σ0²). */
  readonly cofactor: readonly (readonly T[])[];
  /** The m × m weight matrix P = Q_ll⁻¹. */
  readonly weight: readonly (readonly T[])[];
  /** Reduced observations l = observed − computed at the approximate values (m). */
  readonly l: readonly T[];
}

/** The solution of one linear step. @internal */
export interface LinearSolution<T> {
  readonly dx: T[];
  readonly factor: NormalFactor<T>;
  readonly inverse: SelectedInverse<T>;
}

/** Per-observation results of a linear step. @internal */
export interface ObservationStatistics<T> {
  readonly v: T;
  /** Q_ll diagonal entry. */
  readonly qll: T;
  /** (A·Q·Aᵀ) diagonal entry. */
  readonly qadj: T;
  /** Q_vv diagonal entry. */
  readonly qvv: T;
  /** Redundancy number. */
  readonly redundancy: T;
}

/**
 * The elimination order of the last system solved with this memo and that system's pattern:
 * the iterations of a Gauss–Newton adjustment solve systems of one pattern, whose
 * minimum-degree order (a third of a float network adjustment's time) is then computed once.
 * @internal
 */
export interface OrderMemo {
  pattern?: Int32Array;
  perm?: Int32Array;
}

/** The pattern of N as column sizes then row numbers, in the order the columns hold them. */
function patternOf(n: number, cols: readonly Map<number, unknown>[]): Int32Array {
  let size = n;
  for (let j = 0; j < n; j++) size += cols[j]!.size;
  const out = new Int32Array(size);
  let at = n;
  for (let j = 0; j < n; j++) {
    out[j] = cols[j]!.size;
    for (const i of cols[j]!.keys()) out[at++] = i;
  }
  return out;
}

/** minimumDegreeOrder(n, cols), or the memo's order when the memo's pattern is cols'. */
function orderOf(n: number, cols: readonly Map<number, unknown>[], memo?: OrderMemo): Int32Array {
  if (!memo) return minimumDegreeOrder(n, cols);
  const pattern = patternOf(n, cols);
  const old = memo.pattern;
  if (memo.perm && old && old.length === pattern.length) {
    let same = true;
    for (let k = 0; k < pattern.length; k++)
      if (old[k] !== pattern[k]) {
        same = false;
        break;
      }
    if (same) return memo.perm;
  }
  memo.pattern = pattern;
  memo.perm = minimumDegreeOrder(n, cols);
  return memo.perm;
}

/**
 * Forms and factors the normal equations of `groups` over n unknowns and solves them; or
 * returns `{ singular }` naming the unknown whose pivot vanished. @internal
 */
export function solveGroups<T>(
  A: Arithmetic<T>,
  n: number,
  groups: readonly ObservationGroup<T>[],
  tolerance: T,
  order?: OrderMemo,
): LinearSolution<T> | { singular: number } {
  let N = normalSystem(A, n);
  // In float, the twin (the same operations on numbers; docs/performance.md); where it stops
  // (a sum not finite) the generic code starts again and reports it.
  const twin =
    A.float64 === true &&
    accumulateFloat(
      N as unknown as NormalSystem<number>,
      groups as unknown as readonly ObservationGroup<number>[],
    );
  if (!twin) {
    if (A.float64 === true) N = normalSystem(A, n);
    for (const g of groups) {
      if (g.rows.length === 1) addObservation(A, N, g.index, g.rows[0]!, g.weight[0]![0]!, g.l[0]!);
      else addGroup(A, N, g.index, g.rows, g.weight, g.l);
    }
  }
  const perm = orderOf(n, N.cols, order);
  const factor = factorNormal(A, N, perm, tolerance);
  if ('singular' in factor) return factor;
  const dx = solveNormal(A, factor, N.rhs);
  return { dx, factor, inverse: selectedInverse(A, factor) };
}

/**
 * Residuals, cofactors and redundancy numbers of every observation, group by group, and
 * vᵀPv. `cofactorOf(i, j)` gives Q[i][j] of the unknowns (from the selected inverse, or
 * transformed to another datum). @internal
 */
export function observationStatistics<T>(
  A: Arithmetic<T>,
  groups: readonly ObservationGroup<T>[],
  dx: readonly T[],
  cofactorOf: (i: number, j: number) => T,
): { stats: ObservationStatistics<T>[][]; vtpv: T } {
  if (A.float64 === true) {
    // the twin; where a value is not finite, the generic code below reports it
    const f = observationStatisticsFloat(
      groups as unknown as readonly ObservationGroup<number>[],
      dx as unknown as readonly number[],
      cofactorOf as unknown as (i: number, j: number) => number,
    );
    if (f !== undefined) return f as unknown as { stats: ObservationStatistics<T>[][]; vtpv: T };
  }
  let vtpv = A.zero;
  const stats: ObservationStatistics<T>[][] = [];
  for (const g of groups) {
    const m = g.rows.length;
    const k = g.index.length;
    const v: T[] = new Array(m);
    for (let r = 0; r < m; r++) {
      let s = A.neg(g.l[r]!);
      for (let c = 0; c < k; c++) s = A.add(s, A.mul(g.rows[r]![c]!, dx[g.index[c]!]!));
      v[r] = s;
    }
    // Q of the group's unknowns, then A·Q·Aᵀ (m × m).
    const Q: T[][] = [];
    for (let a = 0; a < k; a++) {
      Q.push([]);
      for (let b = 0; b < k; b++)
        Q[a]!.push(b < a ? Q[b]![a]! : cofactorOf(g.index[a]!, g.index[b]!));
    }
    const AQ: T[][] = [];
    for (let r = 0; r < m; r++) {
      AQ.push([]);
      for (let b = 0; b < k; b++) {
        let s = A.zero;
        for (let a = 0; a < k; a++) s = A.add(s, A.mul(g.rows[r]![a]!, Q[a]![b]!));
        AQ[r]!.push(s);
      }
    }
    const Qvv: T[][] = [];
    const qadj: T[] = [];
    for (let r = 0; r < m; r++) {
      Qvv.push([]);
      for (let t = 0; t < m; t++) {
        let s = A.zero;
        for (let b = 0; b < k; b++) s = A.add(s, A.mul(AQ[r]![b]!, g.rows[t]![b]!));
        if (r === t) qadj[r] = s;
        Qvv[r]!.push(A.sub(g.cofactor[r]![t]!, s));
      }
    }
    const out: ObservationStatistics<T>[] = [];
    for (let r = 0; r < m; r++) {
      let red = A.zero;
      let pv = A.zero;
      for (let t = 0; t < m; t++) {
        red = A.add(red, A.mul(Qvv[r]![t]!, g.weight[t]![r]!));
        pv = A.add(pv, A.mul(g.weight[r]![t]!, v[t]!));
      }
      vtpv = A.add(vtpv, A.mul(v[r]!, pv));
      out.push({
        v: v[r]!,
        qll: g.cofactor[r]![r]!,
        qadj: qadj[r]!,
        qvv: Qvv[r]![r]!,
        redundancy: red,
      });
    }
    stats.push(out);
  }
  return { stats, vtpv };
}
