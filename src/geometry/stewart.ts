/**
 * Stewart's relation: a point P and three points B, D, C on one line; the quadrances from
 * P to them and their positions along the line.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import { solveQuadratic } from './quadratic.js';
import { type Root, isSurd, type Surd } from './surd.js';
import { finiteResult, readNumber, readQuadrance } from './validate.js';

/**
 * The data of Stewart's relation with chainages: a point P (off the line or on it) and
 * three points B, C, D of one straight line. `QB`, `QC`, `QD` are the quadrances from P
 * to B, C, D (square units); `tB`, `tC`, `tD` are the chainages of B, C, D: signed
 * distances along the line from any origin, in the same unit.
 *
 * @example
 * ```ts
 * import { float, stewartResidual } from 'quadspread';
 * // P = (3, 4) above the x-axis; B, C, D at chainages 0, 6, 3 along it.
 * stewartResidual(float, { QB: 25, QC: 25, QD: 16, tB: 0, tC: 6, tD: 3 });
 * //=> 0
 * ```
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
 *
 * @example
 * ```ts
 * import { float, stewartQuadranceResidual } from 'quadspread';
 * stewartQuadranceResidual(float, { QB: 25, QC: 25, QD: 16, QBD: 9, QBC: 36 });
 * //=> 0
 * ```
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
  // The spread at B is the same in triangles PBC and PBD; the cross law (the law of cosines, Euclid, Elements II.12–13, squared)
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
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER` naming the member; `INVALID_ARGUMENT` when `data` is not an object; `NOT_FINITE` in float when the result overflows.
 * @example
 * ```ts
 * import { rational, stewartResidual } from 'quadspread';
 * rational.toString(stewartResidual(rational, { QB: 25, QC: 9, QD: '43/7', tB: 0, tC: 7, tD: 3 }));
 * //=> '0'
 * ```
 */
export function stewartResidual<T>(A: Arithmetic<T>, data: StewartChainages<Numeric<T>>): T {
  checkArithmetic(A, 'stewartResidual');
  const w = 'stewartResidual(A, data)';
  checkData(data, w);
  return finiteResult(
    stewart(
      A,
      readQuadrance(A, data.QB, w, 'QB'),
      readQuadrance(A, data.QC, w, 'QC'),
      readQuadrance(A, data.QD, w, 'QD'),
      readNumber(A, data.tB, w, ' tB'),
      readNumber(A, data.tC, w, ' tC'),
      readNumber(A, data.tD, w, ' tD'),
    ),
    w,
  );
}

/**
 * Stewart's relation in quadrances only (the square roots eliminated), as a residual:
 * QBD·(QB + QBC − QC)² − QBC·(QB + QBD − QD)². It is zero when D lies on the line BC; the
 * squared form cannot tell D from its mirror image across B.
 *
 * @param A the arithmetic
 * @param data quadrances from P and along the line, all ≥ 0
 * @returns the residual, in square units cubed
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER` naming the member; `INVALID_ARGUMENT` when `data` is not an object; `NOT_FINITE` in float when the result overflows.
 * @example
 * ```ts
 * import { rational, stewartQuadranceResidual } from 'quadspread';
 * rational.toString(stewartQuadranceResidual(rational, { QB: 25, QC: 9, QD: '43/7', QBD: 9, QBC: 49 }));
 * //=> '0'
 * ```
 */
export function stewartQuadranceResidual<T>(
  A: Arithmetic<T>,
  data: StewartQuadrances<Numeric<T>>,
): T {
  checkArithmetic(A, 'stewartQuadranceResidual');
  const w = 'stewartQuadranceResidual(A, data)';
  checkData(data, w);
  return finiteResult(
    stewartQ(
      A,
      readQuadrance(A, data.QB, w, 'QB'),
      readQuadrance(A, data.QC, w, 'QC'),
      readQuadrance(A, data.QD, w, 'QD'),
      readQuadrance(A, data.QBD, w, 'QBD'),
      readQuadrance(A, data.QBC, w, 'QBC'),
    ),
    w,
  );
}

/** Checks that `data` is an object (the members are read from it). */
function checkData(data: unknown, where: string): void {
  if (data === null || typeof data !== 'object')
    throw invalidArgument(where, `data = ${show(data)} is not an object`);
}

