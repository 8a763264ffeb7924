// Geodesics against an independent implementation: GeographicLib's JavaScript port
// (geographiclib-geodesic, a devDependency used only as a test reference), on random pairs
// drawn uniformly on the sphere, on nearly antipodal pairs, and on the special cases.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import G from 'geographiclib-geodesic';
import { decimal } from '../../src/arithmetic/decimal.js';
import { float } from '../../src/arithmetic/float.js';
import { uncertain } from '../../src/arithmetic/uncertain.js';
import { QuadspreadError } from '../../src/errors.js';
import { exactDecimal } from '../exact-decimal.js';
import {
  WGS84,
  GRS80,
  defineEllipsoid,
  geodesicInverse,
  geodesicDirect,
} from '../../src/geodesy/index.js';

const W = G.Geodesic.WGS84;
const d2r = Math.PI / 180;
/** difference of two azimuths in degrees, wrapped to (−180, 180] */
const dAz = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
// Uniform on the sphere, from integers (fast-check's doubles favour 0 and tiny values:
// GeographicLib rounds angles below 1/16° to multiples of about 1.4e-17°, its AngRound, so
// inputs like 1e-20° would compare its rounded problem with ours).
const unitInterval = fc.integer({ min: 1, max: 2 ** 30 - 1 }).map((i) => i / 2 ** 30);
const lat = unitInterval.map((u) => Math.asin(2 * u - 1) / d2r);
const lon = unitInterval.map((u) => 360 * u - 180);
/** great-circle angle between P2 and the antipode of P1, degrees (by hand, spherical) */
function fromAntipode(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const c =
    -Math.sin(lat1 * d2r) * Math.sin(lat2 * d2r) -
    Math.cos(lat1 * d2r) * Math.cos(lat2 * d2r) * Math.cos((lon2 - lon1) * d2r);
  return Math.acos(Math.min(1, Math.max(-1, c))) / d2r;
}

describe("exactDecimal, the tests' helper (test/exact-decimal.ts)", () => {
  it('expands doubles exactly', () => {
    expect(exactDecimal(0.1)).toBe('0.1000000000000000055511151231257827021181583404541015625');
    expect(exactDecimal(-180)).toBe('-180');
    expect(exactDecimal(2 ** -3)).toBe('0.125');
  });
});

