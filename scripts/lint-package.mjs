#!/usr/bin/env node
// npm run lint:package — packs the built package and checks the tarball with publint
// (--strict: warnings fail too) and @arethetypeswrong/cli (every entry, every resolution
// mode: node10, node16 CJS and ESM, bundler). Needs `npm run build` first.
import { execFileSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { packTarball, root } from './pack.mjs';

const bin = (name) => join(root, 'node_modules', '.bin', name);
const { tarball, dir, files } = packTarball();
console.log(`lint:package: packed ${files.length} files into ${tarball}`);
let failed = false;
for (const [name, args] of [
  ['publint', ['run', tarball, '--strict']],
  ['attw', [tarball, '--format', 'table-flipped']],
]) {
  console.log(`\n$ ${name} ${args.join(' ')}`);
  try {
    execFileSync(bin(name), args, { cwd: root, stdio: 'inherit' });
  } catch {
    failed = true;
    console.error(`lint:package: ${name} failed`);
  }
}
rmSync(dir, { recursive: true, force: true });
if (failed) process.exit(1);
console.log('\nlint:package: publint and attw clean');
