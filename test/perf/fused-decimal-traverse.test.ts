// The fused decimal traverse kernel: sums exact (equal to the generic sums), each adjusted
// value the exact compass-rule value correctly rounded (ties to even) to the digits; the same
// errors as the generic code.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimal, rational, QuadspreadError } from '../../src/index.js';
import type { Arithmetic, Decimal } from '../../src/index.js';
import { traverse } from '../../src/cogo/index.js';

const pow10 = (k: number): bigint => 10n ** BigInt(k);
const ndigits = (a: bigint): number => (a < 0n ? -a : a).toString().length;
/** n/d rounded to p significant digits, ties to even, as text (derived here, independently). */
function roundHalfEven(n: bigint, d: bigint, p: number): string {
  if (n === 0n) return '0';
  const neg = n < 0n;
  if (neg) n = -n;
  let k = p - (ndigits(n) - ndigits(d));
  const at = (j: number): [bigint, bigint] => (j >= 0 ? [n * pow10(j), d] : [n, d * pow10(-j)]);
  let [a, b] = at(k);
  let q = a / b;
  while (q >= pow10(p)) {
    [a, b] = at(--k);
    q = a / b;
  }
  while (q < pow10(p - 1)) {
    [a, b] = at(++k);
    q = a / b;
  }
  const r2 = 2n * (a - q * b);
  if (r2 > b || (r2 === b && q % 2n === 1n)) q += 1n;
  return `${neg ? '-' : ''}${q}e${-k}`;
}

const mmText = fc.integer({ min: -300_000, max: 300_000 }).map((m) => `${m / 1000}`);
const course = fc.record({
  latitude: mmText,
  departure: mmText,
  distance: fc.integer({ min: 0, max: 300_000 }).map((m) => `${m / 1000}`),
});
const input = fc.record({
  start: fc.record({ x: mmText, y: mmText }),
  courses: fc.array(course, { minLength: 1, maxLength: 40 }),
});

function code(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : `not a QuadspreadError: ${String(e)}`;
  }
  return undefined;
}

describe('the fused decimal traverse kernel', () => {
  it('gives the exact sums and the correctly rounded exact adjustment', () => {
    fc.assert(
      fc.property(input, fc.constantFrom(12, 20, 34), (t, p) => {
        const D = decimal(p);
        const plain: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
        const e = code(() => traverse(plain, t));
        expect(code(() => traverse(D, t))).toBe(e);
        if (e !== undefined) return;
        const fast = traverse(D, t);
        const slow = traverse(plain, t);
        const exact = traverse({ ...rational, kernels: undefined }, t);
        // Millimetre sums of at most 40 courses need at most 10 digits: exact in both.
        for (const [a, b] of [
          [fast.closure.east, slow.closure.east],
          [fast.closure.north, slow.closure.north],
          [fast.length, slow.length],
        ] as const)
          expect(D.eq(a, b)).toBe(true);
        fast.points.forEach((P, i) =>
          expect(D.eq(P.x, slow.points[i]!.x) && D.eq(P.y, slow.points[i]!.y)).toBe(true),
        );
        fast.adjusted.forEach((P, i) => {
          const X = exact.adjusted[i]!;
          expect(
            D.eq(P.x, D.from(roundHalfEven(X.x.s * X.x.n, X.x.d, p))),
            `adjusted[${i}].x`,
          ).toBe(true);
          expect(
            D.eq(P.y, D.from(roundHalfEven(X.y.s * X.y.n, X.y.d, p))),
            `adjusted[${i}].y`,
          ).toBe(true);
        });
        fast.courses.forEach((c, i) => {
          const x = exact.courses[i]!;
          expect(
            D.eq(
              c.adjustedLatitude,
              D.from(
                roundHalfEven(x.adjustedLatitude.s * x.adjustedLatitude.n, x.adjustedLatitude.d, p),
              ),
            ),
          ).toBe(true);
          expect(
            D.eq(
              c.adjustedDeparture,
              D.from(
                roundHalfEven(
                  x.adjustedDeparture.s * x.adjustedDeparture.n,
                  x.adjustedDeparture.d,
                  p,
                ),
              ),
            ),
          ).toBe(true);
        });
        expect(fast.closure.ratio === undefined).toBe(slow.closure.ratio === undefined);
      }),
      { numRuns: 200 },
    );
  });

  it('rounds its sums at the edges: ties to even, nines carried, trailing zeros dropped', () => {
    // Three significant digits. Each start and course value has three digits or fewer, so the
    // reading rounds nothing; the running sums below need four and are rounded once (IEEE 754
    // roundTiesToEven, worked by hand): 9990 + 5 = 9995 → 1.00e4 (999 is odd: up, every nine
    // carried); 9980 + 5 = 9985 → 9980 (998 is even: kept); 9980 + 6 = 9986 → 9990 (up, no
    // carry); 9990 + 9 = 9999 → 1.00e4; 12000 + 0 = 12000 (written 1.2e4, two digits); and
    // the two below.
    const D = decimal(3);
    const cases: [string, string, string][] = [
      ['9990', '5', '10000'],
      ['9980', '5', '9980'],
      ['9980', '6', '9990'],
      ['9990', '9', '10000'],
      ['-9990', '-5', '-10000'],
      ['12000', '0', '12000'],
      // 10900 + 96 = 10996 → 110|96: up; the nines carried, the zero before them kept → 11000.
      ['10900', '96', '11000'],
      // 99800 + 51 = 99851 → 998|51: up although 8 is even (a digit after the 5) → 99900.
      ['99800', '51', '99900'],
    ];
    for (const [a, b, want] of cases) {
      const input = {
        start: { x: D.from('0'), y: D.from('0') },
        courses: [
          { latitude: D.zero, departure: D.from(a), distance: D.from(a.replace('-', '')) },
          { latitude: D.zero, departure: D.from(b), distance: D.from(b.replace('-', '')) },
          { latitude: D.from('1'), departure: D.zero, distance: D.from('1') },
        ],
      };
      const fast = traverse(D, input);
      const plain: Arithmetic<Decimal, false> = { ...D, kernels: undefined };
      const slow = traverse(plain, input);
      expect(D.toString(fast.points[2]!.x), `${a} + ${b}`).toBe(want);
      expect(D.toString(slow.points[2]!.x), `${a} + ${b}, generic`).toBe(want);
      expect(fast.points[2]!.x.c.at(-1) !== 0 || fast.points[2]!.x.c.length === 1).toBe(true);
    }
  });
});
