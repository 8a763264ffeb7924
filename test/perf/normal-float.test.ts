// The float twins of the normal-equation kernels (src/adjustment/normal-float.ts) against the
// generic code run on a copy of `float` without its `float64` mark: the same numbers bit for
// bit (toStrictEqual tells -0 from 0) and the same errors, on random sparse systems (with
// values large enough to overflow) and on whole network and levelling adjustments.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { float } from '../../src/arithmetic/float.js';
import { QuadspreadError } from '../../src/errors.js';
import { observationStatisticsFloat } from '../../src/adjustment/normal-float.js';
import {
  solveGroups,
  observationStatistics,
  type ObservationGroup,
} from '../../src/adjustment/least-squares.js';
import { adjustNetwork, adjustLevelling } from '../../src/index.js';

const generic = { ...float, float64: undefined } as unknown as typeof float;

const outcome = (f: () => unknown): unknown => {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    return e.code;
  }
};

/** Everything solveGroups gives, as plain data: dx, the factor and the selected inverse. */
function solved(A: typeof float, n: number, groups: ObservationGroup<number>[]): unknown {
  return outcome(() => {
    const s = solveGroups(A, n, groups, 1e-12);
    if ('singular' in s) return s;
    const pairs: (number | undefined)[] = [];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) pairs.push(s.inverse.get(i, j));
    return {
      dx: s.dx,
      perm: [...s.factor.perm],
      Li: [...s.factor.Li],
      Lx: s.factor.Lx,
      D: s.factor.D,
      diagonal: s.inverse.diagonal,
      pairs,
      // residuals, cofactors, redundancy numbers and vᵀPv (observationStatistics's twin)
      statistics: outcome(() =>
        observationStatistics(A, groups, s.dx, (i, j) => s.inverse.get(i, j) ?? 0),
      ),
    };
  });
}

const value = fc.oneof(
  fc.double({ min: -10, max: 10, noNaN: true }),
  fc.integer({ min: -3, max: 3 }),
  fc.constantFrom(0, -0, 1e-300, 1e-160, 1e-100, 1e100, 1e150, 1e154, -1e200, 1e300),
);

/** A group over 1–4 distinct unknowns of n: one observation, or two correlated ones. */
const groupOf = (n: number): fc.Arbitrary<ObservationGroup<number>> =>
  fc
    .tuple(
      fc.uniqueArray(fc.nat(n - 1), { minLength: 1, maxLength: Math.min(4, n) }),
      fc.boolean(),
      fc.array(value, { minLength: 8, maxLength: 8 }),
      fc.array(value, { minLength: 2, maxLength: 2 }),
      fc.double({ min: 0.01, max: 100, noNaN: true }),
      fc.double({ min: -0.9, max: 0.9, noNaN: true }),
    )
    .map(([index, pair, c, l, p, rho]) => {
      const k = index.length;
      if (!pair)
        return { index, rows: [c.slice(0, k)], cofactor: [[1 / p]], weight: [[p]], l: [l[0]!] };
      // A 2 × 2 weight matrix: the inverse of [[1, ρ], [ρ, 1]] times p (symmetric, positive).
      const det = 1 - rho * rho;
      return {
        index,
        rows: [c.slice(0, k), c.slice(4, 4 + k)],
        cofactor: [
          [1 / p, rho / p],
          [rho / p, 1 / p],
        ],
        weight: [
          [p / det, (-rho * p) / det],
          [(-rho * p) / det, p / det],
        ],
        l,
      };
    });

