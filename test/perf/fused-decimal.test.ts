// The fused decimal kernel (src/arithmetic/fused-decimal.ts) computes each triangle measure
// exactly and rounds it once: every result is the exact value correctly rounded (ties to
// even) to the arithmetic's digits. It differs from the generic step-by-step result (which
// rounds after every step) by at most 2·10^(1−digits) relative when the generic differences
// and products are exact, and not at all where no generic step rounds.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimal, rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Decimal } from '../../src/index.js';
import { point, triangle } from '../../src/geometry/index.js';

const KEYS = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea'] as const;

const pow10 = (k: number): bigint => 10n ** BigInt(k);
const ndigits = (a: bigint): number => a.toString().length;

/** n/d > 0 rounded to p significant digits, ties to even, as text `coef e exp` (derived here). */
function roundHalfEven(n: bigint, d: bigint, p: number): string {
  let k = p - (ndigits(n) - ndigits(d));
  const at = (j: number): [bigint, bigint] => (j >= 0 ? [n * pow10(j), d] : [n, d * pow10(-j)]);
  let [a, b] = at(k);
  let q = a / b;
  while (q >= pow10(p)) {
    [a, b] = at(--k);
    q = a / b;
  }
  while (q < pow10(p - 1)) {
    [a, b] = at(++k);
    q = a / b;
  }
  const r2 = 2n * (a - q * b);
  if (r2 > b || (r2 === b && q % 2n === 1n)) q += 1n;
  return `${q}e${-k}`;
}

const mm = fc.integer({ min: -100_000_000, max: 100_000_000 }).map((m) => `${m / 1000}`);
const long = fc
  .tuple(fc.bigInt({ min: -(10n ** 18n), max: 10n ** 18n }), fc.integer({ min: -20, max: 3 }))
  .map(([m, e]) => `${m}e${e}`);
const coord = fc.oneof(mm, long, fc.integer({ min: -9, max: 9 }).map(String));
const six = fc.tuple(coord, coord, coord, coord, coord, coord);
const digits = fc.constantFrom(7, 12, 20, 34, 50);

function code(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
  }
  return undefined;
}

describe('the fused decimal triangle kernel', () => {
  it('gives each measure as the exact value correctly rounded to the digits (ties to even)', () => {
    fc.assert(
      fc.property(six, digits, (c, p) => {
        const D = decimal(p);
        const [P, Q, R] = [0, 2, 4].map((i) => point(D, c[i]!, c[i + 1]!));
        // The exact measures, from the same (already rounded) decimal inputs, in rational.
        const [Pe, Qe, Re] = [P, Q, R].map((X) =>
          point(rational, D.toString(X!.x), D.toString(X!.y)),
        );
        let exact;
        if (code(() => (exact = triangle(rational, Pe!, Qe!, Re!))) !== undefined) return;
        const t = triangle(D, P!, Q!, R!);
        for (const k of KEYS) {
          const want = roundHalfEven(exact![k].n, exact![k].d, p);
          expect(D.eq(t[k], D.from(want)), `${k}: ${D.toString(t[k])} vs ${want}`).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('is within 2·10^(1−digits) relative of the generic result, and equal in Q1..Q3, when the generic differences and products are exact', () => {
    // Millimetre coordinates up to 100 km have at most 9 significant digits, so with 20 or more
    // digits the generic sub, mul and add of triangle() are exact up to D = u × v; then D², Q·Q
    // and the division (or 4·D²) round, each by at most ½·10^(1−digits) relative, and the kernel
    // once more: at most 2·10^(1−digits) apart (derived, first order). With
    // fewer digits the generic path can lose much more (cancellation in u × v); the kernel
    // cannot (previous test).
    fc.assert(
      fc.property(fc.tuple(mm, mm, mm, mm, mm, mm), fc.constantFrom(20, 34, 50), (c, p) => {
        const D = decimal(p);
        const plain: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
        const [P, Q, R] = [0, 2, 4].map((i) => point(D, c[i]!, c[i + 1]!));
        let slow;
        const e = code(() => (slow = triangle(plain, P!, Q!, R!)));
        expect(code(() => triangle(D, P!, Q!, R!))).toBe(e);
        if (e !== undefined) return;
        const fast = triangle(D, P!, Q!, R!);
        for (const k of KEYS) {
          const f = rational.from(D.toString(fast[k]));
          const s = rational.from(D.toString(slow![k]));
          const bound = rational.mul(rational.from(`2.01e${1 - p}`), rational.abs(f));
          expect(rational.cmp(rational.abs(rational.sub(f, s)), bound) <= 0, k).toBe(true);
        }
        for (const k of ['Q1', 'Q2', 'Q3'] as const) expect(D.eq(fast[k], slow![k]), k).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
