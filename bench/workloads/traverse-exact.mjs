// Workload `traverse20`: exact traverses of 20 courses in `rational` — the size of a field
// traverse, where the precision ratio's root and the adjustment's gcds weigh most.
//   - given lengths: { latitude, departure, distance } (mm), against plain fraction.js (one
//     operation per step, √ through Math.sqrt of the value), as workload (c) at 1000 courses;
//   - computed lengths: the same courses without `distance`, so each length is √(lat² + dep²)
//     as an integer root on one decimal scale, against the same traverse with given lengths
//     (the goal: within 3×, i.e. no digit blow-up from the roots).
import Fraction from 'fraction.js';
import { rng } from '../data.mjs';
import { loop1 } from '../harness.mjs';
import { loopCases, naiveFraction } from './traverse.mjs';

export const name = 'traverse20';
export const title = 'exact traverse of 20 courses, given and computed lengths (rational)';
const COURSES = 20;

export function unavailable(lib) {
  return lib.g.traverse ? undefined : 'traverse() is not in the built package yet';
}

/** `n`/10 closed loops of 20 courses (legs 20–300 m, mm values, a few mm of misclosure). */
export function makeCases(n, seed = 20) {
  return loopCases(rng(seed), Math.max(5, Math.min(40, Math.round(n / 10))), COURSES);
}

export function build(lib, cases) {
  const { g, R } = lib;
  const from = (s) => R.arithmetic.from(s);
  const given = cases.map((t) => ({
    start: { x: from(t.start.x), y: from(t.start.y) },
    courses: t.courses.map((c) => ({
      latitude: from(c.latitude),
      departure: from(c.departure),
      distance: from(c.distance),
    })),
  }));
  const computed = given.map((t) => ({
    start: t.start,
    courses: t.courses.map((c) => ({ latitude: c.latitude, departure: c.departure })),
  }));
  const fr = cases.map((t) => ({
    start: { x: new Fraction(t.start.x), y: new Fraction(t.start.y) },
    courses: t.courses.map((c) => ({
      latitude: new Fraction(c.latitude),
      departure: new Fraction(c.departure),
      distance: new Fraction(c.distance),
    })),
  }));
  const key = (r) => r.adjusted.length > 0;
  return {
    items: cases.length,
    rational: { ours: loop1(given, R.traverse, key), naive: loop1(fr, naiveFraction, key) },
    // Lower is better: computed lengths / given lengths, both ours.
    extra: [
      {
        pair: 'computed vs given lengths',
        line: 'computed-vs-given',
        ours: loop1(computed, R.traverse, key),
        base: loop1(given, R.traverse, key),
      },
    ],
    pollute(arithmetics) {
      let n = 0;
      for (const A of arithmetics) n += g.traverse(A, cases[0]) ? 1 : 0;
      return n;
    },
  };
}
