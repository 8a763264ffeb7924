/**
 * Least-squares adjustment of a plane survey network (x = east, y = north): distances,
 * bearings, angles, direction rounds and coordinate-difference vectors, by Gauss–Newton
 * iteration, with standard and confidence error ellipses, relative ellipses and the tests of
 * every observation.
 *
 * @module adjustment
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { surd } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';
import { angleToDegrees } from '../readings/angle.js';
import { approxSqrt } from '../readings/numeric.js';
import { readArray } from '../cogo/internal.js';
import { solveGroups, observationStatistics, type OrderMemo } from './least-squares.js';
import type { ObservationGroup } from './least-squares.js';
import { solveNormal } from './normal-equations.js';
import { readTestOptions, assess, nonNegative, sigmaRoot } from './testing.js';
import type { TestOptions, GlobalTest, LocalTest, ObservationTest } from './testing.js';
import { readName, readSigma, requireConnected } from './names.js';
import { approximateCoordinates } from './approximate.js';
import type { RoughObservation } from './approximate.js';
import { snoop } from './snooping.js';
import type { SnoopingReport } from './snooping.js';
import { chiSquareQuantile, fQuantile } from './statistics.js';

/** A point of a plane network: coordinates (m) if known or approximate, and whether it is fixed. */
export interface NetworkPointInput<T> {
  /** East, m; may be omitted for a new point (then computed from the observations). */
  readonly x?: Numeric<T>;
  /** North, m. */
  readonly y?: Numeric<T>;
  /** `true`: held; `{ sigmaX, sigmaY }`: a weighted control point (σ in m). */
  readonly fixed?: true | { readonly sigmaX: Numeric<T>; readonly sigmaY: Numeric<T> };
}

/** A distance's σ: metres, or `{ constant, ppm }` (σ² = constant² + (ppm·10⁻⁶·D)²). */
export type DistanceSigma<T> =
  Numeric<T> | { readonly constant: Numeric<T>; readonly ppm?: Numeric<T> };

/** One observation of a plane network. Angles in degrees or DMS text; their σ in arc-seconds. */
export type NetworkObservationInput<T> =
  | {
      readonly kind: 'distance';
      readonly from: string;
      readonly to: string;
      /** Horizontal distance, m. */
      readonly value: Numeric<T>;
      readonly sigma: DistanceSigma<T>;
      /** Centring σ of instrument and target (m), added in quadrature. */
      readonly centring?: { readonly instrument?: Numeric<T>; readonly target?: Numeric<T> };
    }
  | {
      readonly kind: 'bearing';
      readonly from: string;
      readonly to: string;
      /** Azimuth, clockwise from grid north. */
      readonly value: Numeric<T>;
      readonly sigma: Numeric<T>;
    }
  | {
      readonly kind: 'angle';
      readonly at: string;
      readonly from: string;
      readonly to: string;
      /** Clockwise from the direction to `from` to the direction to `to`. */
      readonly value: Numeric<T>;
      readonly sigma: Numeric<T>;
    }
  | {
      readonly kind: 'direction';
      readonly at: string;
      readonly to: string;
      /** Circle reading; one orientation unknown per station and `set`. */
      readonly value: Numeric<T>;
      readonly sigma: Numeric<T>;
      readonly set?: string;
    }
  | {
      readonly kind: 'vector';
      readonly from: string;
      readonly to: string;
      /** x(to) − x(from), m. */
      readonly dx: Numeric<T>;
      /** y(to) − y(from), m. */
      readonly dy: Numeric<T>;
      /** [[σx², σxy], [σxy, σy²]] in m². */
      readonly covariance: readonly (readonly Numeric<T>[])[];
    };

/** Options of {@link adjustNetwork}. */
export interface NetworkOptions<T> extends TestOptions<T> {
  /** Largest coordinate correction (m) of the last iteration; default 1e-7. */
  readonly tolerance?: Numeric<T>;
  /** Iterations allowed; default 20. */
  readonly maxIterations?: number;
  /** Probability of the confidence ellipses; default 0.95. */
  readonly confidence?: number;
  /** Pairs of points for relative ellipses. */
  readonly relative?: readonly (readonly [string, string])[];
  /** Iterative data snooping. */
  readonly snooping?: boolean;
}

/** Input of {@link adjustNetwork}. */
export interface NetworkInput<T> {
  readonly points: Readonly<Record<string, NetworkPointInput<T>>>;
  readonly observations: readonly NetworkObservationInput<T>[];
  readonly options?: NetworkOptions<T>;
}

/** An error ellipse: semi-axes (m) and the azimuth of the major axis (degrees in [0, 180)). */
export interface ErrorEllipse<T, E extends boolean> {
  /** Semi-major axis, m (in `rational` within 1e-40 relative of the root of majorSquared). */
  readonly major: T;
  readonly minor: T;
  /** Azimuth of the major axis, degrees clockwise from grid north, in [0°, 180°). */
  readonly azimuth: T;
  /** major², exactly: f·((qxx + qyy)/2 + √(((qyy − qxx)/2)² + qxy²)). */
  readonly majorSquared: Root<T, E>;
  readonly minorSquared: Root<T, E>;
}

/** A confidence ellipse: the standard ellipse scaled by `factor`. */
export interface ConfidenceEllipse<T> {
  readonly level: number;
  /** √χ²(2, p) (a-priori) or √(2·F(2, r, p)) (a-posteriori). */
  readonly factor: number;
  readonly major: T;
  readonly minor: T;
  readonly azimuth: T;
}

