// Workload (b): heightFromInlineReadings — a point seen from 3 stations on a straight line at
// known chainages (mm), with a vertical reading (spread) at each; heights up to 200 m,
// offsets up to 500 m, stations within 1 km of the foot.
import Fraction from 'fraction.js';
import { rng } from '../data.mjs';
import { loop1 } from '../harness.mjs';

export const name = 'heights';
export const title = '(b) heights from in-line readings (3 stations)';

export function unavailable(lib) {
  return lib.g.heightFromInlineReadings
    ? undefined
    : 'heightFromInlineReadings() is not in the built package yet';
}

/** Cases as exact text: chainages in metres (mm), spreads R = H/(H + (c − f)² + e) as a/b. */
export function makeCases(n, seed = 2) {
  const rand = rng(seed);
  const mmInt = (lo, hi) => lo + Math.floor(rand() * (hi - lo));
  const out = [];
  while (out.length < n) {
    const h = new Fraction(mmInt(1000, 200000), 1000);
    const f = new Fraction(mmInt(-500000, 500000), 1000);
    const o = new Fraction(mmInt(0, 500000), 1000);
    const cs = [0, 1, 2].map(() => mmInt(-1000000, 1000000)).sort((a, b) => a - b);
    if (cs[0] === cs[1] || cs[1] === cs[2]) continue;
    const c = cs.map((m) => new Fraction(m, 1000));
    const H = h.mul(h);
    const R = c.map((ci) => H.div(H.add(ci.sub(f).pow(2)).add(o.mul(o))));
    out.push({ chainages: c.map((x) => x.toString()), vertical: R.map((r) => r.toFraction()) });
  }
  return out;
}

// ---- the same formulas as src/elevation/inline.ts (three stations), written plainly -----
// Chainages taken from their mean; kᵢ = (1 − Rᵢ)/Rᵢ; H = (c₂ − c₁)(c₃ − c₂)(c₃ − c₁)/(k₁(c₃ − c₂) − k₂(c₃ − c₁) + k₃(c₂ − c₁))
// (Stewart 1746, Prop. II); f = (c₁ + c₂ − H(k₁ − k₂)/(c₁ − c₂))/2; g = H·k₁ − (c₁ − f)² + f²;
// e = g − f²; residuals (cᵢ − f)² + e − H·kᵢ.

export function handFloat(inp) {
  const [r1, r2, r3] = inp.chainages;
  const origin = (r1 + r2 + r3) / 3; // solve about the mean chainage, as the library does
  const c1 = r1 - origin,
    c2 = r2 - origin,
    c3 = r3 - origin;
  const [R1, R2, R3] = inp.vertical;
  if (!(R1 > 0 && R1 <= 1 && R2 > 0 && R2 <= 1 && R3 > 0 && R3 <= 1)) throw new Error('spread');
  if (c1 === c2 || c2 === c3 || c1 === c3) throw new Error('chainage');
  const k1 = (1 - R1) / R1,
    k2 = (1 - R2) / R2,
    k3 = (1 - R3) / R3;
  const a12 = c2 - c1,
    a23 = c3 - c2,
    a13 = c3 - c1;
  const coef = k1 * a23 - k2 * a13 + k3 * a12;
  if (coef === 0) throw new Error('inconsistent');
  const H = (a12 * a23 * a13) / coef;
  const f = (c1 + c2 - (H * (k1 - k2)) / (c1 - c2)) / 2;
  const d1 = c1 - f;
  const g = H * k1 - d1 * d1 + f * f;
  if (H <= 0) throw new Error('inconsistent');
  const e = g - f * f;
  if (e < 0) throw new Error('inconsistent');
  const r = (ci, k) => {
    const d = ci - f;
    return d * d + e - H * k;
  };
  return {
    H,
    footChainage: f + origin,
    footOffset: e,
    residuals: [r(c1, k1), r(c2, k2), r(c3, k3)],
    sign: 1,
  };
}

export function naiveFraction(inp) {
  const [r1, r2, r3] = inp.chainages;
  const origin = r1.add(r2).add(r3).div(3);
  const c1 = r1.sub(origin),
    c2 = r2.sub(origin),
    c3 = r3.sub(origin);
  const [R1, R2, R3] = inp.vertical;
  const one = new Fraction(1);
  for (const R of inp.vertical)
    if (R.compare(0) <= 0 || R.compare(1) > 0) throw new Error('spread');
  if (c1.equals(c2) || c2.equals(c3) || c1.equals(c3)) throw new Error('chainage');
  const k1 = one.sub(R1).div(R1),
    k2 = one.sub(R2).div(R2),
    k3 = one.sub(R3).div(R3);
  const a12 = c2.sub(c1),
    a23 = c3.sub(c2),
    a13 = c3.sub(c1);
  const coef = k1.mul(a23).sub(k2.mul(a13)).add(k3.mul(a12));
  if (coef.n === 0n) throw new Error('inconsistent');
  const H = a12.mul(a23).mul(a13).div(coef);
  const f = c1
    .add(c2)
    .sub(H.mul(k1.sub(k2)).div(c1.sub(c2)))
    .div(2);
  const d1 = c1.sub(f);
  const g = H.mul(k1).sub(d1.mul(d1)).add(f.mul(f));
  if (H.compare(0) <= 0) throw new Error('inconsistent');
  const e = g.sub(f.mul(f));
  if (e.compare(0) < 0) throw new Error('inconsistent');
  const r = (ci, k) => {
    const d = ci.sub(f);
    return d.mul(d).add(e).sub(H.mul(k));
  };
  return {
    H,
    footChainage: f.add(origin),
    footOffset: e,
    residuals: [r(c1, k1), r(c2, k2), r(c3, k3)],
    sign: 1,
  };
}

