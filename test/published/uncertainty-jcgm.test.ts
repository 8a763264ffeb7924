// Checks of the uncertainty module against the GUM (JCGM 100:2008) and its Supplement 1
// (JCGM 101:2008). Each source is named beside its check.
import { describe, it, expect } from 'vitest';
import { rational, float, uncertain } from '../../src/arithmetic/index.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { monteCarlo } from '../../src/uncertainty/monte-carlo.js';

describe('JCGM 101:2008 §9.2: additive model Y = X1 + X2 + X3 + X4, every Xi ~ N(0, 1)', () => {
  it('the law of propagation (GUM eq. (10)) gives u(y) = 2 exactly over rational', () => {
    const U = uncertain(rational);
    const xs = [1, 2, 3, 4].map((i) => measured(U, 0, 1, `X${i}`));
    const y = xs.reduce((s, x) => U.add(s, x));
    const B = budget(U, y);
    expect(rational.toString(B.variance)).toBe('4');
    expect(B.sigma.toString()).toBe('2');
    // 95 % interval of the Gaussian: ±1.96·u(y) = ±3.92 (JCGM 101 §9.2.2; its table 2, from memory)
    expect(1.96 * B.sigma.toNumber()).toBeCloseTo(3.92, 12);
  });

  it('Monte Carlo with M = 2·10⁵ gives u(y) = 2.00 and the shortest 95 % interval ±3.92 (JCGM 101 §9.2.2, within the Monte Carlo error)', () => {
    const n = 200000;
    const N01 = { distribution: 'normal', mean: 0, sigma: 1 } as const;
    const r = monteCarlo(
      (x) => x.X1 + x.X2 + x.X3 + x.X4,
      { X1: N01, X2: N01, X3: N01, X4: N01 },
      { n, seed: 2008 },
    );
    // Standard errors (derived): mean 2/√M; s.d. 2/√(2M); a 2.5 % quantile of N(0, 4)
    // √(p(1 − p)/M)/φ where φ = density at 3.92 = 0.0292: about 0.012.
    expect(Math.abs(r.mean)).toBeLessThan((5 * 2) / Math.sqrt(n));
    expect(Math.abs(r.sigma - 2)).toBeLessThan((5 * 2) / Math.sqrt(2 * n));
    expect(Math.abs(r.low + 3.92)).toBeLessThan(0.06);
    expect(Math.abs(r.high - 3.92)).toBeLessThan(0.06);
    expect(r.coverage).toBe(0.95);
  });
});

describe('GUM (JCGM 100:2008) §5.1.2 eq. (10) and §5.1.6', () => {
  it('for Y = c·X1^p1·X2^p2 the relative variance is Σ (pᵢ u(xᵢ)/xᵢ)² (GUM eq. (12)): area of a rectangle', () => {
    const U = uncertain(float);
    const a = measured(U, 120.5, 0.012, 'a');
    const b = measured(U, 80.25, 0.009, 'b');
    const B = budget(U, U.mul(a, b));
    const rel = Math.sqrt((0.012 / 120.5) ** 2 + (0.009 / 80.25) ** 2);
    expect(B.sigma / B.value).toBeCloseTo(rel, 15);
  });

  it('GUM §4.4.3: 20 readings with mean 100.145 °C and s = 1.489 °C give u(mean) = s/√20 = 0.333 °C, propagated through the mean of 20 measured inputs', () => {
    // The document gives the mean and s, the 20 readings only as a histogram
    // (its figure 1, from memory): each reading is taken here at the published mean, which
    // changes neither the mean nor the sensitivities 1/20.
    const U = uncertain(float);
    const s = 1.489;
    const readings = Array.from({ length: 20 }, (_, i) => measured(U, 100.145, s, `t${i}`));
    const mean = U.div(
      readings.reduce((p, t) => U.add(p, t)),
      U.from(20),
    );
    const B = budget(U, mean);
    expect(Math.abs(B.value - 100.145)).toBeLessThan(1e-12);
    // published to 3 decimals: 0.333 ± 0.0005
    expect(Math.abs(B.sigma - 0.333)).toBeLessThanOrEqual(0.0005);
    expect(B.contributions.every((c) => c.sensitivity === 1 / 20)).toBe(true);
  });
});
