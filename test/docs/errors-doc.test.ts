// docs/errors.md lists exactly the codes of ERROR_CODES (src/errors.ts), in order, each with
// its meaning; and its example message is what QuadspreadError really says.
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ERROR_CODES, QuadspreadError, rational } from '../../src/index.js';
import { repoRoot } from './extract.js';

const doc = readFileSync(join(repoRoot, 'docs/errors.md'), 'utf8');
const rows = [...doc.matchAll(/^\| `([A-Z_]+)` \| (.*) \|$/gm)].map((m) => [m[1]!, m[2]!.replace(/\\\|/g, '|')] as const);

describe('docs/errors.md', () => {
  it('has one row per code of ERROR_CODES, in order, with its meaning (regenerate: node scripts/gen-errors-doc.mjs)', () => {
    expect(rows).toEqual(Object.entries(ERROR_CODES));
  });

  it('shows the message QuadspreadError really gives for bad text', () => {
    let error: unknown;
    try {
      rational.from('12,5');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(QuadspreadError);
    const e = error as QuadspreadError;
    expect(doc).toContain(`e.message; // '${e.message}'`);
    expect(doc).toContain(`e.where;   // '${e.where}'`);
    expect(doc).toContain(`e.code;    // '${e.code}'`);
  });
});
