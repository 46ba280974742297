/**
 * The roots of det(G + s·C) = 0 nearest a point of the imaginary axis, for pencils too large to hold
 * densely: shift and invert on the sparse complex LU. With s₀ = j·ω₀, the operator
 * y ↦ (G + s₀C)⁻¹C·y has the pencil's eigenvectors, with eigenvalue θ = 1/(s₀ − s), largest for the
 * roots nearest s₀. Arnoldi's method with full reorthogonalization (Y. Saad, "Numerical Methods for
 * Large Eigenvalue Problems", 2nd ed., SIAM, 2011, the chapters on Krylov methods and on shift and
 * invert) runs on its real form (a complex vector
 * as [Re y; Im y]), whose Hessenberg matrix a real eigenvalue routine can take (ml-matrix's
 * EigenvalueDecomposition); the embedding has θ and θ̄, and the Rayleigh quotient tells which is the
 * pencil's. Each Ritz vector is then refined by Rayleigh-quotient iteration on the pencil itself, and
 * kept only when the residual ‖(G + sC)x‖ is at the rounding level.
 *
 * The Arnoldi process is restarted with the wanted Ritz vectors kept, made orthonormal (a thick
 * restart in the manner of G. W. Stewart's Krylov-Schur method, SIAM J. Matrix Anal. Appl. 23(3),
 * 2001), until the wanted Ritz pairs converge.
 *
 * Limits: 2·limit + 30 vectors (at least 40), each two unknowns long, and at most 30 restarts. Every
 * root returned has a small backward error (it is an exact root of a pencil within rounding of this
 * one), which is as much as any eigenvalue routine promises: where the roots themselves are
 * ill-conditioned (a long one-way cascade of similar sections, hundreds of buffered stages each driving
 * the next), a small backward error does not make an accurate root. A repeated root whose eigenvectors
 * are independent is found once.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { QuiescentError } from '../errors/quiescent-error.js';
import { createComplexSolver } from '../linalg/index.js';
import type { Pencil } from './pencil.js';
import { type RootValue, rootScale } from './pencil-roots-dense.js';

/** Row-by-row relative residual of (G + sC)x the refinement aims for (see {@link rayleigh}). */
const TARGET = 1e-12;
/** The relative residual at which a refined root is accepted as a root. */
const ACCEPT = 1e-9;
/** An imaginary part below this fraction of |s| is rounding noise: the root is real. */
const REAL_AXIS = 1e-7;
/** Restarts of the Arnoldi process at most. */
const MAX_RESTARTS = 30;
/** A Ritz pair whose residual is below this fraction of |θ| has converged. */
const RITZ_CONVERGED = 1e-9;
/** Rayleigh-quotient steps per root. */
const REFINE_STEPS = 12;

/** The complex vector (re, im) and the pencil's products with it. */
interface Work {
  readonly xr: Float64Array;
  readonly xi: Float64Array;
  readonly gr: Float64Array;
  readonly gi: Float64Array;
  readonly cr: Float64Array;
  readonly ci: Float64Array;
  /** Σ_j(|G_ij| + |s|·|C_ij|), row by row. */
  readonly bound: Float64Array;
}

/** out = M·x for the pencil's G or C (values `values`) on complex x. */
function multiply(
  pencil: Pencil,
  values: Float64Array,
  xr: Float64Array,
  xi: Float64Array,
  or: Float64Array,
  oi: Float64Array,
): void {
  or.fill(0);
  oi.fill(0);
  const { Ap, Ai } = pencil;
  for (let j = 0; j < pencil.n; j++) {
    const vr = xr[j]!;
    const vi = xi[j]!;
    if (vr === 0 && vi === 0) continue;
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      or[Ai[p]!]! += values[p]! * vr;
      oi[Ai[p]!]! += values[p]! * vi;
    }
  }
}

