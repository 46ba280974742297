/**
 * Cost of the noise analysis against the AC analysis of the same frequencies on the same circuit.
 * The floor is one extra transposed solve per frequency (the adjoint solve that gives every
 * generator's transfer at once) on top of the AC analysis' factorization; the generator loop itself
 * is a few multiplications per generator. Goal: noise within 1.3× the AC analysis.
 *
 * Circuit: a chain of capacitor-coupled common-emitter stages (six elements each: divider bias,
 * collector and emitter resistors, coupling capacitor, transistor with junction capacitances and
 * flicker noise), about 10,000 elements, at 1,000 log-spaced frequencies from 10 Hz to 1 MHz.
 *
 * Run: npx tsx bench/noise.ts   (`--stages N` for another length, `--json` for one JSON line)
 */
import { performance } from 'node:perf_hooks';
import { acAnalysis } from '../src/analysis/ac-analysis.js';
import { logSweep } from '../src/analysis/frequency-grid.js';
import { noise } from '../src/analysis/noise.js';
import { operatingPoint, renderTable } from '../src/index.js';
import { stageChain } from './stage-chain.js';

const FREQUENCY_COUNT = 1000;

function timeMs(run: () => void): number {
  const t0 = performance.now();
  run();
  return performance.now() - t0;
}

const argument = process.argv.indexOf('--stages');
const stages = argument > 0 ? Number(process.argv[argument + 1]) : 1667;
const circuit = stageChain(stages, { flickerCoefficient: 1e-15 });
const op = operatingPoint(circuit);
const frequencies = logSweep(10, 1e6, (FREQUENCY_COUNT - 1) / 5);
const output = `c${stages - 1}`;
const options = { output, frequencies, input: 'signal', sourceResistor: 'source' };

// Warm-up on a few frequencies, then one timed run of each, alternated twice; the faster of each kept.
acAnalysis(op, { frequencies: frequencies.subarray(0, 20) });
noise(op, { ...options, frequencies: frequencies.subarray(0, 20) });
const acTimes: number[] = [];
const noiseTimes: number[] = [];
let generators = 0;
for (let r = 0; r < 2; r++) {
  acTimes.push(timeMs(() => acAnalysis(op, { frequencies })));
  noiseTimes.push(
    timeMs(() => {
      generators = noise(op, options).contributions.length;
    }),
  );
}
const ac = Math.min(...acTimes);
const nz = Math.min(...noiseTimes);
const row = {
  circuit: `CE stages ×${stages}`,
  elements: circuit.elements.length,
  unknowns: op.system.n,
  generators,
  acMs: ac,
  noiseMs: nz,
  ratio: nz / ac,
};
if (process.argv.includes('--json')) {
  console.log(JSON.stringify(row));
} else {
  console.log(
    renderTable({
      title: `Noise against AC analysis, ${frequencies.length} frequencies (10 Hz to 1 MHz), faster of 2 runs; node ${process.version}`,
      columns: [
        { header: 'circuit' },
        { header: 'elements', align: 'right' },
        { header: 'unknowns', align: 'right' },
        { header: 'generators', align: 'right' },
        { header: 'AC analysis (ms)', align: 'right' },
        { header: 'noise (ms)', align: 'right' },
        { header: 'ratio', align: 'right' },
      ],
      rows: [
        [
          row.circuit,
          String(row.elements),
          String(row.unknowns),
          String(row.generators),
          row.acMs.toFixed(0),
          row.noiseMs.toFixed(0),
          row.ratio.toFixed(2),
        ],
      ],
    }),
  );
}
