/** The element record of the bjt: plain checked data, numbers in SI units. */
import type { GivenParameters } from '../parameters.js';
import type { BjtModel } from './bjt-model.js';

/** A bipolar junction transistor. */
export interface BjtRecord {
  /** Always `'bjt'`; narrows an {@link ElementRecord}. */
  readonly kind: 'bjt';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The collector node. */
  readonly collector: string;
  /** The base node. */
  readonly base: string;
  /** The emitter node. */
  readonly emitter: string;
  /** `'npn'` or `'pnp'`. */
  readonly polarity: 'npn' | 'pnp';
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<BjtModel>;
}
