// heightFromBase: a measured base, horizontal spreads at both stations, and the foot's side.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import { heightFromBase } from '../../src/elevation/base.js';
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
const q = (dx: ReturnType<typeof R.from>, dy: ReturnType<typeof R.from>) =>
  R.add(R.mul(dx, dx), R.mul(dy, dy));

/** An exact configuration: stations (0, 0) and (b, 0), foot (x, y), height quadrance H. */
function config(b: number, x: string, y: string, H: string) {
  const B = R.from(b),
    X = R.from(x),
    Y = R.from(y),
    h = R.from(H);
  const Q1 = q(X, Y);
  const Q2 = q(R.sub(B, X), Y);
  return {
    Q1,
    Q2,
    H: h,
    // spread between the base (along x) and the line to the foot: y²/Q (derived from the definition)
    spreads: [R.div(R.mul(Y, Y), Q1), R.div(R.mul(Y, Y), Q2)] as const,
    vertical: [R.div(h, R.add(h, Q1)), R.div(h, R.add(h, Q2))] as const,
    base: R.mul(B, B),
  };
}

describe('heightFromBase recovers exact configurations on both sides of the ambiguity', () => {
  it("'between': the foot projects between the stations (x in (0, b))", () => {
    const c = config(14, '5', '12', '50');
    const r = heightFromBase(R, {
      base: c.base,
      spreads: c.spreads,
      foot: 'between',
      vertical: c.vertical,
    });
    expect(r.horizontal[0].eq(c.Q1) && r.horizontal[1].eq(c.Q2)).toBe(true);
    expect(r.H.toString()).toBe('50');
    expect(r.discrepancy!.isZero()).toBe(true);
  });
  it("'beyond': the foot projects beyond the second station (x > b)", () => {
    const c = config(4, '9', '12', '7/3');
    const r = heightFromBase(R, {
      base: c.base,
      spreads: c.spreads,
      foot: 'beyond',
      vertical: c.vertical,
    });
    expect(r.horizontal[0].eq(c.Q1) && r.horizontal[1].eq(c.Q2)).toBe(true);
    expect(r.H.toString()).toBe('7/3');
  });
  it('the wrong side flag gives a different (wrong) triangle, so the flag matters', () => {
    const c = config(14, '5', '12', '50');
    const wrong = heightFromBase(R, {
      base: c.base,
      spreads: c.spreads,
      foot: 'beyond',
      vertical: c.vertical,
    });
    expect(wrong.horizontal[0].eq(c.Q1)).toBe(false);
  });
  it('random exact configurations on either side come back exactly (rational), H from one reading', () => {
    const int = (lo: number, hi: number) => fc.integer({ min: lo, max: hi });
    fc.assert(
      fc.property(int(1, 500), int(-2000, 2000), int(1, 2000), int(1, 10 ** 6), (b, x, y, H) => {
        fc.pre(x !== 0 && x !== b && 2 * x !== b);
        const c = config(b, String(x), String(y), String(H));
        const side = x > 0 && x < b ? 'between' : 'beyond';
        const r = heightFromBase(R, {
          base: c.base,
          spreads: c.spreads,
          foot: side,
          vertical: [c.vertical[0], undefined],
        });
        expect(r.horizontal[0].eq(c.Q1) && r.horizontal[1].eq(c.Q2)).toBe(true);
        expect(r.H.eq(c.H)).toBe(true);
        expect(r.heights[1]).toBeUndefined();
      }),
      { numRuns: 60 },
    );
  });
});

