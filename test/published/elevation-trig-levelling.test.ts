// Trigonometric levelling and curvature/refraction constants checked against published values.
import { describe, expect, it } from 'vitest';
import { rational, decimal, float } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import { trigHeight, curvatureRefraction } from '../../src/elevation/trig-heighting.js';
import { verticalFromAngle } from '../../src/readings/vertical.js';
import { rootToNumber } from '../../src/geometry/surd.js';

const arithmetics: Arithmetic<unknown, boolean>[] = [
  rational as never,
  decimal(34) as never,
  float as never,
];

describe('Mahun, Surveying (open text), "Solution: Trig Leveling", Problem 1', () => {
  // Instrument 5.41 ft over a point of elevation 745.39 ft, target 5.64 ft; elevation = H + hi + S·sin α − hr.
  // Published elevations to 0.01 ft (curvature and refraction below 0.001 ft at these distances).
  const cases: [string, number, number][] = [
    [`4°24'10"`, 145.25, 756.31],
    [`-6°00'25"`, 89.32, 735.81],
    [`-2°58'30"`, 118.95, 738.99],
  ];
  for (const A of arithmetics) {
    for (const [angle, S, elevation] of cases) {
      it(`${A.name}: ${angle} over ${S} ft gives ${elevation} ft (±0.005)`, () => {
        const r = trigHeight(A, {
          distance: String(S),
          measured: 'slope',
          vertical: verticalFromAngle(A, angle),
          instrumentHeight: '5.41',
          targetHeight: '5.64',
          correction: { unit: 'ft' },
        });
        const elev = 745.39 + rootToNumber(A, r.difference as never);
        expect(Math.abs(elev - elevation)).toBeLessThanOrEqual(0.005);
        // and the correction is below 0.001 ft, as the source says
        expect(A.toNumber(r.correction)).toBeLessThan(0.001);
      });
    }
  }
});

describe('curvature and refraction constants (Ghilani & Wolf, Elementary Surveying, ch. 4 — from memory; derived with R = 6371 km)', () => {
  it('curvature alone is 0.07848·D² m with D in km', () => {
    expect(rational.toNumber(curvatureRefraction(rational, 1000, { k: 0 }))).toBeCloseTo(
      0.07848,
      5,
    );
    expect(rational.toNumber(curvatureRefraction(rational, 3000, { k: 0 })) / 9).toBeCloseTo(
      0.07848,
      5,
    );
  });
  it('with k = 0.14 it is 0.0675·D² m', () => {
    expect(rational.toNumber(curvatureRefraction(rational, 1000, { k: '0.14' }))).toBeCloseTo(
      0.0675,
      4,
    );
  });
  it('in feet, 0.0206·F² ft with F in thousands of feet (k = 0.14)', () => {
    expect(
      rational.toNumber(curvatureRefraction(rational, 1000, { k: '0.14', unit: 'ft' })),
    ).toBeCloseTo(0.0206, 4);
  });
});
