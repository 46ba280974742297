/** The AC excitation of an independent source. */

/** An AC excitation: peak magnitude and phase in degrees. */
export interface AcExcitation {
  /** Peak magnitude, in V for a voltage source or A for a current source. */
  readonly magnitude: number;
  /** Phase in degrees. */
  readonly phase: number;
}
