import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  decimal,
  float,
  rational,
  heightFromSight,
  heightFromQuadrance,
  heightFromReading,
  heightFromTwoStations,
  heightFromBase,
  verticalFromAngle,
  QuadspreadError,
} from '../../src/index.js';

const R = rational;

describe('heightFromSight(A, { horizontalQuadrance, vertical })', () => {
  it('gives H and the signed height h = D·tan α (classical trig with Math.*, float)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 2000, noNaN: true }),
        fc.double({ min: 0.001, max: 80, noNaN: true }),
        fc.boolean(),
        (D, up, below) => {
          const alpha = below ? -up : up;
          const r = heightFromSight(float, {
            horizontalQuadrance: D * D,
            vertical: verticalFromAngle(float, alpha),
          });
          const h = D * Math.tan((alpha * Math.PI) / 180);
          expect(r.height as number).toBeCloseTo(h, 6 - Math.max(0, Math.log10(Math.abs(h) + 1)));
          expect(r.H).toBeCloseTo(h * h, 3);
          expect(r.sign).toBe(below ? -1 : 1);
        },
      ),
    );
  });

  it('is exact in rational: Q = 100, R = 9/25 gives H = 225/4 and h = 15/2 (a 6-8-10 sight: tan α = 3/4)', () => {
    const r = heightFromSight(R, { horizontalQuadrance: 100, vertical: '9/25' });
    expect(R.toString(r.H)).toBe('225/4');
    expect(r.height.toString()).toBe('15/2');
    expect(r.height.isRational()).toBe(true);
  });

  it('gives an irrational height as an exact surd: 30° below the horizon at 12 m is −4√3', () => {
    const r = heightFromSight(R, { horizontalQuadrance: 144, vertical: verticalFromAngle(R, -30) });
    expect(r.height.toString()).toBe('-4√3');
    expect(r.sign).toBe(-1);
  });

  it('agrees with the deprecated heightFromReading on H', () => {
    const D = decimal(30);
    const a = heightFromSight(D, { horizontalQuadrance: '1234.5', vertical: '0.3' });
    expect(D.toString(a.H)).toBe(
      D.toString(heightFromReading(D, { horizontal: '1234.5', vertical: '0.3' })),
    );
  });

  it('refuses an input without horizontalQuadrance, naming it', () => {
    expect(() => heightFromSight(R, { vertical: '1/2' } as never)).toThrow(/horizontalQuadrance/);
  });
});

describe('heightFromQuadrance(A, H, sign)', () => {
  it('is ±√H, exact in rational', () => {
    expect(heightFromQuadrance(R, 50).toString()).toBe('5√2');
    expect(heightFromQuadrance(R, '9/4', -1).toString()).toBe('-3/2');
    expect(heightFromQuadrance(float, 2)).toBe(Math.SQRT2);
  });

  it('refuses a negative H, a bad sign, and sign 0 with H ≠ 0', () => {
    expect(() => heightFromQuadrance(R, -1)).toThrow(QuadspreadError);
    expect(() => heightFromQuadrance(R, 1, 2 as never)).toThrow(/sign/);
    expect(() => heightFromQuadrance(R, 1, 0)).toThrow(/sign/);
    expect(heightFromQuadrance(R, 0, 0).toString()).toBe('0');
  });
});

describe('the two-station and base height functions also give the height', () => {
  it('heightFromTwoStations: h = √H of the mean, signed (the published example: H = 25, h = 5)', () => {
    const r = heightFromTwoStations(R, {
      stations: [
        { x: 0, y: 0 },
        { x: 10, y: 0 },
      ],
      foot: { x: 4, y: 3 },
      vertical: ['1/2', '25/70'],
    });
    expect(R.toString(r.H)).toBe('25');
    expect(r.height.toString()).toBe('5');
  });

  it('heightFromBase: horizontalQuadrances and verticalQuadrances name what horizontal and heights held; height = √H', () => {
    const r = heightFromBase(R, {
      base: 196,
      angles: ['53.13010235415598', '59.48976259388377'],
      vertical: ['1/2', undefined],
    });
    expect(r.horizontalQuadrances).toEqual(r.horizontal);
    expect(r.verticalQuadrances).toEqual(r.heights);
    // h² = H, to the tolerance the transcendental angles carry
    const h = r.height.toNumber();
    expect(Math.abs(h * h - r.H.toNumber())).toBeLessThan(1e-9 * r.H.toNumber());
  });
});
