/**
 * The linearized circuit as a matrix pencil G + s·C in compressed-column form: its natural
 * frequencies are the s where the pencil is singular. G and C are the small-signal stamps of every
 * device at the operating point (for most devices, their stamps at ω = 0 and ω = 1; a device whose
 * admittance is not G + jωC gives its own through `loadPencil`). The transmission zeros of a transfer
 * come from the same pencil bordered by the input source's column and the output's row.
 */
import type { AcLoadContext } from '../devices/device.js';
import { invalidCircuit, invalidValue } from '../errors/messages.js';
import { compressPattern } from '../linalg/index.js';
import type { Probe } from './ac-analysis.js';
import { probeReader } from './distortion-probe.js';
import type { OperatingPoint } from './operating-point.js';

/** A real matrix pencil G + s·C on one sparse pattern (values indexed as the pattern's entries). */
export interface Pencil {
  /** Order of the matrices. */
  readonly n: number;
  /** Column pointers, length n+1. */
  readonly Ap: Int32Array;
  /** Row index of each entry. */
  readonly Ai: Int32Array;
  /** Values of G, one per entry. */
  readonly G: Float64Array;
  /** Values of C, one per entry. */
  readonly C: Float64Array;
  /** What each row and column stands for, for messages. */
  readonly label: (k: number) => string;
}

/** Relative size of a stamp difference that shows a device's admittance is not G + jωC. */
const AFFINE_TOLERANCE = 1e-9;

/**
 * G and C of the circuit linearized at `op`, on the compiled system's pattern.
 *
 * @throws QuiescentError `invalid-circuit` naming a device whose small-signal stamp is not G + jωC
 */
export function circuitPencil(op: OperatingPoint): Pencil {
  const system = op.system;
  const { n, nnz, pattern, devices } = system;
  const G = new Float64Array(nnz + 1);
  const C = new Float64Array(nnz + 1);
  const Ar = new Float64Array(nnz + 1);
  const Ai = new Float64Array(nnz + 1);
  const br = new Float64Array(n + 1);
  const bi = new Float64Array(n + 1);
  const ctx: AcLoadContext & { omega: number } = {
    x: op.x,
    omega: 0,
    Ar,
    Ai,
    br,
    bi,
    conditions: op.conditions,
  };
  const affine = devices.filter((d) => d.loadPencil === undefined);
  const stampAt = (omega: number, group: readonly (typeof devices)[number][]) => {
    Ar.fill(0);
    Ai.fill(0);
    ctx.omega = omega;
    for (const d of group) d.loadAc(ctx);
  };
  // G + jωC at ω = 0 and ω = 1 gives G and C; ω = 2 checks that the stamps are of that form.
  const affineMiss = (group: readonly (typeof devices)[number][]): boolean => {
    stampAt(0, group);
    G.set(Ar);
    const gi = Ai.slice();
    stampAt(1, group);
    for (let p = 0; p < nnz; p++) C[p] = Ai[p]! - gi[p]!;
    stampAt(2, group);
    let scale = 0;
    let miss = 0;
    for (let p = 0; p < nnz; p++) {
      scale = Math.max(scale, Math.abs(G[p]!), Math.abs(C[p]!));
      miss = Math.max(miss, Math.abs(Ar[p]! - G[p]!), Math.abs(Ai[p]! - 2 * C[p]!), Math.abs(gi[p]!));
    }
    return miss > AFFINE_TOLERANCE * scale;
  };
  if (affineMiss(affine)) {
    const culprit = affine.find((d) => affineMiss([d]))?.name ?? affine[0]!.name;
    throw invalidCircuit(
      [culprit],
      `the small-signal model of '${culprit}' is not of the form G + jωC, so its natural frequencies are not found`,
    );
  }
  for (const d of devices) d.loadPencil?.(G, C, op.x, op.conditions);
  const labels = system.labels;
  return {
    n,
    Ap: pattern.Ap,
    Ai: pattern.Ai,
    G: G.subarray(0, nnz),
    C: C.subarray(0, nnz),
    label: (k) => {
      const l = labels[k]!;
      return l.kind === 'node' ? `node '${l.name}'` : `the current of '${l.name}'`;
    },
  };
}

