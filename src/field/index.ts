// Public exports of src/field/ (one line per file as files land).
export { atmosphericPpm } from './atmosphere.js';
export type { Atmosphere, AtmosphericPpm } from './atmosphere.js';
export { reduceObservation } from './reduce.js';
export type { FieldObservation, GridReduction, ReducedObservation } from './reduce.js';
export { meanFaces } from './faces.js';
export type { Pointing, FaceOptions, MeanFaces } from './faces.js';
export { orientStation } from './orient.js';
export type {
  Backsight,
  SetupTolerance,
  OrientInput,
  BacksightResult,
  StationSetup,
} from './orient.js';
export { sideShot, sideShots } from './side-shot.js';
export type { Shot, SideShot } from './side-shot.js';
export { setOut, setOutCheck } from './set-out.js';
export type { SetOutOptions, SetOut, SetOutTolerance, SetOutCheck } from './set-out.js';
export type { Point3Input, Point3, FieldCheck, SetupInput } from './internal.js';
export { freeStation } from './free-station.js';
export type {
  ControlPoint,
  StationObservation,
  FreeStationInput,
  FreeStationResidual,
  FreeStation,
} from './free-station.js';
export { twoPegTest } from './two-peg.js';
export type { PegReadings, TwoPegInput, TwoPeg } from './two-peg.js';
export { reciprocalLevelling } from './reciprocal-levelling.js';
export type { StaffPair, ReciprocalSet, ReciprocalLevelling } from './reciprocal-levelling.js';
