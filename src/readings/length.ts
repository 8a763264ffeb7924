/**
 * Distance units with exact rational factors to the metre.
 *
 * @module readings
 */
import {
  QuadspreadError,
  show,
  negativeQuadrance,
  checkArithmetic,
  MAX_INPUT_LENGTH,
  textTooLong,
} from '../errors.js';
import { finiteResult, readNumber, shownInput } from '../geometry/validate.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';

/**
 * Length units: `'m'` metre, `'km'`, `'ft'` international foot (0.3048 m exactly),
 * `'us-ft'` U.S. survey foot (1200/3937 m), `'ch'` Gunter's chain of 66 international
 * feet (= 100 links), `'lk'` link, `'us-ch'` and `'us-lk'` the same in survey feet,
 * `'mi'` international mile (1609.344 m).
 */
export type LengthUnit = 'm' | 'km' | 'ft' | 'us-ft' | 'ch' | 'lk' | 'us-ch' | 'us-lk' | 'mi';

/**
 * Metres in one of each {@link LengthUnit}, as exact rational text.
 * Sources: international foot 0.3048 m and U.S. survey foot 1200/3937 m — NIST/NGS,
 * "Deprecation of the U.S. Survey Foot", Federal Register 85(193) 62698–62708, 2020;
 * Gunter's chain = 66 ft = 100 links, mile = 5280 ft = 1609.344 m (same units, derived).
 * @example
 * ```ts
 * import { METRES_PER_UNIT } from 'quadspread';
 * [METRES_PER_UNIT.ft, METRES_PER_UNIT['us-ft']];
 * //=> ['0.3048', '1200/3937']
 * ```
 */
export const METRES_PER_UNIT: Readonly<Record<LengthUnit, string>> = {
  m: '1',
  km: '1000',
  ft: '0.3048', // Federal Register 85(193), 2020: international foot
  'us-ft': '1200/3937', // Federal Register 85(193), 2020: U.S. survey foot
  ch: '20.1168', // 66 international feet
  lk: '0.201168', // 1/100 chain
  'us-ch': '79200/3937', // 66 U.S. survey feet
  'us-lk': '792/3937', // 1/100 U.S. survey chain
  mi: '1609.344', // 5280 international feet
};

/** @internal checks a length unit. */
export function checkLengthUnit(unit: unknown, where: string): LengthUnit {
  if (typeof unit === 'string' && Object.prototype.hasOwnProperty.call(METRES_PER_UNIT, unit))
    return unit as LengthUnit;
  throw new QuadspreadError(
    'INVALID_UNIT',
    where,
    `${show(unit)} is not a length unit (use ${Object.keys(METRES_PER_UNIT)
      .map((u) => `'${u}'`)
      .join(', ')})`,
  );
}

/** Units a length written as text may name: the {@link LengthUnit} codes, and `mm`, `cm`. */
const TEXT_UNITS: Readonly<Record<string, string>> = {
  ...METRES_PER_UNIT,
  mm: '0.001',
  cm: '0.01',
};

// A number (decimal, exponent or fraction), then an optional unit word.
const LENGTH_TEXT =
  /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?(?:\s*\/\s*\d+)?)\s*([A-Za-z][A-Za-z-]*)?\s*$/;

/**
 * Splits a length written as text into its number and the metres in one of its unit, or
 * returns undefined for a value with no unit of its own (a number, a value, bare numeric text).
 * @internal
 */
export function lengthTextParts(
  value: unknown,
  where: string,
): { number: string; metres: string; unit: string } | undefined {
  if (typeof value !== 'string') return undefined;
  if (value.length > MAX_INPUT_LENGTH) throw textTooLong(where, value.length);
  const m = LENGTH_TEXT.exec(value);
  if (!m || m[2] === undefined) return undefined;
  const unit = m[2];
  if (!Object.prototype.hasOwnProperty.call(TEXT_UNITS, unit))
    throw new QuadspreadError(
      'INVALID_UNIT',
      where,
      `${show(value)} names the unit "${unit}", which is not a length unit (use ${Object.keys(TEXT_UNITS).join(', ')})`,
    );
  return { number: m[1]!.replace(/\s+/g, ''), metres: TEXT_UNITS[unit]!, unit };
}

/**
 * Reads a length into `unit`, exactly in `rational`: a number (or numeric text, or a value)
 * is in `unit`; text with a unit of its own — `"250.00 ft"`, `"3 mm"`, `"12.5 us-ft"`,
 * `"4 ch"` — is converted from it (`ft` is the international foot, `us-ft` the U.S. survey
 * foot; `mm` and `cm` are accepted in text). The one reading of lengths the library and the
 * command-line job share.
 *
 * @param A the arithmetic
 * @param value the length: a number in `unit`, or text with its own unit
 * @param unit the unit wanted, and the unit of a bare number (default `'m'`)
 * @returns the length in `unit`
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `INVALID_NUMBER` for a bad
 *   value; `NOT_FINITE` in float when the result overflows.
 * @example
 * ```ts
 * import { rational, lengthIn } from 'quadspread';
 * [rational.toString(lengthIn(rational, '250.00 ft')), rational.toString(lengthIn(rational, '3 mm', 'ft'))];
 * //=> ['381/5', '5/508']
 * ```
 */