/** An adjusted point. */
export interface AdjustedPoint<T, E extends boolean> {
  readonly x: T;
  readonly y: T;
  readonly sigmaX: Root<T, E>;
  readonly sigmaY: Root<T, E>;
  readonly ellipse: ErrorEllipse<T, E>;
  readonly confidence: ConfidenceEllipse<T>;
  readonly held: boolean;
  /** Whether its starting coordinates were computed from the observations. */
  readonly approximated: boolean;
}

/** An adjusted observation (a vector gives two: components `'dx'` and `'dy'`). */
export interface AdjustedNetworkObservation<T, E extends boolean> extends ObservationTest<T, E> {
  readonly kind: 'distance' | 'bearing' | 'angle' | 'direction' | 'vector' | 'control';
  /** Index in the input, or −1 for a weighted control point's pseudo-observation. */
  readonly index: number;
  /** For a vector: `'dx'` or `'dy'`; for a control point `'x'` or `'y'`. */
  readonly component?: 'dx' | 'dy' | 'x' | 'y';
  /** Station or `from`, and target; for a control point, its name in both. */
  readonly from: string;
  readonly to: string;
  readonly at?: string;
  /** As observed (m, or degrees). */
  readonly observed: T;
  /** adjusted − observed: m, or arc-seconds for angular observations. */
  readonly residual: T;
  /** Adjusted value (m, or degrees). */
  readonly adjusted: T;
  /** The unit of residual, σ and MDB. */
  readonly unit: 'm' | 'arcsec';
}

/** A relative error ellipse between two points. */
export interface RelativeEllipse<T, E extends boolean> extends ErrorEllipse<T, E> {
  readonly from: string;
  readonly to: string;
  readonly confidence: ConfidenceEllipse<T>;
}

/** What {@link adjustNetwork} returns. */
export interface NetworkAdjustment<T, E extends boolean> {
  readonly points: Readonly<Record<string, AdjustedPoint<T, E>>>;
  readonly observations: AdjustedNetworkObservation<T, E>[];
  readonly relative: RelativeEllipse<T, E>[];
  /** Orientation unknowns of the direction rounds: station/set → degrees. */
  readonly orientations: Readonly<Record<string, T>>;
  readonly dof: number;
  readonly vtpv: T;
  readonly varianceFactor: T | undefined;
  readonly sigma0: Root<T, E> | undefined;
  readonly scale: 'a-priori' | 'a-posteriori';
  readonly globalTest: GlobalTest<T> | undefined;
  readonly localTest: LocalTest;
  /** Gauss–Newton iterations taken. */
  readonly iterations: number;
  readonly snooping?: SnoopingReport<T, E>;
}

const WHERE = 'adjustNetwork(A, input)';

type Obs<T> =
  | { kind: 'distance'; from: number; to: number; value: T; q: T; index: number }
  | { kind: 'bearing'; from: number; to: number; value: T; q: T; index: number }
  | { kind: 'angle'; at: number; from: number; to: number; value: T; q: T; index: number }
  | { kind: 'direction'; at: number; to: number; value: T; q: T; set: number; index: number }
  | { kind: 'vector'; from: number; to: number; dx: T; dy: T; cov: T[][]; index: number };

interface Parsed<T> {
  names: string[];
  xy: (T[] | undefined)[];
  approximated: boolean[];
  held: boolean[];
  weighted: (T[] | undefined)[];
  obs: Obs<T>[];
  sets: string[];
  options: NetworkOptions<T>;
}

function point<T>(
  A: Arithmetic<T>,
  P: Parsed<T>,
  index: Map<string, number>,
  x: unknown,
  at: string,
): number {
  const name = readName(x, at);
  const i = index.get(name);
  if (i === undefined)
    throw new QuadspreadError(
      'UNKNOWN_POINT',
      at,
      `${JSON.stringify(name)} is not one of the points`,
    );
  return i;
}

