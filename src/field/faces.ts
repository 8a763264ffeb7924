/**
 * Face left and face right: the mean of two pointings, the vertical index error and the
 * horizontal collimation error.
 *
 * @module field
 */
import { invalidAngle, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { AngleUnit } from '../readings/angle.js';
import { sinCosDegrees } from '../readings/trig.js';
import {
  ARCSEC,
  check,
  checkRecord,
  halfTurn,
  readDegrees,
  readTolerance,
  readUnit,
  turn,
  type FieldCheck,
} from './internal.js';

/** One pointing: horizontal circle and zenith angle readings. */
export interface Pointing<T> {
  /** Horizontal circle reading. */
  readonly circle: Numeric<T>;
  /** Zenith angle reading. */
  readonly zenith: Numeric<T>;
}

/** Options of {@link meanFaces}. */
export interface FaceOptions<T> {
  /** Largest acceptable |collimation|, arc-seconds. */
  readonly collimation?: Numeric<T>;
  /** Largest acceptable |index|, arc-seconds. */
  readonly index?: Numeric<T>;
  /** Unit of numeric angles (default `'deg'`). */
  readonly unit?: AngleUnit;
}

/** What {@link meanFaces} returns. */
export interface MeanFaces<T> {
  /** The mean circle reading (face left's sense), degrees in [0°, 360°). */
  readonly circle: T;
  /** The zenith angle freed of index error (face left's sense), degrees. */
  readonly zenith: T;
  /** The horizontal collimation error c, arc-seconds (positive: face left reads high). */
  readonly collimation: T;
  /** The vertical index error i, arc-seconds (positive: both faces read high). */
  readonly index: T;
  /** One check per tolerance given. */
  readonly checks: FieldCheck<T>[];
  /** Every check holds (true when none was asked). */
  readonly ok: boolean;
}

/**
 * The mean of a face-left and a face-right pointing to the same target:
 * - index error i = (z_L + z_R − 360°)/2; zenith z = (z_L − z_R + 360°)/2;
 * - d = (c_L − c_R + 180°) reduced to (−180°, 180°]; mean circle = c_L − d/2, reduced to
 *   [0°, 360°) (so a pair that straddles 0° averages correctly);
 * - collimation c = (d/2)·sin z.
 *
 * (Ghilani & Wolf, *Elementary Surveying*, ch. 8, instrument errors — from memory.) A face-left
 * reading is off the true direction by c/sin z + t·cot z, where t is the tilt of the trunnion
 * axis; this function has no term in cot z, so its collimation is exact only at z = 90° or
 * with no trunnion tilt. The mean circle reading is free of both either way. Exact in
 * `rational` at z = 90°; elsewhere sin z is within `rational`'s transcendental tolerance.
 *
 * @param A the arithmetic
 * @param left the face-left pointing `{ circle, zenith }` (zenith in (0°, 180°))
 * @param right the face-right pointing (zenith in (180°, 360°))
 * @param options tolerances `collimation` and `index` in arc-seconds; `unit`
 * @returns `{ circle, zenith, collimation, index, checks, ok }`
 * @throws {QuadspreadError} `INVALID_ANGLE` for a zenith on the wrong face or outside
 *   (0°, 360°); `INVALID_ARGUMENT` for a missing reading or a negative tolerance;
 *   `INVALID_NUMBER`; `INVALID_UNIT`.
 * @example
 * ```ts
 * import { rational, meanFaces } from 'quadspread';
 * const m = meanFaces(rational, { circle: `10°00'10"`, zenith: `90°00'10"` }, { circle: `189°59'50"`, zenith: `270°00'10"` }, { collimation: 20 });
 * [rational.toString(m.circle), rational.toString(m.zenith), rational.toString(m.collimation), rational.toString(m.index), m.ok];
 * //=> ['10', '90', '10', '10', true]
 * ```
 */
export function meanFaces<T>(
  A: Arithmetic<T>,
  left: Pointing<T>,
  right: Pointing<T>,
  options: FaceOptions<T> = {},
): MeanFaces<T> {
  checkArithmetic(A, 'meanFaces');
  const w = 'meanFaces';
  checkRecord(left, `${w}(left)`);
  checkRecord(right, `${w}(right)`);
  checkRecord(options, `${w}(options)`);
  const unit = readUnit(options.unit, `${w}(options).unit`);
  const cL = readDegrees(A, left.circle, unit, `${w}(left).circle`);
  const zL = readDegrees(A, left.zenith, unit, `${w}(left).zenith`);
  const cR = readDegrees(A, right.circle, unit, `${w}(right).circle`);
  const zR = readDegrees(A, right.zenith, unit, `${w}(right).zenith`);
  const half = A.from(180);
  if (A.sign(zL) <= 0 || A.cmp(zL, half) >= 0)
    throw invalidAngle(
      `${w}(left).zenith`,
      `${show(left.zenith)} is not a face-left zenith angle in (0°, 180°)`,
    );
  if (A.cmp(zR, half) <= 0 || A.cmp(zR, A.from(360)) >= 0)
    throw invalidAngle(
      `${w}(right).zenith`,
      `${show(right.zenith)} is not a face-right zenith angle in (180°, 360°)`,
    );
  const two = A.from(2);
  const full = A.from(360);
  const index = A.div(A.sub(A.add(zL, zR), full), two); // i = (zL + zR − 360°)/2
  const zenith = A.div(A.add(A.sub(zL, zR), full), two); // z = (zL − zR + 360°)/2
  const d = halfTurn(A, A.add(A.sub(cL, cR), half), `${w}(right).circle`); // cL − cR ± 180°
  const circle = turn(A, A.sub(cL, A.div(d, two)), `${w}(left).circle`);
  const { sin } = sinCosDegrees(A, zenith);
  const sec = A.from(ARCSEC);
  const collimation = A.mul(A.mul(A.div(d, two), sin), sec); // c = (d/2)·sin z
  const indexSec = A.mul(index, sec);
  const checks: FieldCheck<T>[] = [];
  check(
    A,
    checks,
    'collimation',
    collimation,
    readTolerance(A, options.collimation, `${w}(options).collimation`),
  );
  check(A, checks, 'index', indexSec, readTolerance(A, options.index, `${w}(options).index`));
  return {
    circle,
    zenith,
    collimation,
    index: indexSec,
    checks,
    ok: checks.every((c) => c.ok),
  };
}
