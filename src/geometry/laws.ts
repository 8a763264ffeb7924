/**
 * The laws of rational trigonometry as residual functions: each returns a value that is
 * exactly zero (in `rational`) when the law holds, so callers can check their data.
 *
 * Triangle convention: Q1 = Q(A2, A3) is opposite A1 and s1 is the spread at A1.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { finiteResult, readNumber, readQuadrance, readSpread } from './validate.js';
import { checkArithmetic } from '../errors.js';

/**
 * Pythagoras' theorem in quadrances: the residual Q1 + Q2 − Q3, zero exactly when the
 * lines through the vertex opposite Q3 are perpendicular (spread 1 there).
 *
 * @param A the arithmetic
 * @param Q1 a quadrance (leg), ≥ 0
 * @param Q2 a quadrance (leg), ≥ 0
 * @param Q3 the quadrance opposite the right vertex (hypotenuse), ≥ 0
 * @returns Q1 + Q2 − Q3, in square units
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`; `NOT_FINITE` in float when the result overflows (values beyond about 1e154).
 * @example
 * ```ts
 * import { rational, pythagorasResidual } from 'quadspread';
 * rational.toString(pythagorasResidual(rational, 9, 16, 25));
 * //=> '0'
 * ```
 */
export function pythagorasResidual<T>(
  A: Arithmetic<T>,
  Q1: Numeric<T>,
  Q2: Numeric<T>,
  Q3: Numeric<T>,
): T {
  checkArithmetic(A, 'pythagorasResidual');
  const w = 'pythagorasResidual(A, Q1, Q2, Q3)';
  const a = readQuadrance(A, Q1, w, 'Q1');
  const b = readQuadrance(A, Q2, w, 'Q2');
  const c = readQuadrance(A, Q3, w, 'Q3');
  // Pythagoras' theorem, Q1 + Q2 = Q3: Euclid, Elements I.47 and its converse I.48.
  return finiteResult(A.sub(A.add(a, b), c), w);
}

/**
 * Archimedes' function of three quadrances,
 * (Q1 + Q2 + Q3)² − 2(Q1² + Q2² + Q3²) = 16·area²: the quadrea of the triangle with those
 * quadrances (positive for a proper triangle, zero for collinear points, negative when
 * no triangle has them).
 *
 * @param A the arithmetic
 * @param Q1 a quadrance, ≥ 0
 * @param Q2 a quadrance, ≥ 0
 * @param Q3 a quadrance, ≥ 0
 * @returns the quadrea, in square units squared
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`; `NOT_FINITE` in float when the result overflows (values beyond about 1e154).
 * @example
 * ```ts
 * import { rational, quadrea } from 'quadspread';
 * rational.toString(quadrea(rational, 169, 196, 225));
 * //=> '112896'
 * ```
 */
export function quadrea<T>(A: Arithmetic<T>, Q1: Numeric<T>, Q2: Numeric<T>, Q3: Numeric<T>): T {
  checkArithmetic(A, 'quadrea');
  const w = 'quadrea(A, Q1, Q2, Q3)';
  return finiteResult(
    archimedes(
      A,
      readQuadrance(A, Q1, w, 'Q1'),
      readQuadrance(A, Q2, w, 'Q2'),
      readQuadrance(A, Q3, w, 'Q3'),
    ),
    w,
  );
}

function archimedes<T>(A: Arithmetic<T>, a: T, b: T, c: T): T {
  // Archimedes' function A(a, b, c) = (a + b + c)² − 2(a² + b² + c²), equal to 16·area² by Heron's
  // formula (Heron, Metrica I.8) expanded in the squared sides (derived).
  const s = A.add(A.add(a, b), c);
  const q = A.add(A.add(A.mul(a, a), A.mul(b, b)), A.mul(c, c));
  return A.sub(A.mul(s, s), A.add(q, q));
}

