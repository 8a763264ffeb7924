/**
 * Horizontal alignment: straights, circular arcs and clothoid transitions fitted to a polyline of
 * intersection points (IPs), with chainages (and chainage equations) along the line.
 *
 * @module alignment
 */
import {
  show,
  invalidArgument,
  coincidentPoints,
  QuadspreadError,
  checkArithmetic,
} from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import type { Point } from '../geometry/point.js';
import { readNumber } from '../geometry/validate.js';
import { angleToDegrees } from '../readings/angle.js';
import { clothoidSeries } from './clothoid.js';
import { keepBoxTree } from './box-tree.js';
import {
  readList,
  readObject,
  readXY,
  readLength,
  readChainage,
  root,
  unit,
  rightOf,
  along,
  rotate,
  azimuth,
  degPerRad,
} from './internal.js';

/**
 * A curve at an IP: `{ radius }`, or `{ degree, definition }` — the US degree of curve per
 * 100 ft, `'arc'` (R = 18000/(π·D), i.e. D = 5729.578/R) or `'chord'` (R = 50/sin(D/2)) —
 * with optional clothoid transitions in and out (their lengths; 0 or absent: none).
 */
export interface HorizontalCurveInput<T> {
  /** Radius of the circular arc, > 0. */
  readonly radius?: Numeric<T>;
  /** Degree of curve (degrees, or DMS text such as `7°09'43.1"`), when no radius is given. */
  readonly degree?: Numeric<T>;
  /** How the degree of curve is defined: on 100 ft of arc (default) or of chord. */
  readonly definition?: 'arc' | 'chord';
  /** Length of the clothoid transition from the back tangent into the arc (0: none). */
  readonly transitionIn?: Numeric<T>;
  /** Length of the clothoid transition from the arc to the forward tangent (0: none). */
  readonly transitionOut?: Numeric<T>;
}

/** A chainage equation: where the line reached chainage `back`, it is re-chained `ahead`. */
export interface ChainageEquationInput<T> {
  /** The chainage on the line before the equation. */
  readonly back: Numeric<T>;
  /** The chainage the same place takes after it. */
  readonly ahead: Numeric<T>;
}

/** The input of {@link horizontalAlignment}. */
export interface HorizontalAlignmentInput<T> {
  /** Start, the IPs, and end: x = east, y = north. */
  readonly points: readonly { readonly x: Numeric<T>; readonly y: Numeric<T> }[];
  /** One curve per IP: `curves[i]` belongs to `points[i + 1]`. */
  readonly curves: readonly HorizontalCurveInput<T>[];
  /** Chainage of the start (a number or station text; default 0). */
  readonly startChainage?: Numeric<T>;
  /** Chainage equations in order along the line. */
  readonly equations?: readonly ChainageEquationInput<T>[];
}

/** What every element of an alignment has. */
interface ElementBase<T> {
  /** Chainage at the start of the element (after any equation). */
  readonly startChainage: T;
  /** Chainage at its end. */
  readonly endChainage: T;
  /** Distance along the line from the alignment's start to the element's start (ignores equations). */
  readonly startDistance: T;
  /** Length along the line. */
  readonly length: T;
  /** Start point. */
  readonly start: Point<T>;
  /** End point. */
  readonly end: Point<T>;
  /** Bearing at the start, degrees clockwise from north. */
  readonly bearingIn: T;
  /** Bearing at the end, degrees clockwise from north. */
  readonly bearingOut: T;
  /** Unit tangent (east, north) at the start, in the direction of travel. */
  readonly direction: Point<T>;
  /**
   * A box holding the element (min east, min north, max east, max north), as JS numbers with a
   * margin: for finding the elements near a point quickly.
   */
  readonly bounds: readonly [number, number, number, number];
}

/** A straight. */
export interface StraightElement<T> extends ElementBase<T> {
  /** `'straight'` */
  readonly type: 'straight';
}

/** A circular arc. */
export interface ArcElement<T> extends ElementBase<T> {
  /** `'arc'` */
  readonly type: 'arc';
  /** The index of its curve in `curves`. */
  readonly curve: number;
  /** Radius. */
  readonly radius: T;
  /** +1 for a right-hand (clockwise) curve, −1 for a left-hand one. */
  readonly turn: 1 | -1;
  /** Centre of the circle. */
  readonly centre: Point<T>;
}

/** A clothoid transition, entering the arc (curvature 0 → 1/R) or leaving it (1/R → 0). */
export interface TransitionElement<T> extends ElementBase<T> {
  /** `'transition'` */
  readonly type: 'transition';
  /** The index of its curve in `curves`. */
  readonly curve: number;
  /** The radius it reaches at its arc end. */
  readonly radius: T;
  /** +1 for a right-hand curve, −1 for a left-hand one. */
  readonly turn: 1 | -1;
  /** `true` from the tangent into the arc (TS → SC), `false` out of it (CS → ST). */
  readonly entering: boolean;
  /** Its tangent point (TS or ST), where the curvature is 0. */
  readonly origin: Point<T>;
  /** The unit tangent at `origin` pointing into the transition. */
  readonly originDirection: Point<T>;
}

/** An element of a horizontal alignment. */
export type AlignmentElement<T> = StraightElement<T> | ArcElement<T> | TransitionElement<T>;

