/**
 * The seven-parameter Helmert transformation of geocentric coordinates (EPSG methods 1033
 * position vector and 1032 coordinate frame), its exact inverse and the EPSG reversal by
 * changing the parameters' signs.
 *
 * @module geodesy
 */
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, expectObject, finiteResult } from '../geometry/validate.js';
import type { Geocentric } from './geocentric.js';

/**
 * Which way the rotation angles turn: `'position-vector'` rotates the position vector (EPSG
 * 9606/1033/1037), `'coordinate-frame'` rotates the axes (EPSG 9607/1032/1038). The same
 * transformation has rotations of opposite sign in the two conventions.
 */
export type HelmertConvention = 'position-vector' | 'coordinate-frame';

/** Units a rotation angle may be given in: arc-seconds, microradians or radians. */
export type RotationUnit = 'arcsec' | 'urad' | 'rad';

/** A rotation angle: a number in arc-seconds, or `{ value, unit }`. */
export type RotationInput<T> =
  Numeric<T> | { readonly value: Numeric<T>; readonly unit: RotationUnit };

/**
 * The seven parameters: translations `tx`, `ty`, `tz` in metres, rotations `rx`, `ry`, `rz`
 * (arc-seconds by default), the scale difference `ds` in parts per million, and the rotation
 * `convention` (required: there is no safe default).
 */
export interface HelmertParameters<T> {
  readonly tx: Numeric<T>;
  readonly ty: Numeric<T>;
  readonly tz: Numeric<T>;
  readonly rx: RotationInput<T>;
  readonly ry: RotationInput<T>;
  readonly rz: RotationInput<T>;
  readonly ds: Numeric<T>;
  readonly convention: HelmertConvention;
}

/** @internal Parameters read into the arithmetic: the rotation vector of the position-vector form, in radians, and M = 1 + ds·10⁻⁶. */
export interface HelmertValues<T> {
  readonly t: readonly [T, T, T];
  /** position-vector rotation vector (coordinate-frame rotations with their signs changed) */
  readonly w: readonly [T, T, T];
  readonly m: T;
}

/** @internal A rotation in radians from arc-seconds (the default), microradians or radians. */
export function readRotation<T>(A: Arithmetic<T>, r: RotationInput<T>, where: string): T {
  if (r !== null && typeof r === 'object' && !A.is(r)) {
    const { value, unit } = r as { value: Numeric<T>; unit: unknown };
    const v = readNumber(A, value, `${where}.value`);
    if (unit === 'rad') return v;
    if (unit === 'urad') return A.div(v, A.from(1000000));
    if (unit === 'arcsec') return arcsec(A, v);
    throw new QuadspreadError(
      'INVALID_UNIT',
      `${where}.unit`,
      `${show(unit)} is not a rotation unit ('arcsec', 'urad' or 'rad')`,
    );
  }
  if (r === undefined) throw invalidArgument(where, 'the rotation is missing');
  return arcsec(A, readNumber(A, r as Numeric<T>, where));
}

/** 1″ = π/648000 rad (the definition of the arc-second). */
function arcsec<T>(A: Arithmetic<T>, v: T): T {
  return A.div(A.mul(v, A.pi), A.from(648000));
}

/** @internal The convention, refused unless it is one of the two. */
export function readConvention(c: unknown, where: string): HelmertConvention {
  if (c !== 'position-vector' && c !== 'coordinate-frame') {
    throw invalidArgument(
      where,
      `${show(c)} is not a rotation convention: say 'position-vector' or 'coordinate-frame' (the two turn the rotations opposite ways)`,
    );
  }
  return c;
}

/** @internal Reads the seven parameters into the arithmetic. */
export function readHelmert<T>(
  A: Arithmetic<T>,
  p: HelmertParameters<T>,
  where: string,
): HelmertValues<T> {
  expectObject(p, where, '{ tx, ty, tz, rx, ry, rz, ds, convention }');
  const conv = readConvention(p.convention, `${where}.convention`);
  const need = (k: 'tx' | 'ty' | 'tz' | 'ds'): T => {
    if (p[k] === undefined) throw invalidArgument(`${where}.${k}`, `${k} is missing`);
    return readNumber(A, p[k], `${where}.${k}`);
  };
  const t = [need('tx'), need('ty'), need('tz')] as const;
  const r = [
    readRotation(A, p.rx, `${where}.rx`),
    readRotation(A, p.ry, `${where}.ry`),
    readRotation(A, p.rz, `${where}.rz`),
  ] as const;
  // The coordinate-frame matrix is the transpose of the position-vector one (IOGP GN 7-2,
  // §4.4.3.1): the same as position vector with the rotations' signs changed.
  const w = conv === 'position-vector' ? r : ([A.neg(r[0]), A.neg(r[1]), A.neg(r[2])] as const);
  const m = A.add(A.one, A.div(need('ds'), A.from(1000000))); // M = 1 + dS·10⁻⁶
  return { t, w, m };
}

