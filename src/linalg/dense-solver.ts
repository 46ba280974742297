/**
 * Dense LU with partial pivoting behind the sparse solver contract. It is the reference that tests
 * compare the sparse kernels with, and a fallback for tiny systems; its cost grows as n³.
 */
import type { ComplexLinearSolver, CscPattern, FactorStatus, RealLinearSolver } from './types.js';

/** A pivot below this fraction of its column's largest original entry counts as zero. */
const SINGULAR_RATIO = 1e-14;

/** Dense real LU of a matrix given on a compressed-column pattern. */
export function createDenseRealSolver(pattern: CscPattern): RealLinearSolver {
  const { n, Ap, Ai } = pattern;
  const lu = new Float64Array(n * n); // row-major
  const perm = new Int32Array(n);
  const colScale = new Float64Array(n);
  const work = new Float64Array(n);
  return {
    n,
    factor(Ax: Float64Array): FactorStatus {
      lu.fill(0);
      colScale.fill(0);
      for (let j = 0; j < n; j++) {
        for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
          const v = Ax[p]!;
          lu[Ai[p]! * n + j]! += v;
        }
      }
      for (let j = 0; j < n; j++) {
        let m = 0;
        for (let i = 0; i < n; i++) m = Math.max(m, Math.abs(lu[i * n + j]!));
        colScale[j] = m;
      }
      for (let i = 0; i < n; i++) perm[i] = i;
      for (let k = 0; k < n; k++) {
        let best = k;
        let bestAbs = Math.abs(lu[k * n + k]!);
        for (let i = k + 1; i < n; i++) {
          const a = Math.abs(lu[i * n + k]!);
          if (a > bestAbs) {
            bestAbs = a;
            best = i;
          }
        }
        if (!(bestAbs > SINGULAR_RATIO * colScale[k]!) || bestAbs === 0) return k + 1;
        if (best !== k) {
          for (let j = 0; j < n; j++) {
            const t = lu[k * n + j]!;
            lu[k * n + j] = lu[best * n + j]!;
            lu[best * n + j] = t;
          }
          const t = perm[k]!;
          perm[k] = perm[best]!;
          perm[best] = t;
        }
        const pivot = lu[k * n + k]!;
        for (let i = k + 1; i < n; i++) {
          const f = lu[i * n + k]! / pivot;
          if (f === 0) continue;
          lu[i * n + k] = f;
          for (let j = k + 1; j < n; j++) lu[i * n + j]! -= f * lu[k * n + j]!;
        }
      }
      return 0;
    },
    solve(b: Float64Array): void {
      for (let i = 0; i < n; i++) work[i] = b[perm[i]!]!;
      for (let i = 0; i < n; i++) {
        let s = work[i]!;
        for (let j = 0; j < i; j++) s -= lu[i * n + j]! * work[j]!;
        work[i] = s;
      }
      for (let i = n - 1; i >= 0; i--) {
        let s = work[i]!;
        for (let j = i + 1; j < n; j++) s -= lu[i * n + j]! * work[j]!;
        work[i] = s / lu[i * n + i]!;
      }
      b.set(work);
    },
    solveTranspose(b: Float64Array): void {
      // Aᵀ = Uᵀ Lᵀ P: solve Uᵀ y = b, then Lᵀ z = y, then x = Pᵀ z.
      work.set(b);
      for (let i = 0; i < n; i++) {
        let s = work[i]!;
        for (let j = 0; j < i; j++) s -= lu[j * n + i]! * work[j]!;
        work[i] = s / lu[i * n + i]!;
      }
      for (let i = n - 1; i >= 0; i--) {
        let s = work[i]!;
        for (let j = i + 1; j < n; j++) s -= lu[j * n + i]! * work[j]!;
        work[i] = s;
      }
      for (let i = 0; i < n; i++) b[perm[i]!] = work[i]!;
    },
  };
}

