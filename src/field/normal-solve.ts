/**
 * A small dense solve of normal equations N·x = b and the inverse of N (the cofactor matrix),
 * for the few unknowns of a free station. Exact in an exact arithmetic.
 *
 * @module field
 * @internal
 */
import { QuadspreadError } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';

/**
 * Solves N·X = B for a square N (n × n) and the columns of B, by Gauss–Jordan elimination with
 * the largest pivot of each column (partial pivoting; Golub & Van Loan, *Matrix Computations*,
 * §3.4 — from memory). Returns X (n rows, as many columns as B).
 * @throws {QuadspreadError} `INCONSISTENT_READINGS` naming `where` when N is singular (the
 *   observations do not fix the unknowns).
 * @internal
 */
export function solveDense<T>(A: Arithmetic<T>, N: T[][], B: T[][], where: string): T[][] {
  const n = N.length;
  const m = B[0]?.length ?? 0;
  const M = N.map((row, i) => [...row, ...B[i]!]);
  // In a rounding arithmetic a pivot below 1e-13 of the largest diagonal term counts as zero.
  let big = A.zero;
  for (let i = 0; i < n; i++) if (A.cmp(A.abs(N[i]![i]!), big) > 0) big = A.abs(N[i]![i]!);
  const tiny = A.exact ? A.zero : A.mul(big, A.from('1e-13'));
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (A.cmp(A.abs(M[i]![k]!), A.abs(M[p]![k]!)) > 0) p = i;
    if (A.cmp(A.abs(M[p]![k]!), tiny) <= 0)
      throw new QuadspreadError(
        'INCONSISTENT_READINGS',
        where,
        'the observations do not fix the station: add directions or distances to further control points',
      );
    [M[k], M[p]] = [M[p]!, M[k]!];
    const row = M[k]!;
    const piv = row[k]!;
    for (let j = k; j < n + m; j++) row[j] = A.div(row[j]!, piv);
    for (let i = 0; i < n; i++) {
      if (i === k || A.isZero(M[i]![k]!)) continue;
      const f = M[i]![k]!;
      const r = M[i]!;
      for (let j = k; j < n + m; j++) r[j] = A.sub(r[j]!, A.mul(f, row[j]!));
    }
  }
  return M.map((row) => row.slice(n));
}
