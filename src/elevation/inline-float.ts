/**
 * The float twin of `heightFromInlineReadings` for three stations: the generic code's
 * operations, in the same order, on plain numbers, without the arrays, closures and error
 * locations the generic path builds. It returns `undefined` wherever the generic code would
 * throw or must decide (text, objects, a spread outside (0, 1], repeated chainages, a
 * singular or impossible solution), and the caller then runs the generic code. Property tests
 * check that it returns exactly what the generic code returns in float.
 *
 * @module elevation
 * @internal
 */
import type { InlineHeight } from './inline.js';

const isNum = (v: unknown): v is number => typeof v === 'number' && v - v === 0;

/** k = (1 − R)/R for a plain spread 0 < R ≤ 1, or NaN where the generic code decides. */
function kOf(R: unknown): number {
  if (!isNum(R) || !(R > 0) || R > 1) return NaN;
  return (1 - R) / R;
}

/** `heightFromInlineReadings(float, input)` for three numeric stations, or `undefined`. @internal */
export function inlineHeightFloat(input: unknown): InlineHeight<number> | undefined {
  if (input === null || typeof input !== 'object') return undefined;
  const { chainages, vertical } = input as { chainages?: unknown; vertical?: unknown };
  if (!Array.isArray(chainages) || !Array.isArray(vertical)) return undefined;
  if (chainages.length !== 3 || vertical.length !== 3) return undefined;
  const r1: unknown = chainages[0];
  const r2: unknown = chainages[1];
  const r3: unknown = chainages[2];
  if (!isNum(r1) || !isNum(r2) || !isNum(r3)) return undefined;
  if (r1 === r2 || r1 === r3 || r2 === r3) return undefined;
  const k1 = kOf(vertical[0]);
  const k2 = kOf(vertical[1]);
  const k3 = kOf(vertical[2]);
  if (k1 - k1 !== 0 || k2 - k2 !== 0 || k3 - k3 !== 0) return undefined;
  const origin = (0 + r1 + r2 + r3) / 3;
  if (origin - origin !== 0) return undefined;
  const c1 = r1 - origin;
  const c2 = r2 - origin;
  const c3 = r3 - origin;
  const a12 = c2 - c1;
  const a23 = c3 - c2;
  const a13 = c3 - c1;
  const coef = k1 * a23 - k2 * a13 + k3 * a12;
  if (coef === 0) return undefined;
  const H = (a12 * a23 * a13) / coef;
  if (H - H !== 0) return undefined;
  const t = (H * (k1 - k2)) / (c1 - c2);
  if (t - t !== 0) return undefined;
  const f = (c1 + c2 - t) / 2;
  if (f - f !== 0) return undefined;
  const d1 = c1 - f;
  const g = H * k1 - d1 * d1 + f * f;
  if (!(H > 0)) return undefined;
  const e = g - f * f;
  if (e < 0) return undefined;
  const d2 = c2 - f;
  const d3 = c3 - f;
  return {
    H,
    footChainage: f + origin,
    footOffset: e,
    residuals: [d1 * d1 + e - H * k1, d2 * d2 + e - H * k2, d3 * d3 + e - H * k3],
    sign: 1,
  };
}
