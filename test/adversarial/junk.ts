// Junk for the adversarial suite: values of the wrong type, objects that fight back (no
// prototype, throwing getters and conversions, Proxies that throw on every trap, revoked
// Proxies), sparse arrays, and numbers and numeric text at the edges (NaN, ±Infinity, −0,
// 1e±308, subnormals, huge digit strings).
import fc from 'fast-check';

/** Marks "make this array element a hole" (delete it from a copy of the array). */
export const HOLE: unique symbol = Symbol('hole');

function throwingGetters(): object {
  const o: Record<string, unknown> = {};
  for (const k of [
    'x',
    'y',
    'value',
    'length',
    'east',
    'north',
    'toString',
    'valueOf',
    'constructor',
  ]) {
    Object.defineProperty(o, k, {
      enumerable: true,
      get() {
        throw new Error(`getter ${k}`);
      },
    });
  }
  return o;
}

function throwingProxy(target: object = {}): object {
  const no = (): never => {
    throw new Error('proxy trap');
  };
  return new Proxy(target, {
    get: no,
    has: no,
    ownKeys: no,
    getOwnPropertyDescriptor: no,
    getPrototypeOf: no,
    apply: no,
    construct: no,
    set: no,
    defineProperty: no,
    deleteProperty: no,
  });
}

function revoked(): object {
  const r = Proxy.revocable({}, {});
  r.revoke();
  return r.proxy;
}

function sparse(n: number): unknown[] {
  const a: unknown[] = [];
  a.length = n;
  a[n - 1] = 1;
  return a;
}

/** Fixed junk, each made fresh (objects are not shared between calls). */
const FIXED: (() => unknown)[] = [
  () => null,
  () => undefined,
  () => NaN,
  () => Infinity,
  () => -Infinity,
  () => -0,
  () => 0,
  () => 1e308,
  () => -1e308,
  () => 1e-308,
  () => 5e-324,
  () => Number.MAX_SAFE_INTEGER + 2,
  () => 2 ** 1023 * 1.9999,
  () => '',
  () => ' ',
  () => 'abc',
  () => 'NaN',
  () => 'Infinity',
  () => '0x10',
  () => '1e1000',
  () => '1e-1000',
  () => '-1e999',
  () => '9'.repeat(999),
  () => '9'.repeat(5000),
  () => '1/0',
  () => '1' + '0'.repeat(300) + '.5',
  () => 'N 45 E',
  () => 'E 100',
  () => 400,
  () => -1,
  () => true,
  () => 10n ** 400n,
  () => -1n,
  () => Symbol('junk'),
  () => () => 1,
  () => [],
  () => [1, 2],
  () => sparse(3),
  () => sparse(1e6),
  () => ({}),
  () => ({ x: NaN, y: 0 }),
  () => ({ x: '0x10', y: '1e-999' }),
  () => ({ x: null, y: null }),
  () => ({ x: '1e999', y: '1e-999' }),
  () => Object.create(null),
  () => Object.assign(Object.create(null), { x: 1, y: 2 }),
  () => throwingGetters(),
  () => throwingProxy(),
  () => throwingProxy([]),
  () => revoked(),
  () => new Date(NaN),
  () => new Map(),
  () => ({ toString: () => '12', valueOf: () => 12 }),
  () => ({
    [Symbol.toPrimitive]() {
      throw new Error('toPrimitive');
    },
  }),
  () => HOLE,
];

/**
 * A recipe for one junk value (fast-check must not hold the hostile objects themselves: it
 * inspects what it generates). {@link makeJunk} makes the value.
 */
export type JunkRecipe = { fixed: number } | { value: unknown };

/** One junk recipe: fixed junk, or an arbitrary value, double, string or big number text. */
export const junk: fc.Arbitrary<JunkRecipe> = fc.oneof(
  { weight: 6, arbitrary: fc.nat(FIXED.length - 1).map((i) => ({ fixed: i })) },
  { weight: 1, arbitrary: fc.double().map((value) => ({ value })) },
  { weight: 1, arbitrary: fc.string({ maxLength: 12 }).map((value) => ({ value })) },
  { weight: 1, arbitrary: fc.anything({ maxDepth: 2 }).map((value) => ({ value })) },
  {
    weight: 1,
    arbitrary: fc
      .tuple(
        fc.constantFrom('', '-'),
        fc.integer({ min: 1, max: 1200 }),
        fc.integer({ min: -1100, max: 1100 }),
      )
      .map(([s, n, e]) => ({ value: `${s}${'7'.repeat(n)}e${e}` })),
  },
);

/** The junk value of a recipe (objects made fresh each time). */
export function makeJunk(r: JunkRecipe): unknown {
  return 'fixed' in r ? FIXED[r.fixed]!() : r.value;
}
