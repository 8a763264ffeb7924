// exp and log in every arithmetic, and the functions built from them (sinh … asin, pow).
// Independent references: decimal.js (through mathjs BigNumber) at 80 digits, and Math.* in
// float.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import type { BigNumber, FactoryFunctionMap } from 'mathjs';
import { rational } from '../../src/arithmetic/rational.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { float } from '../../src/arithmetic/float.js';
import { uncertain, Uncertain } from '../../src/arithmetic/uncertain.js';
import { measured } from '../../src/uncertainty/measured.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import {
  sinh,
  cosh,
  tanh,
  atanh,
  asinh,
  pow,
  tan,
  atan,
  asin,
} from '../../src/arithmetic/transcendental.js';
import { QuadspreadError } from '../../src/errors.js';

const M = create(all as FactoryFunctionMap, { precision: 80 });
const big = (x: string): BigNumber => M.bignumber(x);
const D40 = decimal(40);

/** |x − ref| / max(|ref|, floor), with ref from mathjs. */
function relErr(x: string, ref: BigNumber, floor = '1e-300'): number {
  const d = big(x).minus(ref).abs();
  const s = ref.abs().gt(big(floor)) ? ref.abs() : big(floor);
  return Number(d.div(s).toString());
}

const args = fc
  .tuple(fc.integer({ min: -30000, max: 30000 }), fc.integer({ min: 1, max: 999 }))
  .map(([n, d]) => `${n}/${d * 7}`);

