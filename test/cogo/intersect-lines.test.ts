import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import { rational, float, intersectLines, QuadspreadError } from '../../src/index.js';

const ratText = fc
  .tuple(fc.integer({ min: -100_000, max: 100_000 }), fc.integer({ min: 1, max: 500 }))
  .map(([n, d]) => `${n}/${d}`);
const pointText = fc.record({ x: ratText, y: ratText });

describe.each(kinds)('intersectLines(%s, P1, P2, P3, P4)', (_name, A) => {
  it('finds (3/2, 3/2) where y = x meets x + y = 3 (derived by hand)', () => {
    const p = intersectLines(A, { x: 0, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 3 }, { x: 3, y: 0 });
    expect(A.toNumber(p.x)).toBe(1.5);
    expect(A.toNumber(p.y)).toBe(1.5);
  });

  it('finds a meeting point beyond both segments', () => {
    const p = intersectLines(A, { x: 0, y: 0 }, { x: 1, y: 0 }, { x: 10, y: 5 }, { x: 10, y: 6 });
    expect(A.toNumber(p.x)).toBe(10);
    expect(A.toNumber(p.y)).toBe(0);
  });

  it('refuses parallel lines with PARALLEL_LINES', () => {
    expect(
      code(() => intersectLines(A, { x: 0, y: 0 }, { x: 1, y: 2 }, { x: 5, y: 0 }, { x: 7, y: 4 })),
    ).toBe('PARALLEL_LINES');
    expect(() =>
      intersectLines(A, { x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }, { x: 3, y: 3 }),
    ).toThrow(/parallel/);
  });

  it('refuses a line through two coincident points with COINCIDENT_POINTS naming them', () => {
    expect(
      code(() => intersectLines(A, { x: 1, y: 1 }, { x: 1, y: 1 }, { x: 0, y: 3 }, { x: 3, y: 0 })),
    ).toBe('COINCIDENT_POINTS');
    expect(() =>
      intersectLines(A, { x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 0 }, { x: 2, y: 0 }),
    ).toThrow(/P3 and P4/);
  });
});

describe('intersectLines(rational, …) properties (fast-check)', () => {
  it('gives a point on both lines exactly (zero cross products)', () => {
    fc.assert(
      fc.property(pointText, pointText, pointText, pointText, (p1, p2, p3, p4) => {
        const A = rational;
        const [a, b, c, d] = [p1, p2, p3, p4].map((p) => ({ x: A.from(p.x), y: A.from(p.y) }));
        const cross = (u: typeof a, v: typeof a, w: typeof a) =>
          A.sub(
            A.mul(A.sub(v!.x, u!.x), A.sub(w!.y, u!.y)),
            A.mul(A.sub(v!.y, u!.y), A.sub(w!.x, u!.x)),
          );
        let p;
        try {
          p = intersectLines(A, a!, b!, c!, d!);
        } catch (e) {
          // Only degenerate input may be refused: the directions really are parallel or empty.
          expect(e).toBeInstanceOf(QuadspreadError);
          expect(
            A.isZero(
              A.sub(
                A.mul(A.sub(b!.x, a!.x), A.sub(d!.y, c!.y)),
                A.mul(A.sub(b!.y, a!.y), A.sub(d!.x, c!.x)),
              ),
            ),
          ).toBe(true);
          return;
        }
        expect(A.isZero(cross(a, b, p))).toBe(true);
        expect(A.isZero(cross(c, d, p))).toBe(true);
      }),
    );
  });

  it('agrees in float with the classical determinant formula within 1e-6 of the coordinate scale', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e4, max: 1e4, noNaN: true }), { minLength: 8, maxLength: 8 }),
        (v) => {
          const [x1, y1, x2, y2, x3, y3, x4, y4] = v as [
            number,
            number,
            number,
            number,
            number,
            number,
            number,
            number,
          ];
          const den = (x1 - x2) * (y3 - y4) - (y1 - y2) * (x3 - x4);
          fc.pre(
            Math.abs(den) >
              1e-3 * (1 + Math.hypot(x1 - x2, y1 - y2) * Math.hypot(x3 - x4, y3 - y4)),
          );
          // Textbook determinant form of the line–line intersection (independent of the code's Cramer form).
          const px = ((x1 * y2 - y1 * x2) * (x3 - x4) - (x1 - x2) * (x3 * y4 - y3 * x4)) / den;
          const py = ((x1 * y2 - y1 * x2) * (y3 - y4) - (y1 - y2) * (x3 * y4 - y3 * x4)) / den;
          const p = intersectLines(
            float,
            { x: x1, y: y1 },
            { x: x2, y: y2 },
            { x: x3, y: y3 },
            { x: x4, y: y4 },
          );
          const scale = 1 + Math.abs(px) + Math.abs(py);
          expect(Math.abs(p.x - px) / scale).toBeLessThan(1e-6);
          expect(Math.abs(p.y - py) / scale).toBeLessThan(1e-6);
        },
      ),
    );
  });
});
