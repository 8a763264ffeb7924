/**
 * quadspread — the generic entry. Every function takes an {@link Arithmetic} first.
 *
 * @module quadspread
 */
export { QuadspreadError, ERROR_CODES, MAX_INPUT_LENGTH } from './errors.js';
export type { ErrorCode } from './errors.js';
export * from './arithmetic/index.js';
export * from './geometry/index.js';
export * from './readings/index.js';
export * from './elevation/index.js';
export * from './cogo/index.js';
export * from './geodesy/index.js';
export * from './alignment/index.js';
export * from './field/index.js';
export * from './uncertainty/index.js';
export * from './adjustment/index.js';
