// Local fits from common points: exact recovery of known transformations in rational, and the
// least-squares solution against the normal equations solved independently with mathjs.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { lusolve, multiply, transpose } from 'mathjs';
import { rational } from '../../src/arithmetic/rational.js';
import { float } from '../../src/arithmetic/float.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { QuadspreadError } from '../../src/errors.js';
import { fitSimilarity, fitAffine, fitInclinedPlane } from '../../src/adjustment/index.js';

const R = rational;
const small = fc.integer({ min: -50, max: 50 });
const coord = fc.integer({ min: -100000, max: 100000 });

/** Least squares by the normal equations, with mathjs (an independent solver). */
function mathjsLs(rows: number[][], l: number[]): number[] {
  const At = transpose(rows) as number[][];
  const N = multiply(At, rows) as number[][];
  const b = multiply(At, l) as number[];
  return (lusolve(N, b) as number[][]).map((r) => r[0]!);
}

describe('fitSimilarity', () => {
  it('recovers an exact similarity exactly in rational, with zero residuals', () => {
    fc.assert(
      fc.property(
        small,
        small,
        small,
        small,
        fc.array(fc.tuple(coord, coord), { minLength: 2, maxLength: 6 }),
        (a, b, tx, ty, pts) => {
          fc.pre(a !== 0 || b !== 0);
          fc.pre(new Set(pts.map((p) => p.join())).size > 1);
          const A = R.from(`${a}/7`);
          const B = R.from(`${b}/3`);
          const points = pts.map(([x, y]) => ({
            from: { x, y },
            to: {
              x: R.add(R.sub(R.mul(A, R.from(x)), R.mul(B, R.from(y))), R.from(tx)),
              y: R.add(R.add(R.mul(B, R.from(x)), R.mul(A, R.from(y))), R.from(ty)),
            },
          }));
          const f = fitSimilarity(R, points);
          expect(R.toString(f.a)).toBe(R.toString(A));
          expect(R.toString(f.b)).toBe(R.toString(B));
          expect(R.toString(f.tx)).toBe(String(tx));
          expect(R.toString(f.ty)).toBe(String(ty));
          expect(R.isZero(f.sumSquares)).toBe(true);
        },
      ),
      { numRuns: 40 },
    );
  });
  it('agrees with the normal equations solved by mathjs on noisy points (float, 1e-9 relative)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            coord,
            coord,
            fc.double({ min: -0.05, max: 0.05, noNaN: true }),
            fc.double({ min: -0.05, max: 0.05, noNaN: true }),
          ),
          { minLength: 3, maxLength: 10 },
        ),
        (pts) => {
          fc.pre(new Set(pts.map((p) => `${p[0]},${p[1]}`)).size > 1);
          const a = 0.9996,
            b = 0.0123,
            tx = 500000,
            ty = -1200;
          const points = pts.map(([x, y, ex, ey]) => ({
            from: { x, y },
            to: { x: a * x - b * y + tx + ex, y: b * x + a * y + ty + ey },
          }));
          const f = fitSimilarity(float, points);
          const rows: number[][] = [];
          const l: number[] = [];
          for (const p of points) {
            rows.push([p.from.x, -p.from.y, 1, 0]);
            l.push(p.to.x);
            rows.push([p.from.y, p.from.x, 0, 1]);
            l.push(p.to.y);
          }
          const m = mathjsLs(rows, l);
          expect(Math.abs(f.a - m[0]!)).toBeLessThan(1e-9);
          expect(Math.abs(f.b - m[1]!)).toBeLessThan(1e-9);
          expect(Math.abs(f.tx - m[2]!)).toBeLessThan(1e-9 * 1e6);
          expect(Math.abs(f.ty - m[3]!)).toBeLessThan(1e-9 * 1e6);
          // the residuals of a fit with translations sum to zero
          expect(Math.abs(f.residuals.reduce((s, r) => s + r.vx, 0))).toBeLessThan(1e-6);
        },
      ),
      { numRuns: 50 },
    );
  });
  it('gives scale², the spread of the rotation and the rotation in degrees', () => {
    const th = (30 * Math.PI) / 180;
    const pts = [
      [0, 0],
      [100, 0],
      [0, 100],
      [50, 70],
    ].map(([x, y]) => ({
      from: { x: x!, y: y! },
      to: {
        x: 2 * (Math.cos(th) * x! - Math.sin(th) * y!),
        y: 2 * (Math.sin(th) * x! + Math.cos(th) * y!),
      },
    }));
    const f = fitSimilarity(decimal(30), pts);
    expect(Number(f.scaleSquared.toString())).toBeCloseTo(4, 12);
    expect(Number(f.rotationSpread.toString())).toBeCloseTo(0.25, 12); // sin² 30°
    expect(Number(f.rotation.toString())).toBeCloseTo(30, 10);
    expect(f.variance).toBeDefined();
  });
});

