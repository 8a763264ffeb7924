// Alignment against published worked examples (each source named beside its check):
// - Mahun, *Curves* (open text, jerrymahun.com), "Self Study: Horizontal Curves Set 2",
//   Problem 1: Δ = 45°49′45″ right, R = 800.00 ft (D = 7°09′43.1″, arc definition),
//   PI 54+23.15 → T = 338.17, LC = 622.97, L = 639.90, BC 50+84.98, EC 57+24.88 (= rounded BC +
//   rounded L), and the deflection table from the BC at 100-ft stations.
// - Montana DOT, *Road Design Manual*, Appendix K, Example 3-1 (spiral curve): Δ = 15°00′00″,
//   PI 243+18.72, Rc = 3000 ft, Ls = 210 ft → θs = 2°00′19″, p = 0.612, k = 104.996,
//   Ts = 500.03, Es = 26.50, Lc = 575.40; TS 238+18.69, SC 240+28.69, CS 246+04.09, ST 248+14.09
//   (the source stations from the rounded Ts and Lc).
// - Mahun, *Curves*, "Solution: Self Study Vertical Curves 1", Problem 2: PVI 56+50.00 at
//   1325.00 ft, g1 = +5.0 %, g2 = −3.5 %, L = 500.00 ft → levels at the stations and grades.
import { describe, expect, it } from 'vitest';
import {
  rational,
  float,
  decimal,
  horizontalAlignment,
  verticalAlignment,
  profileLevel,
  formatStation,
  deflectionTable,
  angleToDegrees,
  type Arithmetic,
} from '../../src/index.js';

const D2R = Math.PI / 180;
const ARITHMETICS = [
  ['float', float],
  ['decimal(30)', decimal(30)],
  ['rational', rational],
] as [string, Arithmetic<unknown>][];

/** Start, IP, end of a curve of deflection Δ (degrees, + right) at an IP, first bearing b0. */
function legs(delta: number, b0: number, ip: { x: number; y: number }, leg: number) {
  const b1 = b0 + delta;
  return [
    { x: String(ip.x - leg * Math.sin(b0 * D2R)), y: String(ip.y - leg * Math.cos(b0 * D2R)) },
    { x: String(ip.x), y: String(ip.y) },
    { x: String(ip.x + leg * Math.sin(b1 * D2R)), y: String(ip.y + leg * Math.cos(b1 * D2R)) },
  ];
}

const mahunDelta = 45 + 49 / 60 + 45 / 3600;
const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;

describe('horizontal curve: Mahun, Curves, Horizontal Curves Set 2, Problem 1', () => {
  for (const [name, A] of ARITHMETICS) {
    const n = (x: unknown) => A.toNumber(x);
    for (const curve of [{ radius: 800 }, { degree: `7°09'43.1"`, definition: 'arc' as const }]) {
      it(`${name}, ${'radius' in curve ? 'R = 800.00' : 'D = 7°09′43.1″ (arc)'}: T, LC, L, BC and EC to 0.01 ft`, () => {
        const h = horizontalAlignment(A, {
          points: legs(mahunDelta, 30, { x: 10000, y: 20000 }, 1000),
          curves: [curve],
          startChainage: 5423.15 - 1000,
        });
        const c = h.curves[0]!;
        const tol = 'radius' in curve ? 0.005 : 0.01; // D rounded to 0.1″ moves R by about 0.0005 ft
        expect(n(c.deflection)).toBeCloseTo(mahunDelta, 12);
        expect(Math.abs(n(c.tangentIn) - 338.17)).toBeLessThan(tol);
        expect(Math.abs(n(c.longChord) - 622.97)).toBeLessThan(tol);
        expect(Math.abs(n(c.arcLength) - 639.9)).toBeLessThan(tol);
        expect(formatStation(A, c.ts.chainage as never)).toBe('50+84.98');
        // The source's EC = its rounded BC + its rounded L.
        const ec =
          Math.round(n(c.ts.chainage) * 100) / 100 + Math.round(n(c.arcLength) * 100) / 100;
        expect(formatStation(float, ec)).toBe('57+24.88');
      });
    }
    it(`${name}: the deflection table from the BC at 100-ft stations, to 1″ and 0.01 ft`, () => {
      const h = horizontalAlignment(A, {
        points: legs(mahunDelta, 30, { x: 10000, y: 20000 }, 1000),
        curves: [{ radius: 800 }],
        startChainage: 5423.15 - 1000,
      });
      const rows = deflectionTable(A, h, 0, { interval: 100 });
      const published: [string, number, number, number][] = [
        ['51+00', 15.02, dms(0, 32, 17), 15.02],
        ['52+00', 115.02, dms(4, 7, 8), 114.92],
        ['53+00', 215.02, dms(7, 42, 0), 214.38],
        ['54+00', 315.02, dms(11, 16, 51), 312.99],
        ['55+00', 415.02, dms(14, 51, 43), 410.38],
        ['56+00', 515.02, dms(18, 26, 34), 506.18],
        ['EC', 639.9, dms(22, 54, 52.5), 622.97],
      ];
      // Stations 51+00 … 57+00 and the EC (57+00 is not among the printed rows: checked below).
      expect(rows.map((r) => formatStation(A, r.chainage as never))).toEqual([
        '51+00.00',
        '52+00.00',
        '53+00.00',
        '54+00.00',
        '55+00.00',
        '56+00.00',
        '57+00.00',
        '57+24.87',
      ]);
      published.forEach(([station, arc, defl, chord]) => {
        const r =
          station === 'EC'
            ? rows[rows.length - 1]!
            : rows.find((q) => formatStation(A, q.chainage as never) === `${station}.00`)!;
        expect(r.from).toBe('SC');
        expect(Math.abs(n(r.arc) - arc)).toBeLessThan(0.006);
        expect(Math.abs(n(r.deflection) - defl) * 3600).toBeLessThanOrEqual(1);
        expect(Math.abs(n(r.chord) - chord)).toBeLessThanOrEqual(0.01);
      });
      // 57+00, by classical trig: deflection = arc/(2R), chord = 2R sin(deflection)
      const r57 = rows[6]!;
      expect(n(r57.deflection)).toBeCloseTo(n(r57.arc) / 1600 / D2R, 9);
      expect(n(r57.chord)).toBeCloseTo(1600 * Math.sin(n(r57.arc) / 1600), 9);
      // sub-chords: the first is the chord of 15.02 ft; then 100-ft chords; then the last 124.88 ft
      expect(n(rows[0]!.subChord)).toBeCloseTo(2 * 800 * Math.sin(n(rows[0]!.arc) / 1600), 9);
      expect(n(rows[1]!.subChord)).toBeCloseTo(2 * 800 * Math.sin(100 / 1600), 9);
    });
  }
});

