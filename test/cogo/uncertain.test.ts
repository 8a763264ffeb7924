// cogo with the uncertain arithmetic: first-order budgets against GUM eq. (10) worked by hand.
import { describe, expect, it } from 'vitest';
import { float, uncertain, measured, budget, area, levelRun, traverse } from '../../src/index.js';

const U = uncertain(float);

describe('cogo with uncertain(float) (GUM, JCGM 100:2008 §5.1.2, eq. (10))', () => {
  it('area of an a × b rectangle has u = √((b·u_a)² + (a·u_b)²)', () => {
    const a = measured(U, 200, 0.005, 'a');
    const b = measured(U, 100, 0.005, 'b');
    const B = budget(U, area(U, [{ x: 0, y: 0 }, { x: a, y: 0 }, { x: a, y: b }, { x: 0, y: b }]));
    expect(B.sigma).toBeCloseTo(Math.hypot(100 * 0.005, 200 * 0.005), 12);
  });

  it('a reduced level BM + BS − FS has u = √(u_BS² + u_FS²)', () => {
    const run = levelRun(U, { start: 10, sights: [{ bs: measured(U, 1.5, 0.001, 'bs') }, { fs: measured(U, 1.2, 0.002, 'fs') }] });
    expect(budget(U, run.rows[1]!.level).sigma).toBeCloseTo(Math.hypot(0.001, 0.002), 14);
  });

  it('an exactly closing traverse has a zero linear misclosure instead of an undefined derivative', () => {
    const d = measured(U, 100, 0.01, 'd');
    const t = traverse(U, { start: { x: 0, y: 0 }, courses: [{ latitude: d, departure: 0 }, { latitude: U.neg(d), departure: 0 }] });
    expect(U.toNumber(t.closure.linear)).toBe(0);
    expect(t.closure.ratio).toBeUndefined();
  });
});
