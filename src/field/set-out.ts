/**
 * Setting out: the circle reading and distances to a design point from an oriented set-up,
 * and the check of a placed mark against its design point.
 *
 * @module field
 */
import { coincidentPoints, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, finiteResult } from '../geometry/validate.js';
import { curvatureRefraction, type CurvatureOptions } from '../elevation/trig-heighting.js';
import { shotFrom, type Shot, type SideShot } from './side-shot.js';
import {
  azimuthOf,
  check,
  checkRecord,
  readOptional,
  readPoint3,
  readSetup,
  readTolerance,
  root,
  turn,
  type FieldCheck,
  type Point3Input,
  type SetupInput,
} from './internal.js';

/** Options of {@link setOut}. */
export interface SetOutOptions<T> {
  /** Height of the target above the mark to be placed (default 0). */
  readonly targetHeight?: Numeric<T>;
  /** Ground distance = grid distance ÷ this combined factor (default: coordinates are ground). */
  readonly combinedFactor?: Numeric<T>;
  /** Allow for curvature and refraction in the zenith angle: `true` or options (default none). */
  readonly curvature?: boolean | CurvatureOptions<T>;
}

/** What {@link setOut} returns. */
export interface SetOut<T> {
  /** The bearing from the station to the design point, degrees in [0°, 360°). */
  readonly bearing: T;
  /** The circle reading to turn to (face left), degrees in [0°, 360°): bearing − orientation. */
  readonly circle: T;
  /** circle − the first backsight's circle, in [0°, 360°): the angle turned clockwise from it (when the set-up has backsights). */
  readonly angleFromBacksight?: T;
  /** The horizontal distance to set out on the ground. */
  readonly horizontalDistance: T;
  /** Its square. */
  readonly horizontalQuadrance: T;
  /** Height of the target above the instrument's axis, with a design level and a station level. */
  readonly heightDifference?: T;
  /** The slope distance to the target, with a design level and a station level. */
  readonly slopeDistance?: T;
  /** The zenith angle to the target, degrees in [0°, 180°], with a design level and a station level. */
  readonly zenith?: T;
}

/**
 * The setting-out data of a design point from an oriented set-up: the bearing β from the
 * coordinates, the circle reading β − orientation to turn to, the angle from the first
 * backsight, and the horizontal distance (divided by the combined factor when the
 * coordinates are on a grid). With a level on the design point and on the station, also the
 * rise of the target above the instrument's axis V = z_design + ht − (z_station + hi) (less
 * the curvature and refraction correction when asked), the slope distance √(D² + V²) and the
 * zenith angle atan2(D, V).
 *
 * Exact in `rational` when the bearing is a multiple of 45° and the distances are rational;
 * otherwise atan2 and √ are within `rational`'s tolerances (1e-40 and 1e-48 relative).
 *
 * A computational aid: setting out follows the contract's tolerances, independent checks
 * and licensed practice.
 *
 * @param A the arithmetic
 * @param setup an oriented set-up ({@link orientStation}, or written by hand)
 * @param design the design point `{ x, y, z? }`
 * @param options `targetHeight`, `combinedFactor`, `curvature`
 * @returns `{ bearing, circle, angleFromBacksight?, horizontalDistance, horizontalQuadrance,
 *   heightDifference?, slopeDistance?, zenith? }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` for a design point on the station;
 *   `INVALID_ARGUMENT` for a point without coordinates or a factor ≤ 0; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, setOut } from 'quadspread';
 * const setup = { station: { x: 0, y: 0, z: 10 }, instrumentHeight: '1.5', orientation: 90, backsights: [{ circle: 0 }] };
 * const s = setOut(rational, setup, { x: -30, y: 0, z: '10.5' }, { targetHeight: 41 });
 * [rational.toString(s.circle), rational.toString(s.horizontalDistance), rational.toString(s.slopeDistance!)];
 * //=> ['180', '30', '50']
 * ```
 */
export function setOut<T>(
  A: Arithmetic<T>,
  setup: SetupInput<T>,
  design: Point3Input<T>,
  options: SetOutOptions<T> = {},
): SetOut<T> {
  checkArithmetic(A, 'setOut');
  const w = 'setOut';
  const s = readSetup(A, setup, `${w}(setup)`);
  const p = readPoint3(A, design, `${w}(design)`);
  checkRecord(options, `${w}(options)`);
  const ht = readOptional(A, options.targetHeight, A.zero, `${w}(options).targetHeight`);
  const dx = A.sub(p.x, s.station.x);
  const dy = A.sub(p.y, s.station.y);
  if (A.isZero(dx) && A.isZero(dy))
    throw coincidentPoints(`${w}(design)`, 'the design point is the station itself');
  const bearing = azimuthOf(A, dx, dy);
  const circle = turn(A, A.sub(bearing, s.orientation), `${w}(setup).orientation`);
  let Q = finiteResult(A.add(A.mul(dx, dx), A.mul(dy, dy)), w);
  if (options.combinedFactor !== undefined) {
    const k = readNumber(A, options.combinedFactor, `${w}(options).combinedFactor`);
    if (A.sign(k) <= 0)
      throw invalidArgument(`${w}(options).combinedFactor`, `${A.toString(k)} is not positive`);
    Q = A.div(Q, A.mul(k, k)); // ground = grid ÷ combined factor
  }
  const D = root(A, Q);
  const r: SetOut<T> = {
    bearing,
    circle,
    ...(s.firstCircle !== undefined
      ? { angleFromBacksight: turn(A, A.sub(circle, s.firstCircle), w) }
      : {}),
    horizontalDistance: D,
    horizontalQuadrance: Q,
  };
  if (p.z === undefined || s.station.z === undefined) return r;
  let V = A.sub(A.add(p.z, ht), A.add(s.station.z, s.hi));
  if (options.curvature !== undefined && options.curvature !== false) {
    const opts = options.curvature === true ? {} : options.curvature;
    checkRecord(opts, `${w}(options).curvature`);
    V = A.sub(V, curvatureRefraction(A, D, opts)); // the sight rises by V − (1 − k)·D²/(2R)
  }
  V = finiteResult(V, w);
  return {
    ...r,
    heightDifference: V,
    slopeDistance: root(A, A.add(Q, A.mul(V, V))),
    zenith: zenithOf(A, D, V),
  };
}