describe('spiral curve: Montana DOT Road Design Manual, Appendix K, Example 3-1', () => {
  for (const [name, A] of ARITHMETICS) {
    const n = (x: unknown) => A.toNumber(x);
    it(`${name}: θs, p, k, Ts, Es, Lc and the TS, SC, CS, ST stations`, () => {
      const h = horizontalAlignment(A, {
        points: legs(15, 60, { x: 5000, y: 5000 }, 2000),
        curves: [{ radius: 3000, transitionIn: 210, transitionOut: 210 }],
        startChainage: 24318.72 - 2000,
      });
      const c = h.curves[0]!;
      const t = c.transitionIn!;
      expect(Math.abs(n(t.theta) - dms(2, 0, 19)) * 3600).toBeLessThan(0.5);
      expect(n(t.p)).toBeCloseTo(0.612, 3);
      expect(n(t.k)).toBeCloseTo(104.996, 3);
      expect(Math.abs(n(c.tangentIn) - 500.03)).toBeLessThan(0.005);
      expect(Math.abs(n(c.tangentOut) - 500.03)).toBeLessThan(0.005);
      expect(Math.abs(n(c.external) - 26.5)).toBeLessThan(0.005);
      expect(Math.abs(n(c.arcLength) - 575.4)).toBeLessThan(0.005);
      expect(formatStation(A, c.ts.chainage as never)).toBe('238+18.69');
      expect(formatStation(A, c.sc.chainage as never)).toBe('240+28.69');
      // The source stations the CS and ST from its rounded Ts and Lc.
      const ts = 24318.72 - Math.round(n(c.tangentIn) * 100) / 100;
      expect(formatStation(float, ts + 210 + Math.round(n(c.arcLength) * 100) / 100)).toBe(
        '246+04.09',
      );
      expect(formatStation(float, ts + 420 + Math.round(n(c.arcLength) * 100) / 100)).toBe(
        '248+14.09',
      );
      expect(n(c.deflection)).toBeCloseTo(15, 12);
    });
  }
});

describe('vertical curve: Mahun, Curves, Solution: Self Study Vertical Curves 1, Problem 2', () => {
  const R = rational;
  // The grade line through the PVI at ±5 % and −3.5 %, its ends at 52+00 and 61+00.
  const profile = <T>(A: Arithmetic<T>) =>
    verticalAlignment(A, {
      points: [
        { chainage: '52+00', level: 1325 - 0.05 * 450 },
        { chainage: '56+50.00', level: 1325 },
        { chainage: '61+00', level: '1309.25' },
      ],
      curves: [null, { length: 500 }, null],
    });
  it('levels and grades at the stations are exactly the printed ones in rational', () => {
    const v = profile(R);
    const c = v.curves[1]!;
    const is = (x: unknown, text: string) =>
      expect(R.eq(x as never, R.from(text)), `${R.toString(x as never)} = ${text}`).toBe(true);
    is(c.bvc.chainage, '5400');
    is(c.bvc.level, '1312.5');
    is(c.evc.chainage, '5900');
    is(c.evc.level, '1316.25');
    const printed: [string, string, string][] = [
      ['54+00', '1312.5', '0.05'],
      ['55+00', '1316.65', '0.033'],
      ['56+00', '1319.1', '0.016'],
      ['57+00', '1319.85', '-0.001'],
      ['58+00', '1318.9', '-0.018'],
      ['59+00', '1316.25', '-0.035'],
    ];
    for (const [st, level, grade] of printed) {
      const p = profileLevel(R, v, st);
      is(p.level, level);
      is(p.grade, grade);
    }
  });
  it.each(ARITHMETICS)('the high point is at 56+94.12, 1319.853 (derived) in %s', (_n, A) => {
    const c = profile(A).curves[1]!;
    expect(formatStation(A, c.turningPoint!.chainage as never)).toBe('56+94.12');
    expect(A.toNumber(c.turningPoint!.level)).toBeCloseTo(1319.853, 3);
    expect(c.kind).toBe('crest');
    expect(A.toNumber(c.k)).toBeCloseTo(500 / 8.5, 10);
  });
  it('reads the D of the published curve as 7°09′43.1″ = R 800.00 ft (arc definition, 18000/(πD))', () => {
    const D = float.toNumber(angleToDegrees(float, `7°09'43.1"`));
    expect(18000 / (Math.PI * D)).toBeCloseTo(800, 2);
  });
});
