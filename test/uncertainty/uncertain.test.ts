import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { rational, decimal, float, uncertain, Uncertain } from '../../src/arithmetic/index.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { QuadspreadError } from '../../src/errors.js';

const R = uncertain(rational);
const F = uncertain(float);
const D = uncertain(decimal(30));

/** ∂y/∂(input named `name`), or undefined. */
function grad<T>(y: Uncertain<T>, name: string): T | undefined {
  for (const [k, v] of y.gradient) if (k.name === name) return v;
  return undefined;
}

const q = (s: string) => rational.from(s);

describe('uncertain(base) is an arithmetic over values with gradients', () => {
  it('uncertain(base).name and exact follow the base', () => {
    expect(R.name).toBe('uncertain(rational)');
    expect(R.exact).toBe(true);
    expect(F.name).toBe('uncertain(float)');
    expect(F.exact).toBe(false);
    expect(D.name).toBe('uncertain(decimal(30))');
  });

  it('uncertain(base).from gives constants with empty gradients', () => {
    for (const x of [R.from(3), R.from('1/3'), R.from(2n), R.zero, R.one, R.pi])
      expect(x.gradient.size).toBe(0);
    expect(rational.toString(R.from('0.1').value)).toBe('1/10');
    expect(F.from(0.5).value).toBe(0.5);
  });

  it('uncertain(base).from refuses bad text and values of another uncertain arithmetic', () => {
    expect(() => R.from('abc')).toThrow(QuadspreadError);
    expect(() => R.from(F.from(1) as never)).toThrow(/another uncertain arithmetic/);
    expect(() => F.from(Number.NaN)).toThrow(QuadspreadError);
    // an overflowed float value is named as such, not as another arithmetic's
    const big = F.mul(F.from(1e200), F.from(1e200));
    expect(() => F.from(big)).toThrow(expect.objectContaining({ code: 'NOT_FINITE' }));
    expect(() => F.make(1, 5 as never)).toThrow(
      expect.objectContaining({
        code: 'INVALID_ARGUMENT',
        where: 'uncertain(float).make(value, gradient)',
      }),
    );
    expect(() => R.make(1, [] as never)).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
  });

  it('uncertain(base).is accepts its own values only', () => {
    expect(R.is(R.from(1))).toBe(true);
    expect(R.is(F.from(1))).toBe(false);
    expect(R.is(3)).toBe(false);
  });

  it('comparisons look at the value only', () => {
    const x = measured(R, 2, '0.1', 'x');
    expect(R.eq(x, R.from(2))).toBe(true);
    expect(R.cmp(x, R.from(3))).toBe(-1);
    expect(R.sign(R.neg(x))).toBe(-1);
    expect(R.isZero(R.sub(x, x))).toBe(true);
    expect(R.toString(x)).toBe('2');
    expect(R.toNumber(x)).toBe(2);
    expect(R.toPrecision(R.div(x, R.from(3)), 3)).toBe('0.667');
  });

  it('the derivatives of + − × ÷ of a rational function are exact over rational (hand-derived)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -50, max: 50 }),
        fc.integer({ min: 1, max: 20 }),
        fc.integer({ min: -50, max: 50 }),
        fc.integer({ min: 1, max: 20 }),
        (xn, xd, yn, yd) => {
          const xv = rational.div(rational.from(xn), rational.from(xd));
          const yv = rational.div(rational.from(yn), rational.from(yd));
          const x = measured(R, xv, 1, 'x');
          const y = measured(R, yv, 1, 'y');
          // f = (x·y + x)/(y² + 1)
          const f = R.div(R.add(R.mul(x, y), x), R.add(R.mul(y, y), R.one));
          const den = rational.add(rational.mul(yv, yv), rational.one);
          // ∂f/∂x = (y + 1)/(y² + 1); ∂f/∂y = (x(y² + 1) − 2y(xy + x))/(y² + 1)² (derived by hand)
          const dx = rational.div(rational.add(yv, rational.one), den);
          const num = rational.sub(
            rational.mul(xv, den),
            rational.mul(
              rational.mul(rational.from(2), yv),
              rational.add(rational.mul(xv, yv), xv),
            ),
          );
          const dy = rational.div(num, rational.mul(den, den));
          expect(rational.eq(grad(f, 'x')!, dx)).toBe(true);
          expect(rational.eq(grad(f, 'y')!, dy)).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('the gradient of a composition equals the chain rule product (rational, exact)', () => {
    // Stages g(x) with their derivatives g′(x), derived by hand.
    type Stage = {
      f: (A: typeof R, x: Uncertain<ReturnType<typeof q>>) => Uncertain<ReturnType<typeof q>>;
      d: (x: ReturnType<typeof q>) => ReturnType<typeof q>;
    };
    const r = rational;
    const stages: Stage[] = [
      { f: (A, x) => A.add(A.mul(x, x), A.one), d: (x) => r.mul(r.from(2), x) }, // x² + 1
      {
        f: (A, x) => A.div(A.one, A.add(A.mul(x, x), A.one)),
        d: (x) =>
          r.neg(
            r.div(r.mul(r.from(2), x), r.mul(r.add(r.mul(x, x), r.one), r.add(r.mul(x, x), r.one))),
          ),
      }, // 1/(x² + 1)
      { f: (A, x) => A.sub(A.mul(A.from(3), x), A.from(2)), d: () => r.from(3) }, // 3x − 2
      { f: (A, x) => A.neg(A.mul(x, A.mul(x, x))), d: (x) => r.neg(r.mul(r.from(3), r.mul(x, x))) }, // −x³
    ];
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: stages.length - 1 }), { minLength: 1, maxLength: 4 }),
        fc.integer({ min: -9, max: 9 }),
        fc.integer({ min: 1, max: 7 }),
        (chain, n, d) => {
          const x0 = r.div(r.from(n), r.from(d));
          let u = measured(R, x0, 1, 'x');
          let plain = x0;
          let product = r.one;
          for (const k of chain) {
            const s = stages[k]!;
            product = r.mul(product, s.d(plain));
            u = s.f(R, u);
            plain = u.value;
          }
          expect(r.eq(grad(u, 'x') ?? r.zero, product)).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('the gradient of a composition of sin, cos, sqrt, atan2 matches the chain rule with Math derivatives (float, 1e-12 relative)', () => {
    const stages: {
      f: (x: Uncertain<number>) => Uncertain<number>;
      v: (x: number) => number;
      d: (x: number) => number;
    }[] = [
      { f: (x) => F.sin(x), v: Math.sin, d: Math.cos },
      { f: (x) => F.cos(x), v: Math.cos, d: (x) => -Math.sin(x) },
      {
        f: (x) => F.sqrt(F.add(F.mul(x, x), F.one))!,
        v: (x) => Math.sqrt(x * x + 1),
        d: (x) => x / Math.sqrt(x * x + 1),
      },
      { f: (x) => F.atan2(x, F.from(2)), v: (x) => Math.atan2(x, 2), d: (x) => 2 / (4 + x * x) },
      {
        f: (x) => F.atan2(F.one, F.add(x, F.from(3))),
        v: (x) => Math.atan2(1, x + 3),
        d: (x) => -1 / (1 + (x + 3) * (x + 3)),
      },
    ];
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: stages.length - 1 }), { minLength: 1, maxLength: 5 }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        (chain, x0) => {
          let u = measured(F, x0, 1, 'x');
          let plain = x0;
          let product = 1;
          let scale = 1;
          for (const k of chain) {
            const s = stages[k]!;
            const dk = s.d(plain);
            product *= dk;
            scale *= Math.abs(dk) + 1e-300;
            plain = s.v(plain);
            u = s.f(u);
          }
          expect(u.value).toBeCloseTo(plain, 12);
          expect(Math.abs((grad(u, 'x') ?? 0) - product)).toBeLessThanOrEqual(
            1e-12 * Math.max(scale, 1e-300) + 1e-300,
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it('uncertain(float) gives the same bits as the generic code over a float-like base', () => {
    const G = uncertain({ ...float } as Arithmetic<number, false>); // not `float` itself: the generic path
    expect(G.name).toBe('uncertain(float)');
    const ops = ['add', 'sub', 'mul', 'div', 'sin', 'cos', 'sqrt', 'atan2', 'neg', 'abs'] as const;
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.constantFrom(...ops), fc.nat(), fc.nat()), {
          minLength: 1,
          maxLength: 12,
        }),
        fc.tuple(
          fc.double({ min: 0.1, max: 10, noNaN: true }),
          fc.double({ min: 0.1, max: 10, noNaN: true }),
        ),
        (prog, [a, b]) => {
          const run = (U: typeof F) => {
            const vals = [
              measured(U, a, 0.1, 'a'),
              measured(U, b, 0.2, 'b'),
              U.from(1.5),
              measured(U, a + b, 0.3, 'c'),
            ];
            for (const [op, i, j] of prog) {
              const x = vals[i % vals.length]!;
              const y = vals[j % vals.length]!;
              let r: Uncertain<number> | undefined;
              if (op === 'sqrt') r = U.sqrt(U.abs(x).value === 0 ? U.one : U.add(U.abs(x), U.one));
              else if (op === 'div') r = U.div(x, U.add(U.abs(y), U.one));
              else if (op === 'atan2') r = U.atan2(y, U.add(U.abs(x), U.one));
              else if (op === 'sin' || op === 'cos' || op === 'neg' || op === 'abs') r = U[op](x);
              else r = U[op](x, y);
              if (Math.abs(r!.value) > 1e6) r = U.from(1);
              vals.push(r!);
            }
            return vals.map((v) => [
              v.value,
              grad(v, 'a') ?? 0,
              grad(v, 'b') ?? 0,
              grad(v, 'c') ?? 0,
              [...v.gradient.keys()].map((k) => k.name).join(),
            ]);
          };
          expect(run(F)).toEqual(run(G as unknown as typeof F));
        },
      ),
      { numRuns: 200 },
    );
  });

  it("a result lists its fuller operand's inputs first, then the other's new ones (the first operand's on a tie)", () => {
    for (const U of [F, R, D] as const) {
      const x = measured(U as typeof F, 1, 1, 'x');
      const y = measured(U as typeof F, 2, 1, 'y');
      const z = measured(U as typeof F, 3, 1, 'z');
      const V = U as typeof F;
      const names = (v: Uncertain<number>) => [...v.gradient.keys()].map((k) => k.name);
      expect(names(V.add(x, y))).toEqual(['x', 'y']); // a tie: the first operand's
      expect(names(V.add(y, x))).toEqual(['y', 'x']);
      expect(names(V.mul(z, V.add(x, y)))).toEqual(['x', 'y', 'z']); // the fuller one leads
      expect(names(V.sub(V.add(x, y), z))).toEqual(['x', 'y', 'z']);
      // every input of one operand among the other's: the other's list, shared
      const xy = V.add(x, y);
      expect(V.mul(y, xy).inputs).toBe(xy.inputs);
      expect(V.div(xy, x).inputs).toBe(xy.inputs);
      // lists that begin alike: [x, y, z] and [x, y, w] make [x, y, z, w]
      const w = measured(V, 4, 1, 'w');
      expect(names(V.add(V.add(xy, z), V.add(xy, w)))).toEqual(['x', 'y', 'z', 'w']);
    }
  });

  it('long inputs lists (positions found by a map, shared beginnings) match a reference of gradients by name', () => {
    // An independent reference: each value's gradient as an ordered list of [name, derivative],
    // combined by the rule of Uncertain.gradient (the operand with more inputs first, then the
    // other's new ones) and by the sum and product rules, adding two terms only where both
    // operands have the input (as x + y; a single term is kept as it is, so -0 stays -0).
    type Ref = { v: number; g: [string, number][] };
    const combine = (a: Ref, ca: number, b: Ref, cb: number, v: number): Ref => {
      const [p, cp, o, co] = a.g.length < b.g.length ? [b, cb, a, ca] : [a, ca, b, cb];
      const fromO = new Map(o.g.map(([n, d]) => [n, co * d] as const));
      const g: [string, number][] = p.g.map(([n, d]) => {
        const x = cp * d;
        const y = fromO.get(n);
        fromO.delete(n);
        return [n, y === undefined ? x : x + y];
      });
      for (const [n, y] of fromO) g.push([n, y]);
      return { v, g };
    };
    const N = 40;
    fc.assert(
      fc.property(
        // sums of runs of inputs (lists of up to 40, many beginning alike), then products and
        // differences of them
        fc.array(fc.tuple(fc.nat(N - 1), fc.integer({ min: 1, max: N }), fc.nat(N - 1)), {
          minLength: 2,
          maxLength: 6,
        }),
        fc.array(fc.tuple(fc.constantFrom('add', 'sub', 'mul'), fc.nat(), fc.nat()), {
          minLength: 1,
          maxLength: 10,
        }),
        (runs, prog) => {
          const xs = Array.from({ length: N }, (_, i) => measured(F, 1 + i / 64, 0.1, `x${i}`));
          const refs: Ref[] = xs.map((x, i) => ({ v: x.value, g: [[`x${i}`, 1]] }));
          const vals: Uncertain<number>[] = [];
          const rv: Ref[] = [];
          for (const [start, len, extra] of runs) {
            // x_start + x_start+1 + … (len inputs, from the start or from x0), then one more
            const from = start % 2 === 0 ? 0 : start;
            let u = xs[from]!;
            let r = refs[from]!;
            for (let i = from + 1; i < Math.min(N, from + len); i++) {
              u = F.add(u, xs[i]!);
              r = combine(r, 1, refs[i]!, 1, u.value);
            }
            u = F.add(u, xs[extra]!);
            r = combine(r, 1, refs[extra]!, 1, u.value);
            vals.push(u);
            rv.push(r);
          }
          for (const [op, i, j] of prog) {
            const a = vals[i % vals.length]!;
            const b = vals[j % vals.length]!;
            const ra = rv[i % vals.length]!;
            const rb = rv[j % vals.length]!;
            if (op === 'add') {
              vals.push(F.add(a, b));
              rv.push(combine(ra, 1, rb, 1, a.value + b.value));
            } else if (op === 'sub') {
              vals.push(F.sub(a, b));
              rv.push(combine(ra, 1, rb, -1, a.value - b.value));
            } else {
              vals.push(F.mul(a, b));
              rv.push(combine(ra, b.value, rb, a.value, a.value * b.value));
            }
          }
          vals.forEach((u, k) => {
            const got = [...u.gradient].map(([input, d]) => [input.name, d]);
            expect(got).toStrictEqual(rv[k]!.g);
          });
        },
      ),
      { numRuns: 300 },
    );
  });

  it('sqrt over rational is exact with derivative 1/(2√a) where the root exists, and undefined where it does not', () => {
    const x = measured(R, '9/4', '1/10', 'x');
    const r = R.sqrt(x)!;
    expect(rational.toString(r.value)).toBe('3/2');
    expect(rational.toString(grad(r, 'x')!)).toBe('1/3'); // 1/(2·3/2)
    expect(R.sqrt(measured(R, 2, '1/10', 'x'))).toBeUndefined();
  });

  it('sqrt of an uncertain zero is refused: its derivative is infinite', () => {
    const x = measured(F, 0, 0.1, 'x');
    expect(() => F.sqrt(x)).toThrow(expect.objectContaining({ code: 'NOT_FINITE' }));
    expect(() => R.sqrt(measured(R, 0, 1, 'x'))).toThrow(
      expect.objectContaining({ code: 'NOT_FINITE' }),
    );
    expect(F.sqrt(F.zero)!.value).toBe(0);
  });

  it('sqrt of a negative value and division by an uncertain zero are refused', () => {
    expect(() => F.sqrt(measured(F, -1, 0.1, 'x'))).toThrow(
      expect.objectContaining({ code: 'NO_REAL_SOLUTION' }),
    );
    expect(() => R.div(R.one, measured(R, 0, 1, 'x'))).toThrow(
      expect.objectContaining({ code: 'DIVISION_BY_ZERO' }),
    );
    expect(() => F.div(F.one, F.zero)).toThrow(
      expect.objectContaining({ code: 'DIVISION_BY_ZERO' }),
    );
    expect(() => D.atan2(D.zero, D.zero)).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    );
  });

  it('abs keeps the gradient for positive values and negates it for negative ones', () => {
    const x = measured(R, -3, 1, 'x');
    expect(rational.toString(grad(R.abs(x), 'x')!)).toBe('-1');
    expect(rational.toString(grad(R.abs(R.neg(x)), 'x')!)).toBe('-1');
  });

  it('one input used twice adds its sensitivities: d(x·x)/dx = 2x', () => {
    const x = measured(D, '1.5', '0.1', 'x');
    const y = D.mul(x, x);
    expect(y.gradient.size).toBe(1);
    expect(D.base.toString(grad(y, 'x')!)).toBe('3');
  });

  it('sin, cos and atan2 carry the derivatives cos, −sin and (x dy − y dx)/(x² + y²) over decimal(30)', () => {
    const t = measured(D, '0.5', '0.001', 't');
    const B = D.base;
    expect(B.toNumber(grad(D.sin(t), 't')!)).toBeCloseTo(Math.cos(0.5), 14);
    expect(B.toNumber(grad(D.cos(t), 't')!)).toBeCloseTo(-Math.sin(0.5), 14);
    const y = measured(D, 3, 1, 'y');
    const x = measured(D, 4, 1, 'x');
    const a = D.atan2(y, x);
    expect(B.toString(grad(a, 'y')!)).toBe('0.16'); // x/(x² + y²) = 4/25
    expect(B.toString(grad(a, 'x')!)).toBe('-0.12'); // −y/(x² + y²) = −3/25
  });

  it('budget(U, measured(U, v, σ, name)).sigma is σ: exactly over rational', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1000, max: 1000 }),
        fc.integer({ min: 0, max: 10000 }),
        fc.integer({ min: 1, max: 997 }),
        (v, sn, sd) => {
          const s = rational.div(rational.from(sn), rational.from(sd));
          const b = budget(R, measured(R, v, s, 'x'));
          expect(b.sigma.eq(s)).toBe(true);
          expect(rational.eq(b.variance, rational.mul(s, s))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('budget(U, measured(U, v, σ, name)).sigma is σ within one ulp over float', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-9, max: 1e3, noNaN: true }),
        (v, s) => {
          const b = budget(F, measured(F, v, s, 'x'));
          expect(Math.abs(b.sigma - s)).toBeLessThanOrEqual(s * Number.EPSILON);
        },
      ),
      { numRuns: 200 },
    );
  });
});
