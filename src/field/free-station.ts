/**
 * Free station: a set-up on an unknown point fixed by directions and distances to two or more
 * control points, by least squares when the observations are redundant.
 *
 * @module field
 */
import { QuadspreadError, invalidArgument, show, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { AngleUnit } from '../readings/angle.js';
import { readNumber } from '../geometry/validate.js';
import { readArray } from '../cogo/internal.js';
import { resection } from '../cogo/resection.js';
import { float } from '../arithmetic/float.js';
import { reduceAt, type FieldObservation } from './reduce.js';
import { faceLeftCircle } from './orient.js';
import { solveDense } from './normal-solve.js';
import {
  ARCSEC,
  azimuthOf,
  checkRecord,
  halfTurn,
  readDistance,
  readOptional,
  readPoint3,
  readUnit,
  root,
  turn,
  type Point3,
  type Point3Input,
} from './internal.js';

/** A control point: coordinates and a name the observations refer to. */
export interface ControlPoint<T> extends Point3Input<T> {
  /** The name observations use in `to` (or refer to the point by its index). */
  readonly name?: string;
}

/** Readings from the free station to one control point. */
export interface StationObservation<T> extends Omit<
  FieldObservation<T>,
  'zenith' | 'slope' | 'instrumentHeight' | 'unit' | 'circle'
> {
  /** The control point: its `name`, or its index in `control`. */
  readonly to: string | number;
  /** Horizontal circle reading (a direction). */
  readonly circle?: Numeric<T>;
  /** Zenith angle (with `slope`). */
  readonly zenith?: Numeric<T>;
  /** Slope distance (with `zenith`). */
  readonly slope?: Numeric<T>;
  /** A horizontal distance already reduced, instead of `slope` and `zenith`. */
  readonly horizontalDistance?: Numeric<T>;
}

/** The input of {@link freeStation}. */
export interface FreeStationInput<T> {
  /** The control points. */
  readonly control: readonly ControlPoint<T>[];
  /** The observations to them. */
  readonly observations: readonly StationObservation<T>[];
  /** `'fixed'` (default): distances as measured; `'free'`: a scale of the distances is solved for (reported in ppm). */
  readonly scale?: 'fixed' | 'free';
  /** Height of the instrument above the station mark (default 0). */
  readonly instrumentHeight?: Numeric<T>;
  /** A-priori standard deviations: `direction` in arc-seconds (default 3), `distance` in metres (default 0.003). */
  readonly sigma?: { readonly direction?: Numeric<T>; readonly distance?: Numeric<T> };
  /** Unit of numeric angles (default `'deg'`). */
  readonly unit?: AngleUnit;
}

/** The residuals of one observation of a free station. */
export interface FreeStationResidual<T> {
  /** The control point's name (or `control n`, from 1). */
  readonly name: string;
  /** Computed − observed direction, arc-seconds (when a circle was read). */
  readonly angleResidual?: T;
  /** Measured − computed horizontal distance, metres (when a distance was read). */
  readonly distanceResidual?: T;
  /** Station level + height difference − control level (when levels and a zenith angle are known). */
  readonly heightResidual?: T;
}

/** What {@link freeStation} returns: a set-up for side shots and setting out, with its quality. */
export interface FreeStation<T> {
  /** The station (z when levels and zenith angles allow: the mean over the control points). */
  readonly station: Point3<T>;
  /** Height of the instrument above the station mark. */
  readonly instrumentHeight: T;
  /** The bearing of the circle's zero, degrees in [0°, 360°). */
  readonly orientation: T;
  /** With `scale: 'free'`: the scale of the measured distances in ppm (measured·(1 + ppm·10⁻⁶) = from coordinates). */
  readonly scale?: T;
  /** Standard deviations: x, y (metres), orientation (arc-seconds), scale (ppm). */
  readonly sigma: { readonly x: T; readonly y: T; readonly orientation: T; readonly scale?: T };
  /** Observations less unknowns. */
  readonly redundancy: number;
  /** The a-posteriori variance factor vᵀPv/r (when redundant); the σ's are scaled by it then, a priori otherwise. */
  readonly varianceFactor?: T;
  /** The observations with a circle reading, as backsights (so the result is a set-up). */
  readonly backsights: readonly { readonly name: string; readonly circle: T }[];
  /** The residuals per observation, in order. */
  readonly residuals: readonly FreeStationResidual<T>[];
  /** Gauss–Newton steps taken. */
  readonly iterations: number;
}

interface Obs<T> {
  name: string;
  at: string;
  p: Point3<T>;
  c?: T;
  D?: T;
  dh?: T;
}

const MAX_STEPS = 30;

/**
 * A free station: the station's coordinates and the orientation of the circle (and, with
 * `scale: 'free'`, a scale of the distances) from directions and distances to two or more
 * control points. A direct solution gives the start — two points with direction and distance
 * (a similarity transformation), three directions (the library's `resection`), or two
 * distances (`intersectCircles`' geometry, the candidate that fits the directions) — and
 * Gauss–Newton least squares (Ghilani & Wolf, *Adjustment Computations*, 4th ed., 2006, ch. 11
 * and 15, nonlinear observation equations — from memory) finishes it; for a just-determined
 * set it reaches the exact fit. Weights 1/σ² from the a-priori `sigma`; with redundancy the
 * σ of the unknowns are √(σ̂0²·q) with σ̂0² = vᵀPv/r, without it √q (a priori). The station
 * level is the mean over the control points with a level and a zenith angle.
 *
 * In `rational` each step is exact and the iterate is rounded to 40 digits between steps; the
 * result is within about 1e-30 of the least-squares solution. In `uncertain(base)` the last
 * step carries the readings' first-order sensitivities.
 *
 * A computational aid: check independently (a check shot to a further known point).
 *
 * @param A the arithmetic
 * @param input `control`, `observations` (each `{ to, circle?, zenith?, slope?,
 *   horizontalDistance?, targetHeight?, … }`), `scale`, `instrumentHeight`, `sigma`, `unit`
 * @returns `{ station, instrumentHeight, orientation, scale?, sigma, redundancy,
 *   varianceFactor?, backsights, residuals, iterations }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than two control points observed, no
 *   direction, or fewer observations than unknowns; `INCONSISTENT_READINGS` when the
 *   observations do not fix the station (or fit two stations equally); `NOT_CONVERGED`;
 *   `INVALID_ARGUMENT` for an unknown control point, a point without coordinates, a slope
 *   without zenith angle, an unknown `scale` or a σ ≤ 0; as {@link reduceObservation}.
 * @example
 * ```ts
 * import { float, freeStation } from 'quadspread';
 * // the station at (0, 0) with its circle's zero due north: A due north, B due east
 * const s = freeStation(float, {
 *   control: [{ name: 'A', x: 0, y: 100 }, { name: 'B', x: 100, y: 0 }],
 *   observations: [{ to: 'A', circle: 0, horizontalDistance: 100 }, { to: 'B', circle: 90, horizontalDistance: 100 }],
 * });
 * [Math.round(s.station.x * 1e9) / 1e9, Math.round(s.station.y * 1e9) / 1e9, s.redundancy];
 * //=> [0, 0, 1]
 * ```
 */
export function freeStation<T>(A: Arithmetic<T>, input: FreeStationInput<T>): FreeStation<T> {
  checkArithmetic(A, 'freeStation');
  const w = 'freeStation(input)';
  checkRecord(input, w);
  const unit = readUnit(input.unit, `${w}.unit`);
  const free = input.scale === 'free';
  if (input.scale !== undefined && !free && input.scale !== 'fixed')
    throw invalidArgument(`${w}.scale`, `${show(input.scale)} is not 'fixed' or 'free'`);
  const hi = readOptional(A, input.instrumentHeight, A.zero, `${w}.instrumentHeight`);
  const sg = input.sigma ?? {};
  checkRecord(sg, `${w}.sigma`);
  const sDir = positive(A, sg.direction ?? 3, `${w}.sigma.direction`);
  const sDist = positive(A, sg.distance ?? '0.003', `${w}.sigma.distance`);
  const perRad = A.div(A.pi, A.from(180));
  const pDir = A.div(A.one, sq(A, A.mul(A.div(sDir, A.from(ARCSEC)), perRad))); // 1/σ², σ in radians
  const pDist = A.div(A.one, sq(A, sDist));
  const control = readArray<ControlPoint<T>>(input.control, `${w}.control`, 10000).map((c, i) => ({
    name: controlName(c?.name, i, `${w}.control[${i}].name`),
    p: readPoint3(A, c, `${w}.control[${i}]`),
  }));
  const obs: Obs<T>[] = readArray<StationObservation<T>>(
    input.observations,
    `${w}.observations`,
    10000,
  ).map((o, i) => {
    const at = `${w}.observations[${i}]`;
    checkRecord(o, at);
    const k =
      typeof o.to === 'number'
        ? o.to
        : ((to) => control.findIndex((c) => c.name === to))(controlName(o.to, -1, `${at}.to`));
    const cp = Number.isInteger(k) && k >= 0 ? control[k] : undefined;
    if (cp === undefined)
      throw invalidArgument(`${at}.to`, `${show(o.to)} is not a control point's name or index`);
    const r: Obs<T> = { name: cp.name, at, p: cp.p };
    if (o.circle !== undefined) r.c = faceLeftCircle(A, o, unit, at);
    if (o.slope !== undefined) {
      if (o.zenith === undefined)
        throw invalidArgument(
          `${at}.zenith`,
          'is missing: a slope distance needs its zenith angle',
        );
      const red = reduceAt(A, { ...o, zenith: o.zenith, slope: o.slope, unit }, at, hi);
      r.D = red.gridDistance ?? red.horizontalDistance;
      r.dh = red.heightDifference;
    } else if (o.horizontalDistance !== undefined)
      r.D = readDistance(A, o.horizontalDistance, `${at}.horizontalDistance`);
    return r;
  });
  const nDir = obs.filter((o) => o.c !== undefined).length;
  const nDist = obs.filter((o) => o.D !== undefined).length;
  const unknowns = free ? 4 : 3;
  if (new Set(obs.map((o) => o.name)).size < 2 || nDir === 0 || nDir + nDist < unknowns)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${w}.observations`,
      `${nDir} directions and ${nDist} distances to ${new Set(obs.map((o) => o.name)).size} control points do not fix ${unknowns} unknowns (two points or more, at least one direction)`,
    );
  // The start, in JS numbers.
  const s0 = start(
    obs.map((o) => numbers(A, o)),
    w,
  );
  let x = A.from(s0.x);
  let y = A.from(s0.y);
  let o = A.from(s0.o);
  let mu = A.from(free ? s0.mu : 1);
  // Converged when a step moves nothing by more than this fraction of the longest sight.
  const tol = A.from(`1e-${A.exact ? 30 : Math.max(6, Math.min(30, A.digits - 5))}`);
  // In an exact arithmetic the iterate, the weights and the coefficients (not the misclosures)
  // are rounded to 40 digits so that denominators stay small; the fixed point is unchanged and
  // the last step carries the readings' sensitivities through the misclosures.
  const round = (v: T): T => (A.exact ? A.from(A.toPrecision(v, 40)) : v);
  const pD = round(pDir);
  const pS = round(pDist);
  let N: T[][] = [];
  let steps = 0;
  // An exact arithmetic whose values carry more than a ratio (an uncertain one over rational)
  // takes one more step with its misclosures unrounded, so the result keeps its sensitivities.
  const plain = A.ratio !== undefined;
  let last = false;
  for (;;) {
    if (++steps > MAX_STEPS)
      throw new QuadspreadError('NOT_CONVERGED', w, `no convergence in ${MAX_STEPS} steps`);
    if (A.exact && steps > 1) {
      x = round(x);
      y = round(y);
      o = round(o);
      mu = round(mu);
    }
    N = Array.from({ length: unknowns }, () => Array<T>(unknowns).fill(A.zero));
    const b = Array.from({ length: unknowns }, () => [A.zero]);
    let reach = A.one;
    for (const r of rows(A, obs, x, y, o, mu, perRad, free)) {
      const pw = r.dir ? pD : pS;
      r.a = r.a.map(round);
      for (let i = 0; i < unknowns; i++) {
        b[i]![0] = A.add(b[i]![0]!, A.mul(A.mul(r.a[i]!, pw), last ? r.w : round(r.w)));
        for (let j = 0; j < unknowns; j++)
          N[i]![j] = A.add(N[i]![j]!, A.mul(A.mul(r.a[i]!, pw), r.a[j]!));
      }
      if (A.cmp(r.d, reach) > 0) reach = r.d;
    }
    const d = solveDense(A, N, b, w).map((r) => r[0]!);
    x = A.add(x, d[0]!);
    y = A.add(y, d[1]!);
    o = A.add(o, A.div(d[2]!, perRad));
    if (free) mu = A.add(mu, d[3]!);
    // The step in metres: the position, the orientation over the longest sight, the scale likewise.
    let size = A.cmp(A.abs(d[0]!), A.abs(d[1]!)) > 0 ? A.abs(d[0]!) : A.abs(d[1]!);
    for (const extra of [A.mul(A.abs(d[2]!), reach), free ? A.mul(A.abs(d[3]!), reach) : A.zero])
      if (A.cmp(extra, size) > 0) size = extra;
    if (last) break;
    if (A.cmp(size, A.mul(tol, reach)) <= 0) {
      if (!A.exact || plain) break;
      last = true;
    }
  }
  if (plain) {
    x = round(x);
    y = round(y);
    o = round(o);
    mu = round(mu);
  }
  o = turn(A, o, w);
  // Residuals from the solution rounded to 40 digits in an exact arithmetic (reports only).
  const [rx, ry, ro, rmu] = [x, y, o, mu].map(round) as [T, T, T, T];
  const Q = solveDense(
    A,
    N,
    N.map((_, i) => N.map((__, j) => (i === j ? A.one : A.zero))),
    w,
  );
  // Residuals and vᵀPv at the solution.
  let vpv = A.zero;
  const residuals: FreeStationResidual<T>[] = [];
  const levels: T[] = [];
  for (const ob of obs)
    if (ob.dh !== undefined && ob.p.z !== undefined) levels.push(A.sub(ob.p.z, ob.dh));
  const z = levels.length
    ? A.div(
        levels.reduce((s, v) => A.add(s, v)),
        A.from(levels.length),
      )
    : undefined;
  for (const ob of obs) {
    const dx = A.sub(ob.p.x, rx);
    const dy = A.sub(ob.p.y, ry);
    let r: FreeStationResidual<T> = { name: ob.name };
    if (ob.c !== undefined) {
      const v = halfTurn(A, A.sub(A.sub(azimuthOf(A, dx, dy), ro), ob.c), ob.at); // computed − observed
      vpv = A.add(vpv, A.mul(pDir, sq(A, A.mul(v, perRad))));
      r = { ...r, angleResidual: A.mul(v, A.from(ARCSEC)) };
    }
    if (ob.D !== undefined) {
      const v = A.sub(ob.D, A.mul(rmu, root(A, A.add(sq(A, dx), sq(A, dy))))); // measured − computed
      vpv = A.add(vpv, A.mul(pDist, sq(A, v)));
      r = { ...r, distanceResidual: v };
    }
    if (z !== undefined && ob.dh !== undefined && ob.p.z !== undefined)
      r = { ...r, heightResidual: A.sub(A.add(z, ob.dh), ob.p.z) };
    residuals.push(r);
  }
  const redundancy = nDir + nDist - unknowns;
  const factor = redundancy > 0 ? A.div(vpv, A.from(redundancy)) : undefined;
  const s = (i: number) => root(A, A.abs(A.mul(factor ?? A.one, Q[i]![i]!)));
  const million = A.from(1000000);
  return {
    station: z === undefined ? { x, y } : { x, y, z },
    instrumentHeight: hi,
    orientation: o,
    ...(free ? { scale: A.mul(A.sub(A.div(A.one, mu), A.one), million) } : {}), // 1 + m = 1/μ
    sigma: {
      x: s(0),
      y: s(1),
      orientation: A.div(A.mul(s(2), A.from(ARCSEC)), perRad),
      ...(free ? { scale: A.div(A.mul(s(3), million), sq(A, mu)) } : {}),
    },
    redundancy,
    ...(factor !== undefined ? { varianceFactor: factor } : {}),
    backsights: obs.filter((b) => b.c !== undefined).map((b) => ({ name: b.name, circle: b.c! })),
    residuals,
    iterations: steps,
  };
}

/** A control point's name (text or a number), or `control <i + 1>` when absent (i ≥ 0). */
function controlName(name: unknown, i: number, where: string): string {
  if (name === undefined && i >= 0) return `control ${i + 1}`;
  if (typeof name === 'string') return name;
  if (typeof name === 'number' && Number.isFinite(name)) return String(name);
  throw invalidArgument(where, `${show(name)} is not a name (text)`);
}

function sq<T>(A: Arithmetic<T>, v: T): T {
  return A.mul(v, v);
}

function positive<T>(A: Arithmetic<T>, x: Numeric<T>, where: string): T {
  const v = readNumber(A, x, where);
  if (A.sign(v) <= 0) throw invalidArgument(where, `${show(x)} is not a positive σ`);
  return v;
}

/**
 * The linearised observation equations at (x, y, o, μ): for a direction, computed
 * ĉ = α − o with ∂ĉ/∂x = −Δy/Q, ∂ĉ/∂y = Δx/Q, ∂ĉ/∂o = −1 (radians); for a distance,
 * computed D̂ = μ·d with ∂D̂/∂x = −μΔx/d, ∂D̂/∂y = −μΔy/d, ∂D̂/∂μ = d. w = observed − computed.
 */
function rows<T>(
  A: Arithmetic<T>,
  obs: Obs<T>[],
  x: T,
  y: T,
  o: T,
  mu: T,
  perRad: T,
  free: boolean,
): { a: T[]; w: T; dir: boolean; d: T }[] {
  const out: { a: T[]; w: T; dir: boolean; d: T }[] = [];
  for (const ob of obs) {
    const dx = A.sub(ob.p.x, x);
    const dy = A.sub(ob.p.y, y);
    const Q = A.add(sq(A, dx), sq(A, dy));
    if (A.isZero(Q))
      throw new QuadspreadError(
        'INCONSISTENT_READINGS',
        ob.at,
        'the solution fell on a control point',
      );
    const d = root(A, Q);
    if (ob.c !== undefined) {
      const wv = A.mul(halfTurn(A, A.sub(A.add(ob.c, o), azimuthOf(A, dx, dy)), ob.at), perRad);
      const a = [A.neg(A.div(dy, Q)), A.div(dx, Q), A.neg(A.one)];
      out.push({ a: free ? [...a, A.zero] : a, w: wv, dir: true, d });
    }
    if (ob.D !== undefined) {
      const a = [A.neg(A.div(A.mul(mu, dx), d)), A.neg(A.div(A.mul(mu, dy), d)), A.zero];
      out.push({ a: free ? [...a, d] : a, w: A.sub(ob.D, A.mul(mu, d)), dir: false, d });
    }
  }
  return out;
}

interface Num {
  x: number;
  y: number;
  c?: number;
  D?: number;
  name: string;
}

function numbers<T>(A: Arithmetic<T>, o: Obs<T>): Num {
  return {
    name: o.name,
    x: A.toNumber(o.p.x),
    y: A.toNumber(o.p.y),
    ...(o.c !== undefined ? { c: A.toNumber(o.c) } : {}),
    ...(o.D !== undefined ? { D: A.toNumber(o.D) } : {}),
  };
}

const RAD = Math.PI / 180;

/** The mean of αᵢ − cᵢ over the directions, about the first, in degrees; and its spread. */
function orientationAt(obs: Num[], x: number, y: number): { o: number; misfit: number } {
  const own = obs
    .filter((b) => b.c !== undefined)
    .map((b) => Math.atan2(b.x - x, b.y - y) / RAD - b.c!);
  const first = own[0]!;
  const diffs = own.map((v) => ((((v - first) % 360) + 540) % 360) - 180);
  const mean = diffs.reduce((s, v) => s + v, 0) / diffs.length;
  return { o: first + mean, misfit: diffs.reduce((s, v) => s + (v - mean) ** 2, 0) };
}

/** A direct solution for the start, in JS numbers. */
function start(obs: Num[], w: string): { x: number; y: number; o: number; mu: number } {
  // Two points with direction and distance: the similarity transformation from the
  // instrument's frame (north = circle zero) to the control's, in complex numbers north + i·east.
  const both = obs.filter((b) => b.c !== undefined && b.D !== undefined);
  const two = both.find((b) => b.name !== both[0]?.name);
  if (two !== undefined) {
    const one = both[0]!;
    const L = (b: Num) => [b.D! * Math.cos(b.c! * RAD), b.D! * Math.sin(b.c! * RAD)] as const;
    const [l1n, l1e] = L(one);
    const [l2n, l2e] = L(two);
    const [pn, pe] = [one.y - two.y, one.x - two.x];
    const [ln, le] = [l1n - l2n, l1e - l2e];
    const den = ln * ln + le * le;
    if (den > 0) {
      const kn = (pn * ln + pe * le) / den; // (P1 − P2)/(L1 − L2)
      const ke = (pe * ln - pn * le) / den;
      const y = one.y - (kn * l1n - ke * l1e);
      const x = one.x - (kn * l1e + ke * l1n);
      return { x, y, o: Math.atan2(ke, kn) / RAD, mu: 1 / Math.hypot(kn, ke) };
    }
  }
  // Three directions: resection.
  const dirs = obs.filter((b) => b.c !== undefined);
  const distinct = dirs.filter((b, i) => dirs.findIndex((c) => c.name === b.name) === i);
  if (distinct.length >= 3) {
    const [a, b, c] = distinct as [Num, Num, Num];
    const ang = (u: Num, v: Num) => (((v.c! - u.c!) % 360) + 360) % 360;
    try {
      const r = resection(float, {
        control: [a, b, c],
        angles: [ang(a, b), ang(b, c)],
        dangerTolerance: 0,
      });
      return { ...r.station, o: orientationAt(obs, r.station.x, r.station.y).o, mu: 1 };
    } catch (e) {
      if (!(e instanceof QuadspreadError)) throw e;
    }
  }
  // Two distances: the two intersections of the circles; keep the one the directions fit.
  const dists = obs.filter((b) => b.D !== undefined);
  const other = dists.find((b) => b.name !== dists[0]?.name);
  if (other !== undefined) {
    const p = dists[0]!;
    const dx = other.x - p.x;
    const dy = other.y - p.y;
    const d2 = dx * dx + dy * dy;
    const along = (p.D! ** 2 - other.D! ** 2 + d2) / (2 * d2);
    const h2 = p.D! ** 2 / d2 - along * along;
    const h = Math.sqrt(Math.max(0, h2));
    const cands = [1, -1].map((s) => ({
      x: p.x + along * dx - s * h * dy,
      y: p.y + along * dy + s * h * dx,
    }));
    const fits = cands.map((c) => orientationAt(obs, c.x, c.y));
    const enough = new Set(dirs.map((b) => b.name)).size >= 2;
    if (
      h === 0 ||
      (enough && Math.abs(fits[0]!.misfit - fits[1]!.misfit) > 1e-12 * (1 + fits[0]!.misfit))
    ) {
      const k = h === 0 || fits[0]!.misfit <= fits[1]!.misfit ? 0 : 1;
      return { ...cands[k]!, o: fits[k]!.o, mu: 1 };
    }
    throw new QuadspreadError(
      'INCONSISTENT_READINGS',
      w,
      'two stations fit these observations equally: observe a direction to a further control point',
    );
  }
  throw new QuadspreadError(
    'INCONSISTENT_READINGS',
    w,
    'the observations do not fix the station: give two points with direction and distance, three directions, or two distances and directions to two points',
  );
}
