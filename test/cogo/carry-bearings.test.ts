// carryBearings: bearings carried through field-book angles, checked against the angle-sum
// conditions (Euclid I.32, corollaries) and against carrying written here in floats.
import { describe, expect, it } from 'vitest';
import { carryBearings, decimal, float, rational, QuadspreadError } from '../../src/index.js';

const R = rational;
const deg = (d: number, m = 0, s = 0) => d + m / 60 + s / 3600;
const code = (f: () => unknown) => {
  try {
    f();
  } catch (e) {
    return (e as QuadspreadError).code;
  }
  return 'no error';
};

describe('carryBearings(A, { angles, kind, startBearing, close })', () => {
  it('finds the misclosure of a five-sided loop of interior angles against 540° and balances it', () => {
    // 101°24'00" + 149°13'00" + 80°58'30" + 116°19'00" + 92°05'00" = 539°59'30": −30", +6" each.
    const angles = [`101°24'00"`, `149°13'00"`, `80°58'30"`, `116°19'00"`, `92°05'00"`];
    const b = carryBearings(R, {
      angles,
      kind: 'interior',
      startBearing: `51°22'00"`,
      close: 'loop',
    });
    expect(R.toString(R.mul(b.misclosure!, R.from(3600)))).toBe('-30');
    expect(R.toString(b.expected!)).toBe('540');
    // Carried by hand in floats: forward = back + 180° + balanced angle (mod 360).
    const bal = [deg(101, 24), deg(149, 13), deg(80, 58, 30), deg(116, 19), deg(92, 5)].map(
      (a) => a + 6 / 3600,
    );
    let z = deg(51, 22);
    const want = [z];
    for (let i = 1; i < 5; i++) {
      z = (z + 180 + bal[i]!) % 360;
      want.push(z);
    }
    b.bearings.forEach((x, i) => expect(R.toNumber(x)).toBeCloseTo(want[i]!, 10));
    // After balancing the loop closes: the last bearing carried through the first angle is the first.
    expect((R.toNumber(b.bearings[4]!) + 180 + bal[0]!) % 360).toBeCloseTo(deg(51, 22), 10);
    expect(
      R.eq(
        b.balanced.reduce((s, a) => R.add(s, a), R.zero),
        R.from(540),
      ),
    ).toBe(true);
  });

  it('takes exterior angles against (n + 2)·180° and deflections against ±360°', () => {
    const ext = carryBearings(R, {
      angles: [270, 270, 270, `270°00'08"`],
      kind: 'exterior',
      startBearing: 0,
      close: 'loop',
    });
    expect(R.toString(R.mul(ext.misclosure!, R.from(3600)))).toBe('8');
    expect(R.toString(ext.expected!)).toBe('1080');
    const defl = carryBearings(R, {
      angles: [90, 90, 90, `89°59'54"`],
      kind: 'deflection',
      startBearing: 0,
      close: 'loop',
    });
    expect(R.toString(R.mul(defl.misclosure!, R.from(3600)))).toBe('-6');
    // 359°59'54": −6", so +1.5" each; the first course keeps the start bearing and the
    // angle at the start closes the loop: 0, 90°00'01.5", 180°00'03", 269°59'58.5".
    const want = [0, 90 + 1.5 / 3600, 180 + 3 / 3600, 270 - 1.5 / 3600];
    defl.bearings.forEach((x, i) => expect(R.toNumber(x)).toBeCloseTo(want[i]!, 12));
  });

  it('closes a link traverse on the known closing bearing', () => {
    // Reference bearing 300°, angles to the right 120°, 200°, 100°: 300+180+120 = 240,
    // 240+180+200 = 260, closing line 260+180+100 = 180 (mod 360); known 179°59'45": +15".
    const b = carryBearings(R, {
      angles: [120, 200, 100],
      kind: 'right',
      startBearing: 300,
      close: 'link',
      closeBearing: `179°59'45"`,
    });
    expect(R.toString(R.mul(b.misclosure!, R.from(3600)))).toBe('15');
    expect(b.bearings.map((x) => R.toNumber(x))).toEqual([240 - 5 / 3600, 260 - 10 / 3600]);
  });

  it('gives the same bearings in float and decimal', () => {
    const input = {
      angles: [`101°24'00"`, `149°13'00"`, `80°58'30"`, `116°19'00"`, `92°05'00"`],
      kind: 'interior' as const,
      startBearing: 51,
      close: 'loop' as const,
    };
    const r = carryBearings(R, input).bearings.map((x) => R.toNumber(x));
    carryBearings(float, input).bearings.forEach((x, i) => expect(x).toBeCloseTo(r[i]!, 9));
    const D = decimal(30);
    carryBearings(D, input).bearings.forEach((x, i) =>
      expect(D.toNumber(x)).toBeCloseTo(r[i]!, 12),
    );
  });

  it('refuses too few angles, an unknown kind or close, and a link without its closing bearing', () => {
    expect(
      code(() =>
        carryBearings(R, { angles: [90, 90], kind: 'interior', startBearing: 0, close: 'loop' }),
      ),
    ).toBe('TOO_FEW_POINTS');
    expect(
      code(() =>
        carryBearings(R, {
          angles: [90, 90, 90],
          kind: 'inside' as never,
          startBearing: 0,
          close: 'loop',
        }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(
      code(() =>
        carryBearings(R, { angles: [90, 90, 90], startBearing: 0, close: 'round' as never }),
      ),
    ).toBe('INVALID_ARGUMENT');
    expect(code(() => carryBearings(R, { angles: [90, 90], startBearing: 0, close: 'link' }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      code(() => carryBearings(R, { angles: ['ninety', 90, 90], startBearing: 0, close: 'loop' })),
    ).toBe('INVALID_ANGLE');
  });
});
