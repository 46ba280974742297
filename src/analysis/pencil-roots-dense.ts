/**
 * Every finite root of det(G + s·C) = 0 for a pencil small enough to hold densely. With a real shift σ
 * where A = G + σC is regular (factored on the sparse LU), (G + sC)x = 0 is A⁻¹C·x = μx with s = σ − 1/μ; the infinite roots
 * (μ = 0) are the many unknowns C does not touch. Only the columns D where C has entries matter:
 * the nonzero eigenvalues of A⁻¹C are those of the |D|×|D| block (A⁻¹C)[D, D], so the eigenvalue
 * routine (ml-matrix's EigenvalueDecomposition: Hessenberg reduction and shifted QR, after JAMA) runs
 * on that block alone.
 *
 * A defective infinite root (a loop of capacitors and voltage sources, for instance) perturbs μ by the
 * square root of the rounding error, which would read as a spurious very fast root. The analysis is
 * therefore done at two shifts: a true root is the same at both, a spurious one is not.
 */
import { EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix';
import type { QuiescentError } from '../errors/quiescent-error.js';
import { createRealSolver } from '../linalg/index.js';
import type { Pencil } from './pencil.js';

/** A root s = re + j·im, in rad/s. */
export interface RootValue {
  readonly re: number;
  readonly im: number;
}

/** |μ| below this fraction of the largest is an infinite root (C·x = 0 to rounding). */
const INFINITE_ROOT = 1e-13;
/** Two shifts' roots agree within this fraction of |s| (room for the spread of a repeated root). */
const AGREEMENT = 1e-5;
/** Roots within this fraction of the root scale from the origin are at the origin. */
const ORIGIN = 1e-11;
/** An imaginary part below this fraction of |s| is rounding: the root is real. */
const REAL_AXIS = 1e-7;
/** Relative residual above which a dense solve is refused. */
const RESIDUAL_LIMIT = 1e-9;

/** The size of G over that of C (largest entries): the natural scale of the roots, in rad/s. */
export function rootScale(pencil: Pencil): number {
  let g = 0;
  let c = 0;
  for (let p = 0; p < pencil.G.length; p++) {
    g = Math.max(g, Math.abs(pencil.G[p]!));
    c = Math.max(c, Math.abs(pencil.C[p]!));
  }
  return c === 0 ? 0 : g / c;
}

/** Whether the pencil's C has any entry (no C: no finite root). */
function dynamicColumns(pencil: Pencil): number[] {
  const out: number[] = [];
  for (let j = 0; j < pencil.n; j++) {
    for (let p = pencil.Ap[j]!; p < pencil.Ap[j + 1]!; p++) {
      if (pencil.C[p] !== 0) {
        out.push(j);
        break;
      }
    }
  }
  return out;
}

/**
 * The roots seen through shift σ, or null when G + σC is singular there. The columns of
 * (G + σC)⁻¹C that matter are solved on the sparse LU, each solve's residual checked.
 */
function rootsAtShift(pencil: Pencil, columns: readonly number[], sigma: number): RootValue[] | null {
  const { n, Ap, Ai, G, C } = pencil;
  const A = new Float64Array(G.length);
  for (let p = 0; p < A.length; p++) A[p] = G[p]! + sigma * C[p]!;
  const solver = createRealSolver({ n, Ap, Ai });
  if (solver.factor(A) !== 0) return null;
  const K = new Matrix(columns.length, columns.length);
  const x = new Float64Array(n);
  const r = new Float64Array(n);
  for (let t = 0; t < columns.length; t++) {
    const j = columns[t]!;
    x.fill(0);
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) x[Ai[p]!] = C[p]!;
    r.set(x);
    solver.solve(x);
    // Refuse a solve whose residual b − A·x is not at the rounding level.
    let aNorm = 0;
    let xNorm = 0;
    let bNorm = 0;
    for (let i = 0; i < n; i++) bNorm = Math.max(bNorm, Math.abs(r[i]!));
    for (let col = 0; col < n; col++) {
      const v = x[col]!;
      xNorm = Math.max(xNorm, Math.abs(v));
      for (let p = Ap[col]!; p < Ap[col + 1]!; p++) {
        aNorm = Math.max(aNorm, Math.abs(A[p]!));
        r[Ai[p]!]! -= A[p]! * v;
      }
    }
    let rNorm = 0;
    for (let i = 0; i < n; i++) rNorm = Math.max(rNorm, Math.abs(r[i]!));
    if (!(rNorm <= RESIDUAL_LIMIT * (bNorm + aNorm * xNorm))) return null;
    for (let row = 0; row < columns.length; row++) K.set(row, t, x[columns[row]!]!);
  }
  const eigen = new EigenvalueDecomposition(K, { assumeSymmetric: false });
  const mr = eigen.realEigenvalues;
  const mi = eigen.imaginaryEigenvalues;
  let largest = 0;
  for (let k = 0; k < mr.length; k++) largest = Math.max(largest, Math.hypot(mr[k]!, mi[k]!));
  const roots: RootValue[] = [];
  for (let k = 0; k < mr.length; k++) {
    const size2 = mr[k]! * mr[k]! + mi[k]! * mi[k]!;
    if (!(Math.sqrt(size2) > INFINITE_ROOT * largest)) continue;
    // s = σ − 1/μ, 1/μ = conj(μ)/|μ|².
    roots.push({ re: sigma - mr[k]! / size2, im: mi[k]! / size2 });
  }
  return roots;
}

