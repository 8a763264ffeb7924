/**
 * The float twin of the uncertainty budget: kept out of the package's exports (an internal
 * module, tested against the generic code in test/uncertainty/budget.test.ts).
 *
 * @module uncertainty
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import type { Uncertain, UncertainInput } from '../arithmetic/uncertain.js';
import type { Budget, Contribution } from './budget.js';

/**
 * The float twin of `budget` without covariances (src/uncertainty/budget.ts): the same sums
 * in the same order and the same sort, in plain numbers; `undefined` where the generic code
 * would refuse something (it then runs and throws). With every derivative and σ a number, a
 * finite variance means every product before it was finite.
 * @internal
 */
export function budgetFloat(
  B: Arithmetic<number, false>,
  y: Uncertain<number>,
): Budget<number, false> | undefined {
  const inputs = y.inputs;
  const ders = y.derivatives;
  const n = inputs.length;
  const lines: Contribution<number>[] = [];
  let variance = 0;
  for (let i = 0; i < n; i++) {
    const input = inputs[i] as UncertainInput<number>;
    const c = ders[i] as number;
    const sigma = input.sigma;
    // (numbers only: JS arithmetic would read text, booleans or null where float.mul refuses)
    if (typeof c !== 'number' || typeof sigma !== 'number') return undefined;
    const cu = c * sigma;
    const contribution = cu * cu;
    variance += contribution;
    lines.push({ name: input.name, value: input.value, sigma, sensitivity: c, contribution });
  }
  if (variance - variance !== 0 || y.value - y.value !== 0) return undefined;
  // largest contribution first, ties by name (budget's order: names are distinct, so any
  // sort gives it), by insertion for a few lines
  if (n > 16)
    lines.sort(
      (p, q) => q.contribution - p.contribution || (p.name < q.name ? -1 : p.name > q.name ? 1 : 0),
    );
  else
    for (let i = 1; i < n; i++) {
      const l = lines[i] as Contribution<number>;
      let j = i - 1;
      for (; j >= 0; j--) {
        const q = lines[j] as Contribution<number>;
        if (!(
          q.contribution < l.contribution ||
          (q.contribution === l.contribution && q.name > l.name)
        ))
          break;
        lines[j + 1] = q;
      }
      lines[j + 1] = l;
    }
  return {
    value: y.value,
    variance,
    // budget's sigmaOf over an inexact base: the base's own root of the variance
    sigma: B.sqrt(variance) as number,
    contributions: lines,
    correlations: [],
  };
}
