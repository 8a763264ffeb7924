/**
 * What the io writers share in reading their content: optional lists, and a parcel's
 * boundary as an open ring with its signed area. Internal.
 *
 * @module io
 */
import { QuadspreadError, area, type Arithmetic } from '../index.js';
import { show } from '../errors.js';
import type { PlaneVertex } from './geojson-write.js';

/**
 * `v` as a list (`[]` when absent), or `INVALID_ARGUMENT` naming `where(content.what)` when it
 * is not an array or has a hole (which `forEach` and `map` would pass over without a word).
 * @internal
 */
export function contentList<X>(
  v: readonly X[] | undefined,
  where: string,
  what: string,
): readonly X[] {
  if (v === undefined) return [];
  if (!Array.isArray(v))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(content.${what})`,
      `${show(v)} is not an array`,
    );
  for (let i = 0; i < v.length; i++)
    if (!(i in v))
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${where}(content.${what}[${i}])`,
        'is a hole in the array',
      );
  return v;
}

/**
 * A parcel's boundary without its closing vertex (when the last repeats the first), and its
 * signed plane area (positive counterclockwise); `INVALID_ARGUMENT` at `at` when it encloses
 * no area.
 * @internal
 */
export function parcelRing<T>(
  A: Arithmetic<T, boolean>,
  vertices: readonly PlaneVertex<T>[],
  at: string,
): { ring: PlaneVertex<T>[]; signed: T } {
  let ring = [...vertices];
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (
    ring.length > 3 &&
    A.eq(A.from(first!.x as T), A.from(last!.x as T)) &&
    A.eq(A.from(first!.y as T), A.from(last!.y as T))
  )
    ring = ring.slice(0, -1);
  const signed = area(A, ring);
  if (A.isZero(signed))
    throw new QuadspreadError('INVALID_ARGUMENT', `${at}.points`, 'the boundary encloses no area');
  return { ring, signed };
}
