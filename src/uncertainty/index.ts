// Public exports of src/uncertainty/ (one line per file as files land).
export * from './measured.js';
export * from './budget.js';
export * from './random.js';
export * from './monte-carlo.js';
export * from './readings.js';
export * from './roundoff.js';
