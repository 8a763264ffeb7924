import { describe, it, expect } from 'vitest';
import { rational } from '../../src/arithmetic/rational.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { float } from '../../src/arithmetic/float.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { geodeticToGeocentric, geocentricToGeodetic } from '../../src/geodesy/geocentric.js';
import { GRS80, WGS84, defineEllipsoid, ellipsoidParameters } from '../../src/geodesy/ellipsoid.js';
import { transverseMercator, transverseMercatorInverse } from '../../src/geodesy/grid.js';
import { meridianRadius } from '../../src/geodesy/radii.js';

// Ordnance Survey, "A guide to coordinate systems in Great Britain", annex B (worked
// example on GRS 80): 53°36′43.1653″N, 1°39′51.9920″W, h = 299.800 m ↔
// X = 3790644.900 m, Y = −110149.210 m, Z = 5111482.970 m.
const OS = {
  lat: `53°36'43.1653"N`,
  lon: `1°39'51.9920"W`,
  latDeg: 53 + 36 / 60 + 43.1653 / 3600,
  lonDeg: -(1 + 39 / 60 + 51.992 / 3600),
  h: '299.800',
  X: '3790644.900',
  Y: '-110149.210',
  Z: '5111482.970',
};

const arithmetics: Arithmetic<unknown>[] = [
  float,
  decimal(34),
  decimal(40),
  rational,
] as Arithmetic<unknown>[];

describe('Ordnance Survey guide, annex B: geodetic ↔ geocentric on GRS 80', () => {
  for (const A of arithmetics) {
    it(`geodeticToGeocentric(${A.name}) reproduces X, Y, Z to 1 mm`, () => {
      const p = geodeticToGeocentric(A, { lat: OS.lat, lon: OS.lon, h: OS.h }, GRS80);
      expect(Math.abs(A.toNumber(p.X) - Number(OS.X))).toBeLessThan(0.001);
      expect(Math.abs(A.toNumber(p.Y) - Number(OS.Y))).toBeLessThan(0.001);
      expect(Math.abs(A.toNumber(p.Z) - Number(OS.Z))).toBeLessThan(0.001);
    });
    it(`geocentricToGeodetic(${A.name}) reproduces the latitude and longitude to 0.0001″ and h to 1 mm`, () => {
      const g = geocentricToGeodetic(A, { X: OS.X, Y: OS.Y, Z: OS.Z }, GRS80);
      expect(Math.abs(A.toNumber(g.lat) - OS.latDeg) * 3600).toBeLessThan(0.0001);
      expect(Math.abs(A.toNumber(g.lon) - OS.lonDeg) * 3600).toBeLessThan(0.0001);
      expect(Math.abs(A.toNumber(g.h) - 299.8)).toBeLessThan(0.001);
    });
  }
  it('accepts the same point as decimal degrees and as DMS text with hemisphere letters', () => {
    const a = geodeticToGeocentric(float, { lat: OS.lat, lon: OS.lon, h: 299.8 }, 'GRS80');
    const b = geodeticToGeocentric(float, { lat: OS.latDeg, lon: OS.lonDeg, h: 299.8 }, GRS80);
    expect(Math.abs(a.X - b.X) + Math.abs(a.Y - b.Y) + Math.abs(a.Z - b.Z)).toBeLessThan(1e-6);
  });
});

// The WGS 84 and GRS 80 defining values as quoted in NIMA TR8350.2 (3rd ed., 2000, table 3.1)
// and Moritz (2000): from memory, not re-read from the documents for these tests.
describe('ellipsoid parameters from their defining documents', () => {
  it('WGS84 is a = 6378137 m, 1/f = 298.257223563 (NIMA TR8350.2, 3rd ed., 2000, table 3.1)', () => {
    const E = ellipsoidParameters(rational, WGS84);
    expect(rational.toString(E.a)).toBe('6378137');
    expect(rational.toString(rational.div(rational.one, E.f))).toBe('298257223563/1000000000');
  });
  it('GRS80 is a = 6378137 m, 1/f = 298.257222101 (Moritz, Geodetic Reference System 1980, J. Geodesy 74, 2000)', () => {
    const E = ellipsoidParameters(rational, GRS80);
    expect(rational.toString(E.a)).toBe('6378137');
    expect(rational.toString(rational.div(rational.one, E.f))).toBe('298257222101/1000000000');
  });
  it('GRS80 derived constants match Moritz (2000): b = 6356752.3141 m, e² = 0.00669438002290, e′² = 0.00673949677548 (from memory of its table)', () => {
    const E = ellipsoidParameters(rational, GRS80);
    expect(rational.toPrecision(E.b, 11)).toBe('6356752.3141');
    expect(rational.toPrecision(E.e2, 12)).toBe('0.00669438002290');
    expect(rational.toPrecision(E.ep2, 12)).toBe('0.00673949677548');
  });
  it('GRS80 mean radius R1 = (2a + b)/3 = 6371008.7714 m (Moritz 2000, from memory)', () => {
    const E = ellipsoidParameters(rational, GRS80);
    const R1 = rational.div(
      rational.add(rational.mul(rational.from(2), E.a), E.b),
      rational.from(3),
    );
    expect(rational.toPrecision(R1, 11)).toBe('6371008.7714');
  });
  it('WGS84 derived constants match TR8350.2 table 3.3: b = 6356752.3142 m, e² = 0.00669437999014 (from memory)', () => {
    const E = ellipsoidParameters(rational, WGS84);
    expect(rational.toPrecision(E.b, 11)).toBe('6356752.3142');
    expect(rational.toPrecision(E.e2, 12)).toBe('0.00669437999014');
  });
  it('the derived constants are exact in rational: e² = (a² − b²)/a², e′² = (a² − b²)/b², n = (a − b)/(a + b)', () => {
    for (const ell of [WGS84, GRS80]) {
      const R = rational;
      const E = ellipsoidParameters(R, ell);
      const a2 = R.mul(E.a, E.a);
      const b2 = R.mul(E.b, E.b);
      expect(R.eq(E.e2, R.div(R.sub(a2, b2), a2))).toBe(true);
      expect(R.eq(E.ep2, R.div(R.sub(a2, b2), b2))).toBe(true);
      expect(R.eq(E.n, R.div(R.sub(E.a, E.b), R.add(E.a, E.b)))).toBe(true);
    }
  });
});

