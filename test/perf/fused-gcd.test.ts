// The fused kernels' gcd (Lehmer's method on the leading bits, then doubles) against Euclid's
// algorithm written out here on bigints (Euclid, Elements VII.2), on random, structured and
// adversarial operands (consecutive Fibonacci numbers: the longest quotient sequences).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gcd } from '../../src/arithmetic/fused-rational.js';

function euclid(a: bigint, b: bigint): bigint {
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

const big = fc.bigInt({ min: 0n, max: 1n << 700n });
// Numbers with a large common factor, sizes mixed from one bit to 1200 bits.
const sized = fc
  .tuple(fc.integer({ min: 0, max: 1200 }), fc.bigInt({ min: 0n, max: (1n << 1200n) - 1n }))
  .map(([bits, x]) => x >> BigInt(1200 - bits));

describe('gcd of the fused kernels (Lehmer)', () => {
  it('equals Euclid on random operands', () => {
    fc.assert(
      fc.property(big, big, (a, b) => {
        expect(gcd(a, b)).toBe(euclid(a, b));
      }),
      { numRuns: 2000 },
    );
  });

  it('equals Euclid on operands with a common factor and very different sizes', () => {
    fc.assert(
      fc.property(sized, sized, sized, (a, b, g) => {
        expect(gcd(a * g, b * g)).toBe(euclid(a * g, b * g));
        expect(gcd(a, b * g + 1n)).toBe(euclid(a, b * g + 1n));
      }),
      { numRuns: 2000 },
    );
  });

  it('equals Euclid on consecutive Fibonacci numbers, powers of two and near powers of two', () => {
    const fib = [0n, 1n];
    for (let i = 2; i < 1500; i++) fib.push(fib[i - 1]! + fib[i - 2]!);
    for (let i = 60; i < 1500; i += 7) {
      expect(gcd(fib[i]!, fib[i - 1]!)).toBe(1n);
      expect(gcd(fib[i]! * 12n, fib[i - 3]! * 18n)).toBe(euclid(fib[i]! * 12n, fib[i - 3]! * 18n));
    }
    for (let k = 50n; k < 1100n; k += 13n) {
      const p = 1n << k;
      for (const [a, b] of [
        [p, p - 1n],
        [p + 1n, p - 1n],
        [p * 3n, p],
        [p - 1n, (1n << (k / 2n)) - 1n],
        [p, 1n << (k - 1n)],
        [p * p - 1n, p + 1n],
      ] as const) {
        expect(gcd(a, b)).toBe(euclid(a, b));
        expect(gcd(b, a)).toBe(euclid(a, b));
      }
    }
    expect(gcd(0n, 0n)).toBe(0n);
    expect(gcd(1n << 200n, 0n)).toBe(1n << 200n);
    expect(gcd(0n, 10n ** 40n)).toBe(10n ** 40n);
  });
});