/** The one missing key of `data` among `keys`; throws unless exactly one is missing. */
function missingKey(data: Record<string, unknown>, keys: readonly string[], where: string): string {
  const missing = keys.filter((k) => data[k] === undefined);
  if (missing.length !== 1) {
    throw invalidArgument(
      where,
      `give all of ${keys.join(', ')} but one; ${missing.length === 0 ? 'none is' : `${missing.join(', ')} are`} missing`,
    );
  }
  return missing[0]!;
}

/**
 * The roots of a·x² + b·x + c = 0 (coefficients written out per unknown, so that rounded
 * arithmetic sees no cancellation from sampling); throws when every x satisfies it.
 */
function roots<T, E extends boolean>(
  A: Arithmetic<T, E>,
  a: T,
  b: T,
  c: T,
  where: string,
): Root<T, E>[] {
  if (A.isZero(a) && A.isZero(b)) {
    if (A.isZero(c))
      throw invalidArgument(
        where,
        'the other values do not fix the unknown (every value satisfies the relation)',
      );
    return [];
  }
  return solveQuadratic(A, a, b, c);
}

/** base + sign·r for each root r, kept in increasing order. */
function shift<T, E extends boolean>(
  A: Arithmetic<T, E>,
  rs: Root<T, E>[],
  base: T,
  sign: 1 | -1,
): Root<T, E>[] {
  const out = rs.map(
    (r) =>
      (isSurd(r)
        ? sign > 0
          ? (r as Surd<T>).add(base)
          : (r as Surd<T>).neg().add(base)
        : sign > 0
          ? A.add(base, r as T)
          : A.sub(base, r as T)) as Root<T, E>,
  );
  return sign > 0 ? out : out.reverse();
}

