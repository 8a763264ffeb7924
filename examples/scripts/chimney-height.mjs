// The height of a chimney top above the instruments, in feet, from two stations A and B at the
// ends of a taped base: horizontal angles at A and B between the base and the chimney, and
// zenith angles to its top, all read in degrees, minutes and seconds, each with its standard
// uncertainty — and the budget: which reading the uncertainty comes from.
// (Invented readings; both instruments at the same height.)
import {
  uncertain,
  float,
  measuredQuadrance,
  measuredAngle,
  verticalFromAngle,
  heightFromBase,
  metresToLength,
  budget,
} from 'quadspread';

const U = uncertain(float);

// The base A–B, taped: 150.00 ft ± 0.02 ft.
const base = measuredQuadrance(U, '150.00 ft', '0.02 ft', 'base A–B');
// Horizontal angles between the base and the chimney, at A and at B: ± 5″.
const atA = measuredAngle(U, `58°21'14"`, 5, 'angle at A');
const atB = measuredAngle(U, `64°05'52"`, 5, 'angle at B');
// Zenith angles to the top of the chimney: ± 5″.
const zenithA = measuredAngle(U, `63°25'14"`, 5, 'zenith at A');
const zenithB = measuredAngle(U, `62°08'11"`, 5, 'zenith at B');

const result = heightFromBase(U, {
  base,
  angles: [atA, atB],
  vertical: [
    verticalFromAngle(U, zenithA, { kind: 'zenith' }),
    verticalFromAngle(U, zenithB, { kind: 'zenith' }),
  ],
});

const height = metresToLength(U, result.height, 'ft');
const b = budget(U, height);
console.log(`height above the instruments: ${height.value.toFixed(2)} ft`);
console.log(`standard uncertainty: ${b.sigma.toFixed(3)} ft`);
for (const c of b.contributions)
  console.log(`  ${c.name}: ${((100 * c.contribution) / b.variance).toFixed(1)} %`);
