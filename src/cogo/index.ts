// Public exports of src/cogo/ (one line per file as files land).
export { area, perimeter, convertArea, polygonArea, AREA_UNITS } from './area.js';
export type { AreaUnit, PolygonArea } from './area.js';
export { intersectLines } from './intersect-lines.js';
export { bearingToAzimuth, azimuthToQuadrant } from './bearing.js';
export { traverse, angularMisclosure } from './traverse.js';
export { openTraverse } from './open-traverse.js';
export type { OpenTraverse, OpenTraverseLeg } from './open-traverse.js';
export type { TraverseClose, TraverseClosingPoint } from './traverse-field-book.js';
export { carryBearings } from './carry-bearings.js';
export type { AngleKind, CarryBearingsInput, CarriedBearings } from './carry-bearings.js';
export type {
  TraverseCourse,
  TraverseInput,
  TraverseClosure,
  Traverse,
  TraverseLeg,
  AngularMisclosure,
} from './traverse.js';
export { levelRun, allowableMisclosure, LEVELLING_ORDERS } from './levelling.js';
export type {
  LevellingOrder,
  AllowableMisclosure,
  LevelSight,
  LevelRunInput,
  LevelRow,
  LevelCheck,
  LevelRun,
} from './levelling.js';
export { inverse, forward } from './inverse.js';
export type { Inverse } from './inverse.js';
export { intersectBearings, BEARING_PARALLEL_TOLERANCE } from './intersect-bearings.js';
export type { BearingIntersection } from './intersect-bearings.js';
export { intersectLineCircle, intersectCircles } from './circles.js';
export type { CircleInput } from './circles.js';
export { resection, DANGER_CIRCLE_TOLERANCE } from './resection.js';
export type { ResectionInput, Resection } from './resection.js';
