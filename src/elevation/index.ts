// Public exports of src/elevation/ (one line per file as files land).
export { heightFromReading, horizontalFromHeight, verticalFromHeight } from './height.js';
export { heightFromSight } from './sight.js';
export type { SightHeight } from './sight.js';
export { heightFromQuadrance } from './signed-height.js';
export { heightFromTwoStations } from './two-stations.js';
export type { TwoStationHeight } from './two-stations.js';
export { heightFromBase } from './base.js';
export type { BaseHeight, FootSide } from './base.js';
export { heightFromInlineReadings, heightFromInlineQuadrances } from './inline.js';
export type { InlineHeight, InlineQuadranceHeight } from './inline.js';
export { pathGrade, pathOffset } from './path.js';
export type { OffsetMeasure } from './path.js';
export {
  trigHeight,
  reciprocalTrigHeight,
  curvatureRefraction,
  DEFAULT_REFRACTION,
  DEFAULT_EARTH_RADIUS_M,
} from './trig-heighting.js';
export type {
  TrigSight,
  TrigHeight,
  ReciprocalTrigHeight,
  CurvatureOptions,
} from './trig-heighting.js';
