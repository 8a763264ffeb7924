// Output formats as a subprocess: JSON reports against docs/report-schema.json (ajv), the
// published schemas against the runner's own, every example job against the job schema,
// the SVG sketch parsed as XML by an independent parser (Python's xml.etree), Markdown.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Ajv2020 from 'ajv/dist/2020';
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

const root = resolve(__dirname, '../..');
const readJson = (f: string) => JSON.parse(readFileSync(resolve(root, f), 'utf8'));
function ajv() {
  const a = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true });
  a.addKeyword('x-describe'); // our annotation naming the expected value in messages
  return a;
}
let dir: string;

beforeAll(async () => {
  await bundleCli();
  dir = tempFolder();
});
afterAll(cleanUp);

describe('published schemas', () => {
  it('docs/job-schema.json and docs/report-schema.json are what the runner uses (quadspread schema …)', () => {
    expect(JSON.parse(cli(['schema', 'job']).stdout)).toEqual(readJson('docs/job-schema.json'));
    expect(JSON.parse(cli(['schema', 'report']).stdout)).toEqual(
      readJson('docs/report-schema.json'),
    );
  });

  it('every example job is valid for ajv against docs/job-schema.json and runs with exit 0', () => {
    const validate = ajv().compile(readJson('docs/job-schema.json'));
    const files = readdirSync(resolve(root, 'examples')).filter((f) => f.endsWith('.json'));
    expect(files.length).toBeGreaterThan(1);
    for (const f of files) {
      const ok = validate(readJson(`examples/${f}`));
      expect({ f, ok, errors: validate.errors ?? null }).toEqual({ f, ok: true, errors: null });
      const r = cli(['run', resolve(root, 'examples', f)]);
      expect({ f, code: r.code, stderr: r.stderr }).toEqual({ f, code: 0, stderr: '' });
    }
    // one CLI process per example job: 0.3 s each on an idle machine, several times that under load
  }, 180_000);

  it('ajv rejects the jobs that the runner rejects with exit 2 for breaking the schema', () => {
    const validate = ajv().compile(readJson('docs/job-schema.json'));
    const bad = [
      { tasks: [] },
      { tasks: [{ kind: 'area', points: 'A B C' }] },
      { tasks: [{ kind: 'heigth' }] },
      { tasks: [{ kind: 'area', points: ['A', 'B', 'C'], colour: 'red' }] },
      { units: { length: 'furlong' }, tasks: [{ kind: 'area', points: ['A', 'B', 'C'] }] },
      { tasks: [{ kind: 'height', readings: [{ horizontal: '10 m' }] }] },
    ];
    bad.forEach((job, i) => {
      expect(validate(job)).toBe(false);
      const f = join(dir, `bad-${i}.json`);
      writeFileSync(f, JSON.stringify(job));
      expect(cli(['run', f]).code).toBe(2);
    });
  });
});

describe('quadspread demo --format json', () => {
  it.each(['rational', 'decimal', 'float'])(
    'is valid against docs/report-schema.json with --arithmetic %s',
    (arithmetic) => {
      const r = cli(['demo', '--format', 'json', '--arithmetic', arithmetic, '--digits', '8']);
      expect(r.code).toBe(0);
      const report = JSON.parse(r.stdout);
      const validate = ajv().compile(readJson('docs/report-schema.json'));
      expect(validate.errors ?? validate(report)).toBe(true);
      expect(report.arithmetic).toMatch(
        arithmetic === 'decimal' ? /^decimal\(18\)$/ : new RegExp(`^${arithmetic}$`),
      );
      expect(report.caution).toMatch(/check .*independently/);
    },
  );

  it('gives the same values in every arithmetic to the digits shown', () => {
    const get = (a: string) =>
      JSON.parse(cli(['demo', '--format', 'json', '--arithmetic', a, '--digits', '8']).stdout);
    const [r, d, f] = ['rational', 'decimal', 'float'].map(get);
    r.tasks.forEach((t: { results: { name: string; value: string }[] }, i: number) => {
      t.results.forEach((q, j) => {
        const scale = Math.max(Math.abs(Number(q.value)), 1e-300);
        expect(
          Math.abs(Number(d.tasks[i].results[j].value) - Number(q.value)) / scale,
        ).toBeLessThan(1e-7);
        expect(
          Math.abs(Number(f.tasks[i].results[j].value) - Number(q.value)) / scale,
        ).toBeLessThan(1e-6);
      });
    });
    // three CLI runs of the demo job (each with its uncertainty pass)
  }, 90_000);
});

