/**
 * Helpers shared by the task kinds.
 *
 * @module cli
 */
import { QuadspreadError, decimal, isSurd, sqrtOf } from '../../index.js';
import type { Arithmetic, Point } from '../../index.js';
import type { Env, JobPoint, Value } from '../task.js';
import type { Input } from '../values.js';
import type { Schema } from '../validate.js';

/** A point of the job in a run's arithmetic (x = east, y = north). */
export function xy<V>(env: Env<V>, p: JobPoint): Point<V> {
  return { x: env.get(p.east), y: env.get(p.north) };
}

/** The inputs of a point's coordinates. */
export function pointInputs(p: JobPoint): Input[] {
  return [p.east, p.north];
}

/** The schema of a task kind: `kind` fixed, an optional `name`, the given properties. */
export function taskSchema(
  kind: string,
  required: string[],
  properties: Record<string, Schema>,
): Schema {
  return {
    type: 'object',
    required: ['kind', ...required],
    additionalProperties: false,
    properties: {
      kind: { const: kind },
      name: { $ref: '#/$defs/name' },
      ...properties,
      correlations: { $ref: '#/$defs/correlations' },
    },
  };
}

/** `m²` from `m`, `ft²` from `ft`, … */
export function squared(unit: string): string {
  return `${unit}²`;
}

/** Plain-number view of a value for sketches (the run's `num`). */
export function nums<V>(env: Env<V>, p: Point<V>): { x: number; y: number } {
  return { x: env.num(p.x), y: env.num(p.y) };
}

/**
 * √x as a result: a surd (exact arithmetic) or a value. Where the surd code cannot handle
 * the rational (fractions with very long numerators and denominators, as transcendental
 * readings give, make it refuse with NOT_FINITE), the root goes through `decimal(60)`
 * instead and is flagged `approx`.
 */
export function root<V>(A: Arithmetic<V, boolean>, x: V): { value: Value<V>; approx: boolean } {
  if (!A.exact) return { value: sqrtOf(A, x), approx: false };
  try {
    const s = sqrtOf(A, x);
    if (isSurd(s)) s.toPrecision(20);
    return { value: s, approx: false };
  } catch (e) {
    if (!(e instanceof QuadspreadError) || e.code !== 'NOT_FINITE') throw e;
    const D = decimal(60);
    const r = D.sqrt(D.from(A.toPrecision(x, 60)));
    return { value: A.from(D.toString(r!)), approx: true };
  }
}

/**
 * √x for a value or a surd: a surd a + b√d has no square root of the same form, so its
 * root goes through `decimal(60)` and is flagged `approx` (a rational surd is rooted as a value).
 */
export function rootOfValue<V>(
  A: Arithmetic<V, boolean>,
  x: Value<V>,
): { value: Value<V>; approx: boolean } {
  if (!isSurd(x)) return root(A, x as V);
  const r = x.toRational();
  if (r !== undefined) return root(A, r as V);
  const D = decimal(60);
  return { value: A.from(D.toString(D.sqrt(D.from(x.toPrecision(60)))!)), approx: true };
}

/** A signed square root: sign·√x, e.g. a height from its vertical quadrance (see {@link root}). */
export function signedRoot<V>(
  A: Arithmetic<V, boolean>,
  x: V,
  sign: number,
): { value: Value<V>; approx: boolean } {
  const r = root(A, x);
  if (sign >= 0) return r;
  return { value: isSurd(r.value) ? r.value.neg() : A.neg(r.value as V), approx: r.approx };
}

/** a + b for a value or surd a and a value b. */
export function plus<V>(A: Arithmetic<V, boolean>, a: Value<V>, b: V): Value<V> {
  return isSurd(a) ? (a.add(b) as Value<V>) : A.add(a as V, b);
}

/**
 * Whether |√H1 − √H2| ≤ t, decided exactly: (√H1 − √H2)² = H1 + H2 − 2√(H1·H2) ≤ t²
 * ⟺ H1 + H2 − t² ≤ 2√(H1·H2), squared when the left side is positive (derived).
 */
export function rootsWithin<V>(A: Arithmetic<V, boolean>, H1: V, H2: V, t: V): boolean {
  const lhs = A.sub(A.add(H1, H2), A.mul(t, t));
  if (A.sign(lhs) <= 0) return true;
  return A.cmp(A.mul(lhs, lhs), A.mul(A.from(4), A.mul(H1, H2))) <= 0;
}

/** |x| ≤ t for a value or surd x, exactly. */
export function absAtMost<V>(A: Arithmetic<V, boolean>, x: Value<V>, t: V): boolean {
  if (isSurd(x)) return x.cmp(t) <= 0 && x.cmp(A.neg(t)) >= 0;
  return A.cmp(A.abs(x as V), t) <= 0;
}
