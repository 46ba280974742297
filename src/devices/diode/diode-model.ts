/** The diode's parameters: what a data sheet of a small silicon diode would list. */
import type { Value } from '../../values/value.js';
import type { ParameterTable } from '../parameters.js';

/**
 * Parameters of a junction diode (all optional; numbers in SI units or SI strings such as `'10f'`).
 * Current from anode to cathode at junction voltage v: `I_S·(exp(v/(n·Vt)) − 1)`, plus reverse
 * breakdown below −`breakdownVoltage`.
 */
export interface DiodeModel {
  /** I_S, the saturation current at `referenceTemperature`, in A (default 1e-14). */
  saturationCurrent?: Value;
  /** n, the emission coefficient or ideality factor (default 1). */
  emissionCoefficient?: Value;
  /** Ohmic series resistance in Ω (default 0: none). */
  seriesResistance?: Value;
  /** Depletion capacitance at zero bias, in F (default 0). */
  junctionCapacitance?: Value;
  /** Built-in junction potential of the depletion law, in V (default 0.7). */
  junctionPotential?: Value;
  /** Grading coefficient m of the depletion law, between 0 and 1 (default 0.5: abrupt junction). */
  gradingCoefficient?: Value;
  /** Transit time in s; the diffusion capacitance is transitTime·g_d (default 0). */
  transitTime?: Value;
  /** Reverse breakdown voltage, a positive number in V (default Infinity: no breakdown). */
  breakdownVoltage?: Value;
  /** Bandgap energy in eV for the temperature law of I_S (default 1.12, silicon). */
  bandgap?: Value;
  /** The temperature exponent p of I_S (default 3). */
  saturationCurrentTemperatureExponent?: Value;
  /** The temperature, in K, at which `saturationCurrent` is given (default 298.15, 25 °C). */
  referenceTemperature?: Value;
  /** Flicker noise coefficient K_f, in A^(2 − flickerExponent): the 1/f noise PSD is K_f·|i|^a_f/f (default 0: none). */
  flickerCoefficient?: Value;
  /** Flicker noise exponent a_f of the current in the 1/f noise PSD (default 1). */
  flickerExponent?: Value;
}

/** Parameter table of the diode: units, defaults and admissible ranges. */
export const DIODE_PARAMETERS: ParameterTable<keyof DiodeModel> = {
  saturationCurrent: { unit: 'A', defaultValue: 1e-14, range: 'positive', solutionFollows: 'logarithm' },
  emissionCoefficient: { unit: 'none', defaultValue: 1, range: 'positive' },
  seriesResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
  junctionCapacitance: { unit: 'F', defaultValue: 0, range: 'non-negative' },
  junctionPotential: { unit: 'V', defaultValue: 0.7, range: 'positive' },
  gradingCoefficient: { unit: 'none', defaultValue: 0.5, range: 'grading' },
  transitTime: { unit: 's', defaultValue: 0, range: 'non-negative' },
  breakdownVoltage: { unit: 'V', defaultValue: Number.POSITIVE_INFINITY, range: 'positive-or-infinite' },
  bandgap: { unit: 'eV', defaultValue: 1.12, range: 'positive' },
  saturationCurrentTemperatureExponent: { unit: 'none', defaultValue: 3, range: 'any' },
  referenceTemperature: { unit: 'K', defaultValue: 298.15, range: 'positive' },
  flickerCoefficient: { unit: 'none', defaultValue: 0, range: 'non-negative' },
  flickerExponent: { unit: 'none', defaultValue: 1, range: 'positive' },
};
