// triangle(A, A1, A2, A3) and solveTriangle(A, known): exact round trips in rational,
// classical trigonometry (Math.*) as the independent check in float, and bad input.
import { describe, expect, it } from 'vitest';
import { code } from './helpers.js';
import fc from 'fast-check';
import { rational, decimal, float, solveTriangle } from '../../src/index.js';
import type { Arithmetic, Rational } from '../../src/index.js';
import { point, triangle } from '../../src/geometry/index.js';
import type { Surd, Triangle } from '../../src/geometry/index.js';

const MEASURES = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3'] as const;
type Key = (typeof MEASURES)[number];
/** Every choice of three measures that includes a quadrance (19 of the 20). */
const CHOICES: Key[][] = [];
for (let i = 0; i < 6; i++)
  for (let j = i + 1; j < 6; j++)
    for (let k = j + 1; k < 6; k++) {
      const c = [MEASURES[i]!, MEASURES[j]!, MEASURES[k]!];
      if (c.some((m) => m[0] === 'Q')) CHOICES.push(c);
    }

describe.each<[string, Arithmetic<any>]>([
  ['rational', rational],
  ['decimal(30)', decimal(30)],
  ['float', float],
])('triangle(%s, …) of the 3-4-5 right triangle', (_n, A) => {
  it('has spread 1 at the right angle, 9/25 opposite the side 3 and 16/25 opposite the side 4', () => {
    // A1 = (0, 0) right angle; A2 = (4, 0); A3 = (0, 3): Q1 = 25, Q2 = 9, Q3 = 16 (derived from Pythagoras: 3² + 4² = 5²).
    const t = triangle(A, point(A, 0, 0), point(A, 4, 0), point(A, 0, 3));
    expect(MEASURES.map((k) => A.toNumber(t[k]))).toEqual([25, 9, 16, 1, 0.36, 0.64]);
    expect(A.toNumber(t.quadrea)).toBe(16 * 6 * 6);
  });
});

describe('triangle(A, A1, A2, A3) refuses what is no proper triangle', () => {
  const A = rational;
  it('two coincident vertices throw COINCIDENT_POINTS', () => {
    expect(code(() => triangle(A, point(A, 1, 1), point(A, 1, 1), point(A, 0, 3)))).toBe(
      'COINCIDENT_POINTS',
    );
    expect(code(() => triangle(A, point(A, 1, 1), point(A, 2, 1), point(A, 2, 1)))).toBe(
      'COINCIDENT_POINTS',
    );
  });
  it('three collinear vertices throw COLLINEAR_POINTS', () => {
    expect(code(() => triangle(A, point(A, 0, 0), point(A, 1, 2), point(A, '5/2', 5)))).toBe(
      'COLLINEAR_POINTS',
    );
    expect(code(() => triangle(float, { x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }))).toBe(
      'COLLINEAR_POINTS',
    );
  });
});

