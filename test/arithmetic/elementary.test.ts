import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import type { BigNumber, FactoryFunctionMap } from 'mathjs';
import { decimalElementary } from '../../src/arithmetic/elementary.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { rational, RATIONAL_TRANSCENDENTAL_DIGITS } from '../../src/arithmetic/rational.js';
import { QuadspreadError } from '../../src/errors.js';

// Independent reference: mathjs BigNumber (decimal.js) at 64 significant digits for the
// acceptance check (38 agreeing digits). Checks of correct rounding use mathjs at 160
// digits: a 64-digit reference rounded again to 40 digits can itself be wrong by one unit
// when the true value lies within 1e-64 of a rounding tie (double rounding), and
// arguments such as 1 − 1e-32 make such near-ties common for sqrt and ln.
/** mathjs BigNumber functions at a given precision, typed for what the tests use. */
function reference(precision: number) {
  const M = create(all as FactoryFunctionMap, { precision });
  const big = (x: string | number): BigNumber => M.bignumber(x);
  const un =
    (f: unknown) =>
    (x: string): BigNumber =>
      (f as (v: BigNumber) => BigNumber)(big(x));
  return {
    big,
    sin: un(M.sin),
    cos: un(M.cos),
    tan: un(M.tan),
    atan: un(M.atan),
    sqrt: un(M.sqrt),
    exp: un(M.exp),
    ln: un(M.log),
    atan2: (y: string, x: string): BigNumber =>
      (M.atan2 as unknown as (a: BigNumber, b: BigNumber) => BigNumber)(big(y), big(x)),
    pi: (): BigNumber => big(-1).acos(),
  };
}
type Ref = ReturnType<typeof reference>;
const M64 = reference(64);
const M160 = reference(160);

/** The reference value rounded to `digits` significant digits. */
function ref(_M: Ref, v: BigNumber, digits: number): BigNumber {
  return v.toSignificantDigits(digits);
}

/** Number of agreeing significant digits of a against the reference b (−log10 |a − b| / |b|). */
function agreeingDigits(M: Ref, a: string, b: BigNumber): number {
  const x = M.big(a);
  if (x.eq(b)) return Infinity;
  return -x.minus(b).abs().div(b.abs()).log(10).toNumber();
}

/** Random decimal text: up to 40 significant digits, decimal exponent in [lo, hi]. */
const decimalText = (lo: number, hi: number) =>
  fc
    .tuple(
      fc.boolean(),
      fc.bigInt({ min: 1n, max: 10n ** 40n - 1n }),
      fc.integer({ min: lo, max: hi }),
    )
    .map(([neg, c, e]) => `${neg ? '-' : ''}${c}e${e - String(c).length + 1}`);

const E40 = decimalElementary(40);
const D40 = decimal(40);