/** The zenith angle of a sight rising V over the horizontal distance D, degrees; exact at multiples of 45°. */
function zenithOf<T>(A: Arithmetic<T>, D: T, V: T): T {
  if (A.isZero(D)) return A.from(A.sign(V) >= 0 ? 0 : 180);
  // The zenith angle is the azimuth of (D, V) read from "up": atan2(D, V).
  return azimuthOf(A, D, V);
}

/** Tolerances of {@link setOutCheck}. */
export interface SetOutTolerance<T> {
  /** Largest acceptable horizontal offset √(Δx² + Δy²), metres. */
  readonly horizontal?: Numeric<T>;
  /** Largest acceptable |cut|, metres. */
  readonly vertical?: Numeric<T>;
}

/** What {@link setOutCheck} returns. */
export interface SetOutCheck<T> {
  /** The mark as observed. */
  readonly mark: SideShot<T>;
  /** mark − design, east. */
  readonly dx: T;
  /** mark − design, north. */
  readonly dy: T;
  /** mark − design, level (when both have one). */
  readonly dz?: T;
  /** The offset along the line from the instrument, positive beyond the design point. */
  readonly along: T;
  /** The offset across it, positive to the right looking from the instrument. */
  readonly across: T;
  /** √(Δx² + Δy²). */
  readonly horizontalOffset: T;
  /** Mark level − design level: positive = cut (the ground stands above the design), when both have one. */
  readonly cut?: T;
  /** One check per tolerance given. */
  readonly checks: FieldCheck<T>[];
  /** Every check holds. */
  readonly ok: boolean;
}

/**
 * How far a placed mark is from its design point: the mark is computed from its
 * observation as {@link sideShot} computes it, then Δ = mark − design as Δx, Δy, Δz; `along`
 * = Δ·u and `across` = Δ × u (u the unit vector from the station to the design point:
 * positive beyond it and to the right looking from the instrument); `cut` = mark level −
 * design level (positive = cut).
 *
 * @param A the arithmetic
 * @param setup the oriented set-up
 * @param design the design point `{ x, y, z? }`
 * @param observation the readings to the placed mark (as for {@link sideShot})
 * @param tolerance `horizontal` and `vertical`, metres (optional)
 * @returns `{ mark, dx, dy, dz?, along, across, horizontalOffset, cut?, checks, ok }`
 * @throws {QuadspreadError} `COINCIDENT_POINTS` for a design point on the station; as
 *   {@link sideShot}.
 * @example
 * ```ts
 * import { rational, setOutCheck } from 'quadspread';
 * const setup = { station: { x: 0, y: 0, z: 0 }, orientation: 0 };
 * const c = setOutCheck(rational, setup, { x: 0, y: 20, z: 0 }, { circle: 0, zenith: 90, slope: '20.02' });
 * [rational.toString(c.along), rational.toString(c.across), rational.toString(c.cut!)];
 * //=> ['1/50', '0', '0']
 * ```
 */
export function setOutCheck<T>(
  A: Arithmetic<T>,
  setup: SetupInput<T>,
  design: Point3Input<T>,
  observation: Shot<T>,
  tolerance: SetOutTolerance<T> = {},
): SetOutCheck<T> {
  checkArithmetic(A, 'setOutCheck');
  const w = 'setOutCheck';
  const s = readSetup(A, setup, `${w}(setup)`);
  const p = readPoint3(A, design, `${w}(design)`);
  checkRecord(tolerance, `${w}(tolerance)`);
  const ux = A.sub(p.x, s.station.x);
  const uy = A.sub(p.y, s.station.y);
  if (A.isZero(ux) && A.isZero(uy))
    throw coincidentPoints(`${w}(design)`, 'the design point is the station itself');
  const mark = shotFrom(A, s, observation, `${w}(observation)`);
  const dx = A.sub(mark.x, p.x);
  const dy = A.sub(mark.y, p.y);
  const d = root(A, A.add(A.mul(ux, ux), A.mul(uy, uy)));
  const along = A.div(A.add(A.mul(dx, ux), A.mul(dy, uy)), d); // Δ·u
  const across = A.div(A.sub(A.mul(dx, uy), A.mul(dy, ux)), d); // to the right of u = (ux, uy) is (uy, −ux)
  const horizontalOffset = root(A, A.add(A.mul(dx, dx), A.mul(dy, dy)));
  const checks: FieldCheck<T>[] = [];
  check(
    A,
    checks,
    'horizontal offset',
    horizontalOffset,
    readTolerance(A, tolerance.horizontal, `${w}(tolerance).horizontal`),
  );
  const base = { mark, dx, dy, along, across, horizontalOffset };
  if (mark.z === undefined || p.z === undefined) {
    return { ...base, checks, ok: checks.every((c) => c.ok) };
  }
  const dz = A.sub(mark.z, p.z);
  check(A, checks, 'cut', dz, readTolerance(A, tolerance.vertical, `${w}(tolerance).vertical`));
  return { ...base, dz, cut: dz, checks, ok: checks.every((c) => c.ok) };
}
