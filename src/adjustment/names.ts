/**
 * Helpers shared by the adjustments: point names, connectivity to the datum, sigmas.
 *
 * @module adjustment
 * @internal
 */
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { QuadspreadError, show, invalidArgument } from '../errors.js';
import { readNumber } from '../geometry/validate.js';

/** Reads a point name: a non-empty string of at most 200 characters. @internal */
export function readName(x: unknown, where: string): string {
  if (typeof x !== 'string' || x.length === 0 || x.length > 200)
    throw invalidArgument(where, `${show(x)} is not a point name (non-empty text)`);
  return x;
}

/** Reads a standard deviation > 0. @internal */
export function readSigma<T>(A: Arithmetic<T>, x: Numeric<T>, where: string): T {
  const v = readNumber(A, x, where);
  if (A.sign(v) <= 0)
    throw new QuadspreadError('INVALID_SIGMA', where, `σ = ${A.toString(v)} is not positive`);
  return v;
}

/** A list of names for a message: the first ten, then how many more. @internal */
export function listNames(names: readonly string[]): string {
  const shown = names.slice(0, 10).map((n) => JSON.stringify(n));
  return names.length > 10 ? `${shown.join(', ')} and ${names.length - 10} more` : shown.join(', ');
}

/**
 * The points no chain of edges joins to one of `roots` (breadth-first search); edges are
 * pairs of point numbers. @internal
 */
export function unreached(
  count: number,
  edges: readonly (readonly number[])[],
  roots: readonly number[],
): number[] {
  const adj: number[][] = Array.from({ length: count }, () => []);
  for (const e of edges)
    for (let a = 0; a < e.length; a++)
      for (let b = 0; b < e.length; b++) if (a !== b) adj[e[a]!]!.push(e[b]!);
  const seen = new Uint8Array(count);
  const queue: number[] = [];
  for (const r of roots)
    if (!seen[r]) {
      seen[r] = 1;
      queue.push(r);
    }
  for (let q = 0; q < queue.length; q++)
    for (const u of adj[queue[q]!]!)
      if (!seen[u]) {
        seen[u] = 1;
        queue.push(u);
      }
  const out: number[] = [];
  for (let i = 0; i < count; i++) if (!seen[i]) out.push(i);
  return out;
}

/** Throws `DISCONNECTED_NETWORK` naming the unreached points, if any. @internal */
export function requireConnected(
  names: readonly string[],
  edges: readonly (readonly number[])[],
  roots: readonly number[],
  where: string,
): void {
  const lost = unreached(names.length, edges, roots);
  if (lost.length > 0)
    throw new QuadspreadError(
      'DISCONNECTED_NETWORK',
      where,
      `no observations connect ${listNames(lost.map((i) => names[i]!))} to the datum`,
    );
}
