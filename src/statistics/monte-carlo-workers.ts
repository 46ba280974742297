/**
 * Workers kept between Monte Carlo runs. A run with `workers: n` starts its threads, loads the
 * library in each and lets the compiler warm up on the first few thousand samples, then stops them:
 * on a short run that is most of the time. A {@link MonteCarloWorkers} set is started once and
 * handed to every run (`pool` in the options), so later runs start on threads already warm.
 */
import workerpool from 'workerpool';
import { invalidValue } from '../errors/messages.js';
import type { ScriptLocation } from './signals.js';
import { defaultWorkerScript, scriptArgument } from './worker-script.js';

/** Options of {@link startMonteCarloWorkers}. */
export interface MonteCarloWorkersOptions {
  /** How many worker threads (Node) or web workers (browsers): a whole number, 1 or more. */
  readonly workers: number;
  /** The worker module (see `MonteCarloOptions.workerScript`). */
  readonly workerScript?: string | ScriptLocation;
}

/**
 * Each set's pool, kept out of the class so that the package's public types never name the pool
 * library's (its types are not a dependency of users' builds).
 */
const pools = new WeakMap<MonteCarloWorkers, workerpool.Pool>();

/** A set of running Monte Carlo workers; stop them with {@link MonteCarloWorkers.close}. */
export class MonteCarloWorkers {
  /** How many workers the set runs. */
  readonly size: number;
  #closed = false;

  /** @internal Use {@link startMonteCarloWorkers}. */
  constructor(size: number) {
    this.size = size;
  }

  /** Whether {@link MonteCarloWorkers.close} was called. */
  get closed(): boolean {
    return this.#closed;
  }

  /**
   * Stop every worker (a run still using them ends with `cancelled`). A Node process does not exit
   * while a set is open: close it when the last run is done.
   */
  async close(): Promise<void> {
    if (this.#closed) return;
    this.#closed = true;
    await pools.get(this)?.terminate(true);
  }
}

/** @internal The pool of an open set, for a run; `invalid-value` for a closed one. */
export function poolOf(workers: MonteCarloWorkers): workerpool.Pool {
  const pool = pools.get(workers);
  if (workers.closed || pool === undefined) {
    throw invalidValue(['options', 'pool'], 'closed workers', 'workers not yet closed');
  }
  return pool;
}

/**
 * Start `workers` worker threads (Node) or web workers (browsers) for Monte Carlo runs, each loading
 * the library now. Pass the set as `pool` to {@link monteCarlo} as often as needed, then close it.
 *
 * @throws QuiescentError `invalid-value` for a worker count that is not a whole number ≥ 1
 *
 * @example
 * ```ts
 * const workers = startMonteCarloWorkers({ workers: 2 });
 * try {
 *   for (const seed of [1, 2, 3]) results.push(await monteCarlo(circuit, { ...options, seed, pool: workers }));
 * } finally {
 *   await workers.close();
 * }
 * ```
 */
export function startMonteCarloWorkers(options: MonteCarloWorkersOptions): MonteCarloWorkers {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object { workers, workerScript? }');
  }
  const { workers } = options;
  if (!Number.isInteger(workers) || workers < 1) {
    throw invalidValue(['options', 'workers'], workers, 'a whole number of workers, 1 or more');
  }
  const set = new MonteCarloWorkers(workers);
  pools.set(set, openPool(workers, options.workerScript));
  return set;
}

/** @internal A pool of `workers` Monte Carlo workers, all started at once. */
export function openPool(
  workers: number,
  workerScript: string | ScriptLocation | undefined,
): workerpool.Pool {
  return workerpool.pool(scriptArgument(workerScript ?? defaultWorkerScript()), {
    minWorkers: workers,
    maxWorkers: workers,
    workerType: 'auto',
    workerOpts: { type: 'module' },
  });
}
