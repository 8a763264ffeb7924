// Quadratic surds: normal form, exact arithmetic within a radicand, exact comparison,
// text and decimal expansion. Independent checks use mathjs BigNumber at 80 digits.
import { describe, expect, it } from 'vitest';
import { code } from './helpers.js';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { rational, decimal, float } from '../../src/index.js';
import {
  surd,
  sqrtOf,
  asRoot,
  isSurd,
  rootToNumber,
  rootToString,
  rootToPrecision,
} from '../../src/geometry/index.js';
import type { Surd } from '../../src/geometry/index.js';
import type { Rational } from '../../src/index.js';

const M = create(all!, { number: 'BigNumber', precision: 80 });
/** a + b√d in mathjs BigNumber at 80 digits, from the surd's exact parts (independent of the surd code). */
function big(s: Surd<Rational>) {
  const part = (x: Rational): any =>
    M.divide(M.bignumber((x.s * x.n).toString()) as any, M.bignumber(x.d.toString()) as any);
  return M.add(part(s.a), M.multiply(part(s.b), M.sqrt(part(s.d)))) as any;
}
const small = fc
  .tuple(fc.integer({ min: -400, max: 400 }), fc.integer({ min: 1, max: 30 }))
  .map(([n, m]) => `${n}/${m}`);
const radicand = fc.integer({ min: 2, max: 60 });
const surdArb = fc.tuple(small, small, radicand).map(([a, b, d]) => surd(rational, a, b, d));

describe('surd(A, a, b, d) builds the normal form', () => {
  // [a, b, d] → the normal form, worked by hand: square factors pulled out, roots of squares collapsed.
  const table: Array<[string, string, string, string]> = [
    ['0', '1', '200', '10√2'],
    ['1', '3', '200', '1 + 30√2'],
    ['2', '3', '9', '11'],
    ['0', '1', '1/2', '√2/2'],
    ['0', '1', '1/8', '√2/4'],
    ['0', '5', '0', '0'],
    ['7', '0', '5', '7'],
    ['0', '1', String(2 * 997 * 997), '997√2'],
  ];
  it.each(table)('surd(rational, %s, %s, %s) is %s', (a, b, d, text) => {
    const s = surd(rational, a, b, d);
    expect(s.toString()).toBe(text);
  });
  it('surd(rational, 0, 1, 200) has a = 0, b = 10, d = 2', () => {
    const s = surd(rational, 0, 1, 200);
    expect([s.a, s.b, s.d].map((x) => rational.toString(x))).toEqual(['0', '10', '2']);
  });
  it('a rational surd has b = 0 and d = 1 and says so', () => {
    const s = surd(rational, 3, 2, '4/9');
    expect([rational.toString(s.a), rational.toString(s.b), rational.toString(s.d)]).toEqual([
      '13/3',
      '0',
      '1',
    ]);
    expect(s.isRational()).toBe(true);
    expect(rational.toString(s.toRational()!)).toBe('13/3');
    expect(sqrtOf(rational, 2).isRational()).toBe(false);
    expect(sqrtOf(rational, 2).toRational()).toBeUndefined();
  });
  it('surd(A, a, b, d) refuses a negative radicand with NO_REAL_SOLUTION', () => {
    expect(code(() => surd(rational, 0, 1, -2))).toBe('NO_REAL_SOLUTION');
    expect(code(() => sqrtOf(rational, '-1/4'))).toBe('NO_REAL_SOLUTION');
    expect(code(() => sqrtOf(float, -1))).toBe('NO_REAL_SOLUTION');
  });
  it('surd(A, a, b, d) refuses text that is not a number with INVALID_NUMBER', () => {
    expect(code(() => surd(rational, 'abc', 1, 2))).toBe('INVALID_NUMBER');
    expect(code(() => sqrtOf(rational, NaN))).toBe('INVALID_NUMBER');
  });
});

describe('sqrtOf(A, x) is a surd in rational and a value elsewhere', () => {
  it('sqrtOf(rational, x)² = x exactly for random rationals x ≥ 0', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10 ** 6 }),
        fc.integer({ min: 1, max: 10 ** 6 }),
        (n, m) => {
          const r = sqrtOf(rational, `${n}/${m}`);
          expect(isSurd(r)).toBe(true);
          const sq = r.mul(r);
          expect(sq.isRational()).toBe(true);
          expect(rational.eq(sq.toRational()!, rational.from(`${n}/${m}`))).toBe(true);
        },
      ),
    );
  });
  it('sqrtOf(float, x) is Math.sqrt(x) and sqrtOf(decimal(30), 2) is correctly rounded', () => {
    expect(sqrtOf(float, 2)).toBe(Math.SQRT2);
    const D = decimal(30);
    // √2 to 30 significant digits: 1.41421356237309504880168872421 (mathjs BigNumber, 80 digits, rounded by hand).
    expect(D.toString(sqrtOf(D, 2))).toBe('1.41421356237309504880168872421');
  });
  it('asRoot lifts a value: a rational surd in rational, the value in float', () => {
    expect(isSurd(asRoot(rational, '3/4'))).toBe(true);
    expect(asRoot(float, 0.75)).toBe(0.75);
    expect(rootToNumber(rational, asRoot(rational, '3/4'))).toBe(0.75);
    expect(rootToString(float, sqrtOf(float, 4))).toBe('2');
    expect(rootToPrecision(float, sqrtOf(float, 2), 5)).toBe('1.4142');
  });
});

