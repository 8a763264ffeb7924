/**
 * Reference ellipsoids as exact data: the defining semi-major axis and flattening, and
 * the derived constants (b, e², e′², n), exact in `rational`.
 *
 * @module geodesy
 */
import { QuadspreadError, show, invalidEllipsoid, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { gcd, readInput } from '../arithmetic/exact.js';

/**
 * An oblate ellipsoid of revolution, defined exactly: the semi-major axis `a` in metres
 * and the flattening `f` = (a − b)/a, both as exact numeric text (`f` may be a ratio such
 * as `'1/298.257223563'`).
 */
export interface Ellipsoid {
  /** A short name, e.g. `'WGS84'`. */
  readonly name: string;
  /** Semi-major (equatorial) axis a, metres, exact text. */
  readonly a: string;
  /** Flattening f = (a − b)/a, exact text, 0 ≤ f < 1 (0 is a sphere). */
  readonly f: string;
  /** Where the defining constants come from. */
  readonly source: string;
}

/**
 * The WGS 84 ellipsoid: a = 6378137 m, 1/f = 298.257223563 (NIMA TR8350.2, *Department of
 * Defense World Geodetic System 1984*, 3rd ed., 2000, table 3.1).
 * @example
 * ```ts
 * import { WGS84 } from 'quadspread';
 * [WGS84.a, WGS84.f];
 * //=> ['6378137', '1/298.257223563']
 * ```
 */
export const WGS84: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'WGS84',
  a: '6378137',
  f: '1/298.257223563',
  source: 'NIMA TR8350.2, 3rd ed. (2000), table 3.1',
});

/**
 * The GRS 80 ellipsoid: a = 6378137 m, 1/f = 298.257222101 (H. Moritz, "Geodetic Reference
 * System 1980", *Journal of Geodesy* 74:128–162, 2000; f is derived there from J2, and
 * 1/f = 298.257222101 is its published value, used here as the definition).
 * @example
 * ```ts
 * import { GRS80 } from 'quadspread';
 * GRS80.f;
 * //=> '1/298.257222101'
 * ```
 */
export const GRS80: Ellipsoid = /* @__PURE__ */ Object.freeze({
  name: 'GRS80',
  a: '6378137',
  f: '1/298.257222101',
  source: 'Moritz, Geodetic Reference System 1980, J. Geodesy 74:128-162 (2000)',
});

const KNOWN: Readonly<Record<string, Ellipsoid>> = { WGS84, GRS80 };

/** Ellipsoids known to be valid: the built-in ones and those made by {@link defineEllipsoid} (frozen). */
const CHECKED = /* @__PURE__ */ new WeakSet<Ellipsoid>([WGS84, GRS80]);

/**
 * Whether `e` is a built-in ellipsoid or one made by {@link defineEllipsoid}: frozen when made,
 * with plain data properties, so it cannot change. @internal
 */
export function isCheckedEllipsoid(e: unknown): boolean {
  return typeof e === 'object' && e !== null && CHECKED.has(e as Ellipsoid);
}

/** What {@link defineEllipsoid} accepts: a and exactly one of f, 1/f or b. */
export interface EllipsoidDefinition {
  readonly name?: string;
  /** Semi-major axis a, metres, > 0. */
  readonly a: Numeric<never>;
  /** Flattening f, 0 ≤ f < 1. */
  readonly f?: Numeric<never>;
  /** Inverse flattening 1/f, > 1. */
  readonly invF?: Numeric<never>;
  /** Semi-minor axis b, metres, 0 < b ≤ a. */
  readonly b?: Numeric<never>;
  readonly source?: string;
}

/**
 * A user-defined ellipsoid from its semi-major axis and one of the flattening, the inverse
 * flattening or the semi-minor axis, read exactly (a JS number through its shortest
 * decimal, so `298.257223563` is that decimal exactly).
 *
 * @param def `{ a, f }`, `{ a, invF }` or `{ a, b }`, with an optional `name` and `source`
 * @returns the ellipsoid, its `f` as an exact ratio
 * @throws {QuadspreadError} `INVALID_ELLIPSOID` unless a > 0, exactly one of f, invF, b is
 *   given, and 0 ≤ f < 1 (1/f > 1; 0 < b ≤ a); `INVALID_NUMBER` for values that are not numbers.
 * @example
 * ```ts
 * import { defineEllipsoid } from 'quadspread';
 * defineEllipsoid({ name: 'Airy 1830', a: 6377563.396, b: 6356256.909 }).f;
 * //=> '21306487/6377563396'
 * ```
 */
