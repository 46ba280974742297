/** The bipolar transistor's parameters (transport Ebers-Moll model with the forward Early effect). */
import type { Value } from '../../values/value.js';
import type { ParameterTable } from '../parameters.js';

/** Parameters of a bipolar junction transistor. Only `polarity` is required. */
export interface BjtModel {
  /** `'npn'` or `'pnp'`. */
  polarity: 'npn' | 'pnp';
  /** I_S, the transport saturation current at `referenceTemperature`, in A (default 1e-15). */
  saturationCurrent?: Value;
  /** βF, the forward current gain (default 100). */
  forwardBeta?: Value;
  /** βR, the reverse current gain (default 1). */
  reverseBeta?: Value;
  /** n_F, emission coefficient of the base-emitter junction (default 1). */
  forwardEmissionCoefficient?: Value;
  /** n_R, emission coefficient of the base-collector junction (default 1). */
  reverseEmissionCoefficient?: Value;
  /** V_A, the forward Early voltage in V (default Infinity: no output conductance). */
  earlyVoltage?: Value;
  /** Base-emitter depletion capacitance at zero bias, in F (default 0). */
  baseEmitterCapacitance?: Value;
  /** Base-collector depletion capacitance at zero bias, in F (default 0). */
  baseCollectorCapacitance?: Value;
  /** Forward transit time in s; adds the diffusion capacitance forwardTransitTime·g_m to C_π (default 0). */
  forwardTransitTime?: Value;
  /** Built-in potential of the base-emitter depletion law, in V (default 0.75). */
  baseEmitterPotential?: Value;
  /** Built-in potential of the base-collector depletion law, in V (default 0.75). */
  baseCollectorPotential?: Value;
  /** Grading coefficient of the base-emitter depletion law (default 0.33: graded junction). */
  baseEmitterGrading?: Value;
  /** Grading coefficient of the base-collector depletion law (default 0.33: graded junction). */
  baseCollectorGrading?: Value;
  /** Bandgap energy in eV for the temperature law of I_S (default 1.12). */
  bandgap?: Value;
  /** The temperature exponent p of I_S (default 3). */
  saturationCurrentTemperatureExponent?: Value;
  /** The temperature, in K, at which `saturationCurrent` is given (default 298.15, 25 °C). */
  referenceTemperature?: Value;
  /** Flicker noise coefficient K_f, in A^(2 − flickerExponent): the 1/f noise PSD is K_f·|i|^a_f/f (default 0: none). */
  flickerCoefficient?: Value;
  /** Flicker noise exponent a_f of the current in the 1/f noise PSD (default 1). */
  flickerExponent?: Value;
  /** Ohmic resistance in series with the base, in Ω, through an internal node (default 0: none). */
  baseResistance?: Value;
  /** Ohmic resistance in series with the collector, in Ω, through an internal node (default 0: none). */
  collectorResistance?: Value;
  /** Ohmic resistance in series with the emitter, in Ω, through an internal node (default 0: none). */
  emitterResistance?: Value;
  /**
   * The forward knee current of high injection, in A (default Infinity: none): the transport current
   * is divided by q_h = ½·(1 + √(1 + 4·I_S·(e_f − 1)/kneeCurrent)), so β falls at high current.
   */
  kneeCurrent?: Value;
  /** The temperature exponent of βF and βR: β(T) = β·(T/Tref)^exponent (default 0). */
  betaTemperatureExponent?: Value;
}

/** Parameter table of the bipolar transistor (polarity excluded). */
export const BJT_PARAMETERS: ParameterTable<Exclude<keyof BjtModel, 'polarity'>> = {
  saturationCurrent: { unit: 'A', defaultValue: 1e-15, range: 'positive', solutionFollows: 'logarithm' },
  forwardBeta: { unit: 'none', defaultValue: 100, range: 'positive', solutionFollows: 'reciprocal' },
  reverseBeta: { unit: 'none', defaultValue: 1, range: 'positive', solutionFollows: 'reciprocal' },
  forwardEmissionCoefficient: { unit: 'none', defaultValue: 1, range: 'positive' },
  reverseEmissionCoefficient: { unit: 'none', defaultValue: 1, range: 'positive' },
  earlyVoltage: {
    unit: 'V',
    defaultValue: Number.POSITIVE_INFINITY,
    range: 'positive-or-infinite',
    solutionFollows: 'reciprocal',
  },
  baseEmitterCapacitance: { unit: 'F', defaultValue: 0, range: 'non-negative' },
  baseCollectorCapacitance: { unit: 'F', defaultValue: 0, range: 'non-negative' },
  forwardTransitTime: { unit: 's', defaultValue: 0, range: 'non-negative' },
  baseEmitterPotential: { unit: 'V', defaultValue: 0.75, range: 'positive' },
  baseCollectorPotential: { unit: 'V', defaultValue: 0.75, range: 'positive' },
  baseEmitterGrading: { unit: 'none', defaultValue: 0.33, range: 'grading' },
  baseCollectorGrading: { unit: 'none', defaultValue: 0.33, range: 'grading' },
  bandgap: { unit: 'eV', defaultValue: 1.12, range: 'positive' },
  saturationCurrentTemperatureExponent: { unit: 'none', defaultValue: 3, range: 'any' },
  referenceTemperature: { unit: 'K', defaultValue: 298.15, range: 'positive' },
  flickerCoefficient: { unit: 'none', defaultValue: 0, range: 'non-negative' },
  flickerExponent: { unit: 'none', defaultValue: 1, range: 'positive' },
  baseResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
  collectorResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
  emitterResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
  kneeCurrent: { unit: 'A', defaultValue: Number.POSITIVE_INFINITY, range: 'positive-or-infinite' },
  betaTemperatureExponent: { unit: 'none', defaultValue: 0, range: 'any' },
};
