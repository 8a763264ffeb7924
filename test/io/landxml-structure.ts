// A structural check of LandXML 1.2 documents for the elements the io entry reads and writes:
// allowed and required attributes, enumerated values, allowed children (and their order where
// the schema fixes it), and the text of point elements. Written here from the published
// LandXML 1.2 schema (LandXML-1.2.xsd, http://www.landxml.org/schema/LandXML-1.2) as its
// element reference describes it — from memory, as the schema file is not on this machine: a
// check of structure, not a full XSD validation. Independent of the library's reader: it walks
// the tree that fast-xml-parser gives, in document order.
import { XMLParser, XMLValidator } from 'fast-xml-parser';

interface Rule {
  required?: string[];
  optional?: string[];
  enums?: Record<string, readonly string[]>;
  /** Allowed child elements; `sequence` fixes their order (each at most once unless repeated). */
  children?: string[];
  sequence?: string[];
  /** Exactly one of these children (Units). */
  oneOf?: string[];
  /** The element's text: 'point' (2 or 3 numbers), 'staElev' (2 numbers), or none. */
  text?: 'point' | 'staElev';
}

const DOUBLE = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const ANGULAR = ['radians', 'grads', 'decimal degrees', 'decimal dd.mm.ss'];
const COMMON = ['desc', 'name', 'state', 'oID', 'note'];
const POINT: Rule = {
  optional: ['name', 'desc', 'code', 'state', 'pntRef', 'featureRef', 'pntSurv', 'oID'],
  text: 'point',
};

const RULES: Record<string, Rule> = {
  LandXML: {
    required: ['date', 'time', 'version'],
    optional: [
      'xmlns',
      'xmlns:xsi',
      'xsi:schemaLocation',
      'language',
      'readOnly',
      'LandXMLId',
      'crc',
    ],
    children: [
      'Units',
      'CoordinateSystem',
      'Project',
      'Application',
      'CgPoints',
      'Alignments',
      'Parcels',
      'PlanFeatures',
      'Survey',
    ],
  },
  Units: { oneOf: ['Metric', 'Imperial'] },
  Metric: {
    required: ['areaUnit', 'linearUnit', 'volumeUnit', 'temperatureUnit', 'pressureUnit'],
    optional: ['angularUnit', 'directionUnit', 'elevationUnit', 'latLongAngularUnit'],
    enums: {
      areaUnit: ['hectare', 'squareMeter', 'squareMillimeter', 'squareCentimeter'],
      linearUnit: ['millimeter', 'centimeter', 'meter', 'kilometer'],
      volumeUnit: ['cubicMeter', 'liter', 'hectareMeter'],
      temperatureUnit: ['celsius', 'kelvin'],
      pressureUnit: ['HPA', 'milliBars', 'mmHG', 'millimeterHG'],
      angularUnit: ANGULAR,
      directionUnit: ANGULAR,
    },
  },
  Imperial: {
    required: ['areaUnit', 'linearUnit', 'volumeUnit', 'temperatureUnit', 'pressureUnit'],
    optional: ['angularUnit', 'directionUnit', 'elevationUnit', 'latLongAngularUnit'],
    enums: {
      areaUnit: ['acre', 'squareFoot', 'squareInch', 'squareMiles'],
      linearUnit: ['foot', 'USSurveyFoot', 'inch', 'mile'],
      volumeUnit: ['cubicFeet', 'cubicInch', 'cubicYard', 'acreFeet'],
      temperatureUnit: ['fahrenheit', 'kelvin'],
      pressureUnit: ['inHG', 'inchHG'],
      angularUnit: ANGULAR,
      directionUnit: ANGULAR,
    },
  },
  Application: {
    required: ['name'],
    optional: ['desc', 'manufacturer', 'version', 'manufacturerURL', 'timeStamp'],
  },
  CgPoints: {
    optional: [...COMMON, 'zoneNumber', 'dataFormat'],
    children: ['CgPoint', 'CgPoints'],
  },
  CgPoint: POINT,
  Parcels: { optional: COMMON, children: ['Parcel'] },
  PlanFeatures: { optional: COMMON, children: ['PlanFeature'] },
  PlanFeature: { optional: [...COMMON, 'code'], children: ['CoordGeom', 'Location', 'Feature'] },
  Parcel: {
    optional: [...COMMON, 'area', 'parcelType', 'parcelFormat', 'class'],
    children: ['CoordGeom', 'Center'],
  },
  CoordGeom: { optional: COMMON, children: ['Line', 'IrregularLine', 'Curve', 'Spiral', 'Chain'] },
  Line: { optional: [...COMMON, 'dir', 'length', 'staStart'], sequence: ['Start', 'End'] },
  Curve: {
    required: ['rot'],
    optional: [
      ...COMMON,
      'chord',
      'crvType',
      'delta',
      'dirEnd',
      'dirStart',
      'external',
      'length',
      'midOrd',
      'radius',
      'staStart',
      'tangent',
    ],
    enums: { rot: ['cw', 'ccw'], crvType: ['arc', 'chord'] },
    sequence: ['Start', 'Center', 'End', 'PI'],
  },
  Spiral: {
    required: ['length', 'radiusEnd', 'radiusStart', 'rot', 'spiType'],
    optional: [
      ...COMMON,
      'chord',
      'constant',
      'dirEnd',
      'dirStart',
      'staStart',
      'theta',
      'totalY',
      'totalX',
      'tanLong',
      'tanShort',
    ],
    enums: {
      rot: ['cw', 'ccw'],
      spiType: [
        'biquadratic',
        'bloss',
        'clothoid',
        'cosine',
        'cubic',
        'sinusoid',
        'revBiquadratic',
        'revBloss',
        'revCosine',
        'revSinusoid',
        'sineHalfWave',
        'biquadraticParabola',
        'cubicParabola',
        'japaneseCubic',
        'radioid',
        'weinerBogen',
      ],
    },
    sequence: ['Start', 'PI', 'End'],
  },
  Start: POINT,
  End: POINT,
  Center: POINT,
  PI: POINT,
  Alignments: { optional: COMMON, children: ['Alignment'] },
  Alignment: {
    required: ['name', 'length', 'staStart'],
    optional: ['desc', 'oID', 'state'],
    children: ['CoordGeom', 'StaEquation', 'Profile'],
  },
  StaEquation: {
    required: ['staAhead', 'staInternal'],
    optional: ['staBack', 'desc', 'oID'],
  },
  Profile: { optional: ['name', 'desc', 'staStart', 'state'], children: ['ProfAlign'] },
  ProfAlign: {
    required: ['name'],
    optional: ['desc', 'state'],
    children: ['PVI', 'ParaCurve', 'UnsymParaCurve', 'CircCurve'],
  },
  PVI: { optional: ['desc', 'code'], text: 'staElev' },
  ParaCurve: { required: ['length'], optional: ['desc'], text: 'staElev' },
  UnsymParaCurve: { required: ['lengthIn', 'lengthOut'], optional: ['desc'], text: 'staElev' },
};

