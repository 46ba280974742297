/**
 * Cost of the DC operating point: Newton iterations, time per iteration, and the share of each
 * iteration spent outside the sparse LU (device evaluation and stamping, residual and update tests,
 * damping), for circuits of 100, 1,000 and 10,000 nonlinear devices.
 *
 * Circuits:
 * - cascaded stages: direct-coupled common-emitter stages, each biased from the collector of the one
 *   before through a divider (a DC gain of about −2/3 per stage, so the bias settles along the chain);
 *   one transistor and four resistors per stage;
 * - diode-resistor meshes: a square grid whose horizontal edges are resistors and vertical edges
 *   diodes pointing down the grid, a resistor from every node to ground, the top row fed from a
 *   supply through resistors.
 *
 * Timing: the LU share is measured by wrapping the solver's factor and solve calls of the Newton
 * workspace; "outside LU" is the rest of the solve (compilation excluded, reported apart).
 *
 * Run: npx tsx bench/operating-point.ts   (prints a table; `--json` prints one JSON line per circuit)
 */
import { performance } from 'node:perf_hooks';
import { conditionsAt, solveFromCurrent, startFromGuess } from '../src/analysis/operating-point.js';
import { prepareSolver } from '../src/analysis/prepared.js';
import { Circuit, GROUND } from '../src/index.js';

/** `count` direct-coupled common-emitter stages on a 12 V supply. */
function cascadedStages(count: number): Circuit {
  const model = { polarity: 'npn', forwardBeta: 150, earlyVoltage: 90 } as const;
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('input', 'c0', GROUND, { dc: 8 });
  for (let k = 1; k <= count; k++) {
    c.resistor(`Rt${k}`, `c${k - 1}`, `b${k}`, '20k')
      .resistor(`Rb${k}`, `b${k}`, GROUND, '10k')
      .bjt(`Q${k}`, { collector: `c${k}`, base: `b${k}`, emitter: `e${k}` }, model)
      .resistor(`Rc${k}`, 'vcc', `c${k}`, '2k')
      .resistor(`Re${k}`, `e${k}`, GROUND, '1k');
  }
  return c;
}

/** A side × side diode-resistor grid (side·(side − 1) diodes) fed from a 10 V supply along its top row. */
function diodeMesh(side: number): Circuit {
  const c = new Circuit().voltageSource('supply', 'supply', GROUND, { dc: 10 });
  for (let i = 0; i < side; i++) {
    for (let j = 0; j < side; j++) {
      const node = `n${i}_${j}`;
      c.resistor(`Rg${i}_${j}`, node, GROUND, '10k');
      if (i === 0) c.resistor(`Rs${j}`, 'supply', node, '1k');
      if (j + 1 < side) c.resistor(`Rh${i}_${j}`, node, `n${i}_${j + 1}`, '470');
      if (i + 1 < side) c.diode(`D${i}_${j}`, node, `n${i + 1}_${j}`);
    }
  }
  return c;
}

interface Row {
  circuit: string;
  devices: number;
  unknowns: number;
  compileMs: number;
  iterations: number;
  strategy: string;
  msPerIteration: number;
  luMsPerIteration: number;
  outsideLuShare: number;
}

/** Solve once to warm up the JIT, then time `repeats` cold solves (x from zero each time). */
function measure(name: string, devices: number, circuit: Circuit, repeats: number): Row {
  const t0 = performance.now();
  const solver = prepareSolver(circuit);
  const compileMs = performance.now() - t0;
  const lu = solver.workspace.solver;
  let luTime = 0;
  const factor = lu.factor.bind(lu);
  const solve = lu.solve.bind(lu);
  lu.factor = (A) => {
    const s = performance.now();
    const status = factor(A);
    luTime += performance.now() - s;
    return status;
  };
  lu.solve = (b) => {
    const s = performance.now();
    solve(b);
    luTime += performance.now() - s;
  };
  const conditions = conditionsAt(solver.options.temperature, solver.options);
  startFromGuess(solver);
  let op = solveFromCurrent(solver, conditions);
  luTime = 0;
  let total = 0;
  for (let r = 0; r < repeats; r++) {
    startFromGuess(solver);
    const s = performance.now();
    op = solveFromCurrent(solver, conditions);
    total += performance.now() - s;
  }
  const iterations = op.iterations;
  const perIteration = total / (repeats * iterations);
  const luPerIteration = luTime / (repeats * iterations);
  return {
    circuit: name,
    devices,
    unknowns: solver.system.n,
    compileMs,
    iterations,
    strategy: op.strategy,
    msPerIteration: perIteration,
    luMsPerIteration: luPerIteration,
    outsideLuShare: 1 - luTime / total,
  };
}

const rows: Row[] = [];
for (const count of [100, 1000, 10000]) {
  rows.push(measure('cascaded stages', count, cascadedStages(count), count >= 10000 ? 3 : 10));
}
for (const side of [11, 32, 101]) {
  const devices = side * (side - 1);
  rows.push(measure('diode-resistor mesh', devices, diodeMesh(side), devices >= 10000 ? 3 : 10));
}

if (process.argv.includes('--json')) {
  for (const row of rows) console.log(JSON.stringify(row));
} else {
  const header = [
    'circuit',
    'devices',
    'unknowns',
    'compile ms',
    'iterations',
    'ms/iteration',
    'LU ms/iteration',
    'outside LU',
  ];
  const body = rows.map((r) => [
    r.circuit,
    String(r.devices),
    String(r.unknowns),
    r.compileMs.toFixed(1),
    `${r.iterations} (${r.strategy})`,
    r.msPerIteration.toFixed(3),
    r.luMsPerIteration.toFixed(3),
    `${(100 * r.outsideLuShare).toFixed(0)} %`,
  ]);
  const widths = header.map((h, k) => Math.max(h.length, ...body.map((row) => row[k]!.length)));
  const line = (cells: string[]) => `| ${cells.map((c, k) => c.padEnd(widths[k]!)).join(' | ')} |`;
  console.log(line(header));
  console.log(`| ${widths.map((w) => '-'.repeat(w)).join(' | ')} |`);
  for (const row of body) console.log(line(row));
}
