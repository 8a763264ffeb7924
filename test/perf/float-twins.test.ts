// The float twins (src/readings/trig-float.ts, src/geodesy/geocentric-float.ts) are the
// generic code's operations, in the same order, on plain numbers. These properties check that
// a solver given `float` (which runs the twin) returns exactly, bit for bit, what the generic
// code returns in float, or the same error code, over random and awkward input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  float,
  geodeticToGeocentric,
  geocentricToGeodetic,
  defineEllipsoid,
  QuadspreadError,
} from '../../src/index.js';
import { sinCos } from '../../src/readings/trig.js';
import { sinCosFloat } from '../../src/readings/trig-float.js';

/** float without its `float64` mark: the same operations, through the generic code. */
const generic = { ...float, float64: undefined } as unknown as typeof float;

const outcome = (f: () => unknown): unknown => {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    return e.code;
  }
};

/** Angles: anything, multiples of 15° (the exact cases), tiny, huge and negative zero. */
const angle = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.double({ min: -720, max: 720, noNaN: true }),
  fc.integer({ min: -48, max: 48 }).map((k) => k * 15),
  fc.integer({ min: -1000, max: 1000 }).map((k) => k * 90 + 1e-12),
  fc.constantFrom(-0, 0, 1e-300, -1e-300, 5e-324, 1e12, -1e12, 1e13, 359.99999999999994),
);

describe('sinCosFloat (the float twin of sinCos)', () => {
  it('gives exactly sinCos(float, x), or undefined where sinCos throws', () => {
    fc.assert(
      fc.property(angle, (x) => {
        const fast = sinCosFloat(x);
        const slow = outcome(() => sinCos(generic, x));
        if (fast === undefined) expect(typeof slow).toBe('string');
        else expect(fast).toStrictEqual(slow);
      }),
      { numRuns: 5000 },
    );
  });
});

const ellipsoid = fc.constantFrom(
  'WGS84',
  'GRS80',
  defineEllipsoid({ name: 'sphere', a: 6371000, f: 0 }),
  defineEllipsoid({ name: 'Airy 1830', a: 6377563.396, b: 6356256.909 }),
);
const latitude = fc.oneof(
  fc.double({ min: -90, max: 90, noNaN: true }),
  fc.constantFrom(90, -90, 0, -0, 45, 30, 89.99999999, 90.0000001, -91),
  // the exact cases of the reduction (t = 0°, ±30°) and the quadrant boundaries
  fc.integer({ min: -6, max: 6 }).map((k) => k * 15),
  fc.integer({ min: -2, max: 2 }).map((k) => k * 45 + 1e-13),
  fc.constantFrom(`53°36'43.1653"N`, '12.5', null, undefined),
);
const longitude = fc.oneof(
  fc.double({ min: -540, max: 540, noNaN: true }),
  fc.double({ noNaN: true }),
  fc.constantFrom(0, -0, 180, -180, 360, -360, 359.99999999999994, `1°39'51.9920"W`),
  fc.integer({ min: -24, max: 24 }).map((k) => k * 15),
  fc.integer({ min: -8, max: 8 }).map((k) => k * 45 - 1e-13),
);
const height = fc.oneof(
  fc.double({ min: -1e4, max: 1e7, noNaN: true }),
  fc.constantFrom(undefined, 0, -6378137, -6378138, 1e300, '299.8'),
);

