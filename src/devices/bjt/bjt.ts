/**
 * The bipolar transistor: the transport form of the Ebers-Moll model with the forward Early effect
 * (Ebers & Moll, Proc. IRE 42, 1954; Getreu, Modeling the Bipolar Transistor, 1976). For npn, with
 * e_f = exp(vbe/(n_F·Vt)) and e_r = exp(vbc/(n_R·Vt)):
 *   iT = I_S·(e_f − e_r)·(1 + vce/V_A)
 *   ic = iT − (I_S/βR)·(e_r − 1)
 *   ib = (I_S/βF)·(e_f − 1) + (I_S/βR)·(e_r − 1)
 * A pnp obeys the same equations in the mirrored voltages (veb, vcb), its currents flowing out of the
 * terminals. A small conductance sits across each junction.
 *
 * High injection divides iT by q_h = ½·(1 + √(1 + 4·I_S·(e_f − 1)/I_K)), the forward part of the
 * normalized base charge (Gummel & Poon, Bell Syst. Tech. J. 49, 1970); the base current keeps its
 * form, so β falls above the knee current I_K. Terminal resistances sit between each terminal and an
 * internal node where the junctions are; the equations use the internal junction voltages.
 */

import type {
  AcLoadContext,
  AllocationContext,
  BindContext,
  Conditions,
  DcLoadContext,
  Device,
  DeviceReport,
  JunctionProbe,
  NoiseGenerator,
  NonlinearCurrent,
} from '../device.js';
import {
  boundedExp,
  boundedExpCurvature,
  boundedExpSlope,
  criticalVoltage,
  depletionCapacitance,
  EXP_LIMIT,
  EXP_SLOPE_ABOVE_LIMIT,
  limitJunctionStep,
  saturationCurrentAt,
} from '../junction.js';
import { flickerNoise, shotNoise, thermalNoise } from '../noise-densities.js';
import { revaluedDefaults, sharedDefaults } from '../parameters.js';
import { addConductance, conductanceSlots, NO_SLOTS } from '../stamp.js';
import { BJT_PARAMETERS } from './bjt-model.js';
import type { BjtRecord } from './record.js';

/** A junction counts as forward-biased above this many n·Vt (about 0.41 V for n = 1 at 300 K). */
export const FORWARD_BIAS_THRESHOLD = 16;

/** The operating region of a bipolar transistor, from the bias of its two junctions. */
export type BjtRegion = 'cutoff' | 'forward-active' | 'reverse-active' | 'saturation';

/** Whether a terminal resistance of `record` is present (above 0, given or by default). */
function present(
  record: BjtRecord,
  name: 'collectorResistance' | 'baseResistance' | 'emitterResistance',
): boolean {
  return (record.model[name] ?? BJT_PARAMETERS[name].defaultValue) > 0;
}

