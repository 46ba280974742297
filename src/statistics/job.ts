/**
 * A Monte Carlo job as plain JSON: the circuit's document, the run's options without the callbacks,
 * and the range of samples to compute. The same function runs a job in the calling thread, on a
 * worker thread, in a web worker or on another machine, so every place computes the same numbers.
 */

import type { OperatingPointOptions } from '../analysis/options.js';
import { resolveOptions } from '../analysis/options.js';
import { Circuit } from '../circuit/circuit.js';
import type { CircuitDocument } from '../circuit/json.js';
import { cancelled, invalidCircuit, invalidValue } from '../errors/messages.js';
import { Draws } from './draws.js';
import { SampleEvaluator } from './evaluate-sample.js';
import { type Measure, MeasureSet } from './measures.js';
import { MonteCarlo, type MonteCarloFailure } from './monte-carlo-result.js';
import { drawValue, resolveTolerances, type Tolerance } from './tolerances.js';

/** The options of a run that travel with a job: everything but the callbacks and the worker count. */
export interface MonteCarloJobOptions extends OperatingPointOptions {
  /** The number of samples of the whole run. */
  readonly samples: number;
  /** The seed: a whole number in [0, 2⁵³). Sample k's draws depend only on (seed, k). */
  readonly seed: number;
  /** What varies, and how. */
  readonly tolerances: readonly Tolerance[];
  /** What is read from each sample, by name. */
  readonly measures: Readonly<Record<string, Measure>>;
  /** Compute only samples [start, end) of the run (default all). */
  readonly range?: readonly [number, number];
}

/** A Monte Carlo job: plain JSON, the same wherever it runs. */
export interface MonteCarloJob {
  /** The circuit, as `circuit.toJSON()` writes it. */
  readonly document: CircuitDocument;
  /** The options of the run, with the range to compute. */
  readonly options: MonteCarloJobOptions;
}

/** The keys of the job options that are not operating-point options. */
const RUN_KEYS = new Set([
  'samples',
  'seed',
  'tolerances',
  'measures',
  'range',
  'workers',
  'onProgress',
  'signal',
  'workerScript',
]);

/** The operating-point options among a run's options. */
export function operatingPointOptionsOf(options: object): OperatingPointOptions {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(options)) if (!RUN_KEYS.has(key)) out[key] = value;
  return out as OperatingPointOptions;
}

/**
 * The job of a run: the circuit's document and the options without callbacks, checked.
 *
 * @throws QuiescentError `invalid-value` (samples, seed, range, tolerances, measures),
 *   `unknown-element`, `invalid-circuit`
 */
export function monteCarloJob(circuit: Circuit, options: MonteCarloJobOptions): MonteCarloJob {
  if (!(circuit instanceof Circuit)) throw invalidCircuit(['circuit'], 'must be a Circuit');
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with samples, seed, tolerances and measures');
  }
  const plain: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(options)) {
    if (key !== 'onProgress' && key !== 'signal' && key !== 'workers' && key !== 'workerScript')
      plain[key] = value;
  }
  const job = { document: circuit.toJSON(), options: plain as unknown as MonteCarloJobOptions };
  checkJob(job, circuit);
  return job;
}

/** The range of a job's options, checked: [start, end) within [0, samples). */
export function rangeOf(options: MonteCarloJobOptions): [number, number] {
  const samples = options.samples;
  if (!Number.isInteger(samples) || samples < 1 || samples > 0xffffffff) {
    throw invalidValue(['options', 'samples'], samples, 'a whole number of samples, 1 or more');
  }
  const seed = options.seed;
  if (!Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) {
    throw invalidValue(['options', 'seed'], seed, 'a whole number in [0, 2^53)');
  }
  const range = options.range ?? [0, samples];
  const ok =
    Array.isArray(range) &&
    range.length === 2 &&
    Number.isInteger(range[0]) &&
    Number.isInteger(range[1]) &&
    range[0] >= 0 &&
    range[0] < range[1] &&
    range[1] <= samples;
  if (!ok) throw invalidValue(['options', 'range'], range, `[start, end) with 0 ≤ start < end ≤ ${samples}`);
  return [range[0], range[1]];
}

function checkJob(job: MonteCarloJob, circuit: Circuit): void {
  rangeOf(job.options);
  const op = resolveOptions(operatingPointOptionsOf(job.options));
  resolveTolerances(job.options.tolerances, circuit.elements, op.temperature);
  new MeasureSet(job.options.measures);
}

/** What a job runner reports while it runs and asks before each sample. */
export interface JobHooks {
  /** Called after each sample with the samples done in this job. */
  readonly onSample?: (done: number) => void;
  /** Asked before each sample; true stops the run (the caller then reports `cancelled`). */
  readonly stopped?: () => boolean;
}

/**
 * What the ranges of one run share: the varied parameters, the measures, the draws and the evaluator
 * (the circuit compiled, its nominal point solved, the prediction made). A worker that receives
 * several ranges of one run builds it once (see {@link setUpKey}).
 */
export class JobSetUp {
  readonly draws: Draws;
  readonly evaluator: SampleEvaluator;
  readonly varied: ReturnType<typeof resolveTolerances>;
  readonly measures: MeasureSet;