function parse<T>(A: Arithmetic<T>, input: NetworkInput<T>): Parsed<T> {
  expectObject(input, WHERE, '{ points, observations, options? }');
  expectObject(input.points, `${WHERE} points`, '{ name: { x, y, fixed? } }');
  const options: NetworkOptions<T> = input.options ?? {};
  expectObject(options, `${WHERE} options`, 'an options object');
  const P: Parsed<T> = {
    names: [],
    xy: [],
    approximated: [],
    held: [],
    weighted: [],
    obs: [],
    sets: [],
    options,
  };
  const index = new Map<string, number>();
  for (const [name, p] of Object.entries(input.points)) {
    const at = `${WHERE} points[${JSON.stringify(name)}]`;
    readName(name, at);
    expectObject(p, at, '{ x?, y?, fixed? }');
    index.set(name, P.names.length);
    P.names.push(name);
    const has = p.x !== undefined || p.y !== undefined;
    if (has && (p.x === undefined || p.y === undefined))
      throw invalidArgument(at, 'give both x and y, or neither');
    P.xy.push(has ? [readNumber(A, p.x!, `${at}.x`), readNumber(A, p.y!, `${at}.y`)] : undefined);
    P.approximated.push(!has);
    const f = p.fixed;
    if (f !== undefined && f !== true && (f === null || typeof f !== 'object'))
      throw invalidArgument(`${at}.fixed`, `${show(f)} is not true or { sigmaX, sigmaY }`);
    if (f !== undefined && !has) throw invalidArgument(at, 'a fixed point needs its x and y');
    P.held.push(f === true);
    P.weighted.push(
      f !== undefined && f !== true
        ? [
            readSigma(A, f.sigmaX, `${at}.fixed.sigmaX`),
            readSigma(A, f.sigmaY, `${at}.fixed.sigmaY`),
          ]
        : undefined,
    );
  }
  const t = readTestOptions(A, options, `${WHERE} options`);
  const s02 = A.mul(t.sigma0, t.sigma0);
  const list = readArray<NetworkObservationInput<T>>(input.observations, `${WHERE} observations`);
  const setIndex = new Map<string, number>();
  const setCount: number[] = [];
  list.forEach((o, k) => {
    const at = `${WHERE} observations[${k}]`;
    expectObject(o, at, 'an observation { kind, … }');
    const pt = (field: string): number =>
      point(A, P, index, (o as unknown as Record<string, unknown>)[field], `${at}.${field}`);
    const angular = (v: Numeric<T>, s: Numeric<T>): [T, T] => {
      const sig = readSigma(A, s, `${at}.sigma`);
      return [angleToDegrees(A, readAngleInput(v, `${at}.value`)), A.div(A.mul(sig, sig), s02)];
    };
    const distinct = (a: number, b: number): void => {
      if (a === b)
        throw invalidArgument(at, `an observation from ${JSON.stringify(P.names[a])} to itself`);
    };
    switch (o.kind) {
      case 'distance': {
        const from = pt('from');
        const to = pt('to');
        distinct(from, to);
        const value = readNumber(A, o.value, `${at}.value`);
        if (A.sign(value) <= 0)
          throw invalidArgument(`${at}.value`, `${A.toString(value)} m is not a positive distance`);
        let variance: T;
        const s = o.sigma;
        if (s !== null && typeof s === 'object' && 'constant' in s) {
          const c = readSigma(A, s.constant, `${at}.sigma.constant`);
          const ppm = s.ppm === undefined ? A.zero : readNumber(A, s.ppm, `${at}.sigma.ppm`);
          if (A.sign(ppm) < 0)
            throw new QuadspreadError('INVALID_SIGMA', `${at}.sigma.ppm`, 'negative');
          // σ² = c² + (ppm·10⁻⁶·D)² (the usual EDM specification, common practice)
          const p = A.div(A.mul(ppm, value), A.from(1_000_000));
          variance = A.add(A.mul(c, c), A.mul(p, p));
        } else {
          const c = readSigma(A, s as Numeric<T>, `${at}.sigma`);
          variance = A.mul(c, c);
        }
        if (o.centring !== undefined) {
          expectObject(o.centring, `${at}.centring`, '{ instrument?, target? }');
          for (const key of ['instrument', 'target'] as const) {
            const c = o.centring[key];
            if (c === undefined) continue;
            const v = readNumber(A, c, `${at}.centring.${key}`);
            if (A.sign(v) < 0)
              throw new QuadspreadError('INVALID_SIGMA', `${at}.centring.${key}`, 'negative');
            variance = A.add(variance, A.mul(v, v));
          }
        }
        P.obs.push({ kind: 'distance', from, to, value, q: A.div(variance, s02), index: k });
        break;
      }
      case 'bearing': {
        const from = pt('from');
        const to = pt('to');
        distinct(from, to);
        const [value, q] = angular(o.value, o.sigma);
        P.obs.push({ kind: 'bearing', from, to, value, q, index: k });
        break;
      }
      case 'angle': {
        const at_ = pt('at');
        const from = pt('from');
        const to = pt('to');
        distinct(at_, from);
        distinct(at_, to);
        if (from === to) throw invalidArgument(at, 'an angle between a direction and itself');
        const [value, q] = angular(o.value, o.sigma);
        P.obs.push({ kind: 'angle', at: at_, from, to, value, q, index: k });
        break;
      }
      case 'direction': {
        const st = pt('at');
        const to = pt('to');
        distinct(st, to);
        const [value, q] = angular(o.value, o.sigma);
        const key = `${P.names[st]}#${o.set === undefined ? '' : String(o.set)}`;
        let set = setIndex.get(key);
        if (set === undefined) {
          set = setCount.length;
          setIndex.set(key, set);
          setCount.push(0);
          P.sets.push(o.set === undefined ? P.names[st]! : `${P.names[st]}/${String(o.set)}`);
        }
        setCount[set]!++;
        P.obs.push({ kind: 'direction', at: st, to, value, q, set, index: k });
        break;
      }
      case 'vector': {
        const from = pt('from');
        const to = pt('to');
        distinct(from, to);
        const c = readArray<readonly Numeric<T>[]>(o.covariance, `${at}.covariance`);
        if (
          c.length !== 2 ||
          !Array.isArray(c[0]) ||
          !Array.isArray(c[1]) ||
          c[0].length !== 2 ||
          c[1].length !== 2
        )
          throw new QuadspreadError(
            'INVALID_COVARIANCE',
            `${at}.covariance`,
            'is not a 2 × 2 matrix [[σx², σxy], [σxy, σy²]]',
          );
        const cov = [0, 1].map((r) =>
          [0, 1].map((s) => A.div(readNumber(A, c[r]![s]!, `${at}.covariance[${r}][${s}]`), s02)),
        );
        const det = A.sub(A.mul(cov[0]![0]!, cov[1]![1]!), A.mul(cov[0]![1]!, cov[1]![0]!));
        if (!A.eq(cov[0]![1]!, cov[1]![0]!) || A.sign(cov[0]![0]!) <= 0 || A.sign(det) <= 0)
          throw new QuadspreadError(
            'INVALID_COVARIANCE',
            `${at}.covariance`,
            'is not symmetric positive definite',
          );
        P.obs.push({
          kind: 'vector',
          from,
          to,
          dx: readNumber(A, o.dx, `${at}.dx`),
          dy: readNumber(A, o.dy, `${at}.dy`),
          cov,
          index: k,
        });
        break;
      }
      default:
        throw invalidArgument(
          `${at}.kind`,
          `${show((o as { kind?: unknown }).kind)} is not 'distance', 'bearing', 'angle', 'direction' or 'vector'`,
        );
    }
  });
  setCount.forEach((c, s) => {
    if (c < 2)
      throw new QuadspreadError(
        'TOO_FEW_OBSERVATIONS',
        `${WHERE} observations`,
        `the direction round ${JSON.stringify(P.sets[s])} has one direction: a round needs two or more`,
      );
  });
  return P;
}

