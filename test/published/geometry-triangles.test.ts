// Plane rational trigonometry against published triangle values (each source named beside its check).
import { solveTriangle } from '../../src/readings/triangle-readings.js';
import { describe, expect, it } from 'vitest';
import { rational, decimal, float } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import {
  point,
  triangle,
  quadrea,
  archimedesResidual,
  pythagorasResidual,
  crossLawResidual,
  solveStewart,
  solveStewartQuadrances,
  stewartResidual,
} from '../../src/geometry/index.js';

const kinds: Array<[string, Arithmetic<any>, number]> = [
  // [name, arithmetic, tolerance on toNumber of results]
  ['rational', rational, 0],
  ['decimal(30)', decimal(30), 1e-25],
  ['float', float, 1e-12],
];
const close = (A: Arithmetic<any>, v: unknown, want: number, tol: number) => {
  expect(Math.abs(A.toNumber(v) - want)).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(want)));
};

describe("Stewart's theorem: a = 7, b = 3, c = 5, BD = m = 3, DC = n = 4 gives d² = 43/7", () => {
  // M. Stewart, Some General Theorems of Considerable Use in the Higher Parts of Mathematics,
  // Edinburgh 1746, Prop. II: b²m + c²n = a(d² + mn); the numbers are a = 7, b = 3, c = 5, m = 3, n = 4 (derived: d² = 43/7)
  // (doc/derived): d² = (9·3 + 25·4)/7 − 12 = 43/7.
  it('solveStewart(rational, …) gives exactly 43/7 for the quadrance from A to D', () => {
    const [d2, ...rest] = solveStewart(rational, { QB: 25, QC: 9, tB: 0, tD: 3, tC: 7 });
    expect(rest).toEqual([]);
    expect(d2!.toString()).toBe('43/7');
  });
  it('the quadrance-only form gives 43/7 (and the mirror point of D across B)', () => {
    expect(
      solveStewartQuadrances(rational, { QB: 25, QC: 9, QBD: 9, QBC: 49 }).map((r) => r.toString()),
    ).toContain('43/7');
  });
  it.each(kinds)('the residual of b²m + c²n = a(d² + mn) is zero in %s', (_n, A, tol) => {
    close(A, stewartResidual(A, { QB: 25, QC: 9, QD: '43/7', tB: 0, tD: 3, tC: 7 }), 0, tol * 100);
  });
});

describe('Heron: the 13-14-15 triangle has area 84, quadrea 16·84² = 112896', () => {
  // Heron's formula, s = 21: area = √(21·8·7·6) = 84; spreads by the cross law 16/25 (opposite 13),
  // 3136/4225 (opposite 14), 144/169 (opposite 15). Derived exactly by Heron's formula and the cross law.
  it.each(kinds)(
    'quadrea(%s, 169, 196, 225) = 112896 and Archimedes residual with area 84 is 0',
    (_n, A, tol) => {
      close(A, quadrea(A, 169, 196, 225), 112896, tol);
      close(A, archimedesResidual(A, 169, 196, 225, 84), 0, tol * 1e5);
    },
  );
  it.each(kinds)(
    'triangle(%s, …) on A1 = (5, 12), A2 = (0, 0), A3 = (14, 0) has the published spreads',
    (_n, A, tol) => {
      // A1A2 = 13, A1A3 = 15, A2A3 = 14: Q1 = 196, Q2 = 225, Q3 = 169.
      const t = triangle(A, point(A, 5, 12), point(A, 0, 0), point(A, 14, 0));
      close(A, t.Q1, 196, tol);
      close(A, t.Q2, 225, tol);
      close(A, t.Q3, 169, tol);
      close(A, t.s3, 16 / 25, tol); // opposite 13
      close(A, t.s1, 3136 / 4225, tol); // opposite 14
      close(A, t.s2, 144 / 169, tol); // opposite 15
      close(A, t.quadrea, 112896, tol);
    },
  );
  it('in rational the spreads and quadrea are exactly 16/25, 3136/4225, 144/169 and 112896', () => {
    const t = triangle(
      rational,
      point(rational, 5, 12),
      point(rational, 0, 0),
      point(rational, 14, 0),
    );
    expect([t.s3, t.s1, t.s2, t.quadrea].map((v) => rational.toString(v))).toEqual([
      '16/25',
      '3136/4225',
      '144/169',
      '112896',
    ]);
    const [u] = solveTriangle(rational, { Q1: 169, Q2: 196, Q3: 225 });
    expect([u!.s1, u!.s2, u!.s3].map((v) => v.toString())).toEqual([
      '16/25',
      '3136/4225',
      '144/169',
    ]);
  });
});

describe('the 3-4-5 right triangle: spread 1 at the right angle and Q1 + Q2 = Q3', () => {
  // Derived from Pythagoras: legs 3 and 4, hypotenuse 5.
  it.each(kinds)('in %s', (_n, A, tol) => {
    const t = triangle(A, point(A, 0, 0), point(A, 3, 0), point(A, 0, 4));
    close(A, t.s1, 1, tol);
    close(A, pythagorasResidual(A, 9, 16, 25), 0, tol);
    close(A, crossLawResidual(A, 9, 16, 25, 1), 0, tol);
    close(A, t.s2, 16 / 25, tol); // at (3, 0), opposite the leg 4
    close(A, t.s3, 9 / 25, tol); // at (0, 4), opposite the leg 3
  });
  it('solveTriangle(rational, { Q1: 25, s2: 9/25, s3: 16/25 }) includes the 3-4-5 triangle exactly', () => {
    const sols = solveTriangle(rational, { Q1: 25, s2: '9/25', s3: '16/25' });
    expect(sols.some((t) => t.Q2.eq(9) && t.Q3.eq(16) && t.s1.eq(1))).toBe(true);
  });
});
