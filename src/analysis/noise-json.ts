/**
 * The plain-data form of a noise analysis, for storage, other languages and snapshot tests. Typed
 * arrays become arrays; an infinite noise figure (a source resistor that does not reach the output)
 * becomes `null`, as `JSON.stringify` writes it.
 */

import type { NoiseMechanism } from '../devices/device.js';
import { requireShape } from '../errors/arguments.js';
import type { Probe } from './ac-analysis.js';
import type { Noise } from './noise.js';

/** One contribution as JSON. */
export interface NoiseContributionJson {
  /** The element the generator belongs to. */
  readonly element: string;
  /** Its physical origin. */
  readonly mechanism: NoiseMechanism;
  /** The terminal or input, where the element has several generators of one mechanism. */
  readonly terminal?: string;
  /** Output-referred density at each frequency, in V/√Hz (A/√Hz for a current output). */
  readonly density: readonly number[];
}

/** The input-referred density as JSON. */
export interface NoiseInputJson {
  /** The independent source the noise is referred to. */
  readonly source: string;
  /** Input-referred density at each frequency, in V/√Hz (A/√Hz for a current source). */
  readonly density: readonly number[];
}

/** The noise figure as JSON. */
export interface NoiseFigureJson {
  /** The resistor that stands for the signal source. */
  readonly sourceResistor: string;
  /** The noise figure at each frequency in dB; `null` where the source resistor does not reach the output. */
  readonly decibels: readonly (number | null)[];
}

/** A noise analysis as plain JSON. */
export interface NoiseJson {
  /** The output, as it was given: a node name, `{ node, reference }` or `{ element }`. */
  readonly output: Probe;
  /** The temperature of the operating point, in K. */
  readonly temperature: number;
  /** The analysed frequencies in Hz, in the order given. */
  readonly frequencies: readonly number[];
  /** Output density at each frequency. */
  readonly outputDensity: readonly number[];
  /** The input source and the input-referred density, when an input was named. */
  readonly input?: NoiseInputJson;
  /** The source resistor and the noise figure in dB, when one was named. */
  readonly noiseFigure?: NoiseFigureJson;
  /** Every generator's contribution, the largest first. */
  readonly contributions: readonly NoiseContributionJson[];
}

/** The plain-data form of a noise analysis; `JSON.stringify(nz)` writes it through `Noise.toJSON`. */
export function noiseToJson(nz: Noise): NoiseJson {
  requireShape(nz, 'nz', 'a Noise (the result of noise(op, options))', [
    'frequencies',
    'outputDensity',
    'contributions',
  ]);
  return {
    output: typeof nz.output === 'string' ? nz.output : { ...nz.output },
    temperature: nz.operatingPoint.temperature,
    frequencies: Array.from(nz.frequencies),
    outputDensity: Array.from(nz.outputDensity),
    ...(nz.input === undefined || nz.inputDensity === undefined
      ? {}
      : { input: { source: nz.input, density: Array.from(nz.inputDensity) } }),
    ...(nz.sourceResistor === undefined || nz.noiseFigure === undefined
      ? {}
      : {
          noiseFigure: {
            sourceResistor: nz.sourceResistor,
            decibels: Array.from(nz.noiseFigure, (v) => (Number.isFinite(v) ? v : null)),
          },
        }),
    contributions: nz.contributions.map((c) => ({
      element: c.element,
      mechanism: c.mechanism,
      ...(c.terminal === undefined ? {} : { terminal: c.terminal }),
      density: Array.from(c.density),
    })),
  };
}
