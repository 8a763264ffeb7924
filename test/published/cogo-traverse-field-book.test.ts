// Traverses from a field book: courses as measured angles and distances, against the published
// compass-rule example (its angles derived from its published azimuths) and against carrying and
// closing computed independently here with Math.atan2, Math.sin and Math.cos.
import { describe, expect, it } from 'vitest';
import { kinds } from '../geometry/helpers.js';
import {
  openTraverse,
  rational,
  traverse,
  QuadspreadError,
  rootToNumber,
} from '../../src/index.js';
import type { AngleKind } from '../../src/index.js';

const R = rational;
const code = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    return (e as QuadspreadError).code;
  }
  return 'no error';
};

// Mahun, "Surveying" (open text), "Solution: Traverse Adjustment", Problem 2 (a closed loop
// A-B-C-D, azimuths clockwise from north, distances in ft): AB 226°54′23″ 639.15;
// BC 0°00′00″ 523.69; CD 235°02′29″ 409.54; DA 79°35′02″ 815.93. Published compass-rule
// adjusted lat/dep (±0.001 ft): AB −436.631/−466.761, BC +523.715/−0.023,
// CD −234.640/−335.663, DA +147.556/+802.447.
const azSec = [226 * 3600 + 54 * 60 + 23, 0, 235 * 3600 + 2 * 60 + 29, 79 * 3600 + 35 * 60 + 2].map(
  (x) => x,
); // seconds of arc
const distances = ['639.15', '523.69', '409.54', '815.93'];
const published = [
  [-436.631, -466.761],
  [523.715, -0.023],
  [-234.64, -335.663],
  [147.556, 802.447],
] as const;
const dms = (sec: number): string => {
  const s = ((sec % 1296000) + 1296000) % 1296000;
  return `${Math.floor(s / 3600)}°${Math.floor((s % 3600) / 60)}'${s % 60}"`;
};
// The angle to the right at the station each course leaves (derived, in integer seconds):
// forward azimuth less the back azimuth (previous course + 180°), reduced to [0, 360°).
const rightSec = azSec.map((az, i) => {
  const back = azSec[(i + 3) % 4]! + 180 * 3600;
  return (((az - back) % 1296000) + 1296000) % 1296000;
});
// The published loop crosses itself (BC crosses DA): its angles to the right sum to 720°,
// neither (n − 2)·180° nor (n + 2)·180°, so no angle-sum condition holds for it. Its angles
// are checked here as a link traverse closing on its start A: backsight D (the bearing of DA
// arriving at A), the angles at A, B, C and D, then at A again from D to the known bearing of AB.
const sum720 = rightSec.reduce((s, x) => s + x, 0);

describe.each(kinds)(
  'traverse(%s, …) from angles to the right reproduces Mahun, Traverse Adjustment, Problem 2',
  (_name, A) => {
    const plus2 = rightSec.map((s) => dms(s + 2)); // 2″ too much at every angle: 10″ in all
    const t = traverse(A, {
      start: { x: 1000, y: 1000 },
      close: { point: { x: 1000, y: 1000 }, bearing: dms(azSec[0]!), angle: plus2[0]! },
      angleKind: 'right',
      startBearing: dms(azSec[3]!),
      courses: plus2.map((angle, i) => ({ angle, distance: distances[i]! })),
    });

    it('is a crossed loop: its angles to the right sum to 720°', () => {
      expect(sum720).toBe(720 * 3600);
    });

    it('finds the 10″ angular misclosure on the bearing of AB and takes 2″ from each angle', () => {
      expect(A.toNumber(t.angles!.misclosure!) * 3600).toBeCloseTo(10, 8);
      t.angles!.balanced.forEach((b, i) =>
        expect(A.toNumber(b) * 3600).toBeCloseTo(rightSec[i % 4]!, 6),
      );
    });

    it('carries the published azimuths from the balanced angles', () => {
      t.angles!.bearings.forEach((b, i) => expect(A.toNumber(b) * 3600).toBeCloseTo(azSec[i]!, 6));
    });

    it('gives the published compass-rule adjusted latitudes and departures to ±0.001 ft', () => {
      t.courses.forEach((leg, i) => {
        expect(Math.abs(A.toNumber(leg.adjustedLatitude) - published[i]![0])).toBeLessThanOrEqual(
          0.001,
        );
        expect(Math.abs(A.toNumber(leg.adjustedDeparture) - published[i]![1])).toBeLessThanOrEqual(
          0.001,
        );
      });
      // Published linear misclosure about 0.157 ft (0.1577 unrounded, as in cogo-traverse.test.ts).
      expect(Math.abs(rootToNumber(A, t.closure.linear as never) - 0.157)).toBeLessThan(0.001);
    });
  },
);

