/**
 * The device interface. Every element kind implements it, so that adding a device never touches the
 * analyses. A device never sees the matrix layout: it asks the binding context for integer slots once,
 * then adds its conductances and currents at those slots on every load.
 *
 * Indices: unknowns 0 … n−1; the index n is the ground "trash" row of the right-hand side and of the
 * solution (x[n] is always 0), and slot nnz is the trash entry of the matrix values. Devices index
 * with them freely, which keeps every load free of branches on ground.
 */
import type { ElementRecord } from './records.js';

/** Numbering of unknowns, used while a circuit is compiled. */
export interface AllocationContext {
  /** Index of a circuit node; ground gives the trash index n. */
  node(name: string): number;
  /** A new internal node, named `owner#label` in messages. */
  internalNode(owner: string, label: string): number;
  /** A new branch-current unknown owned by `owner`. */
  branch(owner: string): number;
}

/** Lookups and matrix slots, after every unknown is numbered. */
export interface BindContext {
  /** Index of a circuit node; ground gives the trash index n. */
  node(name: string): number;
  /** The branch-current unknown of element `name` (its first branch). */
  branchOf(name: string): number;
  /** Matrix slots for the (row, column) pairs given flat as [r0, c0, r1, c1, …]; ground pairs go to the trash slot. */
  slots(pairs: readonly number[]): Int32Array;
}

/** What a DC load reads and writes. */
export interface DcLoadContext {
  /** The present Newton iterate, length n+1 with x[n] = 0. */
  readonly x: Float64Array;
  /** Matrix values, length nnz+1. */
  readonly A: Float64Array;
  /** Right-hand side, length n+1. */
  readonly b: Float64Array;
  /** Factor applied to every independent source (source ramping); 1 normally. */
  readonly sourceScale: number;
  /** Set by a device that limited a junction step: the load was not taken at x itself. */
  limited: boolean;
  /** Whether this is the first load of a Newton run (devices seed their limiter memory from x). */
  readonly first: boolean;
}

/** What a small-signal (AC) load reads and writes. */
export interface AcLoadContext {
  /** The DC operating point, length n+1 with x[n] = 0. */
  readonly x: Float64Array;
  /** Angular frequency ω = 2πf in rad/s. */
  readonly omega: number;
  /** Real and imaginary parts of the matrix values, length nnz+1 each. */
  readonly Ar: Float64Array;
  readonly Ai: Float64Array;
  /** Real and imaginary parts of the right-hand side, length n+1 each. */
  readonly br: Float64Array;
  readonly bi: Float64Array;
  /** The conditions of the operating point x. */
  readonly conditions: Conditions;
}

/**
 * The bias point small-signal readings are linearized at: the DC solution x and the conditions it was
 * solved at (an operating point is one).
 */
export interface BiasPoint {
  readonly x: Float64Array;
  readonly conditions: Conditions;
}

/** The conditions an analysis runs at, handed to every device before it loads. */
export interface Conditions {
  /** Temperature in kelvin. */
  readonly temperature: number;
  /** k·T/q in volts. */
  readonly thermalVoltage: number;
  /** The small conductance across every junction (and MOSFET channel), in S. */
  readonly junctionConductance: number;
  /**
   * DC values of independent sources that replace the values in their records, by element name (a
   * sweep sets them, so that each point of a sweep keeps its own value); other sources keep theirs.
   */
  readonly sourceValues?: ReadonlyMap<string, number>;
}

/** The operating report of a nonlinear device (see the public `DiodeReport`, `BjtReport`, `MosfetReport`). */
export type DeviceReport = Readonly<Record<string, number | string>>;

/** A junction (or channel) whose signal the linearity report measures. */
export interface JunctionProbe {
  /** `'pn'`, `'base-emitter'`, `'base-collector'` or `'channel'`. */
  readonly junction: 'pn' | 'base-emitter' | 'base-collector' | 'channel';
  /** Unknowns whose voltage difference is the junction (or gate-source) voltage. */
  readonly plus: number;
  readonly minus: number;
  /** The voltage that normalizes the amplitude: n·Vt for a junction, the overdrive for a channel. */
  readonly scale: number;
  /**
   * For a channel whose law is neither exponential nor square (the charge-based MOSFET): the current's
   * Taylor coefficients in the probe voltage at the bias, i = g1·v + g2·v²/2 + g3·v³/6, normalized as
   * `second` = g2·scale/g1 and `third` = g3·scale²/g1. The square law is second = 1, third = 0.
   */
  readonly taylor?: { readonly second: number; readonly third: number };
}

/**
 * One nonlinear current of a device, expanded about the operating point to third order: the exact
 * second and third partial derivatives of the current with respect to its controlling voltages.
 * The method of nonlinear currents (the distortion estimate) injects these terms into the linearized
 * circuit; the first derivatives are already in the small-signal stamp.
 */
