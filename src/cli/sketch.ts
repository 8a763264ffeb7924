/**
 * The SVG sketch: one panel per view (plan views with north up; elevation views with
 * height up), each fitted to its own extent at one scale in both directions (heights of
 * long, low elevation views exaggerated by a stated whole factor), labelled with the
 * computed values. A drawing to check a configuration by eye, not a plan to
 * set out from.
 *
 * Each panel has a legend of what its lines and marks mean, a scale bar (when the view states
 * its length unit and is drawn to scale across), a north arrow on plans that are oriented, and
 * labels placed so that no two overlap: each label tries candidate positions around its anchor
 * (a point, the middle of a line) in order, nearest first, and takes the first whose box is free
 * of every label, mark, legend and bar already placed (a greedy placement; a label that finds no
 * free place within the panel is left out and counted in the caption). A label's box is its
 * font size high and its stated width wide: every label carries `textLength`, so the renderer
 * fits the glyphs to the width the placement reserved.
 *
 * @module cli
 */
import type { Report, SketchView } from './report.js';
import { visibleControls } from './escape.js';

const WIDTH = 720;
const PANEL = 440;
const MARGIN = 48;
/** Width of the right-hand column kept for the legend and the north arrow. */
const LEGEND_W = 150;

/** Escapes text for XML character data and attribute values. */
export function xmlEscape(text: string): string {
  // XML 1.0 §2.2 allows no C0 control character but tab and line breaks: shown escaped.
  return visibleControls(text)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

function n(x: number): string {
  return Number.isFinite(x) ? (Math.round(x * 100) / 100).toString() : '0';
}

const STYLE = `
  .panel-frame { fill: #fcfcf8; stroke: #888; stroke-width: 1; }
  .panel-title { font: bold 14px sans-serif; fill: #222; }
  .caption { font: 11px sans-serif; fill: #555; }
  .label { font: 12px sans-serif; fill: #111; }
  .note { font: italic 11px sans-serif; fill: #1a4f8a; }
  .measure { font: 10px sans-serif; fill: #444; }
  .legend-text { font: 10px sans-serif; fill: #333; }
  .legend-frame { fill: #fff; stroke: #bbb; stroke-width: 0.8; }
  line.leader { stroke: #999; stroke-width: 0.6; }
  line.scale-bar { stroke: #222; stroke-width: 3; }
  line.scale-tick { stroke: #222; stroke-width: 1; }
  line.sight { stroke: #1a4f8a; stroke-width: 1; stroke-dasharray: 5 3; }
  line.course, line.boundary { stroke: #222; stroke-width: 1.5; }
  line.adjusted { stroke: #b35900; stroke-width: 1; stroke-dasharray: 2 2; }
  line.base, line.ground { stroke: #5a7d2a; stroke-width: 2; }
  line.path { stroke: #a02020; stroke-width: 2; }
  line.straight { stroke: #222; stroke-width: 1.5; }
  line.arc { stroke: #a02020; stroke-width: 2.5; }
  line.transition { stroke: #b35900; stroke-width: 2; stroke-dasharray: 6 3; }
  line.tick { stroke: #555; stroke-width: 1; }
  line.staff { stroke: #a02020; stroke-width: 2; }
  line.collimation { stroke: #1a4f8a; stroke-width: 1; stroke-dasharray: 4 2; }
  circle.station { fill: #fff; stroke: #222; stroke-width: 1.5; }
  circle.control { fill: #222; }
  circle.target { fill: #a02020; }
  circle.computed { fill: #fff; stroke: #b35900; stroke-width: 1.5; }
  path.foot { stroke: #a02020; stroke-width: 1.5; fill: none; }
  path.north { fill: #222; }
`;

/** What each role means, for the legend. */
const POINT_LEGEND: Record<SketchView['points'][number]['role'], string> = {
  station: 'instrument station',
  control: 'known point',
  target: 'observed point',
  foot: 'foot of the point',
  computed: 'computed point',
};
const LINE_LEGEND: Record<SketchView['lines'][number]['role'], string> = {
  sight: 'line of sight',
  course: 'course as measured',
  boundary: 'boundary',
  base: 'base / height',
  path: 'path',
  adjusted: 'adjusted course',
  ground: 'ground',
  straight: 'straight',
  arc: 'circular arc',
  transition: 'transition',
  tick: 'tick',
  staff: 'staff (BS, IS, FS)',
  collimation: 'line of collimation',
};

/** Font size in px of each text class. */
const FONT: Record<string, number> = { label: 12, note: 11, measure: 10 };
/** Width of a character as a fraction of the font size (sans-serif, generous). */
const CHAR_EM = 0.6;

/** A box in panel pixels: left, top, width, height. */
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Whether two boxes overlap (touching edges do not). */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

/** The box of a text of `size` px whose baseline starts at (x, y), `w` wide. */
function textBox(x: number, y: number, w: number, size: number): Box {
  return { x, y: y - size, w, h: size * 1.25 };
}

/** Greedy label placement: reserved boxes, then labels one by one at the first free candidate. */
class Placer {
  private readonly taken: Box[] = [];
  constructor(private readonly bounds: Box) {}
  reserve(b: Box): void {
    this.taken.push(b);
  }
  /** The first candidate box (in order) inside the bounds and free of every taken box. */
  take(candidates: Box[]): Box | undefined {
    for (const b of candidates) {
      if (
        b.x < this.bounds.x ||
        b.y < this.bounds.y ||
        b.x + b.w > this.bounds.x + this.bounds.w ||
        b.y + b.h > this.bounds.y + this.bounds.h
      )
        continue;
      if (this.taken.some((t) => boxesOverlap(t, b))) continue;
      this.taken.push(b);
      return b;
    }
    return undefined;
  }
}

/** Candidate boxes of a text `w` × `size` around an anchor, nearest rings first. */
function around(cx: number, cy: number, w: number, size: number, gap: number): Box[] {
  const out: Box[] = [];
  for (const r of [1, 2, 3, 4.5, 6.5]) {
    const d = gap * r;
    const dirs: [number, number][] = [
      [d, -d], // north-east
      [d, size / 2 - 1], // east
      [d, d + size * 0.8], // south-east
      [-w / 2, -d], // north
      [-w / 2, d + size], // south
      [-d - w, -d], // north-west
      [-d - w, size / 2 - 1], // west
      [-d - w, d + size * 0.8], // south-west
    ];
    for (const [dx, dy] of dirs) out.push(textBox(cx + dx, cy + dy, w, size));
  }
  return out;
}

/** Candidate boxes beside the middle of a segment: off the line on either side, then along it. */
function besideLine(
  x1: number,
  y1: number,
  x2: number,
  y2: number,
  w: number,
  size: number,
): Box[] {
  const len = Math.hypot(x2 - x1, y2 - y1) || 1;
  const nx = -(y2 - y1) / len,
    ny = (x2 - x1) / len;
  const out: Box[] = [];
  for (const along of [0.5, 0.35, 0.65, 0.2, 0.8]) {
    const mx = x1 + (x2 - x1) * along,
      my = y1 + (y2 - y1) * along;
    for (const off of [6, 14, 26]) {
      for (const side of [1, -1]) {
        // the box's centre off the line by `off` plus half its extent along the normal
        const hx = (Math.abs(nx) * w) / 2 + 2,
          hy = (Math.abs(ny) * size * 1.25) / 2 + 2;
        const cx = mx + side * nx * (off + hx),
          cy = my + side * ny * (off + hy);
        out.push(textBox(cx - w / 2, cy + size * 0.4, w, size));
      }
    }
  }
  return out;
}

/** A round length (1, 2 or 5 × 10^k) at most `max`. */
export function roundLength(max: number): number {
  const p = 10 ** Math.floor(Math.log10(max));
  for (const m of [5, 2, 1]) if (m * p <= max) return m * p;
  return p;
}

/** Bearing (azimuth) of a plan direction in whole seconds, as d°mm′ss″. */
function bearingText(dx: number, dy: number): string {
  let s = Math.round(((Math.atan2(dx, dy) * 180) / Math.PI) * 3600);
  s = ((s % 1296000) + 1296000) % 1296000;
  const d = Math.floor(s / 3600),
    m = Math.floor((s % 3600) / 60),
    sec = s % 60;
  return `${d}°${String(m).padStart(2, '0')}′${String(sec).padStart(2, '0')}″`;
}

/** A text element with its width fixed (textLength), so the placed box is the drawn box. */
function text(cls: string, b: Box, size: number, body: string, extra = ''): string {
  const y = b.y + size;
  return `<text class="${cls}" x="${n(b.x)}" y="${n(y)}" textLength="${n(b.w)}" lengthAdjust="spacingAndGlyphs"${extra}>${xmlEscape(body)}</text>`;
}

function width(body: string, size: number): number {
  return Math.max(1, [...body].length) * size * CHAR_EM;
}

function panel(view: SketchView, top: number, id: string): string {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const p of view.points) {
    xs.push(p.x);
    ys.push(p.y);
  }
  for (const l of view.lines) {
    xs.push(l.x1, l.x2);
    ys.push(l.y1, l.y2);
  }
  for (const t of view.notes) {
    xs.push(t.x);
    ys.push(t.y);
  }
  let minX = Math.min(...xs, Infinity),
    maxX = Math.max(...xs, -Infinity);
  let minY = Math.min(...ys, Infinity),
    maxY = Math.max(...ys, -Infinity);
  if (!Number.isFinite(minX)) {
    minX = 0;
    maxX = 1;
    minY = 0;
    maxY = 1;
  }
  const spanX = Math.max(maxX - minX, 1e-9),
    spanY = Math.max(maxY - minY, 1e-9);
  // The drawing area: room around it for labels, the legend column on the right, the scale
  // bar below.
  const left = MARGIN,
    innerW = WIDTH - MARGIN - LEGEND_W - MARGIN,
    innerH = PANEL - 2 * MARGIN - 40;
  const scale = Math.min(innerW / spanX, innerH / spanY);
  // Elevation views of long, low sights: heights exaggerated (by a whole factor, at most 10
  // unless the view allows more).
  const cap = view.maxExaggeration ?? 10;
  let exaggeration = 1;
  if (view.view === 'elevation' && spanY * scale < innerH / 3) {
    const want = Math.max(1, Math.floor(innerH / 2 / (spanY * scale)));
    exaggeration = Math.min(cap, want > 10 ? roundLength(want) : want);
  }
  const ox = left + (innerW - spanX * scale) / 2;
  const oy = top + MARGIN + 28 + (innerH - spanY * scale * exaggeration) / 2;
  const X = (x: number): number => ox + (x - minX) * scale;
  const Y = (y: number): number => oy + (maxY - y) * scale * exaggeration;
  const parts: string[] = [];
  parts.push(
    `<g class="panel ${view.view}" id="${id}" data-scale="${scale}" data-exaggeration="${exaggeration}">`,
  );
  parts.push(
    `<rect class="panel-frame" x="8" y="${n(top + 8)}" width="${WIDTH - 16}" height="${PANEL - 16}"/>`,
  );
  parts.push(`<text class="panel-title" x="20" y="${n(top + 30)}">${xmlEscape(view.title)}</text>`);
  const oriented = view.view === 'plan' && (view.north ?? view.caption === undefined);
  const caption =
    view.caption ??
    (view.view === 'plan'
      ? 'plan: x east, y north'
      : 'elevation: horizontal distance across, height up');
  const exaggerated = exaggeration > 1 ? `; heights exaggerated ×${exaggeration}` : '';
  // Everything placed so far and every fixed furniture box is reserved; labels go round them.
  const placer = new Placer({ x: 12, y: top + 52, w: WIDTH - 24, h: PANEL - 52 - 14 });
  const body: string[] = [];
  // Legend, top right: one row per role used.
  const entries: { kind: 'point' | 'line'; role: string; text: string }[] = [];
  for (const role of new Set(view.points.map((p) => p.role)))
    entries.push({ kind: 'point', role, text: POINT_LEGEND[role] });
  for (const role of new Set(view.lines.map((l) => l.role)))
    entries.push({ kind: 'line', role, text: LINE_LEGEND[role] });
  const lx = WIDTH - LEGEND_W - 4;
  const ly = top + 52 + (oriented ? 44 : 0);
  if (entries.length > 0) {
    const lh = 14 * entries.length + 22;
    placer.reserve({ x: lx, y: ly, w: LEGEND_W - 8, h: lh });
    body.push(`<g class="legend">`);
    body.push(
      `<rect class="legend-frame" x="${n(lx)}" y="${n(ly)}" width="${LEGEND_W - 8}" height="${lh}"/>`,
    );
    body.push(`<text class="legend-text" x="${n(lx + 6)}" y="${n(ly + 13)}">Legend</text>`);
    entries.forEach((e, i) => {
      const y = ly + 28 + 14 * i;
      if (e.kind === 'line')
        body.push(
          `<line class="${e.role}" x1="${n(lx + 6)}" y1="${n(y - 4)}" x2="${n(lx + 30)}" y2="${n(y - 4)}"/>`,
        );
      else if (e.role === 'foot')
        body.push(
          `<path class="foot" d="M ${n(lx + 14)} ${n(y - 8)} L ${n(lx + 22)} ${n(y)} M ${n(lx + 14)} ${n(y)} L ${n(lx + 22)} ${n(y - 8)}"/>`,
        );
      else body.push(`<circle class="${e.role}" cx="${n(lx + 18)}" cy="${n(y - 4)}" r="4"/>`);
      body.push(
        `<text class="legend-text" x="${n(lx + 36)}" y="${n(y)}">${xmlEscape(e.text)}</text>`,
      );
    });
    body.push('</g>');
  }
  // North arrow, above the legend.
  if (oriented) {
    const ax = WIDTH - 40,
      ay = top + 54;
    placer.reserve({ x: ax - 10, y: ay - 2, w: 20, h: 38 });
    body.push(
      `<g class="north-arrow"><path class="north" d="M ${ax} ${ay} L ${ax - 6} ${ay + 18} L ${ax + 6} ${ay + 18} Z"/><text class="label" x="${ax - 4}" y="${ay + 32}">N</text></g>`,
    );
  }
  // Scale bar, bottom left: a round length of about a quarter of the drawing's width.
  if (view.unit !== undefined && view.toScale !== false) {
    const L = roundLength(innerW / 4 / scale);
    const px = L * scale;
    const bx = 24,
      by = top + PANEL - 30;
    placer.reserve({ x: bx - 4, y: by - 16, w: px + 8 + 60, h: 24 });
    const label = `${+L.toPrecision(12)} ${view.unit}`;
    body.push(
      `<g class="scale" data-length="${+L.toPrecision(12)}" data-unit="${xmlEscape(view.unit)}">` +
        `<line class="scale-bar" x1="${n(bx)}" y1="${n(by)}" x2="${n(bx + px)}" y2="${n(by)}"/>` +
        `<line class="scale-tick" x1="${n(bx)}" y1="${n(by - 5)}" x2="${n(bx)}" y2="${n(by + 3)}"/>` +
        `<line class="scale-tick" x1="${n(bx + px)}" y1="${n(by - 5)}" x2="${n(bx + px)}" y2="${n(by + 3)}"/>` +
        `<text class="caption" x="${n(bx)}" y="${n(by - 7)}">0</text>` +
        `<text class="caption" x="${n(bx + px + 6)}" y="${n(by + 4)}">${xmlEscape(label)}</text>` +
        `</g>`,
    );
  }
  // Lines, then marks (reserved so that no label covers one).
  for (const l of view.lines) {
    body.push(
      `<line class="${l.role}" x1="${n(X(l.x1))}" y1="${n(Y(l.y1))}" x2="${n(X(l.x2))}" y2="${n(Y(l.y2))}"/>`,
    );
  }
  for (const p of view.points) {
    const cx = X(p.x),
      cy = Y(p.y);
    placer.reserve({ x: cx - 5, y: cy - 5, w: 10, h: 10 });
    if (p.role === 'foot') {
      body.push(
        `<path class="foot" d="M ${n(cx - 5)} ${n(cy - 5)} L ${n(cx + 5)} ${n(cy + 5)} M ${n(cx - 5)} ${n(cy + 5)} L ${n(cx + 5)} ${n(cy - 5)}"/>`,
      );
    } else {
      body.push(
        `<circle class="${p.role}" cx="${n(cx)}" cy="${n(cy)}" r="${p.role === 'target' ? 5 : 4}" data-name="${xmlEscape(p.name)}"/>`,
      );
    }
  }
  // Labels: names of points first, then the labels of lines, then free notes.
  let dropped = 0;
  const labels: string[] = [];
  const put = (
    cls: string,
    body: string,
    candidates: (w: number, s: number) => Box[],
    ax: number,
    ay: number,
  ) => {
    const size = FONT[cls]!;
    const w = width(body, size);
    const b = placer.take(candidates(w, size));
    if (!b) {
      dropped++;
      return;
    }
    // A leader from the anchor when the label had to move away from it.
    const far = Math.hypot(b.x + b.w / 2 - ax, b.y + b.h / 2 - ay) > 20 + b.w / 2;
    if (far) {
      const tx = Math.min(Math.max(ax, b.x), b.x + b.w),
        ty = Math.min(Math.max(ay, b.y), b.y + b.h);
      labels.push(`<line class="leader" x1="${n(ax)}" y1="${n(ay)}" x2="${n(tx)}" y2="${n(ty)}"/>`);
    }
    labels.push(text(cls, b, size, body));
  };
  for (const p of view.points) {
    const cx = X(p.x),
      cy = Y(p.y);
    put('label', p.name, (w, s) => around(cx, cy, w, s, 7), cx, cy);
  }
  for (const l of view.lines) {
    const x1 = X(l.x1),
      y1 = Y(l.y1),
      x2 = X(l.x2),
      y2 = Y(l.y2);
    const texts: [string, string][] = [];
    if (l.label) texts.push(['note', l.label]);
    if (l.measure && view.view === 'plan' && view.unit !== undefined) {
      const dx = l.x2 - l.x1,
        dy = l.y2 - l.y1;
      const d = Math.hypot(dx, dy);
      if (d > 0)
        texts.push([
          'measure',
          `${bearingText(dx, dy)}  ${d.toFixed(view.decimals ?? 3)} ${view.unit}`,
        ]);
    }
    for (const [cls, t] of texts)
      put(cls, t, (w, s) => besideLine(x1, y1, x2, y2, w, s), (x1 + x2) / 2, (y1 + y2) / 2);
  }
  for (const t of view.notes) {
    const cx = X(t.x),
      cy = Y(t.y);
    put(
      'note',
      t.text,
      (w, s) => [textBox(cx + 7, cy + 16, w, s), ...around(cx, cy, w, s, 9)],
      cx,
      cy,
    );
  }
  const missing = dropped > 0 ? `; ${dropped} label(s) left out for want of room` : '';
  parts.push(
    `<text class="caption" x="20" y="${n(top + 46)}">${xmlEscape(caption + exaggerated + missing)}; not to be scaled from</text>`,
  );
  parts.push(...body, ...labels, '</g>');
  return parts.join('\n');
}

