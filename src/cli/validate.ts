/**
 * A small validator for the subset of JSON Schema (draft 2020-12) that the job schema
 * uses, written so that every message names the place in the job file, e.g.
 * `tasks[2].readings[1].vertical: "95°" is not a valid elevation angle`.
 *
 * Supported keywords: `type`, `properties`, `required`, `additionalProperties`,
 * `patternProperties`, `items`, `minItems`, `maxItems`, `enum`, `const`, `pattern`,
 * `minLength`, `maxLength`, `minimum`, `maximum`, `exclusiveMinimum`, `oneOf`, `anyOf`,
 * `$ref` (to `#/$defs/...`). Annotations (`title`, `description`, `examples`, `$id`,
 * `$schema`, `$comment`, `default`) are ignored. A `oneOf` whose branches all fix
 * `properties.kind.const` is read as a tagged union: the `kind` picks the branch, so the
 * messages come from that branch only.
 *
 * @module cli
 */
import { show } from '../errors.js';

/** A JSON Schema node (the subset above). */
export type Schema = { [key: string]: unknown };

/** One problem found in a document: where, and what. */
export interface Problem {
  /** The place, as `tasks[2].readings[1].vertical` (empty for the whole document). */
  path: string;
  /** What is wrong, naming the value. */
  message: string;
}

/** Joins a path and a property name: `a.b`, `a[2]`, or `a["odd key"]`. */
export function joinPath(path: string, key: string | number): string {
  if (typeof key === 'number') return `${path}[${key}]`;
  if (/^[A-Za-z_$][\w$-]*$/.test(key)) return path === '' ? key : `${path}.${key}`;
  return `${path}[${JSON.stringify(key)}]`;
}

function typeOf(x: unknown): string {
  if (x === null) return 'null';
  if (Array.isArray(x)) return 'array';
  if (typeof x === 'number') return Number.isInteger(x) ? 'integer' : 'number';
  return typeof x;
}

function typeMatches(x: unknown, t: string): boolean {
  const actual = typeOf(x);
  return actual === t || (t === 'number' && actual === 'integer');
}

const ARTICLE: Record<string, string> = {
  object: 'an object',
  array: 'an array',
  string: 'a string',
  number: 'a number',
  integer: 'an integer',
  boolean: 'true or false',
  null: 'null',
};

function describe(schema: Schema): string | undefined {
  return typeof schema['x-describe'] === 'string' ? schema['x-describe'] : undefined;
}

/**
 * Validates `value` against `schema` (with `root` holding the `$defs`), returning every
 * problem found (empty when valid). Messages put the expectation in plain words; where a
 * schema node has an `x-describe` annotation, that text names what was expected
 * (`"95°" is not a valid elevation angle` comes from the readings, not from here).
 */
export function validate(
  value: unknown,
  schema: Schema,
  root: Schema = schema,
  path = '',
): Problem[] {
  const out: Problem[] = [];
  check(value, schema, root, path, out);
  return out;
}

/** A schema node with its `$ref` followed (to `#/$defs/…` of `root`). */
export function resolve(schema: Schema, root: Schema): Schema {
  let s = schema;
  for (let i = 0; i < 20 && typeof s.$ref === 'string'; i++) {
    const ref = s.$ref as string;
    const m = /^#\/\$defs\/(.+)$/.exec(ref);
    const defs = root.$defs as Record<string, Schema> | undefined;
    const target = m && defs ? defs[m[1]!] : undefined;
    if (!target) throw new Error(`job schema: unknown $ref ${ref}`);
    s = { ...target, ...Object.fromEntries(Object.entries(s).filter(([k]) => k !== '$ref')) };
  }
  return s;
}

/**
 * Checks `x` against one schema node, in three steps a reader can hold in mind: the value's
 * own constraints (`const`, `enum`, `type`), then a union (`oneOf`/`anyOf`, a tagged union by
 * `kind`), then the constraints of its JSON type (string, number, array, object).
 */
