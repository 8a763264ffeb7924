/**
 * The float twin of side shots: the generic code's operations (src/field/reduce.ts,
 * src/field/side-shot.ts), in the same order, on plain numbers, for the plain shot — numeric
 * circle, zenith, slope and optional target height, no corrections — without the error
 * locations, object spreads and arithmetic calls the generic path builds for every shot.
 * test/perf/float-twins.test.ts checks that it returns exactly what the generic code returns.
 *
 * @module field
 * @internal
 */
import { sinCosQuadrantInto } from '../arithmetic/float-trig.js';
import { PER_DEGREE, sinCosInto, turnFloat } from '../readings/trig-float.js';
import type { ReadSetup } from './internal.js';
import type { SideShot } from './side-shot.js';

/** sin and cos of the zenith angle and of the bearing of the shot in progress. */
const SC = /* @__PURE__ */ new Float64Array(4);

/**
 * The side shot `o` from the read set-up `s` as the generic code computes it in float, or
 * `undefined` when the shot needs the generic path (a correction, a unit, text or a value the
 * generic code refuses, a result that is not finite): the generic code then computes or
 * reports it.
 * @internal
 */
export function shotFloat(s: ReadSetup<number>, o: unknown): SideShot<number> | undefined {
  if (o === null || typeof o !== 'object') return undefined;
  const r = o as Record<string, unknown>;
  const slope = r.slope;
  const zenith = r.zenith;
  const c = r.circle;
  const ht = r.targetHeight === undefined ? 0 : r.targetHeight;
  if (
    typeof slope !== 'number' ||
    typeof zenith !== 'number' ||
    typeof c !== 'number' ||
    typeof ht !== 'number' ||
    !(slope >= 0 && slope < Infinity && c - c === 0 && ht - ht === 0) ||
    !(zenith > 0 && zenith < 360) ||
    r.unit !== undefined ||
    r.ppm !== undefined ||
    r.atmosphere !== undefined ||
    r.ppmApplied !== undefined ||
    r.prismConstant !== undefined ||
    r.curvature !== undefined ||
    r.grid !== undefined ||
    r.instrumentHeight !== undefined
  )
    return undefined;
  // reduceAt: S = S_raw·(1 + ppm·10⁻⁶) + prism constant, with ppm = 0 and no prism constant.
  const S = slope + (slope * 0) / 1000000 + 0;
  const right = zenith > 180;
  const z = right ? 360 - zenith : zenith;
  const circle = turnFloat(right ? c - 180 : c);
  if (circle !== circle) return undefined;
  const bearing = turnFloat(circle + s.orientation);
  if (bearing !== bearing) return undefined;
  // sin z, cos z into SC[0], SC[1] and sin β, cos β into SC[2], SC[3]: sinCosInto's steps
  // written out (both angles are in (−360°, 360°): z in (0°, 180°], β in [0°, 360°)), so
  // that they are compiled into this function (V8 inlined neither of two calls).
  const sc = SC;
  for (let j = 0; j < 4; j += 2) {
    const d = j === 0 ? z : bearing;
    let k = Math.round(d * (1 / 90));
    let t = k === 0 ? d : d - 90 * k;
    if (t > 45) {
      k += 1;
      t = t - 90;
    } else if (t < -45) {
      k -= 1;
      t = t + 90;
    }
    if (t === 0 || t === 30 || t === -30) {
      sinCosInto(d, sc, j); // the exact cases
    } else {
      sinCosQuadrantInto(t * PER_DEGREE, k, sc, j);
    }
  }
  const D = S * sc[0]!;
  const rise = S * sc[1]!;
  const dh = s.hi - ht + rise + 0;
  if (dh - dh !== 0 || D * D - D * D !== 0) return undefined;
  // shotFrom: the point.
  const st = s.station;
  const x = st.x + D * sc[2]!;
  const y = st.y + D * sc[3]!;
  if (x - x !== 0 || y - y !== 0) return undefined;
  const name = r.name;
  // A name that is not text or a number: the generic code refuses it.
  if (name !== undefined && typeof name !== 'string' && typeof name !== 'number') return undefined;
  if (st.z === undefined) {
    if (name === undefined) return { x, y, bearing, horizontalDistance: D, heightDifference: dh };
    return { name: String(name), x, y, bearing, horizontalDistance: D, heightDifference: dh };
  }
  const h = st.z + dh;
  if (h - h !== 0) return undefined;
  if (name === undefined)
    return { x, y, z: h, bearing, horizontalDistance: D, heightDifference: dh };
  return { name: String(name), x, y, z: h, bearing, horizontalDistance: D, heightDifference: dh };
}

/**
 * Every shot of `list` by {@link shotFloat}, or `undefined` as soon as one needs the generic
 * path (which then computes them all, and reports the first error with its index).
 * @internal
 */
export function sideShotsFloat(
  s: ReadSetup<number>,
  list: readonly unknown[],
): SideShot<number>[] | undefined {
  const n = list.length;
  const out = new Array<SideShot<number>>(n);
  for (let i = 0; i < n; i++) {
    const p = shotFloat(s, list[i]);
    if (p === undefined) return undefined;
    out[i] = p;
  }
  return out;
}
