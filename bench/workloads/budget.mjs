export const name = 'budget';
export function unavailable() { return 'not written yet'; }
export function makeCases() { return []; }
export function build() { return {}; }
