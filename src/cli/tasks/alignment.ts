/**
 * Task `alignment`: a road or railway centre line fitted to named IPs (straights, circular arcs,
 * clothoid transitions), with an optional profile (grades and parabolic vertical curves): the
 * element table, the curves' measures, a setting-out table with offsets, a profile table, and a
 * sketch of the plan and the (exaggerated) profile. Through the library's alignment functions.
 *
 * @module cli
 */
import {
  formatStation,
  horizontalAlignment,
  profileLevel,
  settingOutTable,
  verticalAlignment,
} from '../../index.js';
import type { HorizontalCurveInput } from '../../index.js';
import { JobInvalid } from '../failure.js';
import type { Cell, RawQuantity, RawTable, TaskKind } from '../task.js';
import type { SketchView } from '../report.js';
import { readLength } from '../values.js';
import type { Input } from '../values.js';
import { pointInputs, taskSchema, xy } from './common.js';

interface CurveSpec {
  radius: Input;
  transitionIn?: Input;
  transitionOut?: Input;
}

export const alignmentTask: TaskKind = {
  kind: 'alignment',
  description:
    'A road or railway centre line through named IPs with circular curves and clothoid transitions, and optionally a profile with vertical curves: element table, curve measures, setting-out table with offsets, profile table, and a plan-and-profile sketch.',
  schema: taskSchema('alignment', ['points', 'curves'], {
    points: {
      type: 'array',
      minItems: 2,
      maxItems: 1000,
      items: { $ref: '#/$defs/pointRef' },
      description: 'Start, intersection points (IPs) and end, in order along the line.',
    },
    curves: {
      type: 'array',
      maxItems: 1000,
      description: 'One curve per IP (curves[i] at points[i + 1]).',
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['radius'],
        properties: {
          radius: { $ref: '#/$defs/measuredLength', description: 'Radius of the circular arc.' },
          transitionIn: { $ref: '#/$defs/length', description: 'Clothoid length into the arc.' },
          transitionOut: { $ref: '#/$defs/length', description: 'Clothoid length out of the arc.' },
        },
      },
    },
    startChainage: { $ref: '#/$defs/length', description: 'Chainage of the start (default 0).' },
    interval: {
      $ref: '#/$defs/length',
      description: 'Chainage step of the setting-out and profile tables (default: no tables).',
    },
    offsets: {
      type: 'array',
      maxItems: 10,
      items: { $ref: '#/$defs/length' },
      description: 'Offsets to set out beside the centre line, right positive (e.g. the edges).',
    },
    profile: {
      type: 'object',
      additionalProperties: false,
      required: ['points'],
      description: 'The vertical alignment: VIPs and vertical curves.',
      properties: {
        points: {
          type: 'array',
          minItems: 2,
          maxItems: 1000,
          items: {
            type: 'object',
            additionalProperties: false,
            required: ['chainage', 'level'],
            properties: {
              chainage: { $ref: '#/$defs/length' },
              level: { $ref: '#/$defs/measuredLength' },
              curve: {
                $ref: '#/$defs/length',
                description: 'Length of a symmetric vertical curve here.',
              },
            },
          },
        },
        exaggeration: {
          type: 'number',
          minimum: 1,
          maximum: 1000,
          description: 'Vertical exaggeration of the profile in the sketch (default 10).',
        },
      },
    },
  }),
  prepare(task, path, ctx) {
    const pts = (task.points as unknown[]).map((n, i) => ctx.point(n, `${path}.points[${i}]`));
    const rawCurves = task.curves as Record<string, unknown>[];
    if (rawCurves.length !== Math.max(0, pts.length - 2))
      throw new JobInvalid(
        `${path}.curves`,
        `${rawCurves.length} curves for ${Math.max(0, pts.length - 2)} IPs: give one per IP`,
      );
    const curves: CurveSpec[] = rawCurves.map((c, i) => {
      const p = `${path}.curves[${i}]`;
      const ip = pts[i + 1]!.name;
      return {
        radius: readLength(c.radius, `${p}.radius`, ctx.unit, `${ip} radius`, 'radius'),
        ...(c.transitionIn !== undefined
          ? {
              transitionIn: readLength(
                c.transitionIn,
                `${p}.transitionIn`,
                ctx.unit,
                `${ip} transition in`,
              ),
            }
          : {}),
        ...(c.transitionOut !== undefined
          ? {
              transitionOut: readLength(
                c.transitionOut,
                `${p}.transitionOut`,
                ctx.unit,
                `${ip} transition out`,
              ),
            }
          : {}),
      };
    });
    const start =
      task.startChainage !== undefined
        ? readLength(
            task.startChainage,
            `${path}.startChainage`,
            ctx.unit,
            'start chainage',
            'chainage',
          )
        : undefined;
    const interval =
      task.interval !== undefined
        ? readLength(task.interval, `${path}.interval`, ctx.unit, 'interval', 'interval')
        : undefined;
    const offsets = ((task.offsets as unknown[] | undefined) ?? []).map((o, i) =>
      readLength(o, `${path}.offsets[${i}]`, ctx.unit, `offset ${i + 1}`, 'offset'),
    );
    const prof = task.profile as
      { points: Record<string, unknown>[]; exaggeration?: number } | undefined;
    const vips = prof?.points.map((p, i) => ({
      chainage: readLength(
        p.chainage,
        `${path}.profile.points[${i}].chainage`,
        ctx.unit,
        `VIP ${i + 1} chainage`,
        'chainage',
      ),
      level: readLength(
        p.level,
        `${path}.profile.points[${i}].level`,
        ctx.unit,
        `VIP ${i + 1} level`,
        'level',
      ),
      curve:
        p.curve !== undefined
          ? readLength(
              p.curve,
              `${path}.profile.points[${i}].curve`,
              ctx.unit,
              `VIP ${i + 1} curve`,
              'length',
            )
          : undefined,
    }));
    const exaggeration = prof?.exaggeration ?? 10;
    const inputs: Input[] = [
      ...pts.flatMap(pointInputs),
      ...curves.flatMap((c) => [
        c.radius,
        ...(c.transitionIn ? [c.transitionIn] : []),
        ...(c.transitionOut ? [c.transitionOut] : []),
      ]),
      ...(start ? [start] : []),
      ...(interval ? [interval] : []),
      ...offsets,
      ...(vips ?? []).flatMap((v) => [v.chainage, v.level, ...(v.curve ? [v.curve] : [])]),
    ];
    const u = ctx.unitName;
    const per = ctx.unit === 'm' || ctx.unit === 'km' ? 1000 : 100;
    return {
      summary: `Alignment ${pts.map((p) => p.name).join('–')}: ${curves.length} curve(s)${vips ? `, a profile of ${vips.length} VIPs` : ''}.`,
      inputs,
      compute(env) {
        const A = env.A;
        type V = typeof A.zero;
        const h = horizontalAlignment(A, {
          points: pts.map((p) => xy(env, p)),
          curves: curves.map((c): HorizontalCurveInput<V> => ({
            radius: env.get(c.radius),
            ...(c.transitionIn ? { transitionIn: env.get(c.transitionIn) } : {}),
            ...(c.transitionOut ? { transitionOut: env.get(c.transitionOut) } : {}),
          })),
          ...(start ? { startChainage: env.get(start) } : {}),
        });
        const st = (c: V) => formatStation(A, c, { per, decimals: 3 });
        const results: RawQuantity<V>[] = [];
        // Row-wise values (elements, set-out points, profile levels) are laid out in the tables;
        // as quantities they stay in JSON under their names (and in text with --detail).
        const tables: RawTable<V>[] = [
          {
            name: 'alignment-elements',
            title: 'Elements of the centre line',
            columns: [
              { label: 'No.' },
              { label: 'Type' },
              { label: 'Radius', kind: 'length', unit: u },
              { label: 'From' },
              { label: 'To' },
              { label: 'Bearing in', kind: 'bearing' },
              { label: 'Bearing out', kind: 'bearing' },
              { label: 'Length', kind: 'length', unit: u },
            ],
            rows: h.elements.map((e, i): Cell<V>[] => [
              String(i + 1),
              e.type,
              e.type === 'straight' ? '' : e.radius,
              st(e.startChainage),
              st(e.endChainage),
              e.bearingIn,
              e.bearingOut,
              e.length,
            ]),
            notes: [
              'From and To are chainages written as kilometres (or hundreds of feet) + the remainder.',
            ],
          },
        ];
        h.elements.forEach((e, i) => {
          results.push({
            internal: true,
            name: `element_${i + 1}.start`,
            label: `Element ${i + 1}: ${e.type}${e.type !== 'straight' ? ` (R ${A.toPrecision(e.radius, 8)})` : ''} from ${st(e.startChainage)} to ${st(e.endChainage)}, bearing ${A.toPrecision(e.bearingIn, 9)}° → ${A.toPrecision(e.bearingOut, 9)}°; length`,
            unit: u,
            value: e.length,
            approx: true,
          });
        });
        h.curves.forEach((c, i) => {
          const ip = pts[i + 1]!.name;
          const add = (name: string, label: string, value: V, unit = u) =>
            results.push({
              name: `${ip}.${name}`,
              label: `${ip} ${label}`,
              unit,
              value,
              approx: true,
            });
          add('deflection', `deflection Δ (${c.turn})`, c.deflection, '°');
          add('tangent_in', 'tangent length in (T or Ts)', c.tangentIn);
          add('tangent_out', 'tangent length out', c.tangentOut);
          add('arc_length', 'arc length Lc', c.arcLength);
          add('external', 'external E', c.external);
          add('long_chord', 'long chord of the arc', c.longChord);
          add('middle_ordinate', 'middle ordinate of the arc', c.middleOrdinate);
          for (const [key, label] of [
            ['ts', 'TS (PC)'],
            ['sc', 'SC'],
            ['cs', 'CS'],
            ['st', 'ST (PT)'],
          ] as const) {
            if ((key === 'sc' && !c.transitionIn) || (key === 'cs' && !c.transitionOut)) continue;
            add(`${key}.chainage`, `${label} chainage ${st(c[key].chainage)}`, c[key].chainage);
          }
          for (const [key, t] of [
            ['transition_in', c.transitionIn],
            ['transition_out', c.transitionOut],
          ] as const) {
            if (!t) continue;
            add(`${key}.theta`, `${key.replace('_', ' ')} θs`, t.theta, '°');
            add(`${key}.p`, `${key.replace('_', ' ')} shift p`, t.p);
            add(`${key}.k`, `${key.replace('_', ' ')} k`, t.k);
          }
        });
        const rows = interval
          ? settingOutTable(A, h, {
              interval: env.get(interval),
              offsets: offsets.map((o) => env.get(o)),
            })
          : [];
        if (rows.length > 0) {
          tables.push({
            name: 'setting-out',
            title: 'Setting-out table',
            columns: [
              { label: 'Chainage' },
              { label: 'Element' },
              { label: 'Bearing', kind: 'bearing' },
              { label: 'Offset', kind: 'length', unit: u },
              { label: 'East', kind: 'length', unit: u },
              { label: 'North', kind: 'length', unit: u },
            ],
            rows: rows.flatMap((r) =>
              r.points.map((p, j): Cell<V>[] =>
                j === 0
                  ? [st(r.chainage), r.type, r.bearing, p.offset, p.x, p.y]
                  : ['', '', '', p.offset, p.x, p.y],
              ),
            ),
            notes: [
              'Offsets are positive to the right looking ahead, negative to the left; 0 is the centre line.',
            ],
          });
        }
        for (const r of rows) {
          for (const p of r.points) {
            const tag = A.isZero(p.offset)
              ? 'CL'
              : `${A.sign(p.offset) > 0 ? 'R' : 'L'}${A.toPrecision(A.abs(p.offset), 6)}`;
            results.push({
              internal: true,
              name: `setout.${st(r.chainage)}.${tag}.east`,
              label: `Set-out ${st(r.chainage)} ${tag} (${r.type}) east`,
              unit: u,
              value: p.x,
              approx: true,
            });
            results.push({
              internal: true,
              name: `setout.${st(r.chainage)}.${tag}.north`,
              label: `Set-out ${st(r.chainage)} ${tag} (${r.type}) north`,
              unit: u,
              value: p.y,
              approx: true,
            });
          }
        }
        const notes = [
          'Chainages increase from the first point; offsets are positive to the right looking ahead. Station text is written as kilometres (or hundreds of feet) + the remainder.',
          'Lengths along arcs and transitions need an angle: they are rounded even in the rational arithmetic (1e-40 relative); set-out points on arcs lie exactly on their circles there.',
          'A computational aid: check independently; design and setting out follow the applicable road or railway standard and licensed practice.',
        ];
        let v: ReturnType<typeof verticalAlignment<V>> | undefined;
        if (vips) {
          v = verticalAlignment(A, {
            points: vips.map((p) => ({ chainage: env.get(p.chainage), level: env.get(p.level) })),
            curves: vips.map((p) => (p.curve ? { length: env.get(p.curve) } : null)),
          });
          v.gradesPercent.forEach((g, i) =>
            results.push({
              name: `grade_${i + 1}`,
              label: `Grade ${i + 1}, VIP ${i + 1} to VIP ${i + 2}`,
              unit: '%',
              value: g,
            }),
          );
          v.curves.forEach((c) => {
            if (!c) return;
            const at = `vip_${c.vip + 1}`;
            results.push({
              name: `${at}.bvc`,
              label: `VIP ${c.vip + 1} ${c.kind} curve: BVC ${st(c.bvc.chainage)} level`,
              unit: u,
              value: c.bvc.level,
            });
            results.push({
              name: `${at}.evc`,
              label: `VIP ${c.vip + 1} ${c.kind} curve: EVC ${st(c.evc.chainage)} level`,
              unit: u,
              value: c.evc.level,
            });
            results.push({
              name: `${at}.k`,
              label: `VIP ${c.vip + 1} K = L/|A|`,
              unit: `${u} per %`,
              value: c.k,
            });
            if (c.turningPoint)
              results.push({
                name: `${at}.turning`,
                label: `VIP ${c.vip + 1} ${c.kind === 'crest' ? 'high' : 'low'} point at ${st(c.turningPoint.chainage)}: level`,
                unit: u,
                value: c.turningPoint.level,
              });
          });
          if (interval) {
            const first = v.points[0]!.chainage;
            const last = v.points[v.points.length - 1]!.chainage;
            const step = env.get(interval);
            let k = Math.ceil(A.toNumber(A.div(first, step)));
            const profileRows: Cell<V>[][] = [];
            for (let n = 0; n < 100000; n++, k++) {
              const c = A.mul(A.from(k), step);
              if (A.cmp(c, last) > 0) break;
              if (A.cmp(c, first) < 0) continue;
              const p = profileLevel(A, v, c);
              profileRows.push([st(c), p.level, A.mul(p.grade, A.from(100))]);
              results.push({
                internal: true,
                name: `profile.${st(c)}.level`,
                label: `Profile ${st(c)} level (grade ${A.toPrecision(A.mul(p.grade, A.from(100)), 6)} %)`,
                unit: u,
                value: p.level,
              });
            }
            tables.push({
              name: 'profile',
              title: 'Profile: levels along the centre line',
              columns: [
                { label: 'Chainage' },
                { label: 'Level', kind: 'level', unit: u },
                { label: 'Grade', kind: 'percent', unit: '%' },
              ],
              rows: profileRows,
            });
          }
        }
        const sketch = env.drawing ? drawing(env.num, h, v, exaggeration, u, st) : undefined;
        return {
          results,
          checks: [],
          notes,
          ...(env.drawing ? { tables } : {}),
          ...(sketch ? { sketch } : {}),
          ...(env.drawing
            ? { exchange: { alignment: { horizontal: h, ...(v ? { vertical: v } : {}) } } }
            : {}),
        };
      },
    };
  },
};

