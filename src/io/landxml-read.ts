/**
 * LandXML 1.2 in: the document's `Units`, its `CgPoints` (a point's text is northing, easting,
 * elevation), and the `Survey` section's instrument set-ups and raw observations.
 *
 * @module io
 */
import { QuadspreadError, type Arithmetic } from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import { badElement, parseXml, type XmlElement } from './landxml-dom.js';
import { readAngle, readDecimal, readUnits, type LandXmlUnits } from './landxml-units.js';
import type { ExchangePoint } from './point.js';

/**
 * Options of {@link readLandXml}: `others` — what to do with an element or attribute inside
 * the parts read (`Units`, `CgPoints`, `Survey`) that this version does not understand:
 * `'refuse'` (the default: `INVALID_FILE` naming it and its line) or `'skip'` (left out, and
 * listed in the result's `notRead`).
 */
export interface LandXmlReadOptions {
  /** Unknown elements and attributes in the parts read: `'refuse'` (default) or `'skip'`. */
  readonly others?: 'refuse' | 'skip';
}

/** A point of `CgPoints`: an {@link ExchangePoint} with its description and survey role. */
export interface LandXmlPoint<T> extends ExchangePoint<T> {
  /** The `desc` attribute. */
  readonly description?: string;
  /** The `pntSurv` attribute (how the point was determined: `control`, `sideshot`, …). */
  readonly survey?: string;
  /** The line of the `CgPoint` element. */
  readonly line: number;
}

/**
 * A raw observation from an instrument set-up: the target, and whichever of the measured
 * values the file gives. Angles and directions are in degrees (converted from the file's
 * angle format); distances and heights in the file's linear unit.
 */
export interface LandXmlObservation<T> {
  /** The target point's name (`TargetPoint pntRef`, or its `name`). */
  readonly target?: string;
  /** `purpose` (`normal`, `backsight`, `check`, …), as written. */
  readonly purpose?: string;
  /** Horizontal circle reading, degrees. */
  readonly horizontalAngle?: T;
  /** Zenith angle, degrees. */
  readonly zenithAngle?: T;
  /** Azimuth, degrees. */
  readonly azimuth?: T;
  /** Slope distance. */
  readonly slopeDistance?: T;
  /** Horizontal distance. */
  readonly horizontalDistance?: T;
  /** Height difference. */
  readonly verticalDistance?: T;
  /** Height of the target above its point. */
  readonly targetHeight?: T;
  /** `directFace`: `true` for face left (direct), `false` for face right, as written. */
  readonly directFace?: boolean;
  /** The line of the `RawObservation` element. */
  readonly line: number;
}

/** An instrument set-up of the `Survey` section with its observations. */
export interface LandXmlSetup<T> {
  /** `id`. */
  readonly id: string;
  /** `stationName`: the station point's name. */
  readonly station: string;
  /** Height of the instrument above the station point. */
  readonly instrumentHeight?: T;
  /** The backsight point named by `Backsight/BacksightPoint`, if any. */
  readonly backsight?: string;
  /** The raw observations of every `ObservationGroup` of this set-up, in file order. */
  readonly observations: readonly LandXmlObservation<T>[];
  /** The line of the `InstrumentSetup` element. */
  readonly line: number;
}

/** What {@link readLandXml} gives. */
export interface LandXmlDocument<T> {
  /** The `version` attribute of the root. */
  readonly version: string;
  /** The units (absent only in a document with no points and no survey). */
  readonly units?: LandXmlUnits;
  /** Every `CgPoint`, of the top-level `CgPoints` and of the `Survey` section, in file order. */
  readonly points: readonly LandXmlPoint<T>[];
  /** The instrument set-ups of the `Survey` section, with their observations. */
  readonly setups: readonly LandXmlSetup<T>[];
  /** The attributes of `CoordinateSystem`, when the file has one (e.g. `epsgCode`). */
  readonly coordinateSystem?: Readonly<Record<string, string>>;
  /**
   * What was not read: top-level sections other than `Units`, `CgPoints`, `Survey` and the
   * header elements (`Project`, `Application`, `CoordinateSystem`), and with `others: 'skip'`
   * the unknown elements and attributes of the parts read — each with its line.
   */
  readonly notRead: readonly string[];
}

const SUPPORTED_VERSIONS = new Set(['1.0', '1.1', '1.2']);
// Attributes that describe rather than measure: accepted and not returned (a point's feature
// reference, geometry kind, role and time stamps among them).
const DESCRIPTIVE = new Set([
  'oID',
  'timeStamp',
  'date',
  'time',
  'state',
  'status',
  'note',
  'featureRef',
  'pointGeometry',
  'DTMAttribute',
  'role',
  'determinedTimeStamp',
]);
const HEADER = new Set(['Project', 'Application', 'CoordinateSystem', 'FeatureDictionary']);

