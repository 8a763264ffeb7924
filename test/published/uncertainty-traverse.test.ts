// A traverse closure with uncertainty, on a published worked example: Mahun, *Surveying*
// open text, "Solution: Traverse Adjustment", Problem 2: misclosure
// in latitude −0.115 ft and departure +0.107 ft, linear 0.157 ft (±0.001 ft). The sigmas
// are derived by hand from GUM eq. (10): departure = Σ dᵢ·sin azᵢ, latitude = Σ dᵢ·cos azᵢ.
import { describe, it, expect } from 'vitest';
import { float, uncertain } from '../../src/arithmetic/index.js';
import { traverse } from '../../src/cogo/traverse.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { measuredAngle } from '../../src/uncertainty/readings.js';

const legs = [
  { name: 'AB', az: `226°54'23"`, deg: 226 + 54 / 60 + 23 / 3600, d: 639.15 },
  { name: 'BC', az: `0°00'00"`, deg: 0, d: 523.69 },
  { name: 'CD', az: `235°02'29"`, deg: 235 + 2 / 60 + 29 / 3600, d: 409.54 },
  { name: 'DA', az: `79°35'02"`, deg: 79 + 35 / 60 + 2 / 3600, d: 815.93 },
];
const ud = 0.02; // ft, invented for the check
const uaSec = 5; // arc-seconds, invented for the check
const rad = (deg: number) => (deg * Math.PI) / 180;

describe('Mahun, Surveying, Traverse Adjustment Problem 2, with uncertainty budgets of the misclosure', () => {
  const U = uncertain(float);
  const t = traverse(U, {
    start: { x: U.from(1000), y: U.from(1000) },
    courses: legs.map((l) => ({
      bearing: measuredAngle(U, l.az, uaSec, `az ${l.name}`),
      distance: measured(U, l.d, ud, `d ${l.name}`),
    })),
  });

  it("the misclosure values are the document's: latitude −0.115, departure +0.107, linear 0.157 ft", () => {
    expect(Math.abs(t.closure.north.value + 0.115)).toBeLessThanOrEqual(0.001);
    expect(Math.abs(t.closure.east.value - 0.107)).toBeLessThanOrEqual(0.001);
    expect(Math.abs((t.closure.linear as typeof t.closure.east).value - 0.157)).toBeLessThanOrEqual(
      0.001,
    );
  });

  it('the sigmas of the departure and latitude misclosures equal the hand propagation', () => {
    let vE = 0;
    let vN = 0;
    for (const l of legs) {
      const a = rad(l.deg);
      const ua = uaSec * (Math.PI / 648000);
      vE += (Math.sin(a) * ud) ** 2 + (l.d * Math.cos(a) * ua) ** 2; // ∂(d sin a)/∂d, ∂/∂a
      vN += (Math.cos(a) * ud) ** 2 + (l.d * Math.sin(a) * ua) ** 2;
    }
    expect(Math.abs(budget(U, t.closure.east).sigma - Math.sqrt(vE)) / Math.sqrt(vE)).toBeLessThan(
      1e-12,
    );
    expect(Math.abs(budget(U, t.closure.north).sigma - Math.sqrt(vN)) / Math.sqrt(vN)).toBeLessThan(
      1e-12,
    );
    expect(budget(U, t.closure.east).contributions.length).toBe(8);
  });
});
