#!/usr/bin/env node
// Generates the bound entries src/entries/{rational,decimal,float}.gen.ts from the
// generic entry src/index.ts, with the TypeScript compiler API:
//   - every exported function whose first parameter is typed `Arithmetic<T>` or
//     `Arithmetic<T, E>` (T, E type parameters of the function) gets a bound wrapper with
//     that argument dropped, typed by an instantiation expression
//     (`typeof g.f<Rational, true>` minus its first parameter);
//   - every other public export (constants, classes, types, functions taking something
//     else first) is re-exported unchanged;
//   - exports tagged @internal are left out, as in the API reference;
//   - the uncertainty functions (`uncertain` and every function taking an `UncertainArithmetic`
//     first: `measured`, `budget`, …) are left out: a bound entry's solvers compute in its one
//     arithmetic and cannot take uncertain values, so budgets come from the generic entry with
//     `uncertain(base)`.
// Usage: node scripts/gen-bound.mjs          writes the three files
//        node scripts/gen-bound.mjs --check  exits 1 when a committed file is out of date
import ts from 'typescript';
import { readFileSync, writeFileSync, existsSync } from 'node:fs';
import { dirname, resolve, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const src = resolve(root, 'src');
const indexFile = resolve(src, 'index.ts');
const typesFile = resolve(src, 'arithmetic/types.ts');
const uncertainFile = resolve(src, 'arithmetic/uncertain.ts');

/** The three bound entries: how each fixes the arithmetic. */
const ENTRIES = [
  {
    file: 'entries/rational.gen.ts',
    dist: 'rational',
    module: 'quadspread/rational',
    kind: 'rational',
    said: 'the exact `rational` arithmetic',
    inputs: "numbers, numeric text (`'1/3'`, `'0.1'`) or rationals",
    value: 'Rational',
    valueDoc: 'a fraction.js `Fraction` ({@link g.Rational | Rational})',
    exact: 'true',
    header: [
      "import { rational } from '../arithmetic/rational.js';",
      "import type { Rational, RationalArithmetic } from '../arithmetic/rational.js';",
    ],
    arithmetic: [
      '/** The bound arithmetic: {@link g.rational | rational} (exact; values are fraction.js fractions). */',
      'export const arithmetic: RationalArithmetic = rational;',
    ],
    example: [
      "import { arithmetic, point, quadrance, solveTriangle, heightFromSight } from 'quadspread/rational';",
      "arithmetic.toString(quadrance(point('1/2', 0), point(0, 2)));",
      "//=> '17/4'",
      '// two sides (quadrances 25 and 16) and the spread 1/2 between them: two triangles, exact surds',
      "solveTriangle({ Q1: 25, Q2: 16, s3: '1/2' }).map((t) => t.Q3.toString());",
      "//=> ['41 - 20√2', '41 + 20√2']",
      '// a sight over a horizontal quadrance of 22500 m² at vertical spread 1/3: H and h = √H',
      "const r = heightFromSight({ horizontalQuadrance: 22500, vertical: '1/3' });",
      '[arithmetic.toString(r.H), r.height.toString(), r.height.toPrecision(8)];',
      "//=> ['11250', '75√2', '106.06602']",
    ],
  },
  {
    file: 'entries/decimal.gen.ts',
    dist: 'decimal',
    module: 'quadspread/decimal',
    kind: 'decimal(34)',
    said: 'a `decimal(34)` arithmetic (34 significant digits, IEEE 754 decimal128 precision)',
    inputs: 'numbers, numeric text or big.js values of this arithmetic',
    value: 'Decimal',
    valueDoc: 'a big.js `Big` ({@link g.Decimal | Decimal})',
    exact: 'false',
    header: [
      "import { decimal } from '../arithmetic/decimal.js';",
      "import type { Decimal, DecimalArithmetic } from '../arithmetic/decimal.js';",
    ],
    arithmetic: [
      '/** The bound arithmetic: {@link g.decimal | decimal(34)} (34 significant digits, ties to even; IEEE 754 decimal128 precision). */',
      'export const arithmetic: DecimalArithmetic = /* @__PURE__ */ decimal(34);',
    ],
    example: [
      "import { arithmetic, point, quadrance, inverse } from 'quadspread/decimal';",
      "arithmetic.toString(quadrance(point('0.1', 0), point(0, '0.2')));",
      "//=> '0.05'",
      '// bearing and distance between two points, to 34 significant digits',
      'const i = inverse({ x: 0, y: 0 }, { x: 30, y: 40 });',
      '[arithmetic.toString(i.distance), arithmetic.toString(i.azimuth), i.quadrant];',
      "//=> ['50', '36.86989764584402129685561255909342', 'N 36°52\\'11.6\" E']",
    ],
  },
  {
    file: 'entries/float.gen.ts',
    dist: 'float',
    module: 'quadspread/float',
    kind: 'float',
    said: 'the `float` arithmetic (JS numbers)',
    inputs: 'numbers or numeric text',
    value: 'number',
    valueDoc: 'a JS number',
    exact: 'false',
    header: [
      "import { float } from '../arithmetic/float.js';",
      "import type { FloatArithmetic } from '../arithmetic/float.js';",
    ],
    arithmetic: [
      '/** The bound arithmetic: {@link g.float | float} (JS numbers; NaN and ±Infinity refused). */',
      'export const arithmetic: FloatArithmetic = float;',
    ],
    example: [
      "import { point, quadrance, inverse, heightFromSight } from 'quadspread/float';",
      'quadrance(point(0, 0), point(3, 4));',
      '//=> 25',
      'const i = inverse({ x: 0, y: 0 }, { x: 30, y: 40 });',
      '[i.distance, i.quadrance];',
      '//=> [50, 2500]',
      '// a sight over 150 m (quadrance 22500 m²) at vertical spread 1/2 (45°)',
      'heightFromSight({ horizontalQuadrance: 22500, vertical: 0.5 });',
      '//=> { H: 22500, height: 150, sign: 1 }',
    ],
  },
];

/**
 * How to get an uncertainty budget (shown in every bound entry, which does not export the
 * uncertainty functions): the generic entry with `uncertain(float)`.
 */
const BUDGET_EXAMPLE = [
  '// budgets: the generic entry with an uncertain arithmetic over the base, here float',
  "import { uncertain, float, measured, heightFromSight, budget } from 'quadspread';",
  'const U = uncertain(float);',
  "const Q = measured(U, 22500, 3, 'Q'); // horizontal quadrance, m², σ 3 m² (150 m ± 0.01 m)",
  "const R = measured(U, 0.5, 0.0001, 'R'); // vertical spread, σ 0.0001",
  'const r = heightFromSight(U, { horizontalQuadrance: Q, vertical: R });',
  '// var H = (R/(1 − R))²·3² + (Q/(1 − R)²)²·0.0001² = 9 + 81',
  '[r.H.value, budget(U, r.H).variance];',
  '//=> [22500, 90]',
];

function fail(message) {
  throw new Error(`gen-bound: ${message}`);
}

function loadProgram() {
  const configPath = resolve(root, 'tsconfig.json');
  const config = ts.readConfigFile(configPath, ts.sys.readFile);
  if (config.error) fail(ts.flattenDiagnosticMessageText(config.error.messageText, '\n'));
  const parsed = ts.parseJsonConfigFileContent(config.config, ts.sys, root);
  // Only the generic entry and what it imports: the bound files themselves are not read.
  return ts.createProgram([indexFile], { ...parsed.options, noEmit: true });
}

/** Whether a function declaration takes an `UncertainArithmetic` first. */
function takesUncertainFirst(checker, uncertainSymbol, decl) {
  const fn = ts.isFunctionDeclaration(decl) ? decl : undefined;
  const type = fn?.parameters[0]?.type;
  if (!type || !ts.isTypeReferenceNode(type)) return false;
  let sym = checker.getSymbolAtLocation(type.typeName);
  if (sym && sym.flags & ts.SymbolFlags.Alias) sym = checker.getAliasedSymbol(sym);
  return sym === uncertainSymbol;
}

function isInternal(decl) {
  return ts.getJSDocTags(decl).some((t) => t.tagName.text === 'internal');
}

/** The name of a parameter for the wrapper: its identifier, or argN for a pattern. */
function paramName(p, i) {
  const name = ts.isIdentifier(p.name) ? p.name.text : `arg${i}`;
  // Names the wrapper itself uses must not be shadowed.
  return name === 'g' || name === 'arithmetic' ? `${name}_` : name;
}

/**
 * If `decl` is a function whose first parameter is `Arithmetic<T>` / `Arithmetic<T, E>`
 * with T (and E) type parameters of the function, how to bind it; otherwise undefined.
 */
function bindingOf(checker, arithmeticSymbol, decl) {
  const fn = ts.isFunctionDeclaration(decl)
    ? decl
    : ts.isVariableDeclaration(decl) &&
        decl.initializer &&
        (ts.isArrowFunction(decl.initializer) || ts.isFunctionExpression(decl.initializer))
      ? decl.initializer
      : undefined;
  if (!fn || fn.parameters.length === 0) return undefined;
  const first = fn.parameters[0];
  const type = first.type;
  if (!type || !ts.isTypeReferenceNode(type)) return undefined;
  let sym = checker.getSymbolAtLocation(type.typeName);
  if (sym && sym.flags & ts.SymbolFlags.Alias) sym = checker.getAliasedSymbol(sym);
  if (sym !== arithmeticSymbol) return undefined;
  const typeParams = (fn.typeParameters ?? []).map((t) => t.name.text);
  const args = (type.typeArguments ?? []).map((a) =>
    ts.isTypeReferenceNode(a) && ts.isIdentifier(a.typeName) ? a.typeName.text : a.getText(),
  );
  const valueParam = args[0];
  const exactParam = args[1];
  if (!valueParam || !typeParams.includes(valueParam)) return undefined;
  // Type arguments for the instantiation expression, one per type parameter.
  const typeArgs = [];
  for (const t of typeParams) {
    if (t === valueParam) typeArgs.push('VALUE');
    else if (t === exactParam) typeArgs.push('EXACT');
    else return { loose: true, fn };
  }
  return { loose: false, fn, typeArgs };
}

export function collect() {
  const program = loadProgram();
  const checker = program.getTypeChecker();
  const index = program.getSourceFile(indexFile);
  const types = program.getSourceFile(typesFile);
  if (!index || !types) fail('cannot read src/index.ts or src/arithmetic/types.ts');
  const arithmeticSymbol = checker.getSymbolAtLocation(types).exports.get('Arithmetic');
  if (!arithmeticSymbol) fail('src/arithmetic/types.ts exports no Arithmetic');
  const uncertainSource = program.getSourceFile(uncertainFile);
  const uncertainSymbol = uncertainSource
    ? checker.getSymbolAtLocation(uncertainSource)?.exports.get('UncertainArithmetic')
    : undefined;
  if (!uncertainSymbol) fail('src/arithmetic/uncertain.ts exports no UncertainArithmetic');
  const moduleSymbol = checker.getSymbolAtLocation(index);
  const omitted = [];
  const bound = [];
  const values = [];
  const typesOnly = [];
  for (const exp of checker.getExportsOfModule(moduleSymbol)) {
    const name = exp.name;
    if (name === 'arithmetic' || name === 'Value' || name === 'Bound')
      fail(`src/index.ts exports ${name}, a name the bound entries define themselves`);
    const target = exp.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exp) : exp;
    const decls = target.declarations ?? [];
    if (decls.length === 0) fail(`${name}: no declaration`);
    if (decls.every(isInternal)) continue;
    if (
      name === 'uncertain' ||
      decls.some((d) => takesUncertainFirst(checker, uncertainSymbol, d))
    ) {
      omitted.push(name);
      continue;
    }
    const isValue = (target.flags & ts.SymbolFlags.Value) !== 0;
    if (!isValue) {
      typesOnly.push(name);
      continue;
    }
    const valueDecls = decls.filter(
      (d) => ts.isFunctionDeclaration(d) || ts.isVariableDeclaration(d),
    );
    const implementations = valueDecls.filter((d) => !ts.isFunctionDeclaration(d) || d.body);
    const signatures = valueDecls.filter((d) => ts.isFunctionDeclaration(d) && !d.body);
    const chosen = signatures.length > 0 ? signatures : implementations;
    const bindings = chosen.map((d) => bindingOf(checker, arithmeticSymbol, d));
    if (bindings.length > 0 && bindings.every(Boolean)) {
      if (bindings.length > 1 || bindings[0].loose) {
        console.warn(
          `gen-bound: ${name} is overloaded or has extra type parameters: its bound type is approximate`,
        );
        bound.push({ name, loose: true, params: bindings[0].fn.parameters.slice(1) });
      } else {
        bound.push({
          name,
          loose: false,
          typeArgs: bindings[0].typeArgs,
          params: bindings[0].fn.parameters.slice(1),
        });
      }
      // A type of the same name would be lost behind the bound value.
      if (target.flags & ts.SymbolFlags.Type && !(target.flags & ts.SymbolFlags.Function))
        fail(`${name}: a type and a bound function share the name`);
    } else {
      values.push(name);
    }
  }
  const byName = (a, b) => (a.name ?? a).localeCompare(b.name ?? b);
  return {
    bound: bound.sort(byName),
    values: values.sort(byName),
    typesOnly: typesOnly.sort(byName),
    omitted: omitted.sort(byName),
  };
}

