// Regressions of an adversarial pass over the library: hostile objects in messages, sparse
// arrays, wrong operands of the arithmetics, exact reduction of long arguments, readings that
// look like angles but are directions. Each must give a QuadspreadError or a correct value.
import { beforeAll, describe, expect, it } from 'vitest';
import { Decimal } from 'decimal.js';
import * as q from '../src/index.js';
import { loadFloatEntry } from './float-entry.js';

const R = q.rational;

function codeOf(f: () => unknown): string {
  try {
    f();
    return 'returned';
  } catch (e) {
    if (e instanceof q.QuadspreadError) return e.code;
    return `${(e as Error).name}: ${(e as Error).message}`;
  }
}

const hostile = (): unknown[] => {
  const getter = Object.defineProperty({}, 'x', {
    enumerable: true,
    get() {
      throw new Error('getter');
    },
  });
  const toStringThrows = {
    toString() {
      throw new Error('toString');
    },
  };
  const proxy = new Proxy(
    {},
    {
      get() {
        throw new Error('trap');
      },
    },
  );
  const revocable = Proxy.revocable({}, {});
  revocable.revoke();
  return [Object.create(null), getter, toStringThrows, proxy, revocable.proxy];
};

describe('errors are QuadspreadErrors whatever the value shown in the message', () => {
  it('objects without a prototype, throwing getters or toString, Proxies, revoked Proxies', () => {
    for (const x of hostile()) {
      // An operation reads the operand's fields: a getter or Proxy trap that throws raises its
      // own error, and a revoked Proxy the engine's (the caller's, passed through as JS's own
      // functions do); anything else is ours.
      const own =
        /^(INVALID_NUMBER|Error: (trap|getter)|TypeError: .*proxy that has been revoked)$/;
      expect(codeOf(() => R.from(x as never))).toMatch(own);
      expect(codeOf(() => q.float.from(x as never))).toMatch(own);
      expect(codeOf(() => R.add(x as never, R.one))).toMatch(own);
      expect(codeOf(() => q.decimal(20).mul(x as never, q.decimal(20).one))).toMatch(own);
    }
  });

  it('an arithmetic argument that is not an arithmetic is INVALID_ARGUMENT naming the function', () => {
    for (const A of [undefined, null, 1, 'rational', {}, { from: () => 1 }, ...hostile()]) {
      expect(
        codeOf(() => q.quadrance(A as never, { x: 0, y: 0 } as never, { x: 1, y: 1 } as never)),
      ).toBe('INVALID_ARGUMENT');
      expect(codeOf(() => q.area(A as never, []))).toBe('INVALID_ARGUMENT');
    }
    expect(codeOf(() => (q.uncertain as (b?: unknown) => unknown)())).toBe('INVALID_ARGUMENT');
    expect(() => (q.uncertain as (b?: unknown) => unknown)()).toThrow(/uncertain\(A\)/);
  });
});

describe('sparse arrays are refused, naming the hole', () => {
  // eslint-disable-next-line no-sparse-arrays
  const holed = [{ x: 0, y: 0 }, , { x: 4, y: 0 }, { x: 0, y: 3 }] as never;
  it('area, perimeter and polygonArea', () => {
    for (const f of [q.area, q.perimeter, q.polygonArea] as ((...a: unknown[]) => unknown)[]) {
      expect(codeOf(() => f(R, holed))).toBe('INVALID_ARGUMENT');
      expect(() => f(R, holed)).toThrow(/\[1\]: is missing \(a hole in a sparse array\)/);
    }
  });

  it('resection', () => {
    // eslint-disable-next-line no-sparse-arrays
    const control = [{ x: 0, y: 100 }, , { x: 0, y: -50 }] as never;
    expect(codeOf(() => q.resection(R, { control, angles: [90, 90] }))).toBe('INVALID_ARGUMENT');
    // eslint-disable-next-line no-sparse-arrays
    const angles = [90, ,] as never;
    const ok = [
      { x: 0, y: 100 },
      { x: 100, y: 0 },
      { x: 0, y: -50 },
    ] as const;
    expect(codeOf(() => q.resection(R, { control: ok, angles }))).not.toMatch(/Error/);
  });
});

describe('names that are not text are refused, not turned into text', () => {
  it('freeStation: a control name or an observation target without a prototype is INVALID_ARGUMENT', () => {
    const run = (name: unknown, to: unknown) =>
      codeOf(() =>
        q.freeStation(q.float, {
          control: [
            { name: 'A', x: 0, y: 100 },
            { name: name as string, x: 100, y: 0 },
          ],
          observations: [
            { to: 'A', circle: 0, horizontalDistance: 100 },
            { to: to as string, circle: 90, horizontalDistance: 100 },
          ],
        }),
      );
    expect(run(Object.create(null), 'B')).toBe('INVALID_ARGUMENT');
    expect(run('B', Object.create(null))).toBe('INVALID_ARGUMENT');
    expect(run('B', 'B')).toBe('returned');
    expect(run(7, '7')).toBe('returned');
  });
});

