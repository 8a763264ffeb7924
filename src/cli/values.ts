/**
 * Reading the values of a job file: lengths with units, angles, vertical readings, and
 * the `{ "value": …, "sigma": … }` form that gives any of them a standard uncertainty.
 *
 * Values are read exactly (in `rational`, through the library's readings) into canonical
 * text — degrees for angles, the job's length unit for lengths — so that each run of a
 * task can bring them into its own arithmetic with `A.from`. Every error names the place
 * in the job and the value.
 *
 * @module cli
 */
import {
  QuadspreadError,
  angleSigma,
  angleToDegrees,
  lengthIn,
  lengthSigma,
  rational,
  verticalFromAngle,
  verticalFromSlope,
  vertical,
} from '../index.js';
import type { AngleUnit, Arithmetic, LengthUnit, Rational, VerticalReading } from '../index.js';
import { MAX_INPUT_LENGTH, inputTooLong, show } from '../errors.js';
import { JobInvalid } from './failure.js';

const R = rational;

/** A scalar input of a task: canonical text of its value (and sigma), and a name for budgets. */
export interface Input {
  /** The name shown in uncertainty budgets (e.g. `S2 elevation`). */
  name: string;
  /** The value as exact text (`1251/100`), in degrees or the job's length unit. */
  value: string;
  /** Its standard uncertainty as exact text, same unit as `value`; absent when none was given. */
  sigma?: string;
  /** Whether the value is an angle (its spread is transcendental: no exact form follows). */
  angle: boolean;
}

/** The length units a job may use. */
export const LENGTH_UNITS: readonly LengthUnit[] = [
  'm',
  'km',
  'ft',
  'us-ft',
  'ch',
  'lk',
  'us-ch',
  'us-lk',
  'mi',
];

/** Words for the length units, for reports (`m`, `ft`, `US survey ft`, …). */
export const LENGTH_UNIT_NAMES: Record<LengthUnit, string> = {
  m: 'm',
  km: 'km',
  ft: 'ft',
  'us-ft': 'US survey ft',
  ch: 'ch',
  lk: 'lk',
  'us-ch': 'US survey ch',
  'us-lk': 'US survey lk',
  mi: 'mi',
};

/**
 * A value as the exact text the computation reads back (`A.from`): refused when that text is
 * longer than the readers' limit (a value such as 1e1000 or 1e-999 written out exactly).
 */
function exactText(v: Rational): string {
  const t = R.toString(v);
  if (t.length > MAX_INPUT_LENGTH)
    throw inputTooLong(
      '',
      `it is too large or too precise: written exactly it takes ${t.length} characters, over the limit of ${MAX_INPUT_LENGTH}`,
    );
  return t;
}

function reason(e: unknown): string {
  if (e instanceof QuadspreadError) {
    const m = /^quadspread [A-Z_]+: [^:]*: (.*)$/s.exec(e.message);
    return m ? m[1]! : e.message;
  }
  throw e;
}

/** Marks a `{ value, sigma }` pair made from a reading and the `sigma` beside it (as in `{ "elevation": …, "sigma": … }`). */
const SIBLING_SIGMA = Symbol('sigma beside the reading');

/** A reading with the `sigma` written beside it in the same object, for the readers below. */
function withSiblingSigma(value: unknown, sigma: unknown): unknown {
  return sigma === undefined ? value : { value, sigma, [SIBLING_SIGMA]: true };
}

/**
 * The `{ value, sigma }` form: returns the parts, or the value alone, with the paths that
 * name them (`path.value`, `path.sigma`; for a sigma written beside the reading, `path` and
 * the sibling `….sigma`).
 */
