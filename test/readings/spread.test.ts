// Angles to spreads and back; sines and cosines in degrees; slopes; DMS text out.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import { sinCosDegrees } from '../../src/readings/trig.js';
import { spreadFromDegrees, degreesFromSpread } from '../../src/readings/spread.js';
import { formatDms } from '../../src/readings/dms.js';
import { angleToDegrees } from '../../src/readings/angle.js';
import {
  spreadFromRatio,
  spreadFromGrade,
  spreadFromPerMille,
  spreadFromOneIn,
  gradeSquaredFromSpread,
} from '../../src/readings/slope.js';

const arithmetics: Arithmetic<unknown>[] = [
  rational as Arithmetic<unknown>,
  decimal(40) as Arithmetic<unknown>,
  float as Arithmetic<unknown>,
];
const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};

// Independent high-precision reference: mathjs BigNumber at 60 digits.
const M = create(all!, { number: 'BigNumber', precision: 60 });
const refSin2 = (deg: string): string => {
  const r = M.divide(M.multiply(M.bignumber(deg), M.pi), 180);
  const s = M.sin(r as never);
  return M.format(M.multiply(s, s), { notation: 'fixed', precision: 55 }) as string;
};

describe('sinCosDegrees(A, θ) is exact where the value is rational', () => {
  const exact: [number, string, string][] = [
    [0, '0', '1'],
    [90, '1', '0'],
    [180, '0', '-1'],
    [270, '-1', '0'],
    [360, '0', '1'],
    [-90, '-1', '0'],
    [450, '1', '0'],
    [30, '1/2', ''],
    [150, '1/2', ''],
    [210, '-1/2', ''],
    [330, '-1/2', ''],
    [-30, '-1/2', ''],
    [60, '', '1/2'],
    [120, '', '-1/2'],
    [240, '', '-1/2'],
    [300, '', '1/2'],
  ];
  for (const [deg, s, c] of exact) {
    it(`rational: sin ${deg}° = ${s || '(irrational)'}, cos ${deg}° = ${c || '(irrational)'}`, () => {
      const r = sinCosDegrees(rational, deg);
      if (s) expect(rational.toString(r.sin)).toBe(s);
      if (c) expect(rational.toString(r.cos)).toBe(c);
      // whatever is irrational is still close to the classical value (Math.sin)
      expect(rational.toNumber(r.sin)).toBeCloseTo(Math.sin((deg * Math.PI) / 180), 14);
      expect(rational.toNumber(r.cos)).toBeCloseTo(Math.cos((deg * Math.PI) / 180), 14);
    });
  }
  it('agrees with Math.sin / Math.cos on random angles in every arithmetic (1e-14)', () => {
    fc.assert(
      fc.property(fc.double({ min: -720, max: 720, noNaN: true }), (deg) => {
        for (const A of arithmetics) {
          const r = sinCosDegrees(A, deg);
          expect(Math.abs(A.toNumber(r.sin) - Math.sin((deg * Math.PI) / 180))).toBeLessThan(1e-13);
          expect(Math.abs(A.toNumber(r.cos) - Math.cos((deg * Math.PI) / 180))).toBeLessThan(1e-13);
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('sinCosDegrees(A, θ) with very large angles', () => {
  it('rational reduces exactly: 10³⁰° ≡ 280° (mod 360, by hand: 10³⁰ ≡ 0 mod 8 and ≡ 10 mod 45)', () => {
    const r = sinCosDegrees(rational, '1e30');
    expect(rational.eq(r.sin, sinCosDegrees(rational, 280).sin)).toBe(true);
    expect(rational.toNumber(r.cos)).toBeCloseTo(Math.cos((280 * Math.PI) / 180), 15);
  });
  it('float agrees with Math.sin of the exact JS remainder (x % 360) up to 10¹²°', () => {
    for (const x of [1000.1, -123456.789, 3e12 + 0.5, -7.77e11]) {
      expect(sinCosDegrees(float, x).sin).toBeCloseTo(Math.sin(((x % 360) * Math.PI) / 180), 12);
    }
  });
  it('an angle the arithmetic cannot reduce is refused with INVALID_ANGLE (float returned sin 0, cos 1 for 1e300; decimal hung)', () => {
    expect(codeOf(() => sinCosDegrees(float, 1e300))).toBe('INVALID_ANGLE');
    expect(codeOf(() => sinCosDegrees(float, -1e17))).toBe('INVALID_ANGLE');
    expect(codeOf(() => sinCosDegrees(decimal(10), 1e300))).toBe('INVALID_ANGLE');
    expect(codeOf(() => spreadFromDegrees(float, 1e300))).toBe('INVALID_ANGLE');
    expect(() => sinCosDegrees(float, 1e300)).toThrow(/sinCosDegrees\(degrees\).*1e\+300/);
  });
});

describe('spreadFromDegrees(A, θ) is sin²θ', () => {
  const exact: [number | string, string][] = [
    [0, '0'],
    [30, '1/4'],
    [45, '1/2'],
    [60, '3/4'],
    [90, '1'],
    [135, '1/2'],
    [-45, '1/2'],
    [120, '3/4'],
    [-150, '1/4'],
    [180, '0'],
    ['45°', '1/2'],
  ];
  for (const [deg, s] of exact) {
    it(`rational: the spread of ${deg}° is ${s} exactly`, () => {
      expect(rational.toString(spreadFromDegrees(rational, deg))).toBe(s);
    });
  }
  it('50 gon is spread 1/2 and 1600 mil is spread 1, exactly', () => {
    expect(rational.toString(spreadFromDegrees(rational, 50, 'gon'))).toBe('1/2');
    expect(rational.toString(spreadFromDegrees(rational, 1600, 'mil'))).toBe('1');
  });
  it('float agrees with Math.sin(θ)² on random angles (1e-15 absolute)', () => {
    fc.assert(
      fc.property(fc.double({ min: -360, max: 360, noNaN: true }), (deg) => {
        const want = Math.sin((deg * Math.PI) / 180) ** 2;
        expect(Math.abs(float.toNumber(spreadFromDegrees(float, deg)) - want)).toBeLessThan(1e-15);
      }),
    );
  });
  it('rational is within 1e-20 relative of mathjs BigNumber sin² (60 digits)', () => {
    for (const deg of [
      '1',
      '12.582416666666666',
      '0.0001',
      '89.9999',
      '37',
      '179.5',
      '-71.25',
      '1e-6',
    ]) {
      const got = M.bignumber(rational.toPrecision(spreadFromDegrees(rational, deg), 45));
      const ref = M.bignumber(refSin2(deg));
      expect(Number(M.abs(M.divide(M.subtract(got, ref), ref)))).toBeLessThan(1e-20);
    }
  });
  it('rational radians and gons are within 1e-20 relative of mathjs BigNumber (60 digits)', () => {
    const rel = (got: string, ref: unknown) =>
      Number(M.abs(M.divide(M.subtract(M.bignumber(got), ref as never), ref as never)));
    expect(
      rel(rational.toPrecision(angleToDegrees(rational, '1', 'rad'), 45), M.divide(180, M.pi)),
    ).toBeLessThan(1e-20);
    const s05 = M.sin(M.bignumber('0.5'));
    expect(
      rel(
        rational.toPrecision(spreadFromDegrees(rational, '0.5', 'rad'), 45),
        M.multiply(s05, s05),
      ),
    ).toBeLessThan(1e-20);
    const g = M.sin(M.divide(M.multiply(M.bignumber('123.4567'), M.pi), 200) as never);
    expect(
      rel(
        rational.toPrecision(spreadFromDegrees(rational, '123.4567', 'gon'), 45),
        M.multiply(g, g),
      ),
    ).toBeLessThan(1e-20);
    const c = M.cos(M.divide(M.multiply(M.bignumber('-271.3'), M.pi), 180) as never);
    expect(rel(rational.toPrecision(sinCosDegrees(rational, '-271.3').cos, 45), c)).toBeLessThan(
      1e-20,
    );
  });
  it('decimal(30) spreads, sines and degrees are correctly rounded (mathjs BigNumber at 60 digits, rounded to 30)', () => {
    const D = decimal(30);
    const round30 = (x: unknown) =>
      M.format(x as never, { notation: 'exponential', precision: 30 }) as string;
    const same = (got: unknown, ref: unknown) =>
      expect(round30(M.bignumber(D.toString(got as never)))).toBe(round30(ref));
    for (const deg of ['1', '12.582416666666666', '37', '179.5', '-71.25', '0.0001']) {
      same(spreadFromDegrees(D, deg), M.bignumber(refSin2(deg)));
      same(
        sinCosDegrees(D, deg).sin,
        M.sin(M.divide(M.multiply(M.bignumber(deg), M.pi), 180) as never),
      );
    }
    same(angleToDegrees(D, '1', 'rad'), M.divide(180, M.pi));
    same(angleToDegrees(D, `12°34'56.7"`), M.evaluate('12 + 34/60 + 56.7/3600'));
    same(
      degreesFromSpread(D, '0.3'),
      M.divide(M.multiply(M.asin(M.sqrt(M.bignumber('0.3'))), 180), M.pi),
    );
  });
  it('degreesFromSpread in rational is within 1e-20 relative of mathjs asin (60 digits)', () => {
    for (const s of ['1/3', '1e-8', '0.999999', '2/7']) {
      const ref = M.divide(
        M.multiply(M.asin(M.sqrt(M.bignumber(rational.toPrecision(rational.from(s), 50)))), 180),
        M.pi,
      );
      const got = M.bignumber(rational.toPrecision(degreesFromSpread(rational, s), 45));
      expect(Number(M.abs(M.divide(M.subtract(got, ref as never), ref as never)))).toBeLessThan(
        1e-20,
      );
    }
  });
});

describe('degreesFromSpread(A, s) is the acute angle of spread s', () => {
  it('rational: spreads 0, 1/4, 1/2, 3/4, 1 give 0°, 30°, 45°, 60°, 90° exactly', () => {
    const cases: [string, string][] = [
      ['0', '0'],
      ['1/4', '30'],
      ['1/2', '45'],
      ['3/4', '60'],
      ['1', '90'],
    ];
    for (const [s, d] of cases) expect(rational.toString(degreesFromSpread(rational, s))).toBe(d);
  });
  it('float agrees with atan2(√s, √(1 − s))·180/π (Math.atan2; well conditioned near s = 1, unlike Math.asin)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (s) => {
        const want = (Math.atan2(Math.sqrt(s), Math.sqrt(1 - s)) * 180) / Math.PI;
        expect(Math.abs(float.toNumber(degreesFromSpread(float, s)) - want)).toBeLessThan(1e-12);
      }),
    );
  });
  it('rational and decimal agree with mathjs BigNumber asin(√s)·180/π (60 digits) to 1e-13', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10 ** 9 }), (k) => {
        const s = `${k}e-9`;
        const ref = Number(M.divide(M.multiply(M.asin(M.sqrt(M.bignumber(s))), 180), M.pi));
        for (const A of [rational, decimal(40)] as Arithmetic<unknown>[]) {
          expect(Math.abs(A.toNumber(degreesFromSpread(A, s)) - ref)).toBeLessThan(1e-13);
        }
      }),
      { numRuns: 60 },
    );
  });
  it('round-trips spreadFromDegrees on [0°, 90°] (rational within 1e-13, the rounding of the float reference; float within 2e-8, as 1 − s loses digits near 90°)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 9_000_000 }), (k) => {
        const deg = `${k}e-5`;
        for (const A of [rational, float] as Arithmetic<unknown>[]) {
          const back = A.toNumber(degreesFromSpread(A, spreadFromDegrees(A, deg)));
          expect(Math.abs(back - k * 1e-5)).toBeLessThan(A === float ? 2e-8 : 1e-13);
        }
      }),
      { numRuns: 40 },
    );
  });
  it('refuses spreads outside [0, 1] with SPREAD_OUT_OF_RANGE naming the input', () => {
    expect(codeOf(() => degreesFromSpread(rational, '-1/4'))).toBe('SPREAD_OUT_OF_RANGE');
    expect(codeOf(() => degreesFromSpread(float, 1.5))).toBe('SPREAD_OUT_OF_RANGE');
    expect(() => degreesFromSpread(rational, '5/4')).toThrow(/degreesFromSpread\(s\).*5\/4/);
  });
});

