/**
 * Cost of the stability analyses.
 *
 * - Loop gain over 1,000 frequencies against the AC analysis of the same circuit at the same
 *   frequencies (the floor: one factorization per frequency either way; the loop gain adds a second
 *   solve and a second residual check). Target: at most 2.5 times.
 * - Every pole, densely, of a circuit of about 500 unknowns (a ladder of RLC sections).
 * - The 10 poles nearest 0 Hz of an RC mesh of about 100,000 unknowns, by shift and invert.
 *
 * Run: npx tsx bench/stability.ts   (prints a table; `--json` prints one JSON line per measurement)
 */
import { performance } from 'node:perf_hooks';
import {
  acAnalysis,
  Circuit,
  GROUND,
  logSweep,
  loopGain,
  operatingPoint,
  poles,
  renderTable,
} from '../src/index.js';

/** Median of a few samples, in ms. */
function median(samples: number[]): number {
  const sorted = [...samples].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

function timeMs(run: () => unknown, repeat: number): number {
  const samples: number[] = [];
  for (let r = 0; r < repeat; r++) {
    const t0 = performance.now();
    run();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

/**
 * A side × side RC mesh (a resistor between grid neighbours, a capacitor from every node to ground),
 * optionally inside a follower's feedback loop: the op-amp drives one corner through the loop probe,
 * and the far corner returns to its inverting input.
 */
function mesh(side: number, loop: boolean): Circuit {
  const c = new Circuit().voltageSource('signal', 'in', GROUND, { ac: 1 });
  const far = `n${side - 1}_${side - 1}`;
  if (loop) {
    c.opAmp('U1', { plus: 'in', minus: far, output: 'amp' }, { openLoopGain: 1e5, gainBandwidth: 1e6 });
    c.loopProbe('loopBreak', 'amp', 'drive');
  } else {
    c.loopProbe('loopBreak', 'in', 'drive');
  }
  c.resistor('Rdrive', 'drive', 'n0_0', 50);
  for (let i = 0; i < side; i++) {
    for (let j = 0; j < side; j++) {
      const node = `n${i}_${j}`;
      c.capacitor(`C${i}_${j}`, node, GROUND, 1e-9 * (1 + 0.3 * Math.sin(i * side + j)));
      if (i + 1 < side) c.resistor(`Rv${i}_${j}`, node, `n${i + 1}_${j}`, 1e3);
      if (j + 1 < side) c.resistor(`Rh${i}_${j}`, node, `n${i}_${j + 1}`, 1e3);
    }
  }
  return c;
}

/** A ladder of RLC sections, three unknowns each. */
function ladder(sections: number): Circuit {
  const c = new Circuit().voltageSource('signal', 'n0', GROUND, { ac: 1 });
  for (let k = 0; k < sections; k++) {
    c.resistor(`R${k}`, `n${k}`, `m${k}`, 10 + 3 * k);
    c.inductor(`L${k}`, `m${k}`, `n${k + 1}`, 1e-3 * (1 + 0.37 * Math.sin(k)));
    c.capacitor(`C${k}`, `n${k + 1}`, GROUND, 1e-6 * (1 + 0.5 * Math.cos(k)));
  }
  return c.resistor('load', `n${sections}`, GROUND, 50);
}

interface Row {
  readonly measurement: string;
  readonly unknowns: number;
  readonly ms: number;
  readonly ratio?: number;
}

const rows: Row[] = [];

{
  const op = operatingPoint(mesh(31, true));
  const frequencies = logSweep(1, 1e8, 125).subarray(0, 1000);
  const ac = timeMs(() => acAnalysis(op, { frequencies }), 3);
  const loop = timeMs(() => loopGain(op, { probe: 'loopBreak', frequencies }), 3);
  rows.push({ measurement: `AC analysis, ${frequencies.length} frequencies`, unknowns: op.system.n, ms: ac });
  rows.push({
    measurement: `loop gain, ${frequencies.length} frequencies`,
    unknowns: op.system.n,
    ms: loop,
    ratio: loop / ac,
  });
}
{
  const op = operatingPoint(ladder(166));
  const ms = timeMs(() => poles(op), 1);
  rows.push({ measurement: `every pole, dense (${poles(op).length} poles)`, unknowns: op.system.n, ms });
}
{
  const op = operatingPoint(mesh(316, false));
  const ms = timeMs(() => poles(op, { limit: 10, near: 0 }), 1);
  rows.push({ measurement: '10 poles nearest 0 Hz, shift and invert', unknowns: op.system.n, ms });
}

if (process.argv.includes('--json')) {
  for (const row of rows) console.log(JSON.stringify(row));
} else {
  console.log(
    renderTable({
      title: 'Stability analyses (median of 3 for the loop gain and AC rows, one run otherwise)',
      columns: [
        { header: 'measurement' },
        { header: 'unknowns', align: 'right' },
        { header: 'time (ms)', align: 'right' },
        { header: 'ratio to AC', align: 'right' },
      ],
      rows: rows.map((r) => [
        r.measurement,
        String(r.unknowns),
        r.ms.toFixed(1),
        r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}×`,
      ]),
    }),
  );
  const ratio = rows[1]!.ratio!;
  console.log(
    `\nloop gain / AC analysis: ${ratio.toFixed(2)}× (target ≤ 2.5×): ${ratio <= 2.5 ? 'met' : 'MISSED'}`,
  );
}