describe('fitAffine', () => {
  it('recovers an exact affine transformation exactly in rational', () => {
    fc.assert(
      fc.property(small, small, small, small, small, small, (a1, a2, b1, b2, tx, ty) => {
        const pts = [
          [0, 0],
          [10, 0],
          [0, 10],
          [7, 3],
          [-4, 9],
        ];
        const points = pts.map(([x, y]) => ({
          from: { x: x!, y: y! },
          to: {
            x: R.add(R.div(R.from(a1 * x! + a2 * y!), R.from(5)), R.from(tx)),
            y: R.add(R.from(b1 * x! + b2 * y!), R.from(ty)),
          },
        }));
        const f = fitAffine(R, points);
        expect([f.a1, f.a2, f.b1, f.b2, f.tx, f.ty].map((v) => R.toString(v))).toEqual(
          [
            R.div(R.from(a1), R.from(5)),
            R.div(R.from(a2), R.from(5)),
            R.from(b1),
            R.from(b2),
            R.from(tx),
            R.from(ty),
          ].map((v) => R.toString(v)),
        );
        expect(R.isZero(f.sumSquares)).toBe(true);
      }),
      { numRuns: 30 },
    );
  });
  it('agrees with mathjs on noisy points (float)', () => {
    const pts = [
      [1000, 2000, 0.01, -0.02],
      [1500, 2100, -0.01, 0.0],
      [1200, 2600, 0.02, 0.01],
      [1800, 2500, 0, 0.015],
      [1100, 2300, -0.005, 0.01],
    ];
    const points = pts.map(([x, y, ex, ey]) => ({
      from: { x: x!, y: y! },
      to: { x: 1.001 * x! + 0.002 * y! + 300 + ex!, y: -0.003 * x! + 0.999 * y! - 40 + ey! },
    }));
    const f = fitAffine(float, points);
    const rows: number[][] = [];
    const l: number[] = [];
    for (const p of points) {
      rows.push([p.from.x, p.from.y, 1, 0, 0, 0]);
      l.push(p.to.x);
      rows.push([0, 0, 0, p.from.x, p.from.y, 1]);
      l.push(p.to.y);
    }
    const m = mathjsLs(rows, l);
    for (const [i, v] of [f.a1, f.a2, f.tx, f.b1, f.b2, f.ty].entries())
      expect(Math.abs(v - m[i]!)).toBeLessThan(1e-7 * Math.max(1, Math.abs(m[i]!)));
    expect(f.residuals).toHaveLength(5);
  });
});

describe('fitInclinedPlane', () => {
  it('agrees with mathjs on noisy heights (float) and its residuals sum to zero', () => {
    const pts = [
      [0, 0, 0.003],
      [100, 0, -0.002],
      [0, 100, 0.001],
      [100, 100, 0.0],
      [50, 20, -0.004],
    ];
    const points = pts.map(([x, y, e]) => ({
      from: { x: x!, y: y!, z: 10 },
      to: { x: x!, y: y!, z: 10 + 0.3 + 0.0001 * x! - 0.0002 * y! + e! },
    }));
    const f = fitInclinedPlane(float, points);
    const m = mathjsLs(
      points.map((p) => [1, p.from.x - 50, p.from.y - 44]),
      points.map((p) => p.to.z - p.from.z),
    );
    expect(Math.abs(f.c - m[0]!)).toBeLessThan(1e-12);
    expect(Math.abs(f.sx - m[1]!)).toBeLessThan(1e-12);
    expect(Math.abs(f.sy - m[2]!)).toBeLessThan(1e-12);
    expect(Math.abs(f.residuals.reduce((s, r) => s + r.vz, 0))).toBeLessThan(1e-12);
    expect(f.x0).toBe(50);
    expect(f.y0).toBe(44);
  });
});

describe('local fits refuse bad input with typed errors', () => {
  const code = (fn: () => unknown) => {
    try {
      fn();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      return `${(e as QuadspreadError).code} ${(e as QuadspreadError).where}`;
    }
    return 'no error';
  };
  it('too few points, coincident or collinear points, missing heights, not an array', () => {
    const p = (x: number, y: number) => ({ from: { x, y, z: 0 }, to: { x, y, z: 0 } });
    expect(code(() => fitSimilarity(float, [p(0, 0)]))).toBe(
      'TOO_FEW_POINTS fitSimilarity(points)',
    );
    expect(code(() => fitSimilarity(rational, [p(1, 1), p(1, 1)]))).toBe(
      'COLLINEAR_POINTS fitSimilarity(points)',
    );
    expect(code(() => fitAffine(rational, [p(0, 0), p(1, 1), p(2, 2), p(3, 3)]))).toBe(
      'COLLINEAR_POINTS fitAffine(points)',
    );
    expect(code(() => fitAffine(float, [p(0, 0), p(1, 1)]))).toBe(
      'TOO_FEW_POINTS fitAffine(points)',
    );
    expect(
      code(() =>
        fitInclinedPlane(float, [p(0, 0), p(1, 0), { from: { x: 0, y: 1 }, to: { x: 0, y: 1 } }]),
      ),
    ).toBe('INVALID_NUMBER fitInclinedPlane(points)[2].from.z');
    expect(code(() => fitSimilarity(float, 'abc' as never))).toBe(
      'INVALID_ARGUMENT fitSimilarity(points)',
    );
    expect(
      code(() => fitSimilarity(float, [p(0, 0), { from: { x: 'a', y: 0 }, to: { x: 0, y: 0 } }])),
    ).toBe('INVALID_NUMBER fitSimilarity(points)[1].from.x');
  });
});
