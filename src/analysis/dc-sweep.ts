/**
 * The DC sweep: a sequence of operating points as one quantity steps through given values, each
 * solved from the solution before it (continuation), which is faster than solving every point
 * from scratch and follows one branch of the solutions of a circuit that has several.
 *
 * Three quantities can be swept: the DC value of an independent source, a numeric parameter of one
 * element (a resistance, a gain, a model parameter), and the temperature.
 */
import type { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import { requireCircuit } from './arguments.js';
import { parameterVariant } from './element-parameters.js';
import {
  conditionsAt,
  type OperatingPoint,
  type Solver,
  solveFromCurrent,
  startFromGuess,
} from './operating-point.js';
import { type OperatingPointOptions, resolveOptions } from './options.js';
import { type PreparedCircuit, preparedFor } from './prepared.js';
import type { DeviceReport } from './reports.js';
import { type DcSweepJson, dcSweepToJson } from './result-json.js';

/** The values a sweep steps through, in the order given: any finite numbers. */
export type SweepValues = readonly number[] | Float64Array;

/** Sweep the DC value of an independent voltage source (V) or current source (A). */
export interface SourceSweepOptions extends OperatingPointOptions {
  /** The name of the voltage or current source whose DC value is swept. */
  source: string;
  /** Its DC values, in V or A. */
  values: SweepValues;
}

/**
 * Sweep one numeric parameter of an element: `resistance`, `capacitance`, `inductance`, `gain`,
 * `transconductance`, `transresistance`, `dc` of a source, or a model parameter of a diode,
 * transistor or op-amp (`saturationCurrent`, `forwardBeta`, `gainFactor`, `openLoopGain`, …).
 */
export interface ParameterSweepOptions extends OperatingPointOptions {
  /** The element whose parameter is swept. */
  element: string;
  /** The parameter's name, as in the builder call or the model. */
  parameter: string;
  /** Its values, in the parameter's SI unit. */
  values: SweepValues;
}

/** Sweep the analysis temperature. */
export interface TemperatureSweepOptions extends Omit<OperatingPointOptions, 'temperature'> {
  /** The temperatures, in K (each finite and above 0). */
  temperature: SweepValues;
}

/** Options of {@link dcSweep}: what is swept, through which values, and the operating-point options. */
export type DcSweepOptions = SourceSweepOptions | ParameterSweepOptions | TemperatureSweepOptions;

/** What a sweep stepped, for messages and for programs that label plots. */
export type SweptQuantity =
  | {
      /** The DC value of an independent source was swept. */
      readonly kind: 'source';
      /** The source's name. */
      readonly element: string;
    }
  | {
      /** A parameter of an element was swept. */
      readonly kind: 'parameter';
      /** The element's name. */
      readonly element: string;
      /** The parameter's name. */
      readonly parameter: string;
    }
  | {
      /** The analysis temperature was swept. */
      readonly kind: 'temperature';
    };

/** The result of a {@link dcSweep}: one operating point per swept value. Accessors return copies. */
export class DcSweep {
  /** What was swept. */
  readonly swept: SweptQuantity;
  /** The operating point at each value, in the order of the values. */
  readonly points: readonly OperatingPoint[];
  readonly #values: Float64Array;

  /** @internal Built by {@link dcSweep}. */
  constructor(swept: SweptQuantity, values: Float64Array, points: readonly OperatingPoint[]) {
    this.swept = swept;
    this.#values = values;
    this.points = Object.freeze(points.slice());
  }

  /** The swept values, in the order given (a copy). */
  get values(): Float64Array {
    return this.#values.slice();
  }

  /** Newton iterations taken over the whole sweep. */
  get iterations(): number {
    return this.points.reduce((sum, p) => sum + p.iterations, 0);
  }

  /** The voltage of `node` with respect to `reference` (ground by default) at every point, in V. */
  voltage(node: string, reference: string = GROUND): Float64Array {
    return Float64Array.from(this.points, (p) => p.voltage(node, reference));
  }

  /** The current of an element at every point, in A, by the sign conventions of `OperatingPoint.current`. */
  current(element: string): Float64Array {
    return Float64Array.from(this.points, (p) => p.current(element));
  }

  /** The device report of a diode or transistor at every point. */
  device(name: string): DeviceReport[] {
    return this.points.map((p) => p.device(name));
  }

  /** Plain data: the swept values, and every node voltage and element current per point. */
  toJSON(): DcSweepJson {
    return dcSweepToJson(this);
  }
}

/**
 * Step a source value, an element parameter or the temperature through `values` and find the
 * operating point at each, starting each solve from the solution before it.
 *
 * @param circuit - the circuit to sweep (it is not changed)
 * @param options - one of `{ source, values }`, `{ element, parameter, values }` or
 *   `{ temperature: values }`, plus any option of `operatingPoint` (the initial guess applies to
 *   the first point)
 * @returns the {@link DcSweep} with one operating point per value
 * @throws QuiescentError `unknown-element` (the swept element does not exist, or is not a source for
 *   a source sweep), `invalid-value` (no values, a value that is not finite or out of the
 *   parameter's range, an unknown parameter), `no-convergence` (naming the value where it failed),
 *   and the topology errors of `operatingPoint`
 *
 * @example
 * ```ts
 * const sweep = dcSweep(circuit, { source: 'input', values: linearSweep(0, 5, 51) });
 * sweep.voltage('out');   // Float64Array, one entry per value
 * dcSweep(circuit, { element: 'R2', parameter: 'resistance', values: [1e3, 2e3, 5e3] });
 * dcSweep(circuit, { temperature: [250, 300, 350] });
 * ```
 */
export function dcSweep(circuit: Circuit, options: DcSweepOptions): DcSweep {
  requireCircuit(circuit);
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object naming what to sweep');
  }
  const given = options as unknown as Record<string, unknown>;
  const kinds = [
    given.source !== undefined,
    given.element !== undefined,
    typeof given.temperature === 'object' && given.temperature !== null,
  ].filter(Boolean).length;
  if (kinds > 1) {
    throw invalidValue(
      ['options'],
      options,
      'one sweep only: a source, an element parameter or a temperature list',
    );
  }
  if ('source' in options && options.source !== undefined) return sourceSweep(circuit, options);
  if ('element' in options && options.element !== undefined) return parameterSweep(circuit, options);
  if ('temperature' in options && typeof options.temperature === 'object') {
    return temperatureSweep(circuit, options as TemperatureSweepOptions);
  }
  throw invalidValue(
    ['options'],
    options,
    'a sweep: { source, values }, { element, parameter, values } or { temperature: values }',
  );
}

