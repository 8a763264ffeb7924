// The float twins of the forward projections (src/geodesy/projection-float.ts) are the generic
// code's operations, in the same order, on plain numbers. These properties check that
// toGrid(float, …) (and the per-method functions), which run the twin, return exactly, bit for
// bit, what the generic code returns in float, or the same error code, over random and
// awkward points and projections.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  decimal,
  transverseMercator,
  float,
  defineEllipsoid,
  lambertConic,
  mercator,
  prepareProjection,
  toGrid,
  utmProjection,
  QuadspreadError,
} from '../../src/index.js';
import type { Projection } from '../../src/geodesy/projection-core.js';
import { FLOAT_LCC, FLOAT_TM, forwardFloatInto } from '../../src/geodesy/projection-float.js';

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

const CLARKE1866 = defineEllipsoid({ name: 'Clarke 1866', a: 6378206.4, b: 6356583.8 });
const SPHERE = defineEllipsoid({ name: 'sphere', a: 6371000, f: 0 });
const INTL = defineEllipsoid({ name: 'International 1924', a: 6378388, invF: 297 });
const CLARKE1880 = defineEllipsoid({ name: 'Clarke 1880 (IGN)', a: 6378249.2, b: 6356515 });
const BESSEL = defineEllipsoid({ name: 'Bessel 1841', a: '6377397.155', invF: '299.1528128' });
const KRASSOWSKY = defineEllipsoid({ name: 'Krassowsky 1940', a: 6378245, invF: '298.3' });

// Parameters: Lambert-93 (RGF93, IOGP EPSG dataset, CRS 2154); Jamaica National Grid (IOGP GN
// 7-2 §3.2.1.2 example); a southern cone (n < 0); a cone on a sphere (e = 0); Lambert in Paris
// grads with the Paris meridian (NTF / Lambert zone II's parameters, EPSG CRS 27572) and in US
// survey feet; Mercator variants A and B (GN 7-2 §3.2.3 examples' parameters). The values
// only need to be valid projections: the property compares two ways of computing each.
const PROJECTIONS: readonly Projection[] = [
  {
    method: 'lambert-conic-2sp',
    ellipsoid: 'GRS80',
    lat0: 46.5,
    lon0: 3,
    lat1: 49,
    lat2: 44,
    falseEasting: 700000,
    falseNorthing: 6600000,
  },
  {
    method: 'lambert-conic-1sp',
    ellipsoid: CLARKE1866,
    lat0: 18,
    lon0: -77,
    k0: 1,
    falseEasting: 250000,
    falseNorthing: 150000,
  },
  {
    method: 'lambert-conic-2sp',
    ellipsoid: 'WGS84',
    lat0: -32,
    lon0: 135,
    lat1: -28,
    lat2: -36,
    falseEasting: 1000000,
    falseNorthing: 2000000,
  },
  { method: 'lambert-conic-2sp', ellipsoid: SPHERE, lat0: 10, lon0: 179.5, lat1: 5, lat2: 20 },
  {
    method: 'lambert-conic-1sp',
    ellipsoid: CLARKE1880,
    lat0: 52,
    lon0: 0,
    k0: '0.99987742',
    falseEasting: 600000,
    falseNorthing: 2200000,
    primeMeridian: 2.5969213,
    angleUnit: 'grad',
    pointAngleUnit: 'deg',
  },
  {
    method: 'lambert-conic-2sp',
    ellipsoid: CLARKE1866,
    lat0: '27.5',
    lon0: -99,
    lat1: '28.383333333333',
    lat2: '30.283333333333',
    falseEasting: 2000000,
    falseNorthing: 10000000,
    linearUnit: 'us-survey-foot',
  },
  {
    method: 'mercator-1sp',
    ellipsoid: BESSEL,
    lon0: 110,
    k0: '0.997',
    falseEasting: 3900000,
    falseNorthing: 900000,
  },
  { method: 'mercator-2sp', ellipsoid: KRASSOWSKY, lat1: 42, lon0: 51 },
  { method: 'mercator-1sp', ellipsoid: SPHERE, lon0: -180, k0: 1, linearUnit: 'foot' },
  // no twin (angles in grads): the generic code, equal by construction
  { method: 'mercator-1sp', ellipsoid: INTL, lon0: 0, k0: 1, angleUnit: 'grad' },
  // huge false origin: the sums overflow float
  {
    method: 'mercator-1sp',
    ellipsoid: 'WGS84',
    lon0: 0,
    k0: 1,
    falseEasting: 1.7976931348623157e308,
  },
];