interface Ctx<T> {
  A: Arithmetic<T, boolean>;
  where: string;
  skip: boolean;
  notRead: string[];
  units?: LandXmlUnits;
}

/** Refuses (or, skipping, lists) attributes of `e` outside `known`. */
function checkAttrs<T>(c: Ctx<T>, e: XmlElement, known: readonly string[]): void {
  for (const a of Object.keys(e.attrs)) {
    if (known.includes(a) || DESCRIPTIVE.has(a) || a === 'xmlns' || a.startsWith('xmlns')) continue;
    if (c.skip) c.notRead.push(`attribute ${a} of <${e.name}> at line ${e.line}`);
    else
      throw badElement(
        c.where,
        e,
        `the attribute ${a} is not read by this version (read with others: 'skip' to leave it out)`,
      );
  }
}

/** Refuses (or, skipping, lists) an element this version does not read. */
function unknownElement<T>(c: Ctx<T>, e: XmlElement, parent: XmlElement): void {
  if (c.skip) c.notRead.push(`<${e.name}> at line ${e.line}`);
  else
    throw badElement(
      c.where,
      e,
      `<${e.name}> inside <${parent.name}> is not read by this version (read with others: 'skip' to leave it out)`,
    );
}

function unitsOf<T>(c: Ctx<T>, e: XmlElement): LandXmlUnits {
  if (c.units === undefined)
    throw badElement(
      c.where,
      e,
      'the document has no Units element before its data: its coordinates cannot be read without their unit',
    );
  return c.units;
}

function requireAttr(c: Ctx<unknown>, e: XmlElement, a: string): string {
  const v = e.attrs[a];
  if (v === undefined || v.trim() === '')
    throw badElement(c.where, e, `the required attribute ${a} is missing`);
  return v;
}

/** A point's text: northing, easting and optionally elevation, separated by white space. */
function coordinates<T>(c: Ctx<T>, e: XmlElement): { x: T; y: T; height?: T } {
  const parts = e.text.split(/\s+/).filter((s) => s !== '');
  if (parts.length !== 2 && parts.length !== 3)
    throw badElement(
      c.where,
      e,
      `a point's text is "northing easting [elevation]"; found ${parts.length} value(s) ${show(e.text.slice(0, 60))}`,
    );
  const y = readDecimal(c.A, parts[0]!, c.where, e, 'the northing');
  const x = readDecimal(c.A, parts[1]!, c.where, e, 'the easting');
  return parts.length === 3
    ? { x, y, height: readDecimal(c.A, parts[2]!, c.where, e, 'the elevation') }
    : { x, y };
}

function readCgPoints<T>(
  c: Ctx<T>,
  group: XmlElement,
  out: LandXmlPoint<T>[],
  refs: { e: XmlElement; ref: string; at: number }[],
): void {
  unitsOf(c, group);
  checkAttrs(c, group, ['name', 'desc', 'zoneNumber', 'dataFormat']);
  if (group.attrs.dataFormat !== undefined && group.attrs.dataFormat !== 'Offset')
    throw badElement(
      c.where,
      group,
      `dataFormat="${group.attrs.dataFormat}" is not read by this version (coordinates as northing easting elevation only)`,
    );
  for (const e of group.children) {
    if (e.name === 'CgPoints') {
      readCgPoints(c, e, out, refs);
      continue;
    }
    if (e.name !== 'CgPoint') {
      unknownElement(c, e, group);
      continue;
    }
    checkAttrs(c, e, ['name', 'code', 'desc', 'pntRef', 'pntSurv']);
    if (e.children.length > 0) unknownElement(c, e.children[0]!, e);
    const name = requireAttr(c, e, 'name');
    const base = {
      name,
      ...(e.attrs.code !== undefined ? { code: e.attrs.code } : {}),
      ...(e.attrs.desc !== undefined ? { description: e.attrs.desc } : {}),
      ...(e.attrs.pntSurv !== undefined ? { survey: e.attrs.pntSurv } : {}),
      line: e.line,
    };
    if (e.text === '') {
      const ref = e.attrs.pntRef;
      if (ref === undefined)
        throw badElement(c.where, e, `the point ${show(name)} has neither coordinates nor pntRef`);
      refs.push({ e, ref, at: out.length });
      out.push({ ...base, x: c.A.zero, y: c.A.zero });
    } else out.push({ ...base, ...coordinates(c, e) });
  }
}

