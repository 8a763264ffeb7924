import { describe, expect, it } from 'vitest';
import { code } from '../geometry/helpers.js';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import type { BigNumber } from 'mathjs';
import { rational, decimal, float, resection, DANGER_CIRCLE_TOLERANCE } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';

const M = create(all!, { number: 'BigNumber', precision: 70 });

type XY = { x: number; y: number };
/** Azimuth S→P in degrees clockwise from north, with mathjs BigNumber at 70 digits (independent of the library). */
function azimuth(S: XY, P: XY): BigNumber {
  const atan2 = M.atan2 as unknown as (y: BigNumber, x: BigNumber) => BigNumber;
  const a = atan2(M.bignumber(P.x - S.x), M.bignumber(P.y - S.y));
  const deg = a.mul(180).div(M.pi as unknown as BigNumber);
  return deg.lt(0) ? deg.add(360) : deg;
}
/** The clockwise angle at S from the direction to P to the direction to Q, as 60-digit text. */
function angle(S: XY, P: XY, Q: XY): string {
  let d = azimuth(S, Q).sub(azimuth(S, P));
  if (d.lt(0)) d = d.add(360);
  return d.toFixed(60);
}
/** Observed angles [a12, a23] at S and the danger ratio |Q(O, S) − R²|/R² computed in float. */
function synth(S: XY, C: [XY, XY, XY]) {
  const [P1, P2, P3] = C;
  const bx = P2.x - P1.x,
    by = P2.y - P1.y,
    cx = P3.x - P1.x,
    cy = P3.y - P1.y;
  const det = 2 * (bx * cy - by * cx);
  const ox = (cy * (bx * bx + by * by) - by * (cx * cx + cy * cy)) / det;
  const oy = (bx * (cx * cx + cy * cy) - cx * (bx * bx + by * by)) / det;
  const R2 = ox * ox + oy * oy;
  const danger = Math.abs((S.x - P1.x - ox) ** 2 + (S.y - P1.y - oy) ** 2 - R2) / R2;
  return {
    angles: [angle(S, P1, P2), angle(S, P2, P3)] as [string, string],
    danger,
    collinear: det === 0,
  };
}

// The bound grows as the station nears the danger circle (ratio → 0); a station far outside a
// small control triangle has a large ratio but no better a fix, so the ratio is capped at 1.
const coord = fc.integer({ min: -5000, max: 5000 });
const pt = fc.record({ x: coord, y: coord });

describe('resection(rational, …) recovers a synthetic station (Tienstra; angles from mathjs at 70 digits)', () => {
  it('to 1e-30·(1 + size)/min(dangerRatio, 1), for stations inside and outside the control triangle, either orientation', () => {
    fc.assert(
      fc.property(pt, pt, pt, pt, (S, P1, P2, P3) => {
        const pts = [S, P1, P2, P3];
        for (let i = 0; i < 4; i++)
          for (let j = i + 1; j < 4; j++)
            fc.pre(pts[i]!.x !== pts[j]!.x || pts[i]!.y !== pts[j]!.y);
        const { angles, danger, collinear } = synth(S, [P1, P2, P3]);
        fc.pre(!collinear && danger > 0.05);
        const r = resection(rational, { control: [P1, P2, P3], angles });
        const size = 1 + Math.max(...pts.flatMap((p) => [Math.abs(p.x), Math.abs(p.y)]));
        const err = Math.hypot(
          rational.toNumber(rational.sub(r.station.x, rational.from(S.x))),
          rational.toNumber(rational.sub(r.station.y, rational.from(S.y))),
        );
        expect(err).toBeLessThan((1e-30 * size) / Math.min(danger, 1));
      }),
      { numRuns: 40 },
    );
  });

  it('is exact when the observed angles have rational sines and cosines (multiples of 90°)', () => {
    const r = resection(rational, {
      control: [
        { x: 0, y: 100 },
        { x: 100, y: 0 },
        { x: 0, y: -50 },
      ],
      angles: [90, 90],
    });
    expect([rational.toString(r.station.x), rational.toString(r.station.y)]).toEqual(['0', '0']);
  });
});

