// Placeholder command-line entry: prints a short worked example on invented data until the
// job runner lands.
import { rational, decimal } from '../index.js';

const R = rational;
// Invented data: a mast on Fenwick Knoll read from a station 120 m away (horizontal),
// with a vertical spread of 1/10.
const Q = R.from(120 * 120);
const S = R.from('1/10');
const H = R.div(R.mul(Q, S), R.sub(R.one, S)); // H = Q·R/(1 − R)
const D = decimal(20);
console.log('quadspread demo (invented data: a mast on Fenwick Knoll)');
console.log(`horizontal quadrance Q = ${R.toString(Q)} m², vertical spread R = ${R.toString(S)}`);
console.log(`height quadrance H = Q·R/(1 − R) = ${R.toString(H)} m²; height ≈ ${D.toString(D.sqrt(D.from(R.toString(H)))!)} m`);
console.log('A computational aid: check independently; design and setting-out follow local codes and licensed practice.');
