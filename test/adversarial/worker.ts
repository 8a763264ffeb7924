// The adversarial worker: records the calls that the documented examples make to every entry,
// then replays each with one argument (or a field nested in one) replaced by junk, and sorts
// the outcomes. Run by test/adversarial/harness.ts inside a worker thread, whose watchdog ends
// it when a call runs too long (the shared counters say which call it was).
import { parentPort, workerData } from 'node:worker_threads';
import fc from 'fast-check';
import * as generic from '../../src/index.js';
import * as rationalEntry from '../../src/entries/rational.gen.js';
import * as decimalEntry from '../../src/entries/decimal.gen.js';
import * as floatGen from '../../src/entries/float.gen.js';
import * as ioEntry from '../../src/io/index.js';
import { HOLE, junk, makeJunk } from './junk.js';

export interface WorkerInput {
  examples: { where: string; js: string }[];
  /** quadspread/float as built (float-specialised), as a file to import; else the generated source. */
  floatFile?: string;
  seed: number;
  runs: number;
  /** [site, run, heartbeat, total sites] */
  shared: SharedArrayBuffer;
  start: { site: number; run: number };
  /** Longest call allowed, in ms (the watchdog's limit; reported, not enforced here). */
  timeoutMs: number;
}

export interface Failure {
  site: string;
  path: string;
  junk: string;
  kind: 'untyped error' | 'non-finite result' | 'wrong result type';
  detail: string;
}

export interface WorkerResult {
  sites: string[];
  calls: number;
  typed: number;
  values: number;
  passedThrough: number;
  failures: Failure[];
  failureCount: Record<Failure['kind'], number>;
  covered: Record<string, string[]>;
  uncovered: Record<string, string[]>;
  slowest: { site: string; ms: number };
}

interface Site {
  entry: string;
  name: string;
  call: (...args: unknown[]) => unknown;
  args: unknown[];
  baseline: string;
}

const BRAND = Symbol.for('quadspread.error');
const isOurs = (e: unknown): boolean => {
  try {
    return typeof e === 'object' && e !== null && (e as Record<symbol, unknown>)[BRAND] === true;
  } catch {
    return false;
  }
};

/**
 * An error raised by the junk itself (its getter, Proxy trap or conversion threw, or it is a
 * revoked Proxy): the caller's own error, which passes through unchanged as JS's own functions
 * let it (JSON.stringify, Array.prototype.map), rather than a fault of the library.
 */
const callersOwn = (e: unknown): boolean => {
  try {
    const m = (e as Error).message;
    return (
      /^(proxy trap|getter \w+|toPrimitive)$/.test(m) ||
      (e instanceof TypeError && /on a proxy that has been revoked/.test(m))
    );
  } catch {
    return false;
  }
};

const isClass = (f: unknown): boolean =>
  typeof f === 'function' && /^class\b/.test(Function.prototype.toString.call(f));

function describe(v: unknown): string {
  try {
    if (v === HOLE) return 'a hole (sparse array)';
    if (typeof v === 'string')
      return v.length > 40
        ? `${JSON.stringify(v.slice(0, 30))}… (${v.length} chars)`
        : JSON.stringify(v);
    if (typeof v === 'number') return Object.is(v, -0) ? '-0' : String(v);
    if (typeof v === 'bigint')
      return `${String(v).length > 30 ? String(v).slice(0, 20) + '…' : v}n`;
    if (typeof v === 'symbol' || typeof v === 'function') return typeof v;
    if (v === null || v === undefined) return String(v);
    if (Array.isArray(v))
      return `an array of ${v.length}${Object.keys(v).length < v.length ? ' (sparse)' : ''}`;
    if (Object.getPrototypeOf(v) === null) return 'an object without a prototype';
    const s = JSON.stringify(v);
    return s === undefined ? 'an object' : s.length > 60 ? s.slice(0, 57) + '…' : s;
  } catch {
    return 'a Proxy or an object that throws';
  }
}

function kind(v: unknown): string {
  if (v === undefined || v === null) return 'none';
  return typeof v === 'object' || typeof v === 'function' ? 'object' : typeof v;
}

