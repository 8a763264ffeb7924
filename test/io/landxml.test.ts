// LandXML 1.2 in and out. No sample file of the LandXML 1.2 set is on this machine, so the
// documents read here are written by hand per the schema's element reference (LandXML-1.2.xsd:
// Units/Metric and Imperial, CgPoints/CgPoint, Survey/InstrumentSetup, ObservationGroup,
// RawObservation), and the files written are checked by a structural validator written in
// this test folder from the same reference (landxml-structure.ts). Expected values are worked
// by hand beside each check.
import { describe, expect, it } from 'vitest';
import {
  QuadspreadError,
  decimal,
  float,
  horizontalAlignment,
  orientStation,
  rational,
  sideShots,
  verticalAlignment,
} from '../../src/index.js';
import {
  METRES_PER_LANDXML_UNIT,
  landXmlStations,
  pointsFromFile,
  pointsFromLandXml,
  readLandXml,
  toLandXml,
} from '../../src/io/index.js';
import { landXmlStructureErrors } from './landxml-structure.js';

const R = rational;
const codeOf = (f: () => unknown): string => {
  try {
    f();
    return 'returned';
  } catch (e) {
    return e instanceof QuadspreadError ? e.code : `untyped ${(e as Error).message}`;
  }
};
const messageOf = (f: () => unknown): string => {
  try {
    f();
    return 'returned';
  } catch (e) {
    return (e as Error).message;
  }
};

const METRIC =
  '<Units><Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter" temperatureUnit="celsius" pressureUnit="milliBars" angularUnit="decimal degrees" directionUnit="decimal degrees"/></Units>';
const doc = (body: string, units = METRIC) =>
  `<?xml version="1.0" encoding="UTF-8"?>\n<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2" date="2026-12-03" time="09:00:00">\n${units}\n${body}\n</LandXML>\n`;

