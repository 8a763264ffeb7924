// The types say which results are exact surds: Root<T, true> is Surd<T>, Root<T, false> is T.
// (expectTypeOf is checked by `tsc --noEmit`; the runtime assertions check the same at run time.)
import { solveTriangle } from '../../src/readings/triangle-readings.js';
import { describe, expect, expectTypeOf, it } from 'vitest';
import { rational, float, decimal } from '../../src/index.js';
import type { Rational, Decimal } from '../../src/index.js';
import {
  sqrtOf,
  solveQuadratic,
  solveStewart,
  isSurd,
  triangle,
  point,
} from '../../src/geometry/index.js';
import type { Surd, Root } from '../../src/geometry/index.js';

describe('Root<T, E> is a surd exactly when the arithmetic is exact', () => {
  it('sqrtOf(rational, 2) is typed Surd<Rational> and is a surd', () => {
    const r = sqrtOf(rational, 2);
    expectTypeOf(r).toEqualTypeOf<Surd<Rational>>();
    expect(isSurd(r)).toBe(true);
  });
  it('sqrtOf(float, 2) is typed number and sqrtOf(decimal(20), 2) Decimal', () => {
    expectTypeOf(sqrtOf(float, 2)).toEqualTypeOf<number>();
    expectTypeOf(sqrtOf(decimal(20), 2)).toEqualTypeOf<Decimal>();
    expect(typeof sqrtOf(float, 2)).toBe('number');
  });
  it('solveTriangle, solveQuadratic and solveStewart return roots of the matching kind', () => {
    expectTypeOf(solveTriangle(rational, { Q1: 1, Q2: 1, Q3: 1 })[0]!.Q3).toEqualTypeOf<
      Surd<Rational>
    >();
    expectTypeOf(solveTriangle(float, { Q1: 1, Q2: 1, Q3: 1 })[0]!.s1).toEqualTypeOf<number>();
    expectTypeOf(solveQuadratic(rational, 1, 0, -2)).toEqualTypeOf<Surd<Rational>[]>();
    expectTypeOf(solveStewart(float, { QB: 1, QC: 1, tB: 0, tC: 1, tD: 2 })).toEqualTypeOf<
      number[]
    >();
    expectTypeOf<Root<number, false>>().toEqualTypeOf<number>();
    expect(isSurd(solveQuadratic(rational, 1, 0, -2)[0])).toBe(true);
    expect(typeof solveQuadratic(float, 1, 0, -2)[0]).toBe('number');
  });
  it('triangle(A, …) returns plain values of the arithmetic', () => {
    const t = triangle(float, point(float, 0, 0), point(float, 1, 0), point(float, 0, 1));
    expectTypeOf(t.s1).toEqualTypeOf<number>();
    expect(t.s1).toBe(1);
  });
});
