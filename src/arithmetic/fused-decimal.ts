/**
 * Fused kernels for the {@link decimal} arithmetics: whole formulas computed exactly with
 * bigints and rounded once per result, instead of rounding after every step. Each result is
 * the exact value correctly rounded to the arithmetic's digits (ties to even), so it is never
 * less accurate than the generic step-by-step result and often one rounding better; where
 * no intermediate step of the generic path rounds, the two are equal
 * (test/perf/fused-decimal.test.ts checks both). Performance only.
 *
 * @module arithmetic
 * @internal
 */
import type { Big } from 'big.js';
import type { FusedKernels, FusedTraverse, FusedTriangle } from './types.js';
import { readFusedTraverse } from './fused-input.js';

const POW10: bigint[] = [];
for (let k = 0, p = 1n; k < 64; k++, p *= 10n) POW10.push(p);
function pow10(k: number): bigint {
  return k < POW10.length ? (POW10[k] as bigint) : 10n ** BigInt(k);
}

/** The integer coefficient of a Big (value = coefficient · 10^(e − (c.length − 1))). */
function coefficient(x: Big): bigint {
  const c = x.c;
  let m: bigint;
  if (c.length <= 15) {
    let v = 0;
    for (let i = 0; i < c.length; i++) v = v * 10 + (c[i] as number);
    m = BigInt(v);
  } else {
    m = BigInt(c.join(''));
  }
  return x.s < 0 ? -m : m;
}

/**
 * The number of decimal digits of |x| (x ≠ 0), within one either way: from the double nearest
 * x while it is below 1e300 (its rounding and its log10 can move the count by one next to a
 * power of ten), from the text beyond. `divide` sizes its quotient with it: a count one too
 * small gives one quotient digit more; one too large, one digit fewer, still one beyond the
 * rounding digit. The text of a 40-digit bigint costs about four times its conversion to a
 * double and its logarithm. @internal
 */
export function decimalLength(x: bigint): number {
  const v = Math.abs(Number(x));
  if (v < 1e300) return Math.floor(Math.log10(v)) + 1;
  return (x < 0n ? -x : x).toString().length;
}

/**
 * Most decimal places between the largest and the smallest digit of a kernel's inputs: beyond
 * it the exact integers would have thousands of digits, and the generic code (which rounds at
 * every step) is faster. Survey coordinates span a few dozen.
 */
const MAX_SPAN = 2500;

function exponent(x: Big): number {
  return x.e - (x.c.length - 1);
}

/**
 * The kernels of one decimal arithmetic of `digits` significant digits, given its zero (a
 * value of its big.js constructor) and its `from`.
 * @internal
 */