describe('surd arithmetic is exact within one radicand', () => {
  it('(41 + 20√2)(41 − 20√2) = 881 and their sum is 82', () => {
    const p = surd(rational, 41, 20, 2);
    expect(p.mul(p.conjugate()).toString()).toBe('881');
    expect(p.add(p.conjugate()).toString()).toBe('82');
    expect(p.sub(p.conjugate()).toString()).toBe('40√2');
  });
  it('x + y − y = x, x·y ÷ y = x and x − x = 0 for random surds over one radicand', () => {
    fc.assert(
      fc.property(small, small, small, small, radicand, (a, b, c, e, d) => {
        const x = surd(rational, a, b, d);
        const y = surd(rational, c, e, d);
        expect(x.add(y).sub(y).eq(x)).toBe(true);
        if (!y.isZero()) expect(x.mul(y).div(y).eq(x)).toBe(true);
        expect(x.sub(x).isZero()).toBe(true);
      }),
    );
  });
  it('the value of x·y, x + y and x ÷ y agrees with mathjs BigNumber to 60 digits', () => {
    fc.assert(
      fc.property(small, small, small, small, radicand, (a, b, c, e, d) => {
        const x = surd(rational, a, b, d);
        const y = surd(rational, c, e, d);
        const tol = M.bignumber('1e-60');
        const close = (s: Surd<Rational>, v: any) =>
          expect(
            M.smallerEq(M.abs(M.subtract(big(s), v)), M.multiply(tol, M.add(1, M.abs(v)))),
          ).toBe(true);
        close(x.mul(y), M.multiply(big(x), big(y)));
        close(x.add(y), M.add(big(x), big(y)));
        if (!y.isZero()) close(x.div(y), M.divide(big(x), big(y)));
      }),
    );
  });
  it('radicands whose ratio is a square combine: √8 + √2 = 3√2', () => {
    expect(sqrtOf(rational, 8).add(sqrtOf(rational, 2)).toString()).toBe('3√2');
  });
  it('plain values mix with surds: (1 + √2) + 1/2 and 2·√3', () => {
    expect(surd(rational, 1, 1, 2).add('1/2').toString()).toBe('3/2 + √2');
    expect(sqrtOf(rational, 3).mul(2).toString()).toBe('2√3');
    expect(surd(rational, 5).add(sqrtOf(rational, 7)).toString()).toBe('5 + √7');
  });
  it('different radicands throw DIFFERENT_RADICANDS for + − × ÷', () => {
    const x = sqrtOf(rational, 2);
    const y = sqrtOf(rational, 3);
    expect(code(() => x.add(y))).toBe('DIFFERENT_RADICANDS');
    expect(code(() => x.sub(y))).toBe('DIFFERENT_RADICANDS');
    expect(code(() => x.mul(y))).toBe('DIFFERENT_RADICANDS');
    expect(code(() => x.div(y))).toBe('DIFFERENT_RADICANDS');
  });
  it('division by a zero surd throws DIVISION_BY_ZERO', () => {
    expect(code(() => sqrtOf(rational, 2).div(surd(rational, 0)))).toBe('DIVISION_BY_ZERO');
  });
});

describe('surd comparison is exact, across radicands too', () => {
  it('cmp agrees with mathjs BigNumber for random surds over any radicands', () => {
    fc.assert(
      fc.property(surdArb, surdArb, (x, y) => {
        const c = Number(M.compare(big(x), big(y)));
        const want = M.equal(big(x), big(y)) ? 0 : c;
        // equal values at 80 digits but different exact values cannot occur for these small surds
        expect(x.cmp(y)).toBe(want);
        expect(x.eq(y)).toBe(want === 0);
      }),
    );
  });
  it('sign is exact where floats cancel: 665857 − 470832√2 > 0 and 470832√2 − 665857 < 0', () => {
    // 665857² − 2·470832² = 1 (a Pell equation solution, derived): the difference is 1/(665857 + 470832√2) ≈ 7.5e-7.
    expect(surd(rational, 665857, -470832, 2).sign()).toBe(1);
    expect(surd(rational, -665857, 470832, 2).sign()).toBe(-1);
    expect(surd(rational, 0).sign()).toBe(0);
  });
  it('1 + √2 > √5, 3/10 + √3 < √5 and √10 > √2', () => {
    expect(surd(rational, 1, 1, 2).cmp(sqrtOf(rational, 5))).toBe(1);
    expect(surd(rational, '3/10', 1, 3).cmp(sqrtOf(rational, 5))).toBe(-1);
    expect(sqrtOf(rational, 10).cmp(sqrtOf(rational, 2))).toBe(1);
  });
});

