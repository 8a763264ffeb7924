/**
 * Formatting a batch output value.
 *
 * @module cli
 */
import { isSurd } from '../index.js';
import type { Arithmetic } from '../index.js';

/** A value (or surd) as batch output text, to `digits` significant digits. */
export function batchValue<V>(A: Arithmetic<V, boolean>, x: unknown, digits: number): string {
  return isSurd(x) ? x.toPrecision(digits) : A.toPrecision(x as V, digits);
}
