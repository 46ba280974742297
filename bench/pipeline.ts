/**
 * `npm run bench:pipeline`: the whole path a user takes, timed on three circuit families
 * (pipeline-circuits.ts) at about 1,000, 10,000 and 100,000 elements: building the circuit,
 * compiling it, the first operating point (compile included), a repeated operating point of the
 * unchanged circuit, the AC analysis per frequency, the linearity report, and the peak memory.
 * Each case runs in its own Node process, so that peak memory and JIT state belong to that case, and
 * the smaller cases make untimed passes first (warmUpPasses), so that every figure is of optimized code.
 *
 * Output: one JSON line per case with exactly the keys
 *   family, elements, unknowns, iterations, buildMs, compileMs, firstOperatingPointMs,
 *   repeatedOperatingPointMs, acPerFrequencyMs, linearityMs, peakRssMb
 * (times in ms, medians of repeats; acPerFrequencyMs is the marginal cost of one more frequency, the
 * set-up of an analysis left out, from the fastest of the repeats; peakRssMb is the peak resident
 * memory of a process that makes one pass, build, operating point, a two-frequency AC analysis and
 * its linearity report, on the library bundled and run by plain Node, as the built package runs:
 * bench/pipeline-memory.ts).
 *
 * Usage: npm run bench:pipeline [-- --families bipolar,mesh,cmos] [--sizes 1000,10000,100000]
 *                               [--export DIR]
 * With --export, each case also writes the DC Jacobian at the solution as DIR/<family>-<elements>-dc.mtx
 * and the AC matrix at the analysis frequency as DIR/<family>-<elements>-ac.mtx (complex), so that an
 * outside LU can time the floor on the same matrices.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { buildSync } from 'esbuild';
import { AcWorkspace } from '../src/analysis/ac-workspace.js';
import { preparedFor } from '../src/analysis/prepared.js';
import { acAnalysis, linearity, operatingPoint } from '../src/index.js';
import { formatMatrixMarket } from '../src/linalg/index.js';
import { compileCircuit } from '../src/mna/system.js';
import { PIPELINE_FAMILIES, type PipelineFamily, pipelineCircuit } from './pipeline-circuits.js';

/** The frequency of the AC and linearity timings, in Hz. */
const FREQUENCY = 1e3;

const { values } = parseArgs({
  options: {
    families: { type: 'string', default: PIPELINE_FAMILIES.join(',') },
    sizes: { type: 'string', default: '1000,10000,100000' },
    export: { type: 'string' },
    case: { type: 'string' },
    'peak-rss': { type: 'string' },
  },
});

function median(samples: number[]): number {
  const s = samples.slice().sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
}

/** Time `run` `repeats` times and return the median, in ms. */
function timed(repeats: number, run: () => void): number {
  const samples: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    run();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

/** Time `run` `repeats` times and return the fastest, in ms. */
function fastest(repeats: number, run: () => void): number {
  let best = Number.POSITIVE_INFINITY;
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    run();
    best = Math.min(best, performance.now() - t0);
  }
  return best;
}

/**
 * Untimed passes made before the timed one: a case of 1,000 elements runs each step too few times
 * for V8 to finish optimizing it (compiling took 5 ms in the timed pass, 0.7 ms once warm), so
 * without them its figures would time the JIT, not the library. The largest cases need none.
 */
function warmUpPasses(size: number): number {
  return Math.floor(20_000 / size);
}

function runCase(
  family: PipelineFamily,
  size: number,
  exportDir: string | undefined,
  peakRssMb: number,
): void {
  for (let w = 0; w < warmUpPasses(size); w++) measure(family, size, 1);
  const figures = measure(family, size, size >= 100_000 ? 3 : size >= 10_000 ? 5 : 11);
  if (exportDir !== undefined) {
    writeMatrices(exportDir, family, figures.elements, figures.circuit, figures.op);
  }
  const { circuit: _circuit, op: _op, ...line } = figures;
  console.log(JSON.stringify({ ...line, peakRssMb: round(peakRssMb) }));
}

