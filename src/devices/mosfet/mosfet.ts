/**
 * The MOSFET: the square law of Shichman & Hodges (IEEE J. Solid-State Circuits 3(3), 1968) with
 * channel-length modulation and body effect. For nmos with vds ≥ 0 and
 * Vth = Vth0 + γ·(√(φ − vbs) − √φ), V_ov = vgs − Vth:
 *   saturation (vds ≥ V_ov > 0): id = ½·β·V_ov²·(1 + λ·vds)
 *   triode (0 < vds < V_ov):     id = β·(V_ov·vds − ½·vds²)·(1 + λ·vds)
 *   cutoff (V_ov ≤ 0):           id = 0
 * When vds < 0 the drain and source exchange roles. A pmos obeys the same law in vsg, vsd, vsb with
 * |Vth0|. A small conductance sits across the channel and between body and source.
 *
 * With a `slopeFactor` the channel follows the charge-based model of mosfet-charge-model.ts instead,
 * continuous from weak to strong inversion. Either law takes the temperature laws
 * Vth0(T) = Vth0 + dVth/dT·(T − Tref) (on the signed threshold) and β(T) = β·(T/Tref)^(−exponent).
 */

import type {
  AcLoadContext,
  BindContext,
  Conditions,
  DcLoadContext,
  Device,
  DeviceReport,
  JunctionProbe,
  NoiseGenerator,
  NonlinearCurrent,
} from '../device.js';
import { channelThermalNoise, chargeBasedChannelThermalNoise, flickerNoise } from '../noise-densities.js';
import { revaluedDefaults, sharedDefaults } from '../parameters.js';
import { addConductance, conductanceSlots, NO_SLOTS } from '../stamp.js';
import {
  type ChargeModelConstants,
  chargeBasedChannel,
  chargeBasedCurvature,
  inversionLevel,
} from './mosfet-charge-model.js';
import { defaultThreshold, MOSFET_PARAMETERS } from './mosfet-model.js';
import type { MosfetRecord } from './record.js';

/** The operating region of a MOSFET. */
export type MosfetRegion = 'cutoff' | 'triode' | 'saturation';

/** Where √(φ − vbs) is clamped when the body is forward-biased past φ (keeps the law finite). */
const MIN_BODY_ROOT = 1e-3;

/** The charge state of a square-law device, which has none. */
const NO_CHARGE_STATE = new Float64Array(0);

/** A compiled MOSFET. */
export class Mosfet implements Device {
  readonly nonlinear = true;
  readonly name: string;
  private p: Readonly<Record<keyof typeof MOSFET_PARAMETERS, number>>;
  /** +1 for nmos, −1 for pmos. */
  private sign = 1;
  /** |Vth0| in the mirrored frame, at the analysis temperature. */
  private vth0 = 0;
  /** Vth0 with its sign, as given, at the reference temperature. */
  private signedThreshold = 0;
  /** β at the analysis temperature. */
  private beta = 0;
  /** Whether the charge-based model (a slope factor given) replaces the square law. */
  private chargeBased = false;
  private readonly charge: { -readonly [K in keyof ChargeModelConstants]: number } = {
    thresholdVoltage: 0,
    gainFactor: 0,
    slopeFactor: Number.NaN,
    channelLengthModulation: 0,
    thermalVoltage: Number.NaN,
  };
  /** [id, gm, gds, gmb, if, ir] of the last charge-based evaluation. */
  private chargeState: Float64Array = NO_CHARGE_STATE;
  private d = 0;
  private g = 0;
  private s = 0;
  private bd = 0;
  // Slots of rows (d, s) × columns (d, g, s, b), then the body tie and the two gate capacitors.
  private sChannel: Int32Array = NO_SLOTS;
  private sBody: Int32Array = NO_SLOTS;
  /** The temperature the constants were last prepared for (NaN: never). */
  private preparedTemperature = Number.NaN;
  // The square law's constants, read once from the parameters: λ, γ, φ and √φ.
  private lambda = 0;
  private gamma = 0;
  private phi = 0;
  private rootPhi = 0;
  private sGs: Int32Array = NO_SLOTS;
  private sGd: Int32Array = NO_SLOTS;
  private junctionConductance = 0;
  private vgsOld = 0;
  private vdsOld = 0;
  // The last evaluation in the mirrored frame.
  private id = 0;
  private gm = 0;
  private gds = 0;
  private gmb = 0;
  private vth = 0;
  private reversed = false;
  private regionNow: MosfetRegion = 'cutoff';