describe('readLandXml: points', () => {
  it('reads a CgPoint as northing, easting, elevation (y before x: no silent swap)', () => {
    // Easting 100.5, northing 5000.25, elevation 12.75: the text is "5000.25 100.5 12.75".
    const [p] = pointsFromLandXml(
      R,
      doc(
        '<CgPoints><CgPoint name="K1" code="CP" desc="iron pin">5000.25 100.5 12.75</CgPoint></CgPoints>',
      ),
    );
    expect(p!.name).toBe('K1');
    expect(R.toString(p!.x)).toBe('201/2');
    expect(R.toString(p!.y)).toBe('20001/4');
    expect(R.toString(p!.height!)).toBe('51/4');
    expect(p!.code).toBe('CP');
    expect(p!.description).toBe('iron pin');
  });

  it('reads nested CgPoints, points without elevation, pntRef, and a namespace prefix', () => {
    const d = readLandXml(
      R,
      `<lx:LandXML xmlns:lx="http://www.landxml.org/schema/LandXML-1.2" version="1.2" date="2026-12-03" time="09:00:00">
        <lx:Units><lx:Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter"/></lx:Units>
        <lx:CgPoints name="control">
          <lx:CgPoint name="A">10 20</lx:CgPoint>
          <lx:CgPoints name="inner"><lx:CgPoint name="B" pntRef="A"/></lx:CgPoints>
        </lx:CgPoints>
      </lx:LandXML>`,
    );
    expect(d.points.map((p) => [p.name, R.toNumber(p.x), R.toNumber(p.y), p.height])).toEqual([
      ['A', 20, 10, undefined],
      ['B', 20, 10, undefined],
    ]);
    expect(d.points[1]!.line).toBe(5);
  });

  it('reads the units: metres, US survey feet and their exact factors, elevation units', () => {
    const us = readLandXml(
      R,
      doc(
        '<CgPoints><CgPoint name="A">1 2 3</CgPoint></CgPoints>',
        '<Units><Imperial linearUnit="USSurveyFoot" elevationUnit="foot" areaUnit="squareFoot" volumeUnit="cubicFeet" temperatureUnit="fahrenheit" pressureUnit="inchHG"/></Units>',
      ),
    );
    expect(us.units).toEqual({
      system: 'Imperial',
      linear: 'USSurveyFoot',
      elevation: 'foot',
      // the schema's defaults for angles and directions
      angular: 'radians',
      direction: 'radians',
    });
    // 1 US survey foot = 1200/3937 m, 1 international foot = 0.3048 m (NIST SP 811, B.6)
    expect(R.toString(R.from(METRES_PER_LANDXML_UNIT.USSurveyFoot))).toBe('1200/3937');
    expect(R.toString(R.from(METRES_PER_LANDXML_UNIT.foot))).toBe('381/1250');
  });

  it('refuses a unit it does not know, naming the element and the line', () => {
    const text = doc(
      '<CgPoints><CgPoint name="A">1 2</CgPoint></CgPoints>',
      '<Units><Metric linearUnit="furlong" areaUnit="squareMeter" volumeUnit="cubicMeter"/></Units>',
    );
    expect(codeOf(() => readLandXml(R, text))).toBe('INVALID_FILE');
    expect(messageOf(() => readLandXml(R, text))).toMatch(/<Metric> at line 3.*furlong/);
    // a metric element with an imperial unit
    expect(
      messageOf(() =>
        readLandXml(
          R,
          doc(
            '',
            '<Units><Metric linearUnit="foot" areaUnit="squareMeter" volumeUnit="cubicMeter"/></Units>',
          ),
        ),
      ),
    ).toMatch(/linearUnit="foot"/);
  });

  it('refuses malformed XML naming the line, and a document type declaration', () => {
    expect(
      messageOf(() => readLandXml(R, doc('<CgPoints><CgPoint name="A">1 2</CgPoints>'))),
    ).toMatch(/line 4.*not well-formed/);
    expect(
      messageOf(() =>
        readLandXml(
          R,
          '<?xml version="1.0"?>\n<!DOCTYPE x [<!ENTITY a "aaaa">]>\n<LandXML version="1.2"/>',
        ),
      ),
    ).toMatch(/line 2.*DOCTYPE/);
    expect(codeOf(() => readLandXml(R, '<Other version="1.2"/>'))).toBe('INVALID_FILE');
    expect(messageOf(() => readLandXml(R, '<LandXML version="2.0"/>'))).toMatch(/version="2.0"/);
    expect(codeOf(() => readLandXml(R, 42 as never))).toBe('INVALID_ARGUMENT');
    // entities: the five of XML and character references, nothing else
    expect(
      pointsFromLandXml(
        R,
        doc('<CgPoints><CgPoint name="a&lt;&#x42;&#67;&amp;#10;">1 2</CgPoint></CgPoints>'),
      )[0]!.name,
    ).toBe('a<BC&#10;');
    expect(
      messageOf(() =>
        readLandXml(R, doc('<CgPoints><CgPoint name="&nbsp;">1 2</CgPoint></CgPoints>')),
      ),
    ).toMatch(/&nbsp;/);
  });

  it('refuses missing required attributes and broken points, naming element and line', () => {
    expect(
      messageOf(() => readLandXml(R, doc('<CgPoints>\n<CgPoint>1 2</CgPoint></CgPoints>'))),
    ).toMatch(/<CgPoint> at line 5.*name is missing/);
    expect(
      messageOf(() => readLandXml(R, doc('<CgPoints><CgPoint name="A">1</CgPoint></CgPoints>'))),
    ).toMatch(/northing easting/);
    expect(
      messageOf(() =>
        readLandXml(R, doc('<CgPoints><CgPoint name="A">1,5 2</CgPoint></CgPoints>')),
      ),
    ).toMatch(/not a decimal number/);
    expect(
      messageOf(() =>
        readLandXml(R, doc('<CgPoints><CgPoint name="A">NaN 2</CgPoint></CgPoints>')),
      ),
    ).toMatch(/not a decimal number/);
    expect(
      messageOf(() => readLandXml(R, doc('<CgPoints><CgPoint name="A" pntRef="Z"/></CgPoints>'))),
    ).toMatch(/pntRef "Z"/);
    expect(
      messageOf(() =>
        readLandXml(
          R,
          doc(
            '<CgPoints><CgPoint name="A">1 2</CgPoint><CgPoint name="A">3 4</CgPoint></CgPoints>',
          ),
        ),
      ),
    ).toMatch(/"A" is used again/);
    expect(
      messageOf(() =>
        readLandXml(
          R,
          '<LandXML version="1.2"><CgPoints><CgPoint name="A">1 2</CgPoint></CgPoints></LandXML>',
        ),
      ),
    ).toMatch(/no Units/);
    expect(
      messageOf(() => readLandXml(R, doc('<Survey><InstrumentSetup stationName="A"/></Survey>'))),
    ).toMatch(/<InstrumentSetup> at line 4.*id is missing/);
  });

  it('refuses what it does not understand inside the parts it reads, or skips and lists it when asked', () => {
    const text = doc('<CgPoints><CgPoint name="A" weird="1">1 2</CgPoint><Note/></CgPoints>');
    expect(messageOf(() => readLandXml(R, text))).toMatch(/attribute weird/);
    const d = readLandXml(R, text, { others: 'skip' });
    expect(d.points.length).toBe(1);
    expect(d.notRead).toEqual(['attribute weird of <CgPoint> at line 4', '<Note> at line 4']);
    // sections it does not read are listed, never half-read
    const s = readLandXml(
      R,
      doc(
        '<Surfaces><Surface name="g"/></Surfaces><CgPoints><CgPoint name="A">1 2</CgPoint></CgPoints>',
      ),
    );
    expect(s.notRead).toEqual(['<Surfaces> at line 4']);
    expect(codeOf(() => readLandXml(R, text, { others: 'drop' as never }))).toBe(
      'INVALID_ARGUMENT',
    );
  });

  it('reads through pointsFromFile by extension and by content', () => {
    const text = doc('<CgPoints><CgPoint name="A">200 100 5</CgPoint></CgPoints>');
    for (const name of ['site.xml', 'site.landxml', 'export.dat'])
      expect(pointsFromFile(float, name, text)).toEqual([{ name: 'A', x: 100, y: 200, height: 5 }]);
    expect(codeOf(() => pointsFromFile(float, 'site.xml', doc('')))).toBe('INVALID_FILE');
  });
});

