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
import type { FusedKernels, FusedTriangle } from './types.js';

const PROTO = Fraction.prototype;
const SAFE = 9007199254740991n; // 2^53 − 1: below it a gcd runs in doubles

/** A fraction already in lowest terms, n ≥ 0, d > 0: built without fraction.js's gcd. */
function reduced(n: bigint, d: bigint): Fraction {
  // The same shape fraction.js's own internal constructor makes (prototype, then s, n, d).
  const f = Object.create(PROTO) as Fraction;
  f.s = 1n;
  f.n = n;
  f.d = d;
  return f;
}

/** gcd of two doubles holding integers ≥ 0 below 2^53 (Euclid, exact in binary64). */
function gcdNum(a: number, b: number): number {
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/**
 * gcd(a, b) for a, b ≥ 0: Euclid on bigints while the operands are large, then on doubles
 * once both are below 2^53 (Knuth, TAOCP vol. 2, §4.5.2, Algorithm A).
 */
function gcd(a: bigint, b: bigint): bigint {
  if (a < b) {
    const t = a;
    a = b;
    b = t;
  }
  while (a > SAFE) {
    if (b === 0n) return a;
    const t = a % b;
    a = b;
    b = t;
  }
  return BigInt(gcdNum(Number(a), Number(b)));
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
 * s1 = c²/(Q2·Q3), where c is the cross product (A2 − A1) × (A3 − A1) (Wildberger, *Divine
 * Proportions*, 2005, ch. 7: spread from cross product); quadrea = 4c² = 16·area²
 * (Archimedes' formula, ibid.). Undefined when two points coincide or the three are
 * collinear, so that the caller's generic path reports those cases.
 */
function triangle(x1: Fraction, y1: Fraction, x2: Fraction, y2: Fraction, x3: Fraction, y3: Fraction): FusedTriangle<Fraction> | undefined {
  // One common denominator D for the six coordinates; X = D·x are integers.
  const d1 = x1.d, d2 = y1.d, d3 = x2.d, d4 = y2.d, d5 = x3.d, d6 = y3.d;
  let D = d1;
  if (d2 !== D || d3 !== D || d4 !== D || d5 !== D || d6 !== D) {
    D = lcm(lcm(lcm(d1, d2), lcm(d3, d4)), lcm(d5, d6));
  }
  const X1 = scaled(x1, D), Y1 = scaled(y1, D), X2 = scaled(x2, D), Y2 = scaled(y2, D), X3 = scaled(x3, D), Y3 = scaled(y3, D);
  const ux = X2 - X1, uy = Y2 - Y1; // A1 → A2
  const vx = X3 - X1, vy = Y3 - Y1; // A1 → A3
  const wx = X3 - X2, wy = Y3 - Y2; // A2 → A3
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

/** The fused kernels of the rational arithmetic. @internal */
export const rationalKernels: FusedKernels<Fraction> = Object.freeze({ triangle });
