/**
 * Sparse symmetric positive definite systems over any arithmetic: the normal equations of a
 * least-squares adjustment. Accumulate AᵀPA and AᵀPl one observation (or one correlated
 * group) at a time, order the unknowns by minimum degree, factor N = L·D·Lᵀ without square
 * roots, solve, and compute the entries of N⁻¹ on the pattern of L (selected inversion) —
 * which include the diagonal and every pair of unknowns that share an observation, all an
 * adjustment needs for standard deviations and redundancy numbers.
 *
 * Generic and reusable: unknowns are numbered 0 … n − 1; nothing here knows about surveys.
 *
 * Exactness and cost: in an exact arithmetic every operation is exact; each entry of L and
 * D is a ratio of two minors of N (Gaussian elimination computes those ratios, reduced), so
 * the digits grow polynomially with n, not exponentially (Edmonds, "Systems of distinct
 * representatives and linear algebra", J. Res. NBS 71B, 1967). The work is that of the
 * factor: Σ over columns of (entries in the column)², small for the sparse networks of
 * survey practice once ordered by minimum degree.
 *
 * @module adjustment
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { factorNumericFloat, solveNormalFloat, selectedInverseFloat } from './normal-float.js';

/** Normal equations N·x = b being accumulated: N's upper triangle by column, and b. */
export interface NormalSystem<T> {
  /** The number of unknowns. */
  readonly n: number;
  /** cols[j]: the entries N[i][j] for i ≤ j, keyed by i. */
  readonly cols: Map<number, T>[];
  /** The right-hand side b. */
  readonly rhs: T[];
}

/** An L·D·Lᵀ factor of a permuted normal matrix. */
export interface NormalFactor<T> {
  readonly n: number;
  /** perm[k]: the unknown eliminated k-th; inv[perm[k]] = k. */
  readonly perm: Int32Array;
  readonly inv: Int32Array;
  /** Column pointers, row indices (ascending within a column) and values of L below the diagonal. */
  readonly Lp: Int32Array;
  readonly Li: Int32Array;
  readonly Lx: T[];
  /** The pivots D. */
  readonly D: T[];
}

/** The entries of N⁻¹ on the pattern of L. */
export interface SelectedInverse<T> {
  /** N⁻¹[i][j] for unknowns i, j (original numbering); `undefined` off the pattern. */
  get(i: number, j: number): T | undefined;
  /** The diagonal of N⁻¹, in the original numbering. */
  readonly diagonal: T[];
}

/**
 * An empty system of n unknowns.
 * @internal
 */
export function normalSystem<T>(A: Arithmetic<T>, n: number): NormalSystem<T> {
  const cols: Map<number, T>[] = new Array(n);
  const rhs: T[] = new Array(n);
  for (let j = 0; j < n; j++) {
    cols[j] = new Map();
    rhs[j] = A.zero;
  }
  return { n, cols, rhs };
}

function addAt<T>(A: Arithmetic<T>, N: NormalSystem<T>, i: number, j: number, v: T): void {
  const r = i <= j ? i : j;
  const c = i <= j ? j : i;
  const col = N.cols[c]!;
  const old = col.get(r);
  col.set(r, old === undefined ? v : A.add(old, v));
}

/**
 * Adds one observation with design row a (coefficients `coef` of unknowns `index`), weight p
 * and reduced observation l: N += p·aᵀa, b += p·aᵀl.
 * @internal
 */
export function addObservation<T>(
  A: Arithmetic<T>,
  N: NormalSystem<T>,
  index: readonly number[],
  coef: readonly T[],
  p: T,
  l: T,
): void {
  for (let s = 0; s < index.length; s++) {
    const pa = A.mul(p, coef[s]!);
    const i = index[s]!;
    N.rhs[i] = A.add(N.rhs[i]!, A.mul(pa, l));
    for (let t = s; t < index.length; t++) addAt(A, N, i, index[t]!, A.mul(pa, coef[t]!));
  }
}

