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
    let n = t.length;
    let c: number[];
    let e = exp + n - 1;
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
      n = digits;
      c = new Array(n);
      for (let i = 0; i < n; i++) c[i] = t.charCodeAt(i) - 48;
      if (up) {
        let i = n - 1;
        while (i >= 0 && c[i] === 9) c[i--] = 0;
        if (i >= 0) c[i]! += 1;
        else {
          c.unshift(1); // 99…9 rounded up to 10…0
          c.length = n;
          e += 1;
        }
      }
    } else {
      c = new Array(n);
      for (let i = 0; i < n; i++) c[i] = t.charCodeAt(i) - 48;
    }
    let end = c.length;
    while (end > 1 && c[end - 1] === 0) end--;
    c.length = end;
    return big(neg ? -1 : 1, e, c);
  }

  let lastB = 0n,
    lastLb = 1;
  /** (an·10^ae)/(bn·10^be) for bn > 0, correctly rounded: digits + 2 quotient digits and a sticky one. */
  function divide(an: bigint, ae: number, bn: bigint, be: number): Big {
    if (an === 0n) return big(1, 0, [0]);
    const la = (an < 0n ? -an : an).toString().length;
    if (bn !== lastB) {
      lastB = bn;
      lastLb = bn.toString().length;
    }
    const k = Math.max(0, digits + 3 - (la - lastLb));
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
  return Object.freeze({ triangle, traverse });
}
