// Workload (h): forward map projection, Lambert Conic Conformal (2SP) on GRS 80 — RGF93 /
// Lambert-93's parameters — of points over France (latitude 41°–51.5° N, longitude 5° W–10° E),
// through a projection prepared once (prepareProjection), as a program projecting many points
// would. E, N, k and the convergence per point.
import { rng } from '../data.mjs';
import { loop1 } from '../harness.mjs';

export const name = 'projection';
export const title = '(h) Lambert conic (2SP) forward, prepared projection';

export function unavailable(lib) {
  return lib.g.prepareProjection ? undefined : 'prepareProjection() is not in the package';
}

export const LAMBERT93 = {
  method: 'lambert-conic-2sp',
  ellipsoid: 'GRS80',
  lat0: 46.5,
  lon0: 3,
  lat1: 49,
  lat2: 44,
  falseEasting: 700000,
  falseNorthing: 6600000,
};

export function makeCases(n, seed = 8) {
  const rand = rng(seed);
  const out = [];
  for (let i = 0; i < n; i++) {
    out.push({
      lat: Math.round((41 + rand() * 10.5) * 1e9) / 1e9,
      lon: Math.round((-5 + rand() * 15) * 1e9) / 1e9,
    });
  }
  return out;
}

// ---- the same formulas as src/geodesy/lambert-conic.ts, written plainly -------------------
// IOGP GN 7-2 §3.2.1.1 with t = e^−ψ: ψ = atanh(sin φ) − e atanh(e sin φ); n = (ln m1 − ln m2)/
// (ψ2 − ψ1); r = C e^(−nψ), C = a m1 e^(nψ1)/n; E = FE + r sin θ, N = FN + r0 − r cos θ,
// θ = n(λ − λ0); k = r n/(a m); γ = θ. The constants are computed once, as the library does.
const A = 6378137;
const F = 1 / 298.257222101;
const E2 = F * (2 - F);
const E = Math.sqrt(E2);
const RAD = Math.PI / 180;
const psiOf = (s, c) => {
  const as = Math.abs(s);
  const p = Math.log((1 + as) / c);
  const es = E * s;
  return (s < 0 ? -p : p) - (E * Math.log((1 + es) / (1 - es))) / 2;
};
const mOf = (phi) => Math.cos(phi) / Math.sqrt(1 - E2 * Math.sin(phi) ** 2);
const phi1 = 49 * RAD;
const phi2 = 44 * RAD;
const psi1 = psiOf(Math.sin(phi1), Math.cos(phi1));
const psi2 = psiOf(Math.sin(phi2), Math.cos(phi2));
const N_ = (Math.log(mOf(phi1)) - Math.log(mOf(phi2))) / (psi2 - psi1);
const C = ((A * mOf(phi1)) / N_) * Math.exp(N_ * psi1);
const phi0 = 46.5 * RAD;
const R0 = C * Math.exp(-N_ * psiOf(Math.sin(phi0), Math.cos(phi0)));

export function handForward(p) {
  const lat = p.lat;
  const lon = p.lon;
  if (!(Math.abs(lat) <= 90)) throw new Error('latitude');
  if (!(lon - lon === 0)) throw new Error('longitude');
  const s = Math.sin(lat * RAD);
  const c = Math.cos(lat * RAD);
  if (c === 0) throw new Error('pole');
  const W = Math.sqrt(1 - E2 * s * s);
  let dl = lon - 3;
  if (dl < -180 || dl >= 180) dl = ((((dl + 180) % 360) + 360) % 360) - 180;
  const r = C * Math.exp(-N_ * psiOf(s, c));
  const theta = N_ * dl;
  return {
    E: 700000 + r * Math.sin(theta * RAD),
    N: 6600000 + R0 - r * Math.cos(theta * RAD),
    k: (r * N_ * W) / (A * c),
    convergence: theta,
  };
}

export function build(lib, cases) {
  const { g, F: Fl } = lib;
  const P = Fl.prepareProjection(LAMBERT93);
  const PG = g.prepareProjection(g.float, LAMBERT93);
  const key = (r) => r.E + r.N !== 0;
  return {
    items: cases.length,
    float: {
      ours: loop1(cases, (x) => Fl.toGrid(x, P), key),
      hand: loop1(cases, handForward, key),
    },
    floatGeneric: {
      ours: loop1(cases, (x) => g.toGrid(g.float, x, PG), key),
      hand: loop1(cases, handForward, key),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const Ar of arithmetics) {
        const Q = g.prepareProjection(Ar, LAMBERT93);
        for (const c of cases.slice(0, 2)) {
          const r = g.toGrid(Ar, c, Q);
          n += g.fromGrid(Ar, r, Q) ? 1 : 0;
        }
      }
      return n;
    },
  };
}
