// Type-level checks: the uncertain arithmetic and budgets keep exactness in the types.
import { describe, it, expectTypeOf } from 'vitest';
import { rational, float, decimal, uncertain, Uncertain } from '../../src/arithmetic/index.js';
import type { Rational, Decimal } from '../../src/arithmetic/index.js';
import type { Surd } from '../../src/geometry/surd.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';

describe('types of the uncertain arithmetic', () => {
  it('uncertain(rational) is exact in the type, uncertain(float) is not', () => {
    expectTypeOf(uncertain(rational).exact).toEqualTypeOf<true>();
    expectTypeOf(uncertain(float).exact).toEqualTypeOf<false>();
  });

  it('budget(U, …).sigma is a surd over rational and a plain value over float and decimal', () => {
    const R = uncertain(rational);
    const F = uncertain(float);
    const D = uncertain(decimal(20));
    expectTypeOf(budget(R, measured(R, 1, 1, 'x')).sigma).toEqualTypeOf<Surd<Rational>>();
    expectTypeOf(budget(F, measured(F, 1, 1, 'x')).sigma).toEqualTypeOf<number>();
    expectTypeOf(budget(D, measured(D, 1, 1, 'x')).sigma).toEqualTypeOf<Decimal>();
    expectTypeOf(budget(R, measured(R, 1, 1, 'x')).variance).toEqualTypeOf<Rational>();
  });

  it('values of uncertain(base) are Uncertain<base value>', () => {
    expectTypeOf(measured(uncertain(float), 1, 1, 'x')).toEqualTypeOf<Uncertain<number>>();
    expectTypeOf(uncertain(float).sqrt).returns.toEqualTypeOf<Uncertain<number> | undefined>();
  });
});