describe('geodesy float twins', () => {
  it("take float's stopping tolerances as the generic code reads them", async () => {
    const { tenToMinus, claimedDigits } = await import('../../src/geodesy/internal.js');
    // geocentricToGeodetic passes 1e-17 and 1e-13 to its float twin for a 15-digit float
    expect(claimedDigits(float)).toBe(15);
    expect(tenToMinus(float, claimedDigits(float) + 2)).toBe(1e-17);
    expect(tenToMinus(float, Math.max(1, claimedDigits(float) - 2))).toBe(1e-13);
  });

  it('geodeticToGeocentric(float, …) is exactly the generic float result (or the same error)', () => {
    fc.assert(
      fc.property(latitude, longitude, height, ellipsoid, (lat, lon, h, E) => {
        const p = { lat, lon, h } as never;
        expect(outcome(() => geodeticToGeocentric(float, p, E))).toStrictEqual(
          outcome(() => geodeticToGeocentric(generic, p, E)),
        );
      }),
      { numRuns: 3000 },
    );
  });

  const coordinate = fc.oneof(
    fc.double({ min: -1e7, max: 1e7, noNaN: true }),
    fc.double({ min: -1e-3, max: 1e-3, noNaN: true }),
    fc.double({ noNaN: true }),
    fc.constantFrom(0, -0, 1e-200, 3790644.9, '5111482.97'),
  );
  it('geocentricToGeodetic(float, …) is exactly the generic float result (or the same error)', () => {
    fc.assert(
      fc.property(coordinate, coordinate, coordinate, ellipsoid, (X, Y, Z, E) => {
        const p = { X, Y, Z } as never;
        expect(outcome(() => geocentricToGeodetic(float, p, E))).toStrictEqual(
          outcome(() => geocentricToGeodetic(generic, p, E)),
        );
      }),
      { numRuns: 3000 },
    );
  });

  it('agree exactly with the generic code on 20000 seeded points of the surface and round trips', () => {
    // A seeded generator (xorshift) rather than fast-check: rounding differences such as
    // e²·s·s against e²·(s·s) show in about one point in 5000, so many points are needed.
    let s = 0x2545f491;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    let differ = 0;
    for (let i = 0; i < 20000; i++) {
      const p = { lat: rand() * 180 - 90, lon: rand() * 720 - 360, h: rand() * 10000 - 500 };
      const a = geodeticToGeocentric(float, p, 'WGS84');
      const b = geodeticToGeocentric(generic, p, 'WGS84');
      if (a.X !== b.X || a.Y !== b.Y || a.Z !== b.Z) differ++;
      const g = geocentricToGeodetic(float, a, 'WGS84');
      const h = geocentricToGeodetic(generic, a, 'WGS84');
      if (g.lat !== h.lat || g.lon !== h.lon || g.h !== h.h) differ++;
    }
    expect(differ).toBe(0);
  });

  it('round trips from the surface of the Earth agree exactly with the generic code', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: -500, max: 9000, noNaN: true }),
        ellipsoid,
        (lat, lon, h, E) => {
          const q = geodeticToGeocentric(float, { lat, lon, h }, E);
          expect(outcome(() => geocentricToGeodetic(float, q, E))).toStrictEqual(
            outcome(() => geocentricToGeodetic(generic, q, E)),
          );
        },
      ),
      { numRuns: 3000 },
    );
  });
});

describe('sinCosDegrees(float, …) through the twin', () => {
  it('is exactly the generic float result (or the same error)', async () => {
    const { sinCosDegrees } = await import('../../src/index.js');
    fc.assert(
      fc.property(angle, (x) => {
        expect(outcome(() => sinCosDegrees(float, x))).toStrictEqual(
          outcome(() => sinCosDegrees(generic, x)),
        );
      }),
      { numRuns: 3000 },
    );
  });
});

describe('heightFromInlineReadings(float, …) through the twin', () => {
  it('is exactly the generic float result (or the same error) for three stations', async () => {
    const { heightFromInlineReadings } = await import('../../src/index.js');
    const chainage = fc.oneof(
      fc.double({ min: -1e4, max: 1e4, noNaN: true }),
      fc.integer({ min: -5, max: 5 }),
      fc.constantFrom(0, -0, '12.5', 1e300),
    );
    const reading = fc.oneof(
      fc.double({ min: 0, max: 1, noNaN: true }),
      fc.double({ min: 1e-320, max: 1e-300, noNaN: true }),
      fc.constantFrom(0, -0, 1, 1.5, -0.1, 5e-324, '1/2', { spread: 0.25, sign: -1 }),
    );
    fc.assert(
      fc.property(
        fc.array(chainage, { minLength: 3, maxLength: 3 }),
        fc.array(reading, { minLength: 3, maxLength: 3 }),
        (chainages, vertical) => {
          const input = { chainages, vertical } as never;
          expect(outcome(() => heightFromInlineReadings(float, input))).toStrictEqual(
            outcome(() => heightFromInlineReadings(generic, input)),
          );
        },
      ),
      { numRuns: 5000 },
    );
  });

  it('agrees exactly on 20000 seeded consistent three-station sightings', async () => {
    const { heightFromInlineReadings } = await import('../../src/index.js');
    let s = 0x1234567;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    let differ = 0;
    for (let i = 0; i < 20000; i++) {
      const h = 1 + rand() * 200;
      const foot = rand() * 1000 - 500;
      const off = rand() * 500;
      const chainages = [0, 1, 2].map(() => rand() * 2000 - 1000);
      const vertical = chainages.map((c) => (h * h) / (h * h + (c - foot) ** 2 + off * off));
      const a = outcome(() => heightFromInlineReadings(float, { chainages, vertical }));
      const b = outcome(() => heightFromInlineReadings(generic, { chainages, vertical }));
      try {
        expect(a).toStrictEqual(b);
      } catch {
        differ++;
      }
    }
    expect(differ).toBe(0);
  });
});