describe('geodesicInverse against GeographicLib', () => {
  it('random pairs on WGS 84: distance within 30 nm, azimuths within 1e-12° of GeographicLib, or within 2e-12° of the decimal(40) solution where GeographicLib is off (pairs more than 1° from antipodal)', () => {
    fc.assert(
      fc.property(lat, lon, lat, lon, (lat1, lon1, lat2, lon2) => {
        fc.pre(fromAntipode(lat1, lon1, lat2, lon2) > 1);
        const q = W.Inverse(lat1, lon1, lat2, lon2);
        // over 1 km: the azimuth of a very short line is known only to about 1e-16·a/s rad
        fc.pre(q.s12! > 1000);
        const r = geodesicInverse(float, { lat: lat1, lon: lon1 }, { lat: lat2, lon: lon2 }, WGS84);
        expect(Math.abs(r.distance - q.s12!)).toBeLessThan(30e-9);
        if (dAz(r.azimuth1, q.azi1!) >= 1e-12 || dAz(r.azimuth2, q.azi2!) >= 1e-12) {
          // GeographicLib's own azimuths are off by up to 1.5e-12° on some nearly meridional
          // lines: then the 40-digit solution decides.
          // (the inputs as the exact decimals of the doubles: see exactDecimal)
          const z = geodesicInverse(
            decimal(40),
            { lat: exactDecimal(lat1), lon: exactDecimal(lon1) },
            { lat: exactDecimal(lat2), lon: exactDecimal(lon2) },
            WGS84,
          );
          // against the 40-digit solution the double one is within 2e-12°: the worst of 4 million
          // random pairs (seeds 1 to 2000) was 1.82e-12°, on a 24 km line at azimuth 33°, about
          // 0.5·ε·a/s (GeographicLib was 1.02e-12° off on it)
          expect(dAz(r.azimuth1, Number(z.azimuth1.toString()))).toBeLessThan(2e-12);
          expect(dAz(r.azimuth2, Number(z.azimuth2.toString()))).toBeLessThan(2e-12);
        }
      }),
      { numRuns: 2000 },
    );
  });
  it('short lines across the antimeridian, ordinary doubles: azimuths within 2e-12° of the 40-digit solution', () => {
    // λ₁₂ = (lon2 − 360) − lon1 is exact for points near ±180°; lon2 − lon1 − 360 was rounded
    // at the scale of 360° first, which moved the azimuth of a 3 km north–south line by up to
    // 8e-11°.
    fc.assert(
      fc.property(
        unitInterval.map((u) => 120 * u - 60),
        unitInterval.map((u) => 1e-7 + 1e-5 * u),
        unitInterval.map((u) => 1e-7 + 1e-5 * u),
        unitInterval.map((u) => 0.01 + 0.04 * u),
        (lat1, a, b, dlat) => {
          const lon1 = -180 + a;
          const lon2 = 180 - b;
          const lat2 = lat1 + dlat;
          const r = geodesicInverse(
            float,
            { lat: lat1, lon: lon1 },
            { lat: lat2, lon: lon2 },
            WGS84,
          );
          const z = geodesicInverse(
            decimal(40),
            { lat: exactDecimal(lat1), lon: exactDecimal(lon1) },
            { lat: exactDecimal(lat2), lon: exactDecimal(lon2) },
            WGS84,
          );
          expect(dAz(r.azimuth1, Number(z.azimuth1.toString()))).toBeLessThan(2e-12);
          expect(dAz(r.azimuth2, Number(z.azimuth2.toString()))).toBeLessThan(2e-12);
        },
      ),
      { numRuns: 60, seed: 20261203 },
    );
  });
  it('nearly antipodal pairs: distance within 30 nm, and the azimuth and distance found solve the direct problem to 30 nm (by GeographicLib)', () => {
    const small = fc.double({ min: -1, max: 1, noNaN: true });
    fc.assert(
      fc.property(fc.double({ min: -89.9, max: 89.9, noNaN: true }), small, small, (lat1, u, v) => {
        const lat2 = Math.max(-90, Math.min(90, -lat1 + 0.05 * u ** 3));
        const lon2 = 180 + 1 * v ** 3;
        const r = geodesicInverse(float, { lat: lat1, lon: 0 }, { lat: lat2, lon: lon2 }, WGS84);
        const q = W.Inverse(lat1, 0, lat2, lon2);
        expect(Math.abs(r.distance - q.s12!)).toBeLessThan(30e-9);
        // GeographicLib's direct solution from the azimuth and distance found lands within
        // 30 nm of P2: the distance's own tolerance above, which moves the end point as much
        // (a 15 nm bound failed on lat1 = 87.88020155355976, lat2 = −lat1, lon2 = 180: azimuth 0,
        // as GeographicLib's and the 40-digit solution's, and a distance 15.9 nm long of
        // 20 003 931.4586254311 m — 4 units in the last place of a double)
        const g = W.Direct(lat1, 0, r.azimuth1, r.distance);
        expect(W.Inverse(g.lat2!, g.lon2!, lat2, lon2).s12!).toBeLessThan(30e-9);
        // ... and ours within 30 nm (its own error included)
        const p = geodesicDirect(float, { lat: lat1, lon: 0 }, r.azimuth1, r.distance, WGS84);
        expect(W.Inverse(p.lat, p.lon, lat2, lon2).s12!).toBeLessThan(30e-9);
      }),
      { numRuns: 500 },
    );
  });
  it('meridional, equatorial, polar and coincident cases agree with GeographicLib', () => {
    const cases: [number, number, number, number][] = [
      [10, 20, 50, 20], // same meridian
      [-30, 0, 30, 180], // antipodal, over a pole
      [-30, 0, 20, 180], // opposite meridians
      [0, 0, 0, 90], // equatorial
      [0, 0, 0, 179.5], // equatorial but beyond (1 − f)·180°: leaves the equator
      [0, 0, 0, 180], // antipodal on the equator: over a pole
      [-90, 0, 40, 77], // from the south pole
      [89.9999, 10, -89.9999, -170], // near both poles
      [12, 34, 12, 34], // coincident
    ];
    const unique = new Set(['10,20,50,20', '0,0,0,90', '45,10,45.000001,10.000001']);
    for (const [a, b, c, d] of cases) {
      const r = geodesicInverse(float, { lat: a, lon: b }, { lat: c, lon: d }, WGS84);
      const q = W.Inverse(a, b, c, d);
      expect(Math.abs(r.distance - q.s12!), `${[a, b, c, d]}`).toBeLessThan(30e-9);
      // where the azimuth is unique (not over a pole, not antipodal, not coincident)
      if (unique.has(`${[a, b, c, d]}`))
        expect(dAz(r.azimuth1, q.azi1!), `${[a, b, c, d]}`).toBeLessThan(1e-9);
    }
  });
  it('a 15 cm line: the distance within 30 nm and the azimuth solving the direct problem to 15 nm', () => {
    // The azimuth of a very short line is known only to about 1e-16·a/s rad (here 4e-9 rad),
    // which moves its end by less than a nanometre.
    const r = geodesicInverse(
      float,
      { lat: 45, lon: 10 },
      { lat: 45.000001, lon: 10.000001 },
      WGS84,
    );
    const q = W.Inverse(45, 10, 45.000001, 10.000001);
    expect(Math.abs(r.distance - q.s12!)).toBeLessThan(30e-9);
    const g = W.Direct(45, 10, r.azimuth1, r.distance);
    expect(W.Inverse(g.lat2!, g.lon2!, 45.000001, 10.000001).s12!).toBeLessThan(15e-9);
  });
  it('is symmetric: swapping the points keeps the distance and reverses the azimuths', () => {
    fc.assert(
      fc.property(lat, lon, lat, lon, (lat1, lon1, lat2, lon2) => {
        fc.pre(fromAntipode(lat1, lon1, lat2, lon2) > 1);
        const r = geodesicInverse(float, { lat: lat1, lon: lon1 }, { lat: lat2, lon: lon2 }, GRS80);
        const s = geodesicInverse(float, { lat: lat2, lon: lon2 }, { lat: lat1, lon: lon1 }, GRS80);
        expect(Math.abs(r.distance - s.distance)).toBeLessThan(30e-9);
        expect(dAz(r.azimuth1, s.azimuth2 + 180)).toBeLessThan(1e-11);
      }),
      { numRuns: 200 },
    );
  });
});