function readAngleInput<T>(v: Numeric<T>, where: string): Numeric<T> {
  if (v === undefined || v === null) throw invalidArgument(where, `${show(v)} is not an angle`);
  return v;
}

/** Wraps an angle difference in arc-seconds into (−648000, 648000]. */
function wrapArcsec<T>(A: Arithmetic<T>, x: T): T {
  const full = A.from(1_296_000);
  const half = A.from(648_000);
  let r = x;
  for (let i = 0; i < 8 && A.cmp(r, half) > 0; i++) r = A.sub(r, full);
  for (let i = 0; i < 8 && A.cmp(r, A.neg(half)) <= 0; i++) r = A.add(r, full);
  return r;
}

interface Linearised<T> {
  groups: ObservationGroup<T>[];
  meta: {
    kind: AdjustedNetworkObservation<T, boolean>['kind'];
    index: number;
    component?: 'dx' | 'dy' | 'x' | 'y';
    from: number;
    to: number;
    at?: number;
    observed: T;
    angular: boolean;
  }[];
}

/** Design rows and reduced observations at the coordinates xy and orientations w (degrees). */
function linearise<T>(
  A: Arithmetic<T>,
  P: Parsed<T>,
  active: readonly boolean[],
  xy: T[][],
  w: T[],
  ux: Int32Array,
  uw: Int32Array,
  s02: T,
): Linearised<T> {
  const rho = A.div(A.from(648_000), A.pi); // arc-seconds per radian
  const toDeg = A.div(A.from(180), A.pi);
  const groups: ObservationGroup<T>[] = [];
  const meta: Linearised<T>['meta'] = [];
  const one = A.one;
  // In an exact arithmetic the coefficients and reduced observations are kept to 24
  // significant digits: the linearisation needs no more, and Σr = dof and AᵀPv = 0 hold
  // exactly for whatever design is used.
  const short = (v: T): T => (A.exact && !A.isZero(v) ? A.from(A.toPrecision(v, 24)) : v);
  const single = (index: number[], row: T[], q: T, l: T): void => {
    groups.push({
      index,
      rows: [row.map(short)],
      cofactor: [[q]],
      weight: [[A.div(one, q)]],
      l: [short(l)],
    });
  };
  // Bearing (degrees) and its derivatives (arcsec per metre) for the line i → j.
  const line = (i: number, j: number) => {
    const dx = A.sub(xy[j]![0]!, xy[i]![0]!);
    const dy = A.sub(xy[j]![1]!, xy[i]![1]!);
    const q = A.add(A.mul(dx, dx), A.mul(dy, dy));
    if (A.isZero(q))
      throw new QuadspreadError(
        'COINCIDENT_POINTS',
        WHERE,
        `${JSON.stringify(P.names[i])} and ${JSON.stringify(P.names[j])} have the same coordinates`,
      );
    let az = A.mul(A.atan2(dx, dy), toDeg);
    if (A.sign(az) < 0) az = A.add(az, A.from(360));
    // ∂α/∂x_j = ρ·dy/Q, ∂α/∂y_j = −ρ·dx/Q (bearing clockwise from north)
    return { dx, dy, q, az, ax: A.div(A.mul(rho, dy), q), ay: A.neg(A.div(A.mul(rho, dx), q)) };
  };
  // Adds coefficient c for unknown u (skipping held coordinates).
  const put = (idx: number[], row: T[], u: number, c: T): void => {
    if (u < 0) return;
    const k = idx.indexOf(u);
    if (k >= 0) row[k] = A.add(row[k]!, c);
    else {
      idx.push(u);
      row.push(c);
    }
  };
  const s3600 = A.from(3600);
  P.obs.forEach((o) => {
    if (!active[o.index]) return;
    const idx: number[] = [];
    const row: T[] = [];
    if (o.kind === 'distance') {
      const g = line(o.from, o.to);
      const d = approxSqrt(A, g.q);
      const cx = A.div(g.dx, d);
      const cy = A.div(g.dy, d);
      put(idx, row, ux[o.to]!, cx);
      put(idx, row, ux[o.to]! < 0 ? -1 : ux[o.to]! + 1, cy);
      put(idx, row, ux[o.from]!, A.neg(cx));
      put(idx, row, ux[o.from]! < 0 ? -1 : ux[o.from]! + 1, A.neg(cy));
      single(idx, row, o.q, A.sub(o.value, d));
      meta.push({
        kind: 'distance',
        index: o.index,
        from: o.from,
        to: o.to,
        observed: o.value,
        angular: false,
      });
      return;
    }
    if (o.kind === 'vector') {
      const rows: T[][] = [[], []];
      const index: number[] = [];
      for (const [p, sgn] of [
        [o.to, one],
        [o.from, A.neg(one)],
      ] as const) {
        if (ux[p]! < 0) continue;
        index.push(ux[p]!, ux[p]! + 1);
        rows[0]!.push(sgn, A.zero);
        rows[1]!.push(A.zero, sgn);
      }
      const cx = A.sub(xy[o.to]![0]!, xy[o.from]![0]!);
      const cy = A.sub(xy[o.to]![1]!, xy[o.from]![1]!);
      const [[a, b], [c, d]] = o.cov as [[T, T], [T, T]];
      const det = A.sub(A.mul(a, d), A.mul(b, c));
      const weight = [
        [A.div(d, det), A.neg(A.div(b, det))],
        [A.neg(A.div(c, det)), A.div(a, det)],
      ];
      groups.push({ index, rows, cofactor: o.cov, weight, l: [A.sub(o.dx, cx), A.sub(o.dy, cy)] });
      meta.push({
        kind: 'vector',
        index: o.index,
        component: 'dx',
        from: o.from,
        to: o.to,
        observed: o.dx,
        angular: false,
      });
      meta.push({
        kind: 'vector',
        index: o.index,
        component: 'dy',
        from: o.from,
        to: o.to,
        observed: o.dy,
        angular: false,
      });
      return;
    }
    const add = (i: number, j: number, sign: 1 | -1) => {
      const g = line(i, j);
      const s = sign === 1 ? one : A.neg(one);
      put(idx, row, ux[j]!, A.mul(s, g.ax));
      put(idx, row, ux[j]! < 0 ? -1 : ux[j]! + 1, A.mul(s, g.ay));
      put(idx, row, ux[i]!, A.neg(A.mul(s, g.ax)));
      put(idx, row, ux[i]! < 0 ? -1 : ux[i]! + 1, A.neg(A.mul(s, g.ay)));
      return g.az;
    };
    let computed: T;
    if (o.kind === 'bearing') computed = add(o.from, o.to, 1);
    else if (o.kind === 'angle') computed = A.sub(add(o.at, o.to, 1), add(o.at, o.from, -1));
    else {
      computed = A.sub(add(o.at, o.to, 1), w[o.set]!);
      put(idx, row, uw[o.set]!, A.neg(one));
    }
    const l = wrapArcsec(A, A.mul(A.sub(o.value, computed), s3600));
    single(idx, row, o.q, l);
    meta.push({
      kind: o.kind,
      index: o.index,
      from: o.kind === 'direction' ? o.at : o.kind === 'angle' ? o.from : o.from,
      to: o.to,
      ...(o.kind === 'bearing' ? {} : { at: o.at }),
      observed: o.value,
      angular: true,
    });
  });
  // Weighted control points: x = given, y = given.
  P.weighted.forEach((s, i) => {
    if (s === undefined) return;
    for (const c of [0, 1] as const) {
      const q = A.div(A.mul(s[c]!, s[c]!), s02);
      single([ux[i]! + c], [one], q, A.sub(P.xy[i]![c]!, xy[i]![c]!));
      meta.push({
        kind: 'control',
        index: -1,
        component: c === 0 ? 'x' : 'y',
        from: i,
        to: i,
        observed: P.xy[i]![c]!,
        angular: false,
      });
    }
  });
  return { groups, meta };
}

