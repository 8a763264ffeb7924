// Workload `levelling`: the levelling networks of bench/workloads/adjustment.mjs — 10 000 points
// (19 800 differences) through `quadspread/float` and the generic entry against the hand-written
// banded solve there; and 200 points (20 × 10, millimetre differences) in `rational` against
// the same in float (ours), with the digits of the exact heights.
import {
  makeLevelling,
  handLevelling,
  heightDigits,
  once,
  polluteAdjustments,
} from './adjustment.mjs';

export const name = 'levelling';
export const title = 'levelling network adjustment, 10 000 points (float); 200 points (rational)';
/** An item is a whole adjustment (about a second): few pairs. */
export const repsScale = 0.15;

export function unavailable(lib) {
  return lib.g.adjustLevelling ? undefined : 'adjustLevelling() is not in the built package yet';
}

export function makeCases() {
  return { lev: makeLevelling(), small: makeLevelling(20, 10, 13, true) };
}

export function build(lib, { lev, small }) {
  const { g, F, R } = lib;
  const key = (r) => r.dof > 0;
  const rat = R.adjustLevelling(small.input);
  const fl = F.adjustLevelling(small.input);
  let off = 0;
  for (const k of Object.keys(rat.heights))
    off = Math.max(
      off,
      Math.abs(R.arithmetic.toNumber(rat.heights[k].value) - fl.heights[k].value),
    );
  return {
    items: 1,
    info: [
      `levelling  exact: 200 points, ${small.input.observations.length} differences in mm: the rational heights' denominators have up to ${heightDigits(rat)} digits; largest |rational − float| height ${off.toExponential(1)} m`,
    ],
    float: {
      ours: once(() => F.adjustLevelling(lev.input), key),
      hand: once(() => handLevelling(lev), key),
    },
    floatGeneric: {
      ours: once(() => g.adjustLevelling(g.float, lev.input), key),
      hand: once(() => handLevelling(lev), key),
    },
    extra: [
      {
        pair: '200 points, rational vs float',
        line: 'exact-vs-float',
        ours: once(() => R.adjustLevelling(small.input), key),
        base: once(() => F.adjustLevelling(small.input), key),
      },
    ],
    pollute: (arithmetics) => polluteAdjustments(g, arithmetics),
  };
}
