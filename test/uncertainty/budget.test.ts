import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, uncertain, Uncertain } from '../../src/arithmetic/index.js';
import { sqrtOf } from '../../src/geometry/surd.js';
import { measured, sensitivities } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { budgetFloat } from '../../src/uncertainty/budget-float.js';
import { measuredAngle, spreadOfAngle } from '../../src/uncertainty/readings.js';
import { normalInputs } from '../../src/uncertainty/monte-carlo.js';
import { sqrtRatioToNumber } from '../../src/uncertainty/internal.js';
import { spreadFromDegrees } from '../../src/readings/index.js';
import { create, all } from 'mathjs';
import type { BigNumber, FactoryFunctionMap } from 'mathjs';

// Independent reference: mathjs BigNumber at 80 significant digits.
const M = create(all as FactoryFunctionMap, { number: 'BigNumber', precision: 80 });
const refSqrt = (n: bigint, d: bigint): number => {
  const q = M.divide(M.bignumber(n.toString()), M.bignumber(d.toString())) as BigNumber;
  return Number((M.sqrt(q) as BigNumber).toPrecision(40));
};

const R = uncertain(rational);
const F = uncertain(float);
const D = uncertain(decimal(40));
const r = rational;

describe('budget(U, result) is the law of propagation of uncertainty (GUM, JCGM 100:2008 §5.1.2)', () => {
  it('budget of a product a·b has u² = b²u²(a) + a²u²(b) (eq. (10), derived by hand), exactly over rational', () => {
    const a = measured(R, '12.5', '0.02', 'a');
    const b = measured(R, '4', '0.01', 'b');
    const B = budget(R, R.mul(a, b));
    // 4²·0.02² + 12.5²·0.01² = 0.0064 + 0.015625 = 0.022025
    expect(r.toString(B.variance)).toBe('881/40000');
    expect(B.sigma.toString()).toBe('√881/200');
    expect(
      B.contributions.map((c) => [c.name, r.toString(c.sensitivity), r.toString(c.contribution)]),
    ).toEqual([
      ['b', '25/2', '1/64'],
      ['a', '4', '4/625'],
    ]);
  });

  it('budget of a quotient a/b has (u/y)² = (u(a)/a)² + (u(b)/b)² (GUM §5.1.6, derived by hand), over every base', () => {
    for (const U of [R, D, F] as const) {
      const B0 = U.base;
      const a = measured(U as typeof F, 30, 0.3, 'a');
      const b = measured(U as typeof F, 8, 0.04, 'b');
      const Bq = budget(U as typeof F, (U as typeof F).div(a, b));
      // y = 3.75; (u/y)² = 1e-4 + 2.5e-5 = 1.25e-4; u² = 3.75²·1.25e-4 = 0.0017578125
      expect(B0.toNumber(Bq.variance as never)).toBeCloseTo(0.0017578125, 15);
    }
    const Bx = budget(R, R.div(measured(R, 30, '0.3', 'a'), measured(R, 8, '0.04', 'b')));
    expect(r.toString(Bx.variance)).toBe('9/5120'); // 0.0017578125 exactly
  });

  it('budget of h = d·tan α has u²(h) = tan²α·u²(d) + (d/cos²α)²·u²(α) (derived by hand), over every base', () => {
    // d = 85.3 m ± 4 mm, α = 0.4 rad ± 2e-5 rad; tan computed as sin/cos in the arithmetic
    const hand = Math.sqrt(
      Math.tan(0.4) ** 2 * 0.004 ** 2 + (85.3 / Math.cos(0.4) ** 2) ** 2 * 2e-5 ** 2,
    );
    for (const U of [F, D, R] as const) {
      const A = U as unknown as typeof F;
      const d = measured(A, '85.3', '0.004', 'd');
      const a = measured(A, '0.4', '0.00002', 'alpha');
      const h = A.mul(d, A.div(A.sin(a), A.cos(a)));
      const B = budget(A, h);
      expect(A.base.toNumber(B.value)).toBeCloseTo(85.3 * Math.tan(0.4), 11);
      const sigma = Math.sqrt(A.base.toNumber(B.variance));
      expect(Math.abs(sigma - hand) / hand).toBeLessThan(1e-13);
      expect(B.contributions[0]!.name).toBe('alpha');
    }
  });

  it('the contributions add up to the variance exactly over rational', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 1, max: 500 }), fc.integer({ min: 0, max: 50 })), {
          minLength: 1,
          maxLength: 5,
        }),
        fc.integer({ min: 1, max: 9 }),
        (specs, k) => {
          const xs = specs.map(([v, s], i) =>
            measured(R, v, r.div(r.from(s), r.from(100)), `x${i}`),
          );
          // y = (Σ k·xᵢ²) / (1 + x₀) — non-linear, several inputs
          let num = R.zero;
          for (const x of xs) num = R.add(num, R.mul(R.from(k), R.mul(x, x)));
          const y = R.div(num, R.add(R.one, xs[0]!));
          const B = budget(R, y);
          let sum = r.zero;
          for (const c of B.contributions) sum = r.add(sum, c.contribution);
          expect(r.eq(sum, B.variance)).toBe(true);
          expect(B.contributions.length).toBe(xs.length);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('budget lists contributions largest first, ties by name', () => {
    const U = F;
    const y = U.add(
      U.add(measured(U, 1, 0.5, 'c'), measured(U, 1, 2, 'big')),
      U.add(measured(U, 1, 0.5, 'a'), measured(U, 1, 1, 'mid')),
    );
    expect(budget(U, y).contributions.map((c) => c.name)).toEqual(['big', 'mid', 'a', 'c']);
  });

  it('budget of a constant is zero, and of x − x lists x with sensitivity 0', () => {
    expect(budget(F, F.from(3))).toMatchObject({
      value: 3,
      variance: 0,
      sigma: 0,
      contributions: [],
    });
    const x = measured(R, 5, 1, 'x');
    const B = budget(R, R.sub(x, x));
    expect(r.isZero(B.variance)).toBe(true);
    expect(B.contributions.map((c) => [c.name, r.toString(c.sensitivity)])).toEqual([['x', '0']]);
  });

  it('budget with covariance r = +1 gives u(a + b) = u(a) + u(b), and r = −1 gives |u(a) − u(b)| (GUM eq. (13), (14))', () => {
    const a = measured(R, 10, '0.3', 'a');
    const b = measured(R, 20, '0.1', 'b');
    const s = R.add(a, b);
    const plus = budget(R, s, { covariance: [['a', 'b', '0.03']] });
    expect(plus.sigma.toString()).toBe('2/5');
    expect(plus.correlations.map((c) => [c.names, r.toString(c.contribution)])).toEqual([
      [['a', 'b'], '3/50'],
    ]);
    const minus = budget(R, s, { covariance: [['b', 'a', '-0.03']] });
    expect(minus.sigma.toString()).toBe('1/5');
    // a − b with r = +1: |0.3 − 0.1|
    expect(budget(R, R.sub(a, b), { covariance: [['a', 'b', '0.03']] }).sigma.toString()).toBe(
      '1/5',
    );
  });

  it('budget refuses a float result or variance that overflowed, rather than return Infinity or NaN', () => {
    const x = measured(F, 1e200, 1, 'x');
    expect(() => budget(F, F.mul(x, x))).toThrow(expect.objectContaining({ code: 'NOT_FINITE' }));
    // the value 1e200 is finite, the variance (1e200·1e200)² is not
    const w = measured(F, 1, 1e200, 'w');
    expect(F.toNumber(F.mul(w, F.from(1e200)))).toBe(1e200);
    expect(() => budget(F, F.mul(w, F.from(1e200)))).toThrow(
      expect.objectContaining({ code: 'NOT_FINITE' }),
    );
  });

  it('budget over uncertain(float) (its float twin) is bit for bit the generic code over a float without its mark', () => {
    // The generic path: a copy of float without `float64`, so budget takes its generic loop.
    const G = uncertain({ ...float, float64: undefined } as unknown as typeof float);
    const input = fc.record({
      value: fc.double({ min: -1e3, max: 1e3, noNaN: true }),
      // a few sigmas and derivatives repeat, so that contributions tie and names decide
      sigma: fc.oneof(fc.constantFrom(0, 0.5, 1, 2), fc.double({ min: 0, max: 1e3, noNaN: true })),
      d: fc.oneof(fc.constantFrom(-1, 1, 2), fc.double({ min: -1e6, max: 1e6, noNaN: true })),
    });
    fc.assert(
      fc.property(
        // a few inputs (sorted by insertion) or more than 16 (sorted by the sort)
        fc.oneof(
          fc.array(input, { maxLength: 16 }),
          fc.array(input, { minLength: 17, maxLength: 24 }),
        ),
        (xs) => {
          const made = (U: typeof F) => {
            const grad = new Map(
              xs.map((x, i) => [{ name: `x${(i * 7) % 24}`, value: x.value, sigma: x.sigma }, x.d]),
            );
            return U.make(1.5, grad);
          };
          const fast = budget(F, made(F));
          const slow = budget(G, made(G));
          expect(fast.variance).toBe(slow.variance);
          expect(fast.sigma).toBe(slow.sigma);
          expect(fast.correlations).toEqual([]);
          expect(fast.contributions).toEqual(slow.contributions);
          expect(fast.contributions.map((c) => c.name)).toEqual(
            slow.contributions.map((c) => c.name),
          );
        },
      ),
      { numRuns: 400 },
    );
    // The twin is what budget(F, …) runs: it answers these itself, with the same budget.
    const y = F.add(measured(F, 2, 0.1, 'a'), F.mul(measured(F, 3, 0.2, 'b'), F.from(2)));
    expect(budgetFloat(float, y)).toStrictEqual(budget(F, y));
    // where the generic code refuses (overflow, a sigma or a derivative that is not a number:
    // JS arithmetic would read '2', true, null or [3] as a number), the same error
    const odd = (sigma: unknown, d: unknown) =>
      new Uncertain(1, [{ name: 'x', value: 1, sigma } as never], [d as number]);
    for (const [sigma, d] of [
      [1e200, 1e200],
      ['0.1', 1],
      [Infinity, 0],
      [NaN, 1],
      [0.5, '2'],
      [0.5, null],
      [0.5, true],
      [0.5, [3]],
      [0.5, 2n],
      [0.5, Object(2)],
    ] as const) {
      const code = (U: typeof F) => {
        try {
          budget(U, odd(sigma, d));
          return 'none';
        } catch (e) {
          return (e as { code?: string }).code;
        }
      };
      expect(code(F)).not.toBe('none');
      expect(code(F)).toBe(code(G));
    }
  });

  it('budget refuses two different inputs with one name', () => {
    const y = F.add(measured(F, 1, 0.1, 'a'), measured(F, 2, 0.1, 'a'));
    expect(() => budget(F, y)).toThrow(expect.objectContaining({ code: 'DUPLICATE_INPUT' }));
  });

  it('budget refuses covariances of unknown inputs, of an input with itself, listed twice, or with |r| > 1', () => {
    const a = measured(R, 1, '0.1', 'a');
    const b = measured(R, 1, '0.2', 'b');
    const y = R.add(a, b);
    expect(() => budget(R, y, { covariance: [['a', 'z', 0]] })).toThrow(
      expect.objectContaining({ code: 'UNKNOWN_INPUT' }),
    );
    expect(() => budget(R, y, { covariance: [['a', 'a', '0.01']] })).toThrow(
      expect.objectContaining({ code: 'INVALID_COVARIANCE' }),
    );
    expect(() =>
      budget(R, y, {
        covariance: [
          ['a', 'b', 0],
          ['b', 'a', 0],
        ],
      }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_COVARIANCE' }));
    expect(() => budget(R, y, { covariance: [['a', 'b', '0.0201']] })).toThrow(
      expect.objectContaining({ code: 'INVALID_COVARIANCE' }),
    );
    expect(() => budget(R, y, { covariance: [['a', 'b', 'x']] })).toThrow(
      expect.objectContaining({ code: 'INVALID_COVARIANCE' }),
    );
    expect(() => budget(R, y, { covariance: 5 as never })).toThrow(
      expect.objectContaining({ code: 'INVALID_COVARIANCE' }),
    );
    expect(() => budget(R, y, { covariance: [['a', 'b', '0.02']] })).not.toThrow();
  });

  it('budget refuses covariances that make the variance negative (not positive semi-definite)', () => {
    const x = [0, 1, 2].map((i) => measured(R, 1, 1, `x${i}`));
    const y = R.add(R.add(x[0]!, x[1]!), x[2]!);
    expect(() =>
      budget(R, y, {
        covariance: [
          ['x0', 'x1', -1],
          ['x0', 'x2', -1],
          ['x1', 'x2', -1],
        ],
      }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_COVARIANCE' }));
  });

  it('measured refuses negative or unreadable sigmas and empty names', () => {
    expect(() => measured(F, 1, -0.1, 'x')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measured(R, 1, 'abc', 'x')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measured(F, 1, Number.NaN, 'x')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measured(F, 1, 0.1, '')).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
    expect(() => measured(F, 'abc', 0.1, 'x')).toThrow(
      expect.objectContaining({
        code: 'INVALID_NUMBER',
        where: 'measured(U, value, sigma, name) value',
      }),
    );
    expect(() => measured(F, Number.NaN, 0.1, 'x')).toThrow(
      expect.objectContaining({
        code: 'INVALID_NUMBER',
        where: 'measured(U, value, sigma, name) value',
      }),
    );
  });

  it('the uncertainty functions refuse a plain arithmetic in place of U with INVALID_ARGUMENT naming the function', () => {
    const plain = float as never;
    const cases: [string, () => unknown][] = [
      ['measured(U, value, sigma, name)', () => measured(plain, 1, 0.1, 'x')],
      ['budget(U, result, options)', () => budget(plain, 1)],
      ['sensitivities(U, y)', () => sensitivities(plain, F.from(1))],
      ['measuredAngle(U, reading, sigmaArcSeconds, name)', () => measuredAngle(plain, 10, 1, 'a')],
      ['spreadOfAngle(U, degrees)', () => spreadOfAngle(plain, 10)],
      ['normalInputs(U, result)', () => normalInputs(plain, F.from(1))],
    ];
    for (const [where, f] of cases)
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_ARGUMENT', where }));
  });

  it('sensitivities lists each input with ∂y/∂x', () => {
    const a = measured(R, 2, '0.1', 'a');
    const b = measured(R, 5, '0.2', 'b');
    expect(sensitivities(R, R.div(a, b)).map((s) => [s.name, r.toString(s.sensitivity)])).toEqual([
      ['a', '1/5'],
      ['b', '-2/25'],
    ]);
  });
});

describe('sigma.toNumber() over rational is √variance correctly rounded, however long the surd', () => {
  it('sqrtRatioToNumber(n, 1) equals Math.sqrt(n) for integers below 2^53 (IEEE 754 sqrt is correctly rounded)', () => {
    fc.assert(
      fc.property(
        fc.bigInt({ min: 0n, max: 2n ** 53n - 1n }),
        fc.integer({ min: 0, max: 60 }),
        (n, j) => {
          expect(sqrtRatioToNumber(n, 1n)).toBe(Math.sqrt(Number(n)));
          // n/4^j: the root is Math.sqrt(n)/2^j exactly
          expect(sqrtRatioToNumber(n, 4n ** BigInt(j))).toBe(Math.sqrt(Number(n)) / 2 ** j);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('sqrtRatioToNumber(n, d) agrees with mathjs BigNumber (80 digits) on ratios of huge integers', () => {
    fc.assert(
      fc.property(
        fc.bigInt({ min: 1n, max: 10n ** 400n }),
        fc.bigInt({ min: 1n, max: 10n ** 400n }),
        (n, d) => {
          expect(sqrtRatioToNumber(n, d)).toBe(refSqrt(n, d));
        },
      ),
      { numRuns: 200 },
    );
  });

  it('budget(uncertain(rational), …).sigma.toNumber() works when the radicand is beyond JS numbers', () => {
    // four spreads of angles read in degrees: the exact variance has denominators of hundreds of digits
    let y = measured(R, '123.456', '0.002', 'd');
    for (let i = 0; i < 4; i++)
      y = R.mul(y, spreadFromDegrees(R, measured(R, `3${i}.123457`, '0.0003', `a${i}`)));
    const B = budget(R, y);
    const v = B.variance;
    expect(() => r.toNumber(B.sigma.d)).toThrow(expect.objectContaining({ code: 'NOT_FINITE' }));
    expect(B.sigma.toNumber()).toBe(refSqrt(v.n, v.d));
    expect(B.sigma.toString()).toBe(sqrtOf(r, v).toString());
  });
});
