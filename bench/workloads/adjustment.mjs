// Adjustment workloads (least squares), `quadspread/float` against hand-written float code of
// the same model with the same sparsity:
//   - `network`: a plane network of 1000 points on a jittered 40 × 25 grid (200 m), 4 corners
//     held, about 5000 observations (distances to the right, upper and upper-right neighbours,
//     bearings to the right and upper ones), every point with approximate coordinates a few
//     centimetres off: Gauss–Newton to 1e-7 m, then σ, error ellipses, redundancy numbers and
//     w-tests;
//   - `levelling`: a levelling network of 10 000 points on a 100 × 100 grid, differences to the
//     right and upper neighbours (19 800), 4 benchmarks: heights, σ, redundancy numbers, w-tests;
//   - `levelling-exact`: 200 points (20 × 10) in `rational`, against the same in float (ours),
//     with the digits of the results (their growth is the cost of exactness).
// The hand-written side orders the unknowns along the grid rows, so its normal matrix is banded
// (half-bandwidth ≈ 2 × 41 for the network, 100 for the levelling): a banded L·D·Lᵀ and the
// entries of N⁻¹ within the band (Takahashi's recurrence) for the cofactors an observation
// needs. The library finds its own order (minimum degree) on the sparse matrix.
import { rng } from '../data.mjs';

const RHO = 180 / Math.PI;

/** The plane network: { points, observations } as the library takes it, and the grid size. */
export function makeNetwork(W = 40, H = 25, seed = 11) {
  const rand = rng(seed);
  const gauss = () => {
    let s = 0;
    for (let i = 0; i < 12; i++) s += rand();
    return s - 6;
  };
  const truth = [];
  for (let r = 0; r < H; r++)
    for (let c = 0; c < W; c++)
      truth.push([c * 200 + (rand() - 0.5) * 60, r * 200 + (rand() - 0.5) * 60]);
  const nameOf = (i) => `P${i}`;
  const corner = new Set([0, W - 1, (H - 1) * W, H * W - 1]);
  const points = {};
  truth.forEach(([x, y], i) => {
    points[nameOf(i)] = corner.has(i)
      ? { x, y, fixed: true }
      : { x: x + (rand() - 0.5) * 0.1, y: y + (rand() - 0.5) * 0.1 };
  });
  const observations = [];
  const dist = (i, j) => {
    const [x1, y1] = truth[i],
      [x2, y2] = truth[j];
    observations.push({
      kind: 'distance',
      from: nameOf(i),
      to: nameOf(j),
      value: Math.hypot(x2 - x1, y2 - y1) + 0.003 * gauss(),
      sigma: 0.003,
    });
  };
  const bear = (i, j) => {
    const [x1, y1] = truth[i],
      [x2, y2] = truth[j];
    let az = Math.atan2(x2 - x1, y2 - y1) * RHO + (2 * gauss()) / 3600;
    if (az < 0) az += 360;
    observations.push({ kind: 'bearing', from: nameOf(i), to: nameOf(j), value: az, sigma: 2 });
  };
  for (let r = 0; r < H; r++)
    for (let c = 0; c < W; c++) {
      const i = r * W + c;
      if (c + 1 < W) dist(i, i + 1);
      if (r + 1 < H) dist(i, i + W);
      if (c + 1 < W && r + 1 < H) dist(i, i + W + 1);
      if (c + 1 < W) bear(i, i + 1);
      if (r + 1 < H) bear(i, i + W);
    }
  return { input: { points, observations }, W, H, truth, corner };
}

/** The levelling network: { fixed, observations } and the grid size. */
export function makeLevelling(W = 100, H = 100, seed = 12, exactMm = false) {
  const rand = rng(seed);
  const gauss = () => {
    let s = 0;
    for (let i = 0; i < 12; i++) s += rand();
    return s - 6;
  };
  const h = [];
  for (let i = 0; i < W * H; i++) h.push(100 + 50 * rand());
  const nameOf = (i) => `H${i}`;
  const bm = [0, W - 1, (H - 1) * W, H * W - 1];
  const mmText = (v) => (Math.round(v * 1000) / 1000).toFixed(3);
  const fixed = {};
  for (const i of bm) fixed[nameOf(i)] = exactMm ? mmText(h[i]) : h[i];
  const observations = [];
  const diff = (i, j) => {
    const d = h[j] - h[i] + 0.001 * gauss();
    observations.push({
      from: nameOf(i),
      to: nameOf(j),
      difference: exactMm ? mmText(d) : d,
      sigma: exactMm ? '0.001' : 0.001,
    });
  };
  for (let r = 0; r < H; r++)
    for (let c = 0; c < W; c++) {
      const i = r * W + c;
      if (c + 1 < W) diff(i, i + 1);
      if (r + 1 < H) diff(i, i + W);
    }
  return { input: { fixed, observations }, W, H, bm };
}