describe('solveTriangle(rational, …) in exact form', () => {
  it('{ Q1: 25, Q2: 16, s3: 1/2 } gives the two triangles with Q3 = 41 ± 20√2', () => {
    // Cross law: Q3 = 25 + 16 ± 2√(25·16·(1/2)) = 41 ± 2√200 = 41 ± 20√2 (derived by hand).
    const sols = solveTriangle(rational, { Q1: 25, Q2: 16, s3: '1/2' });
    expect(sols.map((t) => t.Q3.toString())).toEqual(['41 - 20√2', '41 + 20√2']);
    expect(sols.map((t) => t.quadrea.toString())).toEqual(['800', '800']); // 4·25·16·(1/2)
    // Classical check: c² = a² + b² − 2ab·cos θ with a = 5, b = 4, θ = 45° and 135°.
    const c2 = [45, 135].map((d) => 41 - 40 * Math.cos((d * Math.PI) / 180)).sort((x, y) => x - y);
    sols.forEach((t, i) => expect(t.Q3.toNumber()).toBeCloseTo(c2[i]!, 12));
  });
  it('three quadrances 169, 196, 225 give one triangle with spreads 16/25, 3136/4225, 144/169', () => {
    const [t, ...rest] = solveTriangle(rational, { Q1: 169, Q2: 196, Q3: 225 });
    expect(rest).toEqual([]);
    expect([t!.s1, t!.s2, t!.s3, t!.quadrea].map((v) => v.toString())).toEqual([
      '16/25',
      '3136/4225',
      '144/169',
      '112896',
    ]);
  });

  it('the ambiguous case has one triangle when the sides are equal or the given spread is 1', () => {
    // Isosceles Q1 = Q2 = 25 with s1 = 9/25: base = 2·5·cos A1 = 2·5·(4/5) = 8, so Q3 = 64 (by hand);
    // the supplement would need two obtuse angles.
    expect(
      solveTriangle(rational, { Q1: 25, Q2: 25, s1: '9/25' }).map((t) => t.Q3.toString()),
    ).toEqual(['64']);
    // A right angle at A1 (s1 = 1) opposite Q1 = 25 with Q2 = 9: Q3 = 25 − 9 = 16 (Pythagoras).
    expect(solveTriangle(rational, { Q1: 25, Q2: 9, s1: 1 }).map((t) => t.Q3.toString())).toEqual([
      '16',
    ]);
    // Q1 = Q2·s1 exactly (the tangent case): one triangle, right-angled at A2.
    const [t, ...rest] = solveTriangle(rational, { Q1: 16, Q2: 25, s1: '16/25' });
    expect(rest).toEqual([]);
    expect([t!.s2.toString(), t!.Q3.toString()]).toEqual(['1', '9']);
  });

  const coord = fc.integer({ min: -60, max: 60 });
  const tri = fc
    .tuple(coord, coord, coord, coord, coord, coord)
    .filter(([a, b, c, d, e, f]) => (c - a) * (f - b) - (d - b) * (e - a) !== 0)
    .map(([a, b, c, d, e, f]) =>
      triangle(rational, point(rational, a, b), point(rational, c, d), point(rational, e, f)),
    );
  const same = (s: Triangle<Surd<Rational>>, t: Triangle<Rational>) =>
    [...MEASURES, 'quadrea' as const].every((k) => s[k].eq(t[k]));

  it.each(CHOICES.map((c) => [c.join(', '), c] as const))(
    'for random triangles, solving from %s recovers the original exactly',
    (_name, choice) => {
      fc.assert(
        fc.property(tri, (t) => {
          const known = Object.fromEntries(choice.map((k) => [k, t[k]]));
          const sols = solveTriangle(rational, known);
          expect(sols.length).toBeGreaterThanOrEqual(1);
          expect(sols.length).toBeLessThanOrEqual(2);
          expect(sols.some((s) => same(s, t))).toBe(true);
          for (const s of sols) {
            // each solution satisfies the cross law at A3 and the spread law, exactly (surd arithmetic)
            const r = s.Q1.add(s.Q2).sub(s.Q3);
            expect(
              r
                .mul(r)
                .sub(s.Q1.mul(s.Q2).mul(4).mul(s.s3.neg().add(1)))
                .isZero(),
            ).toBe(true);
            expect(s.s1.mul(s.Q2).sub(s.s2.mul(s.Q1)).isZero()).toBe(true);
            for (const k of MEASURES) expect(s[k].sign()).toBe(1);
            for (const k of ['s1', 's2', 's3'] as const) expect(s[k].cmp(1)).toBeLessThanOrEqual(0);
          }
        }),
        { numRuns: 25 },
      );
    },
  );
});

