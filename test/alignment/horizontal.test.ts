// horizontalAlignment, alignmentPoint, alignmentStation: classical curve elements checked with
// Math.* written independently here (T = R tan(Δ/2), L = RΔ, E = R(sec(Δ/2) − 1),
// M = R(1 − cos(Δ/2)), LC = 2R sin(Δ/2)); exact results in rational on Pythagorean legs;
// round trips and continuity as fast-check properties; every bad input's code.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  rational,
  float,
  decimal,
  horizontalAlignment,
  alignmentPoint,
  alignmentStation,
  formatStation,
  readStation,
  quadrance,
  type Arithmetic,
  type HorizontalAlignment,
} from '../../src/index.js';
import { code } from '../geometry/helpers.js';

const R = rational;
const D2R = Math.PI / 180;

function polyline(b0: number, deflections: number[], legs: number[]) {
  const pts = [{ x: 0, y: 0 }];
  let b = b0;
  for (let i = 0; i < legs.length; i++) {
    const p = pts[pts.length - 1]!;
    pts.push({ x: p.x + legs[i]! * Math.sin(b * D2R), y: p.y + legs[i]! * Math.cos(b * D2R) });
    b += deflections[i] ?? 0;
  }
  return pts;
}

describe('horizontalAlignment: simple curves against classical trigonometry (Math.*)', () => {
  it('T, L, E, M, LC and the PC/PT chainages match R tan(Δ/2), RΔ, R(sec(Δ/2) − 1), R(1 − cos(Δ/2)), 2R sin(Δ/2)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 170, noNaN: true }),
        fc.double({ min: 5, max: 2000, noNaN: true }),
        fc.boolean(),
        (delta, radius, right) => {
          const d = right ? delta : -delta;
          const T = radius * Math.tan((delta * D2R) / 2);
          const pts = polyline(17, [d], [T + 100, T + 100]);
          const h = horizontalAlignment(float, {
            points: pts,
            curves: [{ radius }],
            startChainage: 1000,
          });
          const c = h.curves[0]!;
          const half = (delta * D2R) / 2;
          const rel = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
          expect(rel(c.deflection, d)).toBe(true);
          expect(c.turn).toBe(right ? 'right' : 'left');
          expect(rel(c.tangentIn, T) && rel(c.tangentOut, T)).toBe(true);
          expect(rel(c.arcLength, radius * delta * D2R)).toBe(true);
          expect(rel(c.external, radius * (1 / Math.cos(half) - 1))).toBe(true);
          expect(rel(c.middleOrdinate, radius * (1 - Math.cos(half)))).toBe(true);
          expect(rel(c.longChord, 2 * radius * Math.sin(half))).toBe(true);
          expect(rel(c.ts.chainage, 1100)).toBe(true);
          expect(rel(c.st.chainage, 1100 + radius * delta * D2R)).toBe(true);
          expect(rel(c.degree, 18000 / (Math.PI * radius))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('reads a chord-definition degree of curve as R = 50/sin(D/2)', () => {
    const h = horizontalAlignment(float, {
      points: polyline(0, [30], [500, 500]),
      curves: [{ degree: 5, definition: 'chord' }],
    });
    expect(h.curves[0]!.radius).toBeCloseTo(50 / Math.sin(2.5 * D2R), 9);
  });

  it('is exact in rational on legs of Pythagorean direction: PC, PT, centre, T, LC, M', () => {
    // legs north, then along (3, 4)/5, then along (−5, 12)/13 — tan(Δ/2) rational at both IPs
    const h = horizontalAlignment(R, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
        { x: 60, y: 180 },
        { x: -40, y: 420 },
      ],
      curves: [{ radius: 30 }, { radius: 26 }],
    });
    const [c1, c2] = h.curves as [(typeof h.curves)[0], (typeof h.curves)[0]];
    // IP 1: u = (0, 1), v = (3/5, 4/5): tan(Δ/2) = (3/5)/(1 + 4/5) = 1/3, T = 10
    expect(R.toString(c1.tangentIn)).toBe('10');
    expect([R.toString(c1.ts.point.x), R.toString(c1.ts.point.y)]).toEqual(['0', '90']);
    expect([R.toString(c1.st.point.x), R.toString(c1.st.point.y)]).toEqual(['6', '108']);
    // LC² = 6² + 18² = 360 is no square: LC is √360 to the arithmetic's tolerance; LC² = 2R²(1 − cos Δ) = 360
    expect(Math.abs(R.toNumber(c1.longChord) - Math.sqrt(360))).toBeLessThan(1e-12);
    // IP 2: v = (3/5, 4/5), w = (−5/13, 12/13): left turn, u × v = 3/5·12/13 + 4/5·5/13 = 56/65,
    // u·v = −15/65 + 48/65 = 33/65, tan(Δ/2) = (56/65)/(98/65) = 4/7, T = 26·4/7 = 104/7
    expect(c2.turn).toBe('left');
    expect(R.toString(c2.tangentIn)).toBe('104/7');
    const arc = h.elements.find((e) => e.type === 'arc' && e.curve === 1)!;
    if (arc.type !== 'arc') throw new Error('arc');
    // the centre is exactly 26 from the PC and the PT
    expect(R.toString(quadrance(R, arc.centre, c2.ts.point))).toBe('676');
    expect(R.toString(quadrance(R, arc.centre, c2.st.point))).toBe('676');
  });

  it('keeps chainage equations: chainages jump at the equation and read back by region', () => {
    const h = horizontalAlignment(R, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 100 },
        { x: 60, y: 180 },
      ],
      curves: [{ radius: 30 }],
      equations: [{ back: 50, ahead: '0+040.000' }],
    });
    expect(R.toString(h.endChainage)).toBe(R.toString(R.sub(h.length, R.from(10))));
    const p = alignmentPoint(R, h, 45, 0, { region: 1 }); // 45 after the equation: 55 from the start
    expect([R.toString(p.x), R.toString(p.y)]).toEqual(['0', '55']);
    expect(code(() => alignmentPoint(R, h, 45))).toBe('INVALID_ARGUMENT'); // 45 occurs twice
    const s = alignmentStation(R, h, { x: 1, y: 70 });
    expect([R.toString(s.chainage), R.toString(s.offset)]).toEqual(['60', '1']);
    expect(code(() => alignmentPoint(R, h, 35, 0, { region: 1 }))).toBe('OFF_ALIGNMENT');
  });

  it('writes and reads station text', () => {
    expect(formatStation(R, '5084.977')).toBe('50+84.98');
    expect(formatStation(R, '99.996')).toBe('1+00.00');
    expect(formatStation(R, 565, { per: 1000, decimals: 3 })).toBe('0+565.000');
    expect(formatStation(R, 1234567.5, { per: 1000, decimals: 1 })).toBe('1234+567.5');
    expect(R.toString(readStation(R, '248+14.09'))).toBe(R.toString(R.from('24814.09')));
    expect(R.toString(readStation(R, '12+345.6'))).toBe(R.toString(R.from('12345.6')));
    expect(code(() => readStation(R, '12+3x'))).toBe('INVALID_ARGUMENT');
    expect(code(() => formatStation(R, 1, { per: 50 }))).toBe('INVALID_ARGUMENT');
  });
});

