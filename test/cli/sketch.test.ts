// The SVG sketch, parsed with fast-xml-parser (an XML parser independent of the code that writes
// it): no two labels overlap in the demo or in any example job, every label lies in its panel,
// the scale bar's length agrees with the drawing scale measured between two given points, plans
// carry a north arrow and every panel a legend, lines carry bearings and distances computed here
// from the job's own coordinates, the misclosure has its unit, and a levelling job gets a profile
// with one staff per booked reading.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { XMLParser } from 'fast-xml-parser';
import { bundleCli, cleanUp, cli, tempFolder } from './helpers';

const root = resolve(__dirname, '../..');
let dir: string;
beforeAll(async () => {
  await bundleCli();
  dir = tempFolder();
});
afterAll(cleanUp);

type Node = Record<string, unknown>;
interface Label {
  cls: string;
  text: string;
  box: { x: number; y: number; w: number; h: number };
}
interface Panel {
  id: string;
  node: Node;
  frame: { x: number; y: number; w: number; h: number };
  labels: Label[];
}

const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '',
  textNodeName: '#text',
  isArray: (name) => ['g', 'text', 'line', 'circle', 'path', 'rect'].includes(name),
});

function sketchOf(args: string[]): { panels: Panel[]; svg: string } {
  const file = join(dir, `s${Math.random().toString(36).slice(2)}.svg`);
  const r = cli([...args, '--sketch', file, '--out', join(dir, 'report.txt')]);
  expect(r.code, r.stderr).toBe(0);
  const svg = readFileSync(file, 'utf8');
  const doc = parser.parse(svg) as { svg: Node };
  const style = String(doc.svg.style);
  // font sizes as the stylesheet states them
  const size = (cls: string): number => {
    const m = new RegExp(`\\.${cls} \\{ font: (?:italic |bold )?(\\d+)px`).exec(style);
    if (!m) throw new Error(`no font size for .${cls}`);
    return Number(m[1]);
  };
  const panels = ((doc.svg.g as Node[]) ?? []).map((g): Panel => {
    const rect = (g.rect as Node[])[0]!;
    const labels = ((g.text as Node[]) ?? [])
      .filter((t) => t.textLength !== undefined)
      .map((t) => {
        const cls = String(t.class);
        const s = size(cls);
        // the renderer fits the glyphs to textLength; the line box is the font size high
        // (ascent above the baseline, descent below: 1.25 em in all)
        return {
          cls,
          text: String(t['#text']),
          box: { x: Number(t.x), y: Number(t.y) - s, w: Number(t.textLength), h: 1.25 * s },
        };
      });
    return {
      id: String(g.id),
      node: g,
      frame: {
        x: Number(rect.x),
        y: Number(rect.y),
        w: Number(rect.width),
        h: Number(rect.height),
      },
      labels,
    };
  });
  return { panels, svg };
}

const overlap = (a: Label['box'], b: Label['box']) =>
  a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

function expectNoCollisions(panels: Panel[], what: string): void {
  for (const p of panels) {
    for (const l of p.labels) {
      const inside =
        l.box.x >= p.frame.x &&
        l.box.y >= p.frame.y &&
        l.box.x + l.box.w <= p.frame.x + p.frame.w &&
        l.box.y + l.box.h <= p.frame.y + p.frame.h;
      expect(inside, `${what} ${p.id}: "${l.text}" outside its panel`).toBe(true);
    }
    for (let i = 0; i < p.labels.length; i++)
      for (let j = i + 1; j < p.labels.length; j++) {
        const a = p.labels[i]!,
          b = p.labels[j]!;
        expect(overlap(a.box, b.box), `${what} ${p.id}: "${a.text}" overlaps "${b.text}"`).toBe(
          false,
        );
      }
  }
}

const demoJob = JSON.parse(readFileSync(join(root, 'examples/demo.json'), 'utf8')) as {
  points: Record<string, { east: number | { value: number }; north: number | { value: number } }>;
  tasks: { kind: string; sights?: Record<string, unknown>[] }[];
};
const coord = (name: string): [number, number] => {
  const p = demoJob.points[name]!;
  const v = (c: number | { value: number }) => (typeof c === 'number' ? c : c.value);
  return [v(p.east), v(p.north)];
};

