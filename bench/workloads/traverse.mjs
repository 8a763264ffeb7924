export const name = 'traverse';
export function unavailable() { return 'not written yet'; }
export function makeCases() { return []; }
export function build() { return {}; }
