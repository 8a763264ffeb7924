import { describe, it, expect } from 'vitest';
import { float } from '../../src/arithmetic/float.js';
import { rational } from '../../src/arithmetic/rational.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { uncertain } from '../../src/arithmetic/uncertain.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import {
  GRS80,
  enuRotation,
  geodeticToGeocentric,
  geocentricToGeodetic,
  transverseMercator,
  transverseMercatorFactors,
  transverseMercatorInverse,
} from '../../src/geodesy/index.js';

const d2r = Math.PI / 180;

describe('geodesy in uncertain arithmetic', () => {
  it('σ(Z) from σ(h) is σ(h)·sin φ and σ(X) is σ(h)·cos φ cos λ (derived: ∂Z/∂h = sin φ, ∂X/∂h = cos φ cos λ)', () => {
    const U = uncertain(float);
    const h = measured(U, 100, 0.02, 'h');
    const P = geodeticToGeocentric(U, { lat: 52, lon: 10, h }, GRS80);
    expect(Math.abs(budget(U, P.Z).sigma - 0.02 * Math.sin(52 * d2r))).toBeLessThan(1e-12);
    expect(
      Math.abs(budget(U, P.X).sigma - 0.02 * Math.cos(52 * d2r) * Math.cos(10 * d2r)),
    ).toBeLessThan(1e-12);
  });
  it('a geodetic → geocentric → geodetic round trip carries σ(h) and σ(lat) back unchanged, in uncertain(float) and uncertain(decimal(30))', () => {
    for (const base of [float, decimal(30)] as const) {
      const U = uncertain(base as typeof float);
      const h = measured(U, 250, 0.01, 'h');
      const lat = measured(U, 47.5, 1 / 3600, 'lat');
      const g = geocentricToGeodetic(U, geodeticToGeocentric(U, { lat, lon: -3, h }, GRS80), GRS80);
      expect(Math.abs(Number(budget(U, g.h).sigma) - 0.01)).toBeLessThan(1e-9);
      expect(Math.abs(Number(budget(U, g.lat).sigma) - 1 / 3600)).toBeLessThan(1e-12);
    }
  });
  it('σ(k) of the TM scale factor from σ(lon) matches a central finite difference of k (float)', () => {
    const U = uncertain(float);
    const lon = measured(U, 5, 0.01, 'lon');
    const proj = { lon0: 3, k0: 0.9996, ellipsoid: GRS80 };
    const s = budget(U, transverseMercatorFactors(U, { lat: 50, lon }, proj).k).sigma;
    const k = (l: number) => transverseMercatorFactors(float, { lat: 50, lon: l }, proj).k;
    const fd = ((k(5 + 1e-4) - k(5 - 1e-4)) / 2e-4) * 0.01;
    expect(Math.abs(s - Math.abs(fd)) / Math.abs(fd)).toBeLessThan(1e-6);
  });
});

describe('geodesy in uncertain(rational) keeps the gradients through its decimal evaluation', () => {
  const R = uncertain(rational);
  const sig = (x: Parameters<typeof budget<import('fraction.js').default, true>>[1]) =>
    rational.toNumber(budget(R, x).variance) ** 0.5;

  it('geocentricToGeodetic: σ(h) from σ(X) is σ(X)·cos φ cos λ (derived: ∂h/∂X is the X component of the normal)', () => {
    // Ordnance Survey guide, annex B point; φ, λ as published
    const X = measured(R, '3790644.900', '0.01', 'X');
    const g = geocentricToGeodetic(R, { X, Y: '-110149.210', Z: '5111482.970' }, GRS80);
    const phi = (53 + 36 / 60 + 43.1653 / 3600) * d2r;
    const lam = -(1 + 39 / 60 + 51.992 / 3600) * d2r;
    const hand = 0.01 * Math.cos(phi) * Math.cos(lam);
    expect(Math.abs(sig(g.h) - hand) / hand).toBeLessThan(1e-9);
    expect(budget(R, g.lat).contributions.map((c) => c.name)).toEqual(['X']);
  });

  it('transverseMercator, its factors and its inverse: σ in uncertain(rational) equals σ in uncertain(float)', () => {
    const proj = { lon0: 3, k0: '0.9996', ellipsoid: GRS80 };
    const F = uncertain(float);
    const kR = transverseMercatorFactors(
      R,
      { lat: 50, lon: measured(R, 5, '0.01', 'lon') },
      proj,
    ).k;
    const kF = transverseMercatorFactors(F, { lat: 50, lon: measured(F, 5, 0.01, 'lon') }, proj).k;
    const sF = budget(F, kF).sigma;
    expect(sF).toBeGreaterThan(0);
    expect(Math.abs(sig(kR) - sF) / sF).toBeLessThan(1e-9);
    const ER = transverseMercator(R, { lat: measured(R, 50, '0.0001', 'lat'), lon: 5 }, proj).N;
    const EF = transverseMercator(F, { lat: measured(F, 50, 0.0001, 'lat'), lon: 5 }, proj).N;
    expect(Math.abs(sig(ER) - budget(F, EF).sigma) / budget(F, EF).sigma).toBeLessThan(1e-9);
    const gR = transverseMercatorInverse(
      R,
      { E: measured(R, 500000, '0.01', 'E'), N: 5500000 },
      proj,
    ).lon;
    const gF = transverseMercatorInverse(
      F,
      { E: measured(F, 500000, 0.01, 'E'), N: 5500000 },
      proj,
    ).lon;
    expect(Math.abs(sig(gR) - budget(F, gF).sigma) / budget(F, gF).sigma).toBeLessThan(1e-9);
  });

  it('enuRotation: ∂(east row)/∂λ is (−cos λ, −sin λ, 0)·π/180 per degree (derived) with an uncertain origin', () => {
    const lon = measured(R, 10, '0.001', 'lon');
    const M = enuRotation(R, { lat: 52, lon });
    const d = (x: (typeof M)[0][0]) => rational.toNumber(x.derivatives[0] ?? rational.zero);
    expect(Math.abs(d(M[0][0]) + Math.cos(10 * d2r) * d2r)).toBeLessThan(1e-12);
    expect(Math.abs(d(M[0][1]) + Math.sin(10 * d2r) * d2r)).toBeLessThan(1e-12);
  });
});
