// Runs every `@example` of src/geometry/*.ts: each line before a `//=> value` line is an
// expression whose value must deep-equal that JS literal.
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { transformSync } from 'esbuild';
import * as quadspread from '../../src/index.js';

const dir = join(__dirname, '../../src/geometry');

interface Example { file: string; line: number; code: string }

function examples(file: string): Example[] {
  const text = readFileSync(join(dir, file), 'utf8');
  const out: Example[] = [];
  const re = /@example\s*\n\s*\*\s*```ts\n([\s\S]*?)\n\s*\*\s*```/g;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    const line = text.slice(0, m.index).split('\n').length;
    const code = m[1]!.split('\n').map((l) => l.replace(/^\s*\* ?/, '')).join('\n');
    out.push({ file, line, code });
  }
  return out;
}

function compile(code: string): string {
  const lines = code.split('\n');
  const body: string[] = [];
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    const imp = /^import\s*\{([^}]*)\}\s*from\s*'quadspread';?$/.exec(l.trim());
    if (imp) { body.push(`const {${imp[1]}} = __m;`); continue; }
    const next = lines[i + 1];
    const exp = next === undefined ? null : /^\s*\/\/=>\s*(.*)$/.exec(next);
    if (exp) {
      body.push(`__check((${l.trim().replace(/;$/, '')}), (${exp[1]}));`);
      i++;
      continue;
    }
    body.push(l);
  }
  return transformSync(body.join('\n'), { loader: 'ts' }).code;
}

const files = readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'index.ts');

describe('every @example in src/geometry runs and its //=> results hold', () => {
  for (const file of files) {
    for (const ex of examples(file)) {
      it(`${file}:${ex.line}`, () => {
        let checks = 0;
        const check = (actual: unknown, expected: unknown) => {
          checks++;
          expect(actual).toEqual(expected);
        };
        new Function('__m', '__check', compile(ex.code))(quadspread, check);
        expect(checks).toBeGreaterThan(0);
      });
    }
  }
});

describe('every export of src/geometry (functions and types) has an @example', () => {
  for (const file of files) {
    it(`${file} documents each export with an example`, () => {
      const text = readFileSync(join(dir, file), 'utf8');
      const blocks = text.split(/\/\*\*/).slice(1);
      for (const b of blocks) {
        const m = /\*\/\s*export (?:function|const|interface|type|class) (\w+)/.exec(b);
        if (m && !b.includes('@internal')) expect(b.includes('@example'), `${file}: ${m[1]} has no @example`).toBe(true);
      }
    });
  }
});
