/**
 * Renders a report as plain text for a terminal.
 *
 * @module cli
 */
import { rational } from '../index.js';
import type { Quantity, Report } from './report.js';
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

function withUnit(value: string, unit: string): string {
  return unit === '' ? value : `${value} ${unit}`;
}

function quantityLines(q: Quantity): string[] {
  const sigma = q.sigma !== undefined ? `  ± ${withUnit(q.sigma, q.unit)}` : '';
  const lines = [`  ${q.label} [${q.name}]: ${withUnit(q.value, q.unit)}${sigma}`];
  if (showExact(q)) lines.push(`      exact: ${shortExact(q.exact)}`);
  if (q.budget && q.budget.length > 0) {
    const top = q.budget
      .slice(0, BUDGET_SHOWN)
      .map((b) => `${b.input} ${b.share} % (${withUnit(b.part, q.unit)})`);
    const rest = q.budget.slice(BUDGET_SHOWN);
    if (rest.length > 0)
      top.push(
        `${rest.length} other input${rest.length === 1 ? '' : 's'} ${rest.reduce((s, b) => s + Number(b.share), 0).toFixed(1)} %`,
      );
    lines.push(`      budget: ${top.join('; ')}`);
  }
  for (const c of q.correlations ?? [])
    lines.push(
      `      correlation ${c.inputs[0]} ↔ ${c.inputs[1]} (r = ${c.r}): ${c.share} % of the variance`,
    );
  return lines;
}

/** The report as text: a header, each task's results and checks, the tally, the caution. */
export function renderText(report: Report): string {
  const out: string[] = [];
  out.push(`quadspread report: ${report.title}`);
  out.push(
    `source: ${report.source}; arithmetic: ${report.arithmetic}; ${report.digits} significant digits; lengths in ${report.lengthUnit}`,
  );
  if (report.tasks.some((t) => t.results.some((q) => q.sigma !== undefined)))
    out.push(UNCERTAINTY_LEGEND);
  for (const t of report.tasks) {
    out.push('');
    out.push(`[${t.index + 1}] ${t.name} (${t.kind})`);
    out.push(`  ${t.summary}`);
    for (const q of t.results) out.push(...quantityLines(q));
    for (const c of t.checks) {
      out.push(
        `  check ${c.pass ? 'PASS' : 'FAIL'}: ${c.label}: ${withUnit(c.value, c.unit)} (tolerance ${/\d/.test(c.tolerance) ? withUnit(c.tolerance, c.unit) : c.tolerance})`,
      );
    }
    for (const n of t.notes) out.push(`  note: ${n}`);
  }
  out.push('');
  const s = report.summary;
  out.push(
    s.checks === 0
      ? 'checks: none (nothing in this job is checked against a tolerance)'
      : `checks: ${s.passed} passed, ${s.failed} failed (of ${s.checks})${s.failed > 0 ? ' -- SEE FAILED CHECKS ABOVE' : ''}`,
  );
  out.push('');
  out.push(report.caution);
  // Each entry is one line: control characters from the job (a name with an escape sequence or
  // a line break) are shown escaped, never sent to the terminal.
  return out.map(visibleControls).join('\n') + '\n';
}
