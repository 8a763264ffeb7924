/**
 * The tables of a traverse: the traverse sheet (bearings, distances, latitudes, departures
 * and their corrections), the adjusted courses (adjusted bearings and distances) and the
 * coordinate list (unadjusted and adjusted), laid out as survey computation sheets are.
 *
 * @module cli
 */
import { inverse } from '../../index.js';
import type { AngleKind, Arithmetic, CarriedBearings, Point } from '../../index.js';
import type { Cell, RawTable } from '../task.js';

/** Sum of values. */
function total<V>(A: Arithmetic<V, boolean>, xs: V[]): V {
  return xs.reduce((s, x) => A.add(s, x), A.zero);
}

/** The bearing of a course from its latitude dy and departure dx; blank for a null course. */
function bearingOf<V>(A: Arithmetic<V, boolean>, dy: V, dx: V): Cell<V> {
  return A.isZero(dx) && A.isZero(dy)
    ? ''
    : inverse(A, { x: A.zero, y: A.zero }, { x: dx, y: dy }).azimuth;
}

/** What the tables need of a traverse: adjusted parts absent for an open traverse. */
interface Computed<V> {
  readonly rule: 'compass' | 'transit' | undefined;
  readonly length: V;
  readonly points: Point<V>[];
  readonly adjusted?: Point<V>[];
  readonly courses: readonly {
    latitude: V;
    departure: V;
    length: V;
    adjustedLatitude?: V;
    adjustedDeparture?: V;
  }[];
}

/**
 * The tables of a computed traverse: the traverse sheet, and for one that closes the adjusted
 * courses, and the coordinate list. `bearings[i]` is course i's given bearing in degrees
 * (undefined for a course given by latitude and departure: its bearing is computed);
 * `carried`, the bearings carried through measured angles.
 */
export function traverseTables<V>(
  A: Arithmetic<V, boolean>,
  t: Computed<V>,
  names: string[],
  bearings: (V | undefined)[],
  unit: string,
  carried?: readonly V[],
): RawTable<V>[] {
  if (t.rule === undefined || t.adjusted === undefined)
    return openTables(A, t, names, bearings, unit, carried);
  const adjustedPoints = t.adjusted;
  const line = (i: number): string => `${names[i]}–${names[i + 1]}`;
  const c = t.courses;
  const corrLat = c.map((k) => A.sub(k.adjustedLatitude!, k.latitude));
  const corrDep = c.map((k) => A.sub(k.adjustedDeparture!, k.departure));
  const sheet: RawTable<V> = {
    name: 'traverse-sheet',
    title: `Traverse sheet (${t.rule} rule)`,
    columns: [
      { label: 'Line' },
      { label: 'Bearing', kind: 'bearing' },
      { label: 'Distance', kind: 'length' },
      { label: 'Latitude', kind: 'length' },
      { label: 'Departure', kind: 'length' },
      { label: 'Corr lat', kind: 'length' },
      { label: 'Corr dep', kind: 'length' },
    ],
    rows: [
      ...c.map((k, i) => [
        line(i),
        bearings[i] ?? carried?.[i] ?? bearingOf(A, k.latitude, k.departure),
        k.length,
        k.latitude,
        k.departure,
        corrLat[i],
        corrDep[i],
      ]),
      [
        'Σ',
        undefined,
        t.length,
        total(
          A,
          c.map((k) => k.latitude),
        ),
        total(
          A,
          c.map((k) => k.departure),
        ),
        total(A, corrLat),
        total(A, corrDep),
      ],
    ],
    notes: [
      `Latitude = distance × cos(bearing) (north), departure = distance × sin(bearing) (east); lengths in ${unit}. For a loop, Σ latitude and Σ departure are the misclosure, and the corrections sum to minus it.`,
      ...(carried
        ? ['Bearings carried from the starting bearing through the balanced angles.']
        : []),
    ],
  };
  const adjusted: RawTable<V> = {
    name: 'adjusted-courses',
    title: 'Adjusted courses',
    columns: [
      { label: 'Line' },
      { label: 'Adj latitude', kind: 'length' },
      { label: 'Adj departure', kind: 'length' },
      { label: 'Adj bearing', kind: 'bearing' },
      { label: 'Adj distance', kind: 'length' },
    ],
    rows: c.map((k, i) => {
      const la = k.adjustedLatitude!;
      const de = k.adjustedDeparture!;
      const zero = A.isZero(la) && A.isZero(de);
      const inv = zero ? undefined : inverse(A, { x: A.zero, y: A.zero }, { x: de, y: la });
      return [line(i), la, de, inv ? inv.azimuth : '', inv ? (inv.distance as Cell<V>) : A.zero];
    }),
  };
  const coords: RawTable<V> = {
    name: 'coordinates',
    title: 'Coordinate list',
    columns: [
      { label: 'Point' },
      { label: 'East', kind: 'length' },
      { label: 'North', kind: 'length' },
      { label: 'Adj east', kind: 'length' },
      { label: 'Adj north', kind: 'length' },
    ],
    rows: t.points.map((p, i) => [
      names[i] ?? `P${i}`,
      p.x,
      p.y,
      adjustedPoints[i]!.x,
      adjustedPoints[i]!.y,
    ]),
    notes: [
      'East and north unadjusted as carried from the start; the last row, computed, differs from the closing point by the misclosure.',
    ],
  };
  return [sheet, adjusted, coords];
}

