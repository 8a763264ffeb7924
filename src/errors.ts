/**
 * The one error class of quadspread, and its stable codes.
 *
 * @module errors
 */

/**
 * Every stable error code, with what it means. Codes never change meaning once
 * published; new codes may be added. The table in `docs/errors.md` lists them.
 *
 * @example
 * ```ts
 * import { ERROR_CODES } from 'quadspread';
 * ERROR_CODES.DIVISION_BY_ZERO;
 * //=> 'A division by zero.'
 * ```
 */
export const ERROR_CODES = {
  // Numbers and arithmetic
  INVALID_NUMBER:
    'A value is not a number this arithmetic can read (bad text, NaN, ±Infinity, null, an object, a value of another arithmetic).',
  INPUT_TOO_LONG:
    'An input string is longer than the documented limit, or its exponent is too large.',
  NOT_FINITE: 'A float result overflowed to ±Infinity or became NaN.',
  DIVISION_BY_ZERO: 'A division by zero.',
  NO_REAL_SOLUTION: 'A square root of a negative number, or readings with no real solution.',
  INVALID_ARGUMENT: 'An option or argument is outside its allowed set or range.',
  UNSUPPORTED_OPERATION: 'The arithmetic cannot perform this operation.',
  // Geometry
  COINCIDENT_POINTS: 'Two points that must differ coincide (a line or a spread is undefined).',
  COLLINEAR_POINTS: 'Three points that must form a proper triangle are collinear.',
  DEGENERATE_TRIANGLE: 'Measures that do not form a proper triangle.',
  DEGENERATE_LINE: 'A line ⟨a : b : c⟩ with a = b = 0.',
  PARALLEL_LINES: 'Lines that must meet are parallel.',
  SPREAD_OUT_OF_RANGE: 'A spread outside [0, 1].',
  NEGATIVE_QUADRANCE: 'A quadrance below zero.',
  NEEDS_A_QUADRANCE: 'Spreads alone fix a triangle only up to scale: give a quadrance.',
  DIFFERENT_RADICANDS: 'Quadratic surds with different radicands cannot be combined exactly.',
  // Readings
  INVALID_ANGLE: 'An angle reading that cannot be read or is outside its range.',
  INVALID_UNIT: 'An unknown unit.',
  INVALID_SLOPE: 'A slope reading (grade, ratio, 1 in n) that cannot be read.',
  VERTICAL_SIGHT: 'A vertical spread of 1 (a plumb sight) where a horizontal quadrance is given.',
  // Elevation
  TOO_FEW_STATIONS: 'Fewer stations than the solver needs.',
  REPEATED_CHAINAGE: 'Two stations at the same chainage.',
  GRADE_STEEPER_THAN_SLOPE: 'A path grade steeper than the slope it lies on.',
  INCONSISTENT_READINGS: 'Readings that contradict each other beyond what the solver accepts.',
  // Coordinates
  TOO_FEW_POINTS: 'Fewer points than the computation needs.',
  DANGER_CIRCLE: 'A resection station on or near the circle through the control points.',
  INVALID_BEARING: 'A bearing that cannot be read.',
  NO_COURSES: 'A traverse with no courses.',
  // Uncertainty
  UNKNOWN_INPUT: 'A named uncertain input that is not known.',
  DUPLICATE_INPUT: 'Two uncertain inputs with the same name.',
  INVALID_SIGMA: 'A standard uncertainty that is negative or not a number.',
  INVALID_COVARIANCE: 'A covariance that cannot belong to the inputs (for example |r| > 1).',
  // Geodesy
  LATITUDE_OUT_OF_RANGE: 'A latitude beyond ±90°.',
  HEIGHT_OUT_OF_RANGE:
    'A height that cannot belong to a point of the ellipsoid (for example below −a).',
  UNKNOWN_ELLIPSOID: 'An ellipsoid that is not known.',
  INVALID_ELLIPSOID: 'Ellipsoid parameters that do not define an oblate ellipsoid.',
  NOT_CONVERGED: 'An iteration did not converge within its limit.',
  // Map projections
  UNKNOWN_METHOD: 'A projection method that is not known.',
  MISSING_PARAMETER: 'A parameter the projection method needs is missing.',
  OUTSIDE_DOMAIN:
    'A point outside the domain of a projection (a pole in Mercator, the antipode of an azimuthal projection).',
  UNKNOWN_CRS: 'A coordinate reference system code that is not in the table.',
  // Alignment
  CURVES_OVERLAP:
    'Curves of an alignment that overlap: tangents longer than their leg, or a vertical curve running into the next or past an end.',
  TRANSITION_TOO_LONG:
    'Transition curves that turn through more than the deflection of their curve.',
  OFF_ALIGNMENT: 'A chainage or a point beyond the ends of an alignment or a profile.',
  // Adjustment
  UNKNOWN_POINT: 'A point name that is not in the network.',
  DATUM_DEFECT:
    'A network whose datum is not fixed: too few fixed points, weighted points or constraints.',
  DISCONNECTED_NETWORK: 'Points that no chain of observations connects to the datum.',
  SINGULAR_NETWORK:
    'Observations that do not determine a point (weak geometry): the normal equations are singular.',
  TOO_FEW_OBSERVATIONS: 'Fewer observations than the computation needs.',
  NO_APPROXIMATION:
    'No approximate coordinates can be found for a point from the observations: give them.',
  // Data exchange
  INVALID_FILE:
    'A data file (CSV, GeoJSON, LandXML) that breaks its format, or a record the reader cannot take; the message names the line, field or element.',
  MISSING_COLUMN: 'A point file without a column the reader needs; the message names the column.',
  UNKNOWN_FORMAT: 'A data file whose format is not recognised or not supported.',
  MISSING_REFERENCE_SYSTEM:
    'A conversion to longitude and latitude without a stated grid (projection) or, off WGS 84, without a stated datum transformation.',
  // Job runner
  INVALID_JOB: 'A job file that is not valid JSON or breaks the job schema.',
} as const;

