// A haul road cut across a hillside that falls at 1 in 3: how far from the fall line (on the
// plan) must it turn to climb at no more than 1 in 10, and how steep is a road turned 60° from
// the fall line? Exact in rational: the spreads are fractions.
import {
  rational,
  pathGrade,
  pathOffset,
  spreadFromOneIn,
  spreadFromDegrees,
  gradeFromSpread,
  degreesFromSpread,
  formatDms,
} from 'quadspread';

const R = rational;
const fall = spreadFromOneIn(R, 3); // the hillside: 1 in 3
const ruling = spreadFromOneIn(R, 10); // the ruling grade: 1 in 10

// The plan direction that holds the ruling grade exactly, as a spread from the fall line.
const offset = pathOffset(R, { fall, grade: ruling, measured: 'plan' });
console.log(`turn from the fall line (spread): ${R.toString(offset)}`);
console.log(`turn from the fall line (angle): ${formatDms(R, degreesFromSpread(R, offset), 1)}`);

// A road turned 60° from the fall line on the plan.
const grade60 = pathGrade(R, { fall, offset: spreadFromDegrees(R, 60), measured: 'plan' });
const percent = gradeFromSpread(R, grade60); // exact: a surd, here rational
console.log(`grade of a road 60° from the fall line: ${percent.toString()} % = ${percent.toPrecision(6)} %`);