describe('surd text and numbers', () => {
  const table: Array<[string, string, string, string]> = [
    ['41', '20', '2', '41 + 20√2'],
    ['41', '-20', '2', '41 - 20√2'],
    ['0', '-3/2', '5', '-3√5/2'],
    ['0', '1/2', '5', '√5/2'],
    ['1/2', '1/2', '5', '1/2 + √5/2'],
    ['-1', '-1', '3', '-1 - √3'],
    ['0', '1', '7', '√7'],
    ['7/3', '0', '7', '7/3'],
  ];
  it.each(table)('surd(rational, %s, %s, %s).toString() is %s', (a, b, d, text) => {
    expect(surd(rational, a, b, d).toString()).toBe(text);
  });
  it('toNumber is within 2 ulp of the mathjs value, even with cancellation', () => {
    fc.assert(
      fc.property(surdArb, (x) => {
        const v = Number(big(x).toString());
        expect(Math.abs(x.toNumber() - v)).toBeLessThanOrEqual(
          4 * Number.EPSILON * Math.abs(v) + Number.MIN_VALUE,
        );
      }),
    );
    const p = surd(rational, 665857, -470832, 2);
    const v = Number(big(p).toString());
    expect(Math.abs(p.toNumber() - v)).toBeLessThanOrEqual(4 * Number.EPSILON * v);
  });
  it('toPrecision(n) rounds correctly: it matches mathjs BigNumber rounded to n digits', () => {
    fc.assert(
      fc.property(surdArb, fc.integer({ min: 1, max: 50 }), (x, n) => {
        fc.pre(!x.isZero());
        const mine = M.bignumber(x.toPrecision(n));
        const ref = M.bignumber(M.format(big(x), { precision: n }));
        expect(M.equal(mine, ref)).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
  it('(41 − 20√2).toPrecision(40) has 40 correct digits', () => {
    // 41 − 20√2 with √2 = 1.41421356237309504880168872420969807856967187537694... (mathjs, 80 digits)
    const want = M.format(M.subtract(41, M.multiply(20, M.sqrt(M.bignumber(2)))), {
      precision: 40,
    });
    expect(surd(rational, 41, -20, 2).toPrecision(40)).toBe(want);
  });
  it('toPrecision refuses a digit count outside 1..1000 with INVALID_ARGUMENT', () => {
    expect(code(() => sqrtOf(rational, 2).toPrecision(0))).toBe('INVALID_ARGUMENT');
    expect(code(() => sqrtOf(rational, 2).toPrecision(1.5))).toBe('INVALID_ARGUMENT');
  });
});

describe('surds print and serialise as their exact text', () => {
  it('JSON.stringify writes a surd as its text and the console shows the same text', async () => {
    expect(JSON.stringify({ Q3: surd(rational, 41, -20, 2) })).toBe('{"Q3":"41 - 20√2"}');
    const { inspect } = await import('node:util');
    expect(inspect(sqrtOf(rational, 8))).toBe('2√2');
  });
  it('toPrecision works for radicands beyond the range of JS numbers', () => {
    // √(4·10^400 + 1) = 2·10^200·(1 + 1/(8·10^400) − …): to 30 digits it is 2·10^200 (derived),
    // written as the arithmetic writes the rational 2·10^200 to 30 digits.
    const t = surd(rational, 0, 1, 4n * 10n ** 400n + 1n);
    expect(t.isRational()).toBe(false);
    expect(t.toPrecision(30)).toBe(rational.toPrecision(rational.from(2n * 10n ** 200n), 30));
    expect(sqrtOf(rational, 4n * 10n ** 400n).toString()).toBe(`2${'0'.repeat(200)}`);
  });
});

describe('surds over an inexact arithmetic', () => {
  it('surd(decimal(20), 1, 1, 2) keeps its form and rounds only when asked for a number or digits', () => {
    const D = decimal(20);
    const s = surd(D, 1, 1, 2);
    expect(s.toString()).toBe('1 + √2');
    expect(s.toNumber()).toBeCloseTo(1 + Math.SQRT2, 15);
    // 1 + √2 = 2.41421356237309504880… (√2 from mathjs BigNumber above), to 10 digits
    expect(s.toPrecision(10)).toBe('2.414213562');
    expect(s.mul(s.conjugate()).toString()).toBe('-1');
  });
});

describe('Surd.toNumber()', () => {
  it("gives the nearest number when the radicand's terms are beyond JS range (√(p/q) kept as √(pq)/q)", () => {
    // (4·10^1000 + 1)/10^1000 is 4 + 1e-1000, whose root 2 + 2.5e-1001 rounds to the double 2
    const x = rational.div(rational.from(4n * 10n ** 1000n + 1n), rational.from(10n ** 1000n));
    const s = sqrtOf(rational, x) as Surd<Rational>;
    expect(s.isRational()).toBe(false);
    expect(s.toNumber()).toBe(2);
  });
});
