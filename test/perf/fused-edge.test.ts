// Trying to break the fused kernels (src/arithmetic/fused-rational.ts, fused-decimal.ts) with
// edge cases: zeros, negative coordinates, equal and collinear points, tiny and huge values
// ('1e-30', '1e30'), and points or courses mixing numbers, text, bigints, fractions and values
// of other arithmetics. In rational a kernel must give exactly the generic result; in decimal
// the exact value correctly rounded (ties to even); and wherever it does not handle the input
// it must return undefined, so that the generic code gives its result or its error.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { decimal, float, rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Decimal, Rational } from '../../src/index.js';
import { point, triangle } from '../../src/geometry/index.js';
import { traverse } from '../../src/cogo/index.js';
import { heightFromInlineReadings } from '../../src/elevation/index.js';

const plainR: Arithmetic<Rational, true> = { ...rational, kernels: undefined };
const KEYS = ['Q1', 'Q2', 'Q3', 's1', 's2', 's3', 'quadrea'] as const;

/** Every value of a result as text, in order; fractions by (s, n, d), so lowest terms count. */
function flatten(x: unknown, out: string[] = []): string[] {
  if (x instanceof Fraction) out.push(`F ${x.s} ${x.n} ${x.d}`);
  else if (Array.isArray(x)) x.forEach((v) => flatten(v, out));
  else if (
    x !== null &&
    typeof x === 'object' &&
    typeof (x as { isRational?: unknown }).isRational === 'function'
  )
    out.push(`S ${String(x)}`);
  else if (x !== null && typeof x === 'object')
    for (const k of Object.keys(x).sort()) {
      out.push(`.${k}`);
      flatten((x as Record<string, unknown>)[k], out);
    }
  else out.push(`${typeof x} ${String(x)}`);
  return out;
}

/** The result (flattened) or the error: a QuadspreadError by code and message, anything else by its class. */
function outcome(f: () => unknown): unknown {
  try {
    return flatten(f());
  } catch (e) {
    return e instanceof QuadspreadError
      ? `error ${e.code}: ${e.message}`
      : `other ${(e as Error).constructor.name}`;
  }
}

// Raw coordinate values of every kind an integrator might put in a point.
const small = fc.integer({ min: -3, max: 3 });
const text = fc.oneof(
  fc.constantFrom(
    '0',
    '-0',
    '1e-30',
    '-1e-30',
    '1e30',
    '0.001',
    '-2.5',
    '1/3',
    '-7/9',
    '123456789.123456789',
  ),
  fc.integer({ min: -100_000_000, max: 100_000_000 }).map((m) => `${m / 1000}`),
);
const anyValue = fc.oneof(
  small,
  text,
  small.map(BigInt),
  text.map((s) => rational.from(s)),
  small.map((n) => n / 8),
);
const asFraction = (v: unknown): Rational =>
  v instanceof Fraction ? v : rational.from(v as string);

/** Three points with coincident, collinear, axis-aligned and general cases, from raw values. */
const threePoints = fc
  .tuple(
    fc.tuple(anyValue, anyValue),
    fc.tuple(anyValue, anyValue),
    fc.tuple(anyValue, anyValue),
    fc.constantFrom('free', 'equal', 'collinear', 'axis'),
    small,
  )
  .map(([[a, b], [c, d], [e, f], shape, k]) => {
    const P = { x: asFraction(a), y: asFraction(b) },
      Q = { x: asFraction(c), y: asFraction(d) };
    let R = { x: asFraction(e), y: asFraction(f) };
    if (shape === 'equal') R = P;
    if (shape === 'collinear')
      R = { x: P.x.add(Q.x.sub(P.x).mul(k)), y: P.y.add(Q.y.sub(P.y).mul(k)) };
    if (shape === 'axis') R = { x: P.x, y: Q.y };
    return [P, Q, R] as const;
  });

