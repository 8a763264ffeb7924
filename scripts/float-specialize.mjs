/**
 * float-specialize — an esbuild plugin (used by tsup for the `quadspread/float` entry) that
 * compiles the one generic source into a float-specialised copy.
 *
 * Why: generic code calling `A.add(x, y)` through an arithmetic object runs as fast as
 * hand-written float code only while V8 can inline every call; in a real solver several calls
 * deep, the inlining budget runs out and each operation becomes a call that boxes its doubles
 * (see docs/performance.md). This plugin removes those calls for the float bundle only.
 *
 * What it does, for every module reached from the float entry (and only those — the modules of
 * the other entries are loaded again, untouched, in esbuild's normal namespace):
 *  - each top-level `function f(A: …Arithmetic…, …) { body }` becomes
 *      function f(A, …) { if (A !== float) return f$qsGeneric(A, …); body' }
 *      function f$qsGeneric(A, …) { body }          // the original, unchanged
 *    where body' has, for that `A`: `A.add(x, y)` → `((x) + (y))`, `A.sub` → `-`, `A.mul` →
 *    `*`, `A.neg(x)` → `(-(x))`, `A.isZero(x)` → `((x) === 0)`, `A.eq(x, y)` → `===`,
 *    `A.is(x)` → a finite-number test, `checkArithmetic(A, …)` → nothing (A is float there),
 *    `A.cmp(x, y) > 0` → `x > y` and `A.cmp(x, y) < 0` → `x < y`, `if (A.kernels) { … }` → nothing,
 *    `A.abs(x)` → `Math.abs(x)`, `A.zero` → `0`, `A.one` → `1`, `A.digits` → `15`, `A.float64` →
 *    `true`, `A.exact` → `false`, `A.pi` → `Math.PI`, `A.kernels`, `A.ratio`, `A.withDigits`,
 *    `A.approximate` → `undefined`
 *    (float has none), and `A.div`, `A.sqrt`,
 *    `A.cmp`, `A.sign`, `A.from`, `A.sin`, `A.cos`, `A.exp`, `A.log`, `A.atan2` → tiny helpers with exactly the float arithmetic's checks
 *    (a zero divisor or a negative root still throws the same QuadspreadError).
 *  - Every other use of `A` (toNumber, toString, kernels, passing A on) is left as it is.
 * The rewrite reproduces `float`'s own definitions operation by operation, so results are
 * bit-for-bit those of the generic code with `float` (test/perf/float-specialize.test.ts checks
 * this), and any other arithmetic that reaches the float bundle takes the untouched copy.
 *
 * @module scripts/float-specialize
 */
import { readFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const NS = 'qs-float';
const HELPERS = 'qs-float-helpers';

/** Operations rewritten inline; `p` wraps an argument in parentheses. */
const p = (s) => `(${s})`;
const OPS = {
  add: [2, (a, b) => `(${p(a)} + ${p(b)})`],
  sub: [2, (a, b) => `(${p(a)} - ${p(b)})`],
  mul: [2, (a, b) => `(${p(a)} * ${p(b)})`],
  neg: [1, (a) => `(-${p(a)})`],
  isZero: [1, (a) => `(${p(a)} === 0)`],
  eq: [2, (a, b) => `(${p(a)} === ${p(b)})`],
  abs: [1, (a) => `Math.abs(${a})`],
  div: [2, (a, b) => `__qsDiv(${a}, ${b})`],
  sqrt: [1, (a) => `__qsSqrt(${a})`],
  cmp: [2, (a, b) => `__qsCmp(${a}, ${b})`],
  sign: [1, (a) => `__qsSign(${a})`],
  from: [1, (a) => `__qsFrom(${a})`],
  sin: [1, (a) => `__qsSin(${a})`],
  cos: [1, (a) => `__qsCos(${a})`],
  exp: [1, (a) => `__qsExp(${a})`],
  log: [1, (a) => `__qsLog(${a})`],
  atan2: [2, (a, b) => `__qsAtan2(${a}, ${b})`],
  is: [1, (a) => `__qsIs(${a})`],
};
// float has no fused kernels: `A.kernels` is `undefined` in the float copy. Parenthesised so
// that `A.zero.toFixed(1)` stays valid code.
const CONSTANTS = {
  zero: '(0)',
  one: '(1)',
  kernels: '(void 0)',
  digits: '(15)',
  float64: '(true)',
  exact: '(false)',
  approximate: '(void 0)',
  ratio: '(void 0)',
  withDigits: '(void 0)',
  pi: '(Math.PI)',
};
/** The rewrite for the name `k`, own keys only (`A.toString`, `A.constructor` are left alone). */
const own = (table, k) => (Object.hasOwn(table, k) ? table[k] : undefined);

/** The helpers: each is exactly the float arithmetic's operation (src/arithmetic/float.ts). */
const HELPER_SOURCE = `import { float as __qsFloat } from './arithmetic/float.js';
import { floatSin as __qsFloatSin, floatCos as __qsFloatCos } from './arithmetic/float-trig.js';
export { __qsFloat };
export const __qsDiv = (a, b) => { const r = a / b; return r - r === 0 ? r : __qsFloat.div(a, b); };
export const __qsSqrt = (a) => { const r = Math.sqrt(a); return r - r === 0 ? r : __qsFloat.sqrt(a); };
export const __qsCmp = (a, b) => (a < b ? -1 : a > b ? 1 : 0);
export const __qsSign = (a) => (a < 0 ? -1 : a > 0 ? 1 : 0);
export const __qsFrom = (x) => (typeof x === 'number' && x - x === 0 ? x : __qsFloat.from(x));
// The transcendental functions: on finite input with a finite result what float computes there
// (sin and cos: FDLIBM's kernels below π/4, src/arithmetic/float-trig.ts, and Math's past it;
// the others: Math's), float's own operation (with its checks) for anything else.
export const __qsSin = (x) => (x - x === 0 ? __qsFloatSin(x) : __qsFloat.sin(x));
export const __qsCos = (x) => (x - x === 0 ? __qsFloatCos(x) : __qsFloat.cos(x));
export const __qsExp = (x) => { const r = Math.exp(x); return r - r === 0 && x - x === 0 ? r : __qsFloat.exp(x); };
export const __qsLog = (x) => (x > 0 && x < Infinity ? Math.log(x) : __qsFloat.log(x));
export const __qsAtan2 = (y, x) => (y - y === 0 && x - x === 0 && (y !== 0 || x !== 0) ? Math.atan2(y, x) : __qsFloat.atan2(y, x));
export const __qsIs = (x) => typeof x === 'number' && x - x === 0;
`;
const HELPER_IMPORT = `import { __qsFloat, __qsDiv, __qsSqrt, __qsCmp, __qsSign, __qsFrom, __qsSin, __qsCos, __qsExp, __qsLog, __qsAtan2, __qsIs } from '${HELPERS}';\n`;

function isFunctionLike(node) {
  // Functions, arrows, methods, constructors, getters and setters: anything with parameters.
  return ts.isFunctionLike(node) && Array.isArray(node.parameters);
}

/** Whether the identifier `name` occurs anywhere in `node` (conservative). */
function mentions(node, name) {
  let found = false;
  const visit = (n) => {
    if (found) return;
    if (ts.isIdentifier(n) && n.text === name) found = true;
    else ts.forEachChild(n, visit);
  };
  visit(node);
  return found;
}

/** Whether `node` uses `this` or `arguments` (then the generic copy gets them as they came). */
function usesCallContext(node) {
  let found = false;
  const visit = (n) => {
    if (found) return;
    if (n.kind === ts.SyntaxKind.ThisKeyword || (ts.isIdentifier(n) && n.text === 'arguments'))
      found = true;
    else ts.forEachChild(n, visit);
  };
  visit(node);
  return found;
}

function isArithmeticParam(param, sf) {
  if (!param || !ts.isIdentifier(param.name) || param.dotDotDotToken) return false;
  const type = param.type ? param.type.getText(sf) : '';
  return /Arithmetic\b/.test(type) && !/Uncertain/.test(type);
}

const ASSIGN = new Set([
  ts.SyntaxKind.EqualsToken,
  ts.SyntaxKind.PlusEqualsToken,
  ts.SyntaxKind.MinusEqualsToken,
  ts.SyntaxKind.AsteriskEqualsToken,
  ts.SyntaxKind.SlashEqualsToken,
  ts.SyntaxKind.BarBarEqualsToken,
  ts.SyntaxKind.AmpersandAmpersandEqualsToken,
  ts.SyntaxKind.QuestionQuestionEqualsToken,
]);

/** Whether `name` is assigned, or declared again (other than as a nested function's parameter), inside `node`. */
function rebindsName(node, name) {
  let found = false;
  const visit = (n) => {
    if (found) return;
    if (
      ts.isBinaryExpression(n) &&
      ASSIGN.has(n.operatorToken.kind) &&
      ts.isIdentifier(n.left) &&
      n.left.text === name
    )
      found = true;
    // Destructuring assignment ([A] = …, ({ A } = …)) and for (A of …) / for (A in …).
    else if (
      ts.isBinaryExpression(n) &&
      n.operatorToken.kind === ts.SyntaxKind.EqualsToken &&
      (ts.isArrayLiteralExpression(n.left) || ts.isObjectLiteralExpression(n.left)) &&
      mentions(n.left, name)
    )
      found = true;
    else if (
      (ts.isForOfStatement(n) || ts.isForInStatement(n)) &&
      !ts.isVariableDeclarationList(n.initializer) &&
      mentions(n.initializer, name)
    )
      found = true;
    else if (
      (ts.isPrefixUnaryExpression(n) || ts.isPostfixUnaryExpression(n)) &&
      ts.isIdentifier(n.operand) &&
      n.operand.text === name
    )
      found = true;
    else if (
      (ts.isVariableDeclaration(n) || ts.isFunctionDeclaration(n) || ts.isClassDeclaration(n)) &&
      n.name &&
      ts.isIdentifier(n.name) &&
      n.name.text === name
    )
      found = true;
    else if (
      (ts.isVariableDeclaration(n) || ts.isParameter(n)) &&
      n.name &&
      !ts.isIdentifier(n.name) &&
      n.name.getText().match(new RegExp(`\\b${name}\\b`))
    )
      found = true;
    else ts.forEachChild(n, visit);
  };
  visit(node);
  return found;
}

/**
 * Rewrites one TypeScript module's text. Returns `{ code, functions }`, where `functions`
 * names the functions specialised (an empty list leaves the code as it was).
 * @param {string} code
 * @param {string} fileName
 */
export function specializeSource(code, fileName = 'module.ts') {
  const sf = ts.createSourceFile(fileName, code, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const edits = [];
  const functions = [];

  for (const st of sf.statements) {
    if (!ts.isFunctionDeclaration(st) || !st.body || !st.name || st.asteriskToken) continue;
    if (st.modifiers?.some((m) => m.kind === ts.SyntaxKind.AsyncKeyword)) continue;
    const param = st.parameters[0];
    if (!isArithmeticParam(param, sf)) continue;
    const a = param.name.text;
    if (rebindsName(st.body, a)) continue; // `A` reassigned or redeclared inside: leave the function alone
    let changed = false;

    const emit = (node) => {
      const r = replace(node);
      if (r !== undefined) {
        changed = true;
        return r;
      }
      let out = '';
      let pos = node.getStart(sf);
      ts.forEachChild(node, (child) => {
        const start = child.getStart(sf);
        out += code.slice(pos, start) + emit(child);
        pos = child.end;
      });
      return out + code.slice(pos, node.end);
    };

    const replace = (node) => {
      // A nested function that declares its own `A` shadows ours: leave it alone.
      if (
        isFunctionLike(node) &&
        node.parameters.some((q) => ts.isIdentifier(q.name) && q.name.text === a)
      ) {
        return node.getText(sf);
      }
      // checkArithmetic(A, …) where A is float (the guard above the body) has nothing to check.
      if (
        ts.isCallExpression(node) &&
        ts.isIdentifier(node.expression) &&
        node.expression.text === 'checkArithmetic' &&
        node.arguments.length >= 1 &&
        ts.isIdentifier(node.arguments[0]) &&
        node.arguments[0].text === a
      ) {
        return '(void 0)';
      }
      // `if (A.kernels) { … }` (no else): float has no kernels, the block goes.
      if (
        ts.isIfStatement(node) &&
        !node.elseStatement &&
        ts.isPropertyAccessExpression(node.expression) &&
        ts.isIdentifier(node.expression.expression) &&
        node.expression.expression.text === a &&
        node.expression.name.text === 'kernels'
      ) {
        return ';';
      }
      // A.cmp(x, y) > 0 is x > y, and A.cmp(x, y) < 0 is x < y, for every number (NaN too).
      if (
        ts.isBinaryExpression(node) &&
        (node.operatorToken.kind === ts.SyntaxKind.GreaterThanToken ||
          node.operatorToken.kind === ts.SyntaxKind.LessThanToken) &&
        ts.isNumericLiteral(node.right) &&
        node.right.text === '0' &&
        ts.isCallExpression(node.left) &&
        !node.left.questionDotToken &&
        node.left.arguments.length === 2 &&
        node.left.arguments.every((x) => !ts.isSpreadElement(x)) &&
        ts.isPropertyAccessExpression(node.left.expression) &&
        !node.left.expression.questionDotToken &&
        ts.isIdentifier(node.left.expression.expression) &&
        node.left.expression.expression.text === a &&
        node.left.expression.name.text === 'cmp'
      ) {
        const [x, y] = node.left.arguments.map(emit);
        return `(${p(x)} ${node.operatorToken.getText(sf)} ${p(y)})`;
      }
      if (ts.isCallExpression(node) && ts.isPropertyAccessExpression(node.expression)) {
        const callee = node.expression;
        const op = own(OPS, callee.name.text);
        // A.from(<numeric literal>) is that literal (float.from returns a finite number as is).
        if (
          callee.name.text === 'from' &&
          ts.isIdentifier(callee.expression) &&
          callee.expression.text === a &&
          node.arguments.length === 1 &&
          ts.isNumericLiteral(node.arguments[0]) &&
          Number.isFinite(Number(node.arguments[0].text))
        ) {
          return `(${node.arguments[0].getText(sf)})`;
        }
        if (
          op &&
          ts.isIdentifier(callee.expression) &&
          callee.expression.text === a &&
          !callee.questionDotToken &&
          !node.questionDotToken &&
          !node.typeArguments &&
          node.arguments.length === op[0] &&
          node.arguments.every((x) => !ts.isSpreadElement(x))
        ) {
          return op[1](...node.arguments.map(emit));
        }
      }
      if (
        ts.isPropertyAccessExpression(node) &&
        ts.isIdentifier(node.expression) &&
        node.expression.text === a
      ) {
        const k = own(CONSTANTS, node.name.text);
        const parent = node.parent;
        const isCallee = ts.isCallExpression(parent) && parent.expression === node;
        const isTarget =
          (ts.isBinaryExpression(parent) && parent.left === node) ||
          ts.isDeleteExpression(parent) ||
          ts.isPrefixUnaryExpression(parent) ||
          ts.isPostfixUnaryExpression(parent);
        if (k !== undefined && !isCallee && !isTarget) return k;
      }
      return undefined;
    };

    const body = emit(st.body);
    if (!changed) continue;
    const name = st.name.text;
    const generic = `${name}$qsGeneric`;
    // Forward the parameters by name where they are plain identifiers (cheaper than `arguments`).
    // Where the body reads `this` or `arguments`, forward them unchanged (`arguments.length` and
    // extra arguments would differ otherwise).
    const plain =
      st.parameters.every((q) => ts.isIdentifier(q.name)) &&
      !usesCallContext(st.body) &&
      !st.parameters.some((q) => q.initializer && usesCallContext(q.initializer));
    const forward = plain
      ? `${generic}(${st.parameters.map((q) => (q.dotDotDotToken ? '...' : '') + q.name.text).join(', ')})`
      : `${generic}.apply(this, arguments as any)`;
    const guarded = `{ if (${a} !== __qsFloat) return ${forward};${body.slice(1)}`;
    edits.push({ start: st.body.getStart(sf), end: st.body.end, text: guarded });
    // The untouched original, for any other arithmetic that reaches this bundle.
    edits.push({
      start: st.end,
      end: st.end,
      text: `\nfunction ${generic}${code.slice(st.name.end, st.end)}`,
    });
    functions.push(name);
  }
  if (functions.length === 0) return { code, functions };
  edits.sort((x, y) => y.start - x.start || y.end - x.end);
  let out = code;
  for (const e of edits) out = out.slice(0, e.start) + e.text + out.slice(e.end);
  return { code: HELPER_IMPORT + out, functions };
}

function resolveTs(dir, spec) {
  const full = path.resolve(dir, spec);
  const candidates = [
    full,
    full.replace(/\.js$/, '.ts'),
    `${full}.ts`,
    path.join(full, 'index.ts'),
  ];
  return candidates.find((c) => /\.[cm]?[jt]s$/.test(c) && existsSync(c));
}

/**
 * The esbuild plugin.
 * @param {{ entries?: string[], srcDir?: string, exclude?: RegExp }} [options]
 *   `entries`: absolute paths of the entry files whose module graphs are specialised
 *   (default `<cwd>/src/entries/float.gen.ts`); `srcDir`: the sources' root (default `<cwd>/src`);
 *   `exclude`: modules never rewritten (default: the arithmetics and errors).
 */
export function floatSpecialize(options = {}) {
  const srcDir = options.srcDir ?? path.resolve('src');
  const entries = new Set(
    (options.entries ?? [path.join(srcDir, 'entries', 'float.gen.ts')]).map((e) => path.resolve(e)),
  );
  const exclude = options.exclude ?? /[\\/]src[\\/](arithmetic[\\/]|errors\.ts$)/;
  return {
    name: 'float-specialize',
    setup(build) {
      build.onResolve({ filter: /^qs-float-helpers$/ }, () => ({
        path: 'helpers',
        namespace: HELPERS,
      }));
      build.onResolve({ filter: /^\.\.?\// }, (args) => {
        const inGraph =
          args.namespace === NS ||
          args.namespace === HELPERS ||
          entries.has(path.resolve(args.importer));
        if (!inGraph) return undefined;
        const resolved = resolveTs(args.resolveDir, args.path);
        if (!resolved) return undefined;
        return { path: resolved, namespace: NS };
      });
      build.onLoad({ filter: /.*/, namespace: HELPERS }, () => ({
        contents: HELPER_SOURCE,
        loader: 'js',
        resolveDir: srcDir,
      }));
      build.onLoad({ filter: /.*/, namespace: NS }, async (args) => {
        const code = await readFile(args.path, 'utf8');
        const loader = /\.ts$/.test(args.path) ? 'ts' : 'js';
        const contents =
          loader === 'ts' && !exclude.test(args.path)
            ? specializeSource(code, args.path).code
            : code;
        return { contents, loader, resolveDir: path.dirname(args.path) };
      });
    },
  };
}

export default floatSpecialize;
