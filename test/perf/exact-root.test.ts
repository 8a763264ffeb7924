// The exact arithmetic's approximate square root (src/readings/numeric.ts, approxSqrt) is one
// integer square root on a decimal scale chosen from the magnitude alone: checked here against
// decimal.js at 120 digits (an independent computation), for its denominator (a power of ten
// whatever x is), and for what that does to a traverse whose lengths are computed.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import { rational, traverse } from '../../src/index.js';
import { approxSqrt } from '../../src/readings/numeric.js';
import { isqrt } from '../../src/arithmetic/exact.js';
import { runJob } from '../../src/cli/job.js';
import { TASK_KINDS } from '../../src/cli/tasks/index.js';

const D = Decimal.clone({ precision: 120 });
const ratio = fc
  .tuple(fc.bigInt({ min: 1n, max: 10n ** 40n }), fc.bigInt({ min: 1n, max: 10n ** 40n }))
  .map(([n, d]) => rational.from(`${n}/${d}`));

describe('isqrt(a) (Newton from the double root of the leading bits)', () => {
  // The definition of the integer square root: r² ≤ a < (r + 1)².
  const check = (a: bigint): void => {
    const r = isqrt(a);
    expect(r * r <= a && a < (r + 1n) * (r + 1n)).toBe(true);
  };
  it('is the integer square root of random integers up to 3000 bits', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 3000 }),
        fc.bigInt({ min: 0n, max: (1n << 3000n) - 1n }),
        (bits, x) => check(x >> BigInt(3000 - bits)),
      ),
      { numRuns: 2000 },
    );
  });
  it('is exact next to squares and powers of two (where a rounded double root errs)', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 1n, max: 1n << 1600n }), (r) => {
        for (const a of [r * r - 1n, r * r, r * r + 1n, (r + 1n) * (r + 1n) - 1n]) check(a);
      }),
      { numRuns: 1000 },
    );
    for (let k = 0n; k < 2200n; k++)
      for (const a of [(1n << k) - 1n, 1n << k, (1n << k) + 1n]) check(a);
  });
});

describe('approxSqrt(rational, x) (one integer root on a decimal scale)', () => {
  it('is below √x by less than 1e-51 relative (decimal.js, 120 digits), with a power-of-ten denominator', () => {
    fc.assert(
      fc.property(ratio, (x) => {
        fc.pre(rational.sqrt(x) === undefined);
        const r = approxSqrt(rational, x);
        const exact = new D(x.n.toString()).div(x.d.toString()).sqrt();
        const got = new D(r.n.toString()).div(r.d.toString());
        const rel = exact.minus(got).div(exact);
        expect(rel.gte(0)).toBe(true);
        expect(rel.lt('1e-51')).toBe(true);
        let d = r.d;
        while (d % 10n === 0n) d /= 10n;
        while (d % 2n === 0n) d /= 2n;
        while (d % 5n === 0n) d /= 5n;
        expect(d).toBe(1n); // the denominator divides a power of ten
      }),
      { numRuns: 500 },
    );
  });

  it('keeps the adjusted points of a 20-course traverse with computed lengths small (no growth with the courses)', () => {
    // Courses of irrational length (lat² + dep² not a square): 20 of them, in millimetres.
    const courses = Array.from({ length: 20 }, (_, i) => ({
      latitude: `${((i * 7919) % 500) - 250}.${String((i * 104729) % 1000).padStart(3, '0')}`,
      departure: `${((i * 6271) % 400) - 200}.${String((i * 1299709) % 1000).padStart(3, '0')}`,
    }));
    const t = traverse(rational, { start: { x: 1000, y: 5000 }, courses });
    const digits = t.adjusted.map((p) => p.x.d.toString().length);
    // The lengths share one scale 10^k (k ≈ 50): sums of them and the corrections stay within
    // a few hundred digits (each was ~1000 digits when every root had its own denominator).
    expect(Math.max(...digits)).toBeLessThan(200);
    // The compass rule still closes exactly on the start.
    expect(rational.eq(t.adjusted[20]!.x, rational.from(1000))).toBe(true);
    expect(rational.eq(t.adjusted[20]!.y, rational.from(5000))).toBe(true);
  });
});

describe('exactness labels of a rational traverse job', () => {
  const job = (courses: unknown[]) => ({
    points: { A: { east: 0, north: 0 } },
    tasks: [{ kind: 'traverse', start: 'A', courses }],
  });
  const run = (courses: unknown[]) => {
    const r = runJob(job(courses), TASK_KINDS, {
      arithmetic: 'rational',
      digits: 12,
      source: 'test',
    });
    return r.tasks[0]!.results;
  };

  it('gives no exact form for compass-adjusted points when a course length is irrational', () => {
    const results = run([
      { latitude: 3, departure: 1 },
      { latitude: -1, departure: 2 },
      { latitude: '-2.01', departure: -3 },
    ]);
    const adjusted = results.filter((q) => /\.(east|north)$/.test(q.name));
    expect(adjusted.length).toBe(4);
    for (const q of adjusted) expect(q.exact).toBeUndefined();
  });

  it('keeps the exact form when every length is a perfect square (3-4-5 courses)', () => {
    const results = run([
      { latitude: 3, departure: 4 },
      { latitude: 0, departure: -4 },
      { latitude: '-3.01', departure: 0 },
    ]);
    const adjusted = results.filter((q) => /\.(east|north)$/.test(q.name));
    expect(adjusted.length).toBe(4);
    for (const q of adjusted) expect(q.exact).toBeDefined();
  });
});