/**
 * The least-squares Rayleigh quotient s = −(Cx)ᴴ(Gx)/‖Cx‖² (the s that makes ‖Gx + sCx‖ least), and
 * the relative residual of (s, x) row by row: the largest |((G + sC)x)_i| over
 * Σ_j(|G_ij| + |s|·|C_ij|)·‖x‖∞, so that rows of small conductances (a megohm node beside a unit
 * branch row) are judged on their own scale. Fills w.gr/gi and w.cr/ci with G·x and C·x.
 */
function rayleigh(pencil: Pencil, w: Work): { s: RootValue; residual: number } {
  multiply(pencil, pencil.G, w.xr, w.xi, w.gr, w.gi);
  multiply(pencil, pencil.C, w.xr, w.xi, w.cr, w.ci);
  let numRe = 0;
  let numIm = 0;
  let den = 0;
  for (let i = 0; i < pencil.n; i++) {
    const cr = w.cr[i]!;
    const ci = w.ci[i]!;
    // conj(c)·g
    numRe += cr * w.gr[i]! + ci * w.gi[i]!;
    numIm += cr * w.gi[i]! - ci * w.gr[i]!;
    den += cr * cr + ci * ci;
  }
  if (!(den > 0)) return { s: { re: Number.NaN, im: Number.NaN }, residual: Number.POSITIVE_INFINITY };
  const s = { re: -numRe / den, im: -numIm / den };
  const size = Math.hypot(s.re, s.im);
  const bound = w.bound;
  bound.fill(0);
  const { Ap, Ai, G, C } = pencil;
  let xMax = 0;
  for (let j = 0; j < pencil.n; j++) {
    xMax = Math.max(xMax, Math.hypot(w.xr[j]!, w.xi[j]!));
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) bound[Ai[p]!]! += Math.abs(G[p]!) + size * Math.abs(C[p]!);
  }
  let residual = 0;
  for (let i = 0; i < pencil.n; i++) {
    const rr = w.gr[i]! + s.re * w.cr[i]! - s.im * w.ci[i]!;
    const ri = w.gi[i]! + s.re * w.ci[i]! + s.im * w.cr[i]!;
    const r = Math.hypot(rr, ri);
    if (r > 0)
      residual = Math.max(residual, bound[i]! > 0 ? r / (bound[i]! * xMax) : Number.POSITIVE_INFINITY);
  }
  return { s, residual };
}

/**
 * The `limit` roots of the pencil nearest j·ω₀ (distance from j·ω₀ to the root or its conjugate),
 * each refined and verified; a conjugate pair is never split, so one more may be returned.
 *
 * @param pencil - the pencil, any size
 * @param omega0 - the target point's angular frequency, rad/s (≥ 0)
 * @param limit - how many roots
 * @param singular - the error to throw when no shift near the target gives a regular pencil
 */
