/**
 * Road and railway design-check helpers: minimum radius, cant, transition length, stopping sight
 * distance, sight-line offset and the vertical curve length a sight distance needs. Every
 * constant is an input; the defaults are labelled examples, not a standard's values.
 *
 * @module alignment
 */
import { show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { finiteResult, readNumber } from '../geometry/validate.js';
import { readLength, readObject, root } from './internal.js';

/** The unit system of a design check: SI (metres, km/h) or US customary (feet, mph). */
export type DesignUnits = 'metric' | 'us';

function units(x: unknown, where: string): DesignUnits {
  if (x === undefined || x === 'metric') return 'metric';
  if (x === 'us') return 'us';
  throw invalidArgument(`${where}.units`, `${show(x)} is not 'metric' (km/h, m) or 'us' (mph, ft)`);
}

/** v in length units per second from a speed in km/h (→ m/s) or mph (→ ft/s): exact factors 1/3.6 and 5280/3600. */
function perSecond<T>(A: Arithmetic<T>, V: T, u: DesignUnits): T {
  return u === 'metric' ? A.div(V, A.from('3.6')) : A.div(A.mul(V, A.from(5280)), A.from(3600));
}

const num = <T>(
  A: Arithmetic<T>,
  o: Record<string, unknown>,
  key: string,
  where: string,
  fallback?: Numeric<T>,
): T => {
  const x = o[key] ?? fallback;
  if (x === undefined) throw invalidArgument(`${where}.${key}`, 'is missing');
  return readNumber(A, x as Numeric<T>, `${where}.${key}`);
};

/** Standard gravity, 9.80665 m/s² (CGPM 1901), or in ft/s² (÷ 0.3048). */
const gravity = <T>(A: Arithmetic<T>, u: DesignUnits): T =>
  u === 'metric' ? A.from('9.80665') : A.div(A.from('9.80665'), A.from('0.3048'));

/**
 * Minimum radius of a road curve for a design speed, superelevation e and side friction f
 * (point-mass formula): R = v²/(g·(e + f)) (AASHTO, *A Policy on Geometric Design of Highways and
 * Streets*, 2018, §3.3, the basic curve equation — from memory; it is the balance of forces on a
 * vehicle on a banked curve). e and f are ratios (0.08, not 8 %); take them from your standard.
 * Exact in `rational` (standard gravity 9.80665 m/s² unless `gravity` is given).
 *
 * @param A the arithmetic
 * @param input `{ speed, superelevation, sideFriction, units?, gravity? }`: speed in km/h
 *   (`units: 'metric'`, the default; radius in m) or mph (`'us'`; radius in ft)
 * @returns the minimum radius
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing value, a speed ≤ 0 or e + f ≤ 0; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, minimumRadius } from 'quadspread';
 * // 100 km/h, e = 0.08, f = 0.12 (example values)
 * minimumRadius(float, { speed: 100, superelevation: 0.08, sideFriction: 0.12 }).toFixed(1);
 * //=> '393.4'
 * ```
 */
export function minimumRadius<T>(
  A: Arithmetic<T>,
  input: {
    readonly speed: Numeric<T>;
    readonly superelevation: Numeric<T>;
    readonly sideFriction: Numeric<T>;
    readonly units?: DesignUnits;
    readonly gravity?: Numeric<T>;
  },
): T {
  checkArithmetic(A, 'minimumRadius');
  const where = 'minimumRadius(A, input)';
  const o = readObject(input, where, 'an object { speed, superelevation, sideFriction }');
  const u = units(o.units, where);
  const V = readLength(A, o.speed, `${where}.speed`, true);
  const ef = A.add(num(A, o, 'superelevation', where), num(A, o, 'sideFriction', where));
  if (A.sign(ef) <= 0)
    throw invalidArgument(`${where}.superelevation`, `e + f = ${A.toString(ef)} is not positive`);
  const g =
    o.gravity === undefined ? gravity(A, u) : readLength(A, o.gravity, `${where}.gravity`, true);
  const v = perSecond(A, V, u);
  return A.div(A.mul(v, v), A.mul(g, ef));
}

/**
 * Equilibrium cant of a railway curve, E = G·v²/(g·R) (the cant at which the resultant of weight
 * and centripetal force is square to the plane of the rails; common practice, derived), and the
 * cant deficiency E − Ea for an applied cant Ea. G is the distance between the rail centres — not
 * the nominal gauge: about 1500 mm for standard gauge (an example default; use your standard's
 * value). With V in km/h and R in m, E[mm] ≈ 11.8·V²/R for G = 1500 mm. Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `{ speed, radius, railCentres?, appliedCant?, gravity? }`: speed km/h, radius m,
 *   rail centres and cants in mm (default rail centres 1500, an example)
 * @returns `{ equilibrium, deficiency }` in mm (`deficiency` when `appliedCant` is given; negative
 *   is a cant excess)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a speed, radius or rail-centre distance ≤ 0; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, railCant } from 'quadspread';
 * const c = railCant(float, { speed: 120, radius: 1200, appliedCant: 100 });
 * [c.equilibrium.toFixed(1), c.deficiency!.toFixed(1)];
 * //=> ['141.6', '41.6']
 * ```
 */
export function railCant<T>(
  A: Arithmetic<T>,
  input: {
    readonly speed: Numeric<T>;
    readonly radius: Numeric<T>;
    readonly railCentres?: Numeric<T>;
    readonly appliedCant?: Numeric<T>;
    readonly gravity?: Numeric<T>;
  },
): { equilibrium: T; deficiency?: T } {
  checkArithmetic(A, 'railCant');
  const where = 'railCant(A, input)';
  const o = readObject(input, where, 'an object { speed, radius }');
  const v = perSecond(A, readLength(A, o.speed, `${where}.speed`, true), 'metric');
  const R = readLength(A, o.radius, `${where}.radius`, true);
  const G = readLength(A, o.railCentres ?? 1500, `${where}.railCentres`, true);
  const g =
    o.gravity === undefined
      ? gravity(A, 'metric')
      : readLength(A, o.gravity, `${where}.gravity`, true);
  const equilibrium = A.div(A.mul(G, A.mul(v, v)), A.mul(g, R));
  if (o.appliedCant === undefined) return { equilibrium };
  return {
    equilibrium,
    deficiency: finiteResult(A.sub(equilibrium, num(A, o, 'appliedCant', where)), where),
  };
}

/**
 * Length of a transition, the longest of those asked for: from the rate of change of cant,
 * L = v·E/(dE/dt) (cant E in mm, rate in mm/s; common practice); from the rate of change of
 * cant deficiency the same way; and from the rate of change of lateral acceleration,
 * L = v³/(R·c) (Shortt's formula: W. H. Shortt, "A practical method for improvement of existing
 * railroad curves", Minutes of Proceedings of the ICE, 1909 — from memory), c in m/s³. Speeds in
 * km/h, lengths in m. The limits (rates, c) are your standard's: none is assumed.
 *
 * @param A the arithmetic
 * @param input `{ speed, cant?, cantRate?, deficiency?, deficiencyRate?, radius?, jerk? }`: give
 *   at least one pair (cant and cantRate; deficiency and deficiencyRate; radius and jerk)
 * @returns `{ length, byCant?, byDeficiency?, byJerk? }` in m
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when no pair is given, or a rate, radius or speed ≤ 0; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, transitionLength } from 'quadspread';
 * // 120 km/h, 100 mm cant at 35 mm/s, R 1200 m at 0.3 m/s³ (example limits)
 * const t = transitionLength(float, { speed: 120, cant: 100, cantRate: 35, radius: 1200, jerk: 0.3 });
 * [t.byCant!.toFixed(1), t.byJerk!.toFixed(1), t.length.toFixed(1)];
 * //=> ['95.2', '102.9', '102.9']
 * ```
 */
export function transitionLength<T>(
  A: Arithmetic<T>,
  input: {
    readonly speed: Numeric<T>;
    readonly cant?: Numeric<T>;
    readonly cantRate?: Numeric<T>;
    readonly deficiency?: Numeric<T>;
    readonly deficiencyRate?: Numeric<T>;
    readonly radius?: Numeric<T>;
    readonly jerk?: Numeric<T>;
  },
): { length: T; byCant?: T; byDeficiency?: T; byJerk?: T } {
  checkArithmetic(A, 'transitionLength');
  const where = 'transitionLength(A, input)';
  const o = readObject(input, where, 'an object { speed, … }');
  const v = perSecond(A, readLength(A, o.speed, `${where}.speed`, true), 'metric');
  const out: { length: T; byCant?: T; byDeficiency?: T; byJerk?: T } = { length: A.zero };
  if (o.cant !== undefined || o.cantRate !== undefined) {
    // L = v·E/(dE/dt): E/1000 m of cant at rate/1000 m/s.
    out.byCant = A.div(
      A.mul(v, readLength(A, o.cant, `${where}.cant`)),
      readLength(A, o.cantRate, `${where}.cantRate`, true),
    );
  }
  if (o.deficiency !== undefined || o.deficiencyRate !== undefined) {
    out.byDeficiency = A.div(
      A.mul(v, readLength(A, o.deficiency, `${where}.deficiency`)),
      readLength(A, o.deficiencyRate, `${where}.deficiencyRate`, true),
    );
  }
  if (o.radius !== undefined || o.jerk !== undefined) {
    const R = readLength(A, o.radius, `${where}.radius`, true);
    out.byJerk = A.div(
      A.mul(v, A.mul(v, v)),
      A.mul(R, readLength(A, o.jerk, `${where}.jerk`, true)),
    );
  }
  const all = [out.byCant, out.byDeficiency, out.byJerk].filter((x): x is T => x !== undefined);
  if (all.length === 0)
    throw invalidArgument(
      where,
      'give cant and cantRate, deficiency and deficiencyRate, or radius and jerk',
    );
  out.length = all.reduce((a, b) => (A.cmp(a, b) >= 0 ? a : b));
  return out;
}

/** Example constants of the stopping-sight-distance formula, by units. */
const SSD = {
  // Montana DOT Road Design Manual, Appendix K: SSD = 1.47·V·t + V²/(30((a/32.2) ± G)), V mph, ft.
  us: { brake: '1.47', braking: '30', g: '32.2' },
  // The metric form d = 0.278·V·t + V²/(254((a/9.81) ± G)), V km/h, m (AASHTO 2018, from memory).
  metric: { brake: '0.278', braking: '254', g: '9.81' },
};

/**
 * Stopping sight distance, SSD = k1·V·t + V²/(k2·(a/g + G)) with the grade G signed, + uphill
 * (Montana DOT, *Road Design Manual*, Appendix K, which writes G for a downgrade as −G). The
 * constants are inputs with labelled example defaults: in US units k1 = 1.47, k2 = 30,
 * g = 32.2 (V mph, t s, a ft/s², SSD ft: the source's rounded constants), in metric k1 = 0.278,
 * k2 = 254, g = 9.81 (V km/h, a m/s², SSD m; AASHTO 2018, from memory). Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `{ speed, reactionTime, deceleration, grade?, units?, constants? }`; `grade` a ratio
 *   (−0.05 for a 5 % downgrade; default 0); `constants` `{ brake, braking, g }` override the examples
 * @returns the stopping sight distance, in m or ft
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a speed or time < 0, or a/g + G ≤ 0 (no stop); `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, stoppingSightDistance } from 'quadspread';
 * // Montana DOT Road Design Manual, Appendix K: 60 mph, 2.5 s, 11.2 ft/s², 5 % downgrade
 * stoppingSightDistance(float, { speed: 60, reactionTime: 2.5, deceleration: 11.2, grade: -0.05, units: 'us' }).toFixed(1);
 * //=> '623.4'
 * ```
 */
export function stoppingSightDistance<T>(
  A: Arithmetic<T>,
  input: {
    readonly speed: Numeric<T>;
    readonly reactionTime: Numeric<T>;
    readonly deceleration: Numeric<T>;
    readonly grade?: Numeric<T>;
    readonly units?: DesignUnits;
    readonly constants?: {
      readonly brake?: Numeric<T>;
      readonly braking?: Numeric<T>;
      readonly g?: Numeric<T>;
    };
  },
): T {
  checkArithmetic(A, 'stoppingSightDistance');
  const where = 'stoppingSightDistance(A, input)';
  const o = readObject(input, where, 'an object { speed, reactionTime, deceleration }');
  const u = units(o.units, where);
  const c =
    o.constants === undefined
      ? {}
      : readObject(o.constants, `${where}.constants`, 'an object { brake, braking, g }');
  const V = readLength(A, o.speed, `${where}.speed`);
  const t = readLength(A, o.reactionTime, `${where}.reactionTime`);
  const a = readLength(A, o.deceleration, `${where}.deceleration`, true);
  const G = o.grade === undefined ? A.zero : num(A, o, 'grade', where);
  const k1 = num(A, c, 'brake', `${where}.constants`, SSD[u].brake);
  const k2 = num(A, c, 'braking', `${where}.constants`, SSD[u].braking);
  const g = num(A, c, 'g', `${where}.constants`, SSD[u].g);
  const f = A.add(A.div(a, g), G);
  if (A.sign(f) <= 0)
    throw invalidArgument(
      `${where}.grade`,
      `a/g + G = ${A.toString(f)} is not positive: the vehicle cannot stop on this grade`,
    );
  return finiteResult(A.add(A.mul(k1, A.mul(V, t)), A.div(A.mul(V, V), A.mul(k2, f))), where);
}

/**
 * The clearance needed inside a horizontal curve for a sight distance S measured along it:
 * M = R(1 − cos(S/(2R))) (Montana DOT, *Road Design Manual*, Appendix K, written there as
 * R(1 − cos(28.65·S/R)) in degrees). For S up to the curve's length. Needs an angle: in
 * `rational` within the transcendental tolerance.
 *
 * @param A the arithmetic
 * @param input `{ radius, sightDistance }` (same unit)
 * @returns the middle ordinate M from the centre of the inside lane to the obstruction
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a radius ≤ 0, a negative distance, or S > πR; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, sightLineOffset } from 'quadspread';
 * sightLineOffset(float, { radius: 1400, sightDistance: 570 }).toFixed(2);
 * //=> '28.91'
 * ```
 */
export function sightLineOffset<T>(
  A: Arithmetic<T>,
  input: { readonly radius: Numeric<T>; readonly sightDistance: Numeric<T> },
): T {
  checkArithmetic(A, 'sightLineOffset');
  const where = 'sightLineOffset(A, input)';
  const o = readObject(input, where, 'an object { radius, sightDistance }');
  const R = readLength(A, o.radius, `${where}.radius`, true);
  const S = readLength(A, o.sightDistance, `${where}.sightDistance`);
  const half = A.div(S, A.mul(A.from(2), R));
  if (A.cmp(half, A.div(A.pi, A.from(2))) > 0)
    throw invalidArgument(
      `${where}.sightDistance`,
      `${A.toString(S)} is longer than half the circle`,
    );
  return finiteResult(A.mul(R, A.sub(A.one, A.cos(half))), where);
}

/**
 * The length of vertical curve a sight distance S needs for an algebraic grade difference A
 * (percent). Crest (AASHTO 2018, §3.4.6 — from memory; the passing-sight form is Montana DOT,
 * *Road Design Manual*, Appendix K): L = A·S²/(200(√h1 + √h2)²) when S < L, else
 * L = 2S − 200(√h1 + √h2)²/A, with h1 the eye and h2 the object height. Sag, headlight sight
 * distance (AASHTO 2018, from memory): L = A·S²/(200(h + S·tan β)) when S < L, else
 * L = 2S − 200(h + S·tan β)/A, with h the headlight height and β the upward spread of the beam.
 * Heights and angle are inputs; the defaults are US examples (h1 = 3.5 ft, h2 = 2 ft; h = 2 ft,
 * β = 1°). A result ≤ 0 means no curve is needed for sight: 0 is returned.
 *
 * @param A the arithmetic
 * @param input `{ sightDistance, gradeChange, kind, eyeHeight?, objectHeight?, headlightHeight?, beamAngle? }`;
 *   `gradeChange` |g2 − g1| in percent; `kind` `'crest'` or `'sag'`; `beamAngle` in degrees
 * @returns `{ length, longerThanSight }`: the length, and which case applied (S < L)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a bad kind, a distance or grade change ≤ 0, negative heights; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, sightCurveLength } from 'quadspread';
 * // Montana DOT, Appendix K: passing sight on a crest, S = 1000 ft, A = 2, h1 = h2 = 3.5 ft
 * const r = sightCurveLength(rational, { sightDistance: 1000, gradeChange: 2, kind: 'crest', eyeHeight: 3.5, objectHeight: 3.5 });
 * [rational.toString(r.length), r.longerThanSight];
 * //=> ['600', false]
 * ```
 */
export function sightCurveLength<T>(
  A: Arithmetic<T>,
  input: {
    readonly sightDistance: Numeric<T>;
    readonly gradeChange: Numeric<T>;
    readonly kind: 'crest' | 'sag';
    readonly eyeHeight?: Numeric<T>;
    readonly objectHeight?: Numeric<T>;
    readonly headlightHeight?: Numeric<T>;
    readonly beamAngle?: Numeric<T>;
  },
): { length: T; longerThanSight: boolean } {
  checkArithmetic(A, 'sightCurveLength');
  const where = 'sightCurveLength(A, input)';
  const o = readObject(input, where, 'an object { sightDistance, gradeChange, kind }');
  if (o.kind !== 'crest' && o.kind !== 'sag')
    throw invalidArgument(`${where}.kind`, `${show(o.kind)} is not 'crest' or 'sag'`);
  const S = readLength(A, o.sightDistance, `${where}.sightDistance`, true);
  const dg = A.abs(readNumber(A, o.gradeChange as Numeric<T>, `${where}.gradeChange`));
  if (A.isZero(dg)) throw invalidArgument(`${where}.gradeChange`, 'is zero: no vertical curve');
  const two00 = A.from(200);
  let k: T; // the denominator term: (√h1 + √h2)², or h + S·tan β
  if (o.kind === 'crest') {
    const h1 = readLength(A, o.eyeHeight ?? '3.5', `${where}.eyeHeight`);
    const h2 = readLength(A, o.objectHeight ?? 2, `${where}.objectHeight`);
    // (√h1 + √h2)² = h1 + h2 + 2√(h1·h2)
    k = A.add(A.add(h1, h2), A.mul(A.from(2), root(A, A.mul(h1, h2), where)));
  } else {
    const h = readLength(A, o.headlightHeight ?? 2, `${where}.headlightHeight`);
    const beta = A.div(
      A.mul(readNumber(A, (o.beamAngle ?? 1) as Numeric<T>, `${where}.beamAngle`), A.pi),
      A.from(180),
    );
    k = A.add(h, A.mul(S, A.div(A.sin(beta), A.cos(beta))));
  }
  if (A.sign(k) <= 0) throw invalidArgument(where, 'the heights are zero');
  const long = A.div(A.mul(dg, A.mul(S, S)), A.mul(two00, k));
  if (A.cmp(long, S) > 0) return { length: long, longerThanSight: true };
  const short = A.sub(A.mul(A.from(2), S), A.div(A.mul(two00, k), dg));
  return {
    length: A.sign(finiteResult(short, where)) > 0 ? short : A.zero,
    longerThanSight: false,
  };
}
