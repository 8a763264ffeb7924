// GeoJSON out and in: the structure of RFC 7946 (checked by a validator written here from the
// RFC's sections), positions against proj4 (an independent projection and datum library), the
// refusals when the grid or the datum transformation is not stated, polygons by the right-hand
// rule, and round trips.
import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import {
  QuadspreadError,
  decimal,
  float,
  horizontalAlignment,
  rational,
  sqrtOf,
  toGrid,
  crs,
} from '../../src/index.js';
import {
  gridToWgs84,
  pointsFromGeoJson,
  toGeoJson,
  wgs84ToGrid,
  type Wgs84Reference,
} from '../../src/io/index.js';

const codeOf = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    if (e instanceof QuadspreadError) return e.code;
    return `${(e as Error).name}: ${(e as Error).message}`;
  }
  return 'no error';
};

// ---------------------------------------------------------------------------------------------
// A structural validator of RFC 7946 (The GeoJSON Format, IETF, 2016), for what the writer
// produces: §3.3 FeatureCollection, §3.2 Feature (geometry, properties, optional id string or
// number), §3.1.1 positions (two or three numbers; longitude, latitude in degrees, §4),
// §3.1.2 Point, §3.1.4 LineString (two or more positions), §3.1.6 Polygon (linear rings of
// four or more positions, closed, the exterior counterclockwise and holes clockwise), §4 (no
// "crs" member: WGS 84 only). Returns the problems found (empty when valid).
function rfc7946Problems(doc: unknown): string[] {
  const out: string[] = [];
  const isObj = (v: unknown): v is Record<string, unknown> =>
    typeof v === 'object' && v !== null && !Array.isArray(v);
  const position = (p: unknown, at: string): p is number[] => {
    if (
      !Array.isArray(p) ||
      p.length < 2 ||
      p.length > 3 ||
      !p.every((v) => typeof v === 'number' && Number.isFinite(v))
    ) {
      out.push(`${at}: not a position`);
      return false;
    }
    if (Math.abs(p[0]) > 180 || Math.abs(p[1]) > 90) out.push(`${at}: not longitude, latitude`);
    return true;
  };
  // Twice the signed area of a ring in lon/lat (positive counterclockwise).
  const signedArea = (ring: number[][]) =>
    ring
      .slice(0, -1)
      .reduce((s, p, i) => s + p[0]! * ring[i + 1]![1]! - ring[i + 1]![0]! * p[1]!, 0);
  const geometry = (g: unknown, at: string) => {
    if (g === null) return;
    if (!isObj(g)) return void out.push(`${at}: geometry is not an object or null`);
    const c = g.coordinates;
    switch (g.type) {
      case 'Point':
        position(c, `${at}.coordinates`);
        break;
      case 'LineString':
        if (!Array.isArray(c) || c.length < 2) out.push(`${at}: a LineString needs two positions`);
        else c.forEach((p, i) => position(p, `${at}.coordinates[${i}]`));
        break;
      case 'Polygon':
        if (!Array.isArray(c) || c.length < 1)
          return void out.push(`${at}: a Polygon needs a ring`);
        c.forEach((ring, r) => {
          if (!Array.isArray(ring) || ring.length < 4)
            return void out.push(`${at}[${r}]: a ring needs four positions`);
          if (!ring.every((p, i) => position(p, `${at}[${r}][${i}]`))) return;
          const a = ring[0] as number[];
          const z = ring[ring.length - 1] as number[];
          if (a[0] !== z[0] || a[1] !== z[1]) out.push(`${at}[${r}]: ring not closed`);
          const s = signedArea(ring as number[][]);
          if (r === 0 ? !(s > 0) : !(s < 0)) out.push(`${at}[${r}]: breaks the right-hand rule`);
        });
        break;
      default:
        out.push(`${at}: geometry type ${String(g.type)} not produced by the writer`);
    }
  };
  if (!isObj(doc) || doc.type !== 'FeatureCollection') return ['not a FeatureCollection'];
  if ('crs' in doc) out.push('a crs member (removed by RFC 7946 §4)');
  if (!Array.isArray(doc.features)) return [...out, 'features is not an array'];
  doc.features.forEach((f: unknown, i: number) => {
    const at = `features[${i}]`;
    if (!isObj(f) || f.type !== 'Feature') return void out.push(`${at}: not a Feature`);
    if (!('geometry' in f)) out.push(`${at}: no geometry member`);
    if (!('properties' in f) || !(f.properties === null || isObj(f.properties)))
      out.push(`${at}: properties`);
    if ('id' in f && typeof f.id !== 'string' && typeof f.id !== 'number') out.push(`${at}: id`);
    geometry(f.geometry, `${at}.geometry`);
  });
  return out;
}

