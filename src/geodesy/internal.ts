/**
 * Internal helpers of the geodesy area: reading latitudes, longitudes and heights, square
 * roots that are exact where they can be, and the precision an arithmetic claims.
 *
 * @module geodesy
 * @internal
 */
import { QuadspreadError, show, invalidAngle, unsupportedOperation } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, shownInput } from '../geometry/validate.js';
import { Uncertain, uncertain } from '../arithmetic/uncertain.js';
import { angleToDegrees, type AngleUnit } from '../readings/angle.js';
import { approxSqrt } from '../readings/numeric.js';

/** @internal √x for x ≥ 0: exact or correctly rounded where the arithmetic can, else within 1e-48 relative. */
export function root<T>(A: Arithmetic<T>, x: T): T {
  return approxSqrt(A, x);
}

/**
 * @internal Significant digits an arithmetic's results claim ({@link Arithmetic.digits}): n
 * for `decimal(n)` (also inside an uncertain one), 42 for `rational` (its transcendental
 * functions), 15 for float.
 */
export function claimedDigits<T>(A: Arithmetic<T>): number {
  return A.digits;
}

/** @internal 10^−k in the arithmetic. */
export function tenToMinus<T>(A: Arithmetic<T>, k: number): T {
  // Read from text once per arithmetic and k (a pure memo: arithmetics and values are immutable).
  let memo = POWERS.get(A) as T[] | undefined;
  if (memo === undefined) {
    memo = [];
    POWERS.set(A, memo);
  }
  let v = memo[k];
  if (v === undefined) {
    v = A.from(`1e-${k}`);
    if (k >= 0 && k < 4096 && Number.isInteger(k)) memo[k] = v;
  }
  return v;
}
const POWERS = /* @__PURE__ */ new WeakMap<object, unknown[]>();

/**
 * @internal An angle reading in degrees (decimal degrees, DMS text, or `unit`) by the
 * readings' `angleToDegrees`; its errors name `where` (the caller's argument) instead.
 */
export function readAngle<T>(A: Arithmetic<T>, x: Numeric<T>, where: string, unit?: AngleUnit): T {
  try {
    return angleToDegrees(A, x, unit);
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    throw new QuadspreadError(
      e.code,
      where,
      e.message.slice(`quadspread ${e.code}: ${e.where}: `.length),
    );
  }
}

/**
 * Refuses a hemisphere letter of the other axis in angle text: E or W on a latitude, N or S on
 * a longitude (the two swapped would otherwise be read without complaint).
 */
function checkHemisphere(x: unknown, allowed: string, where: string, what: string): void {
  if (typeof x !== 'string') return;
  for (const m of [/^\s*([NSEW])/i.exec(x), /([NSEW])\s*$/i.exec(x)]) {
    const letter = m?.[1]!.toUpperCase();
    if (letter !== undefined && !allowed.includes(letter)) {
      throw invalidAngle(
        where,
        `${show(x)} carries ${letter}, but a ${what} takes ${allowed[0]} or ${allowed[1]}: are latitude and longitude swapped?`,
      );
    }
  }
}

/** @internal A latitude in degrees from decimal degrees or DMS text, checked to be within ±90°. */
export function readLatitude<T>(A: Arithmetic<T>, lat: Numeric<T>, where: string): T {
  if (lat === undefined || lat === null) throw invalidAngle(where, 'the latitude is missing');
  checkHemisphere(lat, 'NS', where, 'latitude');
  const v = readAngle(A, lat, where);
  if (A.cmp(A.abs(v), A.from(90)) > 0) {
    throw new QuadspreadError(
      'LATITUDE_OUT_OF_RANGE',
      where,
      `${shownInput(A, lat, v)} is beyond ±90°`,
    );
  }
  return v;
}

/**
 * @internal A longitude in degrees from decimal degrees or DMS text, within ±360° (both the
 * ±180° and the 0°–360° conventions); beyond, it is refused rather than wrapped without a word
 * (unless `limited` is false: the projections reduce longitudes as they document).
 */
export function readLongitude<T>(
  A: Arithmetic<T>,
  lon: Numeric<T>,
  where: string,
  limited = true,
): T {
  if (lon === undefined || lon === null) throw invalidAngle(where, 'the longitude is missing');
  checkHemisphere(lon, 'EW', where, 'longitude');
  const v = readAngle(A, lon, where);
  if (limited && A.cmp(A.abs(v), A.from(360)) > 0)
    throw invalidAngle(where, `${shownInput(A, lon, v)} is beyond ±360° for a longitude`);
  return v;
}

