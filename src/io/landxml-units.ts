/**
 * The `Units` of a LandXML 1.2 document: its linear, elevation and angular units, and the
 * reading of angles in each of the schema's angle formats.
 *
 * @module io
 */
import { QuadspreadError, angleToDegrees, type Arithmetic } from '../index.js';
import { show } from '../errors.js';
import { badElement, type XmlElement } from './landxml-dom.js';

/** A linear unit of LandXML 1.2 (`Metric` or `Imperial` `linearUnit`). */
export type LandXmlLinearUnit =
  'millimeter' | 'centimeter' | 'meter' | 'kilometer' | 'foot' | 'USSurveyFoot' | 'inch' | 'mile';

/** An angle format of LandXML 1.2 (`angularUnit`, `directionUnit`). */
export type LandXmlAngularUnit = 'radians' | 'grads' | 'decimal degrees' | 'decimal dd.mm.ss';

/**
 * Metres per linear unit, exact. The foot, inch and mile are the international ones
 * (1 ft = 0.3048 m exactly, by the 1959 agreement; NIST Handbook 44, Appendix C); the US
 * survey foot is 1200/3937 m exactly (Federal Register 1959, 24 FR 5348; NIST SP 811, B.6).
 *
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { METRES_PER_LANDXML_UNIT } from 'quadspread/io';
 * rational.toString(rational.mul(rational.from(METRES_PER_LANDXML_UNIT.USSurveyFoot), rational.from(3937)));
 * //=> '1200'
 * ```
 */
export const METRES_PER_LANDXML_UNIT: Readonly<Record<LandXmlLinearUnit, string>> = {
  millimeter: '1/1000',
  centimeter: '1/100',
  meter: '1',
  kilometer: '1000',
  foot: '0.3048',
  USSurveyFoot: '1200/3937',
  inch: '0.0254',
  mile: '1609.344',
};

const METRIC_LINEAR = ['millimeter', 'centimeter', 'meter', 'kilometer'] as const;
const IMPERIAL_LINEAR = ['foot', 'USSurveyFoot', 'inch', 'mile'] as const;
const ANGULAR = ['radians', 'grads', 'decimal degrees', 'decimal dd.mm.ss'] as const;

/** The units a LandXML document states (from its `Units` element). */
export interface LandXmlUnits {
  /** `'Metric'` or `'Imperial'`: the element that stated the units. */
  readonly system: 'Metric' | 'Imperial';
  /** The unit of coordinates, distances and heights of instruments and targets. */
  readonly linear: LandXmlLinearUnit;
  /** The unit of elevations (the third value of a `CgPoint`); the linear unit when not stated. */
  readonly elevation: LandXmlLinearUnit;
  /**
   * The format of angles (`horizAngle`, `zenithAngle`); radians when not stated, the schema's
   * default as recalled from its element reference (from memory: check a file that leaves it out).
   */
  readonly angular: LandXmlAngularUnit;
  /** The format of directions (`azimuth`); radians when not stated, as for `angular`. */
  readonly direction: LandXmlAngularUnit;
}

function pick<U extends string>(
  e: XmlElement,
  attr: string,
  allowed: readonly U[],
  where: string,
  fallback?: U,
): U {
  const v = e.attrs[attr];
  if (v === undefined) {
    if (fallback !== undefined) return fallback;
    throw badElement(where, e, `the required attribute ${attr} is missing`);
  }
  if (!(allowed as readonly string[]).includes(v))
    throw badElement(
      where,
      e,
      `${attr}="${v}" is not a unit of this element (${allowed.map((a) => `"${a}"`).join(', ')})`,
    );
  return v as U;
}

/**
 * Reads the `Units` element: one `Metric` or `Imperial` child with its `linearUnit`
 * (required), `elevationUnit`, `angularUnit` and `directionUnit` (defaults as the schema gives
 * them: the linear unit, radians, radians). Unknown units are refused naming the element.
 * @internal
 */
