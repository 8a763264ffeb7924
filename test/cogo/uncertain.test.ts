// cogo with the uncertain arithmetic: first-order budgets against GUM eq. (10) worked by hand.
import { describe, expect, it } from 'vitest';
import type { Rational } from '../../src/index.js';
import {
  float,
  rational,
  uncertain,
  measured,
  budget,
  area,
  perimeter,
  levelRun,
  traverse,
} from '../../src/index.js';

const U = uncertain(float);

describe('cogo with uncertain(float) (GUM, JCGM 100:2008 §5.1.2, eq. (10))', () => {
  it('area of an a × b rectangle has u = √((b·u_a)² + (a·u_b)²)', () => {
    const a = measured(U, 200, 0.005, 'a');
    const b = measured(U, 100, 0.005, 'b');
    const B = budget(
      U,
      area(U, [
        { x: 0, y: 0 },
        { x: a, y: 0 },
        { x: a, y: b },
        { x: 0, y: b },
      ]),
    );
    expect(B.sigma).toBeCloseTo(Math.hypot(100 * 0.005, 200 * 0.005), 12);
  });

  it('a reduced level BM + BS − FS has u = √(u_BS² + u_FS²)', () => {
    const run = levelRun(U, {
      start: 10,
      sights: [{ bs: measured(U, 1.5, 0.001, 'bs') }, { fs: measured(U, 1.2, 0.002, 'fs') }],
    });
    expect(budget(U, run.rows[1]!.level).sigma).toBeCloseTo(Math.hypot(0.001, 0.002), 14);
  });

  it('an exactly closing traverse has a zero linear misclosure instead of an undefined derivative', () => {
    const d = measured(U, 100, 0.01, 'd');
    const t = traverse(U, {
      start: { x: 0, y: 0 },
      courses: [
        { latitude: d, departure: 0 },
        { latitude: U.neg(d), departure: 0 },
      ],
    });
    expect(U.toNumber(t.closure.linear)).toBe(0);
    expect(t.closure.ratio).toBeUndefined();
  });
});

describe('cogo with uncertain(rational): irrational lengths keep their derivatives (GUM eq. (10), worked by hand)', () => {
  const U = uncertain(rational);
  const variance = (x: Parameters<typeof budget<Rational, true>>[1]) => budget(U, x).variance;

  it('perimeter of the right triangle (0,0), (a,0), (0,b) with a = 1, b = 2 has ∂P/∂a = 1 + a/√5, ∂P/∂b = 1 + b/√5', () => {
    const a = measured(U, 1, '0.01', 'a');
    const b = measured(U, 2, '0.01', 'b');
    const u2 = rational.toNumber(
      variance(
        perimeter(U, [
          { x: 0, y: 0 },
          { x: a, y: 0 },
          { x: 0, y: b },
        ]),
      ),
    );
    const want = ((1 + 1 / Math.sqrt(5)) * 0.01) ** 2 + ((1 + 2 / Math.sqrt(5)) * 0.01) ** 2;
    expect(Math.abs(u2 - want)).toBeLessThan(1e-15);
  });

  it('a course given as latitude a = 1, departure b = 2 has length √5 with u² = ((a·u)² + (b·u)²)/5 = u²', () => {
    const a = measured(U, 1, '0.01', 'lat');
    const b = measured(U, 2, '0.01', 'dep');
    const t = traverse(U, {
      start: { x: 0, y: 0 },
      courses: [
        { latitude: a, departure: b },
        { latitude: -1, departure: '-2.01' },
      ],
    });
    expect(Math.abs(rational.toNumber(variance(t.courses[0]!.length)) - 1e-4)).toBeLessThan(1e-15);
  });
});
