// Workload (a): triangle(A1, A2, A3) → { Q1, Q2, Q3, s1, s2, s3, quadrea } for triangles with
// millimetre coordinates inside a 100 km square, sides from 1 m to 100 km (log-uniform).
import { rng, mm, sig } from '../data.mjs';
import { loop3 } from '../harness.mjs';

export const name = 'triangle';
export const title = '(a) triangles, mm coordinates up to 100 km';

/** Triangles as coordinate text; `digits` (optional) gives every coordinate that many significant digits. */
export function makeCases(n, seed = 1, digits) {
  const rand = rng(seed);
  const out = [];
  while (out.length < n) {
    let t;
    if (digits) {
      t = [0, 1, 2, 3, 4, 5].map(() => sig(rand, digits, 4));
    } else {
      const x1 = Math.floor(rand() * 1e8),
        y1 = Math.floor(rand() * 1e8);
      const size = Math.round(1000 * 10 ** (rand() * 5)); // 1 m … 100 km, in mm
      const off = () => Math.round((rand() * 2 - 1) * size);
      t = [x1, y1, x1 + off(), y1 + off(), x1 + off(), y1 + off()].map(mm);
    }
    const [ax, ay, bx, by, cx, cy] = t.map(Number);
    if ((bx - ax) * (cy - ay) - (by - ay) * (cx - ax) === 0) continue;
    out.push(t);
  }
  return out;
}

// ---- the same formulas as src/geometry/triangle.ts, written plainly ----------------------
// u = A2 − A1, v = A3 − A1, w = A3 − A2; Q1 = w·w, Q2 = v·v, Q3 = u·u; D = u × v;
// s1 = D²/(Q2·Q3), s2 = D²/(Q1·Q3), s3 = D²/(Q1·Q2) (sin²θ = |u × v|²/(|u|²|v|²), Lagrange's
// identity; derived); quadrea = 4·D² (= 16·area², Heron, Metrica I.8, in squared form).

/** Hand-written float code. */
export function handFloat(P1, P2, P3) {
  const ux = P2.x - P1.x,
    uy = P2.y - P1.y;
  const vx = P3.x - P1.x,
    vy = P3.y - P1.y;
  const wx = P3.x - P2.x,
    wy = P3.y - P2.y;
  const Q1 = wx * wx + wy * wy,
    Q2 = vx * vx + vy * vy,
    Q3 = ux * ux + uy * uy;
  if (Q1 === 0 || Q2 === 0 || Q3 === 0) throw new Error('coincident');
  const D = ux * vy - uy * vx;
  const D2 = D * D;
  if (D2 === 0) throw new Error('collinear');
  // Rounding can push the spread of a right angle just above 1: clamp it (as triangle() does).
  let s1 = D2 / (Q2 * Q3),
    s2 = D2 / (Q1 * Q3),
    s3 = D2 / (Q1 * Q2);
  if (s1 > 1) s1 = 1;
  if (s2 > 1) s2 = 1;
  if (s3 > 1) s3 = 1;
  return { Q1, Q2, Q3, s1, s2, s3, quadrea: 4 * D2 };
}

/** The same with fraction.js, plainly (one Fraction operation per step). */
export function naiveFraction(P1, P2, P3) {
  const ux = P2.x.sub(P1.x),
    uy = P2.y.sub(P1.y);
  const vx = P3.x.sub(P1.x),
    vy = P3.y.sub(P1.y);
  const wx = P3.x.sub(P2.x),
    wy = P3.y.sub(P2.y);
  const Q1 = wx.mul(wx).add(wy.mul(wy)),
    Q2 = vx.mul(vx).add(vy.mul(vy)),
    Q3 = ux.mul(ux).add(uy.mul(uy));
  if (Q1.n === 0n || Q2.n === 0n || Q3.n === 0n) throw new Error('coincident');
  const D = ux.mul(vy).sub(uy.mul(vx));
  const D2 = D.mul(D);
  if (D2.n === 0n) throw new Error('collinear');
  return {
    Q1,
    Q2,
    Q3,
    s1: D2.div(Q2.mul(Q3)),
    s2: D2.div(Q1.mul(Q3)),
    s3: D2.div(Q1.mul(Q2)),
    quadrea: D2.mul(4),
  };
}