describe('decimalElementary(40) against mathjs BigNumber', () => {
  const fns = [
    ['sin', (x: string) => E40.sin(x), (M: Ref, x: string) => M.sin(x)],
    ['cos', (x: string) => E40.cos(x), (M: Ref, x: string) => M.cos(x)],
    ['tan', (x: string) => E40.tan(x), (M: Ref, x: string) => M.tan(x)],
    ['atan', (x: string) => E40.atan(x), (M: Ref, x: string) => M.atan(x)],
  ] as const;
  for (const [name, mine, theirs] of fns) {
    it(`${name}(x) is correctly rounded to 40 digits on random arguments of moderate size`, () => {
      fc.assert(
        fc.property(decimalText(-6, 6), (x) => {
          expect(
            agreeingDigits(M64, mine(x), ref(M64, theirs(M64, x), 40)),
            `${name}(${x})`,
          ).toBeGreaterThanOrEqual(38);
          expect(M160.big(mine(x)).eq(ref(M160, theirs(M160, x), 40)), `${name}(${x})`).toBe(true);
        }),
        { numRuns: 150 },
      );
    });
    it(`${name}(x) agrees to 38 digits on huge (up to 1e300) and tiny (down to 1e-300) arguments`, () => {
      fc.assert(
        fc.property(fc.oneof(decimalText(20, 300), decimalText(-300, -20)), (x) => {
          const r = ref(M64, theirs(M64, x), 40);
          expect(agreeingDigits(M64, mine(x), r), `${name}(${x})`).toBeGreaterThanOrEqual(38);
        }),
        { numRuns: 60 },
      );
    });
  }

  it('sqrt, exp and ln are correctly rounded to 40 digits on random arguments (including 1 ± tiny)', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          decimalText(-30, 30),
          fc.integer({ min: 1, max: 60 }).map((k) => `1.${'0'.repeat(k)}7`),
        ),
        decimalText(-1, 2),
        (x, y) => {
          const ax = x.replace(/^-/, '');
          expect(M160.big(E40.sqrt(ax)).eq(ref(M160, M160.sqrt(ax), 40)), `sqrt(${ax})`).toBe(true);
          expect(M160.big(E40.ln(ax)).eq(ref(M160, M160.ln(ax), 40)), `ln(${ax})`).toBe(true);
          expect(M160.big(E40.exp(y)).eq(ref(M160, M160.exp(y), 40)), `exp(${y})`).toBe(true);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('atan2(y, x) is correctly rounded to 40 digits in every quadrant', () => {
    fc.assert(
      fc.property(decimalText(-10, 10), decimalText(-10, 10), (y, x) => {
        const r = ref(M160, M160.atan2(y, x), 40);
        expect(M160.big(E40.atan2(y, x)).eq(r), `atan2(${y}, ${x})`).toBe(true);
      }),
      { numRuns: 200 },
    );
  });

  it('π is 3.141592653589793238462643383279502884197 (its well-known expansion to 40 digits)', () => {
    // The widely reproduced decimal expansion of π (from memory), checked again below against mathjs.
    expect(E40.pi).toBe('3.141592653589793238462643383279502884197');
    expect(decimalElementary(50).pi).toBe('3.1415926535897932384626433832795028841971693993751');
  });
});

describe('decimalElementary near multiples of π/2 (reference: mathjs at 160 digits)', () => {
  it('sin, cos and tan keep 40 correct digits at 40-digit arguments within 1e-30 of kπ/2', () => {
    const halfPi = M160.pi().div(2);
    fc.assert(
      fc.property(
        fc.integer({ min: -1000000, max: 1000000 }),
        fc.integer({ min: -30, max: 30 }),
        (k, off) => {
          // x = k·π/2 rounded to 40 digits, nudged by off units of the 40th digit
          const base = halfPi.times(k).toSignificantDigits(40);
          const x = base
            .plus(M160.big(10).pow(base.abs().log(10).floor().minus(39)).times(off))
            .toString();
          if (M160.big(x).isZero()) return;
          for (const [name, mine, theirs] of [
            ['sin', E40.sin, M160.sin],
            ['cos', E40.cos, M160.cos],
            ['tan', E40.tan, M160.tan],
          ] as const) {
            const r = ref(M160, theirs(x), 40);
            expect(M160.big(mine(x)).eq(r), `${name}(${x})`).toBe(true);
          }
        },
      ),
      { numRuns: 80 },
    );
  });

  it('sin(355) keeps its digits although 355 is within 3e-5 of 113π', () => {
    expect(E40.sin('355')).toBe(M160.sin('355').toSignificantDigits(40).toString());
  });
});

describe('decimalElementary exact cases and rounding', () => {
  it('returns the exact values sin 0 = 0, cos 0 = 1, tan 0 = 0, exp 0 = 1, ln 1 = 0, atan2(0, 1) = 0', () => {
    expect([
      E40.sin('0'),
      E40.cos('0'),
      E40.tan('-0'),
      E40.exp('0'),
      E40.ln('1'),
      E40.atan2('0', '5'),
    ]).toEqual(['0', '1', '0', '1', '0', '0']);
  });
  it('atan2(y, x) gives π for y = 0, x < 0 and ±π/2 on the y axis (range (−π, π])', () => {
    expect(E40.atan2('0', '-2')).toBe(E40.pi);
    expect(E40.atan2('3', '0')).toBe(ref(M64, M64.pi().div(2), 40).toString());
    expect(E40.atan2('-3', '0')).toBe(ref(M64, M64.pi().div(-2), 40).toString());
  });
  it('sqrt(x) rounds ties to even: sqrt(1.5625) = 1.2 at 2 digits, sqrt(1.6129) = 1.3 at 2 digits', () => {
    // 1.25² = 1.5625 and 1.27² = 1.6129 (derived)
    expect(decimalElementary(2).sqrt('1.5625')).toBe('1.2');
    expect(decimalElementary(2).sqrt('1.6129')).toBe('1.3');
    expect(decimalElementary(3).sqrt('2')).toBe('1.41');
  });
  it('sin(x) of a tiny x is x itself when x has fewer digits than the precision', () => {
    expect(E40.sin('1e-30')).toBe('1e-30');
    expect(E40.sin('-2.5e-3000')).toBe('-2.5e-3000');
  });
  it('works at 1000 digits: π agrees with mathjs at 1010 digits, rounded to 1000', () => {
    const M1010 = reference(1010);
    const p = decimalElementary(1000).pi;
    expect(p.length).toBe(1001);
    expect(p).toBe(M1010.pi().toSignificantDigits(1000).toString());
  });
});

describe('decimal(d) and rational use decimalElementary', () => {
  it('decimal(40).sin and .atan2 agree with mathjs at 64 digits to at least 38 digits', () => {
    fc.assert(
      fc.property(decimalText(-5, 5), decimalText(-5, 5), (a, b) => {
        const s = D40.toString(D40.sin(D40.from(a)));
        expect(agreeingDigits(M64, s, ref(M64, M64.sin(a), 40))).toBeGreaterThanOrEqual(38);
        const t = D40.toString(D40.atan2(D40.from(a), D40.from(b)));
        expect(agreeingDigits(M64, t, ref(M64, M64.atan2(a, b), 40))).toBeGreaterThanOrEqual(38);
      }),
      { numRuns: 100 },
    );
  });
  it(`rational.cos(x) is within 1e-40 of the true value (computed at ${RATIONAL_TRANSCENDENTAL_DIGITS} digits)`, () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -10000, max: 10000 }),
        fc.integer({ min: 1, max: 997 }),
        (n, d) => {
          const c = rational.cos(rational.from(`${n}/${d}`));
          const mine = M64.big(c.n.toString()).times(Number(c.s)).div(M64.big(c.d.toString()));
          const truth = M64.big(n).div(d).cos();
          expect(Number(mine.minus(truth).abs().toString())).toBeLessThan(1e-40);
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe('decimalElementary bad input', () => {
  const bad: [string, () => unknown, string][] = [
    ['digits 0', () => decimalElementary(0), 'INVALID_ARGUMENT'],
    ['digits 1001', () => decimalElementary(1001), 'INVALID_ARGUMENT'],
    ['digits 2.5', () => decimalElementary(2.5), 'INVALID_ARGUMENT'],
    ['text that is not a number', () => E40.sin('abc'), 'INVALID_NUMBER'],
    ['empty text', () => E40.cos(''), 'INVALID_NUMBER'],
    ['text of 5000 characters', () => E40.sin('1'.repeat(5000)), 'INPUT_TOO_LONG'],
    ['an exponent of 1e30000', () => E40.exp('1e30000'), 'INPUT_TOO_LONG'],
    ['sin of 1e1200 (too large to reduce)', () => E40.sin('1e1200'), 'INVALID_ARGUMENT'],
    ['exp of 1e7', () => E40.exp('1e7'), 'INVALID_ARGUMENT'],
    ['ln of 0', () => E40.ln('0'), 'NO_REAL_SOLUTION'],
    ['ln of −1', () => E40.ln('-1'), 'NO_REAL_SOLUTION'],
    ['sqrt of −2', () => E40.sqrt('-2'), 'NO_REAL_SOLUTION'],
    ['atan2(0, 0)', () => E40.atan2('0', '0'), 'INVALID_ARGUMENT'],
  ];
  for (const [what, f, code] of bad) {
    it(`throws ${code} for ${what}`, () => {
      expect(f).toThrow(QuadspreadError);
      try {
        f();
      } catch (e) {
        expect((e as QuadspreadError).code).toBe(code);
      }
    });
  }
});