describe('triangle(float, …) through the twin', () => {
  const coordinate = fc.oneof(
    fc.double({ min: -1e5, max: 1e5, noNaN: true }),
    fc.integer({ min: -3, max: 3 }),
    fc.double({ min: -1e-160, max: 1e-160, noNaN: true }),
    fc.double({ noNaN: true }),
    fc.constantFrom(0, -0, 1e154, -1e154, 1e-300, 5e-324, '2.5', null),
  );
  const pt = fc.oneof(
    fc.record({ x: coordinate, y: coordinate }),
    fc.tuple(coordinate, coordinate),
    // Not points at all: null, undefined, primitives, a point whose reading throws.
    fc.constantFrom(null, undefined, 7, 'A1', true, {}),
  );
  it('is exactly the generic float result (or the same error), awkward input included', async () => {
    const { triangle } = await import('../../src/index.js');
    fc.assert(
      fc.property(pt, pt, pt, (P1, P2, P3) => {
        const args = [P1, P2, P3] as never as [never, never, never];
        expect(outcome(() => triangle(float, ...args))).toStrictEqual(
          outcome(() => triangle(generic, ...args)),
        );
      }),
      { numRuns: 5000 },
    );
  });

  it('separates the edges of its one test of zero and non-finite values as the generic code does', async () => {
    const { triangle } = await import('../../src/index.js');
    // Hand-built: each case sits on one side of one part of the twin's test (spreads' product
    // > 0, product + quadrea finite); the generic float code (a copy of float without its
    // mark) decides each, and the twin must give exactly its result or its error.
    const cases: [number, number][][] = [
      // quadrea = 4·D² overflows (D² ≈ 6.0e307) while every spread is finite (1, 0.5, 0.5)
      [
        [0, 0],
        [8.8e76, 0],
        [0, 8.8e76],
      ],
      // below that: quadrea finite (4·D² ≈ 5.2e307)
      [
        [0, 0],
        [6e76, 0],
        [0, 6e76],
      ],
      // spreads each > 0 whose product underflows to 0 (a needle-thin triangle: D² = 1e-220)
      [
        [0, 0],
        [1, 0],
        [2, 1e-110],
      ],
      // Q2·Q3 rounds to 0 while D² rounds to the least subnormal: the first spread is ∞ and
      // quadrea finite (found by a search over legs near 2^−268)
      [
        [0, 0],
        [2.7506880046981786e-81, 0],
        [0, 5.713944227837238e-82],
      ],
      // legs of 1e-170: every quadrance underflows to 0 (coincident in float; the spreads NaN)
      [
        [0, 0],
        [1e-170, 0],
        [0, 1e-170],
      ],
      // collinear, coincident
      [
        [0, 0],
        [1, 1],
        [2, 2],
      ],
      [
        [0, 0],
        [0, 0],
        [1, 2],
      ],
      // an ordinary right triangle (spreads exactly 1, 0.64 and 0.36)
      [
        [0, 0],
        [3, 0],
        [0, 4],
      ],
    ];
    for (const c of cases) {
      const args = c.map(([x, y]) => ({ x, y })) as never as [never, never, never];
      expect(outcome(() => triangle(float, ...args))).toStrictEqual(
        outcome(() => triangle(generic, ...args)),
      );
    }
    // and the first is refused (quadrea not finite), so the twin cannot have answered it
    const [a, b, d] = cases[0]!.map(([x, y]) => ({ x, y }));
    expect(outcome(() => triangle(float, a as never, b as never, d as never))).toBe('NOT_FINITE');
  });

  it('passes a point whose reading throws to the generic code, which throws the same', async () => {
    const { triangle } = await import('../../src/index.js');
    const throwing = {
      get x(): number {
        throw new RangeError('x is not readable');
      },
      y: 1,
    };
    for (const args of [
      [throwing, { x: 0, y: 0 }, { x: 1, y: 2 }],
      [{ x: 0, y: 0 }, { x: 1, y: 2 }, throwing],
    ] as never as [never, never, never][]) {
      expect(() => triangle(float, ...args)).toThrow('x is not readable');
      expect(() => triangle(generic, ...args)).toThrow('x is not readable');
    }
  });

  it('agrees exactly on 20000 seeded triangles of millimetre coordinates and right angles', async () => {
    const { triangle } = await import('../../src/index.js');
    let s = 0x5eed;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    let differ = 0;
    for (let i = 0; i < 20000; i++) {
      const size = 10 ** (rand() * 5);
      const c = () => Math.round(rand() * 1e8) / 1000;
      const x1 = c(),
        y1 = c();
      const dx = Math.round((rand() - 0.5) * size * 1000) / 1000;
      const dy = Math.round((rand() - 0.5) * size * 1000) / 1000;
      // Every other triangle has a right angle at A1 (spreads that round just above 1).
      const [x3, y3] = i % 2 ? [x1 - dy, y1 + dx] : [c(), c()];
      const P = [
        { x: x1, y: y1 },
        { x: x1 + dx, y: y1 + dy },
        { x: x3, y: y3 },
      ] as const;
      const a = outcome(() => triangle(float, P[0], P[1], P[2]));
      const b = outcome(() => triangle(generic, P[0], P[1], P[2]));
      try {
        expect(a).toStrictEqual(b);
      } catch {
        differ++;
      }
    }
    expect(differ).toBe(0);
  });
});

