/**
 * Area and perimeter of a polygon from its vertex coordinates, with exact unit conversions.
 *
 * @module cogo
 */
import { QuadspreadError, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { checkLengthUnit, METRES_PER_UNIT } from '../readings/length.js';
import type { LengthUnit } from '../readings/length.js';
import { expectObject, readNumber } from '../geometry/validate.js';
import { readArray, readPoint, sqrtValue } from './internal.js';
import type { Point } from '../geometry/point.js';
import type { PointInput } from './internal.js';

function readPolygon<T>(A: Arithmetic<T, boolean>, points: unknown, where: string): Point<T>[] {
  const list = readArray<unknown>(points, `${where}`);
  if (list.length < 3) {
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      where,
      `a polygon needs at least 3 vertices, got ${list.length}`,
    );
  }
  return list.map((p, i) => readPoint(A, p, `${where}[${i}]`));
}

/**
 * Signed area of a polygon by the shoelace formula, exact in `rational`.
 *
 * Vertices are `{ x, y }` with x = east and y = north, in order around the polygon (the
 * closing side back to the first vertex is implied). The area is positive when the
 * vertices run counterclockwise as seen on a map (north up), negative when they run
 * clockwise; take its absolute value for the size. Units: the square of the coordinate
 * unit (m² for metres, ft² for feet). The computation is translated to the first vertex,
 * which keeps float results accurate on large grid coordinates.
 *
 * @param A the arithmetic
 * @param points three or more vertices `{ x: east, y: north }`
 * @returns the signed area (square coordinate units)
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than three vertices;
 * `INVALID_ARGUMENT` when `points` is not an array of points; `INVALID_NUMBER` for a
 * coordinate that is not a number.
 * @example
 * ```ts
 * import { rational, area } from 'quadspread';
 * rational.toString(area(rational, [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }]));
 * //=> '6'
 * rational.toString(area(rational, [{ x: 0, y: 0 }, { x: 4, y: 3 }, { x: 4, y: 0 }]));
 * //=> '-6'
 * ```
 */
export function area<T>(A: Arithmetic<T, boolean>, points: readonly PointInput<T>[]): T {
  checkArithmetic(A, 'area');
  const P = readPolygon(A, points, 'area(A, points)');
  const p0 = P[0]!;
  // Shoelace (Gauss's area formula): 2·area = Σ (xᵢ − x₀)(yᵢ₊₁ − y₀) − (xᵢ₊₁ − x₀)(yᵢ − y₀);
  // the coordinate method of area of, e.g., Ghilani & Wolf, Elementary Surveying, chapter on area (from memory).
  let twice = A.zero;
  let ex = A.sub(P[1]!.x, p0.x);
  let ey = A.sub(P[1]!.y, p0.y);
  for (let i = 2; i < P.length; i++) {
    const fx = A.sub(P[i]!.x, p0.x);
    const fy = A.sub(P[i]!.y, p0.y);
    twice = A.add(twice, A.sub(A.mul(ex, fy), A.mul(fx, ey)));
    ex = fx;
    ey = fy;
  }
  return A.div(twice, A.from(2));
}

/**
 * Perimeter of a polygon: the sum of its side lengths, closing side included.
 *
 * Sides are √(Δx² + Δy²) (x = east, y = north). In `rational` a side is exact when its
 * quadrance is the square of a rational, otherwise a rational within 1e-40 relative of
 * the true length, so the perimeter is within 1e-40 relative; `decimal` and `float` round
 * each root as their `sqrt` does.
 *
 * @param A the arithmetic
 * @param points three or more vertices `{ x: east, y: north }`
 * @returns the perimeter (coordinate units)
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than three vertices;
 * `INVALID_ARGUMENT`/`INVALID_NUMBER` for bad points.
 * @example
 * ```ts
 * import { rational, perimeter } from 'quadspread';
 * rational.toString(perimeter(rational, [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }]));
 * //=> '12'
 * ```
 */
export function perimeter<T>(A: Arithmetic<T, boolean>, points: readonly PointInput<T>[]): T {
  checkArithmetic(A, 'perimeter');
  const where = 'perimeter(A, points)';
  const P = readPolygon(A, points, where);
  let sum = A.zero;
  for (let i = 0; i < P.length; i++) {
    const p = P[i]!;
    const q = P[(i + 1) % P.length]!;
    const dx = A.sub(q.x, p.x);
    const dy = A.sub(q.y, p.y);
    // Length of a side = √quadrance (Pythagoras).
    sum = A.add(sum, sqrtValue(A, A.add(A.mul(dx, dx), A.mul(dy, dy)), where));
  }
  return sum;
}

/**
 * Area units and their exact size in square metres.
 *
 * - `ft2`: international foot = 0.3048 m exactly (NIST/NGS, "Deprecation of the U.S.
 *   Survey Foot", Federal Register 85(193):62698–62708, 2020).
 * - `us-ft2`: U.S. survey foot = 1200/3937 m (same notice).
 * - `acre`: 43 560 ft² (10 square Gunter's chains of 66 ft), international foot.
 * - `us-acre`: 43 560 U.S. survey ft², for old records.
 * - `ha`: 10 000 m².
 *
 * @example
 * ```ts
 * import { AREA_UNITS } from 'quadspread';
 * AREA_UNITS.acre;
 * //=> '4046.8564224'
 * ```
 */
export const AREA_UNITS = {
  m2: '1',
  ha: '10000',
  ft2: '0.09290304',
  'us-ft2': '1440000/15499969',
  acre: '4046.8564224',
  'us-acre': '62726400000/15499969',
} as const;

