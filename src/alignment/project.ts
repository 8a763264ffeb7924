/**
 * The chainage and offset of a point: its projection onto a horizontal alignment.
 *
 * @module alignment
 */
import { show, invalidArgument, QuadspreadError, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import type { AlignmentElement, HorizontalAlignment, TransitionElement } from './horizontal.js';
import { readAlignment, chainageAt } from './horizontal.js';
import { placeOn } from './point.js';
import { readXY, rightOf, root, trim } from './internal.js';
import { readNumber } from '../geometry/validate.js';
import { boxTree, nearestBox, nextBox } from './box-tree.js';

const WHERE = 'alignmentStation(A, alignment, P)';
const WHERE_ALIGNMENT = 'alignmentStation(A, alignment, P) alignment';

/** A projection of a point onto one element. */
export interface StationCandidate<T> {
  /** Chainage of the foot of the perpendicular. */
  readonly chainage: T;
  /** Signed offset, positive to the right looking ahead. */
  readonly offset: T;
  /** Index of the element in `alignment.elements`. */
  readonly element: number;
  /** Distance of the foot along the line from the alignment's start (ignores equations). */
  readonly distance: T;
}

/** What {@link alignmentStation} returns: the nearest projection and every close one. */
export interface AlignmentStation<T> extends StationCandidate<T> {
  /**
   * Every projection whose |offset| is within the tolerance of the nearest one (the nearest
   * first; one entry when the answer is unique). The inside of a sharp curve can hold several.
   */
  readonly candidates: readonly StationCandidate<T>[];
  /** `true` when the point lies beyond an end and was projected on the end's tangent (`extend`). */
  readonly extended: boolean;
}

/** Options of {@link alignmentStation}. */
export interface AlignmentStationOptions<T> {
  /**
   * Projections whose |offset| exceeds the nearest one's by at most this much are listed as
   * candidates (default 0.001, in the unit of the coordinates: an example, 1 mm in metres).
   */
  readonly tolerance?: Numeric<T>;
  /** Project a point beyond the start or the end onto the tangent there instead of refusing it. */
  readonly extend?: boolean;
}

/**
 * The chainage and offset of a point: the foot of the perpendicular from it to the alignment.
 * Offsets are positive to the right looking ahead (the direction of increasing chainage).
 *
 * Only the elements whose boxes lie near the point are tried (a search of a tree of the boxes in
 * plain numbers, built once per alignment, then the exact projection, nearest box first), so a
 * long alignment costs little more than a short one; in `float` the projections on straights and
 * arcs run on plain numbers (the same operations, bit for bit). On a straight the projection is exact in `rational`; on an arc it needs √ and atan2
 * (within 1e-40 relative in `rational`); on a transition the foot is found by Newton's method on
 * (P − X(l))·t(l) = 0, kept inside the transition, to 1e-30 of its length in `rational` (with a
 * last unrounded step, so an uncertain arithmetic keeps its first-order derivatives), 1e-12 in
 * `float`.
 *
 * @param A the arithmetic
 * @param alignment an alignment made by {@link horizontalAlignment}
 * @param P the point `{ x: east, y: north }`
 * @param options `tolerance` for candidates (default 0.001), `extend` past the ends (default false)
 * @returns `{ chainage, offset, element, distance, candidates, extended }`
 * @throws {QuadspreadError} `OFF_ALIGNMENT` when no element has a perpendicular foot for P (it
 *   lies beyond an end) and `extend` is not set; `INVALID_ARGUMENT` for an alignment that is not
 *   one, or a negative tolerance; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, horizontalAlignment, alignmentStation } from 'quadspread';
 * const R = rational;
 * const h = horizontalAlignment(R, { points: [{ x: 0, y: 0 }, { x: 0, y: 100 }, { x: 60, y: 180 }], curves: [{ radius: 30 }], startChainage: 1000 });
 * const s = alignmentStation(R, h, { x: -3, y: 40 });
 * [R.toString(s.chainage), R.toString(s.offset), s.candidates.length];
 * //=> ['1040', '-3', 1]
 * ```
 */
export function alignmentStation<T>(
  A: Arithmetic<T>,
  alignment: HorizontalAlignment<T>,
  P: { readonly x: Numeric<T>; readonly y: Numeric<T> },
  options: AlignmentStationOptions<T> = {},
): AlignmentStation<T> {
  checkArithmetic(A, 'alignmentStation');
  if (A.float64 === true) {
    const r = stationFloat(A as unknown as Arithmetic<number>, alignment, P, options);
    if (r !== undefined) return r as unknown as AlignmentStation<T>;
  }
  const where = WHERE;
  const h = readAlignment(A, alignment, `${where} alignment`);
  const p = readXY(A, P, `${where} P`);
  const opts = options === null || typeof options !== 'object' ? {} : options;
  const tol =
    opts.tolerance === undefined
      ? A.from('0.001')
      : readNumber(A, opts.tolerance, `${where} options.tolerance`);
  if (A.sign(tol) < 0)
    throw invalidArgument(`${where} options.tolerance`, `${A.toString(tol)} is negative`);
  const els = h.elements;
  const px = A.toNumber(p.x);
  const py = A.toNumber(p.y);
  const tolN = A.toNumber(tol);
  const n = els.length;
  // The element whose box is nearest (usually one holding P) first, so that the first foot is
  // near and prunes the rest; then, in index order, every element whose box (in plain numbers,
  // a lower bound on its offset) is within reach of the best foot so far. The box tree answers
  // as a scan of every box would, visiting only the near ones.
  const tree = boxTree(h.boxes);
  const first = nearestBox(tree, px, py);
  const found: StationCandidate<T>[] = [];
  let best = Infinity; // |offset| of the nearest foot found so far, as a number
  let reachQ = Infinity; // (best + tolerance)², with slack
  for (let i = first, from = 0; i >= 0;) {
    const e = els[i]!;
    const c = projectOn(A, e, p);
    if (c !== undefined) {
      found.push({
        chainage: A.zero,
        offset: c.offset,
        element: i,
        distance: A.add(e.startDistance, c.s),
      });
      const o = Math.abs(A.toNumber(c.offset));
      if (o < best) {
        best = o;
        reachQ = reachSquared(best, tolN);
      }
    }
    i = nextBox(tree, px, py, reachQ, from);
    if (i === first) i = nextBox(tree, px, py, reachQ, first + 1);
    from = i + 1;
  }
  let extended = false;
  if (found.length === 0) {
    if (opts.extend !== true)
      throw new QuadspreadError(
        'OFF_ALIGNMENT',
        `${where} P`,
        `(${show(A.toString(p.x))}, ${show(A.toString(p.y))}) has no perpendicular foot on the alignment: it lies beyond an end (pass { extend: true } to project it on the end's tangent)`,
      );
    extended = true;
    for (const [i, atEnd] of [
      [0, false],
      [n - 1, true],
    ] as const) {
      const e = els[i]!;
      const pl = placeOn(A, e, atEnd ? e.length : A.zero);
      const dx = A.sub(p.x, pl.point.x);
      const dy = A.sub(p.y, pl.point.y);
      const s = A.add(A.mul(dx, pl.direction.x), A.mul(dy, pl.direction.y));
      if (atEnd ? A.sign(s) >= 0 : A.sign(s) <= 0) {
        const nr = rightOf(A, pl.direction);
        found.push({
          chainage: A.zero,
          offset: A.add(A.mul(dx, nr.x), A.mul(dy, nr.y)),
          element: i,
          distance: A.add(atEnd ? h.length : A.zero, s),
        });
      }
    }
    if (found.length === 0)
      throw new QuadspreadError(
        'OFF_ALIGNMENT',
        `${where} P`,
        'the point projects on neither end tangent',
      );
  }
  // The nearest first; keep those within the tolerance, one per distinct foot.
  if (found.length > 1) found.sort((a, b) => A.cmp(A.abs(a.offset), A.abs(b.offset)));
  const limit = A.add(A.abs(found[0]!.offset), tol);
  const kept: StationCandidate<T>[] = [];
  for (const f of found) {
    if (A.cmp(A.abs(f.offset), limit) > 0) continue;
    if (
      kept.some(
        (k) =>
          A.cmp(A.abs(A.sub(k.distance, f.distance)), tol) <= 0 &&
          A.cmp(A.abs(A.sub(k.offset, f.offset)), tol) <= 0,
      )
    )
      continue;
    kept.push({ ...f, chainage: chainageAt(A, h.startChainage, h.equations, f.distance) });
  }
  return { ...kept[0]!, candidates: kept, extended };
}

/**
 * The squared reach of the search: an element whose box is farther than the best |offset| so
 * far plus the tolerance has no foot to keep (1e-9 relative slack for the rounding of boxes and
 * offsets to numbers).
 */
function reachSquared(best: number, tolerance: number): number {
  const reach = best + tolerance;
  return reach * reach * (1 + 1e-9) + 1e-18;
}

// The float twin's scratch: the feet found (offset, distance along the line, element) in the
// order found, and their order by |offset|. Filled and read within one call.
const FOUND = 64;
const FOUND_O = /* @__PURE__ */ new Float64Array(FOUND);
const FOUND_D = /* @__PURE__ */ new Float64Array(FOUND);
const FOUND_I = /* @__PURE__ */ new Int32Array(FOUND);
const ORDER = /* @__PURE__ */ new Int32Array(FOUND);

/**
 * The float twin of {@link alignmentStation}: the generic code's operations in float, in the
 * same order, on plain numbers, for a point of plain numbers and a plain tolerance, without the
 * candidate objects, closures and error locations the generic path builds for every element
 * tried. `undefined` wherever the generic code must decide or would throw (no foot: an end,
 * `extend`; a value that is not finite; more feet than the scratch holds), and the generic code
 * then runs. test/perf/float-twins.test.ts checks that it returns exactly what the generic code
 * returns in float.
 */
function stationFloat(
  A: Arithmetic<number>,
  alignment: unknown,
  P: unknown,
  options: unknown,
): AlignmentStation<number> | undefined {
  const h = readAlignment(A, alignment, WHERE_ALIGNMENT);
  if (P === null || typeof P !== 'object' || Array.isArray(P)) return undefined;
  const px = (P as { x?: unknown }).x;
  const py = (P as { y?: unknown }).y;
  if (typeof px !== 'number' || typeof py !== 'number' || px - px !== 0 || py - py !== 0)
    return undefined;
  let tol = 0.001; // float.from('0.001')
  if (options !== null && typeof options === 'object') {
    const t = (options as { tolerance?: unknown }).tolerance;
    if (t !== undefined) {
      if (typeof t !== 'number' || !(t >= 0) || t - t !== 0) return undefined;
      tol = t;
    }
  }
  const els = h.elements;
  const tree = boxTree(h.boxes);
  const first = nearestBox(tree, px, py);
  let count = 0;
  let best = Infinity;
  let reachQ = Infinity;
  for (let i = first, from = 0; i >= 0;) {
    // projectOn: the foot's distance s along the element and the offset, if it has one.
    const e = els[i]!;
    const len = e.length;
    const slack = (len + 1) * 1e-9;
    let s = 0;
    let o = 0;
    let foot = false;
    if (e.type === 'straight') {
      const dx = px - e.start.x;
      const dy = py - e.start.y;
      const u = e.direction;
      s = dx * u.x + dy * u.y;
      // A value that is not finite: the generic code's checked operations refuse it.
      if (s - s !== 0) return undefined;
      foot = true;
      if (s < 0) {
        if (-s <= slack) s = 0;
        else foot = false;
      } else if (s > len) {
        if (s - len <= slack) s = len;
        else foot = false;
      }
      if (foot) o = dx * u.y + dy * -u.x;
    } else if (e.type === 'arc') {
      const c = e.centre;
      const rx = px - c.x;
      const ry = py - c.y;
      const q = rx * rx + ry * ry;
      if (q - q !== 0) return undefined;
      if (q !== 0) {
        const r0x = e.start.x - c.x;
        const r0y = e.start.y - c.y;
        const cross = r0x * ry - r0y * rx;
        const dot = r0x * rx + r0y * ry;
        if (cross - cross !== 0 || dot - dot !== 0 || (cross === 0 && dot === 0)) return undefined;
        s = Math.atan2(e.turn > 0 ? -cross : cross, dot) * e.radius;
        if (s - s !== 0) return undefined;
        foot = true;
        if (s < 0) {
          if (-s <= slack) s = 0;
          else foot = false;
        } else if (s > len) {
          if (s - len <= slack) s = len;
          else foot = false;
        }
        if (foot) {
          const off = e.radius - Math.sqrt(q);
          o = e.turn > 0 ? off : -off;
        }
      }
    } else {
      const c = projectOnTransition(A, e, { x: px, y: py }, slack);
      if (c !== undefined) {
        s = c.s;
        o = c.offset;
        foot = true;
      }
    }
    if (foot) {
      const d = e.startDistance + s;
      if (o - o !== 0 || d - d !== 0 || count === FOUND) return undefined;
      FOUND_O[count] = o;
      FOUND_D[count] = d;
      FOUND_I[count] = i;
      count++;
      const a = Math.abs(o);
      if (a < best) {
        best = a;
        reachQ = reachSquared(best, tol);
      }
    }
    i = nextBox(tree, px, py, reachQ, from);
    if (i === first) i = nextBox(tree, px, py, reachQ, first + 1);
    from = i + 1;
  }
  if (count === 0) return undefined;
  // The nearest first, as found.sort does (a stable sort by |offset|).
  for (let j = 0; j < count; j++) {
    const x = j;
    const a = Math.abs(FOUND_O[x]!);
    let m = j;
    while (m > 0 && Math.abs(FOUND_O[ORDER[m - 1]!]!) > a) {
      ORDER[m] = ORDER[m - 1]!;
      m--;
    }
    ORDER[m] = x;
  }
  const limit = Math.abs(FOUND_O[ORDER[0]!]!) + tol;
  if (limit - limit !== 0) return undefined;
  const kept: StationCandidate<number>[] = [];
  const eqs = h.equations;
  for (let j = 0; j < count; j++) {
    const x = ORDER[j]!;
    const o = FOUND_O[x]!;
    if (Math.abs(o) > limit) continue;
    const d = FOUND_D[x]!;
    let same = false;
    for (let m = 0; m < kept.length && !same; m++) {
      const k = kept[m]!;
      const dd = k.distance - d;
      if (dd - dd !== 0) return undefined;
      if (Math.abs(dd) <= tol) {
        const od = k.offset - o;
        if (od - od !== 0) return undefined;
        same = Math.abs(od) <= tol;
      }
    }
    if (same) continue;
    // chainageAt: from the last equation at or before d.
    let c0 = h.startChainage;
    let d0 = 0;
    for (let m = 0; m < eqs.length; m++) {
      const q = eqs[m]!;
      if (!(q.distance <= d)) break;
      c0 = q.ahead;
      d0 = q.distance;
    }
    const chainage = c0 + (d - d0);
    if (chainage - chainage !== 0) return undefined;
    kept.push({ chainage, offset: o, element: FOUND_I[x]!, distance: d });
  }
  const k0 = kept[0]!;
  return {
    chainage: k0.chainage,
    offset: k0.offset,
    element: k0.element,
    distance: k0.distance,
    candidates: kept,
    extended: false,
  };
}

/**
 * The foot of the perpendicular from P on an element: its distance s from the element's start
 * and the signed offset; `undefined` when the foot lies outside the element. @internal
 */
export function projectOn<T>(
  A: Arithmetic<T>,
  e: AlignmentElement<T>,
  p: Point<T>,
): { s: T; offset: T } | undefined {
  // Joins are computed from both sides and agree to rounding: allow a foot that far outside.
  const slack = A.mul(A.add(e.length, A.one), A.exact ? A.from('1e-30') : A.from(1e-9));
  const inside = (s: T): T | undefined =>
    A.sign(s) < 0
      ? A.cmp(A.neg(s), slack) <= 0
        ? A.zero
        : undefined
      : A.cmp(s, e.length) > 0
        ? A.cmp(A.sub(s, e.length), slack) <= 0
          ? e.length
          : undefined
        : s;
  if (e.type === 'straight') {
    const dx = A.sub(p.x, e.start.x);
    const dy = A.sub(p.y, e.start.y);
    const s = inside(A.add(A.mul(dx, e.direction.x), A.mul(dy, e.direction.y)));
    if (s === undefined) return undefined;
    const nr = rightOf(A, e.direction);
    return { s, offset: A.add(A.mul(dx, nr.x), A.mul(dy, nr.y)) };
  }
  if (e.type === 'arc') {
    const rx = A.sub(p.x, e.centre.x);
    const ry = A.sub(p.y, e.centre.y);
    const q = A.add(A.mul(rx, rx), A.mul(ry, ry));
    if (A.isZero(q)) return undefined; // the centre: every point of the arc is a foot
    const r0x = A.sub(e.start.x, e.centre.x);
    const r0y = A.sub(e.start.y, e.centre.y);
    // Angle from the start radius to P's, in the direction of travel (clockwise on a right-hand curve).
    const cross = A.sub(A.mul(r0x, ry), A.mul(r0y, rx));
    const dot = A.add(A.mul(r0x, rx), A.mul(r0y, ry));
    const s = inside(A.mul(A.atan2(e.turn > 0 ? A.neg(cross) : cross, dot), e.radius));
    if (s === undefined) return undefined;
    const rho = root(A, q, 'alignmentStation');
    // P = centre + r̂·(R − turn·offset).
    const offset = A.sub(e.radius, rho);
    return { s, offset: e.turn > 0 ? offset : A.neg(offset) };
  }
  return projectOnTransition(A, e, p, slack);
}

function projectOnTransition<T>(
  A: Arithmetic<T>,
  e: TransitionElement<T>,
  p: Point<T>,
  slack: T,
): { s: T; offset: T } | undefined {
  const L = e.length;
  // g(s) = (P − X(s))·t(s): positive while the foot is ahead of s.
  const g = (s: T) => {
    const pl = placeOn(A, e, s);
    const dx = A.sub(p.x, pl.point.x);
    const dy = A.sub(p.y, pl.point.y);
    const nr = rightOf(A, pl.direction);
    return {
      g: A.add(A.mul(dx, pl.direction.x), A.mul(dy, pl.direction.y)),
      n: A.add(A.mul(dx, nr.x), A.mul(dy, nr.y)),
    };
  };
  const g0 = g(A.zero);
  if (A.cmp(g0.g, A.neg(slack)) < 0) return undefined;
  if (A.sign(g0.g) <= 0) return { s: A.zero, offset: g0.n };
  const g1 = g(L);
  if (A.cmp(g1.g, slack) > 0) return undefined;
  if (A.sign(g1.g) >= 0) return { s: L, offset: g1.n };
  // Safeguarded Newton: g′(s) = −1 + κ(s)·(signed normal distance towards the centre), κ = l/(R·Ls).
  const tolerance = A.mul(L, A.from(A.exact ? '1e-30' : '1e-12'));
  const RL = A.mul(e.radius, L);
  let lo = A.zero;
  let hi = L;
  let s = trim(A, A.div(A.mul(L, g0.g), A.sub(g0.g, g1.g)));
  for (let it = 0; it < 100; it++) {
    const v = g(s);
    const sg = A.sign(v.g);
    if (sg === 0) return { s, offset: v.n };
    if (sg > 0) lo = s;
    else hi = s;
    const l = e.entering ? s : A.sub(L, s);
    const kappa = A.div(l, RL);
    // Distance from the line towards the curve's centre: right offset × turn.
    const towards = e.turn > 0 ? v.n : A.neg(v.n);
    const dg = A.sub(A.mul(kappa, towards), A.one);
    let next = A.isZero(dg) ? s : A.sub(s, A.div(v.g, dg));
    if (A.cmp(next, lo) <= 0 || A.cmp(next, hi) >= 0) next = A.div(A.add(lo, hi), A.from(2));
    const step = A.abs(A.sub(next, s));
    if (A.cmp(step, tolerance) <= 0) {
      // The last Newton step is taken unrounded in an uncertain arithmetic (trim leaves its values
      // alone), so that the foot keeps its first-order derivatives; rational rounds it to 45 digits.
      const foot = trim(A, next);
      return { s: foot, offset: g(foot).n };
    }
    s = trim(A, next);
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    'alignmentStation(A, alignment, P)',
    `the foot on the transition of curve ${e.curve} did not converge`,
  );
}
