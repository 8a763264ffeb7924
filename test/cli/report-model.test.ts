// The report model: display rules, checks whose printed numbers show their verdict (at the
// tolerance boundary too), the header, tables, line width, run - and --fail-on-check.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readdirSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { runJob } from '../../src/cli/job';
import { renderText } from '../../src/cli/render-text';
import { TASK_KINDS } from '../../src/cli/tasks/index';
import { DEFAULT_DISPLAY, bearingText, fixed, significant } from '../../src/cli/display';
import { bundleCli, cleanUp, cli } from './helpers';

beforeAll(bundleCli);
afterAll(cleanUp);

/** A levelling job: one set-up, BS on the start, FS on the close, `km` long, allowance c·√K. */
function levellingJob(bs: string, fs: string, close: string, c: number, km: number) {
  return {
    tasks: [
      {
        kind: 'levelling',
        start: '100.000',
        close,
        c,
        km,
        sights: [
          { station: 'BM1', bs },
          { station: 'BM2', fs },
        ],
      },
    ],
  };
}

function checkLine(job: unknown, arithmetic: 'rational' | 'decimal' | 'float' = 'rational') {
  const report = runJob(job, TASK_KINDS, { arithmetic, digits: 10, source: 'test' });
  const text = renderText(report);
  const line = text.split('\n').find((l) => l.includes('check '))!;
  const m = /check (PASS|FAIL): .*: (-?[\d.]+) mm, limit ±([\d.]+) mm$/.exec(line);
  if (!m) throw new Error(`no check line in:\n${text}`);
  return { pass: m[1] === 'PASS', value: m[2]!, limit: m[3]!, report };
}