function pointRef<T>(c: Ctx<T>, e: XmlElement): string {
  checkAttrs(c, e, ['pntRef', 'name', 'code', 'desc', 'pntSurv']);
  const ref = e.attrs.pntRef ?? e.attrs.name;
  if (ref === undefined || ref.trim() === '')
    throw badElement(c.where, e, 'the point is named neither by pntRef nor by name');
  return ref;
}

const OBSERVATION_ATTRS = [
  'setupID',
  'purpose',
  'horizAngle',
  'zenithAngle',
  'azimuth',
  'slopeDistance',
  'horizDistance',
  'vertDistance',
  'targetHeight',
  'directFace',
  'name',
  'desc',
] as const;

function readObservation<T>(c: Ctx<T>, e: XmlElement): LandXmlObservation<T> {
  const u = unitsOf(c, e);
  checkAttrs(c, e, OBSERVATION_ATTRS);
  const a = e.attrs;
  const len = (k: string, what: string) =>
    a[k] === undefined ? {} : { [what]: readDecimal(c.A, a[k], c.where, e, k) };
  const ang = (k: string, what: string, format = u.angular) =>
    a[k] === undefined ? {} : { [what]: readAngle(c.A, a[k], format, c.where, e, k) };
  let target: string | undefined;
  for (const k of e.children) {
    if (k.name === 'TargetPoint') {
      if (target !== undefined) throw badElement(c.where, k, 'a second TargetPoint');
      target = pointRef(c, k);
    } else if (k.name !== 'FieldNote') unknownElement(c, k, e);
  }
  let directFace: boolean | undefined;
  if (a.directFace !== undefined) {
    if (a.directFace !== 'true' && a.directFace !== 'false')
      throw badElement(c.where, e, `directFace="${a.directFace}" is not true or false`);
    directFace = a.directFace === 'true';
  }
  return {
    ...(target !== undefined ? { target } : {}),
    ...(a.purpose !== undefined ? { purpose: a.purpose } : {}),
    ...ang('horizAngle', 'horizontalAngle'),
    ...ang('zenithAngle', 'zenithAngle'),
    ...ang('azimuth', 'azimuth', u.direction),
    ...len('slopeDistance', 'slopeDistance'),
    ...len('horizDistance', 'horizontalDistance'),
    ...len('vertDistance', 'verticalDistance'),
    ...len('targetHeight', 'targetHeight'),
    ...(directFace !== undefined ? { directFace } : {}),
    line: e.line,
  } as LandXmlObservation<T>;
}

function readSurvey<T>(
  c: Ctx<T>,
  survey: XmlElement,
  points: LandXmlPoint<T>[],
  refs: { e: XmlElement; ref: string; at: number }[],
): LandXmlSetup<T>[] {
  checkAttrs(c, survey, ['name']);
  const setups: {
    s: Omit<LandXmlSetup<T>, 'observations'>;
    observations: LandXmlObservation<T>[];
  }[] = [];
  const byId = new Map<string, (typeof setups)[number]>();
  const groups: XmlElement[] = [];
  for (const e of survey.children) {
    if (e.name === 'CgPoints') readCgPoints(c, e, points, refs);
    else if (e.name === 'SurveyHeader' || e.name === 'Equipment')
      c.notRead.push(`<${e.name}> at line ${e.line}`);
    else if (e.name === 'InstrumentSetup') {
      unitsOf(c, e);
      checkAttrs(c, e, ['id', 'stationName', 'instrumentHeight', 'name', 'desc']);
      const id = requireAttr(c, e, 'id');
      if (byId.has(id))
        throw badElement(c.where, e, `a second InstrumentSetup with id ${show(id)}`);
      let station = e.attrs.stationName;
      let backsight: string | undefined;
      for (const k of e.children) {
        if (k.name === 'InstrumentPoint') station ??= pointRef(c, k);
        else if (k.name === 'Backsight') {
          checkAttrs(c, k, ['name', 'desc']);
          for (const b of k.children)
            if (b.name === 'BacksightPoint') backsight = pointRef(c, b);
            else unknownElement(c, b, k);
        } else unknownElement(c, k, e);
      }
      if (station === undefined)
        throw badElement(
          c.where,
          e,
          'the set-up names no station (stationName or InstrumentPoint)',
        );
      const s = {
        id,
        station,
        ...(e.attrs.instrumentHeight !== undefined
          ? {
              instrumentHeight: readDecimal(
                c.A,
                e.attrs.instrumentHeight,
                c.where,
                e,
                'instrumentHeight',
              ),
            }
          : {}),
        ...(backsight !== undefined ? { backsight } : {}),
        line: e.line,
      };
      const entry = { s, observations: [] };
      setups.push(entry);
      byId.set(id, entry);
    } else if (e.name === 'ObservationGroup') groups.push(e);
    else unknownElement(c, e, survey);
  }
  for (const g of groups) {
    checkAttrs(c, g, ['id', 'setupID', 'purpose', 'name', 'desc']);
    for (const k of g.children) {
      if (k.name !== 'RawObservation') {
        if (k.name !== 'FieldNote') unknownElement(c, k, g);
        continue;
      }
      const id = k.attrs.setupID ?? g.attrs.setupID;
      if (id === undefined)
        throw badElement(c.where, k, 'neither the observation nor its group names a setupID');
      const to = byId.get(id);
      if (to === undefined)
        throw badElement(c.where, k, `setupID ${show(id)} names no InstrumentSetup of the survey`);
      const o = readObservation(c, k);
      to.observations.push(
        o.purpose === undefined && g.attrs.purpose !== undefined
          ? { ...o, purpose: g.attrs.purpose }
          : o,
      );
    }
  }
  return setups.map((x) => ({ ...x.s, observations: x.observations }));
}