function splitMeasured(
  x: unknown,
  path: string,
): {
  value: unknown;
  sigma?: unknown;
  measuredForm: boolean;
  valuePath: string;
  sigmaPath: string;
} {
  if (typeof x === 'object' && x !== null && !Array.isArray(x) && 'value' in x) {
    const o = x as { value: unknown; sigma?: unknown; [SIBLING_SIGMA]?: true };
    const sibling = o[SIBLING_SIGMA] === true;
    return {
      value: o.value,
      ...(o.sigma !== undefined ? { sigma: o.sigma } : {}),
      measuredForm: true,
      valuePath: sibling ? path : `${path}.value`,
      sigmaPath: sibling ? path.replace(/\.[^.[\]]+$/, '.sigma') : `${path}.sigma`,
    };
  }
  return { value: x, measuredForm: false, valuePath: path, sigmaPath: `${path}.sigma` };
}

/**
 * Reads a length (number in the job's unit, or text such as `120.5 m`, `395 ft`, `5 mm`) into
 * the job's unit, exactly, through the library's `lengthIn` (the one reading of lengths).
 */
export function lengthText(x: unknown, path: string, unit: LengthUnit, what = 'length'): string {
  if (typeof x !== 'number' && typeof x !== 'string')
    throw new JobInvalid(
      path,
      `${show(x)} is not a valid ${what} (give a number or text such as "120.5 m")`,
    );
  try {
    return exactText(lengthIn(R, x, unit));
  } catch (e) {
    throw new JobInvalid(path, `${show(x)} is not a valid ${what}: ${reason(e)}`);
  }
}

/** Reads a length input, with its sigma when given as `{ value, sigma }`. */
export function readLength(
  x: unknown,
  path: string,
  unit: LengthUnit,
  name: string,
  what = 'length',
): Input {
  const m = splitMeasured(x, path);
  const value = lengthText(m.value, m.valuePath, unit, what);
  const input: Input = { name, value, angle: false };
  if (m.sigma !== undefined)
    input.sigma = readSigma(
      () => {
        const raw = m.sigma as Parameters<typeof lengthSigma<Rational>>[1];
        if (typeof raw !== 'number' && typeof raw !== 'string' && !isConstantPpm(raw))
          throw new JobInvalid(
            m.sigmaPath,
            `${show(raw)} is not a valid standard uncertainty (a length, or { "constant", "ppm" })`,
          );
        try {
          return exactText(lengthSigma(R, raw, unit, R.from(value)));
        } catch (e) {
          throw new JobInvalid(
            m.sigmaPath,
            `${show(raw)} is not a valid standard uncertainty: ${reason(e)}`,
          );
        }
      },
      m.sigmaPath,
      m.sigma,
    );
  return input;
}

function isConstantPpm(x: unknown): boolean {
  return typeof x === 'object' && x !== null && !Array.isArray(x) && 'constant' in x;
}

/** Requires a length to be positive. */
export function positive(input: Input, path: string, what: string): Input {
  if (R.sign(R.from(input.value)) <= 0)
    throw new JobInvalid(
      path,
      `${input.value} is not a valid ${what}: it must be greater than zero`,
    );
  return input;
}

function readSigma(read: () => string, path: string, raw: unknown): string {
  const s = read();
  if (R.sign(R.from(s)) < 0)
    throw new JobInvalid(path, `${show(raw)} is not a valid standard uncertainty: it is negative`);
  return s;
}

const ANGLE_SUFFIX = /^\s*(.*?)\s*(gon|mil|rad|deg)\s*$/;

/** Reads an angle (decimal degrees, DMS text, or a number with `gon`, `mil`, `rad`) into exact degrees text. */
export function angleText(x: unknown, path: string, what = 'angle'): string {
  if (typeof x !== 'number' && typeof x !== 'string')
    throw new JobInvalid(path, `${show(x)} is not a valid ${what}`);
  try {
    if (typeof x === 'string') {
      const m = ANGLE_SUFFIX.exec(x);
      if (m) return exactText(angleToDegrees(R, m[1]!, m[2] as AngleUnit));
    }
    return exactText(angleToDegrees(R, x));
  } catch (e) {
    throw new JobInvalid(path, `${show(x)} is not a valid ${what}: ${reason(e)}`);
  }
}

