// Trigonometric levelling with uncertainty, on a published worked example: Mahun,
// *Surveying* open text, "Solution: Trig Leveling", Problem 1:
// instrument 5.41 ft over a point of elevation 745.39 ft, target 5.64 ft; elevation =
// H + hi + S·sin α − hr. The elevations are the document's (±0.005 ft); the sigmas are
// derived by hand from GUM eq. (10): u²(V) = sin²α·u²(S) + (S·cos α)²·u²(α), α in radians.
import { describe, it, expect } from 'vitest';
import { float, decimal, uncertain } from '../../src/arithmetic/index.js';
import { trigHeight } from '../../src/elevation/trig-heighting.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { measuredVertical } from '../../src/uncertainty/readings.js';

const sights = [
  { angle: `4°24'10"`, deg: 4 + 24 / 60 + 10 / 3600, S: 145.25, elevation: 756.31 },
  { angle: `-6°00'25"`, deg: -(6 + 0 / 60 + 25 / 3600), S: 89.32, elevation: 735.81 },
  { angle: `-2°58'30"`, deg: -(2 + 58 / 60 + 30 / 3600), S: 118.95, elevation: 738.99 },
];
const uS = 0.01; // ft, invented for the check
const uaSec = 5; // arc-seconds, invented for the check

describe('Mahun, Surveying, Trig Leveling Problem 1, with an uncertainty budget', () => {
  for (const U of [uncertain(float), uncertain(decimal(30))]) {
    for (const s of sights) {
      it(`${U.name}: the sight ${s.angle}, S = ${s.S} ft gives ${s.elevation} ft and the hand-propagated sigma`, () => {
        const A = U as unknown as ReturnType<typeof uncertain<number, false>>;
        const S = measured(A, s.S, uS, 'S');
        const v = measuredVertical(A, s.angle, uaSec, 'alpha');
        const r = trigHeight(A, {
          distance: S,
          measured: 'slope',
          vertical: v,
          instrumentHeight: '5.41',
          targetHeight: '5.64',
          correction: false,
        });
        const elevation = A.base.toNumber(r.difference.value) + 745.39;
        expect(Math.abs(elevation - s.elevation)).toBeLessThanOrEqual(0.005 + 1e-9);
        const t = (s.deg * Math.PI) / 180;
        const hand = Math.sqrt(
          (Math.sin(t) * uS) ** 2 + (s.S * Math.cos(t) * uaSec * (Math.PI / 648000)) ** 2,
        );
        const B = budget(A, r.difference);
        expect(Math.abs(A.base.toNumber(B.sigma) - hand) / hand).toBeLessThan(1e-12);
      });
    }
  }
});
