/**
 * Random matrices shaped like modified nodal analysis: a conductance network on `nodes` nodes tied
 * to ground by a random spanning tree, extra resistors, voltage-source branch rows with a zero
 * diagonal (the source graph is kept a forest, so no source loop), and transconductances that may
 * exceed the diagonal they sit beside. Plus dense helpers for the checks.
 * Construction: common practice of nodal analysis (Ho, Ruehli & Brennan, "The modified nodal
 * approach to network analysis", IEEE Trans. Circuits Syst. 22, 1975).
 */
import fc from 'fast-check';
import { compressPattern } from '../../src/linalg/csc.js';
import type { CscPattern } from '../../src/linalg/types.js';

/** A random number source in [0, 1), so that fast-check can drive it. */
export type Random = () => number;

/** A seeded generator (mulberry32; common practice, no source). */
export function seeded(seed: number): Random {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface MnaMatrix {
  readonly pattern: CscPattern;
  /** Values, with one trailing trash slot at index nnz (as the MNA layer keeps). */
  readonly Ax: Float64Array;
  /** Imaginary parts (jωC entries), same layout. */
  readonly Az: Float64Array;
  /** Triplets with their real and imaginary values, for rebuilding the values. */
  readonly rows: Int32Array;
  readonly cols: Int32Array;
  readonly slots: Int32Array;
  /** Index of each voltage-source branch row. */
  readonly branches: number[];
}

/**
 * fast-check cases of random MNA-shaped matrices: 1…maxNodes nodes, up to 8 sources and 12
 * transconductances, with the seeded generator that built them (for right-hand sides).
 */
export function mnaCases(maxNodes: number): fc.Arbitrary<{ rand: Random; m: MnaMatrix }> {
  return fc
    .record({
      seed: fc.integer(),
      nodes: fc.integer({ min: 1, max: maxNodes }),
      sources: fc.nat(8),
      gms: fc.nat(12),
    })
    .map(({ seed, nodes, sources, gms }) => {
      const rand = seeded(seed);
      return { rand, m: randomMna(rand, nodes, sources, gms) };
    });
}

/** Build a random MNA-shaped matrix; ground is index −1 and is dropped from the stamps. */
export function randomMna(rand: Random, nodes: number, sources: number, gms: number): MnaMatrix {
  const rows: number[] = [];
  const cols: number[] = [];
  const re: number[] = [];
  const im: number[] = [];
  const add = (i: number, j: number, g: number, c: number): void => {
    if (i < 0 || j < 0) return;
    rows.push(i);
    cols.push(j);
    re.push(g);
    im.push(c);
  };
  const logUniform = (lo: number, hi: number): number => lo * (hi / lo) ** rand();
  const admittance = (a: number, b: number, g: number, c: number): void => {
    add(a, a, g, c);
    add(b, b, g, c);
    add(a, b, -g, -c);
    add(b, a, -g, -c);
  };
  const pick = (): number => Math.floor(rand() * (nodes + 1)) - 1; // −1 is ground
  for (let i = 0; i < nodes; i++) {
    const other = Math.floor(rand() * (i + 1)) - 1; // an earlier node or ground: a spanning tree
    admittance(i, other, logUniform(1e-3, 1e2), rand() < 0.5 ? logUniform(1e-3, 1) : 0);
  }
  for (let r = 0; r < nodes; r++) {
    const a = pick();
    const b = pick();
    if (a !== b) admittance(a, b, logUniform(1e-3, 1e2), rand() < 0.3 ? logUniform(1e-3, 1) : 0);
  }
  // Voltage sources as a forest over nodes and ground (union-find), each with its branch row.
  const parent = Array.from({ length: nodes + 1 }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]!]!;
    return i;
  };
  const branches: number[] = [];
  for (let s = 0; s < sources; s++) {
    const a = pick();
    const b = pick();
    const ra = find(a + 1);
    const rb = find(b + 1);
    if (ra === rb) continue;
    parent[ra] = rb;
    const k = nodes + branches.length;
    branches.push(k);
    add(a, k, 1, 0);
    add(b, k, -1, 0);
    add(k, a, 1, 0);
    add(k, b, -1, 0);
  }
  // Transconductances: current into c, out of d, controlled by v(a) − v(b); up to 30× a diagonal.
  for (let t = 0; t < gms; t++) {
    const a = pick();
    const b = pick();
    const c = pick();
    const d = pick();
    const gm = logUniform(1e-2, 3e3) * (rand() < 0.5 ? -1 : 1);
    add(c, a, gm, 0);
    add(c, b, -gm, 0);
    add(d, a, -gm, 0);
    add(d, b, gm, 0);
  }
  const n = nodes + branches.length;
  const { pattern, slots } = compressPattern(n, rows, cols);
  const nnz = pattern.Ap[n]!;
  const Ax = new Float64Array(nnz + 1);
  const Az = new Float64Array(nnz + 1);
  for (let t = 0; t < rows.length; t++) {
    Ax[slots[t]!]! += re[t]!;
    Az[slots[t]!]! += im[t]!;
  }
  Ax[nnz] = Number.NaN; // the trash slot must never be read
  Az[nnz] = Number.NaN;
  return {
    pattern,
    Ax,
    Az,
    rows: Int32Array.from(rows),
    cols: Int32Array.from(cols),
    slots,
    branches,
  };
}

