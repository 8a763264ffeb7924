/**
 * The height of a point seen from three or more stations on one straight line (a track, a
 * road, a shore) whose foot cannot be reached: Stewart's relation.
 *
 * @module elevation
 */
import {
  QuadspreadError,
  show,
  invalidArgument,
  inconsistentReadings,
  checkArithmetic,
} from '../errors.js';
import { checkObject } from './input.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { solveQuadratic } from '../geometry/quadratic.js';
import { readNumber, readQuadrance } from '../geometry/validate.js';
import type { Root } from '../geometry/surd.js';
import { readVertical, type VerticalInput } from '../readings/vertical.js';
import { rootOps } from './roots.js';
import { inlineHeightFloat } from './inline-float.js';

/** The result of {@link heightFromInlineReadings}. */
export interface InlineHeight<T> {
  /** Vertical quadrance of the point above (or below: see `sign`) the stations' level. */
  readonly H: T;
  /** Chainage of the point's foot projected on the line (same origin as the stations'). */
  readonly footChainage: T;
  /** Quadrance from the foot to the line (its offset squared). */
  readonly footOffset: T;
  /**
   * For each station: (cᵢ − f)² + e − H·(1 − Rᵢ)/Rᵢ, the horizontal quadrance from the fitted
   * geometry minus the one the reading implies (square units). All 0 with three stations.
   */
  readonly residuals: readonly T[];
  /** +1 when the point is above the stations' level, −1 below. */
  readonly sign: -1 | 1;
}

/** Reads in-line readings: checks counts, chainages, spreads and signs; returns k = (1 − R)/R. */
function readInline<T>(
  A: Arithmetic<T>,
  vertical: readonly VerticalInput<T>[],
  where: string,
  min: number,
  count: number,
): { k: T[]; sign: -1 | 1 } {
  if (!Array.isArray(vertical) || vertical.length !== count) {
    throw invalidArgument(
      `${where}.vertical`,
      `give one vertical reading per station (${count} stations, ${Array.isArray(vertical) ? vertical.length : show(vertical)} readings)`,
    );
  }
  if (count < min)
    throw new QuadspreadError(
      'TOO_FEW_STATIONS',
      where,
      `${count} station${count === 1 ? '' : 's'}: at least ${min} are needed`,
    );
  let sign: -1 | 1 | 0 = 0;
  const k: T[] = [];
  for (let i = 0; i < count; i++) {
    // `where` strings for a station are built only when it is at fault (this runs in a hot path)
    const r = readVertical(A, vertical[i]!, `${where}.vertical`, i);
    if (r.sign === 0)
      throw inconsistentReadings(
        `${where}.vertical[${i}]`,
        'a level sight (spread 0) from a station on the line meets no point off its level',
      );
    if (sign !== 0 && r.sign !== sign)
      throw inconsistentReadings(
        `${where}.vertical`,
        'some readings are above the horizon and some below',
      );
    sign = r.sign;
    k.push(A.div(A.sub(A.one, r.spread), r.spread)); // cot²α = (1 − R)/R: horizontal quadrance per unit H
  }
  return { k, sign: sign as -1 | 1 };
}

function repeated<T>(A: Arithmetic<T>, w: string, i: number, j: number, x: T): never {
  throw new QuadspreadError(
    'REPEATED_CHAINAGE',
    `${w}.chainages`,
    `stations ${i} and ${j} are both at chainage ${A.toString(x)}`,
  );
}

/** Solves the 3×3 system M·x = y exactly (Gaussian elimination with a non-zero pivot). */
function solve3<T>(A: Arithmetic<T>, M: T[][], y: T[], where: string): T[] {
  const m = M.map((row, i) => [...row, y[i]!]);
  for (let c = 0; c < 3; c++) {
    let p = c;
    // pivot: the largest magnitude (exact arithmetics need only non-zero; floats like the largest)
    for (let r = c + 1; r < 3; r++) if (A.cmp(A.abs(m[r]![c]!), A.abs(m[p]![c]!)) > 0) p = r;
    if (A.isZero(m[p]![c]!))
      throw inconsistentReadings(
        where,
        'the readings fit no single point at a finite height (the equations are singular)',
      );
    [m[c], m[p]] = [m[p]!, m[c]!];
    for (let r = 0; r < 3; r++) {
      if (r === c) continue;
      const f = A.div(m[r]![c]!, m[c]![c]!);
      if (A.isZero(f)) continue;
      for (let j = c; j < 4; j++) m[r]![j] = A.sub(m[r]![j]!, A.mul(f, m[c]![j]!));
    }
  }
  return [0, 1, 2].map((i) => A.div(m[i]![3]!, m[i]![i]!));
}

