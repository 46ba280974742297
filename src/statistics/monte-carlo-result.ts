/**
 * The result of a Monte Carlo run, or of one range of it: the measures of every solved sample, the
 * drawn values of every sample, the failures with their reasons, and the statistics. A result is
 * plain data underneath (`toJSON`), so parts computed anywhere join into exactly one run's result
 * with {@link mergeMonteCarlo}.
 */
import { invalidValue } from '../errors/messages.js';
import { type MeasureSummary, summarize, wilsonInterval, type YieldEstimate } from './summary.js';

/** A sample whose analysis failed, kept with its reason. */
export interface MonteCarloFailure {
  /** The sample number. */
  readonly sample: number;
  /** The error code (`invalid-value` for a value out of range, `no-convergence`, …). */
  readonly code: string;
  /** The error message, naming the element or node involved. */
  readonly message: string;
}

/** Specification limits of one measure (either or both; inclusive). */
export interface SpecLimits {
  /** The lowest value within specification. */
  readonly min?: number;
  /** The highest value within specification. */
  readonly max?: number;
}

/** A Monte Carlo result as plain JSON: what a worker sends back and what {@link mergeMonteCarlo} joins. */
export interface MonteCarloJson {
  /** Always `'quiescent-monte-carlo'`. */
  readonly format: 'quiescent-monte-carlo';
  /** The seed of the run. */
  readonly seed: number;
  /** The samples of the whole run. */
  readonly samples: number;
  /** The samples this result covers, [start, end). */
  readonly range: readonly [number, number];
  /** The measure names, in order. */
  readonly measures: readonly string[];
  /** The varied parameters' keys, in order. */
  readonly parameters: Readonly<Record<string, readonly number[]>>;
  /** Per measure, its value at every solved sample, in sample order. */
  readonly values: Readonly<Record<string, readonly number[]>>;
  /** The sample number of each entry of `values`. */
  readonly sampleIndex: readonly number[];
  /** The samples whose analysis failed, with their reasons. */
  readonly failures: readonly MonteCarloFailure[];
}

/** @internal What a result is made of, as typed arrays. */
export interface MonteCarloParts {
  readonly seed: number;
  readonly samples: number;
  readonly range: readonly [number, number];
  readonly values: Readonly<Record<string, Float64Array>>;
  readonly sampleIndex: Int32Array;
  readonly parameters: Readonly<Record<string, Float64Array>>;
  readonly failures: readonly MonteCarloFailure[];
}

/** The samples of a run (or of one range of it) and their statistics. Immutable. */
export class MonteCarlo {
  /** The seed of the run. */
  readonly seed: number;
  /** The number of samples of the whole run. */
  readonly samples: number;
  /** The samples this result covers, [start, end). */
  readonly range: readonly [number, number];
  /** Per measure, its value at every solved sample, in sample order. */
  readonly values: Readonly<Record<string, Float64Array>>;
  /** The sample number of each entry of `values[…]`. */
  readonly sampleIndex: Int32Array;
  /**
   * Per varied parameter (`${element}.${parameter}`, or `'temperature'`), its drawn value at every
   * sample of the range, solved or failed.
   */
  readonly parameters: Readonly<Record<string, Float64Array>>;
  /** The samples whose analysis failed, in sample order, never dropped. */
  readonly failures: readonly MonteCarloFailure[];

  #summary: Readonly<Record<string, MeasureSummary>> | null = null;

  /** @internal Built by the runs, by {@link mergeMonteCarlo} and from a worker's {@link MonteCarloParts}. */
  constructor(parts: MonteCarloParts) {
    this.seed = parts.seed;
    this.samples = parts.samples;
    this.range = Object.freeze([parts.range[0], parts.range[1]] as const);
    this.values = Object.freeze({ ...parts.values });
    this.sampleIndex = parts.sampleIndex;
    this.parameters = Object.freeze({ ...parts.parameters });
    this.failures = Object.freeze(parts.failures.map((f) => Object.freeze({ ...f })));
  }

  /**
   * Per measure: mean, standard deviation (n − 1), extremes and percentiles over the solved samples
   * (computed on first reading: a part that is only merged never sorts its values).
   */
  get summary(): Readonly<Record<string, MeasureSummary>> {
    if (this.#summary === null) {
      const summary: Record<string, MeasureSummary> = {};
      for (const [name, v] of Object.entries(this.values)) summary[name] = Object.freeze(summarize(v));
      this.#summary = Object.freeze(summary);
    }
    return this.#summary;
  }

  /**
   * @internal The result as typed arrays, for a worker thread to send back with its buffers
   * transferred instead of copied through plain arrays; with the list of those buffers.
   */
  toParts(): { parts: MonteCarloParts; buffers: ArrayBuffer[] } {
    const parts: MonteCarloParts = {
      seed: this.seed,
      samples: this.samples,
      range: [this.range[0], this.range[1]],
      values: { ...this.values },
      sampleIndex: this.sampleIndex,
      parameters: { ...this.parameters },
      failures: this.failures,
    };
    const buffers = new Set<ArrayBuffer>();
    for (const v of [...Object.values(parts.values), ...Object.values(parts.parameters), parts.sampleIndex]) {
      buffers.add(v.buffer as ArrayBuffer);
    }
    return { parts, buffers: [...buffers] };
  }

  /** The measure names, in order. */
  get measures(): readonly string[] {
    return Object.keys(this.values);
  }