describe('slope readings are exact spreads', () => {
  // Derived from the definitions (percent grade = 100·tan θ): s = p²/(10⁴ + p²).
  it('spreadFromGrade: 100 % is 1/2, 10 % is 1/101, −3 % is 9/10009', () => {
    expect(rational.toString(spreadFromGrade(rational, 100))).toBe('1/2');
    expect(rational.toString(spreadFromGrade(rational, 10))).toBe('1/101');
    expect(rational.toString(spreadFromGrade(rational, -3))).toBe('9/10009');
  });
  it('spreadFromGrade agrees with sin²(atan(p/100)) (Math.atan, Math.sin) in float', () => {
    fc.assert(
      fc.property(fc.double({ min: -500, max: 500, noNaN: true }), (p) => {
        expect(
          Math.abs(float.toNumber(spreadFromGrade(float, p)) - Math.sin(Math.atan(p / 100)) ** 2),
        ).toBeLessThan(1e-15);
      }),
    );
  });
  it('spreadFromPerMille, spreadFromOneIn and spreadFromRatio agree on the same slope', () => {
    // 1 in 50 = 20 ‰ = 2 % = rise 1 : run 50
    const s = rational.toString(spreadFromRatio(rational, 1, 50));
    expect(s).toBe('1/2501');
    expect(rational.toString(spreadFromPerMille(rational, 20))).toBe(s);
    expect(rational.toString(spreadFromOneIn(rational, 50))).toBe(s);
    expect(rational.toString(spreadFromGrade(rational, 2))).toBe(s);
  });
  it('gradeSquaredFromSpread inverts spreadFromGrade exactly on random grades', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -100000, max: 100000 }),
        fc.integer({ min: 0, max: 3 }),
        (n, k) => {
          const p = rational.from(`${n}e-${k}`);
          expect(
            rational.eq(
              gradeSquaredFromSpread(rational, spreadFromGrade(rational, p)),
              rational.mul(p, p),
            ),
          ).toBe(true);
        },
      ),
    );
  });
  it('float: huge and tiny rises and runs give the spread, not NaN or a division by zero (squares out of range)', () => {
    expect(spreadFromGrade(float, 1e200)).toBe(1); // 1/(1 + 10⁻³⁹⁶) rounds to 1
    expect(spreadFromRatio(float, 1e-200, 1e-200)).toBe(0.5);
    expect(spreadFromRatio(float, 3e200, 4e200)).toBeCloseTo(9 / 25, 15);
    expect(spreadFromRatio(float, 0, 1e-300)).toBe(0);
    const D = decimal(20);
    expect(D.toString(spreadFromRatio(D, '3e-200', '4e-200'))).toBe('0.36');
  });
  it('bad slopes throw typed errors', () => {
    expect(codeOf(() => spreadFromRatio(rational, 0, 0))).toBe('INVALID_SLOPE');
    expect(codeOf(() => spreadFromOneIn(rational, 0))).toBe('INVALID_SLOPE');
    expect(codeOf(() => spreadFromGrade(rational, 'steep'))).toBe('INVALID_NUMBER');
    expect(codeOf(() => gradeSquaredFromSpread(rational, 1))).toBe('VERTICAL_SIGHT');
    expect(codeOf(() => gradeSquaredFromSpread(rational, 2))).toBe('SPREAD_OUT_OF_RANGE');
  });
});

