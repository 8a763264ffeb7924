/**
 * Points in from CSV, GeoJSON or LandXML files (`run --points`), and results out as GeoJSON,
 * LandXML or a CSV point file (`--export`), through the io entry.
 *
 * @module cli
 */
import {
  METRES_PER_UNIT,
  QuadspreadError,
  rational,
  type Arithmetic,
  type DatumTransformation,
  type LengthUnit,
} from '../index.js';
import {
  METRES_PER_LANDXML_UNIT,
  dataFormatOf,
  pointsFromFile,
  pointsToCsv,
  readLandXml,
  toGeoJson,
  toLandXml,
  type ExchangePoint,
  type LandXmlAlignmentInput,
  type LandXmlWriteUnit,
  type ExchangePointInput,
  type GeoJsonContent,
  type Wgs84Reference,
} from '../io/index.js';
import { JobInvalid } from './failure.js';
import type { Report } from './report.js';

const R = rational;
type Rat = ReturnType<typeof R.from>;

/** The reference-system options of the command line. */
export interface GridOptions {
  /** `--grid`: an EPSG code of the table. */
  grid?: string;
  /** `--to-wgs84`: `coincident`, or the text of a JSON file `{ method, parameters, direction? }`. */
  toWgs84?: string;
  /** `--plane`: GeoJSON of plane coordinates (not RFC 7946). */
  plane?: boolean;
}

/** Reads `--to-wgs84`: `coincident` or a JSON transformation (text already read). */
function reference(
  o: GridOptions,
  readFile: (f: string) => string,
): Wgs84Reference<Rat> | undefined {
  if (o.grid === undefined) {
    if (o.toWgs84 !== undefined) throw new JobInvalid('--to-wgs84', 'give --grid too');
    return undefined;
  }
  let toWgs84: Wgs84Reference<Rat>['toWgs84'];
  if (o.toWgs84 === 'coincident') toWgs84 = 'coincident';
  else if (o.toWgs84 !== undefined) {
    try {
      toWgs84 = JSON.parse(readFile(o.toWgs84)) as DatumTransformation<Rat>;
    } catch (e) {
      if (e instanceof JobInvalid) throw e;
      throw new JobInvalid(
        '--to-wgs84',
        `${JSON.stringify(o.toWgs84)} is not JSON: ${(e as Error).message}`,
      );
    }
  }
  return { grid: o.grid, ...(toWgs84 === undefined ? {} : { toWgs84 }) };
}

/** A QuadspreadError of the io entry as a refusal of the command line option. */
function asInvalid(option: string, e: unknown): unknown {
  return e instanceof QuadspreadError ? new JobInvalid(option, e.message) : e;
}

/** Exact decimal text of a rational (40 significant digits at most), for the job. */
function text(x: Rat): string {
  const t = R.toPrecision(x, 40);
  return t.includes('.') && !/e/i.test(t) ? t.replace(/0+$/, '').replace(/\.$/, '') : t;
}

/**
 * Adds the points of a file (CSV or GeoJSON) to the job's `points`: a point already in the job
 * with other coordinates is refused, naming it.
 */
export function loadPoints(
  job: unknown,
  file: string,
  content: string,
  o: GridOptions,
  readFile: (f: string) => string,
): unknown {
  const ref = reference(o, readFile);
  let pts: ExchangePoint<Rat>[];
  try {
    if (dataFormatOf(file, content.slice(0, 512)) === 'landxml') pts = landXmlPoints(job, content);
    else
      pts = pointsFromFile(R, file, content, {
        geojson: o.plane ? { coordinates: 'plane' } : ref === undefined ? {} : { reference: ref },
      });
  } catch (e) {
    throw asInvalid('--points', e);
  }
  const j = (typeof job === 'object' && job !== null ? job : {}) as {
    points?: Record<string, unknown>;
  };
  const points: Record<string, unknown> = { ...(j.points ?? {}) };
  for (const p of pts) {
    const entry = { east: text(p.x), north: text(p.y) };
    const had = points[p.name] as { east?: unknown; north?: unknown } | undefined;
    if (had !== undefined) {
      const same = (a: unknown, b: string) => {
        try {
          return R.eq(
            R.from(
              typeof a === 'object' && a !== null ? (a as { value: never }).value : (a as never),
            ),
            R.from(b),
          );
        } catch {
          return false;
        }
      };
      if (!same(had.east, entry.east) || !same(had.north, entry.north))
        throw new JobInvalid(
          '--points',
          `the point ${JSON.stringify(p.name)} of ${JSON.stringify(file)} is in the job with other coordinates`,
        );
      continue;
    }
    points[p.name] = entry;
  }
  return { ...j, points };
}