/**
 * Adds a group of m correlated observations: design rows `rows` (m rows over the unknowns
 * `index`), weight matrix P (m × m, symmetric) and reduced observations l:
 * N += AᵀPA, b += AᵀPl.
 * @internal
 */
export function addGroup<T>(
  A: Arithmetic<T>,
  N: NormalSystem<T>,
  index: readonly number[],
  rows: readonly (readonly T[])[],
  P: readonly (readonly T[])[],
  l: readonly T[],
): void {
  const m = rows.length;
  const k = index.length;
  // PA (m × k) and Pl (m)
  for (let s = 0; s < k; s++) {
    // column s of AᵀP: (AᵀP)[s][r] = Σ_q A[q][s] P[q][r]
    const atp: T[] = new Array(m);
    for (let r = 0; r < m; r++) {
      let sum = A.zero;
      for (let q = 0; q < m; q++) sum = A.add(sum, A.mul(rows[q]![s]!, P[q]![r]!));
      atp[r] = sum;
    }
    let b = A.zero;
    for (let r = 0; r < m; r++) b = A.add(b, A.mul(atp[r]!, l[r]!));
    N.rhs[index[s]!] = A.add(N.rhs[index[s]!]!, b);
    for (let t = s; t < k; t++) {
      let v = A.zero;
      for (let r = 0; r < m; r++) v = A.add(v, A.mul(atp[r]!, rows[r]![t]!));
      addAt(A, N, index[s]!, index[t]!, v);
    }
  }
}

/**
 * A minimum-degree ordering of the unknowns of N (the graph of its off-diagonal entries):
 * repeatedly eliminate an unknown of least degree (ties: lowest number), joining its
 * neighbours (Tinney & Walker, "Direct solutions of sparse network equations by optimally
 * ordered triangular factorization", Proc. IEEE 55(11), 1967, scheme 2).
 *
 * @param n the number of unknowns
 * @param cols the upper triangle by column, as in {@link NormalSystem}
 * @returns perm: perm[k] is the unknown to eliminate k-th
 * @internal
 */
export function minimumDegreeOrder(n: number, cols: readonly Map<number, unknown>[]): Int32Array {
  // The elimination graph as adjacency lists of plain arrays; `mark` (stamped with the vertex
  // being merged) replaces hash sets. The next vertex comes from a binary heap of keys
  // degree·n + vertex (least degree, then lowest number), with stale keys skipped: the same
  // order as scanning degree buckets, in O(log n) per step instead of hashing every fill entry.
  const adj: number[][] = new Array(n);
  for (let j = 0; j < n; j++) adj[j] = [];
  const mark = new Int32Array(n).fill(-1);
  for (let j = 0; j < n; j++)
    for (const i of cols[j]!.keys())
      if (i !== j) {
        adj[i]!.push(j);
        adj[j]!.push(i);
      }
  // Entries of one column are distinct, but (i, j) may be listed under column j and (j, i)
  // under column i only if a caller stored both triangles: drop repeated neighbours.
  for (let v = 0; v < n; v++) {
    const a = adj[v]!;
    let m = 0;
    for (let t = 0; t < a.length; t++) {
      const w = a[t]!;
      if (mark[w] !== v) {
        mark[w] = v;
        a[m++] = w;
      }
    }
    a.length = m;
  }
  const done = new Uint8Array(n);
  const heap: number[] = [];
  const push = (key: number): void => {
    let i = heap.length;
    heap.push(key);
    while (i > 0) {
      const up = (i - 1) >> 1;
      if (heap[up]! <= key) break;
      heap[i] = heap[up]!;
      i = up;
    }
    heap[i] = key;
  };
  const pop = (): number => {
    const top = heap[0]!;
    const last = heap.pop()!;
    const size = heap.length;
    if (size > 0) {
      let i = 0;
      for (;;) {
        let c = 2 * i + 1;
        if (c >= size) break;
        if (c + 1 < size && heap[c + 1]! < heap[c]!) c++;
        if (heap[c]! >= last) break;
        heap[i] = heap[c]!;
        i = c;
      }
      heap[i] = last;
    }
    return top;
  };
  for (let v = 0; v < n; v++) push(adj[v]!.length * n + v);
  mark.fill(-1);
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let v: number;
    for (;;) {
      const key = pop();
      v = key % n;
      // A key is current when v is not eliminated and its degree has not changed since.
      if (done[v] === 0 && (key - v) / n === adj[v]!.length) break;
    }
    done[v] = 1;
    perm[k] = v;
    const nb = adj[v]!;
    // Each neighbour u loses v and gains the other neighbours of v (they become a clique).
    for (let s = 0; s < nb.length; s++) {
      const u = nb[s]!;
      const au = adj[u]!;
      let m = 0;
      for (let t = 0; t < au.length; t++) {
        const w = au[t]!;
        if (w !== v) {
          au[m++] = w;
          mark[w] = u;
        }
      }
      au.length = m;
      for (let t = 0; t < nb.length; t++) {
        const w = nb[t]!;
        if (w !== u && mark[w] !== u) {
          mark[w] = u;
          au.push(w);
        }
      }
      push(au.length * n + u);
    }
    adj[v] = [];
  }
  return perm;
}

