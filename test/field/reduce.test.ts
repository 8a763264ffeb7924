// reduceObservation and atmosphericPpm: published trigonometric levelling, and independent
// classical-trig computations with Math.* written here.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { code, kinds } from '../geometry/helpers.js';
import {
  rational,
  float,
  uncertain,
  measured,
  budget,
  reduceObservation,
  atmosphericPpm,
} from '../../src/index.js';

const rad = (deg: number) => (deg * Math.PI) / 180;

describe('reduceObservation against Mahun, Surveying (open text), "Solution: Trig Leveling", Problem 1', () => {
  // Instrument 5.41 ft over a point of elevation 745.39 ft, target 5.64 ft; published elevations
  // to 0.01 ft. The source reads elevation angles α; the zenith angle is 90° − α.
  const cases: [string, string, number][] = [
    [`85°35'50"`, '145.25', 756.31],
    [`96°00'25"`, '89.32', 735.81],
    [`92°58'30"`, '118.95', 738.99],
  ];
  describe.each(kinds)('in %s', (_n, A) => {
    it.each(cases)('zenith %s over %s ft gives %s ft (±0.005)', (zenith, slope, elevation) => {
      const r = reduceObservation(A, {
        zenith,
        slope,
        instrumentHeight: '5.41',
        targetHeight: '5.64',
      });
      expect(Math.abs(745.39 + A.toNumber(r.heightDifference) - elevation)).toBeLessThanOrEqual(
        0.005,
      );
    });
  });
});

describe.each(kinds)(
  'reduceObservation(%s, …) against classical trig (Math.sin, Math.cos)',
  (_n, A) => {
    it('corrects the slope by ppm and prism constant, then D = S·sin z, Δh = hi + S·cos z − ht', () => {
      const r = reduceObservation(A, {
        zenith: `87°12'36"`,
        slope: '412.3456',
        ppm: '-12.4',
        prismConstant: '-0.0344',
        instrumentHeight: '1.602',
        targetHeight: '1.800',
      });
      const S = 412.3456 * (1 - 12.4e-6) - 0.0344;
      const z = rad(87 + 12 / 60 + 36 / 3600);
      expect(Math.abs(A.toNumber(r.slope) - S)).toBeLessThan(1e-12);
      expect(Math.abs(A.toNumber(r.horizontalDistance) - S * Math.sin(z))).toBeLessThan(1e-10);
      expect(Math.abs(A.toNumber(r.horizontalQuadrance) - (S * Math.sin(z)) ** 2)).toBeLessThan(
        1e-7,
      );
      expect(
        Math.abs(A.toNumber(r.heightDifference) - (1.602 + S * Math.cos(z) - 1.8)),
      ).toBeLessThan(1e-10);
      expect(r.face).toBe('left');
    });

    it('skips the ppm when the instrument applied it, and still adds the prism constant', () => {
      const r = reduceObservation(A, {
        zenith: 90,
        slope: 100,
        ppmApplied: true,
        prismConstant: '0.03',
      });
      expect(A.toNumber(r.horizontalDistance)).toBe(100.03);
      expect(A.toNumber(r.ppm)).toBe(0);
    });

    it('reads a face-right zenith angle z as 360° − z and its circle as c − 180°', () => {
      const left = reduceObservation(A, { circle: `12°00'00"`, zenith: `80°`, slope: 50 });
      const right = reduceObservation(A, { circle: `192°00'00"`, zenith: `280°`, slope: 50 });
      expect(right.face).toBe('right');
      expect(A.toString(right.circle!)).toBe(A.toString(left.circle!));
      expect(A.toString(right.horizontalDistance)).toBe(A.toString(left.horizontalDistance));
      expect(A.toString(right.heightDifference)).toBe(A.toString(left.heightDifference));
    });

    it('adds curvature and refraction (1 − k)·D²/(2R) only when asked (0.0675·D² m per km² at k = 0.14, R = 6371 km: Ghilani & Wolf, Elementary Surveying, ch. 4 — from memory)', () => {
      const plain = reduceObservation(A, { zenith: 90, slope: 2000 });
      expect(A.toNumber(plain.curvature)).toBe(0);
      const r = reduceObservation(A, { zenith: 90, slope: 2000, curvature: { k: '0.14' } });
      expect(Math.abs(A.toNumber(r.heightDifference) - 0.0675 * 4)).toBeLessThan(0.0002);
      expect(A.toNumber(r.refraction!)).toBe(0.14);
      const byDefault = reduceObservation(A, { zenith: 90, slope: 2000, curvature: true });
      expect(A.toNumber(byDefault.refraction!)).toBe(0.13);
      expect(Math.abs(A.toNumber(byDefault.curvature) - (0.87 * 4e6) / (2 * 6371000))).toBeLessThan(
        1e-12,
      );
    });

    it('reduces to the ellipsoid by R/(R + h) and to the grid by × k when asked', () => {
      const r = reduceObservation(A, {
        zenith: 90,
        slope: 1000,
        grid: { height: 250, radius: 6380000, scaleFactor: '0.9996' },
      });
      expect(Math.abs(A.toNumber(r.ellipsoidDistance!) - (1000 * 6380000) / 6380250)).toBeLessThan(
        1e-9,
      );
      expect(
        Math.abs(A.toNumber(r.gridDistance!) - ((1000 * 6380000) / 6380250) * 0.9996),
      ).toBeLessThan(1e-9);
    });

    it('refuses a zenith outside (0°, 360°), a negative slope, a missing zenith and both ppm and atmosphere', () => {
      expect(code(() => reduceObservation(A, { zenith: 0, slope: 1 }))).toBe('INVALID_ANGLE');
      expect(code(() => reduceObservation(A, { zenith: 360, slope: 1 }))).toBe('INVALID_ANGLE');
      expect(code(() => reduceObservation(A, { zenith: -5, slope: 1 }))).toBe('INVALID_ANGLE');
      expect(code(() => reduceObservation(A, { zenith: 90, slope: -1 }))).toBe('INVALID_ARGUMENT');
      expect(code(() => reduceObservation(A, { slope: 1 } as never))).toBe('INVALID_ARGUMENT');
      expect(
        code(() =>
          reduceObservation(A, {
            zenith: 90,
            slope: 1,
            ppm: 3,
            atmosphere: {
              temperature: 20,
              pressure: 1000,
              wavelength: 0.658,
              referenceRefractivity: 280,
            },
          }),
        ),
      ).toBe('INVALID_ARGUMENT');
      expect(
        code(() => reduceObservation(A, { zenith: 90, slope: 1, ppm: 3, ppmApplied: true })),
      ).toBe('INVALID_ARGUMENT');
      expect(code(() => reduceObservation(A, { zenith: 'ninety', slope: 1 }))).toBe(
        'INVALID_ANGLE',
      );
    });
  },
);