/**
 * The pencil of the circuit bordered by the input source and the output:
 * [[G + sC, b], [c₀ᵀ + s·c₁ᵀ, 0]], singular exactly at the zeros of the transfer from `input` to
 * `output` (and at poles that the transfer does not see).
 *
 * @throws QuiescentError `unknown-element` for an input that is not an independent source;
 *   `unknown-node`, `invalid-value` for an unreadable output
 */
export function borderedPencil(op: OperatingPoint, output: Probe, input: string): Pencil {
  const base = circuitPencil(op);
  const system = op.system;
  const { n } = system;
  const record = typeof input === 'string' ? system.deviceByName.get(input)?.record : undefined;
  if (record === undefined || (record.kind !== 'voltage-source' && record.kind !== 'current-source')) {
    throw invalidValue(
      ['input'],
      input,
      'the name of an independent voltage or current source of the circuit',
    );
  }
  // The input column: a voltage source's excitation enters its branch row; a current source's
  // current leaves `from` and enters `to`.
  const inputRows: number[] = [];
  const inputValues: number[] = [];
  if (record.kind === 'voltage-source') {
    inputRows.push(system.branchIndex.get(record.name)!);
    inputValues.push(1);
  } else {
    for (const [node, sign] of [
      [record.from, -1],
      [record.to, 1],
    ] as const) {
      const k = system.nodeIndex.get(node)!;
      if (k < n) {
        inputRows.push(k);
        inputValues.push(sign);
      }
    }
  }
  // The output row: read the probe from each unit solution; real part at ω = 0 and the imaginary
  // part at ω = 1 give c₀ and c₁ (a current probe of a capacitor reads s·C·v).
  const read = probeReader(system, op, output, false, 'output');
  const xr = new Float64Array(n + 1);
  const xi = new Float64Array(n + 1);
  const value = new Float64Array(2);
  const outputColumns: number[] = [];
  const c0: number[] = [];
  const c1: number[] = [];
  for (let j = 0; j < n; j++) {
    xr[j] = 1;
    read(xr, xi, 0, value);
    const g = value[0]!;
    read(xr, xi, 1, value);
    const c = value[1]!;
    xr[j] = 0;
    if (g !== 0 || c !== 0) {
      outputColumns.push(j);
      c0.push(g);
      c1.push(c);
    }
  }
  if (outputColumns.length === 0) {
    throw invalidValue(['output'], output, 'a probe that reads a voltage or current of the circuit');
  }
  // Triplets of the bordered matrix: the circuit's entries, then the border.
  const rows: number[] = [];
  const cols: number[] = [];
  const gValues: number[] = [];
  const cValues: number[] = [];
  for (let j = 0; j < n; j++) {
    for (let p = base.Ap[j]!; p < base.Ap[j + 1]!; p++) {
      rows.push(base.Ai[p]!);
      cols.push(j);
      gValues.push(base.G[p]!);
      cValues.push(base.C[p]!);
    }
  }
  inputRows.forEach((row, t) => {
    rows.push(row);
    cols.push(n);
    gValues.push(inputValues[t]!);
    cValues.push(0);
  });
  outputColumns.forEach((col, t) => {
    rows.push(n);
    cols.push(col);
    gValues.push(c0[t]!);
    cValues.push(c1[t]!);
  });
  const { pattern, slots } = compressPattern(n + 1, rows, cols);
  const G = new Float64Array(pattern.Ai.length);
  const C = new Float64Array(pattern.Ai.length);
  for (let t = 0; t < rows.length; t++) {
    G[slots[t]!]! += gValues[t]!;
    C[slots[t]!]! += cValues[t]!;
  }
  return {
    n: n + 1,
    Ap: pattern.Ap,
    Ai: pattern.Ai,
    G,
    C,
    label: (k) => (k === n ? `the transfer from '${input}'` : base.label(k)),
  };
}