describe('heightFromBase with horizontal angles (float, classical sine rule with Math.sin)', () => {
  // Invented demo geometry: base 250 m, interior angles at the stations, elevation angle at station 1.
  const cases: [number, number, string][] = [
    [52, 71, 'between'],
    [118, 23, 'beyond'],
    [30, 135, 'beyond'],
  ];
  for (const [a1, a2, side] of cases) {
    it(`angles ${a1}° and ${a2}° (${side}) match D₁ = b·sin α₂/sin(α₁ + α₂) and h = D₁·tan ε`, () => {
      const b = 250;
      const rad = Math.PI / 180;
      const D1 = (b * Math.sin(a2 * rad)) / Math.sin((a1 + a2) * rad);
      const D2 = (b * Math.sin(a1 * rad)) / Math.sin((a1 + a2) * rad);
      const eps = 8.5;
      const r = heightFromBase(float, {
        base: b * b,
        angles: [a1, a2],
        vertical: [verticalFromAngle(float, eps), undefined],
      });
      expect(Math.sqrt(r.horizontal[0])).toBeCloseTo(D1, 8);
      expect(Math.sqrt(r.horizontal[1])).toBeCloseTo(D2, 8);
      expect(Math.sqrt(r.H)).toBeCloseTo(D1 * Math.tan(eps * rad), 8);
    });
  }
  it('decimal(40) agrees with the classical values too', () => {
    const D = decimal(40);
    const b = 250,
      a1 = 118,
      a2 = 23,
      rad = Math.PI / 180;
    const D1 = (b * Math.sin(a2 * rad)) / Math.sin((a1 + a2) * rad);
    const r = heightFromBase(D, {
      base: b * b,
      angles: [a1, a2],
      vertical: [verticalFromAngle(D, 8.5), undefined],
    });
    expect(Math.sqrt(D.toNumber(r.horizontal[0]))).toBeCloseTo(D1, 9);
    expect(Math.sqrt(D.toNumber(r.H))).toBeCloseTo(D1 * Math.tan(8.5 * rad), 9);
  });
  it('two readings are combined by weight and their discrepancy reported', () => {
    const b = 250,
      a1 = 52,
      a2 = 71,
      rad = Math.PI / 180,
      h = 40;
    const D1 = (b * Math.sin(a2 * rad)) / Math.sin((a1 + a2) * rad);
    const D2 = (b * Math.sin(a1 * rad)) / Math.sin((a1 + a2) * rad);
    const v1 = verticalFromAngle(float, Math.atan2(h, D1) / rad);
    const v2 = verticalFromAngle(float, Math.atan2(h, D2) / rad + 0.01);
    const r = heightFromBase(float, { base: b * b, angles: [a1, a2], vertical: [v1, v2] });
    expect(Math.sqrt(r.heights[0]!)).toBeCloseTo(h, 8);
    expect(r.discrepancy).toBeLessThan(0);
    expect(Math.sqrt(r.H)).toBeGreaterThan(h);
    expect(Math.sqrt(r.H)).toBeLessThan(Math.sqrt(r.heights[1]!));
  });
});

describe('heightFromBase refuses what it cannot solve', () => {
  const ok = {
    base: 196,
    spreads: ['144/169', '16/25'] as const,
    vertical: ['1/2', undefined] as const,
  };
  it('a missing or unknown foot flag with spreads', () => {
    expect(codeOf(() => heightFromBase(R, ok as never))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => heightFromBase(R, { ...ok, foot: 'left' as never }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
  it('both spreads and angles, or neither', () => {
    expect(codeOf(() => heightFromBase(R, { ...ok, foot: 'between', angles: [40, 50] }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => heightFromBase(R, { base: 196, vertical: ['1/2', undefined] }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
  it('a zero spread, equal spreads beyond, angles summing to 180° or more', () => {
    expect(codeOf(() => heightFromBase(R, { ...ok, spreads: [0, '1/2'], foot: 'between' }))).toBe(
      'COLLINEAR_POINTS',
    );
    expect(
      codeOf(() => heightFromBase(R, { ...ok, spreads: ['1/2', '1/2'], foot: 'beyond' })),
    ).toBe('DEGENERATE_TRIANGLE');
    expect(
      codeOf(() =>
        heightFromBase(float, { base: 100, angles: [100, 80], vertical: [0.1, undefined] }),
      ),
    ).toBe('DEGENERATE_TRIANGLE');
    expect(
      codeOf(() =>
        heightFromBase(float, { base: 100, angles: [0, 80], vertical: [0.1, undefined] }),
      ),
    ).toBe('INVALID_ANGLE');
  });
  it('no vertical reading, readings on both sides, a plumb sight, a spread out of range', () => {
    expect(
      codeOf(() => heightFromBase(R, { ...ok, foot: 'between', vertical: [undefined, undefined] })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        heightFromBase(R, {
          ...ok,
          foot: 'between',
          vertical: ['1/2', { spread: R.from('1/3'), sign: -1 }],
        }),
      ),
    ).toBe('INCONSISTENT_READINGS');
    expect(
      codeOf(() => heightFromBase(R, { ...ok, foot: 'between', vertical: [1, undefined] })),
    ).toBe('VERTICAL_SIGHT');
    expect(
      codeOf(() => heightFromBase(R, { ...ok, spreads: ['3/2', '1/2'], foot: 'between' })),
    ).toBe('SPREAD_OUT_OF_RANGE');
    expect(codeOf(() => heightFromBase(R, { ...ok, base: 0, foot: 'between' }))).toBe(
      'COINCIDENT_POINTS',
    );
  });
});
