// Workload (h): the inverse geodesic problem on WGS 84 (distance and azimuths between two
// points anywhere on the globe). The baseline is GeographicLib's JavaScript port (the
// devDependency geographiclib-geodesic), a tuned implementation of the same method by its
// author, not hand-written code: the ratio says what the generic source costs against it.
import G from 'geographiclib-geodesic';
import { rng } from '../data.mjs';

export const name = 'geodesic';
export const title = '(h) inverse geodesic problem (WGS 84), against GeographicLib';
export const baseline = 'GeographicLib';

export function unavailable(lib) {
  return lib.g.geodesicInverse ? undefined : 'geodesicInverse() is not in the built package yet';
}

/** Pairs uniform on the sphere, coordinates to 1e-9°. */
export function makeCases(n, seed = 5) {
  const rand = rng(seed);
  const lat = () => Math.round((Math.asin(2 * rand() - 1) * 180e9) / Math.PI) / 1e9;
  const lon = () => Math.round((rand() * 360 - 180) * 1e9) / 1e9;
  const out = [];
  for (let i = 0; i < n; i++)
    out.push([
      { lat: lat(), lon: lon() },
      { lat: lat(), lon: lon() },
    ]);
  return out;
}

export function build(lib, cases) {
  const { g, F } = lib;
  const W = G.Geodesic.WGS84;
  const gl = () => {
    let s = 0;
    for (const [p, q] of cases) s += W.Inverse(p.lat, p.lon, q.lat, q.lon).s12;
    return s > 0;
  };
  return {
    items: cases.length,
    float: {
      ours: () => {
        let s = 0;
        for (const [p, q] of cases) s += F.geodesicInverse(p, q, F.WGS84).distance;
        return s > 0;
      },
      hand: gl,
    },
    floatGeneric: {
      ours: () => {
        let s = 0;
        for (const [p, q] of cases) s += g.geodesicInverse(g.float, p, q, g.WGS84).distance;
        return s > 0;
      },
      hand: gl,
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics)
        for (const [p, q] of cases.slice(0, 1))
          n += A.toNumber(g.geodesicInverse(A, p, q, g.WGS84).distance) > 0 ? 1 : 0;
      return n;
    },
  };
}
