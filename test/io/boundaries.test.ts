// The io area sits above the library and below the CLI: no solver area imports it (so that
// their bundles never carry the parsers), and it reaches the library only through the public
// generic entry (src/index.ts) and the error module.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const src = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', 'src');
const files = (dir: string): string[] =>
  readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
const importsOf = (file: string): string[] =>
  [...readFileSync(file, 'utf8').matchAll(/^\s*(?:import|export)\s[^'"]*?from\s+'([^']+)'/gm)].map(
    (m) => m[1]!,
  );
const area = (f: string) => relative(src, f).split(/[\\/]/)[0]!;

describe('the io area', () => {
  it('is imported by no area of the library but the CLI', () => {
    const bad = files(src)
      .filter((f) => !['io', 'cli'].includes(area(f)))
      .flatMap((f) =>
        importsOf(f)
          .filter((i) => /(^|\/)io(\/|$)/.test(i) || /^(csv-parse|fast-xml-parser)/.test(i))
          .map((i) => `${relative(src, f)} imports ${i}`),
      );
    expect(bad).toEqual([]);
  });

  it('uses the library through src/index.ts and src/errors.ts only', () => {
    const allowed =
      /^(\.\/[\w-]+\.js|\.\.\/(index|errors)\.js|csv-parse(\/sync)?|fast-xml-parser|geojson|node:[\w/]+)$/;
    const io = files(join(src, 'io'));
    expect(io.length).toBeGreaterThan(0);
    const bad = io.flatMap((f) =>
      importsOf(f)
        .filter((i) => !allowed.test(i))
        .map((i) => `${relative(src, f)} imports ${i}`),
    );
    expect(bad).toEqual([]);
  });
});
