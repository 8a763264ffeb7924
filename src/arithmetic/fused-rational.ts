/**
 * Fused exact kernels for the {@link rational} arithmetic: whole formulas computed with
 * bigints at once — one common denominator, integer arithmetic throughout, and one
 * normalisation (gcd) per result — instead of one fraction.js operation (with its own gcd)
 * per step. Results are the same fractions in lowest terms as the generic formulas give
 * (test/perf/fused-rational.test.ts checks this on random inputs). Performance only.
 *
 * @module arithmetic
 * @internal
 */
import Fraction from 'fraction.js';
import type { FusedKernels, FusedTraverse, FusedTriangle } from './types.js';
import { bitLength, isqrt, readInput, scaledSqrt } from './exact.js';
import { readFusedTraverse } from './fused-input.js';

const SAFE = 9007199254740991n; // 2^53 − 1: below it a gcd runs in doubles

/** A fraction already in lowest terms, n ≥ 0, d > 0: built without fraction.js's gcd. */
function reduced(n: bigint, d: bigint): Fraction {
  // The same shape fraction.js's own internal constructor makes (prototype, then s, n, d).
  const f = Object.create(Fraction.prototype) as Fraction;
  f.s = 1n;
  f.n = n;
  f.d = d;
  return f;
}

/** gcd of two doubles holding integers ≥ 0 below 2^53 (Euclid, exact in binary64). */
function gcdNum(a: number, b: number): number {
  if (!(a >= 0 && b >= 0)) throw new RangeError('gcdNum: not integers ≥ 0'); // never loop on NaN
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/**
 * gcd(a, b) for a, b ≥ 0: Lehmer's method while the operands are large (the leading ~50 bits
 * of both in doubles decide up to ~25 bits of quotients at once, applied to the bigints as one
 * 2×2 step), then Euclid on doubles once both are below 2^53 (Knuth, TAOCP vol. 2, §4.5.2,
 * Algorithms L and A). The same value as Euclid's algorithm (test/perf/fused-gcd.test.ts).
 * @internal
 */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < b) {
    const t = a;
    a = b;
    b = t;
  }
  while (a > SAFE) {
    if (b === 0n) return a;
    // Leading bits: û = ⌊a/2^k⌋ in [2^48, 2^51), v̂ = ⌊b/2^k⌋ ≤ û.
    const k = leadShift(a);
    let u = Number(a >> k),
      v = Number(b >> k);
    // Cofactors: a' = A·a + B·b, b' = C·a + D·b (|A|, |B|, |C|, |D| < 2^51: exact in doubles).
    let A = 1,
      B = 0,
      C = 0,
      D = 1;
    for (;;) {
      if (v + C === 0 || v + D === 0) break;
      const q = floorDiv(u + A, v + C);
      if (q !== floorDiv(u + B, v + D)) break;
      let t = A - q * C;
      A = C;
      C = t;
      t = B - q * D;
      B = D;
      D = t;
      t = u - q * v;
      u = v;
      v = t;
    }
    if (B === 0) {
      // No quotient could be decided from the leading bits: one full division step.
      const t = a % b;
      a = b;
      b = t;
    } else {
      const bA = BigInt(A),
        bB = BigInt(B),
        bC = BigInt(C),
        bD = BigInt(D);
      const t = bA * a + bB * b;
      b = bC * a + bD * b;
      a = t;
    }
  }
  return BigInt(gcdNum(Number(a), Number(b)));
}

/** ⌊x/y⌋ for integers 0 ≤ x < 2^52, 0 < y < 2^52 held in doubles (corrected after the division). */
function floorDiv(x: number, y: number): number {
  let q = Math.floor(x / y);
  // x/y is rounded: fix q so that q·y ≤ x < (q + 1)·y (every product here is below 2^53).
  if (q * y > x) q -= 1;
  else if (x - q * y >= y) q += 1;
  return q;
}

