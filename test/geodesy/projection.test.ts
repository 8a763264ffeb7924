// Map projections: forward and inverse against proj4 (a general-purpose projection library,
// devDependency) on random points within each method's domain; inverse ∘ forward in float and
// decimal(40); units, prime meridian and prepared projections; bad input.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import proj4 from 'proj4';
import { decimal, float, rational, defineEllipsoid, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { toGrid, fromGrid, prepareProjection } from '../../src/geodesy/projection.js';
import type { Projection } from '../../src/geodesy/projection-core.js';

const GRS80 = defineEllipsoid({ name: 'GRS 1980', a: 6378137, invF: '298.257222101' });
const INTL = defineEllipsoid({ name: 'International 1924', a: 6378388, invF: 297 });
const BESSEL = defineEllipsoid({ name: 'Bessel 1841', a: '6377397.155', invF: '299.1528128' });
const WGS84E = defineEllipsoid({ name: 'WGS 84', a: 6378137, invF: '298.257223563' });

interface Method {
  name: string;
  projection: Projection;
  /** the same projection as a proj4 definition */
  proj4: string;
  /** a sampler of points within the domain */
  lat: [number, number];
  dlon: [number, number];
  lon0: number;
}

const METHODS: Method[] = [
  {
    name: 'lambert-conic-1sp',
    projection: {
      method: 'lambert-conic-1sp',
      ellipsoid: INTL,
      lat0: 46.8,
      lon0: 2.337229166667,
      k0: '0.99987742',
      falseEasting: 600000,
      falseNorthing: 2200000,
    },
    proj4:
      '+proj=lcc +lat_1=46.8 +lat_0=46.8 +lon_0=2.337229166667 +k_0=0.99987742 +x_0=600000 +y_0=2200000 +a=6378388 +rf=297 +units=m +no_defs',
    lat: [20, 80],
    dlon: [-40, 40],
    lon0: 2.337229166667,
  },
  {
    name: 'lambert-conic-2sp',
    projection: {
      method: 'lambert-conic-2sp',
      ellipsoid: GRS80,
      lat0: -32,
      lon0: 135,
      lat1: -28,
      lat2: -36,
      falseEasting: 1000000,
      falseNorthing: 2000000,
    },
    proj4:
      '+proj=lcc +lat_1=-28 +lat_2=-36 +lat_0=-32 +lon_0=135 +x_0=1000000 +y_0=2000000 +a=6378137 +rf=298.257222101 +units=m +no_defs',
    lat: [-70, -5],
    dlon: [-50, 50],
    lon0: 135,
  },
  {
    name: 'mercator-1sp',
    projection: {
      method: 'mercator-1sp',
      ellipsoid: BESSEL,
      lon0: 110,
      k0: '0.997',
      falseEasting: 3900000,
      falseNorthing: 900000,
    },
    proj4:
      '+proj=merc +lon_0=110 +k_0=0.997 +x_0=3900000 +y_0=900000 +a=6377397.155 +rf=299.1528128 +units=m +no_defs',
    lat: [-80, 80],
    dlon: [-170, 170],
    lon0: 110,
  },
  {
    name: 'mercator-2sp',
    projection: {
      method: 'mercator-2sp',
      ellipsoid: GRS80,
      lat1: 42,
      lon0: 51,
      falseEasting: 100,
      falseNorthing: 200,
    },
    proj4:
      '+proj=merc +lat_ts=42 +lon_0=51 +x_0=100 +y_0=200 +a=6378137 +rf=298.257222101 +units=m +no_defs',
    lat: [-80, 80],
    dlon: [-170, 170],
    lon0: 51,
  },
  {
    name: 'oblique-stereographic',
    projection: {
      method: 'oblique-stereographic',
      ellipsoid: BESSEL,
      lat0: 52.156160556,
      lon0: 5.387638889,
      k0: '0.9999079',
      falseEasting: 155000,
      falseNorthing: 463000,
    },
    proj4:
      '+proj=sterea +lat_0=52.156160556 +lon_0=5.387638889 +k=0.9999079 +x_0=155000 +y_0=463000 +a=6377397.155 +rf=299.1528128 +units=m +no_defs',
    lat: [35, 70],
    dlon: [-25, 25],
    lon0: 5.387638889,
  },
  {
    name: 'polar-stereographic-a',
    projection: {
      method: 'polar-stereographic-a',
      ellipsoid: WGS84E,
      lat0: 90,
      lon0: 0,
      k0: '0.994',
      falseEasting: 2000000,
      falseNorthing: 2000000,
    },
    proj4:
      '+proj=stere +lat_0=90 +lon_0=0 +k=0.994 +x_0=2000000 +y_0=2000000 +a=6378137 +rf=298.257223563 +units=m +no_defs',
    lat: [40, 89.9999],
    dlon: [-179.9, 179.9],
    lon0: 0,
  },
  {
    name: 'polar-stereographic-b',
    projection: {
      method: 'polar-stereographic-b',
      ellipsoid: WGS84E,
      lat1: -71,
      lon0: 70,
      falseEasting: 6000000,
      falseNorthing: 6000000,
    },
    proj4:
      '+proj=stere +lat_0=-90 +lat_ts=-71 +lon_0=70 +x_0=6000000 +y_0=6000000 +a=6378137 +rf=298.257223563 +units=m +no_defs',
    lat: [-89.9999, -40],
    dlon: [-179.9, 179.9],
    lon0: 70,
  },
  {
    name: 'cassini-soldner',
    projection: {
      method: 'cassini-soldner',
      ellipsoid: GRS80,
      lat0: 2.121,
      lon0: 103.4279,
      falseEasting: -14810.562,
      falseNorthing: 8758.32,
    },
    proj4:
      '+proj=cass +lat_0=2.121 +lon_0=103.4279 +x_0=-14810.562 +y_0=8758.32 +a=6378137 +rf=298.257222101 +units=m +no_defs',
    lat: [-30, 40],
    dlon: [-3, 3],
    lon0: 103.4279,
  },
  {
    name: 'albers-equal-area',
    projection: {
      method: 'albers-equal-area',
      ellipsoid: GRS80,
      lat0: 0,
      lon0: 132,
      lat1: -18,
      lat2: -36,
    },
    proj4:
      '+proj=aea +lat_0=0 +lon_0=132 +lat_1=-18 +lat_2=-36 +x_0=0 +y_0=0 +a=6378137 +rf=298.257222101 +units=m +no_defs',
    lat: [-70, 20],
    dlon: [-60, 60],
    lon0: 132,
  },
  {
    name: 'lambert-azimuthal-equal-area',
    projection: {
      method: 'lambert-azimuthal-equal-area',
      ellipsoid: GRS80,
      lat0: 52,
      lon0: 10,
      falseEasting: 4321000,
      falseNorthing: 3210000,
    },
    proj4:
      '+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 +a=6378137 +rf=298.257222101 +units=m +no_defs',
    lat: [10, 85],
    dlon: [-50, 50],
    lon0: 10,
  },
  {
    name: 'lambert-azimuthal-equal-area (north polar aspect)',
    projection: { method: 'lambert-azimuthal-equal-area', ellipsoid: WGS84E, lat0: 90, lon0: -40 },
    proj4:
      '+proj=laea +lat_0=90 +lon_0=-40 +x_0=0 +y_0=0 +a=6378137 +rf=298.257223563 +units=m +no_defs',
    lat: [0, 89.9999],
    dlon: [-179.9, 179.9],
    lon0: -40,
  },
];

const WGS84_GEO = '+proj=longlat +a=6378137 +rf=298.257223563 +no_defs';

describe('projections against proj4 on random points', () => {
  for (const m of METHODS) {
    it(`${m.name}: forward and inverse agree with proj4 within 1 mm and 2e-9° (about 0.2 mm)`, () => {
      const P = prepareProjection(float, m.projection);
      const conv = proj4(WGS84_GEO, m.proj4);
      fc.assert(
        fc.property(
          fc.double({ min: m.lat[0], max: m.lat[1], noNaN: true }),
          fc.double({ min: m.dlon[0], max: m.dlon[1], noNaN: true }),
          (lat, dlon) => {
            const lon = m.lon0 + dlon;
            const g = toGrid(float, { lat, lon }, P);
            // proj4 works on the projection's own ellipsoid here: the geographic side's datum
            // is irrelevant (no datum shift between +proj=longlat without towgs84)
            const [E, N] = conv.forward([lon, lat]) as [number, number];
            // proj4's own round trip at this point bounds how well it can agree
            const [lon2, lat2] = conv.inverse([E, N]) as [number, number];
            // (in degrees; twice it, as the two inverses may err in opposite directions)
            const own = 2 * Math.hypot(lon2 - lon, lat2 - lat);
            expect(Math.abs(g.E - E)).toBeLessThanOrEqual(Math.max(1e-3, own * 111e3));
            expect(Math.abs(g.N - N)).toBeLessThanOrEqual(Math.max(1e-3, own * 111e3));
            const p = fromGrid(float, { E, N }, P);
            const [lonP, latP] = conv.inverse([E, N]) as [number, number];
            expect(Math.abs(p.lat - latP)).toBeLessThanOrEqual(Math.max(2e-9, own));
            let dl = p.lon - lonP;
            dl -= 360 * Math.round(dl / 360);
            expect(Math.abs(dl)).toBeLessThanOrEqual(Math.max(2e-9, own));
          },
        ),
        { numRuns: 200 },
      );
    });
  }
});

describe('inverse ∘ forward', () => {
  for (const m of METHODS) {
    it(`${m.name}: returns the point within 1e-11° + 1e-14°/cos φ (longitude × cos φ) in float`, () => {
      const P = prepareProjection(float, m.projection);
      fc.assert(
        fc.property(
          fc.double({ min: m.lat[0], max: m.lat[1], noNaN: true }),
          fc.double({ min: m.dlon[0], max: m.dlon[1], noNaN: true }),
          (lat, dlon) => {
            const lon = m.lon0 + dlon;
            const p = fromGrid(float, toGrid(float, { lat, lon }, P), P);
            // the same ground distance: longitude scaled by cos φ; near a pole the latitude is
            // ill-conditioned through ψ or q (dq/dφ ∝ cos φ), hence the 1e-14°/cos φ
            const cos = Math.cos((lat * Math.PI) / 180);
            const bound = 1e-11 + 1e-14 / cos;
            expect(Math.abs(p.lat - lat)).toBeLessThanOrEqual(bound);
            const dl = p.lon - lon; // longitudes come back reduced to [−180°, 180°)
            expect(Math.abs(dl - 360 * Math.round(dl / 360)) * cos).toBeLessThanOrEqual(bound);
          },
        ),
        { numRuns: 200 },
      );
    });
    it(`${m.name}: returns the point within 1e-30° in decimal(40)`, () => {
      const D = decimal(40);
      const P = prepareProjection(D, m.projection);
      for (const [lat, dlon] of [
        [m.lat[0] + 1, m.dlon[0] / 2],
        [(m.lat[0] + m.lat[1]) / 2, 0.123456789],
        [m.lat[1] - 1, m.dlon[1] / 3],
      ] as const) {
        const lon = D.from(String(m.lon0 + dlon));
        const g = toGrid(D, { lat: D.from(String(lat)), lon }, P);
        const p = fromGrid(D, g, P);
        expect(Math.abs(D.toNumber(D.sub(p.lat, D.from(String(lat)))))).toBeLessThanOrEqual(1e-30);
        const dl = D.toNumber(D.sub(p.lon, lon));
        expect(Math.abs(dl - 360 * Math.round(dl / 360))).toBeLessThanOrEqual(1e-30);
      }
    });
  }
});

describe('scale factors and convergence', () => {
  // Independent of the formulas for k, h and γ: central differences of the projected E, N
  // (themselves checked against GIGS, GN 7-2 and proj4) give the meridian scale
  // h = |∂(E, N)/∂φ|/M, the parallel scale k = |∂(E, N)/∂λ|/(N cos φ) and the convergence
  // γ = atan2(−∂E/∂φ, ∂N/∂φ) (the meridian's image has grid bearing −γ). For the conformal
  // methods h = k. M, N: the radii of curvature (e.g. Torge & Müller, Geodesy, 2012, ch. 4).
  for (const m of METHODS) {
    it(`${m.name}: k, h and γ agree with finite differences of E, N within 1e-6`, () => {
      const P = prepareProjection(float, m.projection);
      const ell = m.projection.ellipsoid as { a: string; f: string };
      const num = (t: string) => {
        const [n, d] = t.split('/').map(Number) as [number, number | undefined];
        return d === undefined ? n : n / d;
      };
      const a = num(ell.a);
      const f = num(ell.f);
      const e2 = f * (2 - f);
      fc.assert(
        fc.property(
          fc.double({ min: m.lat[0] + 0.5, max: Math.min(m.lat[1] - 0.5, 89), noNaN: true }),
          fc.double({ min: m.dlon[0] / 2, max: m.dlon[1] / 2, noNaN: true }),
          (lat, dlon) => {
            const lon = m.lon0 + dlon;
            const d = 1e-5;
            const at = (dp: number, dl: number) =>
              toGrid(float, { lat: lat + dp, lon: lon + dl }, P);
            const g = at(0, 0);
            const n1 = at(d, 0);
            const s1 = at(-d, 0);
            const e1 = at(0, d);
            const w1 = at(0, -d);
            const rad = (d * Math.PI) / 180;
            const Ef = (n1.E - s1.E) / (2 * rad);
            const Nf = (n1.N - s1.N) / (2 * rad);
            const El = (e1.E - w1.E) / (2 * rad);
            const Nl = (e1.N - w1.N) / (2 * rad);
            const phi = (lat * Math.PI) / 180;
            const W2 = 1 - e2 * Math.sin(phi) ** 2;
            const M = (a * (1 - e2)) / W2 ** 1.5;
            const Nr = a / Math.sqrt(W2);
            const h = Math.hypot(Ef, Nf) / M;
            const k = Math.hypot(El, Nl) / (Nr * Math.cos(phi));
            expect(Math.abs(g.k - k)).toBeLessThanOrEqual(1e-6 * k);
            expect(Math.abs((g.h ?? g.k) - h)).toBeLessThanOrEqual(1e-6 * h);
            const gamma = (Math.atan2(-Ef, Nf) * 180) / Math.PI;
            expect(Math.abs(g.convergence - gamma)).toBeLessThanOrEqual(1e-6);
          },
        ),
        { numRuns: 40 },
      );
    });
  }
});

describe('units, prime meridian and prepared projections', () => {
  // NTF (Paris) / Lambert zone II (EPSG 27572) as GIGS test 5102 part 2 defines it: grads from
  // Paris (2.5969213 grad east of Greenwich), and the same in degrees from Greenwich.
  const clarkeIgn = defineEllipsoid({ name: 'Clarke 1880 (IGN)', a: '6378249.2', b: '6356515' });
  const inGrads: Projection = {
    method: 'lambert-conic-1sp',
    ellipsoid: clarkeIgn,
    lat0: 52,
    lon0: 0,
    k0: '0.99987742',
    falseEasting: 600000,
    falseNorthing: 2200000,
    primeMeridian: '2.5969213',
    angleUnit: 'grad',
  };
  const inDegrees: Projection = {
    ...inGrads,
    lat0: 46.8, // 52 grad
    lon0: '2.33722917', // 2.5969213 grad = 2.33722917°
    primeMeridian: undefined,
    angleUnit: 'deg',
  };

  it('grads with a prime meridian give what degrees from Greenwich give (exact conversions, rational)', () => {
    const R = rational;
    const a = toGrid(R, { lat: '53.5', lon: '3.2' }, inGrads); // grads, from Greenwich
    const b = toGrid(R, { lat: R.from('48.15'), lon: R.from('2.88') }, inDegrees); // 53.5 and 3.2 grad in degrees
    expect(Math.abs(R.toNumber(R.sub(a.E, b.E)))).toBeLessThan(1e-30);
    expect(Math.abs(R.toNumber(R.sub(a.N, b.N)))).toBeLessThan(1e-30);
    const p = fromGrid(R, a, inGrads);
    expect(Math.abs(R.toNumber(R.sub(p.lat, R.from('53.5'))))).toBeLessThan(1e-30);
    expect(Math.abs(R.toNumber(R.sub(p.lon, R.from('3.2'))))).toBeLessThan(1e-30);
  });

  it('packed DMS parameters are read exactly: 46.48 is 46°48′ (EPSG unit 9110)', () => {
    const packed = toGrid(
      float,
      { lat: 50, lon: 4 },
      {
        ...inDegrees,
        lat0: '46.48',
        lon0: '2.2014025',
        angleUnit: 'dms-packed',
        pointAngleUnit: 'deg',
      },
    );
    const plain = toGrid(
      float,
      { lat: 50, lon: 4 },
      { ...inDegrees, lat0: 46.8, lon0: `2°20'14.025"` },
    );
    expect(packed.E).toBe(plain.E);
    expect(packed.N).toBe(plain.N);
    const p = fromGrid(float, packed, {
      ...inDegrees,
      lat0: '46.48',
      lon0: '2.2014025',
      angleUnit: 'dms-packed',
    });
    // results in packed DMS: 50° and 4° are 50.0000 and 4.0000
    expect(p.lat).toBeCloseTo(50, 9);
    expect(p.lon).toBeCloseTo(4, 9);
  });

  it('linear units: foot, US survey foot and link agree with proj4 (+units=ft, us-ft, link) for the same projection', () => {
    const def = (u: string) =>
      `+proj=lcc +lat_1=46.8 +lat_0=46.8 +lon_0=2.33722917 +k_0=0.99987742 +x_0=600000 +y_0=2200000 +a=6378249.2 +b=6356515 +units=${u} +no_defs`;
    for (const [unit, p4] of [
      ['foot', 'ft'],
      ['us-survey-foot', 'us-ft'],
      ['link', 'link'],
    ] as const) {
      const [E, N] = proj4(WGS84_GEO, def(p4)).forward([4, 50]) as [number, number];
      const ratio = toGrid(float, { lat: 50, lon: 4 }, inDegrees).E / E; // metres per unit
      const g = toGrid(
        float,
        { lat: 50, lon: 4 },
        {
          ...inDegrees,
          linearUnit: unit,
          falseEasting: 600000 / ratio,
          falseNorthing: 2200000 / ratio,
        },
      );
      expect(Math.abs(g.E - E)).toBeLessThan(1e-5);
      expect(Math.abs(g.N - N)).toBeLessThan(1e-5);
    }
  });

  it('a prepared projection gives the same bits as the plain object, and refuses another arithmetic', () => {
    const P = prepareProjection(float, inDegrees);
    const a = toGrid(float, { lat: 47.1, lon: 1.3 }, P);
    const b = toGrid(float, { lat: 47.1, lon: 1.3 }, inDegrees);
    expect(a).toEqual(b);
    expect(() =>
      toGrid(decimal(20) as Arithmetic<unknown>, { lat: 1, lon: 1 }, P as never),
    ).toThrow(/prepared for float/);
  });

  it('longitudes are reduced to [−180°, 180°): 362° is 2°', () => {
    const a = toGrid(float, { lat: 47, lon: 362 }, inDegrees);
    const b = toGrid(float, { lat: 47, lon: 2 }, inDegrees);
    expect(a.E).toBeCloseTo(b.E, 6);
    expect(a.N).toBeCloseTo(b.N, 6);
  });
});

describe('bad input', () => {
  const lcc: Projection = METHODS[0]!.projection;
  const code = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      return (e as QuadspreadError).code;
    }
    return 'no error';
  };
  it('toGrid refuses a latitude beyond ±90° (LATITUDE_OUT_OF_RANGE), naming the input', () => {
    expect(code(() => toGrid(float, { lat: 91, lon: 0 }, lcc))).toBe('LATITUDE_OUT_OF_RANGE');
    expect(() => toGrid(float, { lat: 91, lon: 0 }, lcc)).toThrow(/toGrid\(point\.lat\)/);
  });
  it('an unknown method is UNKNOWN_METHOD; a missing parameter MISSING_PARAMETER naming it', () => {
    expect(
      code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, method: 'gnomonic' as never })),
    ).toBe('UNKNOWN_METHOD');
    expect(code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, k0: undefined }))).toBe(
      'MISSING_PARAMETER',
    );
    expect(() =>
      toGrid(
        float,
        { lat: 1, lon: 1 },
        { method: 'lambert-conic-2sp', ellipsoid: GRS80, lat0: 1, lon0: 1, lat1: 2 },
      ),
    ).toThrow(/projection\.lat2/);
  });
  it('a parameter the method does not use is refused (INVALID_ARGUMENT)', () => {
    expect(code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, lat2: 3 }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
  it('the poles are outside a Lambert conic (OUTSIDE_DOMAIN): the apex has no finite scale, the other pole lies at infinity', () => {
    expect(code(() => toGrid(float, { lat: 90, lon: 0 }, lcc))).toBe('OUTSIDE_DOMAIN');
    expect(code(() => toGrid(float, { lat: -90, lon: 0 }, lcc))).toBe('OUTSIDE_DOMAIN');
  });
  it('points a method cannot project are OUTSIDE_DOMAIN: the poles in Mercator, the antipode of an azimuthal projection, the opposite pole of a polar one', () => {
    const find = (n: string) => METHODS.find((m) => m.name === n)!;
    expect(code(() => toGrid(float, { lat: 90, lon: 0 }, find('mercator-1sp').projection))).toBe(
      'OUTSIDE_DOMAIN',
    );
    expect(code(() => toGrid(float, { lat: -90, lon: 0 }, find('mercator-2sp').projection))).toBe(
      'OUTSIDE_DOMAIN',
    );
    expect(
      code(() =>
        toGrid(float, { lat: -52, lon: -170 }, find('lambert-azimuthal-equal-area').projection),
      ),
    ).toBe('OUTSIDE_DOMAIN');
    expect(
      code(() =>
        toGrid(
          float,
          { lat: -90, lon: 0 },
          find('lambert-azimuthal-equal-area (north polar aspect)').projection,
        ),
      ),
    ).toBe('OUTSIDE_DOMAIN');
    expect(
      code(() => toGrid(float, { lat: -90, lon: 0 }, find('polar-stereographic-a').projection)),
    ).toBe('OUTSIDE_DOMAIN');
    expect(
      code(() => toGrid(float, { lat: 90, lon: 0 }, find('polar-stereographic-b').projection)),
    ).toBe('OUTSIDE_DOMAIN');
    const rd = find('oblique-stereographic').projection;
    const anti = toGrid(float, { lat: -52.156160556, lon: 5.387638889 - 180 }, rd);
    expect(Math.abs(anti.N)).toBeGreaterThan(1e8); // near the antipode the image runs off to infinity
  });
  it('Lambert parameters that define no cone are refused: 1SP on the equator, 2SP symmetric about it', () => {
    expect(code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, lat0: 0 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      code(() =>
        toGrid(
          float,
          { lat: 1, lon: 1 },
          { method: 'lambert-conic-2sp', ellipsoid: GRS80, lat0: 0, lon0: 0, lat1: 30, lat2: -30 },
        ),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
  it('bad units, ellipsoids and non-objects are refused with their codes', () => {
    expect(
      code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, linearUnit: 'furlong' as never })),
    ).toBe('INVALID_UNIT');
    expect(
      code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, angleUnit: 'rad' as never })),
    ).toBe('INVALID_UNIT');
    expect(code(() => toGrid(float, { lat: 1, lon: 1 }, { ...lcc, ellipsoid: 'Everest' }))).toBe(
      'UNKNOWN_ELLIPSOID',
    );
    expect(code(() => toGrid(float, null as never, lcc))).toBe('INVALID_ARGUMENT');
    expect(code(() => toGrid(float, { lat: 1, lon: 1 }, null as never))).toBe('INVALID_ARGUMENT');
    expect(code(() => fromGrid(float, { E: 'x', N: 1 }, lcc))).toBe('INVALID_NUMBER');
    expect(
      code(() =>
        toGrid(float, { lat: 1, lon: 1 }, { ...lcc, lat0: '46.61', angleUnit: 'dms-packed' }),
      ),
    ).toBe('INVALID_ANGLE');
  });
});
