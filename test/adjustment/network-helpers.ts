// Helpers for the plane-network tests: synthetic networks and an independent Gauss–Newton in
// plain float numbers (normal equations solved by mathjs), written here without the library.
import * as math from 'mathjs';

export type Obs =
  | { kind: 'distance'; from: string; to: string; value: number; sigma: number }
  | { kind: 'bearing'; from: string; to: string; value: number; sigma: number }
  | { kind: 'direction'; at: string; to: string; value: number; sigma: number }
  | { kind: 'angle'; at: string; from: string; to: string; value: number; sigma: number }
  | { kind: 'vector'; from: string; to: string; dx: number; dy: number; covariance: number[][] };

export const RHO = 648000 / Math.PI;

/** Azimuth in degrees [0, 360) of P → Q, clockwise from north (x = east, y = north). */
export const azimuth = (P: number[], Q: number[]): number => {
  const a = (Math.atan2(Q[0]! - P[0]!, Q[1]! - P[1]!) * 180) / Math.PI;
  return a < 0 ? a + 360 : a;
};

/** A small LCG (Knuth's MMIX constants) and a Box–Muller normal. */
export function lcg(seed: number): { u: () => number; n: () => number } {
  let s = BigInt(seed);
  const u = (): number => {
    s = (s * 6364136223846793005n + 1442695040888963407n) & ((1n << 64n) - 1n);
    return (Number(s >> 11n) + 0.5) / 2 ** 53;
  };
  return { u, n: () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u()) };
}

/**
 * The plain-float Gauss–Newton of a network: unknowns x, y of the free points and one
 * orientation per direction station; normal equations solved by mathjs lusolve. Returns the
 * coordinates, N⁻¹ (mathjs inv), the final design matrix, weights and residuals.
 */
