/**
 * Levelling runs: reduction of backsight/foresight bookings by rise-and-fall and by
 * height of instrument, the arithmetic checks, misclosure, allowable misclosure and its
 * distribution.
 *
 * @module cogo
 */
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { sqrtOf } from '../geometry/surd.js';
import type { Root } from '../geometry/surd.js';
import { checkLengthUnit, METRES_PER_UNIT } from '../readings/length.js';
import type { LengthUnit } from '../readings/length.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { readArray } from './internal.js';

/**
 * Orders of geodetic levelling with their elevation-difference accuracy b (mm/√km).
 *
 * Source: FGCC, *Standards and Specifications for Geodetic Control Networks* (1984), the b
 * values as printed there. The allowable section misclosure c·√K takes its constant c from
 * the user ({@link allowableMisclosure}): the c of each order is not quoted here, because
 * it was not checked against the standard's text.
 *
 * @example
 * ```ts
 * import { LEVELLING_ORDERS } from 'quadspread';
 * LEVELLING_ORDERS.third;
 * //=> { b: '2.0' }
 * ```
 */
export const LEVELLING_ORDERS = {
  'first-I': { b: '0.5' },
  'first-II': { b: '0.7' },
  'second-I': { b: '1.0' },
  'second-II': { b: '1.3' },
  third: { b: '2.0' },
} as const;

/** A levelling order: a key of {@link LEVELLING_ORDERS}. */
export type LevellingOrder = keyof typeof LEVELLING_ORDERS;

/** The allowable misclosure of a levelling section, and whether a misclosure is within it. */
export interface AllowableMisclosure<T, E extends boolean> {
  /** The constant c in mm (from the order, or as given). */
  readonly c: T;
  /** The section length K in km. */
  readonly km: T;
  /** c·√K in mm: a surd in an exact arithmetic. */
  readonly allowable: Root<T, E>;
}

function readC<T>(A: Arithmetic<T, boolean>, order: Numeric<T>, where: string): T {
  if (typeof order === 'string' && Object.prototype.hasOwnProperty.call(LEVELLING_ORDERS, order)) {
    throw invalidArgument(
      where,
      `${show(order)} names an order, but the constant c of its allowable misclosure is the user's to give: write c in mm as your specification states it (docs/coordinates.md lists common values, unchecked)`,
    );
  }
  if (typeof order === 'string' && !/^[\s\d.+eE/-]+$/.test(order)) {
    throw invalidArgument(where, `${show(order)} is not a constant c in mm`);
  }
  const c = readNumber(A, order, where);
  if (A.sign(c) <= 0) throw invalidArgument(where, `c = ${A.toString(c)} mm is not positive`);
  return c;
}

/**
 * Allowable misclosure c·√K (mm) of a levelling section of one-way length K km.
 *
 * c is the user's: the constant of the specification the work follows, in mm (the
 * library quotes no order's c; docs/coordinates.md lists values in common use, labelled
 * as unchecked). Exact in `rational` as a surd.
 *
 * @param A the arithmetic
 * @param c the constant c in mm (> 0)
 * @param km the section length K in km (≥ 0)
 * @returns `{ c, km, allowable }` with `allowable` = c·√K in mm
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a name of an order instead of c, a c ≤ 0
 *   or a negative K.
 * @example
 * ```ts
 * import { rational, allowableMisclosure } from 'quadspread';
 * allowableMisclosure(rational, 12, 4).allowable.toString();
 * //=> '24'
 * allowableMisclosure(rational, 6, 2).allowable.toString();
 * //=> '6√2'
 * ```
 */
export function allowableMisclosure<T, E extends boolean>(
  A: Arithmetic<T, E>,
  c: Numeric<T>,
  km: Numeric<T>,
): AllowableMisclosure<T, E> {
  checkArithmetic(A, 'allowableMisclosure');
  const where = 'allowableMisclosure(A, c, km)';
  const cMm = readC(A, c, `${where} c`);
  const K = readNumber(A, km, where, ' km');
  if (A.sign(K) < 0) throw invalidArgument(`${where} km`, `K = ${A.toString(K)} km is negative`);
  // Allowable section misclosure c·√K mm, c as the user's specification gives it.
  const allowable = sqrtOf(A, A.mul(A.mul(cMm, cMm), K));
  return { c: cMm, km: K, allowable };
}

/**
 * One booked sight of a levelling run. The first row is the starting bench mark and has
 * only a backsight; a change point has a foresight and a backsight; an intermediate sight
 * has only `is`; the last row has only a foresight. Staff readings are in the run's unit.
 */
