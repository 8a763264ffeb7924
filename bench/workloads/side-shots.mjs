// Workload (e): side shots — one oriented set-up and a batch of total-station shots (circle,
// zenith angle, slope distance, target height) reduced to 3D coordinates; slopes 2 m – 2 km,
// zenith angles 60°–120°, readings to the arc-second and the millimetre.
import { rng } from '../data.mjs';

export const name = 'sideshots';
export const title = '(e) side shots from one set-up (3D coordinates)';

export function unavailable(lib) {
  return lib.g.sideShots ? undefined : 'sideShots() is not in the built package yet';
}

/** One set-up and `n` shots, as numbers (degrees, metres). */
export function makeCases(n, seed = 5) {
  const rand = rng(seed);
  const sec = (lo, hi) => (lo * 3600 + Math.floor(rand() * (hi - lo) * 3600)) / 3600;
  const mm = (lo, hi) => Math.round((lo + rand() * (hi - lo)) * 1000) / 1000;
  const shots = [];
  for (let i = 0; i < n; i++)
    shots.push({
      circle: sec(0, 360),
      zenith: sec(60, 120),
      slope: mm(2, 2000),
      targetHeight: mm(0, 3),
    });
  return {
    setup: {
      station: { x: 351234.567, y: 5812345.678, z: 123.456 },
      instrumentHeight: 1.543,
      orientation: sec(0, 360),
    },
    shots,
  };
}

// ---- the same formulas as src/field/side-shot.ts and reduce.ts, written plainly ----------
// Face right (z > 180°) read as 360° − z and c − 180°; D = S·sin z; Δh = hi + S·cos z − ht;
// β = circle + orientation; x = x₀ + D·sin β, y = y₀ + D·cos β, z = z₀ + Δh.
const RAD = Math.PI / 180;
export function handFloat(setup, shots) {
  const { x: x0, y: y0, z: z0 } = setup.station;
  const hi = setup.instrumentHeight;
  const o = setup.orientation;
  const out = new Array(shots.length);
  for (let i = 0; i < shots.length; i++) {
    const s = shots[i];
    let z = s.zenith;
    let c = s.circle;
    const S = s.slope;
    if (!(z > 0 && z < 360)) throw new Error('zenith');
    if (!(S >= 0)) throw new Error('slope');
    if (z > 180) {
      z = 360 - z;
      c -= 180;
    }
    let b = (c + o) % 360;
    if (b < 0) b += 360;
    const D = S * Math.sin(z * RAD);
    const dh = hi + S * Math.cos(z * RAD) - (s.targetHeight ?? 0);
    const x = x0 + D * Math.sin(b * RAD);
    const y = y0 + D * Math.cos(b * RAD);
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new Error('not finite');
    out[i] = { x, y, z: z0 + dh, bearing: b, horizontalDistance: D, heightDifference: dh };
  }
  return out;
}

export function build(lib, cases) {
  const { g, F } = lib;
  const { setup, shots } = cases;
  const check = (r) => r.length === shots.length && r[0].x > 0;
  return {
    items: shots.length,
    float: {
      ours: () => check(F.sideShots(setup, shots)),
      hand: () => check(handFloat(setup, shots)),
    },
    floatGeneric: {
      ours: () => check(g.sideShots(g.float, setup, shots)),
      hand: () => check(handFloat(setup, shots)),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) n += g.sideShots(A, setup, shots.slice(0, 20)).length;
      return n;
    },
  };
}
