/**
 * Renders a report as one self-contained HTML page (no scripts, no external files), laid
 * out to print on A4 from a browser, with the sketch inline as SVG.
 *
 * @module cli
 */
import type { Check, Quantity, Report, Table } from './report.js';
import { rulesLine, UNCERTAINTY_LEGEND } from './render-text.js';
import { renderSketch } from './sketch.js';

/** Escapes text for HTML character data and attribute values. */
export function htmlEscape(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const STYLE = `
@page { size: A4; margin: 15mm 14mm; }
body { font: 10pt/1.35 "DejaVu Sans", Arial, sans-serif; color: #111; max-width: 182mm; margin: 0 auto; }
h1 { font-size: 15pt; margin: 0 0 4pt; }
h2 { font-size: 12pt; margin: 14pt 0 4pt; border-bottom: 1px solid #999; break-after: avoid; }
h3 { font-size: 10pt; margin: 8pt 0 2pt; break-after: avoid; }
table { border-collapse: collapse; margin: 4pt 0 6pt; break-inside: avoid; }
th, td { padding: 1.5pt 6pt; border-bottom: 1px solid #ddd; vertical-align: top; }
th { text-align: left; border-bottom: 1px solid #555; font-weight: 600; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
dl.header { display: grid; grid-template-columns: max-content 1fr max-content 1fr; gap: 1pt 8pt; margin: 0 0 6pt; }
dl.header dt { font-weight: 600; } dl.header dd { margin: 0; }
.pass { color: #155e1a; font-weight: 600; } .fail { color: #a01010; font-weight: 700; }
.summary { font-weight: 600; margin: 10pt 0; }
.note, .legend { color: #333; font-size: 9pt; }
.caution { border: 1px solid #a01010; padding: 4pt 6pt; margin-top: 10pt; }
.sketch svg { max-width: 100%; height: auto; }
.sketch { break-before: page; }
`;

function e(text: string): string {
  return htmlEscape(text);
}

function quantityRow(q: Quantity): string {
  const budget = (q.budget ?? [])
    .slice(0, 3)
    .map((b) => `${b.input} ${b.share} %`)
    .join('; ');
  return `<tr><td>${e(q.label)}</td><td class="num">${e(q.display ?? `${q.value} ${q.unit}`)}</td><td class="num">${q.displaySigma !== undefined ? `± ${e(q.displaySigma)}` : ''}</td><td class="note">${e(budget)}</td></tr>`;
}

function checkRow(c: Check): string {
  const body = c.display ?? `${c.value} ${c.unit} (tolerance ${c.tolerance})`;
  return `<tr><td>${e(c.label)}</td><td class="num">${e(body)}</td><td class="${c.pass ? 'pass' : 'fail'}">${c.pass ? 'PASS' : 'FAIL'}</td></tr>`;
}

function table(t: Table): string {
  const head = t.columns
    .map((c) => `<th${c.align === 'right' ? ' class="num"' : ''}>${e(c.label)}</th>`)
    .join('');
  const rows = t.rows
    .map(
      (r) =>
        `<tr>${r.map((cell, i) => `<td${t.columns[i]?.align === 'right' ? ' class="num"' : ''}>${e(cell)}</td>`).join('')}</tr>`,
    )
    .join('\n');
  const notes = (t.notes ?? []).map((n) => `<p class="note">${e(n)}</p>`).join('');
  return `<h3>${e(t.title)}</h3>\n<table class="sheet" data-table="${e(t.name)}"><thead><tr>${head}</tr></thead><tbody>\n${rows}\n</tbody></table>${notes}`;
}

/** The report as a self-contained HTML page, printable on A4, with the sketch inline. */
export function renderHtml(report: Report): string {
  const h = report.header;
  const out: string[] = [];
  out.push('<!doctype html>');
  out.push('<html lang="en"><head><meta charset="utf-8">');
  out.push(`<title>${e(report.title)}</title>`);
  out.push(`<style>${STYLE}</style></head><body>`);
  out.push(`<h1>${e(report.title)}</h1>`);
  const facts: [string, string][] = [
    ['Date', h?.date ?? ''],
    ['Program', h?.program ?? 'quadspread'],
    ['Arithmetic', report.arithmetic],
    ['Lengths in', report.lengthUnit],
    ['Datum/grid', h?.datum ?? '—'],
    ['Reference', h?.reference ?? '—'],
    ['Computed by', h?.computedBy ?? ''],
    ['Checked by', h?.checkedBy ?? ''],
    ['Source', report.source],
  ];
  out.push(
    `<dl class="header">${facts.map(([k, v]) => `<dt>${e(k)}</dt><dd>${e(v)}</dd>`).join('')}</dl>`,
  );
  const rules = rulesLine(report);
  if (rules) out.push(`<p class="legend">${e(rules)}</p>`);
  if (report.tasks.some((t) => t.results.some((q) => q.sigma !== undefined)))
    out.push(`<p class="legend">${e(UNCERTAINTY_LEGEND)}</p>`);
  for (const t of report.tasks) {
    out.push(`<section class="task" data-kind="${e(t.kind)}">`);
    out.push(`<h2>${t.index + 1}. ${e(t.name)} <small>(${e(t.kind)})</small></h2>`);
    out.push(`<p>${e(t.summary)}</p>`);
    const shown = t.results.filter((q) => !q.internal);
    if (shown.length > 0) {
      out.push(
        '<table class="results"><thead><tr><th>Quantity</th><th class="num">Value</th><th class="num">Uncertainty</th><th>Budget (share of variance)</th></tr></thead><tbody>',
      );
      out.push(...shown.map(quantityRow));
      out.push('</tbody></table>');
    }
    for (const tb of t.tables ?? []) out.push(table(tb));
    if (t.checks.length > 0) {
      out.push(
        '<table class="checks"><thead><tr><th>Check</th><th class="num">Value and limit</th><th>Verdict</th></tr></thead><tbody>',
      );
      out.push(...t.checks.map(checkRow));
      out.push('</tbody></table>');
    }
    for (const n of t.notes) out.push(`<p class="note">${e(n)}</p>`);
    out.push('</section>');
  }
  for (const n of report.notes ?? []) out.push(`<p class="note">${e(n)}</p>`);
  const s = report.summary;
  out.push(
    `<p class="summary" id="verdict">${
      s.checks === 0
        ? 'Checks: none (nothing in this job is checked against a tolerance).'
        : `Checks: ${s.passed} passed, ${s.failed} failed (of ${s.checks}).`
    }</p>`,
  );
  if (report.tasks.some((t) => (t.sketch ?? []).length > 0)) {
    const svg = renderSketch(report).replace(/^<\?xml[^>]*>\s*/, '');
    out.push(`<section class="sketch"><h2>Sketch</h2>${svg}</section>`);
  }
  out.push(`<p class="caution"><strong>Caution.</strong> ${e(report.caution)}</p>`);
  out.push('</body></html>');
  return out.join('\n') + '\n';
}
