// scripts/float-specialize.mjs compiles the float entry's copy of the generic code with
// A.add(x, y) → (x + y) etc. These tests bundle a fixture through it and check that the
// specialised functions give bit-for-bit the generic results with `float`, throw the same
// errors, and still run the untouched generic code for any other arithmetic; and that the
// real quadspread/float source specialises triangle() and matches the generic triangle.
import { solveTriangle } from '../../src/readings/triangle-readings.js';
import { describe, expect, it, beforeAll } from 'vitest';
import fc from 'fast-check';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
// @ts-expect-error: a plain ES module without types
import { specializeSource } from '../../scripts/float-specialize.mjs';
import { loadSpecialised } from '../float-entry.js';
import * as G from './fixtures/generic.js';
import { float, rational, QuadspreadError } from '../../src/index.js';
import { triangle, point, quadrance, spread } from '../../src/geometry/index.js';
import {
  heightFromReading,
  heightFromInlineReadings,
  pathGrade,
} from '../../src/elevation/index.js';
import { traverse, area, intersectLines } from '../../src/cogo/index.js';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '../..');

const bundle = (entry: string): Promise<Record<string, unknown>> => loadSpecialised(entry);

function outcome(f: () => unknown): unknown {
  try {
    return { value: f() };
  } catch (e) {
    return {
      error:
        e instanceof Error
          ? `${e.name}:${(e as QuadspreadError).code ?? ''}:${e.message}`
          : String(e),
    };
  }
}

const finite = fc.double({ min: -1e9, max: 1e9, noNaN: true });
const pt = fc.record({ x: finite, y: finite });

let B: Record<string, any>;
let F: Record<string, any>;
beforeAll(async () => {
  B = await bundle(path.join(here, 'fixtures/entry.ts'));
  F = await bundle(path.join(root, 'src/entries/float.gen.ts'));
}, 60_000);

