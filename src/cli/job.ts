/**
 * Running a job: check it against the schema, read every task (exit 2 on a bad value),
 * compute each in the chosen arithmetic and again in `uncertain(float)` for the budgets
 * (exit 3 when a computation has no solution), and build the report.
 *
 * @module cli
 */
import {
  QuadspreadError,
  budget,
  decimal,
  float,
  isSurd,
  measured,
  rational,
  uncertain,
} from '../index.js';
import type { Arithmetic, LengthUnit, Uncertain } from '../index.js';
import { show } from '../errors.js';
import { JobInvalid, JobInvalidMany, JobUnsolvable } from './failure.js';
import { DEFAULT_DISPLAY, readDisplay } from './display.js';
import type { QuantityKind } from './display.js';
import { present, presentCheck, presentTable } from './present.js';
import { CAUTION } from './report.js';
import type { BudgetTerm, Quantity, Report, ReportHeader, TaskReport } from './report.js';
import { findDuplicateKey } from './json-keys.js';
import { jobSchema } from './schema.js';
import { unpackAngles } from './angle-format.js';
import type { Env, JobContext, JobPoint, Outcome, TaskKind, Value } from './task.js';
import { joinPath, validate } from './validate.js';
import { LENGTH_UNIT_NAMES, readLength } from './values.js';
import type { Input } from './values.js';

/** The arithmetics a job can run in. */
export type ArithmeticName = 'rational' | 'decimal' | 'float';

/** How to run a job. */
export interface RunOptions {
  arithmetic: ArithmeticName;
  /** Significant digits shown (decimal works with digits + 10). */
  digits: number;
  /** Where the job came from, for the report header. */
  source: string;
  /** Display settings from the command line (`--display`), over the job's `"display"`. */
  display?: Record<string, string>;
  /** Header fields from the command line, over the job's `"report"`. */
  header?: { date?: string; computedBy?: string; checkedBy?: string };
  /** The program's version, for the header. */
  version?: string;
}

/** The arithmetic object for a name and a number of digits. */
export function arithmeticFor(name: ArithmeticName, digits: number): Arithmetic<unknown, boolean> {
  switch (name) {
    case 'rational':
      return rational as Arithmetic<unknown, boolean>;
    case 'decimal':
      return decimal(digits + 10) as Arithmetic<unknown, boolean>;
    case 'float':
      return float as Arithmetic<unknown, boolean>;
  }
}

/** Parses job text as JSON, failing with exit 2 and the line and column of the fault. */
export function parseJob(text: string): unknown {
  let job: unknown;
  try {
    job = JSON.parse(text) as unknown;
  } catch (e) {
    const msg = (e as Error).message;
    const pos = /position (\d+)/.exec(msg);
    let where = '';
    if (pos) {
      const at = Number(pos[1]);
      const before = text.slice(0, at).split('\n');
      where = `line ${before.length}, column ${before[before.length - 1]!.length + 1}`;
    }
    throw new JobInvalid(
      where,
      `the job file is not valid JSON (${msg.replace(/^JSON\.parse: /, '')})`,
    );
  }
  // JSON.parse keeps the last of two equal keys: a point or a reading written twice is refused.
  const dup = findDuplicateKey(text);
  if (dup)
    throw new JobInvalid(
      `${dup.path} (line ${dup.line})`,
      `is written twice in the same object (first on line ${dup.firstLine}): keep one`,
    );
  return job;
}

function taskLabel(task: Record<string, unknown>, index: number): string {
  const name = typeof task.name === 'string' ? ` "${task.name}"` : '';
  return `tasks[${index}] (${String(task.kind)}${name})`;
}

function reasonOf(e: QuadspreadError): string {
  return e.message.replace(/^quadspread /, '');
}

const SIGMA_DIGITS = 2;

type RawQ<V> = {
  name: string;
  label: string;
  unit: string;
  value: Value<V>;
  approx?: boolean;
  kind?: QuantityKind;
  internal?: boolean;
};

function formatQuantity<V>(
  A: Arithmetic<V, boolean>,
  q: RawQ<V>,
  digits: number,
  approx0: boolean,
): Quantity {
  const approx = approx0 || q.approx === true;
  const out: Quantity = { name: q.name, label: q.label, unit: q.unit, value: '' };
  if (isSurd(q.value)) {
    out.value = q.value.toPrecision(digits);
    if (A.exact && !approx) out.exact = q.value.toString();
  } else {
    out.value = A.toPrecision(q.value as V, digits);
    if (A.exact && !approx) out.exact = A.toString(q.value as V);
  }
  return out;
}

function precision(x: number, digits: number): string {
  if (x === 0) return '0';
  return float.toPrecision(x, digits);
}

