/**
 * Sine and cosine in float, with the polynomial kernels for |x| ≤ π/4 written in JavaScript.
 *
 * The kernels are those of FDLIBM 5.3 (Sun Microsystems, 1993; files `k_sin.c` and `k_cos.c`,
 * the degree-13 odd and degree-14 even minimax polynomials with their published coefficients
 * and, for the cosine, the split `1 − qx` that keeps its last bit), with the same operations in
 * the same order. `Math.sin` and `Math.cos` in V8 are FDLIBM's functions, whose first branch
 * (|x| below the first word of π/4) returns exactly these kernels, so `floatSin` returns what
 * `Math.sin` returns in Node (test/arithmetic/float-trig.test.ts checks it bit for bit, and
 * against decimal.js to within one unit in the last place).
 *
 * Why: every reduced angle of the library (an angle in degrees is reduced by whole quadrants to
 * [−45°, 45°] before its sine is taken) falls in that range, and there the kernels compiled into
 * the caller cost about a third of the two calls into the engine's library. Past that range the
 * functions are `Math.sin` and `Math.cos`.
 *
 * @module arithmetic
 * @internal
 */

// The coefficients are written into the functions as literals (a module constant read from a
// function costs a load and a check that it is initialised, and bytecode that counts against
// V8's budget for inlining):
// k_sin.c: sin x ≈ x + S1·x³ + S2·x⁵ + … + S6·x¹³ on [−π/4, π/4], with
//   S1 = -1.66666666666666324348e-1, S2 = 8.33333333332248946124e-3, S3 = -1.98412698298579493134e-4,
//   S4 = 2.75573137070700676789e-6, S5 = -2.50507602534068634195e-8, S6 = 1.58969099521155010221e-10;
// k_cos.c: cos x ≈ 1 − x²/2 + C1·x⁴ + … + C6·x¹⁴ on [−π/4, π/4], with
//   C1 = 4.16666666666666019037e-2, C2 = -1.38888888888741095749e-3, C3 = 2.48015872894767294178e-5,
//   C4 = -2.75573143513906633035e-7, C5 = 2.08757232129817482790e-9, C6 = -1.13596475577881948265e-11.

// FDLIBM's thresholds, stated there as the high 32 bits of |x| (the low 32 bits zero), and
// written into the functions as literals too:
//   2⁻²⁷ = 7.450580596923828e-9 (0x3e400000): below it sin x = x and cos x = 1 in double;
//   0.2999999523162842 (0x3fd33333): below it cos x = 1 − (x²/2 − x²·r);
//   0.7812504768371582 (0x3fe90001, past 0.78125 in the high word): qx = 0.28125 from it on;
//   0.7853984832763672 (0x3fe921fc, just past π/4): below it sin and cos are the kernels.

/** The last of the thresholds above: below it sin and cos are the kernels. @internal */
export const KERNEL_LIMIT = 0.7853984832763672;

/**
 * sin and cos of {@link floatSin} and {@link floatCos} (read at once). Below the limit each
 * computes both with {@link sinCosQuadrantInto}: the second polynomial costs little beside the
 * call, and one copy of the kernels keeps the bundles small.
 */
const SCRATCH = /* @__PURE__ */ new Float64Array(2);

/**
 * sin x of a finite x, as the float arithmetic computes it: FDLIBM's kernel below
 * {@link KERNEL_LIMIT} (by {@link sinCosQuadrantInto}), `Math.sin` from there.
 * @internal
 */
export function floatSin(x: number): number {
  if (!(x < 0.7853984832763672 && x > -0.7853984832763672)) return Math.sin(x);
  sinCosQuadrantInto(x, 0, SCRATCH, 0);
  return SCRATCH[0]!;
}

/**
 * cos x of a finite x, as the float arithmetic computes it: FDLIBM's kernel below
 * {@link KERNEL_LIMIT} (by {@link sinCosQuadrantInto}), `Math.cos` from there.
 * @internal
 */
export function floatCos(x: number): number {
  if (!(x < 0.7853984832763672 && x > -0.7853984832763672)) return Math.cos(x);
  sinCosQuadrantInto(x, 0, SCRATCH, 0);
  return SCRATCH[1]!;
}

/**
 * sin x and cos x of a finite x into `out[at]` and `out[at + 1]`, as {@link floatSin} and
 * {@link floatCos} give them (the kernels once for both below the limit).
 * @internal
 */
export function floatSinCosInto(x: number, out: Float64Array, at: number): void {
  if (x < 0.7853984832763672 && x > -0.7853984832763672) sinCosQuadrantInto(x, 0, out, at);
  else {
    out[at] = Math.sin(x);
    out[at + 1] = Math.cos(x);
  }
}

/**
 * sin and cos of t + 90°·k from t in radians (|t| < {@link KERNEL_LIMIT}), into `out[at]` and
 * `out[at + 1]`: FDLIBM's `__kernel_sin(t, 0, 0)` and `__kernel_cos(t, 0)`, turned by k
 * quadrants (sin(t + 90°) = cos t, cos(t + 90°) = −sin t). One function for both, so that a
 * caller that needs both computes t² once and stays within V8's budget of inlined code.
 * @internal
 */
export function sinCosQuadrantInto(t: number, k: number, out: Float64Array, at: number): void {
  const z = t * t;
  const at0 = t < 0 ? -t : t;
  let s: number;
  let c: number;
  if (at0 < 7.450580596923828e-9) {
    s = t;
    c = 1;
  } else {
    s =
      t +
      z *
        t *
        (-1.66666666666666324348e-1 +
          z *
            (8.33333333332248946124e-3 +
              z *
                (-1.98412698298579493134e-4 +
                  z *
                    (2.75573137070700676789e-6 +
                      z * (-2.50507602534068634195e-8 + z * 1.58969099521155010221e-10)))));
    const r =
      z *
      (4.16666666666666019037e-2 +
        z *
          (-1.38888888888741095749e-3 +
            z *
              (2.48015872894767294178e-5 +
                z *
                  (-2.75573143513906633035e-7 +
                    z * (2.0875723212981748279e-9 + z * -1.13596475577881948265e-11)))));
    if (at0 < 0.2999999523162842) c = 1 - (0.5 * z - z * r);
    else {
      // qx: t/4 with the low 32 bits of its significand cleared (k_cos.c: INSERT_WORDS(qx,
      // ix − 0x00200000, 0)), or 0.28125 past 0.78125. t/4 is in [0.075, 0.197): its last kept
      // bit is 2⁻²⁴ below 0.125 and 2⁻²³ from there (20 significand bits in the high word),
      // and both the scaling and the floor are exact.
      let qx: number;
      if (at0 >= 0.7812504768371582) qx = 0.28125;
      else {
        const q = at0 * 0.25;
        qx = q < 0.125 ? Math.floor(q * 16777216) / 16777216 : Math.floor(q * 8388608) / 8388608;
      }
      c = 1 - qx - (0.5 * z - qx - z * r);
    }
  }
  const odd = k & 1;
  out[at + odd] = (k + 1) & 2 ? -s : s;
  out[at + 1 - odd] = k & 2 ? -c : c;
}
