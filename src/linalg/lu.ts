/**
 * Fresh sparse LU factorization P·A·Q = L·U, left-looking, one sparse triangular solve per column
 * (Gilbert & Peierls, SIAM J. Sci. Stat. Comput. 9, 1988; the shape of CSparse's cs_lu), with
 * threshold partial pivoting that prefers the row the ordering matched to the column (Duff,
 * Erisman & Reid, "Direct Methods for Sparse Matrices", 1986, §5.4; the diagonal preference of
 * KLU, Davis & Palamadai Natarajan, ACM TOMS 37, 2010), so that the fill-reducing order survives
 * matrices whose transconductance entries exceed their diagonals.
 *
 * Key to the names: `n`, `Ap`, `Ai`, `Ax` the matrix A in compressed-column form (only the first
 * Ap[n] values of Ax are read); `S` the symbolic analysis (q, prefRow); `N` the factorization
 * written (see lu-types.ts); `x` dense accumulator indexed by ORIGINAL row, zero between columns; `xi` the reach;
 * `tau` pivot tolerance; `lnz`/`unz` entries of L/U so far.
 */

import { growL, growU, type NumericLu, type PivotTolerances, type SymbolicLu } from './lu-types.js';
import { pruneColumns } from './prune.js';
import { reach } from './reach.js';
import type { CscPattern, FactorStatus } from './types.js';
import { type LuWorkspace, recordEntrySteps } from './workspace.js';

/**
 * Factor A(prow, q) = L·U into N, choosing pivots as the columns are reached.
 *
 * Column k (original column c = q[k]) solves L·x = A(:, c) on the reach of A(:, c), keeps the
 * entries in pivotal rows as U(:, k), and picks the pivot among the other rows: the preferred row
 * prefRow[c] while |x|·r ≥ τ·max(|x|·r) over candidates or while it is the largest candidate |x|
 * outright, else the largest |x|·r, where r is ws.rowScale (1/max|A(i, :)|, so rows of very
 * different scales compete fairly, as KLU scales rows; it must be current). The second rule is
 * plain partial pivoting (multipliers at most 1): the scale of a row is set by its largest
 * original entry even once that entry's column has been eliminated, so a coupling capacitor at
 * high frequency, whose partner node went first, made the matched row of a transistor chain fail
 * the scaled test by a hair while it was the largest candidate, and the row chosen instead (the
 * supply node, coupled to every stage) filled U 70-fold. On 3,000 random MNA matrices the second
 * rule left the largest scaled residual unchanged, where accepting |x| ≥ τ·max|x| raised it 15-fold.
 * A column whose largest row-scaled candidate is ≤ singularTolerance × the largest row-scaled entry of A(:, c) and U(:, k)
 * has no acceptable pivot (row-scaled, so a junction's huge conductance in one row does not make a
 * source's unit branch entries in the same column look like round-off).
 *
 * With `skipped` null, returns 0 or c+1 for the first column c without an acceptable pivot. With
 * an array, such columns are written to skipped[0 …] instead, left without a pivot row, and the
 * factorization goes on; it then returns the count of skipped columns (rank-deficiency report).
 */
