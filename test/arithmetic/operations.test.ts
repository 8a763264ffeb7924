import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import Big from 'big.js';
import { create, all } from 'mathjs';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Decimal } from '../../src/index.js';

/** Decimal text (plain or exponent form) as an exact Fraction — independent of the code under test. */
function exact(t: string): Fraction {
  const [m, e] = t.split('e');
  const f = new Fraction(m!);
  const p = Number(e ?? 0);
  return p >= 0 ? f.mul(new Fraction(10n ** BigInt(p))) : f.div(new Fraction(10n ** BigInt(-p)));
}

/** Half a unit in the last of `digits` significant places of a nonzero Fraction v. */
function halfUlp(v: Fraction, digits: number): Fraction {
  const a = v.abs();
  let e = 0;
  while (
    a.compare(
      new Fraction(10n ** BigInt(Math.max(e + 1, 0)), 10n ** BigInt(Math.max(-(e + 1), 0))),
    ) >= 0
  )
    e++;
  while (a.compare(new Fraction(10n ** BigInt(Math.max(e, 0)), 10n ** BigInt(Math.max(-e, 0)))) < 0)
    e--;
  const k = e - digits + 1;
  return new Fraction(10n ** BigInt(Math.max(k, 0)), 2n * 10n ** BigInt(Math.max(-k, 0)));
}

const digitsText = fc
  .tuple(fc.bigInt({ min: 1n, max: 10n ** 30n }), fc.integer({ min: -20, max: 20 }))
  .map(([n, k]) => `${n}e${k}`);

describe('decimal(digits)', () => {
  it('decimal(30) gives 1/3 to 30 significant digits while decimal(10) in the same process gives 10', () => {
    const D30 = decimal(30);
    const D10 = decimal(10);
    const a = D30.toString(D30.div(D30.one, D30.from(3)));
    const b = D10.toString(D10.div(D10.one, D10.from(3)));
    const c = D30.toString(D30.div(D30.one, D30.from(3)));
    expect(a).toBe(`0.${'3'.repeat(30)}`);
    expect(b).toBe(`0.${'3'.repeat(10)}`);
    expect(c).toBe(a);
  });

  it("leaves big.js's own global settings untouched", () => {
    decimal(50).div(decimal(50).one, decimal(50).from(7));
    expect(Big.DP).toBe(20);
    expect(Big.RM).toBe(1);
  });

  it('rounds to significant digits, not decimal places', () => {
    const D = decimal(4);
    expect(D.toString(D.from('123456'))).toBe('123500');
    expect(D.toString(D.from('0.000123456'))).toBe('0.0001235');
    const D5 = decimal(5);
    // 1.0001² = 1.00020001 → 1.0002 at five significant digits
    expect(D5.toString(D5.mul(D5.from('1.0001'), D5.from('1.0001')))).toBe('1.0002');
  });

  it('rounds ties to even', () => {
    const D = decimal(3);
    expect(D.toString(D.from('1.125'))).toBe('1.12');
    expect(D.toString(D.from('1.135'))).toBe('1.14');
    expect(D.toString(D.from('-1.125'))).toBe('-1.12');
  });

  it.each([5, 17, 34, 60])(
    'div(a, b) in decimal(%i) is correctly rounded (within half an ulp of the exact quotient)',
    (digits) => {
      const D = decimal(digits);
      fc.assert(
        fc.property(digitsText, digitsText, (x, y) => {
          const a = D.from(x),
            b = D.from(y);
          const q = exact(D.toString(D.div(a, b)));
          const truth = exact(D.toString(a)).div(exact(D.toString(b)));
          expect(q.sub(truth).abs().compare(halfUlp(truth, digits))).toBeLessThanOrEqual(0);
        }),
        { numRuns: 200 },
      );
    },
  );

  it.each([5, 17, 34, 60])(
    'sqrt(a) in decimal(%i) is correctly rounded (r brackets √a within half an ulp)',
    (digits) => {
      const D = decimal(digits);
      fc.assert(
        fc.property(digitsText, (x) => {
          const a = D.from(x);
          const r = exact(D.toString(D.sqrt(a) as Decimal));
          const h = halfUlp(r, digits);
          const A = exact(D.toString(a));
          // √a lies in [r − h, r + h]  ⇔  (r − h)² ≤ a ≤ (r + h)²
          expect(r.sub(h).mul(r.sub(h)).compare(A)).toBeLessThanOrEqual(0);
          expect(r.add(h).mul(r.add(h)).compare(A)).toBeGreaterThanOrEqual(0);
        }),
        { numRuns: 200 },
      );
    },
  );

  it('agrees with mathjs BigNumber (an independent decimal library) on √2 and 22/7 to 50 digits', () => {
    const m = create(all!, { number: 'BigNumber', precision: 80 });
    const D = decimal(50);
    const sqrt2 = m.bignumber(2).sqrt().toSignificantDigits(50).toString();
    expect(D.toString(D.sqrt(D.from(2)) as Decimal)).toBe(sqrt2);
    const q = m.bignumber(22).div(7).toSignificantDigits(50).toString();
    expect(D.toString(D.div(D.from(22), D.from(7)))).toBe(q);
  });

  it('refuses digits that are not an integer in 1..1000', () => {
    for (const d of [0, -1, 1.5, 1001, NaN]) {
      expect(() => decimal(d)).toThrow(/INVALID_ARGUMENT/);
    }
  });
});

