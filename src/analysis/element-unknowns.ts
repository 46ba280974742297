/**
 * The unknowns one element touches (its terminal nodes, the internal nodes and branch currents it
 * numbered, the branch current that controls it) and the matrix slots among them. A device writes only
 * into those slots and rows, so its share of the residual, A_e·x − b_e, and its derivatives can be
 * formed over a handful of entries instead of the whole matrix: what the sensitivities need, one
 * element and one parameter at a time.
 */
import { terminalsOf } from '../circuit/elements.js';
import type { Conditions, Device } from '../devices/device.js';
import type { CompiledSystem } from '../mna/system.js';

/** An element's unknowns and the pattern slots among them. */
export interface ElementUnknowns {
  /** The unknowns, each once, ground excluded. */
  readonly unknowns: Int32Array;
  /** Every stored entry (row, column) with both in `unknowns`: its slot, row and column. */
  readonly slots: Int32Array;
  readonly rows: Int32Array;
  readonly cols: Int32Array;
}

/** The unknowns of element number `k` of `system` and the slots among them. */
export function elementUnknowns(system: CompiledSystem, k: number): ElementUnknowns {
  const record = system.records[k]!;
  const set = new Set<number>();
  for (const [, node] of terminalsOf(record)) set.add(system.nodeIndex.get(node)!);
  for (const u of system.allocations[k]!) set.add(u);
  if (record.kind === 'ccvs' || record.kind === 'cccs') {
    const control = system.branchIndex.get(record.control);
    if (control !== undefined) set.add(control);
  }
  set.delete(system.n);
  const unknowns = Int32Array.from([...set].sort((a, b) => a - b));
  const { Ap, Ai } = system.pattern;
  const slots: number[] = [];
  const rows: number[] = [];
  const cols: number[] = [];
  for (const j of unknowns) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = Ai[p]!;
      if (set.has(i)) {
        slots.push(p);
        rows.push(i);
        cols.push(j);
      }
    }
  }
  return {
    unknowns,
    slots: Int32Array.from(slots),
    rows: Int32Array.from(rows),
    cols: Int32Array.from(cols),
  };
}

/**
 * Scratch arrays for loading one device at a time: matrix values and right-hand side of the whole
 * system, kept zero outside the entries being used.
 */
export class DeviceScratch {
  readonly A: Float64Array;
  readonly Az: Float64Array;
  readonly b: Float64Array;
  readonly bz: Float64Array;
  constructor(system: CompiledSystem) {
    this.A = new Float64Array(system.nnz + 1);
    this.Az = new Float64Array(system.nnz + 1);
    this.b = new Float64Array(system.n + 1);
    this.bz = new Float64Array(system.n + 1);
  }

  /** Zero the entries of `e` (and the trash entries the device may also write). */
  clear(e: ElementUnknowns, nnz: number, n: number): void {
    for (const s of e.slots) {
      this.A[s] = 0;
      this.Az[s] = 0;
    }
    for (const u of e.unknowns) {
      this.b[u] = 0;
      this.bz[u] = 0;
    }
    this.A[nnz] = 0;
    this.Az[nnz] = 0;
    this.b[n] = 0;
    this.bz[n] = 0;
  }
}

/**
 * The device's DC residual share r = A_e·x − b_e on its unknowns (r[u] for u in e.unknowns, written
 * into `out` at those indices), loaded at x itself: no step limiting, sources at full value.
 */
export function dcShare(
  device: Device,
  e: ElementUnknowns,
  x: Float64Array,
  scratch: DeviceScratch,
  system: CompiledSystem,
  out: Float64Array,
): void {
  scratch.clear(e, system.nnz, system.n);
  device.load({ x, A: scratch.A, b: scratch.b, sourceScale: 1, limited: false, first: true });
  for (const u of e.unknowns) out[u] = -scratch.b[u]!;
  const A = scratch.A;
  for (let t = 0; t < e.slots.length; t++) out[e.rows[t]!]! += A[e.slots[t]!]! * x[e.cols[t]!]!;
}

/**
 * The device's small-signal residual share R = A_e·X − U_e at angular frequency ω, for the phasor
 * solution (Xr, Xi), linearized at the operating point x; written into (outRe, outIm) on its unknowns.
 */
export function acShare(
  device: Device,
  e: ElementUnknowns,
  x: Float64Array,
  omega: number,
  Xr: Float64Array,
  Xi: Float64Array,
  conditions: Conditions,
  scratch: DeviceScratch,
  system: CompiledSystem,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  scratch.clear(e, system.nnz, system.n);
  device.loadAc({ x, omega, Ar: scratch.A, Ai: scratch.Az, br: scratch.b, bi: scratch.bz, conditions });
  for (const u of e.unknowns) {
    outRe[u] = -scratch.b[u]!;
    outIm[u] = -scratch.bz[u]!;
  }
  const { A, Az } = scratch;
  for (let t = 0; t < e.slots.length; t++) {
    const s = e.slots[t]!;
    const i = e.rows[t]!;
    const j = e.cols[t]!;
    const ar = A[s]!;
    const ai = Az[s]!;
    outRe[i]! += ar * Xr[j]! - ai * Xi[j]!;
    outIm[i]! += ar * Xi[j]! + ai * Xr[j]!;
  }
}