/** The first non-finite number (or NaN/Infinity text) in a result, by path, or undefined. */
function nonFinite(
  v: unknown,
  depth: number,
  skip: Set<unknown>,
  path: string,
): string | undefined {
  // A name echoed back (a label the caller gave) is the caller's text, not a computed number.
  if (/\.name$/.test(path)) return undefined;
  if (typeof v === 'number') return Number.isFinite(v) ? undefined : `${path} = ${v}`;
  // (So is the junk text itself echoed back, e.g. a point named "Infinity".)
  if (typeof v === 'string')
    return /^[+-]?(NaN|Infinity)$/.test(v) && !skip.has(v) ? `${path} = "${v}"` : undefined;
  if (typeof v !== 'object' || v === null || depth > 6 || skip.has(v)) return undefined;
  skip.add(v);
  try {
    if (v instanceof Map) {
      for (const [k, x] of v) {
        const r = nonFinite(x, depth + 1, skip, `${path}.get(${describe(k)})`);
        if (r) return r;
      }
      return undefined;
    }
    const keys = Array.isArray(v) ? Object.keys(v).slice(0, 2000) : Object.keys(v).slice(0, 200);
    for (const k of keys) {
      const r = nonFinite((v as Record<string, unknown>)[k], depth + 1, skip, `${path}.${k}`);
      if (r) return r;
    }
  } catch {
    // A junk object passed through: not ours to walk.
  }
  return undefined;
}

const plain = (v: unknown): v is Record<string, unknown> => {
  if (typeof v !== 'object' || v === null) return false;
  const p = Object.getPrototypeOf(v);
  return p === Object.prototype || p === Array.prototype;
};

/** Numbers, text, booleans, and plain objects and arrays of them (no values of an arithmetic). */
function plainData(v: unknown, depth: number): boolean {
  if (v === null || v === undefined || ['number', 'string', 'boolean'].includes(typeof v))
    return true;
  if (!plain(v) || depth > 4) return false;
  return Object.values(v).every((x) => plainData(x, depth + 1));
}

/** args with the value at one path replaced by junk (containers on the path copied). */
function mutate(
  args: unknown[],
  picks: number[],
  depthWanted: number,
  value: unknown,
): { args: unknown[]; path: string } {
  const out = args.slice();
  let i = picks[0]! % args.length;
  let path = `arg${i}`;
  let parent: Record<string | number, unknown> = out as unknown as Record<number, unknown>;
  let key: string | number = i;
  for (let d = 0; d < depthWanted; d++) {
    const cur: unknown = parent[key];
    // An arithmetic is not taken apart: one with a method replaced is the caller's own
    // arithmetic, whose contract is the caller's.
    if (!plain(cur) || typeof (cur as { add?: unknown }).add === 'function') break;
    const keys = Object.keys(cur);
    if (keys.length === 0) break;
    const copy: Record<string, unknown> = Array.isArray(cur)
      ? (cur.slice() as unknown as Record<string, unknown>)
      : { ...cur };
    parent[key] = copy;
    parent = copy;
    const k = keys[picks[d + 1]! % keys.length]!;
    key = Array.isArray(cur) ? Number(k) : k;
    path += Array.isArray(cur) ? `[${k}]` : `.${k}`;
  }
  if (value === HOLE && Array.isArray(parent)) delete parent[key as number];
  else parent[key] = value === HOLE ? undefined : value;
  i = 0;
  return { args: out, path };
}

