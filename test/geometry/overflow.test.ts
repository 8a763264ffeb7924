// float leaves add, sub and mul unchecked for speed; the functions whose result is a bare sum,
// difference or product check it once and refuse a non-finite one (NOT_FINITE) rather than
// return ±Infinity or NaN. The inputs are beyond the range of a double's square
// (1e155² = 1e310 > 1.8e308, IEEE 754 binary64): the expected values in rational are
// written by hand (1e155² = 1e310). (spreadLawResidual cannot overflow: a spread is at most 1,
// so s·Q ≤ Q.)
import { describe, expect, it, beforeAll } from 'vitest';
import { loadFloatEntry } from '../float-entry.js';
import * as q from '../../src/index.js';
import { QuadspreadError } from '../../src/index.js';

const F = q.float;
const big = 1e155;

/** Each case: a name and a call in the generic entry for an arithmetic. */
const cases: [string, (A: q.Arithmetic<any>) => unknown][] = [
  ['quadrance', (A) => q.quadrance(A, q.point(A, 0, 0), q.point(A, big, 0))],
  ['vectorQuadrance', (A) => q.vectorQuadrance(A, q.point(A, big, big))],
  ['pythagorasResidual', (A) => q.pythagorasResidual(A, 1e308, 1e308, 0)],
  ['quadrea', (A) => q.quadrea(A, 1e160, 1e160, 1e160)],
  ['tripleQuadResidual', (A) => q.tripleQuadResidual(A, 1e160, 1e160, 1e160)],
  ['archimedesResidual', (A) => q.archimedesResidual(A, 1e160, 1e160, 1e160, 1)],
  ['crossLawResidual', (A) => q.crossLawResidual(A, 1e160, 1e160, 1e160, '1/2')],
  [
    'stewartResidual',
    (A) => q.stewartResidual(A, { QB: 1e300, QC: 1e300, QD: 1e300, tB: 0, tC: 1e160, tD: 1e155 }),
  ],
  [
    'stewartQuadranceResidual',
    (A) =>
      q.stewartQuadranceResidual(A, { QB: 1e160, QC: 1e160, QD: 1e160, QBD: 1e160, QBC: 1e100 }),
  ],
  ['lineThrough', (A) => q.lineThrough(A, q.point(A, big, 2 * big), q.point(A, 2 * big, 4 * big))],
  ['lengthToMetres', (A) => q.lengthToMetres(A, 1e308, 'km')],
  ['convertQuadrance', (A) => q.convertQuadrance(A, 1e308, 'km', 'm')],
];

function code(f: () => unknown): string | undefined {
  try {
    f();
    return undefined;
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    return e.code;
  }
}

describe('float overflow in a bare sum or product is refused, not returned', () => {
  it.each(cases)('%s(float) throws NOT_FINITE', (_name, f) => {
    expect(code(() => f(F))).toBe('NOT_FINITE');
  });

  it.each(cases)('%s(uncertain(float)) throws NOT_FINITE', (_name, f) => {
    expect(code(() => f(q.uncertain(F)))).toBe('NOT_FINITE');
  });

  it.each(cases)('%s(rational) gives the exact, finite value', (_name, f) => {
    expect(code(() => f(q.rational))).toBeUndefined();
  });

  it('the exact values behind two of them (by hand: 1e155² = 1e310)', () => {
    const R = q.rational;
    expect(R.toString(q.quadrance(R, q.point(R, 0, 0), q.point(R, big, 0)))).toBe(
      `1${'0'.repeat(310)}`,
    );
    expect(R.toString(q.lengthToMetres(R, 1e308, 'km'))).toBe(`1${'0'.repeat(311)}`);
  });

  it('values just inside the range still pass (exact powers of two: (2^500)² = 2^1000)', () => {
    expect(q.quadrance(F, q.point(F, 0, 0), q.point(F, 2 ** 500, 0))).toBe(2 ** 1000);
    expect(q.lengthToMetres(F, 2 ** 1000, 'km')).toBe(125 * 2 ** 1003);
  });
});

describe('the float-specialised copy (quadspread/float) refuses the same', () => {
  let bound: Record<string, (...a: unknown[]) => unknown>;
  beforeAll(async () => {
    bound = (await loadFloatEntry()) as typeof bound;
  }, 60_000);

  it('quadrance, lineThrough, quadrea, lengthToMetres', () => {
    const { point, quadrance, lineThrough, quadrea, lengthToMetres } = bound as Record<
      string,
      (...a: any[]) => any
    >;
    expect(code(() => quadrance!(point!(0, 0), point!(big, 0)))).toBe('NOT_FINITE');
    expect(code(() => lineThrough!(point!(big, 2 * big), point!(2 * big, 4 * big)))).toBe(
      'NOT_FINITE',
    );
    expect(code(() => quadrea!(1e160, 1e160, 1e160))).toBe('NOT_FINITE');
    expect(code(() => lengthToMetres!(1e308, 'km'))).toBe('NOT_FINITE');
    expect(quadrance!(point!(0, 0), point!(3, 4))).toBe(25);
  });
});
