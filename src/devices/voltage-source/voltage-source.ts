/** The independent voltage source: v(plus) − v(minus) = E; its current (plus → minus through it) is an unknown. */

import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
  BindContext,
  Conditions,
  DcLoadContext,
  Device,
} from '../device.js';
import { addBranchIncidence, branchSlots, NO_SLOTS } from '../stamp.js';
import type { VoltageSourceRecord } from './record.js';

/** A compiled voltage source. Its DC value can be replaced through the analysis conditions (a sweep). */
export class VoltageSource implements Device {
  readonly nonlinear = false;
  readonly name: string;
  /** The DC value in V: the record's, or the one the analysis conditions give (a sweep point's). */
  dc: number;
  private k = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: VoltageSourceRecord) {
    this.name = record.name;
    this.dc = record.dc;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: VoltageSourceRecord): boolean {
    this.record = record;
    this.dc = record.dc;
    return true;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    this.s = branchSlots(ctx, ctx.node(this.record.plus), ctx.node(this.record.minus), this.k);
  }
  prepare(conditions: Conditions): void {
    this.dc = conditions.sourceValues?.get(this.name) ?? this.record.dc;
  }
  load(ctx: DcLoadContext): void {
    addBranchIncidence(ctx.A, this.s, 0);
    ctx.b[this.k]! += this.dc * ctx.sourceScale;
  }
  loadAc(ctx: AcLoadContext): void {
    addBranchIncidence(ctx.Ar, this.s, 0);
    const { magnitude, phase } = this.record.ac;
    const theta = (phase * Math.PI) / 180;
    ctx.br[this.k]! += magnitude * Math.cos(theta);
    ctx.bi[this.k]! += magnitude * Math.sin(theta);
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _omega: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
}
