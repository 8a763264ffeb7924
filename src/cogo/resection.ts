/**
 * Three-point resection by Tienstra's formula, with the danger-circle refusal.
 *
 * @module cogo
 */
import {
  QuadspreadError,
  show,
  invalidArgument,
  invalidAngle,
  coincidentPoints,
  noRealSolution,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { angleToDegrees } from '../readings/angle.js';
import { sinCosDegrees } from '../readings/trig.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { readArray, readPoint } from './internal.js';
import type { PointInput } from './internal.js';

/**
 * Default danger-circle tolerance of {@link resection}: the station is refused when
 * |Q(O, S) − R²| / R² is below 1/50, where O and R² are the centre and squared radius of
 * the circle through the control points and S is the station. That is a station within
 * about 1 % of the radius of the circle.
 *
 * @example
 * ```ts
 * import { DANGER_CIRCLE_TOLERANCE } from 'quadspread';
 * DANGER_CIRCLE_TOLERANCE;
 * //=> '1/50'
 * ```
 */
export const DANGER_CIRCLE_TOLERANCE = '1/50';

/** Input of {@link resection}. */
export interface ResectionInput<T> {
  /** The three control points `{ x: east, y: north }`. */
  readonly control: readonly [PointInput<T>, PointInput<T>, PointInput<T>];
  /**
   * `[a12, a23]`: the horizontal angles at the station, measured clockwise from the
   * direction to P1 to the direction to P2, and from P2 to P3 (degrees or DMS text, each in
   * [0°, 360°)).
   */
  readonly angles: readonly [Numeric<T>, Numeric<T>];
  /** Danger-circle tolerance (see {@link DANGER_CIRCLE_TOLERANCE}); 0 refuses only a station exactly on the circle. */
  readonly dangerTolerance?: Numeric<T>;
}

/** What {@link resection} returns. */
export interface Resection<T> {
  /** The station `{ x: east, y: north }`. */
  readonly station: Point<T>;
  /**
   * |Q(O, S) − R²| / R²: how far the station is from the danger circle, relative to its
   * squared radius (0 on the circle). Small values mean a weak fix.
   */
  readonly dangerRatio: T;
  /** The circle through the control points: centre and quadrance (squared radius). */
  readonly circle: { readonly center: Point<T>; readonly quadrance: T };
}

/** The largest coordinate size {@link resection} takes. */
const MAX_COORDINATE = '1e100';
/** The smallest non-zero coordinate size {@link resection} takes. */
const MIN_COORDINATE = '1e-100';

/**
 * Three-point resection: the station from which the control points P1, P2, P3 are seen
 * at the clockwise horizontal angles a12 (P1 → P2) and a23 (P2 → P3).
 *
 * Coordinates are x = east, y = north; angles are measured clockwise, as read on a
 * horizontal circle graduated clockwise. Uses Tienstra's formula (after J. M. Tienstra;
 * as given e.g. in Ghilani & Wolf, *Elementary Surveying*, resection section, from
 * memory): S = (K1·P1 + K2·P2 + K3·P3)/(K1 + K2 + K3) with Kᵢ = 1/(cot Aᵢ − cot αᵢ), Aᵢ the
 * angle of the control triangle at Pᵢ and αᵢ the observed angle at S subtending the side
 * opposite Pᵢ (α1 = a23, α2 = 360° − a12 − a23, α3 = a12), both taken clockwise so that
 * the formula holds for any station and either orientation of the triangle (checked on
 * synthetic data in the tests).
 *
 * The cotangents of the control triangle are exact (dot over cross products); those of
 * the observed angles come from the readings' `sinCosDegrees`, so in `rational` the
 * station is within the transcendental tolerance (1e-40 relative) times the geometry's
 * amplification, which grows as the station nears the danger circle.
 *
 * **Danger circle.** On the circle through the three control points every station sees
 * the same angles, so the station is undetermined; near it the fix is weak. The station
 * is refused with `DANGER_CIRCLE` when |Q(O, S) − R²| / R² < `dangerTolerance`
 * (default {@link DANGER_CIRCLE_TOLERANCE} = 1/50).
 *
 * A computational aid: check independently (observe a fourth point where you can); setting
 * out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ control: [P1, P2, P3], angles: [a12, a23], dangerTolerance? }`
 * @returns `{ station, dangerRatio, circle }`
 * @throws {QuadspreadError} `DANGER_CIRCLE` for a station on or near the circle through
 * the control points; `COLLINEAR_POINTS` / `COINCIDENT_POINTS` for control points that fix
 * no circle; `INVALID_ANGLE` for an angle that does not parse or is outside [0°, 360°);
 * `NO_REAL_SOLUTION` when no station sees the control points at the given clockwise angles
 * (Tienstra's formula cannot tell an angle from the angle + 180°, so the one candidate it
 * gives is checked against the observed angles); `INVALID_ARGUMENT` for a malformed input,
 * a negative tolerance, or a control coordinate larger than 1e100 or non-zero and smaller
 * than 1e-100 in size.
 * @example
 * ```ts
 * import { rational, resection } from 'quadspread';
 * // From the station, P1 lies due north, P2 due east and P3 due south.
 * const r = resection(rational, { control: [{ x: 0, y: 100 }, { x: 100, y: 0 }, { x: 0, y: -50 }], angles: [90, `90°00'00"`] });
 * [rational.toString(r.station.x), rational.toString(r.station.y)];
 * //=> ['0', '0']
 * ```
 */
export function resection<T>(A: Arithmetic<T, boolean>, input: ResectionInput<T>): Resection<T> {
  checkArithmetic(A, 'resection');
  const where = 'resection(A, { control, angles })';
  expectObject(input, where, '{ control, angles }');
  const ctl = readArray<PointInput<T>>(input.control, `${where} control`);
  if (ctl.length !== 3)
    throw invalidArgument(`${where} control`, `three control points are needed, got ${ctl.length}`);
  const ang = readArray<Numeric<T>>(input.angles, `${where} angles`);
  if (ang.length !== 2)
    throw invalidArgument(`${where} angles`, `two angles [a12, a23] are needed, got ${ang.length}`);
  const P = ctl.map((p, i) => readPoint(A, p, `${where} control[${i}]`)) as [
    Point<T>,
    Point<T>,
    Point<T>,
  ];
  // Survey coordinates lie far inside ±1e100 and are zero or larger than 1e-100 in size: beyond
  // that, exact arithmetic would carry hundreds of digits through Tienstra's formula for no
  // meaningful station (a control point at 1e999 took seconds in rational).
  const big = A.from(MAX_COORDINATE);
  const small = A.from(MIN_COORDINATE);
  P.forEach((p, i) => {
    for (const [axis, v] of [
      ['x', p.x],
      ['y', p.y],
    ] as const) {
      const m = A.abs(v);
      if (A.cmp(m, big) > 0 || (A.sign(v) !== 0 && A.cmp(m, small) < 0))
        throw invalidArgument(
          `${where} control[${i}].${axis}`,
          `${A.toString(v).slice(0, 40)} is outside the range of survey coordinates (zero, or 1e-100 to 1e100 in size)`,
        );
    }
  });
  const full = A.from(360);
  const readAngle = (a: Numeric<T>, name: string): T => {
    const d = angleToDegrees(A, a);
    if (A.sign(d) < 0 || A.cmp(d, full) >= 0)
      throw invalidAngle(`${where} ${name}`, `${show(a)} is not a clockwise angle in [0°, 360°)`);
    return d;
  };
  const a12 = readAngle(ang[0]!, 'angles[0] (a12)');
  const a23 = readAngle(ang[1]!, 'angles[1] (a23)');
  const tol = readNumber(
    A,
    input.dangerTolerance ?? DANGER_CIRCLE_TOLERANCE,
    where,
    ' dangerTolerance',
  );
  if (A.sign(tol) < 0)
    throw invalidArgument(`${where} dangerTolerance`, `${A.toString(tol)} is negative`);

  for (let i = 0; i < 3; i++) {
    const p = P[i]!;
    const q = P[(i + 1) % 3]!;
    if (A.eq(p.x, q.x) && A.eq(p.y, q.y)) {
      throw coincidentPoints(
        `${where} control`,
        `control[${i}] and control[${(i + 1) % 3}] are the same point`,
      );
    }
  }
  // Cotangent of the clockwise angle at V from the direction to U to the direction to W:
  // dot/(−cross) of (U − V, W − V) with cross = uₓw_y − u_yw_x (x = east, y = north).
  const cotAt = (V: Point<T>, U: Point<T>, W: Point<T>): T => {
    const ux = A.sub(U.x, V.x);
    const uy = A.sub(U.y, V.y);
    const wx = A.sub(W.x, V.x);
    const wy = A.sub(W.y, V.y);
    const cross = A.sub(A.mul(ux, wy), A.mul(uy, wx));
    if (A.isZero(cross))
      throw new QuadspreadError(
        'COLLINEAR_POINTS',
        `${where} control`,
        'the three control points are collinear: no circle passes through them',
      );
    return A.div(A.add(A.mul(ux, wx), A.mul(uy, wy)), A.neg(cross));
  };
  const [P1, P2, P3] = P;
  const cot = [cotAt(P1, P2, P3), cotAt(P2, P3, P1), cotAt(P3, P1, P2)];
  // Observed angles subtending the side opposite each control point.
  const obs = [
    sinCosDegrees(A, a23),
    sinCosDegrees(A, A.neg(A.add(a12, a23))),
    sinCosDegrees(A, a12),
  ];
  // Tienstra: Kᵢ = 1/(cot Aᵢ − cot αᵢ) = sin αᵢ / (cot Aᵢ·sin αᵢ − cos αᵢ). Clearing the
  // denominators Dᵢ, the weights wᵢ = sin αᵢ·Dⱼ·Dₖ give S = Σ wᵢPᵢ / Σ wᵢ.
  const D = obs.map((o, i) => A.sub(A.mul(cot[i]!, o.sin), o.cos));
  const w = [
    A.mul(obs[0]!.sin, A.mul(D[1]!, D[2]!)),
    A.mul(obs[1]!.sin, A.mul(D[0]!, D[2]!)),
    A.mul(obs[2]!.sin, A.mul(D[0]!, D[1]!)),
  ];
  const sumW = A.add(A.add(w[0]!, w[1]!), w[2]!);

  // The circle through the control points (circumcircle), exact: centre by the
  // perpendicular-bisector equations solved by Cramer's rule.
  const bx = A.sub(P2.x, P1.x);
  const by = A.sub(P2.y, P1.y);
  const cx = A.sub(P3.x, P1.x);
  const cy = A.sub(P3.y, P1.y);
  const det = A.mul(A.from(2), A.sub(A.mul(bx, cy), A.mul(by, cx)));
  const b2 = A.add(A.mul(bx, bx), A.mul(by, by));
  const c2 = A.add(A.mul(cx, cx), A.mul(cy, cy));
  const ox = A.div(A.sub(A.mul(cy, b2), A.mul(by, c2)), det);
  const oy = A.div(A.sub(A.mul(bx, c2), A.mul(cx, b2)), det);
  const center = { x: A.add(P1.x, ox), y: A.add(P1.y, oy) };
  const R2 = A.add(A.mul(ox, ox), A.mul(oy, oy));
  const circle = { center, quadrance: R2 };

  const refuse = (ratio: string): never => {
    throw new QuadspreadError(
      'DANGER_CIRCLE',
      where,
      `the station lies ${ratio === '0' ? 'on' : 'near'} the circle through the three control points (danger circle; |Q(O, S) − R²|/R² = ${ratio}, tolerance ${A.toString(tol)}): every station on that circle sees the same angles, so the fix is undetermined or weak — choose another control point`,
    );
  };
  const nearZero = A.exact ? A.isZero(sumW) : Math.abs(A.toNumber(sumW)) <= 1e-300;
  if (nearZero) refuse('0');
  const sx = A.div(A.add(A.add(A.mul(w[0]!, P1.x), A.mul(w[1]!, P2.x)), A.mul(w[2]!, P3.x)), sumW);
  const sy = A.div(A.add(A.add(A.mul(w[0]!, P1.y), A.mul(w[1]!, P2.y)), A.mul(w[2]!, P3.y)), sumW);
  const station = { x: sx, y: sy };
  const ex = A.sub(sx, center.x);
  const ey = A.sub(sy, center.y);
  const dangerRatio = A.div(A.abs(A.sub(A.add(A.mul(ex, ex), A.mul(ey, ey)), R2)), R2);
  if (A.cmp(dangerRatio, tol) < 0 || (A.isZero(tol) && A.isZero(dangerRatio)))
    refuse(A.toNumber(dangerRatio).toPrecision(3));
  // Tienstra's weights use cotangents, which cannot tell an angle from the angle + 180°: the
  // point found sees the control points at the observed angles or at those angles ± 180°.
  // Check each observed clockwise angle a against the one the station really sees, through
  // the sign of cos(seen − a) = (dot·cos a − cross·sin a)/(|u||v|), u, v the directions to
  // the two control points (x = east, y = north); negative means no station fits.
  const seenAgrees = (U: Point<T>, W: Point<T>, o: { sin: T; cos: T }): boolean => {
    const ux = A.sub(U.x, sx);
    const uy = A.sub(U.y, sy);
    const wx = A.sub(W.x, sx);
    const wy = A.sub(W.y, sy);
    const dot = A.add(A.mul(ux, wx), A.mul(uy, wy));
    const cross = A.sub(A.mul(ux, wy), A.mul(uy, wx));
    return A.sign(A.sub(A.mul(dot, o.cos), A.mul(cross, o.sin))) >= 0;
  };
  if (!seenAgrees(P1, P2, obs[2]!) || !seenAgrees(P2, P3, obs[0]!)) {
    throw noRealSolution(
      where,
      `no station sees the control points at the clockwise angles a12 = ${show(ang[0])} and a23 = ${show(ang[1])}: the only candidate sees them about 180° apart from one of these (check the angles, the order of the control points and that the angles were turned clockwise)`,
    );
  }
  return { station, dangerRatio, circle };
}