export function sparseRootsNear(
  pencil: Pencil,
  omega0: number,
  limit: number,
  singular: () => QuiescentError,
): RootValue[] {
  const { n } = pencil;
  const scale = rootScale(pencil);
  if (scale === 0) return [];
  const nnz = pencil.G.length;
  const solver = createComplexSolver({ n, Ap: pencil.Ap, Ai: pencil.Ai });
  const Ar = new Float64Array(nnz);
  const Az = new Float64Array(nnz);
  const factor = (re: number, im: number): boolean => {
    for (let p = 0; p < nnz; p++) {
      Ar[p] = pencil.G[p]! + re * pencil.C[p]!;
      Az[p] = im * pencil.C[p]!;
    }
    return solver.factor(Ar, Az) === 0;
  };
  // The shift: j·ω₀, nudged along the axis if a root sits on it (an integrator's pole at 0 Hz).
  let shift = omega0;
  let regular = factor(0, shift);
  for (let attempt = 1; !regular && attempt <= 4; attempt++) {
    shift = omega0 + attempt * 1e-3 * scale * Math.SQRT1_2;
    regular = factor(0, shift);
  }
  if (!regular) throw singular();

  // Arnoldi on the complex operator y ↦ (G + s₀C)⁻¹C·y, its vectors stored as [Re y; Im y],
  // restarted with the wanted Ritz vectors kept (a thick restart).
  const m = Math.min(2 * n, Math.max(2 * limit + 30, 40));
  const keep = Math.max(1, Math.min(2 * limit + 10, m - 10));
  let basis: Float64Array[] = [];
  let H = new Matrix(m + 1, m);
  const br = new Float64Array(n);
  const bi = new Float64Array(n);
  const start = new Float64Array(2 * n);
  // A fixed pseudo-random start (a linear congruential sequence) reaches every eigenvector.
  let seed = 12345;
  for (let i = 0; i < 2 * n; i++) {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    start[i] = seed / 2147483648 - 0.5;
  }
  normalize(start);
  basis.push(start);
  const { Ap, Ai, C } = pencil;
  let kept = 0;
  let size = m;
  let eigen: EigenvalueDecomposition;
  let order: number[];
  for (let cycle = 0; ; cycle++) {
    size = m;
    for (let j = kept; j < m; j++) {
      const y = basis[j]!;
      br.fill(0);
      bi.fill(0);
      for (let col = 0; col < n; col++) {
        const yr = y[col]!;
        const yi = y[n + col]!;
        for (let p = Ap[col]!; p < Ap[col + 1]!; p++) {
          br[Ai[p]!]! += C[p]! * yr;
          bi[Ai[p]!]! += C[p]! * yi;
        }
      }
      solver.solve(br, bi);
      const w = new Float64Array(2 * n);
      w.set(br);
      w.set(bi, n);
      const before = Math.sqrt(dot(w, w));
      // Two passes of classical Gram-Schmidt keep the basis orthogonal to rounding.
      for (let pass = 0; pass < 2; pass++) {
        for (let i = 0; i <= j; i++) {
          const h = dot(basis[i]!, w);
          H.set(i, j, H.get(i, j) + h);
          axpy(-h, basis[i]!, w);
        }
      }
      const norm = Math.sqrt(dot(w, w));
      H.set(j + 1, j, norm);
      basis[j + 1] = w;
      if (!(norm > 1e-13 * before)) {
        // An invariant subspace: its Ritz values are exact.
        size = j + 1;
        break;
      }
      for (let i = 0; i < 2 * n; i++) w[i]! /= norm;
    }
    eigen = new EigenvalueDecomposition(H.subMatrix(0, size - 1, 0, size - 1), { assumeSymmetric: false });
    const pr = eigen.realEigenvalues;
    const pi = eigen.imaginaryEigenvalues;
    const Y = eigen.eigenvectorMatrix;
    // The embedding has θ and θ̄ for every eigenvalue θ = 1/(s₀ − s): one of each pair, largest first.
    order = [];
    for (let k = 0; k < size; k++) if (pi[k]! >= 0) order.push(k);
    order.sort((a, b) => Math.hypot(pr[b]!, pi[b]!) - Math.hypot(pr[a]!, pi[a]!));
    // Converged when each wanted Ritz pair's residual β·|y_last|/‖y‖ is small against |θ|.
    const beta = H.get(size, size - 1);
    const residualOf = (k: number): number => {
      let norm2 = 0;
      for (let i = 0; i < size; i++) {
        norm2 += Y.get(i, k) ** 2 + (pi[k]! > 0 ? Y.get(i, k + 1) ** 2 : 0);
      }
      const last = Math.hypot(Y.get(size - 1, k), pi[k]! > 0 ? Y.get(size - 1, k + 1) : 0);
      return (beta * last) / Math.sqrt(norm2) / Math.hypot(pr[k]!, pi[k]!);
    };
    const wanted = order.slice(0, Math.min(order.length, limit + 2));
    if (size < m || cycle >= MAX_RESTARTS || wanted.every((k) => residualOf(k) <= RITZ_CONVERGED)) break;
    // Restart: keep the span of the wanted Ritz vectors (real and imaginary parts of a pair), made
    // orthonormal, and the residual vector; the projected matrix is Uᵀ·H·U above the residual's row.
    const columns: number[] = [];
    for (const k of order) {
      if (columns.length + (pi[k]! > 0 ? 2 : 1) > keep) break;
      columns.push(k);
      if (pi[k]! > 0) columns.push(k + 1);
    }
    const U = orthonormalColumns(Y, size, columns);
    const Hm = H.subMatrix(0, size - 1, 0, size - 1);
    const projected = U.transpose().mmul(Hm).mmul(U);
    const next = new Matrix(m + 1, m);
    const k2 = U.columns;
    for (let a = 0; a < k2; a++) {
      for (let b = 0; b < k2; b++) next.set(a, b, projected.get(a, b));
      next.set(k2, a, beta * U.get(size - 1, a));
    }
    const residualVector = basis[size]!;
    const fresh: Float64Array[] = [];
    for (let a = 0; a < k2; a++) {
      const q = new Float64Array(2 * n);
      for (let r = 0; r < size; r++) {
        const u = U.get(r, a);
        if (u !== 0) axpy(u, basis[r]!, q);
      }
      fresh.push(q);
    }
    fresh.push(residualVector);
    basis = fresh;
    H = next;
    kept = k2;
  }
  const pr = eigen.realEigenvalues;
  const pi = eigen.imaginaryEigenvalues;
  const Y = eigen.eigenvectorMatrix;

  const work: Work = {
    xr: new Float64Array(n),
    xi: new Float64Array(n),
    gr: new Float64Array(n),
    gi: new Float64Array(n),
    cr: new Float64Array(n),
    ci: new Float64Array(n),
    bound: new Float64Array(n),
  };
  const zr = new Float64Array(2 * n);
  const zi = new Float64Array(2 * n);
  const found: RootValue[] = [];
  const distance = (r: RootValue) => Math.hypot(r.re, Math.abs(r.im) - omega0);
  for (const k of order) {
    // Stop once `limit` roots are known and this Ritz value's root (s = s₀ − 1/θ, as far as the
    // Krylov space tells) lies well beyond the farthest of the nearest `limit`.
    if (found.length >= limit) {
      const size2 = pr[k]! * pr[k]! + pi[k]! * pi[k]!;
      const estimate = Math.min(
        distance({ re: -pr[k]! / size2, im: shift + pi[k]! / size2 }),
        distance({ re: -pr[k]! / size2, im: shift - pi[k]! / size2 }),
      );
      const nearest = found.map(distance).sort((a, b) => a - b);
      if (estimate > (1 + 1e-6) * nearest[limit - 1]!) break;
    }
    // The Ritz vector z = V·y (a complex pair keeps its real and imaginary parts in columns k, k+1).
    zr.fill(0);
    zi.fill(0);
    for (let i = 0; i < size; i++) {
      axpy(Y.get(i, k), basis[i]!, zr);
      if (pi[k]! > 0) axpy(Y.get(i, k + 1), basis[i]!, zi);
    }
    // z = [z₁; z₂] holds the pencil's eigenvector as z₁ + j·z₂ or as z₁ − j·z₂: take the better.
    let best = Number.POSITIVE_INFINITY;
    let sign = 1;
    for (const candidate of [1, -1]) {
      for (let i = 0; i < n; i++) {
        work.xr[i] = zr[i]! - candidate * zi[n + i]!;
        work.xi[i] = zi[i]! + candidate * zr[n + i]!;
      }
      const { residual } = rayleigh(pencil, work);
      if (residual < best) {
        best = residual;
        sign = candidate;
      }
    }
    for (let i = 0; i < n; i++) {
      work.xr[i] = zr[i]! - sign * zi[n + i]!;
      work.xi[i] = zi[i]! + sign * zr[n + i]!;
    }
    // A real θ appears twice in the embedding (for y and for its conjugate): refine each root once.
    const first = rayleigh(pencil, work).s;
    if (
      found.some(
        (r) =>
          Math.hypot(r.re - first.re, Math.abs(r.im) - Math.abs(first.im)) <= 1e-6 * Math.hypot(r.re, r.im),
      )
    ) {
      continue;
    }
    const root = refine(pencil, work, factor, solver);
    if (root === null) continue;
    const tolerance = 1e-7 * Math.max(Math.hypot(root.re, root.im), 1e-9 * scale);
    const known = found.some(
      (r) =>
        Math.abs(r.re - root.re) <= tolerance && Math.abs(Math.abs(r.im) - Math.abs(root.im)) <= tolerance,
    );
    if (known) continue;
    found.push(root);
    if (root.im !== 0) found.push({ re: root.re, im: -root.im });
  }
  // The nearest `limit`, never splitting a pair.
  found.sort((a, b) => distance(a) - distance(b) || b.im - a.im);
  let count = Math.min(limit, found.length);
  if (count > 0 && count < found.length && found[count - 1]!.im > 0) count++;
  return found.slice(0, count);
}