/** A chainage and its point. */
export interface KeyPoint<T> {
  /** Chainage. */
  readonly chainage: T;
  /** The point (x = east, y = north). */
  readonly point: Point<T>;
}

/** A transition's measures (lengths in the unit of the line, angles in degrees). */
export interface TransitionMeasures<T> {
  /** Length Ls. */
  readonly length: T;
  /** Spiral angle θs = Ls/(2R), in degrees. */
  readonly theta: T;
  /** Shift p of the circular arc from the tangent. */
  readonly p: T;
  /** Distance k along the tangent from the TS (or ST) to the foot of the shifted arc's centre. */
  readonly k: T;
  /** x and y of the SC (or CS) from the TS (or ST) along and across the tangent. */
  readonly x: T;
  /** Offset of the SC (or CS) from the tangent. */
  readonly y: T;
}

/** A curve of a horizontal alignment, at its IP. */
export interface HorizontalCurve<T> {
  /** The index of its IP in `points`. */
  readonly ip: number;
  /** The IP. */
  readonly point: Point<T>;
  /** Deflection Δ in degrees, positive for a right-hand curve. */
  readonly deflection: T;
  /** `'right'` or `'left'`. */
  readonly turn: 'right' | 'left';
  /** Radius R of the circular arc. */
  readonly radius: T;
  /** The degree of curve (arc definition, per 100 units of arc): D = 18000/(π·R). */
  readonly degree: T;
  /** Tangent length from the TS (or PC) to the IP: T, or Ts with transitions. */
  readonly tangentIn: T;
  /** Tangent length from the IP to the ST (or PT). */
  readonly tangentOut: T;
  /** Length of the circular arc, Lc (L without transitions). */
  readonly arcLength: T;
  /** Whole length of the curve, TS to ST. */
  readonly length: T;
  /** External distance, IP to the arc (E, or Es with transitions). */
  readonly external: T;
  /** Middle ordinate of the circular arc. */
  readonly middleOrdinate: T;
  /** Long chord of the circular arc. */
  readonly longChord: T;
  /** Central angle of the circular arc, Δc = Δ − θs(in) − θs(out), degrees (unsigned). */
  readonly arcAngle: T;
  /** The transition in, if any. */
  readonly transitionIn?: TransitionMeasures<T>;
  /** The transition out, if any. */
  readonly transitionOut?: TransitionMeasures<T>;
  /** TS (PC/BC without a transition in). */
  readonly ts: KeyPoint<T>;
  /** SC (= TS without a transition in). */
  readonly sc: KeyPoint<T>;
  /** CS (= ST without a transition out). */
  readonly cs: KeyPoint<T>;
  /** ST (PT/EC without a transition out). */
  readonly st: KeyPoint<T>;
}

/** A chainage equation as the alignment holds it. */
export interface ChainageEquation<T> {
  /** Chainage before. */
  readonly back: T;
  /** Chainage after. */
  readonly ahead: T;
  /** Its distance along the line from the start. */
  readonly distance: T;
}

/**
 * A horizontal alignment: plain data (arrays and objects of values of the arithmetic, and
 * JS numbers for the boxes), which may be kept, copied and written out as it is.
 * {@link horizontalAlignment} returns it frozen (every array and object in it, not the
 * arithmetic's values), so it cannot change once made: to change an alignment, make it again
 * from changed input. The functions that read one check it through the first time and then
 * take it as it is; any other object of this shape (a copy, or one built some other way) is
 * checked through, and its boxes indexed, on every call.
 */
export interface HorizontalAlignment<T> {
  /** `'horizontal'` */
  readonly kind: 'horizontal';
  /** The points as read: start, IPs, end. */
  readonly points: readonly Point<T>[];
  /** The elements in order along the line. */
  readonly elements: readonly AlignmentElement<T>[];
  /** One per IP. */
  readonly curves: readonly HorizontalCurve<T>[];
  /** Chainage at the start. */
  readonly startChainage: T;
  /** Chainage at the end. */
  readonly endChainage: T;
  /** Length along the line. */
  readonly length: T;
  /** The chainage equations. */
  readonly equations: readonly ChainageEquation<T>[];
  /**
   * The elements' boxes side by side, four JS numbers per element (min east, min north, max
   * east, max north): the same as each element's `bounds`, in one flat array for a fast search
   * (a tree of these boxes is built the first time it is searched, and kept for this array).
   */
  readonly boxes: readonly number[];
}

