// Runs the @example of every export in src/readings and src/elevation, and the code blocks of their
// guides: each line followed by `//=> literal` must evaluate to a value deep-equal to that literal.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { transformSync } from 'esbuild';
import * as quadspread from '../../src/index.js';

const areas = ['readings', 'elevation'].map((a) => join(__dirname, '../../src', a));

function blocks(text: string): { line: number; code: string }[] {
  const out: { line: number; code: string }[] = [];
  const re = /@example\s*\n\s*\*\s*```ts\n([\s\S]*?)\n\s*\*\s*```/g;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    out.push({ line: text.slice(0, m.index).split('\n').length, code: m[1]!.split('\n').map((l) => l.replace(/^\s*\* ?/, '')).join('\n') });
  }
  return out;
}

function toJs(code: string): string {
  const lines = code.split('\n');
  const out: string[] = [];
  for (let i = 0; i < lines.length; i++) {
    const imp = /^import\s*\{([^}]*)\}\s*from\s*'quadspread';?$/.exec(lines[i]!.trim());
    if (imp) { out.push(`const {${imp[1]}} = lib;`); continue; }
    const want = /^\s*\/\/=>\s*(.*)$/.exec(lines[i + 1] ?? '');
    if (want) { out.push(`check((${lines[i]!.trim().replace(/;$/, '')}), (${want[1]}));`); i++; continue; }
    out.push(lines[i]!);
  }
  return transformSync(out.join('\n'), { loader: 'ts' }).code;
}

// The code blocks of the two guides run too: every `//=>` result in them must hold.
describe('the code blocks of docs/readings.md and docs/heights.md hold', () => {
  for (const guide of ['readings.md', 'heights.md']) {
    const text = readFileSync(join(__dirname, '../../docs', guide), 'utf8');
    const re = /^```ts\n([\s\S]*?)^```/gm;
    for (let m = re.exec(text); m; m = re.exec(text)) {
      const code = m[1]!;
      if (!code.includes('//=>')) continue;
      it(`docs/${guide}:${text.slice(0, m.index).split('\n').length}`, () => {
        let n = 0;
        new Function('lib', 'check', toJs(code))(quadspread, (got: unknown, want: unknown) => { n++; expect(got).toEqual(want); });
        expect(n).toBe(code.split('\n').filter((l) => l.trim().startsWith('//=>')).length);
      });
    }
  }
});

for (const dir of areas) {
  const files = readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'index.ts');
  describe(`the @examples of src/${dir.split('/').pop()} hold`, () => {
    for (const file of files) {
      const text = readFileSync(join(dir, file), 'utf8');
      for (const ex of blocks(text)) {
        it(`${file}:${ex.line}`, () => {
          let n = 0;
          new Function('lib', 'check', toJs(ex.code))(quadspread, (got: unknown, want: unknown) => { n++; expect(got).toEqual(want); });
          expect(n).toBeGreaterThan(0);
        });
      }
      it(`${file}: every public export has an @example`, () => {
        for (const b of text.split('/**').slice(1)) {
          const m = /\*\/\s*export (?:function|const) (\w+)/.exec(b);
          if (m && !b.includes('@internal')) expect(b.includes('@example'), `${file}: ${m[1]}`).toBe(true);
        }
      });
    }
  });
}
