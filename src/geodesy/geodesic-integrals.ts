/**
 * The three integrals of Karney's solution of the geodesic problem, as Fourier series in the
 * arc length σ on the auxiliary sphere, with coefficients computed for the geodesic at hand.
 *
 * C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87:43–55 (2013), eqs. (7)–(8) and
 * (38)–(40): with k² = e′² cos²α₀,
 *   I₁(σ) = ∫₀^σ √(1 + k² sin²σ′) dσ′              (distance: s = b I₁),
 *   I₂(σ) = ∫₀^σ 1/√(1 + k² sin²σ′) dσ′            (reduced length, through J = I₁ − I₂),
 *   I₃(σ) = ∫₀^σ (2 − f)/(1 + (1 − f)√(1 + k² sin²σ′)) dσ′   (longitude: λ = ω − f sin α₀ I₃).
 * Each integrand g is even and π-periodic in σ, so I(σ) = B₀σ + Σₗ (Bₗ/2l) sin 2lσ with
 * g = B₀ + Σₗ Bₗ cos 2lσ. The paper expands Bₗ as series in ε = k²/(√(1 + k²) + 1)² (its
 * eqs. 17–25, to sixth order); here the Bₗ are computed for the given k by the trapezoidal rule
 * on M midpoint nodes σⱼ = (2j + 1)π/(2M) (a discrete cosine transform), which gives the
 * Fourier coefficients up to aliasing: index l receives −B_{M−l} and further terms
 * (Karney, "Geodesics on an arbitrary ellipsoid of revolution", J. Geodesy 88:21–31, 2014,
 * uses the same device). Since |Bₗ| ≤ C εˡ, truncating at L = ⌈(d + 2)/log₁₀(1/ε_max)⌉ and
 * taking M = 2L + 2 nodes leaves a relative error below about 10^−(d+2), for any order d the
 * arithmetic asks for. The nodes mirror each other about π/2 (σ_{M−1−j} = π − σⱼ, where both
 * sin²σ and cos 2lσ take the same values), so the sums run over the first M/2 nodes with
 * doubled weights: the same coefficients (up to rounding: the mirrored nodes' cosines were
 * separate approximations), with half the square roots and products.
 *
 * @module geodesy
 * @internal
 */
import { QuadspreadError } from '../errors.js';
import type { Arithmetic } from '../arithmetic/types.js';
import { ellipsoidParameters, isCheckedEllipsoid, type Ellipsoid } from './ellipsoid.js';
import { claimedDigits, root, tenToMinus } from './internal.js';
import { sinCosDegrees } from '../readings/trig.js';

/** Most significant digits the geodesic solutions support. */
export const MAX_GEODESIC_DIGITS = 100;
/** Largest flattening the geodesic solutions accept (Karney's series and starting guesses are for |f| ≤ 1/50). */
const MAX_FLATTENING = 1 / 50;

/** @internal Constants of an ellipsoid and the quadrature for one arithmetic. */
export interface GeodesicContext<T> {
  readonly A: Arithmetic<T>;
  readonly ell: Ellipsoid;
  readonly a: T;
  readonly b: T;
  readonly f: T;
  readonly f1: T;
  readonly e2: T;
  readonly ep2: T;
  readonly twoMinusF: T;
  readonly digits: number;
  /** Fourier terms kept. */
  readonly L: number;
  /**
   * weights W[l][j] of the discrete cosine transform over the first M/2 nodes, each counting
   * for its mirror image too: 2/M for l = 0 (B₀), 2cos(2lσⱼ)/(lM) otherwise (Bₗ/2l)
   */
  readonly W: T[][];
  /** sin²σⱼ at the nodes σⱼ = (2j + 1)π/(2M), j < M/2 */
  readonly s2: T[];
  /** 10^−(digits+2), a tolerance below the arithmetic's resolution */
  readonly tol: T;
  readonly tiny: T;
}

/** Contexts of one arithmetic: by the ellipsoid's a and f, and by a checked ellipsoid object. */
interface Contexts {
  readonly byKey: Map<string, GeodesicContext<unknown>>;
  readonly byObject: WeakMap<Ellipsoid, GeodesicContext<unknown>>;
}
const memo = new WeakMap<object, Contexts>();