/**
 * Reads an angle input in degrees, with its sigma when given as `{ value, sigma }`: a number
 * in arc-seconds, or text with its own unit (`5"`, `1 mgon`), through the library's `angleSigma`.
 */
export function readAngle(x: unknown, path: string, name: string, what = 'angle'): Input {
  const m = splitMeasured(x, path);
  const value = angleText(m.value, m.valuePath, what);
  const input: Input = { name, value, angle: true };
  if (m.sigma !== undefined)
    input.sigma = readSigma(
      () => {
        const raw = m.sigma;
        if (typeof raw !== 'number' && typeof raw !== 'string')
          throw new JobInvalid(m.sigmaPath, `${show(raw)} is not a valid standard uncertainty`);
        try {
          return exactText(angleSigma(R, raw));
        } catch (e) {
          throw new JobInvalid(
            m.sigmaPath,
            `${show(raw)} is not a valid standard uncertainty: ${reason(e)}`,
          );
        }
      },
      m.sigmaPath,
      m.sigma,
    );
  return input;
}

/** A plain number (a spread, a ratio) with an optional sigma. */
export function readNumber(x: unknown, path: string, name: string, what = 'number'): Input {
  const m = splitMeasured(x, path);
  const read = (v: unknown, p: string, w: string): string => {
    try {
      if (typeof v !== 'number' && typeof v !== 'string')
        throw new JobInvalid(p, `${show(v)} is not a valid ${w}`);
      return exactText(R.from(v));
    } catch (e) {
      if (e instanceof JobInvalid) throw e;
      throw new JobInvalid(p, `${show(v)} is not a valid ${w}: ${reason(e)}`);
    }
  };
  const input: Input = { name, value: read(m.value, m.valuePath, what), angle: false };
  if (m.sigma !== undefined)
    input.sigma = readSigma(
      () => read(m.sigma, m.sigmaPath, 'standard uncertainty'),
      m.sigmaPath,
      m.sigma,
    );
  return input;
}

/** How a vertical reading was given. */
export type VerticalSpec =
  | { form: 'elevation' | 'zenith'; input: Input; text: string }
  | { form: 'slope'; text: string }
  | { form: 'spread'; input: Input; sign: 1 | -1; text: string };

/**
 * Reads a vertical reading: text or a number is an elevation angle (above the horizon
 * positive); `{ "zenith": … }`, `{ "elevation": … }`, `{ "slope": "8%" }` or
 * `{ "spread": "1/10", "below": true }` say which it is; `sigma` beside an angle is its
 * standard uncertainty (an angle, e.g. `5"`).
 */