describe('solveTriangle(float, …) agrees with classical trigonometry (Math.sin, Math.cos)', () => {
  const deg = (d: number) => (d * Math.PI) / 180;
  const rel = (x: number, y: number) => Math.abs(x - y) / Math.max(1, Math.abs(y));
  it('two sides and the spread between them: Q3 = a² + b² − 2ab·cos θ for θ and 180° − θ', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 89, noNaN: true }),
        (a, b, t) => {
          const sols = solveTriangle(float, { Q1: a * a, Q2: b * b, s3: Math.sin(deg(t)) ** 2 });
          const want = [t, 180 - t]
            .map((x) => a * a + b * b - 2 * a * b * Math.cos(deg(x)))
            .sort((x, y) => x - y);
          expect(sols.length).toBe(2);
          sols.forEach((s, i) => expect(rel(s.Q3, want[i]!)).toBeLessThan(1e-9));
        },
      ),
    );
  });
  it('one side and two spreads: the law of sines for the angle pairs (θ1, θ2) and (θ1, 180° − θ2)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 89, noNaN: true }),
        fc.double({ min: 1, max: 89, noNaN: true }),
        (a, t1, t2) => {
          fc.pre(Math.abs(t1 - t2) > 0.01);
          const sols = solveTriangle(float, {
            Q1: a * a,
            s1: Math.sin(deg(t1)) ** 2,
            s2: Math.sin(deg(t2)) ** 2,
          });
          // A triangle has angles (θ1, θ2, 180 − θ1 − θ2), or with one of them replaced by its supplement.
          const want: number[] = [];
          for (const [x, y] of [
            [t1, t2],
            [t1, 180 - t2],
            [180 - t1, t2],
          ]) {
            const z = 180 - x! - y!;
            if (z > 0) want.push((a * a * Math.sin(deg(z)) ** 2) / Math.sin(deg(x!)) ** 2);
          }
          want.sort((x, y) => x - y);
          expect(sols.length).toBe(want.length);
          const got = sols.map((s) => s.Q3).sort((x, y) => x - y);
          got.forEach((q, i) => expect(rel(q, want[i]!)).toBeLessThan(1e-9));
        },
      ),
    );
  });
  it('the ambiguous case (two sides, a spread opposite one): the same triangles as the law of sines', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 89, noNaN: true }),
        (a, b, t) => {
          const want: number[] = [];
          let nearEdge = Math.abs(a - b) < 1e-6 * a;
          for (const A1 of [t, 180 - t]) {
            const x = (b * Math.sin(deg(A1))) / a; // sin A2
            if (Math.abs(x - 1) < 1e-7) nearEdge = true;
            if (x > 1) continue;
            for (const A2 of [
              Math.asin(x) * (180 / Math.PI),
              180 - Math.asin(x) * (180 / Math.PI),
            ]) {
              const A3 = 180 - A1 - A2;
              if (Math.abs(A3) < 1e-7) nearEdge = true;
              if (A3 > 0) want.push(((a * Math.sin(deg(A3))) / Math.sin(deg(A1))) ** 2);
            }
          }
          fc.pre(!nearEdge);
          const uniq = want
            .sort((x, y) => x - y)
            .filter((v, i, w) => i === 0 || rel(v, w[i - 1]!) > 1e-9);
          const sols = solveTriangle(float, { Q1: a * a, Q2: b * b, s1: Math.sin(deg(t)) ** 2 });
          expect(sols.length).toBe(uniq.length);
          sols.forEach((s, i) => expect(rel(s.Q3, uniq[i]!)).toBeLessThan(1e-8));
        },
      ),
    );
  });
  it('thin triangles keep their relative precision: Q1 = Q2 = 1, s3 = 1e-12 gives Q3 = 4·sin²(θ/2)', () => {
    // θ = asin(1e-6); the small root is taken as product/(large root), free of cancellation.
    const theta = Math.asin(1e-6);
    const sols = solveTriangle(float, { Q1: 1, Q2: 1, s3: 1e-12 });
    expect(sols.length).toBe(2);
    expect(rel(sols[0]!.Q3 / (4 * Math.sin(theta / 2) ** 2), 1)).toBeLessThan(1e-9);
    expect(rel(sols[1]!.Q3, 4 * Math.cos(theta / 2) ** 2)).toBeLessThan(1e-12);
    // one side and two spreads: s1 = s2 nearly, so the small third spread is sin²(θ1 − θ2)
    const [t1, t2] = [deg(30), deg(30) + 1e-7];
    const [small] = solveTriangle(float, { Q1: 1, s1: Math.sin(t1) ** 2, s2: Math.sin(t2) ** 2 });
    expect(rel(small!.s3 / Math.sin(t2 - t1) ** 2, 1)).toBeLessThan(1e-6);
  });
  it('three quadrances: spreads equal sin² of the angles from the law of cosines', () => {
    const sols = solveTriangle(float, { Q1: 49, Q2: 64, Q3: 81 });
    const angle = (a: number, b: number, c: number) =>
      Math.acos((b * b + c * c - a * a) / (2 * b * c));
    expect(sols.length).toBe(1);
    expect(sols[0]!.s1).toBeCloseTo(Math.sin(angle(7, 8, 9)) ** 2, 14);
    expect(sols[0]!.s3).toBeCloseTo(Math.sin(angle(9, 7, 8)) ** 2, 14);
  });
});

