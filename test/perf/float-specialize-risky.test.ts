// scripts/float-specialize.mjs must not change what any function does. This bundles
// fixtures/risky.ts (patterns a source-to-source rewrite can get wrong: a shadowed or
// reassigned arithmetic, optional chaining, spread and extra arguments, method references,
// `arguments`, `this`, setters, catch bindings, defaults) through the plugin and compares every
// function with the same source run unbundled, in float and in rational, on random inputs.
import { describe, expect, it, beforeAll } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
// @ts-expect-error: a plain ES module without types
import { specializeSource } from '../../scripts/float-specialize.mjs';
import { loadSpecialised } from '../float-entry.js';
import * as G from './fixtures/risky.js';
import { float, rational } from '../../src/index.js';

const here = path.dirname(fileURLToPath(import.meta.url));
const fixture = path.join(here, 'fixtures/risky.ts');

/** A comparable picture of a result or an error: numbers (−0 kept), text, lists; other values by String. */
function picture(v: unknown): unknown {
  if (typeof v === 'number') return Object.is(v, -0) ? '-0' : v;
  if (Array.isArray(v)) return v.map(picture);
  if (v === undefined || v === null || typeof v === 'string' || typeof v === 'boolean') return v;
  if (typeof v === 'function') return 'function';
  return `${typeof v}:${String(v)}`;
}

function outcome(f: () => unknown): unknown {
  try {
    return { value: picture(f()) };
  } catch (e) {
    return {
      error:
        e instanceof Error
          ? `${e.name}:${(e as { code?: string }).code ?? ''}:${e.message}`
          : String(e),
    };
  }
}

let B: Record<string, any>;
beforeAll(async () => {
  B = await loadSpecialised(path.join(here, 'fixtures/entry-risky.ts'));
}, 60_000);

// Finite numbers whose sums and products stay finite: the float object's operations refuse
// other operands and a non-finite result, which the specialised copy leaves to the checks where
// values enter and leave the public functions (so the two agree on these inputs only).
const num = fc.oneof(
  fc.double({ min: -1e100, max: 1e100, noNaN: true }),
  fc.constant(0),
  fc.constant(-0),
  fc.integer({ min: -9, max: 9 }),
);
const loose = num;
const frac = fc
  .tuple(fc.integer({ min: -50, max: 50 }), fc.integer({ min: 1, max: 9 }))
  .map(([n, d]) => rational.from(`${n}/${d}`));

describe('float-specialize on risky patterns', () => {
  it('specialises the functions it can and leaves alone those whose arithmetic is not a safe first parameter', () => {
    const { functions } = specializeSource(readFileSync(fixture, 'utf8'), fixture);
    for (const f of [
      'accessorShadow',
      'calls',
      'argumentsUse',
      'thisUse',
      'defaults',
      'closures',
      'loose',
      'constants',
    ])
      expect(functions).toContain(f);
    // second parameter; catch (A); [A] = …; for (A of …)
    for (const f of ['secondParam', 'catchShadow', 'destructured', 'loopRebind'])
      expect(functions).not.toContain(f);
  });

  it('leaves A.toString, A.constructor and other inherited names as they are', () => {
    const { code } = specializeSource(
      'export function f(A: Arithmetic<number>, a: number) { return [a].map(A.toString).concat(A.constructor, A.valueOf(), A.zero.toFixed(1)); }',
      'z.ts',
    );
    expect(code).toContain('.map(A.toString)');
    expect(code).toContain('A.constructor');
    expect(code).toContain('(0).toFixed(1)');
  });

  it('every risky function gives in the bundle what the plain source gives, in float', () => {
    fc.assert(
      fc.property(loose, loose, (a, b) => {
        for (const name of [
          'catchShadow',
          'accessorShadow',
          'destructured',
          'loopRebind',
          'closures',
        ]) {
          expect(
            outcome(() => B[name](B.float, a)),
            name,
          ).toEqual(outcome(() => (G as any)[name](float, a)));
        }
        expect(outcome(() => B.calls(B.float, a, b))).toEqual(
          outcome(() => G.calls(float, a as number, b as number)),
        );
        expect(outcome(() => B.loose(B.float, a, b))).toEqual(
          outcome(() => G.loose(float, a as number, b as number)),
        );
        expect(outcome(() => B.secondParam(a, B.float))).toEqual(
          outcome(() => G.secondParam(a as number, float)),
        );
        expect(outcome(() => B.defaults(B.float, { x: a, y: b }))).toEqual(
          outcome(() => G.defaults(float, { x: a as number, y: b as number })),
        );
        expect(outcome(() => B.defaults(B.float, { x: a, y: b }, b))).toEqual(
          outcome(() => G.defaults(float, { x: a as number, y: b as number }, b as number)),
        );
        expect(outcome(() => B.argumentsUse(B.float, a))).toEqual(
          outcome(() => G.argumentsUse(float, a as number)),
        );
        expect(outcome(() => B.argumentsUse(B.float, a, b, 'extra'))).toEqual(
          outcome(() => (G.argumentsUse as any)(float, a, b, 'extra')),
        );
        expect(outcome(() => B.thisUse.call({}, B.float, a))).toEqual(
          outcome(() => G.thisUse.call({}, float, a as number)),
        );
      }),
      { numRuns: 300 },
    );
    expect(outcome(() => B.constants(B.float))).toEqual(outcome(() => G.constants(float)));
  });

  it('every risky function gives in the bundle what the plain source gives, in rational (the untouched copy)', () => {
    const R = B.rational as typeof rational;
    fc.assert(
      fc.property(frac, frac, (x, y) => {
        // The bundle has its own copy of fraction.js: pass it values of its own rational.
        const a = R.from(rational.toString(x)),
          b = R.from(rational.toString(y));
        for (const name of [
          'catchShadow',
          'accessorShadow',
          'destructured',
          'loopRebind',
          'closures',
        ]) {
          expect(
            outcome(() => B[name](R, a)),
            name,
          ).toEqual(outcome(() => (G as any)[name](rational, x)));
        }
        expect(outcome(() => B.calls(R, a, b))).toEqual(outcome(() => G.calls(rational, x, y)));
        expect(outcome(() => B.defaults(R, { x: a, y: b }))).toEqual(
          outcome(() => G.defaults(rational, { x, y })),
        );
        expect(outcome(() => B.argumentsUse(R, a))).toEqual(
          outcome(() => G.argumentsUse(rational, x)),
        );
        expect(outcome(() => B.argumentsUse(R, a, b, 'extra'))).toEqual(
          outcome(() => (G.argumentsUse as any)(rational, x, y, 'extra')),
        );
        expect(outcome(() => B.thisUse.call({ k: 1 }, R, a))).toEqual(
          outcome(() => G.thisUse.call({ k: 1 }, rational, x)),
        );
      }),
      { numRuns: 100 },
    );
  });
});
