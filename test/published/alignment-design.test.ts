// Design-check helpers against Montana DOT, *Road Design Manual*, Appendix K (sight distance):
// SSD = 1.47·V·t + V²/(30((a/32.2) − G)) on a 5 % downgrade, V = 60 mph, t = 2.5 s,
// a = 11.2 ft/s² → 623.4 ft; horizontal sight line offset M = R(1 − cos(28.65·S/R)),
// S = 570 ft, R = 1400 ft → 28.91 ft; passing sight on a crest L = 2S − 200(√h1 + √h2)²/A,
// S = 1000 ft, A = 2, h1 = h2 = 3.5 ft → 600 ft.
import { describe, expect, it } from 'vitest';
import {
  rational,
  float,
  decimal,
  stoppingSightDistance,
  sightLineOffset,
  sightCurveLength,
  type Arithmetic,
} from '../../src/index.js';

const ARITHMETICS = [
  ['float', float],
  ['decimal(30)', decimal(30)],
  ['rational', rational],
] as [string, Arithmetic<unknown>][];

describe('Montana DOT Road Design Manual, Appendix K: sight distance', () => {
  it.each(ARITHMETICS.map(([n]) => n))(
    'stopping sight distance on a 5 per cent downgrade is 623.4 ft (%s)',
    (name) => {
      const A = ARITHMETICS.find(([n]) => n === name)![1];
      const d = stoppingSightDistance(A, {
        speed: 60,
        reactionTime: 2.5,
        deceleration: 11.2,
        grade: -0.05,
        units: 'us',
      });
      expect(A.toPrecision(d, 4)).toBe('623.4');
    },
  );
  it.each(ARITHMETICS)(
    'the sight line offset for S = 570 ft on R = 1400 ft is 28.91 ft (%s)',
    (_n, A) => {
      expect(A.toPrecision(sightLineOffset(A, { radius: 1400, sightDistance: 570 }), 4)).toBe(
        '28.91',
      );
    },
  );
  it('the crest curve for passing sight S = 1000 ft, A = 2, h1 = h2 = 3.5 ft is 600 ft, exactly in rational', () => {
    const r = sightCurveLength(rational, {
      sightDistance: 1000,
      gradeChange: 2,
      kind: 'crest',
      eyeHeight: 3.5,
      objectHeight: 3.5,
    });
    expect(rational.toString(r.length)).toBe('600');
    expect(r.longerThanSight).toBe(false);
  });
});
