/**
 * The loop probe: a 0 V element placed in series with a feedback loop. Its current (from `from`
 * through the probe to `to`) is an unknown, so it is a short at DC and in AC, carries no excitation,
 * and can sense the current of a ccvs or cccs. The loop-gain analysis injects its test voltage and
 * test current at it.
 */

import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
  BindContext,
  DcLoadContext,
  Device,
} from '../device.js';
import { addBranchIncidence, branchSlots, NO_SLOTS } from '../stamp.js';
import type { LoopProbeRecord } from './record.js';

/** A compiled loop probe. */
export class LoopProbe implements Device {
  readonly nonlinear = false;
  readonly name: string;
  /** The branch-current unknown (the current from `from` to `to`). */
  branch = 0;
  /** The unknown of the `from` node (the ground index n when grounded). */
  fromNode = 0;
  /** The unknown of the `to` node (the ground index n when grounded). */
  toNode = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(readonly record: LoopProbeRecord) {
    this.name = record.name;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.branch = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    this.fromNode = ctx.node(this.record.from);
    this.toNode = ctx.node(this.record.to);
    this.s = branchSlots(ctx, this.fromNode, this.toNode, this.branch);
  }
  load(ctx: DcLoadContext): void {
    addBranchIncidence(ctx.A, this.s, 0);
  }
  loadAc(ctx: AcLoadContext): void {
    addBranchIncidence(ctx.Ar, this.s, 0);
  }
  current(x: Float64Array): number {
    return x[this.branch]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _omega: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.branch]!;
    out[1] = xi[this.branch]!;
  }
}
