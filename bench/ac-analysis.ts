/**
 * Cost of the small-signal AC analysis per frequency point, against the floor set by the linear
 * algebra: one complex numeric refactorization plus one solve on the same pattern and values.
 *
 * Circuits: square RC meshes (a resistor between grid neighbours, a capacitor from every node to
 * ground) and chains of capacitor-coupled common-emitter stages (divider bias, bypassed emitter,
 * junction capacitances), each at about 1,000 and 10,000 nodes, analysed at 1,000 frequencies.
 *
 * Run: npx tsx bench/ac-analysis.ts   (prints a table; `--json` prints one JSON line per circuit)
 */
import { performance } from 'node:perf_hooks';
import { acAnalysis } from '../src/analysis/ac-analysis.js';
import { AcWorkspace } from '../src/analysis/ac-workspace.js';
import { logSweep } from '../src/analysis/frequency-grid.js';
import { Circuit, GROUND, type OperatingPoint, operatingPoint, renderTable } from '../src/index.js';
import { createComplexSolver } from '../src/linalg/index.js';
import { median, stageChain } from './stage-chain.js';

const FREQUENCY_COUNT = 1000;

/** A side × side RC mesh driven at one corner through a resistor. */
function rcMesh(side: number): Circuit {
  const c = new Circuit().voltageSource('drive', 'in', GROUND, { ac: 1 }).resistor('feed', 'in', 'n0_0', 50);
  for (let i = 0; i < side; i++) {
    for (let j = 0; j < side; j++) {
      const node = `n${i}_${j}`;
      c.capacitor(`leak${i}_${j}`, node, GROUND, 1e-9);
      if (i + 1 < side) c.resistor(`down${i}_${j}`, node, `n${i + 1}_${j}`, 1e3);
      if (j + 1 < side) c.resistor(`across${i}_${j}`, node, `n${i}_${j + 1}`, 1e3);
    }
  }
  return c;
}

/**
 * Mean time of one complex refactorization plus one solve over the frequencies of the sweep, in ms
 * (median over `repeat` passes): the same solver calls the analysis makes, with the assembly, the
 * residual check and the storing of results left out.
 */
function refactorAndSolveMs(op: OperatingPoint, frequencies: Float64Array, repeat: number): number {
  const workspace = new AcWorkspace(op);
  const { n, pattern } = op.system;
  const solver = createComplexSolver(pattern);
  const xr = new Float64Array(n + 1);
  const xi = new Float64Array(n + 1);
  workspace.assembleAt(frequencies[0]!);
  solver.factor(workspace.Ar, workspace.Ai); // pivot search and symbolic analysis, not timed
  const passes: number[] = [];
  for (let r = 0; r < repeat; r++) {
    let total = 0;
    for (const f of frequencies) {
      workspace.assembleAt(f);
      xr.set(workspace.sourceRe);
      xi.set(workspace.sourceIm);
      const t0 = performance.now();
      const status = solver.factor(workspace.Ar, workspace.Ai);
      solver.solve(xr, xi);
      total += performance.now() - t0;
      if (status !== 0) throw new Error(`the factorization failed at ${f} Hz`);
    }
    passes.push(total / frequencies.length);
  }
  return median(passes);
}

/** Median over `repeat` runs of the whole analysis, in ms. */
function analysisMs(op: OperatingPoint, frequencies: Float64Array, repeat: number): number {
  acAnalysis(op, { frequencies: frequencies.subarray(0, 20) }); // warm-up
  const samples: number[] = [];
  for (let r = 0; r < repeat; r++) {
    const t0 = performance.now();
    acAnalysis(op, { frequencies });
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

interface Row {
  readonly circuit: string;
  readonly unknowns: number;
  readonly nonzeros: number;
  readonly perPointMs: number;
  readonly refactorSolveMs: number;
  readonly ratio: number;
}

function measure(name: string, circuit: Circuit, repeat: number): Row {
  const op = operatingPoint(circuit);
  const frequencies = logSweep(10, 1e6, (FREQUENCY_COUNT - 1) / 5);
  const total = analysisMs(op, frequencies, repeat);
  const perPointMs = total / frequencies.length;
  const refactorSolveMs = refactorAndSolveMs(op, frequencies, repeat);
  return {
    circuit: name,
    unknowns: op.system.n,
    nonzeros: op.system.nnz,
    perPointMs,
    refactorSolveMs,
    ratio: perPointMs / refactorSolveMs,
  };
}

const rows: Row[] = [
  measure('RC mesh 32×32', rcMesh(32), 3),
  measure('RC mesh 100×100', rcMesh(100), 1),
  measure('CE stages ×333', stageChain(333), 3),
  measure('CE stages ×3333', stageChain(3333), 1),
];

if (process.argv.includes('--json')) {
  for (const row of rows) console.log(JSON.stringify(row));
} else {
  console.log(
    renderTable({
      title: `AC analysis, ${FREQUENCY_COUNT} frequencies (10 Hz to 1 MHz), median of runs; node ${process.version}`,
      columns: [
        { header: 'circuit', align: 'left' },
        { header: 'unknowns', align: 'right' },
        { header: 'nonzeros', align: 'right' },
        { header: 'per point (ms)', align: 'right' },
        { header: 'refactor + solve (ms)', align: 'right' },
        { header: 'ratio', align: 'right' },
      ],
      rows: rows.map((r) => [
        r.circuit,
        String(r.unknowns),
        String(r.nonzeros),
        r.perPointMs.toFixed(3),
        r.refactorSolveMs.toFixed(3),
        r.ratio.toFixed(2),
      ]),
    }),
  );
}
