/**
 * The bipolar transistor: the transport form of the Ebers-Moll model with the forward Early effect
 * (Ebers & Moll, Proc. IRE 42, 1954; Getreu, Modeling the Bipolar Transistor, 1976). For npn, with
 * e_f = exp(vbe/(nf·Vt)) and e_r = exp(vbc/(nr·Vt)):
 *   iT = Is·(e_f − e_r)·(1 + vce/VA)
 *   ic = iT − (Is/βR)·(e_r − 1)
 *   ib = (Is/βF)·(e_f − 1) + (Is/βR)·(e_r − 1)
 * A pnp obeys the same equations in the mirrored voltages (veb, vcb), its currents flowing out of the
 * terminals. A small conductance sits across each junction.
 */

import type {
  AcLoadContext,
  BindContext,
  Conditions,
  DcLoadContext,
  Device,
  DeviceReport,
  JunctionProbe,
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
import { withDefaults } from '../parameters.js';
import { addConductance, conductanceSlots } from '../stamp.js';
import { BJT_PARAMETERS } from './bjt-model.js';
import type { BjtRecord } from './record.js';

/** A junction counts as forward-biased above this many n·Vt (about 0.41 V for n = 1 at 300 K). */
export const FORWARD_BIAS_THRESHOLD = 16;

/** The operating region of a bipolar transistor, from the bias of its two junctions. */
export type BjtRegion = 'cutoff' | 'forward-active' | 'reverse-active' | 'saturation';

/** A compiled bipolar transistor. */
export class Bjt implements Device {
  readonly nonlinear = true;
  readonly name: string;
  private readonly p: ReturnType<typeof withDefaults<keyof typeof BJT_PARAMETERS>>;
  /** +1 for npn, −1 for pnp. */
  private readonly sign: number;
  private c = 0;
  private b = 0;
  private e = 0;
  // Slots of rows (c, b, e) × columns (c, b, e), row-major, then the two junction capacitors.
  private s: Int32Array = new Int32Array(0);
  private sBe: Int32Array = new Int32Array(0);
  private sBc: Int32Array = new Int32Array(0);
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
  /** ∂q/∂vbe: 1/VA, or 0 without the Early effect. */
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

  constructor(readonly record: BjtRecord) {
    this.name = record.name;
    this.p = withDefaults(BJT_PARAMETERS, record.model);
    this.sign = record.polarity === 'npn' ? 1 : -1;
    this.forwardBeta = this.p.forwardBeta;
    this.reverseBeta = this.p.reverseBeta;
    this.earlyVoltage = this.p.earlyVoltage;
    this.dqdv = this.earlyVoltage === Number.POSITIVE_INFINITY ? 0 : 1 / this.earlyVoltage;
  }
  bind(ctx: BindContext): void {
    this.c = ctx.node(this.record.collector);
    this.b = ctx.node(this.record.base);
    this.e = ctx.node(this.record.emitter);
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
    this.isOverForwardBeta = this.is / this.forwardBeta;
    this.isOverReverseBeta = this.is / this.reverseBeta;
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
    const gf = (is * (af <= EXP_LIMIT ? ef : EXP_SLOPE_ABOVE_LIMIT)) / nfVt; // ∂(Is·e_f)/∂vbe
    const gr = (is * (ar <= EXP_LIMIT ? er : EXP_SLOPE_ABOVE_LIMIT)) / nrVt; // ∂(Is·e_r)/∂vbc
    const va = this.earlyVoltage;
    const q = va === Number.POSITIVE_INFINITY ? 1 : 1 + (vbe - vbc) / va;
    const transfer = is * (ef - er);
    const transferSlope = transfer * this.dqdv; // ∂q/∂vbe = −∂q/∂vbc
    const g = withJunctionConductance ? this.junctionConductance : 0;
    const reverseBase = this.isOverReverseBeta * (er - 1);
    const grOverBetaR = gr / this.reverseBeta;
    this.ic = transfer * q - reverseBase - g * vbc;
    this.ib = this.isOverForwardBeta * (ef - 1) + reverseBase + g * (vbe + vbc);
    this.dIcDvbe = gf * q + transferSlope;
    this.dIcDvbc = -gr * q - transferSlope - grOverBetaR - g;
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
  /** The base-emitter and base-collector capacitances at (vbe, vbc), written to `cpi` and `cmu`. */
  private capacitances(vbe: number, vbc: number, gm: number): void {
    const p = this.p;
    this.cpi =
      depletionCapacitance(p.baseEmitterCapacitance, vbe, p.baseEmitterPotential, p.baseEmitterGrading) +
      p.forwardTransitTime * gm;
    this.cmu = depletionCapacitance(
      p.baseCollectorCapacitance,
      vbc,
      p.baseCollectorPotential,
      p.baseCollectorGrading,
    );
  }
  loadAc(ctx: AcLoadContext): void {
    // Inline rather than through mirrored(): no array allocated per frequency point.
    const x = ctx.x;
    const vb = x[this.b]!;
    const vbe = this.sign * (vb - x[this.e]!);
    const vbc = this.sign * (vb - x[this.c]!);
    this.evaluate(vbe, vbc, false);
    this.capacitances(vbe, vbc, this.dIcDvbe + this.dIcDvbc);
    this.evaluate(vbe, vbc, true);
    this.stampJacobian(ctx.Ar);
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
  report(x: Float64Array): DeviceReport {
    const [vbe, vbc] = this.mirrored(x);
    this.evaluate(vbe, vbc, false);
    const gm = this.dIcDvbe + this.dIcDvbc;
    const gpi = this.dIbDvbe + this.dIbDvbc;
    const go = -this.dIcDvbc;
    this.capacitances(vbe, vbc, gm);
    const { cpi, cmu } = this;
    // Terminal currents include the junction conductances.
    this.evaluate(vbe, vbc, true);
    const sign = this.sign;
    return {
      vbe: sign * vbe,
      vbc: sign * vbc,
      vce: sign * (vbe - vbc),
      ic: this.ic,
      ib: this.ib,
      ie: this.ic + this.ib,
      gm,
      rpi: 1 / gpi,
      ro: 1 / go,
      cpi,
      cmu,
      region: this.region(vbe, vbc),
    };
  }
  junctions(_x: Float64Array): readonly JunctionProbe[] {
    return [
      { junction: 'base-emitter', plus: this.b, minus: this.e, scale: this.nfVt },
      { junction: 'base-collector', plus: this.b, minus: this.c, scale: this.nrVt },
    ];
  }
  /**
   * The curvature of the four currents of the transport model, in the mirrored frame with controls
   * u = vbe and w = vbc, q = 1 + (u − w)/VA, F(u) = Is·e_f, G(w) = Is·e_r (F_k, G_k their k-th
   * derivatives, r = 1/VA):
   * - forward transport F·q, collector to emitter: ∂uu = F2·q + 2F1·r, ∂uw = −F1·r, ∂ww = 0;
   *   ∂uuu = F3·q + 3F2·r, ∂uuw = −F2·r, ∂uww = ∂www = 0;
   * - reverse transport −G·q, collector to emitter: ∂uu = 0, ∂uw = −G1·r, ∂ww = −G2·q + 2G1·r;
   *   ∂uuu = ∂uuw = 0, ∂uww = −G2·r, ∂www = −G3·q + 3G2·r;
   * - base currents F/βF (base to emitter) and G/βR (base to collector).
   * A pnp carries the same currents in the mirrored voltages, flowing the other way.
   */
  nonlinearCurrents(x: Float64Array): readonly NonlinearCurrent[] {
    const p = this.p;
    const [vbe, vbc] = this.mirrored(x);
    const r = p.earlyVoltage === Number.POSITIVE_INFINITY ? 0 : 1 / p.earlyVoltage;
    const q = 1 + (vbe - vbc) * r;
    const af = vbe / this.nfVt;
    const ar = vbc / this.nrVt;
    const f1 = (this.is * boundedExpSlope(af)) / this.nfVt;
    const f2 = (this.is * boundedExpCurvature(af)) / this.nfVt ** 2;
    const f3 = f2 / this.nfVt;
    const g1 = (this.is * boundedExpSlope(ar)) / this.nrVt;
    const g2 = (this.is * boundedExpCurvature(ar)) / this.nrVt ** 2;
    const g3 = g2 / this.nrVt;
    const npn = this.sign > 0;
    const [c, b, e] = [this.c, this.b, this.e];
    const u = npn ? { plus: b, minus: e } : { plus: e, minus: b };
    const w = npn ? { plus: b, minus: c } : { plus: c, minus: b };
    // Directions in the mirrored frame: into the collector and out of the emitter for npn.
    const ce = npn ? { from: c, to: e } : { from: e, to: c };
    const be = npn ? { from: b, to: e } : { from: e, to: b };
    const bc = npn ? { from: b, to: c } : { from: c, to: b };
    // Tensors over (u, w), row-major: second [uu, uw, wu, ww]; third [uuu, uuw, uwu, uww, wuu, wuw, wwu, www].
    const fuuw = -f2 * r;
    const guww = -g2 * r;
    return [
      {
        junction: 'base-emitter',
        ...ce,
        controls: [u, w],
        second: [f2 * q + 2 * f1 * r, -f1 * r, -f1 * r, 0],
        third: [f3 * q + 3 * f2 * r, fuuw, fuuw, 0, fuuw, 0, 0, 0],
      },
      {
        junction: 'base-emitter',
        ...be,
        controls: [u],
        second: [f2 / p.forwardBeta],
        third: [f3 / p.forwardBeta],
      },
      {
        junction: 'base-collector',
        ...ce,
        controls: [u, w],
        second: [0, -g1 * r, -g1 * r, -g2 * q + 2 * g1 * r],
        third: [0, 0, 0, guww, 0, guww, guww, -g3 * q + 3 * g2 * r],
      },
      {
        junction: 'base-collector',
        ...bc,
        controls: [w],
        second: [g2 / p.reverseBeta],
        third: [g3 / p.reverseBeta],
      },
    ];
  }
}
