/**
 * The atmospheric correction of an electronic distance: ppm from temperature, pressure and
 * humidity by the group refractivity of visible and near-infrared light.
 *
 * @module field
 */
import { invalidArgument, checkArithmetic } from '../errors.js';
import type { Arithmetic, Numeric } from '../arithmetic/types.js';
import { readNumber } from '../geometry/validate.js';
import { checkRecord } from './internal.js';

/** The weather at the sight, and the instrument's carrier and reference refractivity. */
export interface Atmosphere<T> {
  /** Dry-bulb temperature t, °C (above −273.15). */
  readonly temperature: Numeric<T>;
  /** Total air pressure p, hPa (> 0). */
  readonly pressure: Numeric<T>;
  /** Relative humidity, percent in [0, 100]; or give `vapourPressure`. Default 0 (dry air). */
  readonly humidity?: Numeric<T>;
  /** Partial pressure of water vapour e, hPa (≥ 0), instead of `humidity`. */
  readonly vapourPressure?: Numeric<T>;
  /** Carrier wavelength λ of the distance meter, micrometres (e.g. 0.658 for a red laser). */
  readonly wavelength: Numeric<T>;
  /**
   * The reference refractivity N_ref of the instrument (ppm): the refractivity for which its
   * modulation frequency makes the displayed distance true. The maker states it.
   */
  readonly referenceRefractivity: Numeric<T>;
}

/** What {@link atmosphericPpm} returns. */
export interface AtmosphericPpm<T> {
  /** The correction in parts per million: N_ref − N_L; S = S_raw·(1 + ppm·10⁻⁶). */
  readonly ppm: T;
  /** N_L, the group refractivity of the ambient air (ppm). */
  readonly refractivity: T;
  /** N_gr, the group refractivity of standard air at λ (ppm). */
  readonly groupRefractivity: T;
  /** e, the partial water vapour pressure used, hPa. */
  readonly vapourPressure: T;
}

/**
 * The first velocity correction of an electronic distance meter, in ppm, from the weather:
 * ppm = N_ref − N_L, where N_L is the group refractivity of the ambient air and N_ref the
 * instrument's reference refractivity. By the formulae the International Association of
 * Geodesy recommended in 1999 for light waves (Rüeger, *Electronic Distance Measurement*,
 * 4th ed., Springer 1996, and the IAG resolution of 1999, Birmingham — from memory):
 * - standard air (0 °C, 1013.25 hPa, dry, 375 ppm CO₂):
 *   N_gr = 287.6155 + 4.88660/λ² + 0.06800/λ⁴ (λ in µm);
 * - ambient air: N_L = (273.15/1013.25)·N_gr·p/T − 11.27·e/T, T = 273.15 + t kelvin;
 * - e from relative humidity h: e = (h/100)·E_w, E_w = (1.0007 + 3.46·10⁻⁶·p)·6.1121·
 *   exp(17.502·t/(240.97 + t)) hPa (saturation over water, Buck 1981, as the same
 *   resolution quotes it — from memory).
 *
 * Exact in `rational` when `vapourPressure` (or no humidity) is given; from a relative
 * humidity, the exponential is taken in JS numbers (Math.exp) and read back, so the
 * result is within about 10⁻¹⁶ relative of a term under 1 ppm (and an uncertain arithmetic
 * gets no derivative through it).
 *
 * @param A the arithmetic
 * @param atmosphere temperature (°C), pressure (hPa), humidity (%) or vapourPressure (hPa),
 *   wavelength (µm), referenceRefractivity (ppm)
 * @returns `{ ppm, refractivity, groupRefractivity, vapourPressure }`
 * @throws {QuadspreadError} `INVALID_ARGUMENT` for a missing value, a temperature at or
 *   below −273.15 °C, a pressure or wavelength ≤ 0, a humidity outside [0, 100], a negative
 *   vapour pressure, or both humidity and vapourPressure; `INVALID_NUMBER`.
 * @example
 * ```ts
 * import { rational, atmosphericPpm } from 'quadspread';
 * // at λ = 0.5 µm, standard air has N_gr = 287.6155 + 4.8866·4 + 0.068·16 = 308.2499
 * const r = atmosphericPpm(rational, { temperature: 0, pressure: '1013.25', wavelength: '0.5', referenceRefractivity: 310 });
 * [rational.toString(r.groupRefractivity), rational.toString(r.ppm)];
 * //=> ['3082499/10000', '17501/10000']
 * ```
 */
export function atmosphericPpm<T>(A: Arithmetic<T>, atmosphere: Atmosphere<T>): AtmosphericPpm<T> {
  checkArithmetic(A, 'atmosphericPpm');
  const w = 'atmosphericPpm(atmosphere)';
  checkRecord(atmosphere, w);
  const need = (k: keyof Atmosphere<T>): T => {
    const v = atmosphere[k];
    if (v === undefined) throw invalidArgument(`${w}.${k}`, 'is missing');
    return readNumber(A, v, `${w}.${k}`);
  };
  const t = need('temperature');
  const p = need('pressure');
  const lambda = need('wavelength');
  const Nref = need('referenceRefractivity');
  const T = A.add(t, A.from('273.15')); // kelvin
  if (A.sign(T) <= 0)
    throw invalidArgument(`${w}.temperature`, `${A.toString(t)} °C is at or below absolute zero`);
  if (A.sign(p) <= 0)
    throw invalidArgument(`${w}.pressure`, `${A.toString(p)} hPa is not positive`);
  if (A.sign(lambda) <= 0)
    throw invalidArgument(`${w}.wavelength`, `${A.toString(lambda)} µm is not positive`);
  let e = A.zero;
  if (atmosphere.vapourPressure !== undefined) {
    if (atmosphere.humidity !== undefined)
      throw invalidArgument(w, 'give humidity or vapourPressure, not both');
    e = need('vapourPressure');
    if (A.sign(e) < 0)
      throw invalidArgument(`${w}.vapourPressure`, `${A.toString(e)} hPa is negative`);
  } else if (atmosphere.humidity !== undefined) {
    const h = need('humidity');
    if (A.sign(h) < 0 || A.cmp(h, A.from(100)) > 0)
      throw invalidArgument(`${w}.humidity`, `${A.toString(h)} % is outside [0, 100]`);
    const tc = A.toNumber(t);
    // Saturation vapour pressure over water (Buck 1981, as quoted by the IAG 1999 resolution).
    const Ew = A.mul(
      A.add(A.from('1.0007'), A.mul(A.from('3.46e-6'), p)),
      A.mul(A.from('6.1121'), A.from(Math.exp((17.502 * tc) / (240.97 + tc)))),
    );
    e = A.div(A.mul(h, Ew), A.from(100));
  }
  const l2 = A.div(A.one, A.mul(lambda, lambda));
  // Group refractivity of standard air (IAG 1999, light waves).
  const Ngr = A.add(
    A.add(A.from('287.6155'), A.mul(A.from('4.88660'), l2)),
    A.mul(A.from('0.06800'), A.mul(l2, l2)),
  );
  // Ambient group refractivity: N_L = (273.15/1013.25)·N_gr·p/T − 11.27·e/T.
  const NL = A.div(
    A.sub(
      A.div(A.mul(A.mul(A.from('273.15'), Ngr), p), A.from('1013.25')),
      A.mul(A.from('11.27'), e),
    ),
    T,
  );
  return { ppm: A.sub(Nref, NL), refractivity: NL, groupRefractivity: Ngr, vapourPressure: e };
}
