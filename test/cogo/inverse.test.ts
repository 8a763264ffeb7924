import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import {
  rational,
  float,
  inverse,
  forward,
  azimuthToQuadrant,
  bearingToAzimuth,
  rootToNumber,
} from '../../src/index.js';

describe.each(kinds)(
  'inverse(%s, P, Q) (x = east, y = north, azimuth clockwise from north)',
  (_name, A) => {
    it.each([
      [{ x: 0, y: 1 }, 0, 'N 0°00\'00.0" E'],
      [{ x: 1, y: 1 }, 45, 'N 45°00\'00.0" E'],
      [{ x: 1, y: 0 }, 90, 'N 90°00\'00.0" E'],
      [{ x: 2, y: -2 }, 135, 'S 45°00\'00.0" E'],
      [{ x: 0, y: -3 }, 180, 'S 0°00\'00.0" E'],
      [{ x: -1, y: -1 }, 225, 'S 45°00\'00.0" W'],
      [{ x: -5, y: 0 }, 270, 'S 90°00\'00.0" W'],
      [{ x: -1, y: 1 }, 315, 'N 45°00\'00.0" W'],
    ])('gives azimuth exactly %s → %s° (%s) on axes and diagonals', (Q, az, quadrant) => {
      const r = inverse(A, { x: 0, y: 0 }, Q);
      expect(A.toString(r.azimuth)).toBe(A.toString(A.from(az)));
      expect(r.quadrant).toBe(quadrant);
    });

    it('agrees with Math.atan2 and Math.hypot for a general line (to 1e-12° and 1e-9 m)', () => {
      const P = { x: '1234.567', y: '-765.432' };
      const Q = { x: '-987.654', y: '345.678' };
      const r = inverse(A, P, Q);
      const dx = -987.654 - 1234.567;
      const dy = 345.678 - -765.432;
      const az = ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360;
      expect(Math.abs(A.toNumber(r.azimuth) - az)).toBeLessThan(1e-12);
      expect(Math.abs(rootToNumber(A, r.distance as never) - Math.hypot(dx, dy))).toBeLessThan(
        1e-9,
      );
      expect(A.toString(r.direction.x)).toBe(
        A.toString(A.sub(A.from('-987.654'), A.from('1234.567'))),
      );
    });

    it('refuses P = Q with COINCIDENT_POINTS', () => {
      expect(code(() => inverse(A, { x: 1, y: 2 }, { x: 1, y: 2 }))).toBe('COINCIDENT_POINTS');
    });

    it('forward(A, P, bearing, d) goes d·sin θ east and d·cos θ north (Math.sin/Math.cos, 1e-9)', () => {
      const p = forward(A, { x: 500, y: 1000 }, `S 68°05'35" W`, '250.25');
      const th = ((248 + 5 / 60 + 35 / 3600) * Math.PI) / 180;
      expect(Math.abs(A.toNumber(p.x) - (500 + 250.25 * Math.sin(th)))).toBeLessThan(1e-9);
      expect(Math.abs(A.toNumber(p.y) - (1000 + 250.25 * Math.cos(th)))).toBeLessThan(1e-9);
    });

    it('forward refuses a bad bearing with INVALID_BEARING and a negative distance with INVALID_ARGUMENT', () => {
      expect(code(() => forward(A, { x: 0, y: 0 }, 'NE-ish', 1))).toBe('INVALID_BEARING');
      expect(code(() => forward(A, { x: 0, y: 0 }, 10, -1))).toBe('INVALID_ARGUMENT');
    });
  },
);

describe('inverse and forward in rational', () => {
  it('gives the distance as an exact surd: (0,0)→(2,4) is 2√5', () => {
    expect(inverse(rational, { x: 0, y: 0 }, { x: 2, y: 4 }).distance.toString()).toBe('2√5');
  });

  it('forward then inverse returns the bearing within 1e-30° and the quadrance within 1e-35 relative (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 359_999 }),
        fc.integer({ min: 1, max: 1_000_000 }),
        (milliDeg, cm) => {
          const az = rational.from(`${milliDeg}/1000`);
          const d = rational.from(`${cm}/100`);
          const p = forward(rational, { x: 0, y: 0 }, az, d);
          const r = inverse(rational, { x: 0, y: 0 }, p);
          let diff = Math.abs(rational.toNumber(rational.sub(r.azimuth, az)));
          diff = Math.min(diff, 360 - diff);
          expect(diff).toBeLessThan(1e-30);
          // Q = d²(sin² + cos²): within 1e-35 relative of d² when sin and cos are within 1e-40.
          const d2 = rational.mul(d, d);
          expect(
            Math.abs(rational.toNumber(rational.div(rational.sub(r.quadrance, d2), d2))),
          ).toBeLessThan(1e-35);
        },
      ),
      { numRuns: 50 },
    );
  });

  it('azimuthToQuadrant and bearingToAzimuth are inverse on whole seconds', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 360 * 3600 - 1 }), (sec) => {
        const az = rational.from(`${sec}/3600`);
        const text = azimuthToQuadrant(rational, az, 0);
        expect(rational.eq(bearingToAzimuth(rational, text), az)).toBe(true);
      }),
    );
  });
});

describe('inverse(A, P, Q).dms near north', () => {
  it('writes an azimuth that rounds up to 360° as 0°00\'00.0"', () => {
    // Azimuth 360° − 0.01″ (derived: tan of 0.01″ ≈ 4.848e-8).
    const r = inverse(float, { x: 0, y: 0 }, { x: -4.848e-8, y: 1 });
    expect(r.dms).toBe(`0°00'00.0"`);
  });
});