/** The same with big.js, plainly (exact + − ×; ÷ to Big.DP = 34 decimal places). */
export function naiveBig(P1, P2, P3) {
  const ux = P2.x.minus(P1.x),
    uy = P2.y.minus(P1.y);
  const vx = P3.x.minus(P1.x),
    vy = P3.y.minus(P1.y);
  const wx = P3.x.minus(P2.x),
    wy = P3.y.minus(P2.y);
  const Q1 = wx.times(wx).plus(wy.times(wy)),
    Q2 = vx.times(vx).plus(vy.times(vy)),
    Q3 = ux.times(ux).plus(uy.times(uy));
  if (Q1.c[0] === 0 || Q2.c[0] === 0 || Q3.c[0] === 0) throw new Error('coincident');
  const D = ux.times(vy).minus(uy.times(vx));
  const D2 = D.times(D);
  if (D2.c[0] === 0) throw new Error('collinear');
  return {
    Q1,
    Q2,
    Q3,
    s1: D2.div(Q2.times(Q3)),
    s2: D2.div(Q1.times(Q3)),
    s3: D2.div(Q1.times(Q2)),
    quadrea: D2.times(4),
  };
}

/** The same with decimal.js, plainly (every operation to 34 significant digits, ties to even). */
export function naiveDecimalJs(P1, P2, P3) {
  const ux = P2.x.minus(P1.x),
    uy = P2.y.minus(P1.y);
  const vx = P3.x.minus(P1.x),
    vy = P3.y.minus(P1.y);
  const wx = P3.x.minus(P2.x),
    wy = P3.y.minus(P2.y);
  const Q1 = wx.times(wx).plus(wy.times(wy)),
    Q2 = vx.times(vx).plus(vy.times(vy)),
    Q3 = ux.times(ux).plus(uy.times(uy));
  if (Q1.isZero() || Q2.isZero() || Q3.isZero()) throw new Error('coincident');
  const D = ux.times(vy).minus(uy.times(vx));
  const D2 = D.times(D);
  if (D2.isZero()) throw new Error('collinear');
  return {
    Q1,
    Q2,
    Q3,
    s1: D2.div(Q2.times(Q3)),
    s2: D2.div(Q1.times(Q3)),
    s3: D2.div(Q1.times(Q2)),
    quadrea: D2.times(4),
  };
}

/** Bare BigInt work of the same formulas on integer coordinates (no normalisation): the floor. */
export function bigintFloor(X1, Y1, X2, Y2, X3, Y3) {
  const ux = X2 - X1,
    uy = Y2 - Y1,
    vx = X3 - X1,
    vy = Y3 - Y1,
    wx = X3 - X2,
    wy = Y3 - Y2;
  const q1 = wx * wx + wy * wy,
    q2 = vx * vx + vy * vy,
    q3 = ux * ux + uy * uy;
  const c = ux * vy - uy * vx;
  const c2 = c * c;
  return [q1, q2, q3, c2, q2 * q3, q1 * q3, q1 * q2, 4n * c2];
}

/**
 * Builds the runnable sides. `lib` = { g, F, R, D, Fraction, Big }.
 * Each side is a function running all cases once and returning a checksum.
 */
