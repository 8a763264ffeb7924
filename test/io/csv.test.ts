// CSV point files: the header's column names in any order, delimiters, RFC 4180 quoting
// (RFC 4180 §2: fields with delimiters, quotes and line breaks in double quotes, quotes
// doubled), a byte order mark, CRLF; typed errors naming the column or the line; the two
// writer modes; the streaming reader against the whole-file reader.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mkdtempSync, rmSync, writeFileSync, createReadStream } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QuadspreadError, float, rational } from '../../src/index.js';
import { pointsFromCsv, pointsToCsv, streamPointsFromCsv } from '../../src/io/index.js';

const R = rational;
const errorOf = (f: () => unknown): QuadspreadError | string => {
  try {
    f();
  } catch (e) {
    return e instanceof QuadspreadError ? e : `${(e as Error).name}: ${(e as Error).message}`;
  }
  return 'no error';
};
const codeOf = (f: () => unknown) => {
  const e = errorOf(f);
  return typeof e === 'string' ? e : e.code;
};
const show = (pts: { name: string; x: unknown; y: unknown; height?: unknown; code?: string }[]) =>
  pts.map((p) => [
    p.name,
    R.toString(p.x as never),
    R.toString(p.y as never),
    p.height === undefined ? undefined : R.toString(p.height as never),
    p.code,
  ]);
async function collect<T>(it: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const x of it) out.push(x);
  return out;
}

