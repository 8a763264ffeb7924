// The adversarial suite, a bounded sample (the long run: `npm run fuzz`, figures in
// docs/errors.md): every exported function of every entry, called as its documented examples
// call it with one argument or nested field replaced by junk, must return a sane value (no
// NaN or ±Infinity anywhere in it, the type of its valid result) or throw a QuadspreadError —
// never another error type — within the watchdog's time limit. Errors that the junk raises
// itself (a throwing getter or Proxy trap, a revoked Proxy) pass through unchanged and are
// counted apart.
import { describe, expect, it } from 'vitest';
import { runAdversarial } from './harness';

describe('the adversarial suite (bounded sample)', () => {
  it('finds no untyped error, no non-finite result and no timeout in any entry', async () => {
    const s = await runAdversarial({ seed: 20261202, runs: 10, timeoutMs: 15000 });
    const shown = s.failures
      .slice(0, 10)
      .map((f) => `${f.kind}: ${f.site} ${f.path} = ${f.junk}: ${f.detail}`);
    expect(shown).toEqual([]);
    expect(s.untyped + s.nonFinite + s.wrongType).toBe(0);
    expect(s.timeouts).toEqual([]);
    // Every exported function of the generic entry is called, found through its @example (one
    // whose example makes no valid call is listed here).
    expect(s.uncovered['quadspread']!.length, s.uncovered['quadspread']!.join(', ')).toBeLessThan(
      5,
    );
    expect(s.sites).toBeGreaterThan(700);
  }, 240_000);
});
