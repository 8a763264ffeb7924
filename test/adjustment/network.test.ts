// adjustNetwork: exact synthetic observations give the coordinates back; a noisy network
// against an independent plain-float Gauss–Newton (mathjs lusolve and qr); ellipses from the
// independent cofactors; identities exactly in rational; data snooping; bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as math from 'mathjs';
import {
  float as F,
  rational as R,
  adjustNetwork,
  rootToNumber,
  QuadspreadError,
  type NetworkInput,
} from '../../src/index.js';
import { azimuth, gaussNewton, lcg, type Obs } from './network-helpers.js';

const TRUE: Record<string, [number, number]> = {
  A: [1000, 1000],
  B: [1400, 1050],
  C: [1350, 1420],
  D: [980, 1380],
  E: [1180, 1210],
};
const dist = (a: string, b: string) =>
  Math.hypot(TRUE[b]![0] - TRUE[a]![0], TRUE[b]![1] - TRUE[a]![1]);

/** Observations of the network above, exact or with seeded noise (σ: 3 mm, 2″). */
function observations(noise: number, seed = 1): Obs[] {
  const g = lcg(seed);
  const obs: Obs[] = [];
  for (const [a, b] of [
    ['A', 'B'],
    ['B', 'C'],
    ['C', 'D'],
    ['D', 'A'],
    ['A', 'E'],
    ['B', 'E'],
    ['C', 'E'],
    ['D', 'E'],
  ] as const)
    obs.push({
      kind: 'distance',
      from: a,
      to: b,
      value: dist(a, b) + noise * 0.003 * g.n(),
      sigma: 0.003,
    });
  for (const [at, tos] of [
    ['E', ['A', 'B', 'C', 'D']],
    ['A', ['B', 'E', 'D']],
  ] as const) {
    const w = 37.5; // orientation of the circle
    for (const to of tos) {
      let v = azimuth(TRUE[at]!, TRUE[to]!) - w + (noise * 2 * g.n()) / 3600;
      if (v < 0) v += 360;
      obs.push({ kind: 'direction', at, to, value: v, sigma: 2 });
    }
  }
  obs.push({
    kind: 'bearing',
    from: 'B',
    to: 'C',
    value: azimuth(TRUE.B!, TRUE.C!) + (noise * 2 * g.n()) / 3600,
    sigma: 2,
  });
  return obs;
}
const points = (approx: boolean) => ({
  A: { x: 1000, y: 1000, fixed: true as const },
  B: { x: 1400, y: 1050, fixed: true as const },
  C: approx ? { x: 1350.4, y: 1419.7 } : {},
  D: approx ? { x: 979.8, y: 1380.3 } : {},
  E: approx ? { x: 1180.2, y: 1209.9 } : {},
});

describe('adjustNetwork on exact synthetic observations', () => {
  it('gives the coordinates back with zero residuals, from computed approximations (float)', () => {
    const r = adjustNetwork(F, { points: points(false), observations: observations(0) as never });
    for (const k of ['C', 'D', 'E']) {
      expect(r.points[k]!.approximated).toBe(true);
      expect(Math.abs(r.points[k]!.x - TRUE[k]![0])).toBeLessThan(1e-8);
      expect(Math.abs(r.points[k]!.y - TRUE[k]![1])).toBeLessThan(1e-8);
    }
    for (const o of r.observations) expect(Math.abs(o.residual)).toBeLessThan(1e-6);
  });
  it('and in rational, angles with an included angle and a vector too', () => {
    const obs = [
      ...observations(0),
      {
        kind: 'angle',
        at: 'C',
        from: 'D',
        to: 'B',
        value: ((azimuth(TRUE.C!, TRUE.B!) - azimuth(TRUE.C!, TRUE.D!) + 360) % 360).toFixed(12),
        sigma: 3,
      },
      {
        kind: 'vector',
        from: 'D',
        to: 'E',
        dx: '200',
        dy: '-170',
        covariance: [
          ['4e-6', '1e-6'],
          ['1e-6', '4e-6'],
        ],
      },
    ];
    const r = adjustNetwork(R, { points: points(true), observations: obs as never });
    for (const k of ['C', 'D', 'E']) {
      expect(Math.abs(R.toNumber(r.points[k]!.x) - TRUE[k]![0])).toBeLessThan(1e-7);
      expect(Math.abs(R.toNumber(r.points[k]!.y) - TRUE[k]![1])).toBeLessThan(1e-7);
    }
    // Σ redundancy numbers = dof, exactly
    let sum = R.zero;
    for (const o of r.observations) sum = R.add(sum, o.redundancy);
    expect(R.toString(sum)).toBe(String(r.dof));
  });
});

