// The float contract at the solvers' boundary: with valid inputs scaled far beyond the range
// a survey ever needs (coordinates up to 1e300, quadrances up to their squares), every solver
// either returns finite numbers only (deep: every number in the result) or throws a
// QuadspreadError — never ±Infinity or NaN, never a TypeError. float leaves add, sub and mul
// unchecked for speed, so this is what catches a result that is a bare sum or product.
// Run in float, in uncertain(float), and in the float-specialised copy (quadspread/float).
import { describe, expect, it, beforeAll } from 'vitest';
import { loadFloatEntry } from '../float-entry.js';
import * as q from '../../src/index.js';

type Api = Record<string, (...a: any[]) => any>;
const P = (x: number, y: number) => ({ x, y });

/** The solvers, each called through `m` (arithmetic already bound) at scale s. */
const calls = (s: number, m: Api): [string, () => unknown][] => [
  [
    'solveTriangle Q1 Q2 Q3',
    () => m.solveTriangle!({ Q1: 25 * s * s, Q2: 16 * s * s, Q3: 9 * s * s }),
  ],
  ['solveTriangle Q1 Q2 s3', () => m.solveTriangle!({ Q1: 25 * s * s, Q2: 16 * s * s, s3: 0.5 })],
  ['solveTriangle Q1 s2 s3', () => m.solveTriangle!({ Q1: 25 * s * s, s2: 0.5, s3: 0.25 })],
  ['triangle', () => m.triangle!(m.point!(0, 0), m.point!(3 * s, 0), m.point!(0, 4 * s))],
  ['spread', () => m.spread!(m.point!(0, 0), m.point!(3 * s, 0), m.point!(s, 4 * s))],
  ['heightFromReading', () => m.heightFromReading!({ horizontal: 100 * s * s, vertical: 0.36 })],
  ['horizontalFromHeight', () => m.horizontalFromHeight!({ height: 100 * s * s, vertical: 0.36 })],
  [
    'verticalFromHeight',
    () => m.verticalFromHeight!({ height: 100 * s * s, horizontal: 30 * s * s }),
  ],
  [
    'heightFromInlineReadings (3)',
    () =>
      m.heightFromInlineReadings!({ chainages: [0, 10 * s, 25 * s], vertical: [0.2, 0.3, 0.25] }),
  ],
  [
    'heightFromInlineReadings (4)',
    () =>
      m.heightFromInlineReadings!({
        chainages: [0, 10 * s, 25 * s, 40 * s],
        vertical: [0.2, 0.3, 0.25, 0.1],
      }),
  ],
  [
    'heightFromInlineQuadrances',
    () =>
      m.heightFromInlineQuadrances!({
        spacings: [100 * s * s, 225 * s * s],
        vertical: [0.2, 0.3, 0.25],
      }),
  ],
  [
    'heightFromBase',
    () =>
      m.heightFromBase!({
        base: 196 * s * s,
        spreads: [144 / 169, 16 / 25],
        foot: 'between',
        vertical: [0.5, undefined],
      }),
  ],
  [
    'heightFromTwoStations',
    () =>
      m.heightFromTwoStations!({
        stations: [P(0, 0), P(10 * s, 0)],
        foot: P(4 * s, 3 * s),
        vertical: [0.5, 25 / 70],
      }),
  ],
  [
    'trigHeight',
    () =>
      m.trigHeight!({
        distance: 130 * s,
        measured: 'slope',
        vertical: 25 / 169,
        instrumentHeight: 1.5 * s,
        targetHeight: 2 * s,
      }),
  ],
  ['curvatureRefraction', () => m.curvatureRefraction!(1000 * s)],
  ['inverse', () => m.inverse!(P(0, 0), P(3 * s, 4 * s))],
  ['forward', () => m.forward!(P(100 * s, 200 * s), 'S 30° E', 10 * s)],
  ['forward (near the end of the range)', () => m.forward!(P(1.2e308, 0), 90, 1e308 / (1 + 1 / s))],
  ['groundToGrid (near the end of the range)', () => m.groundToGrid!(1e308, 2 - 1 / s)],
  ['intersectLines', () => m.intersectLines!(P(0, 0), P(s, s), P(0, s), P(s, 0))],
  ['intersectBearings', () => m.intersectBearings!(P(0, 0), 45, P(10 * s, 0), 315)],
  [
    'intersectCircles',
    () =>
      m.intersectCircles!(
        { center: P(0, 0), radius: 5 * s },
        { center: P(6 * s, 0), radius: 5 * s },
      ),
  ],
  [
    'intersectLineCircle',
    () => m.intersectLineCircle!(P(-10 * s, 0), P(10 * s, 0), { center: P(0, 0), radius: 5 * s }),
  ],
  [
    'resection',
    () =>
      m.resection!({
        control: [P(0, 100 * s), P(100 * s, 100 * s), P(100 * s, 0)],
        angles: [60, 70],
      }),
  ],
  [
    'traverse (bearings)',
    () =>
      m.traverse!({
        start: P(0, 0),
        courses: [
          { bearing: 0, distance: 10 * s },
          { bearing: 90, distance: 10 * s },
          { bearing: 180, distance: 10 * s },
          { bearing: 270, distance: 10.01 * s },
        ],
      }),
  ],
  [
    'traverse (lat/dep)',
    () =>
      m.traverse!({
        start: P(0, 0),
        courses: [
          { latitude: 10 * s, departure: 0 },
          { latitude: 0, departure: 10 * s },
          { latitude: -10 * s, departure: -10.01 * s },
        ],
      }),
  ],
  ['area', () => m.area!([P(0, 0), P(10 * s, 0), P(10 * s, 10 * s)])],
  ['polygonArea', () => m.polygonArea!([P(0, 0), P(10 * s, 0), P(10 * s, 10 * s)])],
  ['perimeter', () => m.perimeter!([P(0, 0), P(10 * s, 0), P(10 * s, 10 * s)])],
  [
    'levelRun',
    () =>
      m.levelRun!({ start: 100 * s, sights: [{ bs: 1.2 * s }, { fs: 0.8 * s, distance: 40 * s }] }),
  ],
  [
    'solveStewart',
    () => m.solveStewart!({ QB: 25 * s * s, QC: 9 * s * s, tB: 0, tC: 7 * s, tD: 3 * s }),
  ],
  [
    'solveStewartQuadrances',
    () =>
      m.solveStewartQuadrances!({ QB: 25 * s * s, QC: 9 * s * s, QBD: 9 * s * s, QBC: 49 * s * s }),
  ],
  ['quadrance', () => m.quadrance!(m.point!(0, 0), m.point!(3 * s, 4 * s))],
  ['lineThrough', () => m.lineThrough!(m.point!(s, 2 * s), m.point!(2 * s, 3 * s))],
  ['footOfPerpendicular', () => m.footOfPerpendicular!(m.point!(s, s), m.line!(1, 1, -s))],
  ['quadranceToLine', () => m.quadranceToLine!(m.point!(s, 3 * s), m.line!(1, 1, -s))],
  ['quadrea', () => m.quadrea!(25 * s * s, 16 * s * s, 9 * s * s)],
  ['groundToGrid', () => m.groundToGrid!(1000 * s, 0.9996)],
  ['combinedFactor', () => m.combinedFactor!(0.9999 * s, 0.9996 * s)],
  [
    'geodeticToGeocentric',
    () => m.geodeticToGeocentric!({ lat: 45, lon: 10, h: 1000 * s }, q.WGS84),
  ],
  [
    'geocentricToGeodetic',
    () => m.geocentricToGeodetic!({ X: 4e6 * s, Y: 1e6 * s, Z: 4.5e6 * s }, q.WGS84),
  ],
  [
    'enuFromGeocentric',
    () =>
      m.enuFromGeocentric!(
        { lat: 45, lon: 7, h: 0 },
        { X: 4e6 * s, Y: 1e6 * s, Z: 4.5e6 * s },
        q.WGS84,
      ),
  ],
  ['lengthToMetres', () => m.lengthToMetres!(s, 'km')],
  ['convertLength', () => m.convertLength!(s, 'km', 'ft')],
  ['convertQuadrance', () => m.convertQuadrance!(s * s, 'km', 'ft')],
];

