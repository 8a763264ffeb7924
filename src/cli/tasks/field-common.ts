/**
 * What the field task kinds share: reading a station with its backsights, the corrections of
 * the distances, and turning the library's set-up into results, checks and a plan sketch.
 *
 * @module cli
 */
import { formatDms, orientStation, rational } from '../../index.js';
import type { Backsight, StationSetup } from '../../index.js';
import type { Env, JobContext, JobPoint, RawCheck, RawQuantity } from '../task.js';
import {
  angleText,
  inRange,
  lengthText,
  plain,
  readAngle,
  readLength,
  readNumber,
} from '../values.js';
import type { Input } from '../values.js';
import type { Schema } from '../validate.js';
import { pointInputs } from './common.js';

/** One reading towards a point: circle, zenith angle, slope, target height. */
export interface SightSpec {
  circle: Input;
  zenith?: Input;
  slope?: Input;
  targetHeight?: Input;
}

/** A backsight: a job point, its known level, and the readings to it. */
export interface BacksightSpec extends SightSpec {
  point: JobPoint;
  level?: Input;
}

/** The station part of a field task. */
export interface StationSpec {
  station: JobPoint;
  level?: Input;
  instrumentHeight?: Input;
  backsights: BacksightSpec[];
  ppm?: Input;
  prismConstant?: Input;
  curvature: boolean;
  tolerance: { angle?: string; distance?: string; height?: string };
}

const SIGHT_FIELDS: Record<string, Schema> = {
  circle: { $ref: '#/$defs/measuredAngle', description: 'Horizontal circle reading.' },
  zenith: {
    $ref: '#/$defs/measuredAngle',
    description: 'Zenith angle (face left below 180°, face right above).',
  },
  slope: { $ref: '#/$defs/measuredLength', description: 'Slope distance as displayed.' },
  targetHeight: {
    $ref: '#/$defs/measuredLength',
    description: 'Height of the target above the mark.',
  },
};

/** The schema of the station fields every field task has. */
export const STATION_FIELDS: Record<string, Schema> = {
  station: { $ref: '#/$defs/pointRef', description: 'The station (a point of the job).' },
  stationLevel: {
    $ref: '#/$defs/measuredLength',
    description: 'Level of the station mark (for levels of shots and zenith angles to set out).',
  },
  instrumentHeight: {
    $ref: '#/$defs/measuredLength',
    description: 'Height of the instrument above the station mark (default 0).',
  },
  backsights: {
    type: 'array',
    minItems: 1,
    maxItems: 100,
    description: 'Sights to known points that orient the circle.',
    items: {
      type: 'object',
      required: ['point', 'circle'],
      additionalProperties: false,
      properties: {
        point: { $ref: '#/$defs/pointRef' },
        level: { $ref: '#/$defs/measuredLength', description: 'The known level of the point.' },
        ...SIGHT_FIELDS,
      },
    },
  },
  ppm: {
    type: ['number', 'string'],
    description: 'Atmospheric correction of every slope distance, in ppm (default 0).',
    'x-describe': 'a number',
  },
  prismConstant: {
    $ref: '#/$defs/length',
    description: 'Prism constant added to every slope distance (signed; default 0).',
  },
  curvature: {
    type: 'boolean',
    description: 'Add curvature and refraction (k = 0.13) to height differences (default false).',
  },
  tolerance: {
    type: 'object',
    additionalProperties: false,
    description: 'Tolerances of the backsight residuals: angle, distance, height.',
    properties: {
      angle: { $ref: '#/$defs/angle' },
      distance: { $ref: '#/$defs/length' },
      height: { $ref: '#/$defs/length' },
    },
  },
};

/** The schema of one shot (a sight with a name). */
export const SHOT_SCHEMA: Schema = {
  type: 'object',
  required: ['circle', 'zenith', 'slope'],
  additionalProperties: false,
  properties: { name: { $ref: '#/$defs/name' }, ...SIGHT_FIELDS },
};

