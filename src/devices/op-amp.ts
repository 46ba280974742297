/**
 * The op-amp. Its output current (flowing out of the output terminal into the circuit) is an unknown.
 * Ideal: a nullor, the branch row forces v(plus) = v(minus) and the output supplies whatever current
 * that takes. Non-ideal: v(out) + R_out·i = H(jω)·(v(plus) − v(minus)) with the single-pole gain
 * H(jω) = A0/(1 + jω/ω_p) and ω_p = 2π·GBW/A0. The inputs draw no current.
 */
import { GROUND, type OpAmpRecord } from '../circuit/elements.js';
import type {
  AcLoadContext,
  AllocationContext,
  BindContext,
  DcLoadContext,
  Device,
  NoiseGenerator,
} from './device.js';
import { OP_AMP_PARAMETERS } from './op-amp-model.js';
import { withDefaults } from './parameters.js';

/** A compiled op-amp. */
export class OpAmp implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private readonly ideal: boolean;
  private readonly gain: number;
  private readonly poleOmega: number;
  private readonly outputResistance: number;
  private readonly noise: { voltage: number; current: number; voltageCorner: number; currentCorner: number };
  private k = 0;
  private plus = 0;
  private minus = 0;
  /** The ground (trash) index n, where the noise currents return. */
  private groundIndex = 0;
  // Slots: [out·k, k·plus, k·minus, k·out, k·k]
  private s: Int32Array = new Int32Array(0);
  constructor(readonly record: OpAmpRecord) {
    this.name = record.name;
    this.ideal = record.options === undefined || !FINITE_GAIN_OPTIONS.some((key) => key in record.options!);
    const p = withDefaults(OP_AMP_PARAMETERS, record.options ?? {});
    this.noise = {
      voltage: p.inputNoiseVoltage,
      current: p.inputNoiseCurrent,
      voltageCorner: p.voltageNoiseCorner,
      currentCorner: p.currentNoiseCorner,
    };
    this.gain = p.openLoopGain;
    this.poleOmega = (2 * Math.PI * p.gainBandwidth) / p.openLoopGain;
    this.outputResistance = p.outputResistance;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    const out = ctx.node(this.record.output);
    const k = this.k;
    this.plus = ctx.node(this.record.plus);
    this.minus = ctx.node(this.record.minus);
    this.groundIndex = ctx.node(GROUND);
    this.s = ctx.slots([out, k, k, ctx.node(this.record.plus), k, ctx.node(this.record.minus), k, out, k, k]);
  }
  /** Write the gain (hr + j·hi) form of the equations into (Re, Im). */
  private stamp(Re: Float64Array, Im: Float64Array | undefined, omega: number): void {
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
    const hr = this.gain / d;
    const hi = (-this.gain * u) / d;
    Re[s[1]!]! -= hr;
    Re[s[2]!]! += hr;
    if (Im !== undefined) {
      Im[s[1]!]! -= hi;
      Im[s[2]!]! += hi;
    }
    Re[s[3]!]! += 1;
    Re[s[4]!]! += this.outputResistance;
  }
  load(ctx: DcLoadContext): void {
    this.stamp(ctx.A, undefined, 0);
  }
  loadAc(ctx: AcLoadContext): void {
    this.stamp(ctx.Ar, ctx.Ai, ctx.omega);
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _x: Float64Array, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
  /**
   * Input voltage noise e_n²·(1 + f_v/f) in series with the plus input, and input current noise
   * i_n²·(1 + f_i/f) from each input to ground. The voltage enters the branch equation: with the plus
   * input at v(plus) + e the ideal row v(plus) − v(minus) = 0 gains −e on its right-hand side, the
   * finite row v(out) + R_out·i − H·(v(plus) − v(minus)) = 0 gains H·e.
   */
  noiseGenerators(_x: Float64Array): readonly NoiseGenerator[] {
    const { voltage, current, voltageCorner, currentCorner } = this.noise;
    const out: NoiseGenerator[] = [];
    if (voltage > 0) {
      const white = voltage * voltage;
      out.push({
        mechanism: 'input-voltage',
        from: this.groundIndex,
        to: this.k,
        white,
        flicker: white * voltageCorner,
        weightAt: (omega, weight) => this.inputWeight(omega, weight),
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
  /** The factor of a voltage at the plus input in the branch equation's right-hand side: −1, or H(jω). */
  private inputWeight(omega: number, weight: Float64Array): void {
    if (this.ideal) {
      weight[0] = -1;
      weight[1] = 0;
      return;
    }
    const u = Number.isFinite(this.poleOmega) ? omega / this.poleOmega : 0;
    const d = 1 + u * u;
    weight[0] = this.gain / d;
    weight[1] = (-this.gain * u) / d;
  }
}

/** The options that make an op-amp a finite-gain model; any other option keeps the ideal one. */
const FINITE_GAIN_OPTIONS = ['openLoopGain', 'gainBandwidth', 'outputResistance'] as const;
