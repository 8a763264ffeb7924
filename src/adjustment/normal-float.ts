/**
 * Float twins of the normal-equation kernels (src/adjustment/normal-equations.ts): the same
 * operations, in the same order, on plain numbers, so that an adjustment in `float` through
 * the generic entry does not pay a call through the arithmetic object per flop (the generic
 * code's `A.mul`/`A.add` calls go megamorphic once several arithmetics have run in the
 * process). Each returns `undefined` where a value stops being finite: the generic code
 * (whose float operations refuse a result that is not finite) then runs from the start and
 * reports it. The property tests (test/perf/normal-float.test.ts) check the twins bit for bit
 * against the generic code in float.
 *
 * @module adjustment
 * @internal
 */
import type { NormalFactor, NormalSystem, SingularPivot } from './normal-equations.js';
import type { ObservationGroup, ObservationStatistics } from './least-squares.js';

/**
 * Accumulates every group into N as addObservation/addGroup do, or returns false (N then
 * holds part of the sums: the caller starts again from an empty system).
 * @internal
 */
export function accumulateFloat(
  N: NormalSystem<number>,
  groups: readonly ObservationGroup<number>[],
): boolean {
  const rhs = N.rhs;
  const cols = N.cols;
  for (const g of groups) {
    const index = g.index;
    const k = index.length;
    if (g.rows.length === 1) {
      // addObservation: N += p·aᵀa, b += p·aᵀl.
      const coef = g.rows[0]!;
      const p = g.weight[0]![0]!;
      const l = g.l[0]!;
      for (let s = 0; s < k; s++) {
        const pa = p * coef[s]!;
        const i = index[s]!;
        const b = rhs[i]! + pa * l;
        if (b - b !== 0) return false;
        rhs[i] = b;
        for (let t = s; t < k; t++)
          if (!addAtFloat(cols, i, index[t]!, pa * coef[t]!)) return false;
      }
    } else {
      // addGroup: N += AᵀPA, b += AᵀPl.
      const rows = g.rows;
      const P = g.weight;
      const lv = g.l;
      const m = rows.length;
      for (let s = 0; s < k; s++) {
        const atp: number[] = new Array(m);
        for (let r = 0; r < m; r++) {
          let sum = 0;
          for (let q = 0; q < m; q++) sum = sum + rows[q]![s]! * P[q]![r]!;
          atp[r] = sum;
        }
        let b = 0;
        for (let r = 0; r < m; r++) b = b + atp[r]! * lv[r]!;
        const i = index[s]!;
        const bi = rhs[i]! + b;
        if (bi - bi !== 0) return false;
        rhs[i] = bi;
        for (let t = s; t < k; t++) {
          let v = 0;
          for (let r = 0; r < m; r++) v = v + atp[r]! * rows[r]![t]!;
          if (!addAtFloat(cols, i, index[t]!, v)) return false;
        }
      }
    }
  }
  return true;
}

// Every value added is checked where it is stored: a sum that is finite had finite terms.
function addAtFloat(cols: Map<number, number>[], i: number, j: number, v: number): boolean {
  const r = i <= j ? i : j;
  const c = i <= j ? j : i;
  const col = cols[c]!;
  const old = col.get(r);
  const s = old === undefined ? v : old + v;
  if (s - s !== 0) return false;
  col.set(r, s);
  return true;
}

/**
 * The numeric factorisation of factorNormal on numbers, given its symbolic part; undefined
 * where a value is not finite.
 * @internal
 */
