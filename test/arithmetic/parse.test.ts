// Reading numbers: one table of inputs run against every arithmetic.
// Expected exact values are written by hand from the decimal definitions of the inputs
// (e.g. 1.5e-3 = 15/10000 = 3/2000); they are not produced by the code under test.
import { describe, expect, it } from 'vitest';
import Fraction from 'fraction.js';
import {
  rational,
  decimal,
  float,
  QuadspreadError,
  MAX_INPUT_LENGTH,
  readRatio,
} from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';

interface Case {
  input: unknown;
  /** exact value as "n/d" or an integer, written by hand */
  exact?: string;
  /** expected error code */
  error?: string;
}

const cases: Case[] = [
  { input: '0', exact: '0' },
  { input: '-0', exact: '0' },
  { input: '25', exact: '25' },
  { input: '+25', exact: '25' },
  { input: '-7/2', exact: '-7/2' },
  { input: '3/10', exact: '3/10' },
  { input: '6/-4', error: 'INVALID_NUMBER' },
  { input: '0.1', exact: '1/10' },
  { input: '.5', exact: '1/2' },
  { input: '5.', exact: '5' },
  { input: '  12.50  ', exact: '25/2' },
  { input: '1.5e-3', exact: '3/2000' },
  { input: '1.5E3', exact: '1500' },
  { input: '-2.5e+2', exact: '-250' },
  { input: '0.1/0.3', exact: '1/3' },
  { input: '1e-20', exact: '1/100000000000000000000' },
  { input: 0.1, exact: '1/10' },
  { input: 0.2, exact: '1/5' },
  { input: -1.25, exact: '-5/4' },
  { input: 1e21, exact: '1000000000000000000000' },
  { input: 5e-7, exact: '1/2000000' },
  { input: 123456789012345, exact: '123456789012345' },
  { input: 12n, exact: '12' },
  { input: -(10n ** 30n), exact: '-1000000000000000000000000000000' },
  { input: '', error: 'INVALID_NUMBER' },
  { input: '   ', error: 'INVALID_NUMBER' },
  { input: 'abc', error: 'INVALID_NUMBER' },
  { input: '1,5', error: 'INVALID_NUMBER' },
  { input: '0x10', error: 'INVALID_NUMBER' },
  { input: '1e', error: 'INVALID_NUMBER' },
  { input: 'e5', error: 'INVALID_NUMBER' },
  { input: '.', error: 'INVALID_NUMBER' },
  { input: '1/', error: 'INVALID_NUMBER' },
  { input: '/2', error: 'INVALID_NUMBER' },
  { input: '1/2/3', error: 'INVALID_NUMBER' },
  { input: 'NaN', error: 'INVALID_NUMBER' },
  { input: 'Infinity', error: 'INVALID_NUMBER' },
  { input: '1/0', error: 'DIVISION_BY_ZERO' },
  { input: '1e1001', error: 'INPUT_TOO_LONG' },
  { input: '1e-99999999999999999999', error: 'INPUT_TOO_LONG' },
  { input: NaN, error: 'INVALID_NUMBER' },
  { input: Infinity, error: 'INVALID_NUMBER' },
  { input: -Infinity, error: 'INVALID_NUMBER' },
  { input: null, error: 'INVALID_NUMBER' },
  { input: undefined, error: 'INVALID_NUMBER' },
  { input: {}, error: 'INVALID_NUMBER' },
  { input: [1, 2], error: 'INVALID_NUMBER' },
  { input: true, error: 'INVALID_NUMBER' },
];

const arithmetics: Array<[string, Arithmetic<any>]> = [
  ['rational', rational],
  ['decimal(34)', decimal(34)],
  ['decimal(8)', decimal(8)],
  ['float', float],
];

/** The exact value of a value of arithmetic A, as a Fraction, read from its text. */
function exactOf(A: Arithmetic<any>, v: unknown): Fraction {
  if (A === float) {
    // exact binary value of the double
    const x = v as number;
    let k = 0n;
    let m = x;
    while (!Number.isInteger(m)) {
      m *= 2;
      k++;
    }
    return new Fraction(BigInt(m), 1n << k);
  }
  return exactOfText(A.toString(v));
}