export function build(lib, cases) {
  const { g, F, R, D, Fraction, Big, DecimalJs } = lib;
  // The bound entries' own functions, called directly (no shared wrapper closure: its call
  // site's feedback would mix the arithmetics).
  const tri = (entry) => entry.triangle;
  const pts = (from) =>
    cases.map((t) => [0, 2, 4].map((i) => ({ x: from(t[i]), y: from(t[i + 1]) })));
  const fl = pts(Number);
  const ra = pts((s) => R.arithmetic.from(s));
  const fr = pts((s) => new Fraction(s));
  const de = pts((s) => D.arithmetic.from(s));
  const bi = pts((s) => new Big(s));
  const dj = pts((s) => new DecimalJs(s));
  const loop = loop3;
  const fTri = tri(F);
  const gTri = (a, b, c) => g.triangle(g.float, a, b, c);
  const rTri = tri(R);
  const dTri = tri(D);
  return {
    items: cases.length,
    // Every measure is used, so that no side can skip computing any.
    float: {
      ours: loop(fl, fTri, (r) => r.Q1 + r.Q2 + r.Q3 + r.s1 + r.s2 + r.s3 + r.quadrea > 0),
      hand: loop(fl, handFloat, (r) => r.Q1 + r.Q2 + r.Q3 + r.s1 + r.s2 + r.s3 + r.quadrea > 0),
    },
    floatGeneric: {
      ours: loop(fl, gTri, (r) => r.Q1 + r.Q2 + r.Q3 + r.s1 + r.s2 + r.s3 + r.quadrea > 0),
      hand: loop(fl, handFloat, (r) => r.Q1 + r.Q2 + r.Q3 + r.s1 + r.s2 + r.s3 + r.quadrea > 0),
    },
    rational: {
      ours: loop(ra, rTri, (r) => r.s1.n > 0n),
      naive: loop(fr, naiveFraction, (r) => r.s1.n > 0n),
    },
    decimal: {
      ours: loop(de, dTri, (r) => r.s1.c[0] > 0),
      naive: loop(bi, naiveBig, (r) => r.s1.c[0] > 0),
    },
    decimalJs: {
      ours: loop(de, dTri, (r) => r.s1.c[0] > 0),
      naive: loop(dj, naiveDecimalJs, (r) => !r.s1.isZero()),
    },
    // For the pollution pass: every arithmetic through the generic entry's triangle.
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        for (const t of cases.slice(0, 50)) {
          const [a, b, c] = [0, 2, 4].map((i) => g.point(A, t[i], t[i + 1]));
          n += g.triangle(A, a, b, c) ? 1 : 0;
        }
      }
      return n;
    },
  };
}

/** Rational cost growth: our rational triangle and the bare BigInt floor at k significant digits. */
export function buildGrowth(lib, digits, n) {
  const { g, R } = lib;
  const cases = makeCases(n, 7 + digits, digits);
  const ra = cases.map((t) =>
    [0, 2, 4].map((i) => ({ x: R.arithmetic.from(t[i]), y: R.arithmetic.from(t[i + 1]) })),
  );
  // Integer coordinates of the same cases (scaled by a common power of ten).
  const ints = cases.map((t) => {
    const fs = t.map((s) => R.arithmetic.from(s));
    let D = 1n;
    for (const f of fs) while (D % f.d !== 0n) D *= 10n;
    return fs.map((f) => f.s * f.n * (D / f.d));
  });
  const rTri = R.triangle
    ? (a, b, c) => R.triangle(a, b, c)
    : (a, b, c) => g.triangle(g.rational, a, b, c);
  // (fraction.js reads no exponent form: the same values, read by the library.)
  const fr = cases.map((t) =>
    [0, 2, 4].map((i) => ({ x: R.arithmetic.from(t[i]), y: R.arithmetic.from(t[i + 1]) })),
  );
  return {
    items: n,
    naive: loop3(fr, naiveFraction, (r) => r.s1.n > 0n),
    ours: () => {
      let acc = 0;
      for (const p of ra) acc += rTri(p[0], p[1], p[2]).s1.n > 0n ? 1 : 0;
      return acc;
    },
    floor: () => {
      let acc = 0;
      for (const x of ints) acc += bigintFloor(x[0], x[1], x[2], x[3], x[4], x[5])[3] > 0n ? 1 : 0;
      return acc;
    },
  };
}

export function unavailable(lib) {
  return lib.g.triangle ? undefined : 'triangle() is not in the built package yet';
}
