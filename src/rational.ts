/**
 * quadspread/rational — the bound entry: the same functions as the generic entry with the
 * `rational` arithmetic fixed. (Generated wrappers land with the packaging work.)
 *
 * @module quadspread/rational
 */
export { rational as arithmetic } from './arithmetic/rational.js';
export { QuadspreadError, ERROR_CODES } from './errors.js';