/** Dense complex LU (split real and imaginary parts) of a matrix given on a compressed-column pattern. */
export function createDenseComplexSolver(pattern: CscPattern): ComplexLinearSolver {
  const { n, Ap, Ai } = pattern;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const perm = new Int32Array(n);
  const colScale = new Float64Array(n);
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  return {
    n,
    factor(Ax: Float64Array, Az: Float64Array): FactorStatus {
      re.fill(0);
      im.fill(0);
      colScale.fill(0);
      for (let j = 0; j < n; j++) {
        for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
          re[Ai[p]! * n + j]! += Ax[p]!;
          im[Ai[p]! * n + j]! += Az[p]!;
        }
      }
      for (let j = 0; j < n; j++) {
        let m = 0;
        for (let i = 0; i < n; i++) m = Math.max(m, Math.hypot(re[i * n + j]!, im[i * n + j]!));
        colScale[j] = m;
      }
      for (let i = 0; i < n; i++) perm[i] = i;
      for (let k = 0; k < n; k++) {
        let best = k;
        let bestAbs = Math.hypot(re[k * n + k]!, im[k * n + k]!);
        for (let i = k + 1; i < n; i++) {
          const a = Math.hypot(re[i * n + k]!, im[i * n + k]!);
          if (a > bestAbs) {
            bestAbs = a;
            best = i;
          }
        }
        if (!(bestAbs > SINGULAR_RATIO * colScale[k]!) || bestAbs === 0) return k + 1;
        if (best !== k) {
          for (let j = 0; j < n; j++) {
            let t = re[k * n + j]!;
            re[k * n + j] = re[best * n + j]!;
            re[best * n + j] = t;
            t = im[k * n + j]!;
            im[k * n + j] = im[best * n + j]!;
            im[best * n + j] = t;
          }
          const t = perm[k]!;
          perm[k] = perm[best]!;
          perm[best] = t;
        }
        const pr = re[k * n + k]!;
        const pi = im[k * n + k]!;
        const d = pr * pr + pi * pi;
        for (let i = k + 1; i < n; i++) {
          const ar = re[i * n + k]!;
          const ai = im[i * n + k]!;
          if (ar === 0 && ai === 0) continue;
          const fr = (ar * pr + ai * pi) / d;
          const fi = (ai * pr - ar * pi) / d;
          re[i * n + k] = fr;
          im[i * n + k] = fi;
          for (let j = k + 1; j < n; j++) {
            const ur = re[k * n + j]!;
            const ui = im[k * n + j]!;
            re[i * n + j]! -= fr * ur - fi * ui;
            im[i * n + j]! -= fr * ui + fi * ur;
          }
        }
      }
      return 0;
    },
    solve(br: Float64Array, bi: Float64Array): void {
      for (let i = 0; i < n; i++) {
        wr[i] = br[perm[i]!]!;
        wi[i] = bi[perm[i]!]!;
      }
      for (let i = 0; i < n; i++) {
        let sr = wr[i]!;
        let si = wi[i]!;
        for (let j = 0; j < i; j++) {
          const lr = re[i * n + j]!;
          const li = im[i * n + j]!;
          sr -= lr * wr[j]! - li * wi[j]!;
          si -= lr * wi[j]! + li * wr[j]!;
        }
        wr[i] = sr;
        wi[i] = si;
      }
      for (let i = n - 1; i >= 0; i--) {
        let sr = wr[i]!;
        let si = wi[i]!;
        for (let j = i + 1; j < n; j++) {
          const ur = re[i * n + j]!;
          const ui = im[i * n + j]!;
          sr -= ur * wr[j]! - ui * wi[j]!;
          si -= ur * wi[j]! + ui * wr[j]!;
        }
        const pr = re[i * n + i]!;
        const pi = im[i * n + i]!;
        const d = pr * pr + pi * pi;
        wr[i] = (sr * pr + si * pi) / d;
        wi[i] = (si * pr - sr * pi) / d;
      }
      br.set(wr);
      bi.set(wi);
    },
  };
}
