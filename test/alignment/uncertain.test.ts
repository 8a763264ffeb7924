// The alignment functions in uncertain(float): the σ of a set-out point from the σ of the IP
// coordinates and of the radius, against first-order propagation (GUM, JCGM 100:2008 §5.1.2,
// eq. (10)) with the partial derivatives taken here by central finite differences in float.
import { describe, expect, it } from 'vitest';
import {
  float,
  uncertain,
  measured,
  budget,
  horizontalAlignment,
  alignmentPoint,
  alignmentStation,
  verticalAlignment,
  profileLevel,
} from '../../src/index.js';

const U = uncertain(float);

function setOut(ipx: number, ipy: number, radius: number, chainage: number, offset: number) {
  const h = horizontalAlignment(float, {
    points: [
      { x: 0, y: 0 },
      { x: ipx, y: ipy },
      { x: 500, y: 700 },
    ],
    curves: [{ radius, transitionIn: 40, transitionOut: 40 }],
  });
  return alignmentPoint(float, h, chainage, offset);
}

describe('alignment with uncertain(float)', () => {
  it('the σ of a set-out point on a transition and on the arc follows from the σ of the IP and the radius', () => {
    const sx = 0.01;
    const sy = 0.015;
    const sr = 0.5;
    const h = horizontalAlignment(U, {
      points: [
        { x: 0, y: 0 },
        { x: measured(U, 20, sx, 'IP east'), y: measured(U, 400, sy, 'IP north') },
        { x: 500, y: 700 },
      ],
      curves: [{ radius: measured(U, 300, sr, 'R'), transitionIn: 40, transitionOut: 40 }],
    });
    for (const c of [300, 380, 420]) {
      const p = alignmentPoint(U, h, c, 3);
      const d = 1e-5;
      for (const axis of ['x', 'y'] as const) {
        const f = (ipx: number, ipy: number, r: number) => setOut(ipx, ipy, r, c, 3)[axis];
        const dx = (f(20 + d, 400, 300) - f(20 - d, 400, 300)) / (2 * d);
        const dy = (f(20, 400 + d, 300) - f(20, 400 - d, 300)) / (2 * d);
        const dr = (f(20, 400, 300 + d) - f(20, 400, 300 - d)) / (2 * d);
        const sigma = Math.hypot(dx * sx, dy * sy, dr * sr);
        expect(Math.abs(budget(U, p[axis]).sigma - sigma)).toBeLessThan(1e-6 + 1e-4 * sigma);
      }
    }
  });

  it('the chainage and offset of a surveyed point carry the σ of its coordinates (on a straight: σ along and across)', () => {
    const h = horizontalAlignment(U, {
      points: [
        { x: 0, y: 0 },
        { x: 0, y: 400 },
        { x: 300, y: 800 },
      ],
      curves: [{ radius: 200 }],
    });
    const s = alignmentStation(U, h, {
      x: measured(U, 2, 0.003, 'E'),
      y: measured(U, 100, 0.004, 'N'),
    });
    expect(budget(U, s.chainage).sigma).toBeCloseTo(0.004, 12);
    expect(budget(U, s.offset).sigma).toBeCloseTo(0.003, 12);
  });

  it('a profile level carries the σ of the VIP levels', () => {
    const v = verticalAlignment(U, {
      points: [
        { chainage: 0, level: measured(U, 10, 0.01, 'L0') },
        { chainage: 100, level: 12 },
        { chainage: 200, level: 11 },
      ],
      curves: [null, { length: 60 }, null],
    });
    // at 50 on the first grade: level = L0 + (12 − L0)·0.5 → ∂/∂L0 = 0.5
    expect(budget(U, profileLevel(U, v, 50).level).sigma).toBeCloseTo(0.005, 14);
  });
});
