// adjustLevelling: identities exactly in rational on random networks, agreement with an
// independent solve of the normal equations by mathjs (exact fractions and floats), the
// datum choices, data snooping, and bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as math from 'mathjs';
import {
  rational as R,
  float as F,
  adjustLevelling,
  QuadspreadError,
  type LevellingInput,
} from '../../src/index.js';

/** A small deterministic generator for the test networks (an LCG, Knuth's MMIX constants). */
function lcg(seed: number): () => number {
  let s = BigInt(seed) & ((1n << 64n) - 1n);
  return () => {
    s = (s * 6364136223846793005n + 1442695040888963407n) & ((1n << 64n) - 1n);
    return Number(s >> 11n) / 2 ** 53;
  };
}

interface Net {
  input: LevellingInput<never>;
  truth: number[];
}

/** A connected network of n points P0…: P0 held at 100 m, a spanning tree plus extra lines. */
function network(seed: number, n: number, extra: number, exact = false, weighted = false): Net {
  const rnd = lcg(seed);
  const truth = Array.from({ length: n }, (_, i) =>
    i === 0 ? 100000 : 95000 + Math.floor(rnd() * 10000),
  );
  const obs: { from: string; to: string; difference: string; sigma: string }[] = [];
  const add = (a: number, b: number): void => {
    const noise = exact ? 0 : Math.floor(rnd() * 7) - 3;
    obs.push({
      from: `P${a}`,
      to: `P${b}`,
      difference: ((truth[b]! - truth[a]! + noise) / 1000).toFixed(3),
      sigma: ['0.001', '0.002', '0.003', '0.0015'][Math.floor(rnd() * 4)]!,
    });
  };
  for (let i = 1; i < n; i++) {
    const j = Math.floor(rnd() * i);
    if (rnd() < 0.5) add(i, j);
    else add(j, i);
  }
  for (let k = 0; k < extra; k++) {
    const a = Math.floor(rnd() * n);
    let b = Math.floor(rnd() * n);
    if (b === a) b = (a + 1) % n;
    add(a, b);
  }
  const fixed: Record<string, unknown> = { P0: '100.000' };
  if (weighted) fixed[`P${n - 1}`] = { value: (truth[n - 1]! / 1000).toFixed(3), sigma: '0.002' };
  return { input: { fixed, observations: obs } as never, truth };
}

const netArb = fc.record({
  seed: fc.integer({ min: 1, max: 1_000_000 }),
  n: fc.integer({ min: 2, max: 8 }),
  extra: fc.integer({ min: 1, max: 6 }),
  weighted: fc.boolean(),
});

const S = (x: unknown): string => R.toString(x as never);

