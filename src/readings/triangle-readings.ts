/**
 * Solving a triangle from three of its measures as instruments give them: sides and angles,
 * or quadrances and spreads, in any mix.
 *
 * @module geometry
 */
import { invalidArgument, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { isSurd, surd } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';
import type { Triangle } from '../geometry/triangle.js';
import { solveTriangleQs } from '../geometry/solve-triangle.js';
import type { TriangleMeasures } from '../geometry/solve-triangle.js';
import { angleToDegrees } from './angle.js';
import { lengthIn } from './length.js';
import { sinCosDegrees } from './trig.js';

/**
 * Three measures of a triangle: quadrances `Q1..3` and spreads `s1..3`, or sides
 * `side1..3` (lengths: numbers, or text with a unit such as `'250.00 ft'`, read into metres)
 * and angles `angle1..3` (degrees or DMS text) — index i opposite vertex Ai, as in
 * {@link Triangle}. A side and the quadrance of the same index (or an angle and its spread)
 * may not both be given.
 */
export type TriangleKnown<V> = TriangleMeasures<V> &
  Partial<Record<'side1' | 'side2' | 'side3' | 'angle1' | 'angle2' | 'angle3', V>>;

/**
 * Every triangle with the three given measures, each with all six measures (quadrances and
 * spreads) and the quadrea. Sides and angles are read as the job file reads them — a side
 * into its quadrance Q = side² (bare numbers in metres, text converted from its unit), an angle
 * into its spread s = sin²θ — then the triangle is solved in quadrances and spreads:
 *
 * - three quadrances: one triangle (spreads by the cross law);
 * - two quadrances and the spread between them: two triangles in general, since a spread does
 *   not tell an angle from its supplement; one when the spread is 1;
 * - two quadrances and a spread opposite one of them: the ambiguous case, 0, 1 or 2 triangles;
 * - one quadrance and two spreads: the third spread from the triple spread formula, then the
 *   quadrances by the spread law.
 *
 * A given **angle** tells what its spread cannot: triangles whose angle there is acute where
 * the given one is obtuse (or the other way round) are dropped, decided by the sign of
 * Qj + Qk − Qi = 2√(Qj·Qk)·cos θ (the cross law); within 1e-9 of a right angle both are kept.
 *
 * **Exactness**: quadrances and spreads given exactly give exact surds in `rational` (one
 * radicand per triangle); angles go through sine and cosine, so in `rational` their spreads
 * are within the arithmetic's transcendental tolerance. **No solution** gives an empty list,
 * never NaN.
 *
 * @param A the arithmetic
 * @param known exactly three of `Q1..3`, `s1..3`, `side1..3`, `angle1..3`, at least one a
 *   side or quadrance, one per index and kind
 * @returns 0, 1 or 2 triangles
 * @throws {QuadspreadError} `NEEDS_A_QUADRANCE` for three angles or spreads; `INVALID_ARGUMENT`
 *   unless exactly three known measures are given (and no other keys), or for a side and a
 *   quadrance (an angle and a spread) of the same index, or an angle outside (0°, 180°);
 *   `NEGATIVE_QUADRANCE`, `SPREAD_OUT_OF_RANGE`, `INVALID_NUMBER`, `INVALID_UNIT`,
 *   `INVALID_ANGLE` for bad values; `NOT_FINITE` in float when the quadrea overflows.
 * @example
 * ```ts
 * import { rational, solveTriangle } from 'quadspread';
 * solveTriangle(rational, { Q1: 25, Q2: 16, s3: '1/2' }).map((t) => t.Q3.toString());
 * //=> ['41 - 20√2', '41 + 20√2']
 * // Two sides in feet and the right angle between them: Q3 = (50 ft)² in m², exactly.
 * solveTriangle(rational, { side1: '30 ft', side2: '40 ft', angle3: 90 }).map((t) => t.Q3.toString());
 * //=> ['145161/625']
 * ```
 */
export function solveTriangle<T, E extends boolean>(
  A: Arithmetic<T, E>,
  known: TriangleKnown<Numeric<T>>,
): Triangle<Root<T, E>>[] {
  checkArithmetic(A, 'solveTriangle');
  const w = 'solveTriangle(A, known)';
  if (typeof known !== 'object' || known === null)
    throw invalidArgument(w, `known = ${show(known)} is not an object`);
  const qs: Record<string, Numeric<T>> = {};
  const angles: { i: number; cos: T }[] = [];
  for (const [k, v] of Object.entries(known)) {
    const m = /^(Q|s|side|angle)([123])$/.exec(k);
    if (!m)
      throw invalidArgument(
        w,
        `unknown measure ${show(k)}; use Q1..3, s1..3, side1..3 or angle1..3`,
      );
    if (v === undefined) continue;
    const i = m[2]!;
    const key = m[1] === 'Q' || m[1] === 'side' ? `Q${i}` : `s${i}`;
    if (key in qs)
      throw invalidArgument(
        w,
        `${k} gives ${key} a second time (a side and its quadrance, or an angle and its spread)`,
      );
    if (m[1] === 'side') {
      const d = lengthIn(A, v, 'm');
      if (A.sign(d) <= 0) throw invalidArgument(`${w}.${k}`, `${show(v)} is not a positive length`);
      qs[key] = A.mul(d, d);
    } else if (m[1] === 'angle') {
      const deg = angleToDegrees(A, v);
      if (A.sign(deg) <= 0 || A.cmp(deg, A.from(180)) >= 0)
        throw invalidArgument(
          `${w}.${k}`,
          `${show(v)} is not an angle of a triangle, in (0°, 180°)`,
        );
      const sc = sinCosDegrees(A, deg);
      qs[key] = A.mul(sc.sin, sc.sin);
      angles.push({ i: Number(i), cos: sc.cos });
    } else qs[key] = v;
  }
  const found = solveTriangleQs(A, qs as TriangleMeasures<Numeric<T>>);
  if (found.length < 2 || angles.length === 0) return found;
  // Keep the triangles whose given angles are acute, right or obtuse as given.
  return found.filter((t) =>
    angles.every(({ i, cos }) => {
      const c = A.toNumber(cos);
      if (Math.abs(c) <= 1e-9) return true;
      return crossSign(A, t, i) === Math.sign(c);
    }),
  );
}

/** The sign of Qj + Qk − Qi for the angle at Ai (exact for surds). */
function crossSign<T, E extends boolean>(
  A: Arithmetic<T, E>,
  t: Triangle<Root<T, E>>,
  i: number,
): number {
  const Q = [t.Q1, t.Q2, t.Q3] as unknown[];
  const [qi, qj, qk] = [Q[i - 1], Q[i % 3], Q[(i + 1) % 3]];
  if (A.exact) {
    const s = (x: unknown) => (isSurd(x) ? x : surd(A, x as T));
    return s(qj)
      .add(s(qk) as never)
      .sub(s(qi) as never)
      .sign();
  }
  const d = A.toNumber(A.sub(A.add(qj as T, qk as T), qi as T));
  return Math.abs(d) <= 2e-9 * Math.sqrt(A.toNumber(qj as T) * A.toNumber(qk as T))
    ? 0
    : Math.sign(d);
}
