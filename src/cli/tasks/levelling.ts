/**
 * Task `levelling`: reduction of a booked levelling run (backsights, intermediate sights,
 * foresights), its arithmetic checks, misclosure on a closing bench mark, and the
 * allowable misclosure c·√K for an order, through the library's `levelRun`.
 *
 * @module cli
 */
import { QuadspreadError, levelRun, rational } from '../../index.js';
import type { LevelSight } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, Outcome, RawCheck, RawQuantity, RawTable, TaskKind, Value } from '../task.js';
import type { SketchView } from '../report.js';
import { plain, readLength } from '../values.js';
import type { Input } from '../values.js';
import { taskSchema } from './common.js';

interface SightSpec {
  station: string;
  bs?: Input;
  is?: Input;
  fs?: Input;
  distance?: Input;
}

export const levellingTask: TaskKind = {
  kind: 'levelling',
  description:
    'A levelling run: reduced levels from booked backsights, intermediate sights and foresights; arithmetic checks; misclosure on the closing bench mark against c·√K.',
  schema: taskSchema('levelling', ['start', 'sights'], {
    start: {
      $ref: '#/$defs/measuredLength',
      description: 'Reduced level of the starting bench mark.',
    },
    close: {
      $ref: '#/$defs/measuredLength',
      description: 'Known reduced level of the closing bench mark.',
    },
    c: {
      type: 'number',
      exclusiveMinimum: 0,
      description:
        'The constant c in mm of the allowable misclosure c·√K, as the specification of the work gives it (docs/cli.md lists common values, unchecked).',
    },
    order: {
      type: ['number', 'string'],
      description:
        'Older name of "c" (a number, c in mm). The name of an order is refused: its c is the user\'s to give.',
    },
    km: {
      type: 'number',
      minimum: 0,
      description: 'Section length K in km (default: the sum of the sight distances).',
    },
    sights: {
      type: 'array',
      minItems: 2,
      maxItems: 100000,
      items: {
        type: 'object',
        additionalProperties: false,
        properties: {
          station: { $ref: '#/$defs/name' },
          bs: { $ref: '#/$defs/measuredLength', description: 'Backsight staff reading.' },
          is: { $ref: '#/$defs/measuredLength', description: 'Intermediate sight.' },
          fs: { $ref: '#/$defs/measuredLength', description: 'Foresight.' },
          distance: {
            $ref: '#/$defs/length',
            description: "Distance from the previous row's point, for distributing the misclosure.",
          },
        },
      },
    },
  }),
  prepare(task, path, ctx) {
    const start = readLength(task.start, `${path}.start`, ctx.unit, 'start level', 'reduced level');
    const close =
      task.close !== undefined
        ? readLength(task.close, `${path}.close`, ctx.unit, 'close level', 'reduced level')
        : undefined;
    if (typeof task.order === 'string')
      throw new JobInvalid(
        `${path}.order`,
        `${JSON.stringify(task.order)} names an order, but the constant c of the allowable misclosure c·√K is yours to give: write "c": <mm> as your specification states it (docs/cli.md lists common values, unchecked)`,
      );
    if (task.order !== undefined && task.c !== undefined)
      throw new JobInvalid(`${path}.order`, 'give "c" alone ("order" is its older name)');
    const cMm = (task.c ?? task.order) as number | undefined;
    if (cMm !== undefined && close === undefined)
      throw new JobInvalid(
        `${path}.${task.c !== undefined ? 'c' : 'order'}`,
        'an allowable misclosure needs the closing level "close"',
      );
    const sights: SightSpec[] = (task.sights as Record<string, unknown>[]).map((s, i) => {
      const p = `${path}.sights[${i}]`;
      const station = typeof s.station === 'string' ? s.station : `row ${i + 1}`;
      const out: SightSpec = { station };
      for (const k of ['bs', 'is', 'fs'] as const)
        if (s[k] !== undefined)
          out[k] = readLength(
            s[k],
            `${p}.${k}`,
            ctx.unit,
            `${station} ${k.toUpperCase()}`,
            'staff reading',
          );
      if (s.distance !== undefined)
        out.distance = readLength(
          s.distance,
          `${p}.distance`,
          ctx.unit,
          `${station} distance`,
          'distance',
        );
      return out;
    });
    const first = (task.sights as Record<string, unknown>[])[0]!;
    if (first.bs === undefined || first.is !== undefined || first.fs !== undefined) {
      throw new JobInvalid(
        `${path}.sights[0]`,
        'the first row must be a backsight alone, on the starting bench mark',
      );
    }
    // Which sights a row may hold is the library's rule: ask it now, in exact arithmetic and
    // without the closing level, so that a mis-booked row is a bad job (exit 2) naming the row.
    try {
      const R = rational;
      levelRun(R, {
        start: R.from(start.value),
        unit: ctx.unit,
        sights: sights.map((s) => ({
          station: s.station,
          ...(s.bs ? { bs: R.from(s.bs.value) } : {}),
          ...(s.is ? { is: R.from(s.is.value) } : {}),
          ...(s.fs ? { fs: R.from(s.fs.value) } : {}),
          ...(s.distance ? { distance: R.from(s.distance.value) } : {}),
        })),
      });
    } catch (e) {
      if (!(e instanceof QuadspreadError)) throw e;
      // Other refusals are met again, and reported (exit 3), by the computation itself.
      if (e.code === 'INVALID_ARGUMENT') {
        const row = /sights\[(\d+)\](\.\w+)?/.exec(e.where);
        throw new JobInvalid(
          row ? `${path}.sights[${row[1]}]${row[2] ?? ''}` : path,
          e.message.slice(e.message.indexOf(e.where) + e.where.length + 2),
        );
      }
    }
    const inputs = [
      start,
      ...(close ? [close] : []),
      ...sights.flatMap((s) =>
        [s.bs, s.is, s.fs, s.distance].filter((x): x is Input => x !== undefined),
      ),
    ];
    return {
      summary: `Levelling run of ${sights.length} rows from ${plain(start.value)} ${ctx.unitName}${close ? ` closing on ${plain(close.value)} ${ctx.unitName}` : ''}.`,
      inputs,
      compute<V>(env: Env<V>): Outcome<V> {
        const A = env.A;
        const list: LevelSight<V>[] = sights.map((s) => ({
          station: s.station,
          ...(s.bs ? { bs: env.get(s.bs) } : {}),
          ...(s.is ? { is: env.get(s.is) } : {}),
          ...(s.fs ? { fs: env.get(s.fs) } : {}),
          ...(s.distance ? { distance: env.get(s.distance) } : {}),
        }));
        const run = levelRun(A, {
          start: env.get(start),
          sights: list,
          ...(close ? { close: env.get(close) } : {}),
          unit: ctx.unit,
          ...(cMm !== undefined ? { order: cMm } : {}),
          ...(task.km !== undefined ? { km: task.km as number } : {}),
        });
        const u = ctx.unitName;
        const results: RawQuantity<V>[] = run.rows.slice(1).map((r, i) => ({
          name: `${sights[i + 1]!.station}.level`,
          label: `${sights[i + 1]!.station} reduced level${close ? ' (adjusted)' : ''}`,
          unit: u,
          value: close ? r.adjusted : r.level,
          kind: 'level',
        }));
        // The booking's arithmetic checks recompute the program's own sums: they cannot detect a
        // misread staff, only a fault in the reduction, so they are not counted as checks on the
        // survey. They become a note when they hold and a failed check if they ever do not.
        const checks: RawCheck<V>[] = [];
        if (!run.check.riseFallOk)
          checks.push({
            name: 'rise_fall',
            label: 'Arithmetic of the reduction: ΣBS − ΣFS = ΣRise − ΣFall = last − first',
            unit: u,
            value: run.check.difference,
            tolerance: 'all three equal',
            pass: false,
          });
        if (!run.check.heightOfInstrumentOk)
          checks.push({
            name: 'height_of_instrument',
            label: 'Arithmetic of the reduction: height-of-instrument sums',
            unit: u,
            value: run.check.difference,
            tolerance: 'Σ(HI × sights) = ΣIS + ΣFS + Σlevels',
            pass: false,
          });
        if (run.misclosureMm !== undefined)
          results.push({
            name: 'misclosure',
            label: 'Misclosure (computed less known closing level)',
            unit: 'mm',
            value: run.misclosureMm,
          });
        if (run.allowable && run.misclosureMm !== undefined) {
          results.push({
            name: 'allowable',
            label: `Allowable misclosure c·√K (c = ${A.toString(run.allowable.c)} mm, K = ${A.toPrecision(run.allowable.km, 4)} km)`,
            unit: 'mm',
            value: run.allowable.allowable as never,
          });
          checks.push({
            name: 'misclosure',
            label: 'Misclosure within c·√K',
            unit: 'mm',
            value: run.misclosureMm,
            limit: run.allowable.allowable as Value<V>,
            pass: run.withinAllowable === true,
          });
        }
        const notes: string[] = [];
        if (run.check.riseFallOk && run.check.heightOfInstrumentOk) {
          notes.push(
            `Arithmetic of the reduction agrees: ΣBS − ΣFS = ΣRise − ΣFall = last − first = ${Number(env.num(run.check.difference).toPrecision(12))} ${u}, and Σ(HI × sights) = ΣIS + ΣFS + Σlevels (this confirms the sums, not the readings).`,
          );
        }
        if (close) notes.push(`Misclosure distributed by ${run.distributedBy}.`);
        if (task.order !== undefined)
          notes.push('"order" is the older name of "c": write "c" (the constant in mm).');
        const tables: RawTable<V>[] = [];
        if (env.drawing) {
          const rows = run.rows;
          const adjusted = close !== undefined;
          const dist = sights.map((s) => (s.distance ? env.get(s.distance) : undefined));
          tables.push({
            name: 'level-book-rise-fall',
            title: `Level book, rise and fall${adjusted ? ', with the misclosure distributed' : ''}`,
            columns: [
              { label: 'Station' },
              { label: 'BS', kind: 'level' },
              { label: 'IS', kind: 'level' },
              { label: 'FS', kind: 'level' },
              { label: 'Rise', kind: 'level' },
              { label: 'Fall', kind: 'level' },
              { label: 'RL', kind: 'level' },
              ...(adjusted
                ? [
                    { label: 'Corr', kind: 'level' as const },
                    { label: 'Adj RL', kind: 'level' as const },
                  ]
                : []),
              ...(dist.some((d) => d !== undefined)
                ? [{ label: 'Dist', kind: 'length' as const }]
                : []),
            ],
            rows: [
              ...rows.map((r, i) => [
                r.station ?? `row ${i + 1}`,
                r.bs,
                r.is,
                r.fs,
                r.rise,
                r.fall,
                r.level,
                ...(adjusted ? [r.correction, r.adjusted] : []),
                ...(dist.some((d) => d !== undefined) ? [dist[i]] : []),
              ]),
              [
                'Σ',
                run.check.sumBS,
                undefined,
                run.check.sumFS,
                run.check.sumRise,
                run.check.sumFall,
              ],
            ],
            notes: [
              `Checks: ΣBS − ΣFS = ΣRise − ΣFall = last RL − first RL = ${A.toPrecision(
                run.check.difference,
                12,
              )
                .replace(/(\.\d*?)0+$/, '$1')
                .replace(
                  /\.$/,
                  '',
                )} ${u}${run.check.riseFallOk ? ' (they agree)' : ' (THEY DO NOT AGREE)'}. Levels in ${u}.`,
            ],
          });
          tables.push({
            name: 'level-book-collimation',
            title: 'Level book, height of collimation',
            columns: [
              { label: 'Station' },
              { label: 'BS', kind: 'level' },
              { label: 'IS', kind: 'level' },
              { label: 'FS', kind: 'level' },
              { label: 'HPC', kind: 'level' },
              { label: 'RL', kind: 'level' },
            ],
            rows: rows.map((r, i) => [
              r.station ?? `row ${i + 1}`,
              r.bs,
              r.is,
              r.fs,
              r.hi,
              r.level,
            ]),
            notes: [
              `Check: Σ(HPC × sights taken from it) = ΣIS + ΣFS + Σ(RL after the first)${run.check.heightOfInstrumentOk ? ' (it holds)' : ' (IT DOES NOT HOLD)'}. HPC is the height of the plane of collimation, in ${u}.`,
            ],
          });
        }
        const sketch = env.drawing
          ? [
              profileSketch(
                run.rows.map((r) => ({
                  station: r.station ?? '',
                  level: env.num((close ? r.adjusted : r.level) as V),
                  bs: r.bs === undefined ? undefined : env.num(r.bs as V),
                  is: r.is === undefined ? undefined : env.num(r.is as V),
                  fs: r.fs === undefined ? undefined : env.num(r.fs as V),
                })),
                sights.map((s) => (s.distance ? env.num(env.get(s.distance)) : undefined)),
                u,
                run.misclosureMm === undefined ? undefined : env.num(run.misclosureMm as V),
              ),
            ]
          : undefined;
        return { results, checks, notes, tables, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};

/** One row of the level book, as numbers, for the sketch. */
interface ProfileRow {
  station: string;
  level: number;
  bs: number | undefined;
  is: number | undefined;
  fs: number | undefined;
}

/**
 * The levelling profile: reduced levels against chainage (the booked distances added up, or the
 * rows evenly spaced when distances are not booked), each staff drawn from its point up to the
 * line of collimation it was read from (BS, IS, FS), and each set-up's line of collimation.
 */
function profileSketch(
  rows: ProfileRow[],
  distances: (number | undefined)[],
  unit: string,
  misclosureMm: number | undefined,
): SketchView {
  const measured = distances.slice(1).every((d) => d !== undefined);
  const chainage: number[] = [];
  rows.forEach((_, i) =>
    chainage.push(i === 0 ? 0 : chainage[i - 1]! + (measured ? distances[i]! : 1)),
  );
  const view: SketchView = {
    title: 'Levelling profile',
    view: 'elevation',
    caption: measured
      ? `x chainage (${unit}, booked distances), y reduced level; staves to the collimation line`
      : 'x booking order (rows evenly spaced: no distances), y reduced level; staves to the collimation line',
    ...(measured ? { unit } : {}),
    toScale: measured,
    maxExaggeration: 1000,
    points: rows.map((r, i) => ({
      name: r.station || `row ${i + 1}`,
      x: chainage[i]!,
      y: r.level,
      role:
        i === 0 || (i === rows.length - 1 && misclosureMm !== undefined) ? 'control' : 'computed',
    })),
    lines: [],
    notes: [],
  };
  const few = rows.length <= 12;
  let hpc: number | undefined;
  let from = 0;
  const read = (i: number, kind: string, reading: number, top: number) => {
    view.lines.push({
      x1: chainage[i]!,
      y1: rows[i]!.level,
      x2: chainage[i]!,
      y2: top,
      role: 'staff',
    });
    if (few) view.notes.push({ x: chainage[i]!, y: top, text: `${kind} ${reading.toFixed(3)}` });
  };
  rows.forEach((r, i) => {
    if (hpc !== undefined) {
      if (r.is !== undefined) read(i, 'IS', r.is, hpc);
      if (r.fs !== undefined) {
        read(i, 'FS', r.fs, hpc);
        view.lines.push({
          x1: chainage[from]!,
          y1: hpc,
          x2: chainage[i]!,
          y2: hpc,
          role: 'collimation',
        });
      }
    }
    if (r.bs !== undefined) {
      hpc = r.level + r.bs;
      from = i;
      read(i, 'BS', r.bs, hpc);
    }
  });
  for (let i = 1; i < rows.length; i++)
    view.lines.push({
      x1: chainage[i - 1]!,
      y1: rows[i - 1]!.level,
      x2: chainage[i]!,
      y2: rows[i]!.level,
      role: 'ground',
    });
  if (misclosureMm !== undefined) {
    const last = rows.length - 1;
    view.notes.push({
      x: chainage[last]!,
      y: rows[last]!.level,
      text: `misclosure ${misclosureMm.toFixed(1)} mm`,
    });
  }
  return view;
}