/** A shift k ≥ 0 with ⌊a/2^k⌋ in [2^48, 2^51), for a > 2^53. */
function leadShift(a: bigint): bigint {
  const f = Number(a);
  // Number(a) is a rounded to 53 bits (or Infinity past 2^1024): its exponent is within one
  // of a's bit length.
  const e = f < Infinity ? Math.floor(Math.log2(f)) : bitLength(a) - 1;
  return BigInt(Math.max(0, e - 49));
}

/** n/d (n ≥ 0, d > 0) in lowest terms. */
function normal(n: bigint, d: bigint): Fraction {
  if (d === 1n) return reduced(n, 1n);
  const g = gcd(n, d);
  return g === 1n ? reduced(n, d) : reduced(n / g, d / g);
}

/**
 * c²/(p·q) in lowest terms for c², p, q > 0, using gcd(a, pq) = gcd(a, p)·gcd(a/gcd(a, p), q)
 * (derived: both sides hold every prime to the same power), so that no gcd runs on p·q.
 */
function ratioOver(c2: bigint, p: bigint, q: bigint): Fraction {
  const g1 = gcd(c2, p);
  const n1 = g1 === 1n ? c2 : c2 / g1;
  const p1 = g1 === 1n ? p : p / g1;
  const g2 = gcd(n1, q);
  return g2 === 1n ? reduced(n1, p1 * q) : reduced(n1 / g2, p1 * (q / g2));
}

/**
 * triangle(A1, A2, A3) from its six coordinates, exactly: Q1 = Q(A2, A3) etc.;
 * s1 = c²/(Q2·Q3), where c is the cross product (A2 − A1) × (A3 − A1) (sin²θ =
 * |u × v|²/(|u|²|v|²) by Lagrange's identity; derived); quadrea = 4c² = 16·area²
 * (Heron, Metrica I.8, in squared form). Undefined when two points coincide or the three are
 * collinear, so that the caller's generic path reports those cases.
 */
function triangle(
  x1: Fraction,
  y1: Fraction,
  x2: Fraction,
  y2: Fraction,
  x3: Fraction,
  y3: Fraction,
): FusedTriangle<Fraction> | undefined {
  // Only this arithmetic's own values: a number, text, bigint or a value of another arithmetic
  // in a point goes to the generic code (which reports it). Without this check a foreign
  // value's missing denominator made gcd() loop forever on NaN.
  if (!(
    x1 instanceof Fraction &&
    y1 instanceof Fraction &&
    x2 instanceof Fraction &&
    y2 instanceof Fraction &&
    x3 instanceof Fraction &&
    y3 instanceof Fraction
  ))
    return undefined;
  // One common denominator D for the six coordinates; X = D·x are integers.
  const d1 = x1.d,
    d2 = y1.d,
    d3 = x2.d,
    d4 = y2.d,
    d5 = x3.d,
    d6 = y3.d;
  let D = d1;
  if (d2 !== D || d3 !== D || d4 !== D || d5 !== D || d6 !== D) {
    D = lcm(lcm(lcm(d1, d2), lcm(d3, d4)), lcm(d5, d6));
  }
  const X1 = scaled(x1, D),
    Y1 = scaled(y1, D),
    X2 = scaled(x2, D),
    Y2 = scaled(y2, D),
    X3 = scaled(x3, D),
    Y3 = scaled(y3, D);
  const ux = X2 - X1,
    uy = Y2 - Y1; // A1 → A2
  const vx = X3 - X1,
    vy = Y3 - Y1; // A1 → A3
  const wx = X3 - X2,
    wy = Y3 - Y2; // A2 → A3
  const q1 = wx * wx + wy * wy; // D²·Q1
  const q2 = vx * vx + vy * vy; // D²·Q2
  const q3 = ux * ux + uy * uy; // D²·Q3
  const c = ux * vy - uy * vx; // D²·cross
  if (q1 === 0n || q2 === 0n || q3 === 0n || c === 0n) return undefined;
  const c2 = c * c;
  const D2 = D * D;
  return {
    Q1: normal(q1, D2),
    Q2: normal(q2, D2),
    Q3: normal(q3, D2),
    // s1 = c²/(q2·q3): the D⁴ factors cancel.
    s1: ratioOver(c2, q2, q3),
    s2: ratioOver(c2, q1, q3),
    s3: ratioOver(c2, q1, q2),
    quadrea: normal(4n * c2, D2 * D2),
  };
}

