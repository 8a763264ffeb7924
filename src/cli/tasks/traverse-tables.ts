/**
 * The tables of a traverse: the traverse sheet (bearings, distances, latitudes, departures
 * and their corrections), the adjusted courses (adjusted bearings and distances) and the
 * coordinate list (unadjusted and adjusted), laid out as survey computation sheets are.
 *
 * @module cli
 */
import { inverse } from '../../index.js';
import type { Arithmetic, Traverse } from '../../index.js';
import type { Cell, RawTable } from '../task.js';

/** Sum of values. */
function total<V>(A: Arithmetic<V, boolean>, xs: V[]): V {
  return xs.reduce((s, x) => A.add(s, x), A.zero);
}

/**
 * The three tables of a computed traverse. `bearings[i]` is course i's given bearing in
 * degrees (undefined for a course given by latitude and departure: its bearing is computed).
 */
export function traverseTables<V>(
  A: Arithmetic<V, boolean>,
  t: Traverse<V, boolean>,
  names: string[],
  bearings: (V | undefined)[],
  unit: string,
): RawTable<V>[] {
  const line = (i: number): string => `${names[i]}–${names[i + 1]}`;
  const bearingOf = (i: number, dy: V, dx: V): Cell<V> =>
    A.isZero(dx) && A.isZero(dy)
      ? ''
      : inverse(A, { x: A.zero, y: A.zero }, { x: dx, y: dy }).azimuth;
  const c = t.courses;
  const corrLat = c.map((k) => A.sub(k.adjustedLatitude, k.latitude));
  const corrDep = c.map((k) => A.sub(k.adjustedDeparture, k.departure));
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
        bearings[i] ?? bearingOf(i, k.latitude, k.departure),
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
      const zero = A.isZero(k.adjustedLatitude) && A.isZero(k.adjustedDeparture);
      const inv = zero
        ? undefined
        : inverse(A, { x: A.zero, y: A.zero }, { x: k.adjustedDeparture, y: k.adjustedLatitude });
      return [
        line(i),
        k.adjustedLatitude,
        k.adjustedDeparture,
        inv ? inv.azimuth : '',
        inv ? (inv.distance as Cell<V>) : A.zero,
      ];
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
      t.adjusted[i]!.x,
      t.adjusted[i]!.y,
    ]),
    notes: [
      'East and north unadjusted as carried from the start; the last row, computed, differs from the closing point by the misclosure.',
    ],
  };
  return [sheet, adjusted, coords];
}
