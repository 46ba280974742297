/**
 * The worst case of each measure over the ends of every tolerance: by enumerating every combination
 * of the ends (vertices, up to 16 varied parameters), or by the signs of the sensitivities at the
 * nominal point, which choose each parameter's end for the minimum and the maximum, each then
 * confirmed by one solve. The two ends of a tolerance are its range's limits, for a normal
 * distribution too.
 */
import { acAnalysis } from '../analysis/ac-analysis.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import { type OperatingPointOptions, resolveOptions } from '../analysis/options.js';
import { sensitivity } from '../analysis/sensitivity.js';
import { Circuit } from '../circuit/circuit.js';
import { invalidCircuit, invalidValue } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import { SampleEvaluator } from './evaluate-sample.js';
import { operatingPointOptionsOf } from './job.js';
import { type CheckedMeasure, type Measure, MeasureSet } from './measures.js';
import { resolveTolerances, type Tolerance, type VariedParameter } from './tolerances.js';

/** Options of {@link worstCase}. */
export interface WorstCaseOptions extends OperatingPointOptions {
  /** What varies; each parameter is taken at the ends of its range. */
  readonly tolerances: readonly Tolerance[];
  /** What is read, by name. */
  readonly measures: Readonly<Record<string, Measure>>;
  /**
   * `'vertices'` (default for up to 10 varied parameters): every combination of ends, 2ⁿ solves, at
   * most 16 parameters. `'sensitivity'` (default above 10): ends chosen by the signs of the
   * sensitivities at nominal, two solves per measure.
   */
  readonly method?: 'vertices' | 'sensitivity';
}

/** One extreme of a measure and the parameter values that produced it. */
export interface WorstCaseExtreme {
  /** The measure's value there. */
  readonly value: number;
  /** Every varied parameter's value, keyed `${element}.${parameter}` or `'temperature'`. */
  readonly parameters: Readonly<Record<string, number>>;
}

/** The worst case of every measure, by measure name. */
export type WorstCase = Readonly<
  Record<
    string,
    {
      /** The lowest value and where it is reached. */
      readonly min: WorstCaseExtreme;
      /** The highest value and where it is reached. */
      readonly max: WorstCaseExtreme;
    }
  >
>;

/** The most varied parameters vertex enumeration takes (2¹⁶ solves). */
export const MAX_VERTEX_PARAMETERS = 16;
/** Above this many varied parameters the default method is `'sensitivity'`. */
export const DEFAULT_VERTEX_LIMIT = 10;

/**
 * The minimum and maximum of every measure over the tolerances' ends. See docs/tolerances.md.
 *
 * @throws QuiescentError `invalid-value` (options, more than 16 parameters for vertices, an end out of
 *   a parameter's range), `unknown-element`, `unknown-node`, and any error of a corner's solve, its
 *   message naming the corner
 *
 * @example
 * ```ts
 * const wc = worstCase(circuit, {
 *   tolerances: [{ element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.01 }],
 *   measures: { out: 'out' },
 * });
 * wc.out.max.value; wc.out.max.parameters;
 * ```
 */
export function worstCase(circuit: Circuit, options: WorstCaseOptions): WorstCase {
  if (!(circuit instanceof Circuit)) throw invalidCircuit(['circuit'], 'must be a Circuit');
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with tolerances and measures');
  }
  const opOptions = operatingPointOptionsOf(options);
  delete (opOptions as Record<string, unknown>).method;
  const temperature = resolveOptions(opOptions).temperature;
  const varied = resolveTolerances(options.tolerances, circuit.elements, temperature);
  const measures = new MeasureSet(options.measures);
  const method = options.method ?? (varied.length <= DEFAULT_VERTEX_LIMIT ? 'vertices' : 'sensitivity');
  if (method !== 'vertices' && method !== 'sensitivity') {
    throw invalidValue(['options', 'method'], method, "'vertices' or 'sensitivity'");
  }
  const evaluator = new SampleEvaluator(circuit.elements, opOptions, varied, measures);
  evaluator.checkMeasures();
  const corner = new Corner(evaluator, varied, measures);
  return method === 'vertices' ? byVertices(corner) : bySensitivity(corner, evaluator);
}

/** Solves one combination of values and reads every measure, naming the corner when it fails. */
class Corner {
  readonly values: Float64Array;
  readonly out: Float64Array;