// A simple pentagon run counterclockwise, its angles computed independently with Math.atan2.
const penta = [
  [0, 0],
  [400, -50],
  [620, 210],
  [380, 480],
  [60, 350],
] as const;
const azDeg = (p: readonly number[], q: readonly number[]): number => {
  const a = (Math.atan2(q[0]! - p[0]!, q[1]! - p[1]!) * 180) / Math.PI;
  return a < 0 ? a + 360 : a;
};
const loopOf = (pts: readonly (readonly number[])[]) => {
  const n = pts.length;
  const az = pts.map((p, i) => azDeg(p, pts[(i + 1) % n]!));
  const dist = pts.map((p, i) =>
    Math.hypot(pts[(i + 1) % n]![0]! - p[0]!, pts[(i + 1) % n]![1]! - p[1]!),
  );
  // Angle to the right at each vertex: forward azimuth less back azimuth, in [0°, 360°).
  const right = az.map((z, i) => (((z - az[(i + n - 1) % n]! - 180) % 360) + 360) % 360);
  // Deflection: forward azimuth less the previous course's azimuth, in (−180°, 180°].
  const defl = az.map((z, i) => {
    let d = (z - az[(i + n - 1) % n]!) % 360;
    if (d > 180) d -= 360;
    if (d <= -180) d += 360;
    return d;
  });
  return { az, dist, right, defl };
};
const ccw = loopOf(penta);
const cw = loopOf([penta[0], penta[4], penta[3], penta[2], penta[1]]);
const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);

describe.each(kinds)('a pentagon loop from field-book angles of each kind in %s', (_name, A) => {
  it('is a simple loop: to the right, 540° counterclockwise and 1260° clockwise (independent check)', () => {
    expect(sum(ccw.right)).toBeCloseTo(540, 9);
    expect(sum(cw.right)).toBeCloseTo(1260, 9);
    expect(sum(ccw.defl)).toBeCloseTo(-360, 9);
    expect(sum(cw.defl)).toBeCloseTo(360, 9);
  });
  it.each([
    ['interior', ccw, ccw.right, 540, 5],
    ['right', ccw, ccw.right, 540, -4],
    ['exterior', cw, cw.right, 1260, 3],
    ['right', cw, cw.right, 1260, 1],
    ['deflection', ccw, ccw.defl, -360, 2],
    ['deflection', cw, cw.defl, 360, -3],
  ] as const)(
    'checks %s angles against the sum of their kind and carries the bearings',
    (kind, loop, angles, want, e) => {
      const t = traverse(A, {
        start: { x: 0, y: 0 },
        close: 'loop',
        angleKind: kind as AngleKind,
        startBearing: loop.az[0]!,
        courses: angles.map((a, i) => ({ angle: a + e / 3600, distance: loop.dist[i]! })),
      });
      expect(A.toNumber(t.angles!.expected!)).toBe(want);
      expect(A.toNumber(t.angles!.misclosure!) * 3600).toBeCloseTo(5 * e, 6);
      t.angles!.bearings.forEach((b, i) => expect(A.toNumber(b)).toBeCloseTo(loop.az[i]!, 9));
      expect(Math.abs(A.toNumber(t.closure.east))).toBeLessThan(1e-8);
      expect(Math.abs(A.toNumber(t.closure.north))).toBeLessThan(1e-8);
    },
  );
});

// A link traverse computed independently: known points R (backsight), A (start), B (end),
// S (foresight); the new points P1, P2. True angles to the right from Math.atan2; the field
// book adds errors of +3″, −2″, +4″ and +1″ (6″ in all).
const pts = {
  R: [5000, 6200],
  A: [5100, 5000],
  P1: [5410.27, 5123.88],
  P2: [5702.5, 4960.31],
  B: [6018.44, 5107.6],
  S: [6500, 5800],
} as const;
const chain = [pts.R, pts.A, pts.P1, pts.P2, pts.B, pts.S];
const trueRight = [1, 2, 3, 4].map((i) => {
  const back = azDeg(chain[i]!, chain[i - 1]!);
  const fwd = azDeg(chain[i]!, chain[i + 1]!);
  return (((fwd - back) % 360) + 360) % 360;
});
const errs = [3, -2, 4, 1];
const measured = trueRight.map((a, i) => a + errs[i]! / 3600);
const dist = [1, 2, 3].map((i) =>
  Math.hypot(chain[i + 1]![0]! - chain[i]![0]!, chain[i + 1]![1]! - chain[i]![1]!),
);

