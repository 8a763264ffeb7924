import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { rational } from '../../src/arithmetic/rational.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { float } from '../../src/arithmetic/float.js';
import { QuadspreadError } from '../../src/errors.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import {
  GRS80,
  WGS84,
  defineEllipsoid,
  ellipsoidByName,
  ellipsoidParameters,
  geodeticToGeocentric,
  geocentricToGeodetic,
  enuRotation,
  enuFromGeocentric,
  geocentricFromEnu,
  flatEarthError,
  meridianRadius,
  primeVerticalRadius,
  radiusInAzimuth,
  gaussianMeanRadius,
  heightReductionFactor,
  transverseMercatorFactors,
  transverseMercator,
  transverseMercatorInverse,
  combinedFactor,
  groundToGrid,
  gridToGround,
} from '../../src/geodesy/index.js';

const d2r = Math.PI / 180;
const a = 6378137;
const fW = 1 / 298.257223563;
const e2W = fW * (2 - fW);

/** Independent float forward formula with Math.* (the textbook one, written again here). */
function forwardMath(lat: number, lon: number, h: number) {
  const s = Math.sin(lat * d2r);
  const N = a / Math.sqrt(1 - e2W * s * s);
  return {
    X: (N + h) * Math.cos(lat * d2r) * Math.cos(lon * d2r),
    Y: (N + h) * Math.cos(lat * d2r) * Math.sin(lon * d2r),
    Z: (N * (1 - e2W) + h) * s,
  };
}

const latArb = fc.oneof(
  fc.double({ min: -90, max: 90, noNaN: true }),
  fc.double({ min: 89.9999, max: 90, noNaN: true }),
  fc.double({ min: -90, max: -89.9999, noNaN: true }),
);
const lonArb = fc.double({ min: -180, max: 180, noNaN: true });
const hArb = fc.oneof(
  fc.double({ min: -5000, max: 10000, noNaN: true }),
  fc.double({ min: 10000, max: 4e7, noNaN: true }),
);

describe('geodeticToGeocentric agrees with an independent Math.* evaluation', () => {
  it('geodeticToGeocentric(float, …) is within 1 µm of the textbook formula written with Math.*', () => {
    fc.assert(
      fc.property(
        latArb,
        lonArb,
        fc.double({ min: -5000, max: 10000, noNaN: true }),
        (lat, lon, h) => {
          const p = geodeticToGeocentric(float, { lat, lon, h }, WGS84);
          const q = forwardMath(lat, lon, h);
          expect(Math.hypot(p.X - q.X, p.Y - q.Y, p.Z - q.Z)).toBeLessThan(1e-6);
        },
      ),
    );
  });
});

