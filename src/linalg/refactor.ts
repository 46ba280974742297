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
 * some pivot U(k, k) is below τ times the largest entry of its column of L·U(k,k), or below the
 * singular tolerance: then N is left inconsistent and the caller must factor afresh.
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
  const { pinv, Lp, Li, Lx, Up, Ui, Ux, Ud } = N;
  const x = ws.x;
  const tau = tol.pivotTolerance;
  const singular = tol.singularTolerance;
  for (let k = 0; k < n; k++) {
    const col = q[k]!;
    let colMax = 0;
    for (let p = Ap[col]!; p < Ap[col + 1]!; p++) {
      const v = Ax[p]!;
      x[pinv[Ai[p]!]!]! += v;
      const a = Math.abs(v);
      if (a > colMax) colMax = a;
    }
    let uMax = 0;
    for (let p = Up[k]!; p < Up[k + 1]!; p++) {
      const j = Ui[p]!;
      const xj = x[j]!;
      x[j] = 0;
      Ux[p] = xj;
      if (xj === 0) continue;
      const a = Math.abs(xj);
      if (a > uMax) uMax = a;
      for (let r = Lp[j]!; r < Lp[j + 1]!; r++) x[Li[r]!]! -= Lx[r]! * xj;
    }
    const pivot = x[k]!;
    x[k] = 0;
    const p1 = Lp[k]!;
    const p2 = Lp[k + 1]!;
    let lMax = 0;
    for (let p = p1; p < p2; p++) {
      const a = Math.abs(x[Li[p]!]!);
      if (a > lMax) lMax = a;
    }
    const a = Math.abs(pivot);
    if (!(a >= tau * lMax) || !(a > singular * Math.max(colMax, uMax))) {
      for (let p = p1; p < p2; p++) x[Li[p]!] = 0;
      // Rows of later columns were never scattered, so x is all zero again.
      return -1;
    }
    Ud[k] = pivot;
    for (let p = p1; p < p2; p++) {
      const i = Li[p]!;
      Lx[p] = x[i]! / pivot;
      x[i] = 0;
    }
  }
  return 0;
}
