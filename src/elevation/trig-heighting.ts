/**
 * Trigonometric heighting: the height difference from a distance and a vertical reading,
 * with instrument and target heights, curvature and refraction, and reciprocal sights.
 *
 * @module elevation
 */
import {
  QuadspreadError,
  show,
  invalidArgument,
  verticalSight,
  negativeQuadrance,
  checkArithmetic,
} from '../errors.js';
import { checkObject } from './input.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { isSurd, type Root, type Surd } from '../geometry/surd.js';
import { finiteResult, readNumber, shownInput } from '../geometry/validate.js';
import { checkLengthUnit, METRES_PER_UNIT, type LengthUnit } from '../readings/length.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';
import { rootOps } from './roots.js';
import { approxSqrt } from '../readings/numeric.js';

/**
 * Default coefficient of refraction k = 0.13: the classical value for daytime sights
 * (common practice; Gauss's value, widely reproduced in survey textbooks — from memory).
 * @example
 * ```ts
 * import { DEFAULT_REFRACTION } from 'quadspread';
 * DEFAULT_REFRACTION;
 * //=> '0.13'
 * ```
 */
export const DEFAULT_REFRACTION = '0.13';

/**
 * Default Earth radius in metres, 6 371 000 m: the mean radius used for the usual
 * curvature constant 0.07848·D² m with D in km (Ghilani & Wolf, *Elementary Surveying*,
 * ch. 4 — from memory). GRS 80's mean radius R₁ is 6 371 008.7714 m (Moritz 2000).
 * @example
 * ```ts
 * import { DEFAULT_EARTH_RADIUS_M } from 'quadspread';
 * DEFAULT_EARTH_RADIUS_M;
 * //=> '6371000'
 * ```
 */
export const DEFAULT_EARTH_RADIUS_M = '6371000';

/** Options of the curvature and refraction correction. */
export interface CurvatureOptions<T> {
  /** Coefficient of refraction k (default {@link DEFAULT_REFRACTION}); 0 for curvature alone. */
  k?: Numeric<T>;
  /** Earth radius in `unit` (default {@link DEFAULT_EARTH_RADIUS_M} metres, converted to `unit`). */
  earthRadius?: Numeric<T>;
  /** The length unit of the distances (default `'m'`): converts the default radius. */
  unit?: LengthUnit;
}

function radius<T>(A: Arithmetic<T>, o: CurvatureOptions<T>, where: string): { k: T; R: T } {
  const k = readNumber(A, o.k ?? DEFAULT_REFRACTION, `${where}.k`);
  let R: T;
  if (o.earthRadius !== undefined) R = readNumber(A, o.earthRadius, `${where}.earthRadius`);
  else {
    const u = checkLengthUnit(o.unit ?? 'm', `${where}.unit`);
    R = A.div(A.from(DEFAULT_EARTH_RADIUS_M), A.from(METRES_PER_UNIT[u]));
  }
  if (A.sign(R) <= 0)
    throw invalidArgument(`${where}.earthRadius`, `${A.toString(R)} is not a positive radius`);
  if (A.sign(k) < 0 || A.cmp(k, A.one) >= 0)
    throw invalidArgument(`${where}.k`, `${A.toString(k)} is outside [0, 1)`);
  return { k, R };
}

/**
 * The combined curvature and refraction correction for a horizontal distance D:
 * c = (1 − k)·D²/(2R) (Ghilani & Wolf, *Elementary Surveying*, ch. 4 — from memory; with
 * R = 6371 km this is 0.07848·D² m for curvature alone and 0.0675·D² m with k = 0.14, D in
 * km). Add it to a trigonometric height difference: the Earth's curvature drops the target
 * below the instrument's horizontal, refraction bends the sight back by the fraction k.
 * Exact in `rational`.
 *
 * @param A the arithmetic
 * @param distance the horizontal distance D (≥ 0), in `options.unit`
 * @param options `k`, `earthRadius`, `unit` (see {@link CurvatureOptions})
 * @returns c in the distance's unit
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for k outside [0, 1) or a radius ≤ 0;
 *   `NEGATIVE_QUADRANCE` for a negative distance; `INVALID_UNIT`.
 * @example
 * ```ts
 * import { rational, curvatureRefraction } from 'quadspread';
 * rational.toString(curvatureRefraction(rational, 1000, { k: 0 }));
 * //=> '500/6371'
 * ```
 */
export function curvatureRefraction<T>(
  A: Arithmetic<T>,
  distance: Numeric<T>,
  options: CurvatureOptions<T> = {},
): T {
  checkArithmetic(A, 'curvatureRefraction');
  checkObject(options, 'curvatureRefraction(options)');
  const D = readNumber(A, distance, 'curvatureRefraction(distance)');
  if (A.sign(D) < 0)
    throw negativeQuadrance(
      'curvatureRefraction(distance)',
      `${shownInput(A, distance, D)} is a negative distance`,
    );
  return curvatureFromQuadrance(A, A.mul(D, D), options, 'curvatureRefraction(options)');
}

