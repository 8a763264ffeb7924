/**
 * What a task kind of the job runner is: its piece of the job schema, how it reads its
 * part of the job (exit 2 on bad values), and how it computes — once in the arithmetic
 * the user chose (exact forms, values, checks) and once in `uncertain(float)` (budgets).
 * The computation calls the library's solvers only.
 *
 * @module cli
 */
import type {
  Arithmetic,
  HorizontalAlignment,
  LengthUnit,
  Root,
  VerticalAlignment,
} from '../index.js';
import type { QuantityKind } from './display.js';
import type { SketchView } from './report.js';
import type { Schema } from './validate.js';
import type { Input } from './values.js';

/** A value a task computes: a value of the arithmetic, or a surd (exact arithmetics). */
export type Value<V> = V | Root<V, boolean>;

/** What a computation gets: the arithmetic and its inputs. */
export interface Env<V> {
  /** The arithmetic of this run. */
  A: Arithmetic<V, boolean>;
  /** An input's value in this run (carrying its uncertainty in the uncertain run). */
  get(input: Input): V;
  /** The JS number of a value, for the sketch. */
  num(x: Value<V>): number;
  /** Whether this run draws (only the first run does). */
  drawing: boolean;
}

/** A computed quantity before formatting. */
export interface RawQuantity<V> {
  name: string;
  label: string;
  unit: string;
  value: Value<V>;
  /** True when the value is rounded even in an exact arithmetic (it went through a square root or a transcendental function). */
  approx?: boolean;
  /** What it is, for the display rules (default: from the unit). */
  kind?: QuantityKind;
  /** An internal quantity (quadrance, quadrea, H): shown in JSON, and in text only with `--detail`. */
  internal?: boolean;
}

/** A check before formatting: pass/fail decided in the run's arithmetic. */
export interface RawCheck<V> {
  name: string;
  label: string;
  unit: string;
  value: Value<V>;
  /** The tolerance as the report states it (e.g. `≤ 0.05`); with `limit`, the report writes it. */
  tolerance?: string;
  /**
   * The limit, compared with `value` exactly: the report then writes value and limit to
   * decimals enough to show the verdict, so that the printed numbers never disagree with it.
   */
  limit?: Value<V>;
  /** `≤` (default: |value| at most the limit) or `≥` (value at least the limit). */
  relation?: '≤' | '≥';
  /** What the value is, for the display rules (default: from the unit). */
  kind?: QuantityKind;
  pass: boolean;
}

/** A cell of a raw table: a value written by its column's kind, text as it is, or empty. */
export type Cell<V> = Value<V> | string | undefined;

/** A table before formatting: a task adds its tables through the report model with this. */
export interface RawTable<V> {
  name: string;
  title: string;
  /** Columns: a heading, and for value cells their kind and unit (the unit joins the heading). */
  columns: { label: string; kind?: QuantityKind; unit?: string }[];
  rows: Cell<V>[][];
  notes?: string[];
}

/** What a computation returns. */
export interface Outcome<V> {
  results: RawQuantity<V>[];
  checks: RawCheck<V>[];
  notes: string[];
  /** Tables (traverse sheet, level book, coordinate list, …). */
  tables?: RawTable<V>[];
  sketch?: SketchView[];
  /** What the exchange formats take beyond the results (`--export landxml`). */
  exchange?: TaskExchange<V>;
}

/** A task's geometry for the exchange formats: an alignment task's alignment. */
export interface TaskExchange<V> {
  alignment?: { horizontal: HorizontalAlignment<V>; vertical?: VerticalAlignment<V> };
}

/** A task read from the job and ready to compute. */
export interface Prepared {
  /** One line saying what is computed. */
  summary: string;
  /** Every scalar input (those with a sigma enter the uncertainty budget). */
  inputs: Input[];
  /** The computation, run in any arithmetic. Throws QuadspreadError when there is no solution. */
  compute<V>(env: Env<V>): Outcome<V>;
}

/** A point of the job, with exact text coordinates in the job's length unit. */
export interface JobPoint {
  name: string;
  east: Input;
  north: Input;
}

/** What a task kind may read beside its own part of the job. */
export interface JobContext {
  unit: LengthUnit;
  /** Unit words for reports, e.g. `m`. */
  unitName: string;
  points: Map<string, JobPoint>;
  /** Looks up a point by name, or fails naming the place. */
  point(name: unknown, path: string): JobPoint;
}

/** A task kind. */
export interface TaskKind {
  /** The `kind` written in the job. */
  kind: string;
  /** What it computes, for `docs/cli.md` and the schema. */
  description: string;
  /** Its branch of the job schema (must fix `properties.kind.const`). */
  schema: Schema;
  /** Reads a task of this kind; throws JobInvalid naming the place. */
  prepare(task: Record<string, unknown>, path: string, ctx: JobContext): Prepared;
}