function ellipse<T, E extends boolean>(
  A: Arithmetic<T, E>,
  f: T,
  qxx: T,
  qyy: T,
  qxy: T,
): ErrorEllipse<T, E> {
  const two = A.from(2);
  const mean = A.div(A.add(qxx, qyy), two);
  const half = A.div(A.sub(qyy, qxx), two);
  const d2 = A.add(A.mul(half, half), A.mul(qxy, qxy));
  // semi-axes² = f·((qxx + qyy)/2 ± √(((qyy − qxx)/2)² + qxy²)) (e.g. Ghilani & Wolf 2006, ch. 19)
  let majorSquared: Root<T, E>;
  let minorSquared: Root<T, E>;
  let major: T;
  let minor: T;
  if (A.exact) {
    const M = surd(A, A.mul(f, mean), f, d2);
    const m = surd(A, A.mul(f, mean), A.neg(f), d2);
    majorSquared = M as Root<T, E>;
    minorSquared = m as Root<T, E>;
    const num = (s: typeof M): T => {
      const v = A.from(s.toPrecision(60));
      return A.sign(v) <= 0 ? A.zero : approxSqrt(A, v);
    };
    major = num(M);
    minor = num(m);
  } else {
    const r = A.sqrt(d2)!;
    const M = A.mul(f, A.add(mean, r));
    const m = nonNegative(A, A.mul(f, A.sub(mean, r)));
    majorSquared = M as Root<T, E>;
    minorSquared = m as Root<T, E>;
    major = A.isZero(M) ? A.zero : A.sqrt(M)!;
    minor = A.isZero(m) ? A.zero : A.sqrt(m)!;
  }
  // azimuth t of the major axis: tan 2t = 2·qxy/(qyy − qxx), t from north clockwise
  let azimuth = A.zero;
  if (!A.isZero(qxy) || !A.eq(qxx, qyy)) {
    azimuth = A.div(A.mul(A.atan2(A.mul(two, qxy), A.sub(qyy, qxx)), A.from(90)), A.pi);
    if (A.sign(azimuth) < 0) azimuth = A.add(azimuth, A.from(180));
    if (A.cmp(azimuth, A.from(180)) >= 0) azimuth = A.sub(azimuth, A.from(180));
  }
  return { major, minor, azimuth, majorSquared, minorSquared };
}