describe('the sketch of the demo job', () => {
  let panels: Panel[];
  let svg: string;
  beforeAll(() => {
    ({ panels, svg } = sketchOf(['demo']));
  });

  it('places every label inside its panel, no two overlapping', () => {
    expect(panels.length).toBeGreaterThan(5);
    expect(panels.reduce((n, p) => n + p.labels.length, 0)).toBeGreaterThan(40);
    expectNoCollisions(panels, 'demo');
    expect(svg).not.toContain('left out');
  });

  it('gives every panel a legend, and oriented plans a north arrow', () => {
    for (const p of panels) {
      const groups = (p.node.g as Node[]) ?? [];
      expect(
        groups.some((g) => g.class === 'legend'),
        p.id,
      ).toBe(true);
    }
    const parcel = panels.find((p) => /Parcel/.test(JSON.stringify(p.node.text)))!;
    expect(((parcel.node.g as Node[]) ?? []).some((g) => g.class === 'north-arrow')).toBe(true);
  });

  it('draws the scale bar at the drawing scale measured between two given points', () => {
    const parcel = panels.find((p) => /Parcel/.test(JSON.stringify(p.node.text)))!;
    const circles = (parcel.node.circle as Node[]).filter((c) => c['data-name'] !== undefined);
    const at = (name: string) => {
      const c = circles.find((k) => k['data-name'] === name)!;
      return [Number(c.cx), Number(c.cy)] as const;
    };
    const [x1, y1] = at('Q1');
    const [x3, y3] = at('Q3');
    const [e1, n1] = coord('Q1');
    const [e3, n3] = coord('Q3');
    // pixels per metre between Q1 and Q3, from the job's coordinates (north up: y flips)
    const scale = Math.hypot(x3 - x1, y3 - y1) / Math.hypot(e3 - e1, n3 - n1);
    expect((x3 - x1) / (e3 - e1)).toBeCloseTo(scale, 2);
    expect((y1 - y3) / (n3 - n1)).toBeCloseTo(scale, 2);
    const bar = ((parcel.node.g as Node[]) ?? []).find((g) => g.class === 'scale')!;
    expect(bar['data-unit']).toBe('m');
    const line = (bar.line as Node[]).find((l) => l.class === 'scale-bar')!;
    const px = Number(line.x2) - Number(line.x1);
    // the bar is a round length: 1, 2 or 5 × a power of ten
    const L = Number(bar['data-length']);
    expect(/^[125]0*$|^0\.0*[125]$/.test(String(L))).toBe(true);
    expect(Math.abs(px - L * scale)).toBeLessThan(0.05);
    expect(JSON.stringify(bar.text)).toContain(`${L} m`);
  });

  it('writes each boundary line of the parcel with its bearing and distance', () => {
    const parcel = panels.find((p) => /Parcel/.test(JSON.stringify(p.node.text)))!;
    const texts = parcel.labels.map((l) => l.text);
    // Q1 → Q2 by hand from the job's coordinates, with Math.atan2 and Math.hypot
    const [e1, n1] = coord('Q1');
    const [e2, n2] = coord('Q2');
    const az = (Math.atan2(e2 - e1, n2 - n1) * 180) / Math.PI;
    const s = Math.round(((az + 360) % 360) * 3600);
    const dms = `${Math.floor(s / 3600)}°${String(Math.floor((s % 3600) / 60)).padStart(2, '0')}′${String(s % 60).padStart(2, '0')}″`;
    const d = Math.hypot(e2 - e1, n2 - n1).toFixed(3);
    expect(texts).toContain(`${dms}  ${d} m`);
  });

  it('states the unit of the traverse misclosure', () => {
    const all = panels.flatMap((p) => p.labels.map((l) => l.text));
    expect(all.some((t) => /^misclosure -?[\d.e-]+ m E, -?[\d.e-]+ m N$/.test(t))).toBe(true);
  });

  it('draws the levelling run as a profile: one staff per booked reading, labelled', () => {
    const run = demoJob.tasks.find((t) => t.kind === 'levelling')!;
    const readings = run.sights!.flatMap((s) =>
      (['bs', 'is', 'fs'] as const)
        .filter((k) => s[k] !== undefined)
        .map((k) => `${k.toUpperCase()} ${Number(s[k]).toFixed(3)}`),
    );
    const profile = panels.find((p) => JSON.stringify(p.node.text).includes('Levelling profile'))!;
    expect(profile.id).toMatch(/-elevation-/);
    const staves = (profile.node.line as Node[]).filter((l) => l.class === 'staff');
    expect(staves.length).toBe(readings.length);
    // every staff is vertical
    for (const l of staves) expect(Number(l.x1)).toBe(Number(l.x2));
    expect(profile.labels.map((l) => l.text)).toEqual(expect.arrayContaining(readings));
    expect(profile.labels.some((l) => /^misclosure -?[\d.]+ mm$/.test(l.text))).toBe(true);
    // one line of collimation per set-up (a backsight that a foresight closes)
    const setups = run.sights!.filter((s) => s.fs !== undefined).length;
    expect((profile.node.line as Node[]).filter((l) => l.class === 'collimation').length).toBe(
      setups,
    );
  });
});

describe('the sketches of the example jobs', () => {
  const files = readdirSync(join(root, 'examples')).filter((f) => f.endsWith('.json'));
  it.each(files)('%s: labels inside their panels, none overlapping', (f) => {
    const { panels, svg } = sketchOf(['run', join(root, 'examples', f)]);
    expectNoCollisions(panels, f);
    expect(svg).not.toContain('left out');
  });
});