/** Reads the readings of one sight; `tag` names its inputs in budgets. */
export function readSight(
  s: Record<string, unknown>,
  path: string,
  ctx: JobContext,
  tag: string,
): SightSpec {
  const circle = inRange(
    readAngle(s.circle, `${path}.circle`, `${tag} circle`, 'circle reading'),
    `${path}.circle`,
    'circle reading',
    0,
    360,
    'lo',
  );
  const len = (k: string, what: string) =>
    s[k] === undefined
      ? {}
      : { [k]: readLength(s[k], `${path}.${k}`, ctx.unit, `${tag} ${what}`, what) };
  const zenith =
    s.zenith === undefined
      ? undefined
      : inRange(
          readAngle(s.zenith, `${path}.zenith`, `${tag} zenith`, 'zenith angle'),
          `${path}.zenith`,
          'zenith angle',
          0,
          360,
          'both',
        );
  return {
    circle,
    ...(zenith ? { zenith } : {}),
    ...len('slope', 'slope distance'),
    ...len('targetHeight', 'target height'),
  } as SightSpec;
}

/** Reads the station fields of a field task. */
export function readStation(
  task: Record<string, unknown>,
  path: string,
  ctx: JobContext,
): StationSpec {
  const station = ctx.point(task.station, `${path}.station`);
  const opt = (k: string, what: string) =>
    task[k] === undefined ? undefined : readLength(task[k], `${path}.${k}`, ctx.unit, what, what);
  const backsights = (task.backsights as Record<string, unknown>[]).map((b, i) => {
    const p = `${path}.backsights[${i}]`;
    const point = ctx.point(b.point, `${p}.point`);
    const sight = readSight(b, p, ctx, `backsight ${point.name}`);
    return {
      point,
      ...sight,
      ...(b.level !== undefined
        ? { level: readLength(b.level, `${p}.level`, ctx.unit, `${point.name} level`, 'level') }
        : {}),
    };
  });
  const tol = (task.tolerance ?? {}) as Record<string, unknown>;
  const level = opt('stationLevel', 'station level');
  const instrumentHeight = opt('instrumentHeight', 'instrument height');
  return {
    station,
    ...(level ? { level } : {}),
    ...(instrumentHeight ? { instrumentHeight } : {}),
    backsights,
    ...(task.ppm !== undefined ? { ppm: readNumber(task.ppm, `${path}.ppm`, 'ppm', 'ppm') } : {}),
    ...(task.prismConstant !== undefined
      ? {
          prismConstant: readLength(
            task.prismConstant,
            `${path}.prismConstant`,
            ctx.unit,
            'prism constant',
            'prism constant',
          ),
        }
      : {}),
    curvature: task.curvature === true,
    tolerance: {
      ...(tol.angle !== undefined
        ? { angle: angleText(tol.angle, `${path}.tolerance.angle`, 'tolerance') }
        : {}),
      ...(tol.distance !== undefined
        ? {
            distance: lengthText(tol.distance, `${path}.tolerance.distance`, ctx.unit, 'tolerance'),
          }
        : {}),
      ...(tol.height !== undefined
        ? { height: lengthText(tol.height, `${path}.tolerance.height`, ctx.unit, 'tolerance') }
        : {}),
    },
  };
}

/** Every input of a station spec. */
export function stationInputs(s: StationSpec): Input[] {
  return [
    ...pointInputs(s.station),
    ...(s.level ? [s.level] : []),
    ...(s.instrumentHeight ? [s.instrumentHeight] : []),
    ...s.backsights.flatMap((b) => [
      ...pointInputs(b.point),
      ...sightInputs(b),
      ...(b.level ? [b.level] : []),
    ]),
    ...(s.ppm ? [s.ppm] : []),
    ...(s.prismConstant ? [s.prismConstant] : []),
  ];
}

/** The inputs of one sight. */
export function sightInputs(s: SightSpec): Input[] {
  return [s.circle, s.zenith, s.slope, s.targetHeight].filter((x): x is Input => x !== undefined);
}

