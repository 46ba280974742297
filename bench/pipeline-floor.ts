/**
 * The pipeline benchmark beside its floor: runs bench/pipeline.ts with --export, times SuiteSparse's
 * KLU (bench/klu, built with `make -C bench/klu`; needs Debian's libsuitesparse-dev) on the exported
 * DC Jacobians and AC matrices, and prints each case's ratios to the floor:
 * - repeated operating point ÷ (Newton iterations × (KLU refactorization + solve) of the DC Jacobian),
 * - first operating point (compile included) ÷ the same floor,
 * - AC per frequency ÷ (KLU complex refactorization + solve of the AC matrix).
 *
 * Usage: npx tsx bench/pipeline-floor.ts [--families bipolar,cmos] [--sizes 10000,100000]
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';

const here = dirname(fileURLToPath(import.meta.url));
const klu = join(here, 'klu', 'build', 'klu-bench');
if (!existsSync(klu)) {
  console.error('bench/klu/build/klu-bench is missing: run `make -C bench/klu` (needs libsuitesparse-dev)');
  process.exit(1);
}
const { values } = parseArgs({
  options: {
    families: { type: 'string', default: 'bipolar,mesh,cmos' },
    sizes: { type: 'string', default: '10000,100000' },
  },
});
const dir = mkdtempSync(join(tmpdir(), 'pipeline-floor-'));
const lines = execFileSync(
  process.execPath,
  [
    '--import',
    'tsx',
    join(here, 'pipeline.ts'),
    '--families',
    values.families!,
    '--sizes',
    values.sizes!,
    '--export',
    dir,
  ],
  { encoding: 'utf8', maxBuffer: 1 << 24 },
)
  .split('\n')
  .filter((line) => line.startsWith('{'));

interface KluTiming {
  refactorMs: number;
  solveMs: number;
}
const time = (file: string): KluTiming => JSON.parse(execFileSync(klu, [file, '21'], { encoding: 'utf8' }));
const round = (x: number) => Number(x.toPrecision(3));
for (const line of lines) {
  const row = JSON.parse(line);
  const dc = time(join(dir, `${row.family}-${row.elements}-dc.mtx`));
  const ac = time(join(dir, `${row.family}-${row.elements}-ac.mtx`));
  const floorMs = row.iterations * (dc.refactorMs + dc.solveMs);
  console.log(
    JSON.stringify({
      ...row,
      floorMs: round(floorMs),
      repeatedRatio: round(row.repeatedOperatingPointMs / floorMs),
      firstRatio: round(row.firstOperatingPointMs / floorMs),
      acFloorMs: round(ac.refactorMs + ac.solveMs),
      acRatio: round(row.acPerFrequencyMs / (ac.refactorMs + ac.solveMs)),
    }),
  );
}
