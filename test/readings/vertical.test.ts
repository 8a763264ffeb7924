// Signed vertical readings: elevation and zenith angles, slopes, and their sign.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, float, QuadspreadError } from '../../src/index.js';
import {
  vertical,
  verticalFromAngle,
  verticalFromRatio,
  verticalFromSlope,
  elevationFromVertical,
  zenithFromVertical,
  zenithToElevation,
  readVertical,
} from '../../src/readings/vertical.js';

const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};
const show = (v: { spread: unknown; sign: number }) => [
  rational.toString(v.spread as never),
  v.sign,
];

describe('verticalFromAngle keeps the side of the horizon', () => {
  it('an elevation angle of −30° is spread 1/4 below the horizon', () => {
    expect(show(verticalFromAngle(rational, -30))).toEqual(['1/4', -1]);
  });
  it('a zenith angle of 60° is spread 1/4 above, 120° the same spread below, 90° is level', () => {
    expect(show(verticalFromAngle(rational, 60, { kind: 'zenith' }))).toEqual(['1/4', 1]);
    expect(show(verticalFromAngle(rational, '120', { kind: 'zenith' }))).toEqual(['1/4', -1]);
    expect(show(verticalFromAngle(rational, 90, { kind: 'zenith' }))).toEqual(['0', 0]);
  });
  it('a zenith angle in gons: 150 gon is 45° below the horizon', () => {
    expect(show(verticalFromAngle(rational, 150, { kind: 'zenith', unit: 'gon' }))).toEqual([
      '1/2',
      -1,
    ]);
  });
  it('float: the spread is sin²α of the elevation angle and cos²z of the zenith angle (Math.sin, Math.cos)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 180, noNaN: true }), (z) => {
        const v = verticalFromAngle(float, z, { kind: 'zenith' });
        expect(Math.abs(v.spread - Math.cos((z * Math.PI) / 180) ** 2)).toBeLessThan(1e-15);
        if (z < 89.999) expect(v.sign).toBe(1);
        if (z > 90.001) expect(v.sign).toBe(-1);
      }),
    );
  });
  it('round-trips through elevationFromVertical and zenithFromVertical (float, 1e-9°)', () => {
    fc.assert(
      fc.property(fc.double({ min: -90, max: 90, noNaN: true }), (a) => {
        const v = verticalFromAngle(float, a);
        expect(Math.abs(elevationFromVertical(float, v) - a)).toBeLessThan(1e-6);
        expect(Math.abs(zenithFromVertical(float, v) - (90 - a))).toBeLessThan(1e-6);
      }),
    );
  });
  it('rational: exact angles come back exactly (−45° ↔ spread 1/2 below)', () => {
    expect(
      rational.toString(elevationFromVertical(rational, verticalFromAngle(rational, -45))),
    ).toBe('-45');
    expect(
      rational.toString(
        zenithFromVertical(rational, verticalFromAngle(rational, 150, { kind: 'zenith' })),
      ),
    ).toBe('150');
    expect(rational.toString(zenithToElevation(rational, 95))).toBe('-5');
  });
  it('refuses angles outside the range of their kind, unknown kinds and units', () => {
    expect(codeOf(() => verticalFromAngle(rational, 91))).toBe('INVALID_ANGLE');
    expect(codeOf(() => verticalFromAngle(rational, -1, { kind: 'zenith' }))).toBe('INVALID_ANGLE');
    expect(codeOf(() => verticalFromAngle(rational, 181, { kind: 'zenith' }))).toBe(
      'INVALID_ANGLE',
    );
    expect(codeOf(() => verticalFromAngle(rational, 10, { kind: 'nadir' as never }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => verticalFromAngle(rational, 10, { unit: 'turn' as never }))).toBe(
      'INVALID_UNIT',
    );
  });
});

describe('slopes as signed readings', () => {
  const table: [string, string, number][] = [
    ['5%', '1/401', 1],
    ['-2.5 %', '1/1601', -1],
    ['12‰', '9/62509', 1],
    ['1:200', '1/40001', 1],
    ['-1 in 20', '1/401', -1],
    ['1 IN 7', '1/50', 1],
    ['0%', '0', 0],
  ];
  for (const [text, s, sign] of table) {
    it(`${JSON.stringify(text)} is spread ${s}, sign ${sign}`, () => {
      expect(show(verticalFromSlope(rational, text))).toEqual([s, sign]);
    });
  }
  it('verticalFromRatio takes the sign of rise over run', () => {
    expect(show(verticalFromRatio(rational, -3, 4))).toEqual(['9/25', -1]);
    expect(show(verticalFromRatio(rational, 3, -4))).toEqual(['9/25', -1]);
    expect(show(verticalFromRatio(rational, 2, 0))).toEqual(['1', 1]);
  });
  it('bad slope text throws INVALID_SLOPE', () => {
    for (const t of ['steep', '5', '5%%', '1 in 0', '1:0', '1 in', '% 5', 'in 5'])
      expect(codeOf(() => verticalFromSlope(rational, t))).toBe('INVALID_SLOPE');
    expect(codeOf(() => verticalFromSlope(rational, '1'.repeat(1200) + '%'))).toBe(
      'INPUT_TOO_LONG',
    );
  });
});

describe("vertical(A, spread, sign) and the solvers' reading of vertical inputs", () => {
  it('a bare spread is read as a sight above the horizon', () => {
    expect(show(readVertical(rational, '1/9', 'f(v)'))).toEqual(['1/9', 1]);
    expect(show(readVertical(rational, 0, 'f(v)'))).toEqual(['0', 0]);
  });
  it('a reading object keeps its sign; a zero spread has sign 0', () => {
    expect(
      show(readVertical(rational, { spread: rational.from('1/9'), sign: -1 }, 'f(v)')),
    ).toEqual(['1/9', -1]);
    expect(show(vertical(rational, 0, -1))).toEqual(['0', 0]);
  });
  it('refuses spreads outside [0, 1] and signs that are not ±1, naming the input', () => {
    expect(codeOf(() => vertical(rational, '9/8'))).toBe('SPREAD_OUT_OF_RANGE');
    expect(codeOf(() => vertical(rational, '1/8', 2 as never))).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        readVertical(rational, { spread: rational.from('1/8'), sign: 0 }, 'solver(vertical)'),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(() => readVertical(rational, -1, 'solver(vertical)')).toThrow(/solver\(vertical\).*-1/);
  });
});
