import { describe, it, expect } from 'vitest';
import { float } from '../../src/arithmetic/float.js';
import { decimal } from '../../src/arithmetic/decimal.js';
import { uncertain } from '../../src/arithmetic/uncertain.js';
import { measured } from '../../src/uncertainty/measured.js';
import { budget } from '../../src/uncertainty/budget.js';
import { GRS80, geodeticToGeocentric, geocentricToGeodetic, transverseMercatorFactors } from '../../src/geodesy/index.js';

const d2r = Math.PI / 180;

describe('geodesy in uncertain arithmetic', () => {
  it('σ(Z) from σ(h) is σ(h)·sin φ and σ(X) is σ(h)·cos φ cos λ (derived: ∂Z/∂h = sin φ, ∂X/∂h = cos φ cos λ)', () => {
    const U = uncertain(float);
    const h = measured(U, 100, 0.02, 'h');
    const P = geodeticToGeocentric(U, { lat: 52, lon: 10, h }, GRS80);
    expect(Math.abs(budget(U, P.Z).sigma - 0.02 * Math.sin(52 * d2r))).toBeLessThan(1e-12);
    expect(Math.abs(budget(U, P.X).sigma - 0.02 * Math.cos(52 * d2r) * Math.cos(10 * d2r))).toBeLessThan(1e-12);
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
