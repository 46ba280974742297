/**
 * Stamping helpers: the four ways a lumped element writes into the nodal equations. Each takes slots
 * obtained once at bind time and adds values; none allocates.
 *
 * Row r of the equations says "the currents leaving node r sum to the injected current b[r]".
 */
import type { BindContext } from './device.js';

/** The slots of a device not bound yet: one shared empty array instead of one per field per device. */
export const NO_SLOTS: Int32Array = new Int32Array(0);

/** Slots of a conductance between unknowns a and b: [aa, ab, ba, bb]. */
export function conductanceSlots(ctx: BindContext, a: number, b: number): Int32Array {
  return ctx.slots([a, a, a, b, b, a, b, b]);
}

/** Add conductance g at slots s[o … o+3] made by {@link conductanceSlots}. */
export function addConductance(A: Float64Array, s: Int32Array, o: number, g: number): void {
  A[s[o]!]! += g;
  A[s[o + 1]!]! -= g;
  A[s[o + 2]!]! -= g;
  A[s[o + 3]!]! += g;
}

/** Slots of a transconductance: current g·(v(cp) − v(cm)) leaving `from` and entering `to`: [from·cp, from·cm, to·cp, to·cm]. */
export function transconductanceSlots(
  ctx: BindContext,
  from: number,
  to: number,
  cp: number,
  cm: number,
): Int32Array {
  return ctx.slots([from, cp, from, cm, to, cp, to, cm]);
}

/** Add transconductance g at slots s[o … o+3] made by {@link transconductanceSlots}. */
export function addTransconductance(A: Float64Array, s: Int32Array, o: number, g: number): void {
  A[s[o]!]! += g;
  A[s[o + 1]!]! -= g;
  A[s[o + 2]!]! -= g;
  A[s[o + 3]!]! += g;
}

/** A current i flowing from unknown `from` through the element into `to` moves to the right-hand side. */
export function addCurrent(b: Float64Array, from: number, to: number, i: number): void {
  b[from]! -= i;
  b[to]! += i;
}

/**
 * Slots of a voltage-defined branch with current unknown k from node p to node m:
 * KCL entries [p·k, m·k] and the branch-row entries [k·p, k·m].
 */
export function branchSlots(ctx: BindContext, p: number, m: number, k: number): Int32Array {
  return ctx.slots(branchPairs(p, m, k));
}

/**
 * The (row, column) pairs of branch k's incidence, for devices that ask for more slots in the same
 * request (slot arrays are filled only once the pattern is compressed, so they must not be copied).
 */
export function branchPairs(p: number, m: number, k: number): number[] {
  return [p, k, m, k, k, p, k, m];
}

/** Add the incidence of branch k: +1 into row p, −1 into row m, and v(p) − v(m) in row k. */
export function addBranchIncidence(A: Float64Array, s: Int32Array, o: number): void {
  A[s[o]!]! += 1;
  A[s[o + 1]!]! -= 1;
  A[s[o + 2]!]! += 1;
  A[s[o + 3]!]! -= 1;
}
