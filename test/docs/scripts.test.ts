// The practitioner scripts in examples/scripts/ run as a user runs them (bundled with
// 'quadspread' pointing at the sources, then node), and their printed results agree with the
// same problems worked here independently with Math.* (classical trigonometry), not with the
// library.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const root = resolve(__dirname, '../..');
let dir = '';
const out: Record<string, string> = {};

async function runScript(name: string): Promise<string> {
  const file = join(dir, `${name}.mjs`);
  await build({
    entryPoints: [join(root, 'examples/scripts', `${name}.mjs`)],
    bundle: true,
    platform: 'node',
    format: 'esm',
    outfile: file,
    alias: { quadspread: join(root, 'src/index.ts') },
    logLevel: 'error',
  });
  const r = spawnSync(process.execPath, [file], { encoding: 'utf8', timeout: 60000 });
  if (r.status !== 0) throw new Error(`${name}: exit ${r.status}\n${r.stderr}`);
  return r.stdout;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'quadspread-scripts-'));
  for (const name of ['chimney-height', 'traverse-loop', 'haul-road'])
    out[name] = await runScript(name);
}, 120000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rad = (deg: number) => (deg * Math.PI) / 180;
const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;
/** The number after `label` in a script's output. */
const num = (text: string, label: string): number => {
  const m = new RegExp(`${label}[^\\d-]*(-?[\\d.]+)`).exec(text);
  if (!m) throw new Error(`no "${label}" in:\n${text}`);
  return Number(m[1]);
};

describe('examples/scripts/', () => {
  it('use no angle arithmetic of their own and no conversions of exact values', () => {
    for (const name of ['chimney-height', 'traverse-loop', 'haul-road']) {
      const src = readFileSync(join(root, 'examples/scripts', `${name}.mjs`), 'utf8');
      expect(src).not.toMatch(/Math\.(sin|cos|tan|atan|PI)|\/ 3600|\* 3600|toNumber|Number\(/);
    }
  });

  it('chimney-height.mjs: the height in feet and its uncertainty agree with classical trigonometry', () => {
    const text = out['chimney-height']!;
    // Independent: the plan triangle by the sine rule, h = d·cot z at each station, the mean
    // weighted by w = (1 − R)²/Q (R = cos²z, Q = d²), as heightFromBase documents it.
    const f = (x: number[]): number => {
      const [b, a1, a2, z1, z2] = x as [number, number, number, number, number];
      const c = Math.PI - a1 - a2;
      const d1 = (b * Math.sin(a2)) / Math.sin(c);
      const d2 = (b * Math.sin(a1)) / Math.sin(c);
      const H = [d1 / Math.tan(z1), d2 / Math.tan(z2)].map((h) => h * h);
      const w = [
        Math.sin(z1) ** 4 / (d1 * d1),
        Math.sin(z2) ** 4 / (d2 * d2),
      ];
      return Math.sqrt((w[0]! * H[0]! + w[1]! * H[1]!) / (w[0]! + w[1]!));
    };
    const x = [
      150,
      rad(dms(58, 21, 14)),
      rad(dms(64, 5, 52)),
      rad(dms(63, 25, 14)),
      rad(dms(62, 8, 11)),
    ];
    const u = [0.02, ...Array(4).fill(rad(5 / 3600))];
    const h = f(x);
    expect(num(text, 'height above the instruments')).toBeCloseTo(h, 2);
    // First-order propagation (GUM eq. (10)) with central differences.
    let variance = 0;
    x.forEach((xi, i) => {
      const e = Math.abs(xi) * 1e-6;
      const up = x.slice();
      const dn = x.slice();
      up[i] = xi + e;
      dn[i] = xi - e;
      variance += (((f(up) - f(dn)) / (2 * e)) * u[i]!) ** 2;
    });
    expect(num(text, 'standard uncertainty')).toBeCloseTo(Math.sqrt(variance), 3);
    expect(text).toMatch(/base A–B: \d+\.\d %/);
  });

  it('traverse-loop.mjs: misclosures, adjusted coordinates and area agree with a hand computation', () => {
    const text = out['traverse-loop']!;
    const angles = [
      dms(91, 20, 0),
      dms(124, 22, 29),
      dms(102, 24, 33),
      dms(110, 23, 2),
      dms(111, 30, 3),
    ];
    const dist = [389.886, 335.648, 358.234, 372.434, 393.681];
    const mis = angles.reduce((s, a) => s + a, 0) - 540;
    expect(mis * 3600).toBeCloseTo(7, 9);
    expect(text).toContain(`angular misclosure: 0°00'07.0"`);
    // Balanced angles carried: forward = back + 180° + angle − misclosure/5.
    const bearings = [dms(97, 38, 22)];
    for (let i = 1; i < 5; i++)
      bearings.push((bearings[i - 1]! + 180 + angles[i]! - mis / 5) % 360);
    const lat = bearings.map((b, i) => dist[i]! * Math.cos(rad(b)));
    const dep = bearings.map((b, i) => dist[i]! * Math.sin(rad(b)));
    const total = dist.reduce((s, d) => s + d, 0);
    const eN = lat.reduce((s, v) => s + v, 0);
    const eE = dep.reduce((s, v) => s + v, 0);
    expect(num(text, 'linear misclosure')).toBeCloseTo(Math.hypot(eN, eE), 4);
    // Bowditch: each course corrected by −misclosure × length / total.
    const pts = [[1000, 1000]];
    for (let i = 0; i < 4; i++)
      pts.push([
        pts[i]![0]! + dep[i]! - (eE * dist[i]!) / total,
        pts[i]![1]! + lat[i]! - (eN * dist[i]!) / total,
      ]);
    ['K2', 'K3', 'K4', 'K5'].forEach((k, i) => {
      const m = new RegExp(`${k}: E ([\\d.]+)  N ([\\d.]+)`).exec(text)!;
      expect(Number(m[1])).toBeCloseTo(pts[i + 1]![0]!, 3);
      expect(Number(m[2])).toBeCloseTo(pts[i + 1]![1]!, 3);
    });
    // Shoelace area of the adjusted corners, in hectares.
    let twice = 0;
    for (let i = 0; i < 5; i++) {
      const [x1, y1] = pts[i]!;
      const [x2, y2] = pts[(i + 1) % 5]!;
      twice += x1! * y2! - x2! * y1!;
    }
    expect(num(text, 'area')).toBeCloseTo(twice / 2 / 10000, 4);
  });

  it('haul-road.mjs: across a 1-in-3 slope, tan γ = tan β·cos θ (the plan angle θ from the fall line)', () => {
    const text = out['haul-road']!;
    // 1 in 10 on a 1 in 3 slope: cos θ = (1/10)/(1/3) = 0.3.
    const theta = Math.acos(0.3);
    const f = /\(spread\): (\d+)\/(\d+)/.exec(text)!;
    expect(Number(f[1]) / Number(f[2])).toBeCloseTo(Math.sin(theta) ** 2, 12);
    const m = /\(angle\): (\d+)°(\d+)'([\d.]+)"/.exec(text)!;
    expect(dms(Number(m[1]), Number(m[2]), Number(m[3]))).toBeCloseTo((theta * 180) / Math.PI, 4);
    // 60° from the fall line: tan γ = (1/3)·cos 60° = 1/6, 16.6667 %.
    expect(text).toContain('50/3 %');
    expect(num(text, '= ')).toBeCloseTo(100 / 6, 4);
  });
});
