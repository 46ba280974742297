/**
 * The complex counterpart of lu.ts and refactor.ts: fresh factorization and refactorization of a
 * complex matrix with split real and imaginary arrays, on the same symbolic analysis and the same
 * reach (Gilbert & Peierls 1988) as the real kernel. Magnitudes for pivoting are |re| + |im|, which
 * is within a factor √2 of the modulus and needs no square root (as KLU does for complex), compared
 * after row scaling (ws.rowScale from computeRowScaleComplex) as in the real kernel.
 *
 * Key to the names: as lu.ts, with a trailing `z` for imaginary parts (Az, Lz, Uz, Udz, z).
 */
import type { ComplexNumericLu, PivotTolerances, SymbolicLu } from './lu-types.js';
import { growL, growU } from './lu-types.js';
import { pruneColumns } from './prune.js';
import { reach } from './reach.js';
import type { CscPattern, FactorStatus } from './types.js';
import { computeRowScaleComplex, type LuWorkspace, recordEntrySteps } from './workspace.js';

/**
 * Factor A(prow, q) = L·U for A = Ax + j·Az, as luFactor does for real matrices. Returns 0 or c+1
 * for the first original column c without an acceptable pivot.
 */
export function luFactorComplex(
  A: CscPattern,
  Ax: Float64Array,
  Az: Float64Array,
  S: SymbolicLu,
  N: ComplexNumericLu,
  ws: LuWorkspace,
  tol: PivotTolerances,
): FactorStatus {
  const { n, Ap, Ai } = A;
  const { q, prefRow } = S;
  const { pinv, prow, Lp, Up, Ud, Udz } = N;
  const x = ws.x;
  const z = ws.z;
  const xi = ws.stack;
  const mark = ws.mark;
  const rowScale = ws.rowScale;
  const tau = tol.pivotTolerance;
  const singular = tol.singularTolerance;
  let lnz = 0;
  let unz = 0;
  pinv.fill(-1);
  prow.fill(-1);
  for (let k = 0; k < n; k++) {
    Lp[k] = lnz;
    Up[k] = unz;
    ws.pruned[k] = 0;
    growL(N, lnz + n - k);
    growU(N, unz + k + 1);
    const { Li, Lx, Lz, Ui, Ux, Uz } = N;
    const col = q[k]!;
    const top = reach(n, Lp, Li, pinv, Ap, Ai, col, ws);
    const gen = ws.generation;
    let colMax = 0;
    const aEnd = Ap[col + 1]!;
    for (let p = Ap[col]!; p < aEnd; p++) {
      const i = Ai[p]!;
      const vr = Ax[p]!;
      const vi = Az[p]!;
      x[i]! += vr;
      z[i]! += vi;
      const a = (Math.abs(vr) + Math.abs(vi)) * rowScale[i]!;
      if (a > colMax) colMax = a;
    }
    for (let px = top; px < n; px++) {
      const j = xi[px]!;
      const J = pinv[j]!;
      if (J < 0) continue;
      const xr = x[j]!;
      const xz = z[j]!;
      if (xr === 0 && xz === 0) continue;
      const end = Lp[J + 1]!; // hoisted: V8 cannot prove the stores below leave Lp alone
      for (let p = Lp[J]!; p < end; p++) {
        const i = Li[p]!;
        const lr = Lx[p]!;
        const lz = Lz[p]!;
        x[i] = x[i]! - (lr * xr - lz * xz);
        z[i] = z[i]! - (lr * xz + lz * xr);
      }
    }
    let ipiv = -1;
    let best = -1; // largest candidate, row-scaled
    let bestAbs = 0; // largest candidate, unscaled
    let uMax = 0;
    for (let px = top; px < n; px++) {
      const i = xi[px]!;
      const vr = x[i]!;
      const vi = z[i]!;
      const a = Math.abs(vr) + Math.abs(vi);
      if (pinv[i]! < 0) {
        const s = a * rowScale[i]!;
        if (s > best) {
          best = s;
          ipiv = i;
        }
        if (a > bestAbs) bestAbs = a;
      } else {
        Ui[unz] = pinv[i]!;
        Ux[unz] = vr;
        Uz[unz++] = vi;
        const s = a * rowScale[i]!;
        if (s > uMax) uMax = s;
      }
    }
    const pref = prefRow[col]!;
    if (ipiv >= 0 && pref !== ipiv && mark[pref] === gen && pinv[pref]! < 0) {
      const a = Math.abs(x[pref]!) + Math.abs(z[pref]!);
      if (a >= bestAbs || a * rowScale[pref]! >= tau * best) ipiv = pref; // as in lu.ts
    }
    // Row-scaled, as in lu.ts.
    if (ipiv < 0 || !(best > singular * Math.max(colMax, uMax))) {
      for (let px = top; px < n; px++) {
        x[xi[px]!] = 0;
        z[xi[px]!] = 0;
      }
      return col + 1;
    }
    const pr = x[ipiv]!;
    const pz = z[ipiv]!;
    const d = pr * pr + pz * pz;
    const invr = pr / d; // 1/pivot = conj(pivot)/|pivot|²
    const invz = -pz / d;
    Ud[k] = pr;
    Udz[k] = pz;
    prow[k] = ipiv;
    pinv[ipiv] = k;
    for (let px = top; px < n; px++) {
      const i = xi[px]!;
      if (pinv[i]! < 0) {
        const vr = x[i]!;
        const vi = z[i]!;
        Li[lnz] = i;
        Lx[lnz] = vr * invr - vi * invz;
        Lz[lnz++] = vr * invz + vi * invr;
      }
      x[i] = 0;
      z[i] = 0;
    }
    ws.lend[k] = lnz;
    pruneColumns(N, ipiv, Up[k]!, unz, ws, N.Lz);
  }
  Lp[n] = lnz;
  Up[n] = unz;
  const Li = N.Li;
  for (let p = 0; p < lnz; p++) Li[p] = pinv[Li[p]!]!;
  recordEntrySteps(Ai, pinv, ws);
  return 0;
}