describe('adjustNetwork agrees with an independent Gauss–Newton in plain float', () => {
  const obs = observations(1, 7);
  const gn = gaussNewton(
    {
      A: { x: 1000, y: 1000, fixed: true },
      B: { x: 1400, y: 1050, fixed: true },
      C: { x: 1350.4, y: 1419.7 },
      D: { x: 979.8, y: 1380.3 },
      E: { x: 1180.2, y: 1209.9 },
    },
    obs,
  );
  const r = adjustNetwork(F, { points: points(true), observations: obs as never });
  const vtpv = gn.v.reduce((s, v, i) => s + gn.P[i]! * v * v, 0);
  const dof = gn.A.length - gn.u;
  it('coordinates within 1e-9 relative, vᵀPv, dof and residuals', () => {
    for (const k of ['C', 'D', 'E']) {
      expect(Math.abs(r.points[k]!.x - gn.xy.get(k)![0]!)).toBeLessThan(1e-9 * 1400);
      expect(Math.abs(r.points[k]!.y - gn.xy.get(k)![1]!)).toBeLessThan(1e-9 * 1400);
    }
    expect(r.dof).toBe(dof);
    expect(Math.abs(r.vtpv - vtpv)).toBeLessThan(1e-6 * vtpv);
    r.observations.forEach((o, i) => expect(Math.abs(o.residual - gn.v[i]!)).toBeLessThan(1e-6));
  });
  it('σ, redundancy numbers and w from the independent N⁻¹', () => {
    const s02 = vtpv / dof;
    for (const k of ['C', 'D', 'E']) {
      const c = gn.col.get(k)!;
      expect(rootToNumber(F, r.points[k]!.sigmaX)).toBeCloseTo(Math.sqrt(s02 * gn.Ninv[c]![c]!), 9);
      expect(rootToNumber(F, r.points[k]!.sigmaY)).toBeCloseTo(
        Math.sqrt(s02 * gn.Ninv[c + 1]![c + 1]!),
        9,
      );
    }
    r.observations.forEach((o, i) => {
      const a = gn.A[i]!;
      const qadj = math.dot(a, math.multiply(gn.Ninv, a) as number[]) as number;
      const qvv = 1 / gn.P[i]! - qadj;
      expect(o.redundancy).toBeCloseTo(qvv * gn.P[i]!, 9);
      expect(o.standardized as number).toBeCloseTo(gn.v[i]! / Math.sqrt(qvv), 6);
    });
  });
  it('the standard ellipse from the independent cofactors, and its 95 % form', () => {
    const c = gn.col.get('E')!;
    const [qxx, qyy, qxy] = [gn.Ninv[c]![c]!, gn.Ninv[c + 1]![c + 1]!, gn.Ninv[c]![c + 1]!];
    const s02 = vtpv / dof;
    // eigenvalues of the 2 × 2 covariance by mathjs, and the direction of the major axis
    const { values, eigenvectors } = math.eigs([
      [s02 * qxx, s02 * qxy],
      [s02 * qxy, s02 * qyy],
    ]) as unknown as { values: number[]; eigenvectors: { value: number; vector: number[] }[] };
    const big = Math.max(...values);
    const vec = eigenvectors.find((e) => e.value === big)!.vector;
    let az = (Math.atan2(vec[0]!, vec[1]!) * 180) / Math.PI;
    az = ((az % 180) + 180) % 180;
    const e = r.points.E!.ellipse;
    expect(e.major).toBeCloseTo(Math.sqrt(big), 10);
    expect(e.minor).toBeCloseTo(Math.sqrt(Math.min(...values)), 10);
    expect(Math.abs(e.azimuth - az)).toBeLessThan(1e-6);
    // a-posteriori 95 %: √(2·F(2, r, 0.95)) from jstat-independent closed form of F(2, r):
    // P(F ≤ x) = 1 − (1 + 2x/r)^(−r/2) → x = (r/2)·(0.05^(−2/r) − 1)
    const k = Math.sqrt(2 * (dof / 2) * (0.05 ** (-2 / dof) - 1));
    expect(r.points.E!.confidence.factor).toBeCloseTo(k, 9);
    expect(r.points.E!.confidence.major).toBeCloseTo(k * e.major, 12);
  });
  it('the solution of the last step by QR (mathjs qr of √P·A) equals the normal-equation step', () => {
    // One more step from the adjusted coordinates: the corrections are zero either way.
    const sqrtP = gn.P.map(Math.sqrt);
    const rows = gn.A.map((a, i) => a.map((x) => x * sqrtP[i]!));
    const { Q, R: Rm } = math.qr(rows) as unknown as { Q: number[][]; R: number[][] };
    const qtl = math.multiply(
      math.transpose(Q),
      gn.l.map((x, i) => x * sqrtP[i]!),
    ) as number[];
    const n = gn.u;
    const x = math.usolve(
      Rm.slice(0, n).map((row) => row.slice(0, n)),
      qtl.slice(0, n),
    ) as number[][];
    const vq = gn.A.map((a, i) => a.reduce((s, ai, k) => s + ai * x[k]![0]!, 0) - gn.l[i]!);
    r.observations.forEach((o, i) => expect(Math.abs(o.residual - vq[i]!)).toBeLessThan(1e-6));
  });
});