function curvatureFromQuadrance<T>(
  A: Arithmetic<T>,
  Q: T,
  options: CurvatureOptions<T>,
  where: string,
): T {
  const { k, R } = radius(A, options, where);
  return A.div(A.mul(A.sub(A.one, k), Q), A.mul(A.from(2), R)); // (1 − k)·D²/(2R)
}

/** One trigonometric sight. */
export interface TrigSight<T> {
  /** The measured distance, in one length unit: slope (along the sight) or horizontal. */
  distance: Numeric<T>;
  /** Which distance it is. */
  measured: 'slope' | 'horizontal';
  /** The vertical reading (a signed {@link VerticalReading}; a bare spread is upward). */
  vertical: VerticalInput<T>;
  /** Height of the instrument's axis above the station mark (default 0). */
  instrumentHeight?: Numeric<T>;
  /** Height of the target (reflector, sighted point) above the far mark (default 0). */
  targetHeight?: Numeric<T>;
  /** Curvature and refraction options, or `false` to leave them out (default: corrected). */
  correction?: CurvatureOptions<T> | false;
}

/** The result of {@link trigHeight}. */
export interface TrigHeight<T, E extends boolean> {
  /** Height of the far mark above the station mark: hi + V − hr + c. */
  readonly difference: Root<T, E>;
  /** V: the vertical component of the sight, S·sin α or D·tan α, signed. */
  readonly vertical: Root<T, E>;
  /** The horizontal quadrance D² of the sight. */
  readonly horizontalQuadrance: T;
  /** c = (1 − k)·D²/(2R), 0 when `correction` is `false`. */
  readonly correction: T;
}

/**
 * The height difference from a station mark to a far mark by a trigonometric sight:
 * Δh = hᵢ + V − hᵣ + (1 − k)·D²/(2R), with V = S·sin α for a slope distance S and
 * V = D·tan α for a horizontal distance D (Mahun, *Surveying* open text, trigonometric
 * levelling: elevation = H + hi + S·sin α − hr; the correction as in
 * {@link curvatureRefraction}). With the vertical spread R and its sign:
 * sin α = ±√R, tan α = ±√(R(1 − R))/(1 − R), D² = S²(1 − R).
 *
 * Exact surds in `rational` (the radicand is R or R(1 − R)); values otherwise. Give angles
 * through {@link verticalFromAngle} (say whether they are zenith or elevation angles).
 *
 * @param A the arithmetic
 * @param sight the distance, what it is, the vertical reading, instrument and target heights,
 *   and the correction options (see {@link TrigSight})
 * @returns `{ difference, vertical, horizontalQuadrance, correction }`
 * @throws {QuadspreadError} `VERTICAL_SIGHT` for a spread of 1 with a horizontal distance;
 *   `INVALID_ARGUMENT` for an unknown `measured` or bad correction options;
 *   `NEGATIVE_QUADRANCE` for a negative distance; `SPREAD_OUT_OF_RANGE`.
 * @example
 * ```ts
 * import { rational, trigHeight } from 'quadspread';
 * // slope distance 130 on a 5-12-13 sight (spread 25/169) upward, instrument 1.5, target 2
 * const r = trigHeight(rational, { distance: 130, measured: 'slope', vertical: '25/169', instrumentHeight: '1.5', targetHeight: 2, correction: false });
 * r.difference.toString();
 * //=> '99/2'
 * ```
 */
export function trigHeight<T, E extends boolean>(
  A: Arithmetic<T, E>,
  sight: TrigSight<T>,
): TrigHeight<T, E> {
  checkArithmetic(A, 'trigHeight');
  const w = 'trigHeight(sight)';
  checkObject(sight, w);
  const R = rootOps(A);
  if (sight.measured !== 'slope' && sight.measured !== 'horizontal') {
    throw invalidArgument(
      `${w}.measured`,
      `${show(sight.measured)} is not 'slope' or 'horizontal'`,
    );
  }
  const D = readNumber(A, sight.distance, `${w}.distance`);
  if (A.sign(D) < 0)
    throw negativeQuadrance(`${w}.distance`, `${A.toString(D)} is a negative distance`);
  const v = readVertical(A, sight.vertical, `${w}.vertical`);
  const s = v.spread;
  const c = A.sub(A.one, s);
  const sg = A.from(v.sign);
  let V: Root<T, E>;
  let Qh: T;
  if (sight.measured === 'slope') {
    V = R.make(A.zero, A.mul(sg, D), s); // S·sin α = ±S·√R
    Qh = finiteResult(A.mul(A.mul(D, D), c), `${w}.distance`); // D² = S²·cos²α = S²(1 − R)
  } else {
    if (A.isZero(c))
      throw verticalSight(
        `${w}.vertical`,
        'a vertical spread of 1 with a horizontal distance: the sight is plumb',
      );
    V = R.make(A.zero, A.div(A.mul(sg, D), c), A.mul(s, c)); // D·tan α = ±D·√(R(1 − R))/(1 − R)
    Qh = finiteResult(A.mul(D, D), `${w}.distance`);
  }
  if (sight.correction !== undefined && sight.correction !== false)
    checkObject(sight.correction, `${w}.correction`);
  const corr =
    sight.correction === false
      ? A.zero
      : curvatureFromQuadrance(A, Qh, sight.correction ?? {}, `${w}.correction`);
  const hi = readNumber(A, sight.instrumentHeight ?? 0, `${w}.instrumentHeight`);
  const hr = readNumber(A, sight.targetHeight ?? 0, `${w}.targetHeight`);
  const difference = R.add(V, A.add(A.sub(hi, hr), corr));
  return { difference, vertical: V, horizontalQuadrance: Qh, correction: corr };
}