describe('exp and log', () => {
  it('decimal(40).exp and .log are correctly rounded against mathjs BigNumber (80 digits)', () => {
    fc.assert(
      fc.property(args, (t) => {
        const x = D40.from(t);
        const e = D40.exp(x);
        const ref = (M.exp as (v: BigNumber) => BigNumber)(big(x.toString()));
        // correctly rounded: within half a unit of the 40th digit
        expect(relErr(e.toString(), ref)).toBeLessThanOrEqual(5e-40);
        if (x.s > 0 && x.c[0] !== 0) {
          const l = D40.log(x);
          const lref = (M.log as (v: BigNumber) => BigNumber)(big(x.toString()));
          expect(relErr(l.toString(), lref)).toBeLessThanOrEqual(5e-40);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('rational.exp and .log are within 1e-40 relative of mathjs BigNumber (80 digits)', () => {
    for (const t of ['1', '-1', '1/3', '100', '-37/5', '1e-30']) {
      const x = rational.from(t);
      const e = rational.exp(x);
      const ref = (M.exp as (v: BigNumber) => BigNumber)(
        M.divide(big(x.s < 0n ? `-${x.n}` : `${x.n}`), big(`${x.d}`)) as BigNumber,
      );
      expect(relErr(rational.toPrecision(e, 60), ref)).toBeLessThanOrEqual(1e-40);
    }
    for (const t of ['2', '1/3', '1000001/1000000', '1e30', '7e-20']) {
      const x = rational.from(t);
      const l = rational.log(x);
      const ref = (M.log as (v: BigNumber) => BigNumber)(
        M.divide(big(`${x.n}`), big(`${x.d}`)) as BigNumber,
      );
      expect(relErr(rational.toPrecision(l, 60), ref)).toBeLessThanOrEqual(1e-40);
    }
  });

  it('exp 0 = 1 and ln 1 = 0 exactly in rational and decimal', () => {
    expect(rational.toString(rational.exp(rational.zero))).toBe('1');
    expect(rational.toString(rational.log(rational.one))).toBe('0');
    expect(D40.toString(D40.exp(D40.zero))).toBe('1');
    expect(D40.toString(D40.log(D40.one))).toBe('0');
  });

  it('float.exp and .log are Math.exp and Math.log', () => {
    fc.assert(
      fc.property(fc.double({ min: -700, max: 700, noNaN: true }), (x) => {
        expect(float.exp(x)).toBe(Math.exp(x));
        if (x > 0) expect(float.log(x)).toBe(Math.log(x));
      }),
    );
  });

  it('log refuses 0 and negative numbers (NO_REAL_SOLUTION) in every arithmetic', () => {
    for (const A of [
      rational,
      D40,
      float,
      uncertain(float),
      uncertain(rational),
    ] as Arithmetic<unknown>[]) {
      for (const v of ['0', '-2']) {
        let err: unknown;
        try {
          A.log(A.from(v));
        } catch (e) {
          err = e;
        }
        expect(err, `${A.name}.log(${v})`).toBeInstanceOf(QuadspreadError);
        expect((err as QuadspreadError).code).toBe('NO_REAL_SOLUTION');
      }
    }
  });

  it('float.exp refuses an overflow (NOT_FINITE); decimal and rational refuse |x| > 2302585', () => {
    expect(() => float.exp(710)).toThrow(/NOT_FINITE/);
    expect(() => D40.exp(D40.from(3e6))).toThrow(/INVALID_ARGUMENT/);
    expect(() => rational.exp(rational.from(-3e6))).toThrow(/INVALID_ARGUMENT/);
  });

  it('uncertain carries d e^x = e^x dx and d ln x = dx/x (float and rational bases)', () => {
    const U = uncertain(float);
    const x = measured(U, 0.7, 0.01, 'x');
    const g = (u: Uncertain<number>) => u.derivatives[0] as number;
    expect(g(U.exp(x))).toBeCloseTo(Math.exp(0.7), 14);
    expect(g(U.log(x))).toBeCloseTo(1 / 0.7, 14);
    const UR = uncertain(rational);
    const xr = measured(UR, '1/2', '1/100', 'x');
    expect(rational.toString(UR.log(xr).derivatives[0]!)).toBe('2');
    const er = UR.exp(xr);
    expect(rational.eq(er.derivatives[0]!, er.value)).toBe(true);
  });

  it('uncertain(float) gives the same values and derivatives as its generic form for exp and log', () => {
    const G = uncertain({ ...float } as Arithmetic<number, false>);
    const F = uncertain(float);
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 50, noNaN: true }), (v) => {
        for (const op of ['exp', 'log'] as const) {
          const a = G[op](measured(G, v, 0.1, 'a'));
          const b = F[op](measured(F, v, 0.1, 'a'));
          expect(b.value).toBe(a.value);
          expect(b.derivatives).toEqual(a.derivatives);
        }
      }),
      { numRuns: 50 },
    );
  });
});

describe('functions built from exp and log', () => {
  const cases: [
    string,
    (A: Arithmetic<number>, x: number) => number,
    (x: number) => number,
    number[],
  ][] = [
    ['sinh', sinh, Math.sinh, [-3, -0.5, 0.25, 2, 10]],
    ['cosh', cosh, Math.cosh, [-3, -0.5, 0.25, 2, 10]],
    ['tanh', tanh, Math.tanh, [-30, -0.5, 0.25, 2, 400]],
    ['atanh', atanh, Math.atanh, [-0.99, -0.5, 0.25, 0.9]],
    ['asinh', asinh, Math.asinh, [-1e6, -0.5, 0.25, 2, 1e8]],
    ['tan', tan, Math.tan, [-1.2, -0.5, 0.25, 1.5]],
    ['atan', atan, Math.atan, [-1e6, -0.5, 0.25, 3]],
    ['asin', asin, Math.asin, [-1, -0.5, 0.25, 0.999]],
  ];
  for (const [name, f, ref, xs] of cases) {
    it(`${name}(float, x) agrees with Math.${name} within 4e-15 relative`, () => {
      for (const x of xs) {
        const want = ref(x);
        expect(Math.abs(f(float, x) - want)).toBeLessThanOrEqual(
          4e-15 * Math.max(1, Math.abs(want)),
        );
      }
    });
  }

  it('decimal(40): atanh, asinh, pow and tanh agree with mathjs BigNumber (80 digits) to 1e-38', () => {
    const F = M as unknown as Record<string, (v: BigNumber, w?: BigNumber) => BigNumber>;
    const checks: [string, BigNumber][] = [
      [atanh(D40, D40.from('0.3')).toString(), F.atanh!(big('0.3'))],
      [asinh(D40, D40.from('-12.5')).toString(), F.asinh!(big('-12.5'))],
      [tanh(D40, D40.from('0.75')).toString(), F.tanh!(big('0.75'))],
      [
        pow(D40, D40.from('0.61'), D40.from('0.3090169943749474241')).toString(),
        F.pow!(big('0.61'), big('0.3090169943749474241')),
      ],
      [sinh(D40, D40.from('2')).toString(), F.sinh!(big('2'))],
      [asin(D40, D40.from('0.6')).toString(), F.asin!(big('0.6'))],
    ];
    for (const [got, want] of checks) expect(relErr(got, want)).toBeLessThanOrEqual(1e-38);
  });

  it('pow is exact for integer exponents in rational, and refuses a negative base with a fractional exponent', () => {
    expect(rational.toString(pow(rational, rational.from('-3/2'), rational.from(-3)))).toBe(
      '-8/27',
    );
    expect(rational.toString(pow(rational, rational.from(7), rational.zero))).toBe('1');
    expect(() => pow(float, -2, 0.5)).toThrow(/NO_REAL_SOLUTION/);
    expect(() => pow(float, 0, -0.5)).toThrow(/NO_REAL_SOLUTION/);
    expect(pow(float, 0, 0.5)).toBe(0);
  });

  it('atanh refuses |x| ≥ 1 and asin |x| > 1 (NO_REAL_SOLUTION)', () => {
    expect(() => atanh(float, 1)).toThrow(/NO_REAL_SOLUTION/);
    expect(() => atanh(rational, rational.from(-2))).toThrow(/NO_REAL_SOLUTION/);
    expect(() => asin(float, 1.5)).toThrow(/NO_REAL_SOLUTION/);
  });
});
