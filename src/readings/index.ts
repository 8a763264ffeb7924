// Public exports of src/readings/ (one line per file as files land).
export { angleToDegrees, degreesToUnit, ANGLE_UNITS } from './angle.js';
export type { AngleUnit, AngleOptions } from './angle.js';
export { formatDms } from './dms.js';
export { sinCosDegrees } from './trig.js';
export { spreadFromDegrees, degreesFromSpread } from './spread.js';
export { gradeFromSpread } from './grade.js';
export {
  spreadFromRatio,
  spreadFromGrade,
  spreadFromPerMille,
  spreadFromOneIn,
  gradeSquaredFromSpread,
} from './slope.js';
export {
  vertical,
  verticalFromAngle,
  verticalFromRatio,
  verticalFromSlope,
  elevationFromVertical,
  zenithFromVertical,
  zenithToElevation,
} from './vertical.js';
export type { VerticalReading, VerticalInput, VerticalKind } from './vertical.js';
export {
  lengthIn,
  lengthToMetres,
  metresToLength,
  convertLength,
  convertQuadrance,
  METRES_PER_UNIT,
} from './length.js';
export type { LengthUnit } from './length.js';
export { lengthSigma, angleSigma } from './sigma.js';
export type { LengthSigma, ConstantAndPpm } from './sigma.js';
export { solveTriangle } from './triangle-readings.js';
export type { TriangleKnown } from './triangle-readings.js';
