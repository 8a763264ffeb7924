/**
 * Internal helpers: readers that check numbers, quadrances and spreads where they enter,
 * and the clamp of computed spreads.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from './point.js';
import {
  QuadspreadError,
  show,
  invalidArgument,
  invalidNumber,
  negativeQuadrance,
  notFinite,
} from '../errors.js';

/**
 * Reads a value with `A.from`; an error it raises is raised again naming `where` (the
 * function and the argument, e.g. `area(A, points)[2].x`) instead of `A.from(x)`. `where`
 * may be a function (and `suffix` is appended), so that loops build the text only on error.
 * @throws {QuadspreadError} `INVALID_NUMBER`, `INPUT_TOO_LONG` (the code of `A.from`).
 * @internal
 */
export function readNumber<T>(
  A: Arithmetic<T>,
  x: Numeric<T>,
  where: string | (() => string),
  suffix = '',
): T {
  try {
    return A.from(x);
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    const what = e.message.slice(`quadspread ${e.code}: ${e.where}: `.length);
    throw new QuadspreadError(e.code, (typeof where === 'string' ? where : where()) + suffix, what);
  }
}

/**
 * An input for an error message: as the caller wrote it, or, when it was a value of the
 * arithmetic (an object), that value as text.
 * @internal
 */
export function shownInput<T>(A: Arithmetic<T>, x: unknown, v: T): string {
  return show(typeof x === 'object' ? A.toString(v) : x);
}

/**
 * Returns `r`, or throws `NOT_FINITE` when it is a float (or `uncertain(float)`) value that is
 * not finite. `float` leaves `add`, `sub` and `mul` unchecked for speed, so the functions whose
 * result is a bare sum, difference or product check it here, once; exact and decimal values are
 * always finite.
 * @throws {QuadspreadError} `NOT_FINITE` naming `where`.
 * @internal
 */
export function finiteResult<T>(r: T, where: string): T {
  const v = typeof r === 'object' && r !== null ? (r as { value?: unknown }).value : r;
  if (typeof v === 'number' && v - v !== 0)
    throw notFinite(
      where,
      `the result ${show(v)} is not finite: float overflowed (use decimal(n) for values this large) or an input was not a number`,
    );
  return r;
}

/**
 * Throws `INVALID_ARGUMENT` at `where` unless `x` is an object (not null), so that a missing or
 * wrong input gives a typed error rather than a TypeError from reading its fields. `shape`
 * says what was expected, e.g. `{ lat, lon }`; `where` may be a function, called only on error.
 * @throws {QuadspreadError} `INVALID_ARGUMENT`: "… is not {shape}".
 * @internal
 */
export function expectObject(
  x: unknown,
  where: string | (() => string),
  shape: string,
): asserts x is object {
  if (x === null || typeof x !== 'object') notAnObject(x, where, shape);
}

/** The error of {@link expectObject} (kept apart, so that the check is small to inline). */
function notAnObject(x: unknown, where: string | (() => string), shape: string): never {
  throw invalidArgument(typeof where === 'string' ? where : where(), `${show(x)} is not ${shape}`);
}

/**
 * Reads a quadrance with `A.from` and checks that it is ≥ 0.
 * @throws {QuadspreadError} `NEGATIVE_QUADRANCE`; `INVALID_NUMBER` naming the argument.
 * @internal
 */
export function readQuadrance<T>(A: Arithmetic<T>, x: Numeric<T>, where: string, arg: string): T {
  const v = readNumber(A, x, where, ` ${arg}`);
  if (A.sign(v) < 0)
    throw negativeQuadrance(
      where,
      `${arg} = ${show(A.toString(v))} is negative; a quadrance is a squared distance`,
    );
  return v;
}

/**
 * Reads a spread with `A.from` and checks that it lies in [0, 1].
 * @throws {QuadspreadError} `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER` naming the argument.
 * @internal
 */