function scaled<T>(
  A: Arithmetic<T>,
  e: { major: T; minor: T; azimuth: T },
  level: number,
  factor: number,
): ConfidenceEllipse<T> {
  const k = A.from(factor);
  return { level, factor, major: A.mul(k, e.major), minor: A.mul(k, e.minor), azimuth: e.azimuth };
}

type Once<T, E extends boolean> = NetworkAdjustment<T, E> & { w2: (T | undefined)[] };

function adjustOnce<T, E extends boolean>(
  A: Arithmetic<T, E>,
  P: Parsed<T>,
  active: readonly boolean[],
): Once<T, E> {
  const n = P.names.length;
  const o = P.options;
  const t = readTestOptions(A, o, `${WHERE} options`);
  // Datum and connectivity.
  const roots: number[] = [];
  for (let i = 0; i < n; i++) if (P.held[i] || P.weighted[i]) roots.push(i);
  if (roots.length === 0)
    throw new QuadspreadError(
      'DATUM_DEFECT',
      `${WHERE} points`,
      'no fixed point: hold at least one (fixed: true), with a bearing or a second fixed point for the orientation',
    );
  const edges: number[][] = [];
  P.obs.forEach((ob) => {
    if (!active[ob.index]) return;
    edges.push(
      ob.kind === 'angle'
        ? [ob.at, ob.from, ob.to]
        : ob.kind === 'direction'
          ? [ob.at, ob.to]
          : [ob.from, ob.to],
    );
  });
  requireConnected(P.names, edges, roots, WHERE);
  // Starting coordinates.
  const rough: [number, number][] = P.xy.map((p) =>
    p === undefined ? [NaN, NaN] : [A.toNumber(p[0]!), A.toNumber(p[1]!)],
  );
  if (rough.some((p) => Number.isNaN(p[0]))) {
    const ro: RoughObservation[] = [];
    P.obs.forEach((ob) => {
      if (!active[ob.index]) return;
      if (ob.kind === 'vector')
        ro.push({
          kind: 'vector',
          from: ob.from,
          to: ob.to,
          dx: A.toNumber(ob.dx),
          dy: A.toNumber(ob.dy),
        });
      else if (ob.kind === 'direction')
        ro.push({
          kind: 'direction',
          at: ob.at,
          to: ob.to,
          set: ob.set,
          value: A.toNumber(ob.value),
        });
      else if (ob.kind === 'angle')
        ro.push({
          kind: 'angle',
          at: ob.at,
          from: ob.from,
          to: ob.to,
          value: A.toNumber(ob.value),
        });
      else ro.push({ kind: ob.kind, from: ob.from, to: ob.to, value: A.toNumber(ob.value) });
    });
    approximateCoordinates(P.names, rough, ro, WHERE);
  }
  const round = (v: number): T => A.from(v.toFixed(6));
  let xy: T[][] = P.xy.map((p, i) => p ?? [round(rough[i]![0]), round(rough[i]![1]!)]);
  // Unknowns: x, y of every point not held; one orientation per direction round.
  const ux = new Int32Array(n).fill(-1);
  let u = 0;
  for (let i = 0; i < n; i++)
    if (!P.held[i]) {
      ux[i] = u;
      u += 2;
    }
  const uw = new Int32Array(P.sets.length).fill(-1);
  const activeSets = new Set<number>();
  P.obs.forEach((ob) => {
    if (active[ob.index] && ob.kind === 'direction') activeSets.add(ob.set);
  });
  for (const s of activeSets) uw[s] = u++;
  // Starting orientations: the mean of (computed bearing − reading) over the round.
  const w: T[] = P.sets.map(() => A.zero);
  for (const s of activeSets) {
    let first: number | undefined;
    for (const ob of P.obs)
      if (ob.kind === 'direction' && ob.set === s && active[ob.index] && first === undefined) {
        const az =
          Math.atan2(rough[ob.to]![0] - rough[ob.at]![0], rough[ob.to]![1] - rough[ob.at]![1]) *
          (180 / Math.PI);
        first = az - A.toNumber(ob.value);
      }
    w[s] = A.from(((((first ?? 0) % 360) + 360) % 360).toFixed(8));
  }
  const tolerance =
    o.tolerance === undefined
      ? A.from('1e-7')
      : readSigma(A, o.tolerance, `${WHERE} options.tolerance`);
  const maxIterations = o.maxIterations ?? 20;
  if (!Number.isInteger(maxIterations) || maxIterations < 1 || maxIterations > 1000)
    throw invalidArgument(
      `${WHERE} options.maxIterations`,
      `${show(maxIterations)} is not an integer in 1..1000`,
    );
  const pivotTolerance = A.exact ? A.zero : A.from('1e-12');
  const nameOf = (k: number): string => {
    for (let i = 0; i < n; i++)
      if (ux[i] === k || ux[i]! + 1 === k) return `point ${JSON.stringify(P.names[i])}`;
    const s = [...uw].indexOf(k);
    return `the orientation of round ${JSON.stringify(P.sets[s])}`;
  };
  // One pattern in every iteration: its elimination order is computed once.
  const order: OrderMemo = {};
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const lin = linearise(A, P, active, xy, w, ux, uw, A.mul(t.sigma0, t.sigma0));
    const sol = solveGroups(A, u, lin.groups, pivotTolerance, order);
    if ('singular' in sol)
      throw new QuadspreadError(
        'SINGULAR_NETWORK',
        WHERE,
        `the observations do not determine ${nameOf(sol.singular)}: a datum defect (too few fixed points or no orientation) or weak geometry`,
      );
    const { dx } = sol;
    let largest = 0;
    for (let i = 0; i < n; i++)
      if (ux[i]! >= 0)
        largest = Math.max(
          largest,
          Math.abs(A.toNumber(dx[ux[i]!]!)),
          Math.abs(A.toNumber(dx[ux[i]! + 1]!)),
        );
    if (!(largest < 1e9))
      throw new QuadspreadError(
        'NOT_CONVERGED',
        WHERE,
        `the iteration diverged (a correction of ${largest} m at iteration ${iteration}): check the approximate coordinates and the observations`,
      );
    const adjusted = xy.map((p, i) =>
      ux[i]! < 0 ? p : [A.add(p[0]!, dx[ux[i]!]!), A.add(p[1]!, dx[ux[i]! + 1]!)],
    );
    const orient = w.map((v, s) => (uw[s]! < 0 ? v : A.add(v, A.div(dx[uw[s]!]!, A.from(3600)))));
    if (largest <= A.toNumber(tolerance))
      return finish(A, P, t, lin, sol, adjusted, orient, ux, iteration, u);
    // Next linearisation at the corrected values, rounded (the last step is exact regardless).
    const keep = (v: T): T => (A.exact ? A.from(A.toPrecision(v, 20)) : v);
    xy = adjusted.map((p, i) => (ux[i]! < 0 ? p : [keep(p[0]!), keep(p[1]!)]));
    for (let s = 0; s < w.length; s++) w[s] = keep(orient[s]!);
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    WHERE,
    `no convergence to ${A.toString(tolerance)} m in ${maxIterations} iterations`,
  );
}