/** A compiled bipolar transistor. */
export class Bjt implements Device {
  readonly nonlinear = true;
  readonly name: string;
  private p: Readonly<Record<keyof typeof BJT_PARAMETERS, number>>;
  /** +1 for npn, −1 for pnp. */
  private sign: number;
  /** The junctions' nodes: the terminals, or the internal nodes behind the terminal resistances. */
  private c = 0;
  private b = 0;
  private e = 0;
  /** The terminal nodes. */
  private tc = 0;
  private tb = 0;
  private te = 0;
  // Slots of the terminal resistances (unused where a resistance is 0).
  private sRc: Int32Array = NO_SLOTS;
  private sRb: Int32Array = NO_SLOTS;
  private sRe: Int32Array = NO_SLOTS;
  private kneeCurrent = Number.POSITIVE_INFINITY;
  /** Whether any terminal resistance is present: read in every load without touching the parameters. */
  private hasSeries: boolean;
  /** ∂(I_S·e_f/q_h)/∂vbe at the last evaluation: the slope of the forward charge over τF. */
  private forwardChargeSlope = 0;
  // Slots of rows (c, b, e) × columns (c, b, e), row-major, then the two junction capacitors.
  private s: Int32Array = NO_SLOTS;
  private sBe: Int32Array = NO_SLOTS;
  private sBc: Int32Array = NO_SLOTS;
  private is = 0;
  private nfVt = 0;
  private nrVt = 0;
  private vCritF = 0;
  private vCritR = 0;
  private junctionConductance = 0;
  /** The temperature and thermal voltage the constants below were last prepared for (NaN: never). */
  private preparedTemperature = Number.NaN;
  private preparedThermalVoltage = Number.NaN;
  // Constants of the load, taken from the parameters once instead of at every evaluation.
  private forwardBeta = 1;
  private reverseBeta = 1;
  private earlyVoltage = Number.POSITIVE_INFINITY;
  /** ∂q/∂vbe: 1/V_A, or 0 without the Early effect. */
  private dqdv = 0;
  private isOverForwardBeta = 0;
  private isOverReverseBeta = 0;
  private vbeOld = 0;
  private vbcOld = 0;
  // The last evaluation, in the mirrored frame: currents and their derivatives.
  private ic = 0;
  private ib = 0;
  private dIcDvbe = 0;
  private dIcDvbc = 0;
  private dIbDvbe = 0;
  private dIbDvbc = 0;
  // Scratch of the last capacitances() call.
  private cpi = 0;
  private cmu = 0;

