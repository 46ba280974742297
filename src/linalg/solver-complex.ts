/**
 * The sparse complex solver behind the ComplexLinearSolver interface: the real solver's policy
 * (analyse once, factor, refactor with fallback, analyse again before reporting a column) on split
 * real and imaginary arrays. It reuses a
 * real symbolic analysis when given one (options.symbolic), since jωC entries sit on the pattern
 * of the conductance matrix.
 *
 * Key to the names: as solver.ts.
 */

import { luFactorComplex, luRefactorComplex } from './lu-complex.js';
import {
  type ComplexNumericLu,
  createComplexNumericLu,
  initialFactorCapacity,
  reserveFactorStorage,
  type SymbolicLu,
} from './lu-types.js';
import { analyzePattern } from './ordering.js';
import { type LuStatistics, type SparseSolverOptions, tolerancesOf } from './solver.js';
import { luSolveComplex, luSolveTransposeComplex } from './triangular-complex.js';
import type { ComplexLinearSolver, CscPattern, FactorStatus } from './types.js';
import { computeRowScaleComplex, createLuWorkspace } from './workspace.js';

/** A sparse complex solver: the interface plus the transpose solve and statistics. */
export interface SparseComplexSolver extends ComplexLinearSolver {
  /** The symbolic analysis, once the first factor() has computed it (or the one given). */
  readonly symbolic: SymbolicLu | null;
  /** (br, bi) is overwritten with A⁻ᵀ(br + j·bi) (plain transpose). */
  solveTranspose(br: Float64Array, bi: Float64Array): void;
  /** Force the next factor() to search pivots afresh. */
  invalidate(): void;
  statistics(): LuStatistics;
}

/** Create a sparse complex LU solver for matrices on `pattern`. */
export function createSparseComplexSolver(
  pattern: CscPattern,
  options: SparseSolverOptions = {},
): SparseComplexSolver {
  const n = pattern.n;
  const nnz = pattern.Ap[n]!;
  const tol = tolerancesOf(options);
  const ordering = options.ordering ?? 'amd';
  const ws = createLuWorkspace(n, nnz, true);
  const N: ComplexNumericLu = createComplexNumericLu(n, initialFactorCapacity(pattern, options.capacity));
  let S: SymbolicLu | null = options.symbolic ?? null;
  let valid = false;
  /** Whether the storage is sized: by measured sizes given, else at the first fresh factorization. */
  let reserved = options.capacity !== undefined;
  let factorizations = 0;
  let refactorizations = 0;
  let fallbacks = 0;
  let reanalyses = 0;
  /** Matching on |Re| + |Im| of the present values, then the order (allocates; once per analysis). */
  const analyze = (Ax: Float64Array, Az: Float64Array): SymbolicLu => {
    const magnitude = new Float64Array(nnz);
    for (let p = 0; p < nnz; p++) magnitude[p] = Math.abs(Ax[p]!) + Math.abs(Az[p]!);
    return analyzePattern(pattern, magnitude, ordering, tol.pivotTolerance);
  };
  return {
    n,
    get symbolic() {
      return S;
    },
    factor(Ax: Float64Array, Az: Float64Array, rowMax?: Float64Array): FactorStatus {
      ws.rowScaleCurrent = false; // new values: the refactorization computes scales only if needed
      if (rowMax !== undefined) {
        const r = ws.rowScale;
        for (let i = 0; i < n; i++) r[i] = rowMax[i]! > 0 ? 1 / rowMax[i]! : 1;
        ws.rowScaleCurrent = true;
      }
      let analysedNow = false;
      if (S === null) {
        S = analyze(Ax, Az);
        analysedNow = true;
      }
      if (valid) {
        if (luRefactorComplex(pattern, Ax, Az, S, N, ws, tol) === 0) {
          refactorizations++;
          return 0;
        }
        fallbacks++;
      }
      if (!ws.rowScaleCurrent) computeRowScaleComplex(pattern.Ap, pattern.Ai, Ax, Az, ws);
      factorizations++;
      if (!reserved) {
        reserveFactorStorage(N, S.fill);
        reserved = true;
      }
      let status = luFactorComplex(pattern, Ax, Az, S, N, ws, tol);
      if (status !== 0 && !analysedNow && ordering === 'amd') {
        // As in solver.ts: an analysis from other values (another frequency) is redone on these.
        S = analyze(Ax, Az);
        reanalyses++;
        factorizations++;
        status = luFactorComplex(pattern, Ax, Az, S, N, ws, tol);
      }
      valid = status === 0;
      return status;
    },
    solve(br: Float64Array, bi: Float64Array): void {
      luSolveComplex(N, S!.q, br, bi, ws.y, ws.yz);
    },
    solveTranspose(br: Float64Array, bi: Float64Array): void {
      luSolveTransposeComplex(N, S!.q, br, bi, ws.y, ws.yz);
    },
    invalidate(): void {
      valid = false;
    },
    statistics(): LuStatistics {
      return { factorizations, refactorizations, fallbacks, reanalyses, nnzL: N.Lp[n]!, nnzU: N.Up[n]! + n };
    },
  };
}
