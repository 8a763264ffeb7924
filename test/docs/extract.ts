// Extracts the `@example` blocks of the sources and turns each into runnable code, for
// test/docs/examples.test.ts. An example is a fenced ```ts block after `@example` in a
// TSDoc comment; a line `//=> <JS literal>` right after an expression statement says what
// that expression evaluates to (compared deep-equal). Imports from 'quadspread' and
// 'quadspread/<entry>' are served by the source modules.
import ts from 'typescript';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

export interface Example {
  /** Source file, relative to the repository. */
  file: string;
  /** 1-based line of the `@example` tag. */
  line: number;
  /** The documented declaration (function, constant, class, member), when found. */
  name: string;
  /** The code of the fenced block, comment stars removed. */
  code: string;
}

export interface CompiledExample {
  /** JavaScript (CommonJS) calling `__check(actual, expected, site)` for each `//=>`. */
  js: string;
  /** Number of `//=>` checks in the example. */
  checks: number;
}

export const repoRoot = join(__dirname, '../..');

export function sourceFiles(dir = join(repoRoot, 'src')): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...sourceFiles(path));
    else if (name.endsWith('.ts') && !name.endsWith('.d.ts')) out.push(path);
  }
  return out;
}

const DECL = /^\s*(?:export\s+)?(?:declare\s+)?(?:default\s+)?(?:abstract\s+)?(?:async\s+)?(?:function\*?|const|let|var|class|interface|type|enum)\s+([\w$]+)/;
const MEMBER = /^\s*(?:static\s+|readonly\s+|get\s+|set\s+|override\s+|async\s+)*([\w$]+)\s*[(:<=?]/;

/** Every `@example` of one file. Throws when an example has no fenced code block. */
export function examplesOf(path: string): Example[] {
  const text = readFileSync(path, 'utf8');
  const file = relative(repoRoot, path);
  const out: Example[] = [];
  const comment = /\/\*\*([\s\S]*?)\*\//g;
  for (let m = comment.exec(text); m; m = comment.exec(text)) {
    const body = m[1]!.split('\n').map((l) => l.replace(/^\s*\* ?/, ''));
    const after = text.slice(m.index + m[0].length).split('\n').find((l) => l.trim() !== '') ?? '';
    const name = DECL.exec(after)?.[1] ?? MEMBER.exec(after)?.[1] ?? '(anonymous)';
    const startLine = text.slice(0, m.index).split('\n').length;
    for (let i = 0; i < body.length; i++) {
      if (!/^\s*@example\b/.test(body[i]!)) continue;
      // The fenced block that follows the tag, before the next tag.
      let j = i + 1;
      while (j < body.length && !/^\s*```/.test(body[j]!) && !/^\s*@\w/.test(body[j]!)) j++;
      if (j >= body.length || !/^\s*```/.test(body[j]!)) {
        throw new Error(`${file}:${startLine + i}: @example of ${name} has no fenced \`\`\`ts code block`);
      }
      const fence = body[j]!.trim();
      if (!/^```(ts|typescript|js|javascript)?$/.test(fence)) throw new Error(`${file}:${startLine + j}: unsupported fence ${fence}`);
      let k = j + 1;
      while (k < body.length && !/^\s*```\s*$/.test(body[k]!)) k++;
      if (k >= body.length) throw new Error(`${file}:${startLine + j}: unclosed code block in the @example of ${name}`);
      out.push({ file, line: startLine + i, name, code: body.slice(j + 1, k).join('\n') });
      i = k;
    }
  }
  return out;
}

function parsesAsExpression(text: string): boolean {
  const sf = ts.createSourceFile('literal.ts', `(${text}\n);`, ts.ScriptTarget.ES2022, true, ts.ScriptKind.TS);
  const diagnostics = (sf as unknown as { parseDiagnostics: unknown[] }).parseDiagnostics;
  return diagnostics.length === 0;
}

/**
 * Rewrites each `expression;` followed by a `//=> literal` line into
 * `__check((expression), (literal), n);` and transpiles the result to CommonJS.
 */
export function compileExample(ex: Example): CompiledExample {
  const code = ex.code;
  const sf = ts.createSourceFile('example.ts', code, ts.ScriptTarget.ES2022, true, ts.ScriptKind.TS);
  const statements: ts.ExpressionStatement[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isExpressionStatement(node)) statements.push(node);
    ts.forEachChild(node, visit);
  };
  visit(sf);
  // The //=> lines, with literals that may continue on following comment lines.
  const lines = code.split('\n');
  const offsets: number[] = [];
  let offset = 0;
  for (const l of lines) {
    offsets.push(offset);
    offset += l.length + 1;
  }
  const edits: { start: number; end: number; text: string }[] = [];
  let checks = 0;
  for (let i = 0; i < lines.length; i++) {
    const m = /^(\s*)\/\/=>\s?(.*)$/.exec(lines[i]!);
    if (!m) {
      if (lines[i]!.includes('//=>')) throw new Error(`${ex.file}:${ex.line}: put //=> on its own line after the expression: ${lines[i]!.trim()}`);
      continue;
    }
    let literal = m[2]!.replace(/;\s*$/, '');
    let last = i;
    while (!parsesAsExpression(literal) && last + 1 < lines.length) {
      const more = /^\s*\/\/(?!=>)\s?(.*)$/.exec(lines[last + 1]!);
      if (!more) break;
      literal += '\n' + more[1];
      last++;
    }
    if (!parsesAsExpression(literal)) throw new Error(`${ex.file}:${ex.line}: //=> ${literal} is not a JS literal`);
    const at = offsets[i]!;
    const before = statements
      .filter((s) => s.end <= at && code.slice(s.end, at).trim() === '')
      .sort((a, b) => b.end - a.end)[0];
    if (!before) throw new Error(`${ex.file}:${ex.line}: //=> ${literal} does not follow an expression statement`);
    edits.push({ start: before.getStart(sf), end: before.end, text: `__check((${before.expression.getText(sf)}), (${literal}), ${checks});` });
    checks++;
    i = last;
  }
  let rewritten = code;
  for (const e of edits.sort((a, b) => b.start - a.start)) rewritten = rewritten.slice(0, e.start) + e.text + rewritten.slice(e.end);
  const js = ts.transpileModule(rewritten, {
    compilerOptions: { module: ts.ModuleKind.CommonJS, target: ts.ScriptTarget.ES2022, esModuleInterop: false, isolatedModules: true },
    reportDiagnostics: false,
  }).outputText;
  return { js, checks };
}

/** The fenced ```ts blocks of a Markdown guide, as examples. */
export function examplesOfMarkdown(path: string): Example[] {
  const text = readFileSync(path, 'utf8');
  const file = relative(repoRoot, path);
  const out: Example[] = [];
  const fence = /^```(ts|typescript)\s*\n([\s\S]*?)^```\s*$/gm;
  for (let m = fence.exec(text); m; m = fence.exec(text)) {
    out.push({ file, line: text.slice(0, m.index).split('\n').length, name: 'guide', code: m[2]!.replace(/\n$/, '') });
  }
  return out;
}
