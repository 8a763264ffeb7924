/**
 * Reciprocal levelling across a gap (a river, a ravine): the height difference from two
 * set-ups, one near each bank, in which the long sights' errors cancel.
 *
 * @module field
 */
import { invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from '../geometry/validate.js';
import { readArray } from '../cogo/internal.js';
import { check, checkRecord, readTolerance, type FieldCheck } from './internal.js';

/** Staff readings on A and B from one set-up. */
export interface StaffPair<T> {
  /** Staff reading on A, metres. */
  readonly readingA: Numeric<T>;
  /** Staff reading on B, metres. */
  readonly readingB: Numeric<T>;
}

/** One set of reciprocal readings: from the set-up near A and from the one near B. */
export interface ReciprocalSet<T> {
  /** From the level near A: a short sight to A, a long one to B. */
  readonly nearA: StaffPair<T>;
  /** From the level near B: a long sight to A, a short one to B. */
  readonly nearB: StaffPair<T>;
}

/** What {@link reciprocalLevelling} returns. */
export interface ReciprocalLevelling<T> {
  /** Height of B above A: the mean over the sets of (Δ_nearA + Δ_nearB)/2. */
  readonly heightDifference: T;
  /** Per set: Δ from each set-up, their mean, and half their difference (the long sight's error). */
  readonly sets: readonly {
    readonly fromNearA: T;
    readonly fromNearB: T;
    readonly mean: T;
    readonly error: T;
  }[];
  /** The checks of |fromNearA − fromNearB| against `tolerance`, when given. */
  readonly checks: FieldCheck<T>[];
  /** Every check holds. */
  readonly ok: boolean;
}

/**
 * Reciprocal levelling: from a level near A, readings a₁ (short sight) and b₁ (long sight);
 * from a level near B, a₂ (long) and b₂ (short). Each difference a − b carries the error e of
 * the long sight (collimation, curvature and refraction) with opposite signs, so the height of
 * B above A is ((a₁ − b₁) + (a₂ − b₂))/2 and e = ((a₁ − b₁) − (a₂ − b₂))/2 (Ghilani & Wolf,
 * *Elementary Surveying*, reciprocal levelling — from memory). With several sets the height
 * difference is their mean. Take both set-ups close in time: refraction must be the same.
 * Exact in `rational`.
 *
 * @param A the arithmetic
 * @param input `{ sets: [{ nearA: { readingA, readingB }, nearB: { readingA, readingB } }, …],
 *   tolerance? }` (tolerance on |fromNearA − fromNearB|, metres)
 * @returns `{ heightDifference, sets, checks, ok }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for no set, a missing reading or a negative
 *   tolerance; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, reciprocalLevelling } from 'quadspread';
 * const r = reciprocalLevelling(rational, {
 *   sets: [{ nearA: { readingA: '1.270', readingB: '2.106' }, nearB: { readingA: '0.742', readingB: '1.560' } }],
 * });
 * [rational.toString(r.heightDifference), rational.toString(r.sets[0].error)];
 * //=> ['-827/1000', '-9/1000']
 * ```
 */
export function reciprocalLevelling<T>(
  A: Arithmetic<T>,
  input: { readonly sets: readonly ReciprocalSet<T>[]; readonly tolerance?: Numeric<T> },
): ReciprocalLevelling<T> {
  checkArithmetic(A, 'reciprocalLevelling');
  const w = 'reciprocalLevelling(input)';
  checkRecord(input, w);
  const list = readArray<ReciprocalSet<T>>(input.sets, `${w}.sets`, 10000);
  if (list.length === 0) throw invalidArgument(`${w}.sets`, 'is empty: give at least one set');
  const tol = readTolerance(A, input.tolerance, `${w}.tolerance`);
  const two = A.from(2);
  const checks: FieldCheck<T>[] = [];
  let sum = A.zero;
  const sets = list.map((s, i) => {
    const at = `${w}.sets[${i}]`;
    checkRecord(s, at);
    const diff = (k: 'nearA' | 'nearB') => {
      const p = s[k];
      checkRecord(p, `${at}.${k}`);
      const r = (q: 'readingA' | 'readingB') => {
        if (p[q] === undefined) throw invalidArgument(`${at}.${k}.${q}`, 'is missing');
        return readNumber(A, p[q], `${at}.${k}.${q}`);
      };
      return A.sub(r('readingA'), r('readingB')); // B above A = reading on A − reading on B
    };
    const fromNearA = diff('nearA');
    const fromNearB = diff('nearB');
    const mean = A.div(A.add(fromNearA, fromNearB), two);
    const error = A.div(A.sub(fromNearA, fromNearB), two);
    check(A, checks, `set ${i + 1}`, A.sub(fromNearA, fromNearB), tol);
    sum = A.add(sum, mean);
    return { fromNearA, fromNearB, mean, error };
  });
  return {
    heightDifference: A.div(sum, A.from(sets.length)),
    sets,
    checks,
    ok: checks.every((c) => c.ok),
  };
}