/** An area unit: a key of {@link AREA_UNITS}. */
export type AreaUnit = keyof typeof AREA_UNITS;

function unitFactor<T>(
  A: Arithmetic<T, boolean>,
  table: Record<string, string>,
  unit: unknown,
  where: string,
): T {
  if (typeof unit !== 'string' || !Object.prototype.hasOwnProperty.call(table, unit)) {
    throw new QuadspreadError(
      'INVALID_UNIT',
      where,
      `${show(unit)} is not one of ${Object.keys(table).join(', ')}`,
    );
  }
  return A.from(table[unit]!);
}

/**
 * Converts an area between units, with exact factors (exact in `rational`).
 *
 * @param A the arithmetic
 * @param value the area in unit `from`
 * @param from unit of `value`: `m2`, `ha`, `ft2`, `us-ft2`, `acre`, `us-acre`
 * @param to unit wanted
 * @returns the area in unit `to`
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, convertArea } from 'quadspread';
 * rational.toString(convertArea(rational, 1, 'acre', 'ft2'));
 * //=> '43560'
 * rational.toString(convertArea(rational, 1, 'acre', 'm2'));
 * //=> '316160658/78125'
 * ```
 */
export function convertArea<T>(
  A: Arithmetic<T, boolean>,
  value: Numeric<T>,
  from: AreaUnit,
  to: AreaUnit,
): T {
  checkArithmetic(A, 'convertArea');
  const where = 'convertArea(A, value, from, to)';
  const f = unitFactor(A, AREA_UNITS, from, `${where} from`);
  const t = unitFactor(A, AREA_UNITS, to, `${where} to`);
  return A.div(A.mul(readNumber(A, value, where, ' value'), f), t);
}

/** What {@link polygonArea} returns. All areas are unsigned except `signed`. */
export interface PolygonArea<T> {
  /** Signed shoelace area in square coordinate units: positive counterclockwise (x = east, y = north). */
  readonly signed: T;
  /** `'counterclockwise'`, `'clockwise'` or `'degenerate'` (zero area), as seen on a map, north up. */
  readonly orientation: 'counterclockwise' | 'clockwise' | 'degenerate';
  /** Perimeter in coordinate units (see {@link perimeter} for how it rounds). */
  readonly perimeter: T;
  /** Area in square metres. */
  readonly m2: T;
  /** Area in hectares. */
  readonly ha: T;
  /** Area in square international feet. */
  readonly ft2: T;
  /** Area in square U.S. survey feet. */
  readonly usft2: T;
  /** Area in acres (43 560 international ft²). */
  readonly acres: T;
  /** Area in U.S. survey acres (43 560 survey ft²). */
  readonly usacres: T;
}

/**
 * Area of a polygon in every common unit, with its perimeter and orientation.
 *
 * Vertices `{ x, y }` are x = east, y = north, in the length unit `unit` (default
 * metres; any unit of the readings' `LengthUnit`, e.g. `ft` or `us-ft`). Areas are exact in `rational` (the unit factors are exact); the perimeter is
 * rounded as {@link perimeter} says.
 *
 * @param A the arithmetic
 * @param points three or more vertices
 * @param options `unit`: the coordinate unit, `m` (default), `ft` (international foot),
 *   `us-ft` (U.S. survey foot), `ch` (Gunter's chain) or another `LengthUnit`
 * @returns see {@link PolygonArea}
 * @throws {QuadspreadError} `TOO_FEW_POINTS`; `INVALID_UNIT`; `INVALID_ARGUMENT`/`INVALID_NUMBER` for bad points.
 * @example
 * ```ts
 * import { rational, polygonArea } from 'quadspread';
 * const r = polygonArea(rational, [{ x: 0, y: 0 }, { x: 0, y: 660 }, { x: 66, y: 660 }, { x: 66, y: 0 }], { unit: 'ft' });
 * [r.orientation, rational.toString(r.ft2), rational.toString(r.acres)];
 * //=> ['clockwise', '43560', '1']
 * ```
 */
export function polygonArea<T>(
  A: Arithmetic<T, boolean>,
  points: readonly PointInput<T>[],
  options: { readonly unit?: LengthUnit } = {},
): PolygonArea<T> {
  checkArithmetic(A, 'polygonArea');
  const where = 'polygonArea(A, points, options)';
  expectObject(options, `${where} options`, '{ unit? }');
  const u = A.from(METRES_PER_UNIT[checkLengthUnit(options.unit ?? 'm', `${where} unit`)]);
  let signed: T;
  let per: T;
  try {
    signed = area(A, points);
    per = perimeter(A, points);
  } catch (e) {
    if (e instanceof QuadspreadError)
      throw new QuadspreadError(e.code, where, e.message.replace(/^quadspread \w+: /, ''));
    throw e;
  }
  const size = A.abs(signed);
  const m2 = A.mul(size, A.mul(u, u));
  const inUnit = (k: AreaUnit) => A.div(m2, A.from(AREA_UNITS[k]));
  const s = A.sign(signed);
  return {
    signed,
    orientation: s > 0 ? 'counterclockwise' : s < 0 ? 'clockwise' : 'degenerate',
    perimeter: per,
    m2,
    ha: inUnit('ha'),
    ft2: inUnit('ft2'),
    usft2: inUnit('us-ft2'),
    acres: inUnit('acre'),
    usacres: inUnit('us-acre'),
  };
}
