/**
 * Iterative data snooping: remove the observation with the largest suspect standardized
 * residual, adjust again, until no observation is suspect (Baarda, *A testing procedure for
 * use in geodetic networks*, Netherlands Geodetic Commission, Publ. on Geodesy 2(5), 1968).
 *
 * @module adjustment
 * @internal
 */
import type { Arithmetic } from '../arithmetic/types.js';
import { QuadspreadError } from '../errors.js';
import type { Root } from '../geometry/surd.js';

/** One observation removed by data snooping. */
export interface SnoopingRemoval<T, E extends boolean> {
  /** Its index in the input observations. */
  readonly index: number;
  /** Its standardized residual (w or τ) when it was removed. */
  readonly standardized: Root<T, E>;
  /** The critical value it exceeded. */
  readonly critical: number;
  /** Why: the largest |w| (or |τ|) above the critical value in that round. */
  readonly reason: string;
}

/** What data snooping did. */
export interface SnoopingReport<T, E extends boolean> {
  /** The observations removed, in the order they were removed. */
  readonly removed: SnoopingRemoval<T, E>[];
  /**
   * Why it stopped with a suspect observation left, when it did: removing it would leave
   * the network without a datum or disconnected.
   */
  readonly stopped?: string;
}

interface Snoopable<T, E extends boolean> {
  readonly observations: readonly {
    readonly standardized: Root<T, E> | undefined;
    readonly suspect: boolean;
  }[];
  readonly localTest: { readonly critical: number; readonly kind: string };
  /** w² (or τ²) scaled alike for all observations, for comparing exactly. */
  readonly w2: readonly (T | undefined)[];
}

/** Runs data snooping over `run`. @internal */
export function snoop<T, E extends boolean, R extends Snoopable<T, E>>(
  A: Arithmetic<T, E>,
  active: boolean[],
  run: (active: readonly boolean[]) => R,
  inputIndex: (r: R, k: number) => number,
): { result: R; report: SnoopingReport<T, E> } {
  const removed: SnoopingRemoval<T, E>[] = [];
  let result = run(active);
  for (let round = 0; round <= active.length; round++) {
    let best = -1;
    for (let k = 0; k < result.observations.length; k++) {
      if (!result.observations[k]!.suspect || inputIndex(result, k) < 0) continue;
      if (best < 0 || A.cmp(result.w2[k]!, result.w2[best]!) > 0) best = k;
    }
    if (best < 0) return { result, report: { removed } };
    const index = inputIndex(result, best);
    active[index] = false;
    let next: R;
    try {
      next = run(active);
    } catch (e) {
      if (!(e instanceof QuadspreadError)) throw e;
      active[index] = true;
      return {
        result,
        report: {
          removed,
          stopped: `observation ${index} is suspect but removing it leaves the network without a solution (${e.code})`,
        },
      };
    }
    const { critical, kind } = result.localTest;
    removed.push({
      index,
      standardized: result.observations[best]!.standardized!,
      critical,
      reason: `largest |${kind}| above the critical value ${critical.toFixed(4)}`,
    });
    result = next;
  }
  return { result, report: { removed } };
}
