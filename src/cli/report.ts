/**
 * The report model: what a job run produces, before it is rendered as text, Markdown or
 * JSON. `docs/report-schema.json` describes the JSON form.
 *
 * @module cli
 */
import type { Arithmetic } from '../index.js';
import type { DisplayRules, QuantityKind } from './display.js';
import type { TaskExchange } from './task.js';

/** The caution every report ends with. */
export const CAUTION =
  'A computational aid: check every result independently before relying on it. ' +
  'Design and setting-out follow local codes and licensed practice.';

/** One term of an uncertainty budget (GUM, JCGM 100:2008 §5.1.2, eq. (10)). */
export interface BudgetTerm {
  /** The input, as named in the job (e.g. `S2.vertical`). */
  input: string;
  /** ∂result/∂input, in result units per input unit. */
  sensitivity: string;
  /** |sensitivity| · u(input): this input's part of the standard uncertainty, in result units. */
  part: string;
  /** This input's share of the variance, in percent. */
  share: string;
}

/** A computed quantity. */
export interface Quantity {
  /** What it is (`length`, `bearing`, `angle`, …): decides how `display` is written. */
  kind?: QuantityKind;
  /** The value as the text report writes it, by the display rules (DMS, fixed decimals, rounded to σ), with its unit. */
  display?: string;
  /** The standard uncertainty as the text report writes it, with its unit. */
  displaySigma?: string;
  /** An internal quantity (a quadrance, a quadrea, H): in JSON, and in text only with `--detail`. */
  internal?: boolean;
  /** A short name, unique within the task (e.g. `height`, `Q3`). */
  name: string;
  /** What it is, in words. */
  label: string;
  /** The unit of `value` (`m`, `m²`, `%`, `°`, or `` for pure numbers such as spreads). */
  unit: string;
  /** The decimal value rounded to the report's significant digits. */
  value: string;
  /** The exact form (a fraction, or a surd a + b√d), when the arithmetic is exact and the inputs were exact. */
  exact?: string;
  /** Standard uncertainty, in `unit`, when the inputs carry uncertainties. */
  sigma?: string;
  /** The uncertainty budget, largest share first. */
  budget?: BudgetTerm[];
  /** Shares of the variance added by correlated inputs (GUM eq. (13)); may be negative. */
  correlations?: { inputs: [string, string]; r: string; share: string }[];
}

/** A pass/fail check against a stated tolerance. */
export interface Check {
  /** A short name (e.g. `misclosure`). */
  name: string;
  /** What is compared, in words. */
  label: string;
  /** The measured discrepancy or figure, rounded. */
  value: string;
  /** The tolerance, as stated (e.g. `≤ 0.050`, `≥ 5000`). */
  tolerance: string;
  /** Unit of value and tolerance. */
  unit: string;
  /** Whether the check passed. */
  pass: boolean;
  /** The limit as decimal text, to the report's significant digits (when the check has a numeric limit). */
  limit?: string;
  /** How value and limit compare: `≤` (the magnitude of the value at most the limit) or `≥`. */
  relation?: '≤' | '≥';
  /** The comparison as the text report writes it (value and limit to the same decimals, enough to show the verdict). */
  display?: string;
}

/** A table of a task (a traverse sheet, a level book, a coordinate list), cells written by the display rules. */
export interface Table {
  /** A short name, unique within the task (e.g. `level-book`). */
  name: string;
  /** The table's title. */
  title: string;
  /** Column headings, with units. */
  columns: { label: string; align: 'left' | 'right' }[];
  /** Rows of cell text (empty text for an empty cell). */
  rows: string[][];
  /** Notes under the table. */
  notes?: string[];
}

/** The report's header: who, when, with what. */
export interface ReportHeader {
  /** The date of the computation (ISO 8601, YYYY-MM-DD). */
  date: string;
  /** The program and its version. */
  program: string;
  /** Datum or grid of the coordinates, as the job states it. */
  datum?: string;
  /** Who computed, as the job or the command line states it. */
  computedBy?: string;
  /** Who checked, as the job or the command line states it. */
  checkedBy?: string;
  /** A job reference or number, as the job states it. */
  reference?: string;
}

/** Drawing primitives for the sketch, in world units (plan: east/north; elevation: distance/height). */
export interface SketchView {
  /** Panel title. */
  title: string;
  /** `plan` (x east, y north) or `elevation` (x horizontal distance, y height). */
  view: 'plan' | 'elevation';
  /** What the axes are, when not the usual (plan: x east, y north, with a north arrow; elevation: distance across, height up). */
  caption?: string;
  /** Whether a plan is oriented (x east, y north) and gets a north arrow (default: when no caption is given). */
  north?: boolean;
  /** The length unit of x and y (e.g. `m`): the view then gets a scale bar, and measured lines their distances. */
  unit?: string;
  /** False when x is not drawn to scale (e.g. evenly spaced rows): no scale bar. */
  toScale?: boolean;
  /** Largest factor by which heights of an elevation view may be exaggerated (default 10). */
  maxExaggeration?: number;
  /** Decimals of the distances written on measured lines (default 3). */
  decimals?: number;
  points: {
    name: string;
    x: number;
    y: number;
    role: 'station' | 'control' | 'target' | 'foot' | 'computed';
  }[];
  lines: {
    x1: number;
    y1: number;
    x2: number;
    y2: number;
    role:
      | 'sight'
      | 'course'
      | 'boundary'
      | 'base'
      | 'path'
      | 'adjusted'
      | 'ground'
      | 'straight'
      | 'arc'
      | 'transition'
      | 'tick'
      | 'staff'
      | 'collimation';
    label?: string;
    /** Write the line's bearing and distance beside it (plan views with a `unit`). */
    measure?: boolean;
  }[];
  /** Free labels (e.g. a computed value written near a point). */
  notes: { x: number; y: number; text: string }[];
}

/** The report of one task. */
export interface TaskReport {
  /** Position in the job's task list. */
  index: number;
  /** The task kind (`height`, `traverse`, …). */
  kind: string;
  /** The task's name from the job, or a default. */
  name: string;
  /** One line saying what was computed. */
  summary: string;
  results: Quantity[];
  checks: Check[];
  /** Notes: assumptions, which root was taken, what the sketch cannot show. */
  notes: string[];
  /** Tables of the task (traverse sheet, level book, coordinate list, triangle solution). */
  tables?: Table[];
  /** Drawing data for `--sketch` (not part of the JSON report). */
  sketch?: SketchView[];
  /** Geometry for `--export` in the job's arithmetic (not part of the JSON report). */
  exchange?: TaskExchange<unknown> & { A: Arithmetic<unknown, boolean> };
}

/** A whole report. */
export interface Report {
  /** Always `quadspread-report`. */
  format: 'quadspread-report';
  /** Version of the report format. */
  version: 1;
  /** The job's title. */
  title: string;
  /** Where the job came from (a file name, or `demo`). */
  source: string;
  /** The arithmetic used (`rational`, `decimal(30)`, `float`). */
  arithmetic: string;
  /** Significant digits of the decimal values shown. */
  digits: number;
  /** Length unit of the job. */
  lengthUnit: string;
  /** Date, program, datum, computed and checked by. */
  header?: ReportHeader;
  /** The display rules the text, Markdown and HTML reports follow. */
  display?: DisplayRules;
  /** Notes that hold for the whole report (said once, not per task). */
  notes?: string[];
  tasks: TaskReport[];
  /** How many checks passed and failed. */
  summary: { checks: number; passed: number; failed: number };
  /** The closing caution. */
  caution: string;
}
