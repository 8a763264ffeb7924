// orientStation, sideShot(s), setOut and setOutCheck: independent classical-trig computations
// with Math.atan2, Math.sin, Math.cos and Math.hypot written here, and the identities the
// field procedure rests on, as fast-check properties.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { code, kinds } from '../geometry/helpers.js';
import {
  rational,
  float,
  uncertain,
  measured,
  measuredAngle,
  budget,
  orientStation,
  sideShot,
  sideShots,
  setOut,
  setOutCheck,
} from '../../src/index.js';

const rad = (deg: number) => (deg * Math.PI) / 180;
const azimuth = (dx: number, dy: number) => ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360;
const angleDiff = (a: number, b: number) => ((((a - b) % 360) + 540) % 360) - 180;

const station = { x: '1000', y: '2000', z: '50' };
const known = [
  { x: 1250.5, y: 2310.25, z: 52.1 },
  { x: 620.75, y: 1875.5, z: 47.3 },
  { x: 1100, y: 1400.8, z: 55 },
];
const trueOrientation = 37.25; // degrees: bearing of the circle's zero
const errors = [3, -2, 1.5]; // arc-seconds added to each reading
const circles = known.map((p, i) => {
  const b = azimuth(p.x - 1000, p.y - 2000);
  return (b - trueOrientation + errors[i]! / 3600 + 360) % 360;
});