/**
 * A horizontal alignment from its points (start, intersection points, end) and a curve at
 * each IP: a circular arc, with or without clothoid transitions.
 *
 * Formulas (classical route surveying; e.g. Mahun, *Curves*, "Horizontal Curves"; Montana DOT
 * *Road Design Manual*, Appendix K, spiral curves): T = R·tan(Δ/2), L = R·Δ, E = R(sec(Δ/2) − 1),
 * M = R(1 − cos(Δ/2)), LC = 2R·sin(Δ/2); with transitions θs = Ls/(2R), p = y − R(1 − cos θs),
 * k = x − R·sin θs, Ts = (R + p)·tan(Δ/2) + k (for unequal transitions,
 * Ts(in) = k1 + (R + p1)·tan(Δ/2) + (p2 − p1)/sin Δ and its mirror, derived from the shifted
 * centre), Es = (R + p)·sec(Δ/2) − R, Lc = R(Δ − θs1 − θs2). Here tan(Δ/2) = |u × v|/(1 + u·v)
 * and sin Δ = |u × v| come from the unit vectors u, v of the legs, so a curve between legs of
 * rational direction (Pythagorean, e.g. 3-4-5) with no transitions has its PC, PT, centre and
 * tangent length exact in `rational`; arc lengths (R·Δ) and everything along transitions need
 * an angle and are within the arithmetic's transcendental tolerance (1e-40 relative in
 * `rational`).
 *
 * A computational aid: check independently; design and setting-out follow the applicable road
 * or railway standard and licensed practice.
 *
 * @param A the arithmetic
 * @param input `{ points, curves, startChainage?, equations? }`; `curves[i]` belongs to `points[i + 1]`
 * @returns `{ kind, points, elements, curves, startChainage, endChainage, length, equations }`
 * @throws {QuadspreadError} `TOO_FEW_POINTS` for fewer than two points; `COINCIDENT_POINTS` for
 *   consecutive points that coincide; `INVALID_ARGUMENT` for a curve count that does not match,
 *   a radius ≤ 0, a negative transition, a curve where the line does not turn (or turns back),
 *   a bad equation; `TRANSITION_TOO_LONG` when the transitions turn more than Δ;
 *   `CURVES_OVERLAP` when tangents overlap on a leg; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, horizontalAlignment } from 'quadspread';
 * const R = rational;
 * // legs along 3-4-5 directions: the tangent points and the centre are exact
 * const h = horizontalAlignment(R, { points: [{ x: 0, y: 0 }, { x: 0, y: 100 }, { x: 60, y: 180 }], curves: [{ radius: 30 }] });
 * const c = h.curves[0]!;
 * [R.toString(c.tangentIn), c.turn, R.toString(c.ts.point.y), R.toString(c.st.point.x), h.elements.map((e) => e.type)];
 * //=> ['10', 'right', '90', '6', ['straight', 'arc', 'straight']]
 * ```
 */
