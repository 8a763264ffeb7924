/**
 * Task `triangle`: every triangle with three given measures (sides, quadrances, angles or
 * spreads), through the library's `solveTriangle`; or the measures of a triangle of three
 * job points, through `triangle`.
 *
 * @module cli
 */
import {
  QuadspreadError,
  degreesFromSpread,
  solveTriangle,
  triangle,
  isSurd,
  surd,
} from '../../index.js';
import type { Arithmetic, Surd, Triangle } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, RawQuantity, RawTable, TaskKind, Value } from '../task.js';
import { inClosed, inRange, positive, readAngle, readLength, readNumber } from '../values.js';
import type { Input } from '../values.js';
import { nums, pointInputs, root, squared, taskSchema, xy } from './common.js';

type Known = {
  key: 'Q1' | 'Q2' | 'Q3' | 's1' | 's2' | 's3';
  form: 'side' | 'quadrance' | 'angle' | 'spread';
  input: Input;
};

const MEASURES: Record<string, { key: Known['key']; form: Known['form'] }> = {
  side1: { key: 'Q1', form: 'side' },
  side2: { key: 'Q2', form: 'side' },
  side3: { key: 'Q3', form: 'side' },
  Q1: { key: 'Q1', form: 'quadrance' },
  Q2: { key: 'Q2', form: 'quadrance' },
  Q3: { key: 'Q3', form: 'quadrance' },
  angle1: { key: 's1', form: 'angle' },
  angle2: { key: 's2', form: 'angle' },
  angle3: { key: 's3', form: 'angle' },
  s1: { key: 's1', form: 'spread' },
  s2: { key: 's2', form: 'spread' },
  s3: { key: 's3', form: 'spread' },
};

/** √x as a result: exact when x is a rational square (or the arithmetic is inexact), else rounded (flagged approx). */
function rootOf<V>(A: Arithmetic<V, boolean>, x: Value<V>): { value: Value<V>; approx: boolean } {
  if (isSurd(x)) {
    const r = x.toRational();
    if (r !== undefined) return root(A, r as V);
    // √(a + b√d) is not a surd of the same field: give the rounded value.
    return { value: A.from(Math.sqrt(x.toNumber())), approx: true };
  }
  return root(A, x as V);
}

function measures<V>(
  env: Env<V>,
  t: Record<string, Value<V>>,
  unit: string,
  tag: string,
): RawQuantity<V>[] {
  const A = env.A;
  const out: RawQuantity<V>[] = [];
  const which = tag === '' ? '' : `, solution ${tag.slice(1)}`;
  for (const i of [1, 2, 3])
    out.push({
      name: `Q${i}${tag}`,
      label: `Quadrance Q${i} (opposite A${i}${which})`,
      internal: true,
      unit: squared(unit),
      value: t[`Q${i}`]!,
    });
  for (const i of [1, 2, 3]) {
    const r = rootOf(A, t[`Q${i}`]!);
    out.push({
      name: `side${i}${tag}`,
      label: `Side ${i} (opposite A${i}${which})`,
      unit,
      value: r.value,
      approx: r.approx,
    });
  }
  for (const i of [1, 2, 3])
    out.push({
      name: `s${i}${tag}`,
      label: `Spread s${i} at A${i}${which ? ` (${which.slice(2)})` : ''}`,
      unit: '',
      value: t[`s${i}`]!,
    });
  out.push({
    name: `quadrea${tag}`,
    label: 'Quadrea (16·area²)',
    unit: `${unit}⁴`,
    value: t.quadrea!,
  });
  const q = rootOf(A, t.quadrea!);
  const area = isSurd(q.value) ? q.value.div(4) : A.div(q.value as V, A.from(4));
  out.push({
    name: `area${tag}`,
    label: `Area (√quadrea / 4${which})`,
    unit: squared(unit),
    value: area as Value<V>,
    approx: q.approx,
  });
  return out;
}

