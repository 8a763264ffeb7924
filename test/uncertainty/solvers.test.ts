// The uncertain arithmetic runs the library's solvers unchanged: their gradients match
// central finite differences of the same solvers in float (an independent way to get a
// derivative), and over rational they are exact rationals equal to the float ones.
import { solveTriangle } from '../../src/readings/triangle-readings.js';
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { rational, float, uncertain, Uncertain } from '../../src/arithmetic/index.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { triangle, spread, quadrance } from '../../src/geometry/index.js';
import { intersectLines } from '../../src/cogo/intersect-lines.js';
import { area } from '../../src/cogo/area.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';

const F = uncertain(float);
const R = uncertain(rational);

function grad<T>(y: Uncertain<T>, name: string): T | undefined {
  for (const [k, v] of y.gradient) if (k.name === name) return v;
  return undefined;
}

/** Checks ∂f/∂xᵢ from uncertain(float) against central differences of f in float. */
function checkAgainstDifferences(
  fU: (A: Arithmetic<Uncertain<number>>, xs: Uncertain<number>[]) => Uncertain<number>,
  fF: (A: Arithmetic<number>, xs: number[]) => number,
  xs: number[],
  tol = 1e-6,
): void {
  const y = fU(
    F,
    xs.map((x, i) => measured(F, x, 1, `x${i}`)),
  );
  expect(Math.abs(y.value - fF(float, xs))).toBeLessThanOrEqual(
    1e-12 * Math.max(1, Math.abs(y.value)),
  );
  xs.forEach((x, i) => {
    const h = 1e-5 * Math.max(1, Math.abs(x));
    const up = xs.slice();
    const dn = xs.slice();
    up[i] = x + h;
    dn[i] = x - h;
    const fd = (fF(float, up) - fF(float, dn)) / (2 * h); // central difference, error O(h²)
    const g = grad(y, `x${i}`) ?? 0;
    expect(Math.abs(g - fd)).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(fd)));
  });
}

const coord = fc.integer({ min: -1000, max: 1000 }).map((n) => n / 10);

