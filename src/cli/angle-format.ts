/**
 * The job setting `"units": { "angles": "dd.mmss" }`: every angle the job schema marks as an
 * angle (`#/$defs/angle`), given as a number or plain numeric text, is read as degrees,
 * minutes and seconds packed as DD.MMSS (36.5027 = 36°50′27″) through the library's
 * `angleToDegrees(…, { format: 'dd.mmss' })`, before the tasks read it. Standard
 * uncertainties (`sigma`) are not angles in this sense: a number there stays arc-seconds.
 *
 * @module cli
 */
import { angleToDegrees, rational, QuadspreadError } from '../index.js';
import { JobInvalid } from './failure.js';
import { joinPath, resolve, validate } from './validate.js';
import type { Schema } from './validate.js';

const ANGLE = '#/$defs/angle';
const PLAIN = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)\s*$/;

/** The job with its DD.MMSS angles as exact decimal degrees (text); the job is not changed. */
export function unpackAngles(job: unknown, schema: Schema): unknown {
  return walk(job, schema, schema, '', false);
}

function convert(x: unknown, path: string): unknown {
  if (typeof x !== 'number' && !(typeof x === 'string' && PLAIN.test(x))) return x;
  try {
    return rational.toString(angleToDegrees(rational, x, { format: 'dd.mmss' }));
  } catch (e) {
    if (!(e instanceof QuadspreadError)) throw e;
    const m = /^quadspread [A-Z_]+: [^:]*: (.*)$/s.exec(e.message);
    throw new JobInvalid(path, m ? m[1]! : e.message);
  }
}

function walk(x: unknown, node: Schema, root: Schema, path: string, sigma: boolean): unknown {
  if (node.$ref === ANGLE) return sigma ? x : convert(x, path);
  const s = resolve(node, root);
  const union = (s.oneOf ?? s.anyOf) as Schema[] | undefined;
  if (Array.isArray(union)) {
    const kind =
      typeof x === 'object' && x !== null ? (x as Record<string, unknown>).kind : undefined;
    const branch =
      union.find((b) => {
        const k = (resolve(b, root).properties as Record<string, Schema> | undefined)?.kind;
        return kind !== undefined && k?.const === kind;
      }) ?? union.find((b) => validate(x, b, root).length === 0);
    if (branch) x = walk(x, branch, root, path, sigma);
  }
  if (Array.isArray(x) && s.items && typeof s.items === 'object')
    return x.map((v, i) => walk(v, s.items as Schema, root, `${path}[${i}]`, sigma));
  const props = s.properties as Record<string, Schema> | undefined;
  if (props && typeof x === 'object' && x !== null && !Array.isArray(x)) {
    // fromEntries defines own properties, whatever the keys are called.
    return Object.fromEntries(
      Object.entries(x).map(([k, v]) => {
        const p = Object.prototype.hasOwnProperty.call(props, k) ? props[k] : undefined;
        return [k, p ? walk(v, p, root, joinPath(path, k), sigma || k === 'sigma') : v];
      }),
    );
  }
  return x;
}
