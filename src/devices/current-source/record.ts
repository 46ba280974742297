/** The element record of the current source: plain checked data, numbers in SI units. */
import type { AcExcitation } from '../excitation.js';

/** An independent current source; positive current flows from `from` through the source into `to`. */
export interface CurrentSourceRecord {
  /** Always `'current-source'`; narrows an {@link ElementRecord}. */
  readonly kind: 'current-source';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The node the source current is drawn from; it flows through the source into `to`. */
  readonly from: string;
  /** The node the source current enters. */
  readonly to: string;
  /** The DC value, in A, flowing from `from` into `to`. */
  readonly dc: number;
  /** The AC excitation (peak magnitude and phase in degrees); magnitude 0 for none. */
  readonly ac: AcExcitation;
}
