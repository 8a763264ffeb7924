/**
 * The float twin of {@link sinCos}: the same operations, in the same order, on plain numbers,
 * so that callers in float (traverse by bearings, geodesy) stay fast in a process where other
 * arithmetics have been through the generic code. Property tests check that it returns
 * exactly what the generic code returns in float.
 *
 * @module readings
 * @internal
 */

const PER_DEGREE = Math.PI / 180; // float.div(float.pi, 180): π rad = 180°

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
 * caller allocates nothing; `false` where the generic code must decide.
 * @internal
 */
export function sinCosInto(degrees: number, out: Float64Array, at: number): boolean {
  let d = degrees;
  if (!(d >= 0 && d < 360)) {
    // modulo(float, d, 360): the same passes as the generic reduction, in a function of its
    // own so that this one stays small enough for V8 to inline into its callers.
    d = turnFloat(d);
    if (d - d !== 0) return false;
  }
  let q = Math.min(3, Math.floor(d / 90));
  let t = q === 0 ? d : d - 90 * q;
  if (t < 0) {
    q -= 1;
    t = t + 90;
  }
  if (t > 90) {
    q += 1;
    t = t - 90;
  }
  let sin: number;
  let cos: number;
  if (t === 0) {
    sin = t * PER_DEGREE;
    cos = 1;
  } else if (t === 90) {
    sin = 1;
    cos = (90 - t) * PER_DEGREE;
  } else {
    const small = t <= 45;
    const u = small ? t : 90 - t;
    const rad = u * PER_DEGREE;
    const cosU = Math.cos(rad);
    const sinU = u === 30 ? 1 / 2 + (u - 30) * (cosU * PER_DEGREE) : Math.sin(rad);
    sin = small ? sinU : cosU;
    cos = small ? cosU : sinU;
  }
  const k = ((q % 4) + 4) % 4;
  // sin(θ + 90°) = cos θ, cos(θ + 90°) = −sin θ (the quadrant rotations)
  out[at] = k === 0 ? sin : k === 1 ? cos : k === 2 ? -sin : -cos;
  out[at + 1] = k === 0 ? cos : k === 1 ? -sin : k === 2 ? -cos : sin;
  return true;
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