describe('fused triangle kernels on edge cases', () => {
  it('rational: equal to the generic formulas exactly, with the same errors for equal and collinear points', () => {
    let used = 0;
    fc.assert(
      fc.property(threePoints, ([P, Q, R]) => {
        if (rational.kernels!.triangle!(P.x, P.y, Q.x, Q.y, R.x, R.y) !== undefined) used++;
        expect(outcome(() => triangle(rational, P, Q, R))).toEqual(
          outcome(() => triangle(plainR, P, Q, R)),
        );
      }),
      { numRuns: 600 },
    );
    expect(used).toBeGreaterThan(100); // the kernel itself answered (not only the fallback)
  });

  it('rational: a point holding a number, text, bigint or a value of another arithmetic is left to the generic code (no hang)', () => {
    const k = rational.kernels!.triangle!;
    const F = (x: number) => rational.from(x);
    const foreign: unknown[] = [
      3,
      '3',
      3n,
      decimal(10).from(3),
      { n: 3n, d: 1n, s: 1n },
      null,
      undefined,
    ];
    for (const v of foreign) {
      expect(k(F(0), F(0), v as Rational, F(0), F(0), F(4))).toBeUndefined();
      const pts = [
        { x: F(0), y: F(0) },
        { x: v as Rational, y: F(0) },
        { x: F(0), y: F(4) },
      ] as const;
      expect(outcome(() => triangle(rational, ...pts))).toEqual(
        outcome(() => triangle(plainR, ...pts)),
      );
    }
  });

  it('decimal: each measure is the exact value correctly rounded, for 1 to 40 digits, and degenerate input gets the generic error', () => {
    fc.assert(
      fc.property(threePoints, fc.integer({ min: 1, max: 40 }), ([P, Q, R], digits) => {
        const D = decimal(digits);
        const plainD: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
        // The decimal points, and the same values read exactly.
        const d = (p: { x: Rational; y: Rational }) =>
          point(D, rational.toString(p.x), rational.toString(p.y));
        const [a, b, c] = [d(P), d(Q), d(R)];
        const x = (p: { x: Decimal; y: Decimal }) =>
          point(rational, D.toString(p.x), D.toString(p.y));
        const exact = outcome(() => triangle(rational, x(a), x(b), x(c)));
        const fused = D.kernels!.triangle!(a.x, a.y, b.x, b.y, c.x, c.y);
        if (!Array.isArray(exact)) {
          // Exactly degenerate: the kernel leaves it to the generic code, which reports it.
          expect(fused).toBeUndefined();
          expect(outcome(() => triangle(D, a, b, c))).toEqual(
            outcome(() => triangle(plainD, a, b, c)),
          );
          return;
        }
        const t = triangle(rational, x(a), x(b), x(c));
        // D.from('n/d') is n/d correctly rounded (decimal.ts's division, a separate code path).
        for (const key of KEYS)
          expect(D.toString(fused![key]), key).toBe(D.toString(D.from(rational.toString(t[key]))));
      }),
      { numRuns: 400 },
    );
  });

  it('decimal: numbers, text and Bigs of another decimal instance in a point are left to the generic code', () => {
    const D = decimal(10),
      E = decimal(40);
    const plainD: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
    const k = D.kernels!.triangle!;
    for (const v of [
      3,
      '3',
      E.from('3.000000000000000000001'),
      rational.from(3),
      float.from(3),
    ] as unknown[]) {
      expect(k(D.zero, D.zero, v as Decimal, D.zero, D.zero, D.from(4))).toBeUndefined();
      const pts = [
        { x: D.zero, y: D.zero },
        { x: D.from(3), y: v as Decimal },
        { x: D.zero, y: D.from(4) },
      ] as const;
      expect(outcome(() => triangle(D, ...pts))).toEqual(outcome(() => triangle(plainD, ...pts)));
    }
  });

  it('decimal: nearly collinear points get their tiny spread from the kernel, where the step-by-step code in 3 digits rounds the cross product to 0', () => {
    const D = decimal(3);
    const plainD: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
    const pts = [point(D, 0, 0), point(D, 999, 998), point(D, 1000, 999)] as const;
    // Derived by hand: cross = 999·999 − 998·1000 = 1; Q2 = 1000² + 999², Q3 = 999² + 998².
    expect(D.toString(triangle(D, ...pts).s1)).toBe(
      D.toString(D.from(`1/${(1000 ** 2 + 999 ** 2) * (999 ** 2 + 998 ** 2)}`)),
    );
    expect(outcome(() => triangle(plainD, ...pts))).toMatch(/^error COLLINEAR_POINTS/);
  });

  it('decimal: coordinates spanning thousands of decimal places go to the generic code', () => {
    const D = decimal(34);
    let big = D.from('1e999'),
      tiny = D.from('1e-999');
    for (let i = 0; i < 3; i++) {
      big = D.mul(big, D.from('1e999'));
      tiny = D.mul(tiny, D.from('1e-999'));
    }
    expect(D.kernels!.triangle!(big, D.zero, D.zero, tiny, D.one, D.one)).toBeUndefined();
    // Within the span the kernel answers: 1e999 and 1e-999 (derived: s3 at (1, 1) → 1/2 up to 1e-999).
    const t = D.kernels!.triangle!(D.from('1e999'), D.zero, D.zero, D.from('1e-999'), D.one, D.one);
    expect(t).toBeDefined();
    expect(D.toString(t!.s3)).toBe('0.5');
  });
});

