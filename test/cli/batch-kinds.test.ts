// The float row of `batch inverses` (quadrance, √ and azimuth written out on plain numbers) gives
// the same text as the generic row computed through the float arithmetic's operations.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { float } from '../../src/index';
import type { Arithmetic } from '../../src/index';
import { azimuthOf } from '../../src/cogo/inverse';
import { floatToPrecision } from '../../src/cli/batch-format';
import { BATCH_KINDS, azimuthFloat } from '../../src/cli/tasks/batch-kinds';
import type { KindContext, KindPlan } from '../../src/cli/tasks/batch-kinds';

const coordinate = fc.oneof(
  fc.double({ min: -1e7, max: 1e7, noNaN: true }),
  fc.integer({ min: -5, max: 5 }),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

function planFor(A: Arithmetic<unknown, boolean>): KindPlan {
  const num = (x: unknown): string => floatToPrecision(x as number, 12);
  const c: KindContext = {
    A,
    num,
    floatNum: (x) => floatToPrecision(x, 12),
    angle: num,
    exact: (x) => A.toString(x),
    exactColumns: false,
  };
  return BATCH_KINDS.inverses!.plan(c, ['east1', 'north1', 'east2', 'north2']) as KindPlan;
}

const rowOrError = (plan: KindPlan, values: number[]): string[] | string => {
  try {
    return plan.row(values);
  } catch (e) {
    return (e as Error).message;
  }
};

describe('batch inverses in float', () => {
  it('azimuthFloat is azimuthOf(float, dx, dy), axes and diagonals included', () => {
    fc.assert(
      fc.property(coordinate, coordinate, (dx, dy) => {
        fc.pre(dx !== 0 || dy !== 0);
        expect(azimuthFloat(dx, dy)).toBe(azimuthOf(float, dx, dy));
      }),
      { numRuns: 20000, seed: 16 },
    );
  });

  it('the float row writes what the generic row writes through the float operations', () => {
    // A copy of float is not float itself, so the kind takes its generic row for it.
    const fast = planFor(float as Arithmetic<unknown, boolean>);
    const generic = planFor({ ...float } as Arithmetic<unknown, boolean>);
    expect(fast.row).not.toBe(generic.row);
    fc.assert(
      fc.property(fc.array(coordinate, { minLength: 4, maxLength: 4 }), (v) => {
        expect(rowOrError(fast, v)).toEqual(rowOrError(generic, v));
      }),
      { numRuns: 20000, seed: 21 },
    );
    // By hand: (0, 0) → (3, 4): Q 25, distance 5, bearing atan(3/4) = 36.8698976458°.
    expect(fast.row([0, 0, 3, 4])).toEqual(['25.0000000000', '5.00000000000', '36.8698976458']);
  });
});