export function defineEllipsoid(def: EllipsoidDefinition): Ellipsoid {
  const where = 'defineEllipsoid(def)';
  if (def === null || typeof def !== 'object')
    throw invalidEllipsoid(where, `${show(def)} is not an object { a, f | invF | b }`);
  const given = (['f', 'invF', 'b'] as const).filter((k) => def[k] !== undefined);
  if (given.length !== 1) {
    throw invalidEllipsoid(
      where,
      `give exactly one of f, invF, b (got ${given.length === 0 ? 'none' : given.join(', ')})`,
    );
  }
  // Read and checked with bare bigint ratios (not the rational arithmetic), so that a float-only
  // program that converts coordinates does not bundle fraction.js.
  const a = exactOf(def.a, `${where}.a`);
  if (a.n <= 0n) throw invalidEllipsoid(where, `a = ${show(def.a)} is not positive`);
  let f: Exact;
  if (def.f !== undefined) f = exactOf(def.f, `${where}.f`);
  else if (def.invF !== undefined) {
    const inv = exactOf(def.invF, `${where}.invF`);
    if (inv.n <= inv.d) throw invalidEllipsoid(where, `invF = ${show(def.invF)} is not above 1`);
    f = { n: inv.d, d: inv.n }; // 1/invF, invF > 1 > 0
  } else {
    const b = exactOf(def.b as Numeric<never>, `${where}.b`);
    if (b.n <= 0n || b.n * a.d > a.n * b.d)
      throw invalidEllipsoid(where, `b = ${show(def.b)} is not in (0, a]`);
    // f = (a − b)/a, the definition of flattening
    f = { n: a.n * b.d - b.n * a.d, d: a.n * b.d };
  }
  if (f.n < 0n || f.n >= f.d)
    throw invalidEllipsoid(where, `f = ${fractionText(f)} is not in [0, 1)`);
  const e: Ellipsoid = Object.freeze({
    name: def.name ?? 'user-defined',
    a: fractionText(a),
    f: fractionText(f),
    source: def.source ?? 'user-defined',
  });
  CHECKED.add(e);
  return e;
}

/** An exact value n/d with d > 0 (not necessarily in lowest terms). */
interface Exact {
  readonly n: bigint;
  readonly d: bigint;
}

/**
 * An ellipsoid constant read exactly, as `rational.from` reads it: a number (through its
 * shortest decimal), numeric text, a bigint, or a fraction.js value.
 */
function exactOf(x: unknown, where: string): Exact {
  const v = x as { s?: unknown; n?: unknown; d?: unknown } | null;
  if (
    v !== null &&
    typeof v === 'object' &&
    typeof v.s === 'bigint' &&
    typeof v.n === 'bigint' &&
    typeof v.d === 'bigint'
  )
    return { n: v.s * v.n, d: v.d };
  return readInput(x, where);
}

/** n/d in lowest terms as fraction.js writes it (`-3/2`, `5`): the text of an ellipsoid constant. */
function fractionText(x: Exact): string {
  const g = gcd(x.n, x.d);
  const n = x.n / g,
    d = x.d / g;
  return d === 1n ? `${n}` : `${n}/${d}`;
}

/**
 * A known ellipsoid by name: `'WGS84'` or `'GRS80'` (case, spaces, `-` and `_` ignored).
 *
 * @param name the name
 * @returns the ellipsoid
 * @throws {QuadspreadError} `UNKNOWN_ELLIPSOID` for any other name.
 * @example
 * ```ts
 * import { ellipsoidByName } from 'quadspread';
 * ellipsoidByName('wgs 84').name;
 * //=> 'WGS84'
 * ```
 */
export function ellipsoidByName(name: string): Ellipsoid {
  const key = typeof name === 'string' ? name.toUpperCase().replace(/[\s_-]/g, '') : '';
  const e = KNOWN[key];
  if (!e)
    throw new QuadspreadError(
      'UNKNOWN_ELLIPSOID',
      'ellipsoidByName(name)',
      `${show(name)} is not a known ellipsoid (use 'WGS84', 'GRS80' or defineEllipsoid)`,
    );
  return e;
}

/** @internal an ellipsoid argument: a known name or an ellipsoid object. */
export function readEllipsoid(e: Ellipsoid | string | undefined, where: string): Ellipsoid {
  if (typeof e === 'string') {
    const exact = Object.hasOwn(KNOWN, e) ? KNOWN[e] : undefined;
    if (exact !== undefined) return exact; // 'WGS84', 'GRS80' as written: no normalising
    try {
      return ellipsoidByName(e);
    } catch {
      throw new QuadspreadError(
        'UNKNOWN_ELLIPSOID',
        where,
        `${show(e)} is not a known ellipsoid (use 'WGS84', 'GRS80' or defineEllipsoid)`,
      );
    }
  }
  if (e === null || typeof e !== 'object' || typeof e.a !== 'string' || typeof e.f !== 'string') {
    throw new QuadspreadError(
      'UNKNOWN_ELLIPSOID',
      where,
      `${show(e)} is not an ellipsoid (use WGS84, GRS80, a name or defineEllipsoid)`,
    );
  }
  if (CHECKED.has(e)) return e;
  // A hand-made { a, f } object: checked as defineEllipsoid would (a > 0, 0 ≤ f < 1) on every use.
  try {
    defineEllipsoid({ a: e.a, f: e.f });
  } catch (err) {
    if (!(err instanceof QuadspreadError)) throw err;
    throw invalidEllipsoid(
      where,
      `${show(e)} is not a valid ellipsoid: ${err.message.slice(`quadspread ${err.code}: ${err.where}: `.length)}`,
    );
  }
  return e;
}