describe('sideShots(float, …) and sideShot(float, …) through the twin', () => {
  const num = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true });
  const awkward = fc.constantFrom(0, -0, 180, 360, -180, 1e300, -1e-300, '90', null, undefined);
  const shot = fc.record(
    {
      circle: fc.oneof(
        num(-720, 720),
        fc.integer({ min: -8, max: 8 }).map((k) => k * 90),
        // multiples of 30°: with orientation 0, bearings at sinCos's exact cases
        fc.integer({ min: -24, max: 24 }).map((k) => k * 30),
        awkward,
      ),
      zenith: fc.oneof(
        num(0, 360),
        fc.constantFrom(90, 180, 270, 45, 30, 60, 120, 150, 210, 240, 300, 330),
        awkward,
      ),
      slope: fc.oneof(num(0, 3000), fc.constantFrom(0, -0, -1, 1e200), awkward),
      targetHeight: fc.oneof(num(-2, 3), fc.constantFrom(undefined, 0, 1e308)),
      name: fc.constantFrom(undefined, 'P1', 7),
      ppm: fc.constantFrom(undefined, undefined, undefined, 10),
      unit: fc.constantFrom(undefined, undefined, undefined, 'gon'),
    },
    { requiredKeys: ['circle', 'zenith', 'slope'] },
  );
  const setup = fc.record({
    station: fc.oneof(
      fc.record({ x: num(-1e6, 1e6), y: num(-1e7, 1e7), z: num(-100, 5000) }),
      fc.record({ x: num(-1e6, 1e6), y: num(-1e7, 1e7) }),
      fc.constant({ x: 1e308, y: 0, z: 1e308 }),
    ),
    instrumentHeight: fc.oneof(num(0, 2), fc.constant(undefined)),
    orientation: fc.oneof(num(-400, 400), fc.constantFrom(0, 359.9999999999, `12°30'`)),
  });
  it('is exactly the generic float result (or the same error), awkward input included', async () => {
    const { sideShots, sideShot } = await import('../../src/index.js');
    fc.assert(
      fc.property(setup, fc.array(shot, { maxLength: 4 }), (S, shots) => {
        const st = S as never;
        expect(outcome(() => sideShots(float, st, shots as never))).toStrictEqual(
          outcome(() => sideShots(generic, st, shots as never)),
        );
        for (const o of shots)
          expect(outcome(() => sideShot(float, st, o as never))).toStrictEqual(
            outcome(() => sideShot(generic, st, o as never)),
          );
      }),
      { numRuns: 3000 },
    );
  });

  it('agrees exactly on 20000 seeded shots to the second and the millimetre', async () => {
    const { sideShots } = await import('../../src/index.js');
    let s = 0xface;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    const sec = (lo: number, hi: number) =>
      (lo * 3600 + Math.floor(rand() * (hi - lo) * 3600)) / 3600;
    const shots = Array.from({ length: 20000 }, () => ({
      circle: sec(0, 360),
      zenith: sec(60, 300),
      slope: Math.round(rand() * 2e6) / 1000,
      targetHeight: Math.round(rand() * 3000) / 1000,
    }));
    const setup = {
      station: { x: 351234.567, y: 5812345.678, z: 123.456 },
      instrumentHeight: 1.543,
      orientation: 211.5,
    };
    expect(sideShots(float, setup, shots)).toStrictEqual(sideShots(generic, setup, shots));
  });
});
