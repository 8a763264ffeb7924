// The figures under docs/figures/ (one for each solver, showing which quantity is which): each
// is well-formed SVG with a <title> that names what it shows (for screen readers and for the
// file listing), each is shown by a guide, and every figure a guide shows exists.
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const docs = join(__dirname, '..', '..', 'docs');
const figures = join(docs, 'figures');
const svgs = readdirSync(figures).filter((f) => f.endsWith('.svg')).sort();
const guides = readdirSync(docs).filter((f) => f.endsWith('.md'));
const guideText = guides.map((g) => readFileSync(join(docs, g), 'utf8')).join('\n');

/** Tag balance of an XML document (comments, declarations and self-closing tags allowed). */
function unbalanced(xml: string): string | undefined {
  const stack: string[] = [];
  const tag = /<(\/?)([A-Za-z][\w:-]*)([^<>]*?)(\/?)>|<!--[\s\S]*?-->|<[!?][^<>]*>/g;
  let m: RegExpExecArray | null;
  let last = 0;
  while ((m = tag.exec(xml)) !== null) {
    if (/[<>]/.test(xml.slice(last, m.index))) return `stray < or > before offset ${m.index}`;
    last = tag.lastIndex;
    if (m[2] === undefined) continue;
    if (m[1] === '/') {
      const open = stack.pop();
      if (open !== m[2]) return `</${m[2]}> closes <${open ?? 'nothing'}>`;
    } else if (m[4] !== '/') stack.push(m[2]);
  }
  if (/[<>]/.test(xml.slice(last))) return 'stray < or > at the end';
  return stack.length === 0 ? undefined : `<${stack.join('>, <')}> not closed`;
}

describe('docs/figures', () => {
  it('has figures', () => {
    expect(svgs.length).toBeGreaterThanOrEqual(17);
  });

  it.each(svgs)('%s is well-formed SVG with a title, and a guide shows it', (file) => {
    const xml = readFileSync(join(figures, file), 'utf8');
    expect(xml.trimStart().startsWith('<svg')).toBe(true);
    expect(xml).toContain('xmlns="http://www.w3.org/2000/svg"');
    expect(unbalanced(xml)).toBeUndefined();
    const title = /<title>([^<]{20,})<\/title>/.exec(xml);
    expect(title, `${file} needs a <title> saying what it shows`).not.toBeNull();
    expect(guideText).toContain(`figures/${file}`);
  });

  it('every figure a guide shows exists', () => {
    const shown = [...guideText.matchAll(/\]\((figures\/[\w.-]+\.svg)\)/g)].map((m) => m[1]!);
    expect(shown.length).toBeGreaterThan(0);
    for (const f of shown) expect(existsSync(join(docs, f)), f).toBe(true);
  });

  it('the balance check catches a broken document', () => {
    expect(unbalanced('<svg><g></svg>')).toBeDefined();
    expect(unbalanced('<svg><text>a < b</text></svg>')).toBeDefined();
    expect(unbalanced('<svg><g/><!-- c --></svg>')).toBeUndefined();
  });
});
