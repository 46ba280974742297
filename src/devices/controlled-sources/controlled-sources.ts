/**
 * The four linear controlled sources. Voltage-controlled ones read two nodes; current-controlled ones
 * read the branch-current unknown of their controlling element. Voltage outputs own a branch current.
 */

import type {
  AcLoadContext,
  AllocationContext,
  BiasPoint,
  BindContext,
  DcLoadContext,
  Device,
} from '../device.js';
import {
  addBranchIncidence,
  addTransconductance,
  branchPairs,
  NO_SLOTS,
  transconductanceSlots,
} from '../stamp.js';
import type { CccsRecord, CcvsRecord, VccsRecord, VcvsRecord } from './records.js';

/** v(outPlus) − v(outMinus) = gain·(v(controlPlus) − v(controlMinus)); the output current is an unknown. */
export class Vcvs implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private k = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: VcvsRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: VcvsRecord): boolean {
    this.record = record;
    return true;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    const r = this.record;
    const cp = ctx.node(r.controlPlus);
    const cm = ctx.node(r.controlMinus);
    this.s = ctx.slots([
      ...branchPairs(ctx.node(r.outPlus), ctx.node(r.outMinus), this.k),
      this.k,
      cp,
      this.k,
      cm,
    ]);
  }
  private stamp(A: Float64Array): void {
    addBranchIncidence(A, this.s, 0);
    A[this.s[4]!]! -= this.record.gain;
    A[this.s[5]!]! += this.record.gain;
  }
  load(ctx: DcLoadContext): void {
    this.stamp(ctx.A);
  }
  loadAc(ctx: AcLoadContext): void {
    this.stamp(ctx.Ar);
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
}

/** gm·(v(controlPlus) − v(controlMinus)) flows from outFrom through the source into outTo. */
export class Vccs implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private cp = 0;
  private cm = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: VccsRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: VccsRecord): boolean {
    this.record = record;
    return true;
  }
  bind(ctx: BindContext): void {
    const r = this.record;
    this.cp = ctx.node(r.controlPlus);
    this.cm = ctx.node(r.controlMinus);
    this.s = transconductanceSlots(ctx, ctx.node(r.outFrom), ctx.node(r.outTo), this.cp, this.cm);
  }
  load(ctx: DcLoadContext): void {
    addTransconductance(ctx.A, this.s, 0, this.record.transconductance);
  }
  loadAc(ctx: AcLoadContext): void {
    addTransconductance(ctx.Ar, this.s, 0, this.record.transconductance);
  }
  current(x: Float64Array): number {
    return this.record.transconductance * (x[this.cp]! - x[this.cm]!);
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = this.record.transconductance * (xr[this.cp]! - xr[this.cm]!);
    out[1] = this.record.transconductance * (xi[this.cp]! - xi[this.cm]!);
  }
}

/** v(outPlus) − v(outMinus) = r·i(control); the output current is an unknown. */
export class Ccvs implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private k = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: CcvsRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: CcvsRecord): boolean {
    this.record = record;
    return true;
  }
  allocateBranches(ctx: AllocationContext): void {
    this.k = ctx.branch(this.name);
  }
  bind(ctx: BindContext): void {
    const r = this.record;
    const control = ctx.branchOf(r.control);
    this.s = ctx.slots([...branchPairs(ctx.node(r.outPlus), ctx.node(r.outMinus), this.k), this.k, control]);
  }
  private stamp(A: Float64Array): void {
    addBranchIncidence(A, this.s, 0);
    A[this.s[4]!]! -= this.record.transresistance;
  }
  load(ctx: DcLoadContext): void {
    this.stamp(ctx.A);
  }
  loadAc(ctx: AcLoadContext): void {
    this.stamp(ctx.Ar);
  }
  current(x: Float64Array): number {
    return x[this.k]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = xr[this.k]!;
    out[1] = xi[this.k]!;
  }
}

/** gain·i(control) flows from outFrom through the source into outTo. */
export class Cccs implements Device {
  readonly nonlinear = false;
  readonly name: string;
  private control = 0;
  private s: Int32Array = NO_SLOTS;
  constructor(public record: CccsRecord) {
    this.name = record.name;
  }
  /** Take other values of the same element: its unknowns and slots stay. */
  revalue(record: CccsRecord): boolean {
    this.record = record;
    return true;
  }
  bind(ctx: BindContext): void {
    const r = this.record;
    this.control = ctx.branchOf(r.control);
    this.s = ctx.slots([ctx.node(r.outFrom), this.control, ctx.node(r.outTo), this.control]);
  }
  private stamp(A: Float64Array): void {
    A[this.s[0]!]! += this.record.gain;
    A[this.s[1]!]! -= this.record.gain;
  }
  load(ctx: DcLoadContext): void {
    this.stamp(ctx.A);
  }
  loadAc(ctx: AcLoadContext): void {
    this.stamp(ctx.Ar);
  }
  current(x: Float64Array): number {
    return this.record.gain * x[this.control]!;
  }
  acCurrent(xr: Float64Array, xi: Float64Array, _w: number, _at: BiasPoint, out: Float64Array): void {
    out[0] = this.record.gain * xr[this.control]!;
    out[1] = this.record.gain * xi[this.control]!;
  }
}