function lcm(a: bigint, b: bigint): bigint {
  return a === b ? a : (a / gcd(a, b)) * b;
}

function scaled(x: Fraction, D: bigint): bigint {
  const n = x.s < 0n ? -x.n : x.n;
  return x.d === D ? n : n * (D / x.d);
}

/** n/d in lowest terms for any signs (d ≠ 0). */
function normalSigned(n: bigint, d: bigint): Fraction {
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  if (n === 0n) return reduced(0n, 1n);
  const f = normal(n < 0n ? -n : n, d);
  if (n < 0n) f.s = -1n;
  return f;
}

const isPlainFraction = (x: unknown): x is Fraction => x instanceof Fraction;

/**
 * heightFromInlineReadings for exactly three stations given as fractions, with plain spreads
 * in (0, 1] (no signed readings), in integers throughout. With chainages cᵢ = Cᵢ/D (one
 * common denominator), readings Rᵢ = rᵢ/qᵢ and kᵢ = (1 − Rᵢ)/Rᵢ = pᵢ/rᵢ (pᵢ = qᵢ − rᵢ), and
 * Aᵢⱼ = Cⱼ − Cᵢ, the generic formulas (Stewart's relation, M. Stewart, *Some General Theorems*,
 * 1746, Prop. II; see src/elevation/inline.ts) become, with
 * K = p₁r₂r₃A₂₃ − p₂r₁r₃A₁₃ + p₃r₁r₂A₁₂ (derived):
 *   H = A₁₂A₂₃A₁₃·r₁r₂r₃ / (D²K),
 *   f = ((C₁ + C₂)K + A₂₃A₁₃r₃(p₁r₂ − p₂r₁)) / (2DK),
 *   e = (4K·A₁₂A₂₃A₁₃·p₁r₂r₃ − G²) / (4D²K²) with G = −A₁₂K − A₂₃A₁₃r₃(p₁r₂ − p₂r₁),
 * and the three residuals are exactly 0 (three equations, three unknowns). Undefined for any
 * other input, and wherever the generic code reports an error, which it then does.
 */
function inlineHeight(
  input: unknown,
):
  | { H: Fraction; footChainage: Fraction; footOffset: Fraction; residuals: Fraction[]; sign: 1 }
  | undefined {
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
  if (!isPlainFraction(c1) || !isPlainFraction(c2) || !isPlainFraction(c3)) return undefined;
  if (!isPlainFraction(R1) || !isPlainFraction(R2) || !isPlainFraction(R3)) return undefined;
  // Spreads in (0, 1]: s = +1, 0 < n ≤ d.
  if (
    R1.s < 0n ||
    R1.n === 0n ||
    R1.n > R1.d ||
    R2.s < 0n ||
    R2.n === 0n ||
    R2.n > R2.d ||
    R3.s < 0n ||
    R3.n === 0n ||
    R3.n > R3.d
  )
    return undefined;
  const d1 = c1.d,
    d2 = c2.d,
    d3 = c3.d;
  const D = d1 === d2 && d2 === d3 ? d1 : lcm(lcm(d1, d2), d3);
  const C1 = scaled(c1, D),
    C2 = scaled(c2, D),
    C3 = scaled(c3, D);
  if (C1 === C2 || C2 === C3 || C1 === C3) return undefined;
  const r1 = R1.n,
    r2 = R2.n,
    r3 = R3.n;
  const p1 = R1.d - r1,
    p2 = R2.d - r2,
    p3 = R3.d - r3;
  const A12 = C2 - C1,
    A23 = C3 - C2,
    A13 = C3 - C1;
  const K = p1 * r2 * r3 * A23 - p2 * r1 * r3 * A13 + p3 * r1 * r2 * A12;
  if (K === 0n) return undefined;
  const P = A12 * A23 * A13;
  const D2 = D * D;
  const Hn = P * r1 * r2 * r3,
    Hd = D2 * K;
  if (Hn < 0n !== Hd < 0n || Hn === 0n) return undefined; // H ≤ 0
  const w = A23 * A13 * r3 * (p1 * r2 - p2 * r1);
  const Fn = (C1 + C2) * K + w,
    Fd = 2n * D * K;
  const G = -A12 * K - w;
  const En = 4n * K * P * p1 * r2 * r3 - G * G,
    Ed = 4n * D2 * K * K; // Ed > 0
  if (En < 0n) return undefined; // e < 0
  const zero = reduced(0n, 1n);
  return {
    H: normalSigned(Hn, Hd),
    footChainage: normalSigned(Fn, Fd),
    footOffset: normalSigned(En, Ed),
    residuals: [zero, reduced(0n, 1n), reduced(0n, 1n)],
    sign: 1,
  };
}

