/**
 * The op-amp. Its output current (flowing out of the output terminal into the circuit) is an unknown.
 * Ideal: a nullor, the branch row forces v(plus) + Vos = v(minus) and the output supplies whatever
 * current that takes. Finite: v(out) + R_out·i = L(H(jω)·(v(plus) + Vos − v(minus))) with the
 * single-pole gain H(jω) = A0/(1 + jω/ω_p), ω_p = 2π·GBW/A0, and L the output limiter (identity
 * without limits; see op-amp-limiter.ts), so a finite op-amp with limits is solved by Newton.
 * Either model draws its bias currents out of the inputs: Ib + Ios/2 at plus, Ib − Ios/2 at minus.
 */

import { GROUND } from '../../values/ground.js';
import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
  BindContext,
  DcLoadContext,
  Device,
  DeviceReport,
  NoiseGenerator,
} from '../device.js';
import { withDefaults } from '../parameters.js';
import { addCurrent, NO_SLOTS } from '../stamp.js';
import { limiterKnee, limitOutput } from './op-amp-limiter.js';
import { isIdealOpAmp, OP_AMP_PARAMETERS } from './op-amp-model.js';
import type { OpAmpRecord } from './record.js';

/** Where an op-amp's output sits: in its linear range, or held near a limit. */
export type OpAmpRegion = 'linear' | 'limited-high' | 'limited-low';

/** The limiter's slope below which the op-amp counts as limited. */
export const LIMITED_SLOPE = 0.5;

