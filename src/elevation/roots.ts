/**
 * Internal: one code path over {@link Root} values, surds in an exact arithmetic and plain
 * values otherwise. Thin dispatch onto geometry's surd methods.
 *
 * @module elevation
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { noRealSolution } from '../errors.js';
import { isSurd, surd, type Root, type Surd } from '../geometry/surd.js';

/** @internal operations on roots of one arithmetic. */
export interface RootOps<T, E extends boolean> {
  /** a + b√d as a root. */
  make(a: T, b: T, d: T): Root<T, E>;
  /** x as a root. */
  lift(x: T): Root<T, E>;
  add(x: Root<T, E>, y: Root<T, E> | T): Root<T, E>;
  sub(x: Root<T, E>, y: Root<T, E> | T): Root<T, E>;
  mul(x: Root<T, E>, y: Root<T, E> | T): Root<T, E>;
  div(x: Root<T, E>, y: Root<T, E> | T): Root<T, E>;
  sign(x: Root<T, E>): -1 | 0 | 1;
}

/** @internal */
export function rootOps<T, E extends boolean>(A: Arithmetic<T, E>): RootOps<T, E> {
  if (A.exact) {
    const S = (x: unknown): Surd<T> => (isSurd(x) ? (x as Surd<T>) : surd(A, x as T));
    return {
      make: (a, b, d) => surd(A, a, b, d) as Root<T, E>,
      lift: (x) => surd(A, x) as Root<T, E>,
      add: (x, y) => S(x).add(S(y)) as Root<T, E>,
      sub: (x, y) => S(x).sub(S(y)) as Root<T, E>,
      mul: (x, y) => S(x).mul(S(y)) as Root<T, E>,
      div: (x, y) => S(x).div(S(y)) as Root<T, E>,
      sign: (x) => S(x).sign(),
    };
  }
  const V = (x: unknown): T => x as T;
  return {
    make(a, b, d) {
      if (A.isZero(b)) return a as Root<T, E>;
      const r = A.sqrt(d);
      if (r === undefined)
        throw noRealSolution('root(a, b, d)', `no square root of ${A.toString(d)}`);
      return A.add(a, A.mul(b, r)) as Root<T, E>;
    },
    lift: (x) => x as Root<T, E>,
    add: (x, y) => A.add(V(x), V(y)) as Root<T, E>,
    sub: (x, y) => A.sub(V(x), V(y)) as Root<T, E>,
    mul: (x, y) => A.mul(V(x), V(y)) as Root<T, E>,
    div: (x, y) => A.div(V(x), V(y)) as Root<T, E>,
    sign: (x) => A.sign(V(x)),
  };
}