export function horizontalAlignment<T>(
  A: Arithmetic<T>,
  input: HorizontalAlignmentInput<T>,
): HorizontalAlignment<T> {
  checkArithmetic(A, 'horizontalAlignment');
  const where = 'horizontalAlignment(A, input)';
  const o = readObject(input, where, 'an object { points, curves }');
  const rawPoints = readList<unknown>(o.points, `${where}.points`);
  if (rawPoints.length < 2)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      `${where}.points`,
      `${rawPoints.length} points: an alignment needs a start and an end`,
    );
  const points = rawPoints.map((p, i) => readXY(A, p, `${where}.points[${i}]`));
  const rawCurves = readList<unknown>(o.curves ?? [], `${where}.curves`);
  if (rawCurves.length !== points.length - 2)
    throw invalidArgument(
      `${where}.curves`,
      `${rawCurves.length} curves for ${points.length - 2} IPs: give one per IP (curves[i] belongs to points[i + 1])`,
    );
  const startChainage =
    o.startChainage === undefined
      ? A.zero
      : readChainage(A, o.startChainage, `${where}.startChainage`);
  // Legs: unit vectors and lengths.
  const legs = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const p = points[i]!;
    const q = points[i + 1]!;
    const dx = A.sub(q.x, p.x);
    const dy = A.sub(q.y, p.y);
    if (A.isZero(dx) && A.isZero(dy))
      throw coincidentPoints(
        `${where}.points[${i + 1}]`,
        `it is the same point as points[${i}] (${A.toString(p.x)}, ${A.toString(p.y)})`,
      );
    legs.push(unit(A, dx, dy, where));
  }
  const toDeg = degPerRad(A);
  const curves: Omit<HorizontalCurve<T>, 'ts' | 'sc' | 'cs' | 'st'>[] = [];
  const geo: CurveGeometry<T>[] = [];
  for (let i = 0; i < rawCurves.length; i++) {
    const at = `${where}.curves[${i}] (IP points[${i + 1}])`;
    const c = readObject(rawCurves[i], at, 'a curve { radius } or { degree, definition }');
    const u = legs[i]!.u;
    const v = legs[i + 1]!.u;
    const cross = A.sub(A.mul(u.x, v.y), A.mul(u.y, v.x));
    const dot = A.add(A.mul(u.x, v.x), A.mul(u.y, v.y));
    if (A.isZero(cross))
      throw invalidArgument(
        at,
        A.sign(dot) > 0
          ? 'the line does not turn at this IP (zero deflection), so it can take no curve'
          : 'the line turns back on itself at this IP',
      );
    const turn: 1 | -1 = A.sign(cross) < 0 ? 1 : -1; // clockwise (right) when u × v < 0
    const sinD = A.abs(cross);
    const tanHalf = A.div(sinD, A.add(A.one, dot)); // tan(Δ/2) = sin Δ/(1 + cos Δ)
    const delta = A.atan2(sinD, dot); // Δ in radians, (0, π)
    const R = readRadius(A, c, at);
    const Ls1 =
      c.transitionIn === undefined ? A.zero : readLength(A, c.transitionIn, `${at}.transitionIn`);
    const Ls2 =
      c.transitionOut === undefined
        ? A.zero
        : readLength(A, c.transitionOut, `${at}.transitionOut`);
    const t1 = spiralMeasures(A, R, Ls1);
    const t2 = spiralMeasures(A, R, Ls2);
    const arcAngle = A.sub(delta, A.add(t1.theta, t2.theta));
    if (A.sign(arcAngle) < 0)
      throw new QuadspreadError(
        'TRANSITION_TOO_LONG',
        at,
        `the transitions turn ${A.toPrecision(A.mul(A.add(t1.theta, t2.theta), toDeg), 8)}°, more than the deflection ${A.toPrecision(A.mul(delta, toDeg), 8)}°`,
      );
    // Tangent lengths from the shifted centre: T1 = k1 + (R + p1)·tan(Δ/2) + (p2 − p1)/sin Δ.
    const dp = A.div(A.sub(t2.p, t1.p), sinD);
    const T1 = A.add(A.add(t1.k, A.mul(A.add(R, t1.p), tanHalf)), dp);
    const T2 = A.sub(A.add(t2.k, A.mul(A.add(R, t2.p), tanHalf)), dp);
    // External: from the IP to the centre, less R. The centre is (R + p1) off the back tangent
    // and (T1 − k1) back from the IP along it.
    const a = A.sub(T1, t1.k);
    const b = A.add(R, t1.p);
    const external = A.sub(root(A, A.add(A.mul(a, a), A.mul(b, b)), at), R);
    const ip = points[i + 1]!;
    const ts = along(A, ip, u, A.neg(T1));
    const st = along(A, ip, v, T2);
    const nu = turnSide(A, u, turn);
    const nv = turnSide(A, v, turn);
    const sc = A.isZero(Ls1) ? ts : along(A, along(A, ts, u, t1.x), nu, t1.y);
    const cs = A.isZero(Ls2) ? st : along(A, along(A, st, v, A.neg(t2.x)), nv, t2.y);
    // Direction at the SC: u turned by θs1 towards the curve.
    const dirSc = A.isZero(Ls1) ? u : rotate(A, u, A.cos(t1.theta), A.sin(t1.theta), turn);
    const centre = along(A, sc, turnSide(A, dirSc, turn), R);
    const arcLength = A.mul(R, arcAngle);
    // Long chord and middle ordinate of the arc from its end points: LC = |SC CS|, M = R − √(R² − LC²/4).
    const qc = A.add(
      A.mul(A.sub(cs.x, sc.x), A.sub(cs.x, sc.x)),
      A.mul(A.sub(cs.y, sc.y), A.sub(cs.y, sc.y)),
    );
    const longChord = root(A, qc, at);
    const half = A.sub(A.mul(R, R), A.div(qc, A.from(4)));
    const middleOrdinate = A.sub(R, root(A, A.sign(half) < 0 ? A.zero : half, at));
    curves.push({
      ip: i + 1,
      point: ip,
      deflection: A.mul(A.mul(delta, toDeg), A.from(turn)),
      turn: turn > 0 ? 'right' : 'left',
      radius: R,
      degree: A.div(A.from(18000), A.mul(A.pi, R)),
      tangentIn: T1,
      tangentOut: T2,
      arcLength,
      length: A.add(A.add(Ls1, Ls2), arcLength),
      external,
      middleOrdinate,
      longChord,
      arcAngle: A.mul(arcAngle, toDeg),
      ...(A.isZero(Ls1) ? {} : { transitionIn: measuresOut(A, Ls1, t1, toDeg) }),
      ...(A.isZero(Ls2) ? {} : { transitionOut: measuresOut(A, Ls2, t2, toDeg) }),
    });
    geo.push({ ts, sc, cs, st, u, v, turn, R, Ls1, Ls2, centre, arcLength, dirSc });
  }
  // Elements, in order, with their distances from the start.
  const elements: Omit<AlignmentElement<T>, 'startChainage' | 'endChainage'>[] = [];
  const keyDistances: { ts: T; sc: T; cs: T; st: T }[] = [];
  let distance = A.zero;
  let from = points[0]!;
  for (let i = 0; i < legs.length; i++) {
    const leg = legs[i]!;
    const prevT = i === 0 ? A.zero : curves[i - 1]!.tangentOut;
    const nextT = i === legs.length - 1 ? A.zero : curves[i]!.tangentIn;
    const straight = A.sub(leg.length, A.add(prevT, nextT));
    if (A.sign(straight) < 0)
      throw new QuadspreadError(
        'CURVES_OVERLAP',
        `${where}.points[${i}]–points[${i + 1}]`,
        `the tangents on this leg (${A.toPrecision(prevT, 10)} + ${A.toPrecision(nextT, 10)}) are longer than the leg (${A.toPrecision(leg.length, 10)})`,
      );
    const to = i === legs.length - 1 ? points[i + 1]! : geo[i]!.ts;
    if (!A.isZero(straight)) {
      elements.push(straightElement(A, from, to, leg.u, distance, straight));
      distance = A.add(distance, straight);
    }
    if (i === legs.length - 1) break;
    const g = geo[i]!;
    const d0 = distance;
    if (!A.isZero(g.Ls1)) {
      elements.push(transitionElement(A, g.ts, g.sc, g.u, g.turn, true, i, g.R, g.Ls1, distance));
      distance = A.add(distance, g.Ls1);
    }
    const d1 = distance;
    if (A.sign(g.arcLength) > 0) {
      elements.push(arcElement(A, g, i, distance));
      distance = A.add(distance, g.arcLength);
    }
    const d2 = distance;
    if (!A.isZero(g.Ls2)) {
      elements.push(transitionElement(A, g.cs, g.st, g.v, g.turn, false, i, g.R, g.Ls2, distance));
      distance = A.add(distance, g.Ls2);
    }
    keyDistances.push({ ts: d0, sc: d1, cs: d2, st: distance });
    from = g.st;
  }
  const length = distance;
  const equations = readEquations(A, o.equations, startChainage, length, `${where}.equations`);
  const chain = (d: T) => chainageAt(A, startChainage, equations, d);
  const endChainage = chain(length);
  const h = freezeData(A, {
    kind: 'horizontal',
    points,
    elements: elements.map(
      (e) =>
        ({
          ...e,
          startChainage: chain(e.startDistance),
          endChainage: chainageAt(
            A,
            startChainage,
            equations,
            A.add(e.startDistance, e.length),
            true,
          ),
        }) as AlignmentElement<T>,
    ),
    curves: curves.map((c, i) => {
      const g = geo[i]!;
      const k = keyDistances[i]!;
      return {
        ...c,
        ts: { chainage: chain(k.ts), point: g.ts },
        sc: { chainage: chain(k.sc), point: g.sc },
        cs: { chainage: chain(k.cs), point: g.cs },
        st: { chainage: chain(k.st), point: g.st },
      };
    }),
    startChainage,
    endChainage,
    length,
    equations,
    boxes: elements.flatMap((e) => e.bounds),
  }) as HorizontalAlignment<T>;
  made.add(h);
  keepBoxTree(h.boxes);
  return h;
}