/** @internal An ellipsoidal height in metres (default 0), refused below −limit (−a unless said otherwise). */
export function readHeight<T>(
  A: Arithmetic<T>,
  h: Numeric<T> | undefined,
  limit: T,
  where: string,
  name = 'a',
): T {
  const v = h === undefined ? A.zero : readNumber(A, h, where);
  if (A.cmp(v, A.neg(limit)) < 0) {
    throw new QuadspreadError(
      'HEIGHT_OUT_OF_RANGE',
      where,
      `${shownInput(A, h, v)} is below −${name} = −${A.toString(limit)} m`,
    );
  }
  return v;
}

/** @internal radians → degrees: θ·180/π. */
export function toDegrees<T>(A: Arithmetic<T>, rad: T): T {
  return A.div(A.mul(rad, A.from(180)), A.pi); // π rad = 180° (definition of the radian)
}

/**
 * @internal The decimal arithmetic with `digits` significant digits in which an exact
 * arithmetic (or an uncertain one over an exact base) runs iterations and series whose results
 * are approximations anyway, so that fractions do not grow: the arithmetic's own
 * `approximate` (rational: decimal(digits)), so that float-only code does not bundle decimal.
 * @throws {QuadspreadError} `UNSUPPORTED_OPERATION` for an exact arithmetic without one.
 */
function approximationOf(A: Arithmetic<unknown>, digits: number): Arithmetic<unknown> {
  const D = A.approximate?.(digits);
  if (D === undefined)
    throw unsupportedOperation(
      `${A.name}.approximate(digits)`,
      'this exact arithmetic gives no decimal arithmetic to approximate in',
    );
  return D;
}

const uncertainDecimalMemo = new Map<number, Arithmetic<Uncertain<unknown>>>();

/** An uncertain value moved to another base: the value and each derivative converted, the inputs kept. */
function moveUncertain<S, R>(
  from: Arithmetic<S>,
  to: Arithmetic<R>,
  x: Uncertain<S>,
  digits: number | undefined,
): Uncertain<R> {
  const text = (v: S): string =>
    digits === undefined ? from.toString(v) : from.toPrecision(v, digits);
  const ders = x.derivatives.map((c) => to.from(text(c)));
  return new Uncertain(
    to.from(text(x.value)),
    x.inputs as unknown as readonly Uncertain<R>['inputs'][number][],
    ders,
  );
}

/**
 * @internal Where an exact arithmetic evaluates a transcendental approximation: in
 * decimal(digits), or for an uncertain arithmetic over an exact base in
 * uncertain(decimal(digits)), so that the gradients go there and back with the values
 * (they were dropped when values crossed as text). `to` carries a value of `A` over
 * (rounded to digits + 4), `back` reads a result back exactly.
 */
export function delegateFor<T>(
  A: Arithmetic<T>,
  digits: number,
): { D: Arithmetic<unknown>; to: (x: T) => unknown; back: (y: unknown) => T } {
  const base = (A as { base?: Arithmetic<unknown> }).base;
  const Dd = approximationOf(base ?? (A as Arithmetic<unknown>), digits);
  if (base === undefined) {
    return {
      D: Dd,
      to: (x) => Dd.from(A.toPrecision(x, digits + 4)),
      back: (y) => A.from(Dd.toString(y)),
    };
  }
  let UD = uncertainDecimalMemo.get(digits);
  if (UD === undefined) {
    UD = uncertain(Dd) as unknown as Arithmetic<Uncertain<unknown>>;
    uncertainDecimalMemo.set(digits, UD);
  }
  return {
    D: UD,
    to: (x) => moveUncertain(base, Dd, A.from(x) as unknown as Uncertain<unknown>, digits + 4),
    back: (y) => moveUncertain(Dd, base, y as Uncertain<unknown>, undefined) as unknown as T,
  };
}

/**
 * @internal x rounded to `digits` significant digits in an exact arithmetic (for values that
 * are approximations anyway); over an uncertain arithmetic the value is rounded and the
 * gradient kept.
 */
export function roundExact<T>(A: Arithmetic<T>, x: T, digits: number): T {
  const base = (A as { base?: Arithmetic<unknown> }).base;
  if (base !== undefined && x instanceof Uncertain) {
    return new Uncertain(
      base.from(base.toPrecision(x.value, digits)),
      x.inputs,
      x.derivatives,
    ) as unknown as T;
  }
  return A.from(A.toPrecision(x, digits));
}
