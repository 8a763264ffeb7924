/**
 * Task `levelling`: reduction of a booked levelling run (backsights, intermediate sights,
 * foresights), its arithmetic checks, misclosure on a closing bench mark, and the
 * allowable misclosure c·√K for an order, through the library's `levelRun`.
 *
 * @module cli
 */
import { LEVELLING_ORDERS, QuadspreadError, levelRun, rational } from '../../index.js';
import type { LevelSight, LevellingOrder } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { TaskKind } from '../task.js';
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
    order: {
      anyOf: [{ enum: Object.keys(LEVELLING_ORDERS) }, { type: 'number', exclusiveMinimum: 0 }],
      description:
        'Order for the allowable misclosure c·√K (FGCC 1984; c values from memory, check them), or c in mm.',
      'x-describe': `an order (${Object.keys(LEVELLING_ORDERS).join(', ')}) or c in mm`,
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
    if (task.order !== undefined && close === undefined)
      throw new JobInvalid(
        `${path}.order`,
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
      compute(env) {
        const A = env.A;
        const list: LevelSight<typeof A.zero>[] = sights.map((s) => ({
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
          ...(task.order !== undefined ? { order: task.order as LevellingOrder | number } : {}),
          ...(task.km !== undefined ? { km: task.km as number } : {}),
        });
        const u = ctx.unitName;
        const results = run.rows.slice(1).map((r, i) => ({
          name: `${sights[i + 1]!.station}.level`,
          label: `${sights[i + 1]!.station} reduced level${close ? ' (adjusted)' : ''}`,
          unit: u,
          value: close ? r.adjusted : r.level,
        }));
        // The booking's arithmetic checks recompute the program's own sums: they cannot detect a
        // misread staff, only a fault in the reduction, so they are not counted as checks on the
        // survey. They become a note when they hold and a failed check if they ever do not.
        const checks: {
          name: string;
          label: string;
          unit: string;
          value: typeof A.zero;
          tolerance: string;
          pass: boolean;
        }[] = [];
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
            tolerance: `≤ ${env.num(run.allowable.allowable as never).toFixed(1)}`,
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
        if (task.order !== undefined && typeof task.order === 'string')
          notes.push(
            'The allowable misclosure constants are quoted from memory of FGCC (1984): check them against the standard before relying on them.',
          );
        return { results, checks, notes };
      },
    };
  },
};
