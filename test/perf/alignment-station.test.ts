// alignmentStation's fast paths: the box tree (src/alignment/box-tree.ts) must answer exactly as
// a scan of every box in index order, and the float twin (stationFloat in
// src/alignment/project.ts) must return exactly, bit for bit, what the generic code returns in
// float, or the same error code — over random points, points at the joins of elements, points
// equidistant from two elements, on transitions, near arc centres and beyond the ends.
import { describe, expect, it, beforeAll } from 'vitest';
import fc from 'fast-check';
import {
  float,
  rational,
  horizontalAlignment,
  alignmentPoint,
  alignmentStation,
  QuadspreadError,
  type HorizontalAlignment,
  type HorizontalAlignmentInput,
} from '../../src/index.js';
import { boxTree, nearestBox, nextBox } from '../../src/alignment/box-tree.js';
import { loadFloatEntry } from '../float-entry.js';

/** float without its `float64` mark: the same operations, through the generic code. */
const generic = { ...float, float64: undefined } as unknown as typeof float;

const outcome = (f: () => unknown): unknown => {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    return e.code;
  }
};

/** A seeded generator (xorshift): many points, the same every run. */
function xorshift(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

// ---- the box tree against a scan of every box ------------------------------------------------

/** Squared distance from (px, py) to box i, as the scan computes it. */
function scanQ(boxes: number[], i: number, px: number, py: number): number {
  const k = 4 * i;
  const x0 = boxes[k]!;
  const x1 = boxes[k + 2]!;
  const y0 = boxes[k + 1]!;
  const y1 = boxes[k + 3]!;
  const dx = px < x0 ? x0 - px : px > x1 ? px - x1 : 0;
  const dy = py < y0 ? y0 - py : py > y1 ? py - y1 : 0;
  return dx * dx + dy * dy;
}

/** The first strictly nearest box in index order, stopping at a box that holds the point. */
function scanNearest(boxes: number[], px: number, py: number): number {
  let first = 0;
  let firstQ = Infinity;
  for (let i = 0; i < boxes.length / 4 && firstQ > 0; i++) {
    const q = scanQ(boxes, i, px, py);
    if (q < firstQ) {
      firstQ = q;
      first = i;
    }
  }
  return first;
}

function scanNext(boxes: number[], px: number, py: number, limit: number, from: number): number {
  for (let i = from; i < boxes.length / 4; i++) if (!(scanQ(boxes, i, px, py) > limit)) return i;
  return -1;
}

const coordinate = fc.oneof(
  fc.integer({ min: -20, max: 20 }),
  fc.double({ min: -100, max: 100, noNaN: true }),
  fc.constantFrom(0, -0, Infinity, -Infinity, NaN, 1e300, -1e300),
);
const box = fc
  .tuple(coordinate, coordinate, coordinate, coordinate, fc.boolean())
  .map(([a, b, c, d, raw]) => (raw ? [a, b, c, d] : [a, b, a + Math.abs(c), b + Math.abs(d)]));

describe('the box tree answers as a scan of every box in index order', () => {
  it('nearestBox and nextBox, for random boxes (NaN and infinite sides too), points and limits', () => {
    fc.assert(
      fc.property(
        fc.array(box, { minLength: 1, maxLength: 40 }),
        fc.array(
          fc.tuple(
            fc.double({ min: -30, max: 30, noNaN: true }),
            fc.double({ min: -30, max: 30, noNaN: true }),
          ),
          { minLength: 1, maxLength: 5 },
        ),
        fc.array(
          fc.oneof(fc.double({ min: 0, max: 2000, noNaN: true }), fc.constantFrom(0, Infinity)),
          {
            minLength: 1,
            maxLength: 4,
          },
        ),
        (list, points, limits) => {
          const boxes = list.flat();
          const t = boxTree(boxes);
          for (const [px, py] of points) {
            expect(nearestBox(t, px, py)).toBe(scanNearest(boxes, px, py));
            for (const limit of limits)
              for (let from = 0; from <= list.length; from++)
                expect(nextBox(t, px, py, limit, from)).toBe(scanNext(boxes, px, py, limit, from));
          }
        },
      ),
      { numRuns: 400 },
    );
  });

  it('finds the lowest index among boxes that hold the point, and among equally near ones', () => {
    // Four equal boxes, and boxes nearer on the right of the tree than on the left.
    const same = [0, 0, 1, 1, 0, 0, 1, 1, 0, 0, 1, 1, 0, 0, 1, 1, 5, 5, 6, 6];
    expect(nearestBox(boxTree(same), 0.5, 0.5)).toBe(0);
    expect(nearestBox(boxTree(same), 3, 3)).toBe(0);
    const far = [
      10, 10, 11, 11, 20, 20, 21, 21, 30, 30, 31, 31, 0, 0, 1, 1, 2, 0, 3, 1, 0, 0, 1, 1,
    ];
    expect(nearestBox(boxTree(far), 0.5, 0.5)).toBe(3);
    expect(nearestBox(boxTree(far), 1.5, 0.5)).toBe(3); // 0.25 from boxes 3, 4 and 5: the lowest
    expect(scanNearest(far, 1.5, 0.5)).toBe(3);
  });
});

// ---- the float twin against the generic code -------------------------------------------------

/** The benchmark's line: 100 curves between straights, wandering. */
function wandering(
  seed: number,
  curves: number,
  transitions: boolean,
): HorizontalAlignmentInput<number> {
  const rand = xorshift(seed);
  const points = [{ x: 500000, y: 6000000 }];
  const list = [];
  let b = 0.3;
  for (let i = 0; i <= curves; i++) {
    const p = points[points.length - 1]!;
    const leg = 300 + rand() * 300;
    points.push({ x: p.x + leg * Math.sin(b), y: p.y + leg * Math.cos(b) });
    const turn = (rand() < 0.5 ? -1 : 1) * (0.2 + rand() * 0.5);
    b += turn;
    const radius = 150 + Math.round(rand() * 250);
    if (i < curves)
      list.push(
        transitions && rand() < 0.7
          ? { radius, transitionIn: 20 + rand() * 30, transitionOut: rand() < 0.5 ? 0 : 25 }
          : { radius },
      );
  }
  return { points, curves: list };
}

let lines: { name: string; h: HorizontalAlignment<number> }[];
beforeAll(() => {
  lines = [
    { name: 'straights and arcs', h: horizontalAlignment(float, wandering(8, 100, false)) },
    { name: 'with transitions', h: horizontalAlignment(float, wandering(21, 30, true)) },
    {
      name: 'with chainage equations',
      h: horizontalAlignment(float, {
        ...wandering(5, 6, true),
        startChainage: '10+000.000',
        equations: [
          { back: 10500, ahead: 10400 },
          { back: 11200, ahead: 12000.5 },
        ],
      }),
    },
    {
      // Axis-aligned legs: offsets to the straights are exact, so equal offsets are exact ties.
      name: 'a right angle',
      h: horizontalAlignment(float, {
        points: [
          { x: 0, y: 0 },
          { x: 0, y: 100 },
          { x: 100, y: 100 },
        ],
        curves: [{ radius: 30 }],
      }),
    },
    {
      name: 'a sharp curve',
      h: horizontalAlignment(float, {
        points: [
          { x: 0, y: 0 },
          { x: 0, y: 200 },
          { x: 10, y: 0 },
        ],
        curves: [{ radius: 4, transitionIn: 2, transitionOut: 1 }],
      }),
    },
  ];
});

// Each alignment is checked once per arithmetic object that uses it: the generic side takes a
// copy (the same data), so the two sides do not check the whole line again on every call.
const copies = new WeakMap<object, HorizontalAlignment<number>>();
const copyOf = (h: unknown): HorizontalAlignment<number> => {
  if (h === null || typeof h !== 'object') return h as never;
  let c = copies.get(h);
  if (c === undefined) copies.set(h, (c = { ...(h as HorizontalAlignment<number>) }));
  return c;
};

/** Both ways, the same result (bit for bit, -0 included) or the same error code. */
function same(h: unknown, P: unknown, options?: unknown): unknown {
  const fast = outcome(() => alignmentStation(float, h as never, P as never, options as never));
  const slow = outcome(() => alignmentStation(generic, copyOf(h), P as never, options as never));
  expect(fast).toStrictEqual(slow);
  return fast;
}

/** Points near a line: on it, off it, at every join (±a few ulps and ±1e-9), near arc centres. */
function awkwardPoints(
  h: HorizontalAlignment<number>,
  rand: () => number,
): { x: number; y: number }[] {
  const out: { x: number; y: number }[] = [];
  const place = (c: number, o: number) => {
    try {
      out.push(alignmentPoint(float, h, c, o));
    } catch {
      // a chainage an equation left out
    }
  };
  for (const e of h.elements) {
    for (const o of [0, 1e-9, -3, 40 * rand() - 20]) {
      for (const dc of [0, 1e-12, -1e-9, 1e-6]) {
        place(e.startChainage + dc, o);
        place(e.endChainage + dc, o);
      }
    }
    if (e.type === 'arc') {
      out.push({ x: e.centre.x, y: e.centre.y });
      out.push({ x: e.centre.x + 1e-9, y: e.centre.y - 1e-9 });
      out.push({ x: e.centre.x + rand() - 0.5, y: e.centre.y + rand() - 0.5 });
    }
    out.push({ x: e.start.x, y: e.start.y }, { x: e.end.x, y: e.end.y });
  }
  return out;
}

describe('alignmentStation(float, …): the float twin is exactly the generic float code', () => {
  it('at the joins of every element, on and off the line, and near the centres of arcs', () => {
    const rand = xorshift(77);
    for (const { h } of lines)
      awkwardPoints(h, rand).forEach((P, i) =>
        same(h, P, [undefined, { tolerance: 0 }, { tolerance: 5, extend: true }][i % 3]),
      );
  });

  it('for points exactly equidistant from two straights, and tied with an arc at its ends', () => {
    const h = lines[3]!.h; // straight x = 0 (y 0..70), arc about (30, 70), straight y = 100 (x 30..100)
    for (let x = 30; x <= 50; x += 0.125) same(h, { x, y: 100 - x }, { tolerance: 0 });
    for (let t = 0.5; t < 30; t += 0.5) {
      same(h, { x: t, y: 70 }); // the arc's box holds it, the first straight's does not: a tie
      same(h, { x: 30, y: 100 - t });
      same(h, { x: t, y: 70 }, { tolerance: 0 });
    }
    const tie = alignmentStation(float, h, { x: 5, y: 70 });
    expect([tie.element, tie.offset, tie.chainage, tie.candidates.length]).toEqual([1, 5, 70, 1]);
    // Both straights at 40: the first in index order first (a stable sort by |offset|).
    const both = alignmentStation(float, h, { x: 40, y: 60 }, { tolerance: 0 });
    expect(both.candidates.map((c) => [c.element, c.offset])).toEqual([
      [0, 40],
      [2, 40],
    ]);
    expect(both.chainage).toBe(60);
    expect(both.candidates[1]!.chainage).toBeCloseTo(70 + 15 * Math.PI + 10, 9);
  });

  it('for random points near and far, beyond the ends, and for bad points and options', () => {
    const point = (h: HorizontalAlignment<number>) =>
      fc.oneof(
        fc
          .tuple(
            fc.double({ min: 0, max: 1, noNaN: true }),
            fc.double({ min: -60, max: 60, noNaN: true }),
          )
          .map(([f, o]) => {
            const e = h.elements[Math.floor(f * 0.999999 * h.elements.length)]!;
            const g = f * h.elements.length - Math.floor(f * 0.999999 * h.elements.length);
            try {
              return alignmentPoint(float, h, e.startChainage + g * e.length, o);
            } catch {
              return { x: e.start.x + o, y: e.start.y }; // a chainage an equation left out
            }
          }),
        fc
          .tuple(
            fc.double({ min: -1, max: 1, noNaN: true }),
            fc.double({ min: -1, max: 1, noNaN: true }),
          )
          .map(([u, v]) => {
            const b = h.boxes;
            return { x: b[0]! + u * 3000, y: b[1]! + v * 3000 }; // about the start, beyond it too
          }),
        fc.constantFrom(
          { x: 'a', y: 1 },
          { x: 1 },
          { x: NaN, y: 0 },
          { x: Infinity, y: 0 },
          { x: '500100', y: '6000100' },
          { x: 1e308, y: -1e308 },
          null,
          [1, 2],
          Object.assign([], { x: 500000, y: 6000000 }),
        ),
      );
    const options = fc.oneof(
      fc.constant(undefined),
      fc.record({
        tolerance: fc.oneof(
          fc.double({ min: 0, max: 100, noNaN: true }),
          fc.constantFrom(undefined, 0, -0, -1, NaN, Infinity, 1e308, '0.5', 1e-300),
        ),
        extend: fc.boolean(),
      }),
      fc.constantFrom(null, 5, 'x'),
    );
    for (const { h } of lines)
      fc.assert(
        fc.property(point(h), options, (P, o) => {
          same(h, P, o);
        }),
        { numRuns: 1000 },
      );
  });

  it('agrees exactly on 20000 seeded points within 40 m of the benchmark line, and on transitions', () => {
    for (const [which, count] of [
      [0, 20000],
      [1, 5000],
    ] as const) {
      const h = lines[which]!.h;
      const rand = xorshift(0x5eed + which);
      let differ = 0;
      for (let i = 0; i < count; i++) {
        const P = alignmentPoint(
          float,
          h,
          h.startChainage + rand() * (h.endChainage - h.startChainage),
          (rand() - 0.5) * 80,
        );
        const a = alignmentStation(float, h, P);
        const b = alignmentStation(generic, copyOf(h), P);
        if (
          a.chainage !== b.chainage ||
          !Object.is(a.offset, b.offset) ||
          a.element !== b.element ||
          a.candidates.length !== b.candidates.length
        )
          differ++;
      }
      expect(differ).toBe(0);
    }
  });

  it('refuses what is not an alignment of float as the generic code does', () => {
    const h = lines[3]!.h;
    const P = { x: 40, y: 60 };
    expect(same({ ...h, elements: [...h.elements.slice(0, 2), null] }, P)).toBe('INVALID_ARGUMENT');
    expect(same({ ...h, boxes: h.boxes.slice(4) }, P)).toBe('INVALID_ARGUMENT');
    expect(same({ ...h, kind: 'vertical' }, P)).toBe('INVALID_ARGUMENT');
    expect(same(null, P)).toBe('INVALID_ARGUMENT');
    const exact = horizontalAlignment(rational, { points: h.points, curves: [{ radius: 30 }] });
    expect(same(exact, P)).toBe('INVALID_ARGUMENT');
    expect(same({ ...h }, { x: 40, y: 60 })).toStrictEqual(same(h, P)); // a copy: checked anew
    // What horizontalAlignment returns cannot be changed in place (ES modules are strict).
    const g = horizontalAlignment(float, { points: h.points, curves: [{ radius: 30 }] });
    const before = same(g, P);
    expect(before).not.toBe('INVALID_ARGUMENT');
    expect(() => ((g.elements as unknown[])[0] = null)).toThrow(TypeError);
    expect(same(g, P)).toStrictEqual(before);
    // A look-alike that is not frozen, changed in place after a first use, where the search
    // meets the change: refused, not answered from the first use's checks.
    const u = { ...g, elements: [...g.elements], boxes: [...g.boxes] };
    expect(same(u, P)).toStrictEqual(before);
    u.elements[0] = null as never;
    expect(same(u, P)).toBe('INVALID_ARGUMENT');
    expect(same(u, { x: -50, y: 10 }, { extend: true })).toBe('INVALID_ARGUMENT');
    expect(outcome(() => alignmentPoint(float, u, 150))).toBe('INVALID_ARGUMENT');
  });
});

describe('quadspread/float (the float-specialised bundle) gives the generic float results', () => {
  let F: Record<string, any>;
  beforeAll(async () => {
    F = await loadFloatEntry();
  }, 60_000);

  it('on awkward points of every line', () => {
    const rand = xorshift(99);
    for (const { h } of lines) {
      for (const P of awkwardPoints(h, rand).slice(0, 400))
        expect(outcome(() => F.alignmentStation(h, P))).toStrictEqual(
          outcome(() => alignmentStation(generic, copyOf(h), P)),
        );
    }
  });
});
