/**
 * The Molodensky–Badekas ten-parameter transformation of geocentric coordinates (EPSG
 * methods 1034 and 1061): a Helmert transformation whose rotation and scale act about an
 * evaluation point (the pivot) instead of the Earth's centre.
 *
 * @module geodesy
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { invalidArgument, checkArithmetic } from '../errors.js';
import type { Geocentric } from './geocentric.js';
import {
  readHelmert,
  readXyz,
  rotate,
  unrotate,
  type HelmertParameters,
  type HelmertValues,
} from './helmert.js';

/** The seven Helmert parameters plus the evaluation point `pivot: { X, Y, Z }` in metres (source frame). */
export interface MolodenskyBadekasParameters<T> extends HelmertParameters<T> {
  readonly pivot: Geocentric<Numeric<T>>;
}

function read<T>(
  A: Arithmetic<T>,
  p: MolodenskyBadekasParameters<T>,
  where: string,
): HelmertValues<T> & { p: [T, T, T] } {
  const h = readHelmert(A, p, where);
  if (p.pivot === undefined)
    throw invalidArgument(`${where}.pivot`, 'the pivot { X, Y, Z } is missing');
  return { ...h, p: readXyz(A, p.pivot, `${where}.pivot`) };
}

/**
 * The Molodensky–Badekas transformation (IOGP Guidance Note 7-2, §4.4.3.2, EPSG methods 1034
 * coordinate frame and 1061 position vector): X_t = M·R·(X_s − X_p) + X_p + T, with M, R and
 * the conventions as in {@link helmert} and X_p the evaluation point in the source frame.
 * The published examples are coordinate-frame; the convention is required.
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, source frame
 * @param params `{ tx, ty, tz, rx, ry, rz, ds, convention, pivot: { X, Y, Z } }`
 * @returns `{ X, Y, Z }` in metres, target frame
 * @throws {QuadspreadError} as {@link helmert}; `INVALID_ARGUMENT` for a missing pivot.
 * @example
 * ```ts
 * import { float, molodenskyBadekas } from 'quadspread';
 * // The parameters of the IOGP GN 7-2 §4.4.3.2 example, La Canoa to REGVEN (it prints
 * // 2550138.467, −5749799.862, 1054530.826: within 7, 14 and 7 mm; see docs/geodesy.md)
 * const p = molodenskyBadekas(float, { X: 2550408.965, Y: -5749912.266, Z: 1054891.114 }, {
 *   tx: -270.933, ty: 115.599, tz: -360.226, rx: -5.266, ry: -1.238, rz: 2.381, ds: -5.109,
 *   convention: 'coordinate-frame', pivot: { X: 2464351.59, Y: -5783466.61, Z: 974809.81 } });
 * [p.X.toFixed(3), p.Y.toFixed(3), p.Z.toFixed(3)];
 * //=> ['2550138.460', '-5749799.876', '1054530.819']
 * ```
 */
export function molodenskyBadekas<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: MolodenskyBadekasParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'molodenskyBadekas');
  const v = readXyz(A, point, 'molodenskyBadekas(point)');
  const { t, w, m, p } = read(A, params, 'molodenskyBadekas(params)');
  const r = rotate(A, w, [0, 1, 2].map((i) => A.sub(v[i]!, p[i]!)) as [T, T, T]);
  const [X, Y, Z] = [0, 1, 2].map((i) => A.add(A.add(A.mul(m, r[i]!), p[i]!), t[i]!));
  return { X: X!, Y: Y!, Z: Z! };
}

/**
 * The exact inverse of {@link molodenskyBadekas} with the same parameters:
 * X_s = R⁻¹·(X_t − X_p − T)/M + X_p.
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, target frame
 * @param params the parameters of the forward transformation
 * @returns `{ X, Y, Z }` in metres, source frame
 * @throws {QuadspreadError} as {@link molodenskyBadekas}.
 * @example
 * ```ts
 * import { float, molodenskyBadekasInverse } from 'quadspread';
 * const q = { tx: -270.933, ty: 115.599, tz: -360.226, rx: -5.266, ry: -1.238, rz: 2.381,
 *   ds: -5.109, convention: 'coordinate-frame' as const,
 *   pivot: { X: 2464351.59, Y: -5783466.61, Z: 974809.81 } };
 * const p = molodenskyBadekasInverse(float, { X: 2550138.460, Y: -5749799.876, Z: 1054530.819 }, q);
 * [p.X.toFixed(3), p.Y.toFixed(3), p.Z.toFixed(3)];
 * //=> ['2550408.965', '-5749912.266', '1054891.114']
 * ```
 */
export function molodenskyBadekasInverse<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: MolodenskyBadekasParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'molodenskyBadekasInverse');
  const v = readXyz(A, point, 'molodenskyBadekasInverse(point)');
  const { t, w, m, p } = read(A, params, 'molodenskyBadekasInverse(params)');
  const u = [0, 1, 2].map((i) => A.div(A.sub(A.sub(v[i]!, p[i]!), t[i]!), m)) as [T, T, T];
  const r = unrotate(A, w, u);
  return { X: A.add(r[0], p[0]), Y: A.add(r[1], p[1]), Z: A.add(r[2], p[2]) };
}
