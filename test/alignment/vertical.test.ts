// verticalAlignment and profileLevel: continuity of level and grade at every BVC, VIP and EVC,
// exactly in rational (fast-check); the parabola checked against its defining equation written
// here; bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, float, verticalAlignment, profileLevel } from '../../src/index.js';
import { code } from '../geometry/helpers.js';

const R = rational;
const q = (n: number, d = 100) => R.div(R.from(n), R.from(d));

describe('profile continuity (fast-check, exact in rational)', () => {
  const profileArb = fc
    .record({
      levels: fc.array(fc.integer({ min: -5000, max: 5000 }), { minLength: 3, maxLength: 6 }),
      gaps: fc.array(fc.integer({ min: 100, max: 400 }), { minLength: 5, maxLength: 5 }),
      fracIn: fc.array(fc.integer({ min: 5, max: 45 }), { minLength: 6, maxLength: 6 }),
      fracOut: fc.array(fc.integer({ min: 5, max: 45 }), { minLength: 6, maxLength: 6 }),
    })
    .map(({ levels, gaps, fracIn, fracOut }) => {
      let c = 0;
      const points = levels.map((l, i) => {
        if (i > 0) c += gaps[i - 1]!;
        return { chainage: R.from(c), level: q(l) };
      });
      // curves of up to 45 % of each neighbouring gap on each side: never overlapping
      const curves = points.map((_, i) =>
        i === 0 || i === points.length - 1
          ? null
          : { lengthIn: q(gaps[i - 1]! * fracIn[i]!), lengthOut: q(gaps[i]! * fracOut[i]!) },
      );
      return { points, curves };
    });

  it('level and grade are continuous at every BVC, VIP and EVC, and the VIP offset is e = (g2 − g1)·l1·l2/(2(l1 + l2))', () => {
    fc.assert(
      fc.property(profileArb, (input) => {
        let v;
        try {
          v = verticalAlignment(R, input);
        } catch (e) {
          // equal grades at a VIP with a curve: refused, as documented
          expect((e as { code?: string }).code).toBe('INVALID_ARGUMENT');
          return;
        }
        for (const c of v.curves) {
          if (!c) continue;
          const i = c.vip;
          const g1 = v.grades[i - 1]!;
          const g2 = v.grades[i]!;
          const vip = v.points[i]!;
          // at the BVC: the grade line g1 through the VIP, grade g1; at the EVC: g2
          const atB = profileLevel(R, v, c.bvc.chainage);
          expect(R.eq(atB.level, R.sub(vip.level, R.mul(g1, c.lengthIn)))).toBe(true);
          expect(R.eq(atB.grade, g1)).toBe(true);
          const atE = profileLevel(R, v, c.evc.chainage);
          expect(R.eq(atE.level, R.add(vip.level, R.mul(g2, c.lengthOut)))).toBe(true);
          expect(R.eq(atE.grade, g2)).toBe(true);
          // at the VIP, from both branches (just before and after, by the parabolas' Taylor form)
          const e = R.div(
            R.mul(R.sub(g2, g1), R.mul(c.lengthIn, c.lengthOut)),
            R.mul(R.from(2), c.length),
          );
          const atV = profileLevel(R, v, vip.chainage);
          expect(R.eq(atV.level, R.add(vip.level, e))).toBe(true);
          const h = q(1, 1000);
          const before = profileLevel(R, v, R.sub(vip.chainage, h));
          const after = profileLevel(R, v, R.add(vip.chainage, h));
          // second differences of a parabola are exact: the two branches share the tangent at the VIP
          const gradeBefore = R.div(R.sub(atV.level, before.level), h);
          const gradeAfter = R.div(R.sub(after.level, atV.level), h);
          const curvIn = R.div(R.mul(R.from(2), e), R.mul(c.lengthIn, c.lengthIn));
          const curvOut = R.div(R.mul(R.from(2), e), R.mul(c.lengthOut, c.lengthOut));
          expect(R.eq(gradeBefore, R.sub(atV.grade, R.div(R.mul(curvIn, h), R.from(2))))).toBe(
            true,
          );
          expect(R.eq(gradeAfter, R.add(atV.grade, R.div(R.mul(curvOut, h), R.from(2))))).toBe(
            true,
          );
          // just outside the curve, the grade line
          if (R.cmp(c.bvc.chainage, v.points[i - 1]!.chainage) > 0) {
            const out = profileLevel(R, v, R.sub(c.bvc.chainage, h));
            expect(R.eq(out.level, R.sub(atB.level, R.mul(g1, h)))).toBe(true);
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it('a symmetric curve is y = y_BVC + g1·x + (g2 − g1)·x²/(2L) throughout (float, Math.*)', () => {
    const v = verticalAlignment(float, {
      points: [
        { chainage: 0, level: 100 },
        { chainage: 300, level: 103 },
        { chainage: 700, level: 95 },
      ],
      curves: [null, { length: 240 }, null],
    });
    const g1 = 3 / 300;
    const g2 = -8 / 400;
    for (let x = 0; x <= 240; x += 7.5) {
      const p = profileLevel(float, v, 180 + x);
      expect(p.level).toBeCloseTo(101.8 + g1 * x + ((g2 - g1) * x * x) / 480, 10);
      expect(p.grade).toBeCloseTo(g1 + ((g2 - g1) * x) / 240, 12);
    }
    expect(v.curves[1]!.kind).toBe('crest');
    expect(v.curves[1]!.k).toBeCloseTo(240 / 3, 12);
  });

  it('finds the low point of a sag curve', () => {
    const v = verticalAlignment(R, {
      points: [
        { chainage: 0, level: 10 },
        { chainage: 100, level: 8 },
        { chainage: 200, level: 11 },
      ],
      curves: [null, { length: 80 }, null],
    });
    const c = v.curves[1]!;
    expect(c.kind).toBe('sag');
    // g1 = −0.02, g2 = 0.03, L = 80: x = −g1·L/(g2 − g1) = 32 from the BVC at 60; level 8.8 − 0.64 + 0.32
    expect(R.toString(c.turningPoint!.chainage)).toBe('92');
    expect(R.eq(c.turningPoint!.level, R.from('8.48'))).toBe(true);
  });
});

describe('verticalAlignment bad input', () => {
  const pts = [
    { chainage: 0, level: 0 },
    { chainage: 100, level: 5 },
    { chainage: 200, level: 0 },
  ];
  it.each([
    ['one point', { points: [pts[0]] }, 'TOO_FEW_POINTS'],
    ['chainages not increasing', { points: [pts[0], pts[2], pts[1]] }, 'REPEATED_CHAINAGE'],
    [
      'a curve at an end',
      { points: pts, curves: [{ length: 10 }, null, null] },
      'INVALID_ARGUMENT',
    ],
    ['curves not one per point', { points: pts, curves: [null] }, 'INVALID_ARGUMENT'],
    [
      'a negative length',
      { points: pts, curves: [null, { length: -10 }, null] },
      'INVALID_ARGUMENT',
    ],
    [
      'a curve past the end',
      { points: pts, curves: [null, { length: 300 }, null] },
      'CURVES_OVERLAP',
    ],
    [
      'no grade change',
      {
        points: [pts[0], pts[1], { chainage: 200, level: 10 }],
        curves: [null, { length: 20 }, null],
      },
      'INVALID_ARGUMENT',
    ],
    ['a bad level', { points: [pts[0], { chainage: 1, level: 'x' }] }, 'INVALID_NUMBER'],
  ])('%s', (_n, input, expected) => {
    expect(code(() => verticalAlignment(R, input as never))).toBe(expected);
  });
  it('refuses a chainage off the profile', () => {
    const v = verticalAlignment(R, { points: pts });
    expect(code(() => profileLevel(R, v, 201))).toBe('OFF_ALIGNMENT');
    expect(code(() => profileLevel(R, v, '-0+01.00'))).toBe('OFF_ALIGNMENT');
    expect(code(() => profileLevel(R, {} as never, 1))).toBe('INVALID_ARGUMENT');
  });
});
