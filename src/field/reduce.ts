/**
 * Reduction of one total-station observation: the slope distance corrected for the
 * atmosphere and the prism constant, then split by the zenith angle into a horizontal
 * distance and a height difference, with curvature and refraction and the reduction to the
 * ellipsoid and the grid when asked.
 *
 * @module field
 */
import { invalidArgument, invalidAngle, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { AngleUnit } from '../readings/angle.js';
import { sinCosDegrees } from '../readings/trig.js';
import { readNumber, finiteResult } from '../geometry/validate.js';
import {
  curvatureRefraction,
  DEFAULT_REFRACTION,
  type CurvatureOptions,
} from '../elevation/trig-heighting.js';
import { heightReductionFactor, combinedFactor } from '../geodesy/grid.js';
import { atmosphericPpm, type Atmosphere } from './atmosphere.js';
import {
  checkRecord,
  readDegrees,
  readDistance,
  readOptional,
  readUnit,
  turn,
} from './internal.js';

/** Mean Earth radius used for the height reduction when none is given, metres. */
const EARTH_RADIUS = '6371000';

/** The reduction to the ellipsoid and the grid. */
export interface GridReduction<T> {
  /** Ellipsoidal height h of the line, metres (default 0). */
  readonly height?: Numeric<T>;
  /** Earth radius R for the height factor R/(R + h), metres (default 6 371 000). */
  readonly radius?: Numeric<T>;
  /** The projection's point scale factor k on the line (default 1). */
  readonly scaleFactor?: Numeric<T>;
}

/**
 * One observation of a total station, as read: angles in degrees (numbers, DMS text) or in
 * `unit`, distances and heights in metres.
 */
export interface FieldObservation<T> {
  /** Horizontal circle reading (optional for a reduction; needed for coordinates). */
  readonly circle?: Numeric<T>;
  /** Zenith angle, in (0°, 360°): face left below 180°, face right above. */
  readonly zenith: Numeric<T>;
  /** Slope distance as displayed, ≥ 0. */
  readonly slope: Numeric<T>;
  /** Height of the instrument's trunnion axis above the station mark (default 0). */
  readonly instrumentHeight?: Numeric<T>;
  /** Height of the target (prism centre) above the far mark (default 0). */
  readonly targetHeight?: Numeric<T>;
  /** Atmospheric correction in ppm (default 0): S = S_raw·(1 + ppm·10⁻⁶) + prismConstant. */
  readonly ppm?: Numeric<T>;
  /** The weather, for a ppm by {@link atmosphericPpm} (instead of `ppm`). */
  readonly atmosphere?: Atmosphere<T>;
  /** `true` when the instrument already applied the ppm: the slope is not scaled again. */
  readonly ppmApplied?: boolean;
  /** Prism constant in metres, signed, added as given (default 0; 0 if the instrument applied it). */
  readonly prismConstant?: Numeric<T>;
  /** Curvature and refraction: `true` (k = 0.13, R = 6 371 km) or options; default none. */
  readonly curvature?: boolean | CurvatureOptions<T>;
  /** Reduce the horizontal distance to the ellipsoid and the grid (default: not). */
  readonly grid?: GridReduction<T>;
  /** Unit of numeric angles: `'deg'` (default), `'gon'`, `'mil'`, `'rad'`. */
  readonly unit?: AngleUnit;
}

/** What {@link reduceObservation} returns. */
export interface ReducedObservation<T> {
  /** The corrected slope distance S. */
  readonly slope: T;
  /** The ppm applied (0 when none, or when the instrument applied it). */
  readonly ppm: T;
  /** The zenith angle as face left, degrees in (0°, 180°]. */
  readonly zenith: T;
  /** Which face the zenith angle was read on. */
  readonly face: 'left' | 'right';
  /** The circle reading as face left (a face-right reading less 180°), in [0°, 360°), when given. */
  readonly circle?: T;
  /** S·sin z: the horizontal distance at the instrument's height. */
  readonly horizontalDistance: T;
  /** Its square, S²·sin²z. */
  readonly horizontalQuadrance: T;
  /** S·cos z: the rise of the line of sight. */
  readonly verticalComponent: T;
  /** The curvature and refraction correction (1 − k)·D²/(2R) added (0 when not asked). */
  readonly curvature: T;
  /** The coefficient of refraction k used, when curvature was asked. */
  readonly refraction?: T;
  /** Height of the far mark above the station mark: hi + S·cos z − ht + curvature. */
  readonly heightDifference: T;
  /** The horizontal distance on the ellipsoid, D·R/(R + h), when `grid` was given. */
  readonly ellipsoidDistance?: T;
  /** The grid distance, ellipsoid distance × k, when `grid` was given. */
  readonly gridDistance?: T;
  /** The combined factor R/(R + h)·k, when `grid` was given. */
  readonly combinedFactor?: T;
}

/**
 * Reduces one total-station observation.
 *
 * - Slope: S = S_raw·(1 + ppm·10⁻⁶) + prismConstant, the ppm given, computed from
 *   `atmosphere` ({@link atmosphericPpm}), or skipped when `ppmApplied`.
 * - Zenith angle z (face right, z > 180°, is read as 360° − z and its circle as c − 180°):
 *   horizontal distance D = S·sin z, rise S·cos z, and the height of the far mark above the
 *   station mark hi + S·cos z − ht (Ghilani & Wolf, *Elementary Surveying*, trigonometric
 *   levelling — from memory).
 * - Curvature and refraction only when asked: + (1 − k)·D²/(2R), the library's
 *   `curvatureRefraction` (k stated in the result).
 * - To the ellipsoid and grid only when asked: D·R/(R + h) (`heightReductionFactor`), then
 *   × k (`combinedFactor`).
 *
 * Exact in `rational` up to the zenith angle: sin z and cos z are exact at multiples of 90°
 * (and where rational: 30°, 60°, …); elsewhere they are within `rational`'s transcendental
 * tolerance (1e-40 relative), and every later step is exact. From a relative humidity the
 * ppm carries a double's rounding (see {@link atmosphericPpm}).
 *
 * @param A the arithmetic
 * @param observation the readings (see {@link FieldObservation})
 * @returns `{ slope, ppm, zenith, face, circle?, horizontalDistance, horizontalQuadrance,
 *   verticalComponent, curvature, refraction?, heightDifference, ellipsoidDistance?,
 *   gridDistance?, combinedFactor? }`
 * @throws {QuadspreadError} `INVALID_ANGLE` for a zenith outside (0°, 360°);
 *   `INVALID_ARGUMENT` for a negative slope, a missing reading, a corrected slope below 0,
 *   both `ppm` and `atmosphere`, a ppm with `ppmApplied`, or bad curvature or grid options;
 *   `INVALID_NUMBER`; `INVALID_UNIT`.
 * @example
 * ```ts
 * import { rational, reduceObservation } from 'quadspread';
 * const r = reduceObservation(rational, { zenith: 90, slope: '100.000', ppm: 10, prismConstant: '-0.0175', instrumentHeight: '1.55', targetHeight: '1.30' });
 * // 100.000 m × (1 + 10 ppm) − 0.0175 m = 99.9835 m; 1.55 m − 1.30 m = 0.25 m
 * [rational.toString(r.horizontalDistance), rational.toString(r.heightDifference)];
 * //=> ['199967/2000', '1/4']
 * ```
 */
export function reduceObservation<T>(
  A: Arithmetic<T>,
  observation: FieldObservation<T>,
): ReducedObservation<T> {
  checkArithmetic(A, 'reduceObservation');
  return reduceAt(A, observation, 'reduceObservation(observation)');
}

/** {@link reduceObservation} naming `w` in its errors. @internal */
export function reduceAt<T>(
  A: Arithmetic<T>,
  o: FieldObservation<T>,
  w: string,
  instrumentHeight?: T,
): ReducedObservation<T> {
  checkRecord(o, w);
  const unit = readUnit(o.unit, `${w}.unit`);
  const raw = readDistance(A, o.slope, `${w}.slope`);
  let ppm = A.zero;
  if (o.ppmApplied !== undefined && typeof o.ppmApplied !== 'boolean')
    throw invalidArgument(`${w}.ppmApplied`, `${show(o.ppmApplied)} is not true or false`);
  if (o.ppm !== undefined && o.atmosphere !== undefined)
    throw invalidArgument(w, 'give ppm or atmosphere, not both');
  if (o.ppmApplied === true) {
    if (o.ppm !== undefined || o.atmosphere !== undefined)
      throw invalidArgument(
        `${w}.ppmApplied`,
        'the instrument applied the ppm, so a ppm or atmosphere given too would be applied twice',
      );
  } else if (o.atmosphere !== undefined) ppm = atmosphericPpm(A, o.atmosphere).ppm;
  else if (o.ppm !== undefined) ppm = readNumber(A, o.ppm, `${w}.ppm`);
  const pc = readOptional(A, o.prismConstant, A.zero, `${w}.prismConstant`);
  // S = S_raw·(1 + ppm·10⁻⁶) + prism constant
  const S = A.add(A.add(raw, A.div(A.mul(raw, ppm), A.from(1000000))), pc);
  if (A.sign(S) < 0)
    throw invalidArgument(`${w}.slope`, `the corrected slope ${A.toString(S)} is negative`);
  let z = readDegrees(A, o.zenith, unit, `${w}.zenith`);
  if (A.sign(z) <= 0 || A.cmp(z, A.from(360)) >= 0)
    throw invalidAngle(`${w}.zenith`, `${show(o.zenith)} is outside (0°, 360°)`);
  const right = A.cmp(z, A.from(180)) > 0;
  if (right) z = A.sub(A.from(360), z);
  let circle: T | undefined;
  if (o.circle !== undefined) {
    const c = readDegrees(A, o.circle, unit, `${w}.circle`);
    circle = turn(A, right ? A.sub(c, A.from(180)) : c, `${w}.circle`);
  }
  const { sin, cos } = sinCosDegrees(A, z);
  const D = A.mul(S, sin);
  const rise = A.mul(S, cos);
  const hi =
    instrumentHeight ?? readOptional(A, o.instrumentHeight, A.zero, `${w}.instrumentHeight`);
  const ht = readOptional(A, o.targetHeight, A.zero, `${w}.targetHeight`);
  let curvature = A.zero;
  let refraction: T | undefined;
  if (o.curvature !== undefined && o.curvature !== false) {
    const opts = o.curvature === true ? {} : o.curvature;
    if (typeof opts !== 'object' || opts === null)
      throw invalidArgument(`${w}.curvature`, `${show(o.curvature)} is not true, false or options`);
    refraction = readNumber(A, opts.k ?? DEFAULT_REFRACTION, `${w}.curvature.k`);
    curvature = curvatureRefraction(A, D, opts); // (1 − k)·D²/(2R)
  }
  const dh = finiteResult(A.add(A.add(A.sub(hi, ht), rise), curvature), w);
  const r: ReducedObservation<T> = {
    slope: S,
    ppm,
    zenith: z,
    face: right ? 'right' : 'left',
    ...(circle !== undefined ? { circle } : {}),
    horizontalDistance: D,
    horizontalQuadrance: finiteResult(A.mul(D, D), w),
    verticalComponent: rise,
    curvature,
    ...(refraction !== undefined ? { refraction } : {}),
    heightDifference: dh,
  };
  if (o.grid === undefined) return r;
  checkRecord(o.grid, `${w}.grid`);
  const hf = heightReductionFactor(A, o.grid.height ?? 0, o.grid.radius ?? EARTH_RADIUS); // R/(R + h)
  const cf = combinedFactor(A, hf, o.grid.scaleFactor ?? 1); // R/(R + h)·k
  return {
    ...r,
    ellipsoidDistance: A.mul(D, hf),
    gridDistance: A.mul(D, cf),
    combinedFactor: cf,
  };
}