describe.each(kinds)('a link traverse from angles to the right in %s', (_name, A) => {
  const base = {
    start: { x: pts.A[0], y: pts.A[1] },
    angleKind: 'right' as AngleKind,
    courses: [0, 1, 2].map((i) => ({ angle: measured[i]!, distance: dist[i]! + 0.004 })),
  };
  const byBearings = traverse(A, {
    ...base,
    startBearing: azDeg(pts.R, pts.A),
    close: {
      point: { x: pts.B[0], y: pts.B[1] },
      bearing: azDeg(pts.B, pts.S),
      angle: measured[3]!,
    },
  });
  const byPoints = traverse(A, {
    ...base,
    backsight: { x: pts.R[0], y: pts.R[1] },
    close: { point: [pts.B[0], pts.B[1]], foresight: [pts.S[0], pts.S[1]], angle: measured[3]! },
  });

  it('finds the 6″ angular misclosure against the closing bearing', () => {
    expect(A.toNumber(byBearings.angles!.misclosure!) * 3600).toBeCloseTo(6, 6);
    expect(A.toNumber(byPoints.angles!.misclosure!) * 3600).toBeCloseTo(6, 6);
  });

  it('carries bearings through angles balanced by 1.5″ each', () => {
    // Independent: true azimuth of each course plus the running sum of (error − 1.5″).
    let run = 0;
    [0, 1, 2].forEach((i) => {
      run += errs[i]! - 1.5;
      const want = azDeg(chain[i + 1]!, chain[i + 2]!) + run / 3600;
      expect(A.toNumber(byBearings.angles!.bearings[i]!)).toBeCloseTo(want, 9);
      expect(A.toNumber(byPoints.angles!.bearings[i]!)).toBeCloseTo(want, 9);
    });
  });

  it('closes on B: the misclosure is the independent sum of latitudes and departures less B', () => {
    let x = pts.A[0] as number;
    let y = pts.A[1] as number;
    byBearings.angles!.bearings.forEach((b, i) => {
      const r = (A.toNumber(b) * Math.PI) / 180;
      x += (dist[i]! + 0.004) * Math.sin(r);
      y += (dist[i]! + 0.004) * Math.cos(r);
    });
    expect(A.toNumber(byBearings.closure.east)).toBeCloseTo(x - pts.B[0], 8);
    expect(A.toNumber(byBearings.closure.north)).toBeCloseTo(y - pts.B[1], 8);
    const last = byBearings.adjusted[3]!;
    expect(A.toNumber(last.x)).toBeCloseTo(pts.B[0], 8);
    expect(A.toNumber(last.y)).toBeCloseTo(pts.B[1], 8);
  });

  it('carries the same coordinates along an open traverse, with no misclosure claimed', () => {
    const o = openTraverse(A, { ...base, startBearing: azDeg(pts.R, pts.A), close: 'open' });
    expect(o.angles!.misclosure).toBeUndefined();
    expect('closure' in o).toBe(false);
    // Unbalanced: the bearings carry the errors themselves.
    let run = 0;
    let x = pts.A[0] as number;
    let y = pts.A[1] as number;
    o.angles!.bearings.forEach((b, i) => {
      run += errs[i]!;
      const want = azDeg(chain[i + 1]!, chain[i + 2]!) + run / 3600;
      expect(A.toNumber(b)).toBeCloseTo(want, 9);
      x += (dist[i]! + 0.004) * Math.sin((want * Math.PI) / 180);
      y += (dist[i]! + 0.004) * Math.cos((want * Math.PI) / 180);
    });
    expect(A.toNumber(o.points[3]!.x)).toBeCloseTo(x, 7);
    expect(A.toNumber(o.points[3]!.y)).toBeCloseTo(y, 7);
  });
});

describe('traverse refuses field-book input that does not hold together', () => {
  const start = { x: 0, y: 0 };
  const sq = [90, 90, 90, 90].map((angle) => ({ angle, distance: 10 }));
  it.each([
    [
      'mixed courses',
      {
        start,
        courses: [
          { angle: 90, distance: 1 },
          { bearing: 0, distance: 1 },
        ],
        angleKind: 'interior',
        startBearing: 0,
      },
    ],
    ['no angle kind', { start, courses: sq, startBearing: 0 }],
    [
      'a backsight for a loop',
      { start, courses: sq, angleKind: 'interior', backsight: { x: 0, y: -5 } },
    ],
    ['no orientation', { start, courses: sq, angleKind: 'interior' }],
    [
      'a closing bearing without its angle',
      {
        start,
        courses: sq,
        angleKind: 'right',
        startBearing: 0,
        close: { point: [10, 10], bearing: 45 },
      },
    ],
    [
      'an angle kind with bearing courses',
      { start, courses: [{ bearing: 0, distance: 1 }], angleKind: 'right' },
    ],
    ["'open' given to traverse", { start, courses: [{ bearing: 0, distance: 1 }], close: 'open' }],
    ['an unknown close word', { start, courses: [{ bearing: 0, distance: 1 }], close: 'lop' }],
  ])('%s is INVALID_ARGUMENT', (_what, input) => {
    expect(code(() => traverse(R, input as never))).toBe('INVALID_ARGUMENT');
  });
  it('openTraverse refuses a traverse that closes', () => {
    expect(code(() => openTraverse(R, { start, courses: [{ bearing: 0, distance: 1 }] }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
  it('a loop of field-book angles needs three courses', () => {
    expect(
      code(() =>
        traverse(R, { start, courses: sq.slice(0, 2), angleKind: 'interior', startBearing: 0 }),
      ),
    ).toBe('TOO_FEW_POINTS');
  });
});