export const triangleTask: TaskKind = {
  kind: 'triangle',
  description:
    'Every triangle with three given measures (sides side1..3 or quadrances Q1..3, angles angle1..3 or spreads s1..3; index i is opposite vertex Ai), or the measures of the triangle of three points.',
  schema: taskSchema('triangle', [], {
    vertices: {
      type: 'array',
      minItems: 3,
      maxItems: 3,
      items: { $ref: '#/$defs/pointRef' },
      description: 'Three job points A1, A2, A3 (instead of "known").',
    },
    known: {
      type: 'object',
      additionalProperties: false,
      description: 'Exactly three measures, at least one a side or quadrance.',
      properties: {
        side1: { $ref: '#/$defs/measuredLength' },
        side2: { $ref: '#/$defs/measuredLength' },
        side3: { $ref: '#/$defs/measuredLength' },
        Q1: { type: ['number', 'string'] },
        Q2: { type: ['number', 'string'] },
        Q3: { type: ['number', 'string'] },
        angle1: { $ref: '#/$defs/measuredAngle' },
        angle2: { $ref: '#/$defs/measuredAngle' },
        angle3: { $ref: '#/$defs/measuredAngle' },
        s1: { type: ['number', 'string'] },
        s2: { type: ['number', 'string'] },
        s3: { type: ['number', 'string'] },
      },
    },
  }),
  prepare(task, path, ctx) {
    const unit = ctx.unitName;
    if (Array.isArray(task.vertices) === (task.known !== undefined)) {
      throw new JobInvalid(
        path,
        'a triangle task needs either "vertices" (three points) or "known" (three measures), not both or neither',
      );
    }
    if (Array.isArray(task.vertices)) {
      const v = (task.vertices as unknown[]).map((n, i) => ctx.point(n, `${path}.vertices[${i}]`));
      return {
        summary: `Measures of the triangle ${v.map((p) => p.name).join(' ')} (A1 A2 A3).`,
        inputs: v.flatMap(pointInputs),
        compute(env) {
          const [P1, P2, P3] = v.map((p) => xy(env, p)) as [
            ReturnType<typeof xy<typeof env.A.zero>>,
            ReturnType<typeof xy<typeof env.A.zero>>,
            ReturnType<typeof xy<typeof env.A.zero>>,
          ];
          const t = triangle(env.A, P1, P2, P3);
          const sketch = env.drawing
            ? [
                triangleSketch(
                  `Triangle ${v.map((p) => p.name).join(' ')}`,
                  [P1, P2, P3].map((p) => nums(env, p)),
                  v.map((p) => p.name),
                ),
              ]
            : undefined;
          return {
            results: measures(
              env,
              t as unknown as Record<string, Value<typeof env.A.zero>>,
              unit,
              '',
            ),
            checks: [],
            notes: [],
            ...(sketch ? { sketch } : {}),
          };
        },
      };
    }
    const known: Known[] = [];
    for (const [field, raw] of Object.entries(task.known as Record<string, unknown>)) {
      const m = MEASURES[field]!;
      const p = `${path}.known.${field}`;
      if (known.some((k) => k.key === m.key))
        throw new JobInvalid(p, `gives ${m.key} a second time`);
      const input =
        m.form === 'side'
          ? positive(readLength(raw, p, ctx.unit, field, 'side'), p, 'side')
          : m.form === 'angle'
            ? inRange(
                readAngle(raw, p, field, 'angle of a triangle'),
                p,
                'angle of a triangle',
                0,
                180,
                'both',
              )
            : m.form === 'spread'
              ? inClosed(readNumber(raw, p, field, 'spread'), p, 'spread', 0, 1)
              : inClosed(readNumber(raw, p, field, 'quadrance'), p, 'quadrance', 0);
      known.push({ key: m.key, form: m.form, input });
    }
    if (known.length !== 3)
      throw new JobInvalid(
        `${path}.known`,
        `gives ${known.length} measure${known.length === 1 ? '' : 's'}; a triangle needs exactly three`,
      );
    if (!known.some((k) => k.key.startsWith('Q')))
      throw new JobInvalid(
        `${path}.known`,
        'three angles fix a triangle only up to scale: give at least one side',
      );
    return {
      summary: `Triangles with ${known.map((k) => k.key).join(', ')} given.`,
      inputs: known.map((k) => k.input),
      compute(env) {
        const A = env.A;
        const given: Record<string, typeof A.zero> = {};
        // Sides and angles go to the library as they are: solveTriangle reads them into Q and s.
        const field = (k: Known): string =>
          k.form === 'side' ? `side${k.key[1]}` : k.form === 'angle' ? `angle${k.key[1]}` : k.key;
        for (const k of known) given[field(k)] = env.get(k.input);
        let solutions = solveTriangle(A, given);
        // A spread does not tell an angle from its supplement, but the job gave the angle:
        // keep the triangles whose angle there is acute, right or obtuse as given, by the sign
        // of Qj + Qk − Qi (the cross law: Qi = Qj + Qk − 2√(Qj Qk)·cos θ).
        const angles = known.filter((k) => k.form === 'angle');
        if (solutions.length > 1 && angles.length > 0) {
          const kept = solutions.filter((t) =>
            angles.every((k) => {
              const i = Number(k.key[1]) as 1 | 2 | 3;
              // cos θ of the given angle; within 1e-9 of a right angle neither triangle is
              // preferred (the same rule in every arithmetic, so their reports agree).
              const cos = Math.cos((env.num(env.get(k.input)) * Math.PI) / 180);
              return Math.abs(cos) <= 1e-9 || crossSign(A, t, i) === Math.sign(cos);
            }),
          );
          if (kept.length > 0) solutions = kept;
        }
        if (solutions.length === 0) {
          throw new QuadspreadError(
            'NO_REAL_SOLUTION',
            'triangle task',
            `no proper triangle has ${known.map((k) => `${field(k)} = ${A.toPrecision(given[field(k)]!, 8)}`).join(', ')}`,
          );
        }
        const results = solutions.flatMap((t, i) =>
          measures(
            env,
            t as unknown as Record<string, Value<typeof A.zero>>,
            unit,
            solutions.length > 1 ? `.${i + 1}` : '',
          ),
        );
        const notes =
          solutions.length > 1
            ? [
                `Two triangles fit these measures (solutions 1 and 2, keys ending .1 and .2 in JSON; the one that needed the minus sign of the square root first): an angle that was not given can be acute or obtuse (a spread does not tell an angle from its supplement), so say which one the field work saw.`,
              ]
            : [];
        let sketch;
        if (env.drawing) {
          sketch = solutions.map((t, i) => {
            // Draw A1 at the origin, A2 along east: |A1A2|² = Q3, |A1A3|² = Q2.
            const q2 = env.num(t.Q2),
              q3 = env.num(t.Q3),
              s1 = env.num(t.s1);
            const c = Math.sqrt(q3),
              b = Math.sqrt(q2);
            const cos = (q2 + q3 - env.num(t.Q1)) / (2 * b * c); // cross law in cosine form, for the drawing only
            return triangleSketch(
              `Triangle${solutions.length > 1 ? ` (solution ${i + 1})` : ''}`,
              [
                { x: 0, y: 0 },
                { x: c, y: 0 },
                { x: b * cos, y: b * Math.sqrt(Math.max(0, s1)) },
              ],
              ['A1', 'A2', 'A3'],
              'shape only: A1 A2 drawn across, A3 above',
            );
          });
        }
        const tables = env.drawing
          ? solutions.map((t, i) =>
              triangleTable(
                A,
                t as unknown as Triangle<Value<typeof A.zero>>,
                unit,
                solutions.length > 1 ? ` (solution ${i + 1})` : '',
              ),
            )
          : [];
        return { results, checks: [], notes, tables, ...(sketch ? { sketch } : {}) };
      },
    };
  },
};