describe('reduceObservation in rational', () => {
  it('is exact at z = 90°: D = S·(1 + ppm·10⁻⁶) + prism constant, with no rounding', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10 ** 9 }),
        fc.integer({ min: -100, max: 100 }),
        fc.integer({ min: -100, max: 100 }),
        (mm, ppm, pc) => {
          const S = rational.add(
            rational.mul(rational.from(`${mm}/1000`), rational.from(`${10 ** 6 + ppm}/1000000`)),
            rational.from(`${pc}/1000`),
          );
          if (rational.sign(S) < 0) return;
          const r = reduceObservation(rational, {
            zenith: 90,
            slope: `${mm}/1000`,
            ppm,
            prismConstant: `${pc}/1000`,
          });
          expect(rational.eq(r.horizontalDistance, S)).toBe(true);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('keeps D² = horizontalQuadrance exactly', () => {
    const r = reduceObservation(rational, { zenith: `73°14'15"`, slope: '123.456' });
    expect(
      rational.eq(rational.mul(r.horizontalDistance, r.horizontalDistance), r.horizontalQuadrance),
    ).toBe(true);
  });
});

describe('atmosphericPpm (IAG 1999 group refractivity for light, Rüeger 1996 — from memory)', () => {
  // The formula written independently with Math.*: N_gr = 287.6155 + 4.88660/λ² + 0.06800/λ⁴,
  // N_L = (273.15/1013.25)·N_gr·p/T − 11.27·e/T, E_w = (1.0007 + 3.46e-6·p)·6.1121·exp(17.502 t/(240.97 + t)).
  function byHand(t: number, p: number, h: number, lambda: number, Nref: number): number {
    const Ngr = 287.6155 + 4.8866 / lambda ** 2 + 0.068 / lambda ** 4;
    const e = (h / 100) * (1.0007 + 3.46e-6 * p) * 6.1121 * Math.exp((17.502 * t) / (240.97 + t));
    const T = 273.15 + t;
    return Nref - ((273.15 / 1013.25) * Ngr * p) / T + (11.27 * e) / T;
  }
  it.each(kinds)('agrees with the formula by hand in %s (to 1e-9 ppm)', (_n, A) => {
    for (const [t, p, h, l, N] of [
      [20, 1013.25, 60, 0.658, 286.3],
      [-10, 850, 0, 0.85, 281.8],
      [35, 1030, 95, 0.66, 290],
    ] as const) {
      const r = atmosphericPpm(A, {
        temperature: t,
        pressure: p,
        humidity: h,
        wavelength: l,
        referenceRefractivity: N,
      });
      expect(Math.abs(A.toNumber(r.ppm) - byHand(t, p, h, l, N))).toBeLessThan(1e-9);
    }
  });

  it('moves about +1 ppm per °C and −0.3 ppm per hPa near 20 °C, 1013 hPa (rules of thumb, common practice)', () => {
    const U = uncertain(float);
    const t = measured(U, 20, 1, 't');
    const p = measured(U, 1013, 1, 'p');
    const r = atmosphericPpm(U, {
      temperature: t,
      pressure: p,
      vapourPressure: 10,
      wavelength: 0.658,
      referenceRefractivity: 280,
    });
    const g = new Map([...r.ppm.gradient].map(([k, v]) => [k.name, v]));
    expect(g.get('t')!).toBeGreaterThan(0.85);
    expect(g.get('t')!).toBeLessThan(1.05);
    expect(g.get('p')!).toBeLessThan(-0.25);
    expect(g.get('p')!).toBeGreaterThan(-0.32);
    expect(budget(U, r.ppm).sigma).toBeGreaterThan(0.9);
  });

  it('is exact in rational from a vapour pressure: at 0 °C and 1013.25 hPa dry, N_L = N_gr', () => {
    const r = atmosphericPpm(rational, {
      temperature: 0,
      pressure: '1013.25',
      wavelength: '0.8',
      referenceRefractivity: 300,
    });
    // 287.6155 + 4.8866/0.64 + 0.068/0.4096 exactly
    const Ngr = rational.add(
      rational.add(
        rational.from('287.6155'),
        rational.div(rational.from('4.8866'), rational.from('0.64')),
      ),
      rational.div(rational.from('0.068'), rational.from('0.4096')),
    );
    expect(rational.eq(r.refractivity, Ngr)).toBe(true);
    expect(rational.eq(r.ppm, rational.sub(rational.from(300), Ngr))).toBe(true);
  });

  it('feeds reduceObservation: S·(1 + ppm·10⁻⁶)', () => {
    const atmosphere = {
      temperature: 25,
      pressure: 990,
      humidity: 50,
      wavelength: 0.658,
      referenceRefractivity: 286,
    };
    const ppm = byHand(25, 990, 50, 0.658, 286);
    const r = reduceObservation(float, { zenith: 90, slope: 1000, atmosphere });
    expect(Math.abs(r.slope - 1000 * (1 + ppm * 1e-6))).toBeLessThan(1e-9);
  });

  it('refuses a temperature below absolute zero, a pressure ≤ 0, a humidity over 100 % and both humidity and vapour pressure', () => {
    const base = { temperature: 20, pressure: 1000, wavelength: 0.658, referenceRefractivity: 280 };
    expect(code(() => atmosphericPpm(float, { ...base, temperature: -300 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => atmosphericPpm(float, { ...base, pressure: 0 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => atmosphericPpm(float, { ...base, humidity: 101 }))).toBe('INVALID_ARGUMENT');
    expect(code(() => atmosphericPpm(float, { ...base, humidity: 50, vapourPressure: 10 }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(code(() => atmosphericPpm(float, { ...base, wavelength: undefined } as never))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});