export interface LevelSight<T> {
  /** A label for the point. */
  readonly station?: string;
  /** Backsight reading. */
  readonly bs?: Numeric<T>;
  /** Intermediate sight reading. */
  readonly is?: Numeric<T>;
  /** Foresight reading. */
  readonly fs?: Numeric<T>;
  /** Distance along the run from the previous row's point (run unit), for distributing the misclosure. */
  readonly distance?: Numeric<T>;
}

/** Input of {@link levelRun}. */
export interface LevelRunInput<T> {
  /** Reduced level of the first point (a bench mark). */
  readonly start: Numeric<T>;
  /** The booked sights in order. At least two rows. */
  readonly sights: readonly LevelSight<T>[];
  /** The known reduced level of the last point; gives the misclosure and the adjusted levels. */
  readonly close?: Numeric<T>;
  /** Unit of readings, levels and distances (default `'m'`), for converting to mm and km. */
  readonly unit?: LengthUnit;
  /** The constant c in mm of the allowable misclosure c·√K (the user's specification); needs `close`. */
  readonly order?: Numeric<T>;
  /** Section length K in km for the allowable misclosure; default: the sum of the row distances. */
  readonly km?: Numeric<T>;
}

/** One reduced row of a levelling run. */
export interface LevelRow<T> {
  readonly station: string | undefined;
  readonly bs: T | undefined;
  readonly is: T | undefined;
  readonly fs: T | undefined;
  /** Rise from the previous point (rise-and-fall), or undefined for the first row / a fall. */
  readonly rise: T | undefined;
  /** Fall from the previous point (positive), or undefined. */
  readonly fall: T | undefined;
  /** Height of instrument of the setup this row's backsight starts, or undefined. */
  readonly hi: T | undefined;
  /** Reduced level (unadjusted). */
  readonly level: T;
  /** Correction from distributing the misclosure (zero without `close`). */
  readonly correction: T;
  /** Adjusted reduced level. */
  readonly adjusted: T;
}

/** The arithmetic checks of a levelling reduction. */
export interface LevelCheck<T> {
  readonly sumBS: T;
  readonly sumFS: T;
  readonly sumRise: T;
  readonly sumFall: T;
  /** Last reduced level less the first. */
  readonly difference: T;
  /** Rise-and-fall check: ΣBS − ΣFS = ΣRise − ΣFall = last − first. */
  readonly riseFallOk: boolean;
  /** Height-of-instrument check: Σ(HI × sights taken from it) = ΣIS + ΣFS + Σ(levels after the first). */
  readonly heightOfInstrumentOk: boolean;
}

/** What {@link levelRun} returns. */
export interface LevelRun<T, E extends boolean> {
  readonly rows: LevelRow<T>[];
  readonly check: LevelCheck<T>;
  /** Computed level of the last point less `close`, in the run unit; undefined without `close`. */
  readonly misclosure: T | undefined;
  /** The misclosure in mm. */
  readonly misclosureMm: T | undefined;
  /** The allowable misclosure, when `order` and `close` are given. */
  readonly allowable: AllowableMisclosure<T, E> | undefined;
  /** Whether |misclosure| ≤ c·√K (compared exactly through squares), when `allowable` is given. */
  readonly withinAllowable: boolean | undefined;
  /** How the misclosure was distributed: by `'distance'` when every row after the first has one, else by `'setups'`. */
  readonly distributedBy: 'distance' | 'setups';
}

function readOpt<T>(
  A: Arithmetic<T, boolean>,
  v: Numeric<T> | undefined,
  where: string,
): T | undefined {
  return v === undefined ? undefined : readNumber(A, v, where);
}

/**
 * Reduces a levelling run booked as backsights (BS), intermediate sights (IS) and
 * foresights (FS), by both rise-and-fall and height of instrument, with their arithmetic
 * checks, the misclosure on a known closing level, the allowable misclosure c·√K and the
 * distribution of the misclosure along the run.
 *
 * Rise-and-fall: rise = previous staff reading − this reading; level = previous level +
 * rise. Height of instrument: HI = level + BS; level = HI − IS or HI − FS. Both give the
 * same levels; the checks compare their sums. The correction at a point is −misclosure
 * × (distance to it / total distance) when every row after the first has a `distance`,
 * otherwise −misclosure × (setups to it / all setups) (common practice, e.g. Uren & Price,
 * *Surveying for Engineers*, levelling chapter, from memory). Exact in `rational`; the
 * checks then hold exactly, and elsewhere within 1e-9 of the sums.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ start, sights, close?, unit?, order?, km? }`, see {@link LevelRunInput}
 * @returns the reduced rows, the checks, the misclosure and the allowable misclosure
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than two rows; `INVALID_ARGUMENT` for a
 * booking that breaks the rules above (first row not a lone BS, a row with both IS and FS,
 * a BS without FS, a last row that is not a lone FS), a negative distance, or `order` without `close`;
 * `INVALID_UNIT`; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, levelRun } from 'quadspread';
 * const run = levelRun(rational, {
 *   start: '100.000',
 *   close: '100.500',
 *   sights: [{ bs: '1.200' }, { is: '0.950' }, { fs: '0.800', bs: '1.500' }, { fs: '1.390' }],
 * });
 * [rational.toString(run.rows[3]!.level), rational.toString(run.misclosure!), rational.toString(run.rows[3]!.adjusted)];
 * //=> ['10051/100', '1/100', '201/2']
 * ```
 */
