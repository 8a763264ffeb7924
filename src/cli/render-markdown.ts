/**
 * Renders a report as Markdown, for a file to keep with the job.
 *
 * @module cli
 */
import type { Report, Table } from './report.js';
import { BUDGET_SHOWN, rulesLine, shortExact, showExact } from './render-text.js';
import type { TextOptions } from './render-text.js';
import { markdownCode, markdownText } from './escape.js';

/** What ± σ and the budget column mean, said once at the top of a report that has them. */
const MARKDOWN_LEGEND =
  "± σ is the standard uncertainty (k = 1, first order); the budget gives each input's share of the variance.";

/** Escapes text for a Markdown table cell (markdownText escapes the `|` as well). */
const cell = markdownText;

/** A code span in a table cell: a `|` inside still ends the cell unless escaped (GFM §4.10). */
function codeCell(text: string): string {
  return markdownCode(text).replace(/\|/g, '\\|');
}

function withUnit(value: string, unit: string): string {
  return unit === '' ? value : `${value} ${unit}`;
}

function tableLines(t: Table): string[] {
  const out = ['', `**${cell(t.title)}**`, ''];
  out.push(`| ${t.columns.map((c) => cell(c.label)).join(' | ')} |`);
  out.push(`|${t.columns.map((c) => (c.align === 'right' ? '---:' : '---')).join('|')}|`);
  for (const r of t.rows) out.push(`| ${r.map(cell).join(' | ')} |`);
  for (const n of t.notes ?? []) out.push('', cell(n));
  return out;
}

/** The report as Markdown: a heading per task, a table of results, its tables, a table of checks. */
export function renderMarkdown(report: Report, o: TextOptions = {}): string {
  const out: string[] = [];
  const h = report.header;
  out.push(`# ${markdownText(report.title)}`);
  out.push('');
  out.push(
    [
      ...(h ? [`Date: ${h.date}`, h.program] : []),
      `arithmetic: \`${report.arithmetic}\``,
      `lengths in ${report.lengthUnit}`,
      ...(h?.datum !== undefined ? [`datum/grid: ${cell(h.datum)}`] : []),
      ...(h?.reference !== undefined ? [`reference: ${cell(h.reference)}`] : []),
      `source: ${markdownCode(report.source)}`,
    ].join(' · '),
  );
  if (h)
    out.push(
      '',
      `Computed by: ${cell(h.computedBy ?? '____________')} · checked by: ${cell(h.checkedBy ?? '____________')}`,
    );
  const rules = rulesLine(report);
  if (rules) out.push('', rules);
  if (report.tasks.some((t) => t.results.some((q) => q.sigma !== undefined)))
    out.push('', MARKDOWN_LEGEND);
  for (const t of report.tasks) {
    out.push('');
    out.push(`## ${t.index + 1}. ${cell(t.name)} (${t.kind})`);
    out.push('');
    out.push(markdownText(t.summary));
    if (t.results.length > 0) {
      out.push('');
      out.push(
        o.detail
          ? '| quantity | value | ± σ | exact form | budget (share of variance) |'
          : '| quantity | value | ± σ | budget (share of variance) |',
      );
      out.push(o.detail ? '|---|---:|---:|---|---|' : '|---|---:|---:|---|');
      for (const q of t.results) {
        if (q.internal && !o.detail) continue;
        const all = q.budget ?? [];
        const rest = all.slice(BUDGET_SHOWN);
        const budget = [
          ...all.slice(0, BUDGET_SHOWN).map((b) => `${b.input} ${b.share} %`),
          ...(rest.length
            ? [`${rest.length} more ${rest.reduce((s, b) => s + Number(b.share), 0).toFixed(1)} %`]
            : []),
          ...(q.correlations ?? []).map(
            (c) => `${c.inputs[0]} ↔ ${c.inputs[1]} (r = ${c.r}) ${c.share} %`,
          ),
        ].join(', ');
        const exact = showExact(q) ? codeCell(shortExact(q.exact)) : '';
        const key = o.detail ? ` (${codeCell(q.name)})` : '';
        const value = q.display ?? withUnit(q.value, q.unit);
        const sigma = q.sigma !== undefined ? (q.displaySigma ?? withUnit(q.sigma, q.unit)) : '';
        out.push(
          `| ${cell(q.label)}${key} | ${cell(value)} | ${cell(sigma)} |${o.detail ? ` ${exact} |` : ''} ${cell(budget)} |`,
        );
      }
    }
    for (const tb of t.tables ?? []) out.push(...tableLines(tb));
    if (t.checks.length > 0) {
      out.push('');
      out.push('| check | value and limit | result |');
      out.push('|---|---:|---|');
      for (const c of t.checks) {
        const body =
          c.display ??
          `${withUnit(c.value, c.unit)} (tolerance ${/\d/.test(c.tolerance) ? withUnit(c.tolerance, c.unit) : c.tolerance})`;
        out.push(`| ${cell(c.label)} | ${cell(body)} | ${c.pass ? '**pass**' : '**FAIL**'} |`);
      }
    }
    if (t.notes.length > 0) {
      out.push('');
      for (const n of t.notes) out.push(`- ${markdownText(n)}`);
    }
  }
  out.push('');
  for (const n of report.notes ?? []) out.push(`- ${cell(n)}`, '');
  const s = report.summary;
  out.push(
    s.checks === 0
      ? '**Checks: none** (nothing in this job is checked against a tolerance).'
      : `**Checks: ${s.passed} passed, ${s.failed} failed (of ${s.checks}).**`,
  );
  out.push('');
  out.push(`> **Caution.** ${report.caution}`);
  return out.join('\n') + '\n';
}
