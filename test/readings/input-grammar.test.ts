// One input grammar for the library and the job file: lengths with units in text, standard
// uncertainties (a number in the unit of its value, arc-seconds for angles, a value with its own
// unit, { constant, ppm }), DD.MMSS only when asked, sides and angles in solveTriangle.
// Expected values: the unit definitions of the Federal Register 85(193), 2020 (international
// foot 0.3048 m, U.S. survey foot 1200/3937 m), worked by hand or with Math.* here.
import { describe, expect, it } from 'vitest';
import {
  angleSigma,
  angleToDegrees,
  decimal,
  float,
  formatDms,
  lengthIn,
  lengthSigma,
  lengthToMetres,
  rational,
  solveTriangle,
  QuadspreadError,
} from '../../src/index.js';

const R = rational;
const code = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    return (e as QuadspreadError).code;
  }
  return 'no error';
};

describe('lengths with units in text', () => {
  it.each([
    ['250.00 ft', '76.2'], // 250 × 0.3048
    ['250 us-ft', String(250 * (1200 / 3937))],
    ['3 mm', '0.003'],
    ['12 cm', '0.12'],
    ['2 ch', '40.2336'], // 2 × 66 × 0.3048
    ['1.5 km', '1500'],
    ['1/4 mi', '402.336'], // 1609.344 / 4
  ])('lengthToMetres reads %s as %s m', (text, metres) => {
    expect(R.toNumber(lengthToMetres(R, text))).toBeCloseTo(Number(metres), 12);
    expect(float.toNumber(lengthToMetres(float, text))).toBeCloseTo(Number(metres), 9);
  });

  it('keeps the U.S. survey foot distinct from the international foot, exactly', () => {
    const d = R.sub(lengthToMetres(R, '1000000 us-ft'), lengthToMetres(R, '1000000 ft'));
    // 10⁶ × (1200/3937 − 0.3048) = 10⁶ × 0.0000006096012… m ≈ 0.6096 m
    expect(R.toString(d)).toBe('2400/3937');
  });

  it('reads a bare number in the given unit, and converts text into any unit with lengthIn', () => {
    expect(R.toString(lengthToMetres(R, 100, 'ft'))).toBe('762/25');
    expect(R.toString(lengthIn(R, '30.48 m', 'ft'))).toBe('100');
    expect(R.toString(lengthIn(R, 7, 'ft'))).toBe('7');
  });

  it('refuses an unknown unit with INVALID_UNIT, text that is not a length with INVALID_NUMBER', () => {
    expect(code(() => lengthToMetres(R, '3 yards'))).toBe('INVALID_UNIT');
    expect(code(() => lengthIn(R, 'ft 3'))).toBe('INVALID_NUMBER');
  });
});