/** x as a fraction when it is one, or a number, bigint or text that reads as one; else undefined. */
function asFraction(x: unknown): Fraction | undefined {
  if (x instanceof Fraction) return x;
  if (typeof x !== 'number' && typeof x !== 'string' && typeof x !== 'bigint') return undefined;
  try {
    // The same reading as rational.from: exact, a JS number through its shortest decimal.
    const r = readInput(x, 'rational.from(x)');
    return normalSigned(r.n, r.d);
  } catch {
    return undefined; // the generic code reports it
  }
}

/** Signed numerator of x scaled to the denominator D (a multiple of x.d). */
function num(x: Fraction, D: bigint): bigint {
  return scaled(x, D);
}

/**
 * traverse for the common case — a start (and optional closing point) and courses all given
 * as { latitude, departure, distance }, compass rule, no interior angles — with every value
 * over one common denominator Dn (the lcm of the inputs' denominators), the lengths over
 * D = lcm(Dn, the computed roots' power of ten), and the adjusted values over T·Dn
 * (T = D·total length): sums of integers, one gcd per reported value. The compass
 * (Bowditch) rule, correction = −misclosure·(course length/total length), as in
 * src/cogo/traverse.ts. The closure's root and precision ratio are left to the caller.
 * Undefined for any other input and wherever the generic code reports an error.
 */