/** Runs a job that has been parsed from JSON, returning its report. */
export function runJob(job: unknown, kinds: readonly TaskKind[], options: RunOptions): Report {
  const schema = jobSchema(kinds);
  const problems = validate(job, schema);
  // A problem with the whole file (not an object, …) is said to be about the job file.
  if (problems.length > 0)
    throw new JobInvalidMany(
      problems.map((p) =>
        p.path === ''
          ? {
              path: 'the job file',
              message: /is not an object/.test(p.message)
                ? `${p.message} (a job is an object with "tasks")`
                : p.message,
            }
          : p,
      ),
    );
  // DD.MMSS angles, when the job says so, become decimal degrees before the tasks read them.
  const given0 = job as { units?: { angles?: string } };
  const j = (given0.units?.angles === 'dd.mmss' ? unpackAngles(job, schema) : job) as {
    title?: string;
    display?: Record<string, unknown>;
    report?: {
      date?: string;
      computedBy?: string;
      checkedBy?: string;
      datum?: string;
      reference?: string;
    };
    units?: { length?: LengthUnit; angles?: 'degrees' | 'dd.mmss' };
    points?: Record<string, Record<string, unknown>>;
    tasks: Record<string, unknown>[];
  };
  const rules = readDisplay(
    options.display ?? {},
    readDisplay(j.display ?? {}, DEFAULT_DISPLAY, 'display'),
    '--display',
  );
  const given = { ...(j.report ?? {}), ...(options.header ?? {}) };
  const header: ReportHeader = {
    date: given.date ?? new Date().toISOString().slice(0, 10),
    program: `quadspread ${options.version ?? ''}`.trim(),
    ...(j.report?.datum !== undefined ? { datum: j.report.datum } : {}),
    ...(given.computedBy !== undefined ? { computedBy: given.computedBy } : {}),
    ...(given.checkedBy !== undefined ? { checkedBy: given.checkedBy } : {}),
    ...(j.report?.reference !== undefined ? { reference: j.report.reference } : {}),
  };
  const unit: LengthUnit = j.units?.length ?? 'm';
  const unitName = LENGTH_UNIT_NAMES[unit];
  const points = new Map<string, JobPoint>();
  for (const [name, p] of Object.entries(j.points ?? {})) {
    const path = joinPath('points', name);
    const pt: JobPoint = {
      name,
      east: readLength(p.east, `${path}.east`, unit, `${name} east`, 'coordinate'),
      north: readLength(p.north, `${path}.north`, unit, `${name} north`, 'coordinate'),
    };
    points.set(name, pt);
  }
  const ctx: JobContext = {
    unit,
    unitName,
    points,
    point(name, path) {
      const p = typeof name === 'string' ? points.get(name) : undefined;
      if (!p) {
        const known = [...points.keys()];
        throw new JobInvalid(
          path,
          `${show(name)} is not a point of this job${known.length ? ` (points: ${known.slice(0, 12).join(', ')}${known.length > 12 ? ', …' : ''})` : ' (the job has no "points")'}`,
        );
      }
      return p;
    },
  };
  const byKind = new Map(kinds.map((k) => [k.kind, k]));
  const prepared = j.tasks.map((t, i) =>
    byKind.get(t.kind as string)!.prepare(t, `tasks[${i}]`, ctx),
  );

  const A = arithmeticFor(options.arithmetic, options.digits);
  const U = uncertain(float);
  const tasks: TaskReport[] = [];
  let anyTranscendental = false;
  prepared.forEach((p, i) => {
    const task = j.tasks[i]!;
    const approx = p.inputs.some((x) => x.angle);
    const baseEnv: Env<unknown> = {
      A,
      get: (x: Input) => A.from(x.value),
      // Through decimal text: rational.toNumber refuses fractions whose numerator and denominator both exceed the float range.
      num: (x) => Number(isSurd(x) ? x.toPrecision(17) : A.toPrecision(x, 17)),
      drawing: true,
    };
    let base: Outcome<unknown>;
    try {
      base = p.compute(baseEnv);
    } catch (e) {
      if (e instanceof QuadspreadError) throw new JobUnsolvable(taskLabel(task, i), reasonOf(e));
      throw e;
    }
    // The uncertain run: every input enters as a named measured value (σ = 0 where none was
    // given), so that the gradients tell both the budget and which results depend on an
    // angle reading (and so have no exact form).
    const angleNames = new Set(p.inputs.filter((x) => x.angle).map((x) => x.name));
    const withSigma = new Map(
      p.inputs.filter((x) => x.sigma !== undefined).map((x) => [x.name, x]),
    );
    const pairs = ((task.correlations ?? []) as { inputs: [string, string]; r: number }[]).map(
      (c, k) => {
        c.inputs.forEach((n, m) => {
          if (!withSigma.has(n)) {
            throw new JobInvalid(
              `tasks[${i}].correlations[${k}].inputs[${m}]`,
              `${show(n)} is not an input of this task with a sigma (${[...withSigma.keys()].map((x) => JSON.stringify(x)).join(', ') || 'none has one'})`,
            );
          }
        });
        if (c.inputs[0] === c.inputs[1])
          throw new JobInvalid(
            `tasks[${i}].correlations[${k}].inputs`,
            'pairs an input with itself',
          );
        const [a, b] = c.inputs.map((n) => withSigma.get(n)!);
        return {
          names: c.inputs,
          r: c.r,
          covariance: c.r * float.from(a!.sigma!) * float.from(b!.sigma!),
        };
      },
    );
    type UncertaintyEntry = {
      dependsOnAngle: boolean;
      sigma?: string;
      budget?: BudgetTerm[];
      correlations?: NonNullable<Quantity['correlations']>;
    };
    const uncertainties = new Map<string, UncertaintyEntry>();
    let uncertainNote: string | undefined;
    try {
      const cache = new Map<Input, unknown>();
      const uEnv: Env<unknown> = {
        A: U as Arithmetic<unknown, boolean>,
        get: (x: Input) => {
          let v = cache.get(x);
          if (v === undefined) {
            v = measured(
              U,
              float.from(x.value),
              x.sigma !== undefined ? float.from(x.sigma) : 0,
              x.name,
            );
            cache.set(x, v);
          }
          return v;
        },
        num: () => 0,
        drawing: false,
      };
      const u = p.compute(uEnv);
      for (const q of u.results) {
        if (isSurd(q.value)) continue;
        const v = q.value as Uncertain<number>;
        const entry: UncertaintyEntry = {
          dependsOnAngle: [...v.gradient.keys()].some((k) => angleNames.has(k.name)),
        };
        const depends = new Set([...v.gradient.keys()].map((k) => k.name));
        const used = pairs.filter((c) => depends.has(c.names[0]) && depends.has(c.names[1]));
        const b = budget(U, v, {
          covariance: used.map((c) => [c.names[0], c.names[1], c.covariance] as const),
        });
        const terms = b.contributions.filter((c) => c.sigma > 0);
        if (terms.length > 0) {
          entry.sigma = precision(b.sigma, SIGMA_DIGITS);
          entry.budget = terms.map((c): BudgetTerm => ({
            input: c.name,
            sensitivity: precision(c.sensitivity, 4),
            part: precision(Math.sqrt(c.contribution), SIGMA_DIGITS),
            share:
              b.variance > 0
                ? (Math.round((1000 * c.contribution) / b.variance) / 10).toFixed(1)
                : '0.0',
          }));
        }
        if (b.correlations.length > 0 && b.variance > 0) {
          entry.correlations = b.correlations.map((c) => ({
            inputs: [c.names[0], c.names[1]] as [string, string],
            r: String(used.find((u) => u.names[0] === c.names[0] && u.names[1] === c.names[1])!.r),
            share: (Math.round((1000 * c.contribution) / b.variance) / 10).toFixed(1),
          }));
        }
        uncertainties.set(q.name, entry);
      }
    } catch (e) {
      if (!(e instanceof QuadspreadError)) throw e;
      if (p.inputs.some((x) => x.sigma !== undefined))
        uncertainNote = `Uncertainties could not be propagated to first order: ${reasonOf(e)}.`;
    }
    const report: TaskReport = {
      index: i,
      kind: String(task.kind),
      name: typeof task.name === 'string' ? task.name : `${String(task.kind)} ${i + 1}`,
      summary: p.summary,
      results: base.results.map((q) => {
        const un = uncertainties.get(q.name);
        const f = formatQuantity(A, q, options.digits, un ? un.dependsOnAngle : approx);
        if (un?.sigma !== undefined) {
          f.sigma = un.sigma;
          f.budget = un.budget!;
          if (un.correlations) f.correlations = un.correlations;
        }
        return present(A, q, f, rules);
      }),
      checks: base.checks.map((c) => presentCheck(A, c, rules, options.digits)),
      notes: [...base.notes, ...(uncertainNote ? [uncertainNote] : [])],
      ...(base.tables && base.tables.length > 0
        ? { tables: base.tables.map((t) => presentTable(A, t, rules)) }
        : {}),
      ...(base.sketch ? { sketch: base.sketch } : {}),
      ...(base.exchange
        ? { exchange: { A: A as Arithmetic<unknown, boolean>, ...base.exchange } }
        : {}),
    };
    if (A.exact && base.results.some((q) => uncertainties.get(q.name)?.dependsOnAngle ?? approx))
      anyTranscendental = true;
    tasks.push(report);
  });
  const all = tasks.flatMap((t) => t.checks);
  const passed = all.filter((c) => c.pass).length;
  return {
    format: 'quadspread-report',
    version: 1,
    title: j.title ?? 'quadspread job',
    source: options.source,
    arithmetic: A.name,
    digits: options.digits,
    lengthUnit: unitName,
    header,
    display: rules,
    notes: anyTranscendental
      ? [
          'Results that depend on angle readings have no exact form: the spread of an angle is transcendental, so in rational it is a fraction good to about 1e-40 relative (docs/readings.md), not an exact value.',
        ]
      : [],
    tasks,
    summary: { checks: all.length, passed, failed: all.length - passed },
    caution: CAUTION,
  };
}
