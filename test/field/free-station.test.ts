// freeStation: stations generated with Math.atan2 and Math.hypot from a known position,
// orientation and scale are recovered; a redundant set is a least-squares minimum (vᵀPv
// computed independently here with Math.*); σ from the cofactor matrix agrees with the
// first-order propagation of uncertain(float) (GUM, JCGM 100:2008 §5.1.2, eq. (10)).
import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import { float, uncertain, measuredAngle, budget, freeStation, sideShot } from '../../src/index.js';

const az = (dx: number, dy: number) => ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360;
const wrap = (a: number) => ((a % 360) + 360) % 360;

const truth = { x: 5012.345, y: 3001.234, o: 211.5 };
const control = [
  { name: 'A', x: 5150.1, y: 3120.7, z: 101.2 },
  { name: 'B', x: 4890.4, y: 3090.2, z: 98.7 },
  { name: 'C', x: 4950.8, y: 2850.6, z: 99.9 },
  { name: 'D', x: 5120.0, y: 2900.0, z: 100.4 },
];
const circle = (p: { x: number; y: number }) => wrap(az(p.x - truth.x, p.y - truth.y) - truth.o);
const dist = (p: { x: number; y: number }) => Math.hypot(p.x - truth.x, p.y - truth.y);

describe.each(kinds)('freeStation(%s, …) recovers a known station', (_n, A) => {
  it('from directions and distances to four points (redundancy 5)', () => {
    const s = freeStation(A, {
      control,
      observations: control.map((p) => ({
        to: p.name,
        circle: circle(p),
        horizontalDistance: dist(p),
      })),
    });
    expect(Math.abs(A.toNumber(s.station.x) - truth.x)).toBeLessThan(1e-8);
    expect(Math.abs(A.toNumber(s.station.y) - truth.y)).toBeLessThan(1e-8);
    expect(Math.abs(A.toNumber(s.orientation) - truth.o) * 3600).toBeLessThan(1e-5);
    expect(s.redundancy).toBe(5);
    for (const r of s.residuals) expect(Math.abs(A.toNumber(r.angleResidual!))).toBeLessThan(1e-5);
  });

  it('from three directions alone (a resection, just determined) and refers to points by index', () => {
    const s = freeStation(A, {
      control,
      observations: [0, 1, 2].map((i) => ({ to: i, circle: circle(control[i]!) })),
    });
    expect(Math.abs(A.toNumber(s.station.x) - truth.x)).toBeLessThan(1e-7);
    expect(Math.abs(A.toNumber(s.station.y) - truth.y)).toBeLessThan(1e-7);
    expect(s.redundancy).toBe(0);
    expect(s.varianceFactor).toBeUndefined();
  });

  it('from two distances and directions to two points, choosing the intersection the directions fit', () => {
    const s = freeStation(A, {
      control,
      observations: [
        { to: 'A', horizontalDistance: dist(control[0]!) },
        { to: 'B', horizontalDistance: dist(control[1]!), circle: circle(control[1]!) },
        { to: 'D', circle: circle(control[3]!) },
      ],
    });
    expect(Math.abs(A.toNumber(s.station.x) - truth.x)).toBeLessThan(1e-7);
    expect(Math.abs(A.toNumber(s.station.y) - truth.y)).toBeLessThan(1e-7);
  });

  it('with a free scale: measured distances 40 ppm short give scale (1/(1 − 40e-6) − 1)·10⁶ ppm', () => {
    const s = freeStation(A, {
      control,
      scale: 'free',
      observations: control.map((p) => ({
        to: p.name,
        circle: circle(p),
        horizontalDistance: dist(p) * (1 - 40e-6),
      })),
    });
    expect(Math.abs(A.toNumber(s.scale!) - (1 / (1 - 40e-6) - 1) * 1e6)).toBeLessThan(1e-6);
    expect(Math.abs(A.toNumber(s.station.x) - truth.x)).toBeLessThan(1e-8);
  });

  it('gives the station level as the mean over slope observations, with height residuals', () => {
    const hi = 1.6;
    const ht = 1.5;
    const zStation = 100;
    const observations = control.slice(0, 2).map((p) => {
      const d = dist(p);
      const rise = p.z + ht - (zStation + hi);
      return {
        to: p.name,
        circle: circle(p),
        zenith: (Math.atan2(d, rise) * 180) / Math.PI,
        slope: Math.hypot(d, rise),
        targetHeight: ht,
      };
    });
    const s = freeStation(A, { control, observations, instrumentHeight: hi });
    expect(Math.abs(A.toNumber(s.station.z!) - zStation)).toBeLessThan(1e-8);
    for (const r of s.residuals) expect(Math.abs(A.toNumber(r.heightResidual!))).toBeLessThan(1e-8);
  });
});

