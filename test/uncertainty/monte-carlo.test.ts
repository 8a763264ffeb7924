import { describe, it, expect } from 'vitest';
import { float, uncertain } from '../../src/arithmetic/index.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { monteCarlo, normalInputs } from '../../src/uncertainty/monte-carlo.js';
import { randomStream } from '../../src/uncertainty/random.js';

const F = uncertain(float);

describe('randomStream(seed) is a deterministic xoshiro128** stream seeded by SplitMix64', () => {
  it('randomStream(0) starts from SplitMix64(0) = 0xe220a8397b1dcdaf (the published first output, from memory)', () => {
    // State words: low, high halves of the first two SplitMix64 outputs; s1 is the high half
    // of the first. The first xoshiro128** output is rotl(s1·5, 7)·9 (Blackman & Vigna 2021).
    const s1 = 0xe220a839n;
    const m = (s1 * 5n) & 0xffffffffn;
    const rot = ((m << 7n) | (m >> 25n)) & 0xffffffffn;
    const expected = Number((rot * 9n) & 0xffffffffn);
    expect(randomStream(0).nextUint32()).toBe(expected);
  });

  it('randomStream(seed) repeats for one seed and differs between seeds', () => {
    const a = randomStream(7);
    const b = randomStream(7n);
    const c = randomStream(8);
    const xa = Array.from({ length: 5 }, () => a.nextUint32());
    expect(Array.from({ length: 5 }, () => b.nextUint32())).toEqual(xa);
    expect(Array.from({ length: 5 }, () => c.nextUint32())).not.toEqual(xa);
  });

  it('uniform() stays in (0, 1) with mean 1/2 and variance 1/12; normal() has mean 0 and variance 1 (within 5 standard errors)', () => {
    const s = randomStream(12345);
    const n = 100000;
    let su = 0;
    let suu = 0;
    let sz = 0;
    let szz = 0;
    for (let i = 0; i < n; i++) {
      const u = s.uniform();
      expect(u > 0 && u < 1).toBe(true);
      su += u;
      suu += u * u;
      const z = s.normal();
      sz += z;
      szz += z * z;
    }
    const mu = su / n;
    expect(Math.abs(mu - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(suu / n - mu * mu - 1 / 12)).toBeLessThan(5 * Math.sqrt(1 / 180 / n)); // var of (u − ½)² is 1/180
    expect(Math.abs(sz / n)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(szz / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });

  it('randomStream refuses seeds that are not integers in [0, 2^64)', () => {
    for (const bad of [-1, 1.5, Number.NaN, 2n ** 64n, '3' as never]) {
      expect(() => randomStream(bad)).toThrow(
        expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
      );
    }
  });
});

describe('monteCarlo(f, inputs, { n, seed }) propagates distributions (JCGM 101:2008)', () => {
  it('a rectangular input on [−a, a] gives u = a/√3 (GUM §4.3.7)', () => {
    const n = 100000;
    const r = monteCarlo(
      (x) => x.t,
      { t: { distribution: 'rectangular', low: -3, high: 3 } },
      { n, seed: 5 },
    );
    const u = 3 / Math.sqrt(3);
    expect(Math.abs(r.sigma - u)).toBeLessThan(5 * u * Math.sqrt(0.8 / (4 * n))); // kurtosis of a rectangle is 9/5
    expect(Math.abs(r.mean)).toBeLessThan((5 * u) / Math.sqrt(n));
    // 95 % of a rectangle: any interval of width 0.95·6 = 5.7
    expect(r.high - r.low).toBeCloseTo(5.7, 1);
  });

  it('the shortest 95 % interval of y = x², x rectangular on [0, 1], is [0, 0.9025] (P(y ≤ t) = √t, derived)', () => {
    const r = monteCarlo(
      (x) => x.x * x.x,
      { x: { distribution: 'rectangular', low: 0, high: 1 } },
      { n: 100000, seed: 11 },
    );
    expect(r.low).toBeLessThan(1e-3);
    expect(Math.abs(r.high - 0.9025)).toBeLessThan(0.005);
  });

  it('monteCarlo agrees with first order for a product with small relative uncertainties (within 5 Monte Carlo standard errors)', () => {
    const U = F;
    const b1 = budget(U, U.mul(measured(U, 10, 0.01, 'a'), measured(U, 5, 0.02, 'b')));
    const n = 100000;
    const mc = monteCarlo(
      (x) => x.a * x.b,
      {
        a: { distribution: 'normal', mean: 10, sigma: 0.01 },
        b: { distribution: 'normal', mean: 5, sigma: 0.02 },
      },
      { n, seed: 3 },
    );
    expect(b1.sigma).toBeCloseTo(Math.sqrt(25 * 1e-4 + 100 * 4e-4), 12); // derived by hand
    expect(Math.abs(mc.sigma - b1.sigma)).toBeLessThan((5 * b1.sigma) / Math.sqrt(2 * n));
    expect(Math.abs(mc.mean - 50)).toBeLessThan((5 * b1.sigma) / Math.sqrt(n));
  });

  it('first order is not enough for a spread near 0: s = sin²θ at θ ≈ 0 (Monte Carlo σ ≫ first-order σ)', () => {
    // θ = 0.001 rad, u(θ) = 0.01 rad. First order: |ds/dθ|·u = |sin 2θ|·u ≈ 2e-5.
    // For θ ~ N(μ, σ²) with μ ≪ σ, s ≈ θ² has σ(s) ≈ √2·σ² = 1.4e-4 (derived).
    const theta = measured(F, 0.001, 0.01, 'theta');
    const s = F.mul(F.sin(theta), F.sin(theta));
    const first = budget(F, s).sigma;
    const mc = monteCarlo(
      (x) => Math.sin(x.theta) ** 2,
      { theta: { distribution: 'normal', mean: 0.001, sigma: 0.01 } },
      { n: 50000, seed: 9 },
    );
    expect(first).toBeCloseTo(Math.sin(0.002) * 0.01, 15);
    expect(mc.sigma / first).toBeGreaterThan(5);
    expect(Math.abs(mc.sigma - Math.SQRT2 * 1e-4)).toBeLessThan(0.1 * Math.SQRT2 * 1e-4);
  });

  it('monteCarlo is deterministic for one seed', () => {
    const f = (x: Readonly<Record<'a' | 'b', number>>) => Math.hypot(x.a, x.b);
    const inputs = {
      a: { distribution: 'normal', mean: 3, sigma: 0.1 },
      b: { distribution: 'rectangular', low: 3.9, high: 4.1 },
    } as const;
    expect(monteCarlo(f, inputs, { n: 1000, seed: 42 })).toEqual(
      monteCarlo(f, inputs, { n: 1000, seed: 42 }),
    );
    expect(monteCarlo(f, inputs, { n: 1000, seed: 43 }).mean).not.toBe(
      monteCarlo(f, inputs, { n: 1000, seed: 42 }).mean,
    );
  });

  it('monteCarlo refuses bad options and inputs, and model values that are not finite', () => {
    const ok = { a: { distribution: 'normal', mean: 0, sigma: 1 } } as const;
    const f = (x: Readonly<Record<'a', number>>) => x.a;
    for (const n of [0, 99, 1.5, 1e8, Number.NaN])
      expect(() => monteCarlo(f, ok, { n, seed: 1 })).toThrow(
        expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
      );
    expect(() => monteCarlo(f, ok, { n: 100, seed: 1, coverage: 1 })).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
    expect(() => monteCarlo(f, ok, { n: 100, seed: -1 })).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
    expect(() =>
      monteCarlo(f, { a: { distribution: 'normal', mean: 0, sigma: -1 } }, { n: 100, seed: 1 }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_SIGMA' }));
    expect(() =>
      monteCarlo(f, { a: { distribution: 'rectangular', low: 1, high: 0 } }, { n: 100, seed: 1 }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_ARGUMENT' }));
    expect(() =>
      monteCarlo(f, { a: { distribution: 'cauchy' } as never }, { n: 100, seed: 1 }),
    ).toThrow(expect.objectContaining({ code: 'INVALID_ARGUMENT' }));
    expect(() => monteCarlo((x) => Math.log(x.a), ok, { n: 100, seed: 1 })).toThrow(
      expect.objectContaining({ code: 'NOT_FINITE' }),
    );
  });
});

describe('normalInputs(U, result) feeds a first-order result to monteCarlo', () => {
  it('normalInputs gives each input of the result as a normal distribution, and the Monte Carlo check agrees with the budget', () => {
    const a = measured(F, 12, 0.02, 'a');
    const b = measured(F, 7, 0.03, 'b');
    const y = F.div(a, b);
    const inputs = normalInputs(F, y);
    expect(inputs).toEqual({
      a: { distribution: 'normal', mean: 12, sigma: 0.02 },
      b: { distribution: 'normal', mean: 7, sigma: 0.03 },
    });
    const n = 100000;
    const mc = monteCarlo((x) => x.a! / x.b!, inputs, { n, seed: 77 });
    const first = budget(F, y).sigma;
    expect(Math.abs(mc.sigma - first)).toBeLessThan((5 * first) / Math.sqrt(2 * n));
  });

  it('normalInputs refuses two different inputs with one name', () => {
    expect(() =>
      normalInputs(F, F.add(measured(F, 1, 0.1, 'a'), measured(F, 2, 0.1, 'a'))),
    ).toThrow(expect.objectContaining({ code: 'DUPLICATE_INPUT' }));
  });
});