/**
 * Freezes `x` and every object and array in it, except the arithmetic's own values (which are
 * left as they are): what a function builds and returns, so that nothing in it can be changed
 * in place after it has been checked and its boxes indexed.
 */
function freezeData<T, U>(A: Arithmetic<T>, x: U): U {
  if (typeof x === 'object' && x !== null && !A.is(x)) {
    Object.freeze(x);
    for (const v of Object.values(x)) freezeData(A, v);
  }
  return x;
}

interface CurveGeometry<T> {
  ts: Point<T>;
  sc: Point<T>;
  cs: Point<T>;
  st: Point<T>;
  u: Point<T>;
  v: Point<T>;
  turn: 1 | -1;
  R: T;
  Ls1: T;
  Ls2: T;
  centre: Point<T>;
  arcLength: T;
  dirSc: Point<T>;
}

/** The unit normal of u on the side the curve turns to: right for turn = +1. @internal */
export function turnSide<T>(A: Arithmetic<T>, u: Point<T>, turn: 1 | -1): Point<T> {
  const r = rightOf(A, u);
  return turn > 0 ? r : { x: A.neg(r.x), y: A.neg(r.y) };
}

function readRadius<T>(A: Arithmetic<T>, c: Record<string, unknown>, at: string): T {
  if (c.radius !== undefined) {
    if (c.degree !== undefined) throw invalidArgument(at, 'give either radius or degree, not both');
    return readLength(A, c.radius, `${at}.radius`, true);
  }
  if (c.degree === undefined)
    throw invalidArgument(at, 'a curve needs a radius or a degree of curve');
  const def = c.definition ?? 'arc';
  if (def !== 'arc' && def !== 'chord')
    throw invalidArgument(`${at}.definition`, `${show(def)} is not 'arc' or 'chord'`);
  const D = angleToDegrees(A, c.degree as Numeric<T>);
  if (A.sign(D) <= 0 || A.cmp(D, A.from(def === 'chord' ? 180 : 360)) >= 0)
    throw invalidArgument(
      `${at}.degree`,
      `${A.toString(D)}° is not a degree of curve (0° < D < ${def === 'chord' ? 180 : 360}°)`,
    );
  // Arc definition: 100 ft of arc subtends D, R = 100·180/(π·D); chord definition: a 100-ft chord
  // subtends D, R = 50/sin(D/2) (US practice).
  if (def === 'arc') return A.div(A.from(18000), A.mul(A.pi, D));
  return A.div(A.from(50), A.sin(A.div(A.mul(D, A.pi), A.from(360))));
}

interface Spiral<T> {
  theta: T;
  p: T;
  k: T;
  x: T;
  y: T;
}

function spiralMeasures<T>(A: Arithmetic<T>, R: T, Ls: T): Spiral<T> {
  if (A.isZero(Ls)) return { theta: A.zero, p: A.zero, k: A.zero, x: A.zero, y: A.zero };
  const c = clothoidSeries(A, Ls, R, Ls);
  const theta = c.angle; // θs = Ls/(2R)
  // p = y − R(1 − cos θs), k = x − R sin θs (Montana DOT Road Design Manual, Appendix K).
  return {
    theta,
    p: A.sub(c.y, A.mul(R, A.sub(A.one, A.cos(theta)))),
    k: A.sub(c.x, A.mul(R, A.sin(theta))),
    x: c.x,
    y: c.y,
  };
}