/** A stable error code: one of the keys of {@link ERROR_CODES}. */
export type ErrorCode = keyof typeof ERROR_CODES;

const BRAND: unique symbol = /* @__PURE__ */ Symbol.for('quadspread.error') as never;

/**
 * The one error class of quadspread. Every bad input, impossible configuration and
 * unsupported operation throws it, with a stable {@link ErrorCode} in `code` and a
 * message that names the function, the input and its value.
 *
 * The message has the form `quadspread CODE: where: what`. `instanceof QuadspreadError`
 * works across the package's entries (generic and bound builds share one brand).
 *
 * @example
 * ```ts
 * import { rational, QuadspreadError } from 'quadspread';
 * try { rational.from('abc'); } catch (e) {
 *   (e as QuadspreadError).code;
 *   //=> 'INVALID_NUMBER'
 * }
 * ```
 */
export class QuadspreadError extends Error {
  /** The stable code; see {@link ERROR_CODES}. */
  readonly code: ErrorCode;
  /** Where it happened: the function (and argument) that refused the input. */
  readonly where: string;

  /**
   * @param code a stable code from {@link ERROR_CODES}
   * @param where the function and argument, e.g. `rational.from(x)`
   * @param what what is wrong, naming the value, e.g. `"abc" is not a number`
   */
  constructor(code: ErrorCode, where: string, what: string) {
    super(`quadspread ${code}: ${typeof where === 'string' ? where : show(where)}: ${what}`);
    this.name = 'QuadspreadError';
    this.code = code;
    this.where = where;
    Object.defineProperty(this, BRAND, { value: true });
  }

  /** `instanceof` by brand, so that errors from any entry of the package match. */
  static override [Symbol.hasInstance](x: unknown): boolean {
    return typeof x === 'object' && x !== null && (x as Record<symbol, unknown>)[BRAND] === true;
  }
}

