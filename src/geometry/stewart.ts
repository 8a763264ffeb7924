/**
 * Stewart's relation: a point P and three points B, D, C on one line; the quadrances from
 * P to them and their positions along the line.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show } from '../errors.js';
import { solveQuadratic } from './quadratic.js';
import { type Root, isSurd, type Surd } from './surd.js';
import { readQuadrance } from './validate.js';

/**
 * The data of Stewart's relation with chainages: a point P (off the line or on it) and
 * three points B, C, D of one straight line. `QB`, `QC`, `QD` are the quadrances from P
 * to B, C, D (square units); `tB`, `tC`, `tD` are the chainages of B, C, D: signed
 * distances along the line from any origin, in the same unit.
 */
export interface StewartChainages<V> {
  /** Quadrance P–B. */
  QB: V;
  /** Quadrance P–C. */
  QC: V;
  /** Quadrance P–D. */
  QD: V;
  /** Chainage of B. */
  tB: V;
  /** Chainage of C. */
  tC: V;
  /** Chainage of D. */
  tD: V;
}

/**
 * The data of Stewart's relation in quadrances only: `QB`, `QC`, `QD` from the point P
 * to B, C, D of one line; `QBD` = Q(B, D) and `QBC` = Q(B, C) along the line.
 */
export interface StewartQuadrances<V> {
  /** Quadrance P–B. */
  QB: V;
  /** Quadrance P–C. */
  QC: V;
  /** Quadrance P–D. */
  QD: V;
  /** Quadrance B–D (along the line). */
  QBD: V;
  /** Quadrance B–C (along the line). */
  QBC: V;
}

const CHAINAGE_KEYS = ['QB', 'QC', 'QD', 'tB', 'tC', 'tD'] as const;
const QUADRANCE_KEYS = ['QB', 'QC', 'QD', 'QBD', 'QBC'] as const;

function stewart<T>(A: Arithmetic<T>, QB: T, QC: T, QD: T, tB: T, tC: T, tD: T): T {
  // Stewart's theorem b²m + c²n = a(d² + mn) (M. Stewart, Some General Theorems, Edinburgh 1746, Prop. II),
  // with signed chainages: m = tD − tB, n = tC − tD, a = tC − tB.
  const m = A.sub(tD, tB);
  const n = A.sub(tC, tD);
  const a = A.sub(tC, tB);
  return A.sub(A.add(A.mul(QB, n), A.mul(QC, m)), A.mul(a, A.add(QD, A.mul(m, n))));
}

function stewartQ<T>(A: Arithmetic<T>, QB: T, QC: T, QD: T, QBD: T, QBC: T): T {
  // The spread at B is the same in triangles PBC and PBD; the cross law (Wildberger, Divine Proportions, 2005, ch. 6)
  // in both gives QBD·(QB + QBC − QC)² = QBC·(QB + QBD − QD)² (derived).
  const u = A.sub(A.add(QB, QBC), QC);
  const v = A.sub(A.add(QB, QBD), QD);
  return A.sub(A.mul(QBD, A.mul(u, u)), A.mul(QBC, A.mul(v, v)));
}

/**
 * Stewart's relation with chainages, as a residual:
 * QB·(tC − tD) + QC·(tD − tB) − (tC − tB)·(QD + (tD − tB)·(tC − tD)),
 * zero exactly when the data are consistent (B, C, D on one line, P anywhere). With
 * tB = 0, tD = m, tC = m + n = a it is the classical b²m + c²n = a(d² + mn).
 *
 * @param A the arithmetic
 * @param data quadrances from P (≥ 0) and chainages of B, C, D
 * @returns the residual, in cubic units
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, stewartResidual } from 'quadspread';
 * rational.toString(stewartResidual(rational, { QB: 25, QC: 9, QD: '43/7', tB: 0, tC: 7, tD: 3 }));
 * //=> '0'
 * ```
 */
export function stewartResidual<T>(A: Arithmetic<T>, data: StewartChainages<Numeric<T>>): T {
  const w = 'stewartResidual(A, data)';
  return stewart(A, readQuadrance(A, data.QB, w, 'QB'), readQuadrance(A, data.QC, w, 'QC'), readQuadrance(A, data.QD, w, 'QD'), A.from(data.tB), A.from(data.tC), A.from(data.tD));
}

/**
 * Stewart's relation in quadrances only (the square roots eliminated), as a residual:
 * QBD·(QB + QBC − QC)² − QBC·(QB + QBD − QD)². It is zero when D lies on the line BC; the
 * squared form cannot tell D from its mirror image across B.
 *
 * @param A the arithmetic
 * @param data quadrances from P and along the line, all ≥ 0
 * @returns the residual, in square units cubed
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, stewartQuadranceResidual } from 'quadspread';
 * rational.toString(stewartQuadranceResidual(rational, { QB: 25, QC: 9, QD: '43/7', QBD: 9, QBC: 49 }));
 * //=> '0'
 * ```
 */
export function stewartQuadranceResidual<T>(A: Arithmetic<T>, data: StewartQuadrances<Numeric<T>>): T {
  const w = 'stewartQuadranceResidual(A, data)';
  return stewartQ(A, readQuadrance(A, data.QB, w, 'QB'), readQuadrance(A, data.QC, w, 'QC'), readQuadrance(A, data.QD, w, 'QD'), readQuadrance(A, data.QBD, w, 'QBD'), readQuadrance(A, data.QBC, w, 'QBC'));
}

