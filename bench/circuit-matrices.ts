/**
 * Families of circuit-shaped matrices for the sparse LU benchmarks, built the way modified nodal
 * analysis stamps them (Ho, Ruehli & Brennan, "The modified nodal approach to network analysis",
 * IEEE Trans. Circuits Syst. 22, 1975): admittances on node pairs, a branch row with a zero
 * diagonal for every ideal voltage source, and transconductances off the diagonal.
 *
 * - ladder: a chain of series resistors with a shunt resistor (and, complex, a shunt capacitor) at
 *   every node, driven by one voltage source.
 * - mesh: a square grid of resistors, a leak to ground at every node (capacitor when complex),
 *   driven at one corner by a voltage source.
 * - stages: cascaded small-signal transistor stages (input resistance, transconductance, output
 *   resistance, collector and emitter resistors), each followed by an ideal voltage buffer with its
 *   own branch row; the transconductance (40 mS) exceeds every diagonal next to it by 10× or more,
 *   and the voltage gain per stage stays near −1 so that the cascade neither overflows nor vanishes.
 *
 * Key to the names: `n` unknowns (nodes plus branch rows); `rows`/`cols`/`re`/`im` triplets;
 * ground is −1 and drops out of the stamps.
 */

import type { CscPattern } from '../src/linalg/index.js';
import { compressPattern } from '../src/linalg/index.js';

/** A benchmark matrix: pattern and values, Az null for a real matrix. */
export interface CircuitMatrix {
  readonly name: string;
  readonly pattern: CscPattern;
  readonly Ax: Float64Array;
  readonly Az: Float64Array | null;
}

/** Names of the families. */
export type FamilyName = 'ladder' | 'mesh' | 'stages';

/** The families, in table order. */
export const FAMILIES: readonly FamilyName[] = ['ladder', 'mesh', 'stages'];

/** Collects MNA stamps as triplets. */
class Stamps {
  readonly rows: number[] = [];
  readonly cols: number[] = [];
  readonly re: number[] = [];
  readonly im: number[] = [];
  size = 0;

  /** A new unknown (node or branch row); returns its index. */
  unknown(): number {
    return this.size++;
  }

  entry(i: number, j: number, g: number, b: number): void {
    if (i < 0 || j < 0) return;
    this.rows.push(i);
    this.cols.push(j);
    this.re.push(g);
    this.im.push(b);
  }

  /** An admittance g + j·b between nodes a and c. */
  admittance(a: number, c: number, g: number, b = 0): void {
    this.entry(a, a, g, b);
    this.entry(c, c, g, b);
    this.entry(a, c, -g, -b);
    this.entry(c, a, -g, -b);
  }

  /** A current gm·(v(a) − v(c)) from node p to node m. */
  transconductance(p: number, m: number, a: number, c: number, gm: number): void {
    this.entry(p, a, gm, 0);
    this.entry(p, c, -gm, 0);
    this.entry(m, a, -gm, 0);
    this.entry(m, c, gm, 0);
  }

  /** An ideal voltage source from p to m, or a buffer v(p) − v(m) = gain·v(ctl), with its branch row. */
  voltageSource(p: number, m: number, ctl = -1, gain = 0): void {
    const k = this.unknown();
    this.entry(p, k, 1, 0);
    this.entry(m, k, -1, 0);
    this.entry(k, p, 1, 0);
    this.entry(k, m, -1, 0);
    this.entry(k, ctl, -gain, 0);
  }

  build(name: string, complex: boolean): CircuitMatrix {
    const n = this.size;
    const { pattern, slots } = compressPattern(n, this.rows, this.cols);
    const nnz = pattern.Ap[n]!;
    const Ax = new Float64Array(nnz);
    const Az = complex ? new Float64Array(nnz) : null;
    for (let t = 0; t < slots.length; t++) {
      Ax[slots[t]!]! += this.re[t]!;
      if (Az !== null) Az[slots[t]!]! += this.im[t]!;
    }
    return { name, pattern, Ax, Az };
  }
}

