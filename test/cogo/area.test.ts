import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { create, all } from 'mathjs';
import { rational, area, perimeter, convertArea, polygonArea } from '../../src/index.js';

/** Rational text n/d with small integers. */
const ratText = fc
  .tuple(fc.integer({ min: -1_000_000, max: 1_000_000 }), fc.integer({ min: 1, max: 1000 }))
  .map(([n, d]) => `${n}/${d}`);
const pointText = fc.record({ x: ratText, y: ratText });

describe.each(kinds)('area(%s, points)', (_name, A) => {
  // Derived: a 30 × 20 rectangle has area 600 and perimeter 100; a 3-4-5 right triangle area 6.
  const table = [
    {
      pts: [
        { x: 0, y: 0 },
        { x: 30, y: 0 },
        { x: 30, y: 20 },
        { x: 0, y: 20 },
      ],
      area: 600,
      perimeter: 100,
    },
    {
      pts: [
        { x: 0, y: 0 },
        { x: 0, y: 20 },
        { x: 30, y: 20 },
        { x: 30, y: 0 },
      ],
      area: -600,
      perimeter: 100,
    },
    {
      pts: [
        { x: 5, y: 5 },
        { x: 9, y: 5 },
        { x: 9, y: 8 },
      ],
      area: 6,
      perimeter: 12,
    },
    {
      pts: [
        { x: 0, y: 0 },
        { x: 1, y: 1 },
        { x: 2, y: 2 },
      ],
      area: 0,
      perimeter: 4 * Math.SQRT2,
    },
  ];
  it.each(table)(
    'is $area for a polygon with perimeter $perimeter',
    ({ pts, area: want, perimeter: per }) => {
      expect(A.toNumber(area(A, pts))).toBe(want);
      expect(Math.abs(A.toNumber(perimeter(A, pts)) - per)).toBeLessThan(1e-12);
    },
  );

  it('refuses fewer than three vertices with TOO_FEW_POINTS naming the input', () => {
    expect(
      code(() =>
        area(A, [
          { x: 0, y: 0 },
          { x: 1, y: 1 },
        ]),
      ),
    ).toBe('TOO_FEW_POINTS');
    expect(() => area(A, [])).toThrow(/area\(A, points\).*at least 3 vertices, got 0/);
  });

  it('refuses a vertex that is not a point, or a coordinate that is not a number', () => {
    expect(code(() => area(A, 'abc' as never))).toBe('INVALID_ARGUMENT');
    expect(code(() => area(A, [{ x: 0, y: 0 }, { x: 1, y: 0 }, null as never]))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      code(() =>
        area(A, [
          { x: 0, y: 0 },
          { x: 1, y: 0 },
          { x: 'one', y: 2 },
        ]),
      ),
    ).toBe('INVALID_NUMBER');
    expect(
      code(() =>
        area(A, [
          { x: 0, y: 0 },
          { x: 1, y: 0 },
          { x: NaN, y: 2 },
        ]),
      ),
    ).toBe('INVALID_NUMBER');
  });
});

describe('area(rational, points) properties (fast-check, exact)', () => {
  it('is invariant under a rational translation', () => {
    fc.assert(
      fc.property(
        fc.array(pointText, { minLength: 3, maxLength: 12 }),
        ratText,
        ratText,
        (pts, dx, dy) => {
          const A = rational;
          const moved = pts.map((p) => ({
            x: A.add(A.from(p.x), A.from(dx)),
            y: A.add(A.from(p.y), A.from(dy)),
          }));
          expect(A.eq(area(A, pts), area(A, moved))).toBe(true);
        },
      ),
    );
  });

  it('changes sign when the vertex order is reversed', () => {
    fc.assert(
      fc.property(fc.array(pointText, { minLength: 3, maxLength: 12 }), (pts) => {
        const A = rational;
        expect(A.eq(area(A, pts), A.neg(area(A, [...pts].reverse())))).toBe(true);
      }),
    );
  });

  it('equals the untranslated shoelace sum Σ(xᵢyᵢ₊₁ − xᵢ₊₁yᵢ)/2 computed with fraction.js', () => {
    fc.assert(
      fc.property(fc.array(pointText, { minLength: 3, maxLength: 12 }), (pts) => {
        let s = new Fraction(0);
        for (let i = 0; i < pts.length; i++) {
          const p = pts[i]!;
          const q = pts[(i + 1) % pts.length]!;
          s = s.add(new Fraction(p.x).mul(q.y)).sub(new Fraction(q.x).mul(p.y));
        }
        expect(rational.toString(area(rational, pts))).toBe(s.div(2).toFraction());
      }),
    );
  });
});

describe('perimeter(rational, points)', () => {
  it('is within 1e-40 relative of √2 + √5 + 3 for the triangle (0,0), (1,1), (3,0) (mathjs BigNumber, 60 digits)', () => {
    const M = create(all!, { number: 'BigNumber', precision: 60 });
    const want = M.bignumber(2).sqrt().add(M.bignumber(5).sqrt()).add(3);
    const got = M.bignumber(
      rational.toPrecision(
        perimeter(rational, [
          { x: 0, y: 0 },
          { x: 1, y: 1 },
          { x: 3, y: 0 },
        ]),
        60,
      ),
    );
    expect(got.sub(want).abs().div(want).lt(M.bignumber('1e-40'))).toBe(true);
  });
});

describe('convertArea(A, value, from, to) and polygonArea', () => {
  it('uses the exact factors: acre = 43,560 ft², 1 ha = 10,000 m², ft = 0.3048 m', () => {
    expect(rational.toString(convertArea(rational, 1, 'acre', 'ft2'))).toBe('43560');
    expect(rational.toString(convertArea(rational, 1, 'ha', 'm2'))).toBe('10000');
    expect(rational.toString(convertArea(rational, 1, 'ft2', 'm2'))).toBe(
      new Fraction('0.3048').pow(2).toFraction(),
    );
  });

  it('makes a U.S. survey acre (500000/499999)² international acres exactly (Federal Register 85(193), 2020; derived)', () => {
    expect(rational.toString(convertArea(rational, 1, 'us-acre', 'acre'))).toBe(
      new Fraction(500000, 499999).pow(2).toFraction(),
    );
  });

  it('refuses an unknown unit with INVALID_UNIT', () => {
    expect(code(() => convertArea(rational, 1, 'sqmi' as never, 'm2'))).toBe('INVALID_UNIT');
    expect(
      code(() =>
        polygonArea(
          rational,
          [
            { x: 0, y: 0 },
            { x: 1, y: 0 },
            { x: 0, y: 1 },
          ],
          { unit: 'yd' as never },
        ),
      ),
    ).toBe('INVALID_UNIT');
  });

  it('refuses options that are not an object with INVALID_ARGUMENT (not a TypeError)', () => {
    expect(
      code(() =>
        polygonArea(
          rational,
          [
            { x: 0, y: 0 },
            { x: 1, y: 0 },
            { x: 0, y: 1 },
          ],
          null as never,
        ),
      ),
    ).toBe('INVALID_ARGUMENT');
  });

  it('reports a 66 ft × 660 ft rectangle (one furlong by one chain) as 1 acre, counterclockwise', () => {
    const r = polygonArea(
      rational,
      [
        { x: 0, y: 0 },
        { x: 66, y: 0 },
        { x: 66, y: 660 },
        { x: 0, y: 660 },
      ],
      { unit: 'ft' },
    );
    expect(r.orientation).toBe('counterclockwise');
    expect(rational.toString(r.acres)).toBe('1');
    expect(rational.toString(r.perimeter)).toBe('1452');
  });
});
