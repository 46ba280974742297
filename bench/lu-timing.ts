/**
 * Timing of the sparse LU solvers on one matrix: the median of fresh factorizations (pivot search,
 * symbolic analysis kept), refactorizations on the kept pivot order, and solves, plus the relative
 * residual ‖Ax − b‖∞/‖b‖∞ with b = A·1. The figures match those of the C harness in bench/klu.
 */
import { performance } from 'node:perf_hooks';
import { createComplexSolver, createRealSolver } from '../src/linalg/index.js';
import type { CircuitMatrix } from './circuit-matrices.js';

/** The JSON line of `npm run bench:lu`, in this key order. */
export interface LuTiming {
  readonly n: number;
  readonly nnz: number;
  readonly nnzLU: number;
  readonly factorMs: number;
  readonly refactorMs: number;
  readonly solveMs: number;
  readonly residual: number;
}

/** Median of the samples (sorted in place). */
export function median(samples: number[]): number {
  samples.sort((a, b) => a - b);
  const m = samples.length >> 1;
  return samples.length % 2 === 1 ? samples[m]! : (samples[m - 1]! + samples[m]!) / 2;
}

function timeIt(repeat: number, run: () => void): number {
  // Warm up until the JIT has settled: at least one run and 100 ms.
  const start = performance.now();
  for (let r = 0; r < 1 || (performance.now() - start < 100 && r < 500); r++) run();
  const samples: number[] = [];
  for (let r = 0; r < repeat; r++) {
    const t0 = performance.now();
    run();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

function round(v: number, digits: number): number {
  return Number(v.toPrecision(digits));
}

/** Time the sparse solver on M (real or complex), `repeat` samples per operation after one warm-up. */
export function timeSparseLu(M: CircuitMatrix, repeat: number): LuTiming {
  const { pattern, Ax, Az } = M;
  const { n, Ap, Ai } = pattern;
  const nnz = Ap[n]!;
  const complex = Az !== null;
  // b = A·1 (row sums), real and imaginary parts.
  const br = new Float64Array(n);
  const bi = new Float64Array(n);
  for (let p = 0; p < nnz; p++) {
    br[Ai[p]!]! += Ax[p]!;
    if (complex) bi[Ai[p]!]! += Az[p]!;
  }
  const xr = new Float64Array(n);
  const xi = new Float64Array(n);
  let factorMs: number;
  let refactorMs: number;
  let solveMs: number;
  let nnzLU: number;
  if (complex) {
    const solver = createComplexSolver(pattern);
    const fail = (status: number): void => {
      if (status !== 0) throw new Error(`${M.name}: no acceptable pivot for unknown ${status - 1}`);
    };
    fail(solver.factor(Ax, Az)); // symbolic analysis and warm-up
    factorMs = timeIt(repeat, () => {
      solver.invalidate();
      fail(solver.factor(Ax, Az));
    });
    refactorMs = timeIt(repeat, () => fail(solver.factor(Ax, Az)));
    solveMs = timeIt(repeat, () => {
      xr.set(br);
      xi.set(bi);
      solver.solve(xr, xi);
    });
    const stats = solver.statistics();
    nnzLU = stats.nnzL + stats.nnzU + n;
  } else {
    const solver = createRealSolver(pattern);
    const fail = (status: number): void => {
      if (status !== 0) throw new Error(`${M.name}: no acceptable pivot for unknown ${status - 1}`);
    };
    fail(solver.factor(Ax));
    factorMs = timeIt(repeat, () => {
      solver.invalidate();
      fail(solver.factor(Ax));
    });
    refactorMs = timeIt(repeat, () => fail(solver.factor(Ax)));
    solveMs = timeIt(repeat, () => {
      xr.set(br);
      solver.solve(xr);
    });
    const stats = solver.statistics();
    nnzLU = stats.nnzL + stats.nnzU + n;
  }
  return {
    n,
    nnz,
    nnzLU,
    factorMs: round(factorMs, 4),
    refactorMs: round(refactorMs, 4),
    solveMs: round(solveMs, 4),
    residual: round(relativeResidual(M, xr, xi, br, bi), 3),
  };
}

/** ‖A·x − b‖∞ / ‖b‖∞, complex moduli when M is complex. */
export function relativeResidual(
  M: CircuitMatrix,
  xr: Float64Array,
  xi: Float64Array,
  br: Float64Array,
  bi: Float64Array,
): number {
  const { pattern, Ax, Az } = M;
  const { n, Ap, Ai } = pattern;
  const rr = Float64Array.from(br.subarray(0, n), (v) => -v);
  const ri = Float64Array.from(bi.subarray(0, n), (v) => -v);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = Ai[p]!;
      const ar = Ax[p]!;
      const ai = Az === null ? 0 : Az[p]!;
      rr[i]! += ar * xr[j]! - ai * xi[j]!;
      ri[i]! += ar * xi[j]! + ai * xr[j]!;
    }
  }
  let num = 0;
  let den = 0;
  for (let i = 0; i < n; i++) {
    num = Math.max(num, Math.hypot(rr[i]!, ri[i]!));
    den = Math.max(den, Math.hypot(br[i]!, bi[i]!));
  }
  return num / den;
}
