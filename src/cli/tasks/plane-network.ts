/**
 * Task `plane-network`: least-squares adjustment of a plane network (distances, bearings,
 * angles, direction rounds, coordinate-difference vectors) through the library's
 * `adjustNetwork`: coordinates with σ and error ellipses, residuals with w-tests, the variance
 * factor and the global test; the sketch draws the network and the exaggerated ellipses.
 *
 * @module cli
 */
import { adjustNetwork, rootToNumber } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { TaskKind, RawCheck, RawQuantity } from '../task.js';
import type { SketchView } from '../report.js';
import { readAngle, readLength } from '../values.js';
import type { Input } from '../values.js';
import { taskSchema } from './common.js';
import { networkOptionsSchema, statisticsOutcome } from './levelling-network.js';

const NAME = { type: 'string', minLength: 1, maxLength: 200 };
const KINDS = ['distance', 'bearing', 'angle', 'direction', 'vector'] as const;
type Kind = (typeof KINDS)[number];

interface Spec {
  kind: Kind;
  from?: string;
  to: string;
  at?: string;
  set?: string;
  value?: Input;
  dx?: Input;
  dy?: Input;
  ppm?: number;
}

export const planeNetworkTask: TaskKind = {
  kind: 'plane-network',
  description:
    'A plane network adjusted by least squares: coordinates of new points from distances, bearings, angles, direction rounds and vectors, with σ, error ellipses, residuals, w-tests, the variance factor and the global test.',
  schema: taskSchema('plane-network', ['control', 'observations'], {
    control: {
      type: 'array',
      minItems: 1,
      items: { $ref: '#/$defs/pointRef' },
      description: 'Job points held fixed (the datum). Other job points named are approximations.',
    },
    observations: {
      type: 'array',
      minItems: 1,
      maxItems: 100000,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['kind', 'to'],
        properties: {
          kind: { enum: [...KINDS] },
          from: NAME,
          to: NAME,
          at: NAME,
          set: NAME,
          distance: {
            $ref: '#/$defs/measuredLength',
            description: 'Horizontal distance with its sigma.',
          },
          ppm: { type: 'number', minimum: 0, description: "Distance σ's part in ppm of D." },
          bearing: { $ref: '#/$defs/measuredAngle', description: 'Azimuth with its sigma.' },
          angle: {
            $ref: '#/$defs/measuredAngle',
            description: 'Clockwise angle at `at` from `from` to `to`, with its sigma.',
          },
          direction: {
            $ref: '#/$defs/measuredAngle',
            description: 'Circle reading at `at` to `to` (one orientation per station and set).',
          },
          dx: { $ref: '#/$defs/measuredLength', description: 'East difference with its sigma.' },
          dy: { $ref: '#/$defs/measuredLength', description: 'North difference with its sigma.' },
        },
      },
    },
    relative: {
      type: 'array',
      items: { type: 'array', minItems: 2, maxItems: 2, items: NAME },
      description: 'Pairs of points for relative error ellipses.',
    },
    exaggeration: {
      type: 'number',
      exclusiveMinimum: 0,
      description: 'Scale of the ellipses in the sketch (default: chosen and stated).',
    },
    ...networkOptionsSchema,
  }),
  prepare(task, path, ctx) {
    const control = (task.control as string[]).map((n, i) => ctx.point(n, `${path}.control[${i}]`));
    const held = new Set(control.map((p) => p.name));
    const specs: Spec[] = (task.observations as Record<string, unknown>[]).map((o, i) => {
      const p = `${path}.observations[${i}]`;
      const kind = o.kind as Kind;
      const need = (k: string): string => {
        if (typeof o[k] !== 'string') throw new JobInvalid(`${p}.${k}`, `a ${kind} needs "${k}"`);
        return o[k] as string;
      };
      const label = `#${i + 1} ${kind}`;
      const sigmaOf = (x: Input, field: string): Input => {
        if (x.sigma === undefined)
          throw new JobInvalid(`${p}.${field}`, 'give it as { value, sigma }: the sigma weighs it');
        return x;
      };
      switch (kind) {
        case 'distance':
          return {
            kind,
            from: need('from'),
            to: need('to'),
            value: sigmaOf(readLength(o.distance, `${p}.distance`, ctx.unit, label), 'distance'),
            ...(typeof o.ppm === 'number' ? { ppm: o.ppm } : {}),
          };
        case 'bearing':
          return {
            kind,
            from: need('from'),
            to: need('to'),
            value: sigmaOf(readAngle(o.bearing, `${p}.bearing`, label, 'bearing'), 'bearing'),
          };
        case 'angle':
          return {
            kind,
            at: need('at'),
            from: need('from'),
            to: need('to'),
            value: sigmaOf(readAngle(o.angle, `${p}.angle`, label), 'angle'),
          };
        case 'direction':
          return {
            kind,
            at: need('at'),
            to: need('to'),
            ...(typeof o.set === 'string' ? { set: o.set } : {}),
            value: sigmaOf(
              readAngle(o.direction, `${p}.direction`, label, 'direction'),
              'direction',
            ),
          };
        default:
          return {
            kind: 'vector',
            from: need('from'),
            to: need('to'),
            dx: sigmaOf(readLength(o.dx, `${p}.dx`, ctx.unit, `${label} dx`), 'dx'),
            dy: sigmaOf(readLength(o.dy, `${p}.dy`, ctx.unit, `${label} dy`), 'dy'),
          };
      }
    });
    const names = new Set<string>();
    for (const s of specs) for (const n of [s.from, s.to, s.at]) if (n !== undefined) names.add(n);
    for (const c of held) names.add(c);
    const inputs = [
      ...control.flatMap((p) => [p.east, p.north]),
      ...specs.flatMap((s) => [s.value, s.dx, s.dy].filter((x): x is Input => x !== undefined)),
    ];
    return {
      summary: `Plane network: ${specs.length} observations, ${names.size} points, ${control.length} held (${[...held].join(', ')}).`,
      inputs,
      compute(env) {
        const A = env.A;
        const points: Record<string, unknown> = {};
        for (const n of names) {
          const jp = ctx.points.get(n);
          points[n] = held.has(n)
            ? { x: env.get(jp!.east), y: env.get(jp!.north), fixed: true }
            : jp
              ? { x: A.from(jp.east.value), y: A.from(jp.north.value) }
              : {};
        }
        const deg = (i: Input) => A.mul(A.from(i.sigma!), A.from(3600));
        const observations = specs.map((s) => {
          switch (s.kind) {
            case 'distance':
              return {
                kind: s.kind,
                from: s.from,
                to: s.to,
                value: env.get(s.value!),
                sigma: { constant: A.from(s.value!.sigma!), ppm: A.from(s.ppm ?? 0) },
              };
            case 'bearing':
              return {
                kind: s.kind,
                from: s.from,
                to: s.to,
                value: env.get(s.value!),
                sigma: deg(s.value!),
              };
            case 'angle':
              return {
                kind: s.kind,
                at: s.at,
                from: s.from,
                to: s.to,
                value: env.get(s.value!),
                sigma: deg(s.value!),
              };
            case 'direction':
              return {
                kind: s.kind,
                at: s.at,
                to: s.to,
                set: s.set,
                value: env.get(s.value!),
                sigma: deg(s.value!),
              };
            default: {
              const sx = A.from(s.dx!.sigma!);
              const sy = A.from(s.dy!.sigma!);
              return {
                kind: s.kind,
                from: s.from,
                to: s.to,
                dx: env.get(s.dx!),
                dy: env.get(s.dy!),
                covariance: [
                  [A.mul(sx, sx), A.zero],
                  [A.zero, A.mul(sy, sy)],
                ],
              };
            }
          }
        });
        const r = adjustNetwork(A, {
          points: points as never,
          observations: observations as never,
          options: {
            ...(task.relative !== undefined
              ? { relative: task.relative as [string, string][] }
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
        for (const [name, p] of Object.entries(r.points)) {
          if (p.held) continue;
          results.push(
            { name: `${name}.east`, label: `${name} east`, unit: u, value: p.x },
            { name: `${name}.north`, label: `${name} north`, unit: u, value: p.y },
            {
              name: `${name}.sigma_east`,
              label: `${name} σ east`,
              unit: u,
              value: p.sigmaX,
              approx: A.exact,
            },
            {
              name: `${name}.sigma_north`,
              label: `${name} σ north`,
              unit: u,
              value: p.sigmaY,
              approx: A.exact,
            },
            {
              name: `${name}.ellipse_major`,
              label: `${name} standard ellipse, semi-major`,
              unit: u,
              value: p.ellipse.major,
              approx: A.exact,
            },
            {
              name: `${name}.ellipse_minor`,
              label: `${name} standard ellipse, semi-minor`,
              unit: u,
              value: p.ellipse.minor,
              approx: A.exact,
            },
            {
              name: `${name}.ellipse_azimuth`,
              label: `${name} standard ellipse, azimuth of the major axis`,
              unit: '°',
              value: p.ellipse.azimuth,
              approx: A.exact,
            },
          );
        }
        for (const e of r.relative)
          results.push(
            {
              name: `${e.from}-${e.to}.relative_major`,
              label: `${e.from}–${e.to} relative ellipse, semi-major`,
              unit: u,
              value: e.major,
              approx: A.exact,
            },
            {
              name: `${e.from}-${e.to}.relative_minor`,
              label: `${e.from}–${e.to} relative ellipse, semi-minor`,
              unit: u,
              value: e.minor,
              approx: A.exact,
            },
          );
        r.observations.forEach((o, k) => {
          const unit = o.unit === 'arcsec' ? '″' : u;
          const label = `#${o.index + 1} ${o.kind}${o.component ? ` ${o.component}` : ''} ${o.at ? `${o.at}: ` : ''}${o.kind === 'angle' ? `${o.from}→${o.to}` : o.kind === 'direction' ? `→${o.to}` : `${o.from}→${o.to}`}`;
          results.push({
            name: `obs${k + 1}.residual`,
            label: `${label} residual (redundancy ${A.toNumber(o.redundancy).toFixed(2)})`,
            unit,
            value: o.residual,
            approx: A.exact,
          });
          if (o.standardized !== undefined)
            checks.push({
              name: `obs${k + 1}.w`,
              label: `${label} ${r.localTest.kind}-test (MDB ${(o.mdb ? rootToNumber(A, o.mdb as never) : 0).toPrecision(3)} ${unit})`,
              unit: '',
              value: o.standardized,
              tolerance: `|${r.localTest.kind}| ≤ ${r.localTest.critical.toFixed(4)}`,
              pass: !o.suspect,
            });
        });
        statisticsOutcome(A, r as never, results, checks, notes);
        notes.push(
          `Gauss–Newton: ${r.iterations} iteration(s). Angular residuals in arc-seconds.`,
          'An adjustment does not replace independent checks; control and acceptance follow local standards and licensed practice.',
        );
        const approx = Object.entries(r.points)
          .filter(([, p]) => p.approximated)
          .map(([n]) => n);
        if (approx.length > 0)
          notes.push(
            `Approximate coordinates computed from the observations for ${approx.join(', ')}.`,
          );
        let sketch: SketchView[] | undefined;
        if (env.drawing) {
          const pts = Object.entries(r.points).map(([name, p]) => ({
            name,
            x: env.num(p.x),
            y: env.num(p.y),
            role: p.held ? ('control' as const) : ('computed' as const),
          }));
          const at = new Map(pts.map((p) => [p.name, p]));
          const xs = pts.map((p) => p.x);
          const ys = pts.map((p) => p.y);
          const extent = Math.max(
            Math.max(...xs) - Math.min(...xs),
            Math.max(...ys) - Math.min(...ys),
            1,
          );
          const biggest = Math.max(
            ...Object.values(r.points).map((p) => env.num(p.ellipse.major)),
            1e-12,
          );
          // Exaggeration: as given, else the power of ten that makes the largest ellipse about
          // a twentieth of the network.
          const k =
            typeof task.exaggeration === 'number'
              ? task.exaggeration
              : 10 ** Math.round(Math.log10(extent / 20 / biggest));
          const lines: SketchView['lines'] = [];
          const seen = new Set<string>();
          for (const s of specs) {
            const a = at.get(s.at ?? s.from!)!;
            const b = at.get(s.to)!;
            const key = [a.name, b.name].sort().join('|');
            if (seen.has(key)) continue;
            seen.add(key);
            lines.push({ x1: a.x, y1: a.y, x2: b.x, y2: b.y, role: 'sight' });
          }
          for (const [name, p] of Object.entries(r.points)) {
            if (p.held) continue;
            const c = at.get(name)!;
            const M = env.num(p.ellipse.major) * k;
            const m = env.num(p.ellipse.minor) * k;
            const t = (env.num(p.ellipse.azimuth) * Math.PI) / 180;
            // the major axis along azimuth t (east = sin t, north = cos t)
            const pt = (s: number) => ({
              x: c.x + M * Math.cos(s) * Math.sin(t) + m * Math.sin(s) * Math.cos(t),
              y: c.y + M * Math.cos(s) * Math.cos(t) - m * Math.sin(s) * Math.sin(t),
            });
            for (let i = 0; i < 36; i++) {
              const a = pt((i * Math.PI) / 18);
              const b = pt(((i + 1) * Math.PI) / 18);
              lines.push({ x1: a.x, y1: a.y, x2: b.x, y2: b.y, role: 'adjusted' });
            }
          }
          sketch = [
            {
              title: `Plane network: standard error ellipses × ${k}`,
              view: 'plan',
              unit: u,
              north: true,
              caption: `x east, y north; error ellipses (standard, ${r.scale}) exaggerated ${k} times`,
              points: pts,
              lines,
              notes: [],
            },
          ];
        }
        return { results, checks, notes, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};
