/** The MOSFET's parameters (square law of Shichman and Hodges with channel-length modulation and body effect). */
import type { Value } from '../../values/value.js';
import { DIODE_PARAMETERS } from '../diode/diode-model.js';
import type { ParameterTable } from '../parameters.js';

/** Parameters of a MOSFET. Only `polarity` is required. */
export interface MosfetModel {
  /** `'nmos'` or `'pmos'`. */
  polarity: 'nmos' | 'pmos';
  /** Vth0, the zero-bias threshold voltage with its sign, in V (default 0.7 for nmos, −0.7 for pmos). */
  thresholdVoltage?: Value;
  /** β = μ·Cox·W/L, in A/V² (default 1e-3). */
  gainFactor?: Value;
  /** λ, channel-length modulation, in 1/V (default 0). */
  channelLengthModulation?: Value;
  /** γ, the body-effect coefficient, in V^½ (default 0). */
  bodyEffect?: Value;
  /** φ, the surface potential of the body-effect law, in V (default 0.7). */
  surfacePotential?: Value;
  /** Gate-source capacitance in F (default 0). */
  gateSourceCapacitance?: Value;
  /** Gate-drain capacitance in F (default 0). */
  gateDrainCapacitance?: Value;
  /** Flicker noise coefficient K_f, in A^(2 − flickerExponent): the 1/f noise PSD is K_f·|i|^a_f/f (default 0: none). */
  flickerCoefficient?: Value;
  /** Flicker noise exponent a_f of the current in the 1/f noise PSD (default 1). */
  flickerExponent?: Value;
  /**
   * n, the slope factor (greater than 1). When given, the channel follows the charge-based model from
   * weak through strong inversion instead of the square law (default: not given).
   */
  slopeFactor?: Value;
  /** dVth0/dT in V/K on the signed threshold: Vth0(T) = Vth0 + coefficient·(T − Tref) (default 0). */
  thresholdTemperatureCoefficient?: Value;
  /** The mobility's temperature exponent: β(T) = β·(T/Tref)^(−exponent), typically 1.5 (default 0). */
  mobilityTemperatureExponent?: Value;
  /** The temperature, in K, at which the threshold and gain factor are given (default as the diode's). */
  referenceTemperature?: Value;
}

/** Parameter table of the MOSFET (polarity excluded; the threshold default depends on polarity). */
export const MOSFET_PARAMETERS: ParameterTable<Exclude<keyof MosfetModel, 'polarity'>> = {
  thresholdVoltage: { unit: 'V', defaultValue: Number.NaN, range: 'any' },
  gainFactor: { unit: 'A/V²', defaultValue: 1e-3, range: 'positive' },
  channelLengthModulation: { unit: '1/V', defaultValue: 0, range: 'non-negative' },
  bodyEffect: { unit: 'V^½', defaultValue: 0, range: 'non-negative' },
  surfacePotential: { unit: 'V', defaultValue: 0.7, range: 'positive' },
  gateSourceCapacitance: { unit: 'F', defaultValue: 0, range: 'non-negative' },
  gateDrainCapacitance: { unit: 'F', defaultValue: 0, range: 'non-negative' },
  flickerCoefficient: { unit: 'none', defaultValue: 0, range: 'non-negative' },
  flickerExponent: { unit: 'none', defaultValue: 1, range: 'positive' },
  // NaN: not given, the square law applies.
  slopeFactor: { unit: 'none', defaultValue: Number.NaN, range: 'above-one' },
  thresholdTemperatureCoefficient: { unit: 'V/K', defaultValue: 0, range: 'any' },
  mobilityTemperatureExponent: { unit: 'none', defaultValue: 0, range: 'any' },
  referenceTemperature: DIODE_PARAMETERS.referenceTemperature,
};

/** The default threshold voltage of each polarity, in V. */
export function defaultThreshold(polarity: 'nmos' | 'pmos'): number {
  return polarity === 'nmos' ? 0.7 : -0.7;
}