describe('geodetic → geocentric → geodetic round trips', () => {
  it('recover lat/lon within 1e-9″ and h within 1e-8 m in float, including near the poles and at heights to 40 000 km', () => {
    fc.assert(
      fc.property(latArb, lonArb, hArb, (lat, lon, h) => {
        const g = geocentricToGeodetic(
          float,
          geodeticToGeocentric(float, { lat, lon, h }, WGS84),
          WGS84,
        );
        expect(Math.abs(g.lat - lat) * 3600, `lat ${lat}`).toBeLessThan(
          1e-9 * Math.max(1, h / 1e5),
        );
        if (Math.abs(lat) < 90) {
          // the longitude is undefined on the axis; near it, compare as a horizontal angle
          const dl = Math.abs(((g.lon - lon + 540) % 360) - 180) * Math.cos(lat * d2r);
          expect(dl * 3600, `lon ${lon} at lat ${lat}`).toBeLessThan(1e-9 * Math.max(1, h / 1e5));
        }
        expect(Math.abs(g.h - h), `h ${h}`).toBeLessThan(1e-8 * Math.max(1, h / 1e5));
      }),
      { numRuns: 300 },
    );
  });
  it('recover lat/lon and h to about 30 digits in decimal(34)', () => {
    const D = decimal(34);
    fc.assert(
      fc.property(latArb, lonArb, hArb, (lat, lon, h) => {
        const P = geodeticToGeocentric(
          D,
          { lat: String(lat), lon: String(lon), h: String(h) },
          GRS80,
        );
        const g = geocentricToGeodetic(D, P, GRS80);
        expect(Math.abs(Number(D.toString(D.sub(g.lat, D.from(lat))))), `lat ${lat}`).toBeLessThan(
          1e-28,
        );
        if (Math.abs(lat) < 89.99) {
          // −180° comes back as +180° (atan2 is in (−180°, 180°]): compare modulo 360° in decimal
          let dl = D.sub(g.lon, D.from(lon));
          if (D.cmp(dl, D.from(180)) > 0) dl = D.sub(dl, D.from(360));
          if (D.cmp(dl, D.from(-180)) < 0) dl = D.add(dl, D.from(360));
          expect(Math.abs(Number(D.toString(dl))), `lon ${lon}`).toBeLessThan(1e-28);
        }
        expect(Math.abs(Number(D.toString(D.sub(g.h, D.from(h))))), `h ${h}`).toBeLessThan(
          1e-24 * Math.max(1, h / 1e6),
        );
      }),
      { numRuns: 40 },
    );
  });
  it('recover the point within 1e-30 m in rational', () => {
    const R = rational;
    for (const [lat, lon, h] of [
      [53.6, -1.66, 299.8],
      [-89.99999, 120, 10],
      [0, 179.5, 35786000],
      [45, 45, -1000],
    ] as const) {
      const g = geocentricToGeodetic(R, geodeticToGeocentric(R, { lat, lon, h }, GRS80), GRS80);
      expect(Math.abs(R.toNumber(R.sub(g.lat, R.from(lat))))).toBeLessThan(1e-30);
      expect(Math.abs(R.toNumber(R.sub(g.lon, R.from(lon))))).toBeLessThan(1e-30);
      expect(Math.abs(R.toNumber(R.sub(g.h, R.from(h))))).toBeLessThan(1e-26);
    }
  });
  it('geocentricToGeodetic on the polar axis gives ±90° and h = |Z| − b exactly in rational', () => {
    const R = rational;
    const b = ellipsoidParameters(R, GRS80).b;
    const g = geocentricToGeodetic(R, { X: 0, Y: 0, Z: -6400000 }, GRS80);
    expect(R.toString(g.lat)).toBe('-90');
    expect(R.eq(g.h, R.sub(R.from(6400000), b))).toBe(true);
  });
});

