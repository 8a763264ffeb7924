/**
 * The report model's presentation step: each quantity's kind (from the task, or from its
 * unit), its text by the display rules, checks written so that the printed numbers show
 * the verdict, and tables from raw values. Task kinds give raw values; only this file
 * decides how they read.
 *
 * @module cli
 */
import { rational } from '../index.js';
import type { Arithmetic } from '../index.js';
import {
  angleSigmaText,
  angleText,
  bearingText,
  decimalText,
  decimalsForSigma,
  fixed,
  scaled,
  secondsText,
  significant,
  unscaled,
} from './display.js';
import type { DisplayRules, QuantityKind } from './display.js';
import type { Check, Quantity, Table } from './report.js';
import type { RawCheck, RawTable } from './task.js';

/** A quantity's kind: as the task says, or from its unit (and `bearing` in its name). */
export function kindOf(q: { name: string; unit: string; kind?: QuantityKind }): QuantityKind {
  if (q.kind !== undefined) return q.kind;
  if (q.unit === '°') return /bearing|azimuth/i.test(q.name) ? 'bearing' : 'angle';
  if (q.unit === 'mm') return 'mm';
  if (q.unit === '%') return 'percent';
  if (q.unit === '') return 'number';
  if (q.unit.endsWith('²')) return 'area';
  return 'length';
}

/**
 * Whether a quantity is internal to the computation (a quadrance Q, a vertical quadrance H,
 * a quadrea in units⁴): as the task says, or by its unit and name.
 */
export function isInternal(q: { name: string; unit: string; internal?: boolean }): boolean {
  if (q.internal !== undefined) return q.internal;
  if (q.unit.endsWith('⁴')) return true;
  return q.unit.endsWith('²') && /(^|[._])(Q\d*|H)$|^Q\d|_Q$/.test(q.name);
}

function withUnit(text: string, unit: string): string {
  return unit === '' ? text : `${text} ${unit}`;
}

/** Fixed decimals of a kind, by the rules. */
function decimalsOf(kind: QuantityKind, rules: DisplayRules): number {
  switch (kind) {
    case 'length':
      return rules.lengths;
    case 'level':
      return rules.levels;
    case 'mm':
      return rules.mm;
    case 'area':
      return rules.area;
    case 'percent':
      return rules.percent;
    case 'ratio':
      return 0;
    default:
      return rules.lengths;
  }
}

/** Text of a decimal value of a kind and unit, by the rules; `sigmaDecimals` rounds it to match σ. */
export function valueText(
  text: string,
  kind: QuantityKind,
  unit: string,
  rules: DisplayRules,
  sigma?: number,
): string {
  const roundToSigma = rules.roundToSigma && sigma !== undefined && sigma > 0;
  switch (kind) {
    case 'angle':
    case 'bearing': {
      let sec = rules.seconds;
      if (roundToSigma) sec = Math.min(4, Math.max(0, decimalsForSigma(sigma * 3600)));
      return kind === 'bearing' ? bearingText(text, rules, sec) : angleText(text, rules, sec);
    }
    case 'seconds':
      return secondsText(text, rules.seconds);
    case 'number':
      return roundToSigma
        ? fixed(text, decimalsForSigma(sigma))
        : significant(text, rules.significant);
    case 'ratio':
      return `1 : ${fixed(text, 0)}`;
    default: {
      const d = roundToSigma ? decimalsForSigma(sigma) : decimalsOf(kind, rules);
      const main = withUnit(fixed(text, d), unit);
      if (kind === 'area' && unit === 'm²' && Math.abs(Number(text)) >= 1000) {
        const R = rational;
        const ha = R.toPrecision(R.div(R.from(text), R.from(10000)), 40);
        return `${main} (${fixed(ha, d + 2)} ha)`;
      }
      return main;
    }
  }
}

/** Text of a standard uncertainty of a kind. */
export function sigmaText(
  sigma: number,
  kind: QuantityKind,
  unit: string,
  rules: DisplayRules,
): string {
  if (kind === 'angle' || kind === 'bearing') return angleSigmaText(sigma);
  if (kind === 'seconds') return `${significant(String(sigma * 3600), 2)}"`;
  const d = rules.roundToSigma ? decimalsForSigma(sigma) : -1;
  return withUnit(d >= 0 ? fixed(String(sigma), d) : significant(String(sigma), 2), unit);
}