async function main(): Promise<void> {
  const input = workerData as WorkerInput;
  const shared = new Int32Array(input.shared);
  const floatEntry = input.floatFile
    ? ((await import(input.floatFile)) as Record<string, unknown>)
    : floatGen;
  const MODULES: Record<string, Record<string, unknown>> = {
    quadspread: generic as Record<string, unknown>,
    'quadspread/rational': rationalEntry as Record<string, unknown>,
    'quadspread/decimal': decimalEntry as Record<string, unknown>,
    'quadspread/float': floatEntry,
    'quadspread/io': ioEntry as Record<string, unknown>,
  };
  const sites: Site[] = [];
  const seen = new Set<string>();
  const perName = new Map<string, number>();
  const addSite = (
    entry: string,
    name: string,
    call: (...a: unknown[]) => unknown,
    args: unknown[],
  ): void => {
    if (args.length === 0) return;
    const id = `${entry}:${name}`;
    if ((perName.get(id) ?? 0) >= 6) return;
    let sig: string;
    try {
      sig = `${id}(${args.map(describe).join(',')})`;
    } catch {
      return;
    }
    if (seen.has(sig)) return;
    let baseline: unknown;
    try {
      baseline = call(...args);
    } catch {
      return; // not a valid call (an example showing an error)
    }
    seen.add(sig);
    perName.set(id, (perName.get(id) ?? 0) + 1);
    sites.push({ entry, name, call, args, baseline: kind(baseline) });
  };

  // 1. The calls the examples make, to every exported function of every entry.
  for (const ex of input.examples) {
    const recorded: {
      entry: string;
      name: string;
      fn: (...a: unknown[]) => unknown;
      args: unknown[];
    }[] = [];
    let depth = 0;
    const wrapped = new Map<string, Record<string, unknown>>();
    const requireFor = (id: string): Record<string, unknown> => {
      const mod = MODULES[id];
      if (!mod) throw new Error(`unknown module ${id}`);
      let w = wrapped.get(id);
      if (!w) {
        w = {};
        for (const [k, v] of Object.entries(mod)) {
          if (typeof v !== 'function' || isClass(v)) {
            w[k] = v;
            continue;
          }
          const fn = v as (...a: unknown[]) => unknown;
          w[k] = (...args: unknown[]) => {
            if (depth === 0) recorded.push({ entry: id, name: k, fn, args });
            depth++;
            try {
              return fn(...args);
            } finally {
              depth--;
            }
          };
        }
        wrapped.set(id, w);
      }
      return w;
    };
    try {
      const AsyncFunction = Object.getPrototypeOf(async () => {}).constructor as new (
        ...a: string[]
      ) => (...a: unknown[]) => Promise<void>;
      await new AsyncFunction('require', '__check', 'exports', 'module', ex.js)(
        requireFor,
        () => {},
        {},
        { exports: {} },
      );
    } catch {
      // An example may end in a caught error; the calls recorded so far still count.
    }
    for (const r of recorded) {
      addSite(r.entry, r.name, r.fn, r.args);
      // The same call through the bound entries, without the arithmetic: the entry of its
      // arithmetic, and every entry when the other arguments are plain data (numbers, text,
      // plain objects and arrays of them); a re-exported function unchanged, as it is.
      if (r.entry === 'quadspread') {
        const A = r.args[0] as { name?: unknown } | undefined;
        const isArith = typeof (A as { add?: unknown } | undefined)?.add === 'function';
        const data = r.args.slice(isArith ? 1 : 0).every((x) => plainData(x, 0));
        const name = isArith && typeof A?.name === 'string' ? A.name : '';
        for (const entry of ['quadspread/rational', 'quadspread/decimal', 'quadspread/float']) {
          const f = MODULES[entry]![r.name];
          if (typeof f !== 'function') continue;
          if (f === r.fn) {
            addSite(entry, r.name, f as (...a: unknown[]) => unknown, r.args);
            continue;
          }
          if (!isArith) continue;
          const own = entry.endsWith(name.replace(/\(.*$/, ''));
          if (own || data)
            addSite(entry, r.name, f as (...a: unknown[]) => unknown, r.args.slice(1));
        }
      }
    }
  }

  // 2. Every method of every arithmetic, with small valid values.
  const arithmetics: [string, Record<string, unknown>][] = [
    ['rational', generic.rational as unknown as Record<string, unknown>],
    ['float', generic.float as unknown as Record<string, unknown>],
    ['decimal(20)', generic.decimal(20) as unknown as Record<string, unknown>],
    ['decimal(990)', generic.decimal(990) as unknown as Record<string, unknown>],
    ['uncertain(float)', generic.uncertain(generic.float) as unknown as Record<string, unknown>],
    [
      'uncertain(rational)',
      generic.uncertain(generic.rational) as unknown as Record<string, unknown>,
    ],
    ['quadspread/float arithmetic', floatEntry.arithmetic as unknown as Record<string, unknown>],
    [
      'quadspread/decimal arithmetic',
      decimalEntry.arithmetic as unknown as Record<string, unknown>,
    ],
  ];
  for (const [label, A] of arithmetics) {
    const from = A.from as (x: unknown) => unknown;
    const two = from('2');
    const three = from('3');
    for (const k of Object.keys(A)) {
      const m = A[k];
      if (typeof m !== 'function') continue;
      const f = (m as (...a: unknown[]) => unknown).bind(A);
      const args =
        k === 'from'
          ? ['1.5']
          : k === 'toPrecision'
            ? [three, 6]
            : k === 'is'
              ? [two]
              : [two, three].slice(0, Math.max(1, (m as () => void).length));
      addSite(label, k, f, args);
    }
  }

  // Coverage: the exported functions of each entry with and without a call site.
  const covered: Record<string, string[]> = {};
  const uncovered: Record<string, string[]> = {};
  for (const [id, mod] of Object.entries(MODULES)) {
    const fns = Object.keys(mod).filter((k) => typeof mod[k] === 'function' && !isClass(mod[k]));
    covered[id] = fns.filter((k) => perName.has(`${id}:${k}`));
    uncovered[id] = fns.filter((k) => !perName.has(`${id}:${k}`));
  }
  shared[3] = sites.length;

  const result: WorkerResult = {
    sites: sites.map((s) => `${s.entry}:${s.name}`),
    calls: 0,
    typed: 0,
    values: 0,
    passedThrough: 0,
    failures: [],
    failureCount: { 'untyped error': 0, 'non-finite result': 0, 'wrong result type': 0 },
    covered,
    uncovered,
    slowest: { site: '', ms: 0 },
  };
  const fail = (f: Failure): void => {
    result.failureCount[f.kind]++;
    if (result.failures.length < 200) result.failures.push(f);
  };
  const mutation = fc.record({
    picks: fc.array(fc.nat(), { minLength: 5, maxLength: 5 }),
    depth: fc.nat(3),
    value: junk,
  });
  for (let s = input.start.site; s < sites.length; s++) {
    const site = sites[s]!;
    const samples = fc.sample(mutation, { seed: input.seed + s * 7919, numRuns: input.runs });
    for (let r = s === input.start.site ? input.start.run : 0; r < samples.length; r++) {
      shared[0] = s;
      shared[1] = r;
      Atomics.add(shared, 2, 1);
      const { picks, depth, value: recipe } = samples[r]!;
      const value = makeJunk(recipe);
      const m = mutate(site.args, picks, depth, value);
      const label = `${site.entry}:${site.name}`;
      const t0 = performance.now();
      result.calls++;
      try {
        const v = site.call(...m.args);
        const bad = nonFinite(v, 0, new Set([value]), 'result');
        if (bad)
          fail({
            site: label,
            path: m.path,
            junk: describe(value),
            kind: 'non-finite result',
            detail: bad,
          });
        else if (kind(v) !== site.baseline && kind(v) !== 'none' && site.baseline !== 'none')
          fail({
            site: label,
            path: m.path,
            junk: describe(value),
            kind: 'wrong result type',
            detail: `${kind(v)} instead of ${site.baseline}: ${describe(v)}`,
          });
        else result.values++;
      } catch (e) {
        if (isOurs(e)) result.typed++;
        else if (callersOwn(e)) result.passedThrough++;
        else {
          let detail: string;
          try {
            detail =
              `${(e as Error).name}: ${(e as Error).message}`.slice(0, 200) +
              ` @ ${((e as Error).stack ?? '').split('\n')[1]?.trim() ?? ''}`;
          } catch {
            detail = describe(e);
          }
          fail({ site: label, path: m.path, junk: describe(value), kind: 'untyped error', detail });
        }
      }
      const ms = performance.now() - t0;
      if (ms > result.slowest.ms)
        result.slowest = { site: `${label} ${m.path} = ${describe(value)}`, ms };
    }
  }
  parentPort!.postMessage(result);
}

void main();