/** Why a factorisation stopped: the unknown (original numbering) whose pivot vanished. */
export interface SingularPivot {
  readonly singular: number;
}

/**
 * Factors P·N·Pᵀ = L·D·Lᵀ (L unit lower triangular, D diagonal) in the order `perm`, by the
 * up-looking sparse algorithm with an elimination tree (Davis, "Algorithm 849: a concise sparse
 * Cholesky factorization package", ACM TOMS 31(4), 2005, the LDLᵀ variant).
 *
 * A pivot D[k] ≤ tolerance × N[k][k] stops the factorisation: the unknown is not determined
 * by the observations (a datum defect or a weak point). In an exact arithmetic pass 0.
 *
 * @param A the arithmetic
 * @param N the normal system
 * @param perm the elimination order (e.g. {@link minimumDegreeOrder})
 * @param tolerance the relative pivot tolerance (0 in an exact arithmetic)
 * @returns the factor, or `{ singular }` naming the unknown whose pivot vanished
 * @internal
 */
export function factorNormal<T>(
  A: Arithmetic<T>,
  N: NormalSystem<T>,
  perm: Int32Array,
  tolerance: T,
): NormalFactor<T> | SingularPivot {
  const n = N.n;
  const inv = new Int32Array(n);
  for (let k = 0; k < n; k++) inv[perm[k]!] = k;
  // The permuted upper triangle, compressed by column: rows ascending is not needed.
  const Cp = new Int32Array(n + 1);
  const counts = new Int32Array(n);
  for (let j = 0; j < n; j++)
    for (const i of N.cols[j]!.keys()) counts[Math.max(inv[i]!, inv[j]!)]!++;
  for (let k = 0; k < n; k++) Cp[k + 1] = Cp[k]! + counts[k]!;
  const Ci = new Int32Array(Cp[n]!);
  const Cx: T[] = new Array(Cp[n]!);
  const fill = Cp.slice(0, n);
  for (let j = 0; j < n; j++)
    for (const [i, v] of N.cols[j]!) {
      const a = inv[i]!;
      const b = inv[j]!;
      const c = Math.max(a, b);
      const at = fill[c]!++;
      Ci[at] = Math.min(a, b);
      Cx[at] = v;
    }
  // Symbolic: the elimination tree and the column counts of L.
  const parent = new Int32Array(n).fill(-1);
  const flag = new Int32Array(n);
  const Lnz = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    flag[k] = k;
    for (let p = Cp[k]!; p < Cp[k + 1]!; p++) {
      let i = Ci[p]!;
      if (i >= k) continue;
      for (; flag[i] !== k; i = parent[i]!) {
        if (parent[i] === -1) parent[i] = k;
        Lnz[i]!++;
        flag[i] = k;
      }
    }
  }
  const Lp = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) Lp[k + 1] = Lp[k]! + Lnz[k]!;
  const Li = new Int32Array(Lp[n]!);
  // Numeric. In float, the twin (the same operations on numbers; docs/performance.md).
  if (A.float64 === true) {
    const f = factorNumericFloat(
      n,
      perm,
      inv,
      Cp,
      Ci,
      Cx as unknown as number[],
      parent,
      flag,
      Lnz,
      Lp,
      tolerance as unknown as number,
    );
    // (A partial run leaves flag and Lnz as the loop below expects them: column k sets
    // flag[k] and Lnz[k] before anything reads them.)
    if (f !== undefined) return f as unknown as NormalFactor<T> | SingularPivot;
  }
  const Lx: T[] = new Array(Lp[n]!);
  const D: T[] = new Array(n);
  const Y: T[] = new Array(n).fill(A.zero);
  const pattern = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let top = n;
    flag[k] = k;
    Lnz[k] = 0;
    let diag = A.zero;
    for (let p = Cp[k]!; p < Cp[k + 1]!; p++) {
      let i = Ci[p]!;
      Y[i] = A.add(Y[i]!, Cx[p]!);
      if (i === k) diag = A.add(diag, Cx[p]!);
      let len = 0;
      for (; flag[i] !== k; i = parent[i]!) {
        pattern[len++] = i;
        flag[i] = k;
      }
      while (len > 0) pattern[--top] = pattern[--len]!;
    }
    let d: T = Y[k]!;
    Y[k] = A.zero;
    for (; top < n; top++) {
      const i = pattern[top]!;
      const yi = Y[i]!;
      Y[i] = A.zero;
      const p2 = Lp[i]! + Lnz[i]!;
      for (let p = Lp[i]!; p < p2; p++) Y[Li[p]!] = A.sub(Y[Li[p]!]!, A.mul(Lx[p]!, yi));
      const lki = A.div(yi, D[i]!);
      d = A.sub(d, A.mul(lki, yi));
      Li[p2] = k;
      Lx[p2] = lki;
      Lnz[i]!++;
    }
    if (A.sign(d) <= 0 || A.cmp(d, A.mul(tolerance, diag)) <= 0) return { singular: perm[k]! };
    D[k] = d;
  }
  return { n, perm, inv, Lp, Li, Lx, D };
}

