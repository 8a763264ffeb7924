/**
 * Uncertain instrument readings: sigmas given in the reading's own units (arc-seconds for
 * angles, millimetres for distances, percent for grades) carried into degrees, metres,
 * quadrances and spreads through the derivatives of the conversions.
 *
 * The values come from the readings module (so they agree with it exactly, including its
 * exact spreads at 0°, 30°, 45°, 60°, 90°); the derivatives are written here from the
 * conversion formulas, so the gradient survives those exact special cases.
 *
 * @module uncertainty
 */
import type { Numeric } from '../arithmetic/types.js';
import { Uncertain } from '../arithmetic/uncertain.js';
import type { UncertainArithmetic } from '../arithmetic/uncertain.js';
import { angleToDegrees, type AngleUnit } from '../readings/angle.js';
import { spreadFromDegrees } from '../readings/spread.js';
import { spreadFromGrade } from '../readings/slope.js';
import {
  verticalFromAngle,
  type VerticalKind,
  type VerticalReading,
} from '../readings/vertical.js';
import { lengthTextParts, lengthToMetres, type LengthUnit } from '../readings/length.js';
import { angleSigma, lengthSigma, type LengthSigma } from '../readings/sigma.js';
import { readNumber } from '../geometry/validate.js';
import { measured } from './measured.js';
import { checkU, readName } from './internal.js';
import { QuadspreadError, checkArithmetic, show } from '../errors.js';

/**
 * A value y = g(x) of an uncertain `x`, given y and dy/dx: its gradient is dy/dx times
 * x's (the chain rule). For functions whose derivative is known in closed form.
 *
 * @param U the uncertain arithmetic
 * @param x the argument
 * @param value g(x), in the base arithmetic
 * @param derivative g′(x), in the base arithmetic
 * @returns g(x) with gradient g′(x)·∇x
 * @throws {QuadspreadError} `INVALID_NUMBER` naming `x`, `value` or `derivative` when it
 *   cannot be read.
 * @example
 * ```ts
 * import { uncertain, float, measured, withDerivative, budget } from 'quadspread';
 * const U = uncertain(float);
 * const x = measured(U, 2, 0.25, 'x');
 * const cube = withDerivative(U, x, 8, 12); // x³ and 3x²
 * budget(U, cube).sigma;
 * //=> 3
 * ```
 */
export function withDerivative<T>(
  U: UncertainArithmetic<T>,
  x: Uncertain<T>,
  value: Numeric<T>,
  derivative: Numeric<T>,
): Uncertain<T> {
  checkArithmetic(U, 'withDerivative');
  const where = 'withDerivative(U, x, value, derivative)';
  checkU(U, where);
  const B = U.base;
  const v = readNumber(U, x, `${where} x`);
  const d = readNumber(B, derivative, `${where} derivative`);
  return new Uncertain(
    readNumber(B, value, `${where} value`),
    v.inputs,
    v.derivatives.map((c) => B.mul(d, c)),
  ); // d·∇x
}

/**
 * A measured angle in degrees: the reading (degrees, DMS text, or a number in `unit`) read
 * by `angleToDegrees`, with a standard uncertainty read by `angleSigma`: a number in
 * arc-seconds (1″ = 1/3600°), or text with its own unit (`'2"'`, `'1 mgon'` = 3.24″).
 *
 * @param U the uncertain arithmetic
 * @param reading the angle reading
 * @param sigmaArcSeconds its standard uncertainty, ≥ 0: arc-seconds, or text with its own unit
 * @param name the input's name
 * @param unit the unit of a numeric reading (default `'deg'`)
 * @returns the angle in degrees; its input is the angle in degrees, u = σ in degrees
 * @throws {QuadspreadError} as `angleToDegrees` and `measured`.
 * @example
 * ```ts
 * import { uncertain, rational, measuredAngle, budget } from 'quadspread';
 * const U = uncertain(rational);
 * const a = measuredAngle(U, `30°15'00"`, 9, 'a');
 * [rational.toString(a.value), budget(U, a).sigma.toString()];
 * //=> ['121/4', '1/400']
 * ```
 */
