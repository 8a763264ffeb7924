// Public exports of src/adjustment/ (one line per file).
export {
  normalCdf,
  normalQuantile,
  chiSquareCdf,
  chiSquareQuantile,
  fCdf,
  fQuantile,
  baardaTest,
  tauCritical,
} from './statistics.js';
export type { BaardaTest } from './statistics.js';
export type { TestOptions, GlobalTest, LocalTest, ObservationTest } from './testing.js';
export type { SnoopingReport, SnoopingRemoval } from './snooping.js';
export { adjustLevelling } from './levelling.js';
export type {
  BenchmarkInput,
  LevellingObservationInput,
  LevellingOptions,
  LevellingInput,
  AdjustedHeight,
  AdjustedLevelObservation,
  LevellingAdjustment,
} from './levelling.js';
