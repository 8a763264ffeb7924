// Area by coordinates against the published worked example.
import { describe, expect, it } from 'vitest';
import Fraction from 'fraction.js';
import { rational, decimal, float, area, polygonArea } from '../../src/index.js';

// Mahun, "Surveying" (open text), chapter on coordinate geometry, area by coordinates:
// (N, E) in ft: C(406.31, 1259.97), D(235.12, 1489.47), E(65.81, 1126.40),
// A(317.89, 942.04), B(675.32, 1282.54) → 140,493.1069 ft² (3.2253 ac).
// Our convention is x = east, y = north, so each (N, E) becomes { x: E, y: N }.
const NE: [string, string][] = [
  ['406.31', '1259.97'],
  ['235.12', '1489.47'],
  ['65.81', '1126.40'],
  ['317.89', '942.04'],
  ['675.32', '1282.54'],
];
const vertices = NE.map(([n, e]) => ({ x: e, y: n }));

describe('area(A, points) reproduces the published area-by-coordinates example (Mahun, COGO chapter)', () => {
  it('is exactly 140,493.1069 ft² in rational, negative because C→D→E→A→B runs clockwise', () => {
    expect(rational.toString(area(rational, vertices))).toBe('-1404931069/10000');
  });

  it('is exactly 140,493.1069 ft² in decimal(34)', () => {
    const D = decimal(34);
    expect(D.toString(D.abs(area(D, vertices)))).toBe('140493.1069');
  });

  it('is 140,493.1069 ft² within 1e-6 ft² in float', () => {
    expect(Math.abs(Math.abs(area(float, vertices)) - 140493.1069)).toBeLessThan(1e-6);
  });

  it('gives 3.2253 acres (1 acre = 43,560 ft², exact) and the same area in m² and ha with exact factors', () => {
    const r = polygonArea(rational, vertices, { unit: 'ft' });
    expect(r.orientation).toBe('clockwise');
    expect(rational.toPrecision(r.acres, 5)).toBe('3.2253');
    // Independent exact check: 140493.1069 ft² × 0.3048² m²/ft² (international foot, Federal
    // Register 85(193), 2020), computed here with fraction.js directly.
    const m2 = new Fraction('140493.1069').mul(new Fraction('0.3048').pow(2));
    expect(rational.toString(r.m2)).toBe(m2.toFraction());
    expect(rational.toString(r.ha)).toBe(m2.div(10000).toFraction());
    expect(rational.toString(r.ft2)).toBe('1404931069/10000');
  });
});
