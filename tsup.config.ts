import path from 'node:path';
import { defineConfig, type Options } from 'tsup';
import type { Plugin } from 'esbuild';
// The float entry's modules are compiled float-specialised (A.add(x, y) → x + y …); see the file.
// @ts-expect-error -- a plain .mjs plugin without declarations (tsc checks *.config.ts)
import { floatSpecialize } from './scripts/float-specialize.mjs';

// `npm run build` (scripts/build.mjs) regenerates the bound entries, empties dist/, runs
// these builds and fixes up the declarations.
//
// - quadspread/float is bundled as a self-contained copy (splitting: false), in ESM and CJS,
//   so that its code only ever sees the float arithmetic (see docs/performance.md).
// - The ESM of quadspread, quadspread/rational and quadspread/decimal is one file per source
//   module (dist/esm/), so that a consumer's bundler drops every module it does not use
//   (package.json has sideEffects: false): `quadrance` + `float` does not pull in fraction.js
//   or big.js (npm run size checks the budget).
// - The CJS of every entry is bundled; declarations (.d.ts and .d.cts) are built once.
const common: Options = {
  target: 'es2022',
  platform: 'neutral',
  sourcemap: false,
  clean: false,
  // (the io entry's parsers too: dependencies of the package, as fraction.js and big.js are)
  external: ['fraction.js', 'big.js', 'csv-parse', 'fast-xml-parser'],
};
const entries = {
  index: 'src/index.ts',
  rational: 'src/entries/rational.gen.ts',
  decimal: 'src/entries/decimal.gen.ts',
  float: 'src/entries/float.gen.ts',
  // quadspread/io (src/io, docs/interop.md): file formats, kept out of the other entries so
  // that bundles of the solvers never carry the parsers.
  io: 'src/io/index.ts',
};

// In the ESM of quadspread/float, the decimal arithmetic is not copied in but imported from the
// per-module tree (dist/esm/arithmetic/decimal.js): it has no float code to specialise, and
// big.js (8 KiB, a package with side effects as far as bundlers know) then reaches a consumer's
// bundle only when `decimal` is used.
const decimalFromTree = {
  name: 'decimal-from-esm-tree',
  setup(build: {
    onResolve: (
      o: { filter: RegExp },
      f: (a: { path: string; resolveDir: string }) => unknown,
    ) => void;
  }) {
    const target = path.resolve('src/arithmetic/decimal.ts');
    build.onResolve({ filter: /(^|\/)decimal\.js$/ }, (args) =>
      path.resolve(args.resolveDir, args.path.replace(/\.js$/, '.ts')) === target
        ? { path: './esm/arithmetic/decimal.js', external: true }
        : undefined,
    );
  },
};

// For the CommonJS bound entries rational and decimal, and for io: every import of the generic
// source (../index.js, ../arithmetic/*.js) becomes a require of the bundled generic entry, so the
// package carries the library's code once (the arithmetic each entry fixes is exported there).
const genericFromIndex: Plugin = {
  name: 'generic-from-index',
  setup(build) {
    build.onResolve({ filter: /^\.\.\/(index|arithmetic\/[\w-]+)\.js$/ }, (args) =>
      /[\\/](entries[\\/][\w.]+\.gen|io[\\/][\w-]+)\.ts$/.test(args.importer)
        ? { path: './index.cjs', external: true }
        : undefined,
    );
  },
};

export default defineConfig([
  {
    ...common,
    entry: { index: entries.index, float: entries.float },
    format: ['cjs'],
    splitting: false,
    treeshake: true,
    esbuildPlugins: [floatSpecialize()],
  },
  // The CommonJS quadspread/rational and quadspread/decimal are thin: they require
  // dist/index.cjs for everything but their own wrappers, instead of a 220 KB copy each.
  {
    ...common,
    entry: { rational: entries.rational, decimal: entries.decimal, io: entries.io },
    format: ['cjs'],
    splitting: false,
    treeshake: true,
    esbuildPlugins: [genericFromIndex],
  },
  {
    ...common,
    entry: { float: 'src/entries/float.gen.ts' },
    format: ['esm'],
    splitting: false,
    treeshake: true,
    esbuildPlugins: [decimalFromTree, floatSpecialize()],
  },
  {
    ...common,
    // dist/esm/rational.js and decimal.js are one-line re-exports of dist/esm/entries/*.gen.js,
    // written by scripts/build.mjs, so the package's file names stay as they were.
    entry: ['src/**/*.ts', '!src/cli/**', '!src/entries/float.gen.ts'],
    outDir: 'dist/esm',
    format: ['esm'],
    bundle: false,
  },
  { ...common, entry: entries, format: ['esm', 'cjs'], dts: { only: true } },
  // The quadspread command (src/cli, docs/cli.md): one ES module for Node with commander bundled
  // in (runtime dependencies stay fraction.js and big.js); commander is CommonJS, so the bundle
  // gets a require() for its node: imports.
  {
    ...common,
    // dist/batch-worker.js: the script of the batch command's worker threads (the batch code
    // only, so that a worker starts quickly); found by dist/cli.js beside itself.
    entry: { cli: 'src/cli/main.ts', 'batch-worker': 'src/cli/batch-worker-main.ts' },
    format: ['esm'],
    platform: 'node',
    target: 'node20',
    splitting: false,
    treeshake: true,
    noExternal: ['commander'],
    // Minified in the tarball (432 KB → see README): users run it, they do not read it.
    minify: true,
    banner: {
      js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);",
    },
  },
]);
