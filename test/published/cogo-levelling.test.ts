// Levelling orders against the published standard.
import { describe, expect, it } from 'vitest';
import { rational, LEVELLING_ORDERS, allowableMisclosure } from '../../src/index.js';

// FGCC, "Standards and Specifications for Geodetic Control Networks" (1984): elevation-difference
// accuracy b = 0.5, 0.7, 1.0, 1.3, 2.0 mm/√km for first-order class I, class II, second-order
// class I, class II and third order (doc). Allowable section misclosures 3, 4, 6, 8, 12 mm·√K for
// the same orders: from memory — check before relying on it.
describe('LEVELLING_ORDERS follows FGCC 1984', () => {
  it('has the printed elevation-difference accuracies b (mm/√km) for the five orders', () => {
    expect(Object.keys(LEVELLING_ORDERS)).toEqual([
      'first-I',
      'first-II',
      'second-I',
      'second-II',
      'third',
    ]);
    expect(Object.values(LEVELLING_ORDERS).map((o) => o.b)).toEqual([
      '0.5',
      '0.7',
      '1.0',
      '1.3',
      '2.0',
    ]);
  });

  it('has the allowable-misclosure constants c = 3, 4, 6, 8, 12 mm (from memory)', () => {
    expect(Object.values(LEVELLING_ORDERS).map((o) => o.c)).toEqual(['3', '4', '6', '8', '12']);
  });

  it('gives c·√K: a 16 km third-order section may misclose by 48 mm (derived)', () => {
    expect(allowableMisclosure(rational, 'third', 16).allowable.toString()).toBe('48');
  });
});
