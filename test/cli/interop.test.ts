// The command line's data exchange: `--export geojson|landxml|csv <file>` on run and demo,
// and `run --points <file>` (CSV, GeoJSON, LandXML). The acceptance check: the demo's traverse and parcel, exported to
// GeoJSON through a stated grid (OSGB36 / British National Grid with the published Helmert
// transformation to WGS 84, position vector), are where proj4 puts the same grid coordinates.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import proj4 from 'proj4';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers.js';
import { landXmlStructureErrors } from '../io/landxml-structure.js';

const HELMERT = {
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
};
const BNG_PROJ4 =
  '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +a=6377563.396 +b=6356256.909 +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs';
type Fc = {
  type: string;
  features: {
    id: string;
    geometry: { type: string; coordinates: unknown };
    properties: Record<string, unknown>;
  }[];
};

let dir: string;
beforeAll(async () => {
  await bundleCli();
  dir = tempFolder();
  writeFileSync(join(dir, 'helmert.json'), JSON.stringify(HELMERT));
}, 120000);
afterAll(() => cleanUp());

describe('--export geojson', () => {
  it('places the demo traverse and parcel through the stated grid and datum, as proj4 does', () => {
    const out = join(dir, 'demo.geojson');
    const r = cli([
      'demo',
      '--export',
      'geojson',
      out,
      '--grid',
      'EPSG:27700',
      '--to-wgs84',
      join(dir, 'helmert.json'),
    ]);
    expect(r.stderr).toContain(`geojson written to ${out}`);
    expect(r.code).toBe(0);
    const fc = JSON.parse(readFileSync(out, 'utf8')) as Fc;
    const at = (x: number, y: number) => proj4(BNG_PROJ4, 'WGS84', [x, y]) as [number, number];
    const near = (p: unknown, q: [number, number]) => {
      const [lon, lat] = p as number[];
      expect(Math.abs(lon! - q[0])).toBeLessThan(1e-8);
      expect(Math.abs(lat! - q[1])).toBeLessThan(1e-8);
    };
    // The parcel: Quillet Field, corners Q1..Q5 of the demo job (turned counterclockwise).
    const parcel = fc.features.find((f) => f.id === 'Quillet Field')!;
    expect(parcel.geometry.type).toBe('Polygon');
    const ring = (parcel.geometry.coordinates as number[][][])[0]!;
    expect(ring).toHaveLength(6);
    near(ring[0], at(1020.5, 1890.25)); // Q1
    expect(ring.slice(1, 5).map((p) => p.join())).toEqual(
      [at(1009.8, 1824.45), at(1052.35, 1771.1), at(1118.2, 1815.6), at(1101.75, 1902.4)].map(
        (q) => {
          const r9 = (v: number) => Math.round(v * 1e9) / 1e9;
          return [r9(q[0]), r9(q[1])].join();
        },
      ),
    );
    // area of Q1..Q5 by the shoelace formula, computed here independently
    const q = [
      [1020.5, 1890.25],
      [1101.75, 1902.4],
      [1118.2, 1815.6],
      [1052.35, 1771.1],
      [1009.8, 1824.45],
    ];
    const twice = q.reduce(
      (s, p, i) => s + p[0]! * q[(i + 1) % 5]![1]! - q[(i + 1) % 5]![0]! * p[1]!,
      0,
    );
    expect(parcel.properties.area).toBeCloseTo(Math.abs(twice) / 2, 4);
    // The traverse: a closed loop from CM1 through its adjusted points back to CM1.
    const trav = fc.features.find((f) => f.id === 'Snipewhistle Moss control loop')!;
    expect(trav.geometry.type).toBe('LineString');
    const line = trav.geometry.coordinates as number[][];
    expect(line).toHaveLength(5);
    near(line[0], at(1000, 2000));
    near(line[4], at(1000, 2000));
    // CM2 by the bearing and distance of the first course (62°14'20", 212.406 m; classical
    // trigonometry, here), within the traverse's adjustment (a few cm)
    const b = ((62 + 14 / 60 + 20 / 3600) * Math.PI) / 180;
    const cm2 = at(1000 + 212.406 * Math.sin(b), 2000 + 212.406 * Math.cos(b));
    expect(Math.abs(line[1]![0]! - cm2[0])).toBeLessThan(1e-6);
    expect(Math.abs(line[1]![1]! - cm2[1])).toBeLessThan(1e-6);
    // the points the tasks computed are there, the height tasks' local sketches are not
    expect(fc.features.map((f) => f.id)).toEqual(
      expect.arrayContaining(['CM1', 'CM2', 'TS', 'QC', 'Q1']),
    );
    expect(fc.features.map((f) => f.id)).not.toContain('C150');
  });

  it('refuses without a datum transformation off WGS 84, and writes nothing', () => {
    const out = join(dir, 'none.geojson');
    const r = cli(['demo', '--export', 'geojson', out, '--grid', 'EPSG:27700']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('MISSING_REFERENCE_SYSTEM');
    expect(existsSync(out)).toBe(false);
    const r2 = cli(['demo', '--export', 'geojson', out]);
    expect(r2.code).toBe(2);
    expect(existsSync(out)).toBe(false);
  });

  it('writes plane coordinates when asked, marked as not RFC 7946', () => {
    const out = join(dir, 'plane.geojson');
    const r = cli(['demo', '--export', 'geojson', out, '--plane', '--grid', 'EPSG:27700']);
    expect(r.code).toBe(0);
    const fc = JSON.parse(readFileSync(out, 'utf8')) as Fc & { planeCoordinates: unknown };
    expect(fc.planeCoordinates).toEqual({
      rfc7946: false,
      grid: 'EPSG:27700',
      axes: 'x east, y north',
    });
    expect(fc.features.find((f) => f.id === 'Q2')!.geometry.coordinates).toEqual([1101.75, 1902.4]);
  });

  it('refuses a bad --export', () => {
    expect(cli(['demo', '--export', 'kml', join(dir, 'x.kml')]).code).toBe(2);
    expect(cli(['demo', '--export', 'geojson']).code).toBe(2);
  });
});

describe('--export csv and run --points', () => {
  it('writes the points as CSV (spreadsheet mode by default) and loads them into a job', () => {
    const csv = join(dir, 'points.csv');
    expect(cli(['demo', '--export', 'csv', csv, '--csv-mode', 'exchange']).code).toBe(0);
    const text = readFileSync(csv, 'utf8');
    expect(text.split('\n')[0]).toBe('name,east,north');
    expect(text).toContain('\nQ2,1101.75,1902.4\n');
    // A job that names the points only: they come from the file.
    const job = join(dir, 'area.json');
    writeFileSync(
      job,
      JSON.stringify({
        title: 'Area from a point file',
        tasks: [{ kind: 'area', name: 'Q', points: ['Q1', 'Q2', 'Q3', 'Q4', 'Q5'] }],
      }),
    );
    const r = cli(['run', job, '--points', csv, '--format', 'json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('"Q"');
  });

  it('loads GeoJSON points through the grid, and refuses a clash with the job', () => {
    const gj = join(dir, 'pts.geojson');
    writeFileSync(
      gj,
      JSON.stringify({
        type: 'FeatureCollection',
        features: [
          {
            type: 'Feature',
            geometry: { type: 'Point', coordinates: [15, 0] },
            properties: { name: 'A' },
          },
          {
            type: 'Feature',
            geometry: { type: 'Point', coordinates: [15.001, 0] },
            properties: { name: 'B' },
          },
          {
            type: 'Feature',
            geometry: { type: 'Point', coordinates: [15, 0.001] },
            properties: { name: 'C' },
          },
        ],
      }),
    );
    const job = join(dir, 'tri.json');
    writeFileSync(
      job,
      JSON.stringify({
        title: 'From GeoJSON',
        tasks: [{ kind: 'area', name: 'ABC', points: ['A', 'B', 'C'] }],
      }),
    );
    const r = cli(['run', job, '--points', gj, '--grid', 'EPSG:32633', '--format', 'json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(cli(['run', job, '--points', gj, '--format', 'json']).code).toBe(2); // no grid
    writeFileSync(
      job,
      JSON.stringify({
        title: 'Clash',
        points: { A: { east: 1, north: 2 } },
        tasks: [{ kind: 'area', name: 'ABC', points: ['A', 'B', 'C'] }],
      }),
    );
    const clash = cli(['run', job, '--points', gj, '--grid', 'EPSG:32633']);
    expect(clash.code).toBe(2);
    expect(clash.stderr).toContain('"A"');
  });
});

describe('--export landxml and run --points with LandXML', () => {
  it('writes the demo traverse and parcel as LandXML that passes the structural check', () => {
    const out = join(dir, 'demo.xml');
    const r = cli(['demo', '--export', 'landxml', out]);
    expect(r.stderr).toContain(`landxml written to ${out}`);
    expect(r.code).toBe(0);
    const xml = readFileSync(out, 'utf8');
    expect(landXmlStructureErrors(xml)).toEqual([]);
    expect(xml).toContain('linearUnit="meter"');
    // northing before easting (the schema's order): Q2 is east 1101.75, north 1902.4
    expect(xml).toContain('<CgPoint name="Q2">1902.4 1101.75</CgPoint>');
    // the parcel's area by the shoelace formula over Q1..Q5, computed here independently
    const q = [
      [1020.5, 1890.25],
      [1101.75, 1902.4],
      [1118.2, 1815.6],
      [1052.35, 1771.1],
      [1009.8, 1824.45],
    ];
    const twice = q.reduce(
      (s, p, i) => s + p[0]! * q[(i + 1) % 5]![1]! - q[(i + 1) % 5]![0]! * p[1]!,
      0,
    );
    const area = Number(/<Parcel name="Quillet Field" area="([^"]+)"/.exec(xml)![1]);
    expect(Math.abs(area - Math.abs(twice) / 2)).toBeLessThan(6e-5);
    // the traverse: a closed loop of four courses from CM1 (east 1000, north 2000) back to it
    const trav =
      /<PlanFeature name="Snipewhistle Moss control loop" code="traverse">([\s\S]*?)<\/PlanFeature>/.exec(
        xml,
      )![1]!;
    const courses = [...trav.matchAll(/<Line><Start>([^<]*)<\/Start><End>([^<]*)<\/End><\/Line>/g)];
    expect(courses).toHaveLength(4);
    expect(courses[0]![1]).toBe('2000 1000');
    expect(courses[3]![2]).toBe('2000 1000');
  });

  it('writes an alignment task as its geometry and profile', () => {
    const out = join(dir, 'alignment.xml');
    const r = cli([
      'run',
      'examples/alignment.json',
      '--export',
      'landxml',
      out,
      '--format',
      'json',
    ]);
    expect(r.code).toBe(0);
    const xml = readFileSync(out, 'utf8');
    expect(landXmlStructureErrors(xml)).toEqual([]);
    // transitions into and out of the 250 m curve, then the 180 m curve (examples/alignment.json)
    expect([...xml.matchAll(/<(Line|Curve|Spiral) /g)].map((m) => m[1])).toEqual([
      'Line',
      'Spiral',
      'Curve',
      'Spiral',
      'Line',
      'Curve',
      'Line',
    ]);
    expect(xml).toMatch(/<Curve [^>]*radius="180"/);
    expect(xml).toMatch(/<ParaCurve length="120">260 60.2<\/ParaCurve>/);
    // the JSON report carries no exchange data
    expect(r.stdout).not.toContain('exchange');
  });

  it('loads LandXML points into a job, converted exactly from US survey feet to metres', () => {
    const xmlFile = join(dir, 'control.xml');
    writeFileSync(
      xmlFile,
      `<?xml version="1.0"?>
<LandXML version="1.2" date="2026-12-03" time="10:00:00">
  <Units><Imperial linearUnit="USSurveyFoot" areaUnit="squareFoot" volumeUnit="cubicFeet" temperatureUnit="fahrenheit" pressureUnit="inchHG"/></Units>
  <CgPoints>
    <CgPoint name="A">0 0</CgPoint>
    <CgPoint name="B">0 3937</CgPoint>
    <CgPoint name="C">3937 0</CgPoint>
  </CgPoints>
</LandXML>
`,
    );
    const job = join(dir, 'abc.json');
    writeFileSync(
      job,
      JSON.stringify({
        title: 'From LandXML',
        tasks: [{ kind: 'area', name: 'ABC', points: ['A', 'B', 'C'] }],
      }),
    );
    const csv = join(dir, 'abc.csv');
    const r = cli([
      'run',
      job,
      '--points',
      xmlFile,
      '--export',
      'csv',
      csv,
      '--csv-mode',
      'exchange',
    ]);
    expect(r.code).toBe(0);
    // 3937 US survey feet = 1200 m exactly (1 US survey foot = 1200/3937 m)
    expect(readFileSync(csv, 'utf8')).toBe('name,east,north\nA,0,0\nB,1200,0\nC,0,1200\n');
  });

  it('refuses a LandXML file without points, and a job in units LandXML is not written in', () => {
    const empty = join(dir, 'empty.xml');
    writeFileSync(empty, '<LandXML version="1.2" date="2026-12-03" time="10:00:00"/>');
    const job = join(dir, 'abc.json');
    const r = cli(['run', job, '--points', empty]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--points.*no CgPoint/);
    const bad = join(dir, 'bad.xml');
    writeFileSync(bad, '<LandXML version="1.2"><CgPoints>');
    const r2 = cli(['run', job, '--points', bad]);
    expect(r2.code).toBe(2);
    expect(r2.stderr).toMatch(/not well-formed/);
    const km = join(dir, 'km.json');
    writeFileSync(
      km,
      JSON.stringify({
        title: 'km',
        units: { length: 'km' },
        points: { A: { east: 0, north: 0 }, B: { east: 1, north: 0 }, C: { east: 0, north: 1 } },
        tasks: [{ kind: 'area', name: 'ABC', points: ['A', 'B', 'C'] }],
      }),
    );
    const out = join(dir, 'km.xml');
    const r3 = cli(['run', km, '--export', 'landxml', out]);
    expect(r3.code).toBe(2);
    expect(r3.stderr).toMatch(/m, ft or us-ft/);
    expect(existsSync(out)).toBe(false);
  });
});
