/**
 * Minimal CSV reading and writing for the batch command (RFC 4180 quoting: fields with a
 * comma, quote or line break are quoted, quotes doubled). Records do not span lines.
 *
 * @module cli
 */
import { csvField } from './escape.js';

/** Splits one CSV line into fields, or returns a reason when the quoting is broken. */
export function splitCsvLine(line: string): string[] | string {
  const out: string[] = [];
  let i = 0;
  for (;;) {
    if (line[i] === '"') {
      let field = '';
      i++;
      for (;;) {
        if (i >= line.length) return 'a quoted field is not closed';
        if (line[i] === '"') {
          if (line[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        field += line[i];
        i++;
      }
      out.push(field);
      if (i < line.length && line[i] !== ',') return 'text after a closing quote';
    } else {
      const end = line.indexOf(',', i);
      out.push((end < 0 ? line.slice(i) : line.slice(i, end)).trim());
      i = end < 0 ? line.length : end;
    }
    if (i >= line.length) return out;
    i++; // the comma
  }
}

/** Writes one CSV record (with a trailing newline); fields that could act as formulas are neutralised. */
export function csvLine(fields: readonly string[]): string {
  return fields.map(csvField).join(',') + '\n';
}