  /** @throws QuiescentError the checks of {@link monteCarloJob}, and a measure the circuit lacks */
  constructor(job: MonteCarloJob) {
    const circuit = Circuit.fromJSON(job.document);
    const opOptions = operatingPointOptionsOf(job.options);
    const temperature = resolveOptions(opOptions).temperature;
    this.varied = resolveTolerances(job.options.tolerances, circuit.elements, temperature);
    this.measures = new MeasureSet(job.options.measures);
    this.draws = new Draws(job.options.seed);
    this.evaluator = new SampleEvaluator(circuit.elements, opOptions, this.varied, this.measures);
    this.evaluator.checkMeasures();
  }
}

/** The key under which ranges of one run share a {@link JobSetUp}: the job without its range. */
export function setUpKey(job: MonteCarloJob): string {
  const { range: _range, ...options } = job.options;
  return JSON.stringify([job.document, options]);
}

/** A job prepared to run sample by sample: the evaluator, the draws and the result's arrays. */
export class JobRun {
  readonly start: number;
  readonly end: number;
  readonly #job: MonteCarloJob;
  readonly #draws: Draws;
  readonly #evaluator: SampleEvaluator;
  readonly #varied: ReturnType<typeof resolveTolerances>;
  readonly #measures: MeasureSet;
  readonly #drawn: Float64Array[];
  readonly #values: Float64Array[];
  readonly #sampleIndex: Int32Array;
  readonly #failures: MonteCarloFailure[] = [];
  readonly #row: Float64Array;
  readonly #out: Float64Array;
  #solved = 0;
  #next: number;

  /** `setUp`, when given, must come from a job that differs from this one in its range alone. */
  constructor(job: MonteCarloJob, setUp?: JobSetUp) {
    if (job === null || typeof job !== 'object') throw invalidValue(['job'], job, 'a Monte Carlo job');
    const shared = setUp ?? new JobSetUp(job);
    const [start, end] = rangeOf(job.options);
    this.start = start;
    this.end = end;
    this.#next = start;
    this.#job = job;
    this.#varied = shared.varied;
    this.#measures = shared.measures;
    this.#draws = shared.draws;
    this.#evaluator = shared.evaluator;
    const count = end - start;
    this.#drawn = this.#varied.map(() => new Float64Array(count));
    this.#values = this.#measures.names.map(() => new Float64Array(count));
    this.#sampleIndex = new Int32Array(count);
    this.#row = new Float64Array(this.#varied.length);
    this.#out = new Float64Array(this.#measures.names.length);
  }

  /** Whether every sample of the range is done. */
  get finished(): boolean {
    return this.#next >= this.end;
  }

  /** Samples done so far. */
  get done(): number {
    return this.#next - this.start;
  }

  /** Draw and solve the next sample. */
  step(): void {
    const k = this.#next;
    const slot = k - this.start;
    for (let j = 0; j < this.#varied.length; j++) {
      const v = drawValue(this.#varied[j]!, this.#draws, k, j);
      this.#row[j] = v;
      this.#drawn[j]![slot] = v;
    }
    const failure = this.#evaluator.evaluate(this.#row, this.#out);
    if (failure === null) {
      for (let m = 0; m < this.#out.length; m++) this.#values[m]![this.#solved] = this.#out[m]!;
      this.#sampleIndex[this.#solved++] = k;
    } else {
      this.#failures.push({ sample: k, code: failure.code, message: failure.message });
    }
    this.#next = k + 1;
  }

  /** The result of the range (call once finished). */
  result(): MonteCarlo {
    const values: Record<string, Float64Array> = {};
    this.#measures.names.forEach((name, m) => {
      values[name] = this.#values[m]!.slice(0, this.#solved);
    });
    const parameters: Record<string, Float64Array> = {};
    this.#varied.forEach((p, j) => {
      parameters[p.key] = this.#drawn[j]!;
    });
    return new MonteCarlo({
      seed: this.#job.options.seed,
      samples: this.#job.options.samples,
      range: [this.start, this.end],
      values,
      sampleIndex: this.#sampleIndex.slice(0, this.#solved),
      parameters,
      failures: this.#failures,
    });
  }
}

/**
 * Run a job's range in the calling thread, synchronously: what a worker thread, a web worker or a
 * job-queue worker on another machine calls. Returns the range's result (send `result.toJSON()`).
 *
 * @throws QuiescentError `cancelled` when `hooks.stopped` answers true; the checks of {@link monteCarloJob}
 */
export function runMonteCarloJob(job: MonteCarloJob, hooks: JobHooks = {}): MonteCarlo {
  return runJob(new JobRun(job), hooks);
}

/** @internal Run a job's range to its end (a worker passes a run on its kept set-up). */
export function runJob(run: JobRun, hooks: JobHooks = {}): MonteCarlo {
  while (!run.finished) {
    if (hooks.stopped?.() === true) throw cancelledAt(run);
    run.step();
    hooks.onSample?.(run.done);
  }
  return run.result();
}

function cancelledAt(run: JobRun): Error {
  return cancelled('Monte Carlo', run.done, run.end - run.start);
}