describe('the ENU frame is a rotation', () => {
  const origins = fc.record({
    lat: fc.integer({ min: -900000, max: 900000 }).map((x) => `${x / 10000}`),
    lon: fc.integer({ min: -1800000, max: 1800000 }).map((x) => `${x / 10000}`),
  });
  it('enuRotation(rational, …) is exactly orthonormal with determinant exactly 1', () => {
    fc.assert(
      fc.property(origins, (o) => {
        const R = rational;
        const M = enuRotation(R, o);
        for (let i = 0; i < 3; i++)
          for (let j = 0; j < 3; j++) {
            let dot = R.zero;
            for (let k = 0; k < 3; k++) dot = R.add(dot, R.mul(M[i]![k]!, M[j]![k]!));
            expect(R.eq(dot, i === j ? R.one : R.zero)).toBe(true);
          }
        const [r0, r1, r2] = M;
        const det = R.add(
          R.sub(
            R.mul(r0[0], R.sub(R.mul(r1[1], r2[2]), R.mul(r1[2], r2[1]))),
            R.mul(r0[1], R.sub(R.mul(r1[0], r2[2]), R.mul(r1[2], r2[0]))),
          ),
          R.mul(r0[2], R.sub(R.mul(r1[0], r2[1]), R.mul(r1[1], r2[0]))),
        );
        expect(R.eq(det, R.one)).toBe(true);
      }),
      { numRuns: 40 },
    );
  });
  it('enuFromGeocentric(rational, …) preserves quadrances exactly', () => {
    fc.assert(
      fc.property(
        origins,
        fc.array(fc.integer({ min: -100000, max: 100000 }), { minLength: 6, maxLength: 6 }),
        (o, c) => {
          const R = rational;
          const O = geodeticToGeocentric(R, { ...o, h: 0 }, WGS84);
          const P = {
            X: R.add(O.X, R.from(c[0]!)),
            Y: R.add(O.Y, R.from(c[1]!)),
            Z: R.add(O.Z, R.from(c[2]!)),
          };
          const Q = {
            X: R.add(O.X, R.from(`${c[3]}/7`)),
            Y: R.add(O.Y, R.from(c[4]!)),
            Z: R.add(O.Z, R.from(c[5]!)),
          };
          const p = enuFromGeocentric(R, { ...o, h: 0 }, P, WGS84);
          const q = enuFromGeocentric(R, { ...o, h: 0 }, Q, WGS84);
          const sq = (x: ReturnType<typeof R.from>) => R.mul(x, x);
          const Qgeo = R.add(R.add(sq(R.sub(P.X, Q.X)), sq(R.sub(P.Y, Q.Y))), sq(R.sub(P.Z, Q.Z)));
          const Qenu = R.add(R.add(sq(R.sub(p.e, q.e)), sq(R.sub(p.n, q.n))), sq(R.sub(p.u, q.u)));
          expect(R.eq(Qgeo, Qenu)).toBe(true);
        },
      ),
      { numRuns: 25 },
    );
  });
  it('up is the ellipsoid normal, north points along increasing latitude, east along increasing longitude (Math.* finite differences)', () => {
    fc.assert(
      fc.property(fc.double({ min: -89, max: 89, noNaN: true }), lonArb, (lat, lon) => {
        const o = { lat, lon, h: 0 };
        const up = enuFromGeocentric(float, o, forwardMath(lat, lon, 100), WGS84);
        expect(Math.abs(up.u - 100) + Math.abs(up.e) + Math.abs(up.n)).toBeLessThan(1e-6);
        const north = enuFromGeocentric(float, o, forwardMath(lat + 1e-5, lon, 0), WGS84);
        expect(north.n).toBeGreaterThan(1);
        expect(Math.abs(north.e)).toBeLessThan(1e-6);
        const east = enuFromGeocentric(float, o, forwardMath(lat, lon + 1e-5, 0), WGS84);
        expect(east.e).toBeGreaterThan(0);
        expect(Math.abs(east.n) / east.e).toBeLessThan(1e-4);
      }),
    );
  });
  it('geocentricFromEnu inverts enuFromGeocentric (float within 1e-8 m, rational exactly)', () => {
    const o = { lat: `47°22'N`, lon: `8°33'E`, h: 408 };
    const local = { e: 1234.5, n: -987.25, u: 12.5 };
    const P = geocentricFromEnu(float, o, local, GRS80);
    const back = enuFromGeocentric(float, o, P, GRS80);
    expect(
      Math.abs(back.e - local.e) + Math.abs(back.n - local.n) + Math.abs(back.u - local.u),
    ).toBeLessThan(1e-8);
    const R = rational;
    const PR = geocentricFromEnu(R, o, local, GRS80);
    const bR = enuFromGeocentric(R, o, PR, GRS80);
    expect([R.toString(bR.e), R.toString(bR.n), R.toString(bR.u)]).toEqual([
      '2469/2',
      '-3949/4',
      '25/2',
    ]);
  });
  it('flatEarthError(A, s) is s²/(2R) and s³/(6R²), against R(1 − cos(s/R)) and s − R sin(s/R) with Math.*', () => {
    for (const s of [100, 1000, 5000, 20000]) {
      const R = 6371008.7714;
      const f = flatEarthError(float, s);
      expect(Math.abs(f.drop - R * (1 - Math.cos(s / R))) / f.drop).toBeLessThan(1e-5);
      expect(Math.abs(f.shortening - (s - R * Math.sin(s / R))) / f.shortening).toBeLessThan(1e-3);
    }
    expect(rational.toString(flatEarthError(rational, 1000, 6400000).drop)).toBe('5/64');
  });
});