/** The first number in `v` (deep) that is not finite, as a path, or undefined. */
function nonFinite(v: unknown, at = 'result', seen = new Set<unknown>()): string | undefined {
  if (typeof v === 'number') return Number.isFinite(v) ? undefined : `${at} = ${v}`;
  if (v === null || typeof v !== 'object' || seen.has(v)) return undefined;
  seen.add(v);
  for (const [k, x] of Object.entries(v)) {
    const bad = nonFinite(x, `${at}.${k}`, seen);
    if (bad) return bad;
  }
  return undefined;
}

/** undefined when the call keeps the contract, else what went wrong. */
function breach(f: () => unknown): string | undefined {
  try {
    return nonFinite(f());
  } catch (e) {
    return e instanceof q.QuadspreadError
      ? undefined
      : `threw ${(e as Error).name}: ${(e as Error).message}`;
  }
}

const SCALES = [1, 1e100, 1e140, 1e150, 1e154, 1e155, 1e160, 1e200, 1e300];
const bind = (A: q.Arithmetic<any>): Api =>
  new Proxy(
    {},
    {
      get:
        (_t, k: string) =>
        (...a: unknown[]) =>
          (q as unknown as Api)[k]!(A, ...a),
    },
  ) as Api;

function check(m: Api): string[] {
  const out: string[] = [];
  for (const s of SCALES) {
    for (const [name, f] of calls(s, m)) {
      const b = breach(f);
      if (b) out.push(`${name} at scale ${s}: ${b}`);
    }
  }
  return out;
}

describe('float: finite results or a QuadspreadError, at any scale', () => {
  it('the scan can see a breach (a result holding Infinity, a TypeError)', () => {
    expect(breach(() => ({ a: [1, Infinity] }))).toBe('result.a.1 = Infinity');
    expect(breach(() => (null as unknown as { x: number }).x)).toMatch(/^threw TypeError/);
    expect(breach(() => q.float.div(1, 0))).toBeUndefined();
  });

  it('at scale 1 every call succeeds (the inputs are valid)', () => {
    const failed: string[] = [];
    for (const [name, f] of calls(1, bind(q.float))) {
      try {
        f();
      } catch (e) {
        failed.push(`${name}: ${(e as Error).message}`);
      }
    }
    expect(failed).toEqual([]);
  });

  it('generic entry, float', () => {
    expect(check(bind(q.float))).toEqual([]);
  });

  it('generic entry, uncertain(float)', () => {
    expect(check(bind(q.uncertain(q.float)))).toEqual([]);
  });

  describe('quadspread/float (float-specialised)', () => {
    let bound: Api;
    beforeAll(async () => {
      bound = (await loadFloatEntry()) as typeof bound;
    }, 60_000);

    it('bound float entry', () => {
      expect(check(bound)).toEqual([]);
    });
  });
});
