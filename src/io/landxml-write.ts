/**
 * LandXML 1.2 out: `CgPoints`, `Parcels` (boundary and area) and `Alignments` (horizontal
 * geometry from `horizontalAlignment` and the profile from `verticalAlignment`).
 *
 * @module io
 */
import {
  QuadspreadError,
  sinCosDegrees,
  type Arithmetic,
  type HorizontalAlignment,
  type Numeric,
  type VerticalAlignment,
} from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import { contentList, parcelRing } from './content.js';
import { fixedText } from './numbers.js';
import type { ExchangePointInput } from './point.js';
import type { PlaneVertex } from './geojson-write.js';

/** A point to write as a `CgPoint`: an exchange point with an optional description. */
export interface LandXmlPointInput<T> extends ExchangePointInput<T> {
  /** Written as `desc`. */
  readonly description?: string;
}

/** A parcel to write: its boundary's vertices in order (either way round), and a description. */
export interface LandXmlParcelInput<T> {
  /** The parcel's name. */
  readonly name: string;
  /** The boundary's vertices (the closing vertex may be repeated or not). */
  readonly points: readonly PlaneVertex<T>[];
  /** Written as `desc`. */
  readonly description?: string;
}

/** A line to write as a `PlanFeature` (a traverse, a fence, any polyline) by its vertices. */
export interface LandXmlLineInput<T> {
  /** The line's name. */
  readonly name: string;
  /** Its vertices, two or more, in order. */
  readonly points: readonly PlaneVertex<T>[];
  /** Written as `code` (e.g. `traverse`). */
  readonly code?: string;
  /** Written as `desc`. */
  readonly description?: string;
}

/** An alignment to write: the horizontal alignment, and its profile when there is one. */
export interface LandXmlAlignmentInput<T> {
  /** The alignment's name. */
  readonly name: string;
  /** From `horizontalAlignment`. */
  readonly horizontal: HorizontalAlignment<T>;
  /** From `verticalAlignment` (chainages on the same line). */
  readonly vertical?: VerticalAlignment<T>;
  /** Written as `desc`. */
  readonly description?: string;
}

/** What {@link toLandXml} writes: points, parcels and alignments, each list optional. */
export interface LandXmlContent<T> {
  /** Points, as `CgPoints/CgPoint`. */
  readonly points?: readonly LandXmlPointInput<T>[];
  /** Parcels, as `Parcels/Parcel` with a `CoordGeom` of lines and the area. */
  readonly parcels?: readonly LandXmlParcelInput<T>[];
  /** Alignments, as `Alignments/Alignment` with `CoordGeom`, `StaEquation` and `Profile`. */
  readonly alignments?: readonly LandXmlAlignmentInput<T>[];
  /** Traverses and other polylines, as `PlanFeatures/PlanFeature` with a `CoordGeom` of lines. */
  readonly lines?: readonly LandXmlLineInput<T>[];
}

/** A linear unit the writer states: the unit the given values are in. */
export type LandXmlWriteUnit = 'meter' | 'foot' | 'USSurveyFoot';

/**
 * Options of {@link toLandXml}: `linearUnit` — the unit the values are in, written in `Units`
 * (`'meter'`, the default, `'foot'` or `'USSurveyFoot'`); `decimals` of lengths and
 * coordinates (0 to 12, default 4); `date` of
 * the file (default: now), written in UTC; `application`: the `Application` element's name and
 * version (default `quadspread`).
 */
export interface LandXmlWriteOptions {
  /** The unit of the values (default `'meter'`). */
  readonly linearUnit?: LandXmlWriteUnit;
  /** Decimals of lengths and coordinates (default 4). */
  readonly decimals?: number;
  /** The file's date and time (default: now). */
  readonly date?: Date;
  /** The writing program. */
  readonly application?: { readonly name: string; readonly version?: string };
}

const UNITS: Record<LandXmlWriteUnit, string> = {
  meter:
    '<Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter" temperatureUnit="celsius" pressureUnit="milliBars" angularUnit="decimal degrees" directionUnit="decimal degrees"/>',
  foot: '<Imperial linearUnit="foot" areaUnit="squareFoot" volumeUnit="cubicFeet" temperatureUnit="fahrenheit" pressureUnit="inchHG" angularUnit="decimal degrees" directionUnit="decimal degrees"/>',
  USSurveyFoot:
    '<Imperial linearUnit="USSurveyFoot" areaUnit="squareFoot" volumeUnit="cubicFeet" temperatureUnit="fahrenheit" pressureUnit="inchHG" angularUnit="decimal degrees" directionUnit="decimal degrees"/>',
};

