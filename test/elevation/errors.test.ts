// Bad numbers given to an elevation solver: INVALID_NUMBER naming the function and the argument.
import { describe, expect, it } from 'vitest';
import { rational, float } from '../../src/index.js';
import { heightFromInlineReadings } from '../../src/elevation/inline.js';
import { heightFromTwoStations } from '../../src/elevation/two-stations.js';
import {
  trigHeight,
  reciprocalTrigHeight,
  curvatureRefraction,
} from '../../src/elevation/trig-heighting.js';
import {
  heightFromReading,
  horizontalFromHeight,
  verticalFromHeight,
} from '../../src/elevation/height.js';
import { heightFromBase } from '../../src/elevation/base.js';
import { heightFromInlineQuadrances } from '../../src/elevation/inline.js';
import { pathGrade, pathOffset } from '../../src/elevation/path.js';
import { verticalFromAngle } from '../../src/readings/vertical.js';

const cases: [string, () => unknown, string][] = [
  [
    'heightFromInlineReadings with a NaN chainage',
    () =>
      heightFromInlineReadings(float, {
        chainages: [0, 10, Number.NaN],
        vertical: [0.5, 0.4, 0.3],
      }),
    'heightFromInlineReadings(input).chainages[2]',
  ],
  [
    'heightFromInlineReadings with a reading that is not a number',
    () =>
      heightFromInlineReadings(rational, { chainages: [0, 10, 20], vertical: ['1/2', 'x', '1/3'] }),
    'heightFromInlineReadings(input).vertical[1]',
  ],
  [
    'heightFromTwoStations with a bad coordinate',
    () =>
      heightFromTwoStations(rational, {
        stations: [
          { x: 0, y: 'q' },
          { x: 1, y: 1 },
        ],
        foot: { x: 3, y: 3 },
        vertical: ['1/2', '1/2'],
      }),
    'heightFromTwoStations(input).stations[0].y',
  ],
  [
    'trigHeight with a distance that is not a number',
    () => trigHeight(rational, { distance: 'ten', measured: 'slope', vertical: '1/2' }),
    'trigHeight(sight).distance',
  ],
  [
    'trigHeight with a bad instrument height',
    () =>
      trigHeight(float, {
        distance: 10,
        measured: 'slope',
        vertical: 0.5,
        instrumentHeight: Number.NaN,
      }),
    'trigHeight(sight).instrumentHeight',
  ],
  [
    'trigHeight with a bad target height',
    () =>
      trigHeight(rational, {
        distance: 10,
        measured: 'slope',
        vertical: '1/2',
        targetHeight: 'tall',
      }),
    'trigHeight(sight).targetHeight',
  ],
  [
    'trigHeight with a bad refraction coefficient',
    () =>
      trigHeight(rational, {
        distance: 10,
        measured: 'slope',
        vertical: '1/2',
        correction: { k: 'z' },
      }),
    'trigHeight(sight).correction.k',
  ],
  [
    'curvatureRefraction with an infinite distance',
    () => curvatureRefraction(float, Infinity),
    'curvatureRefraction(distance)',
  ],
  [
    'curvatureRefraction with a bad radius',
    () => curvatureRefraction(rational, 100, { earthRadius: 'big' }),
    'curvatureRefraction(options).earthRadius',
  ],
];

describe('elevation solvers refuse bad numbers with INVALID_NUMBER naming the argument', () => {
  for (const [name, f, where] of cases) {
    it(`${name} throws INVALID_NUMBER at ${where}`, () => {
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_NUMBER', where }));
    });
  }
});

const missing: [string, () => unknown, string][] = [
  [
    'heightFromReading',
    () => heightFromReading(rational, undefined as never),
    'heightFromReading(input)',
  ],
  [
    'horizontalFromHeight',
    () => horizontalFromHeight(rational, null as never),
    'horizontalFromHeight(input)',
  ],
  [
    'verticalFromHeight',
    () => verticalFromHeight(rational, 5 as never),
    'verticalFromHeight(input)',
  ],
  [
    'heightFromTwoStations',
    () => heightFromTwoStations(rational, undefined as never),
    'heightFromTwoStations(input)',
  ],
  ['heightFromBase', () => heightFromBase(rational, undefined as never), 'heightFromBase(input)'],
  [
    'heightFromInlineReadings (rational)',
    () => heightFromInlineReadings(rational, undefined as never),
    'heightFromInlineReadings(input)',
  ],
  [
    'heightFromInlineReadings (float)',
    () => heightFromInlineReadings(float, null as never),
    'heightFromInlineReadings(input)',
  ],
  [
    'heightFromInlineQuadrances',
    () => heightFromInlineQuadrances(rational, undefined as never),
    'heightFromInlineQuadrances(input)',
  ],
  ['pathGrade', () => pathGrade(rational, undefined as never), 'pathGrade(input)'],
  ['pathOffset', () => pathOffset(rational, 'x' as never), 'pathOffset(input)'],
  ['trigHeight', () => trigHeight(rational, undefined as never), 'trigHeight(sight)'],
  [
    'trigHeight with correction null',
    () =>
      trigHeight(rational, {
        distance: 10,
        measured: 'slope',
        vertical: '1/2',
        correction: null as never,
      }),
    'trigHeight(sight).correction',
  ],
  [
    'reciprocalTrigHeight',
    () => reciprocalTrigHeight(rational, undefined as never),
    'reciprocalTrigHeight(input)',
  ],
  [
    'reciprocalTrigHeight without a forward sight',
    () =>
      reciprocalTrigHeight(rational, {
        backward: { distance: 1, measured: 'slope', vertical: 0 },
      } as never),
    'reciprocalTrigHeight(input).forward',
  ],
  [
    'curvatureRefraction with null options',
    () => curvatureRefraction(rational, 10, null as never),
    'curvatureRefraction(options)',
  ],
  [
    'verticalFromAngle with null options',
    () => verticalFromAngle(rational, 10, null as never),
    'verticalFromAngle(options)',
  ],
];

describe('a missing or non-object input is refused with INVALID_ARGUMENT, not a TypeError', () => {
  for (const [name, f, where] of missing) {
    it(`${name} throws INVALID_ARGUMENT at ${where}`, () => {
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_ARGUMENT', where }));
    });
  }
});