// ---- banded symmetric positive definite matrices: rows i, columns i..i+b ----------------
/** In place: N (band rows, N[i][k] = N(i, i + k)) → L·D·Lᵀ (L unit, stored as N[i][k] = L(i + k, i)). */
function bandLDL(N, n, b) {
  for (let j = 0; j < n; j++) {
    const rowJ = N[j];
    // D(j) and column j of L from the rows above within the band
    for (let k = Math.max(0, j - b); k < j; k++) {
      const rowK = N[k];
      const ljk = rowK[j - k]; // L(j, k)
      if (ljk === 0) continue;
      const dk = rowK[0];
      const f = ljk * dk;
      const top = Math.min(n - 1, k + b);
      // N(j, m) −= L(j, k)·D(k)·L(m, k) for m = j..k + b
      for (let m = j; m <= top; m++) rowJ[m - j] -= f * rowK[m - k];
    }
    const d = rowJ[0];
    if (!(d > 0)) throw new Error('hand-written: not positive definite');
    const top = Math.min(n - 1, j + b);
    for (let m = j + 1; m <= top; m++) rowJ[m - j] /= d; // L(m, j)
    // row j now holds D(j) at 0 and L(j + k, j) at k; the updates above still need the
    // unscaled values L·D, so they use rowK[m − k] (scaled) times dk: consistent.
  }
}

/** Solves L·D·Lᵀ x = r in place (factor from bandLDL). */
function bandSolve(N, n, b, r) {
  for (let j = 0; j < n; j++) {
    const top = Math.min(n - 1, j + b),
      rj = r[j],
      row = N[j];
    if (rj !== 0) for (let m = j + 1; m <= top; m++) r[m] -= row[m - j] * rj;
  }
  for (let j = 0; j < n; j++) r[j] /= N[j][0];
  for (let j = n - 1; j >= 0; j--) {
    const top = Math.min(n - 1, j + b),
      row = N[j];
    let s = r[j];
    for (let m = j + 1; m <= top; m++) s -= row[m - j] * r[m];
    r[j] = s;
  }
}

/** Entries of N⁻¹ within the band, Z[i][k] = N⁻¹(i, i + k), from the factor (Takahashi et al. 1973). */
function bandInverse(N, n, b) {
  const Z = new Array(n);
  const z = (i, j) => (i <= j ? Z[i][j - i] : Z[j][i - j]);
  for (let i = n - 1; i >= 0; i--) {
    const row = N[i],
      top = Math.min(n - 1, i + b);
    const zi = new Float64Array(b + 1);
    Z[i] = zi;
    // Z(i, j) = −Σ_k L(k, i)·Z(k, j) for j > i; Z(i, i) = 1/D(i) − Σ_k L(k, i)·Z(k, i)
    for (let j = top; j > i; j--) {
      let s = 0;
      for (let k = i + 1; k <= top; k++) s += row[k - i] * z(k, j);
      zi[j - i] = -s;
    }
    let s = 0;
    for (let k = i + 1; k <= top; k++) s += row[k - i] * zi[k - i];
    zi[0] = 1 / row[0] - s;
  }
  return z;
}