describe('a levelling check at its tolerance boundary', () => {
  it('prints a misclosure of −6 mm against 12·√0.2467 = 5.9602… mm as FAIL with enough decimals to show it', () => {
    // 100.000 + 1.000 − 1.006 = 99.994 against 100.000: −6 mm. 12·√0.2467 (Math.sqrt) < 6.
    expect(12 * Math.sqrt(0.2467)).toBeLessThan(6);
    const r = checkLine(levellingJob('1.000', '1.006', '100.000', 12, 0.2467));
    expect(r.pass).toBe(false);
    expect(r.value).toBe('-6.00');
    expect(r.limit).toBe((12 * Math.sqrt(0.2467)).toFixed(2));
    expect(Math.abs(Number(r.value))).toBeGreaterThan(Number(r.limit));
  });

  it('prints a misclosure of −6 mm against exactly 12·√0.25 = 6 mm as PASS, the two equal', () => {
    const r = checkLine(levellingJob('1.000', '1.006', '100.000', 12, 0.25));
    expect(r).toMatchObject({ pass: true, value: '-6.0', limit: '6.0' });
  });

  it('never prints numbers that contradict the verdict, in any arithmetic (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 200 }),
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 4000 }),
        fc.constantFrom('rational' as const, 'decimal' as const, 'float' as const),
        (mm, c, metres, arithmetic) => {
          const fs = (1 + mm / 1000).toFixed(3);
          const r = checkLine(levellingJob('1.000', fs, '100.000', c, metres / 1000), arithmetic);
          // The verdict, decided here in floats: |m| ≤ c·√K, squared to stay exact for integers.
          const exactPass = mm * mm * 1000 <= c * c * metres;
          expect(r.pass).toBe(exactPass);
          const printed = Math.abs(Number(r.value)) <= Number(r.limit);
          expect(printed).toBe(r.pass);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('display rules', () => {
  it('round half away from zero, exactly, on decimal text', () => {
    expect(fixed('2.5', 0)).toBe('3');
    expect(fixed('-2.5', 0)).toBe('-3');
    expect(fixed('0.0004', 3)).toBe('0.000');
    expect(fixed('1.23456789012345678901234567890e3', 4)).toBe('1234.5679');
    expect(significant('0.000147777818', 3)).toBe('0.000148');
    expect(significant('9.996', 3)).toBe('10.0');
  });

  it('write a bearing that rounds to 360° as 0°, and quadrant bearings when asked', () => {
    // 359.99999999° is 0.000036" short of a full turn: to 0.1" it is a full turn.
    expect(bearingText('359.99999999', DEFAULT_DISPLAY)).toBe(`0°00'00.0"`);
    expect(bearingText('248.09305555555555', { ...DEFAULT_DISPLAY, seconds: 0 })).toBe(
      `248°05'35"`,
    );
    expect(
      bearingText('248.09305555555555', { ...DEFAULT_DISPLAY, bearings: 'quadrant', seconds: 0 }),
    ).toBe(`S 68°05'35" W`);
  });

  it('are set by the job and overridden on the command line', () => {
    const job = JSON.parse(
      readFileSync(resolve(__dirname, '../../examples/coordinates.json'), 'utf8'),
    );
    job.display = { lengths: 4 };
    const a = runJob(job, TASK_KINDS, { arithmetic: 'rational', digits: 10, source: 't' });
    expect(a.tasks[3]!.results.find((q) => q.name === 'M.east')!.display).toBe('230.0000 m');
    const b = runJob(job, TASK_KINDS, {
      arithmetic: 'rational',
      digits: 10,
      source: 't',
      display: { lengths: '2', bearings: 'quadrant' },
    });
    expect(b.tasks[3]!.results.find((q) => q.name === 'M.east')!.display).toBe('230.00 m');
    expect(b.display!.bearings).toBe('quadrant');
  });

  it('refuse an unknown key or a bad value with exit 2, naming it', () => {
    const r = cli(['demo', '--display', 'lengths=12']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--display lengths: "12" is not valid here');
    const k = cli(['demo', '--display', 'colour=red']);
    expect(k.code).toBe(2);
    expect(k.stderr).toContain('"colour" is not a display setting');
  });
});

describe('text reports', () => {
  const examples = readdirSync(resolve(__dirname, '../../examples')).filter((f) =>
    f.endsWith('.json'),
  );
  it.each(examples)(
    '%s: every line is at most 100 characters, and the header names date and version',
    (f) => {
      const r = cli(['run', `examples/${f}`, '--date', '2026-01-31']);
      expect(r.code).toBe(0);
      const lines = r.stdout.split('\n');
      expect(Math.max(...lines.map((l) => l.length))).toBeLessThanOrEqual(100);
      expect(r.stdout).toContain('date 2026-01-31; quadspread 0.1.0; arithmetic rational');
      expect(r.stdout).toMatch(/computed by: .* checked by: /);
      // No machine keys and no exact forms without --detail.
      expect(r.stdout).not.toMatch(/\]: /);
      expect(r.stdout).not.toContain('exact: ');
    },
  );

  it('the demo carries a traverse sheet, a coordinate list, a level book and a triangle solution', () => {
    const text = cli(['demo']).stdout;
    for (const title of [
      'Traverse sheet (compass rule)',
      'Adjusted courses',
      'Coordinate list',
      'Level book, rise and fall',
      'Level book, height of collimation',
      'Triangle solution',
    ])
      expect(text).toContain(`\n  ${title}`);
  });

  it('--detail shows machine keys, exact forms and quadrances', () => {
    const text = cli(['demo', '--detail']).stdout;
    expect(text).toContain('[H1.H]');
    expect(text).toContain('exact: 527/576');
  });
});

describe('quadspread run -', () => {
  it('reads the job from the standard input', () => {
    const job = readFileSync(resolve(__dirname, '../../examples/triangles.json'), 'utf8');
    const r = cli(['run', '-', '--format', 'json'], { input: job });
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout);
    expect(report.source).toBe('standard input');
    expect(report.tasks.length).toBeGreaterThan(0);
  });

  it('says where bad JSON on the standard input is (exit 2)', () => {
    const r = cli(['run', '-'], { input: '{ "tasks": [ }' });
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/not valid JSON/);
  });
});

describe('quadspread run --format html', () => {
  it('writes one self-contained page with job text as text, never as markup', () => {
    const job = {
      title: '<script>alert(1)</script>',
      points: {
        '<img src=x onerror=alert(1)>': { east: 0, north: 0 },
        B: { east: 10, north: 0 },
        C: { east: 0, north: 10 },
      },
      tasks: [{ kind: 'area', name: 'a & b', points: ['<img src=x onerror=alert(1)>', 'B', 'C'] }],
    };
    const r = cli(['run', '-', '--format', 'html'], { input: JSON.stringify(job) });
    expect(r.code).toBe(0);
    expect(r.stdout.startsWith('<!doctype html>')).toBe(true);
    expect(r.stdout).not.toMatch(/<script|<img|<link|src="http/);
    expect(r.stdout).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(r.stdout).toContain('a &amp; b');
    expect(r.stdout).toContain('<p class="summary" id="verdict">');
  });
});
