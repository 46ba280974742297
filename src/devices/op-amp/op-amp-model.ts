/** The op-amp's options: ideal without them, single-pole with them. */
import type { Value } from '../../values/value.js';
import type { ParameterTable } from '../parameters.js';

/**
 * Options of a non-ideal op-amp. With none of them the op-amp is ideal (infinite gain, no input
 * current, zero output resistance). Its inputs never draw current.
 */
export interface OpAmpOptions {
  /** DC open-loop gain A0, in V/V (default 1e5 when any option is given). */
  openLoopGain?: Value;
  /** Gain-bandwidth product A0·f_p in Hz (default Infinity: no pole). */
  gainBandwidth?: Value;
  /** Output resistance in Ω, in series with the output (default 0). */
  outputResistance?: Value;
}

/** Parameter table of the op-amp options. */
export const OP_AMP_PARAMETERS: ParameterTable<keyof OpAmpOptions> = {
  openLoopGain: { unit: 'none', defaultValue: 1e5, range: 'positive' },
  gainBandwidth: { unit: 'Hz', defaultValue: Number.POSITIVE_INFINITY, range: 'positive-or-infinite' },
  outputResistance: { unit: 'Ω', defaultValue: 0, range: 'non-negative' },
};
