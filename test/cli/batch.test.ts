// The batch command: a CSV streams through one computation; progress on stderr only when
// stderr is a terminal; with --out nothing is written unless every row is computed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
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
  it('inverses: quadrance, the distance Math.hypot gives and the bearing from Math.atan2; exact columns only with --exact', () => {
    const rows = Array.from({ length: 200 }, (_, i) => [i * 1.5, 2 * i, 300 - i, i * 0.25]);
    const f = csv(
      'pairs.csv',
      'east1,north1,east2,north2\n' + rows.map((r) => r.join(',')).join('\n') + '\n',
    );
    const r = cli([
      'batch',
      'inverses',
      f,
      '--arithmetic',
      'rational',
      '--digits',
      '12',
      '--exact',
    ]);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toBe('east1,north1,east2,north2,quadrance,distance,bearing,quadrance_exact');
    expect(lines).toHaveLength(201);
    rows.forEach(([e1, n1, e2, n2], i) => {
      const [, , , , Q, d, b, exact] = lines[i + 1]!.split(',');
      const [num, den] = exact!.split('/').map(Number);
      const dx = e2! - e1!;
      const dy = n2! - n1!;
      expect(num! / (den ?? 1)).toBeCloseTo(dx ** 2 + dy ** 2, 6);
      expect(Q).not.toContain('/');
      expect(Number(Q)).toBeCloseTo(dx ** 2 + dy ** 2, 6);
      expect(Number(d)).toBeCloseTo(Math.hypot(dx, dy), 8);
      // Bearing clockwise from north: atan2(east, north), in [0°, 360°).
      const az = ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360;
      expect(Number(b)).toBeCloseTo(az, 8);
    });
  });

  it('-a rational writes decimals only unless --exact is given; --exact needs rational', () => {
    const input = 'x1,y1,x2,y2,x3,y3\n0,0,1,0,5,1\n';
    const plain = cli(['batch', 'triangles', '-', '-a', 'rational'], { input });
    expect(plain.code).toBe(0);
    expect(plain.stdout).not.toContain('/');
    expect(plain.stdout.split('\n')[0]).not.toContain('_exact');
    const exact = cli(['batch', 'triangles', '-', '-a', 'rational', '--exact'], { input });
    const [head, row] = exact.stdout.trim().split('\n');
    const names = head!.split(',');
    const at = (n: string) => row!.split(',')[names.indexOf(n)];
    // s1 at (0,0) between (1,0) and (5,1): cross² / (Q·Q) = 1/26; area 1/2 (by hand).
    expect([at('s1_exact'), at('area_exact')]).toEqual(['1/26', '1/2']);
    expect(at('s1')).toBe('0.03846153846');
    const refused = cli(['batch', 'triangles', '-', '--exact'], { input });
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain(
      '--exact: exact columns are written in rational arithmetic only',
    );
  });

  it('inverses: coincident points have no bearing (empty field); --angles dms writes DMS', () => {
    const r = cli(['batch', 'inverses', '-', '--angles', 'dms', '--seconds', '2'], {
      input: 'east1,north1,east2,north2\n5,5,5,5\n0,0,3,4\n',
    });
    expect(r.code).toBe(0);
    const [, same, pyth] = r.stdout.trim().split('\n');
    expect(same).toBe('5,5,5,5,0.000000000,0.000000000,');
    // atan(3/4) = 36.869897645844…° = 36°52'11.63" (Math.atan2, by hand)
    expect(((Math.atan2(3, 4) * 180) / Math.PI).toFixed(9)).toBe('36.869897646');
    expect(pyth).toBe(`0,0,3,4,25.00000000,5.000000000,"36°52'11.63"""`);
  });

  it('triangles: spreads equal sin² of the angles from Math.atan2; sides, angles and area', () => {
    const f = csv(
      'tri.csv',
      'name,x1,y1,x2,y2,x3,y3\nA,0,0,4,0,0,3\nB,1,2,7,3,2,9\nC,0,0,1,0,5,1\n',
    );
    const r = cli(['batch', 'triangles', f, '--arithmetic', 'float']);
    expect(r.code).toBe(0);
    const [head, a, b, c] = r.stdout.trim().split('\n');
    expect(head).toBe(
      'name,x1,y1,x2,y2,x3,y3,Q1,Q2,Q3,s1,s2,s3,quadrea,side1,side2,side3,angle1,angle2,angle3,area',
    );
    expect(a!.split(',').slice(7)).toEqual([
      '25.00000000',
      '9.000000000',
      '16.00000000',
      '1.000000000',
      '0.3600000000',
      '0.6400000000',
      '576.0000000',
      '5.000000000',
      '3.000000000',
      '4.000000000',
      '90.00000000',
      '36.86989765',
      '53.13010235',
      '6.000000000',
    ]);
    const [x1, y1, x2, y2, x3, y3] = [1, 2, 7, 3, 2, 9];
    const angle = Math.atan2(y3 - y1, x3 - x1) - Math.atan2(y2 - y1, x2 - x1);
    expect(Number(b!.split(',')[10])).toBeCloseTo(Math.sin(angle) ** 2, 9);
    expect(Number(b!.split(',')[17])).toBeCloseTo((angle * 180) / Math.PI, 8);
    // The obtuse angle at (1, 0) between (0, 0) and (5, 1): acos(−4/√17) (by hand, Math.acos).
    const obtuse = (Math.acos(-4 / Math.sqrt(17)) * 180) / Math.PI;
    expect(Number(c!.split(',')[18])).toBeCloseTo(obtuse, 6);
    expect(Number(c!.split(',')[14])).toBeCloseTo(Math.hypot(4, 1), 9);
    expect(c!.split(',')[20]).toBe('0.5000000000');
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

  it('heights: zenith angles in DMS, and σ of the height from horizontal_sigma and zenith_sigma', () => {
    const r = cli(['batch', 'heights', '-', '-d', '8'], {
      input:
        'horizontal,zenith,horizontal_sigma,zenith_sigma\n' +
        '100,"45°00\'00""",0.005,5\n' +
        '120.5,102 15 00,0.002,"0°00\'03"""\n',
    });
    expect(r.code).toBe(0);
    const rows = r.stdout.trim().split('\n');
    expect(rows[0]).toBe('horizontal,zenith,horizontal_sigma,zenith_sigma,H,height,height_sigma');
    // h = d·cot z; σh² = (cot z·σd)² + (d/sin²z·σz)², σz in radians (first order, by hand).
    const check = (line: string, d: number, zDeg: number, sd: number, szArcsec: number) => {
      const f = line.split(',');
      const z = (zDeg * Math.PI) / 180;
      const sz = (szArcsec / 3600) * (Math.PI / 180);
      const h = d / Math.tan(z);
      const sh = Math.hypot(sd / Math.tan(z), (d / Math.sin(z) ** 2) * sz);
      expect(Number(f.at(-2))).toBeCloseTo(h, 6);
      expect(Number(f.at(-1)) / sh).toBeCloseTo(1, 6);
    };
    check(rows[1]!, 100, 45, 0.005, 5);
    check(rows[2]!, 120.5, 102.25, 0.002, 3);
  });

  it('heights: an angle out of range, or both elevation and zenith, is exit 2', () => {
    const out = cli(['batch', 'heights', '-'], { input: 'horizontal,zenith\n10,190\n' });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(
      'line 2, column "zenith": "190" is not a valid zenith angle: it must be in [0°, 180°]',
    );
    const both = cli(['batch', 'heights', '-'], {
      input: 'horizontal,zenith,elevation\n10,90,0\n',
    });
    expect(both.code).toBe(2);
    expect(both.stderr).toContain('both "elevation" and "zenith"');
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

  it('--bad-rows note writes an error column and goes on; exit 0 with a count on stderr', () => {
    const r = cli(['batch', 'inverses', '-', '--bad-rows', 'note'], {
      input: 'east1,north1,east2,north2\n0,0,3,4\n1,1,two,5\n"0,0,1\n0,0,6,8\n',
    });
    expect(r.code).toBe(0);
    expect(r.stdout.trim().split('\n')).toEqual([
      'east1,north1,east2,north2,quadrance,distance,bearing,error',
      '0,0,3,4,25.00000000,5.000000000,36.86989765,',
      '1,1,two,5,,,,"column ""east2"": ""two"" is not a number"',
      '"""0,0,1",,,,,,,a quoted field is not closed',
      '0,0,6,8,100.0000000,10.00000000,36.86989765,',
    ]);
    expect(r.stderr).toBe('2 rows not computed: see the error column\n');
  });

  it('--bad-rows note: a row with no solution is noted too', () => {
    const r = cli(['batch', 'triangles', '-', '--bad-rows', 'note', '-d', '3'], {
      input: 'x1,y1,x2,y2,x3,y3\n0,0,1,1,2,2\n0,0,4,0,0,3\n',
    });
    expect(r.code).toBe(0);
    const [, bad, good] = r.stdout.trim().split('\n');
    expect(bad).toMatch(/^0,0,1,1,2,2,{15}"no solution: COLLINEAR_POINTS/);
    expect(good!.endsWith(',6.00,')).toBe(true);
  });

  it('exits 3 naming the line of a row with no solution', () => {
    const f = csv('collinear.csv', 'x1,y1,x2,y2,x3,y3\n0,0,4,0,0,3\n0,0,1,1,2,2\n');
    const r = cli(['batch', 'triangles', f]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/line 3: no solution: COLLINEAR_POINTS/);
  });

  it('with worker threads, writes the same bytes as on one thread, and names the right line of a late bad row', () => {
    // About 5 MB: the first MiB on this thread, then blocks of a MiB computed by the workers.
    let text = 'id,east1,north1,east2,north2\n';
    for (let i = 0; i < 100000; i++)
      text += `P${i},${(i * 7.31) % 1000},${(i * 3.17) % 997},${(i * 1.11) % 1009},${i % 10}\n`;
    const f = csv('many.csv', text);
    const one = cli(['batch', 'inverses', f, '--workers', '1']);
    const two = cli(['batch', 'inverses', f, '--workers', '2']);
    expect(one.code).toBe(0);
    expect(two.code).toBe(0);
    expect(two.stdout.length).toBeGreaterThan(4 << 20);
    expect(two.stdout).toBe(one.stdout);
    const out = join(dir, 'many-out.csv');
    expect(cli(['batch', 'inverses', f, '--workers', '3', '--out', out]).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe(one.stdout);
    const lines = text.split('\n');
    for (const at of [39000, 50000, 99000]) {
      const bad = [...lines];
      bad[at] = 'P,1,2,x,4';
      const g = csv(`late-bad-${at}.csv`, bad.join('\n'));
      const r = cli(['batch', 'inverses', g, '--workers', '2']);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(`line ${at + 1}, column "east2": "x" is not a number`);
      expect(r.stdout.trim().split('\n')).toHaveLength(at);
      expect(r.stdout).toBe(one.stdout.split('\n').slice(0, at).join('\n') + '\n');
      // --out: no file at all, and nothing left in its folder.
      const folder = join(dir, `late-bad-out-${at}`);
      mkdirSync(folder);
      const o = cli(['batch', 'inverses', g, '--workers', '2', '--out', join(folder, 'r.csv')]);
      expect(o.code).toBe(2);
      expect(readdirSync(folder)).toEqual([]);
      // --bad-rows note: the batch goes on; the row is noted at its place.
      const noted = cli(['batch', 'inverses', g, '--workers', '2', '--bad-rows', 'note']);
      expect(noted.code).toBe(0);
      expect(noted.stderr).toBe('1 row not computed: see the error column\n');
      const rows = noted.stdout.split('\n');
      expect(rows).toHaveLength(100002);
      expect(rows[at]).toBe('P,1,2,x,4,,,,"column ""east2"": ""x"" is not a number"');
      expect(rows[at + 1]).toBe(`${one.stdout.split('\n')[at + 1]},`);
    }
  });

  it('with a pool, rows keep their order over many blocks of mixed lines, the same bytes as one thread', () => {
    // About 9 MB (eight blocks and more) with quoted fields, CRLF, comments, blank lines,
    // characters of several bytes and bad rows noted.
    let text = '# made for the test\nid,east1,north1,east2,north2\n';
    for (let i = 0; i < 150000; i++) {
      const e = ((i * 7.31) % 1000).toFixed(3);
      if (i % 1009 === 0) text += '# a comment\n\n';
      if (i % 13 === 0) text += `"Pt ${i}, ünï ✓",${e},2,3,${i % 7}\r\n`;
      else if (i % 4999 === 0) text += `B${i},${e},2,three,4\n`;
      else text += `Ω${i},${e},${i % 11},3.5,4\n`;
    }
    const f = csv('mixed.csv', text);
    const args = ['batch', 'inverses', f, '--bad-rows', 'note'];
    const one = cli([...args, '--workers', '1']);
    expect(one.code).toBe(0);
    expect(Buffer.byteLength(one.stdout)).toBeGreaterThan(8 << 20);
    // Every row in order: the ids of the output are those of the input.
    const ids = one.stdout
      .split('\n')
      .slice(1, -1)
      .map((l) => /^"?(?:Pt |Ω|B)?(\d+)/.exec(l)?.[1]);
    expect(ids).toEqual(Array.from({ length: 150000 }, (_, i) => String(i)));
    for (const n of ['2', '3', '5']) {
      const r = cli([...args, '--workers', n]);
      expect(r.code).toBe(0);
      expect(r.stdout).toBe(one.stdout);
      expect(r.stderr).toBe(one.stderr);
    }
  });

  it('with a pool, the blocks are computed by the worker threads', async () => {
    // A spy worker script: runs the real worker and logs each block it receives.
    const real = join(dirname(await bundleCli()), 'batch-worker.js');
    const log = join(dir, 'spy.log');
    const spy = join(dirname(real), 'spy-worker.js');
    writeFileSync(
      spy,
      `import { appendFileSync } from 'node:fs';\n` +
        `import { parentPort, threadId } from 'node:worker_threads';\n` +
        `await import(${JSON.stringify(pathToFileURL(real).href)});\n` +
        `parentPort.on('message', (m) => appendFileSync(${JSON.stringify(log)}, threadId + ' ' + m.id + '\\n'));\n`,
    );
    let text = 'id,east1,north1,east2,north2\n';
    for (let i = 0; i < 300000; i++) text += `P${i},${i % 1000},${i % 997},${i % 1009},1\n`;
    const f = csv('spied.csv', text);
    const out: string[] = [];
    await runBatch(
      'inverses',
      f,
      { arithmetic: 'float', digits: 10, workers: 2 },
      {
        stdout: (t) => out.push(t),
        stderr: () => {},
        stderrIsTTY: false,
        workerScript: pathToFileURL(spy),
      },
    );
    expect(out.join('')).toBe(cli(['batch', 'inverses', f, '--workers', '1']).stdout);
    const seen = readFileSync(log, 'utf8')
      .trim()
      .split('\n')
      .map((l) => l.split(' ').map(Number));
    // About 6 MiB: five blocks past the first MiB, by both threads.
    expect(seen.length).toBeGreaterThanOrEqual(4);
    expect(new Set(seen.map(([t]) => t)).size).toBe(2);
    expect(seen.map(([, id]) => id).sort((a, b) => a! - b!)).toEqual(seen.map((_, i) => i));
  });

  it('a worker that stops is an error, not a hang, and leaves no --out file', async () => {
    let text = 'id,east1,north1,east2,north2\n';
    for (let i = 0; i < 60000; i++) text += `P${i},${i % 1000},${i % 997},${i % 1009},1\n`;
    const f = csv('crash.csv', text);
    const scripts = {
      exits: `import { parentPort } from 'node:worker_threads';\nparentPort.on('message', () => process.exit(7));\n`,
      throws: `import { parentPort } from 'node:worker_threads';\nparentPort.on('message', () => { throw new Error('boom'); });\n`,
      quiet: `import { parentPort } from 'node:worker_threads';\nparentPort.on('message', () => {});\nsetTimeout(() => process.exit(0), 300);\n`,
    };
    for (const [name, code] of Object.entries(scripts)) {
      const script = join(dir, `crash-${name}.mjs`);
      writeFileSync(script, code);
      const folder = join(dir, `crash-out-${name}`);
      mkdirSync(folder);
      await expect(
        runBatch(
          'inverses',
          f,
          { arithmetic: 'float', digits: 10, workers: 2, out: join(folder, 'r.csv') },
          {
            stdout: () => {},
            stderr: () => {},
            stderrIsTTY: false,
            workerScript: pathToFileURL(script),
          },
        ),
      ).rejects.toThrow(name === 'throws' ? 'boom' : /a batch worker stopped \(exit code [07]\)/);
      expect(readdirSync(folder)).toEqual([]);
    }
    // A worker script that is not there.
    await expect(
      runBatch(
        'inverses',
        f,
        { arithmetic: 'float', digits: 10, workers: 2 },
        {
          stdout: () => {},
          stderr: () => {},
          stderrIsTTY: false,
          workerScript: pathToFileURL(join(dir, 'no-such-worker.js')),
        },
      ),
    ).rejects.toThrow();
  });

  it('removes a byte order mark at the start of the file only; U+FEFF at a later line start is trimmed as white space, wherever the chunks of input end', () => {
    const head = 'id,east1,north1,east2,north2\n';
    // A line starting exactly at 64 KiB, where the file's second chunk of input starts, and
    // one in the middle of a chunk: both written the same way.
    let text = '\uFEFF' + head;
    let i = 0;
    while (Buffer.byteLength(text) < 65536 - 40) text += `P${i++},0,0,3,4\n`;
    const room = 65536 - Buffer.byteLength(text);
    text += `Q,${'0'.repeat(room - 10)}0,0,3,4\n`;
    expect(Buffer.byteLength(text)).toBe(65536);
    text += '\uFEFFA,0,0,3,4\nX,0,0,3,4\n\uFEFFB,0,0,3,4\n';
    const r = cli(['batch', 'inverses', csv('bom.csv', text)]);
    expect(r.code).toBe(0);
    const out = r.stdout.split('\n');
    expect(out[0]).toBe('id,east1,north1,east2,north2,quadrance,distance,bearing');
    expect(out.slice(-4, -1)).toEqual([
      'A,0,0,3,4,25.00000000,5.000000000,36.86989765',
      'X,0,0,3,4,25.00000000,5.000000000,36.86989765',
      'B,0,0,3,4,25.00000000,5.000000000,36.86989765',
    ]);
    expect(r.stdout).not.toContain('\uFEFF');
    // The header may follow comment lines: a U+FEFF there is no byte order mark, but the
    // header's names are trimmed.
    const late = cli(['batch', 'inverses', '-'], {
      input: '# notes\n\uFEFFeast1,north1,east2,north2\n0,0,3,4\n',
    });
    expect(late.code).toBe(0);
    expect(late.stdout).toBe(
      'east1,north1,east2,north2,quadrance,distance,bearing\n0,0,3,4,25.00000000,5.000000000,36.86989765\n',
    );
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
      'east1,north1,east2,north2,quadrance,distance,bearing\n0,0,3,4,25.00000000,5.000000000,36.86989765\n',
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
    expect(out.join('')).toContain('0,0,6,8,100.000,10.0000,36.8699');
  });
});