/**
 * Text for XML: `&`, `<`, `>`, `"` escaped, and tab, line feed and carriage return as
 * character references (so that attribute values keep them); other control characters cannot
 * be written in XML 1.0 and are refused.
 */
function xmlText(s: string, where: string): string {
  // eslint-disable-next-line no-control-regex
  const bad = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/.exec(s);
  if (bad)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      where,
      `${show(s)} holds the control character U+${bad[0].charCodeAt(0).toString(16).padStart(4, '0').toUpperCase()}, which XML 1.0 cannot carry`,
    );
  return s
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/\t/g, '&#9;')
    .replace(/\n/g, '&#10;')
    .replace(/\r/g, '&#13;');
}

/**
 * Points, parcels and alignments as a LandXML 1.2 document (the published schema,
 * `http://www.landxml.org/schema/LandXML-1.2`).
 *
 * - **Points** → `CgPoints/CgPoint` with `name`, `code`, `desc`; the text is **northing
 *   easting** and the elevation when given (the schema's order — y before x).
 * - **Parcels** → `Parcels/Parcel` with `name` and `area` (plane area in the unit squared,
 *   from the coordinates), the boundary as a `CoordGeom` of `Line`s, closed.
 * - **Alignments** → `Alignments/Alignment` with `name`, `length` and `staStart`; a
 *   `CoordGeom` of `Line`, `Curve` (`crvType="arc"`, `rot`, `radius`, `length`, and `Start`,
 *   `Center`, `End`) and `Spiral` (`spiType="clothoid"`, `radiusStart`/`radiusEnd` with `INF`
 *   at the tangent, `Start`, `PI` — where the tangents at its ends meet — and `End`); a
 *   `StaEquation` per chainage equation; and with a profile, `Profile/ProfAlign` of `PVI`,
 *   `ParaCurve` and `UnsymParaCurve` (text: station and elevation).
 * - **Lines** (traverses, any polyline) → `PlanFeatures/PlanFeature` with `name`, `code`,
 *   `desc` and a `CoordGeom` of `Line`s from vertex to vertex.
 *
 * Values are rounded exactly to `decimals`; no direction attributes are written (the
 * geometry is fixed by the points). Names and descriptions are written as they are, escaped for XML, so that
 * {@link readLandXml} gives them back unchanged.
 *
 * @param A the arithmetic of the values
 * @param content `{ points?, parcels?, alignments?, lines? }`
 * @param options `{ linearUnit?, decimals?, date?, application? }`
 * @returns the document's text
 * @throws {@link QuadspreadError} `INVALID_ARGUMENT` for bad content or options, a missing or
 *   repeated name, a parcel that encloses no area, or text XML cannot carry;
 *   `TOO_FEW_POINTS` for a parcel of fewer than three vertices; `INVALID_UNIT` for a unit not
 *   written here.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { toLandXml } from 'quadspread/io';
 * const xml = toLandXml(rational, { points: [{ name: 'CP1', x: '2000.5', y: '5000.25', height: 101.3 }] }, { date: new Date('2026-12-03T09:00:00Z') });
 * xml.split('\n').find((l) => l.includes('<CgPoint '));
 * //=> '    <CgPoint name="CP1">5000.25 2000.5 101.3</CgPoint>'
 * ```
 */