/** @internal Reads X, Y, Z. */
export function readXyz<T>(A: Arithmetic<T>, p: Geocentric<Numeric<T>>, where: string): [T, T, T] {
  expectObject(p, where, '{ X, Y, Z }');
  return [
    readNumber(A, p.X, `${where}.X`),
    readNumber(A, p.Y, `${where}.Y`),
    readNumber(A, p.Z, `${where}.Z`),
  ];
}

/** @internal v + w × v: the linearised rotation matrix of GN 7-2 applied to v. */
export function rotate<T>(
  A: Arithmetic<T>,
  w: readonly [T, T, T],
  v: readonly [T, T, T],
): [T, T, T] {
  const [x, y, z] = v;
  const [a, b, c] = w;
  // [[1, −rZ, +rY], [+rZ, 1, −rX], [−rY, +rX, 1]]·v (position vector, IOGP GN 7-2 §4.4.3.1)
  return [
    A.add(x, A.sub(A.mul(b, z), A.mul(c, y))),
    A.add(y, A.sub(A.mul(c, x), A.mul(a, z))),
    A.add(z, A.sub(A.mul(a, y), A.mul(b, x))),
  ];
}

/**
 * @internal The exact inverse of {@link rotate}: (I + [w]×)⁻¹ v = (v − w × v + w (w·v)) / (1 + |w|²)
 * (the inverse of I + S for a skew-symmetric S with axial vector w, by S² = wwᵀ − |w|² I).
 */
export function unrotate<T>(
  A: Arithmetic<T>,
  w: readonly [T, T, T],
  v: readonly [T, T, T],
): [T, T, T] {
  const [a, b, c] = w;
  const [x, y, z] = v;
  const dot = A.add(A.add(A.mul(a, x), A.mul(b, y)), A.mul(c, z));
  const den = A.add(A.one, A.add(A.add(A.mul(a, a), A.mul(b, b)), A.mul(c, c)));
  const cross = [
    A.sub(A.mul(b, z), A.mul(c, y)),
    A.sub(A.mul(c, x), A.mul(a, z)),
    A.sub(A.mul(a, y), A.mul(b, x)),
  ];
  return [0, 1, 2].map((i) => A.div(A.add(A.sub(v[i]!, cross[i]!), A.mul(w[i]!, dot)), den)) as [
    T,
    T,
    T,
  ];
}

/** The result, each coordinate checked finite (float leaves sums and products unchecked). */
function out<T>(v: readonly [T, T, T], where: string): Geocentric<T> {
  return {
    X: finiteResult(v[0], where),
    Y: finiteResult(v[1], where),
    Z: finiteResult(v[2], where),
  };
}

/**
 * The seven-parameter Helmert transformation of geocentric coordinates, in the form IOGP
 * Guidance Note 7-2 gives (§4.4.3.1, EPSG methods 1033 position vector and 1032 coordinate
 * frame): X_t = M·R·X_s + T, with M = 1 + ds·10⁻⁶ and R the rotation matrix linearised in the
 * small angles, [[1, −rZ, rY], [rZ, 1, −rX], [−rY, rX, 1]] for position vector and its
 * transpose for coordinate frame.
 *
 * Exact in `rational` when the rotations are given in radians or microradians (arc-seconds
 * need π, which `rational` holds to 40 digits); rounded once per operation otherwise.
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, in the source frame
 * @param params `{ tx, ty, tz, rx, ry, rz, ds, convention }`: metres; arc-seconds or
 *   `{ value, unit: 'arcsec' | 'urad' | 'rad' }`; parts per million; `'position-vector'` or
 *   `'coordinate-frame'`
 * @returns `{ X, Y, Z }` in metres, in the target frame
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing or unknown convention or a
 *   missing parameter; `INVALID_UNIT` for an unknown rotation unit; `INVALID_NUMBER` for a
 *   value that is not a number; `NOT_FINITE` in float when a coordinate overflows.
 * @example
 * ```ts
 * import { float, helmert } from 'quadspread';
 * // IOGP GN 7-2 §4.4.3.1 worked example, WGS 72 to WGS 84 (it prints 3657660.78, 255778.43,
 * // 5201387.75 m, computed from the unrounded source coordinates)
 * const p = helmert(float, { X: 3657660.66, Y: 255768.55, Z: 5201382.11 },
 *   { tx: 0, ty: 0, tz: 4.5, rx: 0, ry: 0, rz: 0.554, ds: 0.219, convention: 'position-vector' });
 * [p.X.toFixed(3), p.Y.toFixed(3), p.Z.toFixed(3)];
 * //=> ['3657660.774', '255778.430', '5201387.749']
 * ```
 */
