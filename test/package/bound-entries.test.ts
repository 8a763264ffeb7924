import { describe, it, expect, expectTypeOf } from 'vitest';
import * as generic from '../../src/index.js';
import * as R from '../../src/entries/rational.gen.js';
import * as D from '../../src/entries/decimal.gen.js';
import * as F from '../../src/entries/float.gen.js';
import type { Rational, Decimal } from '../../src/index.js';
// @ts-expect-error -- a plain .mjs script without declarations
import { generate } from '../../scripts/gen-bound.mjs';

interface Api {
  bound: { name: string }[];
  values: string[];
  typesOnly: string[];
  omitted: string[];
}

const { api, stale } = generate({ check: true }) as { api: Api; stale: string[] };
const boundNames = api.bound.map((b) => b.name);
const entries = [
  ['quadspread/rational', R, generic.rational],
  ['quadspread/decimal', D, undefined],
  ['quadspread/float', F, generic.float],
] as const;

describe('bound entries', () => {
  it('src/entries/{rational,decimal,float}.gen.ts are what scripts/gen-bound.mjs generates from src/index.ts', () => {
    // When this fails: run `npm run gen:bound` and commit the three files.
    expect(stale).toEqual([]);
  });

  it('the generator finds the functions that take an arithmetic first (quadrance, spread, point)', () => {
    expect(boundNames).toEqual(expect.arrayContaining(['point', 'quadrance', 'spread']));
    expect(api.values).toEqual(
      expect.arrayContaining(['QuadspreadError', 'ERROR_CODES', 'rational', 'float', 'decimal']),
    );
  });

  it('leaves out the uncertainty functions, which the generic entry keeps', () => {
    const want = ['uncertain', 'budget', 'measured', 'measuredAngle', 'measuredQuadrance'];
    expect(api.omitted).toEqual(expect.arrayContaining(want));
    const g = generic as unknown as Record<string, unknown>;
    for (const key of want) expect(typeof g[key]).toBe('function');
    for (const [, entry] of entries) {
      const mod = entry as unknown as Record<string, unknown>;
      for (const key of api.omitted) expect(mod[key], key).toBeUndefined();
    }
    // what is left is usable there: monteCarlo works on plain numbers
    expect(typeof (F as unknown as Record<string, unknown>).monteCarlo).toBe('function');
  });

  for (const [name, entry, fixed] of entries) {
    const mod = entry as unknown as Record<string, unknown>;
    it(`${name} exports every public value of the generic entry, bound or unchanged`, () => {
      for (const key of boundNames) {
        expect(typeof mod[key], key).toBe('function');
        expect(mod[key], key).not.toBe((generic as Record<string, unknown>)[key]);
      }
      for (const key of api.values)
        expect(mod[key], key).toBe((generic as Record<string, unknown>)[key]);
      expect(Object.keys(mod).sort()).toEqual(['arithmetic', ...boundNames, ...api.values].sort());
    });
    if (fixed) {
      it(`${name} binds the ${fixed.name} arithmetic itself`, () => {
        expect(entry.arithmetic).toBe(fixed);
      });
    }
  }

  it('quadspread/decimal binds decimal(34)', () => {
    expect(D.arithmetic.name).toBe(generic.decimal(34).name);
    expect(D.arithmetic.digits).toBe(34);
  });

  it('bound quadrance(P, Q) equals generic quadrance(A, P, Q) in each arithmetic', () => {
    // 3-4-5 right triangle (derived): Q = 3² + 4² = 25; with halves, Q = (1/2)² + 2² = 17/4.
    expect(R.arithmetic.toString(R.quadrance(R.point('1/2', 0), R.point(0, 2)))).toBe('17/4');
    expect(D.arithmetic.toString(D.quadrance(D.point('0.1', 0), D.point(0, '0.2')))).toBe('0.05');
    expect(F.quadrance(F.point(0, 0), F.point(3, 4))).toBe(25);
    const P = generic.point(generic.float, 1.5, -2);
    const Q = generic.point(generic.float, 0.1, 7);
    expect(F.quadrance(P, Q)).toBe(generic.quadrance(generic.float, P, Q));
  });

  it('bound functions read numbers and numeric text like the arithmetic does', () => {
    // spread of 60° = sin² 60° = 3/4 (derived).
    expect(R.arithmetic.toString(R.spreadFromDegrees(60))).toBe('3/4');
    expect(R.arithmetic.toString(R.spreadFromDegrees('60'))).toBe('3/4');
    expect(R.arithmetic.toString(R.spreadFromDegrees(R.arithmetic.from(60)))).toBe('3/4');
    expect(F.spreadFromDegrees(60)).toBeCloseTo(0.75, 15);
  });

  it('bound functions throw the same QuadspreadError as the generic ones', () => {
    expect(() => R.point('abc', 0)).toThrow(generic.QuadspreadError);
    try {
      F.point(Number.NaN, 0);
      expect.unreachable();
    } catch (e) {
      expect((e as generic.QuadspreadError).code).toBe('INVALID_NUMBER');
    }
  });

  it('bound functions are typed with the arithmetic fixed (type-level checks run by tsc)', () => {
    expectTypeOf(R.quadrance).returns.toEqualTypeOf<Rational>();
    expectTypeOf(D.quadrance).returns.toEqualTypeOf<Decimal>();
    expectTypeOf(F.quadrance).returns.toEqualTypeOf<number>();
    expectTypeOf(F.point).parameters.toEqualTypeOf<
      [x: generic.Numeric<number>, y: generic.Numeric<number>]
    >();
    // An optional parameter of the generic function stays optional.
    expectTypeOf(F.spreadFromDegrees).toBeCallableWith(30);
    expectTypeOf(F.spreadFromDegrees).toBeCallableWith(30, 'gon');
    // Exact arithmetic keeps surds in the types; float does not.
    expectTypeOf(R.sqrtOf).returns.toEqualTypeOf<generic.Root<Rational, true>>();
    expectTypeOf(F.sqrtOf).returns.toEqualTypeOf<number>();
    // @ts-expect-error -- the arithmetic is not passed to a bound function
    const wrong = () => F.quadrance(generic.float, F.point(0, 0), F.point(1, 1));
    expect(typeof wrong).toBe('function');
    // And at run time: √8 = 2√2 stays a surd in rational, a number in float.
    expect(R.rootToString(R.sqrtOf(8))).toBe('2√2');
    expect(generic.isSurd(R.sqrtOf(8))).toBe(true);
    expect(F.sqrtOf(8)).toBe(Math.sqrt(8));
  });
});