describe('adjustLevelling in rational: identities hold exactly', () => {
  it('Σ redundancy numbers = dof, and Aᵀ·P·v = 0 at every unknown point', () => {
    fc.assert(
      fc.property(netArb, ({ seed, n, extra, weighted }) => {
        const { input } = network(seed, n, extra, false, weighted);
        const r = adjustLevelling(R, input);
        let sum = R.zero;
        for (const o of r.observations) sum = R.add(sum, o.redundancy);
        expect(S(sum)).toBe(String(r.dof));
        // Aᵀ P v: each observation adds p·v at `to` and −p·v at `from` (a benchmark: p·v at itself).
        const atpv = new Map<string, ReturnType<typeof R.from>>();
        const bump = (k: string, x: ReturnType<typeof R.from>) =>
          atpv.set(k, R.add(atpv.get(k) ?? R.zero, x));
        const sigmaOf = (o: (typeof r.observations)[number]) => {
          if (o.kind === 'benchmark') return R.from('0.002');
          return R.from((input.observations[o.index] as { sigma: string }).sigma);
        };
        for (const o of r.observations) {
          const s = sigmaOf(o);
          const pv = R.div(o.residual, R.mul(s, s));
          if (o.kind === 'benchmark') bump(o.to, pv);
          else {
            bump(o.to, pv);
            bump(o.from, R.neg(pv));
          }
        }
        for (const [name, v] of atpv) if (!r.heights[name]!.held) expect(S(v)).toBe('0');
      }),
      { numRuns: 60 },
    );
  });

  it('adding an observation equal to its adjusted value changes no height', () => {
    fc.assert(
      fc.property(netArb, fc.nat(), fc.nat(), ({ seed, n, extra, weighted }, a, b) => {
        const { input } = network(seed, n, extra, false, weighted);
        const r = adjustLevelling(R, input);
        const from = `P${a % n}`;
        const to = `P${(a % n === b % n ? b + 1 : b) % n}`;
        const difference = R.sub(r.heights[to]!.value, r.heights[from]!.value);
        const r2 = adjustLevelling(R, {
          ...input,
          observations: [...input.observations, { from, to, difference, sigma: '0.002' }],
        });
        for (const k of Object.keys(r.heights))
          expect(S(r2.heights[k]!.value)).toBe(S(r.heights[k]!.value));
        expect(r2.dof).toBe(r.dof + 1);
      }),
      { numRuns: 40 },
    );
  });

  it('a network whose loops close exactly gives zero residuals and the true heights', () => {
    fc.assert(
      fc.property(netArb, ({ seed, n, extra }) => {
        const { input, truth } = network(seed, n, extra, true);
        const r = adjustLevelling(R, input);
        for (const o of r.observations) expect(S(o.residual)).toBe('0');
        truth.forEach((t, i) =>
          expect(S(r.heights[`P${i}`]!.value)).toBe(S(R.div(R.from(t), R.from(1000)))),
        );
        expect(S(r.vtpv)).toBe('0');
      }),
      { numRuns: 40 },
    );
  });

  it('does not depend on the order of observations or the names of points', () => {
    fc.assert(
      fc.property(
        netArb,
        fc.integer({ min: 1, max: 1000 }),
        ({ seed, n, extra, weighted }, shuffleSeed) => {
          const { input } = network(seed, n, extra, false, weighted);
          const r = adjustLevelling(R, input);
          const rnd = lcg(shuffleSeed);
          const order = input.observations.map((_, i) => i).sort(() => rnd() - 0.5);
          const rename = (s: string) => `station ${String.fromCharCode(90 - Number(s.slice(1)))}`;
          const fixed = Object.fromEntries(
            Object.entries(input.fixed)
              .reverse()
              .map(([k, v]) => [rename(k), v]),
          );
          const observations = order.map((i) => {
            const o = input.observations[i]!;
            return { ...o, from: rename(o.from), to: rename(o.to) };
          });
          const r2 = adjustLevelling(R, { fixed, observations });
          for (const k of Object.keys(r.heights)) {
            expect(S(r2.heights[rename(k)]!.value)).toBe(S(r.heights[k]!.value));
            expect(r2.heights[rename(k)]!.sigma.toString()).toBe(r.heights[k]!.sigma.toString());
          }
          order.forEach((i, k) =>
            expect(S(r2.observations[k]!.residual)).toBe(S(r.observations[i]!.residual)),
          );
          expect(S(r2.vtpv)).toBe(S(r.vtpv));
        },
      ),
      { numRuns: 40 },
    );
  });
});

