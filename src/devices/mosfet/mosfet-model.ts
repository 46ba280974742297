/** The MOSFET's parameters (square law of Shichman and Hodges with channel-length modulation and body effect). */
import type { Value } from '../../values/value.js';
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
};

/** The default threshold voltage of each polarity, in V. */
export function defaultThreshold(polarity: 'nmos' | 'pmos'): number {
  return polarity === 'nmos' ? 0.7 : -0.7;
}
