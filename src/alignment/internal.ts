/**
 * Helpers shared by the alignment files. Not exported from the package.
 *
 * @module alignment
 * @internal
 */
import { show, invalidArgument, inputTooLong, noRealSolution } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { readNumber } from '../geometry/validate.js';
import { approxSqrt } from '../readings/numeric.js';
import { parseStation } from './station.js';

/**
 * Checks that an input is an array of at most `max` items, without holes (a sparse array)
 * unless `holes` (where an absent item means none). @internal
 */
export function readList<U>(x: unknown, where: string, max = 100_000, holes = false): readonly U[] {
  if (!Array.isArray(x)) throw invalidArgument(where, `${show(x)} is not an array`);
  if (x.length > max)
    throw inputTooLong(where, `${x.length} items is more than the limit of ${max}`);
  if (!holes)
    for (let i = 0; i < x.length; i++)
      if (!(i in x))
        throw invalidArgument(`${where}[${i}]`, 'is missing (a hole in a sparse array)');
  return x as readonly U[];
}

/** Throws INVALID_ARGUMENT unless x is a (non-null, non-array) object. @internal */
export function readObject(x: unknown, where: string, shape: string): Record<string, unknown> {
  if (x === null || typeof x !== 'object' || Array.isArray(x))
    throw invalidArgument(where, `${show(x)} is not ${shape}`);
  return x as Record<string, unknown>;
}

/** Reads a point `{ x, y }` (x = east, y = north). @internal */
export function readXY<T>(A: Arithmetic<T>, p: unknown, where: string): Point<T> {
  const o = readObject(p, where, 'a point { x, y } (x = east, y = north)');
  if (!('x' in o) || !('y' in o))
    throw invalidArgument(where, `${show(p)} is not a point { x, y } (x = east, y = north)`);
  return {
    x: readNumber(A, o.x as Numeric<T>, where, '.x'),
    y: readNumber(A, o.y as Numeric<T>, where, '.y'),
  };
}

/** Reads a length that must be ≥ 0 (or > 0 when `positive`). @internal */
export function readLength<T>(A: Arithmetic<T>, x: unknown, where: string, positive = false): T {
  const v = readNumber(A, x as Numeric<T>, where);
  const s = A.sign(v);
  if (s < 0 || (positive && s === 0))
    throw invalidArgument(
      where,
      `${A.toString(v)} is ${s < 0 ? 'negative' : 'zero'}: a ${positive ? 'positive ' : ''}length is needed`,
    );
  return v;
}

/** Reads a chainage: a number or station text such as `'50+84.98'`. @internal */
export function readChainage<T>(A: Arithmetic<T>, x: unknown, where: string): T {
  if (typeof x === 'string' && x.includes('+')) return parseStation(A, x, where);
  return readNumber(A, x as Numeric<T>, where);
}

/** √x for x ≥ 0 (exact where the arithmetic has the root). @internal */
export function root<T>(A: Arithmetic<T>, x: T, where: string): T {
  const s = A.sign(x);
  if (s < 0) throw noRealSolution(where, `√ of the negative value ${A.toString(x)}`);
  return s === 0 ? A.zero : approxSqrt(A, x);
}

/** Unit vector of (dx, dy) ≠ 0 and its length. @internal */
export function unit<T>(A: Arithmetic<T>, dx: T, dy: T, where: string): { u: Point<T>; length: T } {
  const length = root(A, A.add(A.mul(dx, dx), A.mul(dy, dy)), where);
  return { u: { x: A.div(dx, length), y: A.div(dy, length) }, length };
}

/** The unit normal to the right of a direction u (looking along u): (u.y, −u.x). @internal */
export const rightOf = <T>(A: Arithmetic<T>, u: Point<T>): Point<T> => ({ x: u.y, y: A.neg(u.x) });

/** p + s·u. @internal */
export const along = <T>(A: Arithmetic<T>, p: Point<T>, u: Point<T>, s: T): Point<T> => ({
  x: A.add(p.x, A.mul(s, u.x)),
  y: A.add(p.y, A.mul(s, u.y)),
});

/** Rotates u clockwise (sense +1) or anticlockwise (sense −1) by the angle with cos c, sin s. @internal */
export function rotate<T>(A: Arithmetic<T>, u: Point<T>, c: T, s: T, sense: 1 | -1): Point<T> {
  const ss = sense > 0 ? s : A.neg(s);
  // Clockwise on the map (x east, y north): (x, y) → (x cos + y sin, −x sin + y cos).
  return { x: A.add(A.mul(u.x, c), A.mul(u.y, ss)), y: A.sub(A.mul(u.y, c), A.mul(u.x, ss)) };
}

/**
 * cos φ and sin φ of an angle φ in radians (|φ| < π), through the rational parametrisation of
 * the circle: t = tan(φ/2) from the arithmetic's sin and cos, then cos = (1 − t²)/(1 + t²),
 * sin = 2t/(1 + t²), so that cos² + sin² = 1 exactly in an exact arithmetic (the point is exactly
 * on the circle; only its angle carries the transcendental tolerance). @internal
 */
export function circleCosSin<T>(A: Arithmetic<T>, phi: T): { c: T; s: T } {
  if (A.isZero(phi)) return { c: A.one, s: phi };
  const c0 = A.cos(phi);
  const s0 = A.sin(phi);
  if (!A.exact) return { c: c0, s: s0 };
  const t = A.div(s0, A.add(A.one, c0)); // tan(φ/2) = sin φ/(1 + cos φ)
  const t2 = A.mul(t, t);
  const d = A.add(A.one, t2);
  return { c: A.div(A.sub(A.one, t2), d), s: A.div(A.add(t, t), d) };
}

/** Degrees per radian, 180/π, in the arithmetic. @internal */
export const degPerRad = <T>(A: Arithmetic<T>): T => A.div(A.from(180), A.pi);

/** Azimuth in degrees clockwise from north of a nonzero vector (exact on axes and diagonals). @internal */
export function azimuth<T>(A: Arithmetic<T>, u: Point<T>): T {
  const sx = A.sign(u.x);
  const sy = A.sign(u.y);
  if (sx === 0) return A.from(sy > 0 ? 0 : 180);
  if (sy === 0) return A.from(sx > 0 ? 90 : 270);
  if (A.eq(A.abs(u.x), A.abs(u.y)))
    return A.from(sx > 0 ? (sy > 0 ? 45 : 135) : sy < 0 ? 225 : 315);
  // Azimuth clockwise from north = atan2(east, north).
  let d = A.mul(A.atan2(u.x, u.y), degPerRad(A));
  if (A.sign(d) < 0) d = A.add(d, A.from(360));
  return d;
}

/**
 * The smallest term a series keeps: 1e-45 in an exact arithmetic, 10^−(digits+3) in
 * `decimal(digits)`, 1e-18 otherwise. @internal
 */
export function seriesEpsilon<T>(A: Arithmetic<T>): T {
  if (A.exact) return A.from('1e-45');
  const digits = (A as { digits?: unknown }).digits;
  return A.from(typeof digits === 'number' ? `1e-${digits + 3}` : '1e-18');
}

/** Rounds an iterate in an exact arithmetic (to 45 digits) so its size stays bounded. @internal */
export function trim<T>(A: Arithmetic<T>, x: T): T {
  return A.exact && typeof (x as { gradient?: unknown }).gradient === 'undefined'
    ? A.from(A.toPrecision(x, 45))
    : x;
}