/**
 * Every finite root of det(G + sC) = 0, each as often as its multiplicity, in no particular order.
 *
 * @param pencil - the pencil (order up to about a thousand)
 * @param singular - the error to throw when the pencil is singular for every s
 */
export function denseRoots(pencil: Pencil, singular: () => QuiescentError): RootValue[] {
  const columns = dynamicColumns(pencil);
  const scale = rootScale(pencil);
  if (columns.length === 0 || scale === 0) {
    if (new LuDecomposition(denseOf(pencil)).isSingular()) throw singular();
    return [];
  }
  // Shifts in the right half-plane, where a stable circuit has no root; irrational multiples of the
  // scale, so that no tidy circuit puts a root exactly on one.
  const shifts = [0.7317, 1.618, 3.1623, 0.2718, 7.389].map((m) => m * scale);
  const found: RootValue[][] = [];
  for (const sigma of shifts) {
    const roots = rootsAtShift(pencil, columns, sigma);
    if (roots !== null) found.push(roots);
    if (found.length === 2) break;
  }
  if (found.length < 2) throw singular();
  // A root within rounding of the origin is the origin (a high-pass's zero, an integrator's pole); a
  // pair whose imaginary parts are rounding is a double real root (a critically damped section), which
  // rounding splits by about the square root of the unit roundoff.
  return agreeing(found[0]!, found[1]!, ORIGIN * scale).map((r) => {
    const size = Math.hypot(r.re, r.im);
    if (size <= ORIGIN * scale) return { re: 0, im: 0 };
    return Math.abs(r.im) <= REAL_AXIS * size ? { re: r.re, im: 0 } : r;
  });
}

/** The roots of `first` that `second` also has (each matched once). */
function agreeing(first: readonly RootValue[], second: readonly RootValue[], floor: number): RootValue[] {
  const used = new Uint8Array(second.length);
  const out: RootValue[] = [];
  for (const a of first) {
    let best = -1;
    let bestDistance = Number.POSITIVE_INFINITY;
    second.forEach((b, t) => {
      if (used[t]) return;
      const d = Math.hypot(a.re - b.re, a.im - b.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = t;
      }
    });
    if (best >= 0 && bestDistance <= AGREEMENT * Math.hypot(a.re, a.im) + floor) {
      used[best] = 1;
      out.push(a);
    }
  }
  return out;
}

/** The pencil's G as a dense matrix. */
function denseOf(pencil: Pencil): Matrix {
  const A = new Matrix(pencil.n, pencil.n);
  for (let j = 0; j < pencil.n; j++) {
    for (let p = pencil.Ap[j]!; p < pencil.Ap[j + 1]!; p++) A.set(pencil.Ai[p]!, j, pencil.G[p]!);
  }
  return A;
}