/** The normal equations N·h = b of a network, formed here independently with mathjs values. */
function mathjsSolve(input: LevellingInput<never>, kind: 'fraction' | 'number') {
  const num = (x: string) => (kind === 'fraction' ? math.fraction(x) : Number(x));
  const fixed = input.fixed as Record<string, string | { value: string; sigma: string }>;
  const names = [...new Set(input.observations.flatMap((o) => [o.from, o.to]))];
  const held = new Map<string, string>();
  const weighted: [string, string, string][] = [];
  for (const [k, v] of Object.entries(fixed)) {
    if (typeof v === 'string') held.set(k, v);
    else weighted.push([k, v.value, v.sigma]);
  }
  const unknown = names.filter((k) => !held.has(k));
  const u = unknown.length;
  const N = Array.from({ length: u }, () => Array.from({ length: u }, () => num('0')));
  const b = Array.from({ length: u }, () => num('0'));
  const add = (x: unknown, y: unknown) => math.add(x as never, y as never);
  const mul = (x: unknown, y: unknown) => math.multiply(x as never, y as never);
  for (const o of input.observations as unknown as {
    from: string;
    to: string;
    difference: string;
    sigma: string;
  }[]) {
    const p = math.divide(num('1'), mul(num(o.sigma), num(o.sigma)) as never);
    let l: unknown = num(o.difference);
    const terms: [number, number][] = [];
    if (held.has(o.to)) l = math.subtract(l as never, num(held.get(o.to)!) as never);
    else terms.push([unknown.indexOf(o.to), 1]);
    if (held.has(o.from)) l = add(l, num(held.get(o.from)!));
    else terms.push([unknown.indexOf(o.from), -1]);
    for (const [i, ai] of terms) {
      b[i] = add(b[i], mul(mul(p, ai), l)) as never;
      for (const [j, aj] of terms) N[i]![j] = add(N[i]![j], mul(p, ai * aj)) as never;
    }
  }
  for (const [k, v, s] of weighted) {
    const i = unknown.indexOf(k);
    const p = math.divide(num('1'), mul(num(s), num(s)) as never);
    N[i]![i] = add(N[i]![i], p) as never;
    b[i] = add(b[i], mul(p, num(v))) as never;
  }
  const x = math.lusolve(N as never, b as never) as unknown as unknown[][];
  return new Map(unknown.map((k, i) => [k, x[i]![0]]));
}

describe('adjustLevelling agrees with an independent solve by mathjs', () => {
  it('exactly in rational (mathjs lusolve over fractions)', () => {
    fc.assert(
      fc.property(netArb, ({ seed, n, extra, weighted }) => {
        const { input } = network(seed, n, extra, false, weighted);
        const r = adjustLevelling(R, input);
        for (const [k, v] of mathjsSolve(input, 'fraction')) {
          const f = v as { s: bigint; n: bigint; d: bigint };
          expect(S(r.heights[k]!.value)).toBe(S(R.from(`${f.s * f.n}/${f.d}`)));
        }
      }),
      { numRuns: 40 },
    );
  });

  it('within 1e-9 relative in float (mathjs lusolve over numbers)', () => {
    fc.assert(
      fc.property(netArb, ({ seed, n, extra, weighted }) => {
        const { input } = network(seed, n, extra, false, weighted);
        const r = adjustLevelling(F, input);
        for (const [k, v] of mathjsSolve(input, 'number'))
          expect(Math.abs(r.heights[k]!.value - (v as number))).toBeLessThan(
            1e-9 * Math.abs(v as number),
          );
      }),
      { numRuns: 60 },
    );
  });

  it('gives the covariance of the heights σ̂0²·N⁻¹ (N inverted by mathjs exactly)', () => {
    const { input } = network(7, 6, 4);
    const r = adjustLevelling(R, { ...input, options: { covariance: true } });
    const names = r.covariance!.names;
    // N from the definition, inverted by mathjs
    const idx = new Map(names.map((k, i) => [k, i]));
    const N = names.map(() => names.map(() => math.fraction(0)));
    for (const o of input.observations as unknown as {
      from: string;
      to: string;
      sigma: string;
    }[]) {
      const p = math.divide(math.fraction(1), math.square(math.fraction(o.sigma))) as never;
      const t: [number, number][] = [];
      if (idx.has(o.to)) t.push([idx.get(o.to)!, 1]);
      if (idx.has(o.from)) t.push([idx.get(o.from)!, -1]);
      for (const [i, a] of t)
        for (const [j, b] of t) N[i]![j] = math.add(N[i]![j]!, math.multiply(p, a * b)) as never;
    }
    const inv = math.inv(N as never) as unknown as { s: bigint; n: bigint; d: bigint }[][];
    names.forEach((_, i) =>
      names.forEach((__, j) => {
        const f = inv[i]![j]!;
        expect(S(r.covariance!.matrix[i]![j])).toBe(
          S(R.mul(r.varianceFactor!, R.from(`${f.s * f.n}/${f.d}`))),
        );
      }),
    );
  });
});

