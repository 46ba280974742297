/**
 * The sparse real solver behind the RealLinearSolver interface: symbolic analysis on the first
 * values, a fresh factorization, then refactorizations on the kept pivot order that fall back to a
 * fresh factorization when a pivot fails the threshold test (the refactor-or-factor policy of KLU,
 * Davis & Palamadai Natarajan, ACM TOMS 37, 2010). A fresh factorization that finds no acceptable
 * pivot on an analysis made from other values is retried once on a new analysis of the present
 * values before the column is reported.
 *
 * Key to the names: `S` symbolic analysis, `N` numeric factorization, `ws` workspace, `valid`
 * whether N holds a complete factorization of the last values.
 */
import { luFactor } from './lu.js';
import {
  createNumericLu,
  type FactorCapacity,
  initialFactorCapacity,
  type NumericLu,
  type PivotTolerances,
  reserveFactorStorage,
  type SymbolicLu,
} from './lu-types.js';
import { analyzePattern, type Ordering } from './ordering.js';
import { luRefactor } from './refactor.js';
import { luSolve, luSolveMany, luSolveTranspose } from './triangular.js';
import type { CscPattern, FactorStatus, RealLinearSolver } from './types.js';
import { computeRowScale, createLuWorkspace, type LuWorkspace, recordEntrySteps } from './workspace.js';

/** Options of the sparse solvers. */
export interface SparseSolverOptions {
  /** Fill-reducing ordering; 'amd' (default) or 'natural' (the caller's order). */
  readonly ordering?: Ordering;
  /**
   * Threshold τ of partial pivoting (Duff, Erisman & Reid, "Direct Methods for Sparse Matrices",
   * 1986, §5.4): the matched row is kept while, row-scaled, it is ≥ τ × the column's largest
   * candidate, or while it is the largest candidate outright (lu.ts). Default 0.01: each step may
   * grow entries by up to 1 + 1/τ, and on the random MNA matrices of the tests (transconductances
   * up to 10⁶ × a diagonal) τ = 0.001 left about one matrix in a thousand with a scaled residual
   * above 1e-12, τ = 0.01 none in 3,000, while the circuit families of bench/ keep exactly the
   * same fill.
   */
  readonly pivotTolerance?: number;
  /** Relative size below which a column has no acceptable pivot. 1e-13. */
  readonly singularTolerance?: number;
  /** A symbolic analysis to reuse (for example the real solver's, for the complex solver). */
  readonly symbolic?: SymbolicLu;
  /**
   * The entries an earlier factorization on the same pattern and ordering stored in L and in U
   * ({@link SparseRealSolver.factorSizes}): room for them is reserved before the first factorization.
   * Without it the first fresh factorization reserves the fill its symbolic analysis counted
   * (`SymbolicLu.fill`), and the storage grows where pivoting strays from that count.
   */
  readonly capacity?: FactorCapacity;
}

/** Counters of the work a sparse solver did, for benchmarks and diagnostics. */
export interface LuStatistics {
  /** Fresh factorizations (pivot search included). */
  readonly factorizations: number;
  /** Refactorizations that succeeded on the kept pivot order. */
  readonly refactorizations: number;
  /** Refactorizations abandoned for a fresh factorization. */
  readonly fallbacks: number;
  /**
   * Symbolic analyses redone on the present values because a fresh factorization on the kept
   * analysis found a column without an acceptable pivot.
   */
  readonly reanalyses: number;
  /** Entries of L (unit diagonal excluded) and U (diagonal included) of the last factorization. */
  readonly nnzL: number;
  readonly nnzU: number;
}

/**
 * The pivot rows and the patterns of L and U of one fresh factorization, copied out of a solver so
 * that another solver of the same pattern and analysis can refactor on them.
 */
export interface PivotOrder {
  readonly symbolic: SymbolicLu;
  readonly pinv: Int32Array;
  readonly prow: Int32Array;
  readonly Lp: Int32Array;
  readonly Li: Int32Array;
  readonly Up: Int32Array;
  readonly Ui: Int32Array;
}

/** A sparse real solver: the interface plus several right-hand sides and statistics. */
export interface SparseRealSolver extends RealLinearSolver {
  /** The symbolic analysis, once the first factor() has computed it. */
  readonly symbolic: SymbolicLu | null;
  /**
   * Column r of B, B[r·stride … r·stride + n), is overwritten with A⁻¹ (Aᵀ⁻¹ when `transpose`)
   * times itself, for r in [0, count).
   */
  solveMany(B: Float64Array, count: number, stride: number, transpose?: boolean): void;
  /** Force the next factor() to search pivots afresh. */
  invalidate(): void;
  /** A copy of the present pivot order, or null without a complete factorization. */
  pivotOrder(): PivotOrder | null;
  /**
   * Make the next factor() refactor on `order` (taken from a solver of the same pattern), falling
   * back to a fresh factorization as usual: every solve that starts from the same order computes
   * the same numbers, whatever this solver factored before. An order from another analysis only
   * forces a fresh factorization.
   */
  usePivotOrder(order: PivotOrder): void;
  /** The entries stored in L (unit diagonal excluded) and in U (diagonal excluded) by the last factorization. */
  factorSizes(): FactorCapacity;
  statistics(): LuStatistics;
}

