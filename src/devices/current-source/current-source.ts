/** The independent current source: its value flows from `from`, through the source, into `to`. */

import type { AcLoadContext, BiasPoint, BindContext, Conditions, DcLoadContext, Device } from '../device.js';
import { addCurrent } from '../stamp.js';
import type { CurrentSourceRecord } from './record.js';

/** A compiled current source. Its DC value can be replaced through the analysis conditions (a sweep). */
export class CurrentSource implements Device {
  readonly nonlinear = false;
  readonly name: string;
  /** The DC value in A: the record's, or the one the analysis conditions give (a sweep point's). */
  dc: number;
  private from = 0;
  private to = 0;
  constructor(public record: CurrentSourceRecord) {
    this.name = record.name;
    this.dc = record.dc;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: CurrentSourceRecord): boolean {
    this.record = record;
    this.dc = record.dc;
    return true;
  }
  bind(ctx: BindContext): void {
    this.from = ctx.node(this.record.from);
    this.to = ctx.node(this.record.to);
  }
  prepare(conditions: Conditions): void {
    this.dc = conditions.sourceValues?.get(this.name) ?? this.record.dc;
  }
  load(ctx: DcLoadContext): void {
    addCurrent(ctx.b, this.from, this.to, this.dc * ctx.sourceScale);
  }
  loadAc(ctx: AcLoadContext): void {
    const { magnitude, phase } = this.record.ac;
    const theta = (phase * Math.PI) / 180;
    addCurrent(ctx.br, this.from, this.to, magnitude * Math.cos(theta));
    addCurrent(ctx.bi, this.from, this.to, magnitude * Math.sin(theta));
  }
  current(_x: Float64Array, conditions: Conditions): number {
    this.prepare(conditions);
    return this.dc;
  }
  acCurrent(_xr: Float64Array, _xi: Float64Array, _omega: number, _at: BiasPoint, out: Float64Array): void {
    const { magnitude, phase } = this.record.ac;
    const theta = (phase * Math.PI) / 180;
    out[0] = magnitude * Math.cos(theta);
    out[1] = magnitude * Math.sin(theta);
  }
}