function finish<T, E extends boolean>(
  A: Arithmetic<T, E>,
  P: Parsed<T>,
  t: ReturnType<typeof readTestOptions<T>>,
  lin: Linearised<T>,
  sol: Exclude<ReturnType<typeof solveGroups<T>>, { singular: number }>,
  xy: T[][],
  orient: T[],
  ux: Int32Array,
  iterations: number,
  u: number,
): Once<T, E> {
  const { dx, inverse, factor } = sol;
  const cache = new Map<number, T[]>();
  const column = (j: number): T[] => {
    let c = cache.get(j);
    if (c === undefined) {
      const e: T[] = new Array(u).fill(A.zero);
      e[j] = A.one;
      c = solveNormal(A, factor, e);
      cache.set(j, c);
    }
    return c;
  };
  const Q = (i: number, j: number): T => inverse.get(i, j) ?? column(j)[i]!;
  const { stats, vtpv } = observationStatistics(A, lin.groups, dx, Q);
  const flat = stats.flat();
  const dof = flat.length - u;
  const a = assess(A, flat, vtpv, dof, t);
  const level = P.options.confidence ?? 0.95;
  if (typeof level !== 'number' || !(level > 0 && level < 1))
    throw invalidArgument(
      `${WHERE} options.confidence`,
      `${show(level)} is not a probability strictly between 0 and 1`,
    );
  const k =
    a.scale === 'a-priori'
      ? Math.sqrt(chiSquareQuantile(level, 2))
      : Math.sqrt(2 * fQuantile(level, 2, dof));
  const f = a.factor;
  const points: Record<string, AdjustedPoint<T, E>> = {};
  P.names.forEach((name, i) => {
    const held = ux[i]! < 0;
    const qxx = held ? A.zero : Q(ux[i]!, ux[i]!);
    const qyy = held ? A.zero : Q(ux[i]! + 1, ux[i]! + 1);
    const qxy = held ? A.zero : Q(ux[i]!, ux[i]! + 1);
    const e = ellipse(A, f, qxx, qyy, qxy);
    points[name] = {
      x: xy[i]![0]!,
      y: xy[i]![1]!,
      sigmaX: sigmaRoot(A, f, qxx),
      sigmaY: sigmaRoot(A, f, qyy),
      ellipse: e,
      confidence: scaled(A, e, level, k),
      held,
      approximated: P.approximated[i]!,
    };
  });
  const index = new Map(P.names.map((n, i) => [n, i]));
  const relative: RelativeEllipse<T, E>[] = [];
  if (P.options.relative !== undefined) {
    const pairs = readArray<readonly [string, string]>(
      P.options.relative,
      `${WHERE} options.relative`,
    );
    pairs.forEach((pair, r) => {
      const at = `${WHERE} options.relative[${r}]`;
      if (!Array.isArray(pair) || pair.length !== 2)
        throw invalidArgument(at, `${show(pair)} is not a pair of point names`);
      const [i, j] = pair.map((nm, s) => {
        const v = index.get(readName(nm, `${at}[${s}]`));
        if (v === undefined)
          throw new QuadspreadError(
            'UNKNOWN_POINT',
            `${at}[${s}]`,
            `${JSON.stringify(nm)} is not one of the points`,
          );
        return v;
      }) as [number, number];
      // Q of (x_j − x_i, y_j − y_i): Q_jj + Q_ii − Q_ij − Q_ji per component pair.
      const q = (a1: number, b1: number): T => {
        const term = (p: number, s: number, c: number, d: number): T =>
          ux[p]! < 0 || ux[s]! < 0 ? A.zero : Q(ux[p]! + c, ux[s]! + d);
        return A.sub(
          A.add(term(j, j, a1, b1), term(i, i, a1, b1)),
          A.add(term(i, j, a1, b1), term(j, i, a1, b1)),
        );
      };
      const e = ellipse(A, f, q(0, 0), q(1, 1), q(0, 1));
      relative.push({
        ...e,
        from: P.names[i]!,
        to: P.names[j]!,
        confidence: scaled(A, e, level, k),
      });
    });
  }
  const s3600 = A.from(3600);
  const observations = lin.meta.map((m, r): AdjustedNetworkObservation<T, E> => {
    const v = flat[r]!.v;
    return {
      kind: m.kind,
      index: m.index,
      ...(m.component ? { component: m.component } : {}),
      from: P.names[m.from]!,
      to: P.names[m.to]!,
      ...(m.at !== undefined ? { at: P.names[m.at]! } : {}),
      observed: m.observed,
      residual: v,
      adjusted: A.add(m.observed, m.angular ? A.div(v, s3600) : v),
      unit: m.angular ? 'arcsec' : 'm',
      ...a.observations[r]!,
    };
  });
  const w2 = a.observations.map((o, r) =>
    o.standardized === undefined ? undefined : A.div(A.mul(flat[r]!.v, flat[r]!.v), flat[r]!.qvv),
  );
  const orientations: Record<string, T> = {};
  P.sets.forEach((s, i) => {
    orientations[s] = orient[i]!;
  });
  return {
    points,
    observations,
    relative,
    orientations,
    dof,
    vtpv,
    varianceFactor: a.varianceFactor,
    sigma0: a.sigma0,
    scale: a.scale,
    globalTest: a.globalTest,
    localTest: a.localTest,
    iterations,
    w2,
  };
}

