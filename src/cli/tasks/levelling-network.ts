/**
 * Task `levelling-network`: least-squares adjustment of a levelling network through the
 * library's `adjustLevelling`: adjusted heights with σ, residuals with w-tests, the variance
 * factor and the global test.
 *
 * @module cli
 */
import { adjustLevelling, rootToNumber } from '../../index.js';
import type { Arithmetic } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { TaskKind, RawCheck, RawQuantity } from '../task.js';
import { plain, readLength } from '../values.js';
import type { Input } from '../values.js';
import { taskSchema } from './common.js';

interface ObsSpec {
  from: string;
  to: string;
  difference: Input;
  length?: Input;
}

const NAME = { type: 'string', minLength: 1, maxLength: 200 };

/** Options both network tasks share. */
export const networkOptionsSchema = {
  alpha: {
    type: 'number',
    exclusiveMinimum: 0,
    exclusiveMaximum: 1,
    description: 'Level of the global test (default 0.05).',
  },
  alpha0: {
    type: 'number',
    exclusiveMinimum: 0,
    exclusiveMaximum: 1,
    description: "Level of each observation's w-test (default 0.001: |w| > 3.29 is flagged).",
  },
  scale: {
    enum: ['a-priori', 'a-posteriori'],
    description: 'Which variance factor scales σ and ellipses (default a-posteriori).',
  },
  snooping: {
    type: 'boolean',
    description:
      'Iterative data snooping: remove the observation with the largest suspect |w|, adjust again.',
  },
};

/** Common reporting of the statistics of an adjustment. */
export function statisticsOutcome<V>(
  A: Arithmetic<V, boolean>,
  r: {
    dof: number;
    varianceFactor: V | undefined;
    sigma0: unknown;
    scale: string;
    globalTest?: { statistic: V; lower: V; upper: V; alpha: number; passed: boolean } | undefined;
    localTest: { critical: number; kind: string };
    snooping?: { removed: { index: number; reason: string }[]; stopped?: string } | undefined;
  },
  results: RawQuantity<V>[],
  checks: RawCheck<V>[],
  notes: string[],
): void {
  results.push({ name: 'dof', label: 'Degrees of freedom r', unit: '', value: A.from(r.dof) });
  if (r.varianceFactor !== undefined)
    results.push({
      name: 'variance_factor',
      label: 'Variance factor σ̂0² = vᵀPv/r',
      unit: '',
      value: r.varianceFactor,
    });
  const g = r.globalTest;
  if (g)
    checks.push({
      name: 'global_test',
      label: `Global test: vᵀPv/σ0² within the χ²(${r.dof}) bounds at α = ${g.alpha}`,
      unit: '',
      value: g.statistic,
      tolerance: `${A.toNumber(g.lower).toFixed(4)} … ${A.toNumber(g.upper).toFixed(4)}`,
      pass: g.passed,
    });
  notes.push(
    `σ are ${r.scale} (${r.scale === 'a-posteriori' ? 'σ̂0·√q' : 'σ0·√q'}); observations with |${r.localTest.kind}| > ${r.localTest.critical.toFixed(4)} are flagged, never removed silently.`,
  );
  if (r.snooping) {
    for (const s of r.snooping.removed)
      notes.push(`Data snooping removed observation ${s.index + 1}: ${s.reason}.`);
    if (r.snooping.stopped) notes.push(`Data snooping stopped: ${r.snooping.stopped}.`);
    if (r.snooping.removed.length === 0) notes.push('Data snooping removed nothing.');
  }
}

