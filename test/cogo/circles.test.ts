import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import {
  rational,
  intersectLineCircle,
  intersectCircles,
  intersectBearings,
  isSurd,
  QuadspreadError,
} from '../../src/index.js';
import type { Arithmetic, Surd } from '../../src/index.js';

const num = (v: unknown, A: Arithmetic<unknown, boolean>) =>
  isSurd(v) ? (v as Surd<unknown>).toNumber() : A.toNumber(v);

describe.each(kinds)('intersectCircles(%s, circle1, circle2)', (_name, A) => {
  it('finds (4, −3) to the right and (4, 3) to the left of C1→C2 for two radius-5 circles 8 apart (3-4-5, derived)', () => {
    const pts = intersectCircles(
      A,
      { center: { x: 0, y: 0 }, radius: 5 },
      { center: { x: 8, y: 0 }, radius: 5 },
    );
    expect(pts.map((p) => [num(p.x, A), num(p.y, A)])).toEqual([
      [4, -3],
      [4, 3],
    ]);
  });

  it('gives one point when the circles touch', () => {
    const pts = intersectCircles(
      A,
      { center: { x: 0, y: 0 }, radius: 2 },
      { center: { x: 0, y: 5 }, quadrance: 9 },
    );
    expect(pts.map((p) => [num(p.x, A), num(p.y, A)])).toEqual([[0, 2]]);
  });

  it('refuses circles that do not meet with NO_REAL_SOLUTION, and concentric ones with COINCIDENT_POINTS', () => {
    expect(
      code(() =>
        intersectCircles(
          A,
          { center: { x: 0, y: 0 }, radius: 1 },
          { center: { x: 5, y: 0 }, radius: 1 },
        ),
      ),
    ).toBe('NO_REAL_SOLUTION');
    expect(
      code(() =>
        intersectCircles(
          A,
          { center: { x: 0, y: 0 }, radius: 1 },
          { center: { x: 0, y: 0 }, radius: 2 },
        ),
      ),
    ).toBe('COINCIDENT_POINTS');
    expect(
      code(() =>
        intersectCircles(
          A,
          { center: { x: 0, y: 0 }, radius: -1 },
          { center: { x: 1, y: 0 }, radius: 1 },
        ),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        intersectCircles(A, { center: { x: 0, y: 0 } } as never, {
          center: { x: 1, y: 0 },
          radius: 1,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});

describe.each(kinds)('intersectLineCircle(%s, P1, P2, circle)', (_name, A) => {
  it('orders the points along P1→P2 and agrees with the quadratic formula in Math (1e-12)', () => {
    const pts = intersectLineCircle(
      A,
      { x: -10, y: 1 },
      { x: 10, y: 2 },
      { center: { x: 1, y: 1 }, radius: 3 },
    );
    // y = 1.5 + x/20; (x − 1)² + (y − 1)² = 9 → (1 + 1/400)x² + (−2 + 1/20)x + (1 + 1/4 − 9) = 0
    const a = 1 + 1 / 400,
      b = -2 + 1 / 20,
      c = 1 + 0.25 - 9;
    const xs = [
      (-b - Math.sqrt(b * b - 4 * a * c)) / (2 * a),
      (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a),
    ];
    pts.forEach((p, i) => {
      expect(Math.abs(num(p.x, A) - xs[i]!)).toBeLessThan(1e-12);
      expect(Math.abs(num(p.y, A) - (1.5 + xs[i]! / 20))).toBeLessThan(1e-12);
    });
  });

  it('refuses a line that misses with NO_REAL_SOLUTION and P1 = P2 with COINCIDENT_POINTS', () => {
    expect(
      code(() =>
        intersectLineCircle(
          A,
          { x: 0, y: 5 },
          { x: 1, y: 5 },
          { center: { x: 0, y: 0 }, radius: 1 },
        ),
      ),
    ).toBe('NO_REAL_SOLUTION');
    expect(
      code(() =>
        intersectLineCircle(
          A,
          { x: 0, y: 5 },
          { x: 0, y: 5 },
          { center: { x: 0, y: 0 }, radius: 1 },
        ),
      ),
    ).toBe('COINCIDENT_POINTS');
    expect(
      code(() =>
        intersectLineCircle(
          A,
          { x: 0, y: 0 },
          { x: 0, y: 5 },
          { center: { x: 0, y: 0 }, quadrance: -1 },
        ),
      ),
    ).toBe('NEGATIVE_QUADRANCE');
  });
});

describe('circle intersections in rational are exact surds (fast-check)', () => {
  const int = fc.integer({ min: -1000, max: 1000 });
  it('circle–circle points lie on both circles exactly', () => {
    fc.assert(
      fc.property(
        int,
        int,
        int,
        int,
        fc.integer({ min: 1, max: 2000 }),
        fc.integer({ min: 1, max: 2000 }),
        (x1, y1, x2, y2, r1, r2) => {
          fc.pre(x1 !== x2 || y1 !== y2);
          let pts;
          try {
            pts = intersectCircles(
              rational,
              { center: { x: x1, y: y1 }, radius: r1 },
              { center: { x: x2, y: y2 }, radius: r2 },
            );
          } catch (e) {
            expect((e as QuadspreadError).code).toBe('NO_REAL_SOLUTION');
            const D = Math.hypot(x2 - x1, y2 - y1);
            expect(D > r1 + r2 || D < Math.abs(r1 - r2)).toBe(true);
            return;
          }
          for (const p of pts) {
            const X = p.x as Surd<unknown>,
              Y = p.y as Surd<unknown>;
            expect(
              X.sub(x1)
                .mul(X.sub(x1))
                .add(Y.sub(y1).mul(Y.sub(y1)))
                .eq(r1 * r1),
            ).toBe(true);
            expect(
              X.sub(x2)
                .mul(X.sub(x2))
                .add(Y.sub(y2).mul(Y.sub(y2)))
                .eq(r2 * r2),
            ).toBe(true);
          }
        },
      ),
    );
  });

  it('line–circle points lie on the circle and the line exactly', () => {
    fc.assert(
      fc.property(
        int,
        int,
        int,
        int,
        int,
        int,
        fc.integer({ min: 1, max: 2000 }),
        (x1, y1, x2, y2, cx, cy, r) => {
          fc.pre(x1 !== x2 || y1 !== y2);
          let pts;
          try {
            pts = intersectLineCircle(
              rational,
              { x: x1, y: y1 },
              { x: x2, y: y2 },
              { center: { x: cx, y: cy }, radius: r },
            );
          } catch (e) {
            expect((e as QuadspreadError).code).toBe('NO_REAL_SOLUTION');
            return;
          }
          for (const p of pts) {
            const X = p.x as Surd<unknown>,
              Y = p.y as Surd<unknown>;
            expect(
              X.sub(cx)
                .mul(X.sub(cx))
                .add(Y.sub(cy).mul(Y.sub(cy)))
                .eq(r * r),
            ).toBe(true);
            // (X − x1)(y2 − y1) − (Y − y1)(x2 − x1) = 0
            expect(
              X.sub(x1)
                .mul(y2 - y1)
                .sub(Y.sub(y1).mul(x2 - x1))
                .isZero(),
            ).toBe(true);
          }
        },
      ),
    );
  });
});

describe.each(kinds)(
  'intersectBearings(%s, P, bearingP, Q, bearingQ) (bearings clockwise from north)',
  (_name, A) => {
    it('meets at (10, 0) from (0, 0) due east and from (10, −10) due north', () => {
      const r = intersectBearings(A, { x: 0, y: 0 }, 90, { x: 10, y: -10 }, `N 0° E`);
      expect([
        A.toNumber(r.point.x),
        A.toNumber(r.point.y),
        A.toNumber(r.distanceP),
        A.toNumber(r.distanceQ),
      ]).toEqual([10, 0, 10, 10]);
    });

    it('agrees with classical trigonometry (sine rule with Math.*) to 1e-9', () => {
      const P = { x: 0, y: 0 },
        Q = { x: 100, y: 0 };
      const r = intersectBearings(A, P, `N 40°00'00" E`, Q, `N 30° W`);
      // Triangle PQX: angle at P = 50°, at Q = 60°, at X = 70°: PX = 100·sin 60°/sin 70° (sine rule).
      const px = (100 * Math.sin(Math.PI / 3)) / Math.sin((70 * Math.PI) / 180);
      expect(Math.abs(A.toNumber(r.distanceP) - px)).toBeLessThan(1e-9);
      expect(Math.abs(A.toNumber(r.point.x) - px * Math.sin((40 * Math.PI) / 180))).toBeLessThan(
        1e-9,
      );
    });

    it('refuses parallel bearings with PARALLEL_LINES and rays meeting behind a station with NO_REAL_SOLUTION', () => {
      expect(code(() => intersectBearings(A, { x: 0, y: 0 }, 40, { x: 10, y: 0 }, 220))).toBe(
        'PARALLEL_LINES',
      );
      expect(code(() => intersectBearings(A, { x: 0, y: 0 }, 270, { x: 10, y: -10 }, 0))).toBe(
        'NO_REAL_SOLUTION',
      );
      expect(code(() => intersectBearings(A, { x: 0, y: 0 }, 'east', { x: 10, y: -10 }, 0))).toBe(
        'INVALID_BEARING',
      );
    });
  },
);
