/**
 * The float twin of {@link sinCos}: the same operations, in the same order, on plain numbers,
 * so that callers in float (traverse by bearings, geodesy) stay fast in a process where other
 * arithmetics have been through the generic code. Property tests check that it returns
 * exactly what the generic code returns in float.
 *
 * @module readings
 * @internal
 */
import { floatCos, sinCosQuadrantInto } from '../arithmetic/float-trig.js';

/** float.div(float.pi, 180): π rad = 180°. @internal */
export const PER_DEGREE = Math.PI / 180;

/**
 * sin and cos of `degrees` as `sinCos(float, degrees)` gives them, or `undefined` when the
 * generic code must decide (an angle too large to reduce, or not a finite number).
 * @internal
 */
export function sinCosFloat(degrees: number): { sin: number; cos: number } | undefined {
  // One scratch array for every call (a typed array per call cost more than the sines).
  return sinCosInto(degrees, OUT, 0) ? { sin: OUT[0]!, cos: OUT[1]! } : undefined;
}

const OUT = /* @__PURE__ */ new Float64Array(2);

/**
 * {@link sinCosFloat} written into `out[at]` (sin) and `out[at + 1]` (cos), so that a hot
 * caller allocates nothing; `false` where the generic code must decide. Small enough for V8
 * to inline (an angle of a turn or more goes through {@link turnFloat}, a call).
 * @internal
 */
export function sinCosInto(degrees: number, out: Float64Array, at: number): boolean {
  let d = degrees;
  if (!(d > -360 && d < 360)) {
    d = turnFloat(d); // modulo(float, d, 360), or NaN where the generic code must decide
    if (d !== d) return false;
  }
  // t = d − 90°·k ∈ [−45°, 45°], exact (see sinCos)
  let k = Math.round(d * (1 / 90));
  let t = k === 0 ? d : d - 90 * k;
  if (t > 45) {
    k += 1;
    t = t - 90;
  } else if (t < -45) {
    k -= 1;
    t = t + 90;
  }
  if (t === 0 || t === 30 || t === -30) return exactInto(t, k, out, at);
  sinCosQuadrantInto(t * PER_DEGREE, k, out, at);
  return true;
}

/** The exact cases of {@link sinCosInto}: t = 0° and t = ±30° (as sinCos computes them). */
function exactInto(t: number, k: number, out: Float64Array, at: number): boolean {
  if (t === 0) {
    quadrantInto(t * PER_DEGREE, 1, k, out, at);
  } else {
    const cos = floatCos(t * PER_DEGREE);
    const sin =
      t === 30 ? 1 / 2 + (t - 30) * (cos * PER_DEGREE) : (t + 30) * (cos * PER_DEGREE) - 1 / 2;
    quadrantInto(sin, cos, k, out, at);
  }
  return true;
}

/**
 * sin and cos of t + 90°·k from those of t, into `out[at]`, `out[at + 1]`:
 * sin(t + 90°) = cos t, cos(t + 90°) = −sin t (the quadrant rotations; sinCosQuadrantInto ends
 * with the same three lines, written there so that it stays one function for V8 to inline).
 */
function quadrantInto(sin: number, cos: number, k: number, out: Float64Array, at: number): void {
  // sin t goes to sin θ (k even) or cos θ (k odd), negated in quadrants 1 and 2 (k mod 4);
  // cos t to the other, negated in quadrants 2 and 3 (k & 3 is k mod 4, negative k too)
  const odd = k & 1;
  out[at + odd] = (k + 1) & 2 ? -sin : sin;
  out[at + 1 - odd] = k & 2 ? -cos : cos;
}

/**
 * `modulo(float, d, 360)` (a turn: [0°, 360°)) by the same passes as the generic reduction, or
 * `NaN` where the generic code must decide (not finite, or too large to reduce).
 * @internal
 */
export function turnFloat(degrees: number): number {
  let d = degrees;
  if (d >= 0 && d < 360) return d;
  if (d - d !== 0) return NaN;
  if (Math.abs(d + 360 - d - 360) > 360 / 1e6) return NaN;
  for (let i = 0; i < 8; i++) {
    if (d >= 0 && d < 360) return d;
    const q = Math.floor(d / 360);
    d = q === 0 ? d + 360 : d - q * 360;
  }
  return NaN;
}
