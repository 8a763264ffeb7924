// The job runner against a published worked example: Ordnance Survey, *A guide to
// coordinate systems in Great Britain*, annex B (GRS 80):
// 53°36'43.1653"N, 1°39'51.9920"W, h = 299.800 m ↔ X = 3790644.900, Y = −110149.210, Z = 5111482.970 m.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resolve } from 'node:path';
import { bundleCli, cleanUp, cli } from '../cli/helpers';

beforeAll(bundleCli);
afterAll(cleanUp);

describe('quadspread run examples/geodesy.json (Ordnance Survey guide, annex B)', () => {
  it.each(['float', 'decimal', 'rational'])(
    'reproduces X, Y, Z to 1 mm and the latitude, longitude to 0.0001″ in %s',
    (arithmetic) => {
      const r = cli([
        'run',
        resolve(__dirname, '../../examples/geodesy.json'),
        '--format',
        'json',
        '--arithmetic',
        arithmetic,
        '--digits',
        '15',
      ]);
      expect(r.code).toBe(0);
      const [to, from] = JSON.parse(r.stdout).tasks as {
        results: { name: string; value: string }[];
      }[];
      const v = (t: typeof to, n: string) => Number(t!.results.find((q) => q.name === n)!.value);
      expect(Math.abs(v(to, 'X') - 3790644.9)).toBeLessThanOrEqual(0.001);
      expect(Math.abs(v(to, 'Y') - -110149.21)).toBeLessThanOrEqual(0.001);
      expect(Math.abs(v(to, 'Z') - 5111482.97)).toBeLessThanOrEqual(0.001);
      const lat = 53 + 36 / 60 + 43.1653 / 3600;
      const lon = -(1 + 39 / 60 + 51.992 / 3600);
      expect(Math.abs(v(from, 'lat') - lat) * 3600).toBeLessThanOrEqual(0.0001);
      expect(Math.abs(v(from, 'lon') - lon) * 3600).toBeLessThanOrEqual(0.0001);
      expect(Math.abs(v(from, 'h') - 299.8)).toBeLessThanOrEqual(0.001);
    },
  );
});
