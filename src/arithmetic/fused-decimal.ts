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
import type { FusedKernels, FusedTriangle } from './types.js';

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

function exponent(x: Big): number {
  return x.e - (x.c.length - 1);
}

/**
 * The kernels of one decimal arithmetic, given its exact-to-rounded constructors:
 * `make(coef, exp)` rounds coef·10^exp and `divide(an, ae, bn, be)` rounds
 * (an·10^ae)/(bn·10^be), both correctly to the arithmetic's digits.
 * @internal
 */
export function decimalKernels(
  make: (coef: bigint, exp: number) => Big,
  divide: (an: bigint, ae: number, bn: bigint, be: number) => Big,
): FusedKernels<Big> {
  /**
   * triangle(A1, A2, A3) exactly, then rounded once per measure: Q1 = Q(A2, A3) etc.;
   * s1 = c²/(Q2·Q3) with c the cross product (A2 − A1) × (A3 − A1) (Wildberger, *Divine
   * Proportions*, 2005, ch. 7); quadrea = 4c² = 16·area² (Archimedes' formula, ibid.).
   */
  function triangle(x1: Big, y1: Big, x2: Big, y2: Big, x3: Big, y3: Big): FusedTriangle<Big> | undefined {
    const e1 = exponent(x1), e2 = exponent(y1), e3 = exponent(x2), e4 = exponent(y2), e5 = exponent(x3), e6 = exponent(y3);
    const e = Math.min(e1, e2, e3, e4, e5, e6);
    // Integers X = x·10^(−e), all on one scale.
    const X1 = coefficient(x1) * pow10(e1 - e), Y1 = coefficient(y1) * pow10(e2 - e);
    const X2 = coefficient(x2) * pow10(e3 - e), Y2 = coefficient(y2) * pow10(e4 - e);
    const X3 = coefficient(x3) * pow10(e5 - e), Y3 = coefficient(y3) * pow10(e6 - e);
    const ux = X2 - X1, uy = Y2 - Y1;
    const vx = X3 - X1, vy = Y3 - Y1;
    const wx = X3 - X2, wy = Y3 - Y2;
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
  return Object.freeze({ triangle });
}
