// The clothoid series against an independent computation: x(l) = ∫₀ˡ cos(s²/(2RLs)) ds and
// y(l) = ∫₀ˡ sin(s²/(2RLs)) ds (the Fresnel integrals), integrated numerically by Romberg's
// method in decimal.js at 50 digits, written here.
import { describe, expect, it } from 'vitest';
import Decimal from 'decimal.js';
import { rational, float, decimal, clothoid } from '../../src/index.js';
import { code } from '../geometry/helpers.js';

const D = Decimal.clone({ precision: 50 });

function romberg(f: (s: Decimal) => Decimal, a: Decimal, b: Decimal, levels = 11): Decimal {
  const R: Decimal[][] = [];
  let h = b.minus(a);
  R.push([h.div(2).times(f(a).plus(f(b)))]);
  for (let k = 1; k <= levels; k++) {
    h = h.div(2);
    let sum = new D(0);
    const n = 2 ** (k - 1);
    for (let i = 1; i <= n; i++) sum = sum.plus(f(a.plus(h.times(2 * i - 1))));
    const row = [R[k - 1]![0]!.div(2).plus(h.times(sum))];
    for (let j = 1; j <= k; j++) {
      const p = new D(4).pow(j);
      row.push(
        row[j - 1]!.times(p)
          .minus(R[k - 1]![j - 1]!)
          .div(p.minus(1)),
      );
    }
    R.push(row);
  }
  return R[levels]![levels]!;
}

function fresnel(radius: number, length: number, at: number) {
  const c = new D(2).times(radius).times(length);
  const angle = (s: Decimal) => s.times(s).div(c);
  return {
    x: romberg((s) => D.cos(angle(s)), new D(0), new D(at)),
    y: romberg((s) => D.sin(angle(s)), new D(0), new D(at)),
  };
}

describe('clothoid(A, { radius, length, at }) against the Fresnel integrals (Romberg, decimal.js 50 digits)', () => {
  const cases: [number, number, number][] = [
    [3000, 210, 210],
    [250, 60, 41.5],
    [100, 120, 120], // θs = 0.6 rad: a long transition
    [30, 50, 50], // θs = 0.83 rad
  ];
  it.each(cases)(
    'R = %d, Ls = %d, l = %d: float to 1e-12, rational and decimal(40) to 1e-25 relative',
    (radius, length, at) => {
      const ref = fresnel(radius, length, at);
      const f = clothoid(float, { radius, length, at });
      expect(Math.abs(f.x - ref.x.toNumber())).toBeLessThan(1e-12 * at);
      expect(Math.abs(f.y - ref.y.toNumber())).toBeLessThan(1e-12 * at);
      for (const A of [rational, decimal(40)] as const) {
        const c = clothoid(A as typeof rational, { radius, length, at });
        const dx = new D(A.toPrecision(c.x as never, 45)).minus(ref.x).abs();
        const dy = new D(A.toPrecision(c.y as never, 45)).minus(ref.y).abs();
        expect(dx.lt(new D(at).times('1e-25'))).toBe(true);
        expect(dy.lt(new D(at).times('1e-25'))).toBe(true);
      }
      expect(f.angle).toBeCloseTo((at * at) / (2 * radius * length), 15);
    },
  );
  it('refuses a radius or length ≤ 0, or a point beyond the transition', () => {
    expect(code(() => clothoid(float, { radius: 0, length: 10 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => clothoid(float, { radius: 10, length: -1 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => clothoid(float, { radius: 10, length: 5, at: 6 }))).toBe('INVALID_ARGUMENT');
  });
});
