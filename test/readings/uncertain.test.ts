// Readings in an arithmetic that carries derivatives: the exact special cases keep the gradient.
import { describe, expect, it } from 'vitest';
import { uncertain, float, rational, measured } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import { spreadFromDegrees, degreesFromSpread } from '../../src/readings/spread.js';
import { sinCosDegrees } from '../../src/readings/trig.js';
import { heightFromReading } from '../../src/elevation/height.js';

type U = ReturnType<typeof uncertain<number, false>>;
const bases: [string, Arithmetic<unknown>][] = [
  ['float', float as Arithmetic<unknown>],
  ['rational', rational as Arithmetic<unknown>],
];
const derivative = (
  y: { gradient: ReadonlyMap<unknown, unknown> },
  B: Arithmetic<unknown>,
): number => {
  const d = [...y.gradient.values()];
  expect(d.length).toBeLessThanOrEqual(1); // one input; a zero derivative may be dropped
  return d.length === 0 ? 0 : B.toNumber(d[0]);
};

describe('spreadFromDegrees carries ds/dθ = sin 2θ·π/180 (derived from s = sin²θ), exact angles included', () => {
  for (const [name, B] of bases) {
    for (const deg of [0, 30, 37, 45, 60, 90, 120, 135, 200]) {
      it(`uncertain(${name}) at ${deg}°`, () => {
        const Un = uncertain(B) as unknown as U;
        const x = measured(Un, deg, 0.001, 'theta');
        const s = spreadFromDegrees(Un, x);
        const want = (Math.sin((2 * deg * Math.PI) / 180) * Math.PI) / 180;
        expect(Math.abs(derivative(s as never, B) - want)).toBeLessThan(1e-14);
        expect(B.toNumber((s as unknown as { value: unknown }).value)).toBeCloseTo(
          Math.sin((deg * Math.PI) / 180) ** 2,
          14,
        );
      });
    }
  }
  it('sinCosDegrees at 30° in uncertain(rational) keeps sin exactly 1/2 and d sin/dθ = cos 30°·π/180', () => {
    const Un = uncertain(rational);
    const x = measured(Un, 30, 0.001, 'theta');
    const { sin } = sinCosDegrees(Un, x);
    expect(rational.toString(sin.value)).toBe('1/2');
    expect(derivative(sin as never, rational as Arithmetic<unknown>)).toBeCloseTo(
      (Math.cos(Math.PI / 6) * Math.PI) / 180,
      14,
    );
  });
});

describe('degreesFromSpread carries dθ/ds = 90/(π sin θ cos θ) (derived)', () => {
  for (const [name, B] of bases) {
    for (const sv of ['1/4', '1/2', '3/4', '1/3', '0.01']) {
      it(`uncertain(${name}) at s = ${sv}`, () => {
        const Un = uncertain(B) as unknown as U;
        const s = measured(Un, sv, '0.0001', 's');
        const th = degreesFromSpread(Un, s);
        const v = B.toNumber(B.from(sv));
        const t = Math.asin(Math.sqrt(v));
        expect(
          Math.abs(derivative(th as never, B) - 90 / (Math.PI * Math.sin(t) * Math.cos(t))),
        ).toBeLessThan(1e-9);
      });
    }
  }
});

describe('heightFromReading carries dH/dR = Q/(1 − R)² (derived)', () => {
  it('uncertain(rational): exact value and exact derivative', () => {
    const Un = uncertain(rational);
    const R = measured(Un, '9/25', '0.001', 'R');
    const H = heightFromReading(Un, { horizontal: 16, vertical: R });
    expect(rational.toString(H.value)).toBe('9');
    expect(rational.toString([...H.gradient.values()][0]!)).toBe('625/16');
  });
});
