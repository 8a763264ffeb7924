/**
 * quadspread/float — the bound entry: the same functions as the generic entry with the
 * `float` arithmetic fixed. (Generated wrappers land with the packaging work.)
 *
 * @module quadspread/float
 */
export { float as arithmetic } from './arithmetic/float.js';
export { QuadspreadError, ERROR_CODES } from './errors.js';
