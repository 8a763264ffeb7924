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
export { adjustNetwork } from './network.js';
export type {
  NetworkPointInput,
  DistanceSigma,
  NetworkObservationInput,
  NetworkOptions,
  NetworkInput,
  ErrorEllipse,
  ConfidenceEllipse,
  AdjustedPoint,
  AdjustedNetworkObservation,
  RelativeEllipse,
  NetworkAdjustment,
} from './network.js';
export { fitSimilarity } from './fit-similarity.js';
export type { SimilarityFit } from './fit-similarity.js';
export { fitAffine } from './fit-affine.js';
export type { AffineFit } from './fit-affine.js';
export { fitInclinedPlane } from './fit-plane.js';
export type { InclinedPlaneFit } from './fit-plane.js';
export type { CommonPoint } from './fit-common.js';
