/**
 * Setting-out tables: deflection angles and chords from the tangent points of a curve, and
 * coordinates of the centre line and of offset lines at regular chainages.
 *
 * @module alignment
 */
import { show, invalidArgument, inputTooLong, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { readNumber } from '../geometry/validate.js';
import { formatDms } from '../readings/dms.js';
import type { HorizontalAlignment } from './horizontal.js';
import { readAlignment, chainageAt, readDistance } from './horizontal.js';
import { placeOn, elementAt } from './point.js';
import { clothoidSeries } from './clothoid.js';
import { along, rightOf, azimuth, degPerRad, root, readList, readLength } from './internal.js';

/** Most rows a table gives (a larger one is refused: choose a longer interval or a shorter stretch). */
const MAX_ROWS = 100_000;
/**
 * Most rows a deflection table gives: each row needs an angle and a chord (transcendentals,
 * some 0.7 ms a row in `rational`), and a curve set out from more than 1 000 stations is no
 * field practice.
 */
const MAX_DEFLECTION_ROWS = 1_000;

/** A chainage and its distance along the line. @internal */
interface Station<T> {
  readonly distance: T;
  readonly chainage: T;
}

/**
 * The chainages that are whole multiples of `interval` strictly between distances d0 and d1,
 * region by region between chainage equations. @internal
 */
export function stationsBetween<T>(
  A: Arithmetic<T>,
  h: HorizontalAlignment<T>,
  d0: T,
  d1: T,
  interval: T,
  where: string,
  max: number = MAX_ROWS,
): Station<T>[] {
  const out: Station<T>[] = [];
  const bounds = [A.zero, ...h.equations.map((e) => e.distance), h.length];
  for (let r = 0; r + 1 < bounds.length; r++) {
    const lo = A.cmp(bounds[r]!, d0) > 0 ? bounds[r]! : d0;
    const hi = A.cmp(bounds[r + 1]!, d1) < 0 ? bounds[r + 1]! : d1;
    if (A.cmp(lo, hi) >= 0) continue;
    const c0 = r === 0 ? h.startChainage : h.equations[r - 1]!.ahead;
    const base = bounds[r]!;
    const cLo = A.add(c0, A.sub(lo, base));
    // Refused at once when the region alone holds more rows than a table gives.
    if (out.length + A.toNumber(A.div(A.sub(hi, lo), interval)) > max + 1)
      throw inputTooLong(where, `more than ${max} rows: use a longer interval`);
    // First multiple k·interval > cLo: start from the nearest number and correct exactly.
    let k = Math.floor(A.toNumber(A.div(cLo, interval)));
    // Beyond 2^53 intervals from chainage 0 a step of one interval is lost in a JS number.
    if (!Number.isSafeInteger(k) || Math.abs(k) > Number.MAX_SAFE_INTEGER - MAX_ROWS - 2)
      throw invalidArgument(
        where,
        `chainage ${A.toString(cLo)} is more than 2^53 intervals of ${A.toString(interval)} from 0: no table can step to it`,
      );
    while (A.cmp(A.mul(A.from(k), interval), cLo) <= 0) k++;
    while (k > -Number.MAX_SAFE_INTEGER && A.cmp(A.mul(A.from(k - 1), interval), cLo) > 0) k--;
    for (; ; k++) {
      const c = A.mul(A.from(k), interval);
      const d = A.add(base, A.sub(c, c0));
      if (A.cmp(d, hi) >= 0) break;
      if (out.length >= max)
        throw inputTooLong(where, `more than ${max} rows: use a longer interval`);
      out.push({ distance: d, chainage: c });
    }
  }
  return out;
}

/** A row of a deflection table. */
export interface DeflectionRow<T> {
  /** Chainage of the point. */
  readonly chainage: T;
  /** Which tangent point the row is measured from: `'TS'` (a transition in), `'SC'` (the arc), `'ST'` (a transition out, measured back). */
  readonly from: 'TS' | 'SC' | 'ST';
  /** Length along the curve from that tangent point. */
  readonly arc: T;
  /** Deflection angle from the tangent at that point, degrees (positive: the way the curve turns). */
  readonly deflection: T;
  /** The deflection as DMS text. */
  readonly deflectionText: string;
  /** Chord from the tangent point. */
  readonly chord: T;
  /** Chord from the previous row's point (the sub-chord or chord to set out step by step). */
  readonly subChord: T;
}

/**
 * A deflection table for the curve at an IP: for every chainage that is a multiple of `interval`
 * along the curve, and for its key points, the deflection angle from the tangent and the chord
 * from the tangent point — from the SC (the BC/PC without transitions) along the circular arc,
 * deflection = arc/(2R) and chord = 2R·sin(deflection) (Mahun, *Curves*, "Horizontal Curves",
 * deflection angles); from the TS along a transition in, and back from the ST along a transition
 * out, deflection = atan(y/x) and chord = √(x² + y²) of the clothoid (see {@link clothoid}). Each
 * row also gives the chord from the previous point (the first, short one is the sub-chord).
 * Angles need π, so in `rational` they are within the transcendental tolerance (1e-40
 * relative).
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param alignment an alignment made by {@link horizontalAlignment}
 * @param curve the index of the curve in `alignment.curves`
 * @param options `interval`: the chainage step (> 0, e.g. 100 ft or 20 m); `secondsDecimals` of
 *   the DMS texts (default 0)
 * @returns the rows in chainage order, ending at the ST (or EC)
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a curve index that does not exist or an
 *   interval ≤ 0; `INPUT_TOO_LONG` for more than 1 000 rows; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { float, horizontalAlignment, deflectionTable } from 'quadspread';
 * const h = horizontalAlignment(float, { points: [{ x: 0, y: 0 }, { x: 0, y: 100 }, { x: 60, y: 180 }], curves: [{ radius: 30 }] });
 * deflectionTable(float, h, 0, { interval: 10 }).map((r) => [r.chainage.toFixed(3), r.deflectionText, r.chord.toFixed(3)]);
 * //=> [['100.000', `9°32'57"`, '9.954'], ['109.305', `18°26'06"`, '18.974']]
 * ```
 */
export function deflectionTable<T>(
  A: Arithmetic<T>,
  alignment: HorizontalAlignment<T>,
  curve: number,
  options: { readonly interval: Numeric<T>; readonly secondsDecimals?: number },
): DeflectionRow<T>[] {
  checkArithmetic(A, 'deflectionTable');
  const where = 'deflectionTable(A, alignment, curve, options)';
  const h = readAlignment(A, alignment, `${where} alignment`);
  if (
    typeof curve !== 'number' ||
    !Number.isInteger(curve) ||
    curve < 0 ||
    curve >= h.curves.length
  )
    throw invalidArgument(
      `${where} curve`,
      `${show(curve)} is not a curve index 0..${h.curves.length - 1}`,
    );
  if (options === null || typeof options !== 'object')
    throw invalidArgument(`${where} options`, `${show(options)} is not { interval }`);
  const interval = readLength(A, options.interval, `${where} options.interval`, true);
  const decimals = options.secondsDecimals ?? 0;
  const rows: DeflectionRow<T>[] = [];
  const toDeg = degPerRad(A);
  const two = A.from(2);
  let prev: Point<T> | undefined;
  for (let i = 0; i < h.elements.length; i++) {
    const e = h.elements[i]!;
    if (e.type === 'straight' || e.curve !== curve) continue;
    const d0 = e.startDistance;
    const d1 = A.add(d0, e.length);
    const stations = stationsBetween(
      A,
      h,
      d0,
      d1,
      interval,
      where,
      Math.max(0, MAX_DEFLECTION_ROWS - rows.length),
    );
    stations.push({
      distance: d1,
      chainage: chainageAt(A, h.startChainage, h.equations, d1, true),
    });
    if (prev === undefined) prev = e.start;
    for (const st of stations) {
      const s = A.sub(st.distance, d0);
      const p = placeOn(A, e, s).point;
      let from: DeflectionRow<T>['from'];
      let arc: T;
      let deflection: T;
      let chord: T;
      if (e.type === 'arc') {
        from = 'SC';
        arc = s;
        const half = A.div(s, A.mul(two, e.radius)); // deflection = arc/(2R), radians
        deflection = A.mul(half, toDeg);
        chord = A.mul(A.mul(two, e.radius), A.sin(half));
      } else {
        from = e.entering ? 'TS' : 'ST';
        arc = e.entering ? s : A.sub(e.length, s);
        if (A.isZero(arc)) {
          deflection = A.zero;
          chord = A.zero;
        } else {
          const c = clothoidSeries(A, arc, e.radius, e.length);
          deflection = A.mul(A.atan2(c.y, c.x), toDeg);
          chord = root(A, A.add(A.mul(c.x, c.x), A.mul(c.y, c.y)), where);
        }
      }
      const dx = A.sub(p.x, prev.x);
      const dy = A.sub(p.y, prev.y);
      rows.push({
        chainage: st.chainage,
        from,
        arc,
        deflection,
        deflectionText: formatDms(A, deflection, decimals),
        chord,
        subChord: root(A, A.add(A.mul(dx, dx), A.mul(dy, dy)), where),
      });
      prev = p;
    }
  }
  return rows;
}

/** A point of a setting-out row: the offset and its coordinates. */
export interface SetOutPoint<T> {
  /** Offset, positive to the right looking ahead. */
  readonly offset: T;
  /** East. */
  readonly x: T;
  /** North. */
  readonly y: T;
}

/** A row of a setting-out table. */
export interface SettingOutRow<T> {
  /** Chainage. */
  readonly chainage: T;
  /** Index of the element. */
  readonly element: number;
  /** The element's type. */
  readonly type: 'straight' | 'transition' | 'arc';
  /** Bearing of the line, degrees clockwise from north. */
  readonly bearing: T;
  /** The centre line (offset 0) and each offset asked for, in that order. */
  readonly points: readonly SetOutPoint<T>[];
}

/**
 * Coordinates to set out along an alignment: the centre line and offset lines (e.g. the left and
 * right edges) at every chainage that is a multiple of `interval`, and at every element's ends
 * (the TS, SC, CS, ST, PC, PT), between `from` and `to`. On arcs the points come from the
 * rational parametrisation of the circle (see {@link alignmentPoint}): in `rational` they lie
 * exactly on their circles, and only their chainage, forced through φ = s/R, is within the
 * transcendental tolerance (1e-40 relative); on straights they are exact.
 *
 * A computational aid: check independently; setting out follows local codes and licensed practice.
 *
 * @param A the arithmetic
 * @param alignment an alignment made by {@link horizontalAlignment}
 * @param options `interval` (> 0); `offsets` (signed, right positive; default none); `from`,
 *   `to` chainages (default the whole line); `keyPoints` (default true): add the element ends
 * @returns the rows in chainage order
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for an interval ≤ 0 or `from` after `to`;
 *   `OFF_ALIGNMENT` for `from` or `to` beyond the ends; `INPUT_TOO_LONG` for more than
 *   100 000 rows; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, horizontalAlignment, settingOutTable } from 'quadspread';
 * const R = rational;
 * const h = horizontalAlignment(R, { points: [{ x: 0, y: 0 }, { x: 0, y: 100 }, { x: 60, y: 180 }], curves: [{ radius: 30 }] });
 * const rows = settingOutTable(R, h, { interval: 50, offsets: [-3, 3], to: 90 });
 * rows.map((r) => [R.toString(r.chainage), r.points.map((p) => `${R.toString(p.x)},${R.toString(p.y)}`)]);
 * //=> [['0', ['0,0', '-3,0', '3,0']], ['50', ['0,50', '-3,50', '3,50']], ['90', ['0,90', '-3,90', '3,90']]]
 * ```
 */
export function settingOutTable<T>(
  A: Arithmetic<T>,
  alignment: HorizontalAlignment<T>,
  options: {
    readonly interval: Numeric<T>;
    readonly offsets?: readonly Numeric<T>[];
    readonly from?: Numeric<T>;
    readonly to?: Numeric<T>;
    readonly keyPoints?: boolean;
  },
): SettingOutRow<T>[] {
  checkArithmetic(A, 'settingOutTable');
  const where = 'settingOutTable(A, alignment, options)';
  const h = readAlignment(A, alignment, `${where} alignment`);
  if (options === null || typeof options !== 'object')
    throw invalidArgument(`${where} options`, `${show(options)} is not { interval, offsets? }`);
  const interval = readLength(A, options.interval, `${where} options.interval`, true);
  const offsets = readList<Numeric<T>>(options.offsets ?? [], `${where} options.offsets`, 100).map(
    (o, i) => readNumber(A, o, `${where} options.offsets[${i}]`),
  );
  const d0 =
    options.from === undefined ? A.zero : readDistance(A, h, options.from, `${where} options.from`);
  const d1 =
    options.to === undefined ? h.length : readDistance(A, h, options.to, `${where} options.to`);
  if (A.cmp(d0, d1) > 0) throw invalidArgument(`${where} options.from`, 'it lies after options.to');
  const stations = stationsBetween(A, h, d0, d1, interval, where);
  const all: T[] = [d0, ...stations.map((s) => s.distance), d1];
  if (options.keyPoints !== false) {
    for (const e of h.elements) {
      for (const d of [e.startDistance, A.add(e.startDistance, e.length)])
        if (A.cmp(d, d0) > 0 && A.cmp(d, d1) < 0) all.push(d);
    }
  }
  all.sort((a, b) => A.cmp(a, b));
  const rows: SettingOutRow<T>[] = [];
  for (let k = 0; k < all.length; k++) {
    const d = all[k]!;
    if (k > 0 && A.eq(d, all[k - 1]!)) continue;
    const i = elementAt(A, h.elements, d);
    const e = h.elements[i]!;
    const pl = placeOn(A, e, A.sub(d, e.startDistance));
    const nr = rightOf(A, pl.direction);
    rows.push({
      chainage: chainageAt(A, h.startChainage, h.equations, d, A.eq(d, h.length)),
      element: i,
      type: e.type,
      bearing: azimuth(A, pl.direction),
      points: [A.zero, ...offsets].map((o) => {
        const q = A.isZero(o) ? pl.point : along(A, pl.point, nr, o);
        return { offset: o, x: q.x, y: q.y };
      }),
    });
  }
  return rows;
}
