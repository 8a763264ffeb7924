/**
 * Renders a report as plain text for a terminal.
 *
 * @module cli
 */
import { rational } from '../index.js';
import type { Quantity, Report, Table } from './report.js';
import { visibleControls } from './escape.js';

const EXACT_SHOWN = 72;
/** Budget lines shown per quantity in text and Markdown (JSON has them all). */
export const BUDGET_SHOWN = 3;

/** The exact form as shown in text and Markdown: long forms are cut, with their length said. */
export function shortExact(exact: string): string {
  if (exact.length <= EXACT_SHOWN) return exact;
  return `${exact.slice(0, EXACT_SHOWN - 12)}… (${exact.length} characters; full form in --format json)`;
}

/**
 * Whether text and Markdown show the exact form: not when the decimal value shown is
 * already exactly it (integers, terminating decimals such as 114023/1000 = 114.023).
 */
export function showExact(q: Quantity): q is Quantity & { exact: string } {
  if (q.exact === undefined) return false;
  if (q.exact.includes('√')) return true;
  try {
    return !rational.eq(rational.from(q.exact), rational.from(q.value));
  } catch {
    return true;
  }
}

/** What ± and the budget lines mean, said once at the top of a report that has them. */
export const UNCERTAINTY_LEGEND =
  "± is the standard uncertainty (k = 1, first order); a budget gives each input's share of the variance and, in brackets, its part of the uncertainty.";

/** Longest line of a text report. */
export const TEXT_WIDTH = 100;

/** Wraps text into lines of at most `width` characters, the first after `first`, the rest after `rest`. */
export function wrap(text: string, first: string, rest: string, width = TEXT_WIDTH): string[] {
  const lines: string[] = [];
  let line = first;
  let empty = true;
  // Control characters (a line break in a name from the job) are made visible first, so that
  // they neither start a line nor escape the width.
  for (const word0 of visibleControls(text)
    .split(' ')
    .filter((w) => w !== '')) {
    let word = word0;
    const room = width - (empty ? line.length : line.length + 1);
    if (word.length <= room) {
      line += (empty ? '' : ' ') + word;
      empty = false;
      continue;
    }
    if (!empty) {
      lines.push(line);
      line = rest;
      empty = true;
    }
    // A word longer than a line is cut.
    while (line.length + word.length > width) {
      const cut = width - line.length;
      lines.push(line + word.slice(0, cut));
      word = word.slice(cut);
      line = rest;
    }
    line += word;
    empty = word === '';
  }
  if (!empty || lines.length === 0) lines.push(line);
  return lines;
}

function withUnit(value: string, unit: string): string {
  return unit === '' ? value : `${value} ${unit}`;
}

/** What the report shows beyond the display rules. */
export interface TextOptions {
  /** Show machine keys, exact forms and internal quantities (quadrances, quadrea, H). */
  detail?: boolean;
}

function quantityLines(q: Quantity, o: TextOptions): string[] {
  const value = q.display ?? withUnit(q.value, q.unit);
  const sigma = q.sigma !== undefined ? ` ± ${q.displaySigma ?? withUnit(q.sigma, q.unit)}` : '';
  const key = o.detail ? ` [${q.name}]` : '';
  const lines = wrap(`${q.label}${key}: ${value}${sigma}`, '  ', '      ');
  if (o.detail && showExact(q))
    lines.push(...wrap(`exact: ${shortExact(q.exact)}`, '      ', '        '));
  if (q.budget && q.budget.length > 0) {
    const top = q.budget.slice(0, BUDGET_SHOWN).map((b) => `${b.input} ${b.share} %`);
    const rest = q.budget.slice(BUDGET_SHOWN);
    if (rest.length > 0)
      top.push(
        `${rest.length} other input${rest.length === 1 ? '' : 's'} ${rest.reduce((s, b) => s + Number(b.share), 0).toFixed(1)} %`,
      );
    lines.push(...wrap(`budget: ${top.join('; ')}`, '      ', '        '));
  }
  for (const c of q.correlations ?? [])
    lines.push(
      ...wrap(
        `correlation ${c.inputs[0]} ↔ ${c.inputs[1]} (r = ${c.r}): ${c.share} % of the variance`,
        '      ',
        '        ',
      ),
    );
  return lines;
}

