// Runs the code blocks of docs/uncertainty.md: every `//=> value` line checks the statement
// just above it. Blocks import from 'quadspread': here, the generic entry. (The @example
// blocks of the sources are run for every file by test/docs/examples.test.ts.)
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { transformSync } from 'esbuild';
import * as quadspread from '../../src/index.js';

function toChecks(code: string): string {
  const lines = code.split('\n');
  const out: string[] = [];
  for (const line of lines) {
    const m = /^\s*\/\/=> (.*)$/.exec(line);
    if (m) {
      let i = out.length - 1;
      while (
        i >= 0 &&
        ((out[i] as string).trim() === '' || (out[i] as string).trim().startsWith('//'))
      )
        i--;
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
