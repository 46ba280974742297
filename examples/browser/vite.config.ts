import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

// The example page bundles the library from its sources, as an application bundles the package.
export default defineConfig({
  root: fileURLToPath(new URL('.', import.meta.url)),
  build: { outDir: 'dist', emptyOutDir: true, target: 'es2022' },
  logLevel: 'warn',
});
