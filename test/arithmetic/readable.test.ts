// Exact values read as text: in Node's console and util.inspect, through the arithmetic's
// toString/toPrecision/toNumber (which also take surds), and errors that name what to call.
import { describe, expect, it } from 'vitest';
import { inspect } from 'node:util';
import { create, all } from 'mathjs';
import {
  rational,
  float,
  uncertain,
  measured,
  sqrtOf,
  surd,
  heightFromTwoStations,
  heightFromBase,
  QuadspreadError,
} from '../../src/index.js';

const M = create(all!, { number: 'BigNumber', precision: 60 });

function messageOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(QuadspreadError);
    return (e as QuadspreadError).message;
  }
  throw new Error('no error');
}

describe('rational values and surds in the console', () => {
  it('util.inspect shows a fraction as its exact text, alone and inside objects and arrays', () => {
    expect(inspect(rational.from('10161/4'))).toBe('10161/4');
    expect(inspect(rational.from('-0.75'))).toBe('-3/4');
    expect(inspect(rational.from(7))).toBe('7');
    expect(inspect({ H: rational.from('10161/4'), s: [rational.from('1/2')] })).toBe(
      '{ H: 10161/4, s: [ 1/2 ] }',
    );
  });
  it('util.inspect shows a surd as its exact text', () => {
    // √18 = 3√2 and (√10161)/2 = √(10161/4): 10161 = 3²·1129, so √10161 = 3√1129 (by hand)
    expect(inspect(sqrtOf(rational, 18))).toBe('3√2');
    expect(inspect({ h: sqrtOf(rational, '10161/4') })).toBe('{ h: 3√1129/2 }');
    expect(inspect(surd(rational, 41, -20, 2))).toBe('41 - 20√2');
  });
});

describe('the exact arithmetic writes any exact value it returns', () => {
  it('rational.toString, toPrecision and toNumber take a surd and defer to it', () => {
    const r = sqrtOf(rational, 18) as unknown as Parameters<typeof rational.toString>[0];
    expect(rational.toString(r)).toBe('3√2');
    // √18 to 20 digits, from mathjs BigNumber
    expect(rational.toPrecision(r, 20)).toBe(M.sqrt(M.bignumber(18)).toPrecision(20));
    expect(rational.toNumber(r)).toBe(Math.sqrt(18));
  });
  it('computing with a surd as if it were a fraction says which methods to call', () => {
    const r = sqrtOf(rational, 2) as unknown as Parameters<typeof rational.add>[0];
    const m = messageOf(() => rational.add(r, rational.one));
    expect(m).toContain('is a surd');
    expect(m).toContain('x.toString()');
    expect(m).toContain('x.add(y)');
    expect(m).not.toContain('use rational.from');
  });
  it('a JS number where a fraction is expected: the error says to read it with rational.from', () => {
    const m = messageOf(() => rational.toString(0.5 as never));
    expect(m).toContain('rational.from(x)');
  });
  it('an uncertain value where a base value is expected: the error names U.toString and .value', () => {
    const U = uncertain(float);
    const x = measured(U, 3, 0.1, 'x');
    const m = messageOf(() => rational.toString(x as never));
    expect(m).toContain('U.toString(x)');
    expect(m).toContain('x.value');
  });
});

describe('height discrepancies as lengths', () => {
  // Stations (0, 0) and (10, 0), foot (4, 3): Q1 = 25, Q2 = 6² + 3² = 45 (by hand).
  const stations = [
    { x: 0, y: 0 },
    { x: 10, y: 0 },
  ] as const;
  const foot = { x: 4, y: 3 };
  it('heightFromTwoStations: h1 − h2 exactly when the roots share a radicand', () => {
    // R1 = 1/2 → H1 = 25·1 = 25, h1 = 5; R2 = 3/8 → H2 = 45·(3/5) = 27, h2 = 3√3
    const r = heightFromTwoStations(rational, { stations, foot, vertical: ['1/2', '3/8'] });
    expect(rational.toString(r.discrepancy)).toBe('-2');
    expect(String(r.heightDiscrepancy)).toBe('5 - 3√3');
    const f = heightFromTwoStations(float, { stations, foot, vertical: [0.5, 0.375] });
    expect(f.heightDiscrepancy).toBeCloseTo(5 - Math.sqrt(27), 13);
  });
  it('heightFromTwoStations: different radicands give a rational within 1e-40 relative', () => {
    // R1 = 2/3 → H1 = 25·2 = 50, h1 = 5√2; R2 = 3/8 → H2 = 27, h2 = 3√3
    const r = heightFromTwoStations(rational, { stations, foot, vertical: ['2/3', '3/8'] });
    const want = M.subtract(M.sqrt(M.bignumber(50)), M.sqrt(M.bignumber(27)));
    expect(rational.toPrecision(r.heightDiscrepancy as never, 35)).toBe(want.toPrecision(35));
  });
  it('heightFromBase: the two readings disagree by 1 m in height and 25 m² in H', () => {
    // base (0, 0)–(14, 0), foot (5, 12): Q1 = 169, Q2 = 9² + 12² = 225 (by hand).
    // R1 = 1/2 → H1 = 169, h1 = 13; R2 = 16/41 → R2/(1 − R2) = 16/25, H2 = 144, h2 = 12.
    const r = heightFromBase(rational, {
      base: 196,
      spreads: ['144/169', '16/25'],
      foot: 'between',
      vertical: ['1/2', '16/41'],
    });
    expect(String(r.discrepancy)).toBe('25');
    expect(String(r.heightDiscrepancy)).toBe('1');
    const one = heightFromBase(rational, {
      base: 196,
      spreads: ['144/169', '16/25'],
      foot: 'between',
      vertical: ['1/2', undefined],
    });
    expect(one.heightDiscrepancy).toBeUndefined();
  });
});
