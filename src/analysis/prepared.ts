/**
 * The prepared circuit: a circuit compiled once (unknowns numbered, devices bound to their slots, the
 * sparse pattern built, the LU ordering found at the first solve) and then solved as often as needed.
 * Element values and model parameters can change without compiling again, as long as the topology
 * stays: the pattern, the ordering and the pivot sequence are kept while they stay healthy.
 *
 * `operatingPoint(circuit)` keeps one prepared circuit per circuit, keyed on the circuit's revision,
 * so a second analysis of an unchanged circuit does not compile it again.
 */
import type { Circuit } from '../circuit/circuit.js';
import type { ElementRecord } from '../circuit/elements.js';
import { requireOptions } from '../errors/arguments.js';
import { invalidCircuit, unknownElement, unknownNode } from '../errors/messages.js';
import { type CompiledSystem, compileCircuit, withRecords } from '../mna/system.js';
import { parseValue } from '../values/index.js';
import type { Value } from '../values/value.js';
import { requireCircuit } from './arguments.js';
import { parameterValue, parameterVariant } from './element-parameters.js';
import { measureResidual, NewtonWorkspace, prepareWorkspace } from './newton.js';
import {
  conditionsAt,
  type OperatingPoint,
  type Solver,
  solveFromCurrent,
  startFromGuess,
} from './operating-point.js';
import { type OperatingPointOptions, type ResolvedOptions, resolveOptions } from './options.js';

/**
 * A circuit compiled once for many solves. Build it with {@link prepareCircuit}; change values with
 * {@link PreparedCircuit.setValue}; solve with {@link PreparedCircuit.operatingPoint}. Changing a
 * value never changes the circuit it was prepared from, nor any result already returned.
 *
 * @example
 * ```ts
 * const prepared = prepareCircuit(circuit);
 * for (const r of [1e3, 2.2e3, 4.7e3]) {
 *   prepared.setValue('Rload', 'resistance', r);
 *   console.log(prepared.operatingPoint().voltage('out'));
 * }
 * ```
 */
export class PreparedCircuit {
  #system: CompiledSystem;
  #workspace: NewtonWorkspace;
  readonly #original: readonly ElementRecord[];
  #compilations = 1;
  /**
   * Whether every device of the present system belongs to this prepared circuit alone (no fork, no
   * earlier system, no returned result shares it), so that {@link PreparedCircuit.revalueInPlace} may
   * change it.
   */
  #ownsDevices = false;

  /** @internal Use {@link prepareCircuit}; `compiled` shares an existing compilation of `records`. */
  constructor(records: readonly ElementRecord[], compiled?: CompiledSystem) {
    this.#original = records;
    this.#system = compiled ?? compileCircuit(records);
    if (compiled !== undefined) this.#compilations = 0;
    this.#workspace = new NewtonWorkspace(this.#system);
  }

  /** The element records with their present values, in the circuit's order. */
  get elements(): readonly ElementRecord[] {
    return this.#system.records;
  }

  /**
   * How many times this prepared circuit compiled: 1, plus one for every value change that altered the
   * topology (a diode's series resistance stepping away from 0 adds an internal node, say).
   */
  get compilations(): number {
    return this.#compilations;
  }

  /** @internal The compiled system with the present values. */
  get system(): CompiledSystem {
    return this.#system;
  }

  /**
   * Set one numeric parameter of an element: `resistance`, `capacitance`, `inductance`, `gain`,
   * `transconductance`, `transresistance`, `dc` or `ac` (the AC magnitude) of a source, or a model
   * parameter of a diode, transistor or op-amp, in its SI unit (a number or a value string).
   *
   * @throws QuiescentError `unknown-element` (no such element), `invalid-value` (no such parameter, or
   *   a value out of the parameter's range, checked as the builder checks it)
   */
  setValue(element: string, parameter: string, value: Value): this {
    return this.setValues([{ element, parameter, value }]);
  }