describe('readLandXml: the Survey section', () => {
  const survey = (
    angular: string,
    unit = angular === '100' ? 'grads' : angular === '90.3015' ? 'decimal dd.mm.ss' : 'radians',
  ) =>
    doc(
      `<Survey>
        <CgPoints><CgPoint name="S1">1000 2000 50</CgPoint></CgPoints>
        <InstrumentSetup id="IS1" stationName="S1" instrumentHeight="1.55">
          <InstrumentPoint pntRef="S1"/>
          <Backsight><BacksightPoint pntRef="B1"/></Backsight>
        </InstrumentSetup>
        <ObservationGroup id="OG1" setupID="IS1" purpose="normal">
          <RawObservation purpose="backsight" horizAngle="0" zenithAngle="${angular}" slopeDistance="120.005" targetHeight="1.6" directFace="true"><TargetPoint pntRef="B1"/></RawObservation>
          <RawObservation horizAngle="${angular}" horizDistance="80.5" vertDistance="-1.25"><TargetPoint name="P7"/><FieldNote>wall corner</FieldNote></RawObservation>
        </ObservationGroup>
      </Survey>`,
      `<Units><Metric linearUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter" angularUnit="${unit}"/></Units>`,
    );

  it('reads set-ups, backsight, observations and their targets', () => {
    const d = readLandXml(R, survey('100'));
    expect(d.points.map((p) => p.name)).toEqual(['S1']);
    const [s] = d.setups;
    expect([s!.id, s!.station, R.toString(s!.instrumentHeight!), s!.backsight]).toEqual([
      'IS1',
      'S1',
      '31/20',
      'B1',
    ]);
    const [a, b] = s!.observations;
    expect(a!.target).toBe('B1');
    expect(a!.purpose).toBe('backsight');
    expect(a!.directFace).toBe(true);
    // 100 gon = 90° exactly
    expect(R.toString(a!.zenithAngle!)).toBe('90');
    expect(R.toString(a!.slopeDistance!)).toBe('24001/200');
    expect(R.toString(a!.targetHeight!)).toBe('8/5');
    expect(b!.target).toBe('P7');
    // the group's purpose where the observation has none
    expect(b!.purpose).toBe('normal');
    expect(R.toString(b!.horizontalDistance!)).toBe('161/2');
    expect(R.toString(b!.verticalDistance!)).toBe('-5/4');
  });

  it('converts angles from decimal dd.mm.ss and radians to degrees', () => {
    // 90.3015 in dd.mm.ss is 90° 30′ 15″ = 90 + 30/60 + 15/3600 = 21721/240 degrees
    const d = readLandXml(R, survey('90.3015'));
    expect(R.toString(d.setups[0]!.observations[1]!.horizontalAngle!)).toBe('21721/240');
    // π/2 rad = 90°, within the arithmetic's tolerance
    const r = readLandXml(decimal(30), survey('1.5707963267948966192313216916398'));
    const z = r.setups[0]!.observations[0]!.zenithAngle!;
    expect(Math.abs(decimal(30).toNumber(z) - 90)).toBeLessThan(1e-12);
    // minutes of 60 or more are refused
    expect(messageOf(() => readLandXml(R, survey('90.6015', 'decimal dd.mm.ss')))).toMatch(
      /minutes of 60/,
    );
  });

  it('refuses an observation whose set-up is not in the file', () => {
    const text = doc(
      '<Survey><ObservationGroup id="G" setupID="X"><RawObservation horizAngle="1"/></ObservationGroup></Survey>',
    );
    expect(messageOf(() => readLandXml(R, text))).toMatch(/setupID "X"/);
  });
});