describe('radii of curvature', () => {
  const R = rational;
  const P = ellipsoidParameters(R, GRS80);
  it('M = a(1 − e²) and N = a at the equator, M = N = a²/b at the poles (exact in rational)', () => {
    expect(R.eq(meridianRadius(R, 0, GRS80), R.mul(P.a, R.sub(R.one, P.e2)))).toBe(true);
    expect(R.eq(primeVerticalRadius(R, 0, GRS80), P.a)).toBe(true);
    const polar = R.div(R.mul(P.a, P.a), P.b);
    expect(Math.abs(R.toNumber(R.sub(meridianRadius(R, 90, GRS80), polar)))).toBeLessThan(1e-30);
    expect(Math.abs(R.toNumber(R.sub(primeVerticalRadius(R, '-90', GRS80), polar)))).toBeLessThan(
      1e-30,
    );
  });
  it('radiusInAzimuth is M at 0° and 180°, N at 90°, and between them otherwise; √(MN) lies between M and N', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (lat, az) => {
          const M = meridianRadius(float, lat, GRS80);
          const N = primeVerticalRadius(float, lat, GRS80);
          const Ra = radiusInAzimuth(float, lat, az, GRS80);
          expect(Ra).toBeGreaterThanOrEqual(M * (1 - 1e-15));
          expect(Ra).toBeLessThanOrEqual(N * (1 + 1e-15));
          const G = gaussianMeanRadius(float, lat, GRS80);
          expect(Math.abs(G - Math.sqrt(M * N)) / G).toBeLessThan(1e-15);
        },
      ),
    );
    expect(
      Math.abs(radiusInAzimuth(float, 40, 0, GRS80) - meridianRadius(float, 40, GRS80)),
    ).toBeLessThan(1e-6);
    expect(
      Math.abs(radiusInAzimuth(float, 40, `180°`, GRS80) - meridianRadius(float, 40, GRS80)),
    ).toBeLessThan(1e-6);
  });
  it('M is the derivative of the meridian arc: the chord between latitudes φ ± δ over 2δ (independent Math.* geometry)', () => {
    for (const lat of [0, 30, 52.5, 80]) {
      const dd = 1e-4;
      const p = forwardMath(lat + dd, 0, 0);
      const q = forwardMath(lat - dd, 0, 0);
      const chord = Math.hypot(p.X - q.X, p.Z - q.Z);
      const M = meridianRadius(float, lat, WGS84);
      expect(Math.abs(chord / (2 * dd * d2r) - M) / M).toBeLessThan(1e-8);
    }
  });
});