describe('normal-equation twins (float)', () => {
  it('solve random sparse systems exactly as the generic code, errors included', () => {
    const seen = new Map<string, number>();
    fc.assert(
      fc.property(
        fc
          .integer({ min: 1, max: 12 })
          .chain((n) =>
            fc.tuple(fc.constant(n), fc.array(groupOf(n), { minLength: 1, maxLength: 30 })),
          ),
        ([n, groups]) => {
          const a = solved(float, n, groups);
          expect(a).toStrictEqual(solved(generic, n, groups));
          const kind =
            typeof a === 'string'
              ? 'error'
              : a && 'singular' in (a as object)
                ? 'singular'
                : 'solved';
          seen.set(kind, (seen.get(kind) ?? 0) + 1);
          if (kind === 'solved' && typeof (a as { statistics: unknown }).statistics === 'string')
            seen.set('statistics not finite', (seen.get('statistics not finite') ?? 0) + 1);
        },
      ),
      { numRuns: 1500 },
    );
    // The corpus reached every outcome: solutions, singular pivots and values not finite,
    // in the factor and in the statistics after a finite solution.
    expect(seen.get('solved')).toBeGreaterThan(50);
    expect(seen.get('statistics not finite')).toBeGreaterThan(5);
    expect(seen.get('singular')).toBeGreaterThan(50);
    expect(seen.get('error')).toBeGreaterThan(20);
  });

  it('leave a factor that overflows to the generic code, which reports it', () => {
    // N = [[1e-320, 1e-6], [1e-6, 1e308 + 1e300]]: every sum is finite, but the multiplier
    // L[1][0] = 1e-6 / 1e-320 overflows.
    const groups: ObservationGroup<number>[] = [
      { index: [0, 1], rows: [[1e-160, 1e154]], cofactor: [[1]], weight: [[1]], l: [1] },
      { index: [1], rows: [[1e150]], cofactor: [[1]], weight: [[1]], l: [0] },
    ];
    expect(solved(generic, 2, groups)).toBe('NOT_FINITE');
    expect(solved(float, 2, groups)).toBe('NOT_FINITE');
  });

  it('leave statistics whose cofactors overflow to the generic code, which reports it', () => {
    // v = 1e200·1e-200 − 0 = 1 and vᵀPv = 1 are finite; A·Q·Aᵀ = 1e200·1e200·1e200 is not.
    const groups: ObservationGroup<number>[] = [
      { index: [0], rows: [[1e200]], cofactor: [[1]], weight: [[1]], l: [0] },
    ];
    const stats = (A: typeof float) =>
      outcome(() => observationStatistics(A, groups, [1e-200], () => 1e200));
    expect(stats(generic)).toBe('NOT_FINITE');
    expect(stats(float)).toBe('NOT_FINITE');
    // a redundancy number that overflows alone: Q_ll = 1e200, P = 1e200, A·Q·Aᵀ = 1
    const red: ObservationGroup<number>[] = [
      { index: [0], rows: [[1]], cofactor: [[1e200]], weight: [[1e200]], l: [0] },
    ];
    const redundancy = (A: typeof float) =>
      outcome(() => observationStatistics(A, red, [0], () => 1));
    expect(redundancy(generic)).toBe('NOT_FINITE');
    expect(redundancy(float)).toBe('NOT_FINITE');
    // A residual that overflows in the first group is refused before any cofactor is asked
    // for, as the generic code does (a cofactor asked for here would throw a plain Error).
    const early: ObservationGroup<number>[] = [
      { index: [0], rows: [[1e200]], cofactor: [[1]], weight: [[1]], l: [0] },
      { index: [1], rows: [[1]], cofactor: [[1]], weight: [[1]], l: [0] },
    ];
    const asked = () => {
      throw new Error('a cofactor was asked for');
    };
    expect(outcome(() => observationStatistics(generic, early, [1e200, 0], asked))).toBe(
      'NOT_FINITE',
    );
    expect(outcome(() => observationStatistics(float, early, [1e200, 0], asked))).toBe(
      'NOT_FINITE',
    );
  });

  it('answer finite statistics in the twin itself (the generic code is not asked)', () => {
    const groups: ObservationGroup<number>[] = [
      { index: [0, 1], rows: [[1, -1]], cofactor: [[0.5]], weight: [[2]], l: [0.01] },
      { index: [1], rows: [[1]], cofactor: [[1]], weight: [[1]], l: [-0.02] },
    ];
    const cof = (i: number, j: number) => (i === j ? 1 : 0.25);
    const twin = observationStatisticsFloat(groups, [0.1, 0.2], cof);
    expect(twin).toBeDefined();
    expect(twin).toStrictEqual(observationStatistics(generic, groups, [0.1, 0.2], cof));
  });

  it('give the generic result for a well-posed system, its solution checked by substitution', () => {
    // Three unknowns observed directly and by differences (a small levelling line): the
    // solution must satisfy the normal equations Aᵀ·P·A·x = Aᵀ·P·l (computed here by hand).
    const g = (index: number[], row: number[], l: number): ObservationGroup<number> => ({
      index,
      rows: [row],
      cofactor: [[1]],
      weight: [[1]],
      l: [l],
    });
    const groups = [
      g([0], [1], 1),
      g([0, 1], [-1, 1], 2),
      g([1, 2], [-1, 1], 3),
      g([0, 2], [-1, 1], 5.1),
    ];
    const s = solveGroups(float, 3, groups, 1e-12);
    if ('singular' in s) throw new Error('singular');
    const N = [
      [3, -1, -1],
      [-1, 2, -1],
      [-1, -1, 2],
    ];
    const b = [1 - 2 - 5.1, 2 - 3, 3 + 5.1];
    for (let i = 0; i < 3; i++)
      expect(N[i]!.reduce((acc, v, j) => acc + v * s.dx[j]!, 0)).toBeCloseTo(b[i]!, 12);
    expect(solved(float, 3, groups)).toStrictEqual(solved(generic, 3, groups));
  });

  it('adjust a random plane network exactly as the generic code', () => {
    let seed = 7;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let trial = 0; trial < 4; trial++) {
      const W = 3 + trial,
        H = 3;
      const truth: [number, number][] = [];
      for (let i = 0; i < W * H; i++)
        truth.push([(i % W) * 150 + rand() * 40, Math.floor(i / W) * 150 + rand() * 40]);
      const points: Record<string, { x: number; y: number; fixed?: boolean }> = {};
      truth.forEach(([x, y], i) => {
        points[`P${i}`] =
          i === 0 || i === W * H - 1
            ? { x, y, fixed: true }
            : { x: x + rand() * 0.1, y: y + rand() * 0.1 };
      });
      const observations: unknown[] = [];
      for (let i = 0; i < W * H; i++)
        for (const j of [i + 1, i + W, i + W + 1]) {
          if (
            j >= W * H ||
            (j === i + 1 && (i + 1) % W === 0) ||
            (j === i + W + 1 && (i + 1) % W === 0)
          )
            continue;
          const [x1, y1] = truth[i]!,
            [x2, y2] = truth[j]!;
          observations.push({
            kind: 'distance',
            from: `P${i}`,
            to: `P${j}`,
            value: Math.hypot(x2 - x1, y2 - y1) + (rand() - 0.5) * 0.004,
            sigma: 0.003,
          });
          let az = (Math.atan2(x2 - x1, y2 - y1) * 180) / Math.PI + (rand() - 0.5) / 1800;
          if (az < 0) az += 360;
          observations.push({ kind: 'bearing', from: `P${i}`, to: `P${j}`, value: az, sigma: 2 });
        }
      const input = { points, observations } as never;
      const a = outcome(() => adjustNetwork(float, input));
      expect(typeof a).toBe('object'); // an adjustment, not an error code
      expect(a).toStrictEqual(outcome(() => adjustNetwork(generic, input)));
    }
  });

  it('adjust a levelling network exactly as the generic code', () => {
    const observations: unknown[] = [];
    const names = ['A', 'B', 'C', 'D', 'E'];
    let k = 0;
    for (let i = 0; i < names.length; i++)
      for (let j = i + 1; j < names.length; j++)
        observations.push({
          from: names[i],
          to: names[j],
          difference: (j - i) * 1.25 + ((k++ % 3) - 1) * 0.002,
          sigma: 0.002,
        });
    const input = { fixed: { A: 100 }, observations } as never;
    const a = outcome(() => adjustLevelling(float, input));
    expect(typeof a).toBe('object'); // an adjustment, not an error code
    expect(a).toStrictEqual(outcome(() => adjustLevelling(generic, input)));
  });
});
