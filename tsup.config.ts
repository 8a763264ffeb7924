import { defineConfig } from 'tsup';
// The float entry's modules are compiled float-specialised (A.add(x, y) → x + y …); see the file.
import { floatSpecialize } from './scripts/float-specialize.mjs';

// Each entry is bundled as a self-contained copy (splitting: false), so that the code in
// quadspread/float only ever sees the float arithmetic (see docs/performance.md).
export default defineConfig([
  {
    entry: { index: 'src/index.ts', rational: 'src/rational.ts', decimal: 'src/decimal.ts', float: 'src/float.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    splitting: false,
    sourcemap: false,
    clean: true,
    target: 'es2022',
    platform: 'neutral',
    treeshake: true,
    external: ['fraction.js', 'big.js'],
    esbuildPlugins: [floatSpecialize()],
  },
]);