export function levelRun<T, E extends boolean>(
  A: Arithmetic<T, E>,
  input: LevelRunInput<T>,
): LevelRun<T, E> {
  checkArithmetic(A, 'levelRun');
  const where = 'levelRun(A, input)';
  expectObject(input, where, '{ start, sights }');
  const list = readArray<LevelSight<T>>(input.sights, `${where} sights`);
  if (list.length < 2)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${where} sights`,
      `a run needs at least 2 rows (a backsight and a foresight), got ${list.length}`,
    );
  const unit = checkLengthUnit(input.unit ?? 'm', `${where} unit`);
  const start = readNumber(A, input.start, where, ' start');
  const n = list.length;

  const bs = new Array<T | undefined>(n);
  const is = new Array<T | undefined>(n);
  const fs = new Array<T | undefined>(n);
  const dist = new Array<T | undefined>(n);
  let allDistances = true;
  for (let i = 0; i < n; i++) {
    const r = list[i];
    const at = `${where} sights[${i}]`;
    expectObject(r, at, 'a sight { bs?, is?, fs? }');
    bs[i] = readOpt(A, r.bs, `${at}.bs`);
    is[i] = readOpt(A, r.is, `${at}.is`);
    fs[i] = readOpt(A, r.fs, `${at}.fs`);
    dist[i] = readOpt(A, r.distance, `${at}.distance`);
    const d = dist[i];
    if (d !== undefined && A.sign(d) < 0)
      throw invalidArgument(`${at}.distance`, `${A.toString(d)} is negative`);
    if (i > 0 && d === undefined) allDistances = false;
    if (i === 0) {
      if (bs[i] === undefined || is[i] !== undefined || fs[i] !== undefined)
        throw invalidArgument(
          at,
          'the first row must be a backsight alone (on the starting bench mark)',
        );
      continue;
    }
    if (is[i] !== undefined && fs[i] !== undefined)
      throw invalidArgument(at, 'a row has an intermediate sight or a foresight, not both');
    if (is[i] === undefined && fs[i] === undefined)
      throw invalidArgument(at, 'a row after the first needs an intermediate sight or a foresight');
    if (bs[i] !== undefined && fs[i] === undefined)
      throw invalidArgument(
        at,
        'a backsight after the first row belongs on a change point, with its foresight',
      );
    if (i === n - 1 && (fs[i] === undefined || bs[i] !== undefined))
      throw invalidArgument(at, 'the last row must be a foresight alone');
  }

  // Reduction. Rise-and-fall and height of instrument, side by side (e.g. Uren & Price,
  // Surveying for Engineers, levelling chapter, from memory).
  const levelRF = new Array<T>(n);
  const levelHI = new Array<T>(n);
  const rise = new Array<T | undefined>(n);
  const fall = new Array<T | undefined>(n);
  const hi = new Array<T | undefined>(n);
  const setup = new Array<number>(n);
  levelRF[0] = start;
  levelHI[0] = start;
  let sumBS = A.zero;
  let sumFS = A.zero;
  let sumIS = A.zero;
  let sumRise = A.zero;
  let sumFall = A.zero;
  let sumHiUses = A.zero;
  let sumLevelsAfterFirst = A.zero;
  let prevReading = bs[0]!;
  let currentHI = A.add(start, bs[0]!);
  let setups = 1;
  hi[0] = currentHI;
  setup[0] = 0;
  sumBS = A.add(sumBS, bs[0]!);
  for (let i = 1; i < n; i++) {
    const reading = (fs[i] ?? is[i])!;
    // Rise-and-fall: rise = previous reading − this reading.
    const diff = A.sub(prevReading, reading);
    if (A.sign(diff) >= 0) {
      rise[i] = diff;
      sumRise = A.add(sumRise, diff);
    } else {
      fall[i] = A.neg(diff);
      sumFall = A.sub(sumFall, diff);
    }
    levelRF[i] = A.add(levelRF[i - 1]!, diff);
    // Height of instrument: level = HI − reading.
    levelHI[i] = A.sub(currentHI, reading);
    sumHiUses = A.add(sumHiUses, currentHI);
    sumLevelsAfterFirst = A.add(sumLevelsAfterFirst, levelHI[i]!);
    setup[i] = setups;
    if (fs[i] !== undefined) sumFS = A.add(sumFS, fs[i]!);
    else sumIS = A.add(sumIS, is[i]!);
    if (bs[i] !== undefined) {
      currentHI = A.add(levelHI[i]!, bs[i]!);
      hi[i] = currentHI;
      sumBS = A.add(sumBS, bs[i]!);
      prevReading = bs[i]!;
      setups++;
    } else {
      prevReading = reading;
    }
  }
  const last = levelRF[n - 1]!;
  const difference = A.sub(last, start);

  const close = (a: T, b: T): boolean => {
    if (A.exact) return A.eq(a, b);
    const scale = A.add(A.one, A.add(A.abs(sumBS), A.abs(sumFS)));
    return A.cmp(A.abs(A.sub(a, b)), A.mul(scale, A.from('1e-9'))) <= 0;
  };
  const bsMinusFs = A.sub(sumBS, sumFS);
  let levelsAgree = true;
  for (let i = 0; i < n; i++) if (!close(levelRF[i]!, levelHI[i]!)) levelsAgree = false;
  const check: LevelCheck<T> = {
    sumBS,
    sumFS,
    sumRise,
    sumFall,
    difference,
    riseFallOk: close(bsMinusFs, A.sub(sumRise, sumFall)) && close(bsMinusFs, difference),
    heightOfInstrumentOk:
      levelsAgree &&
      close(sumHiUses, A.add(A.add(sumIS, sumFS), sumLevelsAfterFirst)) &&
      close(A.sub(levelHI[n - 1]!, start), bsMinusFs),
  };

  // Misclosure and its distribution.
  let misclosure: T | undefined;
  let misclosureMm: T | undefined;
  let allowable: AllowableMisclosure<T, E> | undefined;
  let withinAllowable: boolean | undefined;
  const toMetres = A.from(METRES_PER_UNIT[unit]);
  const weight = new Array<T>(n);
  let totalDistance = A.zero;
  weight[0] = A.zero;
  if (allDistances) {
    for (let i = 1; i < n; i++) {
      totalDistance = A.add(totalDistance, dist[i]!);
      weight[i] = totalDistance;
    }
  }
  const distributedBy: 'distance' | 'setups' =
    allDistances && !A.isZero(totalDistance) ? 'distance' : 'setups';
  let totalWeight = totalDistance;
  if (distributedBy === 'setups') {
    for (let i = 0; i < n; i++) weight[i] = A.from(setup[i]!);
    totalWeight = A.from(setup[n - 1]!);
  }
  if (input.close !== undefined) {
    misclosure = A.sub(last, readNumber(A, input.close, where, ' close'));
    misclosureMm = A.mul(A.mul(misclosure, toMetres), A.from(1000));
  } else if (input.order !== undefined) {
    throw invalidArgument(
      `${where} order`,
      'an allowable misclosure needs the known closing level `close`',
    );
  }
  if (input.order !== undefined && misclosureMm !== undefined) {
    let km: T;
    if (input.km !== undefined) km = readNumber(A, input.km, where, ' km');
    else if (allDistances) km = A.div(A.mul(totalDistance, toMetres), A.from(1000));
    else
      throw invalidArgument(
        `${where} km`,
        'give the section length km, or a distance on every row after the first',
      );
    allowable = allowableMisclosure(A, input.order, km);
    // |m| ≤ c·√K  ⇔  m² ≤ c²·K (both sides non-negative): exact in rational.
    withinAllowable =
      A.cmp(A.mul(misclosureMm, misclosureMm), A.mul(A.mul(allowable.c, allowable.c), km)) <= 0;
  }

  const rows = new Array<LevelRow<T>>(n);
  for (let i = 0; i < n; i++) {
    const correction =
      misclosure === undefined || A.isZero(misclosure)
        ? A.zero
        : A.neg(A.div(A.mul(misclosure, weight[i]!), totalWeight));
    rows[i] = {
      station: list[i]!.station,
      bs: bs[i],
      is: is[i],
      fs: fs[i],
      rise: rise[i],
      fall: fall[i],
      hi: hi[i],
      level: levelRF[i]!,
      correction,
      adjusted: A.add(levelRF[i]!, correction),
    };
  }
  return { rows, check, misclosure, misclosureMm, allowable, withinAllowable, distributedBy };
}
