import { describe, expect, it } from 'vitest';
import { code, kinds } from '../geometry/helpers.js';
import fc from 'fast-check';
import {
  rational,
  float,
  traverse,
  angularMisclosure,
  bearingToAzimuth,
  rootToString,
  QuadspreadError,
} from '../../src/index.js';

const ratText = fc
  .tuple(fc.integer({ min: -1_000_000, max: 1_000_000 }), fc.integer({ min: 1, max: 1000 }))
  .map(([n, d]) => `${n}/${d}`);
const latDep = fc.record({ latitude: ratText, departure: ratText });

describe('traverse(rational, …) properties (fast-check, exact)', () => {
  const A = rational;
  it('has zero misclosure exactly, no ratio and unchanged points, when rational latitudes/departures close', () => {
    fc.assert(
      fc.property(
        fc.array(latDep, { minLength: 1, maxLength: 15 }),
        fc.record({ x: ratText, y: ratText }),
        fc.constantFrom('compass', 'transit'),
        (cs, start, rule) => {
          let n = A.zero;
          let e = A.zero;
          for (const c of cs) {
            n = A.add(n, A.from(c.latitude));
            e = A.add(e, A.from(c.departure));
          }
          const courses = [...cs, { latitude: A.neg(n), departure: A.neg(e) }];
          const t = traverse(A, { start, courses, rule: rule as 'compass' | 'transit' });
          expect(A.isZero(t.closure.east)).toBe(true);
          expect(A.isZero(t.closure.north)).toBe(true);
          expect(rootToString(A, t.closure.linear)).toBe('0');
          expect(t.closure.ratio).toBeUndefined();
          t.adjusted.forEach((p, i) => {
            expect(A.eq(p.x, t.points[i]!.x) && A.eq(p.y, t.points[i]!.y)).toBe(true);
          });
        },
      ),
    );
  });

  it('reports the misclosure exactly and lands the adjusted end on the closing point exactly, by either rule', () => {
    fc.assert(
      fc.property(
        fc.array(latDep, { minLength: 1, maxLength: 15 }),
        ratText,
        ratText,
        fc.constantFrom('compass', 'transit'),
        (cs, ex, ny, rule) => {
          let n = A.zero;
          let e = A.zero;
          for (const c of cs) {
            n = A.add(n, A.from(c.latitude));
            e = A.add(e, A.from(c.departure));
          }
          // The known closing point is the computed end moved by (−ex, −ny): misclosure (ex, ny).
          const close = { x: A.sub(e, A.from(ex)), y: A.sub(n, A.from(ny)) };
          let t;
          try {
            t = traverse(A, {
              start: { x: 0, y: 0 },
              courses: cs,
              close,
              rule: rule as 'compass' | 'transit',
            });
          } catch (err) {
            // The transit rule cannot spread a misclosure over all-zero components.
            expect((err as QuadspreadError).code).toBe('INVALID_ARGUMENT');
            return;
          }
          expect(A.toString(t.closure.east)).toBe(A.toString(A.from(ex)));
          expect(A.toString(t.closure.north)).toBe(A.toString(A.from(ny)));
          const last = t.adjusted[cs.length]!;
          expect(A.eq(last.x, close.x) && A.eq(last.y, close.y)).toBe(true);
        },
      ),
    );
  });
});