/**
 * The triple quad formula: the residual (Q1 + Q2 + Q3)² − 2(Q1² + Q2² + Q3²), zero exactly
 * when the three quadrances belong to three collinear points.
 *
 * @param A the arithmetic
 * @param Q1 a quadrance, ≥ 0
 * @param Q2 a quadrance, ≥ 0
 * @param Q3 a quadrance, ≥ 0
 * @returns the residual (the quadrea), in square units squared
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`; `NOT_FINITE` in float when the result overflows (values beyond about 1e154).
 * @example
 * ```ts
 * import { rational, tripleQuadResidual } from 'quadspread';
 * rational.toString(tripleQuadResidual(rational, 1, 4, 9));
 * //=> '0'
 * ```
 */
export function tripleQuadResidual<T>(
  A: Arithmetic<T>,
  Q1: Numeric<T>,
  Q2: Numeric<T>,
  Q3: Numeric<T>,
): T {
  checkArithmetic(A, 'tripleQuadResidual');
  const w = 'tripleQuadResidual(A, Q1, Q2, Q3)';
  // Triple quad formula: three points are collinear exactly when Heron's area is zero (Heron, Metrica I.8; derived).
  return finiteResult(
    archimedes(
      A,
      readQuadrance(A, Q1, w, 'Q1'),
      readQuadrance(A, Q2, w, 'Q2'),
      readQuadrance(A, Q3, w, 'Q3'),
    ),
    w,
  );
}

/**
 * Archimedes' formula: the residual quadrea(Q1, Q2, Q3) − 16·area², zero when `area` is the
 * area of the triangle with those quadrances.
 *
 * @param A the arithmetic
 * @param Q1 a quadrance, ≥ 0
 * @param Q2 a quadrance, ≥ 0
 * @param Q3 a quadrance, ≥ 0
 * @param area the area (any sign; only its square matters), in square units
 * @returns quadrea − 16·area², in square units squared
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER`; `NOT_FINITE` in float when the result overflows (values beyond about 1e154).
 * @example
 * ```ts
 * import { rational, archimedesResidual } from 'quadspread';
 * rational.toString(archimedesResidual(rational, 169, 196, 225, 84));
 * //=> '0'
 * ```
 */
export function archimedesResidual<T>(
  A: Arithmetic<T>,
  Q1: Numeric<T>,
  Q2: Numeric<T>,
  Q3: Numeric<T>,
  area: Numeric<T>,
): T {
  checkArithmetic(A, 'archimedesResidual');
  const w = 'archimedesResidual(A, Q1, Q2, Q3, area)';
  const q = archimedes(
    A,
    readQuadrance(A, Q1, w, 'Q1'),
    readQuadrance(A, Q2, w, 'Q2'),
    readQuadrance(A, Q3, w, 'Q3'),
  );
  const s = readNumber(A, area, w, ' area');
  // Archimedes' formula, quadrea = 16·area²: Heron's formula in quadrances (Heron, Metrica I.8; derived).
  return finiteResult(A.sub(q, A.mul(A.from(16), A.mul(s, s))), w);
}

/**
 * The spread law for one pair of vertices: the residual s_a·Q_b − s_b·Q_a, zero when
 * s_a/Q_a = s_b/Q_b (each spread paired with the quadrance opposite it). Written without
 * division, so it also holds where a quadrance is zero.
 *
 * @param A the arithmetic
 * @param Qa a quadrance, ≥ 0
 * @param sa the spread opposite Qa, in [0, 1]
 * @param Qb another quadrance, ≥ 0
 * @param sb the spread opposite Qb, in [0, 1]
 * @returns sa·Qb − sb·Qa, in square units
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`, `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, spreadLawResidual } from 'quadspread';
 * rational.toString(spreadLawResidual(rational, 9, '9/25', 25, 1));
 * //=> '0'
 * ```
 */
