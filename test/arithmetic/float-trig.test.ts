// The float sine and cosine (src/arithmetic/float-trig.ts) against two independent references:
// the engine's Math.sin and Math.cos (V8's are FDLIBM's, whose kernels float-trig.ts writes
// out, so they must agree bit for bit below π/4), and decimal.js at 40 digits (the kernels are
// within one unit in the last place of the true value, FDLIBM's stated bound for sin and cos).
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import {
  KERNEL_LIMIT,
  floatCos,
  floatSin,
  floatSinCosInto,
  sinCosQuadrantInto,
} from '../../src/arithmetic/float-trig.js';
import { float } from '../../src/arithmetic/float.js';
import { exactDecimal } from '../exact-decimal.js';

const D40 = Decimal.clone({ precision: 40 });

/** Distance in units in the last place between two doubles of one sign. */
function ulps(a: number, b: number): number {
  const view = new DataView(new ArrayBuffer(16));
  view.setFloat64(0, Math.abs(a));
  view.setFloat64(8, Math.abs(b));
  const d = view.getBigInt64(0) - view.getBigInt64(8);
  return Math.abs(Number(d)) + (Math.sign(a) * Math.sign(b) < 0 ? Infinity : 0);
}

// Angles below the limit: uniform, near each of FDLIBM's thresholds (2⁻²⁷, 0.3, 0.78125 and
// the limit itself, as the high words 0x3e400000, 0x3fd33333, 0x3fe90001, 0x3fe921fc), and tiny.
const thresholds = [
  2 ** -27,
  (1 + 0x33333 / 2 ** 20) / 4,
  (1 + 0x90001 / 2 ** 20) / 2,
  KERNEL_LIMIT,
];
const below = fc
  .oneof(
    fc.double({ min: -KERNEL_LIMIT, max: KERNEL_LIMIT, noNaN: true }),
    fc
      .tuple(fc.constantFrom(...thresholds), fc.integer({ min: -4000, max: 4000 }), fc.boolean())
      .map(([t, k, neg]) => (neg ? -1 : 1) * (t + k * Number.EPSILON * t)),
    fc.double({ min: -1e-6, max: 1e-6, noNaN: true }),
  )
  .filter((x) => x > -KERNEL_LIMIT && x < KERNEL_LIMIT);

describe('the kernels (FDLIBM 5.3, k_sin.c and k_cos.c), as floatSin and floatCos below the limit', () => {
  it('are Math.sin and Math.cos bit for bit below the limit (V8: FDLIBM), signed zero too', () => {
    fc.assert(
      fc.property(below, (x) => {
        expect(Object.is(floatSin(x), Math.sin(x))).toBe(true);
        expect(Object.is(floatCos(x), Math.cos(x))).toBe(true);
      }),
      { numRuns: 100000 },
    );
    expect(Object.is(floatSin(-0), -0)).toBe(true);
    expect(floatCos(-0)).toBe(1);
  });
  it('are within one unit in the last place of decimal.js at 40 digits', () => {
    fc.assert(
      fc.property(below, (x) => {
        const t = exactDecimal(x);
        const s = new D40(t).sin().toNumber();
        const c = new D40(t).cos().toNumber();
        expect(ulps(floatSin(x), s)).toBeLessThanOrEqual(1);
        expect(ulps(floatCos(x), c)).toBeLessThanOrEqual(1);
      }),
      { numRuns: 1000 },
    );
  });
  it('the limit is the double whose high word is 0x3fe921fc, just past π/4', () => {
    const view = new DataView(new ArrayBuffer(8));
    view.setUint32(0, 0x3fe921fc);
    expect(KERNEL_LIMIT).toBe(view.getFloat64(0));
    expect(KERNEL_LIMIT).toBeGreaterThan(Math.PI / 4);
  });
  it('sinCosQuadrantInto is both kernels turned by whole quadrants (sin(t + 90°) = cos t)', () => {
    const out = new Float64Array(3);
    fc.assert(
      fc.property(
        below,
        fc.integer({ min: -8, max: 8 }),
        fc.integer({ min: 0, max: 1 }),
        (t, k, at) => {
          sinCosQuadrantInto(t, k, out, at);
          // the rotation by quarter turns, read from the angle sums (common practice)
          const s = floatSin(t);
          const c = floatCos(t);
          const q = ((k % 4) + 4) % 4;
          const want = [
            [s, c],
            [c, -s],
            [-s, -c],
            [-c, s],
          ][q]!;
          expect(Object.is(out[at], want[0])).toBe(true);
          expect(Object.is(out[at + 1], want[1])).toBe(true);
        },
      ),
      { numRuns: 20000 },
    );
  });
});

describe('float.sin and float.cos: the float arithmetic sine and cosine', () => {
  it('are Math.sin and Math.cos bit for bit on either side of the limit (V8: FDLIBM), as is floatSinCosInto', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (x) => {
        expect(Object.is(float.sin(x), Math.sin(x))).toBe(true);
        expect(Object.is(float.cos(x), Math.cos(x))).toBe(true);
        const out = new Float64Array(2);
        floatSinCosInto(x, out, 0);
        expect(Object.is(out[0], Math.sin(x)) && Object.is(out[1], Math.cos(x))).toBe(true);
      }),
      { numRuns: 20000 },
    );
  });
});
