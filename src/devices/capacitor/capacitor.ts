/** The capacitor: open at DC, admittance jωC at angular frequency ω. */

import type { AcLoadContext, BiasPoint, BindContext, DcLoadContext, Device } from '../device.js';
import { addConductance, conductanceSlots, NO_SLOTS } from '../stamp.js';
import type { CapacitorRecord } from './record.js';

/** A compiled capacitor. */
export class Capacitor implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private a = 0;
  private b = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: CapacitorRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: CapacitorRecord): boolean {
    this.record = record;
    return true;
  }
  bind(ctx: BindContext): void {
    this.a = ctx.node(this.record.a);
    this.b = ctx.node(this.record.b);
    this.s = conductanceSlots(ctx, this.a, this.b);
  }
  load(_ctx: DcLoadContext): void {}
  loadAc(ctx: AcLoadContext): void {
    addConductance(ctx.Ai, this.s, 0, ctx.omega * this.record.capacitance);
  }
  current(_x: Float64Array): number {
    return 0;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, omega: number, _at: BiasPoint, out: Float64Array): void {
    const wc = omega * this.record.capacitance;
    const vr = xr[this.a]! - xr[this.b]!;
    const vi = xi[this.a]! - xi[this.b]!;
    out[0] = -wc * vi;
    out[1] = wc * vr;
  }
}
