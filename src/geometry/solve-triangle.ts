/**
 * Solving a triangle from three of its six measures.
 *
 * @module geometry
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import {
  QuadspreadError,
  show,
  invalidArgument,
  unsupportedOperation,
  checkArithmetic,
  notFinite,
} from '../errors.js';
import { type Root, type Surd, surd } from './surd.js';
import type { Triangle } from './triangle.js';
import { atMostOne, finiteResult, readQuadrance, readSpread } from './validate.js';

/**
 * Three of the six measures of a triangle (see {@link Triangle} for which is which).
 *
 * @example
 * ```ts
 * import { float, solveTriangle } from 'quadspread';
 * solveTriangle(float, { Q1: 25, Q2: 9, Q3: 16 })[0].s1;
 * //=> 1
 * ```
 */
export type TriangleMeasures<V> = Partial<Record<'Q1' | 'Q2' | 'Q3' | 's1' | 's2' | 's3', V>>;

/** The operations the solver needs, over plain values (inexact) or surds (exact). */
interface Field<T, R> {
  lift(x: T): R;
  add(x: R, y: R): R;
  sub(x: R, y: R): R;
  mul(x: R, y: R): R;
  div(x: R, y: R): R;
  sign(x: R): -1 | 0 | 1;
  /** A computed spread: as is when exact; clamped to at most 1 when rounded. */
  unit(x: R): R;
  /**
   * The two roots base ∓ 2√d (d > 0), ascending, whose product is `prod`. Rounded arithmetic
   * takes the root without cancellation and the other as prod/root (Press et al.,
   * Numerical Recipes, 3rd ed., 2007, §5.6), so thin triangles keep their relative precision.
   */
  pair(base: T, d: T, prod: T): [R, R];
}

function surdField<T>(A: Arithmetic<T>): Field<T, Surd<T>> {
  return {
    lift: (x) => surd(A, x),
    add: (x, y) => x.add(y),
    sub: (x, y) => x.sub(y),
    mul: (x, y) => x.mul(y),
    div: (x, y) => x.div(y),
    sign: (x) => x.sign(),
    unit: (x) => x,
    pair: (base, d, _prod) => [surd(A, base, -2, d), surd(A, base, 2, d)],
  };
}

function valueField<T>(A: Arithmetic<T>): Field<T, T> {
  return {
    lift: (x) => x,
    add: A.add,
    sub: A.sub,
    mul: A.mul,
    div: A.div,
    sign: A.sign,
    unit: (x) => atMostOne(A, x),
    pair(base, d, prod) {
      const r = A.sqrt(d);
      if (r === undefined)
        throw unsupportedOperation(
          'solveTriangle(A, known)',
          `${A.name} has no square root of ${show(A.toString(d))}`,
        );
      const r2 = A.add(r, r);
      if (A.sign(base) >= 0) {
        const hi = A.add(base, r2);
        return [A.div(prod, hi), hi];
      }
      const lo = A.sub(base, r2);
      return [lo, A.div(prod, lo)];
    },
  };
}

const KEYS = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3'] as const;