// Attributes whose values are xs:double in the schema (INF allowed for spiral radii).
const NUMERIC = new Set([
  'area',
  'length',
  'staStart',
  'radius',
  'radiusStart',
  'radiusEnd',
  'staAhead',
  'staBack',
  'staInternal',
  'lengthIn',
  'lengthOut',
]);

type Node = Record<string | symbol, unknown>;

/** The structural errors of a LandXML document (empty when it passes), each naming the element. */
export function landXmlStructureErrors(xml: string): string[] {
  const errors: string[] = [];
  const wf = XMLValidator.validate(xml);
  if (wf !== true) return [`not well-formed: ${wf.err.msg} (line ${wf.err.line})`];
  const parsed = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '',
    attributesGroupName: '@',
    preserveOrder: true,
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
  }).parse(xml) as Node[];
  const visit = (name: string, node: Node, path: string): void => {
    const here = `${path}/${name}`;
    const rule = RULES[name];
    if (rule === undefined) {
      errors.push(`${here}: element not in the checked part of the schema`);
      return;
    }
    const attrs = (node[':@'] as Record<string, string> | undefined)?.['@'] as
      Record<string, string> | undefined;
    const a = attrs ?? (node[':@'] as Record<string, string> | undefined) ?? {};
    const allowed = new Set([...(rule.required ?? []), ...(rule.optional ?? [])]);
    for (const r of rule.required ?? [])
      if (a[r] === undefined) errors.push(`${here}: required attribute ${r} missing`);
    for (const [k, v] of Object.entries(a)) {
      if (!allowed.has(k)) errors.push(`${here}: attribute ${k} not allowed`);
      const en = rule.enums?.[k];
      if (en && !en.includes(v)) errors.push(`${here}: ${k}="${v}" not in the enumeration`);
      if (NUMERIC.has(k) && !DOUBLE.test(v) && v !== 'INF')
        errors.push(`${here}: ${k}="${v}" is not a number`);
    }
    const content = (node[name] as Node[]) ?? [];
    const kids = content.filter((c) => !('#text' in c));
    const text = content
      .filter((c) => '#text' in c)
      .map((c) => String(c['#text']))
      .join(' ')
      .trim();
    const names = kids.map((k) => Object.keys(k).find((x) => x !== ':@')!);
    if (rule.text === 'point' || rule.text === 'staElev') {
      const parts = text.split(/\s+/).filter((s) => s !== '');
      const ok =
        parts.every((p) => DOUBLE.test(p)) &&
        (rule.text === 'staElev'
          ? parts.length === 2
          : parts.length === 2 || parts.length === 3 || (parts.length === 0 && a.pntRef));
      if (!ok) errors.push(`${here}: text "${text}" is not ${rule.text}`);
    } else if (text !== '') errors.push(`${here}: unexpected text "${text.slice(0, 30)}"`);
    if (rule.oneOf) {
      if (names.length !== 1 || !rule.oneOf.includes(names[0]!))
        errors.push(`${here}: needs exactly one of ${rule.oneOf.join(', ')}`);
    } else if (rule.sequence) {
      let at = 0;
      for (const n of names) {
        const i = rule.sequence.indexOf(n, at);
        if (i < 0)
          errors.push(`${here}: child ${n} out of the sequence ${rule.sequence.join(', ')}`);
        else at = i + 1;
      }
      for (const need of rule.sequence.filter((s) => s !== 'PI' || name === 'Spiral'))
        if (!names.includes(need)) errors.push(`${here}: child ${need} missing`);
    } else {
      for (const n of names)
        if (!(rule.children ?? []).includes(n)) errors.push(`${here}: child ${n} not allowed`);
    }
    if (name === 'Alignment' && !names.includes('CoordGeom'))
      errors.push(`${here}: child CoordGeom missing`);
    kids.forEach((k, i) => visit(names[i]!, k, here));
  };
  const roots = parsed.filter((n) => !('?xml' in n));
  if (roots.length !== 1) return ['no single root element'];
  const rootName = Object.keys(roots[0]!).find((x) => x !== ':@')!;
  if (rootName !== 'LandXML') return [`root is ${rootName}`];
  visit(rootName, roots[0]!, '');
  return errors;
}