/** A table as fixed-width text lines, indented. */
export function tableLines(t: Table, indent = '  '): string[] {
  const widths = t.columns.map((c, i) =>
    Math.max(c.label.length, ...t.rows.map((r) => (r[i] ?? '').length)),
  );
  const cellText = (text: string, i: number): string =>
    t.columns[i]!.align === 'right' ? text.padStart(widths[i]!) : text.padEnd(widths[i]!);
  const line = (cells: string[]): string =>
    (indent + cells.map((c, i) => cellText(c, i)).join('  ')).trimEnd();
  const out = [...wrap(t.title, indent, indent)];
  out.push(line(t.columns.map((c) => c.label)));
  out.push(indent + widths.map((w) => '-'.repeat(w)).join('  '));
  for (const r of t.rows) out.push(line(r));
  for (const n of t.notes ?? []) out.push(...wrap(n, indent, indent + '  '));
  return out;
}

/** The header lines: title, date, program, arithmetic, units, datum, computed and checked by. */
export function headerLines(report: Report): string[] {
  const h = report.header;
  const out = wrap(`quadspread report: ${report.title}`, '', '  ');
  const facts = [
    ...(h ? [`date ${h.date}`, h.program] : []),
    `arithmetic ${report.arithmetic}`,
    `lengths in ${report.lengthUnit}`,
    ...(h?.datum !== undefined ? [`datum/grid ${h.datum}`] : []),
    ...(h?.reference !== undefined ? [`reference ${h.reference}`] : []),
    `source ${report.source}`,
  ];
  out.push(...wrap(facts.join('; '), '', '  '));
  if (h)
    out.push(
      `computed by: ${h.computedBy ?? '____________________'}   checked by: ${h.checkedBy ?? '____________________'}`,
    );
  return out;
}

/** The display rules in a line. */
export function rulesLine(report: Report): string | undefined {
  const r = report.display;
  if (!r) return undefined;
  return `Lengths to ${r.lengths} decimals, levels to ${r.levels}; angles ${r.angles === 'dms' ? `in DMS to ${r.seconds === 0 ? 'whole seconds' : `${r.seconds} decimal${r.seconds === 1 ? '' : 's'} of a second`}` : `in degrees to ${r.degreeDecimals} decimals`}; bearings as ${r.bearings === 'azimuth' ? 'azimuths clockwise from north' : 'quadrant bearings'}${r.roundToSigma ? '; a value with ± is rounded to match its uncertainty' : ''}.`;
}

/** The report as text: a header, each task's results, tables and checks, the tally, the caution. */
export function renderText(report: Report, o: TextOptions = {}): string {
  const out: string[] = [];
  out.push(...headerLines(report));
  const rules = rulesLine(report);
  if (rules) out.push(...wrap(rules, '', ''));
  if (report.tasks.some((t) => t.results.some((q) => q.sigma !== undefined)))
    out.push(...wrap(UNCERTAINTY_LEGEND, '', ''));
  for (const t of report.tasks) {
    out.push('');
    out.push(...wrap(`[${t.index + 1}] ${t.name} (${t.kind})`, '', '    '));
    out.push(...wrap(t.summary, '  ', '  '));
    for (const q of t.results) if (o.detail || !q.internal) out.push(...quantityLines(q, o));
    for (const table of t.tables ?? []) {
      out.push('');
      out.push(...tableLines(table));
    }
    if ((t.tables ?? []).length > 0 && t.checks.length > 0) out.push('');
    for (const c of t.checks) {
      const body =
        c.display !== undefined
          ? `${c.label}: ${c.display}`
          : `${c.label}: ${withUnit(c.value, c.unit)} (tolerance ${/\d/.test(c.tolerance) ? withUnit(c.tolerance, c.unit) : c.tolerance})`;
      out.push(...wrap(`check ${c.pass ? 'PASS' : 'FAIL'}: ${body}`, '  ', '      '));
    }
    for (const n of t.notes) out.push(...wrap(`note: ${n}`, '  ', '        '));
  }
  out.push('');
  for (const n of report.notes ?? []) out.push(...wrap(`note: ${n}`, '', '      '));
  const s = report.summary;
  out.push(
    ...wrap(
      s.checks === 0
        ? 'checks: none (nothing in this job is checked against a tolerance)'
        : `checks: ${s.passed} passed, ${s.failed} failed (of ${s.checks})${s.failed > 0 ? ' -- SEE FAILED CHECKS ABOVE' : ''}`,
      '',
      '  ',
    ),
  );
  out.push('');
  out.push(...wrap(report.caution, '', ''));
  // Each entry is one line: control characters from the job (a name with an escape sequence or
  // a line break) are shown escaped, never sent to the terminal.
  return out.map(visibleControls).join('\n') + '\n';
}
