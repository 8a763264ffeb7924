/**
 * Display rules of a report: how each kind of quantity is written — lengths and levels to
 * fixed decimals, angles in degrees, minutes and seconds, bearings as azimuths or quadrant
 * bearings, values with an uncertainty rounded to match it — and the formatting itself,
 * done exactly on decimal text (bigints), never through a float.
 *
 * Defaults are common practice for engineering survey reports; a job sets its own under
 * `"display"` and the command line overrides both with `--display key=value,…`.
 *
 * @module cli
 */
import { azimuthToQuadrant, formatDms, isSurd, rational } from '../index.js';
import type { Arithmetic } from '../index.js';
import { show } from '../errors.js';
import { JobInvalid } from './failure.js';
import type { Value } from './task.js';

/** What a quantity is, which decides how it is written. */
export type QuantityKind =
  /** A length or a coordinate, in the job's unit: fixed decimals (`lengths`). */
  | 'length'
  /** A reduced level or a staff reading: fixed decimals (`levels`). */
  | 'level'
  /** A small length in millimetres (misclosures): fixed decimals (`mm`). */
  | 'mm'
  /** An angle in degrees: DMS (or decimal degrees with `angles=degrees`). */
  | 'angle'
  /** A small angle such as a misclosure, in degrees: written in seconds of arc. */
  | 'seconds'
  /** A bearing in degrees clockwise from north: an azimuth in DMS, or a quadrant bearing. */
  | 'bearing'
  /** An area in the job's unit squared: fixed decimals (`area`). */
  | 'area'
  /** A percentage: fixed decimals (`percent`). */
  | 'percent'
  /** A pure number (a spread, a ratio): significant digits (`significant`). */
  | 'number'
  /** A precision ratio N of 1 : N: a whole number. */
  | 'ratio';

/** How a report writes its numbers. */
export interface DisplayRules {
  /** Decimals of lengths and coordinates. */
  lengths: number;
  /** Decimals of reduced levels and staff readings. */
  levels: number;
  /** Decimals of quantities in millimetres. */
  mm: number;
  /** Decimals of the seconds of arc in DMS. */
  seconds: number;
  /** `dms` (default) or `degrees` (decimal degrees, `degreeDecimals` places). */
  angles: 'dms' | 'degrees';
  /** Decimals of decimal degrees when `angles` is `degrees`. */
  degreeDecimals: number;
  /** `azimuth` (default: clockwise from north, 0–360°) or `quadrant` (N 45°00'00" E). */
  bearings: 'azimuth' | 'quadrant';
  /** Decimals of areas. */
  area: number;
  /** Decimals of percentages. */
  percent: number;
  /** Significant digits of pure numbers (spreads, ratios). */
  significant: number;
  /** Whether a value with an uncertainty is rounded to match it (σ to two significant digits). */
  roundToSigma: boolean;
}

/** The defaults (common practice for engineering survey reports in metres). */
export const DEFAULT_DISPLAY: DisplayRules = {
  lengths: 3,
  levels: 3,
  mm: 1,
  seconds: 1,
  angles: 'dms',
  degreeDecimals: 6,
  bearings: 'azimuth',
  area: 2,
  percent: 2,
  significant: 6,
  roundToSigma: true,
};

const DECIMAL_KEYS = [
  'lengths',
  'levels',
  'mm',
  'seconds',
  'degreeDecimals',
  'area',
  'percent',
  'significant',
] as const;

/** What each display key takes, for messages and docs. */
export const DISPLAY_KEYS: Record<keyof DisplayRules, string> = {
  lengths: 'decimals of lengths and coordinates, 0–8',
  levels: 'decimals of levels and staff readings, 0–8',
  mm: 'decimals of millimetres, 0–8',
  seconds: 'decimals of seconds of arc, 0–4',
  angles: '"dms" or "degrees"',
  degreeDecimals: 'decimals of decimal degrees, 0–12',
  bearings: '"azimuth" or "quadrant"',
  area: 'decimals of areas, 0–8',
  percent: 'decimals of percentages, 0–8',
  significant: 'significant digits of spreads and ratios, 1–20',
  roundToSigma: 'true or false',
};