/** The network, plainly: Gauss–Newton with a banded solve, then σ, ellipses, r and w. */
export function handNetwork(net) {
  const { input, W } = net;
  const names = Object.keys(input.points);
  const idx = new Map();
  const unk = new Int32Array(names.length).fill(-1);
  let n = 0;
  names.forEach((k, i) => {
    idx.set(k, i);
    if (input.points[k].fixed !== true) {
      unk[i] = n;
      n += 2;
    }
  });
  const x = names.map((k) => input.points[k].x),
    y = names.map((k) => input.points[k].y);
  const b = 2 * (W + 2);
  const obs = input.observations.map((o) => ({
    dist: o.kind === 'distance',
    i: idx.get(o.from),
    j: idx.get(o.to),
    value: o.kind === 'distance' ? o.value : o.value / RHO,
    p:
      o.kind === 'distance'
        ? 1 / (o.sigma * o.sigma)
        : (RHO * 3600 * RHO * 3600) / (o.sigma * o.sigma),
  }));
  const m = obs.length;
  const a = new Float64Array(4 * m),
    l = new Float64Array(m);
  let N,
    iterations = 0;
  for (;;) {
    iterations++;
    N = new Array(n);
    for (let i = 0; i < n; i++) N[i] = new Float64Array(b + 1);
    const u = new Float64Array(n);
    for (let k = 0; k < m; k++) {
      const o = obs[k];
      const dx = x[o.j] - x[o.i],
        dy = y[o.j] - y[o.i];
      const q = dx * dx + dy * dy;
      let ax, ay, lk;
      if (o.dist) {
        const d = Math.sqrt(q);
        ax = dx / d;
        ay = dy / d;
        lk = o.value - d;
      } else {
        ax = dy / q; // ∂az/∂x_to
        ay = -dx / q;
        lk = o.value - Math.atan2(dx, dy);
        if (lk > Math.PI) lk -= 2 * Math.PI;
        else if (lk < -Math.PI) lk += 2 * Math.PI;
      }
      a[4 * k] = -ax;
      a[4 * k + 1] = -ay;
      a[4 * k + 2] = ax;
      a[4 * k + 3] = ay;
      l[k] = lk;
      const cols = [unk[o.i], unk[o.i] + 1, unk[o.j], unk[o.j] + 1];
      for (let s = 0; s < 4; s++) {
        const cs = unk[s < 2 ? o.i : o.j];
        if (cs < 0) continue;
        const c1 = cols[s],
          as = a[4 * k + s] * o.p;
        u[c1] += as * lk;
        for (let t = 0; t < 4; t++) {
          if (unk[t < 2 ? o.i : o.j] < 0) continue;
          const c2 = cols[t];
          if (c2 >= c1) N[c1][c2 - c1] += as * a[4 * k + t];
        }
      }
    }
    bandLDL(N, n, b);
    bandSolve(N, n, b, u);
    let big = 0;
    for (let i = 0; i < names.length; i++) {
      const c = unk[i];
      if (c < 0) continue;
      x[i] += u[c];
      y[i] += u[c + 1];
      big = Math.max(big, Math.abs(u[c]), Math.abs(u[c + 1]));
    }
    if (big <= 1e-7 || iterations >= 20) {
      // residuals of the last linear step: v = A·dx − l
      const z = bandInverse(N, n, b);
      let vtpv = 0;
      const out = new Array(m);
      for (let k = 0; k < m; k++) {
        const o = obs[k];
        const cols = [unk[o.i], unk[o.i] + 1, unk[o.j], unk[o.j] + 1];
        let v = -l[k],
          aza = 0;
        for (let s = 0; s < 4; s++) {
          if (unk[s < 2 ? o.i : o.j] < 0) continue;
          v += a[4 * k + s] * u[cols[s]];
          for (let t = 0; t < 4; t++)
            if (unk[t < 2 ? o.i : o.j] >= 0)
              aza += a[4 * k + s] * z(cols[s], cols[t]) * a[4 * k + t];
        }
        vtpv += o.p * v * v;
        const qvv = 1 / o.p - aza;
        out[k] = {
          residual: o.dist ? v : v * RHO * 3600,
          redundancy: o.p * qvv,
          w: v / Math.sqrt(qvv),
        };
      }
      const dof = m - n;
      const f = vtpv / dof;
      const points = {};
      for (let i = 0; i < names.length; i++) {
        const c = unk[i];
        if (c < 0) {
          points[names[i]] = { x: x[i], y: y[i], sigmaX: 0, sigmaY: 0 };
          continue;
        }
        const qxx = z(c, c),
          qyy = z(c + 1, c + 1),
          qxy = z(c, c + 1);
        const mid = (qxx + qyy) / 2,
          rad = Math.sqrt(((qyy - qxx) / 2) ** 2 + qxy * qxy);
        points[names[i]] = {
          x: x[i],
          y: y[i],
          sigmaX: Math.sqrt(f * qxx),
          sigmaY: Math.sqrt(f * qyy),
          major: Math.sqrt(f * (mid + rad)),
          minor: Math.sqrt(f * Math.max(0, mid - rad)),
          azimuth: (Math.atan2(2 * qxy, qyy - qxx) * RHO) / 2,
        };
      }
      return { points, observations: out, dof, vtpv, varianceFactor: f, iterations };
    }
  }
}

