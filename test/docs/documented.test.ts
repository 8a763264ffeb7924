// Every public export of the generic entry (src/index.ts) and of quadspread/io
// (src/io/index.ts) is documented: a summary for every export; and for every value (function, constant, class) an `@example`; and for
// every function a `@param` for each parameter and a `@returns`. Exports tagged @internal
// are left out, as they are from the API reference. The bound entries are generated
// (scripts/gen-bound.mjs) with a summary that links to the generic function.
import { describe, it, expect } from 'vitest';
import ts from 'typescript';
import { join } from 'node:path';
import { repoRoot } from './extract.js';

interface Problem {
  name: string;
  file: string;
  missing: string[];
}

function audit(entry: string): { checked: number; problems: Problem[] } {
  const config = ts.readConfigFile(join(repoRoot, 'tsconfig.json'), ts.sys.readFile);
  const parsed = ts.parseJsonConfigFileContent(config.config, ts.sys, repoRoot);
  const index = join(repoRoot, entry);
  const program = ts.createProgram([index], { ...parsed.options, noEmit: true });
  const checker = program.getTypeChecker();
  const moduleSymbol = checker.getSymbolAtLocation(program.getSourceFile(index)!)!;
  const problems: Problem[] = [];
  let checked = 0;
  for (const exp of checker.getExportsOfModule(moduleSymbol)) {
    const target = exp.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exp) : exp;
    const decls = target.declarations ?? [];
    if (decls.length === 0) continue;
    const tags = (d: ts.Node) => ts.getJSDocTags(d).map((t) => t.tagName.text);
    if (decls.some((d) => tags(d).includes('internal'))) continue;
    checked++;
    const missing: string[] = [];
    const summary = ts.displayPartsToString(target.getDocumentationComment(checker)).trim();
    const allTags = decls.flatMap(tags);
    if (!summary) missing.push('a summary');
    const isValue = (target.flags & ts.SymbolFlags.Value) !== 0;
    if (isValue && !allTags.includes('example')) missing.push('an @example');
    // Functions: each parameter and the result.
    const fn = decls.find((d): d is ts.FunctionDeclaration => ts.isFunctionDeclaration(d) && d.body !== undefined) ?? decls.find(ts.isFunctionDeclaration);
    if (fn) {
      const documented = new Set(ts.getJSDocTags(fn).filter(ts.isJSDocParameterTag).map((t) => t.name.getText()));
      for (const p of fn.parameters) {
        const name = ts.isIdentifier(p.name) ? p.name.text : undefined;
        if (name && !documented.has(name)) missing.push(`@param ${name}`);
      }
      const returnsVoid = fn.type?.kind === ts.SyntaxKind.VoidKeyword;
      if (!returnsVoid && !allTags.includes('returns') && !allTags.includes('return')) missing.push('@returns');
    }
    if (missing.length > 0) {
      const file = decls[0]!.getSourceFile().fileName.slice(repoRoot.length + 1);
      problems.push({ name: exp.name, file, missing });
    }
  }
  return { checked, problems };
}

describe('the API reference', () => {
  const { checked, problems } = audit('src/index.ts');
  const io = audit('src/io/index.ts');

  it('covers the exports of src/index.ts', () => {
    expect(checked).toBeGreaterThan(50);
  });

  it('documents every export: summary, @example for values, @param and @returns for functions', () => {
    const report = [...problems, ...io.problems].map((p) => `${p.file}: ${p.name} lacks ${p.missing.join(', ')}`);
    expect(report).toEqual([]);
  });
});