export function toLandXml<T>(
  A: Arithmetic<T, boolean>,
  content: LandXmlContent<T>,
  options: LandXmlWriteOptions = {},
): string {
  const where = 'toLandXml';
  checkArithmetic(A, where);
  const o = (options ?? {}) as LandXmlWriteOptions;
  if (typeof o !== 'object')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options)`,
      `${show(o)} is not an object`,
    );
  const unit = o.linearUnit ?? 'meter';
  if (!Object.hasOwn(UNITS, unit))
    throw new QuadspreadError(
      'INVALID_UNIT',
      `${where}(options.linearUnit)`,
      `${show(unit)} is not a unit written here ('meter', 'foot', 'USSurveyFoot')`,
    );
  const decimals = o.decimals ?? 4;
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 12)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.decimals)`,
      `${show(decimals)} is not a whole number from 0 to 12`,
    );
  const date = o.date ?? new Date();
  if (!(date instanceof Date) || Number.isNaN(date.getTime()))
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.date)`,
      `${show(date)} is not a date`,
    );
  const app = o.application ?? { name: 'quadspread' };
  if (typeof app !== 'object' || app === null || typeof app.name !== 'string' || app.name === '')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.application)`,
      `${show(app)} is not { name, version? }`,
    );
  if (typeof content !== 'object' || content === null)
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(content)`,
      `${show(content)} is not { points?, parcels?, alignments?, lines? }`,
    );

  const list = <X>(v: readonly X[] | undefined, what: string): readonly X[] =>
    contentList(v, where, what);
  const item = <X>(v: X, at: string, shape: string): X => {
    if (typeof v !== 'object' || v === null)
      throw new QuadspreadError('INVALID_ARGUMENT', at, `${show(v)} is not ${shape}`);
    return v;
  };
  const nameOf = (x: { name?: unknown }, at: string, seen: Set<string>): string => {
    const name = x.name;
    if (typeof name !== 'string' || name === '')
      throw new QuadspreadError('INVALID_ARGUMENT', `${at}.name`, `${show(name)} is not a name`);
    if (seen.has(name))
      throw new QuadspreadError(
        'INVALID_ARGUMENT',
        `${at}.name`,
        `the name ${show(name)} is used twice`,
      );
    seen.add(name);
    return xmlText(name, `${at}.name`);
  };
  const len = (v: Numeric<T> | T) => fixedText(A, A.from(v as T), decimals);
  const attr = (k: string, v: unknown, at: string) => {
    if (v === undefined) return '';
    if (typeof v !== 'string')
      throw new QuadspreadError('INVALID_ARGUMENT', `${at}.${k}`, `${show(v)} is not text`);
    return ` ${k}="${xmlText(v, `${at}.${k}`)}"`;
  };
  const ne = (p: { x: Numeric<T> | T; y: Numeric<T> | T }) => `${len(p.y)} ${len(p.x)}`;

  const pad = (n: number) => String(n).padStart(2, '0');
  const out: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xsi:schemaLocation="http://www.landxml.org/schema/LandXML-1.2 http://www.landxml.org/schema/LandXML-1.2/LandXML-1.2.xsd" version="1.2" date="${date.getUTCFullYear()}-${pad(date.getUTCMonth() + 1)}-${pad(date.getUTCDate())}" time="${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())}:${pad(date.getUTCSeconds())}">`,
    `  <Units>${UNITS[unit]}</Units>`,
    `  <Application name="${xmlText(app.name, `${where}(options.application.name)`)}"${
      app.version === undefined ? '' : attr('version', app.version, `${where}(options.application)`)
    }/>`,
  ];

  const points = list(content.points, 'points');
  if (points.length > 0) {
    const seen = new Set<string>();
    out.push('  <CgPoints>');
    points.forEach((p0, i) => {
      const at = `${where}(content.points[${i}])`;
      const p = item(p0, at, 'a point { name, x, y }');
      const name = nameOf(p, at, seen);
      const h = p.height === undefined ? '' : ` ${len(p.height)}`;
      out.push(
        `    <CgPoint name="${name}"${attr('code', p.code, at)}${attr('desc', p.description, at)}>${ne(p)}${h}</CgPoint>`,
      );
    });
    out.push('  </CgPoints>');
  }

  const parcels = list(content.parcels, 'parcels');
  if (parcels.length > 0) {
    const seen = new Set<string>();
    out.push('  <Parcels>');
    parcels.forEach((q0, i) => {
      const at = `${where}(content.parcels[${i}])`;
      const q = item(q0, at, 'a parcel { name, points }');
      const name = nameOf(q, at, seen);
      const { ring, signed } = parcelRing(
        A,
        list(q.points, `parcels[${i}].points`).map((v, j) =>
          item(v, `${at}.points[${j}]`, 'a vertex { x, y }'),
        ),
        at,
      );
      out.push(
        `    <Parcel name="${name}" area="${len(A.abs(signed))}"${attr('desc', q.description, at)}>`,
        '      <CoordGeom>',
      );
      ring.forEach((v, j) => {
        const w = ring[(j + 1) % ring.length]!;
        out.push(`        <Line><Start>${ne(v)}</Start><End>${ne(w)}</End></Line>`);
      });
      out.push('      </CoordGeom>', '    </Parcel>');
    });
    out.push('  </Parcels>');
  }

  const alignments = list(content.alignments, 'alignments');
  if (alignments.length > 0) {
    const seen = new Set<string>();
    out.push('  <Alignments>');
    alignments.forEach((a0, i) => {
      const at = `${where}(content.alignments[${i}])`;
      const a = item(a0, at, 'an alignment { name, horizontal, vertical? }');
      const name = nameOf(a, at, seen);
      const h = item(a.horizontal, `${at}.horizontal`, 'a horizontal alignment');
      if (h.kind !== 'horizontal' || !Array.isArray(h.elements))
        throw new QuadspreadError(
          'INVALID_ARGUMENT',
          `${at}.horizontal`,
          'is not an alignment made by horizontalAlignment',
        );
      out.push(
        `    <Alignment name="${name}" length="${len(h.length)}" staStart="${len(h.startChainage)}"${attr('desc', a.description, at)}>`,
        '      <CoordGeom>',
      );
      for (const e of h.elements) {
        const common = `staStart="${len(e.startChainage)}" length="${len(e.length)}"`;
        if (e.type === 'straight')
          out.push(
            `        <Line ${common}><Start>${ne(e.start)}</Start><End>${ne(e.end)}</End></Line>`,
          );
        else if (e.type === 'arc')
          out.push(
            `        <Curve ${common} crvType="arc" rot="${e.turn > 0 ? 'cw' : 'ccw'}" radius="${len(e.radius)}"><Start>${ne(e.start)}</Start><Center>${ne(e.centre)}</Center><End>${ne(e.end)}</End></Curve>`,
          );
        else {
          // PI: where the tangents at the spiral's ends meet.
          const u = e.direction;
          const { sin, cos } = sinCosDegrees(A, e.bearingOut);
          const v = { x: sin, y: cos };
          const cross = A.sub(A.mul(u.x, v.y), A.mul(u.y, v.x));
          const dx = A.sub(e.end.x, e.start.x);
          const dy = A.sub(e.end.y, e.start.y);
          const t = A.div(A.sub(A.mul(dx, v.y), A.mul(dy, v.x)), cross);
          const pi = { x: A.add(e.start.x, A.mul(t, u.x)), y: A.add(e.start.y, A.mul(t, u.y)) };
          const r = len(e.radius);
          out.push(
            `        <Spiral ${common} spiType="clothoid" rot="${e.turn > 0 ? 'cw' : 'ccw'}" radiusStart="${e.entering ? 'INF' : r}" radiusEnd="${e.entering ? r : 'INF'}"><Start>${ne(e.start)}</Start><PI>${ne(pi)}</PI><End>${ne(e.end)}</End></Spiral>`,
          );
        }
      }
      out.push('      </CoordGeom>');
      for (const q of h.equations)
        out.push(
          `      <StaEquation staBack="${len(q.back)}" staAhead="${len(q.ahead)}" staInternal="${len(A.add(h.startChainage, q.distance))}"/>`,
        );
      if (a.vertical !== undefined) {
        const v = item(a.vertical, `${at}.vertical`, 'a vertical alignment');
        if (!Array.isArray(v.points) || !Array.isArray(v.curves))
          throw new QuadspreadError(
            'INVALID_ARGUMENT',
            `${at}.vertical`,
            'is not a profile made by verticalAlignment',
          );
        out.push(`      <Profile name="${name}">`, `        <ProfAlign name="${name}">`);
        v.points.forEach((p, j) => {
          const c = v.curves[j];
          const se = `${len(p.chainage)} ${len(p.level)}`;
          if (c === null || c === undefined) out.push(`          <PVI>${se}</PVI>`);
          else if (A.eq(c.lengthIn, c.lengthOut))
            out.push(`          <ParaCurve length="${len(c.length)}">${se}</ParaCurve>`);
          else
            out.push(
              `          <UnsymParaCurve lengthIn="${len(c.lengthIn)}" lengthOut="${len(c.lengthOut)}">${se}</UnsymParaCurve>`,
            );
        });
        out.push('        </ProfAlign>', '      </Profile>');
      }
      out.push('    </Alignment>');
    });
    out.push('  </Alignments>');
  }
  const lines = list(content.lines, 'lines');
  if (lines.length > 0) {
    const seen = new Set<string>();
    out.push('  <PlanFeatures name="lines">');
    lines.forEach((l0, i) => {
      const at = `${where}(content.lines[${i}])`;
      const l = item(l0, at, 'a line { name, points }');
      const name = nameOf(l, at, seen);
      const vs = list(l.points, `lines[${i}].points`).map((v, j) =>
        item(v, `${at}.points[${j}]`, 'a vertex { x, y }'),
      );
      if (vs.length < 2)
        throw new QuadspreadError(
          'INVALID_ARGUMENT',
          `${at}.points`,
          `a line needs two vertices or more, got ${vs.length}`,
        );
      out.push(
        `    <PlanFeature name="${name}"${attr('code', l.code, at)}${attr('desc', l.description, at)}>`,
        '      <CoordGeom>',
      );
      for (let j = 1; j < vs.length; j++)
        out.push(`        <Line><Start>${ne(vs[j - 1]!)}</Start><End>${ne(vs[j]!)}</End></Line>`);
      out.push('      </CoordGeom>', '    </PlanFeature>');
    });
    out.push('  </PlanFeatures>');
  }
  out.push('</LandXML>');
  return out.join('\n') + '\n';
}
