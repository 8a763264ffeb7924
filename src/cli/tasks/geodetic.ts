/**
 * Task `geodetic`: geodetic latitude, longitude and height to Earth-centred coordinates
 * (X, Y, Z) or back, on GRS 80 or WGS 84, through the library's `geodeticToGeocentric` and
 * `geocentricToGeodetic`, with a round trip through the inverse as a computation check.
 *
 * @module cli
 */
import { formatDms, geocentricToGeodetic, geodeticToGeocentric, rational } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Env, RawCheck, RawQuantity, TaskKind } from '../task.js';
import { readAngle, readLength } from '../values.js';
import type { Input } from '../values.js';
import { taskSchema } from './common.js';

export const geodeticTask: TaskKind = {
  kind: 'geodetic',
  description:
    "Geodetic latitude, longitude and ellipsoidal height to geocentric X, Y, Z, or back (GRS 80 or WGS 84), with a round trip through the inverse as a computation check. Heights and X, Y, Z are in metres whatever the job's unit.",
  schema: taskSchema('geodetic', [], {
    ellipsoid: { enum: ['GRS80', 'WGS84'], description: 'The ellipsoid (default GRS80).' },
    geodetic: {
      type: 'object',
      required: ['lat', 'lon'],
      additionalProperties: false,
      properties: {
        lat: { $ref: '#/$defs/measuredAngle' },
        lon: { $ref: '#/$defs/measuredAngle' },
        h: { $ref: '#/$defs/measuredLength' },
      },
      description:
        'Latitude and longitude (degrees, DMS, with N/S/E/W), height above the ellipsoid in metres.',
    },
    geocentric: {
      type: 'object',
      required: ['X', 'Y', 'Z'],
      additionalProperties: false,
      properties: {
        X: { $ref: '#/$defs/measuredLength' },
        Y: { $ref: '#/$defs/measuredLength' },
        Z: { $ref: '#/$defs/measuredLength' },
      },
      description: 'Earth-centred coordinates in metres.',
    },
  }),
  prepare(task, path) {
    if ((task.geodetic === undefined) === (task.geocentric === undefined))
      throw new JobInvalid(path, 'give either "geodetic" or "geocentric" (one of them)');
    const ellipsoid = (task.ellipsoid as string | undefined) ?? 'GRS80';
    if (task.geodetic !== undefined) {
      const g = task.geodetic as Record<string, unknown>;
      hemisphere(g.lat, `${path}.geodetic.lat`, 'NS', 'latitude');
      hemisphere(g.lon, `${path}.geodetic.lon`, 'EW', 'longitude');
      const lat = readAngle(g.lat, `${path}.geodetic.lat`, 'latitude', 'latitude');
      if (rational.cmp(rational.abs(rational.from(lat.value)), rational.from(90)) > 0)
        throw new JobInvalid(
          `${path}.geodetic.lat`,
          `${JSON.stringify(g.lat)} is not a valid latitude: beyond ±90°`,
        );
      const lon = readAngle(g.lon, `${path}.geodetic.lon`, 'longitude', 'longitude');
      const h =
        g.h !== undefined
          ? readLength(g.h, `${path}.geodetic.h`, 'm', 'height', 'height')
          : { name: 'height', value: '0', angle: false };
      return {
        summary: `Geodetic to geocentric coordinates on ${ellipsoid}.`,
        inputs: [lat, lon, h],
        compute<V>(env: Env<V>) {
          const A = env.A;
          const p = geodeticToGeocentric(
            A,
            { lat: env.get(lat), lon: env.get(lon), h: env.get(h) },
            ellipsoid,
          );
          const results: RawQuantity<V>[] = [
            {
              name: 'X',
              label: 'X (toward longitude 0 on the equator)',
              unit: 'm',
              value: p.X,
              approx: true,
            },
            { name: 'Y', label: 'Y (toward 90° E)', unit: 'm', value: p.Y, approx: true },
            { name: 'Z', label: 'Z (toward the north pole)', unit: 'm', value: p.Z, approx: true },
          ];
          const back = geocentricToGeodetic(A, p, ellipsoid);
          const dh = A.abs(A.sub(back.h, env.get(h)));
          const dlat = A.abs(A.sub(back.lat, env.get(lat)));
          const checks: RawCheck<V>[] = [
            {
              name: 'round_trip',
              label: 'Round trip back to latitude (degrees) agrees',
              unit: '°',
              value: dlat,
              tolerance: '≤ 1e-9',
              pass: A.cmp(dlat, A.from('1e-9')) <= 0,
            },
            {
              name: 'round_trip_h',
              label: 'Round trip back to height agrees',
              unit: 'm',
              value: dh,
              tolerance: '≤ 0.0001',
              pass: A.cmp(dh, A.from('0.0001')) <= 0,
            },
          ];
          const notes = [
            `Latitude ${formatDms(rational, rational.from(lat.value), 4)}, longitude ${formatDms(rational, rational.from(lon.value), 4)} as read.`,
          ];
          return {
            results,
            ...computationChecks(
              checks,
              notes,
              'the round trip back to latitude and height agrees (within 1e-9° and 0.0001 m)',
            ),
            notes,
          };
        },
      };
    }
    const c = task.geocentric as Record<string, unknown>;
    const xyz: Input[] = (['X', 'Y', 'Z'] as const).map((k) =>
      readLength(c[k], `${path}.geocentric.${k}`, 'm', k, 'coordinate'),
    );
    return {
      summary: `Geocentric to geodetic coordinates on ${ellipsoid}.`,
      inputs: xyz,
      compute<V>(env: Env<V>) {
        const A = env.A;
        const [X, Y, Z] = xyz.map((x) => env.get(x)) as [V, V, V];
        const g = geocentricToGeodetic(A, { X, Y, Z }, ellipsoid);
        const results: RawQuantity<V>[] = [
          {
            name: 'lat',
            label: 'Latitude (north positive)',
            unit: '°',
            value: g.lat,
            approx: true,
          },
          {
            name: 'lon',
            label: 'Longitude (east positive)',
            unit: '°',
            value: g.lon,
            approx: true,
          },
          { name: 'h', label: 'Height above the ellipsoid', unit: 'm', value: g.h, approx: true },
        ];
        const back = geodeticToGeocentric(A, g, ellipsoid);
        const d = [A.sub(back.X, X), A.sub(back.Y, Y), A.sub(back.Z, Z)].reduce(
          (m, x) => (A.cmp(A.abs(x), m) > 0 ? A.abs(x) : m),
          A.zero,
        );
        const checks: RawCheck<V>[] = [
          {
            name: 'round_trip',
            label: 'Round trip back to X, Y, Z agrees (largest difference)',
            unit: 'm',
            value: d,
            tolerance: '≤ 0.0001',
            pass: A.cmp(d, A.from('0.0001')) <= 0,
          },
        ];
        const notes = env.drawing
          ? [`Latitude ${formatDms(A, g.lat, 4)}, longitude ${formatDms(A, g.lon, 4)}.`]
          : [];
        return {
          results,
          ...computationChecks(
            checks,
            notes,
            'the round trip back to X, Y, Z agrees (within 0.0001 m)',
          ),
          notes,
        };
      },
    };
  },
};