  /**
   * The fraction of samples within every given limit, with its 95 % Wilson interval. Every sample of
   * the result counts, solved or failed; a failed sample is out of specification.
   *
   * @throws QuiescentError `invalid-value` for a name that is not a measure, or limits that are not numbers
   */
  yield(specs: Readonly<Record<string, SpecLimits>>): YieldEstimate {
    if (specs === null || typeof specs !== 'object') {
      throw invalidValue(['specs'], specs, 'an object of { min?, max? } limits by measure name');
    }
    const solved = this.sampleIndex.length;
    const pass = new Uint8Array(solved).fill(1);
    for (const [name, limits] of Object.entries(specs)) {
      const v = this.values[name];
      if (v === undefined)
        throw invalidValue(['specs', name], name, `a measure (${this.measures.join(', ')})`);
      const min = limitOf(limits, 'min', name, Number.NEGATIVE_INFINITY);
      const max = limitOf(limits, 'max', name, Number.POSITIVE_INFINITY);
      for (let k = 0; k < solved; k++) if (!(v[k]! >= min && v[k]! <= max)) pass[k] = 0;
    }
    let passed = 0;
    for (let k = 0; k < solved; k++) passed += pass[k]!;
    return wilsonInterval(passed, this.range[1] - this.range[0]);
  }

  /** Plain JSON of every result: drawn values, measures, sample numbers, failures. */
  toJSON(): MonteCarloJson {
    const values: Record<string, number[]> = {};
    for (const [name, v] of Object.entries(this.values)) values[name] = Array.from(v);
    const parameters: Record<string, number[]> = {};
    for (const [key, v] of Object.entries(this.parameters)) parameters[key] = Array.from(v);
    return {
      format: 'quiescent-monte-carlo',
      seed: this.seed,
      samples: this.samples,
      range: [this.range[0], this.range[1]],
      measures: this.measures,
      parameters,
      values,
      sampleIndex: Array.from(this.sampleIndex),
      failures: this.failures.map((f) => ({ ...f })),
    };
  }

  /** Rebuild a result from its JSON. */
  static fromJSON(json: MonteCarloJson): MonteCarlo {
    if (json === null || typeof json !== 'object' || json.format !== 'quiescent-monte-carlo') {
      throw invalidValue(['part'], json, "a Monte Carlo result or its JSON (format 'quiescent-monte-carlo')");
    }
    const values: Record<string, Float64Array> = {};
    for (const name of json.measures) values[name] = Float64Array.from(json.values[name] ?? []);
    const parameters: Record<string, Float64Array> = {};
    for (const [key, v] of Object.entries(json.parameters)) parameters[key] = Float64Array.from(v);
    return new MonteCarlo({
      seed: json.seed,
      samples: json.samples,
      range: json.range,
      values,
      sampleIndex: Int32Array.from(json.sampleIndex),
      parameters,
      failures: json.failures,
    });
  }
}

function limitOf(limits: SpecLimits, key: 'min' | 'max', name: string, fallback: number): number {
  const v = limits?.[key];
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || Number.isNaN(v)) throw invalidValue(['specs', name, key], v, 'a number');
  return v;
}

/**
 * Join results of ranges of one run (any order, as results or their JSON) into exactly the result
 * of the run over their union, summary included. The ranges must be of the same seed, sample count,
 * measures and parameters, and must not overlap; their ranges must join without a gap.
 *
 * @throws QuiescentError `invalid-value` for an empty list, parts of different runs, or overlapping ranges
 */
export function mergeMonteCarlo(parts: readonly (MonteCarlo | MonteCarloJson)[]): MonteCarlo {
  if (!Array.isArray(parts) || parts.length === 0) {
    throw invalidValue(['parts'], parts, 'a non-empty list of Monte Carlo results');
  }
  const results = parts
    .map((p) => (p instanceof MonteCarlo ? p : MonteCarlo.fromJSON(p)))
    .sort((a, b) => a.range[0] - b.range[0]);
  const first = results[0]!;
  const measures = first.measures;
  const keys = Object.keys(first.parameters);
  let solved = 0;
  let count = 0;
  results.forEach((r, k) => {
    const same =
      r.seed === first.seed &&
      r.samples === first.samples &&
      r.measures.join('\u0000') === measures.join('\u0000') &&
      Object.keys(r.parameters).join('\u0000') === keys.join('\u0000');
    if (!same) {
      throw invalidValue(
        ['parts', k],
        r.range,
        'a part of the same run (seed, samples, measures, parameters)',
      );
    }
    if (k > 0 && r.range[0] < results[k - 1]!.range[1]) {
      throw invalidValue(['parts', k], r.range, `a range after [${results[k - 1]!.range.join(', ')})`);
    }
    solved += r.sampleIndex.length;
    count += r.range[1] - r.range[0];
  });
  const contiguous = results.every((r, k) => k === 0 || r.range[0] === results[k - 1]!.range[1]);
  if (!contiguous) throw invalidValue(['parts'], 'a gap', 'ranges that join without a gap');
  const values: Record<string, Float64Array> = {};
  for (const name of measures) values[name] = new Float64Array(solved);
  const parameters: Record<string, Float64Array> = {};
  for (const key of keys) parameters[key] = new Float64Array(count);
  const sampleIndex = new Int32Array(solved);
  let at = 0;
  let drawn = 0;
  for (const r of results) {
    for (const name of measures) values[name]!.set(r.values[name]!, at);
    for (const key of keys) parameters[key]!.set(r.parameters[key]!, drawn);
    sampleIndex.set(r.sampleIndex, at);
    at += r.sampleIndex.length;
    drawn += r.range[1] - r.range[0];
  }
  return new MonteCarlo({
    seed: first.seed,
    samples: first.samples,
    range: [first.range[0], results[results.length - 1]!.range[1]],
    values,
    sampleIndex,
    parameters,
    failures: results.flatMap((r) => r.failures),
  });
}
