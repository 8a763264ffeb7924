// Field laws: exact in rational; within a stated relative bound in decimal and float.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';

/** Numeric text from random integers: n / 10^k with up to 12 digits, and ratios n/m. */
const numericText = fc.oneof(
  fc
    .tuple(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 9 }))
    .map(([n, k]) => `${n}e-${k}`),
  fc
    .tuple(fc.integer({ min: -1e6, max: 1e6 }), fc.integer({ min: 1, max: 1e6 }))
    .map(([n, m]) => `${n}/${m}`),
);
const nonZeroText = numericText.filter((t) => !/^-?0(e|\/)/.test(t));

describe('rational satisfies the field laws exactly', () => {
  const A = rational;
  const eq = (x: unknown, y: unknown) =>
    expect(A.toString(x as never)).toBe(A.toString(y as never));
  it('a + b = b + a and a·b = b·a', () => {
    fc.assert(
      fc.property(numericText, numericText, (x, y) => {
        const a = A.from(x),
          b = A.from(y);
        eq(A.add(a, b), A.add(b, a));
        eq(A.mul(a, b), A.mul(b, a));
      }),
    );
  });
  it('(a + b) + c = a + (b + c) and (a·b)·c = a·(b·c)', () => {
    fc.assert(
      fc.property(numericText, numericText, numericText, (x, y, z) => {
        const a = A.from(x),
          b = A.from(y),
          c = A.from(z);
        eq(A.add(A.add(a, b), c), A.add(a, A.add(b, c)));
        eq(A.mul(A.mul(a, b), c), A.mul(a, A.mul(b, c)));
      }),
    );
  });
  it('a·(b + c) = a·b + a·c', () => {
    fc.assert(
      fc.property(numericText, numericText, numericText, (x, y, z) => {
        const a = A.from(x),
          b = A.from(y),
          c = A.from(z);
        eq(A.mul(a, A.add(b, c)), A.add(A.mul(a, b), A.mul(a, c)));
      }),
    );
  });
  it('a + (−a) = 0 and a·(1/a) = 1', () => {
    fc.assert(
      fc.property(nonZeroText, (x) => {
        const a = A.from(x);
        expect(A.isZero(A.add(a, A.neg(a)))).toBe(true);
        expect(A.eq(A.mul(a, A.div(A.one, a)), A.one)).toBe(true);
        eq(A.sub(a, a), A.zero);
      }),
    );
  });
});

// Bound: each + − × ÷ rounds once with relative error at most u (half an ulp: 2^-53 for
// float, 5·10^-d for decimal(d)); a law comparing two expressions of at most three
// operations each differs by at most 6u times the sum of the magnitudes of the terms.
const inexact: Array<[string, Arithmetic<any>, number]> = [
  ['float', float, 2 ** -53],
  ['decimal(34)', decimal(34), 5e-34],
  ['decimal(12)', decimal(12), 5e-12],
];

describe.each(inexact)('%s satisfies the field laws within 6u·(sum of magnitudes)', (_n, A, u) => {
  const close = (x: unknown, y: unknown, scale: number) => {
    const d = Math.abs(A.toNumber(x as never) - A.toNumber(y as never));
    expect(d).toBeLessThanOrEqual(6 * u * scale + Number.MIN_VALUE);
  };
  const mag = (...v: unknown[]) =>
    v.reduce<number>((s, x) => s + Math.abs(A.toNumber(x as never)), 0);
  it('commutativity holds exactly', () => {
    fc.assert(
      fc.property(numericText, numericText, (x, y) => {
        const a = A.from(x),
          b = A.from(y);
        expect(A.eq(A.add(a, b), A.add(b, a))).toBe(true);
        expect(A.eq(A.mul(a, b), A.mul(b, a))).toBe(true);
      }),
    );
  });
  it('associativity holds within the bound', () => {
    fc.assert(
      fc.property(numericText, numericText, numericText, (x, y, z) => {
        const a = A.from(x),
          b = A.from(y),
          c = A.from(z);
        close(A.add(A.add(a, b), c), A.add(a, A.add(b, c)), mag(a, b, c));
        const abc = Math.abs(A.toNumber(a) * A.toNumber(b) * A.toNumber(c));
        close(A.mul(A.mul(a, b), c), A.mul(a, A.mul(b, c)), abc);
      }),
    );
  });
  it('distributivity holds within the bound', () => {
    fc.assert(
      fc.property(numericText, numericText, numericText, (x, y, z) => {
        const a = A.from(x),
          b = A.from(y),
          c = A.from(z);
        const scale = Math.abs(A.toNumber(a)) * (Math.abs(A.toNumber(b)) + Math.abs(A.toNumber(c)));
        close(A.mul(a, A.add(b, c)), A.add(A.mul(a, b), A.mul(a, c)), scale);
      }),
    );
  });
  it('inverses hold within the bound', () => {
    fc.assert(
      fc.property(nonZeroText, (x) => {
        const a = A.from(x);
        expect(A.isZero(A.add(a, A.neg(a)))).toBe(true);
        close(A.mul(a, A.div(A.one, a)), A.one, 1);
      }),
    );
  });
});