describe('ground to grid', () => {
  it('heightReductionFactor(A, h, R) is R/(R + h): exact in rational, below 1 above the ellipsoid', () => {
    expect(rational.toString(heightReductionFactor(rational, 500, 6380000))).toBe('12760/12761');
    expect(heightReductionFactor(float, -50, 6.38e6)).toBeGreaterThan(1);
  });
  it('groundToGrid and gridToGround are inverse: ground × CF = grid, grid ÷ CF = ground (exact in rational)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 10 ** 7 }),
        fc.integer({ min: 9990, max: 10010 }),
        (mm, cf) => {
          const R = rational;
          const ground = R.from(`${mm}/1000`);
          const factor = R.from(`${cf}/10000`);
          const grid = groundToGrid(R, ground, factor);
          expect(R.eq(grid, R.mul(ground, factor))).toBe(true);
          expect(R.eq(gridToGround(R, grid, factor), ground)).toBe(true);
        },
      ),
    );
  });
  it('combinedFactor multiplies the height factor and the scale factor', () => {
    expect(rational.toString(combinedFactor(rational, '99/100', '101/100'))).toBe('9999/10000');
  });

  it('transverseMercatorFactors on a sphere equals the closed forms k = 1/√(1 − B²), B = cos φ sin λ; tan γ = tan λ sin φ (Snyder, Map Projections — A Working Manual, USGS PP 1395, 1987, §8, from memory)', () => {
    const S = defineEllipsoid({ a: 6371000, f: 0 });
    fc.assert(
      fc.property(
        fc.double({ min: -89.9, max: 89.9, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        (lat, lon) => {
          const t = transverseMercatorFactors(float, { lat, lon }, { lon0: 0, ellipsoid: S });
          const B = Math.cos(lat * d2r) * Math.sin(lon * d2r);
          expect(Math.abs(t.k - 1 / Math.sqrt(1 - B * B))).toBeLessThan(1e-13);
          expect(
            Math.abs(t.convergence - Math.atan(Math.tan(lon * d2r) * Math.sin(lat * d2r)) / d2r),
          ).toBeLessThan(1e-12);
        },
      ),
    );
  });

  it('transverseMercatorFactors on GRS80 agrees with the classical series in λ (Snyder 1987 eq. 8-11 for k; the Redfearn-type series for γ; from memory) within their truncation', () => {
    const e2 = ellipsoidParameters(float, GRS80).e2;
    const ep2 = e2 / (1 - e2);
    fc.assert(
      fc.property(
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        (lat, lon) => {
          const t = transverseMercatorFactors(
            float,
            { lat, lon: lon + 9 },
            { lon0: 9, k0: 1, ellipsoid: GRS80 },
          );
          const phi = lat * d2r;
          const l = lon * d2r;
          const T = Math.tan(phi) ** 2;
          const C = ep2 * Math.cos(phi) ** 2;
          const Aq = l * Math.cos(phi);
          const k =
            1 +
            ((1 + C) * Aq ** 2) / 2 +
            ((5 - 4 * T + 42 * C + 13 * C * C - 28 * ep2) * Aq ** 4) / 24 +
            ((61 - 148 * T + 16 * T * T) * Aq ** 6) / 720;
          const g =
            l *
            Math.sin(phi) *
            (1 +
              ((l * l * Math.cos(phi) ** 2) / 3) * (1 + 3 * C + 2 * C * C) +
              ((l ** 4 * Math.cos(phi) ** 4) / 15) * (2 - T));
          expect(Math.abs(t.k - k)).toBeLessThan(2e-10);
          expect(Math.abs(t.convergence * d2r - g)).toBeLessThan(2e-9);
        },
      ),
    );
  });
  it('transverseMercatorFactors gives k = k0 (to the series truncation, n⁷ ≈ 4e-20) and γ = 0 on the central meridian, and the same digits in decimal(34) and rational', () => {
    const proj = { lon0: `-2°`, k0: '0.9996012717', ellipsoid: 'GRS80' };
    const D = decimal(34);
    const c = transverseMercatorFactors(D, { lat: 51, lon: -2 }, proj);
    expect(Math.abs(Number(D.toString(D.sub(c.k, D.from('0.9996012717')))))).toBeLessThan(1e-17);
    expect(D.isZero(c.convergence)).toBe(true);
    const d = transverseMercatorFactors(D, { lat: `52°39'27.2531"N`, lon: `1°43'4.5177"E` }, proj);
    const r = transverseMercatorFactors(
      rational,
      { lat: `52°39'27.2531"N`, lon: `1°43'4.5177"E` },
      proj,
    );
    expect(rational.toPrecision(r.k, 30)).toBe(D.toPrecision(d.k, 30));
    expect(rational.toPrecision(r.convergence, 30)).toBe(D.toPrecision(d.convergence, 30));
    const f = transverseMercatorFactors(
      float,
      { lat: `52°39'27.2531"N`, lon: `1°43'4.5177"E` },
      proj,
    );
    expect(Math.abs(f.k - D.toNumber(d.k))).toBeLessThan(1e-15);
    expect(f.convergence).toBeGreaterThan(0); // east of the central meridian, northern hemisphere
  });
});

describe('transverseMercatorInverse undoes transverseMercator', () => {
  const utm = { lon0: 9, k0: 0.9996, falseEasting: 500000, falseNorthing: 0, ellipsoid: GRS80 };
  it('in float within 1e-9″ on random points up to 10° from the central meridian and 85° latitude', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -85, max: 85, noNaN: true }),
        fc.double({ min: -1, max: 19, noNaN: true }),
        (lat, lon) => {
          const p = transverseMercator(float, { lat, lon }, utm);
          const g = transverseMercatorInverse(float, p, utm);
          expect(Math.abs(g.lat - lat) * 3600).toBeLessThan(1e-9);
          expect(Math.abs(g.lon - lon) * 3600 * Math.cos(lat * d2r)).toBeLessThan(1e-9);
          expect(Math.abs(g.k - p.k)).toBeLessThan(1e-15);
        },
      ),
      { numRuns: 60 },
    );
  });
  it('in decimal(34) within 1e-25°', () => {
    const D = decimal(34);
    for (const [lat, lon] of [
      [47.25, 11.5],
      [-33.9, 6.1],
      [70, 3],
    ] as const) {
      const p = transverseMercator(D, { lat, lon }, utm);
      const g = transverseMercatorInverse(D, p, utm);
      expect(Math.abs(Number(D.toString(D.sub(g.lat, D.from(lat)))))).toBeLessThan(1e-25);
      expect(Math.abs(Number(D.toString(D.sub(g.lon, D.from(lon)))))).toBeLessThan(1e-25);
    }
  });
});