function check(x: unknown, schema0: Schema, root: Schema, path: string, out: Problem[]): void {
  const schema = resolve(schema0, root);
  if (!checkValue(x, schema, path, out)) return;
  if (
    (Array.isArray(schema.oneOf) || Array.isArray(schema.anyOf)) &&
    !checkUnion(x, schema, root, path, out)
  )
    return;
  switch (typeOf(x)) {
    case 'string':
      checkString(x as string, schema, path, out);
      break;
    case 'integer':
    case 'number':
      checkNumber(x as number, schema, path, out);
      break;
    case 'array':
      checkArray(x as unknown[], schema, root, path, out);
      break;
    case 'object':
      checkFields(x as Record<string, unknown>, schema, root, path, out);
      break;
    default:
      break;
  }
}

/** `const`, `enum` and `type`: false (after reporting) when the value fails one. */
function checkValue(x: unknown, schema: Schema, where: string, out: Problem[]): boolean {
  if ('const' in schema && JSON.stringify(x) !== JSON.stringify(schema.const)) {
    out.push({ path: where, message: `${show(x)} must be ${JSON.stringify(schema.const)}` });
    return false;
  }
  if (
    Array.isArray(schema.enum) &&
    !schema.enum.some((e) => JSON.stringify(e) === JSON.stringify(x))
  ) {
    out.push({
      path: where,
      message: `${show(x)} is not one of ${schema.enum.map((e) => JSON.stringify(e)).join(', ')}`,
    });
    return false;
  }
  if (schema.type !== undefined) {
    const types = Array.isArray(schema.type) ? (schema.type as string[]) : [schema.type as string];
    if (!types.some((t) => typeMatches(x, t))) {
      const want = describe(schema) ?? types.map((t) => ARTICLE[t] ?? t).join(' or ');
      out.push({ path: where, message: `${show(x)} is not ${want}` });
      return false;
    }
  }
  return true;
}

/**
 * `oneOf` / `anyOf`: a tagged union (every branch has a `kind` const) checks the branch its
 * kind picks; another union reports the branch the value was plainly meant for. Returns false
 * when it has reported (or checked the whole value already).
 */
function checkUnion(
  x: unknown,
  schema: Schema,
  root: Schema,
  path: string,
  out: Problem[],
): boolean {
  const where = path;
  const expected = describe(schema);
  const branches = ((schema.oneOf ?? schema.anyOf) as Schema[]).map((b) => resolve(b, root));
  const kinds = branches.map(
    (b) =>
      ((b.properties as Record<string, Schema> | undefined)?.kind as Schema | undefined)?.const,
  );
  if (kinds.every((k) => typeof k === 'string')) {
    // A tagged union: the kind picks the branch.
    const kind = typeOf(x) === 'object' ? (x as Record<string, unknown>).kind : undefined;
    const i = kinds.indexOf(kind as string);
    if (i < 0) {
      const p = typeOf(x) === 'object' ? joinPath(path, 'kind') : path;
      const what =
        kind === undefined ? 'a task needs a "kind"' : `${show(kind)} is not a known kind`;
      out.push({ path: p, message: `${what} (${(kinds as string[]).join(', ')})` });
      return false;
    }
    check(x, branches[i]!, root, path, out);
    return true;
  }
  const results = branches.map((b) => validate(x, b, root, path));
  const ok = results.filter((r) => r.length === 0).length;
  if (schema.oneOf ? ok === 1 : ok > 0) return true;
  const near = nearest(x, branches, root);
  if (ok > 1) {
    out.push({ path: where, message: `${show(x)} matches more than one form` });
  } else if (near !== undefined) {
    // One form fits the value's type (or its fields) best: report what is wrong with it.
    out.push(...results[near]!);
  } else if (expected) {
    out.push({ path: where, message: `${show(x)} is not ${expected}` });
  } else {
    // Report the branch that got furthest (fewest problems, deepest path).
    const best = results.slice().sort((a, b) => depth(b) - depth(a) || a.length - b.length)[0]!;
    out.push(...best);
  }
  return false;
}

/** `maxLength`, `minLength`, `pattern`. */
function checkString(s: string, schema: Schema, where: string, out: Problem[]): void {
  if (typeof schema.maxLength === 'number' && s.length > schema.maxLength) {
    out.push({ path: where, message: `${show(s)} is longer than ${schema.maxLength} characters` });
  } else if (typeof schema.minLength === 'number' && s.length < schema.minLength) {
    out.push({ path: where, message: `${show(s)} is shorter than ${schema.minLength} characters` });
  } else if (typeof schema.pattern === 'string' && !new RegExp(schema.pattern, 'u').test(s)) {
    const expected = describe(schema);
    out.push({
      path: where,
      message: `${show(s)} is not ${expected ?? `text of the form ${schema.pattern}`}`,
    });
  }
}