export function factorNumericFloat(
  n: number,
  perm: Int32Array,
  inv: Int32Array,
  Cp: Int32Array,
  Ci: Int32Array,
  Cx: readonly number[],
  parent: Int32Array,
  flag: Int32Array,
  Lnz: Int32Array,
  Lp: Int32Array,
  tolerance: number,
): NormalFactor<number> | SingularPivot | undefined {
  const Li = new Int32Array(Lp[n]!);
  const Lx: number[] = new Array(Lp[n]!);
  const D: number[] = new Array(n);
  const Y = new Float64Array(n);
  const pattern = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let top = n;
    flag[k] = k;
    Lnz[k] = 0;
    let diag = 0;
    for (let p = Cp[k]!; p < Cp[k + 1]!; p++) {
      let i = Ci[p]!;
      Y[i] = Y[i]! + Cx[p]!;
      if (i === k) diag = diag + Cx[p]!;
      let len = 0;
      for (; flag[i] !== k; i = parent[i]!) {
        pattern[len++] = i;
        flag[i] = k;
      }
      while (len > 0) pattern[--top] = pattern[--len]!;
    }
    let d = Y[k]!;
    Y[k] = 0;
    for (; top < n; top++) {
      const i = pattern[top]!;
      const yi = Y[i]!;
      Y[i] = 0;
      const p2 = Lp[i]! + Lnz[i]!;
      for (let p = Lp[i]!; p < p2; p++) Y[Li[p]!] = Y[Li[p]!]! - Lx[p]! * yi;
      // Every update of Y reaches some yi or d of this column (the rows of column i are in
      // the pattern of row k): checking lki and d catches any value that stopped being finite.
      const lki = yi / D[i]!;
      if (lki - lki !== 0) return undefined;
      d = d - lki * yi;
      Li[p2] = k;
      Lx[p2] = lki;
      Lnz[i]!++;
    }
    const bound = tolerance * diag;
    if (d - d !== 0 || bound - bound !== 0) return undefined;
    if (d <= 0 || d <= bound) return { singular: perm[k]! };
    D[k] = d;
  }
  return { n, perm, inv, Lp, Li, Lx, D };
}

/**
 * solveNormal on numbers; undefined where a value is not finite (each one reaches x: the
 * divisors D are finite and positive, so nothing that is not finite is absorbed).
 * @internal
 */
export function solveNormalFloat(
  F: NormalFactor<number>,
  b: readonly number[],
): number[] | undefined {
  const n = F.n;
  const { perm, Lp, Li, Lx, D } = F;
  const y: number[] = new Array(n);
  for (let k = 0; k < n; k++) y[k] = b[perm[k]!]!;
  for (let j = 0; j < n; j++) {
    const yj = y[j]!;
    if (yj === 0) continue;
    for (let p = Lp[j]!; p < Lp[j + 1]!; p++) y[Li[p]!] = y[Li[p]!]! - Lx[p]! * yj;
  }
  for (let j = 0; j < n; j++) y[j] = y[j]! / D[j]!;
  for (let j = n - 1; j >= 0; j--) {
    let s = y[j]!;
    for (let p = Lp[j]!; p < Lp[j + 1]!; p++) s = s - Lx[p]! * y[Li[p]!]!;
    y[j] = s;
  }
  const x: number[] = new Array(n);
  for (let k = 0; k < n; k++) {
    const v = y[k]!;
    if (v - v !== 0) return undefined;
    x[perm[k]!] = v;
  }
  return x;
}

/**
 * The recurrences of selectedInverse on numbers: Zx, Zd and the diagonal in the original
 * numbering, in arrays made here (of numbers); `undefined` where a value is not finite (every
 * intermediate is summed into an entry of Zx or Zd, all checked).
 * @internal
 */
export function selectedInverseFloat(
  F: NormalFactor<number>,
): { Zx: number[]; Zd: number[]; diagonal: number[] } | undefined {
  const n = F.n;
  const { Lp, Li, Lx, D } = F;
  const Zx: number[] = new Array(Lp[n]!);
  const Zd: number[] = new Array(n);
  const mark = new Int32Array(n).fill(-1);
  const acc: number[] = [];
  for (let j = n - 1; j >= 0; j--) {
    const p0 = Lp[j]!;
    const m = Lp[j + 1]! - p0;
    for (let b = 0; b < m; b++) {
      mark[Li[p0 + b]!] = b;
      acc[b] = 0;
    }
    for (let b = 0; b < m; b++) {
      const k = Li[p0 + b]!;
      const lkj = Lx[p0 + b]!;
      acc[b] = acc[b]! + Zd[k]! * lkj;
      for (let p = Lp[k]!; p < Lp[k + 1]!; p++) {
        const c = mark[Li[p]!]!;
        if (c < 0) continue;
        acc[c] = acc[c]! + Zx[p]! * lkj;
        acc[b] = acc[b]! + Zx[p]! * Lx[p0 + c]!;
      }
    }
    let zjj = 1 / D[j]!;
    for (let b = 0; b < m; b++) {
      const a = acc[b]!;
      if (a - a !== 0) return undefined;
      Zx[p0 + b] = -a;
      zjj = zjj + Lx[p0 + b]! * a;
      mark[Li[p0 + b]!] = -1;
    }
    if (zjj - zjj !== 0) return undefined;
    Zd[j] = zjj;
  }
  const diagonal: number[] = new Array(n);
  for (let k = 0; k < n; k++) diagonal[F.perm[k]!] = Zd[k]!;
  return { Zx, Zd, diagonal };
}