export function measuredAngle<T>(
  U: UncertainArithmetic<T>,
  reading: Numeric<T>,
  sigmaArcSeconds: Numeric<T>,
  name: string,
  unit: AngleUnit = 'deg',
): Uncertain<T> {
  checkArithmetic(U, 'measuredAngle');
  const where = 'measuredAngle(U, reading, sigmaArcSeconds, name)';
  checkU(U, where);
  readName(name, where);
  const s = angleSigmaOf(U, sigmaArcSeconds, where);
  const deg = angleToDegrees(U.base, reading as Numeric<T>, unit);
  return measured(U, deg, s, name);
}

/**
 * The spread s = sin²θ of an uncertain angle θ in degrees, with ds/dθ = 2 sin θ cos θ · π/180
 * per degree.
 *
 * @deprecated Kept for one release: `spreadFromDegrees(U, θ)` gives the same value and
 * gradient (the uncertain arithmetic carries the derivatives of sin and cos).
 * @param U the uncertain arithmetic
 * @param degrees the angle in degrees, e.g. from {@link measuredAngle}
 * @returns the spread, with its gradient
 * @throws {QuadspreadError} as `spreadFromDegrees`; `INVALID_NUMBER` for an unreadable angle.
 * @example
 * ```ts
 * import { uncertain, float, measuredAngle, spreadOfAngle, budget } from 'quadspread';
 * const U = uncertain(float);
 * const s = spreadOfAngle(U, measuredAngle(U, 45, 3600, 't')); // u(θ) = 1°
 * [s.value, budget(U, s).sigma === Math.PI / 180];
 * //=> [0.5, true]
 * ```
 */
export function spreadOfAngle<T>(
  U: UncertainArithmetic<T>,
  degrees: Uncertain<T> | Numeric<T>,
): Uncertain<T> {
  checkArithmetic(U, 'spreadOfAngle');
  checkU(U, 'spreadOfAngle(U, degrees)');
  return spreadFromDegrees(U, U.from(degrees as Numeric<Uncertain<T>>));
}

/**
 * A measured angle as a spread: {@link spreadOfAngle} of {@link measuredAngle}.
 *
 * @param U the uncertain arithmetic
 * @param reading the angle reading
 * @param sigmaArcSeconds its standard uncertainty in arc-seconds
 * @param name the input's name (the input is the angle in degrees)
 * @param unit the unit of a numeric reading (default `'deg'`)
 * @returns the spread sin²θ with its gradient
 * @throws {QuadspreadError} as {@link measuredAngle}.
 * @example
 * ```ts
 * import { uncertain, float, measuredSpread } from 'quadspread';
 * const U = uncertain(float);
 * measuredSpread(U, 30, 10, 'a').value;
 * //=> 0.25
 * ```
 */
export function measuredSpread<T>(
  U: UncertainArithmetic<T>,
  reading: Numeric<T>,
  sigmaArcSeconds: Numeric<T>,
  name: string,
  unit: AngleUnit = 'deg',
): Uncertain<T> {
  checkArithmetic(U, 'measuredSpread');
  return spreadFromDegrees(U, measuredAngle(U, reading, sigmaArcSeconds, name, unit));
}

/**
 * A vertical reading (spread R of the sight with the horizontal, and its sign) from an
 * uncertain elevation or zenith angle in degrees, its spread carrying dR/dα = 2 sin α cos α ·
 * π/180 per degree (dα/dz = −1).
 *
 * @deprecated Kept for one release: `verticalFromAngle(U, angle, { kind })` gives the same
 * reading and gradient.
 * @param U the uncertain arithmetic
 * @param degrees the angle in degrees, e.g. from {@link measuredAngle}
 * @param kind `'elevation'` (default) or `'zenith'`
 * @returns the signed reading, its spread uncertain
 * @throws {QuadspreadError} as `verticalFromAngle`.
 * @example
 * ```ts
 * import { uncertain, rational, measuredAngle, verticalOfAngle } from 'quadspread';
 * const U = uncertain(rational);
 * const v = verticalOfAngle(U, measuredAngle(U, 120, 5, 'z'), 'zenith');
 * [rational.toString(v.spread.value), v.sign];
 * //=> ['1/4', -1]
 * ```
 */
export function verticalOfAngle<T>(
  U: UncertainArithmetic<T>,
  degrees: Uncertain<T> | Numeric<T>,
  kind: VerticalKind = 'elevation',
): VerticalReading<Uncertain<T>> {
  checkArithmetic(U, 'verticalOfAngle');
  checkU(U, 'verticalOfAngle(U, degrees, kind)');
  return verticalFromAngle(U, U.from(degrees as Numeric<Uncertain<T>>), { kind });
}

