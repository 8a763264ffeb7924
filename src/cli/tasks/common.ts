/**
 * Helpers shared by the task kinds.
 *
 * @module cli
 */
import type { Point } from '../../index.js';
import type { Env, JobPoint } from '../task.js';
import type { Input } from '../values.js';
import type { Schema } from '../validate.js';

/** A point of the job in a run's arithmetic (x = east, y = north). */
export function xy<V>(env: Env<V>, p: JobPoint): Point<V> {
  return { x: env.get(p.east), y: env.get(p.north) };
}

/** The inputs of a point's coordinates. */
export function pointInputs(p: JobPoint): Input[] {
  return [p.east, p.north];
}

/** The schema of a task kind: `kind` fixed, an optional `name`, the given properties. */
export function taskSchema(kind: string, required: string[], properties: Record<string, Schema>): Schema {
  return {
    type: 'object',
    required: ['kind', ...required],
    additionalProperties: false,
    properties: { kind: { const: kind }, name: { $ref: '#/$defs/name' }, ...properties },
  };
}

/** `m²` from `m`, `ft²` from `ft`, … */
export function squared(unit: string): string {
  return `${unit}²`;
}

/** Plain-number view of a value for sketches (the run's `num`). */
export function nums<V>(env: Env<V>, p: Point<V>): { x: number; y: number } {
  return { x: env.num(p.x), y: env.num(p.y) };
}