function traverse(input: unknown): FusedTraverse<Fraction> | undefined {
  const parsed = readFusedTraverse(input, asFraction);
  if (!parsed) return undefined;
  const { start, end, list } = parsed;
  const n = list.length;
  const lat: Fraction[] = new Array(n),
    dep: Fraction[] = new Array(n),
    len: Fraction[] = new Array(n);
  // The common denominator, kept in a double while it stays exact (else: leave it to the generic code).
  let Dn = 1;
  const take = (d: bigint): boolean => {
    if (d === 1n) return true;
    if (d > SAFE) return false;
    const dn = Number(d);
    if (Dn % dn === 0) return true;
    const l = (Dn / gcdNum(Dn, dn)) * dn;
    if (l > 9007199254740991) return false;
    Dn = l;
    return true;
  };
  if (!take(start.x.d) || !take(start.y.d) || !take(end.x.d) || !take(end.y.d)) return undefined;
  let Dl = 1n; // the common denominator of the computed lengths (a bigint: ~10^51)
  for (let i = 0; i < n; i++) {
    const c = list[i] as {
      bearing?: unknown;
      latitude?: unknown;
      departure?: unknown;
      distance?: unknown;
    } | null;
    if (c === null || typeof c !== 'object' || c.bearing !== undefined) return undefined;
    const la = asFraction(c.latitude),
      de = asFraction(c.departure);
    if (!la || !de) return undefined;
    let d: Fraction | undefined;
    if (c.distance === undefined) {
      // √(lat² + dep²) as the generic code computes it (approxSqrt): exact for a square,
      // else one integer root on a decimal scale, whose denominator (a divisor of a power of
      // ten) joins a bigint common denominator of the lengths.
      const cl = courseLength(la, de);
      d = cl.length;
      // A common multiple of the lengths' denominators (not necessarily the least: the
      // adjusted values are reduced at the end): the powers of ten divide one another.
      if (cl.scale !== 1n && Dl % cl.scale !== 0n) Dl = Dl === 1n ? cl.scale : lcm(Dl, cl.scale);
      if (!take(la.d) || !take(de.d)) return undefined;
    } else {
      d = asFraction(c.distance);
      if (!d || d.s < 0n) return undefined;
      if (!take(la.d) || !take(de.d) || !take(d.d)) return undefined;
    }
    lat[i] = la;
    dep[i] = de;
    len[i] = d;
  }
  // Latitudes, departures and the two points over Dn; the lengths over D = lcm(Dn, Dl) (Dn
  // itself when every length is given). The adjusted values are then over T·Dn with T = D·(total
  // length): lat + kLat·d = L/Dn − (north/Dn)·(W/D)/(T/D) = (L·T − north·W)/(T·Dn), so the
  // roots' scale (~10^51) enters their denominators once, through T, and not twice.
  const Db = BigInt(Dn);
  const D = Dl === 1n ? Db : lcm(Db, Dl);
  const Sx = num(start.x, Db),
    Sy = num(start.y, Db);
  const points: { x: Fraction; y: Fraction }[] = new Array(n + 1);
  points[0] = start;
  let X = Sx,
    Y = Sy,
    T = 0n;
  const L: bigint[] = new Array(n),
    E: bigint[] = new Array(n),
    W: bigint[] = new Array(n),
    P: bigint[] = new Array(n); // running sums of W
  for (let i = 0; i < n; i++) {
    const li = num(lat[i]!, Db),
      ei = num(dep[i]!, Db),
      wi = num(len[i]!, D);
    L[i] = li;
    E[i] = ei;
    W[i] = wi;
    T += wi;
    P[i] = T;
    X += ei;
    Y += li;
    points[i + 1] = { x: normalSigned(X, Db), y: normalSigned(Y, Db) };
  }
  if (T === 0n) return undefined;
  const east = X - num(end.x, Db),
    north = Y - num(end.y, Db); // misclosure, over Dn
  const adjusted: { x: Fraction; y: Fraction }[] = new Array(n + 1);
  const courses: FusedTraverse<Fraction>['courses'] = new Array(n);
  adjusted[0] = start;
  // The numerators over T·Dn, then each reduced: aLat = L·T − north·W, and the adjusted points
  // are the start times T plus the running sums.
  const aLat: bigint[] = new Array(n),
    aDep: bigint[] = new Array(n),
    AX: bigint[] = new Array(n),
    AY: bigint[] = new Array(n);
  let ax = Sx * T,
    ay = Sy * T;
  for (let i = 0; i < n; i++) {
    const la = L[i]! * T - north * W[i]!,
      de = E[i]! * T - east * W[i]!;
    aLat[i] = la;
    aDep[i] = de;
    ax += de;
    ay += la;
    AX[i] = ax;
    AY[i] = ay;
  }
  const TD = T * Db;
  const over =
    T <= SAFE
      ? (x: bigint) => normalSigned(x, TD)
      : sharedReducer(T, Db, [north, east, ...W, ...P]);
  for (let i = 0; i < n; i++) {
    adjusted[i + 1] = { x: over(AX[i]!), y: over(AY[i]!) };
    courses[i] = {
      latitude: lat[i]!,
      departure: dep[i]!,
      length: len[i]!,
      adjustedLatitude: over(aLat[i]!),
      adjustedDeparture: over(aDep[i]!),
    };
  }
  return {
    east: normalSigned(east, Db),
    north: normalSigned(north, Db),
    length: normalSigned(T, D),
    points,
    adjusted,
    courses,
    rule: 'compass',
  };
}