export function lengthIn<T>(A: Arithmetic<T>, value: Numeric<T>, unit: LengthUnit = 'm'): T {
  checkArithmetic(A, 'lengthIn');
  const u = checkLengthUnit(unit, 'lengthIn(unit)');
  const parts = lengthTextParts(value, 'lengthIn(value)');
  if (parts === undefined) return readNumber(A, value, 'lengthIn(value)');
  return finiteResult(
    A.div(
      A.mul(readNumber(A, parts.number, 'lengthIn(value)'), A.from(parts.metres)),
      A.from(METRES_PER_UNIT[u]),
    ),
    'lengthIn(value)',
  );
}

/**
 * Converts a length to metres, exactly in `rational`. Text with a unit of its own
 * (`"250.00 ft"`, `"3 mm"`) is read in that unit, as {@link lengthIn} reads it.
 *
 * @param A the arithmetic
 * @param value the length in `unit`, or text with its own unit
 * @param unit the unit of a bare number (see {@link LengthUnit}; default `'m'`)
 * @returns the length in metres
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `INVALID_NUMBER` for a bad value; `NOT_FINITE` in float when the result overflows.
 * @example
 * ```ts
 * import { rational, lengthToMetres } from 'quadspread';
 * rational.toString(lengthToMetres(rational, 1, 'ch'));
 * //=> '12573/625'
 * [rational.toString(lengthToMetres(rational, '250.00 ft')), rational.toString(lengthToMetres(rational, '250 us-ft'))];
 * //=> ['381/5', '300000/3937']
 * ```
 */
export function lengthToMetres<T>(A: Arithmetic<T>, value: Numeric<T>, unit: LengthUnit = 'm'): T {
  checkArithmetic(A, 'lengthToMetres');
  const u = checkLengthUnit(unit, 'lengthToMetres(unit)');
  const parts = lengthTextParts(value, 'lengthToMetres(value)');
  if (parts !== undefined)
    return finiteResult(
      A.mul(readNumber(A, parts.number, 'lengthToMetres(value)'), A.from(parts.metres)),
      'lengthToMetres(value)',
    );
  return finiteResult(
    A.mul(readNumber(A, value, 'lengthToMetres(value)'), A.from(METRES_PER_UNIT[u])),
    'lengthToMetres(value)',
  );
}

/**
 * Converts metres to another length unit, exactly in `rational`.
 *
 * @param A the arithmetic
 * @param metres the length in metres
 * @param unit the unit wanted
 * @returns the length in `unit`
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `INVALID_NUMBER` for a bad value.
 * @example
 * ```ts
 * import { rational, metresToLength } from 'quadspread';
 * rational.toString(metresToLength(rational, '0.3048', 'us-ft'));
 * //=> '499999/500000'
 * ```
 */
export function metresToLength<T>(A: Arithmetic<T>, metres: Numeric<T>, unit: LengthUnit): T {
  checkArithmetic(A, 'metresToLength');
  const u = checkLengthUnit(unit, 'metresToLength(unit)');
  return A.div(readNumber(A, metres, 'metresToLength(metres)'), A.from(METRES_PER_UNIT[u]));
}

/**
 * Converts a length from one unit to another, exactly in `rational`.
 *
 * @param A the arithmetic
 * @param value the length in `from`
 * @param from its unit
 * @param to the unit wanted
 * @returns the length in `to`
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit.
 * @example
 * ```ts
 * import { rational, convertLength } from 'quadspread';
 * rational.toString(convertLength(rational, 1, 'us-ft', 'ft'));
 * //=> '500000/499999'
 * ```
 */
export function convertLength<T>(
  A: Arithmetic<T>,
  value: Numeric<T>,
  from: LengthUnit,
  to: LengthUnit,
): T {
  checkArithmetic(A, 'convertLength');
  const f = checkLengthUnit(from, 'convertLength(from)');
  const t = checkLengthUnit(to, 'convertLength(to)');
  return A.div(
    A.mul(readNumber(A, value, 'convertLength(value)'), A.from(METRES_PER_UNIT[f])),
    A.from(METRES_PER_UNIT[t]),
  );
}

/**
 * Converts a quadrance (a squared length) from one unit to another: the factor squared.
 *
 * @param A the arithmetic
 * @param quadrance the quadrance in `from`²
 * @param from the unit of the length squared
 * @param to the unit wanted
 * @returns the quadrance in `to`²
 * @throws {QuadspreadError} `INVALID_UNIT` for an unknown unit; `NEGATIVE_QUADRANCE` below zero; `NOT_FINITE` in float when the result overflows.
 * @example
 * ```ts
 * import { rational, convertQuadrance } from 'quadspread';
 * rational.toString(convertQuadrance(rational, 100, 'ft', 'm'));
 * //=> '145161/15625'
 * ```
 */
export function convertQuadrance<T>(
  A: Arithmetic<T>,
  quadrance: Numeric<T>,
  from: LengthUnit,
  to: LengthUnit,
): T {
  checkArithmetic(A, 'convertQuadrance');
  const q = readNumber(A, quadrance, 'convertQuadrance(quadrance)');
  if (A.sign(q) < 0)
    throw negativeQuadrance(
      'convertQuadrance(quadrance)',
      `${shownInput(A, quadrance, q)} is below zero`,
    );
  const r = convertLength(A, A.one, from, to);
  return finiteResult(A.mul(q, A.mul(r, r)), 'convertQuadrance(quadrance)');
}
