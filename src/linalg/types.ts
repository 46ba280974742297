/**
 * The interface between the analyses and the linear solvers.
 *
 * Key to the names (after CSparse): a matrix of order `n` in compressed-column form keeps
 * `Ap` (column pointers, length n+1), `Ai` (row indices, length nnz) and its values apart,
 * `Ax` for a real matrix, `Ax`/`Az` (real/imaginary parts) for a complex one. The pattern is
 * fixed once per circuit; only the values change between Newton iterations and frequencies.
 */

/** A sparsity pattern in compressed-column form. Row indices within a column are sorted. */
export interface CscPattern {
  /** Order of the square matrix. */
  readonly n: number;
  /** Column pointers, length n+1: column j occupies entries Ap[j] … Ap[j+1]−1. */
  readonly Ap: Int32Array;
  /** Row index of each entry, length nnz. */
  readonly Ai: Int32Array;
}

/**
 * Status of a factorization: 0 on success, otherwise k+1 where k is the unknown (the original
 * row/column index) that could not receive an acceptable pivot. Kernels never throw; the
 * analysis translates k back to node and element names.
 */
export type FactorStatus = number;

/** A solver of A·x = b for real matrices on one fixed pattern. */
export interface RealLinearSolver {
  readonly n: number;
  /**
   * Factor the matrix whose values on the pattern are `Ax` (length nnz). The first call (or one
   * after pivots went bad) does a fresh factorization; later calls refactor on the kept pivot
   * order and fall back to a fresh factorization when a pivot is too small.
   */
  factor(Ax: Float64Array): FactorStatus;
  /** b is overwritten with A⁻¹b, using the last successful factorization. */
  solve(b: Float64Array): void;
  /** b is overwritten with A⁻ᵀb, using the last successful factorization. */
  solveTranspose(b: Float64Array): void;
}

/** A solver of A·x = b for complex matrices (split real and imaginary arrays) on one fixed pattern. */
export interface ComplexLinearSolver {
  readonly n: number;
  /**
   * Factor the matrix with real parts `Ax` and imaginary parts `Az` (each of length nnz). `rowMax`,
   * when the caller already has it, holds max_j (|Re a_ij| + |Im a_ij|) of every row, which spares the
   * solver a pass over the values when it needs row scales.
   */
  factor(Ax: Float64Array, Az: Float64Array, rowMax?: Float64Array): FactorStatus;
  /** (br, bi) is overwritten with A⁻¹(br + j·bi). */
  solve(br: Float64Array, bi: Float64Array): void;
}