describe('toLandXml', () => {
  const date = new Date('2026-12-03T09:15:30Z');
  const h = horizontalAlignment(R, {
    points: [
      { x: 1000, y: 1000 },
      { x: 1000, y: 1300 },
      { x: 1240, y: 1620 },
      { x: 1640, y: 1620 },
    ],
    curves: [{ radius: 150 }, { radius: 200, transitionIn: 40, transitionOut: 40 }],
    startChainage: 500,
    equations: [{ back: 600, ahead: 650 }],
  });
  const v = verticalAlignment(R, {
    points: [
      { chainage: 500, level: 20 },
      { chainage: 700, level: 24 },
      { chainage: 900, level: 21 },
      { chainage: 1100, level: 22 },
    ],
    curves: [null, { length: 100 }, { lengthIn: 40, lengthOut: 60 }, null],
  });
  const content = {
    points: [
      { name: 'CP1', x: '1000', y: '1000', height: '20.125', code: 'CP' },
      { name: 'A&B <"x">', x: '1012.3456', y: '998.7', description: 'line one\nline two\ttab' },
    ],
    parcels: [
      {
        name: 'Lot 7',
        points: [
          { x: 0, y: 0 },
          { x: 0, y: 40 },
          { x: 30, y: 40 },
          { x: 30, y: 0 },
        ],
      },
    ],
    alignments: [{ name: 'Main St', horizontal: h, vertical: v, description: 'centre line' }],
    lines: [
      {
        name: 'Traverse 1',
        code: 'traverse',
        points: [
          { x: 1000, y: 1000 },
          { x: 1030, y: 1040 },
          { x: 1000, y: 1000 },
        ],
      },
    ],
  };
  const xml = toLandXml(R, content, { date });

  it('writes a document that passes the structural check of the schema', () => {
    expect(landXmlStructureErrors(xml)).toEqual([]);
    expect(xml).toMatch(/version="1.2" date="2026-12-03" time="09:15:30"/);
  });

  it('the structural check catches what it is written for', () => {
    expect(landXmlStructureErrors(xml.replace('rot="cw"', 'rot="right"'))).toEqual([
      expect.stringMatching(/rot="right" not in the enumeration/),
    ]);
    expect(landXmlStructureErrors(xml.replace(' staStart="500"', ''))[0]).toMatch(
      /Alignment: required attribute staStart missing/,
    );
    expect(
      landXmlStructureErrors(xml.replace('<Center>', '<Middle>').replace('</Center>', '</Middle>'))
        .length,
    ).toBeGreaterThan(0);
    expect(
      landXmlStructureErrors(xml.replace(/<Start>[^<]*<\/Start>/, '<Start>1 2 3 4</Start>'))[0],
    ).toMatch(/not point/);
  });

  it('reads back the same points: names exactly, values exactly in rational', () => {
    const back = readLandXml(R, xml, { others: 'refuse' });
    expect(back.points.map((p) => p.name)).toEqual(['CP1', 'A&B <"x">']);
    expect(back.points[1]!.description).toBe('line one\nline two\ttab');
    expect(R.toString(back.points[1]!.x)).toBe(R.toString(R.from('1012.3456')));
    expect(R.toString(back.points[1]!.y)).toBe(R.toString(R.from('998.7')));
    expect(R.toString(back.points[0]!.height!)).toBe(R.toString(R.from('20.125')));
    expect(back.points[0]!.code).toBe('CP');
    // sections written but not read by the points reader are listed
    expect(back.notRead).toEqual([
      expect.stringMatching(/^<Parcels>/),
      expect.stringMatching(/^<Alignments>/),
      expect.stringMatching(/^<PlanFeatures>/),
    ]);
  });

  it('writes the parcel closed, with its area (30 m × 40 m = 1200 m²)', () => {
    expect(xml).toMatch(/<Parcel name="Lot 7" area="1200">/);
    const parcel = /<Parcel [\s\S]*?<\/Parcel>/.exec(xml)![0];
    const lines = [...parcel.matchAll(/<Line><Start>([^<]*)<\/Start><End>([^<]*)<\/End><\/Line>/g)];
    expect(lines.length).toBe(4);
    expect(lines[3]![2]).toBe(lines[0]![1]);
  });

  it('writes the alignment: elements joined end to start, arcs of their radius, spiral PIs on the tangents', () => {
    const nums = (s: string) => s.trim().split(/\s+/).map(Number);
    const els = [
      ...xml.matchAll(/<(Line|Curve|Spiral) staStart="([^"]*)" length="([^"]*)"[^>]*>(.*?)<\/\1>/g),
    ];
    // straight, arc, straight, transition, arc, transition, straight
    expect(els.map((m) => m[1])).toEqual([
      'Line',
      'Curve',
      'Line',
      'Spiral',
      'Curve',
      'Spiral',
      'Line',
    ]);
    const pt = (body: string, tag: string) =>
      nums(new RegExp(`<${tag}>([^<]*)</${tag}>`).exec(body)![1]!);
    for (let i = 1; i < els.length; i++) {
      const end = pt(els[i - 1]![4]!, 'End');
      const start = pt(els[i]![4]!, 'Start');
      expect(Math.hypot(end[0]! - start[0]!, end[1]! - start[1]!)).toBeLessThan(1.5e-4);
    }
    // an arc's start and end lie at its radius from its centre (values rounded to 0.1 mm)
    const arc = els[1]![4]!;
    const c = pt(arc, 'Center');
    for (const tag of ['Start', 'End'])
      expect(
        Math.abs(Math.hypot(pt(arc, tag)[0]! - c[0]!, pt(arc, tag)[1]! - c[1]!) - 150),
      ).toBeLessThan(2e-4);
    // the entering spiral's PI lies on the straight before it (on the line through its ends)
    const straight = els[2]![4]!;
    const s0 = pt(straight, 'Start');
    const s1 = pt(straight, 'End');
    const pi = pt(els[3]![4]!, 'PI');
    const cross = (s1[0]! - s0[0]!) * (pi[1]! - s0[1]!) - (s1[1]! - s0[1]!) * (pi[0]! - s0[0]!);
    expect(Math.abs(cross) / Math.hypot(s1[0]! - s0[0]!, s1[1]! - s0[1]!)).toBeLessThan(2e-4);
    expect(els[3]![0]).toMatch(/radiusStart="INF" radiusEnd="200"/);
    expect(els[5]![0]).toMatch(/radiusStart="200" radiusEnd="INF"/);
    // the chainage equation at the internal station of its distance (600 back, 650 ahead)
    expect(xml).toMatch(/<StaEquation staBack="600" staAhead="650" staInternal="600"\/>/);
  });

  it('writes a traverse as a plan feature of lines from vertex to vertex (northing first)', () => {
    expect(xml).toMatch(
      /<PlanFeature name="Traverse 1" code="traverse">\s*<CoordGeom>\s*<Line><Start>1000 1000<\/Start><End>1040 1030<\/End><\/Line>\s*<Line><Start>1040 1030<\/Start><End>1000 1000<\/End><\/Line>\s*<\/CoordGeom>/,
    );
    expect(
      codeOf(() => toLandXml(R, { lines: [{ name: 'L', points: [{ x: 0, y: 0 }] }] }, { date })),
    ).toBe('INVALID_ARGUMENT');
  });

  it('writes the profile: PVIs and symmetric and unsymmetric parabolic curves', () => {
    expect(xml).toMatch(
      /<PVI>500 20<\/PVI>\s*<ParaCurve length="100">700 24<\/ParaCurve>\s*<UnsymParaCurve lengthIn="40" lengthOut="60">900 21<\/UnsymParaCurve>\s*<PVI>1100 22<\/PVI>/,
    );
  });

  it('states US survey feet when asked, and reads back in them', () => {
    const ft = toLandXml(
      R,
      { points: [{ name: 'A', x: '1.5', y: '2.25' }] },
      { date, linearUnit: 'USSurveyFoot' },
    );
    expect(landXmlStructureErrors(ft)).toEqual([]);
    const back = readLandXml(R, ft);
    expect(back.units?.linear).toBe('USSurveyFoot');
    expect(R.toString(back.points[0]!.y)).toBe('9/4');
  });

  it('refuses bad content and options with typed errors naming them', () => {
    expect(
      codeOf(() => toLandXml(R, { points: [{ name: 'A\u0001', x: 1, y: 2 }] }, { date })),
    ).toBe('INVALID_ARGUMENT');
    expect(
      messageOf(() =>
        toLandXml(
          R,
          {
            points: [
              { name: 'A', x: 1, y: 2 },
              { name: 'A', x: 1, y: 2 },
            ],
          },
          { date },
        ),
      ),
    ).toMatch(/points\[1\]\)\.name.*twice/);
    expect(
      codeOf(() =>
        toLandXml(
          R,
          {
            parcels: [
              {
                name: 'P',
                points: [
                  { x: 0, y: 0 },
                  { x: 1, y: 1 },
                  { x: 2, y: 2 },
                ],
              },
            ],
          },
          { date },
        ),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => toLandXml(R, {}, { linearUnit: 'chain' as never }))).toBe('INVALID_UNIT');
    expect(codeOf(() => toLandXml(R, {}, { decimals: 13 }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => toLandXml(R, {}, { date: new Date('x') }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => toLandXml(R, null as never))).toBe('INVALID_ARGUMENT');
    // a hole in a list is refused, not passed over (forEach would skip it)
    // eslint-disable-next-line no-sparse-arrays
    const holey = [, { name: 'A', x: 1, y: 2 }] as never;
    expect(messageOf(() => toLandXml(R, { points: holey }, { date }))).toMatch(
      /points\[0\]\).*hole/,
    );
    expect(
      codeOf(() =>
        toLandXml(R, { points: [{ name: 'A', x: 1, y: 2, code: Object.create(null) }] }, { date }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      codeOf(() => toLandXml(R, { alignments: [{ name: 'A', horizontal: {} as never }] })),
    ).toBe('INVALID_ARGUMENT');
  });

  it('writes the same text in float as in rational for decimal inputs', () => {
    const f = toLandXml(float, { points: content.points, parcels: content.parcels }, { date });
    const r = toLandXml(R, { points: content.points, parcels: content.parcels }, { date });
    expect(f).toBe(r);
  });
});

describe('landXmlStations: a LandXML survey into the field functions', () => {
  // A station S1 (east 1000, north 2000, height 50), a backsight B1 due north of it read at
  // circle 10°, and three shots; the expected coordinates worked by hand: bearing = circle −
  // 10°, east = 1000 + d·sin(bearing), north = 2000 + d·cos(bearing).
  const text = doc(
    `<CgPoints><CgPoint name="S1">2000 1000 50</CgPoint><CgPoint name="B1">2100 1000 51</CgPoint></CgPoints>
    <Survey>
      <InstrumentSetup id="IS1" stationName="S1" instrumentHeight="1.6"/>
      <ObservationGroup id="G1" setupID="IS1">
        <RawObservation purpose="backsight" horizAngle="10" zenithAngle="90" slopeDistance="100"><TargetPoint pntRef="B1"/></RawObservation>
        <RawObservation horizAngle="100" zenithAngle="90" slopeDistance="25" targetHeight="1.6"><TargetPoint pntRef="P1"/></RawObservation>
        <RawObservation horizAngle="190" horizDistance="40"><TargetPoint pntRef="P2"/></RawObservation>
        <RawObservation horizAngle="280" zenithAngle="60" slopeDistance="20" targetHeight="2.1"><TargetPoint pntRef="P3"/></RawObservation>
      </ObservationGroup>
    </Survey>`,
  );

  it('orients the station on its backsight and gives the shots where they are', () => {
    const d = readLandXml(R, text);
    const [s] = landXmlStations(R, d);
    expect(s!.id).toBe('IS1');
    expect(s!.orient.backsights).toHaveLength(1);
    const setup = orientStation(R, s!.orient);
    // B1 is due north (bearing 0) read at circle 10°: the orientation is −10° (350°)
    expect(R.toNumber(setup.orientation) % 360).toBeCloseTo(350, 12);
    const shots = sideShots(R, setup, s!.shots);
    expect(shots.map((p) => p.name)).toEqual(['P1', 'P2', 'P3']);
    // P1: bearing 90°, 25 m level: (1025, 2000), height 50 + 1.6 − 1.6 = 50
    expect(R.toNumber(shots[0]!.x)).toBeCloseTo(1025, 9);
    expect(R.toNumber(shots[0]!.y)).toBeCloseTo(2000, 9);
    expect(R.toNumber(shots[0]!.z!)).toBeCloseTo(50, 9);
    // P2: bearing 180°, 40 m horizontal: (1000, 1960)
    expect(R.toNumber(shots[1]!.x)).toBeCloseTo(1000, 9);
    expect(R.toNumber(shots[1]!.y)).toBeCloseTo(1960, 9);
    // P3: bearing 270°, zenith 60°: horizontal 20·sin 60° = 17.3205…, rise 20·cos 60° = 10,
    // height 50 + 1.6 + 10 − 2.1 = 59.5
    expect(R.toNumber(shots[2]!.x)).toBeCloseTo(1000 - 20 * Math.sin(Math.PI / 3), 9);
    expect(R.toNumber(shots[2]!.y)).toBeCloseTo(2000, 9);
    expect(R.toNumber(shots[2]!.z!)).toBeCloseTo(59.5, 9);
  });

  it('refuses a station without coordinates and a shot without distances, naming the line', () => {
    const noStation = readLandXml(
      R,
      doc(
        '<Survey><InstrumentSetup id="IS1" stationName="S9"/><ObservationGroup id="G" setupID="IS1"><RawObservation horizAngle="1" horizDistance="2"><TargetPoint pntRef="P"/></RawObservation></ObservationGroup></Survey>',
      ),
    );
    expect(messageOf(() => landXmlStations(R, noStation))).toMatch(
      /station "S9" has no coordinates/,
    );
    const noDistance = readLandXml(
      R,
      doc(
        '<CgPoints><CgPoint name="S1">1 2</CgPoint></CgPoints><Survey><InstrumentSetup id="IS1" stationName="S1"/><ObservationGroup id="G" setupID="IS1">\n<RawObservation horizAngle="1" zenithAngle="90"><TargetPoint pntRef="P"/></RawObservation></ObservationGroup></Survey>',
      ),
    );
    expect(messageOf(() => landXmlStations(R, noDistance))).toMatch(
      /line 5.*neither a slope distance/,
    );
    expect(codeOf(() => landXmlStations(R, {} as never))).toBe('INVALID_ARGUMENT');
  });
});

describe('landXmlStations on a document altered after reading', () => {
  it('refuses a point, set-up or observation that is not an object, naming it (not a TypeError)', async () => {
    const { landXmlStations: stations } = await import('../../src/io/index.js');
    const { rational: Ra } = await import('../../src/index.js');
    const base = { points: [], setups: [] };
    for (const [d, at] of [
      [{ ...base, points: [undefined] }, /points\[0\]/],
      [{ ...base, points: [{ name: 5 }] }, /points\[0\]/],
      [{ ...base, setups: [null] }, /setups\[0\]/],
      [{ ...base, setups: [{ observations: [7] }] }, /setups\[0\]\.observations\[0\]/],
    ] as const) {
      let err: unknown;
      try {
        stations(Ra, d as never);
      } catch (e) {
        err = e;
      }
      expect((err as { code?: string }).code).toBe('INVALID_ARGUMENT');
      expect((err as Error).message).toMatch(at);
    }
  });
});