  /**
   * Set several parameters at once (one pass over the devices instead of one per change). Every change
   * is checked before any is applied.
   */
  setValues(changes: readonly { element: string; parameter: string; value: Value }[]): this {
    if (!Array.isArray(changes))
      throw invalidCircuit(['changes'], 'must be a list of { element, parameter, value }');
    const byName = new Map<string, ElementRecord>();
    for (const [k, change] of changes.entries()) {
      if (change === null || typeof change !== 'object') {
        throw invalidCircuit(['changes', k], 'must be { element, parameter, value }');
      }
      const { element, parameter, value } = change;
      const record = byName.get(element) ?? this.#record(element);
      const numeric =
        typeof value === 'number' ? value : parseValue(value as string, undefined, [element, parameter]);
      byName.set(element, parameterVariant(record, parameter)(numeric));
    }
    this.#apply([...byName.values()]);
    return this;
  }

  /**
   * @internal Give the elements at `positions` the records `records` (the same elements with other
   * values, checked as {@link PreparedCircuit.setValues} checks them) by changing the devices in place:
   * no device object, slot array or system per change. For callers that read every result before the
   * next change (a Monte Carlo sample, a worst-case vertex): a result solved before this call must not
   * be read after it. The first call copies the devices this prepared circuit shares.
   */
  revalueInPlace(positions: readonly number[], records: readonly ElementRecord[]): void {
    if (!this.#ownsDevices) {
      const own = withRecords(this.#system, this.#system.records);
      if (own === null) throw new Error('a system could not be rebound to its own records');
      this.#system = own;
      this.#workspace.useSystem(own);
      this.#ownsDevices = true;
    }
    const devices = this.#system.devices;
    const present = this.#system.records as ElementRecord[];
    const rebound: ElementRecord[] = [];
    for (let j = 0; j < positions.length; j++) {
      const k = positions[j]!;
      const record = records[j]!;
      if (devices[k]!.revalue?.(record) === true) present[k] = record;
      else rebound.push(record);
    }
    // The linear part of the matrix was loaded with the old values.
    this.#workspace.linearFor = null;
    if (rebound.length > 0) {
      // New devices for the rest (its own, so ownership holds), compiled afresh if the topology changed.
      this.#apply(rebound);
      this.#ownsDevices = true;
    }
  }

  /** The present value of a parameter (a model parameter's default when it was never given). */
  value(element: string, parameter: string): number {
    return parameterValue(this.#record(element), parameter);
  }

  /** Restore every value the circuit was prepared with. */
  reset(): this {
    const changed = this.#original.filter((r, k) => r !== this.#system.records[k]);
    if (changed.length > 0) this.#apply(changed);
    return this;
  }

  /**
   * The DC operating point with the present values; see `operatingPoint` for the options. Each call
   * starts from the options' initial guess.
   */
  operatingPoint(options?: OperatingPointOptions): OperatingPoint {
    requireOptions(options);
    // The result reads these devices: a later in-place change must copy them first.
    this.#ownsDevices = false;
    const solver = this.solver(resolveOptions(options));
    startFromGuess(solver);
    return solveFromCurrent(solver, conditionsAt(solver.options.temperature, solver.options));
  }

  /** @internal The workspace with these options, for analyses that solve many points. */
  solver(options: ResolvedOptions): Solver {
    for (const node of Object.keys(options.initialGuess)) {
      if (!this.#system.nodeIndex.has(node)) throw unknownNode(node, ['options', 'initialGuess', node]);
    }
    return { system: this.#system, workspace: this.#workspace, options };
  }

  /**
   * @internal The DC Jacobian (matrix values on the system's pattern, length nnz + 1) at an operating
   * point of this circuit, as the last Newton iteration saw it.
   */
  jacobianAt(op: OperatingPoint): Float64Array {
    const options = resolveOptions();
    const ws = new NewtonWorkspace(op.system);
    ws.x.set(op.x);
    prepareWorkspace(ws, op.conditions);
    measureResidual(ws, options);
    return ws.A.slice();
  }

  /** @internal A copy with its own workspace and values, sharing the compiled structure. */
  fork(): PreparedCircuit {
    return new PreparedCircuit(this.#original, this.#system);
  }

  #record(element: string): ElementRecord {
    const k = typeof element === 'string' ? this.#system.deviceIndex.get(element) : undefined;
    if (k === undefined) throw unknownElement(String(element));
    return this.#system.records[k]!;
  }

  #apply(changed: readonly ElementRecord[]): void {
    this.#ownsDevices = false;
    const next = withRecords(this.#system, changed);
    if (next !== null) {
      this.#system = next;
      this.#workspace.useSystem(next);
      return;
    }
    // The topology changed: compile the records as they now stand.
    const records = this.#system.records.slice();
    for (const record of changed) records[this.#system.deviceIndex.get(record.name)!] = record;
    this.#system = compileCircuit(records);
    this.#workspace = new NewtonWorkspace(this.#system);
    this.#compilations++;
  }
}

/**
 * Compile a circuit once for many solves: value changes without compiling again, every analysis on
 * the same ordering. The prepared circuit is independent of `circuit`: later builder calls on the
 * circuit do not reach it.
 *
 * @throws QuiescentError the topology errors of `operatingPoint` (`no-ground`, `floating-node`,
 *   `singular`, `unknown-element`)
 */
export function prepareCircuit(circuit: Circuit): PreparedCircuit {
  requireCircuit(circuit);
  return new PreparedCircuit(circuit.elements);
}

/** The prepared circuit kept on a circuit (`Circuit.analysisCache`) and the revision it was built at. */
interface CachedPrepared {
  readonly revision: number;
  readonly prepared: PreparedCircuit;
}

/** @internal The cached prepared circuit of `circuit`, compiled again only when the circuit changed. */
export function preparedFor(circuit: Circuit): PreparedCircuit {
  const entry = circuit.analysisCache as CachedPrepared | undefined;
  if (entry !== undefined && entry.revision === circuit.revision) return entry.prepared;
  const prepared = new PreparedCircuit(circuit.elements);
  circuit.analysisCache = { revision: circuit.revision, prepared } satisfies CachedPrepared;
  return prepared;
}

/** @internal A fresh solver for element records (a circuit's, or a variant of them), compiled now. */
export function solverFor(records: readonly ElementRecord[], options: ResolvedOptions): Solver {
  return new PreparedCircuit(records).solver(options);
}

/** @internal The solver of a circuit's cached prepared system with these options (quasi-static checks, benches). */
export function prepareSolver(circuit: Circuit, options?: OperatingPointOptions): Solver {
  return preparedFor(circuit).solver(resolveOptions(options));
}

/**
 * Find the DC operating point of a circuit. A circuit analysed before, and unchanged since, is not
 * compiled again; a {@link PreparedCircuit} is solved with its present values.
 *
 * @param circuit - the circuit to solve, or a prepared circuit
 * @param options - temperature (K), junction conductance, tolerances, iteration limit, initial guess
 * @returns the immutable {@link OperatingPoint}
 * @throws QuiescentError `no-ground`, `floating-node`, `singular`, `unknown-element`, `no-convergence`,
 *   `invalid-value`
 *
 * @example
 * ```ts
 * const op = operatingPoint(circuit);
 * op.voltage('out');          // volts
 * op.device('D1').resistance; // the diode's dynamic resistance, Ω
 * ```
 */
export function operatingPoint(
  circuit: Circuit | PreparedCircuit,
  options?: OperatingPointOptions,
): OperatingPoint {
  if (!(circuit instanceof PreparedCircuit)) requireCircuit(circuit);
  const prepared = circuit instanceof PreparedCircuit ? circuit : preparedFor(circuit);
  return prepared.operatingPoint(options);
}
