// A plane point may be given as [x, y] (x = east, y = north) wherever a point is read.
import { describe, expect, it } from 'vitest';
import {
  float,
  rational,
  decimal,
  point,
  quadrance,
  spread,
  triangle,
  lineThrough,
  area,
  inverse,
  heightFromTwoStations,
  QuadspreadError,
} from '../../src/index.js';
import * as F from '../../src/entries/float.gen.js';
import * as Rb from '../../src/entries/rational.gen.js';

const R = rational;

describe('geometry primitives take [x, y] arrays of values as points', () => {
  it('quadrance(float, [0, 0], [3, 4]) is 25, as with point()', () => {
    expect(quadrance(float, [0, 0], [3, 4])).toBe(25);
  });

  it('spread, triangle and lineThrough give exactly what they give for point() values (rational)', () => {
    const p = (x: string, y: string) => point(R, x, y);
    const a = (x: string, y: string) => [R.from(x), R.from(y)] as const;
    expect(R.toString(spread(R, a('0', '0'), a('4', '0'), a('4', '3')))).toBe(
      R.toString(spread(R, p('0', '0'), p('4', '0'), p('4', '3'))),
    );
    const t1 = triangle(R, a('0', '0'), a('4', '0'), a('0', '3'));
    const t2 = triangle(R, p('0', '0'), p('4', '0'), p('0', '3'));
    expect([t1.s1, t1.s2, t1.s3].map(R.toString)).toEqual([t2.s1, t2.s2, t2.s3].map(R.toString));
    const l = lineThrough(R, a('1', '2'), a('3', '5'));
    expect([l.a, l.b, l.c].map(R.toString)).toEqual(['-3', '2', '-1']); // 3·1 − 2·2 + 1 = 0
  });

  it('the bound float entry takes arrays too: quadrance([0, 0], [3, 4]) is 25', () => {
    expect(F.quadrance([0, 0], [3, 4])).toBe(25);
  });
});

/** [<hole>, 0]: an array of length 2 whose first entry is missing. */
function holed(): unknown[] {
  const a: unknown[] = [];
  a[1] = 0;
  return a;
}

describe('solvers read { x, y } or [x, y] of numbers or text', () => {
  it('area of [[0, 0], [4, 0], [4, "3/2"]] is 3 (half of 4 × 3/2)', () => {
    expect(
      R.toString(
        area(R, [
          [0, 0],
          [4, 0],
          [4, '3/2'],
        ]),
      ),
    ).toBe('3');
    expect(
      Rb.arithmetic.toString(
        Rb.area([
          [0, 0],
          ['4', 0],
          [4, '3/2'],
        ]),
      ),
    ).toBe('3');
  });

  it('inverse from arrays equals inverse from objects (decimal(30))', () => {
    const D = decimal(30);
    const a = inverse(D, [1000, 2000], ['1300.5', 1600]);
    const b = inverse(D, { x: 1000, y: 2000 }, { x: '1300.5', y: 1600 });
    expect(D.toString(a.quadrance)).toBe(D.toString(b.quadrance));
    expect(D.toString(a.azimuth)).toBe(D.toString(b.azimuth));
  });

  it('heightFromTwoStations reads array stations and foot', () => {
    const r = heightFromTwoStations(R, {
      stations: [
        [0, 0],
        [10, 0],
      ],
      foot: [4, 3],
      vertical: ['1/2', '25/70'],
    });
    expect(R.toString(r.H)).toBe('25');
  });

  it('refuses an array of another length or with a hole, naming the input', () => {
    expect(() => area(R, [[0, 0], [1, 0, 5] as never, [0, 1]])).toThrow(QuadspreadError);
    expect(() =>
      area(
        R,
        [
          [0, 0],
          [1, 0],
          [0, 1],
        ].map((p, i) => (i === 1 ? holed() : p)) as never,
      ),
    ).toThrow(/\[x, y\]/);
  });
});
