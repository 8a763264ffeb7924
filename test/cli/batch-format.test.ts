// The batch command's fast paths in float: the native Number#toPrecision (rewritten to the
// exact formatter's notation) gives the same text as float.toPrecision, the exact formatter
// (half away from zero on the exact value of the double); and plain decimal text read by
// Number gives the same value as float.from, or is left to it.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { float } from '../../src/index';
import { floatToPrecision, nativePrecision } from '../../src/cli/batch-format';
import { plainFloat } from '../../src/cli/batch-rows';

const digits = fc.integer({ min: 1, max: 100 });
const same = (x: number, d: number): void => {
  const t = nativePrecision(x, d);
  if (t !== undefined) expect(t).toBe(float.toPrecision(x, d));
  expect(floatToPrecision(x, d)).toBe(float.toPrecision(x, d));
};

/** The number of significant digits of the exact decimal expansion of a double m/2^k. */
function exactDigits(m: number, k: number): number {
  const n = BigInt(m) * 5n ** BigInt(k); // m/2^k = m·5^k / 10^k
  return n.toString().replace(/0+$/, '').length;
}

describe('batch float formatting (native where it gives the same text)', () => {
  it('every double, subnormals, −0 and ±1e21 and beyond, at 1..100 digits', () => {
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), digits, same), {
      numRuns: 20000,
      seed: 16,
    });
  });

  it('values of every decimal magnitude from 1e-12 to 1e25, at 1..25 digits', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 10, noNaN: true }),
        fc.integer({ min: -12, max: 25 }),
        fc.boolean(),
        fc.integer({ min: 1, max: 25 }),
        (m, e, negative, d) => same((negative ? -m : m) * 10 ** e, d),
      ),
      { numRuns: 20000, seed: 21 },
    );
  });

  it('ties at the display precision (an exact expansion ending in 5, one digit past)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 2 ** 26 }),
        fc.integer({ min: 1, max: 60 }),
        fc.boolean(),
        (half, k, negative) => {
          const m = 2 * half + 1; // odd: m/2^k ends in the digit 5 at the k-th decimal
          const x = (negative ? -m : m) / 2 ** k;
          const d = exactDigits(m, k) - 1;
          fc.pre(d >= 1 && d <= 100);
          same(x, d);
          // It is a tie: the exact expansion, one digit longer, ends in 5.
          const t = float.toPrecision(Math.abs(x), d + 1);
          expect(t.split('e')[0]!.replace(/0+$/, '').endsWith('5')).toBe(true);
        },
      ),
      { numRuns: 5000, seed: 5 },
    );
    // Published examples of the rule (ECMA-262 picks the larger n on a tie): 0.125 → 0.13,
    // 2.5 → 3, −0.375 → −0.38, 1.5e-7 → 0.00000015 (written without exponent by quadspread).
    expect(floatToPrecision(0.125, 2)).toBe('0.13');
    expect(floatToPrecision(2.5, 1)).toBe('3');
    expect(floatToPrecision(-0.375, 2)).toBe('-0.38');
    expect(floatToPrecision(1.5e-7, 2)).toBe('0.00000015');
  });

  it('the notations at the edges: 1e-7, 1e21, large integers, zero', () => {
    for (const [x, d] of [
      [1e21, 3],
      [1e21, 25],
      [999999999999999900000, 25],
      [9.9999999e20, 3],
      [1.23456e-7, 4],
      [9.99999e-8, 3],
      [12345678901, 4],
      [-0, 10],
      [0, 1],
      [5e-324, 17],
      [Number.MAX_VALUE, 100],
    ] as const)
      same(x, d);
    expect(floatToPrecision(12345678901, 4)).toBe('12350000000');
    expect(floatToPrecision(1e21, 3)).toBe('1.00e+21');
    expect(floatToPrecision(-0, 3)).toBe('0.00');
  });

  it('the native path is taken for ordinary survey values', () => {
    for (const x of [0.001, 1, 123.456, 4.5e9, 2.5e20, -7.25e-7])
      expect(nativePrecision(x, 10)).toBeDefined();
  });
});

describe('batch float reading (Number where it reads as float.from)', () => {
  const fromOrError = (t: string): number | string => {
    try {
      return float.from(t);
    } catch {
      return 'refused';
    }
  };
  it('agrees with float.from on text made of digits, signs, points, exponents, prefixes and spaces', () => {
    const ch = fc.constantFrom(
      ...'0123456789.eE+-xXbBoO In'.split(''),
      'Infinity',
      '1e-400',
      'e999',
    );
    fc.assert(
      fc.property(fc.array(ch, { minLength: 1, maxLength: 12 }), (parts) => {
        const t = parts.join('');
        const v = plainFloat(t);
        if (v !== undefined) expect(v).toBe(fromOrError(t));
      }),
      { numRuns: 30000, seed: 7 },
    );
  });

  it('agrees on every double written by String()', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const t = String(x);
        const v = plainFloat(t);
        if (v !== undefined) expect(Object.is(v, float.from(t))).toBe(true);
      }),
      { numRuns: 10000, seed: 8 },
    );
    expect(plainFloat('12.5')).toBe(12.5);
    expect(plainFloat('0x10')).toBeUndefined();
    expect(plainFloat(' 5')).toBeUndefined();
    expect(plainFloat('1e-2000')).toBeUndefined();
  });
});