describe('formatDms(A, degrees, decimals) writes DMS text', () => {
  const table: [string, number, string][] = [
    ['12.582416666666666', 1, `12°34'56.7"`],
    ['-12.5', 1, `-12°30'00.0"`],
    ['0.000001', 3, `0°00'00.004"`],
    ['29.99999', 1, `30°00'00.0"`],
    // An angle under a full turn that rounds to one is the same direction as 0°: written 0°.
    ['359.99999999', 2, `0°00'00.00"`],
    ['-359.99999999', 1, `0°00'00.0"`],
    ['360', 1, `360°00'00.0"`],
    ['719.99999999', 1, `720°00'00.0"`],
    ['-0.00000001', 1, `0°00'00.0"`],
    ['1/3', 0, `0°20'00"`],
    ['0.0125', 0, `0°00'45"`],
  ];
  for (const [deg, k, text] of table) {
    it(`${deg}° with ${k} decimals is ${text}`, () => {
      for (const A of arithmetics) expect(formatDms(A, deg, k)).toBe(text);
    });
  }
  it('rounds half away from zero, exactly (0.5″ to 0 decimals is 1″)', () => {
    expect(formatDms(rational, '1/7200', 0)).toBe(`0°00'01"`);
    expect(
      formatDms(rational, rational.sub(rational.from('1/7200'), rational.from('1e-30')), 0),
    ).toBe(`0°00'00"`);
  });
  it('round-trips angleToDegrees to the written precision', () => {
    fc.assert(
      fc.property(fc.integer({ min: -3600 * 3600 * 10, max: 3600 * 3600 * 10 }), (tenths) => {
        const deg = rational.div(rational.from(tenths), rational.from(36000));
        expect(rational.eq(angleToDegrees(rational, formatDms(rational, deg, 1)), deg)).toBe(true);
      }),
    );
  });
  it('refuses bad decimals and huge angles', () => {
    expect(codeOf(() => formatDms(rational, 1, 7))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => formatDms(rational, 1, 1.5))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => formatDms(rational, '1e9'))).toBe('INVALID_ARGUMENT');
    // 10⁸° with 6 decimals is 3.6·10¹⁷ units of 10⁻⁶″, beyond 2⁵³: refused, not a hang (it used to loop)
    expect(codeOf(() => formatDms(rational, '99999999.123456789', 6))).toBe('INVALID_ARGUMENT');
    // a coarse decimal: n + 1 rounds back to x, which used to step n one unit at a time (~10⁸ steps)
    expect(formatDms(decimal(5), '1234.5', 6)).toBe(`1234°30'00.000000"`);
  });
});