describe('geodesicDirect against GeographicLib', () => {
  it('random starts, azimuths and distances up to 20 000 km: end point within 15 nm, azimuth within 1e-12° of GeographicLib, or 15 nm and 2e-12° (more within 3° of a pole) of the decimal(40) solution where the two double solutions differ by more; never 30 nm from GeographicLib', () => {
    fc.assert(
      fc.property(
        lat,
        lon,
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: 0, max: 2e7, noNaN: true }),
        (lat1, lon1, az, s) => {
          fc.pre(Math.abs(lat1) < 89.999);
          const r = geodesicDirect(float, { lat: lat1, lon: lon1 }, az, s, WGS84);
          const q = W.Direct(lat1, lon1, az, s);
          const off = W.Inverse(r.lat, r.lon, q.lat2!, q.lon2!).s12!;
          if (off >= 15e-9 || dAz(r.azimuth2, q.azi2!) >= 1e-12) {
            // GeographicLib in doubles is itself good only to about 15 nm and 1e-12° (Karney 2013,
            // "Algorithms for geodesics", J. Geodesy 87, error figures), so the two double solutions may differ by more than either's error:
            // then the decimal(40) solution of the same problem decides.
            // (the inputs as the exact decimals of the doubles: see exactDecimal; a subnormal
            // azimuth's 1000-digit expansion is past the input limit, and its shortest text is
            // within 1e-323° of it)
            const exact = (x: number) => {
              const t = exactDecimal(x);
              return t.length <= 900 ? t : String(x);
            };
            const z = geodesicDirect(
              decimal(40),
              { lat: exact(lat1), lon: exact(lon1) },
              exact(az),
              exact(s),
              WGS84,
            );
            const zl = Number(z.lat.toString());
            const zn = Number(z.lon.toString());
            expect(W.Inverse(r.lat, r.lon, zl, zn).s12!).toBeLessThan(15e-9);
            // worst of 30 000 random problems: 1.07e-12° (a 20 000 km line from 0.013° off the
            // south pole); 1.71e-12° on the line from (−89.99650294314442, −179.99999966472387)
            // at azimuth −19.674377724390684 for 19 998 134.66386782 m, which read through its
            // shortest decimal text gave 2.05e-12° and failed a full run.
            // Near the poles the azimuth is ill-conditioned (a meridian's direction turns by 1° for
            // 1° of longitude, whatever the distance from the pole), so within 3° of a pole the
            // bound is 6e-12° over the nearer end's distance from its pole in degrees. Measured on
            // 300 000 random lines (half from within 2° of a pole) against decimal(40): the
            // error times that distance was at most 4.1e-12 (GeographicLib's own, 2.5e-12); a
            // line from 0.0061° off the south pole to 0.077° off the north pole
            // (−89.99394291984729, −179.99999966472387, azimuth 40.432375219954274,
            // 19 994 837.668731157 m) is 2.50e-12° from the decimal(40) azimuth
            const polar = Math.min(90 - Math.abs(lat1), 90 - Math.abs(zl));
            const tol = Math.max(2e-12, 6e-12 / polar);
            expect(dAz(r.azimuth2, Number(z.azimuth2.toString()))).toBeLessThan(tol);
          }
          expect(off).toBeLessThan(30e-9);
        },
      ),
      { numRuns: 1000 },
    );
  });
  it('goes round the world more than once and backwards (negative distance)', () => {
    for (const s of [-5e6, 3e7, 6e7]) {
      const r = geodesicDirect(float, { lat: 20, lon: 30 }, 70, s, WGS84);
      const q = W.Direct(20, 30, 70, s);
      expect(W.Inverse(r.lat, r.lon, q.lat2!, q.lon2!).s12!).toBeLessThan(30e-9);
    }
  });
});