function measuresOut<T>(A: Arithmetic<T>, Ls: T, s: Spiral<T>, toDeg: T): TransitionMeasures<T> {
  return { length: Ls, theta: A.mul(s.theta, toDeg), p: s.p, k: s.k, x: s.x, y: s.y };
}

function box<T>(
  A: Arithmetic<T>,
  pts: Point<T>[],
  margin: number,
): [number, number, number, number] {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const p of pts) {
    const x = A.toNumber(p.x);
    const y = A.toNumber(p.y);
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  }
  // A margin for the rounding of toNumber as well as the bulge of a curve.
  const m = margin + 1e-9 * (Math.abs(x0) + Math.abs(y0) + Math.abs(x1) + Math.abs(y1) + 1);
  return [x0 - m, y0 - m, x1 + m, y1 + m];
}

function straightElement<T>(
  A: Arithmetic<T>,
  start: Point<T>,
  end: Point<T>,
  u: Point<T>,
  d: T,
  length: T,
) {
  const b = azimuth(A, u);
  return {
    type: 'straight' as const,
    startDistance: d,
    length,
    start,
    end,
    bearingIn: b,
    bearingOut: b,
    direction: u,
    bounds: box(A, [start, end], 0),
  };
}

function arcElement<T>(A: Arithmetic<T>, g: CurveGeometry<T>, curve: number, d: T) {
  const dirCs = turnedDirection(A, g.centre, g.cs, g.turn);
  const chord = Math.hypot(A.toNumber(A.sub(g.cs.x, g.sc.x)), A.toNumber(A.sub(g.cs.y, g.sc.y)));
  const r = A.toNumber(g.R);
  // The arc lies within its chord's box widened by R (1 − cos(Δc/2)) ≤ R; use the sagitta bound.
  const bulge = r - Math.sqrt(Math.max(0, r * r - (chord * chord) / 4));
  const bulgeMax = A.toNumber(g.arcLength) > Math.PI * r * 0.5 ? r : bulge;
  return {
    type: 'arc' as const,
    curve,
    startDistance: d,
    length: g.arcLength,
    start: g.sc,
    end: g.cs,
    bearingIn: azimuth(A, g.dirSc),
    bearingOut: azimuth(A, dirCs),
    direction: g.dirSc,
    bounds: box(A, [g.sc, g.cs], bulgeMax),
    radius: g.R,
    turn: g.turn,
    centre: g.centre,
  };
}

/** Direction of travel at a point P of an arc with this centre and turn. @internal */
export function turnedDirection<T>(
  A: Arithmetic<T>,
  centre: Point<T>,
  p: Point<T>,
  turn: 1 | -1,
): Point<T> {
  const rx = A.sub(p.x, centre.x);
  const ry = A.sub(p.y, centre.y);
  const r = root(A, A.add(A.mul(rx, rx), A.mul(ry, ry)), 'arc');
  // Clockwise travel (right turn): tangent (ry, −rx)/r; anticlockwise: (−ry, rx)/r.
  return turn > 0
    ? { x: A.div(ry, r), y: A.div(A.neg(rx), r) }
    : { x: A.div(A.neg(ry), r), y: A.div(rx, r) };
}

function transitionElement<T>(
  A: Arithmetic<T>,
  start: Point<T>,
  end: Point<T>,
  tangent: Point<T>,
  turn: 1 | -1,
  entering: boolean,
  curve: number,
  R: T,
  Ls: T,
  d: T,
) {
  const theta = A.div(Ls, A.mul(A.from(2), R));
  const turned = rotate(
    A,
    tangent,
    A.cos(theta),
    A.sin(theta),
    entering ? turn : (-turn as 1 | -1),
  );
  // Entering: tangent u at the TS, u turned by θs at the SC. Leaving: v turned back by θs at the CS, v at the ST.
  const dirIn = entering ? tangent : turned;
  const dirOut = entering ? turned : tangent;
  const chord = Math.hypot(A.toNumber(A.sub(end.x, start.x)), A.toNumber(A.sub(end.y, start.y)));
  return {
    type: 'transition' as const,
    curve,
    startDistance: d,
    length: Ls,
    start,
    end,
    bearingIn: azimuth(A, dirIn),
    bearingOut: azimuth(A, dirOut),
    direction: dirIn,
    // A transition stays within θs·chord of its chord (it turns by at most θs ≤ π).
    bounds: box(A, [start, end], chord * Math.min(1, A.toNumber(theta))),
    radius: R,
    turn,
    entering,
    origin: entering ? start : end,
    originDirection: entering ? tangent : { x: A.neg(tangent.x), y: A.neg(tangent.y) },
  };
}