/** The constants of an ellipsoid in an arithmetic. */
export interface EllipsoidParameters<T> {
  /** semi-major axis a, m */
  readonly a: T;
  /** flattening f */
  readonly f: T;
  /** semi-minor axis b = a(1 − f), m */
  readonly b: T;
  /** first eccentricity squared e² = f(2 − f) = (a² − b²)/a² */
  readonly e2: T;
  /** second eccentricity squared e′² = e²/(1 − e²) = (a² − b²)/b² */
  readonly ep2: T;
  /** third flattening n = f/(2 − f) = (a − b)/(a + b) */
  readonly n: T;
}

/**
 * The defining and derived constants of an ellipsoid in an arithmetic: exact in
 * `rational` (all are rational functions of a and f), rounded once per operation otherwise.
 *
 * @param A the arithmetic
 * @param ellipsoid an ellipsoid or a known name
 * @returns `{ a, f, b, e2, ep2, n }`
 * @throws {QuadspreadError} `UNKNOWN_ELLIPSOID` for an unknown name or a non-ellipsoid.
 * @example
 * ```ts
 * import { rational, ellipsoidParameters, GRS80 } from 'quadspread';
 * rational.toString(ellipsoidParameters(rational, GRS80).n);
 * //=> '500000000/297757222101'
 * ```
 */
export function ellipsoidParameters<T>(
  A: Arithmetic<T>,
  ellipsoid: Ellipsoid | string,
): EllipsoidParameters<T> {
  checkArithmetic(A, 'ellipsoidParameters');
  const E = readEllipsoid(ellipsoid, 'ellipsoidParameters(ellipsoid)');
  // The constants are read from text once per arithmetic and ellipsoid (a pure memo: both
  // are immutable, and the result is frozen).
  let memo = PARAMETERS.get(A) as WeakMap<Ellipsoid, EllipsoidParameters<T>> | undefined;
  const known = memo?.get(E);
  if (known !== undefined) return known;
  if (memo === undefined) {
    memo = new WeakMap();
    PARAMETERS.set(A, memo as WeakMap<Ellipsoid, EllipsoidParameters<unknown>>);
  }
  const P = computeParameters(A, E);
  memo.set(E, P);
  return P;
}

/** The last call of {@link parametersAt}: its arithmetic, ellipsoid input and result. */
let lastA: unknown;
let lastInput: unknown;
let lastParams: unknown;

/**
 * `ellipsoidParameters(A, readEllipsoid(e, where))`, answering a repeated call with the same
 * arithmetic and ellipsoid (a name, or a frozen ellipsoid) by two comparisons instead of the
 * lookups: a conversion of one point costs about as much as those. @internal
 */
export function parametersAt<T>(
  A: Arithmetic<T>,
  e: Ellipsoid | string,
  where: string,
): EllipsoidParameters<T> {
  if (A === lastA && e === lastInput) return lastParams as EllipsoidParameters<T>;
  return parametersLookedUp(A, e, where);
}

/** {@link parametersAt} past its comparisons (kept apart, so that it is small to inline). */
function parametersLookedUp<T>(
  A: Arithmetic<T>,
  e: Ellipsoid | string,
  where: string,
): EllipsoidParameters<T> {
  const P = ellipsoidParameters(A, readEllipsoid(e, where));
  if (typeof e === 'string' || Object.isFrozen(e)) {
    lastA = A;
    lastInput = e;
    lastParams = P;
  }
  return P;
}

/** Parameters already computed, by arithmetic and ellipsoid. */
const PARAMETERS = /* @__PURE__ */ new WeakMap<
  object,
  WeakMap<Ellipsoid, EllipsoidParameters<unknown>>
>();

function computeParameters<T>(A: Arithmetic<T>, E: Ellipsoid): EllipsoidParameters<T> {
  const a = A.from(E.a);
  const f = A.from(E.f);
  const two = A.from(2);
  const b = A.mul(a, A.sub(A.one, f)); // b = a(1 − f): definition of flattening
  const e2 = A.mul(f, A.sub(two, f)); // e² = f(2 − f) (e.g. Torge & Müller, Geodesy, 4th ed., 2012, ch. 4)
  const ep2 = A.div(e2, A.sub(A.one, e2)); // e′² = e²/(1 − e²) (same)
  const n = A.div(f, A.sub(two, f)); // n = (a − b)/(a + b) = f/(2 − f) (Helmert's third flattening)
  return Object.freeze({ a, f, b, e2, ep2, n });
}
