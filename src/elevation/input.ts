/**
 * Internal: the check every elevation solver makes of its input object before reading it.
 *
 * @module elevation
 * @internal
 */
import { expectObject } from '../geometry/validate.js';

/**
 * Throws `INVALID_ARGUMENT` at `where` unless `x` is an object (so that a missing or wrong
 * input gives a typed error, not a TypeError from reading its fields).
 * @internal
 */
export function checkObject(x: unknown, where: string): void {
  expectObject(x, where, 'an object of named inputs');
}

/** The message for a vertical spread of 1 where the point must lie off the station. @internal */
export const PLUMB_SIGHT =
  'a vertical spread of 1 is a plumb sight: it meets no point off the station';
