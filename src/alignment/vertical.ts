/**
 * Vertical alignment: a grade line through vertices (VIPs) joined by parabolic vertical
 * curves, symmetric or unsymmetric, and the level and grade at any chainage. Every result
 * is a rational function of the inputs, so exact in `rational`.
 *
 * @module alignment
 */
import { show, invalidArgument, QuadspreadError, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from '../geometry/validate.js';
import { readChainage, readLength, readList, readObject } from './internal.js';

/** A vertex of the grade line: its chainage (a number or station text) and level. */
export interface ProfilePointInput<T> {
  /** Chainage, e.g. `5650` or `'56+50.00'`. */
  readonly chainage: Numeric<T>;
  /** Level (elevation), in the unit of the line. */
  readonly level: Numeric<T>;
}

/**
 * A vertical curve at a VIP: `{ length }` for a symmetric parabola (half before, half after the
 * VIP, measured horizontally), or `{ lengthIn, lengthOut }` for an unsymmetric one.
 */
export interface VerticalCurveInput<T> {
  /** Whole horizontal length of a symmetric curve. */
  readonly length?: Numeric<T>;
  /** Length before the VIP (unsymmetric curve). */
  readonly lengthIn?: Numeric<T>;
  /** Length after the VIP (unsymmetric curve). */
  readonly lengthOut?: Numeric<T>;
}

/** The input of {@link verticalAlignment}. */
export interface VerticalAlignmentInput<T> {
  /** The VIPs in order of chainage; the first and last are the ends of the profile. */
  readonly points: readonly ProfilePointInput<T>[];
  /** One entry per point: a curve, or `null` (always `null` at the two ends). Absent: no curves. */
  readonly curves?: readonly (VerticalCurveInput<T> | null | undefined)[];
}

/** A chainage and its level. */
export interface ProfileLevel<T> {
  /** Chainage. */
  readonly chainage: T;
  /** Level. */
  readonly level: T;
}

/** A vertical curve as {@link verticalAlignment} computes it. */
export interface VerticalCurve<T> {
  /** Index of its VIP in `points`. */
  readonly vip: number;
  /** Grade before the VIP, as a ratio (rise over run; 0.05 is +5 %). */
  readonly gradeIn: T;
  /** Grade after the VIP, as a ratio. */
  readonly gradeOut: T;
  /** Algebraic change of grade g2 − g1 in percent (A; negative on a crest). */
  readonly gradeChangePercent: T;
  /** Length before the VIP. */
  readonly lengthIn: T;
  /** Length after the VIP. */
  readonly lengthOut: T;
  /** Whole length L = lengthIn + lengthOut. */
  readonly length: T;
  /** Rate of vertical curvature K = L/|A| (length per percent of grade change). */
  readonly k: T;
  /** Beginning of the vertical curve (BVC, also PVC). */
  readonly bvc: ProfileLevel<T>;
  /** End of the vertical curve (EVC, also PVT). */
  readonly evc: ProfileLevel<T>;
  /** The curve's level below the VIP: VIP level + e, e = (g2 − g1)·l1·l2/(2(l1 + l2)). */
  readonly atVip: ProfileLevel<T>;
  /** `'crest'` (grade falls) or `'sag'` (grade rises). */
  readonly kind: 'crest' | 'sag';
  /** The high point of a crest or low point of a sag, when it falls inside the curve. */
  readonly turningPoint?: ProfileLevel<T>;
}

/** What {@link verticalAlignment} returns: a plain, serialisable description of the profile. */
export interface VerticalAlignment<T> {
  /** The VIPs as read. */
  readonly points: readonly ProfileLevel<T>[];
  /** Grades between consecutive VIPs, as ratios: `grades[i]` runs from `points[i]` to `points[i + 1]`. */
  readonly grades: readonly T[];
  /** The grades in percent. */
  readonly gradesPercent: readonly T[];
  /** One entry per VIP: its curve, or `null`. */
  readonly curves: readonly (VerticalCurve<T> | null)[];
}

/**
 * A vertical alignment (profile): grades between vertices of the grade line, and a parabolic
 * vertical curve at each VIP that has one.
 *
 * A symmetric curve of length L at a VIP between grades g1 and g2 has level
 * y = y_BVC + g1·x + (g2 − g1)·x²/(2L) at a distance x past the BVC (the equal-tangent
 * parabola; e.g. Mahun, *Curves*, "Vertical Curves", equation of the curve). An unsymmetric
 * curve (l1 before the VIP, l2 after) is two parabolas meeting below the VIP with a common
 * grade, the VIP offset being e = (g2 − g1)·l1·l2/(2(l1 + l2)) (derived: it is the only e that
 * makes level and grade continuous; it gives the symmetric curve when l1 = l2). K = L/|A|,
 * A = 100·(g2 − g1). All of it is exact in `rational`.
 *
 * A computational aid: check independently; design follows the applicable road or railway
 * standard and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ points, curves }`: points are `{ chainage, level }` (chainage a number or
 *   station text), strictly increasing in chainage; `curves[i]` belongs to `points[i]`
 * @returns `{ points, grades, gradesPercent, curves }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than two points; `REPEATED_CHAINAGE`
 *   for chainages not increasing; `INVALID_ARGUMENT` for a curve at an end, a curve where the
 *   grade does not change, a length ≤ 0, `curves` not one per point; `CURVES_OVERLAP` when a
 *   curve runs past an end or into the next curve; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, verticalAlignment } from 'quadspread';
 * const R = rational;
 * const v = verticalAlignment(R, {
 *   points: [{ chainage: 5400, level: 1312.5 }, { chainage: '56+50', level: 1325 }, { chainage: 5900, level: 1316.25 }],
 *   curves: [null, { length: 500 }, null],
 * });
 * const c = v.curves[1]!;
 * [R.toNumber(c.bvc.chainage), R.toNumber(c.evc.level), R.toString(c.k), R.toString(c.turningPoint!.level)];
 * //=> [5400, 1316.25, '1000/17', '44875/34']
 * ```
 */
export function verticalAlignment<T>(
  A: Arithmetic<T>,
  input: VerticalAlignmentInput<T>,
): VerticalAlignment<T> {
  checkArithmetic(A, 'verticalAlignment');
  const where = 'verticalAlignment(A, input)';
  const o = readObject(input, where, 'an object { points, curves }');
  const raw = readList<unknown>(o.points, `${where}.points`);
  if (raw.length < 2)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${where}.points`,
      `${raw.length} points: a profile needs at least two`,
    );
  const points = raw.map((p, i) => {
    const q = readObject(p, `${where}.points[${i}]`, 'a point { chainage, level }');
    return {
      chainage: readChainage(A, q.chainage, `${where}.points[${i}].chainage`),
      level: readNumber(A, q.level as Numeric<T>, `${where}.points[${i}].level`),
    };
  });
  const n = points.length;
  const grades: T[] = [];
  for (let i = 0; i + 1 < n; i++) {
    const run = A.sub(points[i + 1]!.chainage, points[i]!.chainage);
    if (A.sign(run) <= 0)
      throw new QuadspreadError(
        'REPEATED_CHAINAGE',
        `${where}.points[${i + 1}].chainage`,
        `${A.toString(points[i + 1]!.chainage)} does not exceed the previous chainage ${A.toString(points[i]!.chainage)}`,
      );
    grades.push(A.div(A.sub(points[i + 1]!.level, points[i]!.level), run));
  }
  const rawCurves =
    o.curves === undefined
      ? new Array<null>(n).fill(null)
      : readList<unknown>(o.curves, `${where}.curves`, 100_000, true);
  if (rawCurves.length !== n)
    throw invalidArgument(
      `${where}.curves`,
      `${rawCurves.length} entries for ${n} points: give one per point (null where there is none)`,
    );
  const hundred = A.from(100);
  const two = A.from(2);
  const curves: (VerticalCurve<T> | null)[] = [];
  let lastEnd = points[0]!.chainage;
  let lastEndAt = 'the start of the profile';
  for (let i = 0; i < n; i++) {
    const rc = rawCurves[i];
    const at = `${where}.curves[${i}]`;
    if (rc === null || rc === undefined) {
      curves.push(null);
      continue;
    }
    const c = readObject(rc, at, 'a vertical curve { length } or { lengthIn, lengthOut }');
    if (i === 0 || i === n - 1)
      throw invalidArgument(at, 'a curve at an end of the profile: the ends take null');
    let l1: T;
    let l2: T;
    if (c.length !== undefined) {
      if (c.lengthIn !== undefined || c.lengthOut !== undefined)
        throw invalidArgument(at, 'give either length or lengthIn and lengthOut, not both');
      const L = readLength(A, c.length, `${at}.length`, true);
      l1 = l2 = A.div(L, two);
    } else {
      l1 = readLength(A, c.lengthIn, `${at}.lengthIn`, true);
      l2 = readLength(A, c.lengthOut, `${at}.lengthOut`, true);
    }
    const vip = points[i]!;
    const g1 = grades[i - 1]!;
    const g2 = grades[i]!;
    const dg = A.sub(g2, g1);
    if (A.isZero(dg))
      throw invalidArgument(
        at,
        `the grade does not change at VIP ${i} (both ${A.toString(g1)}): no curve is needed`,
      );
    const L = A.add(l1, l2);
    const bvcCh = A.sub(vip.chainage, l1);
    const evcCh = A.add(vip.chainage, l2);
    if (A.cmp(bvcCh, lastEnd) < 0)
      throw new QuadspreadError(
        'CURVES_OVERLAP',
        at,
        `its BVC at ${A.toString(bvcCh)} lies before ${lastEndAt} at ${A.toString(lastEnd)}`,
      );
    if (A.cmp(evcCh, points[n - 1]!.chainage) > 0)
      throw new QuadspreadError(
        'CURVES_OVERLAP',
        at,
        `its EVC at ${A.toString(evcCh)} lies past the end of the profile at ${A.toString(points[n - 1]!.chainage)}`,
      );
    lastEnd = evcCh;
    lastEndAt = `the EVC of the curve at VIP ${i}`;
    // VIP offset e = (g2 − g1)·l1·l2/(2(l1 + l2)) (derived: continuity of level and grade at the VIP).
    const e = A.div(A.mul(dg, A.mul(l1, l2)), A.mul(two, L));
    const bvc = { chainage: bvcCh, level: A.sub(vip.level, A.mul(g1, l1)) };
    const evc = { chainage: evcCh, level: A.add(vip.level, A.mul(g2, l2)) };
    const Apct = A.mul(dg, hundred);
    // Turning point where the grade is zero: first branch g1 + 2e·x/l1² = 0, second g2 − 2e·x'/l2² = 0.
    let turningPoint: ProfileLevel<T> | undefined;
    const x1 = A.div(A.mul(A.neg(g1), A.mul(l1, l1)), A.mul(two, e));
    const x2 = A.div(A.mul(g2, A.mul(l2, l2)), A.mul(two, e));
    if (A.sign(x1) > 0 && A.cmp(x1, l1) <= 0) {
      turningPoint = {
        chainage: A.add(bvcCh, x1),
        level: A.add(
          bvc.level,
          A.add(A.mul(g1, x1), A.div(A.mul(e, A.mul(x1, x1)), A.mul(l1, l1))),
        ),
      };
    } else if (A.sign(x2) > 0 && A.cmp(x2, l2) < 0) {
      turningPoint = {
        chainage: A.sub(evcCh, x2),
        level: A.add(
          A.sub(evc.level, A.mul(g2, x2)),
          A.div(A.mul(e, A.mul(x2, x2)), A.mul(l2, l2)),
        ),
      };
    }
    curves.push({
      vip: i,
      gradeIn: g1,
      gradeOut: g2,
      gradeChangePercent: Apct,
      lengthIn: l1,
      lengthOut: l2,
      length: L,
      k: A.div(L, A.abs(Apct)),
      bvc,
      evc,
      atVip: { chainage: vip.chainage, level: A.add(vip.level, e) },
      kind: A.sign(dg) < 0 ? 'crest' : 'sag',
      ...(turningPoint ? { turningPoint } : {}),
    });
  }
  return { points, grades, gradesPercent: grades.map((g) => A.mul(g, hundred)), curves };
}

/**
 * The level and grade of a profile at a chainage: on a grade line, or on a vertical curve
 * (y = y_BVC + g1·x + e·x²/l1² before the VIP, y = y_EVC − g2·x′ + e·x′²/l2² after it, x and
 * x′ measured from the BVC and back from the EVC; see {@link verticalAlignment}). Exact in
 * `rational`.
 *
 * @param A the arithmetic
 * @param profile a profile made by {@link verticalAlignment}
 * @param chainage the chainage (a number or station text), within the profile
 * @returns `{ level, grade }`, the grade as a ratio (rise over run)
 * @throws {QuadspreadError} `OFF_ALIGNMENT` for a chainage before the first or after the last
 *   point; `INVALID_ARGUMENT` for a profile that is not one; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, verticalAlignment, profileLevel } from 'quadspread';
 * const R = rational;
 * const v = verticalAlignment(R, {
 *   points: [{ chainage: 5400, level: 1312.5 }, { chainage: 5650, level: 1325 }, { chainage: 5900, level: 1316.25 }],
 *   curves: [null, { length: 500 }, null],
 * });
 * const p = profileLevel(R, v, '55+00');
 * [R.toString(p.level), R.toNumber(p.level), R.toNumber(p.grade)];
 * //=> ['26333/20', 1316.65, 0.033]
 * ```
 */
export function profileLevel<T>(
  A: Arithmetic<T>,
  profile: VerticalAlignment<T>,
  chainage: Numeric<T>,
): { level: T; grade: T } {
  checkArithmetic(A, 'profileLevel');
  const where = 'profileLevel(A, profile, chainage)';
  const pr = readObject(profile, `${where} profile`, 'a profile made by verticalAlignment');
  const points = pr.points as VerticalAlignment<T>['points'];
  const grades = pr.grades as VerticalAlignment<T>['grades'];
  const curves = pr.curves as VerticalAlignment<T>['curves'];
  if (
    !Array.isArray(points) ||
    !Array.isArray(grades) ||
    !Array.isArray(curves) ||
    points.length < 2 ||
    grades.length !== points.length - 1 ||
    curves.length !== points.length ||
    !madeProfile(A, points, grades, curves)
  )
    throw invalidArgument(
      `${where} profile`,
      `${show(profile)} is not a profile made by verticalAlignment in ${A.name}`,
    );
  const c = readChainage(A, chainage, `${where} chainage`);
  const n = points.length;
  if (A.cmp(c, points[0]!.chainage) < 0 || A.cmp(c, points[n - 1]!.chainage) > 0)
    throw new QuadspreadError(
      'OFF_ALIGNMENT',
      `${where} chainage`,
      `${A.toString(c)} is outside the profile, ${A.toString(points[0]!.chainage)} to ${A.toString(points[n - 1]!.chainage)}`,
    );
  // The grade-line segment i with points[i] ≤ c ≤ points[i+1], by bisection.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (A.cmp(points[mid]!.chainage, c) <= 0) lo = mid;
    else hi = mid;
  }
  for (const k of [lo, lo + 1]) {
    const cv = curves[k];
    if (!cv) continue;
    if (A.cmp(c, cv.bvc.chainage) >= 0 && A.cmp(c, cv.evc.chainage) <= 0)
      return onCurve(A, cv, points[k]!, c);
  }
  const g = grades[lo]!;
  return { level: A.add(points[lo]!.level, A.mul(g, A.sub(c, points[lo]!.chainage))), grade: g };
}

/** A chainage and level of A's values. */
function isLevel<T>(A: Arithmetic<T>, p: unknown): boolean {
  return (
    p !== null &&
    typeof p === 'object' &&
    A.is((p as ProfileLevel<T>).chainage) &&
    A.is((p as ProfileLevel<T>).level)
  );
}

/** Whether the parts of a profile are what verticalAlignment makes (every index, no holes). */
function madeProfile<T>(
  A: Arithmetic<T>,
  points: readonly unknown[],
  grades: readonly unknown[],
  curves: readonly unknown[],
): boolean {
  for (let i = 0; i < points.length; i++) {
    if (!isLevel(A, points[i])) return false;
    if (i < grades.length && !A.is(grades[i])) return false;
    const c = curves[i] as VerticalCurve<T> | null | undefined;
    if (c === null) continue;
    if (
      typeof c !== 'object' ||
      !isLevel(A, c.bvc) ||
      !isLevel(A, c.evc) ||
      !isLevel(A, c.atVip) ||
      !A.is(c.gradeIn) ||
      !A.is(c.gradeOut) ||
      !A.is(c.lengthIn) ||
      !A.is(c.lengthOut)
    )
      return false;
  }
  return true;
}

function onCurve<T>(
  A: Arithmetic<T>,
  cv: VerticalCurve<T>,
  vip: ProfileLevel<T>,
  c: T,
): { level: T; grade: T } {
  const e = A.sub(cv.atVip.level, vip.level);
  const two = A.from(2);
  if (A.cmp(c, vip.chainage) <= 0) {
    const x = A.sub(c, cv.bvc.chainage);
    const r = A.div(e, A.mul(cv.lengthIn, cv.lengthIn));
    return {
      level: A.add(cv.bvc.level, A.add(A.mul(cv.gradeIn, x), A.mul(r, A.mul(x, x)))),
      grade: A.add(cv.gradeIn, A.mul(two, A.mul(r, x))),
    };
  }
  const x = A.sub(cv.evc.chainage, c);
  const r = A.div(e, A.mul(cv.lengthOut, cv.lengthOut));
  return {
    level: A.add(A.sub(cv.evc.level, A.mul(cv.gradeOut, x)), A.mul(r, A.mul(x, x))),
    grade: A.sub(cv.gradeOut, A.mul(two, A.mul(r, x))),
  };
}
