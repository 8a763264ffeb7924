// minimumDegreeOrder against the plain statement of the rule (Tinney & Walker, "Direct
// solutions of sparse network equations by optimally ordered triangular factorization",
// Proc. IEEE 55(11), 1967, scheme 2): repeatedly eliminate an unknown of least degree in the
// elimination graph (ties: the lowest number), joining its neighbours into a clique. The
// reference below is that statement written with sets, independently of the library's lists
// and heap; the order must be the same, step for step.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { minimumDegreeOrder } from '../../src/adjustment/normal-equations.js';

function reference(n: number, cols: readonly Map<number, unknown>[]): number[] {
  const adj = Array.from({ length: n }, () => new Set<number>());
  cols.forEach((col, j) => {
    for (const i of col.keys())
      if (i !== j) {
        adj[i]!.add(j);
        adj[j]!.add(i);
      }
  });
  const alive = new Set(Array.from({ length: n }, (_, i) => i));
  const order: number[] = [];
  while (alive.size > 0) {
    let v = -1;
    for (const u of alive)
      if (v < 0 || adj[u]!.size < adj[v]!.size || (adj[u]!.size === adj[v]!.size && u < v)) v = u;
    alive.delete(v);
    order.push(v);
    for (const u of adj[v]!) {
      adj[u]!.delete(v);
      for (const w of adj[v]!) if (w !== u) adj[u]!.add(w);
    }
    adj[v]!.clear();
  }
  return order;
}

/** An upper triangle by column (as the normal equations keep it) from a list of pairs. */
function columns(
  n: number,
  pairs: readonly [number, number][],
  both: boolean,
): Map<number, unknown>[] {
  const cols = Array.from({ length: n }, (_, j) => new Map<number, unknown>([[j, 1]]));
  for (const [a, b] of pairs) {
    const i = a % n,
      j = b % n;
    cols[Math.max(i, j)]!.set(Math.min(i, j), 1);
    // Both triangles stored: the ordering must not count a neighbour twice.
    if (both) cols[Math.min(i, j)]!.set(Math.max(i, j), 1);
  }
  return cols;
}

describe('minimumDegreeOrder', () => {
  it('gives the order of the plain rule on random sparse graphs', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 60 }),
        fc.array(fc.tuple(fc.nat(1000), fc.nat(1000)), { maxLength: 200 }),
        fc.boolean(),
        (n, pairs, both) => {
          const cols = columns(n, pairs, both);
          expect([...minimumDegreeOrder(n, cols)]).toEqual(reference(n, cols));
        },
      ),
      { numRuns: 400 },
    );
  });

  it('gives the order of the plain rule on a grid network with diagonals (heavy fill)', () => {
    const w = 12,
      h = 9,
      n = 2 * w * h; // two unknowns (east, north) per point
    const pairs: [number, number][] = [];
    const id = (x: number, y: number) => y * w + x;
    for (let y = 0; y < h; y++)
      for (let x = 0; x < w; x++)
        for (const [dx, dy] of [
          [1, 0],
          [0, 1],
          [1, 1],
        ] as const) {
          if (x + dx >= w || y + dy >= h) continue;
          const a = id(x, y),
            b = id(x + dx, y + dy);
          for (const s of [0, 1]) for (const t of [0, 1]) pairs.push([2 * a + s, 2 * b + t]);
        }
    const cols = columns(n, pairs, false);
    const order = [...minimumDegreeOrder(n, cols)];
    expect(order).toEqual(reference(n, cols));
    expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
  });

  it('handles no unknowns and unknowns without neighbours', () => {
    expect([...minimumDegreeOrder(0, [])]).toEqual([]);
    const cols = columns(4, [], false);
    expect([...minimumDegreeOrder(4, cols)]).toEqual([0, 1, 2, 3]);
  });
});

describe('solveGroups with an order memo', () => {
  // Levelled differences h_j − h_i = l over a chain (and, in the second system, one more
  // link): each row is [−1, 1] over the unknowns [i, j], weight 1. A fixed height is unknown
  // 0 with an observation of it alone.
  const group = (index: number[], row: number[], l: number) => ({
    index,
    rows: [row],
    cofactor: [[1]],
    weight: [[1]],
    l: [l],
  });
  const chain = [
    group([0], [1], 0),
    group([0, 1], [-1, 1], 1.5),
    group([1, 2], [-1, 1], -0.25),
    group([2, 3], [-1, 1], 2),
  ];
  const looped = [...chain, group([0, 3], [-1, 1], 3.3), group([1, 3], [-1, 1], 1.7)];

  it('reuses the order for the same pattern and recomputes it for another', async () => {
    const { solveGroups } = await import('../../src/adjustment/least-squares.js');
    const { float } = await import('../../src/arithmetic/float.js');
    const memo: { pattern?: Int32Array; perm?: Int32Array } = {};
    for (const groups of [chain, chain, looped, chain]) {
      const withMemo = solveGroups(float, 4, groups, 1e-12, memo);
      const without = solveGroups(float, 4, groups, 1e-12);
      if ('singular' in withMemo || 'singular' in without) throw new Error('singular');
      expect(withMemo.dx).toEqual(without.dx);
      expect([...withMemo.factor.perm]).toEqual([...without.factor.perm]);
    }
    // The chain's least-squares heights by hand: each difference carried once (no redundancy).
    const sol = solveGroups(float, 4, chain, 1e-12, memo);
    if ('singular' in sol) throw new Error('singular');
    expect(sol.dx.map((v) => Math.round(v * 1e12) / 1e12 + 0)).toEqual([0, 1.5, 1.25, 3.25]);
  });
});