const latitude = fc.oneof(
  fc.double({ min: -90, max: 90, noNaN: true }),
  fc.double({ min: 40, max: 52, noNaN: true }),
  fc.double({ min: 89.999999, max: 90, noNaN: true }),
  fc.double({ min: -90, max: -89.999999, noNaN: true }),
  fc.double({ noNaN: true }),
  fc.constantFrom(90, -90, 0, -0, 45, 30, 60, 89.99999999999999, 90.0000001, -91, 5e-324),
  fc.constantFrom(`46°30'N`, '12.5', null, undefined, Number.NaN, Infinity),
);
const longitude = fc.oneof(
  fc.double({ min: -540, max: 540, noNaN: true }),
  fc.double({ min: -10, max: 15, noNaN: true }),
  fc.double({ noNaN: true }),
  fc.integer({ min: -8, max: 8 }).map((k) => k * 45 + 3),
  fc.constantFrom(0, -0, 180, -180, 179.5, -0.5, 359.5, 1e15, -1e300, `3°E`, '3', null),
);

describe('toGrid(float, …) through the float twin', () => {
  const prepared = PROJECTIONS.map((p) => ({
    fast: prepareProjection(float, p),
    slow: prepareProjection(generic, p),
  }));

  it('is exactly the generic float result (or the same error), prepared or not', () => {
    fc.assert(
      fc.property(
        latitude,
        longitude,
        fc.integer({ min: 0, max: PROJECTIONS.length - 1 }),
        fc.boolean(),
        (lat, lon, i, prepare) => {
          const p = { lat, lon } as never;
          const fast = prepare ? prepared[i]!.fast : PROJECTIONS[i]!;
          const slow = prepare ? prepared[i]!.slow : PROJECTIONS[i]!;
          expect(outcome(() => toGrid(float, p, fast))).toStrictEqual(
            outcome(() => toGrid(generic, p, slow)),
          );
        },
      ),
      { numRuns: 6000 },
    );
  });

  it('lambertConic(float, …) and mercator(float, …) agree exactly with the generic code', () => {
    fc.assert(
      fc.property(latitude, longitude, (lat, lon) => {
        const p = { lat, lon } as never;
        expect(outcome(() => lambertConic(float, p, PROJECTIONS[1]!))).toStrictEqual(
          outcome(() => lambertConic(generic, p, PROJECTIONS[1]!)),
        );
        expect(outcome(() => mercator(float, p, PROJECTIONS[6]!))).toStrictEqual(
          outcome(() => mercator(generic, p, PROJECTIONS[6]!)),
        );
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees exactly on 20000 seeded points per projection over its zone and the globe', () => {
    // A seeded generator (xorshift) rather than fast-check: rounding differences such as
    // e²·s·s against e²·(s·s) show in about one point in 5000, so many points are needed.
    let s = 0x5eed1234;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    let differ = 0;
    let fastRuns = 0;
    const out = new Float64Array(4);
    for (const { fast, slow } of prepared) {
      for (let i = 0; i < 20000; i++) {
        // half over France's extent, half anywhere on the globe
        const p =
          i % 2 === 0
            ? { lat: 41 + rand() * 10.5, lon: -5 + rand() * 15 }
            : { lat: rand() * 180 - 90, lon: rand() * 720 - 360 };
        const a = outcome(() => toGrid(float, p, fast));
        const b = outcome(() => toGrid(generic, p, slow));
        try {
          expect(a).toStrictEqual(b);
        } catch {
          differ++;
        }
      }
    }
    expect(differ).toBe(0);
    // and the twin itself ran (not only its fall-back to the generic code)
    const lambert93 = prepareProjection(float, PROJECTIONS[0]!);
    for (let i = 0; i < 1000; i++) {
      const lat = 41 + rand() * 10.5;
      const lon = -5 + rand() * 15;
      const internal = Object.getOwnPropertySymbols(lambert93).map(
        (k) => (lambert93 as unknown as Record<symbol, { fk: number; fc: Float64Array }>)[k]!,
      )[0]!;
      expect(internal.fk).toBe(FLOAT_LCC);
      if (forwardFloatInto(internal.fk, internal.fc, lat, lon, out)) fastRuns++;
    }
    expect(fastRuns).toBe(1000);
  });

  it('takes the generic code for a projection prepared for another arithmetic, and refuses it', () => {
    const p = prepareProjection(generic, PROJECTIONS[0]!);
    expect(outcome(() => toGrid(float, { lat: 46, lon: 3 }, p as never))).toBe('INVALID_ARGUMENT');
    expect(outcome(() => toGrid(float, null as never, prepared[0]!.fast))).toBe('INVALID_ARGUMENT');
  });
});

// Transverse Mercator: UTM zones 31N and 33S (utmProjection); the British National Grid's
// parameters (Ordnance Survey, "A guide to coordinate systems in Great Britain", on Airy
// 1830); a sphere (n = 0: every α is 0); a grid in US survey feet with a prime meridian.
const AIRY = defineEllipsoid({ name: 'Airy 1830', a: 6377563.396, b: 6356256.909 });
const TM_PROJECTIONS: readonly Projection[] = [
  utmProjection(31, 'N'),
  utmProjection(33, 'S', 'GRS80'),
  {
    method: 'transverse-mercator',
    ellipsoid: AIRY,
    lat0: 49,
    lon0: -2,
    k0: '0.9996012717',
    falseEasting: 400000,
    falseNorthing: -100000,
  },
  { method: 'transverse-mercator', ellipsoid: SPHERE, lat0: -30, lon0: 150 },
  {
    method: 'transverse-mercator',
    ellipsoid: CLARKE1866,
    lat0: '30.5',
    lon0: -85.833333333333,
    k0: '0.99996',
    falseEasting: 200000,
    linearUnit: 'us-survey-foot',
    primeMeridian: 0.5,
  },
];

describe('toGrid(float, …) through the Transverse Mercator float twin', () => {
  const prepared = TM_PROJECTIONS.map((p) => ({
    fast: prepareProjection(float, p),
    slow: prepareProjection(generic, p),
  }));
  // near the central meridians, far from them (the series refused beyond about 61°, points
  // 90° away refused), and anywhere
  const tmLongitude = fc.oneof(
    longitude,
    fc.double({ min: -10, max: 10, noNaN: true }).map((d) => d + 3),
    fc.double({ min: 55, max: 95, noNaN: true }).map((d) => 3 + d),
    fc.double({ min: -95, max: -55, noNaN: true }).map((d) => 3 + d),
    fc.constantFrom(93, -87, 63, -57, 3, 15, -2, 150, 330),
  );

  it('is exactly the generic float result (or the same error), prepared or not', () => {
    fc.assert(
      fc.property(
        latitude,
        tmLongitude,
        fc.integer({ min: 0, max: TM_PROJECTIONS.length - 1 }),
        fc.boolean(),
        (lat, lon, i, prepare) => {
          const p = { lat, lon } as never;
          const fast = prepare ? prepared[i]!.fast : TM_PROJECTIONS[i]!;
          const slow = prepare ? prepared[i]!.slow : TM_PROJECTIONS[i]!;
          expect(outcome(() => toGrid(float, p, fast))).toStrictEqual(
            outcome(() => toGrid(generic, p, slow)),
          );
        },
      ),
      { numRuns: 4000 },
    );
  });

  it('agrees exactly on 20000 seeded points per projection within 60° of the central meridian', () => {
    let s = 0x7a3c91e5;
    const rand = () => {
      s ^= s << 13;
      s >>>= 0;
      s ^= s >>> 17;
      s ^= s << 5;
      s >>>= 0;
      return s / 4294967296;
    };
    let differ = 0;
    let refused = 0;
    for (let i = 0; i < TM_PROJECTIONS.length; i++) {
      const { fast, slow } = prepared[i]!;
      const lon0 = Number(TM_PROJECTIONS[i]!.lon0) + Number(TM_PROJECTIONS[i]!.primeMeridian ?? 0);
      for (let n = 0; n < 20000; n++) {
        // a UTM zone's width (±3°) for most points, up to ±60° for the rest
        const p = {
          lat: rand() * 180 - 90,
          lon: lon0 + (n % 4 === 0 ? rand() * 120 - 60 : rand() * 6 - 3),
        };
        const a = outcome(() => toGrid(float, p, fast));
        const b = outcome(() => toGrid(generic, p, slow));
        if (typeof b === 'string') refused++;
        try {
          expect(a).toStrictEqual(b);
        } catch {
          differ++;
        }
      }
    }
    expect(differ).toBe(0);
    expect(refused).toBeLessThan(1000);
    // the twin itself ran for UTM points
    const out = new Float64Array(4);
    const utm = prepared[0]!.fast;
    const internal = Object.getOwnPropertySymbols(utm).map(
      (k) => (utm as unknown as Record<symbol, { fk: number; fc: Float64Array }>)[k]!,
    )[0]!;
    expect(internal.fk).toBe(FLOAT_TM);
    let fastRuns = 0;
    for (let n = 0; n < 1000; n++)
      if (forwardFloatInto(internal.fk, internal.fc, rand() * 160 - 80, rand() * 6, out))
        fastRuns++;
    expect(fastRuns).toBe(1000);
  });
});

describe('toGrid(A, point, projection) with a projection object that cannot change', () => {
  it('gives exactly what a fresh preparation gives, call after call, for every method entry', () => {
    const utm = utmProjection(31, 'N');
    const lambert = Object.freeze({ ...PROJECTIONS[1]! });
    for (let i = 0; i < 50; i++) {
      const p = { lat: -80 + i * 3.2, lon: i * 0.11 };
      for (const proj of [utm, lambert]) {
        expect(toGrid(float, p, proj)).toStrictEqual(toGrid(generic, p, proj));
        expect(toGrid(float, p, proj)).toStrictEqual(
          toGrid(float, p, prepareProjection(float, proj)),
        );
      }
      // the entry of one method still refuses another method's projection
      expect(outcome(() => lambertConic(float, p, utm))).toBe('INVALID_ARGUMENT');
    }
  });

  it('reads a projection that can change afresh on every call', () => {
    const p = { lat: 46, lon: 4 };
    const mutable = { ...PROJECTIONS[0]! } as { falseEasting: number } & Projection;
    const first = toGrid(float, p, mutable);
    mutable.falseEasting = 0;
    expect(toGrid(float, p, mutable).E).toBeCloseTo(first.E - 700000, 6);
    // frozen, but read through a getter
    let fe = 700000;
    const getter = Object.freeze(
      Object.defineProperty({ ...PROJECTIONS[0]! }, 'falseEasting', {
        get: () => fe,
        enumerable: true,
      }),
    );
    const g1 = toGrid(float, p, getter);
    fe = 0;
    expect(toGrid(float, p, getter).E).toBeCloseTo(g1.E - 700000, 6);
  });
});

describe('toGrid(A, …) in Transverse Mercator with the origin computed once', () => {
  it('is exactly transverseMercator (which computes the origin on every call) in decimal(25)', () => {
    const D = decimal(25);
    const utm = prepareProjection(D, utmProjection(31, 'N'));
    const bng = prepareProjection(D, TM_PROJECTIONS[2]!);
    fc.assert(
      fc.property(
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -2.9, max: 2.9, noNaN: true }),
        (lat, d) => {
          const g = toGrid(D, { lat, lon: 3 + d }, utm);
          const t = transverseMercator(
            D,
            { lat, lon: D.sub(D.sub(D.from(3 + d), D.from(3)), D.zero) },
            { lon0: 0, lat0: 0, k0: '0.9996', ellipsoid: 'WGS84' },
          );
          expect(D.toString(g.E)).toBe(D.toString(D.add(D.from(500000), t.E)));
          expect(D.toString(g.N)).toBe(D.toString(D.add(D.zero, t.N)));
          expect(D.toString(g.k)).toBe(D.toString(t.k));
          const b = toGrid(D, { lat, lon: -2 + d }, bng);
          const u = transverseMercator(
            D,
            { lat, lon: D.sub(D.from(-2 + d), D.from(-2)) },
            { lon0: 0, lat0: 49, k0: '0.9996012717', ellipsoid: AIRY },
          );
          expect(D.toString(b.N)).toBe(D.toString(D.add(D.from(-100000), u.N)));
        },
      ),
      { numRuns: 60 },
    );
  });
});