  constructor(
    readonly evaluator: SampleEvaluator,
    readonly varied: readonly VariedParameter[],
    readonly measures: MeasureSet,
  ) {
    this.values = new Float64Array(varied.length);
    this.out = new Float64Array(measures.names.length);
  }

  solve(): void {
    try {
      this.measures.read(this.evaluator.solve(this.values), this.out);
    } catch (e) {
      if (!(e instanceof QuiescentError)) throw e;
      throw new QuiescentError(e.details, `at the corner ${this.describe()}: ${e.message}`);
    }
  }

  parameters(): Record<string, number> {
    const out: Record<string, number> = {};
    this.varied.forEach((p, j) => {
      out[p.key] = this.values[j]!;
    });
    return Object.freeze(out);
  }

  describe(): string {
    return this.varied.map((p, j) => `${p.key} = ${this.values[j]}`).join(', ');
  }
}

function byVertices(corner: Corner): WorstCase {
  const { varied, measures } = corner;
  if (varied.length > MAX_VERTEX_PARAMETERS) {
    throw invalidValue(
      ['options', 'tolerances'],
      varied.length,
      `at most ${MAX_VERTEX_PARAMETERS} varied parameters for the vertex method (use method: 'sensitivity')`,
    );
  }
  const m = measures.names.length;
  const best = measures.names.map(() => ({
    min: { value: Number.POSITIVE_INFINITY, parameters: {} as Readonly<Record<string, number>> },
    max: { value: Number.NEGATIVE_INFINITY, parameters: {} as Readonly<Record<string, number>> },
  }));
  const count = 2 ** varied.length;
  for (let mask = 0; mask < count; mask++) {
    for (let j = 0; j < varied.length; j++) {
      corner.values[j] = (mask >> j) & 1 ? varied[j]!.high : varied[j]!.low;
    }
    corner.solve();
    for (let k = 0; k < m; k++) {
      const v = corner.out[k]!;
      if (v < best[k]!.min.value) best[k]!.min = { value: v, parameters: corner.parameters() };
      if (v > best[k]!.max.value) best[k]!.max = { value: v, parameters: corner.parameters() };
    }
  }
  const result: Record<string, { min: WorstCaseExtreme; max: WorstCaseExtreme }> = {};
  measures.names.forEach((name, k) => {
    result[name] = Object.freeze({ min: Object.freeze(best[k]!.min), max: Object.freeze(best[k]!.max) });
  });
  return Object.freeze(result);
}

function bySensitivity(corner: Corner, evaluator: SampleEvaluator): WorstCase {
  const nominal = evaluator.nominal;
  if (nominal instanceof QuiescentError) {
    throw new QuiescentError(nominal.details, `at the nominal values: ${nominal.message}`);
  }
  const { varied, measures } = corner;
  const result: Record<string, { min: WorstCaseExtreme; max: WorstCaseExtreme }> = {};
  measures.checked.forEach((measure, k) => {
    const signs = directionsOf(nominal, measure, varied);
    const extreme = (towards: 1 | -1): WorstCaseExtreme => {
      varied.forEach((p, j) => {
        const s = signs[j]! * towards;
        corner.values[j] = s > 0 ? p.high : s < 0 ? p.low : p.nominal;
      });
      corner.solve();
      return Object.freeze({ value: corner.out[k]!, parameters: corner.parameters() });
    };
    result[measures.names[k]!] = Object.freeze({ min: extreme(-1), max: extreme(1) });
  });
  return Object.freeze(result);
}

/** The signs of ∂measure/∂p at the nominal point for every varied p, from the adjoint sensitivities. */
function directionsOf(
  op: OperatingPoint,
  measure: CheckedMeasure,
  varied: readonly VariedParameter[],
): number[] {
  if (measure.type === 'ac') {
    const ac = acAnalysis(op, { frequencies: [measure.frequency] });
    const s = sensitivity(ac, { output: measure.output, frequency: measure.frequency });
    return varied.map((p) => {
      const entry = s.of(p.element, p.parameter);
      // The AC figures are per unit relative change (p·∂/∂p): the sign of p turns them into ∂/∂p.
      const perLog = measure.form === 'phase-degrees' ? entry.phaseDegrees : entry.magnitudeDb;
      return Math.sign(perLog) * Math.sign(p.nominal);
    });
  }
  const output = measure.type === 'probe' ? measure.probe : { device: measure.device, field: measure.field };
  const s = sensitivity(op, { output });
  return varied.map((p) => Math.sign(s.of(p.element, p.parameter).derivative));
}