describe.each(kinds)('orientStation(%s, …) against Math.atan2', (_n, A) => {
  const backsights = known.map((p, i) => ({ point: p, circle: circles[i]! }));

  it('gives the orientation as the mean of bearing − circle and each residual in arc-seconds', () => {
    const s = orientStation(A, { station, backsights });
    const mean = trueOrientation - (3 - 2 + 1.5) / 3 / 3600;
    expect(Math.abs(angleDiff(A.toNumber(s.orientation), mean) * 3600)).toBeLessThan(1e-6);
    s.backsights.forEach((b, i) => {
      const expected =
        angleDiff(azimuth(known[i]!.x - 1000, known[i]!.y - 2000), circles[i]! + mean) * 3600;
      expect(Math.abs(A.toNumber(b.angleResidual) - expected)).toBeLessThan(1e-6);
    });
    expect(s.weighting).toBe('equal');
  });

  it('weights by the squared distance when asked', () => {
    const s = orientStation(A, { station, backsights, weighting: 'quadrance' });
    const q = known.map((p) => (p.x - 1000) ** 2 + (p.y - 2000) ** 2);
    const mean =
      trueOrientation - (q[0]! * 3 + q[1]! * -2 + q[2]! * 1.5) / (q[0]! + q[1]! + q[2]!) / 3600;
    expect(Math.abs(angleDiff(A.toNumber(s.orientation), mean) * 3600)).toBeLessThan(1e-6);
  });

  it('gives distance, position and height residuals where a slope and zenith were read, and checks tolerances', () => {
    const p = known[0]!;
    const D = Math.hypot(p.x - 1000, p.y - 2000) + 0.004; // read 4 mm long
    const z = 88.5;
    const S = D / Math.sin(rad(z));
    const hi = 1.55;
    const ht = 1.7;
    const s = orientStation(A, {
      station,
      instrumentHeight: String(hi),
      backsights: [
        { point: p, circle: circles[0]!, zenith: z, slope: S, targetHeight: String(ht) },
      ],
      tolerance: { angle: 5, distance: '0.003', height: '0.01' },
    });
    const b = s.backsights[0]!;
    expect(Math.abs(A.toNumber(b.distanceResidual!) - 0.004)).toBeLessThan(1e-9);
    const bearing = A.toNumber(s.orientation) + circles[0]!;
    expect(
      Math.abs(A.toNumber(b.positionResidual!.x) - (1000 + D * Math.sin(rad(bearing)) - p.x)),
    ).toBeLessThan(1e-9);
    expect(
      Math.abs(A.toNumber(b.positionResidual!.y) - (2000 + D * Math.cos(rad(bearing)) - p.y)),
    ).toBeLessThan(1e-9);
    const h = 50 + hi + S * Math.cos(rad(z)) - ht - p.z;
    expect(Math.abs(A.toNumber(b.heightResidual!) - h)).toBeLessThan(1e-9);
    expect(s.checks.map((c) => [c.quantity, c.ok])).toEqual([
      ['backsight 1 angle', true],
      ['backsight 1 distance', false],
      ['backsight 1 height', Math.abs(h) <= 0.01],
    ]);
    expect(s.ok).toBe(false);
  });

  it('refuses no backsight, a backsight on the station, a point without coordinates and a slope without zenith', () => {
    expect(code(() => orientStation(A, { station, backsights: [] }))).toBe('TOO_FEW_POINTS');
    expect(
      code(() => orientStation(A, { station, backsights: [{ point: station, circle: 0 }] })),
    ).toBe('COINCIDENT_POINTS');
    expect(
      code(() =>
        orientStation(A, { station, backsights: [{ point: { x: 1 } as never, circle: 0 }] }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        orientStation(A, { station: {} as never, backsights: [{ point: known[0]!, circle: 0 }] }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        orientStation(A, { station, backsights: [{ point: known[0]!, circle: 0, slope: 10 }] }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        orientStation(A, {
          station,
          backsights: [{ point: known[0]!, circle: 0 }],
          weighting: 'heavy' as never,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
  });
});

describe('adding δ to every circle reading (a re-zeroed circle)', () => {
  it('changes the orientation by −δ (mod 360°) and leaves side shots and set-out distances and angles unchanged; the set-out circle moves by +δ', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -720, max: 720, noNaN: true }),
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        (delta, shotCircle, slope) => {
          const shift = (c: number) => (((c + delta) % 360) + 360) % 360;
          const make = (d: (c: number) => number) =>
            orientStation(float, {
              station,
              instrumentHeight: '1.5',
              backsights: known.map((p, i) => ({ point: p, circle: d(circles[i]!) })),
            });
          const a = make((c) => c);
          const b = make(shift);
          expect(Math.abs(angleDiff(b.orientation, a.orientation - delta))).toBeLessThan(1e-9);
          const shot = { zenith: 92, slope, targetHeight: 2 };
          const pa = sideShot(float, a, { ...shot, circle: shotCircle });
          const pb = sideShot(float, b, { ...shot, circle: shift(shotCircle) });
          expect(Math.abs(pa.x - pb.x)).toBeLessThan(1e-8);
          expect(Math.abs(pa.y - pb.y)).toBeLessThan(1e-8);
          expect(Math.abs(pa.z! - pb.z!)).toBeLessThan(1e-9);
          const design = { x: 1210.3, y: 1777.7, z: 49 };
          const sa = setOut(float, a, design, { targetHeight: 2 });
          const sb = setOut(float, b, design, { targetHeight: 2 });
          expect(Math.abs(angleDiff(sb.circle, sa.circle + delta))).toBeLessThan(1e-9);
          expect(Math.abs(angleDiff(sb.angleFromBacksight!, sa.angleFromBacksight!))).toBeLessThan(
            1e-9,
          );
          expect(sb.horizontalDistance).toBe(sa.horizontalDistance);
          expect(sb.slopeDistance).toBe(sa.slopeDistance);
          expect(sb.zenith).toBe(sa.zenith);
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe.each(kinds)('sideShot(%s, setup, shot) against Math.sin and Math.cos', (_n, A) => {
  const setup = { station, instrumentHeight: '1.48', orientation: `312°17'40"` };
  it('x = x0 + S sin z sin β, y = y0 + S sin z cos β, z = z0 + hi + S cos z − ht', () => {
    const p = sideShot(A, setup, {
      circle: `81°02'11"`,
      zenith: `94°30'00"`,
      slope: '187.654',
      targetHeight: '1.3',
      name: 'tree 7',
    });
    const beta = rad(312 + 17 / 60 + 40 / 3600 + 81 + 2 / 60 + 11 / 3600);
    const z = rad(94.5);
    expect(p.name).toBe('tree 7');
    expect(
      Math.abs(A.toNumber(p.x) - (1000 + 187.654 * Math.sin(z) * Math.sin(beta))),
    ).toBeLessThan(1e-9);
    expect(
      Math.abs(A.toNumber(p.y) - (2000 + 187.654 * Math.sin(z) * Math.cos(beta))),
    ).toBeLessThan(1e-9);
    expect(Math.abs(A.toNumber(p.z!) - (50 + 1.48 + 187.654 * Math.cos(z) - 1.3))).toBeLessThan(
      1e-9,
    );
  });

  it('sideShots gives each shot as sideShot does', () => {
    const shots = [
      { circle: 10, zenith: 91, slope: 20 },
      { circle: 200, zenith: 265, slope: 35, targetHeight: 2 },
    ];
    const all = sideShots(A, setup, shots);
    shots.forEach((s, i) => {
      const one = sideShot(A, setup, s);
      expect(A.toString(all[i]!.x)).toBe(A.toString(one.x));
      expect(A.toString(all[i]!.z!)).toBe(A.toString(one.z!));
    });
  });

  it('refuses a shot without circle, an instrument height on the shot and a set-up without orientation', () => {
    expect(code(() => sideShot(A, setup, { zenith: 90, slope: 1 }))).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        sideShot(A, setup, { circle: 0, zenith: 90, slope: 1, instrumentHeight: 1 } as never),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(code(() => sideShot(A, { station } as never, { circle: 0, zenith: 90, slope: 1 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => sideShots(A, setup, 'shots' as never))).toBe('INVALID_ARGUMENT');
  });
});

describe('sideShot σ through uncertain(float) (GUM, JCGM 100:2008 §5.1.2, eq. (10), derivatives by hand)', () => {
  it('σx² = (sin z sin β σS)² + (S cos z sin β σz)² + (S sin z cos β σβ)² with angles in radians', () => {
    const U = uncertain(float);
    const setup = { station: { x: 0, y: 0, z: 0 }, orientation: 0 };
    const S = 150;
    const zDeg = 85;
    const cDeg = 30;
    const sS = 0.003;
    const sz = 5; // arc-seconds
    const sc = 3;
    const p = sideShot(U, setup, {
      circle: measuredAngle(U, cDeg, sc, 'circle'),
      zenith: measuredAngle(U, zDeg, sz, 'zenith'),
      slope: measured(U, S, sS, 'slope'),
    });
    const z = rad(zDeg);
    const b = rad(cDeg);
    const szr = rad(sz / 3600);
    const scr = rad(sc / 3600);
    const sx = Math.hypot(
      Math.sin(z) * Math.sin(b) * sS,
      S * Math.cos(z) * Math.sin(b) * szr,
      S * Math.sin(z) * Math.cos(b) * scr,
    );
    const sy = Math.hypot(
      Math.sin(z) * Math.cos(b) * sS,
      S * Math.cos(z) * Math.cos(b) * szr,
      S * Math.sin(z) * Math.sin(b) * scr,
    );
    const sh = Math.hypot(Math.cos(z) * sS, S * Math.sin(z) * szr);
    expect(budget(U, p.x).sigma).toBeCloseTo(sx, 12);
    expect(budget(U, p.y).sigma).toBeCloseTo(sy, 12);
    expect(budget(U, p.z!).sigma).toBeCloseTo(sh, 12);
  });

  it('carries the orientation σ of a set-up oriented on an uncertain backsight reading', () => {
    const U = uncertain(float);
    const setup = orientStation(U, {
      station: { x: 0, y: 0 },
      backsights: [{ point: { x: 0, y: 100 }, circle: measuredAngle(U, 0, 4, 'backsight') }],
    });
    const p = sideShot(U, setup, { circle: 90, zenith: 90, slope: 200 });
    // x = 200·sin(90° + o): ∂x/∂o = 200·cos 90° = 0; y = 200·cos(90° + o): ∂y/∂o = −200 per radian, o = −circle
    expect(budget(U, p.y).sigma).toBeCloseTo(200 * rad(4 / 3600), 12);
    expect(budget(U, p.x).sigma).toBeCloseTo(0, 12);
  });
});

describe.each(kinds)(
  'setOut(%s, setup, design, options) against Math.atan2 and Math.hypot',
  (_n, A) => {
    const setup = orientStation(A, {
      station,
      instrumentHeight: '1.5',
      backsights: known.map((p, i) => ({ point: p, circle: circles[i]! })),
    });
    it('gives circle = bearing − orientation, the angle from the first backsight, D, slope distance and zenith', () => {
      const design = { x: '870.125', y: '2222.75', z: '53.4' };
      const r = setOut(A, setup, design, { targetHeight: '1.8' });
      const dx = 870.125 - 1000;
      const dy = 2222.75 - 2000;
      const bearing = azimuth(dx, dy);
      const o = A.toNumber(setup.orientation);
      expect(Math.abs(angleDiff(A.toNumber(r.circle), bearing - o)) * 3600).toBeLessThan(1e-6);
      expect(
        Math.abs(angleDiff(A.toNumber(r.angleFromBacksight!), bearing - o - circles[0]!)) * 3600,
      ).toBeLessThan(1e-6);
      const D = Math.hypot(dx, dy);
      const V = 53.4 + 1.8 - 51.5;
      expect(Math.abs(A.toNumber(r.horizontalDistance) - D)).toBeLessThan(1e-9);
      expect(Math.abs(A.toNumber(r.slopeDistance!) - Math.hypot(D, V))).toBeLessThan(1e-9);
      expect(
        Math.abs(A.toNumber(r.zenith!) - (Math.atan2(D, V) * 180) / Math.PI) * 3600,
      ).toBeLessThan(1e-6);
    });

    it('divides a grid distance by the combined factor', () => {
      const r = setOut(
        A,
        { station: { x: 0, y: 0 }, orientation: 0 },
        { x: 0, y: 999.6 },
        { combinedFactor: '0.9996' },
      );
      expect(A.toNumber(r.horizontalDistance)).toBeCloseTo(1000, 9);
    });

    it('refuses a design point on the station and one without coordinates', () => {
      expect(code(() => setOut(A, setup, { x: 1000, y: 2000 }))).toBe('COINCIDENT_POINTS');
      expect(code(() => setOut(A, setup, { y: 1 } as never))).toBe('INVALID_ARGUMENT');
    });
  },
);

describe('setOut followed by observing its answer with sideShot returns the design point', () => {
  it('exactly in rational on the axes at the instrument level', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 3 }),
        fc.integer({ min: 1, max: 10 ** 7 }),
        fc.integer({ min: 0, max: 3 }),
        (axis, mm, o) => {
          const setup = {
            station: { x: '100.5', y: '-20.25', z: 10 },
            instrumentHeight: '1.5',
            orientation: 90 * o,
          };
          const d = rational.from(`${mm}/1000`);
          const [ex, ey] = [
            [0, 1],
            [1, 0],
            [0, -1],
            [-1, 0],
          ][axis]!;
          const design = {
            x: rational.add(rational.from('100.5'), rational.mul(rational.from(ex!), d)),
            y: rational.add(rational.from('-20.25'), rational.mul(rational.from(ey!), d)),
            z: rational.from('10.25'),
          };
          const s = setOut(rational, setup, design, { targetHeight: '1.25' });
          const p = sideShot(rational, setup, {
            circle: s.circle,
            zenith: s.zenith!,
            slope: s.slopeDistance!,
            targetHeight: '1.25',
          });
          expect(
            rational.eq(p.x, design.x) && rational.eq(p.y, design.y) && rational.eq(p.z!, design.z),
          ).toBe(true);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('in rational anywhere, within 1e-30 m (atan2, sin and cos within 1e-40 relative)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1000000, max: 1000000 }),
        fc.integer({ min: -1000000, max: 1000000 }),
        fc.integer({ min: -5000, max: 5000 }),
        (x, y, z) => {
          fc.pre(x !== 0 || y !== 0);
          const setup = {
            station: { x: 0, y: 0, z: 0 },
            instrumentHeight: '1.6',
            orientation: `123°45'06"`,
          };
          const design = { x: `${x}/1000`, y: `${y}/1000`, z: `${z}/1000` };
          const s = setOut(rational, setup, design, { targetHeight: 2 });
          const p = sideShot(rational, setup, {
            circle: s.circle,
            zenith: s.zenith!,
            slope: s.slopeDistance!,
            targetHeight: 2,
          });
          for (const [a, b] of [
            [p.x, design.x],
            [p.y, design.y],
            [p.z!, design.z],
          ] as const)
            expect(Math.abs(rational.toNumber(rational.sub(a, rational.from(b))))).toBeLessThan(
              1e-30,
            );
        },
      ),
      { numRuns: 30 },
    );
  });

  it('in float within 1e-8 m, with curvature and refraction on both sides', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 359.9, noNaN: true }),
        (x, y, z, o) => {
          fc.pre(Math.hypot(x, y) > 0.01);
          const setup = { station: { x: 10, y: 20, z: 5 }, instrumentHeight: 1.6, orientation: o };
          const s = setOut(float, setup, { x, y, z }, { targetHeight: 1.3, curvature: true });
          const p = sideShot(float, setup, {
            circle: s.circle,
            zenith: s.zenith!,
            slope: s.slopeDistance!,
            targetHeight: 1.3,
            curvature: true,
          });
          expect(Math.abs(p.x - x) + Math.abs(p.y - y) + Math.abs(p.z! - z)).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe.each(kinds)('setOutCheck(%s, …): along, across and cut', (_n, A) => {
  const setup = { station: { x: 0, y: 0, z: 100 }, orientation: 0 };
  it('a mark placed 3 cm beyond and 2 cm right of a design point NE of the station', () => {
    // design at bearing 45°, 50 m; the mark at along 50.03, across +0.02 (to the right = bearing 135°)
    const u = [Math.SQRT1_2, Math.SQRT1_2];
    const r = [Math.SQRT1_2, -Math.SQRT1_2];
    const mark = { x: 50.03 * u[0]! + 0.02 * r[0]!, y: 50.03 * u[1]! + 0.02 * r[1]! };
    const D = Math.hypot(mark.x, mark.y);
    const bearing = azimuth(mark.x, mark.y);
    const z = (Math.atan2(D, -0.05) * 180) / Math.PI; // the mark 5 cm below the instrument's level
    const design = { x: 50 * u[0]!, y: 50 * u[1]!, z: 100 };
    const c = setOutCheck(
      A,
      setup,
      design,
      { circle: bearing, zenith: z, slope: Math.hypot(D, 0.05) },
      { horizontal: '0.03', vertical: '0.02' },
    );
    expect(A.toNumber(c.along)).toBeCloseTo(0.03, 9);
    expect(A.toNumber(c.across)).toBeCloseTo(0.02, 9);
    expect(A.toNumber(c.cut!)).toBeCloseTo(-0.05, 9);
    expect(A.toNumber(c.horizontalOffset)).toBeCloseTo(Math.hypot(0.03, 0.02), 9);
    expect(c.checks.map((k) => k.ok)).toEqual([false, false]);
  });

  it('across is negative to the left, along negative short of the design point', () => {
    const c = setOutCheck(
      A,
      setup,
      { x: 0, y: 10 },
      {
        circle: 270 + (Math.atan2(9.9, 0.1) * 180) / Math.PI,
        zenith: 90,
        slope: Math.hypot(0.1, 9.9),
      },
    );
    expect(A.toNumber(c.along)).toBeCloseTo(-0.1, 9);
    expect(A.toNumber(c.across)).toBeCloseTo(-0.1, 9);
    expect(c.cut).toBeUndefined();
  });
});
