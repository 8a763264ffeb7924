/**
 * Angle readings: decimal degrees, DMS text as field books write it, gons, mils and
 * radians, read into exact degrees.
 *
 * @module readings
 */
import {
  MAX_INPUT_LENGTH,
  QuadspreadError,
  show,
  invalidAngle,
  textTooLong,
  checkArithmetic,
} from '../errors.js';
import { readNumber } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { guardOf, viaGuard } from './numeric.js';

/**
 * Units of an angle reading: `'deg'` degrees (360 to the turn), `'gon'` (400 to the turn,
 * 1 gon = 0.9° exactly, ISO 80000-3 item 3-5.e), `'mil'` (6400 to the turn, the NATO mil,
 * common practice) and `'rad'` radians (2π to the turn).
 */
export type AngleUnit = 'deg' | 'gon' | 'mil' | 'rad';

/**
 * The angle units {@link angleToDegrees} knows.
 * @example
 * ```ts
 * import { ANGLE_UNITS } from 'quadspread';
 * ANGLE_UNITS;
 * //=> ['deg', 'gon', 'mil', 'rad']
 * ```
 */
export const ANGLE_UNITS: readonly AngleUnit[] = ['deg', 'gon', 'mil', 'rad'];

/** @internal checks an angle unit, naming the function in the error. */
export function checkAngleUnit(unit: unknown, where: string): AngleUnit {
  if (typeof unit === 'string' && (ANGLE_UNITS as readonly string[]).includes(unit))
    return unit as AngleUnit;
  throw new QuadspreadError(
    'INVALID_UNIT',
    where,
    `${show(unit)} is not an angle unit (use ${ANGLE_UNITS.map((u) => `'${u}'`).join(', ')})`,
  );
}

