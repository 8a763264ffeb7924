/**
 * The function q(φ) of the equal-area projections (GN 7-2's α in Albers, q in Lambert Azimuthal
 * Equal Area) and its inverse by Newton's iteration.
 *
 * @module geodesy
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { QuadspreadError } from '../errors.js';
import { root, toDegrees } from './internal.js';

/**
 * q = (1 − e²)[sin φ/(1 − e² sin²φ) − (1/(2e)) ln((1 − e sin φ)/(1 + e sin φ))] (IOGP GN 7-2,
 * Albers Equal Area and Lambert Azimuthal Equal Area; Snyder 1987, USGS PP 1395, eq. 3-12);
 * 2 sin φ on a sphere. @internal
 */
export function authalicQ<T>(A: Arithmetic<T>, e: T, e2: T, s: T): T {
  if (A.isZero(e)) return A.mul(A.from(2), s);
  const es = A.mul(e, s);
  const first = A.div(s, A.sub(A.one, A.mul(es, es)));
  const second = A.div(A.log(A.div(A.sub(A.one, es), A.add(A.one, es))), A.mul(A.from(2), e));
  return A.mul(A.sub(A.one, e2), A.sub(first, second));
}

/** Most Newton steps {@link fromAuthalicQ} takes. */
const MAX_STEPS = 60;

/**
 * The latitude (degrees, with its sine and cosine) whose q is `q`, for |q| < q(90°), by Newton's
 * iteration φ ← φ + (1 − e² sin²φ)²/(2 cos φ) · (q/(1 − e²) − sin φ/(1 − e² sin²φ) +
 * (1/(2e)) ln((1 − e sin φ)/(1 + e sin φ))) (Snyder 1987, eq. 3-16), started from the sphere's
 * asin(q/qP). @internal
 */
export function fromAuthalicQ<T>(
  A: Arithmetic<T>,
  e: T,
  e2: T,
  q: T,
  qP: T,
  tol: T,
  where: string,
): { lat: T; s: T; c: T } {
  const one = A.one;
  let s = A.div(q, qP);
  if (A.cmp(A.abs(s), one) >= 0) {
    const sign = A.sign(q) < 0 ? A.neg(one) : one;
    return { lat: A.mul(sign, A.from(90)), s: sign, c: A.zero };
  }
  let phi = A.atan2(s, root(A, A.sub(one, A.mul(s, s))));
  if (A.isZero(e)) return { lat: toDegrees(A, phi), s, c: A.cos(phi) };
  const oneMinusE2 = A.sub(one, e2);
  // Newton converges quadratically: after a step of 1000·tol the error is far below tol, and the
  // arithmetic's rounding noise (some units of its last digit) never stalls the loop.
  const limit = A.mul(A.from(1000), tol);
  for (let i = 0; i < MAX_STEPS; i++) {
    s = A.sin(phi);
    const c = A.cos(phi);
    const w = A.sub(one, A.mul(e2, A.mul(s, s)));
    const residual = A.sub(A.div(q, oneMinusE2), A.div(authalicQ(A, e, e2, s), oneMinusE2));
    const step = A.div(A.mul(A.mul(w, w), residual), A.mul(A.from(2), c));
    phi = A.add(phi, step);
    if (A.cmp(A.abs(step), A.mul(limit, A.add(one, A.abs(phi)))) <= 0)
      return { lat: toDegrees(A, phi), s: A.sin(phi), c: A.cos(phi) };
  }
  throw new QuadspreadError(
    'NOT_CONVERGED',
    `${where}(point)`,
    `the latitude did not converge in ${MAX_STEPS} steps`,
  );
}
