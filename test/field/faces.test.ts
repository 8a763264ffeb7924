// meanFaces: face left and face right generated from a known direction, zenith angle,
// collimation and index error (the instrument-error model of Ghilani & Wolf, Elementary
// Surveying, ch. 8 — from memory: a face-left reading is off by c/sin z, face right by −c/sin z,
// both zenith readings by +i), then recovered.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { code, kinds } from '../geometry/helpers.js';
import { rational, float, meanFaces } from '../../src/index.js';

const R = rational;

describe('meanFaces recovers known collimation and index errors', () => {
  it('exactly in rational at z = 90° (whole arc-seconds, any direction, across 0°)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 360 * 3600 - 1 }),
        fc.integer({ min: -120, max: 120 }),
        fc.integer({ min: -120, max: 120 }),
        (theta, c, i) => {
          const deg = (sec: number) => R.div(R.from(sec), R.from(3600));
          const cL = R.from((((theta + c) % 1296000) + 1296000) % 1296000);
          const cR = R.from((theta + 648000 - c + 1296000) % 1296000);
          const m = meanFaces(
            R,
            { circle: R.div(cL, R.from(3600)), zenith: R.add(R.from(90), deg(i)) },
            { circle: R.div(cR, R.from(3600)), zenith: R.add(R.from(270), deg(i)) },
          );
          expect(R.toString(m.collimation)).toBe(String(c));
          expect(R.toString(m.index)).toBe(String(i));
          expect(R.toString(m.zenith)).toBe('90');
          expect(R.eq(m.circle, deg(theta))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('in float at any zenith angle with no trunnion tilt (to 1e-6″), from Math.sin', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.99, noNaN: true }),
        fc.double({ min: 45, max: 135, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        (theta, z, c, i) => {
          const off = c / 3600 / Math.sin((z * Math.PI) / 180);
          const m = meanFaces(
            float,
            { circle: (theta + off + 360) % 360, zenith: z + i / 3600 },
            { circle: (theta + 180 - off + 360) % 360, zenith: 360 - z + i / 3600 },
          );
          expect(Math.abs(m.collimation - c)).toBeLessThan(1e-6);
          expect(Math.abs(m.index - i)).toBeLessThan(1e-6);
          expect(Math.abs(m.zenith - z)).toBeLessThan(1e-9);
          const d = Math.abs(m.circle - theta);
          expect(Math.min(d, 360 - d)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe.each(kinds)('meanFaces(%s, left, right, options)', (_n, A) => {
  it('averages a pair that straddles 0°: 359°59′50″ and 180°00′10″ mean 0° with c = −10″', () => {
    // face left 359°59'50", face right 180°00'10": cL − cR + 180° = −20″, so c = −10″ and the mean is 0°.
    const m = meanFaces(
      A,
      { circle: `359°59'50"`, zenith: 90 },
      { circle: `180°00'10"`, zenith: 270 },
    );
    expect(A.toNumber(m.collimation)).toBeCloseTo(-10, 9);
    const c = A.toNumber(m.circle);
    expect(Math.min(c, 360 - c)).toBeLessThan(1e-9);
  });

  it('checks stated tolerances', () => {
    const m = meanFaces(
      A,
      { circle: `10°00'30"`, zenith: `89°59'00"` },
      { circle: `190°00'00"`, zenith: `270°00'00"` },
      { collimation: 10, index: 60 },
    );
    expect(m.checks.map((k) => [k.quantity, k.ok])).toEqual([
      ['collimation', false],
      ['index', true],
    ]);
    expect(m.ok).toBe(false);
    expect(A.toNumber(m.index)).toBeCloseTo(-30, 9);
  });

  it('refuses zenith angles on the wrong face, outside (0°, 360°), a missing circle and a negative tolerance', () => {
    expect(code(() => meanFaces(A, { circle: 0, zenith: 270 }, { circle: 180, zenith: 90 }))).toBe(
      'INVALID_ANGLE',
    );
    expect(code(() => meanFaces(A, { circle: 0, zenith: 0 }, { circle: 180, zenith: 270 }))).toBe(
      'INVALID_ANGLE',
    );
    expect(code(() => meanFaces(A, { circle: 0, zenith: 90 }, { circle: 180, zenith: 360 }))).toBe(
      'INVALID_ANGLE',
    );
    expect(code(() => meanFaces(A, { zenith: 90 } as never, { circle: 180, zenith: 270 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      code(() =>
        meanFaces(A, { circle: 0, zenith: 90 }, { circle: 180, zenith: 270 }, { index: -1 }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});
