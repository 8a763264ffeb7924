#!/usr/bin/env node
// A hand-written Node script doing what `quadspread batch inverses <file> -a float` does, for
// inputs of plain decimal numbers: the baseline of bench/batch.mjs, which checks that both
// write the same bytes. Usage: node hand-inverses.mjs <in.csv> > out.csv
//
// Bearing clockwise from north: atan2(east, north) in degrees, exact on the axes and
// diagonals, in [0°, 360°). Numbers to 10 significant digits (Number#toPrecision, which
// rounds the exact value of the double half away from zero), written without an exponent
// from 1e-7 to below 1e21 as quadspread writes them.
import { createReadStream } from 'node:fs';
import { writeSync } from 'node:fs';

const digits = 10;
function fmt(x) {
  const t = x.toPrecision(digits);
  const at = t.indexOf('e');
  if (at < 0) return t;
  const e = Number(t.slice(at + 1));
  if (e < -7 || e > 20) return t;
  const neg = t[0] === '-';
  const s = t.slice(neg ? 1 : 0, at).replace('.', '');
  const fixed = e < 0 ? '0.000000' + s : s + '0'.repeat(e + 1 - s.length);
  return neg ? '-' + fixed : fixed;
}

function azimuth(dx, dy) {
  if (dx === 0) return dy > 0 ? 0 : 180;
  if (dy === 0) return dx > 0 ? 90 : 270;
  if (Math.abs(dx) === Math.abs(dy)) return dx > 0 ? (dy > 0 ? 45 : 135) : dy < 0 ? 225 : 315;
  let deg = (Math.atan2(dx, dy) * 180) / Math.PI;
  if (deg < 0) deg += 360;
  if (deg >= 360) deg -= 360;
  return deg;
}

let out = '';
const flush = () => {
  writeSync(1, out);
  out = '';
};
let cols;
let rest = '';
for await (const chunk of createReadStream(process.argv[2], { encoding: 'utf8' })) {
  const lines = (rest + chunk).split('\n');
  rest = lines.pop();
  for (const line of lines) {
    if (line === '') continue;
    const f = line.split(',');
    if (!cols) {
      cols = ['east1', 'north1', 'east2', 'north2'].map((c) => f.indexOf(c));
      out += `${line},quadrance,distance,bearing\n`;
      continue;
    }
    const e1 = Number(f[cols[0]]);
    const n1 = Number(f[cols[1]]);
    const dx = Number(f[cols[2]]) - e1;
    const dy = Number(f[cols[3]]) - n1;
    const Q = dx * dx + dy * dy;
    const b = dx === 0 && dy === 0 ? '' : fmt(azimuth(dx, dy));
    out += `${line},${fmt(Q)},${fmt(Math.sqrt(Q))},${b}\n`;
    if (out.length > 65536) flush();
  }
}
flush();