/**
 * Rayleigh-quotient iteration from the vector in `w`: x ← (G + sC)⁻¹C·x, s ← the quotient, until the
 * residual is at the rounding level. Null when it does not get there.
 */
function refine(
  pencil: Pencil,
  w: Work,
  factor: (re: number, im: number) => boolean,
  solver: { solve(br: Float64Array, bi: Float64Array): void },
): RootValue | null {
  let { s, residual } = rayleigh(pencil, w);
  for (let step = 0; step < REFINE_STEPS && residual > TARGET; step++) {
    if (!Number.isFinite(s.re) || !Number.isFinite(s.im)) return null;
    if (!factor(s.re, s.im)) break; // exactly singular at s: x already spans the null space as far as rounding tells
    // x ← (G + sC)⁻¹·C·x (C·x is in w.cr/ci from the last quotient).
    w.xr.set(w.cr);
    w.xi.set(w.ci);
    solver.solve(w.xr, w.xi);
    let scale = 0;
    for (let i = 0; i < pencil.n; i++) scale = Math.max(scale, Math.abs(w.xr[i]!) + Math.abs(w.xi[i]!));
    if (!(scale > 0 && Number.isFinite(scale))) return null;
    for (let i = 0; i < pencil.n; i++) {
      w.xr[i]! /= scale;
      w.xi[i]! /= scale;
    }
    ({ s, residual } = rayleigh(pencil, w));
  }
  if (!(residual <= ACCEPT)) return null;
  // A root whose imaginary part is rounding noise is real.
  const im = Math.abs(s.im) <= REAL_AXIS * Math.hypot(s.re, s.im) ? 0 : s.im;
  return { re: s.re, im };
}

