/**
 * Cost of the stability analyses.
 *
 * - Loop gain over 1,000 frequencies against the AC analysis of the same circuit at the same
 *   frequencies (the floor: one factorization per frequency either way; the loop gain adds a second
 *   solve and a second residual check). Target: at most 2.5 times.
 * - Every pole, densely, of a circuit of about 500 unknowns (a ladder of RLC sections).
 * - The 10 poles nearest 0 Hz of an RC mesh of about 100,000 unknowns, by shift and invert.
 * - The 10 poles nearest 2 kHz of 3,333 series RLC sections, each driven from the source (about
 *   10,000 unknowns), by shift and invert, against each section's closed-form pair.
 *
 * Run: npx tsx bench/stability.ts [cases…]   (cases: loop, dense, mesh, sections; default all;
 * prints a table, `--json` one JSON line per measurement)
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

/** `count` series RLC sections, each driven from the source, with varied values; and their poles in rad/s. */
function sections(count: number): { circuit: Circuit; roots: { re: number; im: number }[] } {
  const circuit = new Circuit().voltageSource('signal', 'in', GROUND, { ac: 1 });
  const roots: { re: number; im: number }[] = [];
  for (let k = 0; k < count; k++) {
    const r = 5 + 20 * (1 + Math.sin(0.7 * k));
    const l = 1e-3 * (1 + 0.5 * Math.cos(1.3 * k));
    const c = 1e-6 * (1 + 0.9 * ((k * 0.618) % 1));
    circuit
      .resistor(`R${k}`, 'in', `a${k}`, r)
      .inductor(`L${k}`, `a${k}`, `b${k}`, l)
      .capacitor(`C${k}`, `b${k}`, GROUND, c);
    // s² + (R/L)·s + 1/(LC) = 0.
    const re = -r / (2 * l);
    const d = re * re - 1 / (l * c);
    if (d < 0) roots.push({ re, im: Math.sqrt(-d) }, { re, im: -Math.sqrt(-d) });
    else roots.push({ re: re + Math.sqrt(d), im: 0 }, { re: re - Math.sqrt(d), im: 0 });
  }
  return { circuit, roots };
}

interface Row {
  readonly measurement: string;
  readonly unknowns: number;
  readonly ms: number;
  readonly ratio?: number;
  /** The largest relative error against a closed form, where there is one. */
  readonly error?: number;
}

const rows: Row[] = [];
const asked = process.argv.slice(2).filter((a) => !a.startsWith('--'));
const wanted = (name: string) => asked.length === 0 || asked.includes(name);

if (wanted('loop')) {
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
if (wanted('dense')) {
  const op = operatingPoint(ladder(166));
  const ms = timeMs(() => poles(op), 1);
  rows.push({ measurement: `every pole, dense (${poles(op).length} poles)`, unknowns: op.system.n, ms });
}
if (wanted('mesh')) {
  const op = operatingPoint(mesh(316, false));
  const ms = timeMs(() => poles(op, { limit: 10, near: 0 }), 1);
  rows.push({ measurement: '10 poles nearest 0 Hz, shift and invert', unknowns: op.system.n, ms });
}
if (wanted('sections')) {
  const { circuit, roots } = sections(3333);
  const op = operatingPoint(circuit);
  const near = 2e3;
  let found: ReturnType<typeof poles> = [];
  const ms = timeMs(() => {
    found = poles(op, { limit: 10, near });
  }, 1);
  // Against the closed form: the same count of section roots nearest j·2π·near.
  const w0 = 2 * Math.PI * near;
  const distance = (r: { re: number; im: number }) => Math.hypot(r.re, Math.abs(r.im) - w0);
  const expected = [...roots].sort((a, b) => distance(a) - distance(b)).slice(0, found.length);
  let error = 0;
  for (const pole of found) {
    const s = { re: 2 * Math.PI * pole.real, im: 2 * Math.PI * pole.imaginary };
    const nearestExpected = Math.min(
      ...expected.map((e) => Math.hypot(e.re - s.re, e.im - s.im) / Math.hypot(e.re, e.im)),
    );
    error = Math.max(error, nearestExpected);
  }
  if (found.length < 10) error = Number.POSITIVE_INFINITY;
  rows.push({
    measurement: `10 poles nearest 2 kHz of RLC sections (${found.length} found)`,
    unknowns: op.system.n,
    ms,
    error,
  });
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
        { header: 'error vs closed form', align: 'right' },
      ],
      rows: rows.map((r) => [
        r.measurement,
        String(r.unknowns),
        r.ms.toFixed(1),
        r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}×`,
        r.error === undefined ? '' : r.error.toExponential(1),
      ]),
    }),
  );
  const ratio = rows.find((r) => r.ratio !== undefined)?.ratio;
  if (ratio !== undefined) {
    console.log(
      `\nloop gain / AC analysis: ${ratio.toFixed(2)}× (target ≤ 2.5×): ${ratio <= 2.5 ? 'met' : 'MISSED'}`,
    );
  }
}