describe('alignmentPoint and alignmentStation are inverse (fast-check)', () => {
  it('exactly in rational on a straight of Pythagorean direction before any curve', () => {
    const h = horizontalAlignment(R, {
      points: [
        { x: 10, y: 20 },
        { x: 10 + 300 * 8, y: 20 + 300 * 15 }, // direction (8, 15)/17
        { x: 10 + 300 * 8 + 500, y: 20 + 300 * 15 },
      ],
      curves: [{ radius: 400 }],
      startChainage: '2+000.000',
    });
    const tsAt = R.toNumber(h.curves[0]!.ts.chainage);
    fc.assert(
      fc.property(
        fc.integer({ min: 2000 * 100, max: Math.floor(tsAt * 100) }),
        fc.integer({ min: -5000, max: 5000 }),
        (c100, o100) => {
          const c = R.div(R.from(c100), R.from(100));
          const o = R.div(R.from(o100), R.from(100));
          const p = alignmentPoint(R, h, c, o);
          const s = alignmentStation(R, h, p);
          expect(R.eq(s.chainage, c) && R.eq(s.offset, o)).toBe(true);
        },
      ),
      { numRuns: 100 },
    );
  });

  const curvy = (A: Arithmetic<unknown>) =>
    horizontalAlignment(A, {
      points: polyline(40, [35, -60, 20], [400, 500, 600, 400]),
      curves: [
        { radius: 250, transitionIn: 60, transitionOut: 80 },
        { radius: 180 },
        { radius: 300, transitionIn: 50, transitionOut: 50 },
      ],
      startChainage: 500,
    }) as HorizontalAlignment<unknown>;

  it('within 1e-8 in float over straights, transitions and arcs, for |offset| below the smallest radius', () => {
    const h = curvy(float) as HorizontalAlignment<number>;
    const c0 = h.startChainage;
    const c1 = h.endChainage;
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        (t, o) => {
          const c = Math.min(c1, c0 + t * (c1 - c0));
          const p = alignmentPoint(float, h, c, o);
          const s = alignmentStation(float, h, p, { tolerance: 0 });
          expect(Math.abs(s.chainage - c)).toBeLessThan(1e-8);
          expect(Math.abs(s.offset - o)).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('within 1e-25 in rational on a transition and an arc', () => {
    const h = curvy(R) as HorizontalAlignment<ReturnType<typeof R.from>>;
    const trans = h.elements.find((e) => e.type === 'transition')!;
    const arc = h.elements.find((e) => e.type === 'arc')!;
    for (const [e, f] of [
      [trans, '1/3'],
      [arc, '2/5'],
    ] as const) {
      const c = R.add(e.startChainage, R.mul(e.length, R.from(f)));
      const p = alignmentPoint(R, h, c, '-7.5');
      const s = alignmentStation(R, h, p);
      expect(R.toNumber(R.abs(R.sub(s.chainage, c)))).toBeLessThan(1e-25);
      expect(R.toNumber(R.abs(R.sub(s.offset, R.from('-7.5'))))).toBeLessThan(1e-25);
    }
  });

  it('position and bearing are continuous at every join, in float, decimal(40) and rational', () => {
    for (const A of [float, decimal(40), R] as Arithmetic<unknown>[]) {
      const h = curvy(A);
      const tol = A === float ? 1e-9 : 1e-25;
      for (let i = 1; i < h.elements.length; i++) {
        const a = h.elements[i - 1]!;
        const b = h.elements[i]!;
        const gap = Math.hypot(
          A.toNumber(A.sub(a.end.x, b.start.x)),
          A.toNumber(A.sub(a.end.y, b.start.y)),
        );
        expect(gap).toBeLessThan(tol);
        expect(Math.abs(A.toNumber(A.sub(a.bearingOut, b.bearingIn)))).toBeLessThan(tol);
        // and the point at the end of one element, evaluated along it, is the next one's start
        const end = alignmentPoint(A, h, a.endChainage as never);
        expect(
          Math.hypot(A.toNumber(A.sub(end.x, b.start.x)), A.toNumber(A.sub(end.y, b.start.y))),
        ).toBeLessThan(tol);
      }
    }
  });

  it('curvature is continuous through transitions (Menger curvature of three close points on each side of a join, Math.*)', () => {
    const h = curvy(float) as HorizontalAlignment<number>;
    const k = (c: number) => {
      const [p, q, r] = [c - 0.5, c, c + 0.5].map((x) => alignmentPoint(float, h, x));
      const a = Math.hypot(q!.x - p!.x, q!.y - p!.y);
      const b = Math.hypot(r!.x - q!.x, r!.y - q!.y);
      const d = Math.hypot(r!.x - p!.x, r!.y - p!.y);
      const cross = (q!.x - p!.x) * (r!.y - p!.y) - (q!.y - p!.y) * (r!.x - p!.x);
      return (2 * cross) / (a * b * d); // signed, + to the left
    };
    for (const e of h.elements) {
      if (e.type !== 'transition') continue;
      for (const c of [e.startChainage, e.endChainage]) {
        expect(Math.abs(k(c - 1) - k(c + 1))).toBeLessThan(0.05 * (1 / e.radius)); // a jump of 1/R would fail
      }
      // and a circular arc's curvature is 1/R
    }
    const arc = h.elements.find((e) => e.type === 'arc')!;
    if (arc.type === 'arc')
      expect(
        Math.abs(Math.abs(k((arc.startChainage + arc.endChainage) / 2)) - 1 / arc.radius),
      ).toBeLessThan(1e-6);
  });

  it('lists every foot near the centre of a sharp curve as a candidate', () => {
    const h = horizontalAlignment(float, {
      points: polyline(0, [90], [200, 200]),
      curves: [{ radius: 100 }],
    });
    const arc = h.elements.find((e) => e.type === 'arc')!;
    if (arc.type !== 'arc') throw new Error('arc');
    // a point on the bisector inside the curve: equidistant from the two straights? No: pick one 0.0005 off it
    const s = alignmentStation(
      float,
      h,
      { x: arc.centre.x, y: arc.centre.y - 0.0001 },
      { tolerance: 1 },
    );
    expect(s.candidates.length).toBeGreaterThan(1);
    expect(Math.abs(s.offset)).toBeLessThanOrEqual(Math.abs(s.candidates[1]!.offset));
  });
});

describe('bad input gets typed errors naming the input', () => {
  const pts = [
    { x: 0, y: 0 },
    { x: 0, y: 100 },
    { x: 100, y: 200 },
  ];
  it.each([
    ['one point', { points: [{ x: 0, y: 0 }], curves: [] }, 'TOO_FEW_POINTS'],
    [
      'coincident IPs',
      { points: [pts[0], pts[1], pts[1], pts[2]], curves: [{ radius: 10 }, { radius: 10 }] },
      'COINCIDENT_POINTS',
    ],
    ['a curve count that does not match', { points: pts, curves: [] }, 'INVALID_ARGUMENT'],
    [
      'zero deflection with a curve',
      { points: [pts[0], pts[1], { x: 0, y: 300 }], curves: [{ radius: 10 }] },
      'INVALID_ARGUMENT',
    ],
    ['a radius of 0', { points: pts, curves: [{ radius: 0 }] }, 'INVALID_ARGUMENT'],
    ['a negative radius', { points: pts, curves: [{ radius: -5 }] }, 'INVALID_ARGUMENT'],
    [
      'a negative transition',
      { points: pts, curves: [{ radius: 50, transitionIn: -1 }] },
      'INVALID_ARGUMENT',
    ],
    ['overlapping tangents', { points: pts, curves: [{ radius: 1000 }] }, 'CURVES_OVERLAP'],
    [
      'transitions longer than the deflection allows',
      { points: pts, curves: [{ radius: 50, transitionIn: 40, transitionOut: 40 }] },
      'TRANSITION_TOO_LONG',
    ],
    [
      'a bad equation',
      { points: pts, curves: [{ radius: 10 }], equations: [{ back: 1e6, ahead: 0 }] },
      'INVALID_ARGUMENT',
    ],
  ])('%s', (_name, input, expected) => {
    expect(code(() => horizontalAlignment(R, input as never))).toBe(expected);
  });

  it('names the IP in the message', () => {
    try {
      horizontalAlignment(R, { points: pts, curves: [{ radius: 0 }] });
    } catch (e) {
      expect((e as Error).message).toContain('points[1]');
    }
  });

  it('refuses a chainage or a point off the ends, unless asked to extend', () => {
    const h = horizontalAlignment(R, { points: pts, curves: [{ radius: 20 }] });
    expect(code(() => alignmentPoint(R, h, -1))).toBe('OFF_ALIGNMENT');
    expect(code(() => alignmentPoint(R, h, R.add(h.endChainage, R.one)))).toBe('OFF_ALIGNMENT');
    expect(code(() => alignmentStation(R, h, { x: 3, y: -10 }))).toBe('OFF_ALIGNMENT');
    const s = alignmentStation(R, h, { x: 3, y: -10 }, { extend: true });
    expect([R.toString(s.chainage), R.toString(s.offset), s.extended]).toEqual(['-10', '3', true]);
    expect(code(() => alignmentPoint(R, { kind: 'horizontal' } as never, 1))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});

describe('an alignment cannot answer from stale checks', () => {
  const input = (dx: number) => ({
    points: [
      { x: dx, y: 0 },
      { x: dx, y: 100 },
      { x: dx + 60, y: 180 },
    ],
    curves: [{ radius: 30, transitionIn: 10, transitionOut: 10 }],
  });

  it('horizontalAlignment returns it frozen, down to its points and curves', () => {
    const h = horizontalAlignment(R, input(0));
    const frozen: unknown[] = [h, h.elements, h.boxes, h.curves, h.equations, h.points];
    for (const e of h.elements) frozen.push(e, e.start, e.end, e.direction, e.bounds);
    for (const c of h.curves) frozen.push(c);
    for (const x of frozen) expect(Object.isFrozen(x)).toBe(true);
    expect(() => ((h.boxes as number[])[0] = 1e9)).toThrow(TypeError);
    // The arithmetic's own values are left as they are.
    expect(Object.isFrozen(h.length)).toBe(false);
  });

  it('a look-alike that is not frozen, changed in place after use, is read anew', () => {
    // Two lines of three elements each: the second runs the other way, 500 m east.
    const a = horizontalAlignment(float, input(0));
    const b = horizontalAlignment(float, {
      points: [...input(500).points].reverse(),
      curves: [{ radius: 30, transitionIn: 10, transitionOut: 10 }],
    });
    expect(b.elements.length).toBe(a.elements.length);
    const u = structuredClone(a) as { -readonly [K in keyof typeof a]: any };
    const at = (h: unknown, P: { x: number; y: number }) => {
      try {
        return alignmentStation(float, h as typeof a, P);
      } catch (e) {
        return code(() => {
          throw e;
        });
      }
    };
    const Q = { x: 20, y: 50 };
    expect(at(u, Q)).toStrictEqual(at(a, Q));
    // Everything of u replaced in place by b's (the same arrays, new contents).
    const c = structuredClone(b);
    u.elements.splice(0, u.elements.length, ...c.elements);
    u.boxes.splice(0, u.boxes.length, ...c.boxes);
    u.points.splice(0, u.points.length, ...c.points);
    u.curves.splice(0, u.curves.length, ...c.curves);
    // Points around b: the answers must be b's, not ones searched with a's boxes.
    for (let x = 440; x <= 620; x += 20)
      for (let y = -20; y <= 200; y += 20) expect(at(u, { x, y })).toStrictEqual(at(b, { x, y }));
  });

  /** Moves every point of an element 5000 m north, in place (its box stays where it was). */
  const moveNorth = (e: any) => {
    for (const k of ['start', 'end', 'centre', 'origin'])
      if (e[k]) Object.defineProperty(e, k, { value: { x: e[k].x, y: e[k].y + 5000 } });
  };

  it('a look-alike whose element was moved in place after use, without its box, is refused', () => {
    const a = horizontalAlignment(float, input(0));
    const u = structuredClone(a) as any;
    const P = { x: 20, y: 5050 };
    expect(alignmentStation(float, u, { x: 20, y: 50 })).toStrictEqual(
      alignmentStation(float, a, { x: 20, y: 50 }),
    );
    moveNorth(u.elements[0]);
    // Not an answer searched with the old box (it would pass element 0 by): refused.
    expect(code(() => alignmentStation(float, u, P))).toBe('INVALID_ARGUMENT');
    expect(code(() => alignmentPoint(float, u, 10))).toBe('INVALID_ARGUMENT');
  });

  it('a look-alike frozen by its maker is not trusted: a getter can still change it', () => {
    const a = horizontalAlignment(float, input(0));
    const u = structuredClone(a) as any;
    let dy = 0;
    const s0 = u.elements[0].start;
    Object.defineProperty(u.elements[0], 'start', { get: () => ({ x: s0.x, y: s0.y + dy }) });
    const deepFreeze = (x: any) => {
      if (typeof x === 'object' && x !== null && !Object.isFrozen(x)) {
        Object.freeze(x);
        for (const k of Object.keys(x)) if (k !== 'start') deepFreeze(x[k]);
      }
      return x;
    };
    deepFreeze(u);
    expect(Object.isFrozen(u.elements[0])).toBe(true);
    const P = { x: 20, y: 50 };
    expect(alignmentStation(float, u, P)).toStrictEqual(alignmentStation(float, a, P));
    dy = 5000;
    expect(code(() => alignmentStation(float, u, P))).toBe('INVALID_ARGUMENT');
  });
});
