/** The element record of the diode: plain checked data, numbers in SI units. */
import type { GivenParameters } from '../parameters.js';
import type { DiodeModel } from './diode-model.js';

/** A junction diode. */
export interface DiodeRecord {
  /** Always `'diode'`; narrows an {@link ElementRecord}. */
  readonly kind: 'diode';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The anode node. */
  readonly anode: string;
  /** The cathode node. */
  readonly cathode: string;
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<DiodeModel>;
}