/**
 * x/(T·Dn) in lowest terms for the adjusted values x, with T large (the roots' scale) and Dn a
 * safe integer, taking one gcd on numbers of T's size for all of them instead of one each.
 * Every such x is congruent modulo T to ±(a product of two of `factors`): aLat ≡ −north·W,
 * aDep ≡ −east·W, and the adjusted points ≡ −east·P, −north·P (P the running sums of W). So
 * with G = gcd(∏ of the nonzero factors mod T, T), gcd(x, T) = gcd(x mod T, G) (gcd(x, T)
 * divides such a product, hence the whole product, and T, hence G; and G divides T; derived),
 * and G is small unless the factors share T's prime factors. A residue of 0 gives gcd(x, T) =
 * T. Then gcd(x, T·Dn) = g₁·gcd(x/g₁, Dn) with g₁ = gcd(x, T), the last in doubles.
 */
function sharedReducer(T: bigint, Db: bigint, factors: bigint[]): (x: bigint) => Fraction {
  let p = 1n;
  for (const f of factors) {
    const r = (f < 0n ? -f : f) % T;
    if (r !== 0n) p = (p * r) % T;
  }
  const G = gcd(p, T);
  const Dn = Number(Db);
  return (x: bigint): Fraction => {
    if (x === 0n) return reduced(0n, 1n);
    const neg = x < 0n;
    const a = neg ? -x : x;
    const r = a % T;
    const g1 = r === 0n ? T : G === 1n ? 1n : gcd(r, G);
    const a1 = g1 === 1n ? a : a / g1;
    const T1 = g1 === 1n ? T : T / g1;
    const g2 = Dn === 1 ? 1 : gcdNum(Number(a1 % Db), Dn);
    const f = g2 === 1 ? reduced(a1, T1 * Db) : reduced(a1 / BigInt(g2), T1 * BigInt(Dn / g2));
    if (neg) f.s = -1n;
    return f;
  };
}

/** Digits of {@link courseLength}'s root: those of the readings' approxSqrt (APPROX_DIGITS). */
const ROOT_DIGITS = 50;

/**
 * √(la² + de²) exactly as the generic traverse computes a course length in `rational`: 0, the
 * exact root of a square, or ⌊√q·10^k⌋/10^k (approxSqrt), in lowest terms; with `scale`, a
 * multiple of its denominator (10^k for a root on a decimal scale).
 */
function courseLength(la: Fraction, de: Fraction): { length: Fraction; scale: bigint } {
  // q = (a² e² + c² b²)/(b² e²) for la = a/b, de = c/e
  const b2 = la.d * la.d,
    e2 = de.d * de.d;
  const qn = la.n * la.n * e2 + de.n * de.n * b2;
  if (qn === 0n) return { length: reduced(0n, 1n), scale: 1n };
  const qd = b2 * e2;
  const g = gcd(qn, qd);
  const n = qn / g,
    d = qd / g;
  const rn = isqrt(n),
    rd = isqrt(d);
  if (rn * rn === n && rd * rd === d) return { length: reduced(rn, rd), scale: rd };
  const r = scaledSqrt(n, d, ROOT_DIGITS);
  return { length: overPowerOfTen(r.n, r.d), scale: r.d };
}

/**
 * r/d in lowest terms for r > 0 and d = 10^k: gcd(r, 2^k·5^k) = 2^min(k, v₂(r))·5^min(k, v₅(r))
 * (v_p: the power of p in r), counted instead of a gcd on r's ~50 digits.
 */
function overPowerOfTen(r: bigint, d: bigint): Fraction {
  while ((r & 1n) === 0n && (d & 1n) === 0n) {
    r >>= 1n;
    d >>= 1n;
  }
  while (r % 5n === 0n && d % 5n === 0n) {
    r /= 5n;
    d /= 5n;
  }
  return reduced(r, d);
}

/** The fused kernels of the rational arithmetic. @internal */
export const rationalKernels: FusedKernels<Fraction> = /* @__PURE__ */ Object.freeze({
  triangle,
  inlineHeight,
  traverse,
});
