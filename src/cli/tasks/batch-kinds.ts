/**
 * The kinds of the batch command: what each row of a CSV is, which columns it reads and
 * which it writes.
 *
 * @module cli
 */
import {
  budget,
  degreesFromSpread,
  float,
  heightFromSight,
  measured,
  point,
  quadrance,
  sqrtOf,
  triangle,
  uncertain,
  verticalFromAngle,
} from '../../index.js';
import type { Arithmetic } from '../../index.js';
import { azimuthOf } from '../../cogo/inverse.js';

/**
 * How a column's text is read: `number` (a plain number or a fraction), `distance` (a number
 * ≥ 0), `angle` (degrees, DMS text or a number with `gon`, `mil`, `rad`), `elevation` (an
 * angle in [−90°, 90°]), `zenith` (an angle in [0°, 180°]), `sigma` (a number ≥ 0, read as a
 * float for the uncertainty run), `arcseconds` (an angle's σ ≥ 0: a number of arc-seconds, or
 * DMS text; read as a float).
 */
export type ColumnReading =
  'number' | 'distance' | 'angle' | 'elevation' | 'zenith' | 'sigma' | 'arcseconds';

/** What a kind needs to write its results. */
export interface KindContext {
  /** The arithmetic of the run. */
  A: Arithmetic<unknown, boolean>;
  /** A value or surd of `A` as decimal text, to the digits asked for. */
  num(x: unknown): string;
  /** A float as decimal text, to the digits asked for (for σ, computed in `uncertain(float)`). */
  floatNum(x: number): string;
  /** An angle in degrees (a value of `A`) as written in the output: decimal degrees or DMS. */
  angle(degrees: unknown): string;
  /** A value of `A` exactly (a fraction in `rational`), for the exact columns. */
  exact(x: unknown): string;
  /** Whether the exact columns were asked for (`--exact`). */
  exactColumns: boolean;
}

/** A kind set up for a header: the columns it reads, those it writes, and one row's results. */
export interface KindPlan {
  /** The columns read, in the order `row` takes them; an optional one may be absent or empty (then `undefined`). */
  inputs: readonly { column: string; reading: ColumnReading; optional?: boolean }[];
  /** The names of the result columns. */
  outputs: readonly string[];
  /** The result fields of one row from its values. */
  row(values: unknown[]): string[];
}

/** One batch kind. */
export interface BatchKind {
  description: string;
  /** The columns a row needs (for help and messages). */
  columns: readonly string[];
  /** Whether the kind has exact columns (`--exact`). */
  exactColumns: boolean;
  /** The plan for a header (its column names), or the reason the header does not do. */
  plan(c: KindContext, header: readonly string[]): KindPlan | string;
}

const numbers = (names: readonly string[]) =>
  names.map((column) => ({ column, reading: 'number' as const }));

/**
 * The azimuth of (dx, dy) ≠ 0 in float: `azimuthOf` with `float`'s operations written out (the
 * same operations in the same order, so the same double; property-tested in
 * test/cli/batch-kinds.test.ts).
 */
export function azimuthFloat(dx: number, dy: number): number {
  if (dx === 0) return dy > 0 ? 0 : 180;
  if (dy === 0) return dx > 0 ? 90 : 270;
  if (Math.abs(dx) === Math.abs(dy)) return dx > 0 ? (dy > 0 ? 45 : 135) : dy < 0 ? 225 : 315;
  let deg = (Math.atan2(dx, dy) * 180) / Math.PI;
  if (deg < 0) deg += 360;
  if (deg >= 360) deg -= 360;
  return deg;
}

const inverses: BatchKind = {
  description:
    'pairs of points (east1, north1, east2, north2): quadrance, distance and bearing (clockwise from north) from the first to the second',
  columns: ['east1', 'north1', 'east2', 'north2'],
  exactColumns: true,
  plan(c) {
    const A = c.A;
    const generic = ([e1, n1, e2, n2]: unknown[]): string[] => {
      const Q = quadrance(A, point(A, e1, n1), point(A, e2, n2));
      const dx = A.sub(e2, e1);
      const dy = A.sub(n2, n1);
      // Two coincident points have no bearing: the field is left empty.
      const b = A.isZero(dx) && A.isZero(dy) ? '' : c.angle(azimuthOf(A, dx, dy));
      const out = [c.num(Q), c.num(sqrtOf(A, Q)), b];
      if (c.exactColumns) out.push(c.exact(Q));
      return out;
    };
    // In float, the same operations on plain numbers (quadrance, √ and azimuthOf as float
    // computes them); a quadrance that overflows goes to the generic code, which refuses it.
    const inFloat = (values: unknown[]): string[] => {
      const [e1, n1, e2, n2] = values as number[];
      const dx = e2! - e1!;
      const dy = n2! - n1!;
      const Q = dx * dx + dy * dy;
      if (Q - Q !== 0) return generic(values);
      const b = dx === 0 && dy === 0 ? '' : c.angle(azimuthFloat(dx, dy));
      return [c.num(Q), c.num(Math.sqrt(Q)), b];
    };
    return {
      inputs: numbers(this.columns),
      outputs: ['quadrance', 'distance', 'bearing', ...(c.exactColumns ? ['quadrance_exact'] : [])],
      row: A === (float as unknown) ? inFloat : generic,
    };
  },
};