const PLAIN_NUMBER = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?(\s*\/\s*\d+)?\s*$/;
// One DMS component: a number, then an optional mark (degrees, minutes, seconds or colon).
const COMPONENT = /(\d+(?:\.\d*)?|\.\d+)\s*(°|'|"|:)?\s*/y;

interface DmsParts {
  sign: 1 | -1;
  parts: { text: string; position: number }[];
  quadrant?: { from: 'N' | 'S'; to: 'E' | 'W' };
}

function normaliseMarks(text: string): string {
  return text
    .replace(/[º˚]/g, '°')
    .replace(/[′’]/g, "'")
    .replace(/[″”]|''/g, '"');
}

function parseDms(original: string, where: string): DmsParts {
  const bad = (why: string): never => {
    throw invalidAngle(where, `${show(original)} ${why}`);
  };
  let text = normaliseMarks(original).trim();
  let sign: 1 | -1 = 1;
  let quadrant: DmsParts['quadrant'];
  let letter: string | undefined;
  const lead = /^([NSEWnsew])\s*/.exec(text);
  if (lead) {
    letter = lead[1]!.toUpperCase();
    text = text.slice(lead[0].length);
  }
  const trail = /\s*([NSEWnsew])$/.exec(text);
  if (trail) {
    const t = trail[1]!.toUpperCase();
    text = text.slice(0, text.length - trail[0].length);
    if (letter !== undefined) {
      if ((letter === 'N' || letter === 'S') && (t === 'E' || t === 'W'))
        quadrant = { from: letter, to: t };
      else bad("is not a quadrant bearing (write N or S first, then E or W, as in N 45°30' E)");
    } else letter = t;
  }
  const signMatch = /^([+-])\s*/.exec(text);
  if (signMatch) {
    if (letter !== undefined) bad('has both a sign and a hemisphere letter');
    if (signMatch[1] === '-') sign = -1;
    text = text.slice(signMatch[0].length);
  }
  if (letter !== undefined && quadrant === undefined && (letter === 'S' || letter === 'W'))
    sign = -1;
  const parts: DmsParts['parts'] = [];
  const marks: Record<string, number> = { '°': 0, "'": 1, '"': 2 };
  let at = 0;
  let next = 0;
  while (at < text.length) {
    COMPONENT.lastIndex = at;
    const m = COMPONENT.exec(text);
    if (!m || m[0].length === 0)
      bad('is not an angle (write 12°34\'56.7", 12 34 56.7 or decimal degrees)');
    const mark = m![2];
    const position = mark !== undefined && mark !== ':' ? marks[mark]! : next;
    if (position < next || position > 2) bad('has its degrees, minutes and seconds out of order');
    parts.push({ text: m![1]!, position });
    next = position + 1;
    at = COMPONENT.lastIndex;
  }
  if (parts.length === 0) bad('is not an angle');
  for (let i = 0; i < parts.length - 1; i++) {
    if (parts[i]!.text.includes('.')) bad('has a decimal fraction before its last component');
  }
  return { sign, parts, ...(quadrant ? { quadrant } : {}) };
}

/**
 * Reads an angle into exact degrees.
 *
 * Accepts a number or numeric text in `unit`; or, in degrees only, DMS text in the forms
 * field books use: `12°34'56.7"`, `12 34 56.7`, `12:34:56.7`, `12°34'`, `-12°34'`, with
 * a sign or a hemisphere letter before or after (`N`, `E` positive; `S`, `W` negative:
 * `33°52'S` is −33.8666…°). A quadrant bearing (`N 45°30' E`, `S 10 W`) is read as an
 * azimuth clockwise from north in [0°, 360°): N θ E = θ, S θ E = 180° − θ,
 * S θ W = 180° + θ, N θ W = 360° − θ. Only the last component may have decimals; minutes
 * and seconds must be below 60 (the degrees of a DMS text with minutes or seconds are an
 * integer). `′`, `″`, `''` and `º` are read as `'`, `"`, `"` and `°`.
 *
 * Exact in `rational` for degrees, DMS, gons (×9/10) and mils (×9/160); radians go
 * through `A.pi` (×180/π), so in `rational` they are within the arithmetic's stated
 * transcendental tolerance. In `decimal(n)` the result is computed with 10 guard digits and
 * rounded once (correctly rounded unless it lies within about 10⁻ⁿ⁻¹⁰ relative of a
 * rounding boundary).
 *
 * @param A the arithmetic
 * @param reading the angle: a value, a number or text
 * @param unit the unit of a numeric reading: `'deg'` (default), `'gon'`, `'mil'`, `'rad'`;
 *   or `{ unit?, format? }` with `format: 'dd.mmss'` for degrees packed as DD.MMSS
 *   (36.5027 = 36°50′27″), read so only when asked
 * @returns the angle in degrees
 * @throws {QuadspreadError} `INVALID_ANGLE` for text that is not an angle, minutes or seconds
 *   ≥ 60, or DMS text with a unit other than degrees; `INVALID_UNIT` for an unknown unit;
 *   `INPUT_TOO_LONG` for text over {@link MAX_INPUT_LENGTH} characters; `INVALID_NUMBER`
 *   for NaN, ±Infinity or a value that is not a number.
 * @example
 * ```ts
 * import { rational, angleToDegrees } from 'quadspread';
 * rational.toString(angleToDegrees(rational, `12°30'36"`));
 * //=> '1251/100'
 * rational.toString(angleToDegrees(rational, '100', 'gon'));
 * //=> '90'
 * rational.toString(angleToDegrees(rational, "S 30°15' W"));
 * //=> '841/4'
 * rational.toString(angleToDegrees(rational, 36.5027, { format: 'dd.mmss' }));
 * //=> '44209/1200'
 * ```
 */
export function angleToDegrees<T>(
  A: Arithmetic<T>,
  reading: Numeric<T>,
  unit: AngleUnit | AngleOptions = 'deg',
): T {
  checkArithmetic(A, 'angleToDegrees');
  if (unit !== null && typeof unit === 'object') {
    const { format = 'decimal', unit: u = 'deg' } = unit;
    if (format === 'dd.mmss') {
      if (u !== 'deg')
        throw invalidAngle(
          'angleToDegrees(options)',
          `DD.MMSS is in degrees, but the unit is ${show(u)}`,
        );
      return angleToDegrees(A, packedDmsText(reading), 'deg');
    }
    if (format !== 'decimal')
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        'angleToDegrees(options.format)',
        `${show(format)} is not 'decimal' or 'dd.mmss'`,
      );
    unit = u;
  }
  const G = guardOf(A);
  if (G) return viaGuard(A, G, reading, (g, x) => readAngle(g, x as Numeric<typeof g.zero>, unit));
  return readAngle(A, reading, unit);
}

/** Options of {@link angleToDegrees}. */
export interface AngleOptions {
  /** The unit of a numeric reading (default `'deg'`). */
  readonly unit?: AngleUnit;
  /**
   * How a number in degrees is written: `'decimal'` (default) or `'dd.mmss'`, degrees,
   * minutes and seconds packed as field calculators take them (36.5027 = 36°50′27″). Only
   * when asked: a number is never guessed to be DD.MMSS.
   */
  readonly format?: 'decimal' | 'dd.mmss';
}

/**
 * DD.MMSS (a number or numeric text: degrees, then two digits of minutes, two of seconds and
 * any decimals of a second) as DMS text; text with marks is returned as it is.
 */
