// The batch command: a CSV streams through one computation; progress on stderr only when
// stderr is a terminal; with --out nothing is written unless every row is computed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { runBatch } from '../../src/cli/batch';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

let dir: string;
const csv = (name: string, text: string) => {
  const f = join(dir, name);
  writeFileSync(f, text);
  return f;
};

beforeAll(async () => {
  await bundleCli();
  dir = tempFolder();
});
afterAll(cleanUp);

describe('quadspread batch', () => {
  it('inverses: writes the quadrance exactly and the distance that Math.hypot gives, without progress when stderr is not a terminal', () => {
    const rows = Array.from({ length: 200 }, (_, i) => [i * 1.5, 2 * i, 300 - i, i * 0.25]);
    const f = csv(
      'pairs.csv',
      'east1,north1,east2,north2\n' + rows.map((r) => r.join(',')).join('\n') + '\n',
    );
    const r = cli(['batch', 'inverses', f, '--arithmetic', 'rational', '--digits', '12']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toBe('east1,north1,east2,north2,quadrance,distance');
    expect(lines).toHaveLength(201);
    rows.forEach(([e1, n1, e2, n2], i) => {
      const [, , , , Q, d] = lines[i + 1]!.split(',');
      const [num, den] = Q!.split('/').map(Number);
      expect(num! / (den ?? 1)).toBeCloseTo((e2! - e1!) ** 2 + (n2! - n1!) ** 2, 6);
      expect(Number(d)).toBeCloseTo(Math.hypot(e2! - e1!, n2! - n1!), 8);
    });
  });

  it('triangles: spreads equal sin² of the angles from Math.atan2', () => {
    const f = csv('tri.csv', 'name,x1,y1,x2,y2,x3,y3\nA,0,0,4,0,0,3\nB,1,2,7,3,2,9\n');
    const r = cli(['batch', 'triangles', f, '--arithmetic', 'float']);
    expect(r.code).toBe(0);
    const [, a, b] = r.stdout.trim().split('\n');
    expect(a!.split(',').slice(7)).toEqual([
      '25.00000000',
      '9.000000000',
      '16.00000000',
      '1.000000000',
      '0.3600000000',
      '0.6400000000',
      '576.0000000',
    ]);
    const [x1, y1, x2, y2, x3, y3] = [1, 2, 7, 3, 2, 9];
    const angle = Math.atan2(y3 - y1, x3 - x1) - Math.atan2(y2 - y1, x2 - x1);
    expect(Number(b!.split(',')[10])).toBeCloseTo(Math.sin(angle) ** 2, 9);
  });

  it('heights: h = d·tan α, negative below the horizon, from the standard input', () => {
    const r = cli(['batch', 'heights', '-', '--arithmetic', 'decimal'], {
      input: 'horizontal,elevation\n100,45\n120.5,-12.25\n',
    });
    expect(r.code).toBe(0);
    const rows = r.stdout
      .trim()
      .split('\n')
      .slice(1)
      .map((l) => Number(l.split(',')[3]));
    expect(rows[0]).toBeCloseTo(100, 8);
    expect(rows[1]).toBeCloseTo(-120.5 * Math.tan((12.25 * Math.PI) / 180), 7);
  });

  it('exits 2 naming the line and column of a bad value, and writes no --out file', () => {
    const f = csv('bad.csv', 'east1,north1,east2,north2\n0,0,3,4\n1,1,two,5\n');
    const out = join(dir, 'bad-out', 'r.csv');
    mkdirSync(join(dir, 'bad-out'));
    const r = cli(['batch', 'inverses', f, '--out', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('line 3, column "east2": "two" is not a number');
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(join(dir, 'bad-out'))).toEqual([]);
  });

  it('exits 3 naming the line of a row with no solution', () => {
    const f = csv('collinear.csv', 'x1,y1,x2,y2,x3,y3\n0,0,4,0,0,3\n0,0,1,1,2,2\n');
    const r = cli(['batch', 'triangles', f]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/line 3: no solution: COLLINEAR_POINTS/);
  });

  it('exits 2 for a header without the needed columns', () => {
    const r = cli(['batch', 'inverses', csv('hdr.csv', 'x,y\n1,2\n')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('the header has no column "east1"');
  });

  it('writes --out atomically when every row is computed', () => {
    const out = join(dir, 'ok.csv');
    const r = cli([
      'batch',
      'inverses',
      csv('ok-in.csv', 'east1,north1,east2,north2\n0,0,3,4\n'),
      '--out',
      out,
    ]);
    expect(r.code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe(
      'east1,north1,east2,north2,quadrance,distance\n0,0,3,4,25.00000000,5.000000000\n',
    );
    expect(r.stderr).toBe(`1 row written to ${out}\n`);
  });

  it('shows a progress count on stderr when stderr is a terminal', async () => {
    const f = csv('tty.csv', 'east1,north1,east2,north2\n0,0,3,4\n0,0,6,8\n');
    const err: string[] = [];
    const out: string[] = [];
    await runBatch(
      'inverses',
      f,
      { arithmetic: 'float', digits: 6, out: undefined },
      { stdout: (t) => out.push(t), stderr: (t) => err.push(t), stderrIsTTY: true },
    );
    expect(err.join('')).toMatch(/\rquadspread batch inverses: 2 rows done\n$/);
    expect(out.join('')).toContain('0,0,6,8,100.000,10.0000');
  });
});
