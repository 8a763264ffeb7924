// heightFromReading and its inverses; heights from two known stations.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import {
  heightFromReading,
  horizontalFromHeight,
  verticalFromHeight,
} from '../../src/elevation/height.js';
import { heightFromTwoStations } from '../../src/elevation/two-stations.js';
import { verticalFromAngle } from '../../src/readings/vertical.js';

const R = rational;
const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};
const posRational = fc
  .tuple(fc.integer({ min: 1, max: 10 ** 6 }), fc.integer({ min: 1, max: 1000 }))
  .map(([n, d]) => R.from(`${n}/${d}`));
const coord = fc
  .tuple(fc.integer({ min: -1e6, max: 1e6 }), fc.integer({ min: 1, max: 100 }))
  .map(([n, d]) => R.from(`${n}/${d}`));

describe('heightFromReading(A, { horizontal, vertical }) is H = Q·R/(1 − R)', () => {
  it('a 3-4-5 sight: Q = 16, R = 9/25 gives H = 9 exactly', () => {
    expect(R.toString(heightFromReading(R, { horizontal: 16, vertical: '9/25' }))).toBe('9');
  });
  it('a reading below the horizon gives the same H (the sign belongs to the reading)', () => {
    expect(
      R.toString(
        heightFromReading(R, { horizontal: 16, vertical: { spread: R.from('9/25'), sign: -1 } }),
      ),
    ).toBe('9');
  });
  it('recovers the height of random exact configurations exactly, and the inverses recover Q and R', () => {
    fc.assert(
      fc.property(posRational, posRational, (H, Q) => {
        const Rv = R.div(H, R.add(H, Q)); // constructed: R = H/(H + Q)
        expect(R.eq(heightFromReading(R, { horizontal: Q, vertical: Rv }), H)).toBe(true);
        expect(R.eq(horizontalFromHeight(R, { height: H, vertical: Rv }), Q)).toBe(true);
        expect(R.eq(verticalFromHeight(R, { height: H, horizontal: Q }), Rv)).toBe(true);
      }),
    );
  });
  it('agrees with classical D·tan α (Math.tan) in float and decimal', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        (D, a) => {
          const h = D * Math.tan((a * Math.PI) / 180);
          for (const A of [float, decimal(30)] as Arithmetic<unknown>[]) {
            const v = verticalFromAngle(A, a);
            const H = A.toNumber(
              heightFromReading(A, { horizontal: A.mul(A.from(D), A.from(D)), vertical: v }),
            );
            expect(Math.abs(Math.sqrt(H) - Math.abs(h))).toBeLessThan(
              1e-9 * Math.max(1, Math.abs(h)),
            );
          }
        },
      ),
      { numRuns: 50 },
    );
  });
  it('refuses a vertical spread of 1 with a horizontal quadrance (VERTICAL_SIGHT), spreads outside [0, 1], negative quadrances', () => {
    expect(codeOf(() => heightFromReading(R, { horizontal: 16, vertical: 1 }))).toBe(
      'VERTICAL_SIGHT',
    );
    expect(codeOf(() => heightFromReading(R, { horizontal: 16, vertical: '5/4' }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
    expect(codeOf(() => heightFromReading(R, { horizontal: 16, vertical: -0.1 }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
    expect(codeOf(() => heightFromReading(R, { horizontal: -16, vertical: '1/2' }))).toBe(
      'NEGATIVE_QUADRANCE',
    );
    expect(codeOf(() => heightFromReading(float, { horizontal: Number.NaN, vertical: 0.5 }))).toBe(
      'INVALID_NUMBER',
    );
    expect(() => heightFromReading(R, { horizontal: 16, vertical: 1 })).toThrow(
      /heightFromReading\(input\.vertical\)/,
    );
  });
  it('inverses refuse what has no answer', () => {
    expect(codeOf(() => horizontalFromHeight(R, { height: 4, vertical: 0 }))).toBe(
      'INCONSISTENT_READINGS',
    );
    expect(codeOf(() => horizontalFromHeight(R, { height: 0, vertical: 0 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => verticalFromHeight(R, { height: 0, horizontal: 0 }))).toBe(
      'COINCIDENT_POINTS',
    );
  });
});

describe('heightFromTwoStations: two known stations, the foot known in plan', () => {
  it('recovers H exactly from both stations of random exact configurations, with zero discrepancy', () => {
    fc.assert(
      fc.property(
        coord,
        coord,
        coord,
        coord,
        coord,
        coord,
        posRational,
        (x1, y1, x2, y2, fx, fy, H) => {
          const Q1 = R.add(
            R.mul(R.sub(fx, x1), R.sub(fx, x1)),
            R.mul(R.sub(fy, y1), R.sub(fy, y1)),
          );
          const Q2 = R.add(
            R.mul(R.sub(fx, x2), R.sub(fx, x2)),
            R.mul(R.sub(fy, y2), R.sub(fy, y2)),
          );
          fc.pre(!R.isZero(Q1) && !R.isZero(Q2));
          const r = heightFromTwoStations(R, {
            stations: [
              { x: x1, y: y1 },
              { x: x2, y: y2 },
            ],
            foot: { x: fx, y: fy },
            vertical: [R.div(H, R.add(H, Q1)), R.div(H, R.add(H, Q2))],
          });
          expect(R.eq(r.H1, H) && R.eq(r.H2, H) && R.eq(r.H, H) && R.isZero(r.discrepancy)).toBe(
            true,
          );
          expect(r.sign).toBe(1);
        },
      ),
    );
  });
  it('float: matches classical heights D·tan α from Math.tan, and weights the nearer, flatter sight more', () => {
    const h = 37.5; // invented demo geometry
    const st = [
      { x: 0, y: 0 },
      { x: 300, y: 40 },
    ];
    const foot = { x: 60, y: 80 };
    const D = st.map((p) => Math.hypot(foot.x - p.x, foot.y - p.y));
    const noisy = [0, 0.001]; // a small angular error on the second sight, radians
    const v = D.map((d, i) =>
      verticalFromAngle(float, ((Math.atan2(h, d) + noisy[i]!) * 180) / Math.PI),
    );
    const r = heightFromTwoStations(float, {
      stations: [st[0]!, st[1]!],
      foot,
      vertical: [v[0]!, v[1]!],
    });
    expect(Math.sqrt(r.H1)).toBeCloseTo(h, 9);
    expect(Math.sqrt(r.H2)).toBeCloseTo(D[1]! * Math.tan(Math.atan2(h, D[1]!) + 0.001), 9);
    expect(r.discrepancy).not.toBe(0);
    expect(r.weights[0]).toBeGreaterThan(r.weights[1]);
    expect(Math.abs(Math.sqrt(r.H) - h)).toBeLessThan(Math.abs(Math.sqrt(r.H2) - h));
  });
  it('refuses readings on both sides of the horizon, a station at the foot, and wrong counts', () => {
    const base = {
      stations: [
        { x: 0, y: 0 },
        { x: 10, y: 0 },
      ] as const,
      foot: { x: 4, y: 3 },
    };
    expect(
      codeOf(() =>
        heightFromTwoStations(R, {
          ...base,
          vertical: ['1/2', { spread: R.from('5/14'), sign: -1 }],
        }),
      ),
    ).toBe('INCONSISTENT_READINGS');
    expect(
      codeOf(() =>
        heightFromTwoStations(R, { ...base, foot: { x: 0, y: 0 }, vertical: ['1/2', '1/2'] }),
      ),
    ).toBe('COINCIDENT_POINTS');
    expect(codeOf(() => heightFromTwoStations(R, { ...base, vertical: ['1/2'] as never }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => heightFromTwoStations(R, { ...base, vertical: ['1/2', 1] }))).toBe(
      'VERTICAL_SIGHT',
    );
    // the error names this solver's input, not heightFromReading's
    expect(() => heightFromTwoStations(R, { ...base, vertical: ['1/2', 1] })).toThrow(
      expect.objectContaining({ where: 'heightFromTwoStations(input).vertical[1]' }),
    );
  });
});
