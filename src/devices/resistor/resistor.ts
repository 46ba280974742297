/** The resistor: i = (v(a) − v(b))/R at DC and at every frequency. */

import type {
  AcLoadContext,
  BiasPoint,
  BindContext,
  Conditions,
  DcLoadContext,
  Device,
  NoiseGenerator,
} from '../device.js';
import { thermalNoise } from '../noise-densities.js';
import { addConductance, conductanceSlots, NO_SLOTS } from '../stamp.js';
import type { ResistorRecord } from './record.js';

/** A compiled resistor. */
export class Resistor implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private a = 0;
  private b = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: ResistorRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: ResistorRecord): boolean {
    this.record = record;
    return true;
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
  acCurrent(xr: Float64Array, xi: Float64Array, _omega: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = (xr[this.a]! - xr[this.b]!) / this.record.resistance;
    out[1] = (xi[this.a]! - xi[this.b]!) / this.record.resistance;
  }
  /** Thermal noise 4kT/R between its terminals, unless it was built noiseless. */
  noiseGenerators(_x: Float64Array, { temperature }: Conditions): readonly NoiseGenerator[] {
    if (this.record.noiseless === true) return [];
    const white = thermalNoise(temperature, this.record.resistance);
    return [{ mechanism: 'thermal', from: this.a, to: this.b, white, flicker: 0, ownCurrent: true }];
  }
}