/**
 * The height of a point P off a straight line, from vertical readings at three or more
 * stations on the line at known chainages. Nothing is measured to P's foot.
 *
 * With the foot F at chainage f and offset quadrance e from the line, the horizontal
 * quadrance from station i is (cᵢ − f)² + e, and the reading says it is H·kᵢ with
 * kᵢ = (1 − Rᵢ)/Rᵢ (from R = H/(H + Q)). So H·kᵢ + 2cᵢ·f − g = cᵢ² with g = f² + e:
 * **linear** in H, f and g. Three stations: Stewart's relation (M. Stewart, *Some General
 * Theorems*, Edinburgh 1746, Prop. II) applied to the quadrances H·kᵢ from F eliminates f
 * and e: H·(k₁(c₃ − c₂) − k₂(c₃ − c₁) + k₃(c₂ − c₁)) = (c₂ − c₁)(c₃ − c₂)(c₃ − c₁),
 * and the system gives f and e; all exact in `rational`. Four or more: least squares on
 * those linear equations (equal weights; normal equations solved exactly), with the
 * residuals in square units.
 *
 * @param A the arithmetic
 * @param input `chainages`: the stations' chainages along the line (distinct, any order, one
 *   unit); `vertical`: one vertical reading per station (spreads in (0, 1], or signed readings,
 *   all on the same side of the horizon)
 * @returns `{ H, footChainage, footOffset, residuals, sign }`
 * @throws {QuadspreadError} `TOO_FEW_STATIONS` below three; `REPEATED_CHAINAGE` when two
 *   stations share a chainage; `INCONSISTENT_READINGS` for a level sight, readings on both
 *   sides of the horizon, or readings that fit no real point (H ≤ 0, a negative offset
 *   quadrance, singular equations); `INVALID_ARGUMENT` when the counts differ;
 *   `SPREAD_OUT_OF_RANGE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, heightFromInlineReadings } from 'quadspread';
 * // point 12 above the line's level, foot at chainage 7, offset 5 (quadrance 25)
 * const r = heightFromInlineReadings(rational, { chainages: [0, 10, 20], vertical: ['144/218', '144/178', '144/338'] });
 * [rational.toString(r.H), rational.toString(r.footChainage), rational.toString(r.footOffset)];
 * //=> ['144', '7', '25']
 * ```
 */