// Traverse courses mixing kinds of values, zero and negative lengths, tiny and huge values.
const courseValue = fc.oneof(
  small,
  text,
  text.map((s) => rational.from(s)),
  small.map(BigInt),
);
const length = fc.oneof(
  fc.constantFrom(0, '0', '1e-30', '-1', '1e30', 5n),
  fc.integer({ min: 0, max: 300_000 }).map((m) => `${m / 1000}`),
);
const course = fc.oneof(
  {
    weight: 8,
    arbitrary: fc.record({ latitude: courseValue, departure: courseValue, distance: length }),
  },
  { weight: 1, arbitrary: fc.record({ latitude: courseValue, departure: courseValue }) },
  {
    weight: 1,
    arbitrary: fc.record({
      latitude: courseValue,
      departure: fc.constantFrom(undefined, 'x', Number.NaN, null),
      distance: length,
    }),
  },
);
const messy = fc.record(
  {
    start: fc.record({ x: courseValue, y: courseValue }),
    courses: fc.array(course, { minLength: 0, maxLength: 12 }),
    close: fc.oneof(fc.record({ x: courseValue, y: courseValue }), fc.constant(undefined)),
    rule: fc.constantFrom('compass', 'transit', undefined, 'bogus'),
  },
  { requiredKeys: ['start', 'courses'] },
);
// Input the kernels handle (compass rule, every course with a length ≥ 0), with the same edge values.
// (Decimal reads no fractions, so its clean input holds numbers, text and bigints only.)
const clean = (v: fc.Arbitrary<unknown>) =>
  fc.record({
    start: fc.record({ x: v, y: v }),
    courses: fc.array(
      fc.record({
        latitude: v,
        departure: v,
        distance: fc.oneof(
          fc.constantFrom(0, '0', '1e-30', '1e30', 5n),
          fc.integer({ min: 0, max: 300_000 }).map((m) => `${m / 1000}`),
        ),
      }),
      { minLength: 1, maxLength: 12 },
    ),
    close: fc.oneof(fc.record({ x: v, y: v }), fc.constant(undefined)),
  });
type TravInput = {
  start: { x: unknown; y: unknown };
  courses: { latitude: unknown; departure: unknown; distance?: unknown }[];
  close?: { x: unknown; y: unknown };
  rule?: unknown;
};
const travInput = fc.oneof(
  { weight: 3, arbitrary: clean(courseValue) },
  { weight: 1, arbitrary: messy },
) as fc.Arbitrary<TravInput>;
const travInputD = fc.oneof(
  { weight: 3, arbitrary: clean(fc.oneof(small, text, small.map(BigInt))) },
  { weight: 1, arbitrary: messy },
) as fc.Arbitrary<TravInput>;

describe('fused traverse kernels on edge cases', () => {
  it('rational: the same traverse as the generic code, or the same error', () => {
    let used = 0;
    fc.assert(
      fc.property(travInput, (t) => {
        if (rational.kernels!.traverse!(t) !== undefined) used++;
        expect(outcome(() => traverse(rational, t as never))).toEqual(
          outcome(() => traverse(plainR, t as never)),
        );
      }),
      { numRuns: 400 },
    );
    expect(used).toBeGreaterThan(20);
  });

  it('decimal: the sums exact and each adjusted value the exact compass value correctly rounded; the same errors', () => {
    let used = 0,
      runs = 0;
    fc.assert(
      fc.property(travInputD, fc.integer({ min: 2, max: 30 }), (t, digits) => {
        runs++;
        const D = decimal(digits);
        const plainD: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
        const fused = D.kernels!.traverse!(t);
        const generic = outcome(() => traverse(plainD, t as never));
        if (fused === undefined) {
          expect(outcome(() => traverse(D, t as never))).toEqual(generic);
          return;
        }
        used++;
        expect(Array.isArray(generic)).toBe(true); // the kernel answers only where the generic code does
        // The same traverse in rational on the inputs as this decimal reads them.
        const r = (v: unknown) => (v === undefined ? undefined : D.toString(D.from(v as string)));
        const exact = traverse(rational, {
          start: { x: r(t.start.x)!, y: r(t.start.y)! },
          close: t.close && { x: r(t.close.x)!, y: r(t.close.y)! },
          courses: t.courses.map((c: TravInput['courses'][number]) => ({
            latitude: r(c.latitude)!,
            departure: r(c.departure)!,
            distance: r((c as { distance?: unknown }).distance)!,
          })),
        });
        const round = (q: Rational) => D.toString(D.from(rational.toString(q)));
        expect(D.toString(fused.north)).toBe(round(exact.closure.north));
        expect(D.toString(fused.east)).toBe(round(exact.closure.east));
        expect(D.toString(fused.length)).toBe(round(exact.length));
        fused.points.forEach((p, i) =>
          expect([D.toString(p.x), D.toString(p.y)]).toEqual([
            round(exact.points[i]!.x),
            round(exact.points[i]!.y),
          ]),
        );
        fused.adjusted.forEach((p, i) =>
          expect([D.toString(p.x), D.toString(p.y)]).toEqual([
            round(exact.adjusted[i]!.x),
            round(exact.adjusted[i]!.y),
          ]),
        );
        fused.courses.forEach((c, i) =>
          expect([D.toString(c.adjustedLatitude), D.toString(c.adjustedDeparture)]).toEqual([
            round(exact.courses[i]!.adjustedLatitude),
            round(exact.courses[i]!.adjustedDeparture),
          ]),
        );
      }),
      { numRuns: 300 },
    );
    expect(used).toBeGreaterThan(runs / 20);
  });
});