/**
 * observationStatistics on numbers: the residuals, cofactors and redundancy numbers of every
 * group and vᵀPv, the same sums in the same order, in arrays made here; `undefined` where a
 * value is not finite (every intermediate flows into a stored value, all checked: a group's
 * residuals before its cofactors are asked for, the rest at the end of the group).
 * @internal
 */
export function observationStatisticsFloat(
  groups: readonly ObservationGroup<number>[],
  dx: readonly number[],
  cofactorOf: (i: number, j: number) => number,
): { stats: ObservationStatistics<number>[][]; vtpv: number } | undefined {
  let vtpv = 0;
  let z = 0;
  const stats: ObservationStatistics<number>[][] = [];
  for (const g of groups) {
    const m = g.rows.length;
    const k = g.index.length;
    const v: number[] = new Array(m);
    for (let r = 0; r < m; r++) {
      const row = g.rows[r]!;
      let s = -g.l[r]!;
      for (let c = 0; c < k; c++) s = s + row[c]! * dx[g.index[c]!]!;
      v[r] = s;
      z += s * 0;
    }
    // (checked before this group's cofactorOf calls and after each group: the generic code
    // would have refused a value that is not finite before it asked for another cofactor)
    if (z !== 0) return undefined;
    // Q of the group's unknowns (k × k, row by row), then A·Q·Aᵀ (m × m).
    const Q: number[] = new Array(k * k);
    for (let a = 0; a < k; a++)
      for (let b = 0; b < k; b++)
        Q[a * k + b] = b < a ? Q[b * k + a]! : cofactorOf(g.index[a]!, g.index[b]!);
    const AQ: number[] = new Array(m * k);
    for (let r = 0; r < m; r++) {
      const row = g.rows[r]!;
      for (let b = 0; b < k; b++) {
        let s = 0;
        for (let a = 0; a < k; a++) s = s + row[a]! * Q[a * k + b]!;
        AQ[r * k + b] = s;
      }
    }
    const Qvv: number[] = new Array(m * m);
    const qadj: number[] = new Array(m);
    for (let r = 0; r < m; r++) {
      for (let t = 0; t < m; t++) {
        const row = g.rows[t]!;
        let s = 0;
        for (let b = 0; b < k; b++) s = s + AQ[r * k + b]! * row[b]!;
        if (r === t) qadj[r] = s;
        Qvv[r * m + t] = g.cofactor[r]![t]! - s;
      }
    }
    const out: ObservationStatistics<number>[] = [];
    for (let r = 0; r < m; r++) {
      let red = 0;
      let pv = 0;
      for (let t = 0; t < m; t++) {
        red = red + Qvv[r * m + t]! * g.weight[t]![r]!;
        pv = pv + g.weight[r]![t]! * v[t]!;
      }
      vtpv = vtpv + v[r]! * pv;
      const qvv = Qvv[r * m + r]!;
      z += qadj[r]! * 0 + qvv * 0 + red * 0;
      out.push({ v: v[r]!, qll: g.cofactor[r]![r]!, qadj: qadj[r]!, qvv, redundancy: red });
    }
    if (z !== 0 || vtpv - vtpv !== 0) return undefined;
    stats.push(out);
  }
  return { stats, vtpv };
}
