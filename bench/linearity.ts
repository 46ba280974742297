/**
 * Cost of the linearity verdict at an output, of two-tone intermodulation and of the large-signal
 * check, each as a ratio to a floor measured in the same run:
 * - linearity(ac, { output }) over 1,000 frequencies against the AC analysis of the same frequencies
 *   (goal ≤ 3×): per frequency the verdict factors at 2f, 3f and f where the AC analysis factors once;
 * - intermodulation(op, …) against an AC analysis at one frequency (goal ≤ 6×): eight factorizations
 *   against one, on one symbolic analysis each;
 * - quasiStaticHarmonics at 64, 256 and 1,024 phases: time per phase, which should stay flat (cost
 *   linear in the number of phases).
 * Circuit: a chain of capacitor-coupled common-emitter stages (divider bias, partly bypassed emitter).
 *
 * Run: npx tsx bench/linearity.ts   (`--quick` for fewer stages and runs; `--json` for JSON lines)
 */
import { performance } from 'node:perf_hooks';
import {
  acAnalysis,
  intermodulation,
  linearity,
  logSweep,
  operatingPoint,
  quasiStaticHarmonics,
  renderTable,
} from '../src/index.js';
import { median, stageChain } from './stage-chain.js';

const quick = process.argv.includes('--quick');

/** Median time of `run` over `repeat` runs after one warm-up, in ms. */
function time(run: () => unknown, repeat: number): number {
  run();
  const samples: number[] = [];
  for (let r = 0; r < repeat; r++) {
    const t0 = performance.now();
    run();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

/**
 * `measured` against `floor`, timed in alternation so that both see the same load on a shared
 * machine: the median of each, and the median of the per-round ratios.
 */
function paired(measured: () => unknown, floor: () => unknown, repeat: number): [number, number, number] {
  measured();
  floor();
  const a: number[] = [];
  const b: number[] = [];
  const ratios: number[] = [];
  for (let r = 0; r < repeat; r++) {
    const t0 = performance.now();
    floor();
    const t1 = performance.now();
    measured();
    const t2 = performance.now();
    b.push(t1 - t0);
    a.push(t2 - t1);
    ratios.push((t2 - t1) / (t1 - t0));
  }
  return [median(a), median(b), median(ratios)];
}

interface Row {
  readonly what: string;
  readonly ms: number;
  readonly floor: string;
  readonly floorMs: number;
  readonly ratio: number;
  readonly goal: string;
}

const rows: Row[] = [];
const repeat = quick ? 3 : 11;
for (const count of quick ? [3] : [3, 30, 300]) {
  const circuit = stageChain(count, { amplitude: 0.01, emitter: 'split' });
  const op = operatingPoint(circuit);
  // The chain loses a little per stage; the output is read where the signal is still well above rounding.
  const output = `c${Math.min(count, 30) - 1}`;
  const frequencies = logSweep(10, 1e6, quick ? 20 : (1000 - 1) / 5);
  const ac = acAnalysis(op, { frequencies });
  const [verdictMs, acMs, verdictRatio] = paired(
    () => linearity(ac, { output }),
    () => acAnalysis(op, { frequencies }),
    repeat,
  );
  rows.push({
    what: `linearity at the output, ${count} stages, ${frequencies.length} frequencies`,
    ms: verdictMs,
    floor: 'AC analysis, same frequencies',
    floorMs: acMs,
    ratio: verdictRatio,
    goal: '≤ 3',
  });
  const [imMs, pointMs, imRatio] = paired(
    () => intermodulation(op, { output, tones: [1e3, 1.1e3] }),
    () => acAnalysis(op, { frequencies: [1e3] }),
    repeat * 5,
  );
  rows.push({
    what: `intermodulation, ${count} stages`,
    ms: imMs,
    floor: 'AC analysis, one frequency',
    floorMs: pointMs,
    ratio: imRatio,
    goal: '≤ 6',
  });
}
const checkCircuit = stageChain(3, { amplitude: 0.01, emitter: 'split' });
const base = time(() => quasiStaticHarmonics(checkCircuit, { output: 'c2', phases: 64 }), quick ? 1 : 3) / 64;
for (const phases of quick ? [256] : [256, 1024]) {
  const perPhase =
    time(() => quasiStaticHarmonics(checkCircuit, { output: 'c2', phases }), quick ? 1 : 3) / phases;
  rows.push({
    what: `large-signal check, 3 stages, ${phases} phases (per phase)`,
    ms: perPhase,
    floor: 'the same at 64 phases (per phase)',
    floorMs: base,
    ratio: perPhase / base,
    goal: '≈ 1 (linear)',
  });
}

if (process.argv.includes('--json')) {
  for (const row of rows) console.log(JSON.stringify(row));
} else {
  console.log(
    renderTable({
      title: `Linearity, intermodulation and the large-signal check, median of runs; node ${process.version}`,
      columns: [
        { header: 'measured' },
        { header: 'ms', align: 'right' },
        { header: 'floor' },
        { header: 'floor ms', align: 'right' },
        { header: 'ratio', align: 'right' },
        { header: 'goal' },
      ],
      rows: rows.map((r) => [
        r.what,
        r.ms.toFixed(3),
        r.floor,
        r.floorMs.toFixed(3),
        r.ratio.toFixed(2),
        r.goal,
      ]),
    }),
  );
}
