/**
 * The size of the library in a browser bundle: vite bundles src/index.ts as a library (ES module,
 * minified, complex.js included as an application would ship it) without writing files, and this
 * prints the bytes minified and gzipped. Run: `npx tsx scripts/bundle-size.ts`; the figures go in
 * docs/performance.md.
 */

import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { build, type Rollup } from 'vite';

const entry = fileURLToPath(new URL('../src/index.ts', import.meta.url));
const result = await build({
  configFile: false,
  logLevel: 'silent',
  build: {
    write: false,
    minify: true,
    target: 'es2022',
    lib: { entry, formats: ['es'], fileName: 'quiescent' },
  },
});
const outputs = (Array.isArray(result) ? result : [result]) as Rollup.RollupOutput[];
let minified = 0;
let gzipped = 0;
for (const output of outputs) {
  for (const chunk of output.output) {
    if (chunk.type !== 'chunk') continue;
    const bytes = Buffer.from(chunk.code);
    minified += bytes.length;
    gzipped += gzipSync(bytes, { level: 9 }).length;
  }
}
const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;
console.log(`quiescent (src/index.ts with complex.js), vite ${(await import('vite')).version}:`);
console.log(`  minified ${kB(minified)} (${minified} bytes), gzipped ${kB(gzipped)} (${gzipped} bytes)`);
