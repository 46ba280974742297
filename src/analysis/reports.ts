/**
 * The shapes of `OperatingPoint.device()`: a diode's, a bipolar transistor's and a MOSFET's operating
 * values and small-signal parameters at the solution.
 */

/** A bipolar transistor's operating region, by the bias of its two junctions. */
export type BjtRegion = 'cutoff' | 'forward-active' | 'reverse-active' | 'saturation';

/** A MOSFET's operating region. */
export type MosfetRegion = 'cutoff' | 'triode' | 'saturation';

/** A diode at its operating point. Voltages in V, currents in A, conductance in S, capacitance in F. */
export interface DiodeReport {
  /** Always `'diode'`; narrows a {@link DeviceReport}. */
  readonly kind: 'diode';
  /** Anode minus cathode, at the terminals (series resistance included). */
  readonly voltage: number;
  /** The voltage across the junction itself (series resistance excluded). */
  readonly junctionVoltage: number;
  /** Anode to cathode. */
  readonly current: number;
  /** ∂i/∂v of the junction, its small parallel conductance included. */
  readonly conductance: number;
  /** The dynamic resistance r_d = 1/conductance, in Ω (series resistance not included). */
  readonly resistance: number;
  /** Depletion plus diffusion capacitance at the operating point. */
  readonly capacitance: number;
}

/**
 * A bipolar transistor at its operating point. Voltages are the signed terminal differences their names
 * say; currents flow into the terminal for npn and out of it for pnp. Small-signal parameters are
 * derivatives with respect to the mirrored voltages, so they are non-negative in normal operation.
 */
export interface BjtReport {
  /** Always `'bjt'`; narrows a {@link DeviceReport}. */
  readonly kind: 'bjt';
  /** v(base) − v(emitter), in V (negative for a pnp in forward-active operation). */
  readonly vbe: number;
  /** v(base) − v(collector), in V. */
  readonly vbc: number;
  /** v(collector) − v(emitter), in V. */
  readonly vce: number;
  /** Collector current in A: into the collector for npn, out of it for pnp. */
  readonly ic: number;
  /** Base current in A: into the base for npn, out of it for pnp. */
  readonly ib: number;
  /** ic + ib. */
  readonly ie: number;
  /** Transconductance ∂ic/∂vbe at constant vce, in S. */
  readonly gm: number;
  /** 1/(∂ib/∂vbe) at constant vce, in Ω. */
  readonly rpi: number;
  /**
   * 1/(∂ic/∂vce) at constant vbe, in Ω: about (V_A + vce)/ic with the Early effect in forward-active
   * operation; without it only the reverse-biased junction slopes the output, so `ro` is astronomically
   * large (of order 1e40 Ω or more), though finite.
   */
  readonly ro: number;
  /** Base-emitter capacitance (depletion plus diffusion), in F. */
  readonly cpi: number;
  /** Base-collector capacitance, in F. */
  readonly cmu: number;
  /** The operating region, by the bias of the two junctions (see {@link BjtRegion}). */
  readonly region: BjtRegion;
  /** v(base) − v(emitter) at the internal junction, behind the terminal resistances, in V. */
  readonly internalVbe: number;
  /** v(base) − v(collector) at the internal junction, behind the terminal resistances, in V. */
  readonly internalVbc: number;
}

/**
 * A MOSFET at its operating point. Voltages are signed terminal differences; `id` flows into the drain
 * for nmos and out of it for pmos. Derivatives are with respect to the mirrored voltages.
 */
export interface MosfetReport {
  /** Always `'mosfet'`; narrows a {@link DeviceReport}. */
  readonly kind: 'mosfet';
  /** v(gate) − v(source), in V. */
  readonly vgs: number;
  /** v(drain) − v(source), in V. */
  readonly vds: number;
  /** v(body) − v(source), in V. */
  readonly vbs: number;
  /** Drain current in A: into the drain for nmos, out of it for pmos. */
  readonly id: number;
  /** ∂id/∂vgs, in S. */
  readonly gm: number;
  /** ∂id/∂vds, in S. */
  readonly gds: number;
  /** ∂id/∂vbs, in S. */
  readonly gmb: number;
  /** Gate-source capacitance, in F. */
  readonly cgs: number;
  /** Gate-drain capacitance, in F. */
  readonly cgd: number;
  /** The operating region (see {@link MosfetRegion}). */
  readonly region: MosfetRegion;
  /** The threshold voltage at the present body bias, with its sign (negative for an enhancement pmos). */
  readonly thresholdVoltage: number;
  /**
   * |vgs − Vth| in the conducting regions, 0 in cutoff, in V; for the charge-based model vgs − Vth0
   * in the mirrored frame, negative in weak inversion.
   */
  readonly overdrive: number;
  /** Charge-based model only: `'weak'` when if < 0.1, `'strong'` when if > 10, else `'moderate'`. */
  readonly inversion?: InversionLevel;
  /** Charge-based model only: the forward inversion coefficient if (the inversion coefficient of the g_m/I_D method). */
  readonly inversionCoefficient?: number;
  /** Charge-based model only: g_m/I_D, in 1/V; tends to 1/(n·Vt) in weak inversion. */
  readonly gmOverId?: number;
  /** Charge-based model only: the slope factor n. */
  readonly slopeFactor?: number;
}

/** A charge-based MOSFET channel's inversion level, by its forward inversion coefficient. */
export type InversionLevel = 'weak' | 'moderate' | 'strong';

/** Where an op-amp's output sits: in its linear range, or held near a limit. */
export type OpAmpRegion = 'linear' | 'limited-high' | 'limited-low';

/** An op-amp at its operating point. Voltages in V. */
export interface OpAmpReport {
  /** Always `'op-amp'`; narrows a {@link DeviceReport}. */
  readonly kind: 'op-amp';
  /** v(plus) − v(minus) at the terminals (the offset voltage not included). */
  readonly differentialInput: number;
  /** The output terminal's voltage to ground, after the output resistance. */
  readonly outputVoltage: number;
  /**
   * `'linear'` (always, for the ideal model), or `'limited-high'` / `'limited-low'` when the output
   * limiter's slope at the solution is below one half.
   */
  readonly region: OpAmpRegion;
}

/** Any device report; narrow it by `kind`. */
export type DeviceReport = DiodeReport | BjtReport | MosfetReport | OpAmpReport;