function code(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof QuadspreadError) return e.code;
    return `not a QuadspreadError: ${String(e)}`;
  }
  return 'no error';
}

describe('bad input gets typed errors', () => {
  const A: Arithmetic<number> = float;
  const cases: [string, () => unknown, string][] = [
    [
      'a latitude of 90.0001°',
      () => geodeticToGeocentric(A, { lat: 90.0001, lon: 0, h: 0 }, WGS84),
      'LATITUDE_OUT_OF_RANGE',
    ],
    [
      'a latitude of −91° as DMS',
      () => geodeticToGeocentric(A, { lat: `91°00'00"S`, lon: 0 }, WGS84),
      'LATITUDE_OUT_OF_RANGE',
    ],
    [
      'non-numeric DMS text',
      () => geodeticToGeocentric(A, { lat: `5x°12'`, lon: 0 }, WGS84),
      'INVALID_ANGLE',
    ],
    [
      'minutes of 61 in DMS',
      () => geodeticToGeocentric(A, { lat: 10, lon: `10°61'` }, WGS84),
      'INVALID_ANGLE',
    ],
    // OS guide annex B's point with latitude and longitude swapped: the letters give it away.
    [
      'a latitude ending in W (swapped with the longitude)',
      () => geodeticToGeocentric(A, { lat: `1°39'51.9920"W`, lon: `53°36'43.1653"N` }, GRS80),
      'INVALID_ANGLE',
    ],
    [
      'a longitude ending in N',
      () => geodeticToGeocentric(A, { lat: 53.6, lon: `1°39'51.9920"N` }, GRS80),
      'INVALID_ANGLE',
    ],
    [
      'a latitude starting with E',
      () => transverseMercator(A, { lat: 'E 10', lon: 0 }, { lon0: 0, ellipsoid: GRS80 }),
      'INVALID_ANGLE',
    ],
    [
      'a height below −a',
      () => geodeticToGeocentric(A, { lat: 0, lon: 0, h: -6378137.5 }, WGS84),
      'HEIGHT_OUT_OF_RANGE',
    ],
    [
      'an unknown ellipsoid name',
      () => geodeticToGeocentric(A, { lat: 0, lon: 0 }, 'Clarke 1880'),
      'UNKNOWN_ELLIPSOID',
    ],
    [
      'an object that is not an ellipsoid',
      () => geocentricToGeodetic(A, { X: 1, Y: 2, Z: 3 }, {} as never),
      'UNKNOWN_ELLIPSOID',
    ],
    ['ellipsoidByName of an unknown name', () => ellipsoidByName('Bessel'), 'UNKNOWN_ELLIPSOID'],
    [
      'defineEllipsoid with f and b',
      () => defineEllipsoid({ a: 1, f: 0.1, b: 0.9 }),
      'INVALID_ELLIPSOID',
    ],
    ['defineEllipsoid with a ≤ 0', () => defineEllipsoid({ a: 0, invF: 300 }), 'INVALID_ELLIPSOID'],
    ['defineEllipsoid with f = 1', () => defineEllipsoid({ a: 1, f: 1 }), 'INVALID_ELLIPSOID'],
    ['defineEllipsoid with b > a', () => defineEllipsoid({ a: 1, b: 2 }), 'INVALID_ELLIPSOID'],
    [
      'the centre of the Earth',
      () => geocentricToGeodetic(A, { X: 0, Y: 0, Z: 0 }, GRS80),
      'INVALID_ARGUMENT',
    ],
    [
      'a point deep inside the Earth',
      () => geocentricToGeodetic(A, { X: 1000, Y: 0, Z: 1 }, GRS80),
      'HEIGHT_OUT_OF_RANGE',
    ],
    [
      'a geocentric coordinate that is not a number',
      () => geocentricToGeodetic(A, { X: 'abc', Y: 0, Z: 0 }, GRS80),
      'INVALID_NUMBER',
    ],
    ['a radius at latitude 100°', () => meridianRadius(A, 100, GRS80), 'LATITUDE_OUT_OF_RANGE'],
    [
      'a TM point 90° from the central meridian',
      () => transverseMercatorFactors(A, { lat: 0, lon: 93 }, { lon0: 3, ellipsoid: GRS80 }),
      'INVALID_ARGUMENT',
    ],
    [
      'a TM point 89.9999° from the central meridian (the series diverges there)',
      () => transverseMercator(A, { lat: 0.0001, lon: 92.9999 }, { lon0: 3, ellipsoid: GRS80 }),
      'INVALID_ARGUMENT',
    ],
    [
      'a TM point 65° from the central meridian on the equator',
      () => transverseMercatorFactors(A, { lat: 0, lon: 68 }, { lon0: 3, ellipsoid: GRS80 }),
      'INVALID_ARGUMENT',
    ],
    [
      'enuFromGeocentric of a null point',
      () => enuFromGeocentric(A, { lat: 0, lon: 0 }, null as never, GRS80),
      'INVALID_ARGUMENT',
    ],
    [
      'geocentricFromEnu of a null local vector',
      () => geocentricFromEnu(A, { lat: 0, lon: 0 }, null as never, GRS80),
      'INVALID_ARGUMENT',
    ],
    [
      'a TM k0 of 0',
      () => transverseMercatorFactors(A, { lat: 0, lon: 3 }, { lon0: 3, k0: 0, ellipsoid: GRS80 }),
      'INVALID_ARGUMENT',
    ],
    ['a negative combined factor', () => gridToGround(A, 100, -1), 'INVALID_ARGUMENT'],
    [
      'a zero radius for the height factor',
      () => heightReductionFactor(A, 100, 0),
      'INVALID_ARGUMENT',
    ],
    [
      'a height factor below −R/2',
      () => heightReductionFactor(A, -4e6, 6.4e6),
      'HEIGHT_OUT_OF_RANGE',
    ],
    [
      'an inverse projection of non-numeric text',
      () => transverseMercatorInverse(A, { E: 'east', N: 0 }, { lon0: 0, ellipsoid: GRS80 }),
      'INVALID_NUMBER',
    ],
    [
      'a latitude of 95° for the TM origin',
      () => transverseMercator(A, { lat: 10, lon: 0 }, { lon0: 0, lat0: 95, ellipsoid: GRS80 }),
      'LATITUDE_OUT_OF_RANGE',
    ],
    ['a negative distance for flatEarthError', () => flatEarthError(A, -1), 'INVALID_ARGUMENT'],
    [
      'a hand-made ellipsoid with f = 2',
      () =>
        geodeticToGeocentric(
          A,
          { lat: 0, lon: 0 },
          { name: 'x', a: '6378137', f: '2', source: 'x' },
        ),
      'INVALID_ELLIPSOID',
    ],
    [
      'a hand-made ellipsoid with a = 0',
      () => ellipsoidParameters(A, { name: 'x', a: '0', f: '0', source: 'x' }),
      'INVALID_ELLIPSOID',
    ],
    [
      'a hand-made ellipsoid with unreadable a',
      () => meridianRadius(A, 10, { name: 'x', a: 'big', f: '0', source: 'x' }),
      'INVALID_ELLIPSOID',
    ],
  ];
  for (const [what, f, c] of cases) {
    it(`throws ${c} for ${what}`, () => {
      expect(code(f)).toBe(c);
    });
  }
});