/**
 * Overwrite the values of N with the factors of A = Ax + j·Az on N's patterns, as luRefactor does
 * for real matrices (the same tests: an unscaled singular test, and row scales computed only when
 * the plain threshold test fails). Returns 0, or −1 when a pivot fails the threshold or singular test.
 */
export function luRefactorComplex(
  A: CscPattern,
  Ax: Float64Array,
  Az: Float64Array,
  S: SymbolicLu,
  N: ComplexNumericLu,
  ws: LuWorkspace,
  tol: PivotTolerances,
): number {
  const { n, Ap } = A;
  const q = S.q;
  const { Lp, Li, Lx, Lz, Up, Ui, Ux, Uz, Ud, Udz } = N;
  const x = ws.x;
  const z = ws.z;
  const E = ws.entryStep;
  const tau = tol.pivotTolerance;
  const singular = tol.singularTolerance;
  let uBegin = Up[0]!;
  let lBegin = Lp[0]!;
  for (let k = 0; k < n; k++) {
    const col = q[k]!;
    let colMax = 0;
    const aEnd = Ap[col + 1]!;
    for (let p = Ap[col]!; p < aEnd; p++) {
      const i = E[p]!;
      const vr = Ax[p]!;
      const vi = Az[p]!;
      x[i]! += vr;
      z[i]! += vi;
      const a = Math.abs(vr) + Math.abs(vi);
      if (a > colMax) colMax = a;
    }
    let uMax = 0;
    const uEnd = Up[k + 1]!;
    for (let p = uBegin; p < uEnd; p++) {
      const j = Ui[p]!;
      const xr = x[j]!;
      const xz = z[j]!;
      x[j] = 0;
      z[j] = 0;
      Ux[p] = xr;
      Uz[p] = xz;
      if (xr === 0 && xz === 0) continue;
      const a = Math.abs(xr) + Math.abs(xz);
      if (a > uMax) uMax = a;
      // x −= L(:, j)·xj, unrolled by four and then two (the real kernel's unrolling, halved).
      const end = Lp[j + 1]!;
      let r = Lp[j]!;
      for (; r + 3 < end; r += 4) {
        const i0 = Li[r]!;
        const i1 = Li[r + 1]!;
        const i2 = Li[r + 2]!;
        const i3 = Li[r + 3]!;
        const lr0 = Lx[r]!;
        const lz0 = Lz[r]!;
        const lr1 = Lx[r + 1]!;
        const lz1 = Lz[r + 1]!;
        const lr2 = Lx[r + 2]!;
        const lz2 = Lz[r + 2]!;
        const lr3 = Lx[r + 3]!;
        const lz3 = Lz[r + 3]!;
        x[i0] = x[i0]! - (lr0 * xr - lz0 * xz);
        z[i0] = z[i0]! - (lr0 * xz + lz0 * xr);
        x[i1] = x[i1]! - (lr1 * xr - lz1 * xz);
        z[i1] = z[i1]! - (lr1 * xz + lz1 * xr);
        x[i2] = x[i2]! - (lr2 * xr - lz2 * xz);
        z[i2] = z[i2]! - (lr2 * xz + lz2 * xr);
        x[i3] = x[i3]! - (lr3 * xr - lz3 * xz);
        z[i3] = z[i3]! - (lr3 * xz + lz3 * xr);
      }
      for (; r + 1 < end; r += 2) {
        const i0 = Li[r]!;
        const i1 = Li[r + 1]!;
        const lr0 = Lx[r]!;
        const lz0 = Lz[r]!;
        const lr1 = Lx[r + 1]!;
        const lz1 = Lz[r + 1]!;
        x[i0] = x[i0]! - (lr0 * xr - lz0 * xz);
        z[i0] = z[i0]! - (lr0 * xz + lz0 * xr);
        x[i1] = x[i1]! - (lr1 * xr - lz1 * xz);
        z[i1] = z[i1]! - (lr1 * xz + lz1 * xr);
      }
      if (r < end) {
        const i = Li[r]!;
        const lr = Lx[r]!;
        const lz = Lz[r]!;
        x[i] = x[i]! - (lr * xr - lz * xz);
        z[i] = z[i]! - (lr * xz + lz * xr);
      }
    }
    uBegin = uEnd;
    const pr = x[k]!;
    const pz = z[k]!;
    x[k] = 0;
    z[k] = 0;
    const lEnd = Lp[k + 1]!;
    const a = Math.abs(pr) + Math.abs(pz);
    // Unscaled, as in refactor.ts; the fresh factorization above judges row-scaled.
    if (!(a > singular * Math.max(colMax, uMax))) {
      for (let p = lBegin; p < lEnd; p++) {
        x[Li[p]!] = 0;
        z[Li[p]!] = 0;
      }
      return -1;
    }
    // L(:, k) = x/pivot and the largest candidate in one pass, as in refactor.ts.
    const d = pr * pr + pz * pz;
    const invr = pr / d;
    const invz = -pz / d;
    let lMax = 0;
    for (let p = lBegin; p < lEnd; p++) {
      const i = Li[p]!;
      const vr = x[i]!;
      const vi = z[i]!;
      Lx[p] = vr * invr - vi * invz;
      Lz[p] = vr * invz + vi * invr;
      x[i] = 0;
      z[i] = 0;
      const b = Math.abs(vr) + Math.abs(vi);
      if (b > lMax) lMax = b;
    }
    if (!(a >= lMax) && !passesScaledTestComplex(A, Ax, Az, N, ws, k, pr, pz, tau)) return -1;
    Ud[k] = pr;
    Udz[k] = pz;
    lBegin = lEnd;
  }
  return 0;
}

/**
 * The row-scaled threshold test of step k once L(:, k) holds x/pivot, pivot = pr + j·pz: the
 * candidates x = L(:, k)·pivot are rebuilt, and the scales computed from (Ax, Az) on first use.
 */
function passesScaledTestComplex(
  A: CscPattern,
  Ax: Float64Array,
  Az: Float64Array,
  N: ComplexNumericLu,
  ws: LuWorkspace,
  k: number,
  pr: number,
  pz: number,
  tau: number,
): boolean {
  if (!ws.rowScaleCurrent) computeRowScaleComplex(A.Ap, A.Ai, Ax, Az, ws);
  const { prow, Lp, Li, Lx, Lz } = N;
  const rowScale = ws.rowScale;
  let lMax = 0;
  for (let p = Lp[k]!; p < Lp[k + 1]!; p++) {
    const lr = Lx[p]!;
    const lz = Lz[p]!;
    const s = (Math.abs(lr * pr - lz * pz) + Math.abs(lr * pz + lz * pr)) * rowScale[prow[Li[p]!]!]!;
    if (s > lMax) lMax = s;
  }
  return (Math.abs(pr) + Math.abs(pz)) * rowScale[prow[k]!]! >= tau * lMax;
}