/** A linear (vector-only) network, where the design is constant: identities exactly in rational. */
function vectorNet(seed: number, n: number) {
  const g = lcg(seed);
  const pts: Record<string, { x: string; y: string; fixed?: true }> = {
    P0: { x: '0', y: '0', fixed: true },
  };
  const obs: {
    kind: 'vector';
    from: string;
    to: string;
    dx: string;
    dy: string;
    covariance: string[][];
  }[] = [];
  for (let i = 1; i < n; i++)
    pts[`P${i}`] = { x: String(Math.floor(g.u() * 1000)), y: String(Math.floor(g.u() * 1000)) };
  const add = (a: number, b: number) =>
    obs.push({
      kind: 'vector',
      from: `P${a}`,
      to: `P${b}`,
      dx: (Math.floor(g.u() * 2e6) / 1000 - 1000).toFixed(3),
      dy: (Math.floor(g.u() * 2e6) / 1000 - 1000).toFixed(3),
      covariance: [
        ['0.000004', '0.000001'],
        ['0.000001', '0.000009'],
      ],
    });
  for (let i = 1; i < n; i++) add(Math.floor(g.u() * i), i);
  for (let k = 0; k < n; k++) {
    const a = Math.floor(g.u() * n);
    const b = (a + 1 + Math.floor(g.u() * (n - 1))) % n;
    add(a, b);
  }
  return { points: pts, observations: obs } as unknown as NetworkInput<never>;
}

