/**
 * Noise analysis: every noise generator of the circuit (thermal, shot, flicker, op-amp input noise),
 * each an uncorrelated excitation of the small-signal equations at the operating point, carried to
 * an output. One transposed (adjoint) solve per frequency, Aᵀ·z = c with c the output's coefficients,
 * gives the transfer from every generator at once: the output's response to an excitation b is zᵀ·b
 * (docs/noise.md, "How it is computed").
 */

import type { NoiseGenerator, NoiseMechanism } from '../devices/device.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import type { Probe } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { requireInstance, requireOptions } from './arguments.js';
import { checkFrequencies } from './frequency-grid.js';
import { integratePsd } from './noise-integral.js';
import { type NoiseJson, noiseToJson } from './noise-json.js';
import { OperatingPoint } from './operating-point.js';
import { OutputFunctional } from './output-functional.js';

/** Options of {@link noise}. */
export interface NoiseOptions {
  /** Where the noise is observed: a node, `{ node, reference }` or `{ element }` (its current). */
  readonly output: Probe;
  /** The frequencies in Hz, each greater than 0, in any order. */
  readonly frequencies: readonly number[] | Float64Array;
  /** An independent voltage or current source: the noise is also referred to it (`inputDensity`). */
  readonly input?: string;
  /** A resistor standing for the signal source's resistance: the noise figure is taken against it. */
  readonly sourceResistor?: string;
}

/** One generator's share of the output noise. */
export interface NoiseContribution {
  /** The element the generator belongs to. */
  readonly element: string;
  /** Its physical origin. */
  readonly mechanism: NoiseMechanism;
  /** Which terminal or input, where the element has several generators of one mechanism. */
  readonly terminal?: string;
  /** √(PSD) of its share of the output noise at each frequency, in V/√Hz (A/√Hz for a current output). */
  readonly density: Float64Array;
}

/** The result of a noise analysis. Immutable. */
export class Noise {
  /** The operating point the noise was evaluated at (its temperature is the noise temperature). */
  readonly operatingPoint: OperatingPoint;
  /** The output the noise is referred to. */
  readonly output: Probe;
  /** The analysed frequencies in Hz, in the order given. */
  readonly frequencies: Float64Array;
  /** √(output noise PSD) at each frequency, in V/√Hz (A/√Hz for an element-current output). */
  readonly outputDensity: Float64Array;
  /** The input source, when one was named. */
  readonly input: string | undefined;
  /**
   * The output density divided by |H|, H the output's phasor per volt (per ampere) of the input source
   * alone: V/√Hz for a voltage source, A/√Hz for a current source. Present when `input` was named.
   */
  readonly inputDensity: Float64Array | undefined;
  /** The source resistor, when one was named. */
  readonly sourceResistor: string | undefined;
  /**
   * 10·log10(total output PSD / output PSD of the source resistor's thermal noise alone), in dB, at
   * each frequency. Present when `sourceResistor` was named.
   */
  readonly noiseFigure: Float64Array | undefined;
  /** Every generator's output-referred density, the largest total power (over all frequencies) first. */
  readonly contributions: readonly NoiseContribution[];
  /** Ascending frequencies and the output PSD at them, for integration. */
  readonly #sortedFrequencies: Float64Array;
  readonly #sortedPsd: Float64Array;
  /** Indices of the analysed frequencies in ascending order of frequency. */
  readonly #order: Int32Array;