export function gaussNewton(
  points: Record<string, { x: number; y: number; fixed?: boolean }>,
  obs: Obs[],
  iterations = 10,
) {
  const names = Object.keys(points);
  const xy = new Map(names.map((k) => [k, [points[k]!.x, points[k]!.y]]));
  const col = new Map<string, number>();
  for (const k of names) if (!points[k]!.fixed) col.set(k, col.size * 2);
  let u = col.size * 2;
  const stations = [
    ...new Set(obs.filter((o) => o.kind === 'direction').map((o) => (o as { at: string }).at)),
  ];
  const ocol = new Map(stations.map((s) => [s, u++]));
  const orient = new Map(
    stations.map((s) => {
      const o = obs.find((d) => d.kind === 'direction' && d.at === s) as {
        at: string;
        to: string;
        value: number;
      };
      return [s, azimuth(xy.get(s)!, xy.get(o.to)!) - o.value];
    }),
  );
  let last = {
    A: [] as number[][],
    P: [] as number[],
    l: [] as number[],
    v: [] as number[],
    Ninv: [] as number[][],
  };
  for (let it = 0; it < iterations; it++) {
    const rows: number[][] = [];
    const l: number[] = [];
    const p: number[] = [];
    const blocks: { rows: number[]; W: number[][] }[] = [];
    const row = () => new Array<number>(u).fill(0);
    const dir = (a: string, b: string, r: number[], sgn: number) => {
      const [x0, y0] = xy.get(a)!;
      const [x1, y1] = xy.get(b)!;
      const q = (x1! - x0!) ** 2 + (y1! - y0!) ** 2;
      const ax = (RHO * (y1! - y0!)) / q;
      const ay = (-RHO * (x1! - x0!)) / q;
      if (col.has(b)) {
        r[col.get(b)!]! += sgn * ax;
        r[col.get(b)! + 1]! += sgn * ay;
      }
      if (col.has(a)) {
        r[col.get(a)!]! -= sgn * ax;
        r[col.get(a)! + 1]! -= sgn * ay;
      }
      return azimuth(xy.get(a)!, xy.get(b)!);
    };
    const wrap = (s: number) => ((((s + 648000) % 1296000) + 1296000) % 1296000) - 648000;
    for (const o of obs) {
      if (o.kind === 'vector') {
        const r0 = row();
        const r1 = row();
        for (const [k, s] of [
          [o.to, 1],
          [o.from, -1],
        ] as const)
          if (col.has(k)) {
            r0[col.get(k)!] = s;
            r1[col.get(k)! + 1] = s;
          }
        const start = rows.length;
        rows.push(r0, r1);
        l.push(
          o.dx - (xy.get(o.to)![0]! - xy.get(o.from)![0]!),
          o.dy - (xy.get(o.to)![1]! - xy.get(o.from)![1]!),
        );
        p.push(NaN, NaN);
        blocks.push({ rows: [start, start + 1], W: math.inv(o.covariance) as number[][] });
        continue;
      }
      const r = row();
      let computed: number;
      if (o.kind === 'distance') {
        const [x0, y0] = xy.get(o.from)!;
        const [x1, y1] = xy.get(o.to)!;
        const d = Math.hypot(x1! - x0!, y1! - y0!);
        for (const [k, s] of [
          [o.to, 1],
          [o.from, -1],
        ] as const)
          if (col.has(k)) {
            r[col.get(k)!] = (s * (x1! - x0!)) / d;
            r[col.get(k)! + 1] = (s * (y1! - y0!)) / d;
          }
        rows.push(r);
        l.push(o.value - d);
        p.push(1 / o.sigma ** 2);
        continue;
      }
      if (o.kind === 'bearing') computed = dir(o.from, o.to, r, 1);
      else if (o.kind === 'angle') computed = dir(o.at, o.to, r, 1) - dir(o.at, o.from, r, -1);
      else {
        computed = dir(o.at, o.to, r, 1) - orient.get(o.at)!;
        r[ocol.get(o.at)!] = -1;
      }
      rows.push(r);
      l.push(wrap((o.value - computed) * 3600));
      p.push(1 / o.sigma ** 2);
    }
    // N = AᵀPA, b = AᵀPl (uncorrelated rows and 2 × 2 vector blocks)
    const N = Array.from({ length: u }, () => new Array<number>(u).fill(0));
    const b = new Array<number>(u).fill(0);
    rows.forEach((r, i) => {
      if (Number.isNaN(p[i]!)) return;
      for (let a = 0; a < u; a++) {
        if (r[a] === 0) continue;
        b[a] = b[a]! + p[i]! * r[a]! * l[i]!;
        for (let c = 0; c < u; c++) N[a]![c]! += p[i]! * r[a]! * r[c]!;
      }
    });
    for (const {
      rows: [i, j],
      W,
    } of blocks)
      for (let a = 0; a < u; a++)
        for (let s = 0; s < 2; s++)
          for (let t = 0; t < 2; t++) {
            const ra = [rows[i!]!, rows[j!]!][s]![a]!;
            if (ra === 0) continue;
            const w = W[s]![t]!;
            b[a] = b[a]! + ra * w * l[[i!, j!][t]!]!;
            for (let c = 0; c < u; c++) N[a]![c]! += ra * w * [rows[i!]!, rows[j!]!][t]![c]!;
          }
    const dx = (math.lusolve(N, b) as number[][]).map((r) => r[0]!);
    const v = rows.map((r, i) => r.reduce((s, a, k) => s + a * dx[k]!, 0) - l[i]!);
    last = { A: rows, P: p, l, v, Ninv: math.inv(N) as number[][] };
    for (const [k, c] of col) xy.set(k, [xy.get(k)![0]! + dx[c]!, xy.get(k)![1]! + dx[c + 1]!]);
    for (const [s, c] of ocol) orient.set(s, orient.get(s)! + dx[c]! / 3600);
    if (Math.max(...dx.map(Math.abs)) < 1e-10) break;
  }
  return { xy, col, ...last, u };
}