describe('solvers run in uncertain(base) without change', () => {
  it('uncertain arithmetics offer no fused kernels, so solvers take the generic path that carries gradients', () => {
    for (const U of [F, R]) expect((U as { kernels?: unknown }).kernels).toBeUndefined();
    const P = [
      { x: measured(R, 0, 1, 'a'), y: R.from(0) },
      { x: R.from(4), y: R.from(0) },
      { x: R.from(0), y: R.from(3) },
    ] as const;
    const t = triangle(R, P[0], P[1], P[2]);
    const plain = triangle(
      rational,
      { x: rational.from(0), y: rational.from(0) },
      { x: rational.from(4), y: rational.from(0) },
      { x: rational.from(0), y: rational.from(3) },
    );
    expect(rational.eq(t.quadrea.value, plain.quadrea)).toBe(true);
    expect(t.quadrea.inputs.length).toBe(1);
  });

  it('spread(U, V, P, Q) of measured coordinates has the gradient of its central differences', () => {
    fc.assert(
      fc.property(fc.array(coord, { minLength: 6, maxLength: 6 }), (c) => {
        const ok = (A: Arithmetic<number>) =>
          Math.abs(A.toNumber(quadrance(A, { x: c[0]!, y: c[1]! }, { x: c[2]!, y: c[3]! }))) > 1 &&
          Math.abs(A.toNumber(quadrance(A, { x: c[0]!, y: c[1]! }, { x: c[4]!, y: c[5]! }))) > 1;
        fc.pre(ok(float));
        checkAgainstDifferences(
          (A, x) =>
            spread(A, { x: x[0]!, y: x[1]! }, { x: x[2]!, y: x[3]! }, { x: x[4]!, y: x[5]! }),
          (A, x) =>
            spread(A, { x: x[0]!, y: x[1]! }, { x: x[2]!, y: x[3]! }, { x: x[4]!, y: x[5]! }),
          c,
        );
      }),
      { numRuns: 100 },
    );
  });

  it('triangle(U, A1, A2, A3) quadrea and spreads over rational have exact gradients equal to the float ones', () => {
    const pts = [
      [0, 0],
      [40, 3],
      [12, 25],
    ] as const;
    const mk = <T>(U: Arithmetic<Uncertain<T>>, m: (v: number, name: string) => Uncertain<T>) =>
      pts.map(([x, y], i) => ({ x: m(x, `x${i}`), y: m(y, `y${i}`) }));
    const tr = triangle(
      R,
      ...(mk(R, (v, n) => measured(R, v, '0.01', n)) as [never, never, never]),
    );
    const tf = triangle(F, ...(mk(F, (v, n) => measured(F, v, 0.01, n)) as [never, never, never]));
    for (const key of ['s1', 's2', 's3', 'quadrea', 'Q1'] as const) {
      const gr = (tr as unknown as Record<string, Uncertain<ReturnType<typeof rational.from>>>)[
        key
      ]!;
      const gf = (tf as unknown as Record<string, Uncertain<number>>)[key]!;
      for (const name of ['x0', 'y0', 'x1', 'y1', 'x2', 'y2']) {
        const a = rational.toNumber(grad(gr, name) ?? rational.zero);
        const b = grad(gf, name) ?? 0;
        expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(a)));
      }
    }
    // contributions of an exact budget add up exactly
    const B = budget(R, (tr as unknown as { s1: Uncertain<ReturnType<typeof rational.from>> }).s1);
    const sum = B.contributions.reduce((s, c) => rational.add(s, c.contribution), rational.zero);
    expect(rational.eq(sum, B.variance)).toBe(true);
  });

  it('solveTriangle(U, { Q1, Q2, s3 }) over uncertain(float) has the gradient of its central differences (both roots)', () => {
    for (const k of [0, 1]) {
      checkAgainstDifferences(
        (A, x) =>
          (solveTriangle(A, { Q1: x[0]!, Q2: x[1]!, s3: x[2]! }) as { Q3: Uncertain<number> }[])[k]!
            .Q3,
        (A, x) =>
          (solveTriangle(A, { Q1: x[0]!, Q2: x[1]!, s3: x[2]! }) as { Q3: number }[])[k]!.Q3,
        [25, 64, 0.36],
      );
    }
  });

  it('intersectLines(U, …) and area(U, …) have the gradients of their central differences', () => {
    checkAgainstDifferences(
      (A, x) =>
        intersectLines(
          A,
          { x: x[0]!, y: x[1]! },
          { x: x[2]!, y: x[3]! },
          { x: x[4]!, y: x[5]! },
          { x: x[6]!, y: x[7]! },
        ).x,
      (A, x) =>
        intersectLines(
          A,
          { x: x[0]!, y: x[1]! },
          { x: x[2]!, y: x[3]! },
          { x: x[4]!, y: x[5]! },
          { x: x[6]!, y: x[7]! },
        ).x,
      [0, 0, 100, 10, 20, -30, 60, 80],
    );
    checkAgainstDifferences(
      (A, x) =>
        area(A, [
          { x: x[0]!, y: x[1]! },
          { x: x[2]!, y: x[3]! },
          { x: x[4]!, y: x[5]! },
          { x: x[6]!, y: x[7]! },
        ]),
      (A, x) =>
        area(A, [
          { x: x[0]!, y: x[1]! },
          { x: x[2]!, y: x[3]! },
          { x: x[4]!, y: x[5]! },
          { x: x[6]!, y: x[7]! },
        ]),
      [0, 0, 100, 10, 90, 70, -10, 60],
    );
  });
});

describe('budget of exact solver results over uncertain(rational)', () => {
  it('budget takes a rational surd from solveTriangle(U, { Q1, Q2, s3 }) and refuses an irrational one', () => {
    // Q3 = Q1 + Q2 ± 2√(Q1·Q2·(1 − s3)) (DESIGN; cross law): with Q1 = 25, Q2 = 64, s3 = 16/25 the root is 24, so Q3 = 41 or 137.
    // ∂Q3/∂Q1 = 1 ± Q2(1 − s3)/√(Q1Q2(1 − s3)) = 1 ± (64·9/25)/24 = 1 ± 24/25 (derived).
    const t = solveTriangle(R, { Q1: measured(R, 25, 1, 'Q1'), Q2: 64, s3: '16/25' });
    const lines = t.map((x) =>
      budget(R, x.Q3).contributions.map((c) => rational.toString(c.sensitivity)),
    );
    expect(t.map((x) => x.Q3.toString())).toEqual(['41', '137']);
    expect(lines).toEqual([['1/25'], ['49/25']]);
    const irr = solveTriangle(R, { Q1: measured(R, 2, 1, 'Q1'), Q2: 3, s3: '1/2' });
    expect(() => budget(R, irr[0]!.Q3)).toThrow(
      expect.objectContaining({ code: 'UNSUPPORTED_OPERATION' }),
    );
  });
});
