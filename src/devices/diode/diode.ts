/**
 * The junction diode: Shockley's law with emission coefficient, reverse breakdown, an ohmic series
 * resistance through an internal node, depletion and diffusion capacitance.
 *
 * Junction current (anode → cathode) at junction voltage v, with nVt = n·k·T/q:
 *   i(v) = I_S·(e^(v/nVt) − 1) − I_S·e^(−(v + V_BR)/nVt) + g_j·v (g_j: the junction conductance)
 * The breakdown term is e-fold steeper per nVt below −V_BR, mirroring the forward knee.
 */

import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
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
  criticalVoltage,
  depletionCapacitance,
  EXP_LIMIT,
  EXP_SLOPE_ABOVE_LIMIT,
  limitJunctionStep,
  saturationCurrentAt,
} from '../junction.js';
import { flickerNoise, shotNoise, thermalNoise } from '../noise-densities.js';
import { revaluedDefaults, sharedDefaults } from '../parameters.js';
import { addConductance, addCurrent, conductanceSlots, NO_SLOTS } from '../stamp.js';
import { DIODE_PARAMETERS } from './diode-model.js';
import type { DiodeRecord } from './record.js';

/** A compiled diode. */
export class Diode implements Device {
  readonly nonlinear = true;
  readonly name: string;
  private p: Readonly<Record<keyof typeof DIODE_PARAMETERS, number>>;
  private a = 0;
  private c = 0;
  /** The junction's anode side: the anode itself, or the internal node behind the series resistance. */
  private j = 0;
  private sJunction: Int32Array = NO_SLOTS;
  private sSeries: Int32Array = NO_SLOTS;
  private is = 0;
  private nVt = 0;
  private vCritical = 0;
  private vOld = 0;
  private junctionConductance = 0;
  /** The temperature and thermal voltage the constants below were last prepared for (NaN: never). */
  private preparedTemperature = Number.NaN;
  private preparedThermalVoltage = Number.NaN;
  // Constants of the load, taken from the parameters once instead of at every evaluation.
  private breakdownVoltage = Number.POSITIVE_INFINITY;
  private seriesConductance = 0;
  // Scratch of the last evaluation: current and conductance.
  private i = 0;
  private g = 0;
  private gDiffusion = 0;