export const levellingNetworkTask: TaskKind = {
  kind: 'levelling-network',
  description:
    'A levelling network adjusted by least squares: heights of new points from observed height differences and benchmarks, with σ, residuals, w-tests, the variance factor and the global test.',
  schema: taskSchema('levelling-network', ['benchmarks', 'observations'], {
    benchmarks: {
      type: 'object',
      minProperties: 1,
      additionalProperties: { $ref: '#/$defs/measuredLength' },
      description:
        'Benchmark heights by point name; with a sigma the benchmark is weighted, else held fixed.',
    },
    observations: {
      type: 'array',
      minItems: 1,
      maxItems: 100000,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['from', 'to', 'difference'],
        properties: {
          from: NAME,
          to: NAME,
          difference: {
            $ref: '#/$defs/measuredLength',
            description: 'Height of `to` less height of `from`, with its sigma.',
          },
          length: {
            $ref: '#/$defs/length',
            description: 'Length of the levelled line, for weights by length (sigmaPerKm).',
          },
        },
      },
    },
    sigmaPerKm: {
      type: 'number',
      exclusiveMinimum: 0,
      description: 'σ per km in mm/√km for observations weighted by length (default 1).',
    },
    datum: {
      enum: ['fixed', 'minimal', 'inner'],
      description: 'fixed (the benchmarks), minimal (datumPoints held) or inner (free network).',
    },
    datumPoints: { type: 'array', items: NAME, description: 'Points of a minimal or inner datum.' },
    ...networkOptionsSchema,
  }),
  prepare(task, path, ctx) {
    const benchmarks = Object.entries(task.benchmarks as Record<string, unknown>).map(
      ([name, v]) => ({
        name,
        input: readLength(v, `${path}.benchmarks.${name}`, ctx.unit, `${name} height`, 'height'),
      }),
    );
    const obs: ObsSpec[] = (task.observations as Record<string, unknown>[]).map((o, i) => {
      const p = `${path}.observations[${i}]`;
      if (o.from === o.to) throw new JobInvalid(p, `an observation from "${o.from}" to itself`);
      const difference = readLength(
        o.difference,
        `${p}.difference`,
        ctx.unit,
        `${o.from}→${o.to} difference`,
        'height difference',
      );
      const length =
        o.length === undefined
          ? undefined
          : readLength(o.length, `${p}.length`, ctx.unit, `${o.from}→${o.to} length`, 'length');
      if (difference.sigma === undefined && length === undefined)
        throw new JobInvalid(p, 'give the difference a sigma ({ value, sigma }) or a length');
      return {
        from: o.from as string,
        to: o.to as string,
        difference,
        ...(length ? { length } : {}),
      };
    });
    const withSigma = obs.filter((o) => o.difference.sigma !== undefined).length;
    if (withSigma > 0 && withSigma < obs.length)
      throw new JobInvalid(
        `${path}.observations`,
        'give every difference a sigma, or none (weights from lengths): the two are not mixed',
      );
    const inputs = [...benchmarks.map((b) => b.input), ...obs.map((o) => o.difference)];
    return {
      summary: `Levelling network: ${obs.length} height differences, ${benchmarks.length} benchmark(s) (${benchmarks.map((b) => `${b.name} ${plain(b.input.value)}`).join(', ')} ${ctx.unitName}).`,
      inputs,
      compute(env) {
        const A = env.A;
        const fixed: Record<string, unknown> = {};
        for (const b of benchmarks)
          fixed[b.name] =
            b.input.sigma === undefined
              ? env.get(b.input)
              : { value: env.get(b.input), sigma: A.from(b.input.sigma) };
        const r = adjustLevelling(A, {
          fixed: fixed as never,
          observations: obs.map((o) => ({
            from: o.from,
            to: o.to,
            difference: env.get(o.difference),
            ...(o.difference.sigma !== undefined ? { sigma: A.from(o.difference.sigma) } : {}),
            ...(o.length ? { length: A.from(o.length.value) } : {}),
          })),
          options: {
            ...(task.sigmaPerKm !== undefined ? { sigmaPerKm: task.sigmaPerKm as number } : {}),
            ...(task.datum !== undefined ? { datum: task.datum as 'fixed' } : {}),
            ...(task.datumPoints !== undefined
              ? { datumPoints: task.datumPoints as string[] }
              : {}),
            ...(task.alpha !== undefined ? { alpha: task.alpha as number } : {}),
            ...(task.alpha0 !== undefined ? { alpha0: task.alpha0 as number } : {}),
            ...(task.scale !== undefined ? { scale: task.scale as 'a-priori' } : {}),
            ...(task.snooping === true ? { snooping: true } : {}),
          },
        });
        const u = ctx.unitName;
        const results: RawQuantity<typeof A.zero>[] = [];
        const checks: RawCheck<typeof A.zero>[] = [];
        const notes: string[] = [];
        for (const [name, h] of Object.entries(r.heights)) {
          if (h.held) continue;
          results.push({
            name: `${name}.height`,
            label: `${name} height`,
            unit: u,
            value: h.value,
          });
          results.push({
            name: `${name}.sigma`,
            label: `${name} σ (${r.scale})`,
            unit: u,
            value: h.sigma,
            approx: A.exact,
          });
        }
        r.observations.forEach((o, k) => {
          const label =
            o.kind === 'benchmark' ? `benchmark ${o.to}` : `${o.from}→${o.to} (#${o.index + 1})`;
          results.push({
            name: `obs${k + 1}.residual`,
            label: `${label} residual (redundancy ${A.toNumber(o.redundancy).toFixed(2)})`,
            unit: u,
            value: o.residual,
          });
          if (o.standardized !== undefined)
            checks.push({
              name: `obs${k + 1}.w`,
              label: `${label} ${r.localTest.kind}-test (MDB ${(o.mdb ? rootToNumber(A, o.mdb as never) : 0).toPrecision(3)} ${u})`,
              unit: '',
              value: o.standardized,
              tolerance: `|${r.localTest.kind}| ≤ ${r.localTest.critical.toFixed(4)}`,
              pass: !o.suspect,
            });
        });
        statisticsOutcome(A, r as never, results, checks, notes);
        notes.push(
          `Datum ${r.datum}; weights from ${r.weighting}.`,
          'An adjustment does not replace independent checks; control and acceptance follow local standards and licensed practice.',
        );
        return { results, checks, notes };
      },
    };
  },
};
