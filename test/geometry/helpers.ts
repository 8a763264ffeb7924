// Helpers shared by the geometry and cogo tests.
import { rational, decimal, float, QuadspreadError } from '../../src/index.js';
import type { Arithmetic } from '../../src/index.js';

/** The code of the QuadspreadError that f throws, or undefined when it returns; any other error is rethrown. */
export function code(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    if (e instanceof QuadspreadError) return e.code;
    throw e;
  }
  return undefined;
}

/** The three arithmetics every table runs against. */
export const kinds: [string, Arithmetic<unknown, boolean>][] = [
  ['rational', rational as Arithmetic<unknown, boolean>],
  ['decimal(34)', decimal(34) as Arithmetic<unknown, boolean>],
  ['float', float as Arithmetic<unknown, boolean>],
];