/** Dense row-major copy of a compressed-column matrix (first nnz values only). */
export function toDense(pattern: CscPattern, Ax: Float64Array): number[][] {
  const { n, Ap, Ai } = pattern;
  const out = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) for (let p = Ap[j]!; p < Ap[j + 1]!; p++) out[Ai[p]!]![j]! += Ax[p]!;
  return out;
}

/** y = A·x on the first n entries. */
export function multiply(pattern: CscPattern, Ax: Float64Array, x: ArrayLike<number>): Float64Array {
  const { n, Ap, Ai } = pattern;
  const y = new Float64Array(n);
  for (let j = 0; j < n; j++) for (let p = Ap[j]!; p < Ap[j + 1]!; p++) y[Ai[p]!]! += Ax[p]! * x[j]!;
  return y;
}

/** y = Aᵀ·x on the first n entries. */
export function multiplyTranspose(pattern: CscPattern, Ax: Float64Array, x: ArrayLike<number>): Float64Array {
  const { n, Ap, Ai } = pattern;
  const y = new Float64Array(n);
  for (let j = 0; j < n; j++) for (let p = Ap[j]!; p < Ap[j + 1]!; p++) y[j]! += Ax[p]! * x[Ai[p]!]!;
  return y;
}

/** ‖A‖∞ (largest absolute row sum; ‖Aᵀ‖∞, the largest column sum, when `transpose`) over the first nnz values. */
export function normInf(pattern: CscPattern, Ax: Float64Array, transpose = false): number {
  const { n, Ap, Ai } = pattern;
  const sum = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) sum[transpose ? j : Ai[p]!]! += Math.abs(Ax[p]!);
  }
  return Math.max(0, ...sum);
}

/** ‖v‖∞ over the first n entries. */
export function vecInf(v: ArrayLike<number>, n: number): number {
  let m = 0;
  for (let i = 0; i < n; i++) m = Math.max(m, Math.abs(v[i]!));
  return m;
}

/** Scaled residual ‖Ax − b‖/(‖A‖‖x‖ + ‖b‖) in the ∞-norm (Davis, CSparse cs_demo.c, 2006). */
export function scaledResidual(
  pattern: CscPattern,
  Ax: Float64Array,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
  transpose = false,
): number {
  const n = pattern.n;
  const r = transpose ? multiplyTranspose(pattern, Ax, x) : multiply(pattern, Ax, x);
  for (let i = 0; i < n; i++) r[i]! -= b[i]!;
  return vecInf(r, n) / (normInf(pattern, Ax, transpose) * vecInf(x, n) + vecInf(b, n));
}

/** y = A·x (Aᵀ·x when `transpose`) for complex A = Ax + j·Az and x = xr + j·xi, first n entries. */
export function multiplyComplex(
  pattern: CscPattern,
  Ax: Float64Array,
  Az: Float64Array,
  xr: ArrayLike<number>,
  xi: ArrayLike<number>,
  transpose = false,
): { re: Float64Array; im: Float64Array } {
  const { n, Ap, Ai } = pattern;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const out = transpose ? j : Ai[p]!;
      const from = transpose ? Ai[p]! : j;
      re[out]! += Ax[p]! * xr[from]! - Az[p]! * xi[from]!;
      im[out]! += Ax[p]! * xi[from]! + Az[p]! * xr[from]!;
    }
  }
  return { re, im };
}

/**
 * Scaled residual of a complex solve, ‖Ax − b‖∞/(‖A‖∞‖x‖∞ + ‖b‖∞) with moduli (the measure of
 * Davis, CSparse cs_demo.c, 2006, on complex entries); Aᵀ when `transpose`.
 */
export function scaledResidualComplex(
  pattern: CscPattern,
  Ax: Float64Array,
  Az: Float64Array,
  x: { re: ArrayLike<number>; im: ArrayLike<number> },
  b: { re: ArrayLike<number>; im: ArrayLike<number> },
  transpose = false,
): number {
  const { n, Ap, Ai } = pattern;
  const r = multiplyComplex(pattern, Ax, Az, x.re, x.im, transpose);
  const modInf = (re: ArrayLike<number>, im: ArrayLike<number>): number => {
    let m = 0;
    for (let i = 0; i < n; i++) m = Math.max(m, Math.hypot(re[i]!, im[i]!));
    return m;
  };
  for (let i = 0; i < n; i++) {
    r.re[i]! -= b.re[i]!;
    r.im[i]! -= b.im[i]!;
  }
  const sum = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) sum[transpose ? j : Ai[p]!]! += Math.hypot(Ax[p]!, Az[p]!);
  }
  const normA = Math.max(0, ...sum);
  return modInf(r.re, r.im) / (normA * modInf(x.re, x.im) + modInf(b.re, b.im));
}

/**
 * The real form [[Ar, −Ai], [Ai, Ar]] of a complex matrix, dense row-major 2n×2n: it maps
 * [xr; xi] to [Re(Ax); Im(Ax)] (common practice, e.g. Golub & Van Loan, "Matrix Computations").
 */
export function toDenseRealForm(pattern: CscPattern, Ax: Float64Array, Az: Float64Array): number[][] {
  const { n, Ap, Ai } = pattern;
  const out = Array.from({ length: 2 * n }, () => new Array<number>(2 * n).fill(0));
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = Ai[p]!;
      out[i]![j]! += Ax[p]!;
      out[i + n]![j + n]! += Ax[p]!;
      out[i]![j + n]! -= Az[p]!;
      out[i + n]![j]! += Az[p]!;
    }
  }
  return out;
}