describe('the RFC 7946 validator of this test', () => {
  it('catches what it is written for', () => {
    const ring = [
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 0],
    ];
    const fc = (g: unknown, extra = {}) => ({
      type: 'FeatureCollection',
      features: [{ type: 'Feature', geometry: g, properties: {} }],
      ...extra,
    });
    expect(rfc7946Problems(fc({ type: 'Polygon', coordinates: [ring] }))).toEqual([]);
    expect(
      rfc7946Problems(fc({ type: 'Polygon', coordinates: [[...ring].reverse()] })),
    ).toHaveLength(1);
    expect(
      rfc7946Problems(fc({ type: 'Polygon', coordinates: [ring.slice(0, 3).concat([[0, 1]])] })),
    ).toEqual(['features[0].geometry[0]: ring not closed']);
    expect(rfc7946Problems(fc({ type: 'Point', coordinates: [500000, 0] }))).toHaveLength(1);
    expect(rfc7946Problems(fc({ type: 'LineString', coordinates: [[0, 0]] }))).toHaveLength(1);
    expect(rfc7946Problems(fc({ type: 'Point', coordinates: [0, 0] }, { crs: {} }))).toHaveLength(
      1,
    );
  });
});

// ---------------------------------------------------------------------------------------------
// OSGB36 / British National Grid with a seven-parameter Helmert transformation to WGS 84
// (the published EPSG:1314 values, position-vector convention, as in proj4's own definition
// of EPSG:27700). proj4 is given the same parameters: an independent computation of the
// whole chain (grid inverse, geocentric, Helmert, geodetic).
const OSGB_TO_WGS84 = {
  method: 'helmert',
  parameters: {
    tx: 446.448,
    ty: -125.157,
    tz: 542.06,
    rx: 0.15,
    ry: 0.247,
    rz: 0.842,
    ds: -20.489,
    convention: 'position-vector',
  },
} as const;
const BNG: Wgs84Reference<never> = { grid: 'EPSG:27700', toWgs84: OSGB_TO_WGS84 };
const BNG_PROJ4 =
  '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +a=6377563.396 +b=6356256.909 +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs';