describe('an unreadable number names the function and the argument it came in', () => {
  const A: Arithmetic<number> = float;
  const tm = { lon0: 0, ellipsoid: GRS80 };
  const cases: [string, () => unknown][] = [
    [
      'geocentricToGeodetic(point).Y',
      () => geocentricToGeodetic(A, { X: 1e6, Y: 'abc', Z: 0 }, GRS80),
    ],
    [
      'geodeticToGeocentric(point).h',
      () => geodeticToGeocentric(A, { lat: 0, lon: 0, h: 'high' }, GRS80),
    ],
    [
      'enuFromGeocentric(point).Z',
      () => enuFromGeocentric(A, { lat: 0, lon: 0 }, { X: 1, Y: 2, Z: Number.NaN }, GRS80),
    ],
    [
      'geocentricFromEnu(local).u',
      () => geocentricFromEnu(A, { lat: 0, lon: 0 }, { e: 1, n: 2, u: 'up' }, GRS80),
    ],
    ['flatEarthError(radius)', () => flatEarthError(A, 100, 'R')],
    ['heightReductionFactor(radius)', () => heightReductionFactor(A, 100, 'R')],
    [
      'transverseMercator(projection.k0)',
      () => transverseMercator(A, { lat: 1, lon: 1 }, { ...tm, k0: 'k' }),
    ],
    [
      'transverseMercator(projection.falseNorthing)',
      () => transverseMercator(A, { lat: 1, lon: 1 }, { ...tm, falseNorthing: 'N0' }),
    ],
    [
      'transverseMercatorInverse(point.N)',
      () => transverseMercatorInverse(A, { E: 0, N: 'north' }, tm),
    ],
    ['groundToGrid(ground)', () => groundToGrid(A, 'far', 1)],
    ['gridToGround(factor)', () => gridToGround(A, 100, 'one')],
    ['defineEllipsoid(def).a', () => defineEllipsoid({ a: 'abc', invF: 300 })],
    ['defineEllipsoid(def).invF', () => defineEllipsoid({ a: 1, invF: 'flat' })],
  ];
  for (const [where, f] of cases) {
    it(`names ${where}`, () => {
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_NUMBER', where }));
    });
  }
  const angles: [string, () => unknown][] = [
    ['radiusInAzimuth(azimuth)', () => radiusInAzimuth(A, 45, 'abc', GRS80)],
    [
      'geodeticToGeocentric(point).lat',
      () => geodeticToGeocentric(A, { lat: 'north', lon: 0 }, GRS80),
    ],
    [
      'transverseMercator(projection.lon0)',
      () => transverseMercator(A, { lat: 1, lon: 1 }, { lon0: '3x', ellipsoid: GRS80 }),
    ],
  ];
  for (const [where, f] of angles) {
    it(`names ${where} for an angle it cannot read (INVALID_ANGLE)`, () => {
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_ANGLE', where }));
    });
  }
});