export function decimalKernels(
  digits: number,
  zero: Big,
  from: (x: unknown) => Big,
): FusedKernels<Big> {
  // Results are built directly as Bigs of this arithmetic (a copy of its zero, then its digits),
  // without going through text: most of the cost of a decimal result is otherwise the parse.
  const Ctor = zero.constructor as unknown as new (x: Big) => Big;

  const proto = Object.getPrototypeOf(zero) as object;
  /** A Big of this arithmetic with the given fields, made as big.js makes one (s, e, c, constructor). */
  function big(sign: number, e: number, c: number[]): Big {
    const b = Object.create(proto) as { s: number; e: number; c: number[]; constructor: unknown };
    b.s = sign;
    b.e = e;
    b.c = c;
    b.constructor = Ctor;
    return b as unknown as Big;
  }

  /** coef·10^exp rounded to `digits` significant digits, ties to even (IEEE 754 roundTiesToEven). */
  function make(coef: bigint, exp: number): Big {
    if (coef === 0n) return big(1, 0, [0]);
    const neg = coef < 0n;
    const t = (neg ? -coef : coef).toString();
    const n = t.length;
    const e = exp + n - 1;
    // The digits kept, without trailing zeros (big.js keeps none): the array is made at its
    // final length (setting an array's length afterwards is a call into the runtime, and was
    // a tenth of a decimal traverse).
    let keep = n;
    let bump = false;
    if (n > digits) {
      // Round the decimal digits themselves: look at the first dropped digit and the rest.
      const next = t.charCodeAt(digits) - 48;
      let up = next > 5;
      if (next === 5) {
        let rest = false;
        for (let i = digits + 1; i < n; i++)
          if (t.charCodeAt(i) !== 48) {
            rest = true;
            break;
          }
        up = rest || (t.charCodeAt(digits - 1) - 48) % 2 === 1;
      }
      keep = digits;
      if (up) {
        // The nines before the last kept digit that is not a nine become zeros (dropped); that
        // digit goes up by one. All nines: 99…9 rounds up to 10…0.
        while (keep > 0 && t.charCodeAt(keep - 1) === 57) keep--;
        if (keep === 0) return big(neg ? -1 : 1, e + 1, [1]);
        bump = true;
      }
    }
    if (!bump) while (keep > 1 && t.charCodeAt(keep - 1) === 48) keep--;
    const c: number[] = new Array(keep);
    for (let i = 0; i < keep; i++) c[i] = t.charCodeAt(i) - 48;
    if (bump) c[keep - 1]! += 1;
    return big(neg ? -1 : 1, e, c);
  }

  let lastB = 0n,
    lastLb = 1;
  /** (an·10^ae)/(bn·10^be) for bn > 0, correctly rounded: at least digits + 2 quotient digits and a sticky one. */
  function divide(an: bigint, ae: number, bn: bigint, be: number): Big {
    if (an === 0n) return big(1, 0, [0]);
    const la = decimalLength(an);
    if (bn !== lastB) {
      lastB = bn;
      lastLb = bn.toString().length;
    }
    // la is within one of |an|'s digit count (lastLb is exact): the quotient then has at
    // least digits + 2 digits before the sticky one.
    const k = Math.max(0, digits + 4 - (la - lastLb));
    const num = an * pow10(k);
    const q = num / bn;
    if (q * bn === num) return make(q, ae - be - k);
    return make(q * 10n + (an < 0n ? -1n : 1n), ae - be - k - 1);
  }

  /** x is a Big made by this arithmetic's constructor (not a number, text or another instance's Big). */
  const own = (x: unknown): boolean =>
    x !== null &&
    typeof x === 'object' &&
    (x as { constructor?: unknown }).constructor === Ctor &&
    Array.isArray((x as Big).c);

  /** x read by the arithmetic (its own rounding), or undefined where from() would throw. */
  const read = (x: unknown): Big | undefined => {
    if (
      typeof x !== 'number' &&
      typeof x !== 'string' &&
      typeof x !== 'bigint' &&
      (x === null || typeof x !== 'object')
    )
      return undefined;
    try {
      return from(x);
    } catch {
      return undefined; // the generic code reports it
    }
  };

  /**
   * traverse for courses given as { latitude, departure, distance }, compass rule, no interior
   * angles: exact sums of the inputs on one decimal scale 10^e, and each adjusted value
   * (lat − north·d/total and the running sums of those) computed exactly and rounded once
   * (compass rule as in src/cogo/traverse.ts). The closure's root and ratio are left to the
   * caller. Undefined for any other input and wherever the generic code reports an error.
   */
  function traverse(input: unknown): FusedTraverse<Big> | undefined {
    const parsed = readFusedTraverse(input, read);
    if (!parsed) return undefined;
    const { start, end, list } = parsed;
    const n = list.length;
    const lat: Big[] = new Array(n),
      dep: Big[] = new Array(n),
      len: Big[] = new Array(n);
    let e = Math.min(exponent(start.x), exponent(start.y), exponent(end.x), exponent(end.y));
    for (let i = 0; i < n; i++) {
      const c = list[i] as {
        bearing?: unknown;
        latitude?: unknown;
        departure?: unknown;
        distance?: unknown;
      } | null;
      if (
        c === null ||
        typeof c !== 'object' ||
        c.bearing !== undefined ||
        c.distance === undefined
      )
        return undefined;
      const la = read(c.latitude),
        de = read(c.departure),
        d = read(c.distance);
      if (!la || !de || !d || (d.s < 0 && d.c[0] !== 0)) return undefined;
      lat[i] = la;
      dep[i] = de;
      len[i] = d;
      e = Math.min(e, exponent(la), exponent(de), exponent(d));
    }
    let top = Math.max(start.x.e, start.y.e, end.x.e, end.y.e);
    for (let i = 0; i < n; i++) top = Math.max(top, lat[i]!.e, dep[i]!.e, len[i]!.e);
    // A span of magnitudes beyond MAX_SPAN decimal places: left to the generic code (see triangle).
    if (top - e > MAX_SPAN) return undefined;
    const at = (x: Big): bigint => coefficient(x) * pow10(exponent(x) - e);
    const Sx = at(start.x),
      Sy = at(start.y);
    const points: { x: Big; y: Big }[] = new Array(n + 1);
    points[0] = start;
    let X = Sx,
      Y = Sy,
      T = 0n;
    const L: bigint[] = new Array(n),
      E: bigint[] = new Array(n),
      W: bigint[] = new Array(n);
    for (let i = 0; i < n; i++) {
      const li = at(lat[i]!),
        ei = at(dep[i]!),
        wi = at(len[i]!);
      L[i] = li;
      E[i] = ei;
      W[i] = wi;
      T += wi;
      X += ei;
      Y += li;
      points[i + 1] = { x: make(X, e), y: make(Y, e) };
    }
    if (T === 0n) return undefined;
    const east = X - at(end.x),
      north = Y - at(end.y);
    const adjusted: { x: Big; y: Big }[] = new Array(n + 1);
    const courses: FusedTraverse<Big>['courses'] = new Array(n);
    adjusted[0] = start;
    let ax = Sx * T,
      ay = Sy * T;
    for (let i = 0; i < n; i++) {
      // (L·T − north·W)/T on the scale 10^e: lat + kLat·d with kLat = −north/T, exactly.
      const aLat = L[i]! * T - north * W[i]!,
        aDep = E[i]! * T - east * W[i]!;
      ax += aDep;
      ay += aLat;
      adjusted[i + 1] = { x: divide(ax, e, T, 0), y: divide(ay, e, T, 0) };
      courses[i] = {
        latitude: lat[i]!,
        departure: dep[i]!,
        length: len[i]!,
        adjustedLatitude: divide(aLat, e, T, 0),
        adjustedDeparture: divide(aDep, e, T, 0),
      };
    }
    return {
      east: make(east, e),
      north: make(north, e),
      length: make(T, e),
      points,
      adjusted,
      courses,
      rule: 'compass',
    };
  }

  /** (n·10^e)/d correctly rounded, for any signs of n and d (d ≠ 0). */
  const over = (n: bigint, e: number, d: bigint): Big =>
    d < 0n ? divide(-n, e, -d, 0) : divide(n, e, d, 0);

  /**
   * heightFromInlineReadings for exactly three stations given as this arithmetic's values, with
   * plain spreads in (0, 1]: H, the foot's chainage and the offset quadrance computed exactly
   * (the integer formulas of the rational kernel, src/arithmetic/fused-rational.ts, from
   * Stewart's relation, M. Stewart, *Some General Theorems*, 1746, Prop. II) and each rounded
   * once; the residuals are exactly 0 (three equations, three unknowns). Chainages cᵢ = Cᵢ·10^ec
   * on one scale, readings Rᵢ = rᵢ/qᵢ with qᵢ a power of ten, kᵢ = (1 − Rᵢ)/Rᵢ = pᵢ/rᵢ.
   * Undefined for any other input and wherever the exact values give an error (the generic code
   * then reports it).
   */
  function inlineHeight(
    input: unknown,
  ): { H: Big; footChainage: Big; footOffset: Big; residuals: Big[]; sign: 1 } | undefined {
    if (input === null || typeof input !== 'object') return undefined;
    const { chainages, vertical } = input as { chainages?: unknown; vertical?: unknown };
    if (
      !Array.isArray(chainages) ||
      !Array.isArray(vertical) ||
      chainages.length !== 3 ||
      vertical.length !== 3
    )
      return undefined;
    const [c1, c2, c3] = chainages as unknown[];
    const [R1, R2, R3] = vertical as unknown[];
    if (!(own(c1) && own(c2) && own(c3) && own(R1) && own(R2) && own(R3))) return undefined;
    const b1 = c1 as Big,
      b2 = c2 as Big,
      b3 = c3 as Big;
    const s1 = R1 as Big,
      s2 = R2 as Big,
      s3 = R3 as Big;
    const x1 = exponent(b1),
      x2 = exponent(b2),
      x3 = exponent(b3);
    const ec = Math.min(x1, x2, x3);
    const y1 = exponent(s1),
      y2 = exponent(s2),
      y3 = exponent(s3);
    const lo = Math.min(ec, y1, y2, y3);
    if (Math.max(b1.e, b2.e, b3.e, s1.e, s2.e, s3.e) - lo > MAX_SPAN) return undefined;
    const C1 = coefficient(b1) * pow10(x1 - ec),
      C2 = coefficient(b2) * pow10(x2 - ec),
      C3 = coefficient(b3) * pow10(x3 - ec);
    if (C1 === C2 || C2 === C3 || C1 === C3) return undefined;
    // Rᵢ = rᵢ/qᵢ: a spread in (0, 1] (a zero, negative or larger reading goes to the generic code).
    const m1 = coefficient(s1),
      m2 = coefficient(s2),
      m3 = coefficient(s3);
    if (m1 <= 0n || m2 <= 0n || m3 <= 0n) return undefined;
    const r1 = y1 >= 0 ? m1 * pow10(y1) : m1,
      r2 = y2 >= 0 ? m2 * pow10(y2) : m2,
      r3 = y3 >= 0 ? m3 * pow10(y3) : m3;
    const p1 = (y1 >= 0 ? 1n : pow10(-y1)) - r1,
      p2 = (y2 >= 0 ? 1n : pow10(-y2)) - r2,
      p3 = (y3 >= 0 ? 1n : pow10(-y3)) - r3;
    if (p1 < 0n || p2 < 0n || p3 < 0n) return undefined;
    const A12 = C2 - C1,
      A23 = C3 - C2,
      A13 = C3 - C1;
    const K = p1 * r2 * r3 * A23 - p2 * r1 * r3 * A13 + p3 * r1 * r2 * A12;
    if (K === 0n) return undefined;
    const P = A12 * A23 * A13;
    const Hn = P * r1 * r2 * r3;
    if (Hn === 0n || Hn < 0n !== K < 0n) return undefined; // H ≤ 0
    const w = A23 * A13 * r3 * (p1 * r2 - p2 * r1);
    const G = -A12 * K - w;
    const En = 4n * K * P * p1 * r2 * r3 - G * G;
    if (En < 0n) return undefined; // e < 0
    const zero = big(1, 0, [0]);
    return {
      H: over(Hn, 2 * ec, K),
      footChainage: over((C1 + C2) * K + w, ec, 2n * K),
      footOffset: divide(En, 2 * ec, 4n * K * K, 0),
      residuals: [zero, big(1, 0, [0]), big(1, 0, [0])],
      sign: 1,
    };
  }

  /**
   * triangle(A1, A2, A3) exactly, then rounded once per measure: Q1 = Q(A2, A3) etc.;
   * s1 = c²/(Q2·Q3) with c the cross product (A2 − A1) × (A3 − A1) (sin²θ =
   * |u × v|²/(|u|²|v|²) by Lagrange's identity; derived); quadrea = 4c² = 16·area² (Heron,
   * Metrica I.8, in squared form).
   */
  function triangle(
    x1: Big,
    y1: Big,
    x2: Big,
    y2: Big,
    x3: Big,
    y3: Big,
  ): FusedTriangle<Big> | undefined {
    // Only this arithmetic's own values (a number, text or a Big of another decimal instance goes
    // to the generic code, which reads or reports it).
    // (Every big.js constructor shares one prototype, so `instanceof` cannot tell instances
    // apart; each Big records its own constructor.)
    if (!(own(x1) && own(y1) && own(x2) && own(y2) && own(x3) && own(y3))) return undefined;
    const e1 = exponent(x1),
      e2 = exponent(y1),
      e3 = exponent(x2),
      e4 = exponent(y2),
      e5 = exponent(x3),
      e6 = exponent(y3);
    const e = Math.min(e1, e2, e3, e4, e5, e6);
    // Coordinates whose magnitudes span more than MAX_SPAN decimal places would make the exact
    // integers huge (the generic code rounds at every step instead): leave them to it.
    if (Math.max(x1.e, y1.e, x2.e, y2.e, x3.e, y3.e) - e > MAX_SPAN) return undefined;
    // Integers X = x·10^(−e), all on one scale.
    const X1 = coefficient(x1) * pow10(e1 - e),
      Y1 = coefficient(y1) * pow10(e2 - e);
    const X2 = coefficient(x2) * pow10(e3 - e),
      Y2 = coefficient(y2) * pow10(e4 - e);
    const X3 = coefficient(x3) * pow10(e5 - e),
      Y3 = coefficient(y3) * pow10(e6 - e);
    const ux = X2 - X1,
      uy = Y2 - Y1;
    const vx = X3 - X1,
      vy = Y3 - Y1;
    const wx = X3 - X2,
      wy = Y3 - Y2;
    const q1 = wx * wx + wy * wy;
    const q2 = vx * vx + vy * vy;
    const q3 = ux * ux + uy * uy;
    const c = ux * vy - uy * vx;
    if (q1 === 0n || q2 === 0n || q3 === 0n || c === 0n) return undefined;
    const c2 = c * c;
    return {
      Q1: make(q1, 2 * e),
      Q2: make(q2, 2 * e),
      Q3: make(q3, 2 * e),
      s1: divide(c2, 0, q2 * q3, 0),
      s2: divide(c2, 0, q1 * q3, 0),
      s3: divide(c2, 0, q1 * q2, 0),
      quadrea: make(4n * c2, 4 * e),
    };
  }
  return Object.freeze({ triangle, traverse, inlineHeight });
}
