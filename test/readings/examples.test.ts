// Runs the code blocks of the readings and heights guides: each line followed by `//=> literal` must
// evaluate to a value deep-equal to that literal. (The @examples of src/readings and src/elevation
// are run, with every other source's, by test/docs/examples.test.ts.)
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { transformSync } from 'esbuild';
import * as quadspread from '../../src/index.js';

function toJs(code: string): string {
  const lines = code.split('\n');
  const out: string[] = [];
  for (let i = 0; i < lines.length; i++) {
    const imp = /^import\s*\{([^}]*)\}\s*from\s*'quadspread';?$/.exec(lines[i]!.trim());
    if (imp) {
      out.push(`const {${imp[1]}} = lib;`);
      continue;
    }
    const want = /^\s*\/\/=>\s*(.*)$/.exec(lines[i + 1] ?? '');
    if (want) {
      out.push(`check((${lines[i]!.trim().replace(/;$/, '')}), (${want[1]}));`);
      i++;
      continue;
    }
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
        new Function('lib', 'check', toJs(code))(quadspread, (got: unknown, want: unknown) => {
          n++;
          expect(got).toEqual(want);
        });
        expect(n).toBe(code.split('\n').filter((l) => l.trim().startsWith('//=>')).length);
      });
    }
  }
});
