// The escaping functions of the reports, in-process: what each format shows of hostile text.
import { describe, expect, it } from 'vitest';
import { csvField, markdownCode, markdownText, visibleControls } from '../../src/cli/escape';
import { findDuplicateKey } from '../../src/cli/json-keys';

describe('escaping of job text', () => {
  it('visibleControls shows C0, C1, DEL and direction overrides as escapes and keeps other text', () => {
    expect(visibleControls('a\u001b[31mb\u009b\u007f\u202e\u2066c\nd\te')).toBe(
      'a\\x1B[31mb\\x9B\\x7F\\u202E\\u2066c\\nd e',
    );
    expect(visibleControls('Höhe 12° ± 5″ – ✓')).toBe('Höhe 12° ± 5″ – ✓');
  });

  it('markdownText turns HTML into entities and escapes link, emphasis, code and cell marks', () => {
    expect(markdownText('<a href="x">&</a>')).toBe('&lt;a href="x"&gt;&amp;&lt;/a&gt;');
    expect(markdownText('![i](u) *e* _f_ `c` a|b ~~s~~ \\')).toBe(
      '!\\[i\\](u) \\*e\\* \\_f\\_ \\`c\\` a\\|b \\~\\~s\\~\\~ \\\\',
    );
  });

  it('markdownCode fences with more backticks than the text holds (CommonMark 0.31 §6.1)', () => {
    expect(markdownCode('A1')).toBe('`A1`');
    expect(markdownCode('a`b')).toBe('``a`b``');
    expect(markdownCode('`x``')).toBe('``` `x`` ```');
  });

  it('csvField neutralises =, +, -, @, tab and CR at the start of text but leaves numbers numeric', () => {
    for (const f of ['=1+2', '+A1', '-A1', '@SUM(A1)', '\tx', '\rx', '=cmd|"/c calc"!A0'])
      expect(csvField(f)).toBe(`"'${f.replace(/"/g, '""')}"`);
    for (const f of ['-12.5', '+3e-4', '-1/3', '0', '12', '.5', '-0.25E+3'])
      expect(csvField(f)).toBe(f);
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
  });
});

describe('duplicate keys in JSON text', () => {
  it('finds a key written twice, comparing keys after their escapes, with both lines', () => {
    expect(findDuplicateKey('{"a": 1,\n "b": {"c": [1, {"d": 2,\n "\\u0064": 3}]}}')).toEqual({
      path: 'b.c[1].d',
      line: 3,
      firstLine: 2,
    });
  });

  it('finds none when equal keys are in different objects, or appear as values', () => {
    expect(findDuplicateKey('{"a": {"x": 1}, "b": {"x": "a"}, "c": ["a", "a"], "d": "\\"a"}')).toBe(
      undefined,
    );
  });
});