/** The sheet and coordinate list of an open traverse: nothing adjusted. */
function openTables<V>(
  A: Arithmetic<V, boolean>,
  t: Computed<V>,
  names: string[],
  bearings: (V | undefined)[],
  unit: string,
  carried: readonly V[] | undefined,
): RawTable<V>[] {
  const line = (i: number): string => `${names[i]}–${names[i + 1]}`;
  const c = t.courses;
  return [
    {
      name: 'traverse-sheet',
      title: 'Traverse sheet (open: not adjusted)',
      columns: [
        { label: 'Line' },
        { label: 'Bearing', kind: 'bearing' },
        { label: 'Distance', kind: 'length' },
        { label: 'Latitude', kind: 'length' },
        { label: 'Departure', kind: 'length' },
      ],
      rows: [
        ...c.map((k, i) => [
          line(i),
          bearings[i] ?? carried?.[i] ?? bearingOf(A, k.latitude, k.departure),
          k.length,
          k.latitude,
          k.departure,
        ]),
        [
          'Σ',
          undefined,
          t.length,
          total(
            A,
            c.map((k) => k.latitude),
          ),
          total(
            A,
            c.map((k) => k.departure),
          ),
        ],
      ],
      notes: [
        `Latitude = distance × cos(bearing) (north), departure = distance × sin(bearing) (east); lengths in ${unit}. An open traverse has no misclosure: nothing is corrected.`,
      ],
    },
    {
      name: 'coordinates',
      title: 'Coordinate list',
      columns: [
        { label: 'Point' },
        { label: 'East', kind: 'length' },
        { label: 'North', kind: 'length' },
      ],
      rows: t.points.map((p, i) => [names[i] ?? `P${i}`, p.x, p.y]),
      notes: ['Carried from the start; not checked.'],
    },
  ];
}

/**
 * The angle book of a traverse measured as angles: each station's measured angle, its
 * correction (seconds of arc), the balanced angle, and the line it turns to with the
 * bearing carried. `measured` holds the course angles (and the closing angle of a link);
 * `closingLine` names the closing line of a link.
 */
export function angleTable<V>(
  A: Arithmetic<V, boolean>,
  carried: CarriedBearings<V>,
  names: string[],
  kind: AngleKind,
  measured: V[],
  closingLine: string | undefined,
): RawTable<V> {
  const n = carried.bearings.length;
  const loop = carried.expected !== undefined && closingLine === undefined;
  const rows: Cell<V>[][] = measured.map((m, i) => {
    const b = carried.balanced[i]!;
    const closing = i === n;
    return [
      closing ? names[n]! : names[i]!,
      m,
      A.sub(b, m),
      b,
      closing
        ? closingLine!
        : loop && i === n - 1
          ? `${names[i]}–${names[0]}`
          : `${names[i]}–${names[i + 1]}`,
      closing ? carried.expected! : carried.bearings[i]!,
    ];
  });
  const sum = (xs: V[]): V => total(A, xs);
  rows.push([
    'Σ',
    sum(measured),
    A.sub(sum(carried.balanced), sum(measured)),
    sum(carried.balanced),
    '',
    '',
  ]);
  const words =
    kind === 'deflection'
      ? 'deflection angles (right positive)'
      : kind === 'right'
        ? 'angles to the right'
        : `${kind} angles`;
  const notes = [
    carried.misclosure === undefined
      ? 'Nothing checks these angles: they are carried as measured.'
      : closingLine !== undefined
        ? 'The last bearing is the known closing bearing, which the balanced angles reach.'
        : `The balanced angles sum to the condition of a loop, ${Math.round(A.toNumber(carried.expected!))}°; the first bearing is the starting bearing.`,
    kind === 'deflection'
      ? 'Bearing = previous bearing + deflection.'
      : 'Bearing = previous bearing + 180° + angle, reduced to 0–360°.',
  ];
  return {
    name: 'angle-book',
    title: `Angles and bearings (${words})`,
    columns: [
      { label: 'Station' },
      { label: 'Measured', kind: 'angle' },
      { label: 'Corr', kind: 'seconds' },
      { label: 'Balanced', kind: 'angle' },
      { label: 'Line' },
      { label: 'Bearing', kind: 'bearing' },
    ],
    rows,
    notes,
  };
}