describe('transverseMercatorFactors far from the central meridian', () => {
  it('accepts 55° on the equator and 80° at latitude 60° (where the series still holds)', () => {
    const tm = { lon0: 3, ellipsoid: GRS80 };
    // on a sphere k = 1/√(1 − B²), B = cos φ sin λ (Snyder 1987, §8, from memory): the ellipsoid is close
    for (const [lat, dl] of [
      [0, 55],
      [60, 80],
    ] as const) {
      const B = Math.cos(lat * (Math.PI / 180)) * Math.sin(dl * (Math.PI / 180));
      const k = transverseMercatorFactors(float, { lat, lon: 3 + dl }, tm).k;
      expect(Math.abs(k - 1 / Math.sqrt(1 - B * B)) / k).toBeLessThan(0.02);
    }
  });
});

describe('a hand-made ellipsoid object', () => {
  it('that is valid gives the same coordinates as the built-in one with the same a and f', () => {
    const own = { name: 'mine', a: GRS80.a, f: GRS80.f, source: 'copied' };
    const p = geodeticToGeocentric(float, { lat: 45, lon: 7, h: 100 }, own);
    const q = geodeticToGeocentric(float, { lat: 45, lon: 7, h: 100 }, GRS80);
    expect([p.X, p.Y, p.Z]).toEqual([q.X, q.Y, q.Z]);
  });
});
