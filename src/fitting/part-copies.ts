/**
 * The measured part as the fits evaluate it: one copy per measured point in one circuit, compiled once
 * for the whole fit. Each evaluation of the least squares changes only the copies' model values on a
 * prepared circuit, so a fit compiles again only where a value changes the unknowns (a series
 * resistance leaving 0).
 */

import type { OperatingPoint } from '../analysis/operating-point.js';
import type { OperatingPointOptions } from '../analysis/options.js';
import { type PreparedCircuit, prepareCircuit } from '../analysis/prepared.js';
import type { Circuit } from '../circuit/circuit.js';

/** The copies of one part, named `elements`, built by `build` from a model the first time. */
export class PartCopies<M extends object> {
  #prepared: PreparedCircuit | null = null;

  /**
   * @param elements - the names of the copies, as `build` names them
   * @param build - the circuit of every copy with a given model (called once)
   */
  constructor(
    readonly elements: readonly string[],
    readonly build: (model: M) => Circuit,
  ) {}

  /** The operating point with every copy at `model` (its numeric parameters; the polarity is fixed). */
  solve(model: M, options: OperatingPointOptions): OperatingPoint {
    if (this.#prepared === null) {
      this.#prepared = prepareCircuit(this.build(model));
    } else {
      const changes: { element: string; parameter: string; value: number | string }[] = [];
      for (const [parameter, value] of Object.entries(model)) {
        if (parameter === 'polarity' || (typeof value !== 'number' && typeof value !== 'string')) continue;
        for (const element of this.elements) changes.push({ element, parameter, value });
      }
      this.#prepared.setValues(changes);
    }
    return this.#prepared.operatingPoint(options);
  }
}