function readEquations<T>(
  A: Arithmetic<T>,
  raw: unknown,
  start: T,
  length: T,
  where: string,
): ChainageEquation<T>[] {
  if (raw === undefined) return [];
  const list = readList<unknown>(raw, where, 10_000);
  const out: ChainageEquation<T>[] = [];
  let regionStart = start;
  let regionDistance = A.zero;
  for (let i = 0; i < list.length; i++) {
    const e = readObject(list[i], `${where}[${i}]`, 'an equation { back, ahead }');
    const back = readChainage(A, e.back, `${where}[${i}].back`);
    const ahead = readChainage(A, e.ahead, `${where}[${i}].ahead`);
    const distance = A.add(regionDistance, A.sub(back, regionStart));
    if (A.cmp(back, regionStart) < 0 || A.cmp(distance, length) > 0)
      throw invalidArgument(
        `${where}[${i}].back`,
        `${A.toString(back)} is not on the line between chainage ${A.toString(regionStart)} and its end`,
      );
    out.push({ back, ahead, distance });
    regionStart = ahead;
    regionDistance = distance;
  }
  return out;
}

/** The chainage at a distance along the line; at an equation, the ahead chainage (the back one when `back`). @internal */
export function chainageAt<T>(
  A: Arithmetic<T>,
  start: T,
  equations: readonly ChainageEquation<T>[],
  d: T,
  back = false,
): T {
  let c0 = start;
  let d0 = A.zero;
  for (const e of equations) {
    const s = A.cmp(e.distance, d);
    if (s < 0 || (s === 0 && !back)) {
      c0 = e.ahead;
      d0 = e.distance;
    } else break;
  }
  return A.add(c0, A.sub(d, d0));
}

/**
 * The distance along the line of a chainage: in the region (before the first equation, between
 * two, after the last) that holds it; `region` picks one when the chainage occurs twice.
 * @throws {QuadspreadError} `OFF_ALIGNMENT` when no region holds it; `INVALID_ARGUMENT` when two do and no region is given.
 * @internal
 */
export function distanceOf<T>(
  A: Arithmetic<T>,
  h: HorizontalAlignment<T>,
  c: T,
  where: string,
  region?: number,
): T {
  const found: T[] = [];
  let c0 = h.startChainage;
  let d0 = A.zero;
  const n = h.equations.length;
  for (let r = 0; r <= n; r++) {
    const dEnd = r < n ? h.equations[r]!.distance : h.length;
    const cEnd = A.add(c0, A.sub(dEnd, d0));
    if ((region === undefined || region === r) && A.cmp(c, c0) >= 0 && A.cmp(c, cEnd) <= 0) {
      const d = A.add(d0, A.sub(c, c0));
      if (!found.some((f) => A.eq(f, d))) found.push(d);
    }
    if (r < n) {
      c0 = h.equations[r]!.ahead;
      d0 = dEnd;
    }
  }
  if (found.length === 1) return found[0]!;
  if (found.length === 0)
    throw new QuadspreadError(
      'OFF_ALIGNMENT',
      where,
      `chainage ${A.toString(c)} is not on the alignment (${A.toString(h.startChainage)} to ${A.toString(h.endChainage)}${n ? `, with ${n} equation(s)` : ''}${region !== undefined ? `, region ${region}` : ''})`,
    );
  throw invalidArgument(
    where,
    `chainage ${A.toString(c)} occurs ${found.length} times (a chainage equation re-uses it): pass { region } to choose`,
  );
}

/** Whether every entry (holes included) is an object. */
function elementsAreObjects(elements: readonly unknown[]): boolean {
  for (let i = 0; i < elements.length; i++) {
    const e = elements[i];
    if (typeof e !== 'object' || e === null) return false;
  }
  return true;
}

// Alignments made here: frozen in full when made (every array and object, see freezeData), and
// never handed out before, so nothing in one can change. Such an alignment is checked through
// once per arithmetic and then taken as it is; so is one proven unchangeable (frozenData: frozen
// in full, plain data properties only, as another copy of this library makes them, say the
// float bundle's). Any other (a copy, or a look-alike built some other way, say read from JSON)
// is checked through on every call, its boxes included, so that a change made in place is never
// met by stale checks.
const made = new WeakSet<object>();
const intact = new WeakMap<object, unknown>();
// The last alignment found intact, and its arithmetic: a comparison instead of a hash lookup.
let lastAlignment: object | undefined;
let lastArithmetic: unknown;

/** Whether `o` was made by horizontalAlignment and found intact for A. */
function unchanged(A: unknown, o: HorizontalAlignment<unknown>): boolean {
  if (o === lastAlignment) return lastArithmetic === A;
  if (intact.get(o) !== A) return false;
  lastAlignment = o;
  lastArithmetic = A;
  return true;
}