/**
 * Adjusts a plane survey network by least squares (Gauss–Newton): coordinates x = east,
 * y = north of its points from distances, bearings, angles, direction rounds (one orientation
 * unknown per station and set) and coordinate-difference vectors (e.g. GNSS baselines reduced
 * to the plane, with their 2 × 2 covariance), with σx, σy, the standard error ellipse and its
 * confidence form, relative ellipses between named pairs, and every observation's residual,
 * redundancy number, standardized residual (w or τ), MDB and flag; the variance factor and the
 * global test (scaling as in {@link adjustLevelling}).
 *
 * Points without coordinates get approximate ones from the observations (vectors, a bearing
 * with a distance, or two bearings); `approximated` says which. The iteration stops when the
 * largest coordinate correction is at most `options.tolerance` (default 1e-7 m); the
 * residuals, cofactors and tests are those of that last linear step, so Σ redundancy = dof and
 * AᵀPv = 0 hold exactly in `rational` (where bearings and distances of the linearisation go
 * through the arithmetic's 1e-40-relative atan2 and square root). Angular residuals, σ and MDBs
 * are in arc-seconds; distances in metres; σ of a distance from `sigma` in metres or
 * `{ constant, ppm }`, plus centring.
 *
 * Ellipses: semi-axes² = f·((qxx+qyy)/2 ± √(((qyy−qxx)/2)² + qxy²)), f the variance factor in
 * use; azimuth of the semi-major axis clockwise from grid north in [0°, 180°); confidence factor
 * √χ²(2, p) a-priori or √(2·F(2, r, p)) a-posteriori.
 *
 * A computational aid: an adjustment does not replace independent checks; control and
 * acceptance follow local standards and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ points, observations, options? }`, see {@link NetworkInput}
 * @returns see {@link NetworkAdjustment}
 * @throws {QuadspreadError} `DATUM_DEFECT` without a fixed point; `SINGULAR_NETWORK` naming the
 * point or orientation the observations do not fix (datum defect, weak geometry);
 * `DISCONNECTED_NETWORK`; `UNKNOWN_POINT`; `NO_APPROXIMATION` naming a point that cannot be
 * placed; `TOO_FEW_OBSERVATIONS` for a direction round with one direction; `INVALID_SIGMA`;
 * `INVALID_COVARIANCE`; `INVALID_ARGUMENT` (an observation from a point to itself, bad kinds
 * or options); `NOT_CONVERGED`; `INVALID_ANGLE`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, adjustNetwork } from 'quadspread';
 * // C from A and B by two distances and a bearing; exact observations give zero residuals
 * const r = adjustNetwork(float, {
 *   points: { A: { x: 0, y: 0, fixed: true }, B: { x: 100, y: 0, fixed: true }, C: {} },
 *   observations: [
 *     { kind: 'distance', from: 'A', to: 'C', value: 50, sigma: 0.005 },
 *     { kind: 'distance', from: 'B', to: 'C', value: Math.hypot(70, 40), sigma: 0.005 },
 *     { kind: 'bearing', from: 'A', to: 'C', value: (Math.atan2(30, 40) * 180) / Math.PI, sigma: 5 },
 *   ],
 * });
 * [r.points.C!.x.toFixed(6), r.points.C!.y.toFixed(6), r.dof, r.points.C!.approximated];
 * //=> ['30.000000', '40.000000', 1, true]
 * ```
 */
export function adjustNetwork<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: NetworkInput<T>,
): NetworkAdjustment<T, E> {
  checkArithmetic(A, 'adjustNetwork');
  const P = parse(A, input);
  const active: boolean[] = [];
  for (const ob of P.obs) active[ob.index] = true;
  if (P.options.snooping === true) {
    const { result, report } = snoop(
      A,
      active,
      (act) => adjustOnce(A, P, act),
      (r, k) => r.observations[k]!.index,
    );
    const { w2: _w, ...rest } = result;
    void _w;
    return { ...rest, snooping: report };
  }
  const { w2: _w, ...rest } = adjustOnce(A, P, active);
  void _w;
  return rest;
}