/** The columns `columns` of Y (rows 0 … rows−1) made orthonormal (modified Gram-Schmidt; dependent ones dropped). */
function orthonormalColumns(Y: Matrix, rows: number, columns: readonly number[]): Matrix {
  const kept: Float64Array[] = [];
  for (const c of columns) {
    const v = new Float64Array(rows);
    for (let r = 0; r < rows; r++) v[r] = Y.get(r, c);
    const before = Math.sqrt(dot(v, v));
    for (let pass = 0; pass < 2; pass++) for (const u of kept) axpy(-dot(u, v), u, v);
    const norm = Math.sqrt(dot(v, v));
    if (!(norm > 1e-10 * before)) continue;
    for (let r = 0; r < rows; r++) v[r]! /= norm;
    kept.push(v);
  }
  const U = new Matrix(rows, kept.length);
  kept.forEach((v, a) => {
    for (let r = 0; r < rows; r++) U.set(r, a, v[r]!);
  });
  return U;
}

function dot(a: Float64Array, b: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!;
  return sum;
}

function axpy(alpha: number, x: Float64Array, y: Float64Array): void {
  for (let i = 0; i < y.length; i++) y[i]! += alpha * x[i]!;
}

function normalize(v: Float64Array): void {
  const norm = Math.sqrt(dot(v, v));
  for (let i = 0; i < v.length; i++) v[i]! /= norm;
}
