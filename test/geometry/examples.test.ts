// Every export of src/geometry, types included, carries an `@example` (the examples themselves
// are run, with every other example of src/, by test/docs/examples.test.ts).
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

const dir = join(__dirname, '../../src/geometry');

const files = readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'index.ts');

describe('every export of src/geometry (functions and types) has an @example', () => {
  for (const file of files) {
    it(`${file} documents each export with an example`, () => {
      const text = readFileSync(join(dir, file), 'utf8');
      const blocks = text.split(/\/\*\*/).slice(1);
      for (const b of blocks) {
        const m = /\*\/\s*export (?:function|const|interface|type|class) (\w+)/.exec(b);
        if (m && !b.includes('@internal'))
          expect(b.includes('@example'), `${file}: ${m[1]} has no @example`).toBe(true);
      }
    });
  }
});
