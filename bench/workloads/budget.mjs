// Workload (d): the uncertainty budget of (b): the three chainages (σ 2 mm) and the three
// readings (σ 1e-6 in spread) as measured inputs, H from heightFromInlineReadings in the
// uncertain arithmetic, then budget(U, H) (GUM, JCGM 100:2008, §5.1.2, eq. (10)).
// Float only: ours is the generic entry with uncertain(float) (the bound quadspread/float
// has no way to run a solver in another arithmetic); hand-written is forward-mode
// differentiation written out for the six inputs.
import { loop1 } from '../harness.mjs';
import { makeCases as heightCases } from './heights.mjs';

export const name = 'budget';
/**
 * Batches 8× as long (bench/run.mjs): each budget leaves many short-lived objects, and with
 * short batches its ratio moved from 1.9 to 4.0 between processes of one quick run; 2.6–2.8
 * in six processes with these (2026-12-04).
 */
export const batchScale = 8;
export const title = '(d) uncertainty budget of (b), float';
const SIG_C = 0.002,
  SIG_R = 1e-6;
const NAMES = ['c1', 'c2', 'c3', 'R1', 'R2', 'R3'];

export function unavailable(lib) {
  const { g } = lib;
  return g.uncertain && g.budget && g.measured && g.heightFromInlineReadings
    ? undefined
    : 'uncertain/budget/heightFromInlineReadings are not all in the built package yet';
}

export const makeCases = (n) => heightCases(n, 4);

// Dual numbers [value, ∂/∂c1, ∂/∂c2, ∂/∂c3, ∂/∂R1, ∂/∂R2, ∂/∂R3], written out.
const N = 7;
function seed(v, i) {
  const d = new Float64Array(N);
  d[0] = v;
  d[i + 1] = 1;
  return d;
}
function konst(v) {
  const d = new Float64Array(N);
  d[0] = v;
  return d;
}
function add(a, b) {
  const d = new Float64Array(N);
  for (let i = 0; i < N; i++) d[i] = a[i] + b[i];
  return d;
}
function sub(a, b) {
  const d = new Float64Array(N);
  for (let i = 0; i < N; i++) d[i] = a[i] - b[i];
  return d;
}
function mul(a, b) {
  const d = new Float64Array(N);
  d[0] = a[0] * b[0];
  for (let i = 1; i < N; i++) d[i] = a[i] * b[0] + a[0] * b[i];
  return d;
}
function div(a, b) {
  if (b[0] === 0) throw new Error('division by zero');
  const d = new Float64Array(N);
  const q = a[0] / b[0];
  d[0] = q;
  for (let i = 1; i < N; i++) d[i] = (a[i] - q * b[i]) / b[0];
  return d;
}

/** The same formulas as heights.handFloat, on dual numbers; then the budget. */
export function handFloat(inp) {
  const [s1, s2, s3] = inp.chainages.map((v, i) => seed(v, i));
  const origin = div(add(add(s1, s2), s3), konst(3)); // about the mean chainage, as the library
  const c1 = sub(s1, origin),
    c2 = sub(s2, origin),
    c3 = sub(s3, origin);
  const [R1, R2, R3] = inp.vertical.map((v, i) => seed(v, i + 3));
  const one = konst(1),
    two = konst(2);
  const k1 = div(sub(one, R1), R1),
    k2 = div(sub(one, R2), R2),
    k3 = div(sub(one, R3), R3);
  const a12 = sub(c2, c1),
    a23 = sub(c3, c2),
    a13 = sub(c3, c1);
  const coef = add(sub(mul(k1, a23), mul(k2, a13)), mul(k3, a12));
  const H = div(mul(mul(a12, a23), a13), coef);
  if (H[0] <= 0) throw new Error('inconsistent');
  // H is what the budget is of; f, e and the residuals are computed as the solver does.
  const f = div(sub(add(c1, c2), div(mul(H, sub(k1, k2)), sub(c1, c2))), two);
  const d1 = sub(c1, f);
  const g = add(sub(mul(H, k1), mul(d1, d1)), mul(f, f));
  const e = sub(g, mul(f, f));
  if (e[0] < 0) throw new Error('inconsistent');
  let variance = 0;
  const contributions = [];
  for (let i = 0; i < 6; i++) {
    const u = H[i + 1] * (i < 3 ? SIG_C : SIG_R);
    contributions.push({ name: NAMES[i], sensitivity: H[i + 1], contribution: u * u });
    variance += u * u;
  }
  contributions.sort((a, b) => b.contribution - a.contribution || (a.name < b.name ? -1 : 1));
  return { value: H[0], variance, sigma: Math.sqrt(variance), contributions };
}

export function build(lib, cases) {
  const { g } = lib;
  const fl = cases.map((c) => ({
    chainages: c.chainages.map((s) => g.float.from(s)),
    vertical: c.vertical.map((s) => g.float.from(s)),
  }));
  const U = g.uncertain(g.float);
  const ours = (inp) => {
    const chainages = inp.chainages.map((v, i) => g.measured(U, v, SIG_C, NAMES[i]));
    const vertical = inp.vertical.map((v, i) => g.measured(U, v, SIG_R, NAMES[i + 3]));
    const r = g.heightFromInlineReadings(U, { chainages, vertical });
    return g.budget(U, r.H);
  };
  return {
    items: cases.length,
    float: {
      ours: loop1(fl, ours, (b) => b.variance > 0),
      hand: loop1(fl, handFloat, (b) => b.variance > 0),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        if (!A.name.startsWith('uncertain')) continue;
        const V = g.uncertain(A.base ?? g.float);
        for (const c of cases.slice(0, 10)) {
          const chainages = c.chainages.map((v, i) => g.measured(V, v, '0.002', NAMES[i]));
          const vertical = c.vertical.map((v, i) => g.measured(V, v, '0.000001', NAMES[i + 3]));
          n += g.budget(V, g.heightFromInlineReadings(V, { chainages, vertical }).H) ? 1 : 0;
        }
      }
      return n;
    },
  };
}
