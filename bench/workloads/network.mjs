// Workload `network`: the plane network of bench/workloads/adjustment.mjs (1000 points, about
// 5000 distances and bearings), `adjustNetwork` through `quadspread/float` and the generic entry
// against the hand-written banded Gauss–Newton there.
import { makeNetwork, handNetwork, once, polluteAdjustments } from './adjustment.mjs';

export const name = 'network';
export const title = 'plane network adjustment, 1000 points, ~5000 observations (float)';
/** An item is a whole adjustment (about a second): few pairs. */
export const repsScale = 0.15;

export function unavailable(lib) {
  return lib.g.adjustNetwork ? undefined : 'adjustNetwork() is not in the built package yet';
}

export function makeCases() {
  return makeNetwork();
}

export function build(lib, net) {
  const { g, F } = lib;
  const key = (r) => r.dof > 0;
  return {
    items: 1,
    float: {
      ours: once(() => F.adjustNetwork(net.input), key),
      hand: once(() => handNetwork(net), key),
    },
    floatGeneric: {
      ours: once(() => g.adjustNetwork(g.float, net.input), key),
      hand: once(() => handNetwork(net), key),
    },
    pollute: (arithmetics) => polluteAdjustments(g, arithmetics),
  };
}