export function readVertical(x: unknown, path: string, name: string): VerticalSpec {
  let spec: VerticalSpec;
  if (typeof x === 'string' || typeof x === 'number') {
    spec = {
      form: 'elevation',
      input: readAngle(x, path, `${name} elevation`, 'elevation angle'),
      text: String(x),
    };
  } else if (typeof x === 'object' && x !== null) {
    const o = x as Record<string, unknown>;
    const sigma = o.sigma;
    const withSigma = (v: unknown): unknown => withSiblingSigma(v, sigma);
    if ('elevation' in o)
      spec = {
        form: 'elevation',
        input: readAngle(
          withSigma(o.elevation),
          `${path}.elevation`,
          `${name} elevation`,
          'elevation angle',
        ),
        text: String(o.elevation),
      };
    else if ('zenith' in o)
      spec = {
        form: 'zenith',
        input: readAngle(withSigma(o.zenith), `${path}.zenith`, `${name} zenith`, 'zenith angle'),
        text: String(o.zenith),
      };
    else if ('slope' in o) {
      if (sigma !== undefined)
        throw new JobInvalid(
          `${path}.sigma`,
          'a slope reading takes no sigma here (give the reading as an angle to carry an uncertainty)',
        );
      spec = { form: 'slope', text: String(o.slope) };
    } else if ('spread' in o) {
      spec = {
        form: 'spread',
        input: readNumber(withSigma(o.spread), `${path}.spread`, `${name} spread`, 'spread'),
        sign: o.below === true ? -1 : 1,
        text: String(o.spread),
      };
    } else
      throw new JobInvalid(
        path,
        'a vertical reading needs one of "elevation", "zenith", "slope" or "spread"',
      );
  } else throw new JobInvalid(path, `${show(x)} is not a valid vertical reading`);
  // Check it now, exactly, so that a bad reading is a bad job (exit 2), not a failed computation.
  const where =
    spec.form === 'elevation' || spec.form === 'zenith'
      ? `${path}${typeof x === 'object' ? `.${spec.form}` : ''}`
      : `${path}.${spec.form}`;
  try {
    verticalOf(R, spec, (i) => R.from(i.value));
  } catch (e) {
    const label =
      spec.form === 'elevation'
        ? 'elevation angle'
        : spec.form === 'zenith'
          ? 'zenith angle'
          : spec.form;
    throw new JobInvalid(where, `${show(spec.text)} is not a valid ${label}: ${reason(e)}`);
  }
  return spec;
}

/** The signed vertical reading of a spec in an arithmetic, through the library's readings. */
export function verticalOf<V>(
  A: Arithmetic<V>,
  spec: VerticalSpec,
  get: (i: Input) => V,
): VerticalReading<V> {
  switch (spec.form) {
    case 'elevation':
    case 'zenith':
      return verticalFromAngle(A, get(spec.input), { kind: spec.form });
    case 'slope':
      return verticalFromSlope(A, spec.text);
    case 'spread':
      return vertical(A, get(spec.input), spec.sign);
  }
}

/** The inputs a vertical spec depends on. */
export function verticalInputs(spec: VerticalSpec): Input[] {
  return spec.form === 'slope' ? [] : [spec.input];
}

/** Exact text (`1/20`, `0.05`) as short decimal text for tolerances: up to 12 significant digits, trailing zeros dropped. */
export function plain(text: string): string {
  const t = R.toPrecision(R.from(text), 12);
  return t.includes('.') && !/e/i.test(t) ? t.replace(/0+$/, '').replace(/\.$/, '') : t;
}

/**
 * Requires an angle input (in degrees) to lie in a range: `[lo, hi)` or `(lo, hi)`.
 * A reading outside the range of its kind is a bad job (exit 2), not a failed computation.
 */
export function inRange(
  input: Input,
  path: string,
  what: string,
  lo: number,
  hi: number,
  open: 'lo' | 'both',
): Input {
  const v = R.from(input.value);
  const low = R.cmp(v, R.from(lo));
  const high = R.cmp(v, R.from(hi));
  if ((open === 'both' ? low <= 0 : low < 0) || high >= 0) {
    const range = open === 'both' ? `(${lo}°, ${hi}°)` : `[${lo}°, ${hi}°)`;
    throw new JobInvalid(
      path,
      `${plain(input.value)}° is not a valid ${what}: it must be in ${range}`,
    );
  }
  return input;
}

/** Requires a number input to lie in [lo, hi] (e.g. a spread in [0, 1]) or [lo, ∞). */
export function inClosed(input: Input, path: string, what: string, lo: number, hi?: number): Input {
  const v = R.from(input.value);
  if (R.cmp(v, R.from(lo)) < 0 || (hi !== undefined && R.cmp(v, R.from(hi)) > 0)) {
    throw new JobInvalid(
      path,
      `${plain(input.value)} is not a valid ${what}: it must be in [${lo}, ${hi ?? '∞'}${hi === undefined ? ')' : ']'}`,
    );
  }
  return input;
}