describe('adjustLevelling datum choices', () => {
  const { input } = network(11, 7, 5);
  const held = adjustLevelling(R, input);
  const minimal = adjustLevelling(R, { ...input, options: { datum: 'minimal' } });
  const inner = adjustLevelling(R, { ...input, options: { datum: 'inner' } });
  it('give the same residuals, vᵀPv and dof with one benchmark', () => {
    for (const r of [minimal, inner]) {
      r.observations.forEach((o, k) =>
        expect(S(o.residual)).toBe(S(held.observations[k]!.residual)),
      );
      expect(S(r.vtpv)).toBe(S(held.vtpv));
      expect(r.dof).toBe(held.dof);
    }
  });
  it('inner: heights differences agree with the held solution; the datum point gets a σ', () => {
    expect(S(R.sub(inner.heights.P3!.value, inner.heights.P1!.value))).toBe(
      S(R.sub(held.heights.P3!.value, held.heights.P1!.value)),
    );
    expect(inner.heights.P0!.sigma.toNumber()).toBeGreaterThan(0);
    expect(held.heights.P0!.sigma.toNumber()).toBe(0);
  });
  it('inner: a network that closes exactly keeps its true heights', () => {
    const { input: exact, truth } = network(11, 7, 5, true);
    const r = adjustLevelling(R, { ...exact, options: { datum: 'inner' } });
    truth.forEach((t, i) =>
      expect(S(r.heights[`P${i}`]!.value)).toBe(S(R.div(R.from(t), R.from(1000)))),
    );
  });
  it('inner: the covariance rows sum to zero over the datum points (all, or the named ones)', () => {
    for (const datumPoints of [undefined, ['P1', 'P4', 'P6']]) {
      const r = adjustLevelling(R, {
        ...input,
        options: { datum: 'inner', covariance: true, ...(datumPoints ? { datumPoints } : {}) },
      });
      const set = new Set(datumPoints ?? r.covariance!.names);
      for (const row of r.covariance!.matrix) {
        let sum = R.zero;
        row.forEach((x, j) => {
          if (set.has(r.covariance!.names[j]!)) sum = R.add(sum, x);
        });
        expect(S(sum)).toBe('0');
      }
    }
  });
  it('inner: the σ² of the heights sum to less than with one point held (minimum trace)', () => {
    let a = 0;
    let b = 0;
    for (const k of Object.keys(inner.heights)) {
      a += inner.heights[k]!.sigma.toNumber() ** 2;
      b += held.heights[k]!.sigma.toNumber() ** 2;
    }
    expect(a).toBeLessThan(b);
  });
});

describe('adjustLevelling weights and tests', () => {
  const lengths = {
    fixed: { BM1: '50.000', BM2: '52.010' },
    observations: [
      { from: 'BM1', to: 'X', difference: '1.234', length: 800 },
      { from: 'X', to: 'Y', difference: '0.500', length: 1200 },
      { from: 'Y', to: 'BM2', difference: '0.271', length: 400 },
      { from: 'X', to: 'BM2', difference: '0.780', length: 900 },
    ],
  };
  it('by length: heights, residuals and redundancy numbers do not depend on sigmaPerKm', () => {
    const a = adjustLevelling(R, lengths);
    const b = adjustLevelling(R, { ...lengths, options: { sigmaPerKm: 2.5 } });
    expect(a.weighting).toBe('length');
    expect(S(a.heights.X!.value)).toBe(S(b.heights.X!.value));
    a.observations.forEach((o, k) => {
      expect(S(o.residual)).toBe(S(b.observations[k]!.residual));
      expect(S(o.redundancy)).toBe(S(b.observations[k]!.redundancy));
    });
    // σ² = (1 mm)²·0.8 km for the first line: 8e-7 m² = 1/1250000 m²
    const p = adjustLevelling(R, { ...lengths, options: { scale: 'a-priori' } });
    expect(p.observations[0]!.sigmaObserved.mul(p.observations[0]!.sigmaObserved).toString()).toBe(
      '1/1250000',
    );
  });
  it('refuses observations with and without a sigma unless weights are mixed on purpose', () => {
    const mixed = {
      ...lengths,
      observations: [
        { ...lengths.observations[0]!, sigma: '0.001' },
        ...lengths.observations.slice(1),
      ],
    };
    expect(() => adjustLevelling(R, mixed)).toThrow(/observations\[1\]/);
    const r = adjustLevelling(R, { ...mixed, options: { weights: 'mixed' } });
    expect(r.weighting).toBe('mixed');
    expect(r.observations.map((o) => o.weightFrom)).toEqual([
      'sigma',
      'length',
      'length',
      'length',
    ]);
  });
  it('flags a 30 mm blunder with w and removes it first by data snooping', () => {
    const { input } = network(5, 8, 10);
    const obs = input.observations.map((o, k) =>
      k === 3
        ? { ...o, difference: (Number((o as { difference: string }).difference) + 0.03).toFixed(3) }
        : o,
    );
    const r = adjustLevelling(R, { ...input, observations: obs });
    expect(r.observations.some((o) => o.suspect)).toBe(true);
    const s = adjustLevelling(R, { ...input, observations: obs, options: { snooping: true } });
    expect(s.snooping!.removed[0]!.index).toBe(3);
    expect(s.observations.every((o) => !o.suspect)).toBe(true);
    expect(s.observations.length).toBe(obs.length - s.snooping!.removed.length);
  });
  it("with Pope's τ uses σ̂0: τ = w·σ0/σ̂0", () => {
    const { input } = network(5, 6, 5);
    const w = adjustLevelling(F, input);
    const t = adjustLevelling(F, { ...input, options: { test: 'tau' } });
    expect(t.localTest.kind).toBe('tau');
    t.observations.forEach((o, k) => {
      if (o.standardized === undefined) return;
      expect(o.standardized).toBeCloseTo(
        (w.observations[k]!.standardized as number) / (w.sigma0 as number),
        9,
      );
    });
  });
});