/** @internal The context for (A, ellipsoid), memoised per arithmetic object. */
export function geodesicContext<T>(
  A: Arithmetic<T>,
  ellipsoid: Ellipsoid,
  where: string,
): GeodesicContext<T> {
  let byEll = memo.get(A);
  if (byEll === undefined) {
    byEll = { byKey: new Map(), byObject: new WeakMap() };
    memo.set(A, byEll);
  }
  // A built-in ellipsoid or one made by defineEllipsoid cannot change: found by identity,
  // without building its key.
  const known = isCheckedEllipsoid(ellipsoid);
  if (known) {
    const hit = byEll.byObject.get(ellipsoid);
    if (hit !== undefined) return hit as GeodesicContext<T>;
  }
  const key = `${ellipsoid.a}|${ellipsoid.f}`;
  const hit = byEll.byKey.get(key);
  if (hit !== undefined) {
    if (known) byEll.byObject.set(ellipsoid, hit);
    return hit as GeodesicContext<T>;
  }
  const digits = claimedDigits(A);
  if (digits > MAX_GEODESIC_DIGITS) {
    throw new QuadspreadError(
      'UNSUPPORTED_OPERATION',
      where,
      `${A.name} asks for ${digits} digits; geodesics are supported to ${MAX_GEODESIC_DIGITS} significant digits`,
    );
  }
  const fNum = Number(eval1(ellipsoid.f));
  if (fNum > MAX_FLATTENING) {
    throw new QuadspreadError(
      'INVALID_ELLIPSOID',
      where,
      `the flattening ${ellipsoid.f} is above 1/50, beyond what the geodesic solutions are written for`,
    );
  }
  const E = ellipsoidParameters(A, ellipsoid);
  // ε_max = k²/(√(1 + k²) + 1)² at k² = e′² (α₀ = 0), Karney 2013 eq. (16)
  const ep2 = (fNum * (2 - fNum)) / (1 - fNum) ** 2;
  const epsMax = ep2 / (Math.sqrt(1 + ep2) + 1) ** 2;
  const L = epsMax > 0 ? Math.max(2, Math.ceil((digits + 2) / -Math.log10(epsMax))) : 2;
  // M midpoint nodes alias index l with −(M − l): M = 2L + 2 keeps every alias beyond L + 1.
  const M = 2 * L + 2;
  // cos(kπ/M), k = 0 … 2M − 1
  const cosTab: T[] = [];
  for (let k = 0; k < 2 * M; k++) {
    cosTab.push(k === 0 ? A.one : A.cos(A.div(A.mul(A.from(k), A.pi), A.from(M))));
  }
  const two = A.from(2);
  // Node j and node M − 1 − j have the same sin²σ and cos 2lσ: H = M/2 nodes, weights doubled.
  const H = M / 2;
  const W: T[][] = [];
  for (let l = 0; l <= L; l++) {
    const row: T[] = [];
    for (let j = 0; j < H; j++) {
      row.push(
        // B₀ = (1/M) Σ gⱼ; the sine coefficient Bₗ/(2l) = (1/(lM)) Σ gⱼ cos 2lσⱼ (j < M),
        // that is (1/H) and (1/(lH)) over j < H
        l === 0
          ? A.div(A.one, A.from(H))
          : A.div(cosTab[(l * (2 * j + 1)) % (2 * M)]!, A.from(l * H)),
      );
    }
    W.push(row);
  }
  // sin²σⱼ = (1 − cos 2σⱼ)/2 with 2σⱼ = (2j + 1)π/M
  const s2 = Array.from({ length: H }, (_, j) =>
    A.div(A.sub(A.one, cosTab[(2 * j + 1) % (2 * M)]!), two),
  );
  const ctx: GeodesicContext<T> = {
    A,
    ell: ellipsoid,
    a: E.a,
    b: E.b,
    f: E.f,
    f1: A.sub(A.one, E.f),
    e2: E.e2,
    ep2: E.ep2,
    twoMinusF: A.sub(two, E.f),
    digits,
    L,
    W,
    s2,
    tol: tenToMinus(A, digits + 2),
    tiny: tenToMinus(A, 2 * digits + 20),
  };
  byEll.byKey.set(key, ctx as GeodesicContext<unknown>);
  if (known) byEll.byObject.set(ellipsoid, ctx as GeodesicContext<unknown>);
  return ctx;
}

/** A ratio text 'p/q' or a decimal as a number. */
function eval1(x: string): number {
  const i = x.indexOf('/');
  return i < 0 ? Number(x) : Number(x.slice(0, i)) / Number(x.slice(i + 1));
}

/** Fourier data of one integral: B₀ and the sine-series coefficients cₗ = Bₗ/(2l). */
export interface Series<T> {
  readonly B0: T;
  readonly c: T[];
}

/**
 * @internal The integrals' series for k² (I₁, I₂, I₃ of Karney 2013); I₂ only when `withI2`
 * (the inverse solution needs it for the reduced length, the direct one does not: a third of
 * the quadrature saved there).
 */