/** `minimum`, `maximum`, `exclusiveMinimum`. */
function checkNumber(n: number, schema: Schema, where: string, out: Problem[]): void {
  if (typeof schema.minimum === 'number' && n < schema.minimum)
    out.push({ path: where, message: `${n} is below the minimum ${schema.minimum}` });
  if (typeof schema.maximum === 'number' && n > schema.maximum)
    out.push({ path: where, message: `${n} is above the maximum ${schema.maximum}` });
  if (typeof schema.exclusiveMinimum === 'number' && n <= schema.exclusiveMinimum)
    out.push({ path: where, message: `${n} must be greater than ${schema.exclusiveMinimum}` });
}

/** `minItems`, `maxItems`, then each item against `items`. */
function checkArray(
  a: unknown[],
  schema: Schema,
  root: Schema,
  path: string,
  out: Problem[],
): void {
  if (typeof schema.minItems === 'number' && a.length < schema.minItems) {
    out.push({
      path,
      message: `has ${a.length} item${a.length === 1 ? '' : 's'}; at least ${schema.minItems} needed`,
    });
  }
  if (typeof schema.maxItems === 'number' && a.length > schema.maxItems) {
    out.push({ path, message: `has ${a.length} items; at most ${schema.maxItems} allowed` });
  }
  if (schema.items && typeof schema.items === 'object') {
    a.forEach((item, i) => check(item, schema.items as Schema, root, joinPath(path, i), out));
  }
}

/** `required`, then each field against `properties`, `patternProperties` or `additionalProperties`. */
function checkFields(
  o: Record<string, unknown>,
  schema: Schema,
  root: Schema,
  path: string,
  out: Problem[],
): void {
  const props = (schema.properties ?? {}) as Record<string, Schema>;
  const patterns = (schema.patternProperties ?? {}) as Record<string, Schema>;
  for (const key of (schema.required ?? []) as string[]) {
    if (!Object.hasOwn(o, key)) out.push({ path, message: `"${key}" is missing` });
  }
  for (const [key, v] of Object.entries(o)) {
    const p = joinPath(path, key);
    if (Object.hasOwn(props, key)) {
      check(v, props[key]!, root, p, out);
      continue;
    }
    const pat = Object.keys(patterns).find((re) => new RegExp(re, 'u').test(key));
    if (pat !== undefined) {
      check(v, patterns[pat]!, root, p, out);
      continue;
    }
    if (schema.additionalProperties === false) {
      const known = Object.keys(props);
      out.push({
        path: p,
        message: `is not a known field${known.length ? ` (known: ${known.join(', ')})` : ''}`,
      });
    } else if (schema.additionalProperties && typeof schema.additionalProperties === 'object') {
      check(v, schema.additionalProperties as Schema, root, p, out);
    }
  }
}

/**
 * The one branch of a union that the value is plainly meant for: the only branch that
 * admits its JSON type, or, for an object, the only branch that knows the most of its
 * field names (and at least one). `undefined` when there is no single such branch.
 */
function nearest(x: unknown, branches: Schema[], root: Schema): number | undefined {
  const t = typeOf(x);
  const admits = branches.map((b0) => {
    const b = resolve(b0, root);
    if (b.type === undefined) return true;
    const types = Array.isArray(b.type) ? (b.type as string[]) : [b.type as string];
    return types.some((ty) => typeMatches(x, ty));
  });
  const typed = admits.flatMap((a, i) => (a ? [i] : []));
  if (typed.length === 1) return typed[0];
  if (t !== 'object' || typed.length === 0) return undefined;
  const keys = Object.keys(x as object);
  const scores = typed.map((i) => {
    const props = (resolve(branches[i]!, root).properties ?? {}) as Record<string, unknown>;
    return keys.filter((k) => Object.hasOwn(props, k)).length;
  });
  const best = Math.max(...scores);
  if (best === 0 || scores.filter((s) => s === best).length !== 1) return undefined;
  return typed[scores.indexOf(best)];
}

function depth(problems: Problem[]): number {
  return problems.reduce((m, p) => Math.max(m, p.path.length), 0);
}
