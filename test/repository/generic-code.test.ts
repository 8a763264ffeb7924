// Generic code asks the arithmetic (digits, withDigits, ratio, float64, kernels) instead of
// recognising a specific one: a custom arithmetic must get the same treatment as a built-in one.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const src = join(root, 'src');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

// The arithmetics themselves, and the generated entries that bind them, may name them.
const generic = files(src).filter(
  (f) => !/^(arithmetic|entries)\//.test(relative(src, f).split('\\').join('/')),
);

const FORBIDDEN: [RegExp, string][] = [
  [/[=!]==?\s*(float|rational)\b(?!\s*[.(])/, 'compares with a specific arithmetic'],
  [/\b(float|rational)\s*[=!]==?\s*\(?A\b/, 'compares with a specific arithmetic'],
  [/instanceof\s+(Fraction|Big)\b/, "tests a dependency's class"],
  [
    /\b[A-Z]\.name\s*[=!]==|\.(exec|test)\(\s*[A-Z]\.name|\b[A-Z]\.name\.(match|startsWith|includes)/,
    'reads the arithmetic from its name',
  ],
];

describe('generic code', () => {
  it('the patterns catch the forms they are written for (the lines this rule replaced)', () => {
    const caught = (line: string) => FORBIDDEN.some(([re]) => re.test(line));
    for (const line of [
      'if ((A as unknown) === float) {',
      'if (!((variance as unknown) instanceof Fraction) || !isSurd(s)) return s;',
      'const m = /decimal\\((\\d+)\\)/.exec(A.name);',
      'if (A.exact || /rational/.test(A.name)) return 42;',
      'A.name !== `decimal(${digits})` ||',
    ])
      expect(caught(line), line).toBe(true);
    for (const line of [
      "const label = typeof s.name === 'string' ? s.name : 'x';",
      'A.float64 === true',
    ])
      expect(caught(line), line).toBe(false);
  });

  it('no module outside src/arithmetic compares A with a specific arithmetic, tests instanceof Fraction/Big or matches A.name', () => {
    const bad: string[] = [];
    for (const f of generic) {
      readFileSync(f, 'utf8')
        .split('\n')
        .forEach((line, i) => {
          if (/^\s*(\*|\/\/)/.test(line)) return; // comments
          for (const [re, what] of FORBIDDEN)
            if (re.test(line)) bad.push(`${relative(root, f)}:${i + 1}: ${what}: ${line.trim()}`);
        });
    }
    expect(bad).toEqual([]);
  });
});