/** A compiled op-amp. */
export class OpAmp implements Device {
  readonly nonlinear: boolean;
  readonly name: string;
  private readonly ideal: boolean;
  private readonly gain: number;
  private readonly poleOmega: number;
  private readonly outputResistance: number;
  private readonly offsetVoltage: number;
  private readonly plusCurrent: number;
  private readonly minusCurrent: number;
  private readonly outputHigh: number;
  private readonly outputLow: number;
  private readonly knee: number;
  private k = 0;
  private plus = 0;
  private minus = 0;
  private out = 0;
  /** The ground (trash) index n, where the noise currents return. */
  private groundIndex = 0;
  private readonly noise: { voltage: number; current: number; voltageCorner: number; currentCorner: number };
  // Slots: [out·k, k·plus, k·minus, k·out, k·k]
  private s: Int32Array = NO_SLOTS;
  /** The limiter's value and derivatives at the last evaluation. */
  private readonly limited = new Float64Array(4);
  /** The linear output value u of the previous Newton load (NaN before the first). */
  private uOld = Number.NaN;
  constructor(readonly record: OpAmpRecord) {
    this.name = record.name;
    this.ideal = isIdealOpAmp(record.options);
    const p = withDefaults(OP_AMP_PARAMETERS, record.options ?? {});
    this.gain = p.openLoopGain;
    this.poleOmega = (2 * Math.PI * p.gainBandwidth) / p.openLoopGain;
    this.outputResistance = p.outputResistance;
    this.offsetVoltage = p.inputOffsetVoltage;
    this.plusCurrent = p.inputBiasCurrent + p.inputOffsetCurrent / 2;
    this.minusCurrent = p.inputBiasCurrent - p.inputOffsetCurrent / 2;
    this.outputHigh = this.ideal ? Number.POSITIVE_INFINITY : p.outputHigh;
    this.outputLow = this.ideal ? Number.NEGATIVE_INFINITY : p.outputLow;
    this.knee = limiterKnee(this.outputLow, this.outputHigh);
    this.nonlinear = Number.isFinite(this.outputHigh) || Number.isFinite(this.outputLow);
    this.noise = {
      voltage: p.inputNoiseVoltage,
      current: p.inputNoiseCurrent,
      voltageCorner: p.voltageNoiseCorner,
      currentCorner: p.currentNoiseCorner,
    };
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    const out = ctx.node(this.record.output);
    const k = this.k;
    this.plus = ctx.node(this.record.plus);
    this.minus = ctx.node(this.record.minus);
    this.out = out;
    this.groundIndex = ctx.node(GROUND);
    this.s = ctx.slots([out, k, k, this.plus, k, this.minus, k, out, k, k]);
  }
  /** Write the gain (hr + j·hi) form of the equations into (Re, Im), the gain scaled by `slope`. */
  private stamp(Re: Float64Array, Im: Float64Array | undefined, omega: number, slope: number): void {
    const s = this.s;
    Re[s[0]!]! -= 1;
    if (this.ideal) {
      Re[s[1]!]! += 1;
      Re[s[2]!]! -= 1;
      return;
    }
    // H = A0/(1 + j·u) = A0·(1 − j·u)/(1 + u²), u = ω/ω_p.
    const u = Number.isFinite(this.poleOmega) ? omega / this.poleOmega : 0;
    const d = 1 + u * u;
    const hr = (slope * this.gain) / d;
    const hi = (-slope * this.gain * u) / d;
    Re[s[1]!]! -= hr;
    Re[s[2]!]! += hr;
    if (Im !== undefined) {
      Im[s[1]!]! -= hi;
      Im[s[2]!]! += hi;
    }
    Re[s[3]!]! += 1;
    Re[s[4]!]! += this.outputResistance;
  }
  /**
   * The DC sources of the input stage, scaled by `scale` (source ramping): the bias currents, and the
   * offset voltage in the branch row, where the finite model sees it through the gain `slope`·A0.
   */
  private loadInputErrors(b: Float64Array, scale: number, slope: number): void {
    // Ideal row: v(plus) − v(minus) = −Vos; finite row: … − L'·A0·(v(plus) − v(minus)) = L'·A0·Vos + ….
    b[this.k]! += (this.ideal ? -1 : slope * this.gain) * this.offsetVoltage * scale;
    addCurrent(b, this.plus, b.length - 1, this.plusCurrent * scale);
    addCurrent(b, this.minus, b.length - 1, this.minusCurrent * scale);
  }
  /** The linear output value u = A0·(v(plus) + Vos − v(minus)) at x. */
  private linearOutput(x: Float64Array): number {
    return this.gain * (x[this.plus]! + this.offsetVoltage - x[this.minus]!);
  }
  /**
   * Where to take the limiter's tangent: at u itself, unless the last load sat on one limit's knee
   * and u has jumped past the other (a flat tangent on each rail in turn would make Newton bounce
   * between them); then at the middle of the range, where the tangent is the linear gain.
   */
  private limitStep(u: number): number {
    const old = this.uOld;
    const high = this.outputHigh - this.knee;
    const low = this.outputLow + this.knee;
    // Only possible with both limits finite (an infinite one is never reached).
    const crossed = (old > high && u < low) || (old < low && u > high);
    return crossed ? 0.5 * (this.outputHigh + this.outputLow) : u;
  }
  load(ctx: DcLoadContext): void {
    if (!this.nonlinear) {
      this.stamp(ctx.A, undefined, 0, 1);
      this.loadInputErrors(ctx.b, ctx.sourceScale, 1);
      return;
    }
    const raw = this.linearOutput(ctx.x);
    const u = ctx.first ? raw : this.limitStep(raw);
    if (u !== raw) ctx.limited = true;
    this.uOld = u;
    const y = limitOutput(u, this.outputLow, this.outputHigh, this.knee, this.limited);
    // The tangent at u: v(out) + R·i − L'·A0·(v(plus) − v(minus)) = L(u) − L'·u + L'·A0·Vos.
    this.stamp(ctx.A, undefined, 0, y[1]!);
    this.loadInputErrors(ctx.b, ctx.sourceScale, y[1]!);
    ctx.b[this.k]! += y[0]! - y[1]! * u;
  }
  /** The limiter's slope L' at x: how much of the linear gain the small signal sees (1 without limits). */
  private slopeAt(x: Float64Array): number {
    if (!this.nonlinear) return 1;
    return limitOutput(this.linearOutput(x), this.outputLow, this.outputHigh, this.knee, this.limited)[1]!;
  }
  loadAc(ctx: AcLoadContext): void {
    this.stamp(ctx.Ar, ctx.Ai, ctx.omega, this.slopeAt(ctx.x));
  }
  /**
   * The branch row times (1 + s/ω_p): (v(out) + R_out·i)·(1 + s/ω_p) = L'·A0·(v(plus) − v(minus)), so
   * that the op-amp's pole is a natural frequency of the circuit (L' the limiter's slope at x).
   */
  loadPencil(G: Float64Array, C: Float64Array, x: Float64Array): void {
    this.stamp(G, undefined, 0, this.slopeAt(x));
    if (this.ideal || !Number.isFinite(this.poleOmega)) return;
    const s = this.s;
    C[s[3]!]! += 1 / this.poleOmega;
    C[s[4]!]! += this.outputResistance / this.poleOmega;
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
  /** Where the output sits: limited when the limiter's slope at the solution is below one half. */
  region(x: Float64Array): OpAmpRegion {
    if (!this.nonlinear) return 'linear';
    const u = this.linearOutput(x);
    const y = limitOutput(u, this.outputLow, this.outputHigh, this.knee, this.limited);
    if (y[1]! >= LIMITED_SLOPE) return 'linear';
    // With one limit infinite the midpoint is infinite too, and the comparison names the finite one.
    return u > 0.5 * (this.outputHigh + this.outputLow) ? 'limited-high' : 'limited-low';
  }
  report(x: Float64Array): DeviceReport {
    return {
      differentialInput: x[this.plus]! - x[this.minus]!,
      outputVoltage: x[this.out]!,
      region: this.region(x),
    };
  }
  /**
   * Input voltage noise e_n²·(1 + f_v/f) in series with the plus input, and input current noise
   * i_n²·(1 + f_i/f) from each input to ground. The voltage enters the branch equation: with the plus
   * input at v(plus) + e the ideal row v(plus) − v(minus) = 0 gains −e on its right-hand side, the
   * finite row v(out) + R_out·i − H·(v(plus) − v(minus)) = 0 gains H·e.
   */
  noiseGenerators(x: Float64Array): readonly NoiseGenerator[] {
    const { voltage, current, voltageCorner, currentCorner } = this.noise;
    const out: NoiseGenerator[] = [];
    // A limited output passes the input's noise on through the limiter's slope at the bias.
    const slope = this.slopeAt(x);
    if (voltage > 0) {
      const white = voltage * voltage;
      out.push({
        mechanism: 'input-voltage',
        from: this.groundIndex,
        to: this.k,
        white,
        flicker: white * voltageCorner,
        weightAt: (omega, weight) => this.inputWeight(omega, weight, slope),
      });
    }
    if (current > 0) {
      const white = current * current;
      const flicker = white * currentCorner;
      out.push({
        mechanism: 'input-current',
        terminal: 'plus',
        from: this.plus,
        to: this.groundIndex,
        white,
        flicker,
      });
      out.push({
        mechanism: 'input-current',
        terminal: 'minus',
        from: this.minus,
        to: this.groundIndex,
        white,
        flicker,
      });
    }
    return out;
  }
  /** The factor of a voltage at the plus input in the branch equation's right-hand side: −1, or L'·H(jω). */
  private inputWeight(omega: number, weight: Float64Array, slope: number): void {
    if (this.ideal) {
      weight[0] = -1;
      weight[1] = 0;
      return;
    }
    const u = Number.isFinite(this.poleOmega) ? omega / this.poleOmega : 0;
    const d = 1 + u * u;
    weight[0] = (slope * this.gain) / d;
    weight[1] = (-slope * this.gain * u) / d;
  }
}