/** Whether every element and equation of `o` has the fields of its kind, values of A. */
function isIntact<T>(A: Arithmetic<T>, o: HorizontalAlignment<T>): boolean {
  const pt = (p: unknown): boolean =>
    typeof p === 'object' && p !== null && A.is((p as Point<T>).x) && A.is((p as Point<T>).y);
  const nCurves = Array.isArray(o.curves) ? o.curves.length : -1;
  if (nCurves < 0 || !elementsAreObjects(o.curves)) return false;
  for (let i = 0; i < o.elements.length; i++) {
    const e = o.elements[i] as AlignmentElement<T>;
    if (
      !A.is(e.startChainage) ||
      !A.is(e.endChainage) ||
      !A.is(e.startDistance) ||
      !A.is(e.length) ||
      !A.is(e.bearingIn) ||
      !A.is(e.bearingOut) ||
      !pt(e.start) ||
      !pt(e.end) ||
      !pt(e.direction)
    )
      return false;
    if (e.type === 'straight') continue;
    if (e.type !== 'arc' && e.type !== 'transition') return false;
    if (
      !A.is(e.radius) ||
      (e.turn !== 1 && e.turn !== -1) ||
      !Number.isInteger(e.curve) ||
      e.curve < 0 ||
      e.curve >= nCurves
    )
      return false;
    if (
      e.type === 'arc'
        ? !pt(e.centre)
        : typeof e.entering !== 'boolean' || !pt(e.origin) || !pt(e.originDirection)
    )
      return false;
  }
  for (let i = 0; i < o.equations.length; i++) {
    const q = o.equations[i]!;
    if (!A.is(q.back) || !A.is(q.ahead) || !A.is(q.distance)) return false;
  }
  for (let i = 0; i < o.boxes.length; i++) if (typeof o.boxes[i] !== 'number') return false;
  if (made.has(o)) return trust(A, o);
  // A look-alike: the search trusts each element's box to hold it, so its ends must be in it
  // (an element moved without its box would otherwise be passed by, silently).
  const inBox = (p: Point<T>, k: number): boolean => {
    const x = A.toNumber(p.x);
    const y = A.toNumber(p.y);
    return x >= o.boxes[k]! && y >= o.boxes[k + 1]! && x <= o.boxes[k + 2]! && y <= o.boxes[k + 3]!;
  };
  for (let i = 0; i < o.elements.length; i++) {
    const e = o.elements[i]!;
    if (!inBox(e.start, 4 * i) || !inBox(e.end, 4 * i)) return false;
  }
  if (frozenData(A, o, new Set())) {
    keepBoxTree(o.boxes);
    return trust(A, o);
  }
  return true;
}

/** Records `o` as found intact for A, to be taken as it is from now on. */
function trust(A: unknown, o: object): true {
  intact.set(o, A);
  lastAlignment = o;
  lastArithmetic = A;
  return true;
}

const PLAIN = [Object.prototype, Array.prototype, null];

/**
 * Whether nothing in `x` can change: every object and array in it (the arithmetic's values
 * aside) frozen, with a plain prototype and only data properties. (A getter could answer
 * differently from call to call; a proxy over a frozen object must answer as the object does.)
 */
function frozenData(A: Arithmetic<unknown>, x: unknown, seen: Set<object>): boolean {
  if (typeof x !== 'object' || x === null || seen.has(x) || A.is(x)) return true;
  seen.add(x);
  if (!Object.isFrozen(x) || !PLAIN.includes(Object.getPrototypeOf(x) as object | null))
    return false;
  const d = Object.getOwnPropertyDescriptors(x);
  for (const k of Reflect.ownKeys(d)) {
    const p = (d as Record<PropertyKey, PropertyDescriptor>)[k]!;
    if (!('value' in p) || !frozenData(A, p.value, seen)) return false;
  }
  return true;
}

/**
 * Checks that `h` looks like an alignment of this arithmetic. One made by horizontalAlignment
 * and found intact before is taken as it is; any other is checked through. @internal
 */
export function readAlignment<T>(
  A: Arithmetic<T>,
  h: unknown,
  where: string,
): HorizontalAlignment<T> {
  const o = h as HorizontalAlignment<T> | null;
  if (o !== null && typeof o === 'object' && unchanged(A, o)) return o;
  if (
    o === null ||
    typeof o !== 'object' ||
    o.kind !== 'horizontal' ||
    !Array.isArray(o.elements) ||
    o.elements.length === 0 ||
    !Array.isArray(o.equations) ||
    !Array.isArray(o.boxes) ||
    o.boxes.length !== 4 * o.elements.length ||
    !elementsAreObjects(o.elements) ||
    !elementsAreObjects(o.equations) ||
    !A.is(o.length) ||
    !A.is(o.startChainage) ||
    !A.is(o.elements[0]!.startDistance) ||
    !A.is(o.endChainage) ||
    !isIntact(A, o)
  )
    throw notAnAlignment(A, h, where);
  return o;
}

/** The error for what is not an alignment of A. @internal */
export function notAnAlignment<T>(A: Arithmetic<T>, h: unknown, where: string): QuadspreadError {
  return invalidArgument(
    where,
    `${show(h)} is not a horizontal alignment made by horizontalAlignment in ${A.name}`,
  );
}

/** Reads a chainage for an alignment and turns it into a distance along it. @internal */
export function readDistance<T>(
  A: Arithmetic<T>,
  h: HorizontalAlignment<T>,
  chainage: unknown,
  where: string,
  region?: unknown,
): T {
  if (
    region !== undefined &&
    (typeof region !== 'number' ||
      !Number.isInteger(region) ||
      region < 0 ||
      region > h.equations.length)
  )
    throw invalidArgument(
      `${where} region`,
      `${show(region)} is not a region index 0..${h.equations.length}`,
    );
  const c = readChainage(A, chainage, `${where} chainage`);
  return distanceOf(A, h, c, `${where} chainage`, region as number | undefined);
}

/** Reads a number with an error naming `where`. @internal */
export const num = <T>(A: Arithmetic<T>, x: unknown, where: string): T =>
  readNumber(A, x as Numeric<T>, where);