function nonNegative<T, E extends boolean>(A: Arithmetic<T, E>, rs: Root<T, E>[]): Root<T, E>[] {
  return rs.filter((r) => (isSurd(r) ? (r as Surd<T>).sign() : A.sign(r as T)) >= 0);
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
 * the others do not fix it, or when `data` is not an object; `REPEATED_CHAINAGE` when two given chainages are equal;
 * `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, solveStewart } from 'quadspread';
 * solveStewart(rational, { QB: 25, QC: 9, tB: 0, tC: 7, tD: 3 }).map((r) => r.toString());
 * //=> ['43/7']
 * ```
 */
export function solveStewart<T, E extends boolean>(
  A: Arithmetic<T, E>,
  data: Partial<StewartChainages<Numeric<T>>>,
): Root<T, E>[] {
  checkArithmetic(A, 'solveStewart');
  const w = 'solveStewart(A, data)';
  checkData(data, w);
  const key = missingKey(data as Record<string, unknown>, CHAINAGE_KEYS, w);
  const v: Record<string, T> = {};
  for (const k of CHAINAGE_KEYS) {
    if (k === key) continue;
    v[k] = k[0] === 'Q' ? readQuadrance(A, data[k]!, w, k) : readNumber(A, data[k]!, w, ` ${k}`);
  }
  const ts = (['tB', 'tC', 'tD'] as const).filter((k) => k !== key);
  if (A.eq(v[ts[0]!]!, v[ts[1]!]!)) {
    throw new QuadspreadError(
      'REPEATED_CHAINAGE',
      w,
      `${ts[0]} and ${ts[1]} are both ${show(A.toString(v[ts[0]!]!))}: the points must differ`,
    );
  }
  if (key[0] === 'Q') {
    // Linear in each quadrance: solve directly (the chainages differ, so the coefficient is not 0).
    const g = (k: string) => (k === key ? A.zero : v[k]!);
    const c = stewart(A, g('QB'), g('QC'), g('QD'), g('tB'), g('tC'), g('tD'));
    const m = A.sub(v.tD!, v.tB!);
    const n = A.sub(v.tC!, v.tD!);
    const coef = key === 'QB' ? n : key === 'QC' ? m : A.neg(A.add(m, n));
    return nonNegative(A, roots(A, A.zero, coef, c, w));
  }
  const { QB, QC, QD } = v as Record<'QB' | 'QC' | 'QD', T>;
  if (key === 'tD') {
    // y = tD − tB, a = tC − tB: a·y² + (QC − QB − a²)·y + a·(QB − QD) = 0 (Stewart's relation expanded; derived).
    const a = A.sub(v.tC!, v.tB!);
    return shift(
      A,
      roots(A, a, A.sub(A.sub(QC, QB), A.mul(a, a)), A.mul(a, A.sub(QB, QD)), w),
      v.tB!,
      1,
    );
  }
  if (key === 'tB') {
    // y = tD − tB, n = tC − tD: −n·y² + (QC − QD − n²)·y + n·(QB − QD) = 0 (derived).
    const n = A.sub(v.tC!, v.tD!);
    return shift(
      A,
      roots(A, A.neg(n), A.sub(A.sub(QC, QD), A.mul(n, n)), A.mul(n, A.sub(QB, QD)), w),
      v.tD!,
      -1,
    );
  }
  // key === 'tC': y = tC − tD, m = tD − tB: −m·y² + (QB − QD − m²)·y + m·(QC − QD) = 0 (derived).
  const m = A.sub(v.tD!, v.tB!);
  return shift(
    A,
    roots(A, A.neg(m), A.sub(A.sub(QB, QD), A.mul(m, m)), A.mul(m, A.sub(QC, QD)), w),
    v.tD!,
    1,
  );
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
 * the others do not fix it, or when `data` is not an object; `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, solveStewartQuadrances } from 'quadspread';
 * solveStewartQuadrances(rational, { QB: 25, QC: 9, QBD: 9, QBC: 49 }).map((r) => r.toString());
 * //=> ['43/7', '433/7']
 * ```
 */
export function solveStewartQuadrances<T, E extends boolean>(
  A: Arithmetic<T, E>,
  data: Partial<StewartQuadrances<Numeric<T>>>,
): Root<T, E>[] {
  checkArithmetic(A, 'solveStewartQuadrances');
  const w = 'solveStewartQuadrances(A, data)';
  checkData(data, w);
  const key = missingKey(data as Record<string, unknown>, QUADRANCE_KEYS, w);
  const v: Record<string, T> = {};
  for (const k of QUADRANCE_KEYS) if (k !== key) v[k] = readQuadrance(A, data[k]!, w, k);
  const { QB, QC, QD, QBD, QBC } = v as Record<'QB' | 'QC' | 'QD' | 'QBD' | 'QBC', T>;
  const two = A.from(2);
  const sq = (x: T) => A.mul(x, x);
  // Each case expands QBD·(QB + QBC − QC)² = QBC·(QB + QBD − QD)² in the unknown (derived).
  switch (key) {
    case 'QC': {
      // y = QB + QBC − QC: QBD·y² − QBC·v² = 0
      const y = roots(A, QBD, A.zero, A.neg(A.mul(QBC, sq(A.sub(A.add(QB, QBD), QD)))), w);
      return nonNegative(A, shift(A, y, A.add(QB, QBC), -1));
    }
    case 'QD': {
      // y = QB + QBD − QD: QBC·y² − QBD·u² = 0
      const y = roots(A, QBC, A.zero, A.neg(A.mul(QBD, sq(A.sub(A.add(QB, QBC), QC)))), w);
      return nonNegative(A, shift(A, y, A.add(QB, QBD), -1));
    }
    case 'QB': {
      // QBD·(x + k1)² − QBC·(x + k2)², k1 = QBC − QC, k2 = QBD − QD
      const k1 = A.sub(QBC, QC);
      const k2 = A.sub(QBD, QD);
      const a = A.sub(QBD, QBC);
      const b = A.mul(two, A.sub(A.mul(QBD, k1), A.mul(QBC, k2)));
      const c = A.sub(A.mul(QBD, sq(k1)), A.mul(QBC, sq(k2)));
      return nonNegative(A, roots(A, a, b, c, w));
    }
    case 'QBD': {
      // x·u² − QBC·(x + k)², u = QB + QBC − QC, k = QB − QD
      const u = A.sub(A.add(QB, QBC), QC);
      const k = A.sub(QB, QD);
      return nonNegative(
        A,
        roots(A, A.neg(QBC), A.sub(sq(u), A.mul(two, A.mul(QBC, k))), A.neg(A.mul(QBC, sq(k))), w),
      );
    }
    default: {
      // QBC = x: QBD·(x + j)² − x·v², j = QB − QC, v = QB + QBD − QD
      const j = A.sub(QB, QC);
      const vv = sq(A.sub(A.add(QB, QBD), QD));
      return nonNegative(
        A,
        roots(A, QBD, A.sub(A.mul(two, A.mul(QBD, j)), vv), A.mul(QBD, sq(j)), w),
      );
    }
  }
}
