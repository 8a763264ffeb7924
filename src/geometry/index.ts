// Public exports of src/geometry/ (one line per file as files land).
export { point } from './point.js';
export type { Point, PointInput, PointLike } from './point.js';
export { quadrance, vectorQuadrance } from './quadrance.js';
export { spread, cross, spreadOfVectors } from './spread.js';
export {
  line,
  lineThrough,
  isOnLine,
  isParallel,
  isPerpendicular,
  footOfPerpendicular,
  quadranceToLine,
  spreadOfLines,
} from './line.js';
export type { Line } from './line.js';
export {
  surd,
  sqrtOf,
  asRoot,
  isSurd,
  rootToNumber,
  rootToString,
  rootToPrecision,
} from './surd.js';
export type { Surd, Root } from './surd.js';
export { solveQuadratic } from './quadratic.js';
export {
  pythagorasResidual,
  quadrea,
  tripleQuadResidual,
  archimedesResidual,
  spreadLawResidual,
  crossLawResidual,
  tripleSpreadResidual,
} from './laws.js';
export {
  stewartResidual,
  stewartQuadranceResidual,
  solveStewart,
  solveStewartQuadrances,
} from './stewart.js';
export type { StewartChainages, StewartQuadrances } from './stewart.js';
export { triangle } from './triangle.js';
export type { Triangle } from './triangle.js';
export type { TriangleMeasures } from './solve-triangle.js';
