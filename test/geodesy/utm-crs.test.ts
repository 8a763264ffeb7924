// UTM zones and projections, and the CRS table: against proj4 (a general-purpose projection
// library, devDependency) with its own definitions, the UTM zone rule and its published
// exceptions (NIMA TR 8358.2, from memory), and a GIGS row through a table entry.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import proj4 from 'proj4';
import { float, QuadspreadError } from '../../src/index.js';
import { toGrid, fromGrid } from '../../src/geodesy/projection.js';
import { utmZone, utmProjection } from '../../src/geodesy/utm.js';
import { crs } from '../../src/geodesy/crs.js';

const WGS84_GEO = '+proj=longlat +datum=WGS84 +no_defs';

describe('utmZone', () => {
  it('is ⌊(λ + 180°)/6°⌋ + 1 away from the exceptions, the hemisphere by the sign of φ', () => {
    expect(utmZone(0, -180)).toEqual({ zone: 1, hemisphere: 'N' });
    expect(utmZone(-0.5, -177)).toEqual({ zone: 1, hemisphere: 'S' });
    expect(utmZone(45, 179.99)).toEqual({ zone: 60, hemisphere: 'N' });
    expect(utmZone(45, 180)).toEqual({ zone: 1, hemisphere: 'N' }); // 180° is −180°
    expect(utmZone(-33.9, 18.4)).toEqual({ zone: 34, hemisphere: 'S' });
    expect(utmZone(51.5, -0.1)).toEqual({ zone: 30, hemisphere: 'N' });
    expect(utmZone(51.5, 0)).toEqual({ zone: 31, hemisphere: 'N' });
  });
  it('takes the exceptions: zone 32 west to 3° E between 56° N and 64° N; Svalbard zones 31, 33, 35, 37', () => {
    expect(utmZone(60.4, 5.3)).toEqual({ zone: 32, hemisphere: 'N' });
    expect(utmZone(55.9, 5.3)).toEqual({ zone: 31, hemisphere: 'N' });
    expect(utmZone(78.2, 8.9)).toEqual({ zone: 31, hemisphere: 'N' });
    expect(utmZone(78.2, 15.6)).toEqual({ zone: 33, hemisphere: 'N' });
    expect(utmZone(78.2, 21)).toEqual({ zone: 35, hemisphere: 'N' });
    expect(utmZone(78.2, 41.9)).toEqual({ zone: 37, hemisphere: 'N' });
    expect(utmZone(78.2, 42)).toEqual({ zone: 38, hemisphere: 'N' });
  });
  it('refuses the polar regions (OUTSIDE_DOMAIN) and latitudes beyond ±90°', () => {
    expect(() => utmZone(84.5, 0)).toThrow(/OUTSIDE_DOMAIN/);
    expect(() => utmZone(-80.5, 0)).toThrow(/OUTSIDE_DOMAIN/);
    expect(() => utmZone(91, 0)).toThrow(/LATITUDE_OUT_OF_RANGE/);
    expect(() => utmZone('x' as never, 0)).toThrow(QuadspreadError);
  });
});