// In-line readings: chainages and spreads of every kind, equal chainages, spreads 0, 1, > 1, negative.
const chain = fc.oneof(
  small,
  text,
  text.map((s) => rational.from(s)),
);
const spreadValue = fc.oneof(
  fc.constantFrom('1', '0', '1/2', '1e-30', '2', '-1/4', 1, 0.5),
  fc
    .tuple(fc.integer({ min: 1, max: 99 }), fc.integer({ min: 1, max: 99 }))
    .map(([a, b]) => rational.from(`${Math.min(a, b)}/${Math.max(a, b)}`)),
);
const messyInline = fc.record({
  chainages: fc
    .array(chain, { minLength: 2, maxLength: 4 })
    .chain((c) => fc.constantFrom(c, [c[0], c[0], ...c.slice(2)])),
  vertical: fc.array(spreadValue, { minLength: 2, maxLength: 4 }),
});
// Three stations as fractions (the kernel's case), equal chainages now and then.
const frac = fc.oneof(text, small.map(String)).map((s) => rational.from(s));
const fracSpread = fc.oneof(
  fc.constantFrom('1', '0', '1/2', '1e-30', '2', '-1/4').map((s) => rational.from(s)),
  fc
    .tuple(fc.integer({ min: 1, max: 99 }), fc.integer({ min: 1, max: 99 }))
    .map(([a, b]) => rational.from(`${Math.min(a, b)}/${Math.max(a, b)}`)),
);
const threeStations = fc.record({
  chainages: fc.tuple(frac, frac, frac).chain((c) => fc.constantFrom(c, [c[0], c[0], c[2]])),
  vertical: fc.tuple(fracSpread, fracSpread, fracSpread),
});
// Readings of a real point: foot f, offset quadrance e ≥ 0, height quadrance H > 0, so that
// Rᵢ = H/(H + (cᵢ − f)² + e) (spread = vertical²/(vertical² + horizontal²); derived).
const consistent = fc
  .tuple(
    fc.tuple(frac, frac, frac),
    frac,
    fc.oneof(
      fc.constant(rational.zero),
      frac.map((x) => x.abs()),
    ),
    frac.map((x) => x.abs()).filter((x) => x.n !== 0n),
  )
  .map(([c, f, e, H]) => ({
    chainages: c,
    vertical: c.map((ci) => H.div(H.add(ci.sub(f).mul(ci.sub(f))).add(e))),
  }));
const inlineInput = fc.oneof(
  { weight: 3, arbitrary: consistent },
  { weight: 1, arbitrary: threeStations },
  { weight: 1, arbitrary: messyInline },
);

describe('the fused in-line heights kernel on edge cases', () => {
  it('rational: the same result as the generic code, or the same error', () => {
    let used = 0;
    fc.assert(
      fc.property(inlineInput, (input) => {
        if (rational.kernels!.inlineHeight!(input) !== undefined) used++;
        expect(outcome(() => heightFromInlineReadings(rational, input as never))).toEqual(
          outcome(() => heightFromInlineReadings(plainR, input as never)),
        );
      }),
      { numRuns: 500 },
    );
    expect(used).toBeGreaterThan(10);
  });
});
