// The fused decimal kernel for heightFromInlineReadings (three stations): H, the foot's chainage
// and the offset quadrance are the exact values of the three-station formulas (the generic code
// run in the rational arithmetic on the same decimal inputs, without its kernel) correctly
// rounded, ties to even, to the digits; the residuals are 0 (exactly so in rational); and the
// kernel leaves to the generic code every input it does not take.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimal, rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Decimal, Rational } from '../../src/index.js';
import { heightFromInlineReadings } from '../../src/elevation/index.js';

const exactA: Arithmetic<Rational, true> = { ...rational, kernels: undefined };
const pow10 = (k: number): bigint => 10n ** BigInt(k);
const ndigits = (a: bigint): number => (a < 0n ? -a : a).toString().length;
/** n/d rounded to p significant digits, ties to even, as text (derived here, independently). */
function roundHalfEven(n: bigint, d: bigint, p: number): string {
  if (n === 0n) return '0';
  const neg = n < 0n;
  if (neg) n = -n;
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
  return `${neg ? '-' : ''}${q}e${-k}`;
}

function code(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
  }
  return undefined;
}

// Chainages in mm within 2 km, readings as decimals (the value of H/(H + Q) for a point, to
// 6–30 digits, so consistent up to the reading's rounding), sometimes 1 (level) or out of range.
const mm = fc.integer({ min: -2_000_000, max: 2_000_000 }).map((m) => `${m / 1000}`);
const reading = fc.oneof(
  { weight: 8, arbitrary: fc.constant(undefined) },
  { weight: 1, arbitrary: fc.constantFrom('1', '0', '-0.5', '1.5', '0.000001') },
);

describe('the fused decimal in-line height kernel', () => {
  it('gives the exact three-station solution correctly rounded, and the same errors as the generic code', () => {
    fc.assert(
      fc.property(
        fc.tuple(mm, mm, mm),
        mm,
        mm,
        fc.integer({ min: 1, max: 200_000 }),
        fc.tuple(reading, reading, reading),
        fc.integer({ min: 6, max: 30 }),
        fc.constantFrom(12, 20, 34),
        (cs, f, o, h, odd, rd, p) => {
          const D = decimal(p);
          const plain: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
          const R = decimal(rd);
          const H = R.mul(R.from(h / 1000), R.from(h / 1000));
          const e = R.mul(R.from(o), R.from(o));
          const vertical = cs.map((c, i) => {
            if (odd[i] !== undefined) return odd[i]!;
            const d = R.sub(R.from(c), R.from(f));
            return R.toString(R.div(H, R.add(R.add(H, R.mul(d, d)), e)));
          });
          const input = {
            chainages: cs.map((c) => D.from(c)),
            vertical: vertical.map((v) => D.from(v)),
          };
          const fused = D.kernels!.inlineHeight!(input);
          const slowCode = code(() => heightFromInlineReadings(plain, input));
          const exactIn = {
            chainages: input.chainages.map((c) => rational.from(D.toString(c))),
            vertical: input.vertical.map((v) => rational.from(D.toString(v))),
          };
          const exactCode = code(() => heightFromInlineReadings(exactA, exactIn));
          if (fused === undefined) {
            // Left to the generic code: then it is what the generic code gives.
            expect(code(() => heightFromInlineReadings(D, input))).toBe(slowCode);
            return;
          }
          // Taken: the exact solution exists (no error in exact arithmetic) and is what it gives.
          expect(exactCode).toBeUndefined();
          const x = heightFromInlineReadings(exactA, exactIn);
          const r = heightFromInlineReadings(D, input);
          for (const k of ['H', 'footChainage', 'footOffset'] as const) {
            const want = D.from(roundHalfEven(x[k].s * x[k].n, x[k].d, p));
            expect(D.eq(r[k], want), `${k}: ${D.toString(r[k])} vs ${D.toString(want)}`).toBe(true);
          }
          expect(x.residuals.every((v) => v.n === 0n)).toBe(true);
          expect(r.residuals.map((v) => D.toString(v))).toEqual(['0', '0', '0']);
          expect(r.sign).toBe(x.sign);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('leaves other inputs to the generic code: numbers, text, another instance, two or four stations, repeated chainages', () => {
    const D = decimal(34);
    const k = D.kernels!.inlineHeight!;
    const c = ['0', '10', '20'].map((s) => D.from(s));
    const v = ['144/218', '144/178', '144/338'].map((s) => D.from(s));
    expect(k({ chainages: c, vertical: v })).toBeDefined();
    expect(k({ chainages: [0, 10, 20], vertical: v })).toBeUndefined();
    expect(k({ chainages: c, vertical: ['0.6', '0.8', '0.4'] })).toBeUndefined();
    const other = decimal(34);
    expect(k({ chainages: c.map((x) => other.from(D.toString(x))), vertical: v })).toBeUndefined();
    expect(k({ chainages: c.slice(0, 2), vertical: v.slice(0, 2) })).toBeUndefined();
    expect(k({ chainages: [...c, D.from(30)], vertical: [...v, D.from('0.5')] })).toBeUndefined();
    expect(k({ chainages: [c[0], c[0], c[2]], vertical: v })).toBeUndefined();
    expect(k(null)).toBeUndefined();
    // A worked case, derived by hand: a point 12 m up (H = 144) over chainage 0 with no offset
    // gives, at chainages −4, 6 and 12, R = 144/(144 + 16), 144/(144 + 36), 144/(144 + 144)
    // = 0.9, 0.8, 0.5 (exact decimals, so the kernel's result is exact).
    const w = heightFromInlineReadings(D, {
      chainages: ['-4', '6', '12'].map((s) => D.from(s)),
      vertical: ['0.9', '0.8', '0.5'].map((s) => D.from(s)),
    });
    expect(
      D.kernels!.inlineHeight!({
        chainages: ['-4', '6', '12'].map((s) => D.from(s)),
        vertical: ['0.9', '0.8', '0.5'].map((s) => D.from(s)),
      }),
    ).toBeDefined();
    expect([D.toString(w.H), D.toString(w.footChainage), D.toString(w.footOffset)]).toEqual([
      '144',
      '0',
      '0',
    ]);
  });
});