/**
 * A measured vertical angle as a vertical reading: {@link verticalOfAngle} of
 * {@link measuredAngle}. Pass it where a solver takes `vertical`.
 *
 * @param U the uncertain arithmetic
 * @param reading the elevation or zenith angle reading
 * @param sigmaArcSeconds its standard uncertainty in arc-seconds
 * @param name the input's name (the input is the angle in degrees)
 * @param options `kind` (`'elevation'` default, or `'zenith'`) and `unit` of a numeric reading
 * @returns the signed reading, its spread uncertain
 * @throws {QuadspreadError} as {@link measuredAngle} and `verticalFromAngle`.
 * @example
 * ```ts
 * import { uncertain, float, measuredVertical } from 'quadspread';
 * const U = uncertain(float);
 * const v = measuredVertical(U, `-30°00'00"`, 5, 'alpha');
 * [v.spread.value, v.sign];
 * //=> [0.25, -1]
 * ```
 */
export function measuredVertical<T>(
  U: UncertainArithmetic<T>,
  reading: Numeric<T>,
  sigmaArcSeconds: Numeric<T>,
  name: string,
  options: { kind?: VerticalKind; unit?: AngleUnit } = {},
): VerticalReading<Uncertain<T>> {
  checkArithmetic(U, 'measuredVertical');
  return verticalFromAngle(
    U,
    measuredAngle(U, reading, sigmaArcSeconds, name, options.unit ?? 'deg'),
    { kind: options.kind ?? 'elevation' },
  );
}

/**
 * A measured distance in metres: the reading in `unit` (or text with its own unit, read by
 * `lengthToMetres`, exact) with a standard uncertainty read by `lengthSigma`: a number in the
 * unit of the reading, text with its own unit (`'3 mm'`), or `{ constant, ppm }`.
 *
 * @param U the uncertain arithmetic
 * @param reading the distance in `unit`, or text with its own unit (`'328.1 ft'`)
 * @param sigma its standard uncertainty, ≥ 0 (see `lengthSigma`)
 * @param name the input's name (the input is the distance in metres)
 * @param unit the unit of a bare-number reading and σ (default `'m'`)
 * @returns the distance in metres, u = σ in metres
 * @throws {QuadspreadError} as `lengthToMetres`, `lengthSigma` and `measured`.
 * @example
 * ```ts
 * import { uncertain, rational, measuredDistance, budget } from 'quadspread';
 * const U = uncertain(rational);
 * const d = measuredDistance(U, 100, '3 mm', 'd', 'ft');
 * [rational.toString(d.value), budget(U, d).sigma.toString()];
 * //=> ['762/25', '3/1000']
 * // 3 mm + 4 ppm over 1000 m: √(3² + 4²) mm = 5 mm
 * budget(U, measuredDistance(U, 1000, { constant: '3 mm', ppm: 4 }, 'd')).sigma.toString();
 * //=> '1/200'
 * ```
 */
export function measuredDistance<T>(
  U: UncertainArithmetic<T>,
  reading: Numeric<T>,
  sigma: LengthSigma<T>,
  name: string,
  unit: LengthUnit = 'm',
): Uncertain<T> {
  checkArithmetic(U, 'measuredDistance');
  const where = 'measuredDistance(U, reading, sigma, name)';
  checkU(U, where);
  readName(name, where);
  const m = lengthToMetres(U.base, reading as Numeric<T>, unit);
  return measured(U, m, lengthSigmaOf(U, reading, sigma, m, where, unit), name);
}

/** σ of a distance (in metres, whose value is `metres`) by the readings' one rule, as `where`. */
function lengthSigmaOf<T>(
  U: UncertainArithmetic<T>,
  reading: unknown,
  sigma: LengthSigma<T>,
  metres: T,
  where: string,
  unit: LengthUnit,
): T {
  checkU(U, where);
  // A bare σ is in `unit`; a reading that names its own unit asks for a σ that names one too.
  const bare = (x: unknown): boolean =>
    typeof x === 'number' || (typeof x === 'string' && lengthTextParts(x, where) === undefined);
  if (
    lengthTextParts(reading, where) !== undefined &&
    (bare(sigma) ||
      (typeof sigma === 'object' && sigma !== null && 'constant' in sigma && bare(sigma.constant)))
  )
    throw new QuadspreadError(
      'INVALID_SIGMA',
      where,
      `the reading ${show(reading)} names its unit: give σ with a unit too (such as '3 mm')`,
    );
  // σ is in the unit of the reading: read it there, then into metres.
  const B = U.base;
  const inUnit = B.div(metres, lengthToMetres(B, 1, unit));
  const s = rewhere(where, () =>
    lengthSigma(B, sigma as LengthSigma<T>, unit, inUnit as Numeric<T>),
  );
  return lengthToMetres(B, s as Numeric<T>, unit);
}