/** A value or surd as a value of the arithmetic (a surd through 40 significant digits). */
function valueOf<V>(A: Arithmetic<V, boolean>, x: Value<V>): V {
  return isSurd(x) ? A.from(x.toPrecision(40)) : (x as V);
}

/**
 * The triangle's solution sheet: at each vertex its angle (from the spread, obtuse where
 * Qj + Qk < Qi by the cross law), its spread, and the side opposite.
 */
function triangleTable<V>(
  A: Arithmetic<V, boolean>,
  t: Triangle<Value<V>>,
  unit: string,
  which: string,
): RawTable<V> {
  const Q = [t.Q1, t.Q2, t.Q3];
  const s = [t.s1, t.s2, t.s3];
  const rows = ([1, 2, 3] as const).map((i) => {
    const acute = degreesFromSpread(A, valueOf(A, s[i - 1]!));
    const angle = crossSign(A, t, i) < 0 ? A.sub(A.from(180), acute) : acute;
    return [
      `A${i}`,
      angle,
      s[i - 1],
      `side ${i} (A${(i % 3) + 1}–A${((i + 1) % 3) + 1})`,
      root(A, valueOf(A, Q[i - 1]!)).value,
    ];
  });
  return {
    name: `triangle${which ? which.replace(/\D/g, '') : ''}`,
    title: `Triangle solution${which}`,
    columns: [
      { label: 'Vertex' },
      { label: 'Angle', kind: 'angle' },
      { label: 'Spread', kind: 'number' },
      { label: 'Opposite' },
      { label: 'Side', kind: 'length', unit },
    ],
    rows,
    notes: [
      'Each angle is read from its spread (s = sin²θ) and is obtuse where the cross law says so (Qj + Qk < Qi).',
    ],
  };
}

/** The sign of Qj + Qk − Qi in triangle t ({i, j, k} = {1, 2, 3}): + acute at Ai, 0 right, − obtuse. */
function crossSign<V>(A: Arithmetic<V, boolean>, t: Triangle<Value<V>>, i: 1 | 2 | 3): number {
  const Q = [t.Q1, t.Q2, t.Q3];
  const [qi, qj, qk] = [Q[i - 1]!, Q[i % 3]!, Q[(i + 1) % 3]!];
  if (A.exact) {
    // Exact surds: the sign is decided exactly.
    const asSurd = (x: Value<V>): Surd<V> => (isSurd(x) ? x : surd(A, x as V));
    return asSurd(qj).add(qk).sub(qi).sign();
  }
  // Qj + Qk − Qi = 2√(Qj Qk)·cos θ: its sign, counted as 0 where |cos θ| ≤ 1e-9 (rounding).
  const d = A.toNumber(A.sub(A.add(qj as V, qk as V), qi as V));
  return Math.abs(d) <= 2e-9 * Math.sqrt(A.toNumber(qj as V) * A.toNumber(qk as V))
    ? 0
    : Math.sign(d);
}

function triangleSketch(
  title: string,
  p: { x: number; y: number }[],
  names: string[],
  caption?: string,
) {
  return {
    title,
    view: 'plan' as const,
    ...(caption ? { caption } : {}),
    points: p.map((q, i) => ({ name: names[i]!, ...q, role: 'control' as const })),
    lines: p.map((q, i) => ({
      x1: q.x,
      y1: q.y,
      x2: p[(i + 1) % 3]!.x,
      y2: p[(i + 1) % 3]!.y,
      role: 'boundary' as const,
    })),
    notes: [],
  };
}
