/** The element record of the inductor: plain checked data, numbers in SI units. */

/** An inductor between nodes `a` and `b`. */
export interface InductorRecord {
  /** Always `'inductor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'inductor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Inductance in H (≥ 0). */
  readonly inductance: number;
}
