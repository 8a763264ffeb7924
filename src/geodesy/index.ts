// Public exports of src/geodesy/ (one line per file as files land).
export {
  WGS84,
  GRS80,
  defineEllipsoid,
  ellipsoidByName,
  ellipsoidParameters,
} from './ellipsoid.js';
export type { Ellipsoid, EllipsoidDefinition, EllipsoidParameters } from './ellipsoid.js';
export { geodeticToGeocentric, geocentricToGeodetic } from './geocentric.js';
export type { Geodetic, GeodeticInput, Geocentric } from './geocentric.js';
export { enuRotation, enuFromGeocentric, geocentricFromEnu, flatEarthError } from './enu.js';
export type { Enu, Matrix3, FlatEarthError } from './enu.js';
export {
  meridianRadius,
  primeVerticalRadius,
  radiusInAzimuth,
  gaussianMeanRadius,
} from './radii.js';
export {
  heightReductionFactor,
  transverseMercatorFactors,
  transverseMercator,
  transverseMercatorInverse,
  combinedFactor,
  groundToGrid,
  gridToGround,
} from './grid.js';
export type { TransverseMercator, TransverseMercatorGrid, TmFactors, GridPoint } from './grid.js';
export { helmert, helmertInverse, helmertReversed } from './helmert.js';
export type {
  HelmertParameters,
  HelmertConvention,
  RotationInput,
  RotationUnit,
} from './helmert.js';
export { molodenskyBadekas, molodenskyBadekasInverse } from './molodensky-badekas.js';
export type { MolodenskyBadekasParameters } from './molodensky-badekas.js';
export { geocentricTranslation } from './geocentric-translation.js';
export type { GeocentricTranslationParameters } from './geocentric-translation.js';
export { datumTransform } from './datum-transform.js';
export type {
  DatumTransformation,
  DatumTransformOptions,
  TransformedPoint,
} from './datum-transform.js';
export type {
  Projection,
  ProjectionMethod,
  ProjectionAngleUnit,
  LinearUnit,
  PreparedProjection,
  ProjectedPoint,
  GeographicPoint,
} from './projection-core.js';
export { toGrid, fromGrid, prepareProjection } from './projection.js';
export { lambertConic, lambertConicInverse } from './lambert-conic.js';
export { mercator, mercatorInverse } from './mercator.js';
export { obliqueStereographic, obliqueStereographicInverse } from './oblique-stereographic.js';
export { polarStereographic, polarStereographicInverse } from './polar-stereographic.js';
export { cassiniSoldner, cassiniSoldnerInverse } from './cassini-soldner.js';
export { albersEqualArea, albersEqualAreaInverse } from './albers.js';
export {
  lambertAzimuthalEqualArea,
  lambertAzimuthalEqualAreaInverse,
} from './lambert-azimuthal.js';
export { utmZone, utmProjection } from './utm.js';
export type { UtmZone } from './utm.js';
export { crs, CRS_CODES } from './crs.js';
export type { ProjectedCrs, GeographicCrs } from './crs.js';
export { geodesicInverse } from './geodesic-inverse.js';
export type { GeodesicInverse } from './geodesic-inverse.js';
export { geodesicDirect } from './geodesic-direct.js';
export type { GeodesicDirect } from './geodesic-direct.js';
