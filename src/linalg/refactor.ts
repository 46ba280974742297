/**
 * Numeric refactorization on the pivot order and the L/U patterns of an earlier fresh
 * factorization: the same left-looking column loop without the search (as KLU's klu_refactor,
 * Davis & Palamadai Natarajan, "Algorithm 907: KLU", ACM TOMS 37, 2010), plus a check that every
 * pivot still passes the threshold test, so that the caller can fall back to a fresh factorization.
 *
 * Key to the names: as lu.ts, but `x` is indexed by pivot STEP (x[pinv[i]] holds row i), and the
 * patterns Li, Ui already hold steps.
 */
import type { NumericLu, PivotTolerances, SymbolicLu } from './lu-types.js';
import type { CscPattern } from './types.js';
import type { LuWorkspace } from './workspace.js';

/**
 * Overwrite the values of N with the factors of A(prow, q) on N's patterns. Returns 0, or −1 when
 * some pivot U(k, k) fails the threshold test of the fresh factorization (row-scaled by
 * ws.rowScale, which the caller computes from Ax first: below τ times the largest candidate of its
 * column), or the singular test: then N is left inconsistent and the caller must factor afresh.
 */
export function luRefactor(
  A: CscPattern,
  Ax: Float64Array,
  S: SymbolicLu,
  N: NumericLu,
  ws: LuWorkspace,
  tol: PivotTolerances,
): number {
  const { n, Ap, Ai } = A;
  const q = S.q;
  const { pinv, prow, Lp, Li, Lx, Up, Ui, Ux, Ud } = N;
  const x = ws.x;
  const rowScale = ws.rowScale;
  const tau = tol.pivotTolerance;
  const singular = tol.singularTolerance;
  for (let k = 0; k < n; k++) {
    const col = q[k]!;
    let colMax = 0;
    const aEnd = Ap[col + 1]!; // bounds hoisted: V8 cannot prove the stores below leave them alone
    for (let p = Ap[col]!; p < aEnd; p++) {
      const v = Ax[p]!;
      x[pinv[Ai[p]!]!]! += v;
      const a = Math.abs(v);
      if (a > colMax) colMax = a;
    }
    let uMax = 0;
    const uEnd = Up[k + 1]!;
    for (let p = Up[k]!; p < uEnd; p++) {
      const j = Ui[p]!;
      const xj = x[j]!;
      x[j] = 0;
      Ux[p] = xj;
      if (xj === 0) continue;
      const a = Math.abs(xj);
      if (a > uMax) uMax = a;
      // x −= L(:, j)·xj, unrolled by four: about twice as fast under V8 as the plain loop.
      const end = Lp[j + 1]!;
      let r = Lp[j]!;
      for (; r + 3 < end; r += 4) {
        const i0 = Li[r]!;
        const i1 = Li[r + 1]!;
        const i2 = Li[r + 2]!;
        const i3 = Li[r + 3]!;
        x[i0] = x[i0]! - Lx[r]! * xj;
        x[i1] = x[i1]! - Lx[r + 1]! * xj;
        x[i2] = x[i2]! - Lx[r + 2]! * xj;
        x[i3] = x[i3]! - Lx[r + 3]! * xj;
      }
      for (; r < end; r++) x[Li[r]!]! -= Lx[r]! * xj;
    }
    const pivot = x[k]!;
    x[k] = 0;
    const a = Math.abs(pivot);
    if (!(a > singular * Math.max(colMax, uMax))) return clearFrom(x, Li, Lp[k]!, Lp[k + 1]!);
    // L(:, k) = x/pivot, finding the largest row-scaled candidate in the same pass (one pass
    // fewer than testing first; the values are discarded when the test fails).
    const inv = 1 / pivot;
    let lMax = 0;
    const p2 = Lp[k + 1]!;
    for (let p = Lp[k]!; p < p2; p++) {
      const i = Li[p]!;
      const v = x[i]!;
      x[i] = 0;
      Lx[p] = v * inv;
      const s = Math.abs(v) * rowScale[prow[i]!]!;
      if (s > lMax) lMax = s;
    }
    if (!(a * rowScale[prow[k]!]! >= tau * lMax)) return -1; // rows of later columns were never scattered: x is zero
    Ud[k] = pivot;
  }
  return 0;
}

/** Zero x on the rows Li[p1 … p2) and report failure (−1). */
function clearFrom(x: Float64Array, Li: Int32Array, p1: number, p2: number): number {
  for (let p = p1; p < p2; p++) x[Li[p]!] = 0;
  return -1;
}
