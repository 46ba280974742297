/** The element record of the op amp: plain checked data, numbers in SI units. */
import type { GivenParameters } from '../parameters.js';
import type { OpAmpOptions } from './op-amp-model.js';

/** An op-amp; `options` is undefined for an ideal one. */
export interface OpAmpRecord {
  /** Always `'op-amp'`; narrows an {@link ElementRecord}. */
  readonly kind: 'op-amp';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The non-inverting input node. */
  readonly plus: string;
  /** The inverting input node. */
  readonly minus: string;
  /** The output node. */
  readonly output: string;
  /** The options as given (numbers in SI units), or undefined for an ideal op-amp. */
  readonly options: GivenParameters<OpAmpOptions> | undefined;
}
