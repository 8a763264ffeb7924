import { describe, expect, it } from 'vitest';
import {
  decimal,
  float,
  rational,
  uncertain,
  RATIONAL_TRANSCENDENTAL_DIGITS,
  QuadspreadError,
} from '../../src/index.js';

describe('what generic code may ask an arithmetic', () => {
  it('digits: n for decimal(n), the transcendental digits for rational, 15 for float, the base’s for uncertain', () => {
    expect(decimal(20).digits).toBe(20);
    expect(rational.digits).toBe(RATIONAL_TRANSCENDENTAL_DIGITS);
    expect(float.digits).toBe(15);
    expect(uncertain(decimal(25)).digits).toBe(25);
    expect(uncertain(float).digits).toBe(15);
  });

  it('decimal(n).withDigits(m) is a decimal(m): 1/3 to m digits', () => {
    const D = decimal(10).withDigits!(30);
    expect(D.digits).toBe(30);
    expect(D.toString(D.div(D.one, D.from(3)))).toBe('0.' + '3'.repeat(30));
  });

  it('rational, float and uncertain have no withDigits (no precision setting)', () => {
    expect(rational.withDigits).toBeUndefined();
    expect(float.withDigits).toBeUndefined();
    expect(uncertain(decimal(20)).withDigits).toBeUndefined();
  });

  it('rational.ratio(x) is x as integers n/d in lowest terms with d > 0, the sign on n', () => {
    expect(rational.ratio!(rational.from('-6/4'))).toEqual({ n: -3n, d: 2n });
    expect(rational.ratio!(rational.from('0.125'))).toEqual({ n: 1n, d: 8n });
    expect(rational.ratio!(rational.zero)).toEqual({ n: 0n, d: 1n });
  });

  it('rational.ratio refuses a value that is not a fraction', () => {
    expect(() => rational.ratio!(0.5 as never)).toThrow(QuadspreadError);
  });

  it('float64 is true for float only', () => {
    expect(float.float64).toBe(true);
    expect(rational.float64).toBeUndefined();
    expect(decimal(34).float64).toBeUndefined();
    expect(uncertain(float).float64).toBeUndefined();
  });
});
