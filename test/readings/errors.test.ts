// Bad numbers given to a reading: INVALID_NUMBER naming the function and the argument (not the arithmetic's from).
import { describe, expect, it } from 'vitest';
import { rational, float, decimal } from '../../src/index.js';
import { angleToDegrees, degreesToUnit } from '../../src/readings/angle.js';
import { formatDms } from '../../src/readings/dms.js';
import {
  lengthToMetres,
  metresToLength,
  convertLength,
  convertQuadrance,
} from '../../src/readings/length.js';
import {
  spreadFromRatio,
  spreadFromGrade,
  spreadFromPerMille,
  spreadFromOneIn,
} from '../../src/readings/slope.js';
import { degreesFromSpread } from '../../src/readings/spread.js';
import { sinCosDegrees } from '../../src/readings/trig.js';
import { verticalFromRatio, zenithToElevation, readVertical } from '../../src/readings/vertical.js';

const cases: [string, () => unknown, string][] = [
  [
    'angleToDegrees(float, NaN)',
    () => angleToDegrees(float, Number.NaN),
    'angleToDegrees(reading)',
  ],
  [
    'angleToDegrees(float, -Infinity, "gon")',
    () => angleToDegrees(float, -Infinity, 'gon'),
    'angleToDegrees(reading)',
  ],
  [
    'degreesToUnit(float, Infinity, "mil")',
    () => degreesToUnit(float, Infinity, 'mil'),
    'degreesToUnit(degrees)',
  ],
  ['formatDms(rational, "x")', () => formatDms(rational, 'x'), 'formatDms(degrees)'],
  [
    'lengthToMetres(rational, "x", "ft")',
    () => lengthToMetres(rational, 'x', 'ft'),
    'lengthToMetres(value)',
  ],
  [
    'metresToLength(float, NaN, "ft")',
    () => metresToLength(float, Number.NaN, 'ft'),
    'metresToLength(metres)',
  ],
  [
    'convertLength(rational, "", "ft", "m")',
    () => convertLength(rational, '', 'ft', 'm'),
    'convertLength(value)',
  ],
  [
    'convertQuadrance(rational, "q", "ft", "m")',
    () => convertQuadrance(rational, 'q', 'ft', 'm'),
    'convertQuadrance(quadrance)',
  ],
  [
    'spreadFromRatio(rational, 1, "a")',
    () => spreadFromRatio(rational, 1, 'a'),
    'spreadFromRatio(run)',
  ],
  [
    'spreadFromGrade(rational, "steep")',
    () => spreadFromGrade(rational, 'steep'),
    'spreadFromGrade(percent)',
  ],
  [
    'spreadFromPerMille(float, NaN)',
    () => spreadFromPerMille(float, Number.NaN),
    'spreadFromPerMille(perMille)',
  ],
  ['spreadFromOneIn(rational, "n")', () => spreadFromOneIn(rational, 'n'), 'spreadFromOneIn(n)'],
  [
    'degreesFromSpread(decimal(20), "half")',
    () => degreesFromSpread(decimal(20), 'half'),
    'degreesFromSpread(s)',
  ],
  [
    'verticalFromRatio(rational, "up", 3)',
    () => verticalFromRatio(rational, 'up', 3),
    'verticalFromRatio(rise)',
  ],
  [
    'zenithToElevation(float, NaN)',
    () => zenithToElevation(float, Number.NaN),
    'zenithToElevation(degrees)',
  ],
  [
    'readVertical(rational, "x", "f(v)", 2)',
    () => readVertical(rational, 'x', 'f(v)', 2),
    'f(v)[2]',
  ],
];

describe('readings refuse bad numbers with INVALID_NUMBER naming the argument', () => {
  for (const [name, f, where] of cases) {
    it(`${name} throws INVALID_NUMBER at ${where}`, () => {
      expect(f).toThrow(expect.objectContaining({ code: 'INVALID_NUMBER', where }));
    });
  }
  it('sinCosDegrees(float, NaN) is refused with INVALID_NUMBER', () => {
    expect(() => sinCosDegrees(float, Number.NaN)).toThrow(
      expect.objectContaining({ code: 'INVALID_NUMBER' }),
    );
  });
});
