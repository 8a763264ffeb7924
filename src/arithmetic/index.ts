export type { Arithmetic, Numeric, ValueOf } from './types.js';
export { rational, RATIONAL_TRANSCENDENTAL_DIGITS } from './rational.js';
export type { Rational, RationalArithmetic } from './rational.js';
export { decimal, MAX_DECIMAL_DIGITS } from './decimal.js';
export type { Decimal, DecimalArithmetic } from './decimal.js';
export { float } from './float.js';
export type { FloatArithmetic } from './float.js';
export { MAX_EXPONENT, readRatio } from './exact.js';
export type { Ratio } from './exact.js';