function wrap(lines, width = 96) {
  // Wraps a list of names into `export { … }` lines.
  const out = [];
  let line = ' ';
  for (const n of lines) {
    const piece = ` ${n},`;
    if (line.length + piece.length > width) {
      out.push(line);
      line = ' ';
    }
    line += piece;
  }
  if (line.trim()) out.push(line);
  return out;
}

function render(entry, { bound, values, typesOnly, omitted }) {
  const A = 'arithmetic';
  const L = [];
  L.push('// GENERATED by scripts/gen-bound.mjs from src/index.ts: do not edit by hand.');
  L.push(
    '// Regenerate with `npm run gen:bound` (or `npm run build`); a test fails when it is stale.',
  );
  L.push(
    `// Built as dist/${entry.dist}.js and dist/${entry.dist}.cjs (the package's ${entry.module}).`,
  );
  L.push('/**');
  L.push(
    ` * ${entry.module} — the bound entry: every function of the generic entry \`quadspread\``,
  );
  L.push(` * with ${entry.said} fixed, so the arithmetic argument is dropped.`);
  L.push(
    ` * Inputs may be ${entry.inputs}; results are values of {@link arithmetic}. The geometry`,
  );
  L.push(
    ' * primitives that take points, vectors or lines (`quadrance`, `vectorQuadrance`, `spread`,',
  );
  L.push(
    ' * `cross`, `spreadOfVectors`, `triangle`, the line functions) take values made by `point`',
  );
  L.push(
    " * (or arrays `[x, y]` of the arithmetic's values) and `line`/`lineThrough`, as the arithmetic's",
  );
  L.push(
    ' * own operations take its values; the solvers read `{ x, y }` or `[x, y]` of numbers or text.',
  );
  L.push(
    ' * Everything else (constants, classes, types, the other arithmetics) is re-exported unchanged,',
  );
  L.push(
    " * except the uncertainty functions: this entry's solvers compute in its one arithmetic and",
  );
  L.push(
    ' * cannot take uncertain values, so for budgets use the generic entry with `uncertain(base)`',
  );
  const names = omitted.map((n) => '`' + n + '`').join(', ');
  const words = `(not exported here: ${names}).`.split(' ');
  let line = ' *';
  for (const w of words) {
    if (line.length + w.length + 1 > 96) {
      L.push(line);
      line = ' *';
    }
    line += ` ${w}`;
  }
  L.push(line);
  L.push(' *');
  L.push(' * @example');
  L.push(' * ```ts');
  for (const e of entry.example) L.push(` * ${e}`);
  L.push(' * ```');
  L.push(' *');
  L.push(' * @example');
  L.push(' * ```ts');
  for (const e of BUDGET_EXAMPLE) L.push(` * ${e}`);
  L.push(' * ```');
  L.push(' *');
  L.push(` * @module ${entry.module}`);
  L.push(' */');
  L.push("import * as g from '../index.js';");
  L.push(...entry.header);
  L.push('');
  L.push(`/** The type of values of this entry's arithmetic: ${entry.valueDoc}. */`);
  L.push(`export type Value = ${entry.value};`);
  L.push(
    '/** The type of a bound function: the generic function type `F` with its first (arithmetic) parameter dropped. */',
  );
  L.push(
    'export type Bound<F> = F extends (A: never, ...rest: infer P) => infer R ? (...rest: P) => R : never;',
  );
  L.push('');
  L.push(...entry.arithmetic);
  for (const b of bound) {
    const params = b.params.map((p, i) => (p.dotDotDotToken ? '...' : '') + paramName(p, i + 1));
    const call = [
      A,
      ...b.params.map((p, i) => (p.dotDotDotToken ? '...' : '') + paramName(p, i + 1)),
    ].join(', ');
    // The same type arguments in the call, so that inference cannot widen T from the inputs.
    const targs = b.loose
      ? ''
      : `<${b.typeArgs.map((t) => (t === 'VALUE' ? 'Value' : entry.exact)).join(', ')}>`;
    const type = `Bound<typeof g.${b.name}${targs}>`;
    L.push('');
    L.push(
      `/** {@link g.${b.name} | ${b.name}} with the arithmetic fixed to \`${entry.kind}\`: the same arguments after the arithmetic. @function */`,
    );
    L.push(
      `export const ${b.name}: ${type} = (${params.join(', ')}) => g.${b.name}${targs}(${call});`,
    );
  }
  if (values.length > 0) {
    L.push('');
    L.push('export {');
    L.push(...wrap(values));
    L.push("} from '../index.js';");
  }
  if (typesOnly.length > 0) {
    L.push('export type {');
    L.push(...wrap(typesOnly));
    L.push("} from '../index.js';");
  }
  return L.join('\n') + '\n';
}

/** Writes (or with `check`, compares) the three files; returns the stale ones. */
export function generate({ check = false } = {}) {
  const api = collect();
  const stale = [];
  for (const entry of ENTRIES) {
    const path = resolve(src, entry.file);
    const text = render(entry, api);
    const old = existsSync(path) ? readFileSync(path, 'utf8') : '';
    if (old === text) continue;
    stale.push(relative(root, path));
    if (!check) writeFileSync(path, text);
  }
  return { api, stale };
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const check = process.argv.includes('--check');
  const { api, stale } = generate({ check });
  if (check && stale.length > 0) {
    console.error(
      `gen-bound: out of date: ${stale.join(', ')}. Run \`npm run gen:bound\` and commit them.`,
    );
    process.exit(1);
  }
  console.log(
    `gen-bound: ${api.bound.length} bound functions, ${api.values.length} values and ${api.typesOnly.length} types re-exported${check ? ' (up to date)' : stale.length ? ` (wrote ${stale.join(', ')})` : ''}`,
  );
}
