// Public exports of src/geodesy/ (one line per file as files land).
export { WGS84, GRS80, defineEllipsoid, ellipsoidByName, ellipsoidParameters } from './ellipsoid.js';
export type { Ellipsoid, EllipsoidDefinition, EllipsoidParameters } from './ellipsoid.js';
export { geodeticToGeocentric, geocentricToGeodetic } from './geocentric.js';
export type { Geodetic, GeodeticInput, Geocentric } from './geocentric.js';