  constructor(public record: DiodeRecord) {
    this.name = record.name;
    this.p = sharedDefaults(DIODE_PARAMETERS, record.model);
    this.take(this.p);
  }
  /** Take other model values; a series resistance appearing or vanishing needs a new binding. */
  revalue(record: DiodeRecord): boolean {
    const series = record.model.seriesResistance ?? DIODE_PARAMETERS.seriesResistance.defaultValue;
    if (series > 0 !== this.p.seriesResistance > 0) return false;
    this.p = revaluedDefaults(DIODE_PARAMETERS, this.p, this.record.model, record.model);
    this.record = record;
    this.take(this.p);
    return true;
  }
  /** The constants that follow from the model values alone; the next prepare redoes the rest. */
  private take(p: typeof this.p): void {
    this.breakdownVoltage = p.breakdownVoltage;
    this.seriesConductance = p.seriesResistance > 0 ? 1 / p.seriesResistance : 0;
    this.preparedTemperature = Number.NaN;
    this.preparedThermalVoltage = Number.NaN;
  }
  allocateNodes(ctx: AllocationContext): void {
    if (this.p.seriesResistance > 0) this.j = ctx.internalNode(this.name, 'junction');
  }
  bind(ctx: BindContext): void {
    this.a = ctx.node(this.record.anode);
    this.c = ctx.node(this.record.cathode);
    if (this.p.seriesResistance > 0) this.sSeries = conductanceSlots(ctx, this.a, this.j);
    else this.j = this.a;
    this.sJunction = conductanceSlots(ctx, this.j, this.c);
  }
  prepare({ temperature, thermalVoltage, junctionConductance }: Conditions): void {
    this.junctionConductance = junctionConductance;
    // Every solve prepares again; at unchanged conditions the temperature laws give the same numbers.
    if (temperature === this.preparedTemperature && thermalVoltage === this.preparedThermalVoltage) return;
    this.preparedTemperature = temperature;
    this.preparedThermalVoltage = thermalVoltage;
    const p = this.p;
    this.nVt = p.emissionCoefficient * thermalVoltage;
    this.is = saturationCurrentAt(
      p.saturationCurrent,
      temperature,
      p.referenceTemperature,
      p.bandgap,
      p.saturationCurrentTemperatureExponent,
      p.emissionCoefficient,
    );
    this.vCritical = criticalVoltage(this.nVt, this.is);
  }
  /** Evaluate current and conductance at junction voltage v into the scratch fields. */
  private evaluate(v: number): void {
    const gJunction = this.junctionConductance;
    const is = this.is;
    const nVt = this.nVt;
    const a = v / nVt;
    // One exponential per term: below the limit the slope of boundedExp is its value.
    const e = boundedExp(a);
    const gf = (is * (a <= EXP_LIMIT ? e : EXP_SLOPE_ABOVE_LIMIT)) / nVt;
    let i = is * (e - 1);
    let g = gf;
    const bv = this.breakdownVoltage;
    if (bv !== Number.POSITIVE_INFINITY) {
      const ab = -(v + bv) / nVt;
      const eb = boundedExp(ab);
      i -= is * eb;
      g += (is * (ab <= EXP_LIMIT ? eb : EXP_SLOPE_ABOVE_LIMIT)) / nVt;
    }
    this.i = i + gJunction * v;
    this.g = g + gJunction;
    this.gDiffusion = gf;
  }
  /** Limit a step on both knees: the forward one, and the breakdown one mirrored. */
  private limit(v: number): number {
    let out = limitJunctionStep(v, this.vOld, this.nVt, this.vCritical);
    const bv = this.breakdownVoltage;
    if (bv !== Number.POSITIVE_INFINITY && out < -bv) {
      out = -bv - limitJunctionStep(-(out + bv), -(this.vOld + bv), this.nVt, this.vCritical);
    }
    return out;
  }
  load(ctx: DcLoadContext): void {
    const x = ctx.x;
    const raw = x[this.j]! - x[this.c]!;
    const v = ctx.first ? raw : this.limit(raw);
    if (v !== raw) ctx.limited = true;
    this.vOld = v;
    this.evaluate(v);
    addConductance(ctx.A, this.sJunction, 0, this.g);
    addCurrent(ctx.b, this.j, this.c, this.i - this.g * v);
    if (this.seriesConductance > 0) addConductance(ctx.A, this.sSeries, 0, this.seriesConductance);
  }
  loadAc(ctx: AcLoadContext): void {
    this.prepare(ctx.conditions);
    const v = ctx.x[this.j]! - ctx.x[this.c]!;
    this.evaluate(v);
    addConductance(ctx.Ar, this.sJunction, 0, this.g);
    addConductance(ctx.Ai, this.sJunction, 0, ctx.omega * this.capacitanceAt(v));
    if (this.seriesConductance > 0) addConductance(ctx.Ar, this.sSeries, 0, this.seriesConductance);
  }
  /** The small-signal current anode to cathode: (g + jωC) times the junction voltage phasor. */
  acCurrent(xr: Float64Array, xi: Float64Array, omega: number, at: BiasPoint, out: Float64Array): void {
    const { x, conditions } = at;
    this.prepare(conditions);
    const v = x[this.j]! - x[this.c]!;
    this.evaluate(v);
    const b = omega * this.capacitanceAt(v);
    const vr = xr[this.j]! - xr[this.c]!;
    const vi = xi[this.j]! - xi[this.c]!;
    out[0] = this.g * vr - b * vi;
    out[1] = this.g * vi + b * vr;
  }
  private capacitanceAt(v: number): number {
    const p = this.p;
    return (
      depletionCapacitance(p.junctionCapacitance, v, p.junctionPotential, p.gradingCoefficient) +
      p.transitTime * this.gDiffusion
    );
  }
  current(x: Float64Array, conditions: Conditions): number {
    this.prepare(conditions);
    this.evaluate(x[this.j]! - x[this.c]!);
    return this.i;
  }
  report(x: Float64Array, conditions: Conditions): DeviceReport {
    this.prepare(conditions);
    const v = x[this.j]! - x[this.c]!;
    this.evaluate(v);
    return {
      voltage: x[this.a]! - x[this.c]!,
      junctionVoltage: v,
      current: this.i,
      conductance: this.g,
      resistance: 1 / this.g,
      capacitance: this.capacitanceAt(v),
    };
  }
  junctions(_x: Float64Array, conditions: Conditions): readonly JunctionProbe[] {
    this.prepare(conditions);
    return [{ junction: 'pn', plus: this.j, minus: this.c, scale: this.nVt }];
  }
  /**
   * The junction current's curvature: the k-th derivative of I_S·e^(v/nVt) is I_S·e^(v/nVt)/nVt^k, and
   * that of the breakdown term −I_S·e^(−(v+V_BR)/nVt) is −I_S·e^(−(v+V_BR)/nVt)·(−1/nVt)^k.
   */
  nonlinearCurrents(x: Float64Array, conditions: Conditions): readonly NonlinearCurrent[] {
    this.prepare(conditions);
    const nVt = this.nVt;
    const v = x[this.j]! - x[this.c]!;
    const forward = this.is * boundedExpCurvature(v / nVt);
    const bv = this.p.breakdownVoltage;
    const reverse = bv === Number.POSITIVE_INFINITY ? 0 : this.is * boundedExpCurvature(-(v + bv) / nVt);
    return [
      {
        junction: 'pn',
        from: this.j,
        to: this.c,
        controls: [{ plus: this.j, minus: this.c }],
        second: [(forward - reverse) / (nVt * nVt)],
        third: [(forward + reverse) / (nVt * nVt * nVt)],
      },
    ];
  }
  /**
   * Shot noise 2q·(i + 2·I_S) of the exponential current i = I_S·(e^(v/nVt) − 1) (at rest it is 4q·I_S,
   * the junction's thermal noise) plus 2q·|i_bd| of the breakdown current; flicker noise
   * K_f·|i|^a_f/f; thermal noise of the series resistance.
   */
  noiseGenerators(x: Float64Array, conditions: Conditions): readonly NoiseGenerator[] {
    this.prepare(conditions);
    const { temperature } = conditions;
    const p = this.p;
    const v = x[this.j]! - x[this.c]!;
    this.evaluate(v);
    const exponential = this.is * (boundedExp(v / this.nVt) - 1);
    const bv = this.breakdownVoltage;
    const breakdown = bv === Number.POSITIVE_INFINITY ? 0 : this.is * boundedExp(-(v + bv) / this.nVt);
    const shot = shotNoise(exponential + 2 * this.is) + shotNoise(breakdown);
    const out: NoiseGenerator[] = [
      { mechanism: 'shot', from: this.j, to: this.c, white: shot, flicker: 0, ownCurrent: true },
    ];
    const flicker = flickerNoise(p.flickerCoefficient, p.flickerExponent, this.i);
    if (flicker > 0) {
      out.push({ mechanism: 'flicker', from: this.j, to: this.c, white: 0, flicker, ownCurrent: true });
    }
    if (p.seriesResistance > 0) {
      const white = thermalNoise(temperature, p.seriesResistance);
      out.push({ mechanism: 'thermal', from: this.a, to: this.j, white, flicker: 0 });
    }
    return out;
  }
}
