/**
 * Renders a report as Markdown, for a file to keep with the job.
 *
 * @module cli
 */
import type { Report } from './report.js';
import { BUDGET_SHOWN, shortExact, showExact } from './render-text.js';
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

/** The report as Markdown: a heading per task, a table of results, a table of checks. */
export function renderMarkdown(report: Report): string {
  const out: string[] = [];
  out.push(`# ${markdownText(report.title)}`);
  out.push('');
  out.push(
    `Source: ${markdownCode(report.source)} · arithmetic: \`${report.arithmetic}\` · ${report.digits} significant digits · lengths in ${report.lengthUnit}`,
  );
  if (report.tasks.some((t) => t.results.some((q) => q.sigma !== undefined)))
    out.push('', MARKDOWN_LEGEND);
  for (const t of report.tasks) {
    out.push('');
    out.push(`## ${t.index + 1}. ${cell(t.name)} (${t.kind})`);
    out.push('');
    out.push(markdownText(t.summary));
    if (t.results.length > 0) {
      out.push('');
      out.push('| quantity | value | ± σ | exact form | budget (share of variance) |');
      out.push('|---|---|---|---|---|');
      for (const q of t.results) {
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
        out.push(
          `| ${cell(q.label)} (${codeCell(q.name)}) | ${cell(withUnit(q.value, q.unit))} | ${q.sigma !== undefined ? cell(withUnit(q.sigma, q.unit)) : ''} | ${exact} | ${cell(budget)} |`,
        );
      }
    }
    if (t.checks.length > 0) {
      out.push('');
      out.push('| check | value | tolerance | result |');
      out.push('|---|---|---|---|');
      for (const c of t.checks) {
        out.push(
          `| ${cell(c.label)} | ${cell(withUnit(c.value, c.unit))} | ${cell(/\d/.test(c.tolerance) ? withUnit(c.tolerance, c.unit) : c.tolerance)} | ${c.pass ? '**pass**' : '**FAIL**'} |`,
        );
      }
    }
    if (t.notes.length > 0) {
      out.push('');
      for (const n of t.notes) out.push(`- ${markdownText(n)}`);
    }
  }
  out.push('');
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
