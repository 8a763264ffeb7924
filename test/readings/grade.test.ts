// gradeFromSpread: the percent grade of a spread, exact surd in rational.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import { gradeFromSpread } from '../../src/readings/grade.js';
import { spreadFromGrade } from '../../src/readings/slope.js';

describe('gradeFromSpread(A, s) is 100·tan of the angle of spread s', () => {
  it('rational: spread 9/25 (a 3-4-5 slope) is exactly 75 %, 1/2 is 100 %, 1/3 is 50√2 %', () => {
    expect(gradeFromSpread(rational, '9/25').toString()).toBe('75');
    expect(gradeFromSpread(rational, '1/2').toString()).toBe('100');
    expect(gradeFromSpread(rational, '1/3').toString()).toBe('50√2');
  });
  it('inverts spreadFromGrade exactly in rational on random rational grades', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e6 }), fc.integer({ min: 1, max: 1000 }), (n, m) => {
        const p = rational.from(`${n}/${m}`);
        const g = gradeFromSpread(rational, spreadFromGrade(rational, p));
        expect(g.isRational()).toBe(true);
        expect(rational.eq(g.toRational()!, p)).toBe(true);
      }),
    );
  });
  it('float and decimal agree with 100·tan(asin(√s)) (Math.tan, Math.asin) to 1e-12 relative', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.999, noNaN: true }), (s) => {
        const want = 100 * Math.tan(Math.asin(Math.sqrt(s)));
        expect(Math.abs(gradeFromSpread(float, s) / want - 1)).toBeLessThan(1e-12);
        const D = decimal(30);
        expect(Math.abs(D.toNumber(gradeFromSpread(D, s)) / want - 1)).toBeLessThan(1e-12);
      }),
    );
  });
  it('refuses a vertical spread and spreads outside [0, 1]', () => {
    expect(() => gradeFromSpread(rational, 1)).toThrow(
      expect.objectContaining({ code: 'VERTICAL_SIGHT' }),
    );
    expect(() => gradeFromSpread(float, -0.1)).toThrow(QuadspreadError);
  });
});
