// Every @example in the sources runs, and every `//=>` result in it holds: so no example
// in the API reference can go stale. Examples import from 'quadspread' (served here by
// src/index.ts) or from 'quadspread/rational' | 'quadspread/decimal' | 'quadspread/float'
// (src/entries/{rational,decimal,float}.gen.ts) or from 'quadspread/io' (src/io/index.ts).
import { describe, it, expect } from 'vitest';
import * as generic from '../../src/index.js';
import * as rationalEntry from '../../src/entries/rational.gen.js';
import * as decimalEntry from '../../src/entries/decimal.gen.js';
import * as floatEntry from '../../src/entries/float.gen.js';
import * as ioEntry from '../../src/io/index.js';
import { join } from 'node:path';
import { compileExample, examplesOf, examplesOfMarkdown, repoRoot, sourceFiles, type Example } from './extract.js';

// Guides whose code blocks are run too (add a guide here once its examples use //=>).
const GUIDES = ['README.md', 'docs/choosing-an-arithmetic.md', 'docs/errors.md', 'docs/uncertainty.md', 'docs/geometry.md', 'docs/coordinates.md', 'docs/geodesy.md', 'docs/cli.md', 'docs/performance.md', 'docs/index.md', 'docs/field.md', 'docs/adjustment.md', 'docs/alignment.md', 'docs/interop.md'];

const MODULES: Record<string, unknown> = {
  quadspread: generic,
  'quadspread/rational': rationalEntry,
  'quadspread/decimal': decimalEntry,
  'quadspread/float': floatEntry,
  'quadspread/io': ioEntry,
};

function requireFor(ex: Example) {
  return (id: string) => {
    if (id in MODULES) return MODULES[id];
    throw new Error(`${ex.file}:${ex.line}: examples import only from 'quadspread' or its entries, not '${id}'`);
  };
}

const AsyncFunction = Object.getPrototypeOf(async () => {}).constructor as new (...args: string[]) => (...args: unknown[]) => Promise<void>;

const all = [...sourceFiles().flatMap((f) => examplesOf(f)), ...GUIDES.flatMap((g) => examplesOfMarkdown(join(repoRoot, g)))];

describe('the examples of the API reference', () => {
  it('are found in the sources (one per documented export at least)', () => {
    expect(all.length).toBeGreaterThan(50);
  });

  for (const ex of all) {
    it(`${ex.file}:${ex.line} (${ex.name}) runs and its //=> results hold`, async () => {
      const { js, checks } = compileExample(ex);
      const seen = new Set<number>();
      const check = (actual: unknown, expected: unknown, site: number) => {
        seen.add(site);
        expect(actual, `${ex.file}:${ex.line} check #${site + 1}`).toEqual(expected);
      };
      await new AsyncFunction('require', '__check', 'exports', 'module', js)(requireFor(ex), check, {}, { exports: {} });
      // Every check ran (a check inside a catch block that was never entered fails here).
      expect([...seen].sort((a, b) => a - b)).toEqual([...Array(checks).keys()]);
    });
  }
});
