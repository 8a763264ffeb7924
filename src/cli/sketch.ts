/**
 * The SVG sketch: one panel per view (plan views with north up; elevation views with
 * height up), each fitted to its own extent at one scale in both directions (heights of
 * long, low elevation views exaggerated by a stated whole factor), labelled with the
 * computed values. A drawing to check a configuration by eye, not a plan to
 * set out from.
 *
 * @module cli
 */
import type { Report, SketchView } from './report.js';
import { visibleControls } from './escape.js';

const WIDTH = 720;
const PANEL = 440;
const MARGIN = 56;

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
  line.sight { stroke: #1a4f8a; stroke-width: 1; stroke-dasharray: 5 3; }
  line.course, line.boundary { stroke: #222; stroke-width: 1.5; }
  line.adjusted { stroke: #b35900; stroke-width: 1; stroke-dasharray: 2 2; }
  line.base, line.ground { stroke: #5a7d2a; stroke-width: 2; }
  line.path { stroke: #a02020; stroke-width: 2; }
  line.straight { stroke: #222; stroke-width: 1.5; }
  line.arc { stroke: #a02020; stroke-width: 2.5; }
  line.transition { stroke: #b35900; stroke-width: 2; stroke-dasharray: 6 3; }
  line.tick { stroke: #555; stroke-width: 1; }
  circle.station { fill: #fff; stroke: #222; stroke-width: 1.5; }
  circle.control { fill: #222; }
  circle.target { fill: #a02020; }
  circle.computed { fill: #fff; stroke: #b35900; stroke-width: 1.5; }
  path.foot { stroke: #a02020; stroke-width: 1.5; fill: none; }
  path.north { fill: #222; }
`;

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
  // Room on the right for labels beside the rightmost points.
  const innerW = WIDTH - 2 * MARGIN - 90,
    innerH = PANEL - 2 * MARGIN - 20;
  const scale = Math.min(innerW / spanX, innerH / spanY);
  // Elevation views of long, low sights: heights exaggerated (by a whole factor, at most 10).
  const exaggeration =
    view.view === 'elevation' && spanY * scale < innerH / 3
      ? Math.max(1, Math.min(10, Math.floor(innerH / 2 / (spanY * scale))))
      : 1;
  const ox = MARGIN + (innerW - spanX * scale) / 2;
  const oy = top + MARGIN + 20 + (innerH - spanY * scale * exaggeration) / 2;
  const X = (x: number): number => ox + (x - minX) * scale;
  const Y = (y: number): number => oy + (maxY - y) * scale * exaggeration;
  const parts: string[] = [];
  parts.push(`<g class="panel ${view.view}" id="${id}">`);
  parts.push(
    `<rect class="panel-frame" x="8" y="${n(top + 8)}" width="${WIDTH - 16}" height="${PANEL - 16}"/>`,
  );
  parts.push(`<text class="panel-title" x="20" y="${n(top + 30)}">${xmlEscape(view.title)}</text>`);
  const caption =
    view.caption ??
    (view.view === 'plan'
      ? 'plan: x east, y north'
      : 'elevation: horizontal distance across, height up');
  const exaggerated = exaggeration > 1 ? `; heights exaggerated ×${exaggeration}` : '';
  parts.push(
    `<text class="caption" x="20" y="${n(top + 46)}">${xmlEscape(caption + exaggerated)}; not to be scaled from</text>`,
  );
  for (const l of view.lines) {
    parts.push(
      `<line class="${l.role}" x1="${n(X(l.x1))}" y1="${n(Y(l.y1))}" x2="${n(X(l.x2))}" y2="${n(Y(l.y2))}"/>`,
    );
    if (l.label) {
      parts.push(
        `<text class="note" x="${n((X(l.x1) + X(l.x2)) / 2 + 4)}" y="${n((Y(l.y1) + Y(l.y2)) / 2 - 4)}">${xmlEscape(l.label)}</text>`,
      );
    }
  }
  for (const p of view.points) {
    const cx = X(p.x),
      cy = Y(p.y);
    if (p.role === 'foot') {
      parts.push(
        `<path class="foot" d="M ${n(cx - 5)} ${n(cy - 5)} L ${n(cx + 5)} ${n(cy + 5)} M ${n(cx - 5)} ${n(cy + 5)} L ${n(cx + 5)} ${n(cy - 5)}"/>`,
      );
    } else {
      parts.push(
        `<circle class="${p.role}" cx="${n(cx)}" cy="${n(cy)}" r="${p.role === 'target' ? 5 : 4}"/>`,
      );
    }
    parts.push(`<text class="label" x="${n(cx + 7)}" y="${n(cy - 7)}">${xmlEscape(p.name)}</text>`);
  }
  for (const t of view.notes) {
    parts.push(
      `<text class="note" x="${n(X(t.x) + 7)}" y="${n(Y(t.y) + 16)}">${xmlEscape(t.text)}</text>`,
    );
  }
  if (view.view === 'plan' && view.caption === undefined) {
    const ax = WIDTH - 40,
      ay = top + 40;
    parts.push(
      `<path class="north" d="M ${ax} ${ay} L ${ax - 6} ${ay + 18} L ${ax + 6} ${ay + 18} Z"/>`,
    );
    parts.push(`<text class="label" x="${ax - 4}" y="${ay + 32}">N</text>`);
  }
  parts.push('</g>');
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