function drawing<V>(
  num: (x: V) => number,
  h: ReturnType<typeof horizontalAlignment<V>>,
  v: ReturnType<typeof verticalAlignment<V>> | undefined,
  exaggeration: number,
  unit: string,
  st: (c: V) => string,
): SketchView[] {
  const plan: SketchView = {
    title: 'Alignment: plan',
    view: 'plan',
    unit: unit,
    north: true,
    caption:
      'x east, y north; straights solid, arcs thick, transitions dashed; ticks at element ends',
    points: h.points.map((p, i) => ({
      name: i === 0 ? 'start' : i === h.points.length - 1 ? 'end' : `IP${i}`,
      x: num(p.x),
      y: num(p.y),
      role: 'control' as const,
    })),
    lines: [],
    notes: [],
  };
  for (let i = 0; i + 1 < h.points.length; i++) {
    const a = h.points[i]!;
    const b = h.points[i + 1]!;
    plan.lines.push({ x1: num(a.x), y1: num(a.y), x2: num(b.x), y2: num(b.y), role: 'sight' });
  }
  for (const e of h.elements) {
    const role = e.type === 'straight' ? 'straight' : e.type === 'arc' ? 'arc' : 'transition';
    // Curves drawn as 24 chords, from the element's own points.
    const n = e.type === 'straight' ? 1 : 24;
    let prev = { x: num(e.start.x), y: num(e.start.y) };
    const L = num(e.length);
    const sx = num(e.start.x),
      sy = num(e.start.y);
    for (let k = 1; k <= n; k++) {
      const q = k === n ? { x: num(e.end.x), y: num(e.end.y) } : pointAlong(e, (L * k) / n, num);
      plan.lines.push({ x1: prev.x, y1: prev.y, x2: q.x, y2: q.y, role });
      prev = q;
    }
    // A tick square to the line at the element's start, labelled with its chainage.
    const d = { x: num(e.direction.x), y: num(e.direction.y) };
    const t = Math.max(L, 1) * 0.05 + 2;
    plan.lines.push({
      x1: sx - d.y * t,
      y1: sy + d.x * t,
      x2: sx + d.y * t,
      y2: sy - d.x * t,
      role: 'tick',
    });
    plan.notes.push({ x: sx + d.y * t, y: sy - d.x * t, text: st(e.startChainage) });
  }
  const views = [plan];
  if (v) {
    const c0 = num(v.points[0]!.chainage);
    const profile: SketchView = {
      title: `Alignment: profile (levels exaggerated ×${exaggeration})`,
      view: 'elevation',
      unit: unit,
      caption: `x chainage, y level × ${exaggeration} (${unit}); grade line dashed, profile solid`,
      points: v.points.map((p, i) => ({
        name: `VIP${i + 1}`,
        x: num(p.chainage) - c0,
        y: num(p.level) * exaggeration,
        role: 'control' as const,
      })),
      lines: [],
      notes: [],
    };
    for (let i = 0; i + 1 < v.points.length; i++) {
      const a = v.points[i]!;
      const b = v.points[i + 1]!;
      profile.lines.push({
        x1: num(a.chainage) - c0,
        y1: num(a.level) * exaggeration,
        x2: num(b.chainage) - c0,
        y2: num(b.level) * exaggeration,
        role: 'sight',
      });
    }
    // The profile itself: straight along grades, 16 chords on each vertical curve.
    const last = num(v.points[v.points.length - 1]!.chainage);
    const level = (c: number) => {
      const cv = v.curves.find((k) => k && c >= num(k.bvc.chainage) && c <= num(k.evc.chainage));
      if (cv) {
        const vip = v.points[cv.vip]!;
        const e = num(cv.atVip.level) - num(vip.level);
        const before = c <= num(vip.chainage);
        const x = before ? c - num(cv.bvc.chainage) : num(cv.evc.chainage) - c;
        const l = num(before ? cv.lengthIn : cv.lengthOut);
        return before
          ? num(cv.bvc.level) + num(cv.gradeIn) * x + (e * x * x) / (l * l)
          : num(cv.evc.level) - num(cv.gradeOut) * x + (e * x * x) / (l * l);
      }
      let i = 0;
      while (i + 2 < v.points.length && num(v.points[i + 1]!.chainage) < c) i++;
      return num(v.points[i]!.level) + num(v.grades[i]!) * (c - num(v.points[i]!.chainage));
    };
    const steps = 200;
    for (let k = 0; k < steps; k++) {
      const a = c0 + ((last - c0) * k) / steps;
      const b = c0 + ((last - c0) * (k + 1)) / steps;
      profile.lines.push({
        x1: a - c0,
        y1: level(a) * exaggeration,
        x2: b - c0,
        y2: level(b) * exaggeration,
        role: 'path',
      });
    }
    views.push(profile);
  }
  return views;
}