  constructor(public record: BjtRecord) {
    this.name = record.name;
    this.p = sharedDefaults(BJT_PARAMETERS, record.model);
    this.sign = 1;
    this.hasSeries = false;
    this.take(record, this.p);
  }
  /** Take other model values; a terminal resistance appearing or vanishing needs a new binding. */
  revalue(record: BjtRecord): boolean {
    const p = this.p;
    if (
      present(record, 'collectorResistance') !== p.collectorResistance > 0 ||
      present(record, 'baseResistance') !== p.baseResistance > 0 ||
      present(record, 'emitterResistance') !== p.emitterResistance > 0
    ) {
      return false;
    }
    this.p = revaluedDefaults(BJT_PARAMETERS, p, this.record.model, record.model);
    this.record = record;
    this.take(record, this.p);
    return true;
  }
  /** The constants of the load that follow from the model values alone; the next prepare redoes the rest. */
  private take(record: BjtRecord, p: typeof this.p): void {
    this.sign = record.polarity === 'npn' ? 1 : -1;
    this.forwardBeta = p.forwardBeta;
    this.reverseBeta = p.reverseBeta;
    this.earlyVoltage = p.earlyVoltage;
    this.dqdv = this.earlyVoltage === Number.POSITIVE_INFINITY ? 0 : 1 / this.earlyVoltage;
    this.kneeCurrent = p.kneeCurrent;
    this.hasSeries = p.collectorResistance > 0 || p.baseResistance > 0 || p.emitterResistance > 0;
    this.preparedTemperature = Number.NaN;
    this.preparedThermalVoltage = Number.NaN;
  }
  allocateNodes(ctx: AllocationContext): void {
    const p = this.p;
    if (p.collectorResistance > 0) this.c = ctx.internalNode(this.name, 'collector');
    if (p.baseResistance > 0) this.b = ctx.internalNode(this.name, 'base');
    if (p.emitterResistance > 0) this.e = ctx.internalNode(this.name, 'emitter');
  }
  bind(ctx: BindContext): void {
    const p = this.p;
    this.tc = ctx.node(this.record.collector);
    this.tb = ctx.node(this.record.base);
    this.te = ctx.node(this.record.emitter);
    if (p.collectorResistance > 0) this.sRc = conductanceSlots(ctx, this.tc, this.c);
    else this.c = this.tc;
    if (p.baseResistance > 0) this.sRb = conductanceSlots(ctx, this.tb, this.b);
    else this.b = this.tb;
    if (p.emitterResistance > 0) this.sRe = conductanceSlots(ctx, this.te, this.e);
    else this.e = this.te;
    const t = [this.c, this.b, this.e];
    const pairs: number[] = [];
    for (const r of t) for (const col of t) pairs.push(r, col);
    this.s = ctx.slots(pairs);
    this.sBe = conductanceSlots(ctx, this.b, this.e);
    this.sBc = conductanceSlots(ctx, this.b, this.c);
  }
  prepare({ temperature, thermalVoltage, junctionConductance }: Conditions): void {
    this.junctionConductance = junctionConductance;
    // Every solve prepares again; at unchanged conditions the temperature laws give the same numbers.
    if (temperature === this.preparedTemperature && thermalVoltage === this.preparedThermalVoltage) return;
    this.preparedTemperature = temperature;
    this.preparedThermalVoltage = thermalVoltage;
    const p = this.p;
    this.nfVt = p.forwardEmissionCoefficient * thermalVoltage;
    this.nrVt = p.reverseEmissionCoefficient * thermalVoltage;
    // The transport current's temperature law, with emission coefficient 1.
    this.is = saturationCurrentAt(
      p.saturationCurrent,
      temperature,
      p.referenceTemperature,
      p.bandgap,
      p.saturationCurrentTemperatureExponent,
      1,
    );
    this.vCritF = criticalVoltage(this.nfVt, this.is);
    this.vCritR = criticalVoltage(this.nrVt, this.is);
    // β(T) = β·(T/Tref)^exponent; the exponent 0 leaves β exactly as given.
    const betaFactor = (temperature / p.referenceTemperature) ** p.betaTemperatureExponent;
    this.forwardBeta = p.forwardBeta * betaFactor;
    this.reverseBeta = p.reverseBeta * betaFactor;
    this.isOverForwardBeta = this.is / this.forwardBeta;
    this.isOverReverseBeta = this.is / this.reverseBeta;
  }
  /** Add the terminal resistances' conductances (none without terminal resistances). */
  private loadSeries(A: Float64Array): void {
    if (!this.hasSeries) return;
    const p = this.p;
    if (p.collectorResistance > 0) addConductance(A, this.sRc, 0, 1 / p.collectorResistance);
    if (p.baseResistance > 0) addConductance(A, this.sRb, 0, 1 / p.baseResistance);
    if (p.emitterResistance > 0) addConductance(A, this.sRe, 0, 1 / p.emitterResistance);
  }
  /** Evaluate the mirrored-frame currents and derivatives at (vbe, vbc), junction conductances included. */
  private evaluate(vbe: number, vbc: number, withJunctionConductance: boolean): void {
    const is = this.is;
    const nfVt = this.nfVt;
    const nrVt = this.nrVt;
    const af = vbe / nfVt;
    const ar = vbc / nrVt;
    const ef = boundedExp(af);
    const er = boundedExp(ar);
    // One exponential per junction: below the limit the slope of boundedExp is its value.
    const gf = (is * (af <= EXP_LIMIT ? ef : EXP_SLOPE_ABOVE_LIMIT)) / nfVt; // ∂(I_S·e_f)/∂vbe
    const gr = (is * (ar <= EXP_LIMIT ? er : EXP_SLOPE_ABOVE_LIMIT)) / nrVt; // ∂(I_S·e_r)/∂vbc
    const va = this.earlyVoltage;
    const q = va === Number.POSITIVE_INFINITY ? 1 : 1 + (vbe - vbc) / va;
    const transfer = is * (ef - er);
    const transferSlope = transfer * this.dqdv; // ∂q/∂vbe = −∂q/∂vbc
    const g = withJunctionConductance ? this.junctionConductance : 0;
    const reverseBase = this.isOverReverseBeta * (er - 1);
    const grOverBetaR = gr / this.reverseBeta;
    // High injection: q_h and ∂q_h/∂vbe = (I_S·e_f'/I_K)/√(…); without a knee q_h = 1 exactly.
    let qh = 1;
    let dqh = 0;
    const knee = this.kneeCurrent;
    if (knee !== Number.POSITIVE_INFINITY) {
      const root = Math.sqrt(Math.max(1 + (4 * is * (ef - 1)) / knee, 0));
      qh = 0.5 * (1 + root);
      dqh = root > 0 ? gf / (knee * root) : 0;
    }
    this.forwardChargeSlope = gf / qh - (is * ef * dqh) / (qh * qh);
    this.ic = (transfer * q) / qh - reverseBase - g * vbc;
    this.ib = this.isOverForwardBeta * (ef - 1) + reverseBase + g * (vbe + vbc);
    this.dIcDvbe = (gf * q + transferSlope) / qh - (transfer * q * dqh) / (qh * qh);
    this.dIcDvbc = (-gr * q - transferSlope) / qh - grOverBetaR - g;
    this.dIbDvbe = gf / this.forwardBeta + g;
    this.dIbDvbc = grOverBetaR + g;
  }
  /** Add the Jacobian of (ic, ib, ie) with respect to the node voltages at rows/cols (c, b, e). */
  private stampJacobian(A: Float64Array): void {
    const s = this.s;
    const g1 = this.dIcDvbe;
    const g2 = this.dIcDvbc;
    const h1 = this.dIbDvbe;
    const h2 = this.dIbDvbc;
    // Current into the collector: ∂/∂vc = −g2, ∂/∂vb = g1 + g2, ∂/∂ve = −g1; the same for the base.
    A[s[0]!]! -= g2;
    A[s[1]!]! += g1 + g2;
    A[s[2]!]! -= g1;
    A[s[3]!]! -= h2;
    A[s[4]!]! += h1 + h2;
    A[s[5]!]! -= h1;
    // Current into the emitter is −(ic + ib).
    A[s[6]!]! += g2 + h2;
    A[s[7]!]! -= g1 + g2 + h1 + h2;
    A[s[8]!]! += g1 + h1;
  }
  load(ctx: DcLoadContext): void {
    const x = ctx.x;
    const sign = this.sign;
    const vb = x[this.b]!;
    const rawBe = sign * (vb - x[this.e]!);
    const rawBc = sign * (vb - x[this.c]!);
    let vbe = rawBe;
    let vbc = rawBc;
    if (!ctx.first) {
      vbe = limitJunctionStep(rawBe, this.vbeOld, this.nfVt, this.vCritF);
      vbc = limitJunctionStep(rawBc, this.vbcOld, this.nrVt, this.vCritR);
      if (vbe !== rawBe || vbc !== rawBc) ctx.limited = true;
    }
    this.vbeOld = vbe;
    this.vbcOld = vbc;
    this.evaluate(vbe, vbc, true);
    this.stampJacobian(ctx.A);
    this.loadSeries(ctx.A);
    // Equivalent currents, in the circuit's frame: I − J·v at the evaluation point.
    const icEq = sign * (this.ic - this.dIcDvbe * vbe - this.dIcDvbc * vbc);
    const ibEq = sign * (this.ib - this.dIbDvbe * vbe - this.dIbDvbc * vbc);
    const bv = ctx.b;
    bv[this.c]! -= icEq;
    bv[this.b]! -= ibEq;
    bv[this.e]! += icEq + ibEq;
  }
  private mirrored(x: Float64Array): [number, number] {
    return [this.sign * (x[this.b]! - x[this.e]!), this.sign * (x[this.b]! - x[this.c]!)];
  }
  /**
   * The base-emitter and base-collector capacitances at (vbe, vbc), written to `cpi` and `cmu`, after
   * an evaluation there. The diffusion part of C_π follows the forward transport current alone,
   * τF·∂(I_S·e_f/q_h)/∂vbe, so it is never negative, whatever the bias of the collector junction.
   */
  private capacitances(vbe: number, vbc: number): void {
    const p = this.p;
    this.cpi =
      depletionCapacitance(p.baseEmitterCapacitance, vbe, p.baseEmitterPotential, p.baseEmitterGrading) +
      p.forwardTransitTime * this.forwardChargeSlope;
    this.cmu = depletionCapacitance(
      p.baseCollectorCapacitance,
      vbc,
      p.baseCollectorPotential,
      p.baseCollectorGrading,
    );
  }
  loadAc(ctx: AcLoadContext): void {
    this.prepare(ctx.conditions);
    // Inline rather than through mirrored(): no array allocated per frequency point.
    const x = ctx.x;
    const vb = x[this.b]!;
    const vbe = this.sign * (vb - x[this.e]!);
    const vbc = this.sign * (vb - x[this.c]!);
    this.evaluate(vbe, vbc, false);
    this.capacitances(vbe, vbc);
    this.evaluate(vbe, vbc, true);
    this.stampJacobian(ctx.Ar);
    this.loadSeries(ctx.Ar);
    addConductance(ctx.Ai, this.sBe, 0, ctx.omega * this.cpi);
    addConductance(ctx.Ai, this.sBc, 0, ctx.omega * this.cmu);
  }
  /** The operating region, by the bias of the two junctions (threshold {@link FORWARD_BIAS_THRESHOLD}·n·Vt). */
  region(vbe: number, vbc: number): BjtRegion {
    const beOn = vbe > FORWARD_BIAS_THRESHOLD * this.nfVt;
    const bcOn = vbc > FORWARD_BIAS_THRESHOLD * this.nrVt;
    if (beOn) return bcOn ? 'saturation' : 'forward-active';
    return bcOn ? 'reverse-active' : 'cutoff';
  }
  report(x: Float64Array, conditions: Conditions): DeviceReport {
    this.prepare(conditions);
    const [vbe, vbc] = this.mirrored(x);
    this.evaluate(vbe, vbc, false);
    const gm = this.dIcDvbe + this.dIcDvbc;
    const gpi = this.dIbDvbe + this.dIbDvbc;
    const go = -this.dIcDvbc;
    this.capacitances(vbe, vbc);
    const { cpi, cmu } = this;
    // Terminal currents include the junction conductances.
    this.evaluate(vbe, vbc, true);
    const sign = this.sign;
    const vb = x[this.tb]!;
    return {
      vbe: vb - x[this.te]!,
      vbc: vb - x[this.tc]!,
      vce: x[this.tc]! - x[this.te]!,
      ic: this.ic,
      ib: this.ib,
      ie: this.ic + this.ib,
      gm,
      rpi: 1 / gpi,
      // go underflows to ±0 when both junctions are far off: r_o is then infinite, never −Infinity.
      ro: go === 0 ? Number.POSITIVE_INFINITY : 1 / go,
      cpi,
      cmu,
      region: this.region(vbe, vbc),
      internalVbe: sign * vbe,
      internalVbc: sign * vbc,
    };
  }
  junctions(_x: Float64Array, conditions: Conditions): readonly JunctionProbe[] {
    this.prepare(conditions);
    return [
      { junction: 'base-emitter', plus: this.b, minus: this.e, scale: this.nfVt },
      { junction: 'base-collector', plus: this.b, minus: this.c, scale: this.nrVt },
    ];
  }
  /**
   * The curvature of the four currents of the transport model, in the mirrored frame with controls
   * u = vbe and w = vbc, q = 1 + (u − w)/V_A, F(u) = I_S·e_f, G(w) = I_S·e_r, k(u) = 1/q_h(u) (F_k, G_k,
   * k_k their k-th derivatives, r = 1/V_A):
   * - forward transport P·q with P = F·k, collector to emitter: ∂uu = P2·q + 2P1·r, ∂uw = −P1·r,
   *   ∂ww = 0; ∂uuu = P3·q + 3P2·r, ∂uuw = −P2·r, ∂uww = ∂www = 0;
   * - reverse transport −h·q with h(u, w) = G(w)·k(u), h_ij = G_j·k_i, collector to emitter: since q
   *   is linear, ∂^α(h·q) = h_α·q + r·(α_u·h_(α−u) − α_w·h_(α−w)) for every multi-index α;
   * - base currents F/βF (base to emitter) and G/βR (base to collector).
   * Without a knee current k = 1 and its derivatives vanish. A pnp carries the same currents in the
   * mirrored voltages, flowing the other way.
   */
  nonlinearCurrents(x: Float64Array, conditions: Conditions): readonly NonlinearCurrent[] {
    this.prepare(conditions);
    const [vbe, vbc] = this.mirrored(x);
    const r = this.dqdv;
    const q = 1 + (vbe - vbc) * r;
    const af = vbe / this.nfVt;
    const ar = vbc / this.nrVt;
    const f0 = this.is * boundedExp(af);
    const f1 = (this.is * boundedExpSlope(af)) / this.nfVt;
    const f2 = (this.is * boundedExpCurvature(af)) / this.nfVt ** 2;
    const f3 = f2 / this.nfVt;
    const g0 = this.is * boundedExp(ar);
    const g1 = (this.is * boundedExpSlope(ar)) / this.nrVt;
    const g2 = (this.is * boundedExpCurvature(ar)) / this.nrVt ** 2;
    const g3 = g2 / this.nrVt;
    const [k0, k1, k2, k3] = this.inverseChargeDerivatives(f0, f1, f2, f3);
    const p1 = f1 * k0 + f0 * k1;
    const p2 = f2 * k0 + 2 * f1 * k1 + f0 * k2;
    const p3 = f3 * k0 + 3 * f2 * k1 + 3 * f1 * k2 + f0 * k3;
    const npn = this.sign > 0;
    const [c, b, e] = [this.c, this.b, this.e];
    const u = npn ? { plus: b, minus: e } : { plus: e, minus: b };
    const w = npn ? { plus: b, minus: c } : { plus: c, minus: b };
    // Directions in the mirrored frame: into the collector and out of the emitter for npn.
    const ce = npn ? { from: c, to: e } : { from: e, to: c };
    const be = npn ? { from: b, to: e } : { from: e, to: b };
    const bc = npn ? { from: b, to: c } : { from: c, to: b };
    // Tensors over (u, w), row-major: second [uu, uw, wu, ww]; third [uuu, uuw, uwu, uww, wuu, wuw, wwu, www].
    const fuuw = -p2 * r;
    // The reverse transport −h·q: h_ij = G_j·k_i.
    const ruu = -(g0 * k2 * q + 2 * r * g0 * k1);
    const ruw = -(g1 * k1 * q + r * (g1 * k0 - g0 * k1));
    const rww = -(g2 * k0 * q - 2 * r * g1 * k0);
    const ruuu = -(g0 * k3 * q + 3 * r * g0 * k2);
    const ruuw = -(g1 * k2 * q + r * (2 * g1 * k1 - g0 * k2));
    const ruww = -(g2 * k1 * q + r * (g2 * k0 - 2 * g1 * k1));
    const rwww = -(g3 * k0 * q - 3 * r * g2 * k0);
    return [
      {
        junction: 'base-emitter',
        ...ce,
        controls: [u, w],
        second: [p2 * q + 2 * p1 * r, -p1 * r, -p1 * r, 0],
        third: [p3 * q + 3 * p2 * r, fuuw, fuuw, 0, fuuw, 0, 0, 0],
      },
      {
        junction: 'base-emitter',
        ...be,
        controls: [u],
        second: [f2 / this.forwardBeta],
        third: [f3 / this.forwardBeta],
      },
      {
        junction: 'base-collector',
        ...ce,
        controls: [u, w],
        second: [ruu, ruw, ruw, rww],
        third: [ruuu, ruuw, ruuw, ruww, ruuw, ruww, ruww, rwww],
      },
      {
        junction: 'base-collector',
        ...bc,
        controls: [w],
        second: [g2 / this.reverseBeta],
        third: [g3 / this.reverseBeta],
      },
    ];
  }
  /**
   * k = 1/q_h and its first three derivatives in vbe, from F = I_S·e_f and its derivatives: with
   * S = 1 + 4·(F − I_S)/I_K, s = √S and q_h = ½·(1 + s), s' = S'/(2s), s'' = S''/(2s) − S'²/(4s³),
   * s''' = S'''/(2s) − 3S'S''/(4s³) + 3S'³/(8s⁵), then the quotient rule. [1, 0, 0, 0] without a knee.
   */
  private inverseChargeDerivatives(
    f0: number,
    f1: number,
    f2: number,
    f3: number,
  ): [number, number, number, number] {
    const knee = this.kneeCurrent;
    if (knee === Number.POSITIVE_INFINITY) return [1, 0, 0, 0];
    const root = Math.sqrt(Math.max(1 + (4 * (f0 - this.is)) / knee, 0));
    if (root === 0) return [2, 0, 0, 0];
    const d1 = (4 * f1) / knee;
    const d2 = (4 * f2) / knee;
    const d3 = (4 * f3) / knee;
    const s1 = d1 / (2 * root);
    const s2 = d2 / (2 * root) - (d1 * d1) / (4 * root ** 3);
    const s3 = d3 / (2 * root) - (3 * d1 * d2) / (4 * root ** 3) + (3 * d1 ** 3) / (8 * root ** 5);
    const qh = 0.5 * (1 + root);
    const h1 = s1 / 2;
    const h2 = s2 / 2;
    const h3 = s3 / 2;
    return [
      1 / qh,
      -h1 / qh ** 2,
      -h2 / qh ** 2 + (2 * h1 * h1) / qh ** 3,
      -h3 / qh ** 2 + (6 * h1 * h2) / qh ** 3 - (6 * h1 ** 3) / qh ** 4,
    ];
  }
  /**
   * Shot noise 2q·|ic| (collector to emitter) and 2q·|ib| (base to emitter), flicker noise
   * K_f·|ib|^a_f/f of the base current, and the thermal noise 4kT/R of each nonzero terminal
   * resistance, between the terminal and the internal node behind it.
   */
  noiseGenerators(x: Float64Array, conditions: Conditions): readonly NoiseGenerator[] {
    this.prepare(conditions);
    const { temperature } = conditions;
    const p = this.p;
    const [vbe, vbc] = this.mirrored(x);
    this.evaluate(vbe, vbc, true);
    const { c, b, e } = this;
    const out: NoiseGenerator[] = [
      { mechanism: 'shot', terminal: 'collector', from: c, to: e, white: shotNoise(this.ic), flicker: 0 },
      { mechanism: 'shot', terminal: 'base', from: b, to: e, white: shotNoise(this.ib), flicker: 0 },
    ];
    const flicker = flickerNoise(p.flickerCoefficient, p.flickerExponent, this.ib);
    if (flicker > 0) out.push({ mechanism: 'flicker', terminal: 'base', from: b, to: e, white: 0, flicker });
    // Terminal resistances, when the model has them: (terminal, resistance, terminal node, internal node).
    const terminals = this.terminalResistances();
    for (const [terminal, resistance, outer, inner] of terminals) {
      if (!(resistance > 0)) continue;
      const white = thermalNoise(temperature, resistance);
      out.push({ mechanism: 'thermal', terminal, from: outer, to: inner, white, flicker: 0 });
    }
    return out;
  }
  /**
   * Each terminal's ohmic resistance (0 when the model has none) with the terminal's node and the
   * internal node behind it; without a resistance the two are the same node.
   */
  private terminalResistances(): readonly [string, number, number, number][] {
    const r = this.p as Partial<Record<string, number>>;
    return [
      ['base', r.baseResistance ?? 0, this.tb, this.b],
      ['collector', r.collectorResistance ?? 0, this.tc, this.c],
      ['emitter', r.emitterResistance ?? 0, this.te, this.e],
    ];
  }
}