describe.each(kinds)('traverse(%s, …)', (_name, A) => {
  it('computes latitude = d·cos(azimuth) and departure = d·sin(azimuth) as Math.cos/Math.sin do (to 1e-9 ft)', () => {
    const az = 226 + 54 / 60 + 23 / 3600;
    const t = traverse(A, {
      start: { x: 0, y: 0 },
      courses: [{ bearing: `226°54'23"`, distance: '639.15' }],
    });
    const rad = (az * Math.PI) / 180;
    expect(Math.abs(A.toNumber(t.courses[0]!.latitude) - 639.15 * Math.cos(rad))).toBeLessThan(
      1e-9,
    );
    expect(Math.abs(A.toNumber(t.courses[0]!.departure) - 639.15 * Math.sin(rad))).toBeLessThan(
      1e-9,
    );
  });

  it('reads a quadrant bearing S 68°05\'35" W as the azimuth 248°05\'35"', () => {
    const q = traverse(A, {
      start: { x: 0, y: 0 },
      courses: [{ bearing: `S 68°05'35" W`, distance: 100 }],
    });
    const z = traverse(A, {
      start: { x: 0, y: 0 },
      courses: [{ bearing: `248°05'35"`, distance: 100 }],
    });
    // Equal exactly in rational; decimal rounds 180° + θ and the azimuth text differently, so 1e-20 there.
    const tol = A.exact ? 0 : 1e-20;
    expect(Math.abs(A.toNumber(A.sub(q.points[1]!.x, z.points[1]!.x)))).toBeLessThanOrEqual(tol);
    expect(Math.abs(A.toNumber(A.sub(q.points[1]!.y, z.points[1]!.y)))).toBeLessThanOrEqual(tol);
    expect(A.sign(q.points[1]!.x)).toBe(-1);
    expect(A.sign(q.points[1]!.y)).toBe(-1);
  });

  it('splits a 0.04 misclosure on a square by the compass rule in proportion to length (derived by hand)', () => {
    // A 100 × 100 square whose last course is 0.04 off in latitude; its length is √(100² + 0.04²),
    // so the total is L = 300 + √10000.0016 and a 100 ft course takes 0.04·100/L.
    const t = traverse(A, {
      start: { x: 0, y: 0 },
      courses: [
        { latitude: 100, departure: 0 },
        { latitude: 0, departure: 100 },
        { latitude: -100, departure: 0 },
        { latitude: '0.04', departure: -100 },
      ],
    });
    expect(A.toNumber(t.closure.north)).toBeCloseTo(0.04, 12);
    const L = 300 + Math.sqrt(10000.0016);
    expect(A.toNumber(t.courses[0]!.adjustedLatitude)).toBeCloseTo(100 - (0.04 * 100) / L, 12);
    expect(A.toNumber(t.courses[3]!.adjustedLatitude)).toBeCloseTo(
      0.04 - (0.04 * Math.sqrt(10000.0016)) / L,
      12,
    );
    expect(A.toNumber(t.closure.ratio!)).toBeCloseTo(L / 0.04, 6);
  });

  it('splits the same misclosure by the transit rule in proportion to |latitude| (derived by hand)', () => {
    const t = traverse(A, {
      start: { x: 0, y: 0 },
      rule: 'transit',
      courses: [
        { latitude: 100, departure: 0 },
        { latitude: 0, departure: 100 },
        { latitude: -100, departure: 0 },
        { latitude: '0.04', departure: -100 },
      ],
    });
    // Σ|lat| = 200.04: the two 100 ft courses take 0.04·100/200.04 each.
    expect(A.toNumber(t.courses[0]!.adjustedLatitude)).toBeCloseTo(100 - (0.04 * 100) / 200.04, 12);
    expect(A.toNumber(t.courses[1]!.adjustedLatitude)).toBe(0);
    expect(A.toNumber(t.courses[1]!.adjustedDeparture)).toBe(100);
  });

  it('closes on a second known point', () => {
    const t = traverse(A, {
      start: { x: 1000, y: 2000 },
      close: { x: 1100, y: '2049.99' },
      courses: [
        { latitude: 50, departure: 0 },
        { latitude: 0, departure: 100 },
      ],
    });
    expect(A.toNumber(t.closure.north)).toBeCloseTo(0.01, 12);
    expect(A.toNumber(t.closure.east)).toBe(0);
    expect(A.toNumber(t.adjusted[2]!.y)).toBeCloseTo(2049.99, 9);
  });

  it('refuses a traverse with no courses with NO_COURSES', () => {
    expect(code(() => traverse(A, { start: { x: 0, y: 0 }, courses: [] }))).toBe('NO_COURSES');
    expect(code(() => traverse(A, { start: { x: 0, y: 0 } } as never))).toBe('NO_COURSES');
  });

  it('refuses bearings that do not parse with INVALID_BEARING naming the course', () => {
    expect(
      code(() =>
        traverse(A, { start: { x: 0, y: 0 }, courses: [{ bearing: 'north-ish', distance: 1 }] }),
      ),
    ).toBe('INVALID_BEARING');
    expect(() =>
      traverse(A, {
        start: { x: 0, y: 0 },
        courses: [
          { bearing: 10, distance: 1 },
          { bearing: `N 95° E`, distance: 1 },
        ],
      }),
    ).toThrow(/courses\[1\]\.bearing/);
    expect(
      code(() => traverse(A, { start: { x: 0, y: 0 }, courses: [{ bearing: 361, distance: 1 }] })),
    ).toBe('INVALID_BEARING');
    expect(
      code(() => traverse(A, { start: { x: 0, y: 0 }, courses: [{ bearing: -1, distance: 1 }] })),
    ).toBe('INVALID_BEARING');
  });

  it('refuses a course of neither form, a negative distance and an unknown rule with INVALID_ARGUMENT', () => {
    expect(
      code(() => traverse(A, { start: { x: 0, y: 0 }, courses: [{ latitude: 1 } as never] })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() => traverse(A, { start: { x: 0, y: 0 }, courses: [{ bearing: 10, distance: -5 }] })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        traverse(A, {
          start: { x: 0, y: 0 },
          courses: [{ bearing: 10, distance: 5 }],
          rule: 'crandall' as never,
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        traverse(A, { start: { x: 0, y: 0 }, courses: [{ bearing: 10, distance: 'five' }] }),
      ),
    ).toBe('INVALID_NUMBER');
    expect(() =>
      traverse(A, {
        start: { x: 0, y: 0 },
        courses: [
          { bearing: 10, distance: 1 },
          { latitude: 1, departure: 'east' },
        ],
      }),
    ).toThrow(/traverse\(A, input\) courses\[1\]\.departure: "east" is not a number/);
    expect(() =>
      traverse(A, { start: { x: 'o', y: 0 }, courses: [{ bearing: 10, distance: 1 }] }),
    ).toThrow(/traverse\(A, input\) start\.x:/);
  });
});

describe('angularMisclosure(A, angles)', () => {
  it('is the sum less (n − 2)·180°, exact for DMS text in rational', () => {
    const m = angularMisclosure(rational, [
      `101°24'00"`,
      `149°13'00"`,
      `80°58'30"`,
      `116°19'00"`,
      `92°05'30"`,
    ]);
    // 539°60'00" = 540°00'00" exactly: 0 misclosure (angles chosen by hand to sum to 540°).
    expect(rational.toString(m.expected)).toBe('540');
    expect(rational.toString(m.misclosure)).toBe('0');
  });

  it('is reported by traverse when interiorAngles are given', () => {
    const t = traverse(float, {
      start: { x: 0, y: 0 },
      courses: [{ latitude: 1, departure: 0 }],
      close: { x: 0, y: 1 },
      interiorAngles: [60, 60, '60.01'],
    });
    expect(t.angular!.misclosure).toBeCloseTo(0.01, 12);
  });

  it('refuses fewer than three angles with TOO_FEW_POINTS', () => {
    expect(code(() => angularMisclosure(rational, [90, 90]))).toBe('TOO_FEW_POINTS');
  });
});

describe('bearingToAzimuth(A, bearing)', () => {
  it.each([
    [`N 30° E`, '30'],
    [`S 30° E`, '150'],
    [`S 30° W`, '210'],
    [`N 30° W`, '330'],
    ['360', '0'],
    [`90°30'`, '181/2'],
  ])('reads %s as azimuth %s° clockwise from north', (b, want) => {
    expect(rational.toString(bearingToAzimuth(rational, b))).toBe(want);
  });
});

describe('traverse(float, …) float twin', () => {
  // A copy of the float arithmetic without its float64 mark takes the generic path.
  const generic = { ...float, float64: undefined } as unknown as typeof float;
  const course = fc.oneof(
    fc.record({
      latitude: fc.double({ min: -1e4, max: 1e4, noNaN: true }),
      departure: fc.double({ min: -1e4, max: 1e4, noNaN: true }),
    }),
    fc.record({
      bearing: fc.oneof(
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.constantFrom(0, -0, 30, 90, 180, 270, 360, 360.5, -1e-9),
      ),
      distance: fc.double({ min: 0, max: 1e4, noNaN: true }),
    }),
    fc.record({
      bearing: fc.constantFrom(`N 12°34'56" E`, `S 68°05'35" W`, '90', `226°54'23"`),
      distance: fc.double({ min: 0, max: 1e4, noNaN: true }),
    }),
  );
  it('returns exactly what the generic code returns in float, by either rule', () => {
    fc.assert(
      fc.property(
        fc.array(course, { minLength: 1, maxLength: 30 }),
        fc.constantFrom('compass', 'transit'),
        fc.double({ min: -1, max: 1, noNaN: true }),
        (courses, rule, off) => {
          const input = {
            start: { x: 100, y: 200 },
            close: { x: 100 + off, y: 200 - off },
            courses,
            rule: rule as 'compass' | 'transit',
          };
          let a: unknown, b: unknown;
          try {
            a = traverse(float, input);
          } catch (e) {
            a = (e as QuadspreadError).code;
          }
          try {
            b = traverse(generic, input);
          } catch (e) {
            b = (e as QuadspreadError).code;
          }
          expect(a).toEqual(b);
        },
      ),
    );
  });
});