describe('the operations of an arithmetic check their operands', () => {
  it('rational.sin(5), rational.cos, rational.atan2 and decimal(20).atan2(0, 1) refuse JS numbers', () => {
    expect(codeOf(() => R.sin(5 as never))).toBe('INVALID_NUMBER');
    expect(codeOf(() => R.cos('1' as never))).toBe('INVALID_NUMBER');
    expect(codeOf(() => R.atan2(0 as never, R.one))).toBe('INVALID_NUMBER');
    const D = q.decimal(20);
    expect(codeOf(() => D.atan2(0 as never, 1 as never))).toBe('INVALID_NUMBER');
    expect(codeOf(() => D.sin(null as never))).toBe('INVALID_NUMBER');
  });

  it('uncertain operations refuse values that are not uncertain values', () => {
    const U = q.uncertain(q.float);
    for (const x of [undefined, null, 1, '1', {}])
      for (const op of ['add', 'mul', 'neg', 'sin', 'sqrt', 'toNumber'] as const)
        expect(codeOf(() => (U[op] as (a: unknown, b: unknown) => unknown)(x, U.one))).toBe(
          'INVALID_NUMBER',
        );
  });

  describe('quadspread/float as built (float-specialised)', () => {
    let F: Record<string, any>;
    beforeAll(async () => {
      F = await loadFloatEntry();
    }, 60_000);

    it("arithmetic.add('0.1', '0.2') is refused, not '0.10.2'; float.sin('abc') is not NaN", () => {
      expect(codeOf(() => F.arithmetic.add('0.1', '0.2'))).toBe('INVALID_NUMBER');
      expect(codeOf(() => F.arithmetic.sin('abc'))).toBe('INVALID_NUMBER');
      expect(codeOf(() => F.arithmetic.mul(1e200, 1e200))).toBe('NOT_FINITE');
      expect(F.arithmetic.add(0.1, 0.2)).toBe(0.1 + 0.2);
    });

    it("the geometry primitives refuse { x: '0x10' } and { x: null } rather than read 16 and 0", () => {
      const origin = F.point(0, 0);
      for (const P of [{ x: '0x10', y: 0 }, { x: null, y: 0 }, { x: 1 }, null])
        for (const [name, call] of [
          ['quadrance', () => F.quadrance(origin, P)],
          ['spread', () => F.spread(origin, P, F.point(1, 1))],
          ['triangle', () => F.triangle(origin, P, F.point(0, 1))],
          ['lineThrough', () => F.lineThrough(origin, P)],
        ] as const)
          expect(codeOf(call), `${name}(${JSON.stringify(P)})`).toBe('INVALID_NUMBER');
      expect(F.quadrance(origin, F.point(3, 4))).toBe(25);
    });
  });
});

describe('rational.sin and cos reduce the exact argument, however long', () => {
  // decimal.js (an independent implementation) at 100 significant digits.
  const D100 = Decimal.clone({ precision: 100 });
  const close = (got: q.Rational, x: string, f: 'sin' | 'cos'): void => {
    const want = D100[f](x);
    const diff = new D100(R.toPrecision(got, 60)).minus(want).abs();
    expect(diff.lte(want.abs().times('1e-40')), `${f}(${x})`).toBe(true);
  };

  it('sin(10^50 + 1) is not sin(10^50), and both agree with decimal.js to 1e-40', () => {
    const a = '1' + '0'.repeat(50);
    const b = '1' + '0'.repeat(49) + '1';
    expect(R.eq(R.sin(R.from(a)), R.sin(R.from(b)))).toBe(false);
    close(R.sin(R.from(a)), a, 'sin');
    close(R.sin(R.from(b)), b, 'sin');
    close(R.cos(R.from(b)), b, 'cos');
  });

  it('sin(10^30 + 10^-25) to 1e-40 relative (the promised tolerance)', () => {
    const x = '1' + '0'.repeat(30) + '.' + '0'.repeat(24) + '1';
    close(R.sin(R.from(x)), x, 'sin');
  });

  it('sinCosDegrees(rational, 10^999) reduces mod 360° exactly (10^999 mod 360 = 280, by BigInt)', () => {
    expect(10n ** 999n % 360n).toBe(280n);
    const big = q.sinCosDegrees(R, '1e999');
    const small = q.sinCosDegrees(R, 280);
    expect(R.eq(big.sin, small.sin) && R.eq(big.cos, small.cos)).toBe(true);
  });
});

describe('readings that are directions are not vertical angles or bearings', () => {
  it("verticalFromAngle(R, 'N 45 E') and '12°S' are refused, not read as 45° and −12°", () => {
    expect(codeOf(() => q.verticalFromAngle(R, 'N 45 E'))).toBe('INVALID_ANGLE');
    expect(codeOf(() => q.verticalFromAngle(R, `12°S`))).toBe('INVALID_ANGLE');
    expect(R.toString(q.verticalFromAngle(R, '30').spread)).toBe('1/4');
  });

  it("bearingToAzimuth(R, 'E 100') is refused; 'S 80 E' is 100", () => {
    expect(codeOf(() => q.bearingToAzimuth(R, 'E 100'))).toBe('INVALID_BEARING');
    expect(codeOf(() => q.bearingToAzimuth(R, '100 W'))).toBe('INVALID_BEARING');
    expect(R.toString(q.bearingToAzimuth(R, 'S 80 E'))).toBe('100');
  });

  it('a longitude of 400° is refused, not wrapped to 40° without a word', () => {
    expect(
      codeOf(() => q.geodeticToGeocentric(q.float, { lat: 10, lon: 400, h: 0 }, q.GRS80)),
    ).toBe('INVALID_ANGLE');
    expect(
      codeOf(() => q.geodeticToGeocentric(q.float, { lat: 10, lon: 350, h: 0 }, q.GRS80)),
    ).toBe('returned');
  });
});