describe('gridToWgs84 and wgs84ToGrid', () => {
  it('agree with proj4 within 1e-9° on the British National Grid with a Helmert transformation', () => {
    for (const [x, y] of [
      [530000, 180000],
      [400000, 600000],
      [200000, 50000],
      [651409.903, 313177.27],
    ]) {
      const [lon, lat] = proj4(BNG_PROJ4, 'WGS84', [x!, y!]) as [number, number];
      const ours = gridToWgs84(float, { x: x!, y: y! }, BNG);
      expect(Math.abs(ours.lon - lon), `${x},${y}`).toBeLessThan(1e-9);
      expect(Math.abs(ours.lat - lat), `${x},${y}`).toBeLessThan(1e-9);
      // and in decimal(30)
      const D = decimal(30);
      const d = gridToWgs84(D, { x: x!, y: y! }, BNG);
      expect(Math.abs(D.toNumber(d.lon) - lon)).toBeLessThan(1e-9);
      // and back to the grid within 0.1 mm
      const back = wgs84ToGrid(float, { lon, lat }, BNG);
      expect(Math.abs(back.x - x!)).toBeLessThan(1e-4);
      expect(Math.abs(back.y - y!)).toBeLessThan(1e-4);
    }
  });

  it('agree with proj4 within 1e-9° on UTM zone 33N (WGS 84: no datum transformation)', () => {
    for (const [x, y] of [
      [500000, 0],
      [412345.678, 5123456.789],
      [699999, 7000000],
    ]) {
      const [lon, lat] = proj4('+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', 'WGS84', [
        x!,
        y!,
      ]) as [number, number];
      const ours = gridToWgs84(float, { x: x!, y: y! }, { grid: 32633 });
      expect(Math.abs(ours.lon - lon)).toBeLessThan(1e-9);
      expect(Math.abs(ours.lat - lat)).toBeLessThan(1e-9);
    }
  });

  it('refuse a grid off WGS 84 without a datum transformation, and no grid at all', () => {
    expect(codeOf(() => gridToWgs84(float, { x: 530000, y: 180000 }, { grid: 'EPSG:27700' }))).toBe(
      'MISSING_REFERENCE_SYSTEM',
    );
    expect(codeOf(() => gridToWgs84(float, { x: 1, y: 1 }, undefined as never))).toBe(
      'MISSING_REFERENCE_SYSTEM',
    );
    expect(codeOf(() => gridToWgs84(float, { x: 1, y: 1 }, {} as never))).toBe(
      'MISSING_REFERENCE_SYSTEM',
    );
    // a GRS80 grid is not WGS 84 either, unless the caller says the datums coincide
    expect(codeOf(() => gridToWgs84(float, { x: 700000, y: 6600000 }, { grid: 'EPSG:2154' }))).toBe(
      'MISSING_REFERENCE_SYSTEM',
    );
    const p = gridToWgs84(
      float,
      { x: 700000, y: 6600000 },
      { grid: 'EPSG:2154', toWgs84: 'coincident' },
    );
    expect(p.lon).toBeCloseTo(3, 12);
    expect(p.lat).toBeCloseTo(46.5, 12);
  });

  it('refuse a geographic system as a grid, an unknown code and a bad transformation', () => {
    expect(codeOf(() => gridToWgs84(float, { x: 1, y: 1 }, { grid: 'EPSG:4326' }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => gridToWgs84(float, { x: 1, y: 1 }, { grid: 'EPSG:9999' }))).toBe(
      'UNKNOWN_CRS',
    );
    expect(
      codeOf(() => gridToWgs84(float, { x: 1, y: 1 }, { grid: 27700, toWgs84: 'yes' as never })),
    ).toBe('INVALID_ARGUMENT');
  });

  it('refuse a point or position that is not an object, naming the argument', () => {
    const ref = { grid: 'EPSG:32633' } as const;
    expect(() => gridToWgs84(float, null as never, ref)).toThrow(/gridToWgs84\(point\)/);
    expect(codeOf(() => gridToWgs84(float, 5 as never, ref))).toBe('INVALID_ARGUMENT');
    expect(() => wgs84ToGrid(float, [15, 0] as never, ref)).toThrow(/wgs84ToGrid\(position\)/);
  });

  it('take a projection object in grads and still give degrees', () => {
    // UTM zone 33N's parameters in grads (15° = 50/3 gon): the result is in degrees.
    const p = gridToWgs84(
      rational,
      { x: 500000, y: 0 },
      {
        grid: {
          method: 'transverse-mercator',
          ellipsoid: 'WGS84',
          lon0: '50/3',
          k0: 0.9996,
          falseEasting: 500000,
          angleUnit: 'grad',
        },
      },
    );
    expect(rational.toNumber(p.lon)).toBeCloseTo(15, 12);
  });
});

// ---------------------------------------------------------------------------------------------
// A small survey on the British National Grid (invented coordinates near 530000, 180000).
const POINTS = [
  { name: 'A1', x: '530012.3456', y: '180034.5678', height: '21.034', code: 'CP' },
  { name: 'A2', x: '530212.3456', y: '180134.5678', height: '22.5' },
];
// Clockwise on the map: the writer must turn it round.
const PARCEL_CW = [
  { x: 530000, y: 180000 },
  { x: 530000, y: 180040 },
  { x: 530030, y: 180040 },
  { x: 530030, y: 180000 },
];

describe('toGeoJson', () => {
  const fc = toGeoJson(
    rational,
    {
      points: [
        ...POINTS,
        {
          name: 'N7',
          x: 530100,
          y: 180100,
          sigmaX: sqrtOf(rational, '0.0002'),
          sigmaY: '0.011',
          ellipse: { major: '0.02', minor: '0.01', azimuth: '35.5' },
        },
      ],
      lines: [{ name: 'Traverse 1', kind: 'traverse', points: PARCEL_CW.concat([PARCEL_CW[0]!]) }],
      parcels: [{ name: 'Lot 7', points: PARCEL_CW }],
    },
    { reference: BNG },
  );

  it('writes a FeatureCollection that RFC 7946 accepts', () => {
    expect(rfc7946Problems(fc)).toEqual([]);
    expect(fc.features.map((f) => [f.id, f.geometry.type])).toEqual([
      ['A1', 'Point'],
      ['A2', 'Point'],
      ['N7', 'Point'],
      ['Traverse 1', 'LineString'],
      ['Lot 7', 'Polygon'],
    ]);
  });

  it('writes every position as proj4 converts it (within 1e-9°, as 9 decimals allow)', () => {
    const [lon, lat] = proj4(BNG_PROJ4, 'WGS84', [530012.3456, 180034.5678]) as [number, number];
    const c = (fc.features[0]!.geometry as { coordinates: number[] }).coordinates;
    expect(Math.abs(c[0]! - lon)).toBeLessThan(1e-9);
    expect(Math.abs(c[1]! - lat)).toBeLessThan(1e-9);
    // nine decimals at most
    for (const v of c) expect(String(v).split('.')[1]?.length ?? 0).toBeLessThanOrEqual(9);
  });

  it('writes the properties: name, kind, height, code, σ and the ellipse; the parcel area', () => {
    expect(fc.features[0]!.properties).toEqual({
      name: 'A1',
      kind: 'point',
      height: 21.034,
      code: 'CP',
    });
    const n7 = fc.features[2]!.properties!;
    expect(n7.sigmaX).toBeCloseTo(Math.sqrt(0.0002), 15);
    expect(n7).toMatchObject({
      sigmaY: 0.011,
      ellipseMajor: 0.02,
      ellipseMinor: 0.01,
      ellipseAzimuth: 35.5,
    });
    // 40 m × 30 m rectangle (by hand): 1200 m²
    expect(fc.features[4]!.properties).toEqual({ name: 'Lot 7', kind: 'parcel', area: 1200 });
    expect(fc.features[3]!.properties).toEqual({ name: 'Traverse 1', kind: 'traverse' });
  });

  it('turns a clockwise parcel counterclockwise and closes the ring (RFC 7946 §3.1.6)', () => {
    const ring = (fc.features[4]!.geometry as { coordinates: number[][][] }).coordinates[0]!;
    expect(ring).toHaveLength(5);
    expect(ring[0]).toEqual(ring[4]);
    // the first vertex, then the one east of it (counterclockwise from the south-west corner)
    const [lon1] = proj4(BNG_PROJ4, 'WGS84', [530030, 180000]) as [number, number];
    expect(Math.abs(ring[1]![0]! - lon1)).toBeLessThan(1e-9);
  });

  it('draws an alignment as a line through its setting-out points', () => {
    const h = horizontalAlignment(rational, {
      points: [
        { x: 530000, y: 180000 },
        { x: 530000, y: 180100 },
        { x: 530060, y: 180180 },
      ],
      curves: [{ radius: 30 }],
    });
    const out = toGeoJson(
      rational,
      { lines: [{ name: 'Centre line', alignment: h, interval: 20 }] },
      { reference: BNG },
    );
    expect(rfc7946Problems(out)).toEqual([]);
    const f = out.features[0]!;
    expect(f.properties).toEqual({ name: 'Centre line', kind: 'alignment' });
    const c = (f.geometry as { coordinates: number[][] }).coordinates;
    // the start, on the grid, and the end
    const [lon0, lat0] = proj4(BNG_PROJ4, 'WGS84', [530000, 180000]) as [number, number];
    expect(Math.abs(c[0]![0]! - lon0) + Math.abs(c[0]![1]! - lat0)).toBeLessThan(2e-9);
    const [lonE, latE] = proj4(BNG_PROJ4, 'WGS84', [530060, 180180]) as [number, number];
    expect(Math.abs(c.at(-1)![0]! - lonE) + Math.abs(c.at(-1)![1]! - latE)).toBeLessThan(2e-9);
    expect(c.length).toBeGreaterThan(10);
  });

  it('refuses without a stated grid, or off WGS 84 without a datum transformation', () => {
    expect(codeOf(() => toGeoJson(rational, { points: POINTS }))).toBe('MISSING_REFERENCE_SYSTEM');
    expect(
      codeOf(() => toGeoJson(rational, { points: POINTS }, { reference: { grid: 'EPSG:27700' } })),
    ).toBe('MISSING_REFERENCE_SYSTEM');
  });

  it('refuses bad content and options with typed errors', () => {
    // a hole in a list is refused, not passed over (map would skip it)
    // eslint-disable-next-line no-sparse-arrays
    const holey = [, { name: 'A', x: 1, y: 2 }] as never;
    expect(() => toGeoJson(float, { points: holey }, { coordinates: 'plane' })).toThrow(/hole/);
    const ref = { reference: BNG };
    expect(
      codeOf(() =>
        toGeoJson(rational, { lines: [{ name: 'L', points: [{ x: 530000, y: 180000 }] }] }, ref),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        toGeoJson(rational, { parcels: [{ name: 'P', points: PARCEL_CW.slice(0, 2) }] }, ref),
      ),
    ).toBe('TOO_FEW_POINTS');
    expect(
      codeOf(() =>
        toGeoJson(
          rational,
          {
            parcels: [
              {
                name: 'P',
                points: [
                  { x: 0, y: 0 },
                  { x: 1, y: 1 },
                  { x: 2, y: 2 },
                ],
              },
            ],
          },
          ref,
        ),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => toGeoJson(rational, { points: [{ name: '', x: 1, y: 1 }] }, ref))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => toGeoJson(rational, { points: 'A1' as never }, ref))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => toGeoJson(rational, { points: POINTS }, { ...ref, decimals: 13 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      codeOf(() =>
        toGeoJson(rational, { points: POINTS }, { ...ref, coordinates: 'utm' as never }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        toGeoJson(rational, { lines: [{ name: 'L', points: [null, null] as never }] }, ref),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() =>
        toGeoJson(rational, { points: [{ name: 'P', x: 1, y: 1, ellipse: null as never }] }, ref),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => toGeoJson(rational, null as never, ref))).toBe('INVALID_ARGUMENT');
  });

  it('refuses a line across the antimeridian (RFC 7946 §3.1.9 asks for it to be cut)', () => {
    // UTM zone 60N: two points either side of 180°
    const z60 = crs('EPSG:32660');
    const a = toGrid(float, { lat: 50, lon: 179.9 }, z60);
    const b = toGrid(float, { lat: 50, lon: -179.9 }, z60);
    const line = {
      name: 'L',
      points: [
        { x: a.E, y: a.N },
        { x: b.E, y: b.N },
      ],
    };
    expect(codeOf(() => toGeoJson(float, { lines: [line] }, { reference: { grid: z60 } }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});

describe('plane coordinates, only when asked', () => {
  it('are written as they are, in a file marked as not RFC 7946, and read back exactly', () => {
    const fc = toGeoJson(
      rational,
      { points: POINTS },
      { coordinates: 'plane', reference: { grid: 'EPSG:27700' } },
    );
    expect(rfc7946Problems(fc).length).toBeGreaterThan(0); // not RFC 7946, as marked
    expect((fc as unknown as Record<string, unknown>).planeCoordinates).toEqual({
      rfc7946: false,
      grid: 'EPSG:27700',
      axes: 'x east, y north',
    });
    expect((fc as unknown as Record<string, unknown>).crs).toEqual({
      type: 'name',
      properties: { name: 'urn:ogc:def:crs:EPSG::27700' },
    });
    expect((fc.features[0]!.geometry as { coordinates: number[] }).coordinates).toEqual([
      530012.3456, 180034.5678,
    ]);
    const text = JSON.stringify(fc);
    const back = pointsFromGeoJson(rational, text, { coordinates: 'plane' });
    expect(
      back.map((p) => [
        p.name,
        rational.toString(p.x),
        rational.toString(p.y),
        p.height && rational.toString(p.height),
        p.code,
      ]),
    ).toEqual([
      ['A1', '331257716/625', '900172839/5000', '10517/500', 'CP'],
      ['A2', '331382716/625', '900672839/5000', '45/2', undefined],
    ]);
    // exactly the decimals given
    for (const [i, p] of back.entries()) {
      expect(rational.eq(p.x, rational.from(POINTS[i]!.x))).toBe(true);
      expect(rational.eq(p.y, rational.from(POINTS[i]!.y))).toBe(true);
      expect(rational.eq(p.height!, rational.from(POINTS[i]!.height))).toBe(true);
    }
  });

  it('are not read as longitude and latitude', () => {
    const fc = toGeoJson(rational, { points: POINTS }, { coordinates: 'plane' });
    expect((fc as unknown as Record<string, unknown>).planeCoordinates).toMatchObject({
      grid: 'unstated',
    });
    expect('crs' in fc).toBe(false);
    expect(codeOf(() => pointsFromGeoJson(rational, fc, { reference: BNG }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});

describe('pointsFromGeoJson', () => {
  it('reads points back through the grid within 0.1 mm, names and codes exactly', () => {
    const fc = toGeoJson(rational, { points: POINTS }, { reference: BNG });
    const back = pointsFromGeoJson(float, JSON.stringify(fc), { reference: BNG });
    expect(back.map((p) => p.name)).toEqual(['A1', 'A2']);
    back.forEach((p, i) => {
      expect(Math.abs(p.x - Number(POINTS[i]!.x))).toBeLessThan(1e-4);
      expect(Math.abs(p.y - Number(POINTS[i]!.y))).toBeLessThan(1e-4);
      expect(p.height).toBe(Number(POINTS[i]!.height));
    });
    expect(back[0]!.code).toBe('CP');
  });

  it('finds the grid point whose image proj4 gives as the position (within 1e-9°)', () => {
    // Grid points lie on the grid's ellipsoid (h = 0 there): proj4 takes the point read back
    // to the same longitude and latitude. (proj4's own inverse starts from h = 0 on WGS 84
    // instead, about 1 mm away here: a convention of two-dimensional datum transformations.)
    const text = JSON.stringify({
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          geometry: { type: 'Point', coordinates: [-0.1276, 51.5072, 45] },
          properties: { id: 7 },
        },
      ],
    });
    const [p] = pointsFromGeoJson(float, text, { reference: BNG, nameProperty: 'id' });
    const [lon, lat] = proj4(BNG_PROJ4, 'WGS84', [p!.x, p!.y]) as [number, number];
    expect(p!.name).toBe('7');
    expect(Math.abs(lon - -0.1276)).toBeLessThan(1e-9);
    expect(Math.abs(lat - 51.5072)).toBeLessThan(1e-9);
    const [x, y] = proj4('WGS84', BNG_PROJ4, [-0.1276, 51.5072]) as [number, number];
    expect(Math.abs(p!.x - x)).toBeLessThan(2e-3);
    expect(Math.abs(p!.y - y)).toBeLessThan(2e-3);
    expect(p!.height).toBeUndefined(); // the ellipsoidal third coordinate is not a height of the grid's system
  });

  it('reads a single Feature, a BOM, and skips other geometries only when asked', () => {
    const feature = {
      type: 'Feature',
      geometry: { type: 'Point', coordinates: [15, 0] },
      properties: { name: 'F' },
    };
    expect(
      pointsFromGeoJson(float, '\uFEFF' + JSON.stringify(feature), {
        reference: { grid: 32633 },
      })[0],
    ).toEqual({ name: 'F', x: 500000, y: 0 });
    const mixed = {
      type: 'FeatureCollection',
      features: [
        feature,
        {
          type: 'Feature',
          geometry: {
            type: 'LineString',
            coordinates: [
              [0, 0],
              [1, 1],
            ],
          },
          properties: { name: 'L' },
        },
      ],
    };
    expect(codeOf(() => pointsFromGeoJson(float, mixed, { reference: { grid: 32633 } }))).toBe(
      'INVALID_FILE',
    );
    expect(
      pointsFromGeoJson(float, mixed, { reference: { grid: 32633 }, others: 'skip' }),
    ).toHaveLength(1);
  });

  it('refuses what it cannot read, naming the feature', () => {
    const ref = { reference: { grid: 32633 } };
    const fc = (f: unknown) => ({ type: 'FeatureCollection', features: [f] });
    const pt = (coordinates: unknown, properties: unknown = { name: 'P' }) => ({
      type: 'Feature',
      geometry: { type: 'Point', coordinates },
      properties,
    });
    expect(codeOf(() => pointsFromGeoJson(float, '{"type":', ref))).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, '[]', ref))).toBe('INVALID_FILE');
    expect(
      codeOf(() => pointsFromGeoJson(float, { type: 'Point', coordinates: [0, 0] }, ref)),
    ).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0], {})), ref))).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0], null)), ref))).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt([15])), ref))).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt(['15', 0])), ref))).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt([200, 0])), ref))).toBe('INVALID_FILE');
    expect(
      codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0], { name: 'P', height: 'high' })), ref)),
    ).toBe('INVALID_FILE');
    expect(
      codeOf(() =>
        pointsFromGeoJson(
          float,
          { type: 'FeatureCollection', features: [pt([15, 0]), pt([15, 1])] },
          ref,
        ),
      ),
    ).toBe('INVALID_FILE');
    expect(codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0])), {}))).toBe(
      'MISSING_REFERENCE_SYSTEM',
    );
    expect(
      codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0])), { ...ref, nameProperty: '' })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() => pointsFromGeoJson(float, fc(pt([15, 0])), { ...ref, others: 'keep' as never })),
    ).toBe('INVALID_ARGUMENT');
  });
});
