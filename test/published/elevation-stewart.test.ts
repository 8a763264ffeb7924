// In-line heights built on the published Stewart's-theorem case (Matthew Stewart, Some General Theorems, Edinburgh 1746, Prop. II: a = 7, BD = 3, DC = 4).
import { describe, expect, it } from 'vitest';
import { rational, decimal, float } from '../../src/index.js';
import { heightFromInlineReadings } from '../../src/elevation/inline.js';

const R = rational;

describe("Stewart's theorem case (M. Stewart, Some General Theorems, Edinburgh 1746, Prop. II): a = 7, b = 3, c = 5, m = 3, n = 4, d² = 43/7", () => {
  // Stations B, D, C at chainages 0, 3, 7 on the line; the foot F of the sighted point is the triangle's apex, so
  // Q(F, B) = c² = 25, Q(F, D) = d² = 43/7, Q(F, C) = b² = 9 (doc/derived). With the point H = 12 above F, the
  // vertical spreads are R = H/(H + Q): 12/37, 84/127, 4/7 (derived).
  const r = heightFromInlineReadings(R, {
    chainages: [0, 3, 7],
    vertical: ['12/37', '84/127', '4/7'],
  });
  it('recovers H = 12 exactly', () => {
    expect(R.toString(r.H)).toBe('12');
  });
  it('puts the foot at chainage 65/14 with offset quadrance 675/196 (from 25 − 9 = 14f − 49; derived)', () => {
    expect(R.toString(r.footChainage)).toBe('65/14');
    expect(R.toString(r.footOffset)).toBe('675/196');
  });
  it('float and decimal(40) (the generic code, not the rational kernel) give the same values to 1e-12', () => {
    for (const A of [float, decimal(40)] as const) {
      const g = heightFromInlineReadings(A as never, {
        chainages: [0, 3, 7],
        vertical: ['12/37', '84/127', '4/7'],
      }) as { H: unknown; footChainage: unknown; footOffset: unknown };
      const n = (x: unknown) => (A as typeof float).toNumber(x as never);
      expect(Math.abs(n(g.H) - 12)).toBeLessThan(1e-12);
      expect(Math.abs(n(g.footChainage) - 65 / 14)).toBeLessThan(1e-12);
      expect(Math.abs(n(g.footOffset) - 675 / 196)).toBeLessThan(1e-12);
    }
  });
});
