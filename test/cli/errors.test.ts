// Bad jobs as a subprocess: not JSON or against the schema → exit 2 naming the place;
// no solution → exit 3 naming the task; nothing partial written on any failure.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

let dir: string;
const jobFile = (name: string, body: unknown): string => {
  const f = join(dir, name);
  writeFileSync(f, typeof body === 'string' ? body : JSON.stringify(body, null, 2));
  return f;
};
const points = {
  A: { east: 0, north: 0 },
  B: { east: 100, north: 0 },
  C: { east: 100, north: 80 },
};

beforeAll(async () => {
  await bundleCli();
  dir = tempFolder();
});
afterAll(cleanUp);

describe('quadspread run with a job that cannot be read', () => {
  it('exits 2 with the line and column when the file is not JSON', () => {
    const r = cli([
      'run',
      jobFile('broken.json', '{\n  "tasks": [\n    { "kind": "area", }\n  ]\n}\n'),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 3, column \d+: the job file is not valid JSON/);
    expect(r.stdout).toBe('');
  });

  it('exits 2 saying that the job file is not an object when it is a JSON array', () => {
    const r = cli(['run', jobFile('array.json', '[]')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(
      'quadspread: the job file: an array of 0 is not an object (a job is an object with "tasks")',
    );
  });

  it('exits 2 naming the place of a field of the wrong type', () => {
    const r = cli([
      'run',
      jobFile('type.json', { points, tasks: [{ kind: 'area', points: 'A B C' }] }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('tasks[0].points: "A B C" is not an array');
  });

  it('exits 2 naming an unknown task kind and listing the known ones', () => {
    const r = cli([
      'run',
      jobFile('kind.json', {
        points,
        tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }, { kind: 'heigth' }],
      }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/tasks\[1\]\.kind: "heigth" is not a known kind \(.*area.*\)/);
  });

  it('exits 2 naming an unknown field', () => {
    const r = cli([
      'run',
      jobFile('field.json', {
        points,
        tasks: [{ kind: 'area', points: ['A', 'B', 'C'], colour: 'red' }],
      }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('tasks[0].colour: is not a known field');
  });

  it('exits 2 naming a point that the job does not have', () => {
    const r = cli([
      'run',
      jobFile('point.json', { points, tasks: [{ kind: 'area', points: ['A', 'B', 'D'] }] }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('tasks[0].points[2]: "D" is not a point of this job');
  });

  it('exits 2 naming a reading that is not an angle, deep in the task', () => {
    const courses = [
      { bearing: '90', distance: 100 },
      { bearing: `0°61'`, distance: 80 },
    ];
    const r = cli([
      'run',
      jobFile('angle.json', {
        points,
        tasks: [{ kind: 'traverse', start: 'A', close: 'C', courses }],
      }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(
      /tasks\[0\]\.courses\[1\]\.bearing: "0°61'" is not a valid bearing: .*minutes 61 ≥ 60/,
    );
  });

  it('exits 2 naming a vertical reading out of range, as in tasks[2].readings[1].vertical', () => {
    const height = (vertical: unknown) => ({
      kind: 'height',
      target: 'C',
      readings: [
        { station: 'A', vertical: `10°00'` },
        { station: 'B', vertical },
      ],
    });
    const area = { kind: 'area', points: ['A', 'B', 'C'] };
    const r = cli(['run', jobFile('elev.json', { points, tasks: [area, area, height('95°')] })]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(
      /^quadspread: tasks\[2\]\.readings\[1\]\.vertical: "95°" is not a valid elevation angle/,
    );
    const z = cli([
      'run',
      jobFile('zen.json', { points, tasks: [height({ zenith: '200°', sigma: '5"' })] }),
    ]);
    expect(z.code).toBe(2);
    expect(z.stderr).toContain(
      'tasks[0].readings[1].vertical.zenith: "200°" is not a valid zenith angle',
    );
    const s = cli(['run', jobFile('slope.json', { points, tasks: [height({ slope: 'steep' })] })]);
    expect(s.code).toBe(2);
    expect(s.stderr).toContain('tasks[0].readings[1].vertical.slope: "steep" is not a valid slope');
  });

  it('exits 2 naming a length with an unknown unit', () => {
    const r = cli([
      'run',
      jobFile('unit.json', {
        points,
        tasks: [
          {
            kind: 'traverse',
            start: 'A',
            close: 'B',
            courses: [{ bearing: 90, distance: '100 furlongs' }],
          },
        ],
      }),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('tasks[0].courses[0].distance');
  });

  it('exits 2 for a job file that does not exist', () => {
    const r = cli(['run', join(dir, 'missing.json')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/cannot read the job file .*ENOENT/);
  });

  it('exits 2 for an unknown option value', () => {
    const r = cli(['demo', '--arithmetic', 'complex']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/complex/);
    const d = cli(['demo', '--digits', 'many']);
    expect(d.code).toBe(2);
    for (const digits of ['0', '101', '-3', '2.5']) {
      const z = cli(['demo', '--digits', digits]);
      expect(z.code).toBe(2);
      expect(z.stdout).toBe('');
      expect(z.stderr).toContain('is not a whole number from 1 to 100');
    }
  });
});

describe('quadspread run tells a bad reading (exit 2) from a computation with no solution (exit 3)', () => {
  const P = points;
  it.each([
    [
      'a spread above 1',
      { tasks: [{ kind: 'triangle', known: { Q1: 25, Q2: 16, s1: 2 } }] },
      2,
      'tasks[0].known.s1: 2 is not a valid spread',
    ],
    [
      'latitude and longitude swapped (a W on the latitude)',
      {
        tasks: [{ kind: 'geodetic', geodetic: { lat: `1°39'51.9920"W`, lon: `53°36'43.1653"N` } }],
      },
      2,
      'tasks[0].geodetic.lat: "1°39\'51.9920\\"W" carries W, but a latitude takes N or S',
    ],
    [
      'a horizontal angle of 400°',
      {
        points: P,
        tasks: [{ kind: 'resection', control: ['A', 'B', 'C'], angles: ['400', '10'] }],
      },
      2,
      'tasks[0].angles[0]: 400° is not a valid clockwise horizontal angle',
    ],
    [
      'an interior angle of 0°',
      {
        tasks: [
          { kind: 'base-height', base: 100, stations: [{ angle: 0, vertical: 10 }, { angle: 30 }] },
        ],
      },
      2,
      'tasks[0].stations[0].angle: 0° is not a valid interior angle',
    ],
    [
      'a levelling run that starts with a foresight',
      { tasks: [{ kind: 'levelling', start: 10, sights: [{ fs: 1 }, { bs: 2 }] }] },
      2,
      'tasks[0].sights[0]: the first row must be a backsight alone',
    ],
    [
      'a levelling row with both an intermediate sight and a foresight',
      { tasks: [{ kind: 'levelling', start: 10, sights: [{ bs: 1 }, { is: 1, fs: 2 }] }] },
      2,
      'tasks[0].sights[1]: a row has an intermediate sight or a foresight, not both',
    ],
    [
      'a levelling row after the first with a backsight alone',
      { tasks: [{ kind: 'levelling', start: 10, sights: [{ bs: 1 }, { bs: 2 }, { fs: 1 }] }] },
      2,
      'tasks[0].sights[1]: ',
    ],
    [
      'an elevation with 68 minutes, its sigma beside it',
      {
        tasks: [
          {
            kind: 'height',
            readings: [{ horizontal: 100, vertical: { elevation: `7°68'00"`, sigma: '5"' } }],
          },
        ],
      },
      2,
      `tasks[0].readings[0].vertical.elevation: "7°68'00\\"" is not a valid elevation angle`,
    ],
    [
      'a sigma beside an elevation that is not an angle',
      {
        tasks: [
          {
            kind: 'height',
            readings: [{ horizontal: 100, vertical: { elevation: 7, sigma: 'abc' } }],
          },
        ],
      },
      2,
      'tasks[0].readings[0].vertical.sigma: "abc" is not a valid standard uncertainty',
    ],
    [
      'a latitude of 95°',
      { tasks: [{ kind: 'geodetic', geodetic: { lat: 95, lon: 0 } }] },
      2,
      'tasks[0].geodetic.lat: 95 is not a valid latitude',
    ],
    [
      'a grade steeper than its slope',
      { tasks: [{ kind: 'path-grade', slope: '5%', grade: '10%' }] },
      3,
      'tasks[0] (path-grade): no solution: GRADE_STEEPER_THAN_SLOPE',
    ],
    [
      'in-line readings on both sides of the horizon',
      {
        tasks: [
          {
            kind: 'inline-height',
            stations: [
              { chainage: 0, vertical: 10 },
              { chainage: 10, vertical: -10 },
              { chainage: 20, vertical: 10 },
            ],
          },
        ],
      },
      3,
      'tasks[0] (inline-height): no solution: INCONSISTENT_READINGS',
    ],
    [
      'a station on the danger circle',
      { points: P, tasks: [{ kind: 'resection', control: ['A', 'B', 'C'], angles: [0, 0] }] },
      3,
      'tasks[0] (resection): no solution: DANGER_CIRCLE',
    ],
    [
      'base angles that do not meet',
      {
        tasks: [
          {
            kind: 'base-height',
            base: 100,
            stations: [{ angle: 100, vertical: 10 }, { angle: 100 }],
          },
        ],
      },
      3,
      'tasks[0] (base-height): no solution: DEGENERATE_TRIANGLE',
    ],
  ])('%s', (_what, job, code, message) => {
    const r = cli(['run', jobFile('classify.json', job)]);
    expect(r.code).toBe(code);
    expect(r.stderr).toContain(message);
  });
});

describe('quadspread run with correlated inputs', () => {
  const job = (names: [string, string], r: number) => ({
    points: { A: { east: 0, north: 0 }, B: { east: 0, north: 100 } },
    tasks: [
      {
        kind: 'traverse',
        start: 'A',
        close: 'B',
        courses: [
          { latitude: { value: 60, sigma: 0.003 }, departure: 0 },
          { latitude: { value: 40.01, sigma: 0.004 }, departure: 0 },
        ],
        correlations: [{ inputs: names, r }],
      },
    ],
  });

  it('adds 2·r·u(a)·u(b) to the variance of a sum (GUM, JCGM 100:2008, eq. (13))', () => {
    const r = cli([
      'run',
      jobFile('corr.json', job(['course 1 latitude', 'course 2 latitude'], 0.5)),
      '--format',
      'json',
    ]);
    expect(r.code).toBe(0);
    const q = JSON.parse(r.stdout).tasks[0].results.find(
      (x: { name: string }) => x.name === 'misclosure_north',
    );
    expect(Number(q.sigma)).toBeCloseTo(
      Math.sqrt(0.003 ** 2 + 0.004 ** 2 + 2 * 0.5 * 0.003 * 0.004),
      4,
    );
    expect(q.correlations).toEqual([
      {
        inputs: ['course 1 latitude', 'course 2 latitude'],
        r: '0.5',
        share: (
          Math.round(
            (1000 * 2 * 0.5 * 0.003 * 0.004) / (0.003 ** 2 + 0.004 ** 2 + 2 * 0.5 * 0.003 * 0.004),
          ) / 10
        ).toFixed(1),
      },
    ]);
  });

  it('exits 2 naming an input that the task does not have', () => {
    const r = cli([
      'run',
      jobFile('corr-bad.json', job(['course 1 latitude', 'course 3 latitude'], 0.5)),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(
      'tasks[0].correlations[0].inputs[1]: "course 3 latitude" is not an input of this task with a sigma ("course 1 latitude", "course 2 latitude")',
    );
  });
});

describe('quadspread run with checks that fail', () => {
  it('exits 0, marks the check FAIL and says so at the end', () => {
    const job = {
      points,
      tasks: [
        {
          kind: 'traverse',
          start: 'A',
          close: 'C',
          courses: [
            { bearing: 90, distance: 100 },
            { bearing: 0, distance: 80.5 },
          ],
          tolerance: { linear: '0.1 m', precision: 1000 },
        },
      ],
    };
    const r = cli(['run', jobFile('fails.json', job)]);
    expect(r.code).toBe(0);
    // The misclosure is 180.5 − 180 = 0.5 m (east 100, north 80.5 against C at 100, 80).
    expect(r.stdout).toContain('check FAIL: Linear misclosure: 0.500 m, limit ±0.100 m');
    expect(r.stdout).toContain(
      'check FAIL: Precision 1 : N, N = length ÷ linear misclosure: 1 : 361, limit ≥ 1 : 1000',
    ); // 180.5 / 0.5
    expect(r.stdout).toMatch(/checks: 0 passed, 2 failed \(of 2\) -- SEE FAILED CHECKS ABOVE/);
    // With --fail-on-check the same report is written, and the exit code is 4.
    const f = cli(['run', jobFile('fails.json', job), '--fail-on-check']);
    expect(f.code).toBe(4);
    expect(f.stdout).toBe(r.stdout);
    expect(f.stderr).toContain('2 of 2 checks failed (--fail-on-check)');
  });

  it('reads a job file that starts with a byte-order mark', () => {
    const f = join(dir, 'bom.json');
    writeFileSync(
      f,
      '\uFEFF' + JSON.stringify({ points, tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }] }),
    );
    expect(cli(['run', f]).code).toBe(0);
  });
});

describe('quadspread run with a job that has no solution', () => {
  const impossible = {
    tasks: [{ kind: 'triangle', name: 'Long thin', known: { side1: 1, side2: 2, side3: 10 } }],
  };

  it('exits 3 naming the task and the reason', () => {
    const r = cli(['run', jobFile('impossible.json', impossible)]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(
      /tasks\[0\] \(triangle "Long thin"\): no solution: .*no proper triangle/,
    );
    expect(r.stdout).toBe('');
  });

  it('exits 3 for two parallel lines that must meet', () => {
    const r = cli([
      'run',
      jobFile('parallel.json', {
        points: { ...points, D: { east: 0, north: 80 } },
        tasks: [
          {
            kind: 'intersection',
            lines: [
              ['A', 'B'],
              ['D', 'C'],
            ],
          },
        ],
      }),
    ]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/tasks\[0\] \(intersection\): no solution: PARALLEL_LINES/);
  });

  it('writes neither the report nor the sketch, leaves no temporary file and keeps an older report as it was', () => {
    const out = join(dir, 'out', 'report.md');
    const sketch = join(dir, 'out', 'sketch.svg');
    const outDir = join(dir, 'out');
    // An older report stays as it was.
    const f = jobFile('impossible2.json', impossible);
    const ok = jobFile('ok.json', { points, tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }] });
    mkdirSync(outDir, { recursive: true });
    expect(cli(['run', ok, '--out', out, '--format', 'markdown']).code).toBe(0);
    const before = readFileSync(out, 'utf8');
    const r = cli(['run', f, '--out', out, '--sketch', sketch]);
    expect(r.code).toBe(3);
    expect(readFileSync(out, 'utf8')).toBe(before);
    expect(existsSync(sketch)).toBe(false);
    expect(readdirSync(outDir)).toEqual(['report.md']);
    // A bad job (exit 2) writes nothing either.
    const bad = cli([
      'run',
      jobFile('bad.json', '{"tasks": ['),
      '--out',
      join(outDir, 'new.txt'),
      '--sketch',
      join(outDir, 'new.svg'),
    ]);
    expect(bad.code).toBe(2);
    expect(readdirSync(outDir)).toEqual(['report.md']);
  });
});

describe('quadspread run with an output file that cannot be written', () => {
  const ok = (): string =>
    jobFile('ok-out.json', { points, tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }] });

  it('exits 2 naming the missing folder of --out, without a stack trace', () => {
    const r = cli(['run', ok(), '--out', join(dir, 'no-such-folder', 'report.txt')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(
      /cannot write ".*report\.txt": the folder ".*no-such-folder" does not exist/,
    );
    expect(r.stderr).not.toMatch(/internal error|\bat \S+ \(/);
    expect(existsSync(join(dir, 'no-such-folder'))).toBe(false);
  });

  it('exits 2 when --sketch names a folder, and writes neither file nor leaves a temporary file', () => {
    const outDir = join(dir, 'targets');
    mkdirSync(join(outDir, 'a-folder'), { recursive: true });
    const r = cli([
      'run',
      ok(),
      '--out',
      join(outDir, 'report.txt'),
      '--sketch',
      join(outDir, 'a-folder'),
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/cannot write ".*a-folder": it is a folder/);
    expect(readdirSync(outDir)).toEqual(['a-folder']);
    expect(readdirSync(join(outDir, 'a-folder'))).toEqual([]);
  });

  it('exits 2 when --out or --sketch names the job file itself, and leaves the job as it was', () => {
    const job = ok();
    const before = readFileSync(job, 'utf8');
    for (const option of ['--out', '--sketch']) {
      const r = cli(['run', job, option, job]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(`${option}: ${JSON.stringify(job)} is the job file itself`);
      expect(readFileSync(job, 'utf8')).toBe(before);
    }
  });

  it('exits 2 when batch --out names the input CSV itself, and leaves it as it was', () => {
    const csv = join(dir, 'same.csv');
    writeFileSync(csv, 'x1,y1,x2,y2,x3,y3\n0,0,4,0,0,3\n');
    const r = cli(['batch', 'triangles', csv, '--out', csv]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('is the input CSV itself');
    expect(readFileSync(csv, 'utf8')).toBe('x1,y1,x2,y2,x3,y3\n0,0,4,0,0,3\n');
  });

  it('exits 2 when batch --out is in a missing folder', () => {
    const csv = join(dir, 'tri.csv');
    writeFileSync(csv, 'x1,y1,x2,y2,x3,y3\n0,0,4,0,0,3\n');
    const r = cli(['batch', 'triangles', csv, '--out', join(dir, 'no-such-folder', 'out.csv')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/the folder ".*no-such-folder" does not exist/);
  });
});

describe('quadspread run with absurd values', () => {
  it('exits 3 with a short message when an exact value has thousands of digits (a chainage of 1e999)', () => {
    const job = {
      tasks: [
        {
          kind: 'inline-height',
          stations: [
            { chainage: 0, vertical: 10 },
            { chainage: 150, vertical: 20 },
            { chainage: '1e999', vertical: 15 },
            { chainage: 475, vertical: 8 },
          ],
        },
      ],
    };
    const r = cli(['run', jobFile('absurd.json', job)]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/^quadspread: tasks\[0\] \(inline-height\): no solution: /);
    expect(r.stderr).toMatch(/…\(\d+ digits\)/);
    expect(r.stderr.length).toBeLessThan(1000);
  });
});

describe('quadspread run with an uncertain coefficient of refraction', () => {
  it('carries σ(k) into the correction: u = σ(k)·D²/(2R) (derived from (1 − k)·D²/(2R))', () => {
    const job = {
      tasks: [
        {
          kind: 'trig-height',
          distance: 1000,
          measured: 'horizontal',
          vertical: 1,
          correction: { k: { value: 0.13, sigma: 0.05 } },
        },
      ],
    };
    const r = cli(['run', jobFile('k-sigma.json', job), '--format', 'json']);
    expect(r.code).toBe(0);
    const t = JSON.parse(r.stdout).tasks[0] as {
      results: { name: string; sigma?: string; budget?: { input: string }[] }[];
      notes: string[];
    };
    const corr = t.results.find((q) => q.name === 'correction')!;
    expect(Number(corr.sigma)).toBeCloseTo((0.05 * 1000 * 1000) / (2 * 6371000), 4);
    expect(corr.budget!.map((b) => b.input)).toEqual(['k']);
    expect(t.notes.some((n) => n.includes('leaves out that of k'))).toBe(false);
  });

  it('says so when k carries no uncertainty', () => {
    const job = {
      tasks: [
        {
          kind: 'trig-height',
          distance: 1000,
          measured: 'horizontal',
          vertical: { elevation: 1, sigma: '5"' },
        },
      ],
    };
    const r = cli(['run', jobFile('k-none.json', job)]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('The uncertainty of the correction leaves out that of k');
  });
});