describe('adjustLevelling refuses bad input with typed errors naming it', () => {
  const ok = {
    fixed: { A: 10 },
    observations: [
      { from: 'A', to: 'B', difference: 1, sigma: 0.001 },
      { from: 'B', to: 'C', difference: 1, sigma: 0.001 },
    ],
  };
  const code = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(QuadspreadError);
      return `${(e as QuadspreadError).code}: ${(e as Error).message}`;
    }
    return 'no error';
  };
  it.each([
    ['no benchmark', { ...ok, fixed: {} }, /DATUM_DEFECT/],
    [
      'a disconnected part',
      {
        ...ok,
        observations: [...ok.observations, { from: 'P', to: 'Q', difference: 1, sigma: 1 }],
      },
      /DISCONNECTED_NETWORK.*"P", "Q"/,
    ],
    [
      'a zero sigma',
      { ...ok, observations: [{ ...ok.observations[0]!, sigma: 0 }, ok.observations[1]!] },
      /INVALID_SIGMA.*observations\[0\]\.sigma/,
    ],
    [
      'a negative sigma',
      { ...ok, observations: [ok.observations[0]!, { ...ok.observations[1]!, sigma: -1 }] },
      /INVALID_SIGMA.*observations\[1\]/,
    ],
    [
      'an observation to itself',
      { ...ok, observations: [{ ...ok.observations[0]!, to: 'A' }] },
      /INVALID_ARGUMENT.*"A" to itself/,
    ],
    [
      'an unknown datum point',
      { ...ok, options: { datum: 'inner', datumPoints: ['Z'] } },
      /UNKNOWN_POINT.*"Z"/,
    ],
    [
      'a minimal datum point without a height',
      { ...ok, options: { datum: 'minimal', datumPoints: ['B'] } },
      /DATUM_DEFECT.*"B"/,
    ],
    [
      'a non-numeric difference',
      { ...ok, observations: [{ ...ok.observations[0]!, difference: 'x' }] },
      /INVALID_NUMBER.*difference/,
    ],
    [
      'a negative benchmark sigma',
      { ...ok, fixed: { A: { value: 1, sigma: -2 } } },
      /INVALID_SIGMA/,
    ],
    ['a bad datum', { ...ok, options: { datum: 'free' } }, /INVALID_ARGUMENT.*datum/],
    [
      'no length nor sigma',
      { ...ok, observations: [{ from: 'A', to: 'B', difference: 1 }] },
      /INVALID_ARGUMENT.*length/,
    ],
  ])('%s', (_name, input, pattern) => {
    expect(code(() => adjustLevelling(R, input as never))).toMatch(pattern);
    expect(code(() => adjustLevelling(F, input as never))).toMatch(pattern);
  });
});
