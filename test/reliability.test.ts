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

describe('extreme magnitudes: a correct value or NOT_FINITE, never [] or NaN', () => {
  let F: Record<string, any>;
  beforeAll(async () => {
    F = await loadFloatEntry();
  }, 60_000);
  const both = (): [string, (k: object) => any][] => [
    ['quadspread/float', (k) => F.solveTriangle(k)],
    ['generic, float', (k) => q.solveTriangle(q.float, k as never)],
  ];

  it('solveTriangle(float) scales quadrances near 1e154 and 1e-150: the equilateral triangle is found', () => {
    // An equilateral triangle has spreads sin²60° = 3/4 (Euclid, Elements I.1 and the sine of
    // 60°) and quadrea 3Q² (Heron's formula, Metrica I.8, in squared form).
    for (const [name, solve] of both()) {
      const [t] = solve({ Q1: 7e153, Q2: 7e153, Q3: 7e153 });
      expect(t, name).toBeDefined();
      expect(Math.abs(t.s1 - 0.75)).toBeLessThan(1e-15);
      expect(Math.abs(t.quadrea / (3 * 7e153 * 7e153) - 1)).toBeLessThan(1e-15);
      const two = solve({ Q1: 1e-150, Q2: 1e-150, s3: 0.75 });
      expect(two.map((x: { Q3: number }) => x.Q3 / 1e-150)).toEqual([1, 3]);
    }
  });

  it('solveTriangle(float) at 1e154 and 1e-200 is NOT_FINITE (the quadrea 3e308, 3e-400 is no JS number), not []', () => {
    for (const [name, solve] of both()) {
      expect(
        codeOf(() => solve({ Q1: 1e154, Q2: 1e154, Q3: 1e154 })),
        name,
      ).toBe('NOT_FINITE');
      expect(
        codeOf(() => solve({ Q1: 1e-200, Q2: 1e-200, Q3: 1e-200 })),
        name,
      ).toBe('NOT_FINITE');
    }
    // rational has the range: the spreads are 3/4.
    const [t] = q.solveTriangle(R, { Q1: 1e154, Q2: 1e154, Q3: 1e154 });
    expect(q.rootToString(R, t!.s1)).toBe('3/4');
  });

  it('transverseMercator with k0 = 1e306 is NOT_FINITE, not NaN', () => {
    const pr = { lon0: 3, k0: 1e306, falseEasting: 500000, ellipsoid: q.GRS80 };
    expect(codeOf(() => F.transverseMercator({ lat: 10, lon: 4 }, pr))).toBe('NOT_FINITE');
    expect(codeOf(() => q.transverseMercator(q.float, { lat: 10, lon: 4 }, pr))).toBe('NOT_FINITE');
  });

  it('monteCarlo of model values near 1e308 has a finite mean and σ, those of the distribution', () => {
    // A rectangular distribution on [a, b] has mean (a + b)/2 and σ = (b − a)/√12
    // (JCGM 101:2008, 6.4.2.3); scaled by 1e300 its draws reach 1.7e308.
    const r = q.monteCarlo(
      (x) => x.a * 1e300,
      { a: { distribution: 'rectangular', low: -1e8, high: 1.7e8 } },
      { n: 20000, seed: 3 },
    );
    expect(Math.abs(r.mean / 0.35e308 - 1)).toBeLessThan(0.05);
    expect(Math.abs(r.sigma / ((2.7e154 / Math.sqrt(12)) * 1e154) - 1)).toBeLessThan(0.02);
    expect(Number.isFinite(r.low) && Number.isFinite(r.high)).toBe(true);
  });

  it('clothoid of a length near 1e308 is refused at once (it would turn more than 4 rad), in rational and float', () => {
    expect(codeOf(() => q.clothoid(R, { radius: 3000, length: '1e308' }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => F.clothoid({ radius: 3000, length: 1e308 }))).toMatch(
      /^(INVALID_ARGUMENT|INVALID_NUMBER|NOT_FINITE)$/,
    );
    expect(codeOf(() => q.clothoid(R, { radius: 1, length: 9 }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => q.clothoid(R, { radius: 1, length: 8 }))).toBe('returned');
  });

  it('perimeter and traverse in rational with legs of 1e154 and more: no float overflow', () => {
    // legs 1e300 and 1e300 and the hypotenuse √2·1e300 (Pythagoras, Elements I.47)
    const p = q.perimeter(R, [
      { x: 0, y: 0 },
      { x: '1e300', y: 0 },
      { x: 0, y: '1e300' },
    ]);
    expect(R.toNumber(p) / 1e300).toBeCloseTo(2 + Math.SQRT2, 14);
    const t = q.traverse(R, {
      start: { x: 0, y: 0 },
      courses: [
        { latitude: '1e154', departure: '1e154' },
        { latitude: '-1e154', departure: 0 },
      ],
    });
    expect(R.toNumber(t.points[2]!.x)).toBe(1e154);
  });

  it("resection(rational) refuses a control point at { x: '1e999', y: '1e-999' } at once, naming it", () => {
    expect(
      codeOf(() =>
        q.resection(R, {
          control: [
            { x: '1e999', y: '1e-999' },
            { x: 100, y: 0 },
            { x: 0, y: -50 },
          ],
          angles: [90, 90],
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(() =>
      q.resection(R, {
        control: [
          { x: 0, y: 100 },
          { x: 100, y: 0 },
          { x: 0, y: '-1e-999' },
        ],
        angles: [90, 90],
      }),
    ).toThrow(/control\[2\]\.y/);
  });
});

describe('internal conversions are not input: decimal(988) is not "input too long"', () => {
  it('sinCosDegrees, spreadFromDegrees and angleToDegrees in decimal(988) (with guard digits, values of 1000 digits)', () => {
    const D = q.decimal(988);
    const tiny = D.from('1e-980');
    // sin 30° = 1/2 and the spread of 45° is 1/2 (exact values)
    const half = D.from('0.5');
    const sc = q.sinCosDegrees(D, 30);
    expect(D.cmp(D.abs(D.sub(sc.sin, half)), tiny)).toBeLessThan(0);
    expect(D.cmp(D.abs(D.sub(q.spreadFromDegrees(D, 45), half)), tiny)).toBeLessThan(0);
    expect(D.cmp(D.abs(D.sub(q.spreadFromDegrees(D, 30), D.from('0.25'))), tiny)).toBeLessThan(0);
    expect(D.toNumber(q.angleToDegrees(D, `30°30'`))).toBe(30.5);
    // −100/3 degrees: a sine of 988 digits written "-0.…" is over 1000 characters as text;
    // it agrees with decimal(60) (and Math.sin, independently) to their precision.
    const x = D.div(D.from(-100), D.from(3));
    const D60 = q.decimal(60);
    const s60 = q.sinCosDegrees(D60, D60.div(D60.from(-100), D60.from(3))).sin;
    const s988 = q.sinCosDegrees(D, x).sin;
    expect(D60.toNumber(D60.abs(D60.sub(D60.from(D.toPrecision(s988, 70)), s60)))).toBeLessThan(
      1e-55,
    );
    expect(D.toNumber(s988)).toBeCloseTo(Math.sin((-100 / 3) * (Math.PI / 180)), 15);
    // a spread of a tiny angle: its text in decimal(988) is long too
    expect(D.toNumber(q.spreadFromDegrees(D, '1e-500'))).toBe(0);
  });

  it('resection in decimal(1000) answers as in rational', () => {
    const r = q.resection(q.decimal(1000), {
      control: [
        { x: 0, y: 100 },
        { x: 100, y: 0 },
        { x: 0, y: -50 },
      ],
      angles: [90, `90°00'00"`],
    });
    expect(q.decimal(1000).toString(r.station.x)).toBe('0');
  });
});

describe('alignment inputs with holes or junk are refused, naming the input', () => {
  it('horizontalAlignment with a sparse points array or a curve that is not an object', () => {
    // eslint-disable-next-line no-sparse-arrays
    const points = [{ x: 0, y: 0 }, , { x: 60, y: 180 }] as never;
    expect(codeOf(() => q.horizontalAlignment(R, { points, curves: [] }))).toBe('INVALID_ARGUMENT');
    const ok = [
      { x: 0, y: 0 },
      { x: 0, y: 100 },
      { x: 60, y: 180 },
    ];
    for (const c of [5, 'x', Object.create(null), null])
      expect(codeOf(() => q.horizontalAlignment(R, { points: ok, curves: [c as never] }))).toMatch(
        /^(INVALID_ARGUMENT|INVALID_NUMBER)$/,
      );
  });

  it('profileLevel with a profile whose arrays have holes or junk curves', () => {
    const v = q.verticalAlignment(R, {
      points: [
        { chainage: 0, level: 10 },
        { chainage: 100, level: 12 },
        { chainage: 200, level: 11 },
      ],
      curves: [null, { length: 50 }, null],
    });
    expect(codeOf(() => q.profileLevel(R, v, 100))).toBe('returned');
    // eslint-disable-next-line no-sparse-arrays
    const holed = { ...v, points: [v.points[0], , v.points[2]] } as never;
    expect(codeOf(() => q.profileLevel(R, holed, 100))).toBe('INVALID_ARGUMENT');
    const junk = { ...v, curves: [null, 5, null] } as never;
    expect(codeOf(() => q.profileLevel(R, junk, 100))).toBe('INVALID_ARGUMENT');
  });
});

// Found by the long adversarial run (`npm run fuzz -- 60 1`) of 2026-12-03, each call as the
// run made it; the float calls go through quadspread/float as the build specialises it (sums
// and products unchecked there).
describe('the long adversarial run of 2026-12-03', () => {
  let F: Record<string, any>;
  beforeAll(async () => {
    F = await loadFloatEntry();
  }, 120_000);

  it('triangle in quadspread/float with a coordinate of 1e217 is NOT_FINITE, not Q1 = Infinity', () => {
    expect(
      codeOf(() => F.triangle({ x: 0, y: 0 }, { x: 3, y: 1.0282715528558735e217 }, { x: 0, y: 4 })),
    ).toBe('NOT_FINITE');
  });

  it('helmert in quadspread/float with Y = -1.8e308 is NOT_FINITE, not -Infinity', () => {
    const P = {
      tx: 0,
      ty: 0,
      tz: 4.5,
      rx: 0,
      ry: 0,
      rz: 0.554,
      ds: 0.219,
      convention: 'position-vector',
    };
    const p = { X: 3657660.66, Y: -1.7976931348623133e308, Z: 5201382.11 };
    expect(codeOf(() => F.helmert(p, P))).toBe('NOT_FINITE');
    // the reversal scales by 1 − ds·1e-6 < 1 here: a finite result, returned
    expect(Number.isFinite(F.helmertReversed(p, P).Y)).toBe(true);
  });

  it('deflectionTable with an alignment whose element is undefined, lacks its start, or has no curves is INVALID_ARGUMENT', () => {
    const h = F.horizontalAlignment({
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
        { x: 60, y: 180 },
      ],
      curves: [{ radius: 30 }],
    });
    expect(
      codeOf(() =>
        F.deflectionTable({ ...h, elements: [undefined, ...h.elements.slice(1)] }, 0, {
          interval: 10,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    const e1 = { ...h.elements[1], start: undefined };
    expect(
      codeOf(() =>
        F.deflectionTable({ ...h, elements: [h.elements[0], e1, ...h.elements.slice(2)] }, 0, {
          interval: 10,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => F.deflectionTable({ ...h, curves: undefined }, 0, { interval: 10 }))).toBe(
      'INVALID_ARGUMENT',
    );
  });

  it('alignmentStation with a sparse equations array is INVALID_ARGUMENT, not a TypeError', () => {
    const h = q.horizontalAlignment(R, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
      ],
      curves: [],
      equations: [{ back: 50, ahead: 60 }],
    });
    // eslint-disable-next-line no-sparse-arrays
    const equations = [, h.equations[0], h.equations[0]];
    expect(codeOf(() => q.alignmentStation(R, { ...h, equations } as never, { x: 1, y: 50 }))).toBe(
      'INVALID_ARGUMENT',
    );
  });

  it('fCdf of Infinity or 1.8e308 is 1, not NaN; fQuantile with d1 = 7.4e-323 is NOT_FINITE, not Infinity', () => {
    expect(q.fCdf(Infinity, 2, 2)).toBe(1);
    expect(q.chiSquareCdf(Infinity, 3)).toBe(1);
    // χ²(2) is exponential with mean 2: P(X ≤ 1e308) = 1 − e^(−5e307) = 1
    expect(q.chiSquareCdf(1e308, 2)).toBe(1);
    // F(2, 2): P(X ≤ x) = x/(1 + x), within rounding of 1 at 1.8e308
    expect(q.fCdf(1.7976931348623141e308, 2, 2)).toBeCloseTo(1, 15);
    expect(codeOf(() => q.fQuantile(0.5, 7.4e-323, 3))).toBe('NOT_FINITE');
  });

  it('stoppingSightDistance in quadspread/float with a reaction time of 1.8e308 is NOT_FINITE', () => {
    expect(
      codeOf(() =>
        F.stoppingSightDistance({
          speed: 100,
          reactionTime: 1.7976032502055728e308,
          deceleration: 3.4,
        }),
      ),
    ).toBe('NOT_FINITE');
  });

  it('formatStation with per = -1n (a BigInt) is INVALID_ARGUMENT, not a TypeError', () => {
    expect(codeOf(() => F.formatStation(565, { per: -1n }))).toBe('INVALID_ARGUMENT');
  });

  it('deflectionTable and settingOutTable refuse an interval that gives too many rows at once', () => {
    const h = q.horizontalAlignment(R, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
        { x: 60, y: 180 },
      ],
      curves: [{ radius: 30 }],
    });
    // The curve is some 19 m long: an interval of 1 mm gives some 19 000 rows (more than 1 000).
    expect(codeOf(() => q.deflectionTable(R, h, 0, { interval: '0.001' }))).toBe('INPUT_TOO_LONG');
    // 1e-21 would give some 1e23 rows: refused before any is made (it took 0.65 s before).
    expect(codeOf(() => q.settingOutTable(R, h, { interval: '1.0243365916612053e-21' }))).toBe(
      'INPUT_TOO_LONG',
    );
    // 100 rows (the curve at 0.2 m) are made as before.
    expect(q.deflectionTable(R, h, 0, { interval: '0.2' }).length).toBeGreaterThan(90);
  });

  it('a projection whose linearUnit is an object without a prototype is INVALID_UNIT, not a TypeError', () => {
    const p = {
      method: 'transverse-mercator',
      ellipsoid: 'WGS84',
      lat0: 0,
      lon0: 15,
      k0: 0.9996,
      falseEasting: 500000,
      falseNorthing: 0,
      linearUnit: Object.create(null),
    };
    expect(codeOf(() => q.toGrid(R, { lat: 0, lon: 15 }, p as never))).toBe('INVALID_UNIT');
  });

  it('a prepared projection whose arithmetic was taken away is INVALID_ARGUMENT, not a TypeError', () => {
    const prepared = q.prepareProjection(q.float, {
      method: 'transverse-mercator',
      ellipsoid: 'WGS84',
      lat0: 0,
      lon0: 15,
      k0: 0.9996,
      falseEasting: 500000,
      falseNorthing: 0,
    });
    expect(
      codeOf(() =>
        q.toGrid(R, { lat: 0, lon: 15 }, { ...prepared, arithmetic: undefined } as never),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});

describe('the long adversarial run of 2026-12-03, seed 1', () => {
  it('heightFromSight in uncertain(float) at a quadrance of 1e308: a derivative that overflows is NOT_FINITE', () => {
    const U = q.uncertain(q.float);
    const R = q.measured(U, 0.36, 0.01, 'R');
    // dH/dR = Q/(1 − R)² ≈ 2.4e308: beyond a JS number
    expect(codeOf(() => q.heightFromSight(U, { horizontalQuadrance: 1e308, vertical: R }))).toBe(
      'NOT_FINITE',
    );
    // at 1e300 every derivative is finite, and dH/dQ = R/(1 − R) = 0.5625
    const h = q.heightFromSight(U, { horizontalQuadrance: 1e300, vertical: R });
    expect(q.float.toNumber(h.H.value) / 1e300).toBeCloseTo(0.5625, 12);
  });
});

describe('the long adversarial run of 2026-12-03, a hang', () => {
  it('deflectionTable of an alignment starting at chainage 1.38e66 (float) answers at once, not after hours', () => {
    const h = q.horizontalAlignment(q.float, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
        { x: 60, y: 180 },
      ],
      curves: [{ radius: 30 }],
    });
    expect(
      codeOf(() =>
        q.deflectionTable(q.float, { ...h, startChainage: 1.3816649360068459e66 }, 0, {
          interval: 10,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});

describe('the adversarial run of 2026-12-03, seed 20261204', () => {
  it('sideShots with a name that is an object without a prototype: INVALID_ARGUMENT naming it, in both paths', () => {
    const setup = { station: { x: 1000, y: 2000, z: 50 }, orientation: 0, instrumentHeight: 1.5 };
    const shot = { name: Object.create(null) as unknown, circle: 10, zenith: 91, slope: 20 };
    for (const A of [q.float, q.rational, { ...q.float, float64: undefined }]) {
      let err: unknown;
      try {
        q.sideShots(A as typeof q.float, setup as never, [shot] as never);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(q.QuadspreadError);
      expect((err as q.QuadspreadError).code).toBe('INVALID_ARGUMENT');
      expect((err as Error).message).toMatch(/name/);
    }
    // Text and numbers stay names (a number written as text).
    const named = q.sideShots(
      q.float,
      setup as never,
      [
        { name: 'P1', circle: 10, zenith: 91, slope: 20 },
        { name: 7, circle: 10, zenith: 91, slope: 20 },
      ] as never,
    );
    expect(named.map((p) => p.name)).toEqual(['P1', '7']);
  });
});