export function readSpread<T>(A: Arithmetic<T>, x: Numeric<T>, where: string, arg: string): T {
  const v = readNumber(A, x, where, ` ${arg}`);
  if (A.sign(v) < 0 || A.cmp(v, A.one) > 0)
    throw new QuadspreadError(
      'SPREAD_OUT_OF_RANGE',
      where,
      `${arg} = ${show(A.toString(v))} is outside [0, 1]`,
    );
  return v;
}

/**
 * A computed spread or cross clamped to at most 1: rounding (float, decimal) can push one just
 * above 1. Never acts in `rational`.
 * @internal
 */
export function atMostOne<T>(A: Arithmetic<T>, s: T): T {
  return A.cmp(s, A.one) > 0 ? A.one : s;
}

/**
 * Checks a point made by `point` (or a vector): an object whose `x` and `y` are values of the
 * arithmetic. Checked once where a geometry primitive starts, so that `{ x: '0x10' }` or
 * `{ x: null }` is refused rather than coerced by the float-specialised code. @internal
 */
export function checkPoint<T>(A: Arithmetic<T>, P: unknown, where: string): void {
  // The error is built elsewhere, so that this check stays small enough for V8 to inline into
  // the solvers' float copies (docs/performance.md).
  if (typeof P !== 'object' || P === null || !A.is((P as { x: T }).x) || !A.is((P as { y: T }).y))
    notAPoint(A, P, where);
}

/**
 * {@link checkPoint} for the three points of a triangle (`where` + `(A1)`, `(A2)`, `(A3)` in
 * the error). @internal
 */
export function checkPoints3<T>(
  A: Arithmetic<T>,
  P1: unknown,
  P2: unknown,
  P3: unknown,
  where: string,
): void {
  checkPoint(A, P1, `${where}(A1)`);
  checkPoint(A, P2, `${where}(A2)`);
  checkPoint(A, P3, `${where}(A3)`);
}

function notAPoint<T>(A: Arithmetic<T>, P: unknown, where: string): never {
  throw invalidNumber(
    where,
    `${show(P)} is not a point of ${A.name}: { x, y } or [x, y] of its values, as point(${A.name}, x, y) makes`,
  );
}

/** Checks a line made by `line` or `lineThrough`: `a`, `b`, `c` values of the arithmetic. @internal */
export function checkLine<T>(A: Arithmetic<T>, l: unknown, where: string): void {
  if (
    typeof l !== 'object' ||
    l === null ||
    !A.is((l as { a: T }).a) ||
    !A.is((l as { b: T }).b) ||
    !A.is((l as { c: T }).c)
  )
    throw invalidNumber(
      where,
      `${show(l)} is not a line of ${A.name}: make it with line(${A.name}, a, b, c) or lineThrough`,
    );
}

/**
 * Reads a plane point into the arithmetic: `{ x, y }` (x = east, y = north) or an array
 * `[x, y]` in that order. Errors name `where` and the coordinate (`.x`, `[0]`, …).
 * @internal
 */
export function readPoint<T>(A: Arithmetic<T, boolean>, p: unknown, where: string): Point<T> {
  if (Array.isArray(p)) {
    if (p.length !== 2 || !(0 in p) || !(1 in p))
      throw invalidArgument(
        where,
        `an array point must be [x, y] (x = east, y = north), not ${p.length} entries`,
      );
    return { x: readNumber(A, p[0], where, '[0]'), y: readNumber(A, p[1], where, '[1]') };
  }
  if (p === null || typeof p !== 'object' || !('x' in p) || !('y' in p)) {
    throw invalidArgument(
      where,
      `${show(p)} is not a point { x, y } or [x, y] (x = east, y = north)`,
    );
  }
  const q = p as { x: Numeric<T>; y: Numeric<T> };
  return { x: readNumber(A, q.x, where, '.x'), y: readNumber(A, q.y, where, '.y') };
}
