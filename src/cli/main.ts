#!/usr/bin/env node
/**
 * The `quadspread` command: see `docs/cli.md`. Exit codes: 0 done, 2 bad command line or
 * job file, 3 a computation with no solution, 1 an internal error.
 *
 * @module cli
 */
import { main } from './program.js';

const code = await main(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  stderrIsTTY: process.stderr.isTTY === true,
});
process.exitCode = code;