/**
 * Reads a LandXML document (versions 1.0 to 1.2; the structure of the parts read is that of
 * the LandXML 1.2 schema): its `Units`, every `CgPoint` (of `CgPoints` at the top and in the
 * `Survey` section), and the `Survey` section's `InstrumentSetup`s with the `RawObservation`s
 * of their `ObservationGroup`s.
 *
 * A `CgPoint`'s text is **northing, easting, elevation** in that order (the schema's point
 * type), read here into `y`, `x` and `height`; a point with `pntRef` and no text takes the
 * coordinates of the point it names. Values are exact decimals in the arithmetic, in the
 * file's units: lengths in its linear unit (elevations in its elevation unit), angles
 * converted to degrees from its angle format (radians by the schema's default; `decimal
 * dd.mm.ss` is read as degrees, minutes, seconds). Header elements are passed over
 * (`CoordinateSystem`'s attributes are returned); other top-level sections (alignments,
 * parcels, surfaces, …) are listed in `notRead`, never read half.
 *
 * @param A the arithmetic of the values
 * @param text the document's text
 * @param options `{ others? }`: unknown elements and attributes in the parts read are refused
 *   (the default) or skipped and listed
 * @returns `{ version, units, points, setups, coordinateSystem?, notRead }`
 * @throws {@link QuadspreadError} `INVALID_FILE` naming the element and its line for text that
 *   is not well-formed XML, a root other than `LandXML`, a version not read, missing `Units`,
 *   an unknown unit, a missing required attribute, a point without coordinates or a broken
 *   reference, a repeated point name or set-up id, a bad number, or (unless skipped) an element
 *   or attribute this version does not read; `INVALID_ARGUMENT` for bad options.
 * @example
 * ```ts
 * import { rational } from 'quadspread';
 * import { readLandXml } from 'quadspread/io';
 * const doc = readLandXml(rational, `<LandXML version="1.2" date="2026-12-03" time="09:00:00">
 *   <Units><Imperial linearUnit="USSurveyFoot" areaUnit="squareFoot" volumeUnit="cubicFeet" angularUnit="decimal dd.mm.ss"/></Units>
 *   <CgPoints><CgPoint name="CP1" code="IP">5000.25 2000.5 101.3</CgPoint></CgPoints>
 *   <Survey><InstrumentSetup id="S1" stationName="CP1" instrumentHeight="5.1">
 *     <InstrumentPoint pntRef="CP1"/></InstrumentSetup>
 *     <ObservationGroup id="G1" setupID="S1"><RawObservation horizAngle="90.3015" slopeDistance="250.02">
 *       <TargetPoint pntRef="CP2"/></RawObservation></ObservationGroup></Survey></LandXML>`);
 * const [p] = doc.points;
 * [doc.units?.linear, p.name, rational.toString(p.x), rational.toString(p.y), p.code];
 * //=> ['USSurveyFoot', 'CP1', '4001/2', '20001/4', 'IP']
 * const o = doc.setups[0].observations[0];
 * [o.target, rational.toString(o.horizontalAngle!)];
 * //=> ['CP2', '21721/240']
 * ```
 */