export function readUnits(units: XmlElement, where: string): LandXmlUnits {
  const kids = units.children;
  if (kids.length !== 1 || (kids[0]!.name !== 'Metric' && kids[0]!.name !== 'Imperial'))
    throw badElement(
      where,
      units,
      `Units holds one Metric or Imperial element (found ${kids.length === 0 ? 'none' : kids.map((k) => k.name).join(', ')})`,
    );
  const u = kids[0]!;
  const system = u.name as 'Metric' | 'Imperial';
  const linearSet = system === 'Metric' ? METRIC_LINEAR : IMPERIAL_LINEAR;
  const linear = pick<LandXmlLinearUnit>(u, 'linearUnit', linearSet, where);
  const elevation = pick<LandXmlLinearUnit>(u, 'elevationUnit', linearSet, where, linear);
  const angular = pick<LandXmlAngularUnit>(u, 'angularUnit', ANGULAR, where, 'radians');
  const direction = pick<LandXmlAngularUnit>(u, 'directionUnit', ANGULAR, where, 'radians');
  return { system, linear, elevation, angular, direction };
}

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A decimal number of an XML attribute or text (no `INF`, `NaN`, fractions or hex). @internal */
export function readDecimal<T>(
  A: Arithmetic<T, boolean>,
  text: string,
  where: string,
  e: XmlElement,
  what: string,
): T {
  const t = text.trim();
  if (!DECIMAL.test(t) || t.length > 200)
    throw badElement(where, e, `${what} ${JSON.stringify(t.slice(0, 40))} is not a decimal number`);
  return A.from(t);
}

/**
 * An angle in a LandXML angle format, in degrees: radians and grads converted, decimal
 * degrees as they are, and `decimal dd.mm.ss` read as degrees, then two digits of minutes and
 * the seconds (`45.301525` is 45° 30′ 15.25″; minutes and seconds below 60).
 * @internal
 */
export function readAngle<T>(
  A: Arithmetic<T, boolean>,
  text: string,
  format: LandXmlAngularUnit,
  where: string,
  e: XmlElement,
  what: string,
): T {
  const v = readDecimal(A, text, where, e, what);
  if (format === 'decimal degrees') return v;
  if (format === 'radians') return angleToDegrees(A, v, 'rad');
  if (format === 'grads') return angleToDegrees(A, v, 'gon');
  const m = /^([+-]?)(\d+)(?:\.(\d{0,2})(\d*))?$/.exec(text.trim());
  if (!m)
    throw badElement(
      where,
      e,
      `${what} ${JSON.stringify(text.trim().slice(0, 40))} is not an angle in decimal dd.mm.ss`,
    );
  const [, sign, d, mm = '', ss = ''] = m;
  const minutes = (mm + '00').slice(0, 2);
  const seconds = ss === '' ? '0' : `${ss.slice(0, 2).padEnd(2, '0')}.${ss.slice(2) || '0'}`;
  if (Number(minutes) >= 60 || Number(seconds) >= 60)
    throw badElement(
      where,
      e,
      `${what} ${text.trim()} in decimal dd.mm.ss has ${Number(minutes) >= 60 ? 'minutes' : 'seconds'} of 60 or more`,
    );
  const deg = A.add(
    A.from(d!),
    A.add(A.div(A.from(minutes), A.from(60)), A.div(A.from(seconds), A.from(3600))),
  );
  return sign === '-' ? A.neg(deg) : deg;
}

/** Checks a linear unit given to a writer. @internal */
export function checkLinearUnit(u: unknown, where: string): LandXmlLinearUnit {
  if (typeof u === 'string' && Object.hasOwn(METRES_PER_LANDXML_UNIT, u))
    return u as LandXmlLinearUnit;
  throw new QuadspreadError(
    'INVALID_UNIT',
    where,
    `${show(u)} is not a LandXML linear unit (${Object.keys(METRES_PER_LANDXML_UNIT)
      .map((k) => `'${k}'`)
      .join(', ')})`,
  );
}
