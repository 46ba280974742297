/** The inductor: a short at DC, v(a) − v(b) = jωL·i at angular frequency ω. Its current is an unknown. */

import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
  BindContext,
  DcLoadContext,
  Device,
} from '../device.js';
import { addBranchIncidence, branchPairs, NO_SLOTS } from '../stamp.js';
import type { InductorRecord } from './record.js';

/** A compiled inductor. */
export class Inductor implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private k = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: InductorRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: InductorRecord): boolean {
    this.record = record;
    return true;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    const a = ctx.node(this.record.a);
    const b = ctx.node(this.record.b);
    this.s = ctx.slots([...branchPairs(a, b, this.k), this.k, this.k]);
  }
  load(ctx: DcLoadContext): void {
    addBranchIncidence(ctx.A, this.s, 0);
  }
  loadAc(ctx: AcLoadContext): void {
    addBranchIncidence(ctx.Ar, this.s, 0);
    ctx.Ai[this.s[4]!]! -= ctx.omega * this.record.inductance;
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _omega: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
}
