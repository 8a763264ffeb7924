// Angle readings: DMS text, units, and the errors for bad text.
import { describe, expect, it } from 'vitest';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import { angleToDegrees, degreesToUnit } from '../../src/readings/angle.js';

const arithmetics: Arithmetic<unknown>[] = [
  rational as Arithmetic<unknown>,
  decimal(40) as Arithmetic<unknown>,
  float as Arithmetic<unknown>,
];

// Expected values worked by hand: D + M/60 + S/3600 (the sexagesimal definition).
const dmsTable: { input: string | number; expected: string }[] = [
  { input: `12°34'56.7"`, expected: '12.582416666666666666666666666666666666667' },
  { input: '12 34 56.7', expected: '12.582416666666666666666666666666666666667' },
  { input: '12:34:56.7', expected: '12.582416666666666666666666666666666666667' },
  { input: `12°30'`, expected: '12.5' },
  { input: `-12°30'`, expected: '-12.5' },
  { input: `12°30'S`, expected: '-12.5' },
  { input: `W 0°30'`, expected: '-0.5' },
  { input: `45°N`, expected: '45' },
  { input: `12°30′36″`, expected: '12.51' },
  { input: `30'`, expected: '0.5' },
  { input: `36"`, expected: '0.01' },
  { input: `12.5°`, expected: '12.5' },
  { input: `N 45°30' E`, expected: '45.5' },
  { input: `S 45°30' E`, expected: '134.5' },
  { input: `S 45°30' W`, expected: '225.5' },
  { input: `N 45°30' W`, expected: '314.5' },
  { input: '-7.25', expected: '-7.25' },
  { input: 33, expected: '33' },
];

describe('angleToDegrees(A, reading) reads field-book DMS text', () => {
  for (const A of arithmetics) {
    for (const { input, expected } of dmsTable) {
      it(`${A.name}: ${JSON.stringify(input)} is ${expected}°`, () => {
        const got = angleToDegrees(A, input as never);
        const rel =
          Math.abs(A.toNumber(got) - Number(expected)) / Math.max(1, Math.abs(Number(expected)));
        expect(rel).toBeLessThan(1e-15);
      });
    }
  }
  it('rational: the DMS value is exact (12°34\'56.7" = 12 + 34/60 + 56.7/3600)', () => {
    expect(rational.toString(angleToDegrees(rational, `12°34'56.7"`))).toBe(
      rational.toString(
        rational.add(
          rational.from(12),
          rational.add(rational.from('34/60'), rational.from('56.7/3600')),
        ),
      ),
    );
  });
});

describe('angleToDegrees(A, reading, unit) converts gons, mils and radians', () => {
  it('100 gon is 90° exactly (ISO 80000-3:2006, item 3-5.e: 1 gon = 0.9°)', () => {
    expect(rational.toString(angleToDegrees(rational, 100, 'gon'))).toBe('90');
    expect(rational.toString(angleToDegrees(rational, '1', 'gon'))).toBe('9/10');
  });
  it('1600 mil is 90° exactly (6400 mil to the turn, NATO practice)', () => {
    expect(rational.toString(angleToDegrees(rational, 1600, 'mil'))).toBe('90');
  });
  it('1 rad is 57.29577951308232…° (independent: 180/Math.PI)', () => {
    for (const A of arithmetics)
      expect(A.toNumber(angleToDegrees(A, 1, 'rad'))).toBeCloseTo(180 / Math.PI, 12);
  });
  it('degreesToUnit inverts angleToDegrees for gon and mil exactly', () => {
    for (const u of ['deg', 'gon', 'mil'] as const) {
      const x = rational.from('123.456789');
      expect(rational.eq(degreesToUnit(rational, angleToDegrees(rational, x, u), u), x)).toBe(true);
    }
  });
});

describe('angleToDegrees refuses bad readings with typed errors', () => {
  const bad: { input: unknown; unit?: string; code: string }[] = [
    { input: `12°60'`, code: 'INVALID_ANGLE' },
    { input: '12 75 10', code: 'INVALID_ANGLE' },
    { input: `12°30'60"`, code: 'INVALID_ANGLE' },
    { input: `12°30'61.5"`, code: 'INVALID_ANGLE' },
    { input: `12.5°30'`, code: 'INVALID_ANGLE' },
    { input: `30'12°`, code: 'INVALID_ANGLE' },
    { input: 'twelve degrees', code: 'INVALID_ANGLE' },
    { input: '', code: 'INVALID_ANGLE' },
    { input: `-12°30'S`, code: 'INVALID_ANGLE' },
    { input: `E 45 N`, code: 'INVALID_ANGLE' },
    { input: `N 95 E`, code: 'INVALID_ANGLE' },
    { input: `12 30 00`, unit: 'gon', code: 'INVALID_ANGLE' },
    { input: 12, unit: 'grad', code: 'INVALID_UNIT' },
    { input: Number.NaN, code: 'INVALID_NUMBER' },
    { input: Infinity, code: 'INVALID_NUMBER' },
    { input: '1'.repeat(2000) + '°', code: 'INPUT_TOO_LONG' },
  ];
  for (const { input, unit, code } of bad) {
    it(`${JSON.stringify(String(input).slice(0, 30))}${unit ? ` in ${unit}` : ''} throws ${code}`, () => {
      let err: unknown;
      try {
        angleToDegrees(rational, input as never, unit as never);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(QuadspreadError);
      expect((err as QuadspreadError).code).toBe(code);
    });
  }
  it('the message names the input and the minutes at fault', () => {
    expect(() => angleToDegrees(rational, `12°60'`)).toThrow(
      /angleToDegrees\(reading\).*12°60'.*minutes 60/,
    );
  });
});