/** The job's length unit (`units.length`, default m). */
function jobUnit(job: unknown): LengthUnit {
  const u = (job as { units?: { length?: unknown } } | null)?.units?.length;
  return typeof u === 'string' && Object.hasOwn(METRES_PER_UNIT, u) ? (u as LengthUnit) : 'm';
}

/** The CgPoints of a LandXML file, converted exactly from the file's units to the job's. */
function landXmlPoints(job: unknown, content: string): ExchangePoint<Rat>[] {
  const doc = readLandXml(R, content);
  if (doc.points.length === 0)
    throw new JobInvalid(
      '--points',
      'the LandXML file has no CgPoint (points are read from CgPoints)',
    );
  const to = R.from(METRES_PER_UNIT[jobUnit(job)]);
  const f = R.div(R.from(METRES_PER_LANDXML_UNIT[doc.units!.linear]), to);
  const fh = R.div(R.from(METRES_PER_LANDXML_UNIT[doc.units!.elevation]), to);
  return doc.points.map((p) => ({
    name: p.name,
    x: R.mul(p.x, f),
    y: R.mul(p.y, f),
    ...(p.height !== undefined ? { height: R.mul(p.height, fh) } : {}),
    ...(p.code !== undefined ? { code: p.code } : {}),
  }));
}

const LANDXML_UNITS: Partial<Record<LengthUnit, LandXmlWriteUnit>> = {
  m: 'meter',
  ft: 'foot',
  'us-ft': 'USSurveyFoot',
};

/**
 * The report as a LandXML document: points, parcels, traverses (as plan features), and the
 * alignments of the alignment tasks.
 */
function landXmlText(r: Report, job: unknown, content: GeoJsonContent<Rat>): string {
  const unit = LANDXML_UNITS[jobUnit(job)];
  if (unit === undefined)
    throw new JobInvalid(
      '--export landxml',
      `the job's lengths are in ${r.lengthUnit}: LandXML is written for jobs in m, ft or us-ft`,
    );
  const withGeometry = r.tasks.filter((t) => t.exchange?.alignment !== undefined);
  const A = (withGeometry[0]?.exchange?.A ?? R) as Arithmetic<unknown, boolean>;
  const alignments: LandXmlAlignmentInput<unknown>[] = withGeometry.map((t) => ({
    name: t.name,
    horizontal: t.exchange!.alignment!.horizontal,
    ...(t.exchange!.alignment!.vertical ? { vertical: t.exchange!.alignment!.vertical } : {}),
  }));
  const date = r.header?.date !== undefined ? new Date(`${r.header.date}T00:00:00Z`) : new Date();
  return toLandXml(
    A,
    {
      points: (content.points ?? []) as never,
      parcels: (content.parcels ?? []) as never,
      alignments,
      // traverses as plan features (alignments go as their geometry above)
      lines: (content.lines ?? [])
        .filter((l) => l.kind !== 'alignment' && 'points' in l)
        .map((l) => ({
          name: l.name,
          code: l.kind ?? 'line',
          points: (l as unknown as { points: never }).points,
        })),
    },
    {
      linearUnit: unit,
      ...(Number.isNaN(date.getTime()) ? {} : { date }),
      application: {
        name: 'quadspread',
        ...(r.header?.program !== undefined
          ? { version: r.header.program.replace(/^quadspread\s*/, '') }
          : {}),
      },
    },
  );
}

const GRID_TASKS = new Set(['traverse', 'resection', 'intersection', 'plane-network']);

