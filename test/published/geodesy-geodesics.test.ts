// Geodesics on the ellipsoid against published worked examples:
// - C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87:43–55 (2013), table 2 (the
//   direct problem on WGS 84: φ1 = 40°, α1 = 30°, s12 = 10 000 km);
// - T. Vincenty, "Direct and inverse solutions of geodesics on the ellipsoid with application
//   of nested equations", Survey Review 23(176):88–93 (1975), test lines (a) (Bessel 1841) and
//   (b) (International 1924), values as reproduced in later literature; α2 printed as the
//   forward azimuth at point 2.
import { describe, it, expect } from 'vitest';
import { rational } from '../../src/arithmetic/rational.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { float } from '../../src/arithmetic/float.js';
import type { Arithmetic } from '../../src/arithmetic/types.js';
import { defineEllipsoid, WGS84 } from '../../src/geodesy/ellipsoid.js';
import { geodesicDirect } from '../../src/geodesy/geodesic-direct.js';
import { geodesicInverse } from '../../src/geodesy/geodesic-inverse.js';

const arithmetics = [float, decimal(40), rational] as Arithmetic<unknown>[];
const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;
const BESSEL = defineEllipsoid({ name: 'Bessel 1841', a: '6377397.155', invF: '299.1528128' });
const INTL24 = defineEllipsoid({ name: 'International 1924', a: 6378388, invF: 297 });

const VINCENTY = [
  {
    line: '(a)',
    ellipsoid: BESSEL,
    p1: { lat: `55°45'`, lon: 0 },
    p2: { lat: `-33°26'`, lon: `108°13'` },
    s: 14110526.17,
    a1: dms(96, 36, 8.7996),
    a2: dms(137, 52, 22.01454),
  },
  {
    line: '(b)',
    ellipsoid: INTL24,
    p1: { lat: `37°19'54.95367"`, lon: 0 },
    p2: { lat: `26°07'42.83946"`, lon: `41°28'35.50729"` },
    s: 4085966.703,
    a1: dms(95, 27, 59.63089),
    a2: dms(118, 5, 58.96161),
  },
];

describe('Karney (2013), table 2: the direct problem on WGS 84', () => {
  for (const A of arithmetics) {
    it(`φ2 = 41.79331020506°, λ2 = 137.84490004377°, α2 = 149.09016931807° (to the printed 1e-11°) in ${A.name}`, () => {
      const r = geodesicDirect(A, { lat: 40, lon: 0 }, 30, 10000000, WGS84);
      expect(Math.abs(A.toNumber(r.lat) - 41.79331020506)).toBeLessThan(6e-12);
      expect(Math.abs(A.toNumber(r.lon) - 137.84490004377)).toBeLessThan(6e-12);
      expect(Math.abs(A.toNumber(r.azimuth2) - 149.09016931807)).toBeLessThan(6e-12);
    });
  }
  it('the inverse problem between the table’s points gives back 10 000 km and 30° (float)', () => {
    const g = geodesicInverse(
      float,
      { lat: 40, lon: 0 },
      { lat: 41.79331020506, lon: 137.84490004377 },
      WGS84,
    );
    // the printed 1e-11° of the end point is about 1 mm on the ground
    expect(Math.abs(g.distance - 10000000)).toBeLessThan(0.002);
    expect(Math.abs(g.azimuth1 - 30)).toBeLessThan(1e-9);
    expect(Math.abs(g.azimuth2 - 149.09016931807)).toBeLessThan(1e-9);
  });
});

describe('Vincenty (1975), test lines (a) and (b): the inverse problem', () => {
  for (const v of VINCENTY) {
    for (const A of arithmetics) {
      it(`line ${v.line}: s = ${v.s} m to 1 mm, α1 and α2 to 0.0001″ in ${A.name}`, () => {
        const g = geodesicInverse(A, v.p1, v.p2, v.ellipsoid);
        expect(Math.abs(A.toNumber(g.distance) - v.s)).toBeLessThan(0.001);
        expect(Math.abs(A.toNumber(g.azimuth1) - v.a1) * 3600).toBeLessThan(1e-4);
        expect(Math.abs(A.toNumber(g.azimuth2) - v.a2) * 3600).toBeLessThan(1e-4);
      });
    }
    it(`line ${v.line}: the direct problem from α1 and s reaches P2 within 1e-8° (the printed 1 mm and 0.00001″ move it by up to 1 mm) in decimal(40)`, () => {
      const D = decimal(40);
      const r = geodesicDirect(D, v.p1, v.a1, v.s, v.ellipsoid);
      const p2 = v.p2;
      const toDeg = (t: string) => {
        const m = /(-?)(\d+)°(\d+)'([\d.]*)"?/.exec(t)!;
        const x = Number(m[2]) + Number(m[3]) / 60 + (m[4] ? Number(m[4]) : 0) / 3600;
        return m[1] ? -x : x;
      };
      expect(Math.abs(D.toNumber(r.lat) - toDeg(p2.lat))).toBeLessThan(1e-8);
      expect(Math.abs(D.toNumber(r.lon) - toDeg(p2.lon))).toBeLessThan(1e-8);
    });
  }
});
