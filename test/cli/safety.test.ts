// Output files, input files, escaping and job checks of the command line, as a subprocess:
/* eslint-disable no-control-regex -- the tests look for control characters in the output */
// special files are never replaced, links are followed and never replaced, temporary files go
// on an interrupt, job text cannot act as markup, terminal commands or spreadsheet formulas.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import {
  existsSync,
  linkSync,
  lstatSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  statSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { join } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

let dir: string;
let bundle: string;
let n = 0;
const folder = (): string => {
  const d = join(dir, `case-${++n}`);
  mkdirSync(d);
  return d;
};
const points = {
  A: { east: 0, north: 0 },
  B: { east: 100, north: 0 },
  C: { east: 100, north: 80 },
};
const areaJob = JSON.stringify({ points, tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }] });
const write = (d: string, name: string, text: string): string => {
  const f = join(d, name);
  writeFileSync(f, text);
  return f;
};

beforeAll(async () => {
  bundle = await bundleCli();
  dir = tempFolder();
});
afterAll(cleanUp);

describe('output files are regular files only', () => {
  it('refuses a device as --out with exit 2 naming it, and leaves the device a device', () => {
    const d = folder();
    const r = cli(['run', write(d, 'job.json', areaJob), '--out', '/dev/null']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('cannot write "/dev/null": it is a device, not a regular file');
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
  });

  it('refuses a FIFO as --out or --sketch and leaves it a FIFO', () => {
    const d = folder();
    const fifo = join(d, 'pipe');
    if (spawnSync('mkfifo', [fifo]).status !== 0) return; // no mkfifo on this system
    const job = write(d, 'job.json', areaJob);
    for (const option of ['--out', '--sketch']) {
      const r = cli(['run', job, option, fifo]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(`"${fifo}": it is a named pipe (FIFO), not a regular file`);
      expect(lstatSync(fifo).isFIFO()).toBe(true);
    }
    expect(readdirSync(d).sort()).toEqual(['job.json', 'pipe']);
  });

  it('follows a symbolic link given as --out to its target and leaves the link a link', () => {
    const d = folder();
    const target = write(d, 'target.txt', 'old\n');
    const link = join(d, 'link.txt');
    symlinkSync(target, link);
    const r = cli(['run', write(d, 'job.json', areaJob), '--out', link]);
    expect(r.code).toBe(0);
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readFileSync(target, 'utf8')).toContain('quadspread report');
    expect(readdirSync(d).sort()).toEqual(['job.json', 'link.txt', 'target.txt']);
  });

  it('refuses a dangling symbolic link as --out and leaves it as it was', () => {
    const d = folder();
    const link = join(d, 'dangling.txt');
    symlinkSync(join(d, 'nowhere', 'x.txt'), link);
    const r = cli(['run', write(d, 'job.json', areaJob), '--out', link]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('a symbolic link to nothing');
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
  });

  it('refuses an --out that is the job file through a symbolic link, a hard link or ..', () => {
    const d = folder();
    const job = write(d, 'job.json', areaJob);
    symlinkSync(job, join(d, 'soft.json'));
    linkSync(job, join(d, 'hard.json'));
    mkdirSync(join(d, 'sub'));
    for (const out of [
      join(d, 'soft.json'),
      join(d, 'hard.json'),
      join(d, 'sub', '..', 'job.json'),
    ]) {
      const r = cli(['run', job, '--out', out]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain('is the job file itself');
      expect(readFileSync(job, 'utf8')).toBe(areaJob);
    }
    const csv = write(d, 'in.csv', 'east1,north1,east2,north2\n0,0,3,4\n');
    symlinkSync(csv, join(d, 'in-link.csv'));
    const r = cli(['batch', 'inverses', csv, '--out', join(d, 'in-link.csv')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('is the input CSV itself');
    expect(readFileSync(csv, 'utf8')).toBe('east1,north1,east2,north2\n0,0,3,4\n');
  });

  it('removes the temporary file of batch --out when interrupted (SIGINT, SIGTERM)', async () => {
    for (const [signal, code] of [
      ['SIGINT', 130],
      ['SIGTERM', 143],
    ] as const) {
      const d = folder();
      const out = join(d, 'results.csv');
      const child = spawn(process.execPath, [bundle, 'batch', 'inverses', '-', '--out', out]);
      // Rows keep coming on the standard input, which stays open: the batch is mid-way.
      child.stdin.write('east1,north1,east2,north2\n');
      for (let i = 0; i < 200; i++) child.stdin.write(`0,0,${i},4\n`);
      const temp = async (): Promise<void> => {
        for (let i = 0; i < 1200 && readdirSync(d).length === 0; i++)
          await new Promise((r) => setTimeout(r, 25));
      };
      await temp();
      expect(readdirSync(d)).toHaveLength(1); // the temporary file
      const ended = new Promise<number | null>((r) => child.on('exit', (c) => r(c)));
      child.kill(signal);
      expect(await ended).toBe(code);
      expect(readdirSync(d)).toEqual([]);
      expect(existsSync(out)).toBe(false);
    }
  });
});

describe('input files that are not regular files', () => {
  it('run /dev/zero stops at the size limit while reading: exit 2, not a run out of memory', () => {
    const r = cli(['run', '/dev/zero']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('the job file "/dev/zero" is larger than 50 MB');
  });

  it('batch of /dev/zero stops at the first over-long line: exit 2', () => {
    const r = cli(['batch', 'inverses', '/dev/zero']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 1: the line is longer than \d+ characters/);
  });

  it('run of a folder is exit 2 saying it is a folder', () => {
    const r = cli(['run', folder()]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('it is a folder');
  });
});

describe('job text in reports is shown as text, never as markup, terminal commands or formulas', () => {
  const hostile = {
    title: '<script>alert(1)</script> [x](javascript:alert(1))',
    points: {
      '<img src=x onerror=alert(1)>': { east: 0, north: 0 },
      'B\u001b[2J\u001b]0;owned\u0007': { east: 100, north: 0 },
      'C|`x`\u202e': { east: 100, north: 80 },
    },
    tasks: [
      {
        kind: 'area',
        name: '**bold** <b>x</b>\nline',
        points: ['<img src=x onerror=alert(1)>', 'B\u001b[2J\u001b]0;owned\u0007', 'C|`x`\u202e'],
      },
    ],
  };

  it('Markdown: HTML as entities, link and emphasis marks escaped, no raw control character', () => {
    const d = folder();
    const r = cli(['run', write(d, 'job.json', JSON.stringify(hostile)), '--format', 'markdown']);
    expect(r.code).toBe(0);
    expect(r.stdout).not.toMatch(/<script|<img|<b>/);
    expect(r.stdout).toContain(
      '&lt;script&gt;alert(1)&lt;/script&gt; \\[x\\](javascript:alert(1))',
    );
    expect(r.stdout).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(r.stdout).toContain('\\*\\*bold\\*\\*');
    expect(r.stdout).not.toMatch(/[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202e]/);
    // A table row is one line with its four cells: a | or a line break in a name does not add one.
    const row = r.stdout.split('\n').find((l) => l.startsWith('| Area'));
    expect(row).toBeDefined();
    expect(row!.replace(/\\\|/g, '').split('|')).toHaveLength(6);
  });

  it('text: control characters shown escaped (\\x1B), a line break in a name does not start a line', () => {
    const d = folder();
    const r = cli(['run', write(d, 'job.json', JSON.stringify(hostile))]);
    expect(r.code).toBe(0);
    expect(r.stdout).not.toMatch(/[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202e]/);
    expect(r.stdout).toContain('B\\x1B[2J\\x1B]0;owned\\x07');
    expect(r.stdout).toContain('<b>x</b>\\nline');
    expect(r.stdout).toContain('C|`x`\\u202E');
  });

  it('error messages show control characters from the job escaped', () => {
    const d = folder();
    const job = { points, tasks: [{ kind: 'area', points: ['A', 'B', 'Z\u001b[31m\u009b1m'] }] };
    const r = cli(['run', write(d, 'job.json', JSON.stringify(job))]);
    expect(r.code).toBe(2);
    expect(r.stderr).not.toMatch(/[\u001b\u009b]/);
    expect(r.stderr).toContain('\\x9B');
  });

  it('batch CSV: formula cells get a leading quote (OWASP CSV injection), numbers stay numbers', () => {
    const d = folder();
    const input =
      'name,east1,north1,east2,north2\n' +
      '"=HYPERLINK(""http://x"",""y"")",0,0,3,4\n' +
      '@SUM(A1:A9),-3,-4,0,0\n' +
      '+cmd,0,0,3,4\n' +
      '"\tTab",0,0,3,4\n' +
      '-12.5,0,0,3,4\n';
    const r = cli(['batch', 'inverses', write(d, 'in.csv', input)]);
    expect(r.code).toBe(0);
    const lines = r.stdout.split('\n');
    expect(lines[1]).toBe(
      `"'=HYPERLINK(""http://x"",""y"")",0,0,3,4,25.00000000,5.000000000,36.86989765`,
    );
    expect(lines[2]).toBe(`"'@SUM(A1:A9)",-3,-4,0,0,25.00000000,5.000000000,36.86989765`);
    expect(lines[3]).toMatch(/^"'\+cmd",/);
    expect(lines[4]).toMatch(/^"'\tTab",/);
    expect(lines[5]).toBe('-12.5,0,0,3,4,25.00000000,5.000000000,36.86989765');
  });
});

describe('job values and job files', () => {
  it('path-grade reduces a fall bearing of 1e12° (and 1e22° in float) at once, to the bearing mod 360°', () => {
    const d = folder();
    // 10^k mod 360 = 280 for every k ≥ 3 (10^3 = 2·360 + 280, and 280·10 = 7·360 + 280).
    expect(10n ** 12n % 360n).toBe(280n);
    const direct = cli(
      [
        'run',
        write(
          d,
          'd.json',
          JSON.stringify({
            tasks: [{ kind: 'path-grade', slope: '1 in 3', grade: '1 in 12', fallBearing: 280 }],
          }),
        ),
        '--format',
        'json',
      ],
      {},
    );
    const bearings = (out: string): string[] =>
      (
        JSON.parse(out) as { tasks: { results: { name: string; value: string }[] }[] }
      ).tasks[0]!.results.filter((q) => q.name.startsWith('bearing')).map((q) => q.value);
    const expected = bearings(direct.stdout);
    expect(expected).toHaveLength(2);
    for (const [fb, arith] of [
      [1e12, 'rational'],
      [1e12, 'float'],
      ['1e22', 'float'],
      ['-1e300', 'decimal'],
    ] as const) {
      const job = {
        tasks: [{ kind: 'path-grade', slope: '1 in 3', grade: '1 in 12', fallBearing: fb }],
      };
      const r = cli([
        'run',
        write(d, 'pg.json', JSON.stringify(job)),
        '-a',
        arith,
        '--format',
        'json',
      ]);
      expect(r.code).toBe(0);
      // −10^300 mod 360 = 360 − 280 = 80: a different bearing, checked by its own run below.
      if (fb !== '-1e300') expect(bearings(r.stdout)).toEqual(expected);
    }
  });

  it('"1e1000" in a length, an angle or a number is exit 2 naming the input, not an internal error', () => {
    const d = folder();
    for (const job of [
      {
        points: { ...points, A: { east: '1e1000', north: 0 } },
        tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }],
      },
      {
        tasks: [{ kind: 'path-grade', slope: '1 in 3', grade: '1 in 12', fallBearing: '1e-1000' }],
      },
      { tasks: [{ kind: 'triangle', known: { side1: '1e1000', side2: 1, side3: 1 } }] },
    ]) {
      const r = cli(['run', write(d, 'big.json', JSON.stringify(job))]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(
        /^quadspread: (points\.A\.east|tasks\[0\]\.[\w.]+): .*too large or too precise/,
      );
      expect(r.stderr).not.toMatch(/internal error/);
    }
  });

  it('an unknown field named like an Object method (constructor, toString) is refused', () => {
    const d = folder();
    for (const key of ['constructor', 'toString', '__proto__', 'hasOwnProperty']) {
      const text = `{"points": ${JSON.stringify(points)}, "tasks": [{"kind": "area", "points": ["A","B","C"], "${key}": 1}]}`;
      const r = cli(['run', write(d, 'unknown.json', text)]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(`${key}: is not a known field`);
    }
  });

  it('a point (or any key) written twice is refused with the line of each', () => {
    const d = folder();
    const text =
      '{\n  "points": {\n    "A": { "east": 0, "north": 0 },\n    "B": { "east": 100, "north": 0 },\n' +
      '    "C": { "east": 100, "north": 80 },\n    "\\u0041": { "east": 5, "north": 5 }\n  },\n' +
      '  "tasks": [{ "kind": "area", "points": ["A", "B", "C"] }]\n}\n';
    const r = cli(['run', write(d, 'dup.json', text)]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(
      'points.A (line 6): is written twice in the same object (first on line 3)',
    );
  });

  it('batch heights refuses a negative horizontal distance with exit 2 naming line and column', () => {
    const r = cli(['batch', 'heights', '-'], { input: 'horizontal,elevation\n100,5\n-100,5\n' });
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('line 3, column "horizontal": "-100" is negative');
  });

  it('a batch kind named like an Object method is refused as unknown', () => {
    const r = cli(['batch', 'constructor', '-'], { input: 'x\n' });
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('"constructor" is not a batch kind');
  });
});
