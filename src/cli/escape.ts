/**
 * Escaping of job text (titles, point and task names, labels) for each output format, so that
 * what a job file says is shown as text and never acts as markup, a terminal command or a
 * spreadsheet formula.
 *
 * @module cli
 */
import { csvCell } from '../io/csv-cell.js';

// C0 and C1 control characters, DEL, the line and paragraph separators, and the invisible
// direction marks and overrides (Unicode Standard Annex #9, §2: explicit directional
// formatting characters), which can make a line read differently from what it holds.
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROLS = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028-\u202e\u2066-\u2069]/g;

/**
 * Control characters shown as visible escapes (`\x1B`, `\u202E`; a tab as a space, a line
 * break as `\n`), so that text from a job cannot move the cursor, recolour a terminal, hide
 * itself or start a new line of a report.
 */
export function visibleControls(text: string): string {
  return text.replace(CONTROLS, (c) => {
    if (c === '\t') return ' ';
    if (c === '\n') return '\\n';
    if (c === '\r') return '\\r';
    const code = c.charCodeAt(0);
    return code < 0x100
      ? `\\x${code.toString(16).toUpperCase().padStart(2, '0')}`
      : `\\u${code.toString(16).toUpperCase().padStart(4, '0')}`;
  });
}

/**
 * Text for Markdown (CommonMark, GitHub-flavoured tables): HTML-significant characters as
 * entities (CommonMark 0.31 §6.6: raw HTML starts with `<`), and the punctuation that starts
 * emphasis, links, images, code, strike-through or a table cell escaped with a backslash
 * (§2.4: any ASCII punctuation may be backslash-escaped).
 */
export function markdownText(text: string): string {
  return visibleControls(text)
    .replace(/[\\`*_[\]|~]/g, (c) => `\\${c}`)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;');
}

/**
 * Text as a Markdown code span: delimited by more backticks than the longest run inside, padded
 * with a space when it starts or ends with a backtick (CommonMark 0.31 §6.1); nothing inside
 * a code span is read as HTML or Markdown.
 */
export function markdownCode(text: string): string {
  const t = visibleControls(text);
  const longest = Math.max(0, ...(t.match(/`+/g) ?? []).map((r) => r.length));
  const fence = '`'.repeat(longest + 1);
  const pad = /^[` ]|[` ]$/.test(t) ? ' ' : '';
  return `${fence}${pad}${t}${pad}${fence}`;
}

/**
 * One CSV field of the batch output (comma-separated): quoted as RFC 4180 §2 says and
 * neutralised against formula injection (the OWASP "CSV Injection" guidance) — the spreadsheet
 * mode of the io entry's CSV writer (see `csvCell` in src/io/csv-cell.ts). Numbers (`-12.5`,
 * `+3e-4`, `-1/3`) stay numbers.
 */
export function csvField(field: string): string {
  return csvCell(field, ',', true);
}
