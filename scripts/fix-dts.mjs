#!/usr/bin/env node
// After tsup: makes the published declarations correct under every module resolution.
//
// fraction.js types its CommonJS flavour as `export = <a const>`, so in dist/*.d.cts the
// emitted `import Fraction from 'fraction.js'` names a value, not the class type, and a
// TypeScript consumer with `module: node16` that requires quadspread gets TS2749 ("'Fraction'
// refers to a value, but is being used as a type"). Both flavours of fraction.js export the
// class as `Fraction` (named in its ESM types, a property in its CJS types), so the type is
// taken from there instead, which resolves the same in ESM, CJS, bundler and node10 modes.
// test/package/consumer.mjs typechecks every mode with skipLibCheck off.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const dist = resolve(
  process.argv[2] ?? resolve(dirname(fileURLToPath(import.meta.url)), '../dist'),
);
const IMPORT = /^import Fraction from 'fraction\.js';$/m;
const REPLACEMENT = "type Fraction = InstanceType<(typeof import('fraction.js'))['Fraction']>;";
let fixed = 0;
for (const name of readdirSync(dist)) {
  if (!/\.d\.c?ts$/.test(name)) continue;
  const path = resolve(dist, name);
  const text = readFileSync(path, 'utf8');
  if (!IMPORT.test(text)) continue;
  writeFileSync(path, text.replace(IMPORT, REPLACEMENT));
  fixed++;
}
console.log(
  `fix-dts: ${fixed} declaration files take the Fraction type from fraction.js's named export`,
);