describe('Ordnance Survey guide, annex C: Transverse Mercator (National Grid on Airy 1830)', () => {
  // Ordnance Survey, "A guide to coordinate systems in Great Britain", annex C worked example
  // (from memory): 52°39′27.2531″N, 1°43′4.5177″E on Airy 1830
  // (a = 6377563.396 m, b = 6356256.909 m), National Grid (F0 = 0.9996012717, true origin
  // 49°N 2°W, false origin E0 = 400000 m, N0 = −100000 m) → E = 651409.903 m, N = 313177.270 m.
  // The guide's own formulas are a series good to about 1 mm this far from the central meridian.
  const airy = defineEllipsoid({ name: 'Airy 1830', a: '6377563.396', b: '6356256.909' });
  const grid = {
    lon0: -2,
    lat0: 49,
    k0: '0.9996012717',
    falseEasting: 400000,
    falseNorthing: -100000,
    ellipsoid: airy,
  };
  for (const A of arithmetics) {
    it(`transverseMercator(${A.name}) gives E = 651409.903 m and N = 313177.270 m within 1 mm`, () => {
      const r = transverseMercator(A, { lat: `52°39'27.2531"N`, lon: `1°43'4.5177"E` }, grid);
      expect(Math.abs(A.toNumber(r.E) - 651409.903)).toBeLessThan(0.001);
      expect(Math.abs(A.toNumber(r.N) - 313177.27)).toBeLessThan(0.001);
    });
  }
  for (const A of arithmetics) {
    it(`transverseMercatorInverse(${A.name}) gives back 52°39′27.2531″N, 1°43′4.5177″E within 0.0001″`, () => {
      const g = transverseMercatorInverse(A, { E: '651409.903', N: '313177.270' }, grid);
      expect(Math.abs(A.toNumber(g.lat) - (52 + 39 / 60 + 27.2531 / 3600)) * 3600).toBeLessThan(
        0.0001,
      );
      expect(Math.abs(A.toNumber(g.lon) - (1 + 43 / 60 + 4.5177 / 3600)) * 3600).toBeLessThan(
        0.0001,
      );
    });
  }
  it('the scale factor agrees with the ratio of grid to ellipsoid distance over a short line (derived check of k)', () => {
    // 1e-5° steps north and east: grid distance / (M dφ) and / (N cos φ dλ) both → k
    const at = { lat: 52.6576, lon: 1.7179 };
    const k = transverseMercator(float, at, grid).k;
    const dd = 1e-5;
    const p = transverseMercator(float, { lat: at.lat + dd, lon: at.lon }, grid);
    const q = transverseMercator(float, { lat: at.lat - dd, lon: at.lon }, grid);
    const M = meridianRadius(float, at.lat, airy);
    const ratio = Math.hypot(p.E - q.E, p.N - q.N) / (M * 2 * dd * (Math.PI / 180));
    expect(Math.abs(ratio - k)).toBeLessThan(1e-9);
  });
  it('the convergence is the sign stated: the grid bearing of the meridian (true azimuth 0) is −γ (derived check)', () => {
    const at = { lat: 52.6576, lon: 1.7179 };
    const { convergence } = transverseMercator(float, at, grid);
    const p = transverseMercator(float, { lat: at.lat + 1e-5, lon: at.lon }, grid);
    const q = transverseMercator(float, { lat: at.lat - 1e-5, lon: at.lon }, grid);
    const gridBearing = (Math.atan2(p.E - q.E, p.N - q.N) * 180) / Math.PI;
    expect(convergence).toBeGreaterThan(0); // east of the central meridian, northern hemisphere
    expect(Math.abs(gridBearing + convergence)).toBeLessThan(1e-7);
  });
});