describe('quadspread demo --sketch', () => {
  it('writes an SVG that an XML parser reads, with a panel per view, stations, sight lines and labels', () => {
    const svg = join(dir, 'demo.svg');
    const r = cli(['demo', '--sketch', svg, '--out', join(dir, 'demo.txt')]);
    expect(r.code).toBe(0);
    // Python's standard XML parser: an implementation independent of ours.
    const py = spawnSync(
      'python3',
      [
        '-c',
        `
import json, sys, xml.etree.ElementTree as ET
ns = {'s': 'http://www.w3.org/2000/svg'}
root = ET.parse(sys.argv[1]).getroot()
panels = root.findall('s:g', ns)
print(json.dumps({
  'tag': root.tag,
  'title': root.find('s:title', ns).text,
  'panels': [p.get('id') for p in panels],
  'classes': sorted({e.get('class') for e in root.iter() if e.get('class')}),
  'texts': [t.text for t in root.iter('{http://www.w3.org/2000/svg}text')],
}))`,
        svg,
      ],
      { encoding: 'utf8' },
    );
    if (py.error)
      throw new Error(
        `this test needs python3 (its XML parser is independent of ours): ${py.error.message}`,
      );
    expect(py.stderr).toBe('');
    const parsed = JSON.parse(py.stdout);
    expect(parsed.tag).toBe('{http://www.w3.org/2000/svg}svg');
    expect(parsed.title).toMatch(/^quadspread sketch: Demonstration job/);
    expect(parsed.panels).toContain('task-2-plan-1');
    expect(parsed.panels).toContain('task-2-elevation-2');
    expect(parsed.panels).toContain('task-3-elevation-2');
    expect(parsed.classes).toEqual(
      expect.arrayContaining([
        'station',
        'target',
        'sight',
        'foot',
        'course',
        'boundary',
        'panel plan',
        'panel elevation',
      ]),
    );
    expect(parsed.texts).toEqual(
      expect.arrayContaining(['HB (foot)', 'H1', 'H2', 'C0', 'C475', 'mast top', 'CM2', 'QC']),
    );
    expect(parsed.texts.some((t: string) => /^h = 38\.5\d* m$/.test(t))).toBe(true);
    expect(parsed.texts.join(' ')).toMatch(/computational aid/);
  });
});

describe('quadspread demo --format markdown', () => {
  it('writes headings, result and check tables, and ends with the caution', () => {
    const r = cli(['demo', '--format', 'markdown']);
    expect(r.code).toBe(0);
    expect(r.stdout.startsWith('# Demonstration job')).toBe(true);
    expect(r.stdout).toContain('| quantity | value | ± σ | budget (share of variance) |');
    expect(r.stdout).toContain('| check | value and limit | result |');
    expect(r.stdout).toContain('**Level book, rise and fall, with the misclosure distributed**');
    // Exact forms and machine keys only with --detail.
    expect(r.stdout).not.toContain('`527/576`');
    const d = cli(['demo', '--format', 'markdown', '--detail']);
    expect(d.stdout).toContain(
      '| quantity | value | ± σ | exact form | budget (share of variance) |',
    );
    expect(d.stdout).toContain('`527/576`');
    expect(r.stdout.trimEnd()).toMatch(/> \*\*Caution\.\*\* .*licensed practice\.$/);
  });
});

describe('docs/cli.md', () => {
  const doc = readFileSync(resolve(root, 'docs/cli.md'), 'utf8');
  it('documents every task kind and every field of each', () => {
    const schema = readJson('docs/job-schema.json');
    const kinds = schema.properties.tasks.items.oneOf as {
      properties: Record<string, { const?: string }>;
    }[];
    expect(kinds.length).toBeGreaterThanOrEqual(10);
    for (const k of kinds) {
      const kind = k.properties.kind!.const!;
      expect(doc).toContain(`**\`${kind}\`**`);
      const section = doc.slice(doc.indexOf(`**\`${kind}\`**`)).split('\n\n')[0]!;
      for (const field of Object.keys(k.properties).filter(
        (f) => f !== 'kind' && f !== 'name' && f !== 'correlations',
      )) {
        expect({ kind, field, documented: section.includes(`\`${field}\``) }).toEqual({
          kind,
          field,
          documented: true,
        });
      }
    }
  });

  it('documents the fields every task has', () => {
    for (const field of ['kind', 'name', 'correlations']) expect(doc).toContain(`\`${field}\``);
  });

  it('documents every batch kind and its columns', () => {
    const help = cli(['batch', '--help']).stdout;
    for (const kind of ['inverses', 'triangles', 'heights']) {
      expect(help).toContain(kind);
      expect(doc).toContain(`| \`${kind}\` |`);
    }
  });
});

describe('quadspread demo says what its uncertainties are', () => {
  it('states once, at the top of text and Markdown, that ± is the standard uncertainty and what a budget share is', () => {
    const text = cli(['demo']).stdout.split('\n');
    const legend = text.filter((l) => l.startsWith('± is the standard uncertainty'));
    expect(legend).toEqual([
      "± is the standard uncertainty (k = 1, first order); a budget gives each input's share of the",
    ]);
    // It comes before the first task.
    expect(text.indexOf(legend[0]!)).toBeLessThan(text.findIndex((l) => l.startsWith('[1]')));
    const md = cli(['demo', '--format', 'markdown']).stdout;
    expect(md).toContain('± σ is the standard uncertainty (k = 1, first order)');
  });
});
