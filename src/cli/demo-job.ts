/**
 * The bundled demonstration job: invented data at invented places (Harrowmere Fell, the
 * Saltings causeway, Crane Moss, Quillet Field), covering the main solvers, with
 * uncertainties and pass/fail checks. `quadspread demo --job` prints it; the same job is
 * `examples/demo.json`.
 *
 * @module cli
 */

/** The demonstration job (invented data; no real places). */
export const DEMO_JOB = {
  title: 'Demonstration job: Harrowmere Fell access road, Saltings mast, Crane Moss traverse (invented data)',
  description: 'Every place and reading in this job is invented for the demonstration.',
  units: { length: 'm' },
  points: {
    CM1: { east: 1000, north: 2000 },
    Q1: { east: 1020.5, north: 1890.25 },
    Q2: { east: { value: 1101.75, sigma: 0.02 }, north: { value: 1902.4, sigma: 0.02 } },
    Q3: { east: 1118.2, north: 1815.6 },
    Q4: { east: 1052.35, north: 1771.1 },
    Q5: { east: 1009.8, north: 1824.45 },
  },
  tasks: [
    {
      kind: 'traverse',
      name: 'Crane Moss control loop',
      start: 'CM1',
      rule: 'compass',
      courses: [
        { to: 'CM2', bearing: { value: `62°14'20"`, sigma: `5"` }, distance: { value: 212.406, sigma: '4 mm' } },
        { to: 'CM3', bearing: { value: `151°38'05"`, sigma: `5"` }, distance: { value: 187.322, sigma: '4 mm' } },
        { to: 'CM4', bearing: { value: `246°51'40"`, sigma: `5"` }, distance: { value: 241.017, sigma: '4 mm' } },
        { to: 'CM1', bearing: { value: `340°59'36"`, sigma: `5"` }, distance: { value: 169.874, sigma: '4 mm' } },
      ],
      tolerance: { precision: 10000, linear: '0.05 m' },
    },
    {
      kind: 'area',
      name: 'Quillet Field',
      points: ['Q1', 'Q2', 'Q3', 'Q4', 'Q5'],
    },
  ],
} as const;
