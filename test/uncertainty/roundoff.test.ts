// Round-off of float against exact rational on ill-conditioned inputs. Each bound is a
// first-order rounding-error bound derived in docs/uncertainty.md (after Higham, *Accuracy
// and Stability of Numerical Algorithms*, 2nd ed., SIAM 2002, §2.2 and ch. 3: every float
// operation is exact times (1 + δ), |δ| ≤ u = 2⁻⁵³, and reading a decimal is one more
// rounding). The tests check the bounds on random ill-conditioned cases; inputs are decimal
// text, read by both arithmetics.
import { solveTriangle } from '../../src/readings/triangle-readings.js';
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { quadrance, spread, cross, quadrea, triangle } from '../../src/geometry/index.js';
import { rational, float } from '../../src/arithmetic/index.js';
import { heightFromReading } from '../../src/elevation/height.js';
import { area } from '../../src/cogo/area.js';
import { roundOff } from '../../src/uncertainty/roundoff.js';

const u = 2 ** -53;
const SLACK = 1 + 1e-6; // room for the second-order terms the bounds leave out

const mm = (x: number) => x.toFixed(3); // a coordinate reading to the millimetre, as text
const pt = <T>(A: Arithmetic<T>, p: readonly [string, string]) => ({
  x: A.from(p[0]),
  y: A.from(p[1]),
});

/** Far-away points with small differences: a base up to 10⁷ m, offsets 1 mm to 100 m. */
const far = fc
  .record({
    X: fc.integer({ min: 0, max: 10_000_000 }),
    Y: fc.integer({ min: 0, max: 10_000_000 }),
    dx: fc.integer({ min: -100_000, max: 100_000 }),
    dy: fc.integer({ min: -100_000, max: 100_000 }),
  })
  .filter((r) => r.dx !== 0 || r.dy !== 0);