describe('rational', () => {
  it('writes n/d or an integer', () => {
    expect(rational.toString(rational.from('0.3'))).toBe('3/10');
    expect(rational.toString(rational.from('50/2'))).toBe('25');
    expect(rational.toString(rational.from('-3.5'))).toBe('-7/2');
  });
  it('0.1 + 0.2 is exactly 3/10', () => {
    expect(rational.toString(rational.add(rational.from('0.1'), rational.from(0.2)))).toBe('3/10');
  });
  it('sqrt is exact for squares of rationals and undefined otherwise', () => {
    expect(rational.toString(rational.sqrt(rational.from('9/4'))!)).toBe('3/2');
    expect(rational.toString(rational.sqrt(rational.from('0.0001'))!)).toBe('1/100');
    expect(rational.sqrt(rational.from(2))).toBeUndefined();
    expect(rational.sqrt(rational.from('4/3'))).toBeUndefined();
    expect(rational.toString(rational.sqrt(rational.from((10n ** 40n + 1n) ** 2n))!)).toBe(
      String(10n ** 40n + 1n),
    );
  });
  it("toNumber is correctly rounded (JavaScript's own decimal parsing as the reference)", () => {
    fc.assert(
      fc.property(
        fc.bigInt({ min: 1n, max: 10n ** 40n }),
        fc.integer({ min: -330, max: 290 }),
        (n, k) => {
          const t = `${n}e${k}`;
          const want = Number(t);
          if (Number.isFinite(want)) expect(rational.toNumber(rational.from(t))).toBe(want);
          else expect(() => rational.toNumber(rational.from(t))).toThrow(/NOT_FINITE/);
        },
      ),
      { numRuns: 500 },
    );
  });
  it('toNumber refuses values beyond the range of a JS number', () => {
    expect(() => rational.toNumber(rational.from('1e400'))).toThrow(/NOT_FINITE/);
  });
});

describe('toPrecision(a, digits)', () => {
  const A3: Array<[string, Arithmetic<any>]> = [
    ['rational', rational],
    ['decimal(40)', decimal(40)],
    ['float', float],
  ];
  it.each(A3)('%s rounds half away from zero and carries into a new digit', (_n, A) => {
    expect(A.toPrecision(A.from('2/3'), 5)).toBe('0.66667');
    expect(A.toPrecision(A.from('0.125'), 2)).toBe('0.13');
    expect(A.toPrecision(A.from('-0.125'), 2)).toBe('-0.13');
    expect(A.toPrecision(A.from('9.996'), 3)).toBe('10.0');
    expect(A.toPrecision(A.from('123456'), 3)).toBe('123000');
    expect(A.toPrecision(A.from('1e25'), 3)).toBe('1.00e+25');
    expect(A.toPrecision(A.from('0'), 3)).toBe('0.00');
  });
  it('float shows the exact binary value: 0.1 is not one tenth', () => {
    expect(float.toPrecision(0.1, 20)).toBe('0.10000000000000000555');
  });
  it('refuses digits out of range', () => {
    expect(() => rational.toPrecision(rational.one, 0)).toThrow(/INVALID_ARGUMENT/);
  });
});