export function makeNaiveBig(Big) {
  const one = new Big(1);
  return function naiveBig(inp) {
    const [r1, r2, r3] = inp.chainages;
    const origin = r1.plus(r2).plus(r3).div(3);
    const c1 = r1.minus(origin),
      c2 = r2.minus(origin),
      c3 = r3.minus(origin);
    const [R1, R2, R3] = inp.vertical;
    for (const R of inp.vertical) if (R.lte(0) || R.gt(1)) throw new Error('spread');
    if (c1.eq(c2) || c2.eq(c3) || c1.eq(c3)) throw new Error('chainage');
    const k1 = one.minus(R1).div(R1),
      k2 = one.minus(R2).div(R2),
      k3 = one.minus(R3).div(R3);
    const a12 = c2.minus(c1),
      a23 = c3.minus(c2),
      a13 = c3.minus(c1);
    const coef = k1.times(a23).minus(k2.times(a13)).plus(k3.times(a12));
    if (coef.eq(0)) throw new Error('inconsistent');
    const H = a12.times(a23).times(a13).div(coef);
    const f = c1
      .plus(c2)
      .minus(H.times(k1.minus(k2)).div(c1.minus(c2)))
      .div(2);
    const d1 = c1.minus(f);
    const g = H.times(k1).minus(d1.times(d1)).plus(f.times(f));
    if (H.lte(0)) throw new Error('inconsistent');
    const e = g.minus(f.times(f));
    if (e.lt(0)) throw new Error('inconsistent');
    const r = (ci, k) => {
      const d = ci.minus(f);
      return d.times(d).plus(e).minus(H.times(k));
    };
    return {
      H,
      footChainage: f.plus(origin),
      footOffset: e,
      residuals: [r(c1, k1), r(c2, k2), r(c3, k3)],
      sign: 1,
    };
  };
}

export function build(lib, cases) {
  const { g, F, R, D, Big, DecimalJs } = lib;
  const as = (from) =>
    cases.map((c) => ({ chainages: c.chainages.map(from), vertical: c.vertical.map(from) }));
  const fl = as((s) => F.arithmetic.from(s));
  const ra = as((s) => R.arithmetic.from(s));
  const fr = as((s) => new Fraction(s));
  const de = as((s) => D.arithmetic.from(s));
  // big.js cannot read 'a/b': the plain big.js side gets the decimal(34) value of each reading.
  const bi = cases.map((c, i) => ({
    chainages: c.chainages.map((s) => new Big(s)),
    vertical: de[i].vertical.map((v) => new Big(v.toString())),
  }));
  const naiveBig = makeNaiveBig(Big);
  // decimal.js reads the decimal(34) value of each reading too (every operation to 34 digits).
  const dj = cases.map((c, i) => ({
    chainages: c.chainages.map((s) => new DecimalJs(s)),
    vertical: de[i].vertical.map((v) => new DecimalJs(v.toString())),
  }));
  // Compiled from its own source text, so that it shares no type feedback with big.js's copy.
  const naiveDecimalJs = new Function(`return ${makeNaiveBig.toString()}`)()(DecimalJs);
  return {
    items: cases.length,
    float: {
      ours: loop1(fl, F.heightFromInlineReadings, (r) => r.H + r.footChainage + r.footOffset > 0),
      hand: loop1(fl, handFloat, (r) => r.H + r.footChainage + r.footOffset > 0),
    },
    floatGeneric: {
      ours: loop1(
        fl,
        (x) => g.heightFromInlineReadings(g.float, x),
        (r) => r.H + r.footChainage + r.footOffset > 0,
      ),
      hand: loop1(fl, handFloat, (r) => r.H + r.footChainage + r.footOffset > 0),
    },
    rational: {
      ours: loop1(ra, R.heightFromInlineReadings, (r) => r.H.n > 0n),
      naive: loop1(fr, naiveFraction, (r) => r.H.n > 0n),
    },
    decimal: {
      ours: loop1(de, D.heightFromInlineReadings, (r) => r.H.c[0] > 0),
      naive: loop1(bi, naiveBig, (r) => r.H.c[0] > 0),
    },
    decimalJs: {
      ours: loop1(de, D.heightFromInlineReadings, (r) => r.H.c[0] > 0),
      naive: loop1(dj, naiveDecimalJs, (r) => !r.H.isZero()),
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        for (const c of cases.slice(0, 30)) {
          n += g.heightFromInlineReadings(A, {
            chainages: c.chainages.map((s) => A.from(s)),
            vertical: c.vertical.map((s) => A.from(s)),
          })
            ? 1
            : 0;
        }
      }
      return n;
    },
  };
}