/**
 * {@link solveTriangle} for quadrances and spreads only (the geometry; the readings layer
 * adds sides and angles). @internal
 *
 * Every triangle with the three given measures, each with all six measures and the
 * quadrea. Any three of Q1, Q2, Q3, s1, s2, s3 that include a quadrance:
 *
 * - three quadrances: one triangle (spreads by the cross law);
 * - two quadrances and the spread between them (e.g. Q1, Q2, s3): two triangles in
 *   general, since a spread does not tell an angle from its supplement
 *   (Q3 = Q1 + Q2 ± 2√(Q1·Q2·(1 − s3))); one when s3 = 1;
 * - two quadrances and a spread opposite one of them (e.g. Q1, Q2, s1): the ambiguous
 *   case, 0, 1 or 2 triangles (Q3 from the cross law, a quadratic);
 * - one quadrance and two spreads in any position: the third spread from the triple
 *   spread formula (two roots in general), then the quadrances by the spread law.
 *
 * **Exactness**: in an exact arithmetic every measure is a {@link Surd} (one radicand per
 * triangle), exact; elsewhere values rounded by the arithmetic (a computed spread that
 * rounds above 1 is returned as 1).
 * **Order**: solutions come in increasing order of the measure that needed a root
 * (the minus sign first).
 * **No solution**: data that no proper triangle has — a zero quadrance or spread,
 * quadrances breaking the triangle inequality (quadrea ≤ 0), an opposite spread too large
 * for its sides, spreads that cannot meet — give an empty list, never NaN. In `float` and
 * `decimal` a discriminant that rounds below zero also gives no solution, so a tangent
 * (single-solution) case may come back empty. In `float`, quadrances beyond 2^±100 are scaled
 * by a power of 2 (exactly) while solving, so that products of quadrances neither overflow
 * nor underflow; a triangle whose quadrances or quadrea then fall outside the range of a JS
 * number is `NOT_FINITE`, never an empty list.
 *
 * @param A the arithmetic
 * @param known exactly three of `Q1, Q2, Q3` (≥ 0, square units) and `s1, s2, s3` (in [0, 1])
 * @returns 0, 1 or 2 triangles
 * @throws {QuadspreadError} `NEEDS_A_QUADRANCE` for three spreads; `INVALID_ARGUMENT` unless
 * exactly three known measures are given (and no other keys); `NEGATIVE_QUADRANCE`,
 * `SPREAD_OUT_OF_RANGE`, `INVALID_NUMBER` for bad values; `NOT_FINITE` in float when a
 * quadrance or the quadrea (a product of quadrances) found is beyond the range of a JS number.
 * @example
 * ```ts
 * import { rational, solveTriangle } from 'quadspread';
 * solveTriangle(rational, { Q1: 25, Q2: 16, s3: '1/2' }).map((t) => t.Q3.toString());
 * //=> ['41 - 20√2', '41 + 20√2']
 * ```
 */
export function solveTriangleQs<T, E extends boolean>(
  A: Arithmetic<T, E>,
  known: TriangleMeasures<Numeric<T>>,
): Triangle<Root<T, E>>[] {
  checkArithmetic(A, 'solveTriangle');
  const w = 'solveTriangle(A, known)';
  if (typeof known !== 'object' || known === null)
    throw invalidArgument(w, `known = ${show(known)} is not an object`);
  for (const k of Object.keys(known)) {
    if (!(KEYS as readonly string[]).includes(k))
      throw invalidArgument(w, `unknown measure ${show(k)}; use Q1, Q2, Q3, s1, s2, s3`);
  }
  const Q: (T | undefined)[] = [];
  const s: (T | undefined)[] = [];
  let count = 0;
  for (let i = 0; i < 3; i++) {
    const q = known[KEYS[i]!];
    const p = known[KEYS[i + 3]!];
    Q.push(q === undefined ? undefined : readQuadrance(A, q, w, KEYS[i]!));
    s.push(p === undefined ? undefined : readSpread(A, p, w, KEYS[i + 3]!));
    count += (q === undefined ? 0 : 1) + (p === undefined ? 0 : 1);
  }
  if (count !== 3) throw invalidArgument(w, `give exactly three measures; ${count} given`);
  const nq = Q.filter((x) => x !== undefined).length;
  if (nq === 0)
    throw new QuadspreadError(
      'NEEDS_A_QUADRANCE',
      w,
      'three spreads fix a triangle only up to scale: give a quadrance',
    );
  // A proper triangle has no zero quadrance or spread.
  for (let i = 0; i < 3; i++)
    if ((Q[i] !== undefined && A.isZero(Q[i]!)) || (s[i] !== undefined && A.isZero(s[i]!)))
      return [];
  const F = (A.exact ? surdField(A) : valueField(A)) as unknown as Field<T, Root<T, E>>;
  if (A.float64) {
    const e = floatScale(Q as (number | undefined)[]);
    if (e !== 0) return solveScaled(A, F, Q, s, nq, e, w);
  }
  return solve(A, F, Q, s, nq);
}

/**
 * float: the binary exponent e of the largest quadrance when it is far from 1 (beyond 2^±100),
 * else 0. Quadrances multiplied by 2^−e (exact in binary floating point) have products that
 * neither overflow nor underflow, spreads do not change with scale, and the quadrances and
 * quadrea found are multiplied back by 2^e and 2^2e.
 */
function floatScale(Q: (number | undefined)[]): number {
  let max = 0;
  for (const q of Q) if (q !== undefined && q > max) max = q;
  if (max === 0 || (max < 2 ** 100 && max > 2 ** -100)) return 0;
  return Math.round(Math.log2(max));
}

