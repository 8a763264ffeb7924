// Runs the @example blocks of the uncertainty sources: every `//=> value` line checks the
// statement just above it. Examples import from 'quadspread': here, the generic entry.
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { transformSync } from 'esbuild';
import * as quadspread from '../../src/index.js';

const files = [
  'src/arithmetic/uncertain.ts',
  'src/uncertainty/measured.ts',
  'src/uncertainty/budget.ts',
  'src/uncertainty/random.ts',
  'src/uncertainty/monte-carlo.ts',
  'src/uncertainty/readings.ts',
  'src/uncertainty/roundoff.ts',
];

function examples(path: string): string[] {
  let text: string;
  try {
    text = readFileSync(new URL(`../../${path}`, import.meta.url), 'utf8');
  } catch {
    return [];
  }
  const out: string[] = [];
  for (const m of text.matchAll(/@example\s*\n\s*\* ```ts\n([\s\S]*?)\n\s*\* ```/g)) {
    out.push((m[1] as string).split('\n').map((l) => l.replace(/^\s*\* ?/, '')).join('\n'));
  }
  return out;
}

function toChecks(code: string): string {
  const lines = code.split('\n');
  const out: string[] = [];
  for (const line of lines) {
    const m = /^\s*\/\/=> (.*)$/.exec(line);
    if (m) {
      let i = out.length - 1;
      while (i >= 0 && ((out[i] as string).trim() === '' || (out[i] as string).trim().startsWith('//'))) i--;
      const stmt = (out[i] as string).replace(/;\s*(\/\/.*)?$/, '');
      const indent = /^\s*/.exec(stmt)?.[0] ?? '';
      out[i] = `${indent}__check(${stmt.trim()}, ${m[1]});`;
    } else {
      out.push(line.replace(/^import \{([^}]*)\} from 'quadspread';$/, 'const {$1} = __q;'));
    }
  }
  return out.join('\n');
}

const q = quadspread;

describe('the @example blocks of the uncertainty sources', () => {
  for (const file of files) {
    examples(file).forEach((code, k) => {
      it(`example ${k + 1} of ${file} gives the results it states`, () => {
        const js = transformSync(toChecks(code), { loader: 'ts' }).code;
        let checks = 0;
        const check = (got: unknown, want: unknown) => {
          checks++;
          expect(got).toEqual(want);
        };
        new Function('__q', '__check', js)(q, check);
        expect(checks).toBeGreaterThan(0);
      });
    });
  }
});

describe('the code blocks of docs/uncertainty.md', () => {
  const text = readFileSync(new URL('../../docs/uncertainty.md', import.meta.url), 'utf8');
  const blocks = [...text.matchAll(/```ts\n([\s\S]*?)```/g)].map((m) => m[1] as string);
  it('the guide has runnable blocks', () => {
    expect(blocks.length).toBeGreaterThan(1);
  });
  blocks.forEach((code, k) => {
    it(`block ${k + 1} of docs/uncertainty.md gives the results it states`, () => {
      const js = transformSync(toChecks(code), { loader: 'ts' }).code;
      let checks = 0;
      new Function('__q', '__check', js)(q, (got: unknown, want: unknown) => {
        checks++;
        expect(got).toEqual(want);
      });
      expect(checks).toBeGreaterThan(0);
    });
  });
});
