/** The element record of the resistor: plain checked data, numbers in SI units. */

/** A resistor between nodes `a` and `b`. */
export interface ResistorRecord {
  /** Always `'resistor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'resistor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Resistance in Ω (> 0). */
  readonly resistance: number;
  /** Present and true when the resistor was built without thermal noise (see docs/noise.md). */
  readonly noiseless?: true;
}
