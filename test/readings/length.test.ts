// Length units: exact factors, round trips, and unknown units.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rational, float, QuadspreadError } from '../../src/index.js';
import {
  lengthToMetres,
  metresToLength,
  convertLength,
  convertQuadrance,
  METRES_PER_UNIT,
} from '../../src/readings/length.js';
import type { LengthUnit } from '../../src/readings/length.js';

const units = Object.keys(METRES_PER_UNIT) as LengthUnit[];

describe('length conversions', () => {
  it('round-trip exactly in rational for every unit pair', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1e9, max: 1e9 }),
        fc.constantFrom(...units),
        fc.constantFrom(...units),
        (n, a, b) => {
          const x = rational.from(`${n}/1000`);
          expect(
            rational.eq(convertLength(rational, convertLength(rational, x, a, b), b, a), x),
          ).toBe(true);
          expect(rational.eq(metresToLength(rational, lengthToMetres(rational, x, a), a), x)).toBe(
            true,
          );
        },
      ),
    );
  });
  it('float conversions agree with the rational ones to 1e-15 relative', () => {
    for (const u of units)
      expect(
        float.toNumber(lengthToMetres(float, 1234.5, u)) /
          rational.toNumber(lengthToMetres(rational, '1234.5', u)),
      ).toBeCloseTo(1, 14);
  });
  it('a quadrance converts by the square of the factor', () => {
    expect(rational.toString(convertQuadrance(rational, 1, 'ch', 'ft'))).toBe('4356');
    expect(() => convertQuadrance(rational, -1, 'm', 'ft')).toThrow(QuadspreadError);
  });
  it('unknown units throw INVALID_UNIT naming the argument', () => {
    expect(() => lengthToMetres(rational, 1, 'yd' as never)).toThrow(
      /INVALID_UNIT.*lengthToMetres\(unit\).*"yd"/,
    );
    expect(() => convertLength(rational, 1, 'm', 'toString' as never)).toThrow(/INVALID_UNIT/);
  });
});
