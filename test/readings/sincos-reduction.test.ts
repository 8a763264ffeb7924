// sinCosDegrees reduces an angle by the nearest whole number of quadrants, t = θ − 90°·k in
// [−45°, 45°]: an exact subtraction in every arithmetic (Sterbenz's lemma: |t| ≤ |θ|). These
// properties check what follows from an exact reduction: float results as accurate as the
// sine of the reduced angle (also for small negative angles, which a reduction into [0°, 360°)
// first would round at the scale of 360°), exact symmetries, and exact values in rational.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { float, rational, decimal, sinCosDegrees } from '../../src/index.js';

const D = decimal(40);
/** The exact value of the double x as decimal text, to 60 significant digits (truncated). */
const exactText = (x: number): string => {
  if (x === 0) return '0';
  let v = Math.abs(x);
  let k = 0;
  while (!Number.isInteger(v)) {
    v *= 2; // exact
    k++;
  }
  // |x| = v / 2^k = v·5^k / 10^k
  const digits = (BigInt(v) * 5n ** BigInt(k)).toString();
  const exponent = digits.length - 1 - k;
  return `${x < 0 ? '-' : ''}${digits[0]}.${digits.slice(1, 60) || '0'}e${exponent}`;
};
/** sin and cos of x degrees (the exact double) to 40 digits, as numbers. */
const reference = (x: number): { sin: number; cos: number } => {
  const r = sinCosDegrees(D, D.from(exactText(x)));
  return { sin: D.toNumber(r.sin), cos: D.toNumber(r.cos) };
};
/** |a − b| within `units` units in the last place of b (relative, so near zero as well). */
const close = (a: number, b: number, units: number): boolean =>
  Math.abs(a - b) <= units * Number.EPSILON * Math.abs(b) + Number.MIN_VALUE;

describe('sinCosDegrees: reduction by whole quadrants', () => {
  it('gives float sines and cosines within 4 units of the last place, negative angles included', () => {
    const angle = fc.oneof(
      fc.double({ min: -360, max: 360, noNaN: true }),
      fc.double({ min: -1e-3, max: 1e-3, noNaN: true }),
      fc
        .integer({ min: -8, max: 8 })
        .chain((k) => fc.double({ min: -1e-6, max: 1e-6, noNaN: true }).map((e) => k * 45 + e)),
    );
    fc.assert(
      fc.property(angle, (x) => {
        const f = sinCosDegrees(float, x);
        const r = reference(x);
        expect(close(f.sin, r.sin, 4)).toBe(true);
        expect(close(f.cos, r.cos, 4)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it('keeps the relative accuracy of small negative angles (no rounding at the scale of a turn)', () => {
    // Reduced into [0°, 360°) first, −1e-10° would become 359.9999999999° (rounded to 5.7e-14°):
    // a relative error of about 4e-4 in its sine.
    for (const x of [-1e-10, -1e-7, -0.1, -1e-300, -2.5e-5, -89.99999999999]) {
      const f = sinCosDegrees(float, x);
      const r = reference(x);
      expect(close(f.sin, r.sin, 4)).toBe(true);
      expect(close(f.cos, r.cos, 4)).toBe(true);
    }
  });

  it('is odd in sin and even in cos, bit for bit, within a turn', () => {
    fc.assert(
      fc.property(fc.double({ min: -359.9, max: 359.9, noNaN: true }), (x) => {
        const a = sinCosDegrees(float, x);
        const b = sinCosDegrees(float, -x);
        expect(b.sin).toBe(-a.sin);
        expect(b.cos).toBe(a.cos);
      }),
      { numRuns: 2000 },
    );
  });

  it('gives the same float values a turn apart where the reduction mod 360° is exact', () => {
    // θ and θ + 360° (θ ≥ 0, both exact doubles): the reduction of the second is exact too.
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 359 * 2 ** 20 }), (n) => {
        const x = n / 2 ** 20;
        const a = sinCosDegrees(float, x);
        const b = sinCosDegrees(float, x + 360);
        expect(b.sin).toBe(a.sin);
        expect(b.cos).toBe(a.cos);
      }),
      { numRuns: 1000 },
    );
  });

  it('is exact at the rational values in rational, and at multiples of 90° in every arithmetic', () => {
    const exact: Array<[number, string, string]> = [
      [-330, '1/2', undefined as never],
      [-210, '1/2', undefined as never],
      [-150, '-1/2', undefined as never],
      [-30, '-1/2', undefined as never],
      [30, '1/2', undefined as never],
      [150, '1/2', undefined as never],
      [210, '-1/2', undefined as never],
      [330, '-1/2', undefined as never],
    ];
    for (const [x, s] of exact) expect(rational.toString(sinCosDegrees(rational, x).sin)).toBe(s);
    for (const x of [-300, -240, -120, -60, 60, 120, 240, 300]) {
      const c = rational.toString(sinCosDegrees(rational, x).cos);
      expect(c).toBe(Math.abs(x) === 60 || Math.abs(x) === 300 ? '1/2' : '-1/2');
    }
    for (const A of [float, rational, decimal(20)] as const) {
      for (let k = -8; k <= 8; k++) {
        const r = sinCosDegrees(A as typeof float, 90 * k);
        const q = ((k % 4) + 4) % 4;
        expect(A.toNumber(r.sin as never) + 0).toBe([0, 1, 0, -1][q]);
        expect(A.toNumber(r.cos as never) + 0).toBe([1, 0, -1, 0][q]);
      }
    }
  });

  it('reduces exactly in decimal: a small negative angle keeps its digits', () => {
    const D20 = decimal(20);
    const x = D20.from('-0.0000123456789012345678');
    const r = sinCosDegrees(D20, x);
    const ref = sinCosDegrees(D, D.from('-0.0000123456789012345678'));
    // within a few units of the 20th digit of the reference
    const err = Math.abs(D20.toNumber(r.sin) - D.toNumber(ref.sin)) / Math.abs(D.toNumber(ref.sin));
    expect(err).toBeLessThan(1e-18);
  });
});
