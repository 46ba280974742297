/**
 * The evaluation of one sample (or one worst-case vertex): set the drawn values on a prepared
 * circuit, solve the operating point, read the measures. Every evaluation starts from the same
 * state (the nominal solution as the first iterate, a fresh pivot search on the nominal ordering),
 * so its result depends on its values alone, never on which samples the same worker solved before:
 * that is what makes a run bit-identical for any number of workers and any split.
 */

import { parameterVariant, solutionFollows } from '../analysis/element-parameters.js';
import {
  conditionsAt,
  type OperatingPoint,
  type Solver,
  solveFromCurrent,
  startFromGuess,
} from '../analysis/operating-point.js';
import { type OperatingPointOptions, type ResolvedOptions, resolveOptions } from '../analysis/options.js';
import { PreparedCircuit } from '../analysis/prepared.js';
import { solutionDerivatives } from '../analysis/sensitivity.js';
import type { ElementRecord } from '../circuit/elements.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import type { PivotOrder } from '../linalg/index.js';
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
  /** The varied elements, one entry per element however many of its parameters vary. */
  readonly #elements: readonly VariedElement[];
  /** Each varied element's position in the circuit, and its record of the present sample. */
  readonly #positions: readonly number[];
  readonly #records: ElementRecord[];
  /**
   * How the nominal solution moves per unit change of each varied parameter (dx/dp, null where none
   * is kept), or null without a nominal solution: a sample starts from the first-order prediction
   * x₀ + Σ dx/dpⱼ·Δpⱼ, which saves Newton iterations where a parameter (the temperature above all)
   * moves every junction.
   */
  readonly #directions: readonly (Float64Array | null)[] | null;
  /**
   * How each varied parameter's change enters the prediction: the parameter itself, or the function
   * of it the solution follows most nearly linearly (1/β, ln I_S; see `ParameterSpec.solutionFollows`).
   */
  readonly #follows: readonly ('linear' | 'reciprocal' | 'logarithm')[];
  /** The pivot order of the nominal solve's last factorization (null: a fresh search per sample). */
  readonly #pivots: PivotOrder | null;

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
    this.#elements = variedElements(this.#base, varied);
    this.#positions = this.#elements.map((e) => e.position);
    this.#records = this.#elements.map((e) => e.nominal);
    const system = this.#base.system;
    this.#follows = varied.map((p) =>
      p.element === null
        ? 'linear'
        : solutionFollows(system.records[system.deviceIndex.get(p.element)!]!, p.parameter),
    );
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
    this.#directions = nominal instanceof QuiescentError ? null : predictorDirections(nominal, varied);
    this.#pivots = this.#base.solver(this.#options).workspace.solver.pivotOrder();
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
    for (let j = 0; j < this.#varied.length; j++) {
      if (this.#varied[j]!.element === null) {
        temperature = values[j]!;
        if (!(temperature > 0)) throw invalidValue(['temperature'], temperature, 'a temperature above 0 K');
      }
    }
    // Every varied element gets its record for this sample, checked before any device changes.
    for (let g = 0; g < this.#elements.length; g++) {
      const element = this.#elements[g]!;
      let record = element.first(values[element.indices[0]!]!);
      for (let t = 1; t < element.indices.length; t++) {
        record = parameterVariant(record, element.parameters[t]!)(values[element.indices[t]!]!);
      }
      this.#records[g] = record;
    }
    const prepared = this.#prepared;
    const before = prepared.compilations;
    const solver = prepared.solver(this.#options);
    const reanalyses = solver.workspace.solver.statistics().reanalyses;
    try {
      prepared.revalueInPlace(this.#positions, this.#records);
      const active = prepared.solver(this.#options);
      const conditions = conditionsAt(temperature, this.#options);
      const nominalStart = this.#start !== null && active.workspace.x.length === this.#start.length;
      if (nominalStart && this.#directions !== null) {
        this.#predict(values, active.workspace.x);
        this.#startPivots(active);
        try {
          return solveFromCurrent(active, conditions);
        } catch (e) {
          // A prediction can overshoot where the circuit is strongly nonlinear: the nominal start
          // decides then, as it would without one.
          if (!(e instanceof QuiescentError && e.code === 'no-convergence')) throw e;
        }
      }
      if (nominalStart) active.workspace.x.set(this.#start!);
      else startFromGuess(active);
      this.#startPivots(active);
      return solveFromCurrent(active, conditions);
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

  /**
   * Every sample factors on the nominal point's pivot order (a fresh search where that fails the
   * pivot test): the same start for every sample, so no sample depends on those solved before it.
   */
  #startPivots(solver: Solver): void {
    if (this.#pivots !== null) solver.workspace.solver.usePivotOrder(this.#pivots);
    else solver.workspace.solver.invalidate();
  }

  /**
   * x ← the nominal solution moved to first order by the sample's changes, each taken in the
   * function of its parameter the solution follows most nearly linearly: with u = f(p),
   * Δx ≈ (dx/dp)·(dp/du)·(f(p) − f(p₀)), so that a β drawn at twice its nominal value moves the
   * start as a halved base current does.
   */
  #predict(values: Float64Array, x: Float64Array): void {
    const start = this.#start!;
    const directions = this.#directions!;
    const n = start.length - 1;
    x.set(start);
    for (let j = 0; j < directions.length; j++) {
      const d = directions[j] ?? null;
      const p0 = this.#varied[j]!.nominal;
      const p = values[j]!;
      let delta = p - p0;
      if (d === null || delta === 0) continue;
      const follows = this.#follows[j];
      if (follows === 'reciprocal') delta = -p0 * p0 * (1 / p - 1 / p0);
      else if (follows === 'logarithm') delta = p0 * Math.log(p / p0);
      // A parameter at an infinite nominal value (no Early effect) gives no direction to move in.
      if (!Number.isFinite(delta)) continue;
      for (let u = 0; u < n; u++) x[u]! += d[u]! * delta;
    }
  }
}

/** The most numbers the predictor keeps (8 MB): past it, only the temperature's direction is kept. */
const PREDICTOR_NUMBERS = 1 << 20;

/**
 * dx/dp at the nominal point for the varied parameters: every one when they fit in
 * {@link PREDICTOR_NUMBERS}, else the temperature's alone (one direction that moves every junction);
 * null when the Jacobian at the nominal point cannot be solved.
 */
function predictorDirections(
  nominal: OperatingPoint,
  varied: readonly VariedParameter[],
): (Float64Array | null)[] | null {
  const all = varied.length * (nominal.system.n + 1) <= PREDICTOR_NUMBERS;
  const kept = varied.map((p) => all || p.element === null);
  if (!kept.includes(true)) return null;
  const parameters = varied
    .filter((_, j) => kept[j])
    .map((p) => ({
      element: p.element === null ? null : nominal.system.deviceIndex.get(p.element)!,
      parameter: p.parameter,
    }));
  let derivatives: Float64Array[];
  try {
    derivatives = solutionDerivatives(nominal, parameters);
  } catch (e) {
    if (e instanceof QuiescentError) return null;
    throw e;
  }
  let next = 0;
  return kept.map((keep) => (keep ? derivatives[next++]! : null));
}

/** The parameters varied on one element: where the element sits and which values it takes. */
interface VariedElement {
  readonly position: number;
  readonly nominal: ElementRecord;
  /** The nominal record with its first varied parameter set (checked as the builder checks it). */
  readonly first: (value: number) => ElementRecord;
  readonly parameters: readonly string[];
  /** Where each of those parameters' values sits in a sample's row. */
  readonly indices: readonly number[];
}

/** Group the varied parameters by element, in the order the elements first appear. */
function variedElements(prepared: PreparedCircuit, varied: readonly VariedParameter[]): VariedElement[] {
  const byName = new Map<string, { parameters: string[]; indices: number[] }>();
  varied.forEach((p, j) => {
    if (p.element === null) return;
    const entry = byName.get(p.element) ?? { parameters: [], indices: [] };
    entry.parameters.push(p.parameter);
    entry.indices.push(j);
    byName.set(p.element, entry);
  });
  return [...byName].map(([name, { parameters, indices }]) => {
    const position = prepared.system.deviceIndex.get(name);
    if (position === undefined) throw unknownElement(name);
    const nominal = prepared.system.records[position]!;
    return { position, nominal, first: parameterVariant(nominal, parameters[0]!), parameters, indices };
  });
}