describe('standard uncertainties: one rule', () => {
  it('a length σ is a number in the unit of its value, or text with its own unit', () => {
    expect(R.toString(lengthSigma(R, 0.01, 'ft'))).toBe('1/100');
    expect(R.toString(lengthSigma(R, '3 mm', 'ft'))).toBe(
      R.toString(R.div(R.from('0.003'), R.from('0.3048'))),
    );
  });

  it('{ constant, ppm } is √(constant² + (ppm·10⁻⁶·d)²), checked with Math.hypot', () => {
    const s = lengthSigma(float, { constant: '2 mm', ppm: 3 }, 'm', 1234.5);
    expect(s).toBeCloseTo(Math.hypot(0.002, 3e-6 * 1234.5), 15);
    const D = decimal(40);
    const t = lengthSigma(D, { constant: '0.01 ft', ppm: 2 }, 'ft', 5000);
    expect(Number(D.toString(t))).toBeCloseTo(Math.hypot(0.01, 2e-6 * 5000), 15);
    expect(code(() => lengthSigma(R, { constant: 1, ppm: 2 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => lengthSigma(R, '-3 mm'))).toBe('INVALID_SIGMA');
  });

  it('an angle σ is a number in arc-seconds, or text with its own unit', () => {
    expect(R.toString(angleSigma(R, 3))).toBe('1/1200');
    expect(R.toString(angleSigma(R, '3"'))).toBe('1/1200');
    expect(R.toString(angleSigma(R, `0°00'03"`))).toBe('1/1200');
    expect(R.toString(angleSigma(R, '10 mgon'))).toBe('9/1000'); // 1 mgon = 0.0009°
    expect(code(() => angleSigma(R, -1))).toBe('INVALID_SIGMA');
  });
});

describe('DD.MMSS only when asked', () => {
  it.each([
    [36.5027, 36, 50, 27],
    ['36.5027', 36, 50, 27],
    [36.5, 36, 50, 0],
    [36.05, 36, 5, 0],
    ['359.595999', 359, 59, 59.99],
    [-12.3015, -12, -30, -15],
  ] as const)('%s is %s° %s′ %s″', (packed, d, m, s) => {
    const want = d + m / 60 + s / 3600;
    expect(R.toNumber(angleToDegrees(R, packed, { format: 'dd.mmss' }))).toBeCloseTo(want, 12);
  });

  it('reads the same number as decimal degrees unless asked', () => {
    expect(R.toString(angleToDegrees(R, 36.5027))).toBe('365027/10000');
  });

  it('refuses minutes or seconds of 60 or more', () => {
    expect(code(() => angleToDegrees(R, 36.6027, { format: 'dd.mmss' }))).toBe('INVALID_ANGLE');
    expect(code(() => angleToDegrees(R, '36.5060', { format: 'dd.mmss' }))).toBe('INVALID_ANGLE');
    expect(code(() => angleToDegrees(R, 36.5, { format: 'packed' as never }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});

describe('formatDms near a full turn', () => {
  it('writes an angle under 360° that rounds to 360° as 0°', () => {
    expect(formatDms(R, 359.99999999)).toBe(`0°00'00.0"`);
    expect(formatDms(float, 359.99999999, 0)).toBe(`0°00'00"`);
    expect(formatDms(R, 360)).toBe(`360°00'00.0"`);
  });
});

describe('solveTriangle with sides and angles', () => {
  it('gives the 13-14-15 triangle from its sides, in feet and metres alike', () => {
    // Heron: area 84, so quadrea 16·84² = 112896; in m² from feet: × 0.3048⁴.
    const [t] = solveTriangle(R, { side1: 13, side2: 14, side3: 15 });
    expect(t!.quadrea.toString()).toBe('112896');
    const [f] = solveTriangle(R, { side1: '13 ft', side2: '14 ft', side3: '15 ft' });
    expect(
      Number(f!.quadrea.toString().split('/')[0]) / Number(f!.quadrea.toString().split('/')[1]),
    ).toBeCloseTo(112896 * 0.3048 ** 4, 9);
  });

  it('keeps only the triangle whose given angle is obtuse, as given', () => {
    // Sides 5 and 8 with 120° between them: Q3 = 25 + 64 + 40 = 129 (cosine rule, by hand).
    const got = solveTriangle(float, { side1: 5, side2: 8, angle3: 120 });
    expect(got).toHaveLength(1);
    expect(got[0]!.Q3 as number).toBeCloseTo(129, 9);
    const acute = solveTriangle(float, { side1: 5, side2: 8, angle3: 60 });
    expect(acute).toHaveLength(1);
    expect(acute[0]!.Q3 as number).toBeCloseTo(49, 9);
    // Given as spreads, the angle and its supplement are the same: both triangles.
    expect(solveTriangle(float, { Q1: 25, Q2: 64, s3: 0.75 })).toHaveLength(2);
  });

  it('refuses a side and its quadrance together, and an angle outside (0°, 180°)', () => {
    expect(code(() => solveTriangle(R, { side1: 3, Q1: 9, side2: 4 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => solveTriangle(R, { side1: 3, side2: 4, angle3: 180 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => solveTriangle(R, { side1: 3, side2: 4, base: 5 } as never))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});