/** Adds `kind`, `display`, `displaySigma` and `internal` to a formatted quantity. */
export function present<V>(
  A: Arithmetic<V, boolean>,
  raw: { name: string; unit: string; value: unknown; kind?: QuantityKind; internal?: boolean },
  q: Quantity,
  rules: DisplayRules,
): Quantity {
  const kind = kindOf(raw);
  const sigma = q.sigma !== undefined ? Number(q.sigma) : undefined;
  const text = decimalText(A, raw.value as V);
  q.kind = kind;
  q.display = valueText(text, kind, q.unit, rules, sigma);
  if (sigma !== undefined) q.displaySigma = sigmaText(sigma, kind, q.unit, rules);
  if (isInternal(raw)) q.internal = true;
  return q;
}

/** Most decimals added to show a verdict (beyond that the value equals the limit to 20 places). */
const MORE_DECIMALS = 20;

/**
 * A check with a numeric limit, written so that the printed value and limit show the
 * verdict: starting from the kind's decimals, one more decimal at a time until the printed
 * numbers compare as the exact values did.
 */
export function presentCheck<V>(
  A: Arithmetic<V, boolean>,
  c: RawCheck<V>,
  rules: DisplayRules,
  digits: number,
): Check {
  const kind = kindOf(c);
  const rel = c.relation ?? '≤';
  if (c.limit === undefined) {
    const value = decimalText(A, c.value);
    return {
      name: c.name,
      label: c.label,
      value: significant(value, Math.min(digits, 6)),
      tolerance: c.tolerance ?? '',
      unit: c.unit,
      pass: c.pass,
    };
  }
  const vt = decimalText(A, c.value);
  const lt = decimalText(A, c.limit);
  let d =
    kind === 'number'
      ? Math.max(0, rules.significant - 1 - Math.floor(Math.log10(Math.abs(Number(lt)) || 1)))
      : kind === 'seconds' || kind === 'angle'
        ? rules.seconds
        : decimalsOf(kind, rules);
  let v = 0n;
  let l = 0n;
  for (let k = 0; k <= MORE_DECIMALS; k++, d++) {
    v = scaled(vt, d);
    l = scaled(lt, d);
    const mag = v < 0n ? -v : v;
    const printedPass = rel === '≤' ? mag <= l : v >= l;
    if (printedPass === c.pass) break;
  }
  d = Math.max(0, d);
  const value = unscaled(v, d);
  const limit = unscaled(l, d);
  const full = (x: string): string => significant(x, Math.max(digits, 1));
  const unit = c.unit === '″' || c.unit === '"' ? '"' : c.unit;
  const show = (x: string): string =>
    kind === 'ratio' ? `1 : ${x}` : unit === '"' ? `${x}"` : withUnit(x, unit);
  return {
    name: c.name,
    label: c.label,
    value: full(vt),
    tolerance: `${rel} ${full(lt)}`,
    unit: c.unit,
    pass: c.pass,
    limit: full(lt),
    relation: rel,
    display: `${show(value)}, limit ${rel === '≤' ? '±' : '≥ '}${show(limit)}`,
  };
}

/** A raw table written by the rules: value cells by their column's kind, units in the headings. */
export function presentTable<V>(
  A: Arithmetic<V, boolean>,
  t: RawTable<V>,
  rules: DisplayRules,
): Table {
  const columns = t.columns.map((c) => ({
    label: c.unit && c.unit !== '' ? `${c.label} (${c.unit})` : c.label,
    align: c.kind === undefined ? ('left' as const) : ('right' as const),
  }));
  const rows = t.rows.map((r) =>
    t.columns.map((c, i) => {
      const cell = r[i];
      if (cell === undefined) return '';
      if (typeof cell === 'string' || c.kind === undefined) return String(cell);
      return valueText(decimalText(A, cell as V), c.kind, '', rules).replace(/ \(.* ha\)$/, '');
    }),
  );
  return {
    name: t.name,
    title: t.title,
    columns,
    rows,
    ...(t.notes && t.notes.length > 0 ? { notes: t.notes } : {}),
  };
}