export interface NonlinearCurrent {
  /** The junction (or channel) this current belongs to, for attributing shares of the distortion. */
  readonly junction: JunctionProbe['junction'];
  /** The current flows from unknown `from`, through the device, into unknown `to`. */
  readonly from: number;
  readonly to: number;
  /** The controlling voltages, each v(plus) − v(minus) of two unknowns. */
  readonly controls: readonly { readonly plus: number; readonly minus: number }[];
  /** ∂²i/∂v_a∂v_b for m controls, m×m row-major (symmetric), in A/V². */
  readonly second: readonly number[];
  /** ∂³i/∂v_a∂v_b∂v_c, m×m×m row-major (symmetric), in A/V³. */
  readonly third: readonly number[];
}

/** The physical origin of a noise generator (see docs/noise.md, "Generators"). */
export type NoiseMechanism = 'thermal' | 'shot' | 'flicker' | 'input-voltage' | 'input-current';

/**
 * One noise generator of a device at the operating point: an excitation of the small-signal equations
 * whose one-sided power spectral density is `white + flicker/f`. For a current generator the
 * excitation is a current that flows out of unknown `from` and into unknown `to` (A²/Hz); a
 * generator that acts in a branch equation (a voltage, V²/Hz) puts its weight on `to` alone, with
 * `from` at the ground index n. Generators are uncorrelated with each other.
 */
export interface NoiseGenerator {
  readonly mechanism: NoiseMechanism;
  /** Which terminal or part the generator belongs to, where a device has several of one mechanism. */
  readonly terminal?: string;
  readonly from: number;
  readonly to: number;
  /** The frequency-independent part of the PSD. */
  readonly white: number;
  /** The 1/f part of the PSD times f (the PSD is `white + flicker/f`). */
  readonly flicker: number;
  /**
   * Whether the generator is part of the device's own current as `acCurrent` reads it (a resistor's
   * thermal noise, a junction's shot noise): an output read as that current then carries it directly.
   */
  readonly ownCurrent?: boolean;
  /**
   * A complex factor on the excitation at angular frequency ω, written to out[0] (real) and out[1]
   * (imaginary); absent means 1. An op-amp's input voltage noise enters its gain equation through it.
   */
  weightAt?(omega: number, out: Float64Array): void;
}

/** One element of a compiled circuit. */
export interface Device {
  readonly name: string;
  readonly record: ElementRecord;
  /** Number internal nodes (first pass). */
  allocateNodes?(ctx: AllocationContext): void;
  /** Number branch currents (second pass, after all nodes). */
  allocateBranches?(ctx: AllocationContext): void;
  /** Take matrix slots and resolve references. */
  bind(ctx: BindContext): void;
  /**
   * Take the values of `record` (this element with other parameter values, as a value change on a
   * prepared circuit makes it) in place, keeping the unknowns and matrix slots bound at compile time,
   * and forget every constant derived from the old values. Returns false, changing nothing, when the
   * new values would need other unknowns or slots (a terminal resistance appearing, say): the caller
   * then binds a new device. Absent: every value change binds a new device.
   */
  revalue?(record: ElementRecord): boolean;
  /**
   * Set the quantities that depend on the analysis conditions (temperature, junction conductance),
   * returning at once when they are those already set. The Newton loop calls it before loading;
   * every reading below takes the conditions of the solution it reads and brings the device to them
   * first, so no reader has to remember to prepare the device (another analysis, at another
   * temperature, may have prepared it since).
   */
  prepare?(conditions: Conditions): void;
  /** Add the Newton companion at ctx.x. */
  load(ctx: DcLoadContext): void;
  /** Add the small-signal admittances at the operating point ctx.x, and AC excitations. */
  loadAc(ctx: AcLoadContext): void;
  /**
   * For a device whose `loadAc` is not of the form G + jωC (G, C independent of ω): add its
   * small-signal equations as G + s·C instead, its rows multiplied by a polynomial in s where that
   * clears a denominator (an op-amp's pole). The natural frequencies are found from these matrices.
   */
  loadPencil?(G: Float64Array, C: Float64Array, x: Float64Array, conditions: Conditions): void;
  /** The DC current of a two-terminal element or controlled-source output, by the sign conventions. */
  current?(x: Float64Array, conditions: Conditions): number;
  /**
   * The AC current phasor at ω from solution (xr, xi) of the circuit linearized `at`, written to
   * out[0] (real) and out[1] (imaginary).
   */
  acCurrent?(xr: Float64Array, xi: Float64Array, omega: number, at: BiasPoint, out: Float64Array): void;
  /** Operating values and small-signal parameters at x. */
  report?(x: Float64Array, conditions: Conditions): DeviceReport;
  /** Junctions and channels to check for linearity at x. */
  junctions?(x: Float64Array, conditions: Conditions): readonly JunctionProbe[];
  /** The second- and third-order terms of the device's nonlinear currents at x (after `prepare`). */
  nonlinearCurrents?(x: Float64Array, conditions: Conditions): readonly NonlinearCurrent[];
  /** The device's noise generators at the operating point x (after `prepare`); none when absent. */
  noiseGenerators?(x: Float64Array, conditions: Conditions): readonly NoiseGenerator[];
  /**
   * Whether the device's load depends on x (so the circuit needs Newton iterations). The load of a
   * linear device must not read x, and what it adds to b must be proportional to `sourceScale`: the
   * Newton loop loads it once per set of conditions and reuses the result.
   */
  readonly nonlinear: boolean;
}
