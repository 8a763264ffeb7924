// Unit and angle definitions from published standards, checked exactly (sources beside each).
import { describe, expect, it } from 'vitest';
import { rational } from '../../src/index.js';
import { lengthToMetres, convertLength, convertQuadrance } from '../../src/readings/length.js';
import { angleToDegrees } from '../../src/readings/angle.js';
import { spreadFromGrade } from '../../src/readings/slope.js';
import { degreesFromSpread } from '../../src/readings/spread.js';

const R = rational;
const s = (x: unknown) => R.toString(x as never);

describe('length units are the published exact definitions', () => {
  // NIST/NGS, "Deprecation of the U.S. Survey Foot", Federal Register 85(193) 62698–62708, 5 Oct 2020.
  it('the international foot is 0.3048 m exactly', () => {
    expect(s(lengthToMetres(R, 1, 'ft'))).toBe('381/1250');
  });
  it('the U.S. survey foot is 1200/3937 m exactly', () => {
    expect(s(lengthToMetres(R, 1, 'us-ft'))).toBe('1200/3937');
  });
  it('a survey foot is 500000/499999 international feet (same notice, derived)', () => {
    expect(s(convertLength(R, 1, 'us-ft', 'ft'))).toBe('500000/499999');
  });
  // Gunter's chain = 66 ft = 100 links; acre = 10 square chains = 43,560 ft²; mile = 5280 ft = 1609.344 m:
  // NIST Handbook 44, Appendix C, "General Tables of Units of Measurement" (from memory); the metre values
  // are derived from the international foot of the notice above (derived).
  it("Gunter's chain is 66 ft and 100 links", () => {
    expect(s(convertLength(R, 1, 'ch', 'ft'))).toBe('66');
    expect(s(convertLength(R, 1, 'ch', 'lk'))).toBe('100');
    expect(s(convertLength(R, 1, 'us-ch', 'us-ft'))).toBe('66');
  });
  it('ten square chains are 43,560 square feet (the acre)', () => {
    expect(s(convertQuadrance(R, 10, 'ch', 'ft'))).toBe('43560');
  });
  it('the international mile is 1609.344 m and 5280 ft', () => {
    expect(s(lengthToMetres(R, 1, 'mi'))).toBe('201168/125'); // 1609.344 = 1609344/1000, by hand
    expect(s(convertLength(R, 1, 'mi', 'ft'))).toBe('5280');
  });
});

describe('angle units are the published definitions', () => {
  // ISO 80000-3:2006, item 3-5.e: 1 gon = (π/200) rad = 0.9°; 400 gon to the turn.
  it('400 gon is 360° and 1 gon is 0.9° exactly', () => {
    expect(s(angleToDegrees(R, 400, 'gon'))).toBe('360');
    expect(s(angleToDegrees(R, 1, 'gon'))).toBe('9/10');
  });
  // NATO mil: 6400 to the turn (common practice).
  it('6400 mil is 360° exactly', () => {
    expect(s(angleToDegrees(R, 6400, 'mil'))).toBe('360');
  });
});

describe('percent grades (percent grade = 100·tan θ, derived)', () => {
  it('100 % is 45° and spread 1/2', () => {
    expect(s(spreadFromGrade(R, 100))).toBe('1/2');
    expect(s(degreesFromSpread(R, spreadFromGrade(R, 100)))).toBe('45');
  });
  it('10 % is 5.7106° and 1 % is 0.5729°', () => {
    expect(R.toNumber(degreesFromSpread(R, spreadFromGrade(R, 10))).toFixed(4)).toBe('5.7106');
    expect(R.toNumber(degreesFromSpread(R, spreadFromGrade(R, 1))).toFixed(4)).toBe('0.5729');
  });
});