/**
 * A round trip through the inverse tests the library's computation, not the job's
 * coordinates, so it is not counted as a check on the survey: when every one holds it
 * becomes a note (pushed onto `notes`), and only one that fails is reported as a check.
 */
function computationChecks<V>(
  checks: RawCheck<V>[],
  notes: string[],
  agrees: string,
): { checks: RawCheck<V>[] } {
  const failed = checks.filter((c) => !c.pass);
  if (failed.length === 0)
    notes.push(`Computation check: ${agrees}; this tests the computation, not the coordinates.`);
  return { checks: failed };
}

/**
 * Refuses a hemisphere letter of the other axis (E or W on a latitude, N or S on a longitude):
 * latitude and longitude swapped. The runner reads angles to degrees itself, so the library's
 * own check of the letters never sees the text.
 */
function hemisphere(raw: unknown, path: string, allowed: string, what: string): void {
  const text = typeof raw === 'object' && raw !== null ? (raw as { value?: unknown }).value : raw;
  if (typeof text !== 'string') return;
  for (const m of [/^\s*([NSEW])/i.exec(text), /([NSEW])\s*$/i.exec(text)]) {
    const letter = m?.[1]!.toUpperCase();
    if (letter !== undefined && !allowed.includes(letter)) {
      throw new JobInvalid(
        path,
        `${JSON.stringify(text)} carries ${letter}, but a ${what} takes ${allowed[0]} or ${allowed[1]}: are latitude and longitude swapped?`,
      );
    }
  }
}
