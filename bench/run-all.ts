/**
 * `npm run bench`: runs every benchmark of the project, one after another, each in its own Node
 * process so that one JIT state never colours the next. To add a benchmark, add its file here.
 */
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Benchmark modules with their arguments, run in this order. */
const BENCHMARKS: readonly (readonly string[])[] = [
  ['lu-families.ts'],
  ['operating-point.ts'],
  ['ac-analysis.ts'],
  ['pipeline.ts', '--sizes', '1000,10000'],
  ['small-circuit.ts'],
  ['noise.ts'],
  ['linearity.ts'],
  ['stability.ts'],
];

const here = dirname(fileURLToPath(import.meta.url));
let failed = 0;
for (const [file, ...args] of BENCHMARKS) {
  process.stdout.write(`\n## ${file} ${args.join(' ')}\n\n`);
  const run = spawnSync(process.execPath, ['--import', 'tsx', join(here, file!), ...args], {
    stdio: 'inherit',
  });
  if (run.status !== 0) failed++;
}
process.exit(failed === 0 ? 0 : 1);