/** The result of {@link reciprocalTrigHeight}. */
export interface ReciprocalTrigHeight<T, E extends boolean> {
  /** Height of B above A from the sight A → B (corrected as asked). */
  readonly forward: Root<T, E>;
  /** Height of A above B from the sight B → A. */
  readonly backward: Root<T, E>;
  /**
   * The mean height of B above A, (forward − backward)/2: curvature and refraction cancel
   * when k is the same both ways. A plain value: in `rational` the exact mean when the two
   * surds share a radicand, otherwise a rational within 1e-40 relative of the exact value
   * (two different square roots do not fit in one surd). In an uncertain arithmetic over
   * `rational` it keeps its sensitivities.
   */
  readonly mean: T;
  /** forward + backward: zero for perfect sights with no curvature and refraction (twice their correction otherwise). */
  readonly misclosure: T;
}

/**
 * A root as a plain value: a + b·√d with √d from the readings' `approxSqrt` (within 1e-48
 * relative, its last Newton step taken on d itself, so derivatives carried by an uncertain
 * arithmetic survive — rounding through text would drop them).
 */
function rootValue<T, E extends boolean>(A: Arithmetic<T, E>, r: Root<T, E>): T {
  if (!isSurd(r)) return r as T;
  const s = r as Surd<T>;
  return s.isRational() ? s.a : A.add(s.a, A.mul(s.b, approxSqrt(A, s.d)));
}

/**
 * Reciprocal trigonometric heighting: a sight from A to B and one from B to A over the same
 * line, at (nearly) the same time. Their mean (Δh_AB − Δh_BA)/2 cancels the curvature and
 * refraction correction, which is the same both ways for the same k (Ghilani & Wolf,
 * *Elementary Surveying*, ch. 4 — from memory).
 *
 * @param A the arithmetic
 * @param input `forward`: the sight A → B; `backward`: the sight B → A (each a
 *   {@link TrigSight}); the correction options apply per sight
 * @returns `{ forward, backward, mean, misclosure }`
 * @throws {QuadspreadError} as {@link trigHeight}.
 * @example
 * ```ts
 * import { rational, reciprocalTrigHeight } from 'quadspread';
 * const r = reciprocalTrigHeight(rational, {
 *   forward: { distance: 1000, measured: 'horizontal', vertical: '1/10001', instrumentHeight: '1.5', targetHeight: '1.5' },
 *   backward: { distance: 1000, measured: 'horizontal', vertical: { spread: rational.from('1/10001'), sign: -1 }, instrumentHeight: '1.5', targetHeight: '1.5' },
 * });
 * [rational.toString(r.mean), r.forward.toNumber().toFixed(4)];
 * //=> ['10', '10.0683']
 * ```
 */
export function reciprocalTrigHeight<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: { forward: TrigSight<T>; backward: TrigSight<T> },
): ReciprocalTrigHeight<T, E> {
  checkArithmetic(A, 'reciprocalTrigHeight');
  checkObject(input, 'reciprocalTrigHeight(input)');
  checkObject(input.forward, 'reciprocalTrigHeight(input).forward');
  checkObject(input.backward, 'reciprocalTrigHeight(input).backward');
  const R = rootOps(A);
  const f = trigHeight(A, input.forward).difference;
  const b = trigHeight(A, input.backward).difference;
  const two = A.from(2);
  let mean: T;
  let misclosure: T;
  try {
    mean = rootValue(A, R.div(R.sub(f, b), two));
  } catch (e) {
    if (!(e instanceof QuadspreadError) || e.code !== 'DIFFERENT_RADICANDS') throw e;
    mean = A.div(A.sub(rootValue(A, f), rootValue(A, b)), two);
  }
  try {
    misclosure = rootValue(A, R.add(f, b));
  } catch (e) {
    if (!(e instanceof QuadspreadError) || e.code !== 'DIFFERENT_RADICANDS') throw e;
    misclosure = A.add(rootValue(A, f), rootValue(A, b));
  }
  return { forward: f, backward: b, mean, misclosure };
}
