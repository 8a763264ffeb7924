/**
 * The bundled demonstration job: invented data at invented places (Harrowmere Fell, the
 * Saltings causeway, Snipewhistle Moss, Quillet Field), covering the main solvers, with
 * uncertainties and pass/fail checks. `quadspread demo --job` prints it; the same job is
 * `examples/demo.json`.
 *
 * @module cli
 */

/** The demonstration job (invented data; no real places). */
export const DEMO_JOB = {
  title:
    'Demonstration job: Harrowmere Fell access road, Saltings mast, Snipewhistle Moss traverse (invented data)',
  description: 'Every place and reading in this job is invented for the demonstration.',
  units: { length: 'm' },
  points: {
    HB: { east: 2105, north: 3160 },
    H1: { east: 2000, north: 3000 },
    H2: { east: 2180, north: 2990 },
    CM1: { east: 1000, north: 2000 },
    T1: { east: 3000, north: 5000 },
    T2: { east: 3420, north: 5310 },
    T3: { east: 3800, north: 4950 },
    Q1: { east: 1020.5, north: 1890.25 },
    Q2: { east: { value: 1101.75, sigma: 0.02 }, north: { value: 1902.4, sigma: 0.02 } },
    Q3: { east: 1118.2, north: 1815.6 },
    Q4: { east: 1052.35, north: 1771.1 },
    Q5: { east: 1009.8, north: 1824.45 },
  },
  tasks: [
    {
      kind: 'path-grade',
      name: 'Harrowmere Fell access road',
      slope: '1 in 3.5',
      grade: '1 in 12',
      measured: 'plan',
      fallBearing: { value: `212°30'`, sigma: `0°30'` },
      alignments: [
        { name: 'Line A', offset: `76°00'` },
        { name: 'Line B', offset: `74°30'` },
      ],
    },
    {
      kind: 'inline-height',
      name: 'Saltings mast from the causeway',
      target: 'mast top',
      stations: [
        { name: 'C0', chainage: 0, vertical: { elevation: `9°33'08.9"`, sigma: `3"` } },
        { name: 'C150', chainage: 150, vertical: { elevation: `19°57'29.3"`, sigma: `3"` } },
        { name: 'C320', chainage: 320, vertical: { elevation: `15°34'55.6"`, sigma: `3"` } },
        { name: 'C475', chainage: 475, vertical: { elevation: `7°55'16.2"`, sigma: `3"` } },
      ],
      instrumentLevel: { value: 4.212, sigma: 0.003 },
      tolerance: '0.01 m',
    },
    {
      kind: 'height',
      name: 'Harrowmere beacon from two stations',
      target: 'HB',
      readings: [
        { station: 'H1', vertical: { elevation: `7°08'52.8"`, sigma: `5"` } },
        { station: 'H2', vertical: { zenith: `82°38'24.5"`, sigma: `5"` } },
      ],
      instrumentLevel: { value: 312.45, sigma: 0.005 },
      tolerance: '0.02 m',
    },
    {
      kind: 'trig-height',
      name: 'Harrowmere beacon to Tern Spit mark, reciprocal sights',
      distance: { value: 1843.226, sigma: '10 mm' },
      measured: 'slope',
      vertical: { zenith: `88°40'43.0"`, sigma: `2"` },
      instrumentHeight: 1.562,
      targetHeight: 1.7,
      backward: {
        distance: 1843.231,
        measured: 'slope',
        vertical: { zenith: `91°19'36.5"`, sigma: `2"` },
        instrumentHeight: 1.548,
        targetHeight: 1.7,
      },
      stationLevel: { value: 336.45, sigma: 0.006 },
      tolerance: '0.05 m',
    },
    {
      kind: 'resection',
      name: 'Tern Spit station by resection',
      control: ['T1', 'T2', 'T3'],
      angles: [
        { value: `55°14'49.1"`, sigma: `3"` },
        { value: `55°48'41.2"`, sigma: `3"` },
      ],
      point: 'TS',
    },
    {
      kind: 'triangle',
      name: 'Tern Spit check triangle',
      known: {
        side1: { value: 412.337, sigma: '5 mm' },
        side2: { value: 385.906, sigma: '5 mm' },
        side3: { value: 298.114, sigma: '5 mm' },
      },
    },
    {
      kind: 'traverse',
      name: 'Snipewhistle Moss control loop',
      start: 'CM1',
      close: 'loop',
      rule: 'compass',
      courses: [
        {
          to: 'CM2',
          bearing: { value: `62°14'20"`, sigma: `5"` },
          distance: { value: 212.406, sigma: '4 mm' },
        },
        {
          to: 'CM3',
          bearing: { value: `151°38'05"`, sigma: `5"` },
          distance: { value: 187.322, sigma: '4 mm' },
        },
        {
          to: 'CM4',
          bearing: { value: `246°51'40"`, sigma: `5"` },
          distance: { value: 241.017, sigma: '4 mm' },
        },
        {
          to: 'CM1',
          bearing: { value: `340°59'36"`, sigma: `5"` },
          distance: { value: 169.874, sigma: '4 mm' },
        },
      ],
      tolerance: { precision: 10000, linear: '0.05 m' },
    },
    {
      kind: 'area',
      name: 'Quillet Field',
      points: ['Q1', 'Q2', 'Q3', 'Q4', 'Q5'],
    },
    {
      kind: 'intersection',
      name: 'Quillet Field centre stake',
      lines: [
        ['Q1', 'Q3'],
        ['Q2', 'Q4'],
      ],
      point: 'QC',
    },
    {
      kind: 'levelling',
      name: 'Harrowmere bench-mark run HF1 to HF2',
      start: 112.406,
      close: 114.023,
      c: 12,
      sights: [
        { station: 'HF1', bs: 1.652 },
        { station: 'TP1', fs: 0.873, bs: 2.114, distance: 85 },
        { station: 'TP2', fs: 1.005, bs: 1.337, distance: 90 },
        { station: 'HF2', fs: 1.612, distance: 80 },
      ],
    },
  ],
} as const;