export function integrals<T>(
  A: Arithmetic<T>,
  ctx: GeodesicContext<T>,
  k2: T,
  withI2: true,
): { I1: Series<T>; I2: Series<T>; I3: Series<T> };
export function integrals<T>(
  A: Arithmetic<T>,
  ctx: GeodesicContext<T>,
  k2: T,
  withI2: false,
): { I1: Series<T>; I3: Series<T> };
export function integrals<T>(
  A: Arithmetic<T>,
  ctx: GeodesicContext<T>,
  k2: T,
  withI2: boolean,
): { I1: Series<T>; I2?: Series<T>; I3: Series<T> } {
  const { W, s2, L } = ctx;
  const H = s2.length; // the first half of the nodes (see geodesicContext)
  const g1: T[] = [];
  const g2: T[] = [];
  const g3: T[] = [];
  for (let j = 0; j < H; j++) {
    const w = root(A, A.add(A.one, A.mul(k2, s2[j]!))); // √(1 + k² sin²σ)
    g1.push(w);
    if (withI2) g2.push(A.div(A.one, w));
    g3.push(A.div(ctx.twoMinusF, A.add(A.one, A.mul(ctx.f1, w))));
  }
  // The three integrals' coefficients together, one row of weights at a time.
  let B1 = A.zero;
  let B2 = A.zero;
  let B3 = A.zero;
  const c1: T[] = [];
  const c2: T[] = [];
  const c3: T[] = [];
  for (let l = 0; l <= L; l++) {
    const row = W[l]!;
    let t1 = A.zero;
    let t2 = A.zero;
    let t3 = A.zero;
    for (let j = 0; j < H; j++) {
      const wj = row[j]!;
      t1 = A.add(t1, A.mul(wj, g1[j]!));
      if (withI2) t2 = A.add(t2, A.mul(wj, g2[j]!));
      t3 = A.add(t3, A.mul(wj, g3[j]!));
    }
    if (l === 0) {
      B1 = t1;
      B2 = t2;
      B3 = t3;
    } else {
      c1.push(t1);
      if (withI2) c2.push(t2);
      c3.push(t3);
    }
  }
  const I1 = { B0: B1, c: c1 };
  const I3 = { B0: B3, c: c3 };
  return withI2 ? { I1, I2: { B0: B2, c: c2 }, I3 } : { I1, I3 };
}

/**
 * @internal Σₗ cₗ sin 2lσ by Clenshaw's recurrence (C. W. Clenshaw, "A note on the summation
 * of Chebyshev series", Math. Tables Aids Comput. 9:118–120, 1955), from sin σ and cos σ
 * (a unit vector).
 */
export function sineSum<T>(A: Arithmetic<T>, c: readonly T[], s: T, co: T): T {
  const two = A.add(A.one, A.one);
  const sin2 = A.mul(two, A.mul(s, co));
  const cos2 = A.mul(A.sub(co, s), A.add(co, s));
  const x = A.mul(two, cos2);
  let b1 = A.zero;
  let b2 = A.zero;
  for (let l = c.length - 1; l >= 0; l--) {
    const b0 = A.sub(A.add(c[l]!, A.mul(x, b1)), b2);
    b2 = b1;
    b1 = b0;
  }
  return A.mul(b1, sin2);
}

/** @internal (s, c) scaled to a unit vector; (0, 0) stays (0, 1). */
export function unit<T>(A: Arithmetic<T>, s: T, c: T): { s: T; c: T } {
  const r = root(A, A.add(A.mul(s, s), A.mul(c, c)));
  if (A.isZero(r)) return { s: A.zero, c: A.one };
  return { s: A.div(s, r), c: A.div(c, r) };
}

/** @internal atan2(s, c), 0 for (0, 0). */
export function angle<T>(A: Arithmetic<T>, s: T, c: T): T {
  return A.isZero(s) && A.isZero(c) ? A.zero : A.atan2(s, c);
}

/**
 * @internal sin and cos of x degrees, |x| ≤ 360°, reduced to [−45°, 45°] by one exact
 * subtraction of a multiple of 90° (Sterbenz's lemma) and the sign taken from x, so that
 * negative angles are not rounded by adding 360° first (as GeographicLib's sincosd reduces;
 * common practice); larger angles go through {@link sinCosDegrees}.
 */
export function sinCosDeg<T>(A: Arithmetic<T>, x: T): { sin: T; cos: T } {
  const t = A.abs(x);
  if (A.cmp(t, A.from(360)) > 0) return sinCosDegrees(A, x);
  const q = Math.round(A.toNumber(t) / 90);
  const r = A.sub(t, A.from(90 * q));
  const rad = A.div(A.mul(r, A.pi), A.from(180));
  const s = A.isZero(r) ? A.zero : A.sin(rad);
  const c = A.isZero(r) ? A.one : A.cos(rad);
  const [sq, cq] = [
    [s, c],
    [c, A.neg(s)],
    [A.neg(s), A.neg(c)],
    [A.neg(c), s],
    [s, c],
  ][q]!;
  return { sin: A.sign(x) < 0 ? A.neg(sq!) : sq!, cos: cq! };
}