describe('pointsFromCsv', () => {
  it('reads the columns by their header names, in any order, values exactly', () => {
    const text = 'north,code,name,height,east\n5310.25,CP,T2,12.5,3420.1\n4950,,T3,,3800\n';
    expect(show(pointsFromCsv(R, text))).toEqual([
      ['T2', '34201/10', '21241/4', '25/2', 'CP'],
      ['T3', '3800', '4950', undefined, undefined],
    ]);
  });

  it('takes semicolons, tabs and bars as delimiters (found from the header), CRLF and a BOM', () => {
    const want = [['A', '1', '2', undefined, undefined]];
    expect(show(pointsFromCsv(R, '\uFEFFname;east;north\r\nA;1;2\r\n'))).toEqual(want);
    expect(show(pointsFromCsv(R, 'name\teast\tnorth\nA\t1\t2\n'))).toEqual(want);
    expect(show(pointsFromCsv(R, 'name|east|north\nA|1|2'))).toEqual(want);
    // bytes, UTF-8 with a BOM
    expect(
      show(pointsFromCsv(R, new TextEncoder().encode('\uFEFFname,east,north\r\nA,1,2\r\n'))),
    ).toEqual(want);
    // a delimiter inside a quoted header name does not count
    expect(
      show(pointsFromCsv(R, '"na;me",east,north\nA,1,2', { columns: { name: 'na;me' } })),
    ).toEqual(want);
  });

  it('keeps quoted fields whole: delimiters, doubled quotes and line breaks inside', () => {
    const text = 'name,east,north,code\n"Pier 3, ""north""\r\nface",1,2,"a\nb"\n';
    expect(pointsFromCsv(R, text).map((p) => [p.name, p.code])).toEqual([
      ['Pier 3, "north"\r\nface', 'a\nb'],
    ]);
  });

  it('reads configured column names without regard to case or spaces, and decimal commas', () => {
    const text = 'Punkt; Rechtswert ;HOCHWERT;Höhe\nP1;"3420,125";5310,5;12,25\n';
    const p = pointsFromCsv(R, text, {
      columns: { name: 'punkt', east: 'rechtswert', north: 'Hochwert', height: 'höhe' },
      decimalComma: true,
    });
    expect(show(p)).toEqual([['P1', '27361/8', '10621/2', '49/4', undefined]]);
  });

  it('refuses a missing column with MISSING_COLUMN naming it', () => {
    const e = errorOf(() => pointsFromCsv(R, 'name,east,height\nA,1,2\n'));
    expect(typeof e !== 'string' && e.code).toBe('MISSING_COLUMN');
    expect(String((e as Error).message)).toMatch(/"north"/);
    const f = errorOf(() =>
      pointsFromCsv(R, 'id,x,y\nA,1,2\n', {
        columns: { name: 'id', east: 'x', north: 'northing' },
      }),
    );
    expect((f as QuadspreadError).code).toBe('MISSING_COLUMN');
    expect((f as Error).message).toMatch(/"northing"/);
  });

  it('refuses broken records with INVALID_FILE naming the line', () => {
    const cases: [string, RegExp][] = [
      ['name,east,north\nA,1,2\nB,1\n', /line 3/],
      ['name,east,north\nA,1,2\n"B,1,2\n', /line/],
      ['name,east,north\nA,1,x\n', /line 2.*north/],
      ['name,east,north\nA,,2\n', /line 2/],
      ['name,east,north\n,1,2\n', /line 2/],
      ['name,east,north\nA,1,2\nA,3,4\n', /line 3.*repeated/],
      ['name,east,north,name\nA,1,2,B\n', /twice/],
      ['', /empty/],
    ];
    for (const [text, message] of cases) {
      const e = errorOf(() => pointsFromCsv(R, text));
      expect(typeof e === 'string' ? e : e.code, text).toBe('INVALID_FILE');
      expect((e as Error).message, text).toMatch(message);
    }
  });

  it('refuses bad options and input', () => {
    expect(codeOf(() => pointsFromCsv(R, 'a', { delimiter: '"' }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pointsFromCsv(R, 'a', { delimiter: ';;' }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pointsFromCsv(R, 'a', { columns: { east: '' } }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pointsFromCsv(R, 42 as never))).toBe('INVALID_ARGUMENT');
  });
});

describe('pointsToCsv', () => {
  const pts = [
    { name: '=SUM(A1:A9)', x: '3420.1', y: '-12.5', height: '0.001', code: '+CP' },
    { name: 'Pier 3, "north"\nface', x: '1/8', y: 7 },
  ];

  it('exchange mode: names kept exactly, read back the same (quoting as RFC 4180)', () => {
    const text = pointsToCsv(R, pts, { mode: 'exchange' });
    expect(text).toBe(
      'name,east,north,height,code\n=SUM(A1:A9),3420.1,-12.5,0.001,+CP\n"Pier 3, ""north""\nface",0.125,7,,\n',
    );
    expect(show(pointsFromCsv(R, text))).toEqual([
      ['=SUM(A1:A9)', '34201/10', '-25/2', '1/1000', '+CP'],
      ['Pier 3, "north"\nface', '1/8', '7', undefined, undefined],
    ]);
  });

  it('spreadsheet mode: formula-like text neutralised with a leading quote, numbers kept', () => {
    const text = pointsToCsv(R, pts, { mode: 'spreadsheet', delimiter: ';', eol: '\r\n' });
    expect(text).toBe(
      'name;east;north;height;code\r\n"\'=SUM(A1:A9)";3420.1;-12.5;0.001;"\'+CP"\r\n"Pier 3, ""north""\nface";0.125;7;;\r\n',
    );
  });

  it('rounds exactly to decimals when asked, and writes float values shortest', () => {
    expect(
      pointsToCsv(R, [{ name: 'P', x: '2/3', y: '-0.00005' }], { mode: 'exchange', decimals: 4 }),
    ).toBe('name,east,north\nP,0.6667,-0.0001\n');
    expect(pointsToCsv(float, [{ name: 'P', x: 0.1, y: 1e21 }], { mode: 'exchange' })).toBe(
      'name,east,north\nP,0.1,1e+21\n',
    );
  });

  it('refuses a missing mode and bad points', () => {
    expect(codeOf(() => pointsToCsv(R, pts, {} as never))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pointsToCsv(R, pts, { mode: 'excel' as never }))).toBe('INVALID_ARGUMENT');
    expect(codeOf(() => pointsToCsv(R, [{ x: 1, y: 2 }] as never, { mode: 'exchange' }))).toBe(
      'INVALID_ARGUMENT',
    );
    expect(
      codeOf(() => pointsToCsv(R, [{ name: 'P', x: 'east', y: 2 }], { mode: 'exchange' })),
    ).toBe('INVALID_NUMBER');
    expect(codeOf(() => pointsToCsv(R, pts, { mode: 'exchange', decimals: 1.5 }))).toBe(
      'INVALID_ARGUMENT',
    );
  });

  it('round trips any names and decimal coordinates exactly (exchange mode, any delimiter)', () => {
    const decimalText = fc
      .tuple(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 0, max: 6 }))
      .map(([n, d]) =>
        d === 0
          ? String(n)
          : `${n < 0 ? '-' : ''}${String(Math.abs(n))
              .padStart(d + 1, '0')
              .replace(new RegExp(`(\\d{${d}})$`), '.$1')}`,
      );
    fc.assert(
      fc.property(
        fc.uniqueArray(
          fc.record({
            name: fc.string({
              minLength: 1,
              unit: fc.constantFrom(
                'a',
                'Z',
                '1',
                ' ',
                ',',
                ';',
                '"',
                '\n',
                '\r',
                '=',
                '-',
                '\t',
                'é',
                '|',
              ),
            }),
            x: decimalText,
            y: decimalText,
          }),
          { minLength: 1, maxLength: 8, selector: (p) => p.name },
        ),
        fc.constantFrom(',', ';', '\t', '|'),
        (points, delimiter) => {
          const text = pointsToCsv(R, points, { mode: 'exchange', delimiter });
          const back = pointsFromCsv(R, text, { delimiter });
          expect(back.map((p) => p.name)).toEqual(points.map((p) => p.name));
          back.forEach((p, i) => {
            expect(R.eq(p.x, R.from(points[i]!.x))).toBe(true);
            expect(R.eq(p.y, R.from(points[i]!.y))).toBe(true);
          });
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('streamPointsFromCsv', () => {
  const text = '\uFEFFcode;name;east;north\r\nCP;"A;1\r\nx";1.5;2\r\n;B;3;4\r\n;é€;5;6\r\n';

  it('gives the same points as the whole-file reader, however the text is cut into chunks', async () => {
    const whole = pointsFromCsv(R, text);
    const bytes = new TextEncoder().encode(text);
    await fc.assert(
      fc.asyncProperty(
        fc.uniqueArray(fc.integer({ min: 1, max: bytes.length - 1 }), { maxLength: 6 }),
        async (cuts) => {
          const at = [0, ...cuts.sort((a, b) => a - b), bytes.length];
          const chunks = at.slice(1).map((end, i) => bytes.slice(at[i], end)); // UTF-8 cut anywhere, even inside a character
          expect(show(await collect(streamPointsFromCsv(R, chunks)))).toEqual(show(whole));
        },
      ),
      { numRuns: 60 },
    );
  });

  it('reads a Node file stream, and stops reading when the loop stops', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'qs-csv-'));
    try {
      const file = join(dir, 'points.csv');
      writeFileSync(
        file,
        'name,east,north\n' +
          Array.from({ length: 5000 }, (_, i) => `P${i},${i},${2 * i}`).join('\n'),
      );
      const all = await collect(
        streamPointsFromCsv(float, createReadStream(file, { highWaterMark: 1024 })),
      );
      expect(all).toHaveLength(5000);
      expect(all[4999]).toEqual({ name: 'P4999', x: 4999, y: 9998 });
      const stream = createReadStream(file, { highWaterMark: 1024 });
      let n = 0;
      for await (const p of streamPointsFromCsv(float, stream)) {
        if (++n === 3) {
          expect(p.name).toBe('P2');
          break;
        }
      }
      await new Promise((r) => setTimeout(r, 20));
      expect(stream.destroyed).toBe(true);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses as the whole-file reader does, when the loop reaches the fault', async () => {
    const codeOfAsync = async (f: () => Promise<unknown>) => {
      try {
        await f();
      } catch (e) {
        return e instanceof QuadspreadError ? e.code : String(e);
      }
      return 'no error';
    };
    expect(await codeOfAsync(() => collect(streamPointsFromCsv(R, ['name,east\nA,1\n'])))).toBe(
      'MISSING_COLUMN',
    );
    expect(
      await codeOfAsync(() => collect(streamPointsFromCsv(R, ['name,east,north\nA,1,2\nB,1\n']))),
    ).toBe('INVALID_FILE');
    expect(
      await codeOfAsync(() => collect(streamPointsFromCsv(R, ['name,east,north\n"A,1,2\n']))),
    ).toBe('INVALID_FILE');
    expect(await codeOfAsync(() => collect(streamPointsFromCsv(R, [])))).toBe('INVALID_FILE');
    expect(
      await codeOfAsync(() => collect(streamPointsFromCsv(R, 'name,east,north' as never))),
    ).toBe('INVALID_ARGUMENT');
    expect(await codeOfAsync(() => collect(streamPointsFromCsv(R, [42 as never])))).toBe(
      'INVALID_ARGUMENT',
    );
  });
});

// Found by the long adversarial run of 2026-12-03.
describe('the long adversarial run of 2026-12-03', () => {
  it('pointsFromCsv of text with a stray quote is INVALID_FILE, not csv-parse’s own error', () => {
    expect(() => pointsFromCsv(rational, '$J85"<?;9')).toThrow(QuadspreadError);
    expect(() => pointsFromCsv(rational, '$J85"<?;9')).toThrow(/INVALID_FILE.*line 1/);
  });

  it('pointsToCsv of a sparse array names the hole, not a TypeError', () => {
    // eslint-disable-next-line no-sparse-arrays
    const pts = [, { name: 'a', x: 1, y: 2 }] as never;
    expect(() => pointsToCsv(rational, pts, { mode: 'exchange' })).toThrow(/points\[0\]/);
    expect(() => pointsToCsv(rational, pts, { mode: 'exchange' })).toThrow(QuadspreadError);
  });

  it('pointsToCsv of a code that is not text is INVALID_ARGUMENT naming it', () => {
    const pts = [{ name: 'a', x: 1, y: 2, code: Object.create(null) }] as never;
    expect(() => pointsToCsv(rational, pts, { mode: 'exchange' })).toThrow(/points\[0\]\.code/);
  });
});