export function luFactor(
  A: CscPattern,
  Ax: Float64Array,
  S: SymbolicLu,
  N: NumericLu,
  ws: LuWorkspace,
  tol: PivotTolerances,
  skipped: Int32Array | null = null,
): FactorStatus {
  const { n, Ap, Ai } = A;
  const { q, prefRow } = S;
  const { pinv, prow, Lp, Up, Ud } = N;
  const x = ws.x;
  const xi = ws.stack;
  const mark = ws.mark;
  const rowScale = ws.rowScale;
  const tau = tol.pivotTolerance;
  const singular = tol.singularTolerance;
  let lnz = 0;
  let unz = 0;
  let nskip = 0;
  pinv.fill(-1);
  prow.fill(-1);
  for (let k = 0; k < n; k++) {
    Lp[k] = lnz;
    Up[k] = unz;
    ws.pruned[k] = 0;
    growL(N, lnz + n - k);
    growU(N, unz + k + 1);
    const Li = N.Li;
    const Lx = N.Lx;
    const Ui = N.Ui;
    const Ux = N.Ux;
    const col = q[k]!;
    // x = L \ A(:, col) on the reach of A(:, col)
    const top = reach(n, Lp, Li, pinv, Ap, Ai, col, ws);
    const gen = ws.generation;
    let colMax = 0;
    const aEnd = Ap[col + 1]!;
    for (let p = Ap[col]!; p < aEnd; p++) {
      const v = Ax[p]!;
      const i = Ai[p]!;
      x[i]! += v;
      const a = Math.abs(v) * rowScale[i]!;
      if (a > colMax) colMax = a;
    }
    for (let px = top; px < n; px++) {
      const j = xi[px]!;
      const J = pinv[j]!;
      if (J < 0) continue; // row j has no pivot yet: x[j] is final
      const xj = x[j]!;
      if (xj === 0) continue;
      // x −= L(:, J)·xj, unrolled by four (refactor.ts, which runs far more often, unrolls by eight).
      const end = Lp[J + 1]!;
      let p = Lp[J]!;
      for (; p + 3 < end; p += 4) {
        const i0 = Li[p]!;
        const i1 = Li[p + 1]!;
        const i2 = Li[p + 2]!;
        const i3 = Li[p + 3]!;
        x[i0] = x[i0]! - Lx[p]! * xj;
        x[i1] = x[i1]! - Lx[p + 1]! * xj;
        x[i2] = x[i2]! - Lx[p + 2]! * xj;
        x[i3] = x[i3]! - Lx[p + 3]! * xj;
      }
      for (; p < end; p++) x[Li[p]!]! -= Lx[p]! * xj;
    }
    // U(:, k) from the pivotal rows, in reach (topological) order; the largest candidate
    let ipiv = -1;
    let best = -1; // largest candidate, row-scaled
    let bestAbs = 0; // largest candidate, unscaled
    let uMax = 0;
    for (let px = top; px < n; px++) {
      const i = xi[px]!;
      const v = x[i]!;
      const a = Math.abs(v);
      if (pinv[i]! < 0) {
        const s = a * rowScale[i]!;
        if (s > best) {
          best = s;
          ipiv = i;
        }
        if (a > bestAbs) bestAbs = a;
      } else {
        Ui[unz] = pinv[i]!;
        Ux[unz++] = v;
        const s = a * rowScale[i]!;
        if (s > uMax) uMax = s;
      }
    }
    const pref = prefRow[col]!;
    if (ipiv >= 0 && pref !== ipiv && mark[pref] === gen && pinv[pref]! < 0) {
      const a = Math.abs(x[pref]!);
      if (a >= bestAbs || a * rowScale[pref]! >= tau * best) ipiv = pref;
    }
    // Row-scaled singular test (see above); refactor.ts keeps an unscaled one and falls back here.
    if (ipiv < 0 || !(best > singular * Math.max(colMax, uMax))) {
      for (let px = top; px < n; px++) x[xi[px]!] = 0;
      if (skipped === null) return col + 1;
      skipped[nskip++] = col; // no pivot row for this step: L(:, k) stays empty
      Ud[k] = 0;
      ws.lend[k] = lnz;
      continue;
    }
    const pivot = x[ipiv]!;
    Ud[k] = pivot;
    prow[k] = ipiv;
    pinv[ipiv] = k;
    for (let px = top; px < n; px++) {
      const i = xi[px]!;
      if (pinv[i]! < 0) {
        Li[lnz] = i; // original row; mapped to its step once every row has one
        Lx[lnz++] = x[i]! / pivot;
      }
      x[i] = 0; // x is all zero between columns
    }
    ws.lend[k] = lnz;
    pruneColumns(N, ipiv, Up[k]!, unz, ws, null);
  }
  Lp[n] = lnz;
  Up[n] = unz;
  if (nskip > 0) return nskip;
  const Li = N.Li;
  for (let p = 0; p < lnz; p++) Li[p] = pinv[Li[p]!]!;
  recordEntrySteps(Ai, pinv, ws);
  return 0;
}