describe('freeStation with redundant, imperfect observations', () => {
  const noise = [2.1, -1.4, 3.3, -0.8]; // arc-seconds
  const dn = [0.002, -0.003, 0.001, 0.004]; // metres
  const observations = control.map((p, i) => ({
    to: p.name,
    circle: wrap(circle(p) + noise[i]! / 3600),
    horizontalDistance: dist(p) + dn[i]!,
  }));
  const sigma = { direction: 2, distance: 0.002 };
  // vᵀPv written independently with Math.* for a trial station (x, y, o).
  const vpv = (x: number, y: number, o: number) =>
    control.reduce((s, p, i) => {
      const dA = ((((az(p.x - x, p.y - y) - o - observations[i]!.circle) % 360) + 540) % 360) - 180;
      const dD = observations[i]!.horizontalDistance - Math.hypot(p.x - x, p.y - y);
      return s + (dA * 3600) ** 2 / sigma.direction ** 2 + dD ** 2 / sigma.distance ** 2;
    }, 0);

  it('is a least-squares minimum: vᵀPv grows for any small move of x, y or orientation', () => {
    const s = freeStation(float, { control, observations, sigma });
    const best = vpv(s.station.x, s.station.y, s.orientation);
    expect(Math.abs(best - s.varianceFactor! * s.redundancy)).toBeLessThan(1e-6 * best);
    for (const [dx, dy, dO] of [
      [1e-4, 0, 0],
      [-1e-4, 0, 0],
      [0, 1e-4, 0],
      [0, -1e-4, 0],
      [0, 0, 1e-4],
      [0, 0, -1e-4],
    ] as const)
      expect(vpv(s.station.x + dx, s.station.y + dy, s.orientation + dO)).toBeGreaterThan(best);
  });

  it('gives the same station in rational, decimal(34) and float (to 1e-9 m)', () => {
    const f = freeStation(float, { control, observations, sigma });
    for (const [, A] of kinds) {
      const s = freeStation(A, { control, observations, sigma });
      expect(Math.abs(A.toNumber(s.station.x) - f.station.x)).toBeLessThan(1e-9);
      expect(Math.abs(A.toNumber(s.station.y) - f.station.y)).toBeLessThan(1e-9);
    }
  });

  it('serves as a set-up for side shots', () => {
    const s = freeStation(float, { control, observations, sigma });
    const p = sideShot(float, s, {
      circle: circle(control[2]!),
      zenith: 90,
      slope: dist(control[2]!),
    });
    expect(Math.hypot(p.x - control[2]!.x, p.y - control[2]!.y)).toBeLessThan(0.01);
  });
});

describe('freeStation σ (a priori, just determined) agrees with uncertain(float) propagation', () => {
  it('σx, σy, σorientation from the cofactor matrix = budget(U, …).sigma of the same solve', () => {
    const U = uncertain(float);
    const s = freeStation(U, {
      control,
      sigma: { direction: 3 },
      observations: [0, 1, 2].map((i) => ({
        to: i,
        circle: measuredAngle(U, circle(control[i]!), 3, `c${i}`),
      })),
    });
    expect(U.toNumber(s.sigma.x)).toBeCloseTo(budget(U, s.station.x).sigma, 9);
    expect(U.toNumber(s.sigma.y)).toBeCloseTo(budget(U, s.station.y).sigma, 9);
    expect(U.toNumber(s.sigma.orientation)).toBeCloseTo(budget(U, s.orientation).sigma * 3600, 6);
    // and both equal the propagation by central finite differences of float solves
    const h = 1e-4;
    let v = 0;
    for (let k = 0; k < 3; k++) {
      const x = (d: number) =>
        freeStation(float, {
          control,
          observations: [0, 1, 2].map((i) => ({
            to: i,
            circle: circle(control[i]!) + (i === k ? d : 0),
          })),
        }).station.x;
      v += ((((x(h) - x(-h)) / (2 * h)) * 3) / 3600) ** 2; // ∂x/∂c per degree × 3″
    }
    expect(budget(U, s.station.x).sigma).toBeCloseTo(Math.sqrt(v), 8);
  });
});

describe('freeStation refuses', () => {
  const A = float;
  it('one control point, no direction, too few observations: TOO_FEW_POINTS', () => {
    expect(
      code(() =>
        freeStation(A, { control, observations: [{ to: 'A', circle: 0, horizontalDistance: 10 }] }),
      ),
    ).toBe('TOO_FEW_POINTS');
    expect(
      code(() =>
        freeStation(A, {
          control,
          observations: [
            { to: 'A', horizontalDistance: 10 },
            { to: 'B', horizontalDistance: 10 },
            { to: 'C', horizontalDistance: 10 },
          ],
        }),
      ),
    ).toBe('TOO_FEW_POINTS');
    expect(
      code(() =>
        freeStation(A, {
          control,
          observations: [
            { to: 'A', circle: 0 },
            { to: 'B', circle: 10 },
          ],
        }),
      ),
    ).toBe('TOO_FEW_POINTS');
  });

  it('two distances and one direction fit two stations: INCONSISTENT_READINGS', () => {
    expect(
      code(() =>
        freeStation(A, {
          control,
          observations: [
            { to: 'A', horizontalDistance: dist(control[0]!), circle: circle(control[0]!) },
            { to: 'B', horizontalDistance: dist(control[1]!) },
          ],
        }),
      ),
    ).toBe('INCONSISTENT_READINGS');
  });

  it('an unknown control point, a point without coordinates, a bad scale and σ ≤ 0: INVALID_ARGUMENT', () => {
    const obs = [
      { to: 'A', circle: 0 },
      { to: 'B', circle: 1 },
      { to: 'C', circle: 2 },
    ];
    expect(
      code(() => freeStation(A, { control, observations: [...obs, { to: 'Z', circle: 0 }] })),
    ).toBe('INVALID_ARGUMENT');
    expect(code(() => freeStation(A, { control: [{ x: 1 } as never], observations: obs }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      code(() => freeStation(A, { control, observations: obs, scale: 'loose' as never })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() => freeStation(A, { control, observations: obs, sigma: { direction: 0 } })),
    ).toBe('INVALID_ARGUMENT');
  });
});
