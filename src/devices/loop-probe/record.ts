/** The element record of the loop probe: plain checked data. */

/** A loop probe: a 0 V element in series with a feedback loop, where the loop gain is measured. */
export interface LoopProbeRecord {
  /** Always `'loop-probe'`; narrows an {@link ElementRecord}. */
  readonly kind: 'loop-probe';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The node on the side that drives the loop (an amplifier's output); the current flows from here. */
  readonly from: string;
  /** The node on the side the loop feeds; the current flows into it. */
  readonly to: string;
}
