/** The element record of the mosfet: plain checked data, numbers in SI units. */
import type { GivenParameters } from '../parameters.js';
import type { MosfetModel } from './mosfet-model.js';

/** A MOSFET; `body` equals `source` unless given. */
export interface MosfetRecord {
  /** Always `'mosfet'`; narrows an {@link ElementRecord}. */
  readonly kind: 'mosfet';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The drain node. */
  readonly drain: string;
  /** The gate node. */
  readonly gate: string;
  /** The source node. */
  readonly source: string;
  /** The body (bulk) node. */
  readonly body: string;
  /** `'nmos'` or `'pmos'`. */
  readonly polarity: 'nmos' | 'pmos';
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<MosfetModel>;
}
