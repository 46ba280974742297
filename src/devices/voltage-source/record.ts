/** The element record of the voltage source: plain checked data, numbers in SI units. */
import type { AcExcitation } from '../excitation.js';

/** An independent voltage source. */
export interface VoltageSourceRecord {
  /** Always `'voltage-source'`; narrows an {@link ElementRecord}. */
  readonly kind: 'voltage-source';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive node; the source current flows from `plus` through the source to `minus`. */
  readonly plus: string;
  /** The negative node. */
  readonly minus: string;
  /** The DC value, in V. */
  readonly dc: number;
  /** The AC excitation (peak magnitude and phase in degrees); magnitude 0 for none. */
  readonly ac: AcExcitation;
}