/**
 * The sketch of a report as SVG text: every view of every task, one panel each, then the
 * caution. Returns a single panel saying so when no task has anything to draw.
 */
export function renderSketch(report: Report): string {
  const views: { view: SketchView; id: string }[] = [];
  for (const t of report.tasks) {
    (t.sketch ?? []).forEach((v, i) =>
      views.push({
        view: { ...v, title: `${t.index + 1}. ${v.title}` },
        id: `task-${t.index + 1}-${v.view}-${i + 1}`,
      }),
    );
  }
  const height = Math.max(1, views.length) * PANEL + 60;
  const out: string[] = [];
  out.push('<?xml version="1.0" encoding="UTF-8"?>');
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${height}" viewBox="0 0 ${WIDTH} ${height}">`,
  );
  out.push(`<title>${xmlEscape(`quadspread sketch: ${report.title}`)}</title>`);
  out.push(`<style>${STYLE}</style>`);
  if (views.length === 0) {
    out.push(`<text class="label" x="20" y="40">No task of this job has a drawing.</text>`);
  }
  views.forEach(({ view, id }, i) => out.push(panel(view, i * PANEL, id)));
  out.push(
    `<text class="caption" id="caution" x="12" y="${height - 24}">${xmlEscape(report.caution.split('. ')[0] + '.')}</text>`,
  );
  out.push(
    `<text class="caption" x="12" y="${height - 10}">${xmlEscape(report.caution.split('. ').slice(1).join('. '))}</text>`,
  );
  out.push('</svg>');
  return out.join('\n') + '\n';
}
