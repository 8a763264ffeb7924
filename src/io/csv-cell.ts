/**
 * One CSV cell as written: quoted as RFC 4180 says, and in the spreadsheet mode neutralised
 * against formula injection. The command-line batch output uses the same code.
 *
 * @module io
 */

/** A number as the writers write it and a spreadsheet reads it back as a number. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+|\/\d+)?$/;

/**
 * One CSV field, quoted as RFC 4180 §2 says (a field holding the delimiter, a quote or a line
 * break in double quotes, quotes doubled). In the `spreadsheet` mode it is also neutralised
 * against formula injection as the OWASP "CSV Injection" guidance describes: a field that
 * starts with `=`, `+`, `-`, `@`, a tab or a carriage return and is not a number gets a leading
 * `'` and is quoted, so a spreadsheet shows it as text; numbers (`-12.5`, `+3e-4`, `-1/3`) stay
 * numbers. The `exchange` mode keeps the text as it is, so a round trip is exact. @internal
 */
export function csvCell(field: string, delimiter: string, spreadsheet: boolean): string {
  if (spreadsheet && /^[=+\-@\t\r]/.test(field) && !NUMBER.test(field))
    return `"'${field.replace(/"/g, '""')}"`;
  return field.includes(delimiter) || /["\n\r]/.test(field)
    ? `"${field.replace(/"/g, '""')}"`
    : field;
}
