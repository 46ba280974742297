/**
 * Solves with a complex factorization P·A·Q = L·U (split real and imaginary arrays): permute,
 * lower solve, upper solve, unpermute (CSparse cs_lusol), and the transpose (not the conjugate
 * transpose) for Aᵀ.
 *
 * Key to the names: as triangular.ts; `br`/`bi` real and imaginary parts of the right-hand side,
 * overwritten by the solution (only [0, n) is touched); `yr`/`yi` scratch indexed by step.
 */
import type { ComplexNumericLu } from './lu-types.js';

/** (br, bi)[0 … n) is overwritten with A⁻¹(br + j·bi). */
export function luSolveComplex(
  N: ComplexNumericLu,
  q: Int32Array,
  br: Float64Array,
  bi: Float64Array,
  yr: Float64Array,
  yi: Float64Array,
): void {
  const { n, prow, Lp, Li, Lx, Lz, Up, Ui, Ux, Uz, Ud, Udz } = N;
  for (let k = 0; k < n; k++) {
    yr[k] = br[prow[k]!]!;
    yi[k] = bi[prow[k]!]!;
  }
  for (let j = 0; j < n; j++) {
    const xr = yr[j]!;
    const xz = yi[j]!;
    if (xr === 0 && xz === 0) continue;
    const end = Lp[j + 1]!; // hoisted: V8 cannot prove the stores leave it alone
    for (let p = Lp[j]!; p < end; p++) {
      const i = Li[p]!;
      yr[i]! -= Lx[p]! * xr - Lz[p]! * xz;
      yi[i]! -= Lx[p]! * xz + Lz[p]! * xr;
    }
  }
  for (let j = n - 1; j >= 0; j--) {
    const pr = Ud[j]!;
    const pz = Udz[j]!;
    const d = pr * pr + pz * pz;
    const sr = yr[j]!;
    const sz = yi[j]!;
    const xr = (sr * pr + sz * pz) / d;
    const xz = (sz * pr - sr * pz) / d;
    yr[j] = xr;
    yi[j] = xz;
    if (xr === 0 && xz === 0) continue;
    const end = Up[j + 1]!; // hoisted: V8 cannot prove the stores leave it alone
    for (let p = Up[j]!; p < end; p++) {
      const i = Ui[p]!;
      yr[i]! -= Ux[p]! * xr - Uz[p]! * xz;
      yi[i]! -= Ux[p]! * xz + Uz[p]! * xr;
    }
  }
  for (let k = 0; k < n; k++) {
    br[q[k]!] = yr[k]!;
    bi[q[k]!] = yi[k]!;
  }
}

/** (br, bi)[0 … n) is overwritten with A⁻ᵀ(br + j·bi) (plain transpose, no conjugation). */
export function luSolveTransposeComplex(
  N: ComplexNumericLu,
  q: Int32Array,
  br: Float64Array,
  bi: Float64Array,
  yr: Float64Array,
  yi: Float64Array,
): void {
  const { n, prow, Lp, Li, Lx, Lz, Up, Ui, Ux, Uz, Ud, Udz } = N;
  for (let k = 0; k < n; k++) {
    yr[k] = br[q[k]!]!;
    yi[k] = bi[q[k]!]!;
  }
  for (let j = 0; j < n; j++) {
    let sr = yr[j]!;
    let sz = yi[j]!;
    const end = Up[j + 1]!; // hoisted: V8 cannot prove the stores leave it alone
    for (let p = Up[j]!; p < end; p++) {
      const i = Ui[p]!;
      sr -= Ux[p]! * yr[i]! - Uz[p]! * yi[i]!;
      sz -= Ux[p]! * yi[i]! + Uz[p]! * yr[i]!;
    }
    const pr = Ud[j]!;
    const pz = Udz[j]!;
    const d = pr * pr + pz * pz;
    yr[j] = (sr * pr + sz * pz) / d;
    yi[j] = (sz * pr - sr * pz) / d;
  }
  for (let j = n - 1; j >= 0; j--) {
    let sr = yr[j]!;
    let sz = yi[j]!;
    const end = Lp[j + 1]!; // hoisted: V8 cannot prove the stores leave it alone
    for (let p = Lp[j]!; p < end; p++) {
      const i = Li[p]!;
      sr -= Lx[p]! * yr[i]! - Lz[p]! * yi[i]!;
      sz -= Lx[p]! * yi[i]! + Lz[p]! * yr[i]!;
    }
    yr[j] = sr;
    yi[j] = sz;
  }
  for (let k = 0; k < n; k++) {
    br[prow[k]!] = yr[k]!;
    bi[prow[k]!] = yi[k]!;
  }
}