/** A sight's readings and the station's corrections as the library's observation fields. */
export function observation<V>(env: Env<V>, s: SightSpec, st: StationSpec, ctx: JobContext) {
  return {
    circle: env.get(s.circle),
    ...(s.zenith ? { zenith: env.get(s.zenith) } : {}),
    ...(s.slope ? { slope: env.get(s.slope) } : {}),
    ...(s.targetHeight ? { targetHeight: env.get(s.targetHeight) } : {}),
    ...(st.ppm ? { ppm: env.get(st.ppm) } : {}),
    ...(st.prismConstant ? { prismConstant: env.get(st.prismConstant) } : {}),
    ...(st.curvature ? { curvature: { unit: ctx.unit } } : {}),
  };
}

/** Orients the station in a run's arithmetic. */
export function setUp<V>(env: Env<V>, st: StationSpec, ctx: JobContext): StationSetup<V> {
  const A = env.A;
  const backsights: Backsight<V>[] = st.backsights.map((b) => ({
    name: b.point.name,
    point: {
      x: env.get(b.point.east),
      y: env.get(b.point.north),
      ...(b.level ? { z: env.get(b.level) } : {}),
    },
    ...observation(env, b, st, ctx),
  }));
  return orientStation(A, {
    station: {
      x: env.get(st.station.east),
      y: env.get(st.station.north),
      ...(st.level ? { z: env.get(st.level) } : {}),
    },
    ...(st.instrumentHeight ? { instrumentHeight: env.get(st.instrumentHeight) } : {}),
    backsights,
    tolerance: {
      ...(st.tolerance.angle ? { angle: A.mul(A.from(st.tolerance.angle), A.from(3600)) } : {}),
      ...(st.tolerance.distance ? { distance: A.from(st.tolerance.distance) } : {}),
      ...(st.tolerance.height ? { height: A.from(st.tolerance.height) } : {}),
    },
  });
}

/** The orientation and backsight residuals as results, and the set-up's checks. */
export function setupReport<V>(
  env: Env<V>,
  setup: StationSetup<V>,
  st: StationSpec,
  unitName: string,
): { results: RawQuantity<V>[]; checks: RawCheck<V>[]; notes: string[] } {
  const A = env.A;
  const results: RawQuantity<V>[] = [
    {
      name: 'orientation',
      label:
        "Orientation: the bearing of the circle's zero (equally weighted mean over the backsights)",
      unit: '°',
      value: setup.orientation,
      approx: true,
    },
  ];
  for (const b of setup.backsights) {
    results.push({
      name: `${b.name}.angle_residual`,
      label: `${b.name}: bearing − circle − orientation`,
      unit: '″',
      value: b.angleResidual,
      approx: true,
    });
    if (b.distanceResidual !== undefined)
      results.push({
        name: `${b.name}.distance_residual`,
        label: `${b.name}: measured − known horizontal distance`,
        unit: unitName,
        value: b.distanceResidual,
        approx: true,
      });
    if (b.heightResidual !== undefined)
      results.push({
        name: `${b.name}.height_residual`,
        label: `${b.name}: measured − known level`,
        unit: unitName,
        value: b.heightResidual,
        approx: true,
      });
  }
  const tolText = (q: string): { unit: string; text: string } => {
    if (q.endsWith(' angle'))
      return {
        unit: '″',
        text: `≤ ${plain(rational.toString(rational.mul(rational.from(st.tolerance.angle!), rational.from(3600))))}`,
      };
    const t = q.endsWith(' distance') ? st.tolerance.distance! : st.tolerance.height!;
    return { unit: unitName, text: `≤ ${plain(t)}` };
  };
  const checks: RawCheck<V>[] = setup.checks.map((c) => {
    const t = tolText(c.quantity);
    return {
      name: c.quantity.replace(/\s+/g, '_'),
      label: `Backsight residual: ${c.quantity}`,
      unit: t.unit,
      value: c.value,
      tolerance: t.text,
      pass: c.ok,
    };
  });
  const notes = [
    `Orientation ${formatDms(A, setup.orientation, 1)} (bearing = circle + orientation); x = east, y = north, bearings clockwise from north.`,
  ];
  if (setup.backsights.length === 1)
    notes.push('One backsight orients the circle with no check of it: sight a second known point.');
  return { results, checks, notes };
}