const LIMITS: Record<(typeof DECIMAL_KEYS)[number], [number, number]> = {
  lengths: [0, 8],
  levels: [0, 8],
  mm: [0, 8],
  seconds: [0, 4],
  degreeDecimals: [0, 12],
  area: [0, 8],
  percent: [0, 8],
  significant: [1, 20],
};

/**
 * Reads display settings (from the job's `"display"` object, or `key=value` pairs of the
 * command line) over `base`, failing with exit 2 naming the place.
 */
export function readDisplay(
  given: Record<string, unknown>,
  base: DisplayRules,
  path: string,
): DisplayRules {
  const out: DisplayRules = { ...base };
  for (const [key, raw] of Object.entries(given)) {
    const where = path === '--display' ? `--display ${key}` : `${path}.${key}`;
    if (!Object.prototype.hasOwnProperty.call(DISPLAY_KEYS, key))
      throw new JobInvalid(
        where,
        `${show(key)} is not a display setting (${Object.keys(DISPLAY_KEYS).join(', ')})`,
      );
    const k = key as keyof DisplayRules;
    const bad = (): never => {
      throw new JobInvalid(where, `${show(raw)} is not valid here: give ${DISPLAY_KEYS[k]}`);
    };
    if ((DECIMAL_KEYS as readonly string[]).includes(k)) {
      const n = typeof raw === 'string' && /^\d+$/.test(raw) ? Number(raw) : raw;
      const [lo, hi] = LIMITS[k as (typeof DECIMAL_KEYS)[number]];
      if (typeof n !== 'number' || !Number.isInteger(n) || n < lo || n > hi) bad();
      (out as unknown as Record<string, unknown>)[k] = n;
    } else if (k === 'roundToSigma') {
      if (raw === true || raw === 'true') out.roundToSigma = true;
      else if (raw === false || raw === 'false') out.roundToSigma = false;
      else bad();
    } else if (k === 'angles') {
      if (raw !== 'dms' && raw !== 'degrees') bad();
      out.angles = raw as 'dms' | 'degrees';
    } else if (k === 'bearings') {
      if (raw !== 'azimuth' && raw !== 'quadrant') bad();
      out.bearings = raw as 'azimuth' | 'quadrant';
    }
  }
  return out;
}

/** Parses `--display lengths=4,bearings=quadrant` into pairs. */
export function parseDisplayOption(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const part of text.split(',')) {
    if (part.trim() === '') continue;
    const m = /^\s*([A-Za-z]+)\s*=\s*([^=]*?)\s*$/.exec(part);
    if (!m)
      throw new JobInvalid(
        '--display',
        `${show(part)} is not key=value (e.g. --display lengths=4,bearings=quadrant)`,
      );
    out[m[1]!] = m[2]!;
  }
  return out;
}

// ---- exact decimal text ----

/** A decimal number as sign, digits and power of ten: value = ±digits·10^exp. */
interface Dec {
  neg: boolean;
  digits: bigint;
  exp: number;
}