describe('adjustNetwork in rational: identities hold exactly', () => {
  it('Σ redundancy = dof and Aᵀ·P·v = 0 (vector networks: constant design)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100000 }),
        fc.integer({ min: 2, max: 6 }),
        (seed, n) => {
          const input = vectorNet(seed, n);
          const r = adjustNetwork(R, input);
          let sum = R.zero;
          for (const o of r.observations) sum = R.add(sum, o.redundancy);
          expect(R.toString(sum)).toBe(String(r.dof));
          // P = C⁻¹ with C = [[4, 1], [1, 9]]e-6: P = [[9, −1], [−1, 4]]/35e-6
          const acc = new Map<string, [ReturnType<typeof R.from>, ReturnType<typeof R.from>]>();
          for (let k = 0; k < r.observations.length; k += 2) {
            const vx = r.observations[k]!.residual;
            const vy = r.observations[k + 1]!.residual;
            const s = R.from('35e-6');
            const px = R.div(R.sub(R.mul(R.from(9), vx), vy), s);
            const py = R.div(R.sub(R.mul(R.from(4), vy), vx), s);
            for (const [name, sign] of [
              [r.observations[k]!.to, 1],
              [r.observations[k]!.from, -1],
            ] as const) {
              const c = acc.get(name) ?? [R.zero, R.zero];
              acc.set(name, [
                R.add(c[0], R.mul(R.from(sign), px)),
                R.add(c[1], R.mul(R.from(sign), py)),
              ]);
            }
          }
          for (const [name, [a, b]] of acc)
            if (name !== 'P0') {
              expect(R.toString(a)).toBe('0');
              expect(R.toString(b)).toBe('0');
            }
        },
      ),
      { numRuns: 25 },
    );
  });
  it('adding an observation equal to its adjusted value changes no coordinate; order and names do not matter', () => {
    const input = vectorNet(42, 5);
    const r = adjustNetwork(R, input);
    const dx = R.sub(r.points.P3!.x, r.points.P1!.x);
    const dy = R.sub(r.points.P3!.y, r.points.P1!.y);
    const more = adjustNetwork(R, {
      ...input,
      observations: [
        ...input.observations,
        {
          kind: 'vector',
          from: 'P1',
          to: 'P3',
          dx,
          dy,
          covariance: [
            [1, 0],
            [0, 1],
          ],
        },
      ],
    });
    const renamed = adjustNetwork(R, {
      points: Object.fromEntries(
        Object.entries(input.points)
          .reverse()
          .map(([k, v]) => [`Q-${k}`, v]),
      ),
      observations: [...input.observations].reverse().map((o) => ({
        ...o,
        from: `Q-${(o as { from: string }).from}`,
        to: `Q-${(o as { to: string }).to}`,
      })) as never,
    });
    for (const k of Object.keys(r.points)) {
      expect(R.toString(more.points[k]!.x)).toBe(R.toString(r.points[k]!.x));
      expect(R.toString(more.points[k]!.y)).toBe(R.toString(r.points[k]!.y));
      expect(R.toString(renamed.points[`Q-${k}`]!.x)).toBe(R.toString(r.points[k]!.x));
      expect(renamed.points[`Q-${k}`]!.sigmaX.toString()).toBe(r.points[k]!.sigmaX.toString());
    }
  });
});

describe('adjustNetwork: relative ellipses, scaling, options', () => {
  it("a relative ellipse to a held point equals the point's own ellipse", () => {
    const r = adjustNetwork(F, {
      points: points(true),
      observations: observations(1, 3) as never,
      options: { relative: [['A', 'E']] },
    });
    expect(r.relative[0]!.major).toBeCloseTo(r.points.E!.ellipse.major, 12);
    expect(r.relative[0]!.azimuth).toBeCloseTo(r.points.E!.ellipse.azimuth, 9);
  });
  it('a-priori scaling uses σ0 and the χ²(2) factor 2.4477', () => {
    const r = adjustNetwork(F, {
      points: points(true),
      observations: observations(1, 3) as never,
      options: { scale: 'a-priori' },
    });
    const p = adjustNetwork(F, { points: points(true), observations: observations(1, 3) as never });
    expect(r.points.E!.confidence.factor.toFixed(4)).toBe('2.4477');
    expect(rootToNumber(F, p.points.E!.sigmaX)).toBeCloseTo(
      rootToNumber(F, r.points.E!.sigmaX) * rootToNumber(F, p.sigma0!),
      12,
    );
  });
});

