/**
 * quadspread/decimal — the bound entry: the same functions as the generic entry with a
 * `decimal(34)` arithmetic fixed. (Generated wrappers land with the packaging work.)
 *
 * @module quadspread/decimal
 */
import { decimal } from './arithmetic/decimal.js';
/** The bound arithmetic: `decimal(34)` (IEEE 754 decimal128 precision). */
export const arithmetic = decimal(34);
export { QuadspreadError, ERROR_CODES } from './errors.js';