describe('geodesics in decimal(d)', () => {
  const D40 = decimal(40);
  const D60 = decimal(60);
  it('decimal(40) and decimal(60) agree to 1e-30 m and 1e-33° (the series order follows the digits)', () => {
    for (const [p1, p2] of [
      [
        { lat: -30.5, lon: 10.25 },
        { lat: 60.125, lon: 140.75 },
      ],
      [
        { lat: 0.5, lon: 0 },
        { lat: -0.75, lon: 179.5 },
      ], // nearly antipodal
    ]) {
      const a = geodesicInverse(D40, p1!, p2!, WGS84);
      const b = geodesicInverse(D60, p1!, p2!, WGS84);
      expect(
        Math.abs(Number(D60.sub(D60.from(D40.toString(a.distance)), b.distance).toString())),
      ).toBeLessThan(1e-30);
      expect(
        Math.abs(Number(D60.sub(D60.from(D40.toString(a.azimuth1)), b.azimuth1).toString())),
      ).toBeLessThan(1e-33);
    }
  });
  it('the direct solution of the inverse solution returns P2 within 1e-32° in decimal(40)', () => {
    const p1 = { lat: '-41.3', lon: '174.8' };
    const p2 = { lat: '51.5', lon: '-0.1' };
    const g = geodesicInverse(D40, p1, p2, WGS84);
    const r = geodesicDirect(D40, p1, g.azimuth1, g.distance, WGS84);
    expect(Math.abs(Number(D40.sub(r.lat, D40.from('51.5')).toString()))).toBeLessThan(1e-32);
    expect(Math.abs(Number(D40.sub(r.lon, D40.from('-0.1')).toString()))).toBeLessThan(1e-32);
    expect(Math.abs(Number(D40.sub(r.azimuth2, g.azimuth2).toString()))).toBeLessThan(1e-32);
  });
  it('float and decimal(40) agree to 15 nm (float checked against its decimal value)', () => {
    const g = geodesicInverse(float, { lat: 10, lon: 20 }, { lat: -50, lon: 150 }, WGS84);
    const h = geodesicInverse(D40, { lat: 10, lon: 20 }, { lat: -50, lon: 150 }, WGS84);
    expect(Math.abs(g.distance - Number(h.distance.toString()))).toBeLessThan(15e-9);
  });
  it('runs in uncertain(float): the distance carries its sensitivity to a measured latitude', () => {
    const U = uncertain(float);
    const g = geodesicInverse(U, { lat: 10, lon: 20 }, { lat: -50, lon: 150 }, WGS84);
    expect(Math.abs(U.toNumber(g.distance) - W.Inverse(10, 20, -50, 150).s12!)).toBeLessThan(1e-6);
  });
});

describe('geodesics refuse bad input with typed errors naming it', () => {
  const code = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      return `${(e as QuadspreadError).code} ${(e as QuadspreadError).where}`;
    }
    return 'no error';
  };
  it('latitudes beyond ±90°, non-numbers, missing points, unknown ellipsoids', () => {
    expect(code(() => geodesicInverse(float, { lat: 91, lon: 0 }, { lat: 0, lon: 0 }, WGS84))).toBe(
      'LATITUDE_OUT_OF_RANGE geodesicInverse(p1).lat',
    );
    expect(code(() => geodesicInverse(float, { lat: 0, lon: 0 }, null as never, WGS84))).toBe(
      'INVALID_ARGUMENT geodesicInverse(p2)',
    );
    expect(code(() => geodesicDirect(float, { lat: 0, lon: 0 }, 'x', 1000, WGS84))).toMatch(
      /^INVALID_(ANGLE|NUMBER) geodesicDirect\(azimuth\)/,
    );
    expect(code(() => geodesicDirect(float, { lat: 0, lon: 0 }, 10, NaN, WGS84))).toBe(
      'INVALID_NUMBER geodesicDirect(distance)',
    );
    expect(code(() => geodesicDirect(float, { lat: 0, lon: 0 }, 10, 1000, 'Mars'))).toBe(
      'UNKNOWN_ELLIPSOID geodesicDirect(ellipsoid)',
    );
  });
  it('a flattening above 1/50 and more than 100 digits, saying what is supported', () => {
    const flat = defineEllipsoid({ a: 1000, invF: 10 });
    expect(code(() => geodesicInverse(float, { lat: 0, lon: 0 }, { lat: 1, lon: 1 }, flat))).toBe(
      'INVALID_ELLIPSOID geodesicInverse(ellipsoid)',
    );
    expect(
      code(() => geodesicInverse(decimal(120), { lat: 0, lon: 0 }, { lat: 1, lon: 1 }, WGS84)),
    ).toBe('UNSUPPORTED_OPERATION geodesicInverse(ellipsoid)');
  });
});
