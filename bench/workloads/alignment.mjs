// Workload (i): chainage and offset of surveyed points — alignmentStation on a road centre line of
// 201 elements (100 circular curves between straights), for 100 000 points scattered within 40 m
// of the line.
import { rng } from '../data.mjs';

export const name = 'alignment';
export const title = '(i) alignmentStation, 201 elements, 100 000 points within 40 m of the line';
/** Each item is a batch of 100 000 points (10 000 in --quick): a third of the pairs. */
export const repsScale = 1 / 3;

export function unavailable(lib) {
  return lib.g.alignmentStation ? undefined : 'alignmentStation() is not in the built package yet';
}

/** A wandering line of 100 curves, and `n` points near it (as chainage/offset to place). */
export function makeCases(n, seed = 8) {
  const rand = rng(seed);
  const points = [{ x: 500000, y: 6000000 }];
  const curves = [];
  let b = 0.3;
  for (let i = 0; i < 101; i++) {
    const p = points[points.length - 1];
    const leg = 300 + rand() * 300;
    points.push({ x: p.x + leg * Math.sin(b), y: p.y + leg * Math.cos(b) });
    const turn = (rand() < 0.5 ? -1 : 1) * (0.2 + rand() * 0.5);
    b += turn;
    if (i < 100) curves.push({ radius: 150 + Math.round(rand() * 250) });
  }
  return { points, curves, n: n >= 1000 ? 100_000 : 10_000, seed };
}

// ---- a hand-written projection on straights and arcs ------------------------------------------
// Each element as plain numbers: straights (start, unit direction, length), arcs (centre, radius,
// start radius, turn, length). For a point: every element whose box is no farther than the best
// foot so far is projected; the nearest perpendicular foot wins.
export function handElements(h) {
  return h.elements.map((e) => ({
    type: e.type,
    sx: e.start.x,
    sy: e.start.y,
    dx: e.direction.x,
    dy: e.direction.y,
    len: e.length,
    c0: e.startChainage,
    cx: e.type === 'arc' ? e.centre.x : 0,
    cy: e.type === 'arc' ? e.centre.y : 0,
    r: e.type === 'arc' ? e.radius : 0,
    turn: e.type === 'arc' ? e.turn : 0,
    box: [...e.bounds], // its own array, as it copies every other field
  }));
}

export function handStation(els, px, py) {
  let best = Infinity;
  let chainage = NaN;
  let offset = NaN;
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    const b = e.box;
    const bx = px < b[0] ? b[0] - px : px > b[2] ? px - b[2] : 0;
    const by = py < b[1] ? b[1] - py : py > b[3] ? py - b[3] : 0;
    if (bx * bx + by * by > best * best) continue;
    let s, o;
    if (e.type === 'straight') {
      const qx = px - e.sx;
      const qy = py - e.sy;
      s = qx * e.dx + qy * e.dy;
      if (s < 0 || s > e.len) continue;
      o = qx * e.dy - qy * e.dx;
    } else {
      const rx = px - e.cx;
      const ry = py - e.cy;
      const r0x = e.sx - e.cx;
      const r0y = e.sy - e.cy;
      const cross = r0x * ry - r0y * rx;
      const dot = r0x * rx + r0y * ry;
      s = Math.atan2(e.turn > 0 ? -cross : cross, dot) * e.r;
      if (s < 0 || s > e.len) continue;
      o = e.turn * (e.r - Math.hypot(rx, ry));
    }
    if (Math.abs(o) < best) {
      best = Math.abs(o);
      chainage = e.c0 + s;
      offset = o;
    }
  }
  if (!(best < Infinity)) throw new Error('off the line');
  return { chainage, offset };
}

export function build(lib, cases) {
  const { g, F } = lib;
  const h = F.horizontalAlignment({ points: cases.points, curves: cases.curves });
  const rand = rng(cases.seed + 1);
  const xs = new Float64Array(cases.n);
  const ys = new Float64Array(cases.n);
  for (let i = 0; i < cases.n; i++) {
    const p = F.alignmentPoint(h, h.startChainage + rand() * h.length, (rand() - 0.5) * 80);
    xs[i] = p.x;
    ys[i] = p.y;
  }
  const els = handElements(h);
  const pts = Array.from(xs, (x, i) => ({ x, y: ys[i] }));
  return {
    items: cases.n,
    float: {
      ours: () => {
        let s = 0;
        for (let i = 0; i < pts.length; i++) s += F.alignmentStation(h, pts[i]).chainage;
        return s > 0;
      },
      hand: () => {
        let s = 0;
        for (let i = 0; i < xs.length; i++) s += handStation(els, xs[i], ys[i]).chainage;
        return s > 0;
      },
    },
    floatGeneric: {
      ours: () => {
        let s = 0;
        for (let i = 0; i < pts.length; i++) s += g.alignmentStation(g.float, h, pts[i]).chainage;
        return s > 0;
      },
      hand: () => {
        let s = 0;
        for (let i = 0; i < xs.length; i++) s += handStation(els, xs[i], ys[i]).chainage;
        return s > 0;
      },
    },
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) {
        const ha = g.horizontalAlignment(A, {
          points: cases.points.slice(0, 4),
          curves: cases.curves.slice(0, 2),
        });
        n += A.toNumber(g.alignmentStation(A, ha, g.alignmentPoint(A, ha, 100, 3)).offset);
      }
      return n;
    },
  };
}