/** The job's points, exactly as written (the value of a measured coordinate). */
function jobPoints(job: unknown): Map<string, { x: string; y: string }> {
  const out = new Map<string, { x: string; y: string }>();
  const pts =
    (job as { points?: Record<string, { east?: unknown; north?: unknown }> }).points ?? {};
  const v = (c: unknown) =>
    String(typeof c === 'object' && c !== null ? (c as { value: unknown }).value : c);
  for (const [name, p] of Object.entries(pts)) out.set(name, { x: v(p.east), y: v(p.north) });
  return out;
}

/**
 * What a report holds for the exchange formats: the job's points (exact), the points the
 * tasks computed (from their plan sketches, as JS numbers), each traverse as a line through
 * its adjusted points, each alignment's centre line, and each parcel (area task).
 */
export function exportContent(r: Report, job: unknown): GeoJsonContent<Rat> {
  const known = jobPoints(job);
  const points: ExchangePointInput<Rat>[] = [...known].map(([name, p]) => ({
    name,
    x: p.x,
    y: p.y,
  }));
  const seen = new Set(known.keys());
  const lines: {
    name: string;
    kind: string;
    points: { x: number | string; y: number | string }[];
  }[] = [];
  const parcels: { name: string; points: { x: number | string; y: number | string }[] }[] = [];
  for (const t of r.tasks) {
    const plan = t.sketch?.find((s) => s.view === 'plan');
    if (!plan) continue;
    // Points in the job's plane coordinates: those the coordinate tasks compute (the sketches
    // of the height tasks are drawn in their own local frames).
    if (GRID_TASKS.has(t.kind))
      for (const p of plan.points)
        if ((p.role === 'computed' || p.role === 'station') && !seen.has(p.name)) {
          seen.add(p.name);
          points.push({ name: p.name, x: p.x, y: p.y });
        }
    const chain = (roles: string[]) => {
      const ls = plan.lines.filter((l) => roles.includes(l.role));
      return ls.length === 0
        ? []
        : [{ x: ls[0]!.x1, y: ls[0]!.y1 }, ...ls.map((l) => ({ x: l.x2, y: l.y2 }))];
    };
    if (t.kind === 'traverse') {
      const adjusted = chain(['adjusted']);
      if (adjusted.length > 1) lines.push({ name: t.name, kind: 'traverse', points: adjusted });
    } else if (t.kind === 'alignment') {
      const centre = chain(['straight', 'arc', 'transition']);
      if (centre.length > 1) lines.push({ name: t.name, kind: 'alignment', points: centre });
    } else if (t.kind === 'area') {
      const corners = plan.points.map((p) => {
        const exact = known.get(p.name);
        return exact ?? { x: p.x, y: p.y };
      });
      if (corners.length >= 3) parcels.push({ name: t.name, points: corners });
    }
  }
  return { points, lines, parcels };
}

/** The text of `--export <format>` for a report. */
export function exportText(
  format: string,
  r: Report,
  job: unknown,
  o: GridOptions & { csvMode?: 'exchange' | 'spreadsheet'; lengthUnit?: string },
  readFile: (f: string) => string,
): string {
  const content = exportContent(r, job);
  try {
    if (format === 'csv')
      return pointsToCsv(R, content.points ?? [], { mode: o.csvMode ?? 'spreadsheet' });
    if (format === 'landxml') return landXmlText(r, job, content);
    if (format === 'geojson') {
      const ref = reference(o, readFile);
      if (!o.plane && r.lengthUnit !== 'm' && ref !== undefined)
        throw new JobInvalid(
          '--grid',
          `the job's coordinates are in ${r.lengthUnit}: GeoJSON through a grid needs metres (or --plane)`,
        );
      const fc = toGeoJson(R, content, {
        ...(ref === undefined ? {} : { reference: ref }),
        coordinates: o.plane ? 'plane' : 'wgs84',
      });
      return JSON.stringify(fc, null, 1) + '\n';
    }
  } catch (e) {
    throw asInvalid(`--export ${format}`, e);
  }
  throw new JobInvalid('--export', `${JSON.stringify(format)} is not geojson, landxml or csv`);
}