export function heightFromInlineReadings<T>(
  A: Arithmetic<T>,
  input: { chainages: readonly Numeric<T>[]; vertical: readonly VerticalInput<T>[] },
): InlineHeight<T> {
  checkArithmetic(A, 'heightFromInlineReadings');
  // Performance (docs/performance.md): the arithmetic's fused kernel, where it has one
  // (rational: three stations, in integers), gives the same result at once, or undefined for
  // input it leaves to the code below (which reports every error).
  const fused = A.kernels?.inlineHeight?.(input);
  if (fused !== undefined) return fused;
  if (A.float64) {
    // The float twin (same operations, same order) for three numeric stations; else below.
    const fast = inlineHeightFloat(input);
    if (fast !== undefined) return fast as unknown as InlineHeight<T>;
  }
  const w = 'heightFromInlineReadings(input)';
  checkObject(input, w);
  if (!Array.isArray(input.chainages))
    throw invalidArgument(
      `${w}.chainages`,
      `${show(input.chainages)} is not an array of chainages`,
    );
  const n = input.chainages.length;
  if (n < 3)
    throw new QuadspreadError(
      'TOO_FEW_STATIONS',
      w,
      `${n} station${n === 1 ? '' : 's'}: at least 3 are needed`,
    );
  const raw: T[] = [];
  let sum = A.zero;
  for (let i = 0; i < n; i++) {
    const x: T = readNumber(A, input.chainages[i]!, () => `${w}.chainages[${i}]`);
    // a few stations: compare each pair at once; many: sort below (n² comparisons would hang)
    if (n <= 8) for (let j = 0; j < i; j++) if (A.eq(raw[j]!, x)) repeated(A, w, j, i, x);
    raw.push(x);
    sum = A.add(sum, x);
  }
  if (n > 8) {
    const order = raw.map((_, i) => i).sort((i, j) => A.cmp(raw[i]!, raw[j]!));
    for (let m = 1; m < n; m++) {
      const [i, j] = [order[m - 1]!, order[m]!];
      if (A.eq(raw[i]!, raw[j]!)) repeated(A, w, Math.min(i, j), Math.max(i, j), raw[i]!);
    }
  }
  const { k, sign } = readInline(A, input.vertical, w, 3, n);
  const two = A.from(2);
  // Work from the stations' mean chainage (exact in rational; better conditioned in float), then shift back.
  const origin = A.div(sum, A.from(n));
  const c: T[] = [];
  for (let i = 0; i < n; i++) c.push(A.sub(raw[i]!, origin));
  let H: T;
  let f: T;
  let g: T;
  if (n === 3) {
    const [c1, c2, c3] = c as [T, T, T];
    const [k1, k2, k3] = k as [T, T, T];
    // Stewart's relation with quadrances Qᵢ = H·kᵢ from the foot: Q₁(c₃ − c₂) − Q₂(c₃ − c₁) + Q₃(c₂ − c₁)
    // = (c₂ − c₁)(c₃ − c₂)(c₃ − c₁) (Stewart 1746, Prop. II, with signed chainages)
    const a12 = A.sub(c2, c1);
    const a23 = A.sub(c3, c2);
    const a13 = A.sub(c3, c1);
    const coef = A.add(A.sub(A.mul(k1, a23), A.mul(k2, a13)), A.mul(k3, a12));
    if (A.isZero(coef))
      throw inconsistentReadings(
        `${w}.vertical`,
        'the readings fit no single point at a finite height',
      );
    H = A.div(A.mul(A.mul(a12, a23), a13), coef);
    // Q₁ − Q₂ = (c₁ − c₂)(c₁ + c₂ − 2f): the foot's chainage
    f = A.div(A.sub(A.add(c1, c2), A.div(A.mul(H, A.sub(k1, k2)), A.sub(c1, c2))), two);
    const d1 = A.sub(c1, f);
    g = A.add(A.sub(A.mul(H, k1), A.mul(d1, d1)), A.mul(f, f));
  } else {
    // Least squares on H·kᵢ + 2cᵢ·f − g = cᵢ² (normal equations, solved exactly)
    const rows = c.map((ci, i) => [k[i]!, A.mul(two, ci), A.neg(A.one)]);
    const rhs = c.map((ci) => A.mul(ci, ci));
    const N: T[][] = [0, 1, 2].map((a) =>
      [0, 1, 2].map((b) => rows.reduce((s, r) => A.add(s, A.mul(r[a]!, r[b]!)), A.zero)),
    );
    const y: T[] = [0, 1, 2].map((a) =>
      rows.reduce((s, r, i) => A.add(s, A.mul(r[a]!, rhs[i]!)), A.zero),
    );
    [H, f, g] = solve3(A, N, y, `${w}.vertical`) as [T, T, T];
  }
  if (A.sign(H) <= 0)
    throw inconsistentReadings(
      `${w}.vertical`,
      `the readings give a height quadrance ${A.toString(H)} ≤ 0: no real point fits`,
    );
  const e = A.sub(g, A.mul(f, f));
  if (A.sign(e) < 0)
    throw inconsistentReadings(
      `${w}.vertical`,
      `the readings give a negative offset quadrance ${A.toString(e)}: no real point fits`,
    );
  const residuals: T[] = [];
  for (let i = 0; i < n; i++) {
    const d = A.sub(c[i]!, f);
    residuals.push(A.sub(A.add(A.mul(d, d), e), A.mul(H, k[i]!)));
  }
  return { H, footChainage: A.add(f, origin), footOffset: e, residuals, sign };
}

/** The result of {@link heightFromInlineQuadrances}. */
export interface InlineQuadranceHeight<T, E extends boolean> {
  /** The physical root: the point's vertical quadrance above (or below) the stations' level. */
  readonly H: Root<T, E>;
  /** The other root of the quadratic: the height if the first station lay on the same side of the second as the third. */
  readonly mirror: Root<T, E> | undefined;
  /** Coefficients [a, b, c] of the quadratic a·H² + b·H + c = 0 that both roots satisfy. */
  readonly quadratic: readonly [T, T, T];
  /** +1 above the stations' level, −1 below. */
  readonly sign: -1 | 1;
}

