// The job runner against a published worked example: Mahun, *Surveying* open text,
// "Solution: Trig Leveling", Problem 1: instrument 5.41 ft over a point of
// elevation 745.39 ft, target 5.64 ft; elevation = H + hi + S·sin α − hr.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { bundleCli, cleanUp, cli, tempFolder } from '../cli/helpers';

beforeAll(bundleCli);
afterAll(cleanUp);

describe('quadspread run on Mahun, Trig Leveling, Problem 1', () => {
  it.each([
    [`4°24'10"`, 145.25, 756.31],
    [`-6°00'25"`, 89.32, 735.81],
    [`-2°58'30"`, 118.95, 738.99],
  ])('sight %s over %s ft gives elevation %s ft (±0.005 ft)', (angle, slope, expected) => {
    const job = {
      units: { length: 'ft' },
      tasks: [
        {
          kind: 'trig-height',
          distance: slope,
          measured: 'slope',
          vertical: angle,
          instrumentHeight: 5.41,
          targetHeight: 5.64,
          stationLevel: 745.39,
        },
      ],
    };
    const f = join(tempFolder(), 'mahun.json');
    writeFileSync(f, JSON.stringify(job));
    const r = cli(['run', f, '--format', 'json']);
    expect(r.code).toBe(0);
    const level = JSON.parse(r.stdout).tasks[0].results.find(
      (q: { name: string }) => q.name === 'level',
    );
    expect(Math.abs(Number(level.value) - expected)).toBeLessThanOrEqual(0.005);
    expect(level.unit).toBe('ft');
  });
});
