// The alignment task kind on examples/alignment.json, against classical computations with
// Math.* written here: a simple curve T = R tan(Δ/2), L = RΔ; the profile's parabola
// y = y_BVC + g1·x + (g2 − g1)·x²/(2L); and the sketch's plan and profile panels.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { tmpdir } from 'node:os';
import { bundleCli, cleanUp, cli } from './helpers';

const file = resolve(__dirname, '../../examples/alignment.json');
type Task = { kind: string; results: { name: string; value: string; exact?: string }[] };

beforeAll(bundleCli);
afterAll(cleanUp);

describe('quadspread run examples/alignment.json', () => {
  it.each(['float', 'rational'])(
    'reports the curves, the set-out points and the profile (%s)',
    (arithmetic) => {
      const r = cli([
        'run',
        file,
        '--format',
        'json',
        '--digits',
        '15',
        '--arithmetic',
        arithmetic,
      ]);
      expect(r.code).toBe(0);
      const t = (JSON.parse(r.stdout) as { tasks: Task[] }).tasks[0]!;
      expect(t.kind).toBe('alignment');
      const val = (name: string) => Number(t.results.find((q) => q.name === name)!.value);
      // IP2: legs along (3, 4)/5 then north, a left turn of Δ = atan(3/4)·2… by classical trig
      const delta = Math.atan2(3, 4); // angle between (0.6, 0.8) and (0, 1)
      expect(val('IP2.deflection')).toBeCloseTo((-delta * 180) / Math.PI, 10);
      expect(val('IP2.tangent_in')).toBeCloseTo(180 * Math.tan(delta / 2), 9);
      expect(val('IP2.arc_length')).toBeCloseTo(180 * delta, 9);
      // the set-out point 3.65 m left at chainage 50 on the first straight (north from A)
      expect(val('setout.0+050.000.L3.65000.east')).toBeCloseTo(1000 - 3.65, 9);
      expect(val('setout.0+050.000.CL.north')).toBeCloseTo(2050, 9);
      // profile: VIP2 at 260, level 60.2, grades 7.8/260 and −5.2/260, L = 120: at chainage 250
      const g1 = 7.8 / 260;
      const g2 = -5.2 / 260;
      const x = 250 - 200;
      expect(val('profile.0+250.000.level')).toBeCloseTo(
        60.2 - g1 * 60 + g1 * x + ((g2 - g1) * x * x) / 240,
        10,
      );
      expect(val('grade_1')).toBeCloseTo(3, 12);
    },
  );

  it('draws the plan (straights, arcs, transitions, ticks) and the exaggerated profile', () => {
    const svg = resolve(tmpdir(), `qs-alignment-${process.pid}.svg`);
    const r = cli(['run', file, '--sketch', svg]);
    expect(r.code).toBe(0);
    const text = readFileSync(svg, 'utf8');
    for (const role of ['straight', 'arc', 'transition', 'tick', 'path'])
      expect(text).toContain(`class="${role}"`);
    expect(text).toContain('Alignment: plan');
    expect(text).toContain('levels exaggerated ×10');
  });
});
