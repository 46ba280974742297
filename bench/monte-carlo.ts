/**
 * Cost of Monte Carlo samples on a 30-element transistor stage (five direct-coupled common-emitter
 * stages, each a transistor and four resistors, with two sources, a load, a decoupling and an output
 * capacitor; every resistor 1 % normal, every β from 100 to 300, the temperature from 0 °C to 70 °C):
 *
 * - per sample, in the calling thread, as a ratio to one point of a `dcSweep` of the same circuit
 *   (the floor: a warm-started solve of the same equations, measured in the same run);
 * - throughput of 2 worker threads against the calling thread alone (worker start-up included), and of
 *   2 workers kept between runs (`startMonteCarloWorkers`, warmed by a first run);
 * - 100,000 samples end to end on 2 workers.
 *
 * The machine's load average is printed with the figures: on a shared machine the worker figures
 * mean little. Run: npx tsx bench/monte-carlo.ts [--samples 4000] [--total 100000] [--skip-total] [--built]
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { parseArgs } from 'node:util';
import type { Circuit as CircuitType, MonteCarloOptions } from '../src/index.js';

const { values: args } = parseArgs({
  options: {
    samples: { type: 'string', default: '4000' },
    total: { type: 'string', default: '100000' },
    'skip-total': { type: 'boolean', default: false },
    // The built package (run `npm run build` first): what users run, and what the workers load.
    built: { type: 'boolean', default: false },
  },
});

const library: typeof import('../src/index.js') = args.built
  ? await import('../dist/index.js' as string)
  : await import('../src/index.js');
const { Circuit, dcSweep, GROUND, linearSweep, monteCarlo, startMonteCarloWorkers } = library;

/** Five direct-coupled common-emitter stages on a 12 V supply: 30 elements. */
function transistorStage(): CircuitType {
  const model = { polarity: 'npn', forwardBeta: 150, earlyVoltage: 90 } as const;
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('drive', 'c0', GROUND, { dc: 8 })
    .capacitor('decouple', 'vcc', GROUND, '10u');
  for (let k = 1; k <= 5; k++) {
    c.resistor(`Rt${k}`, `c${k - 1}`, `b${k}`, '20k')
      .resistor(`Rb${k}`, `b${k}`, GROUND, '10k')
      .bjt(`Q${k}`, { collector: `c${k}`, base: `b${k}`, emitter: `e${k}` }, model)
      .resistor(`Rc${k}`, 'vcc', `c${k}`, '2k')
      .resistor(`Re${k}`, `e${k}`, GROUND, '1k');
  }
  return c.resistor('load', 'c5', GROUND, '100k').capacitor('output', 'c5', GROUND, '1n');
}

const options: Omit<MonteCarloOptions, 'samples'> = {
  seed: 1,
  tolerances: [
    { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.01, distribution: 'normal' },
    { element: { kind: 'bjt' }, parameter: 'forwardBeta', min: 100, max: 300 },
    { parameter: 'temperature', min: 273.15, max: 343.15 },
  ],
  measures: { output: 'c5', middle: { device: 'Q3', field: 'ic' } },
};

async function seconds(run: () => Promise<unknown> | unknown): Promise<number> {
  const start = performance.now();
  await run();
  return (performance.now() - start) / 1000;
}

const circuit = transistorStage();
const samples = Number(args.samples);
const load = () => loadavg()[0]!.toFixed(2);

// Warm both paths up, then time them.
await monteCarlo(circuit, { ...options, samples: 300 });
dcSweep(circuit, { source: 'drive', values: linearSweep(7.9, 8.1, 300) });
const sweepPoints = samples;
const sweep = await seconds(() =>
  dcSweep(circuit, { source: 'drive', values: linearSweep(7.9, 8.1, sweepPoints) }),
);
const here = await seconds(() => monteCarlo(circuit, { ...options, samples }));
const perPoint = sweep / sweepPoints;
const perSample = here / samples;
console.log(`load average ${load()} (1 min), ${circuit.elements.length} elements`);
console.log(
  `dcSweep point ${(perPoint * 1e6).toFixed(1)} µs, Monte Carlo sample ${(perSample * 1e6).toFixed(1)} µs: ratio ${(perSample / perPoint).toFixed(2)}`,
);

// Start-up: a pool of 2 workers that each solve one sample (loading the module, the nominal solve).
const startUp = await seconds(() => monteCarlo(circuit, { ...options, samples: 2, workers: 2 }));
const two = await seconds(() => monteCarlo(circuit, { ...options, samples, workers: 2 }));
console.log(
  `${samples} samples: calling thread ${here.toFixed(2)} s, 2 workers ${two.toFixed(2)} s ` +
    `(start-up ${startUp.toFixed(2)} s): throughput ×${(here / two).toFixed(2)} end to end, ` +
    `×${(here / Math.max(1e-9, two - startUp)).toFixed(2)} past start-up; load ${load()}`,
);

// Workers kept between runs: warmed by one run, then timed on a second of the same size.
const kept = startMonteCarloWorkers({ workers: 2 });
await monteCarlo(circuit, { ...options, samples, pool: kept });
const warm = await seconds(() => monteCarlo(circuit, { ...options, samples, pool: kept }));
await kept.close();
console.log(
  `${samples} samples on 2 kept workers (warmed by a first run): ${warm.toFixed(2)} s: throughput ×${(here / warm).toFixed(2)}; load ${load()}`,
);

let total = 0;
const totalSamples = Number(args.total);
if (!args['skip-total']) {
  total = await seconds(() => monteCarlo(circuit, { ...options, samples: totalSamples, workers: 2 }));
  console.log(
    `${totalSamples} samples on 2 workers: ${total.toFixed(1)} s end to end (${((total / totalSamples) * 1e6).toFixed(1)} µs per sample); load ${load()}`,
  );
}
console.log(
  JSON.stringify({
    elements: circuit.elements.length,
    perPointMicroseconds: perPoint * 1e6,
    perSampleMicroseconds: perSample * 1e6,
    ratio: perSample / perPoint,
    samples,
    oneThreadSeconds: here,
    twoWorkersSeconds: two,
    workerStartUpSeconds: startUp,
    throughputRatio: here / two,
    keptWorkersSeconds: warm,
    keptThroughputRatio: here / warm,
    totalSamples: args['skip-total'] ? 0 : totalSamples,
    totalSeconds: total,
    load: loadavg(),
  }),
);