/** Decimal text, possibly in exponent form (big.js writes 1e-20), as an exact Fraction. */
function exactOfText(t: string): Fraction {
  const [m, e] = t.split('e');
  const f = new Fraction(m!);
  const p = Number(e ?? 0);
  return p >= 0 ? f.mul(new Fraction(10n ** BigInt(p))) : f.div(new Fraction(10n ** BigInt(-p)));
}

describe.each(arithmetics)('%s.from(x)', (_name, A) => {
  it.each(cases)('reads $input', ({ input, exact, error }) => {
    if (error) {
      let caught: unknown;
      try {
        A.from(input as never);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(QuadspreadError);
      expect((caught as QuadspreadError).code).toBe(error);
      expect((caught as QuadspreadError).message).toContain('from(x)');
      return;
    }
    const v = A.from(input as never);
    const want = new Fraction(exact!);
    const got = exactOf(A, v);
    if (A.exact) {
      expect(got.toFraction()).toBe(want.toFraction());
    } else {
      // Correct rounding: the error is within half a unit in the last place. For decimal(d)
      // that is 5·10^-d relative to the value; for float, 2^-53 relative.
      const rel =
        A === float
          ? new Fraction(1n, 2n ** 53n)
          : new Fraction(5n, 10n ** BigInt((A as unknown as { digits: number }).digits));
      const err = got.sub(want).abs();
      expect(err.compare(want.abs().mul(rel))).toBeLessThanOrEqual(0);
    }
  });

  it('returns a value of its own arithmetic unchanged in value', () => {
    const v = A.from('7/8');
    expect(A.eq(A.from(v), v)).toBe(true);
  });

  it(`refuses text longer than ${MAX_INPUT_LENGTH} characters at once`, () => {
    const huge = '1'.repeat(1_000_000);
    expect(() => A.from(huge)).toThrow(/INPUT_TOO_LONG/);
    expect(() => A.from('9'.repeat(MAX_INPUT_LENGTH + 1))).toThrow(/INPUT_TOO_LONG/);
  });

  it('names the input in its error message', () => {
    expect(() => A.from('12x4')).toThrow(/"12x4" is not a number/);
  });
});

describe('float.from(x)', () => {
  it('reads decimal text exactly as JavaScript rounds it', () => {
    for (const t of ['0.1', '2.675', '1e-300', '123456.789e3', '9007199254740993']) {
      expect(float.from(t)).toBe(Number(t));
    }
  });
  it('reads a/b as the double nearest to the exact ratio', () => {
    expect(float.from('1/3')).toBe(1 / 3);
    // 0.1/0.3 is exactly 1/3, so the nearest double is 1/3 — not 0.1 / 0.3 in floats.
    expect(float.from('0.1/0.3')).toBe(1 / 3);
    expect(0.1 / 0.3).not.toBe(1 / 3);
  });
  it('refuses text whose value overflows a double', () => {
    expect(() => float.from('1e400')).toThrow(/NOT_FINITE/);
  });
});

describe('decimal.from(x)', () => {
  it('rounds a value of another decimal instance to its own digits', () => {
    const D30 = decimal(30);
    const D5 = decimal(5);
    const third = D30.div(D30.one, D30.from(3));
    expect(D5.toString(D5.from(third))).toBe('0.33333');
  });
  it('does not take a value of another decimal instance for its own', () => {
    const D40 = decimal(40);
    const D10 = decimal(10);
    const x = D40.div(D40.one, D40.from(7));
    expect(D10.is(x)).toBe(false);
    expect(D40.is(x)).toBe(true);
    const y = D10.from(x);
    expect(D10.is(y)).toBe(true);
    expect(D10.toString(y)).toBe('0.1428571429');
  });
  it('refuses a value of another arithmetic', () => {
    expect(() => decimal(10).from(rational.from(1) as never)).toThrow(QuadspreadError);
    expect(() => rational.from(decimal(10).one as never)).toThrow(QuadspreadError);
  });
});

describe('readRatio', () => {
  it('reads decimal text exactly (1.5e-3 = 15/10000)', () => {
    const r = readRatio('1.5e-3', 'test');
    expect(`${r.n}/${r.d}`).toBe('15/10000');
  });
  it.each([[undefined], [null], [12], [{}]])(
    'refuses %s, which is not text, with INVALID_NUMBER',
    (x) => {
      let c = 'no error';
      try {
        readRatio(x as never, 'test');
      } catch (e) {
        c = e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
      }
      expect(c).toBe('INVALID_NUMBER');
    },
  );
});
