// The fused rational kernel for heightFromInlineReadings (three stations, in integers) gives
// exactly the generic result, and leaves every other input and every error to the generic code.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Rational } from '../../src/index.js';
import { heightFromInlineReadings } from '../../src/elevation/index.js';

const plain: Arithmetic<Rational, true> = { ...rational, kernels: undefined };
const same = (a: Rational, b: Rational): boolean => a.s === b.s && a.n === b.n && a.d === b.d;

function outcome(f: () => unknown): unknown {
  try {
    return f();
  } catch (e) {
    return e instanceof QuadspreadError
      ? `error ${e.code}: ${e.message}`
      : `not a QuadspreadError: ${String(e)}`;
  }
}

function compare(input: { chainages: Rational[]; vertical: Rational[] }): void {
  const fast = outcome(() => heightFromInlineReadings(rational, input));
  const slow = outcome(() => heightFromInlineReadings(plain, input));
  if (typeof slow === 'string' || typeof fast === 'string') {
    expect(fast).toEqual(slow);
    return;
  }
  const a = fast as ReturnType<typeof heightFromInlineReadings<Rational>>;
  const b = slow as ReturnType<typeof heightFromInlineReadings<Rational>>;
  for (const k of ['H', 'footChainage', 'footOffset'] as const)
    expect(same(a[k], b[k]), k).toBe(true);
  expect(a.residuals.length).toBe(b.residuals.length);
  a.residuals.forEach((r, i) => expect(same(r, b.residuals[i]!)).toBe(true));
  expect(a.sign).toBe(b.sign);
}

const mm = fc.integer({ min: -2_000_000, max: 2_000_000 }).map((m) => rational.from(`${m / 1000}`));
const frac = fc
  .tuple(fc.bigInt({ min: -(10n ** 9n), max: 10n ** 9n }), fc.bigInt({ min: 1n, max: 10n ** 6n }))
  .map(([n, d]) => rational.from(`${n}/${d}`));
const spread = fc
  .tuple(fc.bigInt({ min: 0n, max: 10n ** 12n }), fc.bigInt({ min: 1n, max: 10n ** 12n }))
  .map(([a, b]) => rational.from(`${a < b ? a : b}/${a < b ? b : a}`));

describe('the fused rational in-line height kernel', () => {
  it('equals the generic three-station solution exactly for consistent readings', () => {
    // Readings made from a point: R = H/(H + (c − f)² + e) (derived from R = H/(H + Q)).
    fc.assert(
      fc.property(
        fc.tuple(mm, mm, mm),
        mm,
        mm,
        fc.integer({ min: 1, max: 200_000 }),
        (cs, f, o, h) => {
          const H = rational.mul(rational.from(h / 1000), rational.from(h / 1000));
          const e = rational.mul(o, o);
          const vertical = cs.map((c) => {
            const d = rational.sub(c, f);
            return rational.div(H, rational.add(rational.add(H, rational.mul(d, d)), e));
          });
          compare({ chainages: cs, vertical });
        },
      ),
      { numRuns: 300 },
    );
  });

  it('equals the generic code, result or error, for arbitrary readings', () => {
    fc.assert(
      fc.property(
        fc.tuple(fc.oneof(mm, frac), fc.oneof(mm, frac), fc.oneof(mm, frac)),
        fc.tuple(spread, spread, spread),
        (cs, vs) => compare({ chainages: cs, vertical: vs }),
      ),
      { numRuns: 500 },
    );
  });

  it('leaves four stations, signed readings and text inputs to the generic code', () => {
    const k = rational.kernels!.inlineHeight!;
    const c = ['0', '10', '20', '30'].map((x) => rational.from(x));
    const v = ['1/2', '1/3', '1/4', '1/5'].map((x) => rational.from(x));
    expect(k({ chainages: c, vertical: v })).toBeUndefined();
    expect(
      k({
        chainages: c.slice(0, 3),
        vertical: v.slice(0, 2).concat([{ spread: v[2], sign: 1 }] as never),
      }),
    ).toBeUndefined();
    expect(k({ chainages: ['0', '10', '20'], vertical: v.slice(0, 3) })).toBeUndefined();
    // The example of heightFromInlineReadings' own docs: stations 0, 10, 20 seeing a point 12 high.
    const r = heightFromInlineReadings(rational, {
      chainages: [0, 10, 20].map((x) => rational.from(x)),
      vertical: ['144/218', '144/178', '144/338'].map((x) => rational.from(x)),
    });
    const s = heightFromInlineReadings(plain, {
      chainages: [0, 10, 20].map((x) => rational.from(x)),
      vertical: ['144/218', '144/178', '144/338'].map((x) => rational.from(x)),
    });
    expect(rational.toString(r.H)).toBe(rational.toString(s.H));
    // Derived by hand: horizontal quadrances 74, 34, 194 = (c − 7)² + 25 at c = 0, 10, 20, so
    // H = 144 (12²), foot at chainage 7, offset quadrance 25.
    expect([
      rational.toString(r.H),
      rational.toString(r.footChainage),
      rational.toString(r.footOffset),
    ]).toEqual(['144', '7', '25']);
  });
});
