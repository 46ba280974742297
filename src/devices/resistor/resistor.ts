/** The resistor: i = (v(a) − v(b))/R at DC and at every frequency. */

import type { AcLoadContext, BindContext, DcLoadContext, Device } from '../device.js';
import { addConductance, conductanceSlots } from '../stamp.js';
import type { ResistorRecord } from './record.js';

/** A compiled resistor. */
export class Resistor implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private a = 0;
  private b = 0;
  private s: Int32Array = new Int32Array(0);
  constructor(readonly record: ResistorRecord) {
    this.name = record.name;
  }
  bind(ctx: BindContext): void {
    this.a = ctx.node(this.record.a);
    this.b = ctx.node(this.record.b);
    this.s = conductanceSlots(ctx, this.a, this.b);
  }
  load(ctx: DcLoadContext): void {
    addConductance(ctx.A, this.s, 0, 1 / this.record.resistance);
  }
  loadAc(ctx: AcLoadContext): void {
    addConductance(ctx.Ar, this.s, 0, 1 / this.record.resistance);
  }
  current(x: Float64Array): number {
    return (x[this.a]! - x[this.b]!) / this.record.resistance;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _omega: number, _x: Float64Array, out: Float64Array): void {
    out[0] = (xr[this.a]! - xr[this.b]!) / this.record.resistance;
    out[1] = (xi[this.a]! - xi[this.b]!) / this.record.resistance;
  }
}