export function readLandXml<T>(
  A: Arithmetic<T, boolean>,
  text: string,
  options: LandXmlReadOptions = {},
): LandXmlDocument<T> {
  const where = 'readLandXml';
  checkArithmetic(A, where);
  const o = (options ?? {}) as LandXmlReadOptions;
  if (typeof o !== 'object')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options)`,
      `${show(o)} is not an object`,
    );
  const others = o.others ?? 'refuse';
  if (others !== 'refuse' && others !== 'skip')
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(options.others)`,
      `${show(others)} is not 'refuse' or 'skip'`,
    );
  const root = parseXml(text, where);
  const c: Ctx<T> = { A, where, skip: others === 'skip', notRead: [] };
  if (root.name !== 'LandXML')
    throw badElement(where, root, `the root element is <${root.name}>, not <LandXML>`);
  const version = root.attrs.version;
  if (version === undefined)
    throw badElement(where, root, 'the required attribute version is missing');
  if (!SUPPORTED_VERSIONS.has(version))
    throw badElement(where, root, `version="${version}" is not read (LandXML 1.0 to 1.2 are)`);
  const unitEls = root.children.filter((e) => e.name === 'Units');
  if (unitEls.length > 1) throw badElement(where, unitEls[1]!, 'a second Units element');
  if (unitEls.length === 1) c.units = readUnits(unitEls[0]!, where);
  const points: LandXmlPoint<T>[] = [];
  const refs: { e: XmlElement; ref: string; at: number }[] = [];
  const setups: LandXmlSetup<T>[] = [];
  let coordinateSystem: Record<string, string> | undefined;
  for (const e of root.children) {
    if (e.name === 'Units') continue;
    if (e.name === 'CgPoints') readCgPoints(c, e, points, refs);
    else if (e.name === 'Survey') setups.push(...readSurvey(c, e, points, refs));
    else if (e.name === 'CoordinateSystem') coordinateSystem = { ...e.attrs };
    else if (!HEADER.has(e.name)) c.notRead.push(`<${e.name}> at line ${e.line}`);
  }
  // Names are unique; a pntRef takes the coordinates of the point it names.
  const byName = new Map<string, LandXmlPoint<T>>();
  const refAt = new Set(refs.map((r) => r.at));
  points.forEach((p, i) => {
    const had = byName.get(p.name);
    if (had !== undefined)
      throw new QuadspreadError(
        'INVALID_FILE',
        `${where}: <CgPoint> at line ${p.line}`,
        `the point name ${show(p.name)} is used again (first at line ${had.line})`,
      );
    if (!refAt.has(i)) byName.set(p.name, p);
  });
  for (const r of refs) {
    const to = byName.get(r.ref);
    if (to === undefined)
      throw badElement(where, r.e, `pntRef ${show(r.ref)} names no point with coordinates`);
    const p = points[r.at]!;
    points[r.at] = {
      ...p,
      x: to.x,
      y: to.y,
      ...(to.height !== undefined ? { height: to.height } : {}),
    };
    byName.set(p.name, points[r.at]!);
  }
  return {
    version,
    ...(c.units !== undefined ? { units: c.units } : {}),
    points,
    setups,
    ...(coordinateSystem !== undefined ? { coordinateSystem } : {}),
    notRead: c.notRead,
  };
}

/**
 * The `CgPoint`s of a LandXML document as exchange points (x = easting, y = northing, height
 * = elevation; in the file's units, see {@link readLandXml}), for any solver and for
 * `pointsFromFile`.
 *
 * @param A the arithmetic of the values
 * @param text the document's text
 * @param options as {@link readLandXml}
 * @returns the points, in file order
 * @throws {@link QuadspreadError} the errors of {@link readLandXml}; `INVALID_FILE` for a
 *   document without points.
 * @example
 * ```ts
 * import { float } from 'quadspread';
 * import { pointsFromLandXml } from 'quadspread/io';
 * pointsFromLandXml(float, '<LandXML version="1.2"><Units><Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter"/></Units><CgPoints><CgPoint name="A">200 100</CgPoint></CgPoints></LandXML>');
 * //=> [{ name: 'A', x: 100, y: 200, line: 1 }]
 * ```
 */
export function pointsFromLandXml<T>(
  A: Arithmetic<T, boolean>,
  text: string,
  options: LandXmlReadOptions = {},
): LandXmlPoint<T>[] {
  const doc = readLandXml(A, text, options);
  if (doc.points.length === 0)
    throw new QuadspreadError(
      'INVALID_FILE',
      'pointsFromLandXml',
      'the document has no CgPoint (points are read from CgPoints)',
    );
  return [...doc.points];
}