const all3: Array<[string, Arithmetic<any>]> = [
  ['rational', rational],
  ['decimal(20)', decimal(20)],
  ['float', float],
];

describe.each(all3)('%s refuses what has no value', (_n, A) => {
  it('div(a, 0) throws DIVISION_BY_ZERO', () => {
    expect(() => A.div(A.one, A.zero)).toThrow(QuadspreadError);
    try {
      A.div(A.one, A.zero);
    } catch (e) {
      expect((e as QuadspreadError).code).toBe('DIVISION_BY_ZERO');
    }
  });
  it('sqrt of a negative number throws NO_REAL_SOLUTION', () => {
    expect(() => A.sqrt(A.from(-4))).toThrow(/NO_REAL_SOLUTION/);
  });
  it('atan2(0, 0) throws INVALID_ARGUMENT', () => {
    expect(() => A.atan2(A.zero, A.zero)).toThrow(/INVALID_ARGUMENT/);
  });
  it('compares, signs and tests for zero', () => {
    const a = A.from('-3/2'),
      b = A.from('1/4');
    expect(A.cmp(a, b)).toBe(-1);
    expect(A.cmp(b, a)).toBe(1);
    expect(A.cmp(a, A.from('-1.5'))).toBe(0);
    expect(A.sign(a)).toBe(-1);
    expect(A.sign(A.zero)).toBe(0);
    expect(A.isZero(A.sub(b, b))).toBe(true);
    expect(A.toNumber(A.abs(a))).toBe(1.5);
    expect(A.is(a)).toBe(true);
    expect(A.is('1')).toBe(false);
  });
});

describe('float', () => {
  it('div and sqrt refuse a result that is not finite, and an operand that is not', () => {
    expect(() => float.div(Infinity, Infinity)).toThrow(/INVALID_NUMBER/);
    expect(() => float.div(1, float.mul(1e-200, 1e-200))).toThrow(/DIVISION_BY_ZERO/);
    expect(() => float.div(1e300, 1e-300)).toThrow(/NOT_FINITE/);
    expect(() => float.sqrt(Infinity)).toThrow(/INVALID_NUMBER/);
  });
  it('refuses to let an overflow out as Infinity', () => {
    // 1e200 · 1e200 = 1e400 > 1.8e308, the largest double (IEEE 754 binary64).
    expect(() => float.mul(1e200, 1e200)).toThrow(/NOT_FINITE/);
    expect(() => float.add(1.7e308, 1.7e308)).toThrow(/NOT_FINITE/);
    expect(() => float.toNumber(Infinity)).toThrow(/NOT_FINITE/);
    expect(() => float.toString(-Infinity)).toThrow(/NOT_FINITE/);
  });

  it("refuses operands that are not finite numbers: add('0.1', '0.2') is no '0.10.2'", () => {
    for (const [a, b] of [
      ['0.1', '0.2'],
      [null, 1],
      [1, NaN],
      [Infinity, 1],
      [{}, 1],
    ] as [unknown, unknown][]) {
      for (const op of ['add', 'sub', 'mul', 'div', 'cmp', 'eq', 'atan2'] as const)
        expect(() => (float[op] as (x: unknown, y: unknown) => unknown)(a, b), `${op}`).toThrow(
          /INVALID_NUMBER/,
        );
    }
    expect(() => float.sin('abc' as never)).toThrow(/INVALID_NUMBER/);
    expect(() => float.sqrt('4' as never)).toThrow(/INVALID_NUMBER/);
  });
});