/** Copy the values into a Float64Array, checking that there is at least one and each is finite. */
function checkedValues(values: unknown, key: string, check?: (v: number, k: number) => void): Float64Array {
  const ok = Array.isArray(values) || values instanceof Float64Array;
  if (!ok || (values as ArrayLike<unknown>).length === 0) {
    throw invalidValue(['options', key], ok ? '[]' : values, 'a non-empty list of finite numbers');
  }
  const list = values as ArrayLike<unknown>;
  const out = new Float64Array(list.length);
  for (let k = 0; k < list.length; k++) {
    const v = list[k];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw invalidValue(['options', key, k], v, 'a finite number');
    }
    check?.(v, k);
    out[k] = v;
  }
  return out;
}

/** The options of the operating point solved at each point, without the sweep's own keys. */
function pointOptions(options: object): OperatingPointOptions {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(options)) {
    // Anything under `temperature` but a list is the fixed temperature of a source or parameter
    // sweep, and is checked as such (a string or null is rejected, not replaced by the default).
    const temperatureList = Array.isArray(value) || value instanceof Float64Array;
    if (!SWEEP_KEYS.has(key) || (key === 'temperature' && !temperatureList)) out[key] = value;
  }
  return out as OperatingPointOptions;
}

/** The keys that say what is swept; every other key is an operating-point option. */
const SWEEP_KEYS: ReadonlySet<string> = new Set(['source', 'element', 'parameter', 'values', 'temperature']);

