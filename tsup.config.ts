import { defineConfig } from 'tsup';

export default defineConfig({
  entry: {
    index: 'src/index.ts',
    'testing/index': 'src/testing/index.ts',
    // The module Monte Carlo workers load, beside index.js (src/statistics/worker-script.ts).
    'monte-carlo-worker': 'src/statistics/monte-carlo-worker.ts',
  },
  format: ['esm', 'cjs'],
  dts: true,
  clean: true,
  sourcemap: true,
  target: 'es2022',
  external: ['vitest'],
  // import.meta.url in the CommonJS build too: it finds the worker module.
  shims: true,
});
