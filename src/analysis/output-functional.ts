/**
 * An output as a linear functional of the small-signal solution: y = Σ c_j·x_j over the unknowns.
 * The adjoint method solves Aᵀ·z = c once and reads the output's response to any excitation b as
 * zᵀ·b, so it needs c itself rather than a reader of solutions.
 */
import type { BiasPoint } from '../devices/device.js';
import type { CompiledSystem } from '../mna/system.js';
import type { Probe } from './ac-analysis.js';
import { type ProbeReader, probeReader } from './distortion-probe.js';
import { nodeAt } from './operating-point.js';

/** Writes the coefficients c of an output at angular frequency ω. */
export class OutputFunctional {
  /** Unknowns with a nonzero coefficient (the trash index n may appear; its entry is ignored). */
  readonly #support: Int32Array;
  /** Coefficients of a voltage output, or NaN for one read through an element's current. */
  readonly #weights: Float64Array;
  readonly #reader: ProbeReader | null;
  readonly #xr: Float64Array;
  readonly #xi: Float64Array;
  readonly #value = new Float64Array(2);
  readonly #offset = new Float64Array(2);

  /**
   * @param system - the compiled circuit
   * @param x - the operating point the devices are linearized at
   * @param probe - the output
   * @param omegas - angular frequencies at which the support of an element current is found
   * @throws QuiescentError `unknown-node`, `unknown-element`, `invalid-value` for a probe that cannot be read
   */
  constructor(system: CompiledSystem, at: BiasPoint, probe: Probe, omegas: readonly number[]) {
    const n = system.n;
    this.#xr = new Float64Array(n + 1);
    this.#xi = new Float64Array(n + 1);
    if (typeof probe === 'object' && probe !== null && 'node' in probe && typeof probe.node === 'string') {
      const reference = probe.reference === undefined ? n : nodeAt(system, probe.reference);
      this.#support = Int32Array.of(nodeAt(system, probe.node), reference);
      this.#weights = Float64Array.of(1, -1);
      this.#reader = null;
      return;
    }
    if (typeof probe === 'string') {
      this.#support = Int32Array.of(nodeAt(system, probe));
      this.#weights = Float64Array.of(1);
      this.#reader = null;
      return;
    }
    // An element current: a linear function of a few unknowns, found once by probing each unknown.
    const reader = probeReader(system, at, probe, false);
    this.#reader = reader;
    const support: number[] = [];
    for (let j = 0; j < n; j++) {
      for (const omega of omegas) {
        if (this.#coefficient(j, omega, this.#value)) {
          support.push(j);
          break;
        }
      }
    }
    this.#support = Int32Array.from(support);
    this.#weights = new Float64Array(support.length).fill(Number.NaN);
  }

  /** Add the coefficients c at ω into (re, im), vectors of length n+1. */
  addAt(omega: number, re: Float64Array, im: Float64Array): void {
    const support = this.#support;
    if (this.#reader === null) {
      for (let s = 0; s < support.length; s++) re[support[s]!]! += this.#weights[s]!;
      return;
    }
    const value = this.#value;
    for (let s = 0; s < support.length; s++) {
      const j = support[s]!;
      this.#coefficient(j, omega, value);
      re[j]! += value[0]!;
      im[j]! += value[1]!;
    }
  }

  /** c_j at ω into out (the reader at the unit vector e_j, less its value at 0); whether it is nonzero. */
  #coefficient(j: number, omega: number, out: Float64Array): boolean {
    const read = this.#reader!;
    const xr = this.#xr;
    const xi = this.#xi;
    read(xr, xi, omega, this.#offset);
    xr[j] = 1;
    read(xr, xi, omega, out);
    xr[j] = 0;
    out[0]! -= this.#offset[0]!;
    out[1]! -= this.#offset[1]!;
    return out[0] !== 0 || out[1] !== 0;
  }
}
