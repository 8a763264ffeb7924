/**
 * What every map projection shares: the parameter object, its units (angles in degrees, grads
 * or packed DMS; lengths in metres, feet or links), the prime meridian, the isometric latitude
 * and its inverse, and the wrapper that turns a method's formulas (written in metres and
 * degrees, relative to the false origin and the central meridian) into a forward/inverse pair
 * that reads and checks its input, delegates exact arithmetics to `decimal` and converts units.
 *
 * @module geodesy
 */
import Fraction from 'fraction.js';
import { QuadspreadError, show, invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { rational } from '../arithmetic/rational.js';
import { readNumber, expectObject } from '../geometry/validate.js';
import { modulo, sinCosDegrees } from '../readings/trig.js';
import { ellipsoidParameters, readEllipsoid, type Ellipsoid } from './ellipsoid.js';
import {
  claimedDigits,
  delegateFor,
  readAngle,
  readLatitude,
  readLongitude,
  root,
  tenToMinus,
  toDegrees,
} from './internal.js';
import { FLOAT_NONE, forwardFloatInto } from './projection-float.js';

/** The projection methods: EPSG method names, written in lower case with hyphens. */
export type ProjectionMethod =
  | 'transverse-mercator'
  | 'lambert-conic-1sp'
  | 'lambert-conic-2sp'
  | 'oblique-stereographic'
  | 'polar-stereographic-a'
  | 'polar-stereographic-b'
  | 'mercator-1sp'
  | 'mercator-2sp'
  | 'cassini-soldner'
  | 'albers-equal-area'
  | 'lambert-azimuthal-equal-area';

/**
 * Units of the angles of a projection (its parameters and the points' latitude and
 * longitude): `'deg'` decimal degrees (or DMS text), `'grad'` (400 to the circle),
 * `'dms-packed'` sexagesimal degrees packed as D.MMSSsss (EPSG unit 9110, e.g. 46.48 = 46°48′).
 */
export type ProjectionAngleUnit = 'deg' | 'grad' | 'dms-packed';

/**
 * Units of grid coordinates and false easting/northing, with their EPSG unit-of-measure codes
 * and lengths in metres: `'metre'` (9001), `'foot'` (international, 9002, 0.3048 m),
 * `'us-survey-foot'` (9003, 1200/3937 m), `'clarke-foot'` (9005, 0.3047972654 m),
 * `'clarke-link'` (9039, 0.66 Clarke's feet = 0.201166195164 m), `'link'` (9098, 0.66
 * international feet = 0.201168 m).
 */
export type LinearUnit =
  'metre' | 'foot' | 'us-survey-foot' | 'clarke-foot' | 'clarke-link' | 'link';

// Lengths in metres as exact ratios (EPSG Geodetic Parameter Dataset, unit of measure
// records 9001, 9002, 9003, 9005, 9039, 9098; from memory, the foot, US survey foot and link
// checked against proj4's unit table in the tests).
const UNIT_METRES: Readonly<Record<LinearUnit, string>> = {
  metre: '1',
  foot: '0.3048',
  'us-survey-foot': '1200/3937',
  'clarke-foot': '0.3047972654',
  'clarke-link': '0.201166195164',
  link: '0.201168',
};

/**
 * A map projection: the method, the ellipsoid and the method's parameters. Which parameters a
 * method uses is listed in docs/geodesy.md; for the Lambert 2SP and Albers forms `lat0`,
 * `lon0`, `falseEasting` and `falseNorthing` are those of the false origin.
 */
export interface Projection {
  /** The method. */
  readonly method: ProjectionMethod;
  /** The ellipsoid or its name. */
  readonly ellipsoid: Ellipsoid | string;
  /** Latitude of the (natural or false) origin, in `angleUnit`. */
  readonly lat0?: Numeric<never>;
  /** Longitude of the (natural or false) origin, from the prime meridian, in `angleUnit`. */
  readonly lon0?: Numeric<never>;
  /** First (or only) standard parallel, in `angleUnit`. */
  readonly lat1?: Numeric<never>;
  /** Second standard parallel, in `angleUnit`. */
  readonly lat2?: Numeric<never>;
  /** Scale factor at the natural origin. */
  readonly k0?: Numeric<never>;
  /** False easting, in `linearUnit` (default 0). */
  readonly falseEasting?: Numeric<never>;
  /** False northing, in `linearUnit` (default 0). */
  readonly falseNorthing?: Numeric<never>;
  /**
   * Longitude of the prime meridian east of Greenwich, in `angleUnit` (default 0): `lon0` is
   * counted from it, the points' longitudes from Greenwich (e.g. Paris 2.5969213 grad).
   */
  readonly primeMeridian?: Numeric<never>;
  /** Unit of the angles: the parameters' and the points' (default `'deg'`). */
  readonly angleUnit?: ProjectionAngleUnit;
  /**
   * Unit of the points' latitude and longitude when it differs from the parameters' (EPSG
   * often gives parameters in packed DMS and coordinates in degrees); default `angleUnit`.
   */
  readonly pointAngleUnit?: ProjectionAngleUnit;
  /** Unit of grid coordinates and false easting/northing (default `'metre'`). */
  readonly linearUnit?: LinearUnit;
}

/** A projection's parameters read into an arithmetic: degrees, metres, ellipsoid constants. */
export interface ProjectionParams<T> {
  readonly method: ProjectionMethod;
  readonly ellipsoid: Ellipsoid;
  /** semi-major axis, metres */
  readonly a: T;
  /** e² */
  readonly e2: T;
  /** e */
  readonly e: T;
  readonly lat0?: T;
  readonly lon0: T;
  readonly lat1?: T;
  readonly lat2?: T;
  readonly k0?: T;
  /** tolerance of iterations: 10^−(digits + 1) */
  readonly tol: T;
}

/** A method's forward result, relative to the false origin, in metres and degrees. */
export interface MethodForward<T> {
  readonly x: T;
  readonly y: T;
  readonly k: T;
  readonly h?: T;
  readonly gamma: T;
}

/** A method's inverse result: latitude and longitude from the central meridian, degrees. */
export interface MethodInverse<T> {
  readonly lat: T;
  readonly dlon: T;
  readonly k: T;
  readonly h?: T;
  readonly gamma: T;
}

/** The formulas of a projection method, in metres and degrees. @internal */
export interface MethodImpl {
  /** Parameters the method needs (others it does not use are refused). */
  readonly needs: readonly ParamName[];
  /** Parameters it may take (defaults documented per method). */
  readonly takes: readonly ParamName[];
  /** Its constants, computed once. */
  prepare<T>(A: Arithmetic<T>, p: ProjectionParams<T>, where: string): object;
  forward<T>(A: Arithmetic<T>, c: object, lat: T, dlon: T, where: string): MethodForward<T>;
  inverse<T>(A: Arithmetic<T>, c: object, x: T, y: T, where: string): MethodInverse<T>;
  /** The kind of its forward float twin (projection-float.ts), if it has one. */
  readonly floatKind?: number;
  /**
   * Its constants (prepared in A, the float arithmetic) in the order its float twin reads
   * them; `undefined` leaves every point to the generic code.
   */
  floatConstants?<T>(A: Arithmetic<T>, c: object): readonly number[] | undefined;
}

type ParamName = 'lat0' | 'lon0' | 'lat1' | 'lat2' | 'k0';

/** Grid coordinates of a point, in the projection's linear unit, with its scale and convergence. */
export interface ProjectedPoint<T> {
  /** Easting, in the projection's `linearUnit`. */
  readonly E: T;
  /** Northing, in the projection's `linearUnit`. */
  readonly N: T;
  /**
   * Point scale factor: along the parallel (k) for the equal-area and Cassini methods, in
   * every direction for the conformal ones.
   */
  readonly k: T;
  /** Scale factor along the meridian, for the equal-area and Cassini methods. */
  readonly h?: T;
  /**
   * Grid convergence γ, degrees, clockwise from true north to grid north:
   * grid bearing = azimuth − γ.
   */
  readonly convergence: T;
}

/** Geodetic coordinates of a grid point, with the scale and convergence there. */
export interface GeographicPoint<T> {
  /** Latitude, in the projection's `angleUnit`. */
  readonly lat: T;
  /** Longitude from Greenwich, in the projection's `angleUnit`. */
  readonly lon: T;
  /** Point scale factor (as {@link ProjectedPoint.k}). */
  readonly k: T;
  /** Scale factor along the meridian, for the equal-area and Cassini methods. */
  readonly h?: T;
  /** Grid convergence, degrees (as {@link ProjectedPoint.convergence}). */
  readonly convergence: T;
}

const PREPARED = Symbol('quadspread.prepared-projection');

/**
 * A projection read and checked once, with its constants computed, for one arithmetic: what
 * {@link prepareProjection} returns, and what every projection function accepts in place of
 * the parameter object (then nothing is recomputed per point).
 */
export interface PreparedProjection<T> {
  readonly method: ProjectionMethod;
  /** The arithmetic it was prepared for. */
  readonly arithmetic: Arithmetic<T>;
  /** @internal */
  readonly [PREPARED]: Internal<T>;
}

interface Internal<T> {
  readonly impl: MethodImpl;
  /** The arithmetic the formulas run in (decimal for an exact arithmetic). */
  readonly D: Arithmetic<unknown>;
  readonly to: (x: T) => unknown;
  readonly back: (y: unknown) => T;
  readonly c: object;
  readonly angleUnit: ProjectionAngleUnit;
  /** metres per linear unit, in A and in D */
  readonly unitA: T;
  readonly unitD: unknown;
  readonly FE: unknown;
  readonly FN: unknown;
  /** lon0 + prime meridian, degrees from Greenwich, in D */
  readonly lonOrigin: unknown;
  /** The kind of forward float twin (FLOAT_NONE unless A is float and angles are in degrees). */
  readonly fk: number;
  /** The float twin's constants (projection-float.ts): empty without a twin. */
  readonly fc: Float64Array;
}

const NO_CONSTANTS = /* @__PURE__ */ new Float64Array(0);

/** E, N, k, γ of the float twin's call in progress (read before any other call). */
const ENKG = /* @__PURE__ */ new Float64Array(4);

const ANGLE_UNITS: readonly ProjectionAngleUnit[] = ['deg', 'grad', 'dms-packed'];

/**
 * Packed sexagesimal degrees D.MMSSsss (EPSG unit 9110) to degrees, exactly: 46.48 is
 * 46°48′00″; minutes and seconds must be below 60.
 */
function unpackDms(x: Numeric<unknown>, where: string): Fraction {
  const text = typeof x === 'object' ? undefined : String(x).trim();
  if (text === undefined || !/^[+-]?\d+(\.\d*)?$/.test(text))
    throw new QuadspreadError(
      'INVALID_ANGLE',
      where,
      `${show(x)} is not packed D.MMSS text or a number`,
    );
  const neg = text.startsWith('-');
  const body = text.replace(/^[+-]/, '');
  const [d, f = ''] = body.split('.');
  const frac = f.padEnd(4, '0');
  const mm = Number(frac.slice(0, 2));
  const ss = new Fraction(`${frac.slice(2, 4)}.${frac.slice(4) || '0'}`);
  if (mm >= 60 || ss.compare(60) >= 0)
    throw new QuadspreadError(
      'INVALID_ANGLE',
      where,
      `${show(x)} has minutes or seconds of 60 or more`,
    );
  const v = new Fraction(BigInt(d!)).add(new Fraction(mm, 60)).add(ss.div(3600));
  return neg ? v.neg() : v;
}

/** Degrees to packed D.MMSSsss in A (for results in 'dms-packed'). */
function packDms<T>(A: Arithmetic<T>, deg: T): T {
  const neg = A.sign(deg) < 0;
  const v = A.abs(deg);
  const floorA = (x: T): T => {
    let n = A.from(Math.floor(A.toNumber(x)));
    if (A.cmp(n, x) > 0) n = A.sub(n, A.one);
    else if (A.cmp(A.add(n, A.one), x) <= 0) n = A.add(n, A.one);
    return n;
  };
  const d = floorA(v);
  const minutes = A.mul(A.sub(v, d), A.from(60));
  const m = floorA(minutes);
  const s = A.mul(A.sub(minutes, m), A.from(60));
  const packed = A.add(A.add(d, A.div(m, A.from(100))), A.div(s, A.from(10000)));
  return neg ? A.neg(packed) : packed;
}

/** An angle parameter or coordinate in `unit`, to degrees in A (exact where A is). */
function angleIn<T>(A: Arithmetic<T>, x: Numeric<T>, unit: ProjectionAngleUnit, where: string): T {
  if (unit === 'deg') return readAngle(A, x, where);
  if (unit === 'grad') return readAngle(A, x, where, 'gon');
  if (A.is(x)) return A.from(rational.toString(unpackDms(A.toPrecision(x, 40), where)));
  return A.from(rational.toString(unpackDms(x, where)));
}

/** Degrees in A to `unit`. */
function angleOut<T>(A: Arithmetic<T>, deg: T, unit: ProjectionAngleUnit): T {
  if (unit === 'deg') return deg;
  if (unit === 'grad') return A.div(A.mul(deg, A.from(10)), A.from(9)); // 400 grad = 360°
  return packDms(A, deg);
}

function latitudeIn<T>(
  A: Arithmetic<T>,
  x: Numeric<T>,
  unit: ProjectionAngleUnit,
  where: string,
): T {
  if (unit === 'deg') return readLatitude(A, x, where);
  if (x === undefined || x === null)
    throw new QuadspreadError('INVALID_ANGLE', where, 'the latitude is missing');
  const v = angleIn(A, x, unit, where);
  if (A.cmp(A.abs(v), A.from(90)) > 0)
    throw new QuadspreadError(
      'LATITUDE_OUT_OF_RANGE',
      where,
      `${show(typeof x === 'object' ? A.toString(v) : x)} is beyond ±90°`,
    );
  return v;
}

function longitudeIn<T>(
  A: Arithmetic<T>,
  x: Numeric<T>,
  unit: ProjectionAngleUnit,
  where: string,
): T {
  if (unit === 'deg') return readLongitude(A, x, where, false);
  if (x === undefined || x === null)
    throw new QuadspreadError('INVALID_ANGLE', where, 'the longitude is missing');
  return angleIn(A, x, unit, where);
}

/** λ in degrees reduced to [−180°, 180°). */
export function wrapLongitude<T>(A: Arithmetic<T>, lon: T, where: string): T {
  checkArithmetic(A, 'wrapLongitude');
  const h = A.from(180);
  if (A.cmp(lon, A.neg(h)) >= 0 && A.cmp(lon, h) < 0) return lon;
  return A.sub(modulo(A, A.add(lon, h), A.from(360), where), h);
}

const PARAM_NAMES: readonly ParamName[] = ['lat0', 'lon0', 'lat1', 'lat2', 'k0'];

/** Reads a projection object into a prepared projection for A. @internal */
export function prepareWith<T>(
  A: Arithmetic<T>,
  projection: Projection,
  impl: MethodImpl,
  where: string,
): PreparedProjection<T> {
  expectObject(projection, `${where}(projection)`, '{ method, ellipsoid, … }');
  const at = (k: string): string => `${where}(projection.${k})`;
  const angleUnit = projection.angleUnit ?? 'deg';
  if (!ANGLE_UNITS.includes(angleUnit))
    throw new QuadspreadError(
      'INVALID_UNIT',
      at('angleUnit'),
      `${show(angleUnit)} is not 'deg', 'grad' or 'dms-packed'`,
    );
  const pointUnit = projection.pointAngleUnit ?? angleUnit;
  if (!ANGLE_UNITS.includes(pointUnit))
    throw new QuadspreadError(
      'INVALID_UNIT',
      at('pointAngleUnit'),
      `${show(pointUnit)} is not 'deg', 'grad' or 'dms-packed'`,
    );
  const linearUnit = projection.linearUnit ?? 'metre';
  if (typeof linearUnit !== 'string' || !Object.hasOwn(UNIT_METRES, linearUnit))
    throw new QuadspreadError(
      'INVALID_UNIT',
      at('linearUnit'),
      `${show(linearUnit)} is not one of ${Object.keys(UNIT_METRES).join(', ')}`,
    );
  for (const k of impl.needs) {
    if (projection[k] === undefined || projection[k] === null)
      throw new QuadspreadError(
        'MISSING_PARAMETER',
        at(k),
        `the method '${projection.method}' needs ${k}`,
      );
  }
  for (const k of PARAM_NAMES) {
    if (projection[k] !== undefined && !impl.takes.includes(k) && !impl.needs.includes(k))
      throw invalidArgument(at(k), `the method '${projection.method}' does not use ${k}`);
  }
  const ell = readEllipsoid(projection.ellipsoid, at('ellipsoid'));
  // Exact arithmetics run the formulas in decimal with 8 guard digits (every result is an
  // approximation anyway) and read the results back exactly.
  const digits = claimedDigits(A);
  const del = A.exact ? delegateFor(A, digits + 8) : undefined;
  const D = del ? del.D : (A as Arithmetic<unknown>);
  const to = del ? del.to : (x: T): unknown => x;
  const back = del ? del.back : (y: unknown): T => y as T;
  const ang = (k: ParamName): unknown => {
    const v = projection[k];
    if (v === undefined) return undefined;
    const deg =
      k === 'lat0' || k === 'lat1' || k === 'lat2'
        ? latitudeIn(rational, v, angleUnit, at(k))
        : angleIn(rational, v, angleUnit, at(k));
    return D.from(rational.toString(deg));
  };
  const E = ellipsoidParameters(D, ell);
  let k0: unknown;
  if (projection.k0 !== undefined) {
    k0 = readNumber(D, projection.k0 as Numeric<unknown>, at('k0'));
    if (D.sign(k0) <= 0) throw invalidArgument(at('k0'), `${show(projection.k0)} is not positive`);
  }
  const unitR = rational.from(UNIT_METRES[linearUnit]);
  const unitD = D.from(rational.toString(unitR));
  const metres = (k: 'falseEasting' | 'falseNorthing'): unknown =>
    D.mul(readNumber(D, (projection[k] ?? 0) as Numeric<unknown>, at(k)), unitD);
  const pm = projection.primeMeridian === undefined ? undefined : ang2(projection.primeMeridian);
  function ang2(v: Numeric<never>): unknown {
    return D.from(rational.toString(angleIn(rational, v, angleUnit, at('primeMeridian'))));
  }
  const params: ProjectionParams<unknown> = {
    method: projection.method,
    ellipsoid: ell,
    a: E.a,
    e2: E.e2,
    e: root(D, E.e2),
    lat0: ang('lat0'),
    lon0: (ang('lon0') ?? D.zero) as unknown,
    lat1: ang('lat1'),
    lat2: ang('lat2'),
    k0,
    tol: tenToMinus(D, claimedDigits(D) + 1),
  };
  const c = impl.prepare(D, params, where);
  const FE = metres('falseEasting');
  const FN = metres('falseNorthing');
  const lonOrigin = pm === undefined ? params.lon0 : D.add(params.lon0, pm);
  // The float twin reads plain numbers in degrees: float only, points in degrees.
  const twin =
    A.float64 === true && pointUnit === 'deg' && impl.floatKind !== undefined
      ? impl.floatConstants!(D, c)
      : undefined;
  const fk = twin === undefined ? FLOAT_NONE : impl.floatKind!;
  const fc =
    twin === undefined
      ? NO_CONSTANTS
      : Float64Array.of(lonOrigin as number, FE as number, FN as number, unitD as number, ...twin);
  const internal: Internal<T> = {
    impl,
    D,
    to,
    back,
    c,
    angleUnit: pointUnit,
    unitA: A.from(rational.toString(unitR)),
    unitD,
    FE,
    FN,
    lonOrigin,
    fk,
    fc,
  };
  return Object.freeze({ method: projection.method, arithmetic: A, [PREPARED]: internal });
}

/** The name of the arithmetic a projection says it was prepared for (junk shown safely). */
function preparedFor(a: unknown): string {
  const name = typeof a === 'object' && a !== null ? (a as { name?: unknown }).name : undefined;
  return typeof name === 'string' ? name : show(a);
}

/** The prepared form of `projection` for A: itself when prepared for A, else prepared now. @internal */
export function prepared<T>(
  A: Arithmetic<T>,
  projection: Projection | PreparedProjection<T>,
  impl: (method: unknown, where: string) => MethodImpl,
  where: string,
): Internal<T> {
  const p = projection as Partial<PreparedProjection<T>> | null;
  const internal = p?.[PREPARED];
  if (internal !== undefined) {
    if (p!.arithmetic !== A)
      throw invalidArgument(
        `${where}(projection)`,
        `the projection was prepared for ${preparedFor(p!.arithmetic)}, not ${A.name}`,
      );
    return internal;
  }
  expectObject(projection, `${where}(projection)`, '{ method, ellipsoid, … }');
  const m = impl((projection as Projection).method, `${where}(projection.method)`);
  // A projection object that cannot change (frozen, every parameter a primitive, the
  // ellipsoid a name or frozen; `utmProjection` makes such objects) passed again with the
  // same arithmetic: the projection prepared the last time, as preparing it again would give.
  if (projection === lastProjection && A === lastArithmetic && lastPrepared!.impl === m)
    return lastPrepared as Internal<T>;
  const made = prepareWith(A, projection as Projection, m, where)[PREPARED];
  if (unchanging(projection)) {
    lastProjection = projection;
    lastArithmetic = A;
    lastPrepared = made as Internal<unknown>;
  }
  return made;
}

/** The last unchanging projection object {@link prepared} prepared, its arithmetic and result. */
let lastProjection: unknown;
let lastArithmetic: unknown;
let lastPrepared: Internal<unknown> | undefined;

/**
 * Whether a projection object can never change: a frozen plain object whose own properties
 * are data properties holding primitives, except an ellipsoid that is such an object itself.
 */
function unchanging(x: object, nested = false): boolean {
  if (!Object.isFrozen(x)) return false;
  const proto: unknown = Object.getPrototypeOf(x);
  if (proto !== Object.prototype && proto !== null) return false;
  for (const [k, d] of Object.entries(Object.getOwnPropertyDescriptors(x))) {
    if (!('value' in d)) return false; // a getter could answer differently next time
    const v: unknown = d.value;
    if (typeof v === 'object' && v !== null) {
      if (nested || k !== 'ellipsoid' || !unchanging(v, true)) return false;
    } else if (typeof v === 'function') return false;
  }
  return true;
}

/**
 * The float twin's forward for a projection prepared for A (the float arithmetic) and a point
 * of plain numbers in degrees: E, N, k, γ written into `out`; `false` (nothing decided) for
 * anything else, which the caller then hands to the generic code. @internal
 */
export function forwardPreparedFloat(
  A: unknown,
  projection: unknown,
  point: unknown,
  out: Float64Array,
): boolean {
  if (typeof projection !== 'object' || projection === null) return false;
  const P = (projection as Partial<PreparedProjection<unknown>>)[PREPARED];
  if (P === undefined || P.fk === FLOAT_NONE) return false;
  if ((projection as PreparedProjection<unknown>).arithmetic !== A) return false;
  if (typeof point !== 'object' || point === null) return false;
  const pt = point as { readonly lat?: unknown; readonly lon?: unknown };
  return forwardFloatInto(P.fk, P.fc, pt.lat, pt.lon, out);
}

/** Forward: a point's latitude and longitude to grid coordinates, through a prepared projection. @internal */
export function forwardWith<T>(
  A: Arithmetic<T>,
  P: Internal<T>,
  point: { readonly lat: Numeric<T>; readonly lon: Numeric<T> },
  where: string,
): ProjectedPoint<T> {
  expectObject(point, `${where}(point)`, '{ lat, lon }');
  if (A.float64 === true && P.fk !== FLOAT_NONE) {
    // The float twin: the same operations on plain numbers (projection-float.ts); false
    // wherever the generic code below must decide or throw.
    if (forwardFloatInto(P.fk, P.fc, point.lat, point.lon, ENKG))
      return { E: ENKG[0], N: ENKG[1], k: ENKG[2], convergence: ENKG[3] } as ProjectedPoint<T>;
  }
  const lat = latitudeIn(A, point.lat, P.angleUnit, `${where}(point.lat)`);
  const lon = longitudeIn(A, point.lon, P.angleUnit, `${where}(point.lon)`);
  const D = P.D;
  const dlon = wrapLongitude(D, D.sub(P.to(lon), P.lonOrigin), `${where}(point.lon)`);
  const r = P.impl.forward(D, P.c, P.to(lat), dlon, where);
  const out: ProjectedPoint<T> = {
    E: P.back(D.div(D.add(P.FE, r.x), P.unitD)),
    N: P.back(D.div(D.add(P.FN, r.y), P.unitD)),
    k: P.back(r.k),
    convergence: P.back(r.gamma),
  };
  return r.h === undefined ? out : { ...out, h: P.back(r.h) };
}

/** Inverse: grid coordinates to latitude and longitude, through a prepared projection. @internal */
export function inverseWith<T>(
  A: Arithmetic<T>,
  P: Internal<T>,
  point: { readonly E: Numeric<T>; readonly N: Numeric<T> },
  where: string,
): GeographicPoint<T> {
  expectObject(point, `${where}(point)`, '{ E, N }');
  const Et = readNumber(A, point.E, `${where}(point.E)`);
  const Nt = readNumber(A, point.N, `${where}(point.N)`);
  const D = P.D;
  const x = D.sub(D.mul(P.to(Et), P.unitD), P.FE);
  const y = D.sub(D.mul(P.to(Nt), P.unitD), P.FN);
  const r = P.impl.inverse(D, P.c, x, y, where);
  const lon = wrapLongitude(D, D.add(r.dlon, P.lonOrigin), `${where}(point)`);
  const out: GeographicPoint<T> = {
    lat: angleOut(A, P.back(r.lat), P.angleUnit),
    lon: angleOut(A, P.back(lon), P.angleUnit),
    k: P.back(r.k),
    convergence: P.back(r.gamma),
  };
  return r.h === undefined ? out : { ...out, h: P.back(r.h) };
}

// ---------------------------------------------------------------------------
// Shared ellipsoidal quantities.

/** Refuses a point: `OUTSIDE_DOMAIN`. @internal */
export function outside(where: string, what: string): QuadspreadError {
  return new QuadspreadError('OUTSIDE_DOMAIN', where, what);
}

/** sin φ, cos φ, and W = √(1 − e² sin²φ) at a latitude in degrees. @internal */
export function latitudeTerms<T>(A: Arithmetic<T>, e2: T, lat: T): { s: T; c: T; W: T } {
  const { sin: s, cos: c } = sinCosDegrees(A, lat);
  return { s, c, W: root(A, A.sub(A.one, A.mul(e2, A.mul(s, s)))) };
}

/**
 * The isometric latitude ψ = atanh(sin φ) − e atanh(e sin φ) (IOGP GN 7-2, where
 * t = e^−ψ in the Lambert and Mercator formulas), written ψ = ±ln((1 + |sin φ|)/cos φ) −
 * (e/2) ln((1 + e sin φ)/(1 − e sin φ)) so that it keeps its accuracy near the poles.
 * `undefined` at a pole (ψ = ±∞). @internal
 */
export function isometric<T>(A: Arithmetic<T>, e: T, s: T, c: T): T | undefined {
  if (A.isZero(c)) return undefined;
  const as = A.abs(s);
  let psi = A.isZero(as) ? A.zero : A.log(A.div(A.add(A.one, as), c));
  if (A.sign(s) < 0) psi = A.neg(psi);
  if (A.isZero(e) || A.isZero(s)) return psi;
  const es = A.mul(e, s);
  const corr = A.div(A.mul(e, A.log(A.div(A.add(A.one, es), A.sub(A.one, es)))), A.from(2));
  return A.sub(psi, corr);
}

/** Most fixed-point steps {@link fromIsometric} takes. */
const MAX_STEPS = 80;

/**
 * The latitude whose isometric latitude is ψ: the fixed point x = ψ + e atanh(e tanh x), then
 * φ = gd(x) (the Gudermannian; the iteration of IOGP GN 7-2 for the Lambert and Mercator
 * inverses, in the variable x = atanh(sin φ); it contracts by e² < 0.007 per step). Returns
 * the latitude in degrees with its sine and cosine. @internal
 */
export function fromIsometric<T>(
  A: Arithmetic<T>,
  e: T,
  psi: T,
  tol: T,
  where: string,
): { lat: T; s: T; c: T } {
  const two = A.from(2);
  const ax = (x: T): { s: T; c: T } => {
    // sin gd(x) = tanh x, cos gd(x) = sech x, from u = e^−|x| without overflow
    const u = A.exp(A.neg(A.abs(x)));
    const u2 = A.mul(u, u);
    const den = A.add(A.one, u2);
    const sAbs = A.div(A.sub(A.one, u2), den);
    return { s: A.sign(x) < 0 ? A.neg(sAbs) : sAbs, c: A.div(A.mul(two, u), den) };
  };
  let x = psi;
  let sc = ax(x);
  const hundredTol = A.mul(A.from(100), tol);
  if (!A.isZero(e)) {
    let converged = false;
    for (let i = 0; i < MAX_STEPS; i++) {
      const es = A.mul(e, sc.s);
      const next = A.add(
        psi,
        A.div(A.mul(e, A.log(A.div(A.add(A.one, es), A.sub(A.one, es)))), two),
      );
      const step = A.abs(A.sub(next, x));
      x = next;
      sc = ax(x);
      // the error left after a step δ is about e²δ < 0.007δ: stop at δ ≤ 100·tol, above the noise
      if (A.cmp(step, A.mul(hundredTol, A.add(A.one, A.abs(x)))) <= 0) {
        converged = true;
        break;
      }
    }
    if (!converged)
      throw new QuadspreadError(
        'NOT_CONVERGED',
        `${where}(point)`,
        `the latitude did not converge in ${MAX_STEPS} steps`,
      );
  }
  return { lat: toDegrees(A, A.atan2(sc.s, sc.c)), s: sc.s, c: sc.c };
}

/** Degrees to radians: θ·π/180. @internal */
export function toRadians<T>(A: Arithmetic<T>, deg: T): T {
  return A.div(A.mul(deg, A.pi), A.from(180));
}
