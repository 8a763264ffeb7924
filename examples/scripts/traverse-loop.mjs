// A closed traverse from a field book: interior angles and distances around a five-sided loop,
// the angular misclosure balanced, bearings carried, the Bowditch (compass-rule) adjustment,
// and the area enclosed in hectares. (Invented readings, in metres.)
import { float, traverse, polygonArea, formatDms } from 'quadspread';

const t = traverse(float, {
  start: { x: 1000, y: 1000 }, // K1, east and north
  close: 'loop',
  angleKind: 'interior', // turned clockwise at each station: the loop runs counterclockwise
  startBearing: `97°38'22"`, // the bearing of the first course, K1 → K2
  rule: 'compass',
  courses: [
    { angle: `91°20'00"`, distance: 389.886 }, // at K1, then K1 → K2
    { angle: `124°22'29"`, distance: 335.648 }, // at K2, then K2 → K3
    { angle: `102°24'33"`, distance: 358.234 },
    { angle: `110°23'02"`, distance: 372.434 },
    { angle: `111°30'03"`, distance: 393.681 }, // at K5, then K5 → K1
  ],
});

const names = ['K1', 'K2', 'K3', 'K4', 'K5'];
console.log(`angular misclosure: ${formatDms(float, t.angles.misclosure, 1)}`);
t.angles.bearings.forEach((b, i) =>
  console.log(`bearing ${names[i]}–${names[(i + 1) % 5]}: ${formatDms(float, b, 1)}`),
);
console.log(`linear misclosure: ${t.closure.linear.toFixed(4)} m, precision 1 : ${Math.round(t.closure.ratio)}`);
t.adjusted.slice(0, 5).forEach((p, i) =>
  console.log(`${names[i]}: E ${p.x.toFixed(3)}  N ${p.y.toFixed(3)}`),
);
const a = polygonArea(float, t.adjusted.slice(0, 5)); // the adjusted corners, m
console.log(`area: ${a.ha.toFixed(4)} ha (${a.orientation})`);
