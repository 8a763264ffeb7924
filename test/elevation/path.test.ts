// pathGrade and pathOffset: a path across a plane slope.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';
import { pathGrade, pathOffset } from '../../src/elevation/path.js';

const R = rational;
const codeOf = (f: () => unknown): string | undefined => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : 'NOT A QUADSPREAD ERROR';
  }
  return undefined;
};
const spread = fc
  .tuple(fc.integer({ min: 0, max: 10 ** 6 }), fc.integer({ min: 0, max: 10 ** 6 }))
  .map(([a, b]) => (a + b === 0 ? R.zero : R.from(`${Math.min(a, b)}/${Math.max(a, b)}`)));

describe('pathGrade(A, { fall, offset, measured })', () => {
  it("is 3/19 for fall 1/5, offset 1/4 on the plan (the issue's acceptance case), and 3/20 in the face", () => {
    expect(R.toString(pathGrade(R, { fall: '1/5', offset: '1/4', measured: 'plan' }))).toBe('3/19');
    expect(R.toString(pathGrade(R, { fall: '1/5', offset: '1/4', measured: 'face' }))).toBe('3/20');
  });
  it('is the fall itself along the fall line and 0 along the contour, both ways', () => {
    for (const m of ['face', 'plan'] as const) {
      expect(R.toString(pathGrade(R, { fall: '2/7', offset: 0, measured: m }))).toBe('2/7');
      expect(R.toString(pathGrade(R, { fall: '2/7', offset: 1, measured: m }))).toBe('0');
    }
  });
  it('agrees with classical 3-D vectors in float: plan angle β (Math.cos, Math.tan) and face angle γ', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 90, noNaN: true }),
        (phiDeg, angDeg) => {
          const phi = (phiDeg * Math.PI) / 180,
            a = (angDeg * Math.PI) / 180;
          const S = Math.sin(phi) ** 2,
            Roff = Math.sin(a) ** 2;
          // plan: direction (cos β, sin β) on the map climbs tan φ·cos β per unit run
          const dz = Math.tan(phi) * Math.cos(a);
          const Uplan = dz ** 2 / (1 + dz ** 2);
          // face: unit vector cos γ·(fall line) + sin γ·(contour); its vertical component is sin φ·cos γ
          const fallLine = [Math.cos(phi), 0, Math.sin(phi)],
            contour = [0, 1, 0];
          const d = fallLine.map((x, i) => Math.cos(a) * x + Math.sin(a) * contour[i]!);
          const Uface = d[2]! ** 2 / (d[0]! ** 2 + d[1]! ** 2 + d[2]! ** 2);
          expect(
            Math.abs(pathGrade(float, { fall: S, offset: Roff, measured: 'plan' }) - Uplan),
          ).toBeLessThan(1e-12);
          expect(
            Math.abs(pathGrade(float, { fall: S, offset: Roff, measured: 'face' }) - Uface),
          ).toBeLessThan(1e-12);
        },
      ),
    );
  });
  it('the plan grade is never below the face grade for the same offset spread (derived: 1 − S·R ≤ 1)', () => {
    fc.assert(
      fc.property(spread, spread, (S, Rr) => {
        fc.pre(!(R.eq(S, R.one) && R.eq(Rr, R.one)));
        expect(
          R.cmp(
            pathGrade(R, { fall: S, offset: Rr, measured: 'plan' }),
            pathGrade(R, { fall: S, offset: Rr, measured: 'face' }),
          ),
        ).toBeGreaterThanOrEqual(0);
      }),
    );
  });
});

describe('pathOffset inverts pathGrade', () => {
  it('pathOffset(pathGrade(x)) = x exactly in rational, both ways of measuring', () => {
    fc.assert(
      fc.property(
        spread,
        spread,
        fc.constantFrom('face', 'plan') as fc.Arbitrary<'face' | 'plan'>,
        (S, Rr, m) => {
          fc.pre(!R.isZero(S) && !R.eq(S, R.one));
          const U = pathGrade(R, { fall: S, offset: Rr, measured: m });
          expect(R.eq(pathOffset(R, { fall: S, grade: U, measured: m }), Rr)).toBe(true);
        },
      ),
    );
  });
  it('pathGrade(pathOffset(U)) = U in float and decimal within 1e-12', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (S, t) => {
          for (const A of [float, decimal(30)] as Arithmetic<unknown>[]) {
            const U = A.mul(A.from(S), A.from(t));
            for (const m of ['face', 'plan'] as const) {
              const back = pathGrade(A, {
                fall: S,
                offset: pathOffset(A, { fall: S, grade: U, measured: m }),
                measured: m,
              });
              expect(Math.abs(A.toNumber(back) - A.toNumber(U))).toBeLessThan(1e-12);
            }
          }
        },
      ),
      { numRuns: 50 },
    );
  });
  it('a grade steeper than the slope is refused with GRADE_STEEPER_THAN_SLOPE naming both', () => {
    expect(codeOf(() => pathOffset(R, { fall: '1/26', grade: '1/20', measured: 'plan' }))).toBe(
      'GRADE_STEEPER_THAN_SLOPE',
    );
    expect(() => pathOffset(R, { fall: '1/26', grade: '1/20', measured: 'face' })).toThrow(
      /1\/20.*1\/26/,
    );
  });
  it('unknown measured values, spreads outside [0, 1] and a level plane are refused', () => {
    expect(
      codeOf(() => pathGrade(R, { fall: '1/5', offset: '1/4', measured: 'map' as never })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() => pathOffset(R, { fall: '1/5', grade: '1/9', measured: undefined as never })),
    ).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pathGrade(R, { fall: '6/5', offset: '1/4', measured: 'face' }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
    expect(codeOf(() => pathGrade(R, { fall: '1/5', offset: -1, measured: 'face' }))).toBe(
      'SPREAD_OUT_OF_RANGE',
    );
    expect(codeOf(() => pathOffset(R, { fall: 0, grade: 0, measured: 'plan' }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(codeOf(() => pathGrade(R, { fall: 1, offset: 1, measured: 'plan' }))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});
