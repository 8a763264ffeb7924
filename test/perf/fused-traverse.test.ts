// The fused rational traverse kernel (one common denominator, integer sums) gives exactly the
// generic traverse: the same misclosure, length, points, adjustment, root and ratio, and
// leaves every other input and every error to the generic code.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Rational } from '../../src/index.js';
import { traverse } from '../../src/cogo/index.js';

const plain: Arithmetic<Rational, true> = { ...rational, kernels: undefined };

/** Every value of a result as text, in order, with fractions and surds by their exact text. */
function flatten(x: unknown, out: string[] = []): string[] {
  if (x instanceof Object && 'n' in x && 'd' in x && 's' in x)
    out.push(`F ${rational.toString(x as Rational)} ${(x as Rational).d}`);
  else if (
    x !== null &&
    typeof x === 'object' &&
    typeof (x as { isRational?: unknown }).isRational === 'function'
  )
    out.push(`S ${String(x)}`);
  else if (Array.isArray(x)) x.forEach((v) => flatten(v, out));
  else if (x !== null && typeof x === 'object')
    for (const k of Object.keys(x).sort()) {
      out.push(`.${k}`);
      flatten((x as Record<string, unknown>)[k], out);
    }
  else out.push(`${typeof x} ${String(x)}`);
  return out;
}

function outcome(f: () => unknown): unknown {
  try {
    return flatten(f());
  } catch (e) {
    return e instanceof QuadspreadError
      ? `error ${e.code}: ${e.message}`
      : `not a QuadspreadError: ${String(e)}`;
  }
}

const mmText = fc.integer({ min: -300_000, max: 300_000 }).map((m) => `${m / 1000}`);
const value = fc.oneof(
  mmText,
  fc.integer({ min: -50, max: 50 }),
  fc
    .tuple(fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: 1, max: 64 }))
    .map(([n, d]) => rational.from(`${n}/${d}`)),
);
// The distance may be left out: the length is then √(lat² + dep²), computed (exact for a
// square, else one integer root on a decimal scale) by the kernel as by the generic code.
const course = fc.record(
  {
    latitude: value,
    departure: value,
    distance: fc.oneof(
      mmText.map((s) => s.replace('-', '')),
      fc.integer({ min: 0, max: 300 }),
    ),
  },
  { requiredKeys: ['latitude', 'departure'] },
);
const input = fc.record(
  {
    start: fc.record({ x: value, y: value }),
    courses: fc.array(course, { minLength: 1, maxLength: 30 }),
    close: fc.record({ x: value, y: value }),
    rule: fc.constantFrom('compass', 'transit'),
  },
  { requiredKeys: ['start', 'courses'] },
);

describe('the fused rational traverse kernel', () => {
  it('gives exactly the generic traverse (or the same error) for random latitude/departure traverses', () => {
    fc.assert(
      fc.property(input, (t) => {
        expect(outcome(() => traverse(rational, t))).toEqual(outcome(() => traverse(plain, t)));
      }),
      { numRuns: 400 },
    );
  });

  it('gives exactly the generic traverse when every length is computed (irrational roots, zero courses, exact closures)', () => {
    // Lengths √(lat² + dep²) not given: the adjusted values are over T·Dn with T of ~55 digits,
    // reduced with one shared gcd (sharedReducer); zero-length courses and a closing point on
    // the computed end (north = east = 0) make residues that are 0 or share T's factors.
    const comp = fc.oneof(
      mmText,
      fc.integer({ min: -3, max: 3 }),
      fc.constantFrom(0, '0.5', '-0.25', '1/3'),
    );
    const loop = fc
      .record({
        start: fc.record({ x: comp, y: comp }),
        courses: fc.array(fc.record({ latitude: comp, departure: comp }), {
          minLength: 1,
          maxLength: 25,
        }),
        closeAtEnd: fc.boolean(),
      })
      .map(({ start, courses, closeAtEnd }) => {
        if (!closeAtEnd) return { start, courses };
        let x = rational.from(start.x),
          y = rational.from(start.y);
        for (const c of courses) {
          x = rational.add(x, rational.from(c.departure));
          y = rational.add(y, rational.from(c.latitude));
        }
        return { start, courses, close: { x, y } };
      });
    fc.assert(
      fc.property(loop, (t) => {
        expect(outcome(() => traverse(rational, t))).toEqual(outcome(() => traverse(plain, t)));
      }),
      { numRuns: 300 },
    );
  });

  it('closes a loop exactly: the adjusted end is the start, and the misclosure is the sum of the courses', () => {
    const t = {
      start: { x: '10', y: '20' },
      courses: [
        { latitude: '3.001', departure: 0, distance: 3 },
        { latitude: 0, departure: 4, distance: 4 },
        { latitude: -3, departure: -4, distance: 5 },
      ],
    };
    const r = traverse(rational, t);
    // Derived by hand: the courses sum to (0, 0.001) north, over a length of 12.
    expect(rational.toString(r.closure.north)).toBe('1/1000');
    expect(rational.toString(r.closure.east)).toBe('0');
    expect([rational.toString(r.adjusted[3]!.x), rational.toString(r.adjusted[3]!.y)]).toEqual([
      '10',
      '20',
    ]);
    expect(rational.toString(r.closure.ratio!)).toBe('12000');
    expect(outcome(() => r)).toEqual(outcome(() => traverse(plain, t)));
  });

  it('leaves bearings and bad values to the generic code, and computes a missing distance', () => {
    const k = rational.kernels!.traverse!;
    expect(k({ start: { x: 0, y: 0 }, courses: [{ bearing: '45', distance: 1 }] })).toBeUndefined();
    // 3-4-5: the computed length is exactly 5
    expect(
      rational.toString(
        k({ start: { x: 0, y: 0 }, courses: [{ latitude: 3, departure: 4 }] })!.length,
      ),
    ).toBe('5');
    expect(
      k({ start: { x: 0, y: 0 }, courses: [{ latitude: 'x', departure: 4, distance: 5 }] }),
    ).toBeUndefined();
    expect(
      k({ start: { x: 0, y: 0 }, courses: [{ latitude: 3, departure: 4, distance: -5 }] }),
    ).toBeUndefined();
    expect(
      outcome(() =>
        traverse(rational, {
          start: { x: 0, y: 0 },
          courses: [{ latitude: 3, departure: 4, distance: -5 }],
        }),
      ),
    ).toEqual(
      outcome(() =>
        traverse(plain, {
          start: { x: 0, y: 0 },
          courses: [{ latitude: 3, departure: 4, distance: -5 }],
        }),
      ),
    );
  });
});