  constructor(public record: MosfetRecord) {
    this.name = record.name;
    this.p = sharedDefaults(MOSFET_PARAMETERS, record.model);
    this.take(record);
  }
  /** Take other model values: a MOSFET's unknowns and slots never depend on them. */
  revalue(record: MosfetRecord): boolean {
    this.p = revaluedDefaults(MOSFET_PARAMETERS, this.p, this.record.model, record.model);
    this.record = record;
    this.take(record);
    return true;
  }
  /** The constants that follow from the model values alone; the next prepare redoes the rest. */
  private take(record: MosfetRecord): void {
    const p = this.p;
    this.sign = record.polarity === 'nmos' ? 1 : -1;
    const given = record.model.thresholdVoltage;
    this.signedThreshold = given === undefined ? defaultThreshold(record.polarity) : given;
    this.vth0 = this.sign * this.signedThreshold;
    this.beta = p.gainFactor;
    this.lambda = p.channelLengthModulation;
    this.gamma = p.bodyEffect;
    this.phi = p.surfacePotential;
    this.rootPhi = Math.sqrt(this.phi);
    this.chargeBased = !Number.isNaN(p.slopeFactor);
    // Only the charge-based law keeps state; a square-law device shares the empty array.
    if (this.chargeBased && this.chargeState.length === 0) this.chargeState = new Float64Array(6);
    const charge = this.charge;
    charge.thresholdVoltage = this.vth0;
    charge.gainFactor = this.beta;
    charge.slopeFactor = p.slopeFactor;
    charge.channelLengthModulation = p.channelLengthModulation;
    charge.thermalVoltage = Number.NaN;
    this.preparedTemperature = Number.NaN;
  }
  bind(ctx: BindContext): void {
    this.d = ctx.node(this.record.drain);
    this.g = ctx.node(this.record.gate);
    this.s = ctx.node(this.record.source);
    this.bd = ctx.node(this.record.body);
    const cols = [this.d, this.g, this.s, this.bd];
    const pairs: number[] = [];
    for (const r of [this.d, this.s]) for (const col of cols) pairs.push(r, col);
    this.sChannel = ctx.slots(pairs);
    this.sBody = conductanceSlots(ctx, this.bd, this.s);
    this.sGs = conductanceSlots(ctx, this.g, this.s);
    this.sGd = conductanceSlots(ctx, this.g, this.d);
  }
  prepare({ temperature, thermalVoltage, junctionConductance }: Conditions): void {
    this.junctionConductance = junctionConductance;
    // Every solve prepares again; at unchanged conditions the temperature laws give the same numbers.
    if (temperature === this.preparedTemperature && thermalVoltage === this.charge.thermalVoltage) return;
    this.preparedTemperature = temperature;
    // With both temperature parameters at 0 these give the values as given, exactly.
    const p = this.p;
    const rise = temperature - p.referenceTemperature;
    this.vth0 = this.sign * (this.signedThreshold + p.thresholdTemperatureCoefficient * rise);
    this.beta = p.gainFactor * (temperature / p.referenceTemperature) ** -p.mobilityTemperatureExponent;
    this.charge.thresholdVoltage = this.vth0;
    this.charge.gainFactor = this.beta;
    this.charge.thermalVoltage = thermalVoltage;
  }
  /** The square law for vds ≥ 0 in the mirrored frame; writes id, gm, gds, gmb, vth, regionNow. */
  private channel(vgs: number, vds: number, vbs: number): void {
    const lambda = this.lambda;
    const gamma = this.gamma;
    const phi = this.phi;
    const beta = this.beta;
    let root = Math.sqrt(Math.max(phi - vbs, 0));
    let dRootDvbs = 0;
    if (root < MIN_BODY_ROOT) root = MIN_BODY_ROOT;
    else dRootDvbs = -1 / (2 * root);
    this.vth = this.vth0 + gamma * (root - this.rootPhi);
    const vov = vgs - this.vth;
    const clm = 1 + lambda * vds;
    if (vov <= 0) {
      this.id = 0;
      this.gm = 0;
      this.gds = 0;
      this.regionNow = 'cutoff';
    } else if (vds >= vov) {
      this.id = 0.5 * beta * vov * vov * clm;
      this.gm = beta * vov * clm;
      this.gds = 0.5 * beta * vov * vov * lambda;
      this.regionNow = 'saturation';
    } else {
      const core = vov * vds - 0.5 * vds * vds;
      this.id = beta * core * clm;
      this.gm = beta * vds * clm;
      this.gds = beta * (vov - vds) * clm + beta * core * lambda;
      this.regionNow = 'triode';
    }
    // ∂id/∂vbs = ∂id/∂V_ov · (−∂Vth/∂vbs).
    this.gmb = -this.gm * gamma * dRootDvbs;
  }
  /** Evaluate at mirrored (vgs, vds, vbs), swapping drain and source when vds < 0. */
  private evaluate(vgs: number, vds: number, vbs: number): void {
    if (this.chargeBased) {
      this.evaluateChargeBased(vgs, vds, vbs);
      return;
    }
    this.reversed = vds < 0;
    if (!this.reversed) {
      this.channel(vgs, vds, vbs);
      return;
    }
    // id = −f(vgs − vds, −vds, vbs − vds): chain rule back to (vgs, vds, vbs).
    this.channel(vgs - vds, -vds, vbs - vds);
    const fg = this.gm;
    const fd = this.gds;
    const fb = this.gmb;
    this.id = -this.id;
    this.gm = -fg;
    this.gmb = -fb;
    this.gds = fg + fd + fb;
  }
  /**
   * The charge-based law at mirrored (vgs, vds, vbs): symmetric in drain and source, so no exchange
   * of roles; `'saturation'` when ir ≤ if/100, else `'triode'` (this model has no cutoff).
   */
  private evaluateChargeBased(vgs: number, vds: number, vbs: number): void {
    const out = chargeBasedChannel(vgs, vds, vbs, this.charge, this.chargeState);
    this.reversed = false;
    this.vth = this.vth0;
    this.id = out[0]!;
    this.gm = out[1]!;
    this.gds = out[2]!;
    this.gmb = out[3]!;
    this.regionNow = out[5]! <= out[4]! / 100 ? 'saturation' : 'triode';
  }
  private mirrored(x: Float64Array): [number, number, number] {
    const sign = this.sign;
    const vs = x[this.s]!;
    return [sign * (x[this.g]! - vs), sign * (x[this.d]! - vs), sign * (x[this.bd]! - vs)];
  }
  /** Add the channel Jacobian (the junction conductance across the channel included) at rows (d, s), columns (d, g, s, b). */
  private stampJacobian(A: Float64Array): void {
    const s = this.sChannel;
    const gds = this.gds + this.junctionConductance;
    const gm = this.gm;
    const gmb = this.gmb;
    A[s[0]!]! += gds;
    A[s[1]!]! += gm;
    A[s[2]!]! -= gm + gds + gmb;
    A[s[3]!]! += gmb;
    A[s[4]!]! -= gds;
    A[s[5]!]! -= gm;
    A[s[6]!]! += gm + gds + gmb;
    A[s[7]!]! -= gmb;
  }
  load(ctx: DcLoadContext): void {
    // Inline rather than through mirrored(): no array allocated per Newton iteration; the limiter needs vgs, vds.
    const x = ctx.x;
    const sign = this.sign;
    const vs = x[this.s]!;
    let vgs = sign * (x[this.g]! - vs);
    let vds = sign * (x[this.d]! - vs);
    const vbs = sign * (x[this.bd]! - vs);
    if (!ctx.first) {
      // Bound each step by the distance already travelled plus a volt or two: the square law is
      // smooth, but a long jump across the threshold can land in cutoff where the Jacobian is empty.
      const vgsLimit = 1 + Math.abs(this.vgsOld - this.vth);
      const vdsLimit = 2 + Math.abs(this.vdsOld);
      const vgsStep = Math.max(-vgsLimit, Math.min(vgsLimit, vgs - this.vgsOld));
      const vdsStep = Math.max(-vdsLimit, Math.min(vdsLimit, vds - this.vdsOld));
      if (vgsStep !== vgs - this.vgsOld || vdsStep !== vds - this.vdsOld) {
        vgs = this.vgsOld + vgsStep;
        vds = this.vdsOld + vdsStep;
        ctx.limited = true;
      }
    }
    this.vgsOld = vgs;
    this.vdsOld = vds;
    this.evaluate(vgs, vds, vbs);
    this.stampJacobian(ctx.A);
    addConductance(ctx.A, this.sBody, 0, this.junctionConductance);
    // Equivalent current into the drain, in the circuit's frame.
    const ieq = sign * (this.id - this.gm * vgs - this.gds * vds - this.gmb * vbs);
    ctx.b[this.d]! -= ieq;
    ctx.b[this.s]! += ieq;
  }
  loadAc(ctx: AcLoadContext): void {
    this.prepare(ctx.conditions);
    // Inline rather than through mirrored(): no array allocated per frequency point.
    const x = ctx.x;
    const sign = this.sign;
    const vs = x[this.s]!;
    this.evaluate(sign * (x[this.g]! - vs), sign * (x[this.d]! - vs), sign * (x[this.bd]! - vs));
    this.stampJacobian(ctx.Ar);
    addConductance(ctx.Ar, this.sBody, 0, this.junctionConductance);
    addConductance(ctx.Ai, this.sGs, 0, ctx.omega * this.p.gateSourceCapacitance);
    addConductance(ctx.Ai, this.sGd, 0, ctx.omega * this.p.gateDrainCapacitance);
  }
  report(x: Float64Array, conditions: Conditions): DeviceReport {
    this.prepare(conditions);
    const [vgs, vds, vbs] = this.mirrored(x);
    this.evaluate(vgs, vds, vbs);
    const sign = this.sign;
    if (this.chargeBased) return this.chargeBasedReport(vgs, vds, vbs);
    return {
      ...this.commonReport(vgs, vds, vbs),
      thresholdVoltage: sign * this.vth,
      overdrive: this.regionNow === 'cutoff' ? 0 : (this.reversed ? vgs - vds : vgs) - this.vth,
    };
  }
  /** The fields both channel laws report, after an evaluation at mirrored (vgs, vds, vbs). */
  private commonReport(vgs: number, vds: number, vbs: number): Record<string, number | string> {
    const sign = this.sign;
    return {
      vgs: sign * vgs,
      vds: sign * vds,
      vbs: sign * vbs,
      id: this.id + this.junctionConductance * vds,
      gm: this.gm,
      gds: this.gds,
      gmb: this.gmb,
      cgs: this.p.gateSourceCapacitance,
      cgd: this.p.gateDrainCapacitance,
      region: this.regionNow,
    };
  }
  /**
   * The charge-based report: the square law's fields (`overdrive` is vgs − Vth0 with its sign, negative
   * in weak inversion), the inversion level and coefficient if, and g_m/I_D for the g_m/I_D method.
   */
  private chargeBasedReport(vgs: number, vds: number, vbs: number): DeviceReport {
    const sign = this.sign;
    const state = this.chargeState;
    const forwardCoefficient = state[4]!;
    const n = this.p.slopeFactor;
    return {
      ...this.commonReport(vgs, vds, vbs),
      thresholdVoltage: sign * this.vth0,
      overdrive: vgs - this.vth0,
      inversion: inversionLevel(forwardCoefficient),
      inversionCoefficient: forwardCoefficient,
      // Where id underflows to 0 (far below threshold) g_m/I_D is its weak-inversion limit.
      gmOverId: this.id > 0 ? this.gm / this.id : 1 / (n * this.charge.thermalVoltage),
      slopeFactor: n,
    };
  }
  junctions(x: Float64Array, conditions: Conditions): readonly JunctionProbe[] {
    this.prepare(conditions);
    const [vgs, vds, vbs] = this.mirrored(x);
    this.evaluate(vgs, vds, vbs);
    if (this.regionNow !== 'saturation') return [];
    if (this.chargeBased) return [this.chargeBasedProbe(vgs, vds, vbs)];
    const source = this.reversed ? this.d : this.s;
    const vov = (this.reversed ? vgs - vds : vgs) - this.vth;
    return [{ junction: 'channel', plus: this.g, minus: source, scale: vov }];
  }
  /**
   * The channel current's curvature. In the frame of the effective source (the drain when reversed)
   * the law is h(V, D) with V = vgs − Vth(vbs), D = vds:
   *   saturation h = ½β·V²·(1 + λD): h_VV = β(1 + λD), h_VD = βVλ, h_VVD = βλ, the rest 0;
   *   triode h = β·(V·D − ½D²)·(1 + λD): h_VD = β(1 + 2λD), h_DD = β(2λV − 1 − 3λD), h_VDD = 2βλ,
   *   h_DDD = −3βλ, the rest 0.
   * With V_b = γ/(2ρ), V_bb = γ/(4ρ³), V_bbb = 3γ/(8ρ⁵), ρ = √(φ − vbs), the chain rule gives the
   * derivatives in (vgs, vds, vbs) written out below.
   */
  nonlinearCurrents(x: Float64Array, conditions: Conditions): readonly NonlinearCurrent[] {
    this.prepare(conditions);
    const [vgs, vds, vbs] = this.mirrored(x);
    this.evaluate(vgs, vds, vbs);
    if (this.chargeBased) return [this.chargeBasedCurrent(vgs, vds, vbs)];
    if (this.regionNow === 'cutoff') return [];
    const { channelLengthModulation: lambda, bodyEffect: gamma, surfacePotential: phi } = this.p;
    const beta = this.beta;
    const reversed = this.reversed;
    const g = reversed ? vgs - vds : vgs;
    const d = reversed ? -vds : vds;
    const b = reversed ? vbs - vds : vbs;
    const v = g - this.vth;
    const rho = Math.sqrt(Math.max(phi - b, 0));
    const clamped = rho < MIN_BODY_ROOT;
    const p1 = clamped ? 0 : gamma / (2 * rho);
    const p2 = clamped ? 0 : gamma / (4 * rho ** 3);
    const p3 = clamped ? 0 : (3 * gamma) / (8 * rho ** 5);
    let hV: number;
    let hVV: number;
    let hVD: number;
    let hDD: number;
    let hVVD: number;
    let hVDD: number;
    let hDDD: number;
    if (this.regionNow === 'saturation') {
      hV = beta * v * (1 + lambda * d);
      hVV = beta * (1 + lambda * d);
      hVD = beta * v * lambda;
      hDD = 0;
      hVVD = beta * lambda;
      hVDD = 0;
      hDDD = 0;
    } else {
      hV = beta * d * (1 + lambda * d);
      hVV = 0;
      hVD = beta * (1 + 2 * lambda * d);
      hDD = beta * (2 * lambda * v - 1 - 3 * lambda * d);
      hVVD = 0;
      hVDD = 2 * beta * lambda;
      hDDD = -3 * beta * lambda;
    }
    // Controls (g, d, b); h_VVV = 0 in both regions.
    const gg = hVV;
    const gd = hVD;
    const gb = hVV * p1;
    const dd = hDD;
    const db = hVD * p1;
    const bb = hVV * p1 * p1 + hV * p2;
    const ggd = hVVD;
    const gdd = hVDD;
    const gdb = hVVD * p1;
    const gbb = hVV * p2;
    const ddb = hVDD * p1;
    const dbb = hVVD * p1 * p1 + hVD * p2;
    const bbb = 3 * hVV * p1 * p2 + hV * p3;
    const second = [gg, gd, gb, gd, dd, db, gb, db, bb];
    const third = new Array<number>(27);
    const set = (i: number, j: number, k: number, value: number): void => {
      for (const [a, bIndex, c] of [
        [i, j, k],
        [i, k, j],
        [j, i, k],
        [j, k, i],
        [k, i, j],
        [k, j, i],
      ] as const) {
        third[a * 9 + bIndex * 3 + c] = value;
      }
    };
    set(0, 0, 0, 0);
    set(0, 0, 1, ggd);
    set(0, 0, 2, 0);
    set(0, 1, 1, gdd);
    set(0, 1, 2, gdb);
    set(0, 2, 2, gbb);
    set(1, 1, 1, hDDD);
    set(1, 1, 2, ddb);
    set(1, 2, 2, dbb);
    set(2, 2, 2, bbb);
    // The effective source is the drain when reversed; a pmos carries its current the other way.
    const source = reversed ? this.d : this.s;
    const drain = reversed ? this.s : this.d;
    const pair = (node: number) =>
      this.sign > 0 ? { plus: node, minus: source } : { plus: source, minus: node };
    const flow = this.sign > 0 ? { from: drain, to: source } : { from: source, to: drain };
    return [
      {
        junction: 'channel',
        ...flow,
        controls: [pair(this.g), pair(drain), pair(this.bd)],
        second,
        third,
      },
    ];
  }
  /**
   * The charge-based channel's probe: scale id/g_m, and the channel current's own Taylor
   * coefficients in vgs at the bias, i = g1·v + g2·v²/2 + g3·v³/6, normalized to the scale
   * (second = g2·scale/g1, third = g3·scale²/g1), for the harmonic figures of the linearity report.
   */
  private chargeBasedProbe(vgs: number, vds: number, vbs: number): JunctionProbe {
    const second = new Array<number>(9);
    const third = new Array<number>(27);
    chargeBasedCurvature(vgs, vds, vbs, this.charge, second, third);
    const g1 = this.gm;
    const scale = this.id / g1;
    return {
      junction: 'channel',
      plus: this.g,
      minus: this.s,
      scale,
      taylor: { second: (second[0]! * scale) / g1, third: (third[0]! * scale * scale) / g1 },
    };
  }
  /** The charge-based channel's nonlinear current, drain to source, controlled by (vgs, vds, vbs). */
  private chargeBasedCurrent(vgs: number, vds: number, vbs: number): NonlinearCurrent {
    const second = new Array<number>(9);
    const third = new Array<number>(27);
    chargeBasedCurvature(vgs, vds, vbs, this.charge, second, third);
    const source = this.s;
    const pair = (node: number) =>
      this.sign > 0 ? { plus: node, minus: source } : { plus: source, minus: node };
    const flow = this.sign > 0 ? { from: this.d, to: source } : { from: source, to: this.d };
    return {
      junction: 'channel',
      ...flow,
      controls: [pair(this.g), pair(this.d), pair(this.bd)],
      second,
      third,
    };
  }
  /**
   * The channel's thermal noise 4kT·(2/3)·β·V_ov·(1 + η + η²)/(1 + η) (η = 1 − v_ds/V_ov in triode, 0 in
   * saturation; 0 in cutoff) and flicker noise K_f·|id|^a_f/f, both between drain and source.
   */
  noiseGenerators(x: Float64Array, conditions: Conditions): readonly NoiseGenerator[] {
    this.prepare(conditions);
    const { temperature } = conditions;
    const p = this.p;
    const [vgs, vds, vbs] = this.mirrored(x);
    this.evaluate(vgs, vds, vbs);
    // In the frame of the effective source (the drain when reversed), where v_ds ≥ 0.
    const overdrive = (this.reversed ? vgs - vds : vgs) - this.vth;
    const white = this.chargeBased
      ? chargeBasedChannelThermalNoise(temperature, p.slopeFactor, Math.abs(this.gm), this.chargeState[4]!)
      : channelThermalNoise(temperature, this.beta, overdrive, Math.abs(vds));
    const out: NoiseGenerator[] = [{ mechanism: 'thermal', from: this.d, to: this.s, white, flicker: 0 }];
    const flicker = flickerNoise(p.flickerCoefficient, p.flickerExponent, this.id);
    if (flicker > 0) out.push({ mechanism: 'flicker', from: this.d, to: this.s, white: 0, flicker });
    return out;
  }
}
