/**
 * The evaluation of one sample (or one worst-case vertex): set the drawn values on a prepared
 * circuit, solve the operating point, read the measures. Every evaluation starts from the same
 * state (the nominal solution as the first iterate, a fresh pivot search on the nominal ordering),
 * so its result depends on its values alone, never on which samples the same worker solved before:
 * that is what makes a run bit-identical for any number of workers and any split.
 */

import {
  conditionsAt,
  type OperatingPoint,
  solveFromCurrent,
  startFromGuess,
} from '../analysis/operating-point.js';
import { type OperatingPointOptions, type ResolvedOptions, resolveOptions } from '../analysis/options.js';
import { PreparedCircuit } from '../analysis/prepared.js';
import type { ElementRecord } from '../circuit/elements.js';
import { invalidValue } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import type { MeasureSet } from './measures.js';
import type { VariedParameter } from './tolerances.js';

/** Why a sample failed: the error's code and message. */
export interface SampleFailure {
  readonly code: string;
  readonly message: string;
}

/** Solves samples of one circuit: nominal once, then any set of values of the varied parameters. */
export class SampleEvaluator {
  readonly #base: PreparedCircuit;
  #prepared: PreparedCircuit;
  readonly #options: ResolvedOptions;
  readonly #varied: readonly VariedParameter[];
  readonly #measures: MeasureSet;
  /** The nominal solution, the first iterate of every sample (null when nominal did not solve). */
  readonly #start: Float64Array | null;
  /** The nominal operating point, or the error that stopped it. */
  readonly nominal: OperatingPoint | QuiescentError;
  readonly #changes: { element: string; parameter: string; value: number }[];

  constructor(
    records: readonly ElementRecord[],
    options: OperatingPointOptions,
    varied: readonly VariedParameter[],
    measures: MeasureSet,
  ) {
    this.#base = new PreparedCircuit(records);
    this.#options = resolveOptions(options);
    this.#varied = varied;
    this.#measures = measures;
    this.#changes = varied
      .filter((p) => p.element !== null)
      .map((p) => ({ element: p.element!, parameter: p.parameter, value: p.nominal }));
    // The nominal solve comes first on every worker, so the LU ordering of the pattern is always the
    // nominal circuit's, whichever sample a worker starts with.
    let nominal: OperatingPoint | QuiescentError;
    try {
      nominal = this.#base.operatingPoint(options);
    } catch (e) {
      if (!(e instanceof QuiescentError)) throw e;
      nominal = e;
    }
    this.nominal = nominal;
    this.#start = nominal instanceof QuiescentError ? null : nominal.x;
    this.#prepared = this.#base.fork();
  }

  /**
   * Read the measures at the nominal point, so that a measure naming a node or element the circuit
   * lacks (or a device field that is not a number) stops the run at once instead of failing every
   * sample. Skipped when the nominal point did not solve.
   *
   * @throws QuiescentError `unknown-node`, `unknown-element`, `invalid-value`
   */
  checkMeasures(): void {
    if (this.nominal instanceof QuiescentError) return;
    try {
      this.#measures.read(this.nominal, new Float64Array(this.#measures.names.length));
    } catch (e) {
      if (e instanceof QuiescentError && e.code !== 'singular' && e.code !== 'no-convergence') throw e;
    }
  }

  /**
   * Solve with `values` (one per varied parameter, in order) and write the measures into `out`.
   * Returns null on success, or the failure (a value out of range, no convergence, …).
   */
  evaluate(values: Float64Array, out: Float64Array): SampleFailure | null {
    try {
      this.#measures.read(this.solve(values), out);
      return null;
    } catch (e) {
      if (e instanceof QuiescentError) return { code: e.code, message: e.message };
      throw e;
    }
  }

  /** The operating point with `values`; throws what the solve throws. */
  solve(values: Float64Array): OperatingPoint {
    let temperature = this.#options.temperature;
    let c = 0;
    for (let j = 0; j < this.#varied.length; j++) {
      if (this.#varied[j]!.element === null) {
        temperature = values[j]!;
        if (!(temperature > 0)) throw invalidValue(['temperature'], temperature, 'a temperature above 0 K');
      } else this.#changes[c++]!.value = values[j]!;
    }
    const prepared = this.#prepared;
    const before = prepared.compilations;
    const solver = prepared.solver(this.#options);
    const reanalyses = solver.workspace.solver.statistics().reanalyses;
    try {
      prepared.setValues(this.#changes);
      const active = prepared.solver(this.#options);
      if (this.#start !== null && active.workspace.x.length === this.#start.length) {
        active.workspace.x.set(this.#start);
      } else {
        startFromGuess(active);
      }
      active.workspace.solver.invalidate();
      return solveFromCurrent(active, conditionsAt(temperature, this.#options));
    } finally {
      // A change of topology or a new symbolic analysis would carry into later samples: start over
      // from the nominal circuit's structure instead.
      const active = prepared.solver(this.#options);
      if (
        prepared.compilations !== before ||
        active.workspace.solver.statistics().reanalyses !== reanalyses
      ) {
        this.#prepared = this.#base.fork();
      }
    }
  }
}
