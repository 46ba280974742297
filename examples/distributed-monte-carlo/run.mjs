/**
 * One Monte Carlo job spread over the workers of a job queue: the job (the circuit's JSON document
 * and the run's options) is cut into sample ranges, each range is a queue job, any worker runs it
 * with `runMonteCarloJob` and returns its part as JSON, and the parts merge into exactly the result
 * of one local run. Here the queue is BullMQ on a local Redis server and the workers live in this
 * process; on a fleet they would be processes on other machines running the same `process` function.
 *
 * Run: npm run build (in the repository root), then npm ci && npm start (here).
 */
import { Queue, QueueEvents, Worker } from 'bullmq';
import {
  Circuit,
  formatMonteCarlo,
  GROUND,
  mergeMonteCarlo,
  monteCarlo,
  monteCarloJob,
  runMonteCarloJob,
} from '../../dist/index.js';
import { startRedis } from './redis-server.mjs';

/** A sensor front end's bias network (a scenario of our own): its spread over parts and temperature. */
export function biasNetwork() {
  return new Circuit()
    .voltageSource('rail', 'vcc', GROUND, { dc: 9 })
    .resistor('biasTop', 'vcc', 'base', '68k')
    .resistor('biasBottom', 'base', GROUND, '15k')
    .resistor('load', 'vcc', 'collector', '3.3k')
    .resistor('degeneration', 'emitter', GROUND, '820')
    .bjt(
      'Q1',
      { collector: 'collector', base: 'base', emitter: 'emitter' },
      { polarity: 'npn', forwardBeta: 180 },
    );
}

/** The run's options: plain JSON, so the job can travel. */
export const runOptions = {
  samples: 2000,
  seed: 424242,
  tolerances: [
    { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05, distribution: 'normal' },
    { element: 'Q1', parameter: 'forwardBeta', min: 100, max: 300 },
    { parameter: 'temperature', min: 263.15, max: 328.15 },
  ],
  measures: { collector: 'collector', current: { device: 'Q1', field: 'ic' } },
};

/** What a queue worker does with one range: the same function wherever it runs. */
export function processRange(queueJob) {
  return runMonteCarloJob(queueJob.data).toJSON();
}

/**
 * Spread the run over `workers` queue workers in `ranges` ranges; returns the merged result and the
 * result of one local run, for comparison.
 */
export async function runDistributed({ workers = 3, ranges = 8 } = {}) {
  const redis = await startRedis();
  const connection = { host: redis.host, port: redis.port, maxRetriesPerRequest: null };
  const name = 'quiescent-monte-carlo';
  const queue = new Queue(name, { connection });
  const events = new QueueEvents(name, { connection });
  const pool = Array.from({ length: workers }, () => new Worker(name, processRange, { connection }));
  try {
    await events.waitUntilReady();
    const job = monteCarloJob(biasNetwork(), runOptions);
    const total = runOptions.samples;
    const added = [];
    for (let r = 0; r < ranges; r++) {
      const range = [Math.floor((total * r) / ranges), Math.floor((total * (r + 1)) / ranges)];
      added.push(await queue.add('range', { ...job, options: { ...job.options, range } }));
    }
    const parts = await Promise.all(added.map((j) => j.waitUntilFinished(events, 120_000)));
    const merged = mergeMonteCarlo(parts);
    const local = await monteCarlo(biasNetwork(), runOptions);
    return { merged, local };
  } finally {
    await Promise.all(pool.map((w) => w.close()));
    await events.close();
    await queue.close();
    await redis.stop();
  }
}

/** Whether two results are the same bit for bit: every drawn value, measure and sample number. */
export function sameResult(a, b) {
  return JSON.stringify(a) === JSON.stringify(b);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { merged, local } = await runDistributed();
  console.log(
    formatMonteCarlo(merged, {
      units: { collector: 'V', current: 'A' },
      specs: { collector: { min: 3, max: 6 } },
    }),
  );
  console.log(
    sameResult(merged, local) ? 'The merged queue run equals one local run, bit for bit.' : 'MISMATCH',
  );
  if (!sameResult(merged, local)) process.exitCode = 1;
}