/** Solve each point from the one before through `solveAt`, naming the swept value when one fails. */
function continuation(
  values: Float64Array,
  describe: (value: number) => string,
  solveAt: (value: number, k: number) => OperatingPoint,
): OperatingPoint[] {
  const points: OperatingPoint[] = [];
  for (let k = 0; k < values.length; k++) {
    try {
      points.push(solveAt(values[k]!, k));
    } catch (e) {
      if (e instanceof QuiescentError && e.code === 'no-convergence') {
        throw new QuiescentError(
          e.details,
          `at ${describe(values[k]!)} (point ${k + 1} of the sweep): ${e.message}`,
        );
      }
      throw e;
    }
  }
  return points;
}

function sourceSweep(circuit: Circuit, options: SourceSweepOptions): DcSweep {
  const name = options.source;
  const record = typeof name === 'string' ? circuit.element(name) : undefined;
  if (record === undefined)
    throw unknownElement(String(name), 'the circuit has no element of that name', ['options', 'source']);
  if (record.kind !== 'voltage-source' && record.kind !== 'current-source') {
    throw unknownElement(
      name,
      `it is a ${record.kind}, not an independent source; sweep its parameters with { element, parameter, values }`,
      ['options', 'source'],
    );
  }
  const values = checkedValues(options.values, 'values');
  const solver = startedSolver(preparedFor(circuit), options);
  const base = conditionsAt(solver.options.temperature, solver.options);
  const unit = record.kind === 'voltage-source' ? 'V' : 'A';
  const points = continuation(
    values,
    (v) => `${name} = ${v} ${unit}`,
    (v) => solveFromCurrent(solver, { ...base, sourceValues: new Map([[name, v]]) }),
  );
  return new DcSweep({ kind: 'source', element: name }, values, points);
}

function temperatureSweep(circuit: Circuit, options: TemperatureSweepOptions): DcSweep {
  const values = checkedValues(options.temperature, 'temperature', (v, k) => {
    if (v <= 0) throw invalidValue(['options', 'temperature', k], v, 'a temperature above 0 K');
  });
  const solver = startedSolver(preparedFor(circuit), options);
  const points = continuation(
    values,
    (t) => `T = ${t} K`,
    (t) => solveFromCurrent(solver, conditionsAt(t, solver.options)),
  );
  return new DcSweep({ kind: 'temperature' }, values, points);
}

function parameterSweep(circuit: Circuit, options: ParameterSweepOptions): DcSweep {
  const { element, parameter } = options;
  const record = typeof element === 'string' ? circuit.element(element) : undefined;
  if (record === undefined)
    throw unknownElement(String(element), 'the circuit has no element of that name', ['options', 'element']);
  if ((record.kind === 'voltage-source' || record.kind === 'current-source') && parameter === 'dc') {
    const { element: _e, parameter: _p, ...rest } = options;
    return sourceSweep(circuit, { ...rest, source: element });
  }
  const variant = parameterVariant(record, parameter);
  const values = checkedValues(options.values, 'values');
  // Every value is checked as the builder would check it before anything is solved.
  for (const v of values) variant(v);
  const resolved = resolveOptions(pointOptions(options));
  const conditions = conditionsAt(resolved.temperature, resolved);
  // A copy of the circuit's prepared system: its values change, the circuit's stay.
  const prepared = preparedFor(circuit).fork();
  let compilations = -1;
  const points = continuation(
    values,
    (v) => `${element}.${parameter} = ${v}`,
    (v) => {
      prepared.setValue(element, parameter, v);
      const solver = prepared.solver(resolved);
      // Each point starts from the one before, unless the value changed the unknowns (a diode's
      // series resistance stepping away from 0 adds an internal node, say).
      if (prepared.compilations !== compilations) startFromGuess(solver);
      compilations = prepared.compilations;
      return solveFromCurrent(solver, conditions);
    },
  );
  return new DcSweep({ kind: 'parameter', element, parameter }, values, points);
}

/** The prepared circuit's solver with the sweep's point options, at the initial guess. */
function startedSolver(prepared: PreparedCircuit, options: object): Solver {
  const solver = prepared.solver(resolveOptions(pointOptions(options)));
  startFromGuess(solver);
  return solver;
}
