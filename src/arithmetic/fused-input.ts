/**
 * The input checks the fused traverse kernels share: the shape the generic `traverse`
 * accepts, read with a kernel's own value reader. Anything else is left to the generic code
 * (which reports the error).
 *
 * @module arithmetic
 * @internal
 */

/** A traverse input a fused kernel can take: start, closing point and the raw course list. @internal */
export interface FusedTraverseInput<V> {
  readonly start: { x: V; y: V };
  readonly end: { x: V; y: V };
  readonly list: readonly unknown[];
}

/**
 * Reads `{ start, close?, courses, rule? }` for the compass rule with `read` (a kernel's
 * reader of one coordinate, `undefined` for a value it does not take); `undefined` when the
 * input is anything else.
 * @internal
 */
export function readFusedTraverse<V>(
  input: unknown,
  read: (x: unknown) => V | undefined,
): FusedTraverseInput<V> | undefined {
  if (input === null || typeof input !== 'object') return undefined;
  const t = input as {
    start?: unknown;
    close?: unknown;
    courses?: unknown;
    rule?: unknown;
    interiorAngles?: unknown;
  };
  if ((t.rule !== undefined && t.rule !== 'compass') || t.interiorAngles !== undefined)
    return undefined;
  const list = t.courses;
  if (!Array.isArray(list) || list.length === 0 || list.length > 1_000_000) return undefined;
  const pt = (p: unknown): { x: V; y: V } | undefined => {
    if (p === null || typeof p !== 'object' || !('x' in p) || !('y' in p)) return undefined;
    const x = read((p as { x: unknown }).x),
      y = read((p as { y: unknown }).y);
    return x !== undefined && y !== undefined ? { x, y } : undefined;
  };
  const start = pt(t.start);
  if (!start) return undefined;
  const end = t.close === undefined ? start : pt(t.close);
  if (!end) return undefined;
  return { start, end, list };
}