describe('utmProjection and crs', () => {
  it('every UTM zone agrees with proj4 (+proj=utm +zone=z [+south] +datum=WGS84) within 1 mm', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 60 }),
        fc.boolean(),
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        (zone, south, absLat, dlon) => {
          const lat = south ? -absLat : absLat;
          const lon = 6 * zone - 183 + dlon;
          const P = crs(`EPSG:${south ? 327 : 326}${String(zone).padStart(2, '0')}`);
          const g = toGrid(float, { lat, lon }, P);
          const [E, N] = proj4(
            WGS84_GEO,
            `+proj=utm +zone=${zone}${south ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`,
          ).forward([lon, lat]) as [number, number];
          expect(Math.abs(g.E - E)).toBeLessThan(1e-3);
          expect(Math.abs(g.N - N)).toBeLessThan(1e-3);
          const u = toGrid(float, { lat, lon }, utmProjection(zone, south ? 'S' : 'N'));
          expect(u.E).toBe(g.E);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('table grids agree with proj4 definitions of the same parameters within 1 mm', () => {
    const cases: [string, string, [number, number]][] = [
      [
        'EPSG:2154',
        '+proj=lcc +lat_1=49 +lat_2=44 +lat_0=46.5 +lon_0=3 +x_0=700000 +y_0=6600000 +ellps=GRS80 +units=m',
        [2.35, 48.85],
      ],
      [
        'EPSG:5070',
        '+proj=aea +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96 +x_0=0 +y_0=0 +ellps=GRS80 +units=m',
        [-100, 40],
      ],
      [
        'EPSG:2193',
        '+proj=tmerc +lat_0=0 +lon_0=173 +k=0.9996 +x_0=1600000 +y_0=10000000 +ellps=GRS80 +units=m',
        [174.77, -41.29],
      ],
      [
        'EPSG:3031',
        '+proj=stere +lat_0=-90 +lat_ts=-71 +lon_0=0 +x_0=0 +y_0=0 +ellps=WGS84 +units=m',
        [166.67, -77.85],
      ],
      [
        'EPSG:3413',
        '+proj=stere +lat_0=90 +lat_ts=70 +lon_0=-45 +x_0=0 +y_0=0 +ellps=WGS84 +units=m',
        [-51.7, 64.2],
      ],
      [
        'EPSG:32761',
        '+proj=stere +lat_0=-90 +lon_0=0 +k=0.994 +x_0=2000000 +y_0=2000000 +ellps=WGS84 +units=m',
        [0, -85],
      ],
      [
        'EPSG:27700',
        '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +a=6377563.396 +b=6356256.909 +units=m',
        [-0.1276, 51.5072],
      ],
      [
        'EPSG:28992',
        '+proj=sterea +lat_0=52.15616055555555 +lon_0=5.38763888888889 +k=0.9999079 +x_0=155000 +y_0=463000 +ellps=bessel +units=m',
        [4.9, 52.37],
      ],
    ];
    for (const [code, def, [lon, lat]] of cases) {
      const g = toGrid(float, { lat, lon }, crs(code));
      const [E, N] = proj4(WGS84_GEO.replace('+datum=WGS84', '+ellps=WGS84'), def).forward([
        lon,
        lat,
      ]) as [number, number];
      expect(Math.abs(g.E - E), code).toBeLessThan(1e-3);
      expect(Math.abs(g.N - N), code).toBeLessThan(1e-3);
    }
  });

  it('a table entry reproduces a GIGS row: EPSG:3035 and IOGP GIGS Test Dataset test 5110, row GIGS-5110-01 (70° N, 5° E → N 5214090.649, E 4127824.658; 5 cm)', () => {
    const g = toGrid(float, { lat: 70, lon: 5 }, crs('EPSG:3035'));
    expect(Math.abs(g.N - 5214090.649)).toBeLessThan(0.05);
    expect(Math.abs(g.E - 4127824.658)).toBeLessThan(0.05);
    expect(crs('EPSG:3035').axisOrder).toBe('NE');
    const p = fromGrid(float, g, crs('3035'));
    expect(p.lat).toBeCloseTo(70, 10);
  });

  it('EPSG:4326 is WGS 84 geographic; unknown codes are UNKNOWN_CRS; a geographic CRS is no projection', () => {
    expect(crs('EPSG:4326')).toMatchObject({ kind: 'geographic', name: 'WGS 84' });
    expect(() => crs('EPSG:9999')).toThrow(/UNKNOWN_CRS/);
    expect(() => crs('EPSG:32661x')).toThrow(/UNKNOWN_CRS/);
    expect(() => crs(null as never)).toThrow(/UNKNOWN_CRS/);
    expect(() => toGrid(float, { lat: 1, lon: 1 }, crs('EPSG:4326') as never)).toThrow(
      /UNKNOWN_METHOD/,
    );
  });

  it('utmProjection refuses zones outside 1..60 and unknown hemispheres', () => {
    expect(() => utmProjection(0, 'N')).toThrow(/INVALID_ARGUMENT/);
    expect(() => utmProjection(61, 'N')).toThrow(/INVALID_ARGUMENT/);
    expect(() => utmProjection(33, 'X' as never)).toThrow(/INVALID_ARGUMENT/);
  });
});
