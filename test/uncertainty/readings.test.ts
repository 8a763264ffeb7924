import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { rational, decimal, float, uncertain, Uncertain } from '../../src/arithmetic/index.js';
import { spreadFromDegrees, sinCosDegrees, verticalFromAngle } from '../../src/readings/index.js';
import { heightFromReading } from '../../src/elevation/height.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { rootToNumber } from '../../src/geometry/surd.js';
import { monteCarlo } from '../../src/uncertainty/monte-carlo.js';
import {
  measuredAngle,
  measuredDistance,
  measuredGrade,
  measuredQuadrance,
  measuredSpread,
  measuredVertical,
  spreadOfAngle,
  withDerivative,
} from '../../src/uncertainty/readings.js';

const R = uncertain(rational);
const F = uncertain(float);
const D = uncertain(decimal(40));
const r = rational;
const ARCSEC = Math.PI / 648000; // 1″ in radians (648000″ = π rad)

function grad<T>(y: Uncertain<T>, name: string): T | undefined {
  for (const [k, v] of y.gradient) if (k.name === name) return v;
  return undefined;
}

describe('uncertain readings carry sigmas from reading units through the conversions', () => {
  it('measuredAngle reads DMS text exactly and turns arc-seconds into degrees (1″ = 1/3600°)', () => {
    const a = measuredAngle(R, `12°30'36"`, 2, 'a');
    expect(r.toString(a.value)).toBe('1251/100');
    expect(budget(R, a).sigma.toString()).toBe('1/1800');
    const g = measuredAngle(R, 100, '3.24', 'g', 'gon'); // 1 mgon = 3.24″
    expect(r.toString(g.value)).toBe('90');
    expect(r.toString(budget(R, g).variance)).toBe('81/100000000'); // (0.0009°)² = (3.24/3600)²
  });

  it('measuredDistance reads σ with its own unit, or in the unit of the reading (feet: 0.3048 m)', () => {
    const d = measuredDistance(R, '1000', '4 mm', 'd', 'ft');
    expect(r.toString(d.value)).toBe('1524/5');
    expect(budget(R, d).sigma.toString()).toBe('1/250');
    // A bare σ is in the reading's unit: 0.01 ft = 0.003048 m.
    const f = measuredDistance(R, '1000', '0.01', 'd', 'ft');
    expect(budget(R, f).sigma.toString()).toBe('381/125000');
    // Text readings with a unit: the same, and σ must name a unit too.
    expect(r.toString(measuredDistance(R, '1000 ft', '4 mm', 'd').value)).toBe('1524/5');
    expect(() => measuredDistance(R, '1000 ft', 4, 'd')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    // { constant, ppm }: σ² = constant² + (ppm·10⁻⁶·d)², 2 mm + 5 ppm over 400 m = √(4 + 4) mm.
    const e = measuredDistance(R, '400', { constant: '2 mm', ppm: 5 }, 'd');
    expect(Math.abs(rootToNumber(r, budget(R, e).sigma) - Math.hypot(0.002, 0.002))).toBeLessThan(
      1e-15,
    );
  });

  it('measuredQuadrance has u(Q) = 2d·u(d) (derived)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100000 }),
        fc.integer({ min: 0, max: 50 }),
        (cm, mm) => {
          const Q = measuredQuadrance(R, r.div(r.from(cm), r.from(100)), `${mm} mm`, 'd');
          const expected = r.mul(
            r.mul(r.from(2), r.div(r.from(cm), r.from(100))),
            r.div(r.from(mm), r.from(1000)),
          );
          expect(budget(R, Q).sigma.eq(expected)).toBe(true);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('spreadOfAngle has ds/dθ = sin 2θ · π/180 per degree, matching Math and a central difference (float)', () => {
    fc.assert(
      fc.property(fc.double({ min: -400, max: 400, noNaN: true }), (deg) => {
        const s = spreadOfAngle(F, measured(F, deg, 1, 't'));
        const t = (deg * Math.PI) / 180;
        const d = grad(s, 't') ?? 0;
        // The reference rounds θ·π/180 (error up to |θ|·π/180·u); the readings reduce θ exactly.
        const tol = 4e-16 * (2 + Math.abs(t));
        expect(Math.abs(s.value - Math.sin(t) ** 2)).toBeLessThan(tol);
        expect(Math.abs(d - (Math.sin(2 * t) * Math.PI) / 180)).toBeLessThan(tol);
        const h = 1e-5;
        const fd =
          (Math.sin(((deg + h) * Math.PI) / 180) ** 2 -
            Math.sin(((deg - h) * Math.PI) / 180) ** 2) /
          (2 * h);
        expect(Math.abs(d - fd)).toBeLessThan(1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('spreadOfAngle keeps the gradient at the exact angles 30°, 45°, 60° (where the readings give exact spreads)', () => {
    for (const [deg, s] of [
      [30, '1/4'],
      [45, '1/2'],
      [60, '3/4'],
    ] as const) {
      const v = measuredSpread(R, deg, 1, 't');
      expect(r.toString(v.value)).toBe(s);
      const expected = (Math.sin((2 * deg * Math.PI) / 180) * Math.PI) / 180;
      expect(r.toNumber(grad(v, 't')!)).toBeCloseTo(expected, 14);
    }
  });

  it('spreadOfAngle agrees with spreadFromDegrees run in uncertain(float) away from the exact angles', () => {
    fc.assert(
      fc.property(
        fc
          .double({ min: 0.5, max: 89.5, noNaN: true })
          .filter(
            (x) => Math.abs(x - 30) > 0.1 && Math.abs(x - 45) > 0.1 && Math.abs(x - 60) > 0.1,
          ),
        (deg) => {
          const x = measured(F, deg, 1, 't');
          const generic = spreadFromDegrees(F, x);
          const mine = spreadOfAngle(F, x);
          expect(Math.abs(generic.value - mine.value)).toBeLessThan(1e-15);
          expect(Math.abs((grad(generic, 't') ?? 0) - (grad(mine, 't') ?? 0))).toBeLessThan(1e-15);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('measuredGrade has ds/dp = 2·10⁴·p/(10⁴ + p²)², exact over rational: 20/10201 at 10 % (derived)', () => {
    const s = measuredGrade(R, 10, '0.1', 'g');
    expect(r.toString(s.value)).toBe('1/101');
    expect(r.toString(grad(s, 'g')!)).toBe('20/10201');
    expect(budget(R, s).sigma.toString()).toBe('2/10201');
    // against a central difference in float
    const sf = measuredGrade(F, 7.5, 0.1, 'g');
    const fd =
      ((7.5 + 1e-5) ** 2 / (1e4 + (7.5 + 1e-5) ** 2) -
        (7.5 - 1e-5) ** 2 / (1e4 + (7.5 - 1e-5) ** 2)) /
      2e-5;
    expect(Math.abs((grad(sf, 'g') ?? 0) - fd)).toBeLessThan(1e-10);
  });

  it('measuredVertical of a zenith angle z has dR/dz = −sin 2α · π/180 with α = 90° − z', () => {
    const v = measuredVertical(F, 80, 1, 'z', { kind: 'zenith' });
    expect(v.sign).toBe(1);
    expect(v.spread.value).toBeCloseTo(Math.cos((80 * Math.PI) / 180) ** 2, 15);
    expect(grad(v.spread, 'z')!).toBeCloseTo((-Math.sin((20 * Math.PI) / 180) * Math.PI) / 180, 15);
    const e = measuredVertical(F, -10, 1, 'a');
    expect(e.sign).toBe(-1);
    expect(grad(e.spread, 'a')!).toBeCloseTo((Math.sin((-20 * Math.PI) / 180) * Math.PI) / 180, 15);
  });

  it('withDerivative applies the chain rule to every input', () => {
    const x = F.add(measured(F, 1, 0.1, 'a'), F.mul(F.from(2), measured(F, 2, 0.1, 'b')));
    const y = withDerivative(F, x, Math.exp(5), Math.exp(5));
    expect(grad(y, 'a')).toBe(Math.exp(5));
    expect(grad(y, 'b')).toBe(2 * Math.exp(5));
  });

  it('withDerivative names the argument it cannot read', () => {
    const x = measured(F, 1, 0.1, 'a');
    expect(() => withDerivative(F, x, 'e', 1)).toThrow(
      expect.objectContaining({
        code: 'INVALID_NUMBER',
        where: 'withDerivative(U, x, value, derivative) value',
      }),
    );
    expect(() => withDerivative(F, x, 1, Number.NaN)).toThrow(
      expect.objectContaining({
        code: 'INVALID_NUMBER',
        where: 'withDerivative(U, x, value, derivative) derivative',
      }),
    );
  });

  it('the reading helpers refuse negative sigmas and bad names', () => {
    expect(() => measuredAngle(F, 10, -1, 'a')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measuredDistance(F, 10, -1, 'a')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measuredGrade(F, 10, -1, 'a')).toThrow(
      expect.objectContaining({ code: 'INVALID_SIGMA' }),
    );
    expect(() => measuredAngle(F, 10, 1, '')).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
    expect(() => measuredVertical(F, 95, 1, 'a')).toThrow(
      expect.objectContaining({ code: 'INVALID_ANGLE' }),
    );
  });
});

describe('acceptance: the height of a point from a horizontal distance d and an elevation angle α', () => {
  // h = d·tan α; by hand (GUM eq. (10)): u²(h) = tan²α·u²(d) + (d·sec²α)²·u²(α), α in radians.
  const d = 150;
  const ud = 0.005; // 5 mm
  const alphaDeg = 12.5; // 12°30′
  const uaSec = 5;
  const t = (alphaDeg * Math.PI) / 180;
  const hand = Math.sqrt(
    Math.tan(t) ** 2 * ud ** 2 + ((d / Math.cos(t) ** 2) * uaSec * ARCSEC) ** 2,
  );

  it('budget(U, h).sigma over float equals the hand propagation to 1e-12 relative', () => {
    const Q = measuredQuadrance(F, d, '5 mm', 'd');
    const v = measuredVertical(F, `12°30'00"`, uaSec, 'alpha');
    const h = F.sqrt(heightFromReading(F, { horizontal: Q, vertical: v }))!; // H = Q·R/(1 − R), h = √H
    const B = budget(F, h);
    expect(B.value).toBeCloseTo(d * Math.tan(t), 12);
    expect(Math.abs(B.sigma - hand) / hand).toBeLessThan(1e-12);
    expect(B.contributions.map((c) => c.name)).toEqual(['alpha', 'd']); // the angle limits this sight
  });

  it('the same budget agrees with Monte Carlo (M = 10⁵) within 5 Monte Carlo standard errors', () => {
    const n = 100000;
    const mc = monteCarlo(
      (x) => x.d * Math.tan((x.alpha * Math.PI) / 180),
      {
        d: { distribution: 'normal', mean: d, sigma: ud },
        alpha: { distribution: 'normal', mean: alphaDeg, sigma: uaSec / 3600 },
      },
      { n, seed: 20260101 },
    );
    expect(Math.abs(mc.sigma - hand)).toBeLessThan((5 * hand) / Math.sqrt(2 * n));
  });

  it('over rational the variance of H = h² is exact: it equals the hand formula evaluated in rational on the same readings', () => {
    const Q = measuredQuadrance(R, d, '5 mm', 'd');
    const v = measuredVertical(R, `12°30'00"`, uaSec, 'alpha');
    const Hq = heightFromReading(R, { horizontal: Q, vertical: v });
    const B = budget(R, Hq);
    // By hand: H = d²·R/(1 − R); ∂H/∂d = 2d·R/(1 − R); ∂H/∂α = d²·R′/(1 − R)² with R′ = 2 sin α cos α·π/180 per degree.
    const Rv = verticalFromAngle(r, '12.5').spread;
    const { sin, cos } = sinCosDegrees(r, '12.5');
    const Rp = r.div(r.mul(r.mul(r.from(2), r.mul(sin, cos)), r.pi), r.from(180));
    const one = r.sub(r.one, Rv);
    const dHdd = r.div(r.mul(r.from(2 * d), Rv), one);
    const dHda = r.div(r.mul(r.from(d * d), Rp), r.mul(one, one));
    const ua = r.div(r.from(uaSec), r.from(3600));
    const expected = r.add(
      r.mul(r.mul(dHdd, dHdd), r.from('0.000025')),
      r.mul(r.mul(dHda, dHda), r.mul(ua, ua)),
    );
    expect(r.eq(B.variance, expected)).toBe(true);
    // and its value matches the float hand propagation: u(H) = 2h·u(h)
    expect(Math.sqrt(r.toNumber(B.variance)) / (2 * d * Math.tan(t) * hand)).toBeCloseTo(1, 12);
  });

  it('over decimal(40) the sigma of h matches a 50-digit mathjs evaluation of the hand formula to 1e-30 relative', () => {
    const M = create(all!, { number: 'BigNumber', precision: 50 });
    const bn = (x: number | string) => M.bignumber(x);
    const tt = M.divide(M.multiply(bn('12.5'), M.pi), bn(180));
    const tan = M.tan(tt as never);
    const sec2 = M.divide(bn(1), M.pow(M.cos(tt as never), 2));
    const uar = M.divide(M.multiply(bn(5), M.pi), bn(648000));
    const u2 = M.add(
      M.multiply(M.pow(tan, 2), bn('0.000025')),
      M.pow(M.multiply(M.multiply(bn(150), sec2), uar), 2),
    );
    const want = M.sqrt(u2 as never);
    const Q = measuredQuadrance(D, d, '5 mm', 'd');
    const v = measuredVertical(D, '12.5', uaSec, 'alpha');
    const h = D.sqrt(heightFromReading(D, { horizontal: Q, vertical: v }))!;
    const got = bn(D.base.toString(budget(D, h).sigma));
    const rel = M.abs(M.divide(M.subtract(got, want), want));
    expect((rel as unknown as { lt(x: unknown): boolean }).lt(bn('1e-30'))).toBe(true); // not M.smaller: it compares within mathjs' tolerance
  });
});
