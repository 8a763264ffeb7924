// The distributions of src/adjustment/statistics.ts against jstat (an independent
// implementation) and against closed forms written here.
import { describe, expect, it } from 'vitest';
import jStatModule from 'jstat';
import {
  normalCdf,
  normalQuantile,
  chiSquareCdf,
  chiSquareQuantile,
  fCdf,
  fQuantile,
  baardaTest,
  tauCritical,
  QuadspreadError,
} from '../../src/index.js';

const jStat: any = (jStatModule as any).jStat ?? jStatModule;
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
const P = [1e-6, 0.001, 0.025, 0.05, 0.2, 0.5, 0.8, 0.95, 0.975, 0.999, 0.9995];

describe('normalQuantile(p) and normalCdf(x)', () => {
  it("agree with jstat within 1e-9 (jstat's normal cdf underflows below about −8)", () => {
    for (const p of P)
      expect(Math.abs(normalQuantile(p) - jStat.normal.inv(p, 0, 1))).toBeLessThan(1e-9);
    for (const x of [-5, -3, -1, -0.1, 0, 0.5, 2, 4])
      expect(rel(normalCdf(x), jStat.normal.cdf(x, 0, 1))).toBeLessThan(1e-9);
  });
  it('invert each other', () => {
    for (const p of [1e-12, 1e-6, 0.3, 0.7, 0.999999])
      expect(rel(normalCdf(normalQuantile(p)), p)).toBeLessThan(1e-12);
  });
  it("give Baarda's critical value 3.2905 for α0 = 0.001 and λ0 = 17.07 for β0 = 0.80", () => {
    // (3.2905 + 0.8416)² = 17.07 (Baarda 1968; derived)
    const t = baardaTest(0.001, 0.8);
    expect(t.critical.toFixed(4)).toBe('3.2905');
    expect(normalQuantile(0.8).toFixed(4)).toBe('0.8416');
    expect(t.lambda0.toFixed(2)).toBe('17.07');
  });
});

describe('chiSquareQuantile(p, dof) and chiSquareCdf(x, dof)', () => {
  it('agree with jstat within 1e-8', () => {
    for (const k of [1, 2, 3, 5, 10, 37, 200, 5000])
      for (const p of P)
        expect(rel(chiSquareQuantile(p, k), jStat.chisquare.inv(p, k))).toBeLessThan(1e-8);
    for (const k of [1, 3, 10, 100])
      for (const x of [0.1, 1, 3, 10, 150])
        expect(rel(chiSquareCdf(x, k), jStat.chisquare.cdf(x, k))).toBeLessThan(1e-9);
  });
  it('match the closed form of χ²(2), −2·ln(1 − p), within 1e-13', () => {
    for (const p of P)
      expect(rel(chiSquareQuantile(p, 2), -2 * Math.log1p(-p))).toBeLessThan(1e-13);
  });
  it('give the two-sided 95 % bounds 0.2158, 9.3484 (r = 3) and 3.2470, 20.4832 (r = 10)', () => {
    expect(
      [chiSquareQuantile(0.025, 3), chiSquareQuantile(0.975, 3)].map((x) => x.toFixed(4)),
    ).toEqual(['0.2158', '9.3484']);
    expect(
      [chiSquareQuantile(0.025, 10), chiSquareQuantile(0.975, 10)].map((x) => x.toFixed(4)),
    ).toEqual(['3.2470', '20.4832']);
  });
});

describe('fQuantile(p, d1, d2) and fCdf(x, d1, d2)', () => {
  it("agree with jstat within 1e-6 (jstat's own F is good to about 1e-7)", () => {
    for (const [a, b] of [
      [1, 3],
      [2, 3],
      [2, 10],
      [3, 30],
      [10, 10],
      [5, 300],
    ])
      for (const p of [0.01, 0.05, 0.5, 0.95, 0.99])
        expect(rel(fQuantile(p, a!, b!), jStat.centralF.inv(p, a, b))).toBeLessThan(1e-6);
    for (const x of [0.2, 1, 4])
      expect(rel(fCdf(x, 3, 7), jStat.centralF.cdf(x, 3, 7))).toBeLessThan(1e-9);
  });
  it('match the closed form of F(2, 2), p/(1 − p), within 1e-12', () => {
    for (const p of [0.01, 0.3, 0.5, 0.9, 0.999])
      expect(rel(fQuantile(p, 2, 2), p / (1 - p))).toBeLessThan(1e-12);
  });
  it('give the 95 % a-posteriori ellipse factor √(2·F(2, 3)) = 4.3708 and √χ²(2) = 2.4477', () => {
    expect(Math.sqrt(2 * fQuantile(0.95, 2, 3)).toFixed(4)).toBe('4.3708');
    expect(Math.sqrt(chiSquareQuantile(0.95, 2)).toFixed(4)).toBe('2.4477');
  });
  it("make Pope's τ critical value from Student's t: τ(0.05, r = 3) with t(2) = 4.3027", () => {
    // τ = √r·t/√(r − 1 + t²) (Pope 1976); t from jstat's studentt
    const t = jStat.studentt.inv(0.975, 2);
    expect(rel(tauCritical(0.05, 3), (Math.sqrt(3) * t) / Math.sqrt(2 + t * t))).toBeLessThan(1e-7);
  });
});

describe('the distributions refuse bad input', () => {
  it.each([
    () => normalQuantile(0),
    () => normalQuantile(1),
    () => normalQuantile(NaN),
    () => chiSquareQuantile(0.5, 0),
    () => chiSquareQuantile(0.5, -1),
    () => fQuantile(0.5, 1, Infinity),
    () => normalCdf('x' as never),
    () => tauCritical(0.05, 1),
    () => baardaTest(2, 0.8),
  ])('%# with INVALID_ARGUMENT', (f) => {
    expect(f).toThrow(QuadspreadError);
    try {
      f();
    } catch (e) {
      expect((e as QuadspreadError).code).toBe('INVALID_ARGUMENT');
    }
  });
});