/**
 * Solves N·x = b with a factor from {@link factorNormal}.
 * @param b the right-hand side, in the original numbering
 * @returns x, in the original numbering
 * @internal
 */
export function solveNormal<T>(A: Arithmetic<T>, F: NormalFactor<T>, b: readonly T[]): T[] {
  if (A.float64 === true) {
    const x = solveNormalFloat(F as unknown as NormalFactor<number>, b as unknown as number[]);
    if (x !== undefined) return x as unknown as T[];
  }
  const n = F.n;
  const y: T[] = new Array(n);
  for (let k = 0; k < n; k++) y[k] = b[F.perm[k]!]!;
  for (let j = 0; j < n; j++) {
    const yj = y[j]!;
    if (A.isZero(yj)) continue;
    for (let p = F.Lp[j]!; p < F.Lp[j + 1]!; p++)
      y[F.Li[p]!] = A.sub(y[F.Li[p]!]!, A.mul(F.Lx[p]!, yj));
  }
  for (let j = 0; j < n; j++) y[j] = A.div(y[j]!, F.D[j]!);
  for (let j = n - 1; j >= 0; j--) {
    let s: T = y[j]!;
    for (let p = F.Lp[j]!; p < F.Lp[j + 1]!; p++) s = A.sub(s, A.mul(F.Lx[p]!, y[F.Li[p]!]!));
    y[j] = s;
  }
  const x: T[] = new Array(n);
  for (let k = 0; k < n; k++) x[F.perm[k]!] = y[k]!;
  return x;
}