describe('float-specialize', () => {
  it('rewrites the float operations inline and keeps the original as f$qsGeneric', () => {
    const src =
      'export function q<T>(A: Arithmetic<T>, a: T, b: T): T { return A.add(A.mul(a, a), A.neg(b)); }';
    const { code, functions } = specializeSource(src, 'x.ts');
    expect(functions).toEqual(['q']);
    expect(code).toContain('if (A !== __qsFloat) return q$qsGeneric(A, a, b);');
    expect(code).toContain('((((a) * (a))) + ((-(b))))');
    expect(code).toContain(
      'function q$qsGeneric<T>(A: Arithmetic<T>, a: T, b: T): T { return A.add(A.mul(a, a), A.neg(b)); }',
    );
  });

  it('leaves functions without an arithmetic parameter, and uncertain ones, unchanged', () => {
    const src =
      'export function f(x: number) { return x + 1; }\nexport function g<T>(U: UncertainArithmetic<T>, a: T) { return U.add(a, a); }';
    expect(specializeSource(src, 'y.ts').code).toBe(src);
  });

  it('the specialised spread equals the generic one bit for bit in float', () => {
    fc.assert(
      fc.property(pt, pt, pt, (V, P, Q) => {
        expect(outcome(() => B.spreadAt(B.float, V, P, Q))).toEqual(
          outcome(() => G.spreadAt(float, V, P, Q)),
        );
      }),
      { numRuns: 500 },
    );
  });

  it('sign, cmp, isZero, sqrt, from, one, zero, kernels and the errors agree with float', () => {
    fc.assert(
      fc.property(
        fc.oneof(finite, fc.constant(0), fc.constant(-0)),
        fc.oneof(finite, fc.constant(0)),
        (a, b) => {
          expect(outcome(() => B.mixed(B.float, a, b))).toEqual(
            outcome(() => G.mixed(float, a, b)),
          );
        },
      ),
      { numRuns: 500 },
    );
    expect(
      outcome(() => B.spreadAt(B.float, { x: 1, y: 1 }, { x: 1, y: 1 }, { x: 2, y: 2 })),
    ).toEqual(outcome(() => G.spreadAt(float, { x: 1, y: 1 }, { x: 1, y: 1 }, { x: 2, y: 2 })));
  });

  it('runs the untouched generic code for any other arithmetic (here rational)', () => {
    const R = B.rational as typeof rational;
    const V = { x: R.from('1/3'), y: R.from(2) },
      P = { x: R.from(5), y: R.from('-7/2') },
      Q = { x: R.from(0), y: R.from('0.25') };
    expect(R.toString(B.nested(R, V, P, Q))).toBe(rational.toString(G.nested(rational, V, P, Q)));
    expect(outcome(() => B.mixed(R, R.from('1/4'), R.from(3)))).toEqual(
      outcome(() => G.mixed(rational, rational.from('1/4'), rational.from(3))),
    );
  });

  it('quadspread/float triangle() is specialised and equals the generic triangle(float, …) bit for bit', () => {
    fc.assert(
      fc.property(pt, pt, pt, (P, Q, R) => {
        const [a, b, c] = [P, Q, R].map((X) => point(float, X.x, X.y));
        expect(outcome(() => F.triangle(a, b, c))).toEqual(
          outcome(() => triangle(float, a!, b!, c!)),
        );
      }),
      { numRuns: 500 },
    );
    expect(outcome(() => F.triangle({ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }))).toEqual(
      outcome(() => triangle(float, { x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 })),
    );
  });

  it('the other quadspread/float solvers equal the generic ones with float, results and errors', () => {
    const small = fc.double({ min: -1000, max: 1000, noNaN: true });
    const unit = fc.double({ min: -0.1, max: 1.1, noNaN: true });
    const p2 = fc.record({ x: small, y: small });
    fc.assert(
      fc.property(
        p2,
        p2,
        p2,
        p2,
        fc.tuple(small, small, small),
        fc.tuple(unit, unit, unit),
        fc.array(
          fc.record({
            latitude: small,
            departure: small,
            distance: fc.double({ min: 0, max: 500, noNaN: true }),
          }),
          { minLength: 1, maxLength: 20 },
        ),
        (a, b, c, d, cs, vs, courses) => {
          const same = (f: () => unknown, g: () => unknown) => {
            const want = outcome(g) as { error?: string };
            // The documented difference (src/arithmetic/float.ts): float.add/sub/mul refuse an
            // overflow at once (NOT_FINITE); the specialised copy inlines + − × and meets the
            // overflow at its next checked step, with that step's typed error.
            if (/^QuadspreadError:NOT_FINITE:.*float\.(add|sub|mul)\(/.test(want.error ?? ''))
              expect((outcome(f) as { error?: string }).error).toMatch(/^QuadspreadError:/);
            else expect(outcome(f)).toEqual(want);
          };
          same(
            () => F.quadrance(a, b),
            () => quadrance(float, a, b),
          );
          same(
            () => F.spread(a, b, c),
            () => spread(float, a, b, c),
          );
          same(
            () => F.solveTriangle({ Q1: a.x * a.x, Q2: b.x * b.x, s3: vs[0] }),
            () => solveTriangle(float, { Q1: a.x * a.x, Q2: b.x * b.x, s3: vs[0] }),
          );
          same(
            () => F.heightFromReading({ horizontal: Math.abs(a.x), vertical: vs[1] }),
            () => heightFromReading(float, { horizontal: Math.abs(a.x), vertical: vs[1] }),
          );
          same(
            () => F.heightFromInlineReadings({ chainages: cs, vertical: vs }),
            () => heightFromInlineReadings(float, { chainages: cs, vertical: vs }),
          );
          same(
            () => F.pathGrade({ fall: vs[0], offset: vs[1], measured: 'plan' }),
            () => pathGrade(float, { fall: vs[0], offset: vs[1], measured: 'plan' }),
          );
          same(
            () => F.traverse({ start: a, courses }),
            () => traverse(float, { start: a, courses }),
          );
          same(
            () => F.area([a, b, c, d]),
            () => area(float, [a, b, c, d]),
          );
          same(
            () => F.intersectLines(a, b, c, d),
            () => intersectLines(float, a, b, c, d),
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it('projections and geodesics (sin, cos, exp, log, atan2 rewritten) equal the generic ones with float', async () => {
    const { toGrid, fromGrid, geodesicInverse, geodeticToGeocentric } =
      await import('../../src/index.js');
    const lcc = {
      method: 'lambert-conic-2sp',
      ellipsoid: 'GRS80',
      lat0: 46.5,
      lon0: 3,
      lat1: 49,
      lat2: 44,
      falseEasting: 700000,
      falseNorthing: 6600000,
    } as const;
    const tm = { method: 'transverse-mercator', ellipsoid: 'WGS84', lon0: 3, k0: 0.9996 } as const;
    const lat = fc.oneof(
      fc.double({ min: -90, max: 90, noNaN: true }),
      fc.constantFrom(90, -90, 0, -0, 89.9999999999, 1e-300),
    );
    const lon = fc.oneof(
      fc.double({ min: -540, max: 540, noNaN: true }),
      fc.constantFrom(180, -180, 183, 1e12),
    );
    fc.assert(
      fc.property(lat, lon, lat, lon, (la, lo, la2, lo2) => {
        const same = (f: () => unknown, g: () => unknown) => expect(outcome(f)).toEqual(outcome(g));
        for (const P of [lcc, tm]) {
          same(
            () => F.toGrid({ lat: la, lon: lo }, P),
            () => toGrid(float, { lat: la, lon: lo }, P),
          );
          same(
            () => F.fromGrid({ E: 700000 + lo * 1000, N: 6600000 + la * 1000 }, P),
            () => fromGrid(float, { E: 700000 + lo * 1000, N: 6600000 + la * 1000 }, P),
          );
        }
        same(
          () => F.geodesicInverse({ lat: la, lon: lo }, { lat: la2, lon: lo2 }, 'WGS84'),
          () => geodesicInverse(float, { lat: la, lon: lo }, { lat: la2, lon: lo2 }, 'WGS84'),
        );
        same(
          () => F.geodeticToGeocentric({ lat: la, lon: lo, h: 100 }, 'GRS80'),
          () => geodeticToGeocentric(float, { lat: la, lon: lo, h: 100 }, 'GRS80'),
        );
      }),
      { numRuns: 300 },
    );
    // Not two identical errors: the ordinary point gives values.
    expect(outcome(() => F.toGrid({ lat: 45, lon: 2 }, lcc))).toHaveProperty('value');
    expect(
      outcome(() => F.geodesicInverse({ lat: 45, lon: 2 }, { lat: -30, lon: 100 }, 'WGS84')),
    ).toHaveProperty('value');
  });
});