describe('round-off of quadrance(float) far from the origin', () => {
  it('quadrance of points at up to 10⁷ m with differences D ≥ 1 mm has relative error ≤ 3u(2M/D + 2)', () => {
    fc.assert(
      fc.property(
        far,
        fc.integer({ min: 0, max: 999 }),
        fc.integer({ min: 0, max: 999 }),
        ({ X, Y, dx, dy }, fx, fy) => {
          const P = [mm(X + fx / 1000), mm(Y + fy / 1000)] as const;
          const Q = [mm(X + fx / 1000 + dx / 1000), mm(Y + fy / 1000 + dy / 1000)] as const;
          const r = roundOff((A) => quadrance(A, pt(A, P), pt(A, Q)));
          const M = Math.max(...[...P, ...Q].map((t) => Math.abs(Number(t))));
          const D = Math.hypot(dx, dy) / 1000;
          expect(r.relative!).toBeLessThanOrEqual(3 * u * ((2 * M) / D + 2) * SLACK);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('the same quadrance from coordinates reduced to a local origin (exactly, in the text) has relative error ≤ 6u', () => {
    fc.assert(
      fc.property(far, ({ dx, dy }) => {
        const r = roundOff((A) =>
          quadrance(A, pt(A, ['0.000', '0.000']), pt(A, [mm(dx / 1000), mm(dy / 1000)])),
        );
        expect(r.relative!).toBeLessThanOrEqual(6 * u);
      }),
      { numRuns: 200 },
    );
  });
});

/** The first-order bound on the relative error of spread() or cross() (docs/uncertainty.md). */
function spreadBound(
  V: readonly string[],
  P: readonly string[],
  Q: readonly string[],
  kind: 'spread' | 'cross',
): number {
  const n = (t: string) => Number(t);
  const ux = n(P[0]!) - n(V[0]!);
  const uy = n(P[1]!) - n(V[1]!);
  const vx = n(Q[0]!) - n(V[0]!);
  const vy = n(Q[1]!) - n(V[1]!);
  const M = Math.max(...[...V, ...P, ...Q].map((t) => Math.abs(n(t))));
  const Delta = Math.max(Math.abs(ux), Math.abs(uy), Math.abs(vx), Math.abs(vy));
  const e = u * (2 * M + Delta); // error of one coordinate difference
  const top = kind === 'spread' ? ux * vy - uy * vx : ux * vx + uy * vy;
  const terms =
    kind === 'spread'
      ? Math.abs(ux * vy) + Math.abs(uy * vx)
      : Math.abs(ux * vx) + Math.abs(uy * vy);
  const dTop = e * (Math.abs(ux) + Math.abs(uy) + Math.abs(vx) + Math.abs(vy)) + 2 * u * terms;
  const qu = ux * ux + uy * uy;
  const qv = vx * vx + vy * vy;
  const relQ = (a: number, b: number, q: number) =>
    (2 * e * (Math.abs(a) + Math.abs(b))) / q + 2 * u;
  return (2 * dTop) / Math.abs(top) + relQ(ux, uy, qu) + relQ(vx, vy, qv) + 3 * u;
}

/** Nearly collinear (small angle θ at V) or nearly perpendicular (θ near 90°) sights, far away. */
const sights = (near: 0 | 90) =>
  fc
    .record({
      X: fc.integer({ min: 0, max: 1_000_000 }),
      Y: fc.integer({ min: 0, max: 10_000_000 }),
      L1: fc.integer({ min: 10, max: 5000 }),
      L2: fc.integer({ min: 10, max: 5000 }),
      phi: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
      k: fc.integer({ min: 1, max: 6 }),
      m: fc.integer({ min: 1, max: 9 }),
    })
    .map(({ X, Y, L1, L2, phi, k, m }) => {
      const theta = (near === 0 ? 0 : Math.PI / 2) + m * 10 ** -k; // 1e-6 … 0.9 rad from the limit
      const V = [mm(X), mm(Y)];
      const P = [mm(X + L1 * Math.cos(phi)), mm(Y + L1 * Math.sin(phi))];
      const Q = [mm(X + L2 * Math.cos(phi + theta)), mm(Y + L2 * Math.sin(phi + theta))];
      return { V, P, Q };
    });

describe('round-off of spread(float) and cross(float) near 0 and 1', () => {
  it('spread of nearly collinear far-away sights stays within the first-order bound (grows like 1/θ)', () => {
    fc.assert(
      fc.property(sights(0), ({ V, P, Q }) => {
        const r = roundOff((A) =>
          spread(A, pt(A, V as never), pt(A, P as never), pt(A, Q as never)),
        );
        fc.pre(r.relative !== undefined);
        expect(r.relative!).toBeLessThanOrEqual(spreadBound(V, P, Q, 'spread') * SLACK);
      }),
      { numRuns: 300 },
    );
  });

  it('cross of nearly perpendicular far-away sights stays within the same bound with the dot product', () => {
    fc.assert(
      fc.property(sights(90), ({ V, P, Q }) => {
        const r = roundOff((A) =>
          cross(A, pt(A, V as never), pt(A, P as never), pt(A, Q as never)),
        );
        fc.pre(r.relative !== undefined);
        expect(r.relative!).toBeLessThanOrEqual(spreadBound(V, P, Q, 'cross') * SLACK);
      }),
      { numRuns: 300 },
    );
  });

  it('near 90°, cross() is stable and 1 − spread() is not: relative errors below 10u against above 1e-6', () => {
    const V = ['0', '0'] as const;
    const P = ['1', '0'] as const;
    const Q = ['0.000001', '1'] as const; // cross = 1e-12/(1 + 1e-12)
    const direct = roundOff((A) => cross(A, pt(A, V), pt(A, P), pt(A, Q)));
    const viaSpread = roundOff((A) => A.sub(A.one, spread(A, pt(A, V), pt(A, P), pt(A, Q))));
    expect(direct.relative!).toBeLessThan(10 * u);
    expect(viaSpread.relative!).toBeGreaterThan(1e-6);
  });
});

describe('round-off of the quadrea of a needle triangle', () => {
  /** A needle triangle: a long side, a small height h, as coordinates to the millimetre. */
  const needle = fc
    .record({
      L: fc.integer({ min: 10, max: 10000 }),
      t: fc.integer({ min: 1, max: 999 }),
      hmm: fc.integer({ min: 1, max: 1000 }),
    })
    .map(
      ({ L, t, hmm }) =>
        [
          ['0.000', '0.000'],
          [mm(L), '0.000'],
          [mm((L * t) / 1000), mm(hmm / 1000)],
        ] as const,
    );

  it('quadrea(Q1, Q2, Q3) (Archimedes) from decimal quadrances stays within u(6S² + 8ΣQ² + |A|) + uΣ|2S − 4Qᵢ|Qᵢ', () => {
    fc.assert(
      fc.property(needle, ([p1, p2, p3]) => {
        // the quadrances as exact decimal text (coordinates to the mm give Q to 1e-6 m²)
        const q = (a: readonly string[], b: readonly string[]) => {
          const dx = BigInt(Math.round(Number(b[0]) * 1000) - Math.round(Number(a[0]) * 1000));
          const dy = BigInt(Math.round(Number(b[1]) * 1000) - Math.round(Number(a[1]) * 1000));
          const n = dx * dx + dy * dy;
          return `${n}e-6`;
        };
        const Qs = [q(p2, p3), q(p1, p3), q(p1, p2)];
        const r = roundOff((A) => quadrea(A, Qs[0]!, Qs[1]!, Qs[2]!));
        const Qn = Qs.map(Number);
        const S = Qn[0]! + Qn[1]! + Qn[2]!;
        const sq = Qn.reduce((s, x) => s + x * x, 0);
        const Aexact = Number(r.exact.valueOf());
        const bound =
          u * (6 * S * S + 8 * sq + Math.abs(Aexact)) +
          u * Qn.reduce((s, x) => s + Math.abs(2 * S - 4 * x) * x, 0);
        expect(r.absolute).toBeLessThanOrEqual(bound * SLACK);
      }),
      { numRuns: 300 },
    );
  });

  it('triangle(A, …).quadrea from the coordinates is far more accurate on needles than Archimedes from quadrances', () => {
    // A 10 km side, 1 to 4 mm off line: the quadrea from quadrances cancels about 16 digits
    // and here even comes out negative (−4 against the exact 0.8155…).
    const pts = [
      ['0', '0'],
      ['10000.017', '0.004'],
      ['3137.123', '0.0013'],
    ] as const;
    const fromXY = roundOff(
      (A) => triangle(A, pt(A, pts[0]), pt(A, pts[1]), pt(A, pts[2])).quadrea,
    );
    const fromQ = roundOff((A) => {
      const t = triangle(A, pt(A, pts[0]), pt(A, pts[1]), pt(A, pts[2]));
      return quadrea(A, t.Q1, t.Q2, t.Q3);
    });
    expect(fromXY.relative!).toBeLessThan(1e-12);
    expect(fromQ.relative!).toBeGreaterThan(1);
    expect(fromQ.float).toBeLessThan(0);
  });
});

describe('round-off of solveTriangle(float) from three quadrances of a needle', () => {
  it('solveTriangle finds the needle in rational but may find no triangle in float: the quadrea rounds to ≤ 0', () => {
    const pts = [
      ['0', '0'],
      ['10000.017', '0.004'],
      ['3137.123', '0.0013'],
    ] as const;
    const t = triangle(rational, pt(rational, pts[0]), pt(rational, pts[1]), pt(rational, pts[2]));
    const Q = {
      Q1: rational.toString(t.Q1),
      Q2: rational.toString(t.Q2),
      Q3: rational.toString(t.Q3),
    };
    const exact = solveTriangle(rational, Q);
    expect(exact.length).toBe(1);
    expect(exact[0]!.quadrea.eq(t.quadrea)).toBe(true);
    // in float the same quadrances give Archimedes' function −4 (see above): no proper triangle
    expect(quadrea(float, Q.Q1, Q.Q2, Q.Q3)).toBeLessThanOrEqual(0);
    expect(solveTriangle(float, Q)).toEqual([]);
  });
});

describe('round-off of heightFromReading(float) for steep sights (R near 1)', () => {
  it('H = Q·R/(1 − R) from decimal Q and R has relative error ≤ u(6 + R/(1 − R))', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100000 }),
        fc.integer({ min: 1, max: 14 }),
        fc.integer({ min: 1, max: 9 }),
        (qcm, k, m) => {
          const Q = (qcm / 100).toFixed(2);
          const R = (1 - m * 10 ** -k).toFixed(k + 1); // 0.9…, text
          const r = roundOff((A) => heightFromReading(A, { horizontal: Q, vertical: R }));
          const Rn = Number(R);
          expect(r.relative!).toBeLessThanOrEqual(u * (6 + Rn / (1 - Rn)) * SLACK);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('round-off of area(float) (shoelace about the first vertex) far from the origin', () => {
  it('the area of a polygon at up to 10⁷ m stays within e·Σ(|eₓ| + |e_y| + |fₓ| + |f_y|)/2 + γₙ₊₂·Σ(|eₓf_y| + |fₓe_y|)/2', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10_000_000 }),
        fc.integer({ min: 0, max: 10_000_000 }),
        fc.array(
          fc.tuple(
            fc.integer({ min: -500_000, max: 500_000 }),
            fc.integer({ min: -500_000, max: 500_000 }),
          ),
          { minLength: 3, maxLength: 12 },
        ),
        (X, Y, offs) => {
          const pts = offs.map(([dx, dy]) => [mm(X + dx / 1000), mm(Y + dy / 1000)] as const);
          const r = roundOff((A) =>
            area(
              A,
              pts.map((p) => pt(A, p)),
            ),
          );
          const n = (t: string) => Number(t);
          const M = Math.max(...pts.flat().map((t) => Math.abs(n(t))));
          const d = pts.map((p) => [n(p[0]) - n(pts[0]![0]), n(p[1]) - n(pts[0]![1])] as const);
          const Delta = Math.max(...d.flat().map(Math.abs));
          const e = u * (2 * M + Delta); // error of one coordinate difference
          let first = 0;
          let terms = 0;
          for (let i = 2; i < d.length; i++) {
            const [ex, ey] = d[i - 1]!;
            const [fx, fy] = d[i]!;
            first += e * (Math.abs(ex) + Math.abs(ey) + Math.abs(fx) + Math.abs(fy));
            terms += Math.abs(ex * fy) + Math.abs(fx * ey);
          }
          const gamma = ((d.length + 2) * u) / (1 - (d.length + 2) * u); // γₙ (Higham §3.1): products, differences, the sum
          expect(r.absolute).toBeLessThanOrEqual(((first + gamma * terms) / 2) * SLACK);
        },
      ),
      { numRuns: 300 },
    );
  });
});