/** Resolve the options into tolerances with their defaults. */
export function tolerancesOf(options: SparseSolverOptions): PivotTolerances {
  return {
    pivotTolerance: options.pivotTolerance ?? 1e-2,
    singularTolerance: options.singularTolerance ?? 1e-13,
  };
}

/** Create a sparse real LU solver for matrices on `pattern`. */
export function createSparseRealSolver(
  pattern: CscPattern,
  options: SparseSolverOptions = {},
): SparseRealSolver {
  const n = pattern.n;
  const tol = tolerancesOf(options);
  const ordering = options.ordering ?? 'amd';
  const ws: LuWorkspace = createLuWorkspace(n, pattern.Ap[n]!, false);
  const N: NumericLu = createNumericLu(n, initialFactorCapacity(pattern, options.capacity));
  let S: SymbolicLu | null = options.symbolic ?? null;
  let valid = false;
  /** Whether the storage is sized: by measured sizes given, else at the first fresh factorization. */
  let reserved = options.capacity !== undefined;
  let factorizations = 0;
  let refactorizations = 0;
  let fallbacks = 0;
  let reanalyses = 0;
  /** The order last adopted, and the fresh factorizations counted then. */
  let adopted: PivotOrder | null = null;
  let factorizationsAtAdoption = 0;
  return {
    n,
    get symbolic() {
      return S;
    },
    factor(Ax: Float64Array): FactorStatus {
      ws.rowScaleCurrent = false; // new values: the refactorization computes scales only if needed
      let analysedNow = false;
      if (S === null) {
        S = analyzePattern(pattern, Ax, ordering, tol.pivotTolerance);
        analysedNow = true;
      }
      if (valid) {
        if (luRefactor(pattern, Ax, S, N, ws, tol) === 0) {
          refactorizations++;
          return 0;
        }
        fallbacks++;
      }
      if (!ws.rowScaleCurrent) computeRowScale(pattern.Ap, pattern.Ai, Ax, ws);
      factorizations++;
      if (!reserved) {
        reserveFactorStorage(N, S.fill);
        reserved = true;
      }
      let status = luFactor(pattern, Ax, S, N, ws, tol);
      if (status !== 0 && !analysedNow && ordering === 'amd') {
        // The matching and order came from other values (an earlier Newton iterate or frequency);
        // values far from those can leave a column whose matched pivot vanished while another row
        // would serve. Analyse the present values and try once more before reporting.
        S = analyzePattern(pattern, Ax, ordering, tol.pivotTolerance);
        reanalyses++;
        factorizations++;
        status = luFactor(pattern, Ax, S, N, ws, tol);
      }
      valid = status === 0;
      return status;
    },
    solve(b: Float64Array): void {
      luSolve(N, S!.q, b, ws.y);
    },
    solveTranspose(b: Float64Array): void {
      luSolveTranspose(N, S!.q, b, ws.y);
    },
    solveMany(B: Float64Array, count: number, stride: number, transpose = false): void {
      luSolveMany(N, S!.q, B, count, stride, ws.y, transpose);
    },
    invalidate(): void {
      valid = false;
    },
    pivotOrder(): PivotOrder | null {
      if (!valid || S === null) return null;
      return {
        symbolic: S,
        pinv: N.pinv.slice(),
        prow: N.prow.slice(),
        Lp: N.Lp.slice(),
        Li: N.Li.slice(0, N.Lp[n]!),
        Up: N.Up.slice(),
        Ui: N.Ui.slice(0, N.Up[n]!),
      };
    },
    usePivotOrder(order: PivotOrder): void {
      S ??= order.symbolic;
      if (order.symbolic !== S) {
        valid = false;
        return;
      }
      // Refactorizations keep the patterns: only a fresh factorization since the last call moved them.
      if (valid && adopted === order && factorizations === factorizationsAtAdoption) return;
      N.pinv.set(order.pinv);
      N.prow.set(order.prow);
      N.Lp.set(order.Lp);
      N.Up.set(order.Up);
      if (N.Li.length < order.Li.length) {
        N.Li = new Int32Array(order.Li.length);
        N.Lx = new Float64Array(order.Li.length);
      }
      if (N.Ui.length < order.Ui.length) {
        N.Ui = new Int32Array(order.Ui.length);
        N.Ux = new Float64Array(order.Ui.length);
      }
      N.Li.set(order.Li);
      N.Ui.set(order.Ui);
      recordEntrySteps(pattern.Ai, N.pinv, ws);
      adopted = order;
      factorizationsAtAdoption = factorizations;
      valid = true;
    },
    factorSizes(): FactorCapacity {
      return { lower: N.Lp[n]!, upper: N.Up[n]! };
    },
    statistics(): LuStatistics {
      return { factorizations, refactorizations, fallbacks, reanalyses, nnzL: N.Lp[n]!, nnzU: N.Up[n]! + n };
    },
  };
}