/** One timed pass over a case, each step repeated `repeats` times. */
function measure(family: PipelineFamily, size: number, repeats: number) {
  let built = pipelineCircuit(family, size);
  const buildMs = timed(repeats, () => {
    built = pipelineCircuit(family, size);
  });
  const { circuit, output } = built;
  const elements = circuit.elements.length;
  const compileMs = timed(repeats, () => {
    compileCircuit(circuit.elements);
  });
  // A first call on a fresh circuit (same elements, nothing cached), then repeated calls on one.
  const fresh = () => pipelineCircuit(family, size).circuit;
  const firstSamples: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const c = fresh();
    const t0 = performance.now();
    operatingPoint(c);
    firstSamples.push(performance.now() - t0);
  }
  const firstOperatingPointMs = median(firstSamples);
  let op = operatingPoint(circuit);
  const repeatedOperatingPointMs = timed(repeats, () => {
    op = operatingPoint(circuit);
  });
  // The marginal cost of a frequency: an analysis of 3F frequencies less one of F, over 2F, so that
  // the set-up of an analysis (stamping every device once, the first factorization) is left out.
  const count = size >= 100_000 ? 16 : 64;
  const sweep = (m: number) => Array.from({ length: m }, (_, k) => FREQUENCY * (1 + k / m));
  const few = sweep(count);
  const many = sweep(3 * count);
  acAnalysis(op, { frequencies: few });
  // The fastest of the repeats for each: a collection landing in one run would swamp the difference.
  const acPerFrequencyMs =
    (fastest(repeats, () => acAnalysis(op, { frequencies: many })) -
      fastest(repeats, () => acAnalysis(op, { frequencies: few }))) /
    (2 * count);
  const single = acAnalysis(op, { frequencies: [FREQUENCY] });
  const linearityMs = timed(repeats, () => linearity(single));
  void output;
  return {
    family,
    elements,
    unknowns: op.system.n,
    iterations: op.iterations,
    buildMs: round(buildMs),
    compileMs: round(compileMs),
    firstOperatingPointMs: round(firstOperatingPointMs),
    repeatedOperatingPointMs: round(repeatedOperatingPointMs),
    acPerFrequencyMs: round(acPerFrequencyMs),
    linearityMs: round(linearityMs),
    circuit,
    op,
  };
}

function round(x: number): number {
  return Number(x.toPrecision(4));
}

/** Write the DC Jacobian at the solution and the AC matrix at {@link FREQUENCY}. */
function writeMatrices(
  dir: string,
  family: string,
  elements: number,
  circuit: Parameters<typeof operatingPoint>[0],
  op: ReturnType<typeof operatingPoint>,
): void {
  mkdirSync(dir, { recursive: true });
  const prepared = preparedFor(circuit as never);
  const jacobian = prepared.jacobianAt(op);
  const pattern = op.system.pattern;
  const nnz = pattern.Ap[pattern.n]!;
  writeFileSync(
    join(dir, `${family}-${elements}-dc.mtx`),
    formatMatrixMarket(pattern, jacobian.subarray(0, nnz), null),
  );
  const ac = new AcWorkspace(op);
  ac.assembleAt(FREQUENCY);
  writeFileSync(
    join(dir, `${family}-${elements}-ac.mtx`),
    formatMatrixMarket(pattern, ac.Ar.subarray(0, nnz), ac.Ai.subarray(0, nnz)),
  );
}

if (values.case !== undefined) {
  const [family, size] = values.case.split(':');
  runCase(
    family as PipelineFamily,
    Number(size),
    values.export === undefined ? undefined : resolve(values.export),
    Number(values['peak-rss']),
  );
} else {
  const families = values.families!.split(',') as PipelineFamily[];
  for (const f of families) {
    if (!PIPELINE_FAMILIES.includes(f))
      throw new Error(`unknown family '${f}' (${PIPELINE_FAMILIES.join(', ')})`);
  }
  const sizes = values.sizes!.split(',').map(Number);
  const self = fileURLToPath(import.meta.url);
  // The memory pass runs on the library bundled as the built package is (esbuild, as the build's
  // tsup uses), in a process of its own per case.
  const bundleDir = mkdtempSync(join(tmpdir(), 'quiescent-pipeline-'));
  const probe = join(bundleDir, 'pipeline-memory.mjs');
  buildSync({
    entryPoints: [join(dirname(self), 'pipeline-memory.ts')],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile: probe,
    logLevel: 'warning',
  });
  let failed = 0;
  for (const family of families) {
    for (const size of sizes) {
      const memory = spawnSync(process.execPath, ['--max-old-space-size=8192', probe, `${family}:${size}`], {
        encoding: 'utf8',
        stdio: ['ignore', 'pipe', 'inherit'],
      });
      const peakRssMb = Number(memory.stdout.trim());
      if (memory.status !== 0 || !(peakRssMb > 0)) {
        failed++;
        continue;
      }
      const args = ['--import', 'tsx', self, '--case', `${family}:${size}`, '--peak-rss', String(peakRssMb)];
      if (values.export !== undefined) args.push('--export', resolve(values.export));
      const run = spawnSync(process.execPath, ['--max-old-space-size=8192', ...args], { stdio: 'inherit' });
      if (run.status !== 0) failed++;
    }
  }
  rmSync(bundleDir, { recursive: true, force: true });
  process.exit(failed === 0 ? 0 : 1);
}
