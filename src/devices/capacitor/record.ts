/** The element record of the capacitor: plain checked data, numbers in SI units. */

/** A capacitor between nodes `a` and `b`. */
export interface CapacitorRecord {
  /** Always `'capacitor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'capacitor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Capacitance in F (≥ 0). */
  readonly capacitance: number;
}
