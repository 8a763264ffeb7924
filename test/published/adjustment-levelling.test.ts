// The weighted level network of Ghilani & Wolf, "Adjustment Computations: Spatial Data
// Analysis", 4th ed., Wiley 2006, §12.6, Example 12.1.
import { describe, expect, it } from 'vitest';
import { rational, float, decimal, adjustLevelling, rootToNumber } from '../../src/index.js';

// Fixed A = 437.596 m; observed differences (from → to, ΔElev m, σ m), weights 1/σ².
const EXAMPLE_12_1 = {
  fixed: { A: '437.596' },
  observations: [
    { from: 'A', to: 'B', difference: '10.509', sigma: '0.006' },
    { from: 'B', to: 'C', difference: '5.360', sigma: '0.004' },
    { from: 'C', to: 'D', difference: '-8.523', sigma: '0.005' },
    { from: 'D', to: 'A', difference: '-7.348', sigma: '0.003' },
    { from: 'B', to: 'D', difference: '-3.167', sigma: '0.004' },
    { from: 'A', to: 'C', difference: '15.881', sigma: '0.012' },
  ],
};

describe('adjustLevelling reproduces Ghilani & Wolf (2006) §12.6, Example 12.1', () => {
  it.each([
    ['rational', rational],
    ['float', float],
    ['decimal(30)', decimal(30)],
  ] as const)('gives the printed adjusted heights B, C, D to 0.1 mm in %s', (_n, A) => {
    const r = adjustLevelling(A as typeof float, EXAMPLE_12_1);
    // Printed: B = 448.1087, C = 453.4685, D = 444.9436 m.
    expect(A.toPrecision(r.heights.B!.value as never, 7)).toBe('448.1087');
    expect(A.toPrecision(r.heights.C!.value as never, 7)).toBe('453.4685');
    expect(A.toPrecision(r.heights.D!.value as never, 7)).toBe('444.9436');
    expect(r.heights.A!.held).toBe(true);
    expect(r.dof).toBe(3);
  });

  it('gives s0 = 0.6512 as derived from the data, not the printed S0 = 0.6575', () => {
    // The book prints S0 = ±0.6575. An independent weighted solve of the printed data (and
    // this adjustment) gives vᵀPv = 1.27212 and s0 = √(1.27212/3) = 0.6512 (r = 3): the
    // printed value is taken as a misprint, so s0 is tested as derived from the data.
    const r = adjustLevelling(rational, EXAMPLE_12_1);
    expect(rational.toPrecision(r.vtpv, 6)).toBe('1.27212');
    expect(rootToNumber(rational, r.sigma0!).toFixed(4)).toBe('0.6512');
    expect(rational.toString(r.varianceFactor!)).toBe(
      rational.toString(rational.div(r.vtpv, rational.from(3))),
    );
  });

  it('gives the a-posteriori σ of B, C, D as derived from the data (2.3, 2.6, 1.8 mm)', () => {
    const r = adjustLevelling(rational, EXAMPLE_12_1);
    expect(rootToNumber(rational, r.heights.B!.sigma).toFixed(4)).toBe('0.0023');
    expect(rootToNumber(rational, r.heights.C!.sigma).toFixed(4)).toBe('0.0026');
    expect(rootToNumber(rational, r.heights.D!.sigma).toFixed(4)).toBe('0.0018');
    // a-priori (σ0 = 1): 3.5, 4.0, 2.7 mm, derived from the same data
    const p = adjustLevelling(rational, { ...EXAMPLE_12_1, options: { scale: 'a-priori' } });
    expect(p.scale).toBe('a-priori');
    expect(rootToNumber(rational, p.heights.B!.sigma).toFixed(4)).toBe('0.0035');
    expect(rootToNumber(rational, p.heights.C!.sigma).toFixed(4)).toBe('0.0040');
    expect(rootToNumber(rational, p.heights.D!.sigma).toFixed(4)).toBe('0.0027');
  });

  it('passes the global test (χ²(3) bounds 0.2158 and 9.3484) and flags no observation', () => {
    const r = adjustLevelling(rational, EXAMPLE_12_1);
    const g = r.globalTest!;
    expect(rational.toNumber(g.lower).toFixed(4)).toBe('0.2158');
    expect(rational.toNumber(g.upper).toFixed(4)).toBe('9.3484');
    expect(g.passed).toBe(true);
    expect(r.observations.some((o) => o.suspect)).toBe(false);
    expect(r.localTest.critical.toFixed(4)).toBe('3.2905');
  });
});
