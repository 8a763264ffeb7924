// Workload (f): geodetic → geocentric → geodetic on GRS 80 (Bowring's iteration back).
import { loop1 } from '../harness.mjs';
import { makeCases, handRoundTrip } from './geodesy.mjs';

export const name = 'roundtrip';
export const title = '(f) geodetic → geocentric → geodetic (GRS 80)';
export { makeCases };

export function unavailable(lib) {
  return lib.g.geocentricToGeodetic ? undefined : 'geocentricToGeodetic() is not in the package';
}

export function build(lib, cases) {
  const { g, F } = lib;
  const key = (r) => r.lat + r.lon + r.h !== 0;
  const ours = (x) => F.geocentricToGeodetic(F.geodeticToGeocentric(x, 'GRS80'), 'GRS80');
  const gen = (x) =>
    g.geocentricToGeodetic(g.float, g.geodeticToGeocentric(g.float, x, 'GRS80'), 'GRS80');
  return {
    items: cases.length,
    float: { ours: loop1(cases, ours, key), hand: loop1(cases, handRoundTrip, key) },
    floatGeneric: { ours: loop1(cases, gen, key), hand: loop1(cases, handRoundTrip, key) },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        for (const c of cases.slice(0, 3)) {
          const q = g.geodeticToGeocentric(A, c, 'GRS80');
          n += g.geocentricToGeodetic(A, q, 'GRS80') ? 1 : 0;
        }
      }
      return n;
    },
  };
}
