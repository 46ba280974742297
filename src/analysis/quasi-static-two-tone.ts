/**
 * The large-signal check of the two-tone intermodulation estimate: the full nonlinear circuit (its
 * reactive elements held at the operating point, or the DC circuit) solved on a P × P grid of phase
 * pairs (θ1, θ2), every AC source set to dc + s·A·(cos(θ1 + φ) + cos(θ2 + φ)). Where the circuit is
 * quasi-static at both tones, the output is a function y(θ1, θ2), periodic in each phase, and the
 * product of frequency p·f1 + q·f2 is its two-dimensional Fourier coefficient
 *   Y_pq = (2/P²)·Σ_kl y_kl·e^{−j(p·θ1_k + q·θ2_l)}.
 * The grid is walked row by row, alternating direction, so each solve starts Newton next to the last
 * one; the cost grows linearly with the number of phase pairs.
 */
import type { Circuit } from '../circuit/circuit.js';
import { invalidValue, noSignal } from '../errors/messages.js';
import { checkDriveScale } from './distortion.js';
import type { IntermodulationProduct } from './intermodulation.js';
import { checkPhases, prepareDriver, type QuasiStaticOptions } from './quasi-static.js';
import { settleHeld } from './settle-reactive.js';

/** Default phases per tone (a grid of 16 × 16 phase pairs). */
export const DEFAULT_TONE_PHASES = 16;

/** Relative size below which a fundamental is taken for the solver's rounding, not a signal. */
const NO_SIGNAL_LEVEL = 1e-9;

/** Options of {@link quasiStaticIntermodulation}: those of the one-tone check, `phases` per tone. */
export type QuasiStaticIntermodulationOptions = QuasiStaticOptions;

/** One product of the large-signal two-tone check. */
export type QuasiStaticProduct = Omit<IntermodulationProduct, 'frequency'>;

/** The intermodulation products of an output, large-signal and quasi-static. */
export interface QuasiStaticIntermodulation {
  /** The output's description. */
  readonly outputName: string;
  /** Phases per tone (the grid has phases² pairs). */
  readonly phases: number;
  /** The factor applied to every AC source's amplitude. */
  readonly scale: number;
  /** The output's peak amplitudes at f1 and at f2. */
  readonly fundamental: readonly [number, number];
  /** f2 − f1 and f1 + f2 (order 2), then 2f1 − f2 and 2f2 − f1 (order 3), as the estimate lists them. */
  readonly products: readonly QuasiStaticProduct[];
  /** The ratio of the f2 − f1 product. */
  readonly secondOrder: number;
  /** The larger ratio of the two order-3 products. */
  readonly thirdOrder: number;
}

/** The (p, q) of each product: its frequency is p·f1 + q·f2. */
const MIXES: readonly { mix: IntermodulationProduct['mix']; order: 2 | 3; p: number; q: number }[] = [
  { mix: 'f2 - f1', order: 2, p: -1, q: 1 },
  { mix: 'f1 + f2', order: 2, p: 1, q: 1 },
  { mix: '2f1 - f2', order: 3, p: 2, q: -1 },
  { mix: '2f2 - f1', order: 3, p: -1, q: 2 },
];

/**
 * Drive the full nonlinear circuit with two tones quasi-statically, over a grid of phase pairs, and
 * take the intermodulation products of an output by a two-dimensional DFT.
 *
 * @param circuit - the circuit; its sources' AC values set each tone's drive
 * @param options - `output`, `phases` per tone (an integer ≥ 8, default 16), `scale`, `reactive`
 *   (default `'hold'`) and operating-point options
 * @returns the fundamentals and products of the output
 * @throws QuiescentError as {@link quasiStaticHarmonics}
 *
 * @example
 * ```ts
 * const check = quasiStaticIntermodulation(circuit, { output: 'out', phases: 16 });
 * check.thirdOrder; // the larger order-3 product over the fundamental, large-signal
 * ```
 */
export function quasiStaticIntermodulation(
  circuit: Circuit,
  options: QuasiStaticIntermodulationOptions,
): QuasiStaticIntermodulation {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to analyse');
  }
  const phases = checkPhases(options.phases ?? DEFAULT_TONE_PHASES, 8);
  const scale = checkDriveScale(options.scale ?? 1);
  const driver = prepareDriver(circuit, options);
  const { drives } = driver;
  const offsets = new Float64Array(drives.length);
  const samples = new Float64Array(phases * phases);
  const grid = (): void => {
    for (let k = 0; k < phases; k++) {
      const theta1 = (2 * Math.PI * k) / phases;
      for (let step = 0; step < phases; step++) {
        const l = k % 2 === 0 ? step : phases - 1 - step;
        const theta2 = (2 * Math.PI * l) / phases;
        for (let d = 0; d < drives.length; d++) {
          const { amplitude, phase } = drives[d]!;
          offsets[d] = scale * amplitude * (Math.cos(theta1 + phase) + Math.cos(theta2 + phase));
        }
        samples[k * phases + l] = driver.solve(offsets);
      }
    }
  };
  if (driver.reactive === 'settle') settleHeld(driver, grid, phases * phases);
  grid();
  let largest = Math.abs(driver.quiescent);
  for (const y of samples) largest = Math.max(largest, Math.abs(y));
  const coefficient = (p: number, q: number): number => {
    let re = 0;
    let im = 0;
    for (let k = 0; k < phases; k++) {
      for (let l = 0; l < phases; l++) {
        const angle = (2 * Math.PI * ((((p * k + q * l) % phases) + phases) % phases)) / phases;
        const y = samples[k * phases + l]!;
        re += y * Math.cos(angle);
        im -= y * Math.sin(angle);
      }
    }
    return (2 * Math.hypot(re, im)) / (phases * phases);
  };
  const first = coefficient(1, 0);
  const second = coefficient(0, 1);
  if (!(first > NO_SIGNAL_LEVEL * largest + driver.tolerance)) {
    throw noSignal(driver.outputName, [], "its fundamental is within the solver's rounding of zero");
  }
  const products = MIXES.map(({ mix, order, p, q }) => {
    const amplitude = coefficient(p, q);
    return { mix, order, amplitude, ratio: amplitude / first };
  });
  return {
    outputName: driver.outputName,
    phases,
    scale,
    fundamental: [first, second],
    products,
    secondOrder: products[0]!.ratio,
    thirdOrder: Math.max(products[2]!.ratio, products[3]!.ratio),
  };
}