/** The levelling network, plainly: one banded solve, then σ, r and w. */
export function handLevelling(lev) {
  const { input, W, H } = lev;
  // The unknowns in grid order (row by row), so that N is banded.
  const names = Array.from({ length: W * H }, (_, i) => `H${i}`);
  const idx = new Map(names.map((k, i) => [k, i]));
  const fixedH = names.map((k) => input.fixed[k]);
  const unk = new Int32Array(names.length).fill(-1);
  let n = 0;
  names.forEach((k, i) => {
    if (fixedH[i] === undefined) unk[i] = n++;
  });
  const b = W + 1;
  const N = new Array(n);
  for (let i = 0; i < n; i++) N[i] = new Float64Array(b + 1);
  const u = new Float64Array(n);
  const obs = input.observations.map((o) => ({
    i: idx.get(o.from),
    j: idx.get(o.to),
    d: o.difference,
    p: 1 / (o.sigma * o.sigma),
  }));
  for (const o of obs) {
    // h_j − h_i = d + v
    const ci = unk[o.i],
      cj = unk[o.j];
    let rhs = o.d;
    if (ci < 0) rhs += fixedH[o.i];
    if (cj < 0) rhs -= fixedH[o.j];
    if (ci >= 0) {
      N[ci][0] += o.p;
      u[ci] -= o.p * rhs;
    }
    if (cj >= 0) {
      N[cj][0] += o.p;
      u[cj] += o.p * rhs;
    }
    if (ci >= 0 && cj >= 0) {
      if (cj > ci) N[ci][cj - ci] -= o.p;
      else N[cj][ci - cj] -= o.p;
    }
  }
  bandLDL(N, n, b);
  bandSolve(N, n, b, u);
  const z = bandInverse(N, n, b);
  const hOf = (i) => (unk[i] < 0 ? fixedH[i] : u[unk[i]]);
  let vtpv = 0;
  const out = new Array(obs.length);
  for (let k = 0; k < obs.length; k++) {
    const o = obs[k];
    const v = hOf(o.j) - hOf(o.i) - o.d;
    const ci = unk[o.i],
      cj = unk[o.j];
    let aza = 0;
    if (ci >= 0) aza += z(ci, ci);
    if (cj >= 0) aza += z(cj, cj);
    if (ci >= 0 && cj >= 0) aza -= 2 * z(ci, cj);
    vtpv += o.p * v * v;
    const qvv = 1 / o.p - aza;
    out[k] = { residual: v, redundancy: o.p * qvv, w: v / Math.sqrt(qvv) };
  }
  const dof = obs.length - n;
  const f = vtpv / dof;
  const heights = {};
  for (let i = 0; i < names.length; i++)
    heights[names[i]] = { value: hOf(i), sigma: unk[i] < 0 ? 0 : Math.sqrt(f * z(unk[i], unk[i])) };
  return { heights, observations: out, dof, vtpv, varianceFactor: f };
}

/** Largest number of digits of a denominator among the heights of a rational result. */
export function heightDigits(r) {
  let most = 0;
  for (const h of Object.values(r.heights)) most = Math.max(most, h.value.d.toString().length);
  return most;
}

/** A side that runs `f` once per item (an item is a whole adjustment). */
export function once(f, key) {
  const side = (times = 1) => {
    let acc = 0;
    for (let t = 0; t < times; t++) if (key(f())) acc++;
    return acc;
  };
  side.selfTimed = true;
  return side;
}

/** Runs the adjustments of every arithmetic on a tiny network (the pollution before timing). */
export function polluteAdjustments(g, arithmetics) {
  let k = 0;
  const tiny = makeLevelling(4, 3, 14, true).input;
  const net = makeNetwork(3, 3, 15).input;
  for (const A of arithmetics) {
    for (const run of [() => g.adjustLevelling(A, tiny), () => g.adjustNetwork(A, net)]) {
      try {
        k += run().dof;
      } catch {
        // an arithmetic the adjustment refuses (uncertain ones): nothing to pollute
      }
    }
  }
  return k;
}