describe('adjustNetwork refuses bad input with typed errors', () => {
  const base = { points: points(true), observations: observations(0) as never[] };
  const msg = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      return `${(e as QuadspreadError).code}: ${(e as Error).message}`;
    }
    return 'no error';
  };
  it.each([
    [
      'an unknown point',
      {
        ...base,
        observations: [
          ...base.observations,
          { kind: 'distance', from: 'A', to: 'Z', value: 1, sigma: 1 },
        ],
      },
      /UNKNOWN_POINT.*"Z"/,
    ],
    [
      'no fixed point',
      { ...base, points: { ...base.points, A: { x: 1000, y: 1000 }, B: { x: 1400, y: 1050 } } },
      /DATUM_DEFECT/,
    ],
    [
      'a datum defect (one point, no orientation)',
      {
        points: { A: { x: 0, y: 0, fixed: true }, B: { x: 10, y: 0 }, C: { x: 0, y: 10 } },
        observations: [
          { kind: 'distance', from: 'A', to: 'B', value: 10, sigma: 0.01 },
          { kind: 'distance', from: 'A', to: 'C', value: 10, sigma: 0.01 },
          { kind: 'distance', from: 'B', to: 'C', value: 14.142, sigma: 0.01 },
        ],
      },
      /SINGULAR_NETWORK/,
    ],
    [
      'a disconnected point',
      { ...base, points: { ...base.points, F: { x: 0, y: 0 } } },
      /DISCONNECTED_NETWORK.*"F"/,
    ],
    [
      'a zero sigma',
      { ...base, observations: [{ kind: 'distance', from: 'A', to: 'C', value: 100, sigma: 0 }] },
      /INVALID_SIGMA/,
    ],
    [
      'a negative sigma',
      { ...base, observations: [{ kind: 'bearing', from: 'A', to: 'C', value: 10, sigma: -1 }] },
      /INVALID_SIGMA/,
    ],
    [
      'an observation to itself',
      { ...base, observations: [{ kind: 'distance', from: 'C', to: 'C', value: 1, sigma: 1 }] },
      /INVALID_ARGUMENT.*itself/,
    ],
    [
      'a round of one direction',
      {
        ...base,
        observations: [
          ...base.observations,
          { kind: 'direction', at: 'C', to: 'D', value: 1, sigma: 1 },
        ],
      },
      /TOO_FEW_OBSERVATIONS.*"C"/,
    ],
    [
      'a point that cannot be placed',
      {
        points: { A: { x: 0, y: 0, fixed: true }, B: { x: 10, y: 0, fixed: true }, C: {} },
        observations: [
          { kind: 'distance', from: 'A', to: 'C', value: 5, sigma: 0.01 },
          { kind: 'distance', from: 'B', to: 'C', value: 7, sigma: 0.01 },
        ],
      },
      /NO_APPROXIMATION.*"C"/,
    ],
    [
      'non-convergence',
      {
        ...base,
        options: { maxIterations: 1 },
        points: { ...base.points, E: { x: 5000, y: -3000 } },
      },
      /NOT_CONVERGED/,
    ],
    [
      'a bad covariance',
      {
        ...base,
        observations: [
          {
            kind: 'vector',
            from: 'A',
            to: 'C',
            dx: 1,
            dy: 1,
            covariance: [
              [1, 2],
              [2, 1],
            ],
          },
        ],
      },
      /INVALID_COVARIANCE/,
    ],
    [
      'a bad kind',
      { ...base, observations: [{ kind: 'height', from: 'A', to: 'C' }] },
      /INVALID_ARGUMENT.*kind/,
    ],
  ])('%s', (_n, input, pattern) => {
    expect(msg(() => adjustNetwork(F, input as never))).toMatch(pattern);
  });
});
