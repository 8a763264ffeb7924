/**
 * Shared parts of the local fits from common points: reading the point pairs, centring, and
 * the unit-weight least-squares solve through the adjustment's normal equations.
 *
 * @module adjustment
 * @internal
 */
import { QuadspreadError, invalidArgument, show } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { solveGroups, type ObservationGroup } from './least-squares.js';

/** A common point: its coordinates in the source and in the target system, metres. */
export interface CommonPoint<T> {
  /** An optional name, repeated in the residuals. */
  readonly name?: string;
  /** Coordinates in the source system (x east, y north; z where heights are fitted). */
  readonly from: { readonly x: Numeric<T>; readonly y: Numeric<T>; readonly z?: Numeric<T> };
  /** Coordinates in the target system. */
  readonly to: { readonly x: Numeric<T>; readonly y: Numeric<T>; readonly z?: Numeric<T> };
}

/** @internal A common point read into the arithmetic. */
export interface ReadPoint<T> {
  readonly name: string;
  readonly x: T;
  readonly y: T;
  readonly z: T | undefined;
  readonly X: T;
  readonly Y: T;
  readonly Z: T | undefined;
}

/** @internal Reads the common points, refusing fewer than `min` or bad values. */
export function readCommonPoints<T>(
  A: Arithmetic<T>,
  points: readonly CommonPoint<T>[],
  min: number,
  where: string,
  heights: boolean,
): ReadPoint<T>[] {
  if (!Array.isArray(points))
    throw invalidArgument(where, `${show(points)} is not an array of { from, to } points`);
  if (points.length < min)
    throw new QuadspreadError(
      'TOO_FEW_POINTS',
      where,
      `${points.length} common point${points.length === 1 ? '' : 's'}: the fit needs at least ${min}`,
    );
  return points.map((q, i) => {
    const w = `${where}[${i}]`;
    const p = q as CommonPoint<T>;
    expectObject(q, w, '{ from: { x, y }, to: { x, y } }');
    expectObject(p.from as unknown, `${w}.from`, '{ x, y }');
    expectObject(p.to as unknown, `${w}.to`, '{ x, y }');
    const z = heights ? readNumber(A, p.from.z as Numeric<T>, `${w}.from.z`) : undefined;
    const Z = heights ? readNumber(A, p.to.z as Numeric<T>, `${w}.to.z`) : undefined;
    return {
      name: typeof p.name === 'string' ? p.name : String(i + 1),
      x: readNumber(A, p.from.x, `${w}.from.x`),
      y: readNumber(A, p.from.y, `${w}.from.y`),
      z,
      X: readNumber(A, p.to.x, `${w}.to.x`),
      Y: readNumber(A, p.to.y, `${w}.to.y`),
      Z,
    };
  });
}

/** @internal The mean of values (exact in `rational`). */
export function mean<T>(A: Arithmetic<T>, v: readonly T[]): T {
  let s = A.zero;
  for (const x of v) s = A.add(s, x);
  return A.div(s, A.from(v.length));
}

/**
 * @internal Least squares with unit weights: rows · p ≈ l for the u unknowns p. Returns p
 * and the residuals r = l − rows·p (observed minus fitted), or throws `what` when the
 * points do not determine the unknowns.
 */
export function leastSquares<T>(
  A: Arithmetic<T>,
  u: number,
  rows: readonly (readonly T[])[],
  l: readonly T[],
  where: string,
  what: string,
): { p: T[]; residuals: T[]; vtv: T } {
  const index = Array.from({ length: u }, (_, i) => i);
  const groups: ObservationGroup<T>[] = rows.map((r, i) => ({
    index,
    rows: [r],
    cofactor: [[A.one]],
    weight: [[A.one]],
    l: [l[i]!],
  }));
  const sol = solveGroups(A, u, groups, A.exact ? A.zero : A.from('1e-13'));
  if ('singular' in sol) throw new QuadspreadError('COLLINEAR_POINTS', where, what);
  const p = sol.dx;
  let vtv = A.zero;
  const residuals = rows.map((r, i) => {
    let f = A.zero;
    for (let k = 0; k < u; k++) f = A.add(f, A.mul(r[k]!, p[k]!));
    const v = A.sub(l[i]!, f);
    vtv = A.add(vtv, A.mul(v, v));
    return v;
  });
  return { p, residuals, vtv };
}

/** @internal vᵀv/(n − u), or undefined without redundancy. */
export function variance<T>(A: Arithmetic<T>, vtv: T, n: number, u: number): T | undefined {
  return n > u ? A.div(vtv, A.from(n - u)) : undefined;
}