function packedDmsText(reading: unknown): string {
  const where = 'angleToDegrees(reading)';
  let text: string;
  if (typeof reading === 'number') {
    if (!Number.isFinite(reading)) throw invalidAngle(where, `${show(reading)} is not DD.MMSS`);
    text = String(reading);
  } else if (typeof reading === 'string') {
    if (reading.length > MAX_INPUT_LENGTH) throw textTooLong(where, reading.length);
    if (!PLAIN_NUMBER.test(reading)) return reading; // DMS with marks says what it is
    text = reading.trim();
  } else throw invalidAngle(where, `${show(reading)}: give DD.MMSS as a number or as text`);
  const m = /^([+-]?)(\d*)(?:\.(\d*))?$/.exec(text);
  if (!m) throw invalidAngle(where, `${show(reading)} is not DD.MMSS (write it as 36.5027)`);
  const frac = (m[3] ?? '').padEnd(4, '0');
  const min = frac.slice(0, 2);
  const sec = frac.slice(2, 4) + (frac.length > 4 ? `.${frac.slice(4)}` : '');
  if (Number(min) >= 60 || Number(frac.slice(2, 4)) >= 60)
    throw invalidAngle(
      where,
      `${show(reading)} read as DD.MMSS has ${Number(min) >= 60 ? `minutes ${min}` : `seconds ${frac.slice(2, 4)}`} ≥ 60`,
    );
  return `${m[1]}${m[2] || '0'}°${min}'${sec}"`;
}

/** @internal {@link angleToDegrees} computed directly in A. */
export function readAngle<T>(A: Arithmetic<T>, reading: Numeric<T>, unit: AngleUnit = 'deg'): T {
  const where = 'angleToDegrees(reading)';
  const u = checkAngleUnit(unit, 'angleToDegrees(unit)');
  if (typeof reading === 'string' && !PLAIN_NUMBER.test(reading)) {
    if (reading.length > MAX_INPUT_LENGTH) {
      throw textTooLong(where, reading.length);
    }
    if (u !== 'deg')
      throw invalidAngle(
        where,
        `${show(reading)} is DMS text, which is in degrees, but the unit is '${u}'`,
      );
    const dms = parseDms(reading, where);
    const sixty = A.from(60);
    let value = A.zero;
    for (const p of dms.parts) {
      const v = A.from(p.text);
      if (p.position > 0 && A.cmp(v, sixty) >= 0) {
        throw invalidAngle(
          where,
          `${show(reading)} has ${p.position === 1 ? 'minutes' : 'seconds'} ${p.text} ≥ 60`,
        );
      }
      const scale = p.position === 0 ? A.one : p.position === 1 ? sixty : A.from(3600);
      value = A.add(value, A.div(v, scale));
    }
    if (dms.quadrant) {
      const { from, to } = dms.quadrant;
      if (A.cmp(value, A.from(90)) > 0)
        throw invalidAngle(where, `${show(reading)} is a quadrant bearing over 90°`);
      const half = A.from(180);
      if (from === 'N')
        value = to === 'E' ? value : A.isZero(value) ? value : A.sub(A.from(360), value);
      else value = to === 'E' ? A.sub(half, value) : A.add(half, value);
      return value;
    }
    return dms.sign < 0 ? A.neg(value) : value;
  }
  const v = readNumber(A, reading, where);
  switch (u) {
    case 'deg':
      return v;
    case 'gon':
      return A.div(A.mul(v, A.from(9)), A.from(10)); // 400 gon = 360°: ISO 80000-3:2006, item 3-5.e
    case 'mil':
      return A.div(A.mul(v, A.from(9)), A.from(160)); // 6400 mil = 360° (NATO mil, common practice)
    case 'rad':
      return A.div(A.mul(v, A.from(180)), A.pi); // π rad = 180° (definition of the radian, ISO 80000-3)
  }
}

/**
 * Converts degrees to another angle unit: the inverse of {@link angleToDegrees} for
 * numeric readings. Exact for `'deg'`, `'gon'` and `'mil'`; `'rad'` goes through `A.pi`.
 *
 * @param A the arithmetic
 * @param degrees the angle in degrees
 * @param unit the unit wanted
 * @returns the angle in `unit`
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, degreesToUnit } from 'quadspread';
 * rational.toString(degreesToUnit(rational, 45, 'mil'));
 * //=> '800'
 * ```
 */
export function degreesToUnit<T>(A: Arithmetic<T>, degrees: Numeric<T>, unit: AngleUnit): T {
  checkArithmetic(A, 'degreesToUnit');
  const u = checkAngleUnit(unit, 'degreesToUnit(unit)');
  const G = guardOf(A);
  if (G) return viaGuard(A, G, degrees, (g, x) => degreesToUnit(g, x as Numeric<typeof g.zero>, u));
  const v = readNumber(A, degrees, 'degreesToUnit(degrees)');
  switch (u) {
    case 'deg':
      return v;
    case 'gon':
      return A.div(A.mul(v, A.from(10)), A.from(9)); // ISO 80000-3:2006, item 3-5.e
    case 'mil':
      return A.div(A.mul(v, A.from(160)), A.from(9)); // NATO mil, common practice
    case 'rad':
      return A.div(A.mul(v, A.pi), A.from(180)); // ISO 80000-3
  }
}