describe('solveTriangle in float and decimal recovers triangles within a rounding bound', () => {
  const c = fc.double({ min: -1000, max: 1000, noNaN: true });
  const ftri = fc
    .tuple(c, c, c, c, c, c)
    .map(
      ([a, b, d, e, f, g]) =>
        [
          { x: a, y: b },
          { x: d, y: e },
          { x: f, y: g },
        ] as const,
    )
    .filter(([P, Q, R]) => {
      const D = (Q.x - P.x) * (R.y - P.y) - (Q.y - P.y) * (R.x - P.x);
      const q = [
        (Q.x - P.x) ** 2 + (Q.y - P.y) ** 2,
        (R.x - Q.x) ** 2 + (R.y - Q.y) ** 2,
        (R.x - P.x) ** 2 + (R.y - P.y) ** 2,
      ];
      if (Math.min(...q) < 1e-2 * Math.max(...q)) return false;
      // keep the quadrea (~Q²) out of the subnormal range below 2.2e-308, where a double keeps
      // fewer than 16 digits: fast-check draws coordinates as small as 1e-81
      if (Math.min(...q) < 1e-100) return false;
      // keep spreads in [0.01, 0.99]: away from the tangent cases where rounding may drop a double root
      const s = [(D * D) / (q[0]! * q[2]!), (D * D) / (q[0]! * q[1]!), (D * D) / (q[1]! * q[2]!)];
      return s.every((x) => x > 0.01 && x < 0.99);
    });
  // Bound: the solvers use a few dozen operations and one square root of a discriminant that
  // stays away from zero here (spreads ≤ 0.99), so a relative error of 1e-9 leaves a wide margin.
  it.each(CHOICES.map((ch) => [ch.join(', '), ch] as const))(
    'float: from %s a solution matches the original to 1e-9 relative',
    (_name, choice) => {
      fc.assert(
        fc.property(ftri, ([P, Q, R]) => {
          const t = triangle(float, P, Q, R);
          const sols = solveTriangle(float, Object.fromEntries(choice.map((k) => [k, t[k]])));
          const near = (s: Triangle<number>) =>
            [...MEASURES, 'quadrea' as const].every(
              (k) => Math.abs(s[k] - t[k]) <= 1e-9 * Math.max(Math.abs(t[k]), k[0] === 's' ? 1 : 0),
            );
          expect(sols.some(near)).toBe(true);
        }),
        { numRuns: 30 },
      );
    },
  );
  it('decimal(30): { Q1: 25, Q2: 16, s3: 1/2 } gives Q3 = 41 ± 20√2 to 28 digits', () => {
    const D = decimal(30);
    const sols = solveTriangle(D, { Q1: 25, Q2: 16, s3: '1/2' });
    // 41 ∓ 20√2 = 12.71572875253809902396622551580… and 69.28427124746190097603377448419… (mathjs BigNumber, 50 digits)
    expect(sols.map((t) => D.toPrecision(t.Q3, 28))).toEqual([
      '12.71572875253809902396622552',
      '69.28427124746190097603377448',
    ]);
  });
});

describe('solveTriangle on data no proper triangle has returns an empty list', () => {
  const A = rational;
  it.each<[string, Record<string, number | string>]>([
    ['quadrances breaking the triangle inequality (1, 1, 9)', { Q1: 1, Q2: 1, Q3: 9 }],
    ['collinear quadrances (1, 4, 9)', { Q1: 1, Q2: 4, Q3: 9 }],
    [
      'a spread opposite a side too short to reach (Q1 = 1, Q2 = 16, s1 = 1/2)',
      { Q1: 1, Q2: 16, s1: '1/2' },
    ],
    ['two right angles (s1 = s2 = 1)', { Q1: 4, s1: 1, s2: 1 }],
    ['a zero quadrance', { Q1: 0, Q2: 1, s3: '1/2' }],
    ['a zero spread', { Q1: 1, Q2: 1, s3: 0 }],
  ])('%s', (_n, known) => {
    expect(solveTriangle(A, known)).toEqual([]);
    expect(solveTriangle(float, known)).toEqual([]);
  });
});

describe('solveTriangle refuses bad input with typed errors', () => {
  const A = rational;
  it('three spreads throw NEEDS_A_QUADRANCE', () => {
    expect(code(() => solveTriangle(A, { s1: '9/25', s2: '16/25', s3: 1 }))).toBe(
      'NEEDS_A_QUADRANCE',
    );
  });
  it('two or four measures, or an unknown key, throw INVALID_ARGUMENT', () => {
    expect(code(() => solveTriangle(A, { Q1: 1, Q2: 1 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => solveTriangle(A, { Q1: 1, Q2: 1, Q3: 1, s1: '3/4' }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => solveTriangle(A, { Q1: 1, Q2: 1, q3: 1 } as never))).toBe('INVALID_ARGUMENT');
    expect(code(() => solveTriangle(A, null as never))).toBe('INVALID_ARGUMENT');
  });
  it('a negative quadrance throws NEGATIVE_QUADRANCE and a spread outside [0, 1] SPREAD_OUT_OF_RANGE', () => {
    expect(code(() => solveTriangle(A, { Q1: -1, Q2: 1, Q3: 1 }))).toBe('NEGATIVE_QUADRANCE');
    expect(code(() => solveTriangle(A, { Q1: 1, Q2: 1, s3: '3/2' }))).toBe('SPREAD_OUT_OF_RANGE');
    expect(code(() => solveTriangle(float, { Q1: 1, s1: -0.1, s2: 0.5 }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
  });
  it('NaN, Infinity and text that is not a number throw INVALID_NUMBER; overlong text INPUT_TOO_LONG', () => {
    expect(code(() => solveTriangle(float, { Q1: NaN, Q2: 1, Q3: 1 }))).toBe('INVALID_NUMBER');
    expect(code(() => solveTriangle(A, { Q1: Infinity, Q2: 1, Q3: 1 }))).toBe('INVALID_NUMBER');
    expect(code(() => solveTriangle(A, { Q1: 'five', Q2: 1, Q3: 1 }))).toBe('INVALID_NUMBER');
    expect(code(() => solveTriangle(A, { Q1: '9'.repeat(2000), Q2: 1, Q3: 1 }))).toBe(
      'INPUT_TOO_LONG',
    );
  });
});
