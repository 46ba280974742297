/** The op-amp's options: ideal without them, single-pole with them. */
import { invalidValue } from '../../errors/messages.js';
import type { Value } from '../../values/value.js';
import type { ParameterTable } from '../parameters.js';

/**
 * Options of an op-amp. It stays ideal (infinite gain, zero output resistance) unless one of
 * `openLoopGain`, `gainBandwidth`, `outputResistance`, `outputHigh` or `outputLow` is given; the DC
 * errors (`inputOffsetVoltage`, `inputBiasCurrent`, `inputOffsetCurrent`) apply to either model.
 */
export interface OpAmpOptions {
  /** DC open-loop gain A0, in V/V (default 1e5 for the finite-gain model). */
  openLoopGain?: Value;
  /** Gain-bandwidth product A0·f_p in Hz (default Infinity: no pole). */
  gainBandwidth?: Value;
  /** Output resistance in Ω, in series with the output (default 0). */
  outputResistance?: Value;
  /** Input voltage noise density e_n at high frequency, in V/√Hz (default 0); see docs/noise.md. */
  inputNoiseVoltage?: Value;
  /** Input current noise density i_n at high frequency, at each input, in A/√Hz (default 0). */
  inputNoiseCurrent?: Value;
  /** The 1/f corner of the voltage noise, in Hz: its PSD is e_n²·(1 + corner/f) (default 0). */
  voltageNoiseCorner?: Value;
  /** The 1/f corner of the current noise, in Hz: its PSD is i_n²·(1 + corner/f) (default 0). */
  currentNoiseCorner?: Value;
  /** A voltage source in series with the plus input, in V (default 0). */
  inputOffsetVoltage?: Value;
  /** The mean current flowing into each input terminal, in A (default 0). */
  inputBiasCurrent?: Value;
  /** The plus input's current minus the minus input's, in A (default 0). */
  inputOffsetCurrent?: Value;
  /** Upper limit of the output voltage behind `outputResistance`, to ground, in V (default Infinity). */
  outputHigh?: Value;
  /** Lower limit of the output voltage behind `outputResistance`, to ground, in V (default −Infinity). */
  outputLow?: Value;
}

/** Parameter table of the op-amp options. */
export const OP_AMP_PARAMETERS: ParameterTable<keyof OpAmpOptions> = {
  openLoopGain: { unit: 'none', defaultValue: 1e5, range: 'positive' },
  gainBandwidth: { unit: 'Hz', defaultValue: Number.POSITIVE_INFINITY, range: 'positive-or-infinite' },
  outputResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
  inputNoiseVoltage: { unit: 'V/√Hz', defaultValue: 0, range: 'non-negative' },
  inputNoiseCurrent: { unit: 'A/√Hz', defaultValue: 0, range: 'non-negative' },
  voltageNoiseCorner: { unit: 'Hz', defaultValue: 0, range: 'non-negative' },
  currentNoiseCorner: { unit: 'Hz', defaultValue: 0, range: 'non-negative' },
  inputOffsetVoltage: { unit: 'V', defaultValue: 0, range: 'any' },
  inputBiasCurrent: { unit: 'A', defaultValue: 0, range: 'any' },
  inputOffsetCurrent: { unit: 'A', defaultValue: 0, range: 'any' },
  outputHigh: { unit: 'V', defaultValue: Number.POSITIVE_INFINITY, range: 'any-or-infinite' },
  outputLow: { unit: 'V', defaultValue: Number.NEGATIVE_INFINITY, range: 'any-or-infinite' },
};

/** The options whose presence makes an op-amp the finite-gain model. */
export const FINITE_MODEL_OPTIONS = [
  'openLoopGain',
  'gainBandwidth',
  'outputResistance',
  'outputHigh',
  'outputLow',
] as const satisfies readonly (keyof OpAmpOptions)[];

/** Whether options given as numbers select the ideal model (none of {@link FINITE_MODEL_OPTIONS}). */
export function isIdealOpAmp(options: Partial<Record<keyof OpAmpOptions, number>> | undefined): boolean {
  return options === undefined || FINITE_MODEL_OPTIONS.every((key) => options[key] === undefined);
}

/** Check what one option cannot: the output limits must leave room between them (`invalid-value`). */
export function checkOpAmpOptions(
  options: Partial<Record<keyof OpAmpOptions, number>>,
  path: readonly (string | number)[],
): Partial<Record<keyof OpAmpOptions, number>> {
  const high = options.outputHigh ?? OP_AMP_PARAMETERS.outputHigh.defaultValue;
  const low = options.outputLow ?? OP_AMP_PARAMETERS.outputLow.defaultValue;
  if (!(high > low)) {
    throw invalidValue([...path, 'outputHigh'], high, `greater than outputLow (${low} V)`);
  }
  return options;
}