describe('QuadspreadError', () => {
  it('has a stable code, a name and a message naming where and what', () => {
    try {
      rational.from('12..5');
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      expect(e).toBeInstanceOf(Error);
      const q = e as QuadspreadError;
      expect(q.name).toBe('QuadspreadError');
      expect(q.code).toBe('INVALID_NUMBER');
      expect(q.where).toBe('rational.from(x)');
      expect(q.message).toBe(
        'quadspread INVALID_NUMBER: rational.from(x): "12..5" is not a number',
      );
    }
  });
  it('is matched by instanceof through its brand, as a copy from another entry would be', () => {
    const foreign = Object.assign(new Error('x'), { [Symbol.for('quadspread.error')]: true });
    expect(foreign).toBeInstanceOf(QuadspreadError);
    expect(new Error('y')).not.toBeInstanceOf(QuadspreadError);
  });
});

describe('the arithmetic objects', () => {
  it('are frozen, so no caller can change an operation for every other caller', () => {
    expect(Object.isFrozen(rational)).toBe(true);
    expect(Object.isFrozen(float)).toBe(true);
    expect(Object.isFrozen(decimal(12))).toBe(true);
    expect(() => {
      (float as { add: unknown }).add = () => 0;
    }).toThrow(TypeError);
  });
});

describe('rational and decimal operations take only their own values', () => {
  const R = rational;
  const D = decimal(20);
  const codeOf = (f: () => unknown): string => {
    try {
      f();
      return 'no error';
    } catch (e) {
      return e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
    }
  };
  const cases: [string, () => unknown][] = [
    ['rational.add of a JS number', () => R.add(R.one, 2 as never)],
    ['rational.sub with a JS number first', () => R.sub(3 as never, R.one)],
    ['rational.mul of a Big', () => R.mul(R.one, D.from('0.1') as never)],
    ['rational.isZero of a Big (would read as "not zero")', () => R.isZero(D.zero as never)],
    ['rational.eq of text', () => R.eq(R.one, '1' as never)],
    ['rational.toString of a number', () => R.toString(1 as never)],
    ['decimal.add of a fraction', () => D.add(D.one, R.from('1/3') as never)],
    ['decimal.cmp of a JS number', () => D.cmp(D.one, 1 as never)],
    ['decimal.sqrt of text', () => D.sqrt('4' as never)],
    ['decimal.sign of undefined', () => D.sign(undefined as never)],
  ];
  it.each(cases)('%s: INVALID_NUMBER, not a TypeError or a value of the wrong kind', (_n, f) => {
    expect(codeOf(f)).toBe('INVALID_NUMBER');
  });

  it('names the operation and the value', () => {
    expect(() => R.add(R.one, 2 as never)).toThrow(
      /^quadspread INVALID_NUMBER: rational\.add\(…\): 2 \(number\) is not a rational value/,
    );
  });

  it('a point of plain numbers in rational is refused by the geometry primitives (they take values)', async () => {
    const { quadrance, point } = await import('../../src/geometry/index.js');
    expect(codeOf(() => quadrance(R, { x: 0, y: 0 } as never, { x: 3, y: 4 } as never))).toBe(
      'INVALID_NUMBER',
    );
    expect(codeOf(() => quadrance(R, point(R, 0, 0), point(D, '0.1', 0) as never))).toBe(
      'INVALID_NUMBER',
    );
    expect(R.toString(quadrance(R, point(R, 0, 0), point(R, 3, 4)))).toBe('25');
  });

  it('a Big of another decimal(n) is read at its full value (the operations are exact, then round)', () => {
    const D30 = decimal(30);
    const third30 = D30.div(D30.one, D30.from(3)); // 0.333… (30 digits)
    // at 20 digits: 1 + 0.333…(30 digits) = 1.3333333333333333333 (20 digits), as from text
    expect(D.toString(D.add(D.one, third30))).toBe('1.3333333333333333333');
  });
});
