// decimalLength (src/arithmetic/fused-decimal.ts) sizes the decimal kernels' divisions; it may
// be off by one either way, never more (the division's margin is one digit). Checked against
// the length of the decimal text (the definition) on random bigints and on the awkward ones
// next to powers of ten, where the nearest double rounds across the power.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimalLength } from '../../src/arithmetic/fused-decimal.js';

const digitsOf = (x: bigint): number => (x < 0n ? -x : x).toString().length;

describe('decimalLength', () => {
  it('is within one of the digit count next to every power of ten up to 10^400', () => {
    for (let k = 1; k <= 400; k++) {
      const p = 10n ** BigInt(k);
      for (const x of [p - 1n, p, p + 1n, -(p - 1n), -p, p - p / 1000n, p + p / 1000n]) {
        if (x === 0n) continue;
        expect(Math.abs(decimalLength(x) - digitsOf(x))).toBeLessThanOrEqual(1);
      }
    }
  });
  it('is within one of the digit count on random bigints, and exact beyond 1e300', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(10n ** 350n), max: 10n ** 350n }), (x) => {
        if (x === 0n) return;
        const d = decimalLength(x);
        expect(Math.abs(d - digitsOf(x))).toBeLessThanOrEqual(1);
        if (digitsOf(x) > 301) expect(d).toBe(digitsOf(x));
      }),
      { numRuns: 3000 },
    );
  });
});
