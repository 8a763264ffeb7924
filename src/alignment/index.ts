// Public exports of src/alignment/ (one line per file as files land).
export { readStation, formatStation } from './station.js';
export { verticalAlignment, profileLevel } from './vertical.js';
export type {
  ProfilePointInput,
  VerticalCurveInput,
  VerticalAlignmentInput,
  ProfileLevel,
  VerticalCurve,
  VerticalAlignment,
} from './vertical.js';
export { clothoid } from './clothoid.js';
export type { Clothoid } from './clothoid.js';
export { horizontalAlignment } from './horizontal.js';
export type {
  HorizontalCurveInput,
  ChainageEquationInput,
  HorizontalAlignmentInput,
  StraightElement,
  ArcElement,
  TransitionElement,
  AlignmentElement,
  KeyPoint,
  TransitionMeasures,
  HorizontalCurve,
  ChainageEquation,
  HorizontalAlignment,
} from './horizontal.js';
export { alignmentPoint } from './point.js';
export type { AlignmentPoint } from './point.js';
export { alignmentStation } from './project.js';
export type { StationCandidate, AlignmentStation, AlignmentStationOptions } from './project.js';
export { deflectionTable, settingOutTable } from './setting-out.js';
export type { DeflectionRow, SetOutPoint, SettingOutRow } from './setting-out.js';
export {
  minimumRadius,
  railCant,
  transitionLength,
  stoppingSightDistance,
  sightLineOffset,
  sightCurveLength,
} from './design-checks.js';
export type { DesignUnits } from './design-checks.js';
