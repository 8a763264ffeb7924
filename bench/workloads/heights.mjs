export const name = 'heights';
export function unavailable() { return 'not written yet'; }
export function makeCases() { return []; }
export function build() { return {}; }
