// Bad input gets a typed QuadspreadError, never a TypeError: every function of the generic
// entry is called in float, rational and decimal(20) with junk in each argument position
// (missing, null, numbers, text that is no number, empty objects and arrays, NaN, ±Infinity,
// a function, a symbol, a bigint) and must either return or throw a QuadspreadError.
// Excluded, as documented: the geometry primitives that take values of the arithmetic
// (points made by `point`, lines by `line`/`lineThrough`), which read fields of their
// arguments without checks to stay fast; and the arithmetic factories themselves.
import { describe, expect, it } from 'vitest';
import * as q from '../src/index.js';

const VALUE_TAKING = new Set([
  'quadrance',
  'vectorQuadrance',
  'spread',
  'cross',
  'spreadOfVectors',
  'triangle',
  'lineThrough',
  'isOnLine',
  'isParallel',
  'isPerpendicular',
  'footOfPerpendicular',
  'quadranceToLine',
  'spreadOfLines',
]);
const FACTORIES = new Set([
  'rational',
  'float',
  'decimal',
  'uncertain',
  'decimalElementary',
  'monteCarlo',
]);
const JUNK: unknown[] = [
  undefined,
  null,
  0,
  -1,
  'abc',
  {},
  [],
  [null],
  { x: 1 },
  NaN,
  Infinity,
  () => 1,
  Symbol('s'),
  10n,
];

const functions = Object.entries(q).filter(
  ([k, v]) =>
    typeof v === 'function' && !/^[A-Z]/.test(k) && !VALUE_TAKING.has(k) && !FACTORIES.has(k),
) as [string, (...a: unknown[]) => unknown][];

describe('every function answers junk with a QuadspreadError', () => {
  it('covers the entry (more than 90 functions)', () => {
    expect(functions.length).toBeGreaterThan(90);
  });

  it.each([
    ['float', q.float],
    ['rational', q.rational],
    ['decimal(20)', q.decimal(20)],
  ] as const)('in %s', (_n, A) => {
    const breaches: string[] = [];
    for (const [name, f] of functions) {
      for (const j of JUNK) {
        for (const args of [
          [A, j],
          [A, j, j, j],
          [A, 1, j],
          [A, 1, 1, j],
        ]) {
          try {
            f(...args);
          } catch (e) {
            if (!(e instanceof q.QuadspreadError)) {
              breaches.push(
                `${name}(${args.map((a) => (a === A ? 'A' : typeof a === 'symbol' ? 'Symbol' : typeof a === 'bigint' ? `${a}n` : typeof a === 'function' ? 'fn' : (JSON.stringify(a) ?? 'undefined'))).join(', ')}): ${(e as Error).name}: ${(e as Error).message}`,
              );
              break;
            }
          }
        }
      }
    }
    expect(breaches).toEqual([]);
  });
});