/**
 * The height of a point off a straight line seen from three stations in order along it when
 * only the quadrances between consecutive stations are known (Q₁₂, Q₂₃, no distances or
 * chainages), with a vertical reading at each.
 *
 * Stewart's relation in quadrances, at the middle station (the cross law in triangles
 * P₂F S₃ and P₂F S₁ around the shared angle; see geometry's `stewartQuadranceResidual`),
 * Q₁₂·(Q₂ + Q₂₃ − Q₃)² = Q₂₃·(Q₂ + Q₁₂ − Q₁)², with the foot quadrances Qᵢ = H·(1 − Rᵢ)/Rᵢ,
 * is a **quadratic in H**. Its roots are surds a ± b√d in `rational`. Squaring lost a sign:
 * by the cross law Q₂ + Q₂₃ − Q₃ = 2√(Q₂Q₂₃)·cos θ and Q₂ + Q₁₂ − Q₁ = 2√(Q₂Q₁₂)·cos θ′,
 * where θ, θ′ are the angles at station 2 between the foot and stations 3 and 1. With
 * station 2 **between** 1 and 3 (stations in order), θ′ = 180° − θ, so the two brackets have
 * opposite signs (or are both zero): that root is the physical one, returned as `H`. The
 * other (`mirror`) is the height for stations 1 and 3 on the same side of station 2.
 *
 * @param A the arithmetic
 * @param input `spacings`: [Q₁₂, Q₂₃], the quadrances between consecutive stations (> 0);
 *   `vertical`: three readings (spreads in (0, 1] or signed readings, same side)
 * @returns `{ H, mirror, quadratic, sign }`
 * @throws {QuadspreadError} `TOO_FEW_STATIONS` with fewer than three readings;
 *   `INVALID_ARGUMENT` with more than three (each triple needs its own radicand) or a
 *   spacing count other than two; `REPEATED_CHAINAGE` for a zero spacing;
 *   `INCONSISTENT_READINGS` when no positive root has the physical sign pattern;
 *   `SPREAD_OUT_OF_RANGE`; `NEGATIVE_QUADRANCE`.
 * @example
 * ```ts
 * import { rational, heightFromInlineQuadrances } from 'quadspread';
 * // the configuration of heightFromInlineReadings' example, spacings 10 and 10 given as quadrances
 * const r = heightFromInlineQuadrances(rational, { spacings: [100, 100], vertical: ['144/218', '144/178', '144/338'] });
 * r.H.toString();
 * //=> '144'
 * ```
 */
export function heightFromInlineQuadrances<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: { spacings: readonly [Numeric<T>, Numeric<T>]; vertical: readonly VerticalInput<T>[] },
): InlineQuadranceHeight<T, E> {
  checkArithmetic(A, 'heightFromInlineQuadrances');
  const w = 'heightFromInlineQuadrances(input)';
  checkObject(input, w);
  const R = rootOps(A);
  if (!Array.isArray(input.vertical))
    throw invalidArgument(`${w}.vertical`, `${show(input.vertical)} is not an array of readings`);
  if (input.vertical.length < 3)
    throw new QuadspreadError(
      'TOO_FEW_STATIONS',
      w,
      `${input.vertical.length} stations: exactly 3 are needed`,
    );
  if (input.vertical.length > 3)
    throw invalidArgument(
      `${w}.vertical`,
      `${input.vertical.length} stations: this form takes exactly 3 (use heightFromInlineReadings with chainages for more)`,
    );
  if (!Array.isArray(input.spacings) || input.spacings.length !== 2)
    throw invalidArgument(`${w}.spacings`, 'give the two quadrances between consecutive stations');
  const Q12 = readQuadrance(A, input.spacings[0], w, 'spacings[0]');
  const Q23 = readQuadrance(A, input.spacings[1], w, 'spacings[1]');
  if (A.isZero(Q12) || A.isZero(Q23))
    throw new QuadspreadError(
      'REPEATED_CHAINAGE',
      `${w}.spacings`,
      'a spacing of 0 puts two stations at one place',
    );
  const { k, sign } = readInline(A, input.vertical, w, 3, 3);
  const [k1, k2, k3] = k as [T, T, T];
  // u(H) = Q₂ + Q₂₃ − Q₃ = αH + Q₂₃ and v(H) = Q₂ + Q₁₂ − Q₁ = βH + Q₁₂
  const al = A.sub(k2, k3);
  const be = A.sub(k2, k1);
  // Q₁₂·u² − Q₂₃·v² = 0, expanded
  const qa = A.sub(A.mul(Q12, A.mul(al, al)), A.mul(Q23, A.mul(be, be)));
  const qb = A.mul(A.from(2), A.mul(A.mul(Q12, Q23), A.sub(al, be)));
  const qc = A.mul(A.mul(Q12, Q23), A.sub(Q23, Q12));
  if (A.isZero(qa) && A.isZero(qb))
    throw inconsistentReadings(`${w}.vertical`, 'the readings do not fix a height');
  const roots = solveQuadratic(A, qa, qb, qc).filter((h) => R.sign(h) > 0);
  const physical: Root<T, E>[] = [];
  const other: Root<T, E>[] = [];
  for (const h of roots) {
    const u = R.add(R.mul(h, al), Q23);
    const v = R.add(R.mul(h, be), Q12);
    if (R.sign(u) * R.sign(v) <= 0) physical.push(h);
    else other.push(h);
  }
  if (physical.length === 0)
    throw inconsistentReadings(
      `${w}.vertical`,
      'no positive height puts the middle station between the other two',
    );
  // Two physical roots would need u = v = 0 at both: impossible for a quadratic with distinct roots unless degenerate.
  return { H: physical[physical.length - 1]!, mirror: other[0], quadratic: [qa, qb, qc], sign };
}