  /** @internal Built by {@link noise}. */
  constructor(
    op: OperatingPoint,
    options: NoiseOptions,
    frequencies: Float64Array,
    outputPsd: Float64Array,
    contributions: readonly NoiseContribution[],
    inputDensity: Float64Array | undefined,
    noiseFigure: Float64Array | undefined,
  ) {
    this.operatingPoint = op;
    this.output = options.output;
    this.frequencies = frequencies;
    this.outputDensity = outputPsd.map(Math.sqrt);
    this.input = options.input;
    this.inputDensity = inputDensity;
    this.sourceResistor = options.sourceResistor;
    this.noiseFigure = noiseFigure;
    this.contributions = contributions;
    const order = Int32Array.from(frequencies.keys()).sort((a, b) => frequencies[a]! - frequencies[b]!);
    this.#order = order;
    this.#sortedFrequencies = Float64Array.from(order, (k) => frequencies[k]!);
    this.#sortedPsd = Float64Array.from(order, (k) => outputPsd[k]!);
  }

  /**
   * The RMS output noise over [low, high] Hz, √∫ PSD df, with the PSD interpolated as a straight line
   * on log-log axes between analysed frequencies (a power law, integrated exactly).
   *
   * @throws QuiescentError `invalid-value` when low ≥ high or either lies outside the analysed range
   */
  integrated(low: number, high: number): number {
    return Math.sqrt(integratePsd(this.#sortedFrequencies, this.#sortedPsd, low, high));
  }

  /**
   * The RMS output noise of each contribution over [low, high] Hz, in the order of
   * {@link Noise.contributions}, integrated as {@link Noise.integrated}; their squares add up to the
   * square of `integrated(low, high)`.
   *
   * @throws QuiescentError `invalid-value` when low ≥ high or either lies outside the analysed range
   */
  integratedContributions(low: number, high: number): Float64Array {
    const order = this.#order;
    const psd = new Float64Array(order.length);
    return Float64Array.from(this.contributions, (c) => {
      for (let k = 0; k < order.length; k++) psd[k] = c.density[order[k]!]! ** 2;
      return Math.sqrt(integratePsd(this.#sortedFrequencies, psd, low, high));
    });
  }

  /** Plain data: frequencies, densities and contributions as arrays. */
  toJSON(): NoiseJson {
    return noiseToJson(this);
  }
}

/** The generators of a circuit, flattened into arrays for the frequency loop. */
interface GeneratorTable {
  readonly generators: readonly NoiseGenerator[];
  readonly owners: readonly string[];
  readonly from: Int32Array;
  readonly to: Int32Array;
  readonly white: Float64Array;
  readonly flicker: Float64Array;
  /** 1 for a generator with a frequency-dependent weight. */
  readonly weighted: Uint8Array;
  /** 1 for a generator that is part of the output current itself (set per analysis). */
  readonly direct: Float64Array;
  /** Scratch for a generator's weight. */
  readonly weight: Float64Array;
}

function collectGenerators(op: OperatingPoint): GeneratorTable {
  const generators: NoiseGenerator[] = [];
  const owners: string[] = [];
  for (const device of op.system.devices) {
    for (const g of device.noiseGenerators?.(op.x, op.conditions) ?? []) {
      generators.push(g);
      owners.push(device.name);
    }
  }
  return {
    generators,
    owners,
    from: Int32Array.from(generators, (g) => g.from),
    to: Int32Array.from(generators, (g) => g.to),
    white: Float64Array.from(generators, (g) => g.white),
    flicker: Float64Array.from(generators, (g) => g.flicker),
    weighted: Uint8Array.from(generators, (g) => (g.weightAt === undefined ? 0 : 1)),
    direct: new Float64Array(generators.length),
    weight: new Float64Array(2),
  };
}

/** The rows an input source's unit excitation occupies: (from, to) as a generator's. */
function inputRows(op: OperatingPoint, input: string): [number, number] {
  const system = op.system;
  const record = system.deviceByName.get(input)?.record;
  if (record === undefined) throw unknownElement(input, 'the circuit has no element of that name', ['input']);
  if (record.kind === 'voltage-source') return [system.n, system.branchIndex.get(input)!];
  if (record.kind === 'current-source') {
    return [system.nodeIndex.get(record.from)!, system.nodeIndex.get(record.to)!];
  }
  throw unknownElement(input, 'noise is referred to an independent voltage or current source only', [
    'input',
  ]);
}

/** The index of the thermal generator of resistor `name`. */
function sourceResistorGenerator(table: GeneratorTable, op: OperatingPoint, name: string): number {
  const record = op.system.deviceByName.get(name)?.record;
  if (record === undefined)
    throw unknownElement(name, 'the circuit has no element of that name', ['sourceResistor']);
  if (record.kind !== 'resistor') {
    throw unknownElement(name, 'the noise figure is taken against a resistor', ['sourceResistor']);
  }
  const index = table.owners.indexOf(name);
  if (index < 0) {
    throw invalidValue(
      ['sourceResistor'],
      name,
      'a resistor with thermal noise (this one was built noiseless)',
    );
  }
  return index;
}

/**
 * The noise at an output: its density, every generator's contribution, and (optionally) the noise
 * referred to an input source and the noise figure against a source resistor.
 *
 * @param op - the operating point: every generator is evaluated there, at its temperature
 * @param options - `output`, `frequencies` (Hz, > 0), optional `input` and `sourceResistor`
 * @returns the immutable {@link Noise}
 * @throws QuiescentError `invalid-value` for a missing or non-positive frequency, an input the output
 *   does not see at some frequency, or a noiseless source resistor; `unknown-node` / `unknown-element`
 *   for an output, input or source resistor the circuit lacks; `singular` when the small-signal
 *   circuit has no unique solution at some frequency
 *
 * @example
 * ```ts no-run
 * const nz = noise(op, { output: 'out', frequencies: logSweep(10, 100e3, 10), input: 'mic' });
 * nz.integrated(20, 20e3); // RMS output noise over the audio band, in V
 * ```
 */
export function noise(op: OperatingPoint, options: NoiseOptions): Noise {
  requireInstance(op, OperatingPoint, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))');
  requireOptions(options, 'options', false);
  const frequencies = checkFrequencies(options.frequencies);
  for (let k = 0; k < frequencies.length; k++) {
    if (!(frequencies[k]! > 0))
      throw invalidValue(['frequencies', k], frequencies[k], 'a frequency above 0 Hz');
  }
  const system = op.system;
  const n = system.n;
  const count = frequencies.length;
  let lowest = Infinity;
  let highest = 0;
  for (const f of frequencies) {
    lowest = Math.min(lowest, f);
    highest = Math.max(highest, f);
  }
  const output = new OutputFunctional(system, op, options.output, [
    2 * Math.PI * lowest,
    2 * Math.PI * highest,
    2 * Math.PI * 1234.5,
  ]);
  const input = options.input === undefined ? undefined : inputRows(op, options.input);
  const workspace = new AcWorkspace(op);
  const table = collectGenerators(op);
  const source =
    options.sourceResistor === undefined ? -1 : sourceResistorGenerator(table, op, options.sourceResistor);

  const size = table.generators.length;
  // A generator inside the output element's own current reaches the output directly, besides its response.
  const outputElement =
    typeof options.output === 'object' && 'element' in options.output ? options.output.element : undefined;
  for (let g = 0; g < size; g++) {
    table.direct[g] = table.generators[g]!.ownCurrent === true && table.owners[g] === outputElement ? 1 : 0;
  }
  const power = new Float64Array(size * count); // frequency k, generator g: power[k·size + g]
  const total = new Float64Array(count);
  const gainSquared = new Float64Array(count);
  const zr = new Float64Array(n + 1);
  const zi = new Float64Array(n + 1);
  for (let k = 0; k < count; k++) {
    const f = frequencies[k]!;
    workspace.factorAt(f);
    zr.fill(0);
    zi.fill(0);
    output.addAt(2 * Math.PI * f, zr, zi);
    workspace.solveTranspose(zr, zi);
    total[k] = generatorPowers(table, zr, zi, f, power, k * size);
    if (input !== undefined) {
      const hr = zr[input[1]]! - zr[input[0]]!;
      const hi = zi[input[1]]! - zi[input[0]]!;
      gainSquared[k] = hr * hr + hi * hi;
    }
  }

  let inputDensity: Float64Array | undefined;
  if (input !== undefined) {
    inputDensity = new Float64Array(count);
    for (let k = 0; k < count; k++) {
      if (!(gainSquared[k]! > 0)) {
        throw invalidValue(
          ['input'],
          options.input,
          `a source whose signal reaches the output (it does not at ${frequencies[k]} Hz)`,
        );
      }
      inputDensity[k] = Math.sqrt(total[k]! / gainSquared[k]!);
    }
  }
  let noiseFigure: Float64Array | undefined;
  if (source >= 0) {
    noiseFigure = new Float64Array(count);
    for (let k = 0; k < count; k++) {
      noiseFigure[k] = 10 * Math.log10(total[k]! / power[k * size + source]!);
    }
  }
  const contributions = rankContributions(table, byGenerator(power, size, count), count);
  return new Noise(op, options, frequencies, total, contributions, inputDensity, noiseFigure);
}

/**
 * Every generator's output PSD at frequency f, from the adjoint solution (zr, zi), written to
 * power[offset + g]; returns their sum. The transfer of a generator from `from` into `to` is
 * z[to] − z[from] (times its weight, plus 1 when it is part of the output current itself).
 */
function generatorPowers(
  table: GeneratorTable,
  zr: Float64Array,
  zi: Float64Array,
  f: number,
  power: Float64Array,
  offset: number,
): number {
  const { from, to, white, flicker, direct, weighted, generators, weight } = table;
  const omega = 2 * Math.PI * f;
  let sum = 0;
  for (let g = 0; g < from.length; g++) {
    let tr = zr[to[g]!]! - zr[from[g]!]! + direct[g]!;
    let ti = zi[to[g]!]! - zi[from[g]!]!;
    if (weighted[g] === 1) {
      generators[g]!.weightAt!(omega, weight);
      const wr = weight[0]!;
      const wi = weight[1]!;
      const r = tr * wr - ti * wi;
      ti = tr * wi + ti * wr;
      tr = r;
    }
    const p = (tr * tr + ti * ti) * (white[g]! + flicker[g]! / f);
    power[offset + g] = p;
    sum += p;
  }
  return sum;
}

/** Block size of the transpose below: a tile of TILE × TILE doubles stays in the first-level cache. */
const TILE = 32;

/** The frequency-major PSDs as generator-major densities (√), transposed tile by tile. */
function byGenerator(power: Float64Array, size: number, count: number): Float64Array {
  const out = new Float64Array(size * count);
  for (let k0 = 0; k0 < count; k0 += TILE) {
    const k1 = Math.min(count, k0 + TILE);
    for (let g0 = 0; g0 < size; g0 += TILE) {
      const g1 = Math.min(size, g0 + TILE);
      for (let g = g0; g < g1; g++) {
        for (let k = k0; k < k1; k++) out[g * count + k] = Math.sqrt(power[k * size + g]!);
      }
    }
  }
  return out;
}

/**
 * One contribution per generator, its density a view of `densities`, the largest total power first
 * (device order on a tie).
 */
function rankContributions(
  table: GeneratorTable,
  densities: Float64Array,
  count: number,
): NoiseContribution[] {
  const entries = table.generators.map((g, index) => {
    const density = densities.subarray(index * count, (index + 1) * count);
    let sum = 0;
    for (let k = 0; k < count; k++) sum += density[k]! * density[k]!;
    const contribution: NoiseContribution = {
      element: table.owners[index]!,
      mechanism: g.mechanism,
      ...(g.terminal === undefined ? {} : { terminal: g.terminal }),
      density,
    };
    return { contribution, sum, index };
  });
  entries.sort((a, b) => b.sum - a.sum || a.index - b.index);
  return entries.map((e) => e.contribution);
}