/** x · 2^k, exact unless the result leaves the range of a JS number (k up to ±2200). */
function times2(x: number, k: number): number {
  const h = Math.trunc(k / 2);
  return x * 2 ** h * 2 ** (k - h);
}

function solveScaled<T, R>(
  A: Arithmetic<T>,
  F: Field<T, R>,
  Q: (T | undefined)[],
  s: (T | undefined)[],
  nq: number,
  e: number,
  w: string,
): Triangle<R>[] {
  const scaled = Q.map((q) => (q === undefined ? q : (times2(q as number, -e) as T)));
  return solve(A, F, scaled, s, nq).map((t) => {
    const back = (x: R, k: number): R => {
      const v = times2(x as number, k);
      if (!(v - v === 0 && v !== 0))
        throw notFinite(
          w,
          `a triangle exists, but its ${k === e ? 'quadrances' : 'quadrea (16·area²)'} ${show(x)} · 2^${k} is beyond the range of a JS number: use decimal(n) or rational`,
        );
      return v as R;
    };
    return {
      ...t,
      Q1: back(t.Q1, e),
      Q2: back(t.Q2, e),
      Q3: back(t.Q3, e),
      quadrea: back(t.quadrea, 2 * e),
    };
  });
}

function solve<T, R>(
  A: Arithmetic<T>,
  F: Field<T, R>,
  Q: (T | undefined)[],
  s: (T | undefined)[],
  nq: number,
): Triangle<R>[] {
  const two = A.from(2);
  const four = A.from(4);
  // quadrea is a product of quadrances: in float it can overflow where the sides do not.
  const make = (q: R[], p: R[], quadrea: R): Triangle<R> => ({
    Q1: q[0]!,
    Q2: q[1]!,
    Q3: q[2]!,
    s1: p[0]!,
    s2: p[1]!,
    s3: p[2]!,
    quadrea: finiteResult(quadrea, 'solveTriangle(A, known)'),
  });

  if (nq === 3) {
    const [a, b, c] = Q as T[];
    // Archimedes' function = quadrea = 16·area²: Heron's formula (Heron, Metrica I.8) expanded (derived).
    const sum = A.add(A.add(a!, b!), c!);
    const sq = A.add(A.add(A.mul(a!, a!), A.mul(b!, b!)), A.mul(c!, c!));
    const qd = A.sub(A.mul(sum, sum), A.add(sq, sq));
    if (A.sign(qd) <= 0) return [];
    // quadrea = 4·Qj·Qk·si (cross law with the spread at Ai between sides Qj, Qk; derived).
    const sp = (x: T, y: T) => F.unit(F.lift(A.div(qd, A.mul(four, A.mul(x, y)))));
    return [
      make([F.lift(a!), F.lift(b!), F.lift(c!)], [sp(b!, c!), sp(a!, c!), sp(a!, b!)], F.lift(qd)),
    ];
  }

  if (nq === 2) {
    const k = Q.findIndex((x) => x === undefined); // the missing quadrance
    const i = (k + 1) % 3;
    const j = (k + 2) % 3;
    const Qi = Q[i]!;
    const Qj = Q[j]!;
    const out: Triangle<R>[] = [];
    if (s[k] !== undefined) {
      // Two sides and the spread between them. Cross law: (Qi + Qj − Qk)² = 4 Qi Qj (1 − sk),
      // the law of cosines (Euclid, Elements II.12–13) squared, solved for Qk (derived).
      const sk = s[k]!;
      const d = A.mul(A.mul(Qi, Qj), A.sub(A.one, sk));
      const base = A.add(Qi, Qj);
      const quadrea = F.lift(A.mul(four, A.mul(A.mul(Qi, Qj), sk)));
      // The product of the two roots is (Qi − Qj)² + 4 Qi Qj sk (derived).
      const dq = A.sub(Qi, Qj);
      const candidates = A.isZero(d)
        ? [F.lift(base)]
        : F.pair(base, d, A.add(A.mul(dq, dq), A.mul(four, A.mul(A.mul(Qi, Qj), sk))));
      for (const Qk of candidates) {
        if (F.sign(Qk) <= 0) continue;
        // Spread law si/Qi = sk/Qk: the law of sines, squared (derived).
        const skR = F.lift(sk);
        const q: R[] = [];
        const p: R[] = [];
        q[i] = F.lift(Qi);
        q[j] = F.lift(Qj);
        q[k] = Qk;
        p[k] = skR;
        p[i] = F.unit(F.div(F.mul(skR, F.lift(Qi)), Qk));
        p[j] = F.unit(F.div(F.mul(skR, F.lift(Qj)), Qk));
        out.push(make(q, p, quadrea));
      }
      return out;
    }
    // Two sides and a spread opposite one of them: the ambiguous case. Name the side with the
    // spread `a` (opposite the given spread) and the other `b`.
    const [ia, ib] = s[i] !== undefined ? [i, j] : [j, i];
    const Qa = Q[ia]!;
    const Qb = Q[ib]!;
    const sa = s[ia]!;
    // Cross law at A_a: (Qb + Qk − Qa)² = 4 Qb Qk (1 − sa) (law of cosines squared), a quadratic in Qk:
    // Qk = Qa + Qb − 2 Qb sa ± 2√(Qb (1 − sa)(Qa − Qb sa)) (derived).
    const e = A.sub(Qa, A.mul(Qb, sa));
    const d = A.mul(A.mul(Qb, A.sub(A.one, sa)), e);
    if (A.sign(d) < 0) return [];
    const base = A.sub(A.add(Qa, Qb), A.mul(two, A.mul(Qb, sa)));
    const sb = A.div(A.mul(sa, Qb), Qa); // spread law
    // The product of the two roots is (Qb − Qa)² (the constant term; derived).
    const dq = A.sub(Qb, Qa);
    const candidates = A.isZero(d) ? [F.lift(base)] : F.pair(base, d, A.mul(dq, dq));
    for (const Qk of candidates) {
      if (F.sign(Qk) <= 0) continue;
      const saR = F.lift(sa);
      const sk = F.unit(F.div(F.mul(saR, Qk), F.lift(Qa))); // spread law sk/Qk = sa/Qa
      const q: R[] = [];
      const p: R[] = [];
      q[ia] = F.lift(Qa);
      q[ib] = F.lift(Qb);
      q[k] = Qk;
      p[ia] = saR;
      p[ib] = F.unit(F.lift(sb));
      p[k] = sk;
      // quadrea = 4·Qa·Qb·sk (the vertex A_k lies between the sides Qa and Qb).
      out.push(make(q, p, F.mul(F.lift(A.mul(four, A.mul(Qa, Qb))), sk)));
    }
    return out;
  }

  // One quadrance and two spreads.
  const i = Q.findIndex((x) => x !== undefined);
  const c = s.findIndex((x) => x === undefined); // the missing spread
  const a = (c + 1) % 3;
  const b = (c + 2) % 3;
  const sa = s[a]!;
  const sb = s[b]!;
  // Triple spread formula solved for sc: sc = sa + sb − 2 sa sb ± 2√(sa sb (1 − sa)(1 − sb)),
  // from A1 + A2 + A3 = 180° (sin²(θa ± θb) by the angle-sum formulas; derived).
  const d = A.mul(A.mul(sa, sb), A.mul(A.sub(A.one, sa), A.sub(A.one, sb)));
  const base = A.sub(A.add(sa, sb), A.mul(two, A.mul(sa, sb)));
  // The product of the two roots is (sa − sb)² (the constant term; derived).
  const ds = A.sub(sa, sb);
  const candidates = A.isZero(d) ? [F.lift(base)] : F.pair(base, d, A.mul(ds, ds));
  const Qi = F.lift(Q[i]!);
  const out: Triangle<R>[] = [];
  for (const sc of candidates) {
    if (F.sign(sc) <= 0) continue;
    const p: R[] = [];
    p[a] = F.lift(sa);
    p[b] = F.lift(sb);
    p[c] = F.unit(sc);
    // Spread law Qj = Qi·sj/si: the law of sines, squared (derived).
    const ratio = F.div(Qi, p[i]!);
    const q: R[] = [];
    for (let j = 0; j < 3; j++) q[j] = j === i ? Qi : F.mul(ratio, p[j]!);
    // quadrea = 4·Q1·Q2·s3 (derived from the cross law).
    out.push(make(q, p, F.mul(F.mul(F.lift(four), F.mul(q[0]!, q[1]!)), p[2]!)));
  }
  return out;
}