const TRIANGLE_EXACT = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea', 'area'];

const triangles: BatchKind = {
  description:
    'triangles by their vertices (x1, y1, x2, y2, x3, y3; x east, y north): quadrances, spreads, quadrea, sides, angles in degrees and area (side i and angle i are opposite and at vertex i)',
  columns: ['x1', 'y1', 'x2', 'y2', 'x3', 'y3'],
  exactColumns: true,
  plan(c) {
    const A = c.A;
    const d180 = A.from(180);
    const two = A.from(2);
    // The angle at a vertex: acute or right when the opposite quadrance is at most the sum of
    // the other two (the cross law: Q_o = Q_a + Q_b − 2·√(Q_a·Q_b)·cos θ), else obtuse.
    const angleAt = (s: unknown, Qo: unknown, Qa: unknown, Qb: unknown): unknown => {
      const acute = degreesFromSpread(A, s);
      return A.cmp(Qo, A.add(Qa, Qb)) > 0 ? A.sub(d180, acute) : acute;
    };
    return {
      inputs: numbers(this.columns),
      outputs: [
        ...['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea'],
        ...['side1', 'side2', 'side3', 'angle1', 'angle2', 'angle3', 'area'],
        ...(c.exactColumns ? TRIANGLE_EXACT.map((n) => `${n}_exact`) : []),
      ],
      row([x1, y1, x2, y2, x3, y3]) {
        const t = triangle(A, point(A, x1, y1), point(A, x2, y2), point(A, x3, y3));
        // Twice the signed area: (A2 − A1) × (A3 − A1).
        const D = A.sub(A.mul(A.sub(x2, x1), A.sub(y3, y1)), A.mul(A.sub(x3, x1), A.sub(y2, y1)));
        const area = A.div(A.abs(D), two);
        const exact = [t.Q1, t.Q2, t.Q3, t.s1, t.s2, t.s3, t.quadrea];
        const out = exact.map((v) => c.num(v));
        for (const Q of [t.Q1, t.Q2, t.Q3]) out.push(c.num(sqrtOf(A, Q)));
        out.push(
          c.angle(angleAt(t.s1, t.Q1, t.Q2, t.Q3)),
          c.angle(angleAt(t.s2, t.Q2, t.Q1, t.Q3)),
          c.angle(angleAt(t.s3, t.Q3, t.Q1, t.Q2)),
          c.num(area),
        );
        if (c.exactColumns) for (const v of [...exact, area]) out.push(c.exact(v));
        return out;
      },
    };
  },
};

const heights: BatchKind = {
  description:
    'heights from a horizontal distance and an elevation or zenith angle (horizontal, and elevation or zenith: degrees or DMS), with σ from horizontal_sigma and elevation_sigma or zenith_sigma (arc-seconds) when given: H = Q·R/(1 − R), the signed height and its σ',
  columns: ['horizontal', 'elevation or zenith'],
  exactColumns: false,
  plan(c, header) {
    const A = c.A;
    const given = (['elevation', 'zenith'] as const).filter((k) => header.includes(k));
    if (given.length !== 1)
      return given.length === 0
        ? 'the header has no column "elevation" or "zenith" (a heights batch needs horizontal and one of them)'
        : 'the header has both "elevation" and "zenith": give one of them';
    const kind = given[0]!;
    const withSigma = header.includes('horizontal_sigma') || header.includes(`${kind}_sigma`);
    const U = uncertain(float);
    return {
      inputs: [
        { column: 'horizontal', reading: 'distance' },
        { column: kind, reading: kind },
        ...(withSigma
          ? [
              { column: 'horizontal_sigma', reading: 'sigma' as const, optional: true },
              { column: `${kind}_sigma`, reading: 'arcseconds' as const, optional: true },
            ]
          : []),
      ],
      outputs: ['H', 'height', ...(withSigma ? ['height_sigma'] : [])],
      row([d, angle, sd, sa]) {
        const r = heightFromSight(A, {
          horizontalQuadrance: A.mul(d, d),
          vertical: verticalFromAngle(A, angle, { kind }),
        });
        const out = [c.num(r.H), c.num(r.height)];
        if (withSigma) {
          // The budget in uncertain(float), as the job runner computes every budget.
          const dU = measured(U, A.toNumber(d), (sd as number | undefined) ?? 0, 'horizontal');
          const aU = measured(U, A.toNumber(angle), ((sa as number | undefined) ?? 0) / 3600, kind);
          const h = heightFromSight(U, {
            horizontalQuadrance: U.mul(dU, dU),
            vertical: verticalFromAngle(U, aU, { kind }),
          });
          out.push(c.floatNum(budget(U, h.height).sigma as number));
        }
        return out;
      },
    };
  },
};

/** The batch kinds, by name. */
export const BATCH_KINDS: Readonly<Record<string, BatchKind>> = { inverses, triangles, heights };