export function spreadLawResidual<T>(
  A: Arithmetic<T>,
  Qa: Numeric<T>,
  sa: Numeric<T>,
  Qb: Numeric<T>,
  sb: Numeric<T>,
): T {
  checkArithmetic(A, 'spreadLawResidual');
  const w = 'spreadLawResidual(A, Qa, sa, Qb, sb)';
  const qa = readQuadrance(A, Qa, w, 'Qa');
  const a = readSpread(A, sa, w, 'sa');
  const qb = readQuadrance(A, Qb, w, 'Qb');
  const b = readSpread(A, sb, w, 'sb');
  // Spread law s1/Q1 = s2/Q2 = s3/Q3: the law of sines, squared (derived).
  // Spreads are at most 1, so neither product exceeds its quadrance: nothing to overflow.
  return A.sub(A.mul(a, qb), A.mul(b, qa));
}

/**
 * The cross law: the residual (Q1 + Q2 − Q3)² − 4·Q1·Q2·(1 − s3), zero when s3 is the
 * spread at the vertex between the sides of quadrance Q1 and Q2 (opposite Q3).
 *
 * @param A the arithmetic
 * @param Q1 a quadrance, ≥ 0
 * @param Q2 a quadrance, ≥ 0
 * @param Q3 the quadrance opposite the vertex, ≥ 0
 * @param s3 the spread at the vertex, in [0, 1]
 * @returns the residual, in square units squared
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`, `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER`; `NOT_FINITE` in float when the result overflows (values beyond about 1e154).
 * @example
 * ```ts
 * import { rational, crossLawResidual } from 'quadspread';
 * rational.toString(crossLawResidual(rational, 169, 196, 225, '144/169'));
 * //=> '0'
 * ```
 */
export function crossLawResidual<T>(
  A: Arithmetic<T>,
  Q1: Numeric<T>,
  Q2: Numeric<T>,
  Q3: Numeric<T>,
  s3: Numeric<T>,
): T {
  checkArithmetic(A, 'crossLawResidual');
  const w = 'crossLawResidual(A, Q1, Q2, Q3, s3)';
  const a = readQuadrance(A, Q1, w, 'Q1');
  const b = readQuadrance(A, Q2, w, 'Q2');
  const c = readQuadrance(A, Q3, w, 'Q3');
  const s = readSpread(A, s3, w, 's3');
  // Cross law (Q1 + Q2 − Q3)² = 4 Q1 Q2 (1 − s3): the law of cosines (Euclid, Elements II.12–13), squared (derived).
  const t = A.sub(A.add(a, b), c);
  return finiteResult(A.sub(A.mul(t, t), A.mul(A.from(4), A.mul(A.mul(a, b), A.sub(A.one, s)))), w);
}

/**
 * The triple spread formula: the residual
 * (s1 + s2 + s3)² − 2(s1² + s2² + s3²) − 4·s1·s2·s3, zero for the three spreads of a
 * triangle (and for the three spreads between three concurrent or parallel lines).
 *
 * @param A the arithmetic
 * @param s1 a spread, in [0, 1]
 * @param s2 a spread, in [0, 1]
 * @param s3 a spread, in [0, 1]
 * @returns the residual (dimensionless)
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, tripleSpreadResidual } from 'quadspread';
 * rational.toString(tripleSpreadResidual(rational, '9/25', '16/25', 1));
 * //=> '0'
 * ```
 */
export function tripleSpreadResidual<T>(
  A: Arithmetic<T>,
  s1: Numeric<T>,
  s2: Numeric<T>,
  s3: Numeric<T>,
): T {
  checkArithmetic(A, 'tripleSpreadResidual');
  const w = 'tripleSpreadResidual(A, s1, s2, s3)';
  const a = readSpread(A, s1, w, 's1');
  const b = readSpread(A, s2, w, 's2');
  const c = readSpread(A, s3, w, 's3');
  // Triple spread formula: sin² of A3 = 180° − A1 − A2 by the angle-sum formulas, squared out (derived).
  const t = archimedes(A, a, b, c);
  return A.sub(t, A.mul(A.from(4), A.mul(A.mul(a, b), c)));
}
