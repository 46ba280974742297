/**
 * Solves with a factorization P·A·Q = L·U (see lu-types.ts): the four steps of CSparse's cs_lusol,
 * permute, lower solve, upper solve, unpermute, and their transposes for Aᵀ.
 *
 * Key to the names: `N` the factorization (Lp, Li, Lx unit lower by columns; Up, Ui, Ux strictly
 * upper by columns; Ud the diagonal of U; prow[k] the original row of step k); `q[k]` the original
 * column of step k; `b` the right-hand side, overwritten by the solution (only b[0 … n) is read or
 * written); `y` scratch of length n, indexed by step.
 */
import type { NumericLu } from './lu-types.js';

/**
 * y[idx[p]] −= val[p]·a for p in [start, end), unrolled by four (about twice as fast under V8 as
 * the plain loop; the indices within one column are distinct, so the four stores never collide).
 */
function scatterSubtract(
  y: Float64Array,
  idx: Int32Array,
  val: Float64Array,
  start: number,
  end: number,
  a: number,
): void {
  let p = start;
  for (; p + 3 < end; p += 4) {
    const i0 = idx[p]!;
    const i1 = idx[p + 1]!;
    const i2 = idx[p + 2]!;
    const i3 = idx[p + 3]!;
    y[i0] = y[i0]! - val[p]! * a;
    y[i1] = y[i1]! - val[p + 1]! * a;
    y[i2] = y[i2]! - val[p + 2]! * a;
    y[i3] = y[i3]! - val[p + 3]! * a;
  }
  for (; p < end; p++) y[idx[p]!] = y[idx[p]!]! - val[p]! * a;
}

/** y is overwritten with L⁻¹y (L unit lower triangular, by columns). */
function lowerSolve(N: NumericLu, y: Float64Array): void {
  const { n, Lp, Li, Lx } = N;
  for (let j = 0; j < n; j++) {
    const yj = y[j]!;
    if (yj !== 0) scatterSubtract(y, Li, Lx, Lp[j]!, Lp[j + 1]!, yj);
  }
}

/** y is overwritten with U⁻¹y (U upper triangular, by columns, diagonal in Ud). */
function upperSolve(N: NumericLu, y: Float64Array): void {
  const { n, Up, Ui, Ux, Ud } = N;
  for (let j = n - 1; j >= 0; j--) {
    const yj = y[j]! / Ud[j]!;
    y[j] = yj;
    if (yj !== 0) scatterSubtract(y, Ui, Ux, Up[j]!, Up[j + 1]!, yj);
  }
}

/** y is overwritten with U⁻ᵀy. */
function upperTransposeSolve(N: NumericLu, y: Float64Array): void {
  const { n, Up, Ui, Ux, Ud } = N;
  for (let j = 0; j < n; j++) {
    let s = y[j]!;
    const end = Up[j + 1]!;
    for (let p = Up[j]!; p < end; p++) s -= Ux[p]! * y[Ui[p]!]!;
    y[j] = s / Ud[j]!;
  }
}

/** y is overwritten with L⁻ᵀy. */
function lowerTransposeSolve(N: NumericLu, y: Float64Array): void {
  const { n, Lp, Li, Lx } = N;
  for (let j = n - 1; j >= 0; j--) {
    let s = y[j]!;
    const end = Lp[j + 1]!;
    for (let p = Lp[j]!; p < end; p++) s -= Lx[p]! * y[Li[p]!]!;
    y[j] = s;
  }
}

/** b[0 … n) is overwritten with A⁻¹b: y = P·b, y = U⁻¹L⁻¹y, b = Q·y. */
export function luSolve(N: NumericLu, q: Int32Array, b: Float64Array, y: Float64Array, offset = 0): void {
  const { n, prow } = N;
  for (let k = 0; k < n; k++) y[k] = b[offset + prow[k]!]!;
  lowerSolve(N, y);
  upperSolve(N, y);
  for (let k = 0; k < n; k++) b[offset + q[k]!] = y[k]!;
}

/** b[0 … n) is overwritten with A⁻ᵀb: Aᵀ = Q·Uᵀ·Lᵀ·P, so y = Qᵀb, y = L⁻ᵀU⁻ᵀy, b = Pᵀy. */
export function luSolveTranspose(
  N: NumericLu,
  q: Int32Array,
  b: Float64Array,
  y: Float64Array,
  offset = 0,
): void {
  const { n, prow } = N;
  for (let k = 0; k < n; k++) y[k] = b[offset + q[k]!]!;
  upperTransposeSolve(N, y);
  lowerTransposeSolve(N, y);
  for (let k = 0; k < n; k++) b[offset + prow[k]!] = y[k]!;
}

/**
 * Several right-hand sides: column r of B is B[r·stride … r·stride + n), each overwritten with
 * A⁻¹ (or A⁻ᵀ when `transpose`) times itself.
 */
export function luSolveMany(
  N: NumericLu,
  q: Int32Array,
  B: Float64Array,
  count: number,
  stride: number,
  y: Float64Array,
  transpose = false,
): void {
  for (let r = 0; r < count; r++) {
    if (transpose) luSolveTranspose(N, q, B, y, r * stride);
    else luSolve(N, q, B, y, r * stride);
  }
}