/**
 * Longest input text any parser accepts, in characters. Longer text is refused at once.
 *
 * @example
 * ```ts
 * import { rational, MAX_INPUT_LENGTH, QuadspreadError } from 'quadspread';
 * try { rational.from('1'.repeat(MAX_INPUT_LENGTH + 1)); } catch (e) {
 *   (e as QuadspreadError).code;
 *   //=> 'INPUT_TOO_LONG'
 * }
 * ```
 */
export const MAX_INPUT_LENGTH = 1000;

/**
 * Shows a value briefly for an error message: strings quoted and cut to 60 characters.
 * @internal
 */
export function show(x: unknown): string {
  if (typeof x === 'string') {
    const s = x.length > 60 ? `${x.slice(0, 57)}...` : x;
    return JSON.stringify(s) + (x.length > 60 ? ` (${x.length} characters)` : '');
  }
  if (typeof x === 'bigint') return `${x}n`;
  if (typeof x === 'number') return Object.is(x, -0) ? '-0' : String(x);
  if (x === null) return 'null';
  if (x === undefined) return 'undefined';
  // An object may have no prototype, a throwing toString or getter, or be a Proxy that
  // throws on every trap: whatever it does, the message is built and the error is ours.
  try {
    if (Array.isArray(x)) return `an array of ${x.length}`;
    if (typeof x === 'object') {
      const text = String(x);
      return text === '[object Object]'
        ? 'an object'
        : text.length > 60
          ? `${text.slice(0, 57)}...`
          : text;
    }
  } catch {
    return 'an object';
  }
  return typeof x;
}

/** The constructor name of an object for a message, or 'an object' (never throws). @internal */
function kindOfValue(x: unknown): string {
  if (typeof x !== 'object' || x === null) return typeof x;
  try {
    const name = (x as object).constructor?.name;
    return typeof name === 'string' ? name : 'an object';
  } catch {
    return 'an object';
  }
}

// Factories for the codes thrown most often (internal; not exported by the entries). One call
// instead of `new QuadspreadError('CODE', …)` at each of some 240 places keeps the
// minified library inside its size budget; the error is the same.
const make =
  (code: ErrorCode) =>
  (where: string, what: string): QuadspreadError =>
    new QuadspreadError(code, where, what);
/** @internal */ export const invalidArgument = /* @__PURE__ */ make('INVALID_ARGUMENT');
/** @internal */ export const notFinite = /* @__PURE__ */ make('NOT_FINITE');
/** @internal */ export const noRealSolution = /* @__PURE__ */ make('NO_REAL_SOLUTION');
/** @internal */ export const coincidentPoints = /* @__PURE__ */ make('COINCIDENT_POINTS');
/** @internal */ export const invalidAngle = /* @__PURE__ */ make('INVALID_ANGLE');
/** @internal */ export const inconsistentReadings = /* @__PURE__ */ make('INCONSISTENT_READINGS');
/** @internal */ export const invalidNumber = /* @__PURE__ */ make('INVALID_NUMBER');
/** @internal */ export const invalidEllipsoid = /* @__PURE__ */ make('INVALID_ELLIPSOID');
/** @internal */ export const invalidCovariance = /* @__PURE__ */ make('INVALID_COVARIANCE');
/** @internal */ export const inputTooLong = /* @__PURE__ */ make('INPUT_TOO_LONG');
/** @internal */ export const divisionByZero = /* @__PURE__ */ make('DIVISION_BY_ZERO');
/** @internal */ export const verticalSight = /* @__PURE__ */ make('VERTICAL_SIGHT');
/** @internal */ export const unsupportedOperation = /* @__PURE__ */ make('UNSUPPORTED_OPERATION');
/** @internal */ export const negativeQuadrance = /* @__PURE__ */ make('NEGATIVE_QUADRANCE');
/** @internal */ export const degenerateLine = /* @__PURE__ */ make('DEGENERATE_LINE');
/** @internal */ export const invalidSlope = /* @__PURE__ */ make('INVALID_SLOPE');

