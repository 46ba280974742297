/**
 * The sparse complex solver behind the ComplexLinearSolver contract: the real solver's policy
 * (analyse once, factor, refactor with fallback) on split real and imaginary arrays. It reuses a
 * real symbolic analysis when given one (options.symbolic), since jωC entries sit on the pattern
 * of the conductance matrix.
 *
 * Key to the names: as solver.ts.
 */

import { luFactorComplex, luRefactorComplex } from './lu-complex.js';
import { type ComplexNumericLu, createComplexNumericLu, type SymbolicLu } from './lu-types.js';
import { analyzePattern } from './ordering.js';
import { type LuStatistics, type SparseSolverOptions, tolerancesOf } from './solver.js';
import { luSolveComplex, luSolveTransposeComplex } from './triangular-complex.js';
import type { ComplexLinearSolver, CscPattern, FactorStatus } from './types.js';
import { computeRowScaleComplex, createLuWorkspace } from './workspace.js';

/** A sparse complex solver: the contract plus the transpose solve and statistics. */
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
  const ws = createLuWorkspace(n, true);
  const N: ComplexNumericLu = createComplexNumericLu(n, 4 * nnz + n);
  let S: SymbolicLu | null = options.symbolic ?? null;
  let valid = false;
  let factorizations = 0;
  let refactorizations = 0;
  let fallbacks = 0;
  return {
    n,
    get symbolic() {
      return S;
    },
    factor(Ax: Float64Array, Az: Float64Array): FactorStatus {
      if (S === null) {
        const magnitude = new Float64Array(nnz); // once per solver, for the matching
        for (let p = 0; p < nnz; p++) magnitude[p] = Math.abs(Ax[p]!) + Math.abs(Az[p]!);
        S = analyzePattern(pattern, magnitude, ordering, tol.pivotTolerance);
      }
      computeRowScaleComplex(pattern.Ap, pattern.Ai, Ax, Az, ws);
      if (valid) {
        if (luRefactorComplex(pattern, Ax, Az, S, N, ws, tol) === 0) {
          refactorizations++;
          return 0;
        }
        fallbacks++;
      }
      factorizations++;
      const status = luFactorComplex(pattern, Ax, Az, S, N, ws, tol);
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
      return { factorizations, refactorizations, fallbacks, nnzL: N.Lp[n]!, nnzU: N.Up[n]! + n };
    },
  };
}
