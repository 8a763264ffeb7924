/**
 * The two-peg test of a level: the inclination of its line of sight from staff readings on two
 * pegs from two set-ups, and the readings corrected for it.
 *
 * @module field
 */
import { QuadspreadError, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from '../geometry/validate.js';
import {
  ARCSEC,
  check,
  checkRecord,
  readDistance,
  readTolerance,
  type FieldCheck,
} from './internal.js';

/** Staff readings on pegs A and B from one set-up, with the sight lengths. */
export interface PegReadings<T> {
  /** Staff reading on peg A, metres. */
  readonly readingA: Numeric<T>;
  /** Staff reading on peg B, metres. */
  readonly readingB: Numeric<T>;
  /** Horizontal distance from the level to A, metres (≥ 0). */
  readonly distanceA?: Numeric<T>;
  /** Horizontal distance from the level to B, metres (≥ 0). */
  readonly distanceB?: Numeric<T>;
}

/** The input of {@link twoPegTest}. */
export interface TwoPegInput<T> {
  /** The set-up midway between the pegs (distances optional: equal when left out). */
  readonly first: PegReadings<T>;
  /** The set-up near one peg or beyond it (distances required). */
  readonly second: PegReadings<T>;
  /** Largest acceptable |inclination|, metres per metre (e.g. 0.0001 = 1 mm in 10 m). */
  readonly tolerance?: Numeric<T>;
}

/** What {@link twoPegTest} returns. */
export interface TwoPeg<T> {
  /** The rise of the line of sight per unit distance (positive: it points up), m/m. */
  readonly inclination: T;
  /** The same as an angle, arc-seconds (small-angle: inclination × 648000/π). */
  readonly inclinationArcSeconds: T;
  /** Height of B above A, freed of the error. */
  readonly heightDifference: T;
  /** The second set-up's readings corrected: reading − inclination × distance. */
  readonly corrected: { readonly readingA: T; readonly readingB: T };
  /** The check against `tolerance`, when given. */
  readonly checks: FieldCheck<T>[];
  /** Every check holds. */
  readonly ok: boolean;
}

/**
 * The two-peg test: with readings a, b on pegs A and B and sight lengths d_A, d_B, each
 * reading is the true one plus ε·d, ε the inclination of the line of sight. From two set-ups,
 * ε = ((a₂ − b₂) − (a₁ − b₁)) / ((d_A2 − d_B2) − (d_A1 − d_B1)), and the height of B above A is
 * (a₁ − b₁) − ε·(d_A1 − d_B1) (Ghilani & Wolf, *Elementary Surveying*, levelling equipment,
 * the two-peg test — from memory). With the first set-up midway (distances equal or left out),
 * a₁ − b₁ is already the true difference. Exact in `rational` (the arc-second figure uses π).
 *
 * @param A the arithmetic
 * @param input `first` and `second` set-ups `{ readingA, readingB, distanceA?, distanceB? }`,
 *   `tolerance` (m/m)
 * @returns `{ inclination, inclinationArcSeconds, heightDifference, corrected, checks, ok }`
 * @throws {QuadspreadError} `INCONSISTENT_READINGS` when the two set-ups have the same
 *   difference of sight lengths (the error cannot show); `INVALID_ARGUMENT` for a missing
 *   reading or distance, a negative distance or tolerance; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, twoPegTest } from 'quadspread';
 * const t = twoPegTest(rational, {
 *   first: { readingA: '1.432', readingB: '1.117' },
 *   second: { readingA: '1.512', readingB: '1.207', distanceA: 3, distanceB: 53 },
 * });
 * [rational.toString(t.inclination), rational.toString(t.heightDifference), rational.toNumber(t.corrected.readingB)];
 * //=> ['1/5000', '63/200', 1.1964]
 * ```
 */
export function twoPegTest<T>(A: Arithmetic<T>, input: TwoPegInput<T>): TwoPeg<T> {
  checkArithmetic(A, 'twoPegTest');
  const w = 'twoPegTest(input)';
  checkRecord(input, w);
  const read = (s: PegReadings<T>, at: string, needDistances: boolean) => {
    checkRecord(s, at);
    const r = (k: 'readingA' | 'readingB') => {
      if (s[k] === undefined)
        throw new QuadspreadError('INVALID_ARGUMENT', `${at}.${k}`, 'is missing');
      return readNumber(A, s[k], `${at}.${k}`);
    };
    const equal = !needDistances && s.distanceA === undefined && s.distanceB === undefined;
    return {
      a: r('readingA'),
      b: r('readingB'),
      dA: equal ? A.zero : readDistance(A, s.distanceA, `${at}.distanceA`),
      dB: equal ? A.zero : readDistance(A, s.distanceB, `${at}.distanceB`),
    };
  };
  const s1 = read(input.first, `${w}.first`, false);
  const s2 = read(input.second, `${w}.second`, true);
  const k1 = A.sub(s1.dA, s1.dB);
  const k2 = A.sub(s2.dA, s2.dB);
  const dk = A.sub(k2, k1);
  if (A.isZero(dk))
    throw new QuadspreadError(
      'INCONSISTENT_READINGS',
      `${w}.second`,
      'both set-ups have the same difference of sight lengths: set the second up near one peg',
    );
  const d1 = A.sub(s1.a, s1.b);
  const d2 = A.sub(s2.a, s2.b);
  const e = A.div(A.sub(d2, d1), dk); // ε = Δ(a − b) / Δ(d_A − d_B)
  const checks: FieldCheck<T>[] = [];
  check(A, checks, 'inclination', e, readTolerance(A, input.tolerance, `${w}.tolerance`));
  return {
    inclination: e,
    inclinationArcSeconds: A.div(A.mul(e, A.from(180 * ARCSEC)), A.pi),
    heightDifference: A.sub(d1, A.mul(e, k1)),
    corrected: { readingA: A.sub(s2.a, A.mul(e, s2.dA)), readingB: A.sub(s2.b, A.mul(e, s2.dB)) },
    checks,
    ok: checks.every((c) => c.ok),
  };
}