function parseDec(text: string): Dec {
  const m = /^\s*([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?\s*$/.exec(text);
  if (!m || (m[2] === '' && (m[3] ?? '') === ''))
    throw new Error(`not decimal text: ${JSON.stringify(text)}`);
  const frac = m[3] ?? '';
  return {
    neg: m[1] === '-',
    digits: BigInt((m[2] ?? '') + frac || '0'),
    exp: Number(m[4] ?? 0) - frac.length,
  };
}

/** Digits enough to round any value a report shows correctly (far beyond its decimals). */
const WORKING_DIGITS = 40;

/** High-precision decimal text of a value or surd of an arithmetic. */
export function decimalText<V>(A: Arithmetic<V, boolean>, x: Value<V>): string {
  return isSurd(x) ? x.toPrecision(WORKING_DIGITS) : A.toPrecision(x as V, WORKING_DIGITS);
}

/** The value rounded (half away from zero) to a whole number of units of 10^-decimals, signed. */
export function scaled(text: string, decimals: number): bigint {
  const d = parseDec(text);
  const k = d.exp + decimals;
  let n: bigint;
  if (k >= 0) n = d.digits * 10n ** BigInt(k);
  else {
    const q = 10n ** BigInt(-k);
    n = d.digits / q;
    if (2n * (d.digits % q) >= q) n += 1n;
  }
  return d.neg ? -n : n;
}

/** Writes n·10^-decimals as decimal text (no sign on zero). */
export function unscaled(n: bigint, decimals: number): string {
  const neg = n < 0n;
  const s = (neg ? -n : n).toString().padStart(decimals + 1, '0');
  const body = decimals === 0 ? s : `${s.slice(0, -decimals)}.${s.slice(-decimals)}`;
  return neg ? `-${body}` : body;
}

/** Decimal text rounded to fixed decimals, exactly (half away from zero). */
export function fixed(text: string, decimals: number): string {
  return unscaled(scaled(text, decimals), decimals);
}

/** Decimal text rounded to significant digits, exactly; plain notation for moderate sizes. */
export function significant(text: string, digits: number): string {
  const d = parseDec(text);
  if (d.digits === 0n) return '0';
  const len = d.digits.toString().length;
  const top = len + d.exp; // position of the leading digit: value < 10^top
  const decimals = Math.max(0, digits - top);
  if (top > 15 || top < -6) return Number(text).toPrecision(digits);
  const out = fixed(text, decimals);
  // rounding up may add a digit (9.99 → 10.0): drop one decimal then
  const shown = out.replace('-', '').replace('.', '').replace(/^0+/, '');
  return shown.length > digits && decimals > 0 ? fixed(text, decimals - 1) : out;
}

/** Decimals that round a value to match a standard uncertainty σ given to two significant digits. */
export function decimalsForSigma(sigma: number): number {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return -1;
  return Math.max(0, 1 - Math.floor(Math.log10(sigma)));
}

// ---- angles ----

/** An angle in degrees (exact decimal text) as DMS, or decimal degrees, per the rules. */
export function angleText(text: string, rules: DisplayRules, seconds = rules.seconds): string {
  if (rules.angles === 'degrees') return `${fixed(text, rules.degreeDecimals)}°`;
  return formatDms(rational, text, seconds);
}

/** A bearing (degrees clockwise from north) as an azimuth in [0°, 360°) or a quadrant bearing. */
export function bearingText(text: string, rules: DisplayRules, seconds = rules.seconds): string {
  const R = rational;
  let z = R.from(text);
  const full = R.from(360);
  // Into [0, 360): a bearing is a direction (bounded: the input is one turn or a few).
  for (let i = 0; i < 4 && R.sign(z) < 0; i++) z = R.add(z, full);
  for (let i = 0; i < 4 && R.cmp(z, full) >= 0; i++) z = R.sub(z, full);
  if (rules.bearings === 'quadrant') {
    const q = azimuthToQuadrant(R, z, seconds);
    return q.replace(/^N 90°00'00(\.0*)?" W$/, (m) => m); // no change: a due-west bearing
  }
  if (rules.angles === 'degrees') {
    const f = fixed(R.toPrecision(z, WORKING_DIGITS), rules.degreeDecimals);
    return `${/^360(\.0*)?$/.test(f) ? fixed('0', rules.degreeDecimals) : f}°`;
  }
  // A bearing that rounds to 360° is written 0° (the same direction).
  return formatDms(R, z, seconds).replace(/^360°/, '0°');
}

/** A small angle (degrees) written in seconds of arc, signed: `+3.0"`. */
export function secondsText(text: string, decimals: number): string {
  const s = fixed(
    rational.toPrecision(rational.mul(rational.from(text), rational.from(3600)), WORKING_DIGITS),
    decimals,
  );
  return `${s.startsWith('-') || /^0(\.0*)?$/.test(s) ? s : `+${s}`}"`;
}

/** A standard uncertainty of an angle (degrees): seconds below a minute, DMS above. */
export function angleSigmaText(sigmaDegrees: number): string {
  const sec = sigmaDegrees * 3600;
  if (sec < 60) return `${significant(String(sec), 2)}"`;
  return formatDms(rational, significant(String(sigmaDegrees), 2), 0);
}