/** Angular frequency of the complex variants: 1 MHz. */
const OMEGA = 2 * Math.PI * 1e6;

/** A resistor ladder of about `size` unknowns. */
export function ladder(size: number, complex: boolean): CircuitMatrix {
  const s = new Stamps();
  const nodes = size - 1;
  for (let i = 0; i < nodes; i++) s.unknown();
  for (let i = 0; i < nodes; i++) {
    s.admittance(i, i + 1 < nodes ? i + 1 : -1, 1 / 100); // 100 Ω series
    s.admittance(i, -1, 1 / 10e3, complex ? OMEGA * 10e-12 : 0); // 10 kΩ ∥ 10 pF shunt
  }
  s.voltageSource(0, -1);
  return s.build(`ladder-${complex ? 'complex' : 'real'}-${size}`, complex);
}

/** A square resistor mesh of about `size` unknowns. */
export function mesh(size: number, complex: boolean): CircuitMatrix {
  const s = new Stamps();
  const side = Math.max(2, Math.round(Math.sqrt(size - 1)));
  for (let i = 0; i < side * side; i++) s.unknown();
  const at = (r: number, c: number): number => r * side + c;
  for (let r = 0; r < side; r++) {
    for (let c = 0; c < side; c++) {
      if (c + 1 < side) s.admittance(at(r, c), at(r, c + 1), 1 / 1e3);
      if (r + 1 < side) s.admittance(at(r, c), at(r + 1, c), 1 / 1e3);
      s.admittance(at(r, c), -1, 1 / 1e6, complex ? OMEGA * 1e-12 : 0);
    }
  }
  s.voltageSource(at(0, 0), -1);
  return s.build(`mesh-${complex ? 'complex' : 'real'}-${side * side + 1}`, complex);
}

/** Cascaded transistor stages with voltage buffers, about `size` unknowns (5 per stage). */
export function stages(size: number, complex: boolean): CircuitMatrix {
  const s = new Stamps();
  const jw = (c: number): number => (complex ? OMEGA * c : 0);
  const input = s.unknown();
  s.voltageSource(input, -1);
  let previous = input;
  const count = Math.max(1, Math.floor((size - 2) / 5));
  for (let k = 0; k < count; k++) {
    const base = s.unknown();
    const collector = s.unknown();
    const emitter = s.unknown();
    const output = s.unknown();
    s.admittance(previous, base, 1 / 1e3, jw(100e-12)); // coupling 1 kΩ ∥ 100 pF
    s.admittance(base, -1, 1 / 50e3); // bias divider
    s.admittance(base, emitter, 1 / 2.5e3, jw(20e-12)); // input resistance ∥ base-emitter capacitance
    s.admittance(base, collector, 1e-9, jw(2e-12)); // leakage ∥ base-collector capacitance
    s.transconductance(collector, emitter, base, emitter, 40e-3); // 40 mS at 1 mA
    s.admittance(collector, emitter, 1 / 100e3); // output resistance
    s.admittance(collector, -1, 1 / 5e3, jw(5e-12)); // collector load
    s.admittance(emitter, -1, 1 / 1e3); // emitter resistor
    s.voltageSource(output, -1, collector, 0.2); // buffer: v(out) = 0.2·v(collector), stage gain near −1
    s.admittance(output, -1, 1 / 10e3); // buffer load
    previous = output;
  }
  return s.build(`stages-${complex ? 'complex' : 'real'}-${s.size}`, complex);
}

/** The matrix of a family at about `size` unknowns. */
export function familyMatrix(family: FamilyName, size: number, complex: boolean): CircuitMatrix {
  if (family === 'ladder') return ladder(size, complex);
  if (family === 'mesh') return mesh(size, complex);
  return stages(size, complex);
}
