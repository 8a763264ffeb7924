// Levelling orders against the published standard.
import { describe, expect, it } from 'vitest';
import { rational, LEVELLING_ORDERS, allowableMisclosure } from '../../src/index.js';

// FGCC, "Standards and Specifications for Geodetic Control Networks" (1984): elevation-difference
// accuracy b = 0.5, 0.7, 1.0, 1.3, 2.0 mm/√km for first-order class I, class II, second-order
// class I, class II and third order (doc). The allowable section misclosure's constant c is the
// user's input (its values per order were not checked against the text).
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

  it('quotes no allowable-misclosure constant c: the user gives it', () => {
    for (const o of Object.values(LEVELLING_ORDERS)) expect(Object.keys(o)).toEqual(['b']);
  });

  it('gives c·√K: with c = 12 mm a 16 km section may misclose by 48 mm (derived)', () => {
    expect(allowableMisclosure(rational, 12, 16).allowable.toString()).toBe('48');
  });
});