/** A plain-number point along an element, for drawing only (the report's values come from the library). */
function pointAlong<V>(
  e: ReturnType<typeof horizontalAlignment<V>>['elements'][number],
  s: number,
  num: (x: V) => number,
): { x: number; y: number } {
  const sx = num(e.start.x),
    sy = num(e.start.y);
  const dx = num(e.direction.x),
    dy = num(e.direction.y);
  if (e.type === 'straight') return { x: sx + s * dx, y: sy + s * dy };
  if (e.type === 'arc') {
    const cx = num(e.centre.x),
      cy = num(e.centre.y),
      R = num(e.radius);
    const a = (e.turn * s) / R; // clockwise for a right-hand curve
    const rx = (sx - cx) / R,
      ry = (sy - cy) / R;
    return {
      x: cx + R * (rx * Math.cos(a) + ry * Math.sin(a)),
      y: cy + R * (ry * Math.cos(a) - rx * Math.sin(a)),
    };
  }
  // Transition: integrate the heading numerically (drawing only).
  const L = num(e.length),
    R = num(e.radius);
  const steps = 32;
  let x = sx,
    y = sy;
  const h0 = Math.atan2(dx, dy);
  for (let k = 0; k < steps; k++) {
    const m = (s * (k + 0.5)) / steps;
    const l = e.entering ? m : L - m;
    const lead = e.entering ? (m * m) / (2 * R * L) : (L * L - l * l) / (2 * R * L);
    const heading = h0 + e.turn * lead;
    x += (s / steps) * Math.sin(heading);
    y += (s / steps) * Math.cos(heading);
  }
  return { x, y };
}
