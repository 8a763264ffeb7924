// Design-check helpers against their formulas evaluated independently with Math.*, and bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  float,
  rational,
  minimumRadius,
  railCant,
  transitionLength,
  stoppingSightDistance,
  sightCurveLength,
} from '../../src/index.js';
import { code } from '../geometry/helpers.js';

const g = 9.80665;

describe('design checks against their formulas (Math.*)', () => {
  it('minimumRadius is v²/(g(e + f)) in metric and US units', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 0.12, noNaN: true }),
        fc.double({ min: 0.05, max: 0.2, noNaN: true }),
        (V, e, f) => {
          const v = V / 3.6;
          expect(
            minimumRadius(float, { speed: V, superelevation: e, sideFriction: f }),
          ).toBeCloseTo((v * v) / (g * (e + f)), 8);
          const vf = (V * 5280) / 3600;
          expect(
            minimumRadius(float, { speed: V, superelevation: e, sideFriction: f, units: 'us' }),
          ).toBeCloseTo((vf * vf) / ((g / 0.3048) * (e + f)), 7);
        },
      ),
    );
  });
  it('railCant is G·v²/(g·R), about 11.8·V²/R mm for G = 1500 mm, and exact in rational', () => {
    const c = railCant(float, { speed: 100, radius: 800, appliedCant: 90 });
    expect(c.equilibrium).toBeCloseTo((1500 * (100 / 3.6) ** 2) / (g * 800), 9);
    expect(Math.abs(c.equilibrium - (11.8 * 100 * 100) / 800)).toBeLessThan(0.2);
    expect(c.deficiency).toBeCloseTo(c.equilibrium - 90, 12);
    // 1435 + 65 = 1500 mm rail centres, 72 km/h = 20 m/s, g = 10 (given): E = 1500·400/(10·R)
    const r = railCant(rational, { speed: 72, radius: 600, railCentres: 1500, gravity: 10 });
    expect(rational.toString(r.equilibrium)).toBe('100');
  });
  it('transitionLength takes the longest of v·E/rate and v³/(R·c)', () => {
    const t = transitionLength(float, {
      speed: 90,
      cant: 120,
      cantRate: 50,
      deficiency: 80,
      deficiencyRate: 40,
      radius: 700,
      jerk: 0.4,
    });
    const v = 25;
    expect(t.byCant).toBeCloseTo((v * 120) / 50, 12);
    expect(t.byDeficiency).toBeCloseTo((v * 80) / 40, 12);
    expect(t.byJerk).toBeCloseTo(v ** 3 / (700 * 0.4), 12);
    expect(t.length).toBe(Math.max(t.byCant!, t.byDeficiency!, t.byJerk!));
  });
  it('stoppingSightDistance uses the metric example constants 0.278, 254 and 9.81 by default', () => {
    const d = stoppingSightDistance(float, {
      speed: 100,
      reactionTime: 2.5,
      deceleration: 3.4,
      grade: 0.03,
    });
    expect(d).toBeCloseTo(0.278 * 100 * 2.5 + 100 ** 2 / (254 * (3.4 / 9.81 + 0.03)), 9);
  });
  it('sightCurveLength on a sag uses h + S·tan β, and switches formula where S = L', () => {
    const tan1 = Math.tan(Math.PI / 180);
    const long = sightCurveLength(float, { sightDistance: 400, gradeChange: 6, kind: 'sag' });
    expect(long.longerThanSight).toBe(true);
    expect(long.length).toBeCloseTo((6 * 400 * 400) / (200 * (2 + 400 * tan1)), 9);
    const short = sightCurveLength(float, { sightDistance: 400, gradeChange: 1, kind: 'sag' });
    expect(short.longerThanSight).toBe(false);
    expect(short.length).toBeCloseTo(Math.max(0, 800 - (200 * (2 + 400 * tan1)) / 1), 9);
    const k = (Math.sqrt(3.5) + Math.sqrt(2)) ** 2;
    const crest = sightCurveLength(float, { sightDistance: 500, gradeChange: 6, kind: 'crest' });
    expect(crest.longerThanSight).toBe(true);
    expect(crest.length).toBeCloseTo((6 * 500 * 500) / (200 * k), 9);
    const crestShort = sightCurveLength(float, {
      sightDistance: 500,
      gradeChange: 4,
      kind: 'crest',
    });
    expect(crestShort.longerThanSight).toBe(false);
    expect(crestShort.length).toBeCloseTo(1000 - (200 * k) / 4, 9);
  });
  it.each([
    [
      'minimumRadius with e + f ≤ 0',
      () => minimumRadius(float, { speed: 50, superelevation: -0.1, sideFriction: 0.05 }),
    ],
    ['railCant with a zero radius', () => railCant(float, { speed: 50, radius: 0 })],
    ['transitionLength with no pair', () => transitionLength(float, { speed: 50 })],
    [
      'stoppingSightDistance that cannot stop',
      () =>
        stoppingSightDistance(float, { speed: 50, reactionTime: 2, deceleration: 1, grade: -0.5 }),
    ],
    [
      'sightCurveLength with a bad kind',
      () => sightCurveLength(float, { sightDistance: 100, gradeChange: 1, kind: 'dip' as never }),
    ],
    [
      'minimumRadius with unknown units',
      () =>
        minimumRadius(float, {
          speed: 50,
          superelevation: 0.1,
          sideFriction: 0.1,
          units: 'imperial' as never,
        }),
    ],
  ])('refuses %s', (_n, f) => {
    expect(code(f)).toBe('INVALID_ARGUMENT');
  });
});