/**
 * The entries of N⁻¹ on the pattern of L and its diagonal, by the recurrences of Takahashi,
 * Fagan & Chin ("Formation of a sparse bus impedance matrix and its application to short
 * circuit study", 8th PICA Conference, 1973): with Z = N⁻¹ (permuted), for j from n − 1 down,
 * Z[i][j] = −Σ_k Z[i][k]·L[k][j] and Z[j][j] = 1/D[j] − Σ_k L[k][j]·Z[k][j], k over the
 * pattern of column j. No dense inverse is formed.
 * @internal
 */
export function selectedInverse<T>(A: Arithmetic<T>, F: NormalFactor<T>): SelectedInverse<T> {
  // In float, the twin makes the arrays itself: arrays made here would be made as the other
  // arithmetics' values have taught V8 to make them (of references), one box per number.
  if (A.float64 === true) {
    const twin = selectedInverseFloat(F as unknown as NormalFactor<number>);
    if (twin !== undefined)
      return inverseOn(
        F,
        twin.Zx as unknown as T[],
        twin.Zd as unknown as T[],
        twin.diagonal as unknown as T[],
      );
  }
  const n = F.n;
  const { Lp, Li, Lx, D } = F;
  const Zx: T[] = new Array(Lp[n]!);
  const Zd: T[] = new Array(n);
  const mark = new Int32Array(n).fill(-1);
  const acc: T[] = [];
  for (let j = n - 1; j >= 0; j--) {
    const p0 = Lp[j]!;
    const m = Lp[j + 1]! - p0;
    for (let b = 0; b < m; b++) {
      mark[Li[p0 + b]!] = b;
      acc[b] = A.zero;
    }
    for (let b = 0; b < m; b++) {
      const k = Li[p0 + b]!;
      const lkj = Lx[p0 + b]!;
      acc[b] = A.add(acc[b]!, A.mul(Zd[k]!, lkj));
      for (let p = Lp[k]!; p < Lp[k + 1]!; p++) {
        const c = mark[Li[p]!]!;
        if (c < 0) continue;
        // Z[i][k] with i = Li[p] > k, both in the pattern of column j.
        acc[c] = A.add(acc[c]!, A.mul(Zx[p]!, lkj));
        acc[b] = A.add(acc[b]!, A.mul(Zx[p]!, Lx[p0 + c]!));
      }
    }
    let zjj = A.div(A.one, D[j]!);
    for (let b = 0; b < m; b++) {
      Zx[p0 + b] = A.neg(acc[b]!);
      zjj = A.add(zjj, A.mul(Lx[p0 + b]!, acc[b]!));
      mark[Li[p0 + b]!] = -1;
    }
    Zd[j] = zjj;
  }
  const diagonal: T[] = new Array(n);
  for (let k = 0; k < n; k++) diagonal[F.perm[k]!] = Zd[k]!;
  return inverseOn(F, Zx, Zd, diagonal);
}

/**
 * The selected inverse as its users read it: `diagonal` in the original numbering, and
 * `get(i, j)` from Zx (below the diagonal, by column of L) and Zd (permuted numbering).
 */
function inverseOn<T>(
  F: NormalFactor<T>,
  Zx: readonly T[],
  Zd: readonly T[],
  diagonal: T[],
): SelectedInverse<T> {
  const { Lp, Li } = F;
  return {
    diagonal,
    get(i: number, j: number): T | undefined {
      const a = F.inv[i]!;
      const b = F.inv[j]!;
      if (a === b) return Zd[a];
      const c = Math.min(a, b);
      const r = Math.max(a, b);
      // rows ascend within a column: binary search
      let lo = Lp[c]!;
      let hi = Lp[c + 1]! - 1;
      while (lo <= hi) {
        const mid = (lo + hi) >> 1;
        const v = Li[mid]!;
        if (v === r) return Zx[mid];
        if (v < r) lo = mid + 1;
        else hi = mid - 1;
      }
      return undefined;
    },
  };
}
