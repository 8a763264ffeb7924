/**
 * Internal: the check every elevation solver makes of its input object before reading it.
 *
 * @module elevation
 * @internal
 */
import { show, invalidArgument } from '../errors.js';

/**
 * Throws `INVALID_ARGUMENT` at `where` unless `x` is an object (so that a missing or wrong
 * input gives a typed error, not a TypeError from reading its fields).
 * @internal
 */
export function checkObject(x: unknown, where: string): void {
  if (typeof x !== 'object' || x === null) throw invalidArgument(where, `${show(x)} is not an object of named inputs`);
}