/** Runs a σ reader, its errors said as INVALID_SIGMA of `where`. */
function rewhere<R>(where: string, f: () => R): R {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    const m = /^quadspread [A-Z_]+: [^:]*: (.*)$/s.exec(e.message);
    throw new QuadspreadError('INVALID_SIGMA', where, m ? m[1]! : e.message);
  }
}

/** σ of an angle in degrees by the readings' one rule, as `where`. */
function angleSigmaOf<T>(U: UncertainArithmetic<T>, sigma: Numeric<T>, where: string): T {
  return rewhere(where, () => angleSigma(U.base, sigma));
}

/**
 * A measured distance as a quadrance Q = d² in square metres, dQ/dd = 2d.
 *
 * @param U the uncertain arithmetic
 * @param reading the distance in `unit`, or text with its own unit
 * @param sigma its standard uncertainty: a number in the unit of the reading, text with its
 *   own unit (`'5 mm'`) or `{ constant, ppm }`, as {@link measuredDistance}
 * @param name the input's name (the input is the distance in metres)
 * @param unit the unit of a bare-number reading and σ (default `'m'`)
 * @returns the quadrance in m², with its gradient
 * @throws {QuadspreadError} as {@link measuredDistance}.
 * @example
 * ```ts
 * import { uncertain, rational, measuredQuadrance, budget } from 'quadspread';
 * const U = uncertain(rational);
 * const Q = measuredQuadrance(U, 50, '5 mm', 'd'); // u(Q) = 2·50·0.005 = 0.5 m²
 * [rational.toString(Q.value), budget(U, Q).sigma.toString()];
 * //=> ['2500', '1/2']
 * ```
 */
export function measuredQuadrance<T>(
  U: UncertainArithmetic<T>,
  reading: Numeric<T>,
  sigma: LengthSigma<T>,
  name: string,
  unit: LengthUnit = 'm',
): Uncertain<T> {
  checkArithmetic(U, 'measuredQuadrance');
  const d = measuredDistance(U, reading, sigma, name, unit);
  return U.mul(d, d);
}

/**
 * A measured percent grade p as a spread s = p²/(10⁴ + p²) (value by `spreadFromGrade`,
 * exact), with ds/dp = 2·10⁴·p/(10⁴ + p²)² per percent (derived from s).
 *
 * @param U the uncertain arithmetic
 * @param percent the grade in percent (100 % = 45°)
 * @param sigmaPercent its standard uncertainty in percent, ≥ 0
 * @param name the input's name (the input is the grade in percent)
 * @returns the spread of the slope, with its gradient
 * @throws {QuadspreadError} as `spreadFromGrade` and `measured`.
 * @example
 * ```ts
 * import { uncertain, rational, measuredGrade, budget } from 'quadspread';
 * const U = uncertain(rational);
 * const s = measuredGrade(U, 100, '0.5', 'g'); // ds/dp = 2·10⁴·100/(2·10⁴)² = 1/200
 * [rational.toString(s.value), budget(U, s).sigma.toString()];
 * //=> ['1/2', '1/400']
 * ```
 */
export function measuredGrade<T>(
  U: UncertainArithmetic<T>,
  percent: Numeric<T>,
  sigmaPercent: Numeric<T>,
  name: string,
): Uncertain<T> {
  checkArithmetic(U, 'measuredGrade');
  const B = U.base;
  const p = measured(U, percent, sigmaPercent, name);
  const s = spreadFromGrade(B, p.value);
  const t = B.from(10000);
  const den = B.add(t, B.mul(p.value, p.value));
  // s = p²/(10⁴ + p²) ⇒ ds/dp = 2·10⁴·p/(10⁴ + p²)²
  return withDerivative(U, p, s, B.div(B.mul(B.mul(B.from(2), t), p.value), B.mul(den, den)));
}