/** The one missing key of `data` among `keys`; throws unless exactly one is missing. */
function missingKey(data: Record<string, unknown>, keys: readonly string[], where: string): string {
  const missing = keys.filter((k) => data[k] === undefined);
  if (missing.length !== 1) {
    throw new QuadspreadError('INVALID_ARGUMENT', where, `give all of ${keys.join(', ')} but one; ${missing.length === 0 ? 'none is' : `${missing.join(', ')} are`} missing`);
  }
  return missing[0]!;
}

/**
 * Solves R(x) = 0 for a residual R of degree ≤ 2 in x: the coefficients come from R(0),
 * R(1), R(−1) (exact in an exact arithmetic); with `nonNegative`, negative roots are dropped.
 */
function solveResidual<T, E extends boolean>(A: Arithmetic<T, E>, R: (x: T) => T, nonNegative: boolean, where: string): Root<T, E>[] {
  const c = R(A.zero);
  const p = R(A.one);
  const q = R(A.neg(A.one));
  const two = A.from(2);
  const a = A.sub(A.div(A.add(p, q), two), c);
  const b = A.div(A.sub(p, q), two);
  if (A.isZero(a) && A.isZero(b)) {
    if (A.isZero(c)) throw new QuadspreadError('INVALID_ARGUMENT', where, 'the other values do not fix the unknown (every value satisfies the relation)');
    return [];
  }
  const roots = solveQuadratic(A, a, b, c);
  if (!nonNegative) return roots;
  return roots.filter((r) => (isSurd(r) ? (r as Surd<T>).sign() : A.sign(r as T)) >= 0);
}

/**
 * Solves Stewart's relation with chainages (see {@link stewartResidual}) for the one
 * member of `{ QB, QC, QD, tB, tC, tD }` left out of `data`.
 *
 * The relation is linear in each quadrance and quadratic in each chainage, so the result
 * is a list: one value for a quadrance (none when it would be negative: no real point P
 * has those data), zero, one or two for a chainage (a quadratic: for tD, the two points of
 * the line at quadrance QD from P). Exact surds in `rational`, values otherwise.
 *
 * @param A the arithmetic
 * @param data five of the six members (the unknown one absent or `undefined`)
 * @returns the solutions, ascending
 * @throws {QuadspreadError} `INVALID_ARGUMENT` unless exactly one member is missing, or when
 * the others do not fix it; `REPEATED_CHAINAGE` when two given chainages are equal;
 * `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, solveStewart } from 'quadspread';
 * solveStewart(rational, { QB: 25, QC: 9, tB: 0, tC: 7, tD: 3 }).map((r) => r.toString());
 * //=> ['43/7']
 * ```
 */
export function solveStewart<T, E extends boolean>(A: Arithmetic<T, E>, data: Partial<StewartChainages<Numeric<T>>>): Root<T, E>[] {
  const w = 'solveStewart(A, data)';
  const key = missingKey(data as Record<string, unknown>, CHAINAGE_KEYS, w);
  const v: Record<string, T> = {};
  for (const k of CHAINAGE_KEYS) {
    if (k === key) continue;
    v[k] = k[0] === 'Q' ? readQuadrance(A, data[k]!, w, k) : A.from(data[k]!);
  }
  const ts = (['tB', 'tC', 'tD'] as const).filter((k) => k !== key);
  if (A.eq(v[ts[0]!]!, v[ts[1]!]!)) {
    throw new QuadspreadError('REPEATED_CHAINAGE', w, `${ts[0]} and ${ts[1]} are both ${show(A.toString(v[ts[0]!]!))}: the points must differ`);
  }
  const R = (x: T): T => {
    const g = (k: string) => (k === key ? x : v[k]!);
    return stewart(A, g('QB'), g('QC'), g('QD'), g('tB'), g('tC'), g('tD'));
  };
  return solveResidual(A, R, key[0] === 'Q', w);
}

/**
 * Solves Stewart's relation in quadrances (see {@link stewartQuadranceResidual}) for the
 * one member of `{ QB, QC, QD, QBD, QBC }` left out of `data`. The relation is quadratic
 * in every member, so 0, 1 or 2 non-negative solutions come back, ascending (for QD: the
 * point D and its mirror image across B).
 *
 * @param A the arithmetic
 * @param data four of the five quadrances (the unknown one absent or `undefined`)
 * @returns the non-negative solutions, ascending
 * @throws {QuadspreadError} `INVALID_ARGUMENT` unless exactly one member is missing, or when
 * the others do not fix it; `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, solveStewartQuadrances } from 'quadspread';
 * solveStewartQuadrances(rational, { QB: 25, QC: 9, QBD: 9, QBC: 49 }).map((r) => r.toString());
 * //=> ['43/7', '433/7']
 * ```
 */
export function solveStewartQuadrances<T, E extends boolean>(A: Arithmetic<T, E>, data: Partial<StewartQuadrances<Numeric<T>>>): Root<T, E>[] {
  const w = 'solveStewartQuadrances(A, data)';
  const key = missingKey(data as Record<string, unknown>, QUADRANCE_KEYS, w);
  const v: Record<string, T> = {};
  for (const k of QUADRANCE_KEYS) if (k !== key) v[k] = readQuadrance(A, data[k]!, w, k);
  const R = (x: T): T => {
    const g = (k: string) => (k === key ? x : v[k]!);
    return stewartQ(A, g('QB'), g('QC'), g('QD'), g('QBD'), g('QBC'));
  };
  return solveResidual(A, R, true, w);
}