/** `INVALID_ARGUMENT` for atan2(0, 0), which every arithmetic refuses. @internal */
export const zeroVectorAngle = (where: string): QuadspreadError =>
  invalidArgument(where, 'the angle of the zero vector is undefined');
/** `INPUT_TOO_LONG` for text of `length` characters over `limit`. @internal */
export const textTooLong = (
  where: string,
  length: number,
  limit: number = MAX_INPUT_LENGTH,
): QuadspreadError =>
  inputTooLong(where, `text of ${length} characters is longer than the limit of ${limit}`);
/**
 * `INVALID_NUMBER` for an operand of `arith`'s operation `op` that is not a value of that
 * arithmetic (a JS number, text, or a value of another arithmetic). @internal
 */
export const notAValue = (arith: string, op: string, x: unknown): QuadspreadError =>
  invalidNumber(`${arith}.${op}(…)`, `${show(x)} ${notAValueAdvice(arith, x)}`);

// What to call instead, for the values met most often where an arithmetic's value is expected
// (read defensively: a Proxy or a throwing getter gets the plain advice).
function notAValueAdvice(arith: string, x: unknown): string {
  try {
    const o = typeof x === 'object' && x !== null ? (x as Record<PropertyKey, unknown>) : undefined;
    if (o?.[Symbol.for('quadspread.surd')] === true)
      return `is a surd (an exact root), not a ${arith} value: use x.toString(), x.toPrecision(digits), x.toNumber() or its own x.add(y), x.mul(y), …`;
    if (o !== undefined && 'value' in o && Array.isArray(o.derivatives))
      return `is an uncertain value, not a ${arith} value: use U.toString(x), x.value or budget(U, x)`;
  } catch {
    // fall through to the plain advice
  }
  return `(${kindOfValue(x)}) is not a ${arith} value: read it with ${arith}.from(x), or point(${arith}, x, y)`;
}

const METHODS = [
  'from',
  'is',
  'add',
  'sub',
  'mul',
  'div',
  'neg',
  'abs',
  'cmp',
  'eq',
  'isZero',
  'sign',
  'sqrt',
  'toNumber',
  'toString',
  'toPrecision',
  'sin',
  'cos',
  'atan2',
] as const;
// Arithmetics already checked (a cache only: it changes no result).
const checked = /* @__PURE__ */ new WeakSet<object>();
let lastChecked: unknown;

/**
 * Checks, once per arithmetic object, that the first argument of a public function is an
 * arithmetic (an object with every method of `Arithmetic`), so that a wrong one is a
 * `QuadspreadError` naming the function rather than a TypeError deep inside. @internal
 */
export function checkArithmetic(A: unknown, where: string): void {
  // The last arithmetic checked, first: a comparison instead of a hash lookup on every call of
  // a hot function (docs/performance.md).
  if (A === lastChecked && A !== undefined) return;
  checkOther(A, where);
}

/** {@link checkArithmetic} past its first comparison (kept apart so that the comparison, inlined into a hot caller, costs V8 little of its inlining budget). */
function checkOther(A: unknown, where: string): void {
  if (checked.has(A as object)) {
    lastChecked = A;
    return;
  }
  let ok = false;
  try {
    ok =
      typeof A === 'object' &&
      A !== null &&
      METHODS.every((m) => typeof (A as Record<string, unknown>)[m] === 'function') &&
      typeof (A as { exact?: unknown }).exact === 'boolean';
  } catch {
    // A Proxy or a getter that throws: not an arithmetic.
  }
  if (!ok)
    throw invalidArgument(
      `${where}(A)`,
      `${show(A)} is not an arithmetic (use rational, decimal(digits), float or uncertain(base))`,
    );
  checked.add(A as object);
}