const inexact: [string, Arithmetic<unknown, boolean>, number][] = [
  ['float', float as Arithmetic<unknown, boolean>, 1e-8],
  ['decimal(34)', decimal(34) as Arithmetic<unknown, boolean>, 1e-25],
];
describe.each(inexact)('resection(%s, …)', (_name, A, bound) => {
  it(`recovers a synthetic station to ${bound}·(1 + size)/min(dangerRatio, 1)`, () => {
    fc.assert(
      fc.property(pt, pt, pt, pt, (S, P1, P2, P3) => {
        const pts = [S, P1, P2, P3];
        for (let i = 0; i < 4; i++)
          for (let j = i + 1; j < 4; j++)
            fc.pre(pts[i]!.x !== pts[j]!.x || pts[i]!.y !== pts[j]!.y);
        const { angles, danger, collinear } = synth(S, [P1, P2, P3]);
        fc.pre(!collinear && danger > 0.05);
        const r = resection(A, { control: [P1, P2, P3], angles });
        const size = 1 + Math.max(...pts.flatMap((p) => [Math.abs(p.x), Math.abs(p.y)]));
        const err = Math.hypot(A.toNumber(r.station.x) - S.x, A.toNumber(r.station.y) - S.y);
        expect(err).toBeLessThan((bound * size) / Math.min(danger, 1));
      }),
      { numRuns: 40 },
    );
  });
});

describe.each([
  ['rational', rational as Arithmetic<unknown, boolean>],
  ['decimal(34)', decimal(34) as Arithmetic<unknown, boolean>],
  ['float', float as Arithmetic<unknown, boolean>],
])('resection(%s, …) on the danger circle', (_name, A) => {
  const C: [XY, XY, XY] = [
    { x: 0, y: 100 },
    { x: 100, y: 0 },
    { x: 0, y: -100 },
  ];
  it('refuses a station on the circle through the control points with DANGER_CIRCLE', () => {
    const { angles } = synth({ x: -100, y: 0 }, C);
    expect(code(() => resection(A, { control: C, angles }))).toBe('DANGER_CIRCLE');
    expect(() => resection(A, { control: C, angles })).toThrow(/danger circle/);
  });

  it(`refuses a station within the default tolerance ${DANGER_CIRCLE_TOLERANCE} (|Q(O,S) − R²|/R² ≈ 0.01) and accepts it with a smaller one`, () => {
    const S = { x: -100.5, y: 0 };
    const { angles } = synth(S, C);
    expect(code(() => resection(A, { control: C, angles }))).toBe('DANGER_CIRCLE');
    const r = resection(A, { control: C, angles, dangerTolerance: '0.001' });
    expect(Math.abs(A.toNumber(r.station.x) - S.x)).toBeLessThan(1e-6);
    expect(A.toNumber(r.dangerRatio)).toBeCloseTo(0.010025, 6);
  });

  it('refuses angles that no station sees (a 180° blunder, or a12 = 0° where P1 and P2 cannot line up) with NO_REAL_SOLUTION', () => {
    // Tienstra's cotangents do not change when an angle gains 180°: without the check the
    // station S itself would come back for the blundered angles.
    const S = { x: -30, y: 20 };
    const [a12, a23] = synth(S, C).angles.map(Number) as [number, number];
    const good = resection(A, { control: C, angles: [a12, a23] });
    expect(
      Math.hypot(A.toNumber(good.station.x) - S.x, A.toNumber(good.station.y) - S.y),
    ).toBeLessThan(1e-6);
    expect(code(() => resection(A, { control: C, angles: [(a12 + 180) % 360, a23] }))).toBe(
      'NO_REAL_SOLUTION',
    );
    expect(code(() => resection(A, { control: C, angles: [a12, (a23 + 180) % 360] }))).toBe(
      'NO_REAL_SOLUTION',
    );
    // P1 (0, 100), P2 (100, 0), P3 (0, −50): a12 = 0 puts S on line P1P2 beyond P1 or P2, from
    // where P3 is never 90° clockwise of P2 (worked by hand); the candidate is (75, 25), where a12 = 180°.
    expect(
      code(() =>
        resection(A, {
          control: [
            { x: 0, y: 100 },
            { x: 100, y: 0 },
            { x: 0, y: -50 },
          ],
          angles: [0, 90],
        }),
      ),
    ).toBe('NO_REAL_SOLUTION');
  });

  it('refuses collinear control with COLLINEAR_POINTS, bad angles with INVALID_ANGLE, wrong shapes with INVALID_ARGUMENT', () => {
    expect(
      code(() =>
        resection(A, {
          control: [
            { x: 0, y: 0 },
            { x: 1, y: 1 },
            { x: 2, y: 2 },
          ],
          angles: [30, 40],
        }),
      ),
    ).toBe('COLLINEAR_POINTS');
    expect(code(() => resection(A, { control: C, angles: [30, 'forty'] }))).toBe('INVALID_ANGLE');
    expect(code(() => resection(A, { control: C, angles: [30, 360] }))).toBe('INVALID_ANGLE');
    expect(code(() => resection(A, { control: [C[0], C[1]] as never, angles: [30, 40] }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => resection(A, { control: C, angles: [30] as never }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => resection(A, { control: [C[0], C[0], C[2]], angles: [30, 40] }))).toBe(
      'COINCIDENT_POINTS',
    );
  });
});
