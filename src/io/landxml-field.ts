/**
 * The `Survey` section of a LandXML document as the inputs of the field functions: for each
 * instrument set-up, the `orientStation` input (station and backsights with coordinates) and
 * the `sideShots` shots.
 *
 * @module io
 */
import {
  QuadspreadError,
  type Arithmetic,
  type Backsight,
  type OrientInput,
  type Shot,
} from '../index.js';
import { checkArithmetic, show } from '../errors.js';
import type { LandXmlDocument, LandXmlObservation, LandXmlPoint } from './landxml-read.js';

/** One set-up of a LandXML survey, ready for `orientStation` and `sideShots`. */
export interface LandXmlStation<T> {
  /** The set-up's `id`. */
  readonly id: string;
  /** The input of `orientStation`: the station point, instrument height and backsights. */
  readonly orient: OrientInput<T>;
  /** Every other observation of the set-up as a shot of `sideShots`, named by its target. */
  readonly shots: readonly Shot<T>[];
}

const bad = (where: string, line: number, what: string) =>
  new QuadspreadError('INVALID_FILE', `${where}: <RawObservation> at line ${line}`, what);

/**
 * The set-ups of a document read by {@link readLandXml}, as the inputs of the field functions:
 * `orient` for `orientStation` (the station's coordinates from its `CgPoint`, the instrument
 * height, and one backsight per observation whose `purpose` is `backsight` — its target's
 * coordinates, circle reading, and zenith angle, slope distance and target height when
 * observed) and `shots` for `sideShots` (every other observation: its target as the name, the
 * circle reading, zenith angle and slope distance, and the target height). An observation with
 * a horizontal distance and no slope distance is taken at zenith 90° with that distance, which
 * is the same shot. Values stay in the file's units (angles in degrees).
 *
 * Then `sideShots(A, orientStation(A, s.orient), s.shots)` gives the coordinates of the shots
 * in the file's grid.
 *
 * @param A the arithmetic of the document's values
 * @param doc a document from {@link readLandXml} (in the same arithmetic)
 * @returns one entry per set-up, in file order
 * @throws {@link QuadspreadError} `INVALID_FILE` naming the observation's line for a station or
 *   backsight point without coordinates in the file, an observation without a circle reading,
 *   a shot without a target, or one with neither a slope distance and zenith angle nor a
 *   horizontal distance; `INVALID_ARGUMENT` for a document that is not one.
 * @example
 * ```ts
 * import { rational, orientStation, sideShots } from 'quadspread';
 * import { readLandXml, landXmlStations } from 'quadspread/io';
 * const doc = readLandXml(rational, `<LandXML version="1.2">
 *   <Units><Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter" angularUnit="decimal degrees"/></Units>
 *   <CgPoints><CgPoint name="S1">2000 1000 50</CgPoint><CgPoint name="B1">2100 1000</CgPoint></CgPoints>
 *   <Survey><InstrumentSetup id="IS1" stationName="S1" instrumentHeight="1.5"/>
 *     <ObservationGroup id="G1" setupID="IS1">
 *       <RawObservation purpose="backsight" horizAngle="0"><TargetPoint pntRef="B1"/></RawObservation>
 *       <RawObservation horizAngle="90" zenithAngle="90" slopeDistance="25" targetHeight="1.5"><TargetPoint pntRef="P7"/></RawObservation>
 *     </ObservationGroup></Survey></LandXML>`);
 * const [s] = landXmlStations(rational, doc);
 * const [p7] = sideShots(rational, orientStation(rational, s.orient), s.shots);
 * [p7.name, rational.toString(p7.x), rational.toString(p7.y), rational.toString(p7.z!)];
 * //=> ['P7', '1025', '2000', '50']
 * ```
 */
export function landXmlStations<T>(
  A: Arithmetic<T, boolean>,
  doc: LandXmlDocument<T>,
): LandXmlStation<T>[] {
  const where = 'landXmlStations';
  checkArithmetic(A, where);
  if (
    typeof doc !== 'object' ||
    doc === null ||
    !Array.isArray(doc.points) ||
    !Array.isArray(doc.setups)
  )
    throw new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(doc)`,
      `${show(doc)} is not a document read by readLandXml`,
    );
  // A document altered after reading: each entry the conversion reads must still be an object.
  const notRead = (what: string, v: unknown): QuadspreadError =>
    new QuadspreadError(
      'INVALID_ARGUMENT',
      `${where}(doc) ${what}`,
      `${show(v)} is not what readLandXml gives there`,
    );
  const isObject = (v: unknown): boolean => typeof v === 'object' && v !== null;
  const points = new Map<string, LandXmlPoint<T>>();
  for (let i = 0; i < doc.points.length; i++) {
    const p = doc.points[i];
    if (!isObject(p) || typeof p!.name !== 'string') throw notRead(`points[${i}]`, p);
    points.set(p!.name, p!);
  }
  for (let i = 0; i < doc.setups.length; i++) {
    const s = doc.setups[i];
    if (!isObject(s) || !Array.isArray(s!.observations)) throw notRead(`setups[${i}]`, s);
    for (let j = 0; j < s!.observations.length; j++)
      if (!isObject(s!.observations[j]))
        throw notRead(`setups[${i}].observations[${j}]`, s!.observations[j]);
  }
  const coords = (name: string | undefined, line: number, what: string) => {
    const p = name === undefined ? undefined : points.get(name);
    if (p === undefined)
      throw bad(
        where,
        line,
        `the ${what} ${show(name)} has no coordinates in the file (no CgPoint of that name)`,
      );
    return p.height === undefined ? { x: p.x, y: p.y } : { x: p.x, y: p.y, z: p.height };
  };
  const slopeAndZenith = (o: LandXmlObservation<T>): { slope: T; zenith: T } | undefined => {
    if (o.slopeDistance !== undefined && o.zenithAngle !== undefined)
      return { slope: o.slopeDistance, zenith: o.zenithAngle };
    if (o.slopeDistance === undefined && o.horizontalDistance !== undefined)
      return { slope: o.horizontalDistance, zenith: A.from(90) };
    return undefined;
  };
  return doc.setups.map((s) => {
    const station = coords(s.station, s.line, 'station');
    const backsights: Backsight<T>[] = [];
    const shots: Shot<T>[] = [];
    for (const o of s.observations) {
      if (o.horizontalAngle === undefined)
        throw bad(where, o.line, 'the observation has no circle reading (horizAngle)');
      const th = o.targetHeight === undefined ? {} : { targetHeight: o.targetHeight };
      if (o.purpose === 'backsight') {
        const sz = slopeAndZenith(o);
        backsights.push({
          ...(o.target !== undefined ? { name: o.target } : {}),
          point: coords(o.target, o.line, 'backsight point'),
          circle: o.horizontalAngle,
          ...(sz ?? {}),
          ...th,
        });
        continue;
      }
      if (o.target === undefined) throw bad(where, o.line, 'the shot names no target point');
      const sz = slopeAndZenith(o);
      if (sz === undefined)
        throw bad(
          where,
          o.line,
          'the shot has neither a slope distance with a zenith angle nor a horizontal distance',
        );
      shots.push({ name: o.target, circle: o.horizontalAngle, ...sz, ...th });
    }
    return {
      id: s.id,
      orient: {
        station,
        ...(s.instrumentHeight !== undefined ? { instrumentHeight: s.instrumentHeight } : {}),
        backsights,
      },
      shots,
    };
  });
}
