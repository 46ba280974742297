/**
 * Monte Carlo runs: draw every varied parameter of every sample, solve, read the measures, keep the
 * failures. In the calling thread (`workers: 1`, the default) or spread over worker threads (Node)
 * or web workers (browsers) through the workerpool library, which serves both; each worker runs a
 * job (the circuit's JSON document, the options without callbacks, a range of samples) and the
 * parts are merged in sample order, so the result is the same, bit for bit, for any worker count.
 */

import type { Circuit } from '../circuit/circuit.js';
import { cancelled, invalidValue } from '../errors/messages.js';
import { type ErrorDetails, QuiescentError } from '../errors/quiescent-error.js';
import { JobRun, type MonteCarloJobOptions, monteCarloJob, rangeOf } from './job.js';
import { MonteCarlo, type MonteCarloParts, mergeMonteCarlo } from './monte-carlo-result.js';
import { MonteCarloWorkers, openPool, poolOf } from './monte-carlo-workers.js';
import type { CancelSignal, ScriptLocation } from './signals.js';

/** Options of {@link monteCarlo}: the run's options, the operating-point options, and how to run. */
export interface MonteCarloOptions extends MonteCarloJobOptions {
  /** Worker threads (Node) or web workers (browsers); 1 (default) runs in the calling thread. */
  readonly workers?: number;
  /** Called as samples finish, with the samples done and the samples of the range. */
  readonly onProgress?: (done: number, total: number) => void;
  /** Stops the run with a `cancelled` error when aborted. */
  readonly signal?: CancelSignal;
  /**
   * The worker module, for bundled browser builds that serve it from their own URL (default: the
   * module shipped beside the library, `quiescent/dist/monte-carlo-worker.js`).
   */
  readonly workerScript?: string | ScriptLocation;
  /**
   * Workers already running (from {@link startMonteCarloWorkers}), used instead of starting new ones
   * and left running after the run; `workers` and `workerScript` are then the set's own.
   */
  readonly pool?: MonteCarloWorkers;
}

/** How long the calling thread computes before it lets other work (progress, an abort) run, in ms. */
const SLICE_MS = 25;
/** Ranges handed to each worker: several, so that progress flows and slow ranges balance. */
const CHUNKS_PER_WORKER = 4;

/**
 * Run a Monte Carlo analysis: `samples` draws of the `tolerances`, each solved at its operating
 * point (and AC frequencies), reading the `measures`. See docs/tolerances.md.
 *
 * @returns the {@link MonteCarlo} result of the range (all samples by default)
 * @throws QuiescentError `invalid-value` (options, tolerances, measures), `unknown-element`,
 *   `unknown-node`, `cancelled` (through `signal`). A sample whose analysis fails is kept in
 *   `failures`, never thrown.
 *
 * @example
 * ```ts
 * const mc = await monteCarlo(circuit, {
 *   samples: 1000, seed: 1,
 *   tolerances: [{ element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.01 }],
 *   measures: { out: 'out' },
 * });
 * mc.summary.out.standardDeviation;
 * mc.yield({ out: { min: 2.45, max: 2.55 } });
 * ```
 */
export async function monteCarlo(circuit: Circuit, options: MonteCarloOptions): Promise<MonteCarlo> {
  const job = monteCarloJob(circuit, options);
  const kept = options.pool;
  if (kept !== undefined) {
    if (!(kept instanceof MonteCarloWorkers)) {
      throw invalidValue(['options', 'pool'], kept, 'workers from startMonteCarloWorkers');
    }
    if (options.workers !== undefined || options.workerScript !== undefined) {
      throw invalidValue(['options', 'pool'], 'workers with a worker count or script', 'a pool alone');
    }
  }
  const workers = kept?.size ?? options.workers ?? 1;
  if (!Number.isInteger(workers) || workers < 1) {
    throw invalidValue(['options', 'workers'], workers, 'a whole number of workers, 1 or more');
  }
  const onProgress = options.onProgress;
  if (onProgress !== undefined && typeof onProgress !== 'function') {
    throw invalidValue(['options', 'onProgress'], onProgress, 'a function (done, total)');
  }
  const [start, end] = rangeOf(job.options);
  if (options.signal?.aborted === true) throw cancelled('Monte Carlo', 0, end - start);
  if (workers === 1 && kept === undefined) return runHere(new JobRun(job), options);
  // The measures are checked here once (a nominal solve), so a wrong name fails before any worker starts.
  new JobRun({ ...job, options: { ...job.options, range: [start, start + 1] } });
  return runOnWorkers(job.document, job.options, [start, end], workers, options);
}

/** The calling thread's run, giving way to the event loop every {@link SLICE_MS}. */
async function runHere(run: JobRun, options: MonteCarloOptions): Promise<MonteCarlo> {
  const total = run.end - run.start;
  let sliceStart = Date.now();
  while (!run.finished) {
    if (Date.now() - sliceStart >= SLICE_MS) {
      await giveWay();
      sliceStart = Date.now();
    }
    if (options.signal?.aborted === true) throw cancelled('Monte Carlo', run.done, total);
    run.step();
    options.onProgress?.(run.done, total);
  }
  return run.result();
}

function giveWay(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof setImmediate === 'function') setImmediate(resolve);
    else setTimeout(resolve, 0);
  });
}

/** Split [start, end) into ranges over a pool of workers and merge their results in order. */
async function runOnWorkers(
  document: unknown,
  jobOptions: MonteCarloJobOptions,
  [start, end]: [number, number],
  workers: number,
  options: MonteCarloOptions,
): Promise<MonteCarlo> {
  const total = end - start;
  const chunks = Math.min(total, workers * CHUNKS_PER_WORKER);
  const pool = options.pool === undefined ? openPool(workers, options.workerScript) : poolOf(options.pool);
  let done = 0;
  const tasks: ReturnType<typeof pool.exec>[] = [];
  for (let c = 0; c < chunks; c++) {
    const from = start + Math.floor((total * c) / chunks);
    const to = start + Math.floor((total * (c + 1)) / chunks);
    const job = { document, options: { ...jobOptions, range: [from, to] } };
    tasks.push(
      pool.exec('runRange', [job], {
        on(message: { done: number }) {
          done += message.done;
          options.onProgress?.(done, total);
        },
      }),
    );
  }
  const signal = options.signal;
  let onAbort: (() => void) | undefined;
  const aborted = new Promise<never>((_, reject) => {
    if (signal === undefined) return;
    onAbort = () => reject(cancelled('Monte Carlo', done, total));
    signal.addEventListener('abort', onAbort, { once: true });
  });
  try {
    const parts = (await Promise.race([Promise.all(tasks), aborted])) as MonteCarloParts[];
    return mergeMonteCarlo(parts.map((p) => new MonteCarlo(p)));
  } catch (e) {
    throw rebuiltError(e);
  } finally {
    if (onAbort !== undefined) signal!.removeEventListener('abort', onAbort);
    for (const task of tasks) task.cancel();
    if (options.pool === undefined) await pool.terminate(true);
  }
}

/** Errors come back from a worker without their class; give a QuiescentError its class again. */
function rebuiltError(e: unknown): unknown {
  if (e instanceof QuiescentError || e === null || typeof e !== 'object') return e;
  const { name, details, message } = e as { name?: unknown; details?: unknown; message?: unknown };
  if (name === 'QuiescentError' && details !== null && typeof details === 'object') {
    return new QuiescentError(details as ErrorDetails, String(message));
  }
  return e;
}