export function helmert<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: HelmertParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'helmert');
  const v = readXyz(A, point, 'helmert(point)');
  const { t, w, m } = readHelmert(A, params, 'helmert(params)');
  const r = rotate(A, w, v);
  return out([0, 1, 2].map((i) => A.add(A.mul(m, r[i]!), t[i]!)) as [T, T, T], 'helmert');
}

/**
 * The exact inverse of {@link helmert}: X_s = R⁻¹·(X_t − T)/M with the same parameters, so
 * that `helmertInverse(helmert(X))` is X (exactly in `rational` for rotations in radians or
 * microradians). It differs from {@link helmertReversed}, the EPSG reversal by changing the
 * parameters' signs, by the second-order terms (about |r|·|T| + ds·|T| + |r|²·|X|: millimetres
 * to centimetres for large parameters).
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, in the target frame of `params`
 * @param params the parameters of the forward transformation (as {@link helmert})
 * @returns `{ X, Y, Z }` in metres, in the source frame
 * @throws {QuadspreadError} as {@link helmert}.
 * @example
 * ```ts
 * import { rational, helmert, helmertInverse } from 'quadspread';
 * const P = { tx: 446.448, ty: -125.157, tz: 542.06, rx: { value: 1, unit: 'urad' as const },
 *   ry: { value: 2, unit: 'urad' as const }, rz: { value: 4, unit: 'urad' as const }, ds: -20.489,
 *   convention: 'coordinate-frame' as const };
 * const back = helmertInverse(rational, helmert(rational, { X: 3909833, Y: -147097, Z: 5020336 }, P), P);
 * [back.X, back.Y, back.Z].map((v) => rational.toString(v));
 * //=> ['3909833', '-147097', '5020336']
 * ```
 */
export function helmertInverse<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: HelmertParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'helmertInverse');
  const v = readXyz(A, point, 'helmertInverse(point)');
  const { t, w, m } = readHelmert(A, params, 'helmertInverse(params)');
  const u = [0, 1, 2].map((i) => A.div(A.sub(v[i]!, t[i]!), m)) as [T, T, T];
  return out(unrotate(A, w, u), 'helmertInverse');
}

/**
 * The EPSG reversal of {@link helmert}: the same formula with the signs of all seven
 * parameters changed (IOGP GN 7-2 §4.4.3.1: "reversible by changing the signs of the
 * parameters"), which is how published reverse transformations are defined and how
 * conformance data compute the reverse direction. It is not the exact inverse (see
 * {@link helmertInverse}).
 *
 * @param A the arithmetic
 * @param point `{ X, Y, Z }` in metres, in the target frame of `params`
 * @param params the parameters of the forward transformation (as {@link helmert})
 * @returns `{ X, Y, Z }` in metres, in the source frame
 * @throws {QuadspreadError} as {@link helmert}.
 * @example
 * ```ts
 * import { float, helmertReversed } from 'quadspread';
 * const p = helmertReversed(float, { X: 3657660.78, Y: 255778.43, Z: 5201387.75 },
 *   { tx: 0, ty: 0, tz: 4.5, rx: 0, ry: 0, rz: 0.554, ds: 0.219, convention: 'position-vector' });
 * [p.X.toFixed(3), p.Y.toFixed(3), p.Z.toFixed(3)];
 * //=> ['3657660.666', '255768.550', '5201382.111']
 * ```
 */
export function helmertReversed<T>(
  A: Arithmetic<T>,
  point: Geocentric<Numeric<T>>,
  params: HelmertParameters<T>,
): Geocentric<T> {
  checkArithmetic(A, 'helmertReversed');
  const v = readXyz(A, point, 'helmertReversed(point)');
  const { t, w, m } = readHelmert(A, params, 'helmertReversed(params)');
  const two = A.from(2);
  const mr = A.sub(two, m); // 1 − ds·10⁻⁶
  const wr = [A.neg(w[0]), A.neg(w[1]), A.neg(w[2])] as const;
  const r = rotate(A, wr, v);
  return out([0, 1, 2].map((i) => A.sub(A.mul(mr, r[i]!), t[i]!)) as [T, T, T], 'helmertReversed');
}
